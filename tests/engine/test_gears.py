"""Gear, pulley and power relations against their closed forms, computed here independently."""

from __future__ import annotations

import math

import numpy as np
import pytest

from workbench.engine.gears import (
    BELT_PULL_FACTORS,
    belt_pull,
    bevel_axial_load,
    helical_forces,
    mesh_force_components,
    spur_forces,
    straight_bevel_forces,
    torque_from_power,
)
from workbench.engine.record import InputError


def test_torque_from_power_is_p_over_omega() -> None:
    # T = P/ω with ω = 2π·n/60: 7.5 kW at 1450 r/min → 7500/(2π·1450/60) = 49.39 N·m.
    omega = 2.0 * math.pi * 1450.0 / 60.0
    assert torque_from_power(7500.0, 1450.0) == pytest.approx(7500.0 / omega, rel=1e-12)
    assert torque_from_power(7500.0, 1450.0) == pytest.approx(49.39, abs=0.01)


def test_spur_forces_closed_form() -> None:
    # spur gear force relations: Wt = T/(d/2), Wr = Wt·tan φ; 120 N·m on d = 80 mm, φ = 20°.
    forces = spur_forces(120.0, 80.0, 20.0)
    wt = 120.0 / 0.040
    assert forces.tangential == pytest.approx(wt, rel=1e-12)
    assert forces.radial == pytest.approx(wt * math.tan(math.radians(20.0)), rel=1e-12)
    assert forces.axial == 0.0


@pytest.mark.parametrize("phi_n, psi", [(20.0, 15.0), (20.0, 30.0), (14.5, 22.5), (25.0, 0.0)])
def test_helical_forces_closed_form(phi_n: float, psi: float) -> None:
    # helical gear force relations, Wr = Wt·tan φn/cos ψ, Wa = Wt·tan ψ (Wt = T/(d/2)).
    torque, d = 250.0, 140.0
    forces = helical_forces(torque, d, phi_n, psi, "right", True)
    wt = torque / (d / 2000.0)
    assert forces.tangential == pytest.approx(wt, rel=1e-12)
    assert forces.radial == pytest.approx(wt * math.tan(math.radians(phi_n)) / math.cos(math.radians(psi)),
                                          rel=1e-12)
    assert forces.axial == pytest.approx(wt * math.tan(math.radians(psi)), rel=1e-12, abs=1e-9)
    # the same radial load through the transverse pressure angle, tan φt = tan φn/cos ψ
    phi_t = math.atan(math.tan(math.radians(phi_n)) / math.cos(math.radians(psi)))
    assert forces.radial == pytest.approx(wt * math.tan(phi_t), rel=1e-12)


@pytest.mark.parametrize("hand", ["left", "right"])
@pytest.mark.parametrize("driving", [True, False])
@pytest.mark.parametrize("rotation", [1, -1])
def test_helical_thrust_sign_makes_tooth_force_normal_to_tooth_line(
        hand: str, driving: bool, rotation: int) -> None:
    # Helix geometry (frictionless contact): at the mesh point (0, r, 0) the tooth line of a
    # right-hand helix x = c·t, y = r·cos t, z = r·sin t runs along (cos ψ, 0, sin ψ), a left-hand one
    # along (cos ψ, 0, −sin ψ).  The mesh point moves along rotation·(+z); the tangential force on a
    # driver opposes that motion, on a driven gear follows it.  The tooth force's component in the
    # tangent plane (x, z) must then be perpendicular to the tooth line, fixing the sign of Wa.
    psi = 25.0
    forces = helical_forces(90.0, 100.0, 20.0, psi, hand, driving, rotation=rotation)
    force_z = forces.tangential * rotation * (-1.0 if driving else 1.0)
    line_z = math.sin(math.radians(psi)) * (1.0 if hand == "right" else -1.0)
    tangent_plane_force = np.array([forces.axial, force_z])
    tooth_line = np.array([math.cos(math.radians(psi)), line_z])
    assert abs(float(tangent_plane_force @ tooth_line)) < 1e-9 * forces.tangential
    assert abs(forces.axial) == pytest.approx(forces.tangential * math.tan(math.radians(psi)))


