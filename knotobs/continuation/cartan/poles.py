r"""SU(3) ``Z(K)`` at complex ``K`` when the integrand has poles (three or more exceptional orders).

CONVENTIONS §18.7 (docs/continuation_sun.md).  The finite sum of §18.1 is
``S = sum'_{lam in Lambda/PKQ} h(lam/K)`` with ``h = Gauss * prod_j Delta(z/p_j) / Delta(z)^(n-2)``.
In the coordinates ``x = (<alpha_1, z>, <alpha_2, z>)`` the Weyl denominator is
``S(x_1) S(x_2) S(x_1 + x_2)``, ``S(y) = 2i sin(pi y)``, and the identity

    ``1/(S_1 S_2 S_12) = e^{i pi x_2}/(S_1^2 S_2) - e^{i pi (x_1 + x_2)}/(S_1^2 S_12)``

(applied until one power vanishes) writes ``h`` as a sum of terms whose poles lie on two root
families only.  In coordinates ``(u, w)`` with those families on the lines ``u in Z``, ``w in Z``
each term is ``A(u) B(w) C(u + w)`` (:mod:`.rootfn`), quasi-periodic under ``3P`` shifts of
``u`` or ``w``, regular on the third family ``u + w in Z``.  For each term:

* the sum over the box ``[0, 3P)^2`` (three copies of ``Lambda/PKQ``) of its values off the two
  pole families is the iterated Lawrence–Rozansky formula of §18.7 — Gaussian integrals over
  the rotated plane, line integrals of residues and iterated residues at the integer points, no
  kernel left on any contour;
* the values on the third family (excluded in ``S``) are subtracted as rank-one
  Lawrence–Rozansky sums along the lines ``u + w = m``, ``m mod P``.

Every contour is then moved to its saddle (through the nearest half-integer), collecting the
residues it crosses; each piece is ``exp(2 pi i K phi)`` times a function of polynomial growth,
and with ``phases="reduced"`` the integer part of ``phi`` is dropped (equal at integer ``K``,
least exponential type).  ``H < 0`` is ``S_H(K) = conj(S_{-H}(conj K))``.

References
----------
R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (rank one);
M. Mariño, Commun. Math. Phys. 253 (2005) 25–49 (the Cartan integrals for simply-laced groups).
"""

from __future__ import annotations

import math
from fractions import Fraction

from flint import acb, acb_mat, acb_poly, arb, ctx

from knotobs.ball_series import ser_inv, ser_mul
from knotobs.continuation.cartan.data import Coset
from knotobs.continuation.cartan.rootfn import (RootFunction, Scale, _q, grid_series, laurent, laurent_in_K,
                                               period_phase, reflection_sign, shifted_grid, symbolic_scale)

__all__ = ["partial_fraction_terms", "PoleTerm", "pole_sum_sectors", "pole_plan", "pole_cost", "pole_domain",
           "pole_range_digits", "pole_line_count", "pole_line_nodes", "coset_terms"]


# ------------------------------------------------------------------ partial fractions
def _split(a: int, b: int, c: int) -> dict[tuple[Fraction, Fraction, int, int, int], int]:
    """``1/(S_1^a S_2^b S_12^c)`` as ``{(alpha_1, alpha_2, a', b', c'): coefficient}`` meaning
    ``coefficient e^{i pi (alpha_1 x_1 + alpha_2 x_2)} / (S_1^a' S_2^b' S_12^c')`` with ``b' c' = 0``."""
    out: dict = {}
    todo = [((Fraction(0), Fraction(0), a, b, c), 1)]
    while todo:
        (al1, al2, a_, b_, c_), k = todo.pop()
        if b_ == 0 or c_ == 0:
            key = (al1, al2, a_, b_, c_)
            out[key] = out.get(key, 0) + k
            continue
        todo.append(((al1, al2 + 1, a_ + 1, b_, c_ - 1), k))
        todo.append(((al1 + 1, al2 + 1, a_ + 1, b_ - 1, c_), -k))
    return {key: v for key, v in out.items() if v}


class PoleTerm:
    """One term ``A(u) B(w) C(u + w)`` of the partial-fraction expansion of ``h``.

    ``basis`` gives ``(u, w)`` from ``x = (x_1, x_2)``: ``u = basis[0] . x``, ``w = basis[1] . x``.
    ``offsets`` ``(c_u, c_w)``: the linear phase ``exp(-2 pi i K (c_u u + c_w w))`` of a coset
    (§18.8; zero for coprime orders), added to the Fourier indices of ``A`` and ``B``.
    """

    def __init__(self, A: RootFunction, B: RootFunction, C: RootFunction,
                 basis: tuple[tuple[int, int], tuple[int, int]] = ((1, 0), (0, 1)),
                 offsets: tuple[Fraction, Fraction] = (Fraction(0), Fraction(0))):
        self.A, self.B, self.C = A, B, C
        self.basis = basis
        self.offsets = offsets

    def __repr__(self):
        return f"PoleTerm({self.A}, {self.B}, {self.C})"


def partial_fraction_terms(orders: tuple[int, ...], shifts=None, lin=None, deg=None) -> list[PoleTerm]:
    """The terms of ``prod_j Delta((z + s_j)/p_j) / Delta(z)^deg`` (orders ``> 1``; ``deg = n - 2``,
    ``n = len(orders)``, unless given: ``n - 2 + 2g`` on a base of genus ``g``).

    ``shifts``: for orders sharing a factor, ``(<alpha_1, s_j>, <alpha_2, s_j>)`` for each order
    (the coset of §18.8); ``None`` for ``s_j = 0``.  A sine of the root ``beta . x`` is then
    shifted by ``beta . (<alpha_1, s_j>, <alpha_2, s_j>)``.  ``lin``: the coset's linear phase
    ``exp(-2 pi i K c . x)`` as ``c`` (root coordinates), or ``None``; in ``(u, w)`` it is
    ``offsets = c . basis^-1``.

    >>> [t.A.pole_order + t.B.pole_order for t in partial_fraction_terms((2, 3, 5))]
    [3, 3]
    >>> partial_fraction_terms((2, 4, 6), ((0, 0), (1, 0), (2, -1)))[0].C.shifts
    (0, 1, 1)
    """
    n = len(orders)
    deg = n - 2 if deg is None else deg
    num = tuple((p, 1) for p in orders)
    sh = tuple(shifts) if shifts is not None else ((0, 0),) * n

    def f(sign, a, dens, beta):
        t = tuple(beta[0] * a1 + beta[1] * a2 for a1, a2 in sh)
        sines = num + dens
        shifts_ = (t + (0,) * len(dens)) if any(t) else ()
        return RootFunction(sign, a, sines, (), shifts_)

    terms = []
    for (al1, al2, a, b, c), k in sorted(_split(deg, deg, deg).items()):
        if c == 0:   # poles on x_1, x_2: (u, w) = (x_1, x_2)
            basis = ((1, 0), (0, 1))
            A = f(k, al1, ((1, -a),), basis[0])
            B = f(1, al2, ((1, -b),), basis[1])
        else:        # poles on x_1, x_1 + x_2: u = x_1, w = -(x_1 + x_2), u + w = -x_2
            basis = ((1, 0), (-1, -1))
            A = f(k * (-1) ** c, al1 - al2, ((1, -a),), basis[0])
            B = f(1, -al2, ((1, -c),), basis[1])
        both = (basis[0][0] + basis[1][0], basis[0][1] + basis[1][1])
        terms.append(PoleTerm(A, B, f(1, Fraction(0), (), both), basis, _offsets(basis, lin)))
    return terms


