"""Numeric primitives that take a Python float or a numpy array alike.

The physics is written once on top of these, so the scalar derivation and the vectorised
catalog sweep share one expression for every formula.  This module is the only place that asks
whether a value is an array: on arrays the helpers use numpy (with its floating-point warnings
silenced where the formula means an infinite or undefined value); on floats they use plain
Python, which keeps a derivation's numbers Python floats and skips numpy's per-call cost on a
scalar (about a microsecond).  Angles are in degrees.
"""

from __future__ import annotations

import math
import numbers
from bisect import bisect_right
from collections.abc import Sequence
from typing import TypeAlias

import numpy as np

Num: TypeAlias = float | np.ndarray


def _is_array(*values: object) -> bool:
    """True when any value is a numpy array (then numpy does the work)."""
    for value in values:  # a plain loop: a generator in any() cost a derivation about a fifth
        if isinstance(value, np.ndarray):
            return True
    return False


def is_number(value: object) -> bool:
    """True for a real number (not a bool) or a numpy array."""
    return _is_array(value) or (isinstance(value, numbers.Real) and not isinstance(value, bool))


def as_number(value: object) -> Num:
    """``value`` as a float, or as a float array when it is an array; TypeError or ValueError for
    anything else (a bool included)."""
    if _is_array(value):
        return np.asarray(value, dtype=float)
    if isinstance(value, bool):
        raise TypeError(f"a number is needed, not {value!r}")
    return float(value)  # type: ignore[arg-type]


def where(condition: object, if_true: Num, if_false: Num) -> Num:
    """``if_true`` where ``condition`` holds, else ``if_false`` (elementwise on arrays)."""
    if _is_array(condition, if_true, if_false):
        return np.where(condition, if_true, if_false)
    return if_true if condition else if_false


def all_true(condition: object) -> bool:
    """True when ``condition`` holds: for a float, itself; for an array, every element."""
    if _is_array(condition):
        return bool(np.all(condition))
    return bool(condition)


def isfinite(value: Num) -> Num:
    """Whether the value is finite (elementwise on arrays)."""
    if _is_array(value):
        return np.isfinite(value)
    return math.isfinite(value)


def interp(x: Num, xp: Sequence[float], fp: Sequence[float]) -> Num:
    """Linear interpolation in a table, clamped at its ends (callers warn about clamping)."""
    if _is_array(x):
        return np.interp(x, xp, fp)
    if x <= xp[0]:
        return float(fp[0])
    if x >= xp[-1]:
        return float(fp[-1])
    i = bisect_right(xp, x) - 1
    x0, x1 = xp[i], xp[i + 1]
    y0, y1 = fp[i], fp[i + 1]
    return y0 + (y1 - y0) * (x - x0) / (x1 - x0)


def take(values: Sequence[float], index: Num) -> Num:
    """``values[index]`` (elementwise for an array of indices)."""
    if _is_array(index):
        return np.take(values, index)
    return values[index]


def minimum(a: Num, b: Num) -> Num:
    """Elementwise minimum."""
    if _is_array(a, b):
        return np.minimum(a, b)
    return a if a < b else b


def maximum(a: Num, b: Num) -> Num:
    """Elementwise maximum."""
    if _is_array(a, b):
        return np.maximum(a, b)
    return a if a > b else b


def power(base: Num, exponent: Num) -> Num:
    """base**exponent, with +inf where the result overflows or a zero base meets a negative
    exponent (as numpy gives), instead of an exception."""
    if _is_array(base, exponent):
        with np.errstate(over="ignore", divide="ignore"):
            return np.power(base, exponent)
    try:
        return base ** exponent
    except OverflowError:
        return math.inf
    except ZeroDivisionError:
        return math.inf


def log(value: Num) -> Num:
    """Natural logarithm."""
    if _is_array(value):
        return np.log(value)
    return math.log(value)


def log10(value: Num) -> Num:
    """Logarithm to base 10."""
    if _is_array(value):
        return np.log10(value)
    return math.log10(value)


def cosd(angle_deg: Num) -> Num:
    """cos of an angle in degrees."""
    if _is_array(angle_deg):
        return np.cos(np.radians(angle_deg))
    return math.cos(math.radians(angle_deg))


def sind(angle_deg: Num) -> Num:
    """sin of an angle in degrees."""
    if _is_array(angle_deg):
        return np.sin(np.radians(angle_deg))
    return math.sin(math.radians(angle_deg))


def tand(angle_deg: Num) -> Num:
    """tan of an angle in degrees."""
    if _is_array(angle_deg):
        return np.tan(np.radians(angle_deg))
    return math.tan(math.radians(angle_deg))


def extremes(value: Num) -> tuple[float, float] | None:
    """(smallest, largest) of a float (itself twice) or of an array's elements; None for an
    empty array.  A NaN anywhere makes both NaN."""
    if _is_array(value):
        if value.size == 0:
            return None
        return float(np.min(value)), float(np.max(value))
    return float(value), float(value)


def safe_ratio(numerator: Num, denominator: Num) -> Num:
    """numerator/denominator, +inf where the denominator is zero and the numerator positive, 0 for 0/0."""
    if _is_array(numerator, denominator):
        num = np.asarray(numerator, dtype=float)
        den = np.asarray(denominator, dtype=float)
        with np.errstate(divide="ignore", invalid="ignore"):
            out = np.where(den > 0, num / np.where(den > 0, den, 1.0), np.where(num > 0, np.inf, 0.0))
        return out
    if denominator > 0:
        return numerator / denominator
    return math.inf if numerator > 0 else 0.0
