"""The reference rating life from the rolling elements' own loads, in the manner of ISO/TS 16281.

Each raceway has a basic dynamic load rating of its own (Lundberg and Palmgren's Qc, as ISO 281
builds the bearing's C from it) and sees a dynamic equivalent reference load, the power mean
of the element loads it passes under: the ring that rotates against the load meets every
element load in turn (cube mean for balls, 4th power for roller slices), the stationary ring
carries each load at one place (10/3 and 4.5 powers).  Raceway lives combine by Weibull's
series rule with the slope e (10/9 ball, 9/8 roller):

* ball: L10r = [Σ over raceways (Qc/Qe)^(−10/3)]^(−0.3), i.e. Lν = (Qc/Qe)³ per raceway;
* roller, ns slices per roller: L10r = [Σ over raceways and slices (qck/qek)^(−9/2)]^(−8/9), with
  qck = Qc·ns^(−7/9) (the capacity of a slice of width Lwe/ns): with uniform load this is
  (Qc/Qe)⁴, the line-contact life relation.

Sources: Lundberg & Palmgren (1947, 1952) through Harris & Kotzalas, *Rolling Bearing
Analysis*; ISO/TS 16281:2008 for the procedure (clauses from memory); ISO 281:2007 for bm and
for the roller's λ·ν = 0.83 (from memory).  The capacity constants are from memory; the tests
check the method's limits (ISO 281 life under ideal load within a few per cent, exact slice
independence) rather than those digits.  The modification by aISO uses the reference load
Pref = C·L10r^(−1/p), the equivalent load that gives the same life through ISO 281's relation.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ..num import cosd

BALL_CAPACITY_CONSTANT = 98.1  # Lundberg–Palmgren, N and mm (from memory)
ROLLER_CAPACITY_CONSTANT = 552.0  # Lundberg–Palmgren line contact, N and mm (from memory)
ROLLER_LAMBDA_NU = 0.83  # ISO 281 reduction for edge stresses and manufacture (from memory)
BALL_WEIBULL_SLOPE = 10.0 / 9.0
ROLLER_WEIBULL_SLOPE = 9.0 / 8.0


def ball_raceway_capacity(dw: float, dpw: float, alpha_deg: float, z: int, osculation: float,
                          *, inner: bool, bm: float = 1.0) -> float:
    """Basic dynamic capacity Qc of a ball raceway (N), Lundberg–Palmgren, upper signs inner:
    Qc = bm·98.1·(2f/(2f − 1))^0.41·(1 ∓ γ)^1.39/(1 ± γ)^(1/3)·(γ/cos α)^0.3·Dw^1.8·Z^(−1/3),
    γ = Dw·cos α/Dpw (γ/cos α = Dw/Dpw)."""
    gamma = dw * cosd(alpha_deg) / dpw
    near, far = (1.0 - gamma, 1.0 + gamma) if inner else (1.0 + gamma, 1.0 - gamma)
    capacity: float = (bm * BALL_CAPACITY_CONSTANT * (2.0 * osculation / (2.0 * osculation - 1.0)) ** 0.41
                       * near ** 1.39 / far ** (1.0 / 3.0) * (dw / dpw) ** 0.3 * dw ** 1.8 * z ** (-1.0 / 3.0))
    return capacity


def roller_raceway_capacity(dwe: float, dpw: float, alpha_deg: float, z: int, lwe: float,
                            *, inner: bool, bm: float = 1.0) -> float:
    """Basic dynamic capacity Qc of a roller raceway over the whole length (N), upper signs inner:
    Qc = bm·λν·552·(1 ∓ γ)^(29/27)/(1 ± γ)^(1/4)·(γ/cos α)^(2/9)·Dwe^(29/27)·Lwe^(7/9)·Z^(−1/4)."""
    gamma = dwe * cosd(alpha_deg) / dpw
    near, far = (1.0 - gamma, 1.0 + gamma) if inner else (1.0 + gamma, 1.0 - gamma)
    capacity: float = (bm * ROLLER_LAMBDA_NU * ROLLER_CAPACITY_CONSTANT * near ** (29.0 / 27.0)
                       / far ** 0.25 * (dwe / dpw) ** (2.0 / 9.0) * dwe ** (29.0 / 27.0)
                       * lwe ** (7.0 / 9.0) * z ** -0.25)
    return capacity


def equivalent_load(loads: np.ndarray, *, rotating: bool, ball: bool) -> np.ndarray:
    """Dynamic equivalent reference load of a raceway over the elements (axis 0): the power mean
    ((1/Z)·Σ Q^w)^(1/w), w = 3 (ball) or 4 (roller slice) for the ring rotating against the
    load, 10/3 or 4.5 for the stationary ring (Lundberg–Palmgren; ISO/TS 16281)."""
    if ball:
        power = 3.0 if rotating else 10.0 / 3.0
    else:
        power = 4.0 if rotating else 4.5
    mean: np.ndarray = np.mean(np.asarray(loads, dtype=float) ** power, axis=0) ** (1.0 / power)
    return mean


@dataclass(frozen=True, slots=True)
class RaceLives:
    """Each raceway's life (10⁶ rev), the row's L10r, and each raceway's dynamic equivalent
    reference load (N; for rollers that of the most loaded slice)."""

    inner: float
    outer: float
    row: float
    load_inner: float
    load_outer: float


def ball_row_life(loads: np.ndarray, q_c_inner: float, q_c_outer: float,
                  *, inner_rotates: bool = True) -> RaceLives:
    """L10r of a ball row from its element loads: Lν = (Qcν/Qeν)³ per raceway,
    L10r = (Li^(−10/9) + Le^(−10/9))^(−9/10)."""
    q_inner = float(equivalent_load(loads, rotating=inner_rotates, ball=True))
    q_outer = float(equivalent_load(loads, rotating=not inner_rotates, ball=True))
    inner = _ratio_life(q_c_inner, q_inner, 3.0)
    outer = _ratio_life(q_c_outer, q_outer, 3.0)
    return RaceLives(inner, outer, combine_lives((inner, outer), BALL_WEIBULL_SLOPE), q_inner, q_outer)


def roller_row_life(slice_loads: np.ndarray, q_c_inner: float, q_c_outer: float,
                    *, inner_rotates: bool = True) -> RaceLives:
    """L10r of a roller row from its slice loads (Z × ns): per slice qck = Qc·ns^(−7/9) against
    the slice's equivalent load, L = [Σk (qck/qek)^(−9/2)]^(−8/9) per raceway and over both."""
    slices = slice_loads.shape[1]
    share = slices ** (-7.0 / 9.0)
    q_inner = equivalent_load(slice_loads, rotating=inner_rotates, ball=False)
    q_outer = equivalent_load(slice_loads, rotating=not inner_rotates, ball=False)
    inner_sum = float(np.sum((q_inner / (q_c_inner * share)) ** 4.5))
    outer_sum = float(np.sum((q_outer / (q_c_outer * share)) ** 4.5))
    inner = _sum_life(inner_sum)
    outer = _sum_life(outer_sum)
    return RaceLives(inner, outer, _sum_life(inner_sum + outer_sum), float(np.max(q_inner)),
                     float(np.max(q_outer)))


def _ratio_life(capacity: float, load: float, exponent: float) -> float:
    return math.inf if load <= 0.0 else (capacity / load) ** exponent


def _sum_life(damage: float) -> float:
    return math.inf if damage <= 0.0 else damage ** (-8.0 / 9.0)


def combine_lives(lives: tuple[float, ...] | list[float], slope: float) -> float:
    """Weibull's series rule, L = (Σ Li^(−e))^(−1/e); infinite lives drop out."""
    total = sum(life ** -slope for life in lives if math.isfinite(life) and life > 0.0)
    return math.inf if total == 0.0 else total ** (-1.0 / slope)


def reference_load(rating: float, life_mrev: float, exponent: float) -> float:
    """Pref = C·L10r^(−1/p): the load that gives L10r through ISO 281's (C/P)^p."""
    return 0.0 if not math.isfinite(life_mrev) else rating * life_mrev ** (-1.0 / exponent)
