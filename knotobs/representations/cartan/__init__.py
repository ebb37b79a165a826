"""The Cartan engine: root systems, Weyl groups and characters for every simple group.

One small data module per Cartan family (:mod:`.type_a`, :mod:`.type_b`, :mod:`.type_c`,
:mod:`.type_d`, :mod:`.type_g`) holds only the simple roots (in an orthonormal basis) and how a
partition names a highest weight; :mod:`.rootsystem` (Cartan matrix, fundamental weights,
metric with long roots of length^2 = 2, Weyl group) and :mod:`.characters` (Freudenthal
multiplicities, Weyl and quantum dimensions, Casimirs, Adams operations, tensor products)
compute everything else from that data.  :mod:`.group` names the groups (``SO(5)``, ``Sp(4)``,
``G2``, ...) and reads representations (Dynkin labels ``(1,0)``, partitions ``[2,1]``).
"""

from knotobs.representations.cartan.characters import (
    adams,
    casimir,
    dominant_weights,
    quantum_dimension,
    quantum_dimension_weyl,
    tensor,
    weights,
    weyl_dimension,
)
from knotobs.representations.cartan.group import Dynkin, SimpleGroup, is_simple_group_name, parse_rep_text, simple_group
from knotobs.representations.cartan.rootsystem import RootSystem
from knotobs.representations.cartan.samples import samples

__all__ = [
    "Dynkin", "RootSystem", "SimpleGroup", "adams", "casimir", "dominant_weights", "is_simple_group_name",
    "parse_rep_text", "quantum_dimension", "quantum_dimension_weyl", "samples", "simple_group", "tensor",
    "weights", "weyl_dimension",
]


def orthogonal_cache_clear() -> None:
    """Clear the caches of the engine and of the generic orthogonal data (for benchmarks)."""
    from knotobs.representations import orthogonal_generic as og
    from knotobs.representations.cartan import characters as ch

    for f in (og.universal_adams, og.universal_tensor, og.quantum_dimension_factors,
              ch._dominant_cached, ch._weights_cached, ch._qdim_weyl_cached):
        f.cache_clear()
    ch._SYSTEMS.clear()
