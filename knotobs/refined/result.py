"""The result of a refined (three-graded) invariant: a polynomial in ``(a, q, t)`` with its profile."""

from __future__ import annotations

from dataclasses import dataclass

from knotobs.evaluation.result import PolynomialResult
from knotobs.polynomials.multivariate import LaurentM

__all__ = ["SuperpolynomialResult"]


@dataclass(frozen=True)
class SuperpolynomialResult(PolynomialResult):
    """A :class:`PolynomialResult` whose value is a :class:`LaurentM` in ``(a, q, t)``.

    The field ``value`` holds a :class:`~knotobs.polynomials.multivariate.LaurentM`.
    Besides the common interface (``exact_string``, ``to_json``, ``to_sympy``,
    ``_repr_latex_``) it gives the two specialisations that connect it to tables.

    Examples
    --------
    >>> from knotobs.refined import superpolynomial
    >>> r = superpolynomial("T(2,3)")
    >>> r.khovanov_specialization().to_string()      # a = q^2
    'q^2 + q^6*t^2 + q^8*t^3'
    """

    def exact_string(self) -> str:
        return self.value.to_string()

    def to_sympy(self):
        return self.value.to_sympy()

    def num_terms(self) -> int:
        return self.value.num_terms()

    def evaluate(self, a=None, q=None, t=None, **_ignored):
        """Numeric value at given ``a``, ``q``, ``t`` (Python, mpmath or sympy numbers)."""
        if _ignored:
            raise TypeError(f"unknown variables {sorted(_ignored)}: give a, q and t")
        return self.value.evaluate(a=a, q=q, t=t)

    def _repr_latex_(self) -> str:
        return "$" + self.value.to_latex() + "$"

    def homfly_specialization(self) -> LaurentM:
        """``P(a, q, t = -1)``: HOMFLY-PT in ``(a_DGR, q_DGR)`` (see the profile)."""
        return self.value.specialize({"t": -1})

    def khovanov_specialization(self) -> LaurentM:
        """``P(a = q^2, q, t)`` as a polynomial in ``(q, t)``."""
        terms: dict[tuple, int] = {}
        for (i, j, k), c in self.value.terms().items():
            key = (j + 2 * i, k)
            terms[key] = terms.get(key, 0) + c
        return LaurentM(("q", "t"), terms)

    def fgs_grading(self) -> LaurentM:
        """The polynomial in the grading of the coloured formulas of Fuji–Gukov–Sułkowski.

        ``a^i q^j t^k -> a^i q^j t^(2i + j - k)``, then the power of ``t`` that puts the lowest term at
        ``t^0`` (docs/refined.md §17).  Identity at ``t = -1``; for ``[r]`` on ``T(2, 2p+1)`` it gives
        the closed formula of H. Fuji, S. Gukov, P. Sułkowski, Nucl. Phys. B 867 (2013) (checked for
        ``p <= 3``, ``r <= 3``); beyond two strands it is not DGR's grading for ``[1]``.

        >>> from knotobs.refined import superpolynomial
        >>> superpolynomial("T(2,3)", [2]).fgs_grading().num_terms()
        9
        """
        terms: dict[tuple, int] = {}
        for (i, j, k), c in self.value.terms().items():
            key = (i, j, 2 * i + j - k)
            terms[key] = terms.get(key, 0) + c
        t_low = min(k for (_, _, k) in terms)
        return LaurentM(("a", "q", "t"), terms).shift((0, 0, -t_low))

