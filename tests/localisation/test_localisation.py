"""The localisation route (CONVENTIONS §10) against outside formulas and the surgery route.

Sources beside each check:
- V. G. Kac & D. H. Peterson, Adv. Math. 53 (1984) (S matrix), and the SL(2,Z) action on
  SU(N)_k characters: the fiber Gauss sum must equal the matrix of ``S U`` built from S and T
  words (L. Jeffrey, Commun. Math. Phys. 147 (1992) for SU(2); S. K. Hansen & T. Takata,
  arXiv math/0209403 for general groups);
- E. Verlinde, Nucl. Phys. B 300 (1988); E. Witten, Commun. Math. Phys. 121 (1989):
  ``Z(S^1 x Sigma_g) = sum_lam S_{0 lam}^(2-2g)``; SU(2) values 4, 10, 20, 35, 56, 84
  (g = 2) and 8, 36, 120, 329, 784, 1680 (g = 3), ``Z(S^1 x T^2) = k + 1`` (the
  number of integrable weights; common practice);
- L. Jeffrey, Commun. Math. Phys. 147 (1992) 563-604: closed formula for SU(2) lens spaces;
- the surgery route (Reshetikhin-Turaev; CONVENTIONS §7, §9), an independent computation
  from the modular data.
"""

from __future__ import annotations

import math
from fractions import Fraction

import mpmath
import numpy as np
import pytest

from knotobs.errors import (
    InexactDivisionError,
    InvalidGroupError,
    InvalidSeifertDataError,
    NotIntegrableError,
    SizeLimitError,
)
from knotobs.evaluation.modular import ModularData
from knotobs.evaluation.surgery import fiber_wilson_loop, partition_function, rademacher_phi, rho
from knotobs.fibrations.seifert import SeifertManifold
from knotobs.guard import limits
from knotobs.localisation import localisation_fiber_wilson_loop, localisation_partition_function
from knotobs.localisation.fiber import FiberFactor
from knotobs.localisation.lattice import shifted
from knotobs.localisation.phase import dedekind_sum


def _rational(z):
    return z.exact.as_cyclotomic().rational_value()


# ---------------------------------------------------------------------------
# the fiber Gauss sum is the SL(2,Z) matrix (Kac-Peterson S, T with -c/24)


