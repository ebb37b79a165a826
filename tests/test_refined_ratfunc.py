"""Q(q, t) arithmetic with reduced operands (knotobs/refined/ratfunc.py).

Sums and products are formed by Henrici's method (D. E. Knuth, The Art of Computer Programming,
vol. 2, §4.5.1: with reduced operands only gcd(d1, d2), or the cross gcds, can cancel); the check is
against forming the unreduced result and reducing it by one full gcd (common practice), on random
operands, and that equal functions print alike.
"""

import random

import pytest

from knotobs.refined.ratfunc import QT, RatQT


def _random_poly(rng):
    q, t = QT.poly_gens()
    p = 0 * QT.one_poly()
    for _ in range(rng.randint(1, 4)):
        p += rng.randint(-3, 3) * q ** rng.randint(0, 3) * t ** rng.randint(0, 3)
    return p if not p.is_zero() else QT.one_poly()


@pytest.mark.parametrize("seed", range(5))
def test_operations_agree_with_full_reduction(seed):
    rng = random.Random(seed)
    for _ in range(60):
        a = RatQT(_random_poly(rng) * _random_poly(rng), _random_poly(rng) * _random_poly(rng))
        b = RatQT(_random_poly(rng) * _random_poly(rng), _random_poly(rng))
        assert a + b == RatQT(a.n * b.d + b.n * a.d, a.d * b.d)
        assert a - b == RatQT(a.n * b.d - b.n * a.d, a.d * b.d)
        assert a * b == RatQT(a.n * b.n, a.d * b.d)
        if not b.is_zero():
            assert a / b == RatQT(a.n * b.d, a.d * b.n)


def test_cancellation_to_zero_and_one():
    q, t = QT.gens()
    x = (q - t) / (q + t)
    assert (x - x).is_zero() and str(x - x) == "0"
    assert x / x == QT.from_int(1) and str(x * (QT.from_int(1) / x)) == "1"
    with pytest.raises(ZeroDivisionError):
        x / (x - x)
