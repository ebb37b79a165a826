"""Data of SO(N) for generic N: the universal orthogonal character ring, as functions of ``a = q^((N-1)/2)``.

Representations of O(N)/SO(N) with ``l(mu) < N/2`` rows are labelled by partitions ``mu`` (highest
weight ``sum mu_i e_i``); their decompositions are independent of N once N is large
(the universal orthogonal characters of K. Koike, I. Terada, J. Algebra 107 (1987) 466–511).  Here:

* :func:`universal_adams` and :func:`universal_tensor`: Adams operations and tensor products in the
  universal ring, read off from the Cartan engine at ``SO(2r)`` with ``r`` larger than the number of
  boxes involved (then no modification rule applies and every label has fewer than ``r`` rows; the
  tests check that two ranks give the same answer);
* :func:`twist`: ``theta(mu) = q^C(mu) = a^|mu| s^kappa(mu)``, since
  ``C(mu) = (kappa(mu) + (N - 1)|mu|)/2`` (long roots of length^2 = 2; ``s = q^(1/2)``);
* :func:`quantum_dimension_factors`: Weyl's product ``prod_{alpha>0} [(mu + rho, alpha)]/[(rho, alpha)]``
  with ``rho_i = N/2 - i``, where the roots that involve only the empty rows ``j > l(mu)``
  cancel and the products over ``j`` telescope to a fixed number of factors (one derivation for
  ``B_n`` and ``D_n`` alike; the short roots ``e_i`` of ``B_n`` supply the factor that ``D_n`` gets
  from telescoping):

      dim_q(mu) = prod_{i<j<=l} [mu_i - mu_j - i + j] [N + mu_i + mu_j - i - j] / ([j - i] [N - i - j])
                  * prod_{i<=l} ([N - 2i + mu_i] + [mu_i]) / [N - 2i]
                                * prod_{k=1}^{mu_i} [N - i - l + k - 1] / [l - i + k],

  with ``[N + c] = (a s^(c+1) - a^-1 s^-(c+1))/(s - s^-1)``.  The tests check it against the engine
  for SO(N), N = 5..12 (the El Samra–King / Wenzl form of the same product).

References
----------
K. Koike, I. Terada, J. Algebra 107 (1987) 466–511; N. El Samra, R. C. King, J. Phys. A 12 (1979)
2317; H. Wenzl, Commun. Math. Phys. 133 (1990) 383–432; Humphreys (1972) §24.3.
"""

from __future__ import annotations

from functools import lru_cache
from typing import Sequence

from knotobs.errors import SizeLimitError
from knotobs.guard import require, seconds_for
from knotobs.polynomials.bivariate import Laurent2
from knotobs.representations.cartan.characters import adams, tensor
from knotobs.representations.cartan.group import SimpleGroup
from knotobs.representations.partitions import Partition, as_partition, kappa

__all__ = ["universal_adams", "universal_tensor", "twist", "quantum_dimension_factors", "from_labels"]

#: Largest number of boxes ``m |nu|`` in a universal Adams operation.
MAX_UNIVERSAL_BOXES = 40


def from_labels(G: SimpleGroup, labels: Sequence[int]) -> Partition:
    """The partition ``(mu_1, ..., mu_r)`` of a tensor highest weight of SO(2r) given by Dynkin labels."""
    vec = G.roots.to_orthonormal(labels)
    if any(x.denominator != 1 or x < 0 for x in vec):  # pragma: no cover - would be a bug
        raise ArithmeticError(f"{labels} is not a tensor weight with non-negative parts")
    return as_partition([int(x) for x in vec])


def _stable_group(boxes: int) -> SimpleGroup:
    if boxes > MAX_UNIVERSAL_BOXES:
        raise SizeLimitError(
            f"the universal orthogonal decomposition needs {boxes} boxes; at most {MAX_UNIVERSAL_BOXES} are handled"
            " (torus knots T(m, n) with m <= 40 in the vector representation)")
    return SimpleGroup("SO", 2 * (boxes + 2))


@lru_cache(maxsize=512)
def universal_adams(nu: Partition, m: int, extra_rank: int = 0) -> tuple[tuple[Partition, int], ...]:
    """``psi^m(o_nu) = sum_mu c_mu o_mu`` in the universal orthogonal character ring.

    ``extra_rank`` computes at a larger SO(2r) (used by the tests to check stability).

    Examples
    --------
    >>> dict(universal_adams((1,), 2))      # psi^2(V) = S^2 V - Lambda^2 V = o_2 + o_0 - o_11
    {(2,): 1, (1, 1): -1, (): 1}
    >>> dict(universal_adams((1,), 3))      # the o_1 terms of s_3, s_21 cancel
    {(3,): 1, (2, 1): -1, (1, 1, 1): 1}
    """
    nu = as_partition(nu)
    if m == 1 or not nu:
        return ((nu, 1),)
    boxes = m * sum(nu)
    G = _stable_group(boxes + extra_rank)
    require(f"universal Adams operation psi^{m} of {list(nu)} at {G}",
            seconds=seconds_for(G.rank ** (sum(nu) + 1) * 10, "python"), accepted="use a smaller torus knot")
    from knotobs.representations.cartan.type_d import dynkin_from_partition

    labels = dynkin_from_partition(nu, G.rank, str(G))
    out = []
    for mu, c in adams(G.roots, labels, m).items():
        out.append((from_labels(G, mu), c))
    out.sort(key=lambda t: (-sum(t[0]), [-x for x in t[0]]))
    return tuple(out)


