"""Benchmark of the interface: start-up, output formatting and exports (prints a table; not a test).

Run:  python benchmarks/bench_interface.py [--repeat 3] [--rows 5000]

Every timing is the minimum of ``--repeat`` runs (the machine is shared: the minimum is the
least disturbed run); for the CLI rows the CPU time (user + sys) of the child is shown too,
which a loaded machine disturbs less than the wall time.  CLI timings run the installed ``knotobs`` executable in a subprocess,
so they include Python's start-up and every import, i.e. what the user waits for.

Targets (issue #11): ``knotobs --version`` < 0.15 s; J_200(T(3,4)) through the CLI < 0.4 s
with ``--json`` and < 0.5 s as text; LaTeX export of a 5,000-row store < 5 s.
"""

from __future__ import annotations

import argparse
import os
import shutil
import subprocess
import sys
import tempfile
import time
import _bench  # noqa: F401,E402  (time the CLI with bytecode cached, as installed)


def _cli() -> list[str]:
    exe = shutil.which("knotobs")
    return [exe] if exe else [sys.executable, "-m", "knotobs"]


CPU: dict[str, float] = {}


def timed_cli(args: list[str], repeat: int) -> float:
    """Minimum wall time of the command; its minimum CPU time (user + sys) is kept in CPU."""
    import resource

    best, best_cpu = float("inf"), float("inf")
    for _ in range(repeat):
        r0 = resource.getrusage(resource.RUSAGE_CHILDREN)
        t = time.perf_counter()
        subprocess.run(_cli() + args, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, check=True)
        best = min(best, time.perf_counter() - t)
        r1 = resource.getrusage(resource.RUSAGE_CHILDREN)
        best_cpu = min(best_cpu, (r1.ru_utime - r0.ru_utime) + (r1.ru_stime - r0.ru_stime))
    CPU[" ".join(args)] = best_cpu
    return best


timed = _bench.best_of


def in_process_split(repeat: int) -> list[tuple[str, float]]:
    """J_200(T(3,4)): import, computation, JSON and text formatting measured separately (fresh process)."""
    code = r"""
import time, json
t0 = time.perf_counter()
import knotobs.cli, knotobs.evaluation.families as F, knotobs.output.text as T
t1 = time.perf_counter()
r = F.colored_jones("T(3,4)", 200)
t2 = time.perf_counter()
json.dumps(r.to_json())
t3 = time.perf_counter()
r2 = F.colored_jones("T(3,4)", 200)
t4 = time.perf_counter()
T.render_polynomial(r2)
t5 = time.perf_counter()
r2._repr_latex_()
t6 = time.perf_counter()
print(t1 - t0, t2 - t1, t3 - t2, t5 - t4, t6 - t5, r.num_terms())
"""
    best = None
    for _ in range(repeat):
        out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True).stdout.split()
        vals = [float(x) for x in out[:5]]
        best = vals if best is None else [min(a, b) for a, b in zip(best, vals)]
        terms = int(out[5])
    names = ["  imports (CLI + polynomial routes)", "  computation J_200(T(3,4))",
             f"  JSON of the result ({terms} terms)", "  text form", "  LaTeX form (notebook)"]
    return list(zip(names, best))


def store_of(rows_wanted: int) -> str:
    """A store of ``rows_wanted`` rows: a real grid, its rows repeated under new keys to reach the size."""
    from knotobs.tables.grid import GridSpec, run_grid, torus_knots
    from knotobs.tables.store import GridStore

    path = os.path.join(tempfile.mkdtemp(), "bench.sqlite")
    spec = GridSpec(torus_knots(120), "SU(2)", [[1], [2], [3], [4]], [None, 3])
    run_grid(spec, path, workers=2, progress=False)
    with GridStore(path) as st:
        base = list(st.rows())
        i = 0
        while st.count() < rows_wanted:
            row = dict(base[i % len(base)])
            row["key"] = f"{row['key']}-copy{i}"
            row.pop("checksum", None)
            st.insert(row)
            i += 1
        st.conn.commit()
    return path


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--repeat", type=int, default=3)
    ap.add_argument("--rows", type=int, default=5000)
    args = ap.parse_args()
    r = args.repeat
    table: list[tuple[str, float, float | None]] = []
    table.append(("python -c pass (interpreter alone)", timed(lambda: subprocess.run([sys.executable, "-c", "pass"], check=True), r), None))
    table.append(("knotobs --version", timed_cli(["--version"], r), 0.15))
    table.append(("  (CPU time of the same)", CPU["--version"], 0.15))
    table.append(("knotobs --help", timed_cli(["--help"], r), None))
    j200 = ["poly", "T(3,4)", "--family", "colored-jones", "--color", "200"]
    table.append(("knotobs poly T(3,4) colored-jones --color 200 --json", timed_cli(j200 + ["--json"], r), 0.4))
    table.append(("  (CPU time of the same)", CPU[" ".join(j200 + ["--json"])], 0.4))
    table.append(("knotobs poly T(3,4) colored-jones --color 200 (text)", timed_cli(j200, r), 0.5))
    table.append(("  (CPU time of the same)", CPU[" ".join(j200)], 0.5))
    for name, t in in_process_split(r):
        table.append((name, t, None))
    from knotobs.output.schema import export_grid

    path = store_of(args.rows)
    for fmt, target in (("latex", 5.0), ("csv", None)):
        out = path + "." + fmt
        table.append((f"grid export --format {fmt} ({args.rows} rows)",
                      timed(lambda: export_grid(path, fmt, out), r), target))
    exp = ["grid", "export", "--store", path, "--format", "latex", "-o", path + ".tex"]
    table.append((f"  ... through the CLI (latex, {args.rows} rows)", timed_cli(exp, r), 5.0))
    table.append(("  (CPU time of the same)", CPU[" ".join(exp)], 5.0))
    print(f"{'what':58s} {'seconds':>9s} {'target':>8s}")
    print("-" * 78)
    for name, t, target in table:
        tgt = "" if target is None else f"< {target:g}"
        flag = "" if target is None else ("  ok" if t < target else "  MISSED")
        print(f"{name:58s} {t:9.3f} {tgt:>8s}{flag}")
    print(f"(minimum of {r} runs; load average {os.getloadavg()[0]:.1f} on {os.cpu_count()} cores)")


if __name__ == "__main__":
    main()
