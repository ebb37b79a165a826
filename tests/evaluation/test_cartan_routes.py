"""Rosso–Jones and the weight-insertion sum for every group of the Cartan engine.

* The two routes agree exactly (Rosso–Jones, J. Knot Theory Ramifications 2 (1993) 97, for any
  simple Lie algebra; weight sum: Lawrence–Rozansky, Commun. Math. Phys. 205 (1999); Mariño,
  Commun. Math. Phys. 253 (2005); Stevan, Ann. Henri Poincaré 11 (2010); CONVENTIONS §3–§4) on a
  property-tested set of groups, representations, torus knots and links of both chiralities.
* The engine's SU(N) values equal the SU(N) fast paths of ``rosso_jones.py``/``weight_sum.py``.
* Isomorphisms of Lie algebras (common practice; e.g. W. Fulton, J. Harris, *Representation
  Theory*, GTM 129 (1991), §16.1, §19.3, §20.3): so(3) = su(2) (the vector is the 3-dimensional
  irrep), sp(2) = su(2), so(6) = su(4) (the vector is Lambda^2 C^4 = [1,1]), so(5) = sp(4) (the
  spinor of Spin(5) is the defining representation of Sp(4), the vector of SO(5) is [1,1] of Sp(4)).
"""

from __future__ import annotations

import pytest
from hypothesis import given, settings, strategies as st

from knotobs import wilson_loop
from knotobs.errors import InvalidRepresentationError, KnotobsError
from knotobs.evaluation.cartan_rosso_jones import rosso_jones_cartan
from knotobs.evaluation.cartan_weight_sum import weight_sum_cartan
from knotobs.evaluation.rosso_jones import rosso_jones
from knotobs.evaluation.weight_sum import weight_sum
from knotobs.fibrations.torus import TorusLink
from knotobs.representations.cartan import Dynkin, samples, simple_group
from knotobs.representations.groups import SU

KNOTS = [TorusLink(2, 3), TorusLink(2, -5), TorusLink(3, 4), TorusLink(3, -5), TorusLink(2, 7)]
LINKS = [TorusLink(2, 2), TorusLink(2, 4), TorusLink(3, 3), TorusLink(2, -6)]
CASES = [(g, lam) for g, reps in samples() for lam in reps]


@settings(max_examples=40, deadline=None)
@given(case=st.sampled_from(CASES), P=st.integers(2, 4), Q=st.integers(1, 7), sign=st.sampled_from([1, -1]),
       framing=st.sampled_from([0, 1, -2, "fiber"]))
def test_routes_agree_knots(case, P, Q, sign, framing):
    g, lam = case
    k = TorusLink(P, sign * Q)
    if k.components > 2 and g.roots.rank > 2:
        return                                      # kept small: the weight sum needs every weight
    assert rosso_jones_cartan(k, g, lam, framing) == weight_sum_cartan(k, g, lam, framing)


@pytest.mark.parametrize("k", LINKS, ids=str)
@pytest.mark.parametrize("g,lam", [(g, reps[0]) for g, reps in samples()], ids=lambda x: str(x))
def test_routes_agree_links(k, g, lam):
    assert rosso_jones_cartan(k, g, lam) == weight_sum_cartan(k, g, lam)


def test_routes_agree_mixed_link_colours():
    g = simple_group("Sp(4)")
    k = TorusLink(2, 4)
    reps = [Dynkin((1, 0)), Dynkin((0, 1))]
    assert rosso_jones_cartan(k, g, reps) == weight_sum_cartan(k, g, reps)


@pytest.mark.parametrize("k", KNOTS + LINKS, ids=str)
@pytest.mark.parametrize("N,lam", [(2, (1,)), (2, (2,)), (3, (1,)), (3, (2, 1)), (4, (1, 1)), (4, (2,))])
def test_engine_su_n_equals_fast_paths(k, N, lam):
    g = simple_group(f"SU({N})")
    a = rosso_jones_cartan(k, g, lam)
    assert a == rosso_jones(k, SU(N), lam)
    assert weight_sum_cartan(k, g, lam) == weight_sum(k, SU(N), lam)


