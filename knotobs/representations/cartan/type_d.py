"""Family D_n = so(2n), the groups SO(2n) and Spin(2n) (``n >= 2``): data only.

* Simple roots ``alpha_i = e_i - e_(i+1)`` (``i < n``) and ``alpha_n = e_(n-1) + e_n``
  (Bourbaki, plate IV; for ``n = 2`` this is ``A_1 x A_1``, for ``n = 3`` it is ``A_3``).
* Fundamental weights ``omega_i = e_1 + ... + e_i`` (``i <= n - 2``),
  ``omega_(n-1) = (e_1 + ... + e_(n-1) - e_n)/2``, ``omega_n = (e_1 + ... + e_n)/2`` (the two spinors).
* Casimir normalisation: all roots ``e_i +- e_j`` have length^2 = 2 (scale 1), so
  ``C(lam) = (kappa(lam) + (N - 1)|lam|)/2`` for a partition ``lam``, ``N = 2n``.
* A partition ``lam`` with at most ``n`` rows names the highest weight ``sum lam_i e_i``: Dynkin labels
  ``(lam_1 - lam_2, ..., lam_(n-1) - lam_n, lam_(n-1) + lam_n)``.  With ``n`` rows this is one of the
  two SO(2n) representations into which the O(2n) representation splits (the one with
  ``lam_n > 0``).  Representations of SO(2n) have ``a_(n-1) + a_n`` even; the others are
  representations of Spin(2n) only.
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache
from typing import Sequence

from knotobs.errors import InvalidRepresentationError
from knotobs.representations.cartan.rootsystem import RootSystem

__all__ = ["root_system", "dynkin_from_partition", "is_tensor", "FAMILY"]

FAMILY = "D"


@lru_cache(maxsize=None)
def root_system(n: int) -> RootSystem:
    """Root system D_n (``n >= 2``).

    >>> root_system(4).cartan_matrix[3], root_system(2).cartan_matrix
    ((0, -1, 0, 2), ((2, 0), (0, 2)))
    """
    roots = []
    for i in range(n - 1):
        v = [Fraction(0)] * n
        v[i], v[i + 1] = Fraction(1), Fraction(-1)
        roots.append(tuple(v))
    v = [Fraction(0)] * n
    v[n - 2], v[n - 1] = Fraction(1), Fraction(1)
    roots.append(tuple(v))
    return RootSystem(f"D{n}", tuple(roots))


def dynkin_from_partition(lam: Sequence[int], n: int, group: str) -> tuple[int, ...]:
    """Dynkin labels of the partition ``lam`` for SO(2n).

    >>> dynkin_from_partition((1,), 3, "SO(6)"), dynkin_from_partition((1, 1), 3, "SO(6)")
    ((1, 0, 0), (0, 1, 1))
    """
    if len(lam) > n:
        raise InvalidRepresentationError(f"partition {list(lam)} has {len(lam)} rows; {group} allows at most {n}")
    lt = list(lam) + [0] * (n - len(lam))
    return tuple(lt[i] - lt[i + 1] for i in range(n - 1)) + (lt[n - 2] + lt[n - 1],)


def is_tensor(labels: Sequence[int]) -> bool:
    """Whether the highest weight is a representation of SO(2n) (not only of Spin(2n))."""
    return (labels[-2] + labels[-1]) % 2 == 0
