"""``knotobs qseries``: parsing only.

Calls :func:`knotobs.qseries.series.qseries_for` and renders with :mod:`knotobs.output.qseries_text`.
"""

from __future__ import annotations

from typing import Optional

import typer

from knotobs.cli._app import app, emit, handle_errors

__all__ = ["qseries"]


@app.command("qseries")
@handle_errors
def qseries(
    space: str = typer.Argument(
        ..., metavar="SPACE",
        help="Sigma(a1,...,an), L(p,q), M(0; b; (a1,b1), ...) with e < 0, or a negative definite"
             " plumbing Plumb(w_1,...,w_s : i-j, ...)."),
    label: Optional[str] = typer.Option(
        None, "--label", help="Label b: its number (0 = the class of deg mod 2), its vector (b_1,...,b_s), or 'all'."),
    order: int = typer.Option(..., "--order", help="Coefficients from q^0 to q^order after the prefactor."),
    K: Optional[int] = typer.Option(
        None, "--K", help="Also the radial limits at q -> exp(2 pi i/K) and Z_K(M) from them, beside the surgery route."),
    digits: Optional[int] = typer.Option(None, "--digits", "-d", help="With --K: correct digits (default 30)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """The q-series invariants Zhat_b(q) (exact integer coefficients, exact power of q in front)."""
    from knotobs.errors import KnotobsError
    from knotobs.output.qseries_text import qseries_json, qseries_text
    from knotobs.qseries.radial import radial_report
    from knotobs.qseries.series import qseries_for

    if digits is not None and K is None:
        raise KnotobsError("--digits applies to the radial limits: give --K as well")
    series = qseries_for(space, label, order)
    report = None
    if K is not None:
        report = radial_report(space, K, 30 if digits is None else digits, [z.label for z in series])
    inputs = {"space": space, "label": label, "order": order, "K": K, "digits": digits}
    title = f"Zhat_b(q) of {series[0].space}"
    emit(qseries_json(series, inputs, report), qseries_text(series, title, report), as_json)
