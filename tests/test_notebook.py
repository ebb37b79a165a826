"""Notebook forms of every result type: short repr, ``_repr_latex_`` (in the text order),
``to_sympy`` (exact, no free symbols for cyclotomic values), ``evaluate`` with Python, mpmath
and sympy numbers, ``to_json``.

Outside values: the trefoil's Jones polynomial ``t + t^3 - t^4`` (V. F. R. Jones, Ann. of
Math. 126 (1987) 335) and HOMFLY-PT ``2a^-2 + a^-2 z^2 - a^-4`` (KnotInfo 3_1 with v = 1/a);
``Z_3(Sigma(2,3,5))`` is checked against the sympy form of the exact value, which is an
independent evaluation of the same cyclotomic number; the Poincaré sphere's Chern–Simons
invariants ``-1/120, -49/120`` mod 1 (R. Fintushel, R. Stern, Proc. London Math. Soc. 61
(1990) 109).
"""

from __future__ import annotations

import json
import re

import mpmath
import pytest
import sympy

import knotobs


def test_polynomial_result_forms():
    r = knotobs.jones("T(2,3)")
    assert r.exact_string() == "t + t^3 - t^4"
    assert r._repr_latex_() == "$t + t^{3} - t^{4}$"        # the text order, not sympy's
    t = sympy.Symbol("t")
    assert sympy.expand(r.to_sympy() - (t + t**3 - t**4)) == 0
    assert repr(r).startswith("<PolynomialResult jones of T(2,3)") and len(repr(r)) < 120
    assert r.evaluate(2) == -6 and r.evaluate(sympy.Integer(2)) == -6 and r.evaluate(mpmath.mpf(2)) == -6
    z5 = r.evaluate(sympy.exp(2 * sympy.pi * sympy.I / 5), dps=30)
    exact = sympy.N((t + t**3 - t**4).subs(t, sympy.exp(2 * sympy.pi * sympy.I / 5)), 40)   # sympy, independently
    got = sympy.Float(mpmath.nstr(z5.real, 28), 30) + sympy.I * sympy.Float(mpmath.nstr(z5.imag, 28), 30)
    assert sympy.Abs(got - exact) < 1e-25
    json.dumps(r.to_json())


def test_homfly_evaluate_by_name():
    h = knotobs.homfly("T(2,3)")
    assert h.evaluate(a=2, z=3) == mpmath.mpf(2) / 4 + mpmath.mpf(9) / 4 - mpmath.mpf(1) / 16
    assert h.evaluate(a=sympy.Rational(1, 2), z=mpmath.mpf(1)) == 2 * 4 + 4 - 16
    assert h._repr_latex_() == "$2 a^{-2} + a^{-2} z^{2} - a^{-4}$"
    with pytest.raises(knotobs.KnotobsError):
        h.evaluate(2)
    with pytest.raises(knotobs.KnotobsError):
        h.evaluate(a=2)


def test_latex_order_matches_text_for_long_polynomials():
    r = knotobs.colored_jones("T(3,4)", 5)
    text_exps = re.findall(r"t\^?(-?\d*)", r.exact_string())
    tex_exps = re.findall(r"t(?:\^\{(-?\d+)\})?", r._repr_latex_())
    assert [e or "1" for e in text_exps] == [e or "1" for e in tex_exps]


def test_finite_level_value_forms():
    z = knotobs.partition_function("Sigma(2,3,5)", "SU(2)", 3)
    e = z.to_sympy()
    assert e.free_symbols == set()
    assert abs(complex(sympy.N(e, 30)) - complex(z.numeric)) < 1e-14
    got = sympy.Float(mpmath.nstr(z.numeric.real, 28), 30) + sympy.I * sympy.Float(mpmath.nstr(z.numeric.imag, 28), 30)
    assert sympy.Abs(sympy.N(e, 40) - got) < 1e-26
    tex = z._repr_latex_()
    assert "\\zeta_{20}" in tex and "\\sqrt{10}" in tex and "j" not in tex
    assert repr(z).startswith("<FiniteLevelValue") and "zeta_20" in repr(z)
    assert abs(z.evaluate(50) - z.numeric) < 1e-29
    json.dumps(z.to_json())


def test_rational_finite_values_have_no_root_of_unity():
    z = knotobs.partition_function("S^2xS^1", "SU(2)", 3)      # Z(S^2 x S^1) = 1 (common practice)
    assert z.root_of_unity == "" and z.to_sympy() == 1
    from knotobs.output.finite_text import finite_text

    assert "with z1" not in finite_text(z, "Z")


def test_flat_table_continued_and_comparison_forms():
    t = knotobs.flat_connections("Sigma(2,3,5)")
    assert t.to_sympy() == [0, sympy.Rational(71, 120), sympy.Rational(119, 120)]
    assert "\\frac{71}{120}" in t._repr_latex_() and "3 classes" in repr(t)
    c = knotobs.compare("T(2,3)", "t + t^3 - t^4")
    assert "equal" in repr(c) and "equal" in c._repr_latex_()
    t_ = sympy.Symbol("t")
    assert sympy.expand(c.to_sympy() - (t_ + t_**3 - t_**4)) == 0
    v = knotobs.continued_partition_function("Sigma(2,3,5)", "SU(2)", 3, digits=15)
    z = knotobs.partition_function("Sigma(2,3,5)", "SU(2)", 3)
    assert abs(complex(v.to_sympy()) - complex(z.numeric)) < 1e-12     # integer level: the finite value
    assert v._repr_latex_().startswith("$") and "ContinuedValue" in repr(v)
    json.dumps(v.to_json())


@pytest.mark.parametrize("knot,n", [("T(2,2)", 1), ("T(2,3)", 2), ("T(3,4)", 9), ("T(4,6)", 3), ("T(2,5)", 30)])
def test_fast_text_equals_the_polynomial_printer(knot, n):
    """The one-pass printer of the output layer prints exactly what Laurent.to_string prints
    (rational exponents of links included)."""
    from knotobs.output.notebook import laurent_text

    r = knotobs.colored_jones(knot, n) if n > 1 else knotobs.jones(knot)
    assert laurent_text(r.value, "t") == r.value.to_string("t")
    assert r.exact_string() == r.value.to_string("t")
