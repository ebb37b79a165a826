"""Benchmarks for the groups beyond SU(N) and the Kauffman polynomial (prints a table; not a test).

Run:  python benchmarks/bench_groups.py [--repeat 3]

Each row is what a user waits for: the command line ``knotobs ...`` run as a fresh process
(start-up included), minimum wall time over ``--repeat`` runs (timings on a shared machine are
noisy; the minimum is the least disturbed).  For Wilson loops the two exact routes are timed side
by side (``--route rosso-jones`` and ``--route weight-sum``).  The last columns are the in-process
library times with cold caches (minimum over the runs).
"""

from __future__ import annotations

import argparse
import resource
import shutil
import subprocess
import sys
import time
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)

CLI = [shutil.which("knotobs") or sys.executable, ] if shutil.which("knotobs") else [sys.executable, "-c", "from knotobs.cli import main; main()"]

ROWS = [
    ("Kauffman F of T(7,8)", ["poly", "T(7,8)", "--family", "kauffman"], None),
    ("Kauffman F of T(5,6)", ["poly", "T(5,6)", "--family", "kauffman"], None),
    ("Kauffman F of T(4,8) (link)", ["poly", "T(4,8)", "--family", "kauffman"], None),
    ("SO(5) [3] on T(3,5)", ["loop", "T(3,5)", "--group", "SO(5)", "--rep", "[3]"], "route"),
    ("Sp(4) [3] on T(3,5)", ["loop", "T(3,5)", "--group", "Sp(4)", "--rep", "[3]"], "route"),
    ("SO(5) [2,1] on T(3,5)", ["loop", "T(3,5)", "--group", "SO(5)", "--rep", "[2,1]"], "route"),
    ("Sp(4) [2,1] on T(3,5)", ["loop", "T(3,5)", "--group", "Sp(4)", "--rep", "[2,1]"], "route"),
    ("G2 (2,0) on T(3,5)", ["loop", "T(3,5)", "--group", "G2", "--rep", "(2,0)"], "route"),
    ("SO(7) [2] on T(2,7)", ["loop", "T(2,7)", "--group", "SO(7)", "--rep", "[2]"], "route"),
]


def _children_cpu() -> float:
    r = resource.getrusage(resource.RUSAGE_CHILDREN)
    return r.ru_utime + r.ru_stime


def run_cli(args, repeat):
    """Minimum wall time and minimum CPU time (user + sys) of the child process over ``repeat`` runs."""
    best, best_cpu = float("inf"), float("inf")
    for _ in range(repeat):
        c0 = _children_cpu()
        t0 = time.perf_counter()
        out = subprocess.run(CLI + args, capture_output=True, text=True)
        dt = time.perf_counter() - t0
        if out.returncode != 0:
            raise SystemExit(f"{' '.join(args)} failed: {out.stderr.strip()}")
        best = min(best, dt)
        best_cpu = min(best_cpu, _children_cpu() - c0)
    return best, best_cpu


def clear_caches():
    from knotobs.representations.cartan import characters, orthogonal_cache_clear

    orthogonal_cache_clear()
    characters._dominant_cached.cache_clear()
    characters._weights_cached.cache_clear()


def run_lib(args, repeat):
    from knotobs.evaluation.kauffman import kauffman
    from knotobs.evaluation.families import wilson_loop

    best = float("inf")
    for _ in range(repeat):
        clear_caches()
        t0 = time.perf_counter()
        if args[0] == "poly":
            kauffman(args[1])
        else:
            route = args[args.index("--route") + 1] if "--route" in args else "rosso-jones"
            wilson_loop(args[1], args[3], args[5], route=route)
        best = min(best, time.perf_counter() - t0)
    return best


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--repeat", type=int, default=3)
    a = ap.parse_args()
    r = a.repeat
    start, start_cpu = run_cli(["--help"], r)
    print(f"CLI start-up (knotobs --help): wall {start:.3f} s, cpu {start_cpu:.3f} s (min of {r})")
    print("columns: CLI wall / CPU (user+sys of the process) per route, then library time, cold caches\n")
    head = (f"{'case':30s} {'CLI rosso-jones':>20s} {'CLI weight-sum':>20s} {'lib r-j':>9s} {'lib w-s':>9s}")
    print(head)
    print("-" * len(head))
    for name, args, both in ROWS:
        t1, c1 = run_cli(args + (["--route", "rosso-jones"] if both else []), r)
        l1 = run_lib(args + (["--route", "rosso-jones"] if both else []), r)
        if both:
            t2, c2 = run_cli(args + ["--route", "weight-sum"], r)
            l2 = run_lib(args + ["--route", "weight-sum"], r)
            print(f"{name:30s} {t1:8.3f} / {c1:6.3f} s {t2:8.3f} / {c2:6.3f} s {l1:8.4f}s {l2:8.4f}s")
        else:
            print(f"{name:30s} {t1:8.3f} / {c1:6.3f} s {'(generic N)':>20s} {l1:8.4f}s {'':>9s}")


if __name__ == "__main__":
    main()
