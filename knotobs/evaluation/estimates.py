"""Size and time estimates of the exact torus-knot routes, checked through :func:`knotobs.guard.require`.

Each route estimates, from the input sizes alone and before the expensive step, the
number of weights it enumerates, the number of sparse terms it forms and the length of
the dense coefficient arrays it fills (the output size), and refuses with
:class:`~knotobs.errors.SizeLimitError` only when the estimated time or memory exceeds
the limits in force (CONVENTIONS §16: ``--max-seconds``, ``--max-memory``).  The message
names what the user asked for (the knot, the group, the colour) and the estimate.

The estimates are operation counts times the throughputs of :data:`knotobs.guard.OPS_PER_SECOND`
and 8 bytes per int64 array entry (about 40 bytes per entry once coefficients outgrow 64 bits).
They aim at the order of magnitude.

References
----------
CONVENTIONS §16 (the guard); the counts are elementary (common practice).
"""

from __future__ import annotations

from math import comb, factorial, prod
from typing import Sequence

from knotobs.guard import require, seconds_for
from knotobs.labels import labelled, user_label

__all__ = ["weight_count", "guard_fixed", "guard_dense", "user_label", "labelled"]

def weight_count(lam: Sequence[int], N: int) -> int:
    """Upper bound on the number of weights of the U(N) irrep ``lam`` (compositions of ``|lam|``).

    >>> weight_count((799,), 2), weight_count((1,), 20)
    (800, 20)
    """
    n = sum(lam)
    if lam and all(x == 1 for x in lam):
        return comb(N, n)
    return comb(n + N - 1, N - 1)


def _describe(knot, group, cols) -> str:
    col = [list(c) for c in cols]
    col_s = str(col[0]) if len(set(map(tuple, cols))) == 1 else str(col)
    return f"{knot} for {group} coloured by {col_s}"


def _partitions_at_most(n: int, N: int) -> int:
    """Number of partitions of ``n`` with at most ``N`` parts (a small dynamic programme)."""
    p = [1] + [0] * n
    for part in range(1, N + 1):       # partitions into parts <= N (conjugate count)
        for i in range(part, n + 1):
            p[i] += p[i - part]
    return p[n]


def guard_fixed(knot, group, cols, route: str = "Rosso-Jones") -> None:
    """Refuse a fixed-N evaluation whose weight enumeration alone would exceed the limits.

    Knots: the weights of the colour.  Links: the weights of the tensor product (the
    weight-sum route) or its irreducible pieces, each with its weights (the Rosso–Jones route).

    >>> from knotobs.fibrations.torus import TorusLink
    >>> from knotobs.representations.groups import SU
    >>> guard_fixed(TorusLink(3, 4), SU(2), ((799,),))
    """
    N = group.N
    if len(cols) == 1:
        k = weight_count(cols[0], N)
        simple = len(cols[0]) <= 1 or all(x == 1 for x in cols[0])
        py = 0 if simple else 20 * k
        npy = k * N * N * 10
    else:
        total = sum(sum(c) for c in cols)
        k = comb(total + N - 1, N - 1)
        irreps = min(k, _partitions_at_most(total, N))
        py = 0
        done = 0
        for c in cols:
            # Brauer-Klimyk: every irreducible piece so far against every weight of the next colour
            # (the weight sum multiplies weight tables instead)
            pieces = _partitions_at_most(done, N) if route == "Rosso-Jones" else comb(done + N - 1, N - 1)
            py += 10 * pieces * weight_count(c, N)
            done += sum(c)
        npy = (irreps if route == "Rosso-Jones" else 1) * k * N * 10
    # output span: twists q^(C(mu) n/m) with C(mu) up to about |mu|^2/2, |mu| = m |lam|
    boxes = sum(sum(c) for c in cols)
    length = knot.P * knot.Q * boxes * boxes // 2 + N ** 3
    sec = seconds_for(py, "python") + seconds_for(npy + 6 * length, "numpy")
    mem = (k * N * 8 * 8 + 3 * 8 * length) / 2**20
    require(f"{user_label(_describe(knot, group, cols))} by the {route} route: about {k:.3g} weights"
            f" and {length:.3g} output coefficients",
            seconds=sec, memory_mb=mem, accepted="choose a smaller colour or knot")


def guard_dense(what: str, length: int, sparse_terms: int = 0, passes: int = 4, wide: bool = False) -> None:
    """Refuse dense work on arrays of ``length`` entries (``passes`` sweeps) and ``sparse_terms`` terms.

    ``wide`` means coefficients beyond 64 bits (Python integers in the arrays).

    >>> guard_dense("J_200 of T(3,4)", 10**5)
    """
    per = 40 if wide else 8
    kind = "python" if wide else "numpy"
    sec = seconds_for(passes * length + 3 * sparse_terms, kind)
    mem = (3 * length + 3 * sparse_terms) * per / 2**20
    require(f"{user_label(what)}: output of about {length:.3g} coefficients",
            seconds=sec, memory_mb=mem, accepted="choose a smaller colour or knot")


