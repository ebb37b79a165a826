"""From ``s`` to ``z = s - 1/s`` without a quadratic basis change.

A Laurent polynomial ``f(s)`` lies in ``Z[z]`` exactly when it is invariant under
``s -> -1/s`` (the coefficient of ``s^-e`` is ``(-1)^e`` times that of ``s^e``): then
``f = c_0 + sum_{e>0} c_e (s^e + (-1)^e s^-e)`` and ``s^e + (-1)^e s^-e`` is the Lucas
polynomial ``L_e(z)`` (``L_0 = 2``, ``L_1 = z``, ``L_e = z L_(e-1) + L_(e-2)``), whose
coefficients are integers.

When only even powers of ``s`` occur (knots), the same is done in ``w = s^2`` and
``u = z^2 = w - 2 + 1/w`` with ``(w - 1)^2`` in place of ``s^2 - 1`` (half the degree).

The conversion is divide and conquer on ``F(s) = s^d f(s)`` (a polynomial of degree
``2d``): writing ``g = g_lo + z^k g_hi`` with ``deg g_lo < k``,

    F = (s^2 - 1)^k F_hi + s^(d-k+1) F_lo,   F_hi = s^(d-k) g_hi(z),   F_lo = s^(k-1) g_lo(z),

so ``F_hi = F (s^2 - 1)^(-k) mod s^(d-k+1)`` (a truncated power series; ``(1 - s^2)^(-k)``
has the binomial coefficients ``C(k-1+i, i)``) determines the low half of ``F_hi``, its
symmetry the rest, and ``F_lo`` is the exact remainder.  Both halves recurse; the cost is
``O(M(d) log d)`` with ``M`` the cost of one FLINT multiplication.

References
----------
E. Lucas, Amer. J. Math. 1 (1878) 184–240 (the polynomials ``L_e``); divide-and-conquer basis
conversion as in J. von zur Gathen, J. Gerhard, *Modern Computer Algebra*, 3rd ed. (2013), §9.
"""

from __future__ import annotations

from functools import lru_cache

from flint import fmpz, fmpz_poly

from knotobs.errors import InexactDivisionError
from knotobs.polynomials.laurent import Laurent

__all__ = ["to_z", "is_z_invariant", "lucas_coefficients"]

_BASE = 24


