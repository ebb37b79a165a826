"""Tests of the continuation side: complex level, flat connections, asymptotics, q-series, SL(N,C).

Every check compares with something outside this package's own formulas: published values
(sources beside each check) or an independent route in another layer.
"""

from __future__ import annotations

import json
from fractions import Fraction

import mpmath
import pytest
from flint import fmpq_poly

from knotobs.continuation.asymptotics import compare_with_exact, contributions, predicted_exponent
from knotobs.continuation.complex import sl_wilson_loop, unitarity_note
from knotobs.continuation.flat import (
    brieskorn_signature,
    fintushel_stern_cs,
    flat_connections,
    irreducible_representations,
)
from knotobs.continuation.kashaev import growth_exponent, kashaev_invariant
from knotobs.continuation.level import DomainError, continued_partition_function, continued_Z, evaluate_polynomial
from knotobs.continuation.ohtsuki import ohtsuki_series
from knotobs.continuation.qseries import poincare_false_theta, poincare_series, tau_from_radial_limit
from knotobs.errors import KnotobsError
from knotobs.evaluation.families import jones, wilson_loop
from knotobs.evaluation.gauss_sum import lawrence_rozansky_direct
from knotobs.evaluation.surgery import partition_function
from knotobs.fibrations.seifert import parse_space

@pytest.fixture(autouse=True)
def _precision():
    with mpmath.workdps(40):
        yield


SPACES = ["Sigma(2,3,5)", "-Sigma(2,3,5)", "Sigma(2,3,7)", "L(5,1)", "L(7,2)", "S^3",
          "M(0; 0; (2,1), (3,1), (5,2))"]


# ----------------------------------------------------------------- level continuation
@pytest.mark.parametrize("space", SPACES)
@pytest.mark.parametrize("K", [3, 4, 7, 12])
def test_integer_K_equals_finite_value(space, K):
    # independent route: surgery formula (Reshetikhin-Turaev; Kirby-Melvin 1991), CONVENTIONS §9
    z = continued_Z(space, K, 30)
    w = partition_function(parse_space(space), level=K - 2, digits=35).numeric
    assert abs(z - w) < mpmath.mpf(10) ** -30 * max(abs(w), 1)


def test_orders_sharing_a_factor_continue_by_sectors():
    # The single finite Gauss sum of Lawrence-Rozansky needs pairwise coprime orders; with a shared
    # factor the sum splits into P/lcm sectors (CONVENTIONS §9), and the continuation at integer K
    # equals the surgery route (itself checked against the SU(2)_1 Gauss sum in
    # tests/evaluation/test_level_one.py).
    from knotobs.evaluation.surgery import partition_function as surgery_pf

    M = parse_space("M(0; -2; (2,1), (3,1), (4,1))")
    z = continued_Z(M, 5, 25)
    ref = surgery_pf(M, "SU(2)", 3, digits=25).numeric
    with mpmath.workdps(35):
        assert abs(z - ref) < mpmath.mpf(10) ** -22


def test_poincare_le_formula_at_integer_K():
    # Le's cyclotomic formula as quoted by Lawrence & Zagier, Asian J. Math. 3 (1999):
    # tau_K = (1-q)^-1 sum_{n>=0} q^n (q^{n+1}; q)_{n+1} at q = exp(2 pi i/K) (finite sum)
    for K in (5, 9, 14):
        with mpmath.workdps(40):
            q = mpmath.expjpi(mpmath.mpf(2) / K)
            tot = 0
            for n in range(0, K + 1):
                p = 1
                for j in range(n + 1, 2 * n + 2):
                    p *= 1 - q ** j
                tot += q ** n * p
            tau = tot / (1 - q)
            Z = tau * mpmath.sqrt(mpmath.mpf(2) / K) * mpmath.sin(mpmath.pi / K)
        assert abs(continued_Z("Sigma(2,3,5)", K, 30) - Z) < 1e-29


