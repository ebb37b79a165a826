"""The CLI's error layer and the malformed-input matrix: one ``error:`` line and exit 2, never a
traceback, never a silently accepted invalid value.

The expected behaviour is the project's rule for bad input (an error naming the value and what
would be valid, before any work); each case below was seen to produce a traceback or a value.
"""

import os
import stat

import pytest
from typer.testing import CliRunner

from knotobs.cli import app

runner = CliRunner()


def run(*args):
    return runner.invoke(app, list(args))


def one_error(result, *words):
    assert result.exit_code == 2, (result.exit_code, result.output)
    assert result.exception is None or isinstance(result.exception, SystemExit), repr(result.exception)
    err = result.stderr.strip().splitlines()
    assert len(err) == 1 and err[0].startswith("error: "), result.stderr
    assert "Traceback" not in result.output
    for w in words:
        assert w in err[0], (w, err[0])
    return err[0]


# ------------------------------------------------------------------ the error layer itself

def test_usage_errors_are_one_line_naming_the_option():
    one_error(run("loop", "T(2,3)", "--digts", "3"), "--digts", "--digits", "loop --help")
    one_error(run("loop", "T(2,3)", "--level", "x"), "--level")
    one_error(run("flat"), "Missing argument")
    one_error(run("grid", "run", "--bogus"), "--bogus")


def test_unexpected_exception_is_a_one_line_bug_report(monkeypatch):
    import knotobs.fibrations.surgery as f      # the command imports it when it runs

    def boom(*a, **k):
        raise ZeroDivisionError("division by zero")

    monkeypatch.setattr(f, "space_report", boom)
    line = one_error(run("space", "S^3"), "internal error", "ZeroDivisionError", "please report", "--debug")
    assert "division by zero" in line
    res = run("--debug", "space", "S^3")
    assert res.exit_code == 2 and "Traceback" in res.stderr and "ZeroDivisionError" in res.stderr


def test_global_limits_take_effect_and_are_validated():
    one_error(run("--max-seconds", "0", "loop", "T(2,3)"), "--max-seconds")
    one_error(run("--max-memory", "-3", "loop", "T(2,3)"), "--max-memory")
    # a plot that fits 60 s is refused under a limit of 1 s, with the estimate
    one_error(run("--max-seconds", "1", "plot", "asymptotics", "Sigma(2,3,5)", "-o", "x.png", "--kmax", "20000"),
              "estimated", "limit of 1 s")
    assert run("--max-seconds", "5", "loop", "T(2,3)").exit_code == 0


def test_env_limit_is_read(monkeypatch):
    monkeypatch.setenv("KNOTOBS_MAX_SECONDS", "1")
    one_error(run("plot", "asymptotics", "Sigma(2,3,5)", "-o", "x.png", "--kmax", "20000"), "limit of 1 s")
    monkeypatch.setenv("KNOTOBS_MAX_SECONDS", "abc")
    one_error(run("loop", "T(2,3)", "--level", "3"), "KNOTOBS_MAX_SECONDS")


# ------------------------------------------------------------------ tracebacks seen before

def test_deeply_nested_polynomial():
    deep = "(" * 5000 + "t" + ")" * 5000
    one_error(run("match", "T(2,3)", "--poly", deep), "nested")


@pytest.mark.parametrize("cmd", [["loop", "T(2,3)", "--level", "3"], ["space", "Sigma(2,3,5)", "--level", "3"],
                                 ["continue", "Sigma(2,3,5)", "--K", "5.5"]])
@pytest.mark.parametrize("d", ["10000", "-5", "0"])
def test_digits_out_of_range(cmd, d):
    one_error(run(*cmd, "--digits", d), f"--digits {d}", "from 1 to 2000")


@pytest.mark.parametrize("opt,val,word", [("--re", "nan,nan", "finite"), ("--im", "inf,1", "finite"),
                                          ("--re", "5,5", "empty range"), ("--im", "1,-1", "empty range"),
                                          ("--re", "3", "two numbers")])
def test_level_plane_ranges(tmp_path, opt, val, word):
    one_error(run("plot", "level-plane", "Sigma(2,3,5)", "-o", str(tmp_path / "x.png"), opt, val, "--n", "2"),
              opt, word)


@pytest.mark.parametrize("kmax", ["0", "-5", "3"])
def test_asymptotics_kmax_too_small(tmp_path, kmax):
    # every integer K from 3 is sampled, so the smallest plot with two levels has --kmax 4
    one_error(run("plot", "asymptotics", "Sigma(2,3,5)", "-o", str(tmp_path / "a.png"), "--kmax", kmax),
              f"--kmax {kmax}", ">= 4")


