"""Seifert fibred 3-manifolds over closed orientable surfaces.

Notation and orientation convention
-----------------------------------
``M(0; b; (a_1, b_1), ..., (a_n, b_n))`` with ``a_i >= 1`` and
``gcd(a_i, b_i) = 1`` is, by definition here, the oriented manifold obtained by
surgery on a link in ``S^3`` made of an unknot ``U_0`` with framing ``-b`` and
``n`` meridians ``m_1, ..., m_n`` of ``U_0`` (pairwise unlinked, each linking
``U_0`` once) with rational surgery coefficients ``a_i / b_i``.  Sliding the
integer ``b`` into an extra fibre ``(1, b)`` (a slam-dunk) leaves ``U_0``
0-framed, so in the notation of Lawrence and Rozansky, Commun. Math. Phys. 205
(1999) 287-314,

    ``M(0; b; (a_1, b_1), ..., (a_n, b_n)) = X(a_1/b_1, ..., a_n/b_n, 1/b)``

(the last entry omitted when ``b = 0``).  A regular fibre is a further meridian
of ``U_0``; its framing by a nearby fibre is the 0-framing of the diagram.  With
the boundary torus of the ``i``-th fibre neighbourhood described by the
meridian ``mu_i`` of ``m_i`` and the fibre ``h``, the solid torus is glued so
that its meridian is ``a_i mu_i + b_i h``.

Consequences (derived from the surgery diagram with the rational linking
matrix; checked in the tests against published facts):

* Euler number ``e = -(b + sum b_i / a_i)``, ``|H_1| = |a_1 ... a_n e|``
  (``0`` meaning infinite);
* two regular fibres link ``-1/e`` times, so the fibre framing of a regular
  fibre is ``-1/e``;
* ``S^3 = M(0; 0; (P, b_1), (Q, b_2))`` with ``P b_2 + Q b_1 = +1`` has
  ``e = -1/(PQ)`` and regular fibre the *positive* torus knot ``T(P, Q)``;
* the Brieskorn sphere ``Sigma(a_1, a_2, a_3)``, oriented as the link of
  ``x^a1 + y^a2 + z^a3 = 0``, has ``e = -1/(a_1 a_2 a_3)``; e.g. the Poincare
  sphere ``Sigma(2,3,5) = M(0; -1; (2,1), (3,1), (5,1)) = X(2/-1, 3/1, 5/1)``;
* the lens space ``L(p, q)`` is ``-p/q`` surgery on the unknot,
  ``L(p, q) = X(q/p) = M(0; 0; (q, p))``; its linking form is ``q/p``.

This is the convention of Neumann and Raymond (links of singularities have
negative Euler number).  Orientation reversal is
``M(0; b; (a_i, b_i)) -> M(0; -b; (a_i, -b_i))``.

Base genus ``g >= 1``
---------------------
``M(g; b; (a_1, b_1), ..., (a_n, b_n))`` has as base the closed orientable
surface ``Sigma_g``; it is obtained from ``Sigma_g'' x S^1`` (``Sigma_g`` minus
``n + 1`` discs) by the same fibre-preserving fillings as for ``g = 0`` (the
``(1, b)`` filling carries ``b``).  The fundamental group is
``< alpha_j, beta_j, q_i, h | h central, q_i^(a_i) h^(b_i) = 1,
prod_j [alpha_j, beta_j] q_1 ... q_n = h^b >`` (Seifert 1933; Orlik, LNM 291
(1972) §5.2), so

* ``e = -(b + sum b_i/a_i)`` as for ``g = 0``; ``chi = 2 - 2g - sum (1 - 1/a_i)``;
* ``H_1 = Z^(2g) + H_1(M(0; b; (a_i, b_i)))``: the commutators die and the
  genus-0 relations remain.  ``H_1`` is infinite, with first Betti number
  ``b_1 = 2g`` when ``e != 0`` and ``b_1 = 2g + 1`` when ``e = 0``;
* ``M(g; 0)`` is ``S^1 x Sigma_g``;
* normal form and orientation reversal act on ``b`` and the ``(a_i, b_i)``
  exactly as for ``g = 0``.

A non-orientable base (Seifert's classes ``n_1, n_2``, in some notations a
negative genus) is not handled: such input is refused with an error.

References
----------
H. Seifert, Acta Math. 60 (1933) 147-238.
W. D. Neumann and F. Raymond, Seifert manifolds, plumbing, mu-invariant and
orientation reversing maps, Lecture Notes in Math. 664 (1978) 163-196.
R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287-314.
R. C. Kirby, The topology of 4-manifolds, Lecture Notes in Math. 1374 (1989)
(slam-dunks, rational surgery calculus).
"""

from __future__ import annotations

import itertools
import re
from dataclasses import dataclass, field
from fractions import Fraction
from math import gcd, prod
from typing import Sequence

from knotobs.errors import InvalidSeifertDataError, ParseError, SizeLimitError

__all__ = [
    "SeifertManifold",
    "LinkingForm",
    "Recognition",
    "parse_space",
    "lens_canonical_q",
    "MAX_FIBERS",
    "MAX_FIBER_ORDER",
    "MAX_GENUS",
]

#: Largest number of fibres accepted.
MAX_FIBERS = 64
#: Largest |a_i|, |b_i|, |b| accepted (keeps the exact linear algebra small).
MAX_FIBER_ORDER = 10**9
#: Largest base genus accepted.
MAX_GENUS = 10**6


# ---------------------------------------------------------------------------
# small exact integer/rational linear algebra (private)
# ---------------------------------------------------------------------------
def _egcd(a: int, b: int) -> tuple[int, int, int]:
    """Return ``(g, x, y)`` with ``a x + b y = g = gcd(a, b) >= 0``."""
    x0, y0, x1, y1 = 1, 0, 0, 1
    while b:
        k, r = divmod(a, b)
        a, b = b, r
        x0, x1 = x1, x0 - k * x1
        y0, y1 = y1, y0 - k * y1
    if a < 0:
        a, x0, y0 = -a, -x0, -y0
    return a, x0, y0


def _inv_mod(a: int, m: int) -> int:
    """Inverse of ``a`` modulo ``m >= 1`` (``0`` when ``m == 1``)."""
    g, x, _ = _egcd(a % m, m)
    if g != 1:
        raise ValueError(f"{a} is not invertible modulo {m}")
    return x % m


