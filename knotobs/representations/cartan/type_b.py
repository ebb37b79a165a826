"""Family B_n = so(2n+1), the groups SO(2n+1) and Spin(2n+1): data only.

* Simple roots ``alpha_i = e_i - e_(i+1)`` (``i < n``) and ``alpha_n = e_n`` (Bourbaki, plate II).
* Fundamental weights ``omega_i = e_1 + ... + e_i`` (``i < n``), ``omega_n = (e_1 + ... + e_n)/2``
  (the spinor).
* Casimir normalisation: long roots ``e_i +- e_j`` have length^2 = 2 in the Euclidean metric
  (scale 1), so ``C(lam) = (kappa(lam) + (N - 1)|lam|)/2`` for a partition ``lam``, ``N = 2n + 1``.
  For ``n = 1`` (SO(3)) the single root ``e_1`` is the long one and the metric is doubled: SO(3)
  carries the normalisation of SU(2) (vector = spin 1, ``C = 2``).
* A partition ``lam`` with at most ``n`` rows names the tensor representation of highest weight
  ``sum lam_i e_i``: Dynkin labels ``(lam_1 - lam_2, ..., lam_(n-1) - lam_n, 2 lam_n)``.
  Representations of SO(2n+1) are those with an even last label; an odd last label is a
  representation of Spin(2n+1) only.
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache
from typing import Sequence

from knotobs.errors import InvalidRepresentationError
from knotobs.representations.cartan.rootsystem import RootSystem

__all__ = ["root_system", "dynkin_from_partition", "is_tensor", "FAMILY"]

FAMILY = "B"


@lru_cache(maxsize=None)
def root_system(n: int) -> RootSystem:
    """Root system B_n (``n >= 1``).

    >>> root_system(3).cartan_matrix
    ((2, -1, 0), (-1, 2, -2), (0, -1, 2))
    """
    roots = []
    for i in range(n):
        v = [Fraction(0)] * n
        v[i] = Fraction(1)
        if i + 1 < n:
            v[i + 1] = Fraction(-1)
        roots.append(tuple(v))
    return RootSystem(f"B{n}", tuple(roots))


def dynkin_from_partition(lam: Sequence[int], n: int, group: str) -> tuple[int, ...]:
    """Dynkin labels of the partition ``lam`` for SO(2n+1).

    >>> dynkin_from_partition((1,), 2, "SO(5)"), dynkin_from_partition((1, 1), 2, "SO(5)")
    ((1, 0), (0, 2))
    """
    if len(lam) > n:
        raise InvalidRepresentationError(f"partition {list(lam)} has {len(lam)} rows; {group} allows at most {n}")
    lt = list(lam) + [0] * (n - len(lam))
    return tuple(lt[i] - lt[i + 1] for i in range(n - 1)) + (2 * lt[n - 1],)


def is_tensor(labels: Sequence[int]) -> bool:
    """Whether the highest weight is a representation of SO(2n+1) (not only of Spin(2n+1))."""
    return labels[-1] % 2 == 0
