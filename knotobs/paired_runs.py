"""The two runs of a checked computation, side by side on two cores.

A certified value in knotobs comes from two runs that differ in every discretisation parameter
(:func:`knotobs.ball_series.checked`); they are independent by design, so on a machine with a
second core the finer run goes to a forked child process while this process does the coarser one.
Results come back exactly: every ball travels as the integers of its midpoint and radius
(:func:`encode`, :func:`decode`), so the values are the same as one after the other.

One run after the other is used when the platform has no ``fork``, when only one core is
available to this process, when the process runs other threads (a lock held by one of them at
the fork could stall the child; notebooks and servers run threads), inside a child (no nesting)
or inside a worker process of a pool (grids already use the cores).  The child's exceptions are
raised here.  Stopping the command stops the child: Ctrl-C kills it in the parent's cleanup,
and on Linux a parent killed outright takes the child with it (the parent-death signal).

References
----------
Conventions: docs/numerics.md §16.1 (the two runs of every numeric value).
"""

from __future__ import annotations

import multiprocessing
import os
import pickle
import signal
import threading
from typing import Any, Callable, TypeVar

from flint import acb, arb, ctx

from knotobs.numerics import working_precision

__all__ = ["encode", "decode", "second_core", "run_both"]

T = TypeVar("T")

_IN_CHILD = False


def _arb_ints(x: arb) -> tuple[int, int, int, int]:
    m, e = x.mid().man_exp()
    rm, re = x.rad().man_exp()
    return int(m), int(e), int(rm), int(re)


def _arb_from(m: int, e: int, rm: int, re: int) -> arb:
    with working_precision(bits=max(ctx.prec, m.bit_length() + 8)):    # the midpoint exactly
        two = arb(2)
        return arb(arb(m) * two ** e, arb(rm) * two ** re)


def encode(obj: Any) -> Any:
    """``obj`` with every ``acb``/``arb`` replaced by exact integers (nested dicts, lists, tuples).

    >>> from flint import acb
    >>> encode({1: acb(3, -0.5)})
    {1: ('acb', (3, 0, 0, 0), (-1, -1, 0, 0))}
    """
    if isinstance(obj, acb):
        return ("acb", _arb_ints(obj.real), _arb_ints(obj.imag))
    if isinstance(obj, arb):
        return ("arb", _arb_ints(obj))
    if isinstance(obj, dict):
        return {k: encode(v) for k, v in obj.items()}
    if isinstance(obj, list):
        return [encode(v) for v in obj]
    if isinstance(obj, tuple):
        return ("tuple", [encode(v) for v in obj])
    return obj


def decode(obj: Any) -> Any:
    """The inverse of :func:`encode`: the same midpoints, radii rounded up (never smaller).

    >>> from flint import acb, ctx
    >>> x = acb(1, 2) / 3
    >>> y = decode(encode(x))
    >>> y.real.mid() == x.real.mid() and y.imag.mid() == x.imag.mid() and y.rad() >= x.rad()
    True
    """
    if isinstance(obj, tuple) and len(obj) in (2, 3) and obj[0] in ("acb", "arb", "tuple"):
        if obj[0] == "acb":
            return acb(_arb_from(*obj[1]), _arb_from(*obj[2]))
        if obj[0] == "arb":
            return _arb_from(*obj[1])
        return tuple(decode(v) for v in obj[1])
    if isinstance(obj, dict):
        return {k: decode(v) for k, v in obj.items()}
    if isinstance(obj, list):
        return [decode(v) for v in obj]
    return obj


def second_core() -> bool:
    """Whether :func:`run_both` may fork: a ``fork`` platform, two cores for this process, one
    thread, not itself a child or a pool worker.

    >>> isinstance(second_core(), bool)
    True
    """
    if _IN_CHILD or not hasattr(os, "fork"):
        return False
    if multiprocessing.parent_process() is not None or threading.active_count() > 1:
        return False
    try:
        n = len(os.sched_getaffinity(0))
    except (AttributeError, OSError):
        n = os.cpu_count() or 1
    return n >= 2


def _read_all(fd: int) -> bytes:
    chunks = []
    while True:
        b = os.read(fd, 1 << 20)
        if not b:
            return b"".join(chunks)
        chunks.append(b)


def _die_with(parent: int) -> None:
    """Ask the kernel to end this child when ``parent`` ends (Linux), so a killed command leaves
    no run behind; elsewhere the child ends when it finds the pipe closed."""
    try:
        import ctypes

        ctypes.CDLL(None).prctl(1, signal.SIGKILL)     # PR_SET_PDEATHSIG
    except Exception:                                  # noqa: BLE001  (not Linux)
        pass
    if os.getppid() != parent:                         # the parent ended before the request
        os._exit(1)


def run_both(compute: Callable[[int], T], a: int, b: int, parallel: bool | None = None) -> tuple[T, T]:
    """``(compute(a), compute(b))``; ``compute(b)`` in a forked child when :func:`second_core`.

    ``compute`` must return balls in nested dicts, lists and tuples (keys and other values
    picklable) and must not rely on side effects: those of the child are lost.  ``parallel``
    forces either way (``None``: :func:`second_core`).

    >>> from flint import acb
    >>> run_both(lambda d: {"x": acb(d) / 4}, 1, 2, parallel=True)
    ({'x': 0.250000000000000}, {'x': 0.500000000000000})
    """
    if parallel is None:
        parallel = second_core()
    if not parallel:
        return compute(a), compute(b)
    parent = os.getpid()
    try:
        r, w = os.pipe()
        pid = os.fork()
    except OSError:
        return compute(a), compute(b)
    if pid == 0:                                       # the child: compute(b), send it, leave
        global _IN_CHILD
        _IN_CHILD = True
        code = 0
        try:
            os.close(r)
            signal.signal(signal.SIGINT, signal.SIG_DFL)
            _die_with(parent)
            try:
                payload = pickle.dumps(("ok", encode(compute(b))))
            except BaseException as exc:               # noqa: BLE001  (sent to the parent)
                try:
                    payload = pickle.dumps(("err", exc))
                except Exception:                      # noqa: BLE001
                    payload = pickle.dumps(("err", RuntimeError(f"{type(exc).__name__}: {exc}")))
            with os.fdopen(w, "wb") as f:
                f.write(payload)
        except BaseException:                          # noqa: BLE001
            code = 1
        finally:
            os._exit(code)
    os.close(w)
    done = False
    try:
        first = compute(a)
        data = _read_all(r)
        os.waitpid(pid, 0)
        done = True
    finally:
        os.close(r)
        if not done:                                   # this run failed or was interrupted
            try:
                os.kill(pid, signal.SIGKILL)
                os.waitpid(pid, 0)
            except OSError:
                pass
    if not data:
        return first, compute(b)                       # the child died: do its run here
    try:
        status, value = pickle.loads(data)
    except Exception:                                  # noqa: BLE001  (an exception that cannot be rebuilt)
        return first, compute(b)
    if status == "err":
        raise value
    return first, decode(value)
