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


@dataclass(frozen=True, repr=False)
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

    def __post_init__(self):
        # the exact value in its printed normal form: the smallest cyclotomic field, and a
        # square root kept apart only when that is shorter (the same number)
        if self.exact is not None:
            object.__setattr__(self, "exact", self.exact.reduced())

    @property
    def root_of_unity(self) -> str:
        """``"z20 = exp(2*pi*i/20)"``; empty when no root of unity is printed (a rational value,
        a rational multiple of a square root, or not computed)."""
        if self.exact is None or self.is_rational():
            return ""
        if getattr(self.exact, "coefficient", self.exact).is_rational():
            return ""
        n = self.exact.conductor
        return f"z{n} = exp(2*pi*i/{n})"

    def is_rational(self) -> bool:
        """Whether the exact value is a rational number (then it is printed without a root of unity)."""
        if self.exact is None:
            return False
        c = getattr(self.exact, "coefficient", self.exact)
        return c.is_rational() and (getattr(self.exact, "radicand", 1) == 1 or c.is_zero())

    # ------------------------------------------------------------ notebook forms
    def to_sympy(self):
        """The exact value as a sympy expression in ``exp(2 pi i/n)`` (no free symbols).

        >>> from knotobs.polynomials.cyclotomic import CyclotomicField
        >>> v = FiniteLevelValue(CyclotomicField(4).zeta(1), mpmath.mpc(0, 1), 5, "-", "-", "-")
        >>> v.to_sympy()
        I
        """
        if self.exact is None:
            import sympy

            return sympy.Float(self.numeric.real, self.digits) + sympy.I * sympy.Float(self.numeric.imag, self.digits)
        from knotobs.output.notebook import cyclotomic_sympy

        return cyclotomic_sympy(self.exact)

    def evaluate(self, dps: int | None = None) -> mpmath.mpc:
        """The numeric value at ``dps`` digits (recomputed from the exact value when it is known)."""
        from knotobs.errors import PrecisionError

        if dps is None or dps == self.digits:
            return self.numeric
        if self.exact is None:
            if dps > self.digits:
                raise PrecisionError(f"only {self.digits} digits are known (no exact value): ask for more digits")
            return self.numeric
        return self.exact.to_mpc(dps)

    def _repr_latex_(self) -> str:
        from knotobs.output.notebook import cyclotomic_latex

        d = min(self.digits, 15)
        z = mpmath.mpc(self.numeric)
        num = mpmath.nstr(z.real, d) if z.imag == 0 else (
            f"{mpmath.nstr(z.real, d)} {'-' if z.imag < 0 else '+'} {mpmath.nstr(abs(z.imag), d)} i")
        if self.exact is None:
            return f"${num}$"
        n = self.exact.conductor
        zeta = "" if self.is_rational() else f", \\quad \\zeta_{{{n}}} = e^{{2\\pi i/{n}}}"
        return f"${cyclotomic_latex(self.exact)} \\approx {num}{zeta}$"

    def __repr__(self) -> str:
        exact = "numeric only" if self.exact is None else (
            f"exact {self.exact}" if self.is_rational() else f"exact in Q(zeta_{self.exact.conductor})")
        return f"<FiniteLevelValue {mpmath.nstr(self.numeric, min(self.digits, 12))} ({self.digits} digits; {exact})>"

    def numeric_parts(self) -> tuple[str, str]:
        """``(re, im)`` as printed: significant digits when the value is exact (a part below
        ``10^-digits |z|`` shown as 0); for a numeric-only value the decimal places its certified
        bound ``10^-digits max(|z|, 1)`` covers (docs/numerics.md), so that a value that is 0 to
        that bound prints as 0, not as its rounding noise."""
        from knotobs.precision import certified_parts, significant_parts

        if self.exact is None:
            return certified_parts(self.numeric, self.digits)
        return significant_parts(self.numeric, self.digits)

    def numeric_str(self) -> str:
        """:meth:`numeric_parts` as one complex number."""
        from knotobs.precision import joined_parts

        return joined_parts(*self.numeric_parts())

    def to_json(self) -> dict[str, Any]:
        """JSON-ready dictionary (strings for all numbers)."""
        re_, im_ = self.numeric_parts()
        return {
            "exact": "" if self.exact is None else str(self.exact),
            "root_of_unity": self.root_of_unity,
            "numeric": {
                "re": re_,
                "im": im_,
                "digits": self.digits,
            },
            "framing": self.framing,
            "orientation": self.orientation,
            "normalisation": self.normalisation,
        }

    def __complex__(self) -> complex:
        return complex(self.numeric)


#: Routes whose finite-level values are numeric only (certified digits, no cyclotomic value):
#: the SU(2) integral form, the SU(3) convolution, and U(N)'s quotient and gauging routes
#: (docs/localisation.md §10.6, docs/surgery.md §11).
NUMERIC_ROUTES = ("integral", "convolution", "quotient", "gauging")


def numeric_seifert_value(space, numeric: mpmath.mpc, digits: int, details: dict) -> FiniteLevelValue:
    """A numeric-only ``Z_k`` of a Seifert manifold in the common profile (canonical 2-framing,
    ``Z(S^3) = S_00``), as the numeric routes return it.

    >>> from knotobs.fibrations.seifert import parse_space
    >>> numeric_seifert_value(parse_space("L(5,1)"), mpmath.mpc(1), 5, {}).normalisation
    'Z(S^3) = S_00, Z(S^2 x S^1) = 1'
    """
    from knotobs.evaluation.surgery import _orientation_text

    return FiniteLevelValue(
        exact=None, numeric=numeric, digits=digits,
        framing="canonical 2-framing (Atiyah)",
        orientation=_orientation_text(space.b, tuple(space.fibers), space.genus),
        normalisation="Z(S^3) = S_00, Z(S^2 x S^1) = 1",
        details=details,
    )
