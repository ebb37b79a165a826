"""The Kauffman polynomial of torus knots and links.

Sources:

* the open dataset ``database-knotinfo`` (C. Livingston, A. H. Moore, KnotInfo / LinkInfo), column
  ``kauffman_polynomial``, for every torus knot and torus link it contains, in the chirality it
  stores (CONVENTIONS §8: the knots positive, T(2,6), T(2,8), T(2,10), T(3,3) as mirrors); the
  strings are parsed with sympy, independently of knotobs;
* the relation to the Jones polynomial ``V(t) = F(a = -t^(-3/4), z = t^(1/4) + t^(-1/4))``
  (L. Kauffman, Trans. Amer. Math. Soc. 318 (1990) 417–471; CONVENTIONS §8), with ``V`` computed by
  the SU(2) route of knotobs, for torus knots and links well beyond the table;
* the mirror image ``F_{L*}(a, z) = F_L(a^-1, z)`` (Kauffman (1990); common practice);
* Kauffman's skein relations (F and the Dubrovnik form) on the closed 2-braids ``sigma_1^n`` (Kauffman (1990));
* the SO(N) specialisations ``a = q^((N-1)/2)``, ``z = q^(1/2) - q^(-1/2)`` of the generic
  (Dubrovnik) form against the Cartan engine's Rosso–Jones and weight-sum routes for fixed N
  (an independent computation: weights of the fixed group, no universal characters).
"""

from __future__ import annotations

import json
import re
from fractions import Fraction

import pytest

from knotobs import TorusLink, jones
from knotobs.errors import InvalidRepresentationError
from knotobs.evaluation.cartan_rosso_jones import rosso_jones_cartan
from knotobs.evaluation.cartan_weight_sum import weight_sum_cartan
from knotobs.evaluation.dubrovnik import dubrovnik_torus
from knotobs.evaluation.kauffman import kauffman
from knotobs.polynomials.bivariate import Laurent2
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.cartan import quantum_dimension, simple_group
from knotobs.representations.orthogonal_generic import (
    multiply_factor,
    quantum_dimension_factors,
    universal_adams,
    universal_tensor,
)

sympy = pytest.importorskip("sympy")
A_SYM, Z_SYM = sympy.symbols("a z")


def _sympy_of(res):
    return sympy.expand(sum(c * A_SYM**j * Z_SYM**k for (j, k), c in res.value.to_az().items()))


def _dataset_entries():
    dki = pytest.importorskip("database_knotinfo")
    from knotobs.tables.knotinfo import torus_entries

    out = [e for e in torus_entries() if e.kauffman.strip()]
    return out


def test_every_torus_entry_of_the_dataset():
    entries = _dataset_entries()
    names = {e.name for e in entries}
    # CONVENTIONS §8: the torus knots and links of the dataset (<= 13 crossings / <= 11 for links)
    assert {"3_1", "5_1", "7_1", "8_19", "9_1", "10_124", "11a_367", "13a_4878", "L2a1{1}", "L4a1{1}",
            "L6a3{0}", "L8a14{0}", "L10a118{0}", "L6n1{0,1}"} <= names
    for e in entries:
        table = sympy.expand(sympy.sympify(e.kauffman.replace("^", "**"), locals={"a": A_SYM, "z": Z_SYM}))
        computed = _sympy_of(kauffman(e.torus))          # the stored chirality, no convention map at all
        assert sympy.expand(table - computed) == 0, (e.name, str(e.torus))


def test_match_knotinfo_reports_the_identity_map():
    entries = _dataset_entries()
    from knotobs.tables.compare import compare_knotinfo

    for e in entries:
        pos = e.torus.positive
        c = compare_knotinfo(pos, "kauffman")
        assert c.equal, e.name
        m = c.map
        assert m.sign == 1 and m.monomial is None and m.framing == 0
        assert bool(m.mirror) == (c.source.find("T(") >= 0 and "-" in c.source.split("stored as")[1])


