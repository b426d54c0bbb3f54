"""Reference rating life from the element loads (ISO/TS 16281 style) and the recorded analysis:
checked against ISO 281's catalogue life under ideal load, the power-mean definitions, slice
independence, and the shape of life against clearance."""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np
import pytest
from internal_examples import BALL, ROLLER

from workbench.engine.derive import CaseInputs, derive
from workbench.engine.internal import reference_life
from workbench.engine.internal.analysis import (
    analyse_internal,
    clearance_sweep,
    default_clearances,
    raceway_capacities,
)
from workbench.engine.internal.distribution import InternalInputs, NoEquilibrium
from workbench.engine.ratings import dynamic_rating_radial_ball, dynamic_rating_radial_roller



def test_equivalent_load_power_means() -> None:
    # Definitions (Lundberg–Palmgren): equal loads give that load; otherwise the power mean.
    loads = np.array([1000.0, 500.0, 0.0, 0.0])
    assert float(reference_life.equivalent_load(np.full(5, 700.0), rotating=True, ball=True)) == pytest.approx(700.0)
    assert float(reference_life.equivalent_load(loads, rotating=True, ball=True)) == pytest.approx(
        ((1000.0 ** 3 + 500.0 ** 3) / 4) ** (1 / 3))
    assert float(reference_life.equivalent_load(loads, rotating=False, ball=False)) == pytest.approx(
        ((1000.0 ** 4.5 + 500.0 ** 4.5) / 4) ** (1 / 4.5))


def test_weibull_series_rule() -> None:
    # L = (Σ Li^(−e))^(−1/e): two equal lives at e = 10/9 give L·2^(−9/10) (closed form).
    assert reference_life.combine_lives([100.0, 100.0], 10 / 9) == pytest.approx(100.0 * 2 ** -0.9)
    assert reference_life.combine_lives([100.0, math.inf], 10 / 9) == pytest.approx(100.0)


def test_ball_reference_life_near_iso281_under_ideal_load() -> None:
    # Under pure radial load near zero clearance the reference rating life reproduces the ISO 281
    # life within a few per cent (REFERENCE.md §8: a sanity check, not an identity).
    c = dynamic_rating_radial_ball(1, 9, 12.7, 0.0, 65.0)
    for fr in (2000.0, 5000.0, 9000.0):
        life = analyse_internal(replace(BALL, fr=fr)).results["L10r"]
        assert life == pytest.approx((c / fr) ** 3, rel=0.10)


def test_roller_reference_life_meets_iso281_near_rating_load() -> None:
    # Line contact has life exponent 4 (Lundberg–Palmgren) where ISO 281 uses 10/3 for the
    # whole bearing; the two meet at P = C, one million revolutions, where ISO 281's C is
    # defined (ISO 281 §7, from memory): within 5 % at Fr = C, and the reference life is the
    # longer one below it.
    c = dynamic_rating_radial_roller(1, 14, 11.0, 11.0, 0.0, 70.0)
    assert analyse_internal(replace(ROLLER, fr=c)).results["L10r"] == pytest.approx(1.0, rel=0.05)
    assert analyse_internal(replace(ROLLER, fr=0.5 * c)).results["L10r"] > 0.5 ** (-10 / 3)


def test_roller_life_does_not_depend_on_the_slice_count() -> None:
    # qck = Qc·ns^(−7/9) with equal slice loads gives (Qc/Qe)^4 whatever ns (closed form).
    lives = [analyse_internal(replace(ROLLER, slices=n)).results["L10r"] for n in (1, 10, 40)]
    assert lives[1] == pytest.approx(lives[0], rel=1e-9)
    assert lives[2] == pytest.approx(lives[0], rel=1e-9)


def test_misalignment_costs_life_of_straight_rollers() -> None:
    # A tilted straight roller carries its load at one end (edge loading): life falls
    # (Harris & Kotzalas; the reason rollers are crowned).
    # A crown spreads the load back toward the middle, so it loses a smaller share.
    straight = analyse_internal(ROLLER).results["L10r"]
    tilted = analyse_internal(replace(ROLLER, tilt=0.002)).results["L10r"]
    assert tilted < 0.8 * straight
    crowned = replace(ROLLER, profile="crowned")
    crowned_share = (analyse_internal(replace(crowned, tilt=0.002)).results["L10r"]
                     / analyse_internal(crowned).results["L10r"])
    assert crowned_share > tilted / straight


