"""Life relations: ISO 281:2007 §7 and §9, the Weibull model against scipy.stats."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy import stats

from workbench.engine import tables as T
from workbench.engine.life import (
    AISO_CAP, a1_iso281, aiso, basic_rating_life, fatigue_load_limit_estimate, life_hours,
    reference_viscosity, weibull_life_factor, weibull_required_rating,
)


def _printed(value: float, like: float) -> float:
    """Round ``value`` to the digits the table prints for ``like`` (two or three decimals)."""
    decimals = len(repr(like).split(".")[1]) if "." in repr(like) else 0
    return round(value, decimals)


@pytest.mark.parametrize(("r_percent", "a1"), T.A1_TABLE)
def test_a1_closed_form_reproduces_table_12(r_percent: float, a1: float) -> None:
    """ISO 281:2007 Table 12 (from memory): the closed form gives every printed digit."""
    assert _printed(a1_iso281(r_percent / 100.0), a1) == a1


def test_a1_is_not_the_older_table() -> None:
    """ISO 281:1990 printed 0.62 at 95 %; the 2007 value is 0.64 (from memory): keep them apart."""
    assert round(a1_iso281(0.95), 2) == 0.64


@settings(max_examples=100, deadline=None)
@given(st.floats(min_value=0.5, max_value=0.9999))
def test_weibull_life_factor_matches_scipy(reliability: float) -> None:
    """x at reliability R equals scipy.stats.weibull_min(c=b, loc=x0, scale=θ−x0).ppf(1 − R)."""
    x0, theta, b = T.WEIBULL_X0, T.WEIBULL_THETA, T.WEIBULL_B
    reference = stats.weibull_min(c=b, loc=x0, scale=theta - x0).ppf(1.0 - reliability)
    assert weibull_life_factor(reliability, x0, theta, b) == pytest.approx(reference, rel=1e-10)


def test_weibull_parameters_put_the_rating_life_near_90_percent() -> None:
    """With x0 = 0.02, θ = 4.459, b = 1.483 (handbook) survival at x = 1 is about 0.90."""
    sf = stats.weibull_min(c=T.WEIBULL_B, loc=T.WEIBULL_X0, scale=T.WEIBULL_THETA - T.WEIBULL_X0).sf(1.0)
    assert sf == pytest.approx(0.90, abs=0.002)


def test_weibull_required_rating_inverts_the_life_relation() -> None:
    """C10 = af·FD·[xD/(x0 + (θ−x0)(ln 1/RD)^(1/b))]^(1/a): putting C10 back gives xD at RD."""
    fd, xd, rd, af = 1800.0, 540.0, 0.99, 1.2
    c10 = weibull_required_rating(fd, xd, rd, af, 3.0, T.WEIBULL_X0, T.WEIBULL_THETA, T.WEIBULL_B)
    life_at_rd = basic_rating_life(c10, af * fd, 3.0) * weibull_life_factor(
        rd, T.WEIBULL_X0, T.WEIBULL_THETA, T.WEIBULL_B)
    assert life_at_rd == pytest.approx(xd, rel=1e-12)


def test_basic_life_and_hours_closed_form() -> None:
    """L10 = (C/P)^p and L10h = 10⁶·L10/(60·n) (ISO 281:2007 §7.1)."""
    assert basic_rating_life(30000.0, 3000.0, 3.0) == pytest.approx(1000.0)
    assert basic_rating_life(30000.0, 3000.0, 10 / 3) == pytest.approx(10 ** (10 / 3))
    assert life_hours(1000.0, 500.0) == pytest.approx(1e9 / 30000.0)


def test_reference_viscosity_pieces() -> None:
    """ν1 (ISO 281:2007 §9.3.3, from memory): 45000·n^−0.83·dm^−0.5 below 1000 r/min, else 4500·n^−0.5·dm^−0.5."""
    assert reference_viscosity(500.0, 100.0) == pytest.approx(45000 * 500 ** -0.83 / 10)
    assert reference_viscosity(3000.0, 64.0) == pytest.approx(4500 / math.sqrt(3000) / 8)


@pytest.mark.parametrize("roller", [False, True])
@pytest.mark.parametrize("kappa", [0.4, 1.0])
def test_aiso_pieces_join_at_their_boundaries(roller: bool, kappa: float) -> None:
    """ISO 281:2007 §9.3.2 (from memory): the κ ranges meet at 0.4 and 1, to within the
    rounding of the printed five-digit coefficients (a few parts in 10⁴ before the −9.3 power)."""
    below = aiso(kappa * (1 - 1e-9), 0.2, roller)
    above = aiso(kappa, 0.2, roller)
    assert below == pytest.approx(above, rel=2e-3)


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


def test_a_vanishing_load_gives_an_infinite_life_not_an_overflow() -> None:
    """(C/P)^3 with C/P ≈ 1e225 exceeds the largest float (about 1.8e308, IEEE 754 double):
    the relation of ISO 281:2007 §7 sets no limit, so the life is infinite; arrays agree."""
    assert basic_rating_life(5000.0, 4.6e-222, 3.0) == math.inf
    lives = basic_rating_life(np.array([5000.0, 5000.0]), np.array([4.6e-222, 5000.0]), 3.0)
    assert lives[0] == math.inf and lives[1] == 1.0
