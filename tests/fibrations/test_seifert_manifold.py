"""Seifert manifolds over S^2: validation, normal form, homology, recognition."""

from fractions import Fraction
from math import gcd, prod

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from knotobs.errors import InvalidSeifertDataError, KnotobsError, ParseError
from knotobs.fibrations import (
    SeifertManifold,
    lens_canonical_q,
    lens_homeomorphic,
    parse_space,
)


# ----------------------------------------------------------------- strategies
@st.composite
def fibers(draw, max_n=5, max_a=12):
    n = draw(st.integers(0, max_n))
    out = []
    for _ in range(n):
        a = draw(st.integers(1, max_a))
        b = draw(st.integers(-40, 40).filter(lambda x, a=a: gcd(a, x) == 1))
        out.append((a, b))
    return out


manifolds = st.builds(lambda b, f: SeifertManifold(b, f), st.integers(-6, 6), fibers())


# ------------------------------------------------------------------ bad input
@pytest.mark.parametrize(
    "b, fibs, needle",
    [
        (0, [(4, 2)], "gcd(a_1, b_1) = 2"),
        (0, [(2, 1), (6, 9)], "(6,9)"),
        (0, [(0, 1)], "a_1 = 0"),
        (0, [(-3, 1)], "a_1 = -3"),
        (0, [(2.5, 1)], "2.5"),
        ("1", [], "'1'"),
        (0, [(2, 1, 3)], "(2, 1, 3)"),
    ],
)
def test_bad_seifert_data_is_named(b, fibs, needle):
    with pytest.raises(InvalidSeifertDataError) as exc:
        SeifertManifold(b, fibs)
    assert needle in str(exc.value)


@pytest.mark.parametrize(
    "text, needle",
    [
        ("L(7", "'L(7'"),
        ("M(0; 1; (2,1) (3,1))", "(2,1)(3,1)"),
        ("M(1; 0; 2)", "'M(1; 0; 2)'"),
        ("Sigma(2,x,5)", "'Sigma(2,x,5)'"),
        ("M(0; 1; ((2,1))", "unbalanced"),
        ("foo", "'foo'"),
    ],
)
def test_malformed_notation(text, needle):
    with pytest.raises(ParseError) as exc:
        parse_space(text)
    assert needle in str(exc.value)
    assert "L(p,q)" in str(exc.value) or "genus" in str(exc.value) or "unbalanced" in str(exc.value)


@pytest.mark.parametrize("text", ["M(0; 0; (2,4))", "L(6,4)", "Sigma(2,4,5)", "M(0; 0; (0,1))"])
def test_invalid_numbers_in_notation(text):
    with pytest.raises(InvalidSeifertDataError):
        parse_space(text)


def test_fibers_given_as_lists_become_tuples():
    M = SeifertManifold(0, [[2, 1], [3, -1]])
    assert M.fibers == ((2, 1), (3, -1))
    hash(M)


# ------------------------------------------------------- published identities
def test_poincare_sphere():
    # Sigma(2,3,5) as the link of x^2+y^3+z^5 has Seifert invariants with
    # e = -1/(2*3*5) (Neumann-Raymond, LNM 664, 1978); it is an integral
    # homology sphere (Poincare 1904).
    P = parse_space("Sigma(2,3,5)")
    assert P.euler == Fraction(-1, 30)
    assert P.h1_order == 1 and P.homology() == ()
    assert P.normal_form() == SeifertManifold(-1, ((2, 1), (3, 1), (5, 1)))
    assert P.reverse().euler == Fraction(1, 30)
    assert P.recognise() == "Sigma(2,3,5)"
    assert P.reverse().recognise() == "-Sigma(2,3,5)"
    # Lawrence-Rozansky, Commun. Math. Phys. 205 (1999): Sigma(2,3,5) = X(2/-1, 3/1, 5/1), H = +1
    assert SeifertManifold(0, [(2, -1), (3, 1), (5, 1)]).is_equivalent(P)


def test_sigma_237_lawrence_rozansky_presentation():
    # Sigma(2,3,7) = X(2/-3, 3/2, 7/6) (Lawrence-Rozansky 1999, as recorded in CONVENTIONS §9).
    S = SeifertManifold.from_brieskorn(2, 3, 7)
    assert S.euler == Fraction(-1, 42)
    assert SeifertManifold(0, [(2, -3), (3, 2), (7, 6)]).is_equivalent(S)


@pytest.mark.parametrize("a", [(2, 3, 5), (2, 3, 7), (2, 3, 11), (2, 5, 7), (3, 4, 5), (2, 3, 5, 7)])
def test_brieskorn_spheres_are_homology_spheres(a):
    # Brieskorn, Invent. Math. 2 (1966): pairwise coprime orders give an integral homology sphere.
    S = SeifertManifold.from_brieskorn(*a)
    assert S.h1_order == 1
    assert S.euler == Fraction(-1, prod(a))
    assert S.recognise() == "Sigma(" + ",".join(map(str, a)) + ")"


@given(manifolds)
@settings(max_examples=150, deadline=None)
def test_lawrence_rozansky_H_is_h1(M):
    # Lawrence-Rozansky (1999): for X(p_1/q_1, ...), |H_1| = |P sum q_j/p_j|.
    pres = M.surgery_presentation()
    P = prod(p for p, _ in pres)
    H = P * sum((Fraction(q, p) for p, q in pres), Fraction(0))
    assert abs(H) == M.h1_order


@given(manifolds)
@settings(max_examples=150, deadline=None)
def test_h1_formula_agrees_with_smith_normal_form(M):
    # |H_1| = |a_1 ... a_n e| (Seifert 1933; CONVENTIONS §5) against the
    # invariant factors of the presentation matrix, computed independently.
    factors = M.homology()
    if M.euler == 0:
        assert 0 in factors and M.h1_order == 0
    else:
        assert prod(factors) == M.h1_order


