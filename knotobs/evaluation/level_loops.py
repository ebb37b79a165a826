"""Wilson loops at a chosen level k: knots placed as fibers, evaluated by modular data and gluing.

This joins the refibration (:func:`knotobs.fibrations.refibration.fibration_of`) to the
finite-level gluing formula (:func:`knotobs.evaluation.surgery.fiber_wilson_loop`,
docs/conventions.md §7) and, in S^3, to the exact polynomial of the foundation (CONVENTIONS §3),
which is evaluated at ``q = exp(2 pi i/K)`` as a second, independent route.

Defaults are those of the polynomial ``loop``: zero framing where the knot is
null-homologous, normalised by ``Z(M)`` (so in S^3 the unknot gives ``dim_q``).
"""

from __future__ import annotations

from fractions import Fraction
from typing import Optional

import mpmath

from knotobs.numerics import working_precision

from knotobs.errors import InexactDivisionError, InvalidKnotError, KnotobsError, SizeLimitError
from knotobs.evaluation.two_routes import RouteMismatchError
from knotobs.evaluation.finite_value import FiniteLevelValue
from knotobs.evaluation.framing import resolve_framing
from knotobs.evaluation.rosso_jones import colours_for, rosso_jones
from knotobs.evaluation.seifert_routes import fiber_wilson_loop, partition_function
from knotobs.fibrations.refibration import fibration_of
from knotobs.fibrations.seifert import parse_space
from knotobs.fibrations.surgery import space_report
from knotobs.fibrations.torus import parse_knot
from knotobs.evaluation.modular import check_integrable
from knotobs.polynomials.cyclotomic import Cyclotomic, CyclotomicField, root_of_unity
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.groups import casimir, parse_group
from knotobs.representations.partitions import as_partition

__all__ = ["level_loop", "level_partition_function", "polynomial_at_root_of_unity"]


def level_partition_function(space: Optional[str] = None, group="SU(2)", level: int = 1, digits: int = 30,
                             surgery: Optional[str] = None, slope=None,
                             route: str = "auto") -> tuple[FiniteLevelValue, object]:
    """``Z_k`` of a manifold given by name or by surgery on a torus knot; returns ``(value, report)``.

    Examples
    --------
    >>> z, rep = level_partition_function("S^2xS^1", "SU(2)", 3)
    >>> z.numeric
    mpc(real='1.0', imag='0.0')
    """
    from knotobs.precision import check_digits

    digits = check_digits(digits)
    report = space_report(space, surgery=surgery, slope=slope)
    if report.manifold is None:
        raise KnotobsError(
            f"{report.recognised} is reducible; knotobs evaluates Seifert manifolds over S^2 "
            "(use Z(M1 # M2) = Z(M1) Z(M2) / Z(S^3) on the summands)"
        )
    if _is_so3(group):
        if route not in ("auto", "surgery"):
            raise KnotobsError(f"SO(3) at level k has one route (the plumbing sum); --route {route} does not apply")
        from knotobs.evaluation.so3_level import so3_partition_function

        return so3_partition_function(report.manifold, level, digits), report
    return partition_function(report.manifold, group, level, digits, route=route), report


def _is_so3(group) -> bool:
    """SO(3) at odd level (docs/groups.md, §14); other groups of the Cartan engine have no level data here."""
    from knotobs.representations.cartan.group import is_simple_group_name, simple_group

    if not is_simple_group_name(group):
        return False
    g = simple_group(group)
    if (g.kind, g.N) != ("SO", 3):
        raise KnotobsError(f"finite-level values are computed for SU(N) and for SO(3) at odd level; got {g}"
                           " (its exact polynomial in q: knotobs loop KNOT --group ... without --level)")
    return True


