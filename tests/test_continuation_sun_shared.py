"""SU(3) ``Z(K)`` when exceptional orders share a factor (docs/continuation_sun.md §18.8).

External references: the finite-level value of the localisation formula (Lawrence–Rozansky
1999 for rank one, Mariño 2005 for the Cartan integrals, Blau–Thompson 2006 for Seifert
manifolds; knotobs' localisation route and the surgery route of modular data are independent
implementations, §10 and §7); holomorphy in ``K`` (Cauchy–Riemann, common practice).  The coset
split of the per-fiber Gauss sums is the rank-two version of the one checked for SU(2) in
CONVENTIONS §9; it is checked here in double precision against the localisation route with code
written out independently of the continuation.
"""

from __future__ import annotations

import functools
import itertools
from fractions import Fraction

import mpmath
import pytest
from flint import acb

from knotobs.continuation._num import bits, working_bits
from knotobs.continuation.cartan import continued_sun_partition_function
from knotobs.continuation.cartan.data import CartanData, Coset
from knotobs.continuation.cartan.poles import pole_sum_sectors
from knotobs.guard import limits
from knotobs.localisation import localisation_partition_function

PRISM = "M(0; -1; (2,1), (2,1), (3,1))"          # orders 2, 2, 3: P = 12, L = 6, H = 4
QUATERNION = "M(0; -1; (2,1), (2,1), (2,1))"     # orders 2, 2, 2: P = 8, L = 2, H = 4
NAMED = "M(0; -1; (2,1), (4,1), (6,1))"          # orders 2, 4, 6: P = 48, L = 12, H = -4


def _agree(a, b, dg):
    return abs(mpmath.mpc(a) - mpmath.mpc(b)) <= mpmath.mpf(10) ** (-dg) * max(1, abs(mpmath.mpc(b)))


@functools.lru_cache(maxsize=None)
def _z(space, K, digits):
    with limits(seconds=300):
        return continued_sun_partition_function(space, "SU(3)", K=K, digits=digits)


# ---------------------------------------------------------------- the coset split itself
@pytest.mark.parametrize("space,k", [(PRISM, 2), (QUATERNION, 3), (NAMED, 1), (NAMED, 2),
                                     ("M(0; 1; (3,1), (3,1), (3,1))", 1)])
def test_the_coset_split_is_the_localisation_value(space, k, su3_lattice_sum):
    # §18.8 written out in numpy (tests/conftest.py) against the weight sum of the localisation route
    z = complex(localisation_partition_function(space, "SU(3)", k, digits=15).numeric)
    assert abs(su3_lattice_sum(space, k + 3) - z) < 1e-9


def test_without_cosets_the_single_sum_is_wrong():
    # the sum of §18.1 over Lambda/PKQ alone (the coprime formula) misses the other cosets: the
    # check above is not vacuous
    d = CartanData.from_space(PRISM, 3)
    co = [c for c in d.cosets() if not any(any(t) for t in c.shifts) and c.lin == (0, 0)]
    assert len(co) == 1 and co[0].weight == 1
    with working_bits(bits(15)):
        s = pole_sum_sectors(d.big_orders, d.HL, d.L, acb(5), 15, cosets=co)
        only = sum(s.values(), acb(0))
    z = localisation_partition_function(PRISM, "SU(3)", 2, digits=15).numeric
    from knotobs.continuation.cartan.data import B_N

    with working_bits(bits(15)):
        val = complex((B_N(d, acb(5)) * only / 25).mid())
    assert abs(val - complex(z)) > 0.1


