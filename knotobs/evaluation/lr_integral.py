r"""The Lawrence–Rozansky integral form of the SU(2) Gauss sum: Gaussian integrals on
steepest-descent lines plus residues, each piece holomorphic in the shifted level ``K``.

CONVENTIONS §9 gives the finite Gauss sum ``Z = (B/K) sum'_{beta mod 2PK} h(beta/K)`` of
``M = X(p_1/q_1, ..., p_n/q_n)``; R. Lawrence and L. Rozansky, Commun. Math. Phys. 205
(1999) 287–314, §3, rewrite it as ``|H|`` Gaussian integrals plus residues at the poles of
``G`` (the derivation and the contour are in :mod:`knotobs.continuation.level`).  Its cost
does not grow with ``K``: about ``|H|`` trapezoid rules of ``O(sqrt|K|)`` nodes and ``O(P |H|)``
residue terms, against ``O(2^n |H| K)`` terms of the direct Gauss sum.  It serves twice:

* at complex ``K`` it *is* the analytic continuation (:mod:`knotobs.continuation.level`);
* at integer ``K`` it is the ``integral`` route of the finite-level dispatcher
  (:func:`integral_partition_function`), numeric with certified digits, the way to large levels
  (``K = 10^6`` in a fraction of a second, where the direct sum has ``10^8`` terms).

Every value is computed twice (different precision, step and cut-off) and must agree to the
requested digits (CONVENTIONS §16).
"""

from __future__ import annotations

import dataclasses
import math
from dataclasses import dataclass
from functools import lru_cache
from fractions import Fraction

import mpmath
from flint import acb, arb

from knotobs.ball_series import (
    bernoulli_plus,
    bits,
    checked,
    ser_exp,
    ser_inv,
    ser_mul,
    ser_sin,
    to_mpc,
    ball_seconds,
    working_bits,
)
from knotobs.errors import InvalidSeifertDataError, KnotobsError, NotIntegrableError, SizeLimitError
from knotobs.guard import require
from knotobs.precision import check_digits
from knotobs.fibrations.seifert import SeifertManifold, parse_space

__all__ = [
    "DomainError",
    "LRData",
    "ResidueTerm",
    "residue_terms",
    "require_continuation",
    "continuation_cost",
    "integral_partition_function",
]


class DomainError(KnotobsError, ValueError):
    """A complex level outside the region where the continuation formula is set up."""


# ---------------------------------------------------------------------------
# Lawrence–Rozansky data


