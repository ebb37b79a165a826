"""Summing many shifted Laurent polynomials without blowing up the exponent unit.

Sums like ``sum_mu c_mu q^(e_mu) dim_q(mu)`` have offsets ``e_mu`` with large
denominators (``1/(2 N m)``) although every ``dim_q(mu)`` lives in ``q^(1/2) Z``.
Writing everything in the finest unit would make the dense FLINT polynomial
``2 N m`` times longer than needed.  Instead terms are grouped by the class of
their offset modulo the coarse unit, each class is summed densely in the
coarse unit, and the classes are combined once at the end (monomials of
different classes can never cancel each other).
"""

from __future__ import annotations

from fractions import Fraction
from math import floor

import numpy as np
from flint import fmpz_poly

from knotobs.polynomials.laurent import Laurent

__all__ = ["CosetSum"]


class CosetSum:
    """Accumulate ``sum c * x^offset * f`` with ``f`` in the unit ``1/unit``.

    Terms are kept until :meth:`result`; each class is then summed in one dense
    numpy pass when the coefficients provably fit in 64 bits (the bound is the
    sum of ``|c| * 2^height_bits(f)``), and in FLINT otherwise.
    """

    def __init__(self, unit: int = 2, var: str = "q"):
        self.unit = unit
        self.var = var
        self._classes: dict[Fraction, list[tuple[fmpz_poly, int, int]]] = {}

    def add(self, f: Laurent, offset: Fraction, coeff: int = 1) -> None:
        if coeff == 0 or f.is_zero():
            return
        if self.unit % f._d:
            raise ValueError(f"term with exponent unit 1/{f._d} does not fit unit 1/{self.unit}")
        g = f._to_den(self.unit)
        scaled = Fraction(offset) * self.unit
        base = floor(scaled)
        cls = scaled - base
        self._classes.setdefault(cls, []).append((g._p, g._s + base, int(coeff)))

    @staticmethod
    def _sum_class(terms: list[tuple[fmpz_poly, int, int]]) -> tuple[fmpz_poly, int]:
        lo = min(s for _, s, _ in terms)
        hi = max(s + p.degree() for p, s, _ in terms)
        bound = sum(abs(c) << int(p.height_bits()) for p, _, c in terms)
        if bound < (1 << 62):
            arr = np.zeros(hi - lo + 1, dtype=np.int64)
            for p, s, c in terms:
                co = np.array([int(x) for x in p.coeffs()], dtype=np.int64)
                arr[s - lo : s - lo + len(co)] += c * co
            return fmpz_poly(arr.tolist()), lo
        acc = fmpz_poly()
        for p, s, c in sorted(terms, key=lambda t: t[1]):
            acc = acc + (p * c).left_shift(s - lo)
        return acc, lo

    def result(self) -> Laurent:
        out = Laurent.zero(self.var)
        for cls, terms in self._classes.items():
            p, s = self._sum_class(terms)
            if p.is_zero():
                continue
            term = Laurent(p, s, self.unit, self.var)
            if cls:
                term = term.times_monomial(cls / self.unit)
            out = out + term
        return out
