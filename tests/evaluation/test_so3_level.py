"""SO(3) at odd level: the integer-spin part of SU(2)_k (Kirby–Melvin, Invent. Math. 105 (1991) §8).

Checks against independent computations and published facts:

* the factorisation ``Z_{SU(2)_k}(M) = Z_{SO(3)_k}(M) Z_{SU(2)_1}(+-M)`` (``+`` for ``k = 1 mod 4``,
  the mirror for ``k = 3 mod 4``): Kirby–Melvin (1991), Theorem 8.10 (``tau_r = tau_3 tau'_r`` for odd
  ``r``; theorem number from memory), with both sides from knotobs' SU(2) surgery route, an
  independent code path;
* normalised Wilson loops of integer-spin colours along regular and exceptional fibers equal the
  SU(2) ones (same factorisation); in S^3 the Rosso–Jones value of SO(3) at ``q = exp(2 pi i/K)``;
* SO(3)_3 is the Fibonacci category (common practice; e.g. E. Rowell, R. Stong, Z. Wang, Commun.
  Math. Phys. 292 (2009) 343): ``Z(S^3) = 1/sqrt(1 + phi^2)`` and Verlinde dimensions 1, 2, 5, 15, 50
  in genus 0..4 (values from memory, recomputed here from ``phi``).
"""

from __future__ import annotations

import mpmath
import pytest

from knotobs.errors import KnotobsError, NotIntegrableError
from knotobs.evaluation.level_loops import level_loop, level_partition_function
from knotobs.evaluation.so3_level import (
    _Data,
    so3_fiber_wilson_loop,
    so3_level_loop,
    so3_partition_function,
)
from knotobs.evaluation.surgery import fiber_wilson_loop, partition_function
from knotobs.numerics import local_mp

SPACES = [
    (0, [(2, -1), (3, 1), (5, 1)]),       # Poincare sphere
    (0, [(2, -3), (3, 2), (7, 6)]),       # Sigma(2,3,7) as in CONVENTIONS §9 (X notation)
    (1, [(2, 1), (3, 1)]),
    (0, [(5, 2)]),                        # a lens space
    (-1, [(7, 3)]),
    (0, [(2, 1), (3, 1), (7, -5)]),
    (1, [(2, 1), (2, 1), (3, -1), (5, 2)]),
]


def _close(a, b, tol=1e-20):
    with mpmath.workdps(40):
        return abs(mpmath.mpc(a) - mpmath.mpc(b)) < tol * max(1, abs(mpmath.mpc(b)))


@pytest.mark.parametrize("space", SPACES, ids=str)
@pytest.mark.parametrize("k", [1, 3, 5, 7, 9, 11])
def test_factorisation_su2_equals_so3_times_level_one(space, k):
    z3 = so3_partition_function(space, k, digits=25).numeric
    z2 = partition_function(space, "SU(2)", k, digits=25).numeric
    z1 = partition_function(space, "SU(2)", 1, digits=25).numeric
    with mpmath.workdps(40):
        if k % 4 == 3:
            z1 = mpmath.conj(z1)
        assert _close(z2, z3 * z1)


@pytest.mark.parametrize("space", SPACES[:3] + SPACES[5:], ids=str)
@pytest.mark.parametrize("k,colour", [(3, 3), (5, 3), (7, 5), (9, 3)])
def test_fiber_loops_equal_su2(space, k, colour):
    rep = f"[{(colour - 1) // 2}]"
    su2 = (colour - 1,)
    try:
        a = so3_fiber_wilson_loop(space, k, regular=[rep], digits=25).numeric
    except KnotobsError as exc:                       # Z(M) = 0: then the SU(2) value vanishes too
        assert "Z(M) = 0" in str(exc)
        assert abs(partition_function(space, "SU(2)", k, digits=25).numeric) < 1e-20
        return
    b = fiber_wilson_loop(space, k, "SU(2)", regular=[su2], framing="fiber", digits=25).numeric
    assert _close(a, b)
    a = so3_fiber_wilson_loop(space, k, exceptional={0: rep}, digits=25).numeric
    b = fiber_wilson_loop(space, k, "SU(2)", exceptional={0: su2}, framing="fiber", digits=25).numeric
    assert _close(a, b)


