"""Exact torus-knot polynomials at large sizes: both routes, closed formulas, the kernels.

Outside references:

* Jones polynomial of T(p, q): V. F. R. Jones, Ann. of Math. 126 (1987) 335–388, §11:
  ``V(t) (1 - t^2) = t^((p-1)(q-1)/2) (1 - t^(p+1) - t^(q+1) + t^(p+q))``.
* Coloured Jones polynomial of T(p, q): H. R. Morton, Math. Proc. Camb. Phil. Soc. 117 (1995)
  129–135, in the form quoted (from memory, normalisation re-derived) in
  ``tests/reference/test_torus_formulas.py``:
  ``(q^(1/2) - q^(-1/2)) W_n = q^(-pq(n^2-1)/4) sum_j (q^(pq j^2 + (p+q) j + 1/2) - q^(pq j^2 + (q-p) j - 1/2))``,
  ``j = -(n-1)/2 .. (n-1)/2``, ``W_n = [n] J_n`` at ``t = q^-1``.
* HOMFLY-PT at ``a = q^(N/2)``, ``z = q^(1/2) - q^(-1/2)`` is the normalised SU(N) invariant
  (CONVENTIONS §1, §3; common practice), computed here by the two fixed-N routes.
* Lucas polynomials ``s^e + (-1)^e s^-e = sum_k e/(e-k) C(e-k, k) z^(e-2k)`` with ``z = s - 1/s``
  (E. Lucas, Amer. J. Math. 1 (1878)).
* Plethysm by p_m vanishes on Schur functions with nonempty m-core (G. James, A. Kerber,
  The Representation Theory of the Symmetric Group (1981) 2.7.32); the number of partitions of
  ``m n`` with empty m-core is the number of m-multipartitions of n (Macdonald (1995) I.1 ex. 8).

The reference sides are plain dictionaries and Python integers (no knotobs arithmetic).
"""

from __future__ import annotations

import random
import subprocess
import sys
from fractions import Fraction
from math import comb

import numpy as np
import pytest
from flint import fmpz_poly

from knotobs import SU, TorusLink, colored_jones, homfly, jones, rosso_jones, weight_sum, wilson_loop
from knotobs.errors import InexactDivisionError, SizeLimitError
from knotobs.evaluation.families import homfly_at
from knotobs.guard import limits
from knotobs.polynomials.bivariate import _to_z_poly, z_power
from knotobs.polynomials.dense import Dense
from knotobs.polynomials.laurent import Laurent
from knotobs.polynomials.zbasis import lucas_coefficients, to_z
from knotobs.representations.groups import _adams_fixed, quantum_dimension
from knotobs.representations.partitions import partitions_of
from knotobs.representations.qdim_factors import qdim_dense
from knotobs.representations.symmetric import adams_generic, empty_core_partitions, mn_character, z_rho
from knotobs.representations.weight_arrays import adams_array


# ---------------------------------------------------------------- reference formulas (dicts)
def _mul_binomial(a: dict, e1, c1, e2, c2) -> dict:
    out: dict = {}
    for e, c in a.items():
        for de, dc in ((e1, c1), (e2, c2)):
            out[e + de] = out.get(e + de, 0) + c * dc
    return {e: c for e, c in out.items() if c}


def _morton(p: int, q: int, n: int) -> dict:
    pref = Fraction(-p * q * (n * n - 1), 4)
    out: dict = {}
    for twice_j in range(-(n - 1), n, 2):
        j = Fraction(twice_j, 2)
        base = p * q * j * j + pref
        for e, c in ((base + (p + q) * j + Fraction(1, 2), 1), (base + (q - p) * j - Fraction(1, 2), -1)):
            out[e] = out.get(e, 0) + c
    return {e: c for e, c in out.items() if c}


def _check_morton(p: int, q: int, n: int, value: Laurent) -> None:
    """Morton's identity on integer arrays (exponents times 4), for outputs of 10^5..10^6 terms.

    Only the stored coefficient list of the result is read; the arithmetic is numpy's.
    """
    c = value.canonical()
    co = np.array([int(x) for x in c._p.coeffs()], dtype=np.int64)
    nz = np.flatnonzero(co)
    ex4 = -(4 * (c._s + nz)) // c._d                          # t = q^-1, exponents of q times 4
    assert np.all((4 * (c._s + nz)) % c._d == 0)
    cf = co[nz]
    # times (q^(n/2) - q^(-n/2))
    lhs_e = np.concatenate([ex4 + 2 * n, ex4 - 2 * n])
    lhs_c = np.concatenate([cf, -cf])
    order = np.argsort(lhs_e, kind="stable")
    lhs_e, lhs_c = lhs_e[order], lhs_c[order]
    uniq, start = np.unique(lhs_e, return_index=True)
    sums = np.add.reduceat(lhs_c, start)
    got = {int(e): int(v) for e, v in zip(uniq, sums) if v}
    want = {int(4 * e): v for e, v in _morton(p, q, n).items()}
    assert got == want


