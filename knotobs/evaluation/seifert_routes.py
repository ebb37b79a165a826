"""Route choice for Seifert partition functions and fiber Wilson loops at level k.

Three independent routes compute ``Z_k(M)`` of ``M(g; b; (a_1, b_1), ...)``:

* ``surgery``: modular data and gluing (CONVENTIONS §7, §9; :mod:`knotobs.evaluation.surgery`),
  dense ``n x n`` matrices over the ``n`` integrable weights;
* ``gauss-sum``: the SU(2) Lawrence–Rozansky closed Gauss sum (CONVENTIONS §9;
  :mod:`knotobs.evaluation.gauss_sum`), base genus 0, pairwise coprime orders, ``e != 0``;
* ``localisation``: the SU(N) localisation formula for every base genus and any orders
  (CONVENTIONS §10; :mod:`knotobs.localisation`) -- the general form of the Gauss sum over
  the weight lattice; for SU(N), N >= 3, ``gauss-sum`` names the SU(2) closed formula only
  and is refused, with a pointer to ``localisation``;
* ``integral``: the same SU(2) Gauss sum in its Lawrence–Rozansky integral form
  (:mod:`knotobs.evaluation.lr_integral`): Gaussian integrals plus residues, numeric with
  certified digits, at a cost that does not grow with the level (the way to ``K = 10^6``);
* ``convolution``: for SU(3), the Gauss sum over the weight lattice as a cubic convolution
  over the three positive roots (:mod:`knotobs.evaluation.root_convolution`): one Fourier
  transform of length ``6PK`` in ball arithmetic, numeric with certified digits, any base
  genus, pairwise coprime orders (the way to levels in the thousands).

``auto`` estimates the cost of each applicable route from the input sizes (nothing is
built before the route is chosen), keeps the surgery route when it is estimated below
:data:`CHEAP_SURGERY` seconds, and otherwise tries the routes from the cheapest and never refuses a case
that some route answers within the limits of :mod:`knotobs.guard`.  ``both`` computes the
two cheapest independent routes and compares them: exactly when both values are exact,
otherwise to the requested digits; the result carries the agreement in
``details["agreement"]``.  A refusal names the route and the size that was too large.

Fiber Wilson loops have the routes ``surgery`` and ``localisation``.  Their common framing
(``framing="fiber"``) is the fibration framing of :mod:`knotobs.localisation.values`: a
nearby regular fiber, for a core the curve of its gluing matrix; the surgery route's value
is converted to it with the twist ``theta^(f_loc - f_surgery)`` of the two self-linkings
(CONVENTIONS §2), and its cores of fibers with ``b_i < 0`` take the dual colour (that route
orients them against the convention ``h ~ a_i c_i``).
"""

from __future__ import annotations

import dataclasses
from fractions import Fraction
from typing import Mapping, Sequence

import mpmath

from knotobs.errors import InvalidSeifertDataError, KnotobsError, NotIntegrableError, SizeLimitError
from knotobs.evaluation.two_routes import RouteMismatchError
from knotobs.evaluation.finite_value import NUMERIC_ROUTES, FiniteLevelValue
from knotobs.guard import current_limits, require, seconds_for
from knotobs.localisation.formula import LocalisationSum, exact_cost
from knotobs.localisation.lattice import alcove_size
from knotobs.localisation.values import (
    check_fiber_lines,
    EXACT_COST_LIMIT,
    as_manifold,
    localisation_fiber_wilson_loop,
    localisation_partition_function,
    localisation_seconds,
)
from knotobs.numerics import working_precision
from knotobs.representations.groups import parse_group

__all__ = [
    "PARTITION_ROUTES",
    "LOOP_ROUTES",
    "RouteEstimate",
    "route_estimates",
    "partition_function",
    "fiber_wilson_loop",
]

PARTITION_ROUTES = ("auto", "surgery", "gauss-sum", "localisation", "integral", "convolution", "both")
LOOP_ROUTES = ("auto", "surgery", "localisation", "both")

#: ``auto`` keeps the surgery route when it is estimated below this many seconds (small cases
#: then print exactly as before the other routes existed).
CHEAP_SURGERY = 0.05

