"""Exact Laurent polynomials in two variables ``(a, s)`` for HOMFLY-PT.

An element is ``sum_i a^i f_i(s)`` with integer ``i`` and each ``f_i`` a
:class:`~knotobs.polynomials.laurent.Laurent` polynomial in ``s`` (rational
exponents allowed in intermediate steps).  The HOMFLY-PT conventions of
knotobs (CONVENTIONS §1, §3): ``a = q^(N/2)``, ``s = q^(1/2)``, ``z = s - 1/s``.
"""

from __future__ import annotations

from fractions import Fraction
from typing import Iterable, Mapping

from knotobs.errors import InexactDivisionError, RingMismatchError
from knotobs.polynomials._format import format_terms, power
from knotobs.polynomials.laurent import Exponent, Laurent

__all__ = ["Laurent2", "z_power"]


class Laurent2:
    """Exact Laurent polynomial ``sum_i a^i f_i(s)``.

    Parameters
    ----------
    coeffs : mapping int -> Laurent
        The ``s``-polynomial in front of each power of ``a``.
    avar, svar : str
        Variable names (default ``"a"`` and ``"s"``).

    Examples
    --------
    >>> a, s = Laurent2.gen_a(), Laurent2.gen_s()
    >>> p = a**-2 * (s**2 + s**-2) - a**-4     # positive trefoil, CONVENTIONS §3
    >>> p.to_az_string()
    '2*a^-2 + a^-2*z^2 - a^-4'

    References
    ----------
    P. Freyd, D. Yetter, J. Hoste, W. B. R. Lickorish, K. Millett, A. Ocneanu,
    Bull. Amer. Math. Soc. 12 (1985) 239; J. Przytycki, P. Traczyk, Kobe J. Math. 4 (1987) 115.
    """

    __slots__ = ("c", "avar", "svar", "zpow", "_az")

    def __init__(self, coeffs: Mapping[int, Laurent] | None = None, avar: str = "a", svar: str = "s", zpow: int = 0):
        self.avar = avar
        self.svar = svar
        #: the element is ``z^zpow * sum_i a^i f_i(s)`` (links need negative powers of z)
        self.zpow = int(zpow)
        self._az = None
        self.c: dict[int, Laurent] = {}
        for i, f in (coeffs or {}).items():
            if f.var != svar:
                f = f.rename(svar)
            if not f.is_zero():
                self.c[int(i)] = f

    # ------------------------------------------------------------ builders
    @classmethod
    def gen_a(cls) -> "Laurent2":
        return cls({1: Laurent.one("s")})

    @classmethod
    def gen_s(cls) -> "Laurent2":
        return cls({0: Laurent.gen("s")})

    @classmethod
    def monomial(cls, a_exp: int, s_exp: Exponent = 0, coeff: int = 1) -> "Laurent2":
        return cls({a_exp: Laurent.monomial(s_exp, coeff, var="s")})

    @classmethod
    def from_s(cls, f: Laurent) -> "Laurent2":
        return cls({0: f})

    def coeff(self, i: int) -> Laurent:
        """The ``s``-polynomial in front of ``a^i``."""
        return self.c.get(i, Laurent.zero(self.svar))

    # ------------------------------------------------------------ arithmetic
    def _co(self, other):
        if isinstance(other, Laurent2):
            if (other.avar, other.svar) != (self.avar, self.svar):
                raise RingMismatchError("polynomials in different variables")
            if other.zpow or self.zpow:
                raise RingMismatchError("arithmetic with a z^k prefactor is not supported; use with_zpow(0)")
            return other
        if isinstance(other, int) and not isinstance(other, bool):
            return Laurent2({0: Laurent.one(self.svar) * other}, self.avar, self.svar)
        if isinstance(other, Laurent):
            return Laurent2({0: other}, self.avar, self.svar)
        return NotImplemented

    def __add__(self, other):
        other = self._co(other)
        if other is NotImplemented:
            return NotImplemented
        out = dict(self.c)
        for i, f in other.c.items():
            out[i] = out[i] + f if i in out else f
        return Laurent2(out, self.avar, self.svar)

    __radd__ = __add__

    def __neg__(self):
        return Laurent2({i: -f for i, f in self.c.items()}, self.avar, self.svar)

    def __sub__(self, other):
        other = self._co(other)
        if other is NotImplemented:
            return NotImplemented
        return self + (-other)

    def __rsub__(self, other):
        other = self._co(other)
        if other is NotImplemented:
            return NotImplemented
        return other + (-self)

    def __mul__(self, other):
        other = self._co(other)
        if other is NotImplemented:
            return NotImplemented
        out: dict[int, Laurent] = {}
        for i, f in self.c.items():
            for j, g in other.c.items():
                h = f * g
                out[i + j] = out[i + j] + h if (i + j) in out else h
        return Laurent2(out, self.avar, self.svar)

    __rmul__ = __mul__

    def __pow__(self, n: int) -> "Laurent2":
        if n < 0:
            if len(self.c) == 1:
                (i, f), = self.c.items()
                return Laurent2({-i * (-n): f ** n}, self.avar, self.svar)
            raise InexactDivisionError("negative power of a non-monomial")
        out = Laurent2({0: Laurent.one(self.svar)}, self.avar, self.svar)
        for _ in range(n):
            out = out * self
        return out

    def times_monomial(self, a_exp: int, s_exp: Exponent = 0, coeff: int = 1) -> "Laurent2":
        return Laurent2({i + a_exp: f.times_monomial(s_exp, coeff) for i, f in self.c.items()}, self.avar, self.svar)

    def exact_div_s(self, g: Laurent) -> "Laurent2":
        """Divide every coefficient exactly by a polynomial in ``s``."""
        return Laurent2({i: f.exact_div(g.rename(self.svar)) for i, f in self.c.items()}, self.avar, self.svar)

    def exact_div_binomial(self, k: int, g: Laurent) -> "Laurent2":
        """Exact division by ``a^k g(s) - 1`` (``k > 0``), by back substitution in ``a``.

        If ``self = (a^k g - 1) h`` then, comparing coefficients of ``a^i``,
        ``h_i = g h_{i-k} - self_i``; the recursion must leave no remainder.
        """
        if not self.c:
            return Laurent2({}, self.avar, self.svar)
        lo, hi = min(self.c), max(self.c)
        h: dict[int, Laurent] = {}
        for i in range(lo, hi - k + 1):
            val = -self.coeff(i)
            if (i - k) in h:
                val = val + g * h[i - k]
            if not val.is_zero():
                h[i] = val
        # the top k coefficients of self must equal g * h_{i-k}
        for i in range(hi - k + 1, hi + 1):
            expect = g * h[i - k] if (i - k) in h else Laurent.zero(self.svar)
            if not (expect - self.coeff(i)).is_zero():
                raise InexactDivisionError(f"not divisible by a^{k}*({g}) - 1")
        return Laurent2(h, self.avar, self.svar)

    def with_zpow(self, k: int) -> "Laurent2":
        """The element ``z^k * (sum_i a^i f_i(s))`` (the coefficients are kept as they are)."""
        return Laurent2(self.c, self.avar, self.svar, k)

    # ------------------------------------------------------------ maps
    def mirror(self) -> "Laurent2":
        """``a -> 1/a, s -> 1/s`` (the mirror image; ``z -> -z``)."""
        sign = -1 if self.zpow % 2 else 1
        return Laurent2({-i: f.mirror() * sign for i, f in self.c.items()}, self.avar, self.svar, self.zpow)

    def specialize(self, a_exp_in_q: Fraction, s_exp_in_q: Fraction = Fraction(1, 2), var: str = "q") -> Laurent:
        """Substitute ``a = q^a_exp_in_q`` and ``s = q^s_exp_in_q`` (e.g. ``a = q^(N/2)``)."""
        out = Laurent.zero(var)
        for i, f in self.c.items():
            out = out + f.subs_power(s_exp_in_q).rename(var).times_monomial(Fraction(a_exp_in_q) * i)
        if self.zpow:
            zq = (Laurent.gen("s") - Laurent.gen("s") ** -1).subs_power(s_exp_in_q).rename(var)
            if self.zpow > 0:
                out = out * zq ** self.zpow
            else:
                out = out.exact_div(zq ** (-self.zpow))
        return out

    def is_zero(self) -> bool:
        return not self.c

    def __eq__(self, other) -> bool:
        if isinstance(other, Laurent2) and (self.zpow or other.zpow):
            return self.to_az() == other.to_az()
        other = self._co(other)
        if other is NotImplemented:
            return NotImplemented
        return (self - other).is_zero()

    def __hash__(self):
        return hash((self.zpow, tuple(sorted((i, f) for i, f in self.c.items()))))

    # ------------------------------------------------------------ (a, z) form
    def to_az(self, max_inverse_z: int = 64) -> dict[tuple[int, int], int]:
        """Rewrite in ``z = s - 1/s``: ``{(i, j): c}`` for ``c a^i z^j`` (``j`` may be negative for links).

        Raises :class:`InexactDivisionError` if some coefficient is not a
        Laurent polynomial in ``z`` (it must be invariant under ``s -> -1/s``).  The
        conversion is :func:`knotobs.polynomials.zbasis.to_z` (divide and conquer, no
        quadratic basis change); the result is kept, so asking twice costs nothing.
        """
        if self._az is not None:
            return dict(self._az)
        out: dict[tuple[int, int], int] = {}
        for i, f in sorted(self.c.items()):
            for j, c in _to_z(f, max_inverse_z).items():
                out[(i, j + self.zpow)] = c
        self._az = out
        return dict(out)

    def to_az_string(self, avar: str = "a", zvar: str = "z") -> str:
        """Plain text of the ``(a, z)`` form, highest ``a`` power first."""
        terms = self.to_az()
        keys = sorted(terms, key=lambda ij: (-ij[0], ij[1]))
        return format_terms(((power(avar, i), power(zvar, j)), terms[(i, j)]) for i, j in keys)

    def to_aq(self) -> dict[tuple[int, Fraction], int]:
        """``{(i, e): c}`` for ``c a^i q^e`` with ``q = s^2`` (only without a ``z`` prefactor)."""
        if self.zpow:
            return self._zfree().to_aq()
        out = {}
        for i, f in sorted(self.c.items()):
            for e, c in f.terms().items():
                out[(i, e / 2)] = c
        return out

    def _zfree(self) -> "Laurent2":
        z = Laurent.gen(self.svar) - Laurent.gen(self.svar) ** -1
        base = Laurent2(self.c, self.avar, self.svar)
        if self.zpow > 0:
            return base * Laurent2.from_s(z ** self.zpow)
        return base.exact_div_s(z ** (-self.zpow))

    def to_aq_string(self, avar: str = "a", qvar: str = "q") -> str:
        """Plain text of the ``(a, q)`` form (``q = s^2``), highest ``a`` power first."""
        terms = self.to_aq()
        keys = sorted(terms, key=lambda ie: (-ie[0], ie[1]))
        return format_terms(((power(avar, i), power(qvar, e)), terms[(i, e)]) for i, e in keys)

    def to_sympy_aq(self):
        import sympy

        a, q = sympy.symbols(f"{self.avar} q")
        return sympy.Add(*[c * a**i * q ** sympy.Rational(e.numerator, e.denominator) for (i, e), c in self.to_aq().items()])

    def to_sympy_az(self):
        import sympy

        a, z = sympy.symbols(f"{self.avar} z")
        return sympy.Add(*[c * a**i * z**j for (i, j), c in self.to_az().items()])

    def to_string(self) -> str:
        """Plain text in ``(a, s)``."""
        parts = []
        for i, f in sorted(self.c.items(), reverse=True):
            mono = "" if i == 0 else (self.avar if i == 1 else f"{self.avar}^{i}")
            body = f.to_string()
            if mono:
                parts.append(f"{mono}*({body})")
            else:
                parts.append(f"({body})")
        return " + ".join(parts) if parts else "0"

    def __repr__(self) -> str:
        return f"Laurent2({self.to_string()!r})"

    __str__ = to_string


