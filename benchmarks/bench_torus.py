"""Benchmarks of the exact torus-knot evaluators (prints a table; not a test).

Run:  python benchmarks/bench_torus.py [--repeat 5]

Each row: median wall time over several runs (caches cleared before each run),
and the size of the output in monomials.  Both evaluators are shown side by side
where both apply (fixed N).
"""

from __future__ import annotations

import argparse
import statistics
import time

from knotobs import SU, TorusLink, colored_jones, homfly, rosso_jones, weight_sum
from knotobs.representations import groups, symmetric, weights


def clear_caches() -> None:
    for f in (groups._qdim_cached, groups._adams_fixed, groups._qint_poly, groups._homfly_unknot, symmetric.adams_generic,
              symmetric._mn, symmetric.littlewood_richardson, weights.kostka, weights.weight_multiplicities):
        f.cache_clear()


def timed(fn, repeat: int):
    times, out = [], None
    for _ in range(repeat):
        clear_caches()
        t0 = time.perf_counter()
        out = fn()
        times.append(time.perf_counter() - t0)
    return statistics.median(times), out


def size(res) -> int:
    return res.num_terms()


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--repeat", type=int, default=5)
    args = ap.parse_args()
    r = args.repeat
    rows = []
    for knot in ("T(2,3)", "T(3,4)"):
        for n in (20, 100, 200):
            t, res = timed(lambda: colored_jones(knot, n), r)
            t2, _ = timed(lambda: colored_jones(knot, n, route="weight-sum"), r)
            rows.append((f"J_{n}({knot})", "coloured Jones", t, t2, size(res)))
    for p, q in ((5, 6), (7, 9), (9, 11)):
        t, res = timed(lambda: homfly(f"T({p},{q})"), r)
        rows.append((f"HOMFLY-PT T({p},{q})", "generic N", t, None, size(res)))
    t, res = timed(lambda: rosso_jones(TorusLink(4, 5), SU(4), (3, 2, 1)), r)
    t2, _ = timed(lambda: weight_sum(TorusLink(4, 5), SU(4), (3, 2, 1)), r)
    rows.append(("SU(4) [3,2,1] T(4,5)", "Wilson loop", t, t2, res.num_terms()))
    for knot in ("T(3,4)", "T(3,5)"):
        for lam in ((3,), (2, 1), (3, 2)):
            t, res = timed(lambda: homfly(knot, lam), r)
            rows.append((f"HOMFLY-PT {list(lam)} {knot}", "coloured, generic N", t, None, size(res)))
    print(f"{'case':32s} {'kind':22s} {'Rosso-Jones s':>14s} {'weight-sum s':>13s} {'monomials':>10s}")
    for name, kind, t, t2, n in rows:
        ws = f"{t2:13.4f}" if t2 is not None else f"{'-':>13s}"
        print(f"{name:32s} {kind:22s} {t:14.4f} {ws} {n:10d}")


if __name__ == "__main__":
    main()
