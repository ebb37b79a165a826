"""Compare with tabulated and typed polynomials, identify polynomials, and grids of invariants.

* :func:`compare`, :func:`compare_knotinfo` — find the convention map between a computed
  invariant and a polynomial written elsewhere (:mod:`knotobs.tables.compare`);
* :func:`identify` — which torus knots/links, colours and maps reproduce a polynomial;
* :func:`parse_polynomial` — the safe reader of plain algebraic notation;
* :class:`GridSpec`, :func:`run_grid`, :func:`resume_grid`, :class:`GridStore` — grids
  computed in parallel (local processes or Dask) into a resumable SQLite store.
"""

from knotobs.tables.compare import Comparison, ConventionMap, compare, compare_knotinfo
from knotobs.tables.grid import GridReport, GridSpec, resume_grid, run_grid, torus_knots
from knotobs.tables.identify import Candidate, Identification, identify
from knotobs.tables.polyparse import parse_polynomial, read_polynomial
from knotobs.tables.sparse import MPoly
from knotobs.tables.store import GridStore

__all__ = [
    "Comparison", "ConventionMap", "compare", "compare_knotinfo",
    "Candidate", "Identification", "identify",
    "GridReport", "GridSpec", "GridStore", "resume_grid", "run_grid", "torus_knots",
    "MPoly", "parse_polynomial", "read_polynomial",
]
