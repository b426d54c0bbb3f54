"""Hertz contact of a rolling element on its raceway: curvature, contact area, pressure, approach.

Point contact (balls) by Hertz's theory with the complete elliptic integrals K(e) and E(e)
(``scipy.special.ellipk``/``ellipe``, whose parameter is m = e² = 1 − 1/k²), in the form and
notation of Harris & Kotzalas, *Rolling Bearing Analysis* (curvature sum Σρ and difference F(ρ)).
Line contact (rollers) by Hertz's two-cylinder solution for the half-width and pressure, and
Palmgren's steel relation for the approach.  Units: N, mm, N/mm² (= MPa).

Steel on steel throughout: E = 207 000 N/mm², ν = 0.3 (REFERENCE.md §8, from memory).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache

from ..num import cosd

ELASTIC_MODULUS_STEEL = 207_000.0  # N/mm², bearing steel (from memory)
POISSON_RATIO_STEEL = 0.3
# E' = 2/[(1 − ν1²)/E1 + (1 − ν2²)/E2]: both bodies steel.
REDUCED_MODULUS_STEEL = 2.0 / (2.0 * (1.0 - POISSON_RATIO_STEEL ** 2) / ELASTIC_MODULUS_STEEL)
POINT_CONTACT_EXPONENT = 1.5  # Q = K·δ^(3/2), Hertz
LINE_CONTACT_EXPONENT = 10.0 / 9.0  # Q = K·δ^(10/9), Palmgren (steel roller on raceway)
PALMGREN_LINE_APPROACH = 3.84e-5  # δ = 3.84·10⁻⁵·Q^0.9/l^0.8, mm, N (Palmgren; from memory)
# Reference pressures at the basic static load rating C0 (ISO 76:2006 §4, from memory):
STATIC_REFERENCE_PRESSURE_BALL = 4200.0  # MPa (4 600 self-aligning ball, not analysed here)
STATIC_REFERENCE_PRESSURE_ROLLER = 4000.0  # MPa


@dataclass(frozen=True, slots=True)
class Curvature:
    """Curvature sum Σρ (1/mm) and curvature difference F(ρ) of one contact (Harris & Kotzalas)."""

    curvature_sum: float
    curvature_difference: float


@dataclass(frozen=True, slots=True)
class Ellipse:
    """The contact ellipse constants: k = a/b, K(e), E(e) with e² = 1 − 1/k²."""

    k: float
    first_kind: float
    second_kind: float


@dataclass(frozen=True, slots=True)
class PointContact:
    """A loaded point contact: semi-axes a ≥ b (mm), largest pressure (MPa), approach δ (mm)."""

    a: float
    b: float
    p_max: float
    approach: float


def ball_raceway_curvature(dw: float, dpw: float, alpha_deg: float, osculation: float,
                           *, inner: bool) -> Curvature:
    """Σρ and F(ρ) of a ball of diameter ``dw`` on the inner or outer raceway.

    Ball: ρI1 = ρI2 = 2/Dw.  Raceway, with γ = Dw·cos α/Dpw and groove radius f·Dw:
    inner ρII1 = (2/Dw)·γ/(1 − γ), ρII2 = −1/(fi·Dw); outer ρII1 = −(2/Dw)·γ/(1 + γ),
    ρII2 = −1/(fe·Dw).  Σρ = ρI1 + ρI2 + ρII1 + ρII2,
    F(ρ) = [(ρI1 − ρI2) + (ρII1 − ρII2)]/Σρ (Harris & Kotzalas, *Rolling Bearing Analysis*).
    """
    gamma = dw * cosd(alpha_deg) / dpw
    ball = 2.0 / dw
    if inner:
        race_rolling = ball * gamma / (1.0 - gamma)
    else:
        race_rolling = -ball * gamma / (1.0 + gamma)
    race_across = -1.0 / (osculation * dw)
    curvature_sum = 2.0 * ball + race_rolling + race_across
    return Curvature(curvature_sum, (race_rolling - race_across) / curvature_sum)


def curvature_difference_of(k: float) -> float:
    """F(ρ) = [(k² + 1)·E − 2K]/[(k² − 1)·E] for an ellipse ratio k = a/b > 1 (Hertz)."""
    from scipy.special import ellipe, ellipk

    m = 1.0 - 1.0 / (k * k)
    first, second = float(ellipk(m)), float(ellipe(m))
    return ((k * k + 1.0) * second - 2.0 * first) / ((k * k - 1.0) * second)


@lru_cache(maxsize=256)
def ellipse_of(curvature_difference: float) -> Ellipse:
    """k, K and E of the contact ellipse whose F(ρ) is given: F(ρ) = [(k² + 1)E − 2K]/[(k² − 1)E]
    solved for k by Brent's method (F rises monotonically from 0 at k = 1 toward 1).  Cached: the
    screen re-analyses one geometry under changing loads."""
    from scipy.optimize import brentq
    from scipy.special import ellipe, ellipk

    if not 0.0 < curvature_difference < 1.0:
        raise ValueError(f"curvature difference F(ρ) = {curvature_difference} outside (0, 1)")
    k = brentq(lambda x: curvature_difference_of(x) - curvature_difference, 1.0 + 1e-9, 1e4,
               xtol=1e-12, rtol=1e-13)
    m = 1.0 - 1.0 / (k * k)
    return Ellipse(k, float(ellipk(m)), float(ellipe(m)))


def point_contact(load: float, curvature: Curvature, ellipse: Ellipse,
                  *, modulus: float = REDUCED_MODULUS_STEEL) -> PointContact:
    """Hertz point contact under the normal load ``load`` (N).

    a = (6k²·E·Q/(π·Σρ·E'))^(1/3), b = (6E·Q/(π·k·Σρ·E'))^(1/3), pmax = 3Q/(2π·a·b),
    δ = (2K/π)·(π/(2k²E))^(1/3)·(3Q/(Σρ·E'))^(2/3)·Σρ/2 (Hertz; Harris & Kotzalas).
    """
    k, second = ellipse.k, ellipse.second_kind
    rho = curvature.curvature_sum
    a = (6.0 * k * k * second * load / (math.pi * rho * modulus)) ** (1.0 / 3.0)
    b = (6.0 * second * load / (math.pi * k * rho * modulus)) ** (1.0 / 3.0)
    p_max = 3.0 * load / (2.0 * math.pi * a * b) if load > 0.0 else 0.0
    approach = approach_factor(ellipse) * (3.0 * load / (rho * modulus)) ** (2.0 / 3.0) * rho / 2.0
    return PointContact(a, b, p_max, approach)


def approach_factor(ellipse: Ellipse) -> float:
    """δ* = (2K/π)·(π/(2k²E))^(1/3), the dimensionless approach of Harris & Kotzalas."""
    k, first, second = ellipse.k, ellipse.first_kind, ellipse.second_kind
    factor: float = 2.0 * first / math.pi * (math.pi / (2.0 * k * k * second)) ** (1.0 / 3.0)
    return factor


def point_contact_constant(curvature: Curvature, ellipse: Ellipse,
                           *, modulus: float = REDUCED_MODULUS_STEEL) -> float:
    """K in Q = K·δ^(3/2) for one point contact (N/mm^1.5): the inverse of :func:`point_contact`'s
    δ(Q), K = Σρ·E'/3·(2/(δ*·Σρ))^(3/2)."""
    rho = curvature.curvature_sum
    constant: float = rho * modulus / 3.0 * (2.0 / (approach_factor(ellipse) * rho)) ** 1.5
    return constant


def line_contact_constant(length: float) -> float:
    """K in Q = K·δ^(10/9) for one steel line contact of length ``length`` (N/mm^(10/9)):
    Palmgren's δ = 3.84·10⁻⁵·Q^0.9/l^0.8 inverted, K = l^(8/9)/(3.84·10⁻⁵)^(10/9)."""
    constant: float = length ** (8.0 / 9.0) / PALMGREN_LINE_APPROACH ** (10.0 / 9.0)
    return constant


def series_constant(inner: float, outer: float, exponent: float) -> float:
    """K of the inner and outer contacts in series, each Q = K·δ^n and one load through both:
    K = [(1/Ki)^(1/n) + (1/Ke)^(1/n)]^(−n) (Harris & Kotzalas)."""
    constant: float = ((1.0 / inner) ** (1.0 / exponent) + (1.0 / outer) ** (1.0 / exponent)) ** (-exponent)
    return constant


def roller_raceway_curvature_sum(dwe: float, dpw: float, alpha_deg: float, *, inner: bool) -> float:
    """Σρ in the rolling direction of a roller on a raceway (1/mm): 2/(Dwe·(1 ∓ γ)),
    γ = Dwe·cos α/Dpw, upper sign inner raceway (Harris & Kotzalas)."""
    gamma = dwe * cosd(alpha_deg) / dpw
    return 2.0 / (dwe * ((1.0 - gamma) if inner else (1.0 + gamma)))


def line_contact_half_width(load: float, length: float, curvature_sum: float,
                            *, modulus: float = REDUCED_MODULUS_STEEL) -> float:
    """Hertz half-width of a line contact, b = (8Q·R/(π·l·E'))^(1/2) with R = 1/Σρ (mm)."""
    return math.sqrt(8.0 * load / (curvature_sum * math.pi * length * modulus))


def line_contact_pressure(load: float, length: float, curvature_sum: float,
                          *, modulus: float = REDUCED_MODULUS_STEEL) -> float:
    """Hertz largest pressure of a line contact, pmax = 2Q/(π·b·l) (MPa)."""
    if load <= 0.0:
        return 0.0
    return 2.0 * load / (math.pi * line_contact_half_width(load, length, curvature_sum,
                                                           modulus=modulus) * length)
