"""Numeric primitives that take a Python float or a numpy array alike.

The physics is written once on top of these, so the scalar derivation and the vectorised
catalog sweep share one copy of every formula.  On floats they use plain Python (a numpy call
on a scalar costs about a microsecond, which the per-case budget cannot afford); on arrays they
use numpy.  numpy is imported here, eagerly: testing against a lazily looked-up array type made
every scalar derivation half as slow again, and the screen loads numpy at start anyway (duty
cycles and system life use arrays).
"""

from __future__ import annotations

from bisect import bisect_right
from typing import Sequence, TypeAlias, Union

import numpy as np

Num: TypeAlias = Union[float, np.ndarray]


_ARRAY = np.ndarray


def is_array(*values: object) -> bool:
    """True when any value is a numpy array (then the array path is taken)."""
    for v in values:
        if isinstance(v, _ARRAY):
            return True
    return False


def where(condition: object, if_true: Num, if_false: Num) -> Num:
    """``if_true`` where ``condition`` holds, else ``if_false`` (elementwise on arrays)."""
    if isinstance(condition, _ARRAY) or isinstance(if_true, _ARRAY) or isinstance(if_false, _ARRAY):
        return np.where(condition, if_true, if_false)
    return if_true if condition else if_false


def interp(x: Num, xp: Sequence[float], fp: Sequence[float]) -> Num:
    """Linear interpolation in a table, clamped at its ends (callers warn about clamping)."""
    if isinstance(x, np.ndarray):
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
    if isinstance(a, _ARRAY) or isinstance(b, _ARRAY):
        return np.minimum(a, b)
    return a if a < b else b


def maximum(a: Num, b: Num) -> Num:
    """Elementwise maximum."""
    if isinstance(a, _ARRAY) or isinstance(b, _ARRAY):
        return np.maximum(a, b)
    return a if a > b else b


def safe_ratio(numerator: Num, denominator: Num) -> Num:
    """numerator/denominator, +inf where the denominator is zero and the numerator positive, 0 for 0/0."""
    if isinstance(numerator, _ARRAY) or isinstance(denominator, _ARRAY):
        num = np.asarray(numerator, dtype=float)
        den = np.asarray(denominator, dtype=float)
        with np.errstate(divide="ignore", invalid="ignore"):
            out = np.where(den > 0, num / np.where(den > 0, den, 1.0), np.where(num > 0, np.inf, 0.0))
        return out
    if denominator > 0:
        return numerator / denominator
    return float("inf") if numerator > 0 else 0.0
