r"""Holomorphic blocks of the isolated flat connections from the Stokes data of the Borel plane.

For a three-fibre Seifert manifold every isolated irreducible flat connection ``alpha`` is one-loop
exact: its block is

    ``Z_alpha(K) = -S_m exp(2 pi i K cs_alpha) q^(-phi/4)``,   ``q = exp(2 pi i/K)``,

with ``S_m`` the Stokes constant of the nearest pole ``zeta_m`` of the Borel transform with
``cs_m = cs_alpha mod 1`` (:mod:`knotobs.resurgence.resummation`; ``cs_alpha`` taken in
``(-1/2, 1/2]``).  For the SU(2) connections this is exactly the sector of the Lawrence–Rozansky
decomposition (:func:`knotobs.continuation.level.sector_values`; the tests check it), which fixes
the sign; for the SL(2,R) connections it is the same formula, i.e. the block of the critical point
that the SU(2) contour at integer level does not pick up (S. Gukov, M. Mariño and P. Putrov,
arXiv:1605.07615; CONVENTIONS §12).
"""

from __future__ import annotations

from fractions import Fraction

from knotobs.continuation.level import LRData
from knotobs.numerics import local_mp
from knotobs.resurgence.borel import exact_residue, predicted_singularities
from knotobs.resurgence.resummation import stokes_constant

__all__ = ["isolated_block", "stokes_amplitude"]


def _sym(x: Fraction) -> Fraction:
    y = x % 1
    return y - 1 if y > Fraction(1, 2) else y


def stokes_amplitude(d: LRData, cs: Fraction, digits: int):
    """``-S_m`` for the nearest Borel pole with ``cs_m = cs mod 1`` (an mpmath ``mpc`` of its own context)."""
    for s in predicted_singularities(d, 4 * d.P + 4):
        if s.cs_mod1 == cs % 1 and s.pole_order == 1:
            ctx = local_mp(digits + 10)
            res = exact_residue(d, s, local_mp(3 * digits + 30))
            return -stokes_constant(d, s.zeta(ctx), ctx.mpc(res), ctx)
    return None


def isolated_block(space, cs: Fraction, K, digits: int = 30, amplitude=None):
    """``Z_alpha(K)`` of the isolated connection with Chern–Simons value ``cs`` (complex ``K`` allowed).

    >>> from fractions import Fraction
    >>> from knotobs.continuation.level import sector_values
    >>> z = isolated_block("Sigma(2,3,7)", Fraction(143, 168), 9, digits=20)
    >>> abs(z - sector_values("Sigma(2,3,7)", 9, digits=20)[Fraction(143, 168)]) < 1e-18
    True
    """
    d = space if isinstance(space, LRData) else LRData.from_space(space)
    A = amplitude if amplitude is not None else stokes_amplitude(d, cs, digits)
    if A is None:
        return None
    ctx = local_mp(digits + 10)
    Kc = ctx.mpc(K)
    c = _sym(Fraction(cs))
    ph = ctx.mpf(d.phi.numerator) / d.phi.denominator
    val = ctx.mpc(A) * ctx.exp(2j * ctx.pi * Kc * ctx.mpf(c.numerator) / c.denominator) * ctx.exp(-2j * ctx.pi * ph / (4 * Kc))
    return val
