"""SU(N) continuation in the shifted level K (CONVENTIONS §18, docs/continuation_sun.md).

Sources of the checks:

* the finite-level values: the localisation formula of L. Rozansky, Commun. Math. Phys. 178
  (1996) 27-60, S. K. Hansen & T. Takata (arXiv math/0209403), M. Blau & G. Thompson, JHEP
  0605:003 (2006) (knotobs.localisation, itself checked against the modular data);
* the SU(2) continuation: R. Lawrence & L. Rozansky, Commun. Math. Phys. 205 (1999) 287-314
  (knotobs.continuation.level, a separate implementation of the rank-one formula);
* holomorphy: Cauchy's integral formula (common practice);
* S^3: Z(S^3) = S_00 = (N K^r)^(-1/2) prod_{alpha > 0} 2 sin(pi <alpha, rho>/K) (Kac-Peterson;
  common practice).
"""

from __future__ import annotations

import math

import mpmath
import numpy as np
import pytest

from knotobs.continuation.cartan import continued_sun_partition_function, continued_sun_Z
from knotobs.continuation.cartan.data import CartanData, PolesNotCoveredError
from knotobs.continuation._num import parse_complex
from knotobs.continuation.level import DomainError, continued_Z
from knotobs.errors import InvalidSeifertDataError, KnotobsError, ParseError, SizeLimitError
from knotobs.guard import limits
from knotobs.localisation import localisation_partition_function
from knotobs.numerics import working_precision


def _close(a, b, digits):
    with working_precision(digits + 10):
        return abs(mpmath.mpc(a) - mpmath.mpc(b)) <= mpmath.mpf(10) ** (-digits) * max(abs(mpmath.mpc(b)), 1)


# ---------------------------------------------------------------- §18.1: the finite Gauss sum
def _finite_gauss_sum(space, N, K):
    """B_N K^-r sum'_{lam in Lambda/PKQ} h(lam/K) in double precision (numpy), the identity of
    §18.1 written out independently of the continuation code (coordinates in the fundamental
    weights; Lambda/PKQ is (Z/NPK)^r counted N^(r-1) times)."""
    d = CartanData.from_space(space, N)
    P, H, r = d.P, d.H, N - 1
    A = 2 * np.eye(r) - np.eye(r, k=1) - np.eye(r, k=-1)
    x = np.indices((N * P * K,) * r).reshape(r, -1).T.astype(float) / K
    h = np.exp(-1j * np.pi * K * H * np.einsum("ti,ij,tj->t", x, np.linalg.inv(A), x) / P)
    keep = np.ones(len(x), dtype=bool)
    for i in range(r):
        for j in range(i + 1, r + 1):
            y = x[:, i:j].sum(axis=1)                      # <alpha, z> for alpha = e_i - e_j
            for p in d.lr.ps:
                h = h * 2j * np.sin(np.pi * y / p)
            wall = np.abs(np.round(y * K) % K) < 0.5
            keep &= ~wall
            h = h / np.where(wall, 1.0, 2j * np.sin(np.pi * y)) ** (d.n - 2)
    s = h[keep].sum() / N ** (r - 1) / K ** r
    B = ((-1) ** d.npos * np.exp(1j * np.pi * d.sigma * (N * N - 1) / 4) / (math.factorial(N) * N * P ** (r / 2))
         * np.exp(-1j * np.pi * float(d.rho2 * d.phi) / K))
    return complex(B * s)


@pytest.mark.parametrize("space,N,k", [
    ("Sigma(2,3,5)", 3, 2), ("Sigma(2,3,5)", 3, 3), ("L(5,1)", 3, 2), ("L(7,2)", 4, 2),
    ("M(0; -2; (2,1), (3,2), (5,4))", 3, 2), ("M(0; -3; (2,1), (3,1))", 3, 3), ("Sigma(2,3,7)", 3, 1),
])
def test_finite_gauss_sum_over_the_weight_lattice_is_the_localisation_value(space, N, k):
    # §18.1 (both orientations, poles or not); double precision: agreement to 1e-9
    z = complex(localisation_partition_function(space, f"SU({N})", k, digits=15).numeric)
    assert abs(_finite_gauss_sum(space, N, k + N) - z) < 1e-9


