"""U(N)_k = (SU(N)_k x U(1)_{NK})/Z_N on Seifert rational homology spheres (H_1 != 0 included).

Outside sources:

- B. Bakalov & A. Kirillov, Lectures on tensor categories and modular functors (AMS 2001),
  §3.1: the S and T of a modular category satisfy ``S = S^T``, ``S S^* = 1``,
  ``(ST)^3 = S^2`` (with ``T = theta exp(-2 pi i c/24)``), ``S^2`` a permutation, and the
  Verlinde formula gives non-negative integer fusion coefficients;
- M. Mariño, Commun. Math. Phys. 253 (2005) 25–49: ``Z_{U(N)}(S^3) = K^(-N/2) prod_{i<j} 2 sin(pi (j - i)/K)``;
- level–rank (common practice; S. Naculich & H. Schnitzer, JHEP 06 (2007) 023; P.-S. Hsin &
  N. Seiberg, JHEP 09 (2016) 095): ``U(N)_1`` and ``SU(N+1)_1`` are the same Z_{N+1} modular
  category (``c = N``, twists ``exp(2 pi i j(N+1-j)/(2(N+1)))``), so their invariants agree on
  every 3-manifold -- here against the SU(N+1) routes of knotobs (surgery/localisation);
- D. Gaiotto, A. Kapustin, N. Seiberg & B. Willett, JHEP 02 (2015) 172: gauging a one-form
  symmetry; the ``gauging`` route, compared with the ``quotient`` route;
- in integral homology spheres the Z_N quotient is invisible and U(N) = SU(N) x U(1) with the
  abelian Gaussian phase (E. Witten, Commun. Math. Phys. 121 (1989) §5): the product formula of
  :mod:`knotobs.evaluation.unitary_level`.
"""

from __future__ import annotations

import mpmath
import pytest

from knotobs.errors import KnotobsError
from knotobs.evaluation.seifert_routes import partition_function
from knotobs.evaluation.unitary_level import unitary_fiber_loop
from knotobs.evaluation.unitary_mtc import UnitaryModularData, unitary_partition_function, unitary_seifert_loop
from knotobs.numerics import working_precision

SPACES_H1 = ["L(2,1)", "L(3,1)", "L(4,1)", "L(6,1)", "L(5,2)", "M(0; -1; (2,1), (4,1), (6,1))",
             "M(0; -2; (2,1), (2,1), (3,1))", "M(0; 1; (3,1), (3,1), (3,-2))"]


@pytest.mark.parametrize("N,k", [(2, 1), (2, 3), (3, 1), (3, 3), (4, 1), (2, 5)])
def test_quotient_is_a_modular_category(N, k):
    md = UnitaryModularData(N, k)
    with working_precision(30):
        S = md.S(30)
        n = S.rows
        T = mpmath.diag([mpmath.expjpi(2 * (md.h(o) - md.central_charge / 24)) for o in md.objects])
        assert mpmath.mnorm(S * S.H - mpmath.eye(n), 1) < 1e-25
        assert mpmath.mnorm(S - S.T, 1) < 1e-25
        ST = S * T
        assert mpmath.mnorm(ST * ST * ST - S * S, 1) < 1e-24
        S2 = S * S
        assert all(sum(1 for j in range(n) if abs(S2[i, j]) > 1e-20) == 1 for i in range(n))
        # Verlinde: N_ab^c = sum_x S_ax S_bx conj(S_cx) / S_0x are non-negative integers
        for a in range(min(n, 6)):
            for b in range(min(n, 6)):
                for c in range(n):
                    v = mpmath.fsum(S[a, x] * S[b, x] * mpmath.conj(S[c, x]) / S[0, x] for x in range(n))
                    r = round(float(v.real))
                    assert abs(v - r) < 1e-20 and r >= 0
    assert md.size * N == md.su.size * md.K        # orbits of length N, no fixed points


@pytest.mark.parametrize("N,k", [(2, 1), (2, 3), (3, 1), (3, 3), (2, 5)])
def test_s3_marino(N, k):
    K = k + N
    z = unitary_partition_function("S^3", f"U({N})", k, digits=25, route="both")
    with working_precision(40):
        expect = mpmath.mpf(K) ** (-mpmath.mpf(N) / 2)
        for i in range(N):
            for j in range(i + 1, N):
                expect *= 2 * mpmath.sin(mpmath.pi * (j - i) / K)
        assert abs(z.numeric - expect) < mpmath.mpf(10) ** -24


@pytest.mark.parametrize("space", SPACES_H1 + ["Sigma(2,3,5)"])
@pytest.mark.parametrize("N", [2, 3])
def test_level_one_is_su_n_plus_one_level_one(space, N):
    a = unitary_partition_function(space, f"U({N})", 1, digits=25).numeric
    b = partition_function(space, f"SU({N + 1})", 1, digits=25).numeric
    with working_precision(40):
        assert abs(a - b) < mpmath.mpf(10) ** -23


@pytest.mark.parametrize("space,N,k", [("L(2,1)", 2, 3), ("L(4,1)", 2, 3), ("L(6,1)", 3, 1), ("L(9,2)", 3, 3),
                                       ("M(0; -2; (2,1), (2,1), (3,1))", 2, 3), ("L(8,3)", 2, 5),
                                       ("M(0; -1; (2,1), (4,1), (6,1))", 2, 3)])
def test_quotient_equals_gauging(space, N, k):
    z = unitary_partition_function(space, f"U({N})", k, digits=20, route="both")
    assert z.details["agreement"] == "to 20 digits"


