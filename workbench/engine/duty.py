"""Duty cycles and bearing systems: Palmgren–Miner damage summation and series-system life.

* Palmgren–Miner linear damage rule: for operating states i with revolution shares ui (Σui = 1),
  the mean equivalent load Pm = (Σ ui·Pi^p)^(1/p) and the life 1/L = Σ ui/Li.
* Bearings in series (the machine fails when the first bearing fails), two-parameter Weibull
  lives of common slope e: R_sys = ΠRi and L10,sys = (Σ L10,i^(−e))^(−1/e).

Shares are weights: they are normalised to sum 1, so percentages work as well as fractions.
A cycle has a handful of states and a system a handful of bearings, so these work on plain
floats (math.fsum), not arrays.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Literal, Sequence

from .gears import checked
from .record import InputError

ShareBasis = Literal["time", "revolutions"]

#: Weibull slopes of rolling-bearing fatigue life commonly used for system life (from memory).
WEIBULL_SLOPE_BALL = 10.0 / 9.0
WEIBULL_SLOPE_ROLLER = 9.0 / 8.0


@dataclass(frozen=True, slots=True)
class MinerLife:
    """Life under the duty cycle and each state's share of the damage (shares sum to 1)."""

    life: float
    damage_shares: tuple[float, ...]


def _numbers(field_name: str, values: Sequence[float]) -> tuple[float, ...]:
    """``values`` (one per state or bearing: a handful, so plain floats) as a non-empty tuple."""
    try:
        numbers = tuple(float(value) for value in values)
    except TypeError:
        raise InputError(field_name, "needs a flat list of numbers") from None
    except ValueError:
        raise InputError(field_name, "needs a list of numbers") from None
    if not numbers:
        raise InputError(field_name, "needs a non-empty list of numbers")
    return numbers


def _vector(field_name: str, values: Sequence[float], *, low_open: bool = False,
            allow_infinite: bool = False) -> tuple[float, ...]:
    """A non-empty list of floats, each ≥ 0 (> 0 if ``low_open``), +∞ too if allowed."""
    numbers = _numbers(field_name, values)
    for number in numbers:
        if not (allow_infinite and number == math.inf):
            checked(field_name, number, low=0.0, low_open=low_open)
    return numbers


def _weights(field_name: str, shares: Sequence[float], size: int | None) -> tuple[float, ...]:
    """Shares as fractions summing to 1, after checking there is one per state (of ``size``
    states, when given)."""
    weights = _vector(field_name, shares)
    if size is not None and len(weights) != size:
        raise InputError(field_name, f"needs one share per state ({size}), got {len(weights)}")
    total = math.fsum(weights)
    if total <= 0.0:
        raise InputError(field_name, "the weights add up to zero")
    return tuple(weight / total for weight in weights)


def revolution_shares(shares: Sequence[float], speeds: Sequence[float] | None = None,
                      share_basis: ShareBasis = "time") -> tuple[float, ...]:
    """Revolution shares ui of the states: ui = ti·ni/Σ tj·nj from time shares, else normalised.

    Palmgren–Miner summation runs over revolutions; a state's revolutions are its time share
    times its speed.
    """
    if share_basis == "revolutions":
        return _weights("shares", shares, None)
    if share_basis != "time":
        raise InputError("share_basis", f"use 'time' or 'revolutions', not {share_basis!r}")
    if speeds is None:
        raise InputError("speeds", "time shares need the speed of each state")
    speed = _vector("speeds", speeds)
    time = _weights("shares", shares, len(speed))
    return _weights("speeds", [t * n for t, n in zip(time, speed)], len(speed))


def mean_speed(speeds: Sequence[float], time_shares: Sequence[float]) -> float:
    """Time-weighted mean speed nm = Σ ti·ni (r/min), for converting a duty-cycle life to hours."""
    speed = _vector("speeds", speeds)
    return math.fsum(t * n for t, n in zip(_weights("shares", time_shares, len(speed)), speed))


def mean_equivalent_load(loads: Sequence[float], shares: Sequence[float], p: float,
                         speeds: Sequence[float] | None = None,
                         share_basis: ShareBasis = "time") -> float:
    """Pm = (Σ ui·Pi^p)^(1/p), the Palmgren–Miner mean equivalent load of a duty cycle.

    ``p`` is the life exponent (3 ball, 10/3 roller); ``shares`` are time shares (with ``speeds``)
    or revolution shares, as ``share_basis`` says.
    """
    load = _vector("loads", loads)
    checked("life_exponent", p, low=0.0, low_open=True)
    weights = revolution_shares(shares, speeds, share_basis)
    if len(weights) != len(load):
        raise InputError("shares", f"needs one share per state ({len(load)}), got {len(weights)}")
    mean: float = math.fsum(u * f ** p for u, f in zip(weights, load)) ** (1.0 / p)
    return mean


def miner_life(lives: Sequence[float], shares: Sequence[float]) -> MinerLife:
    """Palmgren–Miner life 1/L = Σ ui/Li and the damage share (ui/Li)/Σ(uj/Lj) of each state.

    ``shares`` must be in the measure of ``lives``: revolution shares with lives in revolutions,
    time shares with lives in hours.  A state of infinite life does no damage.
    """
    life = _vector("lives", lives, low_open=True, allow_infinite=True)
    damage = [u / li for u, li in zip(_weights("shares", shares, len(life)), life)]
    total = math.fsum(damage)
    if total == 0.0:
        return MinerLife(math.inf, (0.0,) * len(damage))
    return MinerLife(1.0 / total, tuple(share / total for share in damage))


def system_life(lives: Sequence[float], weibull_slope: float) -> float:
    """L10,sys = (Σ L10,i^(−e))^(−1/e): series system of two-parameter Weibull lives of slope e."""
    checked("weibull_slope", weibull_slope, low=0.0, low_open=True)
    life = _vector("lives", lives, low_open=True, allow_infinite=True)
    total = math.fsum(li ** -weibull_slope for li in life)
    return total ** (-1.0 / weibull_slope) if total > 0.0 else math.inf


def system_reliability(reliabilities: Sequence[float]) -> float:
    """R_sys = ΠRi for bearings in series (independent failures)."""
    reliability = _numbers("reliabilities", reliabilities)
    for value in reliability:
        checked("reliabilities", value, low=0.0, high=1.0)
    return math.prod(reliability)