# ------------------------------------------------------------------- lens spaces
def test_lens_classification_reidemeister_brody():
    # Reidemeister 1935, Brody 1960: L(7,1) and L(7,2) are not homeomorphic; L(7,2) = L(7,4).
    assert not lens_homeomorphic(7, 1, 7, 2)
    assert lens_homeomorphic(7, 2, 7, 4)
    L71, L72, L74 = (SeifertManifold.from_lens(7, q) for q in (1, 2, 4))
    assert L72.recognise() == L74.recognise() == "L(7,2)"
    assert L71.recognise() == "L(7,1)"
    assert L71.normal_form() not in (L72.normal_form(), L72.reverse().normal_form())


def test_whitehead_homotopy_equivalence_via_linking_form():
    # J. H. C. Whitehead (1941): L(p,q) ~ L(p,q') (homotopy) iff q q' = +-u^2 mod p.
    # L(7,1), L(7,2) are homotopy equivalent (2 = 3^2 mod 7); L(5,1), L(5,2) are not.
    a, b = SeifertManifold.from_lens(7, 1), SeifertManifold.from_lens(7, 2)
    assert a.linking_form().is_isometric(b.linking_form())
    c, d = SeifertManifold.from_lens(5, 1), SeifertManifold.from_lens(5, 2)
    assert not c.linking_form().is_isometric(d.linking_form())
    assert not c.linking_form().is_isometric(d.reverse().linking_form())


@pytest.mark.parametrize("p", range(2, 14))
def test_lens_linking_form_and_h1(p):
    # |H_1(L(p,q))| = p and the linking form is q u^2/p for a unit u (Seifert 1933;
    # with L(p,q) = -p/q surgery on the unknot, Rolfsen 1976).
    for q in range(1, p):
        if gcd(p, q) != 1:
            continue
        M = SeifertManifold.from_lens(p, q)
        assert M.h1_order == p
        lf = M.linking_form()
        assert lf.orders == (p,)
        v = lf.matrix[0][0]
        assert any((v - Fraction(q * u * u, p)).denominator == 1 for u in range(1, p) if gcd(u, p) == 1)
        assert M.recognise() == f"L({p},{lens_canonical_q(p, q)})"


def test_named_small_spaces():
    assert parse_space("S^3").recognise() == "S^3"
    assert parse_space("S^2xS^1").recognise() == "S^2xS^1"
    assert parse_space("S^2xS^1").h1_order == 0
    assert parse_space("L(1,0)").recognise() == "S^3"
    # e = 0 with at most two exceptional fibres is S^2 x S^1 (Seifert 1933)
    assert SeifertManifold(0, [(3, 1), (3, -1)]).recognise() == "S^2xS^1"


def test_prism_and_spherical_kinds():
    # Seifert 1933 / Scott, Bull. LMS 15 (1983): orbifold (2,2,n) with e != 0 are prism manifolds.
    M = SeifertManifold(-1, [(2, 1), (2, 1), (5, 2)])
    assert M.classify().kind == "prism manifold"
    assert M.classify().geometry == "S^3"
    assert SeifertManifold(-1, [(2, 1), (3, 1), (4, 1)]).classify().kind.startswith("spherical")
    assert SeifertManifold(-1, [(2, 1), (3, 1), (7, 1)]).classify().geometry == "SL2"


# ---------------------------------------------------------------- hypothesis
@given(manifolds)
@settings(max_examples=200, deadline=None)
def test_normal_form_idempotent(M):
    N = M.normal_form()
    assert N.normal_form() == N
    assert all(0 < b < a for a, b in N.fibers)
    assert list(N.fibers) == sorted(N.fibers)


@given(manifolds, st.data())
@settings(max_examples=200, deadline=None)
def test_moves_preserve_invariants(M, data):
    # Seifert 1933: (a_i, b_i) -> (a_i, b_i + k a_i), b -> b - k; adding (1, k); permuting.
    moved = M.with_regular_fiber(data.draw(st.integers(-5, 5)))
    for _ in range(data.draw(st.integers(0, 4))):
        i = data.draw(st.integers(0, len(moved.fibers) - 1))
        moved = moved.twist(i, data.draw(st.integers(-4, 4)))
    perm = data.draw(st.permutations(range(len(moved.fibers))))
    moved = moved.permute(perm)
    assert moved.euler == M.euler
    assert moved.h1_order == M.h1_order
    assert moved.homology() == M.homology()
    assert moved.normal_form() == M.normal_form()
    assert moved.recognise() == M.recognise()


@given(manifolds)
@settings(max_examples=200, deadline=None)
def test_orientation_reversal(M):
    R = M.reverse()
    assert R.euler == -M.euler
    assert R.reverse() == M
    assert R.h1_order == M.h1_order
    lf, lr = M.linking_form(), R.linking_form()
    if lf is not None:
        # reversing orientation negates the linking form (Seifert 1933)
        assert lf.orders == lr.orders
        if lf.size <= 60:
            neg = type(lf)(lf.orders, tuple(tuple((-x) % 1 for x in row) for row in lf.matrix))
            assert neg.is_isometric(lr)


@given(manifolds)
@settings(max_examples=100, deadline=None)
def test_gluing_matrices_are_in_sl2z(M):
    for (a, my), (b, x) in M.gluing_matrices():
        assert a * x - my * b == 1


def test_error_is_knotobs_error():
    with pytest.raises(KnotobsError):
        SeifertManifold(0, [(2, 2)])


@given(manifolds)
@settings(max_examples=100, deadline=None)
def test_printed_notation_parses_back(M):
    assert parse_space(str(M)) == M
    assert parse_space("-" + str(M)) == M.reverse()
