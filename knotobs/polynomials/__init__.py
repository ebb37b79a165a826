"""Exact polynomial arithmetic: Laurent polynomials in one and two variables."""

from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.laurent import Laurent

__all__ = ["Laurent", "Laurent2"]
