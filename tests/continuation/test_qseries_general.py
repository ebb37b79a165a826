"""Brieskorn q-series route: Hikami's false theta functions and their radial limits.

The identity tau_K = H xi^c [E_0 - lim A_p] / (2 (xi^(1/2) - xi^(-1/2))) (derived in the docstring of
knotobs.continuation.qseries) is checked against the independent finite-level surgery route
(Reshetikhin-Turaev; Kirby-Melvin, Invent. Math. 105 (1991); CONVENTIONS §9).
"""

from __future__ import annotations

import mpmath
import pytest

from knotobs.continuation.qseries import (
    brieskorn_data,
    brieskorn_false_theta,
    brieskorn_radial_limit,
    hikami_character,
    poincare_radial_limit,
    poincare_series,
    tau_from_q_series,
    tau_from_radial_limit,
)
from knotobs.errors import KnotobsError
from knotobs.evaluation.surgery import partition_function
from knotobs.fibrations.seifert import parse_space

SPACES = [(2, 3, 7), (2, 5, 7), (3, 4, 5), (2, 3, 11)]


@pytest.fixture(autouse=True)
def _precision():
    with mpmath.workdps(40):
        yield


def _tau_surgery(space: str, K: int) -> mpmath.mpc:
    z = partition_function(parse_space(space), "SU(2)", level=K - 2, digits=30).numeric
    s3 = partition_function(parse_space("S^3"), "SU(2)", level=K - 2, digits=30).numeric
    return z / s3


# ------------------------------------------------------------------ Poincare sphere
def test_poincare_reduces_to_lawrence_zagier():
    # A(q) = 1 + q + q^3 + q^7 - q^8 - q^14 - q^20 - q^29 + ...  (Lawrence & Zagier, Asian J. Math. 3 (1999))
    assert brieskorn_false_theta((2, 3, 5), order=200) == poincare_series(200)
    assert str(brieskorn_false_theta((2, 3, 5), order=30)) == "1 + q + q^3 + q^7 - q^8 - q^14 - q^20 - q^29"
    for K in (3, 5, 8, 13):
        xi = mpmath.expjpi(mpmath.mpf(2) / K)
        L = brieskorn_radial_limit((2, 3, 5), K, 30)
        assert abs(L - poincare_radial_limit(K, 30)) < 1e-28
        t = tau_from_q_series((2, 3, 5), K, 30)
        # lim A = 2 [1 + xi (1 - xi) tau_K] (Lawrence & Zagier 1999, CONVENTIONS §9)
        assert abs(L - 2 * (1 + xi * (1 - xi) * t)) < 1e-26
        assert abs(t - tau_from_radial_limit(K, 30)) < 1e-26
        assert abs(t - _tau_surgery("Sigma(2,3,5)", K)) < 1e-20


# ------------------------------------------------------------------ structure of chi
@pytest.mark.parametrize("ps", SPACES + [(2, 3, 5), (2, 7, 9)])
def test_character_is_odd_and_exponents_integral(ps):
    # Hikami (Int. J. Math. 16 (2005)): chi is odd and 2P-periodic with 8 residues of weight +-1
    # (pairwise coprime orders); all n in its support have the same n^2 mod 4P.
    d = brieskorn_data(ps)
    chi = hikami_character(ps)
    assert len(chi) == 8 and set(chi.values()) == {1, -1}
    for r, c in chi.items():
        assert chi.get((-r) % (2 * d.P)) == -c
        assert (r * r - d.n0 * d.n0) % (4 * d.P) == 0


# ------------------------------------------------------------------ tau_K from the q-series
def _check(ps, K):
    space = f"Sigma({ps[0]},{ps[1]},{ps[2]})"
    t = tau_from_q_series(ps, K, 30)
    w = _tau_surgery(space, K)
    assert abs(t - w) < mpmath.mpf(10) ** -20 * max(1, abs(w)), (space, K)


@pytest.mark.parametrize("ps", SPACES)
@pytest.mark.parametrize("K", [3, 4, 7, 12, 25, 40])
def test_tau_from_q_series_matches_surgery(ps, K):
    _check(ps, K)


@pytest.mark.slow
@pytest.mark.parametrize("ps", SPACES)
def test_tau_from_q_series_matches_surgery_full_range(ps):
    for K in range(3, 41):
        _check(ps, K)


