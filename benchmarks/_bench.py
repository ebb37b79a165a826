"""What every benchmark table shares: the CLI timed as installed, and the min-of-n timer.

An installed package has its bytecode compiled once (pip does it at install time).  Some
shells and CI images set ``PYTHONDONTWRITEBYTECODE=1``; the child processes of a benchmark would
then compile every module of knotobs on every start (about 0.08 s here) and the table would show
a start-up no user waits for.  Importing this module removes the variable for the benchmark and
its children, and the first (warm-up) run of each command writes the bytecode.
"""

import os
import time

os.environ.pop("PYTHONDONTWRITEBYTECODE", None)


def best_of(f, n: int = 3) -> float:
    """The shortest of ``n`` runs of ``f()``, in seconds."""
    best = float("inf")
    for _ in range(n):
        t0 = time.perf_counter()
        f()
        best = min(best, time.perf_counter() - t0)
    return best
