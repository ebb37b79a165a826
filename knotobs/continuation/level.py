r"""Complex level: invariants at ``q = exp(2 pi i/K)`` for complex ``K``, and the analytic
continuation in ``K`` of SU(2) partition functions of Seifert manifolds.

Conventions
-----------
SU(2) at level ``k`` has shifted level ``K = k + 2`` and ``q = exp(2 pi i/K)``
(docs/conventions.md §1).  Functions take either ``level=k`` or ``K=``; a complex
``level`` means ``K = level + 2``.  Partition functions are normalised by
``Z(S^3) = S_11``, ``Z(S^2 x S^1) = 1`` in the canonical 2-framing, exactly as the
finite-level routes of :mod:`knotobs.evaluation` (CONVENTIONS §9).

The Lawrence–Rozansky representation
------------------------------------
``M = X(p_1/q_1, ..., p_n/q_n)`` (:meth:`SeifertManifold.surgery_presentation`),
``P = prod p_j``, ``H = P sum q_j/p_j`` (``H != 0``), ``sigma = sign H``.  With

    ``G(z) = prod_j 2i sin(pi z/p_j) / (2i sin(pi z))^(n-2)``,   ``h(z) = exp(-i pi K H z^2/(2P)) G(z)``,

the finite Gauss sum of CONVENTIONS §9 is ``Z = (B/K) sum'_{beta mod 2PK} h(beta/K)``
with ``B = -(4 sqrt P)^-1 exp(3 pi i sigma/4) q^(-phi/4)``.  Summing the residues
of ``h(z)/(1 - exp(-2 pi i sigma K z))`` over the parallelogram spanned by a line
``L`` through 0 and ``L + 2P`` and using ``h(z + 2P) = exp(-2 pi i K H z) h(z)``
(integer ``K``) gives the integral-plus-residues form (R. Lawrence and
L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314, §3):

    ``Z(K) = B(K) [ sum_{r=0}^{|H|-1} int_L h(z) exp(-2 pi i sigma K r z) dz
                   - 2 pi i sigma sum_{m=1}^{2P-1} Res_{z=m} h(z) / (1 - exp(-2 pi i sigma K (z-m))) ]``

(the residue sum is absent for ``n <= 2``, where ``G`` is entire).  Every piece is
holomorphic in ``K`` (for integer ``K`` the factor ``exp(-2 pi i sigma K (z - m))``
equals ``exp(-2 pi i sigma K z)``), so the right-hand side *defines* the
continuation; it equals the finite value at every integer ``K >= 2``.  Completing
the square, the ``r``-th integral is ``exp(2 pi i K P r^2/H)`` times a Gaussian
integral centred at ``z = -2 P r/|H|``; the contour is moved there (picking up
the residues of ``G`` at the integers passed) so that nothing cancels
catastrophically.  The contour ``L`` has direction ``exp(i theta)``,
``theta = -sigma pi/4 - arg(K)/2``; this keeps the Gaussian decaying and is
allowed for ``arg K`` in ``(-pi/2, pi)`` (``sigma = 1``) or ``(-pi, pi/2)``
(``sigma = -1``): the continuation is holomorphic in ``K`` on the plane cut along
the ray ``arg K = -sigma pi/2``.

The integrals are done with the trapezoid rule on the steepest-descent line
(exponentially convergent for an integrand analytic in a strip); each value is
computed twice with different steps, cut-offs and precisions and must agree to
the requested digits.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from fractions import Fraction
from typing import Any, Sequence

import mpmath
from flint import acb, arb

from knotobs.continuation._num import (
    bernoulli_plus,
    bits,
    checked,
    parse_complex,
    ser_exp,
    ser_inv,
    ser_mul,
    ser_sin,
    to_acb,
    to_mpc,
    ball_seconds,
    working_bits,
)
from knotobs.errors import InvalidSeifertDataError, KnotobsError, PrecisionError, SizeLimitError
from knotobs.guard import require
from knotobs.numerics import working_precision
from knotobs.precision import certified_parts, check_digits
from knotobs.fibrations.seifert import SeifertManifold, parse_space
from knotobs.polynomials.laurent import Laurent
from knotobs._notebook import NotebookMixin

__all__ = [
    "LRData",
    "ContinuedValue",
    "resolve_K",
    "evaluate_polynomial",
    "continued_partition_function",
    "continued_Z",
    "residue_terms",
    "ResidueTerm",
    "DomainError",
    "sector_values",
    "require_continuation",
    "continuation_cost",
]


class DomainError(KnotobsError, ValueError):
    """A complex level outside the region where the continuation formula is set up."""


# ---------------------------------------------------------------------------
# levels


def resolve_K(level=None, K=None, N: int = 2) -> mpmath.mpc:
    """Shifted level ``K`` from ``level = k`` (``K = k + N``) or from ``K`` itself.

    Both may be complex numbers or strings such as ``"7.5+0.3i"``.

    >>> resolve_K(level="7.5+0.3i")
    mpc(real='9.5', imag='0.29999999999999999')
    >>> resolve_K(K=5)
    mpc(real='5.0', imag='0.0')
    >>> resolve_K()
    Traceback (most recent call last):
    ...
    knotobs.continuation.level.DomainError: give the level k (K = k + 2) or the shifted level K
    """
    if (level is None) == (K is None):
        raise DomainError(f"give the level k (K = k + {N}) or the shifted level K" if level is None
                          else "give either level= or K=, not both")
    if K is not None:
        Kv = parse_complex(K, "K")
    else:
        Kv = parse_complex(level, "level") + N
    if Kv == 0:
        raise DomainError(f"K = 0 (level k = {-N}) is not allowed: q = exp(2 pi i/K) is undefined")
    if not (mpmath.isfinite(Kv.real) and mpmath.isfinite(Kv.imag)) or abs(Kv) > mpmath.mpf(10) ** 100:
        given = K if K is not None else level
        raise DomainError(f"{'K' if K is not None else 'level'} = {given!s}: |K| must be at most 1e100")
    return Kv


def evaluate_polynomial(poly: Laurent, *, K=None, level=None, q=None, N: int = 2, digits: int = 30) -> mpmath.mpc:
    """Value of an exact Laurent polynomial at ``q = exp(2 pi i/K)`` (complex ``K``) or at any ``q``.

    Rational powers ``q^(a/b)`` are ``exp(2 pi i a/(b K))`` on the ``K`` route and use the
    principal logarithm of ``q`` on the ``q`` route.  The value is computed at two
    precisions, which must agree to ``digits`` digits.

    Parameters
    ----------
    poly : Laurent
        The exact invariant (e.g. ``jones("T(2,3)").value``, variable ``t = q^-1``:
        evaluate ``poly`` in its own variable).
    K, level : complex or str
        ``K`` or ``level`` (``K = level + N``); e.g. ``"7.5+0.3i"``.
    q : complex or str
        Evaluate directly at this ``q`` (any modulus, ``q != 0``).
    digits : int

    Examples
    --------
    >>> from knotobs.evaluation.families import jones
    >>> V = jones("T(2,3)").value                       # t + t^3 - t^4
    >>> z = evaluate_polynomial(V, q="0.5")             # at t = 0.5
    >>> mpmath.nstr(z.real, 10)
    '0.5625'
    >>> z = evaluate_polynomial(V, K="7.5+0.3i", digits=20)
    >>> abs(z - (V.at_root_of_unity("7.5+0.3j", dps=25))) < 1e-14
    True

    References
    ----------
    E. Witten, Commun. Math. Phys. 121 (1989) 351–399 (``q = exp(2 pi i/(k+2))``).
    """
    if not isinstance(poly, Laurent):
        raise KnotobsError(f"expected an exact Laurent polynomial, got {type(poly).__name__}")
    digits = check_digits(digits)
    if q is not None:
        if K is not None or level is not None:
            raise DomainError("give q, or K/level, not both")
        if parse_complex(q, "q") == 0:
            raise DomainError("q = 0 is not allowed for a Laurent polynomial")

        def comp(d):
            # q is read again at this precision: both runs start from the text the user gave
            with working_precision(d + 10):
                return poly.evaluate(parse_complex(q, "q"), dps=d)
    else:
        resolve_K(level, K, N)

        def comp(d):
            with working_precision(d + 10):
                return poly.evaluate(log_x=2j * mpmath.pi / resolve_K(level, K, N), dps=d)

    z1 = mpmath.mpc(comp(digits + 5))
    z2 = mpmath.mpc(comp(digits + 15))
    with working_precision(digits + 10):
        if abs(z1 - z2) > mpmath.mpf(10) ** (-digits) * max(abs(z2), 1):
            raise PrecisionError(f"polynomial value not stable to {digits} digits; request fewer digits")
    with working_precision(digits):
        return +z2


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
    >>> LRData.from_space("S^2xS^1")
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidSeifertDataError: M(0; 0) has H = 0 (infinite H_1): the Lawrence-Rozansky continuation needs a rational homology sphere

    References
    ----------
    Lawrence & Rozansky, Commun. Math. Phys. 205 (1999) 287–314.
    """

    space: SeifertManifold
    pq: tuple[tuple[int, int], ...]
    P: int
    H: int
    phi: Fraction

    @classmethod
    def from_space(cls, space) -> "LRData":
        from knotobs.evaluation.gauss_sum import lr_data

        M = parse_space(space)
        raw = list(M.surgery_presentation())
        pq, P, H, phi = lr_data(raw) if raw else ([], 1, 0, Fraction(0))
        if H == 0:
            raise InvalidSeifertDataError(
                f"{M} has H = 0 (infinite H_1): the Lawrence-Rozansky continuation needs a"
                " rational homology sphere"
            )
        return cls(M, tuple(pq), P, H, phi)

    @property
    def n(self) -> int:
        return len(self.pq)

    @property
    def sigma(self) -> int:
        return 1 if self.H > 0 else -1

    @property
    def ps(self) -> tuple[int, ...]:
        return tuple(p for p, _ in self.pq)

    def pole_order(self, m: int) -> int:
        """Order of the pole of ``G`` at the integer ``m`` (``<= 0``: regular)."""
        return (self.n - 2) - sum(1 for p in self.ps if m % p == 0)

    def saddle(self, r: int) -> Fraction:
        """Centre ``-2 P r/|H|`` of the ``r``-th Gaussian."""
        return Fraction(-2 * self.P * r, abs(self.H))


