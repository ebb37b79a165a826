"""Family C_n = sp(2n), the group Sp(2n) (compact symplectic, acting on C^(2n)): data only.

* Simple roots ``alpha_i = e_i - e_(i+1)`` (``i < n``) and ``alpha_n = 2 e_n`` (Bourbaki, plate III).
* Fundamental weights ``omega_i = e_1 + ... + e_i``.
* Casimir normalisation: the long roots ``2 e_i`` have Euclidean length^2 4, so the metric is
  halved (scale 1/2): ``C(lam) = (kappa(lam) + (2n + 1)|lam| + ...)/4``-type values, e.g. the
  defining representation has ``C = (2n + 1)/4``; Sp(2) = SU(2) with the same normalisation.
* A partition ``lam`` with at most ``n`` rows names the highest weight ``sum lam_i e_i``:
  Dynkin labels ``(lam_1 - lam_2, ..., lam_(n-1) - lam_n, lam_n)``.
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache
from typing import Sequence

from knotobs.errors import InvalidRepresentationError
from knotobs.representations.cartan.rootsystem import RootSystem

__all__ = ["root_system", "dynkin_from_partition", "FAMILY"]

FAMILY = "C"


@lru_cache(maxsize=None)
def root_system(n: int) -> RootSystem:
    """Root system C_n (``n >= 1``).

    >>> root_system(2).cartan_matrix, root_system(2).metric_scale
    (((2, -1), (-2, 2)), Fraction(1, 2))
    """
    roots = []
    for i in range(n):
        v = [Fraction(0)] * n
        if i + 1 < n:
            v[i], v[i + 1] = Fraction(1), Fraction(-1)
        else:
            v[i] = Fraction(2)
        roots.append(tuple(v))
    return RootSystem(f"C{n}", tuple(roots))


def dynkin_from_partition(lam: Sequence[int], n: int, group: str) -> tuple[int, ...]:
    """Dynkin labels of the partition ``lam`` for Sp(2n).

    >>> dynkin_from_partition((1,), 2, "Sp(4)"), dynkin_from_partition((1, 1), 2, "Sp(4)")
    ((1, 0), (0, 1))
    """
    if len(lam) > n:
        raise InvalidRepresentationError(f"partition {list(lam)} has {len(lam)} rows; {group} allows at most {n}")
    lt = list(lam) + [0] * (n - len(lam))
    return tuple(lt[i] - lt[i + 1] for i in range(n - 1)) + (lt[n - 1],)
