r"""The flat SL(2,C) connections of a Seifert manifold over ``S^2``, enumerated exactly.

Every representation ``rho: pi_1 M -> SL(2,C)`` of ``M = M(0; b; (a_1,b_1), ..., (a_n,b_n))``
(presentation of CONVENTIONS §12, :mod:`knotobs.flat.chern_simons`) is one of:

* **abelian** (reducible): it factors through ``H_1(M)``; for a rational homology sphere ``H_1`` is
  finite, so the image lies in a compact torus and the character is that of an SU(2) abelian
  representation (the trivial one included).  They are counted by ``Hom(H_1, U(1))/(x ~ x^-1)``.
* **irreducible**: ``rho(h) = eps = +-1`` is central (it commutes with an irreducible image),
  ``rho(x_j)^{a_j} = eps^{b_j}``, so ``rho(x_j)`` is diagonalisable (a parabolic element has no
  finite power equal to +-1) with eigenvalues ``exp(+-i pi l_j/a_j)``, ``0 <= l_j <= a_j``,
  ``(-1)^{l_j} = eps^{b_j}``; ``l_j = 0`` or ``a_j`` makes ``rho(x_j) = +-1`` central.  With
  ``J = {j : 0 < l_j < a_j}`` the remaining matrices satisfy one product relation with fixed
  conjugacy classes (relative character variety of the ``|J|``-punctured sphere):

  - ``|J| <= 2``: no irreducible solution (two matrices whose product is central commute);
  - ``|J| = 3``: exactly one character, irreducible unless the angles are "resonant"
    (``phi_3 = +-phi_1 +- phi_2 mod 2 pi``); it is conjugate into SU(2) when the angles satisfy
    the strict spherical triangle inequalities and into SL(2,R) otherwise (every irreducible
    SL(2,C) representation of a Brieskorn sphere is conjugate into SU(2) or SL(2,R):
    T. Kitano and Y. Yamaguchi, arXiv:1602.07503; by Fricke's trace identity the commutator
    trace ``t_1^2 + t_2^2 + t_3^2 - t_1 t_2 t_3 - 2`` is < 2 for SU(2) and > 2 for SL(2,R));
  - ``|J| >= 4``: a component of complex dimension ``2(|J| - 3)``; its generic points are not
    conjugate into SU(2) or SL(2,R).  It contains irreducible SU(2) points iff the strict polygon
    inequalities ``sum_{S} phi_j - sum_{not S} phi_j < (|S| - 1) pi`` hold for every odd-size
    subset ``S`` (the SU(2) case of the multiplicative Horn problem; L. Jeffrey and
    J. Weitsman, Commun. Math. Phys. 150 (1992); S. Agnihotri and C. Woodward, Math. Res. Lett.
    5 (1998), quoted from memory).

The Chern–Simons value is locally constant, so it is one exact rational number per component
(formula (*) of :mod:`knotobs.flat.chern_simons`); in particular it is never complex for these
manifolds: every flat SL(2,C) connection of a Seifert manifold over ``S^2`` with ``e != 0`` has
real rational CS (its boundary holonomies have finite order).

For ``Sigma(p_1, p_2, p_3)`` the irreducible characters number ``(p_1-1)(p_2-1)(p_3-1)/4``
(H. Boden and C. Curtis, the SL(2,C) Casson invariant for Seifert fibered homology spheres,
2006; quoted from memory, checked by the tests for every pairwise coprime triple up to 13), and
the SU(2) ones ``-2 lambda`` (R. Fintushel and R. Stern, Proc. London Math. Soc. 61 (1990)).
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction
from itertools import combinations, product
from math import gcd, lcm, prod
from typing import Iterator

from knotobs.errors import InvalidSeifertDataError
from knotobs.flat.chern_simons import abelian_cs, core_angles, irreducible_cs

__all__ = ["Character", "irreducible_characters", "abelian_characters", "enumeration_size",
           "guard_enumeration", "SECONDS_PER_CANDIDATE"]

#: Rough cost of examining one candidate ``(eps, l)`` (measured, two-core machine).
SECONDS_PER_CANDIDATE = 6e-6
#: Rough cost of producing one listed connection (CS, torsion at 20 digits, JSON).
SECONDS_PER_CONNECTION = 2e-4


@dataclass(frozen=True)
class Character:
    """One flat SL(2,C) connection (a point or a component of the character variety).

    Attributes
    ----------
    kind : str
        ``"trivial"``, ``"abelian"`` or ``"irreducible"``.
    real_form : str
        ``"SU(2)"``, ``"SL(2,R)"``, ``"SU(2) and SL(2,C)"`` (a component with SU(2) points and
        complex generic points) or ``"SL(2,C)"`` (no SU(2) or SL(2,R) point known).
    eps : int
        ``rho(h) = eps`` (irreducible); for abelian ones ``0``.
    rotation : tuple of int
        Irreducible: ``l_j`` with ``rho(x_j) ~ exp(i pi l_j/a_j)``, one per exceptional fibre of the
        normal form.  Abelian: the angles ``theta_j mod 1`` (Fractions), ``rho(x_j) = e^{2 pi i theta_j}``.
    h_angle : Fraction
        ``rho(h) = e^{2 pi i s}``: ``s``.
    cs : Fraction
        Chern–Simons value mod 1 in ``[0, 1)``.
    dimension : int
        Complex dimension of the component (0 for isolated points).
    """

    kind: str
    real_form: str
    eps: int
    rotation: tuple
    h_angle: Fraction
    cs: Fraction
    dimension: int


def _odd(x: int) -> int:
    return x % 2


def enumeration_size(M) -> int:
    """Number of candidates ``(eps, l_1..l_n)`` the irreducible enumeration examines.

    >>> from knotobs.fibrations.seifert import parse_space
    >>> enumeration_size(parse_space("Sigma(2,3,5)").normal_form())
    18
    """
    total = 0
    for eps in (1, -1):
        total += prod(len(range(_odd(bj) if eps == -1 else 0, a + 1, 2)) for a, bj in M.fibers)
    return total


def guard_enumeration(M, what: str) -> None:
    """Refuse (before any work) an enumeration estimated above the limits in force."""
    from knotobs.guard import require, seconds_for

    n = enumeration_size(M)
    k = len(M.fibers)
    # listed connections: at most the candidates; for three fibres about a quarter of them;
    # with four or more fibres each candidate may need the polygon test over 2^(k-1) subsets
    listed = n if k > 3 else n // 4
    per = SECONDS_PER_CANDIDATE * (1 if k <= 3 else 2 ** (k - 1) * k / 4)
    require(f"{what} on {M}: {n:.3g} candidate rotation-number tuples",
            seconds=n * per + listed * SECONDS_PER_CONNECTION,
            memory_mb=listed * 4e-3 + 50,
            accepted="fewer or smaller exceptional fibres")


def _classify3(phis: list[Fraction]) -> str | None:
    """Real form for three non-central classes (angles as fractions of pi), ``None`` if reducible."""
    D = phis[0].denominator * phis[1].denominator * phis[2].denominator
    p1, p2, p3 = (int(x * D) for x in phis)
    return _classify3_int(p1, p2, p3, D)


def _classify3_int(p1: int, p2: int, p3: int, D: int) -> str | None:
    """:func:`_classify3` with the angles ``p_j pi/D`` (integers)."""
    lo, hi = abs(p1 - p2), min(p1 + p2, 2 * D - p1 - p2)
    if p3 == lo or p3 == p1 + p2 or p3 == 2 * D - p1 - p2:
        return None
    return "SU(2)" if lo < p3 < hi else "SL(2,R)"


def _su2_polygon(phis: list[Fraction]) -> bool:
    """Strict SU(2) polygon inequalities for product 1 (angles as fractions of pi)."""
    k = len(phis)
    total = sum(phis, Fraction(0))
    for r in range(1, k + 1, 2):
        for S in combinations(range(k), r):
            inS = sum((phis[j] for j in S), Fraction(0))
            if inS - (total - inS) >= r - 1:
                return False
    return True


def irreducible_characters(M) -> Iterator[Character]:
    """Irreducible flat SL(2,C) connections (isolated points and components) of ``M`` (normal form).

    Examples
    --------
    >>> from knotobs.fibrations.seifert import parse_space
    >>> M = parse_space("Sigma(2,3,7)").normal_form()
    >>> [(c.real_form, c.rotation, str(c.cs)) for c in irreducible_characters(M)]
    [('SU(2)', (1, 2, 2), '143/168'), ('SU(2)', (1, 2, 4), '47/168'), ('SL(2,R)', (1, 2, 6), '167/168')]

    References
    ----------
    R. Fintushel and R. Stern, Proc. London Math. Soc. 61 (1990) 109–137; T. Kitano and
    Y. Yamaguchi, arXiv:1602.07503; CONVENTIONS §12.
    """
    fib = list(M.fibers)
    for eps in (1, -1):
        s = Fraction(0) if eps == 1 else Fraction(1, 2)
        ranges = []
        for a, bj in fib:
            par = _odd(bj) if eps == -1 else 0
            ranges.append([l for l in range(0, a + 1) if l % 2 == par])
        for ls in product(*ranges):
            J = [j for j, (l, (a, _)) in enumerate(zip(ls, fib)) if 0 < l < a]
            if len(J) < 3:
                continue
            # product of the non-central ones = central sign c
            c = -1 if (eps == -1 and M.b % 2) else 1
            for j, (l, (a, _)) in enumerate(zip(ls, fib)):
                if l == a:          # rho(x_j) = -1
                    c = -c
            if len(J) == 3:
                D = fib[J[0]][0] * fib[J[1]][0] * fib[J[2]][0]
                p = [ls[j] * (D // fib[j][0]) for j in J]
                if c == -1:
                    p[2] = D - p[2]
                rf = _classify3_int(p[0], p[1], p[2], D)
                if rf is None:
                    continue
                dim = 0
            else:
                phis = [Fraction(ls[j], fib[j][0]) for j in J]
                if c == -1:
                    phis[-1] = 1 - phis[-1]
                rf = "SU(2) and SL(2,C)" if _su2_polygon(phis) else "SL(2,C)"
                dim = 2 * (len(J) - 3)
            yield Character("irreducible", rf, eps, tuple(ls), s, irreducible_cs(M, eps, ls), dim)


def _suffix_sums(fib, L: int) -> list[set]:
    """``S[j]``: the residues ``sum_{i >= j} k_i L/a_i mod L`` reachable by the fibres ``j..n`` (``j >= 1``).

    ``S[0]`` (everything reachable) is not needed by the search and left empty.
    """
    S = [set() for _ in range(len(fib) + 1)]
    S[-1] = {0}
    for j in range(len(fib) - 1, 0, -1):
        step = L // fib[j][0]
        S[j] = {(x + k * step) % L for x in S[j + 1] for k in range(fib[j][0])}
    return S


def _k_solutions(fib, target: int, L: int, S) -> Iterator[tuple[int, ...]]:
    """All ``(k_1..k_n)``, ``0 <= k_j < a_j``, with ``sum k_j L/a_j = target mod L`` (pruned depth-first)."""
    n = len(fib)
    stack = [(0, target, ())]
    while stack:
        j, t, ks = stack.pop()
        if j == n:
            yield ks
            continue
        step = L // fib[j][0]
        for k in range(fib[j][0]):
            t2 = (t - k * step) % L
            if t2 in S[j + 1]:
                stack.append((j + 1, t2, ks + (k,)))


def abelian_work(M) -> float:
    """Elementary steps of :func:`abelian_characters` (for the guard): suffix sets and the solutions."""
    fib = list(M.fibers)
    L = lcm(*[a for a, _ in fib]) if fib else 1
    work, size = 0, 1
    for j in range(len(fib) - 1, 0, -1):       # building S[j] from S[j+1]
        work += size * fib[j][0]
        size = min(L, size * fib[j][0])
    return float(work + M.h1_order * (len(fib) + 1) * max([a for a, _ in fib] + [1]))


def abelian_characters(M) -> list[Character]:
    """Abelian flat connections (trivial first), one per class of ``Hom(H_1, U(1))`` modulo inversion.

    Examples
    --------
    >>> from knotobs.fibrations.seifert import parse_space
    >>> [str(c.cs) for c in abelian_characters(parse_space("L(5,1)").normal_form())]
    ['0', '1/5', '4/5']

    References
    ----------
    P. Kirk and E. Klassen, Math. Ann. 287 (1990) (abelian Chern–Simons values); CONVENTIONS §12.
    """
    fib = list(M.fibers)
    e = -(M.b + sum((Fraction(bj, a) for a, bj in fib), Fraction(0)))
    if e == 0:
        raise InvalidSeifertDataError(f"{M} has e = 0 (infinite H_1): flat connections form families;"
                                      " a rational homology sphere is needed")
    A = prod(a for a, _ in fib) if fib else 1
    order = abs(A * e)
    assert order.denominator == 1
    order = int(order)
    seen = {}
    L = lcm(*[a for a, _ in fib]) if fib else 1
    suffix = _suffix_sums(fib, L)
    # rho(h) = e^{2 pi i s}: s has order dividing |H_1|
    for r in range(order):
        s = Fraction(r, order)
        # theta_j = (k_j - b_j s)/a_j, sum_j theta_j - b s in Z (fibre (1,b): theta_0 = -b s)
        base = [-(bj * s) / a for a, bj in fib]
        need = (M.b * s - sum(base, Fraction(0)))            # sum k_j/a_j must be = need mod 1
        if fib:
            t = need * L
            if t.denominator != 1:
                continue
            sols = _k_solutions(fib, int(t) % L, L, suffix)
        else:
            sols = [()] if need.denominator == 1 else []
        for ks in sols:
            th = tuple(bs + Fraction(k, a) for bs, k, (a, _) in zip(base, ks, fib))
            key = (s % 1, tuple(t % 1 for t in th))
            inv = ((-s) % 1, tuple((-t) % 1 for t in th))
            if key in seen or inv in seen:
                continue
            rot = tuple(t % 1 for t in th)
            cs = abelian_cs(M, s, th)
            kind = "trivial" if r == 0 and all(t % 1 == 0 for t in th) else "abelian"
            seen[key] = Character(kind, "SU(2)", 0, rot, s, cs, 0)
    out = sorted(seen.values(), key=lambda c: (c.kind != "trivial", c.cs, c.h_angle))
    return out
