"""The object every exact evaluation returns: value, inputs and profile travel together."""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any, Union

import mpmath

from knotobs.evaluation.profiles import Profile
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.laurent import Laurent

__all__ = ["PolynomialResult"]


@dataclass(frozen=True)
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
        """Plain algebraic text, parsable by sympy after ``^ -> **``."""
        if isinstance(self.value, Laurent2):
            if self.profile.variables == ("a", "q"):
                return self.value.to_aq_string()
            return self.value.to_az_string()
        return self.value.to_string(self.profile.variables[0])

    def sympy_string(self) -> str:
        """The exact value as a string that ``sympy.sympify`` reads."""
        return self.exact_string().replace("^", "**")

    def to_sympy(self):
        import sympy

        if isinstance(self.value, Laurent2):
            if self.profile.variables == ("a", "q"):
                return self.value.to_sympy_aq()
            return self.value.to_sympy_az()
        return self.value.to_sympy(sympy.Symbol(self.profile.variables[0]))

    def evaluate(self, x, dps: int = 30, log_x=None):
        """Numeric value at the variable ``= x`` (Laurent results only)."""
        if isinstance(self.value, Laurent2):
            raise TypeError("evaluate a HOMFLY-PT result after specialising a (e.g. .value.specialize)")
        return self.value.evaluate(x, log_x=log_x, dps=dps)

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

    def _repr_latex_(self) -> str:
        import sympy

        return "$" + sympy.latex(self.to_sympy()) + "$"
