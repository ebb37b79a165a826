"""The top-level Python API: one argument order, strings accepted, only knotobs errors.

Every function here takes, in this order, the knot or space, the group, the level, the
representation, then keyword options (docs/interface.md, §15), accepts strings wherever
it accepts objects (``"T(2,3)"``, ``"SU(3)"``, ``"[2,1]"``, ``"Sigma(2,3,5)"``), and
raises only subclasses of :class:`knotobs.errors.KnotobsError`.  The functions delegate
to the library routes; no mathematics happens here.

Older call forms are kept where they cannot be misread:

* ``wilson_loop(knot, group, rep)`` (the representation third, as a partition);
* ``level_loop(knot, level, group, rep)`` and ``fiber_wilson_loop(space, level, group, ...)``
  (an integer second and a group third);
* ``sl_wilson_loop(knot, rep, couplings, N=...)`` and ``sl2c_partition_function(space, couplings)``.

An integer where the group belongs (``partition_function(M, 3)``) is refused: it could
mean ``SU(3)`` or level 3.

Examples
--------
>>> import knotobs
>>> knotobs.wilson_loop("T(2,3)", "SU(2)", normalized=True).exact_string()
'-q^-4 + q^-3 + q^-1'
>>> v = knotobs.wilson_loop("T(2,3)", "SU(2)", 3)          # level 3: an exact cyclotomic number
>>> v.to_sympy().free_symbols
set()
>>> knotobs.partition_function("Sigma(2,3,5)", 3)
Traceback (most recent call last):
...
knotobs.errors.InvalidGroupError: group 3: give the group as a string such as 'SU(3)' (an integer is ambiguous: for level 3 write partition_function(space, 'SU(2)', 3))

References
----------
docs/interface.md (§15) and docs/conventions.md for the conventions of every value.
"""

from __future__ import annotations

import functools
from typing import Any, Callable, Optional

from knotobs.errors import InvalidGroupError, InvalidKnotError, InvalidRepresentationError, KnotobsError, ParseError

__all__ = [
    "InternalError", "wilson_loop", "level_loop", "partition_function", "fiber_wilson_loop",
    "rosso_jones", "weight_sum", "jones", "colored_jones", "homfly", "alexander",
    "flat_connections", "continued_partition_function", "sl_wilson_loop", "sl2c_partition_function",
    "asymptotic_value", "kashaev_invariant", "ohtsuki_series", "compare", "identify",
]


class InternalError(KnotobsError, RuntimeError):
    """An unexpected failure inside knotobs (a bug): reported as a knotobs error, with the cause chained."""


def _only_knotobs_errors(func: Callable) -> Callable:
    """Let knotobs errors through; turn anything else into :class:`InternalError` (cause chained)."""

    @functools.wraps(func)
    def wrapper(*args, **kwargs):
        try:
            return func(*args, **kwargs)
        except KnotobsError:
            raise
        except TypeError as exc:
            if "argument" in str(exc):      # wrong call: unknown keyword, too many positionals
                raise ParseError(f"knotobs.{func.__name__}: {exc}") from None
            raise InternalError(f"knotobs.{func.__name__} failed unexpectedly ({type(exc).__name__}: {exc});"
                                " please report this with the call") from exc
        except (ValueError, AttributeError, KeyError, IndexError, ZeroDivisionError, ArithmeticError) as exc:
            raise InternalError(f"knotobs.{func.__name__} failed unexpectedly ({type(exc).__name__}: {exc});"
                                " please report this with the call") from exc

    return wrapper


# ------------------------------------------------------------------ coercion of inputs
def _is_int(x) -> bool:
    return isinstance(x, int) and not isinstance(x, bool)


