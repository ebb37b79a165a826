"""``knotobs poly --family superpolynomial``: the JSON schema, the text, refusals of options that do not apply."""

import json

import pytest
import sympy
from typer.testing import CliRunner

from knotobs.cli import app
from knotobs.output.schema import validate

runner = CliRunner()


def test_json_validates_and_reads_back():
    r = runner.invoke(app, ["poly", "T(2,3)", "--family", "superpolynomial", "--json"])
    assert r.exit_code == 0, r.output
    d = json.loads(r.output)
    validate(d, "polynomial-result")
    a, q, t = sympy.symbols("a q t")
    # DGR 2006 (trefoil): a^2 q^-2 + a^2 q^2 t^2 + a^4 t^3; reduced Khovanov of 3_1 at a = q^2 (dataset)
    assert sympy.expand(sympy.sympify(d["exact"]) - (a**2 / q**2 + a**2 * q**2 * t**2 + a**4 * t**3)) == 0
    assert d["variables"] == ["a", "q", "t"]


def test_text_states_the_grading():
    r = runner.invoke(app, ["poly", "T(2,5)", "--family", "superpolynomial"])
    assert r.exit_code == 0, r.output
    assert "Dunfield-Gukov-Rasmussen" in r.output and "reduced (unknot = 1)" in r.output


@pytest.mark.parametrize("extra", [["--color", "2"], ["--group", "SU(3)"], ["--form", "aq"], ["--unnormalized"],
                                   ["--t", "q"]])
def test_options_that_do_not_apply_are_refused(extra):
    r = runner.invoke(app, ["poly", "T(2,3)", "--family", "superpolynomial", *extra])
    assert r.exit_code == 2
    assert "does not apply" in r.output and extra[0] in r.output


def test_a_link_is_one_error_line():
    r = runner.invoke(app, ["poly", "T(4,6)", "--family", "superpolynomial"])
    assert r.exit_code == 2
    assert r.output.startswith("error:") and "T(4,6)" in r.output
