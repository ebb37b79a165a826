"""Finite-dimensional representations of the complexified group SL(N,C).

As a real Lie group, SL(N,C) has the finite-dimensional irreducible
representations ``V_lam (x) conj(V_lamt)``, labelled by a pair of SU(N) highest
weights ``(lam, lamt)``: ``lam`` acts holomorphically, ``lamt``
antiholomorphically.  Complex conjugation exchanges the two labels.  Every
SU(N) datum (Casimir, quantum dimension, weights) comes as a pair.

References
----------
D. P. Zhelobenko, *Compact Lie Groups and their Representations*, AMS (1973), ch. XVI;
E. Witten, Commun. Math. Phys. 137 (1991) 29–66 (the two couplings of complex
Chern–Simons theory act on the two factors).
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from fractions import Fraction

from knotobs.errors import ParseError
from knotobs.polynomials.laurent import Laurent
from knotobs.representations.groups import SU, Group, casimir, dimension, quantum_dimension
from knotobs.representations.partitions import Partition, parse_partition

__all__ = ["ComplexRep", "parse_complex_group"]

_SLNC = re.compile(r"^\s*SL\s*\(\s*(\d+)\s*,\s*C\s*\)\s*$", re.IGNORECASE)


def parse_complex_group(text: str) -> int:
    """``"SL(N,C)"`` -> ``N``.

    >>> parse_complex_group("SL(3,C)")
    3
    """
    m = _SLNC.match(str(text))
    if not m:
        raise ParseError(f"cannot read complex group {text!r}: write SL(N,C), e.g. SL(2,C)")
    SU(int(m.group(1)))  # validates N >= 2
    return int(m.group(1))


@dataclass(frozen=True)
class ComplexRep:
    """The SL(N,C) representation ``V_lam (x) conj(V_lamt)``.

    Examples
    --------
    >>> r = ComplexRep(2, (1,), (2,))
    >>> r.dimension, r.casimirs
    (6, (Fraction(3, 4), Fraction(2, 1)))
    >>> r.conjugate()
    ComplexRep(N=2, lam=(2,), lamt=(1,))
    >>> ComplexRep(3, (1, 1, 1, 1), ())
    Traceback (most recent call last):
    ...
    knotobs.errors.InvalidRepresentationError: partition [1, 1, 1, 1] has 4 rows; SU(3) allows at most 3 rows

    References
    ----------
    Zhelobenko (1973), ch. XVI.
    """

    N: int
    lam: Partition
    lamt: Partition

    def __post_init__(self) -> None:
        g = SU(self.N)
        object.__setattr__(self, "lam", g.check(self.lam))
        object.__setattr__(self, "lamt", g.check(self.lamt))

    @property
    def group(self) -> Group:
        return SU(self.N)

    @property
    def dimension(self) -> int:
        return dimension(self.group, self.lam) * dimension(self.group, self.lamt)

    @property
    def casimirs(self) -> tuple[Fraction, Fraction]:
        """Holomorphic and antiholomorphic quadratic Casimirs."""
        return casimir(self.group, self.lam), casimir(self.group, self.lamt)

    def quantum_dimensions(self) -> tuple[Laurent, Laurent]:
        """``(dim_q(lam), dim_qt(lamt))`` in the two independent variables ``q`` and ``qt``."""
        return quantum_dimension(self.group, self.lam), quantum_dimension(self.group, self.lamt).rename("qt")

    def conjugate(self) -> "ComplexRep":
        """Complex conjugate representation: the labels are exchanged."""
        return ComplexRep(self.N, self.lamt, self.lam)

    def is_unitary_compact(self) -> bool:
        """True when the antiholomorphic label is trivial (an SU(N) representation)."""
        return self.lamt == ()

    @classmethod
    def parse(cls, N: int, text: str) -> "ComplexRep":
        """``"[2,1];[1]"`` -> ``ComplexRep(N, (2,1), (1,))`` (a single partition means ``lamt = []``)."""
        parts = [p for p in text.split(";")]
        if len(parts) == 1:
            return cls(N, parse_partition(parts[0]), ())
        if len(parts) != 2:
            raise ParseError(f"cannot read SL(N,C) representation {text!r}: write [lam];[lamt], e.g. [1];[2]")
        return cls(N, parse_partition(parts[0]), parse_partition(parts[1]))
