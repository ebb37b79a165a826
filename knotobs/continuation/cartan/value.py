r"""``Z(K)`` of SU(N) Chern–Simons theory on a Seifert manifold at complex shifted level ``K``.

CONVENTIONS §18 (docs/continuation_sun.md).  The finite-level value is the Gauss sum over the
weight lattice of :mod:`.data`.  With at most two exceptional orders ``> 1`` (the lens spaces)
its integrand is entire, and Lawrence–Rozansky's argument gives ``|H|^r`` Gaussian integrals over
the rotated Cartan and no residues: closed form (:mod:`.gaussian`) or trapezoid rule
(:mod:`.quadrature`).  For SU(3) with three exceptional orders the integrand has poles on the root
hyperplanes, and :mod:`.poles` adds the line integrals of residues and the iterated residues
(§18.7, ``method="residues"``; ``"auto"`` picks it).  Each route runs twice (``digits + 3`` and
``digits + 12`` digits, with different steps and cut-offs) and the two runs must agree.

Orders sharing a factor (SU(3)): the sum splits into cosets of period ``L = lcm p_j``, each
summed by the same formula (§18.8); base genus ``g >= 1`` and four or more fibers give poles of
higher order (§18.9).  Refused, with a message naming the case: ``H = 0``, poles for ``N >= 4``
(three or more exceptional orders or base genus ``g >= 1``)
(docs/continuation_sun.md §18.4), ``K`` on the cut of §18.7.  SU(2) on every Seifert rational
homology sphere with coprime orders is :func:`knotobs.continuation.level.continued_partition_function`."""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from fractions import Fraction
from typing import Any

import mpmath
from flint import acb, arb

from knotobs._notebook import NotebookMixin
from knotobs.continuation._num import ball_seconds, bits, checked, to_acb, to_mpc, working_bits
from knotobs.continuation.cartan.data import B_N, CartanData, PolesNotCoveredError
from knotobs.continuation.cartan.gaussian import abelian_cs_values, gaussian_sectors, gaussian_terms
from knotobs.continuation.cartan.poles import pole_cost, pole_domain, pole_line_count, pole_line_nodes, pole_range_digits, pole_sum_sectors
from knotobs.continuation.cartan.quadrature import quadrature_nodes, quadrature_sectors
from knotobs.continuation.level import PHASES, DomainError, resolve_K
from knotobs.errors import KnotobsError, PrecisionError
from knotobs.guard import current_limits, require
from knotobs.paired_runs import run_both, second_core
from knotobs.precision import certified_parts, check_digits
from knotobs.representations.groups import parse_group

__all__ = ["CartanContinuedValue", "continued_sun_partition_function", "continued_sun_Z",
           "continued_sun_sectors", "continuation_sun_cost", "continued_sun_seconds", "METHODS"]

#: ``closed``: the Gaussian integrals in closed form; ``quadrature``: the trapezoid rule on the
#: rotated Cartan; ``both``: both, compared to the requested digits (spaces without poles);
#: ``residues``: the two-family Lawrence–Rozansky formula with its line integrals and residues
#: (SU(3) with three or more exceptional orders, :mod:`.poles`); ``auto``: ``closed`` without
#: poles, ``residues`` with them.
METHODS = ("auto", "closed", "quadrature", "both", "residues")

#: At most this many trapezoid nodes per run (rank ``r`` grids grow like ``(2M+1)^r``).
MAX_NODES = 400_000


def _group_N(group) -> int:
    g = parse_group(group)
    if g.kind != "SU":
        raise KnotobsError(f"the continuation in the level is computed for SU(N); got {g}")
    return g.N


def _covered(d: CartanData) -> None:
    if d.entire or d.N == 3:
        return
    orders = ", ".join(map(str, d.big_orders))
    if d.N == 3:
        raise PolesNotCoveredError(
            f"{d.space} has {len(d.big_orders)} exceptional orders > 1 ({orders}): the SU(3) continuation"
            " with poles is built and tested for three exceptional fibers (docs/continuation_sun.md"
            " §18.7); with four or more the poles have higher order and it is not run; the finite"
            " levels are computed by 'knotobs space ... --group SU(3) --level k'")
    hint = ("the SU(2) continuation with its residue terms is knotobs.continuation.level."
            "continued_partition_function (knotobs continue without --group)" if d.N == 2 else
            "SU(2) and, with three exceptional fibers, SU(3) cover it; for SU(N) the finite levels are"
            " computed by 'knotobs space ... --group SU(N) --level k'")
    raise PolesNotCoveredError(
        f"{d.space} has {len(d.big_orders)} exceptional orders > 1 ({orders}): for SU({d.N}) the"
        " integrand has poles on the root hyperplanes of a Cartan of rank 3 or more, whose residue"
        " recursion is not implemented (rank 2, SU(3), is: docs/continuation_sun.md §18.7);"
        f" {hint}"
    )


