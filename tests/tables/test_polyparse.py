"""The safe polynomial reader: forms found in papers and tables, and bad input."""

from fractions import Fraction

import pytest

from knotobs.errors import KnotobsError, ParseError
from knotobs.tables.polyparse import parse_polynomial, read_polynomial
from knotobs.tables.sparse import MPoly

F = Fraction


def terms(p):
    return {k: int(c) for k, c in p.terms.items()}


def test_jones_trefoil_plain():
    # V(3_1) = t + t^3 - t^4: V. F. R. Jones, Bull. AMS 12 (1985) 103 (right-handed trefoil)
    p = parse_polynomial("t + t^3 - t^4")
    assert p.variables == ("t",)
    assert terms(p) == {(1,): 1, (3,): 1, (4,): -1}


@pytest.mark.parametrize("text", ["t+ t^3-t^4", "t + t**3 - t**4", "t + t^(3) - t^(+4)", "1*t + 1t^3 - t^4",
                                  "t\u2212t^4+t^3", "(t + t^3) - t^4", "t*(1 + t^2 - t^3)"])
def test_equivalent_spellings(text):
    assert parse_polynomial(text) == parse_polynomial("t + t^3 - t^4")


def test_knotinfo_link_strings():
    # strings exactly as stored in database-knotinfo (C. Livingston, A. H. Moore, LinkInfo), L2a1{1}, L6n1
    p = parse_polynomial("v/z-v^3/z + v*z")
    assert p.variables == ("v", "z")
    assert terms(p) == {(1, -1): 1, (3, -1): -1, (1, 1): 1}
    q = parse_polynomial("2/x^12 + x^(-8) + x^(-4)")
    assert terms(q) == {(-12,): 2, (-8,): 1, (-4,): 1}
    r = parse_polynomial("1/(v^8*z^2)-2/(v^6*z^2) + (4*z^2)/v^4 + z^(-2)")
    assert r.terms[(F(-8), F(-2))] == 1 and r.terms[(F(-4), F(2))] == 4 and r.terms[(F(0), F(-2))] == 1


def test_half_integer_and_products():
    p = parse_polynomial("2*t^(1/2) - t^(-3/2)")
    assert terms(p) == {(F(1, 2),): 2, (F(-3, 2),): -1}
    h = parse_polynomial("a^-2*z^2 + 2*a^-2 - a^-4")
    assert h.variables == ("a", "z") and len(h.terms) == 3
    assert parse_polynomial("(1 + t)^2") == parse_polynomial("1 + 2t + t^2")


@pytest.mark.parametrize("bad", ["t + ", "t + (t", "t ^", "t^t", "2 $ t", "", "   ", "t/(1+t)", "(1+t)^(1/2)",
                                 "(1+t)^-1", "(2t)^(1/2)", "t^(1/0)" ])
def test_malformed_is_a_clear_error(bad):
    with pytest.raises((ParseError, ZeroDivisionError, KnotobsError)) as exc:
        parse_polynomial(bad)
    assert isinstance(exc.value, KnotobsError)
    assert "polynomial" in str(exc.value) or "exponent" in str(exc.value)


def test_unknown_variable_is_named():
    with pytest.raises(ParseError, match="unknown variable 'y'") as exc:
        parse_polynomial("t + y^2")
    assert "use t, x, q, s, a, v, z" in str(exc.value)
    with pytest.raises(ParseError, match="unknown variable '__import__'"):
        parse_polynomial("__import__")
    with pytest.raises(ParseError, match="unknown variable 't'"):
        parse_polynomial("t + 1", variables=["q"])


def test_no_python_evaluation():
    # dunder tricks are plain unknown identifiers, attribute access is a syntax error
    for text in ["().__class__", "open('x')", "t.real", "lambda: 1", "[t]"]:
        with pytest.raises(ParseError):
            parse_polynomial(text)


def test_read_from_file(tmp_path):
    f = tmp_path / "p.txt"
    f.write_text("t + t^3\n - t^4\n")
    assert read_polynomial("@" + str(f)) == parse_polynomial("t + t^3 - t^4")
    with pytest.raises(ParseError, match="cannot read polynomial file"):
        read_polynomial("@" + str(tmp_path / "missing.txt"))


def test_mpoly_substitution_and_mirror():
    t = MPoly.var("t")
    p = t + t**3 - t**4
    assert p.substitute({"t": ("t", -1, 1)}) == parse_polynomial("t^-1 + t^-3 - t^-4")
    assert parse_polynomial("z + z^3").substitute({"z": ("z", 1, -1)}) == parse_polynomial("-z - z^3")
