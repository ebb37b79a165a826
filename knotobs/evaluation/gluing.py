"""The surgery (gluing) formula evaluated by vectors: one S per letter of a short SL(2,Z) word.

CONVENTIONS §7, §9, §11.  ``M(g; b; (a_1, b_1), ..., (a_n, b_n))`` is the boundary of the
plumbing of disk bundles with a central vertex of genus ``g`` and weight ``e0 = -b`` and one
chain per fiber, the negative continued fraction ``[c_1, ..., c_m]`` of ``a_j/b_j``
(:class:`~knotobs.evaluation.surgery.SurgeryPresentation`).  The Reshetikhin–Turaev
invariant of that plumbing (N. Reshetikhin & V. Turaev, Invent. Math. 103 (1991); for a
central vertex of genus g: L. Rozansky, Commun. Math. Phys. 178 (1996) §2 and
S. K. Hansen, Algebr. Geom. Topol. 1 (2001) 627–686) is

    Z = exp(-i pi c sigma/4) sum_lam S_{0 lam}^(2 - 2g - d) theta_lam^e0
        prod_j (S Theta^{c_j1} S ... Theta^{c_jm} S)_{lam, mu_j} prod_r S_{lam, nu_r}

(``sigma`` the signature of the linking matrix, ``d`` the number of chains and regular
fibers, ``Theta = diag theta``).  With ``T = Theta exp(-2 pi i c/24)`` the bracket is
``exp(2 pi i (c/24) sum_t c_jt) rho(W_j)``, ``W_j = S T^{c_j1} S ... T^{c_jm} S`` in
SL(2,Z), and ``rho`` is a representation of SL(2,Z) (``S^4 = 1``, ``(ST)^3 = S^2``), so
``rho(W_j)`` may be computed from *any* word of ``W_j``: the shortest one
(:func:`~knotobs.evaluation.sl2z_words.shortest_word`), ``+-T^{n_1} S T^{n_2} ... S T^{n_r}``.
The outer ``T^{n_1}`` joins the central twist, ``T^{n_r}`` acts on the colour by a scalar and
``-1 = S^2 = C`` permutes the weights, so the work is ``r - 1`` applications of S to a vector:

    Z = exp(2 pi i phi) sum_lam S_{0 lam}^(2-2g-d) theta_lam^(e0 + sum_j n_j1)
        prod_j (C^{eps_j} S Theta^{n_j2} S ... S Theta^{n_jr} e_{mu_j})_lam theta_{mu_j}^{n_jr} ...

with ``phi = -c sigma/8 + (c/24) sum_j (sum_t c_jt - sum_t n_jt)``.  Both forms are
evaluated in the tests and agree exactly.

Backends: exact cyclotomic vectors (``S`` entry by entry, small cases) or ball arithmetic
with ``S`` applied as a DFT over the weight lattice
(:class:`~knotobs.evaluation.lattice_fourier.WeightLatticeFourier`), at one precision
chosen from the requested digits; the digits are certified by the ball radius.
"""

from __future__ import annotations

import math
import threading
from dataclasses import dataclass
from fractions import Fraction
from typing import Mapping, Sequence

from flint import acb, arb, ctx, fmpq

from knotobs.errors import PrecisionError, SizeLimitError
from knotobs.evaluation.lattice_fourier import WeightLatticeFourier
from knotobs.evaluation.sl2z_words import shortest_word, word_to_matrix
from knotobs.evaluation.surgery import _ExactBackend
from knotobs.guard import require, seconds_for
from knotobs.numerics import working_precision
from knotobs.polynomials.cyclotomic import acb_to_mpc, root_of_unity
from knotobs.representations.permutations import permutation_sign

__all__ = ["GluingPlan", "plan_gluing", "evaluate_gluing", "surgery_cost", "surgery_route_cost",
           "EXACT_COST_LIMIT"]

#: Exact cyclotomic arithmetic is chosen automatically below this cost
#: (weights^2 x S applications x field degree).
EXACT_COST_LIMIT = 4_000_000


