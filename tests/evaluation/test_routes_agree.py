"""The two evaluators agree exactly.

* Rosso–Jones: Adams operations and twists (M. Rosso, V. F. R. Jones, J. Knot Theory
  Ramifications 2 (1993) 97; links: X.-S. Lin, H. Zheng, Trans. AMS 362 (2010) 1;
  CONVENTIONS §3).
* Weight-insertion Gaussian sum from the Seifert fibration (R. Lawrence, L. Rozansky,
  Commun. Math. Phys. 205 (1999) 287; M. Mariño, Commun. Math. Phys. 253 (2005) 25;
  CONVENTIONS §4).

The two share only the representation-theory primitives (weights, Casimir), so exact
agreement over a broad range of knots, links, groups and colours is a real check of
both (agreement with an outside reference is in ``tests/reference/``).  The default run
covers the whole grid asked for (N = 2..5, partitions of 1..4 boxes, coprime P < Q with
P Q <= 60, both chiralities: about 2000 knots, ~5 s) and a sample of links; ``-m slow`` adds
every link of the grid and an extended grid (N up to 6, 5 boxes, P Q <= 100).
"""

from __future__ import annotations

import random
from math import gcd

import pytest

from knotobs import SU, U, TorusLink, rosso_jones, weight_sum, wilson_loop
from knotobs.representations import partitions_of


def _knot_pairs(max_pq: int = 60):
    return [(P, Q) for P in range(2, max_pq) for Q in range(P + 1, max_pq // P + 1)
            if gcd(P, Q) == 1 and P * Q <= max_pq]


def _partitions(N: int, max_size: int = 4):
    return [lam for n in range(1, max_size + 1) for lam in partitions_of(n) if len(lam) <= N]


FULL_KNOTS = [
    (N, lam, P, Q, sign)
    for N in range(2, 6)
    for lam in _partitions(N)
    for (P, Q) in _knot_pairs()
    for sign in (1, -1)
]

# links T(dP, dQ): d = 2, 3 components, same colour on every component or one each
FULL_LINKS = []
for N in range(2, 6):
    small = [lam for lam in _partitions(N, 2)]
    for d, pairs in ((2, [(1, 1), (1, 2), (1, 3), (2, 3), (1, 5), (2, 5), (3, 4)]), (3, [(1, 1), (1, 2), (2, 3)])):
        for (P, Q) in pairs:
            for lam in small:
                FULL_LINKS.append((N, (lam,) * d, d * P, d * Q))
            if d == 2:
                FULL_LINKS.append((N, ((1,), (2,)), d * P, d * Q))
                FULL_LINKS.append((N, ((2,), (1, 1)), d * P, -d * Q))

_RNG = random.Random(20240601)
SAMPLE_LINKS = _RNG.sample(FULL_LINKS, 40)


def _check(N, kind, cols, p, q, framing=0):
    g = SU(N) if kind == "SU" else U(N)
    knot = TorusLink(p, q)
    a = rosso_jones(knot, g, cols, framing)
    b = weight_sum(knot, g, cols, framing)
    assert a == b, f"{knot} {g} {cols} framing={framing}: {a} != {b}"
    return a


def _id_knot(case):
    N, lam, P, Q, s = case
    return f"SU{N}-{''.join(map(str, lam))}-T({P},{s * Q})"


@pytest.mark.parametrize("N", range(2, 6))
def test_routes_agree_knots_full_grid(N):
    cases = [c for c in FULL_KNOTS if c[0] == N]
    assert cases
    for _, lam, P, Q, sign in cases:
        _check(N, "SU", lam, P, sign * Q)


@pytest.mark.parametrize("case", SAMPLE_LINKS, ids=lambda c: f"SU{c[0]}-{c[1]}-T({c[2]},{c[3]})")
def test_routes_agree_links_sample(case):
    N, cols, p, q = case
    _check(N, "SU", list(cols), p, q)


@pytest.mark.parametrize("N,lam", [(N, lam) for N in (1, 2, 3, 4) for lam in ((1,), (2,), (1, 1), (2, 1))
                                   if len(lam) <= N])
@pytest.mark.parametrize("p,q", [(2, 3), (3, 4), (2, -5), (4, 6), (3, 3)])
def test_routes_agree_unitary(N, lam, p, q):
    _check(N, "U", lam, p, q)


@pytest.mark.parametrize("framing", [1, -2, "fiber", "zero"])
@pytest.mark.parametrize("p,q,lam", [(2, 3, (1,)), (3, 5, (2, 1)), (3, -4, (2,)), (4, 6, (1,)), (3, 3, (1, 1))])
def test_routes_agree_with_framing(framing, p, q, lam):
    _check(3, "SU", lam, p, q, framing)


def test_routes_agree_per_component_framing():
    _check(3, "SU", [(1,), (2,)], 2, 4, [1, -1])
    _check(2, "U", [(1,), (1,), (2,)], 3, 3, [0, 2, -1])


def test_route_both_in_wilson_loop():
    """``route="both"`` recomputes both and returns the common value."""
    r = wilson_loop("T(3,5)", "SU(4)", [2, 1], route="both")
    assert r.value == rosso_jones(TorusLink(3, 5), SU(4), (2, 1))
    assert wilson_loop("T(4,6)", "SU(3)", [(1,), (2,)], route="both").value == weight_sum(
        TorusLink(4, 6), SU(3), [(1,), (2,)])


def test_grid_is_the_requested_one():
    """Guard against the grid shrinking silently."""
    assert len(FULL_KNOTS) > 1500
    assert {c[0] for c in FULL_KNOTS} == {2, 3, 4, 5}
    assert {sum(c[1]) for c in FULL_KNOTS} == {1, 2, 3, 4}
    assert max(c[2] * c[3] for c in FULL_KNOTS) == 60  # T(3,20), T(4,15), T(5,12)
    assert {c[0] for c in SAMPLE_LINKS} == {2, 3, 4, 5}


@pytest.mark.slow
@pytest.mark.parametrize("N", range(2, 7))
def test_routes_agree_knots_extended(N):
    for size in (1, 2, 3, 4, 5):
        for lam in partitions_of(size):
            if len(lam) > N:
                continue
            for P, Q in _knot_pairs(100):
                _check(N, "SU", lam, P, Q)


@pytest.mark.slow
def test_routes_agree_links_full():
    for N, cols, p, q in FULL_LINKS:
        _check(N, "SU", list(cols), p, q)
