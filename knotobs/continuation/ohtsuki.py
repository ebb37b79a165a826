r"""The trivial-connection perturbative series (Ohtsuki series) of Seifert rational homology spheres.

Derivation (exact, rational arithmetic)
---------------------------------------
In the Lawrence–Rozansky representation (:mod:`knotobs.continuation.level`) the
trivial flat connection is the Gaussian integral at ``z = 0``,
``B(K) int_L exp(-i pi K H z^2/(2P)) G(z) dz``.  With ``x = pi z`` and

    ``prod_j sin(x/p_j) / sin(x)^(n-2) = sum_k g_k x^(2k+2)``     (``g_0 = 1/P``, ``g_k`` rational),

the Gaussian moments ``int z^(2k+2) exp(-pi K |H| z^2/(2P)) dz`` give, after dividing by
``Z(S^3) = sqrt(2/K) sin(pi/K)`` and writing ``h = 2 pi i/K``:

    ``tau_0 = Z_0/Z(S^3) = |H|^(-3/2) exp(-phi h/4) (h/2)/sinh(h/2) * sum_k (g_k/g_0) (3/2)_k (-P h/H)^k``

(``(a)_k`` the rising factorial).  Every coefficient is rational; substituting
``h = log(1 + x)``, ``x = q - 1``, gives the Ohtsuki series
``tau_0 = |H|^(-3/2) sum_n lambda_n (q - 1)^n``.  For integral homology spheres
(``|H| = 1``) ``lambda_0 = 1`` and ``lambda_1 = 6 lambda(M)`` with ``lambda`` the
Casson invariant normalised so that ``lambda(Sigma(2,3,5)) = -1`` for the Poincaré
sphere oriented as the link of ``x^2 + y^3 + z^5 = 0`` (H. Murakami, Math. Proc.
Camb. Phil. Soc. 115 (1994) 253–281; T. Ohtsuki, Math. Proc. Camb. Phil. Soc. 117
(1995) 83–112; docs/conventions.md §9).  The series is the asymptotic expansion of the
trivial-connection contribution only; it diverges factorially
(L. Rozansky, Commun. Math. Phys. 171 (1995) 279–322).
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction
from math import factorial

from knotobs.continuation.level import LRData
from knotobs.errors import SizeLimitError

__all__ = ["ohtsuki_series", "OhtsukiSeries", "trivial_h_series", "MAX_ORDER"]

#: Largest order accepted.
MAX_ORDER = 60


def _check_order(order: int) -> int:
    if not isinstance(order, int) or isinstance(order, bool) or order < 0:
        raise SizeLimitError(f"order = {order!r} must be a non-negative integer")
    if order > MAX_ORDER:
        raise SizeLimitError(f"order = {order} is above the limit {MAX_ORDER}")
    return order


# ------------------------------------------------------------------ rational power series
def _mul(a: list[Fraction], b: list[Fraction], n: int) -> list[Fraction]:
    out = [Fraction(0)] * n
    for i, ai in enumerate(a[:n]):
        if ai:
            for j, bj in enumerate(b[: n - i]):
                if bj:
                    out[i + j] += ai * bj
    return out


def _inv(a: list[Fraction], n: int) -> list[Fraction]:
    out = [Fraction(0)] * n
    out[0] = 1 / a[0]
    for k in range(1, n):
        s = sum((a[j] * out[k - j] for j in range(1, min(k, len(a) - 1) + 1)), Fraction(0))
        out[k] = -s / a[0]
    return out


def _exp(a: list[Fraction], n: int) -> list[Fraction]:
    """``exp(a)`` for ``a[0] = 0``."""
    a = list(a[:n]) + [Fraction(0)] * max(0, n - len(a))
    out = [Fraction(1)] + [Fraction(0)] * (n - 1)
    for k in range(1, n):
        out[k] = sum((j * a[j] * out[k - j] for j in range(1, k + 1)), Fraction(0)) / k
    return out


def _sinc_series(c: Fraction, n: int) -> list[Fraction]:
    """``sin(c y)/(c y)`` as a series in ``y^2`` (``n`` terms)."""
    return [Fraction((-1) ** k) * c ** (2 * k) / factorial(2 * k + 1) for k in range(n)]


def _g_ratios(d: LRData, n: int) -> list[Fraction]:
    """``g_k/g_0`` for ``k < n`` (series in ``y = x^2``)."""
    s = [Fraction(1)] + [Fraction(0)] * (n - 1)
    for p in d.ps:
        s = _mul(s, _sinc_series(Fraction(1, p), n), n)
    m = d.n - 2
    sx = _sinc_series(Fraction(1), n)
    if m > 0:
        den = [Fraction(1)] + [Fraction(0)] * (n - 1)
        for _ in range(m):
            den = _mul(den, sx, n)
        s = _mul(s, _inv(den, n), n)
    elif m < 0:
        for _ in range(-m):
            s = _mul(s, sx, n)
    return s


def trivial_h_series(space, order: int) -> list[Fraction]:
    """Coefficients ``c_j`` of ``|H|^(3/2) tau_0 = sum_j c_j h^j``, ``h = 2 pi i/K``, ``j <= order``.

    >>> trivial_h_series("S^3", 3)
    [Fraction(1, 1), Fraction(0, 1), Fraction(0, 1), Fraction(0, 1)]

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314, §4.
    """
    order = _check_order(order)
    d = space if isinstance(space, LRData) else LRData.from_space(space)
    n = order + 1
    g = _g_ratios(d, n)
    c = Fraction(-d.P, d.H)
    poch = Fraction(1)
    S = []
    for k in range(n):
        if k > 0:
            poch *= Fraction(2 * k + 1, 2)
        S.append(g[k] * poch * c ** k)
    # exp(-phi h/4)
    E = _exp([Fraction(0), -d.phi / 4], n)
    # (h/2)/sinh(h/2) = 1/(sum (h/2)^(2k)/(2k+1)!)
    sh = [Fraction(0)] * n
    for k in range(0, n, 2):
        sh[k] = Fraction(1, 2 ** k * factorial(k + 1))
    return _mul(_mul(S, E, n), _inv(sh, n), n)


@dataclass(frozen=True)
class OhtsukiSeries:
    """``tau_0 = Z_0/Z(S^3) = |H|^(-3/2) sum_n coefficients[n] (q - 1)^n``.

    Attributes
    ----------
    space : str
    H : int
        ``|H_1|`` up to sign (``H > 0`` for the orientation of a singularity link).
    coefficients : tuple of Fraction
    """

    space: str
    H: int
    coefficients: tuple[Fraction, ...]

    def to_json(self) -> dict:
        return {
            "space": self.space,
            "variable": "q - 1, q = exp(2 pi i/K)",
            "normalisation": f"Z_trivial/Z(S^3) = |H_1|^(-3/2) * sum_n c_n (q-1)^n, |H_1| = {abs(self.H)}",
            "coefficients": [str(c) for c in self.coefficients],
        }


def ohtsuki_series(space, order: int = 6) -> OhtsukiSeries:
    """Exact coefficients of the trivial-connection series in ``q - 1``.

    Parameters
    ----------
    space : str or SeifertManifold
        A Seifert rational homology sphere.
    order : int
        Highest power of ``q - 1``.

    Returns
    -------
    OhtsukiSeries

    Examples
    --------
    >>> s = ohtsuki_series("Sigma(2,3,5)", 3)
    >>> [str(c) for c in s.coefficients]
    ['1', '-6', '45', '-464']
    >>> s.coefficients[1] / 6                     # Casson invariant lambda(Sigma(2,3,5)) = -1
    Fraction(-1, 1)

    References
    ----------
    T. Ohtsuki, Math. Proc. Camb. Phil. Soc. 117 (1995) 83–112; H. Murakami, Math. Proc.
    Camb. Phil. Soc. 115 (1994) 253–281; R. Lawrence and L. Rozansky, Commun. Math. Phys.
    205 (1999) 287–314.
    """
    order = _check_order(order)
    d = space if isinstance(space, LRData) else LRData.from_space(space)
    n = order + 1
    ch = trivial_h_series(d, order)
    # h = log(1 + x) = sum (-1)^(k+1) x^k / k
    L = [Fraction(0)] + [Fraction((-1) ** (k + 1), k) for k in range(1, n)]
    out = [Fraction(0)] * n
    Lp = [Fraction(1)] + [Fraction(0)] * (n - 1)
    for j in range(n):
        if j > 0:
            Lp = _mul(Lp, L, n)
        if ch[j]:
            for i in range(n):
                out[i] += ch[j] * Lp[i]
    return OhtsukiSeries(str(d.space), d.H, tuple(out))
