"""Identify a polynomial: which torus knots or links, colours and conventions reproduce it.

:func:`identify` runs :func:`~knotobs.tables.compare.compare` against every torus knot
and link ``T(P, Q)`` with ``2 <= P <= Q`` inside the given bounds and every colour up
to the given size, and returns the candidates for which some convention map makes the
polynomials equal.  Cheap necessary conditions (number of terms, which is unchanged by
every convention map) prune the search before any map is tried.

Polynomials do not determine a knot in general (docs/conventions.md §8: 10_132 shares
HOMFLY-PT, Jones and Alexander with the mirror of 5_1); the answer is a list of torus
candidates, not a proof that the knot is a torus knot.
"""

from __future__ import annotations

from dataclasses import dataclass
from math import gcd
from typing import Any, Iterable

from knotobs.errors import KnotobsError, SizeLimitError
from knotobs.fibrations.torus import TorusLink
from knotobs.representations.groups import parse_group
from knotobs.representations.partitions import partitions_of
from knotobs.tables.compare import group_free_message, _colours_text
from knotobs.tables.compare import INVARIANTS, Comparison, ConventionMap, compare, _target_mpoly
from knotobs.tables.sparse import MPoly
from knotobs._notebook import NotebookMixin

__all__ = ["Candidate", "Identification", "identify", "MAX_CANDIDATES"]

#: Largest number of (knot, colour) pairs one call may try.
MAX_CANDIDATES = 20_000


@dataclass(frozen=True)
class Candidate:
    """One torus knot or link, colour and convention map that reproduces the polynomial."""

    knot: str
    representation: list
    invariant: str
    group: str
    map: ConventionMap

    @property
    def chirality(self) -> str:
        if self.map.mirror is None:
            return "not determined by this invariant"
        return "mirror image" if self.map.mirror else "as named"

    def to_json(self) -> dict[str, Any]:
        return {"knot": self.knot, "representation": self.representation, "invariant": self.invariant,
                "group": self.group, "chirality": self.chirality, "map": self.map.to_json()}


@dataclass(frozen=True, repr=False)
class Identification(NotebookMixin):
    """Outcome of :func:`identify`."""

    target: str
    invariant: str
    bounds: dict
    candidates: tuple
    tried: int
    #: candidates not compared because their evaluation was over the size limits
    skipped: tuple = ()

    def to_json(self) -> dict[str, Any]:
        return {"kind": "identification", "target": self.target, "invariant": self.invariant,
                "bounds": self.bounds, "tried": self.tried, "compared": self.tried - len(self.skipped),
                "skipped_over_limits": [{"knot": k, "representation": list(lam)} for k, lam in self.skipped],
                "candidates": [c.to_json() for c in self.candidates]}

    def describe(self) -> str:
        head = (f"identify {self.target}\n  searched T(P,Q), 2 <= P <= {self.bounds['max_p']}, P <= Q <= "
                f"{self.bounds['max_q']}, colours up to {self.bounds['max_colour']} boxes"
                f"{', links included' if self.bounds['links'] else ''} ({self.tried - len(self.skipped)} compared"
                f"{f', {len(self.skipped)} over the size limits' if self.skipped else ''})")
        lines = [head]
        if self.skipped:
            shown = ", ".join(f"{k} {_colours_text((lam,))}" for k, lam in self.skipped[:4])
            more = f" and {len(self.skipped) - 4} more" if len(self.skipped) > 4 else ""
            lines.append(f"  not compared (over the size limits; --max-seconds raises them): {shown}{more}")
        if not self.candidates:
            lines.append("  no torus knot or link found" + (" among the candidates compared" if self.skipped else ""))
            return "\n".join(lines)
        for c in self.candidates:
            lines.append(f"  {c.knot}  colour {_colours_text(c.representation)}  [{c.chirality}]  {c.map.describe()}")
        return "\n".join(lines)


def _torus_range(max_p: int, max_q: int, links: bool) -> list[TorusLink]:
    out = []
    for P in range(2, max_p + 1):
        for Q in range(P, max_q + 1):
            if gcd(P, Q) > 1 and not links:
                continue
            out.append(TorusLink(P, Q))
    return out


#: A candidate costs its evaluation, its convention forms and the search, about 2.5-3.2 times the
#: evaluation's estimate (measured on a 2-core machine: SU(2), T(P,Q) up to (5,12) with links,
#: colours of 14, 30, 45 boxes: 3.3 s, 21 s, 71 s against 1.0, 8.7, 27.9 s estimated).
SEARCH_FACTOR = 4.0


def _guard_search(knots, reps, g, homfly_like: bool, inv: str) -> None:
    """Refuse a search whose candidates together are estimated beyond the limits (each one is
    also guarded on its own; those over the limit are skipped and reported, so they do not count)."""
    from knotobs.evaluation.estimates import polynomial_estimate
    from knotobs.evaluation.rosso_jones import colours_for
    from knotobs.guard import current_limits, require

    if inv == "kauffman":
        return                                    # one representation, the vector one
    lim = current_limits().seconds
    total = 0.0
    for k in knots:
        for lam in reps:
            sec = polynomial_estimate(k, colours_for(k, lam), None if homfly_like else g, with_z=True)[0]
            if sec <= lim:
                total += SEARCH_FACTOR * sec
    require(f"identifying among {len(knots) * len(reps)} candidates (T(P,Q) and colours)", seconds=total,
            accepted="lower --max-p, --max-q or --max-boxes (max_p, max_q, max_colour)")


