"""Research scenario: torus knots on the Heegaard torus of a lens space, at finite level.

A study of our own: for the lens space L(7,2), place the curves T(r,s) on its Heegaard torus
as regular fibers of a Seifert fibration (refibration), report their class in H_1 = Z/7 and
fiber framing, and evaluate the SU(2) Wilson loop at several levels (fiber framing when the
knot is not null-homologous, zero framing when it is).

Run:  python examples/lens_space_fibers.py [--space 'L(7,2)'] [--levels 2,3,5]
"""

from __future__ import annotations

import argparse

import mpmath

import knotobs


def main(argv: list[str] | None = None) -> list[tuple]:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--space", default="L(7,2)")
    ap.add_argument("--levels", default="2,3,4")
    ap.add_argument("--knots", default="T(2,5);T(3,4);T(7,3);T(1,3)", help="separated by ;")
    args = ap.parse_args(argv)
    levels = [int(x) for x in args.levels.split(",")]
    rows = []
    print(f"{'knot':8s} {'class':>6s} {'framing':>9s} " + " ".join(f"{'k=' + str(k):>24s}" for k in levels))
    for knot in args.knots.split(";"):
        F = knotobs.fibration_of(knot, args.space)
        vals = [knotobs.level_loop(knot, k, "SU(2)", (1,), space=args.space, digits=15) for k in levels]
        rows.append((knot, F.homology_class, F.fiber_framing, vals))
        cells = " ".join(f"{mpmath.nstr(v.numeric, 8):>24s}" for v in vals)
        print(f"{knot:8s} {str(F.homology_class):>6s} {str(F.fiber_framing):>9s} {cells}")
    return rows


if __name__ == "__main__":
    main()