def _V_from_F(res) -> Laurent:
    """``F(a = -t^(-3/4), z = t^(1/4) + t^(-1/4))`` as a Laurent polynomial in t."""
    az = res.value.to_az()
    kmin = min(k for _, k in az)
    u = Laurent.gen("t")
    z = Laurent.monomial(Fraction(1, 4), var="t") + Laurent.monomial(Fraction(-1, 4), var="t")
    total = Laurent.zero("t")
    for (j, k), c in az.items():
        total = total + Laurent.monomial(Fraction(-3 * j, 4), (-1) ** (j % 2) * c, var="t") * z ** (k - kmin)
    if kmin < 0:
        total = total.exact_div(z ** (-kmin))
    else:
        total = total * z ** kmin
    return total.canonical()


TORUS = [(2, 3), (2, 5), (3, 4), (3, 5), (2, 9), (3, 7), (4, 5), (3, 8), (4, 7), (5, 6), (2, 2), (2, 4),
         (3, 3), (2, 8), (4, 4), (3, 6), (4, 6), (2, -3), (3, -4), (2, -6), (3, -3)]


@pytest.mark.parametrize("pq", TORUS, ids=lambda pq: f"T{pq}")
def test_jones_relation(pq):
    k = TorusLink(*pq)
    assert _V_from_F(kauffman(k)) == jones(k).value.canonical()


@pytest.mark.parametrize("pq", [(2, 3), (3, 4), (2, 4), (3, 3)], ids=lambda pq: f"T{pq}")
def test_mirror(pq):
    k = TorusLink(*pq)
    F, Fm = kauffman(k).value.to_az(), kauffman(k, mirror=True).value.to_az()
    assert Fm == {(-j, kk): c for (j, kk), c in F.items()}


@pytest.mark.parametrize("N", [3, 4, 5, 6, 7, 8, 9])
@pytest.mark.parametrize("pq", [(2, 3), (2, -5), (3, 4), (2, 2), (2, 4), (3, 3)], ids=lambda pq: f"T{pq}")
def test_so_n_specialisations_two_routes(pq, N):
    k = TorusLink(*pq)
    D = dubrovnik_torus(k)
    G = simple_group(f"SO({N})")
    # SO(3) carries the SU(2) normalisation (metric doubled), so its q is the square root of the generic one
    unit = Fraction(1, 1) if N == 3 else Fraction(1, 2)
    val = D.specialize(Fraction(N - 1, 1) * unit, unit)
    dim = quantum_dimension(G.roots, G.highest_weight("[1]"))
    for route in (rosso_jones_cartan, weight_sum_cartan):
        assert val == route(k, G, "[1]").exact_div(dim), (route.__name__, N)


@pytest.mark.parametrize("N", range(5, 13))
def test_generic_quantum_dimension(N):
    # the telescoped Weyl product of orthogonal_generic against the engine's character at q^rho
    G = simple_group(f"SO({N})")
    for mu in [(1,), (2,), (1, 1), (2, 1), (3,), (1, 1, 1), (3, 1), (2, 2), (4, 2, 1)]:
        if len(mu) >= N / 2:
            continue
        num, den = quantum_dimension_factors(mu)
        d = Laurent2.monomial(0, 0)
        for f in den:
            d = multiply_factor(d, f)
        a = Fraction(N - 1, 2)
        assert num.specialize(a).exact_div(d.specialize(a)) == quantum_dimension(G.roots, G.highest_weight(mu))


@pytest.mark.parametrize("nu,m", [((1,), 2), ((1,), 3), ((1,), 5), ((2,), 2), ((1, 1), 3), ((2, 1), 2)])
def test_universal_decompositions_are_stable(nu, m):
    # Koike-Terada universal characters: no dependence on the rank once it is large
    assert universal_adams(nu, m) == universal_adams(nu, m, 2)
    assert universal_tensor(((1,), nu)) == universal_tensor(((1,), nu), 2)


def test_bad_input():
    with pytest.raises(InvalidRepresentationError, match="vector representation"):
        kauffman("T(2,3)", rep=(2,))