def _offsets(basis, lin) -> tuple[Fraction, Fraction]:
    """``c . basis^-1``: the linear phase ``c . x`` written as ``c_u u + c_w w`` (``basis`` unimodular)."""
    if lin is None:
        return Fraction(0), Fraction(0)
    (a, b), (c, d) = basis
    det = a * d - b * c
    # x = basis^-1 (u, w) = (d u - b w, -c u + a w)/det
    c1, c2 = lin
    return Fraction(c1 * d - c2 * c, det), Fraction(-c1 * b + c2 * a, det)


def merged_terms(orders: tuple[int, ...], shifts=None, lin=None, deg=None) -> list[PoleTerm]:
    """The terms with equal ``A`` and ``C`` and equal sines of ``B`` combined into one, whose ``B``
    carries a sum of exponentials.  Every step of §18.7 is linear in ``B`` and uses only the
    ``3P``-quasi-periodicity and the pole lines, which such terms share, so their sums may be
    taken together (for three orders the two terms of the identity become one).

    >>> len(partial_fraction_terms((2, 3, 5))), len(merged_terms((2, 3, 5)))
    (2, 1)
    """
    groups: dict = {}
    for t in partial_fraction_terms(orders, shifts, lin, deg):
        key = (t.A, t.C, t.B.sines, t.B.shifts, t.offsets)
        groups.setdefault(key, []).append(t)
    out = []
    for (A, C, sines, bshifts, offsets), ts in groups.items():
        exps = [e for t in ts for e in t.B.exps]
        spread = max(a for _, a in exps) - min(a for _, a in exps)
        if spread > 2 * ts[0].B.pole_order:
            # exponentials far apart have saddles far apart: each term keeps its own contours
            out.extend(ts)
            continue
        B = RootFunction(exps[0][0], exps[0][1], sines, tuple(exps[1:]), bshifts)
        out.append(PoleTerm(A, B, C, ts[0].basis, offsets))
    return out


#: Skip the third-family line sums of the terms for which they vanish (:func:`odd_third_family`);
#: a test turns it off and finds the same values.
SKIP_ODD_THIRD = True


def odd_third_family(term: PoleTerm) -> bool:
    """Whether the lattice sums of ``term`` along the third family vanish identically.

    With ``N(y) = e^{-i pi c y^2} prod_p S(y/p)`` (``p > 1``, no shifts), a term
    ``A(u) = s_A N(u)/S(u)^2``, ``B(w) = s_B (e^{i pi w} + e^{-i pi w}) N(w)/S(w)`` (the two terms
    of three orders, merged; no Fourier offsets) has on the line ``u + w = m``, ``m`` an integer,
    ``f(u) = A(u) B(m - u)`` odd under ``u -> m - u``: ``S(m - u) = -(-1)^m S(u)`` and
    ``cos(pi (m - u)) = (-1)^m cos(pi u)`` give ``f(m - u) = -f(u)``.  The involution maps the
    lattice points ``b/K`` off the poles to themselves (mod ``3P``), so every finite line sum is
    zero at every integer ``K`` (docs/continuation_sun.md §18.7, the third family).

    >>> odd_third_family(merged_terms((2, 3, 5))[0]), odd_third_family(merged_terms((2, 3, 5, 7))[0])
    (True, False)
    """
    A, B = term.A, term.B
    if any(term.offsets) or any(A.shifts) or any(B.shifts):
        return False
    num = sorted(x for x in A.sines if x[0] > 1)
    if sorted(A.sines) != sorted(num + [(1, -2)]) or sorted(B.sines) != sorted(num + [(1, -1)]):
        return False
    if any(e <= 0 for _, e in num) or len(A.exps) != 1 or A.a != 0:
        return False
    sb = B.sign
    return sorted(B.exps) == sorted([(sb, Fraction(1)), (sb, Fraction(-1))])


def coset_terms(orders: tuple[int, ...], cosets=None, genus: int = 0):
    """``(coset, i, term)`` for every merged term of every coset (default: the one coset of pairwise
    coprime orders), with ``Delta(z)^(n - 2 + 2g)`` in the denominator: the terms that
    :func:`pole_sum_sectors` sums, and that the cost estimates count.

    >>> [(i, len(t.A.sines)) for _, i, t in coset_terms((2, 3, 5))]
    [(0, 4)]
    """
    deg = len(orders) - 2 + 2 * genus
    for co in (cosets if cosets is not None else [Coset.trivial(len(orders))]):
        for i, term in enumerate(merged_terms(tuple(orders), co.shifts, co.lin, deg)):
            yield co, i, term


# ------------------------------------------------------------------ the evaluator
_COMB = [[math.comb(n, k) for k in range(n + 1)] for n in range(48)]


def _half(y: Fraction) -> Fraction:
    """The half-integer ``floor(y) + 1/2`` (a contour through it avoids every pole)."""
    return Fraction(math.floor(y)) + Fraction(1, 2)


def _between(a: Fraction, b: Fraction) -> tuple[int, list[int]]:
    """``(sign, integers strictly between)``: ``int_{C_a} = int_{C_b} + sign 2 pi i sum Res``."""
    if a < b:
        return 1, list(range(math.ceil(a), math.floor(b) + 1))
    return -1, list(range(math.ceil(b), math.floor(a) + 1))


def pole_plan(sin_theta: float, c_abs: float, digits: int, growth: float) -> tuple[float, float, float, float]:
    """Quadrature plan of a line integral with Gaussian ``exp(-pi b s^2)``, ``b = 2 |c|``, and
    sines growing like ``exp(growth |s|)``: ``(h_fine, h, S, T)``.

    ``h`` is the step of the pole-corrected trapezoid rule (aliasing ``exp(-pi/(b h^2) + growth/(b h))``
    below ``e^-T``), ``S`` the half-length of the line, ``h_fine`` the plain rule's step (below the
    pole distance ``|sin theta|/2``; the check of the plane uses it), ``T`` the target in nats.

    >>> hf, h, S, T = pole_plan(0.7, 0.33, 30, 6.0)
    >>> 0 < hf < 0.05 < h and S > 3
    True
    """
    T = math.log(10) * (digits + 6) + 8
    b = 2 * c_abs
    root = math.sqrt(growth * growth + 4 * math.pi * b * T)
    h_fine = 2 * math.pi * (abs(sin_theta) / 2) / (T + 2)
    h = 2 * math.pi / (growth + root)
    S = (growth + root) / (2 * math.pi * b)
    return h_fine, h, S, T


def _growth(st: float, cabs: float, rates: float) -> float:
    """Growth rate of a line's integrand in ``s``: the sines grow like ``exp(pi |Im y| rate)``,
    ``Im y = s st``; the offset of the contour from the saddle (at most 1/2 plus the shift by
    the linear exponentials) adds about ``3 pi |c| |s|``."""
    return math.pi * st * rates + 3 * math.pi * cabs + 1


def _plan_growth(theta: float, cabs: float, rates: float) -> float:
    """``growth`` of :func:`pole_plan`: :func:`_growth` along the line (``|sin theta|``) or across
    it (``|cos theta|``), whichever is larger.  The aliasing bound of the trapezoid rule moves the
    line across itself, where ``Im y`` changes like ``|cos theta|``; with ``|sin theta|`` alone the
    step was too long for contours near the real axis (``K`` in the lower half plane near ``0``:
    at ``K = 0.6 - 0.5i`` on Σ(2,3,5) runs of 13 and 30 digits differed at ``10^-2``)."""
    return _growth(max(abs(math.sin(theta)), abs(math.cos(theta))), cabs, rates)


def _rate(f: RootFunction) -> float:
    """``|f| ~ exp(pi |Im y| rate)``: ``|2i sin(pi y/p)|^e ~ exp(e pi |Im y|/p)`` once ``|Im y| >~ 1/2``
    (denominators decay), and the largest exponential."""
    return max(0.0, sum(e / p for p, e in f.sines)) + max(abs(float(a)) for _, a in f.exps)


