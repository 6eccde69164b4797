"""The embedded demo field: an invented scenario used only for demonstration."""

import pathlib
from typing import Union


def run(out: Union[str, "pathlib.Path"]) -> pathlib.Path:
    """Run the demo study and write its outputs into ``out``; returns the folder."""
    folder = pathlib.Path(out)
    folder.mkdir(parents=True, exist_ok=True)
    raise RuntimeError("the demo study is being assembled")
