"""Ball-arithmetic helpers shared by the integral forms and the continuation (series, parsing).

One place sets the working precision: callers ask for ``digits`` correct decimal
digits; the helpers work with ``bits(digits)`` binary digits (plus guard bits) in
python-flint's ``acb`` balls and convert the midpoint to ``mpmath`` once.
"""

from __future__ import annotations

import re
from contextlib import contextmanager
from fractions import Fraction
from functools import lru_cache
from typing import Callable, Sequence

import mpmath
from flint import acb, arb, ctx

from knotobs.errors import ParseError, PrecisionError
from knotobs.numerics import working_precision

__all__ = [
    "bits",
    "to_mpc",
    "to_acb",
    "parse_complex",
    "checked",
    "ser_mul",
    "ser_inv",
    "ser_exp",
    "ser_sin",
    "bernoulli_plus",
    "agree",
    "working_bits",
    "ball_seconds",
]


def bits(digits: int, guard: int = 20) -> int:
    """Binary precision for ``digits`` decimal digits plus ``guard`` guard digits."""
    return int((digits + guard) * 3.33) + 16


@contextmanager
def working_bits(b: int):
    """At least ``b`` bits in python-flint and mpmath for the block (under the numerics lock)."""
    with working_precision(int(b / 3.3219280948873626) + 2):
        yield


def ball_seconds(ops: float, digits: int) -> float:
    """Estimated seconds for ``ops`` ball (acb) operations at ``digits`` decimal digits."""
    from knotobs.guard import seconds_for

    return seconds_for(ops, "ball") * max(1.0, (digits / 30.0)) ** 1.6


def to_mpc(z: acb, digits: int) -> mpmath.mpc:
    """Midpoint of an ``acb`` ball as an ``mpmath.mpc`` (``digits + 10`` digits kept)."""
    with working_precision(digits + 10):
        re_ = mpmath.mpf(z.real.mid().str(digits + 10, radius=False))
        im_ = mpmath.mpf(z.imag.mid().str(digits + 10, radius=False))
        return mpmath.mpc(re_, im_)


def to_acb(x) -> acb:
    """An ``mpmath`` number, int, Fraction or complex as an ``acb`` at the current precision."""
    if isinstance(x, acb):
        return x
    if isinstance(x, Fraction):
        return acb(x.numerator) / x.denominator
    if isinstance(x, int):
        return acb(x)
    x = mpmath.mpmathify(x)
    if isinstance(x, mpmath.mpf):
        return acb(arb(mpmath.nstr(x, ctx.dps + 5, strip_zeros=False)))
    return acb(arb(mpmath.nstr(x.real, ctx.dps + 5, strip_zeros=False)),
               arb(mpmath.nstr(x.imag, ctx.dps + 5, strip_zeros=False)))


_NUM = r"(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?"
_RE_COMPLEX = re.compile(
    rf"^(?P<re>[+-]?{_NUM})?(?:(?P<isign>[+-])(?P<im>{_NUM})?\*?[ij])?$|^(?P<pim>[+-]?{_NUM})?\*?[ij]$"
)


def parse_complex(value, name: str = "value") -> mpmath.mpc:
    """Read ``7.5+0.3i``, ``7.5-0.3j``, ``2i``, ``-i``, ``12``, a Python number or an mpmath number.

    >>> parse_complex("7.5+0.3i")
    mpc(real='7.5', imag='0.29999999999999999')
    >>> parse_complex("2i").imag
    mpf('2.0')
    >>> parse_complex("seven")
    Traceback (most recent call last):
    ...
    knotobs.errors.ParseError: cannot read value 'seven' as a complex number: write e.g. 7.5+0.3i, 12 or 2i
    """
    if isinstance(value, (int, float, complex, Fraction)) and not isinstance(value, bool):
        if isinstance(value, Fraction):
            return mpmath.mpc(mpmath.mpf(value.numerator) / value.denominator)
        return mpmath.mpc(value)
    if isinstance(value, (mpmath.mpf, mpmath.mpc)):
        return mpmath.mpc(value)
    if not isinstance(value, str):
        raise ParseError(f"cannot read {name} {value!r} as a complex number: write e.g. 7.5+0.3i, 12 or 2i")
    s = "".join(value.split())
    m = _RE_COMPLEX.match(s) if s else None
    if not m:
        raise ParseError(f"cannot read {name} {value!r} as a complex number: write e.g. 7.5+0.3i, 12 or 2i")
    if m.group("pim") is not None or (m.group("re") is None and m.group("isign") is None):
        im = m.group("pim")
        if im in (None, "+"):
            im = "1"
        elif im == "-":
            im = "-1"
        return mpmath.mpc(0, mpmath.mpf(im))
    re_ = mpmath.mpf(m.group("re") or "0")
    im = mpmath.mpf(0)
    if m.group("isign") is not None:
        im = mpmath.mpf(m.group("im") or "1")
        if m.group("isign") == "-":
            im = -im
    return mpmath.mpc(re_, im)