#: ``auto`` ranks the numeric-only routes (``integral``, ``convolution``) as if they cost this
#: many seconds more, so that the exact routes answer whenever they are cheap.
NUMERIC_ONLY_PENALTY = 0.3

#: Largest alcove the surgery route builds (its dense S matrix).
@dataclasses.dataclass(frozen=True)
class RouteEstimate:
    """Estimated cost of one route, or why it does not apply."""

    route: str
    seconds: float | None
    memory_mb: float | None
    reason: str = ""

    @property
    def applicable(self) -> bool:
        return self.seconds is not None

    def fits(self) -> bool:
        lim = current_limits()
        return self.applicable and self.seconds <= lim.seconds and self.memory_mb <= lim.memory_mb

    def describe(self) -> str:
        if not self.applicable:
            return f"{self.route}: {self.reason}"
        return f"{self.route}: {self.reason}, estimated {self.seconds:.3g} s and {self.memory_mb:.3g} MB"


def _group_level(group, level) -> tuple[int, int]:
    g = parse_group(group)
    if g.kind != "SU":
        raise KnotobsError(f"finite-level partition functions are computed for SU(N); got {g}")
    if isinstance(level, bool) or not isinstance(level, int) or level < 1:
        raise NotIntegrableError(f"level k = {level!r} is not allowed: use an integer k >= 1")
    return g.N, level


def _surgery_estimate(M, N: int, k: int, lines: int = 0) -> RouteEstimate:
    """The surgery route's own calibrated estimate (:func:`knotobs.evaluation.gluing.surgery_route_cost`)."""
    from knotobs.evaluation.gluing import surgery_route_cost

    try:
        sec, mb = surgery_route_cost(M, f"SU({N})", k, colours=lines)
    except InvalidSeifertDataError as exc:
        return RouteEstimate("surgery", None, None, str(exc))
    n = alcove_size(N, k)
    return RouteEstimate("surgery", sec, mb, f"SU({N}) at level {k}: {n} integrable weights, S applied as a"
                         " Fourier transform over the weight lattice")


def _gauss_estimate(M, N: int, k: int) -> RouteEstimate:
    if N != 2:
        return RouteEstimate("gauss-sum", None, None, "the Lawrence-Rozansky Gauss sum is SU(2) only;"
                             " for SU(N) use --route localisation (the Gauss sum over the weight lattice)")
    if M.genus:
        return RouteEstimate("gauss-sum", None, None, "the Lawrence-Rozansky Gauss sum needs base genus 0")
    from knotobs.evaluation.gauss_sum import lr_data

    pq = list(M.fibers) + ([(1, M.b)] if M.b else [])
    try:
        pq2, P, H, _ = lr_data(pq)
    except KnotobsError as exc:
        return RouteEstimate("gauss-sum", None, None, str(exc))
    if H == 0:
        return RouteEstimate("gauss-sum", None, None, "H = 0 (e = 0): the Gauss-sum route needs e != 0")
    K = k + 2
    n = len(pq2)
    terms = (2 ** n) * (2 * K) * abs(H)
    # calibrated on Sigma(2,3,7) at K = 10^3 .. 10^5 (2-core machine, 2026): ~0.27 us per term
    sec = seconds_for(terms * 55, "numpy") + seconds_for(4 * abs(H) * K / 50 + 2 ** n * 50, "ball")
    return RouteEstimate("gauss-sum", sec, terms * 8 * 4 / 1e6, f"{terms} Gauss-sum terms (|H| = {abs(H)}, K = {K})")


def _integral_estimate(M, N: int, k: int, digits: int, exact) -> RouteEstimate:
    if N != 2:
        return RouteEstimate("integral", None, None, "the integral form of the Gauss sum is SU(2) only")
    if exact:
        return RouteEstimate("integral", None, None, "the integral form is numeric (no exact value)")
    from knotobs.evaluation.lr_integral import LRData, continuation_cost

    try:
        d = LRData.from_space(M, allow_genus=True, allow_shared=True)
        sec, mb, what = continuation_cost(d, mpmath.mpc(k + 2), digits)
    except KnotobsError as exc:
        return RouteEstimate("integral", None, None, str(exc))
    return RouteEstimate("integral", sec, mb, what)