def as_knot(knot):
    """A :class:`~knotobs.fibrations.torus.TorusLink` from ``"T(p,q)"``, ``(p, q)`` or itself.

    >>> as_knot("T(2,3)"), as_knot((2, 5))
    (TorusLink(p=2, q=3), TorusLink(p=2, q=5))
    """
    from knotobs.fibrations.torus import TorusLink, parse_knot

    if isinstance(knot, TorusLink):
        return knot
    if isinstance(knot, str):
        return parse_knot(knot)
    if isinstance(knot, (tuple, list)) and len(knot) == 2 and all(_is_int(x) for x in knot):
        return TorusLink(int(knot[0]), int(knot[1]))
    raise InvalidKnotError(f"knot {knot!r}: give a torus knot or link as 'T(p,q)' or (p, q)")


def as_group(group, where: str = "the call"):
    """A :class:`~knotobs.representations.groups.Group` from ``"SU(3)"``, ``("A", 2)`` or itself.

    An integer is refused: it is ambiguous between the rank and a level.

    >>> as_group("U(2)")
    Group(kind='U', N=2)
    """
    from knotobs.representations.groups import Group, parse_group

    if isinstance(group, Group):
        return group
    if _is_int(group):
        raise InvalidGroupError(
            f"group {group}: give the group as a string such as 'SU({group})' (an integer is ambiguous: "
            f"for level {group} write {where.replace('k)', str(group) + ')')})")
    if isinstance(group, (str, tuple)):
        return parse_group(group)
    raise InvalidGroupError(f"group {group!r}: give a group such as 'SU(2)', 'SU(3)' or 'U(2)'")


def _is_cartan(group) -> bool:
    """SO(N), Spin(N), Sp(2n), G2 (the Cartan engine reads their representations itself)."""
    if not isinstance(group, str):
        return False
    from knotobs.representations.cartan.group import is_simple_group_name

    return is_simple_group_name(group)


def _group_text(group, where: str) -> str:
    """The group as the evaluators take it: the text for SO/Sp/G2, the parsed SU(N)/U(N) otherwise."""
    return group if _is_cartan(group) else str(as_group(group, where))


def _rep_for(group, rep, color):
    """The representation for ``group``: as given (text, Dynkin labels) for SO/Sp/G2, else :func:`as_rep`."""
    if _is_cartan(group):
        if color is not None:
            raise ParseError(f"color={color!r} is the SU(2) shorthand; for {group} give rep (a partition or Dynkin labels)")
        return "[1]" if rep is None else rep
    return as_rep(rep, color, group)


_LEVEL_ROUTES = (None, "auto", "surgery", "localisation", "both")


def _looks_like_rep(x) -> bool:
    if isinstance(x, str):
        s = x.strip()
        return s.startswith(("[", "(")) or s == ""
    return isinstance(x, (list, tuple))


def as_rep(rep, color: Optional[int] = None, group=None):
    """A partition, or a list of partitions (one per component), from text or sequences.

    ``color = n`` is the SU(2) shorthand for the ``n``-dimensional irrep, ``[n-1]``.  Text in round
    brackets, ``"(1,1)"``, is SU(N) Dynkin labels of ``group``
    (:func:`knotobs.representations.partitions.parse_rep_for`), never a partition.

    >>> as_rep("[2,1]"), as_rep("[1];[2]"), as_rep([[1], [2]]), as_rep(None, color=3)
    ((2, 1), [(1,), (2,)], [(1,), (2,)], (2,))
    """
    from knotobs.representations.partitions import as_partition, parse_rep_for

    def parse_one(text):
        return parse_rep_for(text, None if group is None else str(group))

    if color is not None:
        if rep is not None:
            raise ParseError("give the representation once: rep (a partition) or color (a dimension), not both")
        if not _is_int(color) or color < 1:
            raise InvalidRepresentationError(f"color {color!r}: the dimension n of an SU(2) irrep is an integer >= 1")
        return (color - 1,) if color > 1 else ()
    if rep is None:
        return (1,)
    if isinstance(rep, str):
        parts = [p for p in rep.split(";") if p.strip()]
        if len(parts) > 1:
            return [parse_one(p) for p in parts]
        return parse_one(parts[0]) if parts else ()
    if _is_int(rep):
        raise InvalidRepresentationError(
            f"rep {rep!r}: give a partition such as [{rep}] (or color={rep} for the {rep}-dimensional SU(2) irrep)")
    if isinstance(rep, (list, tuple)):
        if rep and all(isinstance(c, (list, tuple, str)) for c in rep):
            return [parse_one(c) if isinstance(c, str) else as_partition(c) for c in rep]
        return as_partition(rep)
    raise InvalidRepresentationError(f"rep {rep!r}: give a partition such as [2,1], or one per component")


