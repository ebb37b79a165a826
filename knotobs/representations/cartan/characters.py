"""Characters from a root system: weights (Freudenthal), dimensions, quantum dimensions, Casimirs,
Adams operations and tensor products (Brauer–Klimyk / Racah–Speiser).

All functions take a :class:`~knotobs.representations.cartan.rootsystem.RootSystem` and a highest
weight in Dynkin labels; nothing here depends on the Cartan family.

* Dominant weights of ``V(lam)``: the dominant ``mu <= lam`` (``lam - mu`` a sum of positive
  roots); they are reached from ``lam`` by subtracting positive roots through dominant weights
  (J. R. Stembridge, in *Combinatorics and physics*, Contemp. Math. (1998), "The partial order of
  dominant weights"); multiplicities by Freudenthal's formula
  ``m(mu) = 2 sum_{alpha>0} sum_{k>=1} m(mu + k alpha) (mu + k alpha, alpha) / (|lam+rho|^2 - |mu+rho|^2)``
  (Humphreys (1972), §22.3).
* Weyl dimension ``prod_{alpha>0} (lam + rho, alpha)/(rho, alpha)`` (Humphreys §24.3).
* Quantum dimension ``dim_q(lam) = sum_nu mult(nu) q^((nu, rho))`` (the character at ``q^rho``),
  equal to ``prod_{alpha>0} [(lam + rho, alpha)]/[(rho, alpha)]`` with
  ``[x] = (q^(x/2) - q^(-x/2))/(q^(1/2) - q^(-1/2))`` (Weyl's denominator formula); both are
  computed and the tests check one against the other.
* Casimir ``C(lam) = (lam, lam + 2 rho)/2`` (long roots of length^2 = 2; CONVENTIONS §2).
* Adams operation ``psi^m(lam) = sum_nu mult(nu) [m nu]`` where ``[mu]`` is the virtual
  character ``eps(w) V(w.(mu))`` (zero on a wall): Racah–Speiser / Brauer–Klimyk, CONVENTIONS §2.
* Tensor products ``V(lam) x V(mu) = sum_nu mult_mu(nu) [lam + nu]`` (Brauer–Klimyk;
  R. C. King, J. Phys. A 8 (1975) 429).
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache
from math import prod
from typing import Sequence

import numpy as np

from knotobs.errors import SizeLimitError
from knotobs.guard import require, seconds_for
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.cartan.rootsystem import RootSystem, Weight

__all__ = [
    "dominant_weights",
    "weights",
    "weyl_dimension",
    "quantum_dimension",
    "quantum_dimension_weyl",
    "casimir",
    "adams",
    "tensor",
    "MAX_DIMENSION",
]

#: Largest dimension of a representation whose weights are enumerated.
MAX_DIMENSION = 3_000_000


def weyl_dimension(R: RootSystem, lam: Sequence[int]) -> int:
    """Dimension by Weyl's formula ``prod_{alpha>0} (lam + rho, alpha)/(rho, alpha)``.

    Examples
    --------
    >>> from knotobs.representations.cartan import type_g
    >>> G = type_g.root_system(2)
    >>> weyl_dimension(G, (1, 0)), weyl_dimension(G, (0, 1)), weyl_dimension(G, (2, 0))
    (7, 14, 27)

    References
    ----------
    J. E. Humphreys, *Introduction to Lie Algebras and Representation Theory* (1972), §24.3.
    """
    lr = tuple(x + 1 for x in lam)
    num = prod(R.inner(lr, a) for a in R.positive_roots)
    den = prod(R.inner(R.rho, a) for a in R.positive_roots)
    v = num / den
    assert v.denominator == 1
    return int(v)


def _key(R: RootSystem, lam) -> tuple:
    return (R.name, R.simple_roots, tuple(lam))


@lru_cache(maxsize=2048)
def _dominant_cached(key) -> tuple[tuple[Weight, int], ...]:
    name, roots, lam = key
    R = _system(name, roots)
    pos = R.positive_roots
    found = {lam}
    order = [lam]
    k = 0
    while k < len(order):
        mu = order[k]
        for a in pos:
            nu = tuple(x - y for x, y in zip(mu, a))
            if nu not in found and all(x >= 0 for x in nu):
                found.add(nu)
                order.append(nu)
        k += 1
    lr = tuple(x + 1 for x in lam)
    top = R.inner(lr, lr)
    # process from the top: (lam - mu, rho) increasing
    order.sort(key=lambda mu: R.inner(tuple(x - y for x, y in zip(lam, mu)), R.rho))
    mult: dict[Weight, int] = {lam: 1}
    for mu in order[1:]:
        total = Fraction(0)
        for a in pos:
            k = 1
            while True:
                nu = tuple(x + k * y for x, y in zip(mu, a))
                dom, _ = R.to_dominant(nu)
                m = mult.get(dom, 0) if dom in found else 0
                if m == 0:
                    break
                total += m * R.inner(nu, a)
                k += 1
        mr = tuple(x + 1 for x in mu)
        val = 2 * total / (top - R.inner(mr, mr))
        assert val.denominator == 1
        if val:
            mult[mu] = int(val)
    return tuple((mu, mult[mu]) for mu in order if mult.get(mu))


_SYSTEMS: dict = {}


def _system(name, roots) -> RootSystem:
    key = (name, roots)
    if key not in _SYSTEMS:
        _SYSTEMS[key] = RootSystem(name, roots)
    return _SYSTEMS[key]


def _register(R: RootSystem) -> None:
    _SYSTEMS.setdefault((R.name, R.simple_roots), R)


def _check_size(R: RootSystem, lam) -> None:
    d = weyl_dimension(R, lam)
    if d > MAX_DIMENSION:
        raise SizeLimitError(
            f"the representation with Dynkin labels {tuple(lam)} of {R.name} has dimension {d};"
            f" at most {MAX_DIMENSION} weights are enumerated: choose a smaller representation"
        )
    require(f"weights of the {d}-dimensional representation {tuple(lam)} of {R.name}",
            seconds=seconds_for(d * R.rank * 4, "python"), accepted="choose a smaller representation")


def dominant_weights(R: RootSystem, lam: Sequence[int]) -> tuple[tuple[Weight, int], ...]:
    """Dominant weights of ``V(lam)`` with multiplicities (Freudenthal), highest first.

    Examples
    --------
    >>> from knotobs.representations.cartan import type_b
    >>> dominant_weights(type_b.root_system(2), (0, 2))      # adjoint of SO(5): e_1 + e_2, e_1, 0 (twice)
    (((0, 2), 1), ((1, 0), 1), ((0, 0), 2))
    >>> [m for _, m in dominant_weights(type_b.root_system(2), (1, 0))]
    [1, 1]

    References
    ----------
    Humphreys (1972), §22.3 (Freudenthal's formula).
    """
    _register(R)
    lam = tuple(int(x) for x in lam)
    _check_size(R, lam)
    return _dominant_cached(_key(R, lam))


@lru_cache(maxsize=1024)
def _weights_cached(key) -> tuple[tuple[Weight, ...], tuple[int, ...]]:
    name, roots, lam = key
    R = _system(name, roots)
    ws: list[Weight] = []
    ms: list[int] = []
    for mu, m in _dominant_cached(key):
        for w in R.orbit(mu):
            ws.append(w)
            ms.append(m)
    return tuple(ws), tuple(ms)


def weights(R: RootSystem, lam: Sequence[int]) -> dict[Weight, int]:
    """All weights of ``V(lam)`` (Dynkin labels) with multiplicities.

    >>> from knotobs.representations.cartan import type_a
    >>> sorted(weights(type_a.root_system(2), (1, 0)).items())
    [((-1, 1), 1), ((0, -1), 1), ((1, 0), 1)]
    """
    dominant_weights(R, lam)
    ws, ms = _weights_cached(_key(R, tuple(int(x) for x in lam)))
    return dict(zip(ws, ms))


def weight_arrays(R: RootSystem, lam: Sequence[int]) -> tuple[np.ndarray, np.ndarray]:
    """Weights (rows, Dynkin labels) and multiplicities as numpy integer arrays."""
    dominant_weights(R, lam)
    ws, ms = _weights_cached(_key(R, tuple(int(x) for x in lam)))
    return np.array(ws, dtype=np.int64).reshape(len(ws), R.rank), np.array(ms, dtype=np.int64)


def casimir(R: RootSystem, lam: Sequence[int]) -> Fraction:
    """Quadratic Casimir ``C(lam) = (lam, lam + 2 rho)/2``, long roots of length^2 = 2.

    >>> from knotobs.representations.cartan import type_a, type_g
    >>> casimir(type_a.root_system(1), (1,)), casimir(type_g.root_system(2), (0, 1))
    (Fraction(3, 4), Fraction(4, 1))
    """
    lam = tuple(lam)
    return R.inner(lam, tuple(x + 2 for x in lam)) / 2


def quantum_dimension(R: RootSystem, lam: Sequence[int], var: str = "q") -> Laurent:
    """``dim_q(lam) = sum_nu mult(nu) q^((nu, rho))`` as an exact Laurent polynomial.

    >>> from knotobs.representations.cartan import type_a
    >>> quantum_dimension(type_a.root_system(1), (2,))
    Laurent('q^-1 + 1 + q')
    """
    ws, ms = weight_arrays(R, lam)
    D = R.form_denominator
    ex = ws @ (R.form_int @ np.ones(R.rank, dtype=np.int64))  # D (nu, rho)
    acc: dict[int, int] = {}
    for e, m in zip(ex.tolist(), ms.tolist()):
        acc[e] = acc.get(e, 0) + m
    return Laurent.from_terms({Fraction(e, D): c for e, c in acc.items()}, var=var).canonical()


def quantum_dimension_weyl(R: RootSystem, lam: Sequence[int], var: str = "q") -> Laurent:
    """``prod_{alpha>0} [(lam + rho, alpha)]/[(rho, alpha)]`` (Weyl's formula, exact division).

    >>> from knotobs.representations.cartan import type_c
    >>> quantum_dimension_weyl(type_c.root_system(1), (2,)) == quantum_dimension(type_c.root_system(1), (2,))
    True
    """
    _register(R)
    return _qdim_weyl_cached(_key(R, tuple(int(x) for x in lam)), var)


@lru_cache(maxsize=8192)
def _qdim_weyl_cached(key, var: str) -> Laurent:
    name, roots, lam = key
    R = _system(name, roots)
    lr = tuple(x + 1 for x in lam)
    num = Laurent.one(var)
    den = Laurent.one(var)
    for a in R.positive_roots:
        x, y = R.inner(lr, a), R.inner(R.rho, a)
        if x == y:
            continue
        num = num * (Laurent.monomial(x / 2, var=var) - Laurent.monomial(-x / 2, var=var))
        den = den * (Laurent.monomial(y / 2, var=var) - Laurent.monomial(-y / 2, var=var))
    return num.exact_div(den).canonical()


def adams(R: RootSystem, lam: Sequence[int], m: int) -> dict[Weight, int]:
    """Adams operation ``psi^m(lam) = sum_mu c_mu V(mu)`` by Brauer–Klimyk on the weights of ``lam``.

    Examples
    --------
    >>> from knotobs.representations.cartan import type_a
    >>> adams(type_a.root_system(1), (1,), 3)           # SU(2): psi^3(V_1) = V_3 - V_1
    {(3,): 1, (1,): -1}

    References
    ----------
    CONVENTIONS §2; R. C. King, J. Phys. A 8 (1975) 429.
    """
    if not isinstance(m, int) or m < 1:
        raise ValueError(f"Adams operation psi^{m}: m must be a positive integer")
    acc: dict[Weight, int] = {}
    for nu, mult in weights(R, lam).items():
        sign, mu = R.dot_dominant(tuple(m * x for x in nu))
        if sign:
            acc[mu] = acc.get(mu, 0) + sign * mult
    return {k: v for k, v in sorted(acc.items(), key=lambda kv: -R.inner(kv[0], R.rho)) if v}


def tensor(R: RootSystem, parts: Sequence[Sequence[int]]) -> dict[Weight, int]:
    """``V(lam_1) x ... x V(lam_d) = sum_nu N_nu V(nu)`` (Brauer–Klimyk).

    >>> from knotobs.representations.cartan import type_a
    >>> tensor(type_a.root_system(1), [(1,), (1,)])
    {(2,): 1, (0,): 1}
    """
    acc: dict[Weight, int] = {(0,) * R.rank: 1}
    for lam in parts:
        wts = weights(R, lam)
        new: dict[Weight, int] = {}
        for nu, c in acc.items():
            for w, mult in wts.items():
                sign, mu = R.dot_dominant(tuple(x + y for x, y in zip(nu, w)))
                if sign:
                    new[mu] = new.get(mu, 0) + sign * c * mult
        acc = {k: v for k, v in new.items() if v}
    return dict(sorted(acc.items(), key=lambda kv: -R.inner(kv[0], R.rho)))
