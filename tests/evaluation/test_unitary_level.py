"""U(N) at finite level as (SU(N)_k x U(1)_{N(k+N)})/Z_N.

Second route: the exact U(N) polynomial (Rosso & Jones, J. Knot Theory Ramifications 2 (1993);
U(N) Casimir without the |lam|^2/N term, CONVENTIONS §2; M. Mariño, Commun. Math. Phys. 253
(2005)) evaluated at q = exp(2 pi i/(k+N)).  Abelian factor: Witten, Commun. Math. Phys. 121
(1989) §5 (common practice).
"""

from __future__ import annotations

import pytest

from knotobs.errors import KnotobsError
from knotobs.evaluation.unitary_level import unitary_fiber_loop, unitary_level_loop


@pytest.mark.parametrize("knot,N,k,rep", [
    ("T(2,3)", 2, 3, (1,)), ("T(2,4)", 3, 3, (1,)), ("T(2,4)", 3, 2, [(1,), (1, 1)]),
    ("T(3,3)", 2, 4, (1,)), ("T(2,5)", 3, 2, (2, 1)), ("T(2,3)", 3, 2, (1, 1, 1)),
    ("T(4,6)", 2, 3, (1,)),
])
@pytest.mark.parametrize("framing", [None, "fiber", 2])
def test_unitary_torus_links_equal_the_unitary_polynomial(knot, N, k, rep, framing):
    v = unitary_level_loop(knot, f"U({N})", k, rep, framing=framing, digits=25)
    assert v.details["polynomial_check"] < 1e-22
    assert v.details["U(1) level"] == N * (k + N)
    assert f"U(1)_{N * (k + N)})/Z_{N}" in v.normalisation and v.details["quotient"] == "Z_N"


def test_links_differ_from_su_n_by_the_linking_phase():
    # T(2,4): two unknots with linking number 2; charges 1 and 1, U(1) level 3*6 = 18:
    # the ratio to SU(3) is exp(2 pi i * 2/18) = q^(2/3), q = exp(2 pi i/6)
    from knotobs.evaluation.level_loops import level_loop
    import mpmath

    u = unitary_level_loop("T(2,4)", "U(3)", 3, (1,), digits=25)
    s = level_loop("T(2,4)", 3, "SU(3)", (1,), digits=25)
    assert abs(u.numeric / s.numeric - mpmath.expjpi(mpmath.mpf(2) * 2 / 18)) < 1e-12


def test_determinant_representation_of_a_knot_is_one():
    # (1,1,1) of U(3) is det: trivial SU(3) part, charge 3; a zero-framed knot gives 1
    v = unitary_level_loop("T(2,5)", "U(3)", 2, (1, 1, 1), digits=20)
    assert v.exact == 1


def test_fiber_loops_in_S3_presentation_agree_with_torus_knots():
    # S^3 = M(0; 0; (2,1), (3,-1)): regular fibers are T(2,3) in the fiber framing 6; two of
    # them form T(4,6) (CONVENTIONS §5, §7)
    a = unitary_fiber_loop((0, [(2, 1), (3, -1)]), "U(3)", 3, regular=[(1,)], digits=20)
    b = unitary_level_loop("T(2,3)", "U(3)", 3, (1,), framing="fiber", digits=20)
    assert abs(a.numeric - b.numeric) < 1e-18
    a2 = unitary_fiber_loop((0, [(2, 1), (3, -1)]), "U(2)", 3, regular=[(1,), (1,)], digits=20)
    b2 = unitary_level_loop("T(4,6)", "U(2)", 3, (1,), framing="fiber", digits=20)
    assert abs(a2.numeric - b2.numeric) < 1e-18


def test_poincare_sphere_fiber_and_torsion_cases():
    w = unitary_fiber_loop("Sigma(2,3,5)", "U(2)", 3, regular=[(1,)], digits=20)
    assert w.details["linking"] == [[30]]          # fiber framing -1/e = 30
    # H_1 != 0: the quotient category (tests/evaluation/test_unitary_seifert.py); even k is a
    # spin theory there and stays refused
    assert unitary_fiber_loop("L(5,1)", "U(2)", 3, regular=[(1,)]).details["routes"] == ["quotient"]
    with pytest.raises(KnotobsError, match="spin"):
        unitary_fiber_loop("L(5,1)", "U(2)", 2, regular=[(1,)])
    with pytest.raises(KnotobsError, match="more than 2 rows"):
        unitary_level_loop("T(2,3)", "U(2)", 3, (1, 1, 1))


def test_cli_loop_with_unitary_group():
    from typer.testing import CliRunner

    from knotobs.cli import app

    r = CliRunner().invoke(app, ["loop", "T(2,4)", "--group", "U(3)", "--level", "3"])
    assert r.exit_code == 0, r.output
    assert "U(1)_18)/Z_3" in r.output and "exact     -2" in r.output
    r = CliRunner().invoke(app, ["loop", "T(2,4)", "--group", "U(3)", "--level", "3", "--in", "L(5,1)"])
    assert r.exit_code == 2 and "error:" in r.output