def _required_rep(rep, group=None):
    if rep is None:
        raise InvalidRepresentationError("rep None: give a partition such as [1] or [2,1] (one per component for links)")
    return as_rep(rep, group=group)


def as_level(level, name: str = "level") -> int:
    """A level ``k >= 1`` (an integer)."""
    if not _is_int(level):
        raise ParseError(f"{name} {level!r}: the level is an integer k >= 1"
                         " (complex levels: knotobs.continued_partition_function)")
    if level < 1:
        raise ParseError(f"{name} {level}: the level is an integer k >= 1")
    return int(level)


def _space_arg(space):
    """Space strings go through the name recogniser; objects and ``(b, fibers)`` pass through."""
    return space


# ------------------------------------------------------------------ exact polynomials in S^3
@_only_knotobs_errors
def wilson_loop(knot, group="SU(2)", level=None, rep=None, *, color=None, framing=None, normalized: bool = False,
                route: Optional[str] = None, space: str = "S^3", fiber: Optional[int] = None, raw: bool = False,
                digits: int = 30):
    """The Wilson loop of a torus knot/link: an exact polynomial in ``q``, or its value at level ``k``.

    Parameters
    ----------
    knot : str or TorusLink
        ``T(p,q)``; with a level also ``"fiber"`` (a regular fiber of ``space``) or ``None``
        with ``fiber`` (an exceptional fiber).
    group : str or Group
        ``"SU(N)"`` or ``"U(N)"``.
    level : int, optional
        Without it: the polynomial (:class:`~knotobs.evaluation.result.PolynomialResult`);
        with it: the value at ``q = exp(2 pi i/(k+N))``
        (:class:`~knotobs.evaluation.finite_value.FiniteLevelValue`, see :func:`level_loop`).
    rep : partition, text or list of partitions
        ``[2,1]``, ``"[2,1]"``, ``"[1];[2]"`` (one per component).  ``wilson_loop(knot, group,
        [2, 1])`` (the older order) is read as the representation.
    color : int, optional
        SU(2) shorthand: the ``n``-dimensional irrep (``rep = [n-1]``).
    framing, normalized, route
        As in :func:`knotobs.evaluation.families.wilson_loop`.  ``normalized`` (unknot = 1)
        applies to the polynomial only.
    space, fiber, raw, digits
        With a level only (:func:`level_loop`).

    Examples
    --------
    >>> wilson_loop("T(2,3)", "SU(2)", [1], normalized=True).exact_string()
    '-q^-4 + q^-3 + q^-1'
    >>> wilson_loop("T(2,3)", "SU(2)", raw=True)
    Traceback (most recent call last):
    ...
    knotobs.errors.ParseError: raw=True needs a level: the polynomial in q is the Wilson loop in S^3 itself

    References
    ----------
    M. Rosso, V. F. R. Jones, J. Knot Theory Ramifications 2 (1993) 97–112; docs/conventions.md §3, §4.
    """
    if level is not None and not _is_int(level) and _looks_like_rep(level):
        if rep is not None:
            raise ParseError(f"level {level!r} is not an integer: the order is knot, group, level, rep")
        level, rep = None, level
    if level is None:
        for name, val, default in (("space", space, "S^3"), ("fiber", fiber, None), ("raw", raw, False)):
            if val != default:
                why = ("the polynomial in q is the Wilson loop in S^3 itself" if name == "raw"
                       else "polynomials in q are computed in S^3")
                raise ParseError(f"{name}={val!r} needs a level: {why}")
        from knotobs.evaluation.families import wilson_loop as _wl

        g = group if _is_cartan(group) else as_group(group, "wilson_loop(knot, 'SU(2)', k)")
        return _wl(as_knot(knot), g, _rep_for(group, rep, color),
                   0 if framing is None else framing, normalized, route or "rosso-jones")
    if normalized:
        raise ParseError("normalized=True (unknot = 1) applies to polynomials; at a level the value is "
                         "Z(M; L)/Z(M) (unknot = dim_q), or Z(M; L) itself with raw=True")
    if route not in _LEVEL_ROUTES:
        raise ParseError(f"route={route!r}: at a level choose auto, surgery, localisation or both; in S^3 the exact "
                         "polynomial is always evaluated as a further check")
    return level_loop(knot, group, level, rep, color=color, space=space, fiber=fiber, framing=framing, raw=raw,
                      digits=digits, route=route or "auto")