def partition_count(n: int) -> int:
    """Number of partitions of ``n`` (Euler's recurrence; cached inside symmetric).

    >>> partition_count(35)
    14883
    """
    from knotobs.representations.symmetric import _partition_count

    return _partition_count(n)


def multipartition_count(m: int, n: int) -> int:
    """Number of m-tuples of partitions of total size n: the partitions of ``m n`` with empty m-core.

    >>> multipartition_count(7, 5), multipartition_count(1, 5)
    (1547, 7)
    """
    p = [partition_count(i) for i in range(n + 1)]
    poly = [1] + [0] * n
    for _ in range(m):
        poly = [sum(poly[i - j] * p[j] for j in range(i + 1)) for i in range(n + 1)]
    return poly[n]


def homfly_estimate(m: int, n: int, cols, with_z: bool = True) -> dict:
    """Estimated sizes and seconds of the generic-N (HOMFLY-PT) Rosso–Jones sum of ``T(m, n)``.

    With ``k = m |lam|`` boxes in every ``mu`` of the plethysm: ``k + 1`` powers of ``a``;
    an ``s``-span of about ``2 k^2 (n/m + 1)`` (twists ``s^(kappa n/m)``, ``kappa <= k(k-1)``,
    and the common denominator ``prod_{i<=k} {i}``); ``(a, z)`` coefficients of about ``17 k`` bits
    (413 bits for ``T(25,26)``).  Only partitions with empty m-core carry a plethysm
    coefficient, so the number of terms is at most the number of m-multipartitions of ``|lam|``.

    The steps: the plethysm (character values, pure Python), one product per power of ``a``
    and group of terms, the divisions, and (``with_z``) the change to ``z``, whose cost is
    the empirical ``4.3e-13 rows span k^4`` seconds (fitted on a 2-core machine, whole
    evaluation in ``(a, z)``: ``T(30,31)`` 0.22 s, ``T(40,41)`` 0.88 s, ``T(60,61)`` 7.1 s).

    >>> e = homfly_estimate(25, 26, ((1,),))
    >>> e["terms"], e["rows"]
    (25, 26)
    """
    lam_size = sum(sum(c) for c in cols)
    k = m * lam_size
    hooks_only = all(tuple(c) == (1,) for c in cols) and len(cols) == 1
    terms = m if hooks_only else multipartition_count(m, lam_size)
    rows = k + 1
    span = int(2 * k * k * (n / m + 1)) + 1
    bits = 17 * k + 64
    words = max(1, bits // 64)
    py = 0 if hooks_only else terms * partition_count(lam_size) * 40
    c_ops = (terms * k * k * k                          # quantum-dimension rows
             + terms * rows * k * k * 20                # one product per row and group of terms
             + rows * span * words * 20)                # sums and divisions
    py += rows * span * 2                               # reading coefficients back
    sec = seconds_for(py, "python") + seconds_for(c_ops, "numpy")
    if with_z:
        sec += 4.3e-13 * rows * span * k ** 4 + seconds_for(rows * span * words, "python")
    mem = 6 * rows * span * (8 * words + 32) / 2**20
    return {"terms": terms, "rows": rows, "span": span, "bits": bits, "seconds": sec, "memory_mb": mem}


def guard_homfly(knot, cols, with_z: bool = False) -> None:
    """Refuse a generic-N HOMFLY-PT evaluation of ``knot`` whose estimate exceeds the limits.

    >>> from knotobs.fibrations.torus import TorusLink
    >>> guard_homfly(TorusLink(60, 61), ((1,),), with_z=True)       # about 16 s: accepted
    >>> guard_homfly(TorusLink(150, 151), ((1,),), with_z=True)
    Traceback (most recent call last):
    ...
    knotobs.errors.SizeLimitError: the HOMFLY-PT polynomial of T(150,151) coloured by [1] in (a, z): about 1.4e+07 coefficients of up to ~2614 bits from 150 plethysm terms: estimated 3.36e+03 s, above the limit of 60 s; choose a smaller knot or colour, the (a, q) form (--form aq), or a fixed N (--group 'SU(N)', or the loop command with U(N)) (or raise the limit: --max-seconds, KNOTOBS_MAX_SECONDS)
    """
    m, n = min(knot.P, knot.Q), max(knot.P, knot.Q)
    e = homfly_estimate(m, n, cols, with_z)
    col = [list(c) for c in cols]
    col_s = str(col[0]) if len(set(map(tuple, cols))) == 1 else str(col)
    what = user_label(f"the HOMFLY-PT polynomial of {knot} coloured by {col_s}")
    form = " in (a, z)" if with_z else ""
    require(f"{what}{form}: about {e['rows'] * e['span']:.2g} coefficients of up to ~{e['bits']} bits"
            f" from {e['terms']} plethysm terms",
            seconds=e["seconds"], memory_mb=e["memory_mb"],
            accepted="choose a smaller knot or colour, the (a, q) form (--form aq), or a fixed N"
                     " (--group 'SU(N)', or the loop command with U(N))")
