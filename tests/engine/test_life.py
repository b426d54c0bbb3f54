"""Life relations: ISO 281:2007 §7 and §9, the Weibull model against scipy.stats.

Every expected value is typed here from its source (never read from ``engine/tables.py``): the a1
table and the aISO relation as the project's reference sheet gives them [from memory], the
Weibull parameters [handbook: machine-design texts] checked through ``scipy.stats.weibull_min``.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy import stats

from workbench.engine import tables as T
from workbench.engine.life import (
    AISO_CAP, a1_iso281, aiso, basic_rating_life, contamination_factor,
    fatigue_load_limit_estimate, kappa_in_range, life_hours, reference_viscosity,
    weibull_life_factor, weibull_required_rating,
)

# ISO 281:2007 Table 12, R % → a1 [from memory; the closed form reproduces every digit].
A1_PRINTED = [(90, 1.0), (95, 0.64), (96, 0.55), (97, 0.47), (98, 0.37), (99, 0.25), (99.2, 0.22),
              (99.4, 0.19), (99.6, 0.16), (99.8, 0.12), (99.9, 0.093), (99.92, 0.087),
              (99.94, 0.080), (99.95, 0.077)]
# Three-parameter Weibull for ball bearings [handbook: machine-design texts].
WEIBULL_X0, WEIBULL_THETA, WEIBULL_B = 0.02, 4.459, 1.483


def aiso_typed(kappa: float, load_ratio: float, roller: bool) -> float:
    """ISO 281:2007 §9.3.2 as the reference sheet writes it [from memory], typed independently:
    ball 0.1·[1 − (2.5671 − 2.2649/κ^0.054381)^0.83·(eC·Cu/P)^(1/3)]^(−9.3) below κ = 0.4,
    1.9987/κ^0.19087 to κ = 1, 1.9987/κ^0.071739 above; roller 0.1·[1 − (1.5859 −
    1.3993/κ^0.054381)·(eC·Cu/P)^0.4]^(−9.185), 1.2348/κ^0.19087, 1.2348/κ^0.071739; cap 50."""
    if roller:
        c2, k = ((1.3993, 0.054381) if kappa < 0.4 else (1.2348, 0.19087) if kappa < 1
                 else (1.2348, 0.071739))
        # at κ = 0.1 the printed roller digits give a bracket of −0.0002; it is held at 0 (the
        # relation's floor aISO = 0.1, as the ball relation reaches it)
        inner = 1 - max(1.5859 - c2 / kappa ** k, 0.0) * load_ratio ** 0.4
        return 50.0 if inner <= 0 else min(0.1 * inner ** -9.185, 50.0)
    c2, k = ((2.2649, 0.054381) if kappa < 0.4 else (1.9987, 0.19087) if kappa < 1
             else (1.9987, 0.071739))
    inner = 1 - (2.5671 - c2 / kappa ** k) ** 0.83 * load_ratio ** (1 / 3)
    return 50.0 if inner <= 0 else min(0.1 * inner ** -9.3, 50.0)


def _printed(value: float, like: float) -> float:
    """Round ``value`` to the digits the table prints for ``like`` (two or three decimals)."""
    decimals = len(repr(like).split(".")[1]) if "." in repr(like) else 0
    return round(value, decimals)


@pytest.mark.parametrize(("r_percent", "a1"), A1_PRINTED)
def test_a1_closed_form_reproduces_table_12(r_percent: float, a1: float) -> None:
    """ISO 281:2007 Table 12 (from memory): the closed form gives every printed digit."""
    assert _printed(a1_iso281(r_percent / 100.0), a1) == a1


@pytest.mark.parametrize("r_percent", [90.0, 93.0, 95.0, 99.0, 99.9])
def test_a1_closed_form_typed(r_percent: float) -> None:
    """a1 = 0.95·(ln(100/R)/ln(100/90))^(2/3) + 0.05 (ISO 281:2007 §9.2, from memory), typed here."""
    typed = 0.95 * (math.log(100 / r_percent) / math.log(100 / 90)) ** (2 / 3) + 0.05
    assert a1_iso281(r_percent / 100.0) == pytest.approx(typed, rel=1e-12)


def test_a1_range_is_table_12() -> None:
    """Table 12 runs from 90 % to 99.95 % (from memory)."""
    assert (T.RELIABILITY_MIN, T.RELIABILITY_MAX) == (0.90, 0.9995)


def test_a1_is_not_the_older_table() -> None:
    """ISO 281:1990 printed 0.62 at 95 %; the 2007 value is 0.64 (from memory): keep them apart."""
    assert round(a1_iso281(0.95), 2) == 0.64


@settings(max_examples=100, deadline=None)
@given(st.floats(min_value=0.5, max_value=0.9999))
def test_weibull_life_factor_matches_scipy(reliability: float) -> None:
    """x at reliability R equals scipy.stats.weibull_min(c=b, loc=x0, scale=θ−x0).ppf(1 − R)."""
    x0, theta, b = WEIBULL_X0, WEIBULL_THETA, WEIBULL_B
    reference = stats.weibull_min(c=b, loc=x0, scale=theta - x0).ppf(1.0 - reliability)
    assert weibull_life_factor(reliability, x0, theta, b) == pytest.approx(reference, rel=1e-10)


def test_weibull_parameters_put_the_rating_life_near_90_percent() -> None:
    """With x0 = 0.02, θ = 4.459, b = 1.483 (handbook) survival at x = 1 is about 0.90."""
    sf = stats.weibull_min(c=WEIBULL_B, loc=WEIBULL_X0, scale=WEIBULL_THETA - WEIBULL_X0).sf(1.0)
    assert sf == pytest.approx(0.90, abs=0.002)


def test_engine_weibull_defaults_are_the_handbook_values() -> None:
    """The default Weibull parameters are the handbook's ball-bearing values x0 = 0.02, θ = 4.459,
    b = 1.483, and give scipy's quantiles."""
    assert (T.WEIBULL_X0, T.WEIBULL_THETA, T.WEIBULL_B) == (WEIBULL_X0, WEIBULL_THETA, WEIBULL_B)
    for r in (0.5, 0.9, 0.99):
        reference = stats.weibull_min(c=1.483, loc=0.02, scale=4.439).ppf(1.0 - r)
        assert weibull_life_factor(r, T.WEIBULL_X0, T.WEIBULL_THETA, T.WEIBULL_B) == pytest.approx(
            reference, rel=1e-12)


