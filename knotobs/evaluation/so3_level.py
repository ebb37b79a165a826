"""SO(3) at finite level: the integer-spin part of SU(2)_k for odd k, on S^3 and on Seifert manifolds.

For odd ``k`` (``K = k + 2 = r`` odd) the integer-spin representations of SU(2)_k, i.e. the colours of
odd dimension ``a = 1, 3, ..., K - 2``, form a modular category of their own (the quantum SO(3)
invariant of R. Kirby, P. Melvin, Invent. Math. 105 (1991) 473–545, §8; for even ``k`` the simple
current of spin ``k/4`` is among them and the category is not modular, so even ``k`` is refused).
Its data, in the conventions of CONVENTIONS §6 and §9 (colours as dimensions):

* ``S'_ab = sqrt(2) S_ab = 2 sqrt(1/K) sin(pi a b/K)`` (``a, b`` odd): real orthogonal, because
  ``b -> K - b`` exchanges odd and even colours and ``S_{a, K-b} = S_ab`` for odd ``a``;
* ``theta_a = exp(i pi (a^2 - 1)/(2K))`` as for SU(2); ``D' = sqrt(sum_a d_a^2) = 1/S'_11``;
* the framing anomaly ``exp(2 pi i c'/8) = p'_+/D'``, ``p'_+ = sum_a theta_a d_a^2`` (Gauss sum).

The partition function of ``M(0; b; (a_i, b_i))`` is the Reshetikhin–Turaev sum over the star
plumbing (CONVENTIONS §9, the same presentation as the SU(N) surgery route):

    Z(M) = (p'_+/D')^(-sigma) sum_lam prod_v S'_{1 lam_v}^(2 - deg v) theta_{lam_v}^(w_v) prod_edges S'_{lam_u lam_v},

normalised by ``Z(S^3) = S'_11``, ``Z(S^2 x S^1) = 1``, canonical 2-framing.  A Wilson line of colour
``mu`` along a regular fiber (a meridian of the central vertex) or the core of an exceptional fiber
(a meridian of the last vertex of its chain) multiplies the summand by ``S'_{lam_v mu}/S'_{1 lam_v}``,
with the framing of the surgery diagram (the fiber framing for a regular fiber).

Since SU(2)_k is the product of this category with ``{1, j}`` (``j`` of dimension ``K - 1``, spin
``k/4``), which is SU(2)_1 for ``k = 1 mod 4`` and its mirror for ``k = 3 mod 4``,

    Z_{SU(2)_k}(M) = Z_{SO(3)_k}(M) Z_{SU(2)_1}(+-M)

(Kirby–Melvin (1991), Theorem 8.10 in the form ``tau_r = tau_3 tau'_r`` for odd ``r``; theorem
number from memory), and normalised Wilson loops of integer-spin colours are the SU(2) ones; the
tests check both against the SU(2) surgery route.

Values are exact cyclotomic numbers (``S'`` and ``theta`` in one field ``Q(zeta_L)``, ``sqrt(K)`` from Gauss
sums) when the estimated cost is small (:data:`EXACT_AUTO_SECONDS`), and always numeric, computed with a
private mpmath context at two precisions and certified by their agreement; the two are checked
against each other.
"""

from __future__ import annotations

from fractions import Fraction
from typing import Mapping, Optional, Sequence

import mpmath

from knotobs.errors import InvalidKnotError, KnotobsError, NotIntegrableError, PrecisionError
from knotobs.evaluation.finite_value import FiniteLevelValue
from knotobs.guard import require, seconds_for
from knotobs.numerics import local_mp
from knotobs.representations.cartan.group import SimpleGroup

__all__ = ["so3_colour", "so3_partition_function", "so3_fiber_wilson_loop", "so3_level_loop", "check_odd_level"]

_SO3 = SimpleGroup("SO", 3)


def check_odd_level(k) -> int:
    """``k`` must be an odd positive integer.

    >>> check_odd_level(4)
    Traceback (most recent call last):
    ...
    knotobs.errors.NotIntegrableError: SO(3) at level k = 4: the integer-spin part of SU(2)_k is modular only for odd k (K = k + 2 odd, Kirby-Melvin); use k = 3, 5, 7, ...
    """
    if isinstance(k, bool) or not isinstance(k, int) or k < 1 or k % 2 == 0:
        raise NotIntegrableError(
            f"SO(3) at level k = {k!r}: the integer-spin part of SU(2)_k is modular only for odd k"
            " (K = k + 2 odd, Kirby-Melvin); use k = 3, 5, 7, ...")
    return k


