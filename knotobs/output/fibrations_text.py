"""Text tables and JSON payloads for fibrations and Seifert manifolds.

Pure rendering: every number shown is computed in :mod:`knotobs.fibrations`.
"""

from __future__ import annotations

from fractions import Fraction
from typing import Any

from knotobs.fibrations.refibration import FiberedKnot
from knotobs.fibrations.seifert import SeifertManifold
from knotobs.fibrations.surgery import SpaceReport

__all__ = [
    "seifert_json",
    "fibered_knot_json",
    "fibered_knot_text",
    "space_json",
    "space_text",
]


def _fr(x: Fraction | None) -> str | None:
    return None if x is None else str(x)


def seifert_json(M: SeifertManifold) -> dict[str, Any]:
    """``{"b": int, "fibers": [[a, b], ...]}`` of the given invariants.

    >>> seifert_json(SeifertManifold(-1, [(2, 1), (3, 1), (5, 1)]))
    {'b': -1, 'fibers': [[2, 1], [3, 1], [5, 1]]}
    """
    out: dict[str, Any] = {"b": M.b, "fibers": [list(f) for f in M.fibers]}
    if M.genus:
        out["genus"] = M.genus
    return out


def _manifold_fields(M: SeifertManifold) -> dict[str, Any]:
    N = M.normal_form()
    rec = N.classify()
    lf = N.linking_form()
    return {
        "seifert": seifert_json(N),
        "euler": str(N.euler),
        "h1_order": N.h1_order,
        "h1": list(N.homology()),
        "recognised": rec.name,
        "kind": rec.kind,
        "geometry": rec.geometry,
        "orbifold_euler_characteristic": str(N.orbifold_euler_characteristic),
        "surgery_presentation": ([list(x) for x in N.surgery_presentation()] if not N.genus
                                 else None),
        "linking_form": None if lf is None else {
            "orders": list(lf.orders),
            "matrix": [[str(x) for x in row] for row in lf.matrix],
        },
    }


def fibered_knot_json(F: FiberedKnot, inputs: dict[str, Any] | None = None) -> dict[str, Any]:
    """JSON payload of ``knotobs fibers``."""
    out: dict[str, Any] = {"input": inputs or {"knot": F.knot, "space": F.space}}
    out.update(_manifold_fields(F.manifold))
    out.update({
        "knot": F.knot,
        "space": F.space,
        "role": F.role,
        "components": F.components,
        "fiber_framing": _fr(F.fiber_framing),
        "seifert_unnormalised": seifert_json(F.manifold),
        "fiber_numbering": "exceptional fibers are numbered 1..n in the order of seifert_unnormalised (as --fiber)",
        "exceptional_fibers": [
            {"index": c.index + 1, "order": c.order, "invariant": list(c.invariant),
             "knot_type": c.knot_type or None, "homology_class": c.homology_class}
            for c in F.cores
        ],
        "linking": None if F.linking is None else {
            "labels": list(F.linking_labels),
            "matrix": [[str(x) for x in row] for row in F.linking],
        },
        "homology_class": F.homology_class,
        "class_order": F.class_order,
        "self_linking_mod_1": _fr(F.self_linking_mod_one),
    })
    return out


def _table(rows: list[tuple[str, str]]) -> str:
    w = max(len(k) for k, _ in rows)
    return "\n".join(f"{k.ljust(w)}  {v}" for k, v in rows)


def _matrix(labels: tuple[str, ...], M: tuple[tuple[Fraction, ...], ...]) -> str:
    cells = [[str(x) for x in row] for row in M]
    w = max([len(x) for x in labels] + [len(c) for row in cells for c in row])
    head = " " * (w + 2) + "  ".join(x.rjust(w) for x in labels)
    body = [labels[i].ljust(w + 2) + "  ".join(c.rjust(w) for c in cells[i]) for i in range(len(labels))]
    return "\n".join([head] + body)


