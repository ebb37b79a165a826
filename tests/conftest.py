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
