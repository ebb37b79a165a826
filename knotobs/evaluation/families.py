"""Named invariants and the entry point that picks an evaluation route.

All of them come from the same zero-framed Wilson loop ``W`` of docs/conventions.md §3
(unknot = ``dim_q``, ``q = exp(2 pi i/(k+N))`` at level ``k``):

* :func:`wilson_loop` — ``W`` itself for SU(N) or U(N), any framing, optionally
  divided by the unknot.
* :func:`jones` — ``V(t)`` with ``t^-1 V(L+) - t V(L-) = (t^(1/2) - t^(-1/2)) V(L0)``,
  ``V(unknot) = 1``; the positive trefoil ``T(2,3)`` gives ``t + t^3 - t^4``
  (V. F. R. Jones, Ann. of Math. 126 (1987) 335).  In terms of SU(2):
  ``V(t) = (-1)^(c-1) theta(fund)^(-2 lk) W / [2]`` at ``q = t^-1`` (c components,
  ``lk`` the total linking number).
* :func:`colored_jones` — ``J_n`` with colour ``n`` the n-dimensional representation of
  SU(2) (``J_2 = V``): ``J_n(t) = (-1)^((n-1)(c-1)) theta(n)^(-2 lk) W_n / [n]`` at ``q = t^-1``.
* :func:`homfly` — HOMFLY-PT in ``(a, z)`` with ``a P(L+) - a^-1 P(L-) = z P(L0)``,
  ``P(unknot) = 1``, ``a = q^(N/2)``, ``z = q^(1/2) - q^(-1/2)``; the positive trefoil is
  ``2 a^-2 - a^-4 + a^-2 z^2``.  Coloured by any partition via the generic-N (U(N))
  Rosso–Jones sum; for links the U(N) linking phase is removed by
  ``a^(-2 lk_ij |lam_i| |lam_j|)`` so that the fundamental case obeys the skein relation.
* :func:`alexander` — ``Delta(t) = P(a = 1, z = t^(1/2) - t^(-1/2))``, symmetric
  (Conway-normalised) form.
"""

from __future__ import annotations

from fractions import Fraction

from knotobs.errors import InvalidRepresentationError, KnotobsError
from knotobs.evaluation.two_routes import ROUTES, RouteMismatchError, run_routes
from knotobs.evaluation.framing import FramingSpec, resolve_framing
from knotobs.evaluation.profiles import NORMALISED, UNNORMALISED, Profile
from knotobs.evaluation.result import PolynomialResult
from knotobs.evaluation.estimates import guard_homfly, labelled
from knotobs.evaluation.rosso_jones import colours_for, rosso_jones, rosso_jones_dense, rosso_jones_homfly
from knotobs.evaluation.weight_sum import weight_sum, weight_sum_dense
from knotobs.fibrations.torus import TorusLink, parse_knot
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.dense import Dense
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.groups import (
    SU,
    Group,
    casimir,
    homfly_unknot,
    parse_group,
    quantum_dimension,
)
from knotobs.representations.cartan.group import is_simple_group_name
from knotobs.representations.partitions import as_partition, contents

__all__ = ["wilson_loop", "jones", "colored_jones", "homfly", "homfly_at", "alexander", "ROUTES", "RouteMismatchError"]


_T_MAPS = {"q^-1": -1, "1/q": -1, "q": 1}




def _framing_note(knot: TorusLink, framing: FramingSpec, frames: tuple[int, ...]) -> str:
    if isinstance(framing, str) and framing.lower().startswith("fib"):
        return f"fiber framing P*Q = {knot.P * knot.Q} of the Seifert fibration of S^3"
    if all(f == 0 for f in frames):
        return "zero (Seifert) framing"
    return "relative to the zero (Seifert) framing"


def _route_value(knot, group, cols, framing, route):
    return run_routes(route, lambda: rosso_jones(knot, group, cols, framing),
                      lambda: weight_sum(knot, group, cols, framing), f"{knot}, {group}, {cols}")


