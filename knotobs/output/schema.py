"""Documented JSON schemas of every result knotobs prints, and file exports of stored grids.

Each schema is a JSON Schema (draft 2020-12 vocabulary, the subset ``type``,
``properties``, ``required``, ``items``, ``enum``, ``additionalProperties``) kept in
:data:`SCHEMAS`; :func:`validate` checks a document against it without any extra
dependency.  The documents:

``polynomial-result``
    :meth:`PolynomialResult.to_json` (``knotobs loop/poly --json``): quantity, knot, group,
    colours, exact value (sympy-readable), variables, profile, route, inputs.
``observable``
    one stored grid row: knot, manifold, group, representation, framing, level, q,
    profile, exact value, numeric value with its number of digits and where it was taken.
``convention-map``, ``comparison``, ``identification``
    ``knotobs match --json``: a comparison has ``equal`` (bool) and ``map`` (a
    convention map or null); an identification has ``candidates`` (each with knot,
    representation and map).
``grid-report``
    ``knotobs grid run/resume --json``.
``seifert-space``, ``fibered-knot``
    ``knotobs space --json`` and ``knotobs fibers --json``: the normal form
    ``{"b", "fibers"}``, the Euler number as an exact fraction, ``|H_1|`` (0 when
    infinite), the recognised name (or null) and, for a knot, its fiber framing.
``finite-level``
    ``knotobs loop --level`` and ``knotobs space --level``: the exact cyclotomic value with
    the root of unity it is written in, the numeric value with checked digits, framing,
    orientation and normalisation.
``flat-connections``, ``flat-sl2c-connections``, ``continued-value``
    ``knotobs flat --json`` (connections with exact CS values mod 1, Casson invariant,
    Ohtsuki coefficients as exact strings) and ``knotobs continue --json``.
"""

from __future__ import annotations

import csv
import io
import json
import os
from typing import Any

from knotobs.errors import KnotobsError, ParseError

__all__ = ["SCHEMAS", "validate", "export_grid", "EXPORT_FORMATS"]

_STR = {"type": "string"}
_INT = {"type": "integer"}
_BOOL = {"type": "boolean"}
_PARTITION = {"type": "array", "items": {"type": "integer"}}

_PROFILE = {
    "type": "object",
    "description": "The conventions a value is written in (knotobs.evaluation.profiles.Profile).",
    "properties": {
        "variables": {"type": "array", "items": _STR},
        "variable_map": _STR,
        "framing": {"type": "array", "items": _INT},
        "framing_note": _STR,
        "normalisation": _STR,
        "chirality": _STR,
        "skein": _STR,
        "notes": {"type": "array", "items": _STR},
    },
    "required": ["variables", "variable_map", "framing", "framing_note", "normalisation", "chirality"],
}

_MAP = {
    "type": "object",
    "description": "target = sign * monomial * theta^framing * (standard value, normalised and written as stated).",
    "properties": {
        "variables": {"type": "object", "description": "target variable -> expression in knotobs' variables"},
        "mirror": {"type": ["boolean", "null"], "description": "null: this invariant cannot tell"},
        "normalisation": _STR,
        "framing": {"type": "integer", "description": "total framing change f (factor theta(lam)^f)"},
        "sign": {"type": "integer", "enum": [1, -1]},
        "monomial": {"type": ["string", "null"]},
        "description": _STR,
    },
    "required": ["variables", "mirror", "normalisation", "framing", "sign", "monomial", "description"],
    "additionalProperties": False,
}

_NUMERIC = {
    "type": "object",
    "description": "A complex number as decimal strings, correct to 'digits' digits.",
    "properties": {"re": _STR, "im": _STR, "digits": _INT},
    "required": ["re", "im", "digits"],
}
_SEIFERT = {
    "type": "object",
    "description": "M(0; b; (a_1,b_1), ...) in normal form.",
    "properties": {"b": _INT, "fibers": {"type": "array", "items": {"type": "array", "items": _INT}}},
    "required": ["b", "fibers"],
}
_SPACE_PROPS = {
    "seifert": {"type": ["object", "null"], "description": "normal form; null for a reducible surgery"},
    "euler": {"type": ["string", "null"], "description": "exact fraction e = -(b + sum b_i/a_i)"},
    "h1_order": {"type": "integer", "description": "|H_1|, 0 when infinite"},
    "recognised": {"type": ["string", "null"]},
}

