"""SU(N)_k modular data: S, T, C, central charge, fusion, Kac–Walton reduction.

Sources: V. G. Kac & D. H. Peterson, Adv. Math. 53 (1984) 125–264 (S matrix, modular
relations); E. Verlinde, Nucl. Phys. B 300 (1988) 360–376 (fusion from S); M. A. Walton,
Nucl. Phys. B 340 (1990) 777–790 and D. Gepner & E. Witten, Nucl. Phys. B 278 (1986)
(fusion by affine reflection, an independent route to the same integers).
"""

from __future__ import annotations

import math
from fractions import Fraction

import mpmath
import numpy as np
import pytest

from knotobs.errors import InvalidGroupError, NotIntegrableError
from knotobs.evaluation.modular import (
    ModularData,
    check_integrable,
    integrable_weights,
    kac_walton_reduce,
    parse_group,
)
from knotobs.polynomials.cyclotomic import CyclotomicField, sqrt_rational

@pytest.fixture(autouse=True)
def _precision():
    with mpmath.workdps(50):
        yield


FAST = [(2, k) for k in (1, 2, 5, 13, 30)] + [(3, k) for k in (1, 4, 7)] + [(4, k) for k in (1, 3)]
FULL = [(2, k) for k in range(1, 31)] + [(3, k) for k in range(1, 13)] + [(4, k) for k in range(1, 7)]


def _check_modular(N, k):
    md = ModularData(N, k)
    S = md.S_numeric()
    n = md.size
    # alcove size binom(k+N-1, N-1) (common practice)
    assert n == math.comb(k + N - 1, N - 1)
    assert np.allclose(S, S.T, atol=1e-12)                       # symmetric
    assert np.allclose(S @ S.conj().T, np.eye(n), atol=1e-12)    # unitary
    assert S[0, 0].real > 0 and abs(S[0, 0].imag) < 1e-14        # S_00 > 0
    C = md.charge_conjugation()
    assert np.allclose(S @ S, C, atol=1e-12)                     # S^2 = C
    T = np.diag(np.exp(2j * np.pi * np.array([float(t) for t in md.T_exponents()])))
    assert np.allclose(np.linalg.matrix_power(S @ T, 3), S @ S, atol=1e-11)  # (ST)^3 = S^2
    Th = np.diag(np.exp(2j * np.pi * np.array([float(h) for h in md.twist_exponents()])))
    c = float(md.central_charge)
    # without the c/24 shift: (S Theta)^3 = exp(2 pi i c/8) S^2 (Kac-Peterson)
    assert np.allclose(np.linalg.matrix_power(S @ Th, 3), np.exp(2j * np.pi * c / 8) * (S @ S),
                       atol=1e-11)
    F = md.fusion_tensor()
    assert F.min() >= 0
    return md, F


@pytest.mark.parametrize("N,k", FAST)
def test_modular_relations_sample(N, k):
    _check_modular(N, k)


@pytest.mark.slow
@pytest.mark.parametrize("N,k", FULL)
def test_modular_relations_full(N, k):
    md, F = _check_modular(N, k)
    # Verlinde = Kac-Walton for every pair
    for a in md.weights:
        for b in md.weights:
            kw = md.fusion(a, b)
            ver = {c: int(F[md.index[a], md.index[b], md.index[c]])
                   for c in md.weights if F[md.index[a], md.index[b], md.index[c]]}
            assert kw == ver


@pytest.mark.parametrize("N,k", [(2, 4), (3, 3), (4, 2)])
def test_verlinde_equals_kac_walton(N, k):
    # Verlinde's formula and the Kac-Walton algorithm are independent computations of the
    # same fusion coefficients (Verlinde 1988; Walton 1990).
    md = ModularData(N, k)
    F = md.fusion_tensor()
    for a in md.weights:
        for b in md.weights:
            kw = md.fusion(a, b)
            ver = {c: int(F[md.index[a], md.index[b], md.index[c]])
                   for c in md.weights if F[md.index[a], md.index[b], md.index[c]]}
            assert kw == ver, (a, b)