def wilson_loop(
    knot: "TorusLink | str",
    group: "Group | str" = "SU(2)",
    rep=(1,),
    framing: FramingSpec = 0,
    normalized: bool = False,
    route: str = "rosso-jones",
) -> PolynomialResult:
    """Exact Wilson loop of a torus knot or link in S^3 as a polynomial in ``q``.

    Parameters
    ----------
    knot : TorusLink or str
        ``T(p,q)``; a link when ``gcd(p, q) > 1``.
    group : Group or str
        ``"SU(N)"`` or ``"U(N)"``; ``"SO(N)"``, ``"Spin(N)"``, ``"Sp(2n)"``, ``"G2"`` go to
        :func:`knotobs.evaluation.cartan_loops.simple_wilson_loop` (representations as text
        ``"(1,0)"``/``"[1]"``, see docs/groups.md).
    rep : partition or sequence of partitions
        Colour of every component, or one colour per component.
    framing : int, list of int, ``"zero"`` or ``"fiber"``
        Default: zero (Seifert) framing on every component.
    normalized : bool
        Divide by the unknot ``dim_q`` of the first colour.
    route : ``"rosso-jones"``, ``"weight-sum"`` or ``"both"``
        ``"both"`` computes the two independent routes and checks they agree.

    Examples
    --------
    >>> r = wilson_loop("T(2,3)", "SU(2)", [1], normalized=True)
    >>> r.exact_string()
    '-q^-4 + q^-3 + q^-1'
    >>> wilson_loop("T(2,3)", "SU(3)", [2, 1], route="both").value == wilson_loop("T(3,2)", "SU(3)", [2, 1]).value
    True

    References
    ----------
    Rosso–Jones (1993); Lawrence–Rozansky (1999); CONVENTIONS §3–§4.
    """
    if is_simple_group_name(group):
        # SO(N), Spin(N), Sp(2n), G2: the Cartan engine's routes (docs/groups.md, §14)
        from knotobs.evaluation.cartan_loops import simple_wilson_loop

        return simple_wilson_loop(knot, group, rep, framing, normalized, route)
    knot = parse_knot(knot)
    group = parse_group(group)
    cols = tuple(group.check(c) for c in colours_for(knot, rep))
    frames = resolve_framing(knot, framing)
    w = _route_value(knot, group, cols, framing, route)
    if normalized:
        w = w.exact_div(quantum_dimension(group, cols[0]))
    profile = Profile(
        variables=("q",),
        variable_map=f"q = exp(2 pi i/(k+N)) at level k; theta(lam) = q^C(lam) with the {group.kind}(N) Casimir",
        framing=frames,
        framing_note=_framing_note(knot, framing, frames),
        normalisation=NORMALISED if normalized else UNNORMALISED,
        chirality="positive torus link" if knot.chirality > 0 else "negative (mirror) torus link",
    )
    return PolynomialResult(
        quantity="wilson-loop",
        knot=str(knot),
        group=str(group),
        colours=cols,
        value=w.canonical(),
        profile=profile,
        route=route,
        inputs={"knot": str(knot), "group": str(group), "rep": [list(c) for c in cols],
                "framing": list(frames), "normalized": normalized},
    )


def _t_sign(t_is: str) -> int:
    key = t_is.replace(" ", "")
    if key not in _T_MAPS:
        raise KnotobsError(f"unknown variable map t = {t_is!r}: use 'q^-1' (standard) or 'q'")
    return _T_MAPS[key]


def _route_dense(knot, group, cols, framing, route) -> Dense:
    return run_routes(route, lambda: rosso_jones_dense(knot, group, cols, framing),
                      lambda: weight_sum_dense(knot, group, cols, framing), f"{knot}, {group}, {cols}")


def _divide_by_qinteger(w: Dense, n: int) -> Dense:
    """``w / [n] = w {1} / {n}`` with ``{x} = q^(x/2) - q^(-x/2)``: one shifted subtraction, one prefix sum."""
    return w.mul_curly(1).div_curly(n)


def _jones_like(knot: TorusLink, n: int, t_is: str, mirror: bool, normalized: bool, route: str):
    t_sign = _t_sign(t_is)
    if mirror:
        knot = knot.mirror()
    group = SU(2)
    lam = (n - 1,) if n > 1 else ()
    with labelled(f"the coloured Jones polynomial J_{n} of {knot}" if n != 2 else f"the Jones polynomial of {knot}"):
        w = _route_dense(knot, group, (lam,) * knot.components, 0, route)
    c = knot.components
    lk = knot.linking_number * c * (c - 1) // 2
    e = -2 * lk * casimir(group, lam)
    w = w.times_monomial(e, (-1) ** ((n - 1) * (c - 1)))
    if normalized:
        w = _divide_by_qinteger(w, n)
    if t_sign < 0:
        w = w.mirror()
    return knot, w.rename("t").to_laurent()


