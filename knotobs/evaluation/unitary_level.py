"""U(N) Chern–Simons at finite level: SU(N)_k times an abelian factor, for fiber Wilson loops.

Convention (CONVENTIONS §2, §11).  U(N) at level ``k`` is

    U(N)_k = (SU(N)_k x U(1)_{N(k+N)}) / Z_N,        K = k + N,  q = exp(2 pi i/K),

the "canonical" U(N) level, in which a representation ``lam`` (a partition with at most N
rows) is the pair (``lam`` with its full columns removed, U(1) charge ``|lam|``), the U(1)
factor at level ``N K`` has twist ``exp(2 pi i n^2/(2NK))``, and the Z_N quotient
identifies ``(lam, n)`` with the pair shifted by the centre; then the twist is
``q^{C_U(lam)}`` with ``C_U = (kappa + N|lam|)/2`` (the U(N) Casimir of §2) and the quantum
dimensions are those of SU(N).  Sources: M. Mariño, Commun. Math. Phys. 253 (2005) 25–49
(U(N) Chern–Simons with ``q = exp(2 pi i/(k+N))`` and the U(N) Casimir); S. Naculich &
H. Schnitzer, JHEP 06 (2007) 023 (``U(N)_{k,k'} = (SU(N)_k x U(1)_{Nk'})/Z_N`` with
``k' = k + N`` the canonical choice; cited from memory).

Abelian factor.  For a link ``L = L_1 u ... u L_d`` whose linking numbers ``lk_ab`` and
framings ``f_a`` are integers (links in S^3 or in an integral homology sphere), the
normalised U(1)_m Wilson loop with charges ``n_a`` is
``exp(2 pi i (sum_{a<b} n_a n_b lk_ab + sum_a n_a^2 f_a/2)/m)`` (the Gaussian integral of
abelian Chern–Simons theory; E. Witten, Commun. Math. Phys. 121 (1989) §5; common practice),
and the Z_N quotient changes nothing there (``H^1(M; Z_N) = 0``).  So

    W_{U(N)}(L) = W_{SU(N)}(L) * exp(2 pi i (sum_{a<b} n_a n_b lk_ab + sum_a n_a^2 f_a/2)/(N K)).

In S^3 this is checked against the exact U(N) polynomial of Rosso–Jones evaluated at
``q = exp(2 pi i/K)`` (an independent second route).  Manifolds with ``H_1 != 0`` are refused:
there the abelian factor is a Gauss sum over torsion and the quotient matters.

Examples
--------
>>> v = unitary_level_loop("T(2,4)", "U(3)", 3, (1,))
>>> v.details["U(1) level"], v.details["polynomial_check"] < 1e-25
(18, True)
"""

from __future__ import annotations

import dataclasses

from fractions import Fraction
import mpmath

from knotobs.errors import KnotobsError
from knotobs.evaluation.finite_value import FiniteLevelValue
from knotobs.evaluation.level_loops import _is_integer_framing, level_loop
from knotobs.evaluation.rosso_jones import colours_for, rosso_jones
from knotobs.evaluation.surgery import (
    SurgeryPresentation,
    _inverse_matrix,
    fiber_wilson_loop,
    seifert_data,
    seifert_to_surgery,
)
from knotobs.fibrations.seifert import parse_space
from knotobs.fibrations.torus import parse_knot
from knotobs.numerics import working_precision
from knotobs.polynomials.cyclotomic import root_of_unity
from knotobs.representations.groups import parse_group
from knotobs.representations.partitions import as_partition

__all__ = ["unitary_level_loop", "unitary_fiber_loop", "abelian_phase", "UNITARY_CONVENTION"]

#: The convention, as printed in every result's profile.
UNITARY_CONVENTION = "U(N)_k = (SU(N)_k x U(1)_{N(k+N)})/Z_N (Marino 2005; Naculich-Schnitzer 2007)"