@pytest.mark.parametrize("space,N,k,regular,exceptional", [
    ("L(4,1)", 2, 3, [(1,)], {}),
    ("L(4,1)", 2, 1, [], {0: (1,)}),
    ("M(0; -2; (2,1), (2,1), (3,1))", 2, 3, [], {0: (1,), 2: (2,)}),
    ("L(6,1)", 3, 1, [(1, 1)], {}),
])
def test_loops_quotient_equals_gauging(space, N, k, regular, exceptional):
    w = unitary_seifert_loop(space, f"U({N})", k, regular=regular, exceptional=exceptional, digits=20, route="both")
    assert w.details["agreement"] == "to 20 digits"


@pytest.mark.parametrize("space,N,k,regular,exceptional", [
    ("Sigma(2,3,5)", 2, 3, [(1,)], {}),
    ("Sigma(2,3,5)", 2, 3, [], {1: (2, 1)}),
    ("Sigma(2,3,7)", 3, 1, [(1,)], {2: (1, 1)}),
    ("M(0; 0; (2,1), (3,-1))", 2, 3, [(2,)], {}),      # S^3, the trefoil as a regular fiber
])
def test_homology_spheres_product_formula_equals_quotient(space, N, k, regular, exceptional):
    w = unitary_fiber_loop(space, f"U({N})", k, regular=regular, exceptional=exceptional, digits=20, route="both")
    assert "both computed" in w.details["route"]


@pytest.mark.parametrize("space,regular,exceptional", [
    ("L(3,1)", [], {0: (1,)}), ("L(6,1)", [(1,)], {}), ("M(0; -2; (2,1), (2,1), (3,1))", [], {2: (1,)}),
    ("M(0; -2; (2,1), (2,1), (3,1))", [(1,)], {0: (1,)}), ("L(5,2)", [], {0: (1,)}),
])
def test_h1_loops_match_level_one_duality(space, regular, exceptional):
    """U(2)_1 = SU(3)_1: the fundamental of U(2) is an object of twist exp(2 pi i/3), as are [1] and
    [1,1] of SU(3)_1; the loop must equal one of the two SU(3)_1 loops (the surgery route, same
    framing 'fiber')."""
    from knotobs.evaluation.surgery import fiber_wilson_loop
    from knotobs.fibrations.seifert import parse_space

    w = unitary_fiber_loop(space, "U(2)", 1, regular=regular, exceptional=exceptional, digits=25)
    assert w.details["routes"] == ["quotient"]
    M = parse_space(space)
    cands = []
    for c in ((1,), (1, 1)):
        cands.append(fiber_wilson_loop(M, 1, "SU(3)", regular=[c] * len(regular),
                                       exceptional={j: c for j in exceptional}, digits=25).numeric)
    with working_precision(40):
        assert min(abs(w.numeric - c) for c in cands) < mpmath.mpf(10) ** -22


@pytest.mark.parametrize("call,match", [
    (lambda: unitary_partition_function("L(4,1)", "U(2)", 2), "spin theory"),
    (lambda: unitary_partition_function("S^2xS^1", "U(2)", 1), "infinite"),
    (lambda: unitary_partition_function("M(1; -1; (2,1), (3,1))", "U(2)", 1), "genus 0"),
    (lambda: unitary_partition_function("L(4,1)", "SU(2)", 1), "not U"),
    (lambda: unitary_partition_function("L(4,1)", "U(2)", 1, route="surgery"), "unknown route"),
    (lambda: unitary_seifert_loop("L(4,1)", "U(2)", 1, regular=[(1, 1, 1)]), "more than 2 rows"),
    (lambda: unitary_seifert_loop("L(4,1)", "U(2)", 1, regular=[(3,)]), "not integrable"),
    (lambda: unitary_seifert_loop("L(4,1)", "U(2)", 1, exceptional={3: (1,)}), "does not exist"),
    (lambda: unitary_fiber_loop("L(4,1)", "U(2)", 1, regular=[(1,)], framing="zero"), "framing 'fiber'"),
])
def test_refusals_name_the_value(call, match):
    with pytest.raises(KnotobsError, match=match):
        call()


def test_cli_space_and_loop_unitary():
    import subprocess
    import sys

    def run(*args):
        return subprocess.run([sys.executable, "-m", "knotobs", *args], capture_output=True, text=True)

    r = run("space", "L(4,1)", "--group", "U(2)", "--level", "3", "--route", "both", "--digits", "15")
    assert r.returncode == 0 and "quotient = gauging" in r.stdout, r.stdout + r.stderr
    r = run("loop", "--in", "L(4,1)", "--fiber", "1", "--group", "U(2)", "--level", "1", "--rep", "[1]", "--framing", "fiber")
    assert r.returncode == 0 and "U(2)" in r.stdout
    r = run("space", "L(4,1)", "--group", "U(2)", "--level", "2")
    assert r.returncode == 2 and r.stderr.startswith("error:") and "spin" in r.stderr


def test_top_level_api_reaches_the_unitary_routes():
    import knotobs
    from knotobs.fibrations.seifert import parse_space

    a = knotobs.partition_function("L(4,1)", "U(2)", 3, route="both")
    b = knotobs.partition_function(parse_space("L(4,1)"), "U(2)", 3)
    assert a.details["agreement"] and abs(a.numeric - b.numeric) < 1e-25
    w = knotobs.fiber_wilson_loop("L(4,1)", "U(2)", 3, rep=[1], fiber=1, route="both")
    assert "agreement" in w.details
