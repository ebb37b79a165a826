"""Lens spaces, their Seifert fibrations, and torus knots on their Heegaard torus.

Convention (Rolfsen, *Knots and Links*, 1976, ch. 9; CONVENTIONS §9):
``L(p, q)`` is ``-p/q`` surgery on an unknot ``U`` in ``S^3``.  Its Heegaard
torus is ``T = boundary of a neighbourhood of U`` with the meridian ``mu`` and
the Seifert longitude ``lambda`` of ``U``.  ``V_1`` (the exterior of ``U``)
has meridian ``lambda``; the surgery solid torus ``V_2`` has meridian
``-p mu + q lambda``.

The knot ``T(r, s)`` in ``L(p, q)`` is the curve ``r mu + s lambda`` on ``T``
(for ``p = 1, q = 0`` this is the torus knot ``T(r, s)`` of ``S^3``).  Its
class in ``H_1 = Z/p`` (generator ``[mu]``, the core of ``V_1``) is ``r``; its
linking with the parallel copy on ``T`` is ``r s + q r^2 / p`` (rational
linking in the surgered manifold, Kirby LNM 1374), and this is also its fibre
framing in the Seifert fibration in which it is a regular fibre.  That
fibration has exceptional fibres the cores of ``V_1`` and ``V_2``, of orders
``|r|`` and ``|r q + s p|``.
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction
from math import gcd

from knotobs.errors import InvalidKnotError, InvalidSeifertDataError, SizeLimitError
from knotobs.fibrations.seifert import SeifertManifold, _inv_mod, _refill, lens_canonical_q

__all__ = [
    "lens_canonical_q",
    "lens_homeomorphic",
    "s3_seifert",
    "lens_fibration",
    "lens_fibrations",
    "LensKnotData",
    "lens_knot_data",
]


def _check_lens(p: int, q: int) -> None:
    for name, v in (("p", p), ("q", q)):
        if isinstance(v, bool) or not isinstance(v, int):
            raise InvalidSeifertDataError(f"lens parameter {name}={v!r} must be an integer")
    if p < 1:
        raise InvalidSeifertDataError(
            f"L({p},{q}): p = {p} must be >= 1 here (L(0,1) = S^2xS^1 has no such torus knots)"
        )
    if gcd(p, q) != 1:
        raise InvalidSeifertDataError(f"L({p},{q}): gcd(p, q) = {gcd(p, q)} but must be 1")


def lens_homeomorphic(p: int, q: int, p2: int, q2: int, *, oriented: bool = False) -> bool:
    """Whether ``L(p, q)`` and ``L(p2, q2)`` are homeomorphic.

    ``L(p, q) = L(p, q')`` iff ``q' = +-q^{+-1} (mod p)``; preserving the
    orientation iff ``q' = q^{+-1} (mod p)`` (Reidemeister 1935; Brody 1960).

    Examples
    --------
    >>> lens_homeomorphic(7, 1, 7, 2), lens_homeomorphic(7, 2, 7, 4)
    (False, True)
    >>> lens_homeomorphic(5, 1, 5, 4), lens_homeomorphic(5, 1, 5, 4, oriented=True)
    (True, False)

    References
    ----------
    K. Reidemeister, Abh. Math. Sem. Hamburg 11 (1935) 102-109;
    E. J. Brody, Ann. of Math. 71 (1960) 163-184.
    """
    for pp, qq in ((p, q), (p2, q2)):
        if isinstance(pp, bool) or not isinstance(pp, int) or pp < 0 or gcd(pp, qq) != 1:
            raise InvalidSeifertDataError(f"L({pp},{qq}) is not a lens space: need p >= 0, gcd(p,q) = 1")
    if p != p2:
        return False
    if p <= 2:
        return True
    qs = {q % p, _inv_mod(q, p)}
    if not oriented:
        qs |= {(-x) % p for x in qs}
    return q2 % p in qs


def s3_seifert(P: int, Q: int, chirality: int = 1) -> SeifertManifold:
    """``S^3 = M(0; 0; (P, b_1), (Q, b_2))`` with ``P b_2 + Q b_1 = chirality``.

    Its regular fibre is ``T(P, Q)`` for ``chirality = +1`` and the mirror
    ``T(P, -Q)`` for ``-1``; ``e = -chirality/(PQ)``; fibre 0 is the core of
    order ``P`` and fibre 1 the core of order ``Q``.

    >>> s3_seifert(2, 3)
    SeifertManifold(b=0, fibers=((2, 1), (3, -1)))

    References
    ----------
    Seifert (1933) §10; CONVENTIONS §5, §7.
    """
    if P < 1 or Q < 1 or gcd(P, Q) != 1 or chirality not in (1, -1):
        raise InvalidKnotError(f"T({P},{Q}) with chirality {chirality}: need coprime P, Q >= 1")
    b1 = (chirality * _inv_mod(Q, P)) % P if P > 1 else 0
    b2, r = divmod(chirality - Q * b1, P)
    assert r == 0
    return SeifertManifold(0, ((P, b1), (Q, b2)))


def lens_fibration(p: int, q: int, r: int, s: int) -> SeifertManifold:
    """The Seifert fibration of ``L(p, q)`` whose regular fibre is ``r mu + s lambda``.

    Returns ``M(0; 0; (|r|, .), (|rq + sp|, .))`` with fibre 0 the core of
    ``V_1`` and fibre 1 the core of ``V_2``.

    Method: after a Dehn twist of ``V_1`` (``q -> q + kp``, ``s -> s - kr``)
    making ``s != 0``, the curve is the regular fibre of the fibration
    :func:`s3_seifert` of ``S^3`` in which ``U`` is the core of order ``|s|``;
    ``-p/q`` surgery on that core (relative to its Seifert framing) replaces its
    Seifert invariant via the gluing matrix, see
    :func:`knotobs.fibrations.surgery.surgery_on_fiber`.

    Raises
    ------
    InvalidKnotError
        If ``gcd(r, s) != 1``, ``r = 0`` (the curve bounds a meridian disc of
        ``V_1``) or ``r q + s p = 0`` (it bounds a meridian disc of ``V_2``).

    Examples
    --------
    >>> M = lens_fibration(7, 2, 1, 1)
    >>> M, M.recognise(), M.fiber_framing
    (SeifertManifold(b=0, fibers=((1, 0), (9, 7))), 'L(7,2)', Fraction(9, 7))

    References
    ----------
    Seifert (1933); Moser, Pacific J. Math. 38 (1971) 737-745; Kirby, LNM 1374.
    """
    _check_lens(p, q)
    for name, v in (("r", r), ("s", s)):
        if isinstance(v, bool) or not isinstance(v, int):
            raise InvalidKnotError(f"slope parameter {name}={v!r} must be an integer")
    if gcd(r, s) != 1:
        raise InvalidKnotError(f"the curve ({r},{s}) on the Heegaard torus needs gcd(r, s) = 1")
    if r == 0:
        raise InvalidKnotError(
            f"the curve ({r},{s}) bounds a meridian disc of the first Heegaard solid torus of"
            f" L({p},{q}); it is not a fibre of any Seifert fibration with vertical Heegaard torus"
        )
    if r * q + s * p == 0:
        raise InvalidKnotError(
            f"T({r},{s}) bounds a meridian disc of the second Heegaard solid torus of L({p},{q})"
            f" (r q + s p = 0); it is not a fibre of any Seifert fibration with vertical Heegaard torus"
        )
    if max(abs(r), abs(s), abs(r * q + s * p)) > 10**9:
        raise SizeLimitError(f"curve ({r},{s}) in L({p},{q}) is too large: |r|, |s| and the order"
                             f" |r q + s p| = {abs(r * q + s * p)} of the new exceptional fiber must be at most 10^9")
    if s == 0:  # Dehn twist of V_1: q -> q + k p, s -> s - k r
        k = 1
        q, s = q + k * p, s - k * r
    A, B, c = abs(r), abs(s), (1 if r * s > 0 else -1)
    M0 = s3_seifert(A, B, c)
    new = _refill(M0, 1, -p, q, target_self_linking=Fraction(0))  # Seifert framing of U
    M = SeifertManifold(0, (M0.fibers[0], new))
    assert new[0] == abs(r * q + s * p), (p, q, r, s, new)
    return M


def lens_fibrations(p: int, q: int, max_order: int = 12) -> tuple[tuple[int, int, SeifertManifold], ...]:
    """Seifert fibrations of ``L(p, q)`` over ``S^2`` with exceptional orders ``<= max_order``.

    Every Seifert fibration of a lens space over ``S^2`` has a vertical
    Heegaard torus, so it comes from a slope ``r mu + s lambda`` (at most two
    exceptional fibres).  Returns ``(r, s, normal form)`` for one slope per
    distinct normal form, ``r >= 1``.

    >>> found = lens_fibrations(5, 2, 3)
    >>> sorted({M.exceptional_orders for _, _, M in found})
    [(2,), (3,)]
    >>> {M.recognise() for _, _, M in found}
    {'L(5,2)'}

    References
    ----------
    Seifert (1933); P. Orlik, Seifert Manifolds, LNM 291 (1972) ch. 5.
    """
    _check_lens(p, q)
    if max_order > 200:
        raise SizeLimitError(f"max_order={max_order} is too large (limit 200)")
    seen: dict[SeifertManifold, tuple[int, int]] = {}
    for r in range(1, max_order + 1):
        # |r q + s p| <= max_order
        lo = (-max_order - r * q) // p - 1
        hi = (max_order - r * q) // p + 1
        for s in range(lo, hi + 1):
            if gcd(r, s) != 1 or r * q + s * p == 0 or abs(r * q + s * p) > max_order:
                continue
            N = lens_fibration(p, q, r, s).normal_form()
            if N not in seen:
                seen[N] = (r, s)
    return tuple((r, s, N) for N, (r, s) in seen.items())


@dataclass(frozen=True)
class LensKnotData:
    """Homological data of the curve ``r mu + s lambda`` in ``L(p, q)``.

    Attributes
    ----------
    homology_class : int
        Class in ``H_1 = Z/p`` on the generator ``[mu]`` (the core of ``V_1``).
    order : int
        Order of that class.
    self_linking : Fraction
        Rational self-linking with the push-off along the Heegaard torus
        (= fibre framing), ``r s + q r^2 / p``.
    core_classes : tuple of int
        Classes of the cores of ``V_1`` and ``V_2`` oriented along the fibres:
        ``sign(r)`` and ``sign(r q + s p) q^{-1}`` (mod ``p``).
    """

    p: int
    q: int
    r: int
    s: int
    homology_class: int
    order: int
    self_linking: Fraction
    core_classes: tuple[int, int]

    @property
    def self_linking_mod_one(self) -> Fraction:
        """The linking-form value ``q r^2 / p mod 1``."""
        v = self.self_linking
        return v - (v.numerator // v.denominator)


def lens_knot_data(p: int, q: int, r: int, s: int) -> LensKnotData:
    """Class, order and rational self-linking of the curve ``r mu + s lambda`` in ``L(p, q)``.

    >>> d = lens_knot_data(7, 2, 3, 1)
    >>> d.homology_class, d.order, d.self_linking
    (3, 7, Fraction(39, 7))

    References
    ----------
    Rolfsen (1976) ch. 9; linking numbers after surgery: Kirby, LNM 1374 (1989).
    """
    _check_lens(p, q)
    if gcd(r, s) != 1:
        raise InvalidKnotError(f"the curve ({r},{s}) on the Heegaard torus needs gcd(r, s) = 1")
    cls = r % p
    order = p // gcd(cls, p)
    sl = Fraction(r * s) + Fraction(q * r * r, p)
    sgn2 = 1 if r * q + s * p > 0 else -1
    c2 = (sgn2 * _inv_mod(q, p)) % p if p > 1 else 0
    c1 = (1 if r > 0 else -1) % p
    return LensKnotData(p, q, r, s, cls, order, sl, (c1, c2))
