"""The user's request in their own words, for messages raised deep inside a computation.

A named family (``colored_jones``, ``homfly``) knows what the user asked for ("the
coloured Jones polynomial J_800 of T(3,4)"); the step that refuses oversized work (an
Adams operation, a dense sum) knows only internal data (partitions of ``3 * 799``
boxes).  :class:`labelled` sets the first for the duration of a call (per thread and
per asyncio task: a :class:`contextvars.ContextVar`), :func:`user_label` reads it, so a
refusal names the knot and the colour the user typed.

Examples
--------
>>> with labelled("J_800 of T(3,4)"):
...     user_label("psi^3 of [799]")
'J_800 of T(3,4)'
>>> user_label("psi^3 of [799]")
'psi^3 of [799]'
"""

from __future__ import annotations

from contextvars import ContextVar

__all__ = ["labelled", "user_label"]

_LABEL: ContextVar[str | None] = ContextVar("knotobs_request_label", default=None)


class labelled:
    """Context manager naming the user's request; the outermost label wins."""

    def __init__(self, text: str):
        self.text = text
        self._tok = None

    def __enter__(self):
        self._tok = _LABEL.set(self.text) if _LABEL.get() is None else None
        return self

    def __exit__(self, *exc):
        if self._tok is not None:
            _LABEL.reset(self._tok)
        return False


def user_label(default: str) -> str:
    """The label set by :class:`labelled`, or ``default``."""
    return _LABEL.get() or default