def test_asymptotics_runaway_refused_quickly(tmp_path):
    import time

    t = time.time()
    one_error(run("plot", "asymptotics", "Sigma(2,3,5)", "-o", str(tmp_path / "a.png"), "--kmax", "100000"),
              "estimated", "kmax")
    assert time.time() - t < 2
    assert not (tmp_path / "a.png").exists()


def test_unwritable_output(tmp_path, monkeypatch):
    one_error(run("plot", "zeros", "T(2,3)", "-o", "/nonexistent/dir/x.png"), "does not exist")
    ro = tmp_path / "ro"
    ro.mkdir()
    ro.chmod(stat.S_IRUSR | stat.S_IXUSR)
    real_access = os.access
    # root may write anywhere: report the read-only directory as the file system would to a user
    monkeypatch.setattr(os, "access", lambda p, mode, **k: False if str(p).startswith(str(ro)) and mode & os.W_OK
                        else real_access(p, mode, **k))
    try:
        one_error(run("plot", "zeros", "T(2,3)", "-o", str(ro / "x.png")), "permission")
    finally:
        monkeypatch.undo()
        ro.chmod(stat.S_IRWXU)
    one_error(run("plot", "zeros", "T(2,3)", "-o", str(tmp_path)), "directory")


def test_unwritable_output_in_the_library(tmp_path, monkeypatch):
    """A save that fails late (e.g. a full disk) is a PlotError and leaves no file."""
    from knotobs.continuation import plots
    from knotobs.errors import KnotobsError
    import matplotlib.figure

    def full(self, p, *a, **k):
        open(p, "wb").close()
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(matplotlib.figure.Figure, "savefig", full)
    with pytest.raises(KnotobsError, match="No space left"):
        plots.plot_zeros("T(2,3)", tmp_path / "z.png")
    assert not (tmp_path / "z.png").exists()


# ------------------------------------------------------------------ malformed input read as something else

@pytest.mark.parametrize("rep", ["[", "", "[2,1", "(2,1]", "[1;;2]", ";"])
def test_bad_rep_refused_everywhere(rep):
    one_error(run("loop", "T(2,3)", "--rep", rep), "--rep")
    one_error(run("poly", "T(2,3)", "--family", "homfly", "--rep", rep), "--rep")
    one_error(run("match", "T(2,3)", "--poly", "t+t^3-t^4", "--rep", rep), "--rep")


def test_plot_zeros_color_zero(tmp_path):
    one_error(run("plot", "zeros", "T(2,3)", "-o", str(tmp_path / "z.png"), "--color", "0"), "--color 0")
    assert not (tmp_path / "z.png").exists()


# ------------------------------------------------------------------ messages name what was typed

def test_huge_level_message_names_the_level():
    line = one_error(run("loop", "T(2,3)", "--level", "1000000000000"), "--level 1000000000000", "smaller level")
    assert "conductor" not in line


def test_big_knot_message_names_the_knot_and_colour():
    # T(9999,10000) and J_2001 are computed within the default limits since the array kernels;
    # under a tight limit the refusal names what the user typed, not internal partitions
    line = one_error(run("--max-seconds", "0.0001", "loop", "T(9999,10000)"), "T(9999,10000)", "--rep [1]")
    assert "partition [9999]" not in line
    line = one_error(run("--max-seconds", "0.0001", "poly", "T(2,3)", "--family", "colored-jones", "--color", "2001"),
                     "--color 2001")
    assert "partition [4000]" not in line


def test_polynomial_power_runaway_refused_quickly():
    import time

    t = time.time()
    one_error(run("match", "--poly", "(1+t+a+z+q)^200"), "estimated", "terms")
    assert time.time() - t < 2
    # a power that fits is expanded: (1+t)^3 = 1 + 3t + 3t^2 + t^3 (binomial theorem)
    from knotobs.tables.polyparse import read_polynomial

    assert read_polynomial("(1+t)^3") == read_polynomial("1 + 3*t + 3*t^2 + t^3")


def test_deep_nesting_is_a_parse_error_in_the_library():
    from knotobs.errors import ParseError
    from knotobs.tables.polyparse import read_polynomial

    with pytest.raises(ParseError, match="nested 5000 deep"):
        read_polynomial("(" * 5000 + "t" + ")" * 5000)
    assert read_polynomial("(" * 100 + "t" + ")" * 100) == read_polynomial("t")


def test_level_plane_runaway_refused_with_estimate(tmp_path):
    import time

    t = time.time()
    one_error(run("plot", "level-plane", "Sigma(2,3,5)", "-o", str(tmp_path / "p.png"), "--n", "400"),
              "400 x 400", "estimated")
    assert time.time() - t < 2 and not (tmp_path / "p.png").exists()


