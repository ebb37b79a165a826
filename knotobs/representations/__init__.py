"""Representation data for SU(N), U(N) and SL(N,C)."""

from knotobs.representations.groups import (
    SU,
    U,
    Group,
    adams_fixed,
    casimir,
    dimension,
    dual,
    homfly_unknot,
    parse_group,
    quantum_dimension,
    quantum_dimension_hook_content,
    quantum_integer,
    tensor_fixed,
)
from knotobs.representations.complexified import ComplexRep, parse_complex_group
from knotobs.representations.partitions import (
    as_partition,
    conjugate,
    from_dynkin,
    parse_partition,
    partitions_of,
    to_dynkin,
)
from knotobs.representations.symmetric import adams_generic, littlewood_richardson, mn_character, tensor_generic
from knotobs.representations.weights import kostka, weight_multiplicities

__all__ = [
    "ComplexRep", "parse_complex_group", "SU", "U", "Group", "adams_fixed", "adams_generic", "as_partition", "casimir", "conjugate",
    "dimension", "dual", "from_dynkin", "homfly_unknot", "kostka", "littlewood_richardson",
    "mn_character", "parse_group", "parse_partition", "partitions_of", "quantum_dimension",
    "quantum_dimension_hook_content", "quantum_integer", "tensor_fixed", "tensor_generic",
    "to_dynkin", "weight_multiplicities",
]
