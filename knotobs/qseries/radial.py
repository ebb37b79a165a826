r"""Radial limits of ``Zhat_b(q)`` at roots of unity and the finite-level SU(2) invariant.

Radial limit
------------
For a plumbing with at most one vertex of degree ``d >= 3`` (lens spaces: chains; Seifert
manifolds: stars), :mod:`knotobs.qseries.series` writes ``Zhat_b`` as a finite sum plus pieces

    ``q^C sum_{N >= 1, N = N_0 mod kappa} R(N) q^(N^2/(4 a D))``

with ``R`` a polynomial (degree ``d - 3``), one Gaussian scale ``4aD`` and one constant ``C``
common to all pieces (checked).  With ``q = xi e^(-tau)``, ``xi = exp(2 pi i/K)`` and
``psi(N) = [N = N_0 mod kappa] xi^(N^2/(4aD))`` (periodic, period ``p``) the Mellin transform gives

    ``sum_N psi(N) N^j e^(-tau N^2/(4aD)) = (mean psi) Gamma((j+1)/2)/2 (4aD/tau)^((j+1)/2) + L(-j, psi) + O(tau)``,
    ``L(-j, psi) = -(p^j/(j+1)) sum_{r=1}^{p} psi(r) B_{j+1}(r/p)``

(B = Bernoulli polynomials; R. Lawrence and D. Zagier, Asian J. Math. 3 (1999) 93–107, §1, for
``j = 0``; the same Mellin argument for every ``j``).  The singular parts of all pieces must
cancel (they are checked to cancel to the working precision), and the radial limit is
``xi^C`` times the sum of the ``L``-values and the finite terms.  Every ingredient is an exact
rational multiple of a root of unity (Bernoulli polynomials at rational points), so the limit
is assembled exactly as a rational combination of roots of unity and only evaluated at the end,
at two precisions that must agree.

Finite level
------------
Expanding the surgery formula of CONVENTIONS §9 for the plumbing, extending every colour sum to
``Z/2K``, and applying Gauss reciprocity for the form ``B`` (L. Jeffrey, Commun. Math. Phys. 147
(1992); F. Deloup and V. Turaev, J. Pure Appl. Algebra 208 (2007)) gives, in knotobs's normalisation
(``Z(S^3) = S_00``, canonical 2-framing)

    ``Z_K(M) = 1/(2 i sqrt(2K) sqrt|det B|) sum_{a in Z^s/B Z^s} e^(-2 pi i K (a, B^-1 a))
              sum_{beta in (delta + 2Z^s)/2BZ^s} e^(-2 pi i (a, B^-1 beta)) lim_{q -> xi} Zhat_beta(q)``

(the sum over ``beta`` runs over the classes, each of ``b`` and ``-b`` once).  That the formal
expansion of the vertex factors may be used at the root of unity is the theorem of Y. Murakami,
arXiv:2302.13526 (the conjecture of Gukov–Pei–Putrov–Vafa); the phases and the constant were
derived here and are tested against the independent surgery route for many ``K``.

Divergent blocks: when a vertex has degree ``>= 4`` the coefficients grow polynomially and a
single ``Zhat_b`` may diverge like ``tau^-1`` at ``q = xi e^-tau`` (seen for repeated orders, e.g.
``M(0; -1; (2,1),(2,1),(2,1),(2,1))``).  :func:`radial_limit` then refuses; the combination above
uses the regularised finite part of each block (including the ``tau^0`` part of ``e^(-tau C)``
times its singular terms) and checks that the singular parts cancel in the total, which they do
in every case tested.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from fractions import Fraction

from knotobs.errors import KnotobsError, PrecisionError, SizeLimitError
from knotobs.guard import require, seconds_for
from knotobs.numerics import local_mp
from knotobs.qseries.series import PlumbingLattice, _vertex_int
from knotobs.qseries.plumbing import plumbing_of

__all__ = ["radial_limit", "radial_limits", "finite_level_from_qseries", "finite_level_exact",
           "RadialReport", "radial_report"]


def _poly_in_N(d: int, a: int, shift: int) -> list[Fraction]:
    """Coefficients (in ``N``) of ``binom((y + d - 4)/2, d - 3)`` with ``y = (N + shift)/(2a)``.

    ``y = |x| >= 1`` is the value at the vertex of degree ``d`` and ``N`` the Gaussian variable
    on that side of ``x = 0``.
    """
    # P(y) = prod_{k=0}^{d-4} ((y + d - 4)/2 - k) / (d-3)!
    poly = [Fraction(1)]
    for k in range(d - 3):
        # factor: (y + d - 4 - 2k)/2 with y = (N + shift)/(2a)
        c0 = Fraction(shift, 2 * a) + (d - 4 - 2 * k)
        c1 = Fraction(1, 2 * a)
        new = [Fraction(0)] * (len(poly) + 1)
        for i, p in enumerate(poly):
            new[i] += p * c0 / 2
            new[i + 1] += p * c1 / 2
        poly = new
    f = math.factorial(d - 3) if d >= 3 else 1
    return [p / f for p in poly]


_BERN: dict[int, list[Fraction]] = {}


def _bernoulli_poly(n: int) -> list[Fraction]:
    """Coefficients of the Bernoulli polynomial ``B_n(x)`` (lowest degree first), exact."""
    if n not in _BERN:
        B = [Fraction(1)]
        for m in range(1, n + 1):
            B.append(-sum(math.comb(m + 1, k) * B[k] for k in range(m)) / (m + 1))
        _BERN[n] = [math.comb(n, k) * B[n - k] for k in range(n + 1)]   # coefficient of x^k
    return _BERN[n]


def _add(dct: dict, key: Fraction, val: Fraction) -> None:
    key = key - math.floor(key)
    dct[key] = dct.get(key, 0) + val


class _Limit:
    """Exact data of one radial limit: ``sum coef e^(2 pi i key)`` (regularised finite part) and,
    per singular order ``tau^(-m/2)``, a rational combination of phases (times a common non-zero
    constant ``Gamma((m+1)/2) scale^((m+1)/2)/2``)."""

    def __init__(self, finite: dict, orders: dict):
        self.finite = {k: v for k, v in finite.items() if v}
        self.orders = {m: {k: v for k, v in d.items() if v} for m, d in orders.items()}
        self.orders = {m: d for m, d in self.orders.items() if d}

    @staticmethod
    def value(ctx, dct: dict, cache: dict):
        tot = ctx.mpc(0)
        for k, c in dct.items():
            ph = cache.get(k)
            if ph is None:
                ph = cache[k] = ctx.expjpi(2 * ctx.mpf(k.numerator) / k.denominator)
            tot += ph * (ctx.mpf(c.numerator) / c.denominator)
        return tot


def _limit(lat: PlumbingLattice, b, K: int) -> _Limit:
    key = lambda e: Fraction(e) / K  # noqa: E731  xi^e = exp(2 pi i key)
    finite: dict = {}
    if not lat.high:
        for nm, c in lat.terms(b, 10**30):
            _add(finite, key(lat.base_exponent + Fraction(nm, lat.D)), Fraction(c))
        return _Limit(finite, {})
    if len(lat.high) > 1:
        raise KnotobsError(
            f"{lat.graph}: radial limits are implemented for plumbings with at most one vertex of"
            f" degree >= 3 (this one has {len(lat.high)}); the q-series itself is available")
    from knotobs.qseries.series import _solve_congruence

    v0 = lat.high[0]
    d = lat.deg[v0]
    adj, s, sgn, M = lat.adj, lat.s, lat.sgn, lat.M
    a = -sgn * adj[v0][v0]
    scale = 4 * a * lat.D
    col = [adj[i][v0] for i in range(s)]
    adj_b = [sum(adj[i][j] * b[j] for j in range(s)) for i in range(s)]
    const = None
    mean: dict[int, dict] = {}
    for fixed, cfix in lat._fixed_choices():
        y0 = [sum(adj[i][u] * x for u, x in fixed.items()) - adj_b[i] for i in range(s)]
        ap = _solve_congruence(col, y0, M)
        if ap is None:
            continue
        r, m = ap
        bb = 2 * sum(-sgn * adj[v0][u] * x for u, x in fixed.items())
        C = Fraction(4 * a * lat.num(fixed) - bb * bb, scale)
        if const is None:
            const = C
        elif C != const:  # pragma: no cover - a star plumbing has one constant
            raise KnotobsError("internal: pieces of the radial limit have different constants")
        for side in (1, -1):
            # x = side * y, y >= 1; N = side * (2 a x + bb) = 2 a y + side * bb
            sx = 1 if side < 0 else (-1) ** d          # s_d(x)
            coef = Fraction(cfix * sx, 2)
            poly = [coef * c for c in _poly_in_N(d, a, -side * bb)]
            rp = (side * r) % m
            y1 = rp if rp >= 1 else rp + m
            kappa = 2 * a * m
            N0 = 2 * a * y1 + side * bb
            # psi(N) = [N = N0 mod kappa] xi^(N^2/scale), period p = kappa T in N
            u = Fraction(kappa * kappa, scale)
            v = Fraction(2 * N0 * kappa, scale)
            T = 2 * K * math.lcm(u.denominator, v.denominator)
            p = kappa * T
            n_start = N0 % kappa or kappa
            res = [n_start + kappa * t for t in range(T)]            # the r in 1..p with psi(r) != 0
            keys = [key(Fraction(rr * rr, scale)) for rr in res]
            for j, rho in enumerate(poly):
                if not rho:
                    continue
                bern = _bernoulli_poly(j + 1)
                f = -rho * Fraction(p) ** j / (j + 1)
                for rr, kk in zip(res, keys):
                    x = Fraction(rr, p)
                    _add(finite, kk, f * sum(c * x ** i for i, c in enumerate(bern)))
                    _add(mean.setdefault(j, {}), kk, rho / p)
            # finite corrections: the sum runs over N >= N0, the L-value over N >= 1 (same class)
            Nn, stop, sign, step = (N0, 0, 1, kappa) if N0 <= 0 else (N0 - kappa, 1, -1, -kappa)
            while (Nn <= stop) if N0 <= 0 else (Nn >= stop):
                val = sum(c * Fraction(Nn) ** i for i, c in enumerate(poly))
                _add(finite, key(Fraction(Nn * Nn, scale)), sign * val)
                Nn += step
    if const is None:
        return _Limit({}, {})
    E = lat.base_exponent + const
    # singular part: sum_j S_j tau^(-(j+1)/2), S_j = mean_j Gamma((j+1)/2)/2 scale^((j+1)/2), all
    # times q^E = xi^E e^(-tau E).  The tau^0 part of e^(-tau E) S_j tau^(-(j+1)/2) is
    # S_j (-E)^k/k! for (j+1)/2 = k an integer; the rest are the singular orders m = j + 1 - 2k.
    orders: dict[int, dict] = {}
    for j, mj in mean.items():
        for kk in range(0, (j + 1) // 2 + 1):
            mo = j + 1 - 2 * kk
            # Gamma((j+1)/2) scale^((j+1)/2) = Gamma((mo+1)/2) scale^((mo+1)/2) * g, g rational
            if mo == 0:       # Gamma(kk) scale^kk (-E)^kk / kk! / 2, exact
                fac = Fraction(scale) ** kk * (-E) ** kk / (2 * kk)
                target = finite
            else:
                g = Fraction(scale) ** kk
                for i in range(kk):
                    g *= Fraction(mo + 1, 2) + i
                fac = g * (-E) ** kk / math.factorial(kk) / 2
                target = orders.setdefault(mo, {})
            for k0, c in mj.items():
                _add(target, k0, fac * c)
    shift = key(E)
    finite = {(k + shift) - math.floor(k + shift): c for k, c in finite.items()}
    orders = {mo: {(k + shift) - math.floor(k + shift): c for k, c in dd.items()} for mo, dd in orders.items()}
    return _Limit(finite, orders)


def _checked(f, digits: int):
    x = f(digits + 12)
    y = f(digits + 24)
    ctx = local_mp(digits + 24)
    if abs(x - y) > ctx.mpf(10) ** (-digits) * max(1, abs(y)):
        raise PrecisionError(f"radial limit not stable to {digits} digits")
    return local_mp(digits).mpc(y)


def _check_K(K) -> int:
    if isinstance(K, bool) or not isinstance(K, int) or K < 2:
        raise SizeLimitError(f"K = {K!r} must be an integer >= 2 (K = k + 2)")
    return K


def radial_limit(space, label, K: int, digits: int = 30):
    """``lim Zhat_b(q)`` as ``q -> exp(2 pi i/K)`` radially (module docstring), checked at two precisions.

    Examples
    --------
    >>> from knotobs.continuation.qseries import brieskorn_radial_limit
    >>> z = radial_limit("Sigma(2,3,5)", 0, 7, 25)
    >>> xi = local_mp(30).expjpi(local_mp(30).mpf(2) / 7)
    >>> abs(z - xi ** local_mp(30).mpf(-1.5) * (2 - brieskorn_radial_limit((2,3,5), 7, 25))) < 1e-12
    True

    References
    ----------
    R. Lawrence and D. Zagier, Asian J. Math. 3 (1999) 93–107; Y. Murakami, arXiv:2302.13526.
    """
    K = _check_K(K)
    g, _ = plumbing_of(space)
    lat = PlumbingLattice(g)
    lab = lat.labels.find(label)
    _guard(lat, K)
    lim = _limit(lat, lab.vector, K)
    _convergent(lim, lab)
    return _checked(lambda dps: _Limit.value(local_mp(dps), lim.finite, {}), digits)


def _convergent(lim: "_Limit", lab) -> None:
    ctx = local_mp(40)
    for m, dct in sorted(lim.orders.items(), reverse=True):
        size = sum(abs(c) for c in dct.values())
        if abs(_Limit.value(ctx, dct, {})) > ctx.mpf(10) ** -30 * max(1, size):
            raise KnotobsError(
                f"the radial limit of Zhat_b for label {lab} diverges like tau^(-{m}/2) as q -> xi e^-tau"
                " (an Eichler integral of a theta function with non-zero mean); only the combination"
                " over all labels that gives the finite-level value has a limit")


def radial_limits(space, K: int, digits: int = 30) -> dict:
    """``{label: radial limit}`` for every label."""
    K = _check_K(K)
    g, _ = plumbing_of(space)
    lat = PlumbingLattice(g)
    _guard(lat, K)
    out = {}
    for lab in lat.labels.labels:
        lim = _limit(lat, lab.vector, K)
        _convergent(lim, lab)
        out[lab] = _checked(lambda dps, lim=lim: _Limit.value(local_mp(dps), lim.finite, {}), digits)
    return out


def _guard(lat: PlumbingLattice, K: int) -> None:
    if len(lat.high) > 1:
        raise KnotobsError(
            f"{lat.graph}: radial limits are implemented for plumbings with at most one vertex of"
            f" degree >= 3 (this one has {len(lat.high)}); the q-series itself is available")
    n = abs(lat.det)
    ops = n * (2 ** len(lat.leaves)) * 8 * K * max(1, len(lat.high)) * 20 + n * n * lat.s
    require(f"radial limits at K = {K} ({n} labels)", seconds=seconds_for(ops, "ball"),
            accepted="use a smaller K or a manifold with smaller |H_1|")


def finite_level_from_qseries(space, K: int, digits: int = 30):
    """``Z_K(M)`` (SU(2), ``K = k + 2``) from the radial limits of all ``Zhat_b`` (module docstring).

    Examples
    --------
    >>> from knotobs.evaluation.surgery import partition_function
    >>> from knotobs.fibrations.seifert import parse_space
    >>> z = finite_level_from_qseries("L(5,2)", 7, 20)
    >>> abs(z - partition_function(parse_space("L(5,2)"), "SU(2)", level=5, digits=20).numeric) < 1e-18
    True

    References
    ----------
    Gukov, Pei, Putrov & Vafa (2020), §3; Y. Murakami, arXiv:2302.13526; CONVENTIONS §9, §13.
    """
    K = _check_K(K)
    g, _ = plumbing_of(space)
    lat = PlumbingLattice(g)
    _guard(lat, K)

    lims = []
    for lab in lat.labels.labels:
        lim = _limit(lat, lab.vector, K)
        for beta in lat.labels.class_representatives(lab):
            lims.append((beta, lim))
    det, adj, s = lat.det, lat.adj, lat.s
    hb = lat.labels._hb
    from itertools import product

    ys = list(product(*[range(hb[i][i]) for i in range(s)]))
    adj_beta = [[sum(adj[i][j] * beta[j] for j in range(s)) for i in range(s)] for beta, _ in lims]
    phase_keys = []            # (key of e^(-2 pi i K (y, B^-1 y)), [key of e^(-2 pi i (y, B^-1 beta))])
    for y in ys:
        ay = [sum(adj[i][j] * y[j] for j in range(s)) for i in range(s)]
        yy = sum(y[i] * ay[i] for i in range(s))
        ws = [Fraction(-sum(y[i] * ab[i] for i in range(s)), det) for ab in adj_beta]
        phase_keys.append((Fraction(-K * yy, det), ws))

    def f(dps):
        ctx = local_mp(dps)
        cache: dict = {}

        def ph(k):
            k = k - math.floor(k)
            v = cache.get(k)
            if v is None:
                v = cache[k] = ctx.expjpi(2 * ctx.mpf(k.numerator) / k.denominator)
            return v

        vals = [_Limit.value(ctx, lim.finite, cache) for _, lim in lims]
        ms = sorted({m for _, lim in lims for m in lim.orders})
        sing_vals = {m: [_Limit.value(ctx, lim.orders.get(m, {}), cache) for _, lim in lims] for m in ms}
        sizes = {m: sum(sum(abs(c) for c in lim.orders.get(m, {}).values()) for _, lim in lims) for m in ms}
        total = ctx.mpc(0)
        sing_total = {m: ctx.mpc(0) for m in ms}
        for k0, ws in phase_keys:
            p0 = ph(k0)
            wv = [ph(w) for w in ws]
            total += p0 * ctx.fdot(wv, vals)
            for m in ms:
                sing_total[m] += p0 * ctx.fdot(wv, sing_vals[m])
        for m in ms:
            if abs(sing_total[m]) > ctx.mpf(10) ** (-(dps - 10)) * max(1, sizes[m]) * len(phase_keys):
                raise KnotobsError(  # pragma: no cover - the combination has a limit (Murakami 2023)
                    f"{lat.graph}: at K = {K} the divergences of the Zhat_b do not cancel in the"
                    f" finite-level combination (size {ctx.nstr(abs(sing_total[m]), 5)}); no value is given")
        return total / (2j * ctx.sqrt(2 * K) * ctx.sqrt(abs(det)))

    return _checked(f, digits)


@dataclass(frozen=True)
class RadialReport:
    """Radial limits of the ``Zhat_b`` at ``q -> exp(2 pi i/K)`` and the finite-level value from them.

    Attributes
    ----------
    limits : dict
        ``{Label: value or None}`` (``None``: this block diverges at ``xi``; the combination still
        has a limit).
    from_qseries : mpc
        ``Z_K(M)`` from the radial limits (module docstring).
    surgery : mpc or None
        ``Z_K(M)`` from the independent surgery route (Seifert spaces only).
    """

    space: str
    K: int
    digits: int
    limits: dict
    from_qseries: object
    surgery: object
    normalization: str = "Z(S^3) = S_00, Z(S^2 x S^1) = 1, canonical 2-framing (CONVENTIONS §9)"

    @property
    def agree(self):
        """Whether the two routes agree to ``digits`` (``None`` without a surgery value)."""
        if self.surgery is None:
            return None
        ctx = local_mp(self.digits + 10)
        return bool(abs(ctx.mpc(self.from_qseries) - ctx.mpc(self.surgery)) < ctx.mpf(10) ** (2 - self.digits))

    def to_json(self) -> dict:
        ctx = local_mp(self.digits)

        tiny = ctx.mpf(10) ** (-self.digits - 2)      # absolute accuracy: exact zeros print as 0

        def part(x):
            return "0.0" if abs(x) < tiny else ctx.nstr(x, self.digits)

        def num(z):
            return None if z is None else {"re": part(ctx.mpc(z).real), "im": part(ctx.mpc(z).imag)}

        return {
            "K": self.K, "digits": self.digits,
            "limits": [{"label": str(lab), "label_index": lab.index, "value": num(v), "diverges": v is None}
                       for lab, v in self.limits.items()],
            "finite_level_from_qseries": num(self.from_qseries),
            "finite_level_surgery": num(self.surgery),
            "agree": self.agree,
            "normalization": self.normalization,
        }


def radial_report(space, K: int, digits: int = 30, labels=None) -> RadialReport:
    """Radial limits for ``labels`` (default: all) and ``Z_K`` by both routes.

    Examples
    --------
    >>> r = radial_report("Sigma(2,3,5)", 5, 20)
    >>> r.agree, len(r.limits)
    (True, 1)

    References
    ----------
    Gukov, Pei, Putrov & Vafa (2020); Y. Murakami, arXiv:2302.13526; CONVENTIONS §9, §13.
    """
    from knotobs.qseries.plumbing import is_plumbing_text, PlumbingGraph

    K = _check_K(K)
    if isinstance(digits, bool) or not isinstance(digits, int) or not 1 <= digits <= 1000:
        raise SizeLimitError(f"digits = {digits!r} must be an integer between 1 and 1000")
    g, text = plumbing_of(space)
    lat = PlumbingLattice(g)
    _guard(lat, K)
    chosen = lat.labels.labels if labels is None else [lat.labels.find(x) for x in labels]
    limits = {}
    for lab in chosen:
        lim = _limit(lat, lab.vector, K)
        try:
            _convergent(lim, lab)
        except KnotobsError:
            limits[lab] = None
            continue
        limits[lab] = _checked(lambda dps, lim=lim: _Limit.value(local_mp(dps), lim.finite, {}), digits)
    zq = finite_level_from_qseries(g, K, digits)
    zs = None
    if K >= 3 and not (isinstance(space, PlumbingGraph) or is_plumbing_text(space)):
        from knotobs.evaluation.surgery import partition_function
        from knotobs.fibrations.seifert import parse_space

        sp = parse_space(space) if isinstance(space, str) else space
        zs = partition_function(sp, "SU(2)", level=K - 2, digits=digits, route="surgery").numeric
    return RadialReport(text, K, digits, limits, zq, zs)


def finite_level_exact(space, K: int):
    """``Z_K(M)`` from the radial limits as an exact number ``sqrt(r) * c``, ``c`` cyclotomic.

    Every radial limit is an exact rational combination of roots of unity (module docstring), so
    the formula for ``Z_K`` is evaluated in ``Q(zeta_n)``; the result is a
    :class:`~knotobs.polynomials.cyclotomic.CyclotomicSurd` with radicand ``1/(2K |det B|)``.

    Examples
    --------
    >>> from knotobs.evaluation.surgery import partition_function
    >>> from knotobs.fibrations.seifert import parse_space
    >>> z = finite_level_exact("Sigma(2,3,5)", 5)
    >>> z == partition_function(parse_space("Sigma(2,3,5)"), "SU(2)", level=3, exact=True).exact
    True

    References
    ----------
    As :func:`finite_level_from_qseries`.
    """
    from itertools import product

    from knotobs.polynomials.cyclotomic import CyclotomicField, CyclotomicSurd

    K = _check_K(K)
    g, _ = plumbing_of(space)
    lat = PlumbingLattice(g)
    _guard(lat, K)
    det, adj, s = lat.det, lat.adj, lat.s
    lims = []
    for lab in lat.labels.labels:
        lim = _limit(lat, lab.vector, K)
        for beta in lat.labels.class_representatives(lab):
            lims.append(([sum(adj[i][j] * beta[j] for j in range(s)) for i in range(s)], lim))
    n_ops = len(lims) * abs(det) * max(1, max(len(lm.finite) for _, lm in lims))
    require(f"exact finite-level value from {len(lims)} blocks", seconds=seconds_for(n_ops * 3, "python"),
            accepted="use finite_level_from_qseries (numeric) or a smaller K")
    hb = lat.labels._hb
    ms = sorted({m for _, lm in lims for m in lm.orders})
    terms: dict[Fraction, Fraction] = {}
    sing: dict[int, dict] = {m: {} for m in ms}
    for y in product(*[range(hb[i][i]) for i in range(s)]):
        ay = [sum(adj[i][j] * y[j] for j in range(s)) for i in range(s)]
        k0 = Fraction(-K * sum(y[i] * ay[i] for i in range(s)), det)
        for ab, lim in lims:
            w = k0 + Fraction(-sum(y[i] * ab[i] for i in range(s)), det)
            for k, c in lim.finite.items():
                _add(terms, w + k, c)
            for m, dct in lim.orders.items():
                for k, c in dct.items():
                    _add(sing[m], w + k, c)

    def element(dct):
        n = 4
        for k in dct:
            n = math.lcm(n, k.denominator)
        F = CyclotomicField(n)
        vec = [Fraction(0)] * n
        for k, c in dct.items():
            vec[int(k * n) % n] += c
        return F, F.from_group_ring(vec)

    for m in ms:
        if not element(sing[m])[1].is_zero():
            raise KnotobsError(  # pragma: no cover - the combination has a limit (Murakami 2023)
                f"{lat.graph}: at K = {K} the tau^(-{m}/2) divergences of the Zhat_b do not cancel")
    F, total = element(terms)
    minus_i_half = F.zeta(3 * F.n // 4) * Fraction(1, 2)          # 1/(2i) = -i/2
    return CyclotomicSurd(total * minus_i_half, Fraction(1, 2 * K * abs(det)))