def lucas_coefficients(e: int) -> dict[int, int]:
    """``s^e + (-1)^e s^-e = L_e(z)`` as ``{power of z: coefficient}`` (closed form, for checks).

    ``L_e(z) = sum_k e/(e-k) C(e-k, k) z^(e-2k)`` (Lucas 1878).

    >>> lucas_coefficients(4)
    {4: 1, 2: 4, 0: 2}
    """
    from math import comb

    if e == 0:
        return {0: 2}
    return {e - 2 * k: e * comb(e - k, k) // (e - k) for k in range(e // 2 + 1)}


def _inverse_series(k: int, M: int, mode: str) -> fmpz_poly:
    """``phi^(-k) mod x^M`` for ``phi = x^2 - 1`` (mode "z") or ``phi = (x - 1)^2`` (mode "u")."""
    geo = [0] * M
    if mode == "z":   # (x^2 - 1)^(-k) = (-1)^k (1 + x^2 + x^4 + ...)^k
        geo[::2] = [1] * len(geo[::2])
        p = fmpz_poly(geo).pow_trunc(k, M)
        return -p if k % 2 else p
    geo[:] = [1] * M  # (x - 1)^(-2k) = (1 + x + x^2 + ...)^(2k)
    return fmpz_poly(geo).pow_trunc(2 * k, M)


@lru_cache(maxsize=512)
def _phi_power(k: int, mode: str) -> fmpz_poly:
    return (fmpz_poly([-1, 0, 1]) if mode == "z" else fmpz_poly([1, -2, 1])) ** k


def _base_case(F: fmpz_poly, d: int, mode: str) -> list[int]:
    # peel from the top: x^(d-j) phi^j has degree d + j and leading coefficient 1
    g = [0] * (d + 1)
    for j in range(d, -1, -1):
        c = int(F[d + j]) if F.degree() >= d + j else 0
        if c:
            g[j] = c
            F = F - (_phi_power(j, mode) * c).left_shift(d - j)
    return g


def _conv(F: fmpz_poly, d: int, mode: str = "z") -> list[int]:
    """``g`` (lowest first, length ``d + 1``) with ``F(x) = sum_j g_j x^(d-j) phi(x)^j``.

    Mode "z": ``phi = x^2 - 1`` (``x = s``, ``F = s^d g(z)``, ``z = s - 1/s``); mode "u":
    ``phi = (x - 1)^2`` (``x = w = s^2``, ``F = w^d g(u)``, ``u = z^2 = w - 2 + 1/w``).
    """
    if d <= _BASE:
        return _base_case(F, d, mode)
    k = (d + 1) // 2
    M = d - k + 1
    low = F.truncate(M).mul_low(_inverse_series(k, M, mode), M)
    lc = low.coeffs()
    lc = (lc + [fmpz(0)] * M)[:M]
    D = d - k
    if mode == "z":
        full = lc + [(-lc[D - e] if e % 2 else lc[D - e]) for e in range(1, D + 1)]
    else:
        full = lc + lc[D - 1 :: -1] if D > 0 else lc
    F_hi = fmpz_poly(full)
    # F_lo = (F - phi^k F_hi) / x^M has degree 2(k-1) and the same symmetry, so its low k
    # coefficients (a truncated product) determine it
    K = k - 1
    rest = F.truncate(M + K + 1) - _phi_power(k, mode).mul_low(F_hi, M + K + 1)
    if not rest.truncate(M).is_zero():  # pragma: no cover - cannot happen for invariant input
        raise InexactDivisionError("not a polynomial in z = s - 1/s")
    lo = rest.right_shift(M).coeffs()
    lo = lo + [fmpz(0)] * (K + 1 - len(lo))
    if mode == "z":
        F_lo = fmpz_poly(lo + [(-lo[K - e] if e % 2 else lo[K - e]) for e in range(1, K + 1)])
    else:
        F_lo = fmpz_poly(lo + lo[K - 1 :: -1] if K > 0 else lo)
    return _conv(F_lo, K, mode) + _conv(F_hi, D, mode)


def is_z_invariant(f: Laurent) -> bool:
    """Whether ``f(s)`` is invariant under ``s -> -1/s`` (integer exponents only).

    >>> s = Laurent.gen("s")
    >>> is_z_invariant(s - s**-1), is_z_invariant(s + s**-1)
    (True, False)
    """
    c = f.canonical()
    if c.is_zero():
        return True
    if c._d != 1:
        return False
    lo, deg = c._s, c._p.degree()
    if lo != -(lo + deg):
        return False
    co = c._p.coeffs()
    n = len(co)
    d = -lo
    for i in range(n // 2):
        e = i - d                      # exponent of co[i]; its partner is -e at index n - 1 - i
        a, b = co[i], co[n - 1 - i]
        if (a != b) if e % 2 == 0 else (a != -b):
            return False
    return True


def to_z(f: Laurent) -> dict[int, int]:
    """``f(s) = sum_j c_j z^j`` with ``z = s - 1/s``: ``{j: c_j}`` for the nonzero ``c_j``.

    Raises :class:`~knotobs.errors.InexactDivisionError` if ``f`` is not a polynomial in ``z``.

    Examples
    --------
    >>> s = Laurent.gen("s")
    >>> to_z(s**2 + s**-2)                  # z^2 + 2
    {0: 2, 2: 1}
    >>> to_z(s**4 + s**-4) == lucas_coefficients(4)
    True
    """
    if not is_z_invariant(f):
        raise InexactDivisionError(f"{f} is not a Laurent polynomial in z = s - 1/s")
    c = f.canonical()
    if c.is_zero():
        return {}
    d = -c._s
    defl = int(c._p.deflation()[1]) if c._p.degree() > 0 else 2
    if d % 2 == 0 and defl % 2 == 0:
        # only even powers of s: a polynomial in w = s^2 symmetric under w -> 1/w, i.e. in u = z^2
        g = _conv(c._p.deflate(2) if c._p.degree() > 0 else c._p, d // 2, "u")
        return {2 * j: v for j, v in enumerate(g) if v}
    g = _conv(c._p, d, "z")
    return {j: v for j, v in enumerate(g) if v}