def _method(d: CartanData, method: str) -> str:
    """The method actually used (``auto`` resolved); refuses one that does not apply to ``d``."""
    if method == "auto":
        return "closed" if d.entire else "residues"
    if d.entire and method == "residues":
        raise DomainError(f"method = 'residues' (--route): {d.space} has at most two exceptional orders > 1, so the"
                          " integrand has no poles; use 'closed', 'quadrature', 'both' or 'auto'")
    if not d.entire and method != "residues":
        raise DomainError(f"method = {method!r} (--route): {d.space} has {len(d.big_orders)} exceptional orders > 1,"
                          " so the integrand has poles and the value is the residue formula of"
                          " docs/continuation_sun.md §18.7; use 'residues' or 'auto'")
    return method


def _guard_digits(Kv, method: str) -> int:
    """Extra digits of the residue route at complex ``K``: its sectors ``exp(2 pi i K phi)``,
    ``|phi| <= 1/2``, differ in size by up to ``exp(pi |Im K|)``, and their sum is then smaller
    than its largest term."""
    if method != "residues":
        return 0
    return int(math.ceil(math.pi * abs(float(Kv.imag)) / math.log(10))) + 2


def _range_digits(d: CartanData, Kv, method: str) -> int:
    """Working digits beyond ``bits``' 20 guard digits that the residue route loses to the size of
    its integrands (:func:`.poles.pole_range_digits`, an upper estimate; 15 of the guard digits
    are counted against it).  Only the precision is raised, not the quadrature's target."""
    if method != "residues":
        return 0
    lost = pole_range_digits(d.big_orders, d.HL, d.L, complex(Kv), d.cosets(), d.genus)
    return max(0, int(math.ceil(lost)) - 15)


def continuation_sun_cost(d: CartanData, Kv, digits: int, method: str = "closed",
                          counted: bool = False) -> tuple[float, float, str]:
    """Estimated ``(seconds, megabytes, description)`` of one continued value (both runs; for the
    residue route the longer of them when they run side by side, :func:`knotobs.paired_runs.second_core`).

    For the residue route the closed-form count of :func:`.poles.pole_cost` is an upper estimate
    (4-30 times the work); with ``counted`` the integrals the run will evaluate are counted first
    (:func:`.pole_tally.pole_tally`, a dry run of the enumeration, when its closed-form line count
    is at most :data:`.pole_tally.TALLY_LINES`) and the smaller estimate is taken.

    >>> s, mb, what = continuation_sun_cost(CartanData.from_space("L(5,1)", 3), mpmath.mpc(7.5, 0.3), 30)
    >>> s < 1 and "900 exponentials" in what
    True
    """
    where = f"continued SU({d.N}) Z({d.space}) at K = {mpmath.nstr(Kv, 12)} to {digits} digits"
    if method == "residues":
        target = digits + 12 + _guard_digits(Kv, method)
        ops, what = pole_cost(d.big_orders, d.HL, d.L, complex(Kv), target, d.cosets(), d.genus)
        rng = _range_digits(d, Kv, method)
        fine = ball_seconds(ops, digits + 12 + rng) / 6.0                  # measured
        coarse = ball_seconds(ops * 0.8, digits + 3 + rng) / 6.0
        if counted:
            from knotobs.continuation.cartan import pole_tally as pt

            if (pole_line_count(d.big_orders, d.HL, d.L, d.cosets(), d.genus)[0] <= pt.TALLY_LINES
                    and pole_line_nodes(d.big_orders, d.HL, d.L, complex(Kv), target) <= pt.TALLY_NODES):
                tally = pt.pole_tally(d.big_orders, d.HL, d.L, complex(Kv), target, d.cosets(), d.genus)
                run = pt.tallied_run_seconds(tally, target + rng)
                if run < fine:
                    # the coarse run has fewer nodes at lower precision: at most the fine one
                    fine, coarse = run, run
                    what += f"; counted: {tally['distinct']} lines integrated, {tally['planes']} planes"
        # side by side (knotobs.paired_runs) the wait is the longer run, about 30% slower beside
        # the other (measured on two cores)
        sec = 1.3 * max(fine, coarse) if second_core() else fine + coarse
        # cached grids and Laurent data: about one ball per 10 operations, ~150 bytes each
        return sec, 40 + ops * 15e-6, f"{where} ({what})"
    terms = gaussian_terms(d)
    sec = ball_seconds(2 * terms * 4, digits + 12) / 3.0
    what = f"{where} ({terms:.3g} exponentials" if terms > 10 ** 9 else f"{where} ({terms} exponentials"
    if method in ("quadrature", "both"):
        nodes = quadrature_nodes(d, float(abs(Kv)), digits + 12)
        if nodes > MAX_NODES:
            from knotobs.errors import SizeLimitError

            raise SizeLimitError(
                f"{where}: the trapezoid rule needs {nodes} nodes (at most {MAX_NODES}; rank {d.r},"
                f" |H| = {abs(d.H)}); use method='closed' (--route closed), fewer digits or a smaller |H|"
            )
        sec += ball_seconds(2 * nodes * (d.npos + 2), digits + 12) / 3.0
        what += f", {nodes} trapezoid nodes"
    mb = terms * 200 / 1e6 + (quadrature_nodes(d, float(abs(Kv)), digits) * 300 / 1e6 if method != "closed" else 0)
    return sec, mb, what + f"; |H| = {abs(d.H)}, rank {d.r})"


