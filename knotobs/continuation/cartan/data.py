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

from flint import acb, arb

from knotobs.continuation.level import LRData
from knotobs.errors import InvalidGroupError, InvalidSeifertDataError, KnotobsError
from knotobs.representations.permutations import permutation_sign

__all__ = ["CartanData", "weyl_vectors", "B_N"]


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
        lr = LRData.from_space(_lens_form(space))
        if lr.space.genus != 0:
            raise InvalidSeifertDataError(
                f"{lr.space} has base genus {lr.space.genus}: the continuation in K is built for"
                " base genus 0 (Seifert rational homology spheres over S^2)"
            )
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
    def entire(self) -> bool:
        """``h`` is entire (no poles) iff at most two orders exceed 1 (then
        ``prod_j Delta(z/p_j)/Delta(z)^(n-2) = Delta(z/p_a) Delta(z/p_b)``, missing ones ``= 1``)."""
        return len(self.big_orders) <= 2

    def two_orders(self) -> tuple[int, int]:
        """``(p_a, p_b)`` with ``G = Delta(z/p_a) Delta(z/p_b)`` in the entire case."""
        b = list(self.big_orders) + [1, 1]
        return b[0], b[1]


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
    return (sign * mod) * (acb(0, d.sigma * (N * N - 1)) * pi / 4).exp() * (acb(0, -1) * pi * rho2 * ph / K).exp()


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
