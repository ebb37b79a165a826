"""Bad input: a clear error (a subclass of KnotobsError) that names the bad value.

Library calls and the command line (typer's CliRunner and one real subprocess): exit status
2, a one-line ``error: ...`` message, never a traceback.  (Project rule; no outside source
is needed for these.)
"""

from __future__ import annotations

import subprocess
import sys

import pytest
from typer.testing import CliRunner

from knotobs import SU, U, TorusLink, colored_jones, homfly, jones, parse_group, parse_knot, rosso_jones, weight_sum, \
    wilson_loop
from knotobs.errors import (
    InvalidGroupError,
    InvalidKnotError,
    InvalidRepresentationError,
    KnotobsError,
    ParseError,
    SizeLimitError,
)
from knotobs.cli import app as cli_app
from knotobs.representations import parse_partition

LIB_CASES = [
    # (id, callable, expected error class, substrings the message must contain)
    ("link-where-knot-required", lambda: TorusLink(4, 6).require_knot(), InvalidKnotError, ["T(4,6)", "2-component", "coprime"]),
    ("link-where-knot-required-neg", lambda: TorusLink(-6, 9).require_knot(), InvalidKnotError, ["T(-6,9)", "3-component"]),
    ("p-zero", lambda: TorusLink(0, 3), InvalidKnotError, ["p=0", "nonzero"]),
    ("q-zero", lambda: TorusLink(2, 0), InvalidKnotError, ["q=0", "nonzero"]),
    ("q-zero-text", lambda: parse_knot("T(5, 0)"), InvalidKnotError, ["q=0"]),
    ("p-float", lambda: TorusLink(2.5, 3), InvalidKnotError, ["2.5", "integer"]),
    ("p-huge", lambda: TorusLink(10**7, 3), SizeLimitError, [str(10**7)]),
    ("partition-increasing", lambda: wilson_loop("T(2,3)", "SU(3)", [1, 2]), InvalidRepresentationError, ["[1, 2]", "non-increasing"]),
    ("partition-negative", lambda: wilson_loop("T(2,3)", "SU(3)", [2, -1]), InvalidRepresentationError, ["[2, -1]"]),
    ("partition-float", lambda: wilson_loop("T(2,3)", "SU(3)", [1.5]), InvalidRepresentationError, ["1.5"]),
    ("partition-not-iterable", lambda: wilson_loop("T(2,3)", "SU(3)", rep=5), InvalidRepresentationError, ["5"]),
    ("partition-none", lambda: rosso_jones(TorusLink(2, 3), SU(2), None), InvalidRepresentationError, ["None"]),
    ("partition-text", lambda: parse_partition("[2,x]"), ParseError, ["[2,x]", "[2,1]"]),
    ("partition-bool", lambda: wilson_loop("T(2,3)", "SU(2)", [True]), InvalidRepresentationError, ["True"]),
    ("SU(1)", lambda: SU(1), InvalidGroupError, ["SU(1)", "at least 2"]),
    ("SU(0)-text", lambda: parse_group("SU(0)"), InvalidGroupError, ["SU(0)", "at least 2"]),
    ("U(0)", lambda: U(0), InvalidGroupError, ["U(0)", "at least 1"]),
    ("SU(-3)-text", lambda: parse_group("SU(-3)"), KnotobsError, ["SU(-3)"]),
    ("rows>N-SU2", lambda: wilson_loop("T(2,3)", "SU(2)", [1, 1, 1]), InvalidRepresentationError, ["[1, 1, 1]", "SU(2)", "at most 2"]),
    ("rows>N-SU3-weight-sum", lambda: weight_sum(TorusLink(2, 5), SU(3), (2, 1, 1, 1)), InvalidRepresentationError, ["[2, 1, 1, 1]", "SU(3)"]),
    ("rows>N-U2", lambda: rosso_jones(TorusLink(3, 4), U(2), (1, 1, 1)), InvalidRepresentationError, ["U(2)"]),
    ("rows>N-link-colour", lambda: wilson_loop("T(4,6)", "SU(2)", [(1,), (1, 1, 1)]), InvalidRepresentationError, ["[1, 1, 1]"]),
    ("knot-text", lambda: parse_knot("T(2;3)"), ParseError, ["T(2;3)", "T(p,q)"]),
    ("knot-name", lambda: parse_knot("trefoil"), ParseError, ["trefoil", "T(2,3)"]),
    ("knot-empty", lambda: parse_knot(""), ParseError, ["T(p,q)"]),
    ("group-text", lambda: parse_group("SO(3)"), ParseError, ["SO(3)", "SU(N)"]),
    ("group-garbage", lambda: parse_group("SU(three)"), ParseError, ["SU(three)"]),
    ("colour-count", lambda: wilson_loop("T(4,6)", "SU(2)", [(1,), (1,), (1,)]), InvalidKnotError, ["T(4,6)", "2 component", "3 colours"]),
    ("framing-name", lambda: wilson_loop("T(2,3)", framing="blah"), InvalidKnotError, ["blah", "fiber"]),
    ("framing-count", lambda: wilson_loop("T(4,6)", framing=[1]), InvalidKnotError, ["[1]", "2 components"]),
    ("route", lambda: wilson_loop("T(2,3)", route="nope"), KnotobsError, ["nope", "rosso-jones"]),
    ("jones-variable", lambda: jones("T(2,3)", t_is="x"), KnotobsError, ["'x'", "q^-1"]),
    ("colour-zero", lambda: colored_jones("T(2,3)", 0), InvalidRepresentationError, ["n=0", "positive"]),
    ("colour-negative", lambda: colored_jones("T(2,3)", -2), InvalidRepresentationError, ["n=-2"]),
    ("homfly-unnormalised-coloured", lambda: homfly("T(2,3)", (2,), normalized=False), InvalidRepresentationError, ["normalised"]),
    ("weight-sum-huge-colour", lambda: weight_sum(TorusLink(2, 3), SU(9), (400,)), SizeLimitError, ["T(2,3)", "SU(9)", "[400]", "estimated"]),
    ("colored-jones-huge", lambda: colored_jones("T(3,4)", 10**6), SizeLimitError, ["J_1000000", "T(3,4)", "estimated"]),
]


