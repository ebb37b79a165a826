"""Hook pairings of ``nabla^k e_n``, exactly, from the modified Macdonald basis.

The operator ``nabla`` of F. Bergeron, A. Garsia, M. Haiman and G. Tesler (Methods Appl.
Anal. 6 (1999) 363–420) is diagonal on the modified Macdonald polynomials,
``nabla H~_mu = T_mu H~_mu``.  Everything needed here is closed-form in the cell
statistics of :mod:`knotobs.refined.cells` (J. Haglund, *The q,t-Catalan Numbers and the
Space of Diagonal Harmonics*, AMS University Lecture Series 41 (2008), Ch. 2;
A. Garsia & M. Haiman, J. Algebraic Combin. 5 (1996) 191–244):

* ``T_mu = t^n(mu) q^n(mu')``, ``B_mu = sum_s q^a'(s) t^l'(s)``,
  ``Pi_mu = prod_{s != (0,0)} (1 - q^a'(s) t^l'(s))``, ``M = (1 - q)(1 - t)``,
  ``w_mu = prod_s (q^a(s) - t^(l(s)+1)) (t^l(s) - q^(a(s)+1))``;
* ``e_n = sum_{mu |- n} M B_mu Pi_mu H~_mu / w_mu``;
* ``<H~_mu, s_(n-d, 1^d)> = e_d[B_mu - 1]``, i.e.
  ``sum_d z^d <H~_mu, s_(n-d,1^d)> = prod_{s != (0,0)} (1 + z q^a'(s) t^l'(s))``.

Hence the generating polynomial of the hook pairings

    F_{n,k}(q, t, z) = sum_d z^d <nabla^k e_n, s_(n-d, 1^d)>
                     = sum_mu T_mu^k M B_mu Pi_mu / w_mu * prod_{s != (0,0)} (1 + z q^a' t^l'),

a polynomial with non-negative integer coefficients.  The sum is formed over one
common multiple of the ``w_mu`` with python-flint's multivariate integer polynomials and
divided exactly (an inexact division would raise).  Its top coefficient
``[z^(n-1)] F_{n,1}`` is the q,t-Catalan number ``C_n(q, t)`` (Garsia–Haiman), which
:mod:`knotobs.refined.catalan` computes independently from Dyck paths.

>>> F = hook_pairings(2, 1)
>>> sorted(F.items())
[((0, 0, 0), 1), ((0, 1, 1), 1), ((1, 0, 1), 1)]
"""

from __future__ import annotations

from functools import lru_cache

from knotobs.errors import InvalidKnotError
from knotobs.guard import require
from knotobs.refined.cells import cells, conjugate, n_of, partition_count, partitions_of

__all__ = ["hook_pairings", "hook_pairings_cost"]


def hook_pairings_cost(n: int, k: int) -> float:
    """Rough seconds for :func:`hook_pairings`: a part fixed by ``n`` plus a part growing like ``k^2``.

    Fitted, with a margin of about 1.5, on a 2-core machine (one process):
    ``k = 1``: n = 7 0.71 s, n = 8 2.5 s, n = 9 31 s, n = 10 about 130 s (~4.2x per n, with a
    jump at n = 9); the output has about ``a_n k^2`` terms, and the time beyond ``k = 1``
    grows like ``k^2`` times ~8x per n (measured: T(3,1000) 1.6 s, T(4,601) 4.9 s,
    T(5,201) 3.4 s, T(6,61) 2.5 s, T(8,25) 5.6 s).  Computed from ``n`` and ``k`` alone
    (nothing is enumerated), so a huge request is refused at once.

    >>> round(hook_pairings_cost(9, 1)), round(hook_pairings_cost(10, 1))
    (47, 196)
    """
    n = min(n, 300)
    kk = float(min(max(1, k), 10**100))
    return 0.15 * 4.2 ** (n - 5) + 0.04 * 8.0 ** (n - 6) * (kk * kk - 1.0)


@lru_cache(maxsize=64)
def _hook_pairings(n: int, k: int) -> tuple:
    import flint

    ctx = flint.fmpz_mpoly_ctx.get(("q", "t", "z"), "lex")
    q, t, z = ctx.gens()
    one = ctx.from_dict({(0, 0, 0): 1})

    def binomial(kind, x, y):
        # kind "q": q^x - t^y ; kind "t": t^x - q^y
        return q ** x - t ** y if kind == "q" else t ** x - q ** y

    data = []
    common: dict[tuple, int] = {}
    for mu in partitions_of(n):
        T = q ** n_of(conjugate(mu)) * t ** n_of(mu)
        B = 0 * one
        Pi = one
        R = one
        w: dict[tuple, int] = {}
        for c in cells(mu):
            B += q ** c.col * t ** c.row
            if (c.row, c.col) != (0, 0):
                Pi *= one - q ** c.col * t ** c.row
                R *= one + z * q ** c.col * t ** c.row
            for key in (("q", c.arm, c.leg + 1), ("t", c.leg, c.arm + 1)):
                w[key] = w.get(key, 0) + 1
        data.append((T, B, Pi, R, w))
        for key, m in w.items():
            common[key] = max(common.get(key, 0), m)
    W = one
    for key, m in common.items():
        W *= binomial(*key) ** m
    M = (one - q) * (one - t)
    total = 0 * one
    for T, B, Pi, R, w in data:
        cofactor = W
        for key, m in w.items():
            cofactor = cofactor / binomial(*key) ** m
        total += T ** k * M * B * Pi * R * cofactor
    F = total / W
    return tuple((tuple(int(x) for x in e), int(c)) for e, c in F.terms())


def hook_pairings(n: int, k: int) -> dict[tuple[int, int, int], int]:
    """``F_{n,k}`` as a mapping ``(i, j, d) -> coefficient of q^i t^j z^d``.

    Parameters
    ----------
    n : int
        Degree, ``n >= 1``.
    k : int
        Power of ``nabla``, ``k >= 1``.

    Returns
    -------
    dict
        Exponents of ``(q, t, z)`` to non-negative integer coefficients.

    Examples
    --------
    >>> F = hook_pairings(3, 1)
    >>> sum(c for (i, j, d), c in F.items() if d == 2)   # C_3(1, 1), the Catalan number
    5

    References
    ----------
    J. Haglund, The q,t-Catalan Numbers and the Space of Diagonal Harmonics (2008), Ch. 2.
    """
    if not (isinstance(n, int) and isinstance(k, int)) or n < 1 or k < 1:
        raise InvalidKnotError(f"hook pairings need integers n >= 1 and k >= 1, not n={n!r}, k={k!r}")
    require(f"hook pairings of nabla^{k} e_{n} ({partition_count(n):.3g} partitions)",
            seconds=hook_pairings_cost(n, k), accepted="use a torus knot T(n, nk+1) with smaller n")
    return dict(_hook_pairings(n, k))

