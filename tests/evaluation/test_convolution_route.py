"""The SU(3) convolution route (knotobs.evaluation.root_convolution, docs/continuation_sun.md §18.6).

Sources of the checks:

* the localisation route (L. Rozansky, Commun. Math. Phys. 178 (1996) 27-60; S. K. Hansen &
  T. Takata, arXiv math/0209403; M. Blau & G. Thompson, JHEP 0605:003 (2006)), exact cyclotomic
  values, itself checked against the modular data;
* the surgery route (modular data and SL(2,Z) words, Reshetikhin-Turaev; CONVENTIONS §7);
* S^3: Z = S_00 = (3 K^2)^(-1/2) 8 sin(pi/K)^2 sin(2 pi/K) (Kac-Peterson; common practice);
* lens spaces at large level: the closed-form Gaussian integrals of §18.2-18.3 (a separate
  implementation: no Fourier transform, no weight lattice);
* orientation reversal: Z(-M) = conj Z(M) (common practice).
"""

from __future__ import annotations

import mpmath
import pytest

from knotobs.errors import InvalidSeifertDataError, KnotobsError, SizeLimitError
from knotobs.evaluation.root_convolution import convolution_partition_function
from knotobs.evaluation.seifert_routes import partition_function, route_estimates
from knotobs.localisation import localisation_partition_function
from knotobs.numerics import working_precision


def _close(a, b, digits):
    with working_precision(digits + 10):
        return abs(mpmath.mpc(a) - mpmath.mpc(b)) <= mpmath.mpf(10) ** (-digits) * max(abs(mpmath.mpc(b)), 1)


@pytest.mark.parametrize("space,ks", [
    ("Sigma(2,3,5)", (1, 2, 3, 5)), ("-Sigma(2,3,5)", (2, 4)), ("Sigma(2,3,7)", (1, 3)),
    ("M(0; -2; (2,1), (3,2), (5,4))", (2,)), ("M(0; -1; (2,1), (3,1), (5,1), (7,1))", (2,)),
    ("L(5,1)", (1, 2, 6)), ("L(7,2)", (3,)), ("S^3", (4,)), ("M(0; 1; (2,1), (3,1))", (2,)),
    ("M(1; -1; (2,1), (3,1))", (2,)), ("M(2; -1)", (2,)), ("M(1; -2)", (3,)),
    ("M(1; -1; (2,1), (3,1), (5,1))", (1,)),
])
def test_equals_the_localisation_route_to_30_digits(space, ks):
    for k in ks:
        a = convolution_partition_function(space, k, digits=30).numeric
        b = localisation_partition_function(space, "SU(3)", k, digits=40).numeric
        assert _close(a, b, 30), (space, k, a, b)


def test_equals_the_surgery_route():
    for space, k in (("Sigma(2,3,5)", 4), ("Sigma(2,3,7)", 2), ("M(0; -1; (2,1), (3,1), (5,1), (7,1))", 1)):
        a = convolution_partition_function(space, k, digits=30).numeric
        b = partition_function(space, "SU(3)", k, digits=35, route="surgery").numeric
        assert _close(a, b, 30), (space, k)


def test_S3_at_level_ten_thousand_is_S00():
    K = 10003
    with working_precision(50):
        s00 = 8 * mpmath.sin(mpmath.pi / K) ** 2 * mpmath.sin(2 * mpmath.pi / K) / mpmath.sqrt(3 * K * K)
    z = convolution_partition_function("S^3", K - 3, digits=30).numeric
    assert _close(z, s00, 30)


def test_lens_space_at_level_500_equals_the_gaussian_closed_form():
    from knotobs.continuation.cartan import continued_sun_Z

    z = convolution_partition_function("L(5,1)", 500, digits=25).numeric
    assert _close(z, continued_sun_Z("L(5,1)", 503, "SU(3)", 30), 25)


def test_orientation_reversal_at_level_200():
    a = convolution_partition_function("Sigma(2,3,5)", 200, digits=25).numeric
    b = convolution_partition_function("-Sigma(2,3,5)", 200, digits=25).numeric
    with working_precision(40):
        assert _close(a, mpmath.conj(b), 25)


def test_auto_takes_it_where_it_is_cheaper_and_keeps_the_exact_route_where_that_is_cheap():
    big = partition_function("Sigma(2,3,5)", "SU(3)", 400, digits=20)
    assert big.details["routes"] == ["convolution"] and big.exact is None
    small = partition_function("Sigma(2,3,5)", "SU(3)", 5, digits=20)
    assert small.details["routes"] != ["convolution"] and small.exact is not None


def test_refusals_name_the_reason():
    with pytest.raises(InvalidSeifertDataError, match="share a factor"):
        convolution_partition_function("M(0; -1; (2,1), (4,1), (6,1))", 3)
    with pytest.raises(InvalidSeifertDataError, match="e != 0"):
        convolution_partition_function("M(1; 0)", 3)
    with pytest.raises(SizeLimitError, match="length"):
        convolution_partition_function("Sigma(2,3,5)", 10 ** 6)
    with pytest.raises(KnotobsError, match="SU\\(3\\) only"):
        partition_function("Sigma(2,3,5)", "SU(4)", 2, route="convolution")
    est = {e.route: e for e in route_estimates("Sigma(2,3,5)", "SU(3)", 40, exact=True)}
    assert not est["convolution"].applicable and "numeric" in est["convolution"].reason