def _convolution_estimate(M, N: int, k: int, digits: int, exact) -> RouteEstimate:
    if N != 3:
        return RouteEstimate("convolution", None, None, "the convolution over the roots is SU(3) only"
                             " (for SU(N) the Gauss sum over the weight lattice is --route localisation)")
    if exact:
        return RouteEstimate("convolution", None, None, "the convolution route is numeric (no exact value)")
    from knotobs.evaluation.root_convolution import convolution_cost, convolution_data

    try:
        sec, mb, what = convolution_cost(convolution_data(M), k, digits)
    except KnotobsError as exc:
        return RouteEstimate("convolution", None, None, str(exc))
    return RouteEstimate("convolution", sec, mb, what)


def _loc_estimate(M, N: int, k: int, exceptional=None, regular=(), exact=None) -> RouteEstimate:
    s = LocalisationSum(M.genus, M.b, tuple(M.fibers), N, k, dict(exceptional or {}), list(regular))
    want = exact if exact is not None else exact_cost(s) <= EXACT_COST_LIMIT
    sec, mb = localisation_seconds(s, exact=bool(want))
    return RouteEstimate("localisation", sec, mb,
                         f"{s.size} weights, fibers of orders {[f.a for f in s.general] or '-'}")


def route_estimates(space, group="SU(2)", level: int = 1, loop: bool = False,
                    exact: bool | None = None, digits: int = 30) -> list[RouteEstimate]:
    """Cost estimates of every route for ``Z_k(M)`` (``loop=True``: the routes of fiber loops).

    >>> [e.route for e in route_estimates("Sigma(2,3,5)", "SU(2)", 9998) if e.applicable]
    ['surgery', 'gauss-sum', 'localisation', 'integral']
    >>> [e.route for e in route_estimates("Sigma(2,3,5)", "SU(3)", 40) if e.applicable]
    ['surgery', 'localisation', 'convolution']
    """
    M = as_manifold(space)
    N, k = _group_level(group, level)
    out = [_surgery_estimate(M, N, k)]
    if not loop:
        out.append(_gauss_estimate(M, N, k))
    out.append(_loc_estimate(M, N, k, exact=exact))
    if not loop:
        out.append(_integral_estimate(M, N, k, digits, exact))
        out.append(_convolution_estimate(M, N, k, digits, exact))
    return out


def _refuse(what: str, ests: list[RouteEstimate]) -> SizeLimitError:
    lim = current_limits()
    parts = "; ".join(e.describe() for e in ests)
    return SizeLimitError(
        f"{what}: no route fits the limits ({lim.seconds:g} s, {lim.memory_mb:g} MB): {parts}"
        " (raise the limits: --max-seconds, --max-memory)"
    )


def _run_partition(route: str, M, N: int, k: int, digits: int, exact):
    if route == "surgery":
        from knotobs.evaluation.surgery import partition_function as surgery_pf

        return surgery_pf(M, f"SU({N})", k, digits, exact, route="surgery")
    if route == "gauss-sum":
        from knotobs.evaluation.gauss_sum import gauss_sum_partition_function

        return gauss_sum_partition_function(M, k, digits, exact)
    if route == "integral":
        from knotobs.evaluation.lr_integral import integral_partition_function

        return integral_partition_function(M, k, digits)
    if route == "convolution":
        from knotobs.evaluation.root_convolution import convolution_partition_function

        return convolution_partition_function(M, k, digits)
    return localisation_partition_function(M, f"SU({N})", k, digits, exact)


def _compare(a: FiniteLevelValue, b: FiniteLevelValue, digits: int, what: str) -> str:
    if a.exact is not None and b.exact is not None:
        if not (a.exact == b.exact):
            raise RouteMismatchError(f"{what}: the exact values of the two routes differ: {a.exact} vs {b.exact}")
        return "exactly (equal cyclotomic numbers)"
    with working_precision(digits + 10):
        diff = abs(a.numeric - b.numeric)
        tol = mpmath.mpf(10) ** (2 - digits) * max(1, abs(a.numeric))
        if diff > tol:
            raise RouteMismatchError(f"{what}: the two routes disagree: {a.numeric} vs {b.numeric}")
        return f"to {digits} digits (|difference| = {mpmath.nstr(diff, 3)})"