def level_loop(knot: Optional[str] = None, level: int = 1, group="SU(2)", rep=(1,), space: str = "S^3",
               fiber: Optional[int] = None, framing=None, normalized: bool = True,
               digits: int = 30, route: str = "auto") -> FiniteLevelValue:
    """Wilson loop at level ``k`` of a torus knot/link in S^3 or a lens space, or of a fiber.

    Parameters
    ----------
    knot : str, optional
        ``T(p,q)``.  In S^3 a regular fiber of the fibration of :func:`fibration_of`; in
        ``L(p,q)`` the curve of slope ``p/q`` on the Heegaard torus.  ``"fiber"``: a regular
        fiber of any Seifert manifold ``space``.  Omit it and give ``fiber`` to colour a core
        (exceptional) fiber of ``space``.
    level : int
        ``k >= 1``.
    group : str
        ``"SU(N)"``.
    rep : partition or list of partitions
    space : str
        ``S^3``, ``L(p,q)``, ``Sigma(a,b,c)`` or ``M(0; b; ...)``.
    fiber : int, optional
        Index (from 0) of the core fiber of ``space`` carrying ``rep``.
    framing : None, ``"zero"``, ``"fiber"`` or int
        ``None``: zero framing when the knot is null-homologous, the fiber framing otherwise.
        An integer is the framing relative to the zero framing (S^3 only).
    normalized : bool
        Divide by ``Z(M)`` (default; in S^3 the unknot gives ``dim_q``).
    route : str
        ``auto``, ``surgery``, ``localisation`` or ``both`` (see
        :func:`knotobs.evaluation.seifert_routes.fiber_wilson_loop`).

    Returns
    -------
    FiniteLevelValue
        With ``details["framing_value"]`` and, in S^3, ``details["polynomial_check"]``: the
        difference to the exact polynomial evaluated at ``q = exp(2 pi i/K)``.

    Examples
    --------
    >>> v = level_loop("T(2,3)", 3)
    >>> mpmath.nstr(v.numeric, 10), v.details["polynomial_check"] < 1e-25
    ('(-1.309016994 - 2.126627021j)', True)

    References
    ----------
    CONVENTIONS §3, §5, §7; Rosso–Jones (1993); Reshetikhin–Turaev (1991).
    """
    from knotobs.precision import check_digits

    digits = check_digits(digits)
    if _is_so3(group):
        from knotobs.evaluation.so3_level import so3_level_loop

        if route not in ("auto", None):
            raise KnotobsError(f"SO(3) at level k has one route (the plumbing sum); --route {route} does not apply")
        return so3_level_loop(knot, level, rep, space, fiber, framing, normalized, digits)
    g = parse_group(group)
    if g.kind == "U":
        if route not in ("auto", "both"):
            raise KnotobsError(f"route {route!r} does not apply to U(N) at finite level: its routes are the"
                               " SU(N) value times the U(1) factor, the quotient category and the gauging sum"
                               " (use --route auto or both)")
        return _unitary(knot, level, g.N, rep, space, fiber, framing, normalized, digits, route)
    if g.kind != "SU":
        raise KnotobsError(f"finite-level values are computed for SU(N), U(N) and for SO(3) at odd level; got {g}")
    if knot is None:
        if fiber is None:
            raise InvalidKnotError("give a knot T(p,q) or a fiber index (--fiber i) of the space")
        M = parse_space(space)
        lam = g.check(as_partition(rep) if not isinstance(rep, (list, tuple)) or not rep or isinstance(rep[0], int) else rep[0])
        if framing not in (None, "fiber", "zero"):
            raise KnotobsError("a core fiber takes framing zero (when null-homologous) or fiber (its gluing matrix)")
        if framing in (None, "zero"):
            try:
                return fiber_wilson_loop(M, level, str(g), exceptional={fiber: lam}, normalized=normalized,
                                         digits=digits, framing="zero", route=route)
            except InexactDivisionError:
                if framing == "zero":
                    raise
        return fiber_wilson_loop(M, level, str(g), exceptional={fiber: lam}, normalized=normalized,
                                 digits=digits, framing="fiber", route=route)
    if str(knot).strip().lower() in ("fiber", "fibre"):
        # a regular fiber of any Seifert manifold (a single component)
        F = fibration_of("fiber", space)
        k = None
        cols = (g.check(rep if (not rep or isinstance(rep[0], int) or isinstance(rep, str)) else rep[0]),)
    else:
        k = parse_knot(knot)
        cols = tuple(g.check(c) for c in colours_for(k, rep))
        F = fibration_of(k, space)
    null_homologous = (F.homology_class in (None, 0))
    if framing is None:
        mode = "zero" if null_homologous else "fiber"
    elif framing in ("zero", "fiber"):
        mode = framing
    elif _is_integer_framing(framing):
        mode = "zero"
    else:
        if isinstance(framing, (list, tuple)):
            raise KnotobsError(f"framing {tuple(framing)}: at a level one framing for every component (zero,"
                               " fiber or an integer); per-component framings are taken by the polynomial"
                               " routes (without --level)")
        raise KnotobsError(f"unknown framing {framing!r}: use zero, fiber or an integer")
    if mode == "zero" and not null_homologous:
        raise KnotobsError(
            f"{knot} is not null-homologous in {space} (class {F.homology_class} in H_1); it has no zero"
            " framing: use the fiber framing"
        )
    in_s3 = k is not None and space.replace(" ", "").upper() in ("S^3", "S3")
    if framing is None and mode == "zero" and F.homology_class is None \
            and not F.manifold.is_rational_homology_sphere:
        mode = "fiber"          # H_1 infinite (e = 0 or base genus >= 1): no zero framing to default to
    check_skipped = None
    if in_s3 and normalized:
        # the exact polynomial is the second route: its estimate before any work, so that a
        # colour too large for it is said (and the Seifert route still answers) instead of being
        # refused after the Seifert route has run
        from knotobs.evaluation.estimates import fixed_estimate
        from knotobs.guard import current_limits

        # rosso_jones guards itself with the estimate that includes printing; the route choice
        # compares the cost of the evaluation alone
        psec, pmb, pwhat = fixed_estimate(k, g, cols, "Rosso-Jones")
        lim = current_limits()
        fits = psec <= lim.seconds and pmb <= lim.memory_mb
        if fits and route in ("auto", None) and g.kind == "SU":
            why = _polynomials_are_cheaper(F.manifold, g, k, cols, level, mode,
                                           fixed_estimate(k, g, cols, "Rosso-Jones", printed=False)[0])
            if why is not None:
                return _polynomial_only(k, g, cols, level, framing, mode, digits, F, pair=why)
        if not fits:
            check_skipped = (f"not computed: {pwhat}, estimated {psec:.3g} s and {pmb:.3g} MB, above the"
                             f" limits ({lim.seconds:g} s, {lim.memory_mb:g} MB)")
    try:
        v = fiber_wilson_loop(F.manifold, level, str(g), regular=list(cols), normalized=normalized,
                              digits=digits, framing=mode, route=route)
    except SizeLimitError:
        if not (in_s3 and normalized) or route not in ("auto", None):
            raise           # a route asked for by name is refused, not replaced
        # the modular data are too large at this level; in S^3 the exact polynomial still gives
        # the value (one route only, said so in the result)
        return _polynomial_only(k, g, cols, level, framing, mode, digits, F)
    details = dict(v.details)
    exact, numeric, framing_text = v.exact, v.numeric, v.framing
    extra = 0
    if _is_integer_framing(framing):
        f = int(framing)
        K = level + g.N
        c = sum((casimir(g, lam) for lam in cols), Fraction(0))
        f_eff = _reduced_framing(f, c, K)
        phase = f_eff * c / K
        with working_precision(digits + 10):
            numeric = numeric * mpmath.expjpi(2 * mpmath.mpf(phase.numerator) / phase.denominator)
        if exact is not None:
            exact = exact * root_of_unity(phase)
        framing_text = f"{f} on every component relative to the zero framing"
        extra = f
    details["framing_value"] = "zero" if mode == "zero" and not extra else (extra if extra else "fiber")
    if check_skipped is not None:
        details["polynomial_check"] = check_skipped
    elif in_s3 and normalized:
        poly = rosso_jones(k, g, cols, (f_eff if extra else 0) if mode == "zero" else "fiber")
        check = poly.at_root_of_unity(level + g.N, dps=digits + 5)
        with working_precision(digits + 5):
            diff = abs(check - numeric)
        details["polynomial_check"] = float(diff)
        if diff > mpmath.mpf(10) ** (-digits + 3) * max(1, abs(numeric)):
            raise RouteMismatchError(
                f"gluing and the exact polynomial disagree for {k}, {g}, level {level}: |diff| = {diff}"
            )
    return FiniteLevelValue(exact=exact, numeric=numeric, digits=v.digits, framing=framing_text,
                            orientation=v.orientation, normalisation=v.normalisation, details=details)


