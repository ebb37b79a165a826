"""Superpolynomials of torus knots: in-process time and the whole CLI path (start-up included).

Prints a table; targets from the issue: T(5,6) < 2 s, T(7,8) < 20 s.
Run: python benchmarks/bench_refined.py
"""

from __future__ import annotations

import subprocess
import sys
import time


def best_of(f, n=3):
    best = float("inf")
    for _ in range(n):
        t0 = time.perf_counter()
        f()
        best = min(best, time.perf_counter() - t0)
    return best


def main() -> None:
    from knotobs.refined import superpolynomial
    from knotobs.refined.nabla import _hook_pairings

    rows = []
    for knot in ["T(2,3)", "T(3,4)", "T(2,21)", "T(4,5)", "T(5,6)", "T(3,7)", "T(6,7)", "T(7,8)"]:
        def run():
            _hook_pairings.cache_clear()
            return superpolynomial(knot)
        t_lib = best_of(run)
        terms = run().num_terms()
        cmd = [sys.executable, "-c", "from knotobs.cli import main; main()", "poly", knot,
               "--family", "superpolynomial", "--json"]
        t_cli = best_of(lambda: subprocess.run(cmd, check=True, capture_output=True))
        rows.append((knot, terms, t_lib, t_cli))
    print(f"{'knot':10} {'terms':>7} {'library s':>10} {'CLI --json s':>13}")
    for knot, terms, a, b in rows:
        print(f"{knot:10} {terms:7d} {a:10.3f} {b:13.3f}")
    print("(minimum of 3 runs; the library column clears the cache before each run)")


if __name__ == "__main__":
    main()