def _prepare(space, group, level, K, digits, phases, method):
    if phases not in PHASES:
        raise DomainError(f"phases = {phases!r}: use one of {', '.join(PHASES)}")
    if method not in METHODS:
        raise DomainError(f"method = {method!r} (--route): use one of {', '.join(METHODS)}")
    digits = check_digits(digits)
    N = _group_N(group)
    d = CartanData.from_space(space, N)
    _covered(d)
    method = _method(d, method)
    Kv = resolve_K(level, K, N)
    if method == "residues":
        pole_domain(d.H, complex(Kv))
    sec, mb, what = continuation_sun_cost(d, Kv, digits, method)
    if method == "residues" and sec > current_limits().seconds:
        # the closed-form count is an upper estimate: count what the run integrates before refusing
        sec, mb, what = continuation_sun_cost(d, Kv, digits, method, counted=True)
    accepted = ("ask for fewer digits, or a space with smaller |H|, fewer exceptional fibers or a lower"
                " base genus" if method == "residues" else
                "ask for fewer digits, a smaller N or a lens space with smaller |H|")
    require(what, seconds=sec, memory_mb=mb, accepted=accepted)
    return digits, N, d, Kv, method


def _sectors(d: CartanData, level, K, N, digits, reduced, method):
    """Sectors at ``digits`` digits by one method, both runs compared (caller has checked the size).

    The two runs are independent; for the residue route (seconds per run) they go side by side on a
    second core (:mod:`knotobs.paired_runs`); the other methods take milliseconds, less than a fork."""
    Kv = resolve_K(level, K, N)
    extra = _guard_digits(Kv, method)
    rng = _range_digits(d, Kv, method)

    def residues(Ka, dg, parts):
        return pole_sum_sectors(d.big_orders, d.HL, d.L, Ka, dg + extra, reduced, cosets=d.cosets(),
                                genus=d.genus, parts=parts)

    def comp(dg):
        with working_bits(bits(dg + extra + rng)):
            Ka = to_acb(resolve_K(level, K, N))          # read again at this precision
            if method == "closed":
                return gaussian_sectors(d, Ka, reduced)
            if method == "residues":
                pre = B_N(d, Ka) / (Ka * Ka)
                s = {}
                for part in ("exact", "quad"):
                    for phi, v in residues(Ka, dg, part).items():
                        key = phi % 1 if reduced else phi          # CS values mod 1, as for the others
                        s[key] = s.get(key, acb(0)) + pre * v
                return s
            return quadrature_sectors(d, Ka, dg, reduced)

    if method == "residues":
        # the exact pieces (no discretisation: the same in both runs) as polynomials in K, computed
        # here once, at the finer run's precision, and cached for every further K (both runs,
        # and a forked run, read the cache)
        with working_bits(bits(digits + 12 + extra + rng)):
            residues(to_acb(resolve_K(level, K, N)), digits + 12, "exact")
    lo, hi = run_both(comp, digits + 3, digits + 12, parallel=None if method == "residues" else False)

    def total_of(dg):
        with working_bits(bits(dg + extra)):
            return sum((lo if dg == digits + 3 else hi).values(), acb(0))

    total = checked(total_of, digits, f"SU({N}) Z({d.space}) at K = {mpmath.nstr(Kv, 10)} ({method})")
    out = {}
    cancelled = 0
    if method == "residues":
        # groups of pieces whose phase is no Chern–Simons value cancel identically (checked
        # here to the working precision of the finer run, relative to the largest group)
        with working_bits(bits(digits + 12)):
            mags = {cs: abs(to_mpc(v, 15)) for cs, v in hi.items()}
        scale = max(list(mags.values()) + [mpmath.mpf(1)])
        for cs in [c for c, m in mags.items() if m < mpmath.mpf(10) ** (-digits - 6) * scale]:
            del hi[cs]
            lo.pop(cs, None)
            cancelled += 1
    for cs in sorted(hi):
        out[cs] = checked(lambda dg, cs=cs: (lo if dg == digits + 3 else hi).get(cs, acb(0)), digits,
                          f"sector cs = {cs} of SU({N}) Z({d.space})")
    return total, out, cancelled


