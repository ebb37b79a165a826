"""Short words in S and T for elements of SL(2, Z) (the cost of the gluing route).

Every ``U`` in SL(2, Z) is ``+-(T^{n_1} S T^{n_2} S ... S T^{n_r})`` with
``S = [[0, -1], [1, 0]]`` and ``T = [[1, 1], [0, 1]]``; the first column ``(a, c)`` of ``U``
fixes ``n_1, ..., n_{r-1}`` through the continued fraction

    a/c = n_1 - 1/(n_2 - 1/(... - 1/n_{r-1}))

with arbitrary integer partial quotients, and ``n_r`` then follows from the second
column.  In the representation of SL(2, Z) by modular data, ``T`` is diagonal and ``S``
is the expensive step (a Fourier transform over the weight lattice), so the cost of
applying ``rho(U)`` to a vector is the number ``r - 1`` of ``S`` in the word.  The
negative (``ceil``) continued fraction can be very long (``7/6 = [2, 2, 2, 2, 2, 2]``);
choosing each quotient as the integer nearest to the current value (the nearest-integer
continued fraction: every remainder is at most half the denominator) gives the shortest word:
that expansion is of minimal length among all such expansions (O. Perron, *Die Lehre von den Kettenbrüchen*,
Teubner 1913, §40; common practice; checked against brute force in the tests), and it is
computed in ``O(log a)`` steps without search.

The sign ``-1 = S^2`` is returned separately: in modular data ``S^2 = C`` is the
charge conjugation, a permutation, which costs nothing.

Examples
--------
>>> shortest_word([[7, 1], [6, 1]])          # -(T S T^-6 S): two S instead of six
(True, [1, -6, 0])
>>> word_to_matrix([1, -6, 0])
((-7, -1), (-6, -1))
"""

from __future__ import annotations

from typing import Sequence

from knotobs.errors import InvalidSeifertDataError

__all__ = ["shortest_continued_fraction", "shortest_word", "word_to_matrix", "s_count"]


def word_to_matrix(word: Sequence[int]) -> tuple[tuple[int, int], tuple[int, int]]:
    """Matrix of ``T^{n_1} S T^{n_2} S ... S T^{n_r}``.

    >>> word_to_matrix([0, 0])          # S
    ((0, -1), (1, 0))
    """
    a, b, c, d = 1, 0, 0, 1
    for i, n in enumerate(word):
        if i:
            a, b, c, d = b, -a, d, -c
        a, b, c, d = a, a * n + b, c, c * n + d
    return (a, b), (c, d)


def _nearest_integer_expansion(p: int, q: int) -> list[int]:
    """Quotients of ``p/q`` (``q > 0``) choosing each as the integer nearest to the current value
    (ties: the smaller ``|n|``), so that every remainder has ``|r| <= q/2``."""
    out = []
    while True:
        if p % q == 0:
            out.append(p // q)
            return out
        lo = p // q
        r_lo = lo * q - p                  # in (-q, 0)
        n = lo if -r_lo < q + r_lo or (-r_lo == q + r_lo and abs(lo) <= abs(lo + 1)) else lo + 1
        r = n * q - p                      # p/q = n - 1/(q/r)
        out.append(n)
        p, q = (q, r) if r > 0 else (-q, -r)


def shortest_continued_fraction(p: int, q: int) -> list[int]:
    """Shortest ``[n_1, ..., n_m]`` with ``p/q = n_1 - 1/(n_2 - 1/(... - 1/n_m))``.

    >>> shortest_continued_fraction(7, 6), shortest_continued_fraction(-1, 2)
    ([1, -6], [0, 2])
    """
    if q == 0:
        raise InvalidSeifertDataError("p/0 has no continued fraction")
    if q < 0:
        p, q = -p, -q
    return _nearest_integer_expansion(p, q)


def shortest_word(U) -> tuple[bool, list[int]]:
    """``(negate, [n_1, ..., n_r])`` with ``U = (-1)^negate T^{n_1} S ... S T^{n_r}``, ``r`` minimal.

    Raises
    ------
    InvalidSeifertDataError
        If ``U`` is not in SL(2, Z).

    >>> shortest_word([[-1, 0], [0, -1]])
    (True, [0])
    >>> shortest_word([[0, -1], [1, 0]])
    (False, [0, 0])
    """
    (a, b), (c, d) = U
    if a * d - b * c != 1:
        raise InvalidSeifertDataError(f"{U} is not in SL(2,Z) (determinant must be 1)")
    if c == 0:
        # U = a * T^{ab} with a = +-1
        return (a < 0), [a * b]
    word = shortest_continued_fraction(a, c) + [0]
    (a2, b2), (c2, d2) = word_to_matrix(word)
    negate = (a2, c2) != (a, c)
    if negate:
        a2, b2, c2, d2 = -a2, -b2, -c2, -d2
    # U = W T^t with W's first column equal to U's: b = b2 + t a2, d = d2 + t c2
    t = (d - d2) // c2
    word[-1] += t
    (a3, b3), (c3, d3) = word_to_matrix(word)
    s = -1 if negate else 1
    if ((s * a3, s * b3), (s * c3, s * d3)) != ((a, b), (c, d)):  # pragma: no cover - defensive
        raise AssertionError(f"word {word} does not reproduce {U}")
    return negate, word


def s_count(word: Sequence[int]) -> int:
    """Number of ``S`` in ``T^{n_1} S ... S T^{n_r}`` (``r - 1``).

    >>> s_count([1, -6, 0])
    2
    """
    return max(len(word) - 1, 0)
