"""Exact numbers in cyclotomic fields ``Q(zeta_n)`` and square roots of rationals.

An element of ``Q(zeta_n)``, ``zeta_n = exp(2 pi i / n)``, is stored as a rational
polynomial in ``zeta_n`` of degree ``< phi(n)``, reduced modulo the cyclotomic
polynomial ``Phi_n`` (python-flint ``fmpq_poly``).  Arithmetic is exact; the
inverse uses the extended Euclidean algorithm with ``Phi_n`` (``Phi_n`` is
irreducible over Q, so every non-zero element is invertible).  Elements of
different fields are combined in ``Q(zeta_lcm)``.

Numeric values come from evaluating the reduced polynomial at ``zeta_n`` in ball
arithmetic (python-flint ``acb``): the enclosure is rigorous, and
:meth:`Cyclotomic.to_mpc` also recomputes with more precision and checks that
the two agree.

Square roots of rationals are cyclotomic (Kronecker–Weber, explicitly by Gauss
sums): for an odd prime ``p`` the Gauss sum ``g_p = sum_a (a/p) zeta_p^a`` equals
``sqrt(p)`` if ``p = 1 mod 4`` and ``i sqrt(p)`` if ``p = 3 mod 4`` (C. F. Gauss 1811;
K. Ireland & M. Rosen, *A Classical Introduction to Modern Number Theory*, 2nd ed.,
Springer 1990, ch. 6, Thm. 1 and §6.4), and ``sqrt(2) = zeta_8 + zeta_8^-1``.
Finite-level results carry a factor such as ``sqrt(2/K)``; :class:`CyclotomicSurd`
keeps that factor apart (``sqrt(r) * c`` with ``r`` rational, ``c`` cyclotomic)
so the conductor stays small, and :meth:`CyclotomicSurd.as_cyclotomic` puts it
into one cyclotomic field when wanted.
"""

from __future__ import annotations

import math
from fractions import Fraction
from functools import lru_cache
from typing import Iterable, Sequence

import mpmath

from knotobs.numerics import working_precision
import numpy as np
from flint import acb, arb, ctx, fmpq, fmpq_poly, fmpz, fmpz_poly

from knotobs.errors import InexactDivisionError, PrecisionError, SizeLimitError

__all__ = [
    "CyclotomicField",
    "Cyclotomic",
    "CyclotomicSurd",
    "cyclotomic_field",
    "root_of_unity",
    "sqrt_rational",
    "squarefree_part",
    "acb_to_mpc",
    "MAX_CONDUCTOR",
]

#: Largest conductor for which exact arithmetic is attempted.
MAX_CONDUCTOR = 2_000_000

_Rational = int | Fraction | fmpq


def _to_fmpq(x) -> fmpq:
    if isinstance(x, fmpq):
        return x
    if isinstance(x, Fraction):
        return fmpq(x.numerator, x.denominator)
    if isinstance(x, (int, np.integer, fmpz)):
        return fmpq(int(x))
    raise TypeError(f"{x!r} is not a rational number")


