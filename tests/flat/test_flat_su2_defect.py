"""Flat SU(2) connections on Brieskorn spheres: one row per connection, its own rotation numbers,
Chern–Simons value and torsion (issue 10, item 0)."""

from fractions import Fraction
from math import gcd

import mpmath
import pytest

from knotobs.continuation.flat import brieskorn_signature, flat_connections
from knotobs.continuation.ohtsuki import ohtsuki_series
from knotobs.fibrations.seifert import SeifertManifold
from knotobs.flat.characters import irreducible_characters
from knotobs.flat.chern_simons import fintushel_stern_cs, irreducible_cs, rotation_numbers_without_b
from knotobs.flat.torsion import irreducible_torsion

TRIPLES = [(p, q, r) for p in range(2, 14) for q in range(p + 1, 14) for r in range(q + 1, 14)
           if gcd(p, q) == 1 and gcd(q, r) == 1 and gcd(p, r) == 1]


def _su2(M):
    return [c for c in irreducible_characters(M) if c.real_form == "SU(2)"]


@pytest.mark.parametrize("a", TRIPLES)
def test_count_is_minus_two_casson_and_cs_is_fintushel_stern(a):
    M = SeifertManifold.from_brieskorn(*a).normal_form()
    su2 = _su2(M)
    # Casson invariant from knotobs's exact Ohtsuki series: lambda = c_1/6 (H. Murakami, Math. Proc.
    # Camb. Phil. Soc. 115 (1994); T. Ohtsuki, ibid. 117 (1995)) ...
    lam = ohtsuki_series(M, 1).coefficients[1] / 6
    # ... equals sigma(Milnor fibre)/8 (Fintushel-Stern, Proc. London Math. Soc. 61 (1990)) ...
    assert Fraction(brieskorn_signature(a), 8) == lam
    # ... and -1/2 the number of irreducible SU(2) classes (Fintushel-Stern 1990)
    assert len(su2) == -2 * lam
    for c in su2:
        # Fintushel-Stern: cs = -e^2/(4 a1 a2 a3), e = sum l_j a1 a2 a3/a_j.  The formula refers to the
        # presentation of Sigma(a1,a2,a3) without the integer b; knotobs's rotation numbers refer to the
        # normal form (0 < b_j < a_j, here b odd or even), so they are normalised first: for eps = -1 and
        # b odd the last one becomes a_3 - l_3.  Without that step the formula fails (checked below).
        assert c.cs == fintushel_stern_cs(a, rotation_numbers_without_b(M, c.eps, c.rotation))


def test_normalisation_is_needed_for_odd_b():
    # Sigma(3,4,7) = M(0; -1; (3,1), (4,1), (7,3)): b odd; (1,1,3) and (1,3,3) (eps = -1) are the
    # classes whose values the unnormalised formula exchanges
    M = SeifertManifold.from_brieskorn(3, 4, 7).normal_form()
    assert M.b % 2 == 1
    raw = {l: fintushel_stern_cs((3, 4, 7), l) for l in [(1, 1, 3), (1, 3, 3)]}
    true = {l: irreducible_cs(M, -1, l) for l in [(1, 1, 3), (1, 3, 3)]}
    assert raw[(1, 1, 3)] == true[(1, 3, 3)] and raw[(1, 3, 3)] == true[(1, 1, 3)]
    assert true[(1, 1, 3)] != true[(1, 3, 3)]


@pytest.mark.parametrize("space,count", [("Sigma(3,5,7)", 8), ("Sigma(3,5,11)", 12), ("Sigma(3,4,7)", 6),
                                         ("Sigma(2,3,5)", 2), ("Sigma(2,3,7)", 2), ("Sigma(2,5,7)", 4),
                                         ("-Sigma(3,5,7)", 8)])
def test_flat_table_rows_are_connections(space, count):
    # counts -2 lambda (Fintushel-Stern 1990): lambda(Sigma(3,5,7)) = -4, Sigma(3,5,11): -6, Sigma(3,4,7): -3
    t = flat_connections(space)
    irr = [c for c in t.connections if c.kind == "irreducible"]
    assert len(irr) == count == -2 * t.casson * (1 if not space.startswith("-") else -1)
    for c in irr:
        assert c.multiplicity == 1 and len(c.rotation) == 1
        eps, l = c.rotation[0]
        M = SeifertManifold.parse(space).normal_form()
        # route 1: CS from the rotation numbers; route 2: the residue sector the row sits in
        assert irreducible_cs(M, eps, l) == c.cs
        # torsion from the rotation numbers (Freed 1992 product of sines) = |A|^2 of the residue sector
        tau = irreducible_torsion(M, eps, l, 20)
        assert abs(tau - abs(c.amplitude) ** 2) < mpmath.mpf(10) ** -12
    assert len({c.cs for c in irr}) == count          # here every CS value is its own sector


def test_poincare_rotation_numbers():
    # Sigma(2,3,5): cs -1/120 for (1,1,1) and -49/120 for (1,1,3) (Fintushel-Stern 1990; CONVENTIONS §9),
    # torsion (2/5) sin^2(pi/5), (2/5) sin^2(2 pi/5) (Freed-Gompf, CMP 141 (1991))
    t = flat_connections("Sigma(2,3,5)")
    rows = {c.rotation[0][1]: c for c in t.connections if c.kind == "irreducible"}
    assert rows[(1, 1, 1)].cs == Fraction(-1, 120) % 1
    assert rows[(1, 1, 3)].cs == Fraction(-49, 120) % 1
    s = mpmath.mpf(2) / 5
    assert abs(rows[(1, 1, 1)].torsion - s * mpmath.sin(mpmath.pi / 5) ** 2) < 1e-15
    assert abs(rows[(1, 1, 3)].torsion - s * mpmath.sin(2 * mpmath.pi / 5) ** 2) < 1e-15
