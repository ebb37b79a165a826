r"""One-variable factors of the SU(3) integrand after partial fractions (CONVENTIONS §18.7).

On the rotated Cartan the SU(3) integrand of §18.1 is a product over the three positive roots
(§18.6).  After the partial fractions of §18.7 each term is, in coordinates ``(u, w)`` adapted to
two root families, ``A(u) B(w) C(u + w)`` with every factor of the form

    ``f(y) = sign exp(i pi a y) exp(-i pi c y^2) exp(-2 pi i K s y) prod_p (2i sin(pi (y + t_p)/p))^(e_p)``,

``c = K H/(3P)`` (the Gaussian ``-i pi K H |z|^2/P`` split as
``|z|^2 = (u^2 + w^2 + (u + w)^2)/3``), ``s`` an integer or, for orders sharing a factor, a
rational (the linear phase of a coset, §18.8), ``t_p`` integer shifts (also from the coset; zero
otherwise).  Poles (negative ``e_p``, ``p = 1``) lie at
the integers.  This module evaluates such factors on straight grids (values and Taylor
coefficients, by geometric recurrences restarted every :data:`BLOCK` nodes so that the balls stay
tight) and gives their Laurent expansions at integers, optionally times the Lawrence–Rozansky
kernel ``k(y) = 1/(1 - exp(-2 pi i K y))`` (CONVENTIONS §9).

References
----------
R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (the kernel and the residues).
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction
from functools import lru_cache

from flint import acb, acb_poly, arb, ctx

from knotobs.ball_series import bernoulli_plus, ser_exp, ser_inv, ser_mul, ser_sin

__all__ = ["RootFunction", "Scale", "laurent", "laurent_in_K", "symbolic_scale", "grid_series", "period_phase", "reflection_sign", "shifted_grid",
           "BLOCK"]

#: Grid recurrences are restarted from directly computed exponentials every ``BLOCK`` nodes.
BLOCK = 48


@lru_cache(maxsize=None)
def _pole_order(sines) -> int:
    return -sum(e for p, e in sines if e < 0)


@dataclass(frozen=True)
class RootFunction:
    """``sign exp(i pi a y) prod_p (2i sin(pi (y + t)/p))^e`` (the Gaussian and ``s`` come with the
    call), optionally with further exponentials in the prefactor (``extra``) and integer shifts
    ``t`` of the sines (``shifts``, parallel to ``sines``; empty means all zero).

    >>> f = RootFunction(1, Fraction(1, 2), ((1, -1), (3, 1)))
    >>> f.pole_order
    1
    """

    sign: int
    a: Fraction
    sines: tuple[tuple[int, int], ...]
    #: further terms ``(coefficient, a')`` of the exponential prefactor: ``f`` is
    #: ``(sign e^{i pi a y} + sum c e^{i pi a' y}) prod_p (2i sin(pi y/p))^e``
    extra: tuple[tuple[int, Fraction], ...] = ()
    #: integer shifts ``t`` of the sines (one per entry of ``sines``), or ``()`` for none
    shifts: tuple[int, ...] = ()

    @property
    def shifted_sines(self) -> tuple[tuple[int, int, int], ...]:
        """``((p, e, t), ...)``: every sine with its shift."""
        sh = self.shifts or (0,) * len(self.sines)
        return tuple((p, e, t) for (p, e), t in zip(self.sines, sh))

    @property
    def exps(self) -> tuple[tuple[int, Fraction], ...]:
        """The exponential prefactor as ``((coefficient, a), ...)``."""
        return ((self.sign, self.a),) + tuple(self.extra)

    @property
    def pole_order(self) -> int:
        """Largest order of a pole at an integer (at most ``-sum of negative e``)."""
        return _pole_order(self.sines)


@lru_cache(maxsize=4096)
def period_phase(f: RootFunction, n: int) -> Fraction | None:
    """``theta`` (mod 2) with ``f(y + n) = exp(i pi theta) f(y)`` for the sines and exponentials of
    ``f`` (no Gaussian, no ``s``), or ``None`` when ``n`` is not a period of every sine (``p | n``)
    or the exponentials of a sum pick up different phases.

    >>> period_phase(RootFunction(1, Fraction(1), ((2, 1), (3, 1), (1, -2))), 6)
    Fraction(1, 1)
    >>> period_phase(RootFunction(1, Fraction(0), ((2, 1),)), 3) is None
    True
    """
    theta = Fraction(0)
    for p, e, _ in f.shifted_sines:
        if n % p:
            return None
        theta += e * (n // p)          # 2i sin(pi (y + n + t)/p) = (-1)^(n/p) 2i sin(pi (y + t)/p)
    phases = {(a * n) % 2 for _, a in f.exps}
    if len(phases) != 1:
        return None
    return (theta + phases.pop()) % 2


def reflection_sign(f: RootFunction) -> int | None:
    """``eps`` with ``f(-y) = eps f(y)`` for the sines and exponentials of ``f`` (the Gaussian is
    even), or ``None`` when ``f`` has no such symmetry (shifted sines, or exponentials that the
    reflection does not map onto themselves up to one sign).

    ``2i sin(-pi y/p) = -2i sin(pi y/p)`` gives ``(-1)^(sum e)``; ``sum c e^{i pi a y}`` must go to
    ``eps' sum c e^{i pi a y}`` under ``a -> -a``.

    >>> reflection_sign(RootFunction(1, Fraction(1), ((2, 1), (1, -1)), ((1, Fraction(-1)),)))
    1
    >>> reflection_sign(RootFunction(1, Fraction(1), ((2, 1),))) is None
    True
    """
    if any(f.shifts):
        return None
    eps = -1 if sum(e for _, e in f.sines) % 2 else 1

    def combined(pairs):
        out: dict = {}
        for co, a in pairs:
            out[a] = out.get(a, 0) + co
        return {a: co for a, co in out.items() if co}

    here = combined(f.exps)
    mirrored = combined((co, -a) for co, a in f.exps)
    for e2 in (1, -1):
        if mirrored == {a: e2 * co for a, co in here.items()}:
            return eps * e2
    return None


@dataclass
class Scale:
    """The numbers every factor shares, as balls at the current precision.

    ``K`` the shifted level, ``c = K H/(3P)``; ``ipi = i pi``.
    """

    K: acb
    c: acb

    def __post_init__(self):
        self.ipi = acb(0, 1) * arb.pi()
        self.tpiK = 2 * self.ipi * self.K          # 2 pi i K


def _q(x: Fraction) -> acb:
    return acb(x.numerator) / x.denominator


def _num(s):
    """An integer as is, a rational as a ball (``acb`` takes no ``Fraction``)."""
    return _q(s) if isinstance(s, Fraction) else s


def _power(ser: list[acb], e: int, n: int) -> list[acb]:
    if e < 0:
        ser = ser_inv(ser, n)
        e = -e
    out = [acb(1)] + [acb(0)] * (n - 1)
    for _ in range(e):
        out = ser_mul(out, ser, n)
    return out


@lru_cache(maxsize=4096)
def _sine_laurent(sines: tuple[tuple[int, int, int], ...], m: int, n: int, prec: int) -> tuple[int, tuple[acb, ...]]:
    """The sine product ``prod_p (2i sin(pi (m + x + t)/p))^e`` at ``x = 0`` as ``(v, n coefficients)``.

    It does not depend on ``K``, so it is cached (keyed by the working precision ``prec``, which
    the balls were computed at) and shared by every ``s``, kernel flag and level; the
    coefficients are a tuple, so no caller can change the cached value."""
    val = 0
    out = [acb(1)] + [acb(0)] * (n - 1)
    for p, e, sh in sines:
        ms = m + sh
        if ms % p == 0:
            # 2i sin(pi (m + x)/p) = (-1)^(m/p) 2i sin(pi x/p) = x * [(-1)^(m/p) 2i sin(pi x/p)/x]
            sn = ser_sin(acb(0), arb.pi() / p, n + 1)[1:]
            sg = -1 if (ms // p) % 2 else 1
            ser = [acb(0, 2 * sg) * t for t in sn]
            val += e
        else:
            sn = ser_sin(arb.pi() * ms / p, arb.pi() / p, n)
            ser = [acb(0, 2) * t for t in sn]
        out = ser_mul(out, _power(ser, e, n), n)
    return val, tuple(out)


def _kernel_series(n: int, X, first) -> list:
    """``first * [B_k^+ X^k/k!]_{k < n}``: with ``first = 1/X`` the series of the kernel
    ``k(x) = (1/(X x)) * Xx/(1 - e^{-Xx})`` times ``x`` (``X = 2 pi i K``); ``X`` may be a polynomial."""
    ker, pw = [], first
    for b in bernoulli_plus(n):
        ker.append(pw * _q(b))
        pw = pw * X
    return ker


def laurent(f: RootFunction, m: int, s: int, kernel: bool, n: int, sc: Scale) -> tuple[int, list[acb]]:
    """Laurent expansion of ``f(m + x) exp(-i pi c (m+x)^2) exp(-2 pi i K s (m+x)) [k(x)]`` at ``x = 0``.

    Returns ``(v, [c_0, ..., c_{n-1}])`` meaning ``x^v (c_0 + c_1 x + ...)``.

    >>> from knotobs.numerics import working_precision
    >>> with working_precision(20):
    ...     sc = Scale(acb(5), acb(1))
    ...     v, c = laurent(RootFunction(1, Fraction(0), ((1, -1),)), 2, 0, False, 2, sc)
    >>> v, abs(complex(c[0].mid()) * 2j * 3.141592653589793 * complex((-sc.ipi * 4).exp().mid()) ** -1 - 1) < 1e-12
    (-1, True)
    """
    ipi = sc.ipi
    val, out = _sine_laurent(f.shifted_sines, m, n, ctx.prec)
    s = _num(s)
    g = [acb(0)] * n
    for co, a in f.exps:
        lin = ipi * _q(a) - sc.tpiK * s
        gi = ser_exp([lin * m - ipi * sc.c * (m * m), lin - 2 * ipi * sc.c * m, -ipi * sc.c], n)
        g = [x + co * y for x, y in zip(g, gi)]
    out = ser_mul(out, g, n)
    if kernel:
        # k(x) = (1/(2 pi i K x)) * X/(1 - e^-X), X = 2 pi i K x
        out = ser_mul(out, _kernel_series(n, sc.tpiK, 1 / sc.tpiK), n)
        val -= 1
    return val, out


def symbolic_scale(H: int, P: int) -> Scale:
    """The :class:`Scale` with ``K`` the polynomial variable: ``K = x``, ``c = x H/(3P)`` (for
    :func:`laurent_in_K`).

    >>> symbolic_scale(1, 30).c.coeffs()[1].overlaps(acb(1) / 90)
    True
    """
    x = acb_poly([0, 1])
    return Scale(x, x * (acb(H) / (3 * P)))


def _ser_exp_lin_quad(d1, d2, n: int) -> list:
    """``exp(d1 x + d2 x^2)`` to ``n`` terms for polynomial (or ball) ``d1``, ``d2``, by ``E' = (d1 +
    2 d2 x) E``."""
    out = [acb(1)]
    for k in range(1, n):
        t = d1 * out[k - 1]
        if k >= 2:
            t = t + 2 * d2 * out[k - 2]
        out.append(t * (acb(1) / k))
    return out


def laurent_in_K(f: RootFunction, m: int, s, kernel: bool, n: int, sc: Scale) -> tuple[int, list]:
    """The Laurent data of :func:`laurent` as polynomials in ``K`` (``sc`` from :func:`symbolic_scale`),
    without the phase ``exp(-2 pi i K (s m + c m^2/(2K)))`` and, with the kernel, without its
    ``1/(2 pi i K)`` (CONVENTIONS §18.7, exact pieces):

        ``laurent(f, m, s, kernel, n, Scale(K, ...))`` ``=`` ``exp(-2 pi i K s m - i pi c m^2)
        (2 pi i K)^(-kernel) * [laurent_in_K(...) at K]``.

    Every coefficient is a polynomial in ``K`` (the Gaussian's and the Fourier index's series have
    coefficients linear in ``K``, the kernel's are ``B_k^+ (2 pi i K)^k/k!``); the sines' data are
    numbers.

    >>> from knotobs.numerics import working_precision
    >>> with working_precision(20):
    ...     f = RootFunction(1, Fraction(1, 2), ((2, 1), (1, -1)))
    ...     K = acb(7, 0.3)
    ...     v, c = laurent(f, 3, 2, True, 3, Scale(K, K / 90))
    ...     w, p = laurent_in_K(f, 3, 2, True, 3, symbolic_scale(1, 30))
    ...     ph = (-2 * acb(0, 1) * arb.pi() * K * 6 - acb(0, 1) * arb.pi() * K / 90 * 9).exp() / (2 * acb(0, 1) * arb.pi() * K)
    >>> v == w and all(abs(complex((a / (ph * b(K)) - 1).mid())) < 1e-12 for a, b in zip(c, p))
    True
    """
    ipi = sc.ipi
    val, out = _sine_laurent(f.shifted_sines, m, n, ctx.prec)
    s = _num(s)
    g: list = [acb(0)] * n
    for co, a in f.exps:
        lin = ipi * _q(a) - sc.tpiK * s
        const = (ipi * _q(a) * m).exp() * co
        gi = _ser_exp_lin_quad(lin - 2 * ipi * sc.c * m, -ipi * sc.c, n)
        g = [x + const * y for x, y in zip(g, gi)]
    out = ser_mul(out, g, n)
    if kernel:
        out = ser_mul(out, _kernel_series(n, sc.tpiK, acb(1)), n)
        val -= 1
    return val, [x if isinstance(x, acb_poly) else acb_poly([x]) for x in out]


@lru_cache(maxsize=256)
def _value_kernel(coefs: tuple[int, ...], exps: tuple[int, ...]):
    """A loop over ``nb`` grid nodes for one signature of factor (its exponential coefficients and
    sine powers), written out with local variables: the same operations as the generic loop of
    :func:`grid_series` without its per-node list building (about twice as fast).  ``None`` when
    the signature is unusual (the generic loop is used)."""
    if len(coefs) > 4 or len(exps) > 8 or any(abs(e) > 12 for e in exps):
        return None
    ne, ns = len(coefs), len(exps)
    g = [f"g{i}" for i in range(ne)]
    r = [f"r{i}" for i in range(ne)]
    E, iE, names = _sine_names(ns)
    args = ", ".join(["nb", "emit", "Q2"] + g + r + names)
    terms = []
    for i, c in enumerate(coefs):
        terms.append(g[i] if c == 1 else f"(-{g[i]})" if c == -1 else f"({c} * {g[i]})")
    body = [f"        v = {' + '.join(terms)}"]
    for i in range(ne):
        body.append(f"        {g[i]} = {g[i]} * {r[i]}")
        body.append(f"        {r[i]} = {r[i]} * Q2")
    den = []
    for k, e in enumerate(exps):
        if e == 0:
            continue
        body.append(f"        s{k} = {E[k]} - {iE[k]}")
        pw = " * ".join([f"s{k}"] * abs(e)) if abs(e) <= 4 else f"s{k} ** {abs(e)}"
        if e > 0:
            body.append(f"        v = v * {pw}")
        else:
            den.append(pw)
    body.append(f"        emit([v / ({' * '.join(den)})])" if den else "        emit([v])")
    return _compile_kernel(f"grid kernel {coefs} {exps}", args, body, ns)


def _sine_names(ns: int) -> tuple[list[str], list[str], list[str]]:
    """Local names of the kernels: ``E_k``, ``1/E_k`` and all four lists ``E, 1/E, R, 1/R`` in order."""
    E = [f"E{k}" for k in range(ns)]
    iE = [f"iE{k}" for k in range(ns)]
    return E, iE, E + iE + [f"R{k}" for k in range(ns)] + [f"iR{k}" for k in range(ns)]


def _compile_kernel(name: str, args: str, body: list[str], ns: int):
    """The loop ``for _ in range(nb): body`` with the recurrences ``E_k *= R_k``, ``1/E_k *= 1/R_k``
    of the ``ns`` sines appended, compiled once."""
    for k in range(ns):
        body.append(f"        E{k} = E{k} * R{k}")
        body.append(f"        iE{k} = iE{k} * iR{k}")
    src = f"def kernel({args}):\n    for _ in range(nb):\n" + "\n".join(body) + "\n"
    scope: dict = {}
    exec(compile(src, f"<{name}>", "exec"), scope)
    return scope["kernel"]


@lru_cache(maxsize=256)
def _taylor_kernel(sign: int, exps: tuple[int, ...], L: int):
    """As :func:`_value_kernel` for the Taylor coefficients (``L = 2, 3``) of an entire factor: the
    product rule of the generic loop, ``1/E`` and ``d/dy`` of the Gaussian kept by recurrences."""
    if L not in (2, 3) or any(e < 0 or e > 6 for e in exps) or len(exps) > 8:
        return None
    ns = len(exps)
    E, iE, names = _sine_names(ns)
    A = [f"a{k}" for k in range(ns)]
    A2 = [f"b{k}" for k in range(ns)]
    args = ", ".join(["nb", "emit", "g", "rho", "Q2", "d1", "dstep", "q2", "half"] + names + A + A2)
    body = ["        x0 = g" if sign == 1 else "        x0 = -g", "        x1 = x0 * d1"]
    if L == 3:
        body.append("        x2 = x0 * (d1 * d1 + q2) * half")
    for k, e in enumerate(exps):
        if e == 0:
            continue
        body.append(f"        sv = {E[k]} - {iE[k]}")
        body.append(f"        y1 = {A[k]} * ({E[k]} + {iE[k]})")
        if L == 3:
            body.append(f"        y2 = {A2[k]} * sv")
        for _ in range(e):
            if L == 3:
                body.append("        x0, x1, x2 = x0 * sv, x0 * y1 + x1 * sv, x0 * y2 + x1 * y1 + x2 * sv")
            else:
                body.append("        x0, x1 = x0 * sv, x0 * y1 + x1 * sv")
    body.append("        emit([x0, x1, x2])" if L == 3 else "        emit([x0, x1])")
    body += ["        g = g * rho", "        rho = rho * Q2", "        d1 = d1 + dstep"]
    return _compile_kernel(f"taylor kernel {sign} {exps} {L}", args, body, ns)


def grid_series(f: RootFunction, y0: acb, step: acb, J: int, s: int, L: int, sc: Scale) -> list[list[acb]]:
    """Taylor coefficients (length ``L``) of ``f(y) exp(-i pi c y^2 - 2 pi i K s y)`` at
    ``y_j = y0 + j step``, ``j = -J, ..., J`` (``y_j`` never an integer when ``f`` has poles).

    >>> from knotobs.numerics import working_precision
    >>> with working_precision(20):
    ...     sc = Scale(acb(5), acb(1))
    ...     f = RootFunction(1, Fraction(0), ((2, 1),))
    ...     g = grid_series(f, acb(0.5), acb(0.1, -0.1), 3, 0, 2, sc)
    ...     y = acb(0.5) + 2 * acb(0.1, -0.1)
    ...     ref = 2j * (arb.pi() * y / 2).sin() * (-sc.ipi * y * y).exp()
    ...     dref = ref * (-2 * sc.ipi * y) + acb(0, 1) * arb.pi() * (arb.pi() * y / 2).cos() * (-sc.ipi * y * y).exp()
    >>> abs(complex((g[5][0] - ref).mid())) < 1e-15, abs(complex((g[5][1] - dref).mid())) < 1e-14
    (True, True)
    """
    ipi = sc.ipi
    s = _num(s)
    if f.extra and L > 1:
        raise ValueError("grid_series: Taylor coefficients of a sum of exponentials are not needed here")
    lins = [(co, ipi * _q(a) - sc.tpiK * s) for co, a in f.exps]
    lin = lins[0][1]
    quad = -ipi * sc.c
    out: list[list[acb]] = []
    total = 2 * J + 1
    start = y0 - J * step
    sines = f.sines
    avals = [ipi / p for p, _ in sines]
    half_a2 = [a * a / 2 for a in avals]
    sign = f.sign
    j = 0
    while j < total:
        nb = min(BLOCK, total - j)
        y = start + j * step
        E = [((ipi / p) * (y + t)).exp() for p, _, t in f.shifted_sines]
        R = [((ipi / p) * step).exp() for p, _ in sines]
        g = (quad * y * y + lin * y).exp()
        rho = (quad * (2 * y * step + step * step) + lin * step).exp()
        Q2 = (2 * quad * step * step).exp()
        if L == 1:
            iE = [1 / Ek for Ek in E]
            iR = [1 / Rk for Rk in R]
            pos = [(k, e) for k, (p, e) in enumerate(sines) if e > 0]
            neg = [(k, -e) for k, (p, e) in enumerate(sines) if e < 0]
            gs = [(quad * y * y + ln * y).exp() for _, ln in lins]
            rhos = [(quad * (2 * y * step + step * step) + ln * step).exp() for _, ln in lins]
            cos_ = [co for co, _ in lins]
            kern = _value_kernel(tuple(cos_), tuple(e for _, (p, e) in enumerate(sines)))
            if kern is not None:
                kern(nb, out.append, Q2, *gs, *rhos, *E, *iE, *R, *iR)
                j += nb
                continue
            single = len(lins) == 1
            for t in range(nb):
                if single:
                    v = gs[0] if cos_[0] == 1 else cos_[0] * gs[0]
                    gs[0] = gs[0] * rhos[0]
                    rhos[0] = rhos[0] * Q2
                else:
                    v = acb(0)
                    for i in range(len(gs)):
                        v += cos_[i] * gs[i]
                        gs[i] = gs[i] * rhos[i]
                        rhos[i] = rhos[i] * Q2
                for k, e in pos:
                    sv = E[k] - iE[k]
                    v = v * sv if e == 1 else v * sv ** e
                den = None
                for k, e in neg:
                    sv = E[k] - iE[k]
                    sv = sv if e == 1 else sv ** e
                    den = sv if den is None else den * sv
                out.append([v if den is None else v / den])
                E = [Ek * Rk for Ek, Rk in zip(E, R)]
                iE = [Ek * Rk for Ek, Rk in zip(iE, iR)]
            j += nb
            continue
        if L > 3:
            # higher poles (four or more orders, base genus >= 1): generic truncated series
            for t in range(nb):
                yt = y + t * step
                d1 = 2 * quad * yt + lin
                x = ser_exp([acb(0), d1, quad], L)
                x0 = g if sign == 1 else -g
                x = [x0 * c for c in x]
                for k, ((p, e), Ek) in enumerate(zip(sines, E)):
                    if e < 0:
                        raise ValueError("grid_series: Taylor coefficients are for entire factors")
                    iE = 1 / Ek
                    ser, pw, fact = [], acb(1), 1
                    for i in range(L):
                        ser.append(pw / fact * (Ek - iE if i % 2 == 0 else Ek + iE))
                        pw = pw * avals[k]
                        fact *= i + 1
                    for _ in range(e):
                        x = ser_mul(x, ser, L)
                out.append(x)
                g = g * rho
                rho = rho * Q2
                E = [Ek * Rk for Ek, Rk in zip(E, R)]
            j += nb
            continue
        kern = _taylor_kernel(sign, tuple(e for _, e in sines), L)
        if kern is not None:
            iE = [1 / Ek for Ek in E]
            iR = [1 / Rk for Rk in R]
            kern(nb, out.append, g, rho, Q2, 2 * quad * y + lin, 2 * quad * step, 2 * quad, acb(1) / 2,
                 *E, *iE, *R, *iR, *avals, *half_a2)
            j += nb
            continue
        for t in range(nb):
            yt = y + t * step
            d1 = 2 * quad * yt + lin
            x0 = g if sign == 1 else -g
            x1 = x0 * d1
            x2 = x0 * (d1 * d1 + 2 * quad) / 2 if L == 3 else None
            for k, ((p, e), Ek) in enumerate(zip(sines, E)):
                iE = 1 / Ek
                sv, cv = Ek - iE, Ek + iE
                y1 = avals[k] * cv
                if e < 0:
                    raise ValueError("grid_series: Taylor coefficients are for entire factors")
                for _ in range(e):
                    if L == 3:
                        y2 = half_a2[k] * sv
                        x0, x1, x2 = x0 * sv, x0 * y1 + x1 * sv, x0 * y2 + x1 * y1 + x2 * sv
                    else:
                        x0, x1 = x0 * sv, x0 * y1 + x1 * sv
            out.append([x0, x1] if L == 2 else [x0, x1, x2])
            g = g * rho
            rho = rho * Q2
            E = [Ek * Rk for Ek, Rk in zip(E, R)]
        j += nb
    return out


def shifted_grid(base: list[list[acb]], y0: acb, n: int, step: acb, J: int, s, theta: Fraction, L: int,
                 sc: Scale) -> list[list[acb]]:
    """The grid of :func:`grid_series` at ``y0 + n`` with Fourier index ``s`` from ``base``, the
    grid at ``y0`` with index ``0`` (same ``step``, ``J``, ``L``), when ``f(y + n) = e^{i pi theta}
    f(y)`` (:func:`period_phase`).  Exactly,

        ``G_s(y + n) = G_0(y) exp(i pi theta - i pi c n^2 - 2 pi i K s n + lam y)``,
        ``lam = -2 pi i (K s + c n)``,

    so each node costs one product (and the Taylor coefficients the series of ``e^{lam x}``)
    instead of the sines and the Gaussian; the exponential is restarted every :data:`BLOCK` nodes.

    >>> from knotobs.numerics import working_precision
    >>> with working_precision(20):
    ...     sc = Scale(acb(7, 0.3), acb(7, 0.3) / 18)
    ...     f = RootFunction(-1, Fraction(1), ((2, 1), (3, 1)))
    ...     y0, st = acb(0.5), acb(0.2, -0.2)
    ...     base = grid_series(f, y0, st, 4, 0, 2, sc)
    ...     g = shifted_grid(base, y0, 12, st, 4, 2, period_phase(f, 12), 2, sc)
    ...     ref = grid_series(f, y0 + 12, st, 4, 2, 2, sc)
    >>> max(abs(complex((a[i] - b[i]).mid())) / abs(complex(b[i].mid())) for a, b in zip(g, ref) for i in range(2)) < 1e-15
    True
    """
    ipi = sc.ipi
    sb = _num(s)
    lam = -sc.tpiK * sb - 2 * ipi * sc.c * n
    const = ipi * _q(theta) - ipi * sc.c * (n * n) - sc.tpiK * sb * n
    start = y0 - J * step
    ratio = (lam * step).exp()
    ex = [acb(1), lam, lam * lam / 2] if L <= 3 else ser_exp([acb(0), lam], L)
    out: list[list[acb]] = []
    total = len(base)
    j = 0
    while j < total:
        m = (const + lam * (start + j * step)).exp()
        for row in base[j:j + BLOCK]:
            if L == 1:
                out.append([row[0] * m])
            elif L == 2:
                x0, x1 = row[0], row[1]
                out.append([x0 * m, (x1 + lam * x0) * m])
            elif L == 3:
                x0, x1, x2 = row[0], row[1], row[2]
                out.append([x0 * m, (x1 + lam * x0) * m, (x2 + lam * x1 + ex[2] * x0) * m])
            else:
                out.append([x * m for x in ser_mul(row[:L], ex, L)])
            m = m * ratio
        j += BLOCK
    return out
