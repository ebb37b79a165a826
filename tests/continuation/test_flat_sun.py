"""Flat SU(N) connections on lens spaces.

Checks: (1) for N = 2 the Chern-Simons values are those of the SU(2) sectors of the
Lawrence-Rozansky decomposition (Lawrence & Rozansky, CMP 205 (1999); an independent route
in knotobs.continuation.flat), orientation included; (2) the number of classes is the number
of N-element multisets of Z/p with sum 0 mod p, (1/p) sum_{d | gcd(p, N)} phi(d) C(p/d + N/d - 1, N/d)
(roots-of-unity filter on prod_a 1/(1 - x w^a); common practice); (3) homeomorphic lens spaces
L(p,q) and L(p,q^-1) have the same values and reversing the orientation negates them (Jeffrey,
CMP 147 (1992)); (4) trivial and central connections have stabiliser SU(N), so K-power
-(N^2-1)/2 (Freed & Gompf, CMP 141 (1991): -3/2 for the trivial SU(2) connection).
"""

from collections import Counter
from math import comb, gcd

import pytest
from sympy import totient

from knotobs.continuation.flat import flat_connections
from knotobs.continuation.flat_sun import lens_flat_connections
from knotobs.errors import InvalidSeifertDataError


@pytest.mark.parametrize("space", ["L(5,1)", "L(7,2)", "L(8,3)", "-L(7,2)", "L(12,5)", "L(9,2)", "L(11,3)"])
def test_su2_values_match_the_lawrence_rozansky_sectors(space):
    mine = Counter(c.cs for c in lens_flat_connections(space, 2))
    theirs = Counter()
    for c in flat_connections(space, ohtsuki_order=1).connections:
        # abelian sectors r and |H| - r are merged there (multiplicity 2): one class each
        theirs[c.cs] += 1 if c.kind == "trivial" or c.multiplicity == 1 else c.multiplicity // 2
    assert mine == theirs


@pytest.mark.parametrize("p,N", [(4, 3), (5, 3), (6, 3), (6, 4), (8, 4), (9, 3), (7, 5)])
def test_number_of_classes(p, N):
    expect = sum(int(totient(d)) * comb(p // d + N // d - 1, N // d)
                 for d in range(1, gcd(p, N) + 1) if gcd(p, N) % d == 0) // p
    assert len(lens_flat_connections(f"L({p},1)", N)) == expect


@pytest.mark.parametrize("p,q,N", [(7, 2, 3), (11, 3, 3), (10, 3, 4)])
def test_homeomorphic_and_reversed_lens_spaces(p, q, N):
    a = Counter(c.cs for c in lens_flat_connections(f"L({p},{q})", N))
    b = Counter(c.cs for c in lens_flat_connections(f"L({p},{pow(q, -1, p)})", N))
    r = Counter((-c.cs) % 1 for c in lens_flat_connections(f"-L({p},{q})", N))
    assert a == b == r


def test_central_connections_and_bad_spaces():
    cs = lens_flat_connections("L(6,1)", 3)
    central = [c for c in cs if c.kind in ("trivial", "central")]
    assert [c.holonomy for c in central] == [(0, 0, 0), (2, 2, 2), (4, 4, 4)]
    assert all(c.K_power == -4 for c in central)
    with pytest.raises(InvalidSeifertDataError, match="not a lens space"):
        lens_flat_connections("Sigma(2,3,5)", 3)
    with pytest.raises(InvalidSeifertDataError, match="continuum"):
        lens_flat_connections("S^2xS^1", 3)
