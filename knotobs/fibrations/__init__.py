"""Torus knots and links, Seifert fibrations and refibration."""

from knotobs.fibrations.lens import (
    LensKnotData,
    lens_fibration,
    lens_fibrations,
    lens_homeomorphic,
    lens_knot_data,
    s3_seifert,
)
from knotobs.fibrations.refibration import CoreFiber, FiberedKnot, fibration_of
from knotobs.fibrations.seifert import (
    LinkingForm,
    Recognition,
    SeifertManifold,
    lens_canonical_q,
    parse_space,
)
from knotobs.fibrations.surgery import (
    SpaceReport,
    SurgeryResult,
    parse_slope,
    space_report,
    surgery_on_fiber,
    torus_knot_surgery,
)
from knotobs.fibrations.torus import TorusLink, parse_knot

__all__ = [
    "TorusLink",
    "parse_knot",
    "SeifertManifold",
    "LinkingForm",
    "Recognition",
    "parse_space",
    "lens_canonical_q",
    "lens_homeomorphic",
    "s3_seifert",
    "lens_fibration",
    "lens_fibrations",
    "LensKnotData",
    "lens_knot_data",
    "CoreFiber",
    "FiberedKnot",
    "fibration_of",
    "SurgeryResult",
    "SpaceReport",
    "parse_slope",
    "surgery_on_fiber",
    "torus_knot_surgery",
    "space_report",
]
