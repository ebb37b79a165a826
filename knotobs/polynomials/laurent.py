"""Exact Laurent polynomials in one variable with rational exponents.

An element is ``sum_e c_e x^e`` with integer coefficients ``c_e`` and exponents
``e`` in ``(1/D) Z`` for some positive integer ``D`` (the *exponent unit*).
Internally it is a python-flint ``fmpz_poly`` ``p(y)`` in ``y = x^(1/D)``
together with an integer shift: ``x^(shift/D) p(x^(1/D))``.  All arithmetic is
exact and runs in FLINT; sympy is used only to display.

The representation is not canonical between operations (zeros at the low end
and a non-minimal ``D`` are tolerated); :meth:`Laurent.canonical` produces the
canonical form, and equality and hashing go through it.
"""

from __future__ import annotations

from fractions import Fraction
from math import gcd
from typing import Iterable, Mapping, Union

import mpmath

from knotobs.numerics import working_precision
from flint import fmpz_poly

from knotobs.errors import InexactDivisionError, RingMismatchError
from knotobs.polynomials._format import format_terms, power

__all__ = ["Laurent", "Exponent"]

Exponent = Union[int, Fraction]


def _lcm(a: int, b: int) -> int:
    return a * b // gcd(a, b)


def _frac(e: Exponent) -> Fraction:
    if isinstance(e, Fraction):
        return e
    if isinstance(e, int) and not isinstance(e, bool):
        return Fraction(e)
    raise TypeError(f"exponent must be an int or Fraction, not {type(e).__name__}")


def _cancel_digits_of(p: fmpz_poly, terms: int | None = None) -> int:
    """Digits a sum of the terms of ``p`` (at most ``terms`` of them; default its length) can lose to
    cancellation: the size of the largest coefficient and of the number of terms."""
    return int(0.302 * p.height_bits()) + len(str(p.degree() + 1 if terms is None else terms))


