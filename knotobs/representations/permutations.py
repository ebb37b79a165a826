"""Signs of permutations: the Weyl-group signs of type A (and of every signed sum over S_N).

>>> permutation_sign((0, 1, 2)), permutation_sign((1, 0, 2)), permutation_sign((2, 0, 1))
(1, -1, 1)
"""

from __future__ import annotations

from typing import Sequence

__all__ = ["permutation_sign"]


def permutation_sign(p: Sequence[int]) -> int:
    """``(-1)^(number of transpositions)`` of a permutation of ``0..n-1``, by sorting cycles in place."""
    sign, p = 1, list(p)
    for i in range(len(p)):
        while p[i] != i:
            j = p[i]
            p[i], p[j] = p[j], p[i]
            sign = -sign
    return sign
