r"""SU(3) partition functions of Seifert manifolds as a cubic convolution over the roots.

The finite Gauss sum over the weight lattice (docs/continuation_sun.md §18.1, CONVENTIONS §9) is

    ``Z_k(M) = B_N(K) K^(-r) sum'_{lam in Lambda/PKQ} h(lam/K)``,
    ``h(z) = exp(-i pi K H |z|^2/P) prod_j Delta(z/p_j) / Delta(z)^(n-2+2g)``.

For SU(N) the quadratic form is a sum over the positive roots, ``|z|^2 = (1/N) sum_{alpha>0}
<alpha, z>^2``, and so is every factor of ``h``: ``h(z) = prod_{alpha>0} phi(<alpha, z>)`` with the
rank-one function

    ``phi(y) = exp(-i pi K H y^2/(N P)) prod_j 2i sin(pi y/p_j) / (2i sin(pi y))^(n-2+2g)``.

The weights left out (on an affine wall) are those where some ``<alpha, lam>`` is divisible by
``K``: a condition on each factor separately.  For SU(3), in the coordinates
``b = (<alpha_1, lam>, <alpha_2, lam>)`` the three roots give ``b_1, b_2, b_1 + b_2``, and with
``M = 6 P K`` the lattice function ``phi'(b) = phi(b/K)`` (``0`` when ``K | b``) is ``M``-periodic
and even.  ``(Z/M)^2`` covers ``Lambda/PKQ`` twelve times, and the convolution theorem turns the
double sum into one sum over the discrete Fourier transform ``Phi(j) = sum_b phi'(b) e^(-2 pi i j b/M)``:

    ``sum'_{lam in Lambda/PKQ} h(lam/K) = (1/12) sum_{b_1, b_2 mod M} phi'(b_1) phi'(b_2) phi'(b_1 + b_2)
                                        = (1/(12 M)) sum_{j mod M} Phi(j)^3``.

``M`` values and one transform of length ``M`` (``acb.dft``, ball arithmetic): the cost grows like
``K log K`` instead of the ``K^2`` weights of the localisation route.  Base genus ``g`` enters as
the power of the sines and the factor ``(-3 K^2)^g`` of ``S_0lam^(-2g)`` (``(N K^r)^g
(-1)^(g |Delta+|)``; for SU(2) it is CONVENTIONS §9's ``(-2K)^g``).  The sum of §18.1 needs the
orders pairwise coprime; other orders are refused here (the localisation route has them).

References
----------
R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (the rank-one Gauss sum);
M. Mariño, Commun. Math. Phys. 253 (2005) 25–49 (the Cartan integrals of simply-laced groups);
the convolution theorem for the discrete Fourier transform (common practice).
"""

from __future__ import annotations

import mpmath
from flint import acb, arb, fmpq

from knotobs.ball_series import bits, to_mpc, working_bits
from knotobs.errors import InvalidSeifertDataError, KnotobsError, NotIntegrableError, PrecisionError
from knotobs.guard import require, seconds_for
from knotobs.precision import check_digits

__all__ = ["convolution_data", "convolution_cost", "convolution_partition_function"]


def convolution_data(space):
    """The Lawrence–Rozansky data (``P``, ``H``, ``phi``, orders) of ``space`` for this route.

    Refuses, naming the reason: ``H = 0``, orders sharing a factor.

    >>> d = convolution_data("Sigma(2,3,5)")
    >>> d.P, d.H, d.genus
    (30, 1, 0)
    """
    from knotobs.evaluation.lr_integral import LRData

    try:
        d = LRData.from_space(space, allow_genus=True, allow_shared=True)
    except KnotobsError as exc:
        raise InvalidSeifertDataError(f"{exc}; the convolution route needs e != 0 (the localisation"
                                      " route has e = 0)") from exc
    if d.shared:
        raise InvalidSeifertDataError(
            f"{d.space}: the orders {', '.join(str(p) for p in d.ps if p > 1)} share a factor; the"
            " convolution route needs pairwise coprime orders (the Gauss sum over the weight lattice"
            " then misses residue terms); the localisation and surgery routes have these spaces")
    return d


def _length(d, K: int) -> int:
    """``M = 6 P K``, the period of ``phi'`` and the length of the transform."""
    return 6 * d.P * K


def convolution_cost(d, k: int, digits: int) -> tuple[float, float, str]:
    """Estimated ``(seconds, megabytes, description)`` of ``Z_k`` by the convolution route.

    Calibrated on Sigma(2,3,5) (2-core machine, 2026): about 1 us per value and factor, and
    ``acb.dft`` of length 1.8e5 at 200 bits in 2.1 s.

    >>> s, mb, what = convolution_cost(convolution_data("Sigma(2,3,5)"), 40, 30)
    >>> s < 1 and "7740" in what
    True
    """
    M = _length(d, k + 3)
    b = bits(digits + 3) + 2 * M.bit_length()
    scale = max(1.0, b / 200.0) ** 1.3
    sec = seconds_for(M * (len(d.pq) + 6) * 2, "python") + 0.7e-6 * M * max(1, M.bit_length()) * scale
    mb = M * (b / 4 + 160) * 4 / 1e6
    return sec, mb, f"a Fourier transform of length {M} = 6 P K (P = {d.P}, K = {k + 3})"