def test_cosets_up_to_the_weyl_group():
    # (P/L)^2 cosets in all (counted by the weights), and the Weyl-reduced sum equals the sum over
    # every coset, enumerated here directly, at a complex K (not only at integers)
    for space, n in ((PRISM, 4), (QUATERNION, 16), (NAMED, 16)):
        d = CartanData.from_space(space, 3)
        assert sum(c.weight for c in d.cosets()) == n == (d.P // d.L) ** 2
    d = CartanData.from_space(PRISM, 3)
    big = [(p, q) for p, q in d.lr.pq if p > 1]
    every, seen = [], set()
    for tup in itertools.product(*[list(itertools.product(range(p), repeat=2)) for p, _ in big]):
        if tup in seen:
            continue
        for n1, n2 in itertools.product(range(d.L), repeat=2):
            seen.add(tuple(((a + n1) % p, (b + n2) % p) for (a, b), (p, _) in zip(tup, big)))
        c = [sum((Fraction(q * t[i], p) for t, (p, q) in zip(tup, big)), Fraction(0)) % 1 for i in (0, 1)]
        const = sum((Fraction(q * (2 * a * a - 2 * a * b + 2 * b * b), 2 * p) for (a, b), (p, q) in zip(tup, big)),
                    Fraction(0))
        every.append(Coset(tuple((2 * a - b, -a + 2 * b) for a, b in tup), tuple(c), const, 1))
    assert len(every) == 4
    with working_bits(bits(20)):
        K = acb(7.3, 0.2)
        red = sum(pole_sum_sectors(d.big_orders, d.HL, d.L, K, 20, cosets=d.cosets()).values(), acb(0))
        full = sum(pole_sum_sectors(d.big_orders, d.HL, d.L, K, 20, cosets=every).values(), acb(0))
        assert abs(complex((red - full).mid())) < 1e-15 * abs(complex(full.mid()))


# ---------------------------------------------------------------- the continuation
@pytest.mark.parametrize("space,ks", [(PRISM, (2, 4)), (QUATERNION, (3,)), (NAMED, (1,))])
def test_integer_K_equals_the_finite_level_value_to_30_digits(space, ks):
    for k in ks:
        z = _z(space, k + 3, 30)
        ref = localisation_partition_function(space, "SU(3)", k, digits=40).numeric
        assert _agree(z.numeric, ref, 30), (space, k, z.numeric, ref)
        with working_bits(bits(40)):
            assert _agree(sum(z.sectors.values(), mpmath.mpc(0)), z.numeric, 28)


def test_integer_K_equals_the_surgery_route():
    # the second finite-level route: modular data of SU(3)_k and SL(2,Z) words (CONVENTIONS §7)
    from knotobs.evaluation.seifert_routes import partition_function

    z = _z(PRISM, 5, 30).numeric
    ref = partition_function(PRISM, "SU(3)", 2, digits=35, route="surgery").numeric
    assert _agree(z, ref, 30)


def test_reversed_orientation():
    # -M(0; -1; (2,1), (2,1), (3,1)) = M(0; 1; (2,-1), (2,-1), (3,-1)) has H < 0 (the conjugate
    # contours); at integer K against the localisation route
    rev = "M(0; 1; (2,-1), (2,-1), (3,-1))"
    z = _z(rev, 7, 20)
    assert _agree(z.numeric, localisation_partition_function(rev, "SU(3)", 4, digits=25).numeric, 20)


def test_holomorphic_in_K_by_the_cauchy_riemann_equations():
    # f'(K) from a real and from an imaginary step agree for a holomorphic f (common practice);
    # |Z| fails the same test
    eps = mpmath.mpf("1e-4")
    k0 = mpmath.mpc(7.5, 0.4)
    f0, fr, fu = (_z(PRISM, k, 10).numeric for k in (k0, k0 + eps, k0 + 1j * eps))
    d_re, d_im = (fr - f0) / eps, (fu - f0) / (1j * eps)
    assert abs(d_re - d_im) < 1e-2 * abs(d_re)
    a_re, a_im = (abs(fr) - abs(f0)) / eps, (abs(fu) - abs(f0)) / (1j * eps)
    assert abs(a_re - a_im) > 0.3 * abs(a_re)


def test_sectors_contain_the_abelian_flat_connections():
    # the abelian sectors (plane integrals; CS values L |u + c_s|^2/(2 H') - const_s) are among
    # the sectors, and the route names them in its pieces
    z = _z(PRISM, mpmath.mpc(7.5, 0.4), 10)
    assert z.abelian <= set(z.sectors)
    assert z.abelian == {Fraction(0), Fraction(1, 4), Fraction(3, 4)}
    assert abs(z.pieces["integral"] + z.pieces["residues"] - z.numeric) < 1e-9


def test_the_sectors_do_not_depend_on_K():
    # each sector is one holomorphic piece exp(2 pi i K cs) f(K) (§18.9, seating the contours):
    # the set of Chern-Simons values is the same at integer and at complex K.  A version that let
    # the contour's residues move between sectors with K gave 13 sectors at one K and 19 at another
    at_int = set(_z(NAMED, 4, 30).sectors)
    at_cx = set(_z(NAMED, mpmath.mpc(5.5, 0.2), 12).sectors)
    assert at_int == at_cx and len(at_int) == 13


@pytest.mark.slow
def test_named_space_at_two_more_levels():
    # M(0; -1; (2,1), (4,1), (6,1)) at k = 3, 5 (where SU(2) vanishes exactly) to 30 digits
    for k in (3, 5):
        z = _z(NAMED, k + 3, 30)
        assert _agree(z.numeric, localisation_partition_function(NAMED, "SU(3)", k, digits=40).numeric, 30)
