"""Route choice for Seifert partition functions and fiber loops (knotobs.evaluation.seifert_routes).

The routes are compared with each other (surgery: Reshetikhin-Turaev 1991 with CONVENTIONS §7, §9;
Lawrence-Rozansky Gauss sum, Commun. Math. Phys. 205 (1999); localisation, CONVENTIONS §10) and
with the Verlinde formula (E. Verlinde, Nucl. Phys. B 300 (1988)).
"""

import json

import mpmath
import pytest
from typer.testing import CliRunner

from knotobs.cli import app
from knotobs.errors import KnotobsError, SizeLimitError
from knotobs.evaluation.seifert_routes import fiber_wilson_loop, partition_function, route_estimates
from knotobs.guard import limits

runner = CliRunner()


def test_large_su2_level_is_answered_without_modular_data():
    # SU(2) at level 9998 has 9999 integrable weights; the surgery route would build a 9999 x 9999
    # S matrix.  auto must not refuse: the Gauss sum answers
    z = partition_function("Sigma(2,3,5)", "SU(2)", 9998, digits=15)
    assert z.details["routes"] == ["gauss-sum"]
    # the surgery route (S applied as a Fourier transform) answers too, and agrees with the
    # Lawrence-Rozansky Gauss sum (CONVENTIONS §9: the routes agree)
    zs = partition_function("Sigma(2,3,5)", "SU(2)", 9998, digits=15, route="surgery")
    assert abs(complex(zs.numeric) - complex(z.numeric)) < 1e-12
    # under a tight limit the refusal names the route and the size
    from knotobs.guard import limits

    with limits(seconds=0.01), pytest.raises(SizeLimitError) as exc:
        partition_function("Sigma(2,3,5)", "SU(2)", 9998, digits=15, route="surgery")
    assert "surgery" in str(exc.value) and "9999 integrable weights" in str(exc.value)


def test_cli_large_level():
    r = runner.invoke(app, ["space", "Sigma(2,3,5)", "--level", "9998", "--digits", "12"])
    assert r.exit_code == 0, r.output
    assert "route:" in r.output


def test_gauss_sum_is_su2_only():
    with pytest.raises(KnotobsError, match="localisation"):
        partition_function("Sigma(2,3,5)", "SU(3)", 3, route="gauss-sum")


@pytest.mark.parametrize("space", ["Sigma(2,3,5)", "M(0; -1; (2,1), (4,1), (6,1))", "L(7,2)"])
def test_both_agree_exactly(space):
    for N, k in [(2, 5), (3, 2)]:
        z = partition_function(space, f"SU({N})", k, route="both")
        assert z.details["agreement"].startswith("exact")
        assert len(set(z.details["routes"])) == 2


def test_both_prints_the_agreement():
    r = runner.invoke(app, ["space", "Sigma(2,3,5)", "--group", "SU(3)", "--level", "3", "--route", "both"])
    assert r.exit_code == 0, r.output
    assert "agreement:     surgery and localisation agree exactly (equal cyclotomic numbers)" in r.output
    assert r.output.count("equal cyclotomic numbers") == 1          # said once, not also on the route line
    r = runner.invoke(app, ["space", "Sigma(2,3,5)", "--group", "SU(3)", "--level", "3", "--route", "both",
                            "--json"])
    d = json.loads(r.output)
    assert d["details"]["agreement"].startswith("exact")


def test_auto_never_refuses_what_a_route_answers():
    # SU(3) at level 40 took ~16 s by the old surgery route (issue #9); within a 3 s limit auto must
    # answer (by whichever route fits) and agree with the independent localisation route
    with limits(seconds=3):
        z = partition_function("Sigma(2,3,5)", "SU(3)", 40, digits=20)
    assert z.details["routes"][0] in ("surgery", "localisation")
    with limits(seconds=3):
        loc = partition_function("Sigma(2,3,5)", "SU(3)", 40, digits=20, route="localisation")
    assert abs(loc.numeric - z.numeric) < 1e-18


def test_refusal_names_every_route_and_size():
    with limits(seconds=0.001):
        with pytest.raises(SizeLimitError) as exc:
            partition_function("Sigma(2,3,5)", "SU(4)", 30)
    msg = str(exc.value)
    assert "surgery" in msg and "localisation" in msg and "weights" in msg