SCHEMAS: dict[str, dict] = {
    "seifert-space": {
        "$id": "knotobs/seifert-space/1",
        "type": "object",
        "description": "A Seifert manifold over S^2 (or the connected sum a surgery produced).",
        "properties": dict(_SPACE_PROPS),
        "required": ["seifert", "euler", "h1_order", "recognised"],
    },
    "fibered-knot": {
        "$id": "knotobs/fibered-knot/1",
        "type": "object",
        "description": "A knot placed as a fiber of a Seifert fibration.",
        "properties": dict(_SPACE_PROPS, seifert=_SEIFERT, knot=_STR, role=_STR,
                           fiber_framing={"type": ["string", "null"], "description": "exact fraction"}),
        "required": ["seifert", "euler", "h1_order", "recognised", "knot", "role", "fiber_framing"],
    },
    "finite-level": {
        "$id": "knotobs/finite-level/1",
        "type": "object",
        "description": "An exact value at level k: cyclotomic number, checked numeric value and profile.",
        "properties": {
            "quantity": _STR,
            "exact": {"type": "string", "description": "element of Q(z_n) (possibly times a square root); '' if not computed"},
            "root_of_unity": _STR,
            "numeric": _NUMERIC,
            "framing": _STR, "orientation": _STR, "normalisation": _STR,
            "inputs": {"type": "object"},
        },
        "required": ["exact", "root_of_unity", "numeric", "framing", "orientation", "normalisation"],
    },
    "flat-connections": {
        "$id": "knotobs/flat-connections/1",
        "type": "object",
        "properties": {
            "space": _STR,
            "connections": {"type": "array", "items": {
                "type": "object",
                "properties": {"kind": _STR, "cs": {"type": "string", "description": "exact fraction mod 1"},
                               "one_loop": {"type": "object"}},
                "required": ["kind", "cs"],
            }},
            "casson": {"type": ["integer", "null"]},
            "ohtsuki": {"type": "array", "items": _STR},
        },
        "required": ["connections", "casson", "ohtsuki"],
    },
    "flat-sl2c-connections": {
        "$id": "knotobs/flat-sl2c-connections/1",
        "type": "object",
        "properties": {
            "space": _STR,
            "group": _STR,
            "counts": {"type": "object"},
            "connections": {"type": "array", "items": {
                "type": "object",
                "properties": {"kind": _STR, "real_form": _STR, "cs": {"type": "string", "description": "exact fraction mod 1"},
                               "rotation_numbers": {"type": "array", "items": _INT}, "dimension": _INT,
                               "angles": {"type": "array", "items": _STR},
                               "torsion": {"type": ["string", "null"]}},
                "required": ["kind", "real_form", "cs", "rotation_numbers", "dimension", "torsion"],
            }},
        },
        "required": ["space", "group", "counts", "connections"],
    },
    "continued-value": {
        "$id": "knotobs/continued-value/1",
        "type": "object",
        "properties": {"quantity": _STR, "numeric": _NUMERIC, "notes": {"type": "array", "items": _STR}},
        "required": ["quantity", "numeric"],
    },
    "polynomial-result": {
        "$id": "knotobs/polynomial-result/1",
        "type": "object",
        "description": "An exact polynomial invariant with its inputs and convention profile.",
        "properties": {
            "quantity": {"type": "string", "enum": ["wilson-loop", "jones", "colored-jones", "homfly", "alexander", "kauffman", "dubrovnik", "superpolynomial"]},
            "knot": _STR, "manifold": _STR, "group": _STR,
            "colours": {"type": "array", "items": _PARTITION},
            "exact": {"type": "string", "description": "sympy-readable exact value (** for powers)"},
            "variables": {"type": "array", "items": _STR},
            "profile": _PROFILE, "route": _STR, "terms": _INT, "inputs": {"type": "object"},
        },
        "required": ["quantity", "knot", "group", "colours", "exact", "variables", "profile", "route"],
    },
    "observable": {
        "$id": "knotobs/observable/1",
        "type": "object",
        "description": "One grid row: an observable of a knot in a 3-manifold, exact and (at a level) numeric.",
        "properties": {
            "schema": {"type": "string", "enum": ["knotobs/observable/1"]},
            "quantity": _STR, "knot": _STR,
            "manifold": {"type": "string", "description": "the ambient 3-manifold, 'S^3' for now"},
            "group": _STR,
            "representation": {"type": "array", "items": _PARTITION, "description": "one partition per component"},
            "framing": {"type": "array", "items": _INT},
            "level": {"type": ["integer", "null"], "description": "null: generic q"},
            "q": {"type": "string", "description": "'generic' or 'exp(2*pi*i/K)'"},
            "profile": _PROFILE,
            "variables": {"type": "array", "items": _STR},
            "exact": {"type": "string", "description": "the exact polynomial in the profile's variables"},
            "numeric": {
                "type": ["object", "null"],
                "properties": {"re": _STR, "im": _STR,
                               "digits": {"type": "integer", "description": "significant decimal digits, checked"},
                               "at": _STR},
                "required": ["re", "im", "digits", "at"],
            },
            "description": {"type": "string", "description": "how the value was obtained"},
            "version": _STR,
        },
        "required": ["schema", "quantity", "knot", "manifold", "group", "representation", "framing", "level",
                     "q", "profile", "exact", "numeric", "description", "version"],
        "additionalProperties": False,
    },
    "convention-map": _MAP,
    "comparison": {
        "$id": "knotobs/comparison/1",
        "type": "object",
        "properties": {
            "kind": {"type": "string", "enum": ["comparison"]},
            "knot": _STR, "invariant": _STR, "group": _STR,
            "representation": {"type": "array", "items": _PARTITION},
            "target": _STR, "computed": _STR, "computed_profile": {"type": "object"},
            "equal": _BOOL,
            "map": {"type": ["object", "null"], **{k: v for k, v in _MAP.items() if k not in ("type",)}},
            "maps": {"type": "array", "items": _MAP},
            "closest": {"type": ["object", "null"]},
            "difference": {"type": ["string", "null"]},
            "differing_terms": _INT, "source": _STR,
        },
        "required": ["kind", "knot", "invariant", "equal", "map", "target", "computed"],
    },
    "identification": {
        "$id": "knotobs/identification/1",
        "type": "object",
        "properties": {
            "kind": {"type": "string", "enum": ["identification"]},
            "target": _STR, "invariant": _STR, "bounds": {"type": "object"}, "tried": _INT, "compared": _INT,
            "candidates": {"type": "array", "items": {
                "type": "object",
                "properties": {"knot": _STR, "representation": {"type": "array", "items": _PARTITION},
                               "invariant": _STR, "group": _STR, "chirality": _STR, "map": _MAP},
                "required": ["knot", "representation", "map"],
            }},
        },
        "required": ["kind", "target", "candidates"],
    },
    "grid-report": {
        "$id": "knotobs/grid-report/1",
        "type": "object",
        "properties": {
            "kind": {"type": "string", "enum": ["grid-report"]},
            "store": _STR, "total": _INT, "already_stored": _INT, "computed": _INT, "inserted": _INT,
            "failed": {"type": "array"}, "skipped_nonintegrable": _INT, "seconds": {"type": "number"},
            "run_id": _STR, "backend": _STR, "complete": _BOOL,
        },
        "required": ["kind", "store", "total", "already_stored", "computed", "inserted", "failed", "complete"],
    },
}

