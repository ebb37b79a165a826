r"""Locating the singularities of a Borel transform from its Taylor coefficients (Padé, ratio test).

Diagonal Padé approximants ``[L/L]`` of ``B(zeta) = sum_k b_k zeta^k`` from the exact coefficients
are computed in a private mpmath context (:func:`knotobs.numerics.local_mp`) at a precision well
above the number of digits wanted (the linear algebra loses digits); their poles that are stable
between two orders approximate the poles of ``B``, with the residues ``p(zeta*)/q'(zeta*)``.  The
ratio test ``b_k/b_(k+1) -> zeta_1`` (with Richardson extrapolation, ``b_k ~ R zeta_1^(-k-1)``)
gives the nearest singularity independently.
(G. A. Baker and P. Graves-Morris, Padé Approximants, 2nd ed., CUP 1996; C. M. Bender and
S. A. Orszag, Advanced Mathematical Methods for Scientists and Engineers, 1978, §8.)
"""

from __future__ import annotations

from dataclasses import dataclass

__all__ = ["PadePole", "pade_poles", "pade_pole_near", "pade_approximant", "ratio_test"]


@dataclass(frozen=True)
class PadePole:
    """A pole of the Padé approximant: position, residue, and agreement with the next lower order."""

    zeta: object
    residue: object
    stability: object          # |zeta(L) - zeta(L-2)|


def _pade(b, L, ctx, scale):
    """Padé of ``B(scale * w)`` (coefficients ``b_k scale^k`` are of order one)."""
    coeffs = [ctx.mpf(x.numerator) / x.denominator * scale ** k for k, x in enumerate(b[: 2 * L + 1])]
    p, q = ctx.pade(coeffs, L, L)
    return p, q


def _poles(p, q, ctx):
    roots = ctx.polyroots(list(reversed(q)), maxsteps=200, extraprec=ctx.prec // 2, error=False)
    dq = [k * q[k] for k in range(1, len(q))]
    out = []
    for r in roots:
        num = ctx.polyval(list(reversed(p)), r)
        den = ctx.polyval(list(reversed(dq)), r)
        out.append((r, num / den))
    return out


def pade_poles(b, ctx, L: int | None = None) -> list[PadePole]:
    """Poles of the ``[L/L]`` Padé approximant, nearest first, with stability against ``[L-2/L-2]``.

    ``b`` are the exact coefficients (Fractions), at least ``2L + 1`` of them.

    >>> from knotobs.numerics import local_mp
    >>> from fractions import Fraction
    >>> ctx = local_mp(40)
    >>> poles = pade_poles([Fraction(1, 2 ** k) for k in range(9)], ctx, L=1)     # 1/(1 - zeta/2)
    >>> ctx.nstr(poles[0].zeta.real, 10)
    '2.0'
    """
    if L is None:
        L = (len(b) - 1) // 2
    # rescale by the ratio-test radius so that the linear algebra is well conditioned
    scale = abs(ratio_test(b[: 2 * L + 1], ctx)) if 2 * L + 1 > 8 else ctx.mpf(1)
    p, q = _pade(b, L, ctx, scale)
    hi = _poles(p, q, ctx)
    lo = _poles(*_pade(b, L - 2, ctx, scale), ctx) if L > 3 else []
    out = []
    for r, res in hi:
        stab = min((abs(r - s) for s, _ in lo), default=ctx.inf) * scale
        out.append(PadePole(r * scale, res * scale, stab))
    out.sort(key=lambda x: abs(x.zeta))
    return out


def pade_approximant(b, ctx, L: int | None = None):
    """``(p, q, scale)``: the ``[L/L]`` Padé approximant ``p(w)/q(w)`` of ``B(scale * w)``."""
    if L is None:
        L = (len(b) - 1) // 2
    scale = abs(ratio_test(b[: 2 * L + 1], ctx)) if 2 * L + 1 > 8 else ctx.mpf(1)
    p, q = _pade(b, L, ctx, scale)
    return p, q, scale


def pade_pole_near(approx, z0, ctx) -> PadePole:
    """The zero of the Padé denominator reached by Newton's method from ``z0`` (a pole of ``p/q``).

    Only the root is searched near ``z0``; its position is a property of the approximant alone.
    The residue is ``p/q'`` there; ``stability`` is ``|q(zeta)|`` after the iteration.

    >>> from knotobs.numerics import local_mp
    >>> from fractions import Fraction
    >>> ctx = local_mp(40)
    >>> P = pade_pole_near(pade_approximant([Fraction(1, 2 ** k) for k in range(9)], ctx, L=1), 1.9, ctx)
    >>> ctx.nstr(P.zeta.real, 10), ctx.nstr(P.residue.real, 10)
    ('2.0', '-2.0')
    """
    p, q, scale = approx
    rq = list(reversed(q))
    dq = list(reversed([k * q[k] for k in range(1, len(q))]))
    w = ctx.mpc(z0) / scale
    for _ in range(200):
        step = ctx.polyval(rq, w) / ctx.polyval(dq, w)
        w -= step
        if abs(step) < ctx.mpf(10) ** (-ctx.dps + 3) * max(1, abs(w)):
            break
    res = ctx.polyval(list(reversed(p)), w) / ctx.polyval(dq, w)
    return PadePole(w * scale, res * scale, abs(ctx.polyval(rq, w)))


def ratio_test(b, ctx, terms: int = 4):
    """Nearest singularity ``zeta_1`` from ``b_k/b_(k+1)`` with Richardson extrapolation in ``1/k``.

    >>> from knotobs.numerics import local_mp
    >>> from fractions import Fraction
    >>> ctx = local_mp(30)
    >>> b = [Fraction(k + 1, 3 ** k) for k in range(40)]                     # (1 - zeta/3)^-2
    >>> abs(ratio_test(b, ctx) - 3) < 1e-4
    True
    """
    N = len(b) - 1
    r = []
    ks = list(range(N - terms, N))
    for k in ks:
        r.append(ctx.mpf(b[k].numerator) / b[k].denominator / (ctx.mpf(b[k + 1].numerator) / b[k + 1].denominator))
    # Richardson: r_k = z (1 + c_1/k + c_2/k^2 + ...); fit polynomial in 1/k through the points
    xs = [ctx.mpf(1) / k for k in ks]
    # Neville extrapolation to x = 0
    P = list(r)
    n = len(P)
    for j in range(1, n):
        for i in range(n - 1, j - 1, -1):
            P[i] = (xs[i - j] * P[i] - xs[i] * P[i - 1]) / (xs[i - j] - xs[i])
    return P[-1]
