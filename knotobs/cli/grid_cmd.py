"""``knotobs grid run|resume|export|status``: tables of invariants in a resumable SQLite store."""

from __future__ import annotations

import re
import sys
from typing import Optional

import typer

from knotobs.cli._app import app, emit, handle_errors
from knotobs.errors import ParseError, SizeLimitError

grid_app = typer.Typer(help="Grids of invariants: run (resumable), resume, export, status.", no_args_is_help=True,
                       rich_markup_mode=None)
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
        from knotobs.tables.grid import torus_knots

        try:
            out += torus_knots(max_pq, links=links)
        except SizeLimitError as exc:
            raise SizeLimitError(str(exc).replace("max_pq = ", "--max-pq ").replace("max_pq <=", "--max-pq <=")) from None
    if not out:
        raise ParseError("give the knots: --knots 'T(2,3),T(3,4)' and/or --max-pq N (all torus knots with P*Q <= N)")
    if links and max_pq is None:
        raise ParseError("--links: applies with --max-pq N (it adds the torus links with P*Q <= N)")
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
                raise ParseError(f"--level {tok!r}: cannot read the level: use 'generic' or a positive integer, e.g. generic,1,2,3") from None
    if not out:
        raise ParseError(f"--level {text!r} is empty: use 'generic' and/or positive integers, e.g. generic,1,2,3")
    return out


def _show(progress: Optional[bool]) -> bool:
    """Progress bar only on an interactive terminal unless asked for explicitly."""
    return sys.stderr.isatty() if progress is None else progress


def _remove_new_store(store: str) -> None:
    """Remove a store file (and its SQLite side files) that this command created."""
    import os

    for suffix in ("", "-journal", "-wal", "-shm"):
        try:
            os.remove(store + suffix)
        except OSError:
            pass


