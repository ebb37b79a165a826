"""The localisation route: SU(N) Chern–Simons on every Seifert manifold with orientable base.

``Z_k(M)`` and fiber Wilson loops of ``M(g; b; (a_1, b_1), ..., (a_n, b_n))`` as a sum over the
alcove of the torsion ``T(lam)^(2-2g-n)`` times one closed Gauss sum per fiber (a Weyl-group
sum over the root lattice modulo the order), with the phase of the canonical framing from
Rademacher's function (CONVENTIONS §10, docs/localisation.md).  Modules:

* :mod:`.lattice` -- the SU(N) weight lattice, alcove, Weyl group, roots;
* :mod:`.phase` -- gluing matrices, Dedekind sums, Rademacher's function;
* :mod:`.fiber` -- the Gauss sum of one fiber;
* :mod:`.roots`, :mod:`.fixedpoint` -- certified roots of unity and their sums;
* :mod:`.formula` -- the assembled sum, exact or in ball arithmetic;
* :mod:`.values` -- the public functions.
"""

from knotobs.localisation.values import (
    as_manifold,
    localisation_fiber_wilson_loop,
    localisation_partition_function,
    localisation_seconds,
)

__all__ = [
    "as_manifold",
    "localisation_partition_function",
    "localisation_fiber_wilson_loop",
    "localisation_seconds",
]
