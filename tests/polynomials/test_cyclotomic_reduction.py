"""The smallest cyclotomic field of an exact value, and its printed form.

``Cyclotomic.reduced`` rewrites a number of ``Q(zeta_n)`` in the smallest ``Q(zeta_d)`` holding
it; ``str`` prints a short group-ring form.  Checked against facts from outside the project:
the conductor of a quadratic field is the absolute value of its discriminant, and of a root of
unity its order (common practice in algebraic number theory; L. C. Washington, *Introduction to
Cyclotomic Fields*, 2nd ed., Springer GTM 83 (1997), ch. 2; K. Ireland & M. Rosen, *A Classical
Introduction to Modern Number Theory*, 2nd ed., Springer 1990, ch. 6 and 13), and the
integrality of quantum invariants of integral homology spheres (below).
"""

from __future__ import annotations

import random
import re
from fractions import Fraction

import mpmath
import pytest

import knotobs
from knotobs.polynomials.cyclotomic import CyclotomicField, CyclotomicSurd, sqrt_rational


def _value_of_text(text: str) -> mpmath.mpc:
    """Evaluates a printed cyclotomic number (``-1/3 + 2*z9^4``, ``sqrt(3) * (...)``) from its text."""
    with mpmath.workdps(40):
        expr = re.sub(r"z(\d+)\^(\d+)", r"mpmath.exp(2j*mpmath.pi*\2/\1)", text)
        expr = re.sub(r"z(\d+)", r"mpmath.exp(2j*mpmath.pi/\1)", expr)
        expr = re.sub(r"(\d+)/(\d+)", r"mpmath.mpf(\1)/\2", expr)
        expr = expr.replace("sqrt(", "mpmath.sqrt(")
        return mpmath.mpc(eval(expr, {"mpmath": mpmath}))


def _close(a, b) -> bool:
    return abs(complex(a) - complex(b)) < 1e-12 * max(1.0, abs(complex(b)))


def _expected_conductor(d: int) -> int:
    return d // 2 if d % 4 == 2 else d


@pytest.mark.parametrize("m", [2, 3, 5, 6, 7, 10, 13, 15, 21, 30])
def test_square_roots_reduce_to_the_discriminant_of_their_quadratic_field(m):
    # Q(sqrt m), m squarefree: conductor |disc| = m (m = 1 mod 4) or 4m (common practice;
    # Washington 1997, ch. 2; Ireland & Rosen 1990, ch. 6 and 13)
    r = sqrt_rational(m)
    big = r.to_field(r.conductor * 3 * 7)               # the same number in a much larger field
    red = big.reduced()
    assert red.conductor == (m if m % 4 == 1 else 4 * m)
    assert red == r and red * red == CyclotomicField(1)(m)


@pytest.mark.parametrize("n,j", [(48, 12), (48, 8), (40, 4), (64, 18), (60, 25), (30, 6), (90, 33), (12, 6)])
def test_roots_of_unity_reduce_to_their_order(n, j):
    # zeta_n^j has order n/gcd(n, j); Q(zeta_2m) = Q(zeta_m) for odd m (common practice)
    x = CyclotomicField(n).zeta(j)
    red = x.reduced()
    from math import gcd

    order = n // gcd(n, j)
    assert red.conductor == _expected_conductor(order) or (order <= 2 and red.conductor == 1)
    assert red == x and _close(red.to_mpc(20), mpmath.exp(2j * mpmath.pi * j / n))


