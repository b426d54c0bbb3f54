"""Numeric primitives that take a Python float or a numpy array alike.

The physics is written once on top of these, so the scalar derivation and the vectorised
catalog sweep share one expression for every formula.  This module is the only place that asks
whether a value is an array: on arrays the helpers use numpy (with its floating-point warnings
silenced where the formula means an infinite or undefined value); on floats they use plain
Python, which keeps a derivation's numbers Python floats and skips numpy's per-call cost on a
scalar (about a microsecond).  Angles are in degrees.

Each helper is typed by overloads, float to float and array to array (an array anywhere among
the arguments makes the result an array), so code on floats stays typed ``float``; a formula
written for both takes :data:`NumT`.  The checks are ``isinstance``, which the type checker
follows into each branch.
"""

from __future__ import annotations

import math
import numbers
from bisect import bisect_right
from collections.abc import Sequence
from typing import TypeAlias, TypeVar, overload

import numpy as np
import numpy.typing as npt

FloatArray: TypeAlias = npt.NDArray[np.float64]
BoolArray: TypeAlias = npt.NDArray[np.bool_]
IntArray: TypeAlias = npt.NDArray[np.int_]
Num: TypeAlias = float | FloatArray
"""A float or a float array: what a formula written on these helpers takes and gives."""
Truth: TypeAlias = bool | BoolArray
"""A comparison of a :data:`Num`: a bool for a float, a bool array for an array."""
NumT = TypeVar("NumT", float, FloatArray)
"""A float or a float array, the same for every argument and result typed with it: a formula
given floats gives a float (a derivation's numbers), given arrays an array (the catalog sweep)."""


def is_number(value: object) -> bool:
    """True for a real number (not a bool) or a numpy array."""
    return isinstance(value, np.ndarray) or (isinstance(value, numbers.Real) and not isinstance(value, bool))


@overload
def as_number(value: float) -> float: ...
@overload
def as_number(value: FloatArray) -> FloatArray: ...
@overload
def as_number(value: object) -> Num: ...
def as_number(value: object) -> Num:
    """``value`` as a float, or as a float array when it is an array; TypeError or ValueError for
    anything else (a bool included)."""
    if isinstance(value, np.ndarray):
        return np.asarray(value, dtype=float)
    if isinstance(value, bool):
        raise TypeError(f"a number is needed, not {value!r}")
    return float(value)  # type: ignore[arg-type]  # float() itself raises for what it cannot read


@overload
def where(condition: bool, if_true: float, if_false: float) -> float: ...
@overload
def where(condition: BoolArray, if_true: Num, if_false: Num) -> FloatArray: ...
@overload
def where(condition: Truth, if_true: FloatArray, if_false: Num) -> FloatArray: ...
@overload
def where(condition: Truth, if_true: Num, if_false: FloatArray) -> FloatArray: ...
def where(condition: Truth, if_true: Num, if_false: Num) -> Num:
    """``if_true`` where ``condition`` holds, else ``if_false`` (elementwise on arrays)."""
    if (isinstance(condition, np.ndarray) or isinstance(if_true, np.ndarray)
            or isinstance(if_false, np.ndarray)):
        chosen: FloatArray = np.where(condition, if_true, if_false)
        return chosen
    return if_true if condition else if_false


def all_true(condition: Truth) -> bool:
    """True when ``condition`` holds: for a float, itself; for an array, every element."""
    if isinstance(condition, np.ndarray):
        return bool(np.all(condition))
    return bool(condition)


@overload
def isfinite(value: float) -> bool: ...
@overload
def isfinite(value: FloatArray) -> BoolArray: ...
def isfinite(value: Num) -> Truth:
    """Whether the value is finite (elementwise on arrays)."""
    if isinstance(value, np.ndarray):
        finite: BoolArray = np.isfinite(value)
        return finite
    return math.isfinite(value)


@overload
def interp(x: float, xp: Sequence[float], fp: Sequence[float]) -> float: ...
@overload
def interp(x: FloatArray, xp: Sequence[float], fp: Sequence[float]) -> FloatArray: ...
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


@overload
def take(values: Sequence[float], index: int) -> float: ...
@overload
def take(values: Sequence[float], index: IntArray) -> FloatArray: ...
def take(values: Sequence[float], index: int | IntArray) -> Num:
    """``values[index]`` (elementwise for an array of indices)."""
    if isinstance(index, np.ndarray):
        taken: FloatArray = np.take(np.asarray(values), index)
        return taken
    return values[index]


