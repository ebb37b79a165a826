"""Timing table for the surgery (gluing) route.

For each case: the size (weights, |P/KQ|, S applications of the shortest words against the
S applications of the negative continued fractions of the plumbing), the route's own cost
estimate (:func:`knotobs.evaluation.gluing.surgery_cost`), the minimum of three in-process
runs, and the minimum of three runs of the command line with start-up.  Every value has
30 certified digits.  Old vs new: the plumbing form (one S per vertex) and the word form are
evaluated exactly on a small case and must be equal; the S counts show what the words save.

The machine is shared: timings are noisy, hence the minimum of three.  In-process runs keep
the structural caches (alcove, transform indices, DFT matrices) but not the fiber vectors; the
CLI column is a cold start (interpreter, imports, everything).

Run:  python benchmarks/bench_surgery.py [--quick]
"""

from __future__ import annotations

import math
import os
import shutil
import subprocess
import sys
import time

from knotobs.evaluation.gluing import _FIBER_CACHE, evaluate_gluing, plan_gluing, surgery_cost
from knotobs.evaluation.modular import ModularData
from knotobs.evaluation.surgery import (
    SurgeryPresentation,
    _plumbing_exact,
    fiber_wilson_loop,
    partition_function,
    seifert_to_surgery,
)
from knotobs.fibrations.seifert import parse_space
from knotobs.guard import limits
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)

CASES = [
    # (label, space, N, k, regular colour or None, CLI arguments)
    ("SU(3) k=40 Sigma(2,3,5)", "Sigma(2,3,5)", 3, 40, None,
     ["space", "Sigma(2,3,5)", "--group", "SU(3)", "--level", "40", "--route", "surgery"]),
    ("SU(3) k=50 L(7,1)", "L(7,1)", 3, 50, None,
     ["space", "L(7,1)", "--group", "SU(3)", "--level", "50", "--route", "surgery"]),
    ("SU(4) k=20 Sigma(2,3,5)", "Sigma(2,3,5)", 4, 20, None,
     ["space", "Sigma(2,3,5)", "--group", "SU(4)", "--level", "20", "--route", "surgery"]),
    ("SU(4) k=20 L(5,1)", "L(5,1)", 4, 20, None,
     ["space", "L(5,1)", "--group", "SU(4)", "--level", "20", "--route", "surgery"]),
    ("SU(5) k=10 M(0;-1;(2,1),(3,1),(5,1),(7,1))", "M(0; -1; (2,1), (3,1), (5,1), (7,1))", 5, 10, None,
     ["space", "M(0; -1; (2,1), (3,1), (5,1), (7,1))", "--group", "SU(5)", "--level", "10",
      "--route", "surgery"]),
    ("SU(3) k=30 [2,1] regular fiber Sigma(2,3,5)", "Sigma(2,3,5)", 3, 30, (2, 1),
     ["loop", "fiber", "--in", "Sigma(2,3,5)", "--group", "SU(3)", "--level", "30", "--rep", "[2,1]"]),
    ("SU(2) k=9998 Sigma(2,3,5)", "Sigma(2,3,5)", 2, 9998, None,
     ["space", "Sigma(2,3,5)", "--group", "SU(2)", "--level", "9998", "--route", "surgery"]),
    ("SU(2) genus 3, k=6 (S^1 x Sigma_3)", "M(3; 0)", 2, 6, None,
     ["space", "M(3; 0)", "--group", "SU(2)", "--level", "6"]),
]


def _min_time(fn, runs=3):
    best, out = math.inf, None
    for _ in range(runs):
        t = time.perf_counter()
        out = fn()
        best = min(best, time.perf_counter() - t)
    return best, out


def _cli(args, runs=3):
    exe = shutil.which("knotobs") or os.path.join(os.path.dirname(sys.executable), "knotobs")
    best = math.inf
    for _ in range(runs):
        t = time.perf_counter()
        env = dict(os.environ, KNOTOBS_MAX_SECONDS="900")
        r = subprocess.run([exe, *args], capture_output=True, text=True, env=env)
        best = min(best, time.perf_counter() - t)
        if r.returncode != 0:
            return f"refused: {r.stdout.strip().splitlines()[-1][:60] if r.stdout.strip() else r.stderr[-60:]}"
    return f"{best:8.2f}"


def _plan(M):
    e0, pq = seifert_to_surgery(M.b, M.fibers)
    pres = SurgeryPresentation.from_coefficients(e0, pq)
    old = sum(len(c) for c in pres.chains)          # plumbing: one S per vertex beyond the column
    return pres, plan_gluing(pres, getattr(M, "genus", 0)).s_applications, old


def main(quick: bool = False) -> None:
    # old vs new, exactly, on small cases
    for space, N, k in [("Sigma(2,3,7)", 3, 3), ("L(7,2)", 2, 8), ("M(0; 1; (2,1), (4,-1), (6,1))", 3, 2)]:
        M = parse_space(space)
        pres, _, _ = _plan(M)
        md = ModularData(N, k)
        t_old, old = _min_time(lambda: _plumbing_exact(md, pres, {}, [], 0), 1)
        t_new, (new, _) = _min_time(lambda: evaluate_gluing(md, pres, 0, exact=True), 1)
        print(f"old vs new exact, SU({N}) k={k} {space}: equal = {old == new}"
              f"  (plumbing form {t_old:.2f} s, word form {t_new:.2f} s)")
    print()
    head = (f"{'case':46s} {'weights':>7s} {'|P/KQ|':>7s} {'S new/old':>9s} {'estimate s':>10s}"
            f" {'in-process s':>12s} {'CLI s':>8s}  value")
    print(f"CLI start-up alone (knotobs space S^3, no level): {_cli(['space', 'S^3'])} s")
    print(head)
    print("-" * len(head))
    for label, space, N, k, colour, cli in CASES:
        if quick and N * k > 60:
            continue
        M = parse_space(space)
        _, new_s, old_s = _plan(M)
        n = math.comb(k + N - 1, N - 1)
        G = N * (k + N) ** (N - 1)
        est, _mb = surgery_cost(N, k, M.fibers, getattr(M, "genus", 0), M.b, colours=int(colour is not None))
        def fn():
            _FIBER_CACHE.clear()          # no reuse of results between runs
            if colour is None:
                return partition_function(M, f"SU({N})", k, route="surgery")
            return fiber_wilson_loop(M, k, f"SU({N})", regular=[colour])
        runs = 1 if N * k > 45 and N >= 5 else 3
        try:
            with limits(seconds=900):
                t, val = _min_time(fn, runs)
            t_s, v_s = f"{t:12.2f}", f"{complex(val.numeric):.10g}"
        except Exception as exc:  # refusals are part of the table
            t_s, v_s = f"{'refused':>12s}", str(exc)[:50]
        print(f"{label:46s} {n:7d} {G:7d} {new_s:>4d}/{old_s:<4d} {est:10.2f} {t_s} {_cli(cli, runs):>8s}  {v_s}")


if __name__ == "__main__":
    main("--quick" in sys.argv)
