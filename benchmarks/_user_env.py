"""Time the command line as a user's installation runs it.

An installed package has its bytecode compiled once (pip does it at install time).  Some
shells and CI images set ``PYTHONDONTWRITEBYTECODE=1``; the child processes of a benchmark would
then compile every module of knotobs on every start (about 0.08 s here) and the table would show
a start-up no user waits for.  Importing this module removes the variable for the benchmark and
its children, and the first (warm-up) run of each command writes the bytecode.
"""

import os

os.environ.pop("PYTHONDONTWRITEBYTECODE", None)
