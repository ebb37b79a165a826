"""The SL(2,Z) factor of one Seifert fiber as a closed Gauss sum (CONVENTIONS §10).

For ``V = [[p, q], [c, d]]`` in SL(2,Z) with ``c > 0`` the matrix of ``V`` in the SU(N)_k
representation of SL(2,Z) (``S`` of Kac-Peterson, ``T = diag exp(2 pi i (h_lam - c_k/24))``)
has the closed form

    rho(V)_{lam mu} = (i)^{|Delta+|} exp(-2 pi i dim(G) Phi(V)/24) (N K^r c^r)^(-1/2)
        sum_{w in W} eps(w) sum_{n in Q/cQ}
        exp( i pi/(c K) [ p |lam^|^2 - 2 <lam^, w(mu^ + K n)> + d |mu^ + K n|^2 ] ),

``lam^ = lam + rho``, ``r = N - 1``, ``|Delta+| = N(N-1)/2``, ``dim G = N^2 - 1``, ``Q`` the root
lattice, ``Phi`` Rademacher's function.  For SU(2) this is L. Jeffrey's formula (Commun.
Math. Phys. 147 (1992) 563-604); for general simple groups it is the
theta-function (Weil representation) form of S. K. Hansen & T. Takata (arXiv math/0209403)
and L. Rozansky (Commun. Math. Phys. 178 (1996) 27-60).  knotobs checks the
phase and normalisation against ``S``/``T`` words in the tests (N = 2..4).

Here ``V = S U`` for the fiber ``(a, b)`` (:func:`knotobs.localisation.phase.fiber_matrix`):
``p = -b``, ``c = a``, ``d = -y``.  The sum over ``n`` is done once per fiber: writing
``<lam^, w n> = <w^-1 lam^, n>`` and expanding the square,

    sum_n ... = g(w^-1 lam^ + y mu^),  g(z) = sum_{m in (Z/a)^r} zeta_{2a}^(-y K m.A.m - 2 z.m),

with ``A`` the Cartan matrix, ``m`` the simple-root coordinates of ``n`` and ``z`` in Dynkin
coordinates (``z_j - z_{j+1}``) modulo ``a``.  ``g`` is an ``r``-dimensional discrete Fourier
transform, computed exactly in the group ring ``Z[Z/2a]`` one axis at a time
(``a^(r+1) 2a`` integer operations).  What is left per weight is a sum over the Weyl group.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from fractions import Fraction

import numpy as np

from knotobs.localisation.lattice import cartan_matrix, n_inner, n_norm, shifted, weyl_group
from knotobs.localisation.phase import fiber_matrix, rademacher_phi

__all__ = ["FiberFactor", "gauss_table"]


def gauss_table(a: int, y: int, K: int, N: int) -> np.ndarray:
    """Integer coefficients ``C[z, e]`` with ``g(z) = sum_e C[z, e] zeta_{2a}^e``.

    ``z`` runs over ``(Z/a)^r`` in mixed radix (``z = sum_j z_j a^j``, ``z_j`` the Dynkin
    label ``j`` modulo ``a``); shape ``(a^r, 2a)``.

    >>> gauss_table(1, 0, 5, 3).tolist()
    [[1, 0]]
    >>> C = gauss_table(2, 1, 5, 2)      # g(z) = sum_{m=0,1} zeta_4^(-10 m^2 - 2 z m)
    >>> C.tolist()                        # g(0) = 1 + zeta_4^2 = 0, g(1) = 1 + zeta_4^0 = 2
    [[1, 0, 1, 0], [2, 0, 0, 0]]
    """
    r = N - 1
    A = cartan_matrix(N)
    two_a = 2 * a
    grids = np.indices((a,) * r, dtype=np.int64).reshape(r, -1).T     # m vectors, C-order
    quad = np.einsum("ti,ij,tj->t", grids, A, grids)
    e0 = (-y * K * quad) % two_a
    H = np.zeros((a ** r, two_a), dtype=np.int64)
    H[np.arange(a ** r), e0] = 1
    H = H.reshape((a,) * r + (two_a,))
    e = np.arange(two_a)
    zm = np.arange(a)
    # shift[z, m, e] = (e + 2 z m) mod 2a
    shift = (e[None, None, :] + 2 * zm[:, None, None] * zm[None, :, None]) % two_a
    for axis in range(r):
        Hm = np.moveaxis(H, axis, 0)                      # (m, ..., e)
        rest = Hm.shape[1:-1]
        flat = Hm.reshape(a, -1, two_a)                   # (m, R, e)
        out = np.zeros((a, flat.shape[1], two_a), dtype=np.int64)
        for z in range(a):
            # out[z, :, e] = sum_m flat[m, :, shift[z, m, e]]
            idx = shift[z]                                # (m, e)
            out[z] = np.take_along_axis(flat, np.broadcast_to(idx[:, None, :], flat.shape), axis=2).sum(axis=0)
        H = np.moveaxis(out.reshape((a,) + rest + (two_a,)), 0, axis)
    # reorder to mixed radix z = sum_j z_j a^j (np.indices order has the last axis fastest)
    H = np.transpose(H, tuple(reversed(range(r))) + (r,))
    return H.reshape(a ** r, two_a)


@dataclass
class FiberFactor:
    """The Gauss-sum factor ``F(lam) = sum_w eps(w) zeta_M^E(lam, w) g(z(lam, w))`` of one fiber.

    ``M = 2 N a K``; ``rho(S U)_{lam mu} = i^{|Delta+|} exp(-2 pi i dim G Phi/24)
    (N K^r a^r)^(-1/2) F(lam)`` (module docstring).

    Examples
    --------
    >>> f = FiberFactor(3, 5, 2, 1, ())
    >>> f.modulus, f.phi
    (60, Fraction(-1, 1))
    """

    N: int
    K: int
    a: int
    b: int
    mu: tuple

    def __post_init__(self):
        N, K, a, b = self.N, self.K, self.a, self.b
        (p, q), (c, d) = fiber_matrix(a, b)
        self.V = ((p, q), (c, d))
        self.y = -d
        self.phi = rademacher_phi(self.V)
        self.modulus = 2 * N * a * K
        self.mu_hat = shifted(self.mu, N)
        self._table = None

    @property
    def table(self) -> np.ndarray:
        """The Gauss table of :func:`gauss_table` (built on first use, after the size guard)."""
        if self._table is None:
            self._table = gauss_table(self.a, self.y, self.K, self.N)
        return self._table

    def exponents(self, lam_hat: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """``(E, zidx, eps)``: ``E[l, w]`` mod ``M``, the table row ``zidx[l, w]`` and the signs."""
        N, a, b, y = self.N, self.a, self.b, self.y
        perms, inv, eps = weyl_group(N)
        mu = self.mu_hat
        wmu = mu[perms]                                        # (|W|, N): (w mu)_i = mu_{p(i)}
        cross = N * (lam_hat @ wmu.T) - lam_hat.sum(axis=1)[:, None] * int(mu.sum())
        E = (-b * n_norm(lam_hat)[:, None] - 2 * cross - y * int(n_norm(mu))) % self.modulus
        if a == 1:
            zidx = np.zeros(E.shape, dtype=np.int64)
        else:
            z = lam_hat[:, inv] + y * mu[None, None, :]          # (l, |W|, N): w^-1 lam + y mu
            dyn = (z[..., :-1] - z[..., 1:]) % a
            zidx = dyn @ (a ** np.arange(N - 1, dtype=np.int64))
        return E, zidx, eps
