"""Figures (matplotlib; PNG, SVG or PDF chosen by the file suffix) and the data behind them.

* :func:`plot_level_plane` — modulus and phase of the continued ``Z(K)`` of a Seifert
  manifold over a rectangle of the complex ``K`` plane (Lawrence–Rozansky continuation),
  computed on a grid and drawn smoothly (bicubic interpolation of ``Re Z`` and ``Im Z``);
* :func:`plot_asymptotics` — exact finite-level values at **every** integer ``K`` against
  the asymptotic sum over flat connections: modulus, phase and the error on log–log axes
  with the predicted slopes (the comparison of D. S. Freed and R. E. Gompf, Commun. Math.
  Phys. 141 (1991) 79–117);
* :func:`plot_zeros` — zeros of a Jones-type polynomial of a torus knot;
* :func:`plot_wilson_level` — a knot's Wilson loop at every level ``k`` (modulus and phase),
  with the exact polynomial at ``q = exp(2 pi i/K)`` for real ``K`` drawn through them.

Every figure states its group, color, framing and normalization.  Each function returns a
:class:`Figure` (the file and the data drawn, ``to_json()``); ``out=None`` computes the
data only.  matplotlib is an optional dependency (``pip install matplotlib``).
"""

from __future__ import annotations

import sys
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, Callable, Optional

import mpmath

from knotobs.errors import KnotobsError
from knotobs.guard import require

__all__ = ["plot_level_plane", "plot_asymptotics", "plot_zeros", "plot_wilson_level", "PlotError", "FORMATS",
           "Figure", "smooth_grid"]

FORMATS = (".png", ".svg", ".pdf")


class PlotError(KnotobsError, ValueError):
    """A figure that cannot be produced (missing matplotlib, bad file type, bad range)."""


@dataclass
class Figure:
    """A written figure (or only its data): ``path`` (``None`` without a file), ``kind`` and ``data``."""

    path: Optional[Path]
    kind: str
    data: dict = field(default_factory=dict)

    @property
    def name(self) -> str:
        return self.path.name if self.path else ""

    @property
    def suffix(self) -> str:
        return self.path.suffix if self.path else ""

    def __fspath__(self) -> str:
        return str(self.path)

    def __str__(self) -> str:
        return str(self.path) if self.path else f"<{self.kind} data>"

    def to_json(self) -> dict[str, Any]:
        return {"kind": self.kind, "file": None if self.path is None else str(self.path), **self.data}


def _plt():
    try:
        import matplotlib

        matplotlib.use("Agg")
        import matplotlib.pyplot as plt
    except ImportError:  # pragma: no cover
        raise PlotError("plots need matplotlib: pip install matplotlib") from None
    return plt


def _out(path) -> Optional[Path]:
    if path is None:
        return None
    p = Path(path)
    if p.suffix.lower() not in FORMATS:
        raise PlotError(f"--output {str(path)!r}: the suffix must be one of {', '.join(FORMATS)}")
    return p


def _c(z) -> list[float]:
    return [float(mpmath.re(z)), float(mpmath.im(z))]


def _to_digits(x: float, digits: int) -> float:
    """``x`` rounded to ``digits`` significant digits (a figure's data carry no digits beyond those
    its values were certified to; doubles hold at most 17).

    >>> _to_digits(0.12345678901234567, 6), _to_digits(-2.5e-40, 3)
    (0.123457, -2.5e-40)
    """
    return float(f"{x:.{max(1, min(int(digits), 17))}g}")


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
    """Two finite numbers ``a < b`` (``nan``/``inf`` and empty ranges are refused)."""
    import math

    try:
        a, b = (float(x) for x in r)
    except (TypeError, ValueError):
        raise PlotError(f"{name} = {r!r}: give two numbers a,b with a < b") from None
    if not (math.isfinite(a) and math.isfinite(b) and a < b):
        raise PlotError(f"{name} = {r!r}: give two finite numbers a,b with a < b")
    return a, b


