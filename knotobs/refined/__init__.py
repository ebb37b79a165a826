"""Refined (t-deformed) invariants: Macdonald-polynomial data and the superpolynomial of torus knots.

Modules: :mod:`~knotobs.refined.cells` (cell statistics), :mod:`~knotobs.refined.nabla`
(hook pairings of ``nabla^k e_n``), :mod:`~knotobs.refined.catalan` (the q,t-Catalan number
from Dyck paths, an independent route), :mod:`~knotobs.refined.hall` (elliptic-Hall operators),
:mod:`~knotobs.refined.colored_hall` (symmetric colours ``[r]``), :mod:`~knotobs.refined.fock`
(the same algebra on Macdonald polynomials, the second route for ``[r]``),
:mod:`~knotobs.refined.superpolynomial`.
"""

from knotobs.refined.catalan import qt_catalan
from knotobs.refined.nabla import hook_pairings
from knotobs.refined.result import SuperpolynomialResult
from knotobs.refined.superpolynomial import superpolynomial

__all__ = ["superpolynomial", "SuperpolynomialResult", "hook_pairings", "qt_catalan"]
