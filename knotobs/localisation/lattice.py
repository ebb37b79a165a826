"""SU(N) lattice data for the localisation route: alcove, Weyl group, roots, inner products.

Conventions (CONVENTIONS §1, §2, §4, §10): weights live in ``R^N`` with the orthonormal basis
``e_1..e_N``, projected to sum zero; the inner product is
``<x, y> = sum x_i y_i - (sum x)(sum y)/N`` (long roots of length^2 = 2).  A partition
``lam`` (at most ``N - 1`` rows) plus ``rho`` is ``lam^ = (lam_i + N - i)_{i=1..N}`` (a common
shift drops out).  The level-``k`` alcove is ``{lam : lam_1 <= k}``: in shifted coordinates the
strictly decreasing integer vectors with last entry 0 and first entry ``<= K - 1``
(``K = k + N``), ``binom(K - 1, N - 1)`` of them.  The Weyl group is the symmetric group
acting by permuting coordinates, ``(w v)_i = v_{p(i)}``; positive roots ``e_i - e_j``,
``i < j``; the root lattice ``Q`` has basis ``alpha_j = e_j - e_{j+1}`` and Gram matrix the
Cartan matrix.  All inner products are returned multiplied by ``N`` so they are integers.

References
----------
N. Bourbaki, *Lie Groups and Lie Algebras*, ch. VI, Plate I (type A_{N-1}), Springer 2002;
V. G. Kac, *Infinite dimensional Lie algebras*, 3rd ed., CUP 1990, ch. 13 (the alcove).
"""

from __future__ import annotations

import itertools
import math
from functools import lru_cache
from typing import Sequence

import numpy as np

from knotobs.errors import InvalidRepresentationError, NotIntegrableError
from knotobs.representations.partitions import as_partition
from knotobs.representations.permutations import permutation_sign

__all__ = [
    "alcove_size",
    "alcove",
    "shifted",
    "weyl_group",
    "cartan_matrix",
    "n_inner",
    "n_norm",
    "positive_root_pairings",
    "reduce_colour",
]


def alcove_size(N: int, k: int) -> int:
    """Number of integrable weights of SU(N) at level k, ``binom(k + N - 1, N - 1)``.

    >>> alcove_size(3, 40), alcove_size(2, 10**5)
    (861, 100001)
    """
    return math.comb(k + N - 1, N - 1)


def alcove(N: int, k: int) -> np.ndarray:
    """Shifted weights ``lam + rho`` of the level-``k`` alcove, shape ``(n, N)`` (int64).

    The order is that of :func:`itertools.combinations`; the trivial weight is *not*
    necessarily first (use :func:`shifted` to locate a weight).

    >>> alcove(2, 2).tolist()
    [[1, 0], [2, 0], [3, 0]]
    >>> len(alcove(3, 4)) == alcove_size(3, 4)
    True
    """
    K = k + N
    if N == 2:
        x = np.arange(1, K, dtype=np.int64)
        return np.stack([x, np.zeros_like(x)], axis=1)
    combos = np.array(list(itertools.combinations(range(K - 1, 0, -1), N - 1)), dtype=np.int64)
    return np.concatenate([combos, np.zeros((len(combos), 1), dtype=np.int64)], axis=1)


def reduce_colour(lam, N: int, k: int) -> tuple[int, ...]:
    """A colour as a partition with at most ``N - 1`` rows (full columns removed), checked
    integrable at level ``k`` (``lam_1 - lam_N <= k``).

    >>> reduce_colour([2, 1, 1], 3, 2)
    (1,)
    >>> reduce_colour([3], 2, 2)
    Traceback (most recent call last):
    ...
    knotobs.errors.NotIntegrableError: representation [3] of SU(2) is not integrable at level 2: need lam_1 - lam_2 <= 2
    """
    lam = as_partition(lam)
    if len(lam) > N:
        raise InvalidRepresentationError(f"partition {list(lam)} has {len(lam)} rows; SU({N}) allows at most {N}")
    full = tuple(lam) + (0,) * (N - len(lam))
    if full[0] - full[-1] > k:
        raise NotIntegrableError(
            f"representation {list(lam)} of SU({N}) is not integrable at level {k}: need"
            f" lam_1 - lam_{N} <= {k}"
        )
    return tuple(x - full[-1] for x in full if x - full[-1] > 0)


def shifted(lam: Sequence[int], N: int) -> np.ndarray:
    """``lam + rho`` in the coordinates of :func:`alcove`.

    >>> shifted((2, 1), 3).tolist()
    [4, 2, 0]
    """
    full = tuple(lam) + (0,) * (N - len(lam))
    return np.array([full[i] + N - 1 - i for i in range(N)], dtype=np.int64)


@lru_cache(maxsize=16)
def weyl_group(N: int) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """``(perms, inverse perms, signs)`` of the symmetric group ``S_N`` as int arrays.

    >>> p, q, s = weyl_group(3)
    >>> p.shape, int(s.sum())
    ((6, 3), 0)
    """
    perms = np.array(list(itertools.permutations(range(N))), dtype=np.int64)
    inv = np.argsort(perms, axis=1)
    signs = np.array([permutation_sign(p) for p in perms.tolist()], dtype=np.int64)
    return perms, inv, signs


def cartan_matrix(N: int) -> np.ndarray:
    """Cartan matrix of ``A_{N-1}``: the Gram matrix of the simple roots.

    >>> cartan_matrix(3).tolist()
    [[2, -1], [-1, 2]]
    """
    r = N - 1
    A = 2 * np.eye(r, dtype=np.int64)
    for i in range(r - 1):
        A[i, i + 1] = A[i + 1, i] = -1
    return A


def n_inner(x: np.ndarray, y: np.ndarray) -> np.ndarray:
    """``N <x, y>`` (an integer) along the last axis, broadcasting.

    >>> int(n_inner(np.array([1, 0]), np.array([1, 0])))      # N |e_1 - mean|^2 = 2 * 1/2
    1
    """
    N = x.shape[-1]
    return N * np.sum(x * y, axis=-1) - np.sum(x, axis=-1) * np.sum(y, axis=-1)


def n_norm(x: np.ndarray) -> np.ndarray:
    """``N |x|^2`` along the last axis."""
    return n_inner(x, x)


def positive_root_pairings(x: np.ndarray) -> np.ndarray:
    """``<alpha, x> = x_i - x_j`` for the positive roots ``alpha = e_i - e_j``, ``i < j``.

    >>> positive_root_pairings(np.array([[4, 2, 0]])).tolist()
    [[2, 4, 2]]
    """
    N = x.shape[-1]
    pairs = [(i, j) for i in range(N) for j in range(i + 1, N)]
    return np.stack([x[..., i] - x[..., j] for i, j in pairs], axis=-1)
