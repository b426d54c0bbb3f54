"""e, X, Y and X0, Y0 against ISO 281:2007 Table 3 and ISO 76:2006 as tabulated in engine/tables.py.

The table digits themselves are from the sources named in tables.py (handbook for the deep-groove
block, from memory for the rest); these tests check that every tabulated point reproduces exactly,
that midpoints interpolate linearly (the standard's own instruction), and the closed-form rows.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from workbench.engine import tables as T
from workbench.engine.kinds import (
    Arrangement, Kind, dynamic_factors, equivalent_dynamic_load, equivalent_static_load,
    static_factors,
)
from workbench.engine.record import InputError


@pytest.mark.parametrize("i", range(len(T.DEEP_GROOVE_INDEX_F0)))
def test_deep_groove_table_points_reproduce(i: int) -> None:
    """ISO 281:2007 Table 3, deep-groove: each f0·Fa/C0r row gives its e and Y (handbook)."""
    index = T.DEEP_GROOVE_INDEX_F0[i]
    f = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=index, c0=1.0, f0=1.0)
    assert f.e == pytest.approx(T.DEEP_GROOVE_E[i], abs=1e-12)
    assert f.y_high == pytest.approx(T.DEEP_GROOVE_Y[i], abs=1e-12)
    assert f.x_high == 0.56 and f.x_low == 1.0 and f.y_low == 0.0


@pytest.mark.parametrize("i", range(len(T.DEEP_GROOVE_INDEX_F0) - 1))
def test_deep_groove_midpoints_interpolate_linearly(i: int) -> None:
    """ISO 281:2007 Table 3 note: linear interpolation between rows."""
    mid = 0.5 * (T.DEEP_GROOVE_INDEX_F0[i] + T.DEEP_GROOVE_INDEX_F0[i + 1])
    f = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=mid, c0=1.0, f0=1.0)
    assert f.e == pytest.approx(0.5 * (T.DEEP_GROOVE_E[i] + T.DEEP_GROOVE_E[i + 1]), abs=1e-12)
    assert f.y_high == pytest.approx(0.5 * (T.DEEP_GROOVE_Y[i] + T.DEEP_GROOVE_Y[i + 1]), abs=1e-12)


@pytest.mark.parametrize(
    ("fa_c0", "e", "y"),
    [(0.014, 0.19, 2.30), (0.028, 0.22, 1.99), (0.056, 0.26, 1.71), (0.084, 0.28, 1.55),
     (0.11, 0.30, 1.45), (0.17, 0.34, 1.31), (0.28, 0.38, 1.15), (0.42, 0.42, 1.04),
     (0.56, 0.44, 1.00)],
)
def test_deep_groove_fa_over_c0_basis_matches_printed_digits(fa_c0: float, e: float, y: float) -> None:
    """The Fa/C0 form of Table 3 (f0 ≈ 12.3 folded in; handbook, partly): the printed digits."""
    f = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=fa_c0, c0=1.0, f0=None)
    assert abs(f.e - e) <= 0.005 + 1e-9
    assert abs(f.y_high - y) <= 0.02
    assert "Fa/C0" in f.basis


@pytest.mark.parametrize(("fa_c0", "e", "y"), [(0.021, 0.21, 2.15), (0.042, 0.24, 1.85),
                                               (0.070, 0.27, 1.63)])
def test_deep_groove_intermediate_rows_from_interpolation(fa_c0: float, e: float, y: float) -> None:
    """Intermediate Fa/C0 rows 0.021, 0.042, 0.070 (from memory) follow from linear interpolation."""
    f = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=fa_c0, c0=1.0, f0=None)
    assert abs(f.e - e) <= 0.0051
    assert abs(f.y_high - y) <= 0.0051


def test_table_clamps_and_flags_instead_of_extrapolating() -> None:
    """Outside the table the end row is used and flagged (never silent extrapolation)."""
    above = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=20.0, c0=1.0, f0=1.0)
    below = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=0.01, c0=1.0, f0=1.0)
    assert (above.e, above.y_high, above.clamped) == (0.44, 1.00, 1)
    assert (below.e, below.y_high, below.clamped) == (0.19, 2.30, -1)


@pytest.mark.parametrize("angle", sorted(T.ANGULAR_FIXED))
def test_angular_contact_fixed_angles(angle: int) -> None:
    """ISO 281:2007 Table 3, angular-contact rows 20°–45° (from memory; 40° row handbook)."""
    e, xs, ys, xl, yl, xh, yh = T.ANGULAR_FIXED[angle]
    single = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, float(angle))
    pair = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.BACK_TO_BACK, float(angle))
    assert (single.e, single.x_low, single.y_low, single.x_high, single.y_high) == (e, 1.0, 0.0, xs, ys)
    assert (pair.e, pair.x_low, pair.y_low, pair.x_high, pair.y_high) == (e, xl, yl, xh, yh)


def test_angular_contact_40_degree_row_handbook() -> None:
    """40° single row: e = 1.14, X = 0.35, Y = 0.57 (handbook: co-design rolling-element pages)."""
    f = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, 40.0)
    assert (f.e, f.x_high, f.y_high) == (1.14, 0.35, 0.57)


def test_angular_contact_15_degree_is_load_dependent() -> None:
    """15°: e and Y by i·f0·Fa/C0r (Table 3, from memory): first and last rows."""
    low = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, 15.0, fa=0.178, c0=1.0, f0=1.0)
    high = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, 15.0, fa=7.14, c0=1.0, f0=1.0)
    assert (low.e, low.y_high, low.x_high) == pytest.approx((0.38, 1.47, 0.44))
    assert (high.e, high.y_high) == pytest.approx((0.56, 1.00))


@pytest.mark.parametrize("angle", [10.0, 22.0, 37.5, 50.0])
def test_untabulated_angular_contact_angle_is_a_clear_error(angle: float) -> None:
    """Angles outside the tabulated set are refused, naming the input."""
    with pytest.raises(InputError) as info:
        dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, angle)
    assert info.value.field == "contact_angle"


@pytest.mark.parametrize("alpha", [10.0, 12.5, 15.0, 20.0])
def test_roller_closed_forms(alpha: float) -> None:
    """Radial roller with α ≠ 0 (Table 3, from memory): e = 1.5·tan α; Y = 0.4·cot α single row,
    0.45 and 0.67·cot α double row; self-aligning ball 0.42 and 0.65·cot α."""
    t = math.tan(math.radians(alpha))
    single = dynamic_factors(Kind.TAPERED, Arrangement.SINGLE, alpha)
    double = dynamic_factors(Kind.SPHERICAL, Arrangement.DOUBLE_ROW, alpha)
    ball = dynamic_factors(Kind.SELF_ALIGNING, Arrangement.DOUBLE_ROW, alpha)
    assert single.e == pytest.approx(1.5 * t)
    assert (single.x_low, single.y_low, single.x_high, single.y_high) == pytest.approx((1, 0, 0.4, 0.4 / t))
    assert (double.x_low, double.y_low, double.x_high, double.y_high) == pytest.approx((1, 0.45 / t, 0.67, 0.67 / t))
    assert (ball.x_low, ball.y_low, ball.x_high, ball.y_high) == pytest.approx((1, 0.42 / t, 0.65, 0.65 / t))


def test_makers_e_and_y_override_the_angle() -> None:
    """Makers publish e and Y per bearing; given values replace the α relations."""
    f = dynamic_factors(Kind.TAPERED, Arrangement.SINGLE, 12.0, e_given=0.37, y_given=1.6)
    assert (f.e, f.y_high, f.x_high) == (0.37, 1.6, 0.4)


def test_pure_thrust_on_a_radial_ball_bearing_takes_the_high_branch() -> None:
    """Fr = 0, Fa > 0: Fa/Fr is infinite, so P = Y·Fa (ISO 281 §6.1), never a division error."""
    f = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=2000.0, c0=20000.0, f0=None)
    p, ratio, high = equivalent_dynamic_load(f, 0.0, 2000.0)
    assert math.isinf(ratio) and high
    assert p == pytest.approx(f.y_high * 2000.0)


@settings(max_examples=200, deadline=None)
@given(st.floats(min_value=0.172, max_value=6.89))
def test_deep_groove_switch_at_e_jumps_no_more_than_table_rounding(index: float) -> None:
    """At Fa/Fr = e the two branches give P = Fr and 0.56·Fr + Y·e·Fr; with e and Y printed to
    two decimals the difference stays within the table's own rounding (≤ 1.5 % of Fr)."""
    f = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=index, c0=1.0, f0=1.0)
    low_branch = f.x_low + f.y_low * f.e
    high_branch = f.x_high + f.y_high * f.e
    assert abs(high_branch - low_branch) <= 0.015


