"""The ``stocktank`` command line (also ``python -m stocktank``).

``stocktank demo [--out DIR]`` runs the study of the embedded invented demo field and writes
its tables and report into DIR (default ``./stocktank-demo``).
"""

import argparse
import sys
from typing import List, Optional


def main(argv: Optional[List[str]] = None) -> int:
    """Entry point of the console script; returns the process exit code."""
    parser = argparse.ArgumentParser(prog="stocktank", description=__doc__)
    sub = parser.add_subparsers(dest="command", required=True)
    demo = sub.add_parser("demo", help="run the study of the embedded invented demo field")
    demo.add_argument("--out", default="stocktank-demo", help="output folder (created if missing)")
    args = parser.parse_args(argv)
    if args.command == "demo":
        from .demo import run

        out = run(args.out)
        print(f"demo written to {out}")
        return 0
    parser.error(f"unknown command {args.command!r}")
    return 2


if __name__ == "__main__":
    sys.exit(main())