# ---------------------------------------------------------------------------
# the pieces


def _B(d: LRData, K: acb) -> acb:
    pi = arb.pi()
    ph = acb(d.phi.numerator) / d.phi.denominator
    return (-1 / (4 * arb(d.P).sqrt())) * (acb(0, 3 * d.sigma) * pi / 4).exp() * (acb(0, -1) * pi * ph / (2 * K)).exp()


def _G(d: LRData, z: acb) -> acb:
    ipz = acb(0, 1) * arb.pi() * z
    num = acb(1)
    for p in d.ps:
        e = (ipz / p).exp()
        num *= e - 1 / e
    m = d.n - 2
    if m == 0:
        return num
    e = ipz.exp()
    den = e - 1 / e
    return num / den ** m if m > 0 else num * den ** (-m)


def _G_series(d: LRData, m: int, length: int) -> tuple[list[acb], int]:
    """``G(m + w) = w^-(n-2) * F(w)``; returns the first ``length`` coefficients of ``F``."""
    pi = arb.pi()
    num = [acb(1)] + [acb(0)] * (length - 1)
    for p in d.ps:
        s = ser_sin(acb(pi * m / p), acb(pi / p), length)
        num = ser_mul(num, [acb(0, 2) * c for c in s], length)
    k = d.n - 2
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
    """Series of ``exp(-i pi K H (2 m w + w^2)/(2P) + extra_lin * w)``."""
    c = acb(0, -1) * arb.pi() * K * d.H / (2 * d.P)
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
    if data.n >= 3:
        for m in range(1, 2 * data.P):
            o = data.pole_order(m)
            if o >= 0:
                out.append(ResidueTerm("period", m, 0, o + 1, _cs(data, m)))
        for r in range(1, abs(data.H)):
            c = -data.saddle(r)        # saddle at -c, c > 0
            for m in range(-math.ceil(c) + 1 if c.denominator == 1 else -math.floor(c), 0):
                o = data.pole_order(m)
                if o >= 1:
                    out.append(ResidueTerm("shift", m, r, o, _cs(data, m)))
            if c.denominator == 1 and data.pole_order(-int(c)) >= 1:
                # saddle on a pole: the contour is moved to -c - 1/2, passing that pole too
                m = -int(c)
                out.append(ResidueTerm("shift", m, r, data.pole_order(m), _cs(data, m)))
    return out


