"""Slow sweeps (python -m pytest -q -m slow tests/qseries): the two routes of Zhat and the exact
finite-level identity over many Seifert manifolds and levels.  Sources as in test_series.py and
test_radial.py (GPPV 2020; Neumann 1981; Murakami arXiv:2302.13526; the surgery route of
Reshetikhin-Turaev / Kirby-Melvin, CONVENTIONS §9)."""

from __future__ import annotations

from fractions import Fraction
from itertools import combinations_with_replacement

import pytest

from knotobs.evaluation.surgery import partition_function
from knotobs.fibrations.seifert import parse_space
from knotobs.qseries.radial import finite_level_exact
from knotobs.qseries.seifert_sum import SeifertSum
from knotobs.qseries.series import zhat_all


def _spaces():
    out = []
    for orders in combinations_with_replacement([2, 3, 4, 5, 6], 3):
        out.append("M(0; 0; " + ",".join(f"({a},1)" for a in orders) + ")")
    for orders in combinations_with_replacement([2, 3, 5], 4):
        out.append("M(0; -1; " + ",".join(f"({a},1)" for a in orders) + ")")
    return out


def _negative_definite(spaces):
    """The spaces with e < 0 (negative definite star plumbing in this orientation)."""
    from knotobs.fibrations.seifert import parse_space

    return [s for s in spaces if parse_space(s).euler < 0]


@pytest.mark.slow
@pytest.mark.parametrize("space", _negative_definite(_spaces()))
def test_routes_agree_sweep(space):
    S = SeifertSum(space)
    zs = zhat_all(space, 20)
    top = min(z.prefactor for z in zs) + 15
    total: dict[Fraction, Fraction] = {}
    for z in zs:
        w = 1 if z.label.self_conjugate else 2
        for ex, c in z.terms().items():
            if ex <= top:
                total[ex] = total.get(ex, 0) + w * c
    assert {k: v for k, v in total.items() if v} == S.total(top)


@pytest.mark.slow
@pytest.mark.parametrize("space", ["Sigma(2,3,5)", "Sigma(2,3,7)", "L(7,3)", "M(0; 0; (2,1),(4,1),(6,1))"])
def test_exact_finite_level_sweep(space):
    for K in range(3, 16):
        a = finite_level_exact(space, K)
        b = partition_function(parse_space(space), "SU(2)", level=K - 2, exact=True, route="surgery").exact
        assert a == b, (space, K)