def so3_colour(rep, level: int) -> int:
    """The SU(2) dimension ``a`` (odd) of an SO(3) representation, checked to be integrable at level ``k``.

    ``[j]`` (partition) and ``(2j)`` (Dynkin label of B_1) are spin ``j``: ``a = 2 j + 1``.

    >>> so3_colour("[1]", 3), so3_colour("(2)", 5), so3_colour("[]", 3)
    (3, 3, 1)
    """
    labels = _SO3.highest_weight(rep)
    a = labels[0] + 1
    K = level + 2
    if a > K - 2:
        raise NotIntegrableError(
            f"SO(3) representation {rep!r} (spin {labels[0] // 2}, dimension {a}) is not integrable at level {level}:"
            f" spins up to {(K - 3) // 2} are allowed (dimension <= {K - 2})")
    return a


class _Data:
    def __init__(self, level: int, ctx):
        K = level + 2
        self.K = K
        self.ctx = ctx
        self.colours = list(range(1, K - 1, 2))
        n = len(self.colours)
        pi = ctx.pi
        self.S = [[2 / ctx.sqrt(K) * ctx.sin(pi * a * b / K) for b in self.colours] for a in self.colours]
        self.theta = [ctx.expjpi(ctx.mpf(a * a - 1) / (2 * K)) for a in self.colours]
        d = [self.S[0][i] / self.S[0][0] for i in range(n)]
        D = 1 / self.S[0][0]
        p_plus = ctx.fsum(self.theta[i] * d[i] ** 2 for i in range(n))
        self.phase = p_plus / D            # exp(2 pi i c'/8)
        self.index = {a: i for i, a in enumerate(self.colours)}
        self.one = ctx.mpc(1)
        self.fsum = ctx.fsum


class _ExactData:
    """The same data as exact cyclotomic numbers in one field ``Q(zeta_L)``."""

    def __init__(self, level: int):
        from knotobs.polynomials.cyclotomic import CyclotomicField, root_of_unity, sqrt_rational

        K = level + 2
        self.K = K
        self.colours = list(range(1, K - 1, 2))
        n = len(self.colours)
        rK = sqrt_rational(Fraction(1, K))
        L = 1
        for x in (rK.conductor, 4, 2 * K, 4 * K):
            L = L * x // __import__("math").gcd(L, x)
        F = CyclotomicField(L)
        self.field = F
        z = lambda x: root_of_unity(Fraction(x)).to_field(L)           # noqa: E731
        rK = rK.to_field(L)
        minus_i = z(Fraction(-1, 4))
        self.S = [[rK * minus_i * (z(Fraction(a * b, 2 * K)) - z(Fraction(-a * b, 2 * K))) for b in self.colours]
                  for a in self.colours]
        self.theta = [z(Fraction(a * a - 1, 4 * K)) for a in self.colours]
        s00 = self.S[0][0]
        p_plus = F.zero
        for i in range(n):
            d = self.S[0][i] / s00
            p_plus = p_plus + self.theta[i] * d * d
        self.phase = p_plus * s00
        self.index = {a: i for i, a in enumerate(self.colours)}
        self.one = F.one
        self.fsum = lambda xs: sum(xs, F.zero)


def _plumbing(space):
    from knotobs.evaluation.surgery import SurgeryPresentation, seifert_data, seifert_to_surgery, signature

    b, fibers = seifert_data(space)
    e0, pq = seifert_to_surgery(b, fibers)
    pres = SurgeryPresentation.from_coefficients(e0, pq)
    return b, fibers, pres, signature(pres.linking_matrix())