def test_raceway_capacity_formula() -> None:
    # Lundberg–Palmgren Qc written out (REFERENCE.md §8, from memory), bm = 1.3.
    gamma = 12.7 / 65.0
    expected = (1.3 * 98.1 * (1.04 / 0.04) ** 0.41 * (1 - gamma) ** 1.39 / (1 + gamma) ** (1 / 3)
                * gamma ** 0.3 * 12.7 ** 1.8 * 9 ** (-1 / 3))
    assert raceway_capacities(BALL)[0] == pytest.approx(expected, rel=1e-12)


def test_life_against_clearance_peaks_near_slight_preload() -> None:
    # Life against operating clearance (Harris & Kotzalas): longest at a slight preload, falling
    # with clearance as the load zone narrows and steeply with heavy preload.
    inputs = replace(BALL, fa=500.0)
    clearances = default_clearances(inputs, count=25)
    points = clearance_sweep(inputs, clearances)
    lives = [p.life for p in points]
    best = int(np.nanargmax(lives))
    assert points[best].clearance <= 0.0
    assert lives[0] < lives[best] and lives[-1] < lives[best]
    assert all(b <= a * (1 + 1e-9) for a, b in zip(lives[best:], lives[best + 1:]))


def test_analysis_records_the_steps_and_the_json_keys() -> None:
    inputs = InternalInputs("angular-contact", 12, 12.7, 65.0, alpha_deg=40.0, arrangement="back-to-back",
                            fr=4000.0, fa=1000.0, preload=1000.0, speed=3000.0, nu=20.0, ec=0.5)
    result = analyse_internal(inputs)
    out = result.as_dict()
    for key in ("elements", "q_max_N", "load_zone_deg", "epsilon", "displacement", "p_max_MPa",
                "stiffness", "L10r", "L10_iso281", "steps"):
        assert key in out
    assert set(out["displacement"]) == {"radial_mm", "axial_mm", "tilt_rad"}
    assert set(out["p_max_MPa"]) == {"inner", "outer"}
    assert set(out["elements"][0]) >= {"angle_deg", "load_N", "contact_angle_deg"}
    assert len(out["elements"]) == 24
    keys = {step["key"] for step in out["steps"]}
    assert {"K", "delta_r", "Q_max_A", "L10r", "aISO", "Lnmr", "L10_iso281", "Fa_rule_A"} <= keys
    # the rule and the equilibrium both balance the external thrust (shaft axial equilibrium)
    r = result.results
    assert r["Fa_rule_A"] - r["Fa_rule_B"] == pytest.approx(1000.0, rel=1e-9)
    assert result.rows[0].axial_load - result.rows[1].axial_load == pytest.approx(1000.0, rel=1e-8)


def test_iso281_life_beside_is_derive_of_the_same_case() -> None:
    # The life shown beside is the catalogue method itself (engine/derive.py) with C from the
    # same geometry: compared with derive() run here.
    result = analyse_internal(replace(BALL, fa=1000.0))
    r = result.results
    case = CaseInputs(kind="deep-groove", fr=5000.0, fa=1000.0, c=r["C"], c0=r["C0"],
                      f0=r["C0"] / (9 * 12.7 ** 2), contact_angle=0.0, dm=65.0)
    assert r["L10_iso281"] == pytest.approx(derive(case).results["L10"], rel=1e-12)


def test_steps_and_results_agree_without_steps() -> None:
    inputs = replace(BALL, fa=800.0, clearance=0.01)
    full = analyse_internal(inputs)
    bare = analyse_internal(inputs, keep_steps=False)
    assert full.results == bare.results
    assert bare.derivation.steps == []