@pytest.mark.parametrize("knot", ["T(2,3)", "T(2,5)", "T(3,4)", "T(3,-5)"])
@pytest.mark.parametrize("k", [3, 5, 7])
def test_s3_torus_knots(knot, k):
    v = so3_level_loop(knot, k, "[1]", digits=25)
    assert v.details["polynomial_check"] < 1e-20
    w = level_loop(knot, k, "SU(2)", (2,), digits=25)       # the same colour as an SU(2) colour
    assert _close(v.numeric, w.numeric)


def test_fibonacci():
    z = so3_partition_function((1, []), 3, digits=30).numeric          # S^3
    with mpmath.workdps(40):
        phi = (1 + mpmath.sqrt(5)) / 2
        assert _close(z, 1 / mpmath.sqrt(1 + phi**2))
    assert _close(so3_partition_function((0, []), 3).numeric, 1)      # S^2 x S^1
    # exactly: Z(S^3)^2 = 1/(1 + phi^2) = (5 - sqrt 5)/10
    from fractions import Fraction

    from knotobs.polynomials.cyclotomic import CyclotomicField, sqrt_rational

    e = so3_partition_function((1, []), 3).exact
    assert e is not None and e * e == CyclotomicField(1)(Fraction(1, 2)) - sqrt_rational(5) * Fraction(1, 10)
    assert so3_partition_function((0, []), 3).exact == CyclotomicField(1).one
    ctx = local_mp(30)
    data = _Data(3, ctx)
    dims = [ctx.fsum(data.S[0][i] ** (2 - 2 * g) for i in range(len(data.colours))) for g in range(5)]
    assert [int(ctx.nint(d.real)) for d in dims] == [1, 2, 5, 15, 50]
    assert all(abs(d - ctx.nint(d.real)) < 1e-25 for d in dims)
    # S' is real orthogonal
    n = len(data.colours)
    for i in range(n):
        for j in range(n):
            s = ctx.fsum(data.S[i][l] * data.S[l][j] for l in range(n))
            assert abs(s - (1 if i == j else 0)) < 1e-25


def test_bad_input():
    with pytest.raises(NotIntegrableError, match="odd k"):
        so3_partition_function((0, [(2, 1), (3, 1)]), 4)
    with pytest.raises(NotIntegrableError, match="not integrable"):
        so3_level_loop("T(2,3)", 3, "[2]")                 # spin 2 needs k >= 5
    with pytest.raises(KnotobsError, match="SO\\(5\\)"):
        level_loop("T(2,3)", 3, "SO(5)", "[1]")
    with pytest.raises(KnotobsError, match="route"):
        level_partition_function("S^3", "SO(3)", 3, route="gauss-sum")
    with pytest.raises(KnotobsError, match="Spin"):
        so3_level_loop("T(2,3)", 5, "(1)")                  # the spinor is not an SO(3) colour


def test_cli():
    from typer.testing import CliRunner

    from knotobs.cli import app

    r = CliRunner().invoke(app, ["loop", "T(2,3)", "--group", "SO(3)", "--level", "5", "--rep", "[1]", "--json"])
    assert r.exit_code == 0, r.output
    r = CliRunner().invoke(app, ["space", "Sigma(2,3,5)", "--group", "SO(3)", "--level", "3"])
    assert r.exit_code == 0 and "0.58" in r.output or "SO(3)" in r.output, r.output
    r = CliRunner().invoke(app, ["loop", "T(2,3)", "--group", "SO(3)", "--level", "4"])
    assert r.exit_code == 2 and "odd" in r.output


def test_cli_exceptional_fiber_matches_library():
    import json

    from typer.testing import CliRunner

    from knotobs.cli import app
    from knotobs.fibrations.seifert import parse_space

    r = CliRunner().invoke(app, ["loop", "--group", "SO(3)", "--level", "5", "--in", "Sigma(2,3,5)", "--fiber", "1",
                                 "--rep", "[1]", "--json"])
    assert r.exit_code == 0, r.output
    got = json.loads(r.stdout)["numeric"]
    ref = so3_fiber_wilson_loop(parse_space("Sigma(2,3,5)"), 5, exceptional={0: "[1]"}).numeric
    assert abs(complex(float(got["re"]), float(got["im"])) - complex(ref)) < 1e-12
