"""Timing table for the finite-level routes.

Rows: SU(2) Z_K of the Brieskorn sphere Sigma(2,3,7) by the Lawrence–Rozansky reduction
(K = 10^3, 10^4, 10^5); SU(3) at k = 40 for the Poincaré sphere Sigma(2,3,5) (surgery,
ball arithmetic); a regular-fiber Wilson loop in L(5,1), SU(2), k = 200 (surgery).
Each time is the median of several runs, each run computing 30 checked digits.

Run:  python benchmarks/bench_finite_level.py
"""

from __future__ import annotations

import statistics
import time

import mpmath

from knotobs.evaluation.gauss_sum import lawrence_rozansky
from knotobs.evaluation.modular import ModularData
from knotobs.evaluation.surgery import (
    SurgeryPresentation,
    fiber_wilson_loop,
    partition_function,
    seifert_to_surgery,
)


def _products(b, fibers) -> int:
    """Number of dense S-matrix-vector products of the surgery route."""
    e0, pq = seifert_to_surgery(b, fibers)
    return sum(len(c) for c in SurgeryPresentation.from_coefficients(e0, pq).chains)


def _median_time(fn, runs):
    times = []
    out = None
    for _ in range(runs):
        t = time.perf_counter()
        out = fn()
        times.append(time.perf_counter() - t)
    return statistics.median(times), out


def main() -> None:
    rows = []
    sigma237 = [(2, -3), (3, 2), (7, 6)]
    for K in (10**3, 10**4, 10**5):
        t, (ex, z, size) = _median_time(lambda: lawrence_rozansky(sigma237, K - 2, 30, exact=False), 5)
        rows.append((f"SU(2) Sigma(2,3,7) Gauss sum, K={K}", t, f"{size} monomials (2PK = {2 * 42 * K} terms unreduced)",
                     mpmath.nstr(z, 12)))
    md = ModularData(3, 40)
    poincare = (0, [(2, -1), (3, 1), (5, 1)])
    t, z = _median_time(lambda: partition_function(poincare, "SU(3)", 40, digits=30, exact=False), 3)
    rows.append(("SU(3) k=40 Sigma(2,3,5) surgery (balls)", t,
                 f"{md.size} weights, {_products(*poincare)} dense S products of {md.size}x{md.size}", mpmath.nstr(z.numeric, 12)))
    t, w = _median_time(lambda: fiber_wilson_loop((0, [(1, 5)]), 200, "SU(2)", regular=[(1,)], digits=30), 3)
    route = f"exact, conductor {w.exact.conductor}" if w.exact is not None else "ball arithmetic"
    rows.append(("SU(2) k=200 L(5,1) regular fiber [1]", t,
                 f"201 weights, {_products(0, [(1, 5)])} dense S products ({route})", mpmath.nstr(w.numeric, 12)))
    print(f"{'case':48s} {'median s':>9s}  {'size':55s} value")
    for name, t, size, val in rows:
        print(f"{name:48s} {t:9.3f}  {size:55s} {val}")


if __name__ == "__main__":
    main()
