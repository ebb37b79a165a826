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


def format_terms(terms: Iterable[tuple[Sequence[str], int]]) -> str:
    """Join ``(monomial factors, coefficient)`` pairs into ``c1*m1 + c2*m2 - ...``.

    >>> format_terms([(("a^-2",), 2), (("a^-2", "z^2"), 1), (("a^-4",), -1)])
    '2*a^-2 + a^-2*z^2 - a^-4'
    """
    parts = []
    for factors, c in terms:
        mono = "*".join(f for f in factors if f)
        a = abs(c)
        body = mono if (mono and a == 1) else (f"{a}*{mono}" if mono else str(a))
        parts.append(("-" if c < 0 else "+", body))
    if not parts:
        return "0"
    s = ("-" if parts[0][0] == "-" else "") + parts[0][1]
    for sign, body in parts[1:]:
        s += f" {sign} {body}"
    return s
