"""The local results database: one SQLite file, WAL mode, keyed by a canonical description.

Layout (schema version :data:`SCHEMA_VERSION`; ``PRAGMA application_id`` =
:data:`APPLICATION_ID` marks the file as a knotobs store):

``meta(key, value)``
    format marker, schema version, creation time.
``specs(spec_key, spec, created)``
    every grid specification run against this store (so ``resume`` knows what to finish).
``rows(key, description, quantity, knot, grp, rep, level, exact, numeric, digits,
document, version, run_id, created, seconds, checksum)``
    one finished computation per row.  ``key`` is the SHA-256 of the canonical JSON
    description of the computation (which includes the package version); ``document``
    is the full JSON result (schema ``observable`` in :mod:`knotobs.output.schema`);
    ``checksum`` is the SHA-256 of ``document`` and is checked on every read.

Rows are written only whole (``INSERT OR IGNORE`` in one statement, committed at
once), so a process killed mid-run leaves only complete rows, and two writers never
duplicate or overwrite a row.  Opening a file that is not SQLite, that SQLite finds
damaged, or that belongs to another program raises :class:`~knotobs.errors.StoreError`
and leaves the file untouched.
"""

from __future__ import annotations

import hashlib
import json
import os
import sqlite3
import time
from typing import Any, Iterator, Sequence

from knotobs.errors import StoreError

__all__ = ["GridStore", "APPLICATION_ID", "SCHEMA_VERSION", "canonical_json", "description_key"]

#: ``PRAGMA application_id`` of a knotobs store (ASCII "KNOB").
APPLICATION_ID = 0x4B4E4F42
#: Version of the table layout.
SCHEMA_VERSION = 1

_ROW_COLUMNS = ("key", "description", "quantity", "knot", "grp", "rep", "level", "exact", "numeric",
                "digits", "document", "version", "run_id", "created", "seconds", "checksum")

_SCHEMA = """
CREATE TABLE IF NOT EXISTS meta (key TEXT PRIMARY KEY, value TEXT NOT NULL);
CREATE TABLE IF NOT EXISTS specs (spec_key TEXT PRIMARY KEY, spec TEXT NOT NULL, created REAL NOT NULL);
CREATE TABLE IF NOT EXISTS rows (
    key TEXT PRIMARY KEY,
    description TEXT NOT NULL,
    quantity TEXT NOT NULL,
    knot TEXT NOT NULL,
    grp TEXT NOT NULL,
    rep TEXT NOT NULL,
    level INTEGER,
    exact TEXT NOT NULL,
    numeric TEXT,
    digits INTEGER,
    document TEXT NOT NULL,
    version TEXT NOT NULL,
    run_id TEXT NOT NULL,
    created REAL NOT NULL,
    seconds REAL NOT NULL,
    checksum TEXT NOT NULL
);
"""


def canonical_json(obj: Any) -> str:
    """Compact JSON with sorted keys: the canonical text of a description."""
    return json.dumps(obj, sort_keys=True, separators=(",", ":"), ensure_ascii=True)


def description_key(description: dict) -> str:
    """SHA-256 (hex) of the canonical JSON of a computation's description.

    >>> description_key({"b": 1, "a": [1, 2]}) == description_key({"a": [1, 2], "b": 1})
    True
    """
    return hashlib.sha256(canonical_json(description).encode()).hexdigest()


def _checksum(document: str) -> str:
    return hashlib.sha256(document.encode()).hexdigest()


