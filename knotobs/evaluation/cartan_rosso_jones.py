"""Torus knots and links for any simple group by the Rosso–Jones formula (Adams-operation route).

For ``T(m, n)`` (``m = min(P, Q)``), zero framing, unnormalised (unknot = ``dim_q``), CONVENTIONS §3
with the data of any simple group (``docs/groups.md``, §14):

    W_lam = theta(lam)^(-m n) * sum_mu c_{lam,mu}^(m) theta(mu)^(n/m) dim_q(mu),

``theta(mu) = q^C(mu)``, ``C(mu) = (mu, mu + 2 rho)/2`` with long roots of length^2 = 2 and
``psi^m(lam) = sum_mu c_{lam,mu}^(m) V(mu)`` the Adams operation, computed by Brauer–Klimyk on the
weights of ``lam`` (:func:`knotobs.representations.cartan.adams`); ``dim_q(mu)`` by Weyl's product
over the positive roots (no weights of ``mu`` are needed).  A torus link ``T(dP, dQ)`` first
decomposes ``lam_1 x ... x lam_d`` and applies the sum to each summand; the torus framing ``P Q`` of
each component is removed by ``theta(lam_i)^(-P Q)``.  The mirror image is ``q -> q^-1``.

References
----------
M. Rosso, V. F. R. Jones, J. Knot Theory Ramifications 2 (1993) 97–112 (any simple Lie algebra);
S. Stevan, Ann. Henri Poincaré 11 (2010) 1201–1224; X.-S. Lin, H. Zheng, Trans. Amer. Math. Soc.
362 (2010) 1–18.
"""

from __future__ import annotations

from fractions import Fraction

from knotobs.evaluation.cartan_colours import labels_for
from knotobs.evaluation.framing import FramingSpec, resolve_framing
from knotobs.fibrations.torus import TorusLink
from knotobs.guard import require, seconds_for
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.cartan.characters import adams, casimir, quantum_dimension_weyl, tensor, weyl_dimension
from knotobs.representations.cartan.group import SimpleGroup

__all__ = ["rosso_jones_cartan"]


def _estimate(group: SimpleGroup, labels, m: int) -> None:
    R = group.roots
    # Brauer-Klimyk: (number of irreducible summands so far ~ dim/|W|) x (weights of the next factor)
    dims = [weyl_dimension(R, lam) for lam in labels]
    W = R.weyl_order
    tensor_dim, ops = 1, 0
    for d in dims:
        ops += (tensor_dim // W + 1) * d * (R.rank + 2) * 4
        tensor_dim *= d
    ops += tensor_dim * (R.rank + 2) * 4          # the Adams operation on every summand
    require(f"Rosso-Jones for {group} with representations {[group.label_text(x) for x in labels]}"
            f" ({tensor_dim} weights)", seconds=seconds_for(ops, "python"),
            accepted="choose smaller representations or fewer components")


def rosso_jones_cartan(knot: TorusLink, group: SimpleGroup, rep, framing: FramingSpec = 0) -> Laurent:
    """Unnormalised Wilson loop of ``T(p, q)`` for any simple group, exact in ``q``.

    Parameters
    ----------
    knot : TorusLink
    group : SimpleGroup
    rep : representation text, Dynkin tuple or partition; or one per component
    framing : int, list of int, ``"zero"`` or ``"fiber"``

    Examples
    --------
    >>> from knotobs.representations.cartan import simple_group
    >>> from knotobs.evaluation.rosso_jones import rosso_jones
    >>> from knotobs.representations.groups import SU
    >>> w = rosso_jones_cartan(TorusLink(2, 3), simple_group("Sp(2)"), "[1]")
    >>> w == rosso_jones(TorusLink(2, 3), SU(2), (1,))              # Sp(2) = SU(2)
    True

    References
    ----------
    Rosso–Jones (1993); Stevan (2010); CONVENTIONS §3; docs/groups.md (§14).
    """
    labels = labels_for(knot, group, rep)
    frames = resolve_framing(knot, framing)
    R = group.roots
    m, n = min(knot.P, knot.Q), max(knot.P, knot.Q)
    _estimate(group, labels, m)
    decomposition = {labels[0]: 1} if len(labels) == 1 else tensor(R, labels)
    ratio = Fraction(n, m)
    terms: dict = {}
    for nu, mult in decomposition.items():
        for mu, c in adams(R, nu, m).items():
            terms[mu] = terms.get(mu, 0) + c * mult
    w = Laurent.zero()
    for mu, c in terms.items():
        if c:
            w = w + quantum_dimension_weyl(R, mu).times_monomial(casimir(R, mu) * ratio, c)
    shift = -sum((casimir(R, lam) for lam in labels), Fraction(0)) * m * n
    w = w.times_monomial(shift)
    if knot.chirality < 0:
        w = w.mirror()
    extra = sum((f * casimir(R, lam) for f, lam in zip(frames, labels)), Fraction(0))
    if extra:
        w = w.times_monomial(extra)
    return w.canonical()
