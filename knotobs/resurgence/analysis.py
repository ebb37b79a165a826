r"""The Borel plane of one Seifert manifold: singularities found, predicted, Stokes constants, resummation.

:func:`borel_analysis` ties together :mod:`~knotobs.resurgence.series` (exact coefficients),
:mod:`~knotobs.resurgence.pade` (numerical location from the coefficients alone),
:mod:`~knotobs.resurgence.borel` (prediction from the Chern–Simons values of the flat connections
and the closed form) and :mod:`~knotobs.resurgence.resummation` (Laplace integrals, Stokes
constants).  Every number is computed in private mpmath contexts at two precisions
(``digits + 10`` and ``digits + 25`` guard digits) and must agree to ``digits`` digits
(CONVENTIONS §12, §16).
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

from knotobs.continuation.level import LRData
from knotobs.errors import PrecisionError, SizeLimitError
from knotobs.numerics import local_mp
from knotobs.resurgence.borel import exact_residue, predicted_singularities
from knotobs.resurgence.pade import pade_approximant, pade_pole_near, ratio_test
from knotobs.resurgence.resummation import stokes_constant, trivial_sector
from knotobs.resurgence.series import borel_series

__all__ = ["SingularityRow", "BorelReport", "borel_analysis"]


@dataclass(frozen=True)
class SingularityRow:
    m: int
    cs: Any                  # Fraction, unreduced
    cs_mod1: Any
    connections: tuple
    predicted: Any           # mpc
    found: Any               # mpc or None (Pade)
    agreement_digits: float
    residue: Any             # exact residue of B (closed form) or None
    pade_residue: Any
    stokes: Any              # S_m or None
    sqrt_torsion: Any        # sqrt(tau) of the connection (three fibres) or None


@dataclass(frozen=True)
class BorelReport:
    space: str
    order: int
    digits: int
    coefficients: tuple
    ratio_estimate: Any
    rows: tuple
    resummation: dict = field(default_factory=dict)
    notes: tuple = ()
    ohtsuki: tuple = ()

    def to_json(self) -> dict[str, Any]:
        from mpmath import nstr

        def c(z):
            if z is None:
                return None
            return {"re": nstr(z.real, self.digits), "im": nstr(z.imag, self.digits)}

        return {
            "quantity": "borel-plane",
            "space": self.space,
            "series": "Phi(h) = sum a_k h^k, h = 2 pi i/K; Z_0/Z(S^3) = |H|^(-3/2) exp(-phi h/4) (h/2)/sinh(h/2) Phi(h)",
            "borel_transform": "B(zeta) = sum a_k zeta^k/(3/2)_k; Phi = h^(-3/2)/Gamma(3/2) int_0^inf e^(-zeta/h) zeta^(1/2) B d zeta",
            "order": self.order,
            "coefficients": [str(a) for a in self.coefficients],
            "ohtsuki_series": {"variable": "q - 1", "normalisation": "Z_0/Z(S^3) = |H|^(-3/2) sum_n c_n (q-1)^n",
                               "coefficients": [str(c) for c in self.ohtsuki]},
            "ratio_test_nearest": c(self.ratio_estimate),
            "singularities": [{
                "m": r.m, "cs": str(r.cs), "cs_mod1": str(r.cs_mod1),
                "connections": [{"real_form": f, "rotation_numbers": list(l)} for f, l in r.connections],
                "predicted": c(r.predicted), "pade": c(r.found), "agreement_digits": r.agreement_digits,
                "residue": c(r.residue), "pade_residue": c(r.pade_residue),
                "stokes_constant": c(r.stokes), "sqrt_torsion": None if r.sqrt_torsion is None else nstr(r.sqrt_torsion, self.digits),
            } for r in self.rows],
            "resummation": {k: (str(v) if k == "K" else c(v)) for k, v in self.resummation.items()},
            "digits": self.digits,
            "notes": list(self.notes),
        }


def _guard(order: int, count: int, digits: int) -> None:
    from knotobs.guard import require

    dps = 2 * order + digits + 40
    # Pade: O(order^3) at dps digits; roots O(order^2 * steps); quadrature ~ 3000 evaluations
    cost = (order ** 3 / 8 + 200 * order ** 2 / 4) * (dps / 30) ** 1.6 * 2e-5 + 1.5 * (digits / 30) ** 2
    require(f"Borel plane at order {order} with {digits} digits", seconds=cost, memory_mb=50 + order * 0.5,
            accepted="a smaller --order or --digits")


def borel_analysis(space, order: int = 40, count: int = 4, digits: int = 20, K=None) -> BorelReport:
    """Borel plane of the trivial-connection series of a Seifert rational homology sphere.

    Parameters
    ----------
    space : str
        E.g. ``"Sigma(2,3,5)"`` (pairwise coprime orders: the Lawrence–Rozansky data).
    order : int
        Number of exact coefficients minus one (``>= 8``).
    count : int
        Number of predicted singularities (nearest first) to locate.
    digits : int
        Checked digits of the reported numbers.
    K : int, optional
        Also resum at this shifted level: the trivial sector from the closed form and from the Padé
        approximant, plus (integer ``K``) the other sectors, against the finite-level value.

    Examples
    --------
    >>> r = borel_analysis("Sigma(2,3,5)", order=16, count=2, digits=10)
    >>> [(row.m, str(row.cs), row.agreement_digits >= 10) for row in r.rows]
    [(1, '-1/120', True), (7, '-49/120', True)]

    References
    ----------
    S. Gukov, M. Mariño and P. Putrov, arXiv:1605.07615; J. E. Andersen and W. E. Mistegård,
    arXiv:1811.05376; CONVENTIONS §12.
    """
    if not isinstance(order, int) or isinstance(order, bool) or not 8 <= order <= 200:
        raise SizeLimitError(f"order = {order!r}: give an integer between 8 and 200")
    if not isinstance(digits, int) or isinstance(digits, bool) or not 5 <= digits <= 100:
        raise SizeLimitError(f"digits = {digits!r}: give an integer between 5 and 100")
    if not isinstance(count, int) or not 1 <= count <= 20:
        raise SizeLimitError(f"count = {count!r}: give an integer between 1 and 20")
    d = LRData.from_space(space)
    _guard(order, count, digits)
    ser = borel_series(d, order)
    pred = predicted_singularities(d, count)
    from knotobs.flat.table import flat_sl2c_connections

    tau = {}
    try:
        for r in flat_sl2c_connections(d.space, digits=digits + 25).rows:
            if r.torsion is not None:
                tau.setdefault(r.character.cs, r.torsion)
    except SizeLimitError:  # pragma: no cover - very large tables: no torsions beside the Stokes constants
        pass

    def run(extra):
        ctx = local_mp(digits + extra)
        big = local_mp(2 * order + digits + extra + 20)
        approx = pade_approximant(list(ser.b), big, (order - 1) // 2)
        ratio = ratio_test(list(ser.b), big)
        rows = []
        for s in pred:
            z = s.zeta(big)
            near = pade_pole_near(approx, z, big)
            err = abs(near.zeta - z) / abs(z)
            res = exact_residue(d, s, local_mp(3 * (digits + extra)))
            stokes = stokes_constant(d, z, big.mpc(res), big) if res is not None else None
            t = tau.get(s.cs_mod1)
            rows.append((s, z, near, err, res, stokes, None if t is None else big.sqrt(t)))
        out = {}
        if K is not None:
            p, q, scale = approx
            z0 = trivial_sector(d, K, ctx)
            zp = trivial_sector(d, K, ctx, pade=([ctx.mpf(x) for x in p], [ctx.mpf(x) for x in q], ctx.mpf(scale)))
            out["K"] = K
            out["trivial_sector_borel_laplace"] = z0
            out["trivial_sector_pade_borel_laplace"] = zp
            if isinstance(K, int):
                from knotobs.continuation.level import sector_values
                from knotobs.evaluation.gauss_sum import gauss_sum_partition_function

                sv = sector_values(d.space, K, digits=digits + extra)
                others = sum((ctx.mpc(v) for cs, v in sv.items() if cs != 0), ctx.mpc(0))
                out["other_sectors"] = others
                out["resummed_total"] = z0 + others
                out["finite_level_value"] = ctx.mpc(gauss_sum_partition_function(d.space, K - 2, digits=digits + extra,
                                                                               exact=False).numeric)
        return rows, ratio, out

    lo, ratio_lo, res_lo = run(10)
    hi, ratio_hi, res_hi = run(25)
    ctx = local_mp(digits + 5)
    tol = ctx.mpf(10) ** (-digits)
    for a, b in zip(lo, hi):
        if a[2] is not None and abs(a[2].zeta - b[2].zeta) > tol * abs(b[1]):
            raise PrecisionError(f"Pade pole near m = {a[0].m} not stable to {digits} digits; raise --order")
    for k, v in res_hi.items():
        if k != "K" and abs(res_lo[k] - v) > tol * max(1, abs(v)):
            raise PrecisionError(f"{k} not stable to {digits} digits")
    rows = []
    for s, z, near, err, res, stokes, st in hi:
        ag = float(min(digits, -ctx.log10(err))) if err else float(digits) if near is not None else 0.0
        rows.append(SingularityRow(s.m, s.cs, s.cs_mod1, s.connections, ctx.mpc(z), None if near is None else ctx.mpc(near.zeta),
                                   round(ag, 1), None if res is None else ctx.mpc(res),
                                   None if near is None else ctx.mpc(near.residue),
                                   None if stokes is None else ctx.mpc(stokes), None if st is None else ctx.mpf(st)))
    notes = ["zeta = 4 pi^2 cs (unreduced cs = -H m^2/(4P)); exp(-zeta/h) = exp(2 pi i K cs)",
             "Stokes constant S_m: jump of Z_0(K) across the ray through zeta_m is S_m exp(2 pi i K cs_m)(1 + O(1/K));"
             " |S_m| = sqrt(torsion) of the flat connection with that CS value"]
    res = {k: (v if k == "K" else ctx.mpc(v)) for k, v in res_hi.items()}
    from knotobs.continuation.ohtsuki import MAX_ORDER, ohtsuki_series

    oh = ohtsuki_series(d, min(order, MAX_ORDER)).coefficients
    return BorelReport(str(d.space), order, digits, ser.a, ctx.mpc(ratio_hi), tuple(rows), res, tuple(notes), oh)
