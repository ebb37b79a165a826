"""The top-level Python API: one argument order, strings accepted, only knotobs errors, lazy imports.

Values: the trefoil's unnormalized SU(2) loop ``(t + t^3 - t^4)(t^1/2 + t^-1/2)`` at ``t = 1/q``
(V. F. R. Jones, Ann. of Math. 126 (1987) 335); the equality of the gluing route and the
polynomial route at a level is the two-route check of docs/conventions.md §7 (common practice).
"""

from __future__ import annotations

import subprocess
import sys

import mpmath
import pytest

import knotobs
from knotobs.errors import KnotobsError


def test_every_capability_is_reachable_from_the_top_level():
    for name in ("wilson_loop", "level_loop", "partition_function", "fiber_wilson_loop", "rosso_jones", "weight_sum",
                 "jones", "colored_jones", "homfly", "alexander", "flat_connections", "continued_partition_function",
                 "sl_wilson_loop", "sl2c_partition_function", "asymptotic_value", "kashaev_invariant", "ohtsuki_series",
                 "poincare_series", "brieskorn_false_theta", "brieskorn_radial_limit", "tau_from_q_series",
                 "compare", "compare_knotinfo", "identify", "parse_polynomial", "GridSpec", "run_grid", "resume_grid",
                 "GridStore", "fibration_of", "space_report", "parse_space", "FiniteLevelValue", "PolynomialResult"):
        assert callable(getattr(knotobs, name)), name
        assert name in dir(knotobs) and name in knotobs.__all__
    with pytest.raises(AttributeError):
        knotobs.no_such_thing


def test_import_is_lazy():
    code = "import sys, knotobs; print(sorted(m for m in ('numpy', 'sympy', 'flint', 'mpmath', 'typer') if m in sys.modules))"
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True).stdout
    assert out.strip() == "[]"


def test_strings_accepted_where_objects_are():
    a = knotobs.rosso_jones("T(2,3)", "SU(2)", [[1]])
    b = knotobs.rosso_jones(knotobs.TorusLink(2, 3), knotobs.SU(2), (1,))
    c = knotobs.weight_sum("T(2,3)", "SU(2)", "[1]")
    assert a == b == c
    assert a.to_string("q") == "-q^(-9/2) + q^(-5/2) + q^(-3/2) + q^(-1/2)"
    z1 = knotobs.partition_function("Sigma(2,3,5)", "SU(2)", 3)
    z2 = knotobs.partition_function(knotobs.parse_space("Sigma(2,3,5)"), "SU(2)", 3)
    assert abs(z1.numeric - z2.numeric) < 1e-25
    w = knotobs.fiber_wilson_loop("M(0; 0; (2,1), (3,-1))", "SU(2)", 3, regular=["[1]"])
    assert abs(w.numeric - knotobs.level_loop("T(2,3)", "SU(2)", 3, framing="fiber").numeric) < 1e-25


def test_one_argument_order_and_old_forms():
    new = knotobs.level_loop("T(3,4)", "SU(3)", 4, [2, 1], digits=20)
    old = knotobs.level_loop("T(3,4)", 4, "SU(3)", [2, 1], digits=20)
    assert new.numeric == old.numeric
    via_wl = knotobs.wilson_loop("T(3,4)", "SU(3)", 4, [2, 1], digits=20)
    assert via_wl.numeric == new.numeric
    poly = knotobs.wilson_loop("T(3,4)", "SU(3)", [2, 1])          # older order: the partition third
    assert abs(poly.value.at_root_of_unity(7, dps=20) - new.numeric) < 1e-15
    # exceptional fibers count 1..n in the new form, 0..n-1 in the old one
    f_new = knotobs.fiber_wilson_loop("M(0; 0; (2,1), (3,-1))", "SU(2)", 3, [1], fiber=2, framing="zero")
    f_old = knotobs.fiber_wilson_loop((0, [(2, 1), (3, -1)]), 3, "SU(2)", exceptional={1: (1,)}, framing="zero")
    assert f_new.numeric == f_old.numeric


@pytest.mark.parametrize("call, needle", [
    (lambda: knotobs.partition_function("Sigma(2,3,5)", 3), "ambiguous"),
    (lambda: knotobs.partition_function("Sigma(2,3,5)", "SU(2)"), "level"),
    (lambda: knotobs.rosso_jones("T(2,3)", "SU(2)", None), "None"),
    (lambda: knotobs.rosso_jones(3.5, "SU(2)", [1]), "3.5"),
    (lambda: knotobs.rosso_jones("T(2,3)", 2, [1]), "SU(2)"),
    (lambda: knotobs.wilson_loop("T(2,3)", "SU(2)", raw=True), "raw"),
    (lambda: knotobs.wilson_loop("T(2,3)", "SU(2)", 3, normalized=True), "normalized"),
    (lambda: knotobs.level_loop("T(2,3)", "SU(2)", 3, normalized=False), "raw=True"),
    (lambda: knotobs.level_loop("T(2,3)", "SU(2)", 2.5), "integer"),
    (lambda: knotobs.level_loop(None, "SU(2)", 3, space="Sigma(2,3,5)", fiber=0), "1..n"),
    (lambda: knotobs.flat_connections("Sigma(2,3,5)", "U(2)"), "SU(N)"),
    (lambda: knotobs.continued_partition_function("Sigma(2,3,5)", "SU(4)", 3.5), "SU(2)"),
    (lambda: knotobs.wilson_loop("T(2,3)", "SU(2)", nonsense=1), "nonsense"),
])
def test_only_knotobs_errors(call, needle):
    with pytest.raises(KnotobsError) as info:
        call()
    assert needle in str(info.value)


def test_version_and_python_m():
    out = subprocess.run([sys.executable, "-m", "knotobs", "--version"], capture_output=True, text=True, check=True)
    assert out.stdout == f"knotobs {knotobs.__version__}\n"
    out = subprocess.run([sys.executable, "-m", "knotobs", "poly", "T(2,3)", "--json"], capture_output=True, text=True)
    assert out.returncode == 0 and '"exact": "t + t**3 - t**4"' in out.stdout
