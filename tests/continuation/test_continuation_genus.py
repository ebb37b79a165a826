"""SU(2) continuation in K for base genus g >= 1 and for orders sharing a factor, and certified
printing of continued values.

Orders that share a factor: the per-fiber Gauss sums (Jeffrey, Commun. Math. Phys. 147 (1992);
CONVENTIONS §9) no longer combine into one sum by the Chinese remainder theorem; the tuples split
into ``P/lcm`` cosets, each a Lawrence–Rozansky sum with a linear phase (LRData.sectors).

Outside sources:

- R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (the integral + residue
  form); L. Rozansky, Commun. Math. Phys. 178 (1996) 27–60 and S. K. Hansen, Algebr. Geom.
  Topol. 1 (2001) 627–686 (Seifert manifolds of any base genus: the torsion enters to the power
  ``2 - 2g - n``, i.e. ``S_{0 lam}^(-2g)`` more than for g = 0);
- the finite-level value at integer K from the localisation route of knotobs (itself checked
  against Verlinde's numbers and the surgery route, tests/localisation), an independent
  computation: a finite sum over the alcove, no contour;
- holomorphy (Cauchy's integral formula: the value at the centre is the mean over a circle).
"""

from __future__ import annotations

import subprocess
import sys

import mpmath
import pytest

from knotobs.continuation.level import continued_partition_function
from knotobs.evaluation.seifert_routes import partition_function
from knotobs.numerics import working_precision

GENUS = ["M(1; -1; (2,1), (3,1))", "M(1; 1; (2,1))", "M(1; -1; (3,1), (5,2))", "M(2; -1; (2,1))",
         "M(2; 1; (2,1), (3,1))", "M(3; 1; (2,1))", "M(1; -2)"]


@pytest.mark.parametrize("space", GENUS)
@pytest.mark.parametrize("k", [1, 2, 5])
def test_genus_continuation_equals_finite_value(space, k):
    _equals_finite_value(space, k, 30)


def _equals_finite_value(space, k, digits):
    """The continuation at the integer ``K = k + 2`` against the localisation route."""
    a = continued_partition_function(space, K=k + 2, digits=digits).numeric
    b = partition_function(space, "SU(2)", k, digits=digits, route="localisation").numeric
    with working_precision(digits + 15):
        assert abs(a - b) < mpmath.mpf(10) ** (2 - digits) * max(1, abs(b))


def _mean_over_circle_is_centre(space, c, r, n=12):
    """Cauchy: for a holomorphic f, f(c) is the mean of f over a circle around c (the trapezoid rule
    on the circle is exact up to the n-th Taylor coefficient)."""
    centre = continued_partition_function(space, K=c, digits=20).numeric
    with working_precision(30):
        pts = [c + r * mpmath.expjpi(2 * mpmath.mpf(j) / n) for j in range(n)]
    vals = [continued_partition_function(space, K=p, digits=20).numeric for p in pts]
    with working_precision(30):
        assert abs(mpmath.fsum(vals) / n - centre) < mpmath.mpf(10) ** -12 * max(1, abs(centre))


def test_genus_one_is_holomorphic_between_integers():
    _mean_over_circle_is_centre("M(1; -1; (2,1), (3,1))", mpmath.mpc("5.5", "0.3"), mpmath.mpf("0.2"))


def test_integral_route_at_large_level_for_genus_two():
    # K = 3002: Z grows like K^3 here (the Verlinde-type growth of genus 2), the poles of order 2
    # at the integers sit on the saddle of the r = 0 Gaussian
    a = partition_function("M(2; -1; (2,1))", "SU(2)", 3000, digits=25, route="integral").numeric
    b = partition_function("M(2; -1; (2,1))", "SU(2)", 3000, digits=25, route="localisation").numeric
    with working_precision(40):
        assert abs(a - b) < mpmath.mpf(10) ** -22 * max(1, abs(b))


def test_cli_prints_thirty_correct_digits():
    """Regression: certified printing used to round a 30-digit value to double precision."""
    r = subprocess.run([sys.executable, "-m", "knotobs", "continue", "M(1; -1; (2,1), (3,1))", "--level", "3",
                        "--json"], capture_output=True, text=True)
    assert r.returncode == 0, r.stderr
    import json

    got = json.loads(r.stdout)["numeric"]
    exact = partition_function("M(1; -1; (2,1), (3,1))", "SU(2)", 3, digits=35, route="localisation").numeric
    with working_precision(45):
        assert abs(mpmath.mpf(got["re"]) - exact.real) < mpmath.mpf(10) ** -29
        assert abs(mpmath.mpf(got["im"]) - exact.imag) < mpmath.mpf(10) ** -29


def test_genus_stays_refused_where_the_tables_are_genus_zero():
    from knotobs.errors import KnotobsError
    from knotobs.evaluation.lr_integral import LRData

    with pytest.raises(KnotobsError, match="base genus"):
        LRData.from_space("M(1; -1; (2,1), (3,1))")


SHARED = ["M(0; -1; (2,1), (4,1), (6,1))", "M(0; -2; (2,1), (2,1), (3,1))", "M(0; 1; (3,1), (3,1), (3,-2))",
          "M(0; -1; (4,1), (6,1), (9,2))", "M(1; -1; (2,1), (4,1))", "M(0; -1; (2,1), (2,1), (2,1), (3,1))"]


@pytest.mark.parametrize("space", SHARED)
@pytest.mark.parametrize("k", [1, 2, 3, 4, 5, 10])
def test_shared_orders_continuation_equals_finite_value(space, k):
    _equals_finite_value(space, k, 25)


def test_exact_zeros_of_the_shared_order_example_confirmed_by_the_integral_form():
    # M(0; -1; (2,1), (4,1), (6,1)): the surgery route gives exact zeros at k = 1, 3, 5 (issue
    # statement); the integral form, a different computation, must give 0 there and not at k = 2, 4
    for k in (1, 3, 5):
        z = partition_function("M(0; -1; (2,1), (4,1), (6,1))", "SU(2)", k, digits=25, route="integral").numeric
        with working_precision(30):
            assert abs(z) < mpmath.mpf(10) ** -25
    for k in (2, 4):
        z = partition_function("M(0; -1; (2,1), (4,1), (6,1))", "SU(2)", k, digits=25, route="integral").numeric
        assert abs(z) > 0.1


def test_shared_orders_continuation_is_holomorphic():
    _mean_over_circle_is_centre("M(0; -2; (2,1), (2,1), (3,1))", mpmath.mpc("6.5", "0.2"), mpmath.mpf("0.15"))


def test_shared_orders_stay_refused_where_the_tables_need_coprime_orders():
    from knotobs.errors import KnotobsError
    from knotobs.evaluation.lr_integral import LRData

    with pytest.raises(KnotobsError, match="share a factor"):
        LRData.from_space("M(0; -1; (2,1), (4,1), (6,1))")
