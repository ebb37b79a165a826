r"""Data of the SU(N) Lawrence–Rozansky form on a Seifert rational homology sphere (CONVENTIONS §18).

``M = X(p_1/q_1, ..., p_n/q_n)`` (:meth:`SeifertManifold.surgery_presentation`), ``P = prod p_j``,
``H = P sum q_j/p_j != 0``, ``sigma = sign H``, ``phi`` as in CONVENTIONS §9 (the same data as
the SU(2) continuation, :class:`knotobs.continuation.level.LRData`).  For SU(N), rank
``r = N - 1``, ``|Delta+| = N(N-1)/2``, ``dim G = N^2 - 1``, ``|rho|^2 = N(N^2-1)/12``, the
finite-level value is (docs/continuation_sun.md §18.1)

    ``Z_k(M) = B_N(K) K^(-r) sum'_{lam in Lambda / P K Q} h(lam/K)``,
    ``h(z) = exp(-i pi K H |z|^2/P) prod_j Delta(z/p_j) / Delta(z)^(n-2)``,
    ``Delta(z) = prod_{alpha > 0} 2i sin(pi <alpha, z>) = sum_{w in W} eps(w) exp(2 pi i <w rho, z>)``,
    ``B_N(K) = (-1)^{|Delta+|} exp(i pi sigma dim G/4) / (|W| N P^(r/2)) exp(-i pi |rho|^2 phi/K)``,

``Lambda`` the weight lattice, ``Q`` the root lattice (roots of length^2 2); the prime omits the
weights on an affine wall.  For N = 2 it is Lawrence–Rozansky's sum (CONVENTIONS §9).

References
----------
R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314; M. Mariño, Commun. Math.
Phys. 253 (2005) 25–49 (hep-th/0207096).
"""

from __future__ import annotations

import itertools
import math
from dataclasses import dataclass
from fractions import Fraction
from functools import lru_cache

from flint import acb, arb

from knotobs.continuation.level import LRData
from knotobs.errors import InvalidGroupError, InvalidSeifertDataError, KnotobsError
from knotobs.representations.permutations import permutation_sign

__all__ = ["CartanData", "Coset", "weyl_vectors", "B_N"]


class PolesNotCoveredError(KnotobsError, NotImplementedError):
    """A case whose residue structure the SU(N) continuation does not have (refused, not guessed)."""


def weyl_vectors(N: int) -> list[tuple[tuple[Fraction, ...], int]]:
    """``(w rho, eps(w))`` for every ``w`` in ``S_N``; ``rho = ((N-1)/2, ..., -(N-1)/2)`` in ``R^N``.

    >>> [(tuple(str(x) for x in v), s) for v, s in weyl_vectors(2)]
    [(('1/2', '-1/2'), 1), (('-1/2', '1/2'), -1)]
    """
    rho = [Fraction(N - 1 - 2 * i, 2) for i in range(N)]
    out = []
    for p in itertools.permutations(range(N)):
        out.append((tuple(rho[p[i]] for i in range(N)), permutation_sign(list(p))))
    return out


