"""Rating life, reliability and the systems-approach life modification factor.

ISO 281:2007 §7 (basic rating life), §9.2 (a1), §9.3 (aISO, κ, eC, Cu); the three-parameter
Weibull reliability model of the machine-design literature.  Floats or numpy arrays alike
(:data:`~workbench.engine.num.NumT`: floats give a float).  Typeshed types ``float ** float`` as
Any (a negative base may give a complex), so a power's result is given its type where it is named.
"""

from __future__ import annotations

import math

from . import tables as T
from typing import overload

from .num import FloatArray, IntArray, NumT, log, maximum, minimum, power, take, where

AISO_CAP = 50.0
KAPPA_MIN, KAPPA_MAX = 0.1, 4.0
KAPPA_PIECE_LIMITS = (0.4, 1.0)  # where the aISO relation changes coefficients (§9.3.2)
NU1_SPEED_SWITCH = 1000.0  # r/min: ν1 changes formula here (§9.3.3)


def basic_rating_life(c: NumT, p_eff: NumT, exponent: float) -> NumT:
    """L10 = (C/P)^p in million revolutions (ISO 281:2007 §5.3–§8.3); P here already includes af.

    A load so small that (C/P)^p exceeds the largest float gives an infinite life (the relation
    sets no limit), not an overflow: numpy arrays give inf there too.
    """
    return power(c / p_eff, exponent)


def life_hours(life_mrev: NumT, speed_rpm: NumT) -> NumT:
    """Hours from million revolutions at constant speed: L·10⁶/(60·n) (ISO 281:2007 §5.3–§8.3)."""
    return life_mrev * (1e6 / 60.0) / speed_rpm


def a1_iso281(reliability: NumT) -> NumT:
    """ISO 281:2007 Table 12 life modification factor for reliability, closed form.

    a1 = 0.95·(ln(100/R)/ln(100/90))^(2/3) + 0.05 for 90 % ≤ R ≤ 99.95 % (R as a fraction here).
    """
    a1: NumT = 0.95 * (log(1.0 / reliability) / math.log(1.0 / 0.9)) ** (2.0 / 3.0) + 0.05
    return a1


def weibull_life_factor(reliability: NumT, x0: float, theta: float, b: float) -> NumT:
    """Life at reliability R as a multiple of the rating life: x = x0 + (θ − x0)·(ln 1/R)^(1/b).

    Three-parameter Weibull survival R = exp(−((x − x0)/(θ − x0))^b); equals
    ``scipy.stats.weibull_min(c=b, loc=x0, scale=θ − x0).ppf(1 − R)``.
    """
    factor: NumT = x0 + (theta - x0) * log(1.0 / reliability) ** (1.0 / b)
    return factor


def weibull_required_rating(design_load: float, design_life_x: float, reliability: float,
                            af: float, exponent: float, x0: float, theta: float, b: float) -> float:
    """C10 = af·FD·[xD/(x0 + (θ − x0)(ln 1/RD)^(1/b))]^(1/a): catalogue rating for a design duty."""
    rating: float = af * design_load * (
        design_life_x / weibull_life_factor(reliability, x0, theta, b)) ** (1.0 / exponent)
    return rating  # typed here: typeshed gives float ** float as Any (it may be complex)


def reference_viscosity(speed_rpm: NumT, dm_mm: NumT) -> NumT:
    """ν1, the rated viscosity for adequate lubrication (ISO 281:2007 §9.3.3, from memory).

    ν1 = 45000·n^−0.83·dm^−0.5 for n < 1000 r/min, 4500·n^−0.5·dm^−0.5 for n ≥ 1000 r/min.
    """
    slow: NumT = 45000.0 * speed_rpm ** -0.83 * dm_mm ** -0.5
    fast: NumT = 4500.0 * speed_rpm ** -0.5 * dm_mm ** -0.5
    return where(speed_rpm < NU1_SPEED_SWITCH, slow, fast)


