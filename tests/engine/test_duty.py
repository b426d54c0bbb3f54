"""Palmgren–Miner duty cycles and series-system life, against direct computation and scipy.stats."""

from __future__ import annotations

import math

import numpy as np
import pytest
from scipy.stats import weibull_min

from workbench.engine.duty import (
    WEIBULL_SLOPE_BALL,
    WEIBULL_SLOPE_ROLLER,
    mean_equivalent_load,
    mean_speed,
    miner_life,
    revolution_shares,
    system_life,
    system_reliability,
)
from workbench.engine.record import InputError

# An invented three-state duty: loads (N), time shares, speeds (r/min), ball bearing p = 3.
LOADS = [4000.0, 6000.0, 2000.0]
TIME_SHARES = [0.5, 0.3, 0.2]
SPEEDS = [1000.0, 500.0, 1500.0]


def test_equal_states_give_the_single_state_result() -> None:
    # Palmgren–Miner: identical states are one state; Pm = P and L = Li whatever the shares.
    assert mean_equivalent_load([5000.0] * 3, [1.0, 2.0, 7.0], 3.0, [900.0, 300.0, 1200.0]) == \
        pytest.approx(5000.0, rel=1e-12)
    result = miner_life([250.0] * 4, [0.1, 0.2, 0.3, 0.4])
    assert result.life == pytest.approx(250.0, rel=1e-12)
    np.testing.assert_allclose(result.damage_shares, [0.1, 0.2, 0.3, 0.4], rtol=1e-12)


def test_three_state_duty_by_hand() -> None:
    # By hand: revolutions per unit time ti·ni = 500, 150, 300 (Σ 950), so
    # ui = 500/950, 150/950, 300/950.  Σ ui·Pi³ = (500·6.4e10 + 150·2.16e11 + 300·8e9)/950
    # = 6.68e13/950 = 7.031579e10 → Pm = 7.031579e10^(1/3) = 4127.47 N.
    u = revolution_shares(TIME_SHARES, SPEEDS, "time")
    np.testing.assert_allclose(u, np.array([500.0, 150.0, 300.0]) / 950.0, rtol=1e-12)
    pm = mean_equivalent_load(LOADS, TIME_SHARES, 3.0, SPEEDS)
    assert pm == pytest.approx((6.68e13 / 950.0) ** (1.0 / 3.0), rel=1e-12)
    assert pm == pytest.approx(4127.47, abs=0.01)
    # the same shares given as revolution shares
    assert mean_equivalent_load(LOADS, [500.0, 150.0, 300.0], 3.0, share_basis="revolutions") == \
        pytest.approx(pm, rel=1e-12)
    # nm = Σ ti·ni = 0.5·1000 + 0.3·500 + 0.2·1500 = 950 r/min
    assert mean_speed(SPEEDS, TIME_SHARES) == pytest.approx(950.0, rel=1e-12)

    # Miner with C = 30 000 N: Li = (C/Pi)³ = 421.875, 125, 3375 (10⁶ rev).
    # 1/L = (500/950)/421.875 + (150/950)/125 + (300/950)/3375 = 2.60429e-3 → L = 383.98,
    # equal to (C/Pm)³ = 2.7e13/7.031579e10 = 383.98.  Damage shares ∝ revolutions·Pi³:
    # 3.2e13, 3.24e13, 2.4e12 over 6.68e13 = 0.47904, 0.48503, 0.03593.
    lives = [(30000.0 / p) ** 3 for p in LOADS]
    np.testing.assert_allclose(lives, [421.875, 125.0, 3375.0], rtol=1e-12)
    result = miner_life(lives, u)
    assert result.life == pytest.approx(1.0 / sum(ui / li for ui, li in zip(u, lives)), rel=1e-12)
    assert result.life == pytest.approx((30000.0 / pm) ** 3, rel=1e-12)
    assert result.life == pytest.approx(383.98, abs=0.01)
    np.testing.assert_allclose(result.damage_shares, np.array([3.2e13, 3.24e13, 2.4e12]) / 6.68e13,
                               rtol=1e-12)