@pytest.mark.parametrize("name,call,cls,needles", LIB_CASES, ids=[c[0] for c in LIB_CASES])
def test_library_errors(name, call, cls, needles):
    with pytest.raises(cls) as info:
        call()
    assert isinstance(info.value, KnotobsError)
    msg = str(info.value)
    for needle in needles:
        assert needle in msg, f"{name}: {needle!r} not in {msg!r}"


def test_errors_are_builtin_compatible():
    """Each error also derives from the closest builtin (errors.py docstring)."""
    with pytest.raises(ValueError):
        TorusLink(0, 1)
    with pytest.raises(ValueError):
        SU(1)


# ---------------------------------------------------------------- command line
runner = CliRunner()

CLI_CASES = [
    (["loop", "T(4,6)", "--group", "SU(1)"], ["SU(1)"]),
    (["loop", "T(0,3)"], ["p=0"]),
    (["loop", "T(2,0)"], ["q=0"]),
    (["loop", "T(2,3)", "--rep", "[1,2]"], ["[1, 2]"]),
    (["loop", "T(2,3)", "--rep", "[1.5]"], ["[1.5]"]),
    (["loop", "T(2,3)", "--rep", "[2,x]"], ["[2,x]"]),
    (["loop", "T(2,3)", "--group", "SU(2)", "--rep", "[1,1,1]"], ["[1, 1, 1]", "SU(2)"]),
    (["loop", "T(2,3)", "--group", "SO(2)"], ["SO(2)"]),          # SO(3) is accepted since issue #13
    (["loop", "T(2,3)", "--group", "SU(2"], ["'SU(2'"]),
    (["loop", "T(2,3)", "--group", "Sp(3)"], ["Sp(3)"]),
    (["loop", "T(2,3)", "--group", "G2", "--rep", "[1]"], ["partition"]),
    (["loop", "T(4,6)", "--group", "SO(5)", "--rep", "[1];[1];[1]"], ["3 representations"]),
    (["loop", "T(2,3)", "--group", "U(0)"], ["U(0)"]),
    (["loop", "trefoil"], ["trefoil"]),
    (["loop", "T(2,3", "--json"], ["T(2,3"]),
    (["loop", "T(2,3)", "--framing", "abc"], ["abc"]),
    (["loop", "T(4,6)", "--framing", "1,2,3"], ["[1, 2, 3]"]),
    (["loop", "T(4,6)", "--rep", "[1];[1];[1]"], ["3 colours"]),
    (["loop", "T(2,3)", "--route", "nope"], ["nope"]),
    (["poly", "T(2,3)", "--family", "foo"], ["foo"]),
    (["poly", "T(2,3)", "--family", "colored-jones"], ["--color"]),
    (["poly", "T(2,3)", "--family", "colored-jones", "--color", "0"], ["n=0"]),
    (["poly", "T(2,3)", "--t", "x"], ["'x'"]),
    (["poly", "T(0,3)", "--family", "alexander"], ["p=0"]),
    (["poly", "T(2,3)", "--family", "homfly", "--rep", "[1,2]"], ["[1, 2]"]),
]


@pytest.mark.parametrize("args,needles", CLI_CASES, ids=[" ".join(a) for a, _ in CLI_CASES])
def test_cli_errors(args, needles):
    res = runner.invoke(cli_app, args)
    assert res.exit_code == 2, (args, res.exit_code, res.output)
    err = res.stderr
    assert err.startswith("error: "), err
    assert "Traceback" not in res.output
    assert res.exception is None or isinstance(res.exception, SystemExit)
    for needle in needles:
        assert needle in err, (needle, err)
    assert res.stdout == ""


def test_cli_typer_usage_error_has_no_traceback():
    """A value typer itself rejects (non-integer --color) is a usage error: exit 2, no traceback."""
    res = runner.invoke(cli_app,
                        ["poly", "T(2,3)", "--family", "colored-jones", "--color", "abc"])
    assert res.exit_code == 2
    assert "Traceback" not in res.output
    assert "abc" in res.output or "integer" in res.output


def test_cli_error_in_real_process():
    """The installed entry point (run as a module, as the console script does): exit 2, stderr only."""
    proc = subprocess.run(
        [sys.executable, "-c", "from knotobs.cli import main; main()", "loop", "T(6,9)", "--group", "SU(1)"],
        capture_output=True, text=True, timeout=120,
    )
    assert proc.returncode == 2
    assert proc.stdout == ""
    assert proc.stderr.startswith("error: ") and "SU(1)" in proc.stderr
    assert "Traceback" not in proc.stderr
