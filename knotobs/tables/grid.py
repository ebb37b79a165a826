"""Grids of observables: computed in parallel, stored in SQLite, resumable, optionally on Dask.

A :class:`GridSpec` lists knots x representations x levels (``None`` = generic q) for
one quantity.  Each grid point has a canonical *description* (a JSON object that
includes the package version); its SHA-256 is the row's primary key in the
:class:`~knotobs.tables.store.GridStore`.  :func:`run_grid`

1. validates the whole specification before anything runs (a malformed knot,
   group, partition or level is an error, and nothing is written);
2. skips every point whose key is already stored (resume);
3. computes the rest in worker processes (a local ``ProcessPoolExecutor``, 2 workers
   by default) or on a Dask distributed cluster given its scheduler address; workers
   only compute and return rows;
4. inserts rows from the parent process over one writer connection,
   ``INSERT OR IGNORE`` in short transactions, so an interrupted run keeps every
   finished row whole and a concurrent writer never loses or duplicates one.

Level rows: the exact generic-q polynomial evaluated at ``q = exp(2 pi i/(k+N))``
(:meth:`~knotobs.polynomials.laurent.Laurent.at_root_of_unity`), which for an
integrable colour equals the normalised Chern–Simons expectation value
(CONVENTIONS §6); the numeric value is checked against a run with more digits.
Every row's description says so.
"""

from __future__ import annotations

import concurrent.futures as cf
import json
import math
import os
import re
import sqlite3
import sys
import threading
import time
import uuid
from dataclasses import dataclass, field
from math import gcd
from typing import Any, Callable, Iterable, Sequence

import mpmath

from knotobs.numerics import working_precision

from knotobs.errors import (
    NotIntegrableError,
    InvalidRepresentationError,
    KnotobsError,
    MissingDependencyError,
    ParseError,
    PrecisionError,
    SchedulerError,
    SizeLimitError,
    StoreError,
)
from knotobs.evaluation.families import colored_jones, homfly, wilson_loop
from knotobs.evaluation.modular import check_integrable
from knotobs.fibrations.torus import TorusLink, parse_knot
from knotobs.representations.groups import parse_group
from knotobs.representations.partitions import as_partition
from knotobs.tables.store import GridStore, canonical_json, description_key, point_key, store_write_error
from knotobs._notebook import NotebookMixin

__all__ = ["GridSpec", "GridReport", "run_grid", "resume_grid", "grid_status", "compute_row", "torus_knots",
           "QUANTITIES", "MAX_GRID_POINTS", "MAX_GRID_LEVEL", "max_workers", "torus_knot_count",
           "check_scheduler", "observable_document"]

#: Quantities a grid can hold.
QUANTITIES = ("wilson-loop", "colored-jones", "homfly")
#: Largest number of points in one grid.
MAX_GRID_POINTS = 200_000
#: Largest level of a grid row (the finite-level routes stop at roots of unity of order 2 * 10^6).
MAX_GRID_LEVEL = 1_000_000


def max_workers() -> int:
    """Most local worker processes a grid starts: 4 per core (at least 4), at most 64.

    >>> 4 <= max_workers() <= 64
    True
    """
    return max(4, min(64, 4 * (os.cpu_count() or 1)))


def torus_knot_count(max_pq: int, links: bool = False) -> float:
    """Estimated number of torus knots ``T(P,Q)``, ``2 <= P < Q``, ``P*Q <= max_pq`` (without listing them).

    ``sum_P (max_pq/P - P)`` pairs, of which a fraction ``6/pi^2`` is coprime (common practice).

    >>> abs(torus_knot_count(1000) - len(torus_knots(1000))) < 0.2 * len(torus_knots(1000))
    True
    """
    M = float(max_pq)
    top = int(math.isqrt(int(max_pq)))
    pairs = sum(max(0.0, M / P - P) for P in range(2, top + 1)) if top < 10**6 else (
        M * (math.log(top) + 0.5772 - 1) - top * top / 2)
    return pairs if links else pairs * 6 / math.pi ** 2


def _max_pq_allowed(limit: int) -> int:
    lo, hi = 6, 10**12
    while lo < hi:
        mid = (lo + hi + 1) // 2
        if torus_knot_count(mid) <= limit:
            lo = mid
        else:
            hi = mid - 1
    return lo


