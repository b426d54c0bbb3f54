"""e, X, Y and X0, Y0 against ISO 281:2007 Table 3 and ISO 76:2006, typed here from the sources.

Every expected value is written into this file (never read from ``engine/tables.py``), with its
source beside it: the deep-groove block [handbook: *Rules of Thumb for Mechanical Engineers*,
Table 7a]; the angular-contact, thrust and static rows [from memory, as the project's reference
sheet gives them]; and the closed forms that tie the printed digits together — continuity of P at
the branch switch (e·Y = 1 − X for single rows), the pair factors 2^0.7 ≈ 1.625 times the single
row's, e = 1.5·tan α and Y ∝ cot α — which hold whatever digits were recalled.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from workbench.engine.kinds import (
    Arrangement, Kind, dynamic_factors, dynamic_load, equivalent_dynamic_load,
    equivalent_static_load, life_clause, load_clause, rotation_factor, static_clause,
    static_factors,
)
from workbench.engine.record import InputError

# ISO 281:2007 Table 3, single-row deep-groove ball bearings [handbook: Rules of Thumb for
# Mechanical Engineers, Table 7a]: f0·Fa/C0r, the printed Fa/C0r column, e, Y (X = 0.56 above e).
DEEP_GROOVE_ROWS = [
    # f0·Fa/C0r, Fa/C0r, e, Y
    (0.172, 0.014, 0.19, 2.30),
    (0.345, 0.028, 0.22, 1.99),
    (0.689, 0.056, 0.26, 1.71),
    (1.03, 0.084, 0.28, 1.55),
    (1.38, 0.11, 0.30, 1.45),
    (2.07, 0.17, 0.34, 1.31),
    (3.45, 0.28, 0.38, 1.15),
    (5.17, 0.42, 0.42, 1.04),
    (6.89, 0.56, 0.44, 1.00),
]
# ISO 281:2007 Table 3, angular-contact ball 15° [from memory]: i·f0·Fa/C0r, i·Fa/C0r, e,
# single-row Y (X = 0.44), pair Y at Fa/Fr ≤ e (X = 1), pair Y at Fa/Fr > e (X = 0.72).
ANGULAR_15_ROWS = [
    (0.178, 0.015, 0.38, 1.47, 1.65, 2.39),
    (0.357, 0.029, 0.40, 1.40, 1.57, 2.28),
    (0.714, 0.058, 0.43, 1.30, 1.46, 2.11),
    (1.07, 0.087, 0.46, 1.23, 1.38, 2.00),
    (1.43, 0.12, 0.47, 1.19, 1.34, 1.93),
    (2.14, 0.17, 0.50, 1.12, 1.26, 1.82),
    (3.57, 0.29, 0.55, 1.02, 1.14, 1.66),
    (5.35, 0.44, 0.56, 1.00, 1.12, 1.63),
    (7.14, 0.58, 0.56, 1.00, 1.12, 1.63),
]
# ISO 281:2007 Table 3, angular-contact ball at fixed angles [from memory; 40° row handbook:
# co-design rolling-element-bearing pages]: α, e, single X, single Y, pair ≤e X, Y, pair >e X, Y.
ANGULAR_FIXED_ROWS = [
    (20, 0.57, 0.43, 1.00, 1.0, 1.09, 0.70, 1.63),
    (25, 0.68, 0.41, 0.87, 1.0, 0.92, 0.67, 1.41),
    (30, 0.80, 0.39, 0.76, 1.0, 0.78, 0.63, 1.24),
    (35, 0.95, 0.37, 0.66, 1.0, 0.66, 0.60, 1.07),
    (40, 1.14, 0.35, 0.57, 1.0, 0.55, 0.57, 0.93),
    (45, 1.34, 0.33, 0.50, 1.0, 0.47, 0.54, 0.81),
]
# ISO 281:2007 Table 3, single-direction thrust ball bearings, X at Fa/Fr > e (Y = 1) [from memory].
THRUST_BALL_X = [(45, 0.66), (50, 0.73), (55, 0.81), (60, 0.92), (65, 1.06), (70, 1.28),
                 (75, 1.66), (80, 2.25), (85, 4.49)]
# ISO 76:2006, angular-contact ball single row Y0 (X0 = 0.5) [from memory; 40° handbook].
ANGULAR_Y0 = [(15, 0.46), (20, 0.42), (25, 0.38), (30, 0.33), (35, 0.29), (40, 0.26), (45, 0.22)]
PAIR_FACTOR = 2.0 ** 0.7  # i^0.7 with i = 2 rows: the pair factors of Table 3 over the single row's


def _deep_groove(index: float, *, f0: float | None = 1.0):
    return dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa=index, c0=1.0, f0=f0)


@pytest.mark.parametrize(("index", "plain", "e", "y"), DEEP_GROOVE_ROWS)
def test_deep_groove_table_points_reproduce(index: float, plain: float, e: float, y: float) -> None:
    """ISO 281:2007 Table 3, deep-groove (handbook): each f0·Fa/C0r row gives its printed e and Y,
    and so does its printed Fa/C0r row when f0 is not given (Fa/C0 = 0.17 → e = 0.34, Y = 1.31)."""
    by_f0 = _deep_groove(index)
    assert (by_f0.e, by_f0.y_high) == pytest.approx((e, y), abs=1e-12)
    assert (by_f0.x_low, by_f0.y_low, by_f0.x_high) == (1.0, 0.0, 0.56)
    by_plain = _deep_groove(plain, f0=None)
    assert (by_plain.e, by_plain.y_high) == pytest.approx((e, y), abs=1e-12)
    assert by_plain.index_formula == "Fa/C0r"


@pytest.mark.parametrize("i", range(len(DEEP_GROOVE_ROWS) - 1))
def test_deep_groove_midpoints_interpolate_linearly(i: int) -> None:
    """ISO 281:2007 Table 3 note: linear interpolation between rows (either index column)."""
    (x0, p0, e0, y0), (x1, p1, e1, y1) = DEEP_GROOVE_ROWS[i], DEEP_GROOVE_ROWS[i + 1]
    for f in (_deep_groove(0.5 * (x0 + x1)), _deep_groove(0.5 * (p0 + p1), f0=None)):
        assert f.e == pytest.approx(0.5 * (e0 + e1), abs=1e-12)
        assert f.y_high == pytest.approx(0.5 * (y0 + y1), abs=1e-12)


@pytest.mark.parametrize(("index", "plain", "e", "y"), DEEP_GROOVE_ROWS)
def test_deep_groove_rows_are_continuous_at_e(index: float, plain: float, e: float, y: float) -> None:
    """Closed form: P is continuous at Fa/Fr = e, 1 = X + Y·e, so e = (1 − 0.56)/Y to the printed
    rounding; and the Fa/C0r column is the f0·Fa/C0r column over f0 ≈ 12.3 (handbook)."""
    assert e == pytest.approx(0.44 / y, abs=0.005)
    assert plain == pytest.approx(index / 12.3, rel=0.04)
    f = _deep_groove(index)
    assert f.e == pytest.approx((1.0 - f.x_high) / f.y_high, abs=0.005)


@pytest.mark.parametrize(("fa_c0", "e", "y"), [(0.021, 0.21, 2.15), (0.042, 0.24, 1.85),
                                               (0.070, 0.27, 1.63)])
def test_deep_groove_intermediate_rows_from_interpolation(fa_c0: float, e: float, y: float) -> None:
    """Intermediate Fa/C0 rows 0.021, 0.042, 0.070 (from memory) follow from linear interpolation."""
    f = _deep_groove(fa_c0, f0=None)
    assert abs(f.e - e) <= 0.0051
    assert abs(f.y_high - y) <= 0.0051


def test_table_clamps_and_flags_instead_of_extrapolating() -> None:
    """Outside the table the end row is used and flagged (never silent extrapolation)."""
    above = _deep_groove(20.0)
    below = _deep_groove(0.01)
    assert (above.e, above.y_high, above.clamped) == (0.44, 1.00, 1)
    assert (below.e, below.y_high, below.clamped) == (0.19, 2.30, -1)


@pytest.mark.parametrize(("alpha", "e", "xs", "ys", "xl", "yl", "xh", "yh"), ANGULAR_FIXED_ROWS)
def test_angular_contact_fixed_angles(alpha: int, e: float, xs: float, ys: float, xl: float,
                                      yl: float, xh: float, yh: float) -> None:
    """ISO 281:2007 Table 3, angular-contact rows 20°–45° (from memory; 40° row handbook)."""
    single = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, float(alpha))
    tandem = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.TANDEM, float(alpha))
    for arrangement in (Arrangement.BACK_TO_BACK, Arrangement.FACE_TO_FACE):
        pair = dynamic_factors(Kind.ANGULAR_CONTACT, arrangement, float(alpha))
        assert (pair.e, pair.x_low, pair.y_low, pair.x_high, pair.y_high) == (e, xl, yl, xh, yh)
    assert (single.e, single.x_low, single.y_low, single.x_high, single.y_high) == (e, 1.0, 0.0, xs, ys)
    assert (tandem.e, tandem.x_high, tandem.y_high) == (e, xs, ys)


@pytest.mark.parametrize(("alpha", "e", "xs", "ys", "xl", "yl", "xh", "yh"), ANGULAR_FIXED_ROWS)
def test_angular_contact_closed_forms(alpha: int, e: float, xs: float, ys: float, xl: float,
                                      yl: float, xh: float, yh: float) -> None:
    """Closed forms behind the printed rows, independent of the recalled digits: single-row X
    falls 0.02 per 5° from 0.43 at 20°; P is continuous at e (single: e = (1 − X)/Y; pair:
    1 + Y≤·e = X> + Y>·e); the pair's > e factors are 2^0.7 times the single row's."""
    f = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, float(alpha))
    pair = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.BACK_TO_BACK, float(alpha))
    assert f.x_high == pytest.approx(0.43 - 0.004 * (alpha - 20), abs=1e-9)
    assert f.e == pytest.approx((1.0 - f.x_high) / f.y_high, abs=0.005)
    rounding = 0.005 * (1 + 2 * pair.e)  # three factors printed to two decimals
    assert pair.x_low + pair.y_low * pair.e == pytest.approx(pair.x_high + pair.y_high * pair.e,
                                                             abs=rounding)
    assert pair.x_high == pytest.approx(PAIR_FACTOR * f.x_high, abs=0.006)
    assert pair.y_high == pytest.approx(PAIR_FACTOR * f.y_high, abs=0.006)


def test_angular_contact_40_degree_row_handbook() -> None:
    """40° single row: e = 1.14, X = 0.35, Y = 0.57 (handbook: co-design rolling-element pages)."""
    f = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, 40.0)
    assert (f.e, f.x_high, f.y_high) == (1.14, 0.35, 0.57)


@pytest.mark.parametrize(("index", "plain", "e", "ys", "yl", "yh"), ANGULAR_15_ROWS)
def test_angular_contact_15_degree_rows(index: float, plain: float, e: float, ys: float,
                                        yl: float, yh: float) -> None:
    """15° (Table 3, from memory): every row, single and pair, by i·f0·Fa/C0r and by the printed
    i·Fa/C0r column; pairs index with i = 2 rows."""
    single = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, 15.0, fa=index, c0=1.0, f0=1.0)
    assert (single.e, single.y_high, single.x_high) == pytest.approx((e, ys, 0.44), abs=1e-12)
    plain_single = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, 15.0, fa=plain, c0=1.0)
    assert (plain_single.e, plain_single.y_high) == pytest.approx((e, ys), abs=1e-12)
    for arrangement in (Arrangement.BACK_TO_BACK, Arrangement.FACE_TO_FACE):
        pair = dynamic_factors(Kind.ANGULAR_CONTACT, arrangement, 15.0, fa=index / 2, c0=1.0, f0=1.0)
        assert (pair.e, pair.x_low, pair.y_low, pair.x_high, pair.y_high) == pytest.approx(
            (e, 1.0, yl, 0.72, yh), abs=1e-12)
        plain_pair = dynamic_factors(Kind.ANGULAR_CONTACT, arrangement, 15.0, fa=plain / 2, c0=1.0)
        assert (plain_pair.y_low, plain_pair.y_high) == pytest.approx((yl, yh), abs=1e-12)


def test_table_ends_are_where_the_printed_columns_end() -> None:
    """Just past the last printed row (6.89 / 0.56 deep groove, 7.14 / 0.58 at 15°) the index is
    flagged as clamped; just inside it is not (Table 3, as typed above)."""
    for kind, alpha, ends in ((Kind.DEEP_GROOVE, 0.0, (6.89, 0.56)), (Kind.ANGULAR_CONTACT, 15.0, (7.14, 0.58))):
        for end, f0 in zip(ends, (1.0, None)):
            inside = dynamic_factors(kind, Arrangement.SINGLE, alpha, fa=end * 0.999, c0=1.0, f0=f0)
            past = dynamic_factors(kind, Arrangement.SINGLE, alpha, fa=end * 1.001, c0=1.0, f0=f0)
            assert (inside.clamped, past.clamped) == (0, 1)


@pytest.mark.parametrize(("index", "plain", "e", "ys", "yl", "yh"), ANGULAR_15_ROWS)
def test_angular_contact_15_degree_closed_forms(index: float, plain: float, e: float, ys: float,
                                                yl: float, yh: float) -> None:
    """Closed forms for the 15° rows: continuity at e (single e = 0.56/Y; pair 1 + Y≤·e =
    0.72 + Y>·e), pair Y> = 2^0.7 × single Y, and the printed i·Fa/C0r = i·f0·Fa/C0r / 12.3."""
    assert e == pytest.approx(0.56 / ys, abs=0.006)
    assert 1.0 + yl * e == pytest.approx(0.72 + yh * e, abs=0.015)
    assert yh == pytest.approx(PAIR_FACTOR * ys, abs=0.006)
    assert plain == pytest.approx(index / 12.3, rel=0.05)
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
    # the maker's e read back as an angle: α = arctan(e/1.5), the inverse of e = 1.5·tan α
    from workbench.engine.kinds import contact_angle_from_e
    assert contact_angle_from_e(1.5 * t) == pytest.approx(alpha, rel=1e-12)


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
    """ISO 76:2006 §5.2 (from memory): deep groove X0 = 0.6, Y0 = 0.5 with P0 = Fr when larger."""
    sf = static_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0)
    assert (sf.x0, sf.y0) == (0.6, 0.5)
    p0, floored = equivalent_static_load(sf, 5000.0, 1000.0)  # 0.6·5000 + 0.5·1000 = 3500 < 5000
    assert (p0, floored) == (5000.0, True)
    p0, floored = equivalent_static_load(sf, 1000.0, 4000.0)  # 600 + 2000 = 2600 > 1000
    assert p0 == pytest.approx(2600.0) and not floored
    pair = static_factors(Kind.ANGULAR_CONTACT, Arrangement.BACK_TO_BACK, 40.0)
    assert (pair.x0, pair.y0) == (1.0, pytest.approx(0.52))  # pairs: Y0 twice the single row


@pytest.mark.parametrize(("alpha", "x"), THRUST_BALL_X)
def test_thrust_ball_factors(alpha: int, x: float) -> None:
    """Single-direction thrust ball, α < 90° (Table 3, from memory): e = 1.25·tan α, X as printed,
    Y = 1; no Fa/Fr ≤ e branch.  Closed form X = 1.25·tan α·(1 − (2/3)·sin α) holds to the
    printed rounding from 45° to 75° (from memory; the printed 80° and 85° rows lie below it)."""
    f = dynamic_factors(Kind.THRUST_BALL, Arrangement.SINGLE, float(alpha))
    t = math.tan(math.radians(alpha))
    assert f.e == pytest.approx(1.25 * t, rel=1e-12)
    assert (f.x_high, f.y_high) == (x, 1.0)
    if alpha <= 75:
        assert x == pytest.approx(1.25 * t * (1 - 2 / 3 * math.sin(math.radians(alpha))), abs=0.006)
    p, _, _, possible = dynamic_load(Kind.THRUST_BALL, f, 1000.0, 0.5 * f.e * 1000.0)
    assert not possible


@pytest.mark.parametrize("alpha", [50.0, 60.0, 75.0])
def test_thrust_roller_closed_forms(alpha: float) -> None:
    """Thrust roller, α ≠ 90° (ISO 281:2007 §8.2, from memory): e = 1.5·tan α, X = tan α, Y = 1."""
    t = math.tan(math.radians(alpha))
    f = dynamic_factors(Kind.THRUST_ROLLER, Arrangement.SINGLE, alpha)
    assert (f.e, f.x_high, f.y_high) == pytest.approx((1.5 * t, t, 1.0), rel=1e-12)


@pytest.mark.parametrize("kind", [Kind.THRUST_BALL, Kind.THRUST_ROLLER])
def test_thrust_at_90_degrees_is_pure_axial(kind: Kind) -> None:
    """α = 90°: P = Fa (ISO 281:2007 §6.2, §8.2) and P0 = Fa (ISO 76:2006)."""
    f = dynamic_factors(kind, Arrangement.SINGLE, 90.0)
    p, _, _, possible = dynamic_load(kind, f, 0.0, 3000.0)
    assert (p, possible) == (3000.0, True)
    # X = 0, Y = 1 on either side of e: no radial term, the axial load whole
    assert (f.x_low, f.y_low, f.x_high, f.y_high) == (0.0, 1.0, 0.0, 1.0)
    sf = static_factors(kind, Arrangement.SINGLE, 90.0)
    assert equivalent_static_load(sf, 0.0, 3000.0)[0] == 3000.0


@pytest.mark.parametrize("kind", [Kind.THRUST_BALL, Kind.THRUST_ROLLER])
@pytest.mark.parametrize("alpha", [45.0, 60.0, 80.0])
def test_thrust_static_load(kind: Kind, alpha: float) -> None:
    """ISO 76:2006 §7.2, §8.2 (from memory): P0 = 2.3·Fr·tan α + Fa for thrust bearings, α < 90°."""
    sf = static_factors(kind, Arrangement.SINGLE, alpha)
    fr, fa = 1000.0, 5000.0
    p0, _ = equivalent_static_load(sf, fr, fa)
    assert p0 == pytest.approx(2.3 * fr * math.tan(math.radians(alpha)) + fa, rel=1e-12)


@pytest.mark.parametrize(("alpha", "y0"), ANGULAR_Y0)
def test_angular_contact_static_factors(alpha: int, y0: float) -> None:
    """ISO 76:2006 (from memory; 40° handbook): single row X0 = 0.5 and Y0 as printed; pairs
    X0 = 1 and Y0 twice the single row's; P0 ≥ Fr."""
    single = static_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, float(alpha))
    assert (single.x0, single.y0) == (0.5, y0)
    for arrangement in (Arrangement.BACK_TO_BACK, Arrangement.FACE_TO_FACE):
        pair = static_factors(Kind.ANGULAR_CONTACT, arrangement, float(alpha))
        assert (pair.x0, pair.y0) == (1.0, pytest.approx(2 * y0, abs=1e-12))


