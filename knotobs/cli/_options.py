"""Shared option handling of the commands: readers and refusals (docs/interface.md, §15).

Every option either takes effect or is refused with ``error: --OPTION ...: why it does not
apply``; an option renamed by the vocabulary is refused with the new name.  No mathematics.
"""

from __future__ import annotations

from typing import Any, Optional

from knotobs.errors import KnotobsError, ParseError

__all__ = ["refuse", "renamed", "reps", "rep_or_color", "framing", "check_renamed"]


def refuse(option: str, why: str) -> None:
    """Raise the one-line error of an option that does not apply."""
    raise ParseError(f"{option}: {why}")


def renamed(old: str, new: str, example: str = "") -> None:
    """Raise the error of an option name the vocabulary replaced."""
    raise ParseError(f"{old} is not an option: use {new}" + (f" (e.g. {example})" if example else "")
                     + "; see docs/interface.md")


def check_renamed(**given: Any) -> None:
    """``check_renamed(**{"--dps": (value, "--digits")})``: refuse any old option that was given."""
    for old, (value, new) in given.items():
        if value is not None and value is not False:
            renamed(old, new)


def reps(text: str, option: str = "--rep", group: Optional[str] = None):
    """``[2,1]`` or ``[2,1];[1]`` (one partition per component), or SU(N) Dynkin labels ``(1,1)`` of
    ``group``; the checks of :func:`knotobs.cli._inputs.reps`."""
    from knotobs.cli._inputs import reps as _reps

    return _reps(text, option, group=group)


def _su2(group: Optional[str]) -> bool:
    return group is None or str(group).replace(" ", "").upper() == "SU(2)"


def rep_or_color(rep: Optional[str], color: Optional[int], default="[1]", group: Optional[str] = None):
    """The representation from ``--rep PARTITION`` (or Dynkin labels of ``group``) or ``--color n``
    (= ``--rep [n-1]``, SU(2) only)."""
    if rep is not None and color is not None:
        refuse("--color", "give the representation once: --rep PARTITION or --color n (= --rep [n-1])")
    if color is not None:
        if not _su2(group):
            refuse("--color", f"{color} is the SU(2) shorthand for --rep [{color - 1}]; for {group} give --rep,"
                              " a partition such as [2,1] (or Dynkin labels for SU(N))")
        if color < 1:
            refuse("--color", f"{color}: the dimension n of the SU(2) irrep is an integer >= 1")
        return (color - 1,) if color > 1 else ()
    return reps(rep if rep is not None else default, group=group)


def rep_text(rep: Optional[str], color: Optional[int], default: str = "[1]", group: Optional[str] = None) -> str:
    """The representation as the user would write it with ``--rep``; Dynkin labels with the partition
    they stand for (``(1,1) = [2,1]``)."""
    if color is not None:
        return f"[{color - 1}]" if color > 1 else "[]"
    text = rep if rep is not None else default
    if group is not None and "(" in text:
        try:
            parts = reps(text, group=group)
        except KnotobsError:                   # reported by the parse itself
            return text
        parts = parts if isinstance(parts, list) else [parts]
        return text + " = " + ";".join("[" + ",".join(map(str, p)) + "]" for p in parts)
    return text


def framing(text: Optional[str]):
    """``--framing``: an integer, a list ``1,0`` or ``fiber``/``zero``."""
    if text is None:
        return None
    t = text.strip()
    if "," in t:
        try:
            return [int(x) for x in t.strip("[]() ").split(",")]
        except ValueError:
            raise ParseError(f"--framing {text!r}: give an integer, a list like 1,0 or 'fiber'") from None
    if t.lstrip("+-").isdigit():
        return int(t)
    if t.lower() in ("fiber", "zero"):
        return t.lower()
    raise ParseError(f"--framing {text!r}: give an integer, a list like 1,0, 'zero' or 'fiber'")
