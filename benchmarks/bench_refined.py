"""Superpolynomials of torus knots: in-process time and the whole CLI path (start-up included).

Prints a table; targets from the issue: T(5,6) < 2 s, T(7,8) < 20 s.
Run: python benchmarks/bench_refined.py
"""

from __future__ import annotations

import subprocess
import sys
import time
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)


best_of = _bench.best_of


def main() -> None:
    from knotobs.refined import superpolynomial
    from knotobs.refined.hall import _hall
    from knotobs.refined.nabla import _hook_pairings

    def timed(knot, route):
        def run():
            _hook_pairings.cache_clear()
            _hall.cache_clear()
            return superpolynomial(knot, route=route)
        try:
            return best_of(run)
        except Exception as exc:  # a route that does not apply to this knot
            return None

    rows = []
    for knot in ["T(2,3)", "T(3,4)", "T(3,5)", "T(2,21)", "T(4,5)", "T(5,6)", "T(5,7)", "T(6,7)", "T(7,8)"]:
        terms = superpolynomial(knot).num_terms()
        cmd = [sys.executable, "-c", "from knotobs.cli import main; main()", "poly", knot,
               "--family", "superpolynomial", "--json"]
        t_cli = best_of(lambda: subprocess.run(cmd, check=True, capture_output=True))
        rows.append((knot, terms, timed(knot, "nabla"), timed(knot, "elliptic-hall"), t_cli))
    fmt = lambda x: "   n/a" if x is None else f"{x:6.3f}"
    print(f"{'knot':10} {'terms':>6} {'nabla s':>8} {'Hall s':>8} {'CLI --json s (auto)':>20}")
    for knot, terms, a, b, c in rows:
        print(f"{knot:10} {terms:6d} {fmt(a):>8} {fmt(b):>8} {c:20.3f}")
    print("(minimum of 3 runs; library columns clear the caches before each run; targets: "
          "T(5,6) < 2 s, T(7,8) < 20 s)")


if __name__ == "__main__":
    main()
