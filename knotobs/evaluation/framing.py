"""Framings of the components of a torus link.

A framing is an integer per component, measured against the Seifert (zero)
framing of that component.  Names accepted: ``"zero"`` (or ``"seifert"``) and
``"fiber"`` (the framing induced by the Seifert fibration of S^3 in which the
link is a union of regular fibers: ``P*Q`` on every component of ``T(dP, dQ)``,
with the sign of the chirality; docs/conventions.md §4–§5).
"""

from __future__ import annotations

from typing import Sequence, Union

from knotobs.errors import InvalidKnotError
from knotobs.fibrations.torus import TorusLink

__all__ = ["FramingSpec", "resolve_framing", "FRAMING_NAMES"]

FramingSpec = Union[int, str, Sequence[int], None]

FRAMING_NAMES = ("zero", "seifert", "fiber")


def resolve_framing(knot: TorusLink, framing: FramingSpec) -> tuple[int, ...]:
    """One integer framing per component.

    >>> resolve_framing(TorusLink(2, 3), "fiber"), resolve_framing(TorusLink(4, 6), 1)
    ((6,), (1, 1))
    >>> resolve_framing(TorusLink(3, -4), "fiber")
    (-12,)
    """
    d = knot.components
    if framing is None:
        return (0,) * d
    if isinstance(framing, str):
        name = framing.strip().lower()
        if name in ("zero", "seifert", "0"):
            return (0,) * d
        if name in ("fiber", "fibre"):
            return (knot.chirality * knot.P * knot.Q,) * d
        try:
            return (int(name),) * d
        except ValueError:
            raise InvalidKnotError(
                f"unknown framing {framing!r}: give an integer, a list of integers (one per"
                f" component) or one of {', '.join(FRAMING_NAMES)}"
            ) from None
    if isinstance(framing, int) and not isinstance(framing, bool):
        return (framing,) * d
    vals = tuple(framing)
    if len(vals) != d or not all(isinstance(v, int) and not isinstance(v, bool) for v in vals):
        raise InvalidKnotError(
            f"framing {list(vals)!r} must list one integer for each of the {d} components of {knot}"
        )
    return vals
