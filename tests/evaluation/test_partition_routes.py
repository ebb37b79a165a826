"""Route choice of the SU(2) partition function: the automatic route switches to the
Lawrence-Rozansky Gauss sum at large K and must give the surgery value (Lawrence & Rozansky,
Commun. Math. Phys. 205 (1999); Reshetikhin & Turaev, Invent. Math. 103 (1991))."""

import mpmath
import pytest

from knotobs.errors import KnotobsError
from knotobs.evaluation.surgery import AUTO_GAUSS_SUM_K, partition_function
from knotobs.fibrations.seifert import parse_space


def test_auto_route_at_large_level_equals_surgery():
    M = parse_space("Sigma(2,3,7)")
    k = AUTO_GAUSS_SUM_K + 5
    auto = partition_function(M, "SU(2)", k, 20)
    assert auto.details["route"].startswith("Lawrence-Rozansky")
    surg = partition_function(M, "SU(2)", k, 20, route="surgery")
    assert abs(auto.numeric - surg.numeric) < mpmath.mpf(10) ** -18
    both = partition_function(M, "SU(2)", 30, 20, route="both")
    assert "both" in both.details["route"]


def test_auto_route_falls_back_when_the_closed_formula_does_not_apply():
    M = parse_space("M(0; -2; (2,1), (3,1), (4,1))")
    z = partition_function(M, "SU(2)", AUTO_GAUSS_SUM_K + 1, 15)
    assert z.details["route"] == "surgery"
    with pytest.raises(KnotobsError, match="pairwise coprime"):
        partition_function(M, "SU(2)", 3, 15, route="gauss-sum")
    with pytest.raises(KnotobsError, match="unknown route"):
        partition_function(M, "SU(2)", 3, 15, route="fast")
