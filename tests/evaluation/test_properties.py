"""Property-based checks (hypothesis) of facts of the trade.

Each property names its source; where the reference side needs a formula it is written
out here, independently of knotobs.
"""

from __future__ import annotations

from fractions import Fraction
from math import gcd, prod

import pytest

from knotobs.errors import InvalidRepresentationError

hypothesis = pytest.importorskip("hypothesis")
from hypothesis import HealthCheck, assume, given, settings  # noqa: E402
from hypothesis import strategies as st  # noqa: E402

from knotobs import SU, U, TorusLink, alexander, homfly, jones, rosso_jones, weight_sum, wilson_loop  # noqa: E402
from knotobs.representations import (  # noqa: E402
    adams_fixed,
    adams_generic,
    dimension,
    littlewood_richardson,
    quantum_dimension,
    quantum_dimension_hook_content,
)

SETTINGS = settings(max_examples=30, deadline=None, database=None, suppress_health_check=[HealthCheck.too_slow])

nonzero = st.integers(-9, 9).filter(lambda x: x != 0)
partitions = st.lists(st.integers(1, 3), min_size=1, max_size=3).map(lambda xs: tuple(sorted(xs, reverse=True)))
small_partitions = st.lists(st.integers(1, 2), min_size=1, max_size=2).map(lambda xs: tuple(sorted(xs, reverse=True)))


def _torus(p, q, max_pq=40):
    return abs(p * q) <= max_pq


# ---------------------------------------------------------------- independent helpers
def _contents(lam):
    return [j - i for i, row in enumerate(lam) for j in range(row)]


def _hooks(lam):
    conj = [sum(1 for r in lam if r > j) for j in range(lam[0])] if lam else []
    return [lam[i] - j + conj[j] - i - 1 for i in range(len(lam)) for j in range(lam[i])]


def _classical_dim(N, lam):
    """Hook–content formula (Stanley, EC2 Cor. 7.21.4; Macdonald (1995) I.3 ex. 4)."""
    num = prod(N + c for c in _contents(lam))
    den = prod(_hooks(lam))
    assert num % den == 0
    return num // den


def _qint(n):
    """[n] as {exponent of q: coeff}; [0] = 0, [-n] = -[n]."""
    if n == 0:
        return {}
    if n < 0:
        return {e: -c for e, c in _qint(-n).items()}
    return {Fraction(n - 1 - 2 * k, 2): 1 for k in range(n)}


def _mul(a, b):
    out = {}
    for ea, ca in a.items():
        for eb, cb in b.items():
            out[ea + eb] = out.get(ea + eb, 0) + ca * cb
    return {e: c for e, c in out.items() if c}


def _prod(polys):
    out = {Fraction(0): 1}
    for p in polys:
        out = _mul(out, p)
    return out


def _at_minus_one(terms):
    """Exact value at t = -1 with t^(1/2) = i, as a pair of integers (re, im)."""
    re_, im_ = 0, 0
    for e, c in terms.items():
        k = e * 2
        assert k.denominator == 1
        r = int(k) % 4
        re_ += c if r == 0 else (-c if r == 2 else 0)
        im_ += c if r == 1 else (-c if r == 3 else 0)
    return re_, im_


def _schur(lam, xs):
    """Schur polynomial by the bialternant formula (Macdonald (1995) I.3), exact rationals."""
    n = len(xs)
    lt = list(lam) + [0] * (n - len(lam))
    if len(lam) > n:
        return Fraction(0)

    def det(m):
        m = [row[:] for row in m]
        d = Fraction(1)
        for c in range(n):
            piv = next((r for r in range(c, n) if m[r][c] != 0), None)
            if piv is None:
                return Fraction(0)
            if piv != c:
                m[c], m[piv] = m[piv], m[c]
                d = -d
            d *= m[c][c]
            for r in range(c + 1, n):
                f = m[r][c] / m[c][c]
                for k in range(c, n):
                    m[r][k] -= f * m[c][k]
        return d

    num = det([[Fraction(x) ** (lt[j] + n - 1 - j) for j in range(n)] for x in xs])
    den = det([[Fraction(x) ** (n - 1 - j) for j in range(n)] for x in xs])
    return num / den


