"""Speed table of the Seifert-manifold routes (issue #9): localisation, surgery, Gauss sum, integral form,
convolution (SU(3)).

For every case the in-process time of each applicable route (minimum of 3 runs, caches
cleared before each run, 30 certified digits) and the time of the ``knotobs`` command with
``--route auto`` in a fresh process (start-up included, minimum of 3 runs).  A route whose
estimate (``knotobs.evaluation.seifert_routes.route_estimates``) exceeds ``--max-route``
seconds is not run; its estimate is printed instead.

Run:  python benchmarks/bench_seifert.py [--max-route 60] [--runs 3] [--no-cli]
"""

from __future__ import annotations

import argparse
import shlex
import subprocess
import sys
import time

import mpmath

from knotobs.evaluation import modular
from knotobs.evaluation.seifert_routes import fiber_wilson_loop, partition_function, route_estimates
from knotobs.guard import limits
from knotobs.localisation import fixedpoint
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)

# (label, space, group, level, regular-fiber colour or None, issue target)
CASES = [
    ("SU(3) k=40 Sigma(2,3,5)", "Sigma(2,3,5)", "SU(3)", 40, None, "< 0.3 s"),
    ("SU(3) k=50 L(7,1)", "L(7,1)", "SU(3)", 50, None, "< 0.3 s"),
    ("SU(4) k=20 Sigma(2,3,5)", "Sigma(2,3,5)", "SU(4)", 20, None, "< 1 s"),
    ("SU(4) k=20 L(5,1)", "L(5,1)", "SU(4)", 20, None, "< 1 s"),
    ("SU(5) k=10 M(0;-1;(2,1),(3,1),(5,1),(7,1))", "M(0; -1; (2,1), (3,1), (5,1), (7,1))", "SU(5)", 10, None, "< 2 s"),
    ("SU(2) K=10^5 Sigma(2,3,7)", "Sigma(2,3,7)", "SU(2)", 10**5 - 2, None, "< 0.5 s (CLI)"),
    ("SU(2) K=10^6 Sigma(2,3,7)", "Sigma(2,3,7)", "SU(2)", 10**6 - 2, None, "< 5 s (CLI)"),
    ("SU(2) k=9998 Sigma(2,3,5)", "Sigma(2,3,5)", "SU(2)", 9998, None, "(was refused)"),
    ("SU(2) k=200 M(0;-1;(2,1),(4,1),(6,1))", "M(0; -1; (2,1), (4,1), (6,1))", "SU(2)", 200, None, "(shared orders)"),
    ("SU(3) k=30 [2,1] regular fiber Sigma(2,3,5)", "Sigma(2,3,5)", "SU(3)", 30, (2, 1), "< 0.5 s"),
    ("SU(2) k=6 M(2; 0) (Verlinde 84)", "M(2; 0)", "SU(2)", 6, None, "(genus 2)"),
    ("SU(3) k=400 Sigma(2,3,5)", "Sigma(2,3,5)", "SU(3)", 400, None, "(large level)"),
    ("SU(3) k=1000 Sigma(2,3,5)", "Sigma(2,3,5)", "SU(3)", 1000, None, "(was refused)"),
]


def _clear():
    fixedpoint._CACHE.clear()
    modular.modular_data.cache_clear()


def _time(fn, runs):
    best, out = None, None
    for _ in range(runs):
        _clear()
        t = time.perf_counter()
        out = fn()
        dt = time.perf_counter() - t
        best = dt if best is None else min(best, dt)
    return best, out


def _cli(space, group, level, colour, runs):
    if colour is None:
        cmd = ["space", space, "--group", group, "--level", str(level)]
    else:
        cmd = ["loop", "fiber", "--in", space, "--group", group, "--level", str(level),
               "--rep", "[" + ",".join(map(str, colour)) + "]"]
    argv = [sys.executable, "-c", "from knotobs.cli import main; main()"] + cmd
    subprocess.run(argv, capture_output=True, text=True)      # warm-up: writes the bytecode once
    best = None
    for _ in range(runs):
        t = time.perf_counter()
        r = subprocess.run(argv, capture_output=True, text=True)
        dt = time.perf_counter() - t
        if r.returncode != 0:
            return f"error: {r.stderr.strip()[:60]}"
        best = dt if best is None else min(best, dt)
    return f"{best:.3f}"


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--max-route", type=float, default=60.0)
    ap.add_argument("--runs", type=int, default=3)
    ap.add_argument("--no-cli", action="store_true")
    args = ap.parse_args()
    routes = ("localisation", "surgery", "gauss-sum", "integral", "convolution")
    print(f"{'case':46s} {'target':>14s} " + " ".join(f"{r:>13s}" for r in routes) + f" {'CLI auto':>9s}  value")
    for label, space, group, level, colour, target in CASES:
        cells = []
        value = ""
        loop = colour is not None
        ests = {e.route: e for e in route_estimates(space, group, level, loop=loop)}
        for r in routes:
            e = ests.get(r)
            if e is None or not e.applicable:
                cells.append("-")
                continue
            if e.seconds > args.max_route:
                cells.append(f"(est {e.seconds:.0f}s)")
                continue
            with limits(seconds=max(600.0, 2 * e.seconds), memory_mb=16000):
                if loop:
                    fn = (lambda r=r: fiber_wilson_loop(space, level, group, regular=[colour], digits=30, route=r))
                else:
                    fn = (lambda r=r: partition_function(space, group, level, digits=30, route=r))
                try:
                    t, out = _time(fn, args.runs)
                except Exception as exc:  # a benchmark reports, it does not stop
                    cells.append(type(exc).__name__)
                    continue
            cells.append(f"{t:.3f}")
            value = value or mpmath.nstr(out.numeric, 10)
        cli = "-" if args.no_cli else _cli(space, group, level, colour, args.runs)
        print(f"{label:46s} {target:>14s} " + " ".join(f"{c:>13s}" for c in cells) + f" {cli:>9s}  {value}")
    print("\nseconds; in-process: min of %d runs with caches cleared; CLI: min of %d fresh processes"
          " (start-up included), --route auto; '(est Ns)': estimate above --max-route, not run" % (args.runs, args.runs))
    print("the SU(N) continuation in K has its own table: benchmarks/bench_continuation_sun.py")


if __name__ == "__main__":
    main()
