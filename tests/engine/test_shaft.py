"""Two-bearing shaft statics: equilibrium of random layouts and hand-worked free bodies."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from workbench.engine.record import Derivation, InputError
from workbench.engine.shaft import (
    PointLoad, ShaftElement, ShaftLayout, derivation_steps, element_load, shaft_torque,
    solve_reactions,
)

positions = st.floats(-500.0, 500.0, allow_nan=False)
forces = st.floats(-2e4, 2e4, allow_nan=False)


@st.composite
def layouts(draw: st.DrawFn) -> ShaftLayout:
    a = draw(positions)
    b = a + draw(st.floats(1.0, 800.0))
    loads = draw(st.lists(st.builds(
        PointLoad, x_mm=st.floats(-600.0, 1400.0), fy=forces, fz=forces, fx=forces,
        radius_mm=st.floats(0.0, 300.0), angle_deg=st.floats(-360.0, 360.0)), max_size=6))
    return ShaftLayout(a, b, draw(st.sampled_from(["A", "B", "both"])), loads)


def _forces_and_points(layout: ShaftLayout) -> tuple[np.ndarray, np.ndarray]:
    """Every force on the shaft (loads and bearing reactions) with its point of application."""
    reactions = solve_reactions(layout)
    vectors = [np.array([ld.fx, ld.fy, ld.fz]) for ld in layout.loads]
    points = [np.array([ld.x_mm, ld.radius_mm * math.cos(math.radians(ld.angle_deg)),
                        ld.radius_mm * math.sin(math.radians(ld.angle_deg))]) for ld in layout.loads]
    # the locating bearing(s) react the thrust on the axis, where it makes no bending moment
    vectors += [np.array([-reactions.thrust, reactions.a_y, reactions.a_z]),
                np.array([0.0, reactions.b_y, reactions.b_z])]
    points += [np.array([layout.bearing_a_mm, 0.0, 0.0]), np.array([layout.bearing_b_mm, 0.0, 0.0])]
    return np.array(vectors), np.array(points)


@settings(max_examples=200, deadline=None)
@given(layout=layouts(), pivot=st.tuples(positions, positions, positions))
def test_random_layout_is_in_equilibrium(layout: ShaftLayout, pivot: tuple[float, float, float]) -> None:
    # shaft statics: ΣF = 0 and ΣM = 0 about any point, in the x–y plane (Fy, Mz) and the x–z
    # plane (Fz, My), to 1e-9 relative to the size of the terms summed.
    vectors, points = _forces_and_points(layout)
    arms = points - np.array(pivot)
    moments = np.cross(arms, vectors)
    force_scale = max(float(np.abs(vectors).sum()), 1.0)
    moment_scale = max(float(np.abs(moments).sum()), 1.0)
    total_force = vectors.sum(axis=0)
    total_moment = moments.sum(axis=0)
    assert abs(total_force[1]) <= 1e-9 * force_scale and abs(total_force[2]) <= 1e-9 * force_scale
    assert abs(total_force[0]) <= 1e-9 * force_scale
    assert abs(total_moment[1]) <= 1e-9 * moment_scale  # x–z plane
    assert abs(total_moment[2]) <= 1e-9 * moment_scale  # x–y plane


@settings(max_examples=100, deadline=None)
@given(layout=layouts())
def test_radial_and_axial_loads_follow_from_reactions(layout: ShaftLayout) -> None:
    reactions = solve_reactions(layout)
    assert reactions.radial_a == pytest.approx(math.hypot(reactions.a_y, reactions.a_z), rel=1e-12)
    assert reactions.radial_b == pytest.approx(math.hypot(reactions.b_y, reactions.b_z), rel=1e-12)
    thrust = abs(sum(ld.fx for ld in layout.loads))
    if layout.locating == "A":
        assert (reactions.axial_a, reactions.axial_b) == (pytest.approx(thrust), 0.0)
    elif layout.locating == "B":
        assert (reactions.axial_a, reactions.axial_b) == (0.0, pytest.approx(thrust))
    else:
        assert math.isnan(reactions.axial_a) and math.isnan(reactions.axial_b)


def test_simply_supported_hand_worked() -> None:
    # By hand: span 200 mm, Fy = −1000 N at x = 50 mm → R_B,y = 1000·50/200 = 250 N,
    # R_A,y = 1000 − 250 = 750 N.  Fz = 600 N overhung at x = 260 mm → R_B,z = −600·260/200 = −780 N,
    # R_A,z = −600 + 780 = 180 N.  Fx = 400 N at r = 50 mm, θ = 90° (z = 50 mm) adds My = 50·400
    # = 20000 N·mm about A → R_B,z += 20000/200 = 100 N → −680 N, R_A,z → 80 N.
    layout = ShaftLayout(0.0, 200.0, "A", [
        PointLoad(50.0, fy=-1000.0),
        PointLoad(260.0, fz=600.0),
        PointLoad(120.0, fx=400.0, radius_mm=50.0, angle_deg=90.0),
    ])
    r = solve_reactions(layout)
    assert r.b_y == pytest.approx(250.0) and r.a_y == pytest.approx(750.0)
    assert r.b_z == pytest.approx(-680.0) and r.a_z == pytest.approx(80.0)
    assert r.radial_a == pytest.approx(math.hypot(750.0, 80.0))
    assert r.radial_b == pytest.approx(math.hypot(250.0, 680.0))
    assert (r.thrust, r.axial_a, r.axial_b) == (pytest.approx(400.0), pytest.approx(400.0), 0.0)


def test_axial_force_at_pitch_radius_makes_a_couple() -> None:
    # By hand: Fx = 1000 N at y = 80 mm (θ = 0) on a 160 mm span: Mz = −80·1000 about A, so
    # R_B,y = 80000/160 = 500 N and R_A,y = −500 N (a pure couple), located at B.
    r = solve_reactions(ShaftLayout(10.0, 170.0, "B", [PointLoad(90.0, fx=-1000.0, radius_mm=80.0)]))
    assert r.b_y == pytest.approx(-500.0) and r.a_y == pytest.approx(500.0)
    assert r.axial_b == pytest.approx(1000.0) and r.axial_a == 0.0


def test_derivation_steps_carry_the_results() -> None:
    layout = ShaftLayout(0.0, 200.0, "both", [PointLoad(50.0, fy=-1000.0, fx=300.0, radius_mm=40.0)])
    reactions = solve_reactions(layout)
    record = derivation_steps(layout, reactions)
    assert record.results["R_Ay"] == reactions.a_y
    assert record.results["Fr_B"] == reactions.radial_b
    assert math.isnan(record.results["Fa_A"])
    assert record.sources == ["shaft statics, ΣF = 0, ΣM = 0"]
    assert record.step("R_By").substituted.startswith("R_B,y = −")


@pytest.mark.parametrize("layout, field", [
    (ShaftLayout(100.0, 100.0, "A", []), "bearing_b_position"),
    (ShaftLayout(100.0, 50.0, "A", []), "bearing_b_position"),
    (ShaftLayout(math.inf, 50.0, "A", []), "bearing_a_position"),
    (ShaftLayout(0.0, 50.0, "C", []), "locating_bearing"),  # type: ignore[arg-type]
    (ShaftLayout(0.0, 50.0, "A", [PointLoad(10.0, fy=math.nan)]), "load 1 Fy"),
    (ShaftLayout(0.0, 50.0, "A", [PointLoad(10.0, radius_mm=-1.0, name="gear")]), "gear radius"),
])
def test_bad_layouts_raise_input_error(layout: ShaftLayout, field: str) -> None:
    with pytest.raises(InputError) as caught:
        solve_reactions(layout)
    assert caught.value.field == field


# ---- the loads of gears and pulleys -----------------------------------------------------------
def test_shaft_torque_given_or_from_power() -> None:
    # T = P/ω, ω = 2π·n/60: 15 kW at 1200 r/min → 15 000·60/(2π·1200) = 119.366 N·m.
    d = Derivation()
    assert shaft_torque(d, power_W=None, torque_Nm=80.0, speed_rpm=1000.0) == 80.0
    assert shaft_torque(d, power_W=15_000.0, torque_Nm=None, speed_rpm=1200.0) == pytest.approx(
        15_000 * 60 / (2 * math.pi * 1200), rel=1e-12)
    assert d.step("T").formula == "T = P/(2π·n/60)"


def test_helical_element_load_by_hand() -> None:
    # The hand case of tests/model/test_shafts.py: right-hand driving pinion, d = 100 mm, αn = 20°,
    # β = 15°, T = 100 N·m, mesh point at θ = 0°, + rotation.  Wt = 2000 N,
    # Wr = 2000·tan 20°/cos 15° = 753.62 N, Wa = 2000·tan 15° = 535.90 N toward +x;
    # Fy = −Wr, Fz = −Wt, Fx acting at y = +50 mm.
    pinion = ShaftElement(name="pinion", kind="helical", position_mm=80.0, diameter_mm=100.0,
                          mesh_angle_deg=0.0, pressure_angle_deg=20.0, helix_angle_deg=15.0,
                          hand="right", driving=True)
    d = Derivation()
    load = element_load(d, pinion, 100.0, rotation=1)
    wr = 2000 * math.tan(math.radians(20)) / math.cos(math.radians(15))
    assert (load.x_mm, load.radius_mm, load.angle_deg, load.name) == (80.0, 50.0, 0.0, "pinion")
    assert load.fy == pytest.approx(-wr, rel=1e-12)
    assert load.fz == pytest.approx(-2000.0, rel=1e-12)
    assert load.fx == pytest.approx(2000 * math.tan(math.radians(15)), rel=1e-12)
    assert [step.key for step in d.steps] == [
        "Wt[pinion]", "Wr[pinion]", "Wa[pinion]", "Fy[pinion]", "Fz[pinion]"]
    assert d.results == {}  # the element's steps are shown, not results of the shaft


def test_gear_and_pulley_steps_speak_the_forms_symbols_in_one_unit() -> None:
    """The steps name the angles as the shaft editor's form does (αn the normal pressure angle,
    β the helix angle; never φ or ψ), and 2T/d is substituted with T in N·mm against d in mm:
    2 × 100 000 N·mm / 100 mm = 2000 N (T = 100 N·m), so the numbers shown give the result."""
    pinion = ShaftElement(name="pinion", kind="helical", position_mm=80.0, diameter_mm=100.0,
                          mesh_angle_deg=0.0, pressure_angle_deg=20.0, helix_angle_deg=15.0,
                          hand="right", driving=True)
    pulley = ShaftElement(name="pulley", kind="pulley", position_mm=-40.0, diameter_mm=200.0,
                          mesh_angle_deg=90.0)
    d = Derivation()
    element_load(d, pinion, 100.0, rotation=1)
    element_load(d, pulley, 100.0, rotation=1)
    words = " ".join(f"{step.formula} {step.source}" for step in d.steps)
    assert "φ" not in words and "ψ" not in words
    assert d.step("Wr[pinion]").formula == "Wt·tan αn/cos β"
    assert d.step("Wa[pinion]").formula == "±Wt·tan β"
    assert d.step("Wt[pinion]").substituted == "2 × 100000 N·mm / 100 mm"
    assert d.step("F[pulley]").substituted == "2 × 2 × 100000 N·mm / 200 mm"  # F = f·2T/D, f = 2


def test_pulley_load_takes_its_share_and_the_v_belt_factor() -> None:
    # F = f·2T/D (common practice f = 2 for a V belt) at half of 100 N·m on D = 200 mm:
    # 2·2·50 000/200 = 1000 N, pointing at θ = 90° (+z).
    pulley = ShaftElement(name="pulley", kind="pulley", position_mm=-40.0, diameter_mm=200.0,
                          mesh_angle_deg=90.0, share=0.5)
    d = Derivation()
    load = element_load(d, pulley, 100.0, rotation=-1)
    assert (load.fy, load.fz, load.fx) == (pytest.approx(0.0, abs=1e-9), pytest.approx(1000.0), 0.0)
    assert d.step("T[pulley]").value == 50.0
    assert "V-belt value 2" in (d.step("F[pulley]").note or "")