def _unitary(knot, level, N, rep, space, fiber, framing, normalized, digits, route="auto") -> FiniteLevelValue:
    """U(N)_k = (SU(N)_k x U(1)_{N(k+N)})/Z_N (:mod:`knotobs.evaluation.unitary_level`)."""
    from knotobs.evaluation.unitary_level import unitary_fiber_loop, unitary_level_loop

    if not normalized:
        raise KnotobsError("U(N) at finite level is computed normalised by Z(M): drop --raw")
    one = (rep if not rep or isinstance(rep[0], int) or isinstance(rep, str) else rep[0])
    if knot is not None and str(knot).strip().lower() not in ("fiber", "fibre"):
        if space.replace(" ", "").upper() not in ("S^3", "S3"):
            raise KnotobsError("U(N) torus knots at finite level are computed in S^3; in other spaces"
                               " colour a fiber (knot 'fiber' or --fiber i)")
        if route != "auto":
            raise KnotobsError("U(N) torus knots in S^3 have their two routes built in (the polynomial at"
                               " q = exp(2 pi i/K) is always compared): drop --route")
        return unitary_level_loop(knot, N, level, rep, framing=framing, digits=digits)
    if framing is None:
        # as for SU(N): zero framing by default, where the fibers are null-homologous (an integral
        # homology sphere); elsewhere U(N) fiber loops are computed in the fiber framing only
        from knotobs.fibrations.seifert import parse_space

        M = parse_space(space) if isinstance(space, str) else space
        if not M.is_integral_homology_sphere:
            raise KnotobsError(
                f"{space} has H_1 != 0, so a fiber has no zero framing (the default); U(N) fiber loops there"
                " are computed in the fiber framing: give framing 'fiber' (--framing fiber)")
        fr = "zero"
    elif _is_integer_framing(framing) and int(framing) == 0:
        fr = "zero"
    else:
        fr = framing
    if fr not in ("fiber", "zero"):
        raise KnotobsError(f"framing {framing!r}: a U(N) fiber loop takes framing 'fiber' or 'zero' (0)")
    if knot is None:
        if fiber is None:
            raise InvalidKnotError("give a knot T(p,q) or a fiber index (--fiber i) of the space")
        return unitary_fiber_loop(space, N, level, exceptional={fiber: as_partition(one)}, framing=fr,
                                  digits=digits, route=route)
    return unitary_fiber_loop(space, N, level, regular=[as_partition(one)], framing=fr, digits=digits, route=route)


