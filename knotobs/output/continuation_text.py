"""Text forms of the continuation side: flat-connection tables, continued values, SL(N,C) values.

Spaces are printed in the normal form that ``knotobs space`` prints
(:meth:`knotobs.fibrations.seifert.SeifertManifold.normal_form`), and numbers that vanish
to the working precision print as ``0``.

Examples
--------
>>> clean_phase(mpmath.mpf("4.94048e-31")), clean_phase(mpmath.mpf("0.125"))
('0', '0.125')
"""

from __future__ import annotations

import mpmath

from knotobs.precision import certified_str

__all__ = ["normal_form_name", "clean_phase", "flat_text", "flat_sun_text", "flat_sun_json", "continued_text",
           "sl_text", "sector_text"]


def normal_form_name(space) -> str:
    """``M(0; b; ...)`` in normal form for a space given by name (unchanged when it cannot be read).

    >>> normal_form_name("L(7,2)")
    'M(0; 3; (2,1))'
    """
    try:
        from knotobs.fibrations.seifert import parse_space

        return str(parse_space(space).normal_form())
    except Exception:   # a name the parser does not know: print it as given
        return str(space)


def clean_phase(x, digits: int = 6, zero_below: float = 1e-20) -> str:
    """A real number for a table: ``0`` when below ``zero_below`` in absolute value."""
    if abs(x) < zero_below:
        return "0"
    return mpmath.nstr(x, digits)


def flat_text(t) -> str:
    """Readable table of a :class:`~knotobs.continuation.flat.FlatTable`."""
    lines = [f"flat SU(2) connections on {normal_form_name(t.space)}   (|H_1| = {abs(t.H)})",
             f"{'kind':<12} {'cs mod 1':>10} {'mult':>4}  {'K^p':>5}  {'|A|':>18}  {'phase/2pi':>10}  rotation numbers"]
    for c in t.connections:
        rot = "; ".join(str(r[1]) for r in c.rotation) if c.rotation else ""
        lines.append(f"{c.kind:<12} {str(c.cs):>10} {c.multiplicity:>4}  {str(c.K_power):>5}  "
                     f"{mpmath.nstr(abs(c.amplitude), 12):>18}  {clean_phase(c.phase):>10}  {rot}")
    if t.casson is not None:
        lines.append(f"Casson invariant: {t.casson}   (normalized so that lambda(Sigma(2,3,5)) = -1)")
    lines.append("Ohtsuki series c_n (tau_0 = |H|^-3/2 sum c_n (q-1)^n): " + ", ".join(str(c) for c in t.ohtsuki))
    lines.extend(f"note: {n}" for n in t.notes)
    return "\n".join(lines)


def flat_sun_json(space, group, conns) -> dict:
    """JSON of the SU(N) flat connections on a lens space."""
    return {"space": space, "normal_form": normal_form_name(space), "group": str(group),
            "connections": [c.to_json() for c in conns], "casson": None, "ohtsuki": [],
            "notes": ["SU(N), N > 2: lens spaces only; cs = (q*/2p) sum x_i^2 mod 1 (module docstring)"]}


def flat_sun_text(space, group, conns) -> str:
    """Readable table of SU(N) flat connections on a lens space."""
    lines = [f"flat {group} connections on {normal_form_name(space)}   ({len(conns)} classes)",
             f"{'kind':10s} {'cs mod 1':>10s} {'K^p':>6s}  holonomy exponents (mod p)"]
    for c in conns:
        lines.append(f"{c.kind:10s} {str(c.cs):>10s} {str(c.K_power):>6s}  {', '.join(map(str, c.holonomy))}")
    return "\n".join(lines)


def continued_text(res, phases: str) -> str:
    """Readable block of a :class:`~knotobs.continuation.level.ContinuedValue` (SU(2)) or a
    :class:`~knotobs.continuation.cartan.CartanContinuedValue` (SU(N), with its sectors)."""
    N = getattr(res, "N", 2)
    how = ("Lawrence-Rozansky integral + residues" if N == 2 and not hasattr(res, "sectors")
           else getattr(res, "how", "Gaussian integrals over the rotated Cartan (one per abelian flat connection)"))
    text = (f"Z({normal_form_name(res.space)}) at K = {mpmath.nstr(res.K, 12)} (level k = K - {N}), SU({N})\n"
            f"  value = {certified_str(res.numeric, res.digits)}\n"
            f"  normalization: Z(S^3) = S_00, canonical 2-framing\n"
            f"  continuation: {how}, phases {phases}")
    for cs, v in sorted(getattr(res, "sectors", {}).items()):
        text += f"\n    cs = {str(cs):>8s}  sector = {certified_str(v, min(res.digits, 12))}"
    polys = getattr(res, "polynomials", {})
    if polys:
        text += "\n  sector polynomials Q_j(K) (sector = exp(-i pi |rho|^2 phi/K) exp(2 pi i K j/L) Q_j(K)):"
        for cs, cf in sorted(polys.items()):
            terms = [f"{certified_str(c, min(d, 12))}" + ("" if i == 0 else " K" if i == 1 else f" K^{i}")
                     for i, (c, d) in enumerate(cf) if d > 0]
            line = terms[0] if terms else "0"
            for t in terms[1:]:
                line += f" - {t[1:]}" if t.startswith("-") else f" + {t}"
            text += f"\n    cs = {str(cs):>8s}  Q = {line}"
    for n in res.notes:
        text += f"\n  note: {n}"
    return text


def sl_text(res, target: str, rep: str, N: int) -> str:
    """Readable block of an SL(N,C) Wilson loop."""
    js = res.to_json()
    text = (f"SL({N},C) Wilson loop of {target}, color {rep}, at (t, tt) = ({mpmath.nstr(res.t, 10)}, "
            f"{mpmath.nstr(res.tt, 10)})\n  value = {certified_str(res.numeric, res.digits)}\n  variables: {js['variables']}")
    for n in res.notes:
        text += f"\n  note: {n}"
    return text


def sector_text(res, target: str) -> str:
    """Readable block of the SL(2,C) sector sum."""
    js = res.to_json()
    text = (f"SL(2,C) partition function of {normal_form_name(target)} at (t, tt) = ({mpmath.nstr(res.t, 10)}, "
            f"{mpmath.nstr(res.tt, 10)})\n  value = {certified_str(res.numeric, res.digits)}\n"
            f"  sum over flat-connection sectors: {js['variables']}\n"
            "  pairing: diagonal, sum over every flat connection of Z_alpha(t/2) conj(Z_alpha(conj(tt)/2))")
    for cs, (h, _a) in sorted(res.sectors.items()):
        text += f"\n    cs = {str(cs):>10s}  holomorphic block = {mpmath.nstr(h, min(res.digits, 12))}"
    for cs, (h, _a) in sorted(getattr(res, "nonunitary", {}).items()):
        text += (f"\n    cs = {str(cs):>10s}  holomorphic block = {mpmath.nstr(h, min(res.digits, 12))}"
                 "  (SL(2,R) connection)")
    for n in res.notes:
        text += f"\n  note: {n}"
    return text