def _with(value: FiniteLevelValue, **details) -> FiniteLevelValue:
    d = dict(value.details)
    d.update(details)
    return dataclasses.replace(value, details=d)


def _dispatch(route: str, routes: tuple, ests: list[RouteEstimate], what: str, run, digits: int):
    if route not in routes:
        raise KnotobsError(f"unknown route {route!r}: choose one of {', '.join(routes)}")
    by = {e.route: e for e in ests}
    if route in by:
        e = by[route]
        if not e.applicable:
            raise (SizeLimitError if "weights" in e.reason and "at most" in e.reason else KnotobsError)(
                f"{what}: the {route} route (--route {route}) does not apply: {e.reason}")
        require(f"{what} by the {route} route ({e.reason})", seconds=e.seconds, memory_mb=e.memory_mb,
                accepted="choose another route (--route auto)")
        return _with(run(route), routes=[route])
    order = sorted((e for e in ests if e.fits()),
                   key=lambda e: (not (e.route == "surgery" and e.seconds <= CHEAP_SURGERY),
                                  e.seconds + (NUMERIC_ONLY_PENALTY if e.route in NUMERIC_ROUTES else 0.0)))
    if route == "auto":
        tried = []
        for e in order:
            try:
                return _with(run(e.route), routes=[e.route],
                             route_choice=f"auto: {e.route} (estimated {e.seconds:.2g} s)")
            except SizeLimitError as exc:
                tried.append(RouteEstimate(e.route, None, None, str(exc)))
        raise _refuse(what, [x for x in ests if x.route not in {t.route for t in tried}] + tried)
    # both
    if len([e for e in ests if e.applicable]) < 2:
        raise KnotobsError(f"{what}: --route both needs two applicable routes; "
                           + "; ".join(e.describe() for e in ests))
    if len(order) < 2:
        raise _refuse(what + " by two independent routes", ests)
    r1, r2 = order[0].route, order[1].route
    v1, v2 = run(r1), run(r2)
    agreement = _compare(v1, v2, digits, what)
    best = v1 if v1.exact is not None or v2.exact is None else v2
    return _with(best, route=f"{r1} = {r2} (both computed)", routes=[r1, r2],
                 agreement=agreement)


def partition_function(space, group="SU(2)", level: int = 1, digits: int = 30,
                       exact: bool | None = None, route: str = "auto") -> FiniteLevelValue:
    """Chern–Simons partition function ``Z_k(M)`` of ``M(g; b; (a_1, b_1), ...)``.

    Parameters
    ----------
    space : str, SeifertManifold, ``(b, fibers)`` or ``(g, b, fibers)``
    group : str
        ``"SU(N)"``.
    level : int
        ``k >= 1``.
    digits : int
        Certified digits of the numeric value.
    exact : bool or None
        Force or skip the exact cyclotomic value.
    route : {"auto", "surgery", "gauss-sum", "localisation", "integral", "convolution", "both"}
        See the module docstring.

    Returns
    -------
    FiniteLevelValue
        ``Z(S^3) = S_00``, ``Z(S^2 x S^1) = 1``; canonical 2-framing; ``details["route"]``.

    Examples
    --------
    >>> z = partition_function("Sigma(2,3,5)", "SU(2)", 9998, digits=15)   # no 9999 x 9999 S matrix
    >>> z.details["routes"]
    ['gauss-sum']
    >>> partition_function("M(2; 0)", "SU(2)", 3).numeric            # Verlinde number
    mpc(real='20.0', imag='0.0')
    >>> partition_function("Sigma(2,3,5)", "SU(3)", 2, route="both").details["agreement"]
    'exactly (equal cyclotomic numbers)'

    References
    ----------
    CONVENTIONS §7, §9, §10; Reshetikhin & Turaev, Invent. Math. 103 (1991); Lawrence &
    Rozansky, Commun. Math. Phys. 205 (1999); L. Rozansky, Commun. Math. Phys. 178 (1996).
    """
    if route not in PARTITION_ROUTES:
        raise KnotobsError(f"unknown route {route!r}: choose one of {', '.join(PARTITION_ROUTES)}")
    M = as_manifold(space)
    if parse_group(group).kind == "U":
        # U(N)_k as the quotient (SU(N)_k x U(1)_{NK})/Z_N: its own two routes (docs/surgery.md §11)
        if route not in ("auto", "both"):
            raise KnotobsError(f"U(N) at level k has the routes quotient and gauging (docs/surgery.md §11):"
                               f" --route {route} does not apply; use --route auto or both")
        from knotobs.evaluation.unitary_mtc import unitary_partition_function

        return unitary_partition_function(M, group, level, digits, route=route)
    N, k = _group_level(group, level)
    ests = route_estimates(M, f"SU({N})", k, exact=exact, digits=digits)
    what = f"Z of {M}, SU({N}) at level {k}"
    return _dispatch(route, PARTITION_ROUTES, ests, what,
                     lambda r: _run_partition(r, M, N, k, digits, exact), digits)