def z_power(j: int, var: str = "s") -> Laurent:
    """``(s - 1/s)^j`` for ``j >= 0`` as a Laurent polynomial in ``s``.

    >>> z_power(2)
    Laurent('s^-2 - 2 + s^2')"""
    z = Laurent.gen(var) - Laurent.gen(var) ** -1
    return z ** j


def _to_z(f: Laurent, max_inverse_z: int) -> dict[int, int]:
    """Write ``f(s)`` as ``sum_j c_j z^j``, ``z = s - 1/s``, allowing ``z^-m``."""
    from knotobs.polynomials.zbasis import is_z_invariant, to_z

    z = z_power(1, f.var)
    g = f
    for m in range(0, max_inverse_z + 1):
        if is_z_invariant(g):
            return {j - m: c for j, c in to_z(g).items()}
        g = g * z
    raise InexactDivisionError(f"{f} is not a Laurent polynomial in z = s - 1/s")


def _to_z_poly(g: Laurent) -> dict[int, int] | None:
    out: dict[int, int] = {}
    zs: dict[int, Laurent] = {}
    while not g.is_zero():
        d = g.max_exponent()
        if d.denominator != 1 or d < 0:
            return None
        d = int(d)
        c = g.coefficient(d)
        if d not in zs:
            zs[d] = z_power(d, g.var)
        g = g - zs[d] * c
        out[d] = c
    return out
