r"""The two-variable series ``F_K(x, q)`` of torus-knot complements (CONVENTIONS §13).

For coprime ``s, t >= 2`` put ``c = st - s - t`` and let ``eps_m`` be ``-1`` for
``m = st -+ (s + t) (mod 2st)``, ``+1`` for ``m = st +- (s - t) (mod 2st)`` and ``0`` otherwise. Then

    ``F(x, q) = (1/2) sum_{m >= 1} eps_m (x^(m/2) - x^(-m/2)) q^((m^2 - c^2)/(4st))``

(S. Gukov and C. Manolescu, Quantum Topol. 12 (2021) 1–109, arXiv:1904.06057: their trefoil
formula, ``(m^2 - 1)/24`` with ``eps = -1, +1, +1, -1`` on ``1, 5, 7, 11 mod 12``, and its torus-knot
generalisation; the general form is quoted from memory and is checked below).  It is a power
series in ``q`` (``|q| < 1``) whose coefficients are Laurent polynomials in ``x^(1/2)``.

Relation to the coloured Jones polynomials, checked exactly (tests): at ``x = q^n`` the series
collapses to a Laurent polynomial and

    ``F(q^n, q) = q^(-g) (q^(n/2) - q^(-n/2)) J_n(T(s,t); q)``,   ``g = (s-1)(t-1)/2``,

with ``J_n`` knotobs's normalised coloured Jones polynomial of ``T(s,t)`` (unknot = 1, zero
framing, colour = dimension ``n``) in knotobs's variable ``q`` (CONVENTIONS §3: ``J_2(T(2,3)) =
q^-1 + q^-3 - q^-4``).  Gukov–Manolescu call this knot the left-handed trefoil: their variable is
our ``q`` with the opposite chirality convention.
"""

from __future__ import annotations

import math
from fractions import Fraction

from knotobs.errors import InvalidKnotError, SizeLimitError
from knotobs.guard import require, seconds_for

__all__ = ["TorusKnotF", "torus_knot_f"]


class TorusKnotF:
    """``F_K(x, q)`` of ``T(s, t)`` (module docstring).

    Examples
    --------
    >>> F = TorusKnotF(2, 3)
    >>> [(m, str(c), str(e)) for m, c, e in F.terms(12)]
    [(1, '-1/2', '0'), (5, '1/2', '1'), (7, '1/2', '2'), (11, '-1/2', '5'), (13, '-1/2', '7'), (17, '1/2', '12')]
    >>> sorted((str(k), str(v)) for k, v in F.at_q_power(1, 10).items())
    [('-1/2', '1'), ('-3/2', '-1')]

    References
    ----------
    S. Gukov and C. Manolescu, Quantum Topol. 12 (2021), arXiv:1904.06057.
    """

    def __init__(self, s: int, t: int):
        for name, v in (("s", s), ("t", t)):
            if isinstance(v, bool) or not isinstance(v, int) or v < 2:
                raise InvalidKnotError(f"{name} = {v!r}: a torus knot T(s,t) needs integers s, t >= 2")
        if math.gcd(s, t) != 1:
            raise InvalidKnotError(f"T({s},{t}) is a link (gcd = {math.gcd(s, t)}); F_K is for knots")
        self.s, self.t = s, t
        st = s * t
        self.st = st
        self.c = st - s - t
        self.genus = (s - 1) * (t - 1) // 2
        M = 2 * st
        self.eps = {(st - s - t) % M: -1, (st + s + t) % M: -1, (st + s - t) % M: 1, (st - s + t) % M: 1}

    def epsilon(self, m: int) -> int:
        """``eps_m``."""
        return self.eps.get(m % (2 * self.st), 0)

    def exponent(self, m: int) -> Fraction:
        """``(m^2 - c^2)/(4st)``."""
        return Fraction(m * m - self.c * self.c, 4 * self.st)

    def terms(self, order: int):
        """``[(m, eps_m/2, exponent)]`` with ``exponent <= order``: ``F = sum (eps_m/2) q^e (x^(m/2) - x^(-m/2))``."""
        if isinstance(order, bool) or not isinstance(order, int) or order < 0:
            raise SizeLimitError(f"order = {order!r} must be a non-negative integer")
        mmax = math.isqrt(4 * self.st * order + self.c * self.c) + 1
        require(f"F_K of T({self.s},{self.t}) to q^{order}", seconds=seconds_for(mmax, "python"),
                accepted="ask for a lower order")
        out = []
        for m in range(1, mmax + 1):
            e = self.epsilon(m)
            if e and self.exponent(m) <= order:
                out.append((m, Fraction(e, 2), self.exponent(m)))
        return out

    def at_q_power(self, n: int, below: Fraction | int) -> dict[Fraction, Fraction]:
        """``{exponent: coefficient}`` of ``F(q^n, q)`` for the exponents ``< below`` (exact).

        The terms ``m >= M`` have exponents ``>= (M^2 - c^2)/(4st) - nM/2``; the sum is taken over
        every ``m`` below the first ``M`` for which that bound reaches ``below``.
        """
        if isinstance(n, bool) or not isinstance(n, int) or n < 1:
            raise SizeLimitError(f"n = {n!r} must be a positive integer (the colour as a dimension)")
        below = Fraction(below)
        st = self.st
        M = st * n + 1
        while self.exponent(M) - Fraction(n * M, 2) < below:
            M += 1
        require(f"F_K of T({self.s},{self.t}) at x = q^{n}", seconds=seconds_for(M, "python"),
                accepted="use a smaller colour")
        out: dict[Fraction, Fraction] = {}
        for m in range(1, M):
            e = self.epsilon(m)
            if not e:
                continue
            base = self.exponent(m)
            for sg in (1, -1):
                ex = base + sg * Fraction(n * m, 2)
                if ex < below:
                    out[ex] = out.get(ex, 0) + Fraction(e * sg, 2)
        return {k: v for k, v in out.items() if v}


def torus_knot_f(knot) -> TorusKnotF:
    """:class:`TorusKnotF` from ``"T(s,t)"`` or a pair.

    >>> torus_knot_f("T(3,4)").genus
    3
    """
    if isinstance(knot, str):
        from knotobs.fibrations.torus import parse_knot

        k = parse_knot(knot)
        s, t = k.p, k.q
    else:
        s, t = knot
    if s < 0 or t < 0:
        raise InvalidKnotError(f"{knot!r}: give T(s,t) with s, t >= 2 (the mirror is not covered here)")
    return TorusKnotF(min(s, t), max(s, t))