_TYPES = {"object": dict, "array": list, "string": str, "boolean": bool, "null": type(None)}


def _check_type(value: Any, t: str) -> bool:
    if t == "integer":
        return isinstance(value, int) and not isinstance(value, bool)
    if t == "number":
        return isinstance(value, (int, float)) and not isinstance(value, bool)
    return isinstance(value, _TYPES[t])


def _validate(doc: Any, schema: dict, path: str) -> None:
    t = schema.get("type")
    if t is not None:
        ts = t if isinstance(t, list) else [t]
        if not any(_check_type(doc, x) for x in ts):
            raise ParseError(f"{path or 'document'}: expected {' or '.join(ts)}, got {type(doc).__name__} {doc!r:.60}")
    if "enum" in schema and doc not in schema["enum"]:
        raise ParseError(f"{path or 'document'}: {doc!r} is not one of {schema['enum']}")
    if isinstance(doc, dict):
        for k in schema.get("required", []):
            if k not in doc:
                raise ParseError(f"{path or 'document'}: missing required field {k!r}")
        props = schema.get("properties", {})
        for k, v in doc.items():
            if k in props:
                _validate(v, props[k], f"{path}.{k}" if path else k)
            elif schema.get("additionalProperties") is False:
                raise ParseError(f"{path or 'document'}: unexpected field {k!r}")
    if isinstance(doc, list) and "items" in schema:
        for i, v in enumerate(doc):
            _validate(v, schema["items"], f"{path}[{i}]")


def validate(document: Any, name: str) -> None:
    """Check ``document`` against the schema ``name`` (raises :class:`ParseError` naming the field).

    Examples
    --------
    >>> from knotobs import jones
    >>> validate(jones("T(2,3)").to_json(), "polynomial-result")
    >>> validate({"kind": "comparison"}, "comparison")
    Traceback (most recent call last):
    ...
    knotobs.errors.ParseError: document: missing required field 'knot'

    References
    ----------
    JSON Schema: A Media Type for Describing JSON Documents, draft 2020-12 (json-schema.org).
    """
    if name not in SCHEMAS:
        raise KnotobsError(f"unknown schema {name!r}: choose one of {', '.join(SCHEMAS)}")
    _validate(document, SCHEMAS[name], "")


