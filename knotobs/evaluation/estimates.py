"""Size and time estimates of the exact torus-knot routes, checked through :func:`knotobs.guard.require`.

Each route estimates, from the input sizes alone and before the expensive step, the
number of weights it enumerates, the number of sparse terms it forms and the length of
the dense coefficient arrays it fills (the output size), and refuses with
:class:`~knotobs.errors.SizeLimitError` only when the estimated time or memory exceeds
the limits in force (CONVENTIONS §16: ``--max-seconds``, ``--max-memory``).  The message
names what the user asked for (the knot, the group, the colour) and the estimate.

The estimates are operation counts times the throughputs of :data:`knotobs.guard.OPS_PER_SECOND`
and 8 bytes per int64 array entry (about 40 bytes per entry once coefficients outgrow 64 bits).
They aim at the order of magnitude.  A polynomial that is computed is also printed (text or
JSON), which for millions of terms costs far more than computing it: the fixed-N estimate
counts that too (:data:`FORMAT_SECONDS_PER_TERM`), and :func:`guard_format` checks the exact
number of terms once more before the text is built.

References
----------
CONVENTIONS §16 (the guard); the counts are elementary (common practice).
"""

from __future__ import annotations

from math import comb, factorial, prod
from typing import Sequence

from knotobs.guard import require, seconds_for
from knotobs.labels import labelled, user_label

__all__ = ["weight_count", "guard_fixed", "fixed_estimate", "polynomial_estimate", "guard_dense", "guard_format", "format_seconds",
           "printed_terms", "FORMAT_SECONDS_PER_TERM", "FORMAT_BYTES_PER_TERM",
           "user_label", "labelled"]

#: Seconds to print one term of an exact one-variable polynomial (the text form, plus the
#: JSON form built from it), measured on a 2-core machine at about 10^7 terms, where the cost
#: per term is highest: ``knotobs loop 'T(3,4)' -c 2800 --json`` (1.2e7 terms) 33.5 s,
#: ``knotobs loop 'T(2,3)' -g 'SU(3)' -r [2500]`` (9.4e6 terms) 29.4 s, computing included.
FORMAT_SECONDS_PER_TERM = 3.0e-6
#: Peak bytes per printed term (the list of monomials, the text and its JSON copy): the two runs
#: above peaked at 3.2 GB and 2.65 GB.
FORMAT_BYTES_PER_TERM = 280


def format_seconds(terms: float) -> float:
    """Estimated seconds to print ``terms`` terms of an exact polynomial (text or JSON).

    >>> format_seconds(10**7)
    30.0
    """
    return FORMAT_SECONDS_PER_TERM * float(terms)


def printed_terms(value, exact_below: int = 200_000, samples: int = 20_000) -> int:
    """Number of nonzero terms of the one-variable polynomial ``value``, counted cheaply.

    Counting the terms of a polynomial of 5e7 coefficients one by one takes longer (14 s)
    than computing it; beyond ``exact_below`` coefficients the count is the fraction of
    nonzero coefficients among ``samples`` positions drawn at random (a fixed seed, so the
    answer is reproducible) times the length, rounded up with a margin of 2 %.

    >>> from knotobs.polynomials.laurent import Laurent
    >>> printed_terms(Laurent.from_terms({-2: 1, 1: 3, 5: 1}))
    3
    """
    raw = getattr(value, "_p", None)
    if raw is None or not hasattr(raw, "degree") or raw.degree() + 1 <= exact_below:
        return value.num_terms()
    if raw.degree() > 64:
        raw, _ = raw.deflation()          # skip the zeros between the exponents that occur
    length = raw.degree() + 1
    if length <= exact_below:
        return sum(1 for a in raw.coeffs() if a)
    import random

    rng = random.Random(20240601)
    hits = sum(1 for _ in range(samples) if raw[rng.randrange(length)] != 0)
    return min(length, int(length * min(1.0, 1.02 * hits / samples + 1e-3)) + 1)


