"""Dense integer coefficient arrays: the kernel type of the exact polynomial routes.

A :class:`Dense` is ``sum_k c_k x^((shift + k)/den)`` with the coefficients ``c_k`` in a
numpy array: ``int64`` while a bound on the coefficients (the l1 norm) proves that
64 bits suffice, Python integers (``object`` arrays) otherwise.  The hot loops of
the Rosso–Jones and weight-sum routes build their sums here from sparse terms
(exponent and coefficient arrays) and do their divisions by cyclotomic-type
factors as recurrences:

* ``(x^n - 1) Q = A``  gives ``Q_k = Q_(k-n) - A_k``, a prefix sum along each
  residue class mod ``n`` (one numpy ``cumsum`` on a reshaped array);
* multiplying by ``x^n - 1`` is one shifted subtraction.

Both are exact and checked (a division that leaves a remainder raises).  Reading
coefficients back out of a FLINT polynomial costs about as much as building it,
so a route stays in this type until its single conversion to
:class:`~knotobs.polynomials.laurent.Laurent` at the end.

The coefficient bound: if every coefficient of ``A`` is at most ``B`` in size and
``A`` has ``L`` terms, a multiplication by ``x^n - 1`` gives at most ``2B`` and an
exact division by it gives at most ``L B`` (a quotient coefficient is a partial
sum of ``A``'s coefficients); the l1 norm is tracked instead, which bounds both.

References
----------
D. E. Knuth, *The Art of Computer Programming* vol. 2, §4.6.1 (division of polynomials);
common practice for the strided prefix sum.
"""

from __future__ import annotations

from fractions import Fraction
from math import gcd

import numpy as np
from flint import fmpz_poly

from knotobs.errors import InexactDivisionError
from knotobs.polynomials.laurent import Laurent

__all__ = ["Dense", "INT64_SAFE", "accumulate", "place"]

#: Coefficients (and l1 norms) below this stay in int64 arrays.
INT64_SAFE = 1 << 62


def _l1(arr: np.ndarray) -> int:
    if arr.dtype == object:
        return int(sum(abs(int(x)) for x in arr))
    if arr.size == 0:
        return 0
    return max(int(arr.max()), -int(arr.min())) * arr.size


def accumulate(exps: np.ndarray, coeffs: np.ndarray) -> tuple[np.ndarray, int]:
    """Dense array ``arr`` and lowest exponent ``lo`` with ``sum_i coeffs_i x^exps_i = x^lo sum_k arr_k x^k``.

    >>> arr, lo = accumulate(np.array([3, -1, 3]), np.array([1, 2, 4]))
    >>> arr.tolist(), lo
    ([2, 0, 0, 0, 5], -1)
    """
    exps = np.asarray(exps, dtype=np.int64).ravel()
    coeffs = np.asarray(coeffs).ravel()
    if exps.size == 0:
        return np.zeros(0, dtype=np.int64), 0
    lo = int(exps.min())
    n = int(exps.max()) - lo + 1
    idx = exps - lo
    if coeffs.dtype != object:
        bound = int(np.abs(coeffs).max()) * int(coeffs.size)
        if bound < INT64_SAFE:
            arr = np.zeros(n, dtype=np.int64)
            np.add.at(arr, idx, coeffs.astype(np.int64))
            return arr, lo
    arr = np.zeros(n, dtype=object)
    arr[:] = 0
    for i, c in zip(idx.tolist(), coeffs.tolist()):
        arr[i] += int(c)
    return arr, lo


