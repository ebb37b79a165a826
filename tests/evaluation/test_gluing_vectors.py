"""The surgery route by vectors: short SL(2,Z) words, S as a Fourier transform, base genus.

Sources: N. Reshetikhin & V. Turaev, Invent. Math. 103 (1991) and R. Kirby & P. Melvin,
Invent. Math. 105 (1991) (the plumbing form of the surgery formula, CONVENTIONS §9);
V. Kac & D. Peterson, Adv. Math. 53 (1984) (the S matrix, CONVENTIONS §6);
E. Verlinde, Nucl. Phys. B300 (1988) 360 and E. Witten, Commun. Math. Phys. 121 (1989) 351
(dimensions of the spaces of conformal blocks = Z(S^1 x Sigma_g)); the SL(2,Z) presentation
<S, T | S^4 = 1, (ST)^3 = S^2> (common practice).
"""

from __future__ import annotations

import itertools
import math
from fractions import Fraction

import mpmath
import pytest

from knotobs.errors import SizeLimitError
from knotobs.evaluation.gluing import evaluate_gluing, plan_gluing, surgery_cost
from knotobs.evaluation.lattice_fourier import WeightLatticeFourier, smith_normal_form
from knotobs.evaluation.modular import ModularData
from knotobs.evaluation.sl2z_words import shortest_continued_fraction, shortest_word, word_to_matrix
from knotobs.evaluation.surgery import (
    SurgeryPresentation,
    _plumbing_exact,
    negative_continued_fraction,
    partition_function,
    seifert_to_surgery,
)
from knotobs.guard import limits
from knotobs.numerics import working_precision


def _pres(b, fibers):
    e0, pq = seifert_to_surgery(b, fibers)
    return SurgeryPresentation.from_coefficients(e0, pq)


# ---------------------------------------------------------------------------
# words


def _cf_value(cf):
    v = Fraction(cf[-1])
    for c in reversed(cf[:-1]):
        v = c - 1 / v
    return v


@pytest.mark.parametrize("p,q", [(7, 6), (1, 7), (-1, 2), (30, 7), (13, 8), (97, 41), (-5, 3), (2, 1)])
def test_shortest_continued_fraction_is_a_continued_fraction_and_shortest(p, q):
    cf = shortest_continued_fraction(p, q)
    assert _cf_value(cf) == Fraction(p, q)
    assert len(cf) <= len(negative_continued_fraction(p, q))
    # brute force: no expansion with fewer quotients, quotients in [-12, 12]
    for m in range(1, len(cf)):
        for combo in itertools.product(range(-12, 13), repeat=m):
            try:
                if _cf_value(list(combo)) == Fraction(p, q):
                    pytest.fail(f"{combo} is shorter than {cf}")
            except ZeroDivisionError:
                pass