def _is_integer_framing(framing) -> bool:
    """An explicit integer framing (``3``, ``"-2"``), as opposed to ``None``/``"zero"``/``"fiber"``."""
    return (isinstance(framing, int) and not isinstance(framing, bool)) or (
        isinstance(framing, str) and framing.lstrip("-").isdigit())


def _framing_int(framing) -> int:
    return int(framing) if _is_integer_framing(framing) else 0


def _reduced_framing(f: int, c: Fraction, K: int) -> int:
    """``f`` modulo ``K`` times the denominator of ``c = sum_i C(lam_i)``: the value at level
    ``K - N`` depends on the framing only through ``exp(2 pi i f c/K)`` (CONVENTIONS §2), so a
    framing of ``10^30`` need not be carried as such (it overflowed, or lost the phase).

    >>> _reduced_framing(10**30 + 7, Fraction(3), 8)     # SU(3), C([2,1]) = 3, level 5
    7
    """
    return f % (K * c.denominator) if c else 0


def polynomial_at_root_of_unity(poly: Laurent, K: int) -> Cyclotomic:
    """An exact Laurent polynomial in ``q`` at ``q = exp(2 pi i/K)`` as a cyclotomic number.

    ``q^(a/b) = zeta_(K b)^a``; the conductor is ``K`` times the exponent unit.

    >>> from knotobs.representations.groups import quantum_integer
    >>> v = polynomial_at_root_of_unity(quantum_integer(2), 5)     # [2] = 2 cos(pi/5)
    >>> abs(complex(v) - 2 * 0.8090169943749475) < 1e-12
    True
    """
    c = poly.canonical()
    D = c.exponent_unit()
    F = CyclotomicField(K * D)
    terms = c.terms()
    if not terms:
        return F.zero
    return F.from_exponents([int(e * D) for e in terms], list(terms.values()))


