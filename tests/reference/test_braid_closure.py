"""An independent braid-closure computation of the fundamental SU(N)/U(N) invariant.

Written entirely inside this file (nothing from knotobs is used on the reference side):

* The U_q(gl_N) fundamental R-matrix (M. Jimbo, Lett. Math. Phys. 11 (1986) 247;
  V. G. Turaev, Invent. Math. 92 (1988) 527) in the form, on ``e_a (x) e_b``::

      R'(e_a e_a) = s e_a e_a
      R'(e_a e_b) = e_b e_a                          (a < b)
      R'(e_a e_b) = e_b e_a + (s - 1/s) e_a e_b      (a > b)

  with ``s = q^(1/2)``.  It satisfies the Hecke relation ``(R' - s)(R' + 1/s) = 0``, so its
  eigenvalues are ``q^(1/2)`` and ``-q^(-1/2)``; for SU(N) every crossing carries the extra
  factor ``q^(-1/(2N))`` (CONVENTIONS §3).  ``R'^-1 = R' - (s - 1/s)``.
* Quantum trace with ``K_(2 rho)``: ``K e_a = q^((N+1-2a)/2) e_a`` (a = 1..N), one factor
  per strand (Reshetikhin–Turaev, Commun. Math. Phys. 127 (1990) 1; Turaev 1988).  The
  Markov moves are tested on the engine itself before it is used as a reference.
* The closure of a braid is blackboard framed: the framing of each component is its
  self-writhe.  The zero-framed invariant removes ``theta(fund)^(-self-writhe)`` per
  component, ``theta(fund) = q^((N - 1/N)/2)`` for SU(N) and ``q^(N/2)`` for U(N)
  (CONVENTIONS §2).  Crossings between different components are kept: that is what
  zero framing of each component means for a link.
* ``T(p, q)`` is the closure of ``(sigma_1 ... sigma_{p-1})^q`` on ``p`` strands (common
  practice; CONVENTIONS §3), and also of ``(sigma_1 ... sigma_{q-1})^p`` on ``q`` strands.

The result is compared with both knotobs evaluators (Rosso–Jones and the weight sum).
"""

from __future__ import annotations

from fractions import Fraction
from itertools import product

import pytest
from flint import fmpz_poly

from knotobs import SU, U, TorusLink, rosso_jones, weight_sum

# ---------------------------------------------------------------- braid-closure engine
# Polynomials in s = q^(1/2) are fmpz_poly with a separately tracked shift.  Each crossing
# is multiplied by s so that every matrix entry is a polynomial:
#   s R'   : diagonal s^2;  swap s;  extra (s^2 - 1)
#   s R'^-1: diagonal 1;    swap s;  extra -(s^2 - 1)        (R'^-1 = R' - z)
_S = fmpz_poly([0, 1])
_S2 = fmpz_poly([0, 0, 1])
_ONE = fmpz_poly([1])
_S2M1 = fmpz_poly([-1, 0, 1])


def _apply(state: dict, i: int, sign: int) -> dict:
    """Apply ``s * R'^(sign)`` on strands ``i, i+1`` (0-based) to a vector ``{basis tuple: poly}``."""
    out: dict = {}

    def put(key, val):
        if key in out:
            out[key] = out[key] + val
        else:
            out[key] = val

    for b, c in state.items():
        x, y = b[i], b[i + 1]
        if x == y:
            put(b, c * (_S2 if sign > 0 else _ONE))
            continue
        sw = b[:i] + (y, x) + b[i + 2:]
        put(sw, c * _S)
        if sign > 0:
            if x > y:
                put(b, c * _S2M1)
        else:
            if x < y:
                put(b, -(c * _S2M1))
    return {k: v for k, v in out.items() if not v.is_zero()}