@lru_cache(maxsize=512)
def universal_tensor(cols: tuple[Partition, ...], extra_rank: int = 0) -> tuple[tuple[Partition, int], ...]:
    """``o_lam1 x ... x o_lamd = sum_nu N_nu o_nu`` in the universal orthogonal character ring.

    >>> dict(universal_tensor(((1,), (1,))))      # V x V = S^2_0 V + Lambda^2 V + trivial
    {(2,): 1, (1, 1): 1, (): 1}
    """
    boxes = sum(sum(c) for c in cols)
    G = _stable_group(boxes + extra_rank)
    from knotobs.representations.cartan.type_d import dynkin_from_partition

    labels = [dynkin_from_partition(as_partition(c), G.rank, str(G)) for c in cols]
    out = [(from_labels(G, mu), c) for mu, c in tensor(G.roots, labels).items()]
    out.sort(key=lambda t: (-sum(t[0]), [-x for x in t[0]]))
    return tuple(out)


def twist(mu: Partition) -> tuple[int, int]:
    """``theta(mu) = a^e s^f``: returns ``(e, f) = (|mu|, kappa(mu))``.

    >>> twist((1,)), twist((2, 1))
    ((1, 0), (3, 0))
    """
    return sum(mu), kappa(mu)


def _qint_a(e: int) -> Laurent2:
    """``(s - 1/s) [N + e - 1] = a s^e - a^-1 s^-e``."""
    return Laurent2.monomial(1, e) - Laurent2.monomial(-1, -e)


def _qint_s(c: int) -> Laurent2:
    """``(s - 1/s) [c] = s^c - s^-c``."""
    return Laurent2.monomial(0, c) - Laurent2.monomial(0, -c)


@lru_cache(maxsize=4096)
def quantum_dimension_factors(mu: Partition) -> tuple[Laurent2, tuple[tuple[str, int], ...]]:
    """``dim_q(mu)`` of SO(N) for generic N as ``numerator / prod(denominator factors)``.

    A denominator factor ``("a", e)`` is ``a s^e - a^-1 s^-e`` (that is ``(s - 1/s) [N + e - 1]``) and
    ``("s", h)`` is ``s^h - s^-h``; the powers of ``s - 1/s`` cancel between numerator and denominator.

    Examples
    --------
    >>> num, den = quantum_dimension_factors((1,))          # [N - 1] + 1
    >>> num.to_string(), den
    ('a*(1) + (-s^-1 + s) + a^-1*(-1)', (('s', 1),))
    """
    mu = as_partition(mu)
    l = len(mu)
    num = [Laurent2.monomial(0, 0)]
    den: list[tuple[str, int]] = []
    for i in range(1, l + 1):
        mi = mu[i - 1]
        for j in range(i + 1, l + 1):
            mj = mu[j - 1]
            num.append(_qint_s(mi - mj - i + j))
            num.append(_qint_a(mi + mj - i - j + 1))
            den.append(("s", j - i))
            den.append(("a", 1 - i - j))
        # ([N - 2i + mu_i] + [mu_i]) / [N - 2i]
        num.append(_qint_a(1 - 2 * i + mi) + _qint_s(mi))
        den.append(("a", 1 - 2 * i))
        for k in range(1, mi + 1):
            num.append(_qint_a(-i - l + k))
            den.append(("s", l - i + k))
    # cancel equal factors between numerator and denominator where possible
    out = num[0]
    for f in num[1:]:
        out = out * f
    return _cancel(out, tuple(sorted(den)))


def _cancel(num: Laurent2, den: tuple[tuple[str, int], ...]) -> tuple[Laurent2, tuple[tuple[str, int], ...]]:
    """Divide out every denominator factor that divides the numerator exactly."""
    from knotobs.errors import InexactDivisionError

    keep = []
    for f in den:
        try:
            num = divide_factor(num, f)
        except InexactDivisionError:
            keep.append(f)
    return num, tuple(keep)


def divide_factor(x: Laurent2, f: tuple[str, int]) -> Laurent2:
    """Exact division by ``a s^e - a^-1 s^-e`` (``("a", e)``) or ``s^h - s^-h`` (``("s", h)``)."""
    from knotobs.polynomials.laurent import Laurent

    kind, e = f
    if kind == "s":
        s = Laurent.gen("s")
        return x.exact_div_s(s ** e - s ** (-e))
    # a s^e - a^-1 s^-e = a^-1 s^-e (a^2 s^(2e) - 1)
    return x.times_monomial(1, e).exact_div_binomial(2, Laurent.monomial(2 * e, var="s"))


def multiply_factor(x: Laurent2, f: tuple[str, int]) -> Laurent2:
    kind, e = f
    return x * (_qint_s(e) if kind == "s" else _qint_a(e))