def test_reversed_orientation_is_conjugate():
    # Z(-M) = conj Z(M) (CONVENTIONS §9, common practice)
    for K in (5, 11):
        a = tau_from_q_series("Sigma(2,3,7)", K, 30)
        b = tau_from_q_series("-Sigma(2,3,7)", K, 30)
        assert abs(a - mpmath.conj(b)) < 1e-26
        assert abs(b - _tau_surgery("-Sigma(2,3,7)", K)) < 1e-20


# ------------------------------------------------------------------ numerical radial limit
def test_numeric_radial_limit_converges_to_closed_sum():
    # Lawrence & Zagier (1999), §1: for odd periodic chi, A(r xi) -> -(1/M) sum n chi(n) xi^(...)
    # linearly in 1 - r once (1 - r) P K^2 is small; Richardson extrapolation removes the linear term.
    ps, K = (2, 3, 7), 5
    xi = mpmath.expjpi(mpmath.mpf(2) / K)
    L = brieskorn_radial_limit(ps, K, 30)
    vals = {}
    for e in (4, 5, 6):
        r = 1 - mpmath.mpf(10) ** -e
        vals[e] = brieskorn_false_theta(ps, r * xi, digits=25)
    errs = [abs(vals[e] - L) for e in (4, 5, 6)]
    assert errs[0] > errs[1] > errs[2] and errs[2] < 1e-3
    assert 8 < errs[1] / errs[2] < 12                  # linear approach
    rich = (10 * vals[6] - vals[5]) / 9
    assert abs(rich - L) < 1e-5


def test_series_value_matches_truncation_and_tau_variable():
    ps = (2, 5, 7)
    q = mpmath.mpc("0.4", "-0.5")
    z = brieskorn_false_theta(ps, q, digits=30)
    assert abs(z - brieskorn_false_theta(ps, order=600).evaluate(q, dps=40)) < 1e-27
    tau = mpmath.mpc("0.1", "0.2")
    z2 = brieskorn_false_theta(ps, tau, variable="tau", digits=30)
    assert abs(z2 - brieskorn_false_theta(ps, mpmath.exp(2j * mpmath.pi * tau), digits=30)) < 1e-27


# ------------------------------------------------------------------ bad input
@pytest.mark.parametrize("bad", [(2, 4, 5), (2, 3), (1, 3, 5), "Sigma(2,3)", "Sigma(6,10,15)", (2.0, 3, 5)])
def test_bad_orders_are_refused(bad):
    with pytest.raises(KnotobsError):
        brieskorn_data(bad)


def test_bad_points_are_refused():
    with pytest.raises(KnotobsError, match="converges only"):
        brieskorn_false_theta((2, 3, 7), "1.2")
    with pytest.raises(KnotobsError, match="Im tau"):
        brieskorn_false_theta((2, 3, 7), "0.2-0.1i", variable="tau")
    with pytest.raises(KnotobsError, match="not both"):
        brieskorn_false_theta((2, 3, 7), "0.2", order=5)
    with pytest.raises(KnotobsError, match="K = 1"):
        tau_from_q_series((2, 3, 7), 1)


@pytest.mark.parametrize("name", ["Sigma(2,3,5)", "Sigma(2,3,7)", "-Sigma(2,3,7)", "Sigma(3,4,5)", "Sigma(2,5,7)"])
@pytest.mark.parametrize("K", [3, 5, 8, 13])
def test_q_series_route_is_exactly_the_surgery_value(name, K):
    # exact equality in a cyclotomic field: the q-series identity (module docstring; Hikami 2005,
    # Lawrence-Zagier 1999) against the Reshetikhin-Turaev surgery route
    from knotobs.continuation.qseries import tau_from_q_series_exact
    from knotobs.evaluation.surgery import partition_function
    from knotobs.fibrations.seifert import parse_space

    tau = tau_from_q_series_exact(name, K)
    z = partition_function(parse_space(name), "SU(2)", level=K - 2, exact=True)
    s00 = partition_function(parse_space("S^3"), "SU(2)", level=K - 2, exact=True)
    assert tau == (z.exact / s00.exact).as_cyclotomic()