@dataclass(frozen=True)
class GluingPlan:
    """Words and phases of one evaluation (independent of the level)."""

    genus: int
    e0: int
    central_power: int                    # e0 + sum_j n_j1
    words: tuple[tuple[bool, tuple[int, ...]], ...]
    sigma: int
    t_shift: int                          # sum_j (sum_t c_jt - sum_t n_jt)

    @property
    def s_applications(self) -> int:
        """Applications of S to a full vector (the first S of each word gives a column)."""
        return sum(max(len(w) - 2, 0) for _, w in self.words)


def plan_gluing(pres, genus: int = 0) -> GluingPlan:
    """Shortest words for the chains of a :class:`SurgeryPresentation`.

    >>> from knotobs.evaluation.surgery import SurgeryPresentation
    >>> p = plan_gluing(SurgeryPresentation.from_coefficients(0, [(1, 7)]))   # L(7,1)
    >>> p.words, p.s_applications
    (((False, (-7, -1)),), 0)
    """
    from knotobs.evaluation.surgery import signature

    words = []
    central = pres.e0
    shift = 0
    for chain in pres.chains:
        W = word_to_matrix([0, *chain, 0])
        neg, word = shortest_word([list(W[0]), list(W[1])])
        words.append((neg, tuple(word)))
        central += word[0]
        shift += sum(chain) - sum(word)
    return GluingPlan(genus, pres.e0, central, tuple(words), signature(pres.linking_matrix()), shift)


# ---------------------------------------------------------------------------
# cost


def surgery_cost(N: int, k: int, fibers: Sequence[tuple[int, int]] = (), genus: int = 0, b: int = 0,
                 colours: int = 0, exact: bool | None = None) -> tuple[float, float]:
    """Estimated ``(seconds, memory_mb)`` of the surgery route for SU(N) at level ``k``.

    Parameters
    ----------
    N, k : int
        ``SU(N)`` at level ``k``.
    fibers : sequence of ``(a_i, b_i)``
        The exceptional fibers of ``M(g; b; ...)``.
    genus, b : int
        Base genus and ``b`` (they do not change the cost beyond the words).
    colours : int
        Number of coloured regular fibers (each adds one column).
    exact : bool or None
        ``True``: the exact cyclotomic backend; ``False``: balls; ``None``: the automatic choice.

    Returns
    -------
    (seconds, memory_mb) : tuple of float
        Order-of-magnitude estimates on a two-core machine (see :mod:`knotobs.guard`);
        a normalised Wilson loop costs about twice a partition function.

    Examples
    --------
    >>> s, mb = surgery_cost(3, 40, [(2, 1), (3, 1), (5, 1)])
    >>> 0.01 < s < 30 and mb < 2048
    True
    """
    from knotobs.evaluation.surgery import SurgeryPresentation, seifert_to_surgery

    e0, pq = seifert_to_surgery(b, fibers)
    plan = plan_gluing(SurgeryPresentation.from_coefficients(e0, pq), genus)
    n = math.comb(k + N - 1, N - 1)
    seconds, mb = _cost(N, k, n, plan, colours, exact)
    return seconds + seconds_for(n * 8, "python"), mb


def surgery_route_cost(space, group="SU(2)", level: int = 1, colours: int = 0,
                       exact: bool | None = None) -> tuple[float, float]:
    """:func:`surgery_cost` for a space given as the rest of knotobs gives it.

    Parameters
    ----------
    space : SeifertManifold-like (``.b``, ``.fibers``, optional ``.genus``), ``(b, fibers)``,
        ``(g, b, fibers)`` or a string such as ``"Sigma(2,3,5)"`` / ``"M(1; -1; (2,1), (3,1))"``.
    group : str or int
        ``"SU(N)"``.
    level : int
    colours, exact
        As in :func:`surgery_cost`.

    Returns
    -------
    (seconds, memory_mb) : tuple of float

    Examples
    --------
    >>> s, mb = surgery_route_cost("L(7,1)", "SU(3)", 50)
    >>> s < 1.0
    True
    """
    from knotobs.evaluation.modular import parse_group
    from knotobs.evaluation.surgery import _plain, seifert_data, seifert_genus

    if isinstance(space, str):
        from knotobs.fibrations.seifert import parse_space

        space = parse_space(space)
    genus = seifert_genus(space)
    b, fibers = seifert_data(_plain(space))
    return surgery_cost(parse_group(group), level, fibers, genus, b, colours, exact)