_SCHEDULER = re.compile(r"^(tcp|tls|ws|wss|ucx)://(\[[0-9a-fA-F:]+\]|[A-Za-z0-9_.-]+)(:\d{1,5})?/?$"
                        r"|^inproc://[^\s/]+/\S+$")


def check_scheduler(address) -> str:
    """A Dask scheduler address of the form ``tcp://host:port`` (checked before connecting).

    >>> check_scheduler("tcp://127.0.0.1:8786")
    'tcp://127.0.0.1:8786'
    >>> check_scheduler("tcp://")
    Traceback (most recent call last):
    ...
    knotobs.errors.SchedulerError: scheduler address 'tcp://' is not an address: write PROTOCOL://HOST:PORT, e.g. tcp://127.0.0.1:8786
    """
    if not isinstance(address, str) or not address.strip():
        raise SchedulerError(f"scheduler address {address!r} is empty; give e.g. tcp://127.0.0.1:8786")
    a = address.strip()
    if not _SCHEDULER.match(a):
        raise SchedulerError(f"scheduler address {address!r} is not an address: write PROTOCOL://HOST:PORT,"
                             " e.g. tcp://127.0.0.1:8786")
    return a

_LEVEL_METHOD = ("exact generic-q polynomial evaluated at q = exp(2 pi i/(k+N)) (root-of-unity value;"
                 " equals the normalised Chern-Simons expectation value for an integrable colour)")


def _version() -> str:
    from knotobs import __version__

    return __version__


def canonical_knot(knot) -> str:
    """``T(p,q)`` with ``|p| <= |q|``, ``p > 0`` and the sign (chirality) on ``q``.

    >>> canonical_knot("T(5, -2)"), canonical_knot("T(-3,-2)")
    ('T(2,-5)', 'T(2,3)')
    """
    k = parse_knot(knot)
    a, b = sorted((abs(k.p), abs(k.q)))
    return str(TorusLink(a, k.chirality * b))


