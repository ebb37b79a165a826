"""SU(3) ``Z(K)`` with poles: three exceptional orders (docs/continuation_sun.md §18.7).

External references: the finite-level value of the localisation formula (Lawrence–Rozansky
1999 for rank one, Mariño 2005 for the Cartan integrals; knotobs' localisation and convolution
routes are independent implementations of it, §10 and §18.6); the Chern–Simons values of the
flat SU(2) connections on the Poincaré sphere (Fintushel–Stern 1990); holomorphy in K (Cauchy's
integral formula).
"""

from __future__ import annotations

import cmath
import functools
import math
import random
from fractions import Fraction

import mpmath
import pytest

from knotobs.continuation.cartan import continued_sun_partition_function
from knotobs.continuation.cartan.poles import merged_terms, partial_fraction_terms
from knotobs.evaluation.root_convolution import convolution_partition_function
from knotobs.guard import limits
from knotobs.localisation import localisation_partition_function


def _S(y: complex) -> complex:
    return 2j * cmath.sin(cmath.pi * y)


def _root_fn(f, y: complex) -> complex:
    v = sum(c * cmath.exp(1j * cmath.pi * float(a) * y) for c, a in f.exps)
    for p, e in f.sines:
        v *= _S(y / p) ** e
    return v


@pytest.mark.parametrize("orders", [(2, 3, 5), (2, 3, 7), (2, 3, 5, 7)])
def test_partial_fractions_reproduce_the_sine_ratio(orders):
    # prod_j Delta(x/p_j) / Delta(x)^(n-2), Delta(x) = S(x_1) S(x_2) S(x_1 + x_2): an algebraic
    # identity (the Weyl denominator of SU(3) in the simple-root coordinates, common practice)
    rnd = random.Random(5)
    n = len(orders)
    terms = partial_fraction_terms(orders)
    merged = merged_terms(orders)
    for _ in range(5):
        x1 = complex(rnd.uniform(-2, 2), rnd.uniform(-0.5, 0.5))
        x2 = complex(rnd.uniform(-2, 2), rnd.uniform(-0.5, 0.5))
        num = 1
        for p in orders:
            num *= _S(x1 / p) * _S(x2 / p) * _S((x1 + x2) / p)
        want = num / (_S(x1) * _S(x2) * _S(x1 + x2)) ** (n - 2)
        got = 0
        for t in terms:
            u = t.basis[0][0] * x1 + t.basis[0][1] * x2
            w = t.basis[1][0] * x1 + t.basis[1][1] * x2
            got += _root_fn(t.A, u) * _root_fn(t.B, w) * _root_fn(t.C, u + w)
        assert abs(got - want) < 1e-9 * max(1, abs(want))
        # the merged terms: B carries both exponentials, evaluated in the first term's coordinates
        # (the sums of §18.7 use only the box and the pole lines, common to both)
        u, w = x1, x2
        got = sum(_root_fn(t.A, u) * _root_fn(t.B, w) * _root_fn(t.C, u + w) for t in merged)
        assert abs(got - sum(_root_fn(t.A, u) * _root_fn(t.B, w) * _root_fn(t.C, u + w) for t in terms)) \
            < 1e-9 * max(1, abs(want))
    # every term has poles on two root families only
    assert all(not any(e < 0 for _, e in t.C.sines) for t in terms)


def _agree(a, b, dg):
    return abs(a - b) <= mpmath.mpf(10) ** (-dg) * max(1, abs(b))


@functools.lru_cache(maxsize=None)
def _z(K, digits: int, phases: str = "reduced", space: str = "Sigma(2,3,5)"):
    """One continued value (shared between the tests below: each costs about ten seconds)."""
    with limits(seconds=300):
        return continued_sun_partition_function(space, "SU(3)", K=K, digits=digits, phases=phases)


