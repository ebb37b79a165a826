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

__all__ = ["GridStore", "APPLICATION_ID", "SCHEMA_VERSION", "canonical_json", "description_key",
           "point_key", "store_write_error", "check_store_path"]

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


def point_key(description: dict) -> str:
    """Key of a grid point regardless of the package version that computed it.

    Rows are stored under :func:`description_key` of their full description (version
    included); two rows of the same point written by different versions share this key, so
    a store from another version is resumed and exported without duplicates.

    >>> point_key({"knot": "T(2,3)", "version": "1"}) == point_key({"knot": "T(2,3)", "version": "2"})
    True
    """
    return description_key({k: v for k, v in description.items() if k != "version"})


def check_store_path(path) -> str:
    """A usable file name for a store: not empty, not a directory.

    >>> check_store_path("")
    Traceback (most recent call last):
    ...
    knotobs.errors.StoreError: the results store name is empty: give a file name such as grid.sqlite
    """
    p = os.fspath(path) if path is not None else ""
    if not str(p).strip():
        raise StoreError("the results store name is empty: give a file name such as grid.sqlite")
    if os.path.isdir(p):
        raise StoreError(f"results store {p!r} is a directory: give a file name, e.g. {os.path.join(p, 'grid.sqlite')!r}")
    parent = os.path.dirname(os.path.abspath(p))
    if not os.path.isdir(parent):
        raise StoreError(f"results store {p!r}: the directory {parent!r} does not exist")
    return p


def store_write_error(path: str, exc: BaseException, stored: int | None = None,
                      resumable: bool = True) -> StoreError:
    """A clear :class:`StoreError` for an SQLite failure while writing ``path``."""
    msg = str(exc).lower()
    kept = (f"; the {stored} rows stored before are intact" if stored is not None else
            "; rows stored before are intact")
    again = "run 'knotobs grid resume' to finish" if resumable else "run the same grid again"
    if "full" in msg or getattr(exc, "errno", None) == 28:
        why = "the disk (or quota) is full"
        todo = f"free space, then {again}"
    elif "readonly" in msg or "read-only" in msg or "permission" in msg:
        why = "the file or its directory is read-only"
        todo = "choose a writable location (a store in a read-only place can still be read: status, export)"
    elif "locked" in msg or "busy" in msg:
        why = "another process holds a lock on it"
        todo = f"wait for the other writer to finish, then {again}"
    elif "unable to open" in msg:
        why = "the file cannot be created or opened there"
        todo = "check the directory exists and is writable"
    else:
        why = f"SQLite reported: {exc}"
        todo = f"{again} when the cause is fixed"
    return StoreError(f"cannot write results store {path!r}: {why}{kept}; {todo}")


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

    def __init__(self, path: str, timeout: float = 60.0, readonly: bool = False):
        self.path = check_store_path(path)
        self.readonly = readonly
        self.timeout = float(timeout)
        fresh = not os.path.exists(self.path) or os.path.getsize(self.path) == 0
        if readonly and fresh:
            raise StoreError(f"results store {self.path!r} "
                             f"{'is empty' if os.path.exists(self.path) else 'does not exist'}; run a grid first")
        if not fresh:
            self._check_header()
        try:
            if readonly:
                self.conn = self._connect_readonly(timeout)
            else:
                self.conn = sqlite3.connect(self.path, timeout=timeout, isolation_level=None)
        except sqlite3.Error as exc:
            raise StoreError(f"cannot open results store {self.path!r}: {exc}") from None
        try:
            if readonly:
                self._check(self.conn)
            else:
                self._init_retrying(fresh, timeout)
        except sqlite3.OperationalError as exc:
            self.conn.close()
            if readonly:
                raise StoreError(f"cannot read results store {self.path!r} ({exc}): its directory cannot be"
                                 " written and it has an unfinished write-ahead log (-wal file) from an interrupted"
                                 " writer; copy the store with its -wal file to a writable place") from None
            if any(w in str(exc).lower() for w in ("full", "readonly", "read-only", "locked", "busy", "unable to open")):
                raise store_write_error(self.path, exc, resumable=False) from None
            raise StoreError(f"{self.path!r} is not a usable knotobs results store ({exc});"
                             " give a new file name or a store written by knotobs") from None
        except sqlite3.DatabaseError as exc:
            self.conn.close()
            raise StoreError(f"{self.path!r} is not a usable knotobs results store ({exc});"
                             " give a new file name or a store written by knotobs") from None
        except StoreError:
            self.conn.close()
            raise

    def _connect_readonly(self, timeout: float) -> sqlite3.Connection:
        """Read-only connection; in a directory we cannot write, the file is opened as immutable
        (SQLite cannot create the WAL index there), which is safe when no writer can exist."""
        from urllib.parse import quote

        folder = os.path.dirname(os.path.abspath(self.path))
        uri = f"file:{quote(os.path.abspath(self.path))}?mode=ro"
        if not os.access(folder, os.W_OK) and not os.path.exists(self.path + "-wal"):
            uri += "&immutable=1"
        return sqlite3.connect(uri, uri=True, timeout=timeout, isolation_level=None)

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

    def _check(self, c) -> bool:
        """Validate an existing store; ``True`` when it is an SQLite file without tables (adopt it)."""
        fresh = False
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
        if fresh and self.readonly:
            raise StoreError(f"results store {self.path!r} has no tables yet: run a grid first")
        return fresh

    def _init(self, fresh: bool) -> None:
        c = self.conn
        c.execute(f"PRAGMA busy_timeout = {int(self.timeout * 1000)}")
        if not fresh:
            fresh = self._check(c)
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
                if c.in_transaction:
                    c.execute("ROLLBACK")
                raise

    # ------------------------------------------------------------------ writing
    def add_spec(self, spec_key: str, spec: dict) -> None:
        """Remember a grid specification (idempotent, also across package versions)."""
        text = canonical_json(spec)
        try:
            if self.conn.execute("SELECT 1 FROM specs WHERE spec = ? LIMIT 1", (text,)).fetchone():
                return
            self.conn.execute("INSERT OR IGNORE INTO specs VALUES (?, ?, ?)", (spec_key, text, time.time()))
        except sqlite3.OperationalError as exc:
            raise store_write_error(self.path, exc, resumable=False) from None

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

    def point_keys(self) -> set[str]:
        """:func:`point_key` of every stored row (rows of any package version)."""
        out = set()
        for key, desc in self.conn.execute("SELECT key, description FROM rows"):
            try:
                d = json.loads(desc)
                if not isinstance(d, dict):
                    raise ValueError("not an object")
            except (TypeError, ValueError):
                raise StoreError(f"row {str(key)[:12]}... of {self.path!r} is damaged (its description is not"
                                 " valid JSON); delete it and resume the grid to recompute it") from None
            out.add(point_key(d))
        return out

    def count(self) -> int:
        return self.conn.execute("SELECT COUNT(*) FROM rows").fetchone()[0]

    def specs(self) -> list[dict]:
        """Every recorded grid specification (a damaged one is a :class:`StoreError`)."""
        out = []
        for i, (key, text) in enumerate(self.conn.execute("SELECT spec_key, spec FROM specs ORDER BY rowid")):
            try:
                d = json.loads(text)
                if not isinstance(d, dict):
                    raise ValueError("not a JSON object")
            except (TypeError, ValueError) as exc:
                raise StoreError(f"grid specification {i + 1} ({str(key)[:12]}...) in {self.path!r} is damaged"
                                 f" ({exc}); delete that row of table specs or use another store") from None
            out.append(d)
        return out

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
