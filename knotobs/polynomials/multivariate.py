"""Laurent polynomials with integer coefficients in several named variables.

Used for invariants with three gradings (the superpolynomial ``P(a, q, t)``).  A
polynomial is a mapping from integer exponent vectors to nonzero integers; the
variables travel with it, and arithmetic between polynomials in different
variables is a :class:`~knotobs.errors.RingMismatchError`.

Terms print in a fixed order: by the exponent of the first variable, then the
second, and so on, each ascending.

Examples
--------
>>> P = LaurentM(("a", "q", "t"), {(2, -2, 0): 1, (2, 2, 2): 1, (4, 0, 3): 1})
>>> P.to_string()
'a^2*q^-2 + a^2*q^2*t^2 + a^4*t^3'
>>> P.specialize({"t": -1}).to_string()
'a^2*q^-2 + a^2*q^2 - a^4'
"""

from __future__ import annotations

from typing import Iterable, Mapping, Sequence

from knotobs.errors import RingMismatchError
from knotobs.polynomials._format import format_terms, power

__all__ = ["LaurentM"]


class LaurentM:
    """An exact Laurent polynomial in the variables ``names`` with integer coefficients.

    Parameters
    ----------
    names : sequence of str
        Variable names, e.g. ``("a", "q", "t")``.
    terms : mapping from exponent tuples to int
        Zero coefficients are dropped.
    """

    __slots__ = ("names", "_terms")

    def __init__(self, names: Sequence[str], terms: Mapping[tuple, int] | Iterable = ()):
        self.names = tuple(names)
        items = terms.items() if isinstance(terms, Mapping) else terms
        acc: dict[tuple, int] = {}
        for e, c in items:
            e = tuple(int(x) for x in e)
            if len(e) != len(self.names):
                raise ValueError(f"exponent {e} has {len(e)} entries; variables are {self.names}")
            acc[e] = acc.get(e, 0) + int(c)
        self._terms = {e: c for e, c in acc.items() if c}

    # ----------------------------------------------------------------- access
    def terms(self) -> dict[tuple, int]:
        """A copy of the exponent -> coefficient mapping."""
        return dict(self._terms)

    def num_terms(self) -> int:
        """The number of nonzero terms."""
        return len(self._terms)

    def coefficients_nonnegative(self) -> bool:
        """Whether every coefficient is ``>= 0``."""
        return all(c > 0 for c in self._terms.values())

    def degree_range(self, name: str) -> tuple[int, int]:
        """Lowest and highest exponent of the variable ``name``."""
        i = self.names.index(name)
        es = [e[i] for e in self._terms] or [0]
        return min(es), max(es)

    # ------------------------------------------------------------- arithmetic
    def _check(self, other: "LaurentM") -> None:
        if not isinstance(other, LaurentM) or other.names != self.names:
            raise RingMismatchError(
                f"cannot combine polynomials in {self.names} and "
                f"{getattr(other, 'names', type(other).__name__)}"
            )

    def __add__(self, other: "LaurentM") -> "LaurentM":
        self._check(other)
        out = dict(self._terms)
        for e, c in other._terms.items():
            out[e] = out.get(e, 0) + c
        return LaurentM(self.names, out)

    def __neg__(self) -> "LaurentM":
        return LaurentM(self.names, {e: -c for e, c in self._terms.items()})

    def __sub__(self, other: "LaurentM") -> "LaurentM":
        return self + (-other)

    def __eq__(self, other) -> bool:
        return isinstance(other, LaurentM) and other.names == self.names and other._terms == self._terms

    def __hash__(self) -> int:
        return hash((self.names, frozenset(self._terms.items())))

    def shift(self, exponents: Sequence[int]) -> "LaurentM":
        """Multiply by the monomial with the given exponents."""
        return LaurentM(self.names, {tuple(a + b for a, b in zip(e, exponents)): c
                                     for e, c in self._terms.items()})

    def substitute_monomials(self, images: Mapping[str, Mapping[str, int]]) -> "LaurentM":
        """Replace each variable by a signed monomial in the same variables.

        ``images[name]`` maps variable names to exponents; a key ``"sign"`` with
        value ``-1`` multiplies by ``-1``.  Variables not listed stay as they are.

        >>> P = LaurentM(("a", "q", "t"), {(0, 1, 1): 1})
        >>> P.substitute_monomials({"t": {"t": -1}}).to_string()
        'q*t^-1'
        """
        rows = []
        for i, n in enumerate(self.names):
            img = images.get(n, {n: 1})
            rows.append(([img.get(m, 0) for m in self.names], img.get("sign", 1)))
        out: dict[tuple, int] = {}
        for e, c in self._terms.items():
            new = [0] * len(self.names)
            sign = 1
            for (vec, s), k in zip(rows, e):
                for j, v in enumerate(vec):
                    new[j] += v * k
                if s == -1 and k % 2:
                    sign = -sign
            key = tuple(new)
            out[key] = out.get(key, 0) + sign * c
        return LaurentM(self.names, out)

    def specialize(self, values: Mapping[str, int]) -> "LaurentM":
        """Set some variables to integers (``t = -1``); the rest stay, in the same order.

        >>> LaurentM(("q", "t"), {(1, 1): 1, (1, 2): 1}).specialize({"t": -1}).to_string()
        '0'
        """
        keep = [i for i, n in enumerate(self.names) if n not in values]
        out: dict[tuple, int] = {}
        for e, c in self._terms.items():
            v = c
            for i, n in enumerate(self.names):
                if n in values:
                    x = values[n]
                    if e[i] < 0 and abs(x) != 1:
                        raise ValueError(f"cannot set {n} = {x} in a Laurent polynomial with "
                                         f"negative powers of {n} and keep integer coefficients")
                    v *= x ** e[i] if e[i] >= 0 else x ** (-e[i])
            key = tuple(e[i] for i in keep)
            out[key] = out.get(key, 0) + v
        return LaurentM([self.names[i] for i in keep], out)

    # ------------------------------------------------------------ text forms
    def to_string(self) -> str:
        """Plain text, terms ordered by exponents (first variable first), sympy-readable after ``^ -> **``."""
        return format_terms(
            ([power(n, k) for n, k in zip(self.names, e)], c) for e, c in sorted(self._terms.items())
        )

    def to_latex(self) -> str:
        """LaTeX in the same term order as :meth:`to_string`."""
        def tex(n, k):
            return "" if k == 0 else (n if k == 1 else f"{n}^{{{k}}}")
        return format_terms(
            [([tex(n, k) for n, k in zip(self.names, e)], c) for e, c in sorted(self._terms.items())],
            joiner=" ",
        )

    def to_sympy(self):
        """The polynomial as a sympy expression in symbols named like the variables."""
        import sympy

        syms = [sympy.Symbol(n) for n in self.names]
        return sympy.Add(*[c * sympy.Mul(*[s ** k for s, k in zip(syms, e)])
                           for e, c in self._terms.items()])

    def evaluate(self, **values):
        """Numeric value; every variable must be given (Python, mpmath or sympy numbers).

        >>> LaurentM(("a", "q"), {(1, -1): 2}).evaluate(a=3, q=2)
        3.0
        """
        missing = [n for n in self.names if n not in values]
        if missing:
            raise ValueError(f"give a value for {', '.join(missing)}")
        total = 0
        for e, c in self._terms.items():
            term = c
            for n, k in zip(self.names, e):
                term = term * values[n] ** k
            total = total + term
        return total

    def __repr__(self) -> str:
        s = self.to_string()
        return f"LaurentM({', '.join(self.names)}: {s if len(s) < 80 else s[:77] + '...'})"

    __str__ = to_string
