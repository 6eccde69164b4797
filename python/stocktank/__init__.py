"""stocktank: reservoir-engineering screening calculations on whole numpy arrays.

Field units by default (psia, degF, scf, STB, rb, cp). Every function broadcasts its inputs
like a numpy ufunc, returns a float for scalar inputs and a float64 ndarray otherwise, runs
with the GIL released, and raises a :class:`StocktankError` (a ``ValueError``) naming the
argument, the value and its index for physically impossible inputs (``errors="coerce"``
returns NaN there instead).

Results are screening estimates: defer to measured laboratory PVT data, licensed engineers,
and the regulations and reserves-reporting rules that apply to you.
"""

import contextlib
from typing import Iterator, Optional

from . import decline, gas, material_balance, oil, relperm, units, volumetrics, water
from . import metric  # after the domain modules: it wraps their functions
from ._core import (
    ConvergenceError,
    InvalidArgumentError,
    InvalidOptionError,
    InvalidRecordError,
    OutOfRangeError,
    ShapeError,
    SingularError,
    StocktankError,
    __version__,
    get_num_threads,
    set_num_threads,
)
from .decline import *  # noqa: F401,F403
from .gas import *  # noqa: F401,F403
from .material_balance import *  # noqa: F401,F403
from .oil import *  # noqa: F401,F403
from .relperm import *  # noqa: F401,F403
from .units import *  # noqa: F401,F403
from .volumetrics import *  # noqa: F401,F403
from .water import *  # noqa: F401,F403

__all__ = [
    "__version__",
    "StocktankError",
    "InvalidArgumentError",
    "ShapeError",
    "InvalidOptionError",
    "InvalidRecordError",
    "ConvergenceError",
    "SingularError",
    "OutOfRangeError",
    "set_num_threads",
    "get_num_threads",
    "num_threads",
    "decline",
    "gas",
    "material_balance",
    "metric",
    "oil",
    "relperm",
    "units",
    "volumetrics",
    "water",
]
__all__ += relperm.__all__
__all__ += gas.__all__
__all__ += oil.__all__
__all__ += water.__all__
__all__ += material_balance.__all__
__all__ += decline.__all__
__all__ += volumetrics.__all__
__all__ += units.__all__


@contextlib.contextmanager
def num_threads(n: Optional[int]) -> Iterator[None]:
    """Run the ``with`` block's stocktank calls on ``n`` threads (``None``: the default),
    then restore the previous setting. The setting is process-wide (see
    :func:`set_num_threads`), so threads of your own share it.

    >>> import stocktank as st
    >>> with st.num_threads(1):
    ...     st.get_num_threads()
    1
    """
    previous = set_num_threads(n)
    try:
        yield
    finally:
        set_num_threads(previous)
