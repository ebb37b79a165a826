"""Public entry points of the localisation route: ``Z_k(M)`` and fiber Wilson loops.

CONVENTIONS §10 (docs/localisation.md).  The manifold is ``M(g; b; (a_1, b_1), ...)``
(any base genus ``g >= 0``, any number of fibers, any orders, also orders sharing a factor);
the value is normalised by ``Z(S^3) = S_00``, ``Z(S^2 x S^1) = 1``, ``Z(S^1 x Sigma_g) =``
the Verlinde number, in the canonical 2-framing.  Wilson lines on fibers are framed by the
fibration: a regular fiber by a nearby regular fiber, the core of fiber ``i`` by the curve
``-y_i mu_i + x_i h`` of its gluing matrix ``U_i = [[a_i, -y_i], [b_i, x_i]]``
(``0 <= y_i < a_i``; CONVENTIONS §7).  ``framing="zero"`` converts to the zero (Seifert)
framing when every line is null-homologous (genus 0, ``e != 0``).

The route uses neither the S and T matrices nor the surgery presentation: it is the
independent second route to :mod:`knotobs.evaluation.surgery`.
"""

from __future__ import annotations

import math
from fractions import Fraction
from typing import Mapping, Sequence

import mpmath

from knotobs.errors import InexactDivisionError, InvalidGroupError, InvalidSeifertDataError, KnotobsError, NotIntegrableError
from knotobs.evaluation.finite_value import FiniteLevelValue
from knotobs.fibrations.seifert import SeifertManifold, parse_space
from knotobs.guard import require, seconds_for
from knotobs.localisation.formula import LocalisationSum, exact_cost
from knotobs.localisation.lattice import reduce_colour
from knotobs.numerics import working_precision
from knotobs.polynomials.cyclotomic import root_of_unity
from knotobs.representations.groups import parse_group

__all__ = [
    "as_manifold",
    "localisation_partition_function",
    "localisation_fiber_wilson_loop",
    "localisation_seconds",
    "EXACT_COST_LIMIT",
]

#: Above this estimated operation count (:func:`~knotobs.localisation.formula.exact_cost`,
#: about 0.25 s) the exact cyclotomic value is skipped by default (``exact=True`` forces it).
EXACT_COST_LIMIT = 1.0e6

#: Seconds per operation of :func:`~knotobs.localisation.formula.exact_cost`.
EXACT_SECONDS_PER_OP = 2.5e-7


def as_manifold(space) -> SeifertManifold:
    """A :class:`SeifertManifold` from a string, a manifold, ``(b, fibers)`` or ``(g, b, fibers)``.

    >>> as_manifold((0, -1, [(2, 1)])), as_manifold("M(2; 0)").genus
    (SeifertManifold(b=-1, fibers=((2, 1),)), 2)
    """
    if isinstance(space, (str, SeifertManifold)):
        return parse_space(space)
    if hasattr(space, "b") and hasattr(space, "fibers"):
        return SeifertManifold(space.b, tuple(space.fibers), getattr(space, "genus", 0))
    try:
        parts = tuple(space)
    except TypeError:
        parts = ()
    if len(parts) == 2:
        return SeifertManifold(parts[0], tuple(parts[1]))
    if len(parts) == 3:
        return SeifertManifold(parts[1], tuple(parts[2]), parts[0])
    raise InvalidSeifertDataError(
        f"{space!r} is not a Seifert manifold: give 'M(g; b; (a1,b1), ...)', a SeifertManifold,"
        " (b, [(a1, b1), ...]) or (g, b, [(a1, b1), ...])"
    )


def check_fiber_lines(M, N: int, k: int, regular, exceptional, framing: str):
    """Validate the Wilson lines of a fiber loop: exceptional fibers by index ``0..n-1``, the
    framing word, and every colour reduced into the level-``k`` alcove.  Returns
    ``(regular, exceptional)`` as reduced partitions (one check for every route)."""
    exceptional = dict(exceptional or {})
    for j in exceptional:
        if isinstance(j, bool) or not isinstance(j, int) or not 0 <= j < len(M.fibers):
            raise InvalidSeifertDataError(
                f"fiber index {j!r} does not exist: valid indices are 0..{len(M.fibers) - 1}"
                if M.fibers else f"fiber index {j!r} does not exist: the space has no exceptional fibers"
            )
    if framing not in ("fiber", "zero"):
        raise KnotobsError(f"framing {framing!r} is not known: use 'fiber' or 'zero'")
    return ([reduce_colour(nu, N, k) for nu in regular],
            {j: reduce_colour(mu, N, k) for j, mu in exceptional.items()})


def _group_level(group, level) -> tuple[int, int]:
    g = parse_group(group)
    if g.kind != "SU":
        raise InvalidGroupError(f"the localisation route computes SU(N); got {g}")
    if isinstance(level, bool) or not isinstance(level, int) or level < 1:
        raise NotIntegrableError(f"level k = {level!r} is not allowed: use an integer k >= 1")
    return g.N, level


