"""``python -m tensym``: the command line (see :mod:`tensym.cli`).

Examples
--------
>>> import tensym.__main__ as m
>>> callable(m.main)
True
"""

import sys

from tensym.cli import main

__all__ = ["main"]

if __name__ == "__main__":
    sys.exit(main())
