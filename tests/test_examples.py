"""Smoke tests: every script in examples/ runs and produces sensible output."""

import importlib.util
from pathlib import Path

import mpmath

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"


def load(name):
    spec = importlib.util.spec_from_file_location(name, EXAMPLES / f"{name}.py")
    mod = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(mod)
    return mod


def test_twist_family_levels(capsys):
    rows = load("twist_family_levels").main(["--max-m", "2", "--colors", "2", "--levels", "5:10:5"])
    assert len(rows) == 2
    # J_2(T(2,3)) at t = exp(-2 pi i/5): V = t + t^3 - t^4 evaluated directly (Jones 1987 closed form)
    t = mpmath.exp(-2j * mpmath.pi / 5)
    assert abs(rows[0][2][0] - abs(t + t**3 - t**4)) < 1e-15


def test_two_routes_su3(capsys):
    n = load("two_routes_su3").main(["--max-pq", "10"])
    assert n > 0
    assert "all agree" in capsys.readouterr().out
