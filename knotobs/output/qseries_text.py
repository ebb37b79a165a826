"""Text and JSON forms of the q-series invariants (CONVENTIONS §13)."""

from __future__ import annotations

from fractions import Fraction
from typing import Any

__all__ = ["series_string", "qseries_text", "qseries_json"]


def _mono(c: int, k: int) -> str:
    if k == 0:
        return str(abs(c))
    body = "q" if k == 1 else f"q^{k}"
    return body if abs(c) == 1 else f"{abs(c)}*{body}"


def series_string(z, max_terms: int | None = None) -> str:
    """``q^(D) (c_0 + c_1 q + ...)`` of a :class:`~knotobs.qseries.series.QSeries`.

    >>> from knotobs.qseries.series import zhat
    >>> series_string(zhat("Sigma(2,3,5)", order=8))
    'q^(-3/2) * (1 - q - q^3 - q^7 + q^8 + O(q^9))'
    """
    if not any(z.coefficients):
        if z.details.get("empty"):
            return "0  (identically: no lattice point of this class carries a term)"
        return f"0 + O(q^({Fraction(z.prefactor) + z.order + 1}))"
    parts = []
    for k, c in enumerate(z.coefficients):
        if not c:
            continue
        m = _mono(c, k)
        if not parts:
            parts.append(("-" if c < 0 else "") + m)
        else:
            parts.append(("- " if c < 0 else "+ ") + m)
        if max_terms is not None and len(parts) >= max_terms:
            parts.append("+ ...")
            break
    body = " ".join(parts) if parts else "0"
    body += f" + O(q^{z.order + 1})"
    pre = Fraction(z.prefactor)
    pre_s = "" if pre == 0 else (f"q^({pre}) * " if pre.denominator != 1 or pre < 0 else f"q^{pre} * ")
    den = f"(1/{z.denominator}) * " if z.denominator != 1 else ""
    return f"{pre_s}{den}({body})"


def _short(text: str, limit: int = 160) -> str:
    return text if len(text) <= limit else text[: limit - 40] + f" ... ({len(text)} characters; full in --json)"


def qseries_text(series: list, title: str, report=None) -> str:
    """Readable block: one line per label, then the conventions (and the radial limits, if any)."""
    lines = [title, ""]
    for z in series:
        tag = f"label {z.label.index} = {_short(str(z.label))}"
        lines.append(f"  {tag}")
        lines.append(f"    Zhat = {series_string(z, max_terms=40)}")
    z0 = series[0]
    lines += [
        "",
        f"  plumbing       {_short(z0.plumbing)}  ({z0.label_count} label(s), b ~ -b identified)",
        f"  orientation    {z0.orientation}",
        f"  normalization  {z0.normalization}",
        f"  route          {z0.route}",
    ]
    if report is not None:
        d = report.to_json()
        fmt = lambda v: "diverges (only the combination has a limit)" if v is None else f"{v['re']} + ({v['im']}) i"  # noqa: E731
        lines += ["", f"  radial limits at q -> exp(2 pi i/{report.K}), {report.digits} digits:"]
        for item in d["limits"]:
            lines.append(f"    label {item['label_index']}: {fmt(item['value'])}")
        lines.append(f"  Z_K from all labels      {fmt(d['finite_level_from_qseries'])}")
        if d["finite_level_surgery"] is not None:
            lines.append(f"  Z_K by the surgery route {fmt(d['finite_level_surgery'])}"
                         f"   ({'agree' if d['agree'] else 'DISAGREE'})")
        lines.append(f"  normalization            {report.normalization}")
    return "\n".join(lines)


def qseries_json(series: list, inputs: dict[str, Any], report=None) -> dict[str, Any]:
    """One label: its fields at the top level; several: ``{"labels": [...]}`` plus shared fields.

    With a radial report (``--K``), its fields under ``"radial"``.
    """
    if len(series) == 1:
        out = {"quantity": "qseries"}
        out.update(series[0].to_json())
    else:
        out = {"quantity": "qseries", "space": series[0].space, "plumbing": series[0].plumbing,
               "orientation": series[0].orientation, "labels": [z.to_json() for z in series]}
    if report is not None:
        out["radial"] = report.to_json()
    out["inputs"] = inputs
    return out


_S = {"type": "string"}
_I = {"type": "integer"}
_ONE = {
    "type": "object",
    "properties": {
        "quantity": {"type": "string", "enum": ["qseries"]},
        "space": _S, "plumbing": _S,
        "label": {"type": "string", "description": "canonical vector of the label (b ~ -b)"},
        "label_index": _I, "label_count": _I,
        "prefactor_exponent": {"type": "string", "description": "exact power of q in front, a fraction"},
        "coefficients": {"type": "array", "items": _I,
                         "description": "integers from q^0 after the prefactor, divided by denominator"},
        "denominator": _I, "order": _I, "identically_zero": {"type": "boolean"}, "orientation": _S, "normalization": _S, "route": _S,
        "inputs": {"type": "object"},
        "radial": {"type": "object", "required": ["K", "limits", "finite_level_from_qseries", "agree"]},
    },
    "required": ["space", "label", "prefactor_exponent", "coefficients", "denominator", "orientation"],
}
#: JSON schema of ``knotobs qseries --json`` (one label; ``--label all`` gives ``{"labels": [...]}``).
QSERIES_SCHEMA = {
    "$id": "knotobs/qseries/1",
    "type": "object",
    "properties": dict(_ONE["properties"], labels={"type": "array", "items": _ONE}),
    "required": ["quantity", "space", "orientation"],
}
