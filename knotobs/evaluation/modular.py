"""Modular data of SU(N) at level k: alcove, S (Kac–Peterson), T, C, c, fusion.

Conventions (docs/conventions.md §1, §2, §6): shifted level ``K = k + N``; weights are
partitions with at most ``N - 1`` rows and ``lam_1 <= k`` (the level-k alcove),
the trivial weight ``()`` first.  In the orthonormal basis of R^N a weight
``lam`` plus ``rho`` is ``x_i = lam_i + N - i`` (any common shift drops out after
projecting to sum zero).  With ``<x, y> = sum x_i y_i - (sum x)(sum y)/N``:

* ``S_{lam,mu} = i^{N(N-1)/2} (N K^{N-1})^{-1/2} sum_{w in S_N} eps(w) exp(-2 pi i <w(x), y>/K)``
  (V. G. Kac & D. H. Peterson, Adv. Math. 53 (1984) 125–264, Thm. 13.8;
  for SU(2) this is ``sqrt(2/K) sin(pi (a+1)(b+1)/K)``);
* twist ``theta_lam = exp(2 pi i h_lam)``, ``h_lam = C(lam)/K``, ``C`` the quadratic Casimir;
  ``T = diag(theta_lam exp(-2 pi i c/24))``, central charge ``c = k (N^2 - 1)/K``;
* charge conjugation ``C = S^2`` maps a weight to its dual (Dynkin labels reversed);
* Verlinde: ``N_{ab}^c = sum_r S_{ar} S_{br} conj(S_{cr}) / S_{0r}``
  (E. Verlinde, Nucl. Phys. B 300 (1988) 360–376).

Exact values: ``S = s0 * Stilde`` where ``s0 = i^{N(N-1)/2} / sqrt(N K^(N-1))`` and
``Stilde_{lam,mu} = sum_w eps(w) zeta_{NK}^{XY - N <w x, y>_{Z^N}}`` is an algebraic integer of
``Q(zeta_{NK})`` (``X = sum x_i``, ``Y = sum y_i``).
"""

from __future__ import annotations

import itertools
import math
import re
from fractions import Fraction
from functools import lru_cache
from typing import Sequence

import mpmath
import numpy as np

from knotobs.errors import (
    InvalidGroupError,
    InvalidRepresentationError,
    NotIntegrableError,
)
from knotobs.guard import require, seconds_for
from knotobs.polynomials.cyclotomic import (
    Cyclotomic,
    CyclotomicField,
    CyclotomicSurd,
)
from knotobs.representations.partitions import Partition, as_partition, kappa
from knotobs.numerics import working_precision
from knotobs.representations.permutations import permutation_sign

__all__ = [
    "parse_group",
    "ModularData",
    "modular_data",
    "integrable_weights",
    "check_integrable",
    "casimir",
    "central_charge",
    "kac_walton_reduce",
    "weights_of_irrep",
    "alcove_size",
]

_GROUP_RE = re.compile(r"^\s*su\s*\(?\s*(\d+)\s*\)?\s*$", re.IGNORECASE)


def parse_group(group) -> int:
    """Rank-plus-one ``N`` of ``SU(N)`` from ``"SU(3)"``, ``"su3"``, ``3`` or ``("A", 2)``.

    >>> parse_group("SU(3)"), parse_group("su2"), parse_group(("A", 3))
    (3, 2, 4)
    >>> parse_group("SO(3)")
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidGroupError: unknown group 'SO(3)': use SU(N) with N >= 2, e.g. "SU(2)"
    """
    N = None
    if isinstance(group, (int, np.integer)) and not isinstance(group, bool):
        N = int(group)
    elif isinstance(group, str):
        m = _GROUP_RE.match(group)
        if m:
            N = int(m.group(1))
    elif isinstance(group, tuple) and len(group) == 2 and str(group[0]).upper() == "A":
        if isinstance(group[1], int):
            N = group[1] + 1
    if N is None:
        raise InvalidGroupError(
            f"unknown group {group!r}: use SU(N) with N >= 2, e.g. \"SU(2)\""
        )
    if N < 2:
        raise InvalidGroupError(f"SU({N}) is trivial: use SU(N) with N >= 2")
    return N