def test_sigma235_at_integer_K_equals_the_finite_level_value_to_30_digits():
    # Z_k(Sigma(2,3,5)) for SU(3), k = 9: the localisation formula (Marino 2005; §10), evaluated
    # by the cubic convolution (§18.6) and by the weight sum of the localisation route
    z = _z(12, 30)
    conv = convolution_partition_function("Sigma(2,3,5)", 9, digits=35).numeric
    loc = localisation_partition_function("Sigma(2,3,5)", "SU(3)", 9, digits=35).numeric
    assert _agree(z.numeric, conv, 30) and _agree(z.numeric, loc, 30)
    assert z.method == "residues"
    assert any("integer K" in n for n in z.notes)


def test_sectors_are_the_flat_connections_of_the_poincare_sphere():
    # pi_1(Sigma(2,3,5)) is the binary icosahedral group; its SU(3) representations are the
    # trivial one, the two SU(2) ones plus a trivial line (CS = -1/120, -49/120 mod 1:
    # Fintushel-Stern, Proc. London Math. Soc. 61 (1990) 109-137) and the two 3-dimensional
    # irreducibles, which factor through SO(3) and are the adjoints of the SU(2) ones, so their
    # CS is 4 times (Dynkin index 4 of the principal embedding; the list of irreducible
    # dimensions 1,2,2,3,3,4,4,5,6 is from memory).  Every other group of pieces cancels.
    z = _z(mpmath.mpc(10.5, 0.3), 10)
    su2 = [Fraction(-1, 120), Fraction(-49, 120)]
    want = {Fraction(0)} | {c % 1 for c in su2} | {(4 * c) % 1 for c in su2}
    assert set(z.sectors) == want
    assert abs(sum(z.sectors.values()) - z.numeric) < 1e-8
    assert z.pieces["integral"] == z.sectors[Fraction(0)]


def test_reversed_orientation_at_integer_K():
    # -Sigma(2,3,5) (H < 0: the contours of the conjugate level), against the localisation route
    z = _z(10, 20, space="-Sigma(2,3,5)")
    loc = localisation_partition_function("-Sigma(2,3,5)", "SU(3)", 7, digits=25).numeric
    assert _agree(z.numeric, loc, 20)


def test_holomorphic_in_K_by_the_cauchy_riemann_equations():
    # f'(K) from a real and from an imaginary step must agree for a holomorphic f (common
    # practice); |Z| (not holomorphic) fails the same test.  The Cauchy-integral form is the
    # slow test below.
    eps = mpmath.mpf("1e-4")
    k0 = mpmath.mpc(10.5, 0.3)
    f0, fr, fu = _z(k0, 10).numeric, _z(k0 + eps, 10).numeric, _z(k0 + 1j * eps, 10).numeric
    d_re, d_im = (fr - f0) / eps, (fu - f0) / (1j * eps)
    assert abs(d_re - d_im) < 1e-2 * abs(d_re)
    a_re, a_im = (abs(fr) - abs(f0)) / eps, (abs(fu) - abs(f0)) / (1j * eps)
    assert abs(a_re - a_im) > 0.3 * abs(a_re)


def test_far_from_the_real_axis_the_digits_are_confirmed_and_z_is_holomorphic():
    # at K = 3 - 5i the sectors differ in size by exp(2 pi |Im K| |phi|) ~ 10^6 and Z is large;
    # the route adds guard digits for that (without them 30 digits were not confirmed), and the
    # Cauchy-Riemann equations hold there too (common practice)
    k0 = mpmath.mpc(3, -5)
    z = _z(k0, 30)
    assert abs(z.numeric) > 1e6
    eps = mpmath.mpf("1e-4")
    f0, fr, fu = _z(k0, 10).numeric, _z(k0 + eps, 10).numeric, _z(k0 + 1j * eps, 10).numeric
    d_re, d_im = (fr - f0) / eps, (fu - f0) / (1j * eps)
    assert abs(d_re - d_im) < 1e-2 * abs(d_re)
    assert _agree(f0, z.numeric, 10)


