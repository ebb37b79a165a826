"""``knotobs match``: compare a computed invariant with a polynomial, or identify a polynomial."""

from __future__ import annotations

from typing import Optional

import typer

from knotobs.cli import _inputs
from knotobs.cli._app import app, emit, handle_errors
from knotobs.cli._options import refuse, renamed, rep_or_color
from knotobs.errors import ParseError


@app.command()
@handle_errors
def match(
    knot: Optional[str] = typer.Argument(None, help="Torus knot or link T(p,q) to compare; omit it to identify the polynomial."),
    poly: Optional[str] = typer.Option(None, "--poly", "-p", help="Polynomial in plain notation, e.g. 't + t^3 - t^4'."),
    file: Optional[str] = typer.Option(None, "--file", help="Read the polynomial from this text file."),
    knotinfo: bool = typer.Option(False, "--knotinfo", help="Compare with the database-knotinfo entry (optional extra)."),
    invariant: str = typer.Option("auto", "--invariant", "-i", help="auto, quantum, jones, homfly, alexander, conway or kauffman."),
    group: Optional[str] = typer.Option(None, "--group", "-g", help="SU(N) or U(N) for one-variable polynomials (default SU(2))."),
    rep: Optional[str] = typer.Option(None, "--rep", "-r", help="Compare: partition, e.g. [2,1]; links: [1];[2] per component."),
    color: Optional[int] = typer.Option(None, "--color", "-c", help="Compare: SU(2) n-dimensional irrep (= --rep [n-1])."),
    max_p: Optional[int] = typer.Option(None, "--max-p", help="Identify: largest P of T(P,Q) (default 5)."),
    max_q: Optional[int] = typer.Option(None, "--max-q", help="Identify: largest Q of T(P,Q) (default 12)."),
    max_boxes: Optional[int] = typer.Option(None, "--max-boxes", help="Identify: representations with at most this many boxes (default 2)."),
    links: Optional[bool] = typer.Option(None, "--links/--knots-only", help="Identify: include torus links (default: yes)."),
    old_max_colour: Optional[int] = typer.Option(None, "--max-colour", hidden=True),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Compare with a typed or tabulated polynomial (with KNOT), or identify a polynomial (without)."""
    if old_max_colour is not None:
        renamed("--max-colour", "--max-boxes", f"--max-boxes {old_max_colour}")
    from knotobs.tables.polyparse import read_polynomial

    if knot is not None:
        for opt, val in (("--max-p", max_p), ("--max-q", max_q), ("--max-boxes", max_boxes), ("--links", links)):
            if val is not None:
                refuse(opt if opt != "--links" else ("--links" if links else "--knots-only"),
                       "applies when identifying a polynomial (without KNOT)")
    else:
        for opt, val in (("--rep", rep), ("--color", color)):
            if val is not None:
                refuse(opt, "applies when comparing with KNOT; identification tries every representation up to --max-boxes")
    if knotinfo:
        for opt, val in (("--group", group), ("--rep", rep), ("--color", color)):
            if val is not None:
                refuse(opt, "the dataset tabulates the SU(2)/U(N) invariants of the fundamental representation")
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
        from knotobs.tables.identify import identify

        res = identify(target, invariant, group, 5 if max_p is None else max_p, 12 if max_q is None else max_q,
                       2 if max_boxes is None else max_boxes, True if links is None else links)
    elif knotinfo:
        if target is not None:
            raise ParseError("--knotinfo and --poly/--file are alternatives: compare with one of them")
        from knotobs.tables.compare import compare_knotinfo

        res = compare_knotinfo(knot, "jones" if invariant == "auto" else invariant)
    else:
        if target is None:
            raise ParseError(f"give a polynomial to compare {knot} with (--poly TEXT or --file PATH) or --knotinfo")
        from knotobs.tables.compare import compare

        res = compare(knot, target, group, rep_or_color(rep, color, group=group), invariant)
    emit(res.to_json, res.describe, as_json)
    if knot is not None and not res.equal:
        raise typer.Exit(code=1)
