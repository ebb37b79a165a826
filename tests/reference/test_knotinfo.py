"""Torus knots and links against the open dataset ``database-knotinfo``.

Source of every reference value in this file: the KnotInfo and LinkInfo tables
(C. Livingston, A. H. Moore, *KnotInfo: Table of Knot Invariants* and *LinkInfo:
Table of Link Invariants*), as shipped in the PyPI package ``database-knotinfo``
(an optional test dependency; the whole module is skipped without it).

The dataset's strings are parsed here with sympy, independently of knotobs.
Convention map (CONVENTIONS §8, re-checked by the tests below rather than assumed):

* Jones: knot table in ``t``; link table in ``x = t^(1/2)``;
  ``t^-1 V(L+) - t V(L-) = (t^(1/2) - t^(-1/2)) V(L0)``.
* HOMFLY-PT: ``(v, z)`` with ``v^-1 P(L+) - v P(L-) = z P(L0)``, i.e. ``v = a^-1`` for
  knotobs' ``a P(L+) - a^-1 P(L-) = z P(L0)``.  Mirror: ``P(v, z) -> P(-1/v, z)``.
* Quantum group vs Jones for a link of ``c`` components: a sign ``(-1)^(c-1)`` and the
  linking phase ``theta(fund)^(-2 lk)``.
* Alexander: compared through the Conway polynomial, ``Delta(t) = nabla(t^(1/2) - t^(-1/2))``;
  the stored Alexander strings agree up to a unit ``+-t^k``.
* Chirality is read off the data, not assumed: for knots from the sign of the
  generators in the stored braid word, for links from the sign of the stored
  linking matrix (the torus link ``T(p, q)`` with parallel orientation has all
  pairwise linking numbers equal to ``+(p/d)(q/d)``, its mirror ``-(p/d)(q/d)``).
"""

from __future__ import annotations

import re
from fractions import Fraction
from functools import lru_cache

import pytest

sympy = pytest.importorskip("sympy")
dki = pytest.importorskip("database_knotinfo")

from knotobs import TorusLink, alexander, homfly, jones, wilson_loop  # noqa: E402

T_SYM, X_SYM, V_SYM, Z_SYM = sympy.symbols("t x v z")


# --------------------------------------------------------------------------- parsing
def _terms(text: str, symbols) -> dict[tuple, int]:
    """Parse a dataset polynomial string into ``{exponent tuple: integer coefficient}``."""
    expr = sympy.expand(sympy.sympify(text.replace("^", "**"), locals={s.name: s for s in symbols}))
    out: dict[tuple, int] = {}
    for term in sympy.Add.make_args(expr):
        coeff, rest = term.as_coeff_Mul()
        powers = rest.as_powers_dict() if rest != 1 else {}
        extra = set(powers) - set(symbols)
        assert not extra, f"unexpected factor {extra} in {text!r}"
        assert coeff == int(coeff), f"non-integer coefficient in {text!r}"
        key = tuple(Fraction(str(powers.get(s, 0))) for s in symbols)
        out[key] = out.get(key, 0) + int(coeff)
    return {k: c for k, c in out.items() if c}


def _jones_table(text: str, var) -> dict[Fraction, int]:
    """Jones string -> ``{exponent of t: coeff}`` (link table uses ``x = t^(1/2)``)."""
    scale = Fraction(1) if var == T_SYM else Fraction(1, 2)
    return {e[0] * scale: c for e, c in _terms(text, (var,)).items()}


def _homfly_table_in_a(text: str) -> dict[tuple[int, int], int]:
    """HOMFLY string in ``(v, z)`` -> knotobs ``{(i, j): c}`` for ``c a^i z^j`` with ``v = a^-1``."""
    return {(int(-e[0]), int(e[1])): c for e, c in _terms(text, (V_SYM, Z_SYM)).items()}


def _conway_table(text: str) -> dict[int, int]:
    return {int(e[0]): c for e, c in _terms(text, (Z_SYM,)).items()}


