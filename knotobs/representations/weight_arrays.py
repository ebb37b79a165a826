"""Weights and the fixed-N Adams operation as integer arrays (the hot path of both exact routes).

* :func:`weight_array` — the weights of the U(N) irrep ``lam`` as an ``(k, N)`` integer
  array with a multiplicity vector.  Symmetric powers ``(n)`` and exterior powers
  ``(1^n)`` are written down directly (every weight has multiplicity one: the
  Kostka numbers ``K_{(n), mu} = 1`` and ``K_{(1^n), mu} = [mu = 1^n]``, Macdonald (1995)
  ch. I §6); other shapes come from :func:`~knotobs.representations.weights.weight_multiplicities`.
* :func:`adams_array` — ``psi^m(lam)`` by the Racah–Speiser / Brauer–Klimyk rule
  (CONVENTIONS §2) vectorised: every weight times ``m`` plus ``delta = (N-1, ..., 0)``,
  rows with a repeated entry dropped, the rest sorted with the sign of the sorting
  permutation, equal results merged.

References
----------
I. G. Macdonald, *Symmetric Functions and Hall Polynomials*, 2nd ed. (1995), ch. I §5–§6;
R. C. King, J. Phys. A 8 (1975) 429 (Racah–Speiser / Brauer–Klimyk); CONVENTIONS §2.
"""

from __future__ import annotations

from functools import lru_cache
from itertools import combinations
from math import comb

import numpy as np

from knotobs.representations.partitions import Partition
from knotobs.representations.weights import weight_multiplicities

__all__ = ["weight_array", "adams_array", "merge_rows", "compositions"]


def compositions(n: int, N: int) -> np.ndarray:
    """All compositions of ``n`` into ``N`` non-negative parts, as rows of an array.

    >>> compositions(2, 2).tolist()
    [[2, 0], [1, 1], [0, 2]]
    """
    if N == 1:
        return np.array([[n]], dtype=np.int64)
    # stars and bars: choose N - 1 bar positions among n + N - 1 slots
    bars = np.array(list(combinations(range(n + N - 1), N - 1)), dtype=np.int64).reshape(-1, N - 1)
    k = bars.shape[0]
    ext = np.hstack([np.full((k, 1), -1, dtype=np.int64), bars, np.full((k, 1), n + N - 1, dtype=np.int64)])
    parts = np.diff(ext, axis=1) - 1
    return parts[::-1].copy() if N == 2 else parts


@lru_cache(maxsize=256)
def _weight_array(lam: Partition, N: int) -> tuple[np.ndarray, np.ndarray]:
    n = sum(lam)
    if len(lam) == 1 and N == 2:
        k = np.arange(n, -1, -1, dtype=np.int64)
        w = np.stack([k, n - k], axis=1)
        return w, np.ones(n + 1, dtype=np.int64)
    if len(lam) == 1:
        w = compositions(n, N)
        return w, np.ones(len(w), dtype=np.int64)
    if lam and lam[0] == 1:
        w = np.zeros((comb(N, n), N), dtype=np.int64)
        for r, cols in enumerate(combinations(range(N), n)):
            w[r, list(cols)] = 1
        return w, np.ones(len(w), dtype=np.int64)
    d = weight_multiplicities(lam, N)
    w = np.array(list(d.keys()), dtype=np.int64).reshape(len(d), N)
    return w, np.array(list(d.values()), dtype=np.int64)


def weight_array(lam: Partition, N: int) -> tuple[np.ndarray, np.ndarray]:
    """Weights of the U(N) irrep ``lam`` (rows, basis ``e_1..e_N``) and their multiplicities.

    Examples
    --------
    >>> w, m = weight_array((2, 1), 3)
    >>> int(m.sum())                        # dimension of the adjoint of SU(3)
    8
    >>> w, m = weight_array((3,), 2); w.tolist()
    [[3, 0], [2, 1], [1, 2], [0, 3]]

    References
    ----------
    Macdonald (1995), ch. I §5; Fulton–Harris, *Representation Theory* (1991), §15.3.
    """
    if len(lam) > N:
        return np.zeros((0, N), dtype=np.int64), np.zeros(0, dtype=np.int64)
    return _weight_array(tuple(lam), N)


def merge_rows(rows: np.ndarray, coeffs: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Merge equal rows, adding their coefficients; rows with total 0 are dropped.

    >>> r, c = merge_rows(np.array([[1, 0], [0, 1], [1, 0]]), np.array([1, 2, -1]))
    >>> r.tolist(), c.tolist()
    ([[0, 1]], [2])
    """
    if rows.shape[0] == 0:
        return rows, coeffs
    uniq, inv = np.unique(rows, axis=0, return_inverse=True)
    tot = np.zeros(len(uniq), dtype=coeffs.dtype)
    np.add.at(tot, inv.ravel(), coeffs)
    keep = tot != 0
    return uniq[keep], tot[keep]


def adams_array(lam: Partition, m: int, N: int) -> tuple[np.ndarray, np.ndarray]:
    """``psi^m(lam) = sum_mu c_mu mu`` for U(N): partitions ``mu`` as rows (padded to N), ``c_mu``.

    Examples
    --------
    >>> mus, c = adams_array((1,), 3, 2)
    >>> [(tuple(int(x) for x in r), int(v)) for r, v in zip(mus, c)]
    [((2, 1), -1), ((3, 0), 1)]

    References
    ----------
    CONVENTIONS §2; King (1975).
    """
    w, mult = weight_array(tuple(lam), N)
    delta = np.arange(N - 1, -1, -1, dtype=np.int64)
    v = m * w + delta
    order = np.argsort(-v, axis=1, kind="stable")
    srt = np.take_along_axis(v, order, axis=1)
    ok = np.all(srt[:, :-1] > srt[:, 1:], axis=1) if N > 1 else np.ones(len(v), dtype=bool)
    v, srt, mult = v[ok], srt[ok], mult[ok]
    inv = np.zeros(len(v), dtype=np.int64)
    for i in range(N):
        for j in range(i + 1, N):
            inv += v[:, i] < v[:, j]
    sign = 1 - 2 * (inv & 1)
    return merge_rows(srt - delta, sign * mult)