@_only_knotobs_errors
def level_loop(knot=None, group="SU(2)", level=None, rep=None, *, color=None, space: str = "S^3",
               fiber: Optional[int] = None, framing=None, raw: bool = False, digits: int = 30,
               route: str = "auto", **old):
    """Wilson loop at level ``k`` of a torus knot/link, a regular fiber or an exceptional fiber.

    Parameters
    ----------
    knot : str, optional
        ``T(p,q)``, ``"fiber"``, or ``None`` with ``fiber``.
    group : str
        ``"SU(N)"``.
    level : int
        ``k >= 1``.  The older order ``level_loop(knot, k, group, rep)`` is accepted.
    rep, color
        The representation (see :func:`as_rep`).
    space : str
        ``S^3``, ``L(p,q)``, ``Sigma(a,b,c)``, ``M(0; b; ...)``.
    fiber : int, optional
        The exceptional fiber, numbered 1..n in the order of the Seifert invariants.
    framing : None, ``"zero"``, ``"fiber"`` or int
    raw : bool
        ``True``: ``Z(M; L)`` itself; default ``Z(M; L)/Z(M)``.
    digits : int
    route : str
        ``auto``, ``surgery``, ``localisation`` or ``both`` (two routes, agreement recorded).

    Examples
    --------
    >>> v = level_loop("T(2,3)", "SU(2)", 3)
    >>> level_loop("T(2,3)", 3).numeric == v.numeric     # the older order
    True

    References
    ----------
    docs/conventions.md §5, §7; N. Reshetikhin, V. Turaev, Invent. Math. 103 (1991).
    """
    if _is_int(group) and (level is None or not _is_int(level)):
        # older order: level_loop(knot, level, group, rep)
        group, level = ("SU(2)" if level is None else level), group
    if "normalized" in old:
        raise ParseError("level_loop(normalized=...) is ambiguous: the value is Z(M; L)/Z(M) by default;"
                         " pass raw=True for Z(M; L) itself")
    if old:
        raise ParseError(f"level_loop: unknown keyword {sorted(old)[0]!r}")
    if level is None:
        raise ParseError("give the level: level_loop(knot, 'SU(2)', k)")
    if route not in _LEVEL_ROUTES:
        raise ParseError(f"route={route!r}: choose auto, surgery, localisation or both")
    g = _group_text(group, "level_loop(knot, 'SU(2)', k)")
    k = as_level(level)
    r = _rep_for(group, rep, color)
    if fiber is not None:
        if knot is not None:
            raise ParseError("give a knot or an exceptional fiber (fiber=i), not both")
        if not _is_int(fiber) or fiber < 1:
            raise ParseError(f"fiber {fiber!r}: exceptional fibers are numbered 1..n in the order of the"
                             " Seifert invariants")
        fiber = fiber - 1
    from knotobs.evaluation.level_loops import level_loop as _ll

    return _ll(knot, k, g, r, space, fiber, framing, not raw, digits, route or "auto")


