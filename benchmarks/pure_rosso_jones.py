"""A plain pure-Python Rosso–Jones evaluation of the coloured Jones polynomial (benchmark yardstick).

The same formula as :mod:`knotobs.evaluation.rosso_jones` (CONVENTIONS §3) written the
straightforward way: rational exponents as :class:`fractions.Fraction`, polynomials as
dictionaries ``{exponent: coefficient}``, the SU(2) Adams operation by Racah–Speiser on
the weights, quantum integers expanded term by term.  Only for SU(2) torus knots.  It is
used by ``bench_torus.py`` to print the speed-up of the array code in the same run, and
its result is compared with knotobs's there.

References: M. Rosso, V. F. R. Jones, J. Knot Theory Ramifications 2 (1993) 97–112.
"""

from __future__ import annotations

from fractions import Fraction


def _casimir_su2(a: int, b: int) -> Fraction:
    d = a - b
    return Fraction(d * (d + 2), 4)


def pure_colored_jones(p: int, q: int, n: int) -> dict:
    """``J_n(T(p, q))`` (``t = q^-1``, unknot = 1) as ``{Fraction exponent: int}``."""
    m, N = min(p, q), max(p, q)
    lam = (n - 1, 0)
    acc: dict = {}
    for k in range(n):                               # weights (n-1-k, k) of the colour
        v1, v2 = m * (n - 1 - k) + 1, m * k          # m * weight + delta
        if v1 == v2:
            continue
        sign = 1 if v1 > v2 else -1
        hi, lo = max(v1, v2), min(v1, v2)
        mu = (hi - 1, lo)
        acc[mu] = acc.get(mu, 0) + sign
    w: dict = {}
    ratio = Fraction(N, m)
    for mu, c in acc.items():
        if c == 0:
            continue
        e0 = _casimir_su2(*mu) * ratio
        d = mu[0] - mu[1] + 1                        # dim_q(mu) = [d]
        for j in range(d):
            e = e0 + Fraction(d - 1, 2) - j
            w[e] = w.get(e, 0) + c
    shift = -_casimir_su2(*lam) * m * N
    w = {e + shift: c for e, c in w.items() if c}
    # divide by [n] = (q^(n/2) - q^(-n/2)) / (q^(1/2) - q^(-1/2))
    num: dict = {}
    for e, c in w.items():
        for de, dc in ((Fraction(1, 2), 1), (Fraction(-1, 2), -1)):
            num[e + de] = num.get(e + de, 0) + c * dc
    # (q^n - 1) Q = q^(n/2) num: prefix sums along each class of exponents mod n
    num = {e + Fraction(n, 2): c for e, c in num.items() if c}
    # Q_k = -(A_k + A_(k-n) + A_(k-2n) + ...), every k of a class from its lowest exponent on
    out: dict = {}
    classes: dict = {}
    for e in num:
        classes.setdefault(e - (e // n) * n, []).append(e)
    top = max(num) - n
    for es in classes.values():
        es.sort()
        run, i, k = 0, 0, es[0]
        while k <= top:
            while i < len(es) and es[i] == k:
                run += num[es[i]]
                i += 1
            if run:
                out[k] = -run
            k += n
    return dict(sorted((-e, c) for e, c in out.items()))