#: File formats of :func:`export_grid`.
EXPORT_FORMATS = ("csv", "json", "latex", "table")


def _sort_key(row: dict):
    import re

    nums = [int(x) for x in re.findall(r"-?\d+", row["knot"])]
    return (nums, row["grp"], row["rep"], -1 if row["level"] is None else row["level"], row["quantity"])


def export_grid(store: str, fmt: str = "csv", out: str | None = None) -> str:
    """Export every row of a results store as CSV, JSON, LaTeX or a terminal table.

    Parameters
    ----------
    store : str
        Path of an existing results store.
    fmt : ``"csv"``, ``"json"``, ``"latex"`` or ``"table"``
    out : str, optional
        File to write (the text is returned either way).

    Examples
    --------
    >>> import tempfile, os
    >>> from knotobs.tables.grid import GridSpec, run_grid
    >>> path = os.path.join(tempfile.mkdtemp(), "g.sqlite")
    >>> _ = run_grid(GridSpec(["T(2,3)"], "SU(2)", [[1]]), path, workers=0, progress=False)
    >>> print(export_grid(path, "csv").splitlines()[1])  # doctest: +ELLIPSIS
    "T(2,3)",S^3,SU(2),[1],[0],,generic,q,-q**-4 + q**-3 + q**-1,,,normalized (unknot = 1),wilson-loop,...

    References
    ----------
    RFC 4180 (CSV); RFC 8259 (JSON).
    """
    from knotobs.output.latex import GRID_HEADERS, grid_table_rows, latex_table, terminal_table
    from knotobs.tables.store import GridStore

    f = str(fmt).lower()
    if f not in EXPORT_FORMATS:
        raise KnotobsError(f"unknown export format {fmt!r}: choose one of {', '.join(EXPORT_FORMATS)}")
    with GridStore(store, readonly=True) as st:
        rows = sorted(st.rows(), key=_sort_key)
    if f == "json":
        text = json.dumps([json.loads(r["document"]) for r in rows], indent=1) + "\n"
    elif f == "csv":
        buf = io.StringIO()
        w = csv.writer(buf, lineterminator="\n")
        w.writerow(["knot", "manifold", "group", "representation", "framing", "level", "q", "variables", "exact",
                    "numeric_re", "numeric_im", "normalisation", "quantity", "version"])
        for r in rows:
            d = json.loads(r["document"])
            num = d["numeric"] or {}
            w.writerow([d["knot"], d["manifold"], d["group"], json.dumps(d["representation"][0]),
                        json.dumps(d["framing"]), "" if d["level"] is None else d["level"], d["q"],
                        " ".join(d["variables"]), d["exact"], num.get("re", ""), num.get("im", ""),
                        d["profile"]["normalisation"], d["quantity"], d["version"]])
        text = buf.getvalue()
    elif f == "latex":
        from knotobs.output.latex import latex_longtable

        text = latex_longtable(GRID_HEADERS, grid_table_rows(rows), caption=f"knotobs results ({len(rows)} rows)",
                               math_columns=[5], wide_column=5) + "\n"
    else:
        text = terminal_table(GRID_HEADERS, grid_table_rows(rows), title=f"{store} ({len(rows)} rows)") + "\n"
    if out:
        _write_whole(out, text)
    return text


def _write_whole(out: str, text: str) -> None:
    """Write ``text`` to ``out`` through a temporary file and a rename: a failure (disk full, no
    permission) leaves no partial or empty file behind, and an existing file untouched."""
    import tempfile

    folder = os.path.dirname(os.path.abspath(out))
    if os.path.isdir(out):
        raise KnotobsError(f"cannot write {out!r}: it is a directory; give a file name")
    tmp = None
    try:
        fd, tmp = tempfile.mkstemp(prefix=".knotobs-export-", dir=folder)
        with os.fdopen(fd, "w", encoding="utf-8") as fh:
            fh.write(text)
            fh.flush()
            os.fsync(fh.fileno())
        os.replace(tmp, out)
        tmp = None
    except OSError as exc:
        raise KnotobsError(f"cannot write {out!r}: {exc.strerror or exc}; nothing was written") from None
    finally:
        if tmp is not None:
            try:
                os.unlink(tmp)
            except OSError:
                pass


def _register_qseries() -> None:
    from knotobs.output.qseries_text import QSERIES_SCHEMA

    SCHEMAS["qseries"] = QSERIES_SCHEMA


_register_qseries()
