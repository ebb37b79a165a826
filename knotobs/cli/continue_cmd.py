"""``knotobs flat``, ``knotobs continue`` and ``knotobs plot``: the continuation side (parsing only)."""

from __future__ import annotations

from typing import Optional

import mpmath
import typer

from knotobs.cli import _inputs
from knotobs.cli._app import app, emit, handle_errors
from knotobs.errors import ParseError


@app.command()
@handle_errors
def flat(
    space: str = typer.Argument(..., help="Seifert rational homology sphere, e.g. Sigma(2,3,7), L(5,1), M(0; -1; (2,1), (3,1), (5,1))."),
    order: Optional[int] = typer.Option(None, "--order", help="Highest power of (q - 1) in the Ohtsuki series (SU(2); default 6)."),
    group: str = typer.Option("SU(2)", "--group", "-g", help="SU(2); SL(2,C) (every flat SL(2,C) connection); or SU(N) on lens spaces."),
    digits: Optional[int] = typer.Option(None, "--digits", "-d", help="SL(2,C): digits of the torsions (default 15)."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Flat connections: CS invariants mod 1, one-loop data, Casson invariant, Ohtsuki series."""
    if group.replace(" ", "").upper() == "SL(2,C)":
        if order is not None:
            raise ParseError("--order: the Ohtsuki series belongs to the SU(2) table; drop --order with --group 'SL(2,C)'")
        from knotobs.flat.table import flat_sl2c_connections
        from knotobs.output.flat_text import flat_sl2c_text

        t = flat_sl2c_connections(space, digits=15 if digits is None else digits)
        emit(t.to_json(), "" if as_json else flat_sl2c_text(t), as_json)
        return
    if digits is not None:
        raise ParseError("--digits applies to --group 'SL(2,C)' (torsions); the SU(2) table prints fixed digits")
    order = 6 if order is None else order
    from knotobs.representations.groups import parse_group

    g = parse_group(group)
    if g.kind != "SU":
        raise ParseError(f"flat connections are computed for SU(N); got {g}")
    if g.N == 2:
        from knotobs.continuation.flat import flat_connections

        t = flat_connections(space, ohtsuki_order=order)
        emit(t.to_json(), t.text(), as_json)
        return
    from knotobs.continuation.flat_sun import lens_flat_connections

    conns = lens_flat_connections(space, g.N)
    payload = {"space": space, "group": str(g), "connections": [c.to_json() for c in conns],
               "casson": None, "ohtsuki": [],
               "notes": ["SU(N), N > 2: lens spaces only; cs = (q*/2p) sum x_i^2 mod 1 (module docstring)"]}
    lines = [f"flat {g} connections on {space}   ({len(conns)} classes)",
             f"{'kind':10s} {'cs mod 1':>10s} {'K^p':>6s}  holonomy exponents (mod p)"]
    for c in conns:
        lines.append(f"{c.kind:10s} {str(c.cs):>10s} {str(c.K_power):>6s}  {list(c.holonomy)}")
    emit(payload, "\n".join(lines), as_json)


@app.command("continue")
@handle_errors
def continue_(
    target: str = typer.Argument(..., help="A Seifert space (Sigma(2,3,5), L(7,2), ...) or, with --couplings, a torus knot T(p,q)."),
    level: Optional[str] = typer.Option(None, "--level", help="Complex level k, e.g. 7.5+0.3i (K = k + 2)."),
    K: Optional[str] = typer.Option(None, "--K", help="Complex shifted level K instead of --level."),
    couplings: Optional[str] = typer.Option(None, "--couplings", help="SL(N,C) couplings t,tt, e.g. 10+2i,10-2i (torus knots)."),
    rep: str = typer.Option("[1];[]", "--rep", help="SL(N,C) representation [lam];[lamt] (with --couplings)."),
    N: int = typer.Option(2, "--N", help="Rank N of SL(N,C) (with --couplings)."),
    digits: int = typer.Option(30, "--digits", help="Correct digits."),
    phases: str = typer.Option("reduced", "--phases", help="reduced (CS values mod 1 in (-1/2,1/2]; smallest growth) or lawrence-rozansky."),
    as_json: bool = typer.Option(False, "--json", help="Print one JSON object."),
) -> None:
    """Values at complex level (Seifert partition functions) or at SL(N,C) couplings (torus knots)."""
    from knotobs.precision import certified_str

    digits = _inputs.digits(digits)
    if couplings is not None and not target.strip().upper().startswith("T("):
        from knotobs.continuation.complex import sl2c_partition_function

        res = sl2c_partition_function(target, couplings, digits=digits)
        js = res.to_json()
        text = (f"SL(2,C) partition function of {target} at (t, tt) = ({mpmath.nstr(res.t, 10)}, {mpmath.nstr(res.tt, 10)})\n"
                f"  value = {certified_str(res.numeric, digits)}\n  sum over flat-connection sectors: {js['variables']}")
        text += "\n  pairing: diagonal, sum over every flat connection of Z_alpha(t/2) conj(Z_alpha(conj(tt)/2))"
        for cs, (h, _a) in sorted(res.sectors.items()):
            text += f"\n    cs = {str(cs):>10s}  holomorphic block = {mpmath.nstr(h, min(digits, 12))}"
        for cs, (h, _a) in sorted(res.nonunitary.items()):
            text += f"\n    cs = {str(cs):>10s}  holomorphic block = {mpmath.nstr(h, min(digits, 12))}  (SL(2,R) connection)"
        for n in res.notes:
            text += f"\n  note: {n}"
        emit(js, text, as_json)
        return
    if couplings is not None:
        from knotobs.continuation.complex import sl_wilson_loop

        res = sl_wilson_loop(target, rep, couplings, N=N, digits=digits)
        js = res.to_json()
        text = (f"SL({N},C) Wilson loop of {target} in {rep} at (t, tt) = ({mpmath.nstr(res.t, 10)}, {mpmath.nstr(res.tt, 10)})\n"
                f"  value = {certified_str(res.numeric, digits)}\n  variables: {js['variables']}")
        for n in res.notes:
            text += f"\n  note: {n}"
        emit(js, text, as_json)
        return
    if level is None and K is None:
        raise ParseError("give --level k (complex, e.g. 7.5+0.3i), --K, or --couplings t,tt")
    from knotobs.continuation.level import continued_partition_function

    from knotobs.output.progress import terminal_progress

    bar = terminal_progress(f"continue {target}")
    try:
        res = continued_partition_function(target, level, K=K, digits=digits, phases=phases, progress=bar)
    finally:
        if bar is not None:
            bar.close()
    text = (f"Z({res.space}) at K = {mpmath.nstr(res.K, 12)} (level k = K - 2)\n"
            f"  value = {certified_str(res.numeric, digits)}\n  normalisation: Z(S^3) = S_11, canonical 2-framing\n"
            f"  continuation: Lawrence-Rozansky integral + residues, phases {phases}")
    for n in res.notes:
        text += f"\n  note: {n}"
    emit(res.to_json(), text, as_json)


@app.command()
@handle_errors
def plot(
    kind: str = typer.Argument(..., help="level-plane, asymptotics, zeros or borel."),
    target: str = typer.Argument(..., help="Seifert space (level-plane, asymptotics) or torus knot (zeros)."),
    out: str = typer.Option(..., "--out", "-o", help="Output file (.png, .svg or .pdf)."),
    re_range: str = typer.Option("3,12", "--re", help="level-plane: range of Re K, e.g. 3,12."),
    im_range: str = typer.Option("-1,1", "--im", help="level-plane: range of Im K."),
    n: int = typer.Option(30, "--n", help="level-plane: grid points per axis."),
    kmax: int = typer.Option(500, "--kmax", help="asymptotics: largest K."),
    color: Optional[int] = typer.Option(None, "--color", help="zeros: colour of the coloured Jones polynomial."),
) -> None:
    """Figures: |Z| and arg Z over the complex K plane, exact vs asymptotic, zeros of a polynomial."""
    from knotobs.continuation import plots

    k = kind.lower()
    if k not in ("level-plane", "asymptotics", "zeros", "borel"):
        raise ParseError(f"unknown plot {kind!r}: use level-plane, asymptotics, zeros or borel")
    _inputs.output_path(out, "--out")
    if k == "level-plane":
        p = plots.plot_level_plane(target, out, _inputs.float_range(re_range, "--re"),
                                   _inputs.float_range(im_range, "--im"), n=n)
    elif k == "asymptotics":
        _inputs.int_at_least(kmax, 15, "--kmax", "the plot starts at K = 10 and needs two levels")
        p = plots.plot_asymptotics(target, out, Ks=plots.asymptotic_levels(kmax))
    elif k == "borel":
        from knotobs.output.borel_plot import plot_borel

        p = plot_borel(target, out)
    else:
        if color is not None:
            _inputs.int_at_least(color, 1, "--color", "the colour is the dimension n >= 1 of the SU(2) irrep")
        p = plots.plot_zeros(target, out, family="colored-jones" if color is not None else "jones", color=color)
    emit({"file": str(p), "kind": k}, f"wrote {p}", False)