def _line_rate(term: PoleTerm) -> float:
    """The rate of :func:`_rate` of a line's integrand (one of ``A``, ``B`` times ``C``)."""
    return max(_rate(term.A), _rate(term.B)) + _rate(term.C)


#: ``parts`` of :class:`_Eval`: everything; the exact pieces (residues at integer points whose set
#: does not depend on ``K``) as polynomials in ``K``; the rest (quadrature and the residues it moves).
PARTS = ("all", "exact", "quad")


def _label_shift(phi: int, Dc: int) -> int:
    """The integer ``n`` with ``phi/Dc - n`` in ``(-1/2, 1/2]`` (the reduced phase of a label).

    >>> _label_shift(30, 40), _label_shift(-20, 40), _label_shift(20, 40)
    (1, -1, 0)
    """
    n = (2 * phi + Dc) // (2 * Dc)
    if 2 * (phi - n * Dc) == -Dc:
        n -= 1
    return n


def _zero(v) -> bool:
    """An exact zero (a structural zero of :meth:`_Eval.point`); a ball that merely contains 0 is kept."""
    return type(v) is acb and v == 0


class _Eval:
    """All pieces of one term at one ``K`` (``H > 0``), at the current precision.

    ``parts="exact"`` collects only the exact pieces — the iterated residues at the integer points
    crossed when a contour moves from ``C_{-1/2}`` to the half-integer ``yg`` next to its saddle,
    and those of the kernels — as polynomials in ``K`` times their phase label (:func:`.rootfn.laurent_in_K`):
    both the points and ``yg`` are independent of ``K``.  ``parts="quad"`` collects the rest (the
    line and plane quadratures, the residues between ``yg`` and the seated contour, every piece
    under a plane's label).  The two add up to ``parts="all"`` (CONVENTIONS §18.7, exact pieces)."""

    def __init__(self, term: PoleTerm, K: acb, H: int, P: int, digits: int, reduced: bool, theta: float,
                 fine_plane: bool = False, phi0: Fraction = Fraction(0), parts: str = "all"):
        if parts not in PARTS:
            raise ValueError(f"parts = {parts!r}: one of {PARTS}")
        self.parts = parts
        self.t = term
        cu, cw = term.offsets
        self.off = {"A": cu, "B": cw, "C": 0}
        self.fine_plane = fine_plane
        self.H, self.P = H, P
        self.reduced = reduced
        self.sc = Scale(K, K * H / (3 * P))
        pi = arb.pi()
        self.tau = (acb(0, 1) * arb(theta)).exp()
        cabs = float(abs(complex(self.sc.c.mid())))
        st = abs(math.sin(theta))
        growth = _plan_growth(theta, cabs, _line_rate(term))
        self.h, self.hl, self.S, T = pole_plan(math.sin(theta), cabs, digits, growth)
        # the plain rule for the plane (a check): exp(-pi |c| Q), Q >= 1.5 s^2 on the square's boundary
        self.J2 = int(math.ceil(self.S * math.sqrt(2 / 1.5) / self.h))
        self.step = self.tau * arb(self.h)
        # line integrals: the pole-corrected trapezoid rule (step limited by the Gaussian only)
        self.Jl = int(math.ceil(self.S / self.hl))
        self.lstep = self.tau * arb(self.hl)
        self.alpha = 2 * acb(0, 1) * arb.pi() / self.lstep
        self.window = (T + 20) * self.hl / (2 * math.pi * st)
        self.twopii = 2 * acb(0, 1) * pi
        self.K = K
        # exact pieces: K the polynomial variable; XK cancels the kernel's 1/(2 pi i K), which
        # laurent_in_K leaves out (numerically XK = 2 pi i K)
        self.scs = symbolic_scale(H, P) if parts == "exact" else None
        self.Kx = self.scs.K if parts == "exact" else K
        self.XK = acb(1) if parts == "exact" else self.sc.tpiK
        self.out: dict[Fraction, acb] = {}
        self._lc: dict = {}
        self._gc: dict = {}
        self._bc: dict = {}
        # a period of the sines and exponentials of each factor (None: grids are not shifted)
        self._period = {}
        for w in "ABC":
            f = getattr(term, w)
            per = math.lcm(*(p for p, _ in f.sines)) if f.sines else 1
            self._period[w] = per if period_phase(f, per) is not None else None
        # f(-y) = eps f(y) of the factor integrated along a line times that of C (None: no symmetry)
        self._rsign = {w: reflection_sign(getattr(term, w)) for w in "ABC"}
        cr = self._rsign["C"]
        self._refl = {w: None if cr is None or self._rsign[w] is None else cr * self._rsign[w] for w in "AB"}
        self._dc: dict = {}
        self._mc: dict = {}
        self._ex: dict = {}
        # phases are integers over Dc = 24 P H^2 D^2 (D: denominators of the coset offsets)
        D = math.lcm(Fraction(cu).denominator, Fraction(cw).denominator, Fraction(phi0).denominator)
        self.D = D
        self.Dc = 24 * P * H * H * D * D
        self.CU, self.CW = int(cu * D), int(cw * D)
        self.PHI0 = int(phi0 * self.Dc)
        self._nl = term.A.pole_order + term.B.pole_order + 2
        self._label = None       # set while the pieces of one integral are collected under its label
        # the exponentials e^{i pi a y} of a factor act as a shift -a/(2K) of its Fourier index:
        # the contours go through the half-integer next to the saddle they move (conditioning
        # only: the residues crossed are collected exactly, the phase labels are unchanged)
        Kc = complex(K.mid())

        def mean_a(f: RootFunction) -> float:
            return sum(float(a) for _, a in f.exps) / len(f.exps)

        self.aK = {w: mean_a(getattr(term, w)) / Kc for w in "ABC"}
        self._cot = math.cos(theta) / math.sin(theta)

    def _seat(self, y: Fraction, dy: complex) -> Fraction:
        """The half-integer next to where the steepest-descent line through the saddle ``y + dy``
        (direction ``e^{i theta}``) meets the real axis; ``floor(y) + 1/2`` when ``dy = 0``."""
        if dy == 0:
            return _half(y)
        x = float(y) + dy.real - dy.imag * self._cot
        return Fraction(math.floor(x)) + Fraction(1, 2)

    # phases ------------------------------------------------------------
    def _add(self, phi: int, value: acb):
        """Adds a piece ``value ~ exp(2 pi i K phi / Dc)`` (``phi`` an integer, ``Dc = 24 P H^2``)."""
        if self._label is not None:
            phi = self._label
        if self.reduced:
            Dc = self.Dc
            n = _label_shift(phi, Dc)
            if n:
                if self.parts != "exact":      # a polynomial in K carries no exponential
                    f = self._ex.get(n)
                    if f is None:
                        f = self._ex[n] = (-self.sc.tpiK * n).exp()
                    value = value * f
                phi -= n * Dc
        out = self.out
        out[phi] = out[phi] + value if phi in out else value

    def _gphase(self, u, w, s: int, r: int) -> int:
        """``phi * Dc`` for ``exp(-i pi c (u^2 + w^2 + (u+w)^2) - 2 pi i K ((s + c_u) u + (r + c_w) w))``
        times the coset constant ``exp(2 pi i K phi_0)``, ``= exp(2 pi i K phi)`` (``u``, ``w``
        integers or multiples of ``1/(2 H D)``)."""
        H2 = 2 * self.H * self.D
        U = u * H2
        W = w * H2
        if U.denominator != 1 or W.denominator != 1:
            raise ArithmeticError(f"phase at ({u}, {w}) is not on the grid 1/{H2}")
        U, W = int(U), int(W)
        S = s * self.D + self.CU
        R = r * self.D + self.CW
        return (-self.H * (U * U + W * W + (U + W) ** 2) - 12 * self.P * self.H * (S * U + R * W)
                + self.PHI0)

    # Laurent data (cached) ---------------------------------------------
    def lau(self, which: str, m: int, s: int, kernel: bool):
        """Laurent data of a factor at the integer ``m`` (cached; always ``pa + pb + 2`` terms,
        enough for every product taken here)."""
        key = (which, m, s, kernel)
        r = self._lc.get(key)
        if r is None:
            if self.parts == "exact":
                r = laurent_in_K(getattr(self.t, which), m, s + self.off[which], kernel, self._nl, self.scs)
            else:
                r = laurent(getattr(self.t, which), m, s + self.off[which], kernel, self._nl, self.sc)
            self._lc[key] = r
        return r

    def grid(self, which: str, y0: Fraction, s: int, L: int, sign: int = 1, J: int | None = None) -> list[list[acb]]:
        """``grid_series`` on ``y0 + sign j lstep``, ``|j| <= J`` (cached: many lines share a saddle).

        Grids whose ``y0`` differ by a period ``n`` of the sines (a multiple of their orders) are
        the same up to an exponential (:func:`.rootfn.shifted_grid`): every ``(y0, s)`` is derived
        from one grid per ``y0 mod period`` with index 0, about a tenth of the work per node."""
        J = self.Jl if J is None else J
        key = (which, y0, s, L, sign, J)
        g = self._gc.get(key)
        if g is None:
            for L2 in range(L + 1, self._nl + 1):      # a longer Taylor grid serves shorter requests
                g2 = self._gc.get((which, y0, s, L2, sign, J))
                if g2 is not None:
                    return [x[:L] for x in g2]
            f = getattr(self.t, which)
            per = self._period[which]
            if per is None:
                g = grid_series(f, _q(y0), sign * self.lstep, J, s + self.off[which], L, self.sc)
            else:
                n = per * math.floor(y0 / per)
                base = self._base(which, y0 - n, L, sign, J)
                g = shifted_grid(base, _q(y0 - n), n, sign * self.lstep, J, s + self.off[which],
                                 period_phase(f, n), L, self.sc)
            self._gc[key] = g
        return g

    def _base(self, which: str, y0: Fraction, L: int, sign: int, J: int) -> list[list[acb]]:
        """The grid of ``which`` at ``y0`` with Fourier index 0 (no offset), cached.

        The nodes of ``sign = -1`` are those of ``sign = 1`` in reverse order.  A factor with
        ``f(-y) = eps f(y)`` (:func:`.rootfn.reflection_sign`) at ``y0 > per/2`` is the reflection of
        its grid at ``-y0``, itself the grid at ``per - y0`` moved by the period: ``f(y0 + j h)`` is
        ``eps`` times ``f(-y0 - j h)``, and its ``l``-th Taylor coefficient takes ``(-1)^l``."""
        for L2 in range(L, self._nl + 1):
            b = self._bc.get((which, y0, L2, sign, J))
            if b is not None:
                return b if L2 == L else [x[:L] for x in b]
        f = getattr(self.t, which)
        per = self._period[which]
        eps = self._rsign[which]
        if sign == -1:
            b = self._base(which, y0, L, 1, J)[::-1]
        elif eps is not None and per is not None and 0 < per - y0 < y0:
            far = self._base(which, per - y0, L, 1, J)
            near = shifted_grid(far, _q(per - y0), -per, self.lstep, J, 0, period_phase(f, -per), L, self.sc)
            b = [[x if (l % 2 == 0) == (eps == 1) else -x for l, x in enumerate(row)] for row in near[::-1]]
        else:
            b = grid_series(f, _q(y0), sign * self.lstep, J, 0, L, self.sc)
        self._bc[(which, y0, L, sign, J)] = b
        return b

    def ctaylor(self, v: int, n: int) -> list[acb]:
        """Taylor coefficients of ``C`` at the integer ``v`` (``C`` is entire)."""
        val, co = self.lau("C", v, 0, False)
        if n > len(co):
            raise ValueError(f"Taylor length {n} > {len(co)}")
        return ([acb(0)] * val + co)[:n]

    # iterated residue at an integer point --------------------------------
    def _res2(self, v1: int, a, v2: int, b, v: int) -> acb:
        """``Res_x Res_y [x^v1 a(x) y^v2 b(y) C(v + x + y)]``: ``C(v + x + y)`` has the Taylor
        coefficients ``c_{p+q} binom(p+q, p)`` in ``(x, y)``."""
        g = self.ctaylor(v, (-v1) + (-v2))
        tot = acb(0)
        for i in range(-v1):
            p = -1 - v1 - i
            ai = a[i]
            for j in range(-v2):
                q = -1 - v2 - j
                tot += ai * b[j] * (g[p + q] * _COMB[p + q][p])
        return tot

    def point(self, fu: str, m: int, su: int, ku: bool, fw: str, mp: int, sw: int, kw: bool) -> acb:
        """``Res_x Res_y [F_u(m + x) F_w(mp + y) C(m + mp + x + y)]`` (with the kernels)."""
        v1, a = self.lau(fu, m, su, ku)
        if v1 >= 0:
            return acb(0)
        v2, b = self.lau(fw, mp, sw, kw)
        if v2 >= 0:
            return acb(0)
        return self._res2(v1, a, v2, b, m + mp)

    # the pole-corrected trapezoid rule on y0 + tau s ------------------------------
    def _mat(self, which: str, y0: Fraction, s: int, L: int, row: bool = False) -> acb_mat:
        """A grid as an ``acb_mat`` (``1 x n`` values, or ``n x L`` Taylor coefficients; cached)."""
        key = (which, y0, s, L, row)
        M = self._mc.get(key)
        if M is None:
            g = self.grid(which, y0, s, L)
            if row:
                M = acb_mat(1, len(g), [x[0] for x in g])
            else:
                M = acb_mat(len(g), L, [x for r in g for x in r[:L]])
            self._mc[key] = M
        return M

    def _dots(self, fint: str, y0: Fraction, s_int: int, m: int, L: int) -> list[acb]:
        """``[int_{C_y0} F(y) gamma_l(m + y) dy]_{l < L}``, ``gamma_l`` the Taylor coefficients of ``C``
        (cached: lines that differ only in the Laurent data of the fixed variable share them), by the
        pole-corrected trapezoid rule (:meth:`_rep_dots`).

        ``F`` carries the Fourier index ``sigma = s_int + offset``.  Most of these sums are one
        another's images under the exact symmetries of :meth:`_orbit` (periods of the sines with a
        shift of ``sigma``, and the reflection ``y -> -y``), so each orbit is summed once, at its
        representative, and the others follow exactly: node by node for the trapezoid sum, pole by pole
        for its corrections (the window of poles moves with the line)."""
        sig = s_int + self.off[fint]
        key = (fint, y0, sig, m)
        D = self._dc.get(key)
        if D is not None and len(D) >= L:
            return D
        rep, ops = self._orbit(fint, y0, sig, m)
        D = self._rep_dots(fint, *rep, L)
        for op in reversed(ops):
            D = self._undo(fint, op, D)
        self._dc[key] = D
        return D

    def _orbit(self, fint: str, y0: Fraction, sig: Fraction, mu: int):
        """The representative ``(y0', sigma', mu')`` of the orbit of the sum ``D(y0, sigma, mu)`` and
        the steps from it, CONVENTIONS §18.7 (exact identities of the nodes ``y_j = y0 + j h``):

        * ``F``: ``F(y + n) = e^{i pi theta_F - i pi c (2 n y + n^2)} F(y)`` for a period ``n`` of
          ``F``'s sines, so ``D(y0 + n, sigma, mu) = e^{i pi theta_F - i pi c n^2 - 2 pi i K sigma n}
          D(y0, sigma + c n/K, mu + n)``;
        * ``C``: the same for ``C``, whose Taylor coefficients pick up the series of
          ``e^{-2 pi i c n x}``: ``D(y0, sigma, mu + n) = e^{i pi theta_C - i pi c n^2 - 2 pi i c n mu}
          e^{-2 pi i c n x} D(y0, sigma + c n/K, mu)``;
        * ``R``: ``F(-y) = eps_F F(y)``, ``C(-y) = eps_C C(y)`` give ``D_l(y0, sigma, mu) =
          eps_F eps_C (-1)^l D_l(-y0, -sigma, -mu)`` (the nodes are symmetric in ``j``).

        ``c/K = H/(3P)``; ``y0'`` lies in ``[0, per_F)``, ``mu'`` in ``[0, per_C)``."""
        cK = Fraction(self.H, 3 * self.P)
        perF, perC = self._period[fint], self._period["C"]

        def reduce(y0, sig, mu, ops):
            if perF is not None:
                n = perF * math.floor(y0 / perF)
                if n:
                    ops.append(("F", n, sig))
                    y0, sig, mu = y0 - n, sig + cK * n, mu + n
            if perC is not None:
                n = perC * math.floor(Fraction(mu, perC))
                if n:
                    ops.append(("C", n, mu - n))
                    mu, sig = mu - n, sig + cK * n
            return (y0, sig, mu), ops

        rep, ops = reduce(y0, sig, mu, [])
        eps = self._refl[fint]
        if eps is not None:
            rep2, ops2 = reduce(-y0, -sig, -mu, [("R", eps)])
            if rep2 < rep:
                return rep2, ops2
        return rep, ops

    def _undo(self, fint: str, op, D: list[acb]) -> list[acb]:
        """The sums before one step of :meth:`_orbit` from those after it."""
        ipi, c = self.sc.ipi, self.sc.c
        if op[0] == "R":
            return [x if l % 2 == 0 else -x for l, x in enumerate(D)] if op[1] == 1 else \
                [-x if l % 2 == 0 else x for l, x in enumerate(D)]
        kind, n, v = op
        f = getattr(self.t, "C" if kind == "C" else fint)
        const = ipi * _q(period_phase(f, n)) - ipi * c * (n * n)
        if kind == "F":                                   # v = sigma before the step
            return [x * (const - self.sc.tpiK * _q(v) * n).exp() for x in D]
        lam = -2 * ipi * c * n                            # v = mu after the step
        ex = [acb(1)]
        for j in range(1, len(D)):
            ex.append(ex[-1] * lam / j)
        g = (const + lam * v).exp()
        return [g * x for x in ser_mul(D, ex, len(D))]

    def _rep_dots(self, fint: str, y0: Fraction, sig: Fraction, mu: int, L: int) -> list[acb]:
        """The integrals of :meth:`_dots` at a representative: the trapezoid sums (all from one matrix
        product) times the step, minus the error terms of the poles of ``F`` near the line
        (:meth:`_trap`), taken for each ``gamma_l`` separately since they are linear in it."""
        key = (fint, y0, sig, mu, "rep")
        D = self._dc.get(key)
        if D is not None and len(D) >= L:
            return D
        s = sig - self.off[fint]
        Fm = self._mat(fint, y0, s, 1, row=True)
        Cm = self._mat("C", y0 + mu, 0, L)
        R = Fm * Cm                                     # one C-level product for all L sums
        D = [R[0, l] * self.lstep for l in range(L)]
        for k in range(math.ceil(y0 - self.window), math.floor(y0 + self.window) + 1):
            vf, fc = self.lau(fint, k, s, False)
            p = -vf
            if p <= 0:
                continue
            sg, kap = self._kappa(k, y0, p)
            # the kernel's series times the Laurent data of F: Res_k[F gamma_l kappa] for each l
            fk = ser_mul(fc[:p], kap, p)
            gam = self.ctaylor(mu + k, L - 1 + p)
            for l in range(L):
                res = acb(0)
                for i in range(p):
                    j = p - 1 - i                       # Taylor order of gamma_l at k
                    res += fk[i] * (gam[l + j] * _COMB[l + j][j])
                D[l] -= sg * self.twopii * res
        self._dc[key] = D
        return D

    def _trap(self, y0: Fraction, vals, laur) -> acb:
        """``int_{C_y0} g`` from ``vals = [g(y0 + j lstep)]`` and ``laur(k) = (v, coeffs)`` of ``g`` at
        the integer ``k`` (``None`` when regular): the trapezoid sum minus, for each pole near the
        line, ``+-2 pi i Res[g q/(1 - q)]``, ``q = exp(+-2 pi i (y - y0)/lstep)``."""
        tot = acb(0)
        for x in vals:
            tot += x
        tot = tot * self.lstep
        lo = math.ceil(y0 - self.window)
        hi = math.floor(y0 + self.window)
        for k in range(lo, hi + 1):
            L = laur(k)
            if L is None:
                continue
            v, co = L
            p = -v
            if p <= 0:
                continue
            sg, kap = self._kappa(k, y0, p)
            res = acb(0)
            for i in range(p):
                res += co[i] * kap[p - 1 - i]
            tot -= sg * self.twopii * res
        return tot

    # line integrals -------------------------------------------------------
    def line(self, fixed: str, m: int, s_fix: int, k_fix: bool, s_int: int, base: Fraction,
             factor: acb):
        """``factor * int_{C_base} F_int(y) Res_x[F_fix(m + x) C(m + y + x)] dy`` (conditioned)."""
        fint = "B" if fixed == "A" else "A"
        v, a = self.lau(fixed, m, s_fix, k_fix)
        if v >= 0:
            return
        ystar = Fraction(-m, 2) - Fraction(3 * self.P) * (s_int + self.off[fint]) / (2 * self.H)
        yg = _half(ystar)

        def res(k: int) -> tuple[acb, int]:
            if fixed == "A":
                return (self.point("A", m, s_fix, k_fix, "B", k, s_int, False), self._gphase(m, k, s_fix, s_int))
            return self.point("A", k, s_int, False, "B", m, s_fix, k_fix), self._gphase(k, m, s_int, s_fix)

        # to the Gaussian's half-integer yg: each residue a piece of its own (exact pieces, unless
        # the line itself was shed by a K-dependent move of a plane, under the plane's label)
        if self.parts != "quad" or self._label is not None:
            sg, ks = _between(base, yg)
            for k in ks:
                val, ph = res(k)
                if not _zero(val):
                    self._add(ph, factor * sg * self.twopii * val)
        if self.parts == "exact":
            return
        y0 = self._seat(ystar, 3 * self.P * self.aK[fint] / (4 * self.H))
        # int_{C_yg} = int_{C_y0} + residues between (one piece: its label and its K-dependence
        # are those of the Gaussian's contour; y0 only conditions the quadrature)
        L = -v
        D = self._dots(fint, y0, s_int, m, L)
        tot = acb(0)
        for i in range(L):
            tot += a[i] * D[L - 1 - i]
        sg, ks = _between(yg, y0)
        for k in ks:
            val, _ = res(k)
            if not _zero(val):
                tot += sg * self.twopii * val
        # constant factor of the fixed variable is in a (its Laurent data includes it)
        if fixed == "A":
            ph = self._gphase(m, ystar, s_fix, s_int)
        else:
            ph = self._gphase(ystar, m, s_int, s_fix)
        self._add(ph, factor * tot)

    # the plane ----------------------------------------------------------------
    def plane(self, s: int, r: int, factor: acb):
        """``factor * int int_{C_{-1/2}^2} A_s(u) B_r(w) C(u + w)`` (conditioned)."""
        H, P = self.H, self.P
        sp, rp = s + self.off["A"], r + self.off["B"]
        us, ws = Fraction(-P) * (2 * sp - rp) / H, Fraction(-P) * (2 * rp - sp) / H
        dA, dB = -self.aK["A"] / 2, -self.aK["B"] / 2        # shifts of the Fourier indices
        ug, wg = _half(us), _half(ws)
        u0 = self._seat(us, -P * (2 * dA - dB) / H)
        w0 = self._seat(ws, -P * (2 * dB - dA) / H)
        base = Fraction(-1, 2)
        self._move_plane(s, r, base, ug, base, wg, factor)
        if self.parts == "exact":
            return
        # the plane on C_ug x C_wg is one piece; it is evaluated on the seated contours plus the
        # lines between, all under the plane's label
        label = self._gphase(us, ws, s, r)
        prev, self._label = self._label, label
        try:
            self._move_plane(s, r, ug, u0, wg, w0, factor)
        finally:
            self._label = prev
        if self.fine_plane:
            tot = self._plane_fine(u0, w0, s, r)
        else:
            tot = self._plane_corrected(u0, w0, s, r)
        self._add(label, factor * tot)

    def _move_plane(self, s: int, r: int, ua: Fraction, ub: Fraction, wa: Fraction, wb: Fraction, factor: acb):
        """The lines shed by moving the plane from ``C_ua x C_wa`` to ``C_ub x C_wb``: first ``u``
        (lines at ``u = k``, ``w`` on ``C_wa``), then ``w`` (lines at ``w = k``, ``u`` on ``C_ub``)."""
        tpi = self.twopii
        sg, ks = _between(ua, ub)
        for k in ks:
            self.line("A", k, s, False, r, wa, factor * sg * tpi)
        sg, ks = _between(wa, wb)
        for k in ks:
            self.line("B", k, r, False, s, ub, factor * sg * tpi)

    def _plane_fine(self, u0: Fraction, w0: Fraction, s: int, r: int) -> acb:
        """The plane by the plain tensor trapezoid rule, step below the pole distance (a check)."""
        J = self.J2
        u0b, w0b = _q(u0), _q(w0)
        Av = [x[0] for x in grid_series(self.t.A, u0b, self.step, J, s + self.off["A"], 1, self.sc)]
        Bv = [x[0] for x in grid_series(self.t.B, w0b, self.step, J, r + self.off["B"], 1, self.sc)]
        Cv = [x[0] for x in grid_series(self.t.C, u0b + w0b, self.step, 2 * J, 0, 1, self.sc)]
        return self._tensor(Av, Bv, Cv, J) * self.step * self.step

    @staticmethod
    def _tensor(Av, Bv, Cv, J) -> acb:
        """``sum_{i,j} A_i B_j C_{i+j}`` (indices ``-J..J``; ``C`` on ``-2J..2J``) by one product."""
        prod = acb_poly(Bv[::-1]) * acb_poly(Cv)      # x^(J - j) times x^(k + 2J)
        coeffs = prod.coeffs()
        tot = acb(0)
        for i in range(-J, J + 1):
            tot += Av[i + J] * coeffs[3 * J + i]
        return tot

    def _kappa(self, k: int, y0: Fraction, p: int) -> tuple[int, list[acb]]:
        """``(sign, series)`` of the trapezoid-error kernel at the pole ``k`` of a line through ``y0``:
        ``T_h - I = sum_k sign 2 pi i Res_k[g kappa]``."""
        up = k > y0
        a = self.alpha if up else -self.alpha
        qk = (a * (arb(k) - arb(y0.numerator) / y0.denominator)).exp()
        qs = [qk]
        fact = 1
        for j in range(1, p):
            fact *= j
            qs.append(qk * a ** j / fact)
        den = [1 - qs[0]] + [-x for x in qs[1:]]
        return (1 if up else -1), ser_mul(qs, ser_inv(den, p), p)

    def _plane_corrected(self, u0: Fraction, w0: Fraction, s: int, r: int) -> acb:
        """The plane by the tensor trapezoid rule with the Gaussian-limited step, minus the error
        terms of the poles near the two coordinate lines: ``I = QQ - E_u Q - Q E_w + E_u E_w``."""
        J = int(math.ceil(1.16 * self.Jl))      # exp(-1.5 pi |c| S^2) on the square's boundary
        h = self.lstep
        Av = [x[0] for x in self.grid("A", u0, s, 1, J=J)]
        Bv = [x[0] for x in self.grid("B", w0, r, 1, J=J)]
        Cv = [x[0] for x in self.grid("C", u0 + w0, 0, 1, J=2 * J)]
        tot = self._tensor(Av, Bv, Cv, J) * h * h
        tpi = self.twopii

        def corr(which: str, y0: Fraction, sv: int):
            out = []
            for k in range(math.ceil(y0 - self.window), math.floor(y0 + self.window) + 1):
                v, a = self.lau(which, k, sv, False)
                if v >= 0:
                    continue
                sg, kap = self._kappa(k, y0, -v)
                out.append((k, sg, v, ser_mul(a, kap, -v)))
            return out

        cu = corr("A", u0, s)
        cw = corr("B", w0, r)
        # E_u (x) Q_w and Q_u (x) E_w: the pole errors of one variable, summed over the other's nodes
        def edge(corrs, other0: Fraction, other_vals) -> acb:
            out = acb(0)
            for k, sg, v, a in corrs:
                L = -v
                Cg = self.grid("C", k + other0, 0, L, J=J)
                acc = acb(0)
                for x, cg in zip(other_vals, Cg):
                    rr = acb(0)
                    for i in range(L):
                        rr += a[i] * cg[L - 1 - i]
                    acc += x * rr
                out += sg * acc
            return out

        tot -= tpi * h * (edge(cu, w0, Bv) + edge(cw, u0, Av))
        # E_u (x) E_w
        for k, sg, v1, a in cu:
            for kp, sg2, v2, b in cw:
                tot += sg * sg2 * tpi * tpi * self._res2(v1, a, v2, b, k + kp)
        return tot

    # the third family ---------------------------------------------------------
    def third_line(self, m: int, factor: acb):
        """``factor * sum_{b mod 3PK, K !| b} A(u) B(m - u) C(m)``, ``u = b/K`` (rank one LR)."""
        H, P, K = self.H, self.P, self.Kx
        Cm = self.ctaylor(m, 1)[0]
        f = factor * Cm
        n = self._nl

        def laur(k: int, s: int, kernel: bool):
            v1, a = self.lau("A", k, s, kernel)
            v2, b = self.lau("B", m - k, 0, False)
            b = [x * (-1) ** (i + v2) for i, x in enumerate(b)]     # B(m - k - x)
            v = v1 + v2
            if v >= 0:
                return None
            return v, ser_mul(a, b, n)

        def res(k: int, s: int, kernel: bool) -> acb:
            """The one coefficient of ``laur`` that is the residue."""
            v1, a = self.lau("A", k, s, kernel)
            v2, b = self.lau("B", m - k, 0, False)
            top = -1 - v1 - v2
            if top < 0:
                return acb(0)
            tot = acb(0)
            for i in range(top + 1):
                j = top - i
                tot += a[i] * b[j] if (j + v2) % 2 == 0 else -(a[i] * b[j])
            return tot

        def ph(k, t):
            return self._gphase(k, m - k, t, 0)

        exact, quad = self.parts != "quad", self.parts != "exact"
        # - 2 pi i K sum_{k < 3P} Res_{u=k}[A(u) B(m-u) k(u - k)]   (2 pi i K = XK with the kernel)
        for k in range(3 * P if exact else 0):
            val = res(k, 0, True)
            if not _zero(val):
                self._add(ph(k, 0), -f * self.XK * val)
        # K sum_{t < 2H} int_{C_{-1/2}} A_t(u) B(m - u) du
        base = Fraction(-1, 2)
        for t in range(2 * H):
            ustar = Fraction(m, 2) - Fraction(3 * P) * (t + self.off["A"] - self.off["B"]) / (2 * H)
            ug = _half(ustar)
            if exact:
                sg, ks = _between(base, ug)
                for k in ks:
                    val = res(k, t, False)
                    if not _zero(val):
                        self._add(ph(k, t), f * K * sg * self.twopii * val)
            if not quad:
                continue
            u0 = self._seat(ustar, -3 * P * (self.aK["B"] - self.aK["A"]) / (4 * H))
            Av = self.grid("A", u0, t, 1)
            Bv = self.grid("B", m - u0, 0, 1, -1)
            tot = self._trap(u0, [x[0] * y[0] for x, y in zip(Av, Bv)], lambda k, t=t: laur(k, t, False))
            sg, ks = _between(ug, u0)          # the piece is the integral on C_ug (see line)
            for k in ks:
                tot += sg * self.twopii * res(k, t, False)
            self._add(ph(ustar, t), f * K * tot)

    # assembly ------------------------------------------------------------------
    def run(self) -> dict:
        """``{phi: piece}`` (``parts="exact"``: ``{integer label: polynomial in K}``, labels reduced
        as the pieces' when ``reduced``; see :func:`_exact_pieces`)."""
        H, P, K = self.H, self.P, self.Kx
        tpi, XK = self.twopii, self.XK
        K2 = K * K
        third = acb(1) / 3
        base = Fraction(-1, 2)
        # bulk
        for s in range(H):
            for r in range(H):
                self.plane(s, r, third * K2)
        for s in range(H, 2 * H):
            for r in range(2 * H):
                self.plane(s, r, third * K2)
        # - 2 pi i K^2 sum_{m < 3P, r < 2H} int Res_{u=m}[T k(u - m)] e^{-2 pi i K r w} dw
        # (with a kernel, 2 pi i K = XK: laurent_in_K leaves the kernel's 1/(2 pi i K) out)
        for m in range(3 * P):
            for r in range(2 * H):
                self.line("A", m, 0, True, r, base, -third * K * XK)
        # + 2 pi i K^2 sum_{m; r, r' < H} int Res_{u=m}[T e^{-2 pi i K r u}] e^{-2 pi i K (H + r') w} dw
        for m in range(3 * P):
            for r in range(H):
                for rp in range(H):
                    self.line("A", m, r, False, H + rp, base, third * tpi * K2)
        # - 2 pi i K^2 sum_{m' < 3P, t < 2H} int du Res_{w=m'}[T e^{-2 pi i K t u} k(w - m')]
        for mp in range(3 * P):
            for t in range(2 * H):
                self.line("B", mp, 0, True, t, base, -third * K * XK)
        # + (2 pi i)^2 K^2 sum_{m, m'} Res_{w=m'} Res_{u=m}[T k(u - m) k(w - m')]
        for m in range(3 * P if self.parts != "quad" else 0):
            for mp in range(3 * P):
                val = self.point("A", m, 0, True, "B", mp, 0, True)
                if not _zero(val):
                    self._add(self._gphase(m, mp, 0, 0), third * XK * XK * val)
        # the third family, subtracted (its lattice sums vanish for the odd terms: odd_third_family)
        if not (SKIP_ODD_THIRD and odd_third_family(self.t)):
            for m in range(P):
                self.third_line(m, acb(-1))
        if self.parts == "exact":
            return dict(self.out)
        if self.PHI0:
            # the coset constant exp(2 pi i K phi_0): in every label (``_gphase``), here in the values
            f0 = (self.sc.tpiK * (acb(self.PHI0) / self.Dc)).exp()
            return {Fraction(k, self.Dc): v * f0 for k, v in self.out.items()}
        return {Fraction(k, self.Dc): v for k, v in self.out.items()}