# ---------------------------------------------------------------- integer K
@pytest.mark.parametrize("space,N,ks", [
    ("L(5,1)", 3, (1, 2, 3, 4, 6)), ("S^3", 3, (1, 2, 5)), ("L(7,2)", 3, (1, 3, 4)),
    ("M(0; 1; (2,1), (3,1))", 3, (2, 3)), ("M(0; 0; (2,1), (5,2))", 3, (1, 2)), ("M(0; -5)", 3, (1, 2, 4)),
    ("L(5,1)", 4, (1, 3)), ("M(0; -2)", 4, (1, 2)), ("S^3", 5, (1, 2)),
    pytest.param("L(3,1)", 5, (1,), marks=pytest.mark.slow),
])
def test_integer_K_equals_the_finite_level_value_to_30_digits(space, N, ks):
    for k in ks:
        z = continued_sun_partition_function(space, f"SU({N})", K=k + N, digits=30)
        ref = localisation_partition_function(space, f"SU({N})", k, digits=40).numeric
        assert _close(z.numeric, ref, 30), (space, N, k, z.numeric, ref)
        with working_precision(40):
            total = sum(z.sectors.values())
        assert _close(total, z.numeric, 28)


def test_integer_K_equals_the_surgery_route():
    # the second finite-level route (modular data and SL(2,Z) words, CONVENTIONS §7, §9, §11)
    from knotobs.evaluation.seifert_routes import partition_function

    for space, k in (("L(5,1)", 2), ("L(7,2)", 4), ("M(0; -3; (2,1), (3,1))", 3)):
        z = continued_sun_partition_function(space, "SU(3)", level=k, digits=30).numeric
        ref = partition_function(space, "SU(3)", k, digits=35, route="surgery").numeric
        assert _close(z, ref, 30), (space, k)


def test_S3_is_S00_at_complex_K():
    # S_00 as a function of K is holomorphic: the continuation must be it (Carlson: both have type < pi)
    K = mpmath.mpc("7.3", "0.4")
    with working_precision(40):
        s00 = 8 * mpmath.sin(mpmath.pi / K) ** 2 * mpmath.sin(2 * mpmath.pi / K) / mpmath.sqrt(3 * K * K)
    assert _close(continued_sun_Z("S^3", K, "SU(3)", 30), s00, 30)


# ---------------------------------------------------------------- holomorphy
@pytest.mark.parametrize("space,N,centre", [("L(5,1)", 3, "7.3+0.2i"), ("L(7,2)", 3, "6.6-0.3i"), ("M(0; -2)", 4, "8.5+0.1i"),
                                            pytest.param("L(5,1)", 4, "8.5+0.1i", marks=pytest.mark.slow)])
def test_cauchy_integral_at_a_non_integer_centre(space, N, centre):
    """Mean value over a circle of radius 0.3 (24 points, trapezoid: error ~ (0.3/6)^24) equals
    the value at the centre, and the contour integral of Z vanishes; a function that were only
    correct at the integers (e.g. |Z|) would fail both."""
    n, dg = 24, 22
    with working_precision(45):                 # the nodes exactly on the circle, to 45 digits
        c = parse_complex(centre)
        pts = [c + mpmath.mpf("0.3") * mpmath.expjpi(2 * mpmath.mpf(j) / n) for j in range(n)]
    vals = [continued_sun_Z(space, p, f"SU({N})", dg) for p in pts]
    with working_precision(dg + 10):
        mean = sum(vals) / n
        contour = sum(v * (p - c) for v, p in zip(vals, pts)) / n       # (1/2 pi i) oint Z dK / rad
    z0 = continued_sun_Z(space, c, f"SU({N})", dg)
    assert _close(mean, z0, 18)
    assert abs(contour) < mpmath.mpf(10) ** -18
    # the modulus is not holomorphic: its circle mean differs from its centre value
    assert abs(sum(abs(v) for v in vals) / n - abs(z0)) > 1e-8


def test_the_two_phase_choices_agree_at_integers_only():
    a = continued_sun_partition_function("L(5,1)", "SU(3)", K=8, digits=25, phases="lawrence-rozansky").numeric
    b = continued_sun_partition_function("L(5,1)", "SU(3)", K=8, digits=25).numeric
    assert _close(a, b, 25)
    a = continued_sun_partition_function("L(5,1)", "SU(3)", K="8.5+0.1i", digits=25, phases="lawrence-rozansky").numeric
    b = continued_sun_partition_function("L(5,1)", "SU(3)", K="8.5+0.1i", digits=25).numeric
    assert not _close(a, b, 5)


