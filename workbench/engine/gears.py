"""Gear-mesh and belt forces on a shaft: where the bearing loads come from.

Closed forms of the gear-force relations (spur, helical, straight bevel) and T = P/ω.  Floats or
numpy arrays alike.

Shaft frame used throughout the engine
--------------------------------------
``x`` runs along the shaft axis; ``y`` and ``z`` are transverse and (x, y, z) is right-handed.
The shaft's sense of rotation is ``rotation = +1`` when it turns positively about +x (right-hand
rule: thumb along +x, fingers curl the way the shaft turns) and ``−1`` the other way.

:class:`MeshForces` gives the tangential load Wt and the radial load Wr as magnitudes (Wr always
points from the mesh point toward the gear's axis; Wt opposes the motion of the mesh point on a
driving gear and follows it on a driven one).  The axial load Wa is signed:

* helical gears: Wa > 0 pushes the gear (and its shaft) toward +x.  On a driving gear turning
  positively about +x a right-hand helix is thrust toward +x; a left hand, a driven gear or the
  opposite rotation each flip the sign once.  So ``Wa = s_hand·s_role·rotation·Wt·tan β`` with
  ``s_hand`` = +1 right / −1 left and ``s_role`` = +1 driving / −1 driven.  (This is the tooth normal
  force being perpendicular to the tooth line; the two gears of a mesh come out equal and
  opposite.)
* straight bevel gears: the thrust on either member, whichever way it turns, points away from the
  pitch-cone apex toward the back cone; Wa is returned as that positive magnitude and the caller
  gives it the sign of the direction apex → back cone in the shaft frame.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Generic, Literal

from .num import NumT, cosd, extremes, is_number, sind, tand
from .record import InputError

#: Shaft-load factor f in F = f·Wt for belt and chain drives, with the usual spread [common
#: practice]: the pull on the shaft from both strands together, the belt pre-tension included, as a
#: multiple of the effective (tangential) pull 2T/D.
BELT_PULL_FACTORS: dict[str, tuple[float, tuple[float, float]]] = {
    "v_belt": (2.0, (1.5, 2.5)),
    "flat_belt": (2.5, (2.0, 3.0)),
    "toothed_belt": (1.3, (1.1, 1.5)),
    "chain": (1.3, (1.2, 1.5)),
}
V_BELT_PULL_FACTOR = BELT_PULL_FACTORS["v_belt"][0]


@dataclass(frozen=True, slots=True)
class MeshForces(Generic[NumT]):
    """Tangential Wt, radial Wr (magnitudes) and axial Wa (signed, see module notes), in N."""

    tangential: NumT
    radial: NumT
    axial: NumT


@dataclass(frozen=True, slots=True)
class BeltPull(Generic[NumT]):
    """Resultant pull of a belt or chain on its shaft, in N, and its y and z components."""

    force: NumT
    fy: NumT
    fz: NumT


def checked(field_name: str, value: NumT, *, low: float | None = None, high: float | None = None,
            low_open: bool = False, high_open: bool = False) -> NumT:
    """``value`` if it is finite and within the bounds given, else an InputError for ``field_name``.

    Works on a float or on every element of a numpy array.
    """
    if not is_number(value):
        raise InputError(field_name, f"a number is needed, not {value!r}")
    span = extremes(value)
    if span is None:  # an empty array
        return value
    smallest, largest = span
    finite = math.isfinite(smallest) and math.isfinite(largest)
    if not finite:
        raise InputError(field_name, "must be a finite number")
    if low is not None and (smallest < low or (low_open and smallest == low)):
        raise InputError(field_name, f"must be {'>' if low_open else '≥'} {low:g}")
    if high is not None and (largest > high or (high_open and largest == high)):
        raise InputError(field_name, f"must be {'<' if high_open else '≤'} {high:g}")
    return value


def tangential_load(torque_Nm: NumT, diameter_mm: NumT) -> NumT:
    """Wt = T/(d/2) in N, T in N·m and d in mm (gear-force relations; also the belt effective pull)."""
    checked("torque", torque_Nm, low=0.0)
    checked("diameter", diameter_mm, low=0.0, low_open=True)
    return 2000.0 * torque_Nm / diameter_mm


def torque_from_power(power_W: NumT, speed_rpm: NumT) -> NumT:
    """T = P/ω in N·m with ω = 2π·n/60 (power P in W, speed n in r/min)."""
    checked("power", power_W, low=0.0)
    checked("speed", speed_rpm, low=0.0, low_open=True)
    return power_W * 60.0 / (2.0 * math.pi * speed_rpm)


def spur_forces(torque_Nm: NumT, pitch_diameter_mm: NumT, pressure_angle_deg: NumT) -> MeshForces[NumT]:
    """Spur gear: Wt = T/(d/2), Wr = Wt·tan αn, Wa = 0 (gear-force relations, spur gears)."""
    checked("pressure_angle", pressure_angle_deg, low=0.0, high=90.0, low_open=True, high_open=True)
    wt = tangential_load(torque_Nm, pitch_diameter_mm)
    return MeshForces(wt, wt * tand(pressure_angle_deg), 0.0 * wt)


def helical_forces(torque_Nm: NumT, pitch_diameter_mm: NumT, normal_pressure_angle_deg: NumT,
                   helix_angle_deg: NumT, hand: Literal["left", "right"], driving: bool,
                   *, rotation: int = 1) -> MeshForces[NumT]:
    """Helical gear: Wt = T/(d/2), Wr = Wt·tan αn/cos β, Wa = ±Wt·tan β (helical gear force relations).

    ``d`` is the transverse pitch diameter.  The sign of Wa follows the module's shaft-frame
    convention from ``hand``, ``driving`` and ``rotation`` (+1 or −1 about +x).
    """
    checked("normal_pressure_angle", normal_pressure_angle_deg, low=0.0, high=90.0,
            low_open=True, high_open=True)
    checked("helix_angle", helix_angle_deg, low=0.0, high=90.0, high_open=True)
    if hand not in ("left", "right"):
        raise InputError("hand", f"a helix is 'left' or 'right', not {hand!r}")
    if rotation not in (1, -1):
        raise InputError("rotation", f"rotation is +1 or −1 about +x, not {rotation!r}")
    wt = tangential_load(torque_Nm, pitch_diameter_mm)
    sign = (1 if hand == "right" else -1) * (1 if driving else -1) * rotation
    radial = wt * tand(normal_pressure_angle_deg) / cosd(helix_angle_deg)
    return MeshForces(wt, radial, sign * wt * tand(helix_angle_deg))


def straight_bevel_forces(torque_Nm: NumT, mean_pitch_diameter_mm: NumT, pressure_angle_deg: NumT,
                          pitch_cone_angle_deg: NumT) -> MeshForces[NumT]:
    """Straight bevel gear: Wt at the mean pitch radius, Wr = Wt·tan αn·cos γ, Wa = Wt·tan αn·sin γ.

    Gear-force relations for straight bevel gears; Wa is the magnitude of the thrust, which points
    from the pitch-cone apex toward the back cone.
    """
    checked("pressure_angle", pressure_angle_deg, low=0.0, high=90.0, low_open=True, high_open=True)
    checked("pitch_cone_angle", pitch_cone_angle_deg, low=0.0, high=90.0)
    wt = tangential_load(torque_Nm, mean_pitch_diameter_mm)
    separating = wt * tand(pressure_angle_deg)
    return MeshForces(wt, separating * cosd(pitch_cone_angle_deg),
                      separating * sind(pitch_cone_angle_deg))


def belt_pull(torque_Nm: NumT, pulley_diameter_mm: NumT, factor: float = V_BELT_PULL_FACTOR,
              direction_deg: float = 0.0) -> BeltPull[NumT]:
    """Shaft load of a belt or chain drive: F = f·2T/D, resolved at ``direction_deg`` in the y–z plane.

    ``f`` is the shaft-load factor (:data:`BELT_PULL_FACTORS`, common practice; default the V-belt
    value).  ``direction_deg`` is the angle of the pull on the shaft, measured from +y toward +z.
    """
    checked("belt_pull_factor", factor, low=1.0)
    checked("belt_direction", direction_deg)
    force = factor * tangential_load(torque_Nm, pulley_diameter_mm)
    return BeltPull(force, force * cosd(direction_deg), force * sind(direction_deg))


def bevel_axial_load(thrust: NumT, apex: Literal["A", "B"]) -> NumT:
    """A straight bevel gear's thrust Wa (a magnitude) signed in the shaft frame, in N.

    The thrust points from the pitch-cone apex toward the back cone (gear-force relations for
    straight bevel gears): Fx = −Wa when the apex lies on the B side of the gear, +Wa on the A side.
    """
    if apex not in ("A", "B"):
        raise InputError("apex", f"the apex lies on side 'A' or 'B', not {apex!r}")
    return -thrust if apex == "B" else thrust


def mesh_force_components(tangential: NumT, radial: NumT, mesh_angle_deg: NumT, *, rotation: int,
                          driving: bool) -> tuple[NumT, NumT]:
    """(Fy, Fz): a mesh's loads on the shaft resolved in the y–z plane of the shaft frame, in N.

    Fy = −Wr·cos θ − s·Wt·sin θ and Fz = −Wr·sin θ + s·Wt·cos θ, with θ the direction of the mesh
    point from +y toward +z (degrees) and s = −rotation on a driving gear, +rotation on a driven
    one: Wr points toward the axis, and Wt against (driving) or with (driven) the motion of the
    mesh point, which moves along rotation·(−sin θ, cos θ) (gear statics, module notes).
    """
    if rotation not in (1, -1):
        raise InputError("rotation", f"rotation is +1 or −1 about +x, not {rotation!r}")
    along = -rotation if driving else rotation
    cos_t, sin_t = cosd(mesh_angle_deg), sind(mesh_angle_deg)
    return (-radial * cos_t - along * tangential * sin_t,
            -radial * sin_t + along * tangential * cos_t)