@dataclass(frozen=True, repr=False)
class CartanContinuedValue(NotebookMixin):
    """SU(N) ``Z(K)`` at a complex shifted level, with its flat-connection sectors.

    Attributes
    ----------
    numeric : mpmath.mpc
        Correct to ``digits`` digits (absolute below 1, relative above), two runs agreeing.
    K : mpmath.mpc
        Shifted level ``K = k + N``.
    N : int
    space : str
    sectors : dict
        ``{cs mod 1: value}``: one Gaussian integral per abelian flat connection (``u in Q/HQ``
        grouped by Chern–Simons value); they add up to ``numeric``.
    method : str
    """

    numeric: mpmath.mpc
    digits: int
    K: mpmath.mpc
    N: int
    space: str
    sectors: dict = field(default_factory=dict, compare=False)
    method: str = "closed"
    notes: tuple[str, ...] = ()
    #: CS values mod 1 of the abelian flat connections (their sectors are ``pieces["integral"]``)
    abelian: frozenset = field(default_factory=frozenset, compare=False)
    #: ``e = 0``: ``{j/L: [(c_i, digits_i), ...]}``, the sector polynomials ``Q_j(K) = sum c_i K^i``
    #: of the quasi-polynomial with the digits each coefficient is certified to (docs 18.11)
    polynomials: dict = field(default_factory=dict, compare=False)

    @property
    def pieces(self) -> dict:
        """``{"integral": ..., "residues": ...}`` (the layout of the SU(2) value): the sectors of the
        abelian flat connections and the rest (``0`` when the integrand has no poles)."""
        if self.method == "quasi-polynomial":        # e = 0: the lattice sum is all residues (§18.11)
            return {"integral": mpmath.mpc(0), "residues": self.numeric}
        if self.method != "residues":
            return {"integral": self.numeric, "residues": mpmath.mpc(0)}
        integral = sum((v for cs, v in self.sectors.items() if cs in self.abelian), mpmath.mpc(0))
        return {"integral": integral, "residues": self.numeric - integral}

    @property
    def how(self) -> str:
        """One line naming the route."""
        if self.method == "verlinde":
            return "the Verlinde polynomial in K (S^1 x Sigma_g, H = 0)"
        if self.method == "quasi-polynomial":
            return ("a quasi-polynomial in K (e = 0): one polynomial per class of K mod the period,"
                    " interpolated from the finite levels (one sector exp(2 pi i K j/L) Q_j(K) per class j mod L)")
        if self.method == "residues":
            return ("SU(3) two-family Lawrence-Rozansky formula: plane integrals, line integrals of"
                    " residues and iterated residues, each at its saddle (one sector per Chern-Simons value"
                    " of the flat connections)")
        return ("Gaussian integrals over the rotated Cartan (one per abelian flat connection"
                f"{'' if self.method == 'closed' else ', ' + self.method})")

    def to_json(self) -> dict[str, Any]:
        def cj(z):
            re_, im_ = certified_parts(z, self.digits)
            return {"re": re_, "im": im_}

        return {
            "quantity": "partition-function",
            "group": f"SU({self.N})",
            "space": self.space,
            "K": {"re": mpmath.nstr(self.K.real, 15), "im": mpmath.nstr(self.K.imag, 15)},
            "level": {"re": mpmath.nstr(self.K.real - self.N, 15), "im": mpmath.nstr(self.K.imag, 15)},
            "numeric": {**cj(self.numeric), "digits": self.digits},
            "pieces": {k: cj(v) for k, v in self.pieces.items()},
            "sectors": {str(cs): cj(v) for cs, v in sorted(self.sectors.items())},
            **({"sector_polynomials": {
                str(cs): [dict(zip(("re", "im"), certified_parts(c, d))) for c, d in cf]
                for cs, cf in sorted(self.polynomials.items())},
                "sector_polynomials_note": "Q_j(K) = sum_i c_i K^i; the sector j/L is exp(-i pi |rho|^2 phi/K)"
                                           " exp(2 pi i K j/L) Q_j(K) (cos(pi K) at 1/2); coefficient i at index i"}
               if self.polynomials else {}),
            "route": f"{self.how}; analytic continuation in K",
            "normalisation": "Z(S^3) = S_00, Z(S^2 x S^1) = 1, canonical 2-framing",
            "notes": list(self.notes),
        }


