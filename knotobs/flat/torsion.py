r"""Reidemeister torsion (one-loop amplitude) of isolated irreducible flat connections.

For a Seifert manifold with three exceptional fibres and an irreducible ``rho`` whose holonomy
along the ``j``-th exceptional fibre (the core of its solid torus) has angle ``beta_j``
(:func:`knotobs.flat.chern_simons.core_angles`),

    ``tau_rho = (16/(a_1 a_2 a_3)) prod_{j=1}^{3} sin^2(2 pi beta_j)``.

This is the normalisation of CONVENTIONS §9 and §12: in the large-``K`` expansion
``Z_K = sum_alpha e^{2 pi i K cs(alpha)} q^{-phi/4} A_alpha + ...`` the irreducible
sectors have ``|A_alpha|^2 = tau_alpha`` (for the Poincaré sphere ``(2/5) sin^2(pi/5)`` and
``(2/5) sin^2(2 pi/5)``; D. Freed and R. Gompf, Commun. Math. Phys. 141 (1991) 79–117;
D. Freed, J. reine angew. Math. 429 (1992) 75–89, for the product of sines).  The tests check it
connection by connection against the exact residues of the Lawrence–Rozansky integral.
The same expression, evaluated at the rotation numbers of an SL(2,R) connection, is its torsion
(the torsion is an algebraic function of the character).
"""

from __future__ import annotations

from knotobs.numerics import local_mp

__all__ = ["irreducible_torsion"]


def irreducible_torsion(M, eps: int, l: tuple[int, ...], digits: int = 20, ctx=None, cache=None):
    """``tau`` of the isolated irreducible class ``(eps, l)`` on a three-fibre ``M``, to ``digits`` digits.

    ``ctx`` (from :func:`knotobs.numerics.local_mp` with ``digits + 10``) may be shared between calls, and so may
    a dict ``cache`` of the values ``sin^2(2 pi beta)`` already computed in that context.
    Returns ``None`` when ``M`` does not have exactly three exceptional fibres (the connection is
    then not isolated, or the formula is not set up).

    >>> from knotobs.fibrations.seifert import parse_space
    >>> M = parse_space("Sigma(2,3,5)").normal_form()
    >>> t = irreducible_torsion(M, -1, (1, 1, 1), 20)
    >>> ctx = __import__("knotobs.numerics", fromlist=["x"]).local_mp(30)
    >>> abs(t - ctx.mpf(2) / 5 * ctx.sin(ctx.pi / 5) ** 2) < ctx.mpf(10) ** -19
    True

    References
    ----------
    D. Freed, J. reine angew. Math. 429 (1992) 75–89; D. Freed and R. Gompf, Commun. Math. Phys.
    141 (1991) 79–117.
    """
    if len(M.fibers) != 3:
        return None
    if ctx is None:
        ctx = local_mp(digits + 10)     # pass one context when computing many torsions
    from knotobs.flat.chern_simons import complement_pair

    sig = 0 if eps == 1 else 1
    A = 1
    val = ctx.mpf(16)
    for (a, bj), lj in zip(M.fibers, l):
        A *= a
        c, d = complement_pair(a, bj)
        k = (c * lj + d * sig * a) % a          # 2 beta_j = k/a mod 1
        key = (a, k)
        if cache is not None and key in cache:
            val *= cache[key]
            continue
        s2 = ctx.sinpi(ctx.mpf(k) / a) ** 2
        if cache is not None:
            cache[key] = s2
        val *= s2
    return +(val / A)