def _cs(d: LRData, m: int) -> Fraction:
    return Fraction(-d.H * m * m, 4 * d.P) % 1


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
    n2 = d.n - 2
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
        x = Fraction(-d.H * t.m * t.m, 4 * d.P)
        return (_phase(K, _sym(x)) if reduced else _phase(K, x)) * val
    # shift: residue of exp(-i pi K H z^2/(2P)) exp(-2 pi i sigma K r z) G(z) at z = m
    lin = -two_pi_i * d.sigma * K * t.r
    gs = _gauss_series(d, t.m, K, lin, length)
    ser = ser_mul(F, gs, length)
    val = ser[k - 1] if 1 <= k <= length else acb(0)
    x = Fraction(-d.H * t.m * t.m, 4 * d.P) - d.sigma * t.r * t.m
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
    if d.n >= 3 and c.denominator == 1 and d.pole_order(-int(c)) >= 1:
        x0 = -c - Fraction(1, 2)             # saddle on a pole: pass beside it
    a = math.pi * absK * abs(d.H) / (2 * d.P)
    # distance from the line to the nearest pole of G
    if d.n >= 3:
        near = [abs(m - float(x0)) for m in range(int(math.floor(x0)) - 2 * d.P, int(math.ceil(x0)) + 2 * d.P + 1)
                if d.pole_order(m) >= 1]
        dist = max(min(near) if near else 1.0, 1e-3) * st
        strip = 0.8 * dist
    else:
        dist = strip = 1.0
    if d.n >= 3:
        growth = math.pi * st * max(0.0, sum(1.0 / p for p in d.ps) - (d.n - 2))
    else:
        growth = math.pi * st * (sum(1.0 / p for p in d.ps) + (2 - d.n))
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
    sym = (r == 0 and x0 == 0)
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
    for p in d.ps:
        e0 = (ipi * z0 / p).exp()
        st_ = (ipi * dz / p).exp()
        facs.append([e0, 1 / e0, st_, 1 / st_])
    m2 = d.n - 2
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
    for r in range(abs(d.H)):
        J = _saddle_integral(d, r, K, digits)
        x = Fraction(d.P * r * r, d.H)
        pref = _phase(K, _sym(x) if reduced else x)
        integral_part += pref * J
        if tick is not None:
            tick()
    residue_part = acb(0)
    for t in residue_terms(d):
        residue_part += _residue_value(d, t, K, reduced)
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
    for r in range(abs(d.H)):
        x = Fraction(d.P * r * r, d.H)
        J = _saddle_integral(d, r, K, digits)
        val = B * _phase(K, _sym(x) if reduced else x) * J
        out[x % 1] = out.get(x % 1, acb(0)) + val
    for term in residue_terms(d):
        val = -B * two_pi_i * d.sigma * _residue_value(d, term, K, reduced)
        out[term.cs] = out.get(term.cs, acb(0)) + val
    return out