class CyclotomicField:
    """The field ``Q(zeta_n)``, ``zeta_n = exp(2 pi i/n)``; one instance per ``n``.

    Examples
    --------
    >>> F = CyclotomicField(12)
    >>> F.degree
    4
    >>> z = F.zeta()
    >>> z**12 == F.one
    True
    >>> (z**3)**2 == -F.one           # zeta_12^3 = i
    True
    """

    _cache: dict[int, "CyclotomicField"] = {}

    def __new__(cls, n: int):
        if not isinstance(n, (int, np.integer)) or n < 1:
            raise ValueError(f"conductor {n!r} must be a positive integer")
        n = int(n)
        if n > MAX_CONDUCTOR:
            raise SizeLimitError(
                f"cyclotomic conductor {n} is larger than the supported {MAX_CONDUCTOR}"
            )
        if n in cls._cache:
            return cls._cache[n]
        self = super().__new__(cls)
        self.n = n
        self.modulus = fmpq_poly(fmpz_poly.cyclotomic(n))
        self.degree = self.modulus.degree()
        self.zero = Cyclotomic(self, fmpq_poly([]))
        self.one = Cyclotomic(self, fmpq_poly([1]))
        cls._cache[n] = self
        return self

    def __repr__(self) -> str:
        return f"CyclotomicField({self.n})"

    def __reduce__(self):
        return (CyclotomicField, (self.n,))

    # -- constructors -------------------------------------------------
    def __call__(self, x) -> "Cyclotomic":
        """Embed a rational number (or an element of a subfield)."""
        if isinstance(x, Cyclotomic):
            return x.to_field(self.n)
        return Cyclotomic(self, fmpq_poly([_to_fmpq(x)]))

    def zeta(self, k: int = 1) -> "Cyclotomic":
        """``zeta_n^k`` (any integer ``k``)."""
        return self.from_exponents([k])

    def from_group_ring(self, coeffs: Sequence, denominator: int = 1) -> "Cyclotomic":
        """``(sum_e coeffs[e] zeta_n^e) / denominator``, ``len(coeffs) <= n``.

        ``coeffs`` may be a numpy integer array (fast path) or a list of rationals.
        """
        if len(coeffs) > self.n:
            raise ValueError("group-ring vector longer than the conductor")
        if isinstance(coeffs, np.ndarray):
            q = fmpq_poly(fmpz_poly(coeffs.tolist())) % self.modulus
        else:
            q = fmpq_poly([_to_fmpq(c) for c in coeffs]) % self.modulus
        if denominator != 1:
            q = q / _to_fmpq(denominator)
        return Cyclotomic(self, q)

    def from_exponents(self, exponents: Iterable[int], weights: Iterable | None = None,
                       denominator: int = 1) -> "Cyclotomic":
        """``(sum_j weights[j] zeta_n^exponents[j]) / denominator``; integer weights.

        Exponents are taken modulo ``n``.  Vectorised with numpy (exact for
        integer weights whose partial sums stay below 2**62).

        >>> F = CyclotomicField(5)
        >>> F.from_exponents([0, 1, 2, 3, 4]) == F.zero     # 1 + z + ... + z^4 = 0
        True
        """
        e = np.asarray(list(exponents) if not isinstance(exponents, np.ndarray) else exponents,
                       dtype=np.int64) % self.n
        if weights is None:
            vec = np.bincount(e, minlength=self.n).astype(np.int64)
        else:
            w = np.asarray(list(weights) if not isinstance(weights, np.ndarray) else weights)
            if w.dtype == object:
                vec = [0] * self.n
                for ee, ww in zip(e.tolist(), w.tolist()):
                    vec[ee] += ww
                return self.from_group_ring(vec, denominator)
            vec = _signed_bincount(e, w.astype(np.int64), self.n)
        return self.from_group_ring(vec, denominator)


def _signed_bincount(idx: np.ndarray, w: np.ndarray, n: int) -> np.ndarray:
    """Exact integer ``bincount`` with int64 weights (numpy's uses float64)."""
    out = np.zeros(n, dtype=np.int64)
    np.add.at(out, idx, w)
    return out


@lru_cache(maxsize=None)
def cyclotomic_field(n: int) -> CyclotomicField:
    """The cached field ``Q(zeta_n)``."""
    return CyclotomicField(n)


def _common(a: "Cyclotomic", b: "Cyclotomic") -> tuple["Cyclotomic", "Cyclotomic"]:
    if a.field is b.field:
        return a, b
    m = math.lcm(a.field.n, b.field.n)
    return a.to_field(m), b.to_field(m)