@_only_knotobs_errors
def partition_function(space, group="SU(2)", level=None, digits: int = 30, exact: Optional[bool] = None,
                       route: str = "auto"):
    """Chern–Simons partition function ``Z_k(M)`` of a Seifert manifold (canonical 2-framing).

    Parameters
    ----------
    space : str, SeifertManifold or ``(b, [(a_1, b_1), ...])``
        A name (``"Sigma(2,3,5)"``, ``"L(7,2)"``, ``"S^2xS^1"``, ``"M(0; b; ...)"``) or an object.
    group : str
        ``"SU(N)"`` (an integer is refused as ambiguous).
    level : int
    digits, exact, route
        As in :func:`knotobs.evaluation.surgery.partition_function`.

    Examples
    --------
    >>> z = partition_function("Sigma(2,3,5)", "SU(2)", 3)
    >>> print(z.exact)
    sqrt(10) * (-1/10*z20 + 1/5*z20^3 + 1/5*z20^7)

    References
    ----------
    L. Jeffrey, Commun. Math. Phys. 147 (1992) 563–604; docs/conventions.md §9.
    """
    g = _group_text(group, "partition_function(space, 'SU(2)', k)")
    if level is None:
        raise ParseError("give the level: partition_function(space, 'SU(2)', k)")
    k = as_level(level)
    if isinstance(space, str) or _is_cartan(group):
        from knotobs.evaluation.level_loops import level_partition_function

        return level_partition_function(space if isinstance(space, str) else str(space), g, k, digits,
                                        route=route)[0]
    from knotobs.evaluation import partition_function as _pf

    return _pf(space, g, k, digits, exact=exact, route=route)


@_only_knotobs_errors
def fiber_wilson_loop(space, group="SU(2)", level=None, rep=None, *, fiber: Optional[int] = None, regular=(),
                      exceptional=None, raw: bool = False, digits: int = 30, framing: str = "fiber",
                      exact: Optional[bool] = None, route: str = "auto", **old):
    """Wilson loops along regular and exceptional fibers of a Seifert manifold at level ``k``.

    Parameters
    ----------
    space : str, SeifertManifold or ``(b, fibers)``
    group : str
    level : int
        The older order ``fiber_wilson_loop(space, k, group, ...)`` is accepted (its
        ``exceptional`` keys then count from 0, as before).
    rep : partition, optional
        With ``fiber``: the colour of that exceptional fiber.
    fiber : int, optional
        Exceptional fiber numbered 1..n in the order of the Seifert invariants.
    regular : list of partitions
        Colours of parallel regular fibers.
    exceptional : dict ``{i: partition}``, i in 1..n
    raw : bool
        ``Z(M; L)`` itself instead of ``Z(M; L)/Z(M)``.

    Examples
    --------
    >>> w = fiber_wilson_loop("M(0; 0; (2,1), (3,-1))", "SU(2)", 3, regular=[[1]])   # T(2,3) in S^3
    >>> abs(w.numeric - level_loop("T(2,3)", "SU(2)", 3, framing="fiber").numeric) < 1e-25
    True

    References
    ----------
    docs/conventions.md §7; L. Rozansky, Commun. Math. Phys. 178 (1996) 27–60.
    """
    offset = 1
    if _is_int(group) and (level is None or not _is_int(level)):
        group, level = ("SU(2)" if level is None else level), group
        offset = 0
    normalized = not raw
    if "normalized" in old:
        if offset == 1:
            raise ParseError("fiber_wilson_loop(normalized=...) is ambiguous: the value is Z(M; L)/Z(M) by"
                             " default; pass raw=True for Z(M; L) itself")
        normalized = bool(old.pop("normalized"))
    if old:
        raise ParseError(f"fiber_wilson_loop: unknown keyword {sorted(old)[0]!r}")
    g = as_group(group, "fiber_wilson_loop(space, 'SU(2)', k)")
    if level is None:
        raise ParseError("give the level: fiber_wilson_loop(space, 'SU(2)', k, ...)")
    k = as_level(level)
    exc: dict = {}
    for i, lam in (exceptional or {}).items():
        if not _is_int(i) or i < offset:
            raise ParseError(f"exceptional fiber {i!r}: fibers are numbered {offset}..n")
        exc[i - offset] = as_rep(lam, group=g)
    if fiber is not None:
        if not _is_int(fiber) or fiber < 1:
            raise ParseError(f"fiber {fiber!r}: exceptional fibers are numbered 1..n")
        exc[fiber - 1] = as_rep(rep, group=g)
    elif rep is not None:
        raise ParseError("rep colours an exceptional fiber: give fiber=i too (or regular=[...] for regular fibers)")
    if isinstance(space, str):
        from knotobs.fibrations.seifert import parse_space

        space = parse_space(space)
    from knotobs.evaluation import fiber_wilson_loop as _fwl

    if route not in _LEVEL_ROUTES:
        raise ParseError(f"route={route!r}: choose auto, surgery, localisation or both")
    if str(g).startswith("U("):
        from knotobs.evaluation.unitary_level import unitary_fiber_loop

        if not normalized:
            raise ParseError("U(N) fiber loops are computed normalised by Z(M): drop raw=True")
        if route not in ("auto", "both"):
            raise ParseError(f"route={route!r}: U(N) fiber loops take route 'auto' or 'both'")
        return unitary_fiber_loop(space, str(g), k, regular=[as_rep(c, group=g) for c in regular], exceptional=exc,
                                  framing=framing, digits=digits, route=route)
    return _fwl(space, k, str(g), regular=[as_rep(c, group=g) for c in regular], exceptional=exc,
                normalized=normalized, digits=digits, framing=framing, exact=exact, route=route or "auto")