# --------------------------------------------------------------------------- tiny exact Laurent arithmetic
def _mul(a: dict, b: dict) -> dict:
    out: dict = {}
    for ea, ca in a.items():
        for eb, cb in b.items():
            out[ea + eb] = out.get(ea + eb, 0) + ca * cb
    return {e: c for e, c in out.items() if c}


def _add(a: dict, b: dict, sign: int = 1) -> dict:
    out = dict(a)
    for e, c in b.items():
        out[e] = out.get(e, 0) + sign * c
    return {e: c for e, c in out.items() if c}


def _pow(a: dict, n: int) -> dict:
    out = {Fraction(0): 1}
    for _ in range(n):
        out = _mul(out, a)
    return out


def _z_in_half_t() -> dict:
    """``z = t^(1/2) - t^(-1/2)`` as ``{exponent of t: coeff}``."""
    return {Fraction(1, 2): 1, Fraction(-1, 2): -1}


def _conway_to_alexander(conway: dict[int, int]) -> dict[Fraction, int]:
    out: dict = {}
    for j, c in conway.items():
        assert j >= 0
        out = _add(out, {e: c * v for e, v in _pow(_z_in_half_t(), j).items()})
    return out


# --------------------------------------------------------------------------- the tables
@lru_cache(maxsize=None)
def _knots() -> tuple[dict, ...]:
    return tuple(dki.link_list()[1:])


@lru_cache(maxsize=None)
def _links() -> tuple[dict, ...]:
    return tuple(dki.link_list(proper_links=True)[1:])


# The list (CONVENTIONS §8, KnotInfo names); the tests below also discover the
# torus knots from the table's own "geometric_type" column and check the two agree.
EXPECTED_KNOTS = {
    "3_1": (2, 3), "5_1": (2, 5), "7_1": (2, 7), "8_19": (3, 4), "9_1": (2, 9),
    "10_124": (3, 5), "11a_367": (2, 11), "13a_4878": (2, 13),
}
# LinkInfo names of the torus links with at most 11 crossings: T(2,2), T(2,4), T(2,6),
# T(2,8), T(2,10), T(3,3), in the orientation class that is the braid (parallel) one.
EXPECTED_LINKS = {
    "L2a1{1}": (2, 2), "L4a1{1}": (2, 4), "L6a3{0}": (2, 6), "L8a14{0}": (2, 8),
    "L10a118{0}": (2, 10), "L6n1{0,1}": (3, 3),
}

_GEOM = re.compile(r"torus knot T\((\d+),\s*(\d+)\)")


def _knot_chirality(row: dict) -> int:
    """Sign of the stored braid word (all generators of one sign for these positive braids)."""
    word = [int(x) for x in re.findall(r"-?\d+", row["braid_notation"])]
    signs = {1 if w > 0 else -1 for w in word}
    assert len(signs) == 1, f"{row['name']}: braid word {word} is not homogeneous"
    return signs.pop()


def _parse_link_braid(text: str) -> tuple[int, list[int]]:
    nums = [int(x) for x in re.findall(r"-?\d+", text)]
    return nums[0], nums[1:]


def _torus_braid_params(strands: int, word: list[int]) -> tuple[int, int] | None:
    """``(p, q)`` if ``word`` is literally ``(sigma_1 ... sigma_{p-1})^(+-q)`` on ``p = strands``."""
    if not word or strands < 2:
        return None
    cycle = list(range(1, strands))
    length = len(word)
    if length % (strands - 1):
        return None
    reps = length // (strands - 1)
    if word == cycle * reps:
        return strands, reps
    if word == [-i for i in cycle] * reps:
        return strands, -reps
    return None


def _linking_matrix(text: str) -> list[list[int]]:
    rows = re.findall(r"\{([^{}]*)\}", text)
    return [[int(x) for x in r.split(",")] for r in rows]


