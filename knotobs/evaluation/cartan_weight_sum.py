"""Torus knots and links for any simple group from the Seifert fibration of S^3: the weight sum.

CONVENTIONS §4 with the weights, ``rho`` and Weyl group of any simple group (``docs/groups.md``,
§14).  In the fiber framing (``P Q`` relative to the Seifert framing):

    W^fiber_lam(T(P,Q)) = sum_nu mult(nu) sum_w eps(w) q^((PQ/2)|nu + rho/P + w(rho)/Q|^2)
                          / sum_w eps(w) q^((PQ/2)|rho/P + w(rho)/Q|^2),

``nu`` the weights of ``lam`` (of ``lam_1 x ... x lam_d`` for a link of ``d`` regular fibers),
``|.|`` the metric with long roots of length^2 = 2 and ``w`` the Weyl group, whose elements are
enumerated through the orbit of the regular weight ``rho`` (sign ``(-1)^length``).  Then
``W^zero = theta(lam)^(-P Q) W^fiber``.  No Adams operation enters: this route is independent of
:mod:`knotobs.evaluation.cartan_rosso_jones`.

References
----------
R. Lawrence, L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314; M. Mariño, Commun. Math. Phys.
253 (2005) 25–49; C. Beasley, Adv. Theor. Math. Phys. 17 (2013) 1–240; S. Stevan, Ann. Henri
Poincaré 11 (2010) 1201–1224 (any compact simple group); CONVENTIONS §4.
"""

from __future__ import annotations

from fractions import Fraction

import numpy as np

from knotobs.evaluation.cartan_colours import labels_for
from knotobs.evaluation.framing import FramingSpec, resolve_framing
from knotobs.fibrations.torus import TorusLink
from knotobs.guard import require, seconds_for
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.cartan.characters import casimir, weight_arrays, weyl_dimension
from knotobs.representations.cartan.group import SimpleGroup

__all__ = ["weight_sum_cartan"]


def _tensor_weights(R, labels) -> tuple[np.ndarray, np.ndarray]:
    acc: dict[tuple, int] = {(0,) * R.rank: 1}
    for lam in labels:
        ws, ms = weight_arrays(R, lam)
        new: dict[tuple, int] = {}
        for a, ca in acc.items():
            av = np.array(a, dtype=np.int64)
            for row, cb in zip((ws + av).tolist(), ms.tolist()):
                key = tuple(row)
                new[key] = new.get(key, 0) + ca * cb
        acc = new
    keys = list(acc)
    return np.array(keys, dtype=np.int64).reshape(len(keys), R.rank), np.array([acc[k] for k in keys], dtype=np.int64)


def _laurent(exps: np.ndarray, coeffs: np.ndarray, unit: int) -> Laurent:
    u, inv = np.unique(exps, return_inverse=True)
    c = np.zeros(len(u), dtype=object)
    np.add.at(c, inv.ravel(), coeffs.astype(object))
    return Laurent.from_terms({Fraction(int(e), unit): int(x) for e, x in zip(u.tolist(), c.tolist()) if x})


def weight_sum_cartan(knot: TorusLink, group: SimpleGroup, rep, framing: FramingSpec = 0) -> Laurent:
    """Unnormalised Wilson loop of ``T(p, q)`` for any simple group by the weight-insertion sum.

    Same conventions and output as :func:`~knotobs.evaluation.cartan_rosso_jones.rosso_jones_cartan`.

    Examples
    --------
    >>> from knotobs.representations.cartan import simple_group
    >>> from knotobs.evaluation.cartan_rosso_jones import rosso_jones_cartan
    >>> G = simple_group("G2")
    >>> weight_sum_cartan(TorusLink(2, 3), G, "(1,0)") == rosso_jones_cartan(TorusLink(2, 3), G, "(1,0)")
    True

    References
    ----------
    Lawrence–Rozansky (1999); Mariño (2005); Stevan (2010); CONVENTIONS §4; docs/groups.md (§14).
    """
    labels = labels_for(knot, group, rep)
    frames = resolve_framing(knot, framing)
    R = group.roots
    P, Q = knot.P, knot.Q
    tdim = 1
    for lam in labels:
        tdim *= weyl_dimension(R, lam)
    W = R.weyl_order
    require(f"weight sum for {group}: {tdim} weights x {W} Weyl group elements",
            seconds=seconds_for(tdim * W * 6, "numpy") + seconds_for(tdim * len(labels) * 4, "python"),
            memory_mb=tdim * W * 24 / 1e6, accepted="use the Rosso-Jones route (--route rosso-jones)")
    nus, mults = _tensor_weights(R, labels)
    wr, signs = R.weyl_rho
    wrho = np.array(wr, dtype=np.int64).reshape(len(wr), R.rank)
    sg = np.array(signs, dtype=np.int64)
    F = R.form_int                      # D * (omega_i, omega_j)
    D = R.form_denominator
    rho = np.ones(R.rank, dtype=np.int64)
    # 2D * exponent, the w-independent constant (Q/2P + P/2Q)|rho|^2 dropped from numerator and denominator
    nF = nus @ F
    base = P * Q * (nF * nus).sum(axis=1) + 2 * Q * (nF @ rho)          # per weight
    cross = 2 * P * (nF @ wrho.T)                                         # weights x Weyl
    rr = 2 * (wrho @ F @ rho)                                             # per Weyl element
    num_e = base[:, None] + cross + rr[None, :]
    num_c = mults[:, None] * sg[None, :]
    numer = _laurent(num_e.ravel(), num_c.ravel(), 2 * D)
    denom = _laurent(rr, sg, 2 * D)
    w = numer.exact_div(denom)
    w = w.times_monomial(-P * Q * sum((casimir(R, lam) for lam in labels), Fraction(0)))
    if knot.chirality < 0:
        w = w.mirror()
    extra = sum((f * casimir(R, lam) for f, lam in zip(frames, labels)), Fraction(0))
    return w.times_monomial(extra).canonical()
