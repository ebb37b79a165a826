"""Validation of command-line values shared by the commands (parsing only, no mathematics).

Each helper either returns the value in the form the library takes or raises a
:class:`~knotobs.errors.ParseError` naming the option, what was typed and what is valid.
"""

from __future__ import annotations

import math
import os
import re
from contextlib import contextmanager
from pathlib import Path
from typing import Iterator, Optional

from knotobs.errors import InvalidRepresentationError, ParseError, SizeLimitError
from knotobs.precision import check_digits

__all__ = ["digits", "reps", "float_range", "output_path", "int_at_least", "naming"]


def digits(value, option: str = "--digits") -> int:
    """``--digits``: an integer from 1 to :data:`knotobs.precision.MAX_DIGITS`."""
    return check_digits(value, option)


def reps(text: Optional[str], option: str = "--rep", one_allowed: bool = True, group: Optional[str] = None):
    """``[2,1]`` (one partition) or ``[1];[2]`` (one per component); nothing empty or unbalanced.
    ``(1,1)`` are SU(N) Dynkin labels of ``group`` (:func:`knotobs.representations.partitions.parse_rep_for`)."""
    from knotobs.representations.partitions import parse_rep_for

    if text is None or not str(text).strip():
        raise ParseError(f"{option} {text!r} is empty: give a partition such as [1] or [2,1]"
                         " (links: one per component, [1];[2])")
    parts = str(text).split(";")
    out = []
    for p in parts:
        if not p.strip():
            raise ParseError(f"{option} {text!r} has an empty entry: separate partitions by one ';',"
                             " e.g. [1];[2]")
        try:
            out.append(parse_rep_for(p, group))
        except (ParseError, InvalidRepresentationError) as exc:
            raise type(exc)(f"{option} {text!r}: {exc}") from None
    if len(out) == 1 and one_allowed:
        return out[0]
    return out


def float_range(text: str, option: str) -> tuple[float, float]:
    """``a,b`` with finite ``a < b``."""
    try:
        a, b = (float(x) for x in str(text).split(","))
    except ValueError:
        raise ParseError(f"cannot read {option} {text!r}: write two numbers a,b with a < b, e.g. 3,12") from None
    if not (math.isfinite(a) and math.isfinite(b)):
        raise ParseError(f"{option} {text!r}: both ends must be finite numbers, e.g. 3,12")
    if not a < b:
        raise ParseError(f"{option} {text!r} is an empty range: give a,b with a < b, e.g. 3,12")
    return a, b


def int_at_least(value: int, low: int, option: str, why: str = "") -> int:
    """An integer ``>= low``."""
    if value < low:
        raise ParseError(f"{option} {value} is too small: give an integer >= {low}{'; ' + why if why else ''}")
    return value


def output_path(path: str, option: str = "--out") -> Path:
    """A file that can be written: its directory exists and is writable, and it is not a directory."""
    if path is None or not str(path).strip():
        raise ParseError(f"{option} is empty: give the file to write, e.g. figure.png")
    p = Path(path)
    if p.is_dir():
        raise ParseError(f"{option} {path!r} is a directory: give a file name inside it")
    parent = p.parent if str(p.parent) else Path(".")
    if not parent.is_dir():
        raise ParseError(f"{option} {path!r}: the directory {str(parent)!r} does not exist")
    if not os.access(parent, os.W_OK | os.X_OK) or (p.exists() and not os.access(p, os.W_OK)):
        raise ParseError(f"{option} {path!r}: no permission to write there; choose a writable directory")
    return p


@contextmanager
def naming(typed: str) -> Iterator[None]:
    """Prefix a size refusal with what the user typed, so the message names the user's input.

    The library's limits speak of the objects it builds (``partition [9999]`` for the Adams
    operation of ``[1]`` on ``T(9999,10000)``, the cyclotomic field of a level); this says
    which request needed them.
    """
    try:
        yield
    except SizeLimitError as exc:
        msg = str(exc)
        if msg.startswith(typed):
            raise
        m = re.match(r"partition \[.*\] has (\d+) boxes; at most (\d+) are supported$", msg)
        if m:
            msg = (f"the computation needs partitions of {m.group(1)} boxes (from the colour and the"
                   f" number of strands), above the supported {m.group(2)}")
        m = re.match(r"cyclotomic conductor (\d+) is larger than the supported (\d+)$", msg)
        if m:
            msg = (f"exact values at this level need roots of unity of order {m.group(1)}, above the"
                   f" supported {m.group(2)}; use a smaller level")
        raise SizeLimitError(f"{typed}: {msg}") from None