# ================================================================ coloured Jones at new sizes
def test_colored_jones_800_both_routes():
    """J_800(T(3,4)) (433,317 monomials): the Rosso–Jones and weight-sum routes agree exactly."""
    a = colored_jones("T(3,4)", 800)
    b = colored_jones("T(3,4)", 800, route="weight-sum")
    assert a.value == b.value
    assert a.value.num_terms() > 400_000


@pytest.mark.slow
def test_colored_jones_800_morton():
    """J_800(T(3,4)) against Morton (1995) (about 3 s of reference arithmetic)."""
    _check_morton(3, 4, 800, colored_jones("T(3,4)", 800).value)


@pytest.mark.parametrize("p,q,n", [(2, 3, 400), (2, 5, 301), (3, 5, 150), (4, 7, 60)])
def test_colored_jones_morton_larger(p, q, n):
    """Morton (1995) for colours far beyond the old 2000-box limit of the Adams operation."""
    _check_morton(p, q, n, colored_jones(TorusLink(p, q), n).value)


@pytest.mark.slow
def test_colored_jones_2000_both_routes_and_morton():
    a = colored_jones("T(3,4)", 2000)
    b = colored_jones("T(3,4)", 2000, route="weight-sum")
    assert a.value == b.value
    _check_morton(3, 4, 2000, a.value)


@pytest.mark.parametrize("p,q", [(25, 26), (31, 45), (60, 61)])
def test_jones_closed_formula_large(p, q):
    """Jones (1987) for large torus knots, by both fixed-N routes."""
    for route in ("rosso-jones", "weight-sum"):
        v = jones(TorusLink(p, q), route=route).value.terms()
        lhs = _mul_binomial(v, 0, 1, 2, -1)
        g = Fraction((p - 1) * (q - 1), 2)
        rhs = {g: 1, g + p + 1: -1, g + q + 1: -1, g + p + q: 1}
        assert lhs == {e: c for e, c in rhs.items() if c}


# ================================================================ HOMFLY-PT at new sizes
def test_homfly_25_26_specialises_to_fixed_n_routes():
    """HOMFLY-PT of T(25,26) at a = q^(N/2) equals the SU(N) invariant of both fixed-N routes, N = 2..4."""
    res = homfly("T(25,26)")
    assert res.value.to_az()  # the (a, z) form exists
    for N in (2, 3, 4):
        want = homfly_at("T(25,26)", N).value
        k = TorusLink(25, 26)
        rj = wilson_loop(k, SU(N), (1,), normalized=True).value
        ws = wilson_loop(k, SU(N), (1,), normalized=True, route="weight-sum").value
        assert want == rj == ws


def test_homfly_az_alexander_of_large_knot():
    """HOMFLY-PT at a = 1 is the Conway polynomial: Delta(T(p,q)) (t - 1)... closed form (Alexander 1928)."""
    from knotobs import alexander

    p, q = 13, 14
    d = alexander(TorusLink(p, q)).value.terms()
    # Delta(t) (t^p - 1)(t^q - 1) = t^k (t^(pq) - 1)(t - 1) for the symmetric normalisation
    lhs = _mul_binomial(_mul_binomial(d, p, 1, 0, -1), q, 1, 0, -1)
    shift = min(lhs)
    rhs = {shift + p * q + 1: 1, shift + p * q: -1, shift + 1: -1, shift: 1}
    assert lhs == rhs


@pytest.mark.slow
def test_coloured_homfly_7_9_specialises():
    """[3,2]-coloured HOMFLY-PT of T(7,9) at a = q^(N/2) equals the U(N)->SU(N) routes (N = 2, 3)."""
    res = homfly("T(7,9)", (3, 2))
    for N in (2, 3):
        want = res.value.specialize(Fraction(N, 2))
        k = TorusLink(7, 9)
        assert want == wilson_loop(k, SU(N), (3, 2), normalized=True).value


