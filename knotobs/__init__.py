"""knotobs: exact Chern-Simons Wilson-loop observables of torus knots and links.

Examples
--------
>>> import knotobs
>>> knotobs.jones("T(2,3)").exact_string()
't + t^3 - t^4'
"""

from knotobs.errors import KnotobsError
from knotobs.evaluation import (
    FiniteLevelValue,
    fiber_wilson_loop,
    level_loop,
    partition_function,
    PolynomialResult,
    Profile,
    alexander,
    colored_jones,
    homfly,
    jones,
    rosso_jones,
    weight_sum,
    wilson_loop,
)
from knotobs.fibrations import SeifertManifold, fibration_of, parse_space
from knotobs.fibrations.torus import TorusLink, parse_knot
from knotobs.polynomials import Laurent, Laurent2
from knotobs.representations import SU, U, Group, parse_group

__version__ = "0.1.0"

__all__ = [
    "FiniteLevelValue",
    "fiber_wilson_loop",
    "level_loop",
    "partition_function",
    "SeifertManifold",
    "fibration_of",
    "parse_space",
    "KnotobsError",
    "PolynomialResult",
    "Profile",
    "alexander",
    "colored_jones",
    "homfly",
    "jones",
    "rosso_jones",
    "weight_sum",
    "wilson_loop",
    "TorusLink",
    "parse_knot",
    "Laurent",
    "Laurent2",
    "SU",
    "U",
    "Group",
    "parse_group",
    "__version__",
]

# groups beyond SU(N), the Kauffman polynomial (docs/groups.md, §14)
from knotobs.evaluation.kauffman import kauffman  # noqa: E402
from knotobs.representations.cartan import Dynkin, simple_group  # noqa: E402

__all__ += ["kauffman", "Dynkin", "simple_group"]