# ---------------------------------------------------------------- N = 2 and the second route
@pytest.mark.parametrize("space", ["L(7,2)", "L(5,1)", "M(0; -5)", "S^3", "M(0; 1; (2,1), (3,1))", "L(12,5)"])
@pytest.mark.parametrize("K", ["7.5+0.3i", "3.2-1.1i", "2.5+3i"])
def test_N2_equals_the_lawrence_rozansky_continuation(space, K):
    # two implementations: Weyl-group closed form over the Cartan vs level.py's trapezoid + residues
    mine = continued_sun_Z(space, K, "SU(2)", 27)
    theirs = continued_Z(space, K, 27)          # both parse the text at their own precision
    assert _close(mine, theirs, 25)


@pytest.mark.parametrize("space,K,dg", [("S^3", "6.5+0.7i", 20), ("M(0; -2)", "5.5-0.4i", 14), ("M(0; 2)", "9.1+0.2i", 14)])
def test_closed_form_equals_trapezoid_rule_on_the_rotated_cartan(space, K, dg):
    z = continued_sun_partition_function(space, "SU(3)", K=K, digits=dg, method="both")
    q = continued_sun_partition_function(space, "SU(3)", K=K, digits=dg, method="quadrature")
    assert _close(z.numeric, q.numeric, dg)
    assert any("agree" in n for n in z.notes)


# ---------------------------------------------------------------- refusals
@pytest.mark.parametrize("kwargs,exc,words", [
    (dict(space="Sigma(2,3,5)", group="SU(4)", K="7.5+0.3i"), PolesNotCoveredError, ["2, 3, 5", "SU(4)"]),
    (dict(space="Sigma(2,3,5)", group="SU(3)", K=6, method="closed"), DomainError, ["'closed'", "poles", "'residues'"]),
    (dict(space="M(0; -1; (2,1), (3,1), (5,1), (7,1))", group="SU(3)", K=6), SizeLimitError, ["line integrals", "estimated"]),
    (dict(space="M(0; -1; (2,1), (3,1), (5,1), (7,1))", group="SU(4)", K=6), PolesNotCoveredError, ["2, 3, 5, 7", "rank 3"]),
    (dict(space="L(5,1)", group="SU(3)", K=6, method="residues"), DomainError, ["'residues'", "no poles"]),
    (dict(space="Sigma(2,3,5)", group="SU(3)", K="-5i"), DomainError, ["cut", "-pi/2"]),
    (dict(space="-Sigma(2,3,5)", group="SU(3)", K="5i"), DomainError, ["cut", "+pi/2"]),
    (dict(space="M(0; -1; (2,1), (4,1), (6,1))", group="SU(4)", K=6), InvalidSeifertDataError, ["2, 4, 6", "share a factor"]),
    (dict(space="M(1; -1; (2,1), (3,1))", group="SU(4)", K=6), InvalidSeifertDataError, ["genus 1", "SU(3)"]),
    (dict(space="M(1; 0; (2,1), (2,-1))", group="SU(3)", K=6, phases="lawrence-rozansky"), DomainError,
     ["e = 0", "'reduced'"]),
    (dict(space="M(1; 0; (2,1), (2,-1))", group="SU(3)", K=6, method="closed"), DomainError, ["e = 0", "'auto'"]),
    (dict(space="M(0; -1; (2,1), (3,1), (6,1))", group="SU(5)", K=6), SizeLimitError,
     ["78 finite levels", "period 6", "estimated"]),
    (dict(space="L(5,1)", group="SU(3)", K=0), DomainError, ["K = 0"]),
    (dict(space="L(5,1)", group="SU(3)", K=6, digits=0), ParseError, ["digits 0"]),
    (dict(space="L(5,1)", group="SO(3)", K=6), KnotobsError, ["SO(3)"]),
    (dict(space="L(5,1)", group="SU(3)", K=6, phases="nice"), DomainError, ["'nice'"]),
    (dict(space="L(5,1)", group="SU(3)", K=6, method="guess"), DomainError, ["'guess'"]),
    (dict(space="L(5,1)", group="SU(9)", K=6), SizeLimitError, ["SU(9)", "exponentials"]),
])
def test_bad_input_is_refused_naming_the_value(kwargs, exc, words):
    kw = dict(kwargs)
    with limits(seconds=5):
        with pytest.raises(exc) as e:
            continued_sun_partition_function(kw.pop("space"), kw.pop("group"), **kw)
    for w in words:
        assert w in str(e.value), (w, str(e.value))


