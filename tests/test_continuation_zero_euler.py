"""Spaces with ``e = 0`` and exceptional fibers at complex level: the quasi-polynomial of
docs/continuation_sun.md §18.11.

External references: the partition function of a mapping torus is the trace of its monodromy on
the conformal blocks of the torus, ``Z = Tr rho(A)`` up to a framing phase (E. Witten, Commun.
Math. Phys. 121 (1989) 351-399; L. Jeffrey, Commun. Math. Phys. 147 (1992) 563-604); the torus
bundles over S^2 with cone points (2,4,4), (3,3,3), (2,3,6), (2,2,2,2) have monodromy ``S``,
``-ST``, ``ST``, ``-1`` (P. Scott, Bull. London Math. Soc. 15 (1983) 401-487; common practice),
and ``rho(-1) = C`` permutes the integrable weights by conjugation, so ``Tr C`` counts the
self-conjugate ones (common practice).  The Kac-Peterson modular data are built independently in
``tests/reference/test_torus_bundles.py``.  Carlson's theorem (an entire function of exponential
type below ``pi`` vanishing on the integers vanishes; common practice) makes the continuation of
least exponential type unique; tests/reference/test_torus_bundles.py checks the continued values
at integers beyond the interpolation points against the traces.  The localisation and surgery routes of knotobs give the finite
levels beyond the interpolation points (two independent finite routes).
"""

from __future__ import annotations

import subprocess
import sys
from fractions import Fraction

import mpmath
import pytest

import knotobs
from knotobs.continuation.cartan import continued_sun_partition_function
from knotobs.continuation.cartan import quasipolynomial as qp
from knotobs.ball_series import parse_complex
from knotobs.errors import KnotobsError


def _Z(space, N, K, digits=25):
    return continued_sun_partition_function(space, f"SU({N})", K=K, digits=digits)


def test_shape_of_the_quasi_polynomial():
    # period lcm of the orders, degree bound |Delta+| max(n - 2 + 2g, 0) + (N - 1) g (docs 18.11)
    q = qp.quasi_polynomial_data("M(1; 0; (2,1), (2,-1))", 3)
    assert (q.period, q.degree, q.phi) == (2, 3 * 2 + 2, 0)
    q = qp.quasi_polynomial_data("M(0; -1; (2,1), (3,1), (6,1))", 2)
    assert (q.period, q.degree) == (6, 1)
    with pytest.raises(KnotobsError, match="e != 0"):
        qp.quasi_polynomial_data("Sigma(2,3,5)", 2)


