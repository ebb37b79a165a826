r"""Chern–Simons values of flat SL(2,C) connections on Seifert manifolds over ``S^2``, exactly.

Presentation (CONVENTIONS §5, §12).  For ``M = M(0; b; (a_1,b_1), ..., (a_n,b_n))`` with the
integer ``b`` counted as an extra fibre ``(a_0, b_0) = (1, b)``,

    ``pi_1 M = < x_0, ..., x_n, h | h central, x_j^{a_j} h^{b_j} = 1, x_0 x_1 ... x_n = 1 >``.

A representation is described on the boundary torus of the ``j``-th fibre neighbourhood by two
angles: ``rho(x_j) ~ diag(e^{2 pi i theta_j}, e^{-2 pi i theta_j})`` and
``rho(h) ~ diag(e^{2 pi i s}, e^{-2 pi i s})`` (``s in {0, 1/2}`` for irreducible ``rho``, where
``rho(h) = eps = e^{2 pi i s}`` is central).  With ``c_j, d_j`` such that ``a_j d_j - b_j c_j = 1``
put ``n_j = a_j theta_j + b_j s`` (an integer: the meridian ``x_j^{a_j} h^{b_j}`` has trivial
holonomy) and ``beta_j = c_j theta_j + d_j s`` (the angle of the core of the ``j``-th solid torus,
i.e. of the exceptional fibre itself).  Then

    ``cs(rho) = sum_{j=0}^{n} ( s theta_j + n_j beta_j )  mod 1``.          (*)

Derivation: the Kirk–Klassen formula ``cs(rho_1) - cs(rho_0) = -2 int (alpha dbeta - beta dalpha)``
on the torus boundaries of ``(n+1)``-holed sphere ``x S^1`` (P. Kirk and E. Klassen, Math. Ann. 287
(1990) 343–367), applied to the path that first turns ``rho(h)`` from 1 to ``eps`` with every
``x_j = 1`` and then moves the ``x_j`` (with their canonical angles ``theta_j in [0, 1/2]``) to
their final values, followed by the gauge change that puts each meridian angle to zero
(normal form on the solid tori, where the Chern–Simons form vanishes).  The overall sign and the
normalisation (``cs`` of ``SU(2)`` connections in ``R/Z``, instanton number 1 adds 1) were fixed
and checked against the exact residue decomposition of the Lawrence–Rozansky integral
(:mod:`knotobs.continuation.level`), where every irreducible sector carries
``exp(2 pi i K cs)``: in this orientation the Poincaré sphere ``Sigma(2,3,5)`` has
``cs = -1/120, -49/120`` (Fintushel–Stern 1990; CONVENTIONS §9).  For abelian representations
(any ``s``) the same formula holds with lifts ``theta_j`` of the angles chosen so that
``sum_j theta_j = 0`` exactly (the straight path through abelian representations).

The Fintushel–Stern closed form ``cs = -e^2/(4 a_1 a_2 a_3)``, ``e = sum_j l_j a_1 a_2 a_3/a_j``
(R. Fintushel and R. Stern, Proc. London Math. Soc. 61 (1990) 109–137, §2) is
:func:`fintushel_stern_cs`; it refers to the presentation of ``Sigma(a_1, a_2, a_3)`` without the
integer ``b`` (``b = 0``), so rotation numbers of the normal form (``0 < b_j < a_j``, ``b != 0``)
must be converted first (:func:`rotation_numbers_without_b`): when ``eps = -1`` and ``b`` is
odd the last rotation number becomes ``a_3 - l_3``.
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache
from math import gcd

__all__ = ["complement_pair", "irreducible_cs", "abelian_cs", "core_angles", "fintushel_stern_cs",
           "rotation_numbers_without_b"]


@lru_cache(maxsize=4096)
def complement_pair(a: int, b: int) -> tuple[int, int]:
    """``(c, d)`` with ``a d - b c = 1`` (``0 <= c < a`` for ``a > 1``).

    >>> complement_pair(5, 2)
    (2, 1)
    >>> complement_pair(1, -3)
    (0, 1)
    """
    if a == 1:
        return 0, 1
    c = (-pow(b, -1, a)) % a
    d, r = divmod(1 + b * c, a)
    assert r == 0
    return c, d


def _fibres(M) -> list[tuple[int, int]]:
    """Exceptional fibres of ``M`` followed by ``(1, b)``."""
    return list(M.fibers) + [(1, M.b)]


def irreducible_cs(M, eps: int, l: tuple[int, ...]) -> Fraction:
    """Chern–Simons value (*) of the irreducible class with ``rho(h) = eps`` and rotation numbers ``l``.

    ``M`` is a :class:`~knotobs.fibrations.seifert.SeifertManifold` (any presentation; ``l_j`` refer
    to it), ``rho(x_j) ~ exp(i pi l_j/a_j)`` with ``0 <= l_j <= a_j`` and ``(-1)^{l_j} = eps^{b_j}``.

    >>> from knotobs.fibrations.seifert import SeifertManifold
    >>> P = SeifertManifold(-1, [(2, 1), (3, 1), (5, 1)])          # Sigma(2,3,5)
    >>> irreducible_cs(P, -1, (1, 1, 1)), irreducible_cs(P, -1, (1, 1, 3))
    (Fraction(119, 120), Fraction(71, 120))

    References
    ----------
    P. Kirk and E. Klassen, Math. Ann. 287 (1990) 343–367 (the path formula); CONVENTIONS §12.
    """
    sig = 0 if eps == 1 else 1                     # s = sig/2
    fib = list(M.fibers)
    ls = list(l)
    if len(ls) != len(fib):
        raise ValueError(f"{len(ls)} rotation numbers for {len(fib)} fibres")
    # the fibre (1, b): x_0 = h^{-b} = eps^b, canonical angle 0 or 1/2
    fib.append((1, M.b))
    ls.append(1 if (sig and M.b % 2) else 0)
    num, den = 0, 1
    for (a, bj), lj in zip(fib, ls):
        c, d = complement_pair(a, bj)
        twice_n = lj + bj * sig
        if twice_n % 2:
            raise ValueError(f"rotation number {lj} of fibre ({a},{bj}) has the wrong parity for eps = {eps}")
        n = twice_n // 2
        # s theta + n beta = [sig l + 2 n (c l + d sig a)] / (4 a)
        t_num = (sig * lj + 2 * n * (c * lj + d * sig * a)) % (4 * a)
        D = 4 * a
        g = gcd(den, D)
        num = num * (D // g) + t_num * (den // g)
        den = den * (D // g)
    return Fraction(num, den) % 1


def core_angles(M, eps: int, l: tuple[int, ...]) -> tuple[Fraction, ...]:
    """``beta_j = c_j theta_j + d_j s``: holonomy angle of each exceptional fibre (its core).

    >>> from knotobs.fibrations.seifert import SeifertManifold
    >>> core_angles(SeifertManifold(-1, [(2, 1), (3, 1), (5, 1)]), -1, (1, 1, 1))
    (Fraction(3, 4), Fraction(5, 6), Fraction(9, 10))
    """
    s = Fraction(0) if eps == 1 else Fraction(1, 2)
    out = []
    for (a, bj), lj in zip(M.fibers, l):
        c, d = complement_pair(a, bj)
        out.append(c * Fraction(lj, 2 * a) + d * s)
    return tuple(out)


def abelian_cs(M, s: Fraction, thetas: tuple[Fraction, ...]) -> Fraction:
    """(*) for an abelian representation: ``rho(h) = e^{2 pi i s}``, ``rho(x_j) = e^{2 pi i theta_j}``.

    The ``thetas`` are the angles of the exceptional fibres (any lifts); the fibre ``(1, b)`` and a
    fibre ``(1, 0)`` take the angles that make ``sum theta = 0`` exactly.

    >>> from knotobs.fibrations.seifert import SeifertManifold
    >>> L51 = SeifertManifold.from_lens(5, 1)
    >>> sorted({abelian_cs(L51, Fraction(r, 5), (Fraction(-r * L51.fibers[0][1], 5 * L51.fibers[0][0]),))
    ...         for r in range(5)} - {0}) == sorted({Fraction(1, 5), Fraction(4, 5)})
    True
    """
    s = Fraction(s)
    fib = list(M.fibers)
    th = [Fraction(t) for t in thetas]
    # fibre (1, b): theta_0 = -b s + integer; fibre (1, 0) closes the sum exactly
    t0 = -M.b * s
    fib += [(1, M.b), (1, 0)]
    th += [t0, -(sum(th, Fraction(0)) + t0)]
    tot = Fraction(0)
    for (a, bj), t in zip(fib, th):
        c, d = complement_pair(a, bj)
        n = a * t + bj * s
        if n.denominator != 1:
            raise ValueError(f"angle {t} of fibre ({a},{bj}) does not satisfy x^a h^b = 1")
        tot += s * t + n * (c * t + d * s)
    return tot % 1


def rotation_numbers_without_b(M, eps: int, l: tuple[int, ...]) -> tuple[int, ...]:
    """Rotation numbers in the presentation with ``b = 0`` (the integer absorbed into the last fibre).

    Absorbing ``b`` replaces ``x_n`` by ``x_n h^{-b}``, so ``rho(x_n)`` changes by ``eps^b``: for
    ``eps = -1`` and ``b`` odd, ``l_n -> a_n - l_n``.

    >>> from knotobs.fibrations.seifert import SeifertManifold
    >>> rotation_numbers_without_b(SeifertManifold(-1, [(3, 1), (4, 1), (7, 3)]), -1, (1, 1, 3))
    (1, 1, 4)
    """
    l = list(l)
    if eps == -1 and M.b % 2:
        l[-1] = M.fibers[-1][0] - l[-1]
    return tuple(l)


def fintushel_stern_cs(a: tuple[int, ...], l: tuple[int, ...]) -> Fraction:
    """``-e^2/(4 a_1 a_2 a_3) mod 1`` with ``e = sum_j l_j a_1 a_2 a_3/a_j``.

    Valid for rotation numbers of the presentation without ``b`` (:func:`rotation_numbers_without_b`).

    >>> fintushel_stern_cs((2, 3, 5), (1, 1, 4))
    Fraction(119, 120)

    References
    ----------
    R. Fintushel and R. Stern, Proc. London Math. Soc. 61 (1990) 109–137, §2 (statement quoted
    from memory; the tests compare it with (*) and with the Lawrence–Rozansky residues).
    """
    A = 1
    for x in a:
        A *= x
    e = sum(lj * (A // aj) for lj, aj in zip(l, a))
    return Fraction(-e * e, 4 * A) % 1