def test_pressure_warns_above_the_iso76_reference() -> None:
    result = analyse_internal(replace(BALL, fr=28000.0))
    assert result.results["p_max_inner"] > 4200.0
    assert any("4200 MPa" in w for w in result.derivation.warnings)


def test_cylindrical_axial_load_is_left_to_the_ribs() -> None:
    result = analyse_internal(replace(ROLLER, fa=1000.0))
    assert any("ribs" in w for w in result.derivation.warnings)
    with pytest.raises(NoEquilibrium):
        analyse_internal(replace(ROLLER, fr=0.0, fa=1000.0))


def test_static_rating_without_f0_is_the_load_reaching_4200_mpa() -> None:
    # ISO 76:2006 §4 (from memory): C0 of a ball bearing is the load at which the most loaded
    # ball's inner contact reaches 4 200 MPa; with Stribeck's classic allowance Qmax =
    # 5·C0/(i·Z·cos α) (machine-design texts, REFERENCE.md §8). Typed here: 5 and 4 200 MPa.
    from workbench.engine.internal import hertz
    from workbench.engine.internal.distribution import ball_contacts

    bearing = InternalInputs("angular-contact", 12, 12.7, 65.0, alpha_deg=40.0, fr=3000.0,
                             fa=3000.0)
    assert bearing.f0 is None  # no f0: C0 from the contact pressure (deep-groove reads ISO 76's f0)
    c0 = analyse_internal(bearing).results["C0"]
    q_max = 5.0 * c0 / (1 * 12 * math.cos(math.radians(40.0)))
    contacts = ball_contacts(bearing)
    p_max = hertz.point_contact(q_max, contacts.inner, contacts.inner_ellipse).p_max
    assert p_max == pytest.approx(4200.0, rel=1e-9)


@pytest.mark.parametrize("bearing, p", [(BALL, 3.0), (ROLLER, 10.0 / 3.0)])
def test_reference_load_inverts_the_life_relation(bearing: InternalInputs, p: float) -> None:
    # ISO/TS 16281:2008 (from memory): Pref is the load that gives L10r through L10 = (C/P)^p,
    # with ISO 281:2007 §7's life exponent p = 3 for ball and 10/3 for roller bearings (typed).
    r = analyse_internal(bearing).results
    assert r["P_ref"] == pytest.approx(r["C"] * r["L10r"] ** (-1.0 / p), rel=1e-12)
    # without ν, eC and a speed aISO is not evaluated: the factor stays 1 (ISO 281:2007 §9.3)
    assert r["aISO"] == 1.0


def test_modified_reference_life_and_hours() -> None:
    # Lnmr = aISO·L10r (ISO/TS 16281, from memory) and hours = 10⁶·L/(60·n) (ISO 281:2007 §5.3)
    r = analyse_internal(replace(BALL, speed=1500.0, nu=20.0, ec=0.5)).results
    assert r["Lnmr"] == pytest.approx(r["aISO"] * r["L10r"], rel=1e-12)
    assert r["L10rh"] == pytest.approx(r["L10r"] * 1e6 / (60.0 * 1500.0), rel=1e-12)
    assert r["aISO"] != 1.0


def test_pair_rule_beside_a_tapered_pair_takes_y_as_0_4_cot_alpha() -> None:
    # ISO 281:2007 Table 3 (single-row radial roller, α ≠ 0, Fa/Fr > e): Y = 0.4·cot α (from
    # memory, REFERENCE.md §2); induced thrust Fi = Fr/(2Y) = Fr·tan α/0.8 (ISO form, REFERENCE.md
    # §7). The rule's bearing that is not pushed carries exactly its own Fi; the other Fi + Ka.
    inputs = InternalInputs("tapered", 18, 9.0, 70.0, lwe=14.0, alpha_deg=15.0,
                            arrangement="back-to-back", fr=8000.0, fa=1500.0)
    result = analyse_internal(inputs)
    rows = {row.name: row for row in result.rows}
    induced = {name: row.radial_load / (2.0 * 0.4 / math.tan(math.radians(15.0)))
               for name, row in rows.items()}
    r = result.results
    # back-to-back, Ka toward B: bearing A resists it; Fi,B + Ka ≥ Fi,A here
    assert induced["B"] + 1500.0 >= induced["A"]
    assert r["Fa_rule_B"] == pytest.approx(induced["B"], rel=1e-9)
    assert r["Fa_rule_A"] == pytest.approx(induced["B"] + 1500.0, rel=1e-9)