def continued_sun_partition_function(space, group="SU(3)", level=None, *, K=None, digits: int = 30,
                                     phases: str = "reduced", method: str = "auto") -> CartanContinuedValue:
    """SU(N) partition function of a Seifert manifold at complex level (CONVENTIONS §18).

    Parameters
    ----------
    space : str or SeifertManifold
        ``H = 0`` (``e = 0``): every space, as a polynomial (``S^1 x Sigma_g``, §18.10) or a
        quasi-polynomial in ``K`` (torus bundles and other spaces with exceptional fibers,
        §18.11), for every SU(N) within the size limits.
        ``H != 0``: base genus 0 with at most two exceptional orders ``> 1`` (``"L(5,1)"``,
        ``"L(7,2)"``, ``"M(0; 1; (2,1), (3,1))"``, ``"S^3"``); for SU(3) also three or more
        (``"Sigma(2,3,5)"``, §18.7; sharing a factor, ``"M(0; -1; (2,1), (4,1), (6,1))"``, §18.8)
        and base genus ``g >= 1`` (``"M(1; -1; (2,1), (3,1))"``, ``"M(2; -1)"``, §18.9).
    group : str
        ``"SU(N)"``, ``N >= 2``.
    level, K : complex or str
        ``level = k`` (``K = k + N``) or ``K``; e.g. ``level="7.5+0.3i"``.
    digits : int
    phases : ``"reduced"`` (default) or ``"lawrence-rozansky"``
        The sector of ``u`` carries ``exp(2 pi i K cs(u))``; reduced takes ``cs`` in
        ``(-1/2, 1/2]`` (the continuation of smallest exponential type), the other keeps
        ``cs = P |u|^2/(2H)``.  Equal at every integer ``K``.
    method : ``"auto"`` (default), ``"closed"``, ``"quadrature"``, ``"both"`` or ``"residues"``
        Without poles: closed-form Gaussians, the trapezoid rule on the rotated Cartan, or both
        compared (``auto`` = ``closed``); with poles (SU(3), three orders): the two-family
        residue formula of §18.7 (``auto`` = ``residues``); ``H = 0``: ``auto`` only.

    Returns
    -------
    CartanContinuedValue
        At integer ``K`` the finite-level ``Z_{K-N}(M)`` of the localisation route.

    Examples
    --------
    >>> z = continued_sun_partition_function("L(5,1)", "SU(3)", K=5, digits=20)
    >>> from knotobs.localisation import localisation_partition_function
    >>> abs(z.numeric - localisation_partition_function("L(5,1)", "SU(3)", 2).numeric) < 1e-18
    True
    >>> w = continued_sun_partition_function("L(5,1)", "SU(3)", level="7.5+0.3i", digits=15)
    >>> sorted(str(c) for c in w.sectors)
    ['0', '1/5', '2/5', '3/5', '4/5']
    >>> b = continued_sun_partition_function("M(0; -2; (2,1), (2,1), (2,1), (2,1))", "SU(2)", K="4.5+0.1i", digits=15)
    >>> mpmath.nstr(b.numeric, 6), b.method                 # Tr C = k + 1 = K - 1 on this torus bundle
    ('(3.5 + 0.1j)', 'quasi-polynomial')

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314 (rank one);
    M. Mariño, Commun. Math. Phys. 253 (2005) 25–49 (the Cartan integrals for simply-laced groups).
    """
    circle = _circle_product(space, group, level, K, digits, phases, method)
    if circle is not None:
        return circle
    flat_base = _zero_euler(space, group, level, K, digits, phases, method)
    if flat_base is not None:
        return flat_base
    digits, N, d, Kv, method = _prepare(space, group, level, K, digits, phases, method)
    reduced = phases == "reduced"
    notes = []
    if method == "both":
        total, sectors, _ = _sectors(d, level, K, N, digits, reduced, "closed")
        total_q, _, _ = _sectors(d, level, K, N, digits, reduced, "quadrature")
        from knotobs.numerics import working_precision

        with working_precision(digits + 10):
            diff = abs(total - total_q)
            if diff > mpmath.mpf(10) ** (-digits) * max(abs(total), 1):
                raise PrecisionError(f"SU({N}) Z({d.space}): closed form and trapezoid rule differ by"
                                     f" {mpmath.nstr(diff, 3)} at {digits} digits")
        notes.append(f"closed form and trapezoid rule agree to {digits} digits")
    else:
        total, sectors, cancelled = _sectors(d, level, K, N, digits, reduced, method)
        if method == "residues":
            what = ("the flat connections" if not d.genus else
                    f"one per Chern-Simons value; on a base of genus {d.genus} the flat connections come in families")
            notes.append(f"{len(sectors)} sectors ({what}); {cancelled} further groups of"
                         f" line integrals and residues cancel to below 10^-{digits + 6}")
    if Kv.imag == 0 and Kv.real == int(Kv.real):
        notes.append(f"integer K: equals the finite-level value Z_k with k = K - {N}")
    return CartanContinuedValue(total, digits, Kv, N, str(d.space), sectors, method, tuple(notes),
                                abelian_cs_values(d))