def test_exact_fusion_coefficients():
    # SU(2)_k: V_1 x V_1 = V_0 + V_2 for k >= 2 (Clebsch-Gordan truncated); at k = 1 only V_0.
    md = ModularData(2, 3)
    assert md.fusion_coefficient((1,), (1,), ()) == 1
    assert md.fusion_coefficient((1,), (1,), (2,)) == 1
    assert md.fusion_coefficient((1,), (2,), (3,)) == 1
    assert md.fusion_coefficient((3,), (3,), ()) == 1        # simple current
    assert ModularData(2, 1).fusion((1,), (1,)) == {(): 1}
    # SU(3)_1: Z_3 fusion (common practice)
    md3 = ModularData(3, 1)
    assert md3.fusion((1,), (1,)) == {(1, 1): 1}
    assert md3.fusion_coefficient((1,), (1, 1), ()) == 1


def test_exact_S_entries_su2():
    # S_ab = sqrt(2/K) sin(pi (a+1)(b+1)/K) (CONVENTIONS §6)
    md = ModularData(2, 4)
    K = 6
    for a in range(5):
        for b in range(5):
            val = md.S_exact((a,) if a else (), (b,) if b else ()).to_mpc(30)
            ref = mpmath.sqrt(mpmath.mpf(2) / K) * mpmath.sin(mpmath.pi * (a + 1) * (b + 1) / K)
            assert abs(val - ref) < mpmath.mpf(10) ** -28


def test_exact_unitarity_and_S2_su3():
    # exact check of S^2 = C for SU(3)_2 in Q(zeta_15): S = s0 Stilde, s0^2 = -1/(3 K^2)
    md = ModularData(3, 2)
    n = md.size
    St = md.stilde_matrix()
    s0sq = (md.s0() * md.s0()).as_cyclotomic()
    C = md.charge_conjugation()
    for i in range(n):
        for j in range(n):
            acc = sum((St[i][l] * St[l][j] for l in range(n)), md.s_field.zero)
            assert acc * s0sq == CyclotomicField(1)(int(C[i, j]))


def test_quantum_dimension_is_hook_content():
    # dim_q(lam) = prod [N + c]/[h] (CONVENTIONS §2), here SU(3)_4, lam = (2,1)
    md = ModularData(3, 4)
    K = 7
    q = mpmath.expjpi(mpmath.mpf(2) / K)

    def qi(x):
        return (q ** (mpmath.mpf(x) / 2) - q ** (-mpmath.mpf(x) / 2)) / (q ** 0.5 - q ** -0.5)

    ref = qi(3 + 0) * qi(3 + 1) * qi(3 - 1) / (qi(3) * qi(1) * qi(1))
    assert abs(md.quantum_dimension((2, 1)).to_mpc(25) - ref) < 1e-20


def test_central_charge_and_twists():
    md = ModularData(2, 1)
    assert md.central_charge == 1
    assert md.h((1,)) == Fraction(1, 4)                 # h = j(j+1)/K, j = 1/2, K = 3
    md3 = ModularData(3, 1)
    assert md3.central_charge == 2
    assert md3.h((1,)) == Fraction(1, 3)                # (N^2-1)/(2N K) = 8/24


def test_kac_walton_reduction():
    # SU(2), K = 5: x = (6, 0) (lam = (5,), k = 3) reflects to (5-... ) with sign -1
    s, lam = kac_walton_reduce((6, 0), 2, 5)
    assert (s, lam) == (-1, (3,))
    assert kac_walton_reduce((5, 0), 2, 5) == (0, None)   # on the affine wall
    assert kac_walton_reduce((1, 3, 0), 3, 10)[0] == -1   # a Weyl reflection


def test_integrable_weights_and_errors():
    assert integrable_weights(2, 3) == ((), (1,), (2,), (3,))
    with pytest.raises(NotIntegrableError, match="not integrable at level 2"):
        check_integrable((3,), 2, 2)
    with pytest.raises(NotIntegrableError, match="level k = 0"):
        ModularData(2, 0)
    with pytest.raises(InvalidGroupError, match="SO"):
        parse_group("SO(5)")
    assert check_integrable((2, 2, 1), 3, 5) == (1, 1)      # full column removed


def test_sqrt_rational_gauss_sums():
    # Gauss: g_p = sqrt(p) (p = 1 mod 4), i sqrt(p) (p = 3 mod 4) (Ireland & Rosen 1990, ch. 6)
    for r in (Fraction(2), Fraction(3), Fraction(5), Fraction(7, 3), Fraction(2, 15), Fraction(1, 12)):
        s = sqrt_rational(r)
        assert s * s == CyclotomicField(1)(r)
        assert abs(s.to_mpc(30) - mpmath.sqrt(mpmath.mpf(r.numerator) / r.denominator)) < 1e-28
