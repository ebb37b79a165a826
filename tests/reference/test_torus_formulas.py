"""Torus knots against closed formulas from the literature.

* Jones polynomial of T(p, q): V. F. R. Jones, "Hecke algebra representations of braid
  groups and link polynomials", Ann. of Math. 126 (1987) 335–388, §11:
  ``V(t) = t^((p-1)(q-1)/2) (1 - t^(p+1) - t^(q+1) + t^(p+q)) / (1 - t^2)``.
* Coloured Jones polynomial of T(p, q): H. R. Morton, "The coloured Jones function and
  Alexander polynomial for torus knots", Math. Proc. Camb. Phil. Soc. 117 (1995) 129–135.
  The exact typography of Morton's statement could not be retrieved here, so the formula
  below is written FROM MEMORY in the form it is usually quoted (also Rosso–Jones, J. Knot
  Theory Ramifications 2 (1993)); it is re-derived in the docstring of
  :func:`_morton_times_denominator` from the classical character identity
  ``chi_n(x^p) (x - 1/x) = sum_j (x^(2pj+1) - x^-(2pj+1))`` so its normalisation is pinned.
* Alexander polynomial of T(p, q): classical (J. W. Alexander, Trans. AMS 30 (1928); e.g.
  D. Rolfsen, *Knots and Links* (1976), ch. 7 ex.; W. B. R. Lickorish, *An Introduction to
  Knot Theory*, GTM 175 (1997), ch. 6):
  ``Delta(t) = (t^(pq) - 1)(t - 1) / ((t^p - 1)(t^q - 1))`` up to units ``+-t^k``.

Every comparison clears denominators and compares exact ``{exponent: coefficient}`` maps,
computed here with plain dictionaries (no knotobs arithmetic on the reference side).
"""

from __future__ import annotations

from fractions import Fraction
from math import gcd

import pytest

from knotobs import TorusLink, alexander, colored_jones, jones


# ---------------------------------------------------------------- dict-polynomial helpers
def _mul(a: dict, b: dict) -> dict:
    out: dict = {}
    for ea, ca in a.items():
        for eb, cb in b.items():
            out[ea + eb] = out.get(ea + eb, 0) + ca * cb
    return {e: c for e, c in out.items() if c}


def _add(*polys: dict) -> dict:
    out: dict = {}
    for p in polys:
        for e, c in p.items():
            out[e] = out.get(e, 0) + c
    return {e: c for e, c in out.items() if c}


def _poly(*pairs) -> dict:
    """``_poly((e1, c1), (e2, c2), ...)`` with exponents made Fractions."""
    return _add(*({Fraction(e): c} for e, c in pairs))


def _coprime_pairs(lo: int, hi: int):
    return [(p, q) for p in range(lo, hi + 1) for q in range(p + 1, hi + 1) if gcd(p, q) == 1]


# ================================================================ Jones (1987)
JONES_PAIRS = _coprime_pairs(2, 15)


@pytest.mark.parametrize("p,q", JONES_PAIRS)
def test_jones_closed_formula(p, q):
    """Jones, Ann. of Math. 126 (1987): V(t)(1 - t^2) = t^((p-1)(q-1)/2)(1 - t^(p+1) - t^(q+1) + t^(p+q))."""
    v = jones(TorusLink(p, q)).value.terms()
    lhs = _mul(v, _poly((0, 1), (2, -1)))
    g = Fraction((p - 1) * (q - 1), 2)
    rhs = _poly((g, 1), (g + p + 1, -1), (g + q + 1, -1), (g + p + q, 1))
    assert lhs == rhs


@pytest.mark.parametrize("p,q", [(2, 3), (3, 5), (4, 7), (5, 12)])
def test_jones_closed_formula_mirror_and_swap(p, q):
    """T(q, p) is the same knot; T(p, -q) is the mirror: V(t) -> V(1/t) (Jones 1987, §11; common practice)."""
    v = jones(TorusLink(p, q)).value.terms()
    assert jones(TorusLink(q, p)).value.terms() == v
    assert jones(TorusLink(p, -q)).value.terms() == {-e: c for e, c in v.items()}
    assert jones(TorusLink(p, q), mirror=True).value.terms() == {-e: c for e, c in v.items()}


# ================================================================ Morton (1995)
def _morton_times_denominator(p: int, q: int, n: int) -> dict:
    """``(q^(1/2) - q^(-1/2)) * W_n(T(p,q))`` with ``W_n`` the unnormalized (unknot = [n]) value.

    Morton (1995), quoted from memory, in the variable ``q`` with ``t = q^-1``::

        (q^(1/2) - q^(-1/2)) W_n = q^(-pq(n^2-1)/4) sum_{j = -(n-1)/2}^{(n-1)/2}
                                   ( q^(pq j^2 + (p+q) j + 1/2) - q^(pq j^2 + (q-p) j - 1/2) )

    Derivation that pins the normalisation (zero framing, unknot = [n]): the Adams operation
    on the n-dimensional SU(2) module is ``psi^p V_n = sum_j V_(2pj+1)`` (signed, with
    ``V_(-m) = -V_m``), from ``chi_n(x^p)(x - 1/x) = sum_j (x^(2pj+1) - x^-(2pj+1))``; the
    twist of ``V_m`` is ``q^((m^2-1)/4)``; Rosso–Jones then gives
    ``W_n = q^(-pq(n^2-1)/4) sum_j q^(pq j^2 + q j) [2pj+1]``, which is the line above.
    The check ``n = 2`` reproduces Jones's formula (tested below too).
    """
    pref = Fraction(-p * q * (n * n - 1), 4)
    out: dict = {}
    for twice_j in range(-(n - 1), n, 2):
        j = Fraction(twice_j, 2)
        base = p * q * j * j + pref
        out = _add(out, _poly((base + (p + q) * j + Fraction(1, 2), 1),
                              (base + (q - p) * j - Fraction(1, 2), -1)))
    return out