# ================================================================ T(p,q) = T(q,p)
@SETTINGS
@given(p=nonzero, q=nonzero, N=st.integers(2, 4), lam=small_partitions)
def test_swap_p_q(p, q, N, lam):
    """T(p, q) and T(q, p) are isotopic (Rolfsen, Knots and Links (1976) 3.C).  The weight sum
    treats P and Q asymmetrically (rho/P + w(rho)/Q), so the swap is a non-trivial check there."""
    assume(_torus(p, q) and len(lam) <= N)
    a, b = TorusLink(p, q), TorusLink(q, p)
    assert weight_sum(a, SU(N), lam) == weight_sum(b, SU(N), lam)
    assert rosso_jones(a, SU(N), lam) == weight_sum(b, SU(N), lam)
    assert jones(a).value == jones(b).value


# ================================================================ mirror
@SETTINGS
@given(p=nonzero, q=nonzero, N=st.integers(2, 4), lam=small_partitions, f=st.integers(-3, 3))
def test_mirror_is_q_inverse(p, q, N, lam, f):
    """Mirror image is q -> q^-1, and framing f becomes -f (common practice; Turaev, Quantum
    invariants of knots and 3-manifolds (1994) I.1; CONVENTIONS §2)."""
    assume(_torus(p, q) and len(lam) <= N)
    k = TorusLink(p, q)
    for route in (rosso_jones, weight_sum):
        w = route(k, SU(N), lam, framing=f)
        assert route(k.mirror(), SU(N), lam, framing=-f) == w.mirror()
    res = wilson_loop(k, SU(N), lam, framing=f, normalized=True)
    assert wilson_loop(TorusLink(p, -q), SU(N), lam, framing=-f, normalized=True).value == res.value.mirror()


@SETTINGS
@given(p=nonzero, q=nonzero)
def test_mirror_jones_and_homfly(p, q):
    """V_mirror(t) = V(1/t); P_mirror(a, z) = P(-1/a, z) on the (a, z) form (common practice: the
    skein relations with L+ and L- exchanged; the dataset's form of the rule is CONVENTIONS §8)."""
    assume(_torus(p, q, 30))
    k = TorusLink(p, q)
    assert jones(k.mirror()).value == jones(k).value.mirror()
    assert jones(k, mirror=True).value == jones(k).value.mirror()
    h = homfly(k).value.to_az()
    assert homfly(k.mirror()).value.to_az() == {(-i, j): c * (-1) ** i for (i, j), c in h.items()}


# ================================================================ q -> 1
@SETTINGS
@given(p=nonzero, q=nonzero, N=st.integers(2, 5), lam=partitions, kind=st.sampled_from(["SU", "U"]))
def test_q_to_one_is_classical_dimension(p, q, N, lam, kind):
    """At q = 1 the quantum invariant is the classical dimension, product over components
    (the classical limit of the Reshetikhin–Turaev functor; common practice)."""
    assume(_torus(p, q, 30) and len(lam) <= N)
    k = TorusLink(p, q)
    # links with many components in big colours are refused by the size guard (T(5,5) in
    # [3,3,3] of U(5): about 2e5 weights) or take minutes: keep the tensor power small
    assume(k.components <= 2 or k.components * sum(lam) <= 12)
    g = SU(N) if kind == "SU" else U(N)
    expect = _classical_dim(N, lam) ** k.components
    assert rosso_jones(k, g, lam).at_one() == expect
    assert weight_sum(k, g, lam).at_one() == expect


def test_q_to_one_mixed_colours():
    k = TorusLink(4, 6)
    assert rosso_jones(k, SU(3), [(2, 1), (2,)]).at_one() == 8 * 6


