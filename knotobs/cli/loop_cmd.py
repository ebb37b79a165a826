"""``knotobs loop`` and ``knotobs poly``: exact torus-knot invariants (parsing only).

Library modules are imported inside the commands, so ``knotobs --help`` and the other
commands do not pay for them.
"""

from __future__ import annotations

from typing import Optional

import typer

from knotobs.cli import _inputs
from knotobs.cli._app import app, emit, handle_errors
from knotobs.cli._options import framing as _framing, refuse, renamed, rep_or_color, rep_text
from knotobs.errors import ParseError


def _is_cartan(group: str) -> bool:
    """SO(N), Spin(N), Sp(2n), G2: their representations are read by the Cartan engine itself."""
    from knotobs.representations.cartan.group import is_simple_group_name

    return is_simple_group_name(group)


def _colors(group: str, rep, color):
    """The representation argument for the library: a partition (SU/U), or the text for SO/Sp/G2."""
    if _is_cartan(group):
        if color is not None:
            refuse("--color", f"is the SU(2) shorthand (--rep [n-1]); for {group} give --rep, e.g. [1] or (1,0)")
        return rep if rep is not None else "[1]"
    return rep_or_color(rep, color, group=group)

_POLY_ROUTES = ("auto", "rosso-jones", "weight-sum", "both")