class Cyclotomic:
    """An exact element of ``Q(zeta_n)``.

    Examples
    --------
    >>> F = CyclotomicField(8)
    >>> z = F.zeta()
    >>> r2 = z + z**-1                 # sqrt(2)
    >>> r2 * r2 == F(2)
    True
    >>> (1 / r2) * r2 == F.one
    True
    >>> mpmath.nstr(r2.to_mpc(20).real, 20)
    '1.4142135623730950488'
    """

    __slots__ = ("field", "poly")

    def __init__(self, field: CyclotomicField, poly: fmpq_poly):
        self.field = field
        self.poly = poly

    # -- structure ----------------------------------------------------
    @property
    def conductor(self) -> int:
        return self.field.n

    def to_field(self, m: int) -> "Cyclotomic":
        """The same number as an element of ``Q(zeta_m)`` (requires ``n | m``)."""
        n = self.field.n
        if m == n:
            return self
        if m % n:
            raise ValueError(f"Q(zeta_{n}) is not a subfield of Q(zeta_{m})")
        F = CyclotomicField(m)
        step = m // n
        coeffs = self.poly.coeffs()
        vec = [fmpq(0)] * m
        for i, c in enumerate(coeffs):
            vec[(i * step) % m] += c
        return Cyclotomic(F, fmpq_poly(vec) % F.modulus)

    def reduced(self) -> "Cyclotomic":
        """The same number in the smallest cyclotomic field that contains it.

        The fields ``Q(zeta_d)``, ``d | n``, that contain ``x`` are closed under ``gcd`` (with
        ``Q(zeta_2m) = Q(zeta_m)`` for odd ``m``), so ``n`` is divided by one prime at a time while
        the number stays inside (:meth:`_descend`); the result's conductor is never ``2 mod 4``.
        Exact: the number is only rewritten.

        >>> F = CyclotomicField(40)
        >>> x = -2 * F.zeta(4) - F.zeta(12)              # -2 zeta_10 - zeta_10^3
        >>> y = x.reduced()
        >>> y.conductor, str(y), y == x
        (5, '2*z5^3 + z5^4', True)
        >>> CyclotomicField(48).zeta(12).reduced()       # i
        Cyclotomic(4, z4)
        >>> (CyclotomicField(12).zeta() + CyclotomicField(12).zeta(-1)).reduced().conductor   # sqrt(3)
        12

        References
        ----------
        L. C. Washington, *Introduction to Cyclotomic Fields*, 2nd ed., Springer GTM 83 (1997),
        ch. 2 (``Q(zeta_a) cap Q(zeta_b) = Q(zeta_gcd(a,b))``; the basis ``zeta_p^k``, ``1 <= k < p``,
        of ``Q(zeta_mp)`` over ``Q(zeta_m)``, ``p`` prime not dividing ``m``).
        """
        x = self
        if x.is_rational():
            return x if x.field.n == 1 else CyclotomicField(1)(x.rational_value())
        moved = True
        while moved:
            moved = False
            for p in _primes_of(x.field.n):
                y = x._descend(p)
                if y is not None:
                    x, moved = y, True
                    break
        return x

    def _descend(self, p: int) -> "Cyclotomic | None":
        """The number as an element of ``Q(zeta_{n/p})`` (``p`` a prime dividing ``n``), or ``None``
        when it is not in that subfield.

        ``p^2 | n``: ``1, zeta, ..., zeta^(p-1)`` is a basis over ``Q(zeta_{n/p})`` and
        ``Phi_n(x) = Phi_{n/p}(x^p)``, so the number is inside exactly when only exponents divisible by
        ``p`` occur.  ``p`` exactly dividing ``n = m p``: with ``zeta_n = zeta_m^a zeta_p^b``
        (``a p + b m = 1 mod n``) the number is ``sum_k y_k zeta_p^k``, ``y_k`` in ``Q(zeta_m)``, and since
        ``zeta_p^k``, ``1 <= k < p``, is a basis and ``1 = -sum_k zeta_p^k``, it is inside exactly when
        every ``y_k - y_0`` (``k >= 1``) is the same number, and then equals ``y_0 - y_1``."""
        n = self.field.n
        m = n // p
        coeffs = self.poly.coeffs()
        if m % p == 0:
            if any(c != 0 and i % p for i, c in enumerate(coeffs)):
                return None
            return Cyclotomic(CyclotomicField(m), fmpq_poly(coeffs[::p]))
        F = CyclotomicField(m)
        a = pow(p, -1, m) if m > 1 else 0           # a p = 1 mod m
        b = pow(m, -1, p)                           # b m = 1 mod p
        vecs = [[fmpq(0)] * m for _ in range(p)]
        for i, c in enumerate(coeffs):
            if c != 0:
                vecs[(b * i) % p][(a * i) % m] += c
        ys = [fmpq_poly(v) % F.modulus for v in vecs]
        diff = ys[1] - ys[0]
        if any(ys[k] - ys[0] != diff for k in range(2, p)):
            return None
        return Cyclotomic(F, -diff)

    def galois(self, j: int) -> "Cyclotomic":
        """Image under the automorphism ``zeta_n -> zeta_n^j`` (``gcd(j, n) = 1``)."""
        n = self.field.n
        if math.gcd(j, n) != 1:
            raise ValueError(f"{j} is not a unit modulo {n}")
        vec = [fmpq(0)] * n
        for i, c in enumerate(self.poly.coeffs()):
            vec[(i * j) % n] += c
        return Cyclotomic(self.field, fmpq_poly(vec) % self.field.modulus)

    def conj(self) -> "Cyclotomic":
        """Complex conjugate (``zeta_n -> zeta_n^-1``)."""
        return self.galois(-1 % self.field.n) if self.field.n > 2 else self

    conjugate = conj

    # -- arithmetic ---------------------------------------------------
    def _coerce(self, other) -> "Cyclotomic | None":
        if isinstance(other, Cyclotomic):
            return other
        if isinstance(other, (int, Fraction, fmpq, fmpz, np.integer)):
            return self.field(other)
        return None

    def __add__(self, other):
        o = self._coerce(other)
        if o is None:
            return NotImplemented
        a, b = _common(self, o)
        return Cyclotomic(a.field, a.poly + b.poly)

    __radd__ = __add__

    def __neg__(self):
        return Cyclotomic(self.field, -self.poly)

    def __sub__(self, other):
        o = self._coerce(other)
        if o is None:
            return NotImplemented
        a, b = _common(self, o)
        return Cyclotomic(a.field, a.poly - b.poly)

    def __rsub__(self, other):
        o = self._coerce(other)
        if o is None:
            return NotImplemented
        return o - self

    def __mul__(self, other):
        o = self._coerce(other)
        if o is None:
            return NotImplemented
        if not isinstance(other, Cyclotomic):
            return Cyclotomic(self.field, self.poly * _to_fmpq(other))
        a, b = _common(self, o)
        return Cyclotomic(a.field, (a.poly * b.poly) % a.field.modulus)

    __rmul__ = __mul__

    def inverse(self) -> "Cyclotomic":
        """Multiplicative inverse (extended Euclid with ``Phi_n``)."""
        if self.poly.is_zero():
            raise ZeroDivisionError("inverse of 0 in a cyclotomic field")
        g, s, _t = self.poly.xgcd(self.field.modulus)
        # g is a non-zero constant since Phi_n is irreducible
        return Cyclotomic(self.field, (s / g.coeffs()[0]) % self.field.modulus)

    def __truediv__(self, other):
        o = self._coerce(other)
        if o is None:
            return NotImplemented
        if not isinstance(other, Cyclotomic):
            q = _to_fmpq(other)
            if q == 0:
                raise ZeroDivisionError("division by 0")
            return Cyclotomic(self.field, self.poly / q)
        a, b = _common(self, o)
        return a * b.inverse()

    def __rtruediv__(self, other):
        o = self._coerce(other)
        if o is None:
            return NotImplemented
        return o * self.inverse()

    def __pow__(self, e: int):
        if not isinstance(e, (int, np.integer)):
            return NotImplemented
        e = int(e)
        if e < 0:
            return self.inverse() ** (-e)
        result = self.field.one
        base = self
        while e:
            if e & 1:
                result = result * base
            e >>= 1
            if e:
                base = base * base
        return result

    def __eq__(self, other) -> bool:
        o = self._coerce(other)
        if o is None:
            return NotImplemented
        a, b = _common(self, o)
        return a.poly == b.poly

    def __hash__(self):
        return hash(("Cyclotomic", self.field.n, str(self.poly)))

    def is_zero(self) -> bool:
        return self.poly.is_zero()

    def is_rational(self) -> bool:
        return self.poly.degree() <= 0

    def rational_value(self) -> Fraction:
        """The rational number, if the element is rational (else an error)."""
        if not self.is_rational():
            raise InexactDivisionError(f"{self} is not a rational number")
        if self.poly.is_zero():
            return Fraction(0)
        c = self.poly.coeffs()[0]
        return Fraction(int(c.p), int(c.q))

    # -- numerics -----------------------------------------------------
    def to_acb(self, prec: int) -> acb:
        """Ball enclosure of the value at ``zeta_n = exp(2 pi i/n)`` with ``prec`` bits."""
        with working_precision(int((prec) / 3.3219280948873626) + 2):  # bits -> digits
            z = acb(arb(2) / self.field.n).exp_pi_i()
            num = self.poly.numer()
            return num(z) / arb(self.poly.denom())

    def to_mpc(self, digits: int = 30) -> mpmath.mpc:
        """Numeric value with ``digits`` correct significant digits (checked twice)."""
        return acb_to_mpc_checked(lambda prec: self.to_acb(prec), digits)

    def __complex__(self):
        return complex(self.to_mpc(17))

    # -- printing -----------------------------------------------------
    def sparse_exponents(self) -> list[fmpq]:
        """Coefficients ``c_e`` (``0 <= e < n``) of a short way of writing the number as
        ``sum_e c_e zeta_n^e``: the power basis modulo ``Phi_n`` (exponents below ``phi(n)``) moved
        by the relations ``sum_{j<p} zeta_n^(k + j n/p) = 0`` (``p`` a prime dividing ``n``) while that
        removes terms (each block shifted by its most frequent coefficient).  Exact; used for
        printing (``n`` above 20000: the power basis).

        >>> F = CyclotomicField(5)
        >>> x = 2 * F.zeta(3) + F.zeta(4)
        >>> [int(c) for c in x.poly.coeffs()]    # the power basis: -1 - z - z^2 + z^3
        [-1, -1, -1, 1]
        >>> str(x)                               # the printed form
        '2*z5^3 + z5^4'
        """
        n = self.field.n
        coeffs = self.poly.coeffs()
        vec = list(coeffs) + [fmpq(0)] * (n - len(coeffs))      # degree < phi(n) <= n (n > 1)
        if n > 20000 or n == 1:
            return vec
        primes = _primes_of(n)
        better = True
        while better:
            better = False
            for p in primes:
                step = n // p
                for k in range(step):
                    idx = range(k, n, step)
                    vals = [vec[i] for i in idx]
                    nz = sum(1 for v in vals if v != 0)
                    if nz <= p // 2:
                        continue                  # the shift cannot remove terms
                    counts: dict = {}
                    for v in vals:
                        if v != 0:
                            counts[v] = counts.get(v, 0) + 1
                    t = max(counts, key=counts.get)
                    after = sum(1 for v in vals if v != t)
                    if after < nz:
                        for i in idx:
                            vec[i] -= t
                        better = True
        return vec

    def __str__(self) -> str:
        return _poly_str(fmpq_poly(self.sparse_exponents()), f"z{self.field.n}")

    def __repr__(self) -> str:
        return f"Cyclotomic({self.field.n}, {self})"


