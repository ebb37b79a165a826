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
(unnormalised, unknot = ``dim_q``, zero framing unless asked; docs/CONVENTIONS.md §3).  With
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
from knotobs.errors import InvalidRepresentationError, ParseError
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
            "numeric": {**c(self.numeric), "digits": self.digits},
            "holomorphic": c(self.holomorphic),
            "antiholomorphic": c(self.antiholomorphic),
            "unitary": not self.notes,
            "notes": list(self.notes),
        }


def _chiral(knot, N: int, lam, log_q, framing, normalized, digits) -> mpmath.mpc:
    if lam == ():
        return mpmath.mpc(1)
    W = wilson_loop(knot, f"SU({N})", lam, framing, normalized).value
    return mpmath.mpc(W.evaluate(log_x=log_q, dps=digits))


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
    t, tt = parse_couplings(couplings)
    with mpmath.workdps(digits + 15):
        lq = 4j * mpmath.pi / t
        lqt = -4j * mpmath.pi / tt
        vals = []
        for d in (digits + 5, digits + 15):
            h = _chiral(knot, rep.N, rep.lam, lq, framing, normalized, d)
            a = _chiral(knot, rep.N, rep.lamt, lqt, framing, normalized, d)
            vals.append((h, a, h * a))
        if abs(vals[0][2] - vals[1][2]) > mpmath.mpf(10) ** (-digits) * max(abs(vals[1][2]), 1):
            raise ParseError("value not stable at the requested precision; ask for fewer digits")  # pragma: no cover
    h, a, v = vals[1]
    note = unitarity_note(t, tt)
    with mpmath.workdps(digits):
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

    def to_json(self) -> dict[str, Any]:
        def c(z):
            return _complex_json(z, self.digits)

        return {
            "quantity": "sl2c-partition-function",
            "space": self.space,
            "couplings": {"t": c(self.t), "tt": c(self.tt)},
            "variables": "K = t/2 (q = exp(4 pi i/t)); antiholomorphic block conj Z_alpha(conj(tt)/2)",
            "sectors": [{"cs": str(cs), "holomorphic": c(h), "antiholomorphic": c(a)}
                        for cs, (h, a) in sorted(self.sectors.items())],
            "numeric": {**c(self.numeric), "digits": self.digits},
            "unitary": not self.notes,
            "notes": list(self.notes),
        }


def sl2c_partition_function(space, couplings, digits: int = 30) -> SectorSum:
    r"""Perturbative sector sum of SL(2,C) Chern–Simons theory on a Seifert rational homology sphere.

    In complex Chern–Simons theory with couplings ``(t, tt)`` the expansion around a flat
    connection ``alpha`` factorises into a holomorphic and an antiholomorphic block
    (E. Witten, Commun. Math. Phys. 137 (1991) 29–66, §2–3; S. Gukov, Commun. Math. Phys.
    255 (2005) 577–627, §2).  For a Seifert manifold the flat SL(2,C) connections that
    contribute here are the complexified SU(2) ones, and the SU(2) theory already splits
    exactly into one holomorphic function of ``K`` per flat connection
    (:func:`knotobs.continuation.level.sector_values`).  This function returns

    .. math::  Z(t, \tilde t) = \sum_\alpha Z_\alpha(t/2)\, \overline{Z_\alpha(\overline{\tilde t}/2)}

    (diagonal pairing of sectors), with ``K = t/2`` so that ``q = exp(2 pi i/K) = exp(4 pi i/t)``
    as in :func:`sl_wilson_loop`.  At ``tt = conj(t)`` it is ``sum_alpha |Z_alpha(t/2)|^2``.
    The pairing of sectors and the omission of flat connections without an SU(2) real form
    are the assumptions of this perturbative picture; it is not a non-perturbative
    definition of the theory.

    Examples
    --------
    >>> z = sl2c_partition_function("Sigma(2,3,5)", "10+2i,10-2i", digits=15)
    >>> abs(z.numeric.imag) < 1e-14 and z.numeric.real > 0
    True
    >>> sorted(str(cs) for cs in z.sectors)
    ['0', '119/120', '71/120']

    References
    ----------
    Witten (1991); Gukov (2005); R. Lawrence, L. Rozansky, Commun. Math. Phys. 205 (1999).
    """
    from knotobs.continuation.level import sector_values

    t, tt = parse_couplings(couplings)
    with mpmath.workdps(digits + 10):
        hol = sector_values(space, t / 2, digits + 5)
        anti_raw = sector_values(space, mpmath.conj(tt) / 2, digits + 5)
        sectors = {}
        total = mpmath.mpc(0)
        for cs in sorted(set(hol) | set(anti_raw)):
            h = hol.get(cs, mpmath.mpc(0))
            a = mpmath.conj(anti_raw.get(cs, mpmath.mpc(0)))
            sectors[cs] = (h, a)
            total += h * a
    note = unitarity_note(t, tt)
    name = str(getattr(space, "normal_form", lambda: space)()) if not isinstance(space, str) else space
    with mpmath.workdps(digits):
        return SectorSum(name, t, tt, sectors, +total, digits, (note,) if note else ())