def test_near_K_zero_the_precision_follows_the_size_of_the_integrands():
    # at K = 1 + 0.5i the Gaussian is wide (b = 2 |K|/90) and the integrands reach ~10^50 along the
    # lines while Z ~ 10^-6; the route raises the working precision by that range (before, the two
    # runs lost every digit and the value was refused).  Two precisions agree to their digits and
    # the Cauchy-Riemann equations hold (common practice)
    k0 = mpmath.mpc(1, 0.5)
    z30, z20 = _z(k0, 30).numeric, _z(k0, 20).numeric
    assert 1e-8 < abs(z30) < 1e-5
    assert abs(z20 - z30) < 1e-20
    eps = mpmath.mpf("1e-4")
    f0, fr, fu = _z(k0, 16).numeric, _z(k0 + eps, 16).numeric, _z(k0 + 1j * eps, 16).numeric
    d_re, d_im = (fr - f0) / eps, (fu - f0) / (1j * eps)
    assert abs(d_re - d_im) < 1e-2 * abs(d_re)


def test_contours_near_the_real_axis_take_the_step_from_the_growth_across_them():
    # K = 0.6 - 0.5i: the contours lie at about 25 degrees to the real axis; the aliasing bound of
    # the trapezoid rule moves a contour across itself, where the sines grow like |cos theta|, not
    # |sin theta| (with the latter, runs of 13 and 30 digits differed at 10^-2 and the value was
    # refused).  Two precisions agree and the Cauchy-Riemann equations hold (common practice)
    k0 = mpmath.mpc(0.6, -0.5)
    z16, z10 = _z(k0, 16).numeric, _z(k0, 10).numeric
    assert abs(z16) > 1e10
    assert abs(z10 - z16) < 1e-9 * abs(z16)
    eps = mpmath.mpf("1e-4")
    fr, fu = _z(k0 + eps, 10).numeric, _z(k0 + 1j * eps, 10).numeric
    d_re, d_im = (fr - z10) / eps, (fu - z10) / (1j * eps)
    assert abs(d_re - d_im) < 1e-2 * abs(d_re)


@pytest.mark.slow
def test_holomorphic_between_integers_by_cauchys_integral_formula():
    # the mean of a holomorphic function over a circle is its value at the centre, and its contour
    # integral vanishes (Cauchy; the trapezoid rule on the circle converges geometrically);
    # |Z| fails the same test
    n, rad = 12, mpmath.mpf("0.3")
    k0 = mpmath.mpc(10.5, 0.3)
    pts = [k0 + rad * mpmath.expjpi(mpmath.mpf(2 * j) / n) for j in range(n)]
    vals = [_z(p, 10).numeric for p in pts]
    centre = _z(k0, 10).numeric
    mean = sum(vals) / n
    loop = sum(v * (p - k0) for v, p in zip(vals, pts)) / n        # (1/2 pi i) int Z dK
    assert abs(mean - centre) < 1e-8 * abs(centre)
    assert abs(loop) < 1e-8 * abs(centre)
    assert abs(sum(abs(v) for v in vals) / n - abs(centre)) > 1e-4 * abs(centre)


def test_reduced_phases_change_the_continuation_but_not_the_integer_values():
    # Carlson's theorem: the reduced phases give the continuation of least exponential type; the
    # Lawrence-Rozansky phases agree at every integer K and differ in between
    assert _agree(_z(12, 12, "lawrence-rozansky").numeric, _z(12, 30).numeric, 12)
    k0 = mpmath.mpc(10.5, 0.3)
    assert abs(_z(k0, 10, "lawrence-rozansky").numeric - _z(k0, 10).numeric) > 1e-3


@pytest.mark.slow
def test_sigma237_at_integer_K():
    with limits(seconds=900):
        z = continued_sun_partition_function("Sigma(2,3,7)", "SU(3)", K=9, digits=20)
    conv = convolution_partition_function("Sigma(2,3,7)", 6, digits=25).numeric
    assert _agree(z.numeric, conv, 20)


