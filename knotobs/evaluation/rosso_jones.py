"""Torus knots and links by the Rosso–Jones formula (Adams-operation route).

For the torus knot ``T(m, n)`` (``m = min(P, Q)``), zero framing, unnormalised
(the unknot gives ``dim_q``), CONVENTIONS §3:

    W_lam = theta(lam)^(-m n) * sum_mu c_{lam,mu}^(m) theta(mu)^(n/m) dim_q(mu)

with ``psi^m(lam) = sum_mu c_{lam,mu}^(m) mu`` the Adams operation.  A torus
link ``T(dP, dQ)`` whose components carry ``lam_1..lam_d`` first decomposes
``lam_1 x ... x lam_d = sum_nu N^nu nu`` and applies the same sum to each
``nu``; each component's torus framing ``P Q`` is removed by
``theta(lam_i)^(-P Q)``.  The mirror image is ``q -> q^-1``.

References
----------
M. Rosso, V. F. R. Jones, J. Knot Theory Ramifications 2 (1993) 97–112;
X.-S. Lin, H. Zheng, Trans. Amer. Math. Soc. 362 (2010) 1–18;
S. Stevan, Ann. Henri Poincaré 11 (2010) 1201–1224.
"""

from __future__ import annotations

from fractions import Fraction
from typing import Sequence

from knotobs.errors import InvalidKnotError, InvalidRepresentationError
from knotobs.evaluation._accumulate import CosetSum
from knotobs.evaluation.framing import FramingSpec, resolve_framing
from knotobs.fibrations.torus import TorusLink
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.groups import (
    Group,
    adams_fixed,
    casimir,
    homfly_unknot,
    quantum_dimension,
    tensor_fixed,
)
from knotobs.representations.partitions import Partition, as_partition, kappa
from knotobs.representations.symmetric import adams_generic, tensor_generic

__all__ = ["rosso_jones", "rosso_jones_homfly", "colours_for"]


def colours_for(knot: TorusLink, colours) -> tuple[Partition, ...]:
    """One partition per component (a single partition colours every component)."""
    d = knot.components
    if not isinstance(colours, str):
        try:
            colours = tuple(colours)
        except TypeError:
            raise InvalidRepresentationError(
                f"colour {colours!r} is not a partition: give one partition such as [2,1], or one per component"
            ) from None
    if isinstance(colours, str) or (colours and isinstance(colours[0], int)) or colours == ():
        return (as_partition(colours),) * d
    cols = tuple(as_partition(c) for c in colours)
    if len(cols) != d:
        raise InvalidKnotError(
            f"{knot} has {d} component(s) but {len(cols)} colours were given: give one partition"
            " for all components or one per component"
        )
    return cols


def rosso_jones(knot: TorusLink, group: Group, colours, framing: FramingSpec = 0) -> Laurent:
    """Unnormalised Wilson loop of ``T(p, q)`` for SU(N) or U(N), exact in ``q``.

    Parameters
    ----------
    knot : TorusLink
    group : Group
        ``SU(N)`` or ``U(N)`` (the Casimir, hence the twist, differs).
    colours : partition or sequence of partitions
        One partition for every component, or one per component.
    framing : int, sequence of int or ``"zero"``/``"fiber"``
        Framing of each component relative to its Seifert framing.

    Returns
    -------
    Laurent
        Polynomial in ``q`` (exponents in ``(1/D) Z``); the unknot gives ``dim_q(lam)``.

    Examples
    --------
    >>> from knotobs.representations.groups import SU, quantum_integer
    >>> w = rosso_jones(TorusLink(2, 3), SU(2), (1,))
    >>> w.exact_div(quantum_integer(2))          # Jones V(t) of T(2,3) at t = 1/q
    Laurent('-q^-4 + q^-3 + q^-1')

    References
    ----------
    Rosso–Jones (1993); Lin–Zheng (2010); Stevan (2010); CONVENTIONS §3.
    """
    cols = colours_for(knot, colours)
    cols = tuple(group.check(c) for c in cols)
    frames = resolve_framing(knot, framing)
    m, n = min(knot.P, knot.Q), max(knot.P, knot.Q)
    if len(cols) == 1:
        decomposition = {cols[0]: 1}
    else:
        decomposition = tensor_fixed(group, cols)
    acc = CosetSum(unit=2)
    ratio = Fraction(n, m)
    for nu, mult in decomposition.items():
        for mu, c in adams_fixed(group, nu, m):
            acc.add(quantum_dimension(group, mu), casimir(group, mu) * ratio, c * mult)
    w = acc.result()
    shift = Fraction(0)
    for lam in cols:
        shift -= casimir(group, lam) * m * n
    w = w.times_monomial(shift)
    if knot.chirality < 0:
        w = w.mirror()
    extra = sum(f * casimir(group, lam) for f, lam in zip(frames, cols))
    if extra:
        w = w.times_monomial(extra)
    return w.canonical()


