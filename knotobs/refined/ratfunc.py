"""Exact rational functions of ``q`` and ``t`` (integer coefficients), kept in lowest terms.

A small field type over python-flint's multivariate integer polynomials: numerator and
denominator are coprime (``fmpz_mpoly.gcd``) and the denominator has a positive leading
coefficient, so equal functions have equal representations.

>>> from knotobs.refined.ratfunc import QT
>>> q, t = QT.gens()
>>> ((q * q - t * t) / (q - t)).is_polynomial()
True
>>> str((q - t) / (t - q))
'-1'
"""

from __future__ import annotations

__all__ = ["QT", "RatQT", "QTZ", "reduced_by_unknot"]


class _Field:
    """The field ``Q(q, t)``: its polynomial context and constructors."""

    def __init__(self):
        import flint

        self.ctx = flint.fmpz_mpoly_ctx.get(("q", "t"), "lex")
        self._one = self.ctx.from_dict({(0, 0): 1})

    def poly_gens(self):
        """``q`` and ``t`` as polynomials (``fmpz_mpoly``)."""
        return self.ctx.gens()

    def gens(self):
        """``q`` and ``t`` as rational functions."""
        q, t = self.ctx.gens()
        return RatQT(q), RatQT(t)

    def one_poly(self):
        return self._one

    def from_int(self, c: int) -> "RatQT":
        return RatQT(self._one * int(c))


class RatQT:
    """A rational function ``n/d`` of ``q`` and ``t`` in lowest terms."""

    __slots__ = ("n", "d")

    def __init__(self, num, den=None):
        if den is None:
            den = QT.one_poly()
        if den.is_zero():
            raise ZeroDivisionError("rational function with zero denominator")
        g = num.gcd(den)
        if not g.is_one():
            num, den = num / g, den / g
        if den.leading_coefficient() < 0:
            num, den = -num, -den
        self.n, self.d = num, den

    @classmethod
    def _reduced(cls, num, den) -> "RatQT":
        """``num/den`` already coprime: only the sign of the denominator is normalised."""
        self = object.__new__(cls)
        if den.leading_coefficient() < 0:
            num, den = -num, -den
        self.n, self.d = num, den
        return self

    def _plus(self, on, od) -> "RatQT":
        # Henrici: with g = gcd(d1, d2), only g can be shared by the new numerator and denominator
        g = self.d.gcd(od)
        if g.is_one():
            return RatQT._reduced(self.n * od + on * self.d, self.d * od)
        d1, d2 = self.d / g, od / g
        num = self.n * d2 + on * d1
        if num.is_zero():
            return RatQT._reduced(num, QT.one_poly())
        g2 = num.gcd(g)
        return RatQT._reduced(num / g2, d1 * (od / g2))

    def __add__(self, o: "RatQT") -> "RatQT":
        return self._plus(o.n, o.d)

    def __sub__(self, o: "RatQT") -> "RatQT":
        return self._plus(-o.n, o.d)

    def _times(self, on, od) -> "RatQT":
        g1, g2 = self.n.gcd(od), on.gcd(self.d)
        num = (self.n / g1) * (on / g2)
        if num.is_zero():
            return RatQT._reduced(num, QT.one_poly())
        return RatQT._reduced(num, (self.d / g2) * (od / g1))

    def __mul__(self, o: "RatQT") -> "RatQT":
        return self._times(o.n, o.d)

    def __truediv__(self, o: "RatQT") -> "RatQT":
        if o.n.is_zero():
            raise ZeroDivisionError("division by the zero rational function")
        return self._times(o.d, o.n)

    def __neg__(self) -> "RatQT":
        return RatQT(-self.n, self.d)

    def is_zero(self) -> bool:
        return self.n.is_zero()

    def is_polynomial(self) -> bool:
        """Whether the denominator is 1."""
        return self.d.is_one()

    def __eq__(self, o) -> bool:
        return isinstance(o, RatQT) and self.n == o.n and self.d == o.d

    def __hash__(self) -> int:
        return hash((str(self.n), str(self.d)))

    def __str__(self) -> str:
        return str(self.n) if self.d.is_one() else f"({self.n})/({self.d})"

    __repr__ = __str__


#: The field Q(q, t).
QT = _Field()


class QTZ:
    """Fractions in ``q, t`` and the grading variable ``z`` (python-flint ``fmpz_mpoly``), summed
    term by term: ``sum_mu c_mu(q, t) R_mu(q, t, z) / S_mu(q, t, z)`` as one ``num/den``.

    >>> acc = QTZ()
    >>> acc.add(QT.from_int(1), acc.one + acc.z, acc.one)
    >>> str(acc.num), str(acc.den)
    ('z + 1', '1')
    """

    def __init__(self):
        import flint

        self.ctx = flint.fmpz_mpoly_ctx.get(("q", "t", "z"), "lex")
        self.q, self.t, self.z = self.ctx.gens()
        self.one = self.ctx.from_dict({(0, 0, 0): 1})
        self.num, self.den = 0 * self.one, self.one

    def lift(self, p):
        """A polynomial in ``q, t`` (of :data:`QT`) in the three variables."""
        return self.ctx.from_dict({(int(e[0]), int(e[1]), 0): int(c) for e, c in p.terms()})

    def add(self, cf: "RatQT", top, bot) -> None:
        """Add ``cf * top / bot`` (``top``, ``bot`` in the three variables)."""
        n2, d2 = self.lift(cf.n) * top, self.lift(cf.d) * bot
        g = self.den.gcd(d2)
        self.num = self.num * (d2 / g) + n2 * (self.den / g)
        self.den = self.den * (d2 / g)


def reduced_by_unknot(knot: tuple, unknot: tuple, what: str) -> tuple:
    """``knot / unknot`` (each a fraction ``(num, den)`` of :class:`QTZ` polynomials) as exact
    polynomial terms ``((i, j, d), c)``; a remainder raises."""
    (kn, kd), (un, ud) = knot, unknot
    quotient, remainder = divmod(kn * ud, kd * un)
    if not remainder.is_zero():
        raise ArithmeticError(f"{what} is not a polynomial")
    return tuple(((int(e[0]), int(e[1]), int(e[2])), int(c)) for e, c in quotient.terms())