def test_digits_refused_by_the_library_too():
    from knotobs.errors import KnotobsError
    from knotobs.evaluation.level_loops import level_loop, level_partition_function

    with pytest.raises(KnotobsError, match="from 1 to 2000"):
        level_loop("T(2,3)", 3, digits=-5)
    with pytest.raises(KnotobsError, match="from 1 to 2000"):
        level_partition_function("Sigma(2,3,5)", "SU(2)", 3, digits=10000)


def test_max_memory_takes_effect():
    # (1+t)^150 expands to 151 terms (binomial theorem): fine under the default limit,
    # refused with its memory estimate under a limit of 1 kB
    assert run("match", "--poly", "(1+t)^150").exit_code == 0
    one_error(run("--max-memory", "0.001", "match", "--poly", "(1+t)^150"), "MB of memory", "--max-memory")


def test_plot_zeros_refuses_a_companion_matrix_too_large_before_it():
    # the zeros of J_60(T(2,3)) are the eigenvalues of a companion matrix of degree 5310 (the span
    # 3n(n-1)/2 of the trefoil's colored Jones polynomial, stated from memory and computed here):
    # refused by its estimate instead of running out of memory or for hours; J_5 still plots
    r = runner.invoke(app, ["plot", "zeros", "T(2,3)", "-c", "60", "--json"])
    assert r.exit_code == 2 and "degree 5310" in r.output and "estimated" in r.output, r.output
    ok = runner.invoke(app, ["plot", "zeros", "T(2,3)", "-c", "5", "--json"])
    assert ok.exit_code == 0 and len(__import__("json").loads(ok.output)["zeros"]) == 30


@pytest.mark.parametrize("route", ["localisation", "surgery", "both"])
def test_a_route_asked_for_by_name_is_refused_not_replaced(route):
    # project rule: every option takes effect or is refused.  Over the limit, --route auto may
    # fall back to the exact polynomial at q = exp(2 pi i/K) in S^3 (saying so); a named route may not
    r = runner.invoke(app, ["--max-seconds", "1", "loop", "T(2,3)", "-k", "100000", "--route", route])
    assert r.exit_code == 2 and r.output.startswith("error:") and "estimated" in r.output, r.output
    auto = runner.invoke(app, ["--max-seconds", "1", "loop", "T(2,3)", "-k", "100000"])
    assert auto.exit_code == 0 and "exact polynomial at q = exp(2 pi i/K) only" in auto.output, auto.output


def test_huge_framing_at_a_level_is_reduced_exactly():
    # the value at level k depends on the framing f only through theta^f = exp(2 pi i f C/K)
    # (common practice; CONVENTIONS §2): SU(2), K = 7, C([1]) = 3/4 has period 28 in f, and
    # 10^18 + 7 = 15 mod 28.  Such framings once overflowed (10^30) or lost the phase (10^18)
    def value(f):
        r = runner.invoke(app, ["loop", "T(2,3)", "-k", "5", "-f", str(f), "--json"])
        assert r.exit_code == 0, r.output
        return __import__("json").loads(r.output)["numeric"]

    assert value(10**18 + 7) == value(15) == value(10**30 - 10**30 % 28 + 15)
    assert value(15) != value(7)


def test_grid_refuses_options_it_would_not_apply(tmp_path):
    # every option takes effect or is refused: a group for the colored Jones polynomial (the SU(2)
    # invariant) or HOMFLY-PT (generic N), and --digits without a level, were silently dropped
    store = str(tmp_path / "g.sqlite")
    base = ["grid", "run", "--knots", "T(2,3)", "-s", store, "-w", "0"]
    for extra, opt in ((["--quantity", "colored-jones", "-g", "SU(3)"], "--group"),
                       (["--quantity", "homfly", "-g", "SU(3)"], "--group"),
                       (["-d", "50"], "--digits")):
        r = runner.invoke(app, base + extra)
        assert r.exit_code == 2 and r.output.startswith(f"error: {opt}"), r.output
    assert runner.invoke(app, base + ["-k", "generic,2", "-d", "40"]).exit_code == 0


def test_grid_with_an_oversized_point_is_refused_before_any_point(tmp_path):
    # T(2,3) coloured by the 10^5-dimensional irrep is far beyond the limits: the grid once
    # computed the small points first and failed on this one mid-run; now nothing is computed
    store = tmp_path / "g.sqlite"
    r = runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "-c", "2,3,100000", "-s", str(store), "-w", "0"])
    assert r.exit_code == 2 and r.output.startswith("error: grid point T(2,3) coloured by [99999]"), r.output
    assert not store.exists()
