"""Figures (matplotlib; PNG, SVG or PDF chosen by the file suffix).

* :func:`plot_level_plane` — modulus and phase of the continued ``Z(K)`` of a Seifert
  manifold over a rectangle of the complex ``K`` plane (Lawrence–Rozansky continuation);
* :func:`plot_asymptotics` — exact finite-level values against the asymptotic sum over flat
  connections, and the error on log–log axes with the predicted slopes (the comparison of
  D. S. Freed and R. E. Gompf, Commun. Math. Phys. 141 (1991) 79–117);
* :func:`plot_zeros` — zeros of a Jones-type polynomial invariant of a torus knot in the
  complex plane of its variable.

matplotlib is an optional dependency (``pip install matplotlib``).
"""

from __future__ import annotations

import math
from pathlib import Path

import mpmath

from knotobs.errors import KnotobsError

__all__ = ["plot_level_plane", "plot_asymptotics", "plot_zeros", "PlotError", "FORMATS"]

FORMATS = (".png", ".svg", ".pdf")


class PlotError(KnotobsError, ValueError):
    """A figure that cannot be produced (missing matplotlib, bad file type, bad range)."""


def _plt():
    try:
        import matplotlib

        matplotlib.use("Agg")
        import matplotlib.pyplot as plt
    except ImportError:  # pragma: no cover
        raise PlotError("plots need matplotlib: pip install matplotlib") from None
    return plt


def _out(path) -> Path:
    p = Path(path)
    if p.suffix.lower() not in FORMATS:
        raise PlotError(f"output file {str(path)!r}: the suffix must be one of {', '.join(FORMATS)}")
    return p


def _save(fig, p: Path, plt) -> None:
    """Write the figure; a file that cannot be written is a :class:`PlotError`, never a partial file."""
    try:
        fig.savefig(p)
    except OSError as exc:
        try:
            p.unlink()
        except OSError:
            pass
        raise PlotError(f"cannot write {str(p)!r}: {exc.strerror or exc}") from None
    finally:
        plt.close(fig)


def _range(r, name: str) -> tuple[float, float]:
    try:
        a, b = (float(x) for x in r)
    except (TypeError, ValueError):
        raise PlotError(f"{name} = {r!r}: give two numbers (a, b) with a < b") from None
    if not (math.isfinite(a) and math.isfinite(b) and a < b):
        raise PlotError(f"{name} = {r!r}: give two finite numbers (a, b) with a < b")
    return a, b


class _Progress:
    """``label i/n`` on stderr while a long figure is computed, only when stderr is a terminal."""

    def __init__(self, label: str, total: int):
        import sys
        import time

        self.label, self.total, self.done = label, total, 0
        self.stream = sys.stderr
        self.on = self.stream.isatty() and total > 1
        self.t0 = self.last = time.monotonic()
        self._time = time.monotonic

    def step(self) -> None:
        self.done += 1
        now = self._time()
        if self.on and (now - self.last > 0.2 or self.done == self.total):
            self.last = now
            self.stream.write(f"\r{self.label}: {self.done}/{self.total}  {now - self.t0:5.1f} s")
            self.stream.flush()

    def close(self) -> None:
        if self.on:
            self.stream.write("\n")
            self.stream.flush()


def asymptotic_levels(kmax: int) -> list[int]:
    """The levels ``K`` of :func:`plot_asymptotics` up to ``kmax``: every 5th to 100, then every
    25th, and beyond ``K = 1100`` 40 geometrically spaced levels (so the cost stays bounded).

    >>> asymptotic_levels(30)
    [10, 15, 20, 25, 30]
    >>> len(asymptotic_levels(100000)) < 80
    True
    """
    kmax = int(kmax)
    if kmax < 15:
        raise PlotError(f"kmax = {kmax}: give kmax >= 15 (the plot starts at K = 10 and needs two levels)")
    low = list(range(10, min(kmax, 100) + 1, 5))
    if kmax <= 1100:
        return sorted(set(low + list(range(100, kmax + 1, 25))))
    ratio = (kmax / 100) ** (1 / 39)
    high = {int(round(100 * ratio ** j)) for j in range(40)} | {kmax}
    return sorted(set(low) | high)


