"""Speed table of the SU(N) continuation in K (run: python benchmarks/bench_continuation_sun.py).

Rows: 20 complex K to 20 digits from Python and through the CLI (whole processes, start-up
included), and at integer K the continued value beside the two finite-level routes
(localisation and surgery).  Sigma(2,3,5) for SU(3) has poles (three exceptional orders: the
residue formula of docs/continuation_sun.md §18.7: its exact residues once per process, then about 0.2-0.3 s per value on two cores); its CLI row runs the
first 5 of the 20 levels and also prints the time per process.  A third table times one value on
spaces with shared orders and with base genus >= 1 (§18.8, §18.9), a fourth one value on spaces
with e = 0 and exceptional fibers through the CLI (§18.11).
"""

from __future__ import annotations

import subprocess
import sys
import time

import mpmath

from knotobs.continuation.cartan import continued_sun_partition_function
from knotobs.errors import KnotobsError
from knotobs.evaluation.seifert_routes import partition_function
from knotobs.precision import certified_str
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)

POINTS = [f"{3 + 0.45 * j:.2f}{'+' if j % 2 == 0 else '-'}{0.1 + 0.05 * (j % 5):.2f}i" for j in range(20)]


def _python(space: str, group: str, digits: int = 20) -> tuple[float, str]:
    t = time.perf_counter()
    try:
        for k in POINTS:
            continued_sun_partition_function(space, group, level=k, digits=digits)
        status = "ok"
    except KnotobsError as exc:
        status = "refused: " + str(exc)[:70] + "..."
    return time.perf_counter() - t, status


def _cli(space: str, group: str, digits: int = 20, points=POINTS) -> tuple[float, str]:
    t = time.perf_counter()
    status = "ok"
    for k in points:
        r = subprocess.run([sys.executable, "-m", "knotobs", "continue", space, "--group", group, "--level", k,
                            "-d", str(digits)], capture_output=True, text=True)
        if r.returncode != 0:
            status = "refused: " + (r.stdout + r.stderr).strip().splitlines()[-1][:70] + "..."
            break
    return time.perf_counter() - t, status


