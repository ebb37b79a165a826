"""JSON schemas of every result, exports, and the match/grid commands (exit codes, --json)."""

import csv
import io
import json

import pytest
from typer.testing import CliRunner

from knotobs import colored_jones, homfly, jones, wilson_loop
from knotobs.cli import app
from knotobs.errors import ParseError
from knotobs.output.latex import latex_table
from knotobs.output.schema import export_grid, validate
from knotobs.tables.compare import compare
from knotobs.tables.grid import GridSpec, run_grid
from knotobs.tables.identify import identify

runner = CliRunner()


def test_schemas_accept_real_documents(tmp_path):
    for r in (jones("T(2,3)"), colored_jones("T(2,5)", 3), homfly("T(3,4)", (2,)), wilson_loop("T(2,4)", "SU(3)", (1,))):
        validate(r.to_json(), "polynomial-result")
    validate(compare("T(2,3)", "t + t^3 - t^4").to_json(), "comparison")
    validate(compare("T(2,3)", "t + t^3 - 3*t^4").to_json(), "comparison")
    validate(identify("t + t^3 - t^4", max_p=3, max_q=4, max_colour=1).to_json(), "identification")
    db = str(tmp_path / "g.sqlite")
    rep = run_grid(GridSpec(["T(2,3)", "T(2,4)"], "SU(2)", [[1]], [None, 2]), db, workers=0, progress=False)
    validate(rep.to_json(), "grid-report")
    docs = json.loads(export_grid(db, "json"))
    assert len(docs) == 4
    for d in docs:
        validate(d, "observable")
    with pytest.raises(ParseError, match="numeric"):
        bad = dict(docs[0])
        bad["numeric"] = 3
        validate(bad, "observable")


def test_exports(tmp_path):
    db = str(tmp_path / "g.sqlite")
    run_grid(GridSpec(["T(2,3)", "T(2,5)"], "SU(2)", [[1], [2]], [None, 3]), db, workers=0, progress=False)
    rows = list(csv.DictReader(io.StringIO(export_grid(db, "csv", str(tmp_path / "g.csv")))))
    assert len(rows) == 8 and (tmp_path / "g.csv").exists()
    # V(T(2,3)) at t = q^-1 (Jones 1985): q^-1 + q^-3 - q^-4
    gen = [r for r in rows if r["knot"] == "T(2,3)" and r["representation"] == "[1]" and r["level"] == ""][0]
    assert gen["exact"] == "-q**-4 + q**-3 + q**-1"
    tex = export_grid(db, "latex")
    # a multi-page longtable: one line per row, header repeated on every page
    assert "\\begin{longtable}" in tex and "\\endhead" in tex
    assert sum(1 for ln in tex.splitlines() if ln.startswith("T(") and ln.endswith("\\\\")) == 8
    assert "$-q^{-4} + q^{-3} + q^{-1}$" in tex
    assert "T(2,5)" in export_grid(db, "table")
    assert latex_table(["a"], [["x_1"]]) .count("x\\_1") == 1


def test_match_cli_compare_and_identify():
    r = runner.invoke(app, ["match", "T(2,3)", "--poly", "t + t^3 - t^4", "--json"])
    assert r.exit_code == 0, r.output
    out = json.loads(r.stdout)
    assert out["equal"] is True and out["map"]["variables"] == {"t": "q^-1"}
    r = runner.invoke(app, ["match", "T(2,3)", "--poly", "t + t^3 - 2*t^4", "--json"])
    assert r.exit_code == 1 and json.loads(r.stdout)["map"] is None
    r = runner.invoke(app, ["match", "--poly", "t^3 + t^5 - t^8", "--json", "--max-p", "3", "--max-q", "5"])
    assert r.exit_code == 0
    cands = json.loads(r.stdout)["candidates"]
    assert [(c["knot"], c["representation"]) for c in cands] == [("T(3,4)", [[1]])]
    assert set(cands[0]) >= {"knot", "representation", "map"}


def test_match_cli_knotinfo():
    pytest.importorskip("database_knotinfo")
    r = runner.invoke(app, ["match", "T(2,5)", "--knotinfo", "--invariant", "homfly", "--json"])
    assert r.exit_code == 0 and json.loads(r.stdout)["map"]["variables"] == {"v": "a^-1", "z": "z"}


@pytest.mark.parametrize("args, msg", [
    (["match", "T(2,3)", "--poly", "t + u"], "unknown variable 'u'"),
    (["match", "T(2,3)", "--poly", "t +* t"], "cannot read polynomial"),
    (["match", "T(2,3)"], "give a polynomial"),
    (["match", "knot", "--poly", "t"], "cannot read knot"),
    (["grid", "run", "--knots", "T(2,3),trefoil", "--store", "/nonexistent/x.sqlite"], "cannot read knots"),
    (["grid", "run", "--knots", "T(2,3)", "--level", "generic,x"], "cannot read the level"),
    (["grid", "export", "--store", "/nonexistent/none.sqlite"], "does not exist"),
])
def test_cli_bad_input_is_one_line(args, msg):
    r = runner.invoke(app, args)
    assert r.exit_code == 2
    assert msg in r.output and "Traceback" not in r.output


def test_grid_cli_run_resume_export(tmp_path):
    db = str(tmp_path / "g.sqlite")
    r = runner.invoke(app, ["grid", "run", "--knots", "T(2,3),T(3,4)", "--rep", "[1];[2]", "--level", "generic,1", "--normalized",
                            "--store", db, "--workers", "0", "--no-progress", "--json"])
    assert r.exit_code == 0, r.output
    rep = json.loads(r.stdout)
    assert rep["inserted"] == 6 and rep["skipped_nonintegrable"] == 2   # spin-1 colour [2] needs k >= 2 (CONVENTIONS §6)
    r = runner.invoke(app, ["grid", "resume", "--store", db, "--workers", "0", "--no-progress", "--json"])
    assert r.exit_code == 0 and json.loads(r.stdout)["reports"][0]["computed"] == 0
    r = runner.invoke(app, ["grid", "export", "--store", db, "--format", "json"])
    assert r.exit_code == 0 and len(json.loads(r.stdout)) == 6
    r = runner.invoke(app, ["grid", "status", "--store", db, "--json"])
    assert json.loads(r.stdout)["rows"] == 6
