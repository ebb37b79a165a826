"""Text and JSON forms of finite-level values."""

from __future__ import annotations

from typing import Any

import mpmath

from knotobs.evaluation.finite_value import NUMERIC_ROUTES, FiniteLevelValue

__all__ = ["finite_json", "finite_text"]



def finite_json(value: FiniteLevelValue, inputs: dict[str, Any], quantity: str) -> dict[str, Any]:
    """The JSON object of a finite-level command: the value's fields plus the inputs."""
    out: dict[str, Any] = {"quantity": quantity}
    out.update(value.to_json())
    out["inputs"] = inputs
    checks = {k: v for k, v in value.details.items() if k in ("polynomial_check", "route", "framings", "routes",
                                                                    "agreement", "route_choice")}
    if checks:
        def plain(v):
            if isinstance(v, (int, float, str)):
                return v
            if isinstance(v, (list, tuple)):
                return [plain(x) for x in v]
            return str(v)

        out["details"] = {k: plain(v) for k, v in checks.items()}
    return out


def finite_text(value: FiniteLevelValue, title: str) -> str:
    """Readable block: title, numeric value, exact value, profile."""
    lines = [title, ""]
    how = (f"{value.digits} digit{'s' if value.digits != 1 else ''}" if value.exact is not None else
           f"error below 10^-{value.digits} max(|Z|, 1)")
    lines.append(f"  numeric   {value.numeric_str()}   ({how}, checked at higher precision)")
    if value.exact is not None:
        lines.append(f"  exact     {value.exact}")
        if value.root_of_unity:
            lines.append(f"            with {value.root_of_unity}")
    else:
        routes = value.details.get("routes") or []
        numeric_route = bool(routes) and all(r in NUMERIC_ROUTES for r in routes)
        lines.append(f"  exact     (not computed: the {' and '.join(routes)} route{'s are' if len(routes) > 1 else ' is'}"
                     " numeric)" if numeric_route else "  exact     (not computed at this size; numeric only)")
    lines.append("")
    lines.append(f"framing:       {value.framing}")
    lines.append(f"orientation:   {value.orientation}")
    lines.append(f"normalization: {value.normalisation}")
    if "route" in value.details:
        lines.append(f"route:         {value.details['route']}")
    if "agreement" in value.details:
        lines.append(f"agreement:     {' and '.join(value.details.get('routes', []))} agree {value.details['agreement']}")
    if isinstance(value.details.get("polynomial_check"), str):
        lines.append(f"check:         exact polynomial at q = exp(2 pi i/K) {value.details['polynomial_check']}")
    elif "polynomial_check" in value.details:
        lines.append(f"check:         exact polynomial at q = exp(2 pi i/K) agrees to {value.details['polynomial_check']:.1e}")
    return "\n".join(lines)