def main() -> None:
    print("SU(N) continued Z at 20 complex levels k (K = k + N), 20 digits")
    print(f"{'case':<44} {'target':>7} {'python':>9} {'cli (20 processes)':>19}  status")
    for space, group, target in (("L(5,1)", "SU(3)", 10.0), ("L(7,2)", "SU(3)", None), ("M(0; -2)", "SU(4)", None),
                                 ("Sigma(2,3,5)", "SU(3)", 10.0)):
        tp, sp = _python(space, group)
        pts = POINTS if space != "Sigma(2,3,5)" else POINTS[:5]
        tc, sc = _cli(space, group, points=pts)
        tgt = f"{target:.0f} s" if target else "-"
        cli = f"{tc:9.3f}s" + (f" ({len(pts)}: {tc / len(pts):.1f} s each)" if len(pts) != len(POINTS) else "")
        print(f"{space + ', ' + group:<44} {tgt:>7} {tp:8.3f}s {cli:>19}  {sp if sp != 'ok' else sc}")
    print()
    print("SU(3) with poles, one value at level 2.5+0.2i, 20 digits (Python; both runs of the route)")
    print(f"{'case':<44} {'seconds':>8}  sectors  what")
    for space, what in (("Sigma(2,3,5)", "three coprime orders, §18.7"),
                        ("M(0; -1; (2,1), (2,1), (3,1))", "orders sharing a factor, 2 coset orbits, §18.8"),
                        ("M(0; -1; (2,1), (4,1), (6,1))", "orders sharing a factor, 5 coset orbits, §18.8"),
                        ("M(1; -1; (2,1), (3,1))", "base genus 1, §18.9"),
                        ("M(2; -1)", "base genus 2, no fibers, §18.9")):
        t = time.perf_counter()
        try:
            z = continued_sun_partition_function(space, "SU(3)", level="2.5+0.2i", digits=20)
            n = str(len(z.sectors))
        except KnotobsError as exc:
            n = "refused: " + str(exc)[:60]
        print(f"{space:<44} {time.perf_counter() - t:8.2f}  {n:>7}  {what}")
    print()
    print("e = 0 with exceptional fibers (quasi-polynomial in K, §18.11): one value at level 2.5+0.2i,")
    print("20 digits, in a fresh process through the CLI (start-up and the finite levels included)")
    print(f"{'case':<44} {'group':>6} {'cli':>8}  {'levels':>6}  status")
    for space, group in (("M(0; -1; (2,1), (4,1), (4,1))", "SU(2)"), ("M(0; -1; (3,1), (3,1), (3,1))", "SU(3)"),
                         ("M(0; -1; (2,1), (3,1), (6,1))", "SU(3)"), ("M(1; 0; (2,1), (2,-1))", "SU(3)"),
                         ("M(0; -1; (2,1), (4,1), (4,1))", "SU(4)"), ("M(0; -1; (2,1), (3,1), (6,1))", "SU(4)")):
        from knotobs.continuation.cartan.quasipolynomial import quasi_polynomial_data

        n = len(quasi_polynomial_data(space, int(group[3:-1])).levels)
        t = time.perf_counter()
        r = subprocess.run([sys.executable, "-m", "knotobs", "--max-seconds", "120", "continue", space, "--group",
                            group, "--level", "2.5+0.2i", "-d", "20"], capture_output=True, text=True)
        status = "ok" if r.returncode == 0 else (r.stdout + r.stderr).strip().splitlines()[-1][:70]
        print(f"{space:<44} {group:>6} {time.perf_counter() - t:7.2f}s  {n:>6}  {status}")
    print()
    print("estimate before the work vs the wait: one continued value (20 digits, exact pieces cached:")
    print("the second value in the process) and a level-plane figure through the CLI (--json, 12 digits)")
    print(f"{'case':<44} {'estimated':>10} {'measured':>9}  what")
    from knotobs.continuation.cartan.value import continued_sun_seconds

    for space in ("Sigma(2,3,5)", "M(0; -1; (2,1), (4,1), (6,1))", "M(0; -1; (2,1), (3,1), (5,2))"):
        continued_sun_partition_function(space, "SU(3)", level="4.1+0.3i", digits=20)
        _, each, _ = continued_sun_seconds(space, "SU(3)", mpmath.mpc(7.2, 0.3), 20)
        t = time.perf_counter()
        continued_sun_partition_function(space, "SU(3)", level="4.2+0.3i", digits=20)
        print(f"{space:<44} {each:9.2f}s {time.perf_counter() - t:8.2f}s  one value, counted estimate")

    once, each, _ = continued_sun_seconds("Sigma(2,3,5)", "SU(3)", mpmath.mpc(12, 1), 12)
    t = time.perf_counter()
    r = subprocess.run([sys.executable, "-m", "knotobs", "plot", "level-plane", "Sigma(2,3,5)", "--group", "SU(3)",
                        "--n", "6", "--json", "--no-progress"], capture_output=True, text=True)
    status = "" if r.returncode == 0 else "  " + (r.stdout + r.stderr).strip().splitlines()[-1][:60]
    print(f"{'Sigma(2,3,5) level-plane 6 x 6':<44} {once + 36 * each:9.2f}s {time.perf_counter() - t:8.2f}s  "
          f"figure (start-up included){status}")
    print()
    print("integer K: continued value vs the finite-level routes (20 digits)")
    print(f"{'case':<22} {'k':>3}  {'continued':>48}  {'localisation':>48}  {'surgery':>48}  agree")
    for space, group, ks in (("L(5,1)", "SU(3)", (1, 2, 3, 5)), ("L(7,2)", "SU(3)", (1, 2, 3, 5)),
                             ("M(0; -2)", "SU(4)", (1, 2, 3, 5)), ("Sigma(2,3,5)", "SU(3)", (3, 9)),
                             ("M(0; -1; (2,1), (2,1), (3,1))", "SU(3)", (2,)), ("M(2; -1)", "SU(3)", (2,))):
        for k in ks:
            c = continued_sun_partition_function(space, group, level=k, digits=20).numeric
            a = partition_function(space, group, k, digits=20, route="localisation").numeric
            try:
                b = partition_function(space, group, k, digits=20, route="surgery").numeric
            except KnotobsError:         # no surgery presentation on a base of genus >= 1
                b = partition_function(space, group, k, digits=20, route="convolution").numeric
            ok = abs(c - a) < 1e-18 * max(1, abs(a)) and abs(c - b) < 1e-18 * max(1, abs(a))
            print(f"{space + ' ' + group:<22} {k:>3}  {certified_str(c, 20):>48}  {certified_str(a, 20):>48}  "
                  f"{certified_str(b, 20):>48}  {'yes' if ok else 'NO'}")


if __name__ == "__main__":
    main()
