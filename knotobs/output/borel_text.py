"""Text form of the Borel-plane report (:mod:`knotobs.resurgence.analysis`)."""

from __future__ import annotations

import mpmath

__all__ = ["borel_text"]


def borel_text(report) -> str:
    """One block: the series, the singularities (predicted, found, Stokes constants), the resummation."""
    dg = min(report.digits, 15)
    s = mpmath.nstr
    lines = [f"Borel plane of the trivial-connection series of {report.space}",
             "  Phi(h) = sum a_k h^k, h = 2 pi i/K;  B(zeta) = sum a_k zeta^k/(3/2)_k;  zeta = 4 pi^2 cs",
             f"  {report.order + 1} exact coefficients: " + ", ".join(str(a) for a in report.coefficients[:5]) + ", ...",
             f"  ratio test (nearest singularity): {s(report.ratio_estimate.real, dg)}",
             f"{'m':>4} {'cs':>10} {'cs mod 1':>9} {'connection':<10} {'predicted zeta':>22} {'Pade zeta':>22} {'digits':>6}"
             f" {'|Stokes|':>18} {'sqrt(torsion)':>18}"]
    for r in report.rows:
        conn = ",".join(f for f, _ in r.connections) or "-"
        lines.append(f"{r.m:>4} {str(r.cs):>10} {str(r.cs_mod1):>9} {conn:<10} {s(r.predicted.real, dg):>22} "
                     f"{s(r.found.real, dg) if r.found is not None else '-':>22} {r.agreement_digits:>6}"
                     f" {s(abs(r.stokes), dg) if r.stokes is not None else '-':>18}"
                     f" {s(r.sqrt_torsion, dg) if r.sqrt_torsion is not None else '-':>18}")
    res = report.resummation
    if res:
        lines.append(f"resummation at K = {res['K']}:")
        for k, v in res.items():
            if k != "K":
                lines.append(f"  {k:<36} {s(v, report.digits)}")
        if "finite_level_value" in res:
            diff = abs(res["resummed_total"] - res["finite_level_value"])
            lines.append(f"  |resummed total - finite-level value| = {s(diff, 3)}")
    lines.extend(f"note: {n}" for n in report.notes)
    return "\n".join(lines)
