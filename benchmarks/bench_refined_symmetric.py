"""Symmetric-coloured superpolynomials P_[r] of torus knots: both routes side by side, in-process
and through the CLI (start-up included).

Aim from the issue: T(2,3) r=2 and T(3,4) r=2 each well under 2 s through the CLI.
Run: python benchmarks/bench_refined_symmetric.py
"""

from __future__ import annotations

import subprocess
import sys
import time
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)

CASES = [("T(2,3)", 2), ("T(2,3)", 3), ("T(2,5)", 2), ("T(2,5)", 3), ("T(3,4)", 2), ("T(3,4)", 3),
         ("T(2,3)", 4), ("T(2,7)", 3), ("T(3,5)", 2), ("T(4,5)", 2)]


best_of = _bench.best_of


def main() -> None:
    from knotobs.refined import superpolynomial
    from knotobs.refined import colored_hall, fock

    def timed(knot, r, route, n):
        def run():
            colored_hall._pairings.cache_clear()
            fock._pairings.cache_clear()
            fock._pieri.cache_clear()
            return superpolynomial(knot, [r], route=route)
        return best_of(run, n)

    def cli(knot, r, route, n):
        cmd = [sys.executable, "-c", "from knotobs.cli import main; main()", "poly", knot,
               "--family", "superpolynomial", "--rep", f"[{r}]", "--route", route, "--json"]
        return best_of(lambda: subprocess.run(cmd, check=True, capture_output=True), n)

    print(f"{'knot':8} {'[r]':>4} {'terms':>6} {'Hall s':>8} {'Macdonald s':>12} "
          f"{'CLI Hall s':>11} {'CLI Macd. s':>12} {'CLI both s':>11}")
    for knot, r in CASES:
        terms = superpolynomial(knot, [r]).num_terms()
        n = 3 if terms < 200 else 1
        a = timed(knot, r, "elliptic-hall", n)
        b = timed(knot, r, "macdonald", n)
        c = cli(knot, r, "elliptic-hall", n)
        d = cli(knot, r, "macdonald", n)
        e = cli(knot, r, "both", n)
        print(f"{knot:8} {r:4d} {terms:6d} {a:8.3f} {b:12.3f} {c:11.3f} {d:12.3f} {e:11.3f}", flush=True)
    print("(minimum of 3 runs, 1 for the largest; library columns clear the caches before each run; "
          "the CLI default route for [r] >= 2 is macdonald)")


if __name__ == "__main__":
    main()