def test_array_path_matches_scalar_path() -> None:
    """The vectorised factors (catalog sweeps) equal the scalar ones element by element."""
    fa = np.array([100.0, 900.0, 2500.0, 8000.0, 40000.0])
    c0 = np.array([19000.0, 19000.0, 12000.0, 30000.0, 25000.0])
    fr = np.array([5200.0, 300.0, 5200.0, 0.0, 1000.0])
    arr = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=fa, c0=c0)
    p_arr, _, _ = equivalent_dynamic_load(arr, fr, fa)
    for i in range(len(fa)):
        one = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=float(fa[i]), c0=float(c0[i]))
        p_one, _, _ = equivalent_dynamic_load(one, float(fr[i]), float(fa[i]))
        assert p_arr[i] == pytest.approx(p_one, rel=1e-12)


def test_static_factors_and_p0_rule() -> None:
    """ISO 76:2006 §6 (from memory): deep groove X0 = 0.6, Y0 = 0.5 with P0 = Fr when larger."""
    sf = static_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0)
    assert (sf.x0, sf.y0) == (0.6, 0.5)
    p0, floored = equivalent_static_load(sf, 5000.0, 1000.0)  # 0.6·5000 + 0.5·1000 = 3500 < 5000
    assert (p0, floored) == (5000.0, True)
    p0, floored = equivalent_static_load(sf, 1000.0, 4000.0)  # 600 + 2000 = 2600 > 1000
    assert p0 == pytest.approx(2600.0) and not floored
    pair = static_factors(Kind.ANGULAR_CONTACT, Arrangement.BACK_TO_BACK, 40.0)
    assert (pair.x0, pair.y0) == (1.0, pytest.approx(0.52))  # pairs: Y0 twice the single row