def _check_level(k) -> int:
    if not isinstance(k, (int, np.integer)) or isinstance(k, bool) or k < 1:
        raise NotIntegrableError(f"level k = {k!r} is not allowed: use an integer k >= 1")
    return int(k)


def integrable_weights(N: int, k: int) -> tuple[Partition, ...]:
    """The level-``k`` alcove of SU(N): partitions with ``<= N-1`` rows, ``lam_1 <= k``.

    Ordered by number of boxes, then reverse lexicographically; ``()`` first.
    There are ``binom(k + N - 1, N - 1)`` of them (common practice).

    >>> integrable_weights(3, 2)
    ((), (1,), (2,), (1, 1), (2, 1), (2, 2))
    """
    out = []

    def rec(prefix, maxpart, rows_left):
        out.append(tuple(prefix))
        if rows_left == 0:
            return
        for x in range(1, maxpart + 1):
            rec(prefix + [x], x, rows_left - 1)

    rec([], k, N - 1)
    return tuple(sorted(out, key=lambda p: (sum(p), [-x for x in p])))


def alcove_size(N: int, k: int) -> int:
    """Number of integrable weights of SU(N) at level k, ``binom(k + N - 1, N - 1)`` (common practice).

    >>> alcove_size(3, 40)
    861
    """
    return math.comb(k + N - 1, N - 1)


def check_integrable(lam, N: int, k: int) -> Partition:
    """Validate a colour: a partition with ``<= N-1`` rows after removing full columns
    and ``lam_1 - lam_N <= k``.  Returns the reduced partition.

    >>> check_integrable([3], 2, 2)
    Traceback (most recent call last):
    ...
    knotobs.errors.NotIntegrableError: representation [3] of SU(2) is not integrable at level 2: need lam_1 - lam_2 <= 2 (integrable weights: partitions with at most 1 rows and first row <= 2)
    """
    lam = as_partition(lam)
    if len(lam) > N:
        raise InvalidRepresentationError(
            f"partition {list(lam)} has {len(lam)} rows; SU({N}) allows at most {N}"
        )
    full = lam + (0,) * (N - len(lam))
    if full[0] - full[-1] > k:
        raise NotIntegrableError(
            f"representation {list(lam)} of SU({N}) is not integrable at level {k}: need "
            f"lam_1 - lam_{N} <= {k} (integrable weights: partitions with at most {N - 1} rows"
            f" and first row <= {k})"
        )
    return tuple(x - full[-1] for x in full if x - full[-1] > 0)


def casimir(lam: Sequence[int], N: int) -> Fraction:
    """``C(lam) = (kappa + N|lam| - |lam|^2/N) / 2`` (CONVENTIONS §2).

    >>> casimir((1,), 2)
    Fraction(3, 4)
    """
    n = sum(lam)
    return Fraction(kappa(tuple(lam)) + N * n, 2) - Fraction(n * n, 2 * N)


def central_charge(N: int, k: int) -> Fraction:
    """``c = k (N^2 - 1) / (k + N)`` (Sugawara; common practice).

    >>> central_charge(2, 1)
    Fraction(1, 1)
    """
    return Fraction(k * (N * N - 1), k + N)


def _rho_coords(lam: Sequence[int], N: int) -> tuple[int, ...]:
    lam = tuple(lam) + (0,) * (N - len(lam))
    return tuple(lam[i] + N - 1 - i for i in range(N))