def _quantum_trace(strands: int, word: list[int], N: int, k_sign: int) -> dict[Fraction, int]:
    """``tr((K_(2 rho))^(x strands) R'(word))`` as ``{exponent of q: coeff}`` (U(N) crossings).

    ``word`` lists generators ``+-i`` (1-based, sign = crossing sign); ``k_sign`` = +1 puts
    ``q^((N-1)/2)`` on ``e_1``, -1 puts it on ``e_N``.
    """
    total = fmpz_poly()
    for b in product(range(N), repeat=strands):
        state = {b: _ONE}
        for g in word:
            state = _apply(state, abs(g) - 1, 1 if g > 0 else -1)
            if not state:
                break
        diag = state.get(b)
        if diag is None or diag.is_zero():
            continue
        # K weight times s^(N-1) per strand: exponent of s is (N - 1) + k_sign (N + 1 - 2a) - ... >= 0
        kexp = sum((N - 1) + k_sign * (N - 1 - 2 * a) for a in b)
        total += diag * fmpz_poly([0] * kexp + [1])
    shift = -len(word) - strands * (N - 1)  # undo s per crossing and s^(N-1) per strand
    out = {}
    for e, c in enumerate(total.coeffs()):
        if c != 0:
            out[Fraction(e + shift, 2)] = int(c)  # s = q^(1/2)
    return out


def _components_and_self_writhe(strands: int, word: list[int]) -> tuple[int, int]:
    """Number of components of the closure and the total self-writhe (sum over components)."""
    parent = list(range(strands))

    def find(x):
        while parent[x] != x:
            parent[x] = parent[parent[x]]
            x = parent[x]
        return x

    at = list(range(strands))  # at[position] = strand (named by its bottom position)
    crossings = []
    for g in word:
        i = abs(g) - 1
        crossings.append((at[i], at[i + 1], 1 if g > 0 else -1))
        at[i], at[i + 1] = at[i + 1], at[i]
    for pos, strand in enumerate(at):  # the strand ending at top position pos continues as strand pos
        ra, rb = find(strand), find(pos)
        if ra != rb:
            parent[ra] = rb
    comps = len({find(x) for x in range(strands)})
    self_writhe = sum(sg for a, b, sg in crossings if find(a) == find(b))
    return comps, self_writhe


def _shift(poly: dict, e: Fraction) -> dict:
    return {k + e: c for k, c in poly.items()}


K_SIGN = 1  # K e_a = q^((N+1-2a)/2) e_a; Markov moves are tested below


def braid_closure_invariant(strands: int, word: list[int], N: int, kind: str = "SU") -> dict[Fraction, int]:
    """Zero-framed fundamental invariant of the closure of ``word``, unknot = ``[N]``."""
    tr = _quantum_trace(strands, word, N, K_SIGN)
    _, sw = _components_and_self_writhe(strands, word)
    writhe = sum(1 if g > 0 else -1 for g in word)
    if kind == "SU":
        theta = Fraction(N * N - 1, 2 * N)
        return _shift(tr, Fraction(-writhe, 2 * N) - theta * sw)
    return _shift(tr, -Fraction(N, 2) * sw)


def torus_word(p: int, q: int) -> tuple[int, list[int]]:
    """``(sigma_1 ... sigma_{|p|-1})^|q|`` on ``|p|`` strands, inverse crossings when ``p q < 0``."""
    sign = 1 if p * q > 0 else -1
    return abs(p), [sign * i for i in range(1, abs(p))] * abs(q)


def _qint(n: int) -> dict[Fraction, int]:
    return {Fraction(n - 1 - 2 * k, 2): 1 for k in range(n)}


