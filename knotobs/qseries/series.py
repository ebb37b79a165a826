r"""The q-series invariants ``Zhat_b(q)`` of negative definite plumbings (CONVENTIONS §13).

For a negative definite plumbing tree with linking matrix ``B`` (``s`` vertices, signature
``sigma = -s``, ``pi = 0`` positive eigenvalues) and a label ``b`` (:mod:`knotobs.qseries.labels`)

    ``Zhat_b(q) = (-1)^pi q^((3 sigma - tr B)/4) * v.p. oint prod_v dx_v/(2 pi i x_v) (x_v - 1/x_v)^(2 - deg v)
                 * sum_{l in b + 2 B Z^s} q^(-(l, B^-1 l)/4) x^l``

(S. Gukov, D. Pei, P. Putrov and C. Vafa, J. Knot Theory Ramifications 29 (2020) 2040003,
arXiv:1701.06567, §3 and App. A; M. Cheng, S. Chun, F. Ferrari, S. Gukov and S. Harrison, JHEP
2019(10) 010), so the prefactor is ``q^(-(3s + tr B)/4)``.  The contour integral takes the
constant term in every ``x_v``.  The vertex factors are expanded as follows:

* ``deg v = 1``: ``x - 1/x``; ``deg v = 2``: ``1``; ``deg v = 0`` (a single vertex): ``x^2 - 2 + x^-2``;
* ``deg v = d >= 3`` ("v.p.", the symmetric expansion): half the sum of the expansions in
  ``|x| < 1`` and ``|x| > 1``, i.e. the coefficient of ``x^m`` is
  ``(1/2) s_d(m) binom((|m| + d - 4)/2, d - 3)`` for ``m = d mod 2`` (zero otherwise), with
  ``s_d(m) = 1`` for ``m < 0`` and ``(-1)^d`` for ``m > 0``.

Hence, with ``c(n) = prod_v c_v(n_v)`` the product of these coefficients,

    ``Zhat_b(q) = q^(-(3s + tr B)/4) sum_{n in b + 2 B Z^s} c(n) q^(-(n, B^-1 n)/4)``

(the constant term picks ``l = -n``; the sum is the same for ``b`` and ``-b`` because
``c(-n) = (-1)^(sum deg) c(n) = c(n)``).  The powers of ``q`` in one class differ by integers,
so ``Zhat_b = q^Delta_b (c_0 + c_1 q + c_2 q^2 + ...)``; knotobs takes ``Delta_b`` at the first
non-zero coefficient.  The coefficients lie in ``2^-h Z`` (``h`` = number of vertices of
degree ``>= 3``); they are printed as integers over a common power of two (``denominator``,
usually ``1``).  The orientation is the one in which the plumbing is negative definite; for
a Seifert manifold that is ``e < 0`` (``Sigma(2,3,5)`` as the link of ``x^2 + y^3 + z^5 = 0``,
the boundary of the negative E8 plumbing), giving ``q^(-3/2) (1 - q - q^3 - q^7 + q^8 + ...)``.

Only the vertices of degree ``!= 2`` carry non-zero ``n_v``; the sum runs over the leaf signs
and, for the vertices of degree ``>= 3``, over the lattice points of an ellipsoid (Fincke–Pohst
enumeration with the class condition ``B^-1 (n - b)/2 in Z^s`` solved exactly as a congruence
for the innermost coordinate).  Everything is exact integer arithmetic.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from fractions import Fraction
from itertools import product
from typing import Iterator

from knotobs.errors import KnotobsError, SizeLimitError
from knotobs.guard import require, seconds_for
from knotobs.qseries.labels import Label, LabelSystem
from knotobs.qseries.plumbing import PlumbingGraph, plumbing_of

__all__ = ["QSeries", "PlumbingLattice", "zhat", "zhat_all", "guard_all_labels", "qseries_for", "vertex_coefficient", "MAX_ORDER"]

#: Largest truncation order accepted.
MAX_ORDER = 10**6


def vertex_coefficient(d: int, m: int) -> Fraction:
    """Coefficient of ``x^m`` in the expansion of ``(x - 1/x)^(2-d)`` used for a vertex of degree ``d``.

    >>> [vertex_coefficient(3, m) for m in (-3, -1, 1, 3)]
    [Fraction(1, 2), Fraction(1, 2), Fraction(-1, 2), Fraction(-1, 2)]
    >>> [vertex_coefficient(4, m) for m in (-4, -2, 0, 2, 4)]
    [Fraction(1, 1), Fraction(1, 2), Fraction(0, 1), Fraction(1, 2), Fraction(1, 1)]
    >>> [vertex_coefficient(0, m) for m in (-2, 0, 2)], vertex_coefficient(1, -1)
    ([Fraction(1, 1), Fraction(-2, 1), Fraction(1, 1)], Fraction(-1, 1))

    References
    ----------
    Gukov, Pei, Putrov & Vafa (2020), App. A; CONVENTIONS §13.
    """
    return Fraction(_vertex_int(d, m), 2 if d >= 3 else 1)


def _vertex_int(d: int, m: int) -> int:
    """Twice (for ``d >= 3``) or once the vertex coefficient, an integer."""
    if d == 2:
        return 1 if m == 0 else 0
    if d == 1:
        return m if m in (1, -1) else 0
    if d == 0:
        return {2: 1, 0: -2, -2: 1}.get(m, 0)
    if (m - d) % 2 or abs(m) < d - 2:
        return 0
    c = math.comb((abs(m) + d - 4) // 2, d - 3)
    return c if (m < 0 or d % 2 == 0) else -c


class PlumbingLattice:
    """Exact data of a negative definite plumbing for the lattice sum (module docstring).

    Examples
    --------
    >>> lat = PlumbingLattice("Plumb(-2,-2,-2,-2,-2,-2,-2,-2 : 1-2, 2-3, 3-4, 4-5, 5-6, 6-7, 3-8)")
    >>> lat.det, lat.base_exponent, lat.high
    (1, Fraction(-2, 1), (2,))
    """

    def __init__(self, graph):
        from flint import fmpz_mat

        g = graph if isinstance(graph, PlumbingGraph) else plumbing_of(graph)[0]
        g.require_negative_definite()
        self.graph = g
        s = g.size
        self.s = s
        B = g.linking_matrix()
        self.B = B
        M = fmpz_mat(B)
        self.det = int(M.det())
        inv = M.inv()  # fmpq_mat
        self.adj = [[int(inv[i, j] * self.det) for j in range(s)] for i in range(s)]
        self.sgn = 1 if self.det > 0 else -1
        self.D = 4 * abs(self.det)                 # Q(n) = num(n)/D
        self.M = 2 * abs(self.det)                 # class condition: adj (n - b) = 0 mod M
        self.deg = g.degrees
        self.leaves = tuple(v for v in range(s) if self.deg[v] == 1)
        self.high = tuple(v for v in range(s) if self.deg[v] >= 3)
        self.iso = tuple(v for v in range(s) if self.deg[v] == 0)
        self.base_exponent = Fraction(-3 * s - g.trace, 4)
        self.labels = LabelSystem(g)

    # ------------------------------------------------------------ helpers
    def num(self, n: dict[int, int]) -> int:
        """``D * Q(n)`` with ``Q(n) = -(n, B^-1 n)/4`` for a sparse ``n``."""
        items = list(n.items())
        t = 0
        for u, x in items:
            row = self.adj[u]
            for v, y in items:
                t += row[v] * x * y
        return -self.sgn * t

    def _fixed_choices(self) -> Iterator[tuple[dict[int, int], int]]:
        """Leaf signs (and the value of an isolated vertex), with their integer coefficient."""
        if self.iso:
            v = self.iso[0]
            for m, c in ((2, 1), (0, -2), (-2, 1)):
                yield {v: m}, c
            return
        for eps in product((1, -1), repeat=len(self.leaves)):
            yield dict(zip(self.leaves, eps)), math.prod(eps)

    def terms(self, b: tuple[int, ...], cut: int) -> Iterator[tuple[int, int]]:
        """``(D Q(n), 2^h c(n))`` for every ``n in b + 2 B Z^s`` with ``c(n) != 0`` and ``D Q(n) <= cut``."""
        adj, M, sgn = self.adj, self.M, self.sgn
        s = self.s
        adj_b = [sum(adj[i][j] * b[j] for j in range(s)) for i in range(s)]
        H = self.high
        h = len(H)
        if h:
            A = [[-sgn * adj[u][v] for v in H] for u in H]
            fp = _FinckePohst(A)
        for fixed, cfix in self._fixed_choices():
            y0 = [sum(adj[i][u] * x for u, x in fixed.items()) - adj_b[i] for i in range(s)]
            if not h:
                if all(v % M == 0 for v in y0):
                    nm = self.num(fixed)
                    if nm <= cut:
                        yield nm, cfix
                continue
            # num(x) = x^T A x + 2 g.x + c for the high coordinates x
            gvec = [sum(-sgn * adj[u][v] * x for v, x in fixed.items()) for u in H]
            c0 = self.num(fixed)
            yield from self._high_terms(fp, gvec, c0, cfix, fixed, y0, cut)

    def _high_terms(self, fp, gvec, c0, cfix, fixed, y0, cut):
        adj, M = self.adj, self.M
        H = self.high
        h = len(H)
        inner = H[0]
        col = [adj[i][inner] for i in range(self.s)]
        A = fp.A
        d_in = self.deg[inner]
        for outer, lo, hi in fp.enumerate(gvec, c0, cut):
            # outer: values of H[1:], (lo, hi): real bounds for x_inner
            y = list(y0)
            nvals = dict(fixed)
            for k, x in enumerate(outer, start=1):
                if x:
                    u = H[k]
                    for i in range(self.s):
                        y[i] += adj[i][u] * x
                    nvals[u] = x
            ap = _solve_congruence(col, y, M)
            if ap is None:
                continue
            r, m = ap
            # coefficient of the outer high vertices
            cout = cfix
            for k, x in enumerate(outer, start=1):
                cout *= _vertex_int(self.deg[H[k]], x)
                if not cout:
                    break
            if not cout:
                continue
            # num as a quadratic in x_inner: a x^2 + bb x + cc
            a = A[0][0]
            bb = 2 * gvec[0] + 2 * sum(A[0][k] * x for k, x in enumerate(outer, start=1))
            cc = c0 + 2 * sum(gvec[k] * x for k, x in enumerate(outer, start=1)) + sum(
                A[i][j] * outer[i - 1] * outer[j - 1] for i in range(1, h) for j in range(1, h))
            start = math.floor(lo) - 1
            start += (r - start) % m
            x = start
            stop = math.ceil(hi) + 1
            while x <= stop:
                cv = _vertex_int(d_in, x)
                if cv:
                    nm = a * x * x + bb * x + cc
                    if nm <= cut:
                        yield nm, cout * cv
                x += m

    def class_has_support(self, b) -> bool:
        """Whether some ``n`` in ``b + 2BZ^s`` has the shape of the support (leaf signs fixed).

        Exact for at most one vertex of degree ``>= 3`` (the congruence for it is solved);
        with more such vertices ``True`` (the enumeration then decides).
        """
        if len(self.high) != 1:
            return True
        adj, s = self.adj, self.s
        v0 = self.high[0]
        col = [adj[i][v0] for i in range(s)]
        adj_b = [sum(adj[i][j] * b[j] for j in range(s)) for i in range(s)]
        for fixed, _ in self._fixed_choices():
            y0 = [sum(adj[i][u] * x for u, x in fixed.items()) - adj_b[i] for i in range(s)]
            if _solve_congruence(col, y0, self.M) is not None:
                return True
        return False

    def minimum_estimate(self) -> int:
        """A lower bound of ``D Q(n)`` over every ``n`` in the support (any class)."""
        if not self.high:
            return min(self.num(f) for f, _ in self._fixed_choices())
        H = self.high
        A = [[-self.sgn * self.adj[u][v] for v in H] for u in H]
        fp = _FinckePohst(A)
        best = None
        for fixed, _ in self._fixed_choices():
            gvec = [sum(-self.sgn * self.adj[u][v] * x for v, x in fixed.items()) for u in H]
            mn = fp.real_minimum(gvec, self.num(fixed))
            best = mn if best is None else min(best, mn)
        return math.floor(best)

    def count_estimate(self, span: int) -> float:
        """Rough number of lattice points with ``D Q <= minimum + span`` (for the guard)."""
        nfix = 3 if self.iso else 2 ** len(self.leaves)
        if not self.high:
            return float(nfix)
        H = self.high
        A = [[-self.sgn * self.adj[u][v] for v in H] for u in H]
        fp = _FinckePohst(A)
        box = 1.0
        for k, d in enumerate(fp.d):
            w = 2 * math.sqrt(max(span, 1) / d) + 1
            box *= w / 2 if k == 0 else w       # the inner coordinate has the parity step
        return nfix * box


class _FinckePohst:
    """Enumerate integer points of ``x^T A x + 2 g.x + c <= cut`` (A positive definite, exact ints)."""

    def __init__(self, A):
        self.A = A
        h = len(A)
        Af = [[float(x) for x in row] for row in A]
        self.d = []
        self.mu = []
        cur = Af
        for i in range(h):
            p = cur[0][0]
            if p <= 0:  # pragma: no cover - A is positive definite
                raise KnotobsError("internal: quadratic form not positive definite")
            self.d.append(p)
            self.mu.append([x / p for x in cur[0][1:]])
            cur = [[cur[a][b] - cur[a][0] * cur[0][b] / p for b in range(1, len(cur))]
                   for a in range(1, len(cur))]
        self.h = h
        self.Afrac = [[Fraction(x) for x in row] for row in A]

    def centre(self, g):
        """The real minimiser ``-A^-1 g`` (floats) and the minimum value shift."""
        from flint import fmpq_mat

        h = self.h
        Am = fmpq_mat(h, h, [x for row in self.A for x in row])
        gm = fmpq_mat(h, 1, [-x for x in g])
        xs = Am.solve(gm)
        return [Fraction(int(xs[i, 0].p), int(xs[i, 0].q)) for i in range(h)]

    def real_minimum(self, g, c) -> Fraction:
        xs = self.centre(g)
        return c + sum(Fraction(g[i]) * xs[i] for i in range(self.h))

    def enumerate(self, g, c, cut):
        """Yield ``(outer values x_1..x_{h-1}, lo, hi)`` with real bounds for ``x_0``."""
        xs = self.centre(g)
        mn = c + sum(Fraction(g[i]) * xs[i] for i in range(self.h))
        R = float(cut - mn)
        if R < 0:
            return
        xc = [float(x) for x in xs]
        h = self.h
        slack = 1e-9 * (abs(R) + 1)

        def rec(i, chosen, rem):
            # chosen: dict index -> integer value for indices > i; y_j = x_j - xc_j
            ctr = xc[i] - sum(self.mu[i][j - i - 1] * (chosen[j] - xc[j]) for j in range(i + 1, h))
            wd = math.sqrt(max(rem, 0.0) / self.d[i]) + slack + 1e-7
            if i == 0:
                yield tuple(chosen[j] for j in range(1, h)), ctr - wd, ctr + wd
                return
            for x in range(math.ceil(ctr - wd) - 1, math.floor(ctr + wd) + 2):
                t = rem - self.d[i] * (x - ctr) ** 2
                if t < -slack - 1e-6 * (abs(R) + 1):
                    continue
                chosen[i] = x
                yield from rec(i - 1, chosen, t)
            chosen.pop(i, None)

        yield from rec(h - 1, {}, R)


def _solve_congruence(col, y, M):
    """All integers ``x`` with ``y_i + x col_i = 0 (mod M)`` for every ``i``, as ``(r, m)`` (x = r mod m)."""
    r, m = 0, 1
    for ci, yi in zip(col, y):
        a = (ci * m) % M
        t = (-yi - ci * r) % M
        g = math.gcd(a, M)
        if t % g:
            return None
        if a == 0:
            continue
        Mg = M // g
        t0 = (t // g) * pow(a // g, -1, Mg) % Mg if Mg > 1 else 0
        r = r + m * t0
        m = m * Mg
        r %= m
    return r, m


@dataclass(frozen=True)
class QSeries:
    """``Zhat_b(q) = q^prefactor * (1/denominator) * sum_k coefficients[k] q^k + O(q^(order+1))``.

    Attributes
    ----------
    space : str
        What was asked for, and the plumbing used.
    label : Label
        The label (:mod:`knotobs.qseries.labels`); ``label_count`` labels exist.
    prefactor : Fraction
        ``Delta_b``, the exact power of ``q`` in front.
    coefficients : tuple of int
        From ``q^0`` after the prefactor up to ``q^order``.
    denominator : int
        A power of two (``1`` unless a coefficient is a half-integer).
    """

    space: str
    plumbing: str
    label: Label
    label_count: int
    prefactor: Fraction
    coefficients: tuple[int, ...]
    denominator: int
    order: int
    orientation: str
    route: str = "plumbing lattice sum"
    normalization: str = ("q^(-(3s + tr B)/4) sum_{n in b + 2BZ^s} c(n) q^(-(n, B^-1 n)/4);"
                          " vertices of degree >= 3 expanded symmetrically (1/2 of |x|<1 plus |x|>1)")
    details: dict = field(default_factory=dict, compare=False)

    def terms(self) -> dict[Fraction, Fraction]:
        """``{exponent: coefficient}`` of the non-zero terms (exact)."""
        return {self.prefactor + k: Fraction(c, self.denominator)
                for k, c in enumerate(self.coefficients) if c}

    def to_json(self) -> dict:
        """A plain JSON object (exact values as strings where they are fractions)."""
        return {
            "space": self.space,
            "plumbing": self.plumbing,
            "label": str(self.label),
            "label_index": self.label.index,
            "label_count": self.label_count,
            "prefactor_exponent": str(self.prefactor),
            "coefficients": list(self.coefficients),
            "identically_zero": bool(self.details.get("empty", False)),
            "denominator": self.denominator,
            "order": self.order,
            "orientation": self.orientation,
            "normalization": self.normalization,
            "route": self.route,
        }

    def __str__(self) -> str:
        lead = ", ".join(str(c) for c in self.coefficients[:8])
        more = ", ..." if len(self.coefficients) > 8 else ""
        den = f"(1/{self.denominator}) " if self.denominator != 1 else ""
        return f"Zhat_{self.label}(q) = q^({self.prefactor}) {den}[{lead}{more}] + O(q^{self.order + 1})"


def _series_cost(lat: PlumbingLattice, order: int) -> tuple[float, float, float]:
    """``(lattice points, seconds, megabytes)`` estimated for the series of one label to ``q^order``.

    Besides the lattice points, every label searches for its lowest exponent: a few
    passes (the search step doubles) over the ``2^leaves`` fixed choices at the leaves,
    each a congruence on ``s`` vertices; about ``8 s^2 2^leaves`` steps (measured on a
    2-core machine: 0.004 s a label with 4 fibers, 0.012-0.08 s with 5 fibers, 24 vertices).
    """
    span = lat.D * (order + 1)
    count = lat.count_estimate(span + lat.D)
    seconds = seconds_for(count * 4 + 8 * lat.s * lat.s * 2 ** len(lat.leaves), "python")
    return count, seconds, (order + 1) * 1e-4 + count * 2e-5


def _series(lat: PlumbingLattice, lab: Label, order: int, route_text: str, space: str) -> QSeries:
    b = lab.vector
    base = lat.minimum_estimate()
    count, seconds, memory = _series_cost(lat, order)
    require(f"q-series of {space} to q^{order}: about {count:.2g} lattice points",
            seconds=seconds, memory_mb=memory, accepted="ask for a lower --order")
    # the lowest exponent in the support of this class
    step = lat.D
    lead = None
    empty = not lat.class_has_support(b)
    while lead is None and not empty:
        nums = [nm for nm, _ in lat.terms(b, base + step)]
        if nums:
            lead = min(nums)
        elif not lat.high or step > lat.D * 10**12:
            break
        else:
            step *= 2
    h = len(lat.high)
    if lead is None:           # a class with no terms at all: Zhat_b = 0
        return QSeries(space, str(lat.graph), lab, lat.labels.count, lat.base_exponent,
                       (0,) * (order + 1), 1, order, _ORIENT, route_text, details={"empty": True})
    extra = 0
    while True:
        acc: dict[int, int] = {}
        top = lead + lat.D * (order + extra)
        for nm, c in lat.terms(b, top):
            k, rem = divmod(nm - lead, lat.D)
            if rem:  # pragma: no cover - would contradict the integrality of the class
                raise KnotobsError(f"internal: exponents of one class differ by {Fraction(nm - lead, lat.D)}")
            acc[k] = acc.get(k, 0) + c
        first = next((k for k in sorted(acc) if acc[k]), None)
        if first is None or first <= extra:
            break
        extra = first
    shift = first or 0
    coeffs = [acc.get(k + shift, 0) for k in range(order + 1)]
    # the printed coefficients are integers over the smallest power of two that makes them so
    den = 2 ** h
    while den > 1 and all(c % 2 == 0 for c in coeffs):
        coeffs = [c // 2 for c in coeffs]
        den //= 2
    pref = lat.base_exponent + Fraction(lead, lat.D) + shift
    return QSeries(space, str(lat.graph), lab, lat.labels.count, pref, tuple(coeffs), den,
                   order, _ORIENT, route_text)


_ORIENT = ("the orientation in which the plumbing is negative definite (Seifert: e < 0,"
           " Neumann-Raymond; Sigma(2,3,5) = boundary of the negative E8 plumbing)")


def _check_order(order) -> int:
    if isinstance(order, bool) or not isinstance(order, int) or order < 0:
        raise SizeLimitError(f"order = {order!r} must be a non-negative integer")
    if order > MAX_ORDER:
        raise SizeLimitError(f"order = {order} is above the limit {MAX_ORDER}; ask for a lower --order")
    return order


def zhat(space, label=0, order: int = 20) -> QSeries:
    """``Zhat_b(q)`` of a negative definite plumbing or a Seifert manifold with ``b_1 = 0``, ``e < 0``.

    Parameters
    ----------
    space : str, PlumbingGraph or Seifert data
        ``Plumb(...)`` (:mod:`knotobs.qseries.plumbing`), or ``Sigma(...)``, ``L(p,q)``,
        ``M(0; b; (a_1,b_1), ...)`` (converted to its star plumbing).
    label : int, str or Label
        Label number or vector (:mod:`knotobs.qseries.labels`); default ``0``.
    order : int
        Coefficients from ``q^0`` to ``q^order`` after the prefactor.

    Examples
    --------
    >>> z = zhat("Sigma(2,3,5)", order=20)
    >>> z.prefactor, z.coefficients
    (Fraction(-3, 2), (1, -1, 0, -1, 0, 0, 0, -1, 1, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 1))
    >>> zhat("Sigma(2,3,7)", order=11).coefficients
    (1, -1, 0, 0, 0, -1, 0, 0, 0, 0, 1, -1)

    References
    ----------
    S. Gukov, D. Pei, P. Putrov and C. Vafa, J. Knot Theory Ramifications 29 (2020) 2040003;
    M. Cheng, S. Chun, F. Ferrari, S. Gukov and S. Harrison, JHEP 2019(10) 010; CONVENTIONS §13.
    """
    order = _check_order(order)
    g, text = plumbing_of(space)
    lat = PlumbingLattice(g)
    lab = lat.labels.find(label)
    return _series(lat, lab, order, "plumbing lattice sum", text)


def zhat_all(space, order: int = 20) -> list[QSeries]:
    """:func:`zhat` for every label, in label order.

    >>> [str(z.label) for z in zhat_all("Plumb(-5)", 4)]
    ['(0)', '(2)', '(4)']
    """
    order = _check_order(order)
    g, text = plumbing_of(space)
    lat = PlumbingLattice(g)
    guard_all_labels(lat, order, text)
    return [_series(lat, lab, order, "plumbing lattice sum", text) for lab in lat.labels.labels]


def guard_all_labels(lat: PlumbingLattice, order: int, space: str) -> None:
    """Refuse the series of every label when listing the labels and computing one series
    for each (:func:`_series_cost` times the number of labels) exceed the limits.

    Checked before the labels are listed (their number is known from ``H_1`` alone).

    >>> from knotobs.guard import limits
    >>> g, text = plumbing_of("L(5,2)")
    >>> guard_all_labels(PlumbingLattice(g), 10, text)
    >>> with limits(seconds=1e-6):
    ...     guard_all_labels(PlumbingLattice(g), 10, text)
    Traceback (most recent call last):
    ...
    knotobs.errors.SizeLimitError: q-series of L(5,2) = M(0; 3; (2,-1)), e = -5/2, as its star plumbing to q^10 for all 3 labels: about 4 lattice points each: estimated 0.000226 s, above the limit of 1e-06 s; ask for one label (--label 0, a number or a vector) or a lower --order (or raise the limit: --max-seconds, KNOTOBS_MAX_SECONDS)
    """
    labels = lat.labels.count
    count, seconds, memory = _series_cost(lat, order)
    listing = seconds_for(abs(lat.labels.det) * lat.s * lat.s, "python")
    require(f"q-series of {space} to q^{order} for all {labels} labels: about {count:.2g} lattice points each",
            seconds=listing + labels * seconds, memory_mb=memory,
            accepted="ask for one label (--label 0, a number or a vector) or a lower --order")


def qseries_for(space, label=None, order: int = 20) -> list[QSeries]:
    """The series asked for on the command line: label ``0`` by default, one label, or ``"all"``.

    >>> [z.label.index for z in qseries_for("L(5,2)", "all", 3)]
    [0, 1, 2]
    >>> qseries_for("Sigma(2,3,5)", None, 3)[0].coefficients
    (1, -1, 0, -1)
    """
    if isinstance(label, str) and label.strip().lower() == "all":
        return zhat_all(space, order)
    return [zhat(space, 0 if label is None else label, order)]