#: Exact pieces already computed: ``key -> (precision in bits, {label: polynomial in K})``; at most
#: :data:`EXACT_CACHE` entries (one per term and coset), the oldest dropped first.
_EXACT: dict = {}
EXACT_CACHE = 64


def _exact_pieces(key, make) -> dict[Fraction, acb_poly]:
    """``{phi: P_phi}`` with the exact pieces of one term ``= sum_phi P_phi(K) exp(2 pi i K phi)``
    (``P_phi`` a polynomial with ball coefficients), computed once per ``key`` at a precision at
    least the current one (``make()`` gives the ``_Eval`` in ``parts="exact"``).

    Every exact piece is an iterated residue at integer points times a constant factor; its
    Laurent data are ``exp(2 pi i K phi)`` (its label) times polynomials in ``K``
    (:func:`.rootfn.laurent_in_K`), so pieces with one reduced label add up to one polynomial:
    a few dozen polynomials replace some ten thousand residues at every further ``K`` (Σ(2,3,5))."""
    hit = _EXACT.get(key)
    if hit is not None and hit[0] >= ctx.prec:
        return hit[1]
    ev = make()
    grouped = {Fraction(phi, ev.Dc): v for phi, v in ev.run().items()}
    _EXACT.pop(key, None)
    while len(_EXACT) >= EXACT_CACHE:
        del _EXACT[next(iter(_EXACT))]
    _EXACT[key] = (ctx.prec, grouped)
    return grouped


