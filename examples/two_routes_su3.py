"""Research scenario: cross-check SU(3) Wilson loops of torus knots by both exact routes.

For each torus knot with P*Q <= 20 and each SU(3) colour with up to three boxes,
compute the zero-framed Wilson loop by the Rosso-Jones formula and by the
weight-insertion sum of the Seifert fibration, confirm they agree exactly, and
print the number of terms.

Run:  python examples/two_routes_su3.py [--max-pq 20]
"""

from __future__ import annotations

import argparse
from math import gcd

from knotobs import SU, TorusLink, rosso_jones, weight_sum
from knotobs.representations import partitions_of


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--max-pq", type=int, default=20)
    args = ap.parse_args(argv)
    checked = 0
    for P in range(2, args.max_pq):
        for Q in range(P + 1, args.max_pq // P + 1):
            if gcd(P, Q) != 1:
                continue
            knot = TorusLink(P, Q)
            for n in (1, 2, 3):
                for lam in partitions_of(n, 3):
                    a = rosso_jones(knot, SU(3), lam)
                    b = weight_sum(knot, SU(3), lam)
                    status = "agree" if a == b else "DISAGREE"
                    print(f"{str(knot):8s} {str(list(lam)):10s} {a.num_terms():5d} terms  {status}")
                    if a != b:
                        raise SystemExit(1)
                    checked += 1
    print(f"{checked} cases, all agree")
    return checked


if __name__ == "__main__":
    main()