def _link_entry(name: str) -> dict:
    for row in _links():
        if row["name"] == name:
            return row
    raise AssertionError(f"{name} not found in the link table")


def _knot_entry(name: str) -> dict:
    for row in _knots():
        if row["name"] == name:
            return row
    raise AssertionError(f"{name} not found in the knot table")


def _link_as_torus(row: dict) -> TorusLink:
    """The torus link a table entry is, with chirality read from its linking matrix."""
    p, q = EXPECTED_LINKS[row["name"]]
    lk = _linking_matrix(row["linking_matrix"])
    off = {lk[i][j] for i in range(len(lk)) for j in range(len(lk)) if i != j}
    d = int(row["components"])
    assert len(off) == 1, f"{row['name']}: pairwise linking numbers {off} not all equal"
    value = off.pop()
    assert abs(value) == (p // d) * (q // d), f"{row['name']}: |lk| = {abs(value)}"
    return TorusLink(p, q if value > 0 else -q)


# =========================================================================== discovery
def test_torus_knots_in_table_are_the_expected_ones():
    """KnotInfo marks torus knots in its 'geometric_type' column; the set is the issue's list."""
    found = {}
    for row in _knots():
        m = _GEOM.fullmatch(row["geometric_type"].strip())
        if m:
            found[row["name"]] = (int(m.group(1)), int(m.group(2)))
    assert found == EXPECTED_KNOTS


def test_torus_links_in_table_found_by_braid_words():
    """Scan every LinkInfo entry for a braid word that is literally a torus braid.

    Each orientation class whose stored braid is ``(sigma_1...sigma_{p-1})^(+-q)`` is the
    closure, hence ``T(p, +-q)``; the underlying links found must be exactly the six
    torus links with <= 11 crossings, and the linking matrices must agree with knotobs.
    """
    found = {}
    for row in _links():
        strands, word = _parse_link_braid(row["braid_notation"])
        pq = _torus_braid_params(strands, word)
        if pq is not None and TorusLink(*pq).components > 1:
            found[row["name"]] = TorusLink(*pq)
    assert {n.split("{")[0] for n in found} == {n.split("{")[0] for n in EXPECTED_LINKS}
    for name, k in found.items():
        row = _link_entry(name)
        assert int(row["components"]) == k.components
        lk = _linking_matrix(row["linking_matrix"])
        assert all(lk[i][j] == k.linking_number for i in range(k.components)
                   for j in range(k.components) if i != j), (name, lk, k.linking_number)
        if name in EXPECTED_LINKS:
            assert k == _link_as_torus(row)


def test_stored_chirality_matches_conventions_sheet():
    """CONVENTIONS §8: T(2,2), T(2,4) stored positive; T(2,6), T(2,8), T(2,10), T(3,3) mirrored."""
    stored = {name: _link_as_torus(_link_entry(name)).chirality for name in EXPECTED_LINKS}
    assert stored == {"L2a1{1}": 1, "L4a1{1}": 1, "L6a3{0}": -1, "L8a14{0}": -1,
                      "L10a118{0}": -1, "L6n1{0,1}": -1}
    assert all(_knot_chirality(_knot_entry(n)) == 1 for n in EXPECTED_KNOTS)


# =========================================================================== knots
@pytest.mark.parametrize("name", sorted(EXPECTED_KNOTS))
def test_knot_jones(name):
    row = _knot_entry(name)
    p, q = EXPECTED_KNOTS[name]
    knot = TorusLink(p, _knot_chirality(row) * q)
    assert jones(knot).value.terms() == _jones_table(row["jones_polynomial"], T_SYM)


@pytest.mark.parametrize("name", sorted(EXPECTED_KNOTS))
def test_knot_jones_from_raw_su2_wilson_loop(name):
    """Convention map applied by hand: V(t) = W_fund / [2] at q = t^-1 (knots: no sign, lk = 0)."""
    row = _knot_entry(name)
    p, q = EXPECTED_KNOTS[name]
    knot = TorusLink(p, _knot_chirality(row) * q)
    w = wilson_loop(knot, "SU(2)", [1], normalized=True).value
    v = {-e: c for e, c in w.terms().items()}  # t = q^-1
    assert v == _jones_table(row["jones_polynomial"], T_SYM)


@pytest.mark.parametrize("name", sorted(EXPECTED_KNOTS))
def test_knot_homfly(name):
    row = _knot_entry(name)
    p, q = EXPECTED_KNOTS[name]
    knot = TorusLink(p, _knot_chirality(row) * q)
    assert homfly(knot).value.to_az() == _homfly_table_in_a(row["homfly_polynomial"])


@pytest.mark.parametrize("name", ["3_1", "8_19", "10_124"])
def test_knot_homfly_mirror_rule(name):
    """Mirror image: P(v, z) -> P(-1/v, z) (CONVENTIONS §8), i.e. a -> -1/a in knotobs' variables."""
    row = _knot_entry(name)
    p, q = EXPECTED_KNOTS[name]
    table = _homfly_table_in_a(row["homfly_polynomial"])
    mirrored = {(-i, j): c * (-1) ** i for (i, j), c in table.items()}
    assert homfly(TorusLink(p, -q)).value.to_az() == mirrored
    assert homfly(TorusLink(p, q), mirror=True).value.to_az() == mirrored


@pytest.mark.parametrize("name", sorted(EXPECTED_KNOTS))
def test_knot_alexander_via_conway(name):
    row = _knot_entry(name)
    p, q = EXPECTED_KNOTS[name]
    delta = alexander(TorusLink(p, q)).value.terms()
    assert delta == _conway_to_alexander(_conway_table(row["conway_polynomial"]))
    # the stored Alexander string agrees up to a unit +-t^k (KnotInfo normalises differently)
    stored = _jones_table(row["alexander_polynomial"], T_SYM)
    shift = min(stored) - min(delta)
    sign = stored[min(stored)] // delta[min(delta)]
    assert sign in (1, -1)
    assert {e + shift: sign * c for e, c in delta.items()} == stored


@pytest.mark.parametrize("name", sorted(EXPECTED_KNOTS))
def test_knot_determinant(name):
    """|V(-1)| is the determinant stored in the table (exact: t^(1/2) = i)."""
    row = _knot_entry(name)
    p, q = EXPECTED_KNOTS[name]
    assert abs(_at_minus_one(jones(TorusLink(p, q)).value.terms())) == int(row["determinant"])


def _at_minus_one(terms: dict[Fraction, int]) -> complex:
    """Exact value at t = -1 with t^(1/2) = i (Gaussian integer, returned as a complex of ints)."""
    re_, im_ = 0, 0
    for e, c in terms.items():
        k = e * 2
        assert k.denominator == 1
        r = int(k) % 4  # i^r
        if r == 0:
            re_ += c
        elif r == 1:
            im_ += c
        elif r == 2:
            re_ -= c
        else:
            im_ -= c
    return complex(re_, im_)


# =========================================================================== links
@pytest.mark.parametrize("name", sorted(EXPECTED_LINKS))
def test_link_jones(name):
    row = _link_entry(name)
    knot = _link_as_torus(row)
    assert jones(knot).value.terms() == _jones_table(row["jones_polynomial"], X_SYM)


@pytest.mark.parametrize("name", sorted(EXPECTED_LINKS))
def test_link_jones_from_raw_su2_wilson_loop(name):
    """V(t) = (-1)^(c-1) theta(fund)^(-2 lk) W_fund/[2] at q = t^-1 (CONVENTIONS §8).

    ``theta(fund) = q^(3/4)`` for SU(2) (CONVENTIONS §2); ``lk`` is the total linking number.
    """
    row = _link_entry(name)
    knot = _link_as_torus(row)
    c = knot.components
    lk_total = knot.linking_number * c * (c - 1) // 2
    w = wilson_loop(knot, "SU(2)", [1], normalized=True).value.terms()
    phase = Fraction(-3, 2) * lk_total
    v = {-(e + phase): (-1) ** (c - 1) * coeff for e, coeff in w.items()}
    assert v == _jones_table(row["jones_polynomial"], X_SYM)


@pytest.mark.parametrize("name", sorted(EXPECTED_LINKS))
def test_link_homfly(name):
    row = _link_entry(name)
    knot = _link_as_torus(row)
    assert homfly(knot).value.to_az() == _homfly_table_in_a(row["homflypt_polynomial"])


@pytest.mark.parametrize("name", sorted(EXPECTED_LINKS))
def test_link_homfly_mirror_rule(name):
    """The other chirality of the same link: P(v, z) -> P(-1/v, z)."""
    row = _link_entry(name)
    knot = _link_as_torus(row)
    table = _homfly_table_in_a(row["homflypt_polynomial"])
    mirrored = {(-i, j): c * (-1) ** i for (i, j), c in table.items()}
    assert homfly(knot.mirror()).value.to_az() == mirrored


@pytest.mark.parametrize("name", sorted(EXPECTED_LINKS))
@pytest.mark.parametrize("N", [2, 3, 4])
def test_link_homfly_specialises_to_su_n(name, N):
    """The table's HOMFLY-PT at v = q^(-N/2), z = q^(1/2) - q^(-1/2) is the zero-framed SU(N)
    Wilson loop with the linking phase removed: P = W/dim_q * q^(-lk (N - 1/N)) (CONVENTIONS §2–§3:
    theta(fund)^2 = q^(N - 1/N), lk = total linking number).  Both sides times z^(c-1), in s = q^(1/2).
    """
    row = _link_entry(name)
    knot = _link_as_torus(row)
    c = knot.components
    lk_total = knot.linking_number * c * (c - 1) // 2
    z = {Fraction(1): 1, Fraction(-1): -1}  # exponents of s
    table = _terms(row["homflypt_polynomial"], (V_SYM, Z_SYM))
    lhs: dict = {}
    for (i, j), coeff in table.items():
        zj = int(j) + (c - 1)
        assert zj >= 0
        term = {e - N * i: coeff * v for e, v in _pow(z, zj).items()}  # v^i = s^(-N i)
        lhs = _add(lhs, term)
    w = wilson_loop(knot, f"SU({N})", [1], normalized=True).value.terms()
    shift = -lk_total * Fraction(N * N - 1, N) * 2  # q^(-lk(N-1/N)) in powers of s
    rhs = _mul({2 * e + shift: coeff for e, coeff in w.items()}, _pow(z, c - 1))
    assert lhs == rhs


@pytest.mark.parametrize("name", sorted(EXPECTED_LINKS))
def test_link_alexander_via_conway(name):
    row = _link_entry(name)
    knot = _link_as_torus(row)
    assert alexander(knot).value.terms() == _conway_to_alexander(_conway_table(row["conway_polynomial"]))


@pytest.mark.parametrize("name", sorted(EXPECTED_LINKS))
def test_link_determinant(name):
    row = _link_entry(name)
    knot = _link_as_torus(row)
    assert abs(_at_minus_one(jones(knot).value.terms())) == int(row["determinant"])
    assert abs(_at_minus_one(alexander(knot).value.terms())) == int(row["determinant"])


def test_unlink_sign_convention():
    """CONVENTIONS §8: Jones and the quantum dimension differ by (-1)^(c-1) on links.

    Checked here on the table's own Hopf link: the table's V(L2a1{1}) at the top degree
    has coefficient -1, while the SU(2) Wilson loop divided by [2] has +1 there.
    """
    row = _link_entry("L2a1{1}")
    v = _jones_table(row["jones_polynomial"], X_SYM)
    w = wilson_loop(TorusLink(2, 2), "SU(2)", [1], normalized=True).value.terms()
    assert v[max(v)] == -1
    assert w[min(w)] == 1  # t = q^-1 swaps the ends