def _chir(mirror: bool) -> str:
    return "mirror image of the input" if mirror else "as given"


def jones(knot, t_is: str = "q^-1", mirror: bool = False, normalized: bool = True, route: str = "rosso-jones") -> PolynomialResult:
    """Jones polynomial ``V(t)`` of a torus knot or link.

    Examples
    --------
    >>> jones("T(2,3)").exact_string()
    't + t^3 - t^4'
    >>> jones("T(2,2)").exact_string()        # positive Hopf link
    '-t^(1/2) - t^(5/2)'

    References
    ----------
    V. F. R. Jones, Ann. of Math. 126 (1987) 335–388; CONVENTIONS §3, §8.
    """
    k0 = parse_knot(knot)
    k, v = _jones_like(k0, 2, t_is, mirror, normalized, route)
    prof = Profile(
        variables=("t",), variable_map=f"t = {t_is}",
        framing=(0,) * k.components, framing_note="zero framing; for links the total linking is removed as the skein relation requires",
        normalisation=NORMALISED if normalized else "unnormalized (unknot = [2] = t^(1/2) + t^(-1/2))",
        chirality=_chir(mirror),
        skein="t^-1 V(L+) - t V(L-) = (t^(1/2) - t^(-1/2)) V(L0)" if t_is.replace(" ", "") != "q" else "V(1/t) of the standard convention",
    )
    return PolynomialResult("jones", str(k0), "SU(2)", ((1,),) * k.components, v, prof, route,
                            {"knot": str(k0), "t": t_is, "mirror": mirror, "normalized": normalized})


def colored_jones(knot, n: int, t_is: str = "q^-1", mirror: bool = False, normalized: bool = True, route: str = "rosso-jones") -> PolynomialResult:
    """Coloured Jones polynomial ``J_n(t)``: colour ``n`` = the n-dimensional irrep of SU(2).

    ``J_1 = 1``, ``J_2 = V``.

    Examples
    --------
    >>> colored_jones("T(2,3)", 2).value == jones("T(2,3)").value
    True
    >>> colored_jones("T(2,3)", 3).exact_string()
    't^2 + t^5 - t^7 + t^8 - t^9 - t^10 + t^11'

    References
    ----------
    H. R. Morton, Math. Proc. Camb. Phil. Soc. 117 (1995) 129–135 (torus knots);
    CONVENTIONS §3.
    """
    if not isinstance(n, int) or isinstance(n, bool) or n < 1:
        raise InvalidRepresentationError(f"colour n={n!r} must be a positive integer (n = dimension of the SU(2) irrep)")
    as_partition([n - 1])  # size check
    k0 = parse_knot(knot)
    k, v = _jones_like(k0, n, t_is, mirror, normalized, route)
    prof = Profile(
        variables=("t",), variable_map=f"t = {t_is}",
        framing=(0,) * k.components, framing_note="zero framing (for links: theta(n)^(-2 lk) and sign (-1)^((n-1)(c-1)) applied)",
        normalisation=NORMALISED if normalized else "unnormalized (unknot = [n])",
        chirality=_chir(mirror), skein=f"colour n = {n} (dimension), J_2 = Jones V",
    )
    return PolynomialResult("colored-jones", str(k0), "SU(2)", ((n - 1,),) * k.components, v, prof, route,
                            {"knot": str(k0), "color": n, "t": t_is, "mirror": mirror, "normalized": normalized})