@grid_app.command("run")
@handle_errors
def run(
    knots: Optional[str] = typer.Option(None, "--knots", help="List of knots, e.g. 'T(2,3),T(2,5)'."),
    max_pq: Optional[int] = typer.Option(None, "--max-pq", help="Add all torus knots T(P,Q) with P*Q <= this."),
    links: bool = typer.Option(False, "--links", help="With --max-pq: include torus links."),
    group: Optional[str] = typer.Option(None, "--group", "-g", help="wilson-loop: SU(N) or U(N) (default SU(2))."),
    rep: Optional[str] = typer.Option(None, "--rep", "-r", help="Partitions separated by ';', e.g. '[1];[2];[2,1]' (default [1])."),
    color: Optional[str] = typer.Option(None, "--color", "-c", help="SU(2) dimensions instead of --rep, e.g. 2,3,4 (n means [n-1])."),
    level: str = typer.Option("generic", "--level", "-k", help="'generic' and/or levels k, e.g. generic,1,2,3."),
    quantity: str = typer.Option("wilson-loop", "--quantity", help="wilson-loop, colored-jones or homfly."),
    normalized: Optional[bool] = typer.Option(None, "--normalized/--unnormalized", help="Divide by the unknot (default: as the quantity is defined: wilson-loop unnormalized, colored-jones and homfly normalized)."),
    framing: int = typer.Option(0, "--framing", "-f", help="wilson-loop: framing of every component."),
    digits: Optional[int] = typer.Option(None, "--digits", "-d", help="Digits of level values (default 30; needs a level k in --level)."),
    store: str = typer.Option(DEFAULT_STORE, "--store", "-s", help="SQLite results store."),
    workers: int = typer.Option(2, "--workers", "-w", help="Local worker processes (0: in this process)."),
    scheduler: Optional[str] = typer.Option(None, "--scheduler", help="Dask scheduler address, e.g. tcp://127.0.0.1:8786."),
    progress: Optional[bool] = typer.Option(None, "--progress/--no-progress", help="Progress bar on stderr (default: when it is a terminal)."),
    old_reps: Optional[str] = typer.Option(None, "--reps", hidden=True),
    old_levels: Optional[str] = typer.Option(None, "--levels", "-l", hidden=True),
    old_dps: Optional[int] = typer.Option(None, "--dps", hidden=True),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Compute a grid (skipping rows already in the store) and store every row."""
    import os

    from knotobs.cli import _inputs
    from knotobs.cli._options import check_renamed, refuse
    from knotobs.tables.grid import GridSpec, run_grid

    check_renamed(**{"--reps": (old_reps, "--rep"), "--levels": (old_levels, "--level/-k"),
                     "--dps": (old_dps, "--digits/-d")})
    q = quantity.lower()
    if framing and q != "wilson-loop":
        refuse("--framing", f"applies to --quantity wilson-loop; {q} is defined at zero framing")
    if rep is not None and color is not None:
        refuse("--color", "give the colors once: --rep PARTITIONS or --color DIMENSIONS")
    if color is not None:
        try:
            dims = [int(x) for x in color.split(",") if x.strip()]
        except ValueError:
            raise ParseError(f"--color {color!r}: write dimensions like 2,3,4") from None
        if not dims or min(dims) < 1:
            refuse("--color", f"{color!r}: dimensions are integers >= 1")
        if group is not None and group.replace(" ", "").upper() != "SU(2)":
            refuse("--color", f"{color!r} are SU(2) dimensions (n means [n-1]); for {group} give --rep,"
                              " partitions such as '[1];[2,1]' (or Dynkin labels for SU(N))")
        cols = [(d - 1,) if d > 1 else () for d in dims]
    else:
        cols = _inputs.reps(rep if rep is not None else "[1]", "--rep", one_allowed=False,
                            group=group if group is not None else ("SU(2)" if q == "wilson-loop" else None))
    norm = (q != "wilson-loop") if normalized is None else normalized
    levels = _levels(level)
    if group is not None and q == "colored-jones" and group.replace(" ", "").upper() != "SU(2)":
        refuse("--group", f"{group!r}: the colored Jones polynomial is the SU(2) invariant; use --quantity wilson-loop for other groups")
    if group is not None and q == "homfly":
        refuse("--group", "the HOMFLY-PT polynomial is the generic-N invariant; use --quantity wilson-loop for a fixed group")
    if digits is not None and all(k is None for k in levels):
        refuse("--digits", "sets the digits of values at a level k: give levels, e.g. --level generic,1,2,3")
    spec = GridSpec(_knots(knots, max_pq, links), group or "SU(2)", cols, levels, quantity, norm, framing,
                    30 if digits is None else digits)
    existed = os.path.exists(store)
    try:
        rep_ = run_grid(spec, store, workers, _show(progress), scheduler)
    except BaseException:
        if not existed:
            _remove_new_store(store)   # a failed run leaves no store behind
        raise
    emit(rep_.to_json, rep_.describe, as_json)
    if not rep_.complete:
        raise typer.Exit(code=2)


@grid_app.command("resume")
@handle_errors
def resume(
    store: str = typer.Option(DEFAULT_STORE, "--store", "-s", help="SQLite results store."),
    workers: int = typer.Option(2, "--workers", "-w", help="Local worker processes."),
    scheduler: Optional[str] = typer.Option(None, "--scheduler", help="Dask scheduler address."),
    progress: Optional[bool] = typer.Option(None, "--progress/--no-progress", help="Progress bar on stderr (default: when it is a terminal)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Finish every grid recorded in the store, computing only the missing rows."""
    import os

    from knotobs.tables.grid import resume_grid

    if not os.path.exists(store):
        raise ParseError(f"--store {store!r}: no such results store; start a grid with knotobs grid run --store {store}")
    reps = resume_grid(store, workers, _show(progress), scheduler)
    emit(lambda: {"kind": "grid-resume", "reports": [r.to_json() for r in reps]},
         lambda: "\n".join(r.describe() for r in reps), as_json)
    if not all(r.complete for r in reps):
        raise typer.Exit(code=2)


@grid_app.command("export")
@handle_errors
def export(
    store: str = typer.Option(DEFAULT_STORE, "--store", "-s", help="SQLite results store."),
    fmt: str = typer.Option("csv", "--format", help="csv, json, latex or table."),
    output: Optional[str] = typer.Option(None, "--output", "-o", help="Write to this file (default: print)."),
    old_out: Optional[str] = typer.Option(None, "--out", hidden=True),
    as_json: bool = typer.Option(False, "--json", help="Same as --format json."),
) -> None:
    """Export the stored rows as CSV, JSON, LaTeX (a multi-page longtable) or a terminal table."""
    from knotobs.cli._options import refuse, renamed
    from knotobs.output.schema import export_grid

    if old_out is not None:
        renamed("--out", "--output/-o", f"-o {old_out}")
    if as_json:
        if fmt not in ("csv", "json"):
            refuse("--json", f"is --format json; it cannot be combined with --format {fmt}")
        fmt = "json"
    import os

    if not os.path.exists(store):
        raise ParseError(f"--store {store!r}: the results store does not exist; run a grid first (knotobs grid run)")
    text = export_grid(store, fmt, output)
    if output is None:
        typer.echo(text, nl=False)
    else:
        typer.echo(f"wrote {output}", err=True)


@grid_app.command("status")
@handle_errors
def status(
    store: str = typer.Option(DEFAULT_STORE, "--store", "-s", help="SQLite results store."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Rows stored and, for every recorded grid, how many of its rows are missing."""
    import os

    from knotobs.tables.grid import grid_status

    if not os.path.exists(store):
        raise ParseError(f"--store {store!r}: the results store does not exist; run a grid first (knotobs grid run)")
    st = grid_status(store)
    lines = [f"{st['store']}: {st['rows']} rows"]
    for g in st["grids"]:
        lines.append(f"  grid of {g['points']} points ({g['quantity']}, {g['group']}): {g['missing']} missing")
    emit(st, "\n".join(lines), as_json)
