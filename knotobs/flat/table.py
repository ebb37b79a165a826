r"""Every flat SL(2,C) connection of a Seifert manifold over ``S^2``, as one table.

Rows: the trivial and abelian connections, then the irreducible ones (isolated points and
positive-dimensional components), each with its real form, ``rho(h)``, rotation numbers, exact
Chern–Simons value mod 1 (CONVENTIONS §12: ``Z_K ~ sum_alpha exp(2 pi i K cs(alpha))``; reversing
the orientation negates every value) and, for isolated irreducible connections of three-fibre
manifolds, the torsion (:mod:`knotobs.flat.torsion`).

The enumeration size is estimated from the input (the number of rotation-number tuples and of
abelian characters) and refused through :func:`knotobs.guard.require` before any work when it
exceeds the limits in force.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction
from math import prod
from typing import Any

from knotobs.errors import InvalidSeifertDataError
from knotobs.fibrations.seifert import parse_space
from knotobs.flat.characters import Character, abelian_characters, abelian_work, guard_enumeration, irreducible_characters
from knotobs.flat.torsion import irreducible_torsion

__all__ = ["FlatSL2CRow", "FlatSL2CTable", "flat_sl2c_connections", "guard_table"]


@dataclass(frozen=True)
class FlatSL2CRow:
    """One flat SL(2,C) connection: the :class:`~knotobs.flat.characters.Character` and its torsion."""

    character: Character
    torsion: Any = None          # mpmath.mpf or None

    def to_json(self, digits: int = 15) -> dict[str, Any]:
        c = self.character
        import mpmath

        return {
            "kind": c.kind,
            "real_form": c.real_form,
            "rho_h": c.eps if c.kind == "irreducible" else None,
            "h_angle": str(c.h_angle),
            "rotation_numbers": list(c.rotation) if c.kind == "irreducible" else [],
            "angles": [str(t) for t in c.rotation] if c.kind != "irreducible" else [],
            "cs": str(c.cs),
            "cs_signed": str(c.cs - 1 if c.cs > Fraction(1, 2) else c.cs),
            "cs_imaginary": "0",
            "dimension": c.dimension,
            "torsion": None if self.torsion is None else mpmath.nstr(self.torsion, digits),
        }


@dataclass(frozen=True)
class FlatSL2CTable:
    """All flat SL(2,C) connections of one Seifert rational homology sphere."""

    space: str
    normal_form: str
    h1_order: int
    rows: tuple[FlatSL2CRow, ...]
    digits: int
    notes: tuple[str, ...] = field(default_factory=tuple)

    def count(self, kind: str | None = None, real_form: str | None = None) -> int:
        """Number of rows of this kind / real form.

        >>> flat_sl2c_connections("Sigma(2,3,7)").count("irreducible")
        3
        """
        return sum(1 for r in self.rows if (kind is None or r.character.kind == kind)
                   and (real_form is None or r.character.real_form == real_form))

    def counts(self) -> dict[str, int]:
        """Numbers of irreducible (all, SU(2), SL(2,R)) and abelian connections, in one pass."""
        out = {"irreducible": 0, "irreducible_SU(2)": 0, "irreducible_SL(2,R)": 0, "abelian_including_trivial": 0}
        for r in self.rows:
            c = r.character
            if c.kind == "irreducible":
                out["irreducible"] += 1
                if c.real_form in ("SU(2)", "SL(2,R)"):
                    out[f"irreducible_{c.real_form}"] += 1
            else:
                out["abelian_including_trivial"] += 1
        return out

    def to_json(self) -> dict[str, Any]:
        return {
            "quantity": "flat-sl2c-connections",
            "space": self.space,
            "normal_form": self.normal_form,
            "group": "SL(2,C)",
            "H1_order": self.h1_order,
            "convention": "Z_K ~ sum exp(2 pi i K cs); rho(x_j) ~ exp(i pi l_j/a_j), rho(h) = rho_h;"
                          " rotation numbers refer to the normal form; torsion |A|^2 (CONVENTIONS §12)",
            "counts": self.counts(),
            "connections": [r.to_json(self.digits) for r in self.rows],
            "notes": list(self.notes),
        }


def guard_table(M) -> None:
    """Refuse, before any work, a table estimated above the limits in force (``M`` in normal form).

    >>> from knotobs.fibrations.seifert import parse_space
    >>> guard_table(parse_space("Sigma(97,98,99)").normal_form())        # about 30 s: accepted
    """
    from knotobs.guard import require

    guard_enumeration(M, "flat SL(2,C) connections")
    h1 = M.h1_order
    ab_cost = abelian_work(M)
    require(f"abelian flat connections of {M}: |H_1| = {h1}, {ab_cost:.3g} steps",
            seconds=ab_cost * 3e-6 + h1 * 1e-4, memory_mb=h1 * 4e-3 + ab_cost * 1e-4 + 50,
            accepted="a smaller |H_1| or fewer fibres")


def flat_sl2c_connections(space, digits: int = 15) -> FlatSL2CTable:
    """Every flat SL(2,C) connection of a Seifert rational homology sphere over ``S^2``.

    Parameters
    ----------
    space : str or SeifertManifold
        ``Sigma(2,3,7)``, ``L(5,1)``, ``M(0; b; (a1,b1), ...)`` (any number of fibres, any orders).
    digits : int
        Significant digits of the torsions (computed with that many digits plus ten guard digits).

    Returns
    -------
    FlatSL2CTable

    Examples
    --------
    >>> t = flat_sl2c_connections("Sigma(2,3,7)")
    >>> [(r.character.real_form, str(r.character.cs)) for r in t.rows if r.character.kind == "irreducible"]
    [('SU(2)', '143/168'), ('SU(2)', '47/168'), ('SL(2,R)', '167/168')]

    References
    ----------
    R. Fintushel and R. Stern, Proc. London Math. Soc. 61 (1990) 109–137; H. Boden and C. Curtis
    (2006), the SL(2,C) Casson invariant for Seifert fibered homology spheres; S. Gukov, M. Mariño
    and P. Putrov, arXiv:1605.07615 (Sigma(2,3,7): cs = -1/168 for the SL(2,R) connection).
    """
    if not isinstance(digits, int) or isinstance(digits, bool) or not 1 <= digits <= 100:
        raise InvalidSeifertDataError(f"digits = {digits!r}: give an integer between 1 and 100")
    M0 = parse_space(space)
    M = M0.normal_form()
    if not M.is_rational_homology_sphere:
        raise InvalidSeifertDataError(f"{M0} has e = 0 (infinite H_1): flat connections form families"
                                      " there; a rational homology sphere is needed")
    guard_table(M)
    fib = list(M.fibers)
    h1 = M.h1_order
    from knotobs.numerics import local_mp

    ctx = local_mp(digits + 10)
    cache: dict = {}
    rows = [FlatSL2CRow(c) for c in abelian_characters(M)]
    for c in irreducible_characters(M):
        tau = irreducible_torsion(M, c.eps, c.rotation, digits, ctx, cache) if c.dimension == 0 and len(fib) == 3 else None
        rows.append(FlatSL2CRow(c, tau))
    notes = ["CS values are exact and real: for a Seifert manifold over S^2 with e != 0 every flat"
             " SL(2,C) connection has boundary holonomies of finite order (imaginary part 0)"]
    if any(r.character.dimension > 0 for r in rows):
        notes.append("components of positive dimension: CS is constant on each; real form 'SU(2) and"
                     " SL(2,C)' means the component has irreducible SU(2) points; SL(2,R) points of such"
                     " components are not classified here")
    if len(fib) != 3:
        notes.append("torsion is given for isolated irreducible connections of three-fibre manifolds")
    return FlatSL2CTable(str(space), str(M), h1, tuple(rows), digits, tuple(notes))
