"""The S matrix of SU(N)_k applied to vectors as a Fourier transform over the weight lattice.

CONVENTIONS §6, §11.  With ``x = lam + rho`` and ``y = mu + rho`` in the coordinates of
:mod:`knotobs.evaluation.modular` and ``<x, y> = x.y - (sum x)(sum y)/N``,

    Stilde_{lam, mu} = sum_{w in S_N} eps(w) exp(-2 pi i <w x, y>/K),     S = s0 Stilde

(Kac & Peterson, Adv. Math. 53 (1984), Thm. 13.8).  The kernel ``exp(-2 pi i <u, v>/K)`` is
a character of the finite abelian group ``G = P/KQ`` (weight lattice modulo ``K`` times the
root lattice, ``|G| = N K^(N-1)``), so

    (Stilde v)_lam = sum_{p in G} f(p) exp(-2 pi i <x_lam, p>/K),   f(w y_mu) = eps(w) v_mu,

the discrete Fourier transform on ``G`` of the Weyl-antisymmetric extension ``f`` of ``v``
(the alcove points are regular, so their ``N!`` Weyl images are distinct in ``G``;
V. Kac, *Infinite dimensional Lie algebras*, 3rd ed., CUP 1990, ch. 13).  Normalising
``x_N = 0`` identifies ``P`` with ``Z^(N-1)``, ``KQ`` with ``K (I + J) Z^(N-1)`` (``J`` the
all-ones matrix) and the pairing with ``u^T (I + J)^(-1) v``; a Smith normal form
``U (I + J) V = diag(1, ..., 1, N)`` turns ``G`` into ``Z/K x ... x Z/K x Z/(NK)`` with
the standard pairing ``sum_i xhat_i yhat_i / d_i`` for ``xhat = V^T u``, ``yhat = U v``
(common practice).  The transform is then a product of one-dimensional DFTs, done in
ball arithmetic (python-flint ``acb_mat`` products, or ``acb.dft`` for long axes): the
cost is ``|G| (sum_i d_i)`` ball operations per vector instead of the ``n^2 N!`` of
filling ``S`` entry by entry.

Examples
--------
>>> from knotobs.evaluation.modular import ModularData
>>> from knotobs.numerics import working_precision
>>> from flint import acb
>>> md = ModularData(3, 2)
>>> F = WeightLatticeFourier.for_modular_data(md)
>>> F.shape
(5, 15)
>>> with working_precision(30):
...     col = F.apply([[acb(1)] + [acb(0)] * (md.size - 1)])[0]
...     ok = all(abs(complex(c) - complex(md.stilde(i, 0))) < 1e-20 for i, c in enumerate(col))
>>> ok
True
"""

from __future__ import annotations

import itertools
from functools import lru_cache
from typing import Sequence

import numpy as np
from flint import acb, acb_mat, arb, ctx
from knotobs.numerics import working_precision
from knotobs.representations.permutations import permutation_sign

__all__ = ["WeightLatticeFourier", "smith_normal_form", "DENSE_AXIS_MAX"]

#: Axes up to this length are transformed by a dense ``acb_mat`` product (C, block
#: multiplication) unless their length is smooth; longer axes by one ``acb.dft`` call per line (FFT).
DENSE_AXIS_MAX = 400