@_only_knotobs_errors
def rosso_jones(knot, group="SU(2)", rep=(1,), framing=0):
    """The Rosso–Jones sum: the Wilson loop of a torus knot/link as a Laurent polynomial in ``q``.

    >>> rosso_jones("T(2,3)", "SU(2)", [[1]]).to_string("q")   # (t + t^3 - t^4)(t^1/2 + t^-1/2), t = 1/q
    '-q^(-9/2) + q^(-5/2) + q^(-3/2) + q^(-1/2)'

    References
    ----------
    M. Rosso, V. F. R. Jones, J. Knot Theory Ramifications 2 (1993) 97–112.
    """
    from knotobs.evaluation.rosso_jones import rosso_jones as _rj

    return _rj(as_knot(knot), as_group(group), _required_rep(rep, group), framing)


@_only_knotobs_errors
def weight_sum(knot, group="SU(2)", rep=(1,), framing=0):
    """The Gaussian weight sum (the second route) as a Laurent polynomial in ``q``.

    >>> weight_sum("T(2,3)", "SU(2)", "[1]") == rosso_jones("T(2,3)", "SU(2)", "[1]")
    True

    References
    ----------
    X.-S. Lin, H. Zheng, Trans. Amer. Math. Soc. 362 (2010) 1–18.
    """
    from knotobs.evaluation.weight_sum import weight_sum as _ws

    return _ws(as_knot(knot), as_group(group), _required_rep(rep, group), framing)


@_only_knotobs_errors
def jones(knot, **options):
    """Jones polynomial (see :func:`knotobs.evaluation.families.jones`).

    >>> jones("T(2,5)").exact_string()
    't^2 + t^4 - t^5 + t^6 - t^7'
    """
    from knotobs.evaluation.families import jones as _j

    return _j(as_knot(knot), **options)


@_only_knotobs_errors
def colored_jones(knot, color: int = 2, **options):
    """Coloured Jones polynomial ``J_n`` (``color = n``, the dimension).

    >>> colored_jones("T(2,3)", 2).exact_string()
    't + t^3 - t^4'
    """
    from knotobs.evaluation.families import colored_jones as _cj

    return _cj(as_knot(knot), color, **options)


@_only_knotobs_errors
def homfly(knot, rep=None, **options):
    """HOMFLY-PT polynomial (see :func:`knotobs.evaluation.families.homfly`).

    >>> homfly("T(2,3)").exact_string()
    '2*a^-2 + a^-2*z^2 - a^-4'
    """
    from knotobs.evaluation.families import homfly as _h

    return _h(as_knot(knot), as_rep(rep), **options)


@_only_knotobs_errors
def alexander(knot, **options):
    """Alexander polynomial.

    >>> alexander("T(2,3)").exact_string()
    't^-1 - 1 + t'
    """
    from knotobs.evaluation.families import alexander as _a

    return _a(as_knot(knot), **options)


