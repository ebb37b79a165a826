"""Continuation numerics share no precision between threads, and every printed digit is certified.

Outside facts used: ``exp(2 pi i n) = 1`` for every integer ``n`` (common practice), so at the
coupling ``t = 10^-m`` exactly, ``q^(1/2) = exp(2 pi i/t) = 1`` and the SU(2) Wilson loop of any
knot is the classical dimension 2 of the fundamental; and at ``t = 3 * 10^-20``,
``q^(1/2) = exp(2 pi i 10^20/3) = exp(2 pi i/3)`` (``10^20 = 1 mod 3``), the value at ``t = 3``.
The Lawrence-Rozansky continuation at integer K equals the finite-level value (Lawrence and
Rozansky, Commun. Math. Phys. 205 (1999) 287-314), here from the surgery route.
"""

import threading

import mpmath
import pytest
from typer.testing import CliRunner

from knotobs.cli import app
from knotobs.continuation.complex import sl_wilson_loop
from knotobs.continuation.level import continued_partition_function, sector_values
from knotobs.numerics import working_precision

runner = CliRunner()

CASES = [("Sigma(2,3,5)", "7.5+0.3i", 20), ("Sigma(2,3,7)", "6.25-0.1i", 25), ("L(5,2)", "4.5+0.7i", 30),
         ("Sigma(2,3,5)", "11.5", 40)]


def _one(case):
    space, K, d = case
    return continued_partition_function(space, K=K, digits=d).numeric


def test_eight_threads_agree_with_sequential_results():
    sequential = [_one(c) for c in CASES]
    jobs = CASES * 4                                   # 16 computations over 8 threads
    results = [None] * len(jobs)
    errors = []

    def work(i0):
        try:
            for i in range(i0, len(jobs), 8):
                results[i] = _one(jobs[i])
                # and an unrelated precision change in between, as another caller would do
                sl_wilson_loop("T(2,3)", "[1];[]", "10+2i,10-2i", N=2, digits=50 + i)
        except Exception as exc:  # pragma: no cover - reported below
            errors.append(exc)

    threads = [threading.Thread(target=work, args=(i,)) for i in range(8)]
    for t in threads:
        t.start()
    for t in threads:
        t.join()
    assert not errors, errors
    for i, r in enumerate(results):
        assert r == sequential[i % len(CASES)], (jobs[i], r, sequential[i % len(CASES)])
    assert mpmath.mp.dps == 15


@pytest.mark.parametrize("digits", [15, 30, 60])
def test_tiny_couplings_are_read_exactly(digits):
    # t = 10^-20 and 10^-300 exactly: q^(1/2) = 1, so W = 2 (and never a value from a rounded t)
    for t in ("1e-20", "1e-300"):
        w = sl_wilson_loop("T(2,3)", "[1];[]", f"{t},{t}", N=2, digits=digits)
        assert abs(w.numeric - 2) < mpmath.mpf(10) ** (-digits)
    a = sl_wilson_loop("T(2,3)", "[1];[]", "3e-20,3e-20", N=2, digits=digits).numeric
    b = sl_wilson_loop("T(2,3)", "[1];[]", "3,3", N=2, digits=digits).numeric
    assert abs(a - b) < mpmath.mpf(10) ** (-digits)


def test_digits_printed_agree_between_precisions():
    """Each printed digit at 15 digits is a digit of the 60-digit value (up to rounding of the last)."""
    def value(d):
        out = runner.invoke(app, ["continue", "T(2,3)", "--couplings", "3e-20+1e-21i,3e-20", "--digits", str(d)])
        assert out.exit_code == 0, out.output
        return [ln for ln in out.stdout.splitlines() if "value =" in ln][0].split("=", 1)[1].strip()

    lo, hi = mpmath.mpmathify(value(15).replace("j", "j").strip("()").replace(" ", "")), None
    hi = mpmath.mpmathify(value(60).strip("()").replace(" ", ""))
    assert abs(lo - hi) <= mpmath.mpf(10) ** -14 * max(1, abs(hi))


