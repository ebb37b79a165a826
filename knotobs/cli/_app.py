"""The typer application and the one error handler every command uses."""

from __future__ import annotations

import functools
import json
import sys
from typing import Any, Callable

import typer

from knotobs.errors import KnotobsError

app = typer.Typer(
    name="knotobs",
    help="Exact Wilson-loop observables of torus knots and links (Chern-Simons theory).",
    no_args_is_help=True,
    add_completion=False,
    pretty_exceptions_enable=False,
    rich_markup_mode=None,   # plain help: rich's markdown stack costs ~0.3 s of start-up
)


def handle_errors(func: Callable[..., Any]) -> Callable[..., Any]:
    """Turn a :class:`KnotobsError` into a one-line message and exit status 2."""

    @functools.wraps(func)
    def wrapper(*args: Any, **kwargs: Any) -> Any:
        try:
            return func(*args, **kwargs)
        except KnotobsError as exc:
            typer.echo(f"error: {exc}", err=True)
            raise typer.Exit(code=2)

    return wrapper


def emit(payload, text, as_json: bool) -> None:
    """Print either the JSON object or the human-readable text.

    ``payload`` and ``text`` may be callables: only the form asked for is built.
    """
    if as_json:
        sys.stdout.write(json.dumps(payload() if callable(payload) else payload, indent=2, sort_keys=False) + "\n")
    else:
        typer.echo(text() if callable(text) else text)
