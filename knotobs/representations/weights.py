"""Weights with multiplicities of polynomial U(N) representations.

The weights of the irreducible representation with highest weight ``lam``
(a partition with at most N rows) are the compositions ``mu`` of ``|lam|``
into N parts; the multiplicity of ``mu`` is the Kostka number
``K_{lam, sort(mu)}`` (number of semistandard tableaux of shape ``lam`` and
content ``mu``), computed by peeling off horizontal strips.  Weights are
written in the orthonormal basis ``e_1, ..., e_N`` of the Cartan of U(N); for
SU(N) project to the hyperplane ``sum = 0``.

References
----------
I. G. Macdonald, *Symmetric Functions and Hall Polynomials*, 2nd ed., OUP (1995),
ch. I §5 (Schur functions, Kostka numbers); W. Fulton, J. Harris, *Representation
Theory*, Springer GTM 129 (1991), §15.3.
"""

from __future__ import annotations

from functools import lru_cache
from itertools import permutations
from math import comb
from typing import Iterator, Sequence

from knotobs.errors import SizeLimitError
from knotobs.representations.partitions import Partition, partitions_of

__all__ = ["kostka", "weight_multiplicities", "dominant_weights", "MAX_WEIGHTS"]

#: Largest number of distinct weights enumerated for one representation.
MAX_WEIGHTS = 2_000_000


def _horizontal_strips(lam: Partition, r: int) -> Iterator[Partition]:
    """Partitions ``nu`` with ``lam / nu`` a horizontal strip of ``r`` boxes."""
    L = len(lam)
    # room[i]: the most boxes rows i.. can give up (row j keeps at least lam[j+1])
    room = [0] * (L + 1)
    for i in range(L - 1, -1, -1):
        room[i] = room[i + 1] + lam[i] - (lam[i + 1] if i + 1 < L else 0)

    def rec(i: int, left: int, acc: list[int]):
        if i == L:
            if left == 0:
                yield tuple(x for x in acc if x > 0)
            return
        lo = lam[i + 1] if i + 1 < L else 0
        # take at least what the later rows cannot give, at most what is left
        least = max(0, left - room[i + 1])
        for take in range(least, min(left, lam[i] - lo) + 1):
            acc.append(lam[i] - take)
            yield from rec(i + 1, left - take, acc)
            acc.pop()

    yield from rec(0, r, [])


@lru_cache(maxsize=200_000)
def kostka(lam: Partition, mu: Partition) -> int:
    """Kostka number ``K_{lam, mu}`` for partitions ``lam``, ``mu`` of the same size.

    Examples
    --------
    >>> kostka((2, 1), (1, 1, 1)), kostka((3, 2), (2, 2, 1))
    (2, 2)

    References
    ----------
    Macdonald (1995), ch. I §5 (eq. 5.12).
    """
    if sum(lam) != sum(mu):
        return 0
    if not mu:
        return 1 if not lam else 0
    if len(lam) > len(mu):
        return 0
    if len(mu) <= 2:
        # two letters: the 1s fill the start of row 1, so K = 1 iff lam_2 <= min(mu)
        return 1 if (lam[1] if len(lam) > 1 else 0) <= min(mu) else 0
    if len(mu) == 3:
        # three letters: count the strips lam / (nu_1, nu_2) of mu_3 boxes with nu_2 <= min(mu_1, mu_2)
        l1, l2, l3 = (tuple(lam) + (0, 0))[:3]
        s = l1 + l2 + l3 - mu[2]
        lo = max(l3, s - l1)
        hi = min(l2, s - l2, mu[0], mu[1])
        return max(0, hi - lo + 1)
    r = mu[-1]
    rest = mu[:-1]
    return sum(kostka(nu, rest) for nu in _horizontal_strips(lam, r))


def dominant_weights(lam: Partition, N: int) -> list[tuple[Partition, int]]:
    """Dominant weights ``mu`` (partitions, at most N rows) of ``lam`` with multiplicity."""
    n = sum(lam)
    out = []
    for mu in partitions_of(n, N):
        k = kostka(tuple(lam), mu)
        if k:
            out.append((mu, k))
    return out


def _distinct_permutations(vec: tuple[int, ...]) -> Iterator[tuple[int, ...]]:
    # multiset permutations without duplicates
    items = sorted(vec)
    n = len(items)
    used = [False] * n
    cur: list[int] = []

    def rec():
        if len(cur) == n:
            yield tuple(cur)
            return
        prev = None
        for i in range(n):
            if used[i] or items[i] == prev:
                continue
            prev = items[i]
            used[i] = True
            cur.append(items[i])
            yield from rec()
            cur.pop()
            used[i] = False

    yield from rec()


@lru_cache(maxsize=512)
def weight_multiplicities(lam: Partition, N: int) -> dict[tuple[int, ...], int]:
    """All weights of the U(N) irrep ``lam`` as N-tuples, with multiplicities.

    Examples
    --------
    >>> sorted(weight_multiplicities((1,), 3).items())
    [((0, 0, 1), 1), ((0, 1, 0), 1), ((1, 0, 0), 1)]
    >>> sum(weight_multiplicities((2, 1), 3).values())     # dim of the adjoint of SU(3)
    8

    References
    ----------
    Fulton–Harris (1991), §15.3.
    """
    lam = tuple(lam)
    n = sum(lam)
    if comb(n + N - 1, N - 1) > MAX_WEIGHTS:
        raise SizeLimitError(
            f"representation {list(lam)} of U({N}) has too many weights to enumerate"
            f" (more than {MAX_WEIGHTS}); use a route that does not need weights"
        )
    out: dict[tuple[int, ...], int] = {}
    for mu, k in dominant_weights(lam, N):
        padded = tuple(mu) + (0,) * (N - len(mu))
        for w in _distinct_permutations(padded):
            out[w] = k
    return out