def _dual(mu, N: int) -> tuple:
    full = tuple(mu) + (0,) * (N - len(mu))
    top = full[0]
    out = tuple(top - full[N - 1 - i] for i in range(N))
    return tuple(v for v in out if v > 0)


def _casimir(lam, N: int) -> Fraction:
    n = sum(lam)
    kap = sum(x * (x - 2 * i - 1) for i, x in enumerate(lam))
    return Fraction(kap + N * n, 2) - Fraction(n * n, 2 * N)


def _surgery_loop(M, N, k, regular, exceptional, normalized, digits, framing, exact):
    """The surgery route's fiber loop expressed in the common framing and orientation."""
    from knotobs.evaluation.surgery import fiber_wilson_loop as surgery_loop
    from knotobs.polynomials.cyclotomic import root_of_unity

    exc = {j: (_dual(mu, N) if M.fibers[j][1] < 0 else mu) for j, mu in exceptional.items()}
    v = surgery_loop(M, k, f"SU({N})", regular=regular, exceptional=exc, normalized=normalized,
                     digits=digits if framing == "zero" else digits + 5, framing=framing, exact=exact)
    if framing == "zero":
        return _with(v, route="surgery")
    fr = v.details.get("framings") or []
    colours = list(regular) + list(exceptional.values())
    ours = [M.fiber_framing if M.is_rational_homology_sphere else None for _ in regular]
    ours += [M.core_self_linking(j) if M.is_rational_homology_sphere else None for j in exceptional]
    shift = Fraction(0)
    for idx, (f_l, f_s, mu) in enumerate(zip(ours, fr, colours)):
        if idx < len(regular):
            continue                    # regular fibers: both routes use the fiber framing
        if f_l is None or f_s is None:
            raise KnotobsError("the surgery route's framing of a core cannot be converted when"
                               " H_1 is infinite; use --route localisation")
        shift += (f_l - f_s) * _casimir(mu, N) / (k + N)
    ph = root_of_unity(shift)
    if v.exact is not None:
        value = v.exact * ph
        numeric = value.to_mpc(digits)
    else:
        value = None
        with working_precision(digits + 10):
            numeric = v.numeric * mpmath.expjpi(2 * mpmath.mpf(shift.numerator) / shift.denominator)
        with working_precision(digits):
            numeric = +numeric
    return dataclasses.replace(v, exact=value, numeric=numeric, digits=digits,
                               framing=("fibration framing (regular fibers: a nearby fiber; cores: the"
                                        f" gluing-matrix curve -y mu + x h); self-linking in M: {', '.join(_fr(f) for f in ours)}"),
                               details={**v.details, "route": "surgery", "framings": ours})


