"""Gluing matrices of Seifert fibers, Dedekind sums and Rademacher's function (CONVENTIONS §10).

For a fiber ``(a, b)`` (``a >= 1``, ``gcd(a, b) = 1``) knotobs glues the solid torus by
``U = [[a, -y], [b, x]]`` with ``a x + b y = 1`` and ``0 <= y < a`` (CONVENTIONS §7; the same
choice as :meth:`knotobs.fibrations.SeifertManifold.gluing_matrices`).  The localisation
route needs ``V = S U = [[-b, -x], [a, -y]]`` (``S = [[0, -1], [1, 0]]``), whose lower-left
entry is the order ``a > 0``, and Rademacher's function

    Phi(V) = (V_11 + V_22)/V_21 - 12 s(V_22, V_21),

``s`` the Dedekind sum (H. Rademacher & E. Grosswald, *Dedekind Sums*, Carus Math.
Monographs 16, MAA 1972, ch. 4; L. Jeffrey, Commun. Math. Phys. 147 (1992) 563-604, §2).

This module is self-contained (it does not use the surgery route's helpers), so the
localisation route stays independent of it.
"""

from __future__ import annotations

import math
from fractions import Fraction

from knotobs.errors import InvalidSeifertDataError

__all__ = ["dedekind_sum", "gluing_matrix", "fiber_matrix", "rademacher_phi"]


def dedekind_sum(h: int, k: int) -> Fraction:
    """``s(h, k) = sum_{r=1}^{k-1} ((r/k)) ((h r/k))`` for ``k >= 1``, ``gcd(h, k) = 1``.

    By the reciprocity law ``s(h,k) + s(k,h) = -1/4 + (h/k + k/h + 1/(hk))/12`` (Dedekind;
    Rademacher-Grosswald 1972, ch. 2) and ``s(h + k, k) = s(h, k)``, ``s(-h, k) = -s(h, k)``.

    >>> dedekind_sum(1, 5), dedekind_sum(2, 5), dedekind_sum(-1, 3)
    (Fraction(1, 5), Fraction(0, 1), Fraction(-1, 18))
    """
    if k < 1 or math.gcd(h, k) != 1:
        raise ValueError(f"dedekind_sum needs k >= 1 and gcd(h, k) = 1, got ({h}, {k})")
    total = Fraction(0)
    sign = 1
    while True:
        h %= k
        if k == 1 or h == 0:
            return total
        # s(h, k) = -1/4 + (h/k + k/h + 1/(h k))/12 - s(k, h),  0 < h < k
        total += sign * (Fraction(-1, 4) + (Fraction(h, k) + Fraction(k, h) + Fraction(1, h * k)) / 12)
        sign = -sign
        h, k = k, h


def gluing_matrix(a: int, b: int) -> tuple[tuple[int, int], tuple[int, int]]:
    """``U = [[a, -y], [b, x]]`` with ``a x + b y = 1``, ``0 <= y < a``.

    >>> gluing_matrix(2, 1), gluing_matrix(1, 5)
    (((2, -1), (1, 0)), ((1, 0), (5, 1)))
    """
    if a < 1 or math.gcd(a, b) != 1:
        raise InvalidSeifertDataError(f"fiber ({a},{b}) needs a >= 1 and gcd(a, b) = 1")
    y = pow(b, -1, a) if a > 1 else 0
    x, r = divmod(1 - b * y, a)
    assert r == 0
    return (a, -y), (b, x)


def fiber_matrix(a: int, b: int) -> tuple[tuple[int, int], tuple[int, int]]:
    """``V = S U = [[-b, -x], [a, -y]]`` for the fiber ``(a, b)``.

    >>> fiber_matrix(2, 1)
    ((-1, 0), (2, -1))
    """
    (_, my), (_, x) = gluing_matrix(a, b)
    return (-b, -x), (a, my)


def rademacher_phi(V) -> Fraction:
    """Rademacher's ``Phi`` of ``V = [[p, q], [c, d]]`` in SL(2,Z): ``(p + d)/c - 12 sign(c) s(d, |c|)``
    for ``c != 0`` and ``q/d`` for ``c = 0``.

    >>> rademacher_phi(((0, -1), (1, 0))), rademacher_phi(((1, 1), (0, 1)))
    (Fraction(0, 1), Fraction(1, 1))
    """
    (p, q), (c, d) = V
    if p * d - q * c != 1:
        raise InvalidSeifertDataError(f"{V} is not in SL(2,Z)")
    if c == 0:
        return Fraction(q, d)
    sg = 1 if c > 0 else -1
    return Fraction(p + d, c) - 12 * sg * dedekind_sum(d, abs(c))
