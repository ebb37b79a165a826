"""One exception tree for the whole package.

Every error raised on bad user input derives from :class:`KnotobsError`, so a
caller (and the command line) can catch one class and print a clear message
instead of a traceback.  Each subclass also derives from the closest builtin
(``ValueError``, ``TypeError``, ``ArithmeticError``) so ordinary Python code
that expects those keeps working.
"""

from __future__ import annotations

__all__ = [
    "KnotobsError",
    "InvalidKnotError",
    "InvalidRepresentationError",
    "InvalidGroupError",
    "InvalidSeifertDataError",
    "NotIntegrableError",
    "InexactDivisionError",
    "RingMismatchError",
    "ParseError",
    "SizeLimitError",
    "PrecisionError",
]


class KnotobsError(Exception):
    """Root of every error knotobs raises on purpose."""


class InvalidKnotError(KnotobsError, ValueError):
    """A knot or link description that does not name a valid object."""


class InvalidRepresentationError(KnotobsError, ValueError):
    """A partition, Dynkin label or representation that is not valid for the group."""


class InvalidGroupError(KnotobsError, ValueError):
    """A gauge group that knotobs does not know or that is degenerate (e.g. SU(1))."""


class InvalidSeifertDataError(KnotobsError, ValueError):
    """Seifert invariants that do not describe a Seifert manifold (e.g. gcd(a, b) != 1)."""


class NotIntegrableError(KnotobsError, ValueError):
    """A representation that is not integrable at the requested level."""


class InexactDivisionError(KnotobsError, ArithmeticError):
    """An exact division that leaves a remainder."""


class RingMismatchError(KnotobsError, TypeError):
    """Arithmetic between elements of different rings (e.g. polynomials in different variables)."""


class ParseError(KnotobsError, ValueError):
    """User text (a knot, group, partition, polynomial) that could not be parsed."""


class SizeLimitError(KnotobsError, ValueError):
    """A request so large that it would not finish in reasonable time or memory."""


class PrecisionError(KnotobsError, ArithmeticError):
    """A numeric value that could not be certified at the requested precision."""


class StoreError(KnotobsError, ValueError):
    """A results database that is corrupt, damaged, of a newer format, or not a knotobs store."""


class SchedulerError(KnotobsError, ConnectionError):
    """A distributed scheduler that cannot be reached or that failed while running a grid."""


class MissingDependencyError(KnotobsError, ImportError):
    """An optional extra (e.g. the dataset or the distributed runner) that is not installed."""


__all__ += ["StoreError", "SchedulerError", "MissingDependencyError"]
