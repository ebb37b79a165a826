"""Family G_2, the compact exceptional group G2: data only.

* Simple roots in the plane ``x_1 + x_2 + x_3 = 0`` of R^3 (Bourbaki, plate IX):
  ``alpha_1 = e_1 - e_2`` (short, Euclidean length^2 2) and ``alpha_2 = -2 e_1 + e_2 + e_3``
  (long, Euclidean length^2 6).
* Fundamental weights ``omega_1 = 2 alpha_1 + alpha_2`` (the 7-dimensional representation) and
  ``omega_2 = 3 alpha_1 + 2 alpha_2`` (the adjoint, 14-dimensional).
* Casimir normalisation: the metric is divided by 3 so that long roots have length^2 = 2
  (dual Coxeter number 4, adjoint Casimir ``C = h^vee = 4``).
* Representations are named by Dynkin labels only (there is no partition notation).
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache

from knotobs.representations.cartan.rootsystem import RootSystem

__all__ = ["root_system", "FAMILY"]

FAMILY = "G"


@lru_cache(maxsize=None)
def root_system(n: int = 2) -> RootSystem:
    """Root system G_2.

    >>> root_system().cartan_matrix, root_system().metric_scale
    (((2, -1), (-3, 2)), Fraction(1, 3))
    """
    if n != 2:
        raise ValueError("the exceptional family G has rank 2 only")
    F = Fraction
    return RootSystem("G2", ((F(1), F(-1), F(0)), (F(-2), F(1), F(1))))
