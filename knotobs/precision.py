"""Requested precision: the accepted range of ``digits`` and printing only certified digits.

A numeric value in knotobs comes with a certified error bound (CONVENTIONS §16): the
value was computed twice, independently and at different precisions, and the two
agree to within ``10^-digits * max(|z|, 1)``.  :func:`certified_str` prints exactly
the decimal places that bound covers: each component of a complex number is rounded
to the bound's decimal position, so a component (or a whole value) below the bound
prints as ``0``.

Examples
--------
>>> import mpmath
>>> check_digits(30)
30
>>> certified_str(mpmath.mpc("1.27e-49", "-2.92e-49"), 15)
'0.0'
>>> certified_str(mpmath.mpc("-1.070033218316912345", "0.3581273346247381"), 10)
'(-1.070033218 + 0.358127335j)'
"""

from __future__ import annotations

import math
import numbers

import mpmath

from knotobs.errors import ParseError

__all__ = ["MAX_DIGITS", "check_digits", "certified_str", "certified_parts", "significant_parts", "joined_parts"]

#: Largest number of decimal digits accepted for a numeric value.
MAX_DIGITS = 2000


def check_digits(digits, name: str = "digits", low: int = 1, high: int = MAX_DIGITS) -> int:
    """``digits`` as an int in ``[low, high]``, or a :class:`ParseError` naming the valid range.

    >>> check_digits(0, "--digits")
    Traceback (most recent call last):
    ...
    knotobs.errors.ParseError: --digits 0 is out of range: give an integer from 1 to 2000 (correct significant digits of the numeric value)
    """
    if isinstance(digits, bool) or not isinstance(digits, numbers.Integral):
        raise ParseError(f"{name} {digits!r} is not an integer: give an integer from {low} to {high}")
    d = int(digits)
    if not low <= d <= high:
        raise ParseError(f"{name} {d} is out of range: give an integer from {low} to {high}"
                         " (correct significant digits of the numeric value)")
    return d


def _decimal_places(z, digits: int) -> int:
    """Decimal places covered by the bound ``10^-digits * max(|z|, 1)``."""
    mag = abs(z)
    if mag < 1:
        return digits                      # absolute bound 10^-digits
    return digits - 1 - int(math.floor(float(mpmath.log10(mag))))   # ``digits`` significant digits


def _fixed(x, places: int) -> str:
    """``x`` rounded to ``places`` decimal places (negative: to tens, hundreds, ...)."""
    from knotobs.numerics import local_mp

    if not isinstance(x, mpmath.mpf):
        x = mpmath.mpf(x)
    top = 0 if x == 0 else int(mpmath.floor(mpmath.log10(abs(x))))
    if places < 0:
        # the certified digits end before the decimal point: scientific notation, so that no
        # uncertified zeros are printed (``3.359616e+143``, not ``3359616000...``).  The quotient
        # has ``top + places + 1`` digits: that many and a margin suffice (the precision must not
        # grow with the exponent: ``|x| ~ 10^(10^6)`` at continued levels far from the real axis)
        ctx = local_mp(max(top + places + 25, int(_bits(x) / 3.32) + 10))
        q = int(ctx.nint(ctx.mpf(x) / ctx.mpf(10) ** (-places)))
        if q == 0:
            return "0.0"
        sign = "-" if q < 0 else ""
        d = str(abs(q))
        exp = len(d) - 1 - places
        mant = d[0] + ("." + d[1:].rstrip("0") if d[1:].rstrip("0") else ".0")
        return f"{sign}{mant}e+{exp}"
    # enough digits for the requested places and for every bit of x (no rounding on the way in)
    ctx = local_mp(max(max(top, 0) + places + 20, int(_bits(x) / 3.32) + 10))
    n = int(ctx.nint(ctx.mpf(x) * ctx.mpf(10) ** places))
    if n == 0:
        return "0.0"
    sign = "-" if n < 0 else ""
    s = str(abs(n)).rjust(places + 1, "0")
    head, tail = s[: len(s) - places], s[len(s) - places:]
    tail = tail.rstrip("0")
    return f"{sign}{head}.{tail}" if tail else f"{sign}{head}.0"