def _poly_str(poly: fmpq_poly, var: str) -> str:
    coeffs = poly.coeffs()
    terms = []
    for i, c in enumerate(coeffs):
        if c == 0:
            continue
        cs = str(c)
        if i == 0:
            terms.append(cs)
        else:
            mon = var if i == 1 else f"{var}^{i}"
            if c == 1:
                terms.append(mon)
            elif c == -1:
                terms.append(f"-{mon}")
            else:
                terms.append(f"{cs}*{mon}")
    if not terms:
        return "0"
    out = terms[0]
    for t in terms[1:]:
        out += f" - {t[1:]}" if t.startswith("-") else f" + {t}"
    return out


# ---------------------------------------------------------------------------
# numeric helpers


def acb_to_mpc(z: acb, digits: int) -> mpmath.mpc:
    """Convert a ball's midpoint to an ``mpmath.mpc`` carrying ``digits`` digits."""
    with working_precision(digits + 10):
        # a component whose ball contains 0 and is below the accuracy is reported as 0
        re = mpmath.mpf(0) if z.real.contains(0) else mpmath.mpf(z.real.mid().str(digits + 10, radius=False))
        im = mpmath.mpf(0) if z.imag.contains(0) else mpmath.mpf(z.imag.mid().str(digits + 10, radius=False))
        return mpmath.mpc(re, im)