def test_zero_is_printed_as_zero():
    out = runner.invoke(app, ["continue", "Sigma(2,3,5)", "--K", "1", "--digits", "15"])
    assert out.exit_code == 0
    line = [ln for ln in out.stdout.splitlines() if "value =" in ln][0]
    assert line.split("=", 1)[1].strip() == "0.0", line
    out = runner.invoke(app, ["continue", "Sigma(2,3,5)", "--K", "1", "--digits", "30", "--json"])
    import json

    js = json.loads(out.stdout)
    assert js["numeric"]["re"] == "0.0" and js["numeric"]["im"] == "0.0"


def test_integer_K_matches_finite_level_at_every_precision():
    from knotobs.evaluation.surgery import partition_function
    from knotobs.fibrations.seifert import parse_space

    exact = partition_function(parse_space("Sigma(2,3,7)"), level=5, digits=60).numeric
    for d in (15, 30, 50):
        z = continued_partition_function("Sigma(2,3,7)", K=7, digits=d).numeric
        assert abs(z - exact) < mpmath.mpf(10) ** (-d)


def test_level_is_parsed_at_the_working_precision():
    # K = 7.5 + 0.3i exactly: the 40-digit value must not be that of the double nearest to 0.3
    z = continued_partition_function("Sigma(2,3,5)", K="7.5+0.3i", digits=40).numeric
    Kd = mpmath.mpc(7.5, 0.3)              # the binary double 0.29999999999999998889...
    w = continued_partition_function("Sigma(2,3,5)", K=Kd, digits=40).numeric
    with working_precision(60):
        assert abs(z - w) > mpmath.mpf(10) ** -30     # the two levels differ by 1e-17: values differ
        s = sum(sector_values("Sigma(2,3,5)", "7.5+0.3i", digits=40).values())
        assert abs(s - z) < mpmath.mpf(10) ** -38


def test_runaway_continuations_are_refused_fast():
    import time

    ten = "M(0; -1; (2,1), (3,1), (5,1), (7,1), (11,1), (13,1), (17,1), (19,1), (23,1), (29,1))"
    for args in (["continue", ten, "--K", "7.5"], ["continue", "Sigma(2,3,5)", "--K", "7.5+0.3i", "--digits", "2000"],
                 ["continue", "T(2,3)", "--couplings", "1e-100000,1", "--digits", "10"],
                 ["continue", "Sigma(2,3,5)", "--K", "1000000000000000.5"]):
        t = time.time()
        out = runner.invoke(app, args)
        assert out.exit_code == 2, out.output
        assert out.stderr.startswith("error: ") and len(out.stderr.strip().splitlines()) == 1
        assert "estimated" in out.stderr or "nodes" in out.stderr
        assert time.time() - t < 2
    out = runner.invoke(app, ["continue", "Sigma(2,3,5)", "--K", "1000000000000000.5"])
    assert "too small" not in out.stderr and "large" in out.stderr


def test_progress_reports_every_step_and_does_not_change_the_value():
    seen = []
    z = continued_partition_function("Sigma(2,3,7)", K="7.5+0.3i", digits=20,
                                     progress=lambda done, total: seen.append((done, total))).numeric
    assert seen and seen[-1][0] == seen[-1][1] and [d for d, _ in seen] == list(range(1, len(seen) + 1))
    assert z == continued_partition_function("Sigma(2,3,7)", K="7.5+0.3i", digits=20).numeric


def test_terminal_progress_line():
    import io

    from knotobs.output.progress import TerminalProgress

    buf = io.StringIO()
    p = TerminalProgress("continue Sigma(2,3,5)", stream=buf)
    p(1, 4)                       # within the first second: nothing shown
    assert buf.getvalue() == ""
    p.t0 -= 2
    p(4, 4)
    p.close()
    assert buf.getvalue().startswith("\rcontinue Sigma(2,3,5): 4/4") and buf.getvalue().endswith("\n")
