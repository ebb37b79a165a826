"""Representation data of SU(N)/U(N) against textbook values.

Sources are named beside each check; "common practice" marks facts of the trade.
"""

from fractions import Fraction as F

import pytest

from knotobs.errors import InvalidGroupError, InvalidRepresentationError, ParseError
from knotobs.representations import (
    SU,
    U,
    ComplexRep,
    adams_fixed,
    adams_generic,
    casimir,
    conjugate,
    dimension,
    dual,
    from_dynkin,
    kostka,
    littlewood_richardson,
    mn_character,
    parse_group,
    partitions_of,
    quantum_dimension,
    quantum_dimension_hook_content,
    tensor_fixed,
    to_dynkin,
    weight_multiplicities,
)


def test_su3_dimensions():
    # Dimensions of SU(3) irreps with Dynkin labels (a,b): (a+1)(b+1)(a+b+2)/2 (common practice;
    # e.g. Fulton-Harris, Representation Theory (1991), §15.3): 3, 6, 8, 10, 15, 27.
    table = {(1, 0): 3, (2, 0): 6, (1, 1): 8, (3, 0): 10, (2, 1): 15, (2, 2): 27}
    for labels, d in table.items():
        assert dimension(SU(3), from_dynkin(labels)) == d


def test_casimir_values():
    # C_2 with long roots of length^2 = 2: fundamental of SU(N) is (N^2-1)/(2N), adjoint is N
    # (common practice; e.g. Di Francesco-Mathieu-Senechal, Conformal Field Theory (1997), §13.4).
    for N in range(2, 7):
        assert casimir(SU(N), (1,)) == F(N * N - 1, 2 * N)
        adj = (2,) + (1,) * (N - 2)
        assert casimir(SU(N), adj) == N
    # spin j of SU(2): j(j+1)
    for n in range(8):
        assert casimir(SU(2), (n,)) == F(n, 2) * (F(n, 2) + 1)


def test_symmetric_group_characters_S4():
    # Character table of S_4 (common practice; e.g. James-Kerber (1981), appendix I).
    classes = [(1, 1, 1, 1), (2, 1, 1), (2, 2), (3, 1), (4,)]
    table = {
        (4,): [1, 1, 1, 1, 1],
        (3, 1): [3, 1, -1, 0, -1],
        (2, 2): [2, 0, 2, -1, 0],
        (2, 1, 1): [3, -1, -1, 0, 1],
        (1, 1, 1, 1): [1, -1, 1, 1, -1],
    }
    for lam, row in table.items():
        assert [mn_character(lam, rho) for rho in classes] == row


def test_kostka_table_n4():
    # Kostka matrix for n = 4 (Macdonald, Symmetric Functions (1995), ch. I §6 table).
    assert kostka((3, 1), (2, 1, 1)) == 2
    assert kostka((2, 2), (1, 1, 1, 1)) == 2
    assert kostka((3, 1), (1, 1, 1, 1)) == 3
    assert kostka((2, 1, 1), (1, 1, 1, 1)) == 3
    assert kostka((2, 2), (2, 1, 1)) == 1


def _ssyt_count(lam, mu):
    """Semistandard tableaux of shape ``lam`` and content ``mu``, filled cell by cell (brute force)."""
    cells = [(i, j) for i, r in enumerate(lam) for j in range(r)]
    left = list(mu)

    def rec(c, T):
        if c == len(cells):
            return 1
        i, j = cells[c]
        lo = max(T[(i, j - 1)] if j else 0, T[(i - 1, j)] + 1 if i else 0)
        total = 0
        for a in range(lo, len(left)):
            if left[a]:
                left[a] -= 1
                T[(i, j)] = a
                total += rec(c + 1, T)
                left[a] += 1
        T.pop((i, j), None)
        return total

    return rec(0, {})


@pytest.mark.parametrize("rows", [2, 3, 4])
def test_kostka_equals_tableau_count(rows):
    # K_{lam,mu} is by definition the number of semistandard tableaux (Macdonald (1995), ch. I
    # §5); the two- and three-letter cases are closed forms in knotobs, checked here against
    # the definition for every pair of partitions of n <= 7 into at most `rows` parts.
    from knotobs.representations.partitions import partitions_of

    for n in range(1, 8):
        parts = [tuple(p) for p in partitions_of(n, rows)]
        for lam in parts:
            for mu in parts:
                assert kostka(lam, mu) == _ssyt_count(lam, mu), (lam, mu)