def plot_level_plane(space, out, re_range=(3.0, 12.0), im_range=(-1.0, 1.0), n=40, digits=12):
    """Modulus (log scale) and phase of ``Z(K)`` over ``re_range x im_range`` in the ``K`` plane.

    Integer points on the real axis are marked: there ``Z`` is the finite-level value.

    >>> import tempfile, os
    >>> f = os.path.join(tempfile.mkdtemp(), "z.png")
    >>> plot_level_plane("Sigma(2,3,5)", f, n=4, digits=8).name
    'z.png'

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314.
    """
    import numpy as np

    from knotobs.continuation.level import continued_partition_function

    p = _out(out)
    if n < 2 or n > 400:
        raise PlotError(f"grid size n = {n} must be between 2 and 400")
    re_range = _range(re_range, "re_range")
    im_range = _range(im_range, "im_range")
    from knotobs.continuation.level import LRData, continuation_cost
    from knotobs.guard import require

    d = LRData.from_space(space)
    corner = mpmath.mpc(max(abs(re_range[0]), abs(re_range[1])), max(abs(im_range[0]), abs(im_range[1])))
    one, mem, _ = continuation_cost(d, corner, digits)
    require(f"plot level-plane of {space}: {n} x {n} continued values to {digits} digits", seconds=one * n * n,
            memory_mb=mem, accepted=f"use a smaller grid (--n below {n}) or a smaller range")
    plt = _plt()
    xs = np.linspace(*re_range, n)
    ys = np.linspace(*im_range, n)
    mod = np.zeros((n, n))
    ph = np.zeros((n, n))
    bar = _Progress(f"level-plane {space}", n * n)
    for i, y in enumerate(ys):
        for j, x in enumerate(xs):
            z = continued_partition_function(space, K=mpmath.mpc(float(x), float(y)), digits=digits).numeric
            mod[i, j] = float(mpmath.log10(abs(z))) if z != 0 else -digits
            ph[i, j] = float(mpmath.arg(z))
            bar.step()
    bar.close()
    fig, axes = plt.subplots(1, 2, figsize=(11, 4.2), constrained_layout=True)
    ext = (re_range[0], re_range[1], im_range[0], im_range[1])
    im0 = axes[0].imshow(mod, origin="lower", extent=ext, aspect="auto", cmap="viridis")
    fig.colorbar(im0, ax=axes[0], label=r"$\log_{10}|Z(K)|$")
    im1 = axes[1].imshow(ph, origin="lower", extent=ext, aspect="auto", cmap="twilight", vmin=-np.pi, vmax=np.pi)
    fig.colorbar(im1, ax=axes[1], label=r"$\arg Z(K)$")
    ints = [k for k in range(int(np.ceil(re_range[0])), int(np.floor(re_range[1])) + 1) if k >= 2]
    for ax, title in zip(axes, ("modulus", "phase")):
        if im_range[0] <= 0 <= im_range[1]:
            ax.plot(ints, [0] * len(ints), "w.", ms=4)
        ax.set_xlabel(r"Re $K$")
        ax.set_ylabel(r"Im $K$")
        ax.set_title(f"SU(2) $Z(K)$ of {space}: {title}")
    _save(fig, p, plt)
    return p