@app.command()
@handle_errors
def loop(
    knot: Optional[str] = typer.Argument(None, help="Torus knot or link, e.g. T(2,3) or T(4,6); 'fiber' for a regular fiber of --in."),
    group: str = typer.Option("SU(2)", "--group", "-g", help="SU(N), U(N), SO(N), Spin(N), Sp(2n) or G2 (at a level: SU(N), U(N), SO(3) at odd k)."),
    rep: Optional[str] = typer.Option(None, "--rep", "-r", help="Partition, e.g. [2,1], or Dynkin labels (1,0) (SU(N): N-1 labels; SO/Sp/G2); links: [1];[2] per component. Default [1]."),
    color: Optional[int] = typer.Option(None, "--color", "-c", help="SU(2) shorthand: the n-dimensional irrep, i.e. --rep [n-1]."),
    framing: Optional[str] = typer.Option(None, "--framing", "-f", help="Integer, list (1,0) or 'fiber'. Default: zero framing."),
    normalized: Optional[bool] = typer.Option(None, "--normalized/--unnormalized", help="Polynomial only: divide by the unknot (default: unnormalized, unknot = dim_q)."),
    route: Optional[str] = typer.Option(None, "--route", help="Polynomial: auto (= rosso-jones), rosso-jones, weight-sum or both. At a level: auto, surgery, localisation or both (prints the agreement)."),
    level: Optional[int] = typer.Option(None, "--level", "-k", help="Evaluate at level k (SU(N)): exact cyclotomic + numeric."),
    in_: Optional[str] = typer.Option(None, "--in", help="With --level: S^3 (default), L(p,q), Sigma(a,b,c) or M(g; b; ...)."),
    fiber: Optional[int] = typer.Option(None, "--fiber", help="With --level and no KNOT: the exceptional fiber i (numbered 1..n as written)."),
    digits: Optional[int] = typer.Option(None, "--digits", "-d", help="With --level: correct digits of the numeric value (default 30)."),
    raw: bool = typer.Option(False, "--raw", help="With --level: Z(M; L) itself, not divided by Z(M) (use when Z(M) = 0)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Wilson loop of a torus knot/link: exact polynomial in q, or its value at level k."""
    cols = _colors(group, rep, color)
    rep_str = rep_text(rep, color, group=None if _is_cartan(group) else group)
    fr = _framing(framing)
    if level is None:
        for opt, given in (("--in", in_ is not None), ("--fiber", fiber is not None),
                           ("--digits", digits is not None), ("--raw", raw)):
            if given:
                refuse(opt, "needs --level k: without a level the Wilson loop is the exact polynomial in q in S^3")
        if knot is None:
            raise ParseError("give a knot, e.g. knotobs loop 'T(2,3)' (or --level k --in SPACE --fiber i)")
        r = route or "auto"
        if r not in _POLY_ROUTES:
            refuse("--route", f"{route!r}: choose auto, rosso-jones, weight-sum or both")
        from knotobs.evaluation.families import wilson_loop
        from knotobs.output.text import render_polynomial

        with _inputs.naming(f"{knot} with --rep {rep_str}"):
            res = wilson_loop(knot, group, cols, 0 if fr is None else fr, bool(normalized),
                              "rosso-jones" if r == "auto" else r)
        emit(res.to_json, lambda: render_polynomial(res), as_json)
        return
    if normalized is not None:
        refuse("--normalized" if normalized else "--unnormalized",
               "at a level the value is Z(M; L)/Z(M) (unknot in S^3 = dim_q); use --raw for Z(M; L) itself")
    if (fiber is not None or knot == "fiber") and isinstance(cols, list):
        refuse("--rep", f"{rep}: one fiber takes one representation (';' separates the components of a link)")
    space = in_ if in_ is not None else "S^3"
    in_s3 = space.replace(" ", "").upper() in ("S^3", "S3")
    if route not in (None, "auto", "surgery", "localisation", "both"):
        refuse("--route", f"{route!r}: at a level choose auto, surgery, localisation or both (rosso-jones and "
                          "weight-sum are the polynomial routes; in S^3 the exact polynomial is always "
                          "evaluated as a check)")
    if fiber is not None:
        if knot is not None:
            refuse("--fiber", "colors an exceptional fiber of --in instead of a knot: give one of them")
        if fiber < 1:
            refuse("--fiber", f"{fiber}: exceptional fibers are numbered 1..n in the order of the Seifert invariants")
        from knotobs.fibrations.seifert import parse_space

        n_fibers = len(parse_space(space).fibers)
        if fiber > n_fibers:
            refuse("--fiber", f"{fiber}: {space} has {n_fibers} exceptional fiber{'s' if n_fibers != 1 else ''} as"
                              f" written" + (f", numbered 1..{n_fibers}" if n_fibers else
                                              "; color a regular fiber with KNOT = fiber"))
    from knotobs.evaluation.level_loops import level_loop
    from knotobs.output.finite_text import finite_json, finite_text

    d = _inputs.digits(30 if digits is None else digits)
    with _inputs.naming(f"{knot if knot is not None else space} at --level {level} with --rep {rep_str}"):
        val = level_loop(knot, level, group, cols, space, None if fiber is None else fiber - 1, fr, not raw, d,
                         route or "auto")
    what = knot if knot is not None else f"exceptional fiber {fiber}"
    inputs = {"knot": knot, "space": space, "fiber": fiber, "group": group, "rep": rep_str, "level": level,
              "framing": framing, "digits": d, "raw": raw}
    title = f"Wilson loop of {what} in {space}, {group} at level {level}, color {rep_str}"
    emit(lambda: finite_json(val, inputs, "wilson-loop"), lambda: finite_text(val, title), as_json)


_FAMILIES = {"jones": "jones", "colored-jones": "colored-jones", "coloured-jones": "colored-jones",
             "homfly": "homfly", "homfly-pt": "homfly", "homflypt": "homfly", "alexander": "alexander",
             "kauffman": "kauffman", "dubrovnik": "dubrovnik", "superpolynomial": "superpolynomial"}
_FAMILY_LIST = "jones, colored-jones, homfly, alexander, kauffman, dubrovnik or superpolynomial"


@app.command()
@handle_errors
def poly(
    knot: str = typer.Argument(..., help="Torus knot or link, e.g. T(2,3)."),
    family: str = typer.Option("jones", "--family", help="jones, colored-jones, homfly, alexander, kauffman, dubrovnik (SO(N) form) or superpolynomial."),
    color: Optional[int] = typer.Option(None, "--color", "-c", help="colored-jones: J_n with n the dimension; homfly: --rep [n-1]."),
    rep: Optional[str] = typer.Option(None, "--rep", "-r", help="homfly: partition, e.g. [2,1]; colored-jones: [n-1]."),
    group: Optional[str] = typer.Option(None, "--group", "-g", help="homfly: SU(N) specialises a = q^(N/2) (default generic N); jones: SU(2)."),
    t_is: Optional[str] = typer.Option(None, "--t", help="jones, colored-jones: t = q^-1 (default) or t = q."),
    mirror: bool = typer.Option(False, "--mirror", help="Mirror image of the knot."),
    form: Optional[str] = typer.Option(None, "--form", help="homfly, generic N: az or aq (default az for [1], aq otherwise)."),
    normalized: Optional[bool] = typer.Option(None, "--normalized/--unnormalized", help="Divide by the unknot (default: normalized, as the named polynomials are defined)."),
    route: Optional[str] = typer.Option(None, "--route", help="superpolynomial: auto, nabla ([1] only), elliptic-hall, macdonald or both (two routes side by side, checked to agree)."),
    old_N: Optional[int] = typer.Option(None, "--N", hidden=True),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """A named polynomial (Jones, colored Jones, HOMFLY-PT, Alexander, Kauffman, superpolynomial) with its profile."""
    if old_N is not None:
        renamed("--N", "--group", f"--group 'SU({old_N})'")
    fam = _FAMILIES.get(family.lower().replace("_", "-"))
    if fam is None:
        refuse("--family", f"unknown family {family!r}: choose {_FAMILY_LIST}")
    g = None
    if group is not None:
        from knotobs.representations.groups import parse_group

        g = parse_group(group)
    norm = True if normalized is None else normalized
    if route is not None and fam != "superpolynomial":
        refuse("--route", "applies to --family superpolynomial (auto, nabla, elliptic-hall, macdonald, both); "
                          "the HOMFLY-PT routes are chosen with knotobs loop --route")
    from knotobs.evaluation import families as F

    if fam in ("jones", "colored-jones"):
        if form is not None:
            refuse("--form", "applies to --family homfly (the (a, z) or (a, q) form)")
        if g is not None and str(g) != "SU(2)":
            refuse("--group", f"the {fam} polynomial is the SU(2) invariant; use --family homfly --group {g}")
        t = t_is or "q^-1"
        if fam == "jones":
            if color is not None or rep is not None:
                refuse("--color" if color is not None else "--rep",
                       "the Jones polynomial is the fundamental color; use --family colored-jones --color n")
            with _inputs.naming(f"{knot}"):
                res = F.jones(knot, t_is=t, mirror=mirror, normalized=norm)
        else:
            if rep is not None:
                lam = rep_or_color(rep, None, group="SU(2)")
                if isinstance(lam, list) or len(lam) > 1:
                    refuse("--rep", f"{rep}: SU(2) colors are one-row partitions [n-1] (or use --color n)")
                n = (lam[0] if lam else 0) + 1
            elif color is not None:
                n = color
            else:
                raise ParseError("--family colored-jones needs --color n (n = dimension of the SU(2) irrep, n >= 1)")
            with _inputs.naming(f"{knot} with --color {n}"):
                res = F.colored_jones(knot, n, t_is=t, mirror=mirror, normalized=norm)
    elif fam == "homfly":
        if t_is is not None:
            refuse("--t", "applies to the Jones polynomials; HOMFLY-PT is written in a and z (or a and q)")
        cols = rep_or_color(rep, color, group=None if g is None else str(g))
        if g is not None:
            if g.kind != "SU":
                refuse("--group", f"{g}: the specialisation a = q^(N/2) is SU(N); the default is generic N")
            if form is not None:
                refuse("--form", "applies to generic N; with --group SU(N) the result is a polynomial in q")
            if normalized is False:
                refuse("--unnormalized", "the SU(N) specialisation is of the normalized polynomial; "
                                         "use knotobs loop --group SU(N) for the unnormalized Wilson loop")
            with _inputs.naming(f"{knot} with --rep {rep_text(rep, color)}"):
                res = F.homfly_at(knot, g.N, cols, mirror=mirror)
        else:
            with _inputs.naming(f"{knot} with --rep {rep_text(rep, color)}"):
                res = F.homfly(knot, cols, mirror=mirror, normalized=norm, form=form)
    elif fam in ("kauffman", "dubrovnik", "superpolynomial"):
        for opt, given in (("--color", color is not None), ("--group", g is not None), ("--t", t_is is not None),
                           ("--form", form is not None), ("--unnormalized", normalized is False),
                           ("--rep", rep is not None and fam == "dubrovnik")):
            if given:
                where = ("SO(N) values: knotobs loop --group 'SO(N)'" if fam != "superpolynomial" else
                         "its t = -1 specialisation is HOMFLY-PT: --family homfly")
                refuse(opt, f"does not apply to --family {fam} (normalized, unknot = 1, in its own variables; {where})")
        if fam == "superpolynomial":
            from knotobs.refined import superpolynomial
            from knotobs.refined.superpolynomial import ROUTES

            if route is not None and route not in ROUTES:
                refuse("--route", f"{route!r}: choose {', '.join(ROUTES)}")
            with _inputs.naming(f"{knot}" if rep is None else f"{knot} with --rep {rep}"):
                res = superpolynomial(knot, rep_or_color(rep, None), mirror=mirror, route=route or "auto")
        else:
            from knotobs.evaluation.kauffman import dubrovnik, kauffman

            kw = {"rep": rep_or_color(rep, None)} if (rep is not None and fam == "kauffman") else {}
            with _inputs.naming(f"{knot}"):
                res = (kauffman if fam == "kauffman" else dubrovnik)(knot, mirror=mirror, **kw)
    else:
        for opt, given in (("--color", color is not None), ("--rep", rep is not None), ("--group", g is not None),
                           ("--t", t_is is not None), ("--form", form is not None),
                           ("--unnormalized", normalized is False)):
            if given:
                refuse(opt, "does not apply to the Alexander polynomial (Conway-normalized, variable t)")
        res = F.alexander(knot, mirror=mirror)
    from knotobs.output.text import render_polynomial

    emit(res.to_json, lambda: render_polynomial(res), as_json)
