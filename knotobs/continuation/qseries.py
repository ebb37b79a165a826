r"""q-series of the Poincaré sphere inside the unit disk and their radial limits.

Lawrence and Zagier (Asian J. Math. 3 (1999) 93–107) write the SU(2) invariant of
the Poincaré sphere ``Sigma(2,3,5)`` (oriented as the link of ``x^2 + y^3 + z^5 = 0``,
CONVENTIONS §9) through the false theta function

    ``A(q) = sum_{n >= 1} chi_+(n) q^((n^2 - 1)/120)``,
    ``chi_+(n) = +1`` for ``n = 1, 11, 19, 29``, ``-1`` for ``n = 31, 41, 49, 59 (mod 60)``, else 0,

which converges for ``|q| < 1``.  Its radial limit at ``xi = exp(2 pi i/K)`` is the
finite sum ``-(1/M) sum_{n=1}^{M} n chi_+(n) xi^((n^2-1)/120)``, ``M = 60 K``, and

    ``lim_{q -> xi radially} A(q) = 2 [1 + xi (1 - xi) tau_K]``,   ``tau_K = Z_K/Z_K(S^3)``.

The character ``chi_+`` is Hikami's ``chi_{2P}^{(1,1,1)}`` for ``(p_1,p_2,p_3) = (2,3,5)``:
``chi(n) = eps_1 eps_2 eps_3`` for ``n = P (1 + sum_j eps_j/p_j) mod 2P``
(K. Hikami, Int. J. Math. 16 (2005) 661–685); :func:`hikami_character` builds it for any
pairwise coprime triple (the relation of the radial limit to ``tau_K`` is only set up here
for ``Sigma(2,3,5)``).
"""

from __future__ import annotations

from fractions import Fraction
from itertools import product

import mpmath

from knotobs.continuation._num import parse_complex
from knotobs.errors import InvalidSeifertDataError, SizeLimitError
from knotobs.polynomials.laurent import Laurent

__all__ = [
    "hikami_character",
    "poincare_false_theta",
    "poincare_series",
    "poincare_radial_limit",
    "tau_from_radial_limit",
]


def hikami_character(ps: tuple[int, int, int]) -> dict[int, int]:
    """``{n mod 2P: chi(n)}`` with ``chi(n) = eps_1 eps_2 eps_3`` at ``n = P(1 + sum eps_j/p_j)``.

    >>> sorted(hikami_character((2, 3, 5)).items())
    [(1, 1), (11, 1), (19, 1), (29, 1), (31, -1), (41, -1), (49, -1), (59, -1)]

    References
    ----------
    K. Hikami, Int. J. Math. 16 (2005) 661–685.
    """
    if len(ps) != 3 or any(not isinstance(p, int) or p < 2 for p in ps):
        raise InvalidSeifertDataError(f"{ps!r}: need three integers >= 2")
    P = ps[0] * ps[1] * ps[2]
    out: dict[int, int] = {}
    for eps in product((1, -1), repeat=3):
        n = P * (1 + sum(Fraction(e, p) for e, p in zip(eps, ps)))
        if n.denominator != 1:
            raise InvalidSeifertDataError(f"{ps!r}: the orders must be pairwise coprime")
        k = int(n) % (2 * P)
        out[k] = out.get(k, 0) + eps[0] * eps[1] * eps[2]
    return {k: v for k, v in out.items() if v}


_CHI = hikami_character((2, 3, 5))


def poincare_series(order: int) -> Laurent:
    """``A(q)`` truncated after the power ``q^order`` (exact, integer coefficients).

    >>> poincare_series(30)
    Laurent('1 + q + q^3 + q^7 - q^8 - q^14 - q^20 - q^29')

    References
    ----------
    Lawrence & Zagier, Asian J. Math. 3 (1999) 93–107.
    """
    if not isinstance(order, int) or order < 0 or order > 10**7:
        raise SizeLimitError(f"order = {order!r} must be an integer between 0 and 10^7")
    terms: dict[int, int] = {}
    n = 1
    while (n * n - 1) // 120 <= order:
        c = _CHI.get(n % 60, 0)
        if c:
            e = (n * n - 1) // 120
            terms[e] = terms.get(e, 0) + c
        n += 1
    return Laurent.from_terms(terms, var="q")


