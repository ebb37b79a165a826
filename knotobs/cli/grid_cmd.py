"""``knotobs grid run|resume|export|status``: tables of invariants in a resumable SQLite store."""

from __future__ import annotations

import re
import sys
from typing import Optional

import typer

from knotobs.cli._app import app, emit, handle_errors
from knotobs.errors import ParseError, SizeLimitError
from knotobs.output.schema import EXPORT_FORMATS, export_grid
from knotobs.tables.grid import GridSpec, grid_status, resume_grid, run_grid, torus_knots

grid_app = typer.Typer(help="Grids of invariants: run (resumable), resume, export, status.", no_args_is_help=True)
app.add_typer(grid_app, name="grid")

_KNOT = re.compile(r"T\s*\(\s*[-+]?\d+\s*,\s*[-+]?\d+\s*\)", re.IGNORECASE)
DEFAULT_STORE = "knotobs-grid.sqlite"


def _knots(text: Optional[str], max_pq: Optional[int], links: bool) -> list[str]:
    out: list[str] = []
    if text:
        found = _KNOT.findall(text)
        rest = _KNOT.sub("", text).replace(",", " ").replace(";", " ").strip()
        if rest or not found:
            raise ParseError(f"cannot read knots {text!r}: write a list like 'T(2,3),T(2,5),T(3,4)'")
        out += found
    if max_pq is not None:
        if max_pq < 6:
            raise ParseError(f"--max-pq {max_pq}: the smallest torus knot is T(2,3) (P*Q = 6); give --max-pq >= 6")
        try:
            out += torus_knots(max_pq, links=links)
        except SizeLimitError as exc:
            raise SizeLimitError(str(exc).replace("max_pq = ", "--max-pq ").replace("max_pq <=", "--max-pq <=")) from None
    if not out:
        raise ParseError("give the knots: --knots 'T(2,3),T(3,4)' and/or --max-pq N (all torus knots with P*Q <= N)")
    return out


def _levels(text: str) -> list:
    out = []
    for tok in [t.strip() for t in text.split(",") if t.strip()]:
        if tok.lower() in ("generic", "q", "none"):
            out.append(None)
        else:
            try:
                out.append(int(tok))
            except ValueError:
                raise ParseError(f"cannot read level {tok!r}: use 'generic' or a positive integer, e.g. generic,1,2,3") from None
    if not out:
        raise ParseError(f"--levels {text!r} is empty: use 'generic' and/or positive integers, e.g. generic,1,2,3")
    return out


def _show(progress: Optional[bool]) -> bool:
    """Progress bar only on an interactive terminal unless asked for explicitly."""
    return sys.stderr.isatty() if progress is None else progress


@grid_app.command("run")
@handle_errors
def run(
    knots: Optional[str] = typer.Option(None, "--knots", "-k", help="List of knots, e.g. 'T(2,3),T(2,5)'."),
    max_pq: Optional[int] = typer.Option(None, "--max-pq", help="Add all torus knots T(P,Q) with P*Q <= this."),
    links: bool = typer.Option(False, "--links", help="With --max-pq: include torus links."),
    group: str = typer.Option("SU(2)", "--group", "-g", help="SU(N) or U(N)."),
    reps: str = typer.Option("[1]", "--reps", "-r", help="Colours separated by ';', e.g. '[1];[2];[2,1]'."),
    levels: str = typer.Option("generic", "--levels", "-l", help="'generic' and/or levels k, e.g. generic,1,2,3."),
    quantity: str = typer.Option("wilson-loop", "--quantity", help="wilson-loop, colored-jones or homfly."),
    unnormalized: bool = typer.Option(False, "--unnormalized", help="Do not divide by the unknot."),
    framing: int = typer.Option(0, "--framing", "-f", help="Framing of every component (wilson-loop)."),
    dps: int = typer.Option(30, "--dps", help="Digits of level values."),
    store: str = typer.Option(DEFAULT_STORE, "--store", "-s", help="SQLite results store."),
    workers: int = typer.Option(2, "--workers", "-w", help="Local worker processes (0: in this process)."),
    scheduler: Optional[str] = typer.Option(None, "--scheduler", help="Dask scheduler address, e.g. tcp://127.0.0.1:8786."),
    progress: Optional[bool] = typer.Option(None, "--progress/--no-progress", help="Progress bar on stderr (default: when it is a terminal)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Compute a grid (skipping rows already in the store) and store every row."""
    from knotobs.cli import _inputs

    spec = GridSpec(_knots(knots, max_pq, links), group, _inputs.reps(reps, "--reps", one_allowed=False),
                    _levels(levels), quantity, not unnormalized, framing, dps)
    rep = run_grid(spec, store, workers, _show(progress), scheduler)
    emit(rep.to_json(), rep.describe(), as_json)
    if not rep.complete:
        raise typer.Exit(code=2)


@grid_app.command("resume")
@handle_errors
def resume(
    store: str = typer.Option(DEFAULT_STORE, "--store", "-s", help="SQLite results store."),
    workers: int = typer.Option(2, "--workers", "-w", help="Local worker processes."),
    scheduler: Optional[str] = typer.Option(None, "--scheduler", help="Dask scheduler address."),
    progress: Optional[bool] = typer.Option(None, "--progress/--no-progress", help="Progress bar on stderr (default: when it is a terminal)."),
    as_json: bool = typer.Option(False, "--json"),
) -> None:
    """Finish every grid recorded in the store, computing only the missing rows."""
    reps = resume_grid(store, workers, _show(progress), scheduler)
    emit({"kind": "grid-resume", "reports": [r.to_json() for r in reps]}, "\n".join(r.describe() for r in reps), as_json)
    if not all(r.complete for r in reps):
        raise typer.Exit(code=2)


@grid_app.command("export")
@handle_errors
def export(
    store: str = typer.Option(DEFAULT_STORE, "--store", "-s", help="SQLite results store."),
    fmt: str = typer.Option("csv", "--format", help=f"One of {', '.join(EXPORT_FORMATS)}."),
    out: Optional[str] = typer.Option(None, "--out", "-o", help="Write to this file (default: print)."),
) -> None:
    """Export the stored rows as CSV, JSON, LaTeX or a terminal table."""
    text = export_grid(store, fmt, out)
    if out is None:
        typer.echo(text, nl=False)
    else:
        typer.echo(f"wrote {out}", err=True)


@grid_app.command("status")
@handle_errors
def status(
    store: str = typer.Option(DEFAULT_STORE, "--store", "-s", help="SQLite results store."),
    as_json: bool = typer.Option(False, "--json"),
) -> None:
    """Rows stored and, for every recorded grid, how many of its rows are missing."""
    st = grid_status(store)
    lines = [f"{st['store']}: {st['rows']} rows"]
    for g in st["grids"]:
        lines.append(f"  grid of {g['points']} points ({g['quantity']}, {g['group']}): {g['missing']} missing")
    emit(st, "\n".join(lines), as_json)