@overload
def minimum(a: float, b: float) -> float: ...
@overload
def minimum(a: FloatArray, b: Num) -> FloatArray: ...
@overload
def minimum(a: Num, b: FloatArray) -> FloatArray: ...
def minimum(a: Num, b: Num) -> Num:
    """Elementwise minimum."""
    if isinstance(a, np.ndarray) or isinstance(b, np.ndarray):
        return np.minimum(a, b)
    return a if a < b else b


@overload
def maximum(a: float, b: float) -> float: ...
@overload
def maximum(a: FloatArray, b: Num) -> FloatArray: ...
@overload
def maximum(a: Num, b: FloatArray) -> FloatArray: ...
def maximum(a: Num, b: Num) -> Num:
    """Elementwise maximum."""
    if isinstance(a, np.ndarray) or isinstance(b, np.ndarray):
        return np.maximum(a, b)
    return a if a > b else b


@overload
def power(base: float, exponent: float) -> float: ...
@overload
def power(base: FloatArray, exponent: Num) -> FloatArray: ...
@overload
def power(base: Num, exponent: FloatArray) -> FloatArray: ...
def power(base: Num, exponent: Num) -> Num:
    """base**exponent, with +inf where the result overflows or a zero base meets a negative
    exponent (as numpy gives), instead of an exception."""
    if isinstance(base, np.ndarray) or isinstance(exponent, np.ndarray):
        with np.errstate(over="ignore", divide="ignore"):
            return np.power(base, exponent)
    try:
        raised: float = base ** exponent  # typeshed: float ** float may be complex, so Any
        return raised
    except OverflowError:
        return math.inf
    except ZeroDivisionError:
        return math.inf


@overload
def log(value: float) -> float: ...
@overload
def log(value: FloatArray) -> FloatArray: ...
def log(value: Num) -> Num:
    """Natural logarithm."""
    if isinstance(value, np.ndarray):
        return np.log(value)
    return math.log(value)


@overload
def log10(value: float) -> float: ...
@overload
def log10(value: FloatArray) -> FloatArray: ...
def log10(value: Num) -> Num:
    """Logarithm to base 10."""
    if isinstance(value, np.ndarray):
        return np.log10(value)
    return math.log10(value)


@overload
def cosd(angle_deg: float) -> float: ...
@overload
def cosd(angle_deg: FloatArray) -> FloatArray: ...
def cosd(angle_deg: Num) -> Num:
    """cos of an angle in degrees."""
    if isinstance(angle_deg, np.ndarray):
        return np.cos(np.radians(angle_deg))
    return math.cos(math.radians(angle_deg))


@overload
def sind(angle_deg: float) -> float: ...
@overload
def sind(angle_deg: FloatArray) -> FloatArray: ...
def sind(angle_deg: Num) -> Num:
    """sin of an angle in degrees."""
    if isinstance(angle_deg, np.ndarray):
        return np.sin(np.radians(angle_deg))
    return math.sin(math.radians(angle_deg))


@overload
def tand(angle_deg: float) -> float: ...
@overload
def tand(angle_deg: FloatArray) -> FloatArray: ...
def tand(angle_deg: Num) -> Num:
    """tan of an angle in degrees."""
    if isinstance(angle_deg, np.ndarray):
        return np.tan(np.radians(angle_deg))
    return math.tan(math.radians(angle_deg))


def extremes(value: Num) -> tuple[float, float] | None:
    """(smallest, largest) of a float (itself twice) or of an array's elements; None for an
    empty array.  A NaN anywhere makes both NaN."""
    if isinstance(value, np.ndarray):
        if value.size == 0:
            return None
        return float(np.min(value)), float(np.max(value))
    return float(value), float(value)


@overload
def safe_ratio(numerator: float, denominator: float) -> float: ...
@overload
def safe_ratio(numerator: FloatArray, denominator: Num) -> FloatArray: ...
@overload
def safe_ratio(numerator: Num, denominator: FloatArray) -> FloatArray: ...
def safe_ratio(numerator: Num, denominator: Num) -> Num:
    """numerator/denominator, +inf where the denominator is zero and the numerator positive, 0 for 0/0."""
    if isinstance(numerator, np.ndarray) or isinstance(denominator, np.ndarray):
        num = np.asarray(numerator, dtype=float)
        den = np.asarray(denominator, dtype=float)
        with np.errstate(divide="ignore", invalid="ignore"):
            out = np.where(den > 0, num / np.where(den > 0, den, 1.0), np.where(num > 0, np.inf, 0.0))
        return out
    if denominator > 0:
        return numerator / denominator
    return math.inf if numerator > 0 else 0.0
