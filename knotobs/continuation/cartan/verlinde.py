r"""``Z(S^1 x Sigma_g)`` of SU(N) as a polynomial in ``K`` (docs/continuation_sun.md §18.10).

At integer level ``Z_k(S^1 x Sigma_g) = sum_lam S_{0 lam}^(2 - 2g)`` is the Verlinde number, the
dimension of the space of conformal blocks on ``Sigma_g`` (an integer).  For fixed ``g >= 1`` it is
a polynomial in ``K = k + N`` of degree ``(g - 1) dim G`` (``g = 1``: the number of integrable
weights, degree ``N - 1``); ``g = 0`` gives ``Z(S^2 x S^1) = 1``.  The polynomial has no
exponential factors, so it is the continuation of least exponential type (Carlson), and it is what
this module evaluates at complex ``K``.

The coefficients are exact rationals, found by Lagrange interpolation through the Verlinde numbers
at ``k = 1, ..., d + 1`` (``d`` the degree) taken from the localisation route (rounded to the integer
they are certified to be within ``10^-20`` of, with enough digits for every integer digit), and *checked* at two further levels: a mismatch
raises instead of returning a value.

References
----------
E. Verlinde, Nucl. Phys. B300 (1988) 360–376; E. Witten, Commun. Math. Phys. 121 (1989) 351–399;
D. Zagier, in Proc. Hirzebruch 65 Conf. (1996) (the SU(2) polynomials; cited from memory).  That
the Verlinde number is a polynomial in the level for fixed genus is common practice (it is a
Riemann–Roch number); here it is also checked at two levels past the interpolation points.
"""

from __future__ import annotations

import math
from fractions import Fraction
from functools import lru_cache

import mpmath
from flint import acb

from knotobs.errors import KnotobsError, SizeLimitError
from knotobs.numerics import working_precision

__all__ = ["verlinde_polynomial", "verlinde_degree", "verlinde_value", "is_circle_product", "MAX_VERLINDE_WEIGHTS",
           "MAX_VERLINDE_DEGREE"]

#: Largest number of integrable weights at the highest interpolation level.
MAX_VERLINDE_WEIGHTS = 200_000
#: Largest degree interpolated (SU(2) in genus 34, degree 99, takes about 7 s).
MAX_VERLINDE_DEGREE = 100


def is_circle_product(M) -> bool:
    """``M = S^1 x Sigma_g``: no exceptional fibers and Euler number ``b = 0``.

    >>> from knotobs.fibrations.seifert import parse_space
    >>> is_circle_product(parse_space("M(2; 0)")), is_circle_product(parse_space("M(2; -1)"))
    (True, False)
    """
    return not [a for a, _ in M.fibers if a > 1] and M.b == 0 and not any(b for _, b in M.fibers)


def verlinde_degree(N: int, g: int) -> int:
    """Degree in ``K`` of ``Z(S^1 x Sigma_g)`` for SU(N): ``(g - 1)(N^2 - 1)``, ``N - 1`` for ``g = 1``.

    >>> verlinde_degree(2, 2), verlinde_degree(3, 1)
    (3, 2)
    """
    return N - 1 if g == 1 else max(0, (g - 1) * (N * N - 1))


@lru_cache(maxsize=64)
def verlinde_polynomial(N: int, g: int) -> tuple[Fraction, ...]:
    """Coefficients ``(c_0, c_1, ...)`` of ``Z(S^1 x Sigma_g) = sum_i c_i K^i`` for SU(N).

    Examples
    --------
    SU(2) in genus 2 is ``(K^3 - K)/6`` (4, 10, 20, ... at k = 1, 2, 3):

    >>> [str(c) for c in verlinde_polynomial(2, 2)]
    ['0', '-1/6', '0', '1/6']
    """
    from knotobs.localisation import localisation_partition_function

    if g == 0:
        return (Fraction(1),)
    d = verlinde_degree(N, g)
    top = d + 3
    weights = math.comb(top + N - 1, N - 1)
    if weights > MAX_VERLINDE_WEIGHTS or d > MAX_VERLINDE_DEGREE:
        raise SizeLimitError(
            f"Z(S^1 x Sigma_{g}) for SU({N}) is a polynomial of degree {d} in K; interpolating it needs"
            f" the levels up to k = {top} ({weights} integrable weights; at most degree"
            f" {MAX_VERLINDE_DEGREE} and {MAX_VERLINDE_WEIGHTS} weights, about 10 s); use a smaller N or"
            " a lower genus")
    vals = []
    for k in range(1, top + 1):
        z = localisation_partition_function(f"M({g}; 0)", f"SU({N})", k, digits=30).numeric
        size = int(mpmath.log10(abs(z) + 1)) if abs(z) > 1 else 0
        if size > 5:           # relative digits: enough for every integer digit and 25 more
            z = localisation_partition_function(f"M({g}; 0)", f"SU({N})", k, digits=size + 25).numeric
        with working_precision(size + 30):
            n = int(mpmath.nint(z.real))
            off = abs(z - n)
        if off > 1e-20:
            raise KnotobsError(f"Z_{k}(S^1 x Sigma_{g}) for SU({N}) = {z} is not an integer to 20 digits")
        vals.append(n)
    xs = [k + N for k in range(1, top + 1)]
    coeffs = _interpolate(xs[: d + 1], vals[: d + 1])
    for x, v in zip(xs[d + 1:], vals[d + 1:]):
        if _horner(coeffs, Fraction(x)) != v:
            raise KnotobsError(f"Z(S^1 x Sigma_{g}) for SU({N}): the degree-{d} interpolant misses the"
                               f" Verlinde number at K = {x}")
    return tuple(coeffs)


def _interpolate(xs: list[int], ys: list[int]) -> list[Fraction]:
    """Coefficients of the polynomial through ``(xs, ys)`` (Newton's divided differences, exact)."""
    from knotobs.continuation.cartan.newton import divided_differences, newton_to_monomial

    dd = divided_differences(xs, [Fraction(y) for y in ys])
    coeffs = newton_to_monomial(xs, dd, Fraction(0))
    while len(coeffs) > 1 and coeffs[-1] == 0:
        coeffs.pop()
    return coeffs


def _horner(coeffs, x):
    out = 0 * x
    for c in reversed(coeffs):
        out = out * x + c
    return out


def verlinde_value(N: int, g: int, K: acb) -> acb:
    """The polynomial at ``K`` as a ball at the current precision (exact coefficients)."""
    out = acb(0)
    for c in reversed(verlinde_polynomial(N, g)):
        out = out * K + acb(c.numerator) / c.denominator
    return out