def identify(target, invariant: str = "auto", group=None, max_p: int = 5, max_q: int = 12,
             max_colour: int = 2, links: bool = True, variables: Iterable[str] | None = None) -> Identification:
    """Find the torus knots and links, colours and convention maps that reproduce ``target``.

    Parameters
    ----------
    target : str or MPoly or PolynomialResult
        A polynomial, e.g. a Jones polynomial in ``t``, a Wilson loop in ``q``, a
        HOMFLY-PT polynomial in ``(a, z)``/``(v, z)`` or a coloured one in ``(a, q)``.
    invariant : str
        As for :func:`~knotobs.tables.compare.compare`.
    group : str, optional
        Group of one-variable targets (default ``SU(2)``, as for Jones); refused for the
        invariants of no single group (HOMFLY-PT, Alexander, Conway, Kauffman).
    max_p, max_q : int
        Search ``T(P, Q)`` with ``2 <= P <= max_p`` and ``P <= Q <= max_q``.
    max_colour : int
        Colours: partitions with at most this many boxes (rows allowed by the group).
    links : bool
        Include torus links (``gcd(P, Q) > 1``), all components with the same colour.

    Returns
    -------
    Identification
        ``candidates``: each with knot, representation and convention map.

    Examples
    --------
    >>> r = identify("t + t^3 - t^4", max_p=3, max_q=5, max_colour=1)
    >>> [(c.knot, c.representation) for c in r.candidates]
    [('T(2,3)', [[1]])]
    >>> identify("t^-1 + t^-3 - t^-4", max_p=3, max_q=5, max_colour=1).candidates[0].chirality
    'mirror image'

    References
    ----------
    Rosso–Jones (1993); CONVENTIONS §3, §8.
    """
    for name, v in (("max_p", max_p), ("max_q", max_q), ("max_colour", max_colour)):
        if not isinstance(v, int) or isinstance(v, bool) or v < 1:
            raise KnotobsError(f"{name}={v!r} must be a positive integer")
    if max_p < 2 or max_q < 2:
        raise KnotobsError(f"bounds max_p={max_p}, max_q={max_q} leave nothing to search: both must be >= 2")
    tp = _target_mpoly(target, variables)
    g = parse_group("SU(2)" if group is None else group)
    used = set(tp.used_variables())
    inv = invariant.lower()
    if inv not in INVARIANTS:
        raise KnotobsError(f"unknown invariant {invariant!r}: choose one of {', '.join(INVARIANTS)}")
    homfly_like = inv in ("homfly", "alexander", "conway") or (inv == "auto" and bool(used & {"a", "v"} or (used and used <= {"z"})))
    group_free = homfly_like or inv == "kauffman"
    if group is not None and group_free:
        raise KnotobsError(group_free_message(inv if inv != "auto" else "HOMFLY-PT" if used & {"a", "v"} else "Conway", group))
    if homfly_like:
        reps = [lam for n in range(1, max_colour + 1) for lam in partitions_of(n)]
        if inv in ("alexander", "conway"):
            reps = [(1,)]
    elif inv == "kauffman":
        reps = [(1,)]                     # the Kauffman polynomial is the vector representation's invariant
    else:
        max_rows = g.N - 1 if g.kind == "SU" else g.N
        reps = [lam for n in range(1, max_colour + 1) for lam in partitions_of(n, max_rows)]
    knots = _torus_range(max_p, max_q, links)
    n_try = len(knots) * len(reps)
    if n_try > MAX_CANDIDATES:
        raise SizeLimitError(f"{n_try} candidates to try; at most {MAX_CANDIDATES}: lower max_p, max_q or"
                             " max_colour (--max-p, --max-q, --max-boxes)")
    _guard_search(knots, reps, g, homfly_like, inv)
    nterms = len(tp.terms)
    found: list[Candidate] = []
    skipped: list = []
    tried = 0
    for k in knots:
        for lam in reps:
            tried += 1
            try:
                c: Comparison = compare(k, tp, None if group_free else g, lam, inv, _closest=False)
            except SizeLimitError:
                skipped.append((str(k), tuple(lam)))   # said in the result, never a silent "not found"
                continue
            except KnotobsError:
                continue  # e.g. a coloured HOMFLY-PT that is not a polynomial in z
            if c.equal:
                found.append(Candidate(str(k), c.representation, c.invariant, c.group, c.map))
    bounds = {"max_p": max_p, "max_q": max_q, "max_colour": max_colour, "links": links, "group": str(g)}
    return Identification(str(tp), inv, bounds, tuple(found), tried, tuple(skipped))
