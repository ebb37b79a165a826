"""Seifert manifolds with e = 0 over S^2: torus bundles, whose Z is a trace.

The four Euclidean Seifert manifolds with ``e = 0`` over the sphere are the torus bundles with
periodic monodromy ``A``: cone points (2,4,4) <-> ``A = S`` (order 4), (3,3,3) <-> ``-ST``
(order 3), (2,3,6) <-> ``ST`` (order 6), (2,2,2,2) <-> ``-1`` (common practice; P. Scott, Bull.
London Math. Soc. 15 (1983) 401-487, §4; the order of ``A`` is the lcm of the cone orders).  The
Chern-Simons partition function of a mapping torus is the trace of the mapping class on the
torus Hilbert space, ``Z = Tr rho(A)`` up to a framing phase (E. Witten, Commun. Math. Phys. 121
(1989) 351-399; L. Jeffrey, Commun. Math. Phys. 147 (1992) 563-604 for torus bundles), with
``rho(S)``, ``rho(T)`` the Kac-Peterson modular data (V. Kac and D. Peterson, Adv. Math. 53 (1984)
125-264; common practice) and ``rho(-1) = C = S^2``.  The phase depends on conventions, the
absolute value does not: ``|Z_k| = |Tr rho(A)|``.  The modular data below are built here from the
Kac-Peterson formula, independently of the package; ``Z_k`` comes from both finite-level routes
(surgery and localisation, which must agree exactly).
"""

from __future__ import annotations

import itertools

import mpmath
import pytest

import knotobs

BUNDLES = {                  # space -> the monodromy as a word in S, T, C
    "M(0; -1; (2,1), (4,1), (4,1))": "S",
    "M(0; -1; (3,1), (3,1), (3,1))": "STC",
    "M(0; -1; (2,1), (3,1), (6,1))": "ST",
    "M(0; -2; (2,1), (2,1), (2,1), (2,1))": "C",
}


def _sign(p) -> int:
    return (-1) ** sum(1 for i in range(len(p)) for j in range(i + 1, len(p)) if p[i] > p[j])


def _modular_data(N: int, k: int):
    """``S``, ``T`` of SU(N)_k (N = 2, 3) from the Kac-Peterson formula: ``S_lm`` proportional to
    ``sum_w sign(w) exp(-2 pi i <w(l + rho), m + rho>/K)``, normalised to be unitary;
    ``T_l = exp(i pi |l + rho|^2/K)`` (the overall phase does not matter here)."""
    K = k + N
    if N == 2:
        weights = [(a,) for a in range(k + 1)]
    else:
        weights = [(a, b) for a in range(k + 1) for b in range(k + 1 - a)]

    def vec(w):              # l + rho in R^N with coordinate sum 0 (from the partition of l)
        lam = [x + 1 for x in w]
        part = [sum(lam[i:]) for i in range(N - 1)] + [0]
        mean = mpmath.mpf(sum(part)) / N
        return [x - mean for x in part]

    V = [vec(w) for w in weights]
    n = len(V)
    S = mpmath.matrix(n, n)
    for i in range(n):
        for j in range(n):
            S[i, j] = sum(_sign(p) * mpmath.exp(-2j * mpmath.pi * sum(V[i][p[t]] * V[j][t] for t in range(N)) / K)
                          for p in itertools.permutations(range(N)))
    S = S / mpmath.sqrt(sum(abs(S[0, j]) ** 2 for j in range(n)))
    T = mpmath.diag([mpmath.exp(1j * mpmath.pi * sum(x * x for x in v) / K) for v in V])
    return S, T


def _trace_of(word: str, S, T):
    C = S * S
    A = mpmath.eye(S.rows)
    for letter in word:
        A = A * {"S": S, "T": T, "C": C}[letter]
    return sum(A[i, i] for i in range(A.rows))


@pytest.mark.parametrize("N,levels", [(2, range(1, 11)), (3, range(1, 6))])
def test_torus_bundles_are_traces_of_their_monodromy(N, levels):
    with mpmath.workdps(30):
        for k in levels:
            S, T = _modular_data(N, k)
            # the data are a unitary S with S^4 = 1 (a check of the construction)
            assert mpmath.mnorm(S * S.H - mpmath.eye(S.rows), 1) < 1e-25
            for space, word in BUNDLES.items():
                z = knotobs.partition_function(space, f"SU({N})", k, route="both")
                assert z.details["agreement"].startswith("exact")
                want = abs(_trace_of(word, S, T))
                assert abs(abs(z.numeric) - want) < 1e-20, (space, N, k, z.numeric, want)


def test_the_order_four_bundle_vanishes_at_odd_K():
    # |Tr S| for SU(2)_k is |sum_n sin(pi n^2/K)| sqrt(2/K): a half Gauss sum, 0 for odd K and 1 for
    # even K (Landsberg-Schaar / the quadratic Gauss sum; common practice) -- so the exact value
    # is exactly zero there, not a small number
    for k in (1, 3, 5, 7):
        z = knotobs.partition_function("M(0; -1; (2,1), (4,1), (4,1))", "SU(2)", k)
        assert z.exact is not None and z.exact.is_zero()


def test_continued_values_at_integers_are_traces_of_the_monodromy():
    # the continuation in K of e = 0 spaces (docs/continuation_sun.md 18.11) interpolates the
    # finite values at k <= L (d + 3) (SU(2): at most k = 24 on these four) as a quasi-polynomial;
    # at levels beyond those it must still give |Z| = |Tr rho(A)|.  (SU(3) beyond its
    # interpolation points: tests/test_continuation_zero_euler.py, against both finite routes.)
    from knotobs.continuation.cartan import continued_sun_partition_function

    N = 2
    with mpmath.workdps(30):
        for k in (30, 61):
            S, T = _modular_data(N, k)
            for space, word in BUNDLES.items():
                z = continued_sun_partition_function(space, f"SU({N})", K=k + N, digits=20).numeric
                assert abs(abs(z) - abs(_trace_of(word, S, T))) < 1e-15, (space, N, k)