def _sum(M: SeifertManifold, N: int, k: int, exceptional=None, regular=()) -> LocalisationSum:
    return LocalisationSum(M.genus, M.b, tuple(M.fibers), N, k, dict(exceptional or {}), list(regular))


def localisation_seconds(s: LocalisationSum, exact: bool = False) -> tuple[float, float]:
    """Estimated ``(seconds, megabytes)`` of evaluating ``s`` (from its sizes, before any work).

    >>> s = LocalisationSum(0, -1, ((2, 1), (3, 1), (5, 1)), 3, 40)
    >>> sec, mb = localisation_seconds(s)
    >>> 0.01 < sec < 5 and mb < 100
    True
    """
    W = math.factorial(s.N)
    terms = s.size * W * sum(2 * f.a for f in s.general)
    tables = sum(f.a ** (s.N) * 2 * f.a for f in s.general)
    roots = sum(f.modulus for f in s.general) + 2 * s.N * s.K
    per_weight = s.size * (s.n_general + s.npos + 3)
    sec = (seconds_for(terms * 12 + tables * 3, "numpy") + seconds_for(per_weight, "ball")
           + seconds_for(roots * 4, "ball") / 8)
    if exact:
        sec += exact_cost(s) * EXACT_SECONDS_PER_OP
    # the root-of-unity tables of every fiber (modulus 2 N a K entries each): about 200 bytes an
    # entry (measured 2026-12-04: SU(2) at K = 5 10^4 on Sigma(2,3,7), 565 MB for 2.6 10^6 entries)
    mb = (terms * 8 * 6 + tables * 8 * 3 + s.size * s.N * 8 * 4 + roots * 200) / 1e6
    return sec, mb


def _evaluate(s: LocalisationSum, digits: int, exact: bool | None, what: str):
    cost = exact_cost(s)
    want = exact if exact is not None else cost <= EXACT_COST_LIMIT
    sec, mb = localisation_seconds(s, exact=bool(want))
    require(f"localisation route: {what} ({s.size} weights, fibers of orders "
            f"{[f.a for f in s.general] or '-'})", seconds=sec, memory_mb=mb,
            accepted="use a smaller level or another route (--route)")
    value = s.exact() if want else None
    numeric = value.to_mpc(digits) if value is not None else s.numeric(digits)
    return value, numeric


def _orientation(M: SeifertManifold) -> str:
    return f"{M} with e = -(b + sum b_i/a_i) = {M.euler} (Neumann-Raymond)"


def localisation_partition_function(space, group="SU(2)", level: int = 1, digits: int = 30,
                                    exact: bool | None = None) -> FiniteLevelValue:
    """``Z_k(M)`` of ``M(g; b; (a_i, b_i))`` by the localisation formula (CONVENTIONS §10).

    Parameters
    ----------
    space : str, SeifertManifold, ``(b, fibers)`` or ``(g, b, fibers)``
    group : str
        ``"SU(N)"``, any ``N >= 2``.
    level : int
        ``k >= 1`` (``K = k + N``).
    digits : int
        Certified digits of the numeric value.
    exact : bool or None
        Force or skip the exact cyclotomic value (``None``: decide by size).

    Returns
    -------
    FiniteLevelValue
        ``Z(S^3) = S_00``, ``Z(S^2 x S^1) = 1``; canonical 2-framing.

    Examples
    --------
    >>> z = localisation_partition_function("M(2; 0)", "SU(2)", 3)     # Verlinde number
    >>> z.exact.as_cyclotomic().rational_value()
    Fraction(20, 1)
    >>> z = localisation_partition_function("S^3", "SU(2)", 3)
    >>> mpmath.nstr(z.numeric.real, 12)                                 # S_00 = sqrt(2/5) sin(pi/5)
    '0.37174803446'

    References
    ----------
    L. Jeffrey, Commun. Math. Phys. 147 (1992); L. Rozansky, Commun. Math. Phys. 175 (1996),
    178 (1996); S. K. Hansen, Algebr. Geom. Topol. 1 (2001); S. K. Hansen & T. Takata,
    arXiv math/0209403; M. Blau & G. Thompson, JHEP 0605:003 (2006).
    """
    M = as_manifold(space)
    N, k = _group_level(group, level)
    s = _sum(M, N, k)
    value, numeric = _evaluate(s, digits, exact, f"Z of {M}, SU({N}) at level {k}")
    return FiniteLevelValue(
        exact=value, numeric=numeric, digits=digits,
        framing="canonical 2-framing (Atiyah)",
        orientation=_orientation(M),
        normalisation="Z(S^3) = S_00, Z(S^2 x S^1) = 1",
        details={"route": "localisation", "group": f"SU({N})", "level": k, "genus": M.genus,
                 "seifert": (M.b, tuple(M.fibers)), "weights": s.size},
    )