def test_holomorphic_cauchy_integral():
    # Cauchy: for holomorphic f the mean over a circle is f(centre) and the first Fourier
    # coefficient is r f'(centre); the circle lies between the integers 7 and 8.  The
    # continuation grows like exp(pi m^2 Im K/60) off the axis, hence the small radius.
    c = mpmath.mpc("7.5", "0")
    r = mpmath.mpf("0.05")
    n = 64
    with mpmath.workdps(30):
        pts = [c + r * mpmath.expjpi(2 * mpmath.mpf(j) / n) for j in range(n)]
        vals = [continued_Z("Sigma(2,3,5)", k, 25) for k in pts]
        mean = sum(vals) / n
        first = sum(v * mpmath.expjpi(-2 * mpmath.mpf(j) / n) for j, v in enumerate(vals)) / n
        centre = continued_Z("Sigma(2,3,5)", c, 25)
        h = mpmath.mpf("1e-8")
        deriv = (continued_Z("Sigma(2,3,5)", c + h, 25) - continued_Z("Sigma(2,3,5)", c - h, 25)) / (2 * h)
    assert abs(mean - centre) < 1e-15 * max(1, abs(centre))
    assert abs(first - r * deriv) < 1e-10 * max(1, abs(r * deriv))


def test_conjugation_under_orientation_reversal():
    # Z(-M) = conj Z(M) at integer K (CONVENTIONS §9); continued: Z_{-M}(K) = conj Z_M(conj K)
    K = mpmath.mpc("6.3", "0.2")
    a = continued_Z("Sigma(2,3,7)", K, 20)
    b = continued_Z("-Sigma(2,3,7)", mpmath.conj(K), 20)
    assert abs(a - mpmath.conj(b)) < 1e-18 * max(1, abs(a))


def test_precision_agreement_and_bad_input():
    a = continued_partition_function("L(7,2)", level="5.5+0.2i", digits=20).numeric
    b = continued_partition_function("L(7,2)", level="5.5+0.2i", digits=40).numeric
    assert abs(a - b) < 1e-19
    with pytest.raises(KnotobsError, match="cannot read level"):
        continued_partition_function("L(7,2)", level="five")
    with pytest.raises(DomainError, match="cut"):
        continued_partition_function("Sigma(2,3,5)", K="-0.001-3i")
    with pytest.raises(KnotobsError, match="H = 0") as exc:
        continued_partition_function("S^2xS^1", K=5)
    # the message says where S^1 x Sigma_g is continued (H = 0 with fibers: tests/test_continuation_zero_euler.py)
    assert "Verlinde polynomial by knotobs.continued_partition_function" in str(exc.value)


def test_polynomial_at_complex_q_and_K():
    # Jones polynomial of the trefoil t + t^3 - t^4 (Jones, Ann. Math. 126 (1987)), evaluated directly
    V = jones("T(2,3)").value
    z = evaluate_polynomial(V, q="0.3+0.4i", digits=25)
    t = mpmath.mpc("0.3", "0.4")
    assert abs(z - (t + t ** 3 - t ** 4)) < 1e-24
    K = mpmath.mpc("7.5", "0.3")
    z = evaluate_polynomial(V, K="7.5+0.3i", digits=25)
    with mpmath.workdps(40):
        t = mpmath.exp(2j * mpmath.pi / K)
        assert abs(z - (t + t ** 3 - t ** 4)) < 1e-24


# ----------------------------------------------------------------- flat connections
def test_poincare_cs_values():
    # Fintushel & Stern, Proc. London Math. Soc. 61 (1990): -1/120 and -49/120 mod 1
    t = flat_connections("Sigma(2,3,5)")
    irr = sorted(c.cs for c in t.connections if c.kind == "irreducible")
    assert irr == sorted([Fraction(-1, 120) % 1, Fraction(-49, 120) % 1])
    # amplitudes sqrt(2/5) sin(pi/5), sqrt(2/5) sin(2 pi/5) (Freed & Gompf, CMP 141 (1991); CONVENTIONS §9)
    amp = {c.cs: abs(c.amplitude) for c in t.connections if c.kind == "irreducible"}
    s = mpmath.sqrt(mpmath.mpf(2) / 5)
    assert abs(amp[Fraction(119, 120)] - s * mpmath.sin(mpmath.pi / 5)) < 1e-12
    assert abs(amp[Fraction(71, 120)] - s * mpmath.sin(2 * mpmath.pi / 5)) < 1e-12


