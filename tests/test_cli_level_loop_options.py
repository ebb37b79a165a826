"""Options of ``knotobs loop`` at a level either take effect or are refused (internal checks of the
interface rules in docs/interface.md; the values compared are the package's own, no outside data).

Found by an audit of the command line: a list of representations on one fiber was accepted and
its first entry used; ``--unnormalized`` at a level was ignored; fiber numbers beyond the last
were reported with 0-based internal indices; U(N) fiber loops defaulted to the fiber framing while
SU(N) (and the README) default to the zero framing, and ``--framing 0`` was refused for U(N).
"""

from __future__ import annotations

import json

import pytest
from typer.testing import CliRunner

from knotobs.cli import app

AT = ["--in", "Sigma(2,3,5)", "--level", "5"]


def _run(*args):
    return CliRunner().invoke(app, ["loop", *args])


@pytest.mark.parametrize("args,words", [
    (["--fiber", "2", "--rep", "[1];[2]"], ["--rep", "one fiber takes one representation"]),
    (["fiber", "--rep", "[1];[2]"], ["--rep", "one fiber takes one representation"]),
    (["T(2,3)", "--unnormalized"], ["--unnormalized", "--raw"]),
    (["--fiber", "4"], ["--fiber", "4", "3 exceptional fibers", "1..3"]),
])
def test_options_that_cannot_take_effect_are_refused(args, words):
    out = _run(*args, *(AT if args[0] != "T(2,3)" else ["--level", "3"]))
    assert out.exit_code != 0
    for w in words:
        assert w in out.output, out.output


def _numeric(*args):
    out = _run(*args, "--json", "-d", "20")
    assert out.exit_code == 0, out.output
    return json.loads(out.stdout)["numeric"]


def test_unitary_fiber_loops_default_to_the_zero_framing_like_su_n():
    default = _numeric("fiber", "-g", "U(2)", *AT)
    assert default == _numeric("fiber", "-g", "U(2)", *AT, "--framing", "zero")
    assert default == _numeric("fiber", "-g", "U(2)", *AT, "--framing", "0")
    assert default != _numeric("fiber", "-g", "U(2)", *AT, "--framing", "fiber")
    out = _run("fiber", "-g", "U(2)", "--in", "L(7,2)", "--level", "5")
    assert out.exit_code != 0 and "--framing fiber" in out.output


def test_grid_refuses_the_su2_color_shorthand_for_another_group(tmp_path):
    out = CliRunner().invoke(app, ["grid", "run", "--knots", "T(2,3)", "--color", "2,3", "--group", "SU(3)",
                                   "-s", str(tmp_path / "g.sqlite")])
    assert out.exit_code != 0 and "--color" in out.output and "SU(2) dimensions" in out.output
