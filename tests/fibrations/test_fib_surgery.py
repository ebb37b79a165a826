"""Surgery on fibres: Moser's theorem and published identifications."""

from fractions import Fraction
from math import gcd

import pytest

from knotobs.errors import InvalidKnotError, InvalidSeifertDataError, ParseError
from knotobs.fibrations import (
    SeifertManifold,
    lens_homeomorphic,
    parse_slope,
    surgery_on_fiber,
    torus_knot_surgery,
)

PQ_LIST = [(2, 3), (2, 5), (3, 4), (3, 5), (2, 7), (4, 5), (3, 7)]


def _lens_pq(M):
    p, q = M.lens_parameters()
    return p, q


@pytest.mark.parametrize("P,Q", PQ_LIST)
@pytest.mark.parametrize("c", [1, -1])
def test_moser_lens_space_case(P, Q, c):
    # Moser, Pacific J. Math. 38 (1971): r = PQ +- 1 surgery on T(P,Q) is a lens space
    # L(|PQ +- 1|, Q^2) (up to homeomorphism); the mirror knot at -r likewise.
    for eps in (1, -1):
        r = c * (P * Q + eps)
        res = torus_knot_surgery(f"T({P},{c * Q})", r)
        M = res.manifold
        assert M is not None
        p, q = _lens_pq(M)
        assert p == abs(P * Q + eps) == res.h1_order
        assert lens_homeomorphic(p, q, p, Q * Q)
        assert lens_homeomorphic(p, q, p, P * P)


@pytest.mark.parametrize("P,Q", PQ_LIST)
def test_moser_fractional_lens_case(P, Q):
    # Moser 1971: m/n surgery with |PQ n - m| = 1 gives L(|m|, n Q^2).
    for n in (2, 3):
        for m in (P * Q * n + 1, P * Q * n - 1):
            res = torus_knot_surgery(f"T({P},{Q})", Fraction(m, n))
            p, q = _lens_pq(res.manifold)
            assert p == abs(m)
            assert lens_homeomorphic(p, q, p, n * Q * Q)


@pytest.mark.parametrize("P,Q", PQ_LIST)
@pytest.mark.parametrize("c", [1, -1])
def test_moser_reducible_case(P, Q, c):
    # Moser 1971: PQ surgery on T(P,Q) is L(P,Q) # L(Q,P), |H_1| = PQ.
    res = torus_knot_surgery(f"T({P},{c * Q})", c * P * Q)
    assert res.is_reducible and res.manifold is None
    assert res.h1_order == P * Q
    summ = sorted((S.lens_parameters() for S in res.summands))
    (p1, q1), (p2, q2) = summ
    assert (p1, p2) == (min(P, Q), max(P, Q))
    want = {P: Q, Q: P}
    assert lens_homeomorphic(p1, q1, p1, want[p1]) and lens_homeomorphic(p2, q2, p2, want[p2])
    assert " # " in res.recognised


@pytest.mark.parametrize("P,Q", PQ_LIST)
def test_moser_seifert_case(P, Q):
    # Moser 1971: otherwise three exceptional fibres of orders P, Q, |PQ n - m|,
    # and |H_1| = |m| for m/n surgery on a knot in S^3 (common practice).
    for m, n in [(1, 1), (-1, 1), (0, 1), (5, 2), (-7, 3), (P * Q + 3, 1), (2 * P * Q + 5, 2)]:
        if gcd(m, n) != 1 or abs(P * Q * n - m) <= 1:
            continue
        res = torus_knot_surgery(f"T({P},{Q})", Fraction(m, n))
        M = res.manifold
        assert M.exceptional_orders == tuple(sorted([P, Q, abs(P * Q * n - m)]))
        assert res.h1_order == abs(m)


def test_kirby_scharlemann_poincare_sphere():
    # Kirby-Scharlemann (1979): -1 surgery on the left-handed trefoil and +1 surgery on
    # the right-handed one give the Poincare sphere, with opposite orientations; -1
    # surgery on the right-handed trefoil gives Sigma(2,3,7) (common practice).
    a = torus_knot_surgery("T(2,-3)", -1).manifold
    b = torus_knot_surgery("T(2,3)", 1).manifold
    c = torus_knot_surgery("T(2,3)", -1).manifold
    assert a.recognise() == "Sigma(2,3,5)" and a.euler == Fraction(-1, 30)
    assert b.recognise() == "-Sigma(2,3,5)" and b.euler == Fraction(1, 30)
    assert a.is_equivalent(b.reverse())
    assert c.recognise() == "Sigma(2,3,7)" and c.h1_order == 1
    # e = +-1/30 and H_1 = 0
    assert a.homology() == () and b.homology() == ()


@pytest.mark.parametrize("n", [1, 2, 3, 5])
def test_brieskorn_families_from_trefoil(n):
    # -1/n surgery on the right-handed trefoil is Sigma(2,3,6n+1) and on the
    # left-handed one Sigma(2,3,6n-1) (common practice, from memory; e.g. N. Saveliev,
    # Invariants for Homology 3-Spheres, Springer 2002).
    assert torus_knot_surgery("T(2,3)", Fraction(-1, n)).recognised == f"Sigma(2,3,{6 * n + 1})"
    assert torus_knot_surgery("T(2,-3)", Fraction(-1, n)).recognised == f"Sigma(2,3,{6 * n - 1})"


@pytest.mark.parametrize("m,n", [(1, 1), (5, 1), (-3, 1), (7, 2), (-5, 3), (2, 5), (0, 1)])
def test_surgery_on_unknot_is_lens_space(m, n):
    # m/n surgery on the unknot is L(m, -n) when L(p,q) := -p/q surgery (Rolfsen 1976, 9.G).
    res = torus_knot_surgery("T(1,1)", Fraction(m, n))
    p, q = res.manifold.lens_parameters()
    if m == 0:
        assert p == 0
    elif abs(m) == 1:
        assert p == 1
    else:
        assert p == abs(m)
        assert lens_homeomorphic(p, q, p, -n * (1 if m > 0 else -1), oriented=True)


def test_surgery_on_regular_fibre_with_fibre_framing():
    # Fibre-framed P/Q surgery on a regular fibre adds the fibre (P, Q).
    M = SeifertManifold.from_brieskorn(2, 3, 5)
    res = surgery_on_fiber(M, Fraction(7, 2))
    assert res.new_fiber == (7, 2)
    assert res.manifold.fibers[-1] == (7, 2)
    # Seifert framing needs a null-homologous fibre: fine in a homology sphere,
    res2 = surgery_on_fiber(M, Fraction(1), framing="seifert")
    # the fibre framing is -1/e = 30, so +1 (Seifert) = 1 - 30 = -29 (fibre framing)
    assert res2.new_fiber == (29, -1)
    assert res2.manifold.exceptional_orders == (2, 3, 5, 29)
    assert res2.h1_order == 1  # |H_1| = |m| for m/n surgery on a knot in a ZHS (common practice)
    # but not in L(5,1), where the fibre has order 5
    with pytest.raises(InvalidSeifertDataError, match="not null-homologous"):
        surgery_on_fiber(SeifertManifold(0, [(2, 1), (3, 1)]), 1, framing="seifert")


def test_bad_slopes_and_links():
    with pytest.raises(ParseError, match="'1/0'"):
        parse_slope("1/0")
    with pytest.raises(ParseError, match="'abc'"):
        parse_slope("abc")
    with pytest.raises(InvalidKnotError, match="T\\(4,6\\)"):
        torus_knot_surgery("T(4,6)", 1)
