"""Figure of the Borel plane: Padé poles found from the exact coefficients, singularities predicted
by the flat connections (marked and labelled) and the Laplace ray.

matplotlib is optional (``pip install matplotlib``); the file type follows the suffix.
"""

from __future__ import annotations

__all__ = ["plot_borel"]


def plot_borel(space, out, order: int = 40, count: int = 5, K: float = 10.0):
    """Draw the Borel plane of the trivial-connection series of ``space`` into ``out``.

    >>> import tempfile, os
    >>> f = os.path.join(tempfile.mkdtemp(), "b.png")
    >>> fig = plot_borel("Sigma(2,3,5)", f, order=16, count=2)
    >>> fig.name, fig.kind
    ('b.png', 'borel')

    References
    ----------
    S. Gukov, M. Mariño and P. Putrov, arXiv:1605.07615 (the Borel plane of Brieskorn spheres).
    """
    from knotobs.output.plots import Figure, _out, _plt, _save
    from knotobs.resurgence.analysis import borel_analysis
    from knotobs.resurgence.pade import pade_poles
    from knotobs.resurgence.series import borel_series
    from knotobs.numerics import local_mp

    p = _out(out)
    if p is None:
        raise ValueError("plot_borel needs an output file")
    rep = borel_analysis(space, order=order, count=count, digits=10)
    ctx = local_mp(2 * order + 40)
    poles = pade_poles(list(borel_series(space, order).b), ctx)
    plt = _plt()
    fig, ax = plt.subplots(figsize=(7, 5), constrained_layout=True)
    reach = max(abs(complex(r.predicted)) for r in rep.rows) * 1.25
    # stable poles only (a pole that moves between [L-2/L-2] and [L/L] is a spurious Pade artefact)
    shown = [complex(P.zeta) for P in poles if abs(complex(P.zeta)) < reach and P.stability < 1e-8 * abs(P.zeta)]
    ax.plot([z.real for z in shown], [z.imag for z in shown], "o", ms=12, mfc="none", color="C0",
            label=f"stable poles of the [{(order) // 2}/{(order) // 2}] Padé approximant")
    colours = {"SU(2)": "C3", "SL(2,R)": "C2"}
    for r in rep.rows:
        z = complex(r.predicted)
        forms = sorted({f for f, _ in r.connections}) or ["?"]
        ax.plot([z.real], [z.imag], "x", ms=9, mew=2, color=colours.get(forms[0], "k"))
        ax.annotate(f"m={r.m}, cs={r.cs}, {'/'.join(forms)}", (z.real, z.imag), textcoords="offset points",
                    xytext=(0, 12), ha="left", fontsize=7, rotation=60)
    for f, c in colours.items():
        ax.plot([], [], "x", color=c, mew=2, label=f"predicted 4 pi^2 cs, {f} connection")
    ax.plot([0, 0], [0, reach * 0.6], "-", color="C1", lw=1, label=f"Laplace ray arg zeta = arg h (K = {K:g} real)")
    ax.axhline(0, color="gray", lw=0.4)
    ax.set_xscale("symlog", linthresh=0.05)
    ax.set_xlim(-reach, reach * 0.3)
    ax.set_ylim(-reach * 0.4, reach * 0.6)
    ax.set_xlabel(r"Re $\zeta$ (symmetric log scale)")
    ax.set_ylabel(r"Im $\zeta$")
    ax.set_title(f"Borel plane of {space}: {order + 1} exact coefficients", fontsize=10)
    ax.legend(fontsize=7, loc="upper left")
    _save(fig, p, plt)
    data = {"space": str(space), "order": order,
            "poles": [[z.real, z.imag] for z in shown],
            "predicted": [{"m": r.m, "cs": str(r.cs), "zeta": [complex(r.predicted).real, complex(r.predicted).imag],
                           "real_forms": sorted({f for f, _ in r.connections})} for r in rep.rows]}
    return Figure(p, "borel", data)