@pytest.mark.parametrize("k", KNOTS + LINKS, ids=str)
def test_isomorphisms(k):
    rj = rosso_jones_cartan
    # so(3) = su(2): SO(3) vector = SU(2) colour of dimension 3
    assert rj(k, simple_group("SO(3)"), "[1]") == rosso_jones(k, SU(2), (2,))
    # sp(2) = su(2)
    assert rj(k, simple_group("Sp(2)"), "[1]") == rosso_jones(k, SU(2), (1,))
    assert rj(k, simple_group("Sp(2)"), "[2]") == rosso_jones(k, SU(2), (2,))
    # so(6) = su(4): vector = Lambda^2 = [1,1]; a spinor = [1]
    assert rj(k, simple_group("SO(6)"), "[1]") == rosso_jones(k, SU(4), (1, 1))
    assert rj(k, simple_group("Spin(6)"), "(0,0,1)") == rosso_jones(k, SU(4), (1,))
    # so(5) = sp(4): Spin(5) spinor = Sp(4) fundamental; SO(5) vector = Sp(4) [1,1]
    assert rj(k, simple_group("Spin(5)"), "(0,1)") == rj(k, simple_group("Sp(4)"), "[1]")
    assert rj(k, simple_group("SO(5)"), "[1]") == rj(k, simple_group("Sp(4)"), "[1,1]")


def test_unknot_and_normalisation():
    for g, reps in samples():
        for lam in reps[:1]:
            r = wilson_loop("T(1,5)", str(g), Dynkin(lam) if g.kind != "G2" else g.label_text(lam))
            from knotobs.representations.cartan import quantum_dimension

            assert r.value == quantum_dimension(g.roots, lam)


def test_wilson_loop_entry_point_and_route_both():
    r = wilson_loop("T(3,5)", "SO(5)", "[3]", route="both", normalized=True)
    assert r.group == "SO(5)" and r.colours == ((3, 0),)
    assert r.value.at_one() == 1
    assert "long roots of length^2 = 2" in r.profile.variable_map
    with pytest.raises(KnotobsError, match="route"):
        wilson_loop("T(2,3)", "SO(5)", "[1]", route="fast")
    with pytest.raises(InvalidRepresentationError, match="G2 has no partition"):
        wilson_loop("T(2,3)", "G2", "[1]")


def _cli(*args):
    from typer.testing import CliRunner

    from knotobs.cli import app

    return CliRunner().invoke(app, list(args))


def test_cli_loop_new_groups():
    import json

    out = _cli("loop", "T(2,3)", "--group", "SO(5)", "--rep", "[1]", "--route", "both", "--json")
    assert out.exit_code == 0, out.output
    data = json.loads(out.stdout)
    assert data["group"] == "SO(5)" and data["inputs"]["rep"] == ["(1,0)"]
    for args, needle in [(("--group", "SU(2"), "'SU(2'"), (("--group", "SO(2)"), "SO(2)"),
                         (("--group", "Sp(5)"), "Sp(5)"), (("--group", "G2", "--rep", "[1]"), "partition")]:
        out = _cli("loop", "T(2,3)", *args)
        assert out.exit_code == 2 and needle in out.output and "Traceback" not in out.output


def _extended_cases():
    """Every sample with every torus knot/link; links of more than two components only with small
    representations (the weight sum needs every weight of the tensor power)."""
    from knotobs.representations.cartan import weyl_dimension

    out = []
    for g, reps in samples("large"):
        for lam in reps:
            for pq in [(2, 9), (3, 7), (4, 5), (4, 7), (5, 6), (3, 6), (4, 4), (2, -8)]:
                if TorusLink(*pq).components > 2 and (g.roots.rank > 2 or weyl_dimension(g.roots, lam) > 20):
                    continue
                out.append((g, lam, pq))
    return out


@pytest.mark.slow
@pytest.mark.parametrize("g,lam,pq", _extended_cases(), ids=lambda x: str(x))
def test_routes_agree_extended(g, lam, pq):
    k = TorusLink(*pq)
    assert rosso_jones_cartan(k, g, lam) == weight_sum_cartan(k, g, lam)
