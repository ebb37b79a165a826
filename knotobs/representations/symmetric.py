"""Symmetric-function data valid for every N: characters, plethysm by p_m, Littlewood–Richardson.

* Characters of the symmetric group by the Murnaghan–Nakayama rule, in the
  beta-number (abacus) form: removing a rim hook of length ``r`` moves one bead
  from position ``b`` to the empty position ``b - r``; the sign is
  ``(-1)^(beads jumped over)``.
* Adams operation ``psi^m`` for generic N: ``s_lam[p_m] = sum_mu c_{lam,mu} s_mu``
  with ``c_{lam,mu} = sum_{rho |- |lam|} chi^lam(rho) chi^mu(m rho) / z_rho``
  (expand ``s_lam`` in power sums, apply ``p_k -> p_{m k}``, expand back).
  No tableaux of U(N) are enumerated, so the cost is independent of N.
* Littlewood–Richardson coefficients by the Brauer–Klimyk rule on the weights
  of the smaller factor, with as many variables as the product can have rows
  (which makes the result independent of N).

References
----------
I. G. Macdonald, *Symmetric Functions and Hall Polynomials*, 2nd ed., Oxford
University Press (1995), ch. I §7 (characters), ch. I §8 ex. 1 (plethysm by p_m).
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache
from math import factorial
from typing import Sequence

from knotobs.guard import require, seconds_for
from knotobs.labels import user_label
from knotobs.representations.partitions import Partition, partitions_of

__all__ = ["mn_character", "z_rho", "adams_generic", "littlewood_richardson", "tensor_generic",
           "empty_core_partitions"]

#: Kept for backward compatibility only: the plethysm runs over the partitions with empty
#: m-core and its cost is checked by :func:`knotobs.guard.require`, not by a fixed count.
MAX_PLETHYSM_PARTITIONS = None


@lru_cache(maxsize=None)
def _partition_count(n: int) -> int:
    """Number of partitions of ``n`` (Euler's pentagonal recurrence)."""
    p = [1] + [0] * n
    for i in range(1, n + 1):
        k, total = 1, 0
        while True:
            g1 = k * (3 * k - 1) // 2
            if g1 > i:
                break
            sign = 1 if k % 2 else -1
            total += sign * p[i - g1]
            g2 = k * (3 * k + 1) // 2
            if g2 <= i:
                total += sign * p[i - g2]
            k += 1
        p[i] = total
    return p[n]


def _beta(lam: Sequence[int], length: int) -> tuple[int, ...]:
    lam = tuple(lam) + (0,) * (length - len(lam))
    return tuple(lam[i] + length - 1 - i for i in range(length))


def _from_beta(beta: Sequence[int]) -> Partition:
    b = sorted(beta, reverse=True)
    L = len(b)
    return tuple(x for x in (b[i] - (L - 1 - i) for i in range(L)) if x > 0)


@lru_cache(maxsize=200_000)
def _mn(beta: frozenset, rho: tuple[int, ...]) -> int:
    if not rho:
        return 1
    r = rho[0]
    rest = rho[1:]
    total = 0
    for b in beta:
        t = b - r
        if t < 0 or t in beta:
            continue
        between = sum(1 for x in beta if t < x < b)
        sign = -1 if between % 2 else 1
        total += sign * _mn((beta - {b}) | {t}, rest)
    return total


def mn_character(lam: Sequence[int], rho: Sequence[int]) -> int:
    """Character ``chi^lam(rho)`` of the symmetric group (Murnaghan–Nakayama).

    Examples
    --------
    >>> mn_character((2, 1), (1, 1, 1)), mn_character((2, 1), (3,)), mn_character((2, 1), (2, 1))
    (2, -1, 0)

    References
    ----------
    Macdonald (1995), ch. I §7, example 5.
    """
    n = sum(lam)
    if sum(rho) != n:
        raise ValueError("lam and rho must have the same size")
    L = len(lam)
    # larger parts first keeps the recursion shallow
    return _mn(frozenset(_beta(lam, L)), tuple(sorted(rho, reverse=True)))


def z_rho(rho: Sequence[int]) -> int:
    """``z_rho = prod_i i^(m_i) m_i!`` (size of the centraliser of a permutation of type rho)."""
    out = 1
    for part in set(rho):
        mult = sum(1 for x in rho if x == part)
        out *= part**mult * factorial(mult)
    return out


@lru_cache(maxsize=4096)
def adams_generic(lam: Partition, m: int) -> tuple[tuple[Partition, int], ...]:
    """Adams operation ``psi^m`` on ``s_lam`` for generic N.

    Returns the pairs ``(mu, c_{lam,mu})`` with ``c != 0``, ``|mu| = m |lam|``.

    Examples
    --------
    >>> dict(adams_generic((1,), 2))
    {(2,): 1, (1, 1): -1}
    >>> dict(adams_generic((1,), 3))
    {(3,): 1, (2, 1): -1, (1, 1, 1): 1}

    References
    ----------
    Macdonald (1995), ch. I §8, example 1; for the use in knot theory,
    M. Rosso, V. F. R. Jones, J. Knot Theory Ramifications 2 (1993) 97.
    """
    lam = tuple(lam)
    n = sum(lam)
    if m == 1:
        return ((lam, 1),)
    if n == 0:
        return (((), 1),)
    if lam == (1,):
        # p_m = sum_r (-1)^r s_(m-r, 1^r)  (Macdonald (1995), ch. I §3, ex. 11)
        return tuple((tuple([m - r] + [1] * r), (-1) ** r) for r in range(m))
    # Only mu with empty m-core can occur: chi^mu vanishes on classes whose cycles all have
    # length divisible by m unless mu is built from m-rim hooks (James–Kerber (1981) 2.7.32).
    # They are enumerated from their m-quotients on the m-runner abacus.
    candidates = empty_core_partitions(m, n)
    count = len(candidates)
    rhos = partitions_of(n)
    require(f"{user_label(f'the Adams operation psi^{m} of {list(lam)}')}: {count} partitions of {m * n}"
            f" with empty {m}-core, {len(rhos)} classes",
            seconds=seconds_for(count * len(rhos) * 40, "python"),
            memory_mb=count * (m * n) * 80 / 2**20,
            accepted="choose a smaller colour or knot, or a fixed N (the U(N) Wilson loop)")
    weights = [(rho, Fraction(mn_character(lam, rho), z_rho(rho))) for rho in rhos]
    weights = [(rho, w) for rho, w in weights if w != 0]
    scaled = [(tuple(sorted((m * r for r in rho), reverse=True)), w) for rho, w in weights]
    out = []
    for mu in candidates:
        beta = frozenset(_beta(mu, len(mu)))
        c = Fraction(0)
        for mrho, w in scaled:
            c += w * _mn(beta, mrho)
        if c != 0:
            if c.denominator != 1:  # pragma: no cover - would be a bug in the character table
                raise ArithmeticError(f"non-integral plethysm coefficient {c} for {lam}, {mu}")
            out.append((mu, int(c)))
    out.sort(key=lambda t: t[0], reverse=True)
    return tuple(out)


def _multipartitions(m: int, n: int):
    """All m-tuples of partitions with total size n."""
    if m == 0:
        if n == 0:
            yield ()
        return
    for k in range(n, -1, -1):
        for first in partitions_of(k):
            for rest in _multipartitions(m - 1, n - k):
                yield (first,) + rest


@lru_cache(maxsize=256)
def empty_core_partitions(m: int, n: int) -> tuple[Partition, ...]:
    """Partitions of ``m n`` with empty ``m``-core (one for each m-quotient of total size n).

    On the abacus with ``m t`` beads (``t`` at least the longest quotient part count), runner
    ``i`` carries the beads ``m (nu^(i)_j + t - 1 - j) + i``; the empty core is the case of
    ``t`` beads on every runner.  The count is the number of m-multipartitions of n.

    >>> empty_core_partitions(2, 2)
    ((4,), (3, 1), (2, 2), (2, 1, 1), (1, 1, 1, 1))
    >>> len(empty_core_partitions(7, 5))      # 7-multipartitions of 5: [x^5] (prod 1/(1-x^i))^7
    1547

    References
    ----------
    G. James, A. Kerber, *The Representation Theory of the Symmetric Group* (1981), §2.7;
    Macdonald (1995), ch. I §1 ex. 8.
    """
    if m == 1:
        return partitions_of(n)
    t = n
    out = set()
    for quot in _multipartitions(m, n):
        beads = []
        for i, nu in enumerate(quot):
            nu = tuple(nu) + (0,) * (t - len(nu))
            beads.extend(m * (nu[j] + t - 1 - j) + i for j in range(t))
        out.add(_from_beta(beads))
    return tuple(sorted(out, reverse=True))


def _kostka_weights(mu: Partition, nvars: int):
    from knotobs.representations.weights import weight_multiplicities

    return weight_multiplicities(mu, nvars)


def _reflect_to_dominant(vec: Sequence[int]) -> tuple[int, Partition | None]:
    """Sort ``vec + delta`` (delta = (L-1,...,0)) with sign; ``(0, None)`` on a repeat."""
    L = len(vec)
    shifted = [vec[i] + L - 1 - i for i in range(L)]
    if len(set(shifted)) < L or min(shifted) < 0:
        return 0, None
    # sign of the sorting permutation = parity of inversions
    inv = 0
    for i in range(L):
        for j in range(i + 1, L):
            if shifted[i] < shifted[j]:
                inv += 1
    srt = sorted(shifted, reverse=True)
    part = tuple(x for x in (srt[i] - (L - 1 - i) for i in range(L)) if x > 0)
    return (-1 if inv % 2 else 1), part


@lru_cache(maxsize=4096)
def littlewood_richardson(lam: Partition, mu: Partition) -> tuple[tuple[Partition, int], ...]:
    """``s_lam s_mu = sum_nu c^nu_{lam mu} s_nu`` for generic N (Brauer–Klimyk).

    Examples
    --------
    >>> dict(littlewood_richardson((1,), (1,)))
    {(2,): 1, (1, 1): 1}
    >>> dict(littlewood_richardson((2, 1), (2, 1)))[(3, 2, 1)]
    2

    References
    ----------
    R. C. King, J. Phys. A 8 (1975) 429 (Brauer–Klimyk / Racah–Speiser for tensor products);
    Macdonald (1995), ch. I §9.
    """
    lam, mu = tuple(lam), tuple(mu)
    if sum(lam) < sum(mu):
        lam, mu = mu, lam
    L = len(lam) + len(mu)
    if L == 0:
        return (((), 1),)
    base = tuple(lam) + (0,) * (L - len(lam))
    acc: dict[Partition, int] = {}
    for wt, mult in _kostka_weights(mu, L).items():
        vec = [base[i] + wt[i] for i in range(L)]
        sign, part = _reflect_to_dominant(vec)
        if sign:
            acc[part] = acc.get(part, 0) + sign * mult
    return tuple((p, c) for p, c in sorted(acc.items(), reverse=True) if c)


def tensor_generic(parts: Sequence[Partition]) -> dict[Partition, int]:
    """Decompose ``s_{lam_1} ... s_{lam_d}`` into Schur functions (generic N).

    >>> tensor_generic([(1,), (1,), (1,)])
    {(3,): 1, (2, 1): 2, (1, 1, 1): 1}"""
    acc: dict[Partition, int] = {(): 1}
    for lam in parts:
        new: dict[Partition, int] = {}
        for nu, c in acc.items():
            for rho, d in littlewood_richardson(tuple(nu), tuple(lam)):
                new[rho] = new.get(rho, 0) + c * d
        acc = {k: v for k, v in new.items() if v}
    return acc
