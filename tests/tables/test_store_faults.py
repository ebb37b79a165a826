"""Storage faults: full disk, read-only places, locks, damaged rows, other versions, bad
schedulers, worker caps, orphaned workers.  The expected behaviour is the project rule for
storage (a clear error, nothing partial or damaged, resume completes); no mathematics here,
the values are those of the grid tests.
"""

import json
import os
import sqlite3
import subprocess
import sys
import textwrap
import time

import pytest
from typer.testing import CliRunner

import knotobs.tables.grid as grid_mod
from knotobs.cli import app
from knotobs.errors import KnotobsError, SchedulerError, StoreError
from knotobs.output.schema import export_grid
from knotobs.tables.grid import GridSpec, grid_status, resume_grid, run_grid, torus_knots
from knotobs.tables.store import GridStore

runner = CliRunner()


def spec():
    return GridSpec(torus_knots(40), "SU(2)", [[1], [2]], [None, 3])


def counts(path):
    con = sqlite3.connect(path)
    try:
        return con.execute("SELECT COUNT(*), COUNT(DISTINCT key) FROM rows").fetchone()
    finally:
        con.close()


def one_error(res, *words):
    assert res.exit_code == 2, res.output
    err = res.stderr.strip().splitlines()
    assert len(err) == 1 and err[0].startswith("error: "), res.stderr
    for w in words:
        assert w in err[0], (w, err[0])


def test_full_disk_midway_is_a_clear_error_and_resume_completes(tmp_path, monkeypatch):
    db = str(tmp_path / "g.sqlite")
    real = GridStore.insert
    calls = {"n": 0}

    def insert(self, row):
        calls["n"] += 1
        if calls["n"] > 5:
            raise sqlite3.OperationalError("database or disk is full")
        return real(self, row)

    monkeypatch.setattr(GridStore, "insert", insert)
    with pytest.raises(StoreError, match="disk .*full.*intact.*resume"):
        run_grid(spec(), db, workers=0, progress=False, batch_size=2)
    n, distinct = counts(db)
    assert n == distinct and n in (4,)          # whole batches only: rows 1-4, the batch with row 6 rolled back
    monkeypatch.setattr(GridStore, "insert", real)
    rep = resume_grid(db, workers=0, progress=False)[0]
    assert rep.complete and rep.computed == len(spec().points()) - n
    assert counts(db) == (len(spec().points()),) * 2


def test_full_disk_through_the_cli_is_one_line(tmp_path, monkeypatch):
    def insert(self, row):
        raise sqlite3.OperationalError("database or disk is full")

    monkeypatch.setattr(GridStore, "insert", insert)
    one_error(runner.invoke(app, ["grid", "run", "--knots", "T(2,3),T(2,5)", "--store", str(tmp_path / "g.sqlite"),
                                  "--workers", "0"]), "full", "resume")


def test_locked_store_is_a_clear_error(tmp_path):
    db = str(tmp_path / "g.sqlite")
    run_grid(GridSpec(["T(2,3)"]), db, workers=0, progress=False)
    holder = sqlite3.connect(db, isolation_level=None)
    holder.execute("BEGIN EXCLUSIVE")
    try:
        t = time.time()
        with pytest.raises(StoreError, match="lock"):
            run_grid(GridSpec(["T(2,5)"]), db, workers=0, progress=False, lock_timeout=0.3)
        assert time.time() - t < 5
        assert grid_status(db)["rows"] == 1          # readers are not blocked
    finally:
        holder.execute("ROLLBACK")
        holder.close()


def test_store_name_empty_or_a_directory(tmp_path):
    for bad in ("", "  "):
        with pytest.raises(StoreError, match="empty"):
            run_grid(GridSpec(["T(2,3)"]), bad, workers=0, progress=False)
    with pytest.raises(StoreError, match="directory"):
        run_grid(GridSpec(["T(2,3)"]), str(tmp_path), workers=0, progress=False)
    one_error(runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "--store", ""]), "empty")
    one_error(runner.invoke(app, ["grid", "status", "--store", str(tmp_path)]), "directory")
    assert os.listdir(tmp_path) == []