def _phi(m: int) -> int:
    """Euler's totient (the degree of the cyclotomic field of order ``m``)."""
    from knotobs.polynomials.cyclotomic import factor_int

    out = m
    for p, _ in factor_int(m):
        out -= out // p
    return out


def _cost(N: int, k: int, n: int, plan: GluingPlan, colours: int, exact) -> tuple[float, float]:
    K = k + N
    apps = plan.s_applications
    cols = len(plan.words) + colours + 1
    if _use_exact(N, k, n, apps, exact):
        deg = _phi(math.lcm(2 * N * K, 8 * K))
        ops = n * n * (1 + apps) * deg
        return seconds_for(ops, "flint") + seconds_for(n * n * 20, "python"), n * n * deg * 40 / 1e6 + 50
    from knotobs.evaluation.lattice_fourier import DENSE_AXIS_MAX, _fft_friendly

    G = N * K ** (N - 1)
    def per_element(d: int) -> float:         # multiply-adds per element of one axis
        if d <= DENSE_AXIS_MAX and not _fft_friendly(d):
            return d
        return (4 if _fft_friendly(d) else 12) * math.log2(d) + 8

    axes = [K] * (N - 2) + [N * K]
    # the last axis is evaluated at the n alcove points only (when there are two axes or more)
    axis_sum = sum(per_element(d) for d in (axes[:-1] if len(axes) > 1 else axes))
    if len(axes) > 1:
        axis_sum += n * axes[-1] / G
    # measured on a two-core machine at 30 digits: one ball multiply-add of an acb_mat product
    # ~0.12 us, one element of a reshape or scatter ~0.6 us, one Python ball operation ~0.3 us
    transform = apps * G * (0.12e-6 * axis_sum + 0.6e-6 * (N - 1))
    columns = 0.3e-6 * (cols * n * math.factorial(N) + n * (cols + 4))
    mem = (G * max(apps, 1) * 120 + n * math.factorial(N) * 8) / 1e6 + 30
    return seconds_for(G * math.factorial(N) * 4, "numpy") + transform + columns, mem


def _use_exact(N, k, n, apps, exact) -> bool:
    K = k + N
    deg = _phi(math.lcm(2 * N * K, 8 * K))
    cost = n * n * (1 + apps) * deg
    if exact is None:
        return cost <= EXACT_COST_LIMIT
    if exact and cost > 100 * EXACT_COST_LIMIT:
        raise SizeLimitError(
            f"exact SU({N}) level {k} surgery computation is too large ({n} weights, cost {cost:.2e});"
            " use exact=False (certified ball arithmetic)"
        )
    return bool(exact)


# ---------------------------------------------------------------------------
# backends


class _Exact(_ExactBackend):
    """The exact cyclotomic backend of the surgery route, applying ``S`` to several vectors at once."""

    def apply_S(self, vs):
        St = self.stilde()
        n = self.md.size
        out = []
        for v in vs:
            nz = [j for j in range(n) if not v[j].is_zero()]
            w = []
            for i in range(n):
                row = St[i]
                acc = self.F.zero
                for j in nz:
                    acc = acc + row[j] * v[j]
                w.append(acc)
            out.append(w)
        return out

    def power(self, x, e):
        return x ** e