# ------------------------------------------------------------------ continuation side
def _su2_only(group, what: str):
    g = as_group(group)
    if str(g) != "SU(2)":
        raise InvalidGroupError(f"group {g}: {what} is computed for SU(2)")
    return g


@_only_knotobs_errors
def flat_connections(space, group="SU(2)", *, order: int = 6):
    """Flat connections on a Seifert manifold: SU(2) (table with Ohtsuki series) or SU(N) on lens spaces.

    >>> t = flat_connections("Sigma(2,3,5)")
    >>> [str(c.cs) for c in t.connections]      # -49/120, -1/120 mod 1 (Fintushel-Stern 1990)
    ['0', '71/120', '119/120']

    References
    ----------
    R. Fintushel, R. Stern, Proc. London Math. Soc. 61 (1990) 109–137.
    """
    g = as_group(group)
    if g.kind != "SU":
        raise InvalidGroupError(f"group {g}: flat connections are computed for SU(N)")
    if g.N == 2:
        from knotobs.continuation.flat import flat_connections as _fc

        return _fc(space, ohtsuki_order=order)
    from knotobs.continuation.flat_sun import lens_flat_connections

    return lens_flat_connections(space, g.N)


@_only_knotobs_errors
def continued_partition_function(space, group="SU(2)", level=None, *, K=None, digits: int = 30,
                                 phases: str = "reduced"):
    """Partition function at complex level (``level`` = k, or ``K = k + N``).

    SU(2) on every Seifert manifold with ``e != 0``; SU(3) on every Seifert manifold with
    ``e != 0`` within the size limits (orders sharing a factor and base genus ``g >= 1`` included);
    SU(N), N >= 4, on lens spaces (:mod:`knotobs.continuation.cartan`; poles for N >= 4 are
    refused); every SU(N) on every space with ``e = 0``: ``S^1 x Sigma_g`` as its Verlinde
    polynomial in ``K``, and with exceptional fibers (torus bundles, ...) as a quasi-polynomial in
    ``K`` (docs/continuation_sun.md §18.11).

    >>> z = continued_partition_function("Sigma(2,3,5)", "SU(2)", 3, digits=15)
    >>> abs(z.numeric - partition_function("Sigma(2,3,5)", "SU(2)", 3).numeric) < 1e-12
    True

    References
    ----------
    R. Lawrence, L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314.
    """
    if not isinstance(group, str) or not group.strip().upper().startswith(("SU", "U", "SL")):
        if not hasattr(group, "kind"):
            if level is None and K is None:      # older form continued_partition_function(space, level)
                group, level = "SU(2)", group
            else:
                as_group(group)
    g = str(group).replace(" ", "").upper() if isinstance(group, str) else str(group)
    from knotobs.continuation.cartan.quasipolynomial import has_zero_euler
    from knotobs.fibrations.seifert import SeifertManifold, parse_space

    M = space if isinstance(space, SeifertManifold) else parse_space(space)
    if g.startswith("SU(") and (g != "SU(2)" or has_zero_euler(M)):
        # SU(N), and e = 0 for every N (S^1 x Sigma_g: the Verlinde polynomial; with exceptional
        # fibers the quasi-polynomial in K of docs §18.11)
        from knotobs.continuation.cartan import continued_sun_partition_function

        return continued_sun_partition_function(space, g, level, K=K, digits=digits, phases=phases)
    _su2_only(group, "the continuation in the level")
    from knotobs.continuation.level import continued_partition_function as _cpf

    return _cpf(space, level, K=K, digits=digits, phases=phases)


