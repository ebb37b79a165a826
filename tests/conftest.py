"""Shared outside references for the tests."""

import mpmath
import pytest

from knotobs.evaluation.surgery import rademacher_phi


def jeffrey_lens(p: int, q: int, K: int):
    """SU(2) ``Z(L(p, q))`` by L. Jeffrey's closed formula (Commun. Math. Phys. 147 (1992) 563–604):

        exp(-i pi Phi(U)/(2K)) i/sqrt(2Kp) sum_{n mod p} sum_{e = +-1} e exp(i pi/(2Kp) [a - 2(e + 2Kn) + d (e + 2Kn)^2]),

    ``U = [[a, b], [p, d]]`` in SL(2,Z) with ``a = q`` (the framing-corrected ``rho(U)_00``).  The
    integer in the bracket is reduced mod ``4Kp`` before scaling, so large ``K`` loses nothing.
    Computed at the caller's working precision.
    """
    a = q
    d = next(d for d in range(-4 * p, 4 * p) if (a * d - 1) % p == 0)
    b = (a * d - 1) // p
    ph = rademacher_phi([[a, b], [p, d]])
    s = 0
    for n in range(p):
        for e in (1, -1):
            num = a - 2 * (e + 2 * K * n) + d * (e + 2 * K * n) ** 2
            s += e * mpmath.expjpi(mpmath.mpf(num % (4 * K * p)) / (2 * K * p))
    return mpmath.expjpi(-mpmath.mpf(ph.numerator) / ph.denominator / (2 * K)) * 1j / mpmath.sqrt(2 * K * p) * s


@pytest.fixture
def jeffrey():
    """:func:`jeffrey_lens`, for the tests of lens spaces."""
    return jeffrey_lens


def su3_lattice_sum(space, K: int) -> complex:
    """SU(3) ``Z_k(M)``, ``K = k + 3``, as the Gauss sum over the weight lattice in double precision,
    written out independently of knotobs' continuation code (docs/continuation_sun.md §18.1,
    §18.8, §18.9):

        B_3 ((-1)^3 3 K^2)^g K^-2 sum_s sum'_{mu in Lambda/LKQ} h_s(mu/K),

    every coset ``s`` of the diagonal ``Q/LQ`` in ``prod_j Q/p_j Q`` enumerated directly (one coset
    for pairwise coprime orders), the torsion ``Delta^(n - 2 + 2g)`` of a base of genus ``g`` in the
    denominator (Blau–Thompson, JHEP 0605:003 (2006)), in fundamental-weight coordinates."""
    import itertools
    import math

    import numpy as np

    from knotobs.continuation.level import LRData

    lr = LRData.from_space(space, allow_shared=True, allow_genus=True)
    pq = list(lr.pq)
    ps = [p for p, _ in pq]
    L, N, r = math.lcm(*ps), 3, 2
    A = np.array([[2.0, -1.0], [-1.0, 2.0]])
    x = np.indices((N * L * K,) * r).reshape(r, -1).T.astype(float) / K
    gauss = np.exp(-1j * np.pi * K * lr.H * np.einsum("ti,ij,tj->t", x, np.linalg.inv(A), x) / lr.P)
    seen, total = set(), 0
    for s in itertools.product(*[list(itertools.product(range(p), repeat=r)) for p in ps]):
        if s in seen:
            continue
        for n in itertools.product(range(L), repeat=r):
            seen.add(tuple(tuple((a + b) % p for a, b in zip(sj, n)) for sj, p in zip(s, ps)))
        c = sum(np.array(sj, dtype=float) * q / p for sj, (p, q) in zip(s, pq))
        const = sum(q * (np.array(sj) @ A @ np.array(sj)) / (2 * p) for sj, (p, q) in zip(s, pq))
        h = gauss * np.exp(-2j * np.pi * K * (x @ c + const))
        keep = np.ones(len(x), dtype=bool)
        for i, j in ((0, 1), (1, 2), (0, 2)):
            y = x[:, i:j].sum(axis=1)                       # <alpha, z>, alpha = e_i - e_j
            for sj, (p, q) in zip(s, pq):
                h = h * 2j * np.sin(np.pi * (y + A[i:j].sum(axis=0) @ np.array(sj)) / p)
            wall = np.abs(np.round(y * K) % K) < 0.5
            keep &= ~wall
            h = h / np.where(wall, 1.0, 2j * np.sin(np.pi * y)) ** (len(pq) - 2 + 2 * lr.genus)
        total += h[keep].sum() / N / K ** r
    sigma = 1 if lr.H > 0 else -1
    B = (-np.exp(1j * np.pi * sigma * 8 / 4) / (6 * 3 * lr.P)
         * np.exp(-1j * np.pi * 2 * float(lr.phi) / K) * (-3 * K ** 2) ** lr.genus)
    return complex(B * total)


@pytest.fixture(name="su3_lattice_sum")
def _su3_lattice_sum_fixture():
    """:func:`su3_lattice_sum`, for the tests of the SU(3) continuation."""
    return su3_lattice_sum
