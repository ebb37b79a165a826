"""The localisation formula for ``Z_k(M; colours)`` on ``M(g; b; (a_1, b_1), ..., (a_n, b_n))``.

CONVENTIONS §10 (docs/localisation.md).  With ``K = k + N``, ``r = N - 1``,
``|Delta+| = N(N-1)/2``, ``c = k(N^2 - 1)/K``, ``|rho|^2 = N(N^2 - 1)/12`` and the torsion

    T(lam) = prod_{alpha > 0} 2 sin(pi <alpha, lam + rho>/K)      (= sqrt(N K^r) S_{0 lam})

the value is

    Z(M; mu_1, ..., nu_1, ...) = exp(-i pi c sign(e)/4) exp(-i pi |rho|^2 Sum Phi/K) i^{n' |Delta+|}
        (N K^r)^(g-1) prod' a_i^(-r/2)
        sum_{lam in alcove} T(lam)^(2 - 2g - n) zeta_{2NK}^(-B N |lam + rho|^2) prod' F_i(lam)

where the fibers are the given ``(a_i, b_i)``, a fiber ``(1, b)`` carrying ``b`` and one fiber
``(1, 0)`` per coloured regular fiber; ``n`` counts all of them; the fibers with ``a = 1`` and
no colour contribute only ``T(lam) zeta^(-b_i N |lam^|^2)`` (their Gauss sum is the Weyl
denominator) and ``B`` is the sum of their ``b_i``; ``prod'`` runs over the others (``n'`` of
them), with ``F_i`` the Gauss sum of :class:`knotobs.localisation.fiber.FiberFactor`;
``Sum Phi`` adds Rademacher's ``Phi(S U_i)`` over all fibers (``-b_i`` for ``a_i = 1``).

It is the gluing formula ``Z = phase sum_lam S_{0 lam}^(2-2g-n) prod_i rho(S U_i)_{lam, mu_i}``
(CONVENTIONS §7) with each ``rho(S U_i)`` replaced by its closed Gauss sum, and the phase of
the canonical 2-framing ``exp(2 pi i c (Sum Phi - 3 sign e)/24)`` (Jeffrey 1992 for
SU(2); Rozansky 1996; Hansen, Algebr. Geom. Topol. 1 (2001)); the factors
``exp(-2 pi i dim G Phi/24)`` of the Gauss sums combine with it into the two exponentials
above (``c - dim G = -2 |rho|^2 / K``).  Nothing here uses the S and T matrices.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from fractions import Fraction

import mpmath
import numpy as np
from flint import acb, arb, fmpq

from knotobs.errors import PrecisionError
from knotobs.localisation.fiber import FiberFactor
from knotobs.localisation.fixedpoint import root_sums
from knotobs.localisation.lattice import alcove, alcove_size, n_norm, positive_root_pairings, reduce_colour
from knotobs.localisation.roots import RootTable
from knotobs.numerics import working_precision
from knotobs.polynomials.cyclotomic import (
    CyclotomicField,
    CyclotomicSurd,
    acb_to_mpc,
    root_of_unity,
)

__all__ = ["LocalisationSum", "exact_cost"]


@dataclass
class LocalisationSum:
    """Everything the sum needs, prepared with integer numpy arrays (no numerics yet).

    Parameters
    ----------
    genus, b, fibers
        The Seifert invariants ``M(g; b; (a_i, b_i))`` as given (not normalised).
    N, k
        SU(N) at level k.
    exceptional : dict
        ``{i: partition}``: colour of the core of fiber ``i`` (from 0).
    regular : list
        Colours of parallel regular fibers.

    Examples
    --------
    >>> s = LocalisationSum(0, -1, ((2, 1), (3, 1), (5, 1)), 2, 3)
    >>> s.power, s.n_general, s.euler
    (-1, 3, Fraction(-1, 30))
    """

    genus: int
    b: int
    fibers: tuple
    N: int
    k: int
    exceptional: dict = field(default_factory=dict)
    regular: list = field(default_factory=list)

    def __post_init__(self):
        N, k = self.N, self.k
        self.K = K = k + N
        self.r = N - 1
        self.npos = N * (N - 1) // 2
        fibs = []
        for i, (a, bi) in enumerate(self.fibers):
            mu = reduce_colour(self.exceptional[i], N, k) if i in self.exceptional else ()
            fibs.append((a, bi, mu))
        fibs.append((1, self.b, ()))
        for nu in self.regular:
            fibs.append((1, 0, reduce_colour(nu, N, k)))
        self.n_all = len(fibs)
        self.B = sum(bi for a, bi, mu in fibs if a == 1 and mu == ())
        self.general = [FiberFactor(N, K, a, bi, mu) for a, bi, mu in fibs if not (a == 1 and mu == ())]
        self.n_general = len(self.general)
        n_special = self.n_all - self.n_general
        self.power = 2 - 2 * self.genus - self.n_all + n_special
        self.euler = -(Fraction(self.b) + sum((Fraction(bi, a) for a, bi in self.fibers), Fraction(0)))
        sum_phi = sum((f.phi for f in self.general), Fraction(0)) - self.B
        sgn = (self.euler > 0) - (self.euler < 0)
        c = Fraction(k * (N * N - 1), K)
        rho2 = Fraction(N * (N * N - 1), 12)
        #: the phase as a fraction of a full turn
        self.phase = (-c * sgn / 8 - rho2 * sum_phi / (2 * K) + Fraction(self.n_general * self.npos, 4)) % 1
        #: modulus^2 = (N K^r)^(2g-2) prod' a_i^(-r)
        self.modulus_sq = Fraction(N * K ** self.r) ** (2 * self.genus - 2) / math.prod(
            f.a ** self.r for f in self.general)
        self.size = alcove_size(N, k)

    # ------------------------------------------------------------ integer data
    def prepare(self):
        """The integer arrays (exponents, table rows, root pairings) of every weight."""
        if hasattr(self, "_lam"):
            return
        lam = alcove(self.N, self.k)
        self._lam = lam
        self._norm = n_norm(lam)
        self._pairs = positive_root_pairings(lam)
        self._fib = [f.exponents(lam) for f in self.general]

    # ------------------------------------------------------------ numerics
    def to_acb(self, prec: int) -> acb:
        """The value as a ball at ``prec`` bits."""
        self.prepare()
        with working_precision(max(15, int(prec / 3.3219280948873626) + 1)):
            return self._acb()

    def _acb(self) -> acb:
        from flint import ctx as flint_ctx

        K, N = self.K, self.N
        bits = flint_ctx.prec + 10
        n = self._lam.shape[0]
        sines = {}
        for j in sorted(set(self._pairs.ravel().tolist())):  # not np.unique: it imports numpy.ma
            sines[j] = 2 * arb(fmpq(j, K)).sin_pi()
        Bt = RootTable(2 * N * K) if self.B else None
        factors = []
        for f, (E, zidx, eps) in zip(self.general, self._fib):
            rows3 = f.table[zidx]                                   # (n, |W|, 2a)
            l, w, e = np.nonzero(rows3)
            exps = (E[l, w] + N * K * e) % f.modulus
            wts = eps[w] * rows3[l, w, e]
            factors.append(root_sums(l, exps, wts, n, f.modulus, bits))
        total = acb(0)
        p = self.power
        pairs = self._pairs.tolist()
        norms = (-self.B * self._norm).tolist()
        for l in range(n):
            t = arb(1)
            for j in pairs[l]:
                t *= sines[j]
            term = acb(t ** p) if p >= 0 else acb(1 / t ** (-p))
            if Bt is not None:
                term *= Bt[norms[l]]
            for F in factors:
                term *= F[l]
            total += term
        ph = acb(arb(2) * fmpq(self.phase.numerator, self.phase.denominator)).exp_pi_i()
        mod = arb(fmpq(self.modulus_sq.numerator, self.modulus_sq.denominator)).sqrt()
        return total * ph * mod

    def numeric(self, digits: int) -> mpmath.mpc:
        """The value with ``digits`` certified digits.

        Ball arithmetic is rigorous, so one evaluation whose enclosure is below
        ``10^-digits`` (relative to ``max(|Z|, 1)``) certifies the digits; otherwise the
        precision is doubled.
        """
        prec = int(digits * 3.33) + 30 + 2 * self.size.bit_length()
        while prec <= 1 << 15:
            z = self.to_acb(prec)
            rad = max(float(z.real.rad()), float(z.imag.rad()))
            mag = max(abs(float(z.real.mid())), abs(float(z.imag.mid())), 1.0)
            if rad <= 10.0 ** (-digits - 2) * mag:
                return acb_to_mpc(z, digits)
            prec *= 2
        raise PrecisionError(f"could not certify {digits} digits of the localisation sum")

    # ------------------------------------------------------------ exact
    def field_conductor(self) -> int:
        L = math.lcm(4 * self.K, 2 * self.N * self.K)
        for f in self.general:
            L = math.lcm(L, f.modulus)
        return L

    def exact(self) -> CyclotomicSurd:
        """The exact value ``sqrt(r) * (cyclotomic number)``."""
        self.prepare()
        K, N = self.K, self.N
        L = self.field_conductor()
        F = CyclotomicField(L)
        p = self.power
        # 2 sin(pi j/K) = -i (x - 1/x), x = zeta_{2K}^j; its inverse is i (1/K) sum_t t x^(2t+1)
        u = L // (4 * K)
        cache = {}

        def sine_power(j):
            if j not in cache:
                if p >= 0:
                    base = F.from_exponents([(2 * j - K) * u, (-2 * j - K) * u], [1, -1])
                    cache[j] = base ** p
                else:
                    t = np.arange(K, dtype=np.int64)
                    base = F.from_exponents((K + 2 * j * (2 * t + 1)) * u, t, denominator=K)
                    cache[j] = base ** (-p)
            return cache[j]

        total = F.zero
        uB = L // (2 * N * K)
        for l in range(self._lam.shape[0]):
            term = F.one
            for j in self._pairs[l].tolist():
                term = term * sine_power(j)
            if self.B:
                term = term * F.zeta(int(-self.B * self._norm[l]) * uB)
            for f, (E, zidx, eps) in zip(self.general, self._fib):
                uf = L // f.modulus
                rows = f.table[zidx[l]]                          # (|W|, 2a)
                ws, es = np.nonzero(rows)
                exps = (E[l][ws] + N * K * es) * uf
                wts = eps[ws] * rows[ws, es]
                term = term * F.from_exponents(exps, wts)
            total = total + term
        ph = root_of_unity(self.phase)
        return CyclotomicSurd(total * ph, self.modulus_sq)


def exact_cost(s: LocalisationSum) -> float:
    """Coefficient operations of :meth:`LocalisationSum.exact`: per weight, one group-ring
    vector of length ``L`` per fiber and ``n' + |Delta+| + 1`` products in ``Q(zeta_L)``
    (degree ``phi(L) <= L``).  About ``2.5e-7`` s each on the reference machine.

    >>> exact_cost(LocalisationSum(0, -1, ((2, 1), (3, 1), (5, 1)), 2, 3)) > 0
    True
    """
    L = s.field_conductor()
    return float(s.size) * L * (2 * s.n_general + s.npos + 1)