def test_status_never_writes_into_an_empty_file(tmp_path):
    f = tmp_path / "empty.sqlite"
    f.write_bytes(b"")
    one_error(runner.invoke(app, ["grid", "status", "--store", str(f)]), "empty")
    one_error(runner.invoke(app, ["grid", "export", "--store", str(f)]), "empty")
    assert f.read_bytes() == b"" and sorted(os.listdir(tmp_path)) == ["empty.sqlite"]


def test_intact_store_in_a_read_only_directory_is_readable(tmp_path, monkeypatch):
    d = tmp_path / "ro"
    d.mkdir()
    db = str(d / "g.sqlite")
    run_grid(GridSpec(["T(2,3)", "T(2,5)"]), db, workers=0, progress=False)
    for extra in ("-wal", "-shm"):          # a cleanly closed store: main file only
        assert not os.path.exists(db + extra)
    real_access = os.access
    # the directory is read-only (also when the tests run with rights to write anywhere)
    monkeypatch.setattr(os, "access", lambda p, m: False if (m & os.W_OK and os.path.abspath(p) == str(d))
                        else real_access(p, m))
    d.chmod(0o555)
    try:
        st = grid_status(db)
        assert st["rows"] == 2 and st["grids"][0]["missing"] == 0
        assert "T(2,5)" in export_grid(db, "csv")
        assert sorted(os.listdir(d)) == ["g.sqlite"]
    finally:
        d.chmod(0o755)


def test_store_of_another_version_is_neither_recomputed_nor_duplicated(tmp_path, monkeypatch):
    db = str(tmp_path / "g.sqlite")
    s = spec()
    run_grid(s, db, workers=0, progress=False)
    n = counts(db)[0]
    monkeypatch.setattr(grid_mod, "_version", lambda: "99.0.0")
    s2 = spec()
    rep = run_grid(s2, db, workers=0, progress=False)
    assert rep.computed == 0 and rep.already_stored == n
    assert counts(db)[0] == n
    assert len(export_grid(db, "csv").splitlines()) == n + 1
    st = grid_status(db)
    assert len(st["grids"]) == 1 and st["grids"][0]["missing"] == 0


@pytest.mark.parametrize("damage", ["bad json", "not an object", "missing keys", "text in a number"])
def test_damaged_spec_rows_are_clear_errors(tmp_path, damage):
    db = str(tmp_path / "g.sqlite")
    run_grid(GridSpec(["T(2,3)"], "SU(2)", [[1]], [None, 2]), db, workers=0, progress=False)
    con = sqlite3.connect(db)
    spec_text = con.execute("SELECT spec FROM specs").fetchone()[0]
    d = json.loads(spec_text)
    new = {"bad json": spec_text[:-5], "not an object": "[1, 2]",
           "missing keys": json.dumps({k: v for k, v in d.items() if k != "levels"}),
           "text in a number": json.dumps({**d, "dps": "thirty"})}[damage]
    con.execute("UPDATE specs SET spec = ?", (new,))
    con.commit()
    con.close()
    for f in (lambda: grid_status(db), lambda: resume_grid(db, workers=0, progress=False)):
        with pytest.raises(StoreError, match="damaged"):
            f()
    one_error(runner.invoke(app, ["grid", "resume", "--store", db, "--workers", "0"]), "damaged")


@pytest.mark.parametrize("address", ["", "bogus", "tcp://", "tcp://:8786", "http//x"])
def test_malformed_scheduler_is_refused_at_once(tmp_path, address):
    db = str(tmp_path / "g.sqlite")
    t = time.time()
    with pytest.raises(SchedulerError):
        run_grid(GridSpec(["T(2,3)"]), db, progress=False, scheduler=address)
    res = runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "--store", db, "--scheduler", address])
    one_error(res, "scheduler address")
    assert time.time() - t < 3
    assert not os.path.exists(db)


