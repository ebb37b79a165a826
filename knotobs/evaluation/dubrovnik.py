"""The SO(N) invariant of torus knots and links in the vector representation for generic N.

Rosso–Jones (CONVENTIONS §3) with the orthogonal data of
:mod:`knotobs.representations.orthogonal_generic` as functions of ``a = q^((N-1)/2)`` and
``s = q^(1/2)``: for ``T(dP, dQ)`` with every component in the vector representation ``V``,
``m = min(P, Q)``, ``n = max(P, Q)``,

    W = theta(V)^(-P Q d) sum_nu N_nu sum_mu c_{nu,mu}^(m) theta(mu)^(n/m) dim_q(mu),

``V^(x d) = sum_nu N_nu o_nu`` and ``psi^m(o_nu) = sum_mu c_{nu,mu}^(m) o_mu`` in the universal
orthogonal character ring, ``theta(mu) = a^|mu| s^kappa(mu)`` (so ``theta(V) = a``), and ``dim_q`` the
generic quantum dimension.  Zero (Seifert) framing on every component.  The value returned is
normalised by the unknot ``dim_q(V) = (a - a^-1)/z + 1`` (``z = s - s^-1``): it is the Dubrovnik
polynomial (L. Kauffman, Trans. Amer. Math. Soc. 318 (1990) 417–471) in the normalisation

    Lambda(L+) - Lambda(L-) = z (Lambda(L0) - Lambda(Linf)),   positive kink = a,   Lambda(unknot) = 1,

for the framed invariant ``Lambda``, evaluated on the zero-framed link (``a`` and ``z`` as above; CONVENTIONS §14 in ``docs/groups.md``).  Setting
``a = q^((N-1)/2)`` gives the normalised SO(N) Wilson loop of the Cartan engine for every N >= 4 (and
for N = 3 with the SO(3) metric doubled: ``q -> q^2``), which the tests check.

The sum has only ``O(m)`` terms; all of them are put over one common denominator (a product of
factors ``a s^e - a^-1 s^-e`` and ``s^h - s^-h``) which is divided out exactly at the end.
"""

from __future__ import annotations

from fractions import Fraction
from math import floor

from knotobs.errors import InexactDivisionError
from knotobs.fibrations.torus import TorusLink
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.orthogonal_generic import (
    divide_factor,
    multiply_factor,
    quantum_dimension_factors,
    twist,
    universal_adams,
    universal_tensor,
)

__all__ = ["dubrovnik_torus"]


def _div_monic_a(x: Laurent2, g: dict[int, Laurent]) -> Laurent2:
    """Exact division of ``x`` by ``sum_i a^i g_i`` whose top coefficient ``g_top`` is 1 (long division in a)."""
    top = max(g)
    assert g[top] == Laurent.one("s")
    lo_g = min(g)
    rem = dict(x.c)
    quo: dict[int, Laurent] = {}
    while rem:
        hi = max(rem)
        if hi - top < min(rem) - lo_g:
            break
        c = rem.pop(hi)
        e = hi - top
        quo[e] = c
        for i, gi in g.items():
            if i == top:
                continue
            k = e + i
            v = rem.get(k, Laurent.zero("s")) - c * gi
            if v.is_zero():
                rem.pop(k, None)
            else:
                rem[k] = v
    if rem:
        raise InexactDivisionError("not divisible by a - a^-1 + z")
    return Laurent2(quo)


def dubrovnik_torus(knot: TorusLink) -> Laurent2:
    """Normalised zero-framed SO(N) invariant of ``T(p, q)``, vector representation, generic N.

    Returns a :class:`~knotobs.polynomials.bivariate.Laurent2` in ``(a, s)`` carrying
    ``z^(1 - c)`` for a ``c``-component link.

    Examples
    --------
    >>> dubrovnik_torus(TorusLink(2, 3)).to_az_string()
    '2*a^-2 + a^-2*z^2 + a^-3*z - a^-4 - a^-4*z^2 - a^-5*z'

    References
    ----------
    M. Rosso, V. F. R. Jones, J. Knot Theory Ramifications 2 (1993) 97–112; L. Kauffman,
    Trans. Amer. Math. Soc. 318 (1990) 417–471; docs/groups.md (§14).
    """
    d = knot.components
    P, Q = knot.P, knot.Q
    m, n = min(P, Q), max(P, Q)
    dec = ((((1,), 1),) if d == 1 else universal_tensor(((1,),) * d))
    coeff: dict = {}
    for nu, mult in dec:
        for mu, c in universal_adams(nu, m):
            coeff[mu] = coeff.get(mu, 0) + c * mult
    items = []
    common: dict[tuple[str, int], int] = {}
    for mu, c in coeff.items():
        if not c:
            continue
        num, den = quantum_dimension_factors(mu)
        cnt: dict = {}
        for f in den:
            cnt[f] = cnt.get(f, 0) + 1
        for f, k in cnt.items():
            common[f] = max(common.get(f, 0), k)
        items.append((mu, c, num, cnt))
    classes: dict[Fraction, Laurent2] = {}
    ratio = Fraction(n, m)
    for mu, c, num, cnt in items:
        ea, es = twist(mu)
        ea, es = ea * ratio, es * ratio
        term = num
        for f, k in common.items():
            for _ in range(k - cnt.get(f, 0)):
                term = multiply_factor(term, f)
        base = floor(ea)
        frac = ea - base
        term = term.times_monomial(base, es, c)
        classes[frac] = classes[frac] + term if frac in classes else term
    total = classes.pop(Fraction(0), Laurent2())
    if any(not v.is_zero() for v in classes.values()):  # pragma: no cover - would be a bug
        raise ArithmeticError(f"fractional powers of a survive in the Rosso-Jones sum of {knot}")
    total = total.times_monomial(-P * Q * d)       # theta(V)^(-PQ) on each component
    s = Laurent.gen("s")
    total = total * Laurent2.from_s((s - s ** -1) ** d)
    for f, k in common.items():
        for _ in range(k):
            total = divide_factor(total, f)
    out = _div_monic_a(total.times_monomial(1), {2: Laurent.one("s"), 1: s - s ** -1, 0: -Laurent.one("s")})
    out = out.with_zpow(1 - d)
    if knot.chirality < 0:
        out = out.mirror()
    return out
