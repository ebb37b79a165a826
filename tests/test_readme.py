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
