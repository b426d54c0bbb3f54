"""Numeric primitives that take a Python float or a numpy array alike.

The physics is written once on top of these, so the scalar derivation and the vectorised
catalog sweep share one copy of every formula.  On floats they use plain Python (a numpy call
on a scalar costs about a microsecond, which the per-case budget cannot afford); on arrays they
use numpy.  numpy itself is never imported here: if it was never imported, no array can exist,
so the array test only looks for ``numpy.ndarray`` among the modules already loaded, and the
array branches import numpy where they run (a scalar-only run, like the screen, never loads it).
"""

from __future__ import annotations

import sys
from bisect import bisect_right
from typing import TYPE_CHECKING, Sequence, TypeAlias, Union

if TYPE_CHECKING:
    import numpy as np

Num: TypeAlias = Union[float, "np.ndarray"]


class _NoArray:
    """Stands in for ``numpy.ndarray`` while numpy is not loaded: nothing is an instance of it."""


def _array_type() -> type:
    """``numpy.ndarray`` once numpy has been imported (by anyone), else :class:`_NoArray`."""
    numpy = sys.modules.get("numpy")
    return _NoArray if numpy is None else numpy.ndarray


def is_array(*values: object) -> bool:
    """True when any value is a numpy array (then the array path is taken)."""
    array = _array_type()
    for v in values:
        if isinstance(v, array):
            return True
    return False


def where(condition: object, if_true: Num, if_false: Num) -> Num:
    """``if_true`` where ``condition`` holds, else ``if_false`` (elementwise on arrays)."""
    array = _array_type()
    if isinstance(condition, array) or isinstance(if_true, array) or isinstance(if_false, array):
        import numpy as np

        return np.where(condition, if_true, if_false)
    return if_true if condition else if_false


def interp(x: Num, xp: Sequence[float], fp: Sequence[float]) -> Num:
    """Linear interpolation in a table, clamped at its ends (callers warn about clamping)."""
    if isinstance(x, _array_type()):
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
    array = _array_type()
    if isinstance(a, array) or isinstance(b, array):
        import numpy as np

        return np.minimum(a, b)
    return a if a < b else b


def maximum(a: Num, b: Num) -> Num:
    """Elementwise maximum."""
    array = _array_type()
    if isinstance(a, array) or isinstance(b, array):
        import numpy as np

        return np.maximum(a, b)
    return a if a > b else b


def safe_ratio(numerator: Num, denominator: Num) -> Num:
    """numerator/denominator, +inf where the denominator is zero and the numerator positive, 0 for 0/0."""
    array = _array_type()
    if isinstance(numerator, array) or isinstance(denominator, array):
        import numpy as np

        num = np.asarray(numerator, dtype=float)
        den = np.asarray(denominator, dtype=float)
        with np.errstate(divide="ignore", invalid="ignore"):
            out = np.where(den > 0, num / np.where(den > 0, den, 1.0), np.where(num > 0, np.inf, 0.0))
        return out
    if denominator > 0:
        return numerator / denominator
    return float("inf") if numerator > 0 else 0.0
