"""``knotobs borel``: the Borel plane of the trivial-connection series (parsing only)."""

from __future__ import annotations

from typing import Optional

import typer

from knotobs.cli._app import app, emit, handle_errors
from knotobs.errors import ParseError


@app.command()
@handle_errors
def borel(
    space: str = typer.Argument(..., help="Seifert rational homology sphere with pairwise coprime orders, e.g. Sigma(2,3,7)."),
    order: int = typer.Option(40, "--order", help="Highest power of h in the exact series (number of coefficients - 1)."),
    count: int = typer.Option(4, "--count", help="Number of predicted singularities, nearest first."),
    digits: int = typer.Option(30, "--digits", "-d", help="Checked digits of the numbers printed."),
    K: Optional[str] = typer.Option(None, "--K", help="Resum at this shifted level K = k + 2 (an integer adds the finite-level check)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Singularities of the Borel transform (Pade, ratio test) against the CS values, Stokes constants, resummation."""
    from knotobs.resurgence.analysis import borel_analysis

    Kv = None
    if K is not None:
        try:
            Kv = int(K) if K.strip().lstrip("-").isdigit() else complex(K.replace("i", "j"))
        except ValueError:
            raise ParseError(f"--K {K!r}: give a number such as 12 or 12.5+0.5i") from None
        if isinstance(Kv, int) and Kv < 3:
            raise ParseError(f"--K {K}: the finite-level check needs an integer K >= 3")
    r = borel_analysis(space, order=order, count=count, digits=digits, K=Kv)
    if as_json:
        emit(r.to_json(), "", True)
        return
    from knotobs.output.borel_text import borel_text

    emit({}, borel_text(r), False)