@pytest.mark.slow
def test_plane_by_the_corrected_rule_equals_the_plain_trapezoid_rule():
    from flint import acb

    from knotobs.continuation._num import bits, working_bits
    from knotobs.continuation.cartan.poles import pole_sum_sectors

    with working_bits(bits(15)):
        a = sum(pole_sum_sectors((2, 3, 5), 1, 30, acb(11.5, 0.2), 15).values(), acb(0))
        b = sum(pole_sum_sectors((2, 3, 5), 1, 30, acb(11.5, 0.2), 15, fine_plane=True).values(), acb(0))
        assert abs(complex((a - b).mid())) < 1e-14 * max(1, abs(complex(a.mid())))


def test_grid_kernels_equal_the_generic_loop(monkeypatch):
    # the written-out grid loops (rootfn._value_kernel, _taylor_kernel) against the generic loop
    # they replace (an internal check: the same products in another order), values and Taylor
    # coefficients, with shifts, several exponentials and poles
    from flint import acb

    from knotobs.continuation._num import bits, working_bits
    from knotobs.continuation.cartan import rootfn
    from knotobs.continuation.cartan.rootfn import RootFunction

    fs = [(RootFunction(1, Fraction(0), ((2, 1), (3, 1), (5, 1), (1, -2))), 1),
          (RootFunction(-3, Fraction(1), ((2, 1), (3, 1), (1, -1)), ((1, Fraction(-1)),), (1, 0, 0)), 1),
          (RootFunction(1, Fraction(0), ((2, 1), (3, 1), (5, 1))), 2),
          (RootFunction(-1, Fraction(1, 2), ((2, 2), (3, 1)), (), (1, 2)), 3)]
    with working_bits(bits(20)):
        sc = rootfn.Scale(acb(9.5, 0.3), acb(0.1, 0.003))
        for f, L in fs:
            fast = rootfn.grid_series(f, acb(0.5), acb(0.2, -0.15), 70, Fraction(2, 3), L, sc)
            with monkeypatch.context() as m:
                m.setattr(rootfn, "_value_kernel", lambda *a: None)
                m.setattr(rootfn, "_taylor_kernel", lambda *a: None)
                slow = rootfn.grid_series(f, acb(0.5), acb(0.2, -0.15), 70, Fraction(2, 3), L, sc)
            assert len(fast) == len(slow) == 141
            for x, y in zip(fast, slow):
                for a, b in zip(x, y):
                    assert abs(complex((a - b).mid())) <= 1e-25 * max(1.0, abs(complex(b.mid())))