def fibered_knot_text(F: FiberedKnot) -> str:
    """Readable table for ``knotobs fibers``."""
    N = F.manifold.normal_form()
    rec = N.classify()
    what = {"regular": "regular fiber", "exceptional": "exceptional fiber", "core": "core (order 1)"}
    role = what[F.role] + (f" x {F.components} (parallel)" if F.components > 1 else "")
    rows = [
        ("knot", F.knot),
        ("space", F.space),
        ("role", role),
        ("fibration", str(F.manifold)),
        ("normal form", str(N)),
        ("Euler number e", str(N.euler)),
        ("|H_1|", "infinite" if N.h1_order == 0 else str(N.h1_order)),
        ("recognised", rec.name or f"({rec.kind})"),
    ]
    if F.fiber_framing is not None:
        kind = "fiber framing (nearby fiber)" if F.role == "regular" else "framing of gluing matrix"
        rows.append((kind, str(F.fiber_framing)))
    if F.homology_class is not None:
        rows.append(("class in H_1", f"{F.homology_class} mod {N.h1_order} (order {F.class_order})"))
    if F.self_linking_mod_one is not None:
        rows.append(("self-linking mod 1", str(F.self_linking_mod_one)))
    out = [_table(rows), "", "cores (numbered 1..n as in --fiber; exceptional when order > 1):"]
    for c in F.cores:
        extra = f", class {c.homology_class}" if c.homology_class is not None else ""
        kt = f", {c.knot_type}" if c.knot_type else ""
        out.append(f"  core {c.index + 1}: order {c.order}, invariant {c.invariant}{kt}{extra}")
    if F.linking is not None:
        out += ["", "linking numbers (diagonal: framings):", _matrix(F.linking_labels, F.linking)]
    return "\n".join(out)


def space_json(R: SpaceReport) -> dict[str, Any]:
    """JSON payload of ``knotobs space``."""
    out: dict[str, Any] = {"input": {"space": R.space, "surgery": R.surgery, "slope": R.slope}}
    if R.manifold is not None:
        out.update(_manifold_fields(R.manifold))
    else:
        S = R.surgery_result
        assert S is not None
        out.update({
            "seifert": None,
            "euler": None,
            "h1_order": S.h1_order,
            "recognised": S.recognised,
            "kind": "connected sum (reducible)",
            "summands": [dict(_manifold_fields(X)) for X in S.summands],
        })
    if R.surgery_result is not None:
        S = R.surgery_result
        out["surgery"] = {
            "knot": S.knot,
            "slope": str(S.slope),
            "framing": S.framing,
            "ambient": seifert_json(S.ambient),
            "new_fiber": list(S.new_fiber),
            "reducible": S.is_reducible,
        }
    return out


def space_text(R: SpaceReport) -> str:
    """Readable table for ``knotobs space``."""
    rows: list[tuple[str, str]] = []
    if R.surgery_result is not None:
        S = R.surgery_result
        rows += [("surgery", f"{S.slope} on {S.knot} (Seifert framing)"),
                 ("knot as fiber of", str(S.ambient)),
                 ("new fiber", str(S.new_fiber))]
    else:
        rows.append(("space", str(R.space)))
    if R.manifold is not None:
        N = R.manifold.normal_form()
        rec = N.classify()
        lf = N.linking_form()
        rows += [
            ("normal form", str(N)),
            ("Euler number e", str(N.euler)),
            ("orbifold chi", str(N.orbifold_euler_characteristic)),
            ("H_1", " + ".join(f"Z/{d}" if d else "Z" for d in N.homology()) or "0"),
            ("|H_1|", "infinite" if N.h1_order == 0 else str(N.h1_order)),
            ("recognised", rec.name or "-"),
            ("kind", rec.kind),
            ("geometry", rec.geometry),
            ("surgery X(p/q,...)", (", ".join(f"{p}/{q}" for p, q in N.surgery_presentation()) or "-")
             if not N.genus else "- (base genus >= 1)"),
        ]
        if N.genus:
            rows[1:1] = [("base genus g", str(N.genus)),
                         ("b_1", f"{N.betti_number} (2g{' + 1, since e = 0' if N.euler == 0 else ', e != 0'})")]
        if lf is not None and lf.orders:
            rows.append(("linking form", "; ".join(
                f"lk(g{i+1},g{j+1}) = {lf.matrix[i][j]}" for i in range(len(lf.orders))
                for j in range(i, len(lf.orders)))))
    else:
        S = R.surgery_result
        assert S is not None
        rows += [("result", "reducible: connected sum " + str(S.recognised)),
                 ("|H_1|", str(S.h1_order))]
        for X in S.summands:
            rows.append(("summand", f"{X.normal_form()} = {X.recognise()}"))
    return _table(rows)
