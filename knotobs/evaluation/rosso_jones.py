"""Torus knots and links by the Rosso–Jones formula (Adams-operation route).

For the torus knot ``T(m, n)`` (``m = min(P, Q)``), zero framing, unnormalised
(the unknot gives ``dim_q``), CONVENTIONS §3:

    W_lam = theta(lam)^(-m n) * sum_mu c_{lam,mu}^(m) theta(mu)^(n/m) dim_q(mu)

with ``psi^m(lam) = sum_mu c_{lam,mu}^(m) mu`` the Adams operation.  A torus
link ``T(dP, dQ)`` whose components carry ``lam_1..lam_d`` first decomposes
``lam_1 x ... x lam_d = sum_nu N^nu nu`` and applies the same sum to each
``nu``; each component's torus framing ``P Q`` is removed by
``theta(lam_i)^(-P Q)``.  The mirror image is ``q -> q^-1``.

References
----------
M. Rosso, V. F. R. Jones, J. Knot Theory Ramifications 2 (1993) 97–112;
X.-S. Lin, H. Zheng, Trans. Amer. Math. Soc. 362 (2010) 1–18;
S. Stevan, Ann. Henri Poincaré 11 (2010) 1201–1224.
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache
from itertools import permutations
from math import factorial, gcd
from typing import Sequence

import numpy as np
from flint import fmpz_poly

from knotobs.errors import InvalidKnotError, InvalidRepresentationError
from knotobs.evaluation.estimates import guard_dense, guard_fixed, guard_homfly, user_label
from knotobs.guard import require, seconds_for
from knotobs.evaluation.framing import FramingSpec, resolve_framing
from knotobs.fibrations.torus import TorusLink
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.dense import Dense, place
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.groups import (
    Group,
    casimir,
    homfly_unknot,
    tensor_fixed,
)
from knotobs.representations.qdim_factors import binomial_product, content_rows, qdim_dense
from knotobs.representations.weight_arrays import adams_array, merge_rows
from knotobs.representations.partitions import Partition, as_partition, contents, hooks, kappa
from knotobs.representations.symmetric import adams_generic, tensor_generic

__all__ = ["rosso_jones", "rosso_jones_dense", "rosso_jones_homfly", "colours_for"]


def colours_for(knot: TorusLink, colours) -> tuple[Partition, ...]:
    """One partition per component (a single partition colours every component)."""
    d = knot.components
    if not isinstance(colours, str):
        try:
            colours = tuple(colours)
        except TypeError:
            raise InvalidRepresentationError(
                f"colour {colours!r} is not a partition: give one partition such as [2,1], or one per component"
            ) from None
    if isinstance(colours, str) or (colours and isinstance(colours[0], int)) or colours == ():
        return (as_partition(colours),) * d
    cols = tuple(as_partition(c) for c in colours)
    if len(cols) != d:
        raise InvalidKnotError(
            f"{knot} has {d} component(s) but {len(cols)} colours were given: give one partition"
            " for all components or one per component"
        )
    return cols


def _decomposition_arrays(group: Group, decomposition: dict, m: int) -> tuple[np.ndarray, np.ndarray]:
    """All ``(mu, c)`` of ``sum_nu N^nu psi^m(nu)`` as arrays, equal ``mu`` merged (reuse across ``nu``)."""
    rows, cs = [], []
    for nu, mult in decomposition.items():
        mus, c = adams_array(tuple(nu), m, group.N)
        rows.append(mus)
        # multiplicities of large tensor powers exceed 64 bits (T(100,200): 100 components)
        cmax = int(np.abs(c).max(initial=1))
        cs.append(c * mult if abs(mult) * cmax < 1 << 40 else c.astype(object) * mult)
    mus, c = np.vstack(rows), np.concatenate(cs)
    if len(rows) > 1:
        mus, c = merge_rows(mus, c)
    return mus, c


def _twice_n_casimir(group: Group, mus: np.ndarray) -> np.ndarray:
    """``2 N C(mu)`` for each row (an integer; CONVENTIONS §2)."""
    N = group.N
    idx = np.arange(N, dtype=np.int64)
    kap = (mus * (mus - 2 * idx - 1)).sum(axis=1)
    size = mus.sum(axis=1)
    out = N * kap + N * N * size
    if group.kind == "SU":
        out = out - size * size
    return out


@lru_cache(maxsize=64)
def _weyl_table(N: int) -> tuple[np.ndarray, np.ndarray]:
    """Rows ``r_w`` and signs with ``sum_w eps(w) s^(r_w . l) = prod_{i<j} {l_i - l_j}`` (Vandermonde)."""
    perms = list(permutations(range(N)))
    R = np.zeros((len(perms), N), dtype=np.int64)
    sign = np.ones(len(perms), dtype=np.int64)
    for k, w in enumerate(perms):
        for i, wi in enumerate(w):
            R[k, wi] = N - 1 - 2 * i
        inv = sum(1 for i in range(N) for j in range(i + 1, N) if w[i] > w[j])
        sign[k] = -1 if inv % 2 else 1
    return R, sign


def _weyl_sparse_cost(N: int, k: int) -> float:
    return float("inf") if N > 7 else float(factorial(N) * k)


def _sum_fixed(group: Group, mus: np.ndarray, c: np.ndarray, m: int, n: int) -> list[tuple[Dense, Fraction]]:
    """``sum_mu c_mu theta(mu)^(n/m) dim_q(mu)`` as dense pieces ``(piece, offset)`` (piece * q^offset).

    Exponents are integers in ``y = q^(1/(2 N m))``; the twist of ``mu`` is ``y^(2 N C(mu) n)``.
    Terms are grouped by their class modulo ``s = q^(1/2) = y^(N m)`` and each class is summed
    densely in ``s``.  ``dim_q`` enters either through the Weyl numerator expanded over the
    permutations (sparse: ``N!`` terms per ``mu``, then one division by the Weyl denominator
    ``prod_{i<j} {j - i}`` as strided prefix sums) or, for large N, through
    :func:`~knotobs.representations.qdim_factors.qdim_dense` per ``mu``.
    """
    N = group.N
    Nm = N * m
    e_tw = _twice_n_casimir(group, mus) * n
    cls = np.mod(e_tw, Nm)
    base = np.floor_divide(e_tw, Nm)
    out = []
    k = len(mus)
    delta = np.arange(N - 1, -1, -1, dtype=np.int64)
    sparse = _weyl_sparse_cost(N, k) <= 4e6
    if not sparse:
        # one quantum dimension per irreducible piece, |Delta+| q-number divisions each (about 40 us,
        # measured: SU(9) [4,4,4,4] on T(5,4), 1.8e4 pieces, 10 s).  The count of pieces is known
        # only now (the Adams image is cheap); checked before the costly part
        require(f"{user_label(f'{group} Rosso-Jones sum')}: quantum dimensions of {k} irreducible pieces",
                seconds=seconds_for(k * (N * (N - 1) // 2) * 80, "python"), memory_mb=k * N * 8 / 2**20,
                accepted="choose a smaller colour or knot")
    for r in sorted(set(cls.ravel().tolist())):  # not np.unique: it imports numpy.ma
        sel = cls == r
        if sparse:
            R, sign = _weyl_table(N)
            ex = base[sel][:, None] + (mus[sel] + delta) @ R.T
            co = c[sel][:, None] * sign[None, :]
            guard_dense(user_label(f"{group} Rosso-Jones sum"), int(ex.max() - ex.min()) + 1, ex.size)
            d = Dense.from_half_terms(ex, co)
            for dd in range(1, N):
                for _ in range(N - dd):
                    d = d.div_curly(dd)
        else:
            span = int(base[sel].max() - base[sel].min()) + 2 * N * int(mus[sel].sum(axis=1).max()) + N ** 3
            guard_dense(user_label(f"{group} Rosso-Jones sum"), span, 0, passes=2 * int(mus[sel].sum(axis=1).max()))
            d = Dense(np.zeros(0, dtype=np.int64), 0, 2)
            for mu, cc, b in zip(mus[sel].tolist(), c[sel].tolist(), base[sel].tolist()):
                piece = qdim_dense(mu, N, 2).times_monomial(Fraction(b, 2), int(cc))
                d = d.add(piece)
        out.append((d, Fraction(r, 2 * Nm)))
    return out


def _shifted(pieces, offset: Fraction, mirror: bool = False):
    if mirror:
        return [(d.mirror(), -off + offset) for d, off in pieces]
    return [(d, off + offset) for d, off in pieces]


def rosso_jones_dense(knot: TorusLink, group: Group, colours, framing: FramingSpec = 0) -> Dense:
    """:func:`rosso_jones` as a :class:`~knotobs.polynomials.dense.Dense` (no conversion to FLINT).

    >>> from knotobs.representations.groups import SU
    >>> rosso_jones_dense(TorusLink(2, 3), SU(2), (1,)).to_laurent()
    Laurent('-q^(-9/2) + q^(-5/2) + q^(-3/2) + q^(-1/2)')
    """
    cols = colours_for(knot, colours)
    cols = tuple(group.check(c) for c in cols)
    frames = resolve_framing(knot, framing)
    m, n = min(knot.P, knot.Q), max(knot.P, knot.Q)
    guard_fixed(knot, group, cols)
    if len(cols) == 1:
        decomposition = {cols[0]: 1}
    else:
        decomposition = tensor_fixed(group, cols)
    mus, c = _decomposition_arrays(group, decomposition, m)
    pieces = _sum_fixed(group, mus, c, m, n)
    shift = Fraction(0)
    for lam in cols:
        shift -= casimir(group, lam) * m * n
    pieces = _shifted(pieces, shift)
    if knot.chirality < 0:
        pieces = _shifted(pieces, Fraction(0), mirror=True)
    extra = sum((f * casimir(group, lam) for f, lam in zip(frames, cols)), Fraction(0))
    return place(_shifted(pieces, extra))


def rosso_jones(knot: TorusLink, group: Group, colours, framing: FramingSpec = 0) -> Laurent:
    """Unnormalised Wilson loop of ``T(p, q)`` for SU(N) or U(N), exact in ``q``.

    Parameters
    ----------
    knot : TorusLink
    group : Group
        ``SU(N)`` or ``U(N)`` (the Casimir, hence the twist, differs).
    colours : partition or sequence of partitions
        One partition for every component, or one per component.
    framing : int, sequence of int or ``"zero"``/``"fiber"``
        Framing of each component relative to its Seifert framing.

    Returns
    -------
    Laurent
        Polynomial in ``q`` (exponents in ``(1/D) Z``); the unknot gives ``dim_q(lam)``.

    Notes
    -----
    The sum runs on integer arrays: the Adams operation by vectorised Racah–Speiser
    (:func:`~knotobs.representations.weight_arrays.adams_array`), the twists as integer
    exponents, ``dim_q`` through the Weyl numerator or its factor form, divisions by
    ``q^(d/2) - q^(-d/2)`` as strided prefix sums (:mod:`knotobs.polynomials.dense`).

    Examples
    --------
    >>> from knotobs.representations.groups import SU, quantum_integer
    >>> w = rosso_jones(TorusLink(2, 3), SU(2), (1,))
    >>> w.exact_div(quantum_integer(2))          # Jones V(t) of T(2,3) at t = 1/q
    Laurent('-q^-4 + q^-3 + q^-1')

    References
    ----------
    Rosso–Jones (1993); Lin–Zheng (2010); Stevan (2010); CONVENTIONS §3.
    """
    return rosso_jones_dense(knot, group, colours, framing).to_laurent()


def rosso_jones_homfly(knot: TorusLink, colours, framing: FramingSpec = 0) -> tuple[Laurent2, Laurent]:
    """Generic-N (U(N)) Wilson loop as ``(numerator(a, s), denominator(s))``.

    The unnormalised invariant is the ratio (the unknot alone is not a Laurent
    polynomial); :func:`knotobs.evaluation.families.homfly` divides by the unknot.

    Examples
    --------
    >>> from fractions import Fraction
    >>> from knotobs.representations.groups import U
    >>> num, D = rosso_jones_homfly(TorusLink(2, 3), (1,))
    >>> at3 = num.specialize(Fraction(3, 2)).exact_div(D.subs_power(Fraction(1, 2)).rename("q"))
    >>> at3 == rosso_jones(TorusLink(2, 3), U(3), (1,))
    True

    The twist is ``theta(mu) = s^kappa(mu) a^|mu|`` (U(N) Casimir, ``a = q^(N/2)``,
    ``s = q^(1/2)``) and the quantum dimensions are the hook–content forms of
    :func:`~knotobs.representations.groups.homfly_unknot`; all terms are put over the
    common denominator ``prod_{i <= |mu|} (s^i - s^-i)``.  Specialising ``a = q^(N/2)``
    gives :func:`rosso_jones` for U(N).

    References
    ----------
    Rosso–Jones (1993); Lin–Zheng (2010); CONVENTIONS §2–§3.
    """
    cols = colours_for(knot, colours)
    frames = resolve_framing(knot, framing)
    m, n = min(knot.P, knot.Q), max(knot.P, knot.Q)
    guard_homfly(knot, cols)
    decomposition = {cols[0]: 1} if len(cols) == 1 else tensor_generic(cols)
    size = m * sum(sum(c) for c in cols)
    D = _curly_factorial(size)
    terms: dict = {}
    for nu, mult in decomposition.items():
        for mu, c in adams_generic(tuple(nu), m):
            terms[mu] = terms.get(mu, 0) + c * mult
    a_exp = n * sum(sum(c) for c in cols)       # theta(mu)^(n/m) = s^(kappa n/m) a^(n |nu|)
    ratio = Fraction(n, m)
    # Terms whose partitions have the same hook lengths (conjugates, at least) share the
    # cofactor D / prod_h {h}: their rows are added on integer arrays first and multiplied
    # by the cofactor once.
    groups: dict = {}
    for mu, c in terms.items():
        if c:
            groups.setdefault(tuple(sorted(hooks(mu))), []).append((mu, c))
    acc: dict = {}         # (row j, parity and fraction of the s-shift) -> [(shift in w = s^2, poly in w)]
    for hk, members in groups.items():
        cof, cof_lo = _cofactor(hk, size)
        parts: dict = {}
        for mu, c in members:
            rows, row_lo = _signed_rows(tuple(contents(mu)))      # conjugates share one recursion
            twist = ratio * kappa(mu)
            base = twist.numerator // twist.denominator
            frac = twist - base
            for j, (seg, lo) in enumerate(zip(rows, row_lo)):
                if seg is None:
                    continue
                e = base + lo + cof_lo                             # s-exponent of the first term
                parts.setdefault((j, e % 2, frac), []).append((e // 2, seg, c))
        for key, items in parts.items():
            if len(items) == 1:
                w0, seg, c = items[0]
                row = seg * c if c != 1 else seg
            else:
                w0 = min(t[0] for t in items)
                w1 = max(t[0] + len(t[1]) for t in items)
                wide = any(t[1].dtype == object for t in items) or \
                    sum(abs(t[2]) * int(np.abs(t[1]).max()) for t in items) >= (1 << 62)
                row = np.zeros(w1 - w0, dtype=object if wide else np.int64)
                if wide:
                    row[:] = 0
                for w, seg, c in items:
                    row[w - w0 : w - w0 + len(seg)] += seg * c
            acc.setdefault(key, []).append((w0, fmpz_poly(row.tolist()) * cof))
    out: dict[int, Laurent] = {}
    for (j, par, frac), items in acc.items():
        lo, total = _tree_sum(items)
        if total.is_zero():
            continue
        term = Laurent(total, lo, 1, "s").subs_power(2).times_monomial(frac + par)
        i = a_exp - size + 2 * j
        out[i] = out[i] + term if i in out else term
    total = Laurent2(out)
    s_shift = Fraction(0)
    a_shift = 0
    for lam, f in zip(cols, frames):
        s_shift += (f - m * n) * kappa(lam)
        a_shift += (f - m * n) * sum(lam)
    total = total.times_monomial(a_shift, s_shift)
    if knot.chirality < 0:
        # the value is total / D; mirroring s -> 1/s also sends D to (-1)^size D
        total = total.mirror()
        if size % 2:
            total = -total
    return total, D


def _tree_sum(items: list) -> tuple[int, fmpz_poly]:
    """``sum x^shift p`` over ``(shift, p)`` by pairwise merging in shift order (no quadratic copying)."""
    items = sorted(items, key=lambda t: t[0])
    while len(items) > 1:
        merged = []
        for i in range(0, len(items) - 1, 2):
            (sa, pa), (sb, pb) = items[i], items[i + 1]
            merged.append((sa, pa + pb.left_shift(sb - sa)))
        if len(items) % 2:
            merged.append(items[-1])
        items = merged
    return items[0] if items else (0, fmpz_poly())


@lru_cache(maxsize=64)
def _curly_factorial(k: int) -> Laurent:
    """``prod_{i <= k} (s^i - s^-i)``."""
    # {2i} in the variable s is s^i - s^-i
    return binomial_product([2 * i for i in range(1, k + 1)], den=1, var="s").to_laurent()


@lru_cache(maxsize=4096)
def _cofactor(hook_list: tuple[int, ...], k: int) -> tuple[fmpz_poly, int]:
    """``prod_{i <= k} {i} / prod_h {h}`` (``{i} = s^i - s^-i``; a polynomial, the q-analogue of
    ``k!/prod h``) as a FLINT polynomial in ``w = s^2`` and the ``s``-exponent of its first term.

    ``{i} = s^-i (w^i - 1)``: after cancelling equal factors the numerator binomials are
    multiplied out and the denominator's product is divided out exactly, in FLINT.
    """
    from collections import Counter

    num, den = Counter(range(1, k + 1)), Counter(hook_list)
    common = num & den
    nums, dens = sorted((num - common).elements()), sorted((den - common).elements())
    top = _binomial_prod(tuple(nums))
    bottom = _binomial_prod(tuple(dens))
    quo = top if not dens else top / bottom     # exact: the quotient is a polynomial
    # s-exponent: -(sum of num) + (sum of den), and w = s^2 shifts by 2 per step
    return quo, -sum(nums) + sum(dens)


def _binomial_prod(exps: tuple[int, ...]) -> fmpz_poly:
    """``prod_i (w^i - 1)``, multiplied pairwise (balanced) in FLINT."""
    polys = [fmpz_poly([-1] + [0] * (e - 1) + [1]) for e in exps]
    if not polys:
        return fmpz_poly([1])
    while len(polys) > 1:
        polys = [polys[i] * polys[i + 1] for i in range(0, len(polys) - 1, 2)] + (
            [polys[-1]] if len(polys) % 2 else [])
    return polys[0]


@lru_cache(maxsize=4096)
def _signed_rows(cs: tuple[int, ...]) -> tuple[tuple, tuple]:
    """Rows ``j`` of ``prod_c (a s^c - a^-1 s^-c) = sum_j a^(2j - k) f_j(s)``: integer arrays in ``w = s^2``
    with the ``s``-exponent of their first entry.

    Conjugate partitions have negated contents: their rows are the reversed rows of the
    other (one recursion for both; see :func:`~knotobs.representations.qdim_factors.content_rows`).
    """
    key = tuple(sorted(cs))
    neg = tuple(sorted(-c for c in cs))
    k = len(cs)
    flip = neg < key
    E, lo = content_rows(neg if flip else key)
    total_c = sum(cs)
    polys, los = [], []
    for j in range(k + 1):
        row = E[j]
        nz = np.flatnonzero(row)
        if nz.size == 0:
            polys.append(None)
            los.append(0)
            continue
        first, last = int(nz[0]), int(nz[-1])
        seg = row[first:last + 1:2]         # exponents 2c - lo are even: the row lives in w = s^2
        sign = -1 if (k - j) % 2 else 1
        # exponents j*lo + t of e_j over the (possibly negated) contents, times s^(-sum c)
        if flip:
            seg = seg[::-1]
            low = -(j * lo + last)
        else:
            low = j * lo + first
        polys.append(seg * sign)
        los.append(low - total_c)
    return tuple(polys), tuple(los)