@pytest.mark.parametrize("a", [(2, 3, 5), (2, 3, 7), (2, 3, 11), (2, 5, 7), (3, 4, 5), (2, 7, 9)])
def test_fintushel_stern_cs_matches_residue_sectors(a):
    # Fintushel-Stern cs = -e^2/(4 a1 a2 a3), e = sum l_j A/a_j (formula quoted from memory,
    # FS 1990 §2) against the Lawrence-Rozansky residue sectors (an independent route)
    reps = irreducible_representations(a)
    # rotation numbers of the normal form, written in the presentation without b first
    from knotobs.flat.chern_simons import rotation_numbers_without_b
    M = parse_space("Sigma(%d,%d,%d)" % a).normal_form()
    fs = sorted({fintushel_stern_cs(a, rotation_numbers_without_b(M, e, l)) for e, l in reps})
    lr = sorted({c.cs for c in contributions("Sigma(%d,%d,%d)" % a) if c.kind == "irreducible"})
    assert fs == lr


@pytest.mark.parametrize("space,lam", [("Sigma(2,3,5)", -1), ("Sigma(2,3,7)", -1),
                                       ("Sigma(2,3,11)", -2), ("Sigma(2,5,7)", -2)])
def test_first_ohtsuki_coefficient_is_six_casson(space, lam):
    # lambda_1 = 6 lambda (H. Murakami, Math. Proc. Camb. Phil. Soc. 115 (1994); Ohtsuki,
    # ibid. 117 (1995)); lambda = -1, -1, -2, -2 (Fintushel-Stern 1990; Neumann-Wahl 1990),
    # orientation: link of the singularity, lambda(Sigma(2,3,5)) = -1.
    s = ohtsuki_series(space, 6)
    assert s.coefficients[0] == 1
    assert s.coefficients[1] == 6 * lam
    a = parse_space(space).exceptional_orders
    # Casson = sigma(Milnor fibre)/8 (Fintushel-Stern 1990) with Brieskorn's signature count
    assert Fraction(brieskorn_signature(a), 8) == lam
    # Casson = -(number of irreducible SU(2) classes)/2 for Brieskorn spheres (Fintushel-Stern 1990)
    assert Fraction(-len(irreducible_representations(a)), 2) == lam
    assert flat_connections(space).casson == lam
    assert ohtsuki_series("-" + space, 2).coefficients[1] == -6 * lam


def test_ohtsuki_series_poincare_against_le_formula():
    # Le's formula tau = (1-q)^-1 sum q^n (q^{n+1};q)_{n+1} expanded in x = q - 1
    # (Lawrence & Zagier, Asian J. Math. 3 (1999)); term n is O(x^n)
    N = 8
    x = fmpq_poly([0, 1])
    q = 1 + x

    def trunc(p, m):
        return fmpq_poly(p.coeffs()[:m])

    tot = fmpq_poly([0])
    for n in range(N + 1):
        prod = fmpq_poly([1])
        for j in range(n + 1, 2 * n + 2):
            prod = trunc(prod * (1 - q ** j), N + 2)
        c = prod.coeffs() + [0]
        prod = fmpq_poly([-a for a in c[1:]]) if len(c) > 1 else fmpq_poly([0])
        tot = trunc(tot + q ** n * prod, N + 1)
    le = [Fraction(int(c.p), int(c.q)) for c in tot.coeffs()][: N + 1]
    assert list(ohtsuki_series("Sigma(2,3,5)", N).coefficients) == le


def test_lens_space_abelian_sectors():
    # reducible flat connections of L(5,1): Hom(Z/5, U(1)) up to inversion, CS = n^2 r/p mod 1 type
    # values {0, 1/5, 4/5} (Jeffrey, CMP 147 (1992); common practice)
    t = flat_connections("L(5,1)")
    assert sorted(c.cs for c in t.connections) == [0, Fraction(1, 5), Fraction(4, 5)]
    assert t.casson is None


# ----------------------------------------------------------------- asymptotics
@pytest.mark.parametrize("space", ["Sigma(2,3,5)", "L(5,1)"])
@pytest.mark.parametrize("order", [0, 1, 2])
def test_asymptotic_error_rate(space, order):
    # Freed & Gompf, CMP 141 (1991): exact values approach the sum over flat connections;
    # the error after truncation falls like K^-e with e the first omitted power
    rows = compare_with_exact(space, [300, 400, 500], order=order, digits=30)
    e = float(predicted_exponent(space, order))
    import math

    slope = math.log(float(rows[0].error / rows[-1].error)) / math.log(500 / 300)
    assert slope >= e - 0.15
    assert rows[-1].error < rows[0].error


