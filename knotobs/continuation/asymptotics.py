r"""Large-level asymptotics of SU(2) Seifert partition functions, contribution by contribution.

The Lawrence–Rozansky representation of :mod:`knotobs.continuation.level` splits
``Z(K)`` exactly into

* Gaussian integrals centred at ``z = -2 P r/|H|`` (``r = 0 .. |H|-1``), each
  multiplied by ``exp(2 pi i K P r^2/H)``: the trivial (``r = 0``) and the abelian
  (reducible) flat connections, ``CS = P r^2/H mod 1``.  Their large-``K``
  behaviour is the stationary-phase series

      ``B(K) e^(2 pi i K P r^2/H) sum_j G_(2j) e^(-i sigma pi (2j+1)/4) Gamma(j+1/2) (2P/(pi |H|))^(j+1/2) K^-(j+1/2)``

  with ``G_(2j)`` the Taylor coefficients of ``G`` at the centre;
* residues at the poles of ``G``: the irreducible flat connections,
  ``exp(2 pi i K CS)`` times a Laurent polynomial in ``K`` (exact: no expansion).

Truncating every Gaussian series after ``order + 1`` non-zero terms leaves an
error of order ``K^-(j_min + order + 3/2)``, ``j_min`` the first non-zero term (1 for
the trivial connection, whose ``G`` has a double zero).  This is the comparison
made by D. S. Freed and R. E. Gompf, Commun. Math. Phys. 141 (1991) 79–117, for
lens spaces and the Poincaré sphere; L. Jeffrey, Commun. Math. Phys. 147 (1992)
563–604, for lens spaces; L. Rozansky, Commun. Math. Phys. 171 (1995) 279–322 for
Seifert manifolds.  The trivial-connection series diverges factorially (scale set
by the smallest non-zero CS value), so the truncation order must stay well below
``2 pi K |CS_min|``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from fractions import Fraction
from typing import Sequence

import mpmath
from flint import acb, arb, ctx

from knotobs.continuation._num import bits, parse_complex, ser_inv, ser_mul, ser_sin, to_acb, to_mpc, working_bits
from knotobs.continuation.level import (
    DomainError,
    LRData,
    _B,
    _G_series,
    _residue_value,
    residue_terms,
)
from knotobs.errors import SizeLimitError
from knotobs.numerics import working_precision

__all__ = [
    "predicted_exponent",
    "Contribution",
    "contributions",
    "asymptotic_value",
    "AsymptoticRow",
    "compare_with_exact",
    "fitted_rate",
]


def _G_taylor(d: LRData, x0: Fraction, length: int) -> tuple[list[acb], int]:
    """``G(x0 + w) = w^-k F(w)``: first ``length`` coefficients of ``F`` and ``k``."""
    if x0.denominator == 1:
        return _G_series(d, int(x0), length)
    pi = arb.pi()
    xa = acb(x0.numerator) / x0.denominator
    num = [acb(1)] + [acb(0)] * (length - 1)
    for p in d.ps:
        s = ser_sin(xa * pi / p, acb(pi / p), length)
        num = ser_mul(num, [acb(0, 2) * c for c in s], length)
    m = d.n - 2
    if m != 0:
        s = [acb(0, 2) * c for c in ser_sin(xa * pi, acb(pi), length)]
        den = [acb(1)] + [acb(0)] * (length - 1)
        for _ in range(abs(m)):
            den = ser_mul(den, s, length)
        num = ser_mul(num, ser_inv(den, length) if m > 0 else den, length)
    return num, 0


@dataclass(frozen=True)
class Contribution:
    """One flat-connection sector of ``Z(K)``.

    Attributes
    ----------
    kind : str
        ``"trivial"``, ``"abelian"`` (a Gaussian centre ``r > 0``) or ``"irreducible"``
        (a group of residues with the same CS value).
    cs : Fraction
        Chern–Simons value mod 1 in ``[0, 1)``: the sector behaves as ``exp(2 pi i K cs)``.
    r : int
        Gaussian centre index (``-1`` for residues).
    residues : tuple
        The :class:`~knotobs.continuation.level.ResidueTerm` objects of an irreducible sector.
    """

    kind: str
    cs: Fraction
    r: int = -1
    residues: tuple = field(default_factory=tuple)

    @property
    def exact(self) -> bool:
        """True for residue sectors (no expansion in 1/K needed)."""
        return self.kind == "irreducible"


def contributions(space) -> list[Contribution]:
    """All sectors of the Lawrence–Rozansky decomposition, trivial first.

    >>> [(c.kind, str(c.cs)) for c in contributions("Sigma(2,3,5)")]
    [('trivial', '0'), ('irreducible', '71/120'), ('irreducible', '119/120')]
    >>> [(c.kind, str(c.cs)) for c in contributions("L(5,1)")]
    [('trivial', '0'), ('abelian', '1/5'), ('abelian', '4/5'), ('abelian', '4/5'), ('abelian', '1/5')]
    """
    d = space if isinstance(space, LRData) else LRData.from_space(space)
    out = [Contribution("trivial", Fraction(0), 0)]
    for r in range(1, abs(d.H)):
        out.append(Contribution("abelian", Fraction(d.P * r * r, d.H) % 1, r))
    groups: dict[Fraction, list] = {}
    for t in residue_terms(d):
        groups.setdefault(t.cs, []).append(t)
    for cs in sorted(groups):
        if not _vanishes(d, groups[cs]):
            out.append(Contribution("irreducible", cs, -1, tuple(groups[cs])))
    return out


def _vanishes(d: LRData, terms) -> bool:
    """True when a residue group adds up to zero at every integer ``K``.

    The members of a group have phases ``exp(-i pi K H m^2/(2P))`` whose exponents
    differ by integers: at integer ``K`` they combine into one sector, and some
    groups cancel there (they are non-zero only between integers, as part of the
    Lawrence–Rozansky continuation).  Each member is ``exp(..)`` times a Laurent
    polynomial of degree ``<= n - 3`` in ``K``, so vanishing at ``n + 2`` integers
    with the phases aligned means vanishing at all integers; checked at high precision.
    """
    with working_bits(300):
        for K in [acb(101 + 37 * i) for i in range(d.n + 2)]:
            s = acb(0)
            for t in terms:
                s += _residue_value(d, t, K)
            if not (abs(s) < arb(10) ** -60):
                return False
        return True


def _saddle_terms(d: LRData, r: int, order: int) -> list[tuple[int, acb]]:
    """``[(j, coefficient of K^-(j+1/2))]`` for the first ``order + 1`` non-zero terms."""
    x0 = d.saddle(r)
    if d.n >= 3 and x0.denominator == 1 and d.pole_order(int(x0)) >= 1:
        raise DomainError(
            f"the Gaussian centre z = {x0} of {d.space} sits on a pole of G; its stationary-phase"
            " series is not set up here (use the exact continued value instead)"
        )
    length = 2 * (order + 3) + 2
    out = []
    while True:
        F, k = _G_taylor(d, x0, length)
        # G = w^-k F; k <= 0 here (regular point): G_j = F_{j+k}
        coeffs = [F[j + k] if 0 <= j + k < length else acb(0) for j in range(length)]
        out = []
        for j in range(0, length // 2):
            c = coeffs[2 * j]
            if abs(c).mid() == 0 or (abs(c) < arb(10) ** (-(ctx.dps - 5))):
                continue
            out.append((j, c))
            if len(out) == order + 1:
                return _weights(d, out)
        length *= 2
        if length > 400:
            return _weights(d, out)


def _weights(d: LRData, terms: list[tuple[int, acb]]) -> list[tuple[int, acb]]:
    res = []
    pi = arb.pi()
    for j, c in terms:
        half = arb(2 * j + 1) / 2
        w = (c * (acb(0, -d.sigma) * pi * (2 * j + 1) / 4).exp() * half.gamma()
             * (arb(2 * d.P) / (pi * abs(d.H))) ** half)
        res.append((j, w))
    return res


def _sector_value(d: LRData, c: Contribution, K: acb, order: int | None) -> acb:
    B = _B(d, K)
    two_pi_i = acb(0, 2) * arb.pi()
    if c.kind == "irreducible":
        s = acb(0)
        for t in c.residues:
            s += _residue_value(d, t, K)
        return -two_pi_i * d.sigma * B * s
    if order is None:
        raise DomainError("a Gaussian sector needs a truncation order")
    s = acb(0)
    for j, w in _saddle_terms(d, c.r, order):
        s += w * K ** (-(arb(2 * j + 1) / 2))
    return B * (two_pi_i * K * d.P * c.r * c.r / d.H).exp() * s


def asymptotic_value(space, K, order: int = 2, digits: int = 30, per_sector: bool = False):
    """Sum over flat connections: exact residue sectors plus truncated Gaussian series.

    Parameters
    ----------
    space : str or SeifertManifold
    K : complex or str
        Shifted level ``K = k + 2``.
    order : int
        Number of non-zero correction terms kept after the leading one in every
        Gaussian (trivial / abelian) sector.
    per_sector : bool
        Also return ``[(Contribution, value)]``.

    Examples
    --------
    >>> from knotobs.continuation.level import continued_Z
    >>> a = asymptotic_value("Sigma(2,3,5)", 200, order=2, digits=20)
    >>> abs(a - continued_Z("Sigma(2,3,5)", 200, 20)) < 1e-4     # error ~ K^(-9/2)
    True

    References
    ----------
    D. S. Freed and R. E. Gompf, Commun. Math. Phys. 141 (1991) 79–117;
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314.
    """
    if not isinstance(order, int) or order < 0 or order > 60:
        raise SizeLimitError(f"order = {order!r} must be an integer between 0 and 60")
    d = space if isinstance(space, LRData) else LRData.from_space(space)
    Kv = parse_complex(K, "K")
    with working_bits(bits(digits)):
        Ka = to_acb(Kv)
        total = acb(0)
        parts = []
        for c in contributions(d):
            v = _sector_value(d, c, Ka, order)
            total += v
            parts.append((c, to_mpc(v, digits)))
        res = to_mpc(total, digits)
    return (res, parts) if per_sector else res


def predicted_exponent(space, order: int) -> Fraction:
    """Exponent ``e`` with ``|exact - asymptotic| = O(K^-e)`` at truncation ``order``.

    >>> predicted_exponent("Sigma(2,3,5)", 1), predicted_exponent("L(5,1)", 1)
    (Fraction(7, 2), Fraction(5, 2))
    """
    d = space if isinstance(space, LRData) else LRData.from_space(space)
    with working_bits(200):
        best = None
        for r in range(abs(d.H)):
            terms = _saddle_terms(d, r, order + 1)
            if len(terms) > order + 1:
                j = terms[order + 1][0]
                e = Fraction(2 * j + 1, 2)
                best = e if best is None else min(best, e)
        return best if best is not None else Fraction(10**6)


@dataclass(frozen=True)
class AsymptoticRow:
    K: int
    exact: mpmath.mpc
    asymptotic: mpmath.mpc
    error: mpmath.mpf


def compare_with_exact(space, Ks: Sequence[int], order: int = 2, digits: int = 30) -> list[AsymptoticRow]:
    """Exact finite-level values against the asymptotic sum, for integer ``K``.

    The exact values come from the Lawrence–Rozansky Gauss sum of
    :mod:`knotobs.evaluation.gauss_sum` (an independent route).

    >>> rows = compare_with_exact("L(5,1)", [50, 100], order=1, digits=20)
    >>> rows[1].error < rows[0].error
    True
    """
    from knotobs.evaluation.gauss_sum import gauss_sum_partition_function

    d = space if isinstance(space, LRData) else LRData.from_space(space)
    rows = []
    for K in Ks:
        if not isinstance(K, int) or K < 3:
            raise DomainError(f"K = {K!r}: the comparison needs integers K >= 3")
        ex = gauss_sum_partition_function(d.space, K - 2, digits=digits, exact=False).numeric
        asy = asymptotic_value(d, K, order, digits)
        with working_precision(digits):
            rows.append(AsymptoticRow(K, ex, asy, abs(ex - asy)))
    return rows


def fitted_rate(rows: Sequence[AsymptoticRow]) -> float:
    """Least-squares slope ``-d log|error| / d log K``."""
    xs = [math.log(r.K) for r in rows]
    ys = [float(mpmath.log(r.error)) for r in rows]
    n = len(xs)
    mx, my = sum(xs) / n, sum(ys) / n
    sxx = sum((x - mx) ** 2 for x in xs)
    sxy = sum((x - mx) * (y - my) for x, y in zip(xs, ys))
    return -sxy / sxx
