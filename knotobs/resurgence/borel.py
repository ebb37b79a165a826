r"""The Borel transform ``B(zeta)`` in closed form and its predicted singularities (CONVENTIONS §12).

``B(zeta) = P G(sqrt u)/u`` with ``u = -P zeta/H`` and ``G(x) = prod_j sin(x/p_j)/sin(x)^(n-2)``
(:mod:`knotobs.resurgence.series`); it is even in ``sqrt u``, hence single valued.  Its poles sit
at ``zeta_m = -pi^2 H m^2/P = 4 pi^2 cs_m`` for every ``m >= 1`` at which ``G`` has a pole
(pole order ``(n - 2) - #{j : p_j | m}``), and ``cs_m = -H m^2/(4P)`` is the Chern–Simons value
(mod 1) of a non-trivial flat connection: an SU(2) one, or one of the non-unitary (SL(2,R))
ones, which the SU(2) theory at integer level does not see (S. Gukov, M. Mariño and P. Putrov,
arXiv:1605.07615, §3.4 for ``Sigma(2,3,7)``).
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from knotobs.continuation.level import LRData

__all__ = ["PredictedSingularity", "predicted_singularities", "borel_value", "exact_residue"]


@dataclass(frozen=True)
class PredictedSingularity:
    """A pole of ``B`` predicted by a flat connection.

    Attributes
    ----------
    m : int
        ``sqrt u = m pi``.
    cs : Fraction
        Unreduced ``cs_m = -H m^2/(4P)``; ``zeta = 4 pi^2 cs``.
    cs_mod1 : Fraction
    pole_order : int
    connections : tuple
        ``(real form, rotation numbers)`` of the flat SL(2,C) connections with this CS value mod 1.
    """

    m: int
    cs: Fraction
    cs_mod1: Fraction
    pole_order: int
    connections: tuple

    def zeta(self, ctx):
        """``4 pi^2 cs`` in the mpmath context ``ctx``."""
        return 4 * ctx.pi ** 2 * ctx.mpf(self.cs.numerator) / self.cs.denominator


def predicted_singularities(space, count: int = 6) -> list[PredictedSingularity]:
    """The ``count`` poles of ``B`` nearest to the origin, each with its flat connections.

    >>> [(s.m, str(s.cs_mod1), s.connections[0][0]) for s in predicted_singularities("Sigma(2,3,7)", 3)]
    [(1, '167/168', 'SL(2,R)'), (5, '143/168', 'SU(2)'), (11, '47/168', 'SU(2)')]

    References
    ----------
    S. Gukov, M. Mariño and P. Putrov, arXiv:1605.07615; CONVENTIONS §12.
    """
    from knotobs.flat.table import flat_sl2c_connections

    d = space if isinstance(space, LRData) else LRData.from_space(space)
    table = None
    try:
        table = flat_sl2c_connections(d.space)
    except Exception:  # pragma: no cover - the table is guarded separately; singularities stand alone
        table = None
    by_cs: dict[Fraction, list] = {}
    if table is not None:
        for r in table.rows:
            if r.character.kind != "trivial":
                by_cs.setdefault(r.character.cs, []).append((r.character.real_form, r.character.rotation))
    out = []
    m = 0
    if d.n < 3:
        return out                       # G entire: no singularities (lens spaces)
    while len(out) < count and m < 100 * d.P + 10:
        m += 1
        o = d.pole_order(m)
        if o < 1:
            continue
        cs = Fraction(-d.H * m * m, 4 * d.P)
        out.append(PredictedSingularity(m, cs, cs % 1, o, tuple(by_cs.get(cs % 1, ()))))
    return out


def borel_value(d: LRData, zeta, ctx):
    """``B(zeta)`` from the closed form, in the mpmath context ``ctx``."""
    u = -d.P * ctx.mpc(zeta) / d.H
    if u == 0:
        return ctx.mpc(1)
    x = ctx.sqrt(u)
    num = ctx.mpc(1)
    for p in d.ps:
        num *= ctx.sin(x / p)
    m = d.n - 2
    if m:
        num = num / ctx.sin(x) ** m
    return d.P * num / u


def exact_residue(d: LRData, s: PredictedSingularity, ctx):
    """Residue of ``B`` at a simple pole (``None`` for higher order), from the closed form.

    The symmetric difference ``[delta B(zeta + delta) + delta B(zeta - delta)]/2`` removes the
    first correction, so with ``delta = 10^(-dps/3)`` the result has about ``2 dps/3`` digits.
    """
    if s.pole_order != 1:
        return None
    z = s.zeta(ctx)
    delta = ctx.mpf(10) ** (-(ctx.dps // 3)) * max(1, abs(z))
    return (delta * borel_value(d, z + delta, ctx) - delta * borel_value(d, z - delta, ctx)) / 2
