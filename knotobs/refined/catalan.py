"""The q,t-Catalan number from Dyck paths: a combinatorial route independent of nabla.

J. Haglund's bounce statistic (Adv. Math. 175 (2003) 319–334), proved by A. Garsia and
J. Haglund (Discrete Math. 256 (2002) 677–717):

    C_n(q, t) = sum over Dyck paths pi of size n of q^area(pi) t^bounce(pi).

A Dyck path is a word of ``n`` north (N) and ``n`` east (E) steps from ``(0, 0)`` to
``(n, n)`` never below the diagonal; ``area`` counts the whole cells between the path and
the diagonal.  The bounce path starts at ``(0, 0)``, goes north until it meets the start
of an east step of ``pi``, then east to the diagonal, then north again, and so on; if it
touches the diagonal at ``(j_0, j_0) = (0, 0), (j_1, j_1), ..., (j_b, j_b) = (n, n)`` then
``bounce(pi) = sum_{i=1}^{b-1} (n - j_i)``.

>>> sorted(qt_catalan(2).items())
[((0, 1), 1), ((1, 0), 1)]
>>> sum(qt_catalan(4).values())   # the Catalan number C_4
14
"""

from __future__ import annotations

from typing import Iterator

from knotobs.errors import SizeLimitError
from knotobs.guard import require, seconds_for

__all__ = ["dyck_paths", "area", "bounce", "qt_catalan"]


def dyck_paths(n: int) -> Iterator[tuple[int, ...]]:
    """Dyck paths of size ``n`` as tuples of steps (1 = north, 0 = east)."""
    path: list[int] = []

    def rec(north: int, east: int):
        if north == n and east == n:
            yield tuple(path)
            return
        if north < n:
            path.append(1)
            yield from rec(north + 1, east)
            path.pop()
        if east < north:
            path.append(0)
            yield from rec(north, east + 1)
            path.pop()

    yield from rec(0, 0)


def _heights(path: tuple[int, ...]) -> list[int]:
    """``h[x]`` = height of the path's east step in column ``x``."""
    h, y = [], 0
    for s in path:
        if s:
            y += 1
        else:
            h.append(y)
    return h


def area(path: tuple[int, ...]) -> int:
    """Whole cells between the path and the diagonal.

    >>> area((1, 1, 0, 0)), area((1, 0, 1, 0))
    (1, 0)
    """
    return sum(h - x - 1 for x, h in enumerate(_heights(path)))


def bounce(path: tuple[int, ...]) -> int:
    """Haglund's bounce statistic.

    >>> bounce((1, 1, 0, 0)), bounce((1, 0, 1, 0))
    (0, 1)
    """
    h = _heights(path)
    n = len(h)
    x, total = 0, 0
    while True:
        y = h[x]          # go north to the height of the east step starting at column x
        if y == n:
            return total
        x = y             # east to the diagonal point (y, y)
        total += n - y


def qt_catalan(n: int) -> dict[tuple[int, int], int]:
    """``C_n(q, t)`` as a mapping ``(i, j) -> coefficient of q^i t^j``.

    References
    ----------
    J. Haglund, Adv. Math. 175 (2003); A. Garsia, J. Haglund, Discrete Math. 256 (2002).
    """
    if not isinstance(n, int) or n < 1:
        raise SizeLimitError(f"q,t-Catalan number needs an integer n >= 1, not {n!r}")
    count = 1
    for i in range(2, n + 1):              # Catalan number, for the estimate
        count = count * (n + i) // i
    require(f"q,t-Catalan number C_{n} from {count} Dyck paths",
            seconds=seconds_for(count * n * 4, "python"), accepted="use n <= 12")
    out: dict[tuple[int, int], int] = {}
    for p in dyck_paths(n):
        key = (area(p), bounce(p))
        out[key] = out.get(key, 0) + 1
    return out
