"""The command line: ``knotobs loop`` and ``knotobs poly``, text and ``--json`` output.

Values printed are checked against outside references, not only against the library:
the Jones polynomial of the trefoil ``t + t^3 - t^4`` (V. F. R. Jones, Ann. of Math. 126
(1987) 335; also KnotInfo 3_1), the positive Hopf link ``-t^(1/2) - t^(5/2)`` (LinkInfo
L2a1{1}), the HOMFLY-PT of the trefoil ``2a^-2 - a^-4 + a^-2 z^2`` (KnotInfo 3_1 with
``v = a^-1``, docs/conventions.md §3/§8), the quantum dimension of the unknot (hook–content,
Macdonald (1995) I.3 ex. 1), and the framing rule ``W^fiber = theta^(PQ) W^0`` (CONVENTIONS §4).
"""

from __future__ import annotations

import json
from fractions import Fraction

import pytest
import sympy
from typer.testing import CliRunner

from knotobs import SU, TorusLink, rosso_jones, wilson_loop
from knotobs.cli import app
from knotobs.representations import quantum_dimension

runner = CliRunner()
q, t, a, z = sympy.symbols("q t a z")


def run(*args):
    res = runner.invoke(app, list(args))
    assert res.exit_code == 0, (args, res.output)
    return res.stdout


def run_json(*args):
    out = json.loads(run(*args, "--json"))
    for key in ("exact", "variables", "profile", "inputs"):
        assert key in out, key
    return out


def parse(out):
    syms = {v: sympy.Symbol(v) for v in out["variables"]}
    return sympy.sympify(out["exact"], locals=syms)


# ================================================================ loop
def test_loop_text_output():
    text = run("loop", "T(2,3)", "--group", "SU(2)", "--normalized")
    lines = text.splitlines()
    assert "T(2,3)" in lines[0] and "SU(2)" in lines[0]
    # Jones (1987): V(t) = t + t^3 - t^4 at t = q^-1
    assert "-q^-4 + q^-3 + q^-1" in text
    for label in ("variables:", "framing:", "normalization:", "chirality:"):
        assert label in text
    assert "zero (Seifert) framing" in text


def test_loop_json_trefoil_is_jones():
    out = run_json("loop", "T(2,3)", "--group", "SU(2)", "--rep", "[1]", "--normalized")
    assert out["variables"] == ["q"]
    assert sympy.simplify(parse(out) - (q**-1 + q**-3 - q**-4)) == 0  # Jones (1987), t = 1/q
    assert out["inputs"] == {"knot": "T(2,3)", "group": "SU(2)", "rep": [[1]], "framing": [0], "normalized": True}
    assert out["profile"]["framing"] == [0]
    assert out["profile"]["normalisation"].startswith("normalized")
    assert out["knot"] == "T(2,3)" and out["group"] == "SU(2)"


@pytest.mark.parametrize("group,rep", [("SU(3)", "[2,1]"), ("SU(4)", "[2]"), ("U(3)", "[1,1]")])
def test_loop_json_matches_library(group, rep):
    out = run_json("loop", "T(3,5)", "--group", group, "--rep", rep, "--route", "both")
    lib = wilson_loop("T(3,5)", group, json.loads(rep))
    assert sympy.expand(parse(out) - lib.value.to_sympy(q)) == 0
    assert out["inputs"]["group"] == group and out["inputs"]["rep"] == [json.loads(rep)]
    assert out["route"] == "both"


def test_loop_unknot_edge_cases():
    """T(1, q) and T(p, 1) are unknots: the unnormalised loop is dim_q (hook–content)."""
    expect = (q**-2 + 2 * q**-1 + 2 + 2 * q + q**2)  # dim_q of the adjoint [2,1] of SU(3), by hand
    for knot in ("T(1,5)", "T(4,1)", "T(1,1)", "T(-1,7)", "T(3,-1)"):
        out = run_json("loop", knot, "--group", "SU(3)", "--rep", "[2,1]")
        assert sympy.expand(parse(out) - expect) == 0, knot
    assert quantum_dimension(SU(3), (2, 1)).to_sympy(q) == sympy.expand(expect)
    out = run_json("loop", "T(7,1)", "--group", "SU(2)", "--normalized")
    assert parse(out) == 1


