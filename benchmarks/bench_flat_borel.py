"""Benchmarks for flat SL(2,C) connections and the Borel plane (issue 10).

Times what the user waits for: the command line, start-up included (``python -m knotobs.cli`` style via
the installed ``knotobs`` executable), minimum of 3 runs. Targets: Ohtsuki coefficients to order 40 for
Sigma(2,3,5) < 5 s; every flat SL(2,C) connection of Sigma(p,q,r) with pqr <= 10^4 < 1 s; runaway inputs
refused in < 2 s or finished in < 60 s.
"""

from __future__ import annotations

import shutil
import subprocess
import sys
import time
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)


def cli(args, runs=3, timeout=180):
    exe = shutil.which("knotobs") or sys.executable
    cmd = [exe] + args if exe != sys.executable else [exe, "-c", "from knotobs.cli import main; main()"] + args
    best, rc = None, None
    for _ in range(runs):
        t = time.perf_counter()
        p = subprocess.run(cmd, capture_output=True, text=True, timeout=timeout)
        dt = time.perf_counter() - t
        best = dt if best is None else min(best, dt)
        rc = p.returncode
    return best, rc


def lib(fn, runs=3):
    best = None
    for _ in range(runs):
        t = time.perf_counter()
        fn()
        dt = time.perf_counter() - t
        best = dt if best is None else min(best, dt)
    return best


def main():
    from knotobs.continuation.ohtsuki import ohtsuki_series
    from knotobs.flat.table import flat_sl2c_connections

    rows = []
    rows.append(("library: ohtsuki_series(Sigma(2,3,5), 40)", lib(lambda: ohtsuki_series("Sigma(2,3,5)", 40)), "< 5 s", 0))
    for sp in ["Sigma(2,3,5)", "Sigma(5,7,11)", "Sigma(13,17,19)", "Sigma(19,23,29)"]:
        rows.append((f"library: flat_sl2c_connections({sp})", lib(lambda sp=sp: flat_sl2c_connections(sp)),
                     "< 1 s (pqr <= 10^4)", 0))
    cases = [
        (["flat", "Sigma(13,17,19)", "--group", "SL(2,C)"], "< 1 s + start-up (pqr = 4199)"),
        (["flat", "Sigma(3,5,7)"], "SU(2) table with one-loop data"),
        (["borel", "Sigma(2,3,5)", "--order", "40"], "Borel plane, 41 coefficients"),
        (["borel", "Sigma(2,3,7)", "--order", "40", "--K", "9"], "with resummation"),
        (["flat", "Sigma(97,98,99)"], "refused < 2 s"),
        (["flat", "Sigma(97,98,99)", "--group", "SL(2,C)"], "finishes < 60 s"),
        (["flat", "M(0; -1; (2,1),(3,1),(5,1),(7,1),(11,1),(13,1))"], "6 fibres, residue route: refused < 2 s"),
        (["flat", "M(0; -1; (2,1),(3,1),(5,1),(7,1),(11,1),(13,1))", "--group", "SL(2,C)"], "6 fibres: finishes < 60 s"),
        (["flat", "M(0; -1; (2,1),(3,1),(5,2),(7,3),(11,2),(13,5),(17,3),(19,2),(23,4),(29,3))", "--group", "SL(2,C)"],
         "10 fibres: refused < 2 s"),
    ]
    for args, target in cases:
        runs = 1 if "97" in " ".join(args) and "SL(2,C)" in args else 3
        t, rc = cli(args, runs=runs)
        rows.append(("knotobs " + " ".join(a if " " not in a else repr(a) for a in args), t, target, rc))
    t0, _ = cli(["--help"])
    rows.append(("knotobs --help (start-up)", t0, "", 0))
    w = max(len(r[0]) for r in rows)
    print(f"{'what':<{w}}  {'min of runs (s)':>15}  exit  target")
    for name, t, target, rc in rows:
        print(f"{name:<{w}}  {t:>15.3f}  {rc:>4}  {target}")


if __name__ == "__main__":
    main()
