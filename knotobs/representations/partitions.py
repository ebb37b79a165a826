"""Integer partitions (Young diagrams) and their combinatorial data.

A partition is a non-increasing tuple of positive integers ``(l_1, ..., l_r)``;
the empty partition ``()`` labels the trivial representation.  Boxes are
indexed ``(i, j)`` from 0 (row ``i``, column ``j``); the content of a box is
``j - i`` and its hook length ``l_i - j + l'_j - i - 1`` (common practice;
I. G. Macdonald, *Symmetric Functions and Hall Polynomials*, 2nd ed., OUP 1995,
ch. I).
"""

from __future__ import annotations

import re
from functools import lru_cache
from typing import Iterable, Iterator, Sequence

from knotobs.errors import InvalidRepresentationError, ParseError

__all__ = [
    "Partition",
    "as_partition",
    "parse_partition",
    "partitions_of",
    "conjugate",
    "contents",
    "hooks",
    "kappa",
    "to_dynkin",
    "from_dynkin",
    "parse_rep_for",
    "MAX_PARTITION_SIZE",
]

Partition = tuple[int, ...]

#: Kept for backward compatibility only: partitions have no fixed size limit any more; each
#: route estimates its own time and memory (:mod:`knotobs.evaluation.estimates`).
MAX_PARTITION_SIZE = None


def as_partition(parts: Iterable[int] | str) -> Partition:
    """Validate and normalise a partition (trailing zeros are dropped).

    Examples
    --------
    >>> as_partition([2, 1, 0])
    (2, 1)
    >>> as_partition([1, 2])
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidRepresentationError: [1, 2] is not a partition: parts must be non-increasing non-negative integers, e.g. [2,1]
    """
    if isinstance(parts, str):
        return parse_partition(parts)
    try:
        if isinstance(parts, (dict, set, frozenset)):
            raise TypeError
        raw = list(parts)
    except TypeError:
        raise InvalidRepresentationError(
            f"{parts!r} is not a partition: give a list of non-increasing non-negative integers, e.g. [2,1]"
        ) from None
    ok = all(isinstance(x, int) and not isinstance(x, bool) and x >= 0 for x in raw)
    ok = ok and all(raw[i] >= raw[i + 1] for i in range(len(raw) - 1))
    if not ok:
        raise InvalidRepresentationError(
            f"{raw!r} is not a partition: parts must be non-increasing non-negative integers,"
            " e.g. [2,1]"
        )
    return tuple(x for x in raw if x > 0)


_BODY_RE = re.compile(r"^\s*-?\d+(\s*,\s*-?\d+)*\s*,?\s*$")
_CLOSE = {"[": "]", "(": ")"}


def parse_partition(text: str) -> Partition:
    """Parse ``"[2,1]"``, ``"(2,1)"``, ``"2,1"`` or ``"[]"`` (the trivial representation).

    Brackets must match and nothing else may appear: ``"["``, ``""`` and ``"[2,1"`` are errors.

    >>> parse_partition("[3, 1, 1]")
    (3, 1, 1)
    >>> parse_partition("[]")
    ()
    >>> parse_partition("[")
    Traceback (most recent call last):
    ...
    knotobs.errors.ParseError: cannot read partition '[': the brackets do not match; write it as [l1,l2,...], e.g. [2,1], or [] for the trivial representation
    """
    hint = "write it as [l1,l2,...], e.g. [2,1], or [] for the trivial representation"
    if not isinstance(text, str):
        raise ParseError(f"cannot read partition {text!r}: {hint}")
    s = text.strip()
    if not s:
        raise ParseError(f"empty partition {text!r}: {hint}")
    first, last = s[0], s[-1]
    if first in _CLOSE or last in ")]":
        if first not in _CLOSE or len(s) < 2 or _CLOSE[first] != last:
            raise ParseError(f"cannot read partition {text!r}: the brackets do not match; {hint}")
        body = s[1:-1]
        if not body.strip():
            return ()
    else:
        body = s
    if not _BODY_RE.match(body):
        raise ParseError(f"cannot read partition {text!r}: {hint}")
    parts = [int(x) for x in body.strip().rstrip(",").split(",")]
    return as_partition(parts)


def conjugate(lam: Sequence[int]) -> Partition:
    """Transpose of a Young diagram.

    >>> conjugate((3, 1))
    (2, 1, 1)
    """
    if not lam:
        return ()
    return tuple(sum(1 for x in lam if x > j) for j in range(lam[0]))


def contents(lam: Sequence[int]) -> list[int]:
    """Contents ``j - i`` of all boxes, row by row."""
    return [j - i for i, row in enumerate(lam) for j in range(row)]


def hooks(lam: Sequence[int]) -> list[int]:
    """Hook lengths of all boxes, row by row.

    >>> hooks((2, 1))
    [3, 1, 1]
    """
    lc = conjugate(lam)
    return [lam[i] - j + lc[j] - i - 1 for i, row in enumerate(lam) for j in range(row)]


def kappa(lam: Sequence[int]) -> int:
    """``kappa(lam) = sum_i lam_i (lam_i - 2 i + 1)`` (i from 1) = 2 * sum of contents.

    >>> kappa((2,)), kappa((1, 1))
    (2, -2)
    """
    return sum(x * (x - 2 * i - 1) for i, x in enumerate(lam))