def _strided_prefix_sum(a: np.ndarray, n: int) -> np.ndarray:
    """``c_k = a_k + a_(k-n) + a_(k-2n) + ...`` (a new array).

    Three layouts, by measured speed: one ``cumsum`` per class for small ``n``; an
    accumulation down the columns of the ``(rows, n)`` reshaped array for many rows; a loop
    over the few rows otherwise.
    """
    L = len(a)
    rows = -(-L // n)
    if n <= 32:
        c = np.empty_like(a)
        for j in range(n):
            np.cumsum(a[j::n], out=c[j::n])
        return c
    if rows >= 64:
        pad = np.zeros(rows * n, dtype=a.dtype)
        if a.dtype == object:
            pad[:] = 0
        pad[:L] = a
        return np.add.accumulate(pad.reshape(rows, n), axis=0).ravel()[:L].copy()
    c = a.copy()
    for i in range(1, rows):
        lo = i * n
        hi = min(lo + n, L)
        np.add(c[lo:hi], c[lo - n : hi - n], out=c[lo:hi])
    return c


class Dense:
    """``x^(shift/den) * sum_k arr[k] x^(k/den)`` with integer coefficients in a numpy array.

    Parameters
    ----------
    arr : numpy.ndarray
        ``int64`` or ``object`` (Python integers) coefficients, lowest exponent first.
    shift : int or Fraction
        Exponent of ``arr[0]`` in units ``1/den`` (a fraction when the whole support sits
        off the lattice ``(1/den) Z``, e.g. half-integer exponents in a unit of 1).
    den : int
        Exponent unit.
    var : str
        Variable name of the :class:`Laurent` it converts to.

    Examples
    --------
    >>> q = Dense.from_terms([0, 2], [1, 1], den=1)          # 1 + q^2
    >>> (q.mul_binomial(1) .div_binomial(2)).to_laurent()     # (1 + q^2)(q - 1)/(q^2 - 1)
    Traceback (most recent call last):
    ...
    knotobs.errors.InexactDivisionError: not divisible by x^2 - 1 (in units 1/1)
    >>> Dense.from_terms([0, 4], [-1, 1], den=1).div_binomial(2).to_laurent()   # (q^4 - 1)/(q^2 - 1)
    Laurent('1 + q^2')

    References
    ----------
    Knuth, TAOCP vol. 2, §4.6.1.
    """

    __slots__ = ("arr", "shift", "den", "var")

    def __init__(self, arr: np.ndarray, shift: int = 0, den: int = 1, var: str = "q"):
        self.arr = arr
        shift = Fraction(shift)
        self.shift = int(shift) if shift.denominator == 1 else shift
        self.den = int(den)
        self.var = var

    @classmethod
    def from_terms(cls, exps, coeffs, den: int = 1, var: str = "q") -> "Dense":
        """From sparse terms ``coeffs_i x^(exps_i/den)`` (repeated exponents add up)."""
        arr, lo = accumulate(np.asarray(exps), np.asarray(coeffs))
        return cls(arr, lo, den, var)

    @classmethod
    def from_half_terms(cls, exps_half, coeffs, var: str = "q") -> "Dense":
        """From sparse terms ``coeffs_i x^(exps_i/2)``, in the unit 1 when all ``exps_i`` have one parity.

        >>> Dense.from_half_terms([1, 5], [1, 1]).den        # x^(1/2) + x^(5/2): unit 1, shift 1/2
        1
        """
        ex = np.asarray(exps_half, dtype=np.int64)
        if ex.size == 0:
            return cls(np.zeros(0, dtype=np.int64), 0, 2, var)
        e0 = int(ex.min())
        if not np.any((ex - e0) & 1):
            arr, lo = accumulate((ex - e0) >> 1, np.asarray(coeffs))
            return cls(arr, Fraction(e0, 2) + lo, 1, var)
        return cls.from_terms(ex, coeffs, den=2, var=var)

    # ------------------------------------------------------------ queries
    def is_zero(self) -> bool:
        return not np.any(self.arr)

    def trimmed(self) -> "Dense":
        """Same element without zero coefficients at either end."""
        a = self.arr
        if len(a) and a[0] != 0 and a[-1] != 0:
            return self
        nz = np.flatnonzero(a)
        if nz.size == 0:
            return Dense(np.zeros(0, dtype=self.arr.dtype), 0, self.den, self.var)
        a, b = int(nz[0]), int(nz[-1])
        if a == 0 and b == len(self.arr) - 1:
            return self
        return Dense(self.arr[a : b + 1], self.shift + a, self.den, self.var)

    def _widened(self, factor: int) -> np.ndarray:
        """The array, moved to Python integers if ``factor * l1`` could overflow int64."""
        if self.arr.dtype != object and _l1(self.arr) * factor >= INT64_SAFE:
            return self.arr.astype(object)
        return self.arr

    # ------------------------------------------------------------ operations
    def times_monomial(self, exponent, coeff: int = 1) -> "Dense":
        """Multiply by ``coeff * x^exponent``; ``exponent`` must lie in ``(1/den) Z``."""
        e = Fraction(exponent) * self.den
        arr = self.arr if coeff == 1 else self._widened(abs(coeff)) * coeff
        return Dense(arr, self.shift + e, self.den, self.var)

    def refine(self, den: int) -> "Dense":
        """Same element in the finer unit ``1/den`` (``den`` a multiple of the present unit)."""
        if den == self.den:
            return self
        k, r = divmod(den, self.den)
        if r:
            raise ValueError(f"unit 1/{den} is not finer than 1/{self.den}")
        out = np.zeros((len(self.arr) - 1) * k + 1 if len(self.arr) else 0, dtype=self.arr.dtype)
        if out.dtype == object:
            out[:] = 0
        out[::k] = self.arr
        return Dense(out, Fraction(self.shift) * k, den, self.var)

    def rename(self, var: str) -> "Dense":
        return Dense(self.arr, self.shift, self.den, var)

    def mirror(self) -> "Dense":
        """``x -> 1/x``."""
        return Dense(self.arr[::-1].copy(), -(self.shift + len(self.arr) - 1), self.den, self.var)

    def mul_binomial(self, n: int) -> "Dense":
        """Multiply by ``x^(n/den) - 1`` (``n > 0``)."""
        a = self._widened(2)
        out = np.zeros(len(a) + n, dtype=a.dtype)
        out[n:] += a
        out[: len(a)] -= a
        return Dense(out, self.shift, self.den, self.var)

    def mul_curly(self, a: int) -> "Dense":
        """Multiply by ``{a} = x^(a/2) - x^(-a/2)`` (``a > 0`` an integer; ``x`` the variable)."""
        d = self.mul_binomial(a * self.den)
        d.shift = d.shift - Fraction(a * self.den, 2)
        return d

    def div_curly(self, a: int) -> "Dense":
        """Exact quotient by ``{a} = x^(a/2) - x^(-a/2)`` (``a > 0``)."""
        d = self.div_binomial(a * self.den)
        d.shift = d.shift + Fraction(a * self.den, 2)
        return d

    def div_binomial(self, n: int) -> "Dense":
        """Exact quotient by ``x^(n/den) - 1`` (``n > 0``): a prefix sum along each class mod ``n``.

        Raises
        ------
        InexactDivisionError
            If the division leaves a remainder.
        """
        t = self.trimmed()
        L = len(t.arr)
        if L == 0:
            return t
        if L <= n:
            raise InexactDivisionError(f"not divisible by x^{n} - 1 (in units 1/{self.den})")
        a = t._widened(1)  # partial sums are bounded by the l1 norm of the dividend
        c = _strided_prefix_sum(a, n)
        # A = (x^n - 1) Q  <=>  Q_k = -(A_k + A_(k-n) + ...); the last n partial sums must vanish
        if np.any(c[L - n : L]):
            raise InexactDivisionError(f"not divisible by x^{n} - 1 (in units 1/{self.den})")
        q = c[: L - n]
        np.negative(q, out=q)
        return Dense(q, t.shift, self.den, self.var)

    def add(self, other: "Dense") -> "Dense":
        """Sum of two elements in the same unit."""
        if other.den != self.den:
            raise ValueError("units differ")
        if len(other.arr) == 0:
            return self
        if len(self.arr) == 0:
            return other
        gap = Fraction(self.shift - other.shift)
        if gap.denominator != 1:
            k = gap.denominator
            return self.refine(self.den * k).add(other.refine(self.den * k))
        lo = min(self.shift, other.shift)
        hi = max(self.shift + len(self.arr), other.shift + len(other.arr))
        lo_i = lo
        dtype = object if (self.arr.dtype == object or other.arr.dtype == object
                           or _l1(self.arr) + _l1(other.arr) >= INT64_SAFE) else np.int64
        out = np.zeros(int(hi - lo), dtype=dtype)
        if dtype == object:
            out[:] = 0
        a0, b0 = int(self.shift - lo_i), int(other.shift - lo_i)
        out[a0 : a0 + len(self.arr)] += self.arr
        out[b0 : b0 + len(other.arr)] += other.arr
        return Dense(out, lo, self.den, self.var)

    def to_laurent(self) -> Laurent:
        """The element as a (canonical) :class:`Laurent` (one conversion to FLINT)."""
        t = self.trimmed()
        if len(t.arr) == 0:
            return Laurent.zero(self.var)
        sh = Fraction(t.shift)
        if sh.denominator != 1:
            k = sh.denominator
            return Laurent(fmpz_poly(t.arr.tolist()).inflate(k), int(sh * k), t.den * k, self.var).canonical()
        return Laurent(fmpz_poly(t.arr.tolist()), t.shift, t.den, self.var).canonical()

    def __eq__(self, other) -> bool:
        if not isinstance(other, Dense):
            return NotImplemented
        a, b = self.trimmed(), other.trimmed()
        if len(a.arr) == 0 or len(b.arr) == 0:
            return len(a.arr) == len(b.arr)
        if a.den != b.den:
            return a.to_laurent() == b.to_laurent()
        if a.shift != b.shift or len(a.arr) != len(b.arr):
            return False
        return bool(np.all(a.arr == b.arr))

    __hash__ = None  # mutable arrays inside

    def __repr__(self) -> str:
        return f"Dense({self.to_laurent().to_string()!r})"


def place(pieces, var: str = "q") -> Dense:
    """``sum piece * x^offset`` over ``(piece, offset)`` pairs (a common unit is found by :meth:`Dense.add`).

    >>> place([(Dense.from_terms([0], [1]), Fraction(1, 2)), (Dense.from_terms([0], [2]), Fraction(3, 2))]).to_laurent()
    Laurent('q^(1/2) + 2*q^(3/2)')
    """
    total = None
    for d, off in pieces:
        d = d.times_monomial(off)
        total = d if total is None else total.add(d)
    return total if total is not None else Dense(np.zeros(0, dtype=np.int64), 0, 1, var)