@pytest.mark.parametrize("alpha", [8.0, 12.0, 15.0, 25.0])
def test_angled_static_closed_forms(alpha: float) -> None:
    """ISO 76:2006 (from memory): self-aligning ball X0 = 1, Y0 = 0.44·cot α; radial roller α ≠ 0
    single row X0 = 0.5, Y0 = 0.22·cot α, double row X0 = 1, Y0 = 0.44·cot α; cylindrical P0 = Fr."""
    cot = 1.0 / math.tan(math.radians(alpha))
    ball = static_factors(Kind.SELF_ALIGNING, Arrangement.DOUBLE_ROW, alpha)
    single = static_factors(Kind.TAPERED, Arrangement.SINGLE, alpha)
    double = static_factors(Kind.SPHERICAL, Arrangement.DOUBLE_ROW, alpha)
    pair = static_factors(Kind.TAPERED, Arrangement.BACK_TO_BACK, alpha)
    assert (ball.x0, ball.y0) == pytest.approx((1.0, 0.44 * cot), rel=1e-12)
    assert (single.x0, single.y0) == pytest.approx((0.5, 0.22 * cot), rel=1e-12)
    assert (double.x0, double.y0) == pytest.approx((1.0, 0.44 * cot), rel=1e-12)
    assert (pair.x0, pair.y0) == pytest.approx((1.0, 0.44 * cot), rel=1e-12)
    cylindrical = static_factors(Kind.CYLINDRICAL, Arrangement.SINGLE, 0.0)
    assert equivalent_static_load(cylindrical, 4000.0, 1000.0)[0] == 4000.0