# ----------------------------------------------------------------- q-series
def test_poincare_qseries_radial_limit():
    # Lawrence-Zagier (1999): lim_{q -> xi} A(q) = 2 [1 + xi (1 - xi) tau_K], tau_K = Z/Z(S^3)
    for K in (5, 8, 13):
        tau = tau_from_radial_limit(K, 25)
        Z = continued_Z("Sigma(2,3,5)", K, 25)
        with mpmath.workdps(30):
            Zs3 = mpmath.sqrt(mpmath.mpf(2) / K) * mpmath.sin(mpmath.pi / K)
        assert abs(tau * Zs3 - Z) < 1e-22


def test_poincare_series_truncation_and_inside_disk():
    # A(q) = 1 + q + q^3 + q^7 - q^8 - q^14 - q^20 - q^29 + ... (Lawrence-Zagier 1999, from the
    # definition of chi_+)
    s = poincare_series(30)
    assert s.terms() == {0: 1, 1: 1, 3: 1, 7: 1, 8: -1, 14: -1, 20: -1, 29: -1}
    z = poincare_false_theta("0.2+0.3i", 30)
    assert abs(z - poincare_series(400).evaluate(mpmath.mpc("0.2", "0.3"), dps=35)) < 1e-28
    with pytest.raises(KnotobsError):
        poincare_false_theta("1.01")


# ----------------------------------------------------------------- Kashaev invariant
def test_kashaev_trefoil_against_zagier_sum():
    # Kashaev's invariant of the trefoil = sum_{n<N} (xi; xi)_n up to a root of unity
    # (Kashaev, Lett. Math. Phys. 39 (1997); Zagier, Topology 40 (2001)) -- compare moduli
    for N in (5, 9, 16):
        with mpmath.workdps(30):
            xi = mpmath.expjpi(mpmath.mpf(2) / N)
            s, p = 0, 1
            for n in range(N):
                s += p
                p *= 1 - xi ** (n + 1)
        assert abs(abs(kashaev_invariant("T(2,3)", N, 25)) - abs(s)) < 1e-20


@pytest.mark.parametrize("knot,period", [("T(2,3)", 12), ("T(2,5)", 20)])
@pytest.mark.parametrize("r", [1, 5])
def test_kashaev_growth(knot, period, r):
    # |<T(p,q)>_N| ~ C(N mod 4pq) N^(3/2) (Kashaev & Tirkkonen, Zap. Nauchn. Sem. POMI 269
    # (2000)): the amplitude depends on N through phases of period dividing 4pq, so sample one
    # residue class (2pq is enough for these two knots)
    g = growth_exponent(knot, [r + period * j for j in range(2, 6)])
    assert abs(g.exponent - 1.5) < 0.03


def test_kashaev_growth_t34_needs_period_4pq():
    # same source; for T(3,4) the residue classes mod 2pq = 24 mix two different amplitudes
    g = growth_exponent("T(3,4)", [5 + 48 * j for j in range(1, 5)])
    assert abs(g.exponent - 1.5) < 0.01


# ----------------------------------------------------------------- SL(N,C)
def test_sl_trivial_antiholomorphic_reduces_to_compact():
    # with lamt trivial the observable is the compact polynomial at q = exp(4 pi i/t)
    # (Witten, CMP 137 (1991); convention documented in complex.py)
    t = mpmath.mpc("9.3", "1.7")
    for N, lam in ((2, (2,)), (3, (2, 1))):
        w = sl_wilson_loop("T(2,5)", f"[{','.join(map(str, lam))}];[]", (t, "11-2i"), N=N, digits=25)
        W = wilson_loop("T(2,5)", f"SU({N})", lam).value
        assert abs(w.numeric - W.evaluate(log_x=4j * mpmath.pi / t, dps=30)) < 1e-22


