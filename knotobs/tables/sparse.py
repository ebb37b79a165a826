"""Sparse Laurent polynomials in several named variables, for comparing conventions.

The comparison machinery needs a small, exact ring in which a user's polynomial
(``t + t^3 - t^4``, ``v/z - v^3/z + v*z``) and the library's results
(:class:`~knotobs.polynomials.laurent.Laurent`,
:class:`~knotobs.polynomials.bivariate.Laurent2`) live side by side, and in which
the convention maps (``t -> t^-1``, ``x = t^(1/2)``, ``z -> -z``, a monomial
factor) are cheap.  :class:`MPoly` is that ring: a dictionary from exponent
vectors (rational exponents) to rational coefficients, with named variables.
"""

from __future__ import annotations

from fractions import Fraction
from typing import Iterable, Mapping

from knotobs.errors import InexactDivisionError
from knotobs.polynomials._format import format_terms
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.laurent import Laurent

__all__ = ["MPoly"]


def _fr(x) -> Fraction:
    return x if isinstance(x, Fraction) else Fraction(x)


class MPoly:
    """Exact sparse Laurent polynomial ``sum c_e x_1^e_1 ... x_n^e_n``.

    Exponents and coefficients are :class:`fractions.Fraction`.  Variables are
    names; two elements with different variable sets are combined over the union.

    Parameters
    ----------
    terms : mapping
        ``{exponent dict or tuple: coefficient}``; with tuples ``variables`` names the slots.
    variables : sequence of str

    Examples
    --------
    >>> t = MPoly.var("t")
    >>> p = t + t**3 - t**4
    >>> p
    MPoly('t + t^3 - t^4')
    >>> p.substitute({"t": ("t", -1, 1)})
    MPoly('-t^-4 + t^-3 + t^-1')
    >>> (MPoly.var("a") * MPoly.var("z") ** -1).degrees("z")
    (Fraction(-1, 1), Fraction(-1, 1))

    References
    ----------
    Common practice (sparse polynomial arithmetic); cf. the ``PolyElement``
    dictionaries of SymPy's ``sympy.polys.rings``.
    """

    __slots__ = ("variables", "terms")

    def __init__(self, terms: Mapping | None = None, variables: Iterable[str] = ()):
        self.variables: tuple[str, ...] = tuple(sorted(set(variables)))
        out: dict[tuple[Fraction, ...], Fraction] = {}
        for key, c in (terms or {}).items():
            if isinstance(key, Mapping):
                extra = set(key) - set(self.variables)
                if extra:
                    self.variables = tuple(sorted(set(self.variables) | extra))
        vs = list(variables)
        for key, c in (terms or {}).items():
            c = _fr(c)
            if c == 0:
                continue
            if isinstance(key, Mapping):
                vec = tuple(_fr(key.get(v, 0)) for v in self.variables)
            else:
                d = dict(zip(vs, key))
                vec = tuple(_fr(d.get(v, 0)) for v in self.variables)
            out[vec] = out.get(vec, Fraction(0)) + c
            if out[vec] == 0:
                del out[vec]
        self.terms = out

    @classmethod
    def _make(cls, terms: dict, variables: tuple[str, ...]) -> "MPoly":
        """Internal fast path: ``terms`` already over sorted ``variables``; zero coefficients dropped."""
        obj = cls.__new__(cls)
        obj.variables = variables
        obj.terms = {k: c for k, c in terms.items() if c != 0}
        return obj

    # ------------------------------------------------------------ builders
    @classmethod
    def const(cls, c) -> "MPoly":
        return cls({(): c}, ())

    @classmethod
    def var(cls, name: str) -> "MPoly":
        return cls({(1,): 1}, (name,))

    @classmethod
    def monomial(cls, exps: Mapping[str, object], coeff=1) -> "MPoly":
        return cls({tuple(exps.values()): coeff}, tuple(exps.keys())) if exps else cls.const(coeff)

    @classmethod
    def from_laurent(cls, f: Laurent, name: str | None = None) -> "MPoly":
        """A one-variable :class:`Laurent` polynomial (variable renamed to ``name``)."""
        v = name or f.var
        return cls({(e,): c for e, c in f.terms().items()}, (v,))

    @classmethod
    def from_az(cls, p: Laurent2, avar: str = "a", zvar: str = "z") -> "MPoly":
        """A HOMFLY-PT value in ``(a, z)``, ``z = s - 1/s`` (raises if not a polynomial in z)."""
        return cls({(i, j): c for (i, j), c in p.to_az().items()}, (avar, zvar))

    @classmethod
    def from_aq(cls, p: Laurent2, avar: str = "a", qvar: str = "q") -> "MPoly":
        """A HOMFLY-PT value in ``(a, q)``, ``q = s^2``."""
        return cls({(i, e): c for (i, e), c in p.to_aq().items()}, (avar, qvar))

    # ------------------------------------------------------------ helpers
    def _over(self, variables: tuple[str, ...]) -> dict[tuple[Fraction, ...], Fraction]:
        if variables == self.variables:
            return self.terms
        idx = [self.variables.index(v) if v in self.variables else None for v in variables]
        return {tuple(vec[i] if i is not None else Fraction(0) for i in idx): c for vec, c in self.terms.items()}

    def _union(self, other: "MPoly") -> tuple[str, ...]:
        return tuple(sorted(set(self.variables) | set(other.variables)))

    @staticmethod
    def _coerce(other) -> "MPoly | None":
        if isinstance(other, MPoly):
            return other
        if isinstance(other, (int, Fraction)) and not isinstance(other, bool):
            return MPoly.const(other)
        return None

    # ------------------------------------------------------------ ring operations
    def __add__(self, other):
        other = self._coerce(other)
        if other is None:
            return NotImplemented
        vs = self._union(other)
        out = dict(self._over(vs))
        for k, c in other._over(vs).items():
            out[k] = out.get(k, 0) + c
        return MPoly._make(out, vs)

    __radd__ = __add__

    def __neg__(self) -> "MPoly":
        return MPoly._make({k: -c for k, c in self.terms.items()}, self.variables)

    def __sub__(self, other):
        other = self._coerce(other)
        if other is None:
            return NotImplemented
        return self + (-other)

    def __rsub__(self, other):
        other = self._coerce(other)
        if other is None:
            return NotImplemented
        return other + (-self)

    def __mul__(self, other):
        other = self._coerce(other)
        if other is None:
            return NotImplemented
        vs = self._union(other)
        a, b = self._over(vs), other._over(vs)
        out: dict = {}
        for ka, ca in a.items():
            for kb, cb in b.items():
                k = tuple(x + y for x, y in zip(ka, kb))
                out[k] = out.get(k, 0) + ca * cb
        return MPoly._make(out, vs)

    __rmul__ = __mul__

    def __pow__(self, n: int) -> "MPoly":
        if not isinstance(n, int) or isinstance(n, bool):
            raise TypeError("only integer powers of a polynomial are defined")
        if n < 0:
            if not self.is_monomial():
                raise InexactDivisionError(f"{self} is not a monomial; its power {n} is not a Laurent polynomial")
            (k, c), = self.terms.items()
            return MPoly({tuple(x * n for x in k): c ** n}, self.variables)
        out = MPoly.const(1)
        base = self
        while n:
            if n & 1:
                out = out * base
            n >>= 1
            if n:
                base = base * base
        return out

    def monomial_div(self, m: "MPoly") -> "MPoly":
        """Divide by a monomial (raises :class:`InexactDivisionError` for anything else)."""
        if not m.is_monomial():
            raise InexactDivisionError(f"division by {m}, which is not a monomial")
        return self * m ** -1

    # ------------------------------------------------------------ queries
    def is_zero(self) -> bool:
        return not self.terms

    def is_monomial(self) -> bool:
        return len(self.terms) == 1

    def used_variables(self) -> tuple[str, ...]:
        """Variables that occur with a nonzero exponent."""
        return tuple(v for i, v in enumerate(self.variables) if any(k[i] != 0 for k in self.terms))

    def restrict(self) -> "MPoly":
        """The same element over its used variables only."""
        used = self.used_variables()
        return MPoly(self._over(used), used)

    def degrees(self, v: str) -> tuple[Fraction, Fraction]:
        """Lowest and highest exponent of ``v`` (``(0, 0)`` if absent)."""
        if v not in self.variables or not self.terms:
            return Fraction(0), Fraction(0)
        i = self.variables.index(v)
        es = [k[i] for k in self.terms]
        return min(es), max(es)

    def is_integral(self) -> bool:
        return all(c.denominator == 1 for c in self.terms.values())

    def leading(self) -> tuple[tuple[Fraction, ...], Fraction]:
        """Largest exponent vector (lexicographic in sorted variable order) and its coefficient."""
        k = max(self.terms)
        return k, self.terms[k]

    # ------------------------------------------------------------ maps
    def substitute(self, mapping: Mapping[str, tuple[str, object, int]]) -> "MPoly":
        """Substitute ``x -> sign * y^r`` for each ``x: (y, r, sign)`` in ``mapping``.

        Variables not in ``mapping`` are kept.  A sign ``-1`` needs integer exponents.

        >>> MPoly.var("q").substitute({"q": ("x", Fraction(-2), 1)})
        MPoly('x^-2')
        """
        out: dict = {}
        names: list[str] = []
        for v in self.variables:
            tgt = mapping[v][0] if v in mapping else v
            if tgt not in names:
                names.append(tgt)
        names.sort()
        for k, c in self.terms.items():
            vec = [Fraction(0)] * len(names)
            for v, e in zip(self.variables, k):
                if v in mapping:
                    y, r, sign = mapping[v]
                    vec[names.index(y)] += e * _fr(r)
                    if sign == -1 and e != 0:
                        if e.denominator != 1:
                            raise InexactDivisionError(f"cannot take (-1)^({e}) exactly")
                        if e.numerator % 2:
                            c = -c
                else:
                    vec[names.index(v)] += e
            key = tuple(vec)
            out[key] = out.get(key, 0) + c
        return MPoly._make(out, tuple(names))

    def evaluate(self, values: Mapping[str, object]):
        """Numeric value (``values[v]`` may be mpmath numbers; rational powers use the principal branch)."""
        import mpmath

        total = mpmath.mpf(0)
        for k, c in self.terms.items():
            term = mpmath.mpf(c.numerator) / c.denominator
            for v, e in zip(self.variables, k):
                if e:
                    term *= mpmath.power(values[v], mpmath.mpf(e.numerator) / e.denominator)
            total += term
        return total

    # ------------------------------------------------------------ conversions
    def to_laurent(self, var: str | None = None) -> Laurent:
        """Back to a one-variable :class:`Laurent` (integer coefficients)."""
        r = self.restrict()
        if len(r.variables) > 1:
            raise ValueError(f"{self} has more than one variable")
        name = var or (r.variables[0] if r.variables else "q")
        if not r.is_integral():
            raise ValueError(f"{self} has non-integer coefficients")
        return Laurent.from_terms({(k[0] if k else 0): int(c) for k, c in r.terms.items()}, var=name)

    # ------------------------------------------------------------ display
    def to_string(self) -> str:
        """Plain algebraic text (``^`` for powers, rational exponents in parentheses)."""
        if not self.terms:
            return "0"

        def mono(k):
            parts = []
            for v, e in zip(self.variables, k):
                if e == 0:
                    continue
                if e == 1:
                    parts.append(v)
                elif e.denominator == 1:
                    parts.append(f"{v}^{e.numerator}")
                else:
                    parts.append(f"{v}^({e.numerator}/{e.denominator})")
            return "*".join(parts)

        keys = sorted(self.terms, key=lambda k: tuple(-x for x in k[:-1]) + k[-1:] if len(k) > 1 else k)
        return format_terms(((mono(k),), self.terms[k]) for k in keys)

    def to_sympy(self):
        import sympy

        syms = [sympy.Symbol(v) for v in self.variables]
        out = sympy.Integer(0)
        for k, c in self.terms.items():
            t = sympy.Rational(c.numerator, c.denominator)
            for s, e in zip(syms, k):
                t = t * s ** sympy.Rational(e.numerator, e.denominator)
            out += t
        return out

    def __str__(self) -> str:
        return self.to_string()

    def __repr__(self) -> str:
        return f"MPoly({self.to_string()!r})"

    # ------------------------------------------------------------ equality
    def __eq__(self, other) -> bool:
        other = self._coerce(other)
        if other is None:
            return NotImplemented
        return (self - other).is_zero()

    def __hash__(self) -> int:
        r = self.restrict()
        return hash((r.variables, frozenset(r.terms.items())))

    def __bool__(self) -> bool:
        return bool(self.terms)
