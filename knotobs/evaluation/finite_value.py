"""Result object for finite-level Chern–Simons values.

A :class:`FiniteLevelValue` carries the exact value (a cyclotomic number, possibly
times the square root of a rational, see
:class:`knotobs.polynomials.cyclotomic.CyclotomicSurd`), the numeric value as an
``mpmath.mpc`` with a stated number of correct digits, and the profile: framing,
orientation and normalisation.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

import mpmath

from knotobs.polynomials.cyclotomic import Cyclotomic, CyclotomicSurd

__all__ = ["FiniteLevelValue"]


@dataclass(frozen=True)
class FiniteLevelValue:
    """An exact finite-level value with its numeric value and convention profile.

    Attributes
    ----------
    exact : CyclotomicSurd or Cyclotomic or None
        The exact value ``sqrt(r) * c`` with ``c`` in ``Q(zeta_n)``; ``None`` when only a
        numeric value was computed (e.g. very large levels).
    numeric : mpmath.mpc
        The value, correct to ``digits`` significant digits (absolute ``10^-digits``
        for values below 1), checked by recomputation at higher precision.
    digits : int
    framing, orientation, normalisation : str
        Human-readable profile.
    details : dict
        Extra machine-readable data (route, level, group, framings as fractions...).

    Examples
    --------
    >>> from knotobs.polynomials.cyclotomic import CyclotomicField
    >>> v = FiniteLevelValue(exact=None, numeric=mpmath.mpc(1, 0), digits=5,
    ...                      framing="-", orientation="-", normalisation="-")
    >>> v.to_json()["numeric"]
    {'re': '1.0', 'im': '0.0', 'digits': 5}
    """

    exact: CyclotomicSurd | Cyclotomic | None
    numeric: mpmath.mpc
    digits: int
    framing: str
    orientation: str
    normalisation: str
    details: dict = field(default_factory=dict, compare=False)

    @property
    def root_of_unity(self) -> str:
        if self.exact is None:
            return ""
        n = self.exact.conductor
        return f"z{n} = exp(2*pi*i/{n})"

    def to_json(self) -> dict[str, Any]:
        """JSON-ready dictionary (strings for all numbers)."""
        return {
            "exact": "" if self.exact is None else str(self.exact),
            "root_of_unity": self.root_of_unity,
            "numeric": {
                "re": mpmath.nstr(self.numeric.real, self.digits),
                "im": mpmath.nstr(self.numeric.imag, self.digits),
                "digits": self.digits,
            },
            "framing": self.framing,
            "orientation": self.orientation,
            "normalisation": self.normalisation,
        }

    def __complex__(self) -> complex:
        return complex(self.numeric)