def lens_canonical_q(p: int, q: int) -> int:
    """Canonical representative of the oriented lens space ``L(p, q)``.

    ``L(p, q)`` and ``L(p, q')`` are orientation-preservingly homeomorphic iff
    ``q' = q^{+-1} (mod p)`` (Reidemeister 1935; Brody 1960); the
    representative returned is ``min(q mod p, q^{-1} mod p)``.  Reversing the
    orientation gives ``L(p, -q)``.

    Parameters
    ----------
    p : int
        ``p >= 2``.
    q : int
        Coprime to ``p``.

    Examples
    --------
    >>> lens_canonical_q(7, 4), lens_canonical_q(7, 2), lens_canonical_q(7, 5)
    (2, 2, 3)

    References
    ----------
    K. Reidemeister, Abh. Math. Sem. Hamburg 11 (1935) 102-109;
    E. J. Brody, Ann. of Math. 71 (1960) 163-184.
    """
    if p < 2 or gcd(p, q) != 1:
        raise InvalidSeifertDataError(
            f"L({p},{q}) is not a lens space with p >= 2: need p >= 2 and gcd(p, q) = 1"
        )
    q %= p
    return min(q, _inv_mod(q, p))


def _smith(rows: list[list[int]]) -> tuple[list[int], list[list[int]]]:
    """Smith normal form ``U R V = D`` of a square integer matrix.

    Returns the diagonal ``d`` (non-negative, ``d_k | d_{k+1}``) and the matrix
    ``W = V^{-T}``, whose columns ``W e_k`` are generators (in the original
    coordinates) of the cyclic factors of ``Z^m / (row space of R)``.
    """
    m = len(rows)
    A = [list(r) for r in rows]
    # We track V^{-1} as a matrix Vi, with column ops on A mirrored as row ops on Vi.
    Vi = [[int(i == j) for j in range(m)] for i in range(m)]

    def col_swap(i: int, j: int) -> None:
        for r in A:
            r[i], r[j] = r[j], r[i]
        Vi[i], Vi[j] = Vi[j], Vi[i]

    def col_add(src: int, dst: int, k: int) -> None:  # col_dst += k col_src
        for r in A:
            r[dst] += k * r[src]
        # V -> V E with E = I + k e_src e_dst^T; V^{-1} -> E^{-1} V^{-1}: row_src -= k row_dst
        Vi[src] = [a - k * b for a, b in zip(Vi[src], Vi[dst])]

    def col_neg(i: int) -> None:
        for r in A:
            r[i] = -r[i]
        Vi[i] = [-a for a in Vi[i]]

    for t in range(m):
        while True:
            nz = [(abs(A[i][j]), i, j) for i in range(t, m) for j in range(t, m) if A[i][j]]
            if not nz:
                d = [abs(A[i][i]) for i in range(m)]
                return _finish_smith(d, Vi)
            _, i0, j0 = min(nz)
            A[t], A[i0] = A[i0], A[t]
            col_swap(t, j0)
            piv = A[t][t]
            done = True
            for i in range(t + 1, m):
                k = A[i][t] // piv
                if k:
                    A[i] = [a - k * b for a, b in zip(A[i], A[t])]
                if A[i][t]:
                    done = False
            for j in range(t + 1, m):
                k = A[t][j] // piv
                if k:
                    col_add(t, j, -k)
                if A[t][j]:
                    done = False
            if not done:
                continue
            bad = [(i, j) for i in range(t + 1, m) for j in range(t + 1, m) if A[i][j] % piv]
            if bad:
                i, _ = bad[0]
                A[t] = [a + b for a, b in zip(A[t], A[i])]
                continue
            if piv < 0:
                col_neg(t)
            break
    d = [abs(A[i][i]) for i in range(m)]
    return _finish_smith(d, Vi)


def _finish_smith(d: list[int], Vi: list[list[int]]) -> tuple[list[int], list[list[int]]]:
    # W = V^{-T}: columns of W are rows of V^{-1}.
    m = len(d)
    W = [[Vi[k][i] for k in range(m)] for i in range(m)]
    return d, W


def _solve(M: list[list[Fraction]], B: list[list[Fraction]]) -> list[list[Fraction]]:
    """Solve ``M X = B`` exactly (``M`` square, invertible)."""
    m = len(M)
    A = [list(map(Fraction, M[i])) + list(map(Fraction, B[i])) for i in range(m)]
    w = len(A[0])
    for c in range(m):
        p = next(r for r in range(c, m) if A[r][c] != 0)
        A[c], A[p] = A[p], A[c]
        pv = A[c][c]
        A[c] = [x / pv for x in A[c]]
        for r in range(m):
            if r != c and A[r][c] != 0:
                f = A[r][c]
                A[r] = [x - f * y for x, y in zip(A[r], A[c])]
    return [row[m:w] for row in A]


class _Diagram:
    """Star-shaped rational surgery diagram of ``M(0; b; fibers)`` (private).

    Components: ``U_0`` with coefficient ``-b/1`` and meridians ``m_i`` with
    ``a_i/b_i``.  ``H_1`` is generated by the meridians ``e_0, e_1, ...`` of the
    components, with one relation ``p_j e_j + q_j sum_k lk_jk e_k`` per
    component; the linking form is ``-x^T Lambda^{-1} y`` with the rational
    linking matrix ``Lambda`` (diagonal ``p_j/q_j``).
    """

    def __init__(self, b: int, fibers: Sequence[tuple[int, int]]):
        # a fibre (1, 0) has coefficient infinity: no surgery, no component
        self.position: list[int | None] = []
        kept = []
        for f in fibers:
            if f[1] != 0:
                kept.append(f)
                self.position.append(len(kept))
            else:
                self.position.append(None)
        self.fibers = kept
        n = len(self.fibers)
        R = [[-b] + [1] * n]
        for i, (a, bi) in enumerate(self.fibers):
            row = [0] * (n + 1)
            row[0] = bi
            row[i + 1] = a
            R.append(row)
        self.R = R
        self.Dq = [1] + [bi for _, bi in self.fibers]

    def homology(self) -> tuple[list[int], list[list[int]]]:
        return _smith(self.R)

    def inverse_linking(self) -> list[list[Fraction]]:
        """``Lambda^{-1} = R^{-1} D_q`` (requires ``det R != 0``)."""
        m = len(self.R)
        D = [[Fraction(self.Dq[i]) if i == j else Fraction(0) for j in range(m)] for i in range(m)]
        return _solve([list(map(Fraction, r)) for r in self.R], D)