def test_workers_are_capped():
    cap = grid_mod.max_workers()
    with pytest.raises(KnotobsError, match=f"use workers <= {cap}"):
        run_grid(GridSpec(["T(2,3)"]), "unused.sqlite", workers=100000, progress=False)
    one_error(runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "--workers", "100000"]), str(cap))


def test_max_pq_refused_by_estimate_quickly():
    for m in ("1000000000", "1000000"):
        t = time.time()
        res = runner.invoke(app, ["grid", "run", "--max-pq", m])
        one_error(res, f"--max-pq {m}", "--max-pq <=")
        assert "q=" not in res.stderr
        assert time.time() - t < 2
    one_error(runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "--level", "1000000000000"]), "1000000000000")
    one_error(runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "--level", ","]), "--level")
    one_error(runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "--reps", "[1;2]"]), "--reps")
    one_error(runner.invoke(app, ["grid", "run", "--knots", "T(2,3)", "--reps", ""]), "--reps")


def test_failed_export_leaves_no_file(tmp_path, monkeypatch):
    db = str(tmp_path / "g.sqlite")
    run_grid(GridSpec(["T(2,3)"]), db, workers=0, progress=False)
    out = tmp_path / "x.csv"
    real = os.fsync

    def full(fd):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(os, "fsync", full)
    with pytest.raises(KnotobsError, match="No space left"):
        export_grid(db, "csv", str(out))
    assert [f for f in os.listdir(tmp_path) if not f.startswith("g.sqlite")] == []
    out.write_text("old")                               # an existing file is left as it was
    with pytest.raises(KnotobsError):
        export_grid(db, "csv", str(out))
    assert out.read_text() == "old"
    monkeypatch.setattr(os, "fsync", real)
    one_error(runner.invoke(app, ["grid", "export", "--store", db, "-o", str(tmp_path / "no" / "x.csv")]), "x.csv")


DRIVER = textwrap.dedent("""
    import sys
    from knotobs.tables.grid import GridSpec, run_grid
    spec = GridSpec(["T(3,5)", "T(3,7)", "T(4,5)", "T(5,6)"], "SU(3)", [[n, n // 2] for n in range(14, 60, 2)], [None])
    run_grid(spec, sys.argv[1], workers=2, progress=False, batch_size=1)
""")


def _children(pid):
    out = []
    for p in os.listdir("/proc"):
        if p.isdigit():
            try:
                with open(f"/proc/{p}/status") as fh:
                    st = dict(line.split(":", 1) for line in fh if ":" in line)
            except OSError:
                continue
            if st.get("PPid", "").strip() == str(pid):
                out.append(int(p))
    return out


def _alive(pid):
    try:
        with open(f"/proc/{pid}/status") as fh:
            return "zombie" not in fh.read().lower()
    except OSError:
        return False


@pytest.mark.skipif(not sys.platform.startswith("linux"), reason="reads /proc")
def test_workers_exit_when_the_parent_is_killed(tmp_path):
    db = str(tmp_path / "g.sqlite")
    drv = subprocess.Popen([sys.executable, "-c", DRIVER, db])
    try:
        kids = []
        t = time.time()
        while time.time() - t < 30 and len(kids) < 2:
            time.sleep(0.2)
            kids = [k for k in _children(drv.pid)]
        assert kids, "no worker processes started"
    finally:
        drv.kill()
        drv.wait()
    t = time.time()
    while time.time() - t < 10 and any(_alive(k) for k in kids):
        time.sleep(0.2)
    assert not any(_alive(k) for k in kids), "workers outlived their parent"


def test_workers_inherit_the_limits(monkeypatch):
    from knotobs.guard import current_limits, limits

    monkeypatch.setenv("KNOTOBS_MAX_SECONDS", "60")
    monkeypatch.setenv("KNOTOBS_MAX_MEMORY_MB", "2048")
    with limits(seconds=7, memory_mb=300):
        lim = current_limits()
    grid_mod._apply_limits(lim.seconds, lim.memory_mb)     # what each worker runs first
    assert current_limits().seconds == 7 and current_limits().memory_mb == 300