@pytest.mark.parametrize("kind", [Kind.DEEP_GROOVE, Kind.ANGULAR_CONTACT, Kind.TAPERED,
                                  Kind.SPHERICAL, Kind.CYLINDRICAL])
def test_rotation_factor_multiplies_fr_of_radial_bearings(kind: Kind) -> None:
    """V = 1.2 with the outer ring rotating (common practice: older practice; ISO 281:2007 no
    longer carries it), on Fr in the branch test and in X·V·Fr — cylindrical P = V·Fr too."""
    assert rotation_factor(kind, True) == 1.2 and rotation_factor(kind, False) == 1.0
    alpha = {Kind.ANGULAR_CONTACT: 40.0, Kind.TAPERED: 12.0, Kind.SPHERICAL: 10.0}.get(kind, 0.0)
    f = dynamic_factors(kind, Arrangement.SINGLE if kind is not Kind.SPHERICAL
                        else Arrangement.DOUBLE_ROW, alpha, fa=500.0, c0=20000.0)
    p, ratio, high, _ = dynamic_load(kind, f, 10000.0, 500.0, 1.2)
    assert ratio == pytest.approx(500.0 / 12000.0)
    x = f.x_high if high else f.x_low
    y = f.y_high if high else f.y_low
    assert p == pytest.approx(x * 1.2 * 10000.0 + y * 500.0)
    if kind is Kind.CYLINDRICAL:
        assert p == pytest.approx(12000.0)


