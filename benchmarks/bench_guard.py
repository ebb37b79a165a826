"""How long a user waits for a refusal (or a result) of the runaway requests of issue #14.

Runs each command through the installed ``knotobs`` executable (start-up included), three
times, and prints the minimum wall time, the peak memory of the process (``getrusage`` of
the children) and the first line of its answer.  A table, no assertions.

    python benchmarks/bench_guard.py
"""

from __future__ import annotations

import resource
import shutil
import subprocess
import sys
import tempfile
import time
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)

TEN = "M(0; -1; (2,1), (3,1), (5,1), (7,1), (11,1), (13,1), (17,1), (19,1), (23,1), (29,1))"
CASES = [
    ["continue", TEN, "--K", "7.5"],
    ["continue", "Sigma(2,3,5)", "--K", "7.5+0.3i", "--digits", "2000"],
    ["continue", "Sigma(2,3,5)", "--K", "1000000000000000.5"],
    ["continue", "T(2,3)", "--couplings", "1e-300,1e-300", "--digits", "15"],
    ["match", "--poly", "(1+t+a+z+q)^200"],
    ["plot", "asymptotics", "Sigma(2,3,5)", "-o", "{tmp}/a.png", "--kmax", "100000"],
    ["plot", "level-plane", "Sigma(2,3,5)", "-o", "{tmp}/p.png", "--n", "400"],
    ["grid", "run", "--max-pq", "1000000000", "--store", "{tmp}/g.sqlite"],
    ["grid", "run", "--knots", "T(2,3)", "--workers", "100000", "--store", "{tmp}/g.sqlite"],
    ["grid", "run", "--knots", "T(2,3)", "--scheduler", "bogus", "--store", "{tmp}/g.sqlite"],
]


def main() -> None:
    exe = shutil.which("knotobs") or sys.exit("install knotobs first (pip install -e .)")
    tmp = tempfile.mkdtemp()
    print(f"{'command':78s} {'min s':>6s} {'MB':>6s} exit  answer")
    for case in CASES:
        args = [a.replace("{tmp}", tmp) for a in case]
        best = None
        for _ in range(3):
            t = time.perf_counter()
            p = subprocess.run([exe] + args, capture_output=True, text=True, timeout=300)
            dt = time.perf_counter() - t
            best = dt if best is None else min(best, dt)
        mb = resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss / 1024
        first = (p.stderr or p.stdout).strip().splitlines()[0] if (p.stderr or p.stdout).strip() else ""
        shown = " ".join(case)
        print(f"{shown[:78]:78s} {best:6.2f} {mb:6.0f} {p.returncode:4d}  {first[:90]}")


if __name__ == "__main__":
    main()