def fatigue_load_limit_estimate(c0: NumT, dpw_mm: NumT, roller: bool) -> NumT:
    """Cu from C0 when the maker gives none (ISO 281:2007 Annex B approximation, from memory).

    Ball: C0/22, ×(100/dpw)^0.5 above dpw = 100 mm; roller: C0/8.2, ×(100/dpw)^0.3 above.
    """
    if roller:
        base, power = c0 / 8.2, 0.3
    else:
        base, power = c0 / 22.0, 0.5
    scale: NumT = (100.0 / maximum(dpw_mm, 100.0)) ** power
    size = where(dpw_mm > 100.0, scale, 1.0)
    return base * size


def contamination_factor(level: str, dpw_mm: NumT) -> tuple[NumT, tuple[NumT, NumT]]:
    """eC for a named cleanliness level: the midpoint of its range and the range itself.

    ISO 281:2007 §9.3.4, Table 13 (from memory): the dpw < 100 mm or the dpw ≥ 100 mm column.
    """
    small, large = T.CONTAMINATION_LEVELS[level]
    small_column = dpw_mm < 100.0
    low = where(small_column, small[0], large[0])
    high = where(small_column, small[1], large[1])
    return 0.5 * (low + high), (low, high)


def kappa_in_range(kappa: NumT) -> NumT:
    """κ held to the range of the aISO method, 0.1 ≤ κ ≤ 4 (ISO 281:2007 §9.3.2)."""
    return minimum(maximum(kappa, KAPPA_MIN), KAPPA_MAX)


# ISO 281:2007 §9.3 coefficients (from memory; the pieces join at κ = 0.4 and κ = 1):
# kind family → (c1, c2 per κ range, exponent on κ per range, outer power, load-ratio power,
#                final exponent, load-ratio divisor)
_AISO_BALL = (2.5671, (2.2649, 1.9987, 1.9987), (0.054381, 0.19087, 0.071739), 0.83, 1.0 / 3.0, -9.3)
_AISO_ROLLER = (1.5859, (1.3993, 1.2348, 1.2348), (0.054381, 0.19087, 0.071739), 1.0, 0.4, -9.185)


def aiso_coefficients(roller: bool) -> tuple[float, tuple[float, float, float],
                                             tuple[float, float, float], float, float, float]:
    """(c1, c2 per κ piece, κ exponent per piece, outer power, load-ratio power, final exponent)
    of the aISO relation, ball or roller (ISO 281:2007 §9.3.2, from memory)."""
    return _AISO_ROLLER if roller else _AISO_BALL


@overload
def kappa_piece(kappa: float) -> int: ...
@overload
def kappa_piece(kappa: FloatArray) -> IntArray: ...
def kappa_piece(kappa: float | FloatArray) -> int | IntArray:
    """Which piece of the aISO relation applies: 0 for κ < 0.4, 1 for 0.4 ≤ κ < 1, 2 above."""
    middle, upper = KAPPA_PIECE_LIMITS
    return 2 - (kappa < middle) - (kappa < upper)


def _capped(inner: NumT, final: float) -> NumT:
    """0.1·inner^final, capped at 50; 50 where inner ≤ 0 (the relation's pole and beyond)."""
    return where(inner > 0.0, minimum(0.1 * power(maximum(inner, 0.0), final), AISO_CAP), AISO_CAP)


def aiso(kappa: NumT, load_ratio: NumT, roller: bool) -> NumT:
    """Systems-approach factor aISO (ISO 281:2007 §9.3.2), capped at 50.

    ``kappa`` is taken as given (callers clamp it to 0.1…4 and say so); ``load_ratio`` is eC·Cu/P
    with the thrust divisors (3 for thrust ball, 2.5 for thrust roller) already applied.
    """
    c1, c2s, ks, outer, load_power, final = aiso_coefficients(roller)
    piece = kappa_piece(kappa)
    bracket: NumT = maximum(c1 - take(c2s, piece) / kappa ** take(ks, piece), 0.0)
    inner: NumT = 1.0 - bracket ** outer * load_ratio ** load_power
    return _capped(inner, final)
