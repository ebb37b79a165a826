"""``knotobs fibers`` and ``knotobs space``: parsing only.

Each command calls one public library function
(:func:`knotobs.fibrations.fibration_of`, :func:`knotobs.fibrations.space_report`)
and hands the result to :mod:`knotobs.output.fibrations_text`.
"""

from __future__ import annotations

from typing import Optional

import typer

from knotobs.cli._app import app, emit, handle_errors
from knotobs.fibrations.refibration import fibration_of
from knotobs.evaluation.level_loops import level_partition_function
from knotobs.fibrations.surgery import space_report
from knotobs.output.finite_text import finite_json, finite_text
from knotobs.output.fibrations_text import (
    fibered_knot_json,
    fibered_knot_text,
    space_json,
    space_text,
)

__all__ = ["fibers", "space"]


@app.command("fibers")
@handle_errors
def fibers(
    knot: str = typer.Argument(..., help="T(p,q) (torus knot or link), or 'fiber' for a regular fibre of SPACE."),
    in_: str = typer.Option("S^3", "--in", help="S^3, L(p,q) (knot on the Heegaard torus), or any Seifert manifold."),
    core: Optional[int] = typer.Option(None, "--core", help="Study the core of this order of the same fibration."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """The Seifert fibration in which KNOT is a fibre: invariants, cores, framings, linking."""
    result = fibration_of(knot, in_, core=core)
    inputs = {"knot": knot, "space": in_, "core": core}
    emit(fibered_knot_json(result, inputs), fibered_knot_text(result), as_json)


@app.command("space")
@handle_errors
def space(
    space_: Optional[str] = typer.Argument(
        None, metavar="SPACE", help="S^3, L(p,q), Sigma(a1,a2,a3) or M(g; b; (a1,b1), ...) (base genus g >= 0)."
    ),
    surgery: Optional[str] = typer.Option(None, "--surgery", help="A knot T(p,q) in S^3 to do surgery on."),
    slope: Optional[str] = typer.Option(None, "--slope", help="Surgery slope: integer or fraction like 5/2."),
    group: str = typer.Option("SU(2)", "--group", "-g", help="With --level: SU(N)."),
    level: Optional[int] = typer.Option(None, "--level", "-k", help="Print the partition function Z_k."),
    digits: int = typer.Option(30, "--digits", help="With --level: correct digits of the numeric value."),
    route: str = typer.Option("auto", "--route", help="With --level: auto, surgery, gauss-sum (SU(2)), localisation or both (two routes, agreement printed)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Seifert data of a manifold (normal form, e, |H_1|, name), or of r-surgery on a torus knot;
    with --level, its Chern-Simons partition function Z_k."""
    if level is None:
        report = space_report(space_, surgery=surgery, slope=slope)
        emit(space_json(report), space_text(report), as_json)
        return
    value, report = level_partition_function(space_, group, level, digits, surgery=surgery, slope=slope,
                                             route=route)
    payload = space_json(report)
    payload.update(finite_json(value, {"space": space_, "surgery": surgery, "slope": slope,
                                       "group": group, "level": level, "digits": digits, "route": route},
                                      "partition-function"))
    name = report.recognised or space_ or f"{slope} surgery on {surgery}"
    text = finite_text(value, f"Z_k of {name}, {group} at level {level}")
    emit(payload, text + "\n\n" + space_text(report), as_json)
