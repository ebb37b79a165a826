"""Printed forms: no Python lists or empty fiber lists, rational values without a root of
unity, zeros printed as 0, one normal form for a space in every command, one labelling of
the S-matrix (S_00), agreement lines for ``--route both``, ``--json`` never builds the text.

Values: L(7,2) = M(0; 3; (2,1)) in Seifert normal form (P. Orlik, Seifert Manifolds, Springer
LNM 291 (1972)); Z_k(S^3) = S_00 = sqrt(2/K) sin(pi/K), which is 1/2 at k = 2 (common practice).
"""

from __future__ import annotations

import json

from typer.testing import CliRunner

from knotobs.cli import app

runner = CliRunner()


def run(*args):
    r = runner.invoke(app, list(args))
    assert r.exit_code == 0, (args, r.output)
    return r.output


def test_rational_value_has_no_root_of_unity_and_empty_fibration_prints_cleanly():
    out = run("space", "M(0; 1)", "-k", "2")
    assert "exact     1/2\n" in out and "z1" not in out
    assert "M(0; 1) with e" in out and "M(0; 1; )" not in out


def test_self_linking_is_not_a_python_list():
    out = run("loop", "--in", "L(7,2)", "--fiber", "1", "-k", "2")
    assert "self-linking in M: -3/7" in out and "['" not in out


def test_trivial_phase_prints_zero():
    out = run("flat", "Sigma(2,3,7)")
    trivial = [ln for ln in out.splitlines() if ln.startswith("trivial")][0]
    assert trivial.split()[-1] == "0" and "e-" not in trivial


def test_one_normal_form_everywhere():
    normal = "M(0; 3; (2,1))"
    assert normal in run("space", "L(7,2)")
    assert f"on {normal}" in run("flat", "L(7,2)")
    assert f"Z({normal})" in run("continue", "L(7,2)", "-k", "3.5", "-d", "10")


def test_s_matrix_labels_agree():
    assert "S_00" in run("space", "S^3", "-k", "2")
    cont = run("continue", "Sigma(2,3,5)", "-k", "3.5", "-d", "10")
    assert "S_00" in cont and "S_11" not in cont


def test_route_both_prints_its_agreement():
    assert "agree" in run("loop", "T(3,4)", "-g", "SU(3)", "--route", "both")
    assert "agree" in run("loop", "T(3,4)", "-k", "2", "--route", "both")


def test_json_does_not_build_the_text(monkeypatch):
    import knotobs.output.text as text

    def boom(*a, **k):
        raise AssertionError("the text form was built under --json")

    monkeypatch.setattr(text, "render_polynomial", boom)
    out = json.loads(run("poly", "T(3,4)", "--family", "colored-jones", "-c", "5", "--json"))
    assert out["quantity"] == "colored-jones"


def test_square_root_value_prints_no_root_of_unity_legend():
    # M(0; 0; (3,1), (3,1), (3,1)) (e = -1) at SU(2) level 4: the exact value is printed as a
    # rational multiple of sqrt(3), so no "with z..." legend may follow it (an internal check of
    # the printed form; the value itself is the localisation route's, checked elsewhere)
    out = run("space", "M(0; 0; (3,1), (3,1), (3,1))", "-k", "4")
    line = [x for x in out.splitlines() if x.startswith("  exact")][0]
    assert "sqrt(3)" in line and "z" not in line
    assert "with z" not in out
    js = json.loads(run("space", "M(0; 0; (3,1), (3,1), (3,1))", "-k", "4", "--json"))
    assert js["root_of_unity"] == ""


def test_values_beyond_their_certified_digits_print_in_scientific_notation():
    # a value whose certified digits end before the decimal point prints those digits and an
    # exponent, never zeros that were not computed; the number is the same (read back)
    import mpmath

    from knotobs.precision import certified_str

    with mpmath.workdps(60):
        x = mpmath.mpf(2) ** 200                       # 1.606938044258990275541962092341...e60
        s = certified_str(x, 20)
        assert s == "1.6069380442589902755e+60", s             # 20 significant digits
        assert abs(mpmath.mpf(s) / x - 1) < mpmath.mpf(10) ** -19
        # both parts to the same decimal position (10^41): 17 digits of the imaginary part
        z = certified_str(mpmath.mpc(-x, x / 1000), 20)
        assert z == "(-1.6069380442589902755e+60 + 1.6069380442589903e+57j)", z


def test_values_of_huge_magnitude_print_at_once(monkeypatch):
    # continued values far from the real axis reach |Z| ~ 10^(10^6); printing them must not work
    # at a million digits (it once ran for minutes there): 20 digits and the exponent, read back
    # with mpmath in a local context (the reference is the number itself), and every working
    # precision the formatting asks for stays small (internal check of the cause)
    import mpmath

    import knotobs.numerics
    from knotobs.precision import certified_str

    asked = []
    real_local_mp = knotobs.numerics.local_mp

    def spy(dps):
        asked.append(dps)
        return real_local_mp(dps)

    monkeypatch.setattr(knotobs.numerics, "local_mp", spy)

    ctx = mpmath.MPContext()
    ctx.dps = 40
    x = ctx.mpf(3) ** 2_000_001                        # about 10^954243
    s = certified_str(x, 20)
    mant, exp = s.split("e+")
    assert int(exp) == int(ctx.floor(ctx.log10(x))) and len(mant.replace(".", "")) <= 20, s
    assert abs(ctx.mpf(s) / x - 1) < ctx.mpf(10) ** -19
    assert asked and max(asked) < 200, asked


def test_level_plane_beyond_float_range_is_valid_json():
    # far from the real axis |Z| ~ 10^(10^5) leaves the float range: the grid once held
    # Infinity, which is no valid JSON.  Now Z is null there and log10 |Z|, arg Z carry the values
    # (internal check against the same value printed by 'continue')
    import mpmath

    r = runner.invoke(app, ["plot", "level-plane", "Sigma(2,3,5)", "--n", "2", "--im", "100000,1000000", "--json"])
    assert r.exit_code == 0, r.output
    data = json.loads(r.output)
    json.dumps(data, allow_nan=False)                      # raises on Infinity or NaN
    assert data["Z"][0][0] is None
    c = runner.invoke(app, ["continue", "Sigma(2,3,5)", "--level", f"{data['re'][0] - 2}+{data['im'][0]}i", "--json"])
    z = json.loads(c.output)["numeric"]
    ctx = mpmath.MPContext()
    ctx.dps = 30
    expected = ctx.log10(abs(ctx.mpc(ctx.mpf(z["re"]), ctx.mpf(z["im"]))))
    assert abs(data["log10_abs_Z"][0][0] - float(expected)) < 1e-6