def test_genus_one():
    z = partition_function("M(1; 0)", "SU(3)", 4)
    assert z.exact.as_cyclotomic().rational_value() == 15        # binom(k+2, 2) (Verlinde)
    try:
        b = partition_function("M(1; -1; (2,1), (3,1))", "SU(2)", 4, route="both")
    except KnotobsError as exc:                                   # until the surgery route has genus
        assert "two applicable routes" in str(exc)
    else:
        assert b.details["agreement"].startswith("exact")


def test_loops_both_routes():
    for space, reg, exc in [("Sigma(2,3,5)", [(2, 1)], {}), ("M(0; 0; (2,1), (3,-1))", [(1,)], {0: (1,), 1: (1,)}),
                            ("M(0; -1; (2,1), (4,1), (6,1))", [], {2: (2,)}), ("L(7,2)", [], {0: (1,)})]:
        w = fiber_wilson_loop(space, 2, "SU(3)", regular=reg, exceptional=exc, normalized=False, route="both")
        assert w.details["agreement"].startswith("exact"), space
        a = fiber_wilson_loop(space, 2, "SU(3)", regular=reg, exceptional=exc, normalized=False,
                              route="localisation")
        s = fiber_wilson_loop(space, 2, "SU(3)", regular=reg, exceptional=exc, normalized=False,
                              route="surgery")
        assert a.exact == s.exact and a.details["framings"] == s.details["framings"]


def test_cli_loop_route():
    r = runner.invoke(app, ["loop", "--in", "Sigma(2,3,5)", "--fiber", "2", "--level", "3", "--group", "SU(3)",
                            "--route", "both"])
    assert r.exit_code == 0, r.output
    assert "agreement:" in r.output
    r = runner.invoke(app, ["loop", "--in", "Sigma(2,3,5)", "--fiber", "2", "--level", "3", "--route", "weight-sum"])
    assert r.exit_code == 2 and "polynomial route" in r.output
    r = runner.invoke(app, ["loop", "T(2,3)", "--route", "both"])          # polynomial routes unchanged
    assert r.exit_code == 0, r.output


def test_unknown_route():
    with pytest.raises(KnotobsError, match="unknown route"):
        partition_function("S^3", "SU(2)", 3, route="fast")
    with pytest.raises(KnotobsError, match="unknown route"):
        fiber_wilson_loop("S^3", 3, "SU(2)", regular=[(1,)], route="gauss-sum")


def test_loops_when_h1_is_infinite():
    # S^2 x S^1: the regular fiber is the S^1 factor; Z(S^2 x S^1; lam) = dim of the space of
    # conformal blocks on S^2 with one puncture lam = delta_{lam, 0} (Verlinde 1988): W = 0 for lam != 0
    w = fiber_wilson_loop("S^2xS^1", 3, "SU(2)", regular=[(1,)], route="both", normalized=False)
    assert w.details["agreement"].startswith("exact") and w.exact.is_zero()
    # S^1 x Sigma_2 with the fundamental along the circle: odd number of fundamental punctures,
    # no conformal blocks (SU(2) fusion is Z/2-graded; common practice)
    r = runner.invoke(app, ["loop", "fiber", "--in", "M(2; 0)", "--level", "3"])
    assert r.exit_code == 0, r.output
    assert "exact     0" in r.output and "undefined (H_1 infinite)" in r.output
    # with the adjoint: the gluing formula sum_j S_0j^(1-2g) S_j,adj from the modular data (CONVENTIONS §7)
    import numpy as np
    from knotobs.evaluation.modular import ModularData
    S = ModularData(2, 4).S_numeric()
    ref = int(round(float(np.sum(S[0, :] ** (1 - 4) * S[:, 2]).real)))
    z = fiber_wilson_loop("M(2; 0)", 4, "SU(2)", regular=[(2,)], normalized=False)
    assert z.exact.as_cyclotomic().rational_value() == ref == 45
    # a core when e = 0: only the localisation route converts framings
    v = fiber_wilson_loop("M(0; -1; (2,1), (2,1))", 3, "SU(3)", exceptional={0: (1,)}, normalized=False)
    assert v.details["routes"] == ["localisation"]
