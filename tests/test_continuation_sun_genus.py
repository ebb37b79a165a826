"""SU(3) ``Z(K)`` with poles of higher order: base genus ``g >= 1`` and four exceptional fibers
(docs/continuation_sun.md §18.9).

External references: the torsion of a Seifert manifold over a genus-``g`` base enters the
localisation formula as ``S_{0 lam}^(2 - 2g - n)`` (Blau–Thompson, JHEP 0605:003 (2006); Rozansky,
Commun. Math. Phys. 178 (1996)); the finite-level values of knotobs' localisation route and of the
cubic convolution route (independent implementations, §10 and §18.6); holomorphy in ``K``
(Cauchy–Riemann, common practice).
"""

from __future__ import annotations

import functools

import mpmath
import pytest
from flint import acb

from knotobs.continuation._num import bits, working_bits
from knotobs.continuation.cartan import continued_sun_partition_function
from knotobs.continuation.cartan.data import CartanData
from knotobs.continuation.cartan.poles import pole_sum_sectors
from knotobs.guard import limits
from knotobs.localisation import localisation_partition_function


def _agree(a, b, dg):
    return abs(mpmath.mpc(a) - mpmath.mpc(b)) <= mpmath.mpf(10) ** (-dg) * max(1, abs(mpmath.mpc(b)))


@functools.lru_cache(maxsize=None)
def _z(space, K, digits):
    with limits(seconds=600):
        return continued_sun_partition_function(space, "SU(3)", K=K, digits=digits)


@pytest.mark.parametrize("space,k", [("M(1; -1; (2,1), (3,1))", 2), ("M(1; -1; (2,1), (3,1))", 3),
                                     ("M(2; -1)", 2), ("M(2; 1; (2,1))", 2), ("M(1; -2; (2,1), (3,1), (5,1))", 2)])
def test_the_genus_sum_is_the_localisation_value(space, k, su3_lattice_sum):
    # the torsion S_0lam^(2-2g-n) (Blau-Thompson 2006) in the Gauss sum of §18.1 (written out in
    # tests/conftest.py): against the weight sum of the localisation route (double precision)
    z = complex(localisation_partition_function(space, "SU(3)", k, digits=15).numeric)
    assert abs(su3_lattice_sum(space, k + 3) - z) < 1e-9 * max(1, abs(z))


@pytest.mark.parametrize("space,ks", [("M(2; -1)", (2, 4)), ("M(1; -1; (2,1), (3,1))", (2,)), ("M(1; -1)", (1, 2)),
                                      ("M(2; 1)", (3,))])
def test_integer_K_equals_the_finite_level_value_to_30_digits(space, ks):
    for k in ks:
        z = _z(space, k + 3, 30)
        ref = localisation_partition_function(space, "SU(3)", k, digits=40).numeric
        assert _agree(z.numeric, ref, 30), (space, k, z.numeric, ref)


def test_integer_K_equals_the_convolution_route():
    # the cubic convolution over the roots (§18.6), a second finite-level route with its own
    # genus factor (-3 K^2)^g
    from knotobs.evaluation.root_convolution import convolution_partition_function

    z = _z("M(1; -1; (2,1), (3,1))", 6, 30).numeric
    assert _agree(z, convolution_partition_function("M(1; -1; (2,1), (3,1))", 3, digits=35).numeric, 30)


def test_holomorphic_in_K_by_the_cauchy_riemann_equations():
    # common practice; |Z| fails the same test
    eps = mpmath.mpf("1e-4")
    k0 = mpmath.mpc(5.5, 0.3)
    f0, fr, fu = (_z("M(2; -1)", k, 12).numeric for k in (k0, k0 + eps, k0 + 1j * eps))
    d_re, d_im = (fr - f0) / eps, (fu - f0) / (1j * eps)
    assert abs(d_re - d_im) < 1e-2 * abs(d_re)
    a_re, a_im = (abs(fr) - abs(f0)) / eps, (abs(fu) - abs(f0)) / (1j * eps)
    assert abs(a_re - a_im) > 0.3 * abs(a_re)


def test_genus_notes_do_not_call_the_sectors_isolated_connections():
    z = _z("M(2; -1)", mpmath.mpc(5.5, 0.3), 12)
    assert any("come in families" in n for n in z.notes)
    assert abs(sum(z.sectors.values()) - z.numeric) < 1e-10 * max(1, abs(z.numeric))


def test_contours_seated_at_the_moved_saddle_keep_the_digits():
    # a behaviour check (no outside reference): on a base of genus 1 the partial fractions give
    # factors e^{i pi a w} with |a| > 1; integrals evaluated on the contour through the Gaussian
    # saddle alone lost about six digits in the balls here (relative radius 1e-28); evaluated on the
    # contour through the saddle moved by -a/(2K) they lose none (3e-34)
    d = CartanData.from_space("M(1; -1; (2,1), (3,1))", 3)
    with working_bits(bits(20)):
        s = pole_sum_sectors(d.big_orders, d.HL, d.L, acb(3.3, 0.1), 20, genus=d.genus)
        tot = sum(s.values(), acb(0))
    assert float(tot.rad()) < 1e-31 * abs(complex(tot.mid()))


@pytest.mark.slow
def test_four_exceptional_fibers_at_integer_K():
    # M(0; -2; (2,1), (2,1), (2,1), (3,1)): four fibers (poles of order up to 5 after partial
    # fractions) and orders sharing a factor (16 cosets, 5 Weyl orbits), against the localisation route
    sp = "M(0; -2; (2,1), (2,1), (2,1), (3,1))"
    z = _z(sp, 5, 20)
    assert _agree(z.numeric, localisation_partition_function(sp, "SU(3)", 2, digits=25).numeric, 20)


@pytest.mark.slow
def test_genus_one_with_three_fibers_at_integer_K():
    # deg = 3 with P = 30: this case lost 50 digits before the contours were seated (PrecisionError)
    sp = "M(1; -1; (2,1), (3,1), (5,1))"
    z = _z(sp, 5, 20)
    assert _agree(z.numeric, localisation_partition_function(sp, "SU(3)", 2, digits=25).numeric, 20)