# ================================================================ guards
def test_homfly_60_61_estimate_is_accepted_and_a_tight_limit_refuses_it():
    """T(60,61) in (a, z) is estimated at about 16 s (it takes ~7 s and ~0.4 GB on 2 cores), so the
    default limits accept it; a tighter limit refuses it before any work, naming the knot and colour."""
    from knotobs.evaluation.estimates import homfly_estimate

    e = homfly_estimate(60, 61, ((1,),))
    assert 1 < e["seconds"] < 60 and e["memory_mb"] < 2048
    with limits(seconds=1):
        with pytest.raises(SizeLimitError) as info:
            homfly("T(60,61)")
    msg = str(info.value)
    assert "T(60,61)" in msg and "[1]" in msg and "estimated" in msg


def test_homfly_huge_refused_in_the_cli_with_one_line():
    out = subprocess.run([sys.executable, "-c", "from knotobs.cli import app; app()", "poly", "T(150,151)",
                          "--family", "homfly"], capture_output=True, text=True, timeout=120)
    assert out.returncode == 2
    lines = [ln for ln in out.stderr.splitlines() if ln.strip()]
    assert len(lines) == 1 and lines[0].startswith("error:") and "T(150,151)" in lines[0]
    assert "estimated" in lines[0]


@pytest.mark.slow
def test_homfly_60_61_computed_and_specialises_to_jones():
    """HOMFLY-PT of T(60,61) (the former runaway case) at a = q, z = q^(1/2) - q^(-1/2) is
    Jones's V(t) at t = 1/q (Jones 1987 closed formula, checked on the Jones side above)."""
    res = homfly("T(60,61)")
    assert res.value.to_az()
    at2 = homfly_at("T(60,61)", 2).value
    assert at2 == jones("T(60,61)").value.subs_power(-1).rename("q")


def test_limits_are_honoured():
    """A tighter --max-seconds refuses what the default accepts (the estimate is compared, not a fixed size)."""
    with limits(seconds=1e-4):
        with pytest.raises(SizeLimitError) as info:
            colored_jones("T(3,4)", 800)
    assert "J_800" in str(info.value) and "T(3,4)" in str(info.value)


# ================================================================ fixed N beyond the old limits
@pytest.mark.parametrize("N,lam,pq", [(9, (1,), (2, 3)), (10, (2,), (3, 4)), (12, (1, 1), (2, 5)), (20, (1,), (5, 7))])
def test_weight_sum_large_rank_agrees(N, lam, pq):
    """The weight sum now runs for N > 8 (product form of the Weyl sum); it agrees with Rosso–Jones."""
    k = TorusLink(*pq)
    assert weight_sum(k, SU(N), lam) == rosso_jones(k, SU(N), lam)


@pytest.mark.parametrize("N", [2, 3, 5, 9, 20])
def test_qdim_dense_matches_weyl(N):
    for n in range(1, 6):
        for lam in partitions_of(n, N):
            assert qdim_dense(lam, N).to_laurent() == quantum_dimension(SU(N), lam)


@pytest.mark.parametrize("N", [2, 3, 4, 6])
def test_adams_array_matches_python_racah_speiser(N):
    for n in range(1, 5):
        for lam in partitions_of(n, N):
            for m in (2, 3, 5):
                mus, c = adams_array(lam, m, N)
                got = {tuple(x for x in r if x > 0): int(v) for r, v in zip(mus.tolist(), c)}
                assert got == dict(_adams_fixed(lam, m, N))


# ================================================================ plethysm
def _brute_adams(lam, m):
    n = sum(lam)
    w = [(r, Fraction(mn_character(lam, r), z_rho(r))) for r in partitions_of(n)]
    out = {}
    for mu in partitions_of(m * n):
        c = sum(x * mn_character(mu, tuple(m * y for y in r)) for r, x in w)
        if c:
            out[mu] = int(c)
    return out


@pytest.mark.parametrize("lam,m", [((2,), 3), ((1, 1), 4), ((2, 1), 3), ((3, 1), 2), ((2, 2), 3), ((3, 2), 2)])
def test_plethysm_over_empty_cores_equals_all_partitions(lam, m):
    assert dict(adams_generic(lam, m)) == _brute_adams(lam, m)