@pytest.mark.parametrize("d,n", [(5, 40), (12, 60), (20, 60), (9, 36), (15, 105), (8, 24), (7, 42), (16, 48)])
def test_numbers_of_a_subfield_come_back_to_it_and_print_as_the_same_number(d, n):
    # a random element of Q(zeta_d), written in Q(zeta_n) (d | n), reduces into Q(zeta_d) or a
    # subfield of it, stays the same number, and its printed form evaluates to that number
    rng = random.Random(1000 * d + n)
    F = CyclotomicField(d)
    for _ in range(6):
        x = F.from_group_ring([Fraction(rng.randint(-4, 4), rng.randint(1, 3)) for _ in range(d)])
        big = x.to_field(n)
        red = big.reduced()
        assert d % red.conductor == 0 or (d % 4 == 2 and (d // 2) % red.conductor == 0)
        assert red == x
        assert _close(_value_of_text(str(red)), x.to_mpc(20))
        # the printed form has no more terms than the power basis of the reduced field
        assert str(red).count("z") <= sum(1 for c in red.poly.coeffs()[1:] if c != 0)


def test_a_surd_that_is_a_root_of_unity_prints_as_one():
    # sqrt(3) (-1/3 + 2/3 zeta_6) = (2 zeta_6 - 1)/sqrt(3) = i sqrt(3)/sqrt(3) = i
    x = CyclotomicSurd(Fraction(-1, 3) + Fraction(2, 3) * CyclotomicField(48).zeta(8), 3)
    red = x.reduced()
    assert str(red) == "z4" and red == x
    assert red.radicand == 1 and hasattr(red, "as_cyclotomic")   # still a surd (the result type)


@pytest.mark.parametrize("k,text", [(1, "sqrt(2) * (1/2)"), (2, "1/2"), (4, "sqrt(3) * (1/6)")])
def test_the_sphere_prints_its_s00(k, text):
    # Z_k(S^3) = S_00 = sqrt(2/K) sin(pi/K), K = k + 2 (Witten, Commun. Math. Phys. 121 (1989);
    # common practice): 1/sqrt(2) at k = 1, 1/2 at k = 2, 1/(2 sqrt 3) at k = 4
    z = knotobs.partition_function("S^3", "SU(2)", k)
    assert str(z.exact) == text
    assert _close(_value_of_text(text), z.numeric)


@pytest.mark.parametrize("space,group,levels", [
    ("Sigma(2,3,5)", "SU(2)", (1, 2, 3, 4, 5, 7, 9)),
    ("Sigma(2,3,7)", "SU(2)", (3, 5, 6)),
    ("Sigma(2,3,5)", "SU(3)", (1, 2, 4, 5, 6)),
    ("Sigma(2,3,7)", "SU(3)", (2, 4, 6)),
])
def test_invariants_of_homology_spheres_are_integers_of_the_cyclotomic_field(space, group, levels):
    # For an integral homology sphere, tau_K(M) = Z_k(M)/Z_k(S^3) lies in Z[zeta_K], K = k + N
    # (SU(2): K. Habiro, Invent. Math. 171 (2008) 1-81, the unified invariant in the Habiro ring;
    # all simple Lie algebras: K. Habiro and T. T. Q. Le, Geom. Topol. 20 (2016) -- the latter
    # reference from memory).  Checked on the reduced exact values: the conductor divides K and
    # every printed coefficient is an integer.
    N = int(group[3:-1])
    for k in levels:
        K = k + N
        z = knotobs.partition_function(space, group, k).exact
        s = knotobs.partition_function("S^3", group, k).exact
        tau = (z / s).as_cyclotomic().reduced()
        assert K % tau.conductor == 0, (k, tau.conductor)
        assert all(c.q == 1 for c in tau.poly.coeffs()), (k, str(tau))
        assert "/" not in str(tau)


def test_the_notebook_forms_print_the_same_terms_as_the_text():
    # the LaTeX and sympy forms follow the printed (short) form, and sympy evaluates it to the
    # certified numeric value (sympy is an independent evaluator)
    import sympy

    z = knotobs.partition_function("Sigma(2,3,5)", "SU(3)", 6)
    text = str(z.exact)
    tex = z._repr_latex_()
    text_exps = re.findall(r"z\d+\^?(\d*)", text)
    tex_exps = re.findall(r"\\zeta_\{\d+\}(?:\^\{(\d+)\})?", tex.split("\\approx")[0])
    assert [e or "1" for e in text_exps] == [e or "1" for e in tex_exps]
    assert abs(complex(sympy.N(z.to_sympy(), 30)) - complex(z.numeric)) < 1e-14