def _progress(total: int, show: bool) -> Callable[[int], None]:
    """A one-line progress bar on stderr (only when ``show``)."""
    if not show:
        return lambda i: None

    def step(i: int) -> None:
        w = 30
        f = i / total
        sys.stderr.write(f"\r[{'#' * int(w * f):<{w}}] {i}/{total} points")
        if i == total:
            sys.stderr.write("\n")
        sys.stderr.flush()

    return step


def smooth_grid(values, factor: int):
    """Bicubic (Catmull–Rom) upsampling of a 2-D array by ``factor`` along both axes.

    Exact at the grid points; used on ``Re Z`` and ``Im Z`` separately so that the phase
    has no interpolation artefacts at its branch cut.

    >>> import numpy as np
    >>> a = np.arange(12.0).reshape(3, 4)        # linear data is reproduced exactly
    >>> b = smooth_grid(a, 2)
    >>> b.shape, float(b[0, 1]), float(b[2, 0])
    ((5, 7), 0.5, 4.0)
    """
    import numpy as np

    def along(a, axis):
        a = np.moveaxis(np.asarray(a, dtype=complex if np.iscomplexobj(a) else float), axis, 0)
        n = a.shape[0]
        if n < 2 or factor <= 1:
            return np.moveaxis(a, 0, axis)
        t = np.linspace(0, n - 1, (n - 1) * factor + 1)
        i = np.clip(np.floor(t).astype(int), 0, n - 2)
        s = (t - i).reshape((-1,) + (1,) * (a.ndim - 1))
        p1, p2 = a[i], a[i + 1]
        # ghost points beyond the edges by linear extrapolation (keeps linear data exact)
        first = (i == 0).reshape(s.shape)
        last = (i + 2 > n - 1).reshape(s.shape)
        p0 = np.where(first, 2 * p1 - p2, a[np.clip(i - 1, 0, n - 1)])
        p3 = np.where(last, 2 * p2 - p1, a[np.clip(i + 2, 0, n - 1)])
        out = 0.5 * ((2 * p1) + (-p0 + p2) * s + (2 * p0 - 5 * p1 + 4 * p2 - p3) * s ** 2
                     + (-p0 + 3 * p1 - 3 * p2 + p3) * s ** 3)
        return np.moveaxis(out, 0, axis)

    return along(along(values, 0), 1)


def _space_profile(group: str = "SU(2)") -> str:
    """The profile line of a partition-function figure for ``group``."""
    return f"{group}, color: none (no Wilson line); canonical 2-framing; normalization Z(S^3) = S_00"


