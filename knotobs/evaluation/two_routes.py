"""The polynomial routes in S^3 and the one rule for running them: one route, or both compared.

Every exact polynomial in S^3 has two independent routes (CONVENTIONS §3, §4): the
Rosso–Jones sum and the weight sum of the Seifert fibration.  ``route="both"`` computes
the two and raises :class:`RouteMismatchError` when they differ (which would be a bug).

>>> run_routes("both", lambda: 3, lambda: 3, "a check")
3
>>> run_routes("both", lambda: 3, lambda: 4, "T(2,3), SU(2), [1]")
Traceback (most recent call last):
...
knotobs.evaluation.two_routes.RouteMismatchError: Rosso-Jones and weight-sum disagree for T(2,3), SU(2), [1]
"""

from __future__ import annotations

from typing import Callable, TypeVar

from knotobs.errors import KnotobsError

__all__ = ["ROUTES", "RouteMismatchError", "run_routes"]

#: The polynomial routes.
ROUTES = ("rosso-jones", "weight-sum", "both")

T = TypeVar("T")


class RouteMismatchError(KnotobsError, ArithmeticError):
    """The two independent routes disagreed (a bug; please report it with the inputs)."""


def run_routes(route: str, rosso_jones: Callable[[], T], weight_sum: Callable[[], T], what: str) -> T:
    """The value by ``route``: ``rosso-jones``, ``weight-sum``, or ``both`` (computed and compared)."""
    if route not in ROUTES:
        raise KnotobsError(f"unknown route {route!r}: choose one of {', '.join(ROUTES)}")
    if route == "rosso-jones":
        return rosso_jones()
    if route == "weight-sum":
        return weight_sum()
    a, b = rosso_jones(), weight_sum()
    if a != b:
        raise RouteMismatchError(f"Rosso-Jones and weight-sum disagree for {what}")
    return a
