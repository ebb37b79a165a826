"""Torus knots and torus links in the 3-sphere.

Convention (common practice): ``T(p, q)`` is the closure of the braid
``(sigma_1 ... sigma_{p-1})^q`` on ``p`` strands, each ``sigma_i`` a positive
crossing.  ``T(2, 3)`` is the positive (right-handed) trefoil, the one whose
Jones polynomial is ``t + t^3 - t^4``.  ``T(p, -q)`` is the mirror image of
``T(p, q)``; ``T(p, q)`` and ``T(q, p)`` are isotopic; ``T(-p, -q) = T(p, q)``
up to reversing every orientation, which no invariant here sees.

``T(p, q)`` with ``d = gcd(p, q) > 1`` is a link of ``d`` components, each a
torus knot ``T(p/d, q/d)``, any two of which link ``(p/d)(q/d)`` times (with
all components oriented parallel, as in the braid closure).
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from math import gcd

from knotobs.errors import InvalidKnotError, ParseError, SizeLimitError

__all__ = ["TorusLink", "parse_knot", "MAX_TORUS_PARAMETER"]

#: Largest ``|p|`` or ``|q|`` accepted.  Beyond this the exact invariants have
#: far too many terms to be useful (the degree grows like ``p q``).
MAX_TORUS_PARAMETER = 10_000

_PATTERN = re.compile(r"^\s*T\s*\(\s*([+-]?\d+)\s*,\s*([+-]?\d+)\s*\)\s*$", re.IGNORECASE)


@dataclass(frozen=True)
class TorusLink:
    """The torus knot or link ``T(p, q)`` in the 3-sphere.

    Parameters
    ----------
    p, q : int
        Nonzero integers.  ``gcd(|p|, |q|)`` is the number of components.

    Attributes
    ----------
    P, Q : int
        Positive parameters of one component: ``P = |p|/d``, ``Q = |q|/d``.
    components : int
        ``d = gcd(|p|, |q|)``.
    chirality : int
        ``+1`` for the positive link (``p q > 0``), ``-1`` for its mirror.

    Examples
    --------
    >>> k = TorusLink(2, 3)
    >>> k.is_knot, k.components, k.chirality
    (True, 1, 1)
    >>> TorusLink(4, 6).components, TorusLink(4, 6).linking_number
    (2, 6)
    >>> TorusLink(3, 1).is_unknot
    True

    References
    ----------
    D. Rolfsen, *Knots and Links*, Publish or Perish (1976), section 3.C.
    """

    p: int
    q: int

    def __post_init__(self) -> None:
        for name, v in (("p", self.p), ("q", self.q)):
            if isinstance(v, bool) or not isinstance(v, int):
                raise InvalidKnotError(f"torus parameter {name}={v!r} must be an integer")
            if v == 0:
                raise InvalidKnotError(
                    f"torus parameter {name}=0 is not allowed: T(p,q) needs nonzero p and q"
                )
            if abs(v) > MAX_TORUS_PARAMETER:
                raise SizeLimitError(
                    f"torus parameter {name}={v} is too large; |p|, |q| <= {MAX_TORUS_PARAMETER}"
                )

    # ------------------------------------------------------------------ data
    @property
    def components(self) -> int:
        return gcd(abs(self.p), abs(self.q))

    @property
    def is_knot(self) -> bool:
        return self.components == 1

    @property
    def P(self) -> int:
        return abs(self.p) // self.components

    @property
    def Q(self) -> int:
        return abs(self.q) // self.components

    @property
    def chirality(self) -> int:
        return 1 if self.p * self.q > 0 else -1

    @property
    def is_unknot(self) -> bool:
        return self.is_knot and min(self.P, self.Q) == 1

    @property
    def linking_number(self) -> int:
        """Linking number of any two components (parallel orientation); 0 for a knot."""
        if self.is_knot:
            return 0
        return self.chirality * self.P * self.Q

    @property
    def positive(self) -> "TorusLink":
        """The positive member of the mirror pair, with ``0 < p <= q`` order kept."""
        return TorusLink(abs(self.p), abs(self.q))

    def mirror(self) -> "TorusLink":
        """The mirror image ``T(p, -q)``."""
        return TorusLink(self.p, -self.q)

    def require_knot(self) -> "TorusLink":
        """Return ``self`` or raise if this is a link of several components."""
        if not self.is_knot:
            raise InvalidKnotError(
                f"{self} is a {self.components}-component link (gcd({abs(self.p)},{abs(self.q)})"
                f" = {self.components}); a knot needs coprime parameters"
            )
        return self

    def __str__(self) -> str:
        return f"T({self.p},{self.q})"

    @classmethod
    def parse(cls, text: str) -> "TorusLink":
        """Parse ``"T(p,q)"`` (spaces and signs allowed).

        >>> TorusLink.parse("T(2, -5)")
        TorusLink(p=2, q=-5)
        """
        if isinstance(text, TorusLink):
            return text
        m = _PATTERN.match(str(text))
        if not m:
            raise ParseError(
                f"cannot read knot {text!r}: write a torus knot or link as T(p,q), e.g. T(2,3)"
            )
        return cls(int(m.group(1)), int(m.group(2)))


def parse_knot(text: "str | TorusLink") -> TorusLink:
    """Parse a knot description (currently torus knots and links ``T(p,q)``).

    >>> parse_knot("T(3,-4)").mirror()
    TorusLink(p=3, q=4)"""
    return TorusLink.parse(text)