def kac_walton_reduce(x: Sequence[int], N: int, K: int) -> tuple[int, Partition | None]:
    """Reduce a shifted weight ``x = lam + rho`` (R^N coordinates) into the level-``K`` alcove.

    Applies Weyl reflections (sorting) and the affine reflection in the highest
    root, ``x -> x - (x_1 - x_N - K)(e_1 - e_N)``, until
    ``x_1 > x_2 > ... > x_N > x_1 - K``.  Returns ``(sign, lam)`` with ``lam`` the
    integrable weight (partition) reached and ``sign = det w``; ``(0, None)`` if
    ``x`` lies on a wall (M. A. Walton, Nucl. Phys. B 340 (1990) 777–790;
    V. G. Kac, *Infinite dimensional Lie algebras*, 3rd ed., CUP 1990, ex. 13.35).

    >>> kac_walton_reduce((4, 0), 2, 3)     # SU(2), K = 3: lam = (3,) reflects to (0,)... sign -1
    (-1, (1,))
    >>> kac_walton_reduce((3, 0), 2, 3)     # on the wall x_1 - x_2 = K
    (0, None)
    """
    x = list(x)
    if len(x) != N:
        raise InvalidRepresentationError(f"weight {x} must have {N} coordinates")
    sign = 1
    for _ in range(10_000):
        order = sorted(range(N), key=lambda i: -x[i])
        sign *= permutation_sign(order)
        x = [x[i] for i in order]
        if any(x[i] == x[i + 1] for i in range(N - 1)):
            return 0, None
        d = x[0] - x[-1]
        if d == K:
            return 0, None
        if d < K:
            base = x[-1]
            lam = tuple(x[i] - base - (N - 1 - i) for i in range(N))
            return sign, tuple(v for v in lam if v > 0)
        x[0], x[-1] = x[-1] + K, x[0] - K
        sign = -sign
    raise RuntimeError("Kac-Walton reduction did not terminate")  # pragma: no cover


def weights_of_irrep(lam: Sequence[int], N: int) -> dict[tuple[int, ...], int]:
    """Weights (in R^N partition coordinates) with multiplicities of the SU(N) irrep ``lam``.

    Counts semistandard Young tableaux of shape ``lam`` with entries ``1..N`` by content
    (the Schur polynomial ``s_lam(x_1..x_N)``; Macdonald 1995, ch. I §5).

    >>> sorted(weights_of_irrep((1,), 3).items())
    [((0, 0, 1), 1), ((0, 1, 0), 1), ((1, 0, 0), 1)]
    """
    lam = tuple(lam)
    counts: dict[tuple[int, ...], int] = {}
    cells = [(i, j) for i, r in enumerate(lam) for j in range(r)]
    filling: dict[tuple[int, int], int] = {}

    def rec(idx):
        if idx == len(cells):
            w = [0] * N
            for v in filling.values():
                w[v - 1] += 1
            t = tuple(w)
            counts[t] = counts.get(t, 0) + 1
            return
        i, j = cells[idx]
        lo = 1
        if j > 0:
            lo = max(lo, filling[(i, j - 1)])
        if i > 0:
            lo = max(lo, filling[(i - 1, j)] + 1)
        for v in range(lo, N + 1):
            filling[(i, j)] = v
            rec(idx + 1)
        filling.pop((i, j), None)

    rec(0)
    return counts


