r"""The labels ``b`` of the q-series: spin^c structures of a plumbed manifold, up to conjugation.

For a plumbing tree with linking matrix ``B`` (``s`` vertices, degrees ``deg v``) put
``delta_v = deg v mod 2``.  The labels are the classes

    ``b in (delta + 2 Z^s) / 2 B Z^s``,

a torsor over ``H_1(M) = Z^s / B Z^s`` (``b = delta + 2a``), so there are ``|det B| = |H_1(M)|``
of them; they correspond to the spin^c structures of ``M`` (S. Gukov, D. Pei, P. Putrov and
C. Vafa, J. Knot Theory Ramifications 29 (2020), §3; the characteristic vectors ``k`` with
``k_v = w_v mod 2`` give the same classes via ``b = k + B(1,...,1)``).  Conjugation ``b -> -b``
(the Weyl group of SU(2)) leaves the q-series unchanged (CONVENTIONS §13), so knotobs names
one label per pair ``{b, -b}``.

Naming
------
Each class is reduced modulo the rows of the Hermite normal form ``H`` of ``2B`` (upper
triangular, rows spanning ``2 B Z^s``): the representative has ``0 <= b_i < H_ii``, which
is unique.  A label is written by the lexicographically smaller of the reduced
representatives of ``b`` and ``-b``, e.g. ``(1,0,0,1)``.  Labels are numbered: ``0`` is the
class of ``delta`` itself (for an integral homology sphere the only one), the others follow
in lexicographic order of their vectors.  ``--label`` accepts the number or the vector.
The numbering belongs to the plumbing: two plumbings of the same manifold may number
the same spin^c structure differently.
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from itertools import product
from typing import Sequence

from knotobs.errors import InvalidSeifertDataError, ParseError
from knotobs.guard import require, seconds_for
from knotobs.qseries.plumbing import PlumbingGraph

__all__ = ["Label", "LabelSystem", "label_system"]


@dataclass(frozen=True)
class Label:
    """One label: its number, its canonical vector, and whether ``b = -b``.

    >>> label_system("Plumb(-2,-2,-2,-2,-2,-2,-2,-2 : 1-2, 2-3, 3-4, 4-5, 5-6, 6-7, 3-8)").labels
    (Label(index=0, vector=(1, 0, 1, 0, 0, 0, 1, 1), self_conjugate=True),)
    """

    index: int
    vector: tuple[int, ...]
    self_conjugate: bool

    def __str__(self) -> str:
        return "(" + ",".join(str(x) for x in self.vector) + ")"


class LabelSystem:
    """All labels of one plumbing, with reduction and lookup (module docstring).

    Examples
    --------
    >>> ls = label_system("Plumb(-5)")          # L(5,1): delta = (0)
    >>> [str(x) for x in ls.labels]
    ['(0)', '(2)', '(4)']
    >>> ls.find("2").vector, ls.find("(4)").index
    ((4,), 2)

    References
    ----------
    Gukov, Pei, Putrov & Vafa, J. Knot Theory Ramifications 29 (2020) 2040003; CONVENTIONS §13.
    """

    def __init__(self, graph: PlumbingGraph):
        from flint import fmpz_mat

        self.graph = graph
        s = graph.size
        B = graph.linking_matrix()
        self.det = int(fmpz_mat(B).det())
        if self.det == 0:
            raise InvalidSeifertDataError(f"{graph}: det B = 0, so b_1 > 0; the labels need b_1 = 0")
        self.delta = tuple(d % 2 for d in graph.degrees)
        H1 = fmpz_mat(B).hnf()
        self._hb = [[int(H1[i, j]) for j in range(s)] for i in range(s)]
        self._h2 = [[2 * x for x in row] for row in self._hb]
        n = abs(self.det)
        snf = fmpz_mat(B).snf()
        two = 2 ** sum(1 for i in range(s) if int(snf[i, i]) % 2 == 0)
        #: number of labels: (|H_1| + |H_1/2H_1|)/2 (conjugation fixes the spin structures)
        self.count = (n + two) // 2
        b0 = self.reduce(list(self.delta))
        m0 = self.reduce([-x for x in b0])
        self.first = Label(0, min(b0, m0), b0 == m0)
        self._labels: tuple[Label, ...] | None = None

    @property
    def labels(self) -> tuple[Label, ...]:
        """All labels in order (enumerated on first use; guarded by the size of ``H_1``)."""
        if self._labels is None:
            self._enumerate()
        return self._labels

    def _enumerate(self) -> None:
        s = self.graph.size
        n = abs(self.det)
        require(f"listing the {n} spin^c labels of a plumbing with {s} vertices",
                seconds=seconds_for(n * s * s, "python"), memory_mb=n * s * 8e-5,
                accepted="use label 0 (no listing needed) or a manifold with smaller |H_1|")
        seen: dict[tuple[int, ...], tuple[tuple[int, ...], bool]] = {}
        ranges = [range(self._hb[i][i]) for i in range(s)]
        for a in product(*ranges):
            b = self.reduce([d + 2 * x for d, x in zip(self.delta, a)])
            if b in seen:
                continue
            m = self.reduce([-x for x in b])
            canon = min(b, m)
            seen[b] = seen[m] = (canon, b == m)
        canon_set = {v for v in seen.values()}
        rest = sorted(c for c in canon_set if c[0] != self.first.vector)
        self._labels = (self.first,) + tuple(Label(i, c[0], c[1]) for i, c in enumerate(rest, start=1))
        if len(self._labels) != self.count:  # pragma: no cover - would contradict the count above
            raise InvalidSeifertDataError(f"internal: {len(self._labels)} labels, expected {self.count}")
        self._by_vec = {lab.vector: lab for lab in self._labels}

    def reduce(self, v: Sequence[int]) -> tuple[int, ...]:
        """The representative of ``v + 2 B Z^s`` with ``0 <= v_i < H_ii`` (H = HNF of 2B)."""
        v = list(v)
        H = self._h2
        for i in range(len(v)):
            h = H[i][i]
            q = v[i] // h
            if q:
                row = H[i]
                for j in range(i, len(v)):
                    v[j] -= q * row[j]
        return tuple(v)

    def label_of(self, v: Sequence[int]) -> Label:
        """The label of the class of ``v`` (which must have the parity ``delta``)."""
        v = tuple(int(x) for x in v)
        if len(v) != self.graph.size:
            raise ParseError(f"label {v}: need {self.graph.size} entries, one per vertex")
        if any((x - d) % 2 for x, d in zip(v, self.delta)):
            raise ParseError(
                f"label {v}: entry v_i must have the parity of deg(v_i) (delta = {self.delta})")
        b = self.reduce(v)
        m = self.reduce([-x for x in b])
        if min(b, m) == self.first.vector:
            return self.first
        self.labels  # noqa: B018 - enumerate for the numbering
        return self._by_vec[min(b, m)]

    def find(self, label) -> Label:
        """A label from its number (int or digits) or its vector (``"(1,0,...)"`` or a sequence)."""
        if isinstance(label, Label):
            return label
        if isinstance(label, bool):
            raise ParseError(f"label {label!r}: give a label number or a vector")
        if isinstance(label, int) or (isinstance(label, str) and re.fullmatch(r"\s*\d+\s*", label)):
            i = int(label)
            if not 0 <= i < self.count:
                raise ParseError(
                    f"label {label!r} does not exist: this space has labels 0..{self.count - 1}")
            return self.first if i == 0 else self.labels[i]
        if isinstance(label, str):
            body = label.strip()
            if not re.fullmatch(r"\(\s*[+-]?\d+(\s*,\s*[+-]?\d+)*\s*\)", body):
                raise ParseError(
                    f"label {label!r}: give a label number 0..{self.count - 1} or a vector"
                    f" (b_1,...,b_{self.graph.size})")
            return self.label_of([int(x) for x in body.strip("()").split(",")])
        try:
            return self.label_of(list(label))
        except TypeError:
            raise ParseError(f"label {label!r}: give a label number or a vector") from None

    def class_representatives(self, lab: Label) -> tuple[tuple[int, ...], ...]:
        """``(b,)`` or ``(b, -b)`` reduced: the one or two classes mod ``2B`` that ``lab`` names."""
        b = lab.vector
        m = self.reduce([-x for x in b])
        return (b,) if m == b else (b, m)


def label_system(graph) -> LabelSystem:
    """:class:`LabelSystem` of a plumbing (text or graph)."""
    from knotobs.qseries.plumbing import parse_plumbing

    return LabelSystem(parse_plumbing(graph))

