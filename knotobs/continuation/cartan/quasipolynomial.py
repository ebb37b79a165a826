r"""``Z(M)`` of SU(N) on a Seifert manifold with ``e = 0`` as a quasi-polynomial in ``K`` (§18.11).

When the Euler number vanishes (``H = 0``: torus bundles, ``M(1; 0; (2,1), (2,-1))``, ...) the
Gaussian of the Gauss-sum form (docs/continuation_sun.md §18.1) is absent.  What is left at integer
``K`` is a sum of a trigonometric rational function over the points ``lam/K`` of ``Lambda / L K Q``
(``L = lcm p_j``) against a character of ``Lambda / L Q``, one per coset (§18.8).  Summing it by
residues (§18.11 of the docs) shows that

    F(K) = exp(i pi |rho|^2 phi / K) Z_{K - N}(M)

is a *quasi-polynomial*: on each residue class ``K = c mod L`` a polynomial in ``K`` of degree at
most ``d = |Delta+| max(n_> - 2 + 2g, 0) + (N - 1) g``.  Equivalently

    F(K) = sum_{j mod L} exp(2 pi i K j / L) Q_j(K),      Q_j polynomials of degree <= d,

and with ``j / L`` taken in ``(-1/2, 1/2]`` this is the continuation of least exponential type
(Carlson's theorem, as for the reduced phases of §18.2): it is the value at complex ``K``, one
sector ``exp(2 pi i K j/L) Q_j(K)`` per class ``j/L`` of Chern–Simons values.

The polynomials are interpolated through the finite values of the localisation route at the first
``L (d + 1)`` levels (``k >= 1``) and **checked** at two further levels of every class; a mismatch
raises.  The finite values are balls with certified digits, and the interpolation runs in ball
arithmetic, so the radii carry their error to the continued value.

References
----------
E. Witten, Commun. Math. Phys. 121 (1989) 351–399 (``Z`` of a mapping torus is the trace of the
mapping class on the conformal blocks); L. Jeffrey, Commun. Math. Phys. 147 (1992) 563–604
(torus bundles); R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (the
Gauss-sum form and its residues in rank one).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from fractions import Fraction
from functools import lru_cache

import mpmath
from flint import acb, arb

from knotobs.continuation.cartan.newton import divided_differences, newton_to_monomial, newton_value
from knotobs.errors import KnotobsError, PrecisionError
from knotobs.numerics import working_precision

__all__ = ["has_zero_euler", "FINITE_ROUTES", "WideBallError", "QuasiPolynomialData", "quasi_polynomial_data",
           "quasi_polynomial_levels", "quasi_polynomial_coefficients",
           "quasi_polynomial_sectors", "quasi_polynomial_seconds"]


def has_zero_euler(M) -> bool:
    """``e(M) = 0``: ``b + sum b_j/a_j = 0`` (``H = 0``, infinite ``H_1``).

    >>> from knotobs.fibrations.seifert import parse_space
    >>> has_zero_euler(parse_space("M(0; -1; (2,1), (4,1), (4,1))")), has_zero_euler(parse_space("Sigma(2,3,5)"))
    (True, False)
    """
    return Fraction(M.b) + sum((Fraction(b, a) for a, b in M.fibers), Fraction(0)) == 0


@dataclass(frozen=True)
class QuasiPolynomialData:
    """The shape of ``F(K)`` for ``SU(N)`` on ``M`` (``e = 0``).

    Attributes
    ----------
    space : str
    N : int
    period : int
        ``L = lcm`` of the exceptional orders (1 without them).
    degree : int
        The bound ``d = |Delta+| max(n_> - 2 + 2g, 0) + (N - 1) g`` on the degree of every
        ``Q_j`` (docs §18.11).
    phi : Fraction
        ``sum_j (12 s(q_j, p_j) - q_j/p_j)`` over the fibers and ``(1, b)``: the framing phase
        ``exp(-i pi |rho|^2 phi/K)`` of §18.1 with ``sign H = 0``.
    rho2 : Fraction
        ``|rho|^2 = N (N^2 - 1)/12``.

    Examples
    --------
    >>> q = quasi_polynomial_data("M(0; -1; (2,1), (4,1), (4,1))", 2)
    >>> q.period, q.degree, q.phi
    (4, 1, Fraction(3, 1))
    """

    space: str
    N: int
    period: int
    degree: int
    phi: Fraction
    rho2: Fraction

    @property
    def levels(self) -> list[int]:
        """Levels ``k`` whose values are interpolated or checked (``L (d + 3)`` of them)."""
        return list(range(1, self.period * (self.degree + 3) + 1))


def quasi_polynomial_data(space, N: int) -> QuasiPolynomialData:
    """Period, degree bound and framing phase of ``F(K)`` (see :class:`QuasiPolynomialData`)."""
    from knotobs.evaluation.gauss_sum import lr_data
    from knotobs.fibrations.seifert import SeifertManifold, parse_space

    M = space if isinstance(space, SeifertManifold) else parse_space(space)
    if not has_zero_euler(M):
        raise KnotobsError(f"{M} has e != 0: it is continued by the Gauss-sum form (docs §18.2-18.9)")
    raw = list(M.fibers) + ([(1, M.b)] if M.b else [])
    phi = lr_data(raw, coprime=False)[3] if raw else Fraction(0)
    big = [a for a, _ in M.fibers if a > 1]
    L = math.lcm(*big) if big else 1
    npos = N * (N - 1) // 2
    d = npos * max(len(big) - 2 + 2 * M.genus, 0) + (N - 1) * M.genus
    return QuasiPolynomialData(str(M), N, L, d, phi, Fraction(N * (N * N - 1), 12))


#: The finite routes the values can be interpolated from.
FINITE_ROUTES = ("localisation", "surgery")


def quasi_polynomial_seconds(q: QuasiPolynomialData, route: str = "localisation") -> tuple[float, str]:
    """Estimated seconds of the finite values (computed once per space and precision) and a description of the work."""
    from knotobs.fibrations.seifert import parse_space
    from knotobs.paired_runs import second_core

    if route not in FINITE_ROUTES:
        raise KnotobsError(f"route {route!r}: the finite values come from one of {', '.join(FINITE_ROUTES)}")
    M = parse_space(q.space)
    if route == "surgery":
        from knotobs.evaluation.seifert_routes import _surgery_estimate

        ests = [_surgery_estimate(M, q.N, k) for k in q.levels]
        bad = next((e for e in ests if not e.applicable), None)
        if bad is not None:
            raise KnotobsError(f"the surgery route does not apply to {q.space}: {bad.reason}")
        sec = sum(e.seconds for e in ests)
    else:
        from knotobs.localisation.values import _sum, localisation_seconds

        sec = sum(localisation_seconds(_sum(M, q.N, k))[0] for k in q.levels)
    if sec > 0.5 and second_core():
        sec *= 0.65         # half the levels on each core, each about 30% slower beside the other
    return sec + 0.05, (f"{len(q.levels)} finite levels k = 1..{q.levels[-1]} of SU({q.N}) on {q.space}"
                            f" by the {route} route (period {q.period} in K, degree <= {q.degree})")


@lru_cache(maxsize=32)
def quasi_polynomial_levels(space: str, N: int, digits: int,
                            route: str = "localisation") -> tuple[tuple[int, str, str], ...]:
    """``(K, Re F, Im F)`` at every level of :attr:`QuasiPolynomialData.levels`, ``digits`` certified
    digits, from the finite ``route`` (``localisation`` or ``surgery``; strings, so the cache
    holds no precision-dependent objects)."""
    from knotobs.evaluation.seifert_routes import partition_function
    from knotobs.paired_runs import run_both

    q = quasi_polynomial_data(space, N)

    def part(i: int) -> list:
        out = []
        for k in q.levels[i::2]:
            K = k + N
            z = partition_function(space, f"SU({N})", k, digits=digits, exact=False, route=route).numeric
            with working_precision(digits + 10):
                ph = (q.rho2 * q.phi).numerator / mpmath.mpf((q.rho2 * q.phi).denominator)
                f = mpmath.mpc(z) * mpmath.expj(mpmath.pi * ph / K)
                out.append((K, mpmath.nstr(f.real, digits + 8), mpmath.nstr(f.imag, digits + 8)))
        return out

    # every other level on a second core when there is one (the cost grows with the level, so
    # alternate levels balance the halves); the values are the same either way
    big = quasi_polynomial_seconds(q, route)[0] > 0.35
    a, b = run_both(part, 0, 1, parallel=None if big else False)
    return tuple(sorted(a + b))


def _class_tables(q: QuasiPolynomialData, digits: int, route: str = "localisation"):
    """Per residue class ``c`` of ``K`` mod ``L``: the nodes and Newton divided differences of the
    polynomial through its first ``d + 1`` values; the remaining two values of the class are
    checked against it.  Runs at the current precision."""
    table = quasi_polynomial_levels(q.space, q.N, digits, route)
    L, d = q.period, q.degree
    err = arb(10) ** (-digits)
    classes = []
    for c in range(L):
        pts = []
        for K, re_, im_ in table[c::L]:
            rad = err * max(1, abs(float(re_)) + abs(float(im_)))
            pts.append((K, acb(arb(re_, rad), arb(im_, rad))))
        xs = [K for K, _ in pts[: d + 1]]
        dd = divided_differences(xs, [v for _, v in pts[: d + 1]])
        for K, v in pts[d + 1:]:
            diff = newton_value(xs, dd, acb(K)) - v
            if not diff.contains(0):
                raise KnotobsError(
                    f"SU({q.N}) on {q.space}: exp(i pi |rho|^2 phi/K) Z is not a polynomial of degree <= {d}"
                    f" on the class K = {xs[0] % L} mod {L} (it misses the value at K = {K} by"
                    f" {mpmath.nstr(float(abs(diff).mid()), 3)}); docs/continuation_sun.md §18.11")
        classes.append((xs, dd))
    return classes


def quasi_polynomial_sectors(q: QuasiPolynomialData, K: acb, digits: int,
                             route: str = "localisation") -> dict[Fraction, acb]:
    """``{j/L mod 1: exp(-i pi |rho|^2 phi/K) exp(2 pi i K j'/L) Q_j(K)}`` (``j'`` the representative
    of ``j`` in ``(-L/2, L/2]``) from finite values with ``digits`` certified digits, at the current
    precision.  Sectors with ``Q_j = 0`` (zero at ``d + 1`` points, to the radius of the balls) are
    left out.
    """
    classes = _class_tables(q, digits, route)
    L, d = q.period, q.degree
    zeta = [acb.exp_pi_i(acb(2 * j) / L) for j in range(L)]
    # Q_j(K) = (1/L) sum_c zeta^(-j c) P_c(K), c the residue of K mod L on which P_c holds
    cls = [xs[0] % L for xs, _ in classes]

    def Q(j, x):
        s = acb(0)
        for (xs, dd), c in zip(classes, cls):
            s += zeta[(-j * c) % L] * newton_value(xs, dd, x)
        return s / L

    probes = [acb(q.N + 1 + t) for t in range(d + 1)]
    ph = acb.exp_pi_i(-acb((q.rho2 * q.phi).numerator) / (q.rho2 * q.phi).denominator / K)
    out = {}
    for j in range(L):
        if all(Q(j, x).contains(0) for x in probes):
            continue
        if 2 * j == L:
            # exp(i pi K) and exp(-i pi K) agree at the integers: cos(pi K), the choice that keeps
            # Z_{-M}(K) = conj Z_M(conj K) (docs 18.11)
            e = acb.cos_pi(K)
        else:
            jr = j if 2 * j < L else j - L
            e = acb.exp_pi_i(2 * jr * K / L)
        out[Fraction(j, L)] = ph * e * Q(j, K)
    return out


def quasi_polynomial_coefficients(q: QuasiPolynomialData, digits: int,
                                  route: str = "localisation") -> dict[Fraction, list[acb]]:
    """``{j/L mod 1: [c_0, c_1, ...]}`` with ``Q_j(K) = sum_i c_i K^i`` (balls at the current
    precision; trailing coefficients that are balls containing 0 dropped, classes with ``Q_j = 0``
    left out), from finite values with ``digits`` certified digits.

    >>> from knotobs.numerics import working_precision
    >>> q = quasi_polynomial_data("M(0; -2; (2,1), (2,1), (2,1), (2,1))", 2)    # Q_0 = K - 1
    >>> with working_precision(30):
    ...     c = quasi_polynomial_coefficients(q, 30)
    >>> sorted(c), [round(float(x.real.mid())) for x in c[Fraction(0)]]
    ([Fraction(0, 1)], [-1, 1])
    """
    classes = _class_tables(q, digits, route)
    L = q.period
    zeta = [acb.exp_pi_i(acb(2 * j) / L) for j in range(L)]
    mono = [(xs[0] % L, newton_to_monomial(xs, dd, acb(0))) for xs, dd in classes]
    out = {}
    for j in range(L):
        cs = [sum((zeta[(-j * c) % L] * m[i] for c, m in mono), acb(0)) / L for i in range(q.degree + 1)]
        while cs and cs[-1].contains(0):
            cs.pop()
        if cs:
            out[Fraction(j, L)] = cs
    return out


def guard_digits(q: QuasiPolynomialData, Kv, sectors: bool = True) -> int:
    """Digits the interpolation (and with ``sectors`` the sum of the sectors) can lose at ``K``:
    extrapolation of degree ``d`` from nodes spaced ``L`` apart, and sectors of size up to
    ``exp(pi |Im K|)``."""
    top = q.N + q.levels[-1]
    far = (abs(complex(Kv)) + top) / q.period + 2
    size = math.pi * abs(float(mpmath.im(Kv))) / math.log(10) if sectors else 0.0
    return int(math.ceil(q.degree * math.log10(2 * far) + size)) + 5


class WideBallError(PrecisionError):
    """The interpolated ball is wider than the digits asked for; ``missing`` digits short."""

    def __init__(self, message: str, missing: int):
        super().__init__(message)
        self.missing = missing


def check_radius(z: acb, digits: int, what: str) -> None:
    """Raise :class:`WideBallError` when the ball ``z`` is wider than ``10^-digits max(1, |z|)``."""
    mag = abs(z).mid()
    scale = arb(1) if mag < 1 else mag
    if z.rad() > arb(10) ** (-digits) * scale:
        ratio = z.rad() / (arb(10) ** (-digits) * scale)
        missing = int(math.ceil(float(ratio.log() / arb(10).log()))) + 1
        raise WideBallError(f"{what}: the interpolated value is certified only to radius"
                            f" {z.rad().str(3, radius=False)}", missing)
