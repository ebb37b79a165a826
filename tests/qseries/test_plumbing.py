"""Plumbing trees, their text form, the star plumbing of a Seifert manifold, labels.

Outside references: W. D. Neumann, Trans. AMS 268 (1981) 299-344 (plumbing calculus; the inverse
linking matrix of a star plumbing: (B^-1)_00 = 1/e, (B^-1)_{0,l_i} = 1/(e a_i),
(B^-1)_{l_i l_j} = 1/(e a_i a_j) - delta_ij q_i^*/a_i -- common practice); F. Hirzebruch and
D. Zagier, The Atiyah-Singer theorem and elementary number theory (1974), §II.2 (the chain sum
sum (k_j - 3) = 12 s(q,a) - (q + q^*)/a, Barkan-Hirzebruch-Myerson); the E8 Dynkin diagram as the
plumbing of the Poincare sphere (Neumann-Raymond, LNM 664 (1978); common practice).
"""

from __future__ import annotations

import math
from fractions import Fraction

import pytest
from flint import fmpz_mat

from knotobs.errors import KnotobsError
from knotobs.evaluation.surgery import dedekind_sum
from knotobs.fibrations.seifert import parse_space
from knotobs.qseries.plumbing import negative_continued_fraction_le2, parse_plumbing, star_plumbing


def test_text_form_round_trip_and_errors():
    g = parse_plumbing("Plumb( -2 , -3,-2 :1-2 2 - 3)")
    assert str(g) == "Plumb(-2,-3,-2 : 1-2, 2-3)"
    assert parse_plumbing(str(g)) == g
    for bad, msg in [("Plumb()", "not an integer"), ("Plumb(-2,-2)", "edges"), ("Plumb(-2,-2 : 1-1)", "loop"),
                     ("Plumb(-2,-2 : 1-2, 2-1)", "twice"), ("Plumb(-2,-2,-2,-2 : 1-2, 3-4, 1-2)", "twice"),
                     ("Plumb(-2,-2 : 1+2)", "i-j"), ("Plumb(-2 : 1-2)", "1..1"), ("Plum(-2)", "written"),
                     ("Plumb(-2,-2,-2,-2 : 1-2, 3-4, 2-1)", "twice")]:
        with pytest.raises(KnotobsError, match=msg):
            parse_plumbing(bad)


def test_poincare_sphere_star_plumbing_is_e8():
    # the negative E8 Dynkin diagram: eight -2 vertices, one of degree 3 with arms of 1, 2, 4 vertices
    g = star_plumbing("Sigma(2,3,5)").graph
    assert g.weights == (-2,) * 8 and sorted(g.degrees) == [1, 1, 1, 2, 2, 2, 2, 3]
    assert g.determinant() == 1 and g.is_negative_definite()


@pytest.mark.parametrize("space", ["Sigma(2,3,7)", "L(12,5)", "M(0; 0; (4,1),(6,1),(9,2))",
                                   "M(0; -1; (2,1),(3,1),(3,1),(5,2))", "M(0; 1; (2,-1),(4,-1),(6,-1))"])
def test_star_plumbing_has_the_right_homology_and_inverse(space):
    sp = star_plumbing(space)
    g = sp.graph
    assert abs(g.determinant()) == parse_space(space).h1_order        # |H_1| = |det B| (common practice)
    inv = fmpz_mat(g.linking_matrix()).inv()
    e = sp.euler
    ent = lambda i, j: Fraction(int(inv[i, j].p), int(inv[i, j].q))  # noqa: E731
    assert ent(0, 0) == 1 / e
    for i, ((a, c), li) in enumerate(zip(sp.fibers, sp.leaves)):
        qstar = pow(-c, -1, a)
        assert ent(0, li) == 1 / (e * a)
        for j, ((a2, _), lj) in enumerate(zip(sp.fibers, sp.leaves)):
            expected = 1 / (e * a * a2) - (Fraction(qstar, a) if i == j else 0)
            assert ent(li, lj) == expected


def test_chain_sum_dedekind_identity():
    # Barkan-Hirzebruch-Myerson: sum (k_j - 3) = 12 s(q, a) - (q + q*)/a for a/q = [k_1, ..., k_m]^-
    for a in range(2, 30):
        for q in range(1, a):
            if math.gcd(a, q) != 1:
                continue
            ks = [-k for k in negative_continued_fraction_le2(Fraction(-a, q))]
            assert sum(k - 3 for k in ks) == 12 * dedekind_sum(q, a) - Fraction(q + pow(q, -1, a), a)


def test_orientation_and_b1_refusals():
    with pytest.raises(KnotobsError, match="e = 1/30 > 0"):
        star_plumbing("-Sigma(2,3,5)")
    with pytest.raises(KnotobsError, match="b_1 = 1"):
        star_plumbing("M(0; -1; (3,1),(3,1),(3,1))")