def plot_level_plane(space, out=None, re_range=(3.0, 12.0), im_range=(-1.0, 1.0), n=24, digits=12,
                     smooth: int = 6, progress: Optional[bool] = None, group: str = "SU(2)") -> Figure:
    """Modulus (log scale) and phase of ``Z(K)`` over ``re_range x im_range`` in the ``K`` plane.

    ``Z`` is computed on an ``n x n`` grid and drawn after bicubic upsampling by ``smooth``;
    integer points on the real axis (the finite levels) are marked and named in a legend.
    ``group``: ``SU(N)``; SU(2) uses the Lawrence–Rozansky continuation (docs §9), SU(N) and the
    spaces with ``e = 0`` that of docs/continuation_sun.md (§18).

    >>> import tempfile, os
    >>> f = os.path.join(tempfile.mkdtemp(), "z.png")
    >>> plot_level_plane("Sigma(2,3,5)", f, n=4, digits=8).name
    'z.png'

    References
    ----------
    R. Lawrence and L. Rozansky, Commun. Math. Phys. 205 (1999) 287–314.
    """
    import numpy as np

    from knotobs.continuation.cartan.quasipolynomial import has_zero_euler
    from knotobs.fibrations.seifert import parse_space
    from knotobs.representations.groups import parse_group

    p = _out(out)
    if n < 2 or n > 400:
        raise PlotError(f"--n {n}: the grid size must be between 2 and 400")
    re_range = _range(re_range, "--re")
    im_range = _range(im_range, "--im")
    from knotobs.guard import require

    g = parse_group(group)
    if g.kind != "SU":
        raise PlotError(f"--group {group}: the continuation in the level is computed for SU(N)")
    N = g.N
    corner = mpmath.mpc(max(abs(re_range[0]), abs(re_range[1])), max(abs(im_range[0]), abs(im_range[1])))
    xs = np.linspace(*re_range, n)
    ys = np.linspace(*im_range, n)
    # the work per value grows with |K| (sizes of the Gaussian sums) or as K -> 0 (wider
    # Gaussians, more nodes): estimated at the far corner and at the grid point nearest 0
    near = min((complex(float(x), float(y)) for x in xs for y in ys), key=abs)
    points = (corner, mpmath.mpc(near))
    if N == 2 and not has_zero_euler(parse_space(space)):
        from knotobs.continuation.level import LRData, continuation_cost

        data = LRData.from_space(space)
        costs = [continuation_cost(data, K, digits) for K in points]
        once, one, mem = 0.0, max(c[0] for c in costs), max(c[1] for c in costs)

        def continued(K):
            from knotobs.continuation.level import continued_partition_function

            return continued_partition_function(space, K=K, digits=digits).numeric
    else:
        from knotobs.continuation.cartan.value import continued_sun_partition_function, continued_sun_seconds

        costs = [continued_sun_seconds(space, str(g), K, digits) for K in points]
        once, one, mem = (max(c[i] for c in costs) for i in range(3))

        def continued(K):
            return continued_sun_partition_function(space, str(g), K=K, digits=digits).numeric
    require(f"plot level-plane of {space}, {g}: {n} x {n} continued values to {digits} digits",
            seconds=once + one * n * n, memory_mb=mem,
            accepted=(f"use a smaller grid (--n below {n}) or a smaller range" if n > 2 else
                      "the grid is already the smallest (--n 2): use a smaller N, fewer digits or a smaller range"))
    show = sys.stderr.isatty() if progress is None else progress
    step = _progress(n * n, show)
    Z = np.zeros((n, n), dtype=complex)
    # log10 |Z| and arg Z from the certified values themselves: far from the real axis |Z| leaves
    # the range of floats (10^308), where Z itself is given as null (never Infinity)
    logabs = np.zeros((n, n))
    arg = np.zeros((n, n))
    for i, y in enumerate(ys):
        for j, x in enumerate(xs):
            z = continued(mpmath.mpc(float(x), float(y)))
            Z[i, j] = complex(z) if abs(z) < 1e300 else complex("nan")
            logabs[i, j] = float(mpmath.log10(abs(z))) if z != 0 else -digits
            arg[i, j] = float(mpmath.arg(z))
            step(i * n + j + 1)
    ints = [k for k in range(int(np.ceil(re_range[0])), int(np.floor(re_range[1])) + 1) if k >= N]
    finite = bool(np.isfinite(Z).all())
    profile = _space_profile(str(g))
    data = {"space": str(space), "group": str(g), "profile": profile, "re": xs.tolist(), "im": ys.tolist(),
            "Z": [[[_to_digits(z.real, digits), _to_digits(z.imag, digits)] if np.isfinite(z) else None
                   for z in row] for row in Z],
            "log10_abs_Z": [[_to_digits(v, digits) for v in row] for row in logabs.tolist()],
            "arg_Z": [[_to_digits(v, digits) for v in row] for row in arg.tolist()], "integer_K": ints,
            "index": "Z[i][j], log10_abs_Z[i][j] and arg_Z[i][j] are at K = re[j] + i im[i]"}
    if p is None:
        return Figure(None, "level-plane", data)
    plt = _plt()
    if finite:
        Zs = smooth_grid(Z, smooth)
        with np.errstate(divide="ignore"):
            mod = np.log10(np.maximum(np.abs(Zs), 10.0 ** -digits))
        ph = np.angle(Zs)
    else:                       # beyond floats: the grid values, not smoothed
        mod, ph = np.maximum(logabs, -digits), arg
    fig, axes = plt.subplots(1, 2, figsize=(11, 4.6), constrained_layout=True)
    ext = (re_range[0], re_range[1], im_range[0], im_range[1])
    im0 = axes[0].imshow(mod, origin="lower", extent=ext, aspect="auto", cmap="viridis")
    fig.colorbar(im0, ax=axes[0], label=r"$\log_{10}|Z(K)|$")
    im1 = axes[1].imshow(ph, origin="lower", extent=ext, aspect="auto", cmap="twilight", vmin=-np.pi, vmax=np.pi)
    fig.colorbar(im1, ax=axes[1], label=r"$\arg Z(K)$")
    for ax, title in zip(axes, ("modulus", "phase")):
        if im_range[0] <= 0 <= im_range[1] and ints:
            ax.plot(ints, [0] * len(ints), "wo", ms=4, mec="k", label=f"integer K: finite level k = K - {N}")
            ax.legend(loc="upper right", fontsize=8)
        ax.set_xlabel(r"Re $K$")
        ax.set_ylabel(r"Im $K$")
        ax.set_title(f"{g} $Z(K)$ of {space}: {title}")
    fig.suptitle(profile, fontsize=9)
    _save(fig, p, plt)
    return Figure(p, "level-plane", data)


