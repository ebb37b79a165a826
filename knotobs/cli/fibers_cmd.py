"""``knotobs fibers`` and ``knotobs space``: parsing only.

Each command calls one public library function
(:func:`knotobs.fibrations.fibration_of`, :func:`knotobs.fibrations.space_report`,
:func:`knotobs.evaluation.level_loops.level_partition_function`) and hands the result to
:mod:`knotobs.output.fibrations_text`.
"""

from __future__ import annotations

from typing import Optional

import typer

from knotobs.cli._app import app, emit, handle_errors
from knotobs.cli._options import refuse, renamed

__all__ = ["fibers", "space"]


@app.command("fibers")
@handle_errors
def fibers(
    knot: str = typer.Argument(..., help="T(p,q) (torus knot or link), or 'fiber' for a regular fiber of SPACE."),
    in_: str = typer.Option("S^3", "--in", help="S^3, L(p,q) (knot on the Heegaard torus), or any Seifert manifold."),
    fiber: Optional[int] = typer.Option(None, "--fiber", help="Study the core fiber i (numbered 1..n as printed) instead."),
    old_core: Optional[int] = typer.Option(None, "--core", hidden=True),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """The Seifert fibration in which KNOT is a fiber: invariants, cores, framings, linking."""
    if old_core is not None:
        renamed("--core", "--fiber i", "--fiber 1 for the first core printed")
    from knotobs.fibrations.refibration import fibration_of
    from knotobs.output.fibrations_text import fibered_knot_json, fibered_knot_text

    result = fibration_of(knot, in_)
    if fiber is not None:
        orders = [c.order for c in result.cores]
        if not 1 <= fiber <= len(orders):
            refuse("--fiber", f"{fiber}: the fibration of {knot} has cores 1..{len(orders)} (orders {orders})")
        order = orders[fiber - 1]
        if orders.count(order) > 1:
            refuse("--fiber", f"{fiber}: cores {[i + 1 for i, o in enumerate(orders) if o == order]} have the"
                              f" same order {order}; they are exchanged by a symmetry, study --fiber "
                              f"{orders.index(order) + 1}")
        result = fibration_of(knot, in_, core=order)
    inputs = {"knot": knot, "space": in_, "fiber": fiber}
    emit(lambda: fibered_knot_json(result, inputs), lambda: fibered_knot_text(result), as_json)


@app.command("space")
@handle_errors
def space(
    space_: Optional[str] = typer.Argument(
        None, metavar="SPACE", help="S^3, L(p,q), Sigma(a1,a2,a3) or M(g; b; (a1,b1), ...) (base genus g >= 0)."
    ),
    surgery: Optional[str] = typer.Option(None, "--surgery", help="A knot T(p,q) in S^3 to do surgery on."),
    slope: Optional[str] = typer.Option(None, "--slope", help="Surgery slope: integer or fraction like 5/2."),
    group: Optional[str] = typer.Option(None, "--group", "-g", help="With --level: SU(N) (default SU(2)), or SO(3) at odd level."),
    level: Optional[int] = typer.Option(None, "--level", "-k", help="Print the partition function Z_k."),
    digits: Optional[int] = typer.Option(None, "--digits", "-d", help="With --level: correct digits of the numeric value (default 30)."),
    route: Optional[str] = typer.Option(None, "--route", help="With --level: auto, surgery, gauss-sum (SU(2)), localisation, integral (SU(2), numeric, any level), convolution (SU(3), numeric, levels in the thousands) or both (two routes, agreement printed)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Seifert data of a manifold (normal form, e, |H_1|, name), or of r-surgery on a torus knot;
    with --level, its Chern-Simons partition function Z_k."""
    from knotobs.output.fibrations_text import space_json, space_text

    if level is None:
        for opt, val in (("--group", group), ("--digits", digits), ("--route", route)):
            if val is not None:
                refuse(opt, "needs --level k: without a level `space` prints the Seifert data only")
        from knotobs.fibrations.surgery import space_report

        report = space_report(space_, surgery=surgery, slope=slope)
        emit(lambda: space_json(report), lambda: space_text(report), as_json)
        return
    from knotobs.cli import _inputs
    from knotobs.evaluation.level_loops import level_partition_function
    from knotobs.output.finite_text import finite_json, finite_text

    g = group or "SU(2)"
    d = _inputs.digits(30 if digits is None else digits)
    r = route or "auto"
    with _inputs.naming(f"{space_ or surgery} at --level {level}"):
        value, report = level_partition_function(space_, g, level, d, surgery=surgery, slope=slope, route=r)

    def payload():
        out = space_json(report)
        out.update(finite_json(value, {"space": space_, "surgery": surgery, "slope": slope,
                                       "group": g, "level": level, "digits": d, "route": r},
                               "partition-function"))
        return out

    name = report.recognised or space_ or f"{slope} surgery on {surgery}"
    emit(payload, lambda: finite_text(value, f"Z_k of {name}, {g} at level {level}") + "\n\n" + space_text(report),
         as_json)