def _circle_product(space, group, level, K, digits, phases, method):
    """``S^1 x Sigma_g`` (``H = 0``): the Verlinde polynomial in ``K`` (§18.10), or ``None`` for
    any other space."""
    from knotobs.continuation.cartan.verlinde import is_circle_product, verlinde_degree, verlinde_value
    from knotobs.fibrations.seifert import SeifertManifold, parse_space

    M = space if isinstance(space, SeifertManifold) else parse_space(space)
    if not is_circle_product(M):
        return None
    if phases not in PHASES:
        raise DomainError(f"phases = {phases!r}: use one of {', '.join(PHASES)}")
    if method not in ("auto", "closed"):
        raise DomainError(f"method = {method!r} (--route): {M} is S^1 x Sigma_{M.genus}, whose partition function is"
                          " the Verlinde polynomial in K, one closed form: use 'auto' or 'closed'")
    digits = check_digits(digits)
    N = _group_N(group)
    Kv = resolve_K(level, K, N)
    def comp(dg):
        with working_bits(bits(dg)):
            return verlinde_value(N, M.genus, to_acb(resolve_K(level, K, N)))

    total = checked(comp, digits, f"SU({N}) Z({M}) at K = {mpmath.nstr(Kv, 10)} (Verlinde polynomial)")
    notes = ([f"S^1 x Sigma_{M.genus}: the Verlinde number, a polynomial of degree"
              f" {verlinde_degree(N, M.genus)} in K with exact rational coefficients (interpolated from"
              " the finite levels and checked at two more); no exponential factors"] if M.genus else
             ["S^2 x S^1: Z = 1 at every level (the Verlinde number in genus 0)"])
    if Kv.imag == 0 and Kv.real == int(Kv.real):
        notes.append(f"integer K: equals the finite-level value Z_k with k = K - {N}")
    return CartanContinuedValue(total, digits, Kv, N, str(M), {Fraction(0): total}, "verlinde", tuple(notes),
                                frozenset({Fraction(0)}))


