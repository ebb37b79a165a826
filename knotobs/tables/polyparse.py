"""A safe reader for polynomials typed in plain algebraic notation.

Accepts what people paste from papers and tables: ``t + t^3 - t^4``,
``a^-2*z^2 + 2*a^-2 - a^-4``, ``2*t^(1/2)``, ``-x^(-5)-x^(-1)``,
``(2*v^2-v^4)+ v^2*z^2``, ``v/z-v^3/z + v*z``, ``2t^3``, ``t**2``.

Nothing is evaluated as Python: a small tokenizer and a recursive-descent
parser build an exact :class:`~knotobs.tables.sparse.MPoly`.  Only the variable
names in an explicit whitelist are accepted; anything else is a
:class:`~knotobs.errors.ParseError` that names the bad text and says what is
valid.  Division is allowed only by a monomial (``1/(v^3*z)``), powers of
sums only by non-negative integers, rational exponents only on monomials.
"""

from __future__ import annotations

import os
import re
from fractions import Fraction
from typing import Iterable

from knotobs.errors import InexactDivisionError, ParseError, SizeLimitError
from knotobs.tables.sparse import MPoly

__all__ = ["parse_polynomial", "read_polynomial", "KNOWN_VARIABLES", "MAX_INPUT_LENGTH"]

#: Variable names understood by the comparison code, with their meaning.
KNOWN_VARIABLES: dict[str, str] = {
    "t": "Jones/Alexander variable (standard: t = q^-1 for Jones)",
    "x": "half-integer powers written as a variable: x = t^(1/2)",
    "q": "quantum-group variable q = exp(2 pi i/(k+N))",
    "s": "s = q^(1/2)",
    "a": "HOMFLY-PT a = q^(N/2), skein a P(L+) - a^-1 P(L-) = z P(L0)",
    "v": "HOMFLY-PT v = a^-1, skein v^-1 P(L+) - v P(L-) = z P(L0)",
    "z": "HOMFLY-PT / Conway z = s - 1/s",
}

#: Longest accepted input (characters).
MAX_INPUT_LENGTH = 200_000
#: Largest integer power of a sum (``(1 + t)^n``).
MAX_SUM_POWER = 200

_TOKEN = re.compile(
    r"\s*(?:(?P<num>\d+(?:\.\d+)?)|(?P<id>[A-Za-z_][A-Za-z0-9_]*)|(?P<op>\*\*|[-+*/^()]))"
)


def _normalise(text: str) -> str:
    return (text.replace("\u2212", "-").replace("\u2013", "-").replace("\u00b7", "*")
            .replace("\u22c5", "*").replace("\u00d7", "*"))


def _tokenize(text: str) -> list[tuple[str, str, int]]:
    out = []
    pos = 0
    n = len(text)
    while pos < n:
        if text[pos].isspace():
            pos += 1
            continue
        m = _TOKEN.match(text, pos)
        if not m or m.end() == pos:
            raise ParseError(
                f"cannot read polynomial {text!r}: unexpected character {text[pos]!r} at position {pos};"
                " use numbers, variables, + - * / ^ and parentheses, e.g. 't + t^3 - t^4'"
            )
        kind = m.lastgroup
        out.append((kind, m.group(kind), m.start(kind)))
        pos = m.end()
    out.append(("end", "", n))
    return out


#: Deepest nesting of parentheses accepted.
MAX_NESTING = 200


def _terms_bound(base: MPoly, n: int) -> int:
    """Upper bound on the number of terms of ``base^n``: at most ``C(n + m - 1, m - 1)`` for ``m``
    terms, and at most ``prod_v (n * span_v + 1)`` from the exponent range of each variable."""
    from math import comb, lcm

    keys = list(base.terms)
    m = len(keys)
    by_count = comb(n + m - 1, m - 1)
    by_span = 1
    for j in range(len(keys[0]) if keys else 0):
        es = [Fraction(k[j]) for k in keys]
        den = lcm(*[e.denominator for e in es]) if es else 1
        by_span *= int((max(es) - min(es)) * den) * n + 1
        if by_span > by_count:
            break
    return min(by_count, by_span)