class GridStore:
    """A knotobs results database (SQLite, WAL journal), one writer connection.

    Parameters
    ----------
    path : str
        File name; created (with its schema) if it does not exist or is empty.
    timeout : float
        Seconds to wait for another writer's lock.

    Examples
    --------
    >>> import tempfile, os
    >>> d = tempfile.mkdtemp()
    >>> st = GridStore(os.path.join(d, "g.sqlite"))
    >>> st.count()
    0
    >>> st.close()

    References
    ----------
    SQLite documentation: "Write-Ahead Logging", "PRAGMA application_id" (common practice).
    """

    def __init__(self, path: str, timeout: float = 60.0):
        self.path = os.fspath(path)
        fresh = not os.path.exists(self.path) or os.path.getsize(self.path) == 0
        if not fresh:
            self._check_header()
        try:
            self.conn = sqlite3.connect(self.path, timeout=timeout, isolation_level=None)
        except sqlite3.Error as exc:
            raise StoreError(f"cannot open results store {self.path!r}: {exc}") from None
        try:
            self._init_retrying(fresh, timeout)
        except sqlite3.DatabaseError as exc:
            self.conn.close()
            raise StoreError(f"{self.path!r} is not a usable knotobs results store ({exc});"
                             " give a new file name or a store written by knotobs") from None
        except StoreError:
            self.conn.close()
            raise

    # ------------------------------------------------------------------ opening
    def _init_retrying(self, fresh: bool, timeout: float) -> None:
        """:meth:`_init`, retried while another process holds a lock.

        Switching to WAL and the first schema write can report "database is locked" at
        once (SQLite does not always call the busy handler there) when two writers open a
        new store together.
        """
        deadline = time.monotonic() + timeout
        delay = 0.01
        while True:
            try:
                self._init(fresh)
                return
            except sqlite3.OperationalError as exc:
                msg = str(exc).lower()
                if ("locked" not in msg and "busy" not in msg) or time.monotonic() > deadline:
                    raise
                time.sleep(delay)
                delay = min(delay * 2, 0.5)
                fresh = not os.path.exists(self.path) or os.path.getsize(self.path) == 0

    def _check_header(self) -> None:
        with open(self.path, "rb") as fh:
            head = fh.read(100)
        if not head.startswith(b"SQLite format 3\x00"):
            raise StoreError(f"{self.path!r} is not a knotobs results store (not an SQLite database);"
                             " give a new file name or a store written by knotobs")
        if len(head) < 100:
            raise StoreError(f"{self.path!r} is a truncated SQLite file; give a new file name")
        app_id = int.from_bytes(head[68:72], "big")
        if app_id not in (0, APPLICATION_ID):
            raise StoreError(f"{self.path!r} is an SQLite database of another program (application id"
                             f" {app_id:#x}); give a new file name or a store written by knotobs")

    def _init(self, fresh: bool) -> None:
        c = self.conn
        c.execute("PRAGMA busy_timeout = 60000")
        if not fresh:
            bad = c.execute("PRAGMA quick_check").fetchone()[0]
            if bad != "ok":
                raise StoreError(f"results store {self.path!r} is damaged ({bad}); it was not modified")
            app = c.execute("PRAGMA application_id").fetchone()[0]
            tables = {r[0] for r in c.execute("SELECT name FROM sqlite_master WHERE type='table'")}
            if app != APPLICATION_ID:
                if tables:
                    raise StoreError(f"{self.path!r} is an SQLite database of another program (tables:"
                                     f" {', '.join(sorted(tables))}); give a new file name or a store written by knotobs")
                fresh = True
            else:
                ver = c.execute("PRAGMA user_version").fetchone()[0]
                if ver > SCHEMA_VERSION:
                    raise StoreError(f"results store {self.path!r} has format {ver}, newer than this"
                                     f" knotobs understands ({SCHEMA_VERSION}); upgrade knotobs")
                missing = {"meta", "specs", "rows"} - tables
                if missing:
                    raise StoreError(f"results store {self.path!r} is damaged: missing table(s)"
                                     f" {', '.join(sorted(missing))}")
                cols = [r[1] for r in c.execute("PRAGMA table_info(rows)")]
                if tuple(cols) != _ROW_COLUMNS:
                    raise StoreError(f"results store {self.path!r} is damaged: unexpected columns {cols}")
        c.execute("PRAGMA journal_mode = WAL")
        c.execute("PRAGMA synchronous = NORMAL")
        if fresh:
            c.execute("BEGIN IMMEDIATE")
            try:
                for stmt in _SCHEMA.strip().split(";"):
                    if stmt.strip():
                        c.execute(stmt)
                c.execute(f"PRAGMA application_id = {APPLICATION_ID}")
                c.execute(f"PRAGMA user_version = {SCHEMA_VERSION}")
                c.execute("INSERT OR IGNORE INTO meta VALUES ('format', 'knotobs results store')")
                c.execute("INSERT OR IGNORE INTO meta VALUES ('schema_version', ?)", (str(SCHEMA_VERSION),))
                c.execute("INSERT OR IGNORE INTO meta VALUES ('created', ?)", (repr(time.time()),))
                c.execute("COMMIT")
            except BaseException:
                c.execute("ROLLBACK")
                raise

    # ------------------------------------------------------------------ writing
    def add_spec(self, spec_key: str, spec: dict) -> None:
        """Remember a grid specification (idempotent)."""
        self.conn.execute("INSERT OR IGNORE INTO specs VALUES (?, ?, ?)", (spec_key, canonical_json(spec), time.time()))

    def insert(self, row: dict) -> bool:
        """Insert one complete row; ``False`` if a row with this key is already there.

        The row must carry every column except ``checksum`` (computed here).
        """
        missing = [k for k in _ROW_COLUMNS[:-1] if k not in row]
        if missing:
            raise StoreError(f"refusing to store an incomplete row (missing {', '.join(missing)})")
        values = [row[k] for k in _ROW_COLUMNS[:-1]] + [_checksum(row["document"])]
        cur = self.conn.execute(
            f"INSERT OR IGNORE INTO rows ({', '.join(_ROW_COLUMNS)}) VALUES ({', '.join('?' * len(_ROW_COLUMNS))})",
            values)
        return cur.rowcount == 1

    # ------------------------------------------------------------------ reading
    def keys(self) -> set[str]:
        return {r[0] for r in self.conn.execute("SELECT key FROM rows")}

    def count(self) -> int:
        return self.conn.execute("SELECT COUNT(*) FROM rows").fetchone()[0]

    def specs(self) -> list[dict]:
        return [json.loads(r[0]) for r in self.conn.execute("SELECT spec FROM specs ORDER BY created")]

    def rows(self, keys: Sequence[str] | None = None) -> Iterator[dict]:
        """Every stored row (or those with the given keys), checksums verified.

        Raises
        ------
        StoreError
            If a row's document does not match its checksum (a damaged row).
        """
        sql = f"SELECT {', '.join(_ROW_COLUMNS)} FROM rows ORDER BY knot, rep, level, key"
        wanted = set(keys) if keys is not None else None
        for rec in self.conn.execute(sql):
            row = dict(zip(_ROW_COLUMNS, rec))
            if wanted is not None and row["key"] not in wanted:
                continue
            if _checksum(row["document"]) != row["checksum"]:
                raise StoreError(f"row {row['key'][:12]}... of {self.path!r} is damaged (checksum mismatch);"
                                 " delete it and resume the grid to recompute it")
            yield row

    def close(self) -> None:
        try:
            self.conn.close()
        except Exception:  # pragma: no cover
            pass

    def __enter__(self) -> "GridStore":
        return self

    def __exit__(self, *exc) -> None:
        self.close()
