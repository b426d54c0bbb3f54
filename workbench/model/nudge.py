"""What-if edits on typed text: scale the number a person typed and keep the unit they typed.

"3 kN" nudged by +5 % becomes "3.15 kN"; "1200 r/min" scaled by 0.5 becomes "600 r/min".  The
text after the number is left exactly as typed, so the unit edge
(:mod:`workbench.model.quantities`) reads the result the same way it read the original.

A nudge writes four significant figures, as the derivation shows its numbers: nudges compound,
and "1.2 kN" nudged +5 % three times reads "1.389 kN", not "1.38915 kN" (a step of 1 % or 5 %
always moves a four-figure number).  A solved value is written with seven, rounded the way
that still meets its target.
"""

from __future__ import annotations

import math
import re
from typing import Literal

SIGNIFICANT_DIGITS = 7
"""Figures of a solved value written into a field."""
NUDGE_DIGITS = 4
"""Figures of a nudged value."""
_LEADING_NUMBER = re.compile(
    r"(?P<lead>\s*)(?P<number>[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d{1,3})?)(?P<rest>.*)",
    re.DOTALL,
)


Rounding = Literal["nearest", "up", "down"]


def number_text(value: float, rounding: Rounding = "nearest",
                digits: int = SIGNIFICANT_DIGITS) -> str:
    """A number written with up to ``digits`` significant figures and no trailing zeros;
    rounded to the nearest, or up or down (toward +∞ or −∞) at the last figure."""
    if rounding != "nearest" and value != 0.0 and math.isfinite(value):
        step = 10.0 ** (math.floor(math.log10(abs(value))) - digits + 1)
        value = (math.ceil if rounding == "up" else math.floor)(value / step) * step
    return f"{value:.{digits}g}"


def leading_number(text: str) -> float | None:
    """The number at the start of ``text`` ("3.2 kN" → 3.2), or None when there is none."""
    match = _LEADING_NUMBER.fullmatch(text)
    if match is None:
        return None
    value = float(match["number"])
    return value if math.isfinite(value) else None


def scale_text(text: str, factor: float, rounding: Rounding = "nearest",
               digits: int = SIGNIFICANT_DIGITS) -> str | None:
    """``text`` with its leading number multiplied by ``factor``, the rest kept as typed
    (the product written by :func:`number_text` with ``rounding`` and ``digits``).

    None when the text has no leading number or the product is not a finite number.
    """
    match = _LEADING_NUMBER.fullmatch(text)
    if match is None:
        return None
    value = float(match["number"]) * factor
    if not math.isfinite(value):
        return None
    return f"{match['lead']}{number_text(value, rounding, digits)}{match['rest']}"
