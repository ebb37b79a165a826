"""Continuation side: complex level, SL(N,C) couplings, flat connections, asymptotics, q-series."""

from knotobs.continuation.cartan import continued_sun_partition_function, continued_sun_sectors, continued_sun_Z
from knotobs.continuation.asymptotics import asymptotic_value, compare_with_exact, predicted_exponent
from knotobs.continuation.complex import sl2c_partition_function, sl_wilson_loop, unitarity_note
from knotobs.continuation.flat import FlatConnection, FlatTable, flat_connections
from knotobs.continuation.flat_sun import LensFlatConnection, lens_flat_connections
from knotobs.continuation.kashaev import growth_exponent, kashaev_invariant
from knotobs.continuation.level import continued_partition_function, continued_Z, evaluate_polynomial, sector_values
from knotobs.continuation.ohtsuki import ohtsuki_series
from knotobs.continuation.qseries import (
    brieskorn_false_theta,
    brieskorn_radial_limit,
    poincare_false_theta,
    poincare_radial_limit,
    poincare_series,
    tau_from_q_series,
    tau_from_q_series_exact,
)

__all__ = [
    "asymptotic_value", "compare_with_exact", "predicted_exponent", "sl_wilson_loop", "sl2c_partition_function", "sector_values", "unitarity_note",
    "FlatConnection", "FlatTable", "flat_connections", "LensFlatConnection", "lens_flat_connections", "growth_exponent", "kashaev_invariant",
    "continued_partition_function", "continued_Z", "continued_sun_partition_function", "continued_sun_sectors", "continued_sun_Z", "evaluate_polynomial", "ohtsuki_series",
    "poincare_false_theta", "poincare_radial_limit", "poincare_series",
    "brieskorn_false_theta", "brieskorn_radial_limit", "tau_from_q_series", "tau_from_q_series_exact",
]
