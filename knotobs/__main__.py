"""``python -m knotobs`` and the ``knotobs`` executable.

``knotobs --version`` answers before the command line (typer) or any mathematics is
imported, so it costs little more than starting Python.

>>> import subprocess, sys
>>> subprocess.run([sys.executable, "-m", "knotobs", "--version"], capture_output=True, text=True).stdout
'knotobs 0.3.0\\n'
"""

from __future__ import annotations

import sys


def main(argv=None) -> None:
    """Run the command line (``argv`` defaults to ``sys.argv[1:]``)."""
    args = sys.argv[1:] if argv is None else list(argv)
    if args in (["--version"], ["-V"]):
        from knotobs import __version__

        sys.stdout.write(f"knotobs {__version__}\n")
        return
    from knotobs.cli import app
    from knotobs.cli._app import only_command

    with only_command(app, args):
        app(args=args, prog_name="knotobs")


if __name__ == "__main__":  # pragma: no cover
    main()