@_only_knotobs_errors
def sl_wilson_loop(knot, group="SL(2,C)", couplings=None, rep="[1];[]", *, framing=0, normalized: bool = False,
                   digits: int = 30, N: Optional[int] = None):
    """SL(N,C) Wilson loop of a torus knot at the couplings ``(t, tt)``.

    The older order ``sl_wilson_loop(knot, rep, couplings, N=...)`` is accepted.

    >>> w = sl_wilson_loop("T(2,3)", "SL(2,C)", "10+2i,10-2i", "[1];[]", digits=10)
    >>> w.numeric == sl_wilson_loop("T(2,3)", "[1];[]", "10+2i,10-2i", digits=10).numeric
    True
    """
    from knotobs.continuation.complex import sl_wilson_loop as _sl

    if isinstance(group, str) and not group.strip().upper().startswith("SL"):
        group, rep = "SL(2,C)" if N is None else f"SL({N},C)", group      # older order
    elif N is not None:
        raise ParseError("give the group once: group='SL(N,C)' (N= is the older spelling)")
    g = str(group).replace(" ", "").upper()
    import re

    m = re.fullmatch(r"SL\((\d+),C\)", g)
    if not m:
        raise InvalidGroupError(f"group {group!r}: give SL(N,C), e.g. 'SL(2,C)'")
    if couplings is None:
        raise ParseError("give the couplings t,tt, e.g. '10+2i,10-2i'")
    return _sl(knot, rep, couplings, N=int(m.group(1)), framing=framing, normalized=normalized, digits=digits)


@_only_knotobs_errors
def sl2c_partition_function(space, group="SL(2,C)", couplings=None, *, digits: int = 30):
    """SL(2,C) partition function as a sum over flat-connection sectors.

    The older order ``sl2c_partition_function(space, couplings)`` is accepted.
    """
    from knotobs.continuation.complex import sl2c_partition_function as _s

    if couplings is None and not str(group).replace(" ", "").upper().startswith("SL("):
        group, couplings = "SL(2,C)", group
    if str(group).replace(" ", "").upper() != "SL(2,C)":
        raise InvalidGroupError(f"group {group!r}: the sector sum is computed for SL(2,C)")
    if couplings is None:
        raise ParseError("give the couplings t,tt, e.g. '10+2i,10-2i'")
    return _s(space, couplings, digits=digits)


@_only_knotobs_errors
def asymptotic_value(space, K, order: int = 2, digits: int = 30, per_sector: bool = False):
    """Large-K asymptotic sum over flat connections (SU(2); see knotobs.continuation.asymptotics)."""
    from knotobs.continuation.asymptotics import asymptotic_value as _av

    return _av(space, K, order=order, digits=digits, per_sector=per_sector)


@_only_knotobs_errors
def kashaev_invariant(knot, N: int, digits: int = 30):
    """Kashaev invariant ``<K>_N`` (the coloured Jones polynomial at ``q = exp(2 pi i/N)``)."""
    from knotobs.continuation.kashaev import kashaev_invariant as _k

    return _k(knot, N, digits)


@_only_knotobs_errors
def ohtsuki_series(space, order: int = 6):
    """Ohtsuki series of a Seifert rational homology sphere."""
    from knotobs.continuation.ohtsuki import ohtsuki_series as _o

    return _o(space, order)


# ------------------------------------------------------------------ tables
@_only_knotobs_errors
def compare(knot, target, group="SU(2)", rep=None, invariant: str = "auto", **options):
    """Compare an invariant with a polynomial in unknown conventions (knotobs.tables.compare).

    >>> compare("T(2,3)", "t + t^3 - t^4").equal
    True
    """
    from knotobs.tables.compare import compare as _c

    return _c(knot, target, str(as_group(group)), as_rep(rep), invariant, **options)


@_only_knotobs_errors
def identify(target, invariant: str = "auto", group="SU(2)", **options):
    """Which torus knots/links, colors and maps reproduce a polynomial (knotobs.tables.identify).

    >>> [c.knot for c in identify("t + t^3 - t^4", max_boxes=1).candidates][:1]
    ['T(2,3)']
    """
    from knotobs.tables.identify import identify as _i

    if "max_boxes" in options:            # the vocabulary name (docs/interface.md); the module says max_colour
        if "max_colour" in options:
            raise ParseError("give max_boxes once (max_colour is its older name)")
        options["max_colour"] = options.pop("max_boxes")
    return _i(target, invariant, str(as_group(group)), **options)
