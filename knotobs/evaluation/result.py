"""The object every exact evaluation returns: value, inputs and profile travel together."""

from __future__ import annotations

from dataclasses import dataclass, field
from functools import cached_property
from fractions import Fraction
from typing import Any, Union

import mpmath

from knotobs.evaluation.profiles import Profile
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.laurent import Laurent

__all__ = ["PolynomialResult"]


@dataclass(frozen=True, repr=False)
class PolynomialResult:
    """An exact polynomial invariant with its inputs and convention profile.

    Attributes
    ----------
    quantity : str
        ``"wilson-loop"``, ``"jones"``, ``"colored-jones"``, ``"homfly"``, ``"alexander"``.
    knot : str
    group : str
        ``"SU(2)"``, ``"U(N)"`` (generic N for HOMFLY-PT) ...
    colours : tuple of tuple of int
        One partition per component.
    value : Laurent or Laurent2
        The exact polynomial (``Laurent2`` in ``(a, s)`` for HOMFLY-PT; shown in ``(a, z)``).
    profile : Profile
    route : str
        Which evaluator computed it.
    """

    quantity: str
    knot: str
    group: str
    colours: tuple
    value: Union[Laurent, Laurent2]
    profile: Profile
    route: str
    inputs: dict = field(default_factory=dict)

    # ------------------------------------------------------------ text forms
    def exact_string(self) -> str:
        """Plain algebraic text, parsable by sympy after ``^ -> **`` (computed once, linear in the size).

        Raises :class:`~knotobs.errors.SizeLimitError` before building the text of a
        one-variable polynomial whose printing is estimated beyond the limits
        (:func:`~knotobs.evaluation.estimates.guard_format`).
        """
        return self._exact_text

    @cached_property
    def _exact_text(self) -> str:
        from knotobs.evaluation.estimates import guard_format, printed_terms
        from knotobs.output.notebook import laurent_text

        # the text of 10^7 terms takes longer than computing them: checked before it is built
        what = (f"the {self.quantity} of {self.knot} ({self.group}, colour "
                f"{','.join(str(list(c)) for c in self.colours)})")
        if isinstance(self.value, Laurent2):
            # one s-polynomial per power of a: their terms (the (a, z) form has about as many)
            guard_format(what, sum(printed_terms(f) for f in self.value.c.values()))
            if self.profile.variables == ("a", "q"):
                return self.value.to_aq_string()
            return self.value.to_az_string()
        guard_format(what, printed_terms(self.value))

        return laurent_text(self.value, self.profile.variables[0])

    def sympy_string(self) -> str:
        """The exact value as a string that ``sympy.sympify`` reads."""
        return self.exact_string().replace("^", "**")

    def to_sympy(self):
        """The exact polynomial as a sympy expression in the printed variables."""
        import sympy

        if isinstance(self.value, Laurent2):
            if self.profile.variables == ("a", "q"):
                return self.value.to_sympy_aq()
            return self.value.to_sympy_az()
        return self.value.to_sympy(sympy.Symbol(self.profile.variables[0]))

    def evaluate(self, x=None, dps: int = 30, log_x=None, **values):
        """Numeric value at a point: ``evaluate(x)`` (one variable) or ``evaluate(a=2, z=3)`` (HOMFLY-PT).

        ``x`` and the keyword values may be Python, mpmath or sympy numbers.

        Examples
        --------
        >>> import sympy
        >>> from knotobs import jones, homfly
        >>> jones("T(2,3)").evaluate(2)                      # 2 + 8 - 16
        mpf('-6.0')
        >>> w = jones("T(2,3)")
        >>> w.evaluate(sympy.Rational(1, 2))                 # 1/2 + 1/8 - 1/16
        mpf('0.5625')
        >>> abs(w.evaluate(sympy.exp(2*sympy.pi*sympy.I/5)) - w.evaluate(complex(mpmath.exp(2j*mpmath.pi/5)))) < 1e-14
        True
        >>> homfly("T(2,3)").evaluate(a=2, z=3)             # 2/4 + 9/4 - 1/16
        mpf('2.6875')
        """
        from knotobs.errors import ParseError
        from knotobs.output.notebook import to_mpmath

        names = tuple(self.profile.variables)
        if isinstance(self.value, Laurent2):
            if x is not None:
                raise ParseError(f"give the values by name: evaluate({', '.join(v + '=...' for v in names)})")
            if set(values) != set(names):
                raise ParseError(f"evaluate needs {', '.join(names)} by name, got {', '.join(sorted(values)) or 'none'}")
            from knotobs.numerics import working_precision

            with working_precision(dps + 10):
                a = to_mpmath(values[names[0]], dps)
                b = to_mpmath(values[names[1]], dps)
                terms = self.value.to_aq() if names == ("a", "q") else self.value.to_az()
                total = mpmath.mpf(0)
                for (i, j), c in terms.items():
                    total += c * a ** i * (b ** int(j) if Fraction(j).denominator == 1
                                           else mpmath.exp(mpmath.log(b) * mpmath.mpf(Fraction(j).numerator) / Fraction(j).denominator))
            return +total
        if values:
            if x is not None or set(values) != set(names):
                raise ParseError(f"evaluate takes one value, for {names[0]}: evaluate({names[0]}=...)")
            x = values[names[0]]
        if x is None:
            raise ParseError(f"give a value for {names[0]}")
        return self.value.evaluate(to_mpmath(x, dps), log_x=None if log_x is None else to_mpmath(log_x, dps), dps=dps)

    def to_json(self) -> dict[str, Any]:
        out: dict[str, Any] = {
            "quantity": self.quantity,
            "knot": self.knot,
            "manifold": "S^3",
            "group": self.group,
            "colours": [list(c) for c in self.colours],
            "exact": self.sympy_string(),
            "variables": list(self.profile.variables),
            "profile": self.profile.to_dict(),
            "route": self.route,
            "terms": self.num_terms(),
        }
        out["inputs"] = dict(self.inputs)
        return out

    def num_terms(self) -> int:
        if isinstance(self.value, Laurent2):
            if self.profile.variables == ("a", "q"):
                return len(self.value.to_aq())
            return len(self.value.to_az())
        return self.value.num_terms()

    def __str__(self) -> str:
        return self.exact_string()

    def __repr__(self) -> str:
        from knotobs.output.notebook import short

        return (f"<PolynomialResult {self.quantity} of {self.knot}, {self.group}, color "
                f"{','.join(str(list(c)) for c in self.colours)}: {short(self.exact_string())}"
                f" ({self.num_terms()} terms)>")

    def latex(self, break_every: int = 0) -> str:
        """LaTeX of the polynomial, terms in the order of the text output."""
        from knotobs.output.notebook import az_latex, laurent_latex

        if isinstance(self.value, Laurent2):
            if self.profile.variables == ("a", "q"):
                return az_latex(self.value.to_aq(), "a", "q")
            return az_latex(self.value.to_az(), "a", "z")
        return laurent_latex(self.value, self.profile.variables[0], break_every)

    def _repr_latex_(self) -> str:
        return "$" + self.latex() + "$"