def _sum(data: _Data, pres, sigma: int, regular: Sequence[int], exceptional: Mapping[int, int]):
    S, th, n = data.S, data.theta, len(data.colours)
    fsum = data.fsum
    center = [data.one] * n
    degree = 0
    for j, chain in enumerate(pres.chains):
        mu = exceptional.get(j)
        if not chain:
            if mu is not None:
                m = data.index[mu]
                center = [center[l] * S[l][m] / S[0][l] for l in range(n)]
            continue
        degree += 1
        c_last = chain[-1]
        u = [S[0][l] * th[l] ** c_last for l in range(n)]
        if mu is not None:
            m = data.index[mu]
            u = [u[l] * S[l][m] / S[0][l] for l in range(n)]
        for c in reversed(chain[:-1]):
            u = [th[l] ** c * fsum(S[l][v] * u[v] for v in range(n)) for l in range(n)]
        w = [fsum(S[l][v] * u[v] for v in range(n)) for l in range(n)]
        center = [center[l] * w[l] for l in range(n)]
    for mu in regular:
        m = data.index[mu]
        center = [center[l] * S[l][m] / S[0][l] for l in range(n)]
    total = fsum(S[0][l] ** (2 - degree) * th[l] ** pres.e0 * center[l] for l in range(n))
    return data.phase ** (-sigma) * total


def _certified(fn, digits: int):
    lo = fn(local_mp(digits + 12))
    hi = fn(local_mp(digits + 30))
    ctx = local_mp(digits + 30)
    err = abs(ctx.mpc(hi) - ctx.mpc(lo))
    if err > ctx.mpf(10) ** (-digits) * max(1, abs(hi)) / 10:
        raise PrecisionError(f"SO(3) value not certified to {digits} digits (difference {ctx.nstr(err, 3)}); raise --digits")
    return _plain(ctx.mpc(hi))


def _plain(z) -> mpmath.mpc:
    """The same binary value as an ``mpmath.mpc`` of the global context (no rounding)."""
    return mpmath.mp.make_mpc((z.real._mpf_, z.imag._mpf_))


def _estimate(level: int, pres, what: str) -> None:
    n = (level + 1) // 2
    V = 1 + sum(len(c) for c in pres.chains)
    require(f"SO(3) at level {level} on {what}: {n} colours, {V} plumbing vertices",
            seconds=seconds_for(2 * V * n * n * 2, "ball"), accepted="use a smaller level")


#: Estimated seconds above which the exact cyclotomic value is skipped in the automatic mode.
EXACT_AUTO_SECONDS = 5.0


def _exact_seconds(level: int, pres) -> float:
    K = level + 2
    n = (level + 1) // 2
    V = 1 + sum(len(c) for c in pres.chains)
    L = 8 * K                                   # an upper bound for the conductor used
    return V * n * n * L * L / 3e8


def _want_exact(level: int, pres, exact: Optional[bool]) -> bool:
    if exact is False:
        return False
    sec = _exact_seconds(level, pres)
    if exact is None:
        return sec <= EXACT_AUTO_SECONDS
    require(f"exact SO(3) value at level {level}", seconds=sec, accepted="ask for the numeric value only (exact=False)")
    return True


def _agree(exact, numeric, digits: int) -> None:
    """The exact value and the certified numeric value of the same sum must agree (a consistency check)."""
    ctx = local_mp(digits + 10)
    e = exact.to_mpc(digits + 5)
    d = abs(ctx.make_mpc((e.real._mpf_, e.imag._mpf_)) - ctx.make_mpc((numeric.real._mpf_, numeric.imag._mpf_)))
    if d > ctx.mpf(10) ** (2 - digits) * max(1, abs(ctx.make_mpc((numeric.real._mpf_, numeric.imag._mpf_)))):
        raise PrecisionError(f"exact and numeric SO(3) values differ by {ctx.nstr(d, 3)}")  # pragma: no cover


