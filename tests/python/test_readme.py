"""The README's Python quick tour runs as written (users copy it first)."""

import pathlib
import re

README = pathlib.Path(__file__).resolve().parents[2] / "README.md"


def test_readme_python_blocks_run(capsys):
    blocks = re.findall(r"```python\n(.*?)```", README.read_text(), flags=re.S)
    assert blocks, "the README has no Python example"
    for code in blocks:
        exec(compile(code, str(README), "exec"), {"__name__": "readme"})
    assert "invalid `p_psia` = -5 at index 1" in capsys.readouterr().out