def test_weibull_required_rating_inverts_the_life_relation() -> None:
    """C10 = af·FD·[xD/(x0 + (θ−x0)(ln 1/RD)^(1/b))]^(1/a): putting C10 back gives xD at RD."""
    fd, xd, rd, af = 1800.0, 540.0, 0.99, 1.2
    c10 = weibull_required_rating(fd, xd, rd, af, 3.0, WEIBULL_X0, WEIBULL_THETA, WEIBULL_B)
    life_at_rd = basic_rating_life(c10, af * fd, 3.0) * weibull_life_factor(
        rd, WEIBULL_X0, WEIBULL_THETA, WEIBULL_B)
    assert life_at_rd == pytest.approx(xd, rel=1e-12)
    # and the handbook's closed form, typed: C10 = af·FD·[xD/(x0 + (θ − x0)(ln 1/RD)^(1/b))]^(1/3)
    typed = af * fd * (xd / (0.02 + 4.439 * math.log(1 / rd) ** (1 / 1.483))) ** (1 / 3)
    assert c10 == pytest.approx(typed, rel=1e-12)


def test_basic_life_and_hours_closed_form() -> None:
    """L10 = (C/P)^p and L10h = 10⁶·L10/(60·n) (ISO 281:2007 §7.1)."""
    assert basic_rating_life(30000.0, 3000.0, 3.0) == pytest.approx(1000.0)
    assert basic_rating_life(30000.0, 3000.0, 10 / 3) == pytest.approx(10 ** (10 / 3))
    assert life_hours(1000.0, 500.0) == pytest.approx(1e9 / 30000.0)


def test_reference_viscosity_pieces() -> None:
    """ν1 (ISO 281:2007 §9.3.3, from memory): 45000·n^−0.83·dm^−0.5 below 1000 r/min, else 4500·n^−0.5·dm^−0.5."""
    assert reference_viscosity(500.0, 100.0) == pytest.approx(45000 * 500 ** -0.83 / 10)
    assert reference_viscosity(3000.0, 64.0) == pytest.approx(4500 / math.sqrt(3000) / 8)
    assert reference_viscosity(999.0, 49.0) == pytest.approx(45000 * 999 ** -0.83 / 7)
    assert reference_viscosity(1000.0, 49.0) == pytest.approx(4500 / math.sqrt(1000) / 7)


@pytest.mark.parametrize("roller", [False, True])
@pytest.mark.parametrize("kappa", [0.4, 1.0])
def test_aiso_pieces_join_at_their_boundaries(roller: bool, kappa: float) -> None:
    """ISO 281:2007 §9.3.2 (from memory): the κ ranges meet at 0.4 and 1, to within the
    rounding of the printed five-digit coefficients (a few parts in 10⁴ before the −9.3 power)."""
    below = aiso(kappa * (1 - 1e-9), 0.2, roller)
    above = aiso(kappa, 0.2, roller)
    assert below == pytest.approx(above, rel=2e-3)


@pytest.mark.parametrize("roller", [False, True])
@pytest.mark.parametrize("kappa", [0.1, 0.25, 0.39, 0.4, 0.7, 0.99, 1.0, 2.0, 4.0])
@pytest.mark.parametrize("load_ratio", [0.02, 0.1, 0.3, 0.8])
def test_aiso_equals_the_typed_relation(roller: bool, kappa: float, load_ratio: float) -> None:
    """aISO against the ISO 281:2007 §9.3.2 relation typed in this file (from memory)."""
    assert aiso(kappa, load_ratio, roller) == pytest.approx(aiso_typed(kappa, load_ratio, roller),
                                                            rel=1e-12)


