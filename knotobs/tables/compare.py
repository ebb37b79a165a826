"""Compare a computed invariant with a polynomial written in someone else's conventions.

A practitioner meets the same invariant written in many ways.  :func:`compare`
computes the invariant of a torus knot or link in knotobs' standard profile
(docs/conventions.md §1, §3) and tries the convention maps one meets in the literature
and in tables:

* the variable: ``t = q^-1`` or ``t = q`` (the latter is the mirror image),
  half-integer powers written as a variable (``x = t^(1/2)``, ``s = q^(1/2)``),
  and for HOMFLY-PT ``a`` or ``v = a^-1`` and ``z -> -z``;
* normalised by the unknot or not;
* a change of framing by ``theta(lam)^f`` (``theta(lam) = q^C(lam)``; for HOMFLY-PT
  ``a^|lam| s^kappa(lam)``), ``f`` the total change over the components;
* an overall sign (links: the ``(-1)^(c-1)`` between the quantum-group value and
  Jones's ``V``, CONVENTIONS §8) and, as a last resort, any other monomial.

It reports exactly which map makes the two equal, or, when none does, the closest
map and the difference.  Everything is exact.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from fractions import Fraction
from typing import Any, Iterable, Sequence

from knotobs.errors import InexactDivisionError, InvalidRepresentationError, KnotobsError, ParseError
from knotobs.evaluation.families import alexander, homfly, wilson_loop
from knotobs.evaluation.rosso_jones import colours_for
from knotobs.evaluation.result import PolynomialResult
from knotobs.fibrations.torus import TorusLink, parse_knot
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.groups import Group, casimir, homfly_unknot, parse_group
from knotobs.representations.partitions import kappa
from knotobs.tables.polyparse import KNOWN_VARIABLES, parse_polynomial
from knotobs.tables.sparse import MPoly
from knotobs._notebook import NotebookMixin

__all__ = ["ConventionMap", "Comparison", "compare", "compare_knotinfo", "INVARIANTS"]

#: Invariant families :func:`compare` understands (``"auto"`` picks one from the variables).
INVARIANTS = ("auto", "quantum", "jones", "homfly", "alexander", "conway", "kauffman")

#: For each one-variable name: its standard meaning as a power of q (CONVENTIONS §1, §3, §8).
_STD_Q_POWER = {"t": Fraction(-1), "x": Fraction(-1, 2), "q": Fraction(1), "s": Fraction(1, 2)}
_Q_POWERS = (Fraction(1), Fraction(-1), Fraction(1, 2), Fraction(-1, 2), Fraction(2), Fraction(-2))
_STD_A_POWER = {"a": 1, "v": -1}
_ONE_VAR = ("t", "x", "q", "s")

# ---------------------------------------------------------------- results


def _pow_text(base: str, e: Fraction) -> str:
    if e == 1:
        return base
    if e.denominator == 1:
        return f"{base}^{e.numerator}"
    return f"{base}^({e.numerator}/{e.denominator})"



def _colours_text(rep) -> str:
    """``[2,1]`` for one colour on every component, ``[1]; [2]`` for one per component."""
    reps = [list(r) for r in rep]
    if len(reps) == 1 or all(r == reps[0] for r in reps):
        return str(reps[0]).replace(" ", "")
    return "; ".join(str(r).replace(" ", "") for r in reps)


@dataclass(frozen=True)
class ConventionMap:
    """A convention map: how a target polynomial is obtained from knotobs' standard value.

    ``target = sign * monomial * theta^framing * (standard value, normalised as stated,
    written in the target variables as stated)``.

    Attributes
    ----------
    variables : tuple of (str, str)
        Each target variable and what it is in knotobs' variables, e.g. ``("t", "q^-1")``,
        ``("v", "a^-1")``, ``("z", "-z")``.
    mirror : bool or None
        Whether the map amounts to the mirror image (``t <-> t^-1`` against the standard
        ``t = q^-1``; ``a <-> a^-1`` for HOMFLY-PT); ``None`` if the invariant cannot tell.
    normalisation : str
    framing : int
        Total change of framing ``f`` (summed over the components): a factor ``theta(lam)^f``.
    sign : int
        Overall sign ``+1`` or ``-1``.
    monomial : str or None
        Any further monomial factor, in the target variables.
    """

    variables: tuple[tuple[str, str], ...]
    mirror: bool | None
    normalisation: str
    framing: int = 0
    sign: int = 1
    monomial: str | None = None
    nonstandard_variables: bool = False

    @property
    def cost(self) -> int:
        """Smaller is simpler (used to pick the reported map among several that work)."""
        return (8 * (self.monomial is not None) + 4 * (self.framing != 0) + 2 * (self.sign < 0)
                + int(bool(self.nonstandard_variables)))

    def describe(self) -> str:
        parts = [", ".join(f"{v} = {e}" for v, e in self.variables) or "no variables"]
        if self.mirror:
            parts.append("i.e. the mirror image of the standard convention")
        parts.append(self.normalisation)
        if self.framing:
            parts.append(f"framing changed by {self.framing} (factor theta^{self.framing})")
        if self.sign < 0:
            parts.append("overall sign -1")
        if self.monomial:
            parts.append(f"times the monomial {self.monomial}")
        return "; ".join(parts)

    def to_json(self) -> dict[str, Any]:
        return {
            "variables": {v: e for v, e in self.variables},
            "mirror": self.mirror,
            "normalisation": self.normalisation,
            "framing": self.framing,
            "sign": self.sign,
            "monomial": self.monomial,
            "description": self.describe(),
        }


@dataclass(frozen=True, repr=False)
class Comparison(NotebookMixin):
    """Outcome of :func:`compare`.

    Attributes
    ----------
    equal : bool
        Some convention map makes the two polynomials equal.
    map : ConventionMap or None
        The simplest such map.
    maps : tuple of ConventionMap
        Every map found (e.g. both chiralities for an amphichiral case).
    computed : str
        knotobs' value in its standard profile.
    target : str
        The target polynomial as read.
    closest : ConventionMap or None
        When nothing matches: the map that leaves the fewest differing terms.
    difference : str or None
        ``target - (computed under closest)``, when nothing matches.
    """

    knot: str
    invariant: str
    group: str
    representation: list
    target: str
    computed: str
    computed_profile: dict
    equal: bool
    map: ConventionMap | None
    maps: tuple = ()
    closest: ConventionMap | None = None
    difference: str | None = None
    differing_terms: int = 0
    source: str = ""

    def to_json(self) -> dict[str, Any]:
        return {
            "kind": "comparison",
            "knot": self.knot,
            "invariant": self.invariant,
            "group": self.group,
            "representation": self.representation,
            "target": self.target,
            "computed": self.computed,
            "computed_profile": self.computed_profile,
            "equal": self.equal,
            "map": self.map.to_json() if self.map else None,
            "maps": [m.to_json() for m in self.maps],
            "closest": self.closest.to_json() if self.closest else None,
            "difference": self.difference,
            "differing_terms": self.differing_terms,
            "source": self.source,
        }

    def describe(self) -> str:
        lines = [f"{self.invariant} of {self.knot}, {self.group}, color {_colours_text(self.representation)}"
                 + (f"  [{self.source}]" if self.source else ""),
                 f"  target:   {self.target}",
                 f"  computed: {self.computed}"]
        if self.equal:
            lines.append(f"  EQUAL under: {self.map.describe()}")
            for m in self.maps[1:]:
                lines.append(f"  also under:  {m.describe()}")
        else:
            lines.append("  NOT EQUAL under any convention map tried")
            if self.closest is not None:
                lines.append(f"  closest map: {self.closest.describe()}")
                lines.append(f"  difference ({self.differing_terms} terms): {self.difference}")
        return "\n".join(lines)


# ---------------------------------------------------------------- families


@dataclass
class _VarMap:
    subst: dict                      # model var -> (target var, exponent, sign)
    shown: tuple[tuple[str, str], ...]
    mirror: bool | None
    nonstandard: bool


@dataclass
class _Family:
    name: str
    group: str
    rep: list
    profile: dict
    computed: str
    forms: list                      # [(normalisation label, MPoly in model variables)]
    theta: MPoly | None              # framing factor in model variables (None: no framing meaning)
    var_maps: list = field(default_factory=list)


def _q_maps(tvar: str) -> list[_VarMap]:
    std = _STD_Q_POWER.get(tvar, Fraction(1))
    out = []
    for r in _Q_POWERS:
        out.append(_VarMap({"q": (tvar, 1 / r, 1)}, ((tvar, _pow_text("q", r)),),
                           (r < 0) != (std < 0), r != std))
    return out


def _a_maps(avar: str, second: list[tuple[str, dict, str, bool]]) -> list[_VarMap]:
    std = _STD_A_POWER.get(avar, 1)
    out = []
    for rho in (1, -1):
        for sname, ssub, sshown, snonstd in second:
            sub = {"a": (avar, Fraction(1, rho), 1)}
            sub.update(ssub)
            shown = ((avar, _pow_text("a", Fraction(rho))),) + ((sname, sshown),) if sname else ((avar, _pow_text("a", Fraction(rho))),)
            out.append(_VarMap(sub, shown, rho != std, snonstd))
    return out


def _knot_and_cols(knot, rep):
    k = parse_knot(knot)
    cols = colours_for(k, rep)
    return k, cols


def _quantum_family(k: TorusLink, group: Group, cols, tvar: str) -> _Family:
    res = wilson_loop(k, group, list(cols) if len(cols) > 1 else cols[0], 0, False)
    forms = [("unnormalized (unknot = dim_q)", MPoly.from_laurent(res.value, "q"))]
    try:
        nres = wilson_loop(k, group, list(cols) if len(cols) > 1 else cols[0], 0, True)
        forms.append(("normalized (unknot = 1)", MPoly.from_laurent(nres.value, "q")))
    except InexactDivisionError:  # pragma: no cover - links with a non-dividing colour
        pass
    theta = None
    if all(c == cols[0] for c in cols):
        theta = MPoly({(casimir(group, cols[0]),): 1}, ("q",))
    fam = _Family("quantum", str(group), [list(c) for c in cols], res.profile.to_dict(),
                  f"{res.exact_string()}   (q, zero framing, unnormalized)", forms, theta)
    fam.var_maps = _q_maps(tvar)
    return fam


def _homfly_family(k: TorusLink, cols, avar: str, second: str | None, form: str) -> _Family:
    res = homfly(k, cols[0] if len(set(cols)) == 1 else list(cols), form=form)
    if form == "az":
        P = MPoly.from_az(res.value, "a", "z")
    else:
        P = MPoly.from_aq(res.value, "a", "q")
    forms = [("normalized (unknot = 1)", P)]
    lam = cols[0]
    same = all(c == lam for c in cols)
    if same and form == "az" and lam == (1,):
        u = (MPoly.var("a") - MPoly.var("a") ** -1) * MPoly.var("z") ** -1
        forms.append(("unnormalized (unknot = (a - a^-1)/z)", P * u))
    elif same and form == "aq":
        num, den = homfly_unknot(lam)
        nump = MPoly.from_aq(num, "a", "q")
        denp = MPoly.from_laurent(den.subs_power(2).rename("q"), "q")  # s = q^(1/2)
        if denp.is_monomial():  # pragma: no cover - never for a nonempty partition
            forms.append(("unnormalized (unknot = dim_q)", (P * nump).monomial_div(denp)))
    theta = None
    if same:
        kap = kappa(lam)
        if form == "az":
            theta = MPoly({(sum(lam), 0): 1}, ("a", "z")) if kap == 0 else None
        else:
            theta = MPoly({(sum(lam), Fraction(kap, 2)): 1}, ("a", "q"))
    fam = _Family("homfly", "U(N), generic N", [list(c) for c in cols], res.profile.to_dict(),
                  f"{res.exact_string()}   ({'a, z' if form == 'az' else 'a, q'}, a = q^(N/2), zero framing, normalized)",
                  forms, theta)
    if form == "az":
        zs = [("z", {"z": ("z", Fraction(1), 1)}, "z", False), ("z", {"z": ("z", Fraction(1), -1)}, "-z", False)]
        if second is None:
            zs = [("", {}, "", False)]
        fam.var_maps = _a_maps(avar, zs)
    else:
        qv = second or "q"
        std = _STD_Q_POWER.get(qv, Fraction(1)) if qv != "t" else Fraction(1)
        qs = [(qv, {"q": (qv, 1 / r, 1)}, _pow_text("q", r), r != std) for r in _Q_POWERS]
        fam.var_maps = _a_maps(avar, qs)
    return fam


def _conway_family(k: TorusLink) -> _Family:
    res = homfly(k, (1,), form="az")
    terms: dict = {}
    for (i, j), c in res.value.to_az().items():
        terms[(j,)] = terms.get((j,), 0) + c
    nabla = MPoly(terms, ("z",))
    fam = _Family("conway", "HOMFLY-PT at a = 1", [[1]] * k.components, res.profile.to_dict(),
                  f"{nabla}   (Conway: nabla(z) = P(a = 1, z))", [("Conway normalized (unknot = 1)", nabla)], None)
    fam.var_maps = [_VarMap({"z": ("z", Fraction(1), 1)}, (("z", "z"),), None, False),
                    _VarMap({"z": ("z", Fraction(1), -1)}, (("z", "-z"),), None, False)]
    return fam


def _kauffman_family(k: TorusLink) -> _Family:
    from knotobs.evaluation.kauffman import kauffman

    res = kauffman(k)
    F = MPoly.from_az(res.value, "a", "z")
    fam = _Family("kauffman", res.group, [[1]] * k.components, res.profile.to_dict(),
                  f"{res.exact_string()}   (a, z; Kauffman F, F(unknot) = 1)", [("normalised (F(unknot) = 1)", F)], None)
    zs = [("z", {"z": ("z", Fraction(1), 1)}, "z", False), ("z", {"z": ("z", Fraction(1), -1)}, "-z", True)]
    fam.var_maps = _a_maps("a", zs)
    return fam


def _alexander_family(k: TorusLink, tvar: str) -> _Family:
    res = alexander(k)
    d = MPoly.from_laurent(res.value, "t")
    fam = _Family("alexander", "HOMFLY-PT at a = 1", [[1]] * k.components, res.profile.to_dict(),
                  f"{res.exact_string()}   (symmetric, Conway normalized)", [("Conway normalized (Delta(t) = Delta(1/t))", d)], None)
    fam.var_maps = []
    for r in (Fraction(1), Fraction(-1), Fraction(1, 2), Fraction(-1, 2)):
        std = Fraction(1) if tvar == "t" else Fraction(1, 2)
        fam.var_maps.append(_VarMap({"t": (tvar, 1 / r, 1)}, ((tvar, _pow_text("t", r)),), None, abs(r) != abs(std)))
    return fam


# ---------------------------------------------------------------- the search


def _monomial_ratio(X: MPoly, Y: MPoly) -> tuple[int, tuple[Fraction, ...], tuple[str, ...]] | None:
    """``(c, e, vars)`` with ``X = c * vars^e * Y`` and ``c = +-1``, or ``None``."""
    if X.is_zero() or Y.is_zero():
        return (1, (), ()) if (X.is_zero() and Y.is_zero()) else None
    if len(X.terms) != len(Y.terms):
        return None
    vs = tuple(sorted(set(X.variables) | set(Y.variables)))
    Xo, Yo = X._over(vs), Y._over(vs)
    kx, ky = max(Xo), max(Yo)
    c = Xo[kx] / Yo[ky]
    if c not in (1, -1):
        return None
    e = tuple(a - b for a, b in zip(kx, ky))
    for k, v in Yo.items():
        if Xo.get(tuple(a + b for a, b in zip(k, e))) != c * v:
            return None
    return int(c), e, vs


def _closeness(X: MPoly, Y: MPoly):
    """Best-effort monomial alignment for a mismatch: ``(differing terms, difference, c, e, vs)``."""
    if Y.is_zero() or X.is_zero():
        d = X - Y
        return len(d.terms), d, 1, (), ()
    vs = tuple(sorted(set(X.variables) | set(Y.variables)))
    Xo, Yo = X._over(vs), Y._over(vs)
    best = None
    for kx, ky in ((max(Xo), max(Yo)), (min(Xo), min(Yo))):
        c = Xo[kx] / Yo[ky]
        c = Fraction(1) if c > 0 else Fraction(-1)
        e = tuple(a - b for a, b in zip(kx, ky))
        m = MPoly({e: c}, vs)
        d = X - m * Y
        cand = (len(d.terms), d, int(c), e, vs)
        if best is None or cand[0] < best[0]:
            best = cand
    return best


def _interpret(c: int, e, vs, theta_t: MPoly | None) -> tuple[int, str | None]:
    """Split ``vars^e`` into ``theta^f`` and a residual monomial."""
    if not any(e):
        return 0, None
    if theta_t is not None and not theta_t.is_zero():
        (tk, _), = theta_t.terms.items()
        th = dict(zip(theta_t.variables, tk))
        ev = dict(zip(vs, e))
        f = None
        for v, x in th.items():
            if x != 0:
                f = ev.get(v, Fraction(0)) / x
                break
        if f is not None and f.denominator == 1 and f != 0:
            allv = set(th) | set(ev)
            if all(ev.get(v, Fraction(0)) == f * th.get(v, Fraction(0)) for v in allv):
                return int(f), None
    mono = MPoly({tuple(e): 1}, vs)
    return 0, str(mono)


#: Seconds per term of one convention map tried on a mismatch (substitution, monomial alignment
#: and the difference of two sparse polynomials with rational exponents; measured: a torus knot
#: whose Jones polynomial has 10^4 terms takes ~15 s for its 12 maps).
SECONDS_PER_TERM_AND_MAP = 1.5e-4


def _require_search(k, target: MPoly, fam: _Family, want_closest: bool) -> None:
    """Refuses, before it starts, a search whose estimate exceeds the limits (:mod:`knotobs.guard`)."""
    from knotobs.guard import require

    terms = max([len(form.terms) for _, form in fam.forms] + [len(target.terms)])
    nmaps = len(fam.var_maps) * len(fam.forms)
    # only a mismatch runs the alignment on every map; a match costs one substitution per map
    sec = nmaps * terms * SECONDS_PER_TERM_AND_MAP * (1.0 if want_closest else 0.3)
    require(f"comparing {k} ({fam.name}, {terms} terms) under {nmaps} convention maps", seconds=sec,
            memory_mb=terms * nmaps * 400 / 1e6,
            accepted="a smaller knot or a polynomial with fewer terms")


def _search(target: MPoly, fam: _Family, want_closest: bool = True):
    found: list[ConventionMap] = []
    n = len(target.terms)
    subs = []
    for vm in fam.var_maps:
        theta_t = fam.theta.substitute(vm.subst) if fam.theta is not None else None
        for label, form in fam.forms:
            subs.append((vm, theta_t, label, form))
            if len(form.terms) != n:  # every convention map keeps the number of terms
                continue
            try:
                Y = form.substitute(vm.subst)
            except InexactDivisionError:
                continue
            r = _monomial_ratio(target, Y)
            if r is not None:
                c, e, vs = r
                f, mono = _interpret(c, e, vs, theta_t)
                found.append(ConventionMap(vm.shown, vm.mirror, label, f, c, mono, vm.nonstandard))
    found.sort(key=lambda m: m.cost)
    uniq: list[ConventionMap] = []
    for m in found:
        if m not in uniq:
            uniq.append(m)
    closest = None
    if not uniq and want_closest:
        for vm, theta_t, label, form in subs:
            try:
                Y = form.substitute(vm.subst)
            except InexactDivisionError:
                continue
            nd, d, c, e, vs = _closeness(target, Y)
            f, mono = _interpret(c, e, vs, theta_t)
            cm = ConventionMap(vm.shown, vm.mirror, label, f, c, mono, vm.nonstandard)
            key = (nd, cm.cost)
            if closest is None or key < closest[0]:
                closest = (key, cm, d)
    return uniq, closest


# ---------------------------------------------------------------- public API


def _target_mpoly(target, variables) -> MPoly:
    if isinstance(target, MPoly):
        return target.restrict()
    if isinstance(target, PolynomialResult):
        v = target.value
        if isinstance(v, Laurent2):
            if target.profile.variables == ("a", "q"):
                return MPoly.from_aq(v)
            return MPoly.from_az(v)
        return MPoly.from_laurent(v, target.profile.variables[0])
    if isinstance(target, Laurent):
        return MPoly.from_laurent(target)
    if isinstance(target, Laurent2):
        return MPoly.from_az(target)
    if isinstance(target, str):
        return parse_polynomial(target, variables)
    raise ParseError(f"cannot compare with a {type(target).__name__}: give a polynomial as text, MPoly or Laurent")


#: Invariants that are not those of one chosen group (generic N, or the SO(N) Kauffman form).
GROUP_FREE = ("homfly", "alexander", "conway", "kauffman")


def group_free_message(name: str, group) -> str:
    """The refusal of a group given for an invariant of no single group."""
    return (f"group {group!r} (--group) does not apply to the {name} polynomial, which is not the"
            " invariant of one group (generic N, or the SO(N) Kauffman form); the group applies to"
            " one-variable (quantum) polynomials: drop it, or compare the quantum invariant")


def _choose_family(tp: MPoly, invariant: str, knot: TorusLink, group, cols) -> _Family:
    used = set(tp.used_variables())
    inv = invariant.lower().replace("_", "-")
    if inv not in INVARIANTS:
        raise KnotobsError(f"unknown invariant {invariant!r}: choose one of {', '.join(INVARIANTS)}")
    avars = used & {"a", "v"}
    if len(avars) > 1:
        raise ParseError(f"the polynomial uses both 'a' and 'v' ({tp}); HOMFLY-PT uses one of them (v = a^-1)")
    avar = next(iter(avars), None)
    if inv == "auto":
        if avar or (used and used <= {"z"}):
            inv = "homfly" if avar else "conway"
        else:
            inv = "quantum"
    if inv == "kauffman":
        if not used <= {"a", "z"}:
            raise ParseError(f"a Kauffman polynomial is written in a and z; found {', '.join(sorted(used))} in {tp}")
        return _kauffman_family(knot)
    if inv == "conway":
        if not used <= {"z"}:
            raise ParseError(f"a Conway polynomial is written in z only; found {', '.join(sorted(used))} in {tp}")
        return _conway_family(knot)
    if inv == "alexander":
        if len(used) > 1 or not used <= {"t", "x"}:
            raise ParseError(f"an Alexander polynomial is written in t (or x = t^(1/2)); found {', '.join(sorted(used))}")
        return _alexander_family(knot, next(iter(used), "t"))
    if inv == "homfly":
        rest = used - {"a", "v"}
        if rest <= {"z"}:
            return _homfly_family(knot, cols, avar or "a", "z" if "z" in rest else None, "az")
        if len(rest) == 1 and rest <= set(_ONE_VAR):
            return _homfly_family(knot, cols, avar or "a", next(iter(rest)), "aq")
        raise ParseError(f"a HOMFLY-PT polynomial uses (a or v) with z, or with one of q, t, s, x; found {', '.join(sorted(used))}")
    # quantum / jones: one variable
    if avar or "z" in used or len(used) > 1:
        raise ParseError(
            f"a {'Jones' if inv == 'jones' else 'one-variable'} polynomial uses one of {', '.join(_ONE_VAR)};"
            f" found {', '.join(sorted(used))} (for HOMFLY-PT use a or v with z)")
    if inv == "jones" and (group.kind, group.N) != ("SU", 2):
        raise KnotobsError(f"the Jones polynomial is the SU(2) invariant; got group {group}")
    tvar = next(iter(used), "t" if inv == "jones" else "q")
    fam = _quantum_family(knot, group, cols, tvar)
    if inv == "jones":
        fam.name = "jones"
    return fam


def compare(knot, target, group=None, rep=(1,), invariant: str = "auto",
            variables: Iterable[str] | None = None, source: str = "", _closest: bool = True) -> Comparison:
    """Compare the invariant of a torus knot or link with a polynomial in unknown conventions.

    Parameters
    ----------
    knot : str or TorusLink
        ``T(p,q)``; a negative ``q`` is the mirror image.
    target : str, MPoly, Laurent, Laurent2 or PolynomialResult
        The polynomial to compare with, e.g. ``"t + t^3 - t^4"`` or ``"v/z - v^3/z + v*z"``.
    group : str, optional
        ``SU(N)`` or ``U(N)`` for one-variable targets (default ``SU(2)``); refused for the
        invariants of no single group (HOMFLY-PT, Alexander, Conway, Kauffman).
    rep : partition or list of partitions
        Colour of every component (or one per component).
    invariant : str
        ``"auto"`` (from the variables: ``a``/``v`` -> HOMFLY-PT, only ``z`` -> Conway,
        otherwise the quantum-group invariant of ``group``/``rep``), ``"quantum"``,
        ``"jones"``, ``"homfly"``, ``"alexander"`` or ``"conway"``.
    variables : iterable of str, optional
        Variable names allowed in ``target`` (default: t, x, q, s, a, v, z).
    source : str
        Where the target comes from (kept in the result).

    Returns
    -------
    Comparison
        ``equal``, the simplest ``map`` that makes them equal, every map found, or the
        closest map and the difference.

    Examples
    --------
    >>> c = compare("T(2,3)", "t + t^3 - t^4")
    >>> c.equal, c.map.describe()
    (True, 't = q^-1; normalized (unknot = 1)')
    >>> compare("T(2,3)", "t^-1 + t^-3 - t^-4").map.mirror
    True
    >>> compare("T(2,2)", "-x - x^5").map.describe()     # Hopf link, link-table style
    'x = q^(-1/2); normalized (unknot = 1); framing changed by -2 (factor theta^-2); overall sign -1'
    >>> compare("T(2,3)", "t + t^3 - 2*t^4").equal
    False

    References
    ----------
    V. F. R. Jones, Ann. of Math. 126 (1987) 335; Rosso–Jones, J. Knot Theory Ramifications 2
    (1993) 97; C. Livingston, A. H. Moore, KnotInfo (storage conventions); CONVENTIONS §3, §8.
    """
    k = parse_knot(knot)
    g = parse_group("SU(2)" if group is None else group)
    inv = invariant.lower().replace("_", "-") if isinstance(invariant, str) else invariant
    cols = colours_for(k, rep)
    if inv not in GROUP_FREE:
        cols = tuple(g.check(c) for c in cols)
    tp = _target_mpoly(target, variables)
    fam = _choose_family(tp, inv, k, g, cols)
    if group is not None and fam.name in GROUP_FREE:
        raise KnotobsError(group_free_message(fam.name, group))
    _require_search(k, tp, fam, _closest)
    maps, closest = _search(tp, fam, _closest)
    base = dict(knot=str(k), invariant=fam.name, group=fam.group, representation=fam.rep,
                target=str(tp), computed=fam.computed, computed_profile=fam.profile, source=source)
    if maps:
        return Comparison(equal=True, map=maps[0], maps=tuple(maps), **base)
    if closest is None:  # pragma: no cover - there is always at least one form
        return Comparison(equal=False, map=None, **base)
    (n, _), cm, d = closest
    return Comparison(equal=False, map=None, closest=cm, difference=str(d), differing_terms=n, **base)


_KI_INVARIANTS = ("jones", "homfly", "alexander", "conway", "kauffman")


def compare_knotinfo(knot, invariant: str = "jones") -> Comparison:
    """Compare with the tabulated entry of the open dataset ``database-knotinfo``.

    Parameters
    ----------
    knot : str or TorusLink
        A torus knot or link in the dataset (either chirality).
    invariant : ``"jones"``, ``"homfly"``, ``"alexander"``, ``"conway"`` or ``"kauffman"``

    Examples
    --------
    >>> c = compare_knotinfo("T(2,3)", "jones")
    >>> c.equal, c.map.mirror
    (True, False)

    References
    ----------
    C. Livingston, A. H. Moore, KnotInfo and LinkInfo (dataset ``database-knotinfo``);
    CONVENTIONS §8.
    """
    from knotobs.tables.knotinfo import dataset_version, lookup

    inv = invariant.lower()
    if inv not in _KI_INVARIANTS:
        raise KnotobsError(f"unknown tabulated invariant {invariant!r}: choose one of {', '.join(_KI_INVARIANTS)}")
    k = parse_knot(knot)
    e = lookup(k)
    text = {"jones": e.jones, "homfly": e.homfly, "alexander": e.alexander, "conway": e.conway,
            "kauffman": e.kauffman}[inv]
    if not text.strip():
        raise KnotobsError(f"the dataset has no {inv} polynomial for {e.name}")
    allowed = {"jones": (e.jones_variable,), "homfly": ("v", "z"), "alexander": ("t",), "conway": ("z",),
               "kauffman": ("a", "z")}[inv]
    try:
        tp = parse_polynomial(text, allowed)
    except ParseError as exc:
        raise ParseError(f"dataset entry {e.name}: {exc}") from None
    fam_inv = {"jones": "jones", "homfly": "homfly", "alexander": "alexander", "conway": "conway",
               "kauffman": "kauffman"}[inv]
    src = f"database-knotinfo {dataset_version()}, entry {e.name} (stored as {e.torus})"
    return compare(k, tp, "SU(2)" if fam_inv not in GROUP_FREE else None, (1,), fam_inv, source=src)
