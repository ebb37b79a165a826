"""Benchmarks of the exact torus-knot evaluators (prints a table; not a test).

Run:  python benchmarks/bench_torus.py [--repeat 3] [--quick] [--cli]

Each row: the minimum wall time over ``--repeat`` runs (every cache of knotobs cleared
before each run), the size of the output, and beside it the *from-list yardstick*: the
time python-flint takes to build a polynomial of the same dense length from a Python
list of integers (a lower bound for producing the answer at all).  The first row also
times a plain pure-Python implementation of the same Rosso–Jones formula
(``benchmarks/pure_rosso_jones.py``: Fractions and dictionaries) and checks that it
gives the same polynomial, so the speed-up is measured in one run.  ``--cli`` adds the
command-line timings (a subprocess each, start-up included).
"""

from __future__ import annotations

import argparse
import functools
import os
import subprocess
import sys
import time

from flint import fmpz_poly

import knotobs
from knotobs import SU, TorusLink, colored_jones, homfly, rosso_jones, weight_sum
from knotobs.errors import KnotobsError
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from pure_rosso_jones import pure_colored_jones  # noqa: E402


def clear_caches() -> None:
    """Clear every functools cache in the knotobs modules that are loaded."""
    for name, mod in list(sys.modules.items()):
        if not name.startswith("knotobs") or mod is None:
            continue
        for obj in list(vars(mod).values()):
            if isinstance(obj, functools._lru_cache_wrapper):
                obj.cache_clear()


def timed(fn, repeat: int):
    best, out = float("inf"), None
    for _ in range(repeat):
        clear_caches()
        t0 = time.perf_counter()
        out = fn()
        best = min(best, time.perf_counter() - t0)
    return best, out


def dense_length(value) -> int:
    """Length of the FLINT polynomial(s) behind a result: what the yardstick builds."""
    if hasattr(value, "_p"):
        return value.canonical()._p.length()
    return sum(f.canonical()._p.length() for f in value.c.values())


def yardstick(length: int, repeat: int) -> float:
    data = [((i * 7919) % 11) - 5 for i in range(length)]
    best = float("inf")
    for _ in range(repeat):
        t0 = time.perf_counter()
        fmpz_poly(data)
        best = min(best, time.perf_counter() - t0)
    return best


def cli(args: list[str], repeat: int) -> float:
    best = float("inf")
    for _ in range(repeat):
        t0 = time.perf_counter()
        subprocess.run([os.path.join(os.path.dirname(sys.executable), "knotobs"), *args],
                       check=False, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
        best = min(best, time.perf_counter() - t0)
    return best


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--repeat", type=int, default=3)
    ap.add_argument("--quick", action="store_true", help="skip J_2000 and coloured HOMFLY-PT")
    ap.add_argument("--cli", action="store_true", help="also time the command line (start-up included)")
    ap.add_argument("--skip-60", action="store_true", help="skip HOMFLY-PT T(60,61) (for versions that do not refuse it)")
    args = ap.parse_args()
    r = args.repeat
    rows = []

    def attempt(fn):
        try:
            return timed(fn, r)
        except KnotobsError as exc:          # refused (e.g. by an older version's fixed limits)
            return None, str(exc)

    def row(name, target, fn_rj, fn_ws=None, extra=""):
        t, res = attempt(fn_rj)
        t2 = attempt(fn_ws)[0] if fn_ws is not None else None
        if t is None:
            rows.append((name, target, None, t2, 0, None, f"refused: {res[:70]}"))
            return None
        value = res.value if hasattr(res, "value") else res
        n = dense_length(value)
        rows.append((name, target, t, t2, n, yardstick(n, r), extra))
        return res

    res = row("J_200(T(3,4))", "< 0.01", lambda: colored_jones("T(3,4)", 200),
              lambda: colored_jones("T(3,4)", 200, route="weight-sum"))
    tp = float("inf")
    for _ in range(r):
        t0 = time.perf_counter()
        pure = pure_colored_jones(3, 4, 200)
        tp = min(tp, time.perf_counter() - t0)
    same = pure == res.value.terms()
    rows[-1] = rows[-1][:-1] + (f"pure Python {tp:.2f} s ({tp / rows[-1][2]:.0f}x), same: {same}",)
    row("J_800(T(3,4))", "< 0.25", lambda: colored_jones("T(3,4)", 800),
        lambda: colored_jones("T(3,4)", 800, route="weight-sum"))
    if not args.quick:
        row("J_2000(T(3,4))", "< 2", lambda: colored_jones("T(3,4)", 2000),
            lambda: colored_jones("T(3,4)", 2000, route="weight-sum"))
    row("HOMFLY-PT T(25,26) (a,z)", "< 0.1", lambda: _homfly_az("T(25,26)"))
    if not args.quick:
        row("HOMFLY-PT [3,2] T(7,9)", "< 5", lambda: homfly("T(7,9)", (3, 2)))
    row("SU(20) [1] T(5,7)", "< 0.02", lambda: rosso_jones(TorusLink(5, 7), SU(20), (1,)),
        lambda: weight_sum(TorusLink(5, 7), SU(20), (1,)))
    if not args.skip_60:
        # the former runaway case: refused at once or finished within 60 s and 2 GB
        row("HOMFLY-PT T(60,61) (a,z)", "< 60", lambda: _homfly_az("T(60,61)"))

    print(f"knotobs {getattr(knotobs, '__version__', '?')}; minimum of {r} runs, caches cleared before each")
    print(f"{'case':26s} {'target s':>8s} {'Rosso-Jones s':>13s} {'weight-sum s':>12s} {'length':>9s}"
          f" {'from-list s':>11s} {'ratio':>6s}  note")
    for name, target, t, t2, n, y, extra in rows:
        ws = f"{t2:12.4f}" if t2 is not None else f"{'-':>12s}"
        ts = f"{t:13.4f}" if t is not None else f"{'-':>13s}"
        ys = f"{y:11.4f}" if y else f"{'-':>11s}"
        ratio = f"{t / y:6.1f}" if (t is not None and y) else f"{'-':>6s}"
        print(f"{name:26s} {target:>8s} {ts} {ws} {n:9d} {ys} {ratio}  {extra}")
    if args.cli:
        print()
        print("command line (subprocess, start-up included):")
        cases = [("knotobs --help", ["--help"]),
                 ("J_200(T(3,4))", ["poly", "T(3,4)", "--family", "colored-jones", "--color", "200"]),
                 ("J_200(T(3,4)) --json", ["poly", "T(3,4)", "--family", "colored-jones", "--color", "200", "--json"])]
        if not args.skip_60:
            cases.append(("HOMFLY-PT T(60,61)", ["poly", "T(60,61)", "--family", "homfly"]))
        for label, a in cases:
            print(f"  {label:26s} {cli(a, r):8.3f} s")


def _homfly_az(knot: str):
    res = homfly(knot)
    res.value.to_az()  # the (a, z) form is part of the answer
    return res


if __name__ == "__main__":
    main()
