r"""The Gaussian integrals over the rotated Cartan by the trapezoid rule (the second route).

CONVENTIONS §18.2.  For ``u in Q/HQ`` the integral
``int_C exp(-i pi K H |z|^2/P - 2 pi i K <u, z>) G(z) d^r x`` equals
``exp(i pi K P |u|^2/H) int exp(-i pi a |z - z_u|^2) G(z) d^r x`` with ``z_u = -P u/H`` and
``a = K H/P``; ``G`` being entire here, the contour is moved to ``z = z_u + exp(i theta) s``,
``s`` real (coordinates in the fundamental weights), where the Gaussian is
``exp(-pi b s.A^-1.s)`` with ``b = i a exp(2 i theta) > 0``.  The trapezoid rule in each
coordinate converges exponentially (the integrand is entire); step and cut-off come from the
requested digits, and the caller compares two runs with different steps, cut-offs and
precisions.
"""

from __future__ import annotations

import itertools
import math
from fractions import Fraction

import numpy as np
from flint import acb, arb

from knotobs.continuation.cartan.data import B_N, CartanData
from knotobs.continuation.cartan.gaussian import _sym, root_vectors
from knotobs.localisation.lattice import cartan_matrix

__all__ = ["quadrature_plan", "quadrature_sectors"]


def quadrature_plan(d: CartanData, absK: float, digits: int) -> tuple[float, int]:
    """Step ``h`` and half-count ``M`` (nodes ``j h``, ``|j_i| <= M``) for ``digits`` digits.

    >>> h, M = quadrature_plan(CartanData.from_space("S^3", 3), 5.0, 20)
    >>> 0 < h < 0.2 and M > 10
    True
    """
    A = cartan_matrix(d.N).astype(float)
    ev = np.linalg.eigvalsh(np.linalg.inv(A))
    lmin, lmax = float(ev[0]), float(ev[-1])
    b = absK * abs(d.H) / d.P
    pa, pb = d.two_orders()
    T = math.log(10) * (digits + 5) + 10 + d.r * math.log(10)
    grow = math.pi * d.npos * d.r * (1 / pa + 1 / pb)        # |G| <= 4^npos exp(grow |Im s|_inf)
    beta = math.pi * b * lmax * d.r
    dist = math.sqrt(T / beta)
    h = 2 * math.pi * dist / (2 * T + grow * dist + 5)
    # exp(-pi b lmin R^2 + grow R) < 10^-(digits+5)
    g = grow + 1
    R = (g + math.sqrt(g * g + 4 * math.pi * b * lmin * T)) / (2 * math.pi * b * lmin)
    return h, int(math.ceil(R / h))


def quadrature_nodes(d: CartanData, absK: float, digits: int) -> int:
    """Total nodes of one run: ``|H|^r (2M + 1)^r``.

    >>> quadrature_nodes(CartanData.from_space("S^3", 2), 7.0, 15) < 200
    True
    """
    _, M = quadrature_plan(d, absK, digits)
    return abs(d.H) ** d.r * (2 * M + 1) ** d.r


def _f(x: acb, pa: int, pb: int) -> acb:
    """``2i sin(pi x/p_a) 2i sin(pi x/p_b)`` (one positive root's factor of ``G``)."""
    ipi = acb(0, 1) * arb.pi()
    ea, eb = (ipi * x / pa).exp(), (ipi * x / pb).exp()
    return (ea - 1 / ea) * (eb - 1 / eb)


def quadrature_sectors(d: CartanData, K: acb, digits: int, reduced: bool = True) -> dict[Fraction, acb]:
    """``{cs(u) mod 1: contribution}`` by the trapezoid rule (B_N included); the caller sets the
    precision and has checked the size.

    Examples
    --------
    >>> from knotobs.numerics import working_precision
    >>> from knotobs.continuation.cartan.gaussian import gaussian_sectors
    >>> d = CartanData.from_space("S^3", 2)
    >>> with working_precision(25):
    ...     a = quadrature_sectors(d, acb(7, 1), 15)[Fraction(0)]
    ...     b = gaussian_sectors(d, acb(7, 1))[Fraction(0)]
    ...     ok = abs(a - b) < 1e-15
    >>> ok
    True

    References
    ----------
    L. N. Trefethen and J. A. C. Weideman, SIAM Rev. 56 (2014) 385–458 (the exponentially
    convergent trapezoid rule).
    """
    from knotobs.continuation.level import _angle

    N, r, P, H = d.N, d.r, d.P, d.H
    pa, pb = d.two_orders()
    ueit, _ = _angle(d.lr, K)                  # exp(i theta)
    a = K * H / P
    bb = acb(0, 1) * a * ueit * ueit           # b > 0 (up to rounding)
    h, M = quadrature_plan(d, float(abs(K).mid()), digits)
    ha = arb(h)
    Ai = np.linalg.inv(cartan_matrix(N).astype(float))
    NAi = np.rint(N * Ai).astype(np.int64)     # N A^-1 is integral
    # Gaussian exp(-pi b h^2 j.A^-1.j) = g^(j.(N A^-1).j), g = exp(-pi b h^2/N)
    g = (-arb.pi() * bb * ha * ha / N).exp()
    pos = [(i, j) for i in range(N) for j in range(i + 1, N)]
    grid = list(itertools.product(range(-M, M + 1), repeat=r))
    qexp = {}
    for jv in grid:
        v = np.array(jv, dtype=np.int64)
        qexp[jv] = int(v @ NAi @ v)
    gpow = {}
    for q in set(qexp.values()):
        gpow[q] = g ** q
    ipi = acb(0, 1) * arb.pi()
    out: dict[Fraction, acb] = {}
    step = ueit * ha
    for u in root_vectors(N, H):
        tables = []
        for i, j in pos:
            xc = Fraction(-P * (u[i] - u[j]), H)
            base = acb(xc.numerator) / xc.denominator
            span = (j - i) * M
            tables.append({m: _f(base + step * m, pa, pb) for m in range(-span, span + 1)})
        total = acb(0)
        for jv in grid:
            val = gpow[qexp[jv]]
            for (i, j), tab in zip(pos, tables):
                val *= tab[sum(jv[i:j])]
            total += val
        integral = total * step ** r
        cs = Fraction(P * sum(x * x for x in u), 2 * H)
        ph = _sym(cs) if reduced else cs
        val = integral * (2 * ipi * K * ph.numerator / ph.denominator).exp()
        out[cs % 1] = out.get(cs % 1, acb(0)) + val
    B = B_N(d, K)
    return {k: B * v for k, v in out.items()}
