r"""Flat SU(2) connections on Seifert rational homology spheres.

Two independent descriptions are combined.

1. **Representations** (Fintushel & Stern, Proc. London Math. Soc. 61 (1990) 109–137).
   For ``M = M(0; b; (a_1,b_1), (a_2,b_2), (a_3,b_3))`` with
   ``pi_1 = <x_1, x_2, x_3, h | h central, x_j^{a_j} h^{b_j} = 1, x_1 x_2 x_3 = h^b>``
   an irreducible ``rho`` has ``rho(h) = eps = +-1`` and ``rho(x_j)`` conjugate to
   ``diag(e^{i pi l_j/a_j}, e^{-i pi l_j/a_j})`` with ``0 < l_j < a_j`` and
   ``(-1)^{l_j} = eps^{b_j}``; such a triple of conjugacy classes is realised by exactly
   one irreducible class iff the angles ``theta_1 = pi l_1/a_1``, ``theta_2``,
   ``theta_3' = theta_3`` (``eps^b = 1``) or ``pi - theta_3`` (``eps^b = -1``) satisfy the
   strict spherical triangle inequalities
   ``|theta_1 - theta_2| < theta_3' < min(theta_1 + theta_2, 2 pi - theta_1 - theta_2)``.
   Each class carries its own Chern–Simons value, computed from its rotation numbers by the
   formula of :mod:`knotobs.flat.chern_simons` (for Brieskorn spheres it agrees with
   Fintushel–Stern's ``-e^2/(4 a_1 a_2 a_3)`` once the rotation numbers are written in the
   presentation without ``b``), and its own torsion (:mod:`knotobs.flat.torsion`).
2. **Residues** of the Lawrence–Rozansky representation
   (:mod:`knotobs.continuation.asymptotics`): each irreducible sector contributes
   ``exp(2 pi i K cs) q^(-phi/4) A(K)`` with ``cs = -H m^2/(4P) mod 1`` and ``A`` a Laurent
   polynomial in ``K`` (constant for three fibres: the one-loop amplitude
   ``sqrt(torsion)`` times a phase; Freed & Gompf, Commun. Math. Phys. 141 (1991);
   Rozansky, Commun. Math. Phys. 171 (1995)).  The abelian sectors are the
   Gaussian centres ``r``, ``cs = P r^2/H mod 1``.

Sign conventions: ``Z(K) ~ sum_alpha exp(2 pi i K cs(alpha)) ...`` with ``K = k + 2``;
on the Poincaré sphere oriented as the link of ``x^2 + y^3 + z^5 = 0``
(``M(0; -1; (2,1), (3,1), (5,1))``, boundary of the negative E8 plumbing) the two
irreducible connections have ``cs = -1/120`` and ``-49/120`` (``119/120``, ``71/120``
in ``[0, 1)``).  Reversing the orientation negates every ``cs`` and the Casson invariant.

Casson invariant (integral homology spheres; ``lambda(Sigma(2,3,5)) = -1``):
``lambda = lambda_1/6`` from the exact Ohtsuki series (H. Murakami 1994; Ohtsuki 1995),
cross-checked in the tests against ``-#{irreducible classes}/2`` (Fintushel–Stern 1990,
Brieskorn spheres) and ``sigma(Milnor fibre)/8`` (Fintushel–Stern 1990, with Brieskorn's
lattice-point count of the signature).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from fractions import Fraction
from typing import Any

import mpmath
from flint import acb, arb

from knotobs.continuation._num import to_mpc
from knotobs.continuation.asymptotics import Contribution, _saddle_terms, _sector_value, contributions
from knotobs.continuation.level import LRData, _B
from knotobs.continuation.ohtsuki import ohtsuki_series
from knotobs.errors import InvalidSeifertDataError
from knotobs.fibrations.seifert import SeifertManifold, parse_space
from knotobs.flat.characters import irreducible_characters
from knotobs.flat.chern_simons import fintushel_stern_cs  # noqa: F401  (re-exported)
from knotobs.flat.torsion import irreducible_torsion
from knotobs.numerics import working_precision
from knotobs._notebook import NotebookMixin

__all__ = [
    "FlatConnection",
    "FlatTable",
    "flat_connections",
    "irreducible_representations",
    "fintushel_stern_cs",
    "brieskorn_signature",
    "brieskorn_orientation",
]


def brieskorn_orientation(space) -> tuple[tuple[int, int, int], int] | None:
    """``((a_1, a_2, a_3), s)`` with ``M = s * Sigma(a_1, a_2, a_3)``, or ``None``.

    >>> brieskorn_orientation("M(0; -1; (2,1), (3,1), (5,1))")
    ((2, 3, 5), 1)
    >>> brieskorn_orientation("-Sigma(2,3,7)")
    ((2, 3, 7), -1)
    """
    M = parse_space(space)
    orders = M.exceptional_orders
    if len(orders) != 3 or M.h1_order != 1:
        return None
    S = SeifertManifold.from_brieskorn(*orders)
    if M.normal_form() == S.normal_form():
        return orders, 1
    if M.reverse().normal_form() == S.normal_form():
        return orders, -1
    return None  # pragma: no cover - a Seifert ZHS with three fibres is +-Sigma


def irreducible_representations(a: tuple[int, int, int]) -> list[tuple[int, tuple[int, int, int]]]:
    """Irreducible SU(2) classes of ``pi_1 Sigma(a_1, a_2, a_3)`` as ``(eps, (l_1, l_2, l_3))``.

    >>> irreducible_representations((2, 3, 5))
    [(-1, (1, 1, 1)), (-1, (1, 1, 3))]

    References
    ----------
    R. Fintushel and R. J. Stern, Proc. London Math. Soc. 61 (1990) 109–137, §2.
    """
    S = SeifertManifold.from_brieskorn(*a)
    b = S.b
    fib = S.fibers
    out = []
    for eps in (1, -1):
        ranges = []
        for aj, bj in fib:
            par = (bj % 2) if eps == -1 else 0
            ranges.append([l for l in range(1, aj) if l % 2 == par])
        flip = eps == -1 and b % 2 == 1
        for l1 in ranges[0]:
            for l2 in ranges[1]:
                for l3 in ranges[2]:
                    # compare angles as exact fractions of pi
                    t1 = Fraction(l1, fib[0][0])
                    t2 = Fraction(l2, fib[1][0])
                    t3 = Fraction(l3, fib[2][0])
                    if flip:
                        t3 = 1 - t3
                    if abs(t1 - t2) < t3 < min(t1 + t2, 2 - t1 - t2):
                        out.append((eps, (l1, l2, l3)))
    return out


def brieskorn_signature(a: tuple[int, ...]) -> int:
    """Signature of the Milnor fibre of ``z_1^{a_1} + ... + z_n^{a_n}`` (Brieskorn's count).

    Three exponents: ``sigma = #{s in (0,1) U (2,3)} - #{s in (1,2)}`` over
    ``s = sum_j k_j/a_j``, ``0 < k_j < a_j``, i.e. ``sigma = sum (-1)^floor(s)`` over the
    points with non-integer ``s``.

    >>> brieskorn_signature((2, 3, 5))
    -8
    >>> brieskorn_signature((2, 3, 7))
    -8

    References
    ----------
    E. Brieskorn, Invent. Math. 2 (1966) 1–14; F. Hirzebruch and D. Zagier,
    The Atiyah–Singer theorem and elementary number theory (1974).
    """
    from itertools import product

    if len(a) != 3:
        raise InvalidSeifertDataError(f"brieskorn_signature is set up for three exponents, got {a!r}")
    sig = 0
    for ks in product(*[range(1, aj) for aj in a]):
        s = sum(Fraction(k, aj) for k, aj in zip(ks, a))
        if s.denominator == 1:
            continue
        fl = math.floor(s)
        sig += -1 if fl % 2 == 1 else 1
    return sig


@dataclass(frozen=True)
class FlatConnection:
    """One flat SU(2) connection class (or sector) with its Chern–Simons value and one-loop data.

    Attributes
    ----------
    kind : str
        ``"trivial"``, ``"abelian"`` or ``"irreducible"``.
    cs : Fraction
        Chern–Simons invariant mod 1, in ``[0, 1)``.
    multiplicity : int
        Number of classes with this ``cs`` (irreducible, from the representation count)
        or of Gaussian centres merged (abelian: ``r`` and ``|H| - r``).
    rotation : tuple
        ``(eps, (l_1, l_2, l_3))`` representation data (Brieskorn spheres), else ``()``.
    K_power : Fraction
        ``Z_alpha ~ K^K_power``: ``-3/2`` trivial, ``-1/2`` abelian, ``0`` irreducible (three fibres).
    amplitude : mpmath.mpc
        Leading coefficient ``A`` with ``Z_alpha(K) ~ e^{2 pi i K cs} q^{-phi/4} A K^K_power``.
    torsion : mpmath.mpf
        ``|A|^2`` (the square of the one-loop amplitude, Reidemeister-torsion normalised
        so that the irreducible ones of ``Sigma(2,3,5)`` give ``(2/5) sin^2(pi/5)``,
        ``(2/5) sin^2(2 pi/5)``; Freed & Gompf 1991).
    phase : mpmath.mpf
        ``arg(A)/(2 pi)`` in ``(-1/2, 1/2]``.
    """

    kind: str
    cs: Fraction
    multiplicity: int
    rotation: tuple
    K_power: Fraction
    amplitude: mpmath.mpc
    torsion: mpmath.mpf
    phase: mpmath.mpf

    def to_json(self) -> dict[str, Any]:
        return {
            "kind": self.kind,
            "cs": str(self.cs),
            "cs_signed": str(self.cs - 1 if self.cs > Fraction(1, 2) else self.cs),
            "multiplicity": self.multiplicity,
            "rotation_numbers": [list(r[1]) for r in self.rotation] if self.rotation else [],
            "rho_h": [r[0] for r in self.rotation] if self.rotation else [],
            "K_power": str(self.K_power),
            "one_loop": {
                "amplitude": {"re": mpmath.nstr(self.amplitude.real, 15), "im": mpmath.nstr(self.amplitude.imag, 15)},
                "abs": mpmath.nstr(abs(self.amplitude), 15),
                "torsion": mpmath.nstr(self.torsion, 15),
                "phase_over_2pi": mpmath.nstr(self.phase, 15),
            },
        }


@dataclass(frozen=True, repr=False)
class FlatTable(NotebookMixin):
    """Flat connections of a Seifert rational homology sphere, with Casson and Ohtsuki data."""

    space: str
    H: int
    P: int
    phi: Fraction
    connections: tuple[FlatConnection, ...]
    casson: int | Fraction | None
    ohtsuki: tuple[Fraction, ...]
    notes: tuple[str, ...] = field(default_factory=tuple)

    def to_json(self) -> dict[str, Any]:
        return {
            "space": self.space,
            "group": "SU(2)",
            "H1_order": abs(self.H),
            "convention": "Z(K) ~ sum exp(2 pi i K cs) q^(-phi/4) A K^p, K = k + 2, q = exp(2 pi i/K)",
            "phi": str(self.phi),
            "connections": [c.to_json() for c in self.connections],
            "casson": None if self.casson is None else (int(self.casson) if Fraction(self.casson).denominator == 1 else str(self.casson)),
            "casson_normalisation": "lambda(Sigma(2,3,5)) = -1 (link-of-singularity orientation)",
            "ohtsuki": [str(c) for c in self.ohtsuki],
            "ohtsuki_variable": "Z_trivial/Z(S^3) = |H_1|^(-3/2) sum_n c_n (q - 1)^n",
            "notes": list(self.notes),
        }

    def text(self) -> str:
        """The readable table (the one ``knotobs flat`` prints; :func:`knotobs.output.continuation_text.flat_text`)."""
        from knotobs.output.continuation_text import flat_text

        return flat_text(self)


def _amplitude(d: LRData, c: Contribution) -> tuple[mpmath.mpc, Fraction]:
    """Leading ``A`` and power ``p``: ``Z_alpha ~ e^{2 pi i K cs} q^{-phi/4} A K^p``."""
    with working_precision(bits=200):
        if c.kind == "irreducible":
            # A(K) is a Laurent polynomial in K of degree <= deg (pole orders): solve for its
            # coefficients from values at integer K (where the group is one sector)
            deg = max([t.pole_order - 2 if t.kind == "period" else t.pole_order - 1 for t in c.residues] + [0])
            npts = deg + 2
            Ks = [1000 * (i + 1) + 1 for i in range(npts)]
            vals = []
            for K in Ks:
                Ka = acb(K)
                v = _sector_value(d, c, Ka, None)
                v = v / (acb(0, 2) * arb.pi() * Ka * (c.cs.numerator) / c.cs.denominator).exp()
                v = v * (acb(0, 1) * arb.pi() * acb(d.phi.numerator) / d.phi.denominator / (2 * Ka)).exp()
                vals.append(to_mpc(v, 50))
            with working_precision(50):
                A = mpmath.matrix([[mpmath.mpf(K) ** (e - 1) for e in range(npts)] for K in Ks])
                coef = mpmath.lu_solve(A, mpmath.matrix(vals))
                scale = max(abs(x) for x in coef)
                for e in range(npts - 1, -1, -1):
                    if abs(coef[e]) > scale * mpmath.mpf(10) ** -25:
                        return mpmath.mpc(coef[e]), Fraction(e - 1)
            return mpmath.mpc(0), Fraction(0)
        terms = _saddle_terms(d, c.r, 0)
        j, w = terms[0]
        B0 = _B(d, acb(10) ** 30)   # K-independent part of B (q^(-phi/4) -> 1)
        return to_mpc(B0 * w, 15), Fraction(-(2 * j + 1), 2)


def _guard_flat(d: LRData) -> None:
    """Refuse, before any work, a residue decomposition estimated above the limits in force.

    The cost grows like the number ``2P`` of residue points times the pole order (measured:
    about ``2e-3 P`` s with three exceptional fibres, sixteen times more per extra fibre).
    """
    from knotobs.guard import require

    extra = max(0, d.n - 4)
    require(f"flat SU(2) connections of {d.space} by the residue route ({2 * d.P} residue points,"
            f" {d.n} surgery coefficients)",
            seconds=2e-3 * d.P * 16.0 ** extra, memory_mb=1e-3 * d.P * 4.0 ** extra + 50,
            accepted="knotobs flat SPACE --group 'SL(2,C)' lists every flat connection with its CS"
                     " value from the representations, without the residue route")


def flat_connections(space, ohtsuki_order: int = 6) -> FlatTable:
    """Flat SU(2) connections with CS values, one-loop data, Casson invariant and Ohtsuki series.

    Parameters
    ----------
    space : str or SeifertManifold
        A Seifert rational homology sphere, e.g. ``"Sigma(2,3,7)"`` or ``"L(5,1)"``.
    ohtsuki_order : int

    Returns
    -------
    FlatTable

    Examples
    --------
    >>> t = flat_connections("Sigma(2,3,5)")
    >>> [(c.kind, str(c.cs)) for c in t.connections]
    [('trivial', '0'), ('irreducible', '71/120'), ('irreducible', '119/120')]
    >>> t.casson
    -1

    References
    ----------
    R. Fintushel and R. J. Stern, Proc. London Math. Soc. 61 (1990) 109–137;
    D. S. Freed and R. E. Gompf, Commun. Math. Phys. 141 (1991) 79–117;
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314.
    """
    d = LRData.from_space(space)
    _guard_flat(d)
    notes = []
    bo = brieskorn_orientation(d.space)
    M = d.space.normal_form()
    reps_by_cs: dict[Fraction, list] = {}
    if len(M.fibers) == 3:
        # every SU(2) class with its own rotation numbers and CS value (CONVENTIONS §12)
        for ch in irreducible_characters(M):
            if ch.real_form == "SU(2)":
                reps_by_cs.setdefault(ch.cs, []).append((ch.eps, ch.rotation))
        if bo is not None:
            notes.append(f"M = {'-' if bo[1] < 0 else ''}Sigma{bo[0]}; rotation numbers l_j refer to the normal form {M}")
        else:
            notes.append(f"rotation numbers l_j refer to the normal form {M}")
    elif len(d.space.exceptional_orders) > 3:
        notes.append("more than three exceptional fibres: irreducible connections form families of dimension"
                     f" {2 * (len(d.space.exceptional_orders) - 3)}; listed by their CS values (sectors)")
    conns = []
    for c in contributions(d):
        if c.kind == "abelian":
            r2 = abs(d.H) - c.r
            if r2 < c.r:
                continue          # merged with its partner r' = |H| - r
        amp, p = _amplitude(d, c)
        if c.kind == "abelian":
            mult = 2 if abs(d.H) - c.r != c.r else 1
            amp = amp * mult
        with working_precision(20):
            ph = mpmath.arg(amp) / (2 * mpmath.pi) if amp != 0 else mpmath.mpf(0)
            if c.kind == "irreducible" and c.cs in reps_by_cs:
                # one row per connection: its own rotation numbers and torsion
                for eps, l in reps_by_cs.pop(c.cs):
                    tau = irreducible_torsion(M, eps, l, 20)
                    conns.append(FlatConnection(c.kind, c.cs, 1, ((eps, l),), p, amp, mpmath.mpf(tau), ph))
                continue
            mult = 1 if c.kind != "abelian" else (2 if abs(d.H) - c.r != c.r else 1)
            conns.append(FlatConnection(c.kind, c.cs, mult, (), p, amp, abs(amp) ** 2, ph))
    if reps_by_cs:  # pragma: no cover - would signal a mismatch of the two routes
        notes.append(f"representations with cs {sorted(map(str, reps_by_cs))} have no residue sector")
    ser = ohtsuki_series(d, ohtsuki_order)
    casson = None
    if abs(d.H) == 1:
        lam = ser.coefficients[1] / 6 if ohtsuki_order >= 1 else None
        casson = int(lam) if lam is not None and lam.denominator == 1 else lam
    return FlatTable(str(d.space), d.H, d.P, d.phi, tuple(conns), casson, ser.coefficients, tuple(notes))