def test_helical_mesh_thrusts_are_equal_and_opposite() -> None:
    # Newton's third law on a parallel-axis external mesh: opposite hands, opposite rotations,
    # one drives and the other is driven; with both shafts' x axes parallel the thrusts cancel.
    torque_1, d_1, d_2 = 60.0, 50.0, 150.0
    pinion = helical_forces(torque_1, d_1, 20.0, 18.0, "right", True, rotation=1)
    wheel = helical_forces(torque_1 * d_2 / d_1, d_2, 20.0, 18.0, "left", False, rotation=-1)
    assert pinion.tangential == pytest.approx(wheel.tangential, rel=1e-12)
    assert pinion.axial == pytest.approx(-wheel.axial, rel=1e-12)
    assert pinion.axial > 0  # right-hand driver turning positively about +x is thrust toward +x


def test_straight_bevel_closed_form_and_ninety_degree_pair() -> None:
    # straight bevel gear force relations: Wr = Wt·tan φ·cos γ, Wa = Wt·tan φ·sin γ, Wt at the mean
    # pitch radius.
    torque, dm, phi, gamma = 40.0, 60.0, 20.0, 26.565
    forces = straight_bevel_forces(torque, dm, phi, gamma)
    wt = torque / (dm / 2000.0)
    tan_phi = math.tan(math.radians(phi))
    assert forces.tangential == pytest.approx(wt, rel=1e-12)
    assert forces.radial == pytest.approx(wt * tan_phi * math.cos(math.radians(gamma)), rel=1e-12)
    assert forces.axial == pytest.approx(wt * tan_phi * math.sin(math.radians(gamma)), rel=1e-12)
    # shafts at 90°: the pinion's radial load is the gear's axial load and vice versa (same Wt).
    gear = straight_bevel_forces(torque * 2.0, dm * 2.0, phi, 90.0 - gamma)
    assert gear.tangential == pytest.approx(forces.tangential, rel=1e-12)
    assert gear.axial == pytest.approx(forces.radial, rel=1e-12)
    assert gear.radial == pytest.approx(forces.axial, rel=1e-12)


def test_belt_pull_factor_and_direction() -> None:
    # F = f·2T/D resolved along the pull direction; the factors are common practice.
    factor = BELT_PULL_FACTORS["flat_belt"][0]
    pull = belt_pull(30.0, 150.0, factor, 120.0)
    effective = 30.0 / 0.075
    assert pull.force == pytest.approx(factor * effective, rel=1e-12)
    assert pull.fy == pytest.approx(pull.force * math.cos(math.radians(120.0)), rel=1e-12)
    assert pull.fz == pytest.approx(pull.force * math.sin(math.radians(120.0)), rel=1e-12)
    assert belt_pull(30.0, 150.0).force == pytest.approx(BELT_PULL_FACTORS["v_belt"][0] * effective)
    for default, (low, high) in BELT_PULL_FACTORS.values():
        assert 1.0 <= low <= default <= high
    # f = 1 is the bare tangential pull 2T/D (a drive with no slack-side tension, closed form):
    # the smallest factor accepted; below it the pull would be less than the torque transmits
    assert belt_pull(30.0, 150.0, 1.0).force == pytest.approx(effective, rel=1e-12)
    with pytest.raises(InputError):
        belt_pull(30.0, 150.0, 0.99)


def test_belt_pull_factors_are_the_common_practice_values() -> None:
    # Shaft-load factors f (common practice, typed here): V-belt 2 (1.5–2.5), flat belt 2.5
    # (2–3), toothed belt 1.3 (1.1–1.5), chain 1.3 (1.2–1.5).
    assert BELT_PULL_FACTORS == {
        "v_belt": (2.0, (1.5, 2.5)), "flat_belt": (2.5, (2.0, 3.0)),
        "toothed_belt": (1.3, (1.1, 1.5)), "chain": (1.3, (1.2, 1.5)),
    }


def test_arrays_match_floats() -> None:
    torques = np.array([10.0, 55.0, 300.0])
    forces = helical_forces(torques, 90.0, 20.0, 20.0, "left", True)
    for i, torque in enumerate(torques):
        single = helical_forces(float(torque), 90.0, 20.0, 20.0, "left", True)
        assert forces.tangential[i] == pytest.approx(single.tangential, rel=1e-12)
        assert forces.radial[i] == pytest.approx(single.radial, rel=1e-12)
        assert forces.axial[i] == pytest.approx(single.axial, rel=1e-12)
    assert isinstance(torque_from_power(np.array([1e3, 2e3]), 1000.0), np.ndarray)