def agree(a: mpmath.mpc, b: mpmath.mpc, digits: int) -> bool:
    """``|a - b| <= 10^-digits * max(|a|, 1)`` (absolute below 1, relative above)."""
    with working_precision(digits + 10):
        return abs(a - b) <= mpmath.mpf(10) ** (-digits) * max(abs(a), 1)


def checked(compute: Callable[[int], acb], digits: int, what: str) -> mpmath.mpc:
    """``compute(d)`` at ``d = digits + 3`` and ``digits + 12`` must agree to ``digits`` digits.

    ``compute`` receives the number of digits it should aim for and sets its own
    precision, step sizes and cut-offs from it; the two runs therefore differ in
    every discretisation parameter, not only in rounding.  ``compute`` must derive everything
    from the user's input afresh at its own precision (parse the level again, recompute every
    constant): a quantity computed once at the lower precision and reused would carry the same
    error into both runs, and the comparison could not see it.
    """
    z1 = to_mpc(compute(digits + 3), digits)
    z2 = to_mpc(compute(digits + 12), digits + 10)
    if not agree(z1, z2, digits):
        raise PrecisionError(
            f"{what}: {digits} digits could not be confirmed (two discretisations differ by"
            f" {mpmath.nstr(abs(z1 - z2), 3)}); request fewer digits or a level further from"
            " the boundary of the allowed region"
        )
    with working_precision(digits):
        return +z2


# --------------------------------------------------------------- truncated power series
# A series is a list [c_0, c_1, ...] of acb (coefficients of w^0, w^1, ...).


def ser_mul(a: Sequence[acb], b: Sequence[acb], n: int) -> list[acb]:
    out = [acb(0)] * n
    for i, ai in enumerate(a[:n]):
        if ai == 0:
            continue
        for j, bj in enumerate(b[: n - i]):
            out[i + j] += ai * bj
    return out


def ser_inv(a: Sequence[acb], n: int) -> list[acb]:
    """``1/a`` for ``a[0] != 0``."""
    inv0 = 1 / a[0]
    out = [inv0] + [acb(0)] * (n - 1)
    for k in range(1, n):
        s = acb(0)
        for j in range(1, min(k, len(a) - 1) + 1):
            s += a[j] * out[k - j]
        out[k] = -s * inv0
    return out


def ser_exp(a: Sequence[acb], n: int) -> list[acb]:
    """``exp(a)`` (any constant term) by ``E' = a' E``."""
    a = list(a[:n]) + [acb(0)] * max(0, n - len(a))
    out = [a[0].exp()] + [acb(0)] * (n - 1)
    for k in range(1, n):
        s = acb(0)
        for j in range(1, k + 1):
            s += j * a[j] * out[k - j]
        out[k] = s / k
    return out


def ser_sin(c0: acb, c1: acb, n: int) -> list[acb]:
    """Series of ``sin(c0 + c1 w)``."""
    s, c = c0.sin(), c0.cos()
    out = []
    p = acb(1)
    fact = 1
    for k in range(n):
        if k > 0:
            p = p * c1
            fact *= k
        base = (s, c, -s, -c)[k % 4]
        out.append(base * p / fact)
    return out


@lru_cache(maxsize=64)
def bernoulli_plus(n: int) -> tuple[Fraction, ...]:
    """``B_k^+ / k!`` for ``k < n``: the Taylor coefficients of ``x / (1 - e^-x)`` (cached; a tuple,
    so no caller can change the cached value).

    >>> bernoulli_plus(4)
    (Fraction(1, 1), Fraction(1, 2), Fraction(1, 12), Fraction(0, 1))
    """
    B = [Fraction(1)]
    for m in range(1, n):
        B.append(-sum(Fraction(_binom(m + 1, k)) * B[k] for k in range(m)) / (m + 1))
    if n > 1:
        B[1] = Fraction(1, 2)
    out = []
    f = 1
    for k in range(n):
        if k > 0:
            f *= k
        out.append(B[k] / f)
    return tuple(out)


def _binom(n: int, k: int) -> int:
    from math import comb

    return comb(n, k)