def smith_normal_form(A: Sequence[Sequence[int]]) -> tuple[list[list[int]], list[list[int]], list[int]]:
    """``(U, V, d)`` with ``U A V = diag(d)``, ``U, V`` unimodular, ``d_1 | d_2 | ...`` (square ``A``).

    >>> U, V, d = smith_normal_form([[2, 1], [1, 2]])
    >>> d
    [1, 3]
    """
    n = len(A)
    M = [list(map(int, r)) for r in A]
    U = [[int(i == j) for j in range(n)] for i in range(n)]
    V = [[int(i == j) for j in range(n)] for i in range(n)]

    def swap_rows(i, j):
        M[i], M[j] = M[j], M[i]
        U[i], U[j] = U[j], U[i]

    def swap_cols(i, j):
        for R in (M, V):
            for r in R:
                r[i], r[j] = r[j], r[i]

    def add_row(src, dst, k):          # row dst += k row src
        M[dst] = [a + k * b for a, b in zip(M[dst], M[src])]
        U[dst] = [a + k * b for a, b in zip(U[dst], U[src])]

    def add_col(src, dst, k):          # col dst += k col src
        for R in (M, V):
            for r in R:
                r[dst] += k * r[src]

    for t in range(n):
        while True:
            nz = [(abs(M[i][j]), i, j) for i in range(t, n) for j in range(t, n) if M[i][j]]
            if not nz:
                break
            _, i, j = min(nz)
            swap_rows(t, i)
            swap_cols(t, j)
            done = True
            for i in range(t + 1, n):
                q = M[i][t] // M[t][t]
                if q:
                    add_row(t, i, -q)
                if M[i][t]:
                    done = False
            for j in range(t + 1, n):
                q = M[t][j] // M[t][t]
                if q:
                    add_col(t, j, -q)
                if M[t][j]:
                    done = False
            if not done:
                continue
            bad = next(((i, j) for i in range(t + 1, n) for j in range(t + 1, n)
                        if M[i][j] % M[t][t]), None)
            if bad is None:
                break
            add_row(bad[0], t, 1)
        if M[t][t] < 0:
            M[t] = [-a for a in M[t]]
            U[t] = [-a for a in U[t]]
    return U, V, [M[i][i] for i in range(n)]


@lru_cache(maxsize=64)
def _twiddle(d: int, prec: int) -> acb_mat:
    """``exp(-2 pi i j k/d)`` as a ``d x d`` ball matrix at ``prec`` bits."""
    with working_precision(bits=prec):
        roots = [acb(arb(-2 * e) / d).exp_pi_i() for e in range(d)]
        return acb_mat(d, d, [roots[(j * k) % d] for j in range(d) for k in range(d)])


def _largest_prime_factor(d: int) -> int:
    from knotobs.polynomials.cyclotomic import factor_int

    return max((p for p, _ in factor_int(d)), default=1)


def _fft_friendly(d: int) -> bool:
    """Axes of smooth length (prime factors <= 7, length >= 16) are faster by ``acb.dft``
    (FFT in C) than by a dense product; lengths with a large prime factor are not (measured)."""
    return d >= 16 and _largest_prime_factor(d) <= 7


