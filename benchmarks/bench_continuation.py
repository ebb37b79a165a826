"""Speed table of the continuation side (run: python benchmarks/bench_continuation.py)."""

from __future__ import annotations

import time

import mpmath

from knotobs.continuation.asymptotics import compare_with_exact
from knotobs.continuation.flat import flat_connections
from knotobs.continuation.kashaev import kashaev_invariant
from knotobs.continuation.level import continued_partition_function
from knotobs.continuation.ohtsuki import ohtsuki_series
import _bench  # noqa: E402  (the shared timer)


def _time(f, repeat=1):
    return _bench.best_of(f, repeat)


def main() -> None:
    pts = [mpmath.mpc(3 + 0.4 * j, 0.3 * ((-1) ** j)) for j in range(50)]
    rows = [
        ("Ohtsuki coefficients to order 6, Sigma(2,3,5)", 2.0,
         _time(lambda: ohtsuki_series("Sigma(2,3,5)", 6), 3)),
        ("continued Z(K), Sigma(2,3,5), 50 complex K, 30 digits", 5.0,
         _time(lambda: [continued_partition_function("Sigma(2,3,5)", K=K, digits=30) for K in pts])),
        ("flat-connection table, Sigma(2,3,7)", 1.0,
         _time(lambda: flat_connections("Sigma(2,3,7)"), 3)),
        ("continued Z(K), L(5,1), 50 complex K, 30 digits", None,
         _time(lambda: [continued_partition_function("L(5,1)", K=K, digits=30) for K in pts])),
        ("asymptotic comparison Sigma(2,3,5), K = 100..500 (17 levels)", None,
         _time(lambda: compare_with_exact("Sigma(2,3,5)", list(range(100, 501, 25)), order=2))),
        ("Kashaev invariant T(2,5), N = 60", None, _time(lambda: kashaev_invariant("T(2,5)", 60))),
    ]
    w = max(len(r[0]) for r in rows)
    print(f"{'task':<{w}}  {'target':>8}  {'time':>9}  status")
    for name, target, t in rows:
        tgt = f"{target:.1f} s" if target else "-"
        status = "" if target is None else ("ok" if t < target else "SLOW")
        print(f"{name:<{w}}  {tgt:>8}  {t:8.3f}s  {status}")


if __name__ == "__main__":
    main()
