"""Figures moved to :mod:`knotobs.output.plots` (plots belong with output); this path keeps working.

>>> from knotobs.continuation.plots import plot_zeros
>>> plot_zeros.__module__
'knotobs.output.plots'
"""

from knotobs.output.plots import FORMATS, Figure, PlotError, plot_asymptotics, plot_level_plane, plot_wilson_level, plot_zeros

__all__ = ["plot_level_plane", "plot_asymptotics", "plot_zeros", "plot_wilson_level", "PlotError", "FORMATS", "Figure"]
