"""Seifert partition functions and fiber Wilson loops by surgery / gluing.

Route (CONVENTIONS §7, §9).  ``M(0; b; (a_1,b_1), ..., (a_n,b_n))`` (Euler number
``e = -(b + sum b_i/a_i)``) is the Lawrence–Rozansky surgery ``X(a_1/b_1, ..., a_n/b_n)`` on
a central unknot of framing ``-b`` and ``n`` of its meridians (the meridian with
coefficient ``1/b`` is slid into the central framing).  With this dictionary the
Poincaré sphere ``Sigma(2,3,5) = X(2/-1, 3/1, 5/1)`` is ``M(0; 0; (2,-1), (3,1), (5,1))``,
``e = -1/30``: the link of ``x^2 + y^3 + z^5 = 0`` (W. D. Neumann & F. Raymond, LNM 664
(1978); orientation convention of Neumann–Raymond, ``e < 0`` for links of singularities).
Each rational coefficient ``p/q`` is expanded as a negative continued fraction
``[c_1, ..., c_m]``, giving a star-shaped plumbing; the chain of fiber ``j`` contributes
the SL(2,Z) word ``S T^{c_1} S ... T^{c_m} S`` acting on the trivial colour, represented by
the S and (framing) T matrices of SU(N)_k.  The framing anomaly is removed with the
signature ``sigma`` of the linking matrix (canonical 2-framing, M. Atiyah, Topology 29
(1990); R. Kirby & P. Melvin, Invent. Math. 105 (1991) 473–545, §1):

    Z(M) = exp(-i pi c sigma/4) sum_lam S_{0 lam}^{2-d} theta_lam^{e_0}
           prod_j (S Theta^{c_j1} S ... Theta^{c_jm} S)_{lam, mu_j} prod_r S_{lam, nu_r}

(N. Reshetikhin & V. Turaev, Invent. Math. 103 (1991) 547–597), with ``theta_lam =
exp(2 pi i C(lam)/K)``, ``d`` the valence of the central vertex, ``mu_j`` the colour on the
exceptional fiber ``j`` (trivial if none) and ``nu_r`` the colours of regular fibers.  It is
normalised so that ``Z(S^3) = S_00``, ``Z(S^2 x S^1) = 1``, ``Z(-M) = conj Z(M)``.

Wilson lines.  The core of the solid torus glued in by the last vertex of a chain is
isotopic to a meridian of that vertex; a regular fiber is a meridian of the central
vertex.  The Wilson lines are taken with their 0-framing in the surgery diagram (for a
regular fiber this is the fiber framing: a nearby regular fiber is another meridian).
In ``M`` the self-linking of that framing is ``f = -(A^{-1})_{vv}`` (``A`` the linking
matrix; common practice, Gompf & Stipsicz, *4-Manifolds and Kirby Calculus*, AMS 1999,
§5.1); when the line is null-homologous ``f`` is an integer and the zero-framed value is
``theta_mu^{-f}`` times the computed one (CONVENTIONS §2).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from fractions import Fraction
from typing import Iterable, Mapping, Sequence

import mpmath

from knotobs.errors import (
    InexactDivisionError,
    InvalidSeifertDataError,
    KnotobsError,
)
from knotobs.evaluation.finite_value import FiniteLevelValue
from knotobs.evaluation.modular import ModularData, check_integrable, modular_data, parse_group
from knotobs.polynomials.cyclotomic import (
    Cyclotomic,
    CyclotomicField,
    CyclotomicSurd,
)
from knotobs.representations.partitions import Partition
from knotobs.numerics import working_precision

__all__ = [
    "negative_continued_fraction",
    "seifert_data",
    "seifert_to_surgery",
    "SurgeryPresentation",
    "sl2z_word",
    "word_matrix",
    "rho",
    "dedekind_sum",
    "rademacher_phi",
    "signature",
    "surgery_partition_function",
    "partition_function",
    "fiber_wilson_loop",
]


# ---------------------------------------------------------------------------
# input handling


def seifert_data(space) -> tuple[int, tuple[tuple[int, int], ...]]:
    """``(b, fibers)`` from a SeifertManifold-like object (``.b``, ``.fibers``) or plain data.

    Accepts ``(b, [(a_1, b_1), ...])``; validates ``a_i >= 1`` and ``gcd(a_i, b_i) = 1``.

    >>> seifert_data((0, [(2, -1), (3, 1), (5, 1)]))
    (0, ((2, -1), (3, 1), (5, 1)))
    >>> seifert_data((0, [(2, 4)]))
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidSeifertDataError: fiber (2, 4) is invalid: need a >= 1 and gcd(a, b) = 1
    """
    if hasattr(space, "b") and hasattr(space, "fibers"):
        if getattr(space, "genus", 0):
            raise InvalidSeifertDataError(
                f"{space} has base genus {space.genus}: this route handles base genus 0 only"
            )
        b, fibers = space.b, space.fibers
    else:
        try:
            b, fibers = space
        except (TypeError, ValueError):
            raise InvalidSeifertDataError(
                f"{space!r} is not Seifert data: give (b, [(a_1, b_1), ...]) or a SeifertManifold"
            ) from None
    if not isinstance(b, int) or isinstance(b, bool):
        raise InvalidSeifertDataError(f"b = {b!r} must be an integer")
    out = []
    for f in fibers:
        try:
            a, bb = f
        except (TypeError, ValueError):
            raise InvalidSeifertDataError(f"fiber {f!r} must be a pair (a, b)") from None
        if not (isinstance(a, int) and isinstance(bb, int)) or a < 1 or math.gcd(a, bb) != 1:
            raise InvalidSeifertDataError(
                f"fiber {tuple(f)!r} is invalid: need a >= 1 and gcd(a, b) = 1"
            )
        out.append((a, bb))
    return b, tuple(out)


def seifert_to_surgery(b: int, fibers: Sequence[tuple[int, int]]) -> tuple[int, list[tuple[int, int]]]:
    """Central framing and meridian coefficients ``(e0, [(p_j, q_j)])`` of ``M(0; b; ...)``.

    ``M(0; b; (a_i, b_i)) = X(a_1/b_1, ..., a_n/b_n, 1/b)`` and the meridian ``1/b`` is
    slid into the central framing ``e0 = -b`` (slam-dunk, Gompf & Stipsicz 1999, §5.3).

    >>> seifert_to_surgery(-1, [(2, 1), (3, 1), (5, 1)])
    (1, [(2, 1), (3, 1), (5, 1)])
    """
    return -b, [(a, bb) for a, bb in fibers]


def negative_continued_fraction(p: int, q: int) -> list[int]:
    """``p/q = c_1 - 1/(c_2 - 1/(... - 1/c_m))`` with ``c_1 = ceil(p/q)`` etc.

    >>> negative_continued_fraction(7, 2)
    [4, 2]
    >>> negative_continued_fraction(-2, 1)
    [-2]
    """
    if q == 0:
        raise InvalidSeifertDataError("surgery coefficient p/0 has no continued fraction")
    if q < 0:
        p, q = -p, -q
    out = []
    while True:
        c = -((-p) // q)
        out.append(c)
        r = c * q - p
        if r == 0:
            return out
        p, q = q, r


def signature(A: Sequence[Sequence[int]]) -> int:
    """Signature of a symmetric integer matrix (exact, by congruence diagonalisation).

    >>> signature([[0, 1], [1, 0]]), signature([[-2, 1], [1, -2]])
    (0, -2)
    """
    M = [[Fraction(x) for x in row] for row in A]
    n = len(M)
    sig = 0
    idx = list(range(n))
    while idx:
        piv = next((i for i in idx if M[i][i] != 0), None)
        if piv is None:
            pair = next(((i, j) for i in idx for j in idx if i != j and M[i][j] != 0), None)
            if pair is None:
                break
            i, j = pair
            # row/col i += row/col j makes M[i][i] = 2 M[i][j] + M[j][j] = 2 M[i][j] != 0
            for t in range(n):
                M[i][t] += M[j][t]
            for t in range(n):
                M[t][i] += M[t][j]
            piv = i
        d = M[piv][piv]
        sig += 1 if d > 0 else -1
        idx.remove(piv)
        for i in idx:
            f = M[i][piv] / d
            if f:
                for t in idx:
                    M[i][t] -= f * M[piv][t]
        for i in idx:
            M[i][piv] = M[piv][i] = Fraction(0)
    return sig


def _inverse_matrix(A: Sequence[Sequence[int]]) -> list[list[Fraction]] | None:
    n = len(A)
    M = [[Fraction(x) for x in row] + [Fraction(int(i == j)) for j in range(n)]
         for i, row in enumerate(A)]
    for c in range(n):
        p = next((r for r in range(c, n) if M[r][c] != 0), None)
        if p is None:
            return None
        M[c], M[p] = M[p], M[c]
        inv = 1 / M[c][c]
        M[c] = [x * inv for x in M[c]]
        for r in range(n):
            if r != c and M[r][c] != 0:
                f = M[r][c]
                M[r] = [x - f * y for x, y in zip(M[r], M[c])]
    return [row[n:] for row in M]


@dataclass(frozen=True)
class SurgeryPresentation:
    """Star-shaped plumbing: central weight ``e0`` and one chain per fiber.

    ``chains[j]`` is the negative continued fraction of ``p_j/q_j`` (empty for ``1/0``).
    ``vertex_of[j]`` is the index (in the linking matrix) of the vertex whose meridian is
    the core of fiber ``j``.
    """

    e0: int
    chains: tuple[tuple[int, ...], ...]

    @classmethod
    def from_coefficients(cls, e0: int, pq: Iterable[tuple[int, int]]) -> "SurgeryPresentation":
        chains = []
        for p, q in pq:
            chains.append(tuple(negative_continued_fraction(p, q)) if q != 0 else ())
        return cls(e0, tuple(chains))

    def linking_matrix(self) -> list[list[int]]:
        n = 1 + sum(len(c) for c in self.chains)
        A = [[0] * n for _ in range(n)]
        A[0][0] = self.e0
        v = 1
        for ch in self.chains:
            prev = 0
            for c in ch:
                A[v][v] = c
                A[v][prev] = A[prev][v] = 1
                prev = v
                v += 1
        return A

    def vertex_of(self, j: int) -> int:
        v = 1 + sum(len(c) for c in self.chains[:j])
        return v + len(self.chains[j]) - 1 if self.chains[j] else 0


# ---------------------------------------------------------------------------
# SL(2, Z)


def word_matrix(word: Sequence[int]) -> tuple[tuple[int, int], tuple[int, int]]:
    """Matrix of ``T^{n_1} S T^{n_2} S ... S T^{n_r}`` (``S = [[0,-1],[1,0]]``, ``T = [[1,1],[0,1]]``)."""
    a, b, c, d = 1, 0, 0, 1
    for i, n in enumerate(word):
        if i:
            a, b, c, d = b, -a, d, -c          # right-multiply by S
        a, b, c, d = a, a * n + b, c, c * n + d  # right-multiply by T^n
    return (a, b), (c, d)


def sl2z_word(U) -> list[int]:
    """Exponents ``[n_1, ..., n_r]`` with ``U = +-(T^{n_1} S T^{n_2} S ... S T^{n_r})``.

    From the negative continued fraction of ``a/c`` (Euclid); the sign ``+-1`` (``S^2 = -1``)
    is fixed by appending ``S^2`` when needed, i.e. the returned word multiplies out to
    ``U`` exactly (checked).

    >>> sl2z_word([[2, -1], [1, 0]])
    [2, 0]
    >>> word_matrix(sl2z_word([[5, 2], [7, 3]]))
    ((5, 2), (7, 3))
    """
    (a, b), (c, d) = U
    if a * d - b * c != 1:
        raise InvalidSeifertDataError(f"{U} is not in SL(2,Z) (determinant must be 1)")
    word: list[int] = []
    if c == 0:
        # U = +-T^n
        word = [a * b]
    else:
        word = negative_continued_fraction(a, c) + [0]
        (a2, b2), (c2, d2) = word_matrix(word)
        # U = W T^t for the first column equal (up to sign)
        sgn = 1 if (a2, c2) == (a, c) else -1
        if sgn == -1:
            word = word + [0, 0]              # extra S^2 = -1
            (a2, b2), (c2, d2) = word_matrix(word)
        t = (b - b2) // a2 if a2 else (d - d2) // c2
        word[-1] += t
    (a2, b2), (c2, d2) = word_matrix(word)
    if ((a2, b2), (c2, d2)) != ((a, b), (c, d)):
        if ((a2, b2), (c2, d2)) == ((-a, -b), (-c, -d)):
            word = word + [0, 0]
        (a2, b2), (c2, d2) = word_matrix(word)
    if ((a2, b2), (c2, d2)) != ((a, b), (c, d)):  # pragma: no cover - defensive
        raise AssertionError(f"word {word} does not reproduce {U}")
    return word


def dedekind_sum(h: int, k: int) -> Fraction:
    """Dedekind sum ``s(h, k) = sum_{r=1}^{|k|-1} ((r/k)) ((h r/k))`` (``gcd(h, k) = 1``).

    Computed by the reciprocity law ``s(h,k) + s(k,h) = -1/4 + (h/k + k/h + 1/(hk))/12``
    (H. Rademacher & E. Grosswald, *Dedekind Sums*, MAA 1972, ch. 2).

    >>> dedekind_sum(1, 5), dedekind_sum(2, 5)
    (Fraction(1, 5), Fraction(0, 1))
    """
    k = abs(k)
    if k == 0:
        raise ValueError("dedekind_sum needs k != 0")
    if math.gcd(h, k) != 1:
        raise ValueError(f"dedekind_sum needs gcd(h, k) = 1, got ({h}, {k})")
    sign = 1
    total = Fraction(0)
    while True:
        h %= k
        if h == 0 or k == 1:
            return total * 1 + sign * Fraction(0) if k == 1 else total
        if h == 1:
            return total + sign * Fraction((k - 1) * (k - 2), 12 * k)
        # s(h,k) = -1/4 + (h/k + k/h + 1/(hk))/12 - s(k,h)
        total += sign * (Fraction(-1, 4) + (Fraction(h, k) + Fraction(k, h) + Fraction(1, h * k)) / 12)
        sign = -sign
        h, k = k, h


def rademacher_phi(U) -> Fraction:
    """Rademacher's function ``Phi(U) = (a+d)/c - 12 sign(c) s(d, |c|)`` (``c != 0``), ``b/d`` (``c = 0``).

    It measures the framing change of the gluing map ``U`` (L. Jeffrey, Commun. Math.
    Phys. 147 (1992) 563–604, §2; Rademacher & Grosswald 1972).

    >>> rademacher_phi([[1, 1], [0, 1]]), rademacher_phi([[0, -1], [1, 0]])
    (Fraction(1, 1), Fraction(0, 1))
    """
    (a, b), (c, d) = U
    if c == 0:
        return Fraction(b, d)
    return Fraction(a + d, c) - 12 * (1 if c > 0 else -1) * dedekind_sum(d, abs(c))


def rho(U, md: ModularData) -> list[list[CyclotomicSurd]]:
    """Exact ``rho(U)`` for ``U`` in SL(2,Z): the product of ``S`` and
    ``T = diag exp(2 pi i (h_lam - c/24))`` along :func:`sl2z_word` (``S -> S``, ``T -> T``).

    With the ``-c/24`` shift, ``(ST)^3 = S^2`` and ``S^4 = 1`` hold exactly, so this is a
    representation of SL(2,Z) and the result does not depend on the word (tested).

    >>> md = ModularData(2, 1)
    >>> r = rho([[0, -1], [1, 0]], md)
    >>> r[0][0] == md.S_exact((), ())
    True
    """
    word = sl2z_word(U)
    n = md.size
    M = math.lcm(2 * md.N * md.K, 8 * md.K, 24 * md.K)
    F = CyclotomicField(M)
    texp = [int(t * M) for t in md.T_exponents()]
    St = [[md.stilde(i, j).to_field(M) for j in range(n)] for i in range(n)]
    R = [[F.one if i == j else F.zero for j in range(n)] for i in range(n)]
    s_count = 0
    for idx, t in enumerate(word):
        if idx:
            R = [[sum((R[i][l] * St[l][j] for l in range(n)), F.zero) for j in range(n)]
                 for i in range(n)]
            s_count += 1
        if t:
            R = [[R[i][j] * F.zeta(t * texp[j]) for j in range(n)] for i in range(n)]
    s0p = md.s0() ** s_count
    return [[s0p * R[i][j] for j in range(n)] for i in range(n)]


# ---------------------------------------------------------------------------
# backends: exact cyclotomic vectors, or ball arithmetic


class _ExactBackend:
    exact = True

    def __init__(self, md: ModularData):
        self.md = md
        N, K = md.N, md.K
        self.M = math.lcm(2 * N * K, 8 * K)
        self.F = CyclotomicField(self.M)
        self._St = None
        self.h_exp = [int(h * self.M) for h in md.twist_exponents()]   # theta = z^h_exp
        assert all(Fraction(x, self.M) == h for x, h in zip(self.h_exp, md.twist_exponents()))

    def stilde(self):
        if self._St is None:
            n = self.md.size
            self._St = [[self.md.stilde(i, j).to_field(self.M) for j in range(n)] for i in range(n)]
        return self._St

    def column(self, j):
        St = self.stilde()
        return [St[i][j] for i in range(self.md.size)]

    def theta_pow(self, v, c):
        if c == 0:
            return v
        return [x * self.F.zeta(c * h) for x, h in zip(v, self.h_exp)]

    def apply_S(self, v):
        St = self.stilde()
        n = self.md.size
        out = []
        for i in range(n):
            acc = self.F.zero
            row = St[i]
            for j in range(n):
                if not v[j].is_zero():
                    acc = acc + row[j] * v[j]
            out.append(acc)
        return out

    def scalar_power(self, x, e):
        return x ** e

    def one(self):
        return self.F.one

    def zero(self):
        return self.F.zero


def _core_sum(backend, pres: SurgeryPresentation, exceptional: Mapping[int, int],
              regular: Sequence[int], genus: int = 0):
    """``sum_lam Stilde_{0 lam}^{2-d} theta^{e0} prod_j V_j[lam] prod_r Stilde_{lam, nu_r}``
    and the power of ``s0`` that multiplies it."""
    md = backend.md
    n = md.size
    vecs = []
    s0_power = 0
    for j, chain in enumerate(pres.chains):
        mu = exceptional.get(j, 0)
        v = backend.column(mu)
        for c in reversed(chain):
            v = backend.theta_pow(v, c)
            v = backend.apply_S(v)
        s0_power += len(chain) + 1
        vecs.append(v)
    for nu in regular:
        vecs.append(backend.column(nu))
        s0_power += 1
    d = len(vecs)
    s0_power += 2 - 2 * genus - d
    row0 = backend.column(0)
    central = backend.theta_pow(row0, pres.e0) if pres.e0 else row0
    total = backend.zero()
    for lam in range(n):
        term = backend.scalar_power(row0[lam], 1 - 2 * genus - d)   # S_{0lam}^{2-2g-d}
        term = term * central[lam]
        for v in vecs:
            term = term * v[lam]
        total = total + term
    return total, s0_power


def _plumbing_exact(md: ModularData, pres: SurgeryPresentation, exceptional: Mapping[int, int],
                    regular: Sequence[int], genus: int = 0) -> CyclotomicSurd:
    """The surgery formula in its plumbing form, exactly: one ``S`` per vertex of each chain,
    ``Theta`` without the ``c/24`` shift and the anomaly ``exp(-i pi c sigma/4)``.

    This is the reference form of CONVENTIONS §9 (Reshetikhin–Turaev; Kirby–Melvin 1991); the
    route itself evaluates the same number from short SL(2,Z) words
    (:mod:`knotobs.evaluation.gluing`).  Used by the tests to check the two forms agree exactly.
    """
    sigma = signature(pres.linking_matrix())
    anomaly_exp = -md.central_charge * sigma / 8
    be = _ExactBackend(md)
    total, p = _core_sum(be, pres, exceptional, regular, genus)
    anomaly = be.F.zeta(int(anomaly_exp * be.M)) if (anomaly_exp * be.M).denominator == 1 \
        else CyclotomicField(anomaly_exp.denominator).zeta(anomaly_exp.numerator)
    return (md.s0() ** p) * (total * anomaly)


def _evaluate(md: ModularData, pres: SurgeryPresentation, exceptional: Mapping[int, int],
              regular: Sequence[int], digits: int, exact: bool | None, genus: int = 0):
    """Exact (CyclotomicSurd or None) and numeric value of the surgery formula."""
    from knotobs.evaluation.gluing import evaluate_gluing

    return evaluate_gluing(md, pres, genus, exceptional, regular, digits, exact)


def seifert_genus(space) -> int:
    """Base genus of a SeifertManifold-like object (``.genus`` or ``.g``) or of plain data.

    Plain data: ``(b, fibers)`` has genus 0; ``(g, b, fibers)`` names it.

    >>> seifert_genus((0, [(2, 1)])), seifert_genus((2, 0, []))
    (0, 2)
    """
    g = getattr(space, "genus", None)
    if g is None:
        g = getattr(space, "g", None)
    if g is None and isinstance(space, (tuple, list)) and len(space) == 3:
        g = space[0]
    if g is None:
        return 0
    if not isinstance(g, int) or isinstance(g, bool) or g < 0:
        raise InvalidSeifertDataError(f"base genus g = {g!r} is not allowed: use an integer g >= 0")
    return g


def _plain(space):
    """``(b, fibers)`` of any base genus: plain ``(g, b, fibers)`` data loses its leading genus,
    a SeifertManifold-like object gives its ``.b`` and ``.fibers`` (its genus is read by
    :func:`seifert_genus`; :func:`seifert_data` itself refuses genus >= 1 for the genus-0 routes)."""
    if isinstance(space, (tuple, list)) and len(space) == 3 and not hasattr(space, "fibers"):
        return space[1], space[2]
    if hasattr(space, "b") and hasattr(space, "fibers"):
        return space.b, tuple(space.fibers)
    return space


# ---------------------------------------------------------------------------
# public entry points


def _group_level(group, level) -> ModularData:
    N = parse_group(group)
    return modular_data(N, level) if isinstance(level, int) and level >= 1 else ModularData(N, level)


def surgery_partition_function(e0: int, pq: Sequence[tuple[int, int]], group="SU(2)", level: int = 1,
                               digits: int = 30, exact: bool | None = None) -> FiniteLevelValue:
    """``Z_k`` of the Lawrence–Rozansky surgery ``X(p_1/q_1, ...)`` with central framing ``e0``.

    Examples
    --------
    >>> z = surgery_partition_function(0, [(1, 1)], "SU(2)", 3)    # X(1/1) = S^3
    >>> mpmath.nstr(z.numeric.real, 12)                              # S_00 = sqrt(2/5) sin(pi/5)
    '0.37174803446'
    """
    md = _group_level(group, level)
    pres = SurgeryPresentation.from_coefficients(e0, pq)
    value, numeric = _evaluate(md, pres, {}, [], digits, exact)
    return FiniteLevelValue(
        exact=value, numeric=numeric, digits=digits,
        framing="canonical 2-framing (Atiyah)",
        orientation=f"X({', '.join(f'{p}/{q}' for p, q in pq)}) with central framing {e0}",
        normalisation="Z(S^3) = S_00, Z(S^2 x S^1) = 1",
        details={"route": "surgery", "group": f"SU({md.N})", "level": md.k},
    )


#: Above this shifted level ``K`` the SU(2) partition function uses the Lawrence–Rozansky
#: Gauss sum (when it applies) in the automatic route: the surgery route costs ``O(K^2)``.
AUTO_GAUSS_SUM_K = 200

PARTITION_ROUTES = ("auto", "surgery", "gauss-sum", "both")


def partition_function(space, group="SU(2)", level: int = 1, digits: int = 30,
                       exact: bool | None = None, route: str = "auto") -> FiniteLevelValue:
    """Chern–Simons partition function ``Z_k(M)`` of a Seifert manifold over S^2.

    Parameters
    ----------
    space : SeifertManifold-like (``.b``, ``.fibers``) or ``(b, [(a_1, b_1), ...])``
        ``M(0; b; (a_1, b_1), ...)`` with Euler number ``e = -(b + sum b_i/a_i)``.
    group : str or int
        ``"SU(N)"``.
    level : int
        ``k >= 1``; ``K = k + N``.
    digits : int
        Correct digits of the numeric value (checked at higher precision).
    exact : bool or None
        Force (``True``) or skip (``False``) the exact cyclotomic value; ``None`` decides
        by size.

    Returns
    -------
    FiniteLevelValue
        Normalised by ``Z(S^3) = S_00``, ``Z(S^2 x S^1) = 1``; canonical 2-framing.

    References
    ----------
    N. Reshetikhin & V. Turaev, Invent. Math. 103 (1991); R. Kirby & P. Melvin, Invent.
    Math. 105 (1991); L. Jeffrey, Commun. Math. Phys. 147 (1992); CONVENTIONS §9.

    Examples
    --------
    >>> z = partition_function((1, []), "SU(2)", 3)        # M(0; 1; ) = S^3
    >>> mpmath.nstr(z.numeric.real, 12)
    '0.37174803446'
    >>> partition_function((0, []), "SU(3)", 2).numeric    # S^2 x S^1
    mpc(real='1.0', imag='0.0')
    """
    if route not in PARTITION_ROUTES:
        raise KnotobsError(f"unknown route {route!r}: choose one of {', '.join(PARTITION_ROUTES)}")
    genus = seifert_genus(space)
    b, fibers = seifert_data(_plain(space))
    md = _group_level(group, level)
    if genus and route in ("gauss-sum", "both"):
        raise KnotobsError(
            f"the Gauss-sum route is implemented for base genus 0; M has genus {genus}: use route='surgery'"
        )
    if route in ("gauss-sum", "both") or (route == "auto" and md.N == 2 and md.K > AUTO_GAUSS_SUM_K
                                          and genus == 0):
        from knotobs.evaluation.gauss_sum import gauss_sum_partition_function

        try:
            gs = gauss_sum_partition_function((b, fibers), md.k, digits, exact)
        except KnotobsError:
            if route in ("gauss-sum", "both"):
                raise
            gs = None  # not applicable (orders sharing a factor, H = 0): fall back to surgery
        if md.N != 2 and gs is not None:  # pragma: no cover - the Gauss sum is SU(2) only
            raise KnotobsError("the Gauss-sum route is SU(2) only")
        if gs is not None and route != "both":
            return gs
    e0, pq = seifert_to_surgery(b, fibers)
    pres = SurgeryPresentation.from_coefficients(e0, pq)
    value, numeric = _evaluate(md, pres, {}, [], digits, exact, genus)
    if route == "both":
        with working_precision(digits + 5):
            if abs(gs.numeric - numeric) > mpmath.mpf(10) ** (3 - digits) * max(1, abs(numeric)):
                raise KnotobsError(  # pragma: no cover - would be a bug
                    f"surgery and Gauss-sum routes disagree at level {md.k}: {numeric} vs {gs.numeric}"
                )
    return FiniteLevelValue(
        exact=value, numeric=numeric, digits=digits,
        framing="canonical 2-framing (Atiyah)",
        orientation=_orientation_text(b, fibers, genus),
        normalisation="Z(S^3) = S_00, Z(S^2 x S^1) = 1" + (
            "; base genus g: Z(S^1 x Sigma_g) = Verlinde dimension, phase as for genus 0"
            " (canonical 2-framing of the plumbing)" if genus else ""),
        details={"route": "surgery" if route != "both" else "surgery = Gauss sum (both checked)",
                 "group": f"SU({md.N})", "level": md.k, "seifert": (b, fibers), "genus": genus},
    )


def _orientation_text(b, fibers, genus: int = 0) -> str:
    e = -(Fraction(b) + sum(Fraction(bb, a) for a, bb in fibers))
    fs = "".join(f"; ({a},{bb})" if i == 0 else f", ({a},{bb})" for i, (a, bb) in enumerate(fibers))
    return f"M({genus}; {b}{fs}) with e = -(b + sum b_i/a_i) = {e} (Neumann-Raymond)"


def fiber_wilson_loop(space, level: int, group="SU(2)", regular: Sequence = (),
                      exceptional: Mapping[int, object] | None = None, normalized: bool = True,
                      digits: int = 30, framing: str = "fiber",
                      exact: bool | None = None) -> FiniteLevelValue:
    """Wilson loops along fibers of ``M(0; b; (a_i, b_i))``: coloured regular fibers (a torus
    link when several) and coloured exceptional fibers.

    Parameters
    ----------
    space : SeifertManifold-like or ``(b, fibers)``
    level : int
    group : str
    regular : list of partitions
        Colours of parallel regular fibers.
    exceptional : dict ``{fiber_index: partition}``
        ``fiber_index`` counts the fibers ``(a_i, b_i)`` from 0.  The core is oriented so that
        a nearby regular fiber is homologous to ``a_i`` times it (CONVENTIONS §7), whatever the
        sign of ``b_i``.
    normalized : bool
        ``True``: ``Z(M; L)/Z(M)`` (in S^3 the unknot gives ``dim_q``);
        ``False``: ``Z(M; L)`` (in S^3 the unknot gives ``S_{0 lam}``).
    framing : ``"fiber"`` or ``"zero"``
        ``"fiber"``: each line framed by the 0-framing of its meridian in the surgery diagram
        (for regular fibers the fiber framing); ``"zero"``: converted to the Seifert framing,
        only if every line is null-homologous.

    References
    ----------
    CONVENTIONS §7; Reshetikhin & Turaev 1991; L. Rozansky, Commun. Math. Phys. 178 (1996).

    Examples
    --------
    >>> w = fiber_wilson_loop((0, [(2, 1), (3, -1)]), 3, "SU(2)", regular=[(1,)])  # S^3, T(2,3)
    >>> w.details["framings"]
    [Fraction(6, 1)]
    """
    genus = seifert_genus(space)
    b, fibers = seifert_data(_plain(space))
    md = _group_level(group, level)
    exceptional = dict(exceptional or {})
    for j in exceptional:
        if not isinstance(j, int) or not 0 <= j < len(fibers):
            raise InvalidSeifertDataError(
                f"fiber index {j!r} does not exist: valid indices are 0..{len(fibers) - 1}"
                if fibers else f"fiber index {j!r} does not exist: the space has no exceptional fibers"
            )
    reg_idx = [md.weight_index(check_integrable(lam, md.N, md.k)) for lam in regular]
    # The core of fiber j is oriented so that a nearby regular fiber is homologous to a_j times
    # it (CONVENTIONS §7).  The meridian of the last vertex of the chain of a_j/b_j carries that
    # orientation when b_j > 0 and the opposite one when b_j < 0 (found by comparing
    # presentations of the same fibration, e.g. M(0; 0; (2,1), (3,-1)) = M(0; -1; (2,1), (3,2))):
    # there the colour is replaced by its dual.
    exc_idx = {j: md.weight_index(check_integrable(lam, md.N, md.k)) for j, lam in exceptional.items()}
    exc_idx = {j: (md.index[md.dual(md.weights[i])] if fibers[j][1] < 0 else i) for j, i in exc_idx.items()}
    e0, pq = seifert_to_surgery(b, fibers)
    pres = SurgeryPresentation.from_coefficients(e0, pq)

    A = pres.linking_matrix()
    Ainv = _inverse_matrix(A)
    verts = [0] * len(reg_idx) + [pres.vertex_of(j) for j in exc_idx]
    colours = list(reg_idx) + list(exc_idx.values())
    framings: list[Fraction | None] = []
    null_hom: list[bool] = []
    for v in verts:
        if Ainv is None:
            framings.append(None)
            null_hom.append(False)
        else:
            framings.append(-Ainv[v][v])
            null_hom.append(all(Ainv[r][v].denominator == 1 for r in range(len(A))))

    val_L, num_L = _evaluate(md, pres, exc_idx, reg_idx, digits + 5, exact, genus)
    if framing not in ("fiber", "zero"):
        raise KnotobsError(f"framing {framing!r} is not known: use 'fiber' or 'zero'")
    shift = Fraction(0)
    if framing == "zero":
        for f, ok, lam in zip(framings, null_hom, colours):
            if f is None or not ok:
                raise InexactDivisionError(
                    "a fiber is not null-homologous in this manifold, so it has no zero framing;"
                    " use framing='fiber' (--framing fiber)"
                )
            shift -= f * md.h(md.weights[lam])
    if normalized:
        val_0, num_0 = _evaluate(md, pres, {}, [], digits + 5, exact, genus)
        if abs(num_0) < mpmath.mpf(10) ** (-(digits + 3)):
            raise InexactDivisionError(
                f"Z(M) vanishes at level {md.k}; the normalised Wilson loop is undefined: ask for Z(M; L)"
                " itself (normalized=False; knotobs loop --raw)"
            )
    with working_precision(digits + 10):
        phase = mpmath.expjpi(2 * mpmath.mpf(shift.numerator) / shift.denominator)
        if normalized:
            numeric = num_L / num_0 * phase
        else:
            numeric = num_L * phase
    value = None
    if val_L is not None and (not normalized or val_0 is not None):
        ph = CyclotomicField(shift.denominator).zeta(shift.numerator)
        value = (val_L / val_0 if normalized else val_L) * ph
        numeric = value.to_mpc(digits)
    else:
        with working_precision(digits):
            numeric = +numeric
    fr_text = ("0-framing of the surgery-diagram meridian (regular fibers: fiber framing);"
               f" self-linking in M: {', '.join(str(f) for f in framings)}") if framing == "fiber" \
        else "zero (Seifert) framing"
    return FiniteLevelValue(
        exact=value, numeric=numeric, digits=digits,
        framing=fr_text,
        orientation=_orientation_text(b, fibers, genus),
        normalisation=("Z(M; L)/Z(M) (unknot in S^3 = dim_q)" if normalized
                       else "Z(M; L) with Z(S^3) = S_00 (unknot in S^3 = S_0lam)"),
        details={"route": "surgery", "group": f"SU({md.N})", "level": md.k,
                 "framings": framings, "null_homologous": null_hom},
    )