def test_grids_moved_by_a_period_equal_the_direct_grids():
    # rootfn.shifted_grid derives the grid at y0 + n with Fourier index s from the grid at y0 with
    # index 0, by the quasi-periodicity of the sine product (2i sin(pi (y + n)/p) = (-1)^(n/p)
    # 2i sin(pi y/p) when p | n, a fact of the trade) and of the Gaussian; an internal check
    # against grid_series computed directly at y0 + n, for the factors of the Sigma(2,3,5) pole
    # route and for shifted sines, fractional s, several exponentials, negative n and step
    from flint import acb

    from knotobs.continuation._num import bits, working_bits
    from knotobs.continuation.cartan import rootfn
    from knotobs.continuation.cartan.data import CartanData
    from knotobs.continuation.cartan.poles import merged_terms
    from knotobs.continuation.cartan.rootfn import RootFunction, period_phase

    fs = [getattr(t, w) for t in merged_terms((2, 3, 5)) for w in "ABC"]
    for co in CartanData.from_space("M(0; -1; (2,1), (4,1), (6,1))", 3).cosets()[1:3]:   # shifted sines
        fs += [getattr(t, w) for t in merged_terms((2, 4, 6), co.shifts, co.lin, 1) for w in "ABC"]
    fs += [RootFunction(-3, Fraction(1), ((2, 1), (3, 1), (1, -1)), ((1, Fraction(-5)),), (1, 0, 0)),
           RootFunction(-1, Fraction(1, 2), ((2, 2), (3, 1)), (), (1, 2))]
    assert period_phase(RootFunction(1, Fraction(1, 2), ((2, 1),), ((1, Fraction(0)),)), 2) is None
    checked = 0
    with working_bits(bits(20)):
        sc = rootfn.Scale(acb(9.5, 0.3), acb(0.1, 0.003))
        for i, f in enumerate(fs):
            per = math.lcm(*(p for p, _ in f.sines)) if f.sines else 1
            assert period_phase(f, per) is not None
            L, s = 1 if f.extra or f.pole_order else 1 + i % 3, (Fraction(2, 3), 0, -2, Fraction(1, 5))[i % 4]
            for n, sign in ((per, 1), (-per, -1), (2 * per, -1)):
                y0, st = acb(0.5), sign * acb(0.1, -0.06)
                base = rootfn.grid_series(f, y0, st, 30, 0, L, sc)
                moved = rootfn.shifted_grid(base, y0, n, st, 30, s, period_phase(f, n), L, sc)
                direct = rootfn.grid_series(f, y0 + n, st, 30, s, L, sc)
                assert len(moved) == len(direct) == 61
                for col in range(L):                   # errors against the size of the grid
                    size = max(abs(complex(y[col].mid())) for y in direct)
                    for x, y in zip(moved, direct):
                        a, b = x[col], y[col]
                        assert b.rad() < 1e-30 * size    # the reference itself is sharp
                        assert abs(complex((a - b).mid())) <= 1e-25 * size
                        assert a.overlaps(b)
                checked += 1
    assert checked == 3 * len(fs)


def _pole_factors():
    """The factors A, B, C of the pole route: coprime orders, four orders, and a coset with
    shifted sines and a linear phase (orders sharing a factor)."""
    from knotobs.continuation.cartan.data import CartanData

    fs = [getattr(t, w) for orders in ((2, 3, 5), (2, 3, 7), (2, 3, 5, 7)) for t in merged_terms(orders)
          for w in "ABC"]
    for co in CartanData.from_space("M(0; -1; (2,1), (4,1), (6,1))", 3).cosets()[1:3]:
        fs += [getattr(t, w) for t in merged_terms((2, 4, 6), co.shifts, co.lin, 1) for w in "ABC"]
    return fs


def test_reflection_sign_is_the_parity_of_the_factor():
    # rootfn.reflection_sign: f(-y) = eps f(y) for the sines and exponentials of a factor
    # (2i sin is odd, a fact of the trade); checked by evaluating f at random complex y.  None
    # claims nothing (shifted sines are not examined); the two factors added here are neither
    # even nor odd
    from knotobs.continuation.cartan.rootfn import RootFunction, reflection_sign

    rnd = random.Random(11)
    odd = [RootFunction(1, Fraction(1), ((2, 1),)),
           RootFunction(2, Fraction(1, 2), ((3, 1), (1, -1)), ((1, Fraction(-1, 2)),))]
    seen = set()
    for f in _pole_factors() + odd:
        eps = reflection_sign(f)
        seen.add(eps)
        for _ in range(4):
            y = complex(rnd.uniform(-3, 3), rnd.uniform(-0.4, 0.4))
            a, b = _root_fn_shifted(f, -y), _root_fn_shifted(f, y)
            if f in odd:
                assert eps is None
                assert abs(a - b) > 1e-6 * abs(b) and abs(a + b) > 1e-6 * abs(b)
            elif eps is not None:
                assert abs(a - eps * b) < 1e-9 * max(1, abs(b))
    assert seen == {1, -1, None}


def _root_fn_shifted(f, y: complex) -> complex:
    v = sum(c * cmath.exp(1j * cmath.pi * float(a) * y) for c, a in f.exps)
    for p, e, t in f.shifted_sines:
        v *= _S((y + t) / p) ** e
    return v