def test_sl_conjugation_symmetry():
    # complex conjugation exchanges the labels (Zhelobenko 1973; Witten 1991):
    # conj W_(lam,lamt)(t, tt) = W_(lamt,lam)(conj tt, conj t)
    t, tt = mpmath.mpc("7.3", "1"), mpmath.mpc("5", "-2")
    a = sl_wilson_loop("T(3,4)", "[1];[2]", (t, tt), N=2, digits=20)
    b = sl_wilson_loop("T(3,4)", "[2];[1]", (mpmath.conj(tt), mpmath.conj(t)), N=2, digits=20)
    assert abs(mpmath.conj(a.numeric) - b.numeric) < 1e-17
    # real couplings (s imaginary): the swap (lam, lamt, t, tt) -> (lamt, lam, tt, t) conjugates
    a = sl_wilson_loop("T(2,3)", "[1];[3]", ("9", "13"), N=2, digits=20)
    b = sl_wilson_loop("T(2,3)", "[3];[1]", ("13", "9"), N=2, digits=20)
    assert abs(mpmath.conj(a.numeric) - b.numeric) < 1e-17


def test_sl_unitarity_notes():
    assert unitarity_note(10 + 2j, 10 - 2j) is None          # s real
    assert unitarity_note(12, 8) is None                      # s imaginary
    assert "not an integer" in unitarity_note(10.5 + 2j, 10.5 - 2j)
    w = sl_wilson_loop("T(2,3)", "[1];[1]", "7+1i,3", N=2, digits=15)
    assert w.notes and not w.to_json()["unitary"]


# ----------------------------------------------------------------- command line
def test_cli_flat_and_continue_json():
    from typer.testing import CliRunner

    from knotobs.cli import app

    r = CliRunner().invoke(app, ["flat", "Sigma(2,3,5)", "--json"])
    assert r.exit_code == 0, r.output
    js = json.loads(r.output)
    assert {c["cs"] for c in js["connections"]} == {"0", "71/120", "119/120"}
    assert js["casson"] == -1
    assert js["ohtsuki"][:3] == ["1", "-6", "45"]
    r = CliRunner().invoke(app, ["continue", "Sigma(2,3,5)", "--K", "7", "--json", "--digits", "25"])
    assert r.exit_code == 0, r.output
    num = json.loads(r.output)["numeric"]
    assert num["digits"] == 25
    w = partition_function(parse_space("Sigma(2,3,5)"), level=5, digits=30).numeric
    assert abs(mpmath.mpc(mpmath.mpf(num["re"]), mpmath.mpf(num["im"])) - w) < 1e-23
    r = CliRunner().invoke(app, ["continue", "Sigma(2,3,5)", "--level", "x+y"])
    assert r.exit_code == 2 and "error:" in r.output
    r = CliRunner().invoke(app, ["continue", "T(2,3)", "--couplings", "10+2i,10-2i", "--json"])
    assert r.exit_code == 0 and json.loads(r.output)["unitary"] is True


def test_cli_plot(tmp_path):
    from typer.testing import CliRunner

    from knotobs.cli import app

    f = tmp_path / "zeros.png"
    r = CliRunner().invoke(app, ["plot", "zeros", "T(3,5)", "-o", str(f)])
    assert r.exit_code == 0 and f.stat().st_size > 1000
    r = CliRunner().invoke(app, ["plot", "zeros", "T(3,5)", "-o", str(tmp_path / "z.txt")])
    assert r.exit_code == 2 and "suffix" in r.output


def test_reduced_phases_give_the_tame_continuation():
    # Both phase choices agree at integers (exp(2 pi i K n) = 1) and are holomorphic; the reduced
    # one has exponential type <= pi, so by Carlson's theorem (F. Carlson 1914; common practice)
    # it is the unique continuation of that type.  Growth checked at Im K = 2.
    for K in (5, 8):
        a = continued_Z("Sigma(2,3,5)", K, 25)
        b = continued_Z("Sigma(2,3,5)", K, 25, phases="lawrence-rozansky")
        assert abs(a - b) < 1e-23
    K = mpmath.mpc(9.5, 2)
    tame = continued_Z("Sigma(2,3,5)", K, 20)
    wild = continued_Z("Sigma(2,3,5)", K, 20, phases="lawrence-rozansky")
    assert abs(tame) < mpmath.exp(mpmath.pi * 2) * 100
    assert abs(wild) > 1e100
