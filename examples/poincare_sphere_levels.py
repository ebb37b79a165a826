"""Research scenario: how the Poincare sphere's SU(2) invariant approaches its flat-connection sum.

A study of our own: compute Z_K(Sigma(2,3,5)) exactly (surgery route, cyclotomic) for a range
of shifted levels K, split it into its three flat-connection sectors (trivial and two
irreducible, Chern-Simons values -1/120 and -49/120 mod 1), and print how far the exact
value is from the truncated large-K asymptotic sum.

Run:  python examples/poincare_sphere_levels.py [--levels 10:200:10] [--order 2]
"""

from __future__ import annotations

import argparse

import mpmath

import knotobs
from knotobs.continuation import asymptotic_value, sector_values


def main(argv: list[str] | None = None) -> list[tuple]:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--levels", default="10:200:10", help="K range start:stop:step (K = k + 2)")
    ap.add_argument("--order", type=int, default=2, help="truncation order of the trivial-connection series")
    args = ap.parse_args(argv)
    a, b, step = (int(x) for x in args.levels.split(":"))
    M = knotobs.parse_space("Sigma(2,3,5)")
    rows = []
    print(f"{'K':>5s} {'|Z_K|':>12s} {'|Z_trivial|':>12s} {'|Z_-1/120|':>12s} {'|Z_-49/120|':>12s} {'|Z - asympt|':>13s}")
    for K in range(a, b + 1, step):
        z = knotobs.partition_function(M, "SU(2)", K - 2, digits=20).numeric
        sec = sector_values(M, K, 20)
        asym = asymptotic_value(M, K, order=args.order, digits=20)
        err = abs(z - asym)
        vals = [abs(sec[cs]) for cs in sorted(sec)]
        rows.append((K, z, sec, err))
        print(f"{K:5d} {float(abs(z)):12.6f} " + " ".join(f"{float(v):12.6f}" for v in vals) + f" {float(err):13.3e}")
    return rows


if __name__ == "__main__":
    main()