def _evaluators():
    from flint import acb

    from knotobs.continuation.cartan.data import CartanData
    from knotobs.continuation.cartan.poles import _Eval, _theta

    out = []
    for orders, cos, H, P, K in (((2, 3, 5), None, 1, 30, acb(4.35, 0.2)),
                                 ((2, 3, 7), None, 1, 42, acb(6.5, -0.3)),
                                 ((2, 4, 6), CartanData.from_space("M(0; -1; (2,1), (4,1), (6,1))", 3), None,
                                  None, acb(5.5, 0.25))):
        if cos is not None:
            d = cos
            H, P = d.HL, d.L
            cosets = d.cosets()[1:3]
            if H < 0:                                  # as pole_sum_sectors: conjugate to H > 0
                H, cosets = -H, [c.negated() for c in cosets]
            pairs = [(t, co) for co in cosets for t in merged_terms(orders, co.shifts, co.lin, 1)]
        else:
            pairs = [(t, None) for t in merged_terms(orders)]
        theta = _theta(H, complex(K.mid()))
        for t, co in pairs:
            out.append(_Eval(t, K, H, P, 12, True, theta, phi0=-co.const if co is not None else Fraction(0)))
    return out


def test_line_integrals_from_their_orbit_representatives_equal_the_direct_ones():
    # poles._Eval._dots takes each line integral from the representative of its orbit under the
    # periods of the sines (with the shift of the Fourier index they bring) and the reflection
    # y -> -y (docs/continuation_sun.md §18.7); an internal check against the same integral
    # computed directly at its own contour (_rep_dots called on the original key), for coprime
    # orders and for a coset with shifted sines and a linear phase
    from flint import acb

    from knotobs.continuation._num import bits, working_bits

    rnd = random.Random(3)
    checked = reflected = 0
    with working_bits(bits(25)):
        for ev in _evaluators():
            for _ in range(14):
                fint = rnd.choice("AB")
                m = rnd.randrange(-2 * ev.P, 3 * ev.P)
                s_int = rnd.randrange(0, 2 * ev.H)
                y0 = Fraction(rnd.randrange(-3 * ev.P, 3 * ev.P)) + Fraction(1, 2)
                L = rnd.choice((1, 2, 3))
                rep, ops = ev._orbit(fint, y0, s_int + ev.off[fint], m)
                reflected += any(op[0] == "R" for op in ops)
                got = ev._dots(fint, y0, s_int, m, L)
                want = ev._rep_dots(fint, y0, s_int + ev.off[fint], m, L)
                assert rep != (y0, s_int + ev.off[fint], m) or not ops
                size = max(abs(complex(x.mid())) for x in want[:L])
                for a, b in zip(got[:L], want[:L]):
                    assert abs(complex((a - b).mid())) <= 1e-18 * size
                checked += 1
    assert checked == 14 * len(_evaluators()) and reflected > 5


def test_reversed_and_reflected_base_grids_equal_the_direct_grids():
    # poles._Eval._base: a grid with the step reversed is the same nodes in reverse order, and a
    # factor with f(-y) = eps f(y) beyond half its period is the reflection of the grid at
    # per - y0 moved by the period; an internal check against rootfn.grid_series at y0
    from knotobs.continuation._num import bits, working_bits
    from knotobs.continuation.cartan.rootfn import _q, grid_series

    checked = 0
    with working_bits(bits(25)):
        for ev in _evaluators()[:2]:
            for which, L in (("A", 1), ("B", 1), ("C", 3)):
                per = ev._period[which]
                for y0, sign in ((Fraction(2 * per - 1, 2), 1), (Fraction(per + 3, 2), -1), (Fraction(1, 2), -1)):
                    got = ev._base(which, y0, L, sign, ev.Jl)
                    want = grid_series(getattr(ev.t, which), _q(y0), sign * ev.lstep, ev.Jl, 0, L, ev.sc)
                    assert len(got) == len(want)
                    for col in range(L):
                        size = max(abs(complex(y[col].mid())) for y in want)
                        for x, y in zip(got, want):
                            assert abs(complex((x[col] - y[col]).mid())) <= 1e-18 * size
                    checked += 1
    assert checked == 18