def test_loop_mirror_is_q_inverse():
    """T(p, -q) is the mirror image: q -> 1/q."""
    pos = parse(run_json("loop", "T(3,4)", "--group", "SU(3)", "--rep", "[2]"))
    neg = parse(run_json("loop", "T(3,-4)", "--group", "SU(3)", "--rep", "[2]"))
    assert sympy.expand(neg - pos.subs(q, 1 / q)) == 0


def test_loop_fiber_framing():
    """CONVENTIONS §4: W^fiber = theta(lam)^(PQ) W^0, theta(fund of SU(2)) = q^(3/4); P Q = 6."""
    out = run_json("loop", "T(2,3)", "--framing", "fiber")
    zero = parse(run_json("loop", "T(2,3)"))
    assert sympy.expand(parse(out) - sympy.expand(zero * q ** sympy.Rational(9, 2))) == 0
    assert sympy.expand(parse(out) - (-1 + q**2 + q**3 + q**4)) == 0
    assert out["profile"]["framing"] == [6]
    assert "fiber" in out["profile"]["framing_note"]


def test_loop_link_per_component_framing_and_colours():
    out = run_json("loop", "T(4,6)", "--group", "SU(3)", "--rep", "[1];[2]", "--framing", "1,0")
    lib = rosso_jones(TorusLink(4, 6), SU(3), [(1,), (2,)], framing=[1, 0])
    assert sympy.expand(parse(out) - lib.to_sympy(q)) == 0
    assert out["inputs"]["rep"] == [[1], [2]]
    assert out["inputs"]["framing"] == [1, 0]


# ================================================================ poly
def test_poly_jones_text_and_json():
    text = run("poly", "T(2,3)")
    assert "t + t^3 - t^4" in text  # Jones (1987); KnotInfo 3_1
    out = run_json("poly", "T(2,3)", "--family", "jones")
    assert sympy.expand(parse(out) - (t + t**3 - t**4)) == 0
    assert out["variables"] == ["t"]
    assert out["inputs"]["knot"] == "T(2,3)"
    assert out["profile"]["variable_map"] == "t = q^-1"


def test_poly_jones_hopf_link():
    out = run_json("poly", "T(2,2)")
    assert sympy.expand(parse(out) - (-t ** sympy.Rational(1, 2) - t ** sympy.Rational(5, 2))) == 0  # L2a1{1}


def test_poly_jones_variable_map_and_mirror():
    """--t q gives V(1/t); --mirror and T(p,-q) both give the mirror, V(1/t)."""
    base = parse(run_json("poly", "T(3,4)"))
    assert sympy.expand(base - (t**3 + t**5 - t**8)) == 0  # KnotInfo 8_19
    for args in (("poly", "T(3,4)", "--t", "q"), ("poly", "T(3,4)", "--mirror"), ("poly", "T(3,-4)")):
        assert sympy.expand(parse(run_json(*args)) - base.subs(t, 1 / t)) == 0, args


def test_poly_jones_unnormalized():
    out = run_json("poly", "T(2,3)", "--unnormalized")
    half = t ** sympy.Rational(1, 2)
    assert sympy.expand(parse(out) - (t + t**3 - t**4) * (half + 1 / half)) == 0
    assert out["inputs"]["normalized"] is False


def test_poly_colored_jones():
    out = run_json("poly", "T(2,3)", "--family", "colored-jones", "--color", "2")
    assert sympy.expand(parse(out) - (t + t**3 - t**4)) == 0
    out = run_json("poly", "T(2,5)", "--family", "colored-jones", "--color", "1")
    assert parse(out) == 1
    assert out["inputs"]["color"] == 1