@dataclass(frozen=True)
class LRData:
    """``X(p_1/q_1, ..., p_n/q_n)`` data of a Seifert rational homology sphere.

    Attributes
    ----------
    space : SeifertManifold
    pq : tuple of (p_j, q_j)
        ``p_j >= 1``; entries ``1/0`` dropped.
    P, H : int
        ``P = prod p_j``, ``H = P sum q_j/p_j`` (``|H| = |H_1(M)|``, ``H != 0``).
    phi : Fraction
        ``3 sign(H) + sum_j (12 s(q_j, p_j) - q_j/p_j)`` (CONVENTIONS §9).

    Examples
    --------
    >>> d = LRData.from_space("Sigma(2,3,5)")
    >>> d.P, d.H, d.n
    (30, 1, 4)
    >>> LRData.from_space("S^2xS^1")  # doctest: +ELLIPSIS
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidSeifertDataError: M(0; 0) has H = 0 (infinite H_1): ... continued in K as its Verlinde polynomial ...

    References
    ----------
    Lawrence & Rozansky, Commun. Math. Phys. 205 (1999) 287–314.
    """

    space: SeifertManifold
    pq: tuple[tuple[int, int], ...]
    P: int
    H: int
    phi: Fraction
    genus: int = 0
    # one sector of the sum when orders share factors (see :meth:`sectors`): shifts s_j of the
    # fibers, linear and constant phases, period 2L of the sector (0: 2P) and H' = H L/P
    shifts: tuple[int, ...] = ()
    lin: Fraction = Fraction(0)
    const: Fraction = Fraction(0)
    period: int = 0
    Hq: int = 0

    @classmethod
    def from_space(cls, space, allow_genus: bool = False, allow_shared: bool = False) -> "LRData":
        """The data of ``space``; base genus ``g >= 1`` only with ``allow_genus``, orders that
        share a factor only with ``allow_shared`` (the partition function and its continuation
        handle both; the flat-connection and series code built on this class is for ``g = 0``
        and pairwise coprime orders)."""
        from knotobs.evaluation.gauss_sum import lr_data

        def data_of(raw):
            return lr_data(raw, coprime=not allow_shared)
        M = parse_space(space)
        if M.genus and not allow_genus:
            M.surgery_presentation()          # raises the genus-0 error with its explanation
        # base genus g: the same surgery coefficients on the central curve (now a fiber over a
        # surface); only the power of the torsion changes (CONVENTIONS §10)
        raw = list(M.fibers) + ([(1, M.b)] if M.b else []) if M.genus else list(M.surgery_presentation())
        pq, P, H, phi = data_of(raw) if raw else ([], 1, 0, Fraction(0))
        if H == 0:
            fibered = any(a > 1 for a, _ in M.fibers)
            where = ("with exceptional fibers and H = 0 it is continued in K as a quasi-polynomial (one"
                     " polynomial per class of K mod lcm of the orders) by knotobs.continued_partition_function"
                     " (knotobs continue SPACE; docs/continuation_sun.md 18.11);" if fibered else
                     "S^1 x Sigma_g (no exceptional fibers, b = 0) is continued in K as its Verlinde"
                     " polynomial by knotobs.continued_partition_function (knotobs continue SPACE);")
            raise InvalidSeifertDataError(
                f"{M} has H = 0 (infinite H_1): the Lawrence-Rozansky continuation needs a"
                f" rational homology sphere; {where} finite levels: knotobs space SPACE --level k"
            )
        return cls(M, tuple(pq), P, H, phi, M.genus)

    @property
    def n(self) -> int:
        return len(self.pq)

    @property
    def Lp(self) -> int:
        """Half period ``L`` of the sum (``P`` for pairwise coprime orders, else ``lcm p_j``)."""
        return self.period or self.P

    @property
    def Hs(self) -> int:
        """``H L/P``: ``h(z + 2L) = exp(-2 pi i K Hs z) h(z)`` at integer ``K``."""
        return self.Hq or self.H

    @property
    def shared(self) -> bool:
        return math.lcm(*self.ps) != self.P if self.ps else False

    def sectors(self) -> list["LRData"]:
        """The sum split into ``P/L`` sectors (``L = lcm p_j``; one sector for coprime orders).

        The tuples ``(n_j mod p_j)`` of the per-fiber Gauss sums
        ``F_j(lam) = sum_{n_j} f_j(lam + 2K n_j)`` are cosets ``n_j = n + s_j`` of the
        diagonal ``Z_L``; with ``beta = lam + 2K n`` (mod ``2KL``) the summand of the coset ``s`` is

            exp(-i pi K H z^2/(2P)) exp(-2 pi i K lin z) exp(-2 pi i K const)
              prod_j 2i sin(pi (z + 2 s_j)/p_j) / (2i sin(pi z))^(n-2+2g),   z = beta/K,

        ``lin = sum q_j s_j/p_j`` (taken mod 1, allowed at integer ``K``), ``const = sum q_j
        s_j^2/p_j``, of period ``2L`` with ``H L/P`` in place of ``H``.  Each sector is a
        Lawrence–Rozansky sum of its own (CONVENTIONS §9).
        """
        if self.period or not self.shared:
            return [self]
        return list(_sectors(self))

    def _build_sectors(self) -> tuple["LRData", ...]:
        import itertools

        L = math.lcm(*self.ps)
        seen, out = set(), []
        for t in itertools.product(*[range(p) for p in self.ps]):
            key = min(tuple((x + k) % p for x, p in zip(t, self.ps)) for k in range(L))
            if key in seen:
                continue
            seen.add(key)
            lin = sum((Fraction(q * x, p) for (p, q), x in zip(self.pq, key)), Fraction(0))
            const = sum((Fraction(q * x * x, p) for (p, q), x in zip(self.pq, key)), Fraction(0))
            lin = lin - math.floor(lin) if self.sigma > 0 else lin - math.ceil(lin)   # sigma*lin in [0, 1)
            out.append(dataclasses.replace(self, shifts=key, lin=lin, const=const, period=L,
                                           Hq=self.H * L // self.P))
        return tuple(out)

    @property
    def deg(self) -> int:
        """Power ``n - 2 + 2g`` of ``2i sin(pi z)`` in the denominator of ``G``."""
        return self.n - 2 + 2 * self.genus

    @property
    def sigma(self) -> int:
        return 1 if self.H > 0 else -1

    @property
    def ps(self) -> tuple[int, ...]:
        return tuple(p for p, _ in self.pq)

    def pole_order(self, m: int) -> int:
        """Order of the pole of ``G`` at the integer ``m`` (``<= 0``: regular)."""
        sh = self.shifts or (0,) * self.n
        return self.deg - sum(1 for p, s in zip(self.ps, sh) if (m + 2 * s) % p == 0)

    def saddle(self, r: int) -> Fraction:
        """Centre ``-2 L (r + sigma lin)/|Hs|`` of the ``r``-th Gaussian (``-2 P r/|H|`` for one sector)."""
        return -2 * self.Lp * (r + self.sigma * self.lin) / abs(self.Hs)


@lru_cache(maxsize=64)
def _sectors(d: LRData) -> tuple[LRData, ...]:
    """The sectors of ``d``, built once (every continued value asks for them twice)."""
    return d._build_sectors()


# ---------------------------------------------------------------------------
# the pieces


def _B(d: LRData, K: acb) -> acb:
    pi = arb.pi()
    ph = acb(d.phi.numerator) / d.phi.denominator
    B = (-1 / (4 * arb(d.P).sqrt())) * (acb(0, 3 * d.sigma) * pi / 4).exp() * (acb(0, -1) * pi * ph / (2 * K)).exp()
    # base genus g: S_{0 lam}^(-2g) = (K/2)^g sin^(-2g) = (-2K)^g (2i sin)^(-2g)
    return B * (-2 * K) ** d.genus if d.genus else B


def _G(d: LRData, z: acb) -> acb:
    ipz = acb(0, 1) * arb.pi() * z
    num = acb(1)
    for p, sj in zip(d.ps, d.shifts or (0,) * d.n):
        e = ((ipz + acb(0, 2 * sj) * arb.pi()) / p).exp()
        num *= e - 1 / e
    m = d.deg
    if m == 0:
        return num
    e = ipz.exp()
    den = e - 1 / e
    return num / den ** m if m > 0 else num * den ** (-m)


def _G_series(d: LRData, m: int, length: int) -> tuple[list[acb], int]:
    """``G(m + w) = w^-(n-2+2g) * F(w)``; returns the first ``length`` coefficients of ``F``."""
    pi = arb.pi()
    num = [acb(1)] + [acb(0)] * (length - 1)
    for p, sj in zip(d.ps, d.shifts or (0,) * d.n):
        s = ser_sin(acb(pi * (m + 2 * sj) / p), acb(pi / p), length)
        num = ser_mul(num, [acb(0, 2) * c for c in s], length)
    k = d.deg
    # sin(pi(m+w)) = (-1)^m pi w S(w),  S(w) = sum (-1)^j (pi w)^(2j)/(2j+1)!
    S = [acb(0)] * length
    fact = 1
    for j in range(0, length):
        if j > 0:
            fact *= j
        if j % 2 == 0:
            S[j] = acb((-1) ** (j // 2)) * pi ** j / (fact * (j + 1))
    c = acb(0, 2) * ((-1) ** (m % 2)) * pi
    if k > 0:
        Sk = [acb(1)] + [acb(0)] * (length - 1)
        for _ in range(k):
            Sk = ser_mul(Sk, S, length)
        F = ser_mul(num, ser_inv(Sk, length), length)
        F = [x / c ** k for x in F]
        return F, k
    # k <= 0: G = num * (c w S)^|k| -> shift into F with w^-(k) = w^|k|
    Sk = [acb(1)] + [acb(0)] * (length - 1)
    for _ in range(-k):
        Sk = ser_mul(Sk, S, length)
    F = ser_mul(num, Sk, length)
    F = [x * c ** (-k) for x in F]
    # G = w^{|k|} F = w^{-(k)} F : same convention with exponent k (negative)
    return F, k


def _gauss_series(d: LRData, m: int, K: acb, extra_lin: acb, length: int) -> list[acb]:
    """Series of ``exp(-i pi K H (2 m w + w^2)/(2P) - 2 pi i K lin w + extra_lin * w)``."""
    c = acb(0, -1) * arb.pi() * K * d.H / (2 * d.P)
    if d.lin:
        extra_lin = extra_lin - acb(0, 2) * arb.pi() * K * d.lin.numerator / d.lin.denominator
    return ser_exp([acb(0), c * 2 * m + extra_lin, c], length)


@dataclass(frozen=True)
class ResidueTerm:
    """One exact (residue) contribution ``exp(2 pi i K cs) * A(K)`` to ``Z(K)/B(K)``.

    ``kind`` is ``"period"`` (a pole ``z = m`` of ``h/(1 - e^{-2 pi i sigma K (z-m)})``,
    ``0 < m < 2P``) or ``"shift"`` (a pole of ``G`` passed when the ``r``-th Gaussian
    contour is moved to its centre).  ``cs = -H m^2/(4P) mod 1`` in both cases.
    """

    kind: str
    m: int
    r: int
    pole_order: int
    cs: Fraction


def residue_terms(data: LRData) -> list[ResidueTerm]:
    """The exact residue contributions of the Lawrence–Rozansky representation.

    >>> terms = residue_terms(LRData.from_space("Sigma(2,3,5)"))
    >>> sorted({t.cs for t in terms})[-2:]        # among them -49/120 and -1/120 mod 1
    [Fraction(29, 30), Fraction(119, 120)]
    """
    out = []
    if data.deg >= 1:
        # the parallelogram between L + eps and L + eps + 2P (eps -> 0+): its poles are
        # m = 1..2P (for g = 0 the ends m = 0, 2P are regular, h vanishing there)
        for m in range(1, 2 * data.Lp + 1):
            o = data.pole_order(m)
            if o >= 0:
                out.append(ResidueTerm("period", m, 0, o + 1, _cs(data, m)))
        for r in range(0, abs(data.Hs)):
            c = -data.saddle(r)        # saddle at -c, c >= 0; the line starts at 0+ (a pole at 0: g >= 2)
            for m in range(-math.ceil(c) + 1 if c.denominator == 1 else -math.floor(c), 1):
                o = data.pole_order(m)
                if o >= 1:
                    out.append(ResidueTerm("shift", m, r, o, _cs(data, m)))
            if c.denominator == 1 and data.pole_order(-int(c)) >= 1:
                # saddle on a pole: the contour is moved to -c - 1/2, passing that pole too
                m = -int(c)
                out.append(ResidueTerm("shift", m, r, data.pole_order(m), _cs(data, m)))
    return out


def _cs(d: LRData, m: int) -> Fraction:
    return (Fraction(-d.H * m * m, 4 * d.P) - d.lin * m - d.const) % 1


def _sym(x: Fraction) -> Fraction:
    """Representative of ``x mod 1`` in ``(-1/2, 1/2]``."""
    y = x % 1
    return y - 1 if y > Fraction(1, 2) else y


def _phase(K: acb, x: Fraction) -> acb:
    """``exp(2 pi i K x)`` for a rational ``x``."""
    return (acb(0, 2) * arb.pi() * K * x.numerator / x.denominator).exp()


def _residue_value(d: LRData, t: ResidueTerm, K: acb, reduced: bool = False) -> acb:
    """Value of the residue (without the factor ``-2 pi i sigma``), full phase included.

    With ``reduced`` the phase ``exp(2 pi i K x)`` uses the representative of ``x mod 1``
    in ``(-1/2, 1/2]``; the two agree at every integer ``K``.
    """
    n2 = d.deg
    length = max(n2 + 2, 2)
    F, k = _G_series(d, t.m, length)
    two_pi_i = acb(0, 2) * arb.pi()
    if t.kind == "period":
        gs = _gauss_series(d, t.m, K, acb(0), length)
        bern = [acb(x.numerator) / x.denominator * (two_pi_i * d.sigma * K) ** j
                for j, x in enumerate(bernoulli_plus(length))]
        ser = ser_mul(ser_mul(F, gs, length), bern, length)
        # Phi = w^-(k) F gs * (1/(2 pi i sigma K w)) bern -> coefficient of w^k
        val = ser[k] / (two_pi_i * d.sigma * K) if 0 <= k < length else acb(0)
        x = Fraction(-d.H * t.m * t.m, 4 * d.P) - d.lin * t.m - d.const
        return (_phase(K, _sym(x)) if reduced else _phase(K, x)) * val
    # shift: residue of exp(-i pi K H z^2/(2P)) exp(-2 pi i sigma K r z) G(z) at z = m
    lin = -two_pi_i * d.sigma * K * t.r
    gs = _gauss_series(d, t.m, K, lin, length)
    ser = ser_mul(F, gs, length)
    val = ser[k - 1] if 1 <= k <= length else acb(0)
    x = Fraction(-d.H * t.m * t.m, 4 * d.P) - d.sigma * t.r * t.m - d.lin * t.m - d.const
    return (_phase(K, _sym(x)) if reduced else _phase(K, x)) * val


def _angle(d: LRData, K: acb) -> tuple[acb, float]:
    """Contour direction ``u = exp(i theta)`` and ``|sin theta|``."""
    alpha = float(mpmath.arg(mpmath.mpc(float(K.real.mid()), float(K.imag.mid()))))
    theta = -d.sigma * math.pi / 4 - alpha / 2
    if d.sigma == 1 and not (-math.pi / 2 < alpha < math.pi):
        theta -= math.pi          # arg K in (-pi, -pi/2]: same line reached the other way round
    if d.sigma == -1 and not (-math.pi < alpha < math.pi / 2):
        theta += math.pi
    st = abs(math.sin(theta))
    if st < 0.02:
        raise DomainError(
            f"K = {mpmath.nstr(to_mpc(K, 10), 8)} lies on (or too close to) the cut arg K ="
            f" {'-' if d.sigma > 0 else '+'}pi/2 of the continuation of {d.space}; move K off that ray"
        )
    # theta from the arb value of arg K to full precision
    argK = K.arg() if hasattr(K, "arg") else arb(alpha)
    th = -d.sigma * arb.pi() / 4 - argK / 2
    if d.sigma == 1 and not (-math.pi / 2 < alpha < math.pi):
        th -= arb.pi()
    if d.sigma == -1 and not (-math.pi < alpha < math.pi / 2):
        th += arb.pi()
    return (acb(0, 1) * th).exp(), st


MAX_NODES = 2_000_000
# measured speed-ups over knotobs.guard's generic ball-operation cost (2-core machine, 2026): the
# trapezoid loop runs geometric recurrences (cheap products), the residue series are short
QUADRATURE_SPEED = 60.0
RESIDUE_SPEED = 3.0


def _nodes_message(d: "LRData", Kv, N: int) -> str:
    K = mpmath.nstr(Kv, 15)
    why = ("|K| is large: the Gaussian is narrow, and the nodes grow like sqrt|K|; use a smaller |K|"
           if abs(Kv) > 100 else "|K| is small or K is close to the cut; move K away from 0 and from the cut")
    return f"K = {K} on {d.space}: the quadrature needs {2 * N} nodes per integral (at most {2 * MAX_NODES}); {why}"


def _quadrature(d: "LRData", r: int, absK: float, st: float, digits: int):
    """Centre shift ``c``, start ``x0``, step ``h`` and half-count ``N`` of the ``r``-th trapezoid rule."""
    c = -d.saddle(r)                         # Fraction >= 0
    x0 = -c
    a = math.pi * absK * abs(d.H) / (2 * d.P)
    if d.deg >= 1 and c.denominator == 1 and d.pole_order(-int(c)) >= 1:
        # saddle on a pole: pass beside it, at about one Gaussian width (the integrand on a line
        # offset by delta from its centre peaks near exp(a delta^2): delta = 1/2 would cost
        # a/4 / ln 10 digits of cancellation at large |K|)
        x0 = -c - Fraction(1, max(2, math.ceil(math.sqrt(a))))
    # distance from the line to the nearest pole of G
    if d.deg >= 1:
        near = [abs(m - float(x0)) for m in range(int(math.floor(x0)) - 2 * d.P, int(math.ceil(x0)) + 2 * d.P + 1)
                if d.pole_order(m) >= 1]
        dist = max(min(near) if near else 1.0, 1e-3) * st
        strip = 0.8 * dist
    else:
        dist = strip = 1.0
    if d.deg >= 1:
        growth = math.pi * st * max(0.0, sum(1.0 / p for p in d.ps) - d.deg)
    else:
        growth = math.pi * st * (sum(1.0 / p for p in d.ps) - d.deg)
    T = math.log(10) * (digits + 5) + 10
    shift = float(x0 + c)                    # offset of the line from the Gaussian centre
    b = growth + 2 * a * abs(shift) + 1
    smax = (b + math.sqrt(b * b + 4 * a * T)) / (2 * a) + abs(shift)
    h = 2 * math.pi * strip / (T + a * strip * strip + b * strip + max(0.0, math.log(1 / max(dist - strip, 1e-6))) + 5)
    N = int(math.ceil(smax / h))
    return c, x0, h, N


def _saddle_integral(d: LRData, r: int, K: acb, digits: int) -> acb:
    """``int_{L_r} exp(-i pi K H (z + c_r)^2/(2P)) G(z) dz`` on the steepest line through the centre."""
    u, st = _angle(d, K)
    c, x0, h, N = _quadrature(d, r, float(abs(K).mid()), st, digits)
    if N > MAX_NODES:
        raise SizeLimitError(_nodes_message(d, to_mpc(K, 15), N))
    ha = arb(h)
    coef = acb(0, -1) * arb.pi() * K * d.H / (2 * d.P)
    xa = acb(x0.numerator) / x0.denominator
    ca = acb(c.numerator) / c.denominator
    sym = (r == 0 and x0 == 0 and d.genus == 0 and not any(d.shifts) and d.lin == 0)
    ipi = acb(0, 1) * arb.pi()
    # nodes s_j = s0 + j h (j = 0..count-1); every factor is a geometric recurrence in j
    if sym:
        s0, count = ha, N            # even integrand, f(0) = 0 (double zero of G at 0)
    else:
        s0, count = -ha * (2 * N + 1) / 2, 2 * N + 2   # nodes at (j + 1/2) h: never on an integer
    z0 = xa + u * s0
    dz = u * ha
    w0 = z0 + ca
    # Gaussian exp(coef w^2), w = w0 + j dz: g_{j+1} = g_j * rho_j, rho_{j+1} = rho_j * exp(2 coef dz^2)
    g = (coef * w0 * w0).exp()
    rho = (coef * (2 * w0 * dz + dz * dz)).exp()
    rr = (2 * coef * dz * dz).exp()
    facs = []
    for p, sj in zip(d.ps, d.shifts or (0,) * d.n):
        e0 = (ipi * (z0 + 2 * sj) / p).exp()
        st_ = (ipi * dz / p).exp()
        facs.append([e0, 1 / e0, st_, 1 / st_])
    m2 = d.deg
    if m2 != 0:
        e0 = (ipi * z0).exp()
        st_ = (ipi * dz).exp()
        den = [e0, 1 / e0, st_, 1 / st_]
    total = acb(0)
    for _ in range(count):
        num = g
        for f in facs:
            num = num * (f[0] - f[1])
            f[0] = f[0] * f[2]
            f[1] = f[1] * f[3]
        if m2 > 0:
            num = num / (den[0] - den[1]) ** m2
        elif m2 < 0:
            num = num * (den[0] - den[1]) ** (-m2)
        if m2 != 0:
            den[0] = den[0] * den[2]
            den[1] = den[1] * den[3]
        total += num
        g = g * rho
        rho = rho * rr
    if sym:
        total = 2 * total
    return total * ha * u


def _Z_acb(d: LRData, K: acb, digits: int, reduced: bool = True, tick=None) -> tuple[acb, dict[str, acb]]:
    """``Z(K)`` as a ball (rounding only; discretisation checked by the caller, who sets the precision)."""
    pieces: dict[str, acb] = {}
    two_pi_i = acb(0, 2) * arb.pi()
    bracket = acb(0)
    integral_part = acb(0)
    residue_part = acb(0)
    for sd in d.sectors():
        for r in range(abs(sd.Hs)):
            J = _saddle_integral(sd, r, K, digits)
            x = _gauss_phase(sd, r)
            pref = _phase(K, _sym(x) if reduced else x)
            integral_part += pref * J
            if tick is not None:
                tick()
        for t in residue_terms(sd):
            residue_part += _residue_value(sd, t, K, reduced)
    if tick is not None:
        tick()
    bracket = integral_part - two_pi_i * d.sigma * residue_part
    B = _B(d, K)
    pieces["integral"] = B * integral_part
    pieces["residues"] = -B * two_pi_i * d.sigma * residue_part
    return B * bracket, pieces


def _sectors_acb(d: LRData, K: acb, digits: int, reduced: bool = True) -> dict[Fraction, acb]:
    """``Z(K)`` split by Chern–Simons value: ``{cs mod 1 in [0, 1): value}`` (B included).

    Gaussian pieces ``r`` carry ``cs = P r^2/H``; residues carry their own ``cs``.  The
    values add up to :func:`_Z_acb`.  The caller sets the precision.
    """
    two_pi_i = acb(0, 2) * arb.pi()
    B = _B(d, K)
    out: dict[Fraction, acb] = {}
    for sd in d.sectors():
        for r in range(abs(sd.Hs)):
            x = _gauss_phase(sd, r)
            J = _saddle_integral(sd, r, K, digits)
            val = B * _phase(K, _sym(x) if reduced else x) * J
            out[x % 1] = out.get(x % 1, acb(0)) + val
        for term in residue_terms(sd):
            val = -B * two_pi_i * sd.sigma * _residue_value(sd, term, K, reduced)
            out[term.cs] = out.get(term.cs, acb(0)) + val
    return out


def _gauss_phase(d: LRData, r: int) -> Fraction:
    """Phase ``x`` (``exp(2 pi i K x)``) of the ``r``-th Gaussian of a sector after completing the
    square: ``L (lin + sigma r)^2/Hs - const`` (``P r^2/H`` for one sector)."""
    return d.Lp * (d.lin + d.sigma * r) ** 2 / d.Hs - d.const


def require_continuation(d: LRData, Kv, digits: int) -> None:
    """Refuse (CONVENTIONS §16) a continued ``Z(K)`` whose estimated cost is above the limits.

    The work is two runs (at ``digits + 3`` and ``digits + 12`` digits) of: ``|H|`` trapezoid
    rules of ``2 N`` nodes with ``n + 4`` ball products each, and about ``2P + P|H|`` residue
    terms, each a product of ``n`` truncated series of length ``n``.

    >>> require_continuation(LRData.from_space("Sigma(2,3,5)"), mpmath.mpc(7.5, 0.3), 30)
    """
    seconds, memory, what = continuation_cost(d, Kv, digits)
    require(what, seconds=seconds, memory_mb=memory,
            accepted="ask for fewer digits, or a manifold with fewer or smaller exceptional fibers")


def continuation_cost(d: LRData, Kv, digits: int) -> tuple[float, float, str]:
    """Estimated ``(seconds, memory_mb, description)`` of one continued ``Z(K)`` (see
    :func:`require_continuation`); the residue count alone is checked against the limits first,
    since the contour set-up itself is ``O(P)``."""
    n = max(d.n, 1)
    absK = float(abs(Kv))
    alpha = float(mpmath.arg(Kv))
    theta = -d.sigma * math.pi / 4 - alpha / 2
    st = max(abs(math.sin(theta)), 0.02)
    where = f"continued Z({d.space}) at K = {mpmath.nstr(Kv, 12)} to {digits} digits"
    L = math.lcm(*d.ps) if d.ps else 1
    nsec = d.P // L                          # sectors when orders share factors (LRData.sectors)
    terms = nsec * (2 * L + L * abs(d.H * L // d.P)) if d.deg >= 1 else 0
    accepted = "ask for fewer digits, or a manifold with fewer or smaller exceptional fibers"
    # the residue terms alone (and the pole search of the contour, O(P)) come first
    require(f"{where} ({terms} residue terms in {nsec} sector(s); {d.n} surgery coefficients, P = {d.P},"
            f" |H| = {abs(d.H)})",
            seconds=ball_seconds(2 * terms * n * (n + 2) ** 2 + 4 * d.P, digits + 12) / RESIDUE_SPEED,
            memory_mb=terms * 400 / 1e6, accepted=accepted)
    N = _quadrature(d, 0, absK, st, digits + 12)[3]
    if N > MAX_NODES:
        raise SizeLimitError(f"{where}: " + _nodes_message(d, Kv, N))
    seconds = (ball_seconds(2 * abs(d.H) * 2 * N * (n + 4), digits + 12) / QUADRATURE_SPEED
               + ball_seconds(2 * terms * n * (n + 2) ** 2, digits + 12) / RESIDUE_SPEED)
    memory = terms * 400 / 1e6 + abs(d.H) * (digits + 12) * 8 / 1e6
    return seconds, memory, (f"{where} ({abs(d.H)} Gaussian integrals of {2 * N} nodes, {terms} residue terms;"
                             f" {d.n} surgery coefficients, P = {d.P})")



def integral_partition_function(space, level: int, digits: int = 30):
    """SU(2) ``Z_k(M)`` at an integer level by the integral form (the ``integral`` route).

    ``M`` is ``M(g; b; (a_i, b_i))`` with ``e != 0``, any orders (those sharing a factor split
    the sum into ``P/lcm`` sectors, :meth:`LRData.sectors`) and any base genus (``(-2K)^g`` and
    the power ``n - 2 + 2g`` of the sines); the value is numeric with ``digits`` certified digits
    (two discretisations agree), in the normalisation and framing of the Gauss-sum route.

    Parameters
    ----------
    space : str or SeifertManifold
    level : int
        ``k >= 1`` (``K = k + 2``).
    digits : int

    Returns
    -------
    FiniteLevelValue
        ``exact`` is ``None``; ``details["route"]`` names the integral form.

    Examples
    --------
    >>> from knotobs.evaluation.gauss_sum import gauss_sum_partition_function
    >>> M = parse_space("Sigma(2,3,7)")
    >>> a = integral_partition_function(M, 40, digits=25).numeric
    >>> b = gauss_sum_partition_function(M, 40, digits=25).numeric
    >>> abs(a - b) < 1e-22
    True

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314, §3; CONVENTIONS §9.
    """
    from knotobs.evaluation.finite_value import numeric_seifert_value

    if isinstance(level, bool) or not isinstance(level, int) or level < 1:
        raise NotIntegrableError(f"level k = {level!r} is not allowed: use an integer k >= 1")
    digits = check_digits(digits)
    d = LRData.from_space(space, allow_genus=True, allow_shared=True)
    K = level + 2
    require_continuation(d, mpmath.mpc(K), digits)
    val = checked(lambda dg: _Z_at(d, K, dg), digits, f"Z({d.space}) at level {level}")
    return numeric_seifert_value(d.space, val, digits, {
        "route": "Lawrence-Rozansky integral form (Gaussian integrals + residues)",
        "group": "SU(2)", "level": level,
        "terms": 2 * d.P + d.P * abs(d.H) if d.deg >= 1 else abs(d.H)})


def _Z_at(d: LRData, K: int, dg: int) -> acb:
    with working_bits(bits(dg)):
        return _Z_acb(d, acb(K), dg, True)[0]