@pytest.mark.parametrize("N,k", [(2, 3), (2, 6), (3, 2), (3, 3), (4, 2)])
def test_fiber_gauss_sum_is_sl2z_matrix(N, k):
    md = ModularData(N, k)
    K = k + N
    lam = np.array([shifted(w, N) for w in md.weights])
    for a, b in [(2, 1), (3, 2), (5, 2), (1, 3), (4, -1), (6, 1)]:
        for mu in [(), (1,), (2,)]:
            f = FiberFactor(N, K, a, b, mu)
            E, z, eps = f.exponents(lam)
            g = np.array([sum(c * np.exp(1j * np.pi * e / a) for e, c in enumerate(row)) for row in f.table])
            F = (eps[None, :] * np.exp(2j * np.pi * E / f.modulus) * g[z]).sum(axis=1)
            val = (1j ** (N * (N - 1) // 2) * np.exp(-2j * np.pi * (N * N - 1) * float(f.phi) / 24)
                   / math.sqrt(N * K ** (N - 1) * a ** (N - 1)) * F)
            R = rho(f.V, md)
            j = md.index[mu]
            ref = np.array([complex(R[i][j].to_mpc(15)) for i in range(md.size)])
            assert np.abs(val - ref).max() < 1e-9, (N, k, a, b, mu)


def test_dedekind_sum_matches_definition():
    # s(h, k) = sum_r ((r/k)) ((h r/k)) (Rademacher-Grosswald 1972, ch. 2), by the definition
    def saw(x):
        return Fraction(0) if x.denominator == 1 else x - math.floor(x) - Fraction(1, 2)
    for k in range(1, 25):
        for h in range(-30, 30):
            if math.gcd(h, k) == 1:
                ref = sum((saw(Fraction(r, k)) * saw(Fraction(h * r, k)) for r in range(1, k)), Fraction(0))
                assert dedekind_sum(h, k) == ref


# ---------------------------------------------------------------------------
# Verlinde numbers (Verlinde 1988; Witten 1989)


def test_verlinde_su2_published():
    assert [_rational(localisation_partition_function("M(2; 0)", "SU(2)", k)) for k in range(1, 7)] == \
        [4, 10, 20, 35, 56, 84]
    assert [_rational(localisation_partition_function("M(3; 0)", "SU(2)", k)) for k in range(1, 7)] == \
        [8, 36, 120, 329, 784, 1680]
    assert [_rational(localisation_partition_function("M(1; 0)", "SU(2)", k)) for k in range(1, 9)] == \
        [k + 1 for k in range(1, 9)]


@pytest.mark.parametrize("k", [1, 2, 3, 4])
@pytest.mark.parametrize("g", [0, 1, 2, 3])
def test_verlinde_su3_from_modular_data(g, k):
    md = ModularData(3, k)
    S0 = md.S_numeric()[0, :]
    ref = int(round(float(np.sum(S0 ** (2 - 2 * g)).real)))
    z = localisation_partition_function(f"M({g}; 0)", "SU(3)", k)
    assert _rational(z) == ref
    if g == 1:
        assert ref == math.comb(k + 2, 2)


# ---------------------------------------------------------------------------
# Jeffrey's closed formula for SU(2) lens spaces


@pytest.mark.parametrize("p", [2, 3, 5, 7, 12])
@pytest.mark.parametrize("K", [3, 6, 13])
def test_lens_spaces_jeffrey(p, K, jeffrey):
    with mpmath.workdps(40):
        for q in range(1, p):
            if math.gcd(p, q) == 1:
                z = localisation_partition_function(f"L({p},{q})", "SU(2)", K - 2, digits=25)
                assert abs(z.numeric - jeffrey(p, q, K)) < 1e-22, (p, q)


# ---------------------------------------------------------------------------
# equal to the surgery route, exactly


CASES = [
    (-1, [(2, 1), (3, 1), (5, 1)]),           # Poincare sphere
    (0, [(2, -1), (3, 1), (5, 1)]),           # the same manifold, other invariants
    (1, [(2, 1), (3, 2), (5, 3)]),
    (0, [(7, 2)]),                            # L(2,7) = L(7,4)
    (-1, [(2, 1), (4, 1), (6, 1)]),           # orders sharing factors
    (-2, [(2, 1), (2, 1), (2, 1), (2, 1)]),   # e = 0
    (0, [(3, 1), (3, 1), (3, 2), (3, 1)]),
    (0, []),                                  # S^2 x S^1
    (2, []),
]


@pytest.mark.parametrize("N,k", [(2, 1), (2, 4), (3, 2), (3, 3), (4, 1), (4, 2)])
def test_equals_surgery_exactly(N, k):
    for b, fib in CASES:
        loc = localisation_partition_function((b, fib), f"SU({N})", k, exact=True)
        sur = partition_function((b, fib), f"SU({N})", k, route="surgery", exact=True)
        assert loc.exact == sur.exact, (N, k, b, fib)


@pytest.mark.slow
@pytest.mark.parametrize("N,kmax", [(2, 12), (3, 8), (4, 4)])
def test_equals_surgery_sweep(N, kmax):
    more = CASES + [(-1, [(2, 1), (3, 1), (5, 1), (7, 1)]), (0, [(4, 1), (6, 1), (9, 2)]),
                    (-1, [(2, 1), (2, 1), (3, 1), (3, 1), (4, 1)])]
    for k in range(1, kmax + 1):
        for b, fib in more:
            loc = localisation_partition_function((b, fib), f"SU({N})", k, digits=25, exact=False)
            sur = partition_function((b, fib), f"SU({N})", k, route="surgery", digits=25, exact=False)
            assert abs(loc.numeric - sur.numeric) < 1e-22, (N, k, b, fib)


def test_shared_orders_exact_zeros():
    # surgery gives exact zeros of Z(M(0; -1; (2,1), (4,1), (6,1))) at k = 1, 3, 5; the
    # localisation route confirms them as exact zeros of the cyclotomic field
    for k in range(1, 7):
        z = localisation_partition_function("M(0; -1; (2,1), (4,1), (6,1))", "SU(2)", k, exact=True)
        s = partition_function((-1, [(2, 1), (4, 1), (6, 1)]), "SU(2)", k, route="surgery", exact=True)
        assert z.exact.is_zero() == (k % 2 == 1) == s.exact.is_zero()
        assert z.exact == s.exact


# ---------------------------------------------------------------------------
# fiber Wilson loops


def _theta(mu, N, K, f):
    C = Fraction(sum(x * (x - 2 * i - 1) for i, x in enumerate(mu)) + N * sum(mu), 2) \
        - Fraction(sum(mu) ** 2, 2 * N)
    return mpmath.expjpi(2 * mpmath.mpf((C * f / K).numerator) / (C * f / K).denominator)


@pytest.mark.parametrize("N,k", [(2, 4), (3, 3), (4, 2)])
def test_fiber_loops_equal_surgery(N, k):
    K = k + N
    for b, fib in [(-1, [(2, 1), (3, 1), (5, 1)]), (0, [(2, 1), (3, -1)]), (0, [(7, 2)]),
                   (1, [(2, 1), (3, 2), (5, 3)]), (-1, [(2, 1), (4, 1), (6, 1)])]:
        M = SeifertManifold(b, fib)
        for exc, reg in [({0: (1,)}, []), ({len(fib) - 1: (2,)}, []), ({}, [(1,)]), ({}, [(2, 1)]),
                         ({}, [(1,), (1,)]), ({0: (1,), len(fib) - 1: (1,)}, [(1,)])]:
            if any(len(m) >= N or (m and m[0] > k) for m in list(exc.values()) + reg):
                continue
            if len(set(exc)) < len(exc):
                continue
            loc = localisation_fiber_wilson_loop((b, fib), k, f"SU({N})", regular=reg, exceptional=exc,
                                                 normalized=False, digits=20)
            # both routes orient the core of a fiber by "regular fiber ~ a_i c_i" (CONVENTIONS §7;
            # the surgery route takes the dual colour on chains of fibers with b_i < 0)
            sur = fiber_wilson_loop((b, fib), k, f"SU({N})", regular=reg, exceptional=exc,
                                    normalized=False, digits=20)
            # both are in a framing whose self-linking they report; convert (CONVENTIONS §2)
            conv = 1
            for f_l, f_s, mu in zip(loc.details["framings"], sur.details["framings"], reg + list(exc.values())):
                conv *= _theta(mu, N, K, f_l - f_s)
            with mpmath.workdps(30):
                assert abs(loc.numeric - sur.numeric * conv) < 1e-15, (N, k, b, fib, exc, reg)


def test_core_orientation_convention():
    # M(0; 0; (2,1), (3,-1)) = M(0; -1; (2,1), (3,2)) (the normal-form move keeps the fibration and
    # the orientation of every core; Seifert 1933).  The localisation route gives the same zero-framed
    # three-component link for both invariants, and so does the surgery route on the normal form
    # (b_i > 0) and on the unnormalised invariant (3,-1).
    for N, k in [(3, 3), (4, 2)]:
        args = dict(regular=[(1,)], normalized=False, digits=20, framing="zero")
        a = localisation_fiber_wilson_loop((0, [(2, 1), (3, -1)]), k, f"SU({N})", exceptional={0: (1,), 1: (1,)}, **args)
        b = localisation_fiber_wilson_loop((-1, [(2, 1), (3, 2)]), k, f"SU({N})", exceptional={0: (1,), 1: (1,)}, **args)
        s = fiber_wilson_loop((-1, [(2, 1), (3, 2)]), k, f"SU({N})", exceptional={0: (1,), 1: (1,)}, **args)
        d = fiber_wilson_loop((0, [(2, 1), (3, -1)]), k, f"SU({N})",
                              exceptional={0: (1,), 1: (1,)}, **args)
        assert abs(a.numeric - b.numeric) < 1e-15 and abs(a.numeric - s.numeric) < 1e-15
        assert abs(a.numeric - d.numeric) < 1e-15


def test_trefoil_as_regular_fiber_is_rosso_jones():
    # S^3 = M(0; 0; (2,1), (3,-1)): the regular fiber is T(2,3) in the fiber framing 6, normalised by
    # Z(S^3) it is theta^6 times the zero-framed invariant, here compared to the exact polynomial
    # (CONVENTIONS §3, §7) evaluated at q = exp(2 pi i/K)
    from knotobs.evaluation.rosso_jones import rosso_jones
    from knotobs.fibrations.torus import parse_knot
    from knotobs.representations.groups import parse_group
    for N, k, lam in [(2, 3, (1,)), (3, 4, (2, 1)), (4, 2, (1, 1))]:
        w = localisation_fiber_wilson_loop((0, [(2, 1), (3, -1)]), k, f"SU({N})", regular=[lam], digits=20)
        poly = rosso_jones(parse_knot("T(2,3)"), parse_group(f"SU({N})"), (lam,), "fiber")
        assert abs(w.numeric - poly.at_root_of_unity(k + N, dps=25)) < 1e-15


def test_zero_framing_and_normalised_loop():
    w0 = localisation_fiber_wilson_loop("Sigma(2,3,5)", 3, "SU(2)", regular=[(1,)], framing="zero")
    s0 = fiber_wilson_loop((-1, [(2, 1), (3, 1), (5, 1)]), 3, "SU(2)", regular=[(1,)], framing="zero")
    assert w0.exact == s0.exact
    with pytest.raises(InexactDivisionError):
        localisation_fiber_wilson_loop("L(5,1)", 3, "SU(2)", exceptional={0: (1,)}, framing="zero")
    with pytest.raises(InexactDivisionError):   # Z vanishes at k = 1
        localisation_fiber_wilson_loop("M(0; -1; (2,1), (4,1), (6,1))", 1, "SU(2)", regular=[(1,)])


def test_genus_one_gluing_formula():
    # g >= 1: compare with the gluing formula of CONVENTIONS §7 evaluated here from the modular
    # data: Z = exp(2 pi i c (Sum Phi - 3 sign e)/24) sum_lam S_{0 lam}^(2-2g-n) prod rho(S U_i)_{lam 0}
    from knotobs.localisation.phase import fiber_matrix
    for N, k, g, b, fib in [(2, 3, 1, -1, [(2, 1), (3, 1)]), (3, 2, 1, 0, [(3, 1)]), (2, 4, 2, 1, [(2, 1)]),
                            (2, 2, 1, -1, [(2, 1), (2, 1)])]:
        md = ModularData(N, k)
        fibs = list(fib) + [(1, b)]
        mats = [rho(fiber_matrix(a, bb), md) for a, bb in fibs]
        S0 = [complex(md.S_exact((), w).to_mpc(20)) for w in md.weights]
        tot = 0
        for i in range(md.size):
            t = S0[i] ** (2 - 2 * g - len(fibs))
            for R in mats:
                t *= complex(R[i][0].to_mpc(20))
            tot += t
        e = -(Fraction(b) + sum(Fraction(bb, a) for a, bb in fib))
        X = sum(rademacher_phi(fiber_matrix(a, bb)) for a, bb in fibs) - 3 * ((e > 0) - (e < 0))
        ref = tot * np.exp(2j * np.pi * float(md.central_charge * X) / 24)
        z = localisation_partition_function((g, b, fib), f"SU({N})", k, digits=20)
        assert abs(complex(z.numeric) - ref) < 1e-9, (N, k, g, b, fib)


# ---------------------------------------------------------------------------
# bad input


def test_bad_input():
    with pytest.raises(InvalidSeifertDataError):
        localisation_partition_function("M(-1; 0)", "SU(2)", 3)
    with pytest.raises(InvalidSeifertDataError, match="non-orientable"):
        localisation_partition_function("M(n2; 0)", "SU(2)", 3)
    with pytest.raises(NotIntegrableError):
        localisation_partition_function("S^3", "SU(2)", 0)
    with pytest.raises(InvalidGroupError):
        localisation_partition_function("S^3", "U(2)", 2)
    with pytest.raises(NotIntegrableError):
        localisation_fiber_wilson_loop("S^3", 2, "SU(2)", regular=[(3,)])
    with pytest.raises(InvalidSeifertDataError):
        localisation_fiber_wilson_loop("Sigma(2,3,5)", 2, "SU(2)", exceptional={3: (1,)})


def test_oversized_is_refused_before_work():
    with limits(seconds=1):
        with pytest.raises(SizeLimitError) as exc:
            localisation_partition_function("Sigma(2,3,5)", "SU(6)", 60)
    msg = str(exc.value)
    assert "localisation route" in msg and "weights" in msg and "limit of 1 s" in msg


# ---------------------------------------------------------------------------
# property test: random Seifert manifolds, the two routes agree exactly


def _random_cases(seed, count):
    import random
    rnd = random.Random(seed)
    out = []
    while len(out) < count:
        N = rnd.choice([2, 3, 4])
        k = rnd.randint(1, {2: 10, 3: 5, 4: 3}[N])
        n = rnd.randint(3, 5)
        fib = []
        for _ in range(n):
            a = rnd.randint(2, 6)
            b = rnd.choice([x for x in range(-a, 2 * a) if math.gcd(a, x) == 1])
            fib.append((a, b))
        b = rnd.randint(-2, 1)
        colour = rnd.choice([(), (1,), (2,), (1, 1)][: 2 + (N > 2) + (k > 1)])
        if colour and (len(colour) >= N or colour[0] > k):
            colour = ()
        out.append((N, k, b, fib, colour))
    return out


def _check_random(N, k, b, fib, colour):
    z = localisation_partition_function((b, fib), f"SU({N})", k, exact=True)
    s = partition_function((b, fib), f"SU({N})", k, route="surgery", exact=True)
    assert z.exact == s.exact, (N, k, b, fib)
    if colour:
        from knotobs.evaluation.seifert_routes import fiber_wilson_loop as dispatch
        w = dispatch((b, fib), k, f"SU({N})", exceptional={len(fib) - 1: colour}, normalized=False,
                     route="both", digits=20)
        assert w.details["agreement"].startswith(("exact", "to 20")), (N, k, b, fib, colour)


@pytest.mark.parametrize("case", _random_cases(7, 4))
def test_random_manifolds_agree(case):
    _check_random(*case)


@pytest.mark.slow
@pytest.mark.parametrize("case", _random_cases(11, 60))
def test_random_manifolds_agree_sweep(case):
    _check_random(*case)


@pytest.mark.parametrize("M", [7, 64, 65, 360, 2580, 5003])
def test_root_table_within_three_units(M):
    """The fixed-point table of ``zeta^j = exp(2 pi i j/M)`` behind every fiber factor is within
    3 units of ``2^-S`` of the true cosines and sines (the bound ``root_sums`` certifies), both
    entry by entry (``M <= SMALL``) and by giant and baby steps above.  Reference values: mpmath's
    cos and sin at 60 digits in a local context (the trigonometric values are common practice)."""
    import mpmath

    from knotobs.localisation import fixedpoint as fp

    S = 2 * fp.LIMB
    re_l, im_l = fp._table(M, S)

    def val(limbs, j):
        return sum(int(limb[j]) << (fp.LIMB * t) for t, limb in enumerate(limbs)) - (2 << S)

    ctx = mpmath.MPContext()
    ctx.dps = 60
    for j in sorted({0, 1, M // 3, M // 2, M - 1, (7 * M) // 11}):
        x = 2 * ctx.pi * j / M
        assert abs(val(re_l, j) - ctx.cos(x) * 2 ** S) <= 3
        assert abs(val(im_l, j) - ctx.sin(x) * 2 ** S) <= 3
