"""Flat-connection sectors of Seifert partition functions and the SL(2,C) sector sum.

Sources: the irreducible flat connections of the Poincare sphere appear in Z_K as
exp(2 pi i K CS) with K-independent amplitudes sqrt(2/5) sin(pi/5) and sqrt(2/5) sin(2 pi/5),
CS = -1/120, -49/120 mod 1 (Freed & Gompf, Commun. Math. Phys. 141 (1991); Fintushel & Stern,
Proc. London Math. Soc. 61 (1990); CONVENTIONS §9).  The SL(2,C) sum pairs holomorphic and
antiholomorphic blocks sector by sector (Witten, Commun. Math. Phys. 137 (1991); Gukov,
Commun. Math. Phys. 255 (2005)); its reality at tt = conj(t) and its conjugation symmetry are
properties of that construction.
"""

import json
from fractions import Fraction

import mpmath
import pytest
from typer.testing import CliRunner

from knotobs.cli import app
from knotobs.continuation.complex import sl2c_partition_function
from knotobs.continuation.level import sector_values
from knotobs.evaluation.surgery import partition_function
from knotobs.fibrations.seifert import parse_space


@pytest.fixture(autouse=True)
def _precision():
    # the values are correct to 25 digits; do the test arithmetic at that precision too
    with mpmath.workdps(30):
        yield


@pytest.mark.parametrize("K", [5, 7, 12, 31])
def test_poincare_sectors_have_the_published_amplitudes(K):
    v = sector_values("Sigma(2,3,5)", K, 25)
    assert set(v) == {Fraction(0), Fraction(71, 120), Fraction(119, 120)}
    amp = mpmath.sqrt(mpmath.mpf(2) / 5)
    assert abs(abs(v[Fraction(71, 120)]) - amp * mpmath.sin(2 * mpmath.pi / 5)) < 1e-20
    assert abs(abs(v[Fraction(119, 120)]) - amp * mpmath.sin(mpmath.pi / 5)) < 1e-20


@pytest.mark.parametrize("space", ["Sigma(2,3,5)", "Sigma(2,3,7)", "L(5,1)", "L(7,2)"])
def test_sectors_add_up_to_the_finite_level_value(space):
    for K in (4, 9):
        v = sector_values(space, K, 25)
        z = partition_function(parse_space(space), "SU(2)", K - 2, 25).numeric
        assert abs(sum(v.values()) - z) < 1e-20


def test_sl2c_sum_is_real_on_the_unitary_line_and_conjugation_symmetric():
    z = sl2c_partition_function("Sigma(2,3,7)", "9+1.5i,9-1.5i", digits=20)
    assert not z.notes
    assert abs(z.numeric.imag) < 1e-18 and z.numeric.real > 0
    # every sector, the non-unitary (SL(2,R)) connection at -1/168 included (issue 10; GMP arXiv:1605.07615)
    assert list(z.nonunitary) == [Fraction(167, 168)]
    direct = sum(abs(h) ** 2 for h, _ in list(z.sectors.values()) + list(z.nonunitary.values()))
    assert abs(z.numeric - direct) < 1e-15
    t, tt = mpmath.mpc(8, 1), mpmath.mpc(11, -0.5)
    a = sl2c_partition_function("Sigma(2,3,5)", (t, tt), digits=20).numeric
    b = sl2c_partition_function("Sigma(2,3,5)", (mpmath.conj(tt), mpmath.conj(t)), digits=20).numeric
    assert abs(a - mpmath.conj(b)) < 1e-15
    assert sl2c_partition_function("Sigma(2,3,5)", (t, tt), digits=10).notes  # outside the unitary range


def test_cli_continue_couplings_on_a_space():
    r = CliRunner().invoke(app, ["continue", "Sigma(2,3,5)", "--couplings", "10+2i,10-2i", "--digits", "12", "--json"])
    assert r.exit_code == 0, r.output
    d = json.loads(r.output)
    assert d["unitary"] is True and len(d["sectors"]) == 3 and "numeric" in d