def test_kappa_range_and_cap() -> None:
    """The aISO method covers 0.1 ≤ κ ≤ 4 and caps aISO at 50 (ISO 281:2007 §9.3.2, from memory)."""
    assert (kappa_in_range(0.05), kappa_in_range(2.0), kappa_in_range(9.0)) == (0.1, 2.0, 4.0)
    assert AISO_CAP == 50.0


@pytest.mark.parametrize(("level", "small", "large"), [
    ("extreme", (1.0, 1.0), (1.0, 1.0)), ("high", (0.6, 0.8), (0.8, 0.9)),
    ("normal", (0.5, 0.6), (0.6, 0.8)), ("slight", (0.3, 0.5), (0.4, 0.6)),
    ("typical", (0.1, 0.3), (0.2, 0.4)), ("severe", (0.0, 0.1), (0.0, 0.1)),
    ("very-severe", (0.0, 0.0), (0.0, 0.0))])
def test_contamination_levels(level: str, small: tuple[float, float], large: tuple[float, float]) -> None:
    """ISO 281:2007 §9.3.4 eC ranges, dpw < 100 mm and ≥ 100 mm (from memory): the midpoint is used."""
    for dpw, (low, high) in ((60.0, small), (99.9, small), (100.0, large), (250.0, large)):
        ec, rng = contamination_factor(level, dpw)
        assert rng == pytest.approx((low, high), abs=1e-12)
        assert ec == pytest.approx(0.5 * (low + high), abs=1e-12)


def test_aiso_limits() -> None:
    """eC = 0 gives aISO = 0.1 (the floor of the relation); clean, lightly loaded hits the cap 50."""
    assert aiso(1.0, 0.0, False) == pytest.approx(0.1)
    assert aiso(4.0, 5.0, False) == AISO_CAP
    assert aiso(4.0, 5.0, True) == AISO_CAP


@settings(max_examples=100, deadline=None)
@given(st.floats(min_value=0.1, max_value=4.0), st.floats(min_value=0.0, max_value=2.0))
def test_aiso_rises_with_kappa_and_cleanliness(kappa: float, ratio: float) -> None:
    """More viscosity or more eC·Cu/P never lowers aISO (ISO 281:2007 §9.3 diagrams)."""
    for roller in (False, True):
        base = aiso(kappa, ratio, roller)
        assert aiso(min(kappa * 1.05, 4.0), ratio, roller) >= base * (1 - 1e-12)
        assert aiso(kappa, ratio * 1.05, roller) >= base * (1 - 1e-12)


def test_aiso_array_equals_scalar() -> None:
    """The vectorised relation equals the scalar one."""
    kappa = np.array([0.1, 0.3, 0.5, 1.0, 2.5, 4.0])
    ratio = np.array([0.05, 0.2, 0.4, 1.0, 3.0, 0.0])
    for roller in (False, True):
        arr = aiso(kappa, ratio, roller)
        assert np.allclose(arr, [aiso(float(k), float(r), roller) for k, r in zip(kappa, ratio)])


def test_fatigue_load_limit_estimate() -> None:
    """Cu ≈ C0/22 (ball) or C0/8.2 (roller), reduced above dpw = 100 mm (ISO 281 Annex B, from memory)."""
    assert fatigue_load_limit_estimate(22000.0, 80.0, False) == pytest.approx(1000.0)
    assert fatigue_load_limit_estimate(8200.0, 400.0, True) == pytest.approx(1000.0 * 0.25 ** 0.3)
    assert fatigue_load_limit_estimate(8200.0, 80.0, True) == pytest.approx(1000.0)
    assert fatigue_load_limit_estimate(22000.0, 400.0, False) == pytest.approx(1000.0 * 0.25 ** 0.5)
    assert fatigue_load_limit_estimate(22000.0, 100.0, False) == pytest.approx(1000.0)
    # just above 100 mm the reduction already applies (the switch is at dpw = 100 mm)
    assert fatigue_load_limit_estimate(22000.0, 101.5, False) == pytest.approx(
        1000.0 * (100.0 / 101.5) ** 0.5, rel=1e-12)


def test_a_vanishing_load_gives_an_infinite_life_not_an_overflow() -> None:
    """(C/P)^3 with C/P ≈ 1e225 exceeds the largest float (about 1.8e308, IEEE 754 double):
    the relation of ISO 281:2007 §7 sets no limit, so the life is infinite; arrays agree."""
    assert basic_rating_life(5000.0, 4.6e-222, 3.0) == math.inf
    lives = basic_rating_life(np.array([5000.0, 5000.0]), np.array([4.6e-222, 5000.0]), 3.0)
    assert lives[0] == math.inf and lives[1] == 1.0
