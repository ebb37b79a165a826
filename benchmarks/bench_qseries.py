"""Speed table of the q-series invariants (run: python benchmarks/bench_qseries.py).

Each row is the minimum of 3 runs, in-process and through the CLI (a fresh process, so start-up
and imports are included: that is what the user waits for).  Target (issue #10): q-series to
q^1000 for a four-fiber Seifert manifold in under 2 s.
"""

from __future__ import annotations

import os
import subprocess
import sys
import time

from knotobs.qseries.radial import finite_level_from_qseries
from knotobs.qseries.series import qseries_for
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)

CASES = [
    ("Sigma(2,3,5)", "0", 1000, None),
    ("Sigma(2,3,5,7)", "0", 1000, 2.0),
    ("M(0; 0; (2,1),(3,1),(5,1),(7,1))", "0", 1000, 2.0),
    ("M(0; -1; (2,1),(3,1),(3,1),(5,2))", "all", 1000, 2.0),
    ("M(0; 0; (2,1),(2,1),(3,1),(3,1))", "all", 1000, 2.0),
    ("Sigma(2,3,5)", "0", 100000, None),
    ("Plumb(-2,-2,-2,-3,-2,-2,-3,-2,-2 : 1-2, 1-3, 1-4, 4-5, 4-6, 4-7, 7-8, 7-9)", "0", 100, None),
]


_best = _bench.best_of


def _cli(space, label, order):
    exe = [os.path.join(os.path.dirname(sys.executable), "knotobs")]
    cmd = exe + ["qseries", space, "--order", str(order), "--label", label, "--json"]
    return lambda: subprocess.run(cmd, check=True, stdout=subprocess.DEVNULL)


def main() -> None:
    print(f"{'what':72s} {'in-process s':>12s} {'CLI s':>8s} {'target s':>9s}")
    exe = os.path.join(os.path.dirname(sys.executable), "knotobs")
    t0 = _best(lambda: subprocess.run([exe, "--help"], check=True, stdout=subprocess.DEVNULL))
    print(f"{'knotobs --help (start-up and imports only, for comparison)':72s} {'':12s} {t0:8.2f}")
    for space, label, order, target in CASES:
        t_in = _best(lambda: qseries_for(space, label, order))
        t_cli = _best(_cli(space, label, order))
        what = f"qseries {space} --label {label} --order {order}"
        print(f"{what:72s} {t_in:12.3f} {t_cli:8.2f} {target if target else '':>9}")
    for space, K in [("Sigma(2,3,5)", 50), ("M(0; -1; (2,1),(3,1),(3,1),(5,2))", 20), ("L(12,5)", 40)]:
        t = _best(lambda: finite_level_from_qseries(space, K, 30), 1)
        print(f"{'finite-level value from radial limits, ' + space + f', K = {K}, 30 digits':72s} {t:12.3f}")


if __name__ == "__main__":
    main()
