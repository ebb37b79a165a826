"""Command line: ``knotobs fibers`` and ``knotobs space``."""

import json

import pytest
from typer.testing import CliRunner

import knotobs.cli.fibers_cmd  # noqa: F401  (registers the commands)
from knotobs.cli._app import app

runner = CliRunner()


def run(*args):
    return runner.invoke(app, list(args))


def run_json(*args):
    res = run(*args, "--json")
    assert res.exit_code == 0, res.output
    return json.loads(res.stdout)


def test_fibers_trefoil_json():
    # T(2,3) is the regular fibre of S^3 with fibre framing 6 = P*Q (common practice;
    # CONVENTIONS §5).
    d = run_json("fibers", "T(2,3)")
    assert d["input"]["knot"] == "T(2,3)" and d["input"]["space"] == "S^3"
    assert d["recognised"] == "S^3" and d["h1_order"] == 1
    assert d["fiber_framing"] == "6"
    assert d["euler"] == "-1/6"
    assert d["seifert"] == {"b": -1, "fibers": [[2, 1], [3, 2]]}
    assert sorted(f["order"] for f in d["exceptional_fibers"]) == [2, 3]


def test_fibers_text_table():
    res = run("fibers", "T(3,4)")
    assert res.exit_code == 0
    assert "fiber framing" in res.output and "12" in res.output
    assert "linking numbers" in res.output


def test_fibers_in_lens_space():
    d = run_json("fibers", "T(3,1)", "--in", "L(7,2)")
    assert d["recognised"] == "L(7,2)" and d["h1_order"] == 7
    assert d["homology_class"] == 3 and d["fiber_framing"] == "39/7"


@pytest.mark.parametrize(
    "space, name, h1, euler",
    [
        ("Sigma(2,3,5)", "Sigma(2,3,5)", 1, "-1/30"),  # Neumann-Raymond 1978
        ("L(7,4)", "L(7,2)", 7, None),  # Reidemeister 1935: L(7,4) = L(7,2)
        ("S^3", "S^3", 1, "-1"),
        ("M(0; -1; (2,1), (3,1), (5,1))", "Sigma(2,3,5)", 1, "-1/30"),
    ],
)
def test_space_json(space, name, h1, euler):
    d = run_json("space", space)
    assert d["input"]["space"] == space
    assert d["recognised"] == name and d["h1_order"] == h1
    if euler is not None:
        assert d["euler"] == euler
    assert set(d["seifert"]) == {"b", "fibers"}


def test_space_surgery_poincare():
    # Kirby-Scharlemann 1979: -1 surgery on the left-handed trefoil is Sigma(2,3,5).
    d = run_json("space", "--surgery", "T(2,-3)", "--slope", "-1")
    assert d["recognised"] == "Sigma(2,3,5)" and d["euler"] == "-1/30" and d["h1_order"] == 1
    assert d["input"] == {"space": None, "surgery": "T(2,-3)", "slope": "-1"}


def test_space_surgery_fraction_and_reducible():
    # Moser 1971: 5/2 surgery on T(2,3): fibres of orders 2, 3, |6*2-5| = 7, |H_1| = 5;
    # 6 surgery: L(2,1) # L(3,2), |H_1| = 6.
    d = run_json("space", "--surgery", "T(2,3)", "--slope", "5/2")
    assert sorted(a for a, _ in d["seifert"]["fibers"]) == [2, 3, 7] and d["h1_order"] == 5
    d = run_json("space", "--surgery", "T(2,3)", "--slope", "6")
    assert d["seifert"] is None and d["h1_order"] == 6 and "#" in d["recognised"]


@pytest.mark.parametrize(
    "args, needle",
    [
        (("space", "M(0; 0; (2,4))"), "(2,4)"),
        (("space", "M(0; 0; (0,1))"), "a_1 = 0"),
        (("space", "L(7"), "'L(7'"),
        (("space", "--surgery", "T(2,3)", "--slope", "1/0"), "'1/0'"),
        (("space", "--surgery", "T(2,3)"), "--slope"),
        (("fibers", "T(5,-2)", "--in", "L(5,2)"), "T(5,-2)"),
        (("fibers", "T(2,3)", "--in", "Sigma(2,3,5)"), "T(2,3)"),
        (("fibers", "K(2,3)"), "'K(2,3)'"),
        (("fibers", "T(2,3)", "--fiber", "5"), "cores 1..2"),
        (("fibers", "T(2,3)", "--core", "2"), "--fiber"),
    ],
)
def test_cli_errors_are_clear(args, needle):
    res = run(*args)
    assert res.exit_code == 2
    assert "Traceback" not in res.output
    assert needle in res.output