def guard_format(what: str, terms: int) -> None:
    """Refuse to print (as text or JSON) a polynomial of ``terms`` terms beyond the limits.

    Called with the exact number of terms, after the polynomial is computed and before its
    text is built (:meth:`~knotobs.evaluation.result.PolynomialResult.exact_string`).

    >>> guard_format("J_20 of T(3,4)", 600)
    >>> from knotobs.guard import limits
    >>> with limits(seconds=10):
    ...     guard_format("J_3000 of T(3,4)", 13_500_000)
    Traceback (most recent call last):
    ...
    knotobs.errors.SizeLimitError: printing J_3000 of T(3,4): 1.35e+07 terms: estimated 40.5 s, above the limit of 10 s; choose a smaller colour or knot, or compute it through the library without printing it (or raise the limit: --max-seconds, KNOTOBS_MAX_SECONDS)
    """
    require(f"printing {what}: {terms:.3g} terms", seconds=format_seconds(terms),
            memory_mb=FORMAT_BYTES_PER_TERM * float(terms) / 2**20,
            accepted="choose a smaller colour or knot, or compute it through the library without printing it")

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
    """Refuse a fixed-N evaluation whose estimate (:func:`fixed_estimate`) exceeds the limits.

    >>> from knotobs.fibrations.torus import TorusLink
    >>> from knotobs.representations.groups import SU
    >>> guard_fixed(TorusLink(3, 4), SU(2), ((799,),))
    >>> from knotobs.guard import limits
    >>> with limits(seconds=60):
    ...     guard_fixed(TorusLink(3, 4), SU(2), ((2999,),))
    Traceback (most recent call last):
    ...
    knotobs.errors.SizeLimitError: T(3,4) for SU(2) coloured by [2999] by the Rosso-Jones route: about 3e+03 weights and 5.4e+07 output coefficients (printing included): estimated 82.7 s, above the limit of 60 s; choose a smaller colour or knot (or raise the limit: --max-seconds, KNOTOBS_MAX_SECONDS)
    """
    sec, mem, what = fixed_estimate(knot, group, cols, route)
    require(what, seconds=sec, memory_mb=mem, accepted="choose a smaller colour or knot")


