"""The ``integral`` route: the SU(2) Gauss sum in its Lawrence–Rozansky integral form at integer K.

Outside sources:

- R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314, §3: the finite Gauss
  sum equals the Gaussian integrals plus residues at every integer ``K``; the direct Gauss sum
  (:mod:`knotobs.evaluation.gauss_sum`, a different computation of the same finite sum) is
  the comparison;
- L. Jeffrey, Commun. Math. Phys. 147 (1992) 563–604: closed formula for SU(2) lens spaces,
  a sum of ``2p`` terms, usable at any level;
- E. Witten, Commun. Math. Phys. 121 (1989) 351–399: ``Z(S^3) = S_00 = sqrt(2/K) sin(pi/K)``.
"""

from __future__ import annotations

import math

import mpmath
import pytest

from knotobs.errors import KnotobsError
from knotobs.evaluation.lr_integral import integral_partition_function
from knotobs.evaluation.seifert_routes import partition_function, route_estimates
from knotobs.numerics import working_precision


@pytest.mark.parametrize("space,k", [(s, k) for s in ("Sigma(2,3,5)", "Sigma(2,3,7)") for k in (1, 3, 15, 398)]
                         + [("M(0; -1; (2,1), (3,1), (5,1), (7,1))", 398), ("M(0; 1; (3,1), (4,-1), (5,2))", 15)])
def test_integral_equals_direct_gauss_sum(space, k):
    a = partition_function(space, "SU(2)", k, digits=25, route="integral")
    b = partition_function(space, "SU(2)", k, digits=25, route="gauss-sum")
    assert a.details["routes"] == ["integral"] and a.exact is None
    with working_precision(40):
        assert abs(a.numeric - b.numeric) < mpmath.mpf(10) ** -23


def test_integral_at_large_level_matches_direct_sum():
    # K = 20002: the direct sum has 2^4 * 2K = 6.4e5 terms, the integral form one Gaussian
    a = partition_function("Sigma(2,3,7)", "SU(2)", 20000, digits=30, route="both")
    assert set(a.details["routes"]) == {"integral", "gauss-sum"}
    assert "30 digits" in a.details["agreement"]


@pytest.mark.parametrize("p,q", [(5, 1), (7, 2), (12, 5)])
@pytest.mark.parametrize("K", [7, 1000003, 10 ** 6])
def test_lens_spaces_at_huge_level_jeffrey(p, q, K, jeffrey):
    z = integral_partition_function(f"L({p},{q})", K - 2, digits=25)
    with working_precision(60):
        assert abs(z.numeric - jeffrey(p, q, K)) < mpmath.mpf(10) ** -23


def test_s3_at_level_one_million_witten():
    K = 10 ** 6
    z = integral_partition_function("S^3", K - 2, digits=30)
    with working_precision(50):
        exact = mpmath.sqrt(mpmath.mpf(2) / K) * mpmath.sin(mpmath.pi / K)
        assert abs(z.numeric - exact) < mpmath.mpf(10) ** -30


def test_auto_keeps_exact_routes_when_cheap_and_goes_integral_when_large():
    small = partition_function("Sigma(2,3,7)", "SU(2)", 10)
    assert small.exact is not None and "integral" not in small.details["routes"]
    big = partition_function("Sigma(2,3,7)", "SU(2)", 10 ** 6 - 2)
    assert big.details["routes"] == ["integral"]
    # the estimate of the direct sum grows with K, that of the integral form does not
    e1 = {e.route: e for e in route_estimates("Sigma(2,3,7)", "SU(2)", 10 ** 4)}
    e2 = {e.route: e for e in route_estimates("Sigma(2,3,7)", "SU(2)", 10 ** 6)}
    assert e2["gauss-sum"].seconds > 50 * e1["gauss-sum"].seconds
    assert e2["integral"].seconds < 3 * e1["integral"].seconds


@pytest.mark.parametrize("space,group,why", [
    ("Sigma(2,3,5)", "SU(3)", "SU(2) only"),
    ("S^2xS^1", "SU(2)", "H = 0"),
])
def test_integral_route_refusals_name_the_reason(space, group, why):
    with pytest.raises(KnotobsError, match=r"integral route \(--route integral\) does not apply") as info:
        partition_function(space, group, 3, route="integral")
    assert why in str(info.value)


def test_integral_route_refuses_exact():
    with pytest.raises(KnotobsError, match="numeric"):
        partition_function("Sigma(2,3,5)", "SU(2)", 3, route="integral", exact=True)


def test_integral_digits_are_certified():
    lo = integral_partition_function("Sigma(2,3,5)", 10 ** 5, digits=15).numeric
    hi = integral_partition_function("Sigma(2,3,5)", 10 ** 5, digits=40).numeric
    with working_precision(50):
        assert abs(lo - hi) < mpmath.mpf(10) ** -15
    assert math.isfinite(float(abs(hi)))
