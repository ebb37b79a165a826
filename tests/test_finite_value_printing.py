"""Finite-level values print only digits they certify (docs/numerics.md: the bound
``10^-d max(|Z|, 1)`` of the numeric routes).

Outside facts: ``Z_k = 0`` for SU(2) on ``M(0; -1; (2,1), (4,1), (6,1))`` at odd ``k`` (the exact
surgery route; the issue text reports exact zeros at k = 1, 3, 5, and the cyclotomic value is 0);
``Z(S^3)`` of SO(3) at level 3 is the real number ``sqrt(2) S_00`` (common practice: S_00 is real).
Before, the integral route printed its rounding noise ``2.1e-42`` as 12 significant digits, and the
exact SO(3) value printed an imaginary part ``1.6e-44j``.
"""

from __future__ import annotations

import json

from typer.testing import CliRunner

from knotobs.cli import app


def _run(*args):
    out = CliRunner().invoke(app, list(args))
    assert out.exit_code == 0, out.output
    return out.stdout


def test_a_numeric_zero_prints_as_zero_not_as_noise():
    text = _run("space", "M(0; -1; (2,1), (4,1), (6,1))", "--level", "5", "--route", "integral", "-d", "12")
    line = [x for x in text.splitlines() if x.strip().startswith("numeric")][0]
    assert line.split()[1] == "0.0" and "10^-12 max(|Z|, 1)" in line
    js = json.loads(_run("space", "M(0; -1; (2,1), (4,1), (6,1))", "--level", "5", "--route", "integral",
                         "-d", "12", "--json"))
    assert js["numeric"]["re"] in ("0.0", "-0.0") and js["numeric"]["im"] in ("0.0", "-0.0")
    exact = json.loads(_run("space", "M(0; -1; (2,1), (4,1), (6,1))", "--level", "5", "--route", "surgery", "--json"))
    assert exact["exact"] == "0"


def test_an_exact_real_value_has_no_imaginary_noise():
    js = json.loads(_run("space", "S^3", "-g", "SO(3)", "--level", "3", "--json"))
    assert js["numeric"]["im"] == "0.0" and js["numeric"]["re"].startswith("0.52573111211913")