@pytest.mark.parametrize("kind", [Kind.SELF_ALIGNING, Kind.THRUST_BALL, Kind.THRUST_ROLLER])
def test_rotation_factor_is_one_where_it_does_not_apply(kind: Kind) -> None:
    """Older practice kept V = 1 for self-aligning ball bearings (from memory); thrust bearings
    have no rotation factor."""
    assert rotation_factor(kind, True) == 1.0


@pytest.mark.parametrize(("alpha", "refused"), [(44.0, True), (46.0, False), (89.0, False)])
def test_thrust_roller_angle_range(alpha: float, refused: bool) -> None:
    """A thrust roller bearing with α ≠ 90° has 45° ≤ α < 90° (ISO 281:2007 §8, from memory)."""
    if refused:
        with pytest.raises(InputError):
            dynamic_factors(Kind.THRUST_ROLLER, Arrangement.SINGLE, alpha)
    else:
        assert dynamic_factors(Kind.THRUST_ROLLER, Arrangement.SINGLE, alpha).y_high == 1.0


@pytest.mark.parametrize(("kind", "clause"), [
    (Kind.DEEP_GROOVE, 5), (Kind.ANGULAR_CONTACT, 5), (Kind.SELF_ALIGNING, 5), (Kind.THRUST_BALL, 6),
    (Kind.CYLINDRICAL, 7), (Kind.TAPERED, 7), (Kind.SPHERICAL, 7), (Kind.THRUST_ROLLER, 8)])
def test_clauses_cited(kind: Kind, clause: int) -> None:
    """ISO 281:2007 clause per family (from memory): radial ball 5, thrust ball 6, radial roller 7,
    thrust roller 8; §n.2 the equivalent load, §n.3 the life; ISO 76:2006 the same numbering."""
    assert load_clause(kind) == f"ISO 281:2007 §{clause}.2"
    assert life_clause(kind) == f"ISO 281:2007 §{clause}.3"
    assert static_clause(kind) == f"ISO 76:2006 §{clause}.2"