def plot_asymptotics(space, out=None, Ks=None, orders=(0, 1, 2), digits=30, kmax: int = 200) -> Figure:
    """Exact ``Z_K`` at every integer ``K`` against the asymptotic sum: modulus, phase, error.

    ``Ks`` defaults to every integer ``3 <= K <= kmax`` (sampling only some residues of
    ``K`` would hide oscillations, e.g. on ``L(5,1)`` every fifth ``K``).

    >>> import tempfile, os
    >>> f = os.path.join(tempfile.mkdtemp(), "a.svg")
    >>> fig = plot_asymptotics("L(5,1)", f, Ks=range(10, 16), orders=(0,), digits=20)
    >>> [round(z[0], 3) + 0.0 for z in fig.data["exact"]]     # Re Z_K, K = 10..15: it oscillates
    [-0.155, -0.221, 0.0, 0.208, 0.147, -0.085]

    References
    ----------
    D. S. Freed and R. E. Gompf, Commun. Math. Phys. 141 (1991) 79–117.
    """
    from knotobs.continuation.asymptotics import compare_with_exact, predicted_exponent

    from knotobs.continuation.level import LRData
    from knotobs.guard import require, seconds_for

    p = _out(out)
    Ks = list(range(3, int(kmax) + 1)) if Ks is None else [int(k) for k in Ks]
    if len(Ks) < 2:
        raise PlotError(f"levels {Ks}: give at least two (--kmax at least 4)")
    d = LRData.from_space(space)
    # one Gauss sum of 2 P K terms (n + 2 factors each) and one asymptotic sum per level and order
    ops = sum(2 * d.P * K * (d.n + 2) for K in Ks) * len(orders)
    require(f"plot asymptotics of {space} at {len(Ks)} levels up to K = {max(Ks)}",
            seconds=seconds_for(ops, "numpy") * 40 + seconds_for(len(Ks) * len(orders) * 1e5, "python"),
            memory_mb=max(Ks) * d.P * 2 * 16 * 4 / 1e6, accepted="use a smaller --kmax")
    per_order = {o: compare_with_exact(space, Ks, order=o, digits=digits) for o in orders}
    rows0 = per_order[orders[-1]]

    def clean(z):
        return [0.0 if abs(float(mpmath.re(z))) < 1e-25 else float(mpmath.re(z)),
                0.0 if abs(float(mpmath.im(z))) < 1e-25 else float(mpmath.im(z))]

    data = {"space": str(space), "profile": _space_profile(), "K": Ks,
            "exact": [clean(r.exact) for r in rows0],
            "asymptotic": {str(o): [_c(r.asymptotic) for r in rows] for o, rows in per_order.items()},
            "error": {str(o): [float(r.error) for r in rows] for o, rows in per_order.items()},
            "predicted_exponent": {str(o): str(predicted_exponent(space, o)) for o in orders}}
    if p is None:
        return Figure(None, "asymptotics", data)
    plt = _plt()
    import numpy as np

    fig, axes = plt.subplots(1, 3, figsize=(15, 4.4), constrained_layout=True)
    ex = np.array([complex(*z) for z in data["exact"]])
    asy = np.array([complex(*z) for z in data["asymptotic"][str(orders[-1])]])
    axes[0].plot(Ks, np.abs(asy), "-", lw=1, label=f"asymptotic, order {orders[-1]}")
    axes[0].plot(Ks, np.abs(ex), "k.", ms=3, label="exact (every integer K)")
    axes[0].set_ylabel(r"$|Z_K|$")
    nz = np.abs(ex) > 1e-25
    axes[1].plot(np.array(Ks)[nz], np.angle(ex[nz]) / np.pi, "k.", ms=3, label="exact")
    axes[1].plot(Ks, np.angle(asy) / np.pi, "-", lw=0.8, alpha=0.7, label=f"asymptotic, order {orders[-1]}")
    axes[1].set_ylabel(r"$\arg Z_K / \pi$")
    for ax in axes[:2]:
        ax.set_xlabel(r"$K = k + 2$")
        ax.legend(fontsize=8)
    axes[0].set_title(f"{space}: modulus")
    axes[1].set_title(f"{space}: phase (exact zeros omitted)")
    for o in orders:
        errs = np.array(data["error"][str(o)])
        keep = errs > 0
        axes[2].loglog(np.array(Ks)[keep], errs[keep], ".", ms=3, label=f"order {o}")
        e = float(predicted_exponent(space, o))
        if keep.any():
            K1, E1 = np.array(Ks)[keep][-1], errs[keep][-1]
            axes[2].loglog(Ks, [E1 * (K1 / k) ** e for k in Ks], "--", lw=0.8, color="gray")
    from matplotlib.ticker import NullFormatter

    axes[2].xaxis.set_minor_formatter(NullFormatter())
    axes[2].set_xlabel(r"$K$")
    axes[2].set_ylabel(r"$|Z_K - Z_K^{\mathrm{asympt}}|$")
    axes[2].set_title("error (dashed: predicted power of K)")
    axes[2].legend(fontsize=8)
    fig.suptitle(_space_profile(), fontsize=9)
    _save(fig, p, plt)
    return Figure(p, "asymptotics", data)