class ModularData:
    """SU(N)_k modular data with exact (cyclotomic) and numeric S and T.

    Examples
    --------
    >>> md = ModularData(2, 3)
    >>> md.K, len(md.weights), md.central_charge
    (5, 4, Fraction(9, 5))
    >>> round(float(md.S_numeric()[0, 0].real), 12)     # sqrt(2/5) sin(pi/5)
    0.37174803446
    >>> md.fusion((1,), (1,))
    {(): 1, (2,): 1}
    """

    def __init__(self, N: int, k: int):
        self.N = parse_group(N)
        self.k = _check_level(k)
        self.K = self.k + self.N
        size = alcove_size(self.N, self.k)
        require(f"modular data of SU({self.N}) at level {self.k} ({size} integrable weights)",
                seconds=seconds_for(size * 12 * self.N, "python"),
                memory_mb=size * (200 + 16 * self.N) / 1e6,
                accepted="use a lower level")
        self.weights: tuple[Partition, ...] = integrable_weights(self.N, self.k)
        self.index = {w: i for i, w in enumerate(self.weights)}
        self.central_charge = central_charge(self.N, self.k)
        self._x = np.array([_rho_coords(w, self.N) for w in self.weights], dtype=np.int64)
        self._stilde: list[list[Cyclotomic | None]] | None = None
        self._S_np = None

    # -- basic data ---------------------------------------------------
    @property
    def size(self) -> int:
        return len(self.weights)

    @property
    def s_field(self) -> CyclotomicField:
        """``Q(zeta_{NK})``, the field of the entries of ``Stilde``."""
        return CyclotomicField(self.N * self.K)

    def weight_index(self, lam) -> int:
        """Index of an (integrable) colour; errors name the bad value."""
        lam = check_integrable(lam, self.N, self.k)
        return self.index[lam]

    def h(self, lam) -> Fraction:
        """Conformal weight ``h_lam = C(lam)/K``; ``theta_lam = exp(2 pi i h_lam)``."""
        return casimir(tuple(lam), self.N) / self.K

    def twist_exponents(self) -> list[Fraction]:
        """``h_lam`` for all weights (``Theta = diag exp(2 pi i h)``)."""
        return [self.h(w) for w in self.weights]

    def T_exponents(self) -> list[Fraction]:
        """``h_lam - c/24`` for all weights (``T = diag exp(2 pi i (h - c/24))``)."""
        c24 = self.central_charge / 24
        return [self.h(w) - c24 for w in self.weights]

    def dual(self, lam) -> Partition:
        """Charge conjugate weight: Dynkin labels reversed.

        >>> ModularData(3, 4).dual((2,))
        (2, 2)
        """
        lam = tuple(lam) + (0,) * (self.N - len(lam))
        top = lam[0]
        out = tuple(top - lam[self.N - 1 - i] for i in range(self.N))
        return tuple(v for v in out if v > 0)

    def charge_conjugation(self) -> np.ndarray:
        """The permutation matrix ``C_{lam, mu} = delta_{mu, lam*}`` (integers)."""
        n = self.size
        C = np.zeros((n, n), dtype=np.int64)
        for i, w in enumerate(self.weights):
            C[i, self.index[self.dual(w)]] = 1
        return C

    # -- S matrix -----------------------------------------------------
    def s0(self) -> CyclotomicSurd:
        """Normalisation ``s0 = i^{N(N-1)/2} / sqrt(N K^(N-1))`` with ``S = s0 * Stilde``."""
        N, K = self.N, self.K
        phase = CyclotomicField(4).zeta((N * (N - 1) // 2) % 4)
        return CyclotomicSurd(phase, Fraction(1, N * K ** (N - 1)))

    def _exponent_tensor(self) -> tuple[np.ndarray, np.ndarray]:
        """Exponents ``E[w, i, j]`` (mod NK) and signs ``eps[w]`` with
        ``Stilde_ij = sum_w eps_w zeta_{NK}^{E[w,i,j]}``."""
        N, K = self.N, self.K
        nperm = math.factorial(N)
        require(f"dense S matrix of SU({N}) at level {self.k} ({self.size}^2 entries x {nperm} Weyl terms)",
                seconds=seconds_for(nperm * self.size ** 2 * 3, "numpy"),
                memory_mb=nperm * self.size ** 2 * 16 / 1e6,
                accepted="use the surgery route, which applies S as a Fourier transform without forming it")
        x = self._x
        X = x.sum(axis=1)
        perms = list(itertools.permutations(range(N)))
        E = np.empty((len(perms), self.size, self.size), dtype=np.int64)
        eps = np.empty(len(perms), dtype=np.int64)
        for a, p in enumerate(perms):
            dot = x[:, list(p)] @ x.T
            E[a] = (np.outer(X, X) - N * dot) % (N * K)
            eps[a] = permutation_sign(p)
        return E, eps

    def S_numeric(self) -> np.ndarray:
        """``S`` in double precision (numpy complex128), for fast checks."""
        if self._S_np is None:
            E, eps = self._exponent_tensor()
            M = self.N * self.K
            St = np.tensordot(eps, np.exp(2j * np.pi * E / M), axes=1)
            s0 = complex(self.s0().to_mpc(20))
            self._S_np = s0 * St
        return self._S_np

    def S_mpmath(self, dps: int = 30) -> mpmath.matrix:
        """``S`` as an mpmath matrix at ``dps`` digits (from the exact entries)."""
        n = self.size
        with working_precision(dps):
            s0 = self.s0().to_mpc(dps)
            A = mpmath.matrix(n, n)
            for i in range(n):
                for j in range(n):
                    A[i, j] = s0 * self.stilde(i, j).to_mpc(dps)
        return A

    def stilde(self, i: int, j: int) -> Cyclotomic:
        """Exact ``Stilde_{ij}`` in ``Q(zeta_{NK})`` (cached)."""
        if self._stilde is None:
            n = self.size
            self._stilde = [[None] * n for _ in range(n)]
            self._E, self._eps = self._exponent_tensor()
        if i > j:
            i, j = j, i
        val = self._stilde[i][j]
        if val is None:
            val = self.s_field.from_exponents(self._E[:, i, j], self._eps)
            self._stilde[i][j] = val
        return val

    def stilde_matrix(self) -> list[list[Cyclotomic]]:
        """The full exact matrix ``Stilde`` (``S = s0 * Stilde``)."""
        n = self.size
        return [[self.stilde(i, j) for j in range(n)] for i in range(n)]

    def S_exact(self, lam, mu) -> CyclotomicSurd:
        """Exact ``S_{lam, mu}`` as ``sqrt(r) * (cyclotomic)``.

        >>> md = ModularData(2, 2)          # K = 4: S_00 = sqrt(2/4) sin(pi/4) = 1/2
        >>> md.S_exact((), ()) == CyclotomicField(1)(Fraction(1, 2))
        True
        """
        return self.s0() * self.stilde(self.weight_index(lam), self.weight_index(mu))

    def quantum_dimension(self, lam) -> Cyclotomic:
        """``dim_q(lam) = S_{0 lam} / S_{00}`` exactly (in ``Q(zeta_{NK})``)."""
        i = self.weight_index(lam)
        return self.stilde(0, i) / self.stilde(0, 0)

    # -- fusion -------------------------------------------------------
    def fusion_coefficient(self, a, b, c) -> int:
        """Exact Verlinde fusion coefficient ``N_{ab}^c`` (rational by construction,
        checked to be an integer).

        >>> ModularData(2, 2).fusion_coefficient((1,), (1,), (2,))
        1
        """
        ia, ib, ic = (self.weight_index(x) for x in (a, b, c))
        total = self.s_field.zero
        for r in range(self.size):
            total = total + (self.stilde(ia, r) * self.stilde(ib, r)
                             * self.stilde(ic, r).conj() / self.stilde(0, r))
        # S S conj(S) / S = |s0|^2 Stilde Stilde conj(Stilde) / Stilde
        val = (total * Fraction(1, self.N * self.K ** (self.N - 1))).rational_value()
        if val.denominator != 1:
            raise ArithmeticError(f"Verlinde coefficient {val} is not an integer")
        return int(val)

    def fusion_tensor(self) -> np.ndarray:
        """All ``N_{ab}^c`` by the Verlinde formula in double precision, rounded after a
        check that every value is within 1e-6 of an integer."""
        S = self.S_numeric()
        inv = 1.0 / S[0, :]
        Nt = np.einsum("ar,br,cr,r->abc", S, S, S.conj(), inv)
        R = np.rint(Nt.real)
        if np.max(np.abs(Nt - R)) > 1e-6:
            raise ArithmeticError("Verlinde formula did not give integers (precision lost)")
        return R.astype(np.int64)

    def fusion(self, a, b) -> dict[Partition, int]:
        """``a x b = sum_c N_{ab}^c c`` by the Kac–Walton algorithm (finite tensor product by
        Racah–Speiser over the weights of ``b``, then affine reflection into the alcove).
        """
        a = check_integrable(a, self.N, self.k)
        b = check_integrable(b, self.N, self.k)
        xa = _rho_coords(a, self.N)
        out: dict[Partition, int] = {}
        for wt, mult in weights_of_irrep(b, self.N).items():
            x = [xa[i] + wt[i] for i in range(self.N)]
            s, lam = kac_walton_reduce(x, self.N, self.K)
            if s:
                out[lam] = out.get(lam, 0) + s * mult
        return {lam: m for lam, m in sorted(out.items(), key=lambda t: self.index[t[0]]) if m}


@lru_cache(maxsize=64)
def modular_data(N: int, k: int) -> ModularData:
    """Cached :class:`ModularData`."""
    return ModularData(N, k)