def pole_sum_sectors(orders: tuple[int, ...], H: int, P: int, K: acb, digits: int,
                     reduced: bool = True, fine_plane: bool = False, cosets=None,
                     genus: int = 0, parts: str = "all") -> dict[Fraction, acb]:
    """``{phi: piece}`` with ``sum = S(K)`` of §18.1 for SU(3) (``H != 0``, genus 0, three orders).

    Orders sharing a factor (§18.8): ``cosets`` lists the cosets (:meth:`CartanData.cosets`, given
    for the orientation of ``H``; default: the one coset of pairwise coprime orders), and
    ``H``, ``P`` are the period data ``H L/P``, ``L = lcm p_j`` of every coset; the sum is
    ``sum_s weight_s exp(-2 pi i K const_s) S_s(K)``.  Base genus ``g``: ``Delta(z)^(n - 2 + 2g)`` in
    the denominator (§18.9).

    ``phi`` is the Chern–Simons phase of the piece (``exp(2 pi i K phi)``), reduced to
    ``(-1/2, 1/2]`` when ``reduced``.  One run at the current precision (the caller compares two).

    ``parts``: ``"all"``; ``"exact"``, the iterated residues whose points do not depend on ``K``,
    from polynomials in ``K`` computed once per space and cached (:func:`_exact_pieces`);
    ``"quad"``, the rest.  ``"exact"`` and ``"quad"`` add up to ``"all"``.

    Examples
    --------
    The Poincaré sphere at ``K = 12`` against the finite sum of §18.1 (``Z = B_3 K^-2 S``), whose
    value by the localisation route is ``Z_9(Sigma(2,3,5))``:

    >>> from knotobs.continuation._num import bits, working_bits
    >>> from knotobs.continuation.cartan.data import B_N, CartanData
    >>> from knotobs.localisation import localisation_partition_function
    >>> with working_bits(bits(12)):
    ...     K = acb(12)
    ...     S = sum(pole_sum_sectors((2, 3, 5), 1, 30, K, 12).values(), acb(0))
    ...     z = complex((B_N(CartanData.from_space("Sigma(2,3,5)", 3), K) * S / (K * K)).mid())
    >>> abs(z - complex(localisation_partition_function("Sigma(2,3,5)", "SU(3)", 9).numeric)) < 1e-10
    True

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (the rank-one step).
    """
    if H < 0:
        Kc = K.conjugate()
        neg = None if cosets is None else [c.negated() for c in cosets]       # (the trivial one is its own)
        res = pole_sum_sectors(orders, -H, P, Kc, digits, reduced, fine_plane, neg, genus, parts)
        return {-phi: v.conjugate() for phi, v in res.items()}
    if parts not in PARTS:
        raise ValueError(f"parts = {parts!r}: one of {PARTS}")
    theta = _theta(H, complex(K.mid()))
    out: dict[Fraction, acb] = {}
    deg = len(orders) - 2 + 2 * genus
    tpiK = 2 * acb(0, 1) * arb.pi() * K
    for co, i, term in coset_terms(orders, cosets, genus):
        if parts == "exact":
            key = (tuple(orders), H, P, co.shifts, co.lin, co.const, deg, reduced, i)
            polys = _exact_pieces(key, lambda: _Eval(term, K, H, P, digits, reduced, theta, False, -co.const,
                                                     "exact"))
            items = ((phi, poly(K) * (tpiK * _q(phi)).exp()) for phi, poly in polys.items())
        else:
            items = _Eval(term, K, H, P, digits, reduced, theta, fine_plane, -co.const, parts).run().items()
        for phi, v in items:
            if co.weight != 1:
                v = v * co.weight
            out[phi] = out.get(phi, acb(0)) + v
    return out


