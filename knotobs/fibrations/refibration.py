"""Torus knots as fibres: the Seifert fibration in which a knot is a fibre.

* In ``S^3``, ``T(P, Q)`` (``P, Q >= 1`` coprime, chirality ``c``) is the
  regular fibre of ``S^3 = M(0; 0; (P, b_1), (Q, b_2))`` with
  ``P b_2 + Q b_1 = c`` (:func:`knotobs.fibrations.lens.s3_seifert`); the cores
  of orders ``P`` and ``Q`` are unknots (the cores of the Heegaard solid tori);
  two regular fibres link ``c P Q`` times, a regular fibre links the core of
  order ``P`` ``c Q`` times and that of order ``Q`` ``c P`` times, the two
  cores link ``c`` times (Rolfsen, *Knots and Links*, 1976, 3.C and 10.B;
  Seifert 1933).  ``T(dP, dQ)`` is ``d`` regular fibres.
* In ``L(p, q)`` the knot ``T(r, s)`` is the curve ``r mu + s lambda`` on the
  Heegaard torus (:mod:`knotobs.fibrations.lens`).
* In any Seifert manifold, ``"fiber"`` names a regular fibre.

With ``core=N`` the knot studied is instead the core of order ``N`` of the same
fibration (e.g. the unknot as the exceptional fibre of order ``P``).

All linking numbers come from one formula, ``lk(c_i, c_j) = -1/(e a_i a_j)``
for distinct fibres (a regular fibre has ``a = 1``), derived from the surgery
presentation in :mod:`knotobs.fibrations.seifert`.
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from fractions import Fraction
from math import gcd

from knotobs.errors import InvalidKnotError, InvalidSeifertDataError, ParseError
from knotobs.fibrations.lens import lens_fibration, lens_knot_data, s3_seifert
from knotobs.fibrations.seifert import SeifertManifold, parse_space
from knotobs.fibrations.torus import TorusLink, parse_knot

__all__ = ["CoreFiber", "FiberedKnot", "fibration_of"]

_FIBER_WORDS = {"fiber", "fibre", "regular", "h"}
_RE_S3 = re.compile(r"^S\^?3$", re.I)
_RE_LENS = re.compile(r"^(-?)L\(([+-]?\d+),([+-]?\d+)\)$", re.I)


@dataclass(frozen=True)
class CoreFiber:
    """A core (possibly exceptional) fibre of the fibration.

    Attributes
    ----------
    index : int
        Position in ``FiberedKnot.manifold.fibers``.
    order : int
        ``a_i`` (exceptional when ``> 1``).
    invariant : tuple of int
        ``(a_i, b_i)``.
    knot_type : str
        What the core is as a knot, e.g. ``"unknot"`` in ``S^3``.
    homology_class : int or None
        Class in ``H_1 = Z/p`` for lens spaces (generator ``[mu]``), else ``None``.
    """

    index: int
    order: int
    invariant: tuple[int, int]
    knot_type: str
    homology_class: int | None = None


@dataclass(frozen=True)
class FiberedKnot:
    """A knot (or torus link) realised as fibre(s) of a Seifert fibration.

    Attributes
    ----------
    knot, space : str
        Descriptions of the inputs.
    manifold : SeifertManifold
        The fibration, unnormalised, with its fibres in the order of ``cores``.
    role : str
        ``"regular"``, ``"exceptional"`` (a core of order > 1) or ``"core"``
        (a core of order 1).
    components : int
        Number of parallel regular fibres (``d`` for ``T(dP, dQ)``); 1 for a core.
    core : int or None
        Index of the core studied when ``role != "regular"``.
    cores : tuple of CoreFiber
    fiber_framing : Fraction or None
        For a regular fibre: its linking with a nearby fibre, ``-1/e``; in
        ``S^3`` this is the framing relative to the Seifert framing (``c P Q``).
        For a core: its self-linking with the framing of the gluing matrix
        :meth:`SeifertManifold.gluing_matrices`.  ``None`` when ``e = 0``.
    linking_labels : tuple of str
    linking : tuple of tuple of Fraction, or None
        Linking matrix of the regular fibres and cores (diagonal: framings as above).
    homology_class, class_order : int or None
        Lens spaces: class of (one component of) the knot in ``H_1 = Z/p`` and its order.
    self_linking_mod_one : Fraction or None
        Linking-form value of the knot's class (rational homology spheres).

    Examples
    --------
    >>> F = fibration_of("T(2,3)")
    >>> F.recognised, F.fiber_framing, [c.order for c in F.cores]
    ('S^3', Fraction(6, 1), [2, 3])
    """

    knot: str
    space: str
    manifold: SeifertManifold
    role: str
    components: int
    core: int | None
    cores: tuple[CoreFiber, ...]
    fiber_framing: Fraction | None
    linking_labels: tuple[str, ...]
    linking: tuple[tuple[Fraction, ...], ...] | None
    homology_class: int | None
    class_order: int | None
    self_linking_mod_one: Fraction | None

    @property
    def normal_form(self) -> SeifertManifold:
        return self.manifold.normal_form()

    @property
    def euler(self) -> Fraction:
        return self.manifold.euler

    @property
    def h1_order(self) -> int:
        return self.manifold.h1_order

    @property
    def recognised(self) -> str | None:
        return self.manifold.recognise()


def _mod1(x: Fraction) -> Fraction:
    return x - (x.numerator // x.denominator)


def _build(
    knot: str,
    space: str,
    M: SeifertManifold,
    components: int,
    core_order: int | None,
    knot_types: list[str],
    classes: list[int | None],
    knot_class: tuple[int, int] | None,
) -> FiberedKnot:
    cores = tuple(
        CoreFiber(i, a, (a, b), knot_types[i], classes[i]) for i, (a, b) in enumerate(M.fibers)
    )
    core_idx = None
    if core_order is not None:
        hits = [c.index for c in cores if c.order == core_order]
        if not hits:
            raise InvalidKnotError(
                f"--core {core_order}: the fibration of {knot} in {space} has cores of orders"
                f" {[c.order for c in cores]}, none of order {core_order}"
            )
        core_idx = hits[0]
    qhs = M.is_rational_homology_sphere
    if core_idx is None:
        labels = tuple(f"K{j + 1}" if components > 1 else "K" for j in range(components))
        role, comps = "regular", components
    else:
        labels = ("K = core",)
        role = "exceptional" if cores[core_idx].order > 1 else "core"
        comps = 1
    labels = labels + tuple(f"core({c.order})" for c in cores if c.index != core_idx)
    framing = linking = slm = None
    if qhs:
        full = M.fiber_linking()  # [h, c_1, ..., c_n]
        # rows/cols of the displayed matrix as indices into ``full``
        if core_idx is None:
            idx = [0] * comps + [i + 1 for i in range(len(cores))]
        else:
            idx = [core_idx + 1] + [i + 1 for i in range(len(cores)) if i != core_idx]
        n = len(idx)
        rows = []
        for a in range(n):
            rows.append(tuple(full[idx[a]][idx[b]] for b in range(n)))
        linking = tuple(rows)
        framing = linking[0][0]
        slm = _mod1(framing)
    hc = order = None
    if knot_class is not None:
        hc, order = knot_class
    return FiberedKnot(knot, space, M, role, comps, core_idx, cores, framing, labels, linking,
                       hc, order, slm)


def fibration_of(
    knot: "str | TorusLink",
    space: "str | SeifertManifold | None" = "S^3",
    *,
    core: int | None = None,
) -> FiberedKnot:
    """The Seifert fibration in which ``knot`` is a fibre.

    Parameters
    ----------
    knot : str or TorusLink
        ``T(p,q)`` (a torus knot or link), or ``"fiber"`` for a regular fibre of ``space``.
    space : str or SeifertManifold, default ``"S^3"``
        ``S^3``, ``L(p,q)`` (torus knots on the Heegaard torus) or any Seifert
        manifold (then ``knot`` must be ``"fiber"``).
    core : int, optional
        Study instead the core of this order of the same fibration.

    Returns
    -------
    FiberedKnot

    Raises
    ------
    InvalidKnotError
        The knot is not a fibre of the fibrations considered (e.g. it bounds a
        meridian disc of a Heegaard solid torus of ``L(p,q)``), or there is no
        core of the requested order.

    Examples
    --------
    >>> F = fibration_of("T(2,3)")
    >>> F.manifold, F.euler, F.h1_order
    (SeifertManifold(b=0, fibers=((2, 1), (3, -1))), Fraction(-1, 6), 1)
    >>> [[str(x) for x in r] for r in F.linking]
    [['6', '3', '2'], ['3', '1', '1'], ['2', '1', '0']]
    >>> fibration_of("T(4,6)").linking[0][1]      # two regular fibres link 6 times
    Fraction(6, 1)
    >>> G = fibration_of("T(3,1)", "L(7,2)")
    >>> G.recognised, G.homology_class, G.fiber_framing
    ('L(7,2)', 3, Fraction(39, 7))

    References
    ----------
    Seifert (1933); Rolfsen, Knots and Links (1976); Moser, Pacific J. Math. 38 (1971).
    """
    space_text = "S^3" if space is None else space
    knot_text = knot if isinstance(knot, str) else str(knot)
    is_fiber_word = isinstance(knot, str) and knot.strip().lower() in _FIBER_WORDS
    if core is not None and (isinstance(core, bool) or not isinstance(core, int) or core < 1):
        raise InvalidKnotError(f"--core {core!r}: the order of a core must be an integer >= 1")

    if isinstance(space_text, SeifertManifold):
        return _generic(knot_text, is_fiber_word, space_text, str(space_text), core)
    s = "".join(str(space_text).split())
    if _RE_S3.match(s) and not is_fiber_word:
        K = parse_knot(knot)
        M = s3_seifert(K.P, K.Q, K.chirality)
        return _build(str(K), "S^3", M, K.components, core, ["unknot", "unknot"], [None, None], None)
    m = _RE_LENS.match(s)
    if m and not is_fiber_word:
        p, q = int(m.group(2)), int(m.group(3))
        if m.group(1):
            q = -q
        if p < 1:
            raise InvalidSeifertDataError(
                f"space {space_text!r}: torus knots T(r,s) are defined in L(p,q) with p >= 1"
            )
        K = parse_knot(knot)
        d = K.components
        r, t = K.p // d, K.q // d
        M = lens_fibration(p, q, r, t)
        data = lens_knot_data(p, q, r, t)
        kt = ["core of V_1 (meridian of U)", "core of V_2 (core of the surgery solid torus)"]
        space_name = f"L({p},{q})"
        F = _build(str(K), space_name, M, d, core, kt, list(data.core_classes),
                   (data.homology_class, data.order))
        if F.core is not None:
            cls = data.core_classes[F.core]
            F = FiberedKnot(F.knot, F.space, F.manifold, F.role, F.components, F.core, F.cores,
                            F.fiber_framing, F.linking_labels, F.linking, cls,
                            p // gcd(cls, p), F.self_linking_mod_one)
        return F
    M = parse_space(space_text)
    return _generic(knot_text, is_fiber_word, M, str(space_text), core)


def _generic(knot_text: str, is_fiber_word: bool, M: SeifertManifold, name: str,
             core: int | None) -> FiberedKnot:
    if not is_fiber_word:
        try:
            K = parse_knot(knot_text)
        except ParseError:
            raise ParseError(
                f"cannot read knot {knot_text!r}: write T(p,q) (in S^3 or L(p,q)) or 'fiber'"
            ) from None
        raise InvalidKnotError(
            f"{K} in {name}: a torus knot T(p,q) is only defined in S^3 and on the Heegaard torus"
            f" of L(p,q); in a general Seifert manifold use KNOT = fiber (a regular fibre)"
        )
    return _build("fiber", name, M, 1, core, ["" for _ in M.fibers], [None] * len(M.fibers), None)