def so3_partition_function(space, level: int, digits: int = 30, exact: Optional[bool] = None) -> FiniteLevelValue:
    """``Z(M)`` of the SO(3) theory (integer-spin part of SU(2)_k, ``k`` odd) on ``M(0; b; (a_i, b_i))``.

    Examples
    --------
    >>> z = so3_partition_function((1, []), 3)             # S^3: S'_11 = 1/sqrt(1 + phi^2) (Fibonacci)
    >>> mpmath.nstr(z.numeric.real, 12), abs(z.numeric.imag) < 1e-30
    ('0.525731112119', True)

    References
    ----------
    Kirby–Melvin (1991) §8; Reshetikhin–Turaev, Invent. Math. 103 (1991); CONVENTIONS §9; docs/groups.md (§14).
    """
    level = check_odd_level(level)
    b, fibers, pres, sigma = _plumbing(space)
    _estimate(level, pres, f"M(0; {b}; {list(fibers)})")
    val = _certified(lambda ctx: _sum(_Data(level, ctx), pres, sigma, (), {}), digits)
    ex = None
    if _want_exact(level, pres, exact):
        ex = _sum(_ExactData(level), pres, sigma, (), {})
        _agree(ex, val, digits)
    return FiniteLevelValue(
        exact=ex, numeric=val, digits=digits, framing="canonical 2-framing (Atiyah)",
        orientation=_orient(b, fibers),
        normalisation="Z(S^3) = S'_11 = sqrt(2) S_11, Z(S^2 x S^1) = 1",
        details={"route": "SO(3) plumbing sum over odd colours (exact cyclotomic and numeric, certified at two precisions)"
                 if ex is not None else "SO(3) plumbing sum over odd colours (numeric, certified at two precisions)",
                 "group": "SO(3)", "level": level, "seifert": (b, fibers)},
    )


def _orient(b, fibers) -> str:
    e = -(Fraction(b) + sum(Fraction(bb, a) for a, bb in fibers))
    fs = ", ".join(f"({a},{bb})" for a, bb in fibers)
    return f"M(0; {b}; {fs}) with e = -(b + sum b_i/a_i) = {e} (Neumann-Raymond)"


