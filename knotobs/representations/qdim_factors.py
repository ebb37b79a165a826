"""Quantum dimensions as ratios of ``{x} = s^x - s^-x``, and their dense expansion.

``dim_q(lam)`` of U(N)/SU(N) is a ratio of products of ``{x}`` (``s = q^(1/2)``) in two
standard ways (CONVENTIONS §2):

* Weyl: ``prod_{i<j} {lam_i - lam_j + j - i} / {j - i}`` — ``N(N-1)/2`` factors;
* hook–content: ``prod_boxes {N + c} / {h}`` — ``|lam|`` factors.

:func:`qdim_factors` takes the one with fewer factors after cancelling equal factors
between numerator and denominator; :func:`qdim_dense` multiplies the numerator out
(each factor one shifted subtraction) and divides by the denominator (each factor a
strided prefix sum), all on integer arrays.

References
----------
H. Weyl (character formula); I. G. Macdonald, *Symmetric Functions and Hall
Polynomials*, 2nd ed. (1995), ch. I §3 ex. 1 (hook–content); CONVENTIONS §2.
"""

from __future__ import annotations

from collections import Counter
from functools import lru_cache
from typing import Sequence

import numpy as np

from knotobs.polynomials.dense import Dense
from knotobs.representations.partitions import contents, hooks

__all__ = ["qdim_factors", "qdim_dense", "binomial_product", "content_rows"]


def _cancel(num: list[int], den: list[int]) -> tuple[list[int], list[int]]:
    cn, cd = Counter(num), Counter(den)
    common = cn & cd
    return sorted((cn - common).elements()), sorted((cd - common).elements())


def qdim_factors(lam: Sequence[int], N: int) -> tuple[list[int], list[int]]:
    """``(num, den)`` with ``dim_q(lam) = prod_{a in num} {a} / prod_{b in den} {b}`` for U(N).

    Examples
    --------
    >>> qdim_factors((1,), 20)              # [20] = {20}/{1}
    ([20], [1])
    >>> qdim_factors((2, 1), 3)             # the adjoint of SU(3): [2]^2 [4] / ([2] [1] ...)
    ([2, 4], [1, 1])

    References
    ----------
    Macdonald (1995), ch. I §3 ex. 1; CONVENTIONS §2.
    """
    lam = [x for x in lam if x > 0]
    if len(lam) > N:
        raise ValueError(f"{lam} has more than {N} rows")
    hc = _cancel([N + c for c in contents(lam)], hooks(lam))
    lt = lam + [0] * (N - len(lam))
    # Weyl form, skipping the pairs i < j with lam_i = lam_j (their factor is 1)
    wn, wd = [], []
    for i in range(len(lam)):
        for j in range(i + 1, N):
            if lt[i] != lt[j]:
                wn.append(lt[i] - lt[j] + j - i)
                wd.append(j - i)
    wy = _cancel(wn, wd)
    return hc if len(hc[0]) + len(hc[1]) <= len(wy[0]) + len(wy[1]) else wy


def binomial_product(factors: Sequence[int], den: int = 2, var: str = "q") -> Dense:
    """``prod_a {a}`` as a :class:`Dense` in units ``1/den`` of ``q`` (``{a} = q^(a/2) - q^(-a/2)``).

    >>> binomial_product([1, 2]).to_laurent()
    Laurent('q^(-3/2) - q^(-1/2) - q^(1/2) + q^(3/2)')
    """
    d = Dense(np.ones(1, dtype=np.int64), 0, den, var)
    for a in factors:
        d = d.mul_curly(a)
    return d


def qdim_dense(lam: Sequence[int], N: int, den: int = 2, var: str = "q") -> Dense:
    """``dim_q(lam)`` of U(N) (= SU(N)) as a :class:`Dense` in units ``1/den`` of ``q`` (``den`` even).

    >>> qdim_dense((2,), 2).to_laurent()
    Laurent('q^-1 + 1 + q')
    """
    num, dd = qdim_factors(lam, N)
    d = binomial_product(num, den, var)
    for b in dd:
        d = d.div_curly(b)
    return d


@lru_cache(maxsize=4096)
def content_rows(cs: tuple[int, ...]) -> tuple[np.ndarray, int]:
    """Elementary symmetric polynomials of ``s^(2c)`` over the contents ``cs``, as array rows.

    ``prod_c (A s^(2c) - 1) = sum_j (-1)^(k-j) A^j s^(j lo) sum_t E[j, t] s^t`` with ``lo = 2 min c``
    and ``k = len(cs)``: row ``j`` of ``E`` holds ``e_j(s^(2c - lo))``.  These are the numerators
    of the generic-N quantum dimension ``prod_c (a s^c - a^-1 s^-c)`` (CONVENTIONS §2), built by
    the recurrence ``e_j <- e_j + x e_(j-1)`` one content at a time (int64 while
    ``C(k, k/2)`` fits, Python integers beyond).

    >>> E, lo = content_rows((0, 1))
    >>> E.tolist(), lo
    ([[1, 0, 0], [1, 0, 1], [0, 0, 1]], 0)
    """
    k = len(cs)
    lo = 2 * min(cs, default=0)
    span = sum(2 * c - lo for c in cs) + 1
    dtype = np.int64 if k <= 60 else object
    E = np.zeros((k + 1, span), dtype=dtype)
    if dtype == object:
        E[:, :] = 0
    E[0, 0] = 1
    top = 0
    for i, c in enumerate(cs):
        sh = 2 * c - lo
        # rows 1..i+1 gain x * (row below); go downwards so each row uses the old one below
        if sh:
            E[1 : i + 2, sh : top + sh + 1] += E[0 : i + 1, 0 : top + 1]
        else:
            E[1 : i + 2, : top + 1] += E[0 : i + 1, : top + 1].copy()
        top += sh
    E.setflags(write=False)
    return E, lo