@pytest.mark.parametrize("kwargs", [dict(space="M(0; -1; (2,1), (3,1), (5,2))", group="SU(3)", K=6),
                                    dict(space="Sigma(2,3,5)", group="SU(3)", K="7.5+0.3i", digits=60)])
def test_poles_over_the_counted_estimate_are_refused_naming_the_count(kwargs):
    # the closed-form estimate is above the limit, so the run's integrals are counted first
    # (pole_tally); the refusal names both counts
    kw = dict(kwargs)
    with limits(seconds=0.2):
        with pytest.raises(SizeLimitError) as e:
            continued_sun_partition_function(kw.pop("space"), kw.pop("group"), **kw)
    for w in ("line integrals", "residues", "counted:", "lines integrated", "estimated"):
        assert w in str(e.value), (w, str(e.value))


def test_refusal_comes_before_the_work():
    import time

    t = time.perf_counter()
    with limits(seconds=1), pytest.raises(SizeLimitError):
        continued_sun_partition_function("L(97,1)", "SU(5)", K="7.5+0.1i", digits=30)
    assert time.perf_counter() - t < 2


def test_cli_prints_the_certified_digits():
    # regression: the printed digits beyond the 16th must be the value's, not those of a double
    import json

    from typer.testing import CliRunner

    from knotobs.cli import app

    out = CliRunner().invoke(app, ["continue", "L(5,1)", "--group", "SU(3)", "--level", "2", "-d", "30", "--json"])
    assert out.exit_code == 0, out.output
    js = json.loads(out.stdout)
    ref = localisation_partition_function("L(5,1)", "SU(3)", 2, digits=40).numeric
    with working_precision(45):
        got = mpmath.mpc(mpmath.mpf(js["numeric"]["re"]), mpmath.mpf(js["numeric"]["im"]))
    assert _close(got, ref, 29) and js["group"] == "SU(3)" and js["level"]["re"] == "2.0"


@pytest.mark.parametrize("space", ["L(5,1)", "L(7,2)", "L(8,3)"])
def test_sectors_are_the_flat_connections(space):
    # one Gaussian per abelian flat connection: its key is the CS value P|u|^2/(2H) mod 1, which must
    # be among the CS values of the flat SU(3) connections on L(p,q), (q*/2p) sum x_i^2 mod 1
    # (knotobs.continuation.flat_sun; L. Jeffrey, Commun. Math. Phys. 147 (1992) for SU(2))
    from knotobs.continuation.cartan import continued_sun_sectors
    from knotobs.continuation.flat_sun import lens_flat_connections

    keys = set(continued_sun_sectors(space, "7.5+0.2i", "SU(3)", 12))
    assert keys == {c.cs % 1 for c in lens_flat_connections(space, 3)}


@pytest.mark.parametrize("space", ["L(7,2)", "L(8,3)", "M(0; -5)"])
def test_N2_sectors_equal_the_lawrence_rozansky_sectors(space):
    # sector by sector against level.sector_values (Lawrence & Rozansky 1999, one block per flat connection)
    from knotobs.continuation.cartan import continued_sun_sectors
    from knotobs.continuation.level import sector_values

    K = "7.5+0.2i"
    a, b = sector_values(space, K, 22), continued_sun_sectors(space, K, "SU(2)", 22)
    assert sorted(a) == sorted(b)
    for cs in a:
        assert _close(a[cs], b[cs], 20), cs


@pytest.mark.parametrize("space", ["M(0; -1; (2,1), (4,1))", "M(0; 0; (3,1), (6,1))", "M(0; -3; (4,1), (6,5))"])
@pytest.mark.parametrize("N", [2, 3])
def test_lens_space_with_shared_orders_is_continued_in_its_one_fiber_form(space, N):
    """Two exceptional orders sharing a factor: the space is a lens space, continued as L(p, q)
    (the slam-dunk of SeifertManifold.lens_parameters; Rolfsen 1976, ch. 9); at integer K the value
    must equal the localisation route on the presentation as given (catches an orientation slip)."""
    from knotobs.continuation.cartan import continued_sun_partition_function
    from knotobs.evaluation.seifert_routes import partition_function
    from knotobs.numerics import working_precision

    for k in (1, 2, 3):
        a = continued_sun_partition_function(space, f"SU({N})", k, digits=25).numeric
        b = partition_function(space, f"SU({N})", k, digits=25, route="localisation").numeric
        with working_precision(35):
            assert abs(a - b) < mpmath.mpf(10) ** -22