@pytest.mark.parametrize("N,K", [(2, "5.3+0.4i"), (3, "6.7-0.25i"), (4, "7.2+0.1i")])
def test_monodromy_minus_one_counts_self_conjugate_weights(N, K):
    # M(0; -2; (2,1)^4) is the torus bundle with monodromy -1, Z_k = Tr C (phi = 0: no framing
    # phase; the sign is checked at the integers).  Tr C counts the self-conjugate integrable
    # weights: k + 1 for SU(2); floor(k/2) + 1 for SU(3), (a, a) with 2a <= k; for SU(4) the
    # weights (a, b, a) with 2a + b <= k.  Their least-type continuations (cos(pi K) for the
    # sign (-1)^K, docs 18.11), written by hand: K - 1;  K/2 - 3/4 - cos(pi K)/4;  for SU(4), with
    # k = K - 4, sum_a (k - 2a + 1) over 0 <= a <= k/2 is (k + 2)^2/4 at even k and (k + 1)(k + 3)/4
    # at odd k.
    space = "M(0; -2; (2,1), (2,1), (2,1), (2,1))"

    def count(N, k):
        if N == 2:
            return k + 1
        if N == 3:
            return k // 2 + 1
        return sum(k - 2 * a + 1 for a in range(k // 2 + 1))

    def closed(N, K):
        e = mpmath.cospi(K)
        if N == 2:
            return K - 1
        if N == 3:
            return K / 2 - mpmath.mpf(3) / 4 - e / 4
        k = K - 4
        even, odd = (k + 2) ** 2 / 4, (k + 1) * (k + 3) / 4
        return (even + odd) / 2 + e * (even - odd) / 2

    with mpmath.workdps(40):
        for k in (1, 2, 3, 8, 41):                       # inside and far beyond the interpolation
            z = _Z(space, N, k + N).numeric
            assert abs(z - count(N, k)) < 1e-20 and abs(closed(N, mpmath.mpf(k + N)) - count(N, k)) < 1e-30
        w = _Z(space, N, K).numeric
        assert abs(w - closed(N, parse_complex(K))) < 1e-20


@pytest.mark.parametrize("space,N,k", [
    ("M(0; -1; (3,1), (3,1), (3,1))", 3, 25),
    ("M(1; 0; (2,1), (2,-1))", 3, 30),
    ("M(0; -2; (3,1), (3,1), (3,2), (3,2))", 2, 40),
    ("M(0; -1; (2,1), (4,1), (4,1))", 4, 14),
])
def test_integer_K_equals_both_finite_routes(space, N, k):
    z = _Z(space, N, k + N, digits=30).numeric
    fin = knotobs.partition_function(space, f"SU({N})", k, digits=35, route="both")
    # the two finite routes agree (exactly, or to 35 digits where the level is beyond exact work)
    assert fin.details["agreement"].startswith(("exact", "to 35 digits"))
    assert abs(z - fin.numeric) < 1e-29


def test_order_four_bundle_closed_form_at_complex_K():
    # SU(2) on the bundle with monodromy S: Tr S = sqrt(2/K) sum_n sin(pi n^2/K) is 1 at even K and
    # 0 at odd K (Landsberg-Schaar; common practice), so with the framing phase of the finite
    # values (read off at K = 4) the least-type continuation is c exp(-3 pi i/(2K)) (1 + cos(pi K))/2
    space = "M(0; -1; (2,1), (4,1), (4,1))"
    with mpmath.workdps(40):
        c = _Z(space, 2, 4).numeric * mpmath.expjpi(mpmath.mpf(3) / 8)
        assert abs(abs(c) - 1) < 1e-20
        for K in ("5.5+0.3i", "3.25-0.5i", "12.1+1i"):
            Kc = parse_complex(K)
            want = c * mpmath.expjpi(-mpmath.mpf(3) / (2 * Kc)) * (1 + mpmath.cospi(Kc)) / 2
            res = _Z(space, 2, K)
            assert abs(res.numeric - want) < 1e-20
            assert sorted(res.sectors) == [0, Fraction(1, 2)]


def test_holomorphic_between_integers():
    # Cauchy: the mean over a circle is the centre value (|Z| fails the same test)
    space = "M(0; -1; (3,1), (3,1), (3,1))"
    with mpmath.workdps(30):
        c = mpmath.mpc("7.4", "0.2")
        pts = [c + mpmath.mpf("0.3") * mpmath.expjpi(2 * mpmath.mpf(j) / 16) for j in range(16)]
        vals = [_Z(space, 3, p, 20).numeric for p in pts]
        centre = _Z(space, 3, "7.4+0.2i", 20).numeric
        assert abs(sum(vals) / 16 - centre) < 1e-12
        assert abs(sum(abs(v) for v in vals) / 16 - abs(centre)) > 1e-6


def test_su2_without_group_and_the_cli():
    # knotobs continue SPACE (no --group) is SU(2) and reaches the same value
    space = "M(0; -1; (2,1), (3,1), (6,1))"
    a = knotobs.continued_partition_function(space, "SU(2)", "3.7+0.3i", digits=20).numeric
    b = _Z(space, 2, "5.7+0.3i", 20).numeric
    assert abs(a - b) < 1e-19
    r = subprocess.run([sys.executable, "-m", "knotobs", "continue", space, "--level", "3.7+0.3i", "-d", "15"],
                       capture_output=True, text=True, timeout=120)
    assert r.returncode == 0, r.stderr
    assert "quasi-polynomial" in r.stdout and "period 6" in r.stdout
    assert mpmath.nstr(a.real, 10)[:8] in r.stdout


def test_a_wrong_degree_bound_is_caught(monkeypatch):
    # the checks at two further levels per class are real: with a bound one below the true degree
    # (SU(2) on the bundle with monodromy -1 is K - 1, degree 1) the interpolant misses them
    real = qp.quasi_polynomial_data

    def low(space, N):
        import dataclasses

        return dataclasses.replace(real(space, N), degree=0)

    monkeypatch.setattr(qp, "quasi_polynomial_data", low)
    with pytest.raises(KnotobsError, match="not a polynomial of degree <= 0"):
        _Z("M(0; -2; (2,1), (2,1), (2,1), (2,1))", 2, "5.5+0.1i", 15)


def test_level_plane_plot_of_su_n_and_of_e_zero():
    # the figure's data are the continued values themselves (SU(3) on a lens space by the Gaussian
    # integrals of docs 18.2; SU(2) on an e = 0 bundle by the quasi-polynomial), and integer K on
    # the real axis are labelled from K = N
    from knotobs.output.plots import plot_level_plane

    for space, group in (("L(5,1)", "SU(3)"), ("M(0; -1; (2,1), (4,1), (4,1))", "SU(2)")):
        fig = plot_level_plane(space, None, (3.0, 6.0), (-0.5, 0.5), n=2, digits=12, group=group)
        N = int(group[3:-1])
        assert fig.data["group"] == group and fig.data["integer_K"][0] == max(3, N)
        assert fig.data["profile"].startswith(group + ",")
        z = continued_sun_partition_function(space, group, K=mpmath.mpc(6.0, 0.5), digits=12).numeric
        re_, im_ = fig.data["Z"][1][1]
        assert abs(complex(re_, im_) - complex(z)) < 1e-10


@pytest.mark.parametrize("space,mirror,N", [
    ("M(0; -1; (3,1), (3,1), (3,1))", "M(0; -2; (3,2), (3,2), (3,2))", 3),
    ("M(0; -1; (2,1), (4,1), (4,1))", "M(0; 1; (2,-1), (4,-1), (4,-1))", 2),      # a sector at 1/2
    ("M(1; 0; (2,1), (2,-1))", "M(1; 0; (2,-1), (2,1))", 2),                       # its own mirror
    ("M(0; -1; (2,1), (3,1), (6,1))", "M(0; 1; (2,-1), (3,-1), (6,-1))", 3),
])
def test_reversed_orientation_is_the_conjugate(space, mirror, N):
    # Z(-M) = conj Z(M) at every level (common practice: reversing the orientation conjugates the
    # partition function); the continuations must keep Z_{-M}(K) = conj Z_M(conj K), which is what
    # fixes cos(pi K) for the sector at 1/2 (e^{+i pi K} alone failed it)
    a = _Z(space, N, "5.3+0.2i", 20)
    b = _Z(mirror, N, "5.3-0.2i", 20)
    with mpmath.workdps(30):
        assert abs(a.numeric - mpmath.conj(b.numeric)) < 1e-19
        for cs, v in a.sectors.items():           # the sector j/L of M is the sector -j/L of -M
            assert abs(v - mpmath.conj(b.sectors[(-cs) % 1])) < 1e-19


def test_far_from_the_real_axis_and_wide_nodes():
    # K = 5 + 5000i: the sectors differ by e^{5000 pi}; the finite values need no such digits (this
    # once asked for 6900 of them and failed).  A genus-4 space whose nodes are far larger than the
    # value: the finite values are recomputed with the digits the ball was short of
    space = "M(0; -1; (2,1), (4,1), (4,1))"
    z = _Z(space, 2, "7+5000i", 15).numeric
    with mpmath.workdps(40):
        c = _Z(space, 2, 4).numeric * mpmath.expjpi(mpmath.mpf(3) / 8)     # as in the closed form above
        Kc = mpmath.mpc(7, 5000)
        want = c * mpmath.expjpi(-mpmath.mpf(3) / (2 * Kc)) * (1 + mpmath.cospi(Kc)) / 2
        assert abs(want) > mpmath.mpf(10) ** 6000 and abs(z / want - 1) < 1e-14


def test_a_too_wide_ball_recomputes_the_finite_values(monkeypatch):
    # with no guard digits the extrapolation to K = 500 (degree 6, nodes below 22) loses about 16
    # digits; the first ball is too wide, the finite values are recomputed with the missing digits,
    # and the value is the closed form of the monodromy -1 bundle (Tr C, as above)
    misses = []
    real = qp.check_radius

    def spy(z, digits, what):
        try:
            real(z, digits, what)
        except qp.WideBallError as exc:
            misses.append(exc.missing)
            raise

    monkeypatch.setattr(qp, "guard_digits", lambda q, Kv, sectors=True: 0)
    monkeypatch.setattr(qp, "check_radius", spy)
    z = _Z("M(0; -2; (2,1), (2,1), (2,1), (2,1))", 3, "500.5+0.5i", 20).numeric
    assert misses and max(misses) > 3
    with mpmath.workdps(40):
        K = mpmath.mpc("500.5", "0.5")
        assert abs(z - (K / 2 - mpmath.mpf(3) / 4 - mpmath.cospi(K) / 4)) < 1e-20 * abs(z)


@pytest.mark.slow
def test_genus_four_nodes_far_larger_than_the_value():
    # 595 finite levels whose values reach 10^39 while Z_3 is about 7178: the first ball is too
    # wide and the recomputed one gives the finite value
    big = "M(4; 0; (5,1), (5,-1), (7,2), (7,-2))"
    v = _Z(big, 2, 5, 10).numeric
    fin = knotobs.partition_function(big, "SU(2)", 3, digits=15).numeric
    with mpmath.workdps(30):
        assert abs(v - fin) < 1e-10 * abs(fin)
    assert abs(_Z(big, 2, "5.5+0.1i", 15).numeric) > 0


def test_both_finite_routes_give_the_same_continuation():
    # method 'both' (CLI --route both) interpolates the quasi-polynomial a second time, through the
    # surgery route's finite values (modular data, independent of the localisation sum)
    z = continued_sun_partition_function("M(0; -1; (2,1), (3,1), (6,1))", "SU(3)", level="2.5+0.2i", digits=20,
                                         method="both")
    assert any("surgery route: agree to 20 digits" in n for n in z.notes)
    r = subprocess.run([sys.executable, "-m", "knotobs", "continue", "M(0; -1; (2,1), (4,1), (4,1))", "--level",
                        "2.5+0.2i", "-d", "15", "--route", "both"], capture_output=True, text=True, timeout=120)
    assert r.returncode == 0 and "surgery route: agree to 15 digits" in r.stdout, r.stdout + r.stderr
    bad = subprocess.run([sys.executable, "-m", "knotobs", "continue", "L(5,1)", "--level", "2.5+0.2i", "--route",
                          "both"], capture_output=True, text=True, timeout=120)
    assert bad.returncode == 2 and "error: --route" in bad.stdout + bad.stderr, bad.stdout + bad.stderr


def test_sector_polynomials_are_reported():
    # the sector polynomials of the monodromy -1 bundle for SU(3) are those of the self-conjugate
    # weight count above: Q_0 = K/2 - 3/4, Q_{1/2} = -1/4 (text, JSON and the result object)
    z = _Z("M(0; -2; (2,1), (2,1), (2,1), (2,1))", 3, "6.7+0.3i", 20)
    with mpmath.workdps(30):
        q0 = [c for c, _ in z.polynomials[Fraction(0)]]
        q1 = [c for c, _ in z.polynomials[Fraction(1, 2)]]
        assert len(q0) == 2 and abs(q0[0] + mpmath.mpf(3) / 4) < 1e-18 and abs(q0[1] - mpmath.mpf(1) / 2) < 1e-18
        assert len(q1) == 1 and abs(q1[0] + mpmath.mpf(1) / 4) < 1e-18
    js = z.to_json()
    assert js["sector_polynomials"]["1/2"][0]["re"].startswith("-0.25")
    r = subprocess.run([sys.executable, "-m", "knotobs", "continue", "M(0; -2; (2,1), (2,1), (2,1), (2,1))", "-g",
                        "SU(3)", "--level", "3.7+0.3i", "-d", "15"], capture_output=True, text=True, timeout=120)
    assert "Q = -0.75 + 0.5 K" in r.stdout and "Q = -0.25" in r.stdout, r.stdout
