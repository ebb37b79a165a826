r"""Complex level: invariants at ``q = exp(2 pi i/K)`` for complex ``K``, and the analytic
continuation in ``K`` of SU(2) partition functions of Seifert manifolds.

Conventions
-----------
SU(2) at level ``k`` has shifted level ``K = k + 2`` and ``q = exp(2 pi i/K)``
(docs/conventions.md §1).  Functions take either ``level=k`` or ``K=``; a complex
``level`` means ``K = level + 2``.  Partition functions are normalised by
``Z(S^3) = S_11``, ``Z(S^2 x S^1) = 1`` in the canonical 2-framing, exactly as the
finite-level routes of :mod:`knotobs.evaluation` (CONVENTIONS §9).

The Lawrence–Rozansky representation
------------------------------------
``M = X(p_1/q_1, ..., p_n/q_n)`` (:meth:`SeifertManifold.surgery_presentation`),
``P = prod p_j``, ``H = P sum q_j/p_j`` (``H != 0``), ``sigma = sign H``.  With

    ``G(z) = prod_j 2i sin(pi z/p_j) / (2i sin(pi z))^(n-2)``,   ``h(z) = exp(-i pi K H z^2/(2P)) G(z)``,

the finite Gauss sum of CONVENTIONS §9 is ``Z = (B/K) sum'_{beta mod 2PK} h(beta/K)``
with ``B = -(4 sqrt P)^-1 exp(3 pi i sigma/4) q^(-phi/4)``.  Summing the residues
of ``h(z)/(1 - exp(-2 pi i sigma K z))`` over the parallelogram spanned by a line
``L`` through 0 and ``L + 2P`` and using ``h(z + 2P) = exp(-2 pi i K H z) h(z)``
(integer ``K``) gives the integral-plus-residues form (R. Lawrence and
L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314, §3):

    ``Z(K) = B(K) [ sum_{r=0}^{|H|-1} int_L h(z) exp(-2 pi i sigma K r z) dz
                   - 2 pi i sigma sum_{m=1}^{2P-1} Res_{z=m} h(z) / (1 - exp(-2 pi i sigma K (z-m))) ]``

(the residue sum is absent for ``n <= 2``, where ``G`` is entire).  Every piece is
holomorphic in ``K`` (for integer ``K`` the factor ``exp(-2 pi i sigma K (z - m))``
equals ``exp(-2 pi i sigma K z)``), so the right-hand side *defines* the
continuation; it equals the finite value at every integer ``K >= 2``.  Completing
the square, the ``r``-th integral is ``exp(2 pi i K P r^2/H)`` times a Gaussian
integral centred at ``z = -2 P r/|H|``; the contour is moved there (picking up
the residues of ``G`` at the integers passed) so that nothing cancels
catastrophically.  The contour ``L`` has direction ``exp(i theta)``,
``theta = -sigma pi/4 - arg(K)/2``; this keeps the Gaussian decaying and is
allowed for ``arg K`` in ``(-pi/2, pi)`` (``sigma = 1``) or ``(-pi, pi/2)``
(``sigma = -1``): the continuation is holomorphic in ``K`` on the plane cut along
the ray ``arg K = -sigma pi/2``.

The integrals are done with the trapezoid rule on the steepest-descent line
(exponentially convergent for an integrand analytic in a strip); each value is
computed twice with different steps, cut-offs and precisions and must agree to
the requested digits.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction
from typing import Any

import mpmath
from flint import acb

from knotobs.ball_series import bits, checked, parse_complex, to_acb, to_mpc, working_bits
from knotobs.errors import KnotobsError, PrecisionError
from knotobs.evaluation.lr_integral import (  # noqa: F401  (the integral form; re-exported)
    DomainError,
    LRData,
    ResidueTerm,
    _B,
    _G,
    _G_series,
    _Z_acb,
    _angle,
    _phase,
    _quadrature,
    _residue_value,
    _saddle_integral,
    _sectors_acb,
    _sym,
    continuation_cost,
    require_continuation,
    residue_terms,
)
from knotobs.numerics import working_precision
from knotobs.precision import certified_parts, check_digits
from knotobs.fibrations.seifert import parse_space
from knotobs.polynomials.laurent import Laurent
from knotobs._notebook import NotebookMixin

__all__ = [
    "LRData",
    "ContinuedValue",
    "resolve_K",
    "evaluate_polynomial",
    "continued_partition_function",
    "continued_Z",
    "residue_terms",
    "ResidueTerm",
    "DomainError",
    "sector_values",
    "require_continuation",
    "continuation_cost",
]


# ---------------------------------------------------------------------------
# levels


def resolve_K(level=None, K=None, N: int = 2) -> mpmath.mpc:
    """Shifted level ``K`` from ``level = k`` (``K = k + N``) or from ``K`` itself.

    Both may be complex numbers or strings such as ``"7.5+0.3i"``.

    >>> resolve_K(level="7.5+0.3i")
    mpc(real='9.5', imag='0.29999999999999999')
    >>> resolve_K(K=5)
    mpc(real='5.0', imag='0.0')
    >>> resolve_K()
    Traceback (most recent call last):
    ...
    knotobs.evaluation.lr_integral.DomainError: give the level k (K = k + 2) or the shifted level K
    """
    if (level is None) == (K is None):
        raise DomainError(f"give the level k (K = k + {N}) or the shifted level K" if level is None
                          else "give either level= or K=, not both")
    if K is not None:
        Kv = parse_complex(K, "K")
    else:
        Kv = parse_complex(level, "level") + N
    if Kv == 0:
        raise DomainError(f"K = 0 (level k = {-N}) is not allowed: q = exp(2 pi i/K) is undefined")
    if not (mpmath.isfinite(Kv.real) and mpmath.isfinite(Kv.imag)) or abs(Kv) > mpmath.mpf(10) ** 100:
        given = K if K is not None else level
        raise DomainError(f"{'K' if K is not None else 'level'} = {given!s}: |K| (K = k + N) must be at most"
                          " 10^100")
    return Kv


def evaluate_polynomial(poly: Laurent, *, K=None, level=None, q=None, N: int = 2, digits: int = 30) -> mpmath.mpc:
    """Value of an exact Laurent polynomial at ``q = exp(2 pi i/K)`` (complex ``K``) or at any ``q``.

    Rational powers ``q^(a/b)`` are ``exp(2 pi i a/(b K))`` on the ``K`` route and use the
    principal logarithm of ``q`` on the ``q`` route.  The value is computed at two
    precisions, which must agree to ``digits`` digits.

    Parameters
    ----------
    poly : Laurent
        The exact invariant (e.g. ``jones("T(2,3)").value``, variable ``t = q^-1``:
        evaluate ``poly`` in its own variable).
    K, level : complex or str
        ``K`` or ``level`` (``K = level + N``); e.g. ``"7.5+0.3i"``.
    q : complex or str
        Evaluate directly at this ``q`` (any modulus, ``q != 0``).
    digits : int

    Examples
    --------
    >>> from knotobs.evaluation.families import jones
    >>> V = jones("T(2,3)").value                       # t + t^3 - t^4
    >>> z = evaluate_polynomial(V, q="0.5")             # at t = 0.5
    >>> mpmath.nstr(z.real, 10)
    '0.5625'
    >>> z = evaluate_polynomial(V, K="7.5+0.3i", digits=20)
    >>> abs(z - (V.at_root_of_unity("7.5+0.3j", dps=25))) < 1e-14
    True

    References
    ----------
    E. Witten, Commun. Math. Phys. 121 (1989) 351–399 (``q = exp(2 pi i/(k+2))``).
    """
    if not isinstance(poly, Laurent):
        raise KnotobsError(f"expected an exact Laurent polynomial, got {type(poly).__name__}")
    digits = check_digits(digits)
    if q is not None:
        if K is not None or level is not None:
            raise DomainError("give q, or K/level, not both")
        if parse_complex(q, "q") == 0:
            raise DomainError("q = 0 is not allowed for a Laurent polynomial")

        def comp(d):
            # q is read again at this precision: both runs start from the text the user gave
            with working_precision(d + 10):
                return poly.evaluate(parse_complex(q, "q"), dps=d)
    else:
        resolve_K(level, K, N)

        def comp(d):
            with working_precision(d + 10):
                return poly.evaluate(log_x=2j * mpmath.pi / resolve_K(level, K, N), dps=d)

    z1 = mpmath.mpc(comp(digits + 5))
    z2 = mpmath.mpc(comp(digits + 15))
    with working_precision(digits + 10):
        if abs(z1 - z2) > mpmath.mpf(10) ** (-digits) * max(abs(z2), 1):
            raise PrecisionError(f"polynomial value not stable to {digits} digits; request fewer digits")
    with working_precision(digits):
        return +z2


def sector_values(space, K, digits: int = 30, phases: str = "reduced") -> dict[Fraction, mpmath.mpc]:
    """The continued ``Z(K)`` split into its flat-connection sectors, keyed by CS value mod 1.

    Each value is holomorphic in ``K``; their sum is :func:`continued_partition_function`.
    With the reduced phases (default) the residue groups that are not flat connections
    cancel identically, so the keys are exactly the Chern–Simons values of the trivial,
    abelian and irreducible flat connections.

    Examples
    --------
    >>> v = sector_values("Sigma(2,3,5)", 5, digits=20)
    >>> sorted(str(cs) for cs in v)
    ['0', '119/120', '71/120']
    >>> abs(sum(v.values()) - continued_Z("Sigma(2,3,5)", 5, 20)) < 1e-12
    True

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (the decomposition);
    L. Rozansky, Commun. Math. Phys. 171 (1995) 279–322 (its identification with flat connections).
    """
    if phases not in PHASES:
        raise DomainError(f"phases = {phases!r}: use one of {', '.join(PHASES)}")
    digits = check_digits(digits)
    d = LRData.from_space(space)
    Kv = resolve_K(K=K)
    require_continuation(d, Kv, digits)

    def run(dg):
        with working_bits(bits(dg)):
            # K is read again at this precision, so the two runs are independent
            return _sectors_acb(d, to_acb(resolve_K(K=K)), dg, phases == "reduced")

    lo, hi = run(digits + 3), run(digits + 12)
    keep = set(hi)
    if phases == "reduced":
        # residue groups that cancel at every integer K cancel identically once the phases
        # are reduced: only the flat connections of the manifold remain
        from knotobs.continuation.asymptotics import contributions

        keep = {c.cs for c in contributions(d.space)}
        scale = max([abs(to_mpc(v, 15)) for v in hi.values()] + [mpmath.mpf(1)])
        for cs, v in hi.items():
            if cs not in keep and abs(to_mpc(v, 15)) > mpmath.mpf(10) ** (-digits) * scale:
                raise PrecisionError(  # pragma: no cover - would contradict the decomposition
                    f"sector cs = {cs} of Z({d.space}) should vanish but is {mpmath.nstr(to_mpc(v, 15), 5)}"
                )
    out = {}
    for cs in sorted(keep):
        def pick(dg, cs=cs):
            return (lo if dg == digits + 3 else hi).get(cs, acb(0))

        out[cs] = checked(pick, digits, f"sector cs = {cs} of Z({d.space}) at K = {mpmath.nstr(Kv, 10)}")
    return out


@dataclass(frozen=True, repr=False)
class ContinuedValue(NotebookMixin):
    """``Z(K)`` at a complex shifted level, with its pieces and profile.

    Attributes
    ----------
    numeric : mpmath.mpc
        Correct to ``digits`` digits (absolute below 1, relative above), confirmed by two
        discretisations.
    K : mpmath.mpc
        Shifted level ``K = k + 2``.
    space : str
    pieces : dict
        ``"integral"`` (the Gaussian integrals, i.e. trivial/abelian saddles) and
        ``"residues"`` (the exact residue terms), as mpc; they add up to ``numeric``.
    """

    numeric: mpmath.mpc
    digits: int
    K: mpmath.mpc
    space: str
    pieces: dict = field(default_factory=dict, compare=False)
    notes: tuple[str, ...] = ()

    def to_json(self) -> dict[str, Any]:
        return {
            "quantity": "partition-function",
            "group": "SU(2)",
            "space": self.space,
            "K": {"re": mpmath.nstr(self.K.real, 15), "im": mpmath.nstr(self.K.imag, 15)},
            "level": {"re": mpmath.nstr(self.K.real - 2, 15), "im": mpmath.nstr(self.K.imag, 15)},
            "numeric": {**_certified_json(self.numeric, self.digits), "digits": self.digits},
            "pieces": {k: _certified_json(v, self.digits) for k, v in self.pieces.items()},
            "route": "Lawrence-Rozansky integral plus residues (analytic continuation in K)",
            "normalisation": "Z(S^3) = S_11, Z(S^2 x S^1) = 1, canonical 2-framing",
            "notes": list(self.notes),
        }


PHASES = ("reduced", "lawrence-rozansky")


def _certified_json(z, digits: int) -> dict[str, str]:
    re_, im_ = certified_parts(z, digits)
    return {"re": re_, "im": im_}


def continued_partition_function(space, level=None, *, K=None, digits: int = 30,
                                 phases: str = "reduced", progress=None) -> ContinuedValue:
    """SU(2) partition function of a Seifert rational homology sphere at complex level.

    Parameters
    ----------
    space : str or SeifertManifold
        E.g. ``"Sigma(2,3,5)"``, ``"L(5,1)"``, ``"M(0; -1; (2,1), (3,1), (5,1))"``.
    level, K : complex or str
        ``level = k`` (``K = k + 2``) or ``K``; e.g. ``level="7.5+0.3i"``.
    digits : int
        Correct digits of the result.
    phases : ``"reduced"`` (default) or ``"lawrence-rozansky"``
        Every piece of the representation carries a phase ``exp(2 pi i K x)`` with ``x``
        rational (a Chern–Simons value).  ``"reduced"`` takes ``x`` mod 1 in
        ``(-1/2, 1/2]``; ``"lawrence-rozansky"`` keeps ``x`` as it comes out of the
        residue calculus.  Both agree at every integer ``K`` and are holomorphic; the
        reduced one grows at most like ``exp(pi |Im K|)`` times a power of ``|K|``, so it is
        the continuation of smallest exponential type (Carlson's theorem: two
        continuations of type below ``pi`` in a half-plane that agree at the integers are
        equal), while the unreduced one grows like ``exp(pi m^2 |Im K|/(2P))``.

    progress : callable, optional
        ``progress(done, total)`` after each Gaussian integral and residue sum of both runs
        (the command line shows it on a terminal).

    Returns
    -------
    ContinuedValue

    Notes
    -----
    At integer ``K >= 2`` the value is the finite-level ``Z_{K-2}(M)`` of
    :func:`knotobs.evaluation.surgery.partition_function`; in between it is the
    Lawrence–Rozansky continuation described in the module docstring, with the
    phases chosen by ``phases``.

    Examples
    --------
    >>> z = continued_partition_function("Sigma(2,3,5)", K=5, digits=20)
    >>> from knotobs.evaluation.surgery import partition_function
    >>> abs(z.numeric - partition_function(parse_space("Sigma(2,3,5)"), level=3).numeric) < 1e-18
    True
    >>> w = continued_partition_function("Sigma(2,3,5)", level="7.5+0.3i", digits=15)
    >>> w.to_json()["numeric"]["digits"]
    15

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314.
    """
    if phases not in PHASES:
        raise DomainError(f"phases = {phases!r}: use one of {', '.join(PHASES)}")
    digits = check_digits(digits)
    d = LRData.from_space(space, allow_genus=True, allow_shared=True)
    Kv = resolve_K(level, K)
    require_continuation(d, Kv, digits)
    holder = {}
    steps = {"done": 0, "total": 2 * (abs(d.H) + 1)}

    def tick():
        steps["done"] += 1
        if progress is not None:
            progress(steps["done"], steps["total"])

    def comp(dg):
        with working_bits(bits(dg)):
            # the level is read again at this precision, so the two runs are independent
            Ka = to_acb(resolve_K(level, K))
            z, pieces = _Z_acb(d, Ka, dg, phases == "reduced", tick)
            holder["pieces"] = pieces
            return z

    val = checked(comp, digits, f"Z({d.space}) at K = {mpmath.nstr(Kv, 10)}")
    pieces = {k: to_mpc(v, digits) for k, v in holder["pieces"].items()}
    notes = []
    if Kv.imag == 0 and Kv.real == int(Kv.real):
        notes.append("integer K: equals the finite-level value Z_k with k = K - 2")
    return ContinuedValue(val, digits, Kv, str(d.space), pieces, tuple(notes))


def continued_Z(space, K, digits: int = 30, phases: str = "reduced") -> mpmath.mpc:
    """Shorthand: ``continued_partition_function(space, K=K, digits=digits).numeric``.

    >>> abs(continued_Z("S^3", 5, 20) - mpmath.sqrt(mpmath.mpf(2)/5) * mpmath.sin(mpmath.pi/5)) < 1e-14
    True
    """
    return continued_partition_function(space, K=K, digits=digits, phases=phases).numeric
