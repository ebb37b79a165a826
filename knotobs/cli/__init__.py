"""Command line of knotobs: parsing only.

Each command lives in a small module of this package, parses its options and
hands off to one public library function; rendering is done by
:mod:`knotobs.output`.  No mathematics happens here.
"""

from __future__ import annotations

import sys

import typer

from knotobs.cli._app import app
from knotobs.cli._fastparams import install as _install_fast_params

_install_fast_params()  # plain option values without typer's pydantic layer (start-up)

# Importing the command modules registers their commands on ``app``.
from knotobs.cli import loop_cmd as _loop_cmd  # noqa: F401,E402

from importlib import import_module as _import_module

# command modules written alongside (each registers its commands on ``app``)
for _name in ("fibers_cmd", "finite_cmd", "match_cmd", "grid_cmd", "continue_cmd", "qseries_cmd", "borel_cmd"):
    try:
        _import_module(f"knotobs.cli.{_name}")
    except ModuleNotFoundError as _exc:  # pragma: no cover - module not written yet
        if _exc.name != f"knotobs.cli.{_name}":
            raise

__all__ = ["app", "main"]


def main() -> None:
    """Entry point of the ``knotobs`` executable."""
    app(prog_name="knotobs")


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
