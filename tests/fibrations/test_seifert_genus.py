"""Seifert manifolds over a closed orientable surface of genus g >= 1.

Sources: H. Seifert, Acta Math. 60 (1933) 147-238 and P. Orlik, Seifert Manifolds,
LNM 291 (1972) §5.2 (the presentation of pi_1 and hence H_1 = Z^(2g) + H_1 of the genus-0
part); W. D. Neumann & F. Raymond, LNM 664 (1978) (Euler number); P. Scott, Bull. LMS 15
(1983) Table 4.1 (geometries from chi and e).
"""

from fractions import Fraction

import pytest

from knotobs.errors import InvalidSeifertDataError, ParseError
from knotobs.fibrations.seifert import SeifertManifold, parse_space
from knotobs.fibrations.surgery import space_report
from knotobs.output.fibrations_text import space_json, space_text


@pytest.mark.parametrize("g", [1, 2, 3, 7])
def test_product_with_surface(g):
    # S^1 x Sigma_g: H_1 = Z^(2g+1) (Kuenneth; common practice), e = 0, chi = 2 - 2g
    M = parse_space(f"M({g}; 0)")
    assert M.genus == g and M.fibers == () and M.euler == 0
    assert M.homology() == (0,) * (2 * g + 1)
    assert M.betti_number == 2 * g + 1
    assert M.h1_order == 0 and not M.is_rational_homology_sphere
    assert M.orbifold_euler_characteristic == 2 - 2 * g
    assert M.recognise() == f"S^1xSigma_{g}"
    assert M.classify().geometry == ("E^3" if g == 1 else "H^2xR")


def test_circle_bundle_over_torus():
    # Euler number 1 bundle over T^2: the Heisenberg nilmanifold, H_1 = Z^2 + Z/1 (Nil geometry;
    # Scott 1983).  Euler number n: H_1 = Z^2 + Z/|n| (common practice).
    for n in (1, 2, 5):
        M = SeifertManifold(-n, (), genus=1)
        assert M.euler == n
        assert M.homology() == ((n,) if n > 1 else ()) + (0, 0)
        assert M.betti_number == 2
        assert M.classify().geometry == "Nil"


def test_genus_one_with_fibers():
    M = parse_space("M(1; -1; (2,1), (3,1))")
    assert M.genus == 1
    assert M.euler == Fraction(1) - Fraction(1, 2) - Fraction(1, 3)
    # genus-0 part M(0; -1; (2,1), (3,1)) has |H_1| = |2*3*e| = 1, so H_1 = Z^2
    assert M.homology() == (0, 0) and M.betti_number == 2
    assert M.orbifold_euler_characteristic == Fraction(-7, 6)   # 2 - 2 - 1/2 - 2/3
    assert str(M) == "M(1; -1; (2,1), (3,1))"
    # with e = 0 the fibre adds one more free generator
    # (genus-0 part M(0; -1; (2,1), (2,1)) = S^2 x S^1, H_1 = Z)
    Z = parse_space("M(1; -1; (2,1), (2,1))")
    assert Z.euler == 0 and Z.betti_number == 3 and Z.homology() == (0, 0, 0)
    # torsion survives: genus-0 part M(0; -2; 4 x (2,1)) has H_1 = Z/2 + Z/2 + Z
    W = parse_space("M(1; -2; (2,1), (2,1), (2,1), (2,1))")
    assert W.homology() == (2, 2, 0, 0, 0) and W.betti_number == 3


def test_normal_form_and_reversal_keep_genus():
    M = SeifertManifold(0, [(5, -4), (3, 2), (1, 7)], genus=2)
    N = M.normal_form()
    assert N == SeifertManifold(6, ((3, 2), (5, 1)), genus=2)
    assert M.is_equivalent(N)
    assert not N.is_equivalent(SeifertManifold(6, ((3, 2), (5, 1))))
    R = M.reverse()
    assert R.genus == 2 and R.euler == -M.euler
    assert parse_space("-M(2; 1; (2,1))") == SeifertManifold(1, ((2, 1),), 2).reverse()


def test_genus_zero_unchanged():
    M = parse_space("M(0; -1; (2,1), (3,1), (5,1))")
    assert M.genus == 0 and repr(M) == "SeifertManifold(b=-1, fibers=((2, 1), (3, 1), (5, 1)))"
    assert M.recognise() == "Sigma(2,3,5)" and str(M) == "M(0; -1; (2,1), (3,1), (5,1))"
    assert parse_space("M(-1; (2,1), (3,1), (5,1))") == M


@pytest.mark.parametrize("text", ["M(-1; 0)", "M(-2; 0; (2,1))"])
def test_negative_genus_refused(text):
    with pytest.raises(InvalidSeifertDataError) as exc:
        parse_space(text)
    assert "negative" in str(exc.value) and "g >= 0" in str(exc.value)


@pytest.mark.parametrize("text", ["M(n1; 0)", "M(N2; -1; (2,1))"])
def test_non_orientable_base_refused(text):
    with pytest.raises(InvalidSeifertDataError) as exc:
        parse_space(text)
    assert "non-orientable" in str(exc.value)


def test_bad_genus_type():
    with pytest.raises(InvalidSeifertDataError):
        SeifertManifold(0, (), genus=1.5)
    with pytest.raises(ParseError):
        parse_space("M(1; 2; 3)")


def test_linking_numbers_refused_for_genus():
    M = parse_space("M(1; -1; (2,1), (3,1))")
    assert M.linking_form() is None
    with pytest.raises(InvalidSeifertDataError, match="genus"):
        M.fiber_framing
    with pytest.raises(InvalidSeifertDataError, match="genus"):
        M.surgery_presentation()


def test_space_report_text_and_json():
    R = space_report("M(2; 0)")
    text = space_text(R)
    assert "base genus g  2" in text.replace("   ", "  ") or "base genus g" in text
    assert "b_1" in text and "5 (2g + 1, since e = 0)" in text
    js = space_json(R)
    assert js["seifert"] == {"b": 0, "fibers": [], "genus": 2}
    assert js["h1"] == [0, 0, 0, 0, 0] and js["h1_order"] == 0
    assert js["surgery_presentation"] is None
    # genus 0 JSON keeps its keys
    assert "genus" not in space_json(space_report("L(5,1)"))["seifert"]
