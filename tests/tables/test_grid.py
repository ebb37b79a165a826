"""Grids: resume after a kill, concurrent writers, Dask = local, bad stores and schedulers.

The values themselves are the library's Rosso-Jones evaluations (checked against published
tables elsewhere); here one row per point, exact agreement between back ends, and the
root-of-unity values against an independent closed form are what is tested.
"""

import json
import os
import signal
import sqlite3
import subprocess
import sys
import textwrap
import time

import mpmath
import pytest

from knotobs.errors import KnotobsError, ParseError, SchedulerError, StoreError
from knotobs.tables.grid import GridSpec, grid_status, resume_grid, run_grid, torus_knots
from knotobs.tables.store import GridStore


def slow_spec() -> GridSpec:
    # SU(3) colours [n, n/2]: each point takes tens of milliseconds, enough to kill a run midway
    return GridSpec(["T(3,5)", "T(3,7)", "T(4,5)"], "SU(3)", [[n, n // 2] for n in range(14, 34, 2)], [None])


DRIVER = textwrap.dedent("""
    import sys
    from knotobs.tables.grid import GridSpec, run_grid
    spec = GridSpec(["T(3,5)", "T(3,7)", "T(4,5)"], "SU(3)", [[n, n // 2] for n in range(14, 34, 2)], [None])
    knots = sys.argv[2].split("/") if len(sys.argv) > 2 else None
    if knots:
        spec = GridSpec(knots, "SU(3)", [[n, n // 2] for n in range(14, 30, 2)], [None])
    r = run_grid(spec, sys.argv[1], workers=1, progress=False, batch_size=1)
    print(r.computed, r.inserted)
""")


def keys_and_runs(path):
    con = sqlite3.connect(path)
    try:
        return dict(con.execute("SELECT key, run_id FROM rows").fetchall()), \
            con.execute("SELECT COUNT(*), COUNT(DISTINCT key) FROM rows").fetchone()
    finally:
        con.close()


def test_killed_run_resumes_without_recomputing(tmp_path):
    db = str(tmp_path / "g.sqlite")
    drv = tmp_path / "drv.py"
    drv.write_text(DRIVER)
    proc = subprocess.Popen([sys.executable, str(drv), db], start_new_session=True,
                            stdout=subprocess.PIPE, stderr=subprocess.PIPE)
    try:
        deadline = time.time() + 120
        n = 0
        while time.time() < deadline:
            if os.path.exists(db):
                try:
                    n = keys_and_runs(db)[1][0]
                except sqlite3.Error:
                    n = 0
            if n >= 4:
                break
            time.sleep(0.05)
        os.killpg(proc.pid, signal.SIGKILL)
    finally:
        proc.wait(timeout=30)
    before, (cnt, _) = keys_and_runs(db)
    total = len(slow_spec().points())
    assert 4 <= len(before) < total, "the run finished before it could be killed; make the grid slower"
    rep = run_grid(slow_spec(), db, workers=2, progress=False)
    assert rep.already_stored == len(before)
    assert rep.computed == total - len(before)          # nothing recomputed
    after, (cnt, distinct) = keys_and_runs(db)
    assert cnt == distinct == total                     # every row once
    assert all(after[k] == run for k, run in before.items())   # old rows untouched
    with GridStore(db) as st:
        assert len(list(st.rows())) == total            # checksums intact


def test_two_writers_lose_nothing(tmp_path):
    db = str(tmp_path / "g.sqlite")
    drv = tmp_path / "drv.py"
    drv.write_text(DRIVER)
    a = subprocess.Popen([sys.executable, str(drv), db, "T(3,5)/T(3,7)"], stdout=subprocess.PIPE, stderr=subprocess.PIPE)
    b = subprocess.Popen([sys.executable, str(drv), db, "T(3,7)/T(4,5)"], stdout=subprocess.PIPE, stderr=subprocess.PIPE)
    oa, ea = a.communicate(timeout=300)
    ob, eb = b.communicate(timeout=300)
    assert a.returncode == 0 and b.returncode == 0, (ea, eb)
    expect = set()
    for ks in (["T(3,5)", "T(3,7)"], ["T(3,7)", "T(4,5)"]):
        from knotobs.tables.store import description_key
        spec = GridSpec(ks, "SU(3)", [[n, n // 2] for n in range(14, 30, 2)], [None])
        expect |= {description_key(d) for d in spec.points()}
    got, (cnt, distinct) = keys_and_runs(db)
    assert set(got) == expect and cnt == distinct == len(expect)
    inserted = int(oa.split()[1]) + int(ob.split()[1])
    assert inserted == len(expect)                      # overlap inserted once, nothing lost


def test_level_rows_match_closed_form(tmp_path):
    # SU(2), fundamental, normalised trefoil at q = exp(2 pi i/K): V(t = q^-1) = q^-1 + q^-3 - q^-4
    # (Jones 1985 with t = q^-1, CONVENTIONS §3); evaluate that closed form independently with mpmath
    db = str(tmp_path / "g.sqlite")
    run_grid(GridSpec(["T(2,3)"], "SU(2)", [[1]], [1, 2, 3, 10], dps=40), db, workers=0, progress=False)
    with GridStore(db) as st:
        rows = list(st.rows())
    assert len(rows) == 4
    for r in rows:
        doc = json.loads(r["document"])
        K = r["level"] + 2
        with mpmath.workdps(60):
            q = mpmath.exp(2j * mpmath.pi / K)
            ref = q ** -1 + q ** -3 - q ** -4
            got = mpmath.mpc(mpmath.mpf(doc["numeric"]["re"]), mpmath.mpf(doc["numeric"]["im"]))
            assert abs(got - ref) < mpmath.mpf(10) ** -35
        assert doc["numeric"]["digits"] == 40 and "exp(2 pi i/(k+N))" in doc["description"]


def test_nonintegrable_points_are_skipped_and_reported(tmp_path):
    rep = run_grid(GridSpec(["T(2,3)"], "SU(2)", [[1], [3]], [1, 2]), str(tmp_path / "g.sqlite"),
                   workers=0, progress=False)
    # [3] (spin 3/2) is integrable only for k >= 3 (CONVENTIONS §6)
    assert rep.inserted == 2 and rep.skipped_nonintegrable == 2


def test_dask_matches_local(tmp_path):
    distributed = pytest.importorskip("distributed")
    spec = GridSpec(torus_knots(40), "SU(2)", [[1], [2]], [None, 3])
    a, b = str(tmp_path / "a.sqlite"), str(tmp_path / "b.sqlite")
    run_grid(spec, a, workers=2, progress=False)
    with distributed.LocalCluster(n_workers=1, threads_per_worker=2, processes=False,
                                  dashboard_address=None) as cluster:
        rep = run_grid(spec, b, progress=False, scheduler=cluster.scheduler_address)
    assert rep.backend == "dask" and not rep.failed, rep.failed
    assert rep.inserted == len(spec.points())
    with GridStore(a) as sa, GridStore(b) as sb:
        ra = {r["key"]: (r["document"], r["numeric"]) for r in sa.rows()}
        rb = {r["key"]: (r["document"], r["numeric"]) for r in sb.rows()}
    assert ra == rb


def test_unreachable_scheduler_writes_nothing(tmp_path):
    pytest.importorskip("distributed")
    db = str(tmp_path / "g.sqlite")
    with pytest.raises(SchedulerError, match="cannot reach the Dask scheduler at 'tcp://127.0.0.1:9'"):
        run_grid(GridSpec(["T(2,3)"]), db, progress=False, scheduler="tcp://127.0.0.1:9", connect_timeout=1)
    with GridStore(db) as st:
        assert st.count() == 0 and st.specs() == []


def test_corrupt_and_foreign_files_are_refused_untouched(tmp_path):
    junk = tmp_path / "junk.sqlite"
    junk.write_bytes(b"this is not a database" * 100)
    foreign = tmp_path / "foreign.sqlite"
    con = sqlite3.connect(foreign)
    con.execute("CREATE TABLE people (name TEXT)")
    con.execute("INSERT INTO people VALUES ('x')")
    con.commit()
    con.close()
    for f, msg in ((junk, "not an SQLite database"), (foreign, "another program")):
        raw = f.read_bytes()
        with pytest.raises(StoreError, match=msg):
            run_grid(GridSpec(["T(2,3)"]), str(f), workers=0, progress=False)
        assert f.read_bytes() == raw


def test_damaged_store_and_damaged_row(tmp_path):
    db = str(tmp_path / "g.sqlite")
    run_grid(GridSpec(torus_knots(60), "SU(2)", [[1], [2]]), db, workers=0, progress=False)
    con = sqlite3.connect(db)
    con.execute("UPDATE rows SET document = replace(document, 'q**', 'Q**') WHERE knot = 'T(2,3)'")
    con.commit()
    con.close()
    with GridStore(db) as st, pytest.raises(StoreError, match="damaged"):
        list(st.rows())
    # now scribble over the middle of the file: SQLite's own check must refuse it
    data = bytearray(open(db, "rb").read())
    for i in range(4096 + 200, min(len(data), 4096 * 3)):
        data[i] = 0x5A
    open(db, "wb").write(bytes(data))
    for suffix in ("-wal", "-shm"):
        if os.path.exists(db + suffix):
            os.remove(db + suffix)
    with pytest.raises(StoreError):
        with GridStore(db) as st:
            list(st.rows())


def test_bad_specs_fail_before_anything_is_written(tmp_path):
    db = tmp_path / "g.sqlite"
    with pytest.raises(ParseError, match="T\\(p,q\\)"):
        run_grid(GridSpec(["T(2,3)", "trefoil"]), str(db), progress=False)
    with pytest.raises(KnotobsError, match="level"):
        GridSpec(["T(2,3)"], levels=[0])
    with pytest.raises(KnotobsError, match="rows"):
        GridSpec(["T(2,3)"], "SU(2)", [[1, 1, 1]])
    assert not db.exists()


def test_status_and_resume(tmp_path):
    db = str(tmp_path / "g.sqlite")
    run_grid(GridSpec(["T(2,3)", "T(2,5)"], "SU(2)", [[1]]), db, workers=0, progress=False)
    con = sqlite3.connect(db)
    con.execute("DELETE FROM rows WHERE knot = 'T(2,5)'")
    con.commit()
    con.close()
    assert grid_status(db)["grids"][0]["missing"] == 1
    reps = resume_grid(db, workers=0, progress=False)
    assert [r.computed for r in reps] == [1]
    assert grid_status(db)["grids"][0]["missing"] == 0