def plot_asymptotics(space, out, Ks=None, orders=(0, 1, 2), digits=30):
    """Exact ``Z_K`` against the asymptotic sum, and ``|exact - asymptotic|`` versus ``K``.

    >>> import tempfile, os
    >>> f = os.path.join(tempfile.mkdtemp(), "a.svg")
    >>> plot_asymptotics("L(5,1)", f, Ks=[20, 40, 80], orders=(0,), digits=20).suffix
    '.svg'

    References
    ----------
    D. S. Freed and R. E. Gompf, Commun. Math. Phys. 141 (1991) 79–117.
    """
    from knotobs.continuation.asymptotics import compare_with_exact, predicted_exponent

    from knotobs.continuation.level import LRData
    from knotobs.guard import require, seconds_for

    p = _out(out)
    if Ks is None:
        Ks = list(range(10, 101, 3)) + list(range(110, 501, 30))
    Ks = [int(k) for k in Ks]
    if len(Ks) < 2:
        raise PlotError(f"Ks = {Ks!r}: give at least two levels")
    d = LRData.from_space(space)
    # one Gauss sum of 2 P K terms (n + 2 factors each) and one asymptotic sum per level and order
    ops = sum(2 * d.P * K * (d.n + 2) for K in Ks) * len(orders)
    require(f"plot asymptotics of {space} at {len(Ks)} levels up to K = {max(Ks)}",
            seconds=seconds_for(ops, "numpy") * 40 + seconds_for(len(Ks) * len(orders) * 1e5, "python"),
            memory_mb=max(Ks) * d.P * 2 * 16 * 4 / 1e6, accepted="use a smaller kmax")
    plt = _plt()
    fig, axes = plt.subplots(1, 2, figsize=(11, 4.2), constrained_layout=True)
    rows0 = None
    bar = _Progress(f"asymptotics {space}", len(orders))
    for order in orders:
        rows = compare_with_exact(space, Ks, order=order, digits=digits)
        bar.step()
        rows0 = rows0 or rows
        errs = [float(r.error) for r in rows]
        axes[1].loglog(Ks, errs, "o-", ms=3, label=f"order {order}")
        e = float(predicted_exponent(space, order))
        ref = errs[-1] * (Ks[-1] ** e)
        axes[1].loglog(Ks, [ref * k ** (-e) for k in Ks], "--", lw=0.8, color="gray")
        if order == orders[-1]:
            axes[0].plot(Ks, [float(r.asymptotic.real) for r in rows], "-", lw=1, label="asymptotic (Re)")
    bar.close()
    axes[0].plot(Ks, [float(r.exact.real) for r in rows0], "k.", ms=4, label="exact (Re)")
    axes[0].set_xlabel(r"$K = k + 2$")
    axes[0].set_ylabel(r"Re $Z_K$")
    axes[0].set_title(f"{space}: exact values and the sum over flat connections")
    axes[0].legend()
    axes[1].set_xlabel(r"$K$")
    axes[1].set_ylabel(r"$|Z_K - Z_K^{asympt}|$")
    axes[1].set_title("error (dashed: predicted power of K)")
    axes[1].legend()
    _save(fig, p, plt)
    return p


def plot_zeros(knot, out, family="jones", color=None):
    """Zeros of the Jones (or coloured Jones, ``color = n``) polynomial of a torus knot.

    The polynomial is written in ``y = t^(1/D)`` when it has fractional exponents
    (``D`` the exponent denominator); the unit circle is drawn.

    >>> import tempfile, os
    >>> f = os.path.join(tempfile.mkdtemp(), "zeros.pdf")
    >>> plot_zeros("T(3,4)", f).suffix
    '.pdf'

    References
    ----------
    V. F. R. Jones, Ann. of Math. 126 (1987) 335–388.
    """
    import numpy as np

    from knotobs.evaluation.families import colored_jones, jones

    p = _out(out)
    plt = _plt()
    if family == "jones":
        res = jones(knot)
    elif family in ("colored-jones", "coloured-jones"):
        if color is None:
            raise PlotError("family colored-jones needs a colour n >= 1")
        res = colored_jones(knot, int(color))
    else:
        raise PlotError(f"family {family!r}: use jones or colored-jones")
    poly = res.value.canonical()
    terms = poly.terms()
    D = 1
    for e in terms:
        D = max(D, e.denominator) if D % e.denominator == 0 else D * e.denominator
    lo = min(terms)
    deg = int((max(terms) - lo) * D)
    coeffs = [0] * (deg + 1)
    for e, c in terms.items():
        coeffs[int((e - lo) * D)] += c
    roots = np.roots(list(reversed(coeffs))) if deg > 0 else np.array([])
    fig, ax = plt.subplots(figsize=(5, 5), constrained_layout=True)
    th = np.linspace(0, 2 * np.pi, 400)
    ax.plot(np.cos(th), np.sin(th), color="gray", lw=0.6)
    ax.plot(roots.real, roots.imag, "o", ms=4)
    ax.axhline(0, color="gray", lw=0.4)
    ax.axvline(0, color="gray", lw=0.4)
    ax.set_aspect("equal")
    var = "t" if D == 1 else f"t^(1/{D})"
    ax.set_xlabel(f"Re {var}")
    ax.set_ylabel(f"Im {var}")
    ax.set_title(f"zeros of {res.quantity} of {knot} ({len(roots)} zeros)")
    _save(fig, p, plt)
    return p
