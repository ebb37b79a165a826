"""``Z(S^1 x Sigma_g)`` at complex level: the Verlinde polynomial (docs/continuation_sun.md §18.10).

External references: the Verlinde numbers (E. Verlinde, Nucl. Phys. B300 (1988); E. Witten,
Commun. Math. Phys. 121 (1989)), as listed in issue #9 for SU(2) in genus 2 and 3; the SU(2)
polynomials (K^3 - K)/6 and (K^6 + 10 K^4 - 11 K^2)/180 (D. Zagier, "Elementary aspects of the
Verlinde formula and of the Harder-Narasimhan-Atiyah-Bott formula", 1996; quoted from memory and
checked here against the numbers above); in genus 1 the number of integrable weights (common
practice); knotobs' localisation and surgery routes at levels beyond the interpolation points.
"""

from __future__ import annotations

import math
import subprocess
import sys
from fractions import Fraction

import mpmath
import pytest

from knotobs import continued_partition_function
from knotobs.continuation.cartan import continued_sun_partition_function
from knotobs.continuation.cartan.verlinde import verlinde_degree, verlinde_polynomial
from knotobs.errors import KnotobsError, SizeLimitError
from knotobs.localisation import localisation_partition_function


def _at(coeffs, K):
    return sum(c * K ** i for i, c in enumerate(coeffs))


def test_su2_verlinde_numbers_and_polynomials():
    p2, p3 = verlinde_polynomial(2, 2), verlinde_polynomial(2, 3)
    assert [_at(p2, k + 2) for k in range(1, 7)] == [4, 10, 20, 35, 56, 84]
    assert [_at(p3, k + 2) for k in range(1, 7)] == [8, 36, 120, 329, 784, 1680]
    assert p2 == (0, Fraction(-1, 6), 0, Fraction(1, 6))
    assert p3 == (0, 0, Fraction(-11, 180), 0, Fraction(1, 18), 0, Fraction(1, 180))


@pytest.mark.parametrize("N", [2, 3, 4])
def test_genus_one_counts_the_integrable_weights(N):
    assert [_at(verlinde_polynomial(N, 1), k + N) for k in range(8)] == [math.comb(k + N - 1, N - 1) for k in range(8)]


def test_polynomial_beyond_its_interpolation_points():
    # SU(3), genus 2: degree 8, interpolated from k <= 11; at k = 15 and 20 against the localisation
    # route, and at k = 15 against the surgery route of modular data, sum_lam S_0lam^(-2)
    # (the polynomial is a theorem, not a fit)
    from knotobs.evaluation.seifert_routes import partition_function

    p = verlinde_polynomial(3, 2)
    assert verlinde_degree(3, 2) == 8 == len(p) - 1
    for k in (15, 20):
        loc = localisation_partition_function("M(2; 0)", "SU(3)", k, digits=30).numeric
        assert abs(loc - _at(p, k + 3)) < 1e-20 * abs(loc)
    sur = partition_function("M(2; 0)", "SU(3)", 15, digits=30, route="surgery").numeric
    assert abs(sur - _at(p, 18)) < 1e-20 * abs(sur)


def test_continued_value_at_complex_K():
    K = mpmath.mpc("3.5", "0.2")
    z = continued_partition_function("M(2; 0)", "SU(2)", K=K, digits=30)
    with mpmath.workdps(40):
        want = (K ** 3 - K) / 6
        assert abs(z.numeric - want) < mpmath.mpf(10) ** -30 * abs(want)
    assert z.method == "verlinde" and set(z.sectors) == {0}
    w = continued_sun_partition_function("M(2; 0)", "SU(3)", level=4, digits=30)
    assert w.numeric == 504 and any("integer K" in n for n in w.notes)
    assert continued_sun_partition_function("S^2xS^1", "SU(3)", level="2.5+1i", digits=20).numeric == 1


def test_refusals_name_the_size_and_the_method():
    with pytest.raises(SizeLimitError, match="degree 177"):
        continued_sun_partition_function("M(60; 0)", "SU(2)", level=2)
    with pytest.raises(KnotobsError, match="Verlinde polynomial"):
        continued_sun_partition_function("M(2; 0)", "SU(3)", level=2, method="residues")


def test_cli_without_group_is_su2():
    r = subprocess.run([sys.executable, "-m", "knotobs", "continue", "M(2; 0)", "--level", "1.5+0.2i", "-d", "20"],
                       capture_output=True, text=True)
    assert r.returncode == 0, r.stderr
    assert "Verlinde polynomial" in r.stdout and "6.4925 + 1.1903333333333333333j" in r.stdout