def _refuse_non_laurent(knot: TorusLink, cols, normalized: bool) -> None:
    """Refuse the requests whose HOMFLY-PT is not a Laurent polynomial (before any estimate or sum)."""
    c = knot.components
    # every component fundamental, or every component trivial (the value 1), stays a Laurent
    # polynomial; refusals come first, before the Rosso-Jones sum is computed
    coloured = not (all(cc == (1,) for cc in cols) or all(cc == () for cc in cols))
    if not normalized and coloured:
        raise InvalidRepresentationError(
            "the unnormalised coloured HOMFLY-PT is not a Laurent polynomial in (a, z); ask for"
            " the normalised one (the unknot factor is prod (a s^c - a^-1 s^-c)/prod (s^h - s^-h))"
        )
    if normalized and c > 1 and coloured:
        raise InvalidRepresentationError(
            f"the normalised HOMFLY-PT of the {c}-component link {knot} coloured by"
            f" {[list(cc) for cc in cols]} is a rational function of (a, q), not a Laurent polynomial;"
            " coloured links are available for a fixed N: use wilson_loop / 'knotobs loop --group U(N)'"
        )


def _homfly_value(knot: TorusLink, cols, normalized: bool) -> Laurent2:
    c = knot.components
    _refuse_non_laurent(knot, cols, normalized)
    num, D = rosso_jones_homfly(knot, cols, 0)
    # remove the U(N) linking phase: a^(-2 lk_ij |lam_i||lam_j|)
    lk = knot.linking_number
    pair = sum(sum(cols[i]) * sum(cols[j]) for i in range(c) for j in range(i + 1, c))
    num = num.times_monomial(-2 * lk * pair)
    if not normalized:
        # fundamental: W = P (a - 1/a)/z, a Laurent polynomial in a and z^-1
        zc = (Laurent.gen("s") - Laurent.gen("s") ** -1) ** c
        return (num * Laurent2.from_s(zc)).exact_div_s(D).with_zpow(-c)
    lam = cols[0]
    unum, uden = homfly_unknot(lam)
    # a c-component link has P in z^(1-c) Z[a^+-1, z]: carry z^(c-1) along
    zc = (Laurent.gen("s") - Laurent.gen("s") ** -1) ** (c - 1)
    out = (num * Laurent2.from_s(uden * zc)).exact_div_s(D)
    for cc in contents(lam):
        # divide by a s^cc - a^-1 s^-cc = a^-1 s^-cc (a^2 s^(2cc) - 1)
        out = out.times_monomial(1, cc).exact_div_binomial(2, Laurent.monomial(2 * cc, var="s"))
    return out.with_zpow(1 - c)


def homfly(knot, rep=(1,), mirror: bool = False, normalized: bool = True, form: str | None = None) -> PolynomialResult:
    """HOMFLY-PT polynomial in ``(a, z)`` or ``(a, q)``, coloured by any partition.

    Knots take any colour; links take the fundamental colour on every component (a
    coloured link's normalised HOMFLY-PT is a rational function, so it is refused with
    a clear error; use a fixed N through :func:`wilson_loop` instead).

    The value is kept in ``(a, s)`` (``s = q^(1/2)``, ``z = s - 1/s``) and printed in
    ``(a, z)`` (``form="az"``, the default for the fundamental representation) or in
    ``(a, q)`` (``form="aq"``, the default for other colours, which are in general not
    polynomials in ``z``).

    Examples
    --------
    >>> homfly("T(2,3)").exact_string()
    '2*a^-2 + a^-2*z^2 - a^-4'
    >>> homfly("T(2,2)").exact_string()    # positive Hopf link
    'a^-1*z^-1 + a^-1*z - a^-3*z^-1'

    References
    ----------
    Freyd–Yetter–Hoste–Lickorish–Millett–Ocneanu, Bull. AMS 12 (1985); Przytycki–Traczyk (1987);
    Rosso–Jones (1993); Lin–Zheng (2010); CONVENTIONS §3.
    """
    k0 = parse_knot(knot)
    k = k0.mirror() if mirror else k0
    cols = colours_for(k, rep)
    col = [list(c) for c in cols]
    if form is None:
        form = "az" if all(c == (1,) for c in cols) else "aq"
    if form not in ("az", "aq"):
        raise KnotobsError(f"unknown HOMFLY-PT form {form!r}: use 'az' or 'aq'")
    _refuse_non_laurent(k, cols, normalized)       # an invalid request is named before its size
    guard_homfly(k, cols, with_z=(form == "az"))
    with labelled(f"the HOMFLY-PT polynomial of {k0} coloured by {col[0] if len(set(cols)) == 1 else col}"):
        val = _homfly_value(k, cols, normalized)
    if form == "az":
        try:
            val.to_az()
        except KnotobsError:
            raise KnotobsError(
                f"the HOMFLY-PT polynomial of {k0} coloured by {[list(c) for c in cols]} is not a"
                " Laurent polynomial in z; ask for the (a, q) form"
            ) from None
    prof = Profile(
        variables=("a", form[1]),
        variable_map="a = q^(N/2), z = q^(1/2) - q^(-1/2)" if form == "az" else "a = q^(N/2), q = exp(2 pi i/(k+N))",
        framing=(0,) * k.components,
        framing_note="zero framing; for links the linking phase a^(-2 lk |lam_i||lam_j|) is removed",
        normalisation=NORMALISED if normalized else "unnormalized (unknot = (a - a^-1)/z)",
        chirality=_chir(mirror), skein="a P(L+) - a^-1 P(L-) = z P(L0)",
    )
    return PolynomialResult("homfly", str(k0), "U(N), generic N", cols, val, prof, "rosso-jones (generic N)",
                            {"knot": str(k0), "rep": [list(c) for c in cols], "mirror": mirror, "normalized": normalized, "form": form})