# ================================================================ determinant
@SETTINGS
@given(p=st.integers(2, 12), q=st.integers(2, 12), sign=st.sampled_from([1, -1]))
def test_determinant_jones_vs_alexander(p, q, sign):
    """|V(-1)| = |Delta(-1)| = det (Jones, Bull. AMS 12 (1985); Lickorish (1997) ch. 6 & 3)."""
    assume(p * q <= 60)
    k = TorusLink(p, sign * q)
    v = _at_minus_one(jones(k).value.terms())
    d = _at_minus_one(alexander(k).value.terms())
    assert v[0] ** 2 + v[1] ** 2 == d[0] ** 2 + d[1] ** 2
    if k.is_knot:
        # classical (from Alexander's formula at t = -1): det T(p,q) = 1 if p, q odd, else the odd one
        det = 1 if (p % 2 and q % 2) else (q if p % 2 == 0 else p)
        assert v[0] ** 2 + v[1] ** 2 == det * det


# ================================================================ HOMFLY-PT -> SU(N)
@SETTINGS
@given(p=st.integers(1, 7), q=st.integers(2, 7), sign=st.sampled_from([1, -1]), N=st.integers(2, 6),
       lam=small_partitions)
def test_homfly_specialises_to_su_n_knots(p, q, sign, N, lam):
    """P_lam(a = q^(N/2), z = q^(1/2) - q^(-1/2)) = SU(N) normalised Wilson loop, knots, any colour
    (Freyd et al. Bull. AMS 12 (1985); Turaev, Invent. Math. 92 (1988); CONVENTIONS §1, §3)."""
    assume(gcd(p, q) == 1 and len(lam) <= N)
    k = TorusLink(p, sign * q)
    h = homfly(k, lam).value.specialize(Fraction(N, 2))
    assert h == wilson_loop(k, SU(N), lam, normalized=True).value


@SETTINGS
@given(d=st.integers(2, 3), P=st.integers(1, 3), Q=st.integers(1, 4), sign=st.sampled_from([1, -1]),
       N=st.integers(2, 6))
def test_homfly_specialises_to_su_n_links(d, P, Q, sign, N):
    """Links, fundamental colour: P(a = q^(N/2)) = W_SU(N)/[N] * q^(-lk (N - 1/N)) with lk the total
    linking number (the linking phase theta(fund)^(2 lk) that zero framing per component keeps;
    CONVENTIONS §2–§3)."""
    assume(gcd(P, Q) == 1)
    k = TorusLink(d * P, sign * d * Q)
    lk_total = k.linking_number * d * (d - 1) // 2
    h = homfly(k).value.specialize(Fraction(N, 2))
    w = wilson_loop(k, SU(N), (1,), normalized=True).value
    assert h == w.times_monomial(-lk_total * Fraction(N * N - 1, N))


def test_homfly_coloured_link_is_refused_clearly():
    """A coloured link's normalised HOMFLY-PT is a rational function (the other components keep
    their unknot factors), so knotobs refuses it with a clear error and points to fixed N, where
    the value exists (checked here for SU(3))."""
    k = TorusLink(2, 4)
    with pytest.raises(InvalidRepresentationError, match="rational function"):
        homfly(k, (2,))
    w = wilson_loop(k, SU(3), (2,), normalized=True).value
    assert w.at_one() != 0


def test_homfly_coloured_link_is_refused_before_the_sum(monkeypatch):
    """The refusal comes before the Rosso–Jones sum (project rule: refuse before the work
    starts): T(8,12) coloured by [4] once ran for minutes before the same error.  The sum is
    replaced by one that fails, so a refusal that came after it would show."""
    import knotobs.evaluation.families as fam

    def _no_sum(*a, **k):
        raise AssertionError("the Rosso-Jones sum was started")

    monkeypatch.setattr(fam, "rosso_jones_homfly", _no_sum)
    for kw in ({}, {"normalized": False}):
        with pytest.raises(InvalidRepresentationError, match="Laurent polynomial"):
            homfly(TorusLink(8, 12), (4,), **kw)