def sector_values(space, K, digits: int = 30, phases: str = "reduced") -> dict[Fraction, mpmath.mpc]:
    """The continued ``Z(K)`` split into its flat-connection sectors, keyed by CS value mod 1.

    Each value is holomorphic in ``K``; their sum is :func:`continued_partition_function`.
    With the reduced phases (default) the residue groups that are not flat connections
    cancel identically, so the keys are exactly the Chern–Simons values of the trivial,
    abelian and irreducible flat connections.

    Examples
    --------
    >>> v = sector_values("Sigma(2,3,5)", 5, digits=20)
    >>> sorted(str(cs) for cs in v)
    ['0', '119/120', '71/120']
    >>> abs(sum(v.values()) - continued_Z("Sigma(2,3,5)", 5, 20)) < 1e-12
    True

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (the decomposition);
    L. Rozansky, Commun. Math. Phys. 171 (1995) 279–322 (its identification with flat connections).
    """
    if phases not in PHASES:
        raise DomainError(f"phases = {phases!r}: use one of {', '.join(PHASES)}")
    digits = check_digits(digits)
    d = LRData.from_space(space)
    Kv = resolve_K(K=K)
    require_continuation(d, Kv, digits)

    def run(dg):
        with working_bits(bits(dg)):
            # K is read again at this precision, so the two runs are independent
            return _sectors_acb(d, to_acb(resolve_K(K=K)), dg, phases == "reduced")

    lo, hi = run(digits + 3), run(digits + 12)
    keep = set(hi)
    if phases == "reduced":
        # residue groups that cancel at every integer K cancel identically once the phases
        # are reduced: only the flat connections of the manifold remain
        from knotobs.continuation.asymptotics import contributions

        keep = {c.cs for c in contributions(d.space)}
        scale = max([abs(to_mpc(v, 15)) for v in hi.values()] + [mpmath.mpf(1)])
        for cs, v in hi.items():
            if cs not in keep and abs(to_mpc(v, 15)) > mpmath.mpf(10) ** (-digits) * scale:
                raise PrecisionError(  # pragma: no cover - would contradict the decomposition
                    f"sector cs = {cs} of Z({d.space}) should vanish but is {mpmath.nstr(to_mpc(v, 15), 5)}"
                )
    out = {}
    for cs in sorted(keep):
        def pick(dg, cs=cs):
            return (lo if dg == digits + 3 else hi).get(cs, acb(0))

        out[cs] = checked(pick, digits, f"sector cs = {cs} of Z({d.space}) at K = {mpmath.nstr(Kv, 10)}")
    return out


