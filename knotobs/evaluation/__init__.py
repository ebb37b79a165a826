"""Evaluation routes for exact observables and the entry points that pick one.

The names below are imported from their modules on first use (PEP 562), so importing one
route (e.g. :mod:`knotobs.evaluation.families` for a polynomial) does not load the
finite-level machinery (modular data, gluing, Gauss sums).

>>> from knotobs.evaluation import jones
>>> jones("T(2,3)").exact_string()
't + t^3 - t^4'
"""

from importlib import import_module as _import_module

# These two modules share their name with the function they define: import the functions
# now, or a later ``import knotobs.evaluation.rosso_jones`` would leave the module in their place.
from knotobs.evaluation.rosso_jones import rosso_jones  # noqa: E402
from knotobs.evaluation.weight_sum import weight_sum  # noqa: E402

_EXPORTS = {
    "ROUTES": "families", "RouteMismatchError": "families", "alexander": "families",
    "colored_jones": "families", "homfly": "families", "homfly_at": "families", "jones": "families",
    "wilson_loop": "families",
    "resolve_framing": "framing",
    "Profile": "profiles",
    "PolynomialResult": "result",
    "rosso_jones": "rosso_jones", "rosso_jones_homfly": "rosso_jones",
    "FiniteLevelValue": "finite_value",
    "level_loop": "level_loops", "level_partition_function": "level_loops",
    "ModularData": "modular",
    "fiber_wilson_loop": "seifert_routes", "partition_function": "seifert_routes",
    "weight_sum": "weight_sum",
}

__all__ = sorted(_EXPORTS)


def __getattr__(name: str):
    module = _EXPORTS.get(name)
    if module is None:
        raise AttributeError(f"module 'knotobs.evaluation' has no attribute {name!r}")
    value = getattr(_import_module(f"knotobs.evaluation.{module}"), name)
    globals()[name] = value
    return value


def __dir__():
    return sorted(set(globals()) | set(_EXPORTS))