def homfly_at(knot, N: int, rep=(1,), mirror: bool = False) -> PolynomialResult:
    """The normalised HOMFLY-PT polynomial specialised to SU(N): ``a = q^(N/2)``, ``s = q^(1/2)``.

    For knots this is the normalised SU(N) Wilson loop of :func:`wilson_loop` (zero framing).

    Examples
    --------
    >>> homfly_at("T(2,3)", 2).exact_string()
    '-q^-4 + q^-3 + q^-1'

    References
    ----------
    CONVENTIONS §1, §3.
    """
    res = homfly(knot, rep, mirror=mirror, normalized=True, form="aq")  # the z form is not needed here
    SU(N)  # validates N
    val = res.value.specialize(Fraction(N, 2))
    prof = Profile(
        variables=("q",), variable_map=f"a = q^({N}/2), z = q^(1/2) - q^(-1/2)",
        framing=res.profile.framing, framing_note=res.profile.framing_note,
        normalisation=NORMALISED, chirality=res.profile.chirality, skein=res.profile.skein,
    )
    return PolynomialResult("homfly", res.knot, f"SU({N})", res.colours, val.canonical(), prof, res.route,
                            dict(res.inputs, N=N))


def alexander(knot, mirror: bool = False) -> PolynomialResult:
    """Alexander polynomial ``Delta(t) = P(a = 1, z = t^(1/2) - t^(-1/2))`` (Conway-normalised).

    Examples
    --------
    >>> alexander("T(2,3)").exact_string()
    't^-1 - 1 + t'

    References
    ----------
    J. H. Conway, in *Computational Problems in Abstract Algebra* (1970); CONVENTIONS §8.
    """
    k0 = parse_knot(knot)
    k = k0.mirror() if mirror else k0
    cols = ((1,),) * k.components
    P = _homfly_value(k, cols, True)
    delta = P.with_zpow(0).specialize(0, 1, var="s")  # a = 1, s = s
    if P.zpow < 0:
        delta = delta.exact_div((Laurent.gen("s") - Laurent.gen("s") ** -1) ** (-P.zpow))
    elif P.zpow > 0:
        delta = delta * (Laurent.gen("s") - Laurent.gen("s") ** -1) ** P.zpow
    delta = delta.subs_power(Fraction(1, 2)).rename("t").canonical()  # s = t^(1/2)
    prof = Profile(
        variables=("t",), variable_map="t = q (s = t^(1/2)); Delta(t) = Delta(1/t)",
        framing=(0,) * k.components, framing_note="framing-independent",
        normalisation="Conway normalized: Delta(unknot) = 1, Delta(t) = Delta(1/t)",
        chirality=_chir(mirror), skein="Delta(L+) - Delta(L-) = (t^(1/2) - t^(-1/2)) Delta(L0)",
    )
    return PolynomialResult("alexander", str(k0), "HOMFLY-PT at a = 1", cols, delta, prof, "rosso-jones (generic N)",
                            {"knot": str(k0), "mirror": mirror})
