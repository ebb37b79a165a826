"""Family A_n = sl(n+1), the group SU(n+1): data only.

* Simple roots ``alpha_i = e_i - e_(i+1)``, ``i = 1..n``, in R^(n+1) (Bourbaki, plate I).
* Fundamental weights ``omega_i = e_1 + ... + e_i - (i/(n+1)) (e_1 + ... + e_(n+1))``.
* Casimir normalisation: every root has length^2 = 2 in the Euclidean metric (scale 1), so
  ``C(lam) = (kappa + N|lam| - |lam|^2/N)/2`` (CONVENTIONS §2).
* A partition ``lam`` (at most ``n + 1`` rows; columns of height ``n + 1`` dropped) names the highest
  weight ``sum lam_i e_i``: Dynkin labels ``a_i = lam_i - lam_(i+1)``.
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache
from typing import Sequence

from knotobs.errors import InvalidRepresentationError
from knotobs.representations.cartan.rootsystem import RootSystem

__all__ = ["root_system", "dynkin_from_partition", "FAMILY"]

FAMILY = "A"


@lru_cache(maxsize=None)
def root_system(n: int) -> RootSystem:
    """Root system A_n (``n >= 1``).

    >>> root_system(2).cartan_matrix
    ((2, -1), (-1, 2))
    """
    dim = n + 1
    roots = []
    for i in range(n):
        v = [Fraction(0)] * dim
        v[i], v[i + 1] = Fraction(1), Fraction(-1)
        roots.append(tuple(v))
    return RootSystem(f"A{n}", tuple(roots))


def dynkin_from_partition(lam: Sequence[int], n: int, group: str) -> tuple[int, ...]:
    """Dynkin labels of the partition ``lam`` for SU(n+1).

    >>> dynkin_from_partition((2, 1), 2, "SU(3)")
    (1, 1)
    """
    if len(lam) > n + 1:
        raise InvalidRepresentationError(f"partition {list(lam)} has {len(lam)} rows; {group} allows at most {n + 1}")
    lt = list(lam) + [0] * (n + 1 - len(lam))
    return tuple(lt[i] - lt[i + 1] for i in range(n))