def rosso_jones_homfly(knot: TorusLink, colours, framing: FramingSpec = 0) -> tuple[Laurent2, Laurent]:
    """Generic-N (U(N)) Wilson loop as ``(numerator(a, s), denominator(s))``.

    The unnormalised invariant is the ratio (the unknot alone is not a Laurent
    polynomial); :func:`knotobs.evaluation.families.homfly` divides by the unknot.

    Examples
    --------
    >>> from fractions import Fraction
    >>> from knotobs.representations.groups import U
    >>> num, D = rosso_jones_homfly(TorusLink(2, 3), (1,))
    >>> at3 = num.specialize(Fraction(3, 2)).exact_div(D.subs_power(Fraction(1, 2)).rename("q"))
    >>> at3 == rosso_jones(TorusLink(2, 3), U(3), (1,))
    True

    The twist is ``theta(mu) = s^kappa(mu) a^|mu|`` (U(N) Casimir, ``a = q^(N/2)``,
    ``s = q^(1/2)``) and the quantum dimensions are the hook–content forms of
    :func:`~knotobs.representations.groups.homfly_unknot`; all terms are put over the
    common denominator ``prod_{i <= |mu|} (s^i - s^-i)``.  Specialising ``a = q^(N/2)``
    gives :func:`rosso_jones` for U(N).

    References
    ----------
    Rosso–Jones (1993); Lin–Zheng (2010); CONVENTIONS §2–§3.
    """
    cols = colours_for(knot, colours)
    frames = resolve_framing(knot, framing)
    m, n = min(knot.P, knot.Q), max(knot.P, knot.Q)
    decomposition = {cols[0]: 1} if len(cols) == 1 else tensor_generic(cols)
    size = m * sum(sum(c) for c in cols)
    s = Laurent.gen("s")
    D = Laurent.one("s")
    for i in range(1, size + 1):
        D = D * (s**i - s**-i)
    D = D.canonical()
    total = Laurent2()
    ratio = Fraction(n, m)
    for nu, mult in decomposition.items():
        a_exp = n * sum(nu)
        # collect the s-parts per power of a before multiplying out
        for mu, c in adams_generic(tuple(nu), m):
            num, den = homfly_unknot(mu)
            cofactor = D.exact_div(den)
            term = (num * Laurent2.from_s(cofactor)).times_monomial(a_exp, ratio * kappa(mu), c * mult)
            total = total + term
    s_shift = Fraction(0)
    a_shift = 0
    for lam, f in zip(cols, frames):
        s_shift += (f - m * n) * kappa(lam)
        a_shift += (f - m * n) * sum(lam)
    total = total.times_monomial(a_shift, s_shift)
    if knot.chirality < 0:
        # the value is total / D; mirroring s -> 1/s also sends D to (-1)^size D
        total = total.mirror()
        if size % 2:
            total = -total
    return total, D