#: In S^3 with ``--route auto``, the exact polynomials replace the Seifert routes when those are
#: estimated above this many seconds and above :data:`POLYNOMIAL_RATIO` times the polynomials.
POLYNOMIAL_SWITCH_SECONDS = 1.0
POLYNOMIAL_RATIO = 3.0
#: Above this ``K`` the polynomial routes give the numeric value only (no cyclotomic form).
EXACT_PAIR_K = 2000


def _polynomials_are_cheaper(M, g, k, cols, level, mode, rj_seconds: float) -> str | None:
    """Why the two polynomial routes (Rosso-Jones and the weight sum, exact in ``q``) answer a
    normalised S^3 loop at ``level`` instead of surgery or localisation, or ``None``
    (``rj_seconds``: the Rosso-Jones estimate the caller already has)."""
    from knotobs.evaluation.estimates import fixed_estimate
    from knotobs.evaluation.seifert_routes import RouteEstimate, loop_estimates
    from knotobs.localisation.values import check_fiber_lines

    for lam in cols:
        check_integrable(lam, g.N, level)
    regular, exceptional = check_fiber_lines(M, g.N, level, list(cols), {}, mode)
    fits = [e for e in loop_estimates(M, g.N, level, regular, exceptional, True, mode) if e.fits()]
    if not fits:
        return None             # the caller's fallback (one polynomial route) says so
    best = min(fits, key=lambda e: e.seconds)
    ws_full, ws_mb, _ = fixed_estimate(k, g, cols, "weight-sum")
    if not RouteEstimate("weight-sum", ws_full, ws_mb).fits():
        return None             # the weight sum would refuse itself (its guard counts printing)
    poly = rj_seconds + fixed_estimate(k, g, cols, "weight-sum", printed=False)[0]
    if best.seconds > POLYNOMIAL_SWITCH_SECONDS and best.seconds > POLYNOMIAL_RATIO * poly:
        return (f"auto: the exact polynomials at q (estimated {poly:.2g} s; the cheapest Seifert route,"
                f" {best.route}, {best.seconds:.2g} s)")
    return None


def _polynomial_only(k, g, cols, level, framing, mode, digits, F, pair: str | None = None) -> FiniteLevelValue:
    """The exact polynomial at ``q = exp(2 pi i/K)``: Rosso-Jones alone when the Seifert routes
    are too large, or (``pair``: the reason) Rosso-Jones and the weight sum, equal as polynomials."""
    from knotobs.evaluation.weight_sum import weight_sum

    K = level + g.N
    for lam in cols:
        check_integrable(lam, g.N, level)
    fr = _framing_int(framing) if mode == "zero" else "fiber"
    frame = fr if fr == "fiber" else _reduced_framing(fr, sum((casimir(g, lam) for lam in cols), Fraction(0)), K)
    poly = rosso_jones(k, g, cols, frame)
    extra = {}
    if pair is not None:
        other = weight_sum(k, g, cols, frame)
        if other != poly:
            raise RouteMismatchError(f"Rosso-Jones and the weight sum differ for {k}, {g}, colours {cols}")
        extra = {"route": "Rosso-Jones = weight-sum (exact polynomials, equal), at q = exp(2 pi i/K)",
                 "routes": ["Rosso-Jones", "weight-sum"], "agreement": "exactly (equal polynomials in q)",
                 "route_choice": pair}
    if pair is not None and K > EXACT_PAIR_K:
        # the cyclotomic form would have about phi(2K) terms: numeric only (as the Seifert routes
        # at such levels); the evaluation adds the digits its coefficients can cancel
        exact = None
        numeric = poly.at_root_of_unity(K, dps=digits + 10)
        with working_precision(digits):
            numeric = +numeric
    else:
        exact = polynomial_at_root_of_unity(poly, K)
        numeric = exact.to_mpc(digits)
    framing_text = ("zero (Seifert) framing" if fr == 0 else
                    f"{fr} on every component relative to the zero framing" if mode == "zero" else
                    f"fiber framing P*Q = {k.P * k.Q}")
    return FiniteLevelValue(
        exact=exact, numeric=numeric, digits=digits, framing=framing_text,
        orientation=f"S^3 (the fibration {F.manifold})",
        normalisation="Z(M; L)/Z(M) (unknot in S^3 = dim_q)",
        details={"route": "exact polynomial at q = exp(2 pi i/K) only (modular data too large at this level)",
                 "group": str(g), "level": level, **extra},
    )
