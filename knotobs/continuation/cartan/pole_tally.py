r"""What one value of the SU(3) residue route integrates, counted before the work (docs 18.7, Cost).

The closed-form estimate :func:`.poles.pole_cost` counts every line integral of the formula of
CONVENTIONS §18.7; the evaluation integrates only one representative per orbit of the period
and reflection symmetries, derives shifted grids from base grids, and skips the lines of the
odd terms, so that count is 4-30 times the work (measured 2026-12-04 on eight spaces).  This
module runs the enumeration of :class:`.poles._Eval` itself, with every quadrature, grid and
matrix product replaced by a count of its nodes: the same contours, seats, orbits and caches,
no quadrature.  Its own cost is the enumeration (about 25 microseconds per line of the
closed-form count, and lists as long as the lines), so it is used only when that count is at most
:data:`TALLY_LINES` and the lines have at most :data:`TALLY_NODES` nodes.

The seconds of one run are modelled from two counts: the nodes of the base grids (each a
Gaussian, the sines and Taylor series by recurrence) and the terms of the plane tensor sums,
fitted on eight spaces (Σ(2,3,5), Σ(2,3,7), two coset spaces, ``|H| = 7``, four fibers, base
genus 1 with two and with three fibers) at 30 and 60 digits: the model was within 0.66-1.24 of
the measured time of one run, with a per-unit cost flat up to about 80 digits and growing like
the square root of the digits above (1.36 at 150 digits).  :data:`MARGIN` makes it an upper
estimate on those spaces.

References
----------
R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (the formula whose pieces
are counted, through §18.7).
"""

from __future__ import annotations

import math
from collections import Counter

from flint import acb

from knotobs.continuation._num import bits, working_bits
from knotobs.continuation.cartan.poles import _Eval, _theta, coset_terms
from knotobs.guard import seconds_for

__all__ = ["pole_tally", "tallied_run_seconds", "TALLY_LINES", "TALLY_NODES"]

#: Largest closed-form line count (:func:`.poles.pole_cost_parts`) for which the enumeration is
#: run (about 0.6 s of enumeration); above it the closed-form estimate stands.
TALLY_LINES = 25_000

#: Largest number of nodes per line (:func:`.poles.pole_line_nodes`, about linear in ``|K|``) for which the
#: enumeration is run: its grids are lists of that length.
TALLY_NODES = 20_000

#: Ball operations per base-grid node and per tensor term (fitted, see the module docstring).
GRID_OPS, TENSOR_OPS = 1.92, 0.022

#: The model's least ratio to the measured time on the fitted spaces was 0.66: 1.5 covers it.
MARGIN = 1.5


class _Tally(_Eval):
    """:class:`.poles._Eval` with ``parts="quad"`` whose grids, trapezoid sums and plane tensors are
    counted instead of computed (values returned as zeros; the residues are computed, they are few)."""

    def __init__(self, *args, **kwargs):
        super().__init__(*args, **kwargs)
        self.count: Counter = Counter()
        self._seen: set = set()

    def grid(self, which, y0, s, L, sign=1, J=None):
        J = self.Jl if J is None else J
        key = (which, y0, s, L, sign, J)
        if key not in self._seen:
            self._seen.add(key)
            nodes = (2 * J + 1) * L
            per = self._period[which]
            if per is None:                    # computed directly
                self.count["grid"] += nodes
            else:                              # shifted from the base grid at y0 mod per (computed once)
                base = ("base", which, y0 - per * math.floor(y0 / per), L, J)
                if base not in self._seen:
                    self._seen.add(base)
                    self.count["grid"] += nodes
                self.count["shifted"] += nodes
        return [[acb(0)] * L] * (2 * J + 1)

    def _rep_dots(self, fint, y0, sig, mu, L):
        key = (fint, y0, sig, mu, "rep")
        D = self._dc.get(key)
        if D is not None and len(D) >= L:
            return D
        self.grid(fint, y0, sig - self.off[fint], 1)
        self.grid("C", y0 + mu, 0, L)
        self.count["integrated lines"] += 1
        self.count["distinct"] += D is None
        D = [acb(0)] * L
        self._dc[key] = D
        return D

    def _plane_corrected(self, u0, w0, s, r):
        J = int(math.ceil(1.16 * self.Jl))
        self.grid("A", u0, s, 1, J=J)
        self.grid("B", w0, r, 1, J=J)
        self.grid("C", u0 + w0, 0, 1, J=2 * J)
        self.count["tensor"] += (2 * J + 1) * (4 * J + 1)
        self.count["planes"] += 1
        return acb(0)

    def _trap(self, y0, vals, laur):
        self.count["trapezoid"] += len(vals)
        return acb(0)


def pole_tally(orders: tuple[int, ...], H: int, P: int, K: complex, digits: int,
               cosets=None, genus: int = 0) -> Counter:
    """The counts of one run of :func:`.poles.pole_sum_sectors` (``parts="quad"``) at ``K`` with
    quadrature target ``digits``: ``grid`` (base-grid nodes times Taylor length), ``shifted``,
    ``distinct`` (orbit representatives integrated), ``integrated lines`` (with the recomputations
    for a longer Taylor vector), ``planes``, ``tensor`` (terms of the plane sums), ``trapezoid``.
    Mirrors the loop over cosets and merged terms of ``pole_sum_sectors``; a test checks that the
    evaluation integrates the same lines and planes.

    >>> c = pole_tally((2, 3, 5), 1, 30, 8.1 - 0.4j, 32)
    >>> c["planes"], c["distinct"] < c["integrated lines"] < 630
    (3, True)
    """
    Kc = complex(K)
    if H < 0:
        Kc, H = Kc.conjugate(), -H
        cosets = None if cosets is None else [c.negated() for c in cosets]
    theta = _theta(H, Kc)
    total: Counter = Counter()
    with working_bits(bits(digits)):
        Ka = acb(Kc.real, Kc.imag)
        for co, _, term in coset_terms(orders, cosets, genus):
            t = _Tally(term, Ka, H, P, digits, True, theta, False, -co.const, "quad")
            t.run()
            total.update(t.count)
    return total


def tallied_run_seconds(count: Counter, work_digits: float) -> float:
    """Estimated seconds of the run counted by :func:`pole_tally` at ``work_digits`` digits of
    working precision (an upper estimate on the fitted spaces, see the module docstring).

    >>> tallied_run_seconds(Counter(grid=10**5, tensor=10**6), 40) > tallied_run_seconds(Counter(grid=10**5), 40)
    True
    """
    ops = GRID_OPS * count["grid"] + TENSOR_OPS * count["tensor"]
    return MARGIN * seconds_for(ops, "ball") * max(1.0, work_digits / 80.0) ** 0.5
