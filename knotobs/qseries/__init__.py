"""q-series invariants ``Zhat_b(q)`` of negative definite plumbings and Seifert manifolds (CONVENTIONS §13).

One concept per module:

* :mod:`knotobs.qseries.plumbing` -- weighted plumbing trees, their text form ``Plumb(...)``,
  the star plumbing of a Seifert manifold;
* :mod:`knotobs.qseries.labels` -- the labels ``b`` (spin^c structures up to conjugation);
* :mod:`knotobs.qseries.series` -- the lattice sum (the plumbing route);
* :mod:`knotobs.qseries.seifert_sum` -- the closed one-variable sum from the Seifert invariants
  (the second route);
* :mod:`knotobs.qseries.radial` -- radial limits and the finite-level SU(2) invariant;
* :mod:`knotobs.qseries.knot_complement` -- the two-variable series F_K(x, q) of torus knots.

The Brieskorn-sphere false theta functions of Lawrence–Zagier and Hikami stay in
:mod:`knotobs.continuation.qseries` (importable from there as before).
"""

from knotobs.qseries.labels import Label, LabelSystem, label_system
from knotobs.qseries.plumbing import PlumbingGraph, parse_plumbing, plumbing_of, star_plumbing
from knotobs.qseries.series import QSeries, zhat, zhat_all

__all__ = [
    "Label",
    "LabelSystem",
    "label_system",
    "PlumbingGraph",
    "parse_plumbing",
    "plumbing_of",
    "star_plumbing",
    "QSeries",
    "zhat",
    "zhat_all",
]
