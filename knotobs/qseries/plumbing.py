r"""Weighted plumbing trees, their text form, and the star plumbing of a Seifert manifold.

A *plumbing tree* is a finite tree whose vertices carry integer weights ``w_v``.  Its
linking matrix ``B`` has ``B_vv = w_v`` and ``B_uv = 1`` for every edge ``u - v``; the
plumbed 3-manifold ``M(Gamma)`` is the boundary of the plumbed 4-manifold, i.e. integral
surgery on the link of unknots (one per vertex, framing ``w_v``, Hopf-linked along edges)
with linking matrix ``B`` (common practice: W. D. Neumann, Trans. AMS 268 (1981) 299–344).
The q-series of :mod:`knotobs.qseries.series` need ``B`` negative definite (CONVENTIONS §13).

Text form (our own)
-------------------
``Plumb(w_1, w_2, ..., w_s : i-j, i-j, ...)``

* the weights in vertex order, separated by commas; the vertices are numbered ``1..s``;
* after a colon, the edges as pairs ``i-j`` of vertex numbers, separated by commas or
  spaces; a single vertex has no colon part (``Plumb(-5)``).

Examples: the negative E8 tree ``Plumb(-2,-2,-2,-2,-2,-2,-2,-2 : 1-2, 2-3, 3-4, 4-5, 5-6, 6-7, 3-8)``;
the lens space ``L(5,2)`` as the chain ``Plumb(-3,-2 : 1-2)``.

Seifert manifolds
-----------------
``M(0; b; (a_1,b_1), ..., (a_n,b_n))`` (CONVENTIONS §5, Euler number ``e = -(b + sum b_i/a_i)``)
is the Lawrence–Rozansky surgery ``X(a_1/b_1, ..., a_n/b_n)`` with central framing ``-b``
(CONVENTIONS §9).  Fibers with ``a_i = 1`` are absorbed into ``b``; each remaining ``b_i`` is moved
into ``-a_i < b_i < 0`` (changing ``b`` so that ``e`` is unchanged).  Then the rational framing
``r_i = a_i/b_i < -1`` of the i-th meridian is replaced by the chain of its negative continued
fraction ``r_i = c_1 - 1/(c_2 - 1/(... - 1/c_m))`` with every ``c_j <= -2`` (slam-dunks, Gompf &
Stipsicz, *4-Manifolds and Kirby Calculus*, AMS 1999, §5.3).  The central vertex has weight
``-b`` and degree ``n``.  The legs are negative definite and the Schur complement at the centre
is ``e``, so the star tree is negative definite exactly when ``e < 0`` (Neumann–Raymond's
orientation of links of singularities; ``Sigma(2,3,5)`` gives the negative E8 tree).
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from fractions import Fraction
from knotobs.errors import InvalidSeifertDataError, ParseError, SizeLimitError

__all__ = [
    "MAX_VERTICES",
    "PlumbingGraph",
    "parse_plumbing",
    "is_plumbing_text",
    "negative_continued_fraction_le2",
    "star_plumbing",
    "StarPlumbing",
    "plumbing_of",
]

#: Largest plumbing accepted (vertices).
MAX_VERTICES = 400


def negative_continued_fraction_le2(r: Fraction) -> list[int]:
    """Entries ``c_j <= -2`` with ``r = c_1 - 1/(c_2 - ... - 1/c_m)``, for a rational ``r < -1``.

    >>> negative_continued_fraction_le2(Fraction(-5, 4))
    [-2, -2, -2, -2]
    >>> negative_continued_fraction_le2(Fraction(-7, 3))
    [-3, -2, -2]

    References
    ----------
    Common practice (Hirzebruch–Jung continued fractions); CONVENTIONS §13.
    """
    r = Fraction(r)
    if r >= -1:
        raise InvalidSeifertDataError(f"{r}: need a rational number < -1 for a chain with weights <= -2")
    out: list[int] = []
    while True:
        c = r.numerator // r.denominator  # floor
        out.append(c)
        rest = r - c
        if rest == 0:
            return out
        r = -1 / rest  # r = c - 1/r_next  =>  r_next = -1/(r - c) < -1


@dataclass(frozen=True)
class PlumbingGraph:
    """A weighted tree (vertices ``0..s-1`` inside; ``1..s`` in the text form).

    Parameters
    ----------
    weights : tuple of int
        ``w_v``, the diagonal of the linking matrix.
    edges : tuple of (int, int)
        0-based vertex pairs.

    Examples
    --------
    >>> g = parse_plumbing("Plumb(-3,-2 : 1-2)")
    >>> g.linking_matrix(), g.degrees, g.determinant()
    ([[-3, 1], [1, -2]], (1, 1), 5)
    >>> str(g)
    'Plumb(-3,-2 : 1-2)'

    References
    ----------
    W. D. Neumann, Trans. AMS 268 (1981) 299–344; CONVENTIONS §13.
    """

    weights: tuple[int, ...]
    edges: tuple[tuple[int, int], ...] = ()

    def __post_init__(self) -> None:
        w = tuple(self.weights)
        e = tuple(tuple(x) for x in self.edges)
        object.__setattr__(self, "weights", w)
        object.__setattr__(self, "edges", e)
        s = len(w)
        if s == 0:
            raise InvalidSeifertDataError("a plumbing needs at least one vertex")
        if s > MAX_VERTICES:
            raise SizeLimitError(f"{s} vertices is too many for a plumbing (limit {MAX_VERTICES})")
        for k, x in enumerate(w, 1):
            if isinstance(x, bool) or not isinstance(x, int):
                raise InvalidSeifertDataError(f"weight of vertex {k} = {x!r} must be an integer")
        seen = set()
        for u, v in e:
            for x in (u, v):
                if isinstance(x, bool) or not isinstance(x, int) or not 0 <= x < s:
                    raise InvalidSeifertDataError(
                        f"edge {u + 1}-{v + 1}: vertex numbers must lie in 1..{s}")
            if u == v:
                raise InvalidSeifertDataError(f"edge {u + 1}-{v + 1} is a loop; a plumbing tree has none")
            key = (min(u, v), max(u, v))
            if key in seen:
                raise InvalidSeifertDataError(f"edge {u + 1}-{v + 1} is given twice")
            seen.add(key)
        if len(e) != s - 1:
            raise InvalidSeifertDataError(
                f"{s} vertices and {len(e)} edges: a tree on {s} vertices has {s - 1} edges")
        adj: list[list[int]] = [[] for _ in range(s)]
        for u, v in e:
            adj[u].append(v)
            adj[v].append(u)
        reached, stack = {0}, [0]
        while stack:
            for y in adj[stack.pop()]:
                if y not in reached:
                    reached.add(y)
                    stack.append(y)
        if len(reached) != s:
            raise InvalidSeifertDataError("the plumbing graph is not connected; give a tree")

    # --------------------------------------------------------------- data
    @property
    def size(self) -> int:
        """Number of vertices ``s``."""
        return len(self.weights)

    @property
    def degrees(self) -> tuple[int, ...]:
        """Vertex degrees."""
        d = [0] * self.size
        for u, v in self.edges:
            d[u] += 1
            d[v] += 1
        return tuple(d)

    @property
    def trace(self) -> int:
        """``tr B`` = sum of the weights."""
        return sum(self.weights)

    def linking_matrix(self) -> list[list[int]]:
        """``B`` (a new list of lists)."""
        s = self.size
        B = [[0] * s for _ in range(s)]
        for v, w in enumerate(self.weights):
            B[v][v] = w
        for u, v in self.edges:
            B[u][v] = B[v][u] = 1
        return B

    def determinant(self) -> int:
        """``det B`` (exact)."""
        from flint import fmpz_mat

        return int(fmpz_mat(self.linking_matrix()).det())

    def is_negative_definite(self) -> bool:
        """All pivots of the exact symmetric elimination negative (Sylvester's criterion).

        >>> parse_plumbing("Plumb(-2,-2 : 1-2)").is_negative_definite()
        True
        >>> parse_plumbing("Plumb(-1,-1 : 1-2)").is_negative_definite()
        False
        """
        M = [[Fraction(x) for x in row] for row in self.linking_matrix()]
        s = self.size
        for k in range(s):
            p = M[k][k]
            if p >= 0:
                return False
            for i in range(k + 1, s):
                f = M[i][k] / p
                if f:
                    for j in range(k, s):
                        M[i][j] -= f * M[k][j]
        return True

    def require_negative_definite(self) -> None:
        """Raise :class:`InvalidSeifertDataError` unless ``B`` is negative definite."""
        if not self.is_negative_definite():
            raise InvalidSeifertDataError(
                f"{self}: the linking matrix is not negative definite; the q-series invariants are"
                " defined for negative definite plumbings (reverse the orientation: negate every"
                " weight, if that one is negative definite)")

    def blow_up(self, u: int, v: int) -> "PlumbingGraph":
        """Insert a ``-1`` vertex on the edge ``u - v`` (0-based); both ends lose 1 (Neumann move).

        The plumbed manifold does not change and negative definiteness is kept.

        >>> str(parse_plumbing("Plumb(-2,-2 : 1-2)").blow_up(0, 1))
        'Plumb(-3,-3,-1 : 1-3, 2-3)'
        """
        key = (min(u, v), max(u, v))
        if key not in {(min(a, b), max(a, b)) for a, b in self.edges}:
            raise InvalidSeifertDataError(f"{u + 1}-{v + 1} is not an edge of {self}")
        w = list(self.weights)
        w[u] -= 1
        w[v] -= 1
        new = len(w)
        w.append(-1)
        edges = [e for e in self.edges if (min(e), max(e)) != key] + [(u, new), (v, new)]
        return PlumbingGraph(tuple(w), tuple(sorted((min(a, b), max(a, b)) for a, b in edges)))

    def __str__(self) -> str:
        ws = ",".join(str(w) for w in self.weights)
        if not self.edges:
            return f"Plumb({ws})"
        es = ", ".join(f"{u + 1}-{v + 1}" for u, v in self.edges)
        return f"Plumb({ws} : {es})"


_PLUMB = re.compile(r"^\s*plumb\s*\((.*)\)\s*$", re.I | re.S)
_EDGE = re.compile(r"^(\d+)\s*-\s*(\d+)$")


def is_plumbing_text(text: object) -> bool:
    """Whether ``text`` is meant as a plumbing (starts with ``Plumb(``).

    >>> is_plumbing_text("Plumb(-2)"), is_plumbing_text("Sigma(2,3,5)")
    (True, False)
    """
    return isinstance(text, str) and text.strip().lower().startswith("plumb")


def parse_plumbing(text: "str | PlumbingGraph") -> PlumbingGraph:
    """Read the text form ``Plumb(w_1, ..., w_s : i-j, ...)`` (module docstring).

    >>> parse_plumbing("Plumb(-5)")
    PlumbingGraph(weights=(-5,), edges=())
    >>> parse_plumbing("Plumb(-2,-2 : 1-3)")
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidSeifertDataError: edge 1-3: vertex numbers must lie in 1..2

    References
    ----------
    CONVENTIONS §13.
    """
    if isinstance(text, PlumbingGraph):
        return text
    if not isinstance(text, str):
        raise ParseError(f"{text!r}: give a plumbing as text, Plumb(w_1, ..., w_s : i-j, ...)")
    m = _PLUMB.match(text)
    if not m:
        raise ParseError(f"{text!r}: a plumbing is written Plumb(w_1, ..., w_s : i-j, ...),"
                         " e.g. Plumb(-3,-2 : 1-2)")
    body = m.group(1)
    if body.count(":") > 1:
        raise ParseError(f"{text!r}: one colon separates the weights from the edges")
    wpart, _, epart = body.partition(":")
    weights = []
    for k, tok in enumerate(wpart.split(","), 1):
        tok = tok.strip()
        if not re.fullmatch(r"[+-]?\d+", tok):
            raise ParseError(f"{text!r}: weight {k} = {tok!r} is not an integer")
        weights.append(int(tok))
    if len(weights) > MAX_VERTICES:
        raise SizeLimitError(f"{len(weights)} vertices is too many for a plumbing (limit {MAX_VERTICES})")
    edges = []
    toks = [t for t in re.split(r"[,\s]+", re.sub(r"\s*-\s*", "-", epart.strip())) if t]
    if _ and not toks and len(weights) > 1:
        raise ParseError(f"{text!r}: no edges after the colon")
    for tok in toks:
        em = _EDGE.match(tok)
        if not em:
            raise ParseError(f"{text!r}: edge {tok!r} is not of the form i-j")
        edges.append((int(em.group(1)) - 1, int(em.group(2)) - 1))
    return PlumbingGraph(tuple(weights), tuple(edges))


@dataclass(frozen=True)
class StarPlumbing:
    """The star plumbing of a Seifert manifold and the normalised invariants behind it.

    Attributes
    ----------
    graph : PlumbingGraph
        Vertex 0 is the centre; the legs follow in fiber order, each from the centre outwards.
    b : int
        Normalised ``b`` (central weight ``-b``).
    fibers : tuple
        Normalised ``(a_i, b_i)`` with ``-a_i < b_i < 0`` (fibers with ``a_i = 1`` absorbed).
    euler : Fraction
        ``e = -(b + sum b_i/a_i)`` (unchanged by the normalisation), ``< 0``.
    leaves : tuple of int
        The vertex at the far end of each leg.
    """

    graph: PlumbingGraph
    b: int
    fibers: tuple[tuple[int, int], ...]
    euler: Fraction
    leaves: tuple[int, ...]


def negative_normal_form(b: int, fibers) -> tuple[int, list[tuple[int, int]], Fraction]:
    """Seifert invariants with every ``-a_i < b_i < 0`` (fibers of order 1 folded into ``b``),
    and the Euler number ``e = -(b + sum b_i/a_i)``, which this move keeps.

    >>> negative_normal_form(-1, [(2, 1), (3, 1), (5, 1)])
    (2, [(2, -1), (3, -2), (5, -4)], Fraction(-1, 30))
    """
    nb = b
    norm: list[tuple[int, int]] = []
    for a, c in fibers:
        if a == 1:
            nb += c
            continue
        c2 = c % a - a
        nb += (c - c2) // a
        norm.append((a, c2))
    return nb, norm, -(Fraction(nb) + sum(Fraction(c, a) for a, c in norm))


def star_plumbing(space) -> StarPlumbing:
    """The negative definite star plumbing of ``M(0; b; (a_i,b_i))`` with ``e < 0`` (module docstring).

    Parameters
    ----------
    space : str, SeifertManifold or ``(b, [(a_1,b_1), ...])``

    Examples
    --------
    >>> str(star_plumbing("Sigma(2,3,5)").graph)
    'Plumb(-2,-2,-2,-2,-2,-2,-2,-2 : 1-2, 1-3, 3-4, 1-5, 5-6, 6-7, 7-8)'
    >>> str(star_plumbing("L(5,2)").graph)
    'Plumb(-3,-2 : 1-2)'
    >>> star_plumbing("-Sigma(2,3,5)")
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidSeifertDataError: M(0; 1; (2,-1), (3,-1), (5,-1)) has Euler number e = 1/30 > 0: its star plumbing is positive definite; the q-series are defined for the orientation with e < 0 (the reversed space)

    References
    ----------
    W. D. Neumann and F. Raymond, LNM 664 (1978); Gompf & Stipsicz (1999) §5.3; CONVENTIONS §5, §9, §13.
    """
    from knotobs.evaluation.surgery import seifert_data
    from knotobs.fibrations.seifert import parse_space

    if isinstance(space, str):
        space = parse_space(space)
    genus = getattr(space, "genus", 0) or getattr(space, "g", 0) or 0
    if genus:
        raise InvalidSeifertDataError(
            f"{space}: base genus {genus}; the q-series here need base S^2 (b_1 = 0 requires genus 0)")
    b, fibers = seifert_data(space)
    text = f"M(0; {b}; {', '.join(f'({a},{c})' for a, c in fibers)})"
    nb, norm, e = negative_normal_form(b, fibers)
    if e == 0:
        raise InvalidSeifertDataError(
            f"{text} has Euler number e = 0, so b_1 = 1; the q-series here need b_1 = 0")
    if e > 0:
        raise InvalidSeifertDataError(
            f"{text} has Euler number e = {e} > 0: its star plumbing is positive definite; the"
            " q-series are defined for the orientation with e < 0 (the reversed space)")
    weights = [-nb]
    edges: list[tuple[int, int]] = []
    leaves = []
    for a, c in norm:
        prev = 0
        for w in negative_continued_fraction_le2(Fraction(a, c)):
            weights.append(w)
            v = len(weights) - 1
            edges.append((prev, v))
            prev = v
        leaves.append(prev)
    g = PlumbingGraph(tuple(weights), tuple(edges))
    return StarPlumbing(g, nb, tuple(norm), e, tuple(leaves))


def plumbing_of(space) -> tuple[PlumbingGraph, str]:
    """``(graph, description)`` for a plumbing text, a PlumbingGraph or any Seifert space.

    >>> plumbing_of("Sigma(2,3,5)")[1]
    'Sigma(2,3,5) = M(0; 2; (2,-1), (3,-2), (5,-4)), e = -1/30, as its star plumbing'
    """
    if isinstance(space, PlumbingGraph) or is_plumbing_text(space):
        g = parse_plumbing(space)
        return g, str(g)
    sp = star_plumbing(space)
    name = space if isinstance(space, str) else str(space)
    fs = ", ".join(f"({a},{c})" for a, c in sp.fibers)
    return sp.graph, f"{name} = M(0; {sp.b}; {fs}), e = {sp.euler}, as its star plumbing"

