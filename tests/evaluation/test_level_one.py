"""SU(2) at level 1 as an abelian theory: an independent check of the surgery route.

SU(2)_1 is the semion theory (common practice): two labels, S = (1/sqrt 2)[[1, 1], [1, -1]],
twists (1, i).  For surgery on a framed link with linking matrix A (n components) the
Reshetikhin-Turaev sum then collapses to the Gauss sum over (Z/2)^n

    |Z_1(M)| = 2^(-(n+1)/2) |sum_x i^(x^T A x)|

(Kirby & Melvin, Invent. Math. 105 (1991) 473-545, the case r = 3).  The plumbing matrix of a
Seifert manifold M(0; b; (a_i, 1)) is a star: central weight b, arm weights -a_i (Neumann,
Trans. AMS 268 (1981); common practice).  This also pins down the spaces where the
Lawrence-Rozansky finite sum is not used (orders sharing a factor).
"""

import itertools

import mpmath
import numpy as np
import pytest

from knotobs.errors import KnotobsError
from knotobs.evaluation.gauss_sum import gauss_sum_partition_function
from knotobs.evaluation.surgery import partition_function

CASES = [
    (-2, (2, 3, 4)),   # |H_1| = 22, orders share a factor: Z_1 = 0
    (-1, (2, 3, 5)),   # Poincare sphere
    (-2, (2, 3, 5)),
    (-1, (2, 2, 3)),
    (-2, (3, 3, 2)),
    (-1, (2, 3, 7)),
    (-3, (2, 2, 2, 3)),
]


def _semion(b, orders):
    n = 1 + len(orders)
    A = np.zeros((n, n), dtype=int)
    A[0, 0] = b
    for j, a in enumerate(orders, 1):
        A[j, j] = -a
        A[0, j] = A[j, 0] = 1
    s = sum(1j ** (int(np.array(x) @ A @ np.array(x)) % 4) for x in itertools.product([0, 1], repeat=n))
    return abs(s) / 2 ** ((n + 1) / 2)


@pytest.mark.parametrize("b,orders", CASES)
def test_level_one_modulus_is_the_semion_gauss_sum(b, orders):
    z = partition_function((b, [(a, 1) for a in orders]), "SU(2)", 1, 20).numeric
    assert abs(abs(z) - _semion(b, orders)) < 1e-15


def test_closed_formula_refuses_orders_sharing_a_factor():
    with pytest.raises(KnotobsError, match="pairwise coprime"):
        gauss_sum_partition_function((-2, [(2, 1), (3, 1), (4, 1)]), 1)
    # and agrees with the surgery route where it applies
    z1 = gauss_sum_partition_function((-1, [(2, 1), (3, 1), (7, 1)]), 1, 20).numeric
    z2 = partition_function((-1, [(2, 1), (3, 1), (7, 1)]), "SU(2)", 1, 20).numeric
    assert abs(z1 - z2) < mpmath.mpf(10) ** -18