def _zero_euler(space, group, level, K, digits, phases, method):
    """``e = 0`` with exceptional fibers: the quasi-polynomial in ``K`` of §18.11, or ``None`` for
    any other space."""
    from knotobs.continuation.cartan import quasipolynomial as qp
    from knotobs.fibrations.seifert import SeifertManifold, parse_space
    from knotobs.numerics import working_precision

    M = space if isinstance(space, SeifertManifold) else parse_space(space)
    if not qp.has_zero_euler(M):
        return None
    if phases != "reduced":
        raise DomainError(f"phases = {phases!r} (--phases): {M} has e = 0, so there is no Lawrence-Rozansky phase"
                          " cs(u) = P|u|^2/(2H); its sectors exp(2 pi i K j/L) are reduced (j/L in (-1/2, 1/2), cos(pi K) at 1/2);"
                          " use phases='reduced'")
    if method not in ("auto", "both"):
        raise DomainError(f"method = {method!r} (--route): {M} has e = 0; its value is the quasi-polynomial in K of"
                          " docs/continuation_sun.md 18.11, interpolated from the localisation route ('auto')"
                          " or from it and from the surgery route, compared ('both')")
    digits = check_digits(digits)
    N = _group_N(group)
    Kv = resolve_K(level, K, N)
    q = qp.quasi_polynomial_data(M, N)
    routes = ("localisation", "surgery") if method == "both" else ("localisation",)
    for route in routes:
        sec, what = qp.quasi_polynomial_seconds(q, route)
        require(f"continued SU({N}) Z({M}) at K = {mpmath.nstr(Kv, 12)}: {what}", seconds=sec,
                accepted="use a smaller N, fewer exceptional fibers or a lower base genus")
    guard = qp.guard_digits(q, Kv)
    # the finite values carry no discretisation: both runs share them at the finer run's digits
    # (their balls certify them), and differ in the precision of everything after.  They need the
    # digits the extrapolation loses; when the ball of the result is still too wide (the values at
    # the nodes much larger than the result, or sectors cancelling), they are recomputed with the
    # missing digits (at most twice)
    fine = digits + 12 + qp.guard_digits(q, Kv, sectors=False)
    what = f"SU({N}) Z({M}) at K = {mpmath.nstr(Kv, 10)}"
    found = {}

    def run(route, fine_digits):
        def comp(dg):
            with working_bits(bits(dg + guard)):
                Ka = to_acb(resolve_K(level, K, N))
                sec_ = qp.quasi_polynomial_sectors(q, Ka, fine_digits, route)
                total = sum(sec_.values(), acb(0))
                qp.check_radius(total, dg, what)
                found[dg] = {cs: to_mpc(v, dg) for cs, v in sec_.items()}
                return total
        return checked(comp, digits, f"{what} (quasi-polynomial)")

    for attempt in range(3):
        try:
            total = run("localisation", fine)
            break
        except qp.WideBallError as exc:
            if attempt == 2 or exc.missing > 1000:
                raise PrecisionError(f"{what}: {exc}; request fewer digits or a level closer to the real"
                                     " axis") from None
            fine += exc.missing + 5
    sectors = found[digits + 12]
    agree = None
    if method == "both":         # the same interpolation through the surgery route's finite values
        other = run("surgery", fine)
        with working_precision(digits + 10):
            diff = abs(other - total)
            if diff > mpmath.mpf(10) ** (-digits) * max(1, abs(total)):
                from knotobs.evaluation.two_routes import RouteMismatchError

                raise RouteMismatchError(f"{what}: interpolated from the localisation and the surgery route the"
                                         f" values differ by {mpmath.nstr(diff, 3)}")
        agree = (f"interpolated from the localisation route and from the surgery route: agree to {digits} digits"
                 f" (|difference| = {mpmath.nstr(diff, 3)})")
    with working_precision(digits):
        sectors = {cs: +v for cs, v in sectors.items()}
    notes = [f"e = 0: exp(i pi |rho|^2 phi/K) Z is a quasi-polynomial in K of period {q.period} and degree"
             f" <= {q.degree} (phi = {q.phi}), interpolated from the finite levels k = 1..{q.levels[-1]}"
             " of the localisation route and checked at two levels of every class",
             f"{len(sectors)} of {q.period} sectors exp(2 pi i K j/{q.period}) Q_j(K) are non-zero (keyed by"
             f" j/{q.period} mod 1; the exponent uses the representative in (-1/2, 1/2), and cos(pi K) at 1/2)"]
    if agree:
        notes.append(agree)
    polys = {}
    with working_bits(bits(fine)):
        for cs, cf in qp.quasi_polynomial_coefficients(q, fine).items():
            row = []
            for c in cf:
                mag = abs(c).mid()
                if c.contains(0):
                    row.append((mpmath.mpc(0), 0))
                    continue
                good = int(math.floor(float((mag / c.rad()).log() / arb(10).log()))) if c.rad() > 0 else digits
                row.append((to_mpc(c, digits), max(1, min(digits, good))))
            polys[cs] = row
    if Kv.imag == 0 and Kv.real == int(Kv.real):
        notes.append(f"integer K: equals the finite-level value Z_k with k = K - {N}")
    return CartanContinuedValue(total, digits, Kv, N, str(M), sectors, "quasi-polynomial", tuple(notes),
                                frozenset(), polys)