def test_nearest_integer_expansion_is_as_short_as_any_floor_or_ceiling_choice():
    # exhaustive search over floor/ceiling quotients (every expansion whose remainders stay
    # below the denominator) for all p/q with |p| <= 60, 1 <= q <= 60
    from functools import lru_cache

    @lru_cache(maxsize=None)
    def best(p, q):
        if p % q == 0:
            return 1
        out = None
        for n in (p // q, p // q + 1):
            r = n * q - p
            nq, nr = (q, r) if r > 0 else (-q, -r)
            cand = 1 + best(nq, nr)
            out = cand if out is None else min(out, cand)
        return out

    for p in range(-60, 61):
        for q in range(1, 61):
            if math.gcd(p, q) == 1:
                cf = shortest_continued_fraction(p, q)
                assert _cf_value(cf) == Fraction(p, q)
                assert len(cf) == best(p, q), (p, q, cf)


def test_shortest_word_reproduces_every_small_matrix():
    for a, b, c, d in itertools.product(range(-6, 7), repeat=4):
        if a * d - b * c != 1:
            continue
        neg, w = shortest_word([[a, b], [c, d]])
        M = word_to_matrix(w)
        s = -1 if neg else 1
        assert ((s * M[0][0], s * M[0][1]), (s * M[1][0], s * M[1][1])) == ((a, b), (c, d))


def test_lens_space_words_have_no_S_applications():
    # L(7,1) = M(0; 0; (1,7)): the negative continued fraction of 1/7 has 7 vertices, the
    # shortest word none beyond the column
    plan = plan_gluing(_pres(0, [(1, 7)]))
    assert plan.s_applications == 0
    assert len(negative_continued_fraction(1, 7)) == 7


# ---------------------------------------------------------------------------
# the Fourier transform over P/KQ


def test_smith_normal_form_of_the_root_lattice():
    # I + J on Z^(N-1) has Smith form diag(1, ..., 1, N): P/Q = Z/N (common practice)
    for N in range(2, 7):
        m = N - 1
        A = [[int(i == j) + 1 for j in range(m)] for i in range(m)]
        U, V, d = smith_normal_form(A)
        assert d == [1] * (m - 1) + [N]
        prod = [[sum(U[i][t] * A[t][s] * V[s][j] for t in range(m) for s in range(m)) for j in range(m)]
                for i in range(m)]
        assert prod == [[d[i] if i == j else 0 for j in range(m)] for i in range(m)]


@pytest.mark.parametrize("N,k", [(2, 5), (3, 3), (4, 2), (5, 1), (3, 6)])
def test_fourier_transform_equals_kac_peterson_matrix(N, k):
    md = ModularData(N, k)
    F = WeightLatticeFourier.for_modular_data(md)
    assert F.size == N * (k + N) ** (N - 1)
    n = md.size
    from flint import acb

    vecs = [[acb(int(i == j)) for i in range(n)] for j in range(min(n, 4))]
    vecs.append([acb(i + 1, -i) for i in range(n)])
    with working_precision(40):
        out = F.apply(vecs)
    for j in range(min(n, 4)):
        for i in range(n):
            assert abs(out[j][i].mid() - acb(md.stilde(i, j).to_mpc(40))).abs_upper() < 1e-35
    for i in range(n):
        ref = sum((md.stilde(i, j).to_mpc(40) * mpmath.mpc(j + 1, -j) for j in range(n)), mpmath.mpc(0))
        assert abs(complex(out[-1][i]) - complex(ref)) < 1e-12 * max(1, abs(ref))


# ---------------------------------------------------------------------------
# the two forms of the formula agree exactly

CASES = [
    (0, [(2, -1), (3, 1), (5, 1)]),        # Sigma(2,3,5)
    (0, [(1, 7)]),                         # L(7,1)
    (0, [(7, 6)]),
    (-2, [(2, 1), (3, 2), (7, 6)]),        # Sigma(2,3,7)
    (1, [(2, 1), (4, -1), (6, 1)]),        # orders sharing factors
    (0, [(3, 1), (5, 2), (5, -3), (2, 1)]),
    (2, []),
]


@pytest.mark.parametrize("N,k", [(2, 3), (2, 6), (3, 2), (4, 1)])
@pytest.mark.parametrize("space", CASES)
@pytest.mark.parametrize("genus", [0, 1])
def test_word_form_equals_plumbing_form_exactly(space, N, k, genus):
    md = ModularData(N, k)
    pres = _pres(*space)
    new, _ = evaluate_gluing(md, pres, genus, exact=True)
    old = _plumbing_exact(md, pres, {}, [], genus)
    assert new == old


@pytest.mark.parametrize("N,k,lam", [(2, 4, (2,)), (3, 2, (1,)), (3, 3, (2, 1))])
def test_word_form_equals_plumbing_form_with_wilson_lines(N, k, lam):
    md = ModularData(N, k)
    i = md.weight_index(lam)
    for space in CASES[:5]:
        pres = _pres(*space)
        for exc, reg in [({0: i}, []), ({}, [i]), ({len(space[1]) - 1: i}, [i, 0])]:
            if not space[1] and exc:
                continue
            new, _ = evaluate_gluing(md, pres, 0, exc, reg, exact=True)
            assert new == _plumbing_exact(md, pres, exc, reg, 0)


@pytest.mark.parametrize("N,k", [(2, 5), (3, 3), (4, 2)])
def test_balls_agree_with_exact(N, k):
    md = ModularData(N, k)
    i = md.weight_index((1,))
    for space in CASES:
        pres = _pres(*space)
        ex, _ = evaluate_gluing(md, pres, 0, {}, [i], digits=25, exact=True)
        none, num = evaluate_gluing(md, pres, 0, {}, [i], digits=25, exact=False)
        assert none is None
        assert abs(num - ex.to_mpc(30)) < mpmath.mpf(10) ** -24


# ---------------------------------------------------------------------------
# base genus: Verlinde dimensions


@pytest.mark.parametrize("g,expected", [
    (1, [2, 3, 4, 5, 6, 7]),                  # k + 1
    (2, [4, 10, 20, 35, 56, 84]),             # Verlinde 1988; Witten 1989
    (3, [8, 36, 120, 329, 784, 1680]),
])
def test_su2_verlinde_numbers(g, expected):
    got = [partition_function((g, 0, []), "SU(2)", k).exact for k in range(1, 7)]
    assert got == expected


def test_su2_verlinde_closed_formula_genus_4():
    # dim = (K/2)^(g-1) sum_{j=1}^{K-1} sin(pi j/K)^(2-2g) (Verlinde 1988), K = k + 2
    for k in (1, 2, 5):
        K = k + 2
        ref = (mpmath.mpf(K) / 2) ** 3 * sum(mpmath.sin(mpmath.pi * j / K) ** -6 for j in range(1, K))
        assert partition_function((4, 0, []), "SU(2)", k).exact == int(mpmath.nint(ref))


@pytest.mark.parametrize("k", [1, 2, 3])
@pytest.mark.parametrize("g", [1, 2])
def test_su3_verlinde_from_modular_data(g, k):
    # sum_lam S_{0 lam}^(2-2g) with the (double precision) Kac-Peterson S matrix
    md = ModularData(3, k)
    S = md.S_numeric()
    ref = sum(abs(S[0, j]) ** (2 - 2 * g) for j in range(md.size))
    z = partition_function((g, 0, []), "SU(3)", k)
    assert z.exact == int(round(ref))
    assert abs(ref - round(ref)) < 1e-8


def test_genus_one_orientation_and_invariants():
    # Z(-M) = conj Z(M) (Kirby-Melvin 1991); (b, b_i) -> (b - 1, b_i + a_i) is the same manifold
    M = (1, -1, [(2, 1), (3, 1)])
    z = partition_function(M, "SU(2)", 5).exact
    assert partition_function((1, 1, [(2, -1), (3, -1)]), "SU(2)", 5).exact == z.conj()
    assert partition_function((1, -2, [(2, 3), (3, 1)]), "SU(2)", 5).exact == z
    assert "M(1; -1;" in partition_function(M, "SU(2)", 5).orientation


def test_genus_refused_by_gauss_sum():
    from knotobs.errors import KnotobsError

    with pytest.raises(KnotobsError, match="genus"):
        partition_function((1, 0, []), "SU(2)", 3, route="gauss-sum")
    from knotobs.errors import InvalidSeifertDataError

    with pytest.raises(InvalidSeifertDataError, match="g = -1"):
        partition_function((-1, 0, []), "SU(2)", 3)


# ---------------------------------------------------------------------------
# cost and guard


def test_cost_estimate_grows_and_refusal_names_size_and_route():
    s1, m1 = surgery_cost(3, 10, [(2, 1), (3, 1), (5, 1)], exact=False)
    s2, m2 = surgery_cost(3, 40, [(2, 1), (3, 1), (5, 1)], exact=False)
    assert 0 < s1 < s2 and 0 < m1 <= m2
    assert surgery_cost(3, 4, [(2, 1), (3, 1), (5, 1)])[0] < s2
    with limits(seconds=0.1):
        with pytest.raises(SizeLimitError, match=r"surgery route for SU\(3\) at level 40 \(861 weights"):
            partition_function((-1, [(2, 1), (3, 1), (5, 1)]), "SU(3)", 40)


def test_large_alcove_is_no_longer_a_fixed_refusal():
    # SU(2) at level 9998 (K = 10^4) has 9999 weights: above the old fixed limit of 5000
    z = partition_function((0, [(1, 5)]), "SU(2)", 9998, digits=20, route="surgery")
    # L(5,1) by Jeffrey's closed formula (Commun. Math. Phys. 147 (1992)) for L(p,1):
    # Z = -i sign / sqrt(2Kp) ... checked instead against the Gauss-sum route here
    gs = partition_function((0, [(1, 5)]), "SU(2)", 9998, digits=20, route="gauss-sum")
    assert abs(z.numeric - gs.numeric) < mpmath.mpf(10) ** -18
    assert math.comb(9999, 1) > 5000


@pytest.mark.parametrize("name", ["M(1; -1; (2,1), (3,1))", "M(2; 1; (3,1))", "M(1; 0; (2,1), (4,1), (6,-1))",
                                  "M(2; 0)", "M(1; 2)"])
@pytest.mark.parametrize("N,k", [(2, 3), (2, 5), (3, 2)])
def test_genus_surgery_equals_localisation_exactly(name, N, k):
    # two independent routes for base genus >= 1: the plumbing/gluing phase (canonical
    # 2-framing from the signature) and the localisation route's phase from Rademacher's
    # function (Lawrence-Rozansky 1999; Hansen 2001)
    from knotobs.fibrations.seifert import parse_space
    from knotobs.localisation import localisation_partition_function

    M = parse_space(name)
    a = partition_function(M, f"SU({N})", k, exact=True)
    b = localisation_partition_function(M, f"SU({N})", k, exact=True)
    assert a.exact == b.exact


def test_route_cost_takes_spaces_as_everywhere():
    from knotobs.evaluation.gluing import surgery_route_cost

    a = surgery_route_cost("Sigma(2,3,5)", "SU(3)", 40)
    b = surgery_cost(3, 40, [(2, 1), (3, 1), (5, 1)], 0, -1)
    assert a == b
    assert surgery_route_cost("M(2; 0)", "SU(2)", 5) == surgery_cost(2, 5, [], 2, 0)


@pytest.mark.parametrize("N,k,lam", [(3, 3, (1,)), (3, 3, (2,)), (4, 2, (1,)), (4, 2, (2, 1))])
def test_exceptional_core_orientation_does_not_depend_on_the_presentation(N, k, lam):
    # (b, b_i) -> (b - 1, b_i + a_i) and the sign of b_i do not change the fibration or the
    # orientation of the cores (H. Seifert, Acta Math. 60 (1933); convention "regular fiber ~
    # a_i c_i", CONVENTIONS §7): zero-framed values of the same link must agree, also for
    # colours that are not self-dual
    from knotobs.evaluation.surgery import fiber_wilson_loop

    args = dict(normalized=False, digits=20, framing="zero")
    for presentations in ([(0, [(2, 1), (3, -1)]), (-1, [(2, 1), (3, 2)]), (1, [(2, -1), (3, -1)])],
                          [(-1, [(2, 1), (3, 1), (5, 1)]), (0, [(2, -1), (3, 1), (5, 1)]),
                           (2, [(2, -1), (3, -2), (5, -4)])]):
        for j in range(len(presentations[0][1])):
            vals = [fiber_wilson_loop(sp, k, f"SU({N})", regular=[(1,)], exceptional={j: lam}, **args).numeric
                    for sp in presentations]
            assert all(abs(v - vals[0]) < 1e-15 for v in vals[1:]), (presentations[0], j, vals)