def _require_power(base: MPoly, n: int) -> None:
    """Refuse (CONVENTIONS §16) a power whose expansion is estimated above the limits."""
    from knotobs.guard import require, seconds_for

    half = _terms_bound(base, (n + 1) // 2)
    full = _terms_bound(base, n)
    # repeated squaring: the last products multiply two polynomials of about ``half`` terms
    # measured: one term product of the sparse polynomial class costs about 40 elementary steps
    require(f"expanding ({base})^{n} (up to {full:.3g} terms)", seconds=seconds_for(80.0 * half * half, "python"),
            memory_mb=full * 200 / 1e6, accepted="give the polynomial expanded, or a smaller power")


class _Parser:
    def __init__(self, text: str, allowed: tuple[str, ...]):
        self.text = text
        self.toks = _tokenize(text)
        self.i = 0
        self.allowed = allowed

    # -------------------------------------------------------------- helpers
    def peek(self):
        return self.toks[self.i]

    def take(self):
        t = self.toks[self.i]
        self.i += 1
        return t

    def fail(self, msg: str, pos: int | None = None):
        where = f" at position {pos}" if pos is not None else ""
        shown = self.text if len(self.text) <= 80 else self.text[:60] + "..." + self.text[-10:]
        raise ParseError(f"cannot read polynomial {shown!r}: {msg}{where}")

    def expect(self, value: str):
        kind, val, pos = self.take()
        if val != value:
            self.fail(f"expected {value!r} but found {val or 'the end'!r}", pos)

    # -------------------------------------------------------------- grammar
    def parse(self) -> MPoly:
        if self.peek()[0] == "end":
            self.fail("the text is empty; write a polynomial such as 't + t^3 - t^4'")
        depth = deepest = 0
        for kind, val, _ in self.toks:
            if kind == "op" and val == "(":
                depth += 1
                deepest = max(deepest, depth)
            elif kind == "op" and val == ")":
                depth -= 1
        if deepest > MAX_NESTING:
            self.fail(f"parentheses are nested {deepest} deep; at most {MAX_NESTING} levels are read")
        p = self.expr()
        kind, val, pos = self.peek()
        if kind != "end":
            self.fail(f"unexpected {val!r}", pos)
        return p

    def expr(self) -> MPoly:
        sign = 1
        kind, val, _ = self.peek()
        if val in "+-" and kind == "op":
            self.take()
            sign = -1 if val == "-" else 1
        out = self.term() * sign
        while True:
            kind, val, _ = self.peek()
            if kind == "op" and val in ("+", "-"):
                self.take()
                t = self.term()
                out = out + t if val == "+" else out - t
            else:
                return out

    def term(self) -> MPoly:
        out = self.unary()
        while True:
            kind, val, pos = self.peek()
            if kind == "op" and val == "*":
                self.take()
                out = out * self.unary()
            elif kind == "op" and val == "/":
                self.take()
                den = self.unary()
                if den.is_zero():
                    self.fail("division by zero", pos)
                if not den.is_monomial():
                    self.fail(f"division by {den}, which is not a monomial (only a Laurent polynomial can be read)", pos)
                out = out.monomial_div(den)
            elif kind in ("num", "id") or (kind == "op" and val == "("):
                out = out * self.unary()  # implicit multiplication: 2t, 3(t + 1)
            else:
                return out

    def unary(self) -> MPoly:
        kind, val, _ = self.peek()
        if kind == "op" and val in ("+", "-"):
            self.take()
            f = self.unary()
            return -f if val == "-" else f
        return self.power()

    def power(self) -> MPoly:
        base = self.atom()
        kind, val, pos = self.peek()
        if kind == "op" and val in ("^", "**"):
            self.take()
            e = self.exponent()
            return self.raise_to(base, e, pos)
        return base

    def exponent(self) -> Fraction:
        kind, val, pos = self.peek()
        sign = 1
        while kind == "op" and val in ("+", "-"):
            self.take()
            if val == "-":
                sign = -sign
            kind, val, pos = self.peek()
        if kind == "num":
            self.take()
            return sign * Fraction(val)
        if kind == "op" and val == "(":
            self.take()
            inner = self.expr()
            self.expect(")")
            if inner.used_variables():
                self.fail(f"the exponent {inner} must be a number, such as 2, -1 or (1/2)", pos)
            c = inner.terms.get((Fraction(0),) * len(inner.variables), Fraction(0)) if inner.terms else Fraction(0)
            return sign * c
        self.fail(f"expected an exponent after '^' but found {val or 'the end'!r}", pos)

    def raise_to(self, base: MPoly, e: Fraction, pos: int) -> MPoly:
        if e.denominator == 1:
            n = int(e)
            if n < 0 and not base.is_monomial():
                self.fail(f"the negative power ({base})^{n} is not a Laurent polynomial", pos)
            if n > MAX_SUM_POWER and not base.is_monomial():
                raise SizeLimitError(f"the power ({base})^{n} is too large to expand; at most {MAX_SUM_POWER}")
            if n > 1 and not base.is_monomial():
                _require_power(base, n)
            try:
                return base ** n
            except InexactDivisionError as exc:  # pragma: no cover - guarded above
                self.fail(str(exc), pos)
        if not base.is_monomial():
            self.fail(f"the rational power ({base})^({e}) of a sum is not a Laurent polynomial", pos)
        (k, c), = base.terms.items()
        if c != 1:
            self.fail(f"the rational power ({base})^({e}) of a coefficient {c} is not exact; write e.g. t^(1/2)", pos)
        return MPoly({tuple(x * e for x in k): 1}, base.variables)

    def atom(self) -> MPoly:
        kind, val, pos = self.take()
        if kind == "num":
            return MPoly.const(Fraction(val))
        if kind == "id":
            if val not in self.allowed:
                raise ParseError(
                    f"unknown variable {val!r} in polynomial {self.text!r} (position {pos}): "
                    f"use {', '.join(self.allowed)}"
                )
            return MPoly.var(val)
        if kind == "op" and val == "(":
            inner = self.expr()
            self.expect(")")
            return inner
        self.fail(f"expected a number, a variable or '(' but found {val or 'the end'!r}", pos)


def parse_polynomial(text: str, variables: Iterable[str] | None = None) -> MPoly:
    """Read a Laurent polynomial written in plain algebraic notation.

    Parameters
    ----------
    text : str
        E.g. ``"t + t^3 - t^4"``, ``"a^-2*z^2 + 2*a^-2 - a^-4"``, ``"2*t^(1/2)"``.
        ``^`` or ``**`` for powers; rational exponents in parentheses; ``*`` may be
        omitted after a number (``2t``); division only by a monomial.
    variables : iterable of str, optional
        The allowed variable names (default :data:`KNOWN_VARIABLES`).

    Returns
    -------
    MPoly
        Exact, over the variables that occur.

    Raises
    ------
    ParseError
        Malformed text or a variable outside the whitelist; the message names it.

    Examples
    --------
    >>> parse_polynomial("t + t^3 - t^4")
    MPoly('t + t^3 - t^4')
    >>> parse_polynomial("v/z-v^3/z + v*z")
    MPoly('-v^3*z^-1 + v*z^-1 + v*z')
    >>> parse_polynomial("2*t^(1/2) - x^(-5)")
    MPoly('2*t^(1/2) - x^-5')
    >>> parse_polynomial("t + y")
    Traceback (most recent call last):
    ...
    knotobs.errors.ParseError: unknown variable 'y' in polynomial 't + y' (position 4): use t, x, q, s, a, v, z

    References
    ----------
    Common practice (recursive-descent parsing; e.g. A. V. Aho, M. S. Lam, R. Sethi,
    J. D. Ullman, *Compilers*, 2nd ed., Addison-Wesley (2006), §4.4).
    """
    if not isinstance(text, str):
        raise ParseError(f"a polynomial must be given as text, not {type(text).__name__}")
    if len(text) > MAX_INPUT_LENGTH:
        raise SizeLimitError(f"polynomial text of {len(text)} characters is too long; at most {MAX_INPUT_LENGTH}")
    allowed = tuple(variables) if variables is not None else tuple(KNOWN_VARIABLES)
    for v in allowed:
        if not re.fullmatch(r"[A-Za-z_][A-Za-z0-9_]*", v):
            raise ParseError(f"{v!r} is not a valid variable name")
    return _Parser(_normalise(text), allowed).parse().restrict()


def read_polynomial(source: str, variables: Iterable[str] | None = None) -> MPoly:
    """Read a polynomial from text, or from the file ``PATH`` when ``source`` is ``@PATH``.

    Examples
    --------
    >>> read_polynomial("q + q^-1")
    MPoly('q^-1 + q')
    """
    if source.startswith("@"):
        path = source[1:]
        try:
            with open(path, encoding="utf-8") as fh:
                text = fh.read()
        except OSError as exc:
            raise ParseError(f"cannot read polynomial file {path!r}: {exc.strerror}") from None
        except UnicodeDecodeError:
            raise ParseError(f"polynomial file {path!r} is not UTF-8 text") from None
        return parse_polynomial(" ".join(text.split()), variables)
    return parse_polynomial(source, variables)