def continued_sun_seconds(space, group, K, digits: int = 20) -> tuple[float, float, float]:
    """``(once, per_value, megabytes)``: estimated seconds of the work done once per space (the
    finite levels of a Verlinde or quasi-polynomial; the residue route's iterated residues, mostly
    exact pieces cached per space) and of one continued value at ``K`` (for the residue route the
    integrals the run will do, counted by its dry run where that is cheap, docs 18.7), before any work.

    >>> once, each, mb = continued_sun_seconds("L(5,1)", "SU(3)", mpmath.mpc(7.5, 0.3), 20)
    >>> once == 0 and each < 1
    True
    """
    from knotobs.continuation.cartan import quasipolynomial as qp
    from knotobs.continuation.cartan.verlinde import is_circle_product
    from knotobs.fibrations.seifert import SeifertManifold, parse_space

    M = space if isinstance(space, SeifertManifold) else parse_space(space)
    N = _group_N(group)
    Kv = mpmath.mpc(K)
    if qp.has_zero_euler(M):
        if is_circle_product(M):
            return 2.0, 0.01, 10.0       # the Verlinde numbers at d + 3 levels (refused by size otherwise)
        return qp.quasi_polynomial_seconds(qp.quasi_polynomial_data(M, N))[0], 0.02, 10.0
    d = CartanData.from_space(M, N)
    _covered(d)
    method = _method(d, "auto")
    if method == "residues":
        pole_domain(d.H, complex(Kv))
    digits = check_digits(digits)
    sec, mb, _ = continuation_sun_cost(d, Kv, digits, method)
    if method != "residues":
        return 0.0, sec, mb
    # the iterated residues are mostly the exact pieces, computed once per space (docs 18.7); the
    # quadratures of every value are counted (continuation_sun_cost with counted=True)
    from knotobs.continuation.cartan.poles import pole_cost_parts

    lines, points, _ = pole_cost_parts(d.big_orders, d.HL, d.L, complex(Kv), digits + 12 + _guard_digits(Kv, method),
                                       d.cosets(), d.genus)
    share = lines / (lines + points)
    each = continuation_sun_cost(d, Kv, digits, method, counted=True)[0]
    return sec * (1 - share), min(sec * share, each), mb


def continued_sun_Z(space, K, group="SU(3)", digits: int = 30, phases: str = "reduced") -> mpmath.mpc:
    """Shorthand: ``continued_sun_partition_function(space, group, K=K, digits=digits).numeric``.

    >>> z = continued_sun_Z("S^3", 5, "SU(3)", 20)          # S_00 of SU(3) at level 2
    >>> abs(z - mpmath.mpf(1) / mpmath.sqrt(3 * 25) * 8 * mpmath.sin(mpmath.pi/5)**2 * mpmath.sin(2*mpmath.pi/5)) < 1e-15
    True
    """
    return continued_sun_partition_function(space, group, K=K, digits=digits, phases=phases).numeric


def continued_sun_sectors(space, K, group="SU(3)", digits: int = 30, phases: str = "reduced") -> dict[Fraction, mpmath.mpc]:
    """The sectors ``{cs mod 1: value}`` of :func:`continued_sun_partition_function`.

    >>> v = continued_sun_sectors("L(5,1)", "6.5+0.2i", "SU(3)", 15)
    >>> abs(sum(v.values()) - continued_sun_Z("L(5,1)", "6.5+0.2i", "SU(3)", 15)) < 1e-13
    True
    """
    return dict(continued_sun_partition_function(space, group, K=K, digits=digits, phases=phases).sectors)
