"""Wilson loops at level k: the gluing route against the exact polynomials, and the CLI.

CONVENTIONS §7 (verified there for SU(2)): for S^3 = M(0; (P,b1), (Q,b2)) with
P b2 + Q b1 = +1, the regular fiber coloured lam gives theta(lam)^(PQ) times the
Rosso-Jones value of T(P,Q) at q = exp(2 pi i/K): the fiber framing is P*Q.  The
polynomials themselves are checked against published formulas and the dataset in
tests/reference; here the finite-level gluing (modular data, S and T matrices) is
an independent computation of the same numbers.  An exceptional fiber of S^3 is an
unknot (common practice; Rolfsen, Knots and Links (1976)), so zero-framed it gives dim_q.
"""

import json

import mpmath
import pytest
from typer.testing import CliRunner

from knotobs import SU, TorusLink, rosso_jones
from knotobs.cli import app
from knotobs.errors import KnotobsError, NotIntegrableError
from knotobs.evaluation.level_loops import level_loop
from knotobs.evaluation.surgery import fiber_wilson_loop
from knotobs.fibrations.refibration import fibration_of
from knotobs.representations import quantum_dimension

runner = CliRunner()


def _alcove(N, k):
    """The level-k alcove of SU(N) as partitions: at most N-1 rows, lam_1 <= k (common practice)."""
    out = []

    def rec(prefix, maxpart):
        if len(prefix) == N - 1:
            out.append(tuple(x for x in prefix if x > 0))
            return
        for x in range(maxpart, -1, -1):
            rec(prefix + [x], x)

    rec([], k)
    return out


CASES = [(2, (2, 3), 3), (2, (2, 5), 4), (2, (3, 4), 5), (2, (2, 3), 8), (3, (2, 3), 2), (3, (3, 4), 3), (3, (2, 5), 2)]


@pytest.mark.parametrize("N,PQ,k", CASES)
def test_regular_fiber_equals_polynomial_in_fiber_framing(N, PQ, k):
    P, Q = PQ
    knot = TorusLink(P, Q)
    F = fibration_of(knot)
    K = k + N
    for lam in _alcove(N, k):
        v = fiber_wilson_loop(F.manifold, k, f"SU({N})", regular=[lam], framing="fiber", digits=25)
        poly = rosso_jones(knot, SU(N), lam, framing="fiber")  # theta^(PQ) * zero-framed value
        ref = poly.at_root_of_unity(K, dps=30)
        assert abs(v.numeric - ref) < mpmath.mpf(10) ** -20, (lam, v.numeric, ref)


@pytest.mark.parametrize("N,PQ,k", CASES[:4])
def test_zero_framing_default_and_links(N, PQ, k):
    P, Q = PQ
    for lam in _alcove(N, k)[:4]:
        v = level_loop(f"T({P},{Q})", k, f"SU({N})", lam, digits=20)
        assert v.details["polynomial_check"] < 1e-15
    # a two-component torus link T(2P, 2Q) with two colours
    v = level_loop(f"T({2 * P},{2 * Q})", k, f"SU({N})", [(1,), (1,)], digits=20)
    ref = rosso_jones(TorusLink(2 * P, 2 * Q), SU(N), (1,)).at_root_of_unity(k + N, dps=25)
    assert abs(v.numeric - ref) < 1e-15


@pytest.mark.parametrize("N,k", [(2, 3), (2, 7), (3, 2)])
def test_exceptional_fiber_of_s3_is_the_unknot(N, k):
    for idx in (0, 1):
        for lam in _alcove(N, k)[:3]:
            v = level_loop(None, k, f"SU({N})", lam, space=f"M(0; 0; (2,1), (5,-2))", fiber=idx, digits=20)
            ref = quantum_dimension(SU(N), lam).at_root_of_unity(k + N, dps=25)
            assert abs(v.numeric - ref) < 1e-15


def test_not_integrable_and_bad_fiber_are_clear_errors():
    with pytest.raises(NotIntegrableError, match="not integrable at level 1"):
        level_loop("T(2,3)", 1, "SU(2)", (2,))
    with pytest.raises(KnotobsError, match="fiber index 5"):
        level_loop(None, 3, "SU(2)", (1,), space="Sigma(2,3,5)", fiber=5)
    with pytest.raises(KnotobsError, match="not null-homologous"):
        level_loop("T(2,5)", 3, "SU(2)", (1,), space="L(7,2)", framing="zero")


def test_cli_level_json_fields():
    r = runner.invoke(app, ["loop", "T(2,3)", "--level", "3", "--json"])
    assert r.exit_code == 0, r.output
    d = json.loads(r.output)
    for key in ("exact", "root_of_unity", "numeric", "framing", "orientation", "normalisation"):
        assert key in d
    assert d["numeric"]["digits"] == 30
    # Jones polynomial at t = q^-1 = exp(-2 pi i/5), times [2] (unnormalised): Jones (1987) closed form
    t = mpmath.exp(-2j * mpmath.pi / 5)
    ref = (t + t**3 - t**4) * 2 * mpmath.cos(mpmath.pi / 5)
    assert abs(complex(float(d["numeric"]["re"]), float(d["numeric"]["im"])) - complex(ref)) < 1e-12
    r = runner.invoke(app, ["space", "Sigma(2,3,5)", "--level", "3", "--json"])
    assert r.exit_code == 0, r.output
    d = json.loads(r.output)
    assert d["recognised"] == "Sigma(2,3,5)" and "numeric" in d and d["h1_order"] == 1
    r = runner.invoke(app, ["loop", "T(2,3)", "--level", "1", "--rep", "[2]"])
    assert r.exit_code == 2 and "not integrable" in r.output