# ---------------------------------------------------------------- sanity of the engine itself
@pytest.mark.parametrize("N", [2, 3, 4])
def test_markov_moves_pin_the_quantum_trace(N):
    """Reidemeister/Markov moves on the reference engine (Markov's theorem; common practice).

    Closure of sigma_1 (2 strands) and of sigma_1 sigma_2 (3 strands) is the unknot with
    blackboard framing +1, resp. +2; the zero-framed invariant is [N] in both; a
    stabilisation sigma_3^(+-1) on a fourth strand changes only the framing.
    """
    theta_u = Fraction(N, 2)
    assert _quantum_trace(1, [], N, K_SIGN) == _qint(N)
    assert _quantum_trace(2, [1], N, K_SIGN) == _shift(_qint(N), theta_u)
    assert _quantum_trace(2, [-1], N, K_SIGN) == _shift(_qint(N), -theta_u)
    assert _quantum_trace(3, [1, 2], N, K_SIGN) == _shift(_qint(N), 2 * theta_u)
    assert _quantum_trace(3, [1, -2], N, K_SIGN) == _qint(N)
    assert _quantum_trace(3, [-1, 2], N, K_SIGN) == _qint(N)
    assert _quantum_trace(3, [2, 1], N, K_SIGN) == _shift(_qint(N), 2 * theta_u)
    assert _quantum_trace(4, [1, -2, 3], N, K_SIGN) == _shift(_qint(N), theta_u)
    assert _quantum_trace(4, [1, 2, -1, -2, -3], N, K_SIGN) == _shift(_qint(N), -theta_u)
    for strands, word in ([3, [1, 2]], [3, [1, -2]], [3, [-1, -2]], [3, [2, -1]], [4, [1, 2, 3]], [4, [-1, 2, -3]]):
        assert braid_closure_invariant(strands, word, N) == _qint(N)  # unknot, zero framing = dim_q
    # the trefoil closure sigma_1^3 on 2 strands changes under a stabilisation only by theta
    tref = _quantum_trace(2, [1, 1, 1], N, K_SIGN)
    assert _quantum_trace(3, [1, 1, 1, 2], N, K_SIGN) == _shift(tref, theta_u)
    assert _quantum_trace(3, [1, 1, 1, -2], N, K_SIGN) == _shift(tref, -theta_u)


def test_reversed_weight_order_gives_the_same_invariant():
    """Putting q^((N-1)/2) on e_N instead of e_1 amounts to conjugating every crossing by the flip
    of tensor factors, i.e. rotating the closed braid by pi (sigma_i -> sigma_(m-i)), an isotopy:
    the reference engine must not depend on the choice (common practice)."""
    for strands, word in ([3, [1, 1, 2, -1, 2]], [3, [1, 2] * 4], [4, [1, 2, 3, -2, 1, 3]]):
        assert _quantum_trace(strands, word, 3, K_SIGN) == _quantum_trace(strands, word, 3, -K_SIGN)


def test_reference_engine_hopf_link_and_unlink():
    """Closure of the identity on 2 strands is the 2-component unlink: [N]^2 (common practice)."""
    for N in (2, 3):
        sq = {}
        for e1, c1 in _qint(N).items():
            for e2, c2 in _qint(N).items():
                sq[e1 + e2] = sq.get(e1 + e2, 0) + c1 * c2
        assert braid_closure_invariant(2, [], N) == {e: c for e, c in sq.items() if c}
        assert _components_and_self_writhe(2, [1, 1]) == (2, 0)
        assert _components_and_self_writhe(3, [1, 2, 1, 2, 1, 2]) == (3, 0)
        assert _components_and_self_writhe(2, [1, 1, 1]) == (1, 3)


# ---------------------------------------------------------------- comparison with knotobs
CASES = {
    2: [(2, 3), (3, 2), (2, 5), (3, 4), (4, 3), (3, 5), (2, 7), (4, 5), (2, -3), (3, -4), (-2, 5),
        (2, 2), (2, 4), (4, 2), (2, 6), (3, 3), (4, 4), (3, 6), (4, 6), (2, -4), (3, -3), (4, -2)],
    3: [(2, 3), (3, 2), (2, 5), (3, 4), (4, 3), (3, 5), (2, -5), (3, -4),
        (2, 2), (2, 4), (3, 3), (4, 2), (2, 6), (3, -3), (4, -6)],
    4: [(2, 3), (3, 2), (3, 4), (4, 3), (2, 5), (3, -4), (2, 2), (2, 4), (3, 3), (4, 2), (2, -6), (4, 4)],
}
# larger braids (still seconds at most), part of the default run
CASES[2] += [(5, 6), (5, 5), (5, -2), (4, -5)]
CASES[3] += [(4, 5), (4, 4), (5, 2)]
CASES[4] += [(4, 5), (4, 6), (4, -5)]