@dataclass(frozen=True)
class CartanData:
    """The SU(N) Lawrence–Rozansky data of a Seifert rational homology sphere.

    Attributes
    ----------
    lr : LRData
        ``X(p_j/q_j)`` data (``P``, ``H``, ``phi``), shared with the SU(2) continuation.
    N : int

    Examples
    --------
    >>> d = CartanData.from_space("L(5,1)", 3)
    >>> d.r, d.P, d.H, d.big_orders, d.entire
    (2, 1, 5, (), True)
    >>> CartanData.from_space("Sigma(2,3,5)", 3).entire
    False
    """

    lr: LRData
    N: int

    @classmethod
    def from_space(cls, space, N: int) -> "CartanData":
        if isinstance(N, bool) or not isinstance(N, int) or N < 2:
            raise InvalidGroupError(f"SU(N) needs an integer N >= 2, got N = {N!r}")
        lr = LRData.from_space(_lens_form(space), allow_shared=True, allow_genus=True)
        nbig = len([p for p in lr.ps if p > 1])
        if lr.genus and N != 3:
            hint = ("the SU(2) continuation is knotobs.continuation.level.continued_partition_function"
                    " (knotobs continue without --group)" if N == 2 else
                    f"the finite levels are computed by 'knotobs space ... --group SU({N}) --level k'")
            raise InvalidSeifertDataError(
                f"{lr.space} has base genus {lr.genus}: the SU(N) continuation in K on a base of genus"
                " g >= 1 (poles of order 2g + n - 2 on the root hyperplanes, docs/continuation_sun.md"
                f" §18.9) is built for SU(3); {hint}")
        if lr.shared and (N != 3 or (nbig <= 2 and not lr.genus)):
            orders = ", ".join(str(p) for p in lr.ps if p > 1)
            raise InvalidSeifertDataError(
                f"{lr.space}: the exceptional orders {orders} share a factor; the SU(N) continuation"
                " in K splits such a sum into cosets (docs/continuation_sun.md §18.8) for SU(3) with"
                " three or more exceptional fibers (or base genus >= 1); the finite levels are"
                f" computed by 'knotobs space ... --group SU({N}) --level k'")
        return cls(lr, N)

    # ---------------------------------------------------------------- numbers
    @property
    def r(self) -> int:
        return self.N - 1

    @property
    def npos(self) -> int:
        return self.N * (self.N - 1) // 2

    @property
    def P(self) -> int:
        return self.lr.P

    @property
    def H(self) -> int:
        return self.lr.H

    @property
    def sigma(self) -> int:
        return self.lr.sigma

    @property
    def phi(self) -> Fraction:
        return self.lr.phi

    @property
    def n(self) -> int:
        return self.lr.n

    @property
    def space(self):
        return self.lr.space

    @property
    def rho2(self) -> Fraction:
        return Fraction(self.N * (self.N * self.N - 1), 12)

    @property
    def big_orders(self) -> tuple[int, ...]:
        """The orders ``p_j > 1``."""
        return tuple(p for p in self.lr.ps if p > 1)

    @property
    def genus(self) -> int:
        return self.lr.genus

    @property
    def deg(self) -> int:
        """Power of ``Delta(z)`` left in the denominator: ``n_> - 2 + 2g`` (``n_>`` orders ``> 1``;
        every fiber of order 1 cancels one power)."""
        return len(self.big_orders) - 2 + 2 * self.genus

    @property
    def entire(self) -> bool:
        """``h`` is entire and given by the closed form iff the base has genus 0 and at most two
        orders exceed 1 (then ``prod_j Delta(z/p_j)/Delta(z)^(n-2) = Delta(z/p_a) Delta(z/p_b)``,
        missing ones ``= 1``); with genus ``g >= 1`` the residue route is used (§18.9)."""
        return self.genus == 0 and len(self.big_orders) <= 2

    @property
    def shared(self) -> bool:
        """Two exceptional orders share a factor (``L = lcm p_j < P``)."""
        return self.lr.shared

    @property
    def L(self) -> int:
        """Period of every coset: ``lcm p_j`` (``P`` for coprime orders)."""
        return math.lcm(*self.lr.ps) if self.lr.ps else 1

    @property
    def HL(self) -> int:
        """``H L/P``: ``H`` of every coset."""
        return self.H * self.L // self.P

    def cosets(self) -> list["Coset"]:
        """The cosets of §18.8 up to the Weyl group, with their orbit sizes (SU(3)).

        The per-fiber Gauss sums run over ``n_j in Q/p_j Q``; the tuples ``(n_j)`` are the cosets
        ``n_j = n + s_j`` of the diagonal ``Q/LQ``, ``(P/L)^2`` of them, and ``W`` permutes them
        (``h_{ws}(w z) = h_s(z)``).  One coset ``s = 0`` for coprime orders.

        >>> cs = CartanData.from_space("M(0; -1; (2,1), (4,1), (6,1))", 3).cosets()
        >>> sum(c.weight for c in cs), len(cs)
        (16, 5)
        """
        return list(_cosets(tuple(self.lr.pq), self.sigma))

    def two_orders(self) -> tuple[int, int]:
        """``(p_a, p_b)`` with ``G = Delta(z/p_a) Delta(z/p_b)`` in the entire case."""
        b = list(self.big_orders) + [1, 1]
        return b[0], b[1]


@dataclass(frozen=True)
class Coset:
    """One coset ``s = (s_j)`` of §18.8 (SU(3), root coordinates ``s_j = t_1 alpha_1 + t_2 alpha_2``).

    Attributes
    ----------
    shifts : tuple
        ``(<alpha_1, s_j>, <alpha_2, s_j>)`` for each exceptional order: the shifts of its sines.
    lin : tuple of Fraction
        ``c = sum_j q_j s_j/p_j`` in root coordinates, ``sigma c`` reduced to ``[0, 1)^2``
        (allowed at integer ``K``): the linear phase ``exp(-2 pi i K <z, c>)``.
    const : Fraction
        ``sum_j q_j |s_j|^2/(2 p_j)``: the constant ``exp(-2 pi i K const)``.
    weight : int
        Size of the Weyl orbit of the coset (every member contributes the same at integer ``K``).
    """

    shifts: tuple[tuple[int, int], ...]
    lin: tuple[Fraction, Fraction]
    const: Fraction
    weight: int

    @classmethod
    def trivial(cls, n: int) -> "Coset":
        """The one coset ``s = 0`` of ``n`` pairwise coprime orders."""
        return cls(((0, 0),) * n, (Fraction(0), Fraction(0)), Fraction(0), 1)

    def negated(self) -> "Coset":
        """The coset data of ``-M`` (``q_j -> -q_j``)."""
        return Coset(self.shifts, (-self.lin[0], -self.lin[1]), -self.const, self.weight)