@pytest.mark.parametrize("call, field", [
    (lambda: spur_forces(-1.0, 80.0, 20.0), "torque"),
    (lambda: spur_forces(10.0, 0.0, 20.0), "diameter"),
    (lambda: spur_forces(10.0, 80.0, math.nan), "pressure_angle"),
    (lambda: helical_forces(10.0, 80.0, 20.0, 90.0, "right", True), "helix_angle"),
    (lambda: helical_forces(10.0, 80.0, 20.0, 20.0, "up", True), "hand"),
    (lambda: helical_forces(10.0, 80.0, 20.0, 20.0, "left", True, rotation=0), "rotation"),
    (lambda: straight_bevel_forces(10.0, 80.0, 20.0, 95.0), "pitch_cone_angle"),
    (lambda: torque_from_power(1000.0, 0.0), "speed"),
    (lambda: belt_pull(10.0, 100.0, 0.8), "belt_pull_factor"),
    (lambda: spur_forces(np.array([1.0, math.inf]), 80.0, 20.0), "torque"),
    # geometry: a pressure, helix or pitch-cone angle lies below 90° (tan 90° is infinite, and past
    # it the tooth or cone turns over); just past 90° is refused, not read as a steep angle
    (lambda: spur_forces(10.0, 80.0, 90.5), "pressure_angle"),
    (lambda: helical_forces(10.0, 80.0, 90.5, 20.0, "right", True), "normal_pressure_angle"),
    (lambda: helical_forces(10.0, 80.0, 20.0, 90.5, "right", True), "helix_angle"),
    (lambda: straight_bevel_forces(10.0, 80.0, 90.5, 45.0), "pressure_angle"),
    (lambda: straight_bevel_forces(10.0, 80.0, 20.0, 90.5), "pitch_cone_angle"),
])
def test_bad_input_names_its_field(call, field: str) -> None:
    with pytest.raises(InputError) as caught:
        call()
    assert caught.value.field == field


# ---- resolution in the shaft frame ------------------------------------------------------------
def test_mesh_force_components_at_the_axes() -> None:
    # Gear statics by hand: Wr points from the mesh point toward the axis; the mesh point at θ moves
    # along rotation·(−sin θ, cos θ), and Wt opposes that motion on a driving gear.
    # θ = 0°, driving, + rotation: the point moves along +z → Fy = −Wr, Fz = −Wt.
    assert mesh_force_components(2000.0, 750.0, 0.0, rotation=1, driving=True) == (
        pytest.approx(-750.0), pytest.approx(-2000.0))
    # θ = 90°, driving, + rotation: the point moves along −y → Fy = +Wt, Fz = −Wr.
    fy, fz = mesh_force_components(2000.0, 750.0, 90.0, rotation=1, driving=True)
    assert (fy, fz) == (pytest.approx(2000.0), pytest.approx(-750.0))
    # a driven gear, or the other rotation, turns the tangential part round
    for changes in ({"rotation": -1, "driving": True}, {"rotation": 1, "driving": False}):
        fy, fz = mesh_force_components(2000.0, 750.0, 90.0, **changes)  # type: ignore[arg-type]
        assert (fy, fz) == (pytest.approx(-2000.0), pytest.approx(-750.0))


@pytest.mark.parametrize("theta", [-170.0, -45.0, 13.0, 120.0, 200.0])
def test_mesh_force_components_keep_the_magnitude(theta: float) -> None:
    # A rotation of the frame keeps |F| = √(Wt² + Wr²) (closed form).
    fy, fz = mesh_force_components(1234.0, 456.0, theta, rotation=-1, driving=False)
    assert math.hypot(fy, fz) == pytest.approx(math.hypot(1234.0, 456.0), rel=1e-12)


def test_bevel_axial_load_points_away_from_the_apex() -> None:
    # Straight bevel gear force relations: the thrust points from the apex toward the back cone.
    assert bevel_axial_load(300.0, "A") == 300.0
    assert bevel_axial_load(300.0, "B") == -300.0
    with pytest.raises(InputError):
        bevel_axial_load(300.0, "C")  # type: ignore[arg-type]