def torus_knots(max_pq: int, links: bool = False, min_p: int = 2) -> list[str]:
    """Positive torus knots ``T(P,Q)``, ``min_p <= P < Q``, ``gcd = 1``, ``P*Q <= max_pq``
    (and torus links ``T(P,Q)``, ``P <= Q``, ``gcd > 1`` with ``links=True``).

    >>> torus_knots(15)
    ['T(2,3)', 'T(2,5)', 'T(2,7)', 'T(3,4)', 'T(3,5)']
    """
    if not isinstance(max_pq, int) or max_pq < 1:
        raise KnotobsError(f"max_pq={max_pq!r} must be a positive integer")
    n = torus_knot_count(max_pq, links)
    if n > MAX_GRID_POINTS:
        raise SizeLimitError(
            f"max_pq = {max_pq} gives about {n:.2g} torus {'knots and links' if links else 'knots'}; a grid holds at"
            f" most {MAX_GRID_POINTS} points: use max_pq <= {_max_pq_allowed(MAX_GRID_POINTS // (3 if links else 1))}")
    out = []
    P = min_p
    while P * P <= max_pq:
        for Q in range(P, max_pq // P + 1):
            g = gcd(P, Q)
            if (g == 1 and Q > P) or (links and g > 1):
                out.append(f"T({P},{Q})")
        P += 1
    return sorted(out, key=lambda s: tuple(int(x) for x in s[2:-1].split(",")))


@dataclass(frozen=True)
class GridSpec:
    """A grid: knots x representations x levels for one quantity.

    Parameters
    ----------
    knots : sequence of str
        Torus knots or links ``T(p,q)`` (canonicalised: ``T(3,2)`` is ``T(2,3)``).
    group : str
        ``SU(N)`` or ``U(N)`` (``wilson-loop``); ignored by ``colored-jones`` (SU(2)) and
        ``homfly`` (generic N).
    reps : sequence of partitions
        Colours (the same on every component of a link).
    levels : sequence of (int or None)
        ``None`` for generic q, an integer ``k >= 1`` for ``q = exp(2 pi i/(k+N))``
        (``wilson-loop`` and ``colored-jones`` with SU(N) only).
    quantity : ``"wilson-loop"``, ``"colored-jones"`` or ``"homfly"``
    normalized : bool
    framing : int
        Framing of every component relative to the zero (Seifert) framing (``wilson-loop``).
    dps : int
        Decimal digits of level rows.
    skip_nonintegrable : bool
        Leave out level rows whose colour is not integrable at that level (otherwise an error).

    Examples
    --------
    >>> spec = GridSpec(["T(2,3)", "T(3,2)"], "SU(2)", [[1], [2]], [None, 3])
    >>> spec.knots, len(spec.points())
    (('T(2,3)',), 4)
    """

    knots: tuple
    group: str = "SU(2)"
    reps: tuple = ((1,),)
    levels: tuple = (None,)
    quantity: str = "wilson-loop"
    normalized: bool = True
    framing: int = 0
    dps: int = 30
    skip_nonintegrable: bool = True

    def __post_init__(self) -> None:
        if isinstance(self.knots, str):
            raise ParseError(f"knots must be a list of T(p,q), not the string {self.knots!r}")
        knots = []
        for k in self.knots:
            c = canonical_knot(k)
            if c not in knots:
                knots.append(c)
        if not knots:
            raise KnotobsError("a grid needs at least one knot")
        q = str(self.quantity).lower()
        if q not in QUANTITIES:
            raise KnotobsError(f"unknown grid quantity {self.quantity!r}: choose one of {', '.join(QUANTITIES)}")
        g = parse_group(self.group) if q == "wilson-loop" else parse_group("SU(2)") if q == "colored-jones" else None
        reps = []
        for r in self.reps:
            lam = as_partition(r)
            if g is not None:
                lam = g.check(lam)
            if q == "homfly" and not lam:
                raise InvalidRepresentationError("the HOMFLY-PT grid needs non-empty partitions, e.g. [1]")
            if lam not in reps:
                reps.append(lam)
        if not reps:
            raise KnotobsError("a grid needs at least one representation")
        levels = []
        for lv in self.levels:
            if lv is not None and (isinstance(lv, bool) or not isinstance(lv, int) or lv < 1):
                raise KnotobsError(f"level {lv!r} must be a positive integer or None (generic q)")
            if lv is not None and lv > MAX_GRID_LEVEL:
                raise SizeLimitError(f"level {lv} is above the largest level {MAX_GRID_LEVEL} knotobs evaluates"
                                     " (finite-level values need roots of unity of order about 2 * 10^6 at most)")
            if lv is not None and (q == "homfly" or (g is not None and g.kind != "SU")):
                raise KnotobsError(f"level {lv} needs SU(N) (q = exp(2 pi i/(k+N))); use generic q (level None; --level generic) for {q} / {self.group}")
            if lv not in levels:
                levels.append(lv)
        if not levels:
            raise KnotobsError("a grid needs at least one level (None for generic q)")
        if isinstance(self.framing, bool) or not isinstance(self.framing, int):
            raise KnotobsError(f"framing {self.framing!r} must be an integer")
        if self.framing and q != "wilson-loop":
            raise KnotobsError(f"framing applies to wilson-loop grids only (got {q})")
        if not isinstance(self.dps, int) or not 5 <= self.dps <= 1000:
            raise KnotobsError(f"dps={self.dps!r} must be an integer between 5 and 1000")
        object.__setattr__(self, "knots", tuple(knots))
        object.__setattr__(self, "quantity", q)
        object.__setattr__(self, "group", str(g) if g is not None else "U(N), generic N")
        object.__setattr__(self, "reps", tuple(reps))
        object.__setattr__(self, "levels", tuple(levels))
        n = len(knots) * len(reps) * len(levels)
        if n > MAX_GRID_POINTS:
            raise SizeLimitError(f"the grid has {n} points; at most {MAX_GRID_POINTS}")

    # -------------------------------------------------------------- serialisation
    def to_dict(self) -> dict:
        return {"knots": list(self.knots), "group": self.group, "reps": [list(r) for r in self.reps],
                "levels": list(self.levels), "quantity": self.quantity, "normalized": self.normalized,
                "framing": self.framing, "dps": self.dps, "skip_nonintegrable": self.skip_nonintegrable}

    @classmethod
    def from_stored(cls, d, where: str) -> "GridSpec":
        """:meth:`from_dict` for a specification read back from a store: damage is a :class:`StoreError`."""
        try:
            return cls.from_dict(d)
        except (KeyError, TypeError, ValueError, AttributeError, KnotobsError) as exc:
            what = f"missing {exc}" if isinstance(exc, KeyError) else f"{type(exc).__name__}: {exc}"
            raise StoreError(f"a grid specification in {where!r} is damaged ({what}); delete that row of"
                             " table specs, or use another store") from None

    @classmethod
    def from_dict(cls, d: dict) -> "GridSpec":
        d = dict(d)
        if d.get("group", "").startswith("U(N)"):
            d["group"] = "SU(2)"
        return cls(knots=tuple(d["knots"]), group=d["group"], reps=tuple(tuple(r) for r in d["reps"]),
                   levels=tuple(d["levels"]), quantity=d["quantity"], normalized=d["normalized"],
                   framing=d["framing"], dps=d["dps"], skip_nonintegrable=d.get("skip_nonintegrable", True))

    def key(self) -> str:
        return description_key({"spec": self.to_dict(), "version": _version()})

    # -------------------------------------------------------------- points
    def _integrable(self, lam, level) -> bool:
        g = parse_group(self.group) if self.quantity == "wilson-loop" else parse_group("SU(2)")
        try:
            check_integrable(lam, g.N, level)
        except NotIntegrableError:
            return False
        return True

    def points(self) -> list[dict]:
        """Canonical descriptions of every grid point (integrability filter applied)."""
        out = []
        version = _version()
        for k in self.knots:
            comps = parse_knot(k).components
            for lam in self.reps:
                for lv in self.levels:
                    if lv is not None and not self._integrable(lam, lv):
                        if self.skip_nonintegrable:
                            continue
                        raise KnotobsError(f"representation {list(lam)} is not integrable at level {lv} for"
                                           f" {self.group}; drop it or allow skipping")
                    d = {
                        "quantity": self.quantity, "knot": k, "manifold": "S^3", "group": self.group,
                        "rep": [list(lam)], "framing": [self.framing] * comps, "normalized": self.normalized,
                        "level": lv, "dps": self.dps if lv is not None else None, "version": version,
                        "method": ("exact polynomial at generic q (Rosso-Jones)" if lv is None else _LEVEL_METHOD),
                    }
                    out.append(d)
        return out


# ------------------------------------------------------------------ one row


def _compute(desc: dict):
    q = desc["quantity"]
    lam = tuple(desc["rep"][0])
    if q == "wilson-loop":
        return wilson_loop(desc["knot"], desc["group"], lam, desc["framing"][0] if len(desc["framing"]) == 1
                           else list(desc["framing"]), desc["normalized"])
    if q == "colored-jones":
        return colored_jones(desc["knot"], (lam[0] if lam else 0) + 1, normalized=desc["normalized"])
    return homfly(desc["knot"], lam, normalized=desc["normalized"], form="aq")


def _numeric(value, K: int, dps: int) -> tuple[str, str]:
    """Value at q = exp(2 pi i/K) to ``dps`` digits, checked against ``dps + 15`` digits."""
    a = value.at_root_of_unity(K, dps)
    b = value.at_root_of_unity(K, dps + 15)
    with working_precision(dps + 15):
        scale = max(abs(b), mpmath.mpf(1))
        if abs(a - b) > scale * mpmath.mpf(10) ** (-(dps - 2)):
            raise PrecisionError(f"value at K = {K} not stable at {dps} digits; raise dps")
    with working_precision(dps):
        b = mpmath.mpc(b)
        tol = scale * mpmath.mpf(10) ** (-(dps - 3))
        re = b.real if abs(b.real) > tol else mpmath.mpf(0)
        im = b.imag if abs(b.imag) > tol else mpmath.mpf(0)
        return mpmath.nstr(re, dps), mpmath.nstr(im, dps)


def _numeric_text(num: tuple[str, str]) -> str:
    re, im = num
    if mpmath.mpf(im) == 0:
        return re
    if im.startswith("-"):
        return f"{re} - {im[1:]}*I"
    return f"{re} + {im}*I"


def observable_document(desc: dict, result, numeric: tuple[str, str] | None) -> dict:
    """The JSON document of one grid row (schema ``observable`` of :mod:`knotobs.output.schema`)."""
    lv = desc["level"]
    N = None
    if lv is not None:
        N = parse_group(desc["group"] if desc["quantity"] == "wilson-loop" else "SU(2)").N
    return {
        "schema": "knotobs/observable/1",
        "quantity": desc["quantity"],
        "knot": desc["knot"],
        "manifold": desc["manifold"],
        "group": result.group,
        "representation": [list(c) for c in result.colours],
        "framing": list(result.profile.framing),
        "level": lv,
        "q": "generic" if lv is None else f"exp(2*pi*i/{lv + N})",
        "profile": result.profile.to_dict(),
        "variables": list(result.profile.variables),
        "exact": result.sympy_string(),
        "numeric": None if numeric is None else {"re": numeric[0], "im": numeric[1], "digits": desc["dps"],
                                                 "at": f"q = exp(2 pi i/K), K = k + N = {lv + N}"},
        "description": desc["method"],
        "version": desc["version"],
    }


#: mpmath's working precision and FLINT's ball precision are process-global settings, so
#: grid points computed in threads of one process (e.g. a multi-threaded Dask worker) are
#: computed one at a time; parallelism comes from processes.
_COMPUTE_LOCK = threading.Lock()


def compute_row(desc: dict, run_id: str = "") -> dict:
    """Compute one grid point; returns a complete store row (or ``{"key", "error"}``).

    Runs in a worker; touches no database.  Thread-safe (see ``_COMPUTE_LOCK``).
    """
    key = description_key(desc)
    t0 = time.perf_counter()
    try:
        with _COMPUTE_LOCK:
            res = _compute(desc)
            num = None
            if desc["level"] is not None:
                N = parse_group(desc["group"] if desc["quantity"] == "wilson-loop" else "SU(2)").N
                num = _numeric(res.value, desc["level"] + N, desc["dps"])
        doc = observable_document(desc, res, num)
    except KnotobsError as exc:
        return {"key": key, "error": f"{type(exc).__name__}: {exc}", "description": desc}
    except Exception as exc:  # a bug: keep the run going, report it
        return {"key": key, "error": f"internal error {type(exc).__name__}: {exc}", "description": desc}
    document = canonical_json(doc)
    return {
        "key": key, "description": canonical_json(desc), "quantity": desc["quantity"], "knot": desc["knot"],
        "grp": doc["group"], "rep": json.dumps(desc["rep"][0]), "level": desc["level"], "exact": doc["exact"],
        "numeric": None if num is None else _numeric_text(num),
        "digits": desc["dps"] if num is not None else None, "document": document, "version": desc["version"],
        "run_id": run_id, "created": time.time(), "seconds": time.perf_counter() - t0,
    }


def compute_batch(descs: list[dict], run_id: str = "") -> list[dict]:
    """:func:`compute_row` over a batch (one task for the pool or the cluster)."""
    return [compute_row(d, run_id) for d in descs]


# ------------------------------------------------------------------ running


@dataclass(repr=False)
class GridReport(NotebookMixin):
    """What :func:`run_grid` did."""

    store: str
    total: int
    already_stored: int
    computed: int
    inserted: int
    failed: list = field(default_factory=list)
    skipped_nonintegrable: int = 0
    seconds: float = 0.0
    run_id: str = ""
    backend: str = "local"

    @property
    def complete(self) -> bool:
        return not self.failed

    def to_json(self) -> dict[str, Any]:
        return {"kind": "grid-report", "store": self.store, "total": self.total,
                "already_stored": self.already_stored, "computed": self.computed, "inserted": self.inserted,
                "failed": self.failed, "skipped_nonintegrable": self.skipped_nonintegrable,
                "seconds": round(self.seconds, 3), "run_id": self.run_id, "backend": self.backend,
                "complete": self.complete}

    def describe(self) -> str:
        s = (f"grid -> {self.store}: {self.total} points, {self.already_stored} already stored, "
             f"{self.computed} computed, {self.inserted} new rows ({self.backend}, {self.seconds:.2f} s)")
        if self.skipped_nonintegrable:
            s += f"\n  {self.skipped_nonintegrable} level points skipped (colour not integrable at that level)"
        for f in self.failed:
            s += f"\n  FAILED {f['knot']} {f['rep']} level {f['level']}: {f['error']}"
        return s


class _Progress:
    def __init__(self, total: int, done: int, enabled: bool, stream=None):
        self.total, self.done, self.enabled = total, done, enabled
        self.stream = stream or sys.stderr
        self.t0 = time.perf_counter()
        self.last = 0.0
        self.show(force=True)

    def step(self, n: int = 1) -> None:
        self.done += n
        self.show()

    def show(self, force: bool = False) -> None:
        if not self.enabled:
            return
        now = time.perf_counter()
        if not force and now - self.last < 0.1 and self.done < self.total:
            return
        self.last = now
        width = 30
        frac = self.done / self.total if self.total else 1.0
        bar = "#" * int(frac * width) + "-" * (width - int(frac * width))
        self.stream.write(f"\rgrid [{bar}] {self.done}/{self.total} rows  {now - self.t0:6.1f} s")
        self.stream.flush()

    def close(self) -> None:
        if self.enabled:
            self.show(force=True)
            self.stream.write("\n")
            self.stream.flush()


def _batches(items: list, size: int) -> list[list]:
    return [items[i:i + size] for i in range(0, len(items), size)]


def _connect_dask(scheduler: str, timeout: float):
    try:
        from distributed import Client
    except ImportError:
        raise MissingDependencyError("running a grid on a Dask cluster needs the optional extra:"
                                     " pip install 'knotobs[dask]'") from None
    if not isinstance(scheduler, str) or not scheduler.strip():
        raise SchedulerError(f"scheduler address {scheduler!r} is empty; give e.g. tcp://127.0.0.1:8786")
    try:
        return Client(scheduler, timeout=timeout, set_as_default=False)
    except (OSError, TimeoutError, ValueError) as exc:
        raise SchedulerError(f"cannot reach the Dask scheduler at {scheduler!r} ({type(exc).__name__}: {exc});"
                             " check the address (e.g. tcp://127.0.0.1:8786) and that the scheduler is running") from None


def guard_points(points: list[dict]) -> None:
    """Refuse a grid, before any point is computed, when one of its points is over the limits.

    Each point is the exact polynomial at generic ``q`` (a level only evaluates it), so its
    estimate is that of the polynomial route (:func:`~knotobs.evaluation.estimates.polynomial_estimate`), taken once per knot and colour.  The
    grid as a whole is not bounded: it is stored point by point and resumable.

    >>> guard_points(GridSpec(["T(2,3)"], "SU(2)", [[1]], [None, 3]).points())
    """
    from knotobs.evaluation.estimates import polynomial_estimate
    from knotobs.evaluation.rosso_jones import colours_for
    from knotobs.guard import require

    seen = set()
    for d in points:
        key = (d["quantity"], d["knot"], d["group"], tuple(map(tuple, d["rep"])))
        if key in seen:
            continue
        seen.add(key)
        k = parse_knot(d["knot"])
        cols = colours_for(k, tuple(d["rep"][0]))
        q = d["quantity"]
        g = None if q == "homfly" else parse_group("SU(2)" if q == "colored-jones" else d["group"])
        sec, mem = polynomial_estimate(k, cols, g)          # homfly points are stored in (a, q)
        require(f"grid point {d['knot']} coloured by {d['rep'][0]} ({d['quantity']}, {d['group']})",
                seconds=sec, memory_mb=mem,
                accepted="leave the point out of the grid (a smaller colour or knot); nothing was computed")


def run_grid(spec: GridSpec, store: str, workers: int = 2, progress: bool = True,
             scheduler: str | None = None, batch_size: int | None = None,
             connect_timeout: float = 10.0, on_row: Callable[[dict], None] | None = None,
             lock_timeout: float = 60.0) -> GridReport:
    """Compute every missing point of ``spec`` and store it in the SQLite file ``store``.

    Parameters
    ----------
    spec : GridSpec
    store : str
        Path of the SQLite results store (created if missing).
    workers : int
        Local worker processes (``0``: compute in this process).  Ignored with ``scheduler``.
    progress : bool
        Print a progress bar on stderr.
    scheduler : str, optional
        Address of a Dask distributed scheduler (``tcp://host:8786``): run there instead.
    batch_size : int, optional
        Grid points per task (default: about 4 tasks per worker, at most 16 points).
    lock_timeout : float
        Seconds to wait while another process holds the store's write lock.

    Returns
    -------
    GridReport

    Examples
    --------
    >>> import tempfile, os
    >>> path = os.path.join(tempfile.mkdtemp(), "g.sqlite")
    >>> spec = GridSpec(["T(2,3)", "T(2,5)"], "SU(2)", [[1]], [None, 3])
    >>> run_grid(spec, path, workers=0, progress=False).inserted
    4
    >>> run_grid(spec, path, workers=0, progress=False).computed       # resumed: nothing left
    0

    References
    ----------
    Rosso–Jones (1993) for the values; CONVENTIONS §3, §6.
    """
    if not isinstance(spec, GridSpec):
        raise KnotobsError(f"run_grid needs a GridSpec, not {type(spec).__name__}")
    if not isinstance(workers, int) or isinstance(workers, bool) or workers < 0:
        raise KnotobsError(f"workers={workers!r} must be a non-negative integer")
    if workers > max_workers():
        raise KnotobsError(f"workers = {workers} is more than the {max_workers()} worker processes a grid may start"
                           f" here (4 per core, {os.cpu_count()} cores, at most 64); use workers <= {max_workers()}")
    if scheduler is not None:
        scheduler = check_scheduler(scheduler)
    t0 = time.perf_counter()
    run_id = uuid.uuid4().hex
    all_points = spec.points()
    n_skip = 0
    if spec.skip_nonintegrable:
        full = len(spec.knots) * len(spec.reps) * len(spec.levels)
        n_skip = full - len(all_points)
    keyed = [(point_key(d), d) for d in all_points]
    st = GridStore(store, timeout=lock_timeout)
    try:
        # points stored by any package version count as done (no recomputation, no duplicates)
        present = st.point_keys()
        todo = [d for k, d in keyed if k not in present]
        guard_points(todo)
        report = GridReport(st.path, len(keyed), len(keyed) - len(todo), 0, 0, [], n_skip, 0.0, run_id,
                            "dask" if scheduler else ("local" if workers else "in-process"))
        client = _connect_dask(scheduler, connect_timeout) if scheduler else None
        st.add_spec(spec.key(), spec.to_dict())
        if not todo:
            if client is not None:
                client.close()
            report.seconds = time.perf_counter() - t0
            return report
        nw = workers if not scheduler else 4
        size = batch_size or max(1, min(16, len(todo) // max(1, 4 * max(nw, 1))))
        batches = _batches(todo, size)
        bar = _Progress(len(keyed), report.already_stored, progress)

        def consume(rows: list[dict]) -> None:
            good = [r for r in rows if "error" not in r]
            for r in rows:
                if "error" in r:
                    d = r["description"]
                    report.failed.append({"knot": d["knot"], "rep": d["rep"][0], "level": d["level"], "error": r["error"]})
            report.computed += len(rows)
            if good:
                added = 0
                try:
                    st.conn.execute("BEGIN IMMEDIATE")
                    for r in good:
                        added += st.insert(r)
                    st.conn.execute("COMMIT")
                except BaseException as exc:
                    if st.conn.in_transaction:        # SQLite may have rolled back already (disk full)
                        try:
                            st.conn.execute("ROLLBACK")
                        except sqlite3.Error:
                            pass
                    if isinstance(exc, (sqlite3.Error, OSError)):
                        raise store_write_error(st.path, exc, report.already_stored + report.inserted) from None
                    raise
                report.inserted += added
            for r in good:
                if on_row is not None:
                    on_row(r)
            bar.step(len(rows))

        try:
            if client is not None:
                _run_dask(client, batches, run_id, consume)
            elif workers == 0:
                for b in batches:
                    consume(compute_batch(b, run_id))
            else:
                from knotobs.guard import current_limits

                lim = current_limits()
                with cf.ProcessPoolExecutor(max_workers=workers, initializer=_worker_init,
                                            initargs=(os.getpid(), lim.seconds, lim.memory_mb)) as ex:
                    futs = [ex.submit(compute_batch, b, run_id) for b in batches]
                    try:
                        for fut in cf.as_completed(futs):
                            consume(fut.result())
                    except BaseException:
                        for f in futs:
                            f.cancel()
                        raise
        finally:
            bar.close()
        report.seconds = time.perf_counter() - t0
        return report
    finally:
        st.close()


def _apply_limits(seconds: float, memory_mb: float) -> None:
    """Make the parent's size/time limits (``--max-seconds``, ``--max-memory``) those of this process."""
    os.environ["KNOTOBS_MAX_SECONDS"] = repr(float(seconds))
    os.environ["KNOTOBS_MAX_MEMORY_MB"] = repr(float(memory_mb))


def _worker_init(parent: int, seconds: float | None = None, memory_mb: float | None = None) -> None:
    """In each worker process: the parent's limits, and exit as soon as the parent process is gone
    (e.g. killed with -9)."""
    if seconds is not None and memory_mb is not None:
        _apply_limits(seconds, memory_mb)
    try:  # Linux: the kernel sends SIGTERM when the parent dies
        import ctypes
        import signal

        ctypes.CDLL("libc.so.6", use_errno=True).prctl(1, int(signal.SIGTERM))   # PR_SET_PDEATHSIG
    except (OSError, AttributeError):
        pass

    def watch() -> None:
        while True:
            if os.getppid() != parent:
                os._exit(1)
            time.sleep(0.5)

    threading.Thread(target=watch, name="knotobs-parent-watch", daemon=True).start()


def _run_dask(client, batches, run_id, consume) -> None:
    from distributed import as_completed

    try:
        with client.as_current():
            futs = client.map(compute_batch, batches, run_id=run_id, pure=False)
            for fut in as_completed(futs):
                consume(fut.result())
    except (OSError, TimeoutError) as exc:
        raise SchedulerError(f"the Dask cluster failed while running the grid ({type(exc).__name__}: {exc});"
                             " finished rows are stored: run again to resume") from None
    finally:
        client.close()


def resume_grid(store: str, workers: int = 2, progress: bool = True, scheduler: str | None = None) -> list[GridReport]:
    """Finish every grid specification recorded in ``store`` (computing only missing rows).

    >>> import tempfile, os
    >>> path = os.path.join(tempfile.mkdtemp(), "g.sqlite")
    >>> _ = run_grid(GridSpec(["T(2,3)"], "SU(2)", [[1]]), path, workers=0, progress=False)
    >>> [r.computed for r in resume_grid(path, workers=0, progress=False)]
    [0]
    """
    with GridStore(store) as st:
        specs = [GridSpec.from_stored(s, st.path) for s in st.specs()]
    if not specs:
        raise KnotobsError(f"the store {store!r} records no grid to resume; start one with 'knotobs grid run --store ...' (Python: knotobs.run_grid)")
    return [run_grid(s, store, workers, progress, scheduler) for s in specs]


def grid_status(store: str) -> dict:
    """Rows stored, and for every recorded grid how many of its points are missing.

    >>> import tempfile, os
    >>> path = os.path.join(tempfile.mkdtemp(), "g.sqlite")
    >>> _ = run_grid(GridSpec(["T(2,3)"], "SU(2)", [[1]]), path, workers=0, progress=False)
    >>> grid_status(path)["grids"][0]["missing"]
    0
    """
    with GridStore(store, readonly=True) as st:
        keys = st.point_keys()
        grids = []
        for d in st.specs():
            spec = GridSpec.from_stored(d, st.path)
            pts = [point_key(p) for p in spec.points()]
            grids.append({"quantity": spec.quantity, "group": spec.group, "points": len(pts),
                          "missing": sum(1 for k in pts if k not in keys), "spec": spec.to_dict()})
        return {"kind": "grid-status", "store": st.path, "rows": len(keys), "grids": grids}
