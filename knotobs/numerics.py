"""Working precision without shared state: the one place numeric precision is set.

mpmath's ``mp`` context and python-flint's ``ctx`` are process-global: a
computation that changes them from one thread changes them for every other
thread.  knotobs therefore never calls ``mpmath.workdps`` or assigns
``flint.ctx.prec`` directly.  Numeric code does one of two things:

* :func:`local_mp` gives a fresh ``mpmath.MPContext`` of its own precision; code that
  uses its methods (``ctx.mpf``, ``ctx.exp``, ``ctx.quad``, ...) shares nothing;
* :func:`working_precision` sets both global precisions for the length of a
  ``with`` block while holding one process-wide re-entrant lock, so no two threads
  ever compute with each other's precision (python-flint balls have no per-call
  precision).  Results are then the same from any number of threads.

Guard digits are added by the caller (see ``knotobs.continuation._num.bits``).

Examples
--------
>>> from knotobs.numerics import local_mp, working_precision
>>> ctx = local_mp(40)
>>> ctx.nstr(ctx.pi, 20)
'3.1415926535897932385'
>>> import mpmath
>>> with working_precision(50):
...     mpmath.mp.dps
50
"""

from __future__ import annotations

import threading
from contextlib import contextmanager
from typing import Iterator

import mpmath

__all__ = ["local_mp", "working_precision", "NUMERIC_LOCK", "digits_to_bits"]

#: Held while the process-global precisions of mpmath and python-flint are changed.
NUMERIC_LOCK = threading.RLock()


def digits_to_bits(digits: int) -> int:
    """Binary digits that carry ``digits`` decimal digits (no guard digits added).

    >>> digits_to_bits(15)
    50
    """
    return int(digits * 3.3219280948873626) + 1


def local_mp(dps: int) -> "mpmath.ctx_mp.MPContext":
    """A new mpmath context with ``dps`` decimal digits, shared with nobody.

    >>> local_mp(25).dps
    25
    """
    ctx = mpmath.MPContext()
    ctx.dps = int(dps)
    return ctx


@contextmanager
def working_precision(dps: int | None = None, *, bits: int | None = None) -> Iterator[None]:
    """Set mpmath's and python-flint's global precision to ``dps`` digits (or ``bits`` bits), under the lock.

    Re-entrant: nested blocks in the same thread work and restore the outer precision.

    >>> from flint import ctx
    >>> with working_precision(bits=200):
    ...     ctx.prec
    200
    """
    from flint import ctx as flint_ctx

    if (dps is None) == (bits is None):
        raise TypeError("give exactly one of dps and bits")
    with NUMERIC_LOCK:
        old_mp = mpmath.mp.prec
        old_fl = flint_ctx.prec
        try:
            if bits is not None:
                mpmath.mp.prec = int(bits)
                flint_ctx.prec = int(bits)
            else:
                mpmath.mp.dps = int(dps)
                flint_ctx.dps = int(dps)
            yield
        finally:
            mpmath.mp.prec = old_mp
            flint_ctx.prec = old_fl
