"""One highest weight per component of a torus link, for the groups of the Cartan engine."""

from __future__ import annotations

from knotobs.errors import InvalidKnotError, InvalidRepresentationError
from knotobs.fibrations.torus import TorusLink
from knotobs.representations.cartan.group import Dynkin, SimpleGroup
from knotobs.representations.cartan.rootsystem import Weight

__all__ = ["labels_for"]


def _is_single(rep) -> bool:
    if isinstance(rep, (str, Dynkin)):
        return ";" not in rep if isinstance(rep, str) else True
    try:
        items = list(rep)
    except TypeError:
        raise InvalidRepresentationError(
            f"representation {rep!r} is not readable: give Dynkin labels such as '(1,0)' or a partition such as '[1]'"
        ) from None
    return not items or all(isinstance(x, int) and not isinstance(x, bool) for x in items)


def labels_for(knot: TorusLink, group: SimpleGroup, rep) -> tuple[Weight, ...]:
    """Dynkin labels of the representation of every component.

    ``rep`` is one representation for all components (``"(1,0)"``, ``"[1]"``, ``Dynkin((1, 0))``,
    a partition tuple) or one per component (a list of those, or text ``"[1];(0,1)"``).

    >>> from knotobs.representations.cartan import simple_group
    >>> labels_for(TorusLink(2, 4), simple_group("SO(5)"), "[1];(0,2)")
    ((1, 0), (0, 2))
    """
    d = knot.components
    if _is_single(rep):
        return (group.highest_weight(rep),) * d
    items = [p for p in rep.split(";") if p.strip()] if isinstance(rep, str) else list(rep)
    if len(items) == 1:
        return (group.highest_weight(items[0]),) * d
    if len(items) != d:
        raise InvalidKnotError(
            f"{knot} has {d} component(s) but {len(items)} representations were given: give one for all"
            " components or one per component")
    return tuple(group.highest_weight(x) for x in items)
