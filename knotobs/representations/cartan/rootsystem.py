"""Root systems from simple roots: Cartan matrix, fundamental weights, inner products, Weyl group.

The generic half of the Cartan engine (the other half, :mod:`.characters`, builds
characters on top of it).  A family module (:mod:`.type_a`, ..., :mod:`.type_g`)
supplies only the simple roots in an orthonormal basis ``e_1, e_2, ...``; everything
else is computed here from them:

* the metric is the Euclidean one rescaled so that **long roots have length^2 = 2**
  (CONVENTIONS §2; for ``B_1 = so(3)`` the single root counts as long, so SO(3) carries
  the normalisation of SU(2));
* the Cartan matrix ``A_ij = 2 (alpha_i, alpha_j)/(alpha_j, alpha_j) = <alpha_i, alpha_j^vee>``, so
  that row i is ``alpha_i`` in Dynkin labels (the transpose of Bourbaki's ``<alpha_i^vee, alpha_j>``);
* fundamental weights ``omega_i`` with ``(omega_i, alpha_j^vee) = delta_ij``, i.e.
  ``alpha_i = sum_j A_ij omega_j``;
* weights are integer vectors of **Dynkin labels** (coordinates in the basis of
  fundamental weights); the simple reflection is ``s_i(lam) = lam - lam_i A_i``
  (``A_i`` the i-th row);
* the quadratic form ``F_ij = (omega_i, omega_j)``, ``rho = (1, ..., 1)``;
* positive roots as the Weyl orbits of the simple roots with ``(beta, rho) > 0``;
* Weyl orbits by lowering reflections (from a dominant weight apply ``s_i`` only where
  the label is positive); for the regular weight ``rho`` the depth of that search is the
  length of the Weyl group element, which gives its sign.

References
----------
N. Bourbaki, *Groupes et algebres de Lie*, ch. VI (root systems, plates I–IX for the
labelling of simple roots); J. E. Humphreys, *Introduction to Lie Algebras and
Representation Theory*, Springer GTM 9 (1972), §10–§13.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction
from functools import cached_property
from math import lcm, prod
from typing import Sequence

import numpy as np

__all__ = ["RootSystem", "Weight"]

Weight = tuple[int, ...]


def _inverse(M: list[list[Fraction]]) -> list[list[Fraction]]:
    """Exact inverse of a square rational matrix (Gauss–Jordan)."""
    n = len(M)
    A = [list(map(Fraction, row)) + [Fraction(int(i == j)) for j in range(n)] for i, row in enumerate(M)]
    for c in range(n):
        p = next(r for r in range(c, n) if A[r][c] != 0)
        A[c], A[p] = A[p], A[c]
        piv = A[c][c]
        A[c] = [x / piv for x in A[c]]
        for r in range(n):
            if r != c and A[r][c] != 0:
                f = A[r][c]
                A[r] = [x - f * y for x, y in zip(A[r], A[c])]
    return [row[n:] for row in A]


@dataclass(frozen=True)
class RootSystem:
    """A (semi)simple root system given by its simple roots in an orthonormal basis.

    Parameters
    ----------
    name : str
        Cartan type, e.g. ``"B2"``.
    simple_roots : tuple of tuple of Fraction
        Simple roots in the basis ``e_1, e_2, ...`` with the Euclidean metric (Bourbaki order).

    Examples
    --------
    >>> from knotobs.representations.cartan.type_b import root_system
    >>> R = root_system(2)
    >>> R.cartan_matrix
    ((2, -2), (-1, 2))
    >>> R.metric_scale, len(R.positive_roots), R.weyl_order
    (Fraction(1, 1), 4, 8)
    """

    name: str
    simple_roots: tuple[tuple[Fraction, ...], ...]
    _cache: dict = field(default_factory=dict, compare=False, hash=False, repr=False)

    # ------------------------------------------------------------ metric
    @property
    def rank(self) -> int:
        return len(self.simple_roots)

    @cached_property
    def metric_scale(self) -> Fraction:
        """Factor multiplying the Euclidean metric so that long roots have length^2 = 2."""
        longest = max(sum(x * x for x in a) for a in self.simple_roots)
        return Fraction(2) / longest

    def _eucl(self, u: Sequence[Fraction], v: Sequence[Fraction]) -> Fraction:
        return sum((x * y for x, y in zip(u, v)), Fraction(0)) * self.metric_scale

    @cached_property
    def cartan_matrix(self) -> tuple[tuple[int, ...], ...]:
        """``A_ij = 2 (alpha_i, alpha_j)/(alpha_j, alpha_j)``."""
        r = self.simple_roots
        out = []
        for a in r:
            row = []
            for b in r:
                v = 2 * self._eucl(a, b) / self._eucl(b, b)
                assert v.denominator == 1
                row.append(int(v))
            out.append(tuple(row))
        return tuple(out)

    @cached_property
    def fundamental_weights(self) -> tuple[tuple[Fraction, ...], ...]:
        """``omega_i`` in the orthonormal basis: ``omega = A^-1 alpha`` (rows)."""
        Ainv = _inverse([list(map(Fraction, row)) for row in self.cartan_matrix])
        dim = len(self.simple_roots[0])
        return tuple(
            tuple(sum((Ainv[i][k] * self.simple_roots[k][c] for k in range(self.rank)), Fraction(0)) for c in range(dim))
            for i in range(self.rank)
        )

    @cached_property
    def quadratic_form(self) -> tuple[tuple[Fraction, ...], ...]:
        """``F_ij = (omega_i, omega_j)`` in the normalised metric."""
        w = self.fundamental_weights
        return tuple(tuple(self._eucl(a, b) for b in w) for a in w)

    @cached_property
    def form_denominator(self) -> int:
        """Common denominator ``D`` of the entries of ``F`` (so ``D F`` is an integer matrix)."""
        return lcm(*[x.denominator for row in self.quadratic_form for x in row])

    @cached_property
    def form_int(self) -> np.ndarray:
        """``D F`` as an integer numpy matrix."""
        D = self.form_denominator
        return np.array([[int(x * D) for x in row] for row in self.quadratic_form], dtype=np.int64)

    @cached_property
    def _form_rows(self) -> tuple[tuple[int, ...], ...]:
        D = self.form_denominator
        return tuple(tuple(int(x * D) for x in row) for row in self.quadratic_form)

    def inner(self, lam: Sequence[int], mu: Sequence[int]) -> Fraction:
        """``(lam, mu)`` for weights given by Dynkin labels (integer arithmetic, one division)."""
        F = self._form_rows
        r = range(self.rank)
        tot = 0
        for i in r:
            li = lam[i]
            if li:
                row = F[i]
                tot += li * sum(row[j] * mu[j] for j in r if mu[j])
        return Fraction(tot, self.form_denominator)

    def to_orthonormal(self, lam: Sequence[int]) -> tuple[Fraction, ...]:
        """The weight with Dynkin labels ``lam`` in the basis ``e_1, e_2, ...`` (unscaled)."""
        w = self.fundamental_weights
        return tuple(sum((lam[i] * w[i][c] for i in range(self.rank)), Fraction(0)) for c in range(len(w[0])))

    # ------------------------------------------------------------ reflections
    @property
    def rho(self) -> Weight:
        """Half the sum of the positive roots: Dynkin labels ``(1, ..., 1)``."""
        return (1,) * self.rank

    def reflect(self, lam: Sequence[int], i: int) -> Weight:
        """Simple reflection ``s_i(lam) = lam - lam_i alpha_i``."""
        c = lam[i]
        row = self.cartan_matrix[i]
        return tuple(x - c * a for x, a in zip(lam, row))

    def to_dominant(self, lam: Sequence[int]) -> tuple[Weight, int]:
        """The dominant weight in the Weyl orbit of ``lam`` and the parity ``(-1)^length`` used."""
        lam = list(lam)
        sign = 1
        A = self.cartan_matrix
        r = self.rank
        while True:
            for i in range(r):
                c = lam[i]
                if c < 0:
                    row = A[i]
                    for j in range(r):
                        lam[j] -= c * row[j]
                    sign = -sign
                    break
            else:
                return tuple(lam), sign

    def dot_dominant(self, lam: Sequence[int]) -> tuple[int, Weight | None]:
        """``w . lam = w(lam + rho) - rho`` made dominant, with ``eps(w)``; ``(0, None)`` on a wall."""
        mu, sign = self.to_dominant([x + 1 for x in lam])
        if any(x == 0 for x in mu):
            return 0, None
        return sign, tuple(x - 1 for x in mu)

    def orbit(self, lam: Sequence[int]) -> list[Weight]:
        """The Weyl orbit of ``lam`` (any weight), dominant element first."""
        return [w for w, _ in self._orbit_with_depth(self.to_dominant(lam)[0])]

    def _orbit_with_depth(self, dom: Weight) -> list[tuple[Weight, int]]:
        key = ("orbit", dom)
        if key in self._cache:
            return self._cache[key]
        seen = {dom: 0}
        order = [dom]
        k = 0
        while k < len(order):
            lam = order[k]
            d = seen[lam]
            for i in range(self.rank):
                if lam[i] > 0:
                    nu = self.reflect(lam, i)
                    if nu not in seen:
                        seen[nu] = d + 1
                        order.append(nu)
            k += 1
        out = [(w, seen[w]) for w in order]
        if len(self._cache) < 4096:
            self._cache[key] = out
        return out

    @cached_property
    def weyl_rho(self) -> tuple[tuple[Weight, ...], tuple[int, ...]]:
        """All ``w(rho)`` with ``eps(w) = (-1)^length(w)`` (``rho`` is regular, so ``w -> w(rho)`` is 1:1)."""
        pairs = self._orbit_with_depth(self.rho)
        return tuple(w for w, _ in pairs), tuple(-1 if d % 2 else 1 for _, d in pairs)

    @cached_property
    def exponents(self) -> tuple[int, ...]:
        """The exponents ``m_1 <= ... <= m_r``: the partition dual to the numbers of positive roots
        of each height (Kostant 1959; Humphreys, *Reflection Groups and Coxeter Groups*, 1990, §3.20).

        >>> from knotobs.representations.cartan import type_d, type_g
        >>> type_g.root_system(2).exponents, type_d.root_system(4).exponents
        ((1, 5), (1, 3, 3, 5))
        """
        Ainv = _inverse([list(map(Fraction, row)) for row in self.cartan_matrix])
        heights: dict[int, int] = {}
        for b in self.positive_roots:
            h = sum(sum(b[j] * Ainv[j][i] for j in range(self.rank)) for i in range(self.rank))
            heights[int(h)] = heights.get(int(h), 0) + 1
        counts = [heights.get(h, 0) for h in range(1, max(heights) + 1)]
        # m_i >= h for exactly counts[h - 1] exponents
        return tuple(sorted(sum(1 for c in counts if c > i) for i in range(self.rank)))

    @property
    def weyl_order(self) -> int:
        """``|W| = prod (m_i + 1)`` (the product of the degrees; Humphreys 1990, §3.9), without
        listing the group (``SO(20)`` has ``1.9 10^9`` elements).

        >>> from knotobs.representations.cartan import type_d
        >>> type_d.root_system(10).weyl_order
        1857945600
        """
        return prod(m + 1 for m in self.exponents)

    @cached_property
    def positive_roots(self) -> tuple[Weight, ...]:
        """Positive roots in Dynkin labels (the Weyl orbits of the simple roots, ``(beta, rho) > 0``)."""
        roots: set[Weight] = set()
        for a in self.cartan_matrix:
            roots.update(self.orbit(a))
        pos = [b for b in roots if self.inner(b, self.rho) > 0]
        return tuple(sorted(pos, key=lambda b: (self.inner(b, self.rho), b)))

    @cached_property
    def long_root_length2(self) -> Fraction:
        return max(self.inner(b, b) for b in self.positive_roots)

    @cached_property
    def dual_coxeter(self) -> Fraction:
        """``h^vee = 1 + (theta, rho)`` with ``theta`` the highest root (long roots of length^2 2).

        For a semisimple, non-simple system this is the value of the first highest root found.
        """
        theta = max(self.positive_roots, key=lambda b: self.inner(b, self.rho))
        return 1 + self.inner(theta, self.rho)
