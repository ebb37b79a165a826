"""Command line of knotobs: parsing only.

Each command lives in a small module of this package, parses its options and
hands off to one public library function; rendering is done by
:mod:`knotobs.output`.  No mathematics happens here.
"""

from __future__ import annotations

import sys

import typer

from knotobs.cli._app import app

# Importing the command modules registers their commands on ``app``.
from knotobs.cli import loop_cmd as _loop_cmd  # noqa: F401,E402

try:  # commands that live in optional modules register themselves when present
    from knotobs.cli import fibers_cmd as _fibers_cmd  # noqa: F401
except ImportError:  # pragma: no cover - only while a module is being written
    pass

__all__ = ["app", "main"]


def main() -> None:
    """Entry point of the ``knotobs`` executable."""
    app(prog_name="knotobs")


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
