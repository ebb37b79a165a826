"""Torus knots and links from the Seifert fibration: the weight-insertion Gaussian sum.

When ``T(P, Q)`` is a regular fiber of the Seifert fibration of S^3, the
Chern–Simons path integral localises on the Cartan subalgebra and the Gaussian
integral with the character of ``lam`` inserted can be done exactly
(CONVENTIONS §4).  In the fiber framing (``P Q`` relative to the Seifert framing):

    W^fiber_lam(T(P,Q)) = sum_nu mult(nu) sum_w eps(w) q^((PQ/2)|nu + rho/P + w(rho)/Q|^2)
                          / sum_w eps(w) q^((PQ/2)|rho/P + w(rho)/Q|^2)

with ``nu`` the weights of ``lam`` (orthonormal basis, projected to ``sum = 0`` for
SU(N), unprojected for U(N)), ``rho = ((N-1)/2, ..., -(N-1)/2)`` and ``w`` running over
permutations.  ``W^fiber = theta(lam)^(P Q) W^zero``.  A torus link ``T(dP, dQ)``
consists of ``d`` regular fibers; inserting one character per fiber amounts to
using the weights of ``lam_1 x ... x lam_d``.

This route needs only weights and the Weyl group — no Adams operations — so it is
an independent check of :mod:`knotobs.evaluation.rosso_jones`.

References
----------
R. Lawrence, L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314;
M. Mariño, Commun. Math. Phys. 253 (2005) 25–49;
C. Beasley, Adv. Theor. Math. Phys. 17 (2013) 1–240 (Wilson loops and localization);
CONVENTIONS §4.
"""

from __future__ import annotations

from fractions import Fraction
from functools import reduce
from itertools import permutations
from math import gcd

import numpy as np
from flint import fmpz_poly

from knotobs.errors import SizeLimitError
from knotobs.evaluation.framing import FramingSpec, resolve_framing
from knotobs.evaluation.rosso_jones import colours_for
from knotobs.fibrations.torus import TorusLink
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.groups import Group, casimir
from knotobs.representations.weights import weight_multiplicities

__all__ = ["weight_sum", "MAX_WEYL_ORDER"]

#: Largest Weyl group (N!) summed over explicitly.
MAX_WEYL_ORDER = 40_320


def _perm_sign(p: tuple[int, ...]) -> int:
    inv = sum(1 for i in range(len(p)) for j in range(i + 1, len(p)) if p[i] > p[j])
    return -1 if inv % 2 else 1


def _tensor_weights(cols, N: int) -> tuple[np.ndarray, np.ndarray]:
    acc: dict[tuple[int, ...], int] = {(0,) * N: 1}
    for lam in cols:
        wts = weight_multiplicities(lam, N)
        new: dict[tuple[int, ...], int] = {}
        for a, ca in acc.items():
            for b, cb in wts.items():
                key = tuple(x + y for x, y in zip(a, b))
                new[key] = new.get(key, 0) + ca * cb
        acc = new
    keys = list(acc)
    return np.array(keys, dtype=np.int64).reshape(len(keys), N), np.array([acc[k] for k in keys], dtype=np.int64)


def weight_sum(knot: TorusLink, group: Group, colours, framing: FramingSpec = 0) -> Laurent:
    """Unnormalised Wilson loop of ``T(p, q)`` by the weight-insertion Gaussian sum.

    Same conventions and output as :func:`knotobs.evaluation.rosso_jones.rosso_jones`
    (zero framing by default, unknot = ``dim_q``), computed independently.

    Examples
    --------
    >>> from knotobs.representations.groups import SU
    >>> from knotobs.evaluation.rosso_jones import rosso_jones
    >>> k = TorusLink(3, 4)
    >>> weight_sum(k, SU(3), (2, 1)) == rosso_jones(k, SU(3), (2, 1))
    True

    References
    ----------
    Lawrence–Rozansky (1999); Mariño (2005); CONVENTIONS §4.
    """
    cols = tuple(group.check(c) for c in colours_for(knot, colours))
    frames = resolve_framing(knot, framing)
    N = group.N
    order = 1
    for i in range(2, N + 1):
        order *= i
    if order > MAX_WEYL_ORDER:
        raise SizeLimitError(
            f"the weight sum runs over the {order} elements of the Weyl group of {group};"
            f" use the Rosso-Jones route for N > 8"
        )
    P, Q = knot.P, knot.Q
    nus, mults = _tensor_weights(cols, N)
    two_rho = np.array([N - 1 - 2 * i for i in range(N)], dtype=np.int64)
    tot = nus.sum(axis=1)
    # 4N * exponent, with the w-independent constant (Q/2P + P/2Q)|rho|^2 dropped
    base = 2 * N * P * Q * (nus * nus).sum(axis=1) + 2 * N * Q * (nus @ two_rho)
    if group.kind == "SU":
        base = base - 2 * P * Q * tot * tot
    num_e, num_c, den_e, den_c = [], [], [], []
    for perm in permutations(range(N)):
        sign = _perm_sign(perm)
        w_rho = two_rho[list(perm)]
        rr = int(N * (two_rho @ w_rho))
        num_e.append(base + 2 * N * P * (nus @ w_rho) + rr)
        num_c.append(sign * mults)
        den_e.append(rr)
        den_c.append(sign)
    ne = np.concatenate(num_e)
    nc = np.concatenate(num_c)
    de = np.array(den_e, dtype=np.int64)
    dc = np.array(den_c, dtype=np.int64)
    lo_n, lo_d = int(ne.min()), int(de.min())
    g = reduce(gcd, [int(x) for x in np.unique(ne - lo_n)] + [int(x) for x in np.unique(de - lo_d)], 0) or 1
    num = np.zeros((int(ne.max()) - lo_n) // g + 1, dtype=np.int64)
    np.add.at(num, (ne - lo_n) // g, nc)
    den = np.zeros((int(de.max()) - lo_d) // g + 1, dtype=np.int64)
    np.add.at(den, (de - lo_d) // g, dc)
    # exponents are (lo + g*i)/(4N); write lo as a multiple of g plus a remainder class
    unit = Fraction(g, 4 * N)
    numer = Laurent(fmpz_poly(num.tolist()), 0, 1).subs_power(unit).times_monomial(Fraction(lo_n, 4 * N))
    denom = Laurent(fmpz_poly(den.tolist()), 0, 1).subs_power(unit).times_monomial(Fraction(lo_d, 4 * N))
    w = numer.exact_div(denom)  # fiber framing, positive chirality
    w = w.times_monomial(-P * Q * sum(casimir(group, lam) for lam in cols))
    if knot.chirality < 0:
        w = w.mirror()
    extra = sum(f * casimir(group, lam) for f, lam in zip(frames, cols))
    return w.times_monomial(extra).canonical()