class _Balls:
    exact = False

    def __init__(self, md):
        self.md = md
        N, K = md.N, md.K
        self.NK = N * K
        self.roots = [acb(arb(2 * e) / self.NK).exp_pi_i() for e in range(self.NK)]
        self.theta = [acb(arb(2) * fmpq(h.numerator, h.denominator)).exp_pi_i()
                      for h in (t - math.floor(t) for t in md.twist_exponents())]
        self.fourier = WeightLatticeFourier.for_modular_data(md)
        x = md._x
        self._X = x.sum(axis=1)
        self._x = x

    def column(self, j):
        """``Stilde e_j`` by the Weyl sum (``n N!`` ball additions; memoised per evaluation)."""
        memo = self.__dict__.setdefault("_columns", {})
        if j not in memo:
            memo[j] = self._column(j)
        return memo[j]

    def _column(self, j):
        import itertools

        md = self.md
        N = md.N
        x, X = self._x, self._X
        y = x[j]
        out = [acb(0)] * md.size
        for p in itertools.permutations(range(N)):
            sgn = permutation_sign(p)
            E = ((X * X[j] - N * (x[:, list(p)] @ y)) % self.NK).tolist()
            roots = self.roots
            if sgn > 0:
                out = [o + roots[e] for o, e in zip(out, E)]
            else:
                out = [o - roots[e] for o, e in zip(out, E)]
        return out

    def theta_pow(self, v, c):
        if c == 0:
            return v
        return [a * t ** c for a, t in zip(v, self.theta)]

    def apply_S(self, vs):
        return self.fourier.apply(vs)

    def power(self, x, e):
        return x ** e

    def zero(self):
        return acb(0)


def _dual_perm(md) -> list[int]:
    return [md.index[md.dual(w)] for w in md.weights]


def _core(be, plan: GluingPlan, exceptional: Mapping[int, int], regular: Sequence[int]):
    """``(sum_lam ..., s0 power)`` of the vector form."""
    md = be.md
    n = md.size
    key = ("exact" if be.exact else ctx.prec, md.N, md.k, plan.words, tuple(sorted(exceptional.items())))
    with _CACHE_LOCK:
        hit = _FIBER_CACHE.get(key)
    if hit is None:
        hit = _fiber_vectors(be, plan, exceptional)
        with _CACHE_LOCK:
            _FIBER_CACHE[key] = hit
            while len(_FIBER_CACHE) > 4:
                _FIBER_CACHE.pop(next(iter(_FIBER_CACHE)))
    fiber_vecs, s0_power, scalars = hit
    vecs = list(fiber_vecs)
    for nu in regular:
        vecs.append(be.column(nu))
        s0_power += 1
    d = len(vecs)
    e_central = 2 - 2 * plan.genus - d
    s0_power += e_central
    row0 = be.column(0)
    central = be.theta_pow(row0, plan.central_power)
    total = be.zero()
    for lam in range(n):
        term = central[lam] * be.power(row0[lam], e_central - 1)
        for v in vecs:
            term = term * v[lam]
        total = total + term
    return total, s0_power, list(scalars)


#: The fiber vectors of the last few evaluations: a normalised Wilson loop on regular fibers
#: evaluates Z(M; L) and Z(M) with the same fibers, which then cost one column only.
_FIBER_CACHE: dict = {}
_CACHE_LOCK = threading.Lock()


def _fiber_vectors(be, plan: GluingPlan, exceptional: Mapping[int, int]):
    """The vectors ``C^{eps_j} S Theta^{n_j2} ... S e_{mu_j}`` of every fiber, their power of s0
    and the scalars ``(mu_j, n_jr)``."""
    md = be.md
    n = md.size
    vecs = [None] * len(plan.words)
    pending = []                      # (slot, remaining letters, vector)
    s0_power = 0
    scalars = []                      # (colour index, exponent) of theta_mu^{n_r}
    for j, (neg, word) in enumerate(plan.words):
        mu = exceptional.get(j, 0)
        letters = list(reversed(word[1:]))          # n_r, ..., n_2; each followed by an S
        scalars.append((mu, letters[0]))
        s0_power += len(letters)
        v = be.column(mu)                           # S e_mu (after the scalar theta_mu^{n_r})
        pending.append([j, letters[1:], v, neg])
    # apply the remaining letters, all vectors together (one batched transform per round)
    while True:
        active = [p for p in pending if p[1]]
        if not active:
            break
        ins = []
        for p in active:
            t = p[1].pop(0)
            ins.append(be.theta_pow(p[2], t))
        outs = be.apply_S(ins)
        for p, o in zip(active, outs):
            p[2] = o
    perm = None
    for j, _letters, v, neg in pending:
        if neg:
            perm = perm or _dual_perm(md)
            v = [v[perm[i]] for i in range(n)]
        vecs[j] = v
    return tuple(vecs), s0_power, tuple(scalars)