def _parts(z) -> tuple:
    """``(re, im)`` of ``z`` without rounding: mpmath numbers keep every bit they carry (a plain
    ``mpmath.mpc(z)`` would round them to the caller's working precision, often 53 bits)."""
    if isinstance(z, mpmath.mpc):
        return z.real, z.imag
    if isinstance(z, mpmath.mpf):
        return z, mpmath.mpf(0)
    if isinstance(z, complex):
        return mpmath.mpf(z.real), mpmath.mpf(z.imag)
    w = mpmath.mpmathify(z)
    return (w.real, w.imag) if isinstance(w, mpmath.mpc) else (w, mpmath.mpf(0))


def _bits(x) -> int:
    """Bits of the mantissa of an mpmath real (53 for anything else)."""
    return x._mpf_[3] if isinstance(x, mpmath.mpf) else 53


def certified_parts(z, digits: int) -> tuple[str, str]:
    """Real and imaginary parts of ``z`` as decimal strings, certified digits only.

    Every bit of ``z`` is used, whatever the precision of the caller:

    >>> from knotobs.numerics import working_precision
    >>> with working_precision(40):
    ...     third = mpmath.mpf(1) / 3
    >>> certified_parts(third, 30)[0]
    '0.333333333333333333333333333333'
    """
    re_, im_ = _parts(z)
    places = _decimal_places(mpmath.mpc(re_, im_), digits)
    return _fixed(re_, places), _fixed(im_, places)


def certified_str(z, digits: int) -> str:
    """``z`` with only the decimal places its bound ``10^-digits * max(|z|, 1)`` certifies.

    >>> certified_str(mpmath.mpf(2) / 3, 5)
    '0.66667'
    >>> certified_str(mpmath.mpc(0, 1) / 3, 5)
    '0.33333j'
    >>> certified_str(mpmath.mpf(2) ** 100, 5)      # digits end before the point: no fake zeros
    '1.2677e+30'
    """
    return joined_parts(*certified_parts(z, digits))


def significant_parts(z, digits: int) -> tuple[str, str]:
    """Real and imaginary parts of an exactly known ``z`` to ``digits`` significant digits each; a
    part below ``10^-digits |z|`` (rounding of the other, e.g. the imaginary part of a real value) is
    ``"0.0"``.

    >>> significant_parts(mpmath.mpc(2, 1e-40) / 3, 5)
    ('0.66667', '0.0')
    >>> significant_parts(mpmath.mpc(-4.2329155e-5, 5.3e-5), 4)
    ('-4.233e-5', '5.3e-5')
    """
    # the parts keep their own precision (no conversion at the process precision)
    parts = (z.real, z.imag) if hasattr(z, "imag") else (z, 0)
    with mpmath.workdps(20):
        size = mpmath.sqrt(sum(mpmath.mpf(abs(p)) ** 2 for p in parts))
        small = [p == 0 or mpmath.mpf(abs(p)) < mpmath.mpf(10) ** (-digits) * size for p in parts]
    out = []
    for part, tiny in zip(parts, small):
        out.append("0.0" if tiny else mpmath.nstr(part, digits))
    return out[0], out[1]


def joined_parts(re_: str, im_: str) -> str:
    """``re``, ``im`` strings as one complex number, a zero part left out.

    >>> joined_parts("1.5", "-0.25"), joined_parts("0.0", "2.0"), joined_parts("3.0", "0.0")
    ('(1.5 - 0.25j)', '2.0j', '3.0')
    """
    if im_ in ("0.0", "-0.0", "0"):
        return re_
    if re_ in ("0.0", "-0.0", "0"):
        return f"{im_}j"
    sign = "-" if im_.startswith("-") else "+"
    return f"({re_} {sign} {im_.lstrip('-')}j)"