def abelian_phase(charges, linking, framings, N: int, K: int) -> Fraction:
    """Turns ``(sum_{a<b} n_a n_b lk_ab + sum_a n_a^2 f_a/2)/(N K)`` of the U(1)_{NK} factor (mod 1).

    >>> abelian_phase([1, 1], [[0, 2], [2, 0]], [0, 0], 3, 6)
    Fraction(1, 9)
    """
    d = len(charges)
    t = Fraction(0)
    for a in range(d):
        t += Fraction(charges[a] ** 2) * Fraction(framings[a]) / 2
        for b in range(a + 1, d):
            t += charges[a] * charges[b] * Fraction(linking[a][b])
    t /= N * K
    return t - (t.numerator // t.denominator)


def _profile(v: FiniteLevelValue, N: int, level: int, turns: Fraction, extra: dict) -> FiniteLevelValue:
    phase = root_of_unity(turns)
    exact = v.exact * phase if v.exact is not None else None
    with working_precision(v.digits + 10):
        numeric = v.numeric * mpmath.expjpi(2 * mpmath.mpf(turns.numerator) / turns.denominator)
    if exact is not None:
        numeric = exact.to_mpc(v.digits)
    else:
        with working_precision(v.digits):
            numeric = +numeric
    details = dict(v.details)
    details.update({"group": f"U({N})", "level": level, "U(1) level": N * (level + N),
                    "quotient": "Z_N", "convention": UNITARY_CONVENTION,
                    "abelian phase (turns)": turns, **extra})
    return FiniteLevelValue(exact=exact, numeric=numeric, digits=v.digits, framing=v.framing,
                            orientation=v.orientation,
                            normalisation=(f"{v.normalisation}; U({N}) at level {level} = (SU({N})_{level} x"
                                           f" U(1)_{N * (level + N)})/Z_{N} (Marino 2005;"
                                           " Naculich-Schnitzer 2007)"), details=details)


def _rank(group) -> int:
    """``N`` from ``"U(N)"``, ``U(N)`` as a Group, or the integer ``N``."""
    if isinstance(group, int) and not isinstance(group, bool):
        return group
    g = parse_group(group)
    if g.kind != "U":
        raise KnotobsError(f"group {group!r} is not U(N): this function computes U(N) at finite level")
    return g.N


def unitary_level_loop(knot: str, group="U(2)", level: int = 1, rep=(1,), framing=None,
                       digits: int = 30) -> FiniteLevelValue:
    """U(N)_k Wilson loop of a torus knot or link ``T(p,q)`` in S^3, normalised by ``Z(S^3)``.

    Parameters
    ----------
    knot : str
        ``T(p,q)``.
    group : str or int
        ``"U(N)"`` (or ``N``).
    level : int
        ``k >= 1``; ``K = k + N``, ``q = exp(2 pi i/K)``.
    rep : partition or one partition per component
        At most ``N`` rows; the SU(N) part must be integrable (``lam_1 - lam_N <= k``).
    framing : None, ``"zero"``, ``"fiber"`` or int
        As in :func:`knotobs.evaluation.level_loops.level_loop` (default zero framing).

    Returns
    -------
    FiniteLevelValue
        With ``details["U(1) level"] = N(k+N)``, ``details["quotient"]``,
        ``details["polynomial_check"]`` (difference to the exact U(N) polynomial at
        ``q = exp(2 pi i/K)``, a second route).

    References
    ----------
    Mariño, Commun. Math. Phys. 253 (2005); Rosso & Jones (1993); CONVENTIONS §2, §3, §11.
    """
    N = _rank(group)
    k = parse_knot(knot)
    cols = colours_for(k, rep)
    for lam in cols:
        if len(as_partition(lam)) > N:
            raise KnotobsError(f"representation {list(lam)} has more than {N} rows: not a U({N}) representation")
    v = level_loop(knot, level, f"SU({N})", list(cols) if len(cols) > 1 else cols[0], "S^3",
                   framing=framing, normalized=True, digits=digits)
    K = level + N
    d = k.components
    lk = [[0 if a == b else k.P * k.Q for b in range(d)] for a in range(d)]
    if framing in (None, "zero"):
        fr = [0] * d
    elif framing == "fiber":
        fr = [k.P * k.Q] * d
    elif _is_integer_framing(framing):
        fr = [int(framing)] * d
    else:  # pragma: no cover - level_loop has refused it
        raise KnotobsError(f"unknown framing {framing!r}")
    charges = [sum(as_partition(c)) for c in cols]
    turns = abelian_phase(charges, lk, fr, N, K)
    out = _profile(v, N, level, turns, {"charges": charges})
    # second route: the exact U(N) polynomial at the root of unity
    f_poly = "fiber" if framing == "fiber" else (int(framing) if _is_integer_framing(framing) else 0)
    poly = rosso_jones(k, parse_group(f"U({N})"), cols, f_poly)
    ref = poly.at_root_of_unity(K, dps=digits + 5)
    with working_precision(digits + 5):
        diff = abs(ref - out.numeric)
    if diff > mpmath.mpf(10) ** (3 - digits) * max(1, abs(ref)):
        raise KnotobsError(  # pragma: no cover - would be a bug
            f"U({N}) gluing and the U({N}) polynomial disagree for {knot} at level {level}: {diff}")
    out.details["polynomial_check"] = float(diff)
    return out


def unitary_fiber_loop(space, group="U(2)", level: int = 1, regular=(), exceptional=None,
                       framing: str = "fiber", digits: int = 30, route: str = "auto") -> FiniteLevelValue:
    """U(N)_k Wilson loops along fibers of a Seifert integral homology sphere (or S^3), normalised.

    The SU(N) part comes from :func:`~knotobs.evaluation.surgery.fiber_wilson_loop`; the
    linking numbers and framings of the lines are read off the plumbing
    (``lk_uv = -(A^{-1})_{uv}`` for the meridians of vertices ``u, v``; Gompf & Stipsicz 1999, §5.1).

    Where ``H_1(M) != 0`` the abelian factor is not a phase: the value comes from
    :func:`knotobs.evaluation.unitary_mtc.unitary_seifert_loop` (the quotient category, and with
    ``route="both"`` also the gauging sum), in the framing ``"fiber"`` and for odd ``k``.  In an
    integral homology sphere ``route="both"`` compares the product formula with the quotient route.

    Raises
    ------
    KnotobsError
        ``H_1(M) != 0`` with ``framing="zero"`` or an even level (a spin theory there).

    Examples
    --------
    >>> w = unitary_fiber_loop("Sigma(2,3,5)", "U(2)", 2, regular=[(1,)])
    >>> w.details["U(1) level"], w.details["linking"]
    (8, [[Fraction(30, 1)]])
    """
    N = _rank(group)
    M = parse_space(space) if isinstance(space, str) else space
    b, fibers = seifert_data(M)
    e0, pq = seifert_to_surgery(b, fibers)
    pres = SurgeryPresentation.from_coefficients(e0, pq)
    A = pres.linking_matrix()
    Ainv = _inverse_matrix(A)
    if route not in ("auto", "both"):
        raise KnotobsError(f"route {route!r}: a U(N) fiber loop takes route 'auto' or 'both'")
    if Ainv is None or any(x.denominator != 1 for row in Ainv for x in row):
        if framing != "fiber":
            raise KnotobsError(
                f"{space} has H_1 != 0: U(N) fiber loops there are computed in the framing 'fiber'"
                " (a core is not null-homologous, so 'zero' is not defined)")
        from knotobs.evaluation.unitary_mtc import unitary_seifert_loop

        w = unitary_seifert_loop(M, f"U({N})", level, regular=list(regular), exceptional=dict(exceptional or {}),
                                 digits=digits, route="quotient" if route == "auto" else "both")
        return dataclasses.replace(w, details={**w.details, "U(1) level": N * (level + N), "quotient": "Z_N",
                                               "convention": UNITARY_CONVENTION})
    exceptional = dict(exceptional or {})
    verts = [0] * len(regular) + [pres.vertex_of(j) for j in exceptional]
    cols = [as_partition(c) for c in regular] + [as_partition(c) for c in exceptional.values()]
    for lam in cols:
        if len(lam) > N:
            raise KnotobsError(f"representation {list(lam)} has more than {N} rows: not a U({N}) representation")
    v = fiber_wilson_loop(M, level, f"SU({N})", regular=list(regular), exceptional=exceptional,
                          normalized=True, digits=digits, framing=framing)
    d = len(verts)
    lk = [[-Ainv[verts[a]][verts[b]] for b in range(d)] for a in range(d)]
    fr = [lk[a][a] if framing == "fiber" else 0 for a in range(d)]
    charges = [sum(c) for c in cols]
    turns = abelian_phase(charges, lk, fr, N, level + N)
    out = _profile(v, N, level, turns, {"charges": charges, "linking": lk})
    if route == "both":
        if framing != "fiber" or level % 2 == 0:
            raise KnotobsError("route 'both' for a U(N) fiber loop needs the framing 'fiber' and an odd level"
                               " (the quotient category is bosonic only then)")
        from knotobs.evaluation.unitary_mtc import unitary_seifert_loop

        w = unitary_seifert_loop(M, f"U({N})", level, regular=list(regular), exceptional=exceptional,
                                 digits=digits, route="quotient")
        with working_precision(digits + 5):
            if abs(w.numeric - out.numeric) > mpmath.mpf(10) ** (2 - digits) * max(1, abs(out.numeric)):
                from knotobs.evaluation.two_routes import RouteMismatchError

                raise RouteMismatchError(f"U({N}) fiber loop: product formula {out.numeric} vs quotient"
                                         f" category {w.numeric}")
        out = dataclasses.replace(out, details={**out.details, "route": "product formula = quotient category"
                                                " (both computed)", "routes": ["product formula", "quotient category"],
                                                "agreement": f"to {digits} digits"})
    return out
