"""Progress of long work on a terminal: one line on stderr, rewritten in place.

Library functions that can take long accept a ``progress`` callable ``progress(done, total)``;
the command line passes a :class:`TerminalProgress` when stderr is a terminal, so scripts and
pipes never see it.

>>> p = TerminalProgress("demo", enabled=False)
>>> p(1, 4); p(4, 4); p.close()
"""

from __future__ import annotations

import sys
import time

__all__ = ["TerminalProgress", "terminal_progress"]


class TerminalProgress:
    """``label: done/total  elapsed`` on stderr, at most every 0.2 s, after the first second."""

    def __init__(self, label: str, enabled: bool = True, stream=None):
        self.label = label
        self.stream = stream or sys.stderr
        self.enabled = enabled
        self.t0 = time.monotonic()
        self.last = 0.0
        self.shown = False

    def __call__(self, done: int, total: int) -> None:
        if not self.enabled:
            return
        now = time.monotonic()
        if now - self.t0 < 1.0 or (now - self.last < 0.2 and done < total):
            return
        self.last = now
        self.shown = True
        self.stream.write(f"\r{self.label}: {done}/{total}  {now - self.t0:6.1f} s")
        self.stream.flush()

    def close(self) -> None:
        if self.enabled and self.shown:
            self.stream.write("\n")
            self.stream.flush()


def terminal_progress(label: str):
    """A :class:`TerminalProgress` when stderr is a terminal, else ``None``."""
    return TerminalProgress(label) if sys.stderr.isatty() else None
