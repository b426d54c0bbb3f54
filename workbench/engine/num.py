"""Numeric primitives that take a Python float or a numpy array alike.

The physics is written once on top of these, so the scalar derivation and the vectorised
catalog sweep share one copy of every formula.  On floats they use plain Python (a numpy call
on a scalar costs about a microsecond, which the per-case budget cannot afford); on arrays they
use numpy.  numpy is not imported here: a value is an array only if numpy is already loaded (no
array can exist before), so the screen starts without numpy's import, and a Python number is
recognised first, at the cost of one ``isinstance``.
"""

from __future__ import annotations

import sys
from bisect import bisect_right
from typing import TYPE_CHECKING, Sequence, TypeAlias, Union

if TYPE_CHECKING:
    import numpy as np

Num: TypeAlias = Union[float, "np.ndarray"]

_PYTHON_NUMBER = (float, int)  # bool is an int; numpy's float64 is a float


def _is_ndarray(value: object) -> bool:
    """True when ``value`` is a numpy array (numpy need not be loaded)."""
    if isinstance(value, _PYTHON_NUMBER):
        return False
    numpy = sys.modules.get("numpy")
    return numpy is not None and isinstance(value, numpy.ndarray)


def is_array(*values: object) -> bool:
    """True when any value is a numpy array (then the array path is taken)."""
    for v in values:
        if _is_ndarray(v):
            return True
    return False


def where(condition: object, if_true: Num, if_false: Num) -> Num:
    """``if_true`` where ``condition`` holds, else ``if_false`` (elementwise on arrays)."""
    if _is_ndarray(condition) or _is_ndarray(if_true) or _is_ndarray(if_false):
        import numpy as np

        return np.where(condition, if_true, if_false)
    return if_true if condition else if_false


def interp(x: Num, xp: Sequence[float], fp: Sequence[float]) -> Num:
    """Linear interpolation in a table, clamped at its ends (callers warn about clamping)."""
    if _is_ndarray(x):
        import numpy as np

        return np.interp(x, xp, fp)
    if x <= xp[0]:
        return float(fp[0])
    if x >= xp[-1]:
        return float(fp[-1])
    i = bisect_right(xp, x) - 1
    x0, x1 = xp[i], xp[i + 1]
    y0, y1 = fp[i], fp[i + 1]
    return y0 + (y1 - y0) * (x - x0) / (x1 - x0)


def minimum(a: Num, b: Num) -> Num:
    """Elementwise minimum."""
    if _is_ndarray(a) or _is_ndarray(b):
        import numpy as np

        return np.minimum(a, b)
    return a if a < b else b


def maximum(a: Num, b: Num) -> Num:
    """Elementwise maximum."""
    if _is_ndarray(a) or _is_ndarray(b):
        import numpy as np

        return np.maximum(a, b)
    return a if a > b else b


def safe_ratio(numerator: Num, denominator: Num) -> Num:
    """numerator/denominator, +inf where the denominator is zero and the numerator positive, 0 for 0/0."""
    if _is_ndarray(numerator) or _is_ndarray(denominator):
        import numpy as np

        num = np.asarray(numerator, dtype=float)
        den = np.asarray(denominator, dtype=float)
        with np.errstate(divide="ignore", invalid="ignore"):
            out = np.where(den > 0, num / np.where(den > 0, den, 1.0), np.where(num > 0, np.inf, 0.0))
        return out
    if denominator > 0:
        return numerator / denominator
    return float("inf") if numerator > 0 else 0.0
