"""Basic load ratings from internal geometry: ISO 281:2007 (dynamic) and ISO 76:2006 (static).

Every expected rating below is written out by hand with ``math`` from the closed forms of
/work/shared/REFERENCE.md §6, not by calling the module.  Provenance follows that sheet: the radial
ball two-formula structure and the thrust-ball fc digits are [handbook: Machinery's Handbook 31st ed.];
the other table digits, the roller and static formulas are [memory]; the thrust dynamic formulas and
the thrust-roller fc table are not in REFERENCE.md at all and are recalled — every check resting on a
recalled value is marked ``from memory``.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from workbench.engine import rating_tables as tables
from workbench.engine.record import InputError
from workbench.engine.ratings import (
    BearingGeometry,
    dynamic_rating_radial_ball,
    dynamic_rating_radial_roller,
    dynamic_rating_thrust_ball,
    dynamic_rating_thrust_roller,
    rate_bearing,
    static_rating_radial_ball,
    static_rating_radial_roller,
    static_rating_thrust_ball,
    static_rating_thrust_roller,
    table_factor,
)


def cosd(angle: float) -> float:
    return math.cos(math.radians(angle))


def sind(angle: float) -> float:
    return math.sin(math.radians(angle))


def parse(pairs: str) -> tuple[tuple[float, ...], tuple[float, ...]]:
    """'0.01 29.1, 0.02 35.8, …' → (xs, ys), exactly as the reference sheet writes them."""
    rows = [item.split() for item in pairs.split(",")]
    return tuple(float(x) for x, _ in rows), tuple(float(y) for _, y in rows)


# ---------------------------------------------------------------------------------------------
# The tables, transcribed a second time straight from REFERENCE.md §6.

# REFERENCE.md §6, ISO 281 radial ball fc [from memory].
RADIAL_BALL_FC = parse(
    "0.01 29.1, 0.02 35.8, 0.03 40.3, 0.04 43.8, 0.05 46.7, 0.06 49.1, 0.07 51.1, 0.08 52.8, "
    "0.09 54.3, 0.10 55.5, 0.12 57.5, 0.14 58.8, 0.16 59.6, 0.18 59.9, 0.20 59.9, 0.22 59.6, "
    "0.24 59.0, 0.26 58.2, 0.28 57.1, 0.30 56.0, 0.32 54.6, 0.34 53.2, 0.36 51.7, 0.38 50.0, 0.40 48.4"
)
# REFERENCE.md §6, ISO 281 radial roller fc [from memory].
RADIAL_ROLLER_FC = parse(
    "0.01 52.1, 0.02 60.8, 0.03 66.5, 0.04 70.7, 0.05 74.1, 0.06 76.9, 0.07 79.2, 0.08 81.2, "
    "0.09 82.8, 0.10 84.2, 0.12 86.4, 0.14 87.7, 0.16 88.5, 0.18 88.8, 0.20 88.7, 0.22 88.2, "
    "0.24 87.5, 0.26 86.4, 0.28 85.2, 0.30 83.8"
)
# REFERENCE.md §6, thrust ball fc α = 90° [handbook: Machinery's Handbook 31st ed., Table 29].
THRUST_BALL_FC_90 = parse(
    "0.01 36.7, 0.02 45.2, 0.03 51.1, 0.04 55.7, 0.05 59.5, 0.06 62.9, 0.07 65.8, 0.08 68.5, "
    "0.09 71.0, 0.10 73.3, 0.12 77.4, 0.14 81.1, 0.16 84.4, 0.18 87.4, 0.20 90.2"
)
# Not in REFERENCE.md: ISO 281 thrust roller fc α = 90°, from memory.
THRUST_ROLLER_FC_90 = parse(
    "0.01 105.4, 0.02 122.9, 0.03 134.5, 0.04 143.4, 0.05 150.7, 0.06 156.9, 0.07 162.4, "
    "0.08 167.2, 0.09 171.7, 0.10 175.7, 0.12 183.0, 0.14 189.4, 0.16 195.1, 0.18 200.3, "
    "0.20 205.0, 0.22 209.4, 0.24 213.5, 0.26 217.3, 0.28 220.9, 0.30 224.3"
)
# REFERENCE.md §6, ISO 76 deep-groove f0 [from memory].
DEEP_GROOVE_F0 = parse(
    "0.00 14.7, 0.02 15.1, 0.04 15.5, 0.06 15.9, 0.08 16.3, 0.10 16.4, 0.12 15.9, 0.14 15.4, "
    "0.16 14.9, 0.18 14.4, 0.20 14.0, 0.22 13.5, 0.24 13.0, 0.26 12.5, 0.28 12.1, 0.30 11.6, "
    "0.32 11.2, 0.34 10.7, 0.36 10.3, 0.38 9.8, 0.40 9.4"
)

TABLES = [
    pytest.param(tables.FC_RADIAL_BALL, RADIAL_BALL_FC, id="fc-radial-ball (from memory)"),
    pytest.param(tables.FC_RADIAL_ROLLER, RADIAL_ROLLER_FC, id="fc-radial-roller (from memory)"),
    pytest.param(tables.FC_THRUST_BALL_90, THRUST_BALL_FC_90, id="fc-thrust-ball-90 (handbook)"),
    pytest.param(tables.FC_THRUST_ROLLER_90, THRUST_ROLLER_FC_90, id="fc-thrust-roller-90 (from memory)"),
    pytest.param(tables.F0_DEEP_GROOVE, DEEP_GROOVE_F0, id="f0-deep-groove (from memory)"),
]


@pytest.mark.parametrize(("table", "reference"), TABLES)
def test_table_matches_reference_transcription(table, reference):
    # REFERENCE.md §6 digits (provenance per table id).
    assert table.xs == reference[0]
    assert table.ys == reference[1]
    assert all(b > a for a, b in zip(table.xs, table.xs[1:]))


@pytest.mark.parametrize(("table", "reference"), TABLES)
def test_tabulated_points_reproduce_exactly(table, reference):
    # REFERENCE.md §6 digits (provenance per table id): a tabulated argument returns its entry exactly.
    xs, ys = reference
    for x, y in zip(xs, ys):
        assert table_factor(table, x) == y
    assert list(table_factor(table, np.array(xs))) == list(ys)


@pytest.mark.parametrize(("table", "reference"), TABLES)
def test_midpoints_interpolate_linearly(table, reference):
    # ISO 281 / ISO 76: intermediate values by linear interpolation (the standards' instruction,
    # from memory) — the midpoint of two rows is the mean of their entries.
    xs, ys = reference
    for (x0, y0), (x1, y1) in zip(zip(xs, ys), zip(xs[1:], ys[1:])):
        assert table_factor(table, (x0 + x1) / 2) == pytest.approx((y0 + y1) / 2, abs=1e-12)
        quarter = x0 + 0.25 * (x1 - x0)
        assert table_factor(table, quarter) == pytest.approx(y0 + 0.25 * (y1 - y0), abs=1e-12)


def test_radial_roller_fc_follows_lundberg_palmgren_closed_form():
    # from memory: ISO/TR 1281-1 closed form behind ISO 281's radial-roller fc,
    # fc = 207.9·λν·γ^(2/9)·(1−γ)^(29/27)/(1+γ)^(1/4)·[1 + (1.04·((1−γ)/(1+γ))^(143/108))^(9/2)]^(−2/9),
    # λν = 0.83.  Every tabulated digit agrees to its rounding (±0.05).
    for gamma, fc in zip(*RADIAL_ROLLER_FC):
        ratio = (1 - gamma) / (1 + gamma)
        closed = (207.9 * 0.83 * gamma ** (2 / 9) * (1 - gamma) ** (29 / 27) / (1 + gamma) ** 0.25
                  * (1 + (1.04 * ratio ** (143 / 108)) ** 4.5) ** (-2 / 9))
        assert abs(closed - fc) <= 0.05 + 1e-9, gamma


@pytest.mark.parametrize(
    ("reference", "exponent"),
    [
        pytest.param(THRUST_BALL_FC_90, 0.3, id="thrust ball, γ^0.3"),
        pytest.param(THRUST_ROLLER_FC_90, 2 / 9, id="thrust roller, γ^(2/9)"),
    ],
)
def test_right_angle_thrust_fc_is_a_power_of_gamma(reference, exponent):
    # from memory: at α = 90° the Lundberg–Palmgren fc (ISO/TR 1281-1) reduces to a constant times
    # γ^0.3 (ball) or γ^(2/9) (roller); the tabulated digits fit that to their rounding.
    xs, ys = reference
    scale = sum(y / x**exponent for x, y in zip(xs, ys)) / len(xs)
    assert max(abs(y - scale * x**exponent) for x, y in zip(xs, ys)) < 0.06


def test_large_ball_factor_joins_the_two_branches():
    # Closed form: 3.647 is 25.4^0.4 rounded, so the Dw ≤ 25.4 and Dw > 25.4 formulas meet.
    assert tables.LARGE_BALL_FACTOR == pytest.approx(25.4**0.4, abs=5e-4)
    below = dynamic_rating_radial_ball(1, 10, 25.4, 0, 254.0)
    above = dynamic_rating_radial_ball(1, 10, 25.4 * (1 + 1e-12), 0, 254.0)
    assert above == pytest.approx(below, rel=5e-5)


# ---------------------------------------------------------------------------------------------
# Dynamic ratings against the closed forms written out here


def test_radial_ball_small_ball_at_a_table_point():
    # ISO 281 §6 radial ball, Dw ≤ 25.4 mm (REFERENCE.md §6, from memory for fc 55.5 at γ = 0.10).
    expected = 1.3 * 55.5 * (1 * cosd(0)) ** 0.7 * 8 ** (2 / 3) * 7.5**1.8
    assert dynamic_rating_radial_ball(1, 8, 7.5, 0, 75.0) == pytest.approx(expected, rel=1e-12)


def test_radial_ball_at_exactly_25_4_mm_uses_the_small_ball_branch():
    # ISO 281 §6 radial ball: Dw = 25.4 mm is still the Dw^1.8 branch (fc 55.5 at γ = 0.10, from memory).
    expected = 1.3 * 55.5 * 10 ** (2 / 3) * 25.4**1.8
    assert dynamic_rating_radial_ball(1, 10, 25.4, 0, 254.0) == pytest.approx(expected, rel=1e-12)


def test_radial_ball_just_above_25_4_mm_uses_the_large_ball_branch():
    # ISO 281 §6 radial ball, Dw > 25.4 mm: Cr = 3.647·bm·fc·(i·cos α)^0.7·Z^(2/3)·Dw^1.4 (REFERENCE.md
    # §6 [handbook: Machinery's Handbook 31st ed., the switch at 25.4 mm]; fc 55.5 at γ = 0.10, from
    # memory). At Dw = 26 mm the small-ball formula would read 0.9 % higher (26^0.4 = 3.68).
    expected = 3.647 * 1.3 * 55.5 * 10 ** (2 / 3) * 26.0**1.4
    assert dynamic_rating_radial_ball(1, 10, 26.0, 0, 260.0) == pytest.approx(expected, rel=1e-12)


def test_radial_ball_large_ball_branch():
    # ISO 281 §6 radial ball, Dw > 25.4 mm: 3.647·bm·fc·(i·cos α)^0.7·Z^(2/3)·Dw^1.4
    # (REFERENCE.md §6 [handbook]; fc 55.5 at γ = 0.10 from memory).
    expected = 3.647 * 1.3 * 55.5 * 12 ** (2 / 3) * 30.0**1.4
    assert dynamic_rating_radial_ball(1, 12, 30.0, 0, 300.0) == pytest.approx(expected, rel=1e-12)


def test_angular_contact_double_row_at_a_midpoint():
    # ISO 281 §6 radial ball, i = 2, α = 40°; γ = 0.15 sits halfway between 0.14 (58.8) and
    # 0.16 (59.6), so fc = 59.2 (digits from memory).
    dpw = 12.0 * cosd(40) / 0.15
    expected = 1.3 * 59.2 * (2 * cosd(40)) ** 0.7 * 14 ** (2 / 3) * 12.0**1.8
    assert dynamic_rating_radial_ball(2, 14, 12.0, 40, dpw) == pytest.approx(expected, rel=1e-9)


def test_radial_roller_cylindrical_and_tapered():
    # ISO 281 radial roller: bm·fc·(i·Lwe·cos α)^(7/9)·Z^(3/4)·Dwe^(29/27) (REFERENCE.md §6 [handbook]
    # for the form; fc 84.2 at 0.10 and 88.5 at 0.16 from memory).
    cylindrical = 1.1 * 84.2 * (1 * 10.0 * cosd(0)) ** (7 / 9) * 14**0.75 * 10.0 ** (29 / 27)
    assert dynamic_rating_radial_roller(1, 14, 10.0, 10.0, 0, 100.0) == pytest.approx(cylindrical, rel=1e-12)
    dpw = 8.0 * cosd(15) / 0.16
    tapered = 1.1 * 88.5 * (2 * 14.0 * cosd(15)) ** (7 / 9) * 17**0.75 * 8.0 ** (29 / 27)
    assert dynamic_rating_radial_roller(2, 17, 8.0, 14.0, 15, dpw) == pytest.approx(tapered, rel=1e-9)


def test_thrust_ball_right_angle_both_branches():
    # from memory: ISO 281 thrust ball, α = 90°: Ca = bm·fc·Z^(2/3)·Dw^1.8 (Dw ≤ 25.4 mm),
    # 3.647·bm·fc·Z^(2/3)·Dw^1.4 above; fc 73.3 at Dw/Dpw = 0.10 [handbook].
    small = 1.3 * 73.3 * 15 ** (2 / 3) * 8.0**1.8
    assert dynamic_rating_thrust_ball(15, 8.0, 90, 80.0) == pytest.approx(small, rel=1e-12)
    large = 3.647 * 1.3 * 73.3 * 18 ** (2 / 3) * 30.0**1.4
    assert dynamic_rating_thrust_ball(18, 30.0, 90, 300.0) == pytest.approx(large, rel=1e-12)


def test_thrust_roller_right_angle():
    # from memory: ISO 281 thrust roller, α = 90°: Ca = bm·fc·Lwe^(7/9)·Z^(3/4)·Dwe^(29/27),
    # bm = 1.0, fc 175.7 at Dwe/Dpw = 0.10.
    expected = 1.0 * 175.7 * 8.0 ** (7 / 9) * 20**0.75 * 8.0 ** (29 / 27)
    assert dynamic_rating_thrust_roller(20, 8.0, 8.0, 90, 80.0) == pytest.approx(expected, rel=1e-12)


# ---------------------------------------------------------------------------------------------
# Static ratings (ISO 76)


def test_static_radial_ball_from_table_and_given():
    # ISO 76 radial ball: C0r = f0·i·Z·Dw²·cos α (REFERENCE.md §6, from memory; f0 16.4 at γ = 0.10).
    assert static_rating_radial_ball(1, 8, 7.5, 0, 75.0) == pytest.approx(16.4 * 8 * 7.5**2, rel=1e-12)
    expected = 13.0 * 2 * 14 * 12.0**2 * cosd(40)
    assert static_rating_radial_ball(2, 14, 12.0, 40, 100.0, f0=13.0) == pytest.approx(expected, rel=1e-12)


def test_static_radial_roller():
    # ISO 76 radial roller: C0r = 44·(1 − Dwe·cos α/Dpw)·i·Z·Lwe·Dwe·cos α (REFERENCE.md §6, from memory).
    expected = 44 * (1 - 10.0 / 100.0) * 1 * 14 * 10.0 * 10.0
    assert static_rating_radial_roller(1, 14, 10.0, 10.0, 0, 100.0) == pytest.approx(expected, rel=1e-12)
    gamma = 8.0 * cosd(15) / 90.0
    expected = 44 * (1 - gamma) * 2 * 17 * 14.0 * 8.0 * cosd(15)
    assert static_rating_radial_roller(2, 17, 8.0, 14.0, 15, 90.0) == pytest.approx(expected, rel=1e-12)


def test_static_thrust_ball_and_roller():
    # ISO 76 thrust: C0a = f0·Z·Dw²·sin α; C0a = 220·(1 − Dwe·cos α/Dpw)·Z·Lwe·Dwe·sin α
    # (REFERENCE.md §6, from memory).
    assert static_rating_thrust_ball(15, 8.0, 90, f0=60.0) == pytest.approx(60.0 * 15 * 64.0, rel=1e-12)
    assert static_rating_thrust_ball(15, 8.0, 60, f0=55.0) == pytest.approx(55.0 * 15 * 64.0 * sind(60))
    assert static_rating_thrust_roller(20, 8.0, 8.0, 90, 80.0) == pytest.approx(220 * 20 * 8.0 * 8.0)
    expected = 220 * (1 - 8.0 * cosd(60) / 80.0) * 20 * 10.0 * 8.0 * sind(60)
    assert static_rating_thrust_roller(20, 8.0, 10.0, 60, 80.0) == pytest.approx(expected, rel=1e-12)


# ---------------------------------------------------------------------------------------------
# rate_bearing: the derivation record


def test_deep_groove_derivation_steps_and_results():
    # REFERENCE.md §6 (from memory: fc 55.5, f0 16.4 at γ = 0.10; bm 1.3).
    record = rate_bearing(BearingGeometry("deep-groove", 1, 8, 7.5, 0, 75.0))
    assert [s.key for s in record.steps] == ["gamma", "fc", "bm", "C", "f0", "C0"]
    assert set(record.results) == {"gamma", "fc", "C", "f0", "C0"}
    assert record.results["gamma"] == pytest.approx(0.1)
    assert record.results["fc"] == pytest.approx(55.5)
    assert record.results["f0"] == pytest.approx(16.4)
    assert record.results["C"] == pytest.approx(1.3 * 55.5 * 8 ** (2 / 3) * 7.5**1.8, rel=1e-12)
    assert record.results["C0"] == pytest.approx(16.4 * 8 * 7.5**2, rel=1e-12)
    assert record.step("C").unit == "N" and record.step("C0").unit == "N"
    assert record.warnings == []
    for step in record.steps:
        assert step.source and step.formula and step.label
        assert isinstance(step.substituted, str)
    assert record.as_dict()["results"]["C"] == record.results["C"]


@pytest.mark.parametrize(
    ("geometry", "dynamic", "static"),
    [
        pytest.param(BearingGeometry("angular-contact", 2, 14, 12.0, 40, 90.0, f0=13.0),
                     lambda: dynamic_rating_radial_ball(2, 14, 12.0, 40, 90.0),
                     lambda: static_rating_radial_ball(2, 14, 12.0, 40, 90.0, f0=13.0), id="angular"),
        pytest.param(BearingGeometry("deep-groove", 1, 9, 30.0, 0, 200.0),
                     lambda: dynamic_rating_radial_ball(1, 9, 30.0, 0, 200.0),
                     lambda: static_rating_radial_ball(1, 9, 30.0, 0, 200.0), id="large-ball"),
        pytest.param(BearingGeometry("spherical", 2, 16, 12.0, 10, 110.0, lwe=11.0),
                     lambda: dynamic_rating_radial_roller(2, 16, 12.0, 11.0, 10, 110.0, bm=1.15),
                     lambda: static_rating_radial_roller(2, 16, 12.0, 11.0, 10, 110.0), id="spherical"),
        pytest.param(BearingGeometry("thrust-ball", 1, 15, 8.0, 90, 60.0, f0=60.0),
                     lambda: dynamic_rating_thrust_ball(15, 8.0, 90, 60.0),
                     lambda: static_rating_thrust_ball(15, 8.0, 90, f0=60.0), id="thrust-ball"),
        pytest.param(BearingGeometry("thrust-roller", 1, 20, 8.0, 90, 80.0, lwe=8.0),
                     lambda: dynamic_rating_thrust_roller(20, 8.0, 8.0, 90, 80.0),
                     lambda: static_rating_thrust_roller(20, 8.0, 8.0, 90, 80.0), id="thrust-roller"),
    ],
)
def test_derivation_agrees_with_the_stand_alone_functions(geometry, dynamic, static):
    # Consistency: one copy of each formula serves both paths (ISO 281 Table 1 bm, from memory).
    record = rate_bearing(geometry)
    assert record.results["C"] == pytest.approx(dynamic(), rel=1e-12)
    assert record.results["C0"] == pytest.approx(static(), rel=1e-12)
    assert record.warnings == []


def test_spherical_roller_closed_form_with_its_bm():
    # ISO 281 radial roller with bm = 1.15 for spherical rollers (REFERENCE.md §6, from memory);
    # γ = 0.10 → fc 84.2; static 44·(1 − γ)·i·Z·Lwe·Dwe·cos α.
    dpw = 12.0 * cosd(10) / 0.10
    record = rate_bearing(BearingGeometry("spherical", 2, 16, 12.0, 10, dpw, lwe=11.0))
    expected = 1.15 * 84.2 * (2 * 11.0 * cosd(10)) ** (7 / 9) * 16**0.75 * 12.0 ** (29 / 27)
    assert record.results["C"] == pytest.approx(expected, rel=1e-9)
    assert record.results["f0"] == pytest.approx(44 * 0.9, rel=1e-9)
    assert record.results["C0"] == pytest.approx(44 * 0.9 * 2 * 16 * 11.0 * 12.0 * cosd(10), rel=1e-9)


def test_bm_override_is_used_and_marked_given():
    record = rate_bearing(BearingGeometry("cylindrical", 1, 14, 10.0, 0, 100.0, lwe=10.0, bm=1.0))
    assert record.step("bm").value == 1.0 and record.step("bm").source == "given"
    # ISO 281 radial roller closed form, fc 84.2 at γ = 0.10 (from memory).
    expected = 1.0 * 84.2 * 10.0 ** (7 / 9) * 14**0.75 * 10.0 ** (29 / 27)
    assert record.results["C"] == pytest.approx(expected, rel=1e-12)


def test_gamma_outside_table_is_clamped_with_a_warning():
    # Dw·cos α/Dpw = 2/300 < 0.01: fc held at the first entry, 29.1 (from memory), and said so.
    record = rate_bearing(BearingGeometry("deep-groove", 1, 9, 2.0, 0, 300.0))
    fc_step = record.step("fc")
    assert fc_step.value == 29.1
    assert fc_step.warning is not None and "not extrapolated" in fc_step.warning
    assert fc_step.warning in record.warnings
    assert record.results["C"] == pytest.approx(1.3 * 29.1 * 9 ** (2 / 3) * 2.0**1.8, rel=1e-12)
    # The deep-groove f0 table starts at 0.00, so γ = 0.0067 is inside it: no warning there.
    assert record.step("f0").warning is None
    # Above the top of the table: 0.45 > 0.40 → 48.4, with a warning.
    high = rate_bearing(BearingGeometry("deep-groove", 1, 6, 18.0, 0, 40.0))
    assert high.step("fc").value == 48.4 and high.step("fc").warning is not None


def test_stand_alone_functions_refuse_gamma_outside_the_table():
    with pytest.raises(InputError) as caught:
        dynamic_rating_radial_ball(1, 6, 18.0, 0, 40.0)
    assert caught.value.field == "dw"
    with pytest.raises(InputError) as caught:
        dynamic_rating_radial_roller(1, 10, 14.0, 14.0, 0, 40.0)
    assert caught.value.field == "dwe"


@pytest.mark.parametrize(
    ("geometry", "field"),
    [
        (BearingGeometry("self-aligning", 2, 14, 8.0, 12, 60.0), "kind"),
        (BearingGeometry("four-point", 1, 14, 8.0, 35, 60.0), "kind"),
        (BearingGeometry("deep-groove", 2, 14, 8.0, 0, 60.0), "i"),
        (BearingGeometry("deep-groove", 0, 14, 8.0, 0, 60.0), "i"),
        (BearingGeometry("deep-groove", 1, 0, 8.0, 0, 60.0), "z"),
        (BearingGeometry("deep-groove", 1, 9, float("nan"), 0, 60.0), "dw"),
        (BearingGeometry("deep-groove", 1, 9, 8.0, 0, -60.0), "dpw"),
        (BearingGeometry("deep-groove", 1, 9, 8.0, 0, 60.0, bm=0.0), "bm"),
        (BearingGeometry("deep-groove", 1, 9, 8.0, 0, 60.0, lwe=8.0), "lwe"),
        (BearingGeometry("deep-groove", 1, 9, 8.0, 60, 60.0), "alpha_deg"),
        (BearingGeometry("angular-contact", 1, 9, 8.0, 40, 60.0), "f0"),
        (BearingGeometry("cylindrical", 1, 14, 10.0, 0, 100.0), "lwe"),
        (BearingGeometry("cylindrical", 1, 14, 10.0, 0, 100.0, lwe=10.0, f0=15.0), "f0"),
        (BearingGeometry("thrust-ball", 1, 15, 8.0, 60, 60.0, f0=60.0), "alpha_deg"),
        (BearingGeometry("thrust-ball", 1, 15, 8.0, 90, 60.0), "f0"),
        (BearingGeometry("thrust-roller", 2, 20, 8.0, 90, 80.0, lwe=8.0), "i"),
        (BearingGeometry("thrust-roller", 1, 20, 8.0, 75, 80.0, lwe=8.0), "alpha_deg"),
    ],
)
def test_rate_bearing_refuses_bad_geometry(geometry, field):
    with pytest.raises(InputError) as caught:
        rate_bearing(geometry)
    assert caught.value.field == field


@pytest.mark.parametrize(
    ("call", "field"),
    [
        (lambda: dynamic_rating_radial_ball(0, 9, 8.0, 0, 60.0), "i"),
        (lambda: dynamic_rating_radial_ball(1, 0, 8.0, 0, 60.0), "z"),
        (lambda: dynamic_rating_radial_ball(1, 8.5, 8.0, 0, 60.0), "z"),
        (lambda: dynamic_rating_radial_ball(1, 9, -8.0, 0, 60.0), "dw"),
        (lambda: dynamic_rating_radial_ball(1, 9, 0.0, 0, 60.0), "dw"),
        (lambda: dynamic_rating_radial_ball(1, 9, 8.0, 0, float("inf")), "dpw"),
        (lambda: dynamic_rating_radial_ball(1, 9, 8.0, float("nan"), 60.0), "alpha_deg"),
        (lambda: dynamic_rating_radial_ball(1, 9, 8.0, -5, 60.0), "alpha_deg"),
        (lambda: dynamic_rating_radial_ball(1, 9, 8.0, 0, 60.0, bm=-1.3), "bm"),
        (lambda: dynamic_rating_radial_ball(1, 9, 80.0, 0, 60.0), "dw"),
        (lambda: dynamic_rating_radial_ball(1, "nine", 8.0, 0, 60.0), "z"),
        (lambda: dynamic_rating_radial_ball(1, np.array([9, 0]), 8.0, 0, 60.0), "z"),
        (lambda: dynamic_rating_radial_ball(1, 9, np.array([8.0, np.nan]), 0, 60.0), "dw"),
        (lambda: dynamic_rating_radial_roller(1, 14, 10.0, 0.0, 0, 100.0), "lwe"),
        (lambda: dynamic_rating_radial_roller(1, 14, 10.0, 10.0, 0, 100.0, bm=float("nan")), "bm"),
        (lambda: dynamic_rating_thrust_ball(15, 8.0, 75, 80.0), "alpha_deg"),
        (lambda: dynamic_rating_thrust_ball(15, 8.0, 30, 80.0), "alpha_deg"),
        (lambda: dynamic_rating_thrust_roller(20, 8.0, 8.0, 60, 80.0), "alpha_deg"),
        (lambda: dynamic_rating_thrust_roller(0, 8.0, 8.0, 90, 80.0), "z"),
        (lambda: static_rating_radial_ball(1, 9, 8.0, 0, 60.0, f0=0.0), "f0"),
        (lambda: static_rating_radial_roller(1, 14, 10.0, 10.0, 50, 100.0), "alpha_deg"),
        (lambda: static_rating_radial_roller(1, 14, 10.0, 10.0, 45.5, 100.0), "alpha_deg"),
        (lambda: static_rating_thrust_ball(15, 8.0, 90), "f0"),
        (lambda: static_rating_thrust_ball(15, 8.0, 45, f0=60.0), "alpha_deg"),
        (lambda: static_rating_thrust_roller(20, 8.0, 8.0, 90, 0.0), "dpw"),
    ],
)
def test_functions_refuse_bad_input_naming_the_field(call, field):
    with pytest.raises(InputError) as caught:
        call()
    assert caught.value.field == field


def test_radial_and_thrust_meet_at_45_degrees():
    # ISO 281:2007 §3 (from memory): radial bearings 0° ≤ α ≤ 45°, thrust bearings 45° < α ≤ 90°
    assert static_rating_radial_roller(1, 14, 10.0, 10.0, 45.0, 100.0) > 0
    assert static_rating_thrust_ball(15, 8.0, 45.5, f0=60.0) > 0


# ---------------------------------------------------------------------------------------------
# Arrays give what a loop over scalars gives


def radial_cases(top_gamma: float) -> st.SearchStrategy:
    return st.lists(
        st.tuples(
            st.integers(1, 4),                      # i
            st.integers(3, 40),                     # Z
            st.floats(1.0, 45.0),                   # Dw: both sides of 25.4 mm
            st.floats(0.0, 45.0),                   # α
            st.floats(0.0101, top_gamma - 0.0001),  # γ, inside the table
        ),
        min_size=1,
        max_size=12,
    )


@settings(max_examples=60, deadline=None)
@given(radial_cases(0.40))
def test_radial_ball_array_matches_scalar_loop(cases):
    i, z, dw, alpha, gamma = (np.array(column, dtype=float) for column in zip(*cases))
    dpw = dw * np.cos(np.radians(alpha)) / gamma
    dynamic = dynamic_rating_radial_ball(i, z, dw, alpha, dpw)
    static = static_rating_radial_ball(i, z, dw, alpha, dpw)
    for k in range(len(cases)):
        args = (float(i[k]), float(z[k]), float(dw[k]), float(alpha[k]), float(dpw[k]))
        assert dynamic[k] == pytest.approx(dynamic_rating_radial_ball(*args), rel=1e-12)
        assert static[k] == pytest.approx(static_rating_radial_ball(*args), rel=1e-12)


@settings(max_examples=60, deadline=None)
@given(radial_cases(0.30), st.floats(0.5, 3.0))
def test_radial_roller_array_matches_scalar_loop(cases, length_ratio):
    i, z, dwe, alpha, gamma = (np.array(column, dtype=float) for column in zip(*cases))
    dpw = dwe * np.cos(np.radians(alpha)) / gamma
    lwe = dwe * length_ratio
    dynamic = dynamic_rating_radial_roller(i, z, dwe, lwe, alpha, dpw)
    static = static_rating_radial_roller(i, z, dwe, lwe, alpha, dpw)
    for k in range(len(cases)):
        args = (float(i[k]), float(z[k]), float(dwe[k]), float(lwe[k]), float(alpha[k]), float(dpw[k]))
        assert dynamic[k] == pytest.approx(dynamic_rating_radial_roller(*args), rel=1e-12)
        assert static[k] == pytest.approx(static_rating_radial_roller(*args), rel=1e-12)


@settings(max_examples=60, deadline=None)
@given(radial_cases(0.20))
def test_thrust_array_matches_scalar_loop(cases):
    _, z, dw, _, gamma = (np.array(column, dtype=float) for column in zip(*cases))
    dpw = dw / gamma
    alpha = np.full_like(dw, 90.0)
    ball = dynamic_rating_thrust_ball(z, dw, alpha, dpw)
    roller = dynamic_rating_thrust_roller(z, dw, dw, alpha, dpw)
    static_ball = static_rating_thrust_ball(z, dw, alpha, f0=np.full_like(dw, 60.0))
    static_roller = static_rating_thrust_roller(z, dw, dw, alpha, dpw)
    for k in range(len(cases)):
        zk, dk, pk = float(z[k]), float(dw[k]), float(dpw[k])
        assert ball[k] == pytest.approx(dynamic_rating_thrust_ball(zk, dk, 90.0, pk), rel=1e-12)
        assert roller[k] == pytest.approx(dynamic_rating_thrust_roller(zk, dk, dk, 90.0, pk), rel=1e-12)
        assert static_ball[k] == pytest.approx(static_rating_thrust_ball(zk, dk, 90.0, f0=60.0), rel=1e-12)
        assert static_roller[k] == pytest.approx(static_rating_thrust_roller(zk, dk, dk, 90.0, pk), rel=1e-12)