def fiber_wilson_loop(space, level: int, group="SU(2)", regular: Sequence = (),
                      exceptional: Mapping[int, object] | None = None, normalized: bool = True,
                      digits: int = 30, framing: str = "fiber", exact: bool | None = None,
                      route: str = "auto") -> FiniteLevelValue:
    """Wilson loops along fibers of ``M(g; b; (a_i, b_i))``: coloured regular fibers (a torus
    link when several) and coloured cores of exceptional fibers.

    Parameters
    ----------
    space : str, SeifertManifold, ``(b, fibers)`` or ``(g, b, fibers)``
    level, group
        SU(N) at level k.
    regular : list of partitions
        Colours of parallel regular fibers.
    exceptional : dict ``{fiber_index: partition}``
        ``fiber_index`` counts the fibers ``(a_i, b_i)`` from 0.
    normalized : bool
        ``Z(M; L)/Z(M)`` (default) or ``Z(M; L)``.
    framing : ``"fiber"`` or ``"zero"``
        ``"fiber"``: regular fibers framed by a nearby fiber, cores by the curve
        ``-y_i mu_i + x_i h`` of the gluing matrix (CONVENTIONS §7); ``"zero"``: the zero
        framing when every line is null-homologous.
    route : {"auto", "surgery", "localisation", "both"}

    Examples
    --------
    >>> w = fiber_wilson_loop((0, [(2, 1), (3, -1)]), 3, "SU(2)", regular=[(1,)])  # S^3, T(2,3)
    >>> w.details["framings"]
    [Fraction(6, 1)]
    >>> fiber_wilson_loop("Sigma(2,3,5)", 3, "SU(3)", regular=[(2, 1)], route="both").details["agreement"]
    'exactly (equal cyclotomic numbers)'

    References
    ----------
    CONVENTIONS §7, §10; Reshetikhin & Turaev 1991; L. Rozansky, Commun. Math. Phys. 178 (1996);
    M. Blau & G. Thompson, arXiv:1306.3381.
    """
    if route not in LOOP_ROUTES:
        raise KnotobsError(f"unknown route {route!r}: choose one of {', '.join(LOOP_ROUTES)}")
    M = as_manifold(space)
    N, k = _group_level(group, level)
    regular, exceptional = check_fiber_lines(M, N, k, regular, exceptional, framing)
    ests = loop_estimates(M, N, k, regular, exceptional, normalized, framing, exact)
    what = f"Wilson loop in {M}, SU({N}) at level {k}"

    def run(r):
        if r == "surgery":
            return _surgery_loop(M, N, k, regular, exceptional, normalized, digits, framing, exact)
        return localisation_fiber_wilson_loop(M, k, f"SU({N})", regular=regular, exceptional=exceptional,
                                              normalized=normalized, digits=digits, framing=framing,
                                              exact=exact)

    return _dispatch(route, LOOP_ROUTES, ests, what, run, digits)


def loop_estimates(M, N: int, k: int, regular, exceptional, normalized: bool = True, framing: str = "fiber",
                   exact: bool | None = None) -> list[RouteEstimate]:
    """Cost estimates of the surgery and localisation routes for fiber Wilson loops (checked
    lines, as :func:`fiber_wilson_loop` passes them; normalised values count the partition
    function too).

    >>> from knotobs.localisation.values import as_manifold
    >>> [e.route for e in loop_estimates(as_manifold("Sigma(2,3,5)"), 3, 30, [(2, 1)], {})]
    ['surgery', 'localisation']
    """
    factor = 2 if normalized else 1
    ests = []
    s = _surgery_estimate(M, N, k, lines=len(regular) + len(exceptional))
    if s.applicable and exceptional and framing == "fiber" and not M.is_rational_homology_sphere:
        s = RouteEstimate("surgery", None, None, "its framing of a core cannot be converted to the"
                          " fibration framing when H_1 is infinite")
    ests.append(dataclasses.replace(s, seconds=None if s.seconds is None else s.seconds * factor))
    loc = _loc_estimate(M, N, k, exceptional, regular, exact)
    ests.append(dataclasses.replace(loc, seconds=loc.seconds * factor, memory_mb=loc.memory_mb))
    return ests


def _fr(f) -> str:
    """A self-linking number as text (``undefined`` when ``H_1`` is infinite)."""
    return "undefined (H_1 infinite)" if f is None else str(f)