def test_laurent_data_as_polynomials_in_K_equal_the_numeric_ones():
    # rootfn.laurent_in_K: the Laurent data of a factor at an integer are exp(-2 pi i K s m - i pi c m^2)
    # (2 pi i K)^-kernel times polynomials in K (docs/continuation_sun.md §18.7, exact pieces); an
    # internal check against rootfn.laurent at several K, with kernels, Fourier indices, fractional
    # (coset) indices and shifted sines
    from flint import acb, arb

    from knotobs.continuation._num import bits, working_bits
    from knotobs.continuation.cartan.rootfn import RootFunction, Scale, laurent, laurent_in_K, symbolic_scale

    fs = [RootFunction(1, Fraction(1), ((2, 1), (3, 1), (5, 1), (1, -2))),
          RootFunction(-1, Fraction(1, 2), ((2, 1), (4, 1), (1, -1)), ((1, Fraction(-3, 2)),)),
          RootFunction(1, Fraction(0), ((2, 1), (3, 1), (6, 1)), (), (1, 0, 2))]
    checked = 0
    with working_bits(bits(30)):
        ipi = acb(0, 1) * arb.pi()
        for K in (acb(4.35, 0.2), acb(9, 0), acb(-3.1, 2.5)):
            for H, P in ((1, 30), (7, 42)):
                sc = Scale(K, K * H / (3 * P))
                scs = symbolic_scale(H, P)
                for f in fs:
                    for m, s, kernel in ((0, 0, True), (3, 2, False), (-4, Fraction(1, 3), True), (6, 1, False)):
                        v, num = laurent(f, m, s, kernel, 5, sc)
                        w, pol = laurent_in_K(f, m, s, kernel, 5, scs)
                        sq = acb(s.numerator) / s.denominator if isinstance(s, Fraction) else acb(s)
                        ph = (-2 * ipi * K * sq * m - ipi * sc.c * (m * m)).exp()
                        if kernel:
                            ph = ph / (2 * ipi * K)
                        assert v == w
                        for a, b in zip(num, pol):
                            assert (a - ph * b(K)).contains(0) or abs(complex((a - ph * b(K)).mid())) <= \
                                1e-25 * max(abs(complex(a.mid())), 1e-30)
                        checked += 1
    assert checked == 3 * 2 * 3 * 4


@pytest.mark.parametrize("space, K", [("Sigma(2,3,5)", (4.35, 0.2)), ("Sigma(2,3,7)", (6.5, -0.3)),
                                      ("M(0; -1; (2,1), (4,1), (6,1))", (5.5, 0.25)),
                                      ("-Sigma(2,3,5)", (3.9, 0.4)),
                                      ("M(1; -1; (2,1), (3,1))", (4.6, 0.1))])
def test_exact_pieces_and_the_rest_add_up_to_every_piece(space, K):
    # poles.pole_sum_sectors(parts=...): the exact pieces (iterated residues at K-independent points,
    # from cached polynomials in K) plus the rest (quadratures and the residues they move) equal the
    # whole evaluation, label by label; an internal check of the split of docs/continuation_sun.md
    # §18.7 (exact pieces), for coprime orders, a coset with shifts and linear phases (§18.8),
    # H < 0 and base genus 1 (§18.9).  The whole evaluation is itself checked against the
    # finite-level routes at integer K above.
    from flint import acb

    from knotobs.continuation._num import bits, working_bits
    from knotobs.continuation.cartan import poles
    from knotobs.continuation.cartan.data import CartanData

    d = CartanData.from_space(space, 3)
    args = (d.big_orders, d.HL, d.L)
    kw = dict(cosets=d.cosets(), genus=d.genus)
    poles._EXACT.clear()
    with working_bits(bits(25)):
        Ka = acb(*K)
        whole = poles.pole_sum_sectors(*args, Ka, 14, **kw)
        exact = poles.pole_sum_sectors(*args, Ka, 14, **kw, parts="exact")
        again = poles.pole_sum_sectors(*args, Ka, 14, **kw, parts="exact")          # from the cache
        rest = poles.pole_sum_sectors(*args, Ka, 14, **kw, parts="quad")
    assert poles._EXACT and exact and rest
    scale = max(abs(complex(v.mid())) for v in whole.values())
    for phi in set(whole) | set(exact) | set(rest):
        s = exact.get(phi, acb(0)) + rest.get(phi, acb(0))
        w = whole.get(phi, acb(0))
        assert s.overlaps(w) and float(s.rad()) + float(w.rad()) < 1e-10 * scale, (space, phi)
        assert exact.get(phi, acb(0)).overlaps(again.get(phi, acb(0)))