def test_regular_fiber_by_name_is_the_torus_knot():
    # S^3 = M(0; 0; (2,1), (3,-1)) has the positive trefoil as regular fiber (CONVENTIONS §5, §7)
    for k in (2, 3, 5):
        a = level_loop("fiber", k, "SU(2)", (1,), space="M(0; 0; (2,1), (3,-1))", digits=20).numeric
        b = level_loop("T(2,3)", k, "SU(2)", (1,), digits=20).numeric
        assert abs(a - b) < 1e-15
    with pytest.raises(KnotobsError, match="null-homologous"):
        level_loop("fiber", 3, "SU(2)", (1,), space="L(5,1)", framing="zero")


@pytest.mark.parametrize("N,k,lam", [(2, 3, (1,)), (2, 6, (2,)), (3, 2, (2, 1)), (3, 3, (1,))])
def test_polynomial_and_gluing_agree_exactly(N, k, lam):
    # the exact cyclotomic numbers of the two routes coincide (CONVENTIONS §3 and §7)
    from knotobs.evaluation.level_loops import polynomial_at_root_of_unity

    v = level_loop("T(2,5)", k, f"SU({N})", lam, digits=20)
    exact = v.exact.as_cyclotomic() if hasattr(v.exact, "as_cyclotomic") else v.exact
    poly = rosso_jones(TorusLink(2, 5), SU(N), lam)
    assert exact == polynomial_at_root_of_unity(poly, k + N)


def test_large_level_in_s3_needs_no_modular_data():
    # SU(3) at level 100 (5151 weights): a Seifert route answers (checked against the exact
    # polynomial inside level_loop); when no route fits the limits, the polynomial alone answers
    from knotobs.guard import limits

    ref = rosso_jones(TorusLink(2, 3), SU(3), (2, 1)).at_root_of_unity(103, dps=20)
    v = level_loop("T(2,3)", 100, "SU(3)", (2, 1), digits=15)
    assert "polynomial" in v.details["route"] or v.details.get("polynomial_check", 1) < 1e-12
    assert abs(v.numeric - ref) < 1e-13
    with limits(seconds=1e-3):
        v = level_loop("T(2,3)", 100, "SU(3)", (2, 1), digits=15)
    assert "polynomial" in v.details["route"]
    assert abs(v.numeric - ref) < 1e-13


def test_auto_takes_the_exact_polynomials_when_the_seifert_routes_are_slow():
    # SU(2) at level 10^5 in S^3: localisation is estimated at ~10-20 s, the two exact polynomial
    # routes (Rosso-Jones and the weight sum, equal as polynomials) at far less; auto takes them.
    # The value is [2] V(q^-1) with the Jones polynomial of the trefoil V(t) = t + t^3 - t^4
    # (V. Jones, Ann. of Math. 126 (1987) 335-388; the chirality is the library's, CONVENTIONS §3)
    import mpmath

    v = level_loop("T(2,3)", 100000, "SU(2)", (1,), digits=25)
    assert v.details["routes"] == ["Rosso-Jones", "weight-sum"]
    assert v.details["agreement"].startswith("exactly") and "estimated" in v.details["route_choice"]
    with mpmath.workdps(40):
        t = mpmath.expjpi(-2 / mpmath.mpf(100002))
        want = (mpmath.sqrt(t) + 1 / mpmath.sqrt(t)) * (t + t ** 3 - t ** 4)
        assert abs(v.numeric - want) < 1e-24
    # a cheap Seifert route is still taken (and checked against the polynomial)
    w = level_loop("T(2,3)", 30, "SU(3)", (2, 1), digits=20)
    assert w.details["routes"] != ["Rosso-Jones", "weight-sum"] and w.details["polynomial_check"] < 1e-15


def test_polynomial_check_over_the_limits_is_said_not_refused_after_the_work(monkeypatch):
    # the second route (the exact polynomial in S^3) is estimated before the Seifert route runs;
    # over the limits it is reported as not computed (the value still comes from the Seifert route)
    import knotobs.evaluation.estimates as est

    monkeypatch.setattr(est, "fixed_estimate", lambda *a, **k: (1e9, 1.0, "the polynomial"))
    v = level_loop("T(2,3)", 30, "SU(3)", (2, 1), digits=20)
    assert isinstance(v.details["polynomial_check"], str) and "not computed" in v.details["polynomial_check"]
    monkeypatch.undo()
    w = level_loop("T(2,3)", 30, "SU(3)", (2, 1), digits=20)
    assert abs(v.numeric - w.numeric) < 1e-18 and w.details["polynomial_check"] < 1e-15


def test_polynomial_at_an_integer_root_of_unity_reduced_mod_its_order():
    # a polynomial longer than the order of q is reduced mod y^n - 1 before it is evaluated; the
    # value equals the direct evaluation at the same (non-integer-typed) K
    import mpmath

    p = rosso_jones(TorusLink(2, 3), SU(2), (300,))
    a = p.at_root_of_unity(1002, dps=25)
    b = p.at_root_of_unity(mpmath.mpf(1002), dps=25)
    with mpmath.workdps(40):
        assert abs(a - b) < 1e-22 * abs(b)
