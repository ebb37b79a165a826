"""``knotobs qseries``: JSON fields, text, refusals (CONVENTIONS §13).

Series values are checked against GPPV (S. Gukov, D. Pei, P. Putrov, C. Vafa, J. Knot Theory
Ramifications 29 (2020), the Sigma(2,3,7) example) through the command line.
"""

from __future__ import annotations

import json

from typer.testing import CliRunner

from knotobs.cli import app
from knotobs.output.schema import validate

runner = CliRunner()


def test_json_fields_for_sigma_237():
    r = runner.invoke(app, ["qseries", "Sigma(2,3,7)", "--order", "11", "--json"])
    assert r.exit_code == 0, r.output
    d = json.loads(r.output)
    validate(d, "qseries")
    assert d["prefactor_exponent"] == "1/2"
    assert d["coefficients"] == [1, -1, 0, 0, 0, -1, 0, 0, 0, 0, 1, -1]       # GPPV
    assert d["label_index"] == 0 and d["label_count"] == 1
    # the star plumbing of Sigma(2,3,7) = M(0; 1; (2,-1), (3,-1), (7,-1)): centre -1, legs -2, -3, -7;
    # delta = degrees mod 2 = (1,1,1,1) is the only label of a homology sphere
    assert d["plumbing"] == "Plumb(-1,-2,-3,-7 : 1-2, 1-3, 1-4)"
    assert (d["label"], d["label_index"], d["label_count"]) == ("(1,1,1,1)", 0, 1)
    assert "negative definite" in d["orientation"]


def test_plumbing_text_form_on_the_command_line():
    e8 = "Plumb(-2,-2,-2,-2,-2,-2,-2,-2 : 1-2, 2-3, 3-4, 4-5, 5-6, 6-7, 3-8)"
    r = runner.invoke(app, ["qseries", e8, "--order", "8", "--json"])
    assert r.exit_code == 0, r.output
    d = json.loads(r.output)
    assert (d["prefactor_exponent"], d["coefficients"]) == ("-3/2", [1, -1, 0, -1, 0, 0, 0, -1, 1])


def test_all_labels_and_one_label_by_vector():
    r = runner.invoke(app, ["qseries", "L(5,2)", "--order", "3", "--label", "all", "--json"])
    assert r.exit_code == 0, r.output
    d = json.loads(r.output)
    validate(d, "qseries")
    assert len(d["labels"]) == 3                  # (|H_1| + |H_1/2H_1|)/2 = (5 + 1)/2
    vec = d["labels"][1]["label"]
    r2 = runner.invoke(app, ["qseries", "L(5,2)", "--order", "3", "--label", vec, "--json"])
    assert json.loads(r2.output)["label_index"] == 1


def test_text_output_shows_prefactor_and_series():
    r = runner.invoke(app, ["qseries", "Sigma(2,3,5)", "--order", "8"])
    assert r.exit_code == 0
    assert "q^(-3/2) * (1 - q - q^3 - q^7 + q^8 + O(q^9))" in r.output


def test_refusals_are_one_line_errors():
    for args in (["qseries", "--order", "5", "--", "-Sigma(2,3,5)"],
                 ["qseries", "Plumb(-1,-1 : 1-2)", "--order", "5"],
                 ["qseries", "Plumb(-2,x)", "--order", "5"],
                 ["qseries", "Sigma(2,3,5)", "--order", "5", "--label", "3"],
                 ["qseries", "Sigma(2,3,5)", "--order", "99999999"]):
        r = runner.invoke(app, args)
        assert r.exit_code == 2, (args, r.output)
        assert "error:" in r.output and "Traceback" not in r.output


def test_radial_limits_on_the_command_line():
    # --K: radial limits and Z_K from the q-series beside the independent surgery route
    # (Reshetikhin-Turaev; CONVENTIONS §9); L(5,2) at K = 5 has Z = 0 exactly (CONVENTIONS §9).
    r = runner.invoke(app, ["qseries", "Sigma(2,3,7)", "--order", "5", "--K", "9", "--digits", "25", "--json"])
    assert r.exit_code == 0, r.output
    d = json.loads(r.output)
    validate(d, "qseries")
    assert d["radial"]["agree"] is True and d["radial"]["digits"] == 25
    a, b = d["radial"]["finite_level_from_qseries"], d["radial"]["finite_level_surgery"]
    assert all(abs(float(a[k]) - float(b[k])) < 1e-14 for k in ("re", "im"))
    r = runner.invoke(app, ["qseries", "L(5,2)", "--order", "3", "--K", "5", "--json"])
    d = json.loads(r.output)["radial"]
    assert d["finite_level_from_qseries"] == {"re": "0.0", "im": "0.0"} and d["agree"] is True
    r = runner.invoke(app, ["qseries", "L(5,2)", "--order", "3", "--digits", "5"])
    assert r.exit_code == 2 and "--K" in r.output
