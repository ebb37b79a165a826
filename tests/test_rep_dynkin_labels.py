"""SU(N) Dynkin labels on the command line and in the API are read as labels, never as a partition.

Outside fact (common practice; e.g. W. Fulton and J. Harris, *Representation Theory*, Springer
1991, §15.3, cited from memory): the SU(N) highest weight with Dynkin labels ``(a_1, ..., a_{N-1})``
is the partition ``l_i = a_i + ... + a_{N-1}``; for SU(3), ``(1,1)`` is the adjoint ``[2,1]`` (dimension
8) and ``(0,1)`` the antifundamental ``[1,1]``.  Before, ``(1,1)`` was silently read as ``[1,1]``.
"""

from __future__ import annotations

import json

import pytest
from typer.testing import CliRunner

import knotobs
from knotobs.cli import app
from knotobs.errors import InvalidRepresentationError

FIBER = ["loop", "--in", "Sigma(2,3,5)", "--fiber", "2", "-g", "SU(3)", "--level", "4", "--json", "-d", "15"]


def _value(*rep):
    out = CliRunner().invoke(app, FIBER + list(rep))
    assert out.exit_code == 0, out.output
    return json.loads(out.stdout)["numeric"]


def test_dynkin_labels_of_a_fiber_loop_are_the_partition_they_stand_for():
    adj, anti = _value("--rep", "(1,1)"), _value("--rep", "(0,1)")
    assert adj == _value("--rep", "[2,1]")
    assert anti == _value("--rep", "[1,1]")
    assert adj != anti


def test_dynkin_labels_in_the_polynomial_route_and_the_api():
    p = knotobs.rosso_jones("T(2,3)", "SU(3)", "(1,1)")
    assert p == knotobs.rosso_jones("T(2,3)", "SU(3)", "[2,1]") != knotobs.rosso_jones("T(2,3)", "SU(3)", "[1,1]")
    # dimension of the adjoint: the unnormalized unknot at q = 1 (a Wilson loop of T(1,2), the unknot)
    assert knotobs.rosso_jones("T(2,1)", "SU(3)", "(1,1)").evaluate(1) == 8


@pytest.mark.parametrize("args,words", [
    (["--rep", "(1,0,0)"], ["(1,0,0)", "SU(3) has 2 labels"]),
    (["--color", "3"], ["--color", "SU(2) shorthand", "SU(3)"]),
])
def test_wrong_labels_and_the_su2_shorthand_are_refused(args, words):
    out = CliRunner().invoke(app, FIBER + args)
    assert out.exit_code != 0
    for w in words:
        assert w in out.output, out.output


def test_labels_without_a_group_or_for_U_N_are_refused_naming_the_partition():
    with pytest.raises(InvalidRepresentationError, match=r"U\(1\) charge.*\[2,1\]"):
        knotobs.rosso_jones("T(2,3)", "U(3)", "(1,1)")
    out = CliRunner().invoke(app, ["poly", "T(2,3)", "--family", "homfly", "--rep", "(1,1)"])
    assert out.exit_code != 0 and "need a group" in out.output
