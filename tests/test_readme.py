"""The README's Python session runs as written (doctest of its ```python blocks)."""

import doctest
import re
from pathlib import Path

README = Path(__file__).resolve().parent.parent / "README.md"


def test_readme_python_examples():
    text = README.read_text()
    blocks = re.findall(r"```python\n(.*?)```", text, flags=re.S)
    assert blocks, "README has no python example"
    parser = doctest.DocTestParser()
    runner = doctest.DocTestRunner(optionflags=doctest.ELLIPSIS)
    for i, block in enumerate(blocks):
        test = parser.get_doctest(block, {}, f"README block {i}", str(README), 0)
        runner.run(test)
    assert runner.failures == 0


def test_readme_command_outputs_are_real():
    """Every ```text block that starts with '$ knotobs ...' shows what the command prints
    (lines up to a '...' line; trailing spaces ignored)."""
    import shlex

    from typer.testing import CliRunner

    from knotobs.cli import app

    text = README.read_text()
    blocks = re.findall(r"```text\n(.*?)```", text, flags=re.S)
    checked = 0
    for block in blocks:
        lines = block.rstrip("\n").split("\n")
        if not lines[0].startswith("$ knotobs "):
            continue
        args = shlex.split(lines[0][len("$ knotobs "):])
        result = CliRunner().invoke(app, args)
        assert result.exit_code == 0, (lines[0], result.output)
        got = [ln.rstrip() for ln in result.output.rstrip("\n").split("\n")]
        want = []
        for ln in lines[1:]:
            if ln.strip() == "...":
                break
            want.append(ln.rstrip())
        assert got[: len(want)] == want, (lines[0], got[: len(want)], want)
        checked += 1
    assert checked >= 5
