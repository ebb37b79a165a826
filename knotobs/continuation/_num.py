"""The ball-arithmetic helpers of the continuation layer; they live in :mod:`knotobs.ball_series`
(one layer down, so the finite-level integral route can use them too)."""

from knotobs.ball_series import *  # noqa: F401,F403
from knotobs.ball_series import __all__, _binom  # noqa: F401
