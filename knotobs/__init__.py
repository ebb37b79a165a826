"""knotobs: exact Chern-Simons Wilson-loop observables of torus knots and links.

Every capability is reachable as ``knotobs.<name>``; the modules behind the names are
imported on first use (module ``__getattr__``, PEP 562), so ``import knotobs`` and
``knotobs --version`` stay fast.  The functions take their arguments in one order —
knot or space, group, level, representation, then keyword options — and accept strings
wherever they accept objects (docs/interface.md, §15).

To add a capability, add its name and module to :data:`_EXPORTS`.

Examples
--------
>>> import knotobs
>>> knotobs.jones("T(2,3)").exact_string()
't + t^3 - t^4'
>>> "flat_connections" in dir(knotobs)
True
"""

from __future__ import annotations

from importlib import import_module as _import_module

from knotobs.errors import KnotobsError

__version__ = "0.3.0"

#: public name -> module that defines it (imported lazily).
_EXPORTS: dict[str, str] = {
    # exact polynomials in S^3 and values at level k (uniform argument order: knotobs.api)
    "wilson_loop": "knotobs.api",
    "level_loop": "knotobs.api",
    "partition_function": "knotobs.api",
    "fiber_wilson_loop": "knotobs.api",
    "rosso_jones": "knotobs.api",
    "weight_sum": "knotobs.api",
    "jones": "knotobs.api",
    "colored_jones": "knotobs.api",
    "homfly": "knotobs.api",
    "alexander": "knotobs.api",
    # continuation, flat connections, asymptotics, Kashaev, q-series
    "flat_connections": "knotobs.api",
    "continued_partition_function": "knotobs.api",
    "continued_sun_partition_function": "knotobs.continuation.cartan",
    "continued_sun_sectors": "knotobs.continuation.cartan",
    "unitary_partition_function": "knotobs.evaluation.unitary_mtc",
    "sl_wilson_loop": "knotobs.api",
    "sl2c_partition_function": "knotobs.api",
    "asymptotic_value": "knotobs.api",
    "kashaev_invariant": "knotobs.api",
    "ohtsuki_series": "knotobs.api",
    "poincare_series": "knotobs.continuation.qseries",
    "brieskorn_false_theta": "knotobs.continuation.qseries",
    "brieskorn_radial_limit": "knotobs.continuation.qseries",
    "tau_from_q_series": "knotobs.continuation.qseries",
    # comparison, identification, grids
    "compare": "knotobs.api",
    "compare_knotinfo": "knotobs.tables.compare",
    "identify": "knotobs.api",
    "parse_polynomial": "knotobs.tables.polyparse",
    "GridSpec": "knotobs.tables.grid",
    "run_grid": "knotobs.tables.grid",
    "resume_grid": "knotobs.tables.grid",
    "GridStore": "knotobs.tables.store",
    # fibrations and spaces
    "fibration_of": "knotobs.fibrations.refibration",
    "space_report": "knotobs.fibrations.surgery",
    "parse_space": "knotobs.fibrations.seifert",
    "SeifertManifold": "knotobs.fibrations.seifert",
    "TorusLink": "knotobs.fibrations.torus",
    "parse_knot": "knotobs.fibrations.torus",
    # result types
    "PolynomialResult": "knotobs.evaluation.result",
    "FiniteLevelValue": "knotobs.evaluation.finite_value",
    "Profile": "knotobs.evaluation.profiles",
    # algebra and groups
    "Laurent": "knotobs.polynomials.laurent",
    "Laurent2": "knotobs.polynomials.bivariate",
    "SU": "knotobs.representations.groups",
    "U": "knotobs.representations.groups",
    "Group": "knotobs.representations.groups",
    "parse_group": "knotobs.representations.groups",
    # other simple groups and the Kauffman polynomial (docs/groups.md, §14)
    "kauffman": "knotobs.evaluation.kauffman",
    "dubrovnik": "knotobs.evaluation.kauffman",
    "simple_group": "knotobs.representations.cartan",
    "Dynkin": "knotobs.representations.cartan",
    # refined invariants (docs/refined.md, §17)
    "superpolynomial": "knotobs.refined",
    # the localisation route on Seifert manifolds (docs/localisation.md, §10)
    "localisation_partition_function": "knotobs.localisation",
    "localisation_fiber_wilson_loop": "knotobs.localisation",
    # flat SL(2,C) connections and the Borel plane (docs/flat_and_borel.md, §12)
    "flat_sl2c_connections": "knotobs.flat.table",
    "borel_analysis": "knotobs.resurgence.analysis",
    # q-series invariants of plumbings and Seifert manifolds (docs/qseries.md, §13)
    "zhat": "knotobs.qseries",
    "zhat_all": "knotobs.qseries",
    "parse_plumbing": "knotobs.qseries",
    "plumbing_of": "knotobs.qseries",
}

__all__ = sorted(_EXPORTS) + ["KnotobsError", "__version__"]


def __getattr__(name: str):
    """Import the module behind a public name on first use (PEP 562)."""
    module = _EXPORTS.get(name)
    if module is None:
        raise AttributeError(f"module 'knotobs' has no attribute {name!r}")
    value = getattr(_import_module(module), name)
    globals()[name] = value
    return value


def __dir__():
    return sorted(set(globals()) | set(_EXPORTS))
