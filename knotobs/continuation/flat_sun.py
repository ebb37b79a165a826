r"""Flat SU(N) connections on lens spaces and their Chern–Simons invariants.

``pi_1(L(p, q)) = Z/p``, so a flat SU(N) connection is a homomorphism sending the
generator to ``diag(w^(n_1), ..., w^(n_N))``, ``w = exp(2 pi i/p)``, ``sum n_i = 0 mod p``,
up to conjugation: a multiset ``{n_i}`` of residues mod ``p``.  Lift it to integers
``x_i`` with ``sum x_i = 0`` exactly; then

    ``cs = (q* / (2p)) sum_i x_i^2  mod 1``,   ``q q* = 1 mod p``,

in the orientation of :meth:`knotobs.fibrations.seifert.SeifertManifold.from_lens`
(``L(p, q)`` is ``-p/q`` surgery on the unknot).  The value does not depend on the lift
(changing ``x`` by ``p (e_i - e_j)`` moves ``cs`` by an integer).  For SU(2), ``x = (n, -n)``
gives ``q* n^2/p`` (L. Jeffrey, Commun. Math. Phys. 147 (1992) 563–604, §4, up to the
orientation convention; matched in the tests against the SU(2) sectors of the
Lawrence–Rozansky decomposition, an independent route).

The stabiliser of the holonomy in SU(N) is ``S(prod_j U(m_j))`` for multiplicities
``m_j`` of equal entries, of dimension ``sum m_j^2 - 1``; in the large-level expansion
the connection contributes with the power ``K^(-dim/2)`` (Freed & Gompf, Commun. Math.
Phys. 141 (1991); Jeffrey 1992), e.g. ``-3/2`` (trivial) and ``-1/2`` (abelian) for SU(2).
"""

from __future__ import annotations

from collections import Counter
from dataclasses import dataclass
from fractions import Fraction
from itertools import combinations_with_replacement
from math import comb
from typing import Any

from knotobs.errors import InvalidSeifertDataError, SizeLimitError
from knotobs.fibrations.seifert import SeifertManifold, parse_space
from knotobs.representations.groups import SU

__all__ = ["LensFlatConnection", "lens_flat_connections", "MAX_LENS_CLASSES"]

#: Largest number of candidate holonomies enumerated.
MAX_LENS_CLASSES = 500_000


@dataclass(frozen=True)
class LensFlatConnection:
    """One flat SU(N) connection on ``L(p, q)``.

    Attributes
    ----------
    holonomy : tuple of int
        Exponents ``n_i`` (mod ``p``, non-decreasing) of the holonomy of the generator.
    cs : Fraction
        Chern–Simons invariant mod 1, in ``[0, 1)``.
    stabilizer_dim : int
        Dimension of the centraliser of the holonomy in SU(N).
    kind : str
        ``"trivial"``, ``"central"`` (a non-trivial central holonomy) or ``"abelian"``.
    """

    holonomy: tuple[int, ...]
    cs: Fraction
    stabilizer_dim: int
    kind: str

    @property
    def K_power(self) -> Fraction:
        """Power of ``K`` of the leading term of this connection's contribution."""
        return Fraction(-self.stabilizer_dim, 2)

    def to_json(self) -> dict[str, Any]:
        return {"kind": self.kind, "cs": str(self.cs), "holonomy": list(self.holonomy),
                "stabilizer_dim": self.stabilizer_dim, "K_power": str(self.K_power)}


def _lens_pq(space) -> tuple[int, int]:
    M = space if isinstance(space, SeifertManifold) else parse_space(space)
    pq = M.lens_parameters()
    if pq is None:
        raise InvalidSeifertDataError(
            f"{M} is not a lens space; flat SU(N) connections for N > 2 are computed on lens spaces"
        )
    p, q = pq
    if p == 0:
        raise InvalidSeifertDataError(f"{M} is S^2 x S^1: its flat connections form a continuum, not a finite set")
    return abs(p), q % abs(p) if p else q


def lens_flat_connections(space, N: int) -> list[LensFlatConnection]:
    """All flat SU(N) connections on a lens space with their CS invariants, trivial first.

    Parameters
    ----------
    space : str or SeifertManifold
        ``"L(p,q)"`` or any Seifert description of a lens space (``S^3`` gives the trivial one).
    N : int
        Rank, ``N >= 2``.

    Examples
    --------
    >>> [(c.holonomy, str(c.cs), c.kind) for c in lens_flat_connections("L(5,1)", 2)]
    [((0, 0), '0', 'trivial'), ((1, 4), '1/5', 'abelian'), ((2, 3), '4/5', 'abelian')]
    >>> len(lens_flat_connections("L(4,1)", 3))     # multisets of Z/4 of size 3 summing to 0
    5

    References
    ----------
    L. Jeffrey, Commun. Math. Phys. 147 (1992) 563–604; D. Freed, R. Gompf, Commun. Math. Phys.
    141 (1991) 79–117.
    """
    SU(N)  # validates N
    p, q = _lens_pq(space)
    if p == 1:
        return [LensFlatConnection((0,) * N, Fraction(0), N * N - 1, "trivial")]
    if comb(p + N - 1, N) > MAX_LENS_CLASSES:
        raise SizeLimitError(
            f"L({p},{q}) with SU({N}) has {comb(p + N - 1, N)} candidate holonomies; at most"
            f" {MAX_LENS_CLASSES} are enumerated"
        )
    qstar = pow(q, -1, p)
    out = []
    for ns in combinations_with_replacement(range(p), N):
        s = sum(ns)
        if s % p:
            continue
        x = list(ns)
        x[-1] -= s                      # lift with sum exactly 0
        cs = Fraction(qstar * sum(v * v for v in x), 2 * p) % 1
        mult = Counter(ns).values()
        dim = sum(m * m for m in mult) - 1
        if len(mult) == 1:
            kind = "trivial" if ns[0] == 0 else "central"
        else:
            kind = "abelian"
        out.append(LensFlatConnection(tuple(ns), cs, dim, kind))
    out.sort(key=lambda c: (c.kind != "trivial", c.kind != "central", c.holonomy))
    return out