@dataclass(frozen=True, repr=False)
class ContinuedValue(NotebookMixin):
    """``Z(K)`` at a complex shifted level, with its pieces and profile.

    Attributes
    ----------
    numeric : mpmath.mpc
        Correct to ``digits`` digits (absolute below 1, relative above), confirmed by two
        discretisations.
    K : mpmath.mpc
        Shifted level ``K = k + 2``.
    space : str
    pieces : dict
        ``"integral"`` (the Gaussian integrals, i.e. trivial/abelian saddles) and
        ``"residues"`` (the exact residue terms), as mpc; they add up to ``numeric``.
    """

    numeric: mpmath.mpc
    digits: int
    K: mpmath.mpc
    space: str
    pieces: dict = field(default_factory=dict, compare=False)
    notes: tuple[str, ...] = ()

    def to_json(self) -> dict[str, Any]:
        return {
            "quantity": "partition-function",
            "group": "SU(2)",
            "space": self.space,
            "K": {"re": mpmath.nstr(self.K.real, 15), "im": mpmath.nstr(self.K.imag, 15)},
            "level": {"re": mpmath.nstr(self.K.real - 2, 15), "im": mpmath.nstr(self.K.imag, 15)},
            "numeric": {**_certified_json(self.numeric, self.digits), "digits": self.digits},
            "pieces": {k: _certified_json(v, self.digits) for k, v in self.pieces.items()},
            "route": "Lawrence-Rozansky integral plus residues (analytic continuation in K)",
            "normalisation": "Z(S^3) = S_11, Z(S^2 x S^1) = 1, canonical 2-framing",
            "notes": list(self.notes),
        }


PHASES = ("reduced", "lawrence-rozansky")