def _phase_turns(md, plan: GluingPlan, scalars) -> Fraction:
    """``phi`` plus the scalars ``theta_mu^{n_r}`` (as turns)."""
    c = md.central_charge
    turns = -c * plan.sigma / 8 + c * plan.t_shift / 24
    for mu, t in scalars:
        turns += t * md.h(md.weights[mu])
    return turns - math.floor(turns)


def evaluate_gluing(md, pres, genus: int = 0, exceptional: Mapping[int, int] | None = None,
                    regular: Sequence[int] = (), digits: int = 30, exact: bool | None = None):
    """``(exact value or None, mpmath value)`` of the gluing formula (module docstring).

    ``exceptional`` maps a fiber index (from 0) to a weight index; ``regular`` lists weight
    indices of coloured regular fibers.

    >>> from knotobs.evaluation.modular import ModularData
    >>> from knotobs.evaluation.surgery import SurgeryPresentation
    >>> md = ModularData(2, 3)
    >>> ex, num = evaluate_gluing(md, SurgeryPresentation.from_coefficients(1, []))   # S^3
    >>> ex == md.S_exact((), ())
    True
    """
    exceptional = dict(exceptional or {})
    plan = plan_gluing(pres, genus)
    seconds, mb = _cost(md.N, md.k, md.size, plan, len(regular), exact)
    require(f"surgery route for SU({md.N}) at level {md.k} ({md.size} weights,"
            f" {plan.s_applications} S applications)", seconds=seconds, memory_mb=mb,
            accepted="use a lower level or another route (--route)")
    s0 = md.s0()
    if _use_exact(md.N, md.k, md.size, plan.s_applications, exact):
        be = _Exact(md)
        total, p, scalars = _core(be, plan, exceptional, regular)
        turns = _phase_turns(md, plan, scalars)
        # the phase is a root of unity of Q(zeta_M) (the two words of W_j differ by
        # relations of SL(2,Z), whose phases are powers of exp(2 pi i c/8)); keep the value
        # in that field so that it prints as before
        phase = be.F.zeta(int(turns * be.M)) if (turns * be.M).denominator == 1 else root_of_unity(turns)
        value = (s0 ** p) * (total * phase)
        return value, value.to_mpc(digits)
    # guard digits: the transforms lose about log10(n)/2 digits, and the central power
    # S_{0 lam}^(2-2g-d) amplifies the error by up to |S_{0 lam}|^-(d+2g-2) at the corners
    # of the alcove, where Stilde_{0 lam} ~ (pi/K)^(N(N-1)/2)
    d = len(plan.words) + len(regular)
    amplify = max(0, d + 2 * genus - 2) * (md.N * (md.N - 1) / 2) * math.log10(max(md.K / math.pi, 1.0))
    dps = digits + 6 + int(math.log10(md.size + 1)) // 2 + int(amplify / 2)
    for _attempt in range(4):
        with working_precision(dps):
            be = _Balls(md)
            total, p, scalars = _core(be, plan, exceptional, regular)
            turns = _phase_turns(md, plan, scalars)
            prec = ctx.prec
            z = total * acb(arb(2) * fmpq(turns.numerator, turns.denominator)).exp_pi_i() \
                * s0.to_acb(prec) ** p
        if _certified(z, digits):
            return None, acb_to_mpc(z, digits)
        # raise the precision by the digits that were missing (from the radius), plus guard
        rad = max(float(z.real.rad()), float(z.imag.rad()), 1e-300)
        mag = max(abs(float(z.real.mid())), abs(float(z.imag.mid())), 1.0)
        missing = math.log10(rad / mag) + digits + 2 if rad > 0 else 0
        dps += max(int(missing) + 8, 10)
    raise PrecisionError(f"could not certify {digits} digits of the surgery value (ball radius too large)")


def _certified(z: acb, digits: int) -> bool:
    rad = max(float(z.real.rad()), float(z.imag.rad()))
    mag = max(abs(float(z.real.mid())), abs(float(z.imag.mid())), 1e-300)
    return rad <= 10.0 ** (-digits - 2) * max(mag, 1.0)
