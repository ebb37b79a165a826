r"""Borel–Laplace resummation of the trivial-connection series and its Stokes jumps (CONVENTIONS §12).

With ``h = 2 pi i/K`` and ``B`` the Borel transform of :mod:`knotobs.resurgence.series`,

    ``S[Phi](h) = (1/Gamma(3/2)) int_0^infinity exp(-t) t^(1/2) B(h t) dt``

(the ray ``arg zeta = arg h``; for real ``K > 0`` it is the positive imaginary axis, which no pole
of ``B`` meets when ``H != 0``), and the trivial connection's sector of the partition function is

    ``Z_0(K) = Z(S^3) |H|^(-3/2) E(h) S[Phi](h)``,  ``Z(S^3) = sqrt(2/K) sin(pi/K)``,
    ``E(h) = exp(-phi h/4) (h/2)/sinh(h/2)``.

Crossing a pole ``zeta_m`` of ``B`` changes ``S[Phi]`` by ``2 pi i h^(-3/2) zeta_m^(1/2) Res_m/Gamma(3/2)
exp(-zeta_m/h)``, i.e. ``Z_0`` jumps by ``exp(2 pi i K cs_m)`` times

    ``S_m(K) = Z(S^3) |H|^(-3/2) E(h) h^(-3/2) 2 pi i zeta_m^(1/2) Res_m/Gamma(3/2)``,

whose large-``K`` limit ``S_m = |H|^(-3/2) sqrt 2 pi (2 pi i)^(-3/2) 2 pi i zeta_m^(1/2) Res_m/Gamma(3/2)``
is the Stokes constant reported here (``zeta_m^(1/2) = i pi m sqrt(H/P)`` for ``H > 0``).  The tests check
``|S_m| = sqrt(tau_alpha)`` for the flat connection ``alpha`` with ``cs(alpha) = cs_m mod 1``, SU(2)
and SL(2,R) alike (the statement of S. Gukov, M. Mariño and P. Putrov, arXiv:1605.07615, and
J. E. Andersen and W. E. Mistegård, arXiv:1811.05376, that the Borel singularities of the trivial
series carry the one-loop data of the other flat connections).
"""

from __future__ import annotations

from knotobs.continuation.level import LRData
from knotobs.resurgence.borel import borel_value

__all__ = ["laplace_closed_form", "laplace_pade", "trivial_sector", "stokes_constant"]


def _E(d: LRData, h, ctx):
    ph = ctx.mpf(d.phi.numerator) / d.phi.denominator
    return ctx.exp(-ph * h / 4) * (h / 2) / ctx.sinh(h / 2)


def _prefactor(d: LRData, K, ctx):
    h = 2j * ctx.pi / K
    zs3 = ctx.sqrt(2 / ctx.mpc(K)) * ctx.sin(ctx.pi / K)
    return zs3 * ctx.power(abs(d.H), ctx.mpf(-3) / 2) * _E(d, h, ctx)


def laplace_closed_form(d: LRData, K, ctx):
    """``S[Phi](h)`` at ``h = 2 pi i/K`` from the closed-form Borel transform (tanh–sinh quadrature)."""
    h = 2j * ctx.pi / ctx.mpc(K)
    f = lambda t: ctx.exp(-t) * ctx.sqrt(t) * borel_value(d, h * t, ctx)
    return ctx.quad(f, [0, 1, 4, 16, ctx.inf]) / ctx.gamma(ctx.mpf(3) / 2)


def laplace_pade(p, q, scale, K, ctx):
    """``S[Phi](h)`` with ``B`` replaced by a Padé approximant ``p/q`` of ``B(scale * w)``."""
    h = 2j * ctx.pi / ctx.mpc(K)
    rp, rq = list(reversed(p)), list(reversed(q))
    f = lambda t: ctx.exp(-t) * ctx.sqrt(t) * ctx.polyval(rp, h * t / scale) / ctx.polyval(rq, h * t / scale)
    return ctx.quad(f, [0, 1, 4, 16, ctx.inf]) / ctx.gamma(ctx.mpf(3) / 2)


def trivial_sector(d: LRData, K, ctx, pade=None):
    """``Z_0(K)``: the resummed trivial sector (closed-form ``B``, or ``pade = (p, q, scale)``).

    >>> from knotobs.numerics import local_mp
    >>> from knotobs.continuation.level import sector_values
    >>> from fractions import Fraction
    >>> ctx = local_mp(25)
    >>> z = trivial_sector(LRData.from_space("Sigma(2,3,5)"), 8, ctx)
    >>> abs(z - ctx.mpc(sector_values("Sigma(2,3,5)", 8, digits=20)[Fraction(0)])) < 1e-18
    True

    References
    ----------
    S. Gukov, M. Mariño and P. Putrov, arXiv:1605.07615; CONVENTIONS §12.
    """
    S = laplace_closed_form(d, K, ctx) if pade is None else laplace_pade(*pade, K, ctx)
    return _prefactor(d, K, ctx) * S


def stokes_constant(d: LRData, zeta_m, residue, ctx):
    """Large-``K`` Stokes constant ``S_m`` of the pole ``zeta_m`` with residue ``residue``.

    >>> from knotobs.numerics import local_mp
    >>> from knotobs.resurgence.borel import exact_residue, predicted_singularities
    >>> ctx = local_mp(30)
    >>> d = LRData.from_space("Sigma(2,3,5)")
    >>> s = predicted_singularities(d, 1)[0]
    >>> S = stokes_constant(d, s.zeta(ctx), exact_residue(d, s, local_mp(90)), ctx)
    >>> abs(abs(S) - ctx.sqrt(ctx.mpf(2) / 5) * ctx.sin(ctx.pi / 5)) < 1e-25     # sqrt(torsion)
    True

    References
    ----------
    J. E. Andersen and W. E. Mistegård, arXiv:1811.05376; CONVENTIONS §12.
    """
    root = ctx.sqrt(ctx.mpc(zeta_m))
    if ctx.im(root) < 0:
        root = -root
    jump = 2j * ctx.pi * root * residue / ctx.gamma(ctx.mpf(3) / 2)
    return ctx.power(abs(d.H), ctx.mpf(-3) / 2) * ctx.sqrt(2) * ctx.pi * ctx.power(2j * ctx.pi, ctx.mpf(-3) / 2) * jump
