"""``knotobs loop`` and ``knotobs poly``: exact torus-knot invariants."""

from __future__ import annotations

from typing import Optional

import typer

from knotobs.cli._app import app, emit, handle_errors
from knotobs.errors import ParseError
from knotobs.evaluation.families import alexander, colored_jones, homfly, homfly_at, jones, wilson_loop
from knotobs.evaluation.level_loops import level_loop
from knotobs.output.finite_text import finite_json, finite_text
from knotobs.output.text import render_polynomial
from knotobs.representations.partitions import parse_partition


def _reps(text: str):
    """``[2,1]`` or ``[2,1];[1]`` (one partition per component)."""
    parts = [p for p in text.split(";") if p.strip()]
    if len(parts) == 1:
        return parse_partition(parts[0])
    return [parse_partition(p) for p in parts]


def _framing(text: Optional[str]):
    if text is None:
        return 0
    if "," in text:
        try:
            return [int(x) for x in text.strip("[]() ").split(",")]
        except ValueError:
            raise ParseError(f"cannot read framing {text!r}: give an integer, a list like 1,0 or 'fiber'") from None
    return text


@app.command()
@handle_errors
def loop(
    knot: Optional[str] = typer.Argument(None, help="Torus knot or link, e.g. T(2,3) or T(4,6)."),
    group: str = typer.Option("SU(2)", "--group", "-g", help="SU(N) or U(N)."),
    rep: str = typer.Option("[1]", "--rep", "-r", help="Partition, e.g. [2,1]; links: [1];[2] per component."),
    framing: Optional[str] = typer.Option(None, "--framing", "-f", help="Integer, list (1,0) or 'fiber'. Default: zero framing."),
    normalized: bool = typer.Option(False, "--normalized", help="Divide by the unknot (default: unknot = dim_q)."),
    route: Optional[str] = typer.Option(None, "--route", help="Polynomial: rosso-jones (default), weight-sum or both. With --level: auto (default), surgery, localisation or both."),
    level: Optional[int] = typer.Option(None, "--level", "-k", help="Evaluate at level k (SU(N) only): exact cyclotomic + numeric."),
    in_: str = typer.Option("S^3", "--in", help="With --level: S^3, L(p,q), Sigma(a,b,c) or M(0; b; ...)."),
    fiber: Optional[int] = typer.Option(None, "--fiber", help="With --level and no KNOT: colour the core fiber with this index (from 0)."),
    digits: int = typer.Option(30, "--digits", help="With --level: correct digits of the numeric value."),
    raw: bool = typer.Option(False, "--raw", help="With --level: Z(M; L) itself, not divided by Z(M) (use when Z(M) = 0)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Wilson loop of a torus knot/link: exact polynomial in q, or its value at level k."""
    if level is None:
        if knot is None:
            raise ParseError("give a knot, e.g. knotobs loop 'T(2,3)' (or --level k --in SPACE --fiber i)")
        if in_ != "S^3" or fiber is not None:
            raise ParseError("--in and --fiber need --level k (polynomials in q are computed in S^3)")
        res = wilson_loop(knot, group, _reps(rep), _framing(framing), normalized, route or "rosso-jones")
        emit(res.to_json(), render_polynomial(res), as_json)
        return
    fr = _framing(framing) if framing is not None else None
    if route in ("rosso-jones", "weight-sum"):
        raise ParseError(f"--route {route} names a polynomial route; with --level use auto, surgery,"
                         " localisation or both")
    val = level_loop(knot, level, group, _reps(rep), in_, fiber, fr, not raw, digits, route or "auto")
    what = knot if knot is not None else f"core fiber {fiber} of {in_}"
    inputs = {"knot": knot, "space": in_, "fiber": fiber, "group": group, "rep": rep, "level": level,
              "framing": framing, "digits": digits, "raw": raw}
    title = f"Wilson loop of {what} in {in_}, {group} at level {level}, colour {rep}"
    emit(finite_json(val, inputs, "wilson-loop"), finite_text(val, title), as_json)


@app.command()
@handle_errors
def poly(
    knot: str = typer.Argument(..., help="Torus knot or link, e.g. T(2,3)."),
    family: str = typer.Option("jones", "--family", help="jones, colored-jones, homfly or alexander."),
    color: Optional[int] = typer.Option(None, "--color", help="Colour n of the coloured Jones polynomial (dimension)."),
    rep: Optional[str] = typer.Option(None, "--rep", help="Partition colouring the HOMFLY-PT polynomial, e.g. [2,1]."),
    t_is: str = typer.Option("q^-1", "--t", help="Variable map for Jones: t = q^-1 (standard) or t = q."),
    mirror: bool = typer.Option(False, "--mirror", help="Mirror image of the knot."),
    rank: Optional[int] = typer.Option(None, "--N", help="HOMFLY-PT only: specialise to SU(N), a = q^(N/2)."),
    form: Optional[str] = typer.Option(None, "--form", help="HOMFLY-PT only: az or aq (default az for [1], aq otherwise)."),
    unnormalized: bool = typer.Option(False, "--unnormalized", help="Do not divide by the unknot."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """A named polynomial (Jones, coloured Jones, HOMFLY-PT, Alexander) with its profile."""
    fam = family.lower().replace("_", "-")
    norm = not unnormalized
    if fam == "jones":
        res = jones(knot, t_is=t_is, mirror=mirror, normalized=norm)
    elif fam in ("colored-jones", "coloured-jones"):
        if color is None:
            raise ParseError("--family colored-jones needs --color N (N = dimension of the SU(2) irrep, N >= 1)")
        res = colored_jones(knot, color, t_is=t_is, mirror=mirror, normalized=norm)
    elif fam in ("homfly", "homfly-pt", "homflypt"):
        reps = _reps(rep) if rep else (1,)
        if rank is not None:
            res = homfly_at(knot, rank, reps, mirror=mirror)
        else:
            res = homfly(knot, reps, mirror=mirror, normalized=norm, form=form)
    elif fam == "alexander":
        res = alexander(knot, mirror=mirror)
    else:
        raise ParseError(f"unknown family {family!r}: choose jones, colored-jones, homfly or alexander")
    emit(res.to_json(), render_polynomial(res), as_json)