def _phi_values(d, K: int) -> list:
    """``phi'(b)``, ``b = 0 .. 6PK - 1``, at the current precision (module docstring)."""
    P, H = d.P, d.H
    M = _length(d, K)
    deg = len(d.pq) - 2 + 2 * d.genus
    # exp(-i pi H b^2/(3PK)) evaluated afresh for each b (H b^2 reduced mod 6PK): a recurrence
    # g_{b+1} = g_b z^(2b+1) would inflate the balls geometrically
    third = arb(1) / (3 * P * K)
    tables = []
    for p in d.ps:
        period = 2 * K * p                      # sin(pi b/(K p)) has period 2Kp in b
        tables.append((period, [2 * acb(0, 1) * arb(fmpq(t, K * p)).sin_pi() for t in range(period)]))
    den = [acb(0)] + [(2 * acb(0, 1) * arb(fmpq(t, K)).sin_pi()) ** (-deg) if t % K else acb(0)
                      for t in range(1, 2 * K)]
    out = []
    for b in range(M):
        if b % K:
            v = acb(-((H * b * b) % M) * third).exp_pi_i() * den[b % (2 * K)]
            for period, tab in tables:
                v *= tab[b % period]
            out.append(v)
        else:
            out.append(acb(0))
    return out


def _sum(d, K: int) -> acb:
    """``sum'_{lam in Lambda/PKQ} h(lam/K)`` at the current precision."""
    phis = _phi_values(d, K)
    total = acb(0)
    for c in acb.dft(phis):
        total += c * c * c
    return total / (12 * len(phis))


def _prefactor(d, K: int) -> acb:
    """``B_3(K) K^-2 (-3 K^2)^g`` (§18.1 with N = 3: ``exp(i pi sigma dim G/4) = 1``)."""
    phi = d.phi
    b = -acb(arb(fmpq(-2 * phi.numerator, phi.denominator * K))).exp_pi_i() / (18 * d.P)
    return b / (K * K) * acb(-3 * K * K) ** d.genus


def convolution_partition_function(space, level: int, digits: int = 30):
    """SU(3) ``Z_k(M)`` by the cubic convolution over the roots (the ``convolution`` route).

    Parameters
    ----------
    space : str or SeifertManifold
        ``M(g; b; (a_i, b_i))``, ``e != 0``, pairwise coprime orders, any base genus.
    level : int
        ``k >= 1`` (``K = k + 3``).
    digits : int
        Certified digits (the ball of the result is checked).

    Returns
    -------
    FiniteLevelValue
        Numeric only (``exact is None``); normalisation ``Z(S^3) = S_00``, canonical 2-framing.

    Examples
    --------
    >>> from knotobs.localisation import localisation_partition_function
    >>> a = convolution_partition_function("Sigma(2,3,5)", 5, digits=25).numeric
    >>> b = localisation_partition_function("Sigma(2,3,5)", "SU(3)", 5, digits=25).numeric
    >>> abs(a - b) < 1e-23
    True

    References
    ----------
    docs/continuation_sun.md §18.1 and §18.6; Lawrence & Rozansky, Commun. Math. Phys. 205 (1999).
    """
    from knotobs.evaluation.finite_value import numeric_seifert_value

    if isinstance(level, bool) or not isinstance(level, int) or level < 1:
        raise NotIntegrableError(f"level k = {level!r} is not allowed: use an integer k >= 1")
    digits = check_digits(digits)
    d = convolution_data(space)
    sec, mb, what = convolution_cost(d, level, digits)
    require(f"Z of {d.space}, SU(3) at level {level} by the convolution route ({what})",
            seconds=sec, memory_mb=mb, accepted="choose a lower level or another route")
    K = level + 3
    M = _length(d, K)
    val = None
    for extra in (0, 64):
        with working_bits(bits(digits + 3) + 2 * M.bit_length() + extra):
            z = _prefactor(d, K) * _sum(d, K)
            ok = z.rad() <= arb(10) ** (-digits - 1) * max(arb(1), abs(z).mid())
            if ok:
                val = to_mpc(z, digits)
                break
    if val is None:
        raise PrecisionError(f"Z of {d.space}, SU(3) at level {level}: the convolution did not reach"
                             f" {digits} certified digits")
    return numeric_seifert_value(d.space, val, digits, {
        "route": "cubic convolution over the roots (Fourier transform of length 6PK)",
        "group": "SU(3)", "level": level, "terms": M})
