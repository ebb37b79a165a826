"""The typer application and the one error layer every command goes through.

Every invocation ends in exactly one of these ways (exit status in brackets):

* the result is printed (0; ``match`` with a mismatch: 1);
* a :class:`~knotobs.errors.KnotobsError` (bad input, work above the limits of
  :mod:`knotobs.guard`, a storage fault): one line ``error: ...`` on stderr (2);
* a usage error (unknown option, a value of the wrong type, a missing argument):
  one line ``error: ...`` naming the option and what is valid (2);
* anything else is a bug: one line ``error: internal error (...): please report it``
  (2), or the traceback when the global option ``--debug`` is given.

The global options ``--max-seconds`` and ``--max-memory`` set the limits of
:func:`knotobs.guard.limits` for the whole command (CONVENTIONS §16).
"""

from __future__ import annotations

import contextlib
import contextvars
import functools
import json
import sys
import traceback
from typing import Any, Callable, Iterator, Optional

import typer
from typer.core import TyperGroup

try:  # a standalone click is not a dependency of recent typer (which carries its own copy)
    import click
except ImportError:  # pragma: no cover - depends on what else is installed
    click = None

try:  # typer >= 0.20 carries its own copy of click; catch the exceptions of both
    from typer import _click as _typer_click
except ImportError:  # pragma: no cover - older typer uses click itself
    _typer_click = click


def _exc(name: str) -> tuple[type, ...]:
    found = set()
    for mod in (m for m in (click, _typer_click, typer) if m is not None):
        for where in (mod, getattr(mod, "exceptions", None)):
            cls = getattr(where, name, None)
            if isinstance(cls, type):
                found.add(cls)
    return tuple(found)


_NO_ARGS = _exc("NoArgsIsHelpError")
_USAGE = _exc("UsageError")
_CLICK = _exc("ClickException")
_ABORT = _exc("Abort")

from knotobs.errors import KnotobsError

__all__ = ["app", "emit", "handle_errors", "KnotobsGroup"]

#: Set by the global ``--debug`` option for the command being run.
_DEBUG: contextvars.ContextVar[bool] = contextvars.ContextVar("knotobs_cli_debug", default=False)


def _one_line(text: str) -> str:
    return " ".join(str(text).split())


def _usage_line(exc) -> str:
    """``error: ...`` for a usage error, naming the command whose ``--help`` lists what is valid."""
    msg = _one_line(exc.format_message())
    ctx = exc.ctx
    where = ctx.command_path if ctx is not None else "knotobs"
    return f"error: {msg} (see '{where} --help')"


def _report(exc: BaseException) -> None:
    if isinstance(exc, MemoryError):
        typer.echo("error: out of memory: the request needs more memory than this machine has;"
                   " ask for less (smaller sizes, fewer digits) or lower --max-memory so it is refused"
                   " before it starts", err=True)
        return
    if isinstance(exc, RecursionError):
        typer.echo("error: the input is nested too deeply to be read (Python's recursion limit);"
                   " simplify it", err=True)
        return
    typer.echo(f"error: internal error ({type(exc).__name__}: {_one_line(exc)[:200]}): please report it"
               " with the command line (rerun with 'knotobs --debug ...' for the traceback)", err=True)


class KnotobsGroup(TyperGroup):
    """The top-level group: runs the command and turns every failure into one ``error:`` line."""

    def main(self, args=None, prog_name=None, complete_var=None, standalone_mode=True, **extra):
        token = _DEBUG.set(False)
        try:
            code = self._run(args, prog_name, complete_var, **extra)
        finally:
            _DEBUG.reset(token)
        if not standalone_mode:
            return code
        sys.exit(code)

    def _run(self, args, prog_name, complete_var, **extra) -> int:
        try:
            rv = super().main(args=args, prog_name=prog_name, complete_var=complete_var,
                              standalone_mode=False, **extra)
            return rv if isinstance(rv, int) else 0
        except _NO_ARGS as exc:
            typer.echo(exc.ctx.get_help() if exc.ctx is not None else exc.format_message())
            return 0
        except _USAGE as exc:
            typer.echo(_usage_line(exc), err=True)
            return 2
        except _CLICK as exc:
            typer.echo(f"error: {_one_line(exc.format_message())}", err=True)
            return 2
        except _ABORT:
            typer.echo("error: aborted", err=True)
            return 130
        except KnotobsError as exc:
            typer.echo(f"error: {_one_line(exc)}", err=True)
            return 2
        except BrokenPipeError:
            return 1
        except Exception as exc:  # noqa: BLE001 - this is the last line of defence
            if _DEBUG.get():
                traceback.print_exception(type(exc), exc, exc.__traceback__, file=sys.stderr)
            else:
                _report(exc)
            return 2


