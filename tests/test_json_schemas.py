"""Every command's --json output validates against its documented schema (knotobs.output.schema)."""

import json

import pytest
from typer.testing import CliRunner

from knotobs.cli import app
from knotobs.output.schema import validate

runner = CliRunner()

CASES = [
    (["loop", "T(2,3)", "--json"], "polynomial-result"),
    (["poly", "T(4,6)", "--family", "homfly", "--json"], "polynomial-result"),
    (["poly", "T(3,4)", "--family", "colored-jones", "--color", "3", "--json"], "polynomial-result"),
    (["space", "L(7,2)", "--json"], "seifert-space"),
    (["space", "--surgery", "T(2,3)", "--slope", "6", "--json"], "seifert-space"),
    (["fibers", "T(2,5)", "--in", "L(7,2)", "--json"], "fibered-knot"),
    (["loop", "T(2,3)", "--level", "3", "--json"], "finite-level"),
    (["space", "Sigma(2,3,5)", "--level", "2", "--json"], "finite-level"),
    (["space", "Sigma(2,3,5)", "--level", "2", "--json"], "seifert-space"),
    (["flat", "Sigma(2,3,7)", "--json"], "flat-connections"),
    (["continue", "Sigma(2,3,5)", "--level", "7.5+0.3i", "--digits", "15", "--json"], "continued-value"),
    (["continue", "T(2,3)", "--couplings", "10+2i,10-2i", "--digits", "15", "--json"], "continued-value"),
    (["match", "T(2,3)", "--poly", "t + t^3 - t^4", "--json"], "comparison"),
    (["loop", "T(3,4)", "--group", "Sp(4)", "--rep", "(0,1)", "--json"], "polynomial-result"),
    (["poly", "T(4,6)", "--family", "kauffman", "--json"], "polynomial-result"),
    (["poly", "T(2,5)", "--family", "dubrovnik", "--json"], "polynomial-result"),
    (["loop", "T(2,3)", "--group", "SO(3)", "--level", "5", "--json"], "finite-level"),
    (["space", "Sigma(2,3,5)", "--group", "SO(3)", "--level", "3", "--json"], "finite-level"),
]


@pytest.mark.parametrize("args,schema", CASES)
def test_json_output_matches_schema(args, schema):
    r = runner.invoke(app, args)
    assert r.exit_code == 0, r.output
    validate(json.loads(r.output), schema)


def test_flat_su3_on_a_lens_space_matches_schema():
    r = runner.invoke(app, ["flat", "L(5,2)", "--group", "SU(3)", "--json"])
    assert r.exit_code == 0, r.output
    d = json.loads(r.output)
    validate(d, "flat-connections")
    assert len(d["connections"]) == 7   # multisets of Z/5 of size 3 with sum 0 mod 5: C(7,3)/5