def _theta(H: int, K: complex) -> float:
    """Direction of every contour for ``H > 0`` (``K`` conjugated first when ``H < 0``)."""
    if H < 0:
        K = K.conjugate()
    argK = math.atan2(K.imag, K.real)
    if argK <= -math.pi / 2:
        argK += 2 * math.pi
    return -math.pi / 4 - argK / 2


#: The contours need ``|sin theta| >= MIN_SIN``: ``K`` away from the cut ``arg K = -sign(H) pi/2``.
MIN_SIN = 0.05


def pole_domain(H: int, K: complex) -> None:
    """Refuses ``K = 0`` and ``K`` on (or too near) the cut ``arg K = -sign(H) pi/2``.

    >>> pole_domain(1, 7.5 + 0.3j)
    >>> try:
    ...     pole_domain(1, -5j)
    ... except Exception as e:
    ...     print(str(e)[:45])
    K = 0-5i lies on the cut arg K = -pi/2 of the
    """
    from knotobs.continuation.level import DomainError

    if K == 0:
        raise DomainError("K = 0: the continuation is defined for K != 0")
    st = abs(math.sin(_theta(H, K)))
    if st < MIN_SIN:
        side = "-pi/2" if H > 0 else "+pi/2"
        raise DomainError(
            f"K = {K.real + 0.0:g}{K.imag:+g}i lies on the cut arg K = {side} of the SU(3) continuation with poles"
            f" (H = {H} {'>' if H > 0 else '<'} 0): the contours through the half-integers would meet"
            f" the poles; use K off that ray (|sin theta| >= {MIN_SIN}, theta = -pi/4 - arg(K)/2)")


