"""F_K(x, q) of torus knots against the coloured Jones polynomials knotobs computes.

Outside sources: S. Gukov and C. Manolescu, Quantum Topol. 12 (2021), arXiv:1904.06057 (the trefoil
series (1/2) sum eps_m (x^(m/2) - x^(-m/2)) q^((m^2-1)/24), eps = -1, +1, +1, -1 on 1, 5, 7, 11 mod
12; the torus-knot form with (m^2 - (st-s-t)^2)/(4st) is from memory, hence the exact checks
below).  The coloured Jones polynomials come from knotobs's Rosso-Jones route (M. Rosso and
V. F. R. Jones, J. Knot Theory Ramifications 2 (1993); CONVENTIONS §3), an independent computation.
"""

from __future__ import annotations

from fractions import Fraction

import pytest

import knotobs
from knotobs.errors import KnotobsError
from knotobs.qseries.knot_complement import TorusKnotF, torus_knot_f


def test_trefoil_series_is_the_published_one():
    F = TorusKnotF(2, 3)
    got = {(m, c, e) for m, c, e in F.terms(60)}
    expected = set()
    for m in range(1, 60):
        eps = {1: -1, 5: 1, 7: 1, 11: -1}.get(m % 12, 0)
        if eps and Fraction(m * m - 1, 24) <= 60:
            expected.add((m, Fraction(eps, 2), Fraction(m * m - 1, 24)))
    assert got == expected and len(got) > 10


@pytest.mark.parametrize("s,t", [(2, 3), (2, 5), (3, 4), (3, 5), (2, 7), (4, 5)])
def test_specialisation_x_equals_q_to_the_n_gives_coloured_jones(s, t):
    # F(q^n, q) = q^(-g) (q^(n/2) - q^(-n/2)) J_n(T(s,t); q), g = (s-1)(t-1)/2, for n = 1..6; the
    # window extends 40 powers beyond the top of the right-hand side, so an infinite tail would show.
    F = TorusKnotF(s, t)
    g = Fraction((s - 1) * (t - 1), 2)
    for n in range(1, 7):
        J = knotobs.colored_jones(f"T({s},{t})", n, t_is="q").value
        rhs: dict[Fraction, Fraction] = {}
        for ex, c in dict(J.terms()).items():
            for sh, sg in ((Fraction(n, 2), 1), (Fraction(-n, 2), -1)):
                k = Fraction(ex) + sh - g
                rhs[k] = rhs.get(k, 0) + sg * c
        rhs = {k: v for k, v in rhs.items() if v}
        lhs = F.at_q_power(n, max(rhs) + 40)
        assert lhs == rhs, (s, t, n)


def test_refusals():
    with pytest.raises(KnotobsError, match="link"):
        TorusKnotF(2, 4)
    with pytest.raises(KnotobsError, match=">= 2"):
        TorusKnotF(1, 3)
    assert torus_knot_f("T(3,2)").s == 2
