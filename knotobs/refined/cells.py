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

__all__ = ["Cell", "cells", "n_of", "conjugate", "partitions_of"]


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


def n_of(mu: Sequence[int]) -> int:
    """``n(mu) = sum_i i mu_i`` (rows counted from 0)."""
    return sum(i * x for i, x in enumerate(mu))
