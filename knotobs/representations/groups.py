"""The gauge groups SU(N) and U(N) and the data of their irreducible representations.

Conventions (docs/conventions.md §1–§2):

* A representation is labelled by a partition ``lam`` with at most N rows
  (its highest weight in the basis ``e_1..e_N``); for SU(N), columns of height
  N are the determinant and may be present or not.
* Quadratic Casimir with long roots of length^2 = 2:
  ``C(lam) = <lam, lam + 2 rho>/2 = (kappa + N|lam| - |lam|^2/N)/2`` for SU(N),
  without the ``|lam|^2/N`` term for U(N) (``kappa = 2 * sum of contents``).
* Twist ``theta(lam) = q^C(lam)``; quantum integers
  ``[x] = (q^(x/2) - q^(-x/2))/(q^(1/2) - q^(-1/2))``.
* Quantum dimension by Weyl's formula ``prod_{i<j} [lam_i - lam_j + j - i]/[j - i]``
  (equal to the hook–content formula ``prod_boxes [N + c]/[h]``, which the tests
  check; the generic-N form lives in :func:`homfly_unknot`).
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from fractions import Fraction
from functools import lru_cache
from math import prod
from typing import Sequence

import numpy as np
from flint import fmpz_poly

from knotobs.errors import InvalidGroupError, InvalidRepresentationError, ParseError, SizeLimitError
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.partitions import (
    Partition,
    as_partition,
    contents,
    from_dynkin,
    hooks,
    kappa,
    to_dynkin,
)
from knotobs.representations.symmetric import _reflect_to_dominant
from knotobs.representations.weights import weight_multiplicities

__all__ = [
    "Group",
    "SU",
    "U",
    "parse_group",
    "quantum_integer",
    "casimir",
    "dimension",
    "quantum_dimension",
    "quantum_dimension_hook_content",
    "homfly_unknot",
    "adams_fixed",
    "tensor_fixed",
    "dual",
    "MAX_RANK",
]

#: Largest N accepted for SU(N)/U(N) computations that depend on N.
MAX_RANK = 64


@dataclass(frozen=True)
class Group:
    """A compact gauge group ``SU(N)`` or ``U(N)``.

    Examples
    --------
    >>> parse_group("SU(3)")
    Group(kind='SU', N=3)
    >>> parse_group(("A", 2))
    Group(kind='SU', N=3)
    >>> parse_group("SU(1)")
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidGroupError: SU(1) is trivial: N must be at least 2 (e.g. SU(2))
    """

    kind: str
    N: int

    def __post_init__(self) -> None:
        if self.kind not in ("SU", "U"):
            raise InvalidGroupError(f"unknown group kind {self.kind!r}: use 'SU' or 'U'")
        if not isinstance(self.N, int) or isinstance(self.N, bool):
            raise InvalidGroupError(f"rank N={self.N!r} must be an integer")
        if self.N < 2 and self.kind == "SU":
            raise InvalidGroupError(f"SU({self.N}) is trivial: N must be at least 2 (e.g. SU(2))")
        if self.N < 1:
            raise InvalidGroupError(f"U({self.N}) is not a group: N must be at least 1")
        if self.N > MAX_RANK:
            raise SizeLimitError(f"N={self.N} is too large; knotobs handles N <= {MAX_RANK}")

    def __str__(self) -> str:
        return f"{self.kind}({self.N})"

    def check(self, lam: Sequence[int] | str) -> Partition:
        """Validate a partition as a representation of this group."""
        lam = as_partition(lam)
        if len(lam) > self.N:
            raise InvalidRepresentationError(
                f"partition {list(lam)} has {len(lam)} rows; {self} allows at most {self.N} rows"
            )
        return lam

    def from_dynkin(self, labels: Sequence[int]) -> Partition:
        """Partition of the highest weight with Dynkin labels ``labels`` (length N - 1)."""
        if len(labels) != self.N - 1:
            raise InvalidRepresentationError(
                f"{self} needs {self.N - 1} Dynkin labels, got {len(labels)}: {list(labels)}"
            )
        return from_dynkin(labels)

    def dynkin(self, lam: Sequence[int]) -> tuple[int, ...]:
        """Dynkin labels of ``lam``."""
        return to_dynkin(self.check(lam), self.N)


def SU(N: int) -> Group:
    """The group SU(N).

    >>> SU(3), SU(3).dynkin((2, 1))
    (Group(kind='SU', N=3), (1, 1))"""
    return Group("SU", N)


def U(N: int) -> Group:
    """The group U(N).

    >>> casimir(U(2), (1,)) - casimir(SU(2), (1,))     # the U(1) part |lam|^2/(2N)
    Fraction(1, 4)"""
    return Group("U", N)


_GROUP_RE = re.compile(r"^\s*(SU|U|SL)\s*\(\s*(\d+)\s*(,\s*C\s*)?\)\s*$", re.IGNORECASE)


def parse_group(spec) -> Group:
    """Read ``"SU(N)"``, ``"U(N)"``, ``("A", N - 1)`` or a :class:`Group`.

    >>> parse_group("U(4)"), parse_group(" su ( 2 ) ")
    (Group(kind='U', N=4), Group(kind='SU', N=2))

    ``"SL(N,C)"`` is accepted by :mod:`knotobs.representations.complexified`, not here.
    """
    if isinstance(spec, Group):
        return spec
    if type(spec).__name__ == "SimpleGroup" and getattr(spec, "kind", None) == "SU":
        return Group("SU", spec.N)            # SU(N) of the Cartan engine: the same group
    if isinstance(spec, tuple) and len(spec) == 2 and str(spec[0]).upper() == "A":
        r = spec[1]
        if not isinstance(r, int) or r < 1:
            raise InvalidGroupError(f"{spec!r} is not a valid Cartan type: rank must be >= 1")
        return Group("SU", r + 1)
    m = _GROUP_RE.match(str(spec))
    if not m:
        from knotobs.representations.cartan.group import is_simple_group_name

        if is_simple_group_name(spec):
            raise ParseError(f"{spec!r} is not SU(N) or U(N): this computation is defined for SU(N)/U(N) only"
                             " (SO(N), Spin(N), Sp(2n), G2: knotobs loop/poly; SO(3) also with --level)")
    if not m or m.group(1).upper() == "SL":
        why = "unbalanced brackets" if str(spec).count("(") != str(spec).count(")") else "unknown form"
        raise ParseError(f"cannot read group {spec!r} ({why}): write SU(N), U(N), SO(N), Spin(N), Sp(2n) or G2, e.g. SU(3)")
    return Group(m.group(1).upper(), int(m.group(2)))


# ---------------------------------------------------------------- numbers
def casimir(group: Group, lam: Sequence[int]) -> Fraction:
    """Quadratic Casimir ``C(lam)`` (long roots of length^2 = 2).

    Examples
    --------
    >>> casimir(SU(2), (1,)), casimir(SU(3), (2, 1)), casimir(U(2), (1,))
    (Fraction(3, 4), Fraction(3, 1), Fraction(1, 1))
    """
    lam = group.check(lam)
    n = sum(lam)
    c = Fraction(kappa(lam) + group.N * n, 2)
    if group.kind == "SU":
        c -= Fraction(n * n, 2 * group.N)
    return c


def dimension(group: Group, lam: Sequence[int]) -> int:
    """Dimension by Weyl's formula ``prod_{i<j} (lam_i - lam_j + j - i)/(j - i)``.

    >>> dimension(SU(3), (2, 1)), dimension(SU(4), (3, 2, 1))
    (8, 64)
    """
    lam = group.check(lam)
    N = group.N
    lt = tuple(lam) + (0,) * (N - len(lam))
    num = prod(lt[i] - lt[j] + j - i for i in range(N) for j in range(i + 1, N))
    den = prod(j - i for i in range(N) for j in range(i + 1, N))
    return num // den


@lru_cache(maxsize=100_000)
def _qint_poly(x: int) -> fmpz_poly:
    # [x] * q^((x-1)/2) in the variable q^(1/2): 1 + y^2 + ... + y^(2x-2)
    c = [0] * (2 * x - 1)
    c[::2] = [1] * x
    return fmpz_poly(c)


def quantum_integer(x: int, var: str = "q") -> Laurent:
    """``[x] = (q^(x/2) - q^(-x/2))/(q^(1/2) - q^(-1/2))`` for an integer ``x``.

    >>> quantum_integer(3)
    Laurent('q^-1 + 1 + q')
    >>> quantum_integer(-2)
    Laurent('-q^(-1/2) - q^(1/2)')
    """
    if x == 0:
        return Laurent.zero(var)
    if x < 0:
        return -quantum_integer(-x, var)
    return Laurent(_qint_poly(x), -(x - 1), 2, var)


@lru_cache(maxsize=100_000)
def _qdim_cached(N: int, lam: Partition) -> Laurent:
    lt = tuple(lam) + (0,) * (N - len(lam))
    num = Laurent.one()
    den = Laurent.one()
    for i in range(N):
        for j in range(i + 1, N):
            a = lt[i] - lt[j] + j - i
            if a != j - i:
                num = num * quantum_integer(a)
                den = den * quantum_integer(j - i)
    return num.exact_div(den).canonical()


def quantum_dimension(group: Group, lam: Sequence[int]) -> Laurent:
    """Quantum dimension ``dim_q(lam)`` as a Laurent polynomial in q (Weyl's formula).

    Examples
    --------
    >>> quantum_dimension(SU(2), (2,))
    Laurent('q^-1 + 1 + q')
    >>> quantum_dimension(SU(3), (1,)) == quantum_dimension_hook_content(SU(3), (1,))
    True

    References
    ----------
    H. Weyl (character formula); e.g. V. Chari, A. Pressley, *A Guide to Quantum
    Groups*, CUP (1994), §10.1.
    """
    lam = group.check(lam)
    return _qdim_cached(group.N, lam)


def quantum_dimension_hook_content(group: Group, lam: Sequence[int]) -> Laurent:
    """Quantum dimension by the hook–content formula ``prod_boxes [N + c]/[h]``.

    An independent formula for :func:`quantum_dimension` (Macdonald (1995), ch. I §3, ex. 1).

    >>> quantum_dimension_hook_content(SU(2), (2,))
    Laurent('q^-1 + 1 + q')
    """
    lam = group.check(lam)
    num = Laurent.one()
    for c in contents(lam):
        num = num * quantum_integer(group.N + c)
    den = Laurent.one()
    for h in hooks(lam):
        den = den * quantum_integer(h)
    return num.exact_div(den)


def homfly_unknot(lam: Sequence[int]) -> tuple[Laurent2, Laurent]:
    """Generic-N quantum dimension as ``(numerator in a, s; denominator in s)``.

    ``dim_q(lam) = prod_boxes (a s^c - a^-1 s^-c) / prod_boxes (s^h - s^-h)``, which
    becomes :func:`quantum_dimension` of SU(N) at ``a = q^(N/2)``, ``s = q^(1/2)``.

    >>> num, den = homfly_unknot((1,))
    >>> num.to_string(), den.to_string()
    ('a*(1) + a^-1*(-1)', '-s^-1 + s')
    """
    lam = as_partition(lam)
    return _homfly_unknot(lam)


@lru_cache(maxsize=20_000)
def _homfly_unknot(lam: Partition) -> tuple[Laurent2, Laurent]:
    cs = contents(lam)
    n = len(cs)
    # prod_c (a s^c - a^-1 s^-c) = a^-n s^-sum(c) prod_c (A s^(2c) - 1), A = a^2.  The product is
    # built by the recursion for elementary symmetric functions on a dense (k, s-exponent) array.
    lo = 2 * min(cs, default=0)
    span = sum(2 * c - lo for c in cs) + 1     # largest index reached, plus one
    dtype = np.int64 if n <= 60 else object
    arr = np.zeros((n + 1, span), dtype=dtype)
    arr[0, 0] = 1          # exponents of s stored as (2c - lo) summed over the chosen factors
    for c in cs:
        sh = 2 * c - lo
        new = np.zeros_like(arr)
        new[:, :] = -arr
        new[1:, sh:] += arr[:-1, : span - sh]
        arr = new
    num = {}
    total_c = sum(cs)
    for k in range(n + 1):
        row = arr[k]
        nz = np.nonzero(row)[0]
        if len(nz) == 0:
            continue
        first, last = int(nz[0]), int(nz[-1])
        # term A^k s^(index + k*lo) in the product; times a^-n s^-sum(c)
        f = Laurent.from_dense(row[first:last + 1].tolist(), first + k * lo - total_c, 1, var="s")
        num[2 * k - n] = f
    s = Laurent.gen("s")
    den = Laurent.one("s")
    for h in hooks(lam):
        den = den * (s**h - s**-h)
    return Laurent2(num), den


# ---------------------------------------------------------------- fixed-N decompositions
def _sort_with_sign(vec: Sequence[int]) -> tuple[int, Partition | None]:
    sign, part = _reflect_to_dominant(vec)
    return sign, part


@lru_cache(maxsize=4096)
def _adams_fixed(lam: Partition, m: int, N: int) -> tuple[tuple[Partition, int], ...]:
    acc: dict[Partition, int] = {}
    for wt, mult in weight_multiplicities(lam, N).items():
        sign, part = _sort_with_sign([m * x for x in wt])
        if sign:
            acc[part] = acc.get(part, 0) + sign * mult
    return tuple((p, c) for p, c in sorted(acc.items(), reverse=True) if c)


def adams_fixed(group: Group, lam: Sequence[int], m: int) -> tuple[tuple[Partition, int], ...]:
    """Adams operation ``psi^m`` for a fixed N by the Racah–Speiser / Brauer–Klimyk rule.

    Every weight of ``lam`` is multiplied by ``m``, ``delta = (N-1, ..., 0)`` added, the
    result sorted with the sign of the sorting permutation (repeated entries dropped).

    Examples
    --------
    >>> dict(adams_fixed(SU(2), (1,), 3))
    {(3,): 1, (2, 1): -1}

    References
    ----------
    CONVENTIONS §2; R. C. King, J. Phys. A 8 (1975) 429.
    """
    lam = group.check(lam)
    if m < 1:
        raise InvalidRepresentationError(f"Adams operation psi^{m}: m must be a positive integer")
    return _adams_fixed(lam, m, group.N)


def tensor_fixed(group: Group, parts: Sequence[Sequence[int]]) -> dict[Partition, int]:
    """Decompose ``lam_1 x ... x lam_d`` for U(N) by Brauer–Klimyk on the weights of each factor.

    >>> sorted(tensor_fixed(SU(2), [(1,), (1,)]).items())   # spin 1/2 x 1/2 = 1 + 0 (height-2 column kept)
    [((1, 1), 1), ((2,), 1)]"""
    N = group.N
    acc: dict[Partition, int] = {(): 1}
    for lam in parts:
        lam = group.check(lam)
        wts = weight_multiplicities(lam, N)
        new: dict[Partition, int] = {}
        for nu, c in acc.items():
            base = tuple(nu) + (0,) * (N - len(nu))
            for wt, mult in wts.items():
                sign, part = _sort_with_sign([base[i] + wt[i] for i in range(N)])
                if sign:
                    new[part] = new.get(part, 0) + sign * c * mult
        acc = {k: v for k, v in new.items() if v}
    return acc


def dual(group: Group, lam: Sequence[int]) -> Partition:
    """Conjugate (dual) representation of SU(N): ``(lam_1 - lam_N, ..., lam_1 - lam_2)``.

    For U(N) the dual of a polynomial representation is not polynomial; this returns
    the SU(N) dual, i.e. the dual twisted by ``det^(lam_1)``.

    >>> dual(SU(3), (1,)), dual(SU(3), (2, 1))
    ((1, 1), (2, 1))
    """
    lam = group.check(lam)
    N = group.N
    lt = tuple(lam) + (0,) * (N - len(lam))
    return as_partition([lt[0] - lt[N - 1 - i] for i in range(N)])