def _framings(M: SeifertManifold, regular, exceptional) -> tuple[list, list]:
    """Self-linking of each line (regular first) in the fibration framing, and whether it is
    null-homologous; ``None``/``False`` when undefined (``e = 0`` or genus >= 1)."""
    fr, nh = [], []
    qhs = M.is_rational_homology_sphere
    if qhs:
        hcls, ccls = M.fiber_homology_classes()
    for _ in regular:
        fr.append(M.fiber_framing if qhs else None)
        nh.append(qhs and not any(hcls))
    for i in exceptional:
        fr.append(M.core_self_linking(i) if qhs else None)
        nh.append(qhs and not any(ccls[i]))
    return fr, nh


def localisation_fiber_wilson_loop(space, level: int, group="SU(2)", regular: Sequence = (),
                                   exceptional: Mapping[int, object] | None = None,
                                   normalized: bool = True, digits: int = 30, framing: str = "fiber",
                                   exact: bool | None = None) -> FiniteLevelValue:
    """Wilson loops on fibers of ``M(g; b; (a_i, b_i))`` by the localisation formula.

    Parameters
    ----------
    space, level, group
        As :func:`localisation_partition_function`.
    regular : list of partitions
        Colours of parallel regular fibers.
    exceptional : dict ``{fiber_index: partition}``
        Colours of cores; ``fiber_index`` counts the given fibers ``(a_i, b_i)`` from 0.
    normalized : bool
        ``Z(M; L)/Z(M)`` (default) or ``Z(M; L)``.
    framing : ``"fiber"`` or ``"zero"``
        ``"fiber"``: the fibration framing (module docstring); ``"zero"``: the zero framing,
        only if every line is null-homologous.

    Examples
    --------
    >>> w = localisation_fiber_wilson_loop((0, [(2, 1), (3, -1)]), 3, "SU(2)", regular=[(1,)])
    >>> w.details["framings"]                                        # S^3, fiber T(2,3)
    [Fraction(6, 1)]

    References
    ----------
    CONVENTIONS §7, §10; M. Blau & G. Thompson, arXiv:1306.3381 (fiber Wilson loops);
    C. Beasley, Adv. Theor. Math. Phys. 17 (2013) 1-240.
    """
    M = as_manifold(space)
    N, k = _group_level(group, level)
    regular, exceptional = check_fiber_lines(M, N, k, regular, exceptional, framing)
    framings, null_hom = _framings(M, regular, exceptional)
    K = k + N
    shift = Fraction(0)
    if framing == "zero":
        for f, ok, lam in zip(framings, null_hom, list(regular) + list(exceptional.values())):
            if f is None or not ok:
                raise InexactDivisionError(
                    "a fiber is not null-homologous in this manifold (or H_1 is infinite), so it has"
                    " no zero framing; use framing='fiber' (--framing fiber)"
                )
            shift -= f * _casimir(lam, N) / K
    s_L = _sum(M, N, k, exceptional, regular)
    what = f"Wilson loop in {M}, SU({N}) at level {k}"
    val_L, num_L = _evaluate(s_L, digits + 5, exact, what)
    if normalized:
        s_0 = _sum(M, N, k)
        val_0, num_0 = _evaluate(s_0, digits + 5, exact if val_L is not None else False, what)
        if (val_0 is not None and val_0.is_zero()) or abs(num_0) < mpmath.mpf(10) ** (-(digits + 3)):
            raise InexactDivisionError(
                f"Z(M) vanishes at level {k}; the normalised Wilson loop is undefined: ask for Z(M; L)"
                " itself (normalized=False; knotobs loop --raw)"
            )
    value = None
    if val_L is not None and (not normalized or val_0 is not None):
        value = (val_L / val_0 if normalized else val_L) * root_of_unity(shift)
        numeric = value.to_mpc(digits)
    else:
        with working_precision(digits + 10):
            ph = mpmath.expjpi(2 * mpmath.mpf(shift.numerator) / shift.denominator)
            numeric = (num_L / num_0 if normalized else num_L) * ph
        with working_precision(digits):
            numeric = +numeric
    fr_text = ("fibration framing (regular fibers: a nearby fiber; cores: the gluing-matrix curve"
               f" -y mu + x h); self-linking in M: {[_fr(f) for f in framings]}") if framing == "fiber" \
        else "zero (Seifert) framing"
    return FiniteLevelValue(
        exact=value, numeric=numeric, digits=digits, framing=fr_text,
        orientation=_orientation(M),
        normalisation=("Z(M; L)/Z(M) (unknot in S^3 = dim_q)" if normalized
                       else "Z(M; L) with Z(S^3) = S_00 (unknot in S^3 = S_0lam)"),
        details={"route": "localisation", "group": f"SU({N})", "level": k, "framings": framings,
                 "null_homologous": null_hom, "genus": M.genus},
    )


def _casimir(lam, N: int) -> Fraction:
    """``C(lam) = (kappa + N|lam| - |lam|^2/N)/2`` (CONVENTIONS §2)."""
    n = sum(lam)
    kap = sum(x * (x - 2 * i - 1) for i, x in enumerate(lam))
    return Fraction(kap + N * n, 2) - Fraction(n * n, 2 * N)


def _fr(f) -> str:
    """A self-linking number as text (``undefined`` when ``H_1`` is infinite)."""
    return "undefined (H_1 infinite)" if f is None else str(f)