def test_state_without_damage() -> None:
    # an unloaded state (infinite life) does no damage: 1/L = 0.5/100 → L = 200
    result = miner_life([100.0, math.inf], [0.5, 0.5])
    assert result.life == pytest.approx(200.0)
    np.testing.assert_allclose(result.damage_shares, [1.0, 0.0])
    assert miner_life([math.inf], [1.0]).life == math.inf


def test_weibull_slopes_for_system_life() -> None:
    # Weibull slopes of rolling-bearing fatigue life (from memory): 10/9 ball, 9/8 roller.
    assert WEIBULL_SLOPE_BALL == pytest.approx(10 / 9, rel=1e-15)
    assert WEIBULL_SLOPE_ROLLER == pytest.approx(9 / 8, rel=1e-15)


def test_system_life_closed_form() -> None:
    # L10,sys = (Σ L10,i^(−e))^(−1/e); n equal lives give L·n^(−1/e).
    lives = [12000.0, 8000.0, 30000.0]
    e = WEIBULL_SLOPE_BALL
    assert system_life(lives, e) == pytest.approx(sum(li ** -e for li in lives) ** (-1.0 / e), rel=1e-12)
    assert system_life([5000.0] * 4, WEIBULL_SLOPE_ROLLER) == \
        pytest.approx(5000.0 * 4 ** (-1.0 / WEIBULL_SLOPE_ROLLER), rel=1e-12)
    assert system_life([5000.0, math.inf], e) == pytest.approx(5000.0, rel=1e-12)


def test_system_life_against_scipy_weibull() -> None:
    # Two-parameter Weibull (scipy.stats.weibull_min, c = e, scale η): a bearing with L10 has
    # η = L10/(ln(1/0.9))^(1/e).  Series system: survival = product of survivals, so at L10,sys
    # the product of the bearings' survival functions is 0.90.
    lives = np.array([12000.0, 8000.0, 30000.0])
    e = WEIBULL_SLOPE_ROLLER
    scales = lives / math.log(1.0 / 0.9) ** (1.0 / e)
    l10_sys = system_life(lives, e)
    survival = [weibull_min.sf(l10_sys, e, scale=s) for s in scales]
    assert system_reliability(survival) == pytest.approx(0.90, rel=1e-12)
    # at any other life the product equals one Weibull of the same slope with the system's scale
    system_scale = float(np.sum(scales ** -e) ** (-1.0 / e))
    for life in (1000.0, 7000.0, 40000.0):
        product = system_reliability([weibull_min.sf(life, e, scale=s) for s in scales])
        assert product == pytest.approx(weibull_min.sf(life, e, scale=system_scale), rel=1e-12)


@pytest.mark.parametrize("call, field", [
    (lambda: mean_equivalent_load(LOADS, TIME_SHARES, 3.0), "speeds"),
    (lambda: mean_equivalent_load(LOADS, [0.5, 0.5], 3.0, [1.0, 2.0]), "shares"),
    (lambda: mean_equivalent_load(LOADS, TIME_SHARES, 3.0, [1.0, 2.0]), "shares"),
    (lambda: mean_equivalent_load([-1.0], [1.0], 3.0, share_basis="revolutions"), "loads"),
    (lambda: mean_equivalent_load(LOADS, TIME_SHARES, 0.0, SPEEDS), "life_exponent"),
    (lambda: mean_equivalent_load(LOADS, TIME_SHARES, 3.0, SPEEDS, "cycles"), "share_basis"),
    (lambda: mean_equivalent_load(LOADS, [0.0, 0.0, 0.0], 3.0, SPEEDS), "shares"),
    (lambda: miner_life([100.0, 0.0], [0.5, 0.5]), "lives"),
    (lambda: miner_life([], []), "lives"),
    (lambda: system_life([100.0, math.nan], 1.1), "lives"),
    (lambda: system_life([100.0], 0.0), "weibull_slope"),
    (lambda: system_reliability([0.9, 1.01]), "reliabilities"),
])
def test_bad_input(call, field: str) -> None:
    with pytest.raises(InputError) as caught:
        call()
    assert caught.value.field == field
