"""The two runs of a checked computation side by side (knotobs.paired_runs).

Internal checks: the forked run must give exactly the balls of the serial run (so the
certification of docs/numerics.md §16.1 is unchanged), its errors must surface here, and a child
that dies must not lose the value.  The outside check of the SU(3) numbers themselves is in
tests/test_continuation_sun_poles.py (the finite-level localisation sum, Rozansky, Commun. Math.
Phys. 178 (1996)); here only serial against parallel.
"""

from __future__ import annotations

import os
import random
import sys

import pytest
from flint import acb, arb, ctx

from knotobs import paired_runs
from knotobs.continuation._num import bits, working_bits
from knotobs.errors import PrecisionError
from knotobs.paired_runs import decode, encode, run_both


def _same(x: acb, y: acb) -> bool:
    return (x.real.mid() == y.real.mid() and x.imag.mid() == y.imag.mid()
            and x.real.rad() <= y.real.rad() <= 1.01 * x.real.rad() + 1e-300
            and x.imag.rad() <= y.imag.rad() <= 1.01 * x.imag.rad() + 1e-300)


def test_balls_travel_exactly_at_any_precision():
    rng = random.Random(7)
    for prec in (53, 200, 1000):
        with working_bits(prec):
            xs = [acb(rng.randint(-10**9, 10**9), rng.randint(-10**9, 10**9)) / rng.randint(1, 10**6)
                  * acb(arb(1, 10.0 ** rng.randint(-200, -5))) for _ in range(50)]
            xs += [acb(0), acb(arb(0, 1e-30)), acb(2) ** 4000, acb(1) / acb(3) ** 700]
        obj = {"a": xs, 3: (xs[0], [xs[1]]), "n": 5}
        with working_bits(53):                          # decoding at a lower precision loses nothing
            back = decode(encode(obj))
        assert back["n"] == 5 and isinstance(back[3], tuple)
        assert all(_same(x, y) for x, y in zip(xs, back["a"]))
        assert _same(xs[0], back[3][0]) and _same(xs[1], back[3][1][0])
    assert ctx.prec == 53


def test_forked_run_equals_the_serial_run():
    from knotobs.continuation.cartan.poles import pole_sum_sectors

    def comp(dg):
        with working_bits(bits(dg)):
            return pole_sum_sectors((2, 3, 5), 1, 30, acb(9.5, 0.2), dg)

    serial = run_both(comp, 8, 12, parallel=False)
    forked = run_both(comp, 8, 12, parallel=True)
    for s, f in zip(serial, forked):
        assert s.keys() == f.keys() and len(s) > 3
        assert all(_same(s[k], f[k]) for k in s)


def test_child_errors_are_raised_here():
    def comp(dg):
        if dg == 2:
            raise PrecisionError(f"run {dg} failed")
        return acb(dg)

    with pytest.raises(PrecisionError, match="run 2 failed"):
        run_both(comp, 1, 2, parallel=True)


def test_a_child_that_dies_is_replaced_by_a_run_here():
    def comp(dg):
        if paired_runs._IN_CHILD:
            os._exit(3)
        return {"v": acb(dg) / 7}

    a, b = run_both(comp, 1, 2, parallel=True)
    assert _same(b["v"], acb(2) / 7) and _same(a["v"], acb(1) / 7)


def test_no_fork_inside_the_child():
    out = run_both(lambda dg: acb(int(paired_runs.second_core())), 1, 2, parallel=True)
    assert out[1] == 0


def test_continued_value_is_the_same_serial_or_side_by_side(monkeypatch):
    from knotobs.continuation.cartan import continued_sun_partition_function

    vals = []
    for two in (False, True):
        monkeypatch.setattr(paired_runs, "second_core", lambda two=two: two)
        z = continued_sun_partition_function("Sigma(2,3,5)", "SU(3)", level="4.5+0.2i", digits=12)
        vals.append((z.numeric, dict(z.sectors)))
    assert vals[0] == vals[1]


def test_no_fork_while_other_threads_run():
    import threading

    stop = threading.Event()
    t = threading.Thread(target=stop.wait)
    t.start()
    try:
        assert paired_runs.second_core() is False
    finally:
        stop.set()
        t.join()


_SLEEPER = """
import os, sys, time
from flint import acb
from knotobs.paired_runs import run_both
def comp(dg):
    if dg == 2:
        print(os.getpid(), flush=True)
    time.sleep(60)
    return acb(dg)
try:
    run_both(comp, 1, 2, parallel=True)
except KeyboardInterrupt:
    sys.exit(3)
"""


@pytest.mark.parametrize("sig", ["SIGINT"] + (["SIGKILL"] if sys.platform.startswith("linux") else []))
def test_stopping_the_command_stops_the_child(sig):
    # Ctrl-C (SIGINT to the parent) kills the child in the parent's cleanup; a parent killed
    # outright takes the child with it (the kernel's parent-death signal, Linux)
    import signal
    import subprocess
    import time

    p = subprocess.Popen([sys.executable, "-c", _SLEEPER], stdout=subprocess.PIPE, text=True,
                         preexec_fn=lambda: signal.signal(signal.SIGINT, signal.SIG_DFL))
    child = int(p.stdout.readline())
    os.kill(p.pid, getattr(signal, sig))
    p.wait(timeout=20)
    for _ in range(100):
        try:
            os.kill(child, 0)
        except ProcessLookupError:
            break
        try:                                   # reap it if it is ours (it is not: the parent's)
            os.waitpid(child, os.WNOHANG)
        except ChildProcessError:
            pass
        time.sleep(0.1)
    else:
        raise AssertionError(f"child {child} still runs after {sig} to its parent")
    if sig == "SIGINT":
        assert p.returncode == 3


class _Unrebuildable(Exception):
    def __init__(self, a, b):                  # pickles, but cannot be rebuilt from its args
        super().__init__(f"{a} and {b}")


def test_an_error_that_cannot_travel_is_raised_by_a_run_here():
    def comp(dg):
        if dg == 2:
            raise _Unrebuildable("x", "y")
        return acb(dg)

    with pytest.raises(_Unrebuildable, match="x and y"):
        run_both(comp, 1, 2, parallel=True)