def _radius_ok(z: acb, digits: int) -> bool:
    rad = max(float(z.real.rad()), float(z.imag.rad()))
    mag = max(abs(float(z.real.mid())), abs(float(z.imag.mid())), 1e-300)
    # absolute accuracy 10^-digits relative to max(|z|, 1) (exact zeros occur)
    return rad <= 10.0 ** (-digits - 2) * max(mag, 1.0)


def acb_to_mpc_checked(compute, digits: int, max_prec: int = 1 << 16) -> mpmath.mpc:
    """Evaluate ``compute(prec) -> acb`` until the ball is small enough; re-check.

    The value is accepted when the enclosure at working precision is below
    ``10^-digits`` (relative to ``max(|z|, 1)``) and a recomputation with twice
    the guard bits agrees with it to that accuracy; otherwise the precision is
    doubled.  :class:`~knotobs.errors.PrecisionError` if ``max_prec`` is reached.
    """
    prec = int(digits * 3.33) + 40
    while prec <= max_prec:
        z1 = compute(prec)
        if _radius_ok(z1, digits):
            z2 = compute(2 * prec)
            if _radius_ok(z2, digits) and z1.overlaps(z2):
                return acb_to_mpc(z2, digits)
        prec *= 2
    raise PrecisionError(
        f"could not certify {digits} digits with up to {max_prec} bits; request fewer digits"
    )