MORTON_PAIRS = [(p, q) for (p, q) in _coprime_pairs(2, 9) if p * q <= 40]


@pytest.mark.parametrize("p,q", MORTON_PAIRS)
@pytest.mark.parametrize("n", range(1, 11))
def test_colored_jones_morton(p, q, n):
    """Morton, Math. Proc. Camb. Phil. Soc. 117 (1995): coloured Jones of torus knots, colours 1..10.

    knotobs returns ``J_n(t)`` normalized (unknot = 1) with ``t = q^-1``; multiply by
    ``(q^(n/2) - q^(-n/2))`` = ``(q^(1/2) - q^(-1/2)) [n]`` and compare in ``q``.
    """
    jn = colored_jones(TorusLink(p, q), n).value.terms()
    in_q = {-e: c for e, c in jn.items()}  # t = q^-1
    lhs = _mul(in_q, _poly((Fraction(n, 2), 1), (Fraction(-n, 2), -1)))
    assert lhs == _morton_times_denominator(p, q, n)


@pytest.mark.parametrize("p,q", [(2, 3), (3, 4), (2, 7)])
@pytest.mark.parametrize("n", [3, 6])
def test_colored_jones_morton_unnormalised_and_mirror(p, q, n):
    """Same formula for the unnormalised value, and the mirror T(p,-q) is q -> 1/q."""
    raw = colored_jones(TorusLink(p, q), n, normalized=False).value.terms()
    in_q = {-e: c for e, c in raw.items()}
    assert _mul(in_q, _poly((Fraction(1, 2), 1), (Fraction(-1, 2), -1))) == _morton_times_denominator(p, q, n)
    mir = colored_jones(TorusLink(p, -q), n).value.terms()
    norm = colored_jones(TorusLink(p, q), n).value.terms()
    assert mir == {-e: c for e, c in norm.items()}


def test_morton_reduces_to_jones_formula():
    """Internal consistency of the reference side: Morton at n = 2 equals Jones (1987) times (q - 1/q)."""
    for p, q in _coprime_pairs(2, 9):
        g = Fraction((p - 1) * (q - 1), 2)
        jones_t_times = _poly((g, 1), (g + p + 1, -1), (g + q + 1, -1), (g + p + q, 1))  # V(t)(1 - t^2)
        # (q - 1/q) V = -(t - 1/t) V(t) = t^-1 (1 - t^2) V(t)  with t = q^-1
        in_t = {e - 1: c for e, c in jones_t_times.items()}
        assert {-e: c for e, c in in_t.items()} == _morton_times_denominator(p, q, 2)


@pytest.mark.slow
@pytest.mark.parametrize("p,q", [(p, q) for (p, q) in _coprime_pairs(2, 15) if p * q > 40])
@pytest.mark.parametrize("n", range(1, 16))
def test_colored_jones_morton_slow(p, q, n):
    """Morton (1995), the remaining coprime pairs up to 15 and colours up to 15."""
    jn = colored_jones(TorusLink(p, q), n).value.terms()
    in_q = {-e: c for e, c in jn.items()}
    lhs = _mul(in_q, _poly((Fraction(n, 2), 1), (Fraction(-n, 2), -1)))
    assert lhs == _morton_times_denominator(p, q, n)


# ================================================================ Alexander (classical)
ALEX_PAIRS = _coprime_pairs(2, 15)


@pytest.mark.parametrize("p,q", ALEX_PAIRS)
def test_alexander_classical(p, q):
    """Delta(t) (t^p - 1)(t^q - 1) = +-t^k (t^(pq) - 1)(t - 1) (classical; Rolfsen 1976, Lickorish 1997).

    knotobs' Delta is Conway-normalized (symmetric, Delta(1) = 1), which fixes the unit: the
    shift is ``k = -(p-1)(q-1)/2`` and the sign ``+1``.
    """
    d = alexander(TorusLink(p, q)).value.terms()
    lhs = _mul(d, _mul(_poly((p, 1), (0, -1)), _poly((q, 1), (0, -1))))
    rhs = _mul(_poly((p * q, 1), (0, -1)), _poly((1, 1), (0, -1)))
    shift = min(lhs) - min(rhs)
    sign = lhs[min(lhs)] // rhs[min(rhs)]
    assert sign in (1, -1)
    assert lhs == {e + shift: sign * c for e, c in rhs.items()}
    # Conway normalisation: symmetric and Delta(1) = 1
    assert d == {-e: c for e, c in d.items()}
    assert sum(d.values()) == 1
    assert shift == Fraction(-(p - 1) * (q - 1), 2) and sign == 1


@pytest.mark.parametrize("p,q", [(2, 3), (3, 4), (5, 7)])
def test_alexander_of_mirror_and_swap(p, q):
    """Delta is insensitive to mirror image and to swapping p, q (classical, common practice)."""
    d = alexander(TorusLink(p, q)).value
    assert alexander(TorusLink(q, p)).value == d
    assert alexander(TorusLink(p, -q)).value == d
    assert alexander(TorusLink(p, q), mirror=True).value == d