def test_poly_homfly_trefoil_and_hopf():
    out = run_json("poly", "T(2,3)", "--family", "homfly")
    assert sympy.expand(parse(out) - (2 * a**-2 - a**-4 + a**-2 * z**2)) == 0  # KnotInfo 3_1, v = 1/a
    assert out["variables"] == ["a", "z"]
    out = run_json("poly", "T(2,2)", "--family", "homfly")
    # LinkInfo L2a1{1}: v/z - v^3/z + v z with v = 1/a
    assert sympy.expand(parse(out) - (a**-1 / z - a**-3 / z + a**-1 * z)) == 0


def test_poly_homfly_coloured_json_parses():
    out = run_json("poly", "T(2,3)", "--family", "homfly", "--rep", "[2]")
    expr = parse(out)
    assert expr.free_symbols <= {sympy.Symbol(v) for v in out["variables"]}
    assert out["inputs"]["rep"] == [[2]]


def test_poly_alexander():
    out = run_json("poly", "T(2,3)", "--family", "alexander")
    assert sympy.expand(parse(out) - (t**-1 - 1 + t)) == 0  # KnotInfo 3_1 via Conway 1 + z^2
    out = run_json("poly", "T(4,6)", "--family", "alexander")
    assert parse(out).subs(t, 1) == 0  # links: Delta(1) = 0 (classical)
    text = run("poly", "T(3,5)", "--family", "alexander")
    assert "Conway" in text


def test_poly_unknot_edge_cases():
    for knot in ("T(1,4)", "T(5,1)", "T(-3,1)"):
        for fam in ("jones", "homfly", "alexander"):
            assert parse(run_json("poly", knot, "--family", fam)) == 1, (knot, fam)


def test_json_is_one_object_and_exact_round_trips():
    """The JSON 'exact' string round-trips through sympy to the library's exact value (all families)."""
    cases = [("loop", "T(5,7)", "--group", "SU(3)", "--rep", "[2]", "--normalized"),
             ("poly", "T(5,7)", "--family", "jones"),
             ("poly", "T(4,6)", "--family", "homfly")]
    for args in cases:
        out = run_json(*args)
        assert isinstance(out, dict)
        assert sympy.sympify(out["exact"]) is not None
    lib = wilson_loop("T(5,7)", "SU(3)", [2], normalized=True).value
    out = run_json(*cases[0])
    terms = {}
    for term in sympy.Add.make_args(sympy.expand(parse(out))):
        c, e = term.as_coeff_exponent(q)
        terms[Fraction(str(e))] = int(c)
    assert terms == lib.terms()


@pytest.mark.parametrize("argv", [["space", "Sigma(2,3,5)", "--group", "SU(3)", "--level", "4"],
                                  ["--max-seconds", "30", "loop", "T(2,3)", "--json"],
                                  ["grid", "--help"], ["--help"], ["spac"]])
def test_the_executable_registers_only_the_invoked_command_with_the_same_output(argv, capsys):
    # knotobs.__main__.main builds only the command it runs (start-up); the output, the exit
    # status and the full listing of --help must be those of the whole application
    from knotobs.__main__ import main

    with pytest.raises(SystemExit) as e:
        main(argv)
    out = capsys.readouterr()
    full = CliRunner().invoke(app, argv)
    assert e.value.code == full.exit_code
    if argv == ["--help"]:      # the listing (its text is cut to the terminal width)
        for name in ("loop", "poly", "fibers", "space", "match", "flat", "continue", "plot", "qseries", "borel", "grid"):
            assert f"\n  {name} " in out.out and f"\n  {name} " in full.output, name
    else:
        assert " ".join((out.out + out.err).split()) == " ".join(full.output.split())
    assert len(app.registered_commands) >= 10 and app.registered_groups     # restored