@pytest.mark.parametrize("m,n", [(2, 4), (3, 3), (7, 5)])
def test_empty_core_count(m, n):
    # m-multipartitions of n: [x^n] (prod_i 1/(1 - x^i))^m
    p = [len(partitions_of(i)) for i in range(n + 1)]
    poly = [1] + [0] * n
    for _ in range(m):
        poly = [sum(poly[i - j] * p[j] for j in range(i + 1)) for i in range(n + 1)]
    cores = empty_core_partitions(m, n)
    assert len(cores) == len(set(cores)) == poly[n]
    assert all(sum(mu) == m * n for mu in cores)


# ================================================================ kernels
def test_dense_division_matches_flint():
    rng = random.Random(7)
    for _ in range(30):
        L = rng.randint(1, 300)
        a = [rng.randint(-9, 9) for _ in range(L)]
        n = rng.randint(1, 40)
        q = fmpz_poly(a) * fmpz_poly([-1] + [0] * (n - 1) + [1])
        d = Dense(np.array([int(x) for x in q.coeffs()], dtype=np.int64), 0, 1).div_binomial(n)
        assert d.to_laurent() == Laurent(fmpz_poly(a), 0, 1)
        if L > 1 and any(a):
            with pytest.raises(InexactDivisionError):
                Dense(np.array(a, dtype=np.int64), 0, 1).mul_binomial(n).times_monomial(0).div_binomial(n + 1)


def test_dense_big_coefficients_switch_to_python_integers():
    big = 1 << 61
    d = Dense.from_terms([0, 1, 2], [big, big, big])
    p = d.mul_binomial(1).mul_binomial(1).mul_binomial(3)
    assert p.arr.dtype == object
    assert p.div_binomial(3).div_binomial(1).div_binomial(1).to_laurent() == d.to_laurent()


def test_to_z_matches_greedy_and_lucas():
    rng = random.Random(3)
    for d in (0, 1, 2, 7, 24, 25, 40, 77):
        for step in (1, 2):
            g = {j: rng.randint(-10**12, 10**12) for j in range(0, d + 1, step)}
            f = Laurent.zero("s")
            for j, c in g.items():
                f = f + z_power(j) * c
            assert to_z(f) == {j: c for j, c in g.items() if c} == _to_z_poly(f)
    s = Laurent.gen("s")
    for e in range(1, 60):
        assert to_z(s**e + (-1) ** e * s**-e) == lucas_coefficients(e)
    # the closed form itself against the recurrence L_e = z L_(e-1) + L_(e-2)
    prev, cur = {0: 2}, {1: 1}
    for e in range(2, 40):
        nxt = {}
        for j, c in cur.items():
            nxt[j + 1] = nxt.get(j + 1, 0) + c
        for j, c in prev.items():
            nxt[j] = nxt.get(j, 0) + c
        prev, cur = cur, {j: c for j, c in nxt.items() if c}
        assert cur == lucas_coefficients(e)
    with pytest.raises(InexactDivisionError):
        to_z(s + s**-1)


def test_many_quantum_dimensions_are_refused_before_they_are_computed(monkeypatch):
    """Regression (found by the CLI fuzz test): SU(9) [4,4,4,4] on T(12,11) has 162585 irreducible
    pieces in its Adams image and took 214 s while its weight-count estimate said 10 s; the count of
    pieces is now checked before any quantum dimension is computed."""
    import importlib

    from knotobs.errors import SizeLimitError
    from knotobs.fibrations.torus import TorusLink
    from knotobs.representations.groups import SU

    rj = importlib.import_module("knotobs.evaluation.rosso_jones")   # the module (the package exports the function)

    def no_work(*args, **kwargs):
        raise AssertionError("a quantum dimension was computed before the refusal")

    monkeypatch.setattr(rj, "qdim_dense", no_work)
    with pytest.raises(SizeLimitError, match="quantum dimensions of 162585 irreducible pieces"):
        rj.rosso_jones(TorusLink(12, 11), SU(9), (4, 4, 4, 4))


@pytest.mark.parametrize("n, N", [(70, 2), (100, 2), (44, 3)])
def test_many_component_torus_links_keep_exact_multiplicities(n, N):
    # the tensor-power multiplicities of n fundamental components exceed 64 bits from about
    # n = 64 (SU(2)); T(70,140) once failed with an integer overflow.  At q = 1 the unnormalised
    # Wilson loop is the classical dimension N^n (common practice: the quantum dimension at q = 1)
    v = wilson_loop(TorusLink(n, 2 * n), SU(N), (1,)).value
    assert v.at_one() == N ** n