def _weyl_image(perm: tuple[int, ...], t1: int, t2: int) -> tuple[int, int]:
    """``w(t_1 alpha_1 + t_2 alpha_2)`` in root coordinates, ``w`` the permutation ``perm`` of the
    coordinates of ``R^3`` (the convention of :func:`weyl_vectors`): ``t alpha = (t_1, t_2 - t_1, -t_2)``."""
    v = (t1, t2 - t1, -t2)
    w = tuple(v[perm[i]] for i in range(3))
    return w[0], -w[2]


@lru_cache(maxsize=32)
def _cosets(pq: tuple[tuple[int, int], ...], sigma: int) -> tuple[Coset, ...]:
    big = [(p, q) for p, q in pq if p > 1]
    ps = [p for p, _ in big]
    L = math.lcm(*ps) if ps else 1
    per = [list(itertools.product(range(p), repeat=2)) for p in ps]
    coset_of: dict = {}
    reps: list = []
    for tup in itertools.product(*per):
        if tup in coset_of:
            continue
        cid = len(reps)
        reps.append(tup)
        for n1 in range(L):
            for n2 in range(L):
                coset_of[tuple(((t1 + n1) % p, (t2 + n2) % p) for (t1, t2), p in zip(tup, ps))] = cid
    W = list(itertools.permutations(range(3)))
    seen: set = set()
    out = []
    for cid, tup in enumerate(reps):
        if cid in seen:
            continue
        orbit = set()
        for w in W:
            img = tuple(tuple(x % p for x in _weyl_image(w, t1, t2)) for (t1, t2), p in zip(tup, ps))
            orbit.add(coset_of[img])
        seen |= orbit
        c1 = sum((Fraction(q * t1, p) for (t1, _), (p, q) in zip(tup, big)), Fraction(0))
        c2 = sum((Fraction(q * t2, p) for (_, t2), (p, q) in zip(tup, big)), Fraction(0))
        lin = tuple(sigma * ((sigma * c) % 1) for c in (c1, c2))
        const = sum((Fraction(q * (2 * t1 * t1 - 2 * t1 * t2 + 2 * t2 * t2), 2 * p)
                     for (t1, t2), (p, q) in zip(tup, big)), Fraction(0))
        shifts = tuple((2 * t1 - t2, -t1 + 2 * t2) for t1, t2 in tup)
        out.append(Coset(shifts, lin, const, len(orbit)))
    return tuple(out)


def B_N(d: CartanData, K: acb) -> acb:
    """``B_N(K)`` of the module docstring (a ball at the current precision).

    >>> from knotobs.numerics import working_precision
    >>> with working_precision(20):
    ...     b = B_N(CartanData.from_space("S^3", 2), acb(5))
    >>> abs(complex(b.mid()) - complex(-0.25 * math.e ** (3j * math.pi / 4) * math.e ** (-1j * math.pi / 5))) < 1e-12
    True
    """
    pi = arb.pi()
    N, r = d.N, d.r
    ph = acb(d.phi.numerator) / d.phi.denominator
    rho2 = acb(d.rho2.numerator) / d.rho2.denominator
    mod = 1 / (arb(math.factorial(N) * N) * arb(d.P).sqrt() ** r)
    sign = -1 if d.npos % 2 else 1
    out = (sign * mod) * (acb(0, d.sigma * (N * N - 1)) * pi / 4).exp() * (acb(0, -1) * pi * rho2 * ph / K).exp()
    if d.genus:
        # base genus g: S_0lam^(-2g) = ((-1)^{|Delta+|} N K^r)^g Delta(lam/K)^(-2g) (§18.9)
        out = out * ((-1) ** d.npos * N * K ** r) ** d.genus
    return out


def _lens_form(space):
    """A lens space given with two exceptional orders that share a factor (``M(0; b; (2,1), (4,1))``),
    as its one-fiber form ``L(p, q)`` (same oriented manifold: the slam-dunk of
    :meth:`SeifertManifold.lens_parameters`); anything else unchanged.  The sum of §18.1 needs
    coprime orders, and a lens space always has a presentation with one exceptional fiber."""
    from knotobs.fibrations.seifert import SeifertManifold, parse_space

    M = parse_space(space) if not isinstance(space, SeifertManifold) else space
    orders = [a for a, _ in M.fibers if a > 1]
    if M.genus or len(orders) != 2 or math.gcd(*orders) == 1:
        return M
    pq = M.lens_parameters()
    if pq is None or pq[0] == 0:
        return M
    return SeifertManifold.from_lens(*pq)
