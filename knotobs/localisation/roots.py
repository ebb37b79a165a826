"""Roots of unity as balls: one table lookup (or two and a product) per power.

``RootTable(M, prec)[E] = exp(2 pi i E/M)`` for integer arrays ``E``.  Up to
:data:`FULL_TABLE` the whole table is built; above it a baby-step/giant-step pair of
tables of size about ``sqrt(M)`` is used, ``zeta^E = G[E // B] B_[E % B]``.  Every entry
is computed directly by ``exp_pi_i`` (python-flint ``acb``), so errors do not accumulate.
"""

from __future__ import annotations

import math

from flint import acb, arb, fmpq

__all__ = ["RootTable", "FULL_TABLE"]

#: Largest modulus for which every power is tabulated.
FULL_TABLE = 20_000


class RootTable:
    """``exp(2 pi i E / M)`` at the current python-flint precision (build inside a
    :func:`knotobs.numerics.working_precision` block).

    >>> from knotobs.numerics import working_precision
    >>> with working_precision(20):
    ...     t = RootTable(8)
    ...     z = t[2]
    >>> abs(complex(z) - 1j) < 1e-15
    True
    """

    def __init__(self, M: int):
        self.M = M
        if M <= FULL_TABLE:
            self.B = M
            self.small = [acb(arb(fmpq(2 * j, M))).exp_pi_i() if j else acb(1) for j in range(M)]
            self.big = None
        else:
            B = math.isqrt(M) + 1
            self.B = B
            self.small = [acb(arb(fmpq(2 * j, M))).exp_pi_i() for j in range(B)]
            self.big = [acb(arb(fmpq(2 * (j * B % M), M))).exp_pi_i() for j in range(M // B + 1)]

    def __getitem__(self, E: int) -> acb:
        E %= self.M
        if self.big is None:
            return self.small[E]
        q, r = divmod(E, self.B)
        return self.big[q] * self.small[r]

    def many(self, E) -> list:
        """The powers for an iterable of exponents (already reduced or not)."""
        if self.big is None:
            sm = self.small
            M = self.M
            return [sm[e % M] for e in E]
        return [self[e] for e in E]
