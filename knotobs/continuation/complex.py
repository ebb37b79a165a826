r"""SL(N,C) Wilson loops of torus knots with the two couplings ``(t, tt)`` of complex Chern–Simons theory.

Convention
----------
Complex Chern–Simons theory has the action
``S = (t/8 pi) int Tr(A dA + 2/3 A^3) + (tt/8 pi) int Tr(Abar dAbar + 2/3 Abar^3)``
(E. Witten, Commun. Math. Phys. 137 (1991) 29–66, eq. (1.2)); it is unitary for
``t = k + i s``, ``tt = k - i s`` with ``k`` an integer and ``s`` real or purely imaginary.
Restricted to an SU(N) connection (``A = Abar``) the two terms add up to the compact
coupling ``k/4 pi``, so each chiral half behaves as compact Chern–Simons theory at
"level" ``t/2``: its variable is

    ``q = exp(4 pi i/t)``,  and for the antiholomorphic half  ``qt = exp(-4 pi i/tt)``

(the sign: complex conjugation maps the holomorphic half at ``t`` to the antiholomorphic
half at ``tt = conj(t)``; the form ``q = exp(4 pi i/t)`` is that of T. Dimofte, S. Gukov,
J. Lenells and D. Zagier, Commun. Number Theory Phys. 3 (2009) 363–443, quoted from
memory; S. Gukov, Commun. Math. Phys. 255 (2005) 577–627 for the holomorphic blocks).
The finite-dimensional representation ``V_lam (x) conj(V_lamt)`` of SL(N,C)
(:class:`~knotobs.representations.complexified.ComplexRep`) gives, for a torus knot
in ``S^3`` (where the only flat connection near the unknot sector is the trivial one and
the observable factorises),

    ``W_(lam, lamt)(t, tt) = W_lam(q) * W_lamt(qt)``

with ``W_lam`` the compact polynomial of :func:`knotobs.evaluation.families.wilson_loop`
(unnormalised, unknot = ``dim_q``, zero framing unless asked; docs/conventions.md §3).  With
``lamt`` trivial this is the compact polynomial at ``q = exp(4 pi i/t)``; at ``t = 2K``
(``K = k + N``) it is the SU(N) level-``k`` value.  Exchanging the labels and the
couplings and conjugating them is complex conjugation,
``conj W_(lam, lamt)(t, tt) = W_(lamt, lam)(conj tt, conj t)`` (for real-coefficient
polynomials); on the unitary slice with real ``t, tt`` this is ``(lam, lamt, t, tt) ->
(lamt, lam, tt, t)``, and with ``tt = conj t`` the labels alone are exchanged.

Factorisation into sectors for Seifert manifolds is not set up here.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

import mpmath

from knotobs.continuation._num import parse_complex
from knotobs.errors import InvalidRepresentationError, ParseError, PrecisionError
from knotobs.guard import require, seconds_for
from knotobs.numerics import working_precision
from knotobs.precision import certified_parts, check_digits
from knotobs.evaluation.families import wilson_loop
from knotobs.representations.complexified import ComplexRep
from knotobs._notebook import NotebookMixin

__all__ = ["ComplexObservable", "parse_couplings", "unitarity_note", "sl_wilson_loop",
           "SectorSum", "sl2c_partition_function"]


def parse_couplings(text) -> tuple[mpmath.mpc, mpmath.mpc]:
    """``"t,tt"`` -> ``(t, tt)``; each a complex number such as ``10+2i``.

    >>> parse_couplings("10+2i,10-2i")
    (mpc(real='10.0', imag='2.0'), mpc(real='10.0', imag='-2.0'))
    """
    if isinstance(text, (tuple, list)) and len(text) == 2:
        t, tt = text
    else:
        parts = str(text).split(",")
        if len(parts) != 2:
            raise ParseError(f"cannot read couplings {text!r}: write t,tt, e.g. 10+2i,10-2i")
        t, tt = parts
    t = parse_complex(t, "t")
    tt = parse_complex(tt, "tt")
    for name, v in (("t", t), ("tt", tt)):
        if v == 0:
            raise ParseError(f"coupling {name} = 0 is not allowed (q = exp(4 pi i/{name}))")
    return t, tt


def unitarity_note(t, tt, tol=1e-20) -> str | None:
    """``None`` inside the unitary range of Witten (1991), else a sentence saying why not.

    >>> unitarity_note(10 + 2j, 10 - 2j) is None
    True
    >>> unitarity_note(10.5 + 2j, 10.5 - 2j)
    'k = (t + tt)/2 = 10.5 is not an integer: outside the unitary range (Witten 1991)'
    """
    t = mpmath.mpc(t)
    tt = mpmath.mpc(tt)
    k = (t + tt) / 2
    s = (t - tt) / 2j
    msgs = []
    if abs(k.imag) > tol or abs(k.real - mpmath.nint(k.real)) > tol:
        msgs.append(f"k = (t + tt)/2 = {mpmath.nstr(k.real if abs(k.imag) <= tol else k, 8)} is not an integer")
    if abs(s.imag) > tol and abs(s.real) > tol:
        msgs.append(f"s = (t - tt)/(2i) = {mpmath.nstr(s, 8)} is neither real nor imaginary")
    if not msgs:
        return None
    return "; ".join(msgs) + ": outside the unitary range (Witten 1991)"


def _complex_json(z, digits: int) -> dict[str, str]:
    """``{"re": ..., "im": ...}`` as decimal strings with ``digits`` digits."""
    return {"re": mpmath.nstr(z.real, digits), "im": mpmath.nstr(z.imag, digits)}


@dataclass(frozen=True, repr=False)
class ComplexObservable(NotebookMixin):
    """Value of an SL(N,C) Wilson loop at couplings ``(t, tt)``."""

    knot: str
    rep: ComplexRep
    t: mpmath.mpc
    tt: mpmath.mpc
    holomorphic: mpmath.mpc
    antiholomorphic: mpmath.mpc
    numeric: mpmath.mpc
    digits: int
    notes: tuple[str, ...] = field(default_factory=tuple)

    def to_json(self) -> dict[str, Any]:
        def c(z):
            return _complex_json(z, self.digits)

        return {
            "quantity": "sl-wilson-loop",
            "knot": self.knot,
            "group": f"SL({self.rep.N},C)",
            "rep": [list(self.rep.lam), list(self.rep.lamt)],
            "couplings": {"t": c(self.t), "tt": c(self.tt)},
            "variables": "q = exp(4 pi i/t), qt = exp(-4 pi i/tt)",
            "numeric": {**_value_json(self.numeric, self.digits), "digits": self.digits},
            "holomorphic": _value_json(self.holomorphic, self.digits),
            "antiholomorphic": _value_json(self.antiholomorphic, self.digits),
            "unitary": not self.notes,
            "notes": list(self.notes),
        }


def _value_json(z, digits: int) -> dict[str, str]:
    """A computed value: only its certified decimal places (CONVENTIONS §16)."""
    re_, im_ = certified_parts(z, digits)
    return {"re": re_, "im": im_}


def _chiral_poly(knot, N: int, lam, framing, normalized):
    if lam == ():
        return None
    return wilson_loop(knot, f"SU({N})", lam, framing, normalized).value


def _chiral(W, log_q, digits) -> mpmath.mpc:
    if W is None:
        return mpmath.mpc(1)
    return mpmath.mpc(W.evaluate(log_x=log_q, dps=digits))


def _extra_digits(t, tt, polys) -> int:
    """Digits lost to the phase ``exp(e * 4 pi i/t)``: log10 of the largest ``|e * 4 pi/t|``."""
    top = 1
    for W in polys:
        if W is not None:
            top = max([top] + [abs(float(e)) + 1 for e in W.terms()])
    big = max(abs(4 * mpmath.pi / t), abs(4 * mpmath.pi / tt), 1) * top
    return int(mpmath.ceil(mpmath.log10(big))) + 5


def sl_wilson_loop(knot, rep, couplings, N: int | None = None, framing=0, normalized: bool = False,
                   digits: int = 30) -> ComplexObservable:
    """SL(N,C) Wilson loop ``W_lam(q) W_lamt(qt)`` of a torus knot in ``S^3``.

    Parameters
    ----------
    knot : str
        ``T(p,q)``.
    rep : ComplexRep or str
        ``ComplexRep(N, lam, lamt)`` or text ``"[1];[2]"`` (needs ``N``).
    couplings : str or pair
        ``"t,tt"`` or ``(t, tt)``.
    N : int
        Rank when ``rep`` is text.
    framing, normalized
        As in :func:`~knotobs.evaluation.families.wilson_loop`.

    Examples
    --------
    >>> from knotobs.evaluation.families import wilson_loop
    >>> w = sl_wilson_loop("T(2,3)", "[1];[]", "10,10", N=2, digits=20)    # lamt trivial, t = 2K
    >>> W = wilson_loop("T(2,3)", "SU(2)", (1,)).value
    >>> abs(w.numeric - W.at_root_of_unity(5, dps=25)) < 1e-15
    True
    >>> w.to_json()["unitary"]
    True

    References
    ----------
    E. Witten, Commun. Math. Phys. 137 (1991) 29–66; S. Gukov, Commun. Math. Phys. 255
    (2005) 577–627; Dimofte, Gukov, Lenells, Zagier, Commun. Number Theory Phys. 3 (2009).
    """
    if isinstance(rep, str):
        if N is None:
            raise InvalidRepresentationError("give N (SL(N,C)) together with a text representation like [1];[2]")
        rep = ComplexRep.parse(N, rep)
    if not isinstance(rep, ComplexRep):
        raise InvalidRepresentationError(f"{rep!r} is not an SL(N,C) representation: use ComplexRep or '[lam];[lamt]'")
    digits = check_digits(digits)
    t, tt = parse_couplings(couplings)
    Wh = _chiral_poly(knot, rep.N, rep.lam, framing, normalized)
    Wa = _chiral_poly(knot, rep.N, rep.lamt, framing, normalized)
    extra = _extra_digits(t, tt, (Wh, Wa))
    terms = sum(len(W.terms()) for W in (Wh, Wa) if W is not None)
    top = digits + 15 + extra
    require(f"SL({rep.N},C) Wilson loop of {knot} at couplings {couplings!r} to {digits} digits"
            f" ({extra} extra digits for the phases, {terms} terms)",
            seconds=seconds_for(2 * terms * 10, "ball") * max(1.0, top / 30) ** 1.6,
            accepted="give couplings of moderate size (|4 pi/t| below about 10^1000) or fewer digits")

    def run(d):
        # everything from the user's text again, at this run's precision: the couplings, the
        # logarithms of q and qt and the phases (a value reused from the other run would carry
        # its error into both, and the comparison could not see it)
        with working_precision(d + extra):
            t_, tt_ = parse_couplings(couplings)
            h = _chiral(Wh, 4j * mpmath.pi / t_, d + extra)
            a = _chiral(Wa, -4j * mpmath.pi / tt_, d + extra)
            return h, a, h * a

    lo = run(digits + 5)
    hi = run(digits + 15)
    with working_precision(top):
        if abs(lo[2] - hi[2]) > mpmath.mpf(10) ** (-digits) * max(abs(hi[2]), 1):
            raise PrecisionError(f"SL({rep.N},C) Wilson loop of {knot}: {digits} digits could not be"
                                 " confirmed by two independent precisions; request fewer digits")
    h, a, v = hi
    note = unitarity_note(t, tt)
    with working_precision(digits):
        return ComplexObservable(str(knot), rep, t, tt, +h, +a, +v, digits, (note,) if note else ())


@dataclass(frozen=True, repr=False)
class SectorSum(NotebookMixin):
    """SL(2,C) partition function of a Seifert manifold as a sum over flat-connection sectors."""

    space: str
    t: mpmath.mpc
    tt: mpmath.mpc
    sectors: dict            # cs (Fraction) -> (holomorphic block, antiholomorphic block)
    numeric: mpmath.mpc
    digits: int
    notes: tuple[str, ...] = field(default_factory=tuple)
    nonunitary: dict = field(default_factory=dict)   # cs -> (hol, antihol) of the SL(2,R) connections
    unitary: bool = True

    def to_json(self) -> dict[str, Any]:
        def c(z):
            return _complex_json(z, self.digits)

        return {
            "quantity": "sl2c-partition-function",
            "space": self.space,
            "couplings": {"t": c(self.t), "tt": c(self.tt)},
            "variables": "K = t/2 (q = exp(4 pi i/t)); antiholomorphic block conj Z_alpha(conj(tt)/2)",
            "pairing": "diagonal: Z = sum_alpha Z_alpha(t/2) conj(Z_alpha(conj(tt)/2)) over every flat connection alpha",
            "sectors": [{"cs": str(cs), "real_form": "SU(2)", "holomorphic": _value_json(h, self.digits),
                         "antiholomorphic": _value_json(a, self.digits)}
                        for cs, (h, a) in sorted(self.sectors.items())]
                       + [{"cs": str(cs), "real_form": "SL(2,R)", "holomorphic": _value_json(h, self.digits),
                           "antiholomorphic": _value_json(a, self.digits)}
                          for cs, (h, a) in sorted(self.nonunitary.items())],
            "numeric": {**_value_json(self.numeric, self.digits), "digits": self.digits},
            "unitary": self.unitary,
            "notes": list(self.notes),
        }


def sl2c_partition_function(space, couplings, digits: int = 30) -> SectorSum:
    r"""Perturbative sector sum of SL(2,C) Chern–Simons theory on a Seifert rational homology sphere.

    In complex Chern–Simons theory with couplings ``(t, tt)`` the expansion around a flat
    connection ``alpha`` factorises into a holomorphic and an antiholomorphic block
    (E. Witten, Commun. Math. Phys. 137 (1991) 29–66, §2–3; S. Gukov, Commun. Math. Phys.
    255 (2005) 577–627, §2).  This function returns

    .. math::  Z(t, \tilde t) = \sum_\alpha Z_\alpha(t/2)\, \overline{Z_\alpha(\overline{\tilde t}/2)}

    with ``K = t/2`` (``q = exp(2 pi i/K) = exp(4 pi i/t)``, as in :func:`sl_wilson_loop`), summed over
    **every** flat SL(2,C) connection ``alpha``: the trivial and abelian ones, the SU(2) ones and the
    non-unitary (SL(2,R)) ones.

    *Blocks.*  For the SU(2) connections ``Z_alpha`` is the exact sector of the Lawrence–Rozansky
    decomposition (:func:`knotobs.continuation.level.sector_values`).  For a non-unitary ``alpha``
    (isolated, on a three-fibre integral homology sphere) it is the one-loop-exact block
    ``-S_m e^{2 pi i K cs_alpha} q^{-phi/4}`` built from the Stokes constant of the Borel pole at
    ``4 pi^2 cs_alpha`` (:mod:`knotobs.resurgence.blocks`); the same formula reproduces the SU(2)
    sectors exactly, which is how it is checked.

    *Pairing: diagonal, and why.*  On the real integration cycle of the complexified theory
    (``Abar`` the complex conjugate of ``A``) the holomorphic and antiholomorphic actions are
    complex conjugates, so each critical point ``alpha`` contributes its holomorphic block times
    the conjugate block of the *same* ``alpha``; cross terms ``Z_alpha conj(Z_beta)``, ``alpha != beta``,
    would come from a cycle that pairs the thimble of ``alpha`` with the antithimble of ``beta``,
    which the real cycle does not contain (E. Witten, Analytic continuation of Chern–Simons theory,
    AMS/IP Stud. Adv. Math. 50 (2011), §2–5, quoted from memory).  Every critical point enters
    with weight one: unlike the SU(2) contour, whose Stokes multipliers at integer level exclude
    the SL(2,R) points, the SL(2,C) cycle contains all of them.  The resulting sum is a
    perturbative (saddle-point) definition; it is not claimed to be the non-perturbative
    SL(2,C) partition function.  At ``tt = conj(t)`` it is ``sum_alpha |Z_alpha(t/2)|^2``.
    Non-unitary components of positive dimension (four or more fibres) and non-unitary blocks of
    manifolds with ``|H_1| > 1`` are not set up; a note says when they are left out.

    Examples
    --------
    >>> z = sl2c_partition_function("Sigma(2,3,5)", "10+2i,10-2i", digits=15)
    >>> abs(z.numeric.imag) < 1e-14 and z.numeric.real > 0
    True
    >>> sorted(str(cs) for cs in z.sectors)
    ['0', '119/120', '71/120']
    >>> w = sl2c_partition_function("Sigma(2,3,7)", "10+2i,10-2i", digits=15)
    >>> [str(cs) for cs in w.nonunitary]                 # the SL(2,R) connection at -1/168
    ['167/168']

    References
    ----------
    Witten (1991); Gukov (2005); R. Lawrence, L. Rozansky, Commun. Math. Phys. 205 (1999).
    """
    from knotobs.continuation.level import sector_values

    from knotobs.continuation.level import LRData
    from knotobs.flat.table import flat_sl2c_connections
    from knotobs.resurgence.blocks import isolated_block

    digits = check_digits(digits)
    t, tt = parse_couplings(couplings)
    d = LRData.from_space(space)
    table = flat_sl2c_connections(d.space)
    notes = []
    with working_precision(digits + 10):
        hol = sector_values(space, t / 2, digits + 5)
        anti_raw = sector_values(space, mpmath.conj(tt) / 2, digits + 5)
        sectors = {}
        total = mpmath.mpc(0)
        for cs in sorted(set(hol) | set(anti_raw)):
            h = hol.get(cs, mpmath.mpc(0))
            a = mpmath.conj(anti_raw.get(cs, mpmath.mpc(0)))
            sectors[cs] = (h, a)
            total += h * a
        nonunitary = {}
        others = [r.character for r in table.rows if r.character.kind == "irreducible" and "SU(2)" not in r.character.real_form]
        if others and (abs(d.H) != 1 or len(d.space.exceptional_orders) != 3):
            notes.append(f"{len(others)} non-unitary flat connection(s) left out: their blocks are set up for"
                         " three-fibre integral homology spheres only")
        elif others:
            for ch in others:
                h = isolated_block(d, ch.cs, t / 2, digits + 5)
                a = mpmath.conj(isolated_block(d, ch.cs, mpmath.conj(tt) / 2, digits + 5))
                h, a = mpmath.mpc(h), mpmath.mpc(a)
                nonunitary[ch.cs] = (h, a)
                total += h * a
    note = unitarity_note(t, tt)
    if note:
        notes.insert(0, note)
    name = str(getattr(space, "normal_form", lambda: space)()) if not isinstance(space, str) else space
    with working_precision(digits):
        return SectorSum(name, t, tt, sectors, +total, digits, tuple(notes), nonunitary, note is None)
