"""Simple compact groups by name, and their representations in knotobs' notation.

Group names (strict; anything else is refused with an error that names the text):

=============  ==============  ==========================================================
name           Cartan type     notes
=============  ==============  ==========================================================
``SU(N)``      ``A_(N-1)``     ``N >= 2``
``SO(N)``      ``B_n``/``D_n``  ``N >= 3``; ``N = 2n + 1`` or ``2n``; SO(4) = ``D_2`` is semisimple
``Spin(N)``    ``B_n``/``D_n``  as SO(N), and the spinor representations are allowed
``Sp(2n)``     ``C_n``         the compact symplectic group acting on ``C^(2n)``; the size is even
``G2``         ``G_2``         representations by Dynkin labels only
=============  ==============  ==========================================================

Representations (CONVENTIONS §14, ``docs/groups.md``):

* **Dynkin labels** in round brackets, ``(1,0)``: the highest weight ``sum a_i omega_i`` in
  Bourbaki's labelling of the simple roots (any group);
* **partitions** in square brackets, ``[2,1]``: the highest weight ``sum lam_i e_i`` in the
  orthonormal basis of the classical groups (SU, SO, Spin, Sp); see the family modules for the
  map to Dynkin labels.

In Python a :class:`Dynkin` tuple is Dynkin labels, any other tuple or list is a partition.

Examples
--------
>>> G = simple_group("Sp(4)")
>>> G, G.rank, G.cartan_type
(SimpleGroup('Sp(4)'), 2, 'C2')
>>> G.highest_weight("[1,1]"), G.highest_weight("(0,1)"), G.highest_weight(Dynkin((2, 0)))
((0, 1), (0, 1), (2, 0))
>>> simple_group("SO(2)")
Traceback (most recent call last):
...
knotobs.errors.InvalidGroupError: SO(2) is abelian (a circle): SO(N) needs N >= 3, e.g. SO(3) or SO(5)
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from functools import lru_cache
from typing import Sequence

from knotobs.errors import InvalidGroupError, InvalidRepresentationError, ParseError, SizeLimitError
from knotobs.representations.cartan import type_a, type_b, type_c, type_d, type_g
from knotobs.representations.cartan.rootsystem import RootSystem, Weight

__all__ = ["SimpleGroup", "Dynkin", "simple_group", "is_simple_group_name", "MAX_CARTAN_RANK"]

#: Largest rank accepted for the groups of this package.
MAX_CARTAN_RANK = 32


class Dynkin(tuple):
    """A tuple of Dynkin labels (to tell it apart from a partition in Python calls).

    >>> Dynkin((1, 0))
    Dynkin((1, 0))
    """

    def __repr__(self) -> str:
        return f"Dynkin({tuple(self)!r})"


@dataclass(frozen=True)
class SimpleGroup:
    """A compact simple (or, for SO(4), semisimple) group with its root system.

    Attributes
    ----------
    kind : str
        ``"SU"``, ``"SO"``, ``"Spin"``, ``"Sp"`` or ``"G2"``.
    N : int
        Size of the defining matrices (``SU(N)``, ``SO(N)``, ``Sp(N)`` with ``N = 2n``); 7 for G2.
    """

    kind: str
    N: int

    def __post_init__(self) -> None:
        k, N = self.kind, self.N
        if isinstance(N, bool) or not isinstance(N, int):
            raise InvalidGroupError(f"{k}({N!r}): the size must be an integer")
        if k == "SU" and N < 2:
            raise InvalidGroupError(f"SU({N}) is trivial: SU(N) needs N >= 2, e.g. SU(2)")
        if k in ("SO", "Spin") and N < 3:
            raise InvalidGroupError(f"{k}({N}) is abelian (a circle): {k}(N) needs N >= 3, e.g. {k}(3) or {k}(5)"
                                    if N == 2 else f"{k}({N}) is not a simple group: {k}(N) needs N >= 3, e.g. {k}(5)")
        if k == "Sp" and (N < 2 or N % 2):
            raise InvalidGroupError(
                f"Sp({N}): the compact symplectic group Sp(2n) acts on C^(2n), so its size must be even"
                f" and at least 2, e.g. Sp(2) or Sp(4)")
        if k == "G2" and N != 7:
            raise InvalidGroupError(f"G2 has defining size 7, not {N}")
        if k not in ("SU", "SO", "Spin", "Sp", "G2"):
            raise InvalidGroupError(f"unknown group kind {k!r}: use SU, SO, Spin, Sp or G2")
        if self.rank > MAX_CARTAN_RANK:
            raise SizeLimitError(f"{self} has rank {self.rank}; at most rank {MAX_CARTAN_RANK} is handled")

    def __str__(self) -> str:
        return "G2" if self.kind == "G2" else f"{self.kind}({self.N})"

    def __repr__(self) -> str:
        return f"SimpleGroup({str(self)!r})"

    # ------------------------------------------------------------ structure
    @property
    def family(self):
        k, N = self.kind, self.N
        if k == "SU":
            return type_a
        if k in ("SO", "Spin"):
            return type_b if N % 2 else type_d
        if k == "Sp":
            return type_c
        return type_g

    @property
    def rank(self) -> int:
        k, N = self.kind, self.N
        if k == "SU":
            return N - 1
        if k in ("SO", "Spin", "Sp"):
            return N // 2
        return 2

    @property
    def cartan_type(self) -> str:
        return f"{self.family.FAMILY}{self.rank}"

    @property
    def roots(self) -> RootSystem:
        return self.family.root_system(self.rank)

    @property
    def dual_coxeter(self):
        """Dual Coxeter number ``h^vee`` (for SO(4): that of each ``A_1`` factor, 2)."""
        return self.roots.dual_coxeter

    # ------------------------------------------------------------ representations
    def highest_weight(self, rep) -> Weight:
        """Dynkin labels of a representation given as text, a :class:`Dynkin` tuple or a partition.

        Raises
        ------
        InvalidRepresentationError
            For a partition of G2, wrong lengths, negative labels, or a spinor of SO(N).
        """
        if isinstance(rep, str):
            rep = parse_rep_text(rep)
        if isinstance(rep, Dynkin):
            labels = tuple(rep)
            if len(labels) != self.rank or not all(isinstance(x, int) and not isinstance(x, bool) and x >= 0 for x in labels):
                raise InvalidRepresentationError(
                    f"Dynkin labels {_fmt(labels)} are not a highest weight of {self}: give {self.rank}"
                    f" non-negative integers, e.g. {_fmt((1,) + (0,) * (self.rank - 1))}")
        else:
            if self.kind == "G2":
                raise InvalidRepresentationError(
                    f"G2 has no partition notation (got {list(rep) if not isinstance(rep, str) else rep}):"
                    " give Dynkin labels, e.g. (1,0) for the 7-dimensional or (0,1) for the adjoint")
            from knotobs.representations.partitions import as_partition

            lam = as_partition(rep)
            labels = self.family.dynkin_from_partition(lam, self.rank, str(self))
        if self.kind == "SO" and not self.family.is_tensor(labels):
            raise InvalidRepresentationError(
                f"Dynkin labels {_fmt(labels)} name a spinor representation, which is a representation of"
                f" Spin({self.N}), not of SO({self.N}): use --group 'Spin({self.N})'")
        if sum(labels) > 200:
            raise SizeLimitError(f"Dynkin labels {_fmt(labels)} are too large; the sum of labels is at most 200")
        return labels

    def label_text(self, labels: Sequence[int]) -> str:
        """``"(1,0)"``: the notation used in printed results."""
        return _fmt(labels)


def _fmt(labels) -> str:
    return "(" + ",".join(str(x) for x in labels) + ")"


_REP_RE = re.compile(r"^\s*([\[(])\s*(\d+(?:\s*,\s*\d+)*)?\s*([\])])\s*$")


def parse_rep_text(text: str):
    """``"[2,1]"`` -> the partition ``(2, 1)``; ``"(1,0)"`` -> ``Dynkin((1, 0))``.

    >>> parse_rep_text("[2, 1]"), parse_rep_text("(0,1)")
    ((2, 1), Dynkin((0, 1)))
    >>> parse_rep_text("(1,0")
    Traceback (most recent call last):
    ...
    knotobs.errors.ParseError: cannot read representation '(1,0': write Dynkin labels as (1,0) or a partition as [2,1]
    """
    m = _REP_RE.match(text)
    if not m or {"[": "]", "(": ")"}[m.group(1)] != m.group(3):
        raise ParseError(f"cannot read representation {text!r}: write Dynkin labels as (1,0) or a partition as [2,1]")
    body = m.group(2)
    vals = tuple(int(x) for x in body.split(",")) if body else ()
    if m.group(1) == "(":
        return Dynkin(vals)
    from knotobs.representations.partitions import as_partition

    return as_partition(list(vals))


_NAME_RE = re.compile(r"^\s*([A-Za-z]+)\s*\(\s*([+-]?\d+)\s*\)\s*$")
_G2_RE = re.compile(r"^\s*G\s*_?\s*2\s*$", re.IGNORECASE)
_KINDS = {"su": "SU", "so": "SO", "spin": "Spin", "sp": "Sp", "usp": "Sp"}


def is_simple_group_name(spec) -> bool:
    """Whether ``spec`` names one of the groups of this package other than SU(N)/U(N).

    >>> is_simple_group_name("SO(5)"), is_simple_group_name("SU(3)"), is_simple_group_name("G2")
    (True, False, True)
    """
    if isinstance(spec, SimpleGroup):
        return spec.kind != "SU"
    if not isinstance(spec, str):
        return False
    if _G2_RE.match(spec):
        return True
    m = _NAME_RE.match(spec)
    return bool(m) and m.group(1).lower() in ("so", "spin", "sp", "usp")


@lru_cache(maxsize=256)
def _parse(spec: str) -> SimpleGroup:
    if _G2_RE.match(spec):
        return SimpleGroup("G2", 7)
    opens, closes = spec.count("("), spec.count(")")
    if opens != closes:
        raise ParseError(f"cannot read group {spec!r}: unbalanced brackets; write e.g. SO(5), Sp(4), G2 or SU(3)")
    m = _NAME_RE.match(spec)
    if not m:
        raise ParseError(f"cannot read group {spec!r}: write SU(N), SO(N), Spin(N), Sp(2n) or G2, e.g. SO(5)")
    kind = _KINDS.get(m.group(1).lower())
    if kind is None:
        raise InvalidGroupError(f"unknown group {spec.strip()!r}: use SU(N), SO(N), Spin(N), Sp(2n) or G2")
    return SimpleGroup(kind, int(m.group(2)))


def simple_group(spec) -> SimpleGroup:
    """Read ``"SO(5)"``, ``"Spin(7)"``, ``"Sp(4)"``, ``"G2"``, ``"SU(3)"``, a Cartan pair
    ``("B", 2)`` or a :class:`SimpleGroup`.

    >>> simple_group("SO(6)").cartan_type, simple_group(("C", 3)), simple_group(" spin ( 5 ) ")
    ('D3', SimpleGroup('Sp(6)'), SimpleGroup('Spin(5)'))
    >>> simple_group("SU(2")
    Traceback (most recent call last):
    ...
    knotobs.errors.ParseError: cannot read group 'SU(2': unbalanced brackets; write e.g. SO(5), Sp(4), G2 or SU(3)
    """
    if isinstance(spec, SimpleGroup):
        return spec
    if isinstance(spec, tuple) and len(spec) == 2:
        t, r = str(spec[0]).upper(), spec[1]
        if not isinstance(r, int) or isinstance(r, bool) or r < 1:
            raise InvalidGroupError(f"{spec!r} is not a valid Cartan type: the rank must be a positive integer")
        table = {"A": ("SU", r + 1), "B": ("SO", 2 * r + 1), "C": ("Sp", 2 * r), "D": ("SO", 2 * r), "G": ("G2", 7)}
        if t not in table or (t == "G" and r != 2) or (t == "D" and r < 2):
            raise InvalidGroupError(f"{spec!r} is not a valid Cartan type: use A_n, B_n, C_n, D_n (n >= 2) or G_2")
        return SimpleGroup(*table[t])
    if not isinstance(spec, str):
        raise InvalidGroupError(f"cannot read group {spec!r}: give a name such as 'SO(5)'")
    return _parse(spec)