def poincare_false_theta(q, digits: int = 30) -> mpmath.mpc:
    """``A(q)`` at any ``|q| < 1`` (summed until the tail is below ``10^-digits``).

    >>> z = poincare_false_theta("0.5")
    >>> abs(z - poincare_series(200).evaluate(mpmath.mpf("0.5"), dps=30)) < 1e-25
    True

    References
    ----------
    Lawrence & Zagier, Asian J. Math. 3 (1999) 93–107.
    """
    qv = parse_complex(q, "q")
    with mpmath.workdps(digits + 10):
        r = abs(qv)
        if r >= 1:
            raise SizeLimitError(f"|q| = {mpmath.nstr(r, 8)}: the q-series converges only for |q| < 1")
        if r == 0:
            return mpmath.mpc(1)
        lq = mpmath.log(qv)
        tol = mpmath.mpf(10) ** (-digits - 3)
        total = mpmath.mpc(0)
        n = 1
        while True:
            e = mpmath.mpf(n * n - 1) / 120
            c = _CHI.get(n % 60, 0)
            if c:
                total += c * mpmath.exp(e * lq)
            if n > 60 and r ** e < tol * (1 - r):
                break
            n += 1
            if n > 10**7:
                raise SizeLimitError("|q| too close to 1 for direct summation; use the radial limit")
    with mpmath.workdps(digits):
        return +total


def poincare_radial_limit(K: int, digits: int = 30) -> mpmath.mpc:
    """``lim A(q)`` as ``q -> exp(2 pi i/K)`` radially: ``-(1/M) sum n chi(n) xi^((n^2-1)/120)``.

    >>> z = poincare_radial_limit(7)
    >>> w = poincare_false_theta(mpmath.mpf("0.9999") * mpmath.expjpi(mpmath.mpf(2) / 7), 15)
    >>> abs(z - w) < 0.1          # the approach is linear in 1 - |q|
    True

    References
    ----------
    Lawrence & Zagier (1999), §1 (valid because ``sum_{n mod M} chi(n) xi^((n^2-1)/120) = 0``).
    """
    if not isinstance(K, int) or K < 1:
        raise SizeLimitError(f"K = {K!r} must be a positive integer")
    M = 60 * K
    with mpmath.workdps(digits + 10):
        s = mpmath.mpc(0)
        for n in range(1, M + 1):
            c = _CHI.get(n % 60, 0)
            if c:
                s += n * c * mpmath.expjpi(mpmath.mpf((n * n - 1) // 120 % K * 2) / K)
        res = -s / M
    with mpmath.workdps(digits):
        return +res


def tau_from_radial_limit(K: int, digits: int = 30) -> mpmath.mpc:
    """``tau_K(Sigma(2,3,5)) = (lim A / 2 - 1) / (xi (1 - xi))`` (Lawrence–Zagier relation).

    >>> from knotobs.continuation.level import continued_Z
    >>> t = tau_from_radial_limit(9, 20)
    >>> Z = continued_Z("Sigma(2,3,5)", 9, 20) / (mpmath.sqrt(mpmath.mpf(2)/9) * mpmath.sin(mpmath.pi/9))
    >>> abs(t - Z) < 1e-15
    True
    """
    L = poincare_radial_limit(K, digits + 5)
    with mpmath.workdps(digits + 10):
        xi = mpmath.expjpi(mpmath.mpf(2) / K)
        res = (L / 2 - 1) / (xi * (1 - xi))
    with mpmath.workdps(digits):
        return +res
