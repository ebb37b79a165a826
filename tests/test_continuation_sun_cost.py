"""The cost estimate of the SU(3) residue route counts what the run integrates (docs 18.7, Cost).

Internal checks (no outside reference: they test the guard layer, not a value): the dry run of
``knotobs.continuation.cartan.pole_tally`` must enumerate the same orbit representatives, planes
and recomputations as the evaluation itself, on coprime orders, a coset space, base genus 1 and
the reversed orientation; a value whose closed-form estimate is above the limit in force but
whose counted estimate is below it is computed, and one above both is refused by name.
"""

from __future__ import annotations

from collections import Counter

import pytest
from flint import acb

from knotobs.continuation._num import bits, working_bits
from knotobs.continuation.cartan import continued_sun_partition_function, poles
from knotobs.continuation.cartan.data import CartanData
from knotobs.continuation.cartan.pole_tally import pole_tally
from knotobs.continuation.cartan.value import continuation_sun_cost
from knotobs.errors import SizeLimitError
from knotobs.guard import limits


def _run_counts(d: CartanData, K: complex, digits: int, monkeypatch) -> Counter:
    """Counts of the evaluation itself (parts="quad"): representatives integrated (with the
    recomputations for a longer Taylor vector), distinct representatives, planes."""
    count: Counter = Counter()
    rep_dots, plane = poles._Eval._rep_dots, poles._Eval._plane_corrected

    def counted_rep(self, fint, y0, sig, mu, L):
        D = self._dc.get((fint, y0, sig, mu, "rep"))
        if D is None or len(D) < L:
            count["integrated lines"] += 1
            count["distinct"] += D is None
        return rep_dots(self, fint, y0, sig, mu, L)

    def counted_plane(self, *args):
        count["planes"] += 1
        return plane(self, *args)

    monkeypatch.setattr(poles._Eval, "_rep_dots", counted_rep)
    monkeypatch.setattr(poles._Eval, "_plane_corrected", counted_plane)
    H, Kc, cosets = d.HL, K, d.cosets()
    if H < 0:
        H, Kc, cosets = -H, K.conjugate(), [c.negated() for c in cosets]
    theta = poles._theta(H, Kc)
    with working_bits(bits(digits)):
        for co, _, t in poles.coset_terms(d.big_orders, cosets, d.genus):
            poles._Eval(t, acb(Kc.real, Kc.imag), H, d.L, digits, True, theta, False, -co.const, "quad").run()
    return count


@pytest.mark.parametrize("space", ["Sigma(2,3,5)", "-Sigma(2,3,5)", "M(0; -1; (2,1), (2,1), (3,1))",
                                   "M(1; -1; (2,1), (3,1))"])
def test_the_dry_run_counts_the_integrals_the_run_evaluates(space, monkeypatch):
    d = CartanData.from_space(space, 3)
    K = 8.1 - 0.4j
    tally = pole_tally(d.big_orders, d.HL, d.L, K, 32, d.cosets(), d.genus)
    run = _run_counts(d, K, 32, monkeypatch)
    assert run["planes"] > 0 and run["integrated lines"] > 0
    for key in ("integrated lines", "distinct", "planes"):
        assert tally[key] == run[key], key
    # far fewer than the closed-form count of every line integral
    assert tally["distinct"] < poles.pole_line_count(d.big_orders, d.HL, d.L, d.cosets(), d.genus)[0] / 3


def test_a_value_over_the_closed_form_estimate_but_under_the_counted_one_is_computed():
    d = CartanData.from_space("Sigma(2,3,5)", 3)
    K = 10.3 + 0.2j
    closed = continuation_sun_cost(d, K, 12, "residues")[0]
    counted, _, what = continuation_sun_cost(d, K, 12, "residues", counted=True)
    assert counted < closed / 2 and "counted:" in what
    limit = (counted + closed) / 2
    with limits(seconds=limit):
        z = continued_sun_partition_function("Sigma(2,3,5)", "SU(3)", level="7.3+0.2i", digits=12)
    assert abs(z.numeric) > 0
    with limits(seconds=counted / 2):
        with pytest.raises(SizeLimitError, match=r"counted: \d+ lines integrated"):
            continued_sun_partition_function("Sigma(2,3,5)", "SU(3)", level="7.3+0.2i", digits=12)


def test_at_a_huge_level_the_closed_form_estimate_refuses_without_the_dry_run():
    # the dry run keeps lists as long as a line (nodes about linear in |K|): at K ~ 1e10 it would
    # take minutes before refusing, so it is skipped above TALLY_NODES nodes
    with pytest.raises(SizeLimitError) as e:
        continued_sun_partition_function("Sigma(2,3,5)", "SU(3)", level="1e10", digits=20)
    assert "line integrals" in str(e.value) and "counted:" not in str(e.value)
