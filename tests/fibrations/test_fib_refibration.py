"""Torus knots as fibres of S^3 and of lens spaces."""

from fractions import Fraction
from math import gcd

import pytest

from knotobs.errors import InvalidKnotError, ParseError
from knotobs.fibrations import (
    TorusLink,
    fibration_of,
    lens_canonical_q,
    lens_fibration,
    lens_fibrations,
    lens_knot_data,
    s3_seifert,
)

COPRIME_30 = [(P, Q) for P in range(1, 31) for Q in range(1, 31) if gcd(P, Q) == 1]


@pytest.mark.parametrize("c", [1, -1])
def test_s3_fibrations_up_to_30(c):
    # Regular fibres of the circle action t.(z1,z2) = (t^P z1, t^Q z2) on S^3 are
    # T(P,Q); two of them link P*Q times; the exceptional fibres are the unknotted
    # cores, linking a regular fibre Q and P times and each other once
    # (common practice; e.g. Rolfsen, Knots and Links, 1976, 3.C, 10.B).
    for P, Q in COPRIME_30:
        F = fibration_of(TorusLink(P, c * Q))
        assert F.h1_order == 1 and F.recognised == "S^3"
        L = F.linking
        assert L[0][0] == c * P * Q == F.fiber_framing
        assert sorted(x.order for x in F.cores) == sorted([P, Q])
        assert all(x.knot_type == "unknot" for x in F.cores)
        lk_core = {F.cores[i].order: L[0][i + 1] for i in range(2)}
        assert lk_core[P] == c * Q and lk_core[Q] == c * P if P != Q else True
        assert L[1][2] == c


def test_torus_link_is_d_regular_fibres():
    # T(dP, dQ): d parallel regular fibres, pairwise linking P*Q (common practice).
    for p, q in [(4, 6), (6, 9), (3, 3), (2, -8), (10, 15)]:
        K = TorusLink(p, q)
        F = fibration_of(K)
        assert F.components == K.components
        for i in range(K.components):
            for j in range(K.components):
                if i != j:
                    assert F.linking[i][j] == K.linking_number


def test_unknot_as_exceptional_fibre():
    # The cores of the Heegaard solid tori are unknots, exceptional fibres of order P
    # and Q (Seifert 1933; Rolfsen 1976).
    F = fibration_of("T(3,5)", core=3)
    assert F.role == "exceptional"
    assert F.cores[F.core].order == 3 and F.cores[F.core].knot_type == "unknot"
    # it links a regular fibre 5 times and the other core once
    assert F.linking[0][1:] == (Fraction(1),)
    full = F.manifold.fiber_linking()
    assert full[0][F.core + 1] == 5
    with pytest.raises(InvalidKnotError, match="none of order 4"):
        fibration_of("T(3,5)", core=4)


def test_regular_fibre_of_general_seifert_manifold():
    # In Sigma(2,3,5) two regular fibres link -1/e = 30 times (Seifert 1933, e = -1/30
    # by Neumann-Raymond 1978).
    F = fibration_of("fiber", "Sigma(2,3,5)")
    assert F.fiber_framing == 30 and F.recognised == "Sigma(2,3,5)"
    with pytest.raises(InvalidKnotError, match="T\\(2,3\\) in Sigma"):
        fibration_of("T(2,3)", "Sigma(2,3,5)")
    with pytest.raises(ParseError, match="'K'"):
        fibration_of("K", "Sigma(2,3,5)")


def test_lens_route_with_p1_is_s3():
    # L(1,0) = S^3 (Rolfsen 1976): the Heegaard-torus construction must reproduce
    # the S^3 fibration for every torus knot.
    for P, Q in [(2, 3), (3, 5), (1, 4), (5, 7)]:
        for c in (1, -1):
            assert lens_fibration(1, 0, P, c * Q).normal_form() == s3_seifert(P, Q, c).normal_form()


@pytest.mark.parametrize("p", range(2, 13))
def test_lens_fibrations_have_h1_p(p):
    # |H_1(L(p,q))| = p (Seifert 1933); every fibration found is of the same oriented lens space.
    for q in range(1, p):
        if gcd(p, q) != 1:
            continue
        found = lens_fibrations(p, q, 8)
        assert found
        for r, s, M in found:
            assert M.h1_order == p
            assert M.recognise() == f"L({p},{lens_canonical_q(p, q)})"
            assert len(M.exceptional_orders) <= 2


def test_lens_knot_data_and_fibre_framing():
    # Class of r mu + s lambda in H_1(L(p,q)) = Z/p is r; its linking with the torus
    # push-off is r s + q r^2/p (rational linking after surgery, Kirby LNM 1374).  The
    # Seifert model gives the same number as -1/e (a different derivation).
    for p, q in [(7, 2), (5, 1), (9, 4), (12, 5)]:
        for r in range(-4, 5):
            for s in range(-4, 5):
                if r == 0 or gcd(r, s) != 1 or r * q + s * p == 0:
                    continue
                d = lens_knot_data(p, q, r, s)
                M = lens_fibration(p, q, r, s)
                assert d.homology_class == r % p
                assert M.fiber_framing == d.self_linking
                assert sorted(a for a, _ in M.fibers) == sorted([abs(r), abs(r * q + s * p)])


def test_lens_knot_via_fibration_of():
    F = fibration_of("T(3,1)", "L(7,2)")
    assert F.recognised == "L(7,2)" and F.h1_order == 7
    assert F.homology_class == 3 and F.class_order == 7
    assert F.self_linking_mod_one == Fraction(18, 7) - 2


def test_knot_that_is_not_a_fibre():
    # r q + s p = 0: the curve bounds a meridian disc of V_2.
    with pytest.raises(InvalidKnotError, match=r"T\(5,-2\).*L\(5,2\)"):
        fibration_of("T(5,-2)", "L(5,2)")
