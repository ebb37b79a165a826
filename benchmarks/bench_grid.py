"""Benchmark of the grid runner (prints a table; not a test).

Run:  python benchmarks/bench_grid.py [--workers 2] [--max-pq 200]

Rows: all torus knots T(P,Q), 2 <= P < Q, gcd(P,Q) = 1, P*Q <= max-pq, SU(2) colours
[1], [2], [3] (dimensions 2, 3, 4), generic q, normalised, zero framing; stored in a fresh
SQLite file.  Targets: the full run under 60 s on two cores, the re-read under 2 s.
"""

from __future__ import annotations

import argparse
import os
import tempfile
import time

from knotobs.output.schema import export_grid
from knotobs.tables.grid import GridSpec, run_grid, torus_knots
from knotobs.tables.store import GridStore


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--workers", type=int, default=2)
    ap.add_argument("--max-pq", type=int, default=200)
    args = ap.parse_args()
    knots = torus_knots(args.max_pq)
    spec = GridSpec(knots, "SU(2)", [[1], [2], [3]], [None])
    path = os.path.join(tempfile.mkdtemp(), "bench.sqlite")
    rows = []
    t0 = time.perf_counter()
    rep = run_grid(spec, path, workers=args.workers, progress=False)
    rows.append(("compute + store", rep.computed, time.perf_counter() - t0, 60.0))
    t0 = time.perf_counter()
    rep2 = run_grid(spec, path, workers=args.workers, progress=False)
    rows.append(("resume (nothing to do)", rep2.computed, time.perf_counter() - t0, None))
    t0 = time.perf_counter()
    with GridStore(path) as st:
        n = len(list(st.rows()))
    rows.append(("re-read from store", n, time.perf_counter() - t0, 2.0))
    for fmt in ("csv", "json", "latex"):
        t0 = time.perf_counter()
        export_grid(path, fmt)
        rows.append((f"export {fmt}", n, time.perf_counter() - t0, None))
    print(f"grid: {len(knots)} torus knots with P*Q <= {args.max_pq} x SU(2) colours [1],[2],[3], generic q;"
          f" {args.workers} workers; store {os.path.getsize(path) // 1024} KiB")
    print(f"{'step':<24} {'rows':>6} {'seconds':>9} {'target':>8}  ok")
    for name, cnt, sec, target in rows:
        ok = "" if target is None else ("yes" if sec < target else "NO")
        print(f"{name:<24} {cnt:>6} {sec:>9.3f} {('< %g' % target) if target else '':>8}  {ok}")


if __name__ == "__main__":
    main()
