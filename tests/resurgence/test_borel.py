"""Borel plane of the trivial-connection series (issue 10, item 2)."""

import json
import os
import tempfile
from fractions import Fraction

import pytest
from typer.testing import CliRunner

from knotobs.cli import app
from knotobs.continuation.level import LRData
from knotobs.continuation.ohtsuki import _g_ratios, ohtsuki_series, trivial_h_series
from knotobs.numerics import local_mp
from knotobs.resurgence.analysis import borel_analysis
from knotobs.resurgence.series import borel_series


@pytest.mark.parametrize("space", ["Sigma(2,3,5)", "Sigma(2,3,7)", "L(7,2)", "M(0; 1; (2,1),(3,1),(5,2),(7,3))"])
def test_series_two_routes(space):
    # the flint series of knotobs.resurgence against the rational recursion of knotobs.continuation.ohtsuki,
    # and E(h) Phi(h) = the trivial-connection series (Lawrence-Rozansky CMP 205 (1999) §4)
    d = LRData.from_space(space)
    s = borel_series(d, 30)
    c = Fraction(-d.P, d.H)
    assert [b / c ** k for k, b in enumerate(s.b)] == _g_ratios(d, 31)
    from flint import fmpq, fmpq_poly

    N = 12
    h = [Fraction(0)] * (N + 1)
    # exp(-phi h/4) (h/2)/sinh(h/2) times Phi, truncated
    from knotobs.continuation.ohtsuki import _exp, _inv, _mul
    from math import factorial
    E = _exp([Fraction(0), -d.phi / 4], N + 1)
    sh = [Fraction(1, 2 ** k * factorial(k + 1)) if k % 2 == 0 else Fraction(0) for k in range(N + 1)]
    full = _mul(_mul(E, _inv(sh, N + 1), N + 1), list(s.a[: N + 1]), N + 1)
    assert full == trivial_h_series(d, N)


def test_poincare_ohtsuki_order_40_is_integral():
    # the Ohtsuki coefficients of an integral homology sphere are integers (Ohtsuki 1995; H. Murakami 1994),
    # lambda_1 = 6 lambda = -6 (CONVENTIONS §9)
    c = ohtsuki_series("Sigma(2,3,5)", 40).coefficients
    assert len(c) == 41 and all(x.denominator == 1 for x in c) and c[1] == -6


@pytest.mark.parametrize("space,first", [("Sigma(2,3,5)", [(1, "-1/120", "SU(2)"), (7, "-49/120", "SU(2)")]),
                                         ("Sigma(2,3,7)", [(1, "-1/168", "SL(2,R)"), (5, "-25/168", "SU(2)"),
                                                           (11, "-121/168", "SU(2)")])])
def test_singularities_at_the_cs_values(space, first):
    # Borel singularities of the trivial series at 4 pi^2 times the CS values of the other flat connections
    # (Gukov-Marino-Putrov arXiv:1605.07615: Sigma(2,3,5) at -1/120, -49/120; Sigma(2,3,7) at -1/168
    # (the non-unitary one), -25/168 = 143/168 - 1, -121/168 = 47/168 - 1): found from the 41 exact
    # coefficients alone (Pade and ratio test) to >= 6 digits (here 20 are asked and checked)
    r = borel_analysis(space, order=40, count=len(first), digits=20)
    got = [(row.m, str(row.cs), row.connections[0][0]) for row in r.rows]
    assert got == first
    for row in r.rows:
        assert row.agreement_digits >= 20
        assert abs(row.pade_residue - row.residue) < 1e-18 * abs(row.residue)
    z1 = r.rows[0].predicted
    assert abs(r.ratio_estimate - z1) < 1e-8 * abs(z1)


@pytest.mark.parametrize("space", ["Sigma(2,3,5)", "Sigma(2,3,7)", "Sigma(2,5,7)", "M(0; 0; (2,1),(3,1),(5,2))"])
def test_stokes_constants_are_one_loop_amplitudes(space):
    # |S_m| = sqrt(torsion) of the connection with CS = cs_m mod 1, unitary or not (Gukov-Marino-Putrov
    # arXiv:1605.07615; Andersen-Mistegard arXiv:1811.05376); torsion from the rotation numbers (Freed 1992)
    r = borel_analysis(space, order=24, count=6, digits=15)
    for row in r.rows:
        assert row.sqrt_torsion is not None
        assert abs(abs(row.stokes) - row.sqrt_torsion) < 1e-14


@pytest.mark.parametrize("space,K", [("Sigma(2,3,5)", 5), pytest.param("Sigma(2,3,5)", 17, marks=pytest.mark.slow),
                                     pytest.param("Sigma(2,3,7)", 9, marks=pytest.mark.slow)])
def test_resummation_reproduces_finite_level(space, K):
    # Borel-Laplace of the trivial series (closed form, and Pade of the 41 exact coefficients) plus the
    # other sectors = the finite-level value of the Lawrence-Rozansky Gauss sum (CONVENTIONS §9), >= 15 digits
    r = borel_analysis(space, order=40, count=1, digits=25, K=K)
    res = r.resummation
    assert abs(res["resummed_total"] - res["finite_level_value"]) < 1e-25
    assert abs(res["trivial_sector_pade_borel_laplace"] - res["trivial_sector_borel_laplace"]) < 1e-20


@pytest.mark.slow
def test_resummed_trivial_sector_against_lawrence_rozansky_contour():
    from knotobs.continuation.level import sector_values

    r = borel_analysis("Sigma(2,3,7)", order=20, count=1, digits=20, K=10.5)
    lr = sector_values("Sigma(2,3,7)", 10.5, digits=25)[Fraction(0)]
    assert abs(r.resummation["trivial_sector_borel_laplace"] - lr) < 1e-20


def test_cli_borel_and_plot():
    run = CliRunner()
    res = run.invoke(app, ["borel", "Sigma(2,3,7)", "--order", "20", "--count", "2", "--digits", "12", "--json"])
    assert res.exit_code == 0, res.output
    d = json.loads(res.output)
    assert d["singularities"][0]["cs"] == "-1/168" and d["singularities"][0]["connections"][0]["real_form"] == "SL(2,R)"
    # Ohtsuki series of Sigma(2,3,7): 1, -6, 69, ... (lambda_1 = 6 lambda = -6; CONVENTIONS §9)
    assert d["ohtsuki_series"]["coefficients"][:3] == ["1", "-6", "69"]
    res = run.invoke(app, ["borel", "Sigma(2,3,5)", "--order", "20", "--count", "2", "--digits", "12", "--K", "6"])
    assert res.exit_code == 0 and "finite_level_value" in res.output
    res = run.invoke(app, ["borel", "Sigma(2,3,5)", "--order", "2000"])
    assert res.exit_code == 2


@pytest.mark.slow
def test_cli_plot_borel():
    f = os.path.join(tempfile.mkdtemp(), "b.png")
    res = CliRunner().invoke(app, ["plot", "borel", "Sigma(2,3,5)", "-o", f])
    assert res.exit_code == 0 and os.path.getsize(f) > 1000
