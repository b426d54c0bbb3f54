"""Catalog selection: the vectorised sweep against the plain derive() loop, and closed forms."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from workbench.engine.derive import CaseInputs
from workbench.engine.life import aiso, contamination_factor, kappa_in_range
from workbench.engine.record import InputError
from workbench.engine.select import (
    REASON_BORE, REASON_KIND, REASON_LIFE, REASON_NO_AXIAL, REASON_NO_RADIAL, REASON_OUTER,
    REASON_SPEED, REASON_STATIC, REASON_WIDTH, BearingArrays, Filters, benchmark_select,
    load_direction_refusal, select, select_by_loop, unrated_reason,
)
from workbench.engine.kinds import Kind

NAN = math.nan

# kind, arrangement, contact angle (NaN = the kind's default), f0 given?
BEARING_SHAPES = (
    ("deep-groove", "single", NAN, True),
    ("deep-groove", "single", NAN, False),
    ("angular-contact", "single", 40.0, False),
    ("angular-contact", "back-to-back", 25.0, False),
    ("angular-contact", "single", 15.0, True),
    ("angular-contact", "single", 33.0, False),  # not tabulated: the engine refuses it
    ("cylindrical", "single", NAN, False),
    ("tapered", "single", 15.0, False),
    ("spherical", "double-row", 10.0, False),
    ("self-aligning", "double-row", 12.0, False),
    ("thrust-ball", "single", 90.0, False),
    ("thrust-roller", "single", 60.0, False),
    ("thrust-ball", "single", 45.0, False),
    ("thrust-ball", "single", 50.0, False),  # not tabulated: the engine refuses it
)


def table_of(rows: list[tuple]) -> BearingArrays:
    """A BearingArrays from (shape index, d, D, B, C, C0, f0, cu, speed limit, mass) rows."""
    shapes = [BEARING_SHAPES[r[0]] for r in rows]
    col = lambda k: np.array([r[k] for r in rows], dtype=float)  # noqa: E731
    return BearingArrays(
        kind=np.array([s[0] for s in shapes], dtype=str),
        arrangement=np.array([s[1] for s in shapes], dtype=str),
        d_mm=col(1), D_mm=col(2), B_mm=col(3), c_n=col(4), c0_n=col(5),
        f0=np.array([r[6] if s[3] else NAN for r, s in zip(rows, shapes)]),
        cu_n=col(7), contact_angle_deg=np.array([s[2] for s in shapes]),
        speed_limit_rpm=col(8), mass_kg=col(9),
    )


bearing_rows = st.tuples(
    st.integers(0, len(BEARING_SHAPES) - 1),
    st.floats(10.0, 100.0), st.floats(1.2, 2.5),  # d, D/d
    st.floats(5.0, 40.0),                          # B
    st.floats(2e3, 3e5), st.floats(0.4, 1.6),      # C, C0/C
    st.floats(10.0, 16.0),                         # f0
    st.one_of(st.just(NAN), st.floats(100.0, 5e3)),  # Cu
    st.one_of(st.just(NAN), st.floats(500.0, 20000.0)),  # speed limit
    st.one_of(st.just(NAN), st.floats(0.01, 5.0)),  # mass
).map(lambda r: (r[0], r[1], r[1] * r[2], r[3], r[4], r[4] * r[5], r[6], r[7], r[8], r[9]))


@st.composite
def load_cases(draw: st.DrawFn) -> CaseInputs:
    """Combined loads, speeds (0 included), both reliability models, and every lubrication path."""
    weibull = draw(st.booleans())
    lubrication = draw(st.sampled_from(["none", "nu", "vg", "bad-vg"]))
    clean = draw(st.sampled_from(["level", "ec", "none"]))
    return CaseInputs(
        fr=draw(st.sampled_from([0.0, 500.0, 3000.0, 12000.0])),
        fa=draw(st.sampled_from([0.0, 300.0, 2500.0, 9000.0])),
        speed=draw(st.sampled_from([0.0, 300.0, 1500.0, 3600.0])),
        af=draw(st.sampled_from([1.0, 1.3])),
        outer_ring_rotates=draw(st.booleans()),
        reliability=draw(st.floats(0.90, 0.999)),
        reliability_model="weibull" if weibull else "iso281",
        rating_life_mrev=draw(st.sampled_from([1.0, 90.0])),
        nu=draw(st.floats(5.0, 300.0)) if lubrication == "nu" else None,
        vg=(220.0 if lubrication == "vg" else 221.0) if lubrication in ("vg", "bad-vg") else None,
        temp=draw(st.floats(20.0, 110.0)) if lubrication in ("vg", "bad-vg") else None,
        cleanliness=draw(st.sampled_from(["normal", "high", "typical"])) if clean == "level" else None,
        ec=draw(st.floats(0.0, 1.0)) if clean == "ec" else None,
        static_duty=draw(st.sampled_from(["normal", "quiet", "shock"])),
        s0_min=draw(st.sampled_from([None, 0.8, 2.0])),
    )


def assert_same(vector, loop) -> None:
    """The sweep agrees with derive() per bearing and case: verdicts, margins, governing case."""
    assert vector.reason == loop.reason
    np.testing.assert_array_equal(vector.order, loop.order)
    np.testing.assert_allclose(vector.life_margin, loop.life_margin, rtol=1e-9)
    np.testing.assert_allclose(vector.min_s0, loop.min_s0, rtol=1e-12)
    np.testing.assert_array_equal(vector.governing_case, loop.governing_case)
    np.testing.assert_array_equal(vector.load_case, loop.load_case)
    assert vector.rejections == loop.rejections
    assert vector.notes == loop.notes and vector.examples.keys() == loop.examples.keys()


@settings(max_examples=50, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(st.lists(bearing_rows, min_size=1, max_size=8), st.lists(load_cases(), min_size=1, max_size=4),
       st.floats(100.0, 60000.0), st.sampled_from([None, 1.2]), st.booleans())
def test_select_agrees_with_the_derive_loop(rows, cases, target, s0_min, flanged) -> None:
    # reference: derive() called per bearing and case (select_by_loop) — the scalar engine itself
    bearings = table_of(rows)
    filters = Filters(flanged_cylindrical=flanged)
    assert_same(select(bearings, cases, target, s0_min, filters),
                select_by_loop(bearings, cases, target, s0_min, filters))


def test_catalog_case_takes_the_mean_diameter() -> None:
    # ISO 281:2007 §9.3.3 (from memory, REFERENCE.md §5): dm = (d + D)/2 for ν1; the maker's e
    # and Y of the case are cleared (a catalog row carries none).
    from workbench.engine.select import bearing_case

    bearings = table_of([(1, 40.0, 80.0, 18.0, 30000.0, 20000.0, 14.0, NAN, NAN, NAN)])
    case = bearing_case(CaseInputs(fr=3000.0, speed=1500.0, e_given=0.3, y_given=1.5), bearings, 0)
    assert case.dm == pytest.approx((40.0 + 80.0) / 2.0, rel=1e-12)
    assert (case.c, case.c0, case.e_given, case.y_given) == (30000.0, 20000.0, None, None)


def test_no_governing_case_without_a_speed() -> None:
    # At speed 0 there is no life in hours (L10h = 10⁶·L10/(60·n), ISO 281:2007 §5.3): no case
    # governs the life margin (case index −1, an integer like every other index) and the margin
    # is unbounded; the bearing still qualifies on static safety.
    bearings = table_of([(1, 40.0, 80.0, 18.0, 30000.0, 20000.0, 14.0, NAN, NAN, NAN)] * 2)
    for run in (select, select_by_loop):
        result = run(bearings, [CaseInputs(fr=3000.0, speed=0.0)], 5000.0)
        assert result.governing_case.tolist() == [-1, -1]
        assert result.governing_case.dtype.kind == "i"
        assert np.all(np.isinf(result.life_margin))


def test_closed_form_margin_for_pure_radial_load() -> None:
    # ISO 281:2007 §7: L10 = (C/P)^3 with P = Fr for Fa = 0 (X = 1); a1 = 1 at R = 90 %;
    # no lubrication data, so aISO = 1 — Lnm in hours is (C/Fr)^3·10⁶/(60·n), a closed form.
    bearings = table_of([(1, 40.0, 80.0, 18.0, 30000.0, 20000.0, 14.0, NAN, NAN, NAN)])
    cases = [CaseInputs(fr=3000.0, speed=1500.0), CaseInputs(fr=4000.0, speed=1000.0)]
    result = select(bearings, cases, 5000.0)
    hours = [(30000.0 / 3000.0) ** 3 * 1e6 / (60 * 1500.0), (30000.0 / 4000.0) ** 3 * 1e6 / (60 * 1000.0)]
    assert result.life_margin[0] == pytest.approx(min(hours) / 5000.0, rel=1e-12)
    assert result.governing_case[0] == 1
    assert result.min_s0[0] == pytest.approx(20000.0 / 4000.0, rel=1e-12)  # ISO 76: P0 = Fr


def test_filters_and_speed_limit_reject_in_order() -> None:
    rows = [
        (1, 40.0, 80.0, 18.0, 9e4, 6e4, 14.0, NAN, NAN, NAN),   # qualifies
        (6, 40.0, 80.0, 18.0, 9e4, 6e4, 14.0, NAN, NAN, NAN),   # kind
        (1, 20.0, 47.0, 14.0, 9e4, 6e4, 14.0, NAN, NAN, NAN),   # bore below
        (1, 40.0, 99.0, 18.0, 9e4, 6e4, 14.0, NAN, NAN, NAN),   # outer diameter
        (1, 40.0, 80.0, 30.0, 9e4, 6e4, 14.0, NAN, NAN, NAN),   # width
        (1, 40.0, 80.0, 18.0, 9e4, 6e4, 14.0, NAN, 1000.0, NAN),  # speed limit below 1500
        (1, 40.0, 80.0, 18.0, 9e4, 1e3, 14.0, NAN, NAN, NAN),   # static safety
        (1, 40.0, 80.0, 18.0, 5e3, 6e4, 14.0, NAN, NAN, NAN),   # life
    ]
    filters = Filters(kind="deep-groove", bore_min_mm=30.0, outer_max_mm=90.0, width_max_mm=20.0)
    cases = [CaseInputs(fr=3000.0, fa=500.0, speed=1500.0)]
    for run in (select, select_by_loop):
        result = run(table_of(rows), cases, 20000.0, None, filters)
        assert result.reason == ["", REASON_KIND, REASON_BORE, REASON_OUTER, REASON_WIDTH,
                                 REASON_SPEED, REASON_STATIC, REASON_LIFE]


def test_ranking_is_outer_diameter_then_width_then_mass() -> None:
    rows = [
        (1, 40.0, 90.0, 20.0, 9e4, 6e4, 14.0, NAN, NAN, 0.5),
        (1, 40.0, 80.0, 20.0, 9e4, 6e4, 14.0, NAN, NAN, 0.4),
        (1, 40.0, 80.0, 18.0, 9e4, 6e4, 14.0, NAN, NAN, NAN),
        (1, 40.0, 80.0, 18.0, 9e4, 6e4, 14.0, NAN, NAN, 0.3),
    ]
    result = select(table_of(rows), [CaseInputs(fr=3000.0, speed=1500.0)], 20000.0)
    assert result.order.tolist() == [3, 2, 1, 0]  # unknown mass after a known one
    assert [c.index for c in result.candidates] == [3, 2, 1, 0]


def test_a_bearing_the_engine_refuses_is_rejected_with_the_field() -> None:
    # ISO 281 Table 3 (from memory) tabulates angular-contact bearings at 15° … 45° in 5° steps;
    # 33° is none of them, so the engine refuses the angle
    rows = [(5, 30.0, 60.0, 15.0, 5e4, 8e4, 14.0, NAN, NAN, NAN)]
    cases = [CaseInputs(fr=1000.0, fa=2000.0, speed=1000.0)]
    for run in (select, select_by_loop):
        result = run(table_of(rows), cases, 1000.0)
        assert result.reason == [unrated_reason("contact_angle")]
        assert math.isnan(result.life_margin[0])


# ---- the position rule: a kind must carry the case's load in the direction it comes from ------
CYLINDRICAL = (6, 40.0, 80.0, 18.0, 9e4, 9e4, NAN, NAN, NAN, NAN)
DEEP_GROOVE = (1, 40.0, 80.0, 18.0, 9e4, 6e4, 14.0, NAN, NAN, NAN)
THRUST_BALL_90 = (10, 40.0, 80.0, 18.0, 9e4, 2e5, NAN, NAN, NAN, NAN)
THRUST_ROLLER_60 = (11, 40.0, 80.0, 18.0, 9e4, 2e5, NAN, NAN, NAN, NAN)
THRUST_BALL_45 = (12, 40.0, 80.0, 18.0, 9e4, 2e5, NAN, NAN, NAN, NAN)


def test_a_cylindrical_bearing_under_axial_load_qualifies_only_when_flanged() -> None:
    # ISO 281:2007 §7.2: a radial roller bearing with α = 0 is rated on P = Fr; the axial load goes
    # to flanges, which only some designs have — so under Fa > 0 it must not qualify by default
    rows = [CYLINDRICAL, DEEP_GROOVE]
    cases = [CaseInputs(fr=3000.0, speed=1500.0), CaseInputs(fr=3000.0, fa=800.0, speed=1500.0)]
    for run in (select, select_by_loop):
        result = run(table_of(rows), cases, 2000.0)
        assert result.reason == [REASON_NO_AXIAL, ""]
        assert list(result.load_case) == [1, -1]  # the second case is the one it cannot carry
        assert "flanges" in result.examples[REASON_NO_AXIAL]
        assert math.isnan(result.life_margin[0])
        flanged = run(table_of(rows), cases, 2000.0, None, Filters(flanged_cylindrical=True))
        assert flanged.reason == ["", ""]
        # P = Fr for both cases (§7.2), p = 10/3: the margin is the closed form's, Fa left out
        hours = (9e4 / 3000.0) ** (10 / 3) * 1e6 / (60 * 1500.0)
        assert flanged.life_margin[0] == pytest.approx(hours / 2000.0, rel=1e-12)
        assert "maker's data" in flanged.notes[0] and "800 N" in flanged.notes[0]
        assert 1 not in flanged.notes  # a deep-groove bearing's Fa is in its P: nothing left over
        assert flanged.candidates[[c.index for c in flanged.candidates].index(0)].note


def test_a_cylindrical_bearing_never_carries_a_purely_axial_load() -> None:
    cases = [CaseInputs(fr=0.0, fa=800.0, speed=1500.0)]
    for run in (select, select_by_loop):
        result = run(table_of([CYLINDRICAL]), cases, 2000.0, None, Filters(flanged_cylindrical=True))
        assert result.reason == [REASON_NO_AXIAL]


def test_a_pure_thrust_bearing_under_radial_load_does_not_qualify() -> None:
    # ISO 281:2007 §6.2: a thrust ball bearing with α = 90° is rated on P = Fa and takes no Fr
    rows = [THRUST_BALL_90, DEEP_GROOVE]
    for run in (select, select_by_loop):
        loaded = run(table_of(rows), [CaseInputs(fr=500.0, fa=3000.0, speed=1000.0)], 2000.0)
        assert loaded.reason[0] == REASON_NO_RADIAL and loaded.load_case[0] == 0
        assert "α = 90°" in loaded.examples[REASON_NO_RADIAL]
        axial = run(table_of(rows), [CaseInputs(fr=0.0, fa=3000.0, speed=1000.0)], 2000.0)
        # P = Fa (α = 90°), p = 3: L10 = (C/Fa)^3 10⁶ rev, closed form
        hours = (9e4 / 3000.0) ** 3 * 1e6 / (60 * 1000.0)
        assert axial.reason[0] == "" and axial.life_margin[0] == pytest.approx(hours / 2000.0)


@pytest.mark.parametrize("row, e", [
    (THRUST_ROLLER_60, 1.5 * math.tan(math.radians(60.0))),   # ISO 281:2007 §8.2: e = 1.5·tan α
    (THRUST_BALL_45, 1.25 * math.tan(math.radians(45.0))),    # ISO 281:2007 §6.2: e = 1.25·tan α
])
def test_an_angled_thrust_bearing_carries_radial_load_only_while_fa_over_fr_exceeds_e(row, e) -> None:
    fr = 1000.0
    for run in (select, select_by_loop):
        below = run(table_of([row]), [CaseInputs(fr=fr, fa=0.95 * e * fr, speed=500.0)], 100.0)
        assert below.reason == [REASON_NO_RADIAL] and "Fa/Fr > e" in below.examples[REASON_NO_RADIAL]
        above = run(table_of([row]), [CaseInputs(fr=fr, fa=1.05 * e * fr, speed=500.0)], 100.0)
        assert above.reason == [""]


def test_the_position_rule_names_the_load_each_kind_cannot_carry() -> None:
    assert load_direction_refusal(Kind.CYLINDRICAL, 0.0, 1000.0, 0.0) is None
    assert load_direction_refusal(Kind.CYLINDRICAL, 0.0, 1000.0, 1.0)[0] == REASON_NO_AXIAL
    assert load_direction_refusal(Kind.CYLINDRICAL, 0.0, 1000.0, 1.0, flanged_cylindrical=True) is None
    assert load_direction_refusal(Kind.THRUST_ROLLER, 90.0, 1.0, 1e4)[0] == REASON_NO_RADIAL
    assert load_direction_refusal(Kind.THRUST_ROLLER, 90.0, 0.0, 1e4) is None
    for kind in (Kind.DEEP_GROOVE, Kind.ANGULAR_CONTACT, Kind.TAPERED, Kind.SPHERICAL):
        assert load_direction_refusal(kind, 30.0, 1000.0, 5000.0) is None
        assert load_direction_refusal(kind, 30.0, 0.0, 5000.0) is None


def test_bad_request_is_an_input_error() -> None:
    bearings = table_of([(1, 40.0, 80.0, 18.0, 9e4, 6e4, 14.0, NAN, NAN, NAN)])
    with pytest.raises(InputError):
        select(bearings, [], 1000.0)
    with pytest.raises(InputError):
        select(bearings, [CaseInputs(fr=1.0)], 0.0)


def test_array_forms_of_the_shared_engine_pieces_match_their_scalar_forms() -> None:
    # the sweep relies on these taking arrays; each element must equal the scalar call
    dm = np.array([50.0, 99.9, 100.0, 180.0])
    for level in ("normal", "high", "slight"):
        assert contamination_factor(level, dm)[0].tolist() == [contamination_factor(level, float(x))[0] for x in dm]
    kappa = np.array([0.01, 0.1, 0.39, 0.4, 0.99, 1.0, 3.9, 4.0, 7.0])
    assert kappa_in_range(kappa).tolist() == [min(max(k, 0.1), 4.0) for k in kappa]
    load_ratio = np.linspace(0.0, 3.0, kappa.size)
    for roller in (False, True):
        clamped = kappa_in_range(kappa)
        expected = [aiso(float(k), float(r), roller) for k, r in zip(clamped, load_ratio)]
        assert aiso(clamped, load_ratio, roller).tolist() == expected


def test_benchmark_reports_its_figures() -> None:
    figures = benchmark_select(n_bearings=400, n_cases=4, repeats=2, loop_bearings=20)
    assert figures["select_ms"] > 0.0
    assert figures["select_ratio"] > 1.0  # the goals (≤ 30 ms, ≥ 50) are for the full-size run
