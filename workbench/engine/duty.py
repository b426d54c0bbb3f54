"""Duty cycles and bearing systems: Palmgren–Miner damage summation and series-system life.

* Palmgren–Miner linear damage rule: for operating states i with revolution shares ui (Σui = 1),
  the mean equivalent load Pm = (Σ ui·Pi^p)^(1/p) and the life 1/L = Σ ui/Li.
* Bearings in series (the machine fails when the first bearing fails), two-parameter Weibull
  lives of common slope e: R_sys = ΠRi and L10,sys = (Σ L10,i^(−e))^(−1/e).

Shares are weights: they are normalised to sum 1, so percentages work as well as fractions.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Literal, Sequence

from .gears import checked
from .record import InputError

if TYPE_CHECKING:  # numpy is imported by the functions that build arrays
    import numpy as np

ShareBasis = Literal["time", "revolutions"]

#: Weibull slopes of rolling-bearing fatigue life commonly used for system life (from memory).
WEIBULL_SLOPE_BALL = 10.0 / 9.0
WEIBULL_SLOPE_ROLLER = 9.0 / 8.0


@dataclass(frozen=True, slots=True)
class MinerLife:
    """Life under the duty cycle and each state's share of the damage (shares sum to 1)."""

    life: float
    damage_shares: np.ndarray


def _as_array(field_name: str, values: Sequence[float] | np.ndarray) -> np.ndarray:
    """``values`` as a float array whose axis 0 (one entry per state or bearing) is not empty."""
    import numpy as np

    try:
        array = np.asarray(values, dtype=float)
    except (TypeError, ValueError):
        raise InputError(field_name, "needs a list of numbers") from None
    if array.ndim == 0 or array.shape[0] == 0:
        raise InputError(field_name, "needs a non-empty list of numbers")
    return array


def _vector(field_name: str, values: Sequence[float] | np.ndarray, *, low_open: bool = False,
            allow_infinite: bool = False) -> np.ndarray:
    """A non-empty 1-D float array with every element ≥ 0 (> 0 if ``low_open``); +∞ if allowed."""
    import numpy as np

    array = _as_array(field_name, values)
    if array.ndim != 1:
        raise InputError(field_name, "needs a flat list of numbers")
    checked(field_name, array[~np.isposinf(array)] if allow_infinite else array, low=0.0,
            low_open=low_open)
    return array


def _weights(field_name: str, shares: Sequence[float] | np.ndarray, size: int) -> np.ndarray:
    """Shares as fractions summing to 1, after checking there is one per state."""
    array = _vector(field_name, shares)
    if array.size != size:
        raise InputError(field_name, f"needs one share per state ({size}), got {array.size}")
    total = float(array.sum())
    if total <= 0.0:
        raise InputError(field_name, "the weights add up to zero")
    return array / total


def revolution_shares(shares: Sequence[float] | np.ndarray,
                      speeds: Sequence[float] | np.ndarray | None = None,
                      share_basis: ShareBasis = "time") -> np.ndarray:
    """Revolution shares ui of the states: ui = ti·ni/Σ tj·nj from time shares, else normalised.

    Palmgren–Miner summation runs over revolutions; a state's revolutions are its time share
    times its speed.
    """
    if share_basis == "revolutions":
        return _weights("shares", shares, _as_array("shares", shares).shape[0])
    if share_basis != "time":
        raise InputError("share_basis", f"use 'time' or 'revolutions', not {share_basis!r}")
    if speeds is None:
        raise InputError("speeds", "time shares need the speed of each state")
    speed = _vector("speeds", speeds)
    time = _weights("shares", shares, speed.size)
    return _weights("speeds", time * speed, speed.size)


def mean_speed(speeds: Sequence[float] | np.ndarray, time_shares: Sequence[float] | np.ndarray) -> float:
    """Time-weighted mean speed nm = Σ ti·ni (r/min), for converting a duty-cycle life to hours."""
    import numpy as np

    speed = _vector("speeds", speeds)
    return float(np.dot(_weights("shares", time_shares, speed.size), speed))


def mean_equivalent_load(loads: Sequence[float] | np.ndarray, shares: Sequence[float] | np.ndarray,
                         p: float, speeds: Sequence[float] | np.ndarray | None = None,
                         share_basis: ShareBasis = "time") -> float:
    """Pm = (Σ ui·Pi^p)^(1/p), the Palmgren–Miner mean equivalent load of a duty cycle.

    ``p`` is the life exponent (3 ball, 10/3 roller); ``shares`` are time shares (with ``speeds``)
    or revolution shares, as ``share_basis`` says.
    """
    import numpy as np

    load = _vector("loads", loads)
    checked("life_exponent", p, low=0.0, low_open=True)
    weights = revolution_shares(shares, speeds, share_basis)
    if weights.size != load.size:
        raise InputError("shares", f"needs one share per state ({load.size}), got {weights.size}")
    return float(np.dot(weights, load ** p) ** (1.0 / p))


def miner_life(lives: Sequence[float] | np.ndarray, shares: Sequence[float] | np.ndarray) -> MinerLife:
    """Palmgren–Miner life 1/L = Σ ui/Li and the damage share (ui/Li)/Σ(uj/Lj) of each state.

    ``shares`` must be in the measure of ``lives``: revolution shares with lives in revolutions,
    time shares with lives in hours.  A state of infinite life does no damage.
    """
    import numpy as np

    life = _vector("lives", lives, low_open=True, allow_infinite=True)
    weights = _weights("shares", shares, life.size)
    damage = weights / life
    total = float(damage.sum())
    if total == 0.0:
        return MinerLife(float("inf"), np.zeros_like(damage))
    return MinerLife(1.0 / total, damage / total)


def system_life(lives: Sequence[float] | np.ndarray, weibull_slope: float) -> float | np.ndarray:
    """L10,sys = (Σ L10,i^(−e))^(−1/e): series system of two-parameter Weibull lives of slope e.

    Axis 0 of ``lives`` runs over the bearings; further axes (cases) are kept.
    """
    import numpy as np

    checked("weibull_slope", weibull_slope, low=0.0, low_open=True)
    life = _as_array("lives", lives)
    checked("lives", life[~np.isposinf(life)], low=0.0, low_open=True)
    with np.errstate(divide="ignore"):
        result = np.sum(life ** -weibull_slope, axis=0) ** (-1.0 / weibull_slope)
    return float(result) if result.ndim == 0 else result


def system_reliability(reliabilities: Sequence[float] | np.ndarray) -> float | np.ndarray:
    """R_sys = ΠRi for bearings in series (independent failures); axis 0 runs over the bearings."""
    import numpy as np

    reliability = _as_array("reliabilities", reliabilities)
    checked("reliabilities", reliability, low=0.0, high=1.0)
    result = np.prod(reliability, axis=0)
    return float(result) if result.ndim == 0 else result
