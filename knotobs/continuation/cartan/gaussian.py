r"""The Gaussian integrals over the Cartan in closed form (entire ``h``: at most two orders ``> 1``).

CONVENTIONS §18.2 (docs/continuation_sun.md).  When at most two orders exceed 1, ``G`` of
:mod:`.data` is the trigonometric polynomial ``Delta(z/p_a) Delta(z/p_b)``, and

    ``Z(K) = B_N(K) sum_{u in Q/HQ} int_C exp(-i pi K H |z|^2/P - 2 pi i K <u, z>) G(z) d^r x``

(``x`` the coordinates of ``z`` in the fundamental weights, ``C`` the real Cartan rotated by
``exp(i theta)``, ``theta = -sigma pi/4 - arg(K)/2``).  With ``a = K H/P`` and
``c = w_1 rho/p_a + w_2 rho/p_b`` each integral is an exact Gaussian:

    ``int_C exp(-i pi a |z|^2 + 2 pi i <c - K u, z>) d^r x = sqrt(N) (i a)^(-r/2) exp(i pi |c - K u|^2/a)``,

``(i a)^(-r/2) = exp(i r theta) (i a exp(2 i theta))^(-r/2)`` (principal power of a positive
number; for even ``r`` simply the integer power).  Expanding
``|c - K u|^2/a = P|c|^2/(K H) - 2 P <c, u>/H + K P |u|^2/H`` gives one sector per ``u``: the phase
``exp(2 pi i K cs(u))``, ``cs(u) = P |u|^2/(2H)`` (the Chern–Simons value of the abelian flat
connection ``u``), times an amplitude that is a finite sum of ``exp(i pi P |c|^2/(K H))``.  With
``phases="reduced"`` ``cs`` is taken in ``(-1/2, 1/2]`` (equal at every integer ``K``).
"""

from __future__ import annotations

import itertools
import math
from fractions import Fraction

from flint import acb, arb

from knotobs.continuation.cartan.data import B_N, CartanData, weyl_vectors

__all__ = ["gaussian_sectors", "gaussian_terms", "ia_power", "root_vectors", "abelian_cs", "abelian_cs_values"]


def _sym(x: Fraction) -> Fraction:
    y = x % 1
    return y - 1 if y > Fraction(1, 2) else y


def root_vectors(N: int, H: int) -> list[tuple[int, ...]]:
    """Representatives ``u`` of ``Q/HQ`` in ``R^N``: ``u = sum_j t_j alpha_j``, ``0 <= t_j < |H|``.

    >>> root_vectors(3, 2)[:3]
    [(0, 0, 0), (0, 1, -1), (1, -1, 0)]
    """
    r = N - 1
    out = []
    for t in itertools.product(range(abs(H)), repeat=r):
        out.append(tuple((t[i] if i < r else 0) - (t[i - 1] if i > 0 else 0) for i in range(N)))
    return out


def abelian_cs(P: int, H: int, u) -> Fraction:
    """Chern–Simons value ``P |u|^2/(2H)`` of the abelian flat connection ``u in Q/HQ`` (§18.2).

    >>> abelian_cs(1, 5, (1, -1, 0))
    Fraction(1, 5)
    """
    return Fraction(P * sum(ui * ui for ui in u), 2 * H)


def abelian_cs_values(d: CartanData) -> frozenset:
    """The CS values mod 1 of all abelian flat connections (``u in Q/HQ``).

    >>> sorted(str(c) for c in abelian_cs_values(CartanData.from_space("L(5,1)", 3)))
    ['0', '1/5', '2/5', '3/5', '4/5']
    """
    if d.shared:
        return _coset_abelian_cs_values(d)
    return frozenset(abelian_cs(d.P, d.H, u) % 1 for u in root_vectors(d.N, d.H))


