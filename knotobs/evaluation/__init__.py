"""Evaluation routes for exact observables and the entry points that pick one."""

from knotobs.evaluation.families import (
    ROUTES,
    RouteMismatchError,
    alexander,
    colored_jones,
    homfly,
    homfly_at,
    jones,
    wilson_loop,
)
from knotobs.evaluation.framing import resolve_framing
from knotobs.evaluation.profiles import Profile
from knotobs.evaluation.result import PolynomialResult
from knotobs.evaluation.rosso_jones import rosso_jones, rosso_jones_homfly
from knotobs.evaluation.finite_value import FiniteLevelValue
from knotobs.evaluation.level_loops import level_loop, level_partition_function
from knotobs.evaluation.modular import ModularData
from knotobs.evaluation.seifert_routes import fiber_wilson_loop, partition_function
from knotobs.evaluation.weight_sum import weight_sum

__all__ = [
    "FiniteLevelValue",
    "ModularData",
    "fiber_wilson_loop",
    "level_loop",
    "level_partition_function",
    "partition_function",
    "ROUTES",
    "RouteMismatchError",
    "Profile",
    "PolynomialResult",
    "alexander",
    "colored_jones",
    "homfly",
    "homfly_at",
    "jones",
    "resolve_framing",
    "rosso_jones",
    "rosso_jones_homfly",
    "weight_sum",
    "wilson_loop",
]
