"""Research scenario: coloured Jones invariants of the T(2, 2m+1) family as the level grows.

A small study of our own: for the positive torus knots T(2,3), T(2,5), T(2,7), ...
compute the exact coloured Jones polynomials J_n (n = dimension of the SU(2)
colour), evaluate them at q = exp(2 pi i / K) for a range of shifted levels K,
and print how |J_n| behaves.  The exact polynomial is computed once per
(knot, colour); the evaluations reuse it.

Run:  python examples/twist_family_levels.py [--max-m 4] [--colors 2,3,4] [--levels 5:30:5]
"""

from __future__ import annotations

import argparse

import knotobs


def parse_range(text: str) -> list[int]:
    a, b, step = (int(x) for x in text.split(":"))
    return list(range(a, b + 1, step))


def main(argv: list[str] | None = None) -> list[tuple]:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--max-m", type=int, default=4)
    ap.add_argument("--colors", default="2,3,4")
    ap.add_argument("--levels", default="5:30:5", help="K range start:stop:step (K = k + 2)")
    args = ap.parse_args(argv)
    colours = [int(c) for c in args.colors.split(",")]
    Ks = parse_range(args.levels)
    rows = []
    print(f"{'knot':8s} {'n':>3s} " + " ".join(f"{'K=' + str(K):>10s}" for K in Ks))
    for m in range(1, args.max_m + 1):
        knot = f"T(2,{2 * m + 1})"
        for n in colours:
            poly = knotobs.colored_jones(knot, n).value  # in t = q^-1
            vals = [abs(poly.at_root_of_unity(-K, dps=20)) for K in Ks]  # t = exp(-2 pi i/K)
            rows.append((knot, n, vals))
            print(f"{knot:8s} {n:3d} " + " ".join(f"{float(v):10.5f}" for v in vals))
    return rows


if __name__ == "__main__":
    main()