def _coset_abelian_cs_values(d: CartanData) -> frozenset:
    """Orders sharing a factor (§18.8, SU(3)): the Gaussian of the coset ``s`` and the Fourier index
    ``u in Q/H'Q`` (``H' = H L/P``) complete to ``exp(2 pi i K (L |u + c_s|^2/(2 H') - const_s))``.

    >>> sorted(str(c) for c in abelian_cs_values(CartanData.from_space("M(0; -1; (2,1), (2,1), (3,1))", 3)))
    ['0', '1/4', '3/4']
    """
    Hp, L = d.HL, d.L
    out = set()
    for co in d.cosets():
        for t in itertools.product(range(abs(Hp)), repeat=2):
            v1, v2 = t[0] + co.lin[0], t[1] + co.lin[1]
            norm = 2 * v1 * v1 - 2 * v1 * v2 + 2 * v2 * v2          # |v|^2, roots of length^2 2
            out.add((Fraction(L) * norm / (2 * Hp) - co.const) % 1)
    return frozenset(out)


def gaussian_terms(d: CartanData) -> int:
    """Number of exponentials the closed form sums: ``|H|^r (N!)^2``.

    >>> gaussian_terms(CartanData.from_space("L(5,1)", 3))
    900
    """
    return abs(d.H) ** d.r * math.factorial(d.N) ** 2


def ia_power(d: CartanData, K: acb) -> acb:
    """``(i a)^(-r/2)``, ``a = K H/P``, on the branch of the rotated contour (module docstring).

    >>> from knotobs.numerics import working_precision
    >>> with working_precision(20):
    ...     w = ia_power(CartanData.from_space("S^3", 3), acb(5))     # (5i)^-1
    >>> abs(complex(w.mid()) + 0.2j) < 1e-15
    True
    """
    a = K * d.H / d.P
    ia = acb(0, 1) * a
    if d.r % 2 == 0:
        return ia ** (-(d.r // 2))
    from knotobs.continuation.level import _angle

    u, _ = _angle(d.lr, K)                    # u = exp(i theta); refuses K on the cut
    b = ia * u * u                            # positive up to rounding
    return u ** d.r / b.sqrt() ** d.r


def gaussian_sectors(d: CartanData, K: acb, reduced: bool = True) -> dict[Fraction, acb]:
    """``{cs(u) mod 1: contribution}`` of every ``u in Q/HQ``, ``B_N`` included; the values add up
    to the continued ``Z(K)``.  The caller sets the precision and has checked the size.

    Examples
    --------
    >>> from knotobs.numerics import working_precision
    >>> with working_precision(20):
    ...     s = gaussian_sectors(CartanData.from_space("L(5,1)", 3), acb(5))
    ...     z = complex(sum(s.values(), acb(0)).mid())
    >>> sorted(str(c) for c in s), abs(z - (0.339357973636751 + 0.467086179481358j)) < 1e-12
    (['0', '1/5', '2/5', '3/5', '4/5'], True)

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314; M. Mariño, Commun. Math.
    Phys. 253 (2005) 25–49.
    """
    N, P, H = d.N, d.P, d.H
    pa, pb = d.two_orders()
    pi = arb.pi()
    W = weyl_vectors(N)
    # the K-dependent exponentials exp(i pi P |c|^2/(K H)) of each pair (w1, w2), summed by value of c
    cs_by_c: dict[tuple[Fraction, ...], int] = {}
    for (v1, e1), (v2, e2) in itertools.product(W, W):
        c = tuple(x / pa + y / pb for x, y in zip(v1, v2))
        cs_by_c[c] = cs_by_c.get(c, 0) + e1 * e2
    cvals = [(c, m) for c, m in cs_by_c.items() if m != 0]
    ipi = acb(0, 1) * pi
    E = []
    for c, m in cvals:
        c2 = sum(x * x for x in c)
        E.append((c, m * (ipi * (P * c2.numerator) / (c2.denominator * H) / K).exp()))
    pref = B_N(d, K) * arb(N).sqrt() * ia_power(d, K)
    out: dict[Fraction, acb] = {}
    for u in root_vectors(N, H):
        amp = acb(0)
        for c, e in E:
            x = Fraction(-P) * sum(ci * ui for ci, ui in zip(c, u)) / H      # exp(2 pi i x)
            x = x % 1
            amp += e * (2 * ipi * x.numerator / x.denominator).exp()
        cs = abelian_cs(P, H, u)
        ph = _sym(cs) if reduced else cs
        val = pref * amp * (2 * ipi * K * ph.numerator / ph.denominator).exp()
        key = cs % 1
        out[key] = out.get(key, acb(0)) + val
    return out
