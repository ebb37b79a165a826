"""Wilson loops of torus knots and links for SO(N), Spin(N), Sp(2n), G2 (and SU(N) on the engine).

The entry point :func:`simple_wilson_loop` picks one of the two exact routes of the Cartan engine,
:func:`~knotobs.evaluation.cartan_rosso_jones.rosso_jones_cartan` (Adams operations) or
:func:`~knotobs.evaluation.cartan_weight_sum.weight_sum_cartan` (Seifert fibration), or computes
both and checks that they agree (``route="both"``).  Conventions: ``docs/groups.md`` (§14) and
CONVENTIONS §3–§4: zero framing, unknot = ``dim_q``, ``theta(lam) = q^C(lam)`` with the Casimir
of long roots of length^2 = 2, ``q = exp(2 pi i/(k + h^vee))`` at level ``k``.
"""

from __future__ import annotations

from knotobs.evaluation.cartan_colours import labels_for
from knotobs.evaluation.cartan_rosso_jones import rosso_jones_cartan
from knotobs.evaluation.cartan_weight_sum import weight_sum_cartan
from knotobs.evaluation.framing import FramingSpec, resolve_framing
from knotobs.evaluation.profiles import NORMALISED, UNNORMALISED, Profile
from knotobs.evaluation.result import PolynomialResult
from knotobs.fibrations.torus import parse_knot
from knotobs.representations.cartan.characters import quantum_dimension
from knotobs.representations.cartan.group import simple_group
from knotobs.evaluation.two_routes import ROUTES, run_routes

__all__ = ["simple_wilson_loop", "CARTAN_ROUTES"]

CARTAN_ROUTES = ROUTES


def _value(knot, group, labels, framing, route):
    from knotobs.representations.cartan.group import Dynkin

    reps = [Dynkin(x) for x in labels]
    return run_routes(route, lambda: rosso_jones_cartan(knot, group, reps, framing),
                      lambda: weight_sum_cartan(knot, group, reps, framing), f"{knot}, {group}, {reps}")


def simple_wilson_loop(knot, group, rep="[1]", framing: FramingSpec = 0, normalized: bool = False,
                       route: str = "rosso-jones") -> PolynomialResult:
    """Exact Wilson loop of a torus knot or link for any group of the Cartan engine.

    Parameters
    ----------
    knot : TorusLink or str
    group : SimpleGroup or str
        ``"SO(N)"``, ``"Spin(N)"``, ``"Sp(2n)"``, ``"G2"`` (or ``"SU(N)"``).
    rep : str, Dynkin, partition, or one per component
        ``"(1,0)"`` (Dynkin labels) or ``"[1]"`` (partition, classical groups).
    framing, normalized, route
        As in :func:`knotobs.evaluation.families.wilson_loop`.

    Examples
    --------
    >>> r = simple_wilson_loop("T(2,3)", "SO(3)", "[1]", normalized=True)   # = J_3 of SU(2) at t = 1/q
    >>> r.exact_string()
    'q^-11 - q^-10 - q^-9 + q^-8 - q^-7 + q^-5 + q^-2'
    >>> simple_wilson_loop("T(2,3)", "G2", "(1,0)", route="both").value.at_one()
    7

    References
    ----------
    Rosso–Jones (1993); Stevan (2010); CONVENTIONS §3–§4; docs/groups.md (§14).
    """
    knot = parse_knot(knot)
    g = simple_group(group)
    labels = labels_for(knot, g, rep)
    frames = resolve_framing(knot, framing)
    w = _value(knot, g, labels, framing, route)
    if normalized:
        w = w.exact_div(quantum_dimension(g.roots, labels[0]))
    hv = g.dual_coxeter
    fr_note = ("fiber framing P*Q = %d of the Seifert fibration of S^3" % (knot.P * knot.Q)
               if isinstance(framing, str) and framing.lower().startswith("fib")
               else "zero (Seifert) framing" if all(f == 0 for f in frames) else "relative to the zero (Seifert) framing")
    profile = Profile(
        variables=("q",),
        variable_map=(f"q = exp(2 pi i/(k + {hv})) at level k (h^vee = {hv}); theta(lam) = q^C(lam),"
                      " C(lam) = (lam, lam + 2 rho)/2 with long roots of length^2 = 2"),
        framing=frames,
        framing_note=fr_note,
        normalisation=NORMALISED if normalized else UNNORMALISED,
        chirality="positive torus link" if knot.chirality > 0 else "negative (mirror) torus link",
        notes=(f"representations as Dynkin labels of {g.cartan_type} (Bourbaki labelling): "
               + "; ".join(g.label_text(x) for x in labels),),
    )
    return PolynomialResult(
        quantity="wilson-loop",
        knot=str(knot),
        group=str(g),
        colours=labels,
        value=w.canonical(),
        profile=profile,
        route=route,
        inputs={"knot": str(knot), "group": str(g), "rep": [g.label_text(x) for x in labels],
                "framing": list(frames), "normalized": normalized},
    )
