"""Newton interpolation for exact and ball coefficients (the polynomials in ``K`` of §18.10-18.11).

The same three steps serve the Verlinde polynomial (``Fraction`` values) and the quasi-polynomial
classes (``acb`` balls): divided differences through the nodes, evaluation of the Newton form by
Horner's rule, and conversion to monomial coefficients.  Only ``+``, ``-``, ``*`` and division by
integers are used, so any field type works.

References
----------
Common practice (Newton's divided differences); e.g. F. B. Hildebrand, *Introduction to Numerical
Analysis* (1956), ch. 2 (cited from memory).
"""

from __future__ import annotations

__all__ = ["divided_differences", "newton_value", "newton_to_monomial"]


def divided_differences(xs, ys) -> list:
    """Newton coefficients ``dd`` of the polynomial through ``(xs[i], ys[i])`` (integer nodes).

    >>> from fractions import Fraction
    >>> divided_differences([0, 1, 2], [Fraction(1), Fraction(2), Fraction(5)])   # 1 + K^2
    [Fraction(1, 1), Fraction(1, 1), Fraction(1, 1)]
    """
    dd = list(ys)
    n = len(dd)
    for j in range(1, n):
        for i in range(n - 1, j - 1, -1):
            dd[i] = (dd[i] - dd[i - 1]) / (xs[i] - xs[i - j])
    return dd


def newton_value(xs, dd, x):
    """The Newton form at ``x`` (Horner: ``p = dd[i] + (x - x_i) p``).

    >>> newton_value([0, 1, 2], [1, 1, 1], 3)
    10
    """
    out = dd[-1]
    for i in range(len(dd) - 2, -1, -1):
        out = out * (x - xs[i]) + dd[i]
    return out


def newton_to_monomial(xs, dd, zero) -> list:
    """Monomial coefficients ``[c_0, c_1, ...]`` of the Newton form (``zero`` of the field).

    >>> newton_to_monomial([0, 1, 2], [1, 1, 1], 0)     # 1 + K + K (K - 1) = 1 + K^2
    [1, 0, 1]
    """
    n = len(dd)
    coeffs = [zero] * n
    for i in range(n - 1, -1, -1):
        new = [zero] * n
        for k in range(n - 1):
            new[k + 1] += coeffs[k]
            new[k] -= xs[i] * coeffs[k]
        new[0] += dd[i]
        coeffs = new
    return coeffs
