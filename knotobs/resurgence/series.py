r"""The trivial-connection perturbative series and its Borel transform, exactly (CONVENTIONS §12).

For ``M = X(p_1/q_1, ..., p_n/q_n)`` (Lawrence–Rozansky data, :class:`~knotobs.continuation.level.LRData`:
``P = prod p_j``, ``H = P sum q_j/p_j``) the trivial connection contributes the Gaussian integral
at ``z = 0`` of :mod:`knotobs.continuation.level`; with ``h = 2 pi i/K`` it is (module
:mod:`knotobs.continuation.ohtsuki`)

    ``Z_0(K)/Z(S^3) = |H|^(-3/2) E(h) Phi(h)``,   ``E(h) = exp(-phi h/4) (h/2)/sinh(h/2)``,
    ``Phi(h) = sum_k a_k h^k``,   ``a_k = (g_k/g_0) (3/2)_k (-P/H)^k``,

where ``prod_j sin(x/p_j)/sin(x)^(n-2) = sum_k g_k x^(2k+2)``.  ``E`` converges for ``|h| < 2 pi``;
all the divergence sits in ``Phi``.  Its Borel transform, in the normalisation of a Gaussian
integral (``K^(-3/2)`` in front),

    ``B(zeta) = sum_k a_k zeta^k/(3/2)_k = sum_k (g_k/g_0) u^k = G(sqrt u)/(g_0 u)``,   ``u = -P zeta/H``,

``G(x) = prod_j sin(x/p_j)/sin(x)^(n-2)``, so that

    ``Phi(h) = h^(-3/2)/Gamma(3/2) int_0^infinity exp(-zeta/h) zeta^(1/2) B(zeta) d zeta``

along any ray on which the integral converges.  ``B`` is meromorphic; its poles are at
``sqrt u = m pi`` with ``G`` singular there, i.e. at

    ``zeta_m = -pi^2 H m^2/P = 4 pi^2 cs_m``,   ``cs_m = -H m^2/(4P)``,

the (unreduced) Chern–Simons values of the flat connections: ``exp(-zeta_m/h) = exp(2 pi i K cs_m)``.
(L. Rozansky, Commun. Math. Phys. 171 (1995) 279–322; S. Gukov, M. Mariño and P. Putrov,
arXiv:1605.07615, §3; J. E. Andersen and W. E. Mistegård, arXiv:1811.05376.)
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from knotobs.continuation.level import LRData
from knotobs.errors import SizeLimitError

__all__ = ["BorelSeries", "borel_series", "MAX_BOREL_ORDER"]

#: Largest number of exact coefficients computed.
MAX_BOREL_ORDER = 400


def _q(x) -> Fraction:
    return Fraction(int(x.p), int(x.q))


@dataclass(frozen=True)
class BorelSeries:
    """Exact coefficients of ``Phi(h) = sum a_k h^k`` and of its Borel transform ``B = sum b_k zeta^k``.

    Attributes
    ----------
    space : str
    P, H : int
        Lawrence–Rozansky data; ``ps`` the ``p_j`` (including 1 for the integer ``b``).
    a, b : tuple of Fraction
        ``a_k`` and ``b_k = a_k/(3/2)_k`` for ``k = 0..order``.
    """

    space: str
    P: int
    H: int
    ps: tuple[int, ...]
    phi: Fraction
    a: tuple[Fraction, ...]
    b: tuple[Fraction, ...]

    @property
    def order(self) -> int:
        return len(self.a) - 1


def borel_series(space, order: int = 40) -> BorelSeries:
    """Exact series ``Phi`` and Borel coefficients to ``order``.

    Examples
    --------
    >>> s = borel_series("Sigma(2,3,5)", 3)
    >>> [str(x) for x in s.a]
    ['1', '-539/120', '982921/28800', '-3764521619/10368000']

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314, §4; CONVENTIONS §12.
    """
    from flint import fmpq, fmpq_poly

    if not isinstance(order, int) or isinstance(order, bool) or not 0 <= order <= MAX_BOREL_ORDER:
        raise SizeLimitError(f"order = {order!r}: give an integer between 0 and {MAX_BOREL_ORDER}")
    d = space if isinstance(space, LRData) else LRData.from_space(space)
    L = order + 1                          # series in y = x^2, y^0 .. y^order

    def trunc(f):
        return fmpq_poly(f.coeffs()[:L]) if f.degree() >= L else f

    def sinc(c: Fraction):
        """``sin(c x)/(c x)`` in ``y = x^2``."""
        out, term = [], Fraction(1)
        for k in range(L):
            if k:
                term *= -c * c / ((2 * k) * (2 * k + 1))
            out.append(fmpq(term.numerator, term.denominator))
        return fmpq_poly(out)

    def inverse(f):
        g = fmpq_poly([1 / f[0]])
        prec = 1
        while prec < L:
            prec = min(2 * prec, L)
            g = fmpq_poly((g * (2 - f * g)).coeffs()[:prec])
        return g

    num = fmpq_poly([1])
    for p in d.ps:
        num = trunc(num * sinc(Fraction(1, p)))
    m = d.n - 2
    if m != 0:
        s1 = sinc(Fraction(1))
        den = fmpq_poly([1])
        for _ in range(abs(m)):
            den = trunc(den * s1)
        num = trunc(num * inverse(den)) if m > 0 else trunc(num * den)
    ratios = [_q(num[k]) for k in range(order + 1)]           # g_k/g_0
    c = Fraction(-d.P, d.H)
    b = []
    a = []
    poch = Fraction(1)
    ck = Fraction(1)
    for k in range(order + 1):
        if k:
            poch *= Fraction(2 * k + 1, 2)
            ck *= c
        b.append(ratios[k] * ck)
        a.append(ratios[k] * ck * poch)
    return BorelSeries(str(d.space), d.P, d.H, d.ps, d.phi, tuple(a), tuple(b))