class Laurent:
    """Exact Laurent polynomial ``sum_e c_e x^e`` with ``e`` rational.

    Parameters
    ----------
    poly : flint.fmpz_poly
        Coefficients in the variable ``y = x^(1/den)``.
    shift : int
        The element is ``x^(shift/den) * poly(x^(1/den))``.
    den : int
        Exponent unit ``1/den``.
    var : str
        Name of the variable (``"q"``, ``"t"``, ``"s"``, ...).  Elements in
        different variables do not mix (:class:`~knotobs.errors.RingMismatchError`).

    Examples
    --------
    >>> q = Laurent.gen("q")
    >>> f = (q**3 - q**-3) // (q - q**-1)     # the quantum integer [3] in q^2
    >>> f
    Laurent('q^-2 + 1 + q^2')
    >>> Laurent.monomial(Fraction(1, 2), var="q") * Laurent.monomial(Fraction(-1, 2), var="q")
    Laurent('1')
    >>> f.subs_power(Fraction(1, 2)).terms()
    {Fraction(-1, 1): 1, Fraction(0, 1): 1, Fraction(1, 1): 1}

    References
    ----------
    W. Hart et al., FLINT: Fast Library for Number Theory (fmpz_poly arithmetic).
    """

    __slots__ = ("_p", "_s", "_d", "var")

    def __init__(self, poly: fmpz_poly | None = None, shift: int = 0, den: int = 1, var: str = "q"):
        self._p = poly if poly is not None else fmpz_poly()
        self._s = int(shift)
        self._d = int(den)
        self.var = var
        if self._d <= 0:
            raise ValueError("exponent unit denominator must be positive")

    # ------------------------------------------------------------ builders
    @classmethod
    def zero(cls, var: str = "q") -> "Laurent":
        return cls(fmpz_poly(), 0, 1, var)

    @classmethod
    def one(cls, var: str = "q") -> "Laurent":
        return cls(fmpz_poly([1]), 0, 1, var)

    @classmethod
    def gen(cls, var: str = "q") -> "Laurent":
        """The variable itself."""
        return cls(fmpz_poly([1]), 1, 1, var)

    @classmethod
    def monomial(cls, exponent: Exponent, coeff: int = 1, var: str = "q") -> "Laurent":
        """``coeff * x^exponent``."""
        e = _frac(exponent)
        return cls(fmpz_poly([int(coeff)]), e.numerator, e.denominator, var)

    @classmethod
    def from_terms(cls, terms: Mapping[Exponent, int] | Iterable[tuple[Exponent, int]], var: str = "q") -> "Laurent":
        """Build from ``{exponent: coefficient}`` (or pairs; repeated exponents add up).

        >>> Laurent.from_terms({1: 1, 3: 1, 4: -1}, var="t")
        Laurent('t + t^3 - t^4')
        """
        items = list(terms.items()) if isinstance(terms, Mapping) else list(terms)
        items = [(_frac(e), int(c)) for e, c in items]
        if not items:
            return cls.zero(var)
        den = 1
        for e, _ in items:
            den = _lcm(den, e.denominator)
        ints = [(int(e * den), c) for e, c in items]
        lo = min(k for k, _ in ints)
        hi = max(k for k, _ in ints)
        coeffs = [0] * (hi - lo + 1)
        for k, c in ints:
            coeffs[k - lo] += c
        return cls(fmpz_poly(coeffs), lo, den, var)

    @classmethod
    def from_dense(cls, coeffs, shift: int, den: int, var: str = "q") -> "Laurent":
        """From a dense coefficient sequence (list or integer numpy array) in units ``1/den``."""
        return cls(fmpz_poly([int(c) for c in coeffs]), shift, den, var)

    # ------------------------------------------------------------ internals
    def _check(self, other: "Laurent") -> None:
        if self.var != other.var:
            raise RingMismatchError(
                f"cannot combine a polynomial in {self.var!r} with one in {other.var!r}"
            )

    def _to_den(self, den: int) -> "Laurent":
        if den == self._d:
            return self
        m = den // self._d
        return Laurent(self._p.inflate(m) if self._p.degree() > 0 else self._p, self._s * m, den, self.var)

    def _aligned(self, other: "Laurent") -> tuple["Laurent", "Laurent"]:
        self._check(other)
        d = _lcm(self._d, other._d)
        return self._to_den(d), other._to_den(d)

    def _coerce(self, other) -> "Laurent":
        if isinstance(other, Laurent):
            return other
        if isinstance(other, int) and not isinstance(other, bool):
            return Laurent(fmpz_poly([other]), 0, 1, self.var)
        return NotImplemented

    # ------------------------------------------------------------ ring ops
    def __add__(self, other):
        other = self._coerce(other)
        if other is NotImplemented:
            return NotImplemented
        a, b = self._aligned(other)
        if a._p.is_zero():
            return b
        if b._p.is_zero():
            return a
        if a._s <= b._s:
            return Laurent(a._p + b._p.left_shift(b._s - a._s), a._s, a._d, a.var)
        return Laurent(a._p.left_shift(a._s - b._s) + b._p, b._s, a._d, a.var)

    __radd__ = __add__

    def __neg__(self) -> "Laurent":
        return Laurent(-self._p, self._s, self._d, self.var)

    def __sub__(self, other):
        other = self._coerce(other)
        if other is NotImplemented:
            return NotImplemented
        return self + (-other)

    def __rsub__(self, other):
        other = self._coerce(other)
        if other is NotImplemented:
            return NotImplemented
        return other + (-self)

    def __mul__(self, other):
        if isinstance(other, int) and not isinstance(other, bool):
            return Laurent(self._p * other, self._s, self._d, self.var)
        if not isinstance(other, Laurent):
            return NotImplemented
        a, b = self._aligned(other)
        return Laurent(a._p * b._p, a._s + b._s, a._d, a.var)

    __rmul__ = __mul__

    def __pow__(self, n: int) -> "Laurent":
        if not isinstance(n, int):
            raise TypeError("only integer powers of a Laurent polynomial are defined")
        if n >= 0:
            return Laurent(self._p ** n, self._s * n, self._d, self.var)
        c = self.canonical()
        if c._p.length() == 1 and abs(int(c._p[0])) == 1:
            return Laurent(c._p ** (-n), -c._s * (-n), c._d, c.var)
        raise InexactDivisionError(f"{self} is not a unit; negative power {n} is not a Laurent polynomial")

    def exact_div(self, other: "Laurent | int") -> "Laurent":
        """Exact quotient ``self / other``; raises if the division leaves a remainder.

        >>> q = Laurent.gen()
        >>> (q**2 - 1).exact_div(q - 1)
        Laurent('1 + q')
        >>> (q**2 + 1).exact_div(q - 1)
        Traceback (most recent call last):
        ...
        knotobs.errors.InexactDivisionError: 1 + q^2 is not divisible by -1 + q
        """
        if isinstance(other, int) and not isinstance(other, bool):
            other = Laurent(fmpz_poly([other]), 0, 1, self.var)
        a, b = self._aligned(other)
        b = b._strip_low()
        if b._p.is_zero():
            raise ZeroDivisionError("division by the zero polynomial")
        try:
            quo = a._p / b._p
        except Exception:  # flint DomainError: not exact
            raise InexactDivisionError(f"{self} is not divisible by {other}") from None
        return Laurent(quo, a._s - b._s, a._d, a.var)

    __floordiv__ = exact_div
    __truediv__ = exact_div

    # ------------------------------------------------------------ canonical
    def _strip_low(self) -> "Laurent":
        p = self._p
        if p.is_zero():
            return Laurent(fmpz_poly(), 0, 1, self.var)
        if p[0] != 0:
            return self
        k = 0
        while p[k] == 0:
            k += 1
        return Laurent(p.right_shift(k), self._s + k, self._d, self.var)

    def canonical(self) -> "Laurent":
        """Same element with no low zeros and the smallest exponent unit."""
        c = self._strip_low()
        if c._p.is_zero():
            return c
        g = c._d
        if g > 1:
            g = gcd(g, c._s)
            if g > 1 and c._p.degree() > 0:
                _, defl = c._p.deflation()
                g = gcd(g, int(defl))
        if g > 1:
            p = c._p.deflate(g) if c._p.degree() > 0 else c._p
            return Laurent(p, c._s // g, c._d // g, c.var)
        return c

    # ------------------------------------------------------------ queries
    def is_zero(self) -> bool:
        return self._p.is_zero()

    def terms(self) -> dict[Fraction, int]:
        """``{exponent: coefficient}`` for the nonzero terms, in increasing order."""
        c = self.canonical()
        out = {}
        for i, a in enumerate(c._p.coeffs()):
            if a != 0:
                out[Fraction(c._s + i, c._d)] = int(a)
        return out

    def num_terms(self) -> int:
        """Number of nonzero monomials."""
        return sum(1 for a in self._p.coeffs() if a != 0)

    def coefficient(self, exponent: Exponent) -> int:
        e = _frac(exponent)
        c = self
        k = e * c._d - c._s
        if k.denominator != 1 or k < 0 or k > max(c._p.degree(), -1):
            return 0
        return int(c._p[int(k)])

    def min_exponent(self) -> Fraction:
        c = self.canonical()
        return Fraction(c._s, c._d)

    def max_exponent(self) -> Fraction:
        c = self.canonical()
        return Fraction(c._s + c._p.degree(), c._d)

    def exponent_unit(self) -> int:
        """Smallest ``D`` such that every exponent is in ``(1/D) Z``."""
        return self.canonical()._d

    def at_one(self) -> int:
        """Value at ``x = 1`` (sum of coefficients)."""
        return int(self._p(1))

    def is_monomial(self) -> bool:
        return self.num_terms() == 1

    # ------------------------------------------------------------ substitution
    def subs_power(self, r: Exponent) -> "Laurent":
        """Substitute ``x -> x^r`` for a nonzero rational ``r`` (``r = -1`` is the mirror ``q -> 1/q``)."""
        r = _frac(r)
        if r == 0:
            raise ValueError("x -> x^0 is not an automorphism")
        c = self.canonical()
        if r < 0:
            coeffs = c._p.coeffs()
            coeffs.reverse()
            c = Laurent(fmpz_poly(coeffs), -(c._s + c._p.degree()), c._d, c.var)
            r = -r
        # exponents (s+i)/d * num/den
        n, m = r.numerator, r.denominator
        p = c._p.inflate(n) if (n > 1 and c._p.degree() > 0) else c._p
        return Laurent(p, c._s * n, c._d * m, c.var)

    def mirror(self) -> "Laurent":
        """``x -> x^-1``."""
        return self.subs_power(-1)

    def rename(self, var: str) -> "Laurent":
        """Same coefficients, variable called ``var``."""
        return Laurent(self._p, self._s, self._d, var)

    def times_monomial(self, exponent: Exponent, coeff: int = 1) -> "Laurent":
        """Multiply by ``coeff * x^exponent`` (cheap)."""
        e = _frac(exponent)
        d = _lcm(self._d, e.denominator)
        a = self._to_den(d)
        return Laurent(a._p * coeff if coeff != 1 else a._p, a._s + int(e * d), d, self.var)

    # ------------------------------------------------------------ evaluation
    def evaluate(self, x=None, *, log_x=None, dps: int = 30):
        """Numeric value at ``x`` (mpmath, ``dps`` decimal digits).

        Rational powers are taken as ``exp(e * log_x)``.  Give ``log_x`` to fix
        the branch (for ``q = exp(2 pi i / K)`` pass ``log_x = 2 pi i / K``);
        otherwise the principal logarithm of ``x`` is used.

        >>> q = Laurent.gen()
        >>> (q + q**-1).evaluate(2)
        mpf('2.5')
        """
        c = self.canonical()
        if c._p.is_zero():
            return mpmath.mpf(0)
        with working_precision(dps + 10 + c._cancel_digits()):
            if log_x is None:
                if c._d == 1 and x is not None:
                    x = mpmath.mpmathify(x)
                    y = x
                else:
                    log_x = mpmath.log(mpmath.mpmathify(x))
            if log_x is not None:
                y = mpmath.exp(mpmath.mpmathify(log_x) / c._d)
            val = mpmath.polyval([mpmath.mpf(int(a)) for a in reversed(c._p.coeffs())], y)
            val = val * y ** c._s
            return +val

    def at_root_of_unity(self, K, dps: int = 30):
        """Value at ``x = exp(2 pi i / K)`` for any (complex, non-integer) ``K``.

        ``K`` may be an int, a Fraction, a string such as ``"7.5+0.3j"`` or an mpmath
        number; ``2 pi i / K`` is formed at the working precision, so the result is
        good to ``dps`` digits.

        >>> from knotobs.representations import quantum_integer
        >>> abs(quantum_integer(5).at_root_of_unity(5)) < 1e-25
        True
        """
        if isinstance(K, int) and not isinstance(K, bool) and K > 0:
            c = self.canonical()
            if c._p.degree() > 4 * K * c._d:
                return c._at_integer_root(K, dps)
        with working_precision(dps + 10):
            if isinstance(K, Fraction):
                Kv = mpmath.mpf(K.numerator) / K.denominator
            elif isinstance(K, str):
                Kv = mpmath.mpmathify(K.replace("i", "j"))
            else:
                Kv = mpmath.mpmathify(K)
            return self.evaluate(log_x=2j * mpmath.pi / Kv, dps=dps)

    def _cancel_digits(self) -> int:
        """Digits a sum of these terms can lose to cancellation (:func:`_cancel_digits_of`)."""
        return _cancel_digits_of(self._p)

    def _at_integer_root(self, K: int, dps: int):
        """``at_root_of_unity`` at an integer ``K`` for a canonical element whose span exceeds the
        order ``n = K d`` of ``y = exp(2 pi i/(K d))`` (``x = y^d``): the exact integer polynomial is
        reduced mod ``y^n - 1`` first (FLINT), then evaluated in ball arithmetic (a span of 10^7
        took half a minute in Horner's rule)."""
        from flint import acb, acb_poly

        n = K * self._d
        red = self._p % fmpz_poly([-1] + [0] * (n - 1) + [1])
        with working_precision(dps + 10 + _cancel_digits_of(red, n)):
            y = acb.exp_pi_i(acb(2) / n)
            val = acb_poly(red.coeffs())(y) * acb.exp_pi_i(acb(2 * (self._s % n)) / n)
            return mpmath.mpc(mpmath.mpf(val.real.mid().str(dps + 10, radius=False)),
                              mpmath.mpf(val.imag.mid().str(dps + 10, radius=False)))

    # ------------------------------------------------------------ display
    def to_sympy(self, symbol=None):
        """The element as a sympy expression (display only)."""
        import sympy

        x = symbol if symbol is not None else sympy.Symbol(self.var)
        return sympy.Add(*[c * x ** sympy.Rational(e.numerator, e.denominator) for e, c in self.terms().items()])

    def to_string(self, var: str | None = None, descending: bool = False) -> str:
        """Plain algebraic text, e.g. ``'q^-1 + q^(3/2) - 2*q^4'`` (sympy-parsable with ``^ -> **``)."""
        v = var or self.var
        items = list(self.terms().items())
        if descending:
            items.reverse()
        return format_terms(((power(v, e),), c) for e, c in items)

    def __str__(self) -> str:
        return self.to_string()

    def __repr__(self) -> str:
        return f"Laurent({self.to_string()!r})"

    # ------------------------------------------------------------ equality
    def __eq__(self, other) -> bool:
        if isinstance(other, int) and not isinstance(other, bool):
            other = Laurent(fmpz_poly([other]), 0, 1, self.var)
        if not isinstance(other, Laurent):
            return NotImplemented
        if self.var != other.var:
            return False
        return (self - other).is_zero()

    def __hash__(self) -> int:
        c = self.canonical()
        return hash((c.var, c._s, c._d, tuple(int(a) for a in c._p.coeffs())))

    def __bool__(self) -> bool:
        return not self.is_zero()