def pole_range_digits(orders: tuple[int, ...], H: int, P: int, K: complex, cosets=None, genus: int = 0) -> float:
    """Decimal digits lost to the size of the integrands: along a line the integrand is at most
    about ``max_s exp(growth s - pi b s^2) = exp(growth^2/(4 pi b))`` (:func:`pole_plan`) while the
    integral is of order one, so the sum of the trapezoid rule cancels that many digits.  Small
    ``|K|`` (a wide Gaussian, ``b = 2 |K| |H|/(3P)``) needs many (about 120 at ``K = 0.5 + 0.2i`` on
    Σ(2,3,5)); near ``K = 7`` about 9.  An upper estimate: measured losses are 70-90% of it.

    >>> 5 < pole_range_digits((2, 3, 5), 1, 30, 6.7 + 0.3j) < 15 < 100 < pole_range_digits((2, 3, 5), 1, 30, 0.5 + 0.2j)
    True
    """
    H = abs(H)
    theta = _theta(H, K)
    cabs = abs(K) * H / (3 * P)
    st = abs(math.sin(theta))
    rate = max(_line_rate(t) for _, _, t in coset_terms(orders, cosets, genus))
    g = _growth(st, cabs, rate)                        # along the line: the values summed
    return g * g / (4 * math.pi * 2 * cabs) / math.log(10)


