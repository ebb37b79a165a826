"""Optional access to the torus knots and links of the open dataset ``database-knotinfo``.

The dataset is an optional extra (``pip install knotobs[tables]``); without it every
function here raises :class:`~knotobs.errors.MissingDependencyError` with that advice.

How torus entries are recognised (no list of names is hard-coded):

* knots: the column ``geometric_type`` reads ``"torus knot T(p,q)"``; the chirality of the
  stored diagram is read off its ``braid_notation`` (all generators positive: the
  positive torus knot; all negative: its mirror);
* links: the ``braid_notation`` ``{b, word}`` is exactly ``(sigma_1 ... sigma_(b-1))^n``
  or its inverse up to a cyclic rotation.  Its closure is ``T(b, +-n)`` with the braid
  (parallel) orientation, which fixes the orientation class ``{...}`` of the entry.

Storage conventions of the dataset (docs/conventions.md §8): the knot table writes the Jones
polynomial in ``t``, the link table in ``x = t^(1/2)``; HOMFLY-PT in ``(v, z)`` with
``v = a^-1``; the Alexander string's normalisation varies, the Conway polynomial is
in ``z``.
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from functools import lru_cache

from knotobs.errors import InvalidKnotError, MissingDependencyError
from knotobs.fibrations.torus import TorusLink, parse_knot

__all__ = ["KnotInfoEntry", "available", "dataset_version", "torus_entries", "lookup"]

_INSTALL = ("the dataset 'database-knotinfo' is not installed; install the optional extra"
            " with: pip install 'knotobs[tables]'")


def available() -> bool:
    """Whether the dataset package can be imported."""
    try:
        import database_knotinfo  # noqa: F401
    except ImportError:
        return False
    return True


def _module():
    try:
        import database_knotinfo
    except ImportError:
        raise MissingDependencyError(_INSTALL) from None
    return database_knotinfo


def dataset_version() -> str:
    """Version string of the installed dataset."""
    mod = _module()
    try:
        from importlib.metadata import version

        return version("database_knotinfo")
    except Exception:  # pragma: no cover - metadata missing
        return str(mod.version())


@dataclass(frozen=True)
class KnotInfoEntry:
    """One torus knot or link of the dataset, with its polynomial strings as stored.

    Attributes
    ----------
    name : str
        The dataset's name (``"3_1"``, ``"L6a3{0}"``).
    torus : TorusLink
        The stored diagram as a torus link, with its chirality (``T(2,-6)`` for a mirror).
    jones, homfly, alexander, conway, kauffman : str
        The stored strings (``""`` when absent); the Kauffman polynomial is in ``(a, z)``.
    jones_variable : str
        ``"t"`` (knot table) or ``"x"`` (link table, ``x = t^(1/2)``).
    """

    name: str
    torus: TorusLink
    jones: str
    homfly: str
    alexander: str
    conway: str
    jones_variable: str
    braid: str
    kauffman: str = ""

    @property
    def is_link(self) -> bool:
        return not self.torus.is_knot

    @property
    def stored_mirror(self) -> bool:
        """True when the dataset stores the negative (mirror) torus link."""
        return self.torus.chirality < 0


_BRAID_LINK = re.compile(r"^\{\s*(\d+)\s*,\s*\{([-\d,\s]*)\}\s*\}$")
_TORUS_TYPE = re.compile(r"torus knot T\((\d+),\s*(\d+)\)")


def _torus_from_braid(strands: int, word: list[int]) -> TorusLink | None:
    """``T(b, +-n)`` if ``word`` is a cyclic rotation of ``(s_1 ... s_(b-1))^(+-n)``."""
    if strands < 2 or not word:
        return None
    sign = 1 if word[0] > 0 else -1
    if any((w > 0) != (sign > 0) for w in word):
        return None
    gens = [abs(w) for w in word]
    period = list(range(1, strands))
    L = len(period)
    if len(gens) % L:
        return None
    for shift in range(L):
        rot = gens[shift:] + gens[:shift]
        if all(rot[i] == period[i % L] for i in range(len(rot))):
            n = len(gens) // L
            return TorusLink(strands, sign * n)
    return None


@lru_cache(maxsize=1)
def torus_entries() -> tuple[KnotInfoEntry, ...]:
    """All torus knots and torus links of the dataset, recognised as described above.

    Examples
    --------
    >>> es = torus_entries()
    >>> [(e.name, str(e.torus)) for e in es][:2]
    [('3_1', 'T(2,3)'), ('5_1', 'T(2,5)')]

    References
    ----------
    C. Livingston, A. H. Moore, KnotInfo and LinkInfo: tables of knot and link invariants
    (the dataset ``database-knotinfo``); CONVENTIONS §8.
    """
    mod = _module()
    out: list[KnotInfoEntry] = []
    knots = mod.link_list()
    for row in knots[1:]:
        m = _TORUS_TYPE.search(row.get("geometric_type", "") or "")
        if not m:
            continue
        p, q = int(m.group(1)), int(m.group(2))
        word = [int(x) for x in re.findall(r"-?\d+", row.get("braid_notation", ""))]
        if not word:
            continue
        if all(w > 0 for w in word):
            chir = 1
        elif all(w < 0 for w in word):
            chir = -1
        else:  # not a positive/negative braid: chirality not readable, leave out
            continue
        out.append(KnotInfoEntry(row["name"], TorusLink(p, chir * q), row.get("jones_polynomial", ""),
                                 row.get("homfly_polynomial", ""), row.get("alexander_polynomial", ""),
                                 row.get("conway_polynomial", ""), "t", row.get("braid_notation", ""),
                                 row.get("kauffman_polynomial", "") or ""))
    links = mod.link_list(proper_links=True)
    for row in links[1:]:
        m = _BRAID_LINK.match((row.get("braid_notation") or "").strip())
        if not m:
            continue
        word = [int(x) for x in re.findall(r"-?\d+", m.group(2))]
        tl = _torus_from_braid(int(m.group(1)), word)
        if tl is None or tl.is_knot:
            continue
        out.append(KnotInfoEntry(row["name"], tl, row.get("jones_polynomial", ""),
                                 row.get("homflypt_polynomial", ""), "",
                                 row.get("conway_polynomial", ""), "x", row.get("braid_notation", ""),
                                 row.get("kauffman_polynomial", "") or ""))
    return tuple(out)


def lookup(knot) -> KnotInfoEntry:
    """The dataset entry of the torus knot or link ``knot`` (either chirality).

    For a link, an entry with the parallel (braid-closure) orientation is returned; when
    the dataset stores both chiralities (the Hopf link: ``T(2,-2)`` is ``T(2,2)`` with one
    component reversed) the one of the same chirality as ``knot`` is preferred.

    Raises
    ------
    InvalidKnotError
        If the dataset has no entry for it (e.g. more crossings than tabulated).
    """
    k = parse_knot(knot)
    if k.is_unknot:
        raise InvalidKnotError(f"{k} is the unknot; the dataset's torus entries start at T(2,3)")
    want = {(k.P * k.components, k.Q * k.components), (k.Q * k.components, k.P * k.components)}
    hits = [e for e in torus_entries() if (abs(e.torus.p), abs(e.torus.q)) in want]
    same = [e for e in hits if e.torus.chirality == k.chirality]
    if same or hits:
        return (same or hits)[0]
    names = ", ".join(sorted({str(e.torus.positive) for e in torus_entries()}))
    raise InvalidKnotError(f"the dataset has no entry for {k}; its torus knots and links are: {names}")