@pytest.mark.parametrize("N,p,q", [(N, p, q) for N, lst in CASES.items() for p, q in lst])
def test_braid_closure_equals_both_routes(N, p, q):
    """Zero-framed SU(N) fundamental invariant of T(p,q): braid closure = Rosso–Jones = weight sum."""
    strands, word = torus_word(p, q)
    ref = braid_closure_invariant(strands, word, N, "SU")
    knot = TorusLink(p, q)
    assert rosso_jones(knot, SU(N), (1,)).terms() == ref
    assert weight_sum(knot, SU(N), (1,)).terms() == ref


@pytest.mark.parametrize("N,p,q", [(2, 2, 3), (2, 3, 3), (3, 2, 4), (3, 3, 4), (4, 2, 2), (3, 3, -3)])
def test_braid_closure_u_n(N, p, q):
    """Same for U(N): R' without the q^(-1/(2N)) factor, theta(fund) = q^(N/2)."""
    strands, word = torus_word(p, q)
    ref = braid_closure_invariant(strands, word, N, "U")
    knot = TorusLink(p, q)
    assert rosso_jones(knot, U(N), (1,)).terms() == ref
    assert weight_sum(knot, U(N), (1,)).terms() == ref


@pytest.mark.parametrize("N,p,q", [(2, 3, 4), (3, 2, 5), (2, 2, 4), (3, 3, 3)])
def test_braid_closure_with_framing(N, p, q):
    """Framing f on every component multiplies by theta(fund)^f (CONVENTIONS §2); blackboard framing
    of the braid closure is the self-writhe, so the raw (framed) closure is framing = self-writhe/component."""
    strands, word = torus_word(p, q)
    comps, sw = _components_and_self_writhe(strands, word)
    writhe = len(word)
    raw = _shift(_quantum_trace(strands, word, N, K_SIGN), Fraction(-writhe, 2 * N))
    knot = TorusLink(p, q)
    per_comp = sw // comps  # torus links: every component has the same self-writhe
    assert per_comp * comps == sw
    assert rosso_jones(knot, SU(N), (1,), framing=per_comp).terms() == raw
    assert weight_sum(knot, SU(N), (1,), framing=[per_comp] * comps).terms() == raw


@pytest.mark.parametrize("N,p,q", [(2, 2, 3), (2, 3, 4), (3, 2, 3), (2, 2, 4), (3, 3, 3)])
def test_braid_closure_on_the_other_number_of_strands(N, p, q):
    """T(p, q) = T(q, p): closure on q strands gives the same zero-framed invariant."""
    a = braid_closure_invariant(*torus_word(p, q), N)
    b = braid_closure_invariant(*torus_word(q, p), N)
    assert a == b == rosso_jones(TorusLink(p, q), SU(N), (1,)).terms()


@pytest.mark.slow
@pytest.mark.parametrize("N,p,q", [(2, 6, 7), (2, 7, 4), (3, 5, 6), (3, 5, 5), (4, 5, 6), (4, 5, 3), (4, 4, 8)])
def test_braid_closure_equals_both_routes_slow(N, p, q):
    strands, word = torus_word(p, q)
    ref = braid_closure_invariant(strands, word, N, "SU")
    knot = TorusLink(p, q)
    assert rosso_jones(knot, SU(N), (1,)).terms() == ref
    assert weight_sum(knot, SU(N), (1,)).terms() == ref