def test_outer_ball_raceway_capacity_formula() -> None:
    # Lundberg–Palmgren Qc of the outer raceway (REFERENCE.md §8, from memory): the lower signs,
    # (1 + γ)^1.39/(1 − γ)^(1/3), with fe = 0.53; bm = 1.3 (ISO 281, deep groove, from memory).
    gamma = 12.7 / 65.0
    expected = (1.3 * 98.1 * (1.06 / 0.06) ** 0.41 * (1 + gamma) ** 1.39 / (1 - gamma) ** (1 / 3)
                * gamma ** 0.3 * 12.7 ** 1.8 * 9 ** (-1 / 3))
    assert raceway_capacities(BALL)[1] == pytest.approx(expected, rel=1e-12)


@pytest.mark.parametrize("alpha", [0.0, 12.0])
def test_roller_raceway_capacity_formula(alpha: float) -> None:
    # Lundberg–Palmgren line contact (ISO/TS 16281 form, from memory): Qc = bm·λν·552·
    # (1 ∓ γ)^(29/27)/(1 ± γ)^(1/4)·(γ/cos α)^(2/9)·Dwe^(29/27)·Lwe^(7/9)·Z^(−1/4), upper signs
    # inner; λν = 0.83 (edge stresses and manufacture), bm = 1.1 cylindrical and tapered (ISO
    # 281, from memory). Dwe = 11, Dpw = 70, Lwe = 11, Z = 14.
    kind = "cylindrical" if alpha == 0.0 else "tapered"
    bearing = replace(ROLLER, kind=kind, alpha_deg=alpha)
    gamma = 11.0 * math.cos(math.radians(alpha)) / 70.0
    common = (1.1 * 0.83 * 552.0 * (11.0 / 70.0) ** (2 / 9) * 11.0 ** (29 / 27) * 11.0 ** (7 / 9)
              * 14 ** -0.25)
    inner, outer = raceway_capacities(bearing)
    assert inner == pytest.approx(common * (1 - gamma) ** (29 / 27) / (1 + gamma) ** 0.25, rel=1e-12)
    assert outer == pytest.approx(common * (1 + gamma) ** (29 / 27) / (1 - gamma) ** 0.25, rel=1e-12)


@pytest.mark.parametrize("inner_rotates", [True, False])
def test_ball_row_life_written_out(inner_rotates: bool) -> None:
    # Lundberg–Palmgren, ISO/TS 16281 (from memory; REFERENCE.md §8): the rotating raceway takes
    # the cubic mean of the element loads, the stationary one the 10/3 mean; each raceway lives
    # (Qc/Qe)³, the row (Li^(−10/9) + Le^(−10/9))^(−9/10).
    loads = np.array([3000.0, 2200.0, 800.0, 0.0, 0.0, 0.0, 0.0, 900.0, 2300.0])
    q_ci, q_ce = 21000.0, 24000.0
    cubic = np.mean(loads ** 3) ** (1 / 3)
    ten_thirds = np.mean(loads ** (10 / 3)) ** (3 / 10)
    q_i, q_e = (cubic, ten_thirds) if inner_rotates else (ten_thirds, cubic)
    li, le = (q_ci / q_i) ** 3, (q_ce / q_e) ** 3
    lives = reference_life.ball_row_life(loads, q_ci, q_ce, inner_rotates=inner_rotates)
    assert (lives.load_inner, lives.load_outer) == pytest.approx((q_i, q_e), rel=1e-12)
    assert (lives.inner, lives.outer) == pytest.approx((li, le), rel=1e-12)
    assert lives.row == pytest.approx((li ** (-10 / 9) + le ** (-10 / 9)) ** (-9 / 10), rel=1e-12)