def _certified_json(z, digits: int) -> dict[str, str]:
    re_, im_ = certified_parts(z, digits)
    return {"re": re_, "im": im_}


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
    terms = (2 * d.P + d.P * abs(d.H)) if d.n >= 3 else 0
    accepted = "ask for fewer digits, or a manifold with fewer or smaller exceptional fibers"
    # the residue terms alone (and the pole search of the contour, O(P)) come first
    require(f"{where} ({terms} residue terms; {d.n} surgery coefficients, P = {d.P}, |H| = {abs(d.H)})",
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


def continued_partition_function(space, level=None, *, K=None, digits: int = 30,
                                 phases: str = "reduced", progress=None) -> ContinuedValue:
    """SU(2) partition function of a Seifert rational homology sphere at complex level.

    Parameters
    ----------
    space : str or SeifertManifold
        E.g. ``"Sigma(2,3,5)"``, ``"L(5,1)"``, ``"M(0; -1; (2,1), (3,1), (5,1))"``.
    level, K : complex or str
        ``level = k`` (``K = k + 2``) or ``K``; e.g. ``level="7.5+0.3i"``.
    digits : int
        Correct digits of the result.
    phases : ``"reduced"`` (default) or ``"lawrence-rozansky"``
        Every piece of the representation carries a phase ``exp(2 pi i K x)`` with ``x``
        rational (a Chern–Simons value).  ``"reduced"`` takes ``x`` mod 1 in
        ``(-1/2, 1/2]``; ``"lawrence-rozansky"`` keeps ``x`` as it comes out of the
        residue calculus.  Both agree at every integer ``K`` and are holomorphic; the
        reduced one grows at most like ``exp(pi |Im K|)`` times a power of ``|K|``, so it is
        the continuation of smallest exponential type (Carlson's theorem: two
        continuations of type below ``pi`` in a half-plane that agree at the integers are
        equal), while the unreduced one grows like ``exp(pi m^2 |Im K|/(2P))``.

    progress : callable, optional
        ``progress(done, total)`` after each Gaussian integral and residue sum of both runs
        (the command line shows it on a terminal).

    Returns
    -------
    ContinuedValue

    Notes
    -----
    At integer ``K >= 2`` the value is the finite-level ``Z_{K-2}(M)`` of
    :func:`knotobs.evaluation.surgery.partition_function`; in between it is the
    Lawrence–Rozansky continuation described in the module docstring, with the
    phases chosen by ``phases``.

    Examples
    --------
    >>> z = continued_partition_function("Sigma(2,3,5)", K=5, digits=20)
    >>> from knotobs.evaluation.surgery import partition_function
    >>> abs(z.numeric - partition_function(parse_space("Sigma(2,3,5)"), level=3).numeric) < 1e-18
    True
    >>> w = continued_partition_function("Sigma(2,3,5)", level="7.5+0.3i", digits=15)
    >>> w.to_json()["numeric"]["digits"]
    15

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314.
    """
    if phases not in PHASES:
        raise DomainError(f"phases = {phases!r}: use one of {', '.join(PHASES)}")
    digits = check_digits(digits)
    d = LRData.from_space(space)
    Kv = resolve_K(level, K)
    require_continuation(d, Kv, digits)
    holder = {}
    steps = {"done": 0, "total": 2 * (abs(d.H) + 1)}

    def tick():
        steps["done"] += 1
        if progress is not None:
            progress(steps["done"], steps["total"])

    def comp(dg):
        with working_bits(bits(dg)):
            # the level is read again at this precision, so the two runs are independent
            Ka = to_acb(resolve_K(level, K))
            z, pieces = _Z_acb(d, Ka, dg, phases == "reduced", tick)
            holder["pieces"] = pieces
            return z

    val = checked(comp, digits, f"Z({d.space}) at K = {mpmath.nstr(Kv, 10)}")
    pieces = {k: to_mpc(v, digits) for k, v in holder["pieces"].items()}
    notes = []
    if Kv.imag == 0 and Kv.real == int(Kv.real):
        notes.append("integer K: equals the finite-level value Z_k with k = K - 2")
    return ContinuedValue(val, digits, Kv, str(d.space), pieces, tuple(notes))


def continued_Z(space, K, digits: int = 30, phases: str = "reduced") -> mpmath.mpc:
    """Shorthand: ``continued_partition_function(space, K=K, digits=digits).numeric``.

    >>> abs(continued_Z("S^3", 5, 20) - mpmath.sqrt(mpmath.mpf(2)/5) * mpmath.sin(mpmath.pi/5)) < 1e-14
    True
    """
    return continued_partition_function(space, K=K, digits=digits, phases=phases).numeric