@lru_cache(maxsize=None)
def _partitions(n: int, max_part: int, max_len: int) -> tuple[Partition, ...]:
    if n == 0:
        return ((),)
    if max_len == 0:
        return ()
    out = []
    for first in range(min(n, max_part), 0, -1):
        for rest in _partitions(n - first, first, max_len - 1):
            out.append((first,) + rest)
    return tuple(out)


def partitions_of(n: int, max_len: int | None = None) -> tuple[Partition, ...]:
    """All partitions of ``n`` (with at most ``max_len`` rows), in reverse lexicographic order.

    >>> partitions_of(4)
    ((4,), (3, 1), (2, 2), (2, 1, 1), (1, 1, 1, 1))
    """
    if n < 0:
        return ()
    return _partitions(n, n, n if max_len is None else max_len)


def to_dynkin(lam: Sequence[int], N: int) -> tuple[int, ...]:
    """Dynkin labels ``(l_1 - l_2, ..., l_{N-1} - l_N)`` of an SU(N) highest weight.

    Columns of height ``N`` are dropped (they are the determinant).

    >>> to_dynkin((2, 1), 3)
    (1, 1)
    """
    lam = tuple(lam) + (0,) * max(0, N - len(lam))
    if len(lam) > N:
        raise InvalidRepresentationError(
            f"partition {list(lam)} has {len(lam)} rows; SU({N}) allows at most {N}"
        )
    return tuple(lam[i] - lam[i + 1] for i in range(N - 1))


def from_dynkin(labels: Sequence[int]) -> Partition:
    """Partition with at most ``N - 1`` rows from SU(N) Dynkin labels.

    >>> from_dynkin((1, 1))
    (2, 1)
    """
    if any((not isinstance(x, int)) or x < 0 for x in labels):
        raise InvalidRepresentationError(
            f"Dynkin labels {list(labels)} must be non-negative integers"
        )
    rows = []
    total = 0
    for x in reversed(labels):
        total += x
        rows.append(total)
    return as_partition(list(reversed(rows)))


def iter_boxes(lam: Sequence[int]) -> Iterator[tuple[int, int]]:
    """Boxes ``(i, j)`` of a Young diagram, row by row."""
    for i, row in enumerate(lam):
        for j in range(row):
            yield i, j


def parse_rep_for(text: str, group=None) -> Partition:
    """One representation as the user writes it for SU(N) or U(N): a partition ``[2,1]``, or SU(N)
    Dynkin labels ``(1,1)`` (exactly ``N - 1`` of them; the partition ``l_i = a_i + ... + a_{N-1}``).

    Round brackets are Dynkin labels, never a partition: ``(1,1)`` for SU(3) is the adjoint ``[2,1]``,
    not ``[1,1]``.  Without a group (HOMFLY-PT at generic ``N``) and for U(N) (whose representations
    carry a U(1) charge, fixed by the partition) labels are refused with the partition to write.

    >>> parse_rep_for("(1,1)", "SU(3)"), parse_rep_for("[1,1]", "SU(3)"), parse_rep_for("(3)", "SU(2)")
    ((2, 1), (1, 1), (3,))
    >>> parse_rep_for("(1,0,0)", "SU(3)")
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidRepresentationError: Dynkin labels (1,0,0): SU(3) has 2 labels (a_1,a_2), e.g. (1,0) for [1]; or write a partition such as [2,1]
    """
    s = text.strip() if isinstance(text, str) else text
    if not (isinstance(s, str) and s.startswith("(")):
        return parse_partition(text)
    from knotobs.representations.cartan.group import Dynkin, parse_rep_text

    labels = parse_rep_text(s)
    if not isinstance(labels, Dynkin):                       # pragma: no cover - "(" always gives labels
        raise ParseError(f"cannot read representation {text!r}")
    vals = tuple(labels)
    shown = "(" + ",".join(str(x) for x in vals) + ")"
    if group is None:
        raise InvalidRepresentationError(
            f"Dynkin labels {shown} need a group (they depend on N): write a partition such as [2,1]"
            f" (for SU(N), labels a_i give l_i = a_i + ... + a_(N-1))")
    g = str(group).replace(" ", "")
    m = re.match(r"^([SU]?U)\((\d+)\)$", g.upper())
    if m is None:
        raise InvalidRepresentationError(f"Dynkin labels {shown} for {group}: write a partition such as [2,1]")
    N = int(m.group(2))
    part = from_dynkin(vals) if len(vals) == N - 1 else None
    if m.group(1) == "U":
        hint = f"; e.g. [{','.join(map(str, part))}] for these SU({N}) labels" if part is not None else ""
        raise InvalidRepresentationError(
            f"Dynkin labels {shown} for U({N}): a U(N) representation carries a U(1) charge, so write"
            f" it as a partition{hint}")
    if part is None:
        names = ",".join(f"a_{i}" for i in range(1, N))
        example = "(" + ",".join(["1"] + ["0"] * (N - 2)) + ")"
        raise InvalidRepresentationError(
            f"Dynkin labels {shown}: SU({N}) has {N - 1} label{'s' if N > 2 else ''} ({names}), e.g. {example}"
            f" for [1]; or write a partition such as [2,1]")
    return part