def test_cli_poly_and_match():
    from typer.testing import CliRunner

    from knotobs.cli import app

    r = CliRunner().invoke(app, ["poly", "T(2,3)", "--family", "kauffman", "--json"])
    assert r.exit_code == 0, r.output
    data = json.loads(r.stdout)
    assert data["quantity"] == "kauffman" and "a = q^((N-1)/2)" in data["profile"]["variable_map"]
    assert sympy.expand(sympy.sympify(data["exact"]) - _sympy_of(kauffman("T(2,3)"))) == 0
    r = CliRunner().invoke(app, ["poly", "T(2,3)", "--family", "kauffman", "--N", "3"])
    assert r.exit_code == 2 and "--N" in r.output
    pytest.importorskip("database_knotinfo")
    r = CliRunner().invoke(app, ["match", "T(2,6)", "--knotinfo", "--invariant", "kauffman"])
    assert r.exit_code == 0 and "EQUAL" in r.output and "mirror" in r.output


def test_identify_by_kauffman_polynomial():
    # the dataset's string for 8_19 = T(3,4) (CONVENTIONS §8), typed in: identification finds T(3,4) only
    from knotobs.tables.identify import identify

    text = ("(-a^(-10)-5*a^(-8)-5*a^(-6))*z^(0)+ (5*a^(-9)+ 5*a^(-7))*z^(1)+ (10*a^(-8)+ 10*a^(-6))*z^(2)"
            "+ (-5*a^(-9)-5*a^(-7))*z^(3)+ (-6*a^(-8)-6*a^(-6))*z^(4)+ (a^(-9)+ a^(-7))*z^(5)+ (a^(-8)+ a^(-6))*z^(6)")
    r = identify(text, "kauffman", max_p=4, max_q=6)
    assert [c.knot for c in r.candidates] == ["T(3,4)"]
    assert r.candidates[0].map.mirror is False


@pytest.mark.parametrize("n", range(2, 13))
def test_skein_relation_on_two_strand_torus_links(n):
    """Kauffman's relation Lambda(L+) + Lambda(L-) = z (Lambda(L0) + Lambda(Linf)) (Kauffman (1990)).

    At one crossing of the closed 2-braid sigma_1^n: L+ = T(2,n), L- = T(2,n-2), L0 = T(2,n-1), and
    Linf is an unknot drawn with n - 1 curls, negative once oriented (the smoothing reverses one strand).
    With Lambda = a^writhe F (writhe n for sigma_1^n with parallel strands) and a positive curl = a:
        a^n F_n + a^(n-2) F_(n-2) = z (a^(n-1) F_(n-1) + a^-(n-1)),
    where F_0 is the two-component unlink, (a + a^-1)/z - 1, and F_1 = 1.
    """
    a, z = A_SYM, Z_SYM

    def F(m):
        if m == 0:
            return (a + 1 / a) / z - 1
        return _sympy_of(kauffman(TorusLink(2, m)))

    lhs = a**n * F(n) + a ** (n - 2) * F(n - 2)
    rhs = z * (a ** (n - 1) * F(n - 1) + a ** (-(n - 1)))
    assert sympy.simplify(sympy.expand(lhs - rhs)) == 0


@pytest.mark.parametrize("n", range(2, 13))
def test_dubrovnik_skein_relation_two_strand(n):
    """``Lambda(L+) - Lambda(L-) = z (Lambda(L0) - Lambda(Linf))`` (Kauffman (1990), the Dubrovnik form) for
    the SO(N) form D of knotobs (zero framing on every component).

    On sigma_1^n the blackboard framing of a component is its self-writhe: n for a knot (n odd), 0 for each
    component of a link (n even); a positive kink is a (theta(V) = q^((N-1)/2)), so Lambda_n = a^n D_n for n
    odd and D_n for n even; Linf is an unknot with n - 1 negative curls, D_0 = (a - a^-1)/z + 1.
    """
    from knotobs.evaluation.dubrovnik import dubrovnik_torus

    a, z = A_SYM, Z_SYM

    def Lam(m):
        if m == 0:
            return (a - 1 / a) / z + 1
        D = sympy.expand(sum(c * a**j * z**k for (j, k), c in dubrovnik_torus(TorusLink(2, m)).to_az().items()))
        return a**m * D if m % 2 else D

    assert sympy.simplify(Lam(n) - Lam(n - 2) - z * (Lam(n - 1) - a ** (-(n - 1)))) == 0