app = typer.Typer(
    name="knotobs",
    cls=KnotobsGroup,
    help="Exact Wilson-loop observables of torus knots and links (Chern-Simons theory).",
    no_args_is_help=True,
    add_completion=False,
    pretty_exceptions_enable=False,
    rich_markup_mode=None,   # plain help: rich's markdown stack costs ~0.3 s of start-up
)


@app.callback()
def _global_options(
    ctx: typer.Context,
    max_seconds: Optional[float] = typer.Option(
        None, "--max-seconds", metavar="S",
        help="Refuse work estimated to take longer than S seconds (default 60; env KNOTOBS_MAX_SECONDS)."),
    max_memory: Optional[float] = typer.Option(
        None, "--max-memory", metavar="MB",
        help="Refuse work estimated to need more than MB megabytes (default 2048; env KNOTOBS_MAX_MEMORY_MB)."),
    debug: bool = typer.Option(False, "--debug", help="Show the traceback of an unexpected failure."),
) -> None:
    """Exact Wilson-loop observables of torus knots and links (Chern-Simons theory)."""
    from knotobs.guard import limits

    _DEBUG.set(debug)
    ctx.with_resource(limits(seconds=max_seconds, memory_mb=max_memory))


#: Global options that take a value (the others are flags).
_GLOBAL_VALUED = ("--max-seconds", "--max-memory")


def _command_name(info) -> str:
    return info.name or info.callback.__name__.replace("_", "-")


@contextlib.contextmanager
def only_command(typer_app: typer.Typer, args: list[str]) -> Iterator[None]:
    """Register only the command that ``args`` invoke while the command line runs.

    typer builds the parameters of every command (signatures, type hints) before it parses
    anything, about 30 ms for the fourteen commands of knotobs; one command needs only its own.
    Without a known command name (``--help``, a typo, no arguments) everything stays registered,
    so the listing and the suggestions are complete.

    >>> from knotobs.cli import app
    >>> with only_command(app, ["--max-seconds", "5", "space", "S^3"]):
    ...     [_command_name(c) for c in app.registered_commands], len(app.registered_groups)
    (['space'], 0)
    >>> len(app.registered_commands) > 5
    True
    """
    name, i = None, 0
    while i < len(args):
        tok = args[i]
        if tok in _GLOBAL_VALUED:
            i += 2
            continue
        if tok == "--debug" or any(tok.startswith(o + "=") for o in _GLOBAL_VALUED):
            i += 1
            continue
        if not tok.startswith("-"):
            name = tok
        break
    cmds = [c for c in typer_app.registered_commands if _command_name(c) == name]
    groups = [g for g in typer_app.registered_groups if g.name == name]
    if not (cmds or groups):
        yield
        return
    saved = typer_app.registered_commands, typer_app.registered_groups
    typer_app.registered_commands, typer_app.registered_groups = cmds, groups
    try:
        yield
    finally:
        typer_app.registered_commands, typer_app.registered_groups = saved


def handle_errors(func: Callable[..., Any]) -> Callable[..., Any]:
    """Turn a :class:`KnotobsError` into a one-line message and exit status 2."""

    @functools.wraps(func)
    def wrapper(*args: Any, **kwargs: Any) -> Any:
        try:
            return func(*args, **kwargs)
        except KnotobsError as exc:
            typer.echo(f"error: {_one_line(exc)}", err=True)
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
