"""``knotobs flat``, ``knotobs continue`` and ``knotobs plot``: the continuation side (parsing only)."""

from __future__ import annotations

from typing import Optional

import typer

from knotobs.cli import _inputs
from knotobs.cli._app import app, emit, handle_errors
from knotobs.cli._options import framing as _framing, refuse, renamed, rep_or_color, rep_text
from knotobs.errors import ParseError


@app.command()
@handle_errors
def flat(
    space: str = typer.Argument(..., help="Seifert rational homology sphere, e.g. Sigma(2,3,7), L(5,1), M(0; -1; (2,1), (3,1), (5,1))."),
    order: Optional[int] = typer.Option(None, "--order", help="SU(2): highest power of (q - 1) in the Ohtsuki series (default 6)."),
    group: str = typer.Option("SU(2)", "--group", "-g", help="SU(2); SL(2,C) (every flat SL(2,C) connection); or SU(N) on lens spaces."),
    digits: Optional[int] = typer.Option(None, "--digits", "-d", help="SL(2,C): digits of the torsions (default 15)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Flat connections: CS invariants mod 1, one-loop data, Casson invariant, Ohtsuki series."""
    if group.replace(" ", "").upper() == "SL(2,C)":
        if order is not None:
            refuse("--order", "the Ohtsuki series belongs to the SU(2) table; drop --order with --group 'SL(2,C)'")
        from knotobs.flat.table import flat_sl2c_connections
        from knotobs.output.flat_text import flat_sl2c_text

        t = flat_sl2c_connections(space, digits=_inputs.digits(15 if digits is None else digits))
        emit(t.to_json, lambda: flat_sl2c_text(t), as_json)
        return
    if digits is not None:
        refuse("--digits", "applies to --group 'SL(2,C)' (torsions); the SU(2) table prints fixed digits")
    from knotobs.representations.groups import parse_group

    g = parse_group(group)
    if g.kind != "SU":
        refuse("--group", f"{g}: flat connections are computed for SU(N)")
    if g.N == 2:
        from knotobs.continuation.flat import flat_connections
        from knotobs.output.continuation_text import flat_text

        t = flat_connections(space, ohtsuki_order=6 if order is None else order)
        emit(t.to_json, lambda: flat_text(t), as_json)
        return
    if order is not None:
        refuse("--order", f"the Ohtsuki series is computed for SU(2), not {g}")
    from knotobs.continuation.flat_sun import lens_flat_connections
    from knotobs.output.continuation_text import flat_sun_json, flat_sun_text

    conns = lens_flat_connections(space, g.N)
    emit(lambda: flat_sun_json(space, g, conns), lambda: flat_sun_text(space, g, conns), as_json)


@app.command("continue")
@handle_errors
def continue_(
    target: str = typer.Argument(..., help="A Seifert space (Sigma(2,3,5), L(7,2), ...) or, with --couplings, a torus knot T(p,q)."),
    level: Optional[str] = typer.Option(None, "--level", "-k", help="Complex level k, e.g. 7.5+0.3i (K = k + N)."),
    K: Optional[str] = typer.Option(None, "--K", help="Complex shifted level K instead of --level."),
    couplings: Optional[str] = typer.Option(None, "--couplings", help="SL(N,C) couplings t,tt, e.g. 10+2i,10-2i."),
    group: Optional[str] = typer.Option(None, "--group", "-g", help="SU(N) at complex level (default SU(2); SU(3): every Seifert rational homology sphere within the size limits; SU(N), N >= 4: lens spaces; e = 0 (S^1 x Sigma_g, torus bundles, ...): every SU(N)); SL(N,C) with --couplings (default SL(2,C))."),
    rep: Optional[str] = typer.Option(None, "--rep", "-r", help="With --couplings and a knot: [lam];[lamt] (default [1];[])."),
    digits: int = typer.Option(30, "--digits", "-d", help="Digits (1 to 2000): error below 10^-d max(|Z|, 1), so decimal places when |Z| < 1."),
    phases: Optional[str] = typer.Option(None, "--phases", help="Complex level: reduced (default; CS values in (-1/2,1/2]) or lawrence-rozansky."),
    route: Optional[str] = typer.Option(None, "--route", help="SU(N) and e = 0: auto (default), closed, quadrature, residues or both (two methods compared; e = 0: interpolated from the localisation and from the surgery route)."),
    old_N: Optional[int] = typer.Option(None, "--N", hidden=True),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Values at complex level (Seifert partition functions) or at SL(N,C) couplings (torus knots)."""
    if old_N is not None:
        renamed("--N", "--group", f"--group 'SL({old_N},C)'")
    digits = _inputs.digits(digits)
    is_knot = target.strip().upper().startswith("T(")
    if couplings is not None:
        for opt, val in (("--level", level), ("--K", K), ("--phases", phases), ("--route", route)):
            if val is not None:
                refuse(opt, "does not apply with --couplings (the couplings t, tt set both levels)")
        import re

        gname = (group or "SL(2,C)").replace(" ", "").upper()
        m = re.fullmatch(r"SL\((\d+),C\)", gname)
        if not m:
            refuse("--group", f"{group}: with --couplings the group is SL(N,C), e.g. 'SL(3,C)'")
        N = int(m.group(1))
        from knotobs.output.continuation_text import sector_text, sl_text

        if not is_knot:
            if rep is not None:
                refuse("--rep", "colors a knot; the partition function of a space has no Wilson line")
            if N != 2:
                refuse("--group", f"{group}: the sector sum over flat connections is computed for SL(2,C)")
            from knotobs.continuation.complex import sl2c_partition_function

            res = sl2c_partition_function(target, couplings, digits=digits)
            emit(res.to_json, lambda: sector_text(res, target), as_json)
            return
        from knotobs.continuation.complex import sl_wilson_loop

        r = rep or "[1];[]"
        res = sl_wilson_loop(target, r, couplings, N=N, digits=digits)
        emit(res.to_json, lambda: sl_text(res, target, r, N), as_json)
        return
    if rep is not None:
        refuse("--rep", "needs --couplings and a knot: the continued partition function has no Wilson line")
    sun = None
    if group is not None and group.replace(" ", "").upper() != "SU(2)":
        from knotobs.errors import KnotobsError
        from knotobs.representations.groups import parse_group

        try:
            g = parse_group(group)
        except KnotobsError as exc:
            refuse("--group", f"{group}: {exc}")
        if g.kind != "SU":
            refuse("--group", f"{group}: the continuation in the level is computed for SU(N)"
                              " (SL(N,C) Wilson loops: --couplings t,tt)")
        sun = g.N
    if is_knot:
        raise ParseError(f"{target} is a knot: give --couplings t,tt for its SL(N,C) Wilson loop, or a space")
    if level is None and K is None:
        raise ParseError("give --level k (complex, e.g. 7.5+0.3i), --K, or --couplings t,tt")
    if level is not None and K is not None:
        refuse("--K", f"give the level once: --level k or --K (= k + {sun or 2})")
    if sun is None:
        from knotobs.continuation.cartan.quasipolynomial import has_zero_euler
        from knotobs.fibrations.seifert import parse_space

        if has_zero_euler(parse_space(target)):
            sun = 2                  # e = 0: the Verlinde or quasi-polynomial in K, for every SU(N)
    if sun is not None:
        from knotobs.continuation.cartan import continued_sun_partition_function
        from knotobs.output.continuation_text import continued_text

        ph = phases or "reduced"
        res = continued_sun_partition_function(target, f"SU({sun})", level, K=K, digits=digits, phases=ph,
                                               method=route or "auto")
        emit(res.to_json, lambda: continued_text(res, ph), as_json)
        return
    if route not in (None, "auto"):
        from knotobs.continuation.cartan.value import METHODS

        if route not in METHODS:
            refuse("--route", f"{route}: use one of {', '.join(METHODS)} (with --group 'SU(N)' or for e = 0)")
        refuse("--route", f"{route}: the SU(2) continuation of a space with e != 0 has one method (the"
                          " Lawrence-Rozansky integral plus residues, docs §9); --route chooses among the"
                          " SU(N) methods (--group 'SU(N)') and for e = 0")
    from knotobs.continuation.level import continued_partition_function
    from knotobs.output.continuation_text import continued_text

    from knotobs.output.progress import terminal_progress

    ph = phases or "reduced"
    bar = terminal_progress(f"continue {target}")
    try:
        res = continued_partition_function(target, level, K=K, digits=digits, phases=ph, progress=bar)
    finally:
        if bar is not None:
            bar.close()
    emit(res.to_json, lambda: continued_text(res, ph), as_json)


_PLOT_KINDS = ("level-plane", "asymptotics", "zeros", "wilson-level", "borel")
#: options of ``plot`` and the kinds they apply to
_PLOT_OPTIONS = {"--re": ("level-plane",), "--im": ("level-plane",), "--n": ("level-plane",),
                 "--progress": ("level-plane",), "--kmax": ("asymptotics", "wilson-level"),
                 "--color": ("zeros", "wilson-level"), "--rep": ("wilson-level",), "--group": ("wilson-level", "level-plane"),
                 "--framing": ("wilson-level",), "--normalized": ("wilson-level",)}


@app.command()
@handle_errors
def plot(
    kind: str = typer.Argument(..., help="level-plane, asymptotics, zeros, wilson-level or borel."),
    target: str = typer.Argument(..., help="Seifert space (level-plane, asymptotics, borel) or torus knot (zeros, wilson-level)."),
    output: Optional[str] = typer.Option(None, "--output", "-o", help="Figure file (.png, .svg or .pdf); optional with --json."),
    re_range: Optional[str] = typer.Option(None, "--re", help="level-plane: range of Re K (default 3,12)."),
    im_range: Optional[str] = typer.Option(None, "--im", help="level-plane: range of Im K (default -1,1)."),
    n: Optional[int] = typer.Option(None, "--n", help="level-plane: grid points per axis (default 24, drawn smoothly)."),
    kmax: Optional[int] = typer.Option(None, "--kmax", help="asymptotics: largest K (default 200); wilson-level: largest k (default 40)."),
    color: Optional[int] = typer.Option(None, "--color", "-c", help="zeros: colored Jones J_n; wilson-level: SU(2) n-dimensional irrep."),
    rep: Optional[str] = typer.Option(None, "--rep", "-r", help="wilson-level: partition (default [1])."),
    group: Optional[str] = typer.Option(None, "--group", "-g", help="wilson-level, level-plane: SU(N) (default SU(2))."),
    framing: Optional[str] = typer.Option(None, "--framing", "-f", help="wilson-level: integer framing (default 0) or fiber."),
    normalized: Optional[bool] = typer.Option(None, "--normalized/--unnormalized", help="wilson-level: divide by the unknot (default unnormalized)."),
    progress: Optional[bool] = typer.Option(None, "--progress/--no-progress", help="level-plane: progress bar on stderr (default: when it is a terminal)."),
    old_out: Optional[str] = typer.Option(None, "--out", hidden=True),
    as_json: bool = typer.Option(False, "--json", help="Print the figure's data as one JSON object."),
) -> None:
    """Figures: |Z| and arg Z over the complex K plane, exact vs asymptotic, zeros, Wilson loop vs level, Borel plane."""
    if old_out is not None:
        renamed("--out", "--output/-o", f"-o {old_out}")
    k = kind.lower()
    if k not in _PLOT_KINDS:
        raise ParseError(f"unknown plot {kind!r}: use {', '.join(_PLOT_KINDS)}")
    given = {"--re": re_range, "--im": im_range, "--n": n, "--progress": progress, "--kmax": kmax, "--color": color,
             "--rep": rep, "--group": group, "--framing": framing, "--normalized": normalized}
    for opt, val in given.items():
        if val is not None and k not in _PLOT_OPTIONS[opt]:
            refuse(opt, f"does not apply to plot {k} (it applies to {', '.join(_PLOT_OPTIONS[opt])})")
    if output is None and not as_json:
        raise ParseError("give the figure file: --output figure.png (or --json for the data only)")
    if output is not None:
        _inputs.output_path(output, "--output")
    from knotobs.output import plots

    if k == "level-plane":
        fig = plots.plot_level_plane(target, output, _inputs.float_range(re_range or "3,12", "--re"),
                                     _inputs.float_range(im_range or "-1,1", "--im"),
                                     n=24 if n is None else n, progress=progress, group=group or "SU(2)")
    elif k == "asymptotics":
        if kmax is not None:
            _inputs.int_at_least(kmax, 4, "--kmax", "every integer K from 3 is sampled and the plot needs two levels")
        fig = plots.plot_asymptotics(target, output, kmax=200 if kmax is None else kmax)
    elif k == "borel":
        if output is None:
            refuse("--json", "plot borel writes a figure: give --output figure.png (knotobs borel --json prints the data)")
        from knotobs.output.borel_plot import plot_borel

        fig = plot_borel(target, output)
    elif k == "zeros":
        if color is not None:
            _inputs.int_at_least(color, 1, "--color", "the color is the dimension n >= 1 of the SU(2) irrep")
        fig = plots.plot_zeros(target, output, family="colored-jones" if color else "jones", color=color)
    else:
        fr = _framing(framing)
        fig = plots.plot_wilson_level(target, output, group or "SU(2)", rep_or_color(rep, color, group=group or "SU(2)"),
                                      kmax=40 if kmax is None else kmax, framing=0 if fr is None else fr,
                                      normalized=bool(normalized))
        fig.data["inputs"] = {"rep": rep_text(rep, color, group=group or "SU(2)")}
    emit(fig.to_json, lambda: f"wrote {fig.path}", as_json)
