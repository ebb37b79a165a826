"""Coloured Hopf link against the closed formula.

For SU(2) with colours given by dimensions j, k, the zero-framed, unnormalised invariant of the
positive Hopf link is the quantum integer [jk] (R. Kirby & P. Melvin, Invent. Math. 105 (1991)
473-545, the Hopf-link evaluation used throughout their paper; equivalently S_jk/S_11 of the
SU(2)_k modular S-matrix, Verlinde, Nucl. Phys. B 300 (1988)).  Its mirror is q -> 1/q, which
leaves [jk] unchanged.  The HOMFLY-PT of the Hopf link is checked through the skein relation in
knotobs' convention, a P(L+) - a^-1 P(L-) = z P(L0), with L+ = Hopf, L- = the two-component
unlink (P = (a - a^-1)/z) and L0 = the unknot (common practice).
"""

import pytest

from knotobs import SU, TorusLink, homfly, rosso_jones, weight_sum
from knotobs.polynomials import Laurent2
from knotobs.representations import quantum_integer


@pytest.mark.parametrize("j", range(1, 6))
@pytest.mark.parametrize("k", range(1, 6))
def test_coloured_hopf_is_quantum_integer(j, k):
    hopf = TorusLink(2, 2)
    cols = [(j - 1,), (k - 1,)]
    expect = quantum_integer(j * k)
    assert rosso_jones(hopf, SU(2), cols) == expect
    assert weight_sum(hopf, SU(2), cols) == expect
    assert rosso_jones(hopf.mirror(), SU(2), cols) == expect


def test_hopf_homfly_obeys_the_skein_relation():
    a, s = Laurent2.gen_a(), Laurent2.gen_s()
    z = s - s**-1
    hopf = homfly("T(2,2)").value
    assert hopf.zpow == -1                      # stored as z^-1 * (coefficients)
    lhs = a * hopf.with_zpow(0)                 # = z * a P(Hopf)
    rhs = (a - a**-1) * a**-1 + z * z           # = z * (a^-1 P(unlink) + z P(unknot))
    assert lhs == rhs


@pytest.mark.parametrize("knot", ["T(2,3)", "T(2,4)", "T(3,3)", "T(3,4)", "T(2,-5)"])
def test_unnormalised_homfly_is_normalised_times_unknot(knot):
    # P(unknot) = (a - a^-1)/z in the quantum-group normalisation (common practice; CONVENTIONS §3)
    import sympy

    a, z = sympy.symbols("a z")
    un = sympy.sympify(homfly(knot, normalized=False).sympy_string())
    no = sympy.sympify(homfly(knot).sympy_string())
    assert sympy.simplify(un - no * (a - 1 / a) / z) == 0
