"""Human-readable text for results (the JSON form is each result's ``to_json``)."""

from __future__ import annotations

from knotobs.evaluation.result import PolynomialResult

__all__ = ["render_polynomial"]

_TITLES = {
    "wilson-loop": "Wilson loop",
    "jones": "Jones polynomial V(t)",
    "colored-jones": "colored Jones polynomial J_n(t)",
    "homfly": "HOMFLY-PT polynomial P(a, z)",
    "alexander": "Alexander polynomial Delta(t)",
    "superpolynomial": "reduced superpolynomial P(a, q, t)",
    "kauffman": "Kauffman polynomial F(a, z)",
    "dubrovnik": "Dubrovnik polynomial D(a, z)",
}


def render_polynomial(result: PolynomialResult) -> str:
    """Title line, the exact polynomial, then the convention profile."""
    cols = ", ".join(str(list(c)) for c in result.colours)
    if result.inputs.get("rep") and isinstance(result.inputs["rep"][0], str):   # Dynkin labels, e.g. (1,0)
        cols = ", ".join(result.inputs["rep"])
    title = _TITLES.get(result.quantity, result.quantity)
    if result.quantity == "homfly":
        title = "HOMFLY-PT polynomial P(" + ", ".join(result.profile.variables) + ")"
    head = f"{title} of {result.knot}, {result.group}, color {cols}"
    body = result.exact_string()
    lines = [head, "", "  " + body, "", result.profile.describe(),
             f"route:         {result.route}   ({result.num_terms()} terms)"]
    if result.route == "both":
        lines.append("check:         Rosso-Jones sum and Seifert weight sum agree exactly")
    return "\n".join(lines)