def fixed_estimate(knot, group, cols, route: str = "Rosso-Jones", printed: bool = True) -> tuple[float, float, str]:
    """``(seconds, megabytes, description)`` of a fixed-N evaluation of ``knot`` coloured by ``cols``
    (``printed=False``: a polynomial only evaluated at a root of unity, never printed).

    Knots: the weights of the colour.  Links: the weights of the tensor product (the
    weight-sum route) or its irreducible pieces, each with its weights (the Rosso–Jones route).
    The estimate includes printing the result, :data:`FORMAT_SECONDS_PER_TERM` for each of at
    most ``min(span, pieces x terms of one quantum dimension)`` terms: the Adams image has at
    most as many irreducible pieces ``mu`` as the colour has weights, and ``dim_q(mu)`` at most
    ``(N - 1) |mu| + N^3`` terms, ``|mu| = min(P, Q) |lam|`` (measured: 1.5e6 printed terms for
    J_1000 of T(3,4), bound 3e6; 1.36e5 for SU(3) [300] on T(2,3), bound 2.7e5).

    >>> from knotobs.fibrations.torus import TorusLink
    >>> from knotobs.representations.groups import SU
    >>> round(fixed_estimate(TorusLink(3, 4), SU(2), ((2999,),))[0], 1)
    82.7
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
    if printed:
        sec += format_seconds(min(length, k * ((N - 1) * min(knot.P, knot.Q) * boxes + N ** 3)))
    mem = (k * N * 8 * 8 + 3 * 8 * length) / 2**20
    return sec, mem, (f"{user_label(_describe(knot, group, cols))} by the {route} route: about {k:.3g} weights"
                      f" and {length:.3g} output coefficients{' (printing included)' if printed else ''}")


def polynomial_estimate(knot, cols, group=None, with_z: bool = False) -> tuple[float, float]:
    """``(seconds, megabytes)`` of the exact polynomial of ``knot`` coloured by ``cols``: at a fixed
    group (:func:`fixed_estimate`) or, with ``group=None``, the generic-N HOMFLY-PT
    (:func:`homfly_estimate`; ``with_z``: in ``(a, z)``).  For the guards of many evaluations at
    once (a grid, an identification).

    >>> from knotobs.fibrations.torus import TorusLink
    >>> from knotobs.representations.groups import SU
    >>> polynomial_estimate(TorusLink(3, 4), ((2999,),), SU(2))[0] > 60
    True
    """
    if group is None:
        e = homfly_estimate(min(knot.P, knot.Q), max(knot.P, knot.Q), cols, with_z)
        return e["seconds"], e["memory_mb"]
    sec, mem, _ = fixed_estimate(knot, group, cols)
    return sec, mem


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

    The steps: the plethysm (character values, pure Python, once for every irreducible piece
    of the tensor product of the colours of a link), one product per power of ``a``
    and group of terms, the divisions, and (``with_z``) the change to ``z``, whose cost is
    the empirical ``4.3e-13 rows span k^4`` seconds (fitted on a 2-core machine, whole
    evaluation in ``(a, z)``: ``T(30,31)`` 0.22 s, ``T(40,41)`` 0.88 s, ``T(60,61)`` 7.1 s).

    >>> e = homfly_estimate(25, 26, ((1,),))
    >>> e["terms"], e["rows"]
    (25, 26)
    >>> e = homfly_estimate(2, 3, ((1,),) * 15)                   # T(30,45), 15 components
    >>> e["pieces"], round(e["seconds"])
    (176, 2463)
    """
    lam_size = sum(sum(c) for c in cols)
    k = m * lam_size
    hooks_only = all(tuple(c) == (1,) for c in cols) and len(cols) == 1
    terms = m if hooks_only else multipartition_count(m, lam_size)
    rows = k + 1
    span = int(2 * k * k * (n / m + 1)) + 1
    bits = 17 * k + 64
    words = max(1, bits // 64)
    # the plethysm: one Murnaghan-Nakayama character per candidate mu and class rho, for every
    # irreducible piece nu of the tensor product of the colours (a link: at most p(|lam|) pieces,
    # each with its own Adams operation).  The first piece fills the character cache (about
    # 20 us a pair); further pieces reuse it while it holds the pairs (about 3 us a pair,
    # measured: T(20,30) 2.8 s, T(22,33) 7.2 s, T(24,36) 17.7 s as 10-12 components coloured [1]).
    pairs = terms * partition_count(lam_size)
    pieces = 1 if len(cols) == 1 else partition_count(lam_size)
    py = 0 if hooks_only else pairs * (40 + (pieces - 1) * (10 if pairs <= 100_000 else 40))
    c_ops = (terms * k * k * k                          # quantum-dimension rows
             + terms * rows * k * k * 20                # one product per row and group of terms
             + rows * span * words * 20)                # sums and divisions
    py += rows * span * 2                               # reading coefficients back
    sec = seconds_for(py, "python") + seconds_for(c_ops, "numpy")
    if with_z:
        sec += 4.3e-13 * rows * span * k ** 4 + seconds_for(rows * span * words, "python")
    mem = 6 * rows * span * (8 * words + 32) / 2**20
    return {"terms": terms, "pieces": pieces, "rows": rows, "span": span, "bits": bits, "seconds": sec,
            "memory_mb": mem}


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
            f" from {e['terms']} plethysm terms"
            + (f" for each of up to {e['pieces']} irreducible pieces" if e["pieces"] > 1 else ""),
            seconds=e["seconds"], memory_mb=e["memory_mb"],
            accepted="choose a smaller knot or colour" + (", the (a, q) form (--form aq)," if with_z else "")
                     + " or a fixed N (--group 'SU(N)', or the loop command with U(N))")
