"""``knotobs match``: compare a computed invariant with a polynomial, or identify a polynomial."""

from __future__ import annotations

from typing import Optional

import typer

from knotobs.cli import _inputs
from knotobs.cli._app import app, emit, handle_errors
from knotobs.errors import ParseError
from knotobs.tables.compare import compare, compare_knotinfo
from knotobs.tables.identify import identify
from knotobs.tables.polyparse import read_polynomial


def _reps(text: str):
    return _inputs.reps(text, "--rep")


@app.command()
@handle_errors
def match(
    knot: Optional[str] = typer.Argument(None, help="Torus knot or link T(p,q) to compare; omit it to identify the polynomial."),
    poly: Optional[str] = typer.Option(None, "--poly", "-p", help="Polynomial in plain notation, e.g. 't + t^3 - t^4'."),
    file: Optional[str] = typer.Option(None, "--file", help="Read the polynomial from this text file."),
    knotinfo: bool = typer.Option(False, "--knotinfo", help="Compare with the database-knotinfo entry (optional extra)."),
    invariant: str = typer.Option("auto", "--invariant", "-i", help="auto, quantum, jones, homfly, alexander, conway or kauffman."),
    group: str = typer.Option("SU(2)", "--group", "-g", help="SU(N) or U(N) for one-variable polynomials."),
    rep: str = typer.Option("[1]", "--rep", "-r", help="Partition, e.g. [2,1]; links: [1];[2] per component."),
    max_p: int = typer.Option(5, "--max-p", help="Identify: largest P of T(P,Q)."),
    max_q: int = typer.Option(12, "--max-q", help="Identify: largest Q of T(P,Q)."),
    max_colour: int = typer.Option(2, "--max-colour", help="Identify: colours with at most this many boxes."),
    links: bool = typer.Option(True, "--links/--knots-only", help="Identify: include torus links."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Compare with a typed or tabulated polynomial (with KNOT), or identify a polynomial (without)."""
    sources = [x for x in (poly, file) if x is not None]
    if len(sources) > 1:
        raise ParseError("give the polynomial once: either --poly TEXT or --file PATH")
    target = None
    if sources:
        target = read_polynomial(poly) if poly is not None else read_polynomial("@" + file)
    if knot is None:
        if knotinfo:
            raise ParseError("--knotinfo compares a knot with its dataset entry: give the knot, e.g. knotobs match T(2,3) --knotinfo")
        if target is None:
            raise ParseError("nothing to do: give a knot and --poly/--file/--knotinfo to compare, or --poly/--file alone to identify")
        res = identify(target, invariant, group, max_p, max_q, max_colour, links)
    elif knotinfo:
        if target is not None:
            raise ParseError("--knotinfo and --poly/--file are alternatives: compare with one of them")
        res = compare_knotinfo(knot, "jones" if invariant == "auto" else invariant)
    else:
        if target is None:
            raise ParseError(f"give a polynomial to compare {knot} with (--poly TEXT or --file PATH) or --knotinfo")
        res = compare(knot, target, group, _reps(rep), invariant)
    emit(res.to_json(), res.describe(), as_json)
    if knot is not None and not res.equal:
        raise typer.Exit(code=1)
