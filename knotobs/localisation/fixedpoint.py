"""Certified evaluation of many integer combinations of roots of unity at once.

Each fiber factor of the localisation sum is, for every weight, an integer combination
``sum_t w_t zeta_M^(e_t)``.  Instead of one ball operation per term, the powers
``zeta_M^j`` are tabulated once as fixed-point integers (scale ``2^S``, ``S`` a multiple of
30, each entry rounded from a ball of higher precision, so its error is at most one unit
``2^-S``), split into 30-bit limbs, and all sums are accumulated exactly in numpy ``int64``
(sorted by weight, ``np.add.reduceat``).  The result for each weight is a ball whose radius
is the rigorous bound ``(3 sum_t |w_t| + 1) 2^-S`` of the table rounding (common practice of
fixed-point error analysis, e.g. N. J. Higham, *Accuracy and Stability of Numerical
Algorithms*, 2nd ed., SIAM 2002, ch. 2).
"""

from __future__ import annotations

import math

import numpy as np
from flint import acb, arb, fmpq, fmpz

from knotobs.numerics import working_precision

__all__ = ["root_sums", "LIMB"]

#: Bits per limb.
LIMB = 30
_MASK = (1 << LIMB) - 1


def _table(M: int, S: int) -> tuple[list[np.ndarray], list[np.ndarray]]:
    """Limbs of ``2^S (cos + 2)`` and ``2^S (sin + 2)`` of ``2 pi j/M`` (non-negative integers).

    Up to ``SMALL`` entries each value is rounded from a ball; above, ``zeta^j`` is the
    fixed-point product of a giant step ``zeta^(qB)`` and a baby step ``zeta^r`` (both rounded
    from balls), so every entry is within 3 units of ``2^-S`` (see :func:`root_sums`).
    """
    L = S // LIMB + 1
    one = 1 << S
    scale = arb(2) ** S

    def fixed(j: int, m: int) -> tuple[int, int]:
        z = acb(arb(fmpq(2 * j, m))).exp_pi_i()
        return (int((z.real * scale).mid().floor().unique_fmpz()),
                int((z.imag * scale).mid().floor().unique_fmpz()))

    with working_precision(int((S + 40) / 3.32) + 5):
        if M <= SMALL:
            vals = [fixed(j, M) for j in range(M)]
            re = np.array([c for c, _ in vals], dtype=object)
            im = np.array([s for _, s in vals], dtype=object)
        else:
            B = math.isqrt(M) + 1
            baby = [fixed(j, M) for j in range(B)]
            giant = [fixed(q * B % M, M) for q in range(M // B + 1)]
            bc = np.array([c for c, _ in baby], dtype=object)
            bs = np.array([s for _, s in baby], dtype=object)
            gc = np.array([c for c, _ in giant], dtype=object)
            gs = np.array([s for _, s in giant], dtype=object)
            # zeta^(qB + r) = zeta^(qB) zeta^r in fixed point (object arrays: exact Python integers)
            re = ((np.multiply.outer(gc, bc) - np.multiply.outer(gs, bs)) >> S).ravel()[:M]
            im = ((np.multiply.outer(gc, bs) + np.multiply.outer(gs, bc)) >> S).ravel()[:M]
    # offset 2^(S+1) keeps every entry non-negative (products may overshoot +-1 by a few units)
    re = re + 2 * one
    im = im + 2 * one
    re_l = [((re >> (LIMB * t)) & _MASK).astype(np.int64) for t in range(L)]
    im_l = [((im >> (LIMB * t)) & _MASK).astype(np.int64) for t in range(L)]
    return re_l, im_l


#: Largest table computed entry by entry from balls (one exponential each, ~6 us at 150 bits);
#: above it the giant/baby steps take ``2 sqrt(M)`` exponentials and integer products, about
#: four times faster at ``M = 2580`` (SU(3), level 40 on Σ(2,3,5)).
SMALL = 64


_CACHE: dict = {}


def _cached_table(M: int, S: int):
    key = (M, S)
    if key not in _CACHE:
        if len(_CACHE) > 16:
            _CACHE.clear()
        _CACHE[key] = _table(M, S)
    return _CACHE[key]


def root_sums(rows: np.ndarray, exps: np.ndarray, weights: np.ndarray, n_rows: int, M: int,
              bits: int) -> list[acb]:
    """Balls ``F[l] = sum_{t : rows_t = l} weights_t exp(2 pi i exps_t / M)``, ``l < n_rows``.

    ``bits`` is the wanted absolute accuracy (the radius is below about ``2^-bits`` times
    ``sum |w|``).

    >>> import numpy as np
    >>> F = root_sums(np.array([0, 0, 1]), np.array([0, 2, 1]), np.array([1, 1, 3]), 2, 4, 60)
    >>> abs(complex(F[0])) < 1e-15, abs(complex(F[1]) - 3j) < 1e-15
    (True, True)
    """
    S = LIMB * ((bits + LIMB - 1) // LIMB + 1)
    re_l, im_l = _cached_table(M, S)
    order = np.argsort(rows, kind="stable")
    r = rows[order]
    e = exps[order] % M
    w = weights[order].astype(np.int64)
    starts = np.searchsorted(r, np.arange(n_rows))
    present = np.bincount(r, minlength=n_rows) > 0

    def red(v):
        out = np.zeros(n_rows, dtype=object)
        if len(v) == 0:
            return out
        s = np.add.reduceat(v, np.minimum(starts, len(v) - 1))
        s = np.where(present, s, 0)
        return s

    wsum = red(w)
    wabs = red(np.abs(w))
    re_acc = [red(w * re_l[t][e]) for t in range(len(re_l))]
    im_acc = [red(w * im_l[t][e]) for t in range(len(im_l))]
    one = 2 << S

    def join(acc):
        # the limbs put together row by row, as exact Python integers (object arrays)
        tot = np.zeros(n_rows, dtype=object)
        for t, a in enumerate(acc):
            tot = tot + (a.astype(object) << (LIMB * t))
        return (tot - wsum.astype(object) * one).tolist()

    Rs, Is, errs = join(re_acc), join(im_acc), (3 * wabs.astype(object) + 1).tolist()
    out = []
    unit = arb(2) ** (-S)
    for l, p in enumerate(present.tolist()):
        if not p:
            out.append(acb(0))
            continue
        err = arb(0, arb(errs[l]) * unit)
        out.append(acb(arb(fmpz(Rs[l])) * unit + err, arb(fmpz(Is[l])) * unit + err))
    return out
