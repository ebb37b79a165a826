"""Cell statistics of Young diagrams, as Macdonald-polynomial formulas use them.

A cell ``s = (i, j)`` of ``mu`` sits in row ``i`` and column ``j`` (both from 0, English
convention).  Its statistics (I. G. Macdonald, *Symmetric Functions and Hall
Polynomials*, 2nd ed., OUP 1995, Ch. VI §6):

* ``coarm a'(s) = j`` and ``coleg l'(s) = i`` (cells to the left, cells above);
* ``arm a(s) = mu_i - j - 1`` and ``leg l(s) = mu'_j - i - 1`` (cells to the right, below);
* ``n(mu) = sum_i i mu_i = sum_s l'(s)``, and ``n(mu') = sum_s a'(s)``.

>>> [c for c in cells((2, 1))]
[Cell(row=0, col=0, arm=1, leg=1), Cell(row=0, col=1, arm=0, leg=0), Cell(row=1, col=0, arm=0, leg=0)]
>>> n_of((2, 1)), n_of(conjugate((2, 1)))
(1, 1)
"""

from __future__ import annotations

from typing import Iterator, NamedTuple, Sequence

from knotobs.representations.partitions import conjugate, partitions_of

__all__ = ["Cell", "cells", "addable", "n_of", "conjugate", "partitions_of", "partition_count",
           "partition_count_text"]


class Cell(NamedTuple):
    """One cell: ``row = l'``, ``col = a'``, and its ``arm`` and ``leg``."""

    row: int
    col: int
    arm: int
    leg: int


def cells(mu: Sequence[int]) -> Iterator[Cell]:
    """The cells of ``mu`` row by row, each with its arm and leg."""
    mu = tuple(mu)
    mc = conjugate(mu)
    for i, row in enumerate(mu):
        for j in range(row):
            yield Cell(i, j, row - j - 1, mc[j] - i - 1)


def addable(mu: Sequence[int]) -> Iterator[tuple[tuple[int, ...], tuple[int, int]]]:
    """``(lam, (i, j))`` for each partition ``lam`` obtained by adding the cell ``(i, j)`` to ``mu``.

    >>> list(addable((2,)))
    [((3,), (0, 2)), ((2, 1), (1, 0))]
    """
    mu = list(mu)
    for i in range(len(mu) + 1):
        row = mu[i] if i < len(mu) else 0
        if i == 0 or mu[i - 1] > row:
            lam = mu[:]
            if i < len(mu):
                lam[i] += 1
            else:
                lam.append(1)
            yield tuple(lam), (i, row)


def n_of(mu: Sequence[int]) -> int:
    """``n(mu) = sum_i i mu_i`` (rows counted from 0)."""
    return sum(i * x for i, x in enumerate(mu))


def partition_count(n: int) -> float:
    """The number ``p(n)`` of partitions of ``n``, without listing them.

    Exact (Euler's pentagonal recurrence) for ``n <= 400``; above, the Hardy–Ramanujan
    asymptotic ``exp(pi sqrt(2n/3)) / (4 n sqrt 3)`` (G. H. Hardy, S. Ramanujan, Proc. London
    Math. Soc. 17 (1918)), which is all an estimate needs.

    >>> partition_count(7), partition_count(100)
    (15, 190569292)
    >>> partition_count(9999) > 1e100
    True
    """
    import math

    if n < 0:
        return 0
    if n <= 400:
        p = [1] + [0] * n
        for m in range(1, n + 1):
            total, k = 0, 1
            while True:
                g1, g2 = k * (3 * k - 1) // 2, k * (3 * k + 1) // 2
                if g1 > m:
                    break
                sign = 1 if k % 2 else -1
                total += sign * p[m - g1]
                if g2 <= m:
                    total += sign * p[m - g2]
                k += 1
            p[m] = total
        return p[n]
    return math.exp(math.pi * math.sqrt(2 * n / 3)) / (4 * n * math.sqrt(3))


def partition_count_text(n: int) -> str:
    """``p(n)`` for a message: three digits, or "more than 1e300" where even the estimate overflows.

    >>> partition_count_text(10)
    '42'
    """
    return f"{partition_count(n):.3g}" if n <= 50000 else "more than 1e300"
