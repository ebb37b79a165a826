"""Size-guard estimates for requests that the guard used to let through although they ran > 60 s.

Each test checks the guard itself, before any expensive work: the oversized request is
refused with :class:`~knotobs.errors.SizeLimitError` (exit status 2 and one ``error:`` line on
the command line) naming the size, and a nearby smaller request is still accepted.  These
are internal checks of the estimates (CONVENTIONS §16), compared with the default limits
(60 s, 2048 MB) and not with measured times; the measurements behind the constants are in
the docstrings of the estimate functions.

* Printing a coloured Jones polynomial of ~10^7 terms (:func:`~knotobs.evaluation.estimates.guard_fixed`,
  :func:`~knotobs.evaluation.estimates.guard_format`).
* The hook pairings of ``nabla e_n`` for ``T(n, n+1)`` (:func:`~knotobs.refined.nabla.hook_pairings_cost`).
* The plethysm of every irreducible piece of a many-component torus link
  (:func:`~knotobs.evaluation.estimates.homfly_estimate`).
* The q-series of every label (:func:`~knotobs.qseries.series.guard_all_labels`).
"""

from __future__ import annotations

import subprocess
import sys

import pytest

from knotobs import colored_jones
from knotobs.errors import SizeLimitError
from knotobs.evaluation.estimates import (guard_fixed, guard_format, guard_homfly, homfly_estimate,
                                          printed_terms)
from knotobs.fibrations.torus import TorusLink
from knotobs.guard import limits
from knotobs.refined.nabla import hook_pairings, hook_pairings_cost
from knotobs.representations.groups import SU

DEFAULTS = {"seconds": 60, "memory_mb": 2048}
FIVE_FIBERS = "M(0; 2; (2,1), (3,1), (5,1), (7,1), (11,1))"


def _cli(*args: str) -> subprocess.CompletedProcess:
    return subprocess.run([sys.executable, "-c", "from knotobs.cli import app; app()", *args],
                          capture_output=True, text=True, timeout=60)


def _one_error_line(out: subprocess.CompletedProcess) -> str:
    assert out.returncode == 2, out.stderr
    lines = [ln for ln in out.stderr.splitlines() if ln.strip()]
    assert len(lines) == 1 and lines[0].startswith("error:")
    return lines[0]


# ------------------------------------------------------------------ 1. printing the output
def test_fixed_n_estimate_counts_printing_the_output():
    """J_3000 of T(3,4) computes in ~2 s but prints 1.35e7 terms: the estimate up front refuses
    it; J_2000 (6e6 terms) is still accepted.  Internal check of the guard."""
    with limits(**DEFAULTS):
        guard_fixed(TorusLink(3, 4), SU(2), ((1999,),))
        with pytest.raises(SizeLimitError) as info:
            guard_fixed(TorusLink(3, 4), SU(2), ((2999,),))
    msg = str(info.value)
    assert "T(3,4)" in msg and "[2999]" in msg and "printing included" in msg and "estimated" in msg


def test_format_guard_uses_the_number_of_terms():
    """The guard before the text is built: 1.35e7 terms refused, 10^6 accepted (internal check)."""
    with limits(**DEFAULTS):
        guard_format("J_1000 of T(3,4)", 10**6)
        with pytest.raises(SizeLimitError, match=r"1\.35e\+07 terms"):
            guard_format("J_3000 of T(3,4)", 13_500_000)


def test_printed_terms_bounds_the_exact_count():
    """The sampled count of a 5.4e5-coefficient polynomial lies within a few per cent above the
    exact count of nonzero coefficients (internal check of the estimator against a full count)."""
    value = colored_jones("T(3,4)", 300).value
    exact = value.num_terms()
    assert exact > 50_000
    est = printed_terms(value)
    assert exact <= est <= 1.06 * exact


@pytest.mark.parametrize("args", [("loop", "T(3,4)", "-c", "3000"),
                                  ("loop", "T(3,4)", "-c", "3500", "--json"),
                                  ("poly", "T(3,4)", "--family", "colored-jones", "-c", "3500", "--json")])
def test_cli_refuses_huge_coloured_jones_at_once(args):
    line = _one_error_line(_cli(*args))
    assert "T(3,4)" in line and "estimated" in line and "output coefficients" in line


# ------------------------------------------------------------------ 2. superpolynomial
def test_superpolynomial_10_11_refused_9_10_accepted():
    """hook pairings of nabla e_10 (T(10,11), ~130 s) are refused before any work; those of
    nabla e_9 (T(9,10), ~30 s) fit the default limit.  Internal check of the estimate."""
    assert hook_pairings_cost(10, 1) > DEFAULTS["seconds"] > hook_pairings_cost(9, 1)
    with limits(**DEFAULTS):
        with pytest.raises(SizeLimitError, match=r"e_10"):
            hook_pairings(10, 1)


def test_superpolynomial_cost_grows_with_k():
    """The part growing with k: T(8,17) (k = 2) costs more than T(8,9), T(9,19) is refused."""
    assert hook_pairings_cost(8, 2) > hook_pairings_cost(8, 1)
    assert hook_pairings_cost(9, 2) > DEFAULTS["seconds"]


# ------------------------------------------------------------------ 3. plethysm of a link
def test_link_plethysm_counts_every_irreducible_piece():
    """T(30,45) is 15 parallel copies of T(2,3): the plethysm runs once for each of the 176
    irreducible pieces of the 15-fold tensor product, so it is refused; T(24,36) (12 copies,
    77 pieces) is accepted.  Internal check of the estimate."""
    with limits(**DEFAULTS):
        guard_homfly(TorusLink(24, 36), ((1,),) * 12)
        with pytest.raises(SizeLimitError) as info:
            guard_homfly(TorusLink(30, 45), ((1,),) * 15)
    msg = str(info.value)
    assert "T(30,45)" in msg and "176 irreducible pieces" in msg
    assert homfly_estimate(2, 3, ((1,),) * 15)["pieces"] == 176


def test_cli_refuses_alexander_of_30_45():
    line = _one_error_line(_cli("poly", "T(30,45)", "--family", "alexander"))
    assert "T(30,45)" in line and "estimated" in line


# ------------------------------------------------------------------ 4. q-series of every label
def test_all_labels_counts_one_series_per_label():
    """3774 labels of a five-fiber Seifert manifold, one series each, are refused before the
    labels are listed; every label of L(5,2) is accepted.  Internal check of the estimate."""
    from knotobs.qseries.series import PlumbingLattice, guard_all_labels, plumbing_of, zhat_all

    g, text = plumbing_of(FIVE_FIBERS)
    lat = PlumbingLattice(g)
    with limits(**DEFAULTS):
        with pytest.raises(SizeLimitError, match=r"3774 labels"):
            guard_all_labels(lat, 10, text)
        assert lat.labels._labels is None            # refused before listing them
        assert len(zhat_all("L(5,2)", 10)) == 3


def test_cli_refuses_all_labels_of_five_fibers():
    line = _one_error_line(_cli("qseries", FIVE_FIBERS, "--order", "10", "--label", "all"))
    assert "3774 labels" in line and "--label" in line


def test_two_variable_text_is_guarded_too():
    """The HOMFLY-PT text (two variables) is checked before it is built, as the one-variable text
    is (internal check of the guard, against the limit; the value itself is not printed)."""
    from knotobs import homfly

    r = homfly("T(9,10)", (3,))
    with limits(seconds=1e-4), pytest.raises(SizeLimitError, match="printing the homfly of T"):
        r.exact_string()
    assert homfly("T(2,3)").exact_string() == "2*a^-2 + a^-2*z^2 - a^-4"
