"""Plain-text formatting of polynomials shared by the polynomial classes.

Output is plain algebraic notation (``2*a^-2 + a^-2*z^2 - t^(1/2)``): readable, and
parsable by sympy after replacing ``^`` with ``**``.
"""

from __future__ import annotations

from fractions import Fraction
from typing import Iterable, Sequence

__all__ = ["power", "format_terms"]


def power(var: str, e: "int | Fraction") -> str:
    """``var^e`` in plain text; ``""`` for ``e = 0``.

    >>> power("q", Fraction(-1, 2)), power("t", 1), power("a", -3), power("z", 0)
    ('q^(-1/2)', 't', 'a^-3', '')
    """
    e = Fraction(e)
    if e == 0:
        return ""
    if e == 1:
        return var
    if e.denominator == 1:
        return f"{var}^{e.numerator}"
    return f"{var}^({e.numerator}/{e.denominator})"


def _plain_coeff(a) -> str:
    a = Fraction(a)
    return str(a) if a.denominator == 1 else f"({a})"


def format_terms(terms: Iterable[tuple[Sequence[str], "int | Fraction"]], joiner: str = "*",
                 coeff=_plain_coeff) -> str:
    """Join ``(monomial factors, coefficient)`` pairs into ``c1*m1 + c2*m2 - ...``.

    ``joiner`` glues the factors (``"*"``; ``" "`` for LaTeX) and ``coeff`` writes the
    absolute value of a coefficient (rational coefficients are parenthesised by default).

    >>> format_terms([(("a^-2",), 2), (("a^-2", "z^2"), 1), (("a^-4",), -1)])
    '2*a^-2 + a^-2*z^2 - a^-4'
    >>> format_terms([(("t",), Fraction(-1, 2))])
    '-(1/2)*t'
    """
    parts = []
    for factors, c in terms:
        mono = joiner.join(f for f in factors if f)
        a = abs(c)
        astr = coeff(a)
        body = mono if (mono and a == 1) else (f"{astr}{joiner}{mono}" if mono else astr)
        parts.append(("-" if c < 0 else "+", body))
    if not parts:
        return "0"
    s = ("-" if parts[0][0] == "-" else "") + parts[0][1]
    for sign, body in parts[1:]:
        s += f" {sign} {body}"
    return s
