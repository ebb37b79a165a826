"""The size and time guard: estimate before expensive work, refuse with the estimate.

Every expensive step in knotobs first estimates its running time and memory from
the sizes of its inputs (number of weights, partitions, fibers, digits, nodes,
grid points) and calls :func:`require`.  When the estimate exceeds the limits in
force the step raises :class:`~knotobs.errors.SizeLimitError` *before* any work is
done, with a message that names the estimate, the limit and what would be
accepted.  Nothing is refused that fits the limits.

The limits (defaults: 60 s and 2048 MB) are set, innermost first, by

1. :func:`limits` as a context manager (per thread and per asyncio task, since it
   is stored in a :class:`contextvars.ContextVar`); the CLI's ``--max-seconds`` and
   ``--max-memory`` options use it;
2. the environment variables ``KNOTOBS_MAX_SECONDS`` and ``KNOTOBS_MAX_MEMORY_MB``.

Estimates are deliberately simple: a count of elementary operations times the
cost of one operation of that kind on a typical two-core machine
(:data:`OPS_PER_SECOND`).  They aim at the right order of magnitude, which is
what a refusal needs.

Examples
--------
>>> from knotobs.guard import require, limits, seconds_for
>>> require("weight sum over 10 weights", seconds=seconds_for(10, "python"))
>>> with limits(seconds=1):
...     require("sum over 10^12 terms", seconds=seconds_for(10**12, "python"),
...             accepted="use a smaller level")
Traceback (most recent call last):
...
knotobs.errors.SizeLimitError: sum over 10^12 terms: estimated 5e+05 s, above the limit of 1 s; use a smaller level (or raise the limit: --max-seconds, KNOTOBS_MAX_SECONDS)
"""

from __future__ import annotations

import contextvars
import math
import os
from contextlib import contextmanager
from dataclasses import dataclass
from typing import Iterator, Optional

from knotobs.errors import SizeLimitError

__all__ = [
    "Limits",
    "current_limits",
    "limits",
    "require",
    "seconds_for",
    "OPS_PER_SECOND",
    "DEFAULT_SECONDS",
    "DEFAULT_MEMORY_MB",
]

#: Default limit on the estimated running time of one step, in seconds.
DEFAULT_SECONDS = 60.0
#: Default limit on the estimated memory of one step, in megabytes.
DEFAULT_MEMORY_MB = 2048.0

#: Rough throughput of one elementary operation of each kind (operations per second).
OPS_PER_SECOND = {
    "python": 2.0e6,   # one pure-Python arithmetic step on small ints/Fractions
    "numpy": 2.0e8,    # one element of a vectorised numpy operation
    "flint": 2.0e7,    # one python-flint call on small operands
    "ball": 2.0e5,     # one acb/mpmath operation at ~30 digits (cost grows with digits)
}


@dataclass(frozen=True)
class Limits:
    """The limits in force: ``seconds`` of estimated time, ``memory_mb`` of estimated memory."""

    seconds: float = DEFAULT_SECONDS
    memory_mb: float = DEFAULT_MEMORY_MB


_override: contextvars.ContextVar[Optional[Limits]] = contextvars.ContextVar(
    "knotobs_limits", default=None
)


def _env_float(name: str, default: float) -> float:
    text = os.environ.get(name)
    if text is None or not text.strip():
        return default
    try:
        value = float(text)
    except ValueError:
        raise SizeLimitError(
            f"environment variable {name}={text!r} is not a number: give a positive number"
        ) from None
    if not (value > 0 and math.isfinite(value)):
        raise SizeLimitError(f"environment variable {name}={text!r} must be a positive finite number")
    return value


def current_limits() -> Limits:
    """The limits in force here (context first, then environment, then defaults).

    >>> current_limits().seconds > 0
    True
    """
    lim = _override.get()
    if lim is not None:
        return lim
    return Limits(
        seconds=_env_float("KNOTOBS_MAX_SECONDS", DEFAULT_SECONDS),
        memory_mb=_env_float("KNOTOBS_MAX_MEMORY_MB", DEFAULT_MEMORY_MB),
    )


def _check_limit(name: str, value) -> Optional[float]:
    if value is None:
        return None
    try:
        v = float(value)
    except (TypeError, ValueError):
        raise SizeLimitError(f"{name} = {value!r} is not a number: give a positive number") from None
    if not (v > 0 and math.isfinite(v)):
        raise SizeLimitError(f"{name} = {value!r} must be a positive finite number")
    return v


@contextmanager
def limits(seconds=None, memory_mb=None) -> Iterator[Limits]:
    """Set the limits for the code inside the ``with`` block (this thread/task only).

    >>> with limits(seconds=5) as lim:
    ...     lim.seconds
    5.0
    """
    base = current_limits()
    s = _check_limit("--max-seconds", seconds)
    m = _check_limit("--max-memory", memory_mb)
    new = Limits(seconds=base.seconds if s is None else s, memory_mb=base.memory_mb if m is None else m)
    token = _override.set(new)
    try:
        yield new
    finally:
        _override.reset(token)


def seconds_for(ops: float, kind: str = "python") -> float:
    """Estimated seconds for ``ops`` elementary operations of ``kind`` (see :data:`OPS_PER_SECOND`).

    >>> seconds_for(2e6, "python")
    1.0
    """
    return float(ops) / OPS_PER_SECOND[kind]


def _fmt(x: float) -> str:
    return f"{x:.3g}" if x < 1e4 else f"{x:.1g}"


def require(what: str, *, seconds: float | None = None, memory_mb: float | None = None,
            accepted: str = "") -> None:
    """Refuse ``what`` before it starts when its estimate exceeds the limits in force.

    Parameters
    ----------
    what : str
        The step, named in the user's terms (``"SU(4) at level 200 on L(5,1): 1.9e6 weights"``).
    seconds, memory_mb : float, optional
        The estimates.
    accepted : str
        What would be accepted instead (``"use level <= 60"``).

    Raises
    ------
    SizeLimitError
        Naming the estimate, the limit and ``accepted``.
    """
    lim = current_limits()
    hint = f"; {accepted}" if accepted else ""
    if seconds is not None and seconds > lim.seconds:
        raise SizeLimitError(
            f"{what}: estimated {_fmt(seconds)} s, above the limit of {lim.seconds:g} s{hint}"
            " (or raise the limit: --max-seconds, KNOTOBS_MAX_SECONDS)"
        )
    if memory_mb is not None and memory_mb > lim.memory_mb:
        raise SizeLimitError(
            f"{what}: estimated {_fmt(memory_mb)} MB of memory, above the limit of "
            f"{lim.memory_mb:g} MB{hint} (or raise the limit: --max-memory, KNOTOBS_MAX_MEMORY_MB)"
        )
