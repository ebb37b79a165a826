"""SU(N) continuation in the shifted level ``K`` on Seifert manifolds (CONVENTIONS §18).

Modules (one concept each):

* :mod:`.data` -- the SU(N) Lawrence–Rozansky data and the prefactor ``B_N(K)``;
* :mod:`.gaussian` -- the Gaussian integrals over the rotated Cartan in closed form;
* :mod:`.quadrature` -- the same integrals by the trapezoid rule (the second route);
* :mod:`.value` -- the public functions.
"""

from knotobs.continuation.cartan.value import (
    CartanContinuedValue,
    continued_sun_partition_function,
    continued_sun_sectors,
    continued_sun_Z,
)

__all__ = ["CartanContinuedValue", "continued_sun_partition_function", "continued_sun_sectors", "continued_sun_Z"]