def plot_zeros(knot, out=None, family="jones", color=None) -> Figure:
    """Zeros of the Jones (or colored Jones, ``color = n``) polynomial of a torus knot.

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
    if family == "jones":
        res = jones(knot)
    elif family in ("colored-jones", "coloured-jones"):
        if color is None:
            raise PlotError("family colored-jones needs a color n >= 1")
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
    # the zeros are the eigenvalues of the deg x deg companion matrix: about 30 ns deg^3 here
    # (measured 2-12 ns deg^3 up to degree 570 on a 2-core machine) and three such matrices
    require(f"zeros of the {res.quantity} polynomial of {knot}{f' (color {color})' if color else ''}:"
            f" a companion matrix of degree {deg}", seconds=3e-8 * deg ** 3,
            memory_mb=3 * 16 * deg * deg / 2**20, accepted="choose a smaller color or knot")
    roots = np.roots(list(reversed(coeffs))) if deg > 0 else np.array([])
    var = "t" if D == 1 else f"t^(1/{D})"
    prof = res.profile
    profile = (f"{res.group}, color {', '.join(str(list(c)) for c in res.colours)} (dimension {color or 2}); "
               f"framing {list(prof.framing)}; {prof.normalisation}; {prof.variable_map}")
    data = {"knot": str(knot), "family": family, "variable": var, "profile": profile,
            "zeros": [[float(z.real), float(z.imag)] for z in roots]}
    if p is None:
        return Figure(None, "zeros", data)
    plt = _plt()
    fig, ax = plt.subplots(figsize=(5.4, 5.6), constrained_layout=True)
    th = np.linspace(0, 2 * np.pi, 400)
    ax.plot(np.cos(th), np.sin(th), color="gray", lw=0.6, label="unit circle")
    ax.plot(roots.real, roots.imag, "o", ms=4, label=f"zeros ({len(roots)})")
    ax.axhline(0, color="gray", lw=0.4)
    ax.axvline(0, color="gray", lw=0.4)
    ax.set_aspect("equal")
    ax.set_xlabel(f"Re {var}")
    ax.set_ylabel(f"Im {var}")
    ax.legend(fontsize=8, loc="lower right")
    ax.set_title(f"zeros of the {res.quantity} polynomial of {knot}", fontsize=10)
    fig.suptitle(profile, fontsize=7)
    _save(fig, p, plt)
    return Figure(p, "zeros", data)


def plot_wilson_level(knot, out=None, group="SU(2)", rep=(1,), kmax: int = 40, framing=0,
                      normalized: bool = False, samples: int = 2000) -> Figure:
    """A knot's Wilson loop at every level ``k = 1..kmax``: modulus and phase.

    The points are the exact values at ``q = exp(2 pi i/(k+N))``; the line is the same exact
    polynomial at ``q = exp(2 pi i/K)`` for real ``K`` between them.

    >>> v = plot_wilson_level("T(2,3)", None, kmax=3).data["values"][2]     # k = 3 (K = 5)
    >>> from knotobs.evaluation.level_loops import level_loop
    >>> abs(complex(*v) - complex(level_loop("T(2,3)", 3).numeric)) < 1e-12
    True

    References
    ----------
    M. Rosso, V. F. R. Jones, J. Knot Theory Ramifications 2 (1993) 97–112; E. Witten,
    Commun. Math. Phys. 121 (1989) 351–399 (q = exp(2 pi i/(k+N))).
    """
    from knotobs.evaluation.families import wilson_loop
    from knotobs.representations.groups import parse_group

    p = _out(out)
    g = parse_group(group)
    if g.kind != "SU":
        raise PlotError(f"--group {g}: the level is that of SU(N)")
    if kmax < 1 or kmax > 5000:
        raise PlotError(f"--kmax {kmax}: give 1 <= kmax <= 5000")
    res = wilson_loop(knot, g, rep, framing, normalized)
    poly = res.value
    ks = list(range(1, kmax + 1))
    vals = [poly.at_root_of_unity(k + g.N, dps=20) for k in ks]
    prof = res.profile
    cols = ", ".join(str(list(c)) for c in res.colours)
    profile = f"{g}, color {cols}; framing {list(prof.framing)} ({prof.framing_note}); {prof.normalisation}"
    data = {"knot": str(knot), "group": str(g), "color": [list(c) for c in res.colours], "profile": profile,
            "level": ks, "K": [k + g.N for k in ks], "values": [_c(v) for v in vals]}
    if p is None:
        return Figure(None, "wilson-level", data)
    import numpy as np

    plt = _plt()
    Kline = np.linspace(1 + g.N, kmax + g.N, min(samples, 50 * kmax))
    line = np.array([complex(poly.at_root_of_unity(mpmath.mpf(float(K)), dps=15)) for K in Kline])
    pts = np.array([complex(*v) for v in data["values"]])
    fig, axes = plt.subplots(1, 2, figsize=(11, 4.4), constrained_layout=True)
    axes[0].plot(Kline - g.N, np.abs(line), "-", lw=0.8, color="gray", label="exact polynomial, real K")
    axes[0].plot(ks, np.abs(pts), "ko", ms=3, label="integer level k")
    axes[0].set_ylabel(r"$|W_k|$")
    nz = np.abs(pts) > 1e-12
    axes[1].plot(Kline - g.N, np.angle(line) / np.pi, ".", ms=1, color="gray", label="exact polynomial, real K")
    axes[1].plot(np.array(ks)[nz], np.angle(pts[nz]) / np.pi, "ko", ms=3, label="integer level k")
    axes[1].set_ylabel(r"$\arg W_k / \pi$")
    for ax, t in zip(axes, ("modulus", "phase")):
        ax.set_xlabel(f"level k  (q = exp(2 pi i/(k+{g.N})))")
        ax.set_title(f"Wilson loop of {knot}: {t}")
        ax.legend(fontsize=8)
    fig.suptitle(profile, fontsize=9)
    _save(fig, p, plt)
    return Figure(p, "wilson-level", data)