@pytest.mark.parametrize("N", [2, 3, 4])
@pytest.mark.parametrize("lam", [(1,), (2,), (2, 1), (3, 1), (2, 2)])
def test_weights_sum_to_dimension(N, lam):
    if len(lam) > N:
        return
    assert sum(weight_multiplicities(lam, N).values()) == dimension(SU(N), lam)


def test_littlewood_richardson():
    # s_21 * s_21 = s_42 + s_411 + s_33 + 2 s_321 + s_3111 + s_222 + s_2211
    # (Macdonald (1995), ch. I §9; common practice)
    expect = {(4, 2): 1, (4, 1, 1): 1, (3, 3): 1, (3, 2, 1): 2, (3, 1, 1, 1): 1, (2, 2, 2): 1, (2, 2, 1, 1): 1}
    assert dict(littlewood_richardson((2, 1), (2, 1))) == expect
    # truncation to U(3) of the generic product equals the fixed-N Brauer-Klimyk product
    fixed = tensor_fixed(U(3), [(2, 1), (2, 1)])
    assert fixed == {k: v for k, v in expect.items() if len(k) <= 3}


def test_adams_of_fundamental_is_alternating_hooks():
    # p_m = sum over hooks (m-r, 1^r) of (-1)^r s_hook (Macdonald (1995), ch. I §3, ex. 11)
    for m in range(1, 8):
        got = dict(adams_generic((1,), m))
        expect = {tuple([m - r] + [1] * r): (-1) ** r for r in range(m)}
        assert got == expect


def test_adams_generic_equals_fixed_n():
    # two independent algorithms (Murnaghan-Nakayama vs Racah-Speiser on weights)
    for N in (2, 3, 4):
        for n in range(1, 4):
            for lam in partitions_of(n, N):
                for m in (2, 3):
                    gen = {mu: c for mu, c in adams_generic(lam, m) if len(mu) <= N}
                    assert dict(adams_fixed(SU(N), lam, m)) == gen


def test_adams_classical_dimension():
    # psi^m preserves the dimension of a U(N) character evaluated at the identity (common practice)
    for N in (2, 3, 4):
        for lam in [(1,), (2,), (2, 1), (3, 1)]:
            if len(lam) > N:
                continue
            for m in (2, 3, 4):
                total = sum(c * dimension(U(N), mu) for mu, c in adams_fixed(U(N), lam, m))
                assert total == dimension(U(N), lam)


@pytest.mark.parametrize("N", [2, 3, 4, 5])
def test_quantum_dimension_formulas_agree(N):
    for n in range(0, 5):
        for lam in partitions_of(n, N):
            qd = quantum_dimension(SU(N), lam)
            assert qd == quantum_dimension_hook_content(SU(N), lam)
            assert qd.at_one() == dimension(SU(N), lam)  # q -> 1 gives the classical dimension


def test_dynkin_round_trip_and_dual():
    for lam in [(3, 1), (2, 2, 1), (4,)]:
        assert from_dynkin(to_dynkin(lam, 4)) == lam
    # dual of SU(N) fundamental is the antifundamental (common practice)
    assert dual(SU(4), (1,)) == (1, 1, 1)
    assert dual(SU(3), dual(SU(3), (3, 1))) == (3, 1)
    assert conjugate((3, 1)) == (2, 1, 1)


def test_bad_groups_and_partitions():
    with pytest.raises(InvalidGroupError, match="SU\\(1\\)"):
        parse_group("SU(1)")
    with pytest.raises(ParseError, match="SO"):
        parse_group("SO(3)")
    with pytest.raises(InvalidRepresentationError, match="3 rows"):
        quantum_dimension(SU(2), (1, 1, 1))
    with pytest.raises(InvalidRepresentationError, match="not a partition"):
        casimir(SU(3), (1, 2))


def test_complex_representation_pairs():
    r = ComplexRep(3, (1,), (1, 1))
    assert r.dimension == 9
    assert r.conjugate().conjugate() == r
    assert ComplexRep.parse(2, "[1];[2]") == ComplexRep(2, (1,), (2,))