class WeightLatticeFourier:
    """``v -> Stilde v`` for SU(N)_k by the DFT on ``P/KQ`` (see the module docstring).

    Parameters
    ----------
    N, K : int
        Rank plus one and shifted level.
    x : array (n, N)
        Shifted weights ``lam + rho`` of the alcove, in the order of the vectors.
    """

    def __init__(self, N: int, K: int, x: np.ndarray):
        self.N, self.K = N, K
        x = np.asarray(x, dtype=np.int64)
        self.n = len(x)
        m = N - 1
        L = [[int(i == j) + 1 for j in range(m)] for i in range(m)]
        U, V, D = smith_normal_form(L)
        self.shape = tuple(K * t for t in D)
        self.size = int(np.prod(self.shape))
        U = np.array(U, dtype=np.int64)
        Vt = np.array(V, dtype=np.int64).T
        d = np.array(self.shape, dtype=np.int64)
        strides = np.array([int(np.prod(self.shape[i + 1:])) for i in range(m)], dtype=np.int64)

        def flat(coords: np.ndarray, T: np.ndarray) -> np.ndarray:
            u = coords[..., :m] - coords[..., m:m + 1]           # normalise x_N = 0
            h = (u @ T.T) % d
            return h @ strides

        self.out_index = flat(x, Vt)                             # xhat(x_lam)
        perms = list(itertools.permutations(range(N)))
        self.signs = [permutation_sign(p) for p in perms]
        self.in_index = np.stack([flat(x[:, list(p)], U) for p in perms], axis=1)  # (n, N!)
        if len(set(self.in_index.ravel().tolist())) != self.n * len(perms):  # pragma: no cover - defensive
            raise AssertionError("Weyl images of alcove points collide in P/KQ")

    @classmethod
    def for_modular_data(cls, md) -> "WeightLatticeFourier":
        """The transform for a :class:`~knotobs.evaluation.modular.ModularData` (cached on it)."""
        F = getattr(md, "_lattice_fourier", None)
        if F is None:
            F = cls(md.N, md.K, md._x)
            md._lattice_fourier = F
        return F

    def ball_operations(self, batch: int = 1) -> float:
        """Ball multiply-adds of one :meth:`apply` on ``batch`` vectors (for cost estimates)."""
        per = sum(min(d, 2 * max(1, int(np.log2(d))) + 8) if d > DENSE_AXIS_MAX else d for d in self.shape)
        return float(self.size) * batch * (per + 25 * len(self.shape)) + self.n * len(self.signs) * batch

    def apply(self, vectors: Sequence[Sequence[acb]]) -> list[list[acb]]:
        """``[Stilde v for v in vectors]`` in ball arithmetic at the current precision.

        The caller sets the precision (``knotobs.numerics.working_precision``).
        """
        B = len(vectors)
        if B == 0:
            return []
        zero = acb(0)
        data = [zero] * (self.size * B)
        for b, v in enumerate(vectors):
            neg = [-t for t in v]
            for a, s in enumerate(self.signs):
                src = v if s > 0 else neg
                for pos, val in zip((self.in_index[:, a] * B + b).tolist(), src):
                    data[pos] = val
        prec = ctx.prec
        cur = data
        r = len(self.shape)
        restricted = r >= 2
        for d in (self.shape[:-1] if restricted else self.shape):
            R = len(cur) // d
            if d <= DENSE_AXIS_MAX and not _fft_friendly(d):
                Y = _twiddle(d, prec) * acb_mat(d, R, cur)
                cur = Y.transpose().entries()
            else:
                cur = [t for j in range(R) for t in acb.dft(cur[j::R])]
        if restricted:
            return self._last_axis_at_outputs(cur, B, prec)
        # now ordered (B, d_0, ..., d_{r-1})
        out = []
        idx = self.out_index.tolist()
        for b in range(B):
            off = b * self.size
            out.append([cur[off + i] for i in idx])
        return out

    def _last_axis_at_outputs(self, cur: list, B: int, prec: int) -> list[list[acb]]:
        """The last axis, evaluated only at the alcove points.

        ``cur`` is ordered ``(d_last, B, d_0, ..., d_{r-2})``; for each line (a value of the
        first ``r - 1`` coordinates) only the frequencies of the output points on that line are
        computed, by one product with the matching rows of the DFT matrix (cached per precision).
        """
        d = self.shape[-1]
        L = self.size // d
        BL = B * L
        lines = self._lines(prec)
        out = [[None] * self.n for _ in range(B)]
        for line, (rows, T) in lines.items():
            X = acb_mat(d, B, [cur[x * BL + b * L + line] for x in range(d) for b in range(B)])
            Y = (T * X).entries()
            for i, lam in enumerate(rows):
                for b in range(B):
                    out[b][lam] = Y[i * B + b]
        return out

    def _lines(self, prec: int) -> dict:
        cache = self.__dict__.setdefault("_line_cache", {})
        if prec in cache:
            return cache[prec]
        d = self.shape[-1]
        with working_precision(bits=prec):
            roots = [acb(arb(-2 * e) / d).exp_pi_i() for e in range(d)]
            groups: dict[int, list[tuple[int, int]]] = {}
            for lam, flat in enumerate(self.out_index.tolist()):
                groups.setdefault(flat // d, []).append((lam, flat % d))
            lines = {}
            for line, pts in groups.items():
                rows = [lam for lam, _ in pts]
                T = acb_mat(len(pts), d, [roots[(kk * x) % d] for _, kk in pts for x in range(d)])
                lines[line] = (rows, T)
        cache.clear()
        cache[prec] = lines
        return lines