# ---------------------------------------------------------------------------
# Linking form
# ---------------------------------------------------------------------------
@dataclass(frozen=True)
class LinkingForm:
    """The torsion linking form ``H_1 x H_1 -> Q/Z`` of a rational homology sphere.

    Attributes
    ----------
    orders : tuple of int
        Invariant factors ``d_1 | d_2 | ...`` (all ``> 1``) of ``H_1``.
    matrix : tuple of tuple of Fraction
        ``matrix[k][l] = lk(g_k, g_l) mod 1`` in ``[0, 1)`` on the generators
        ``g_k`` of the cyclic factors.

    Examples
    --------
    >>> SeifertManifold.from_lens(7, 2).linking_form()
    LinkingForm(orders=(7,), matrix=((Fraction(2, 7),),))

    References
    ----------
    H. Seifert, Verschlingungsinvarianten, Sitzungsber. Preuss. Akad. Wiss. 26
    (1933) 811-828; C. T. C. Wall, Topology 2 (1963) 281-298.
    """

    orders: tuple[int, ...]
    matrix: tuple[tuple[Fraction, ...], ...]

    def value(self, x: Sequence[int], y: Sequence[int]) -> Fraction:
        """``lk(x, y) mod 1`` for elements given in generator coordinates."""
        s = sum(
            (Fraction(xi * yj) * self.matrix[i][j] for i, xi in enumerate(x) for j, yj in enumerate(y)),
            Fraction(0),
        )
        return s - (s.numerator // s.denominator)

    @property
    def size(self) -> int:
        return prod(self.orders)

    def is_isometric(self, other: "LinkingForm", max_size: int = 400) -> bool:
        """Whether the two forms are isometric (exhaustive search over images of generators).

        Raises :class:`SizeLimitError` when ``|H_1| > max_size``.

        Examples
        --------
        >>> a = SeifertManifold.from_lens(7, 1).linking_form()
        >>> b = SeifertManifold.from_lens(7, 2).linking_form()
        >>> a.is_isometric(b)   # 2 = 3^2 mod 7: homotopy equivalent (Whitehead 1941)
        True
        """
        if self.orders != other.orders:
            return False
        n = self.size
        if n > max_size:
            raise SizeLimitError(
                f"isometry test of linking forms on a group of order {n} is too large"
                f" (limit {max_size})"
            )
        if n == 1:
            return True
        elems = list(itertools.product(*[range(d) for d in other.orders]))
        k = len(self.orders)

        def order_of(v: tuple[int, ...]) -> int:
            o = 1
            for vi, d in zip(v, other.orders):
                g = gcd(vi, d)
                o = o * (d // g) // gcd(o, d // g)
            return o

        cands = []
        for i, d in enumerate(self.orders):
            want = self.matrix[i][i]
            cands.append([v for v in elems if d % order_of(v) == 0 and order_of(v) == d
                          and other.value(v, v) == want])
        for images in itertools.product(*cands):
            ok = all(
                other.value(images[i], images[j]) == self.matrix[i][j]
                for i in range(k) for j in range(i + 1, k)
            )
            if not ok:
                continue
            # bijective: the images generate everything
            span = {tuple(0 for _ in other.orders)}
            for img in images:
                new = set(span)
                for s in span:
                    cur = s
                    for _ in range(order_of(img)):
                        cur = tuple((c + v) % d for c, v, d in zip(cur, img, other.orders))
                        new.add(cur)
                span = new
            if len(span) == n:
                return True
        return False


# ---------------------------------------------------------------------------
# Recognition result
# ---------------------------------------------------------------------------
@dataclass(frozen=True)
class Recognition:
    """What a Seifert manifold was recognised as.

    Attributes
    ----------
    name : str or None
        ``"S^3"``, ``"S^2xS^1"``, ``"L(p,q)"`` (oriented canonical ``q``),
        ``"Sigma(a1,...,an)"`` or ``"-Sigma(...)"`` (the orientation reversed
        from the link of a singularity), or ``None``.
    kind : str
        A short description, e.g. ``"lens space"``, ``"prism manifold"``,
        ``"Brieskorn homology sphere"``, ``"Seifert manifold"``.
    geometry : str
        One of Thurston's geometries read off from ``e`` and the orbifold Euler
        characteristic (Scott, Bull. LMS 15 (1983), Table 4.1).
    """

    name: str | None
    kind: str
    geometry: str


# ---------------------------------------------------------------------------
# The manifold
# ---------------------------------------------------------------------------
def _check_int(name: str, v: object) -> int:
    if isinstance(v, bool) or not isinstance(v, int):
        raise InvalidSeifertDataError(f"Seifert invariant {name}={v!r} must be an integer")
    if abs(v) > MAX_FIBER_ORDER:
        raise SizeLimitError(f"Seifert invariant {name}={v} is too large (limit {MAX_FIBER_ORDER})")
    return v


def _check_genus(g: object) -> int:
    if isinstance(g, bool) or not isinstance(g, int):
        raise InvalidSeifertDataError(f"base genus g={g!r} must be an integer >= 0")
    if g < 0:
        raise InvalidSeifertDataError(
            f"base genus g = {g} is negative: the base must be a closed orientable surface of genus"
            " g >= 0 (a negative genus stands for a non-orientable base in some notations;"
            " non-orientable bases are not supported)"
        )
    if g > MAX_GENUS:
        raise SizeLimitError(f"base genus g = {g} is too large (limit {MAX_GENUS})")
    return g


@dataclass(frozen=True, repr=False)
class SeifertManifold:
    """The oriented Seifert manifold ``M(g; b; (a_1, b_1), ..., (a_n, b_n))`` (base genus ``g``).

    See the module docstring for the orientation convention and the dictionary
    ``M(0; b; (a_i, b_i)) = X(a_1/b_1, ..., a_n/b_n, 1/b)`` with the surgery
    notation of Lawrence and Rozansky.

    Parameters
    ----------
    b : int
        The integer Seifert invariant.
    fibers : sequence of pairs of int
        ``(a_i, b_i)`` with ``a_i >= 1`` and ``gcd(a_i, b_i) = 1``; lists are
        converted to tuples.  Fibres with ``a_i = 1`` are allowed (they are
        regular and can be absorbed into ``b``).
    genus : int, default 0
        Genus ``g >= 0`` of the (orientable) base surface (module docstring).

    Examples
    --------
    >>> M = SeifertManifold(-1, [(2, 1), (3, 1), (5, 1)])
    >>> M.euler, M.h1_order, M.recognise()
    (Fraction(-1, 30), 1, 'Sigma(2,3,5)')
    >>> M.surgery_presentation()
    ((2, 1), (3, 1), (5, 1), (1, -1))
    >>> SeifertManifold(0, [(2, 5)]).normal_form()
    SeifertManifold(b=2, fibers=((2, 1),))
    >>> T = SeifertManifold(0, (), genus=2)          # S^1 x Sigma_2
    >>> T, T.homology(), T.betti_number
    (SeifertManifold(b=0, fibers=(), genus=2), (0, 0, 0, 0, 0), 5)

    References
    ----------
    H. Seifert, Acta Math. 60 (1933); Neumann and Raymond, LNM 664 (1978);
    P. Orlik, Seifert Manifolds, LNM 291 (1972).
    """

    b: int
    fibers: tuple[tuple[int, int], ...] = field(default_factory=tuple)
    genus: int = 0

    def __post_init__(self) -> None:
        _check_int("b", self.b)
        _check_genus(self.genus)
        try:
            raw = list(self.fibers)
        except TypeError:
            raise InvalidSeifertDataError(
                f"fibers={self.fibers!r} must be a sequence of pairs (a_i, b_i)"
            ) from None
        if len(raw) > MAX_FIBERS:
            raise SizeLimitError(f"{len(raw)} fibres is too many (limit {MAX_FIBERS})")
        out = []
        for k, f in enumerate(raw, start=1):
            try:
                a, bi = f
            except (TypeError, ValueError):
                raise InvalidSeifertDataError(
                    f"fibre {k} = {f!r} is not a pair (a_{k}, b_{k}) of integers"
                ) from None
            _check_int(f"a_{k}", a)
            _check_int(f"b_{k}", bi)
            if a < 1:
                raise InvalidSeifertDataError(
                    f"fibre {k} = ({a},{bi}): the order a_{k} = {a} must be >= 1"
                    " (a_i = 0 would be a reducible filling, not a Seifert fibre)"
                )
            if gcd(a, bi) != 1:
                raise InvalidSeifertDataError(
                    f"fibre {k} = ({a},{bi}): gcd(a_{k}, b_{k}) = {gcd(a, bi)} but must be 1"
                )
            out.append((a, bi))
        object.__setattr__(self, "fibers", tuple(out))

    # ------------------------------------------------------------ invariants
    @property
    def euler(self) -> Fraction:
        """Euler number ``e = -(b + sum b_i/a_i)``.

        >>> SeifertManifold(0, [(2, 1), (3, -1)]).euler   # S^3, fibre T(2,3)
        Fraction(-1, 6)
        """
        return -(Fraction(self.b) + sum((Fraction(bi, a) for a, bi in self.fibers), Fraction(0)))

    @property
    def orbifold_euler_characteristic(self) -> Fraction:
        """``chi = 2 - 2g - sum (1 - 1/a_i)`` of the base orbifold.

        >>> SeifertManifold(-1, [(2, 1), (3, 1), (5, 1)]).orbifold_euler_characteristic
        Fraction(1, 30)
        >>> SeifertManifold(-1, [(2, 1)], genus=1).orbifold_euler_characteristic
        Fraction(-1, 2)
        """
        return 2 - 2 * self.genus - sum((1 - Fraction(1, a) for a, _ in self.fibers), Fraction(0))

    @property
    def h1_order(self) -> int:
        """``|H_1(M; Z)| = |a_1 ... a_n e|``, ``0`` when ``H_1`` is infinite (``e = 0`` or ``g >= 1``).

        >>> SeifertManifold.from_lens(7, 2).h1_order
        7
        >>> SeifertManifold(-1, [(2, 1), (3, 1)], genus=1).h1_order
        0
        """
        if self.genus:
            return 0
        v = abs(prod(a for a, _ in self.fibers) * self.euler)
        assert v.denominator == 1
        return int(v)

    @property
    def is_rational_homology_sphere(self) -> bool:
        """``e != 0`` and base of genus 0."""
        return self.genus == 0 and self.euler != 0

    @property
    def betti_number(self) -> int:
        """First Betti number ``b_1 = 2g`` (``e != 0``) or ``2g + 1`` (``e = 0``).

        From ``H_1 = Z^(2g) + H_1(M(0; b; (a_i, b_i)))`` (module docstring; Orlik, LNM 291
        (1972) §5.2).

        >>> SeifertManifold(-1, [(2, 1), (3, 1)], genus=1).betti_number
        2
        >>> SeifertManifold(0, (), genus=2).betti_number     # S^1 x Sigma_2
        5
        """
        return 2 * self.genus + (1 if self.euler == 0 else 0)

    @property
    def is_integral_homology_sphere(self) -> bool:
        return self.h1_order == 1

    @property
    def exceptional_orders(self) -> tuple[int, ...]:
        """Sorted orders ``a_i > 1`` of the exceptional fibres."""
        return tuple(sorted(a for a, _ in self.fibers if a > 1))

    def homology(self) -> tuple[int, ...]:
        """Invariant factors of ``H_1`` (``0`` for a free summand), trivial factors dropped.

        >>> SeifertManifold(0, [(2, 1), (2, 1), (2, 1), (2, 1)]).homology()   # e = -2
        (2, 2, 8)
        >>> SeifertManifold(-2, [(2, 1), (2, 1), (2, 1), (2, 1)]).homology()  # e = 0
        (2, 2, 0)
        >>> SeifertManifold(0, [(2, 1), (2, 1)], genus=1).homology()  # Z^2 + H_1(M(0; 0; (2,1), (2,1)))
        (4, 0, 0)
        """
        d, _ = _Diagram(self.b, self.fibers).homology()
        free = [x for x in d if x == 0] + [0] * (2 * self.genus)
        tors = sorted(x for x in d if x > 1)
        return tuple(tors + free)

    def linking_form(self) -> LinkingForm | None:
        """Torsion linking form (``None`` when ``H_1`` is infinite, in particular for ``g >= 1``).

        The form is ``-x^T Lambda^{-1} y mod 1`` with ``Lambda`` the rational
        linking matrix of the surgery diagram (module docstring).  For
        ``L(p, q)`` it is ``q/p`` on the class of the meridian of the surgered
        unknot.

        Examples
        --------
        >>> SeifertManifold(-1, [(2, 1), (3, 1), (5, 1)]).linking_form()
        LinkingForm(orders=(), matrix=())

        References
        ----------
        Seifert (1933); Kirby, LNM 1374 (1989), linking numbers in surgered
        manifolds.
        """
        if self.euler == 0 or self.genus:
            return None
        diag = _Diagram(self.b, self.fibers)
        d, W = diag.homology()
        Linv = diag.inverse_linking()
        m = len(d)
        idx = [k for k in range(m) if d[k] > 1]
        idx.sort(key=lambda k: d[k])
        gens = [[W[i][k] for i in range(m)] for k in idx]

        def lk(x: list[int], y: list[int]) -> Fraction:
            s = -sum((x[i] * Linv[i][j] * y[j] for i in range(m) for j in range(m)), Fraction(0))
            return s - (s.numerator // s.denominator)

        mat = tuple(tuple(lk(g, h) for h in gens) for g in gens)
        return LinkingForm(tuple(d[k] for k in idx), mat)

    # ----------------------------------------------------------- normal form
    def normal_form(self) -> "SeifertManifold":
        """Unnormalised invariants -> ``0 < b_i < a_i``, ``a_i = 1`` absorbed, sorted.

        Uses the moves ``(a_i, b_i) -> (a_i, b_i + k a_i)``, ``b -> b - k``
        and removal of ``(1, 0)`` fibres, which preserve the oriented manifold
        and its fibration (Seifert 1933).

        >>> SeifertManifold(0, [(5, -4), (3, 2), (1, 7)]).normal_form()
        SeifertManifold(b=6, fibers=((3, 2), (5, 1)))
        """
        b = self.b
        out = []
        for a, bi in self.fibers:
            k, r = divmod(bi, a)
            b += k
            if a > 1:
                out.append((a, r))
        return SeifertManifold(b, tuple(sorted(out)), self.genus)

    def twist(self, i: int, k: int) -> "SeifertManifold":
        """The move ``(a_i, b_i) -> (a_i, b_i + k a_i)``, ``b -> b - k`` (same manifold).

        >>> SeifertManifold(0, [(2, 1)]).twist(0, 1)
        SeifertManifold(b=-1, fibers=((2, 3),))
        """
        self._check_index(i)
        f = list(self.fibers)
        a, bi = f[i]
        f[i] = (a, bi + k * a)
        return SeifertManifold(self.b - k, tuple(f), self.genus)

    def with_regular_fiber(self, k: int = 0) -> "SeifertManifold":
        """Add a fibre ``(1, k)`` and change ``b`` by ``-k`` (same manifold)."""
        return SeifertManifold(self.b - k, self.fibers + ((1, k),), self.genus)

    def permute(self, order: Sequence[int]) -> "SeifertManifold":
        """Reorder the fibres (same manifold)."""
        if sorted(order) != list(range(len(self.fibers))):
            raise InvalidSeifertDataError(f"{list(order)!r} is not a permutation of the fibre indices")
        return SeifertManifold(self.b, tuple(self.fibers[j] for j in order), self.genus)

    def is_equivalent(self, other: "SeifertManifold") -> bool:
        """Same normal form, i.e. orientation- and fibre-preservingly homeomorphic."""
        return self.normal_form() == other.normal_form()

    def reverse(self) -> "SeifertManifold":
        """Orientation reversal ``M(0; -b; (a_i, -b_i))``.

        >>> SeifertManifold(-1, [(2, 1), (3, 1), (5, 1)]).reverse().recognise()
        '-Sigma(2,3,5)'
        """
        return SeifertManifold(-self.b, tuple((a, -bi) for a, bi in self.fibers), self.genus)

    # --------------------------------------------------- surgery and gluing
    def surgery_presentation(self) -> tuple[tuple[int, int], ...]:
        """``(p_j, q_j)`` with ``M = X(p_1/q_1, ..., p_n/q_n)`` (Lawrence-Rozansky).

        The central unknot is 0-framed; the integer ``b`` becomes a last entry
        ``(1, b)`` when ``b != 0``.  ``H = P sum q_j/p_j = -a_1...a_n e``.

        >>> SeifertManifold.from_lens(7, 2).surgery_presentation()
        ((2, 7),)

        Base genus ``g >= 1`` has no such presentation (``b_1 >= 2``) and is refused.

        References
        ----------
        R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287-314.
        """
        if self.genus:
            raise InvalidSeifertDataError(
                f"{self} has base genus {self.genus}: it is not surgery on an unknot and its meridians"
                " (that presentation exists for base genus 0 only)"
            )
        out = tuple(self.fibers)
        if self.b != 0:
            out = out + ((1, self.b),)
        return out

    def gluing_matrices(self) -> tuple[tuple[tuple[int, int], tuple[int, int]], ...]:
        """``U_i = [[a_i, -y_i], [b_i, x_i]]`` with ``a_i x_i + b_i y_i = 1``, ``0 <= y_i < a_i``.

        Columns: ``(a_i, b_i)`` is the meridian of the ``i``-th solid torus and
        ``(-y_i, x_i)`` the longitude ``-y_i mu_i + x_i h`` that frames its core
        in the ``(mu_i, h)`` basis; the core ``c_i`` is oriented so that a
        regular fibre is homologous to ``a_i c_i`` near it (CONVENTIONS §7).

        >>> SeifertManifold(0, [(2, 1), (3, -1)]).gluing_matrices()
        (((2, -1), (1, 0)), ((3, -2), (-1, 1)))
        """
        out = []
        for a, bi in self.fibers:
            y = _inv_mod(bi, a) if a > 1 else 0
            x, r = divmod(1 - bi * y, a)
            assert r == 0
            out.append(((a, -y), (bi, x)))
        return tuple(out)

    def core_self_linking(self, i: int) -> Fraction:
        """Self-linking of the core ``c_i`` with the framing of :meth:`gluing_matrices`.

        Equal to ``-y_i/a_i - 1/(a_i^2 e)``; adding the meridian to the framing
        curve adds 1.  For a regular fibre (``a_i = 1, b_i = 0``) this is the
        fibre framing ``-1/e``.  Requires ``e != 0``.

        >>> SeifertManifold(0, [(2, 1), (3, -1)]).core_self_linking(0)
        Fraction(1, 1)
        """
        self._check_index(i)
        e = self._require_qhs("a self-linking number")
        a = self.fibers[i][0]
        y = -self.gluing_matrices()[i][0][1]
        return Fraction(-y, a) - 1 / (a * a * e)

    @property
    def fiber_framing(self) -> Fraction:
        """Linking number of two regular fibres, ``-1/e`` (the fibre framing).

        >>> SeifertManifold(0, [(2, 1), (3, -1)]).fiber_framing
        Fraction(6, 1)
        """
        return -1 / self._require_qhs("the fibre framing")

    def fiber_linking(self) -> tuple[tuple[Fraction, ...], ...]:
        """Linking matrix of ``[h, c_1, ..., c_n]``: regular fibre and cores.

        Off-diagonal: ``lk(h, c_i) = -1/(e a_i)``, ``lk(c_i, c_j) = -1/(e a_i a_j)``;
        diagonal: fibre framing of ``h`` and :meth:`core_self_linking`.

        >>> [[int(x) for x in r] for r in SeifertManifold(0, [(2, 1), (3, -1)]).fiber_linking()]
        [[6, 3, 2], [3, 1, 1], [2, 1, 0]]
        """
        e = self._require_qhs("linking numbers")
        orders = [Fraction(1)] + [Fraction(a) for a, _ in self.fibers]
        n = len(orders)
        rows = []
        for i in range(n):
            row = []
            for j in range(n):
                if i == j:
                    row.append(self.fiber_framing if i == 0 else self.core_self_linking(i - 1))
                else:
                    row.append(-1 / (e * orders[i] * orders[j]))
            rows.append(tuple(row))
        return tuple(rows)

    def fiber_homology_classes(self) -> tuple[tuple[int, ...], tuple[tuple[int, ...], ...]]:
        """Classes of the regular fibre and of each core in ``H_1``.

        Returns ``(h, (c_1, ..., c_n))`` in the coordinates of the cyclic
        factors listed by :meth:`homology_factors` (one entry per factor; a
        free factor is listed last with order 0).  The core ``c_i`` is
        homologous to its framing curve ``-y_i mu_i + x_i h``.

        >>> M = SeifertManifold.from_lens(7, 2)
        >>> M.homology_factors(), M.fiber_homology_classes()
        ((7,), ((1,), ((4,),)))
        """
        diag = _Diagram(self.b, self.fibers)
        d, W = diag.homology()
        m = len(d)
        # class of x in factor k is (V^T x)_k, and W = V^{-T}, so V^T = W^{-1}
        Winv = _solve([list(map(Fraction, r)) for r in W],
                      [[Fraction(int(i == j)) for j in range(m)] for i in range(m)])
        keep = sorted((k for k in range(m) if d[k] != 1), key=lambda k: (d[k] == 0, d[k]))

        def cls(x: list[int]) -> tuple[int, ...]:
            out = []
            for k in keep:
                v = sum((Winv[k][i] * x[i] for i in range(m)), Fraction(0))
                assert v.denominator == 1
                out.append(int(v) % d[k] if d[k] else int(v))
            return tuple(out) + (0,) * (2 * self.genus)   # fibres lie in the genus-0 part

        h = [0] * m
        h[0] = 1
        cores = []
        for i, U in enumerate(self.gluing_matrices()):
            x = [0] * m
            x[0] = U[1][1]
            pos = diag.position[i]
            if pos is not None:
                x[pos] = U[0][1]
            cores.append(cls(x))
        return cls(h), tuple(cores)

    def homology_factors(self) -> tuple[int, ...]:
        """Orders of the cyclic factors used by :meth:`fiber_homology_classes` (0 = Z)."""
        d, _ = _Diagram(self.b, self.fibers).homology()
        keep = sorted((x for x in d if x != 1), key=lambda x: (x == 0, x))
        return tuple(keep) + (0,) * (2 * self.genus)

    # ------------------------------------------------------------ recognise
    def lens_parameters(self) -> tuple[int, int] | None:
        """``(p, q)`` with ``M = L(p, q)`` (``L(1, 0) = S^3``, ``L(0, 1) = S^2 x S^1``) if
        at most two fibres are exceptional, else ``None``.

        Computed by expanding one fibre into an integer chain and slam-dunking
        down to one rationally framed unknot (Kirby LNM 1374; Rolfsen 1976):
        ``-p/q`` surgery on the unknot is ``L(p, q)``.

        >>> SeifertManifold(0, [(2, 1), (3, 1)]).lens_parameters()   # X(2, 3): +5 on the unknot
        (5, 4)
        """
        N = self.normal_form()
        if len(N.fibers) > 2 or N.genus:
            return None
        b = N.b
        if not N.fibers:
            num, den = -b, 1
        else:
            a2, b2 = N.fibers[-1]
            num, den = -(b * a2 + b2), a2  # U_0 after absorbing m_2
            if len(N.fibers) == 2:
                a1, b1 = N.fibers[0]
                x, y = a1, b1  # a1/b1 = c_1 - 1/(c_2 - ...)
                while True:
                    c = -((-x) // y)
                    num, den = c * num - den, num
                    x, y = y, c * y - x
                    if y == 0:
                        break
        if den < 0:
            num, den = -num, -den
        p = abs(num)
        if p == 0:
            return (0, 1)
        if p == 1:
            return (1, 0)
        q = (-den * (1 if num > 0 else -1)) % p
        return (p, q)

    def classify(self) -> Recognition:
        """Recognise the manifold; see :class:`Recognition`.

        >>> SeifertManifold(-1, [(2, 1), (2, 1), (3, 1)]).classify().kind
        'prism manifold'
        """
        N = self.normal_form()
        e = N.euler
        chi = N.orbifold_euler_characteristic
        if chi > 0:
            geom = "S^2xR" if e == 0 else "S^3"
        elif chi == 0:
            geom = "E^3" if e == 0 else "Nil"
        else:
            geom = "H^2xR" if e == 0 else "SL2"
        if N.genus:
            if not N.fibers and e == 0:
                return Recognition(f"S^1xSigma_{N.genus}", f"product S^1 x Sigma_{N.genus}", geom)
            if not N.fibers:
                return Recognition(None, f"circle bundle over Sigma_{N.genus}", geom)
            return Recognition(None, f"Seifert manifold over Sigma_{N.genus}", geom)
        lp = N.lens_parameters()
        if lp is not None:
            p, q = lp
            if p == 0:
                return Recognition("S^2xS^1", "S^2 x S^1", "S^2xR")
            if p == 1:
                return Recognition("S^3", "3-sphere", "S^3")
            return Recognition(f"L({p},{lens_canonical_q(p, q)})", "lens space", "S^3")
        orders = N.exceptional_orders
        if N.h1_order == 1:
            tag = ",".join(map(str, orders))
            name = f"Sigma({tag})" if e < 0 else f"-Sigma({tag})"
            return Recognition(name, "Brieskorn homology sphere", geom)
        if geom == "S^3":
            if len(orders) == 3 and orders[:2] == (2, 2):
                return Recognition(None, "prism manifold", geom)
            kinds = {(2, 3, 3): "tetrahedral", (2, 3, 4): "octahedral", (2, 3, 5): "icosahedral"}
            return Recognition(None, f"spherical manifold ({kinds[orders]} type)", geom)
        return Recognition(None, "Seifert manifold", geom)

    def recognise(self) -> str | None:
        """Name of the manifold if it is a named one (see :class:`Recognition`).

        >>> SeifertManifold.from_lens(7, 4).recognise()
        'L(7,2)'
        >>> SeifertManifold(1, []).recognise(), SeifertManifold(0, []).recognise()
        ('S^3', 'S^2xS^1')
        """
        return self.classify().name

    # --------------------------------------------------------- constructors
    @classmethod
    def from_lens(cls, p: int, q: int) -> "SeifertManifold":
        """``L(p, q) = X(q/p) = M(0; 0; (q, p))`` (``-p/q`` surgery on the unknot).

        ``q`` is reduced to ``1 <= q <= p``; ``L(1, q) = S^3``; ``L(0, +-1) = S^2 x S^1``.

        >>> SeifertManifold.from_lens(5, 2)
        SeifertManifold(b=0, fibers=((2, 5),))

        References
        ----------
        D. Rolfsen, Knots and Links (1976), ch. 9; Lawrence-Rozansky (1999).
        """
        for name, v in (("p", p), ("q", q)):
            if isinstance(v, bool) or not isinstance(v, int):
                raise InvalidSeifertDataError(f"lens parameter {name}={v!r} must be an integer")
        if p < 0:
            raise InvalidSeifertDataError(f"L({p},{q}): p = {p} must be >= 0 (use L(|p|, -q))")
        if gcd(p, q) != 1:
            raise InvalidSeifertDataError(f"L({p},{q}): gcd(p, q) = {gcd(p, q)} but must be 1")
        if p == 0:
            return cls(0, ((1, 0),))
        qq = q % p or p
        return cls(0, ((qq, p),))

    @classmethod
    def from_brieskorn(cls, *a: int) -> "SeifertManifold":
        """``Sigma(a_1, ..., a_n)``, oriented as the link of ``sum z_i^{a_i} = 0``.

        Needs pairwise coprime ``a_i >= 1``; the result has ``b = 0`` before
        normalisation and ``e = -1/(a_1 ... a_n)`` (Neumann-Raymond 1978).

        >>> SeifertManifold.from_brieskorn(2, 3, 5).normal_form()
        SeifertManifold(b=-1, fibers=((2, 1), (3, 1), (5, 1)))

        References
        ----------
        E. Brieskorn, Invent. Math. 2 (1966); Neumann-Raymond, LNM 664 (1978).
        """
        if len(a) == 1 and isinstance(a[0], (tuple, list)):
            a = tuple(a[0])
        if len(a) < 1:
            raise InvalidSeifertDataError("Sigma() needs at least one order a_i")
        for k, x in enumerate(a, start=1):
            if isinstance(x, bool) or not isinstance(x, int) or x < 1:
                raise InvalidSeifertDataError(f"Brieskorn order a_{k}={x!r} must be an integer >= 1")
        for i, j in itertools.combinations(range(len(a)), 2):
            if gcd(a[i], a[j]) != 1:
                raise InvalidSeifertDataError(
                    f"Sigma{tuple(a)}: a_{i+1}={a[i]} and a_{j+1}={a[j]} are not coprime;"
                    " a Brieskorn homology sphere needs pairwise coprime orders"
                )
        A = prod(a)
        fibers = [(x, _inv_mod(A // x, x) if x > 1 else 0) for x in a]
        s = sum((Fraction(bi, x) for x, bi in fibers), Fraction(0))
        b = Fraction(1, A) - s
        assert b.denominator == 1
        return cls(int(b), tuple(fibers))

    @classmethod
    def parse(cls, text: "str | SeifertManifold") -> "SeifertManifold":
        """Parse ``S^3``, ``S^2xS^1``, ``L(p,q)``, ``Sigma(a1,...)``, ``M(0; b; (a1,b1), ...)``.

        A leading ``-`` reverses the orientation.  ``S^3`` is ``M(0; 1)``
        (the Hopf fibration, positive Hopf fibres).

        >>> SeifertManifold.parse("M(0; -1; (2,1), (3,1), (5,1))").recognise()
        'Sigma(2,3,5)'
        >>> SeifertManifold.parse("L(7,4)").recognise()
        'L(7,2)'
        """
        return parse_space(text)

    # --------------------------------------------------------------- misc
    def _check_index(self, i: int) -> None:
        if isinstance(i, bool) or not isinstance(i, int) or not 0 <= i < len(self.fibers):
            raise InvalidSeifertDataError(
                f"fibre index {i!r} out of range: {self} has fibres 0..{len(self.fibers) - 1}"
            )

    def _require_qhs(self, what: str) -> Fraction:
        if self.genus:
            raise InvalidSeifertDataError(
                f"{what} of {self} is not defined here: base genus {self.genus} >= 1, so H_1 is"
                " infinite (needs a rational homology sphere: base genus 0 and e != 0)"
            )
        e = self.euler
        if e == 0:
            raise InvalidSeifertDataError(
                f"{what} of {self} is not defined: e = 0, so H_1 is infinite"
                " (needs a rational homology sphere, e != 0)"
            )
        return e

    def __str__(self) -> str:
        fib = "".join(f"; ({a},{bi})" if k == 0 else f", ({a},{bi})"
                      for k, (a, bi) in enumerate(self.fibers))
        return f"M({self.genus}; {self.b}{fib})"

    def __repr__(self) -> str:
        g = f", genus={self.genus}" if self.genus else ""
        return f"SeifertManifold(b={self.b!r}, fibers={self.fibers!r}{g})"


# ---------------------------------------------------------------------------
# refilling a fibre (used by surgery and lens spaces)
# ---------------------------------------------------------------------------
def _refill(
    M: "SeifertManifold", i: int, P: int, Q: int, target_self_linking: Fraction | None = None
) -> tuple[int, int]:
    """Invariant after ``P/Q`` surgery on core ``i`` (relative to the framing of self-linking
    ``target_self_linking``; ``None`` = the gluing-matrix framing).  Sign normalised so that
    the first entry is ``>= 0``."""
    (a, my), (b, x) = M.gluing_matrices()[i]
    if target_self_linking is not None:
        k = target_self_linking - M.core_self_linking(i)
        if k.denominator != 1:
            raise InvalidSeifertDataError(
                f"the framing of self-linking {target_self_linking} does not exist on core {i} of {M}"
                f" (self-linkings of its framings are {M.core_self_linking(i)} + integers)"
            )
        P = P + int(k) * Q
    alpha, beta = a * P + my * Q, b * P + x * Q
    if alpha < 0 or (alpha == 0 and beta < 0):
        alpha, beta = -alpha, -beta
    return alpha, beta


# ---------------------------------------------------------------------------
# parsing
# ---------------------------------------------------------------------------
_INT = r"[+-]?\d+"
_RE_S3 = re.compile(r"^S\^?3$", re.I)
_RE_S2S1 = re.compile(r"^(S\^?2[x×]S\^?1|S\^?1[x×]S\^?2)$", re.I)
_RE_LENS = re.compile(rf"^L\(({_INT}),({_INT})\)$", re.I)
_RE_SIGMA = re.compile(rf"^(?:SIGMA|Σ)\(({_INT}(?:,{_INT})*)\)$", re.I)
_RE_M = re.compile(r"^M\((.*)\)$", re.I)
_RE_PAIR = re.compile(rf"^\(({_INT}),({_INT})\)$")

_SPACE_HELP = (
    "write S^3, S^2xS^1, L(p,q), Sigma(a1,a2,a3) or M(g; b; (a1,b1), ..., (an,bn)) (base genus g >= 0),"
    " optionally with a leading '-' for the reversed orientation"
)
_RE_NONORIENTABLE = re.compile(r"^[nN]\d+$")


def parse_space(text: "str | SeifertManifold") -> SeifertManifold:
    """Parse the usual notation for a Seifert manifold with orientable base.

    Parameters
    ----------
    text : str
        ``S^3``, ``S^2xS^1``, ``L(p,q)``, ``Sigma(a1,...,an)``,
        ``M(g; b; (a1,b1), ..., (an,bn))`` with base genus ``g >= 0`` (also
        ``M(b; (a1,b1), ...)`` for ``g = 0``; ``M(2; 0)`` is ``S^1 x Sigma_2``), each
        optionally preceded by ``-`` (orientation reversal).  Spaces are ignored.
        A genus written ``n1``, ``n2``, ... (non-orientable base) or a negative
        genus is refused.

    Returns
    -------
    SeifertManifold

    Raises
    ------
    ParseError
        The text is not in one of these forms.
    InvalidSeifertDataError
        The numbers do not describe a Seifert manifold (e.g. ``gcd(a_i, b_i) != 1``,
        a negative genus, a non-orientable base).

    Examples
    --------
    >>> parse_space("Sigma(2,3,7)").euler
    Fraction(-1, 42)
    >>> parse_space("-L(5,2)").recognise()
    'L(5,2)'
    >>> M = parse_space("M(2; 0)")
    >>> M.recognise(), M.homology()
    ('S^1xSigma_2', (0, 0, 0, 0, 0))
    >>> parse_space("M(1; -1; (2,1), (3,1))").betti_number
    2
    >>> parse_space("M(0; 0; (2,1), (4,2))")
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidSeifertDataError: fibre 2 = (4,2): gcd(a_2, b_2) = 2 but must be 1

    References
    ----------
    Neumann-Raymond, LNM 664 (1978) (the notation ``M(0; b; (a_i, b_i))``).
    """
    if isinstance(text, SeifertManifold):
        return text
    if not isinstance(text, str):
        raise ParseError(f"cannot read space {text!r}: {_SPACE_HELP}")
    s = "".join(text.split())
    sign = 1
    while s.startswith(("-", "+")):
        if s[0] == "-":
            sign = -sign
        s = s[1:]
    M = _parse_unsigned(s, text)
    return M.reverse() if sign < 0 else M


def _parse_unsigned(s: str, original: str) -> SeifertManifold:
    if _RE_S3.match(s):
        return SeifertManifold(1, ())
    if _RE_S2S1.match(s):
        return SeifertManifold(0, ())
    m = _RE_LENS.match(s)
    if m:
        return SeifertManifold.from_lens(int(m.group(1)), int(m.group(2)))
    m = _RE_SIGMA.match(s)
    if m:
        return SeifertManifold.from_brieskorn(*[int(x) for x in m.group(1).split(",")])
    m = _RE_M.match(s)
    if m:
        parts = _split_top(m.group(1), original)
        nums: list[int] = []
        pairs: list[tuple[int, int]] = []
        for k, part in enumerate(parts):
            pm = _RE_PAIR.match(part)
            if pm:
                pairs.append((int(pm.group(1)), int(pm.group(2))))
            elif re.fullmatch(_INT, part) and not pairs:
                nums.append(int(part))
            elif k == 0 and _RE_NONORIENTABLE.match(part):
                raise InvalidSeifertDataError(
                    f"space {original!r} has a non-orientable base ({part!r}); knotobs handles"
                    " orientable bases only: write M(g; b; (a1,b1), ...) with genus g >= 0"
                )
            else:
                raise ParseError(f"cannot read {part!r} in space {original!r}: {_SPACE_HELP}")
        if len(nums) == 2:
            genus, b = nums
            _check_genus(genus)
        elif len(nums) == 1:
            genus, b = 0, nums[0]
        else:
            raise ParseError(f"cannot read space {original!r}: expected M(g; b; ...). {_SPACE_HELP}")
        return SeifertManifold(b, tuple(pairs), genus)
    raise ParseError(f"cannot read space {original!r}: {_SPACE_HELP}")


def _split_top(body: str, original: str) -> list[str]:
    """Split at top-level ``;`` or ``,`` (not inside parentheses)."""
    out, depth, cur = [], 0, ""
    for ch in body:
        if ch == "(":
            depth += 1
        elif ch == ")":
            depth -= 1
            if depth < 0:
                raise ParseError(f"unbalanced parentheses in space {original!r}")
        if depth == 0 and ch in ";,":
            out.append(cur)
            cur = ""
        else:
            cur += ch
    if depth != 0:
        raise ParseError(f"unbalanced parentheses in space {original!r}")
    out.append(cur)
    if any(p == "" for p in out):
        raise ParseError(f"empty entry in space {original!r}: {_SPACE_HELP}")
    return out