@pytest.mark.parametrize("inner_rotates", [True, False])
def test_roller_row_life_written_out(inner_rotates: bool) -> None:
    # Line contact, sliced (ISO/TS 16281 form, from memory; REFERENCE.md §8): per slice k the
    # capacity qck = Qc·ns^(−7/9); the rotating raceway takes the 4th-power mean of the slice loads
    # over the elements, the stationary one the 4.5th; L = [Σk (qek/qck)^4.5]^(−8/9) per raceway,
    # the row (Li^(−9/8) + Le^(−9/8))^(−8/9).
    slices = np.array([[400.0, 600.0, 500.0], [300.0, 350.0, 200.0], [0.0, 0.0, 0.0],
                       [100.0, 150.0, 120.0]])
    q_ci, q_ce = 30000.0, 33000.0
    share = 3 ** (-7 / 9)
    fourth = np.mean(slices ** 4, axis=0) ** (1 / 4)
    four_half = np.mean(slices ** 4.5, axis=0) ** (1 / 4.5)
    q_i, q_e = (fourth, four_half) if inner_rotates else (four_half, fourth)
    li = np.sum((q_i / (q_ci * share)) ** 4.5) ** (-8 / 9)
    le = np.sum((q_e / (q_ce * share)) ** 4.5) ** (-8 / 9)
    lives = reference_life.roller_row_life(slices, q_ci, q_ce, inner_rotates=inner_rotates)
    assert (lives.inner, lives.outer) == pytest.approx((li, le), rel=1e-12)
    assert (lives.load_inner, lives.load_outer) == pytest.approx((q_i.max(), q_e.max()), rel=1e-12)
    assert lives.row == pytest.approx((li ** (-9 / 8) + le ** (-9 / 8)) ** (-8 / 9), rel=1e-12)
    # one slice of the whole length: the raceway lives (Qc/Qe)^4 (line contact, closed form)
    whole = reference_life.roller_row_life(slices[:, :1], q_ci, q_ce, inner_rotates=True)
    assert whole.inner == pytest.approx((q_ci / np.mean(slices[:, 0] ** 4) ** 0.25) ** 4, rel=1e-12)


def test_raceway_capacities_without_bm_are_lundberg_palmgren_s_own() -> None:
    # Lundberg & Palmgren's capacities carry no ISO 281 bm: called without one, bm = 1
    # (REFERENCE.md §8 formulas, from memory), α = 20° (γ/cos α = Dw/Dpw).
    gamma = 12.7 * math.cos(math.radians(20.0)) / 65.0
    ball = reference_life.ball_raceway_capacity(12.7, 65.0, 20.0, 9, 0.52, inner=True)
    assert ball == pytest.approx(98.1 * (1.04 / 0.04) ** 0.41 * (1 - gamma) ** 1.39
                                 / (1 + gamma) ** (1 / 3) * (12.7 / 65.0) ** 0.3 * 12.7 ** 1.8
                                 * 9 ** (-1 / 3), rel=1e-12)
    roller = reference_life.roller_raceway_capacity(11.0, 70.0, 0.0, 14, 11.0, inner=False)
    g = 11.0 / 70.0
    assert roller == pytest.approx(0.83 * 552.0 * (1 + g) ** (29 / 27) / (1 - g) ** 0.25
                                   * g ** (2 / 9) * 11.0 ** (29 / 27) * 11.0 ** (7 / 9)
                                   * 14 ** -0.25, rel=1e-12)


@pytest.mark.parametrize(("bearing", "limit"), [(BALL, "4200 MPa"), (ROLLER, "4000 MPa")])
def test_contact_pressure_steps_name_the_iso76_reference(bearing: InternalInputs, limit: str) -> None:
    # ISO 76:2006 §4 (from memory; REFERENCE.md §8): the largest contact pressure at C0 is
    # 4 200 MPa for ball bearings (other than self-aligning) and 4 000 MPa for roller bearings.
    d = analyse_internal(bearing).derivation
    for side in ("inner", "outer"):
        note = d.step(f"p_max_{side}").note
        assert f"reference at C0: {limit}" in note