def pole_cost(orders: tuple[int, ...], H: int, P: int, K: complex, digits: int,
              cosets=None, genus: int = 0) -> tuple[float, str]:
    """``(ball operations, description)`` of one evaluation of :func:`pole_sum_sectors`.

    Counts the grid nodes of every line integral (``~ 3P (H^2 + 4H)`` lines per term plus
    the contour shifts of the planes, ``~ 2P`` each) and the iterated residues (``(3P)^2``
    per term plus those collected when a line is moved to its saddle).

    >>> ops, what = pole_cost((2, 3, 5), 1, 30, 12.0, 30)
    >>> 1e5 < ops < 1e8 and "line integrals" in what
    True
    """
    lines_ops, points_ops, what = pole_cost_parts(orders, H, P, K, digits, cosets, genus)
    return lines_ops + points_ops, what


def pole_line_count(orders: tuple[int, ...], H: int, P: int, cosets=None, genus: int = 0) -> tuple[int, int]:
    """``(line integrals, terms)`` of the formula of CONVENTIONS §18.7 (``~ 3P (H^2 + 4H)`` lines per
    term plus the contour shifts of the planes, ``~ 2P`` each, and the third-family lines of the
    terms that are not odd), counted before the symmetries that spare most of them.

    >>> pole_line_count((2, 3, 5), 1, 30)
    (630, 1)
    """
    H = abs(H)
    terms = [t for _, _, t in coset_terms(orders, cosets, genus)]
    nterms = len(terms)
    odd = sum(1 for t in terms if SKIP_ODD_THIRD and odd_third_family(t))     # no third-family lines
    return nterms * (3 * P * (H * H + 4 * H) + 3 * H * H * 2 * P) + (nterms - odd) * 2 * P * H, nterms


def pole_line_nodes(orders: tuple[int, ...], H: int, P: int, K: complex, digits: int) -> int:
    """Nodes of one line integral at ``K`` to ``digits`` digits (:func:`pole_plan`; they grow like
    ``|K|`` at large ``|K|``: the step follows the Gaussian, the cut-off the growth of the sines).

    >>> pole_line_nodes((2, 3, 5), 1, 30, 12.0, 30) < pole_line_nodes((2, 3, 5), 1, 30, 1.2e5, 30)
    True
    """
    H = abs(H)
    theta = _theta(H, K)
    cabs = abs(K) * H / (3 * P)
    growth = _plan_growth(theta, cabs, 2 * (sum(1 / p for p in orders) + 1))
    _, h, S, _ = pole_plan(math.sin(theta), cabs, digits, growth)
    return 2 * int(math.ceil(S / h)) + 1


def pole_cost_parts(orders: tuple[int, ...], H: int, P: int, K: complex, digits: int,
                    cosets=None, genus: int = 0) -> tuple[float, float, str]:
    """:func:`pole_cost` split into the line integrals (every value) and the iterated residues
    (mostly the exact pieces, computed once per space and cached)."""
    nodes = pole_line_nodes(orders, H, P, K, digits)
    lines, nterms = pole_line_count(orders, H, P, cosets, genus)
    points = nterms * ((3 * P) ** 2 + lines * P // 2)
    # measured: higher poles cost more per line (Taylor grids) and per residue (longer series)
    deg = len(orders) - 2 + 2 * genus
    scale = 0.55 if deg <= 1 else 0.6 * deg ** 1.3
    return (25.0 * lines * nodes * scale, 30.0 * points * scale,
            f"{lines} line integrals of {nodes} nodes, about {points} iterated residues")