def test_homfly_trivial_colour_is_one():
    """The trivial colour on every component gives the invariant 1 (the empty link; common
    practice), normalised or not, for knots and links alike, matching the coloured Jones J_1 = 1."""
    for k in (TorusLink(2, 3), TorusLink(2, 4), TorusLink(3, 6)):
        for norm in (True, False):
            assert homfly(k, (), normalized=norm).exact_string() == "1"


# ================================================================ quantum dimensions
@settings(max_examples=60, deadline=None, database=None)
@given(N=st.integers(2, 8), lam=st.lists(st.integers(1, 4), min_size=1, max_size=4).map(
    lambda xs: tuple(sorted(xs, reverse=True))))
def test_hook_content_equals_weyl(N, lam):
    """Quantum hook–content formula: dim_q = prod [N + c] / prod [h] (Macdonald (1995) I.3 ex. 1;
    Stanley EC2 7.21.2) equals Weyl's quantum dimension prod_{i<j} [lam_i - lam_j + j - i]/[j - i]."""
    assume(len(lam) <= N)
    weyl = quantum_dimension(SU(N), lam)
    # reference side, cleared of denominators: dim_q * prod [h] == prod [N + c]
    lhs = _mul(weyl.terms(), _prod(_qint(h) for h in _hooks(lam)))
    rhs = _prod(_qint(N + c) for c in _contents(lam))
    assert lhs == rhs
    assert quantum_dimension_hook_content(SU(N), lam) == weyl
    assert weyl.at_one() == _classical_dim(N, lam) == dimension(SU(N), lam)


# ================================================================ Adams operations
@settings(max_examples=40, deadline=None, database=None)
@given(N=st.integers(1, 5), lam=partitions, m=st.integers(1, 4))
def test_adams_generic_vs_fixed(N, lam, m):
    """psi^m for fixed N is the generic-N plethysm s_lam[p_m] with the mu of more than N rows
    dropped (s_mu(x_1..x_N) = 0 for l(mu) > N; Macdonald (1995) I.3, I.8 ex. 1)."""
    assume(len(lam) <= N and sum(lam) * m <= 12)
    generic = {mu: c for mu, c in adams_generic(lam, m) if len(mu) <= N}
    assert dict(adams_fixed(U(N), lam, m)) == generic


@settings(max_examples=25, deadline=None, database=None)
@given(lam=partitions, m=st.integers(2, 3), xs=st.sampled_from([(2, 3, 5), (1, 2), (2, -1, 3), (1, 3, 4, 7)]))
def test_adams_against_bialternant(lam, m, xs):
    """s_lam(x_1^m, ..., x_N^m) = sum_mu c_mu s_mu(x) evaluated at integer points with the
    bialternant formula (CONVENTIONS §2; Macdonald (1995) I.3 (3.1))."""
    N = len(xs)
    assume(len(lam) <= N)
    lhs = _schur(lam, [x**m for x in xs])
    for table in (dict(adams_generic(lam, m)), dict(adams_fixed(U(N), lam, m))):
        assert sum(c * _schur(mu, xs) for mu, c in table.items()) == lhs


@settings(max_examples=25, deadline=None, database=None)
@given(lam=partitions, mu=partitions, N=st.integers(2, 5))
def test_littlewood_richardson_dimensions(lam, mu, N):
    """dim(lam) dim(mu) = sum_nu c^nu dim(nu) for U(N) (common practice), and at a point
    s_lam s_mu = sum c^nu s_nu (Macdonald (1995) I.9)."""
    assume(len(lam) <= N and len(mu) <= N)
    lr = dict(littlewood_richardson(lam, mu))
    assert sum(c * _classical_dim(N, nu) for nu, c in lr.items() if len(nu) <= N) == \
        _classical_dim(N, lam) * _classical_dim(N, mu)
    xs = (2, 3, 7)
    assert sum(c * _schur(nu, xs) for nu, c in lr.items()) == _schur(lam, xs) * _schur(mu, xs)