def test_cached_exact_pieces_are_recomputed_for_a_higher_precision():
    # the cache of poles._exact_pieces serves a request only at a precision at or below its own: a
    # finer run after a coarser one gets balls as tight as a fresh computation's
    from flint import acb

    from knotobs.continuation._num import bits, working_bits
    from knotobs.continuation.cartan import poles

    poles._EXACT.clear()
    with working_bits(bits(5)):
        coarse = poles.pole_sum_sectors((2, 3, 5), 1, 30, acb(5.1, 0.2), 5, parts="exact")
    with working_bits(bits(40)):
        fine = poles.pole_sum_sectors((2, 3, 5), 1, 30, acb(5.1, 0.2), 40, parts="exact")
        poles._EXACT.clear()
        fresh = poles.pole_sum_sectors((2, 3, 5), 1, 30, acb(5.1, 0.2), 40, parts="exact")
    worst = max(float(v.rad()) / abs(complex(v.mid())) for v in fine.values() if abs(complex(v.mid())) > 1e-10)
    assert worst < 1e-50
    assert max(float(v.rad()) for v in coarse.values()) > 1e-30
    for phi, v in fine.items():
        assert v.overlaps(fresh[phi]) and v.overlaps(coarse[phi])


def test_odd_third_family_lines_vanish_and_are_skipped(monkeypatch):
    # docs 18.7: on u + w = m the merged term of three orders is odd under u -> m - u, so its
    # lattice sums vanish.  (a) the symmetry itself, from the term's own factors at random complex
    # points; (b) the continued value with the line sums computed equals the one without them
    from knotobs.continuation.cartan import poles

    rng = random.Random(5)
    for orders in ((2, 3, 5), (2, 2, 3), (3, 4, 5)):
        t = merged_terms(orders)[0]
        assert poles.odd_third_family(t)
        for m in (1, 2, 7):
            for _ in range(3):
                u = complex(rng.uniform(-2, 2), rng.uniform(-0.5, 0.5))
                f = _root_fn(t.A, u) * _root_fn(t.B, m - u)
                g = _root_fn(t.A, m - u) * _root_fn(t.B, u)
                assert abs(f + g) < 1e-9 * max(1.0, abs(f))
    assert not poles.odd_third_family(merged_terms((2, 3, 5, 7))[0])
    with mpmath.workdps(40):
        for space, K in (("Sigma(2,3,5)", "7.3+0.4i"), ("M(0; -1; (2,1), (2,1), (3,1))", "6.6+0.3i")):
            vals = []
            for flag in (False, True):
                monkeypatch.setattr(poles, "SKIP_ODD_THIRD", flag)
                poles._EXACT.clear()                 # the cached exact pieces hold the lines or not
                z = continued_sun_partition_function(space, "SU(3)", K=K, digits=30)
                vals.append((z.numeric, {k: v for k, v in z.sectors.items()}))
            poles._EXACT.clear()
            assert abs(vals[0][0] - vals[1][0]) < 1e-29
            assert set(vals[0][1]) == set(vals[1][1])
            assert all(abs(vals[0][1][k] - vals[1][1][k]) < 1e-29 for k in vals[0][1])
