"""Rational surgery along a fibre of a Seifert fibration.

Rule (derived from the surgery presentation of
:mod:`knotobs.fibrations.seifert`): a regular fibre is a further meridian of
the central unknot whose fibre framing is the 0-framing of the diagram, so
``P/Q`` surgery on it *relative to the fibre framing* adds the Seifert fibre
``(P, Q)``.  On a core ``c_i`` with gluing matrix ``U_i`` (columns: meridian
``(a_i, b_i)`` and framing curve ``(-y_i, x_i)``), ``P/Q`` surgery relative to
that framing replaces ``(a_i, b_i)`` by ``U_i (P, Q)^T``.  Relative to another
framing of self-linking ``sigma'`` the slope is first shifted by the integer
``sigma' - sigma``.  For a knot in ``S^3`` the Seifert framing is
``sigma' = 0``; for a regular fibre of ``S^3`` fibred by ``T(P, Q)`` the fibre
framing is ``PQ``, so ``r = m/n`` surgery adds the fibre ``(m - PQ n, n)``:
this is Moser's theorem (exceptional orders ``P, Q, |PQ n - m|``; a lens space
when ``|PQ n - m| = 1``; ``L(P,Q) # L(Q,P)`` when ``m/n = PQ``).

Filling along the fibre slope (``P = 0``) gives the connected sum of the lens
spaces ``L(a_i, -b_i)`` of the exceptional fibres (handle slides over the
0-framed meridian; Kirby LNM 1374).

References
----------
L. Moser, Elementary surgery along a torus knot, Pacific J. Math. 38 (1971)
737-745.  R. Kirby and M. Scharlemann, Eight faces of the Poincare homology
3-sphere, in Geometric Topology (Athens GA, 1977), Academic Press (1979).
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from fractions import Fraction

from knotobs.errors import InvalidSeifertDataError, ParseError
from knotobs.fibrations.lens import s3_seifert
from knotobs.fibrations.seifert import SeifertManifold, _refill as _new_fiber, parse_space
from knotobs.fibrations.torus import TorusLink, parse_knot

__all__ = [
    "SurgeryResult",
    "parse_slope",
    "surgery_on_fiber",
    "torus_knot_surgery",
    "SpaceReport",
    "space_report",
]

_SLOPE = re.compile(r"^\s*([+-]?\d+)\s*(?:/\s*([+-]?\d+)\s*)?$")


def parse_slope(text: "str | int | Fraction") -> Fraction:
    """Parse a surgery slope: an integer or a fraction ``m/n`` with ``n != 0``.

    >>> parse_slope("5/2"), parse_slope("-1"), parse_slope(7)
    (Fraction(5, 2), Fraction(-1, 1), Fraction(7, 1))
    >>> parse_slope("1/0")
    Traceback (most recent call last):
    ...
    knotobs.errors.ParseError: slope '1/0' has denominator 0; write an integer or a fraction m/n with n != 0, e.g. 5/2
    """
    if isinstance(text, Fraction):
        return text
    if isinstance(text, int) and not isinstance(text, bool):
        return Fraction(text)
    m = _SLOPE.match(str(text))
    if not m:
        raise ParseError(
            f"cannot read slope {text!r}: write an integer or a fraction m/n, e.g. -1 or 5/2"
        )
    num, den = int(m.group(1)), int(m.group(2) or 1)
    if den == 0:
        raise ParseError(
            f"slope {text!r} has denominator 0; write an integer or a fraction m/n with n != 0, e.g. 5/2"
        )
    return Fraction(num, den)


@dataclass(frozen=True)
class SurgeryResult:
    """The manifold obtained by surgery on a fibre.

    Attributes
    ----------
    ambient : SeifertManifold
        The fibred manifold operated on (with the fibre added as ``(1, 0)`` if regular).
    fiber_index : int
        Index in ``ambient.fibers`` of the fibre operated on.
    slope : Fraction
        The slope as given, relative to ``framing``.
    framing : str
        ``"fiber"`` (nearby fibre / gluing framing) or ``"seifert"`` (null-homologous framing).
    new_fiber : tuple of int
        The Seifert invariant of the filling solid torus; ``(0, 1)`` is the fibre slope.
    manifold : SeifertManifold or None
        The result, ``None`` when it is reducible (``new_fiber = (0, 1)`` with
        at least two exceptional fibres left).  With fewer, the fibre-slope
        filling is the lens space ``L(a, -b)`` of the remaining fibre, or ``S^3``.
    summands : tuple of SeifertManifold
        When reducible: the lens-space summands ``L(a_i, -b_i)`` (``S^3`` summands dropped).
    knot : str
        Description of the fibre.
    """

    ambient: SeifertManifold
    fiber_index: int
    slope: Fraction
    framing: str
    new_fiber: tuple[int, int]
    manifold: SeifertManifold | None
    summands: tuple[SeifertManifold, ...]
    knot: str = "fiber"

    @property
    def is_reducible(self) -> bool:
        return self.manifold is None

    @property
    def h1_order(self) -> int:
        """``|H_1|`` (``0`` if infinite); for a connected sum the product of the orders."""
        if self.manifold is not None:
            return self.manifold.h1_order
        out = 1
        for S in self.summands:
            out *= S.h1_order
        return out

    @property
    def recognised(self) -> str | None:
        """Name of the result, e.g. ``"Sigma(2,3,5)"`` or ``"L(2,1) # L(3,1)"``."""
        if self.manifold is not None:
            return self.manifold.recognise()
        names = [S.recognise() for S in self.summands]
        if not names:
            return "S^3"
        if any(n is None for n in names):
            return None
        return " # ".join(names)  # type: ignore[arg-type]


def surgery_on_fiber(
    M: "SeifertManifold | str",
    slope: "Fraction | int | str",
    fiber: int | None = None,
    *,
    framing: str = "fiber",
) -> SurgeryResult:
    """Rational surgery on a fibre of a Seifert fibration.

    Parameters
    ----------
    M : SeifertManifold or str
        The fibred manifold.
    slope : Fraction, int or str
        Surgery coefficient ``m/n``.
    fiber : int or None
        ``None`` for a regular fibre, else the index of a fibre of ``M`` (its core).
    framing : {"fiber", "seifert"}
        Reference framing: the fibre framing (for a core: the framing of
        :meth:`SeifertManifold.gluing_matrices`) or the Seifert framing (the
        fibre must then be null-homologous, e.g. any fibre of ``S^3``).

    Returns
    -------
    SurgeryResult

    Examples
    --------
    Moser: -1 surgery on the right-handed trefoil, the regular fibre of
    ``S^3 = M(0; 0; (2,1), (3,-1))``:

    >>> r = surgery_on_fiber(SeifertManifold(0, [(2, 1), (3, -1)]), -1, framing="seifert")
    >>> r.new_fiber, r.recognised
    ((7, -1), 'Sigma(2,3,7)')

    References
    ----------
    Moser, Pacific J. Math. 38 (1971); Kirby, LNM 1374 (1989).
    """
    M = parse_space(M)
    s = parse_slope(slope)
    if framing not in ("fiber", "seifert"):
        raise InvalidSeifertDataError(f"framing={framing!r}: use 'fiber' or 'seifert'")
    if fiber is None:
        amb = SeifertManifold(M.b, M.fibers + ((1, 0),), M.genus)
        idx = len(amb.fibers) - 1
        label = "regular fibre"
    else:
        M._check_index(fiber)
        amb, idx, label = M, fiber, f"core {fiber} (order {M.fibers[fiber][0]})"
    target = None
    if framing == "seifert":
        if amb.euler == 0:
            raise InvalidSeifertDataError(
                f"the Seifert framing of a fibre of {M} is not defined: H_1 is infinite (e = 0)"
            )
        hcls, ccls = amb.fiber_homology_classes()
        if any(ccls[idx]):
            raise InvalidSeifertDataError(
                f"the {label} of {M} is not null-homologous (class {ccls[idx]} in H_1 ="
                f" {amb.homology_factors()}); use framing='fiber' (--framing fiber)"
            )
        target = Fraction(0)
    new = _new_fiber(amb, idx, s.numerator, s.denominator, target)
    others = amb.fibers[:idx] + amb.fibers[idx + 1:]
    if new[0] == 0 and amb.genus:
        raise InvalidSeifertDataError(
            f"surgery along the fibre slope on {M} (base genus {amb.genus}) is not a Seifert"
            " manifold with a circle fibration of this kind; knotobs does not follow it"
        )
    if new[0] == 0:
        summands = []
        for a, bi in others:
            if a > 1:
                summands.append(SeifertManifold.from_lens(a, -bi))
        if len(summands) <= 1:  # a single lens space (or S^3): not reducible
            single = summands[0] if summands else SeifertManifold(1, ())
            return SurgeryResult(amb, idx, s, framing, new, single, (), label)
        return SurgeryResult(amb, idx, s, framing, new, None, tuple(summands), label)
    fibers = list(amb.fibers)
    fibers[idx] = new
    return SurgeryResult(amb, idx, s, framing, new, SeifertManifold(amb.b, tuple(fibers), amb.genus),
                         (), label)


def torus_knot_surgery(knot: "TorusLink | str", slope: "Fraction | int | str") -> SurgeryResult:
    """``r``-surgery on the torus knot ``T(p, q)`` in ``S^3`` (Seifert framing).

    The knot is the regular fibre of
    :func:`knotobs.fibrations.lens.s3_seifert` ``(P, Q, chirality)``.

    Examples
    --------
    >>> torus_knot_surgery("T(2,-3)", -1).recognised    # Poincare sphere
    'Sigma(2,3,5)'
    >>> torus_knot_surgery("T(2,3)", 1).recognised
    '-Sigma(2,3,5)'
    >>> r = torus_knot_surgery("T(2,3)", 6)
    >>> r.recognised, r.h1_order
    ('L(2,1) # L(3,1)', 6)

    References
    ----------
    Moser, Pacific J. Math. 38 (1971) 737-745; Kirby-Scharlemann (1979).
    """
    K = parse_knot(knot).require_knot()
    M = s3_seifert(K.P, K.Q, K.chirality)
    res = surgery_on_fiber(M, slope, None, framing="seifert")
    return SurgeryResult(res.ambient, res.fiber_index, res.slope, res.framing, res.new_fiber,
                         res.manifold, res.summands, str(K))


@dataclass(frozen=True)
class SpaceReport:
    """Everything ``knotobs space`` shows: the inputs and the resulting manifold.

    Attributes
    ----------
    space, surgery, slope : str or None
        The inputs as given.
    manifold : SeifertManifold or None
        The manifold (``None`` for a reducible surgery).
    surgery_result : SurgeryResult or None
    """

    space: str | None
    surgery: str | None
    slope: str | None
    manifold: SeifertManifold | None
    surgery_result: SurgeryResult | None

    @property
    def recognised(self) -> str | None:
        if self.surgery_result is not None:
            return self.surgery_result.recognised
        assert self.manifold is not None
        return self.manifold.recognise()

    @property
    def h1_order(self) -> int:
        if self.surgery_result is not None:
            return self.surgery_result.h1_order
        assert self.manifold is not None
        return self.manifold.h1_order


def space_report(
    space: "str | SeifertManifold | None" = None,
    *,
    surgery: "str | TorusLink | None" = None,
    slope: "str | int | Fraction | None" = None,
) -> SpaceReport:
    """The Seifert data of a manifold given by name or by surgery on a torus knot.

    Exactly one of ``space`` or (``surgery`` and ``slope``) must be given.

    >>> space_report("L(7,4)").recognised
    'L(7,2)'
    >>> space_report(surgery="T(2,3)", slope="-1").recognised
    'Sigma(2,3,7)'

    References
    ----------
    See :func:`parse_space` and :func:`torus_knot_surgery`.
    """
    if space is not None and (surgery is not None or slope is not None):
        raise ParseError(
            f"give either a space ({space!r}) or --surgery KNOT --slope r, not both"
        )
    if space is None:
        if surgery is None or slope is None:
            raise ParseError(
                "give a space (S^3, L(p,q), Sigma(a1,a2,a3), M(0; b; (a1,b1), ...))"
                " or both --surgery KNOT and --slope r"
            )
        res = torus_knot_surgery(surgery, slope)
        return SpaceReport(None, str(surgery), str(slope), res.manifold, res)
    M = parse_space(space)
    return SpaceReport(str(space), None, None, M, None)