def so3_fiber_wilson_loop(space, level: int, regular: Sequence = (), exceptional: Optional[Mapping[int, object]] = None,
                          normalized: bool = True, digits: int = 30, exact: Optional[bool] = None) -> FiniteLevelValue:
    """SO(3) Wilson loops along regular fibers and cores of exceptional fibers (index from 0).

    The framing is that of the surgery diagram: the fiber framing for a regular fiber.

    Examples
    --------
    >>> v = so3_fiber_wilson_loop((1, []), 5, regular=["[1]"])   # S^3 = -1 surgery: an unknot of framing +1
    >>> mpmath.nstr(abs(v.numeric), 12)                             # |theta_3 [3]| = sin(3 pi/7)/sin(pi/7)
    '2.24697960372'
    """
    level = check_odd_level(level)
    b, fibers, pres, sigma = _plumbing(space)
    reg = [so3_colour(r, level) for r in regular]
    exc = {}
    for j, r in (exceptional or {}).items():
        if not isinstance(j, int) or not 0 <= j < len(fibers):
            raise InvalidKnotError(f"fiber index {j!r} is not one of the {len(fibers)} exceptional fibers (0..{len(fibers) - 1})")
        exc[j] = so3_colour(r, level)
    _estimate(level, pres, f"M(0; {b}; {list(fibers)})")

    def fn(ctx):
        data = _Data(level, ctx)
        z = _sum(data, pres, sigma, reg, exc)
        if normalized:
            z0 = _sum(data, pres, sigma, (), {})
            if abs(z0) < ctx.mpf(10) ** (-(ctx.dps // 2)):
                raise KnotobsError(f"Z(M) = 0 for SO(3) at level {level}: ask for the raw value (--raw)")
            z = z / z0
        return z

    val = _certified(fn, digits)
    ex = None
    if _want_exact(level, pres, exact):
        data = _ExactData(level)
        ex = _sum(data, pres, sigma, reg, exc)
        if normalized:
            ex = ex / _sum(data, pres, sigma, (), {})
        _agree(ex, val, digits)
    return FiniteLevelValue(
        exact=ex, numeric=val, digits=digits,
        framing="framing of the surgery diagram (the fiber framing for a regular fiber)",
        orientation=_orient(b, fibers),
        normalisation="Z(M; L)/Z(M)" if normalized else "Z(M; L), Z(S^3) = S'_11",
        details={"route": "SO(3) plumbing sum over odd colours (exact cyclotomic and numeric, certified at two precisions)"
                 if ex is not None else "SO(3) plumbing sum over odd colours (numeric, certified at two precisions)",
                 "group": "SO(3)", "level": level, "regular": reg, "exceptional": exc},
    )


def so3_level_loop(knot: Optional[str], level: int, rep="[1]", space: str = "S^3", fiber: Optional[int] = None,
                   framing=None, normalized: bool = True, digits: int = 30) -> FiniteLevelValue:
    """SO(3) Wilson loop of a torus knot in S^3 (a regular fiber), a regular fiber of a Seifert
    manifold (``knot="fiber"``) or the core of exceptional fiber ``fiber`` (``knot=None``).

    In S^3 the default is the zero framing (the fiber framing ``P Q`` removed by ``theta_a^(-P Q)``) and
    the value is checked against the Rosso–Jones polynomial of SO(3) at ``q = exp(2 pi i/K)``.

    >>> v = so3_level_loop("T(2,3)", 5, "[1]")
    >>> v.details["polynomial_check"] < 1e-25
    True
    """
    from knotobs.fibrations.refibration import fibration_of
    from knotobs.fibrations.torus import parse_knot

    level = check_odd_level(level)
    if framing not in (None, "zero", "fiber", 0, "0"):
        raise KnotobsError(f"SO(3) at level k takes framing zero or fiber; got {framing!r}")
    if knot is None:
        if fiber is None:
            raise InvalidKnotError("give a knot T(p,q), 'fiber', or a fiber index (--fiber) of the space")
        from knotobs.fibrations.seifert import parse_space

        M = parse_space(space)
        return so3_fiber_wilson_loop(M, level, exceptional={fiber: rep}, normalized=normalized, digits=digits)
    if str(knot).strip().lower() in ("fiber", "fibre"):
        F = fibration_of("fiber", space)
        return so3_fiber_wilson_loop(F.manifold, level, regular=[rep], normalized=normalized, digits=digits)
    k = parse_knot(knot)
    if not k.is_knot:
        raise InvalidKnotError(f"{k} is a link: SO(3) at level k is computed for torus knots (one regular fiber)")
    if space.replace(" ", "").upper() not in ("S^3", "S3"):
        raise KnotobsError("SO(3) torus knots at level k are computed in S^3; for other spaces use 'fiber' or --fiber")
    F = fibration_of(k, space)
    a = so3_colour(rep, level)
    v = so3_fiber_wilson_loop(F.manifold, level, regular=[rep], normalized=normalized, digits=digits)
    K = level + 2
    C = Fraction(a * a - 1, 4)
    mode = "fiber" if framing == "fiber" else "zero"
    num = v.numeric
    ex = v.exact
    pq = k.P * k.Q * k.chirality
    if mode == "zero" and ex is not None:
        from knotobs.polynomials.cyclotomic import root_of_unity

        ex = ex * root_of_unity(-pq * C / K)
    if mode == "zero":
        ctx = local_mp(digits + 10)
        num = _plain(ctx.make_mpc((num.real._mpf_, num.imag._mpf_))
                     * ctx.expjpi(-2 * ctx.mpf(pq) * C.numerator / (C.denominator * K)))
    details = dict(v.details)
    if normalized:
        from knotobs.evaluation.cartan_rosso_jones import rosso_jones_cartan

        poly = rosso_jones_cartan(k, _SO3, rep, 0 if mode == "zero" else "fiber")
        check = poly.at_root_of_unity(K, dps=digits + 5)
        ctx = local_mp(digits + 5)
        diff = abs(ctx.make_mpc((check.real._mpf_, check.imag._mpf_)) - ctx.make_mpc((num.real._mpf_, num.imag._mpf_)))
        details["polynomial_check"] = float(diff)
        if diff > ctx.mpf(10) ** (3 - digits) * max(1, abs(num)):
            from knotobs.evaluation.two_routes import RouteMismatchError

            raise RouteMismatchError(f"SO(3) gluing and the Rosso-Jones polynomial disagree for {k} at level {level}")
    if ex is not None:
        _agree(ex, num, digits)
    return FiniteLevelValue(exact=ex, numeric=num, digits=digits,
                            framing="zero (Seifert) framing" if mode == "zero" else f"fiber framing P*Q = {k.P * k.Q}",
                            orientation=f"S^3 (the fibration {F.manifold})", normalisation=v.normalisation,
                            details=details)
