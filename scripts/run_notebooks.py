"""Execute every notebook of a folder headless (in a temporary copy; the sources stay as they are).

Usage: python scripts/run_notebooks.py notebooks-demo
"""

import os
import pathlib
import shutil
import sys
import tempfile

import nbformat
from nbclient import NotebookClient


def main(folder: str) -> int:
    os.environ.setdefault("MPLBACKEND", "Agg")
    books = sorted(pathlib.Path(folder).glob("*.ipynb"))
    if not books:
        print(f"no notebooks in {folder}")
        return 0
    failed = 0
    for book in books:
        with tempfile.TemporaryDirectory() as tmp:
            work = pathlib.Path(tmp) / book.name
            shutil.copy(book, work)
            nb = nbformat.read(work, as_version=4)
            client = NotebookClient(nb, timeout=900, kernel_name="python3", resources={"metadata": {"path": tmp}})
            try:
                client.execute()
                print(f"ok   {book}")
            except Exception as exc:  # report every failing notebook, then fail
                failed += 1
                print(f"FAIL {book}: {exc}")
    print(f"{len(books) - failed} passed, {failed} failed")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1] if len(sys.argv) > 1 else "notebooks-demo"))