# ---------------------------------------------------------------------------
# roots of unity and square roots


def root_of_unity(x: Fraction | int) -> Cyclotomic:
    """``exp(2 pi i x)`` for rational ``x`` as an element of ``Q(zeta_den(x))``.

    >>> root_of_unity(Fraction(1, 4)) == CyclotomicField(4).zeta()
    True
    """
    x = Fraction(x)
    F = CyclotomicField(x.denominator)
    return F.zeta(x.numerator)


def factor_int(n: int) -> list[tuple[int, int]]:
    """``[(p, e), ...]`` with ``n = prod p^e`` (``n >= 1``), by FLINT (fast for the sizes of levels,
    e.g. ``10^20``, where trial division took seconds).

    >>> factor_int(360), factor_int(1)
    ([(2, 3), (3, 2), (5, 1)], [])
    """
    if n < 1:
        raise ValueError("factor_int needs a positive integer")
    from flint import fmpz

    return [(int(p), int(e)) for p, e in fmpz(n).factor()] if n > 1 else []


def squarefree_part(n: int) -> tuple[int, int]:
    """``(s, m)`` with ``n = s^2 m`` and ``m`` squarefree (``n > 0``)."""
    if n <= 0:
        raise ValueError("squarefree_part needs a positive integer")
    s, m = 1, 1
    for p, e in factor_int(n):
        s *= p ** (e // 2)
        if e % 2:
            m *= p
    return s, m


def _squarefree_divisors(n: int) -> list[int]:
    """The squarefree divisors of ``n >= 1``, ascending."""
    out = [1]
    for p in _primes_of(n):
        out += [x * p for x in out]
    return sorted(out)


def _primes_of(n: int) -> list[int]:
    """The distinct primes dividing ``n >= 1``."""
    return [p for p, _ in factor_int(n)]


def sqrt_rational(r: Fraction | int) -> Cyclotomic:
    """The positive square root of a rational ``r > 0`` in its cyclotomic field.

    ``sqrt(m)`` (``m`` squarefree) lives in ``Q(zeta_m)`` if ``m = 1 mod 4`` and in
    ``Q(zeta_4m)`` otherwise; it is built from Gauss sums (Ireland & Rosen 1990,
    ch. 6).

    >>> s = sqrt_rational(Fraction(2, 7))
    >>> s * s == CyclotomicField(1)(Fraction(2, 7))
    True
    >>> s.conductor
    56
    >>> mpmath.nstr(s.to_mpc(15).real, 15)
    '0.534522483824849'
    """
    r = Fraction(r)
    if r <= 0:
        raise ValueError(f"sqrt_rational needs r > 0, got {r}")
    a, b = r.numerator, r.denominator
    s, m = squarefree_part(a * b)          # sqrt(a/b) = s sqrt(m) / b
    if m == 1:
        return CyclotomicField(1)(Fraction(s, b))
    n = m if m % 4 == 1 else 4 * m
    F = CyclotomicField(n)
    val = F.one
    t3 = 0
    for p in _primes_of(m):
        if p == 2:
            z8 = F.zeta(n // 8)
            val = val * (z8 + z8 ** -1)
            continue
        step = n // p
        exps = list(range(1, p))
        weights = [1 if pow(a_, (p - 1) // 2, p) == 1 else -1 for a_ in exps]
        g = F.from_exponents([step * e for e in exps], weights)
        if p % 4 == 3:
            t3 += 1                         # g_p = i sqrt(p)
        val = val * g
    # val = i^t3 sqrt(m); divide by i^t3
    if t3 % 2 == 0:
        val = val * (-1) ** (t3 // 2)
    else:
        val = val * F.zeta((-t3 * (n // 4)) % n)
    return val * Fraction(s, b)


class CyclotomicSurd:
    """An exact number ``sqrt(r) * c`` with ``r > 0`` rational and ``c`` cyclotomic.

    Finite-level Chern–Simons values have this shape (``S``-matrix entries carry
    ``sqrt(2/K)``-type factors).  ``r`` is kept squarefree-normalised: ``r`` is
    either 1 or a squarefree integer divided by nothing, the rest moved into ``c``.

    Examples
    --------
    >>> F = CyclotomicField(4)
    >>> x = CyclotomicSurd(F(3), Fraction(1, 8))     # 3 sqrt(1/8) = (3/4) sqrt(2)
    >>> x.radicand, x.coefficient
    (Fraction(2, 1), Cyclotomic(1, 3/4))
    >>> (x * x).radicand
    Fraction(1, 1)
    """

    __slots__ = ("coefficient", "radicand")

    def __init__(self, coefficient: Cyclotomic, radicand: Fraction | int = 1):
        r = Fraction(radicand)
        if r <= 0:
            raise ValueError("radicand must be positive")
        s, m = squarefree_part(r.numerator * r.denominator)
        c = coefficient * Fraction(s, r.denominator)
        if c.is_rational():
            c = CyclotomicField(1)(c.rational_value())
        self.coefficient = c
        self.radicand = Fraction(m)

    def __mul__(self, other):
        if isinstance(other, CyclotomicSurd):
            r1, r2 = self.radicand, other.radicand
            g = math.gcd(int(r1), int(r2))
            # sqrt(r1) sqrt(r2) = g sqrt(r1 r2 / g^2)
            return CyclotomicSurd(self.coefficient * other.coefficient * g,
                                  Fraction(int(r1) * int(r2), g * g))
        if isinstance(other, (Cyclotomic, int, Fraction)):
            return CyclotomicSurd(self.coefficient * other, self.radicand)
        return NotImplemented

    __rmul__ = __mul__

    def __add__(self, other):
        if isinstance(other, CyclotomicSurd):
            if other.radicand == self.radicand:
                return CyclotomicSurd(self.coefficient + other.coefficient, self.radicand)
            return CyclotomicSurd(self.as_cyclotomic() + other.as_cyclotomic(), 1)
        return NotImplemented

    def __neg__(self):
        return CyclotomicSurd(-self.coefficient, self.radicand)

    def inverse(self) -> "CyclotomicSurd":
        # 1/(c sqrt(r)) = (1/c) sqrt(r) / r
        return CyclotomicSurd(self.coefficient.inverse() / self.radicand, self.radicand)

    def __truediv__(self, other):
        if isinstance(other, CyclotomicSurd):
            return self * other.inverse()
        if isinstance(other, (Cyclotomic, int, Fraction)):
            return CyclotomicSurd(self.coefficient / other, self.radicand)
        return NotImplemented

    def __pow__(self, e: int):
        if not isinstance(e, int):
            return NotImplemented
        base = self if e >= 0 else self.inverse()
        out = CyclotomicSurd(CyclotomicField(1).one, 1)
        for _ in range(abs(e)):
            out = out * base
        return out

    def __sub__(self, other):
        return self + (-other)

    def conj(self) -> "CyclotomicSurd":
        return CyclotomicSurd(self.coefficient.conj(), self.radicand)

    def reduced(self) -> "CyclotomicSurd":
        """The printed normal form: the shortest of ``sqrt(r) * c`` with ``c`` in its smallest
        cyclotomic field (:meth:`Cyclotomic.reduced`), the whole number in its smallest field
        (``r = 1``), and ``sqrt(m) * (x / sqrt(m))`` for the squarefree ``m > 1`` whose square root
        lies in that field (its discriminant, ``m`` or ``4m``, divides the conductor; a number
        ``sqrt(m) y`` lies in ``Q(zeta_lcm(disc, cond y))``); tried for conductors up to 1200.
        The same number.

        >>> F = CyclotomicField(48)
        >>> x = CyclotomicSurd(Fraction(-1, 3) + Fraction(2, 3) * F.zeta(8), 3)    # = i
        >>> str(x), str(x.reduced())
        ('sqrt(3) * (-1/3 + 2/3*z48^8)', 'z4')
        >>> str(CyclotomicSurd(CyclotomicField(40).zeta(2), 10).reduced())
        'sqrt(10) * (z20)'
        >>> w = CyclotomicField(12).zeta() / 3 - CyclotomicField(12).zeta(3) / 6   # sqrt(3)/6
        >>> str(CyclotomicSurd(w, 1).reduced())
        'sqrt(3) * (1/6)'
        """
        c = self.coefficient.reduced()
        if self.is_zero():
            return CyclotomicSurd(c, 1)
        forms = [CyclotomicSurd(c, self.radicand)]
        m = self.radicand.numerator * self.radicand.denominator
        if math.lcm(c.conductor, m if m % 4 == 1 else 4 * m) > 1200:
            return forms[0]
        whole = (c * sqrt_rational(self.radicand)).reduced() if self.radicand != 1 else c
        forms.append(CyclotomicSurd(whole, 1))
        d = whole.conductor
        if not whole.is_rational() and d <= 1200:
            for q in _squarefree_divisors(d):
                if q > 1 and d % (q if q % 4 == 1 else 4 * q) == 0:
                    forms.append(CyclotomicSurd((whole * sqrt_rational(q) / q).reduced(), q))
        return min(forms, key=lambda f: len(str(f)))

    def as_cyclotomic(self) -> Cyclotomic:
        """The same number inside one cyclotomic field (square root via Gauss sums)."""
        if self.radicand == 1:
            return self.coefficient
        return self.coefficient * sqrt_rational(self.radicand)

    def __eq__(self, other) -> bool:
        if isinstance(other, CyclotomicSurd):
            if self.radicand == other.radicand:
                return self.coefficient == other.coefficient
            return self.as_cyclotomic() == other.as_cyclotomic()
        if isinstance(other, (Cyclotomic, int, Fraction)):
            return self.as_cyclotomic() == other
        return NotImplemented

    def __hash__(self):
        return hash(("CyclotomicSurd", hash(self.coefficient), self.radicand))

    def is_zero(self) -> bool:
        return self.coefficient.is_zero()

    @property
    def conductor(self) -> int:
        return self.coefficient.conductor

    def to_acb(self, prec: int) -> acb:
        with working_precision(int((prec) / 3.3219280948873626) + 2):  # bits -> digits
            rad = arb(fmpq(self.radicand.numerator, self.radicand.denominator)).sqrt()
            return self.coefficient.to_acb(prec) * rad

    def to_mpc(self, digits: int = 30) -> mpmath.mpc:
        return acb_to_mpc_checked(lambda prec: self.to_acb(prec), digits)

    def __str__(self) -> str:
        """``sqrt(r) * (c)``; an exact zero prints as ``0``.

        >>> str(CyclotomicSurd(CyclotomicField(5)(0), Fraction(10)))
        '0'
        """
        c = str(self.coefficient)
        if self.radicand == 1 or self.is_zero():
            return "0" if self.is_zero() else c
        return f"sqrt({self.radicand}) * ({c})"

    def __repr__(self) -> str:
        return f"CyclotomicSurd({self.coefficient!r}, {self.radicand!r})"
