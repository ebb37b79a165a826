r"""Kashaev invariant of torus knots and its ``N^(3/2)`` growth.

The Kashaev invariant is the normalised coloured Jones polynomial with colour
``N`` (the ``N``-dimensional representation of SU(2)) evaluated at the ``N``-th
root of unity (H. Murakami and J. Murakami, Acta Math. 186 (2001) 85–104):

    ``<K>_N = J_N(K; t = exp(2 pi i/N))``,

with ``J_N`` from :func:`knotobs.evaluation.families.colored_jones` (variable ``t = q^-1``,
``J_2 = V``, ``V(T(2,3)) = t + t^3 - t^4``).  Evaluating at ``t = exp(-2 pi i/N)`` instead
gives the complex conjugate.  For torus knots ``|<T(p,q)>_N|`` grows like
``N^(3/2)`` (R. Kashaev and O. Tirkkonen, Zap. Nauchn. Sem. POMI 269 (2000)
262–268; K. Hikami, Commun. Math. Phys. 246 (2004)); :func:`growth_exponent`
measures the exponent from the exact values.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import mpmath

from knotobs.numerics import working_precision

from knotobs.errors import InvalidRepresentationError, SizeLimitError
from knotobs.evaluation.families import colored_jones

__all__ = ["kashaev_invariant", "growth_exponent", "KashaevGrowth", "MAX_COLOUR"]

#: Largest colour accepted.
MAX_COLOUR = 400


def kashaev_invariant(knot, N: int, digits: int = 30) -> mpmath.mpc:
    """``<K>_N = J_N(K; t = exp(2 pi i/N))`` for a torus knot.

    Parameters
    ----------
    knot : str or TorusLink
        E.g. ``"T(2,3)"``.
    N : int
        Colour (dimension of the SU(2) representation), ``N >= 2``.
    digits : int

    Examples
    --------
    >>> v = kashaev_invariant("T(2,3)", 5, 20)
    >>> mpmath.nstr(abs(v), 12)
    '11.838323278'

    References
    ----------
    R. M. Kashaev, Lett. Math. Phys. 39 (1997) 269–275; H. Murakami and J. Murakami,
    Acta Math. 186 (2001) 85–104.
    """
    if not isinstance(N, int) or isinstance(N, bool) or N < 2:
        raise InvalidRepresentationError(f"colour N = {N!r} must be an integer >= 2")
    if N > MAX_COLOUR:
        raise SizeLimitError(f"colour N = {N} is above the limit {MAX_COLOUR}")
    J = colored_jones(knot, N).value
    v1 = J.at_root_of_unity(N, dps=digits + 5)
    v2 = J.at_root_of_unity(N, dps=digits + 15)
    with working_precision(digits + 5):
        if abs(v1 - v2) > mpmath.mpf(10) ** (-digits) * max(abs(v2), 1):  # pragma: no cover
            raise SizeLimitError("Kashaev invariant not stable at the requested precision")
    with working_precision(digits):
        return +mpmath.mpc(v2)


@dataclass(frozen=True)
class KashaevGrowth:
    """Exact values ``|<K>_N|`` and the fitted exponent ``a`` in ``|<K>_N| ~ C N^a``."""

    knot: str
    Ns: tuple[int, ...]
    values: tuple[mpmath.mpc, ...]
    exponent: float
    constant: float


def growth_exponent(knot, Ns) -> KashaevGrowth:
    """Least-squares fit of ``log |<K>_N|`` against ``log N``.

    The amplitude of the ``N^(3/2)`` term depends on ``N`` through phases
    ``exp(-pi i N j^2/(2pq))`` (Kashaev–Tirkkonen), periodic with a period dividing ``4pq``
    (``2pq`` suffices for T(2,3) and T(2,5), T(3,4) needs 48), so choose the colours in one
    residue class modulo ``4pq``.

    >>> g = growth_exponent("T(2,3)", [25, 37, 49, 61])
    >>> abs(g.exponent - 1.5) < 0.05
    True

    References
    ----------
    Kashaev & Tirkkonen, Zap. Nauchn. Sem. POMI 269 (2000) 262–268.
    """
    Ns = tuple(int(n) for n in Ns)
    if len(Ns) < 2:
        raise SizeLimitError("growth_exponent needs at least two colours")
    vals = tuple(kashaev_invariant(knot, n, 20) for n in Ns)
    xs = [math.log(n) for n in Ns]
    ys = [float(mpmath.log(abs(v))) for v in vals]
    mx, my = sum(xs) / len(xs), sum(ys) / len(ys)
    a = sum((x - mx) * (y - my) for x, y in zip(xs, ys)) / sum((x - mx) ** 2 for x in xs)
    return KashaevGrowth(str(knot), Ns, vals, a, math.exp(my - a * mx))
