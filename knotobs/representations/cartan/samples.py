"""A list of groups and representations spanning every family, for tests that run one body over all.

>>> [str(g) for g, _ in samples()][:4]
['SU(2)', 'SU(3)', 'SU(4)', 'SO(3)']
"""

from __future__ import annotations

from knotobs.representations.cartan.group import Dynkin, SimpleGroup

__all__ = ["samples"]


def samples(size: str = "small") -> list[tuple[SimpleGroup, tuple[Dynkin, ...]]]:
    """``(group, representations)`` pairs over the families A, B, C, D and G2.

    ``size="small"`` keeps every representation small enough for exhaustive tests.
    """
    D = Dynkin
    out = [
        (SimpleGroup("SU", 2), (D((1,)), D((2,)), D((3,)))),
        (SimpleGroup("SU", 3), (D((1, 0)), D((0, 1)), D((1, 1)), D((2, 0)))),
        (SimpleGroup("SU", 4), (D((1, 0, 0)), D((0, 1, 0)))),
        (SimpleGroup("SO", 3), (D((2,)), D((4,)))),
        (SimpleGroup("Spin", 5), (D((1, 0)), D((0, 1)), D((0, 2)), D((2, 0)), D((1, 1)))),
        (SimpleGroup("SO", 7), (D((1, 0, 0)), D((0, 1, 0)))),
        (SimpleGroup("Spin", 7), (D((0, 0, 1)),)),
        (SimpleGroup("Sp", 2), (D((1,)), D((2,)))),
        (SimpleGroup("Sp", 4), (D((1, 0)), D((0, 1)), D((2, 0)), D((1, 1)))),
        (SimpleGroup("Sp", 6), (D((1, 0, 0)), D((0, 0, 1)))),
        (SimpleGroup("SO", 4), (D((1, 1)), D((2, 0)))),
        (SimpleGroup("SO", 6), (D((1, 0, 0)), D((0, 1, 1)), D((2, 0, 0)))),
        (SimpleGroup("Spin", 8), (D((1, 0, 0, 0)), D((0, 0, 0, 1)))),
        (SimpleGroup("G2", 7), (D((1, 0)), D((0, 1)), D((2, 0)))),
    ]
    if size == "large":
        out += [
            (SimpleGroup("SO", 5), (D((3, 0)), D((1, 2)))),
            (SimpleGroup("Sp", 4), (D((3, 0)), D((1, 1)))),
            (SimpleGroup("G2", 7), (D((3, 0)), D((1, 1)))),
        ]
    return out
