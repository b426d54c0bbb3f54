"""Statics of a shaft on two bearings: bearing reactions from the loads on the shaft.

Shaft statics (ΣF = 0, ΣM = 0) in the two planes x–y and x–z of the shaft frame described in
:mod:`workbench.engine.gears`: x along the axis, y and z transverse, right-handed.  The bearings are
simple supports on the axis at ``bearing_a_mm`` < ``bearing_b_mm``, so +x points from A toward B
(the direction :mod:`workbench.engine.pairs` calls "toward B"); they carry no moment and no
torque (the torque through the shaft is balanced by the drive, not by the bearings).

A :class:`PointLoad` is a force applied at the point (x, r·cos θ, r·sin θ): for a gear mesh, r is
the pitch radius and θ the angular position of the mesh point, measured from +y toward +z.  The
offset matters only for the axial component, whose lever arm r gives the bending moments
My = z₀·Fx and Mz = −y₀·Fx; the transverse components at radius r add only torsion.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Literal, TypeVar

from .gears import (
    BELT_PULL_FACTORS, V_BELT_PULL_FACTOR, belt_pull, bevel_axial_load, checked, helical_forces,
    mesh_force_components, spur_forces, straight_bevel_forces, torque_from_power,
)
from .num import cosd, sind
from .record import Derivation, InputError

Locating = Literal["A", "B", "both"]
ElementKind = Literal["spur", "helical", "bevel", "pulley"]
SOURCE = "shaft statics, ΣF = 0, ΣM = 0"
# αn the (normal) pressure angle, β the helix angle, γ the pitch cone angle: the symbols the
# shaft editor's form uses (a spur or straight bevel gear's pressure angle is its normal one)
SPUR_SOURCE = "spur gear force relations: Wt = 2T/d, Wr = Wt·tan αn"
HELICAL_SOURCE = "helical gear force relations: Wt = 2T/d, Wr = Wt·tan αn/cos β, Wa = Wt·tan β"
BEVEL_SOURCE = ("straight bevel gear force relations: Wt = 2T/dm, Wr = Wt·tan αn·cos γ, "
                "Wa = Wt·tan αn·sin γ")
N_MM_PER_N_M = 1000.0
"""A torque in N·m written in N·mm, so a substitution against a diameter in mm is in one unit."""
PULLEY_SOURCE = "belt or chain shaft load F = f·2T/D (factor f: common practice)"
RESOLVE_SOURCE = "gear-force relations resolved in the shaft frame (x from A toward B)"
TORQUE_SOURCE = "T = P/ω, ω = 2π·n/60"


@dataclass(frozen=True, slots=True)
class PointLoad:
    """A force on the shaft in N at axial position ``x_mm``; axial ``fx`` acts at (radius, angle)."""

    x_mm: float
    fy: float = 0.0
    fz: float = 0.0
    fx: float = 0.0
    radius_mm: float = 0.0
    angle_deg: float = 0.0
    name: str = ""

    @property
    def offset_y_mm(self) -> float:
        """y of the point of application: r·cos θ."""
        return self.radius_mm * cosd(self.angle_deg)

    @property
    def offset_z_mm(self) -> float:
        """z of the point of application: r·sin θ."""
        return self.radius_mm * sind(self.angle_deg)


@dataclass(frozen=True, slots=True)
class ShaftLayout:
    """Bearing positions (mm), which bearing locates axially, and the loads on the shaft.

    ``locating`` is "A" or "B" when one bearing takes all the thrust (the other floats), or "both"
    for a paired set adjusted against each other, whose thrust split needs
    :func:`workbench.engine.pairs.share_thrust`.
    """

    bearing_a_mm: float
    bearing_b_mm: float
    locating: Locating
    loads: Sequence[PointLoad] = ()


@dataclass(frozen=True, slots=True)
class ShaftReactions:
    """Forces the bearings exert on the shaft (N), their radial loads, and the axial loads.

    ``thrust`` is the net external axial force on the shaft, positive toward +x; the locating
    bearing carries its magnitude as ``axial_a`` or ``axial_b``.  With ``locating == "both"`` the
    split is not a matter of statics and both axial loads are NaN (undefined).
    """

    a_y: float
    a_z: float
    b_y: float
    b_z: float
    radial_a: float
    radial_b: float
    thrust: float
    axial_a: float
    axial_b: float


@dataclass(frozen=True, slots=True)
class _LoadSums:
    span: float
    force_y: float
    force_z: float
    moment_xy: float  # Σ moments of the loads about the z axis through bearing A, N·mm
    moment_xz: float  # Σ moments of the loads about the y axis through bearing A, N·mm
    thrust: float


def _validated_sums(layout: ShaftLayout) -> _LoadSums:
    checked("bearing_a_position", layout.bearing_a_mm)
    checked("bearing_b_position", layout.bearing_b_mm)
    if layout.locating not in ("A", "B", "both"):
        raise InputError("locating_bearing", f"use 'A', 'B' or 'both', not {layout.locating!r}")
    span = layout.bearing_b_mm - layout.bearing_a_mm
    scale = max(abs(layout.bearing_a_mm), abs(layout.bearing_b_mm), 1.0)
    if abs(span) <= 1e-12 * scale:
        raise InputError("bearing_b_position", "bearings A and B are at the same axial position")
    if span < 0:
        raise InputError("bearing_b_position", "bearing B goes on the +x side of bearing A")
    force_y = force_z = moment_xy = moment_xz = thrust = 0.0
    for index, load in enumerate(layout.loads):
        label = load.name or f"load {index + 1}"
        for part, value in (("position", load.x_mm), ("Fy", load.fy), ("Fz", load.fz),
                            ("Fx", load.fx), ("angle", load.angle_deg)):
            checked(f"{label} {part}", value)
        checked(f"{label} radius", load.radius_mm, low=0.0)
        lever = load.x_mm - layout.bearing_a_mm
        force_y += load.fy
        force_z += load.fz
        thrust += load.fx
        moment_xy += lever * load.fy - load.offset_y_mm * load.fx
        moment_xz += load.offset_z_mm * load.fx - lever * load.fz
    return _LoadSums(span, force_y, force_z, moment_xy, moment_xz, thrust)


def solve_reactions(layout: ShaftLayout) -> ShaftReactions:
    """Bearing reactions of a two-bearing shaft by shaft statics (ΣF = 0, ΣM = 0, both planes)."""
    sums = _validated_sums(layout)
    b_y = -sums.moment_xy / sums.span
    b_z = sums.moment_xz / sums.span
    a_y = -sums.force_y - b_y
    a_z = -sums.force_z - b_z
    carried = abs(sums.thrust)
    axial_a = {"A": carried, "B": 0.0, "both": math.nan}[layout.locating]
    axial_b = {"A": 0.0, "B": carried, "both": math.nan}[layout.locating]
    return ShaftReactions(a_y, a_z, b_y, b_z, math.hypot(a_y, a_z), math.hypot(b_y, b_z),
                          sums.thrust, axial_a, axial_b)


def derivation_steps(layout: ShaftLayout, reactions: ShaftReactions) -> Derivation:
    """The free-body results of :func:`solve_reactions` as derivation steps (shaft statics)."""
    sums = _validated_sums(layout)
    record = Derivation()
    record.add("M_A_xy", sums.moment_xy, symbol="ΣM_A,xy",
               label="moment of the loads about A, x–y plane",
               formula="ΣM_A,xy = Σ(Fy,i·(xi − xA) − Fx,i·yi)", template="ΣM_A,xy = {0}",
               args=(sums.moment_xy,), unit="N·mm", source=SOURCE, result=False)
    record.add("R_By", reactions.b_y, symbol="R_B,y", label="reaction at B, y",
               formula="R_B,y = −ΣM_A,xy/(xB − xA)", template="R_B,y = −{0}/{1}",
               args=(sums.moment_xy, sums.span), unit="N", source=SOURCE)
    record.add("R_Ay", reactions.a_y, symbol="R_A,y", label="reaction at A, y",
               formula="R_A,y = −ΣFy,i − R_B,y", template="R_A,y = −({0}) − ({1})",
               args=(sums.force_y, reactions.b_y), unit="N", source=SOURCE)
    record.add("M_A_xz", sums.moment_xz, symbol="ΣM_A,xz",
               label="moment of the loads about A, x–z plane",
               formula="ΣM_A,xz = Σ(Fx,i·zi − Fz,i·(xi − xA))", template="ΣM_A,xz = {0}",
               args=(sums.moment_xz,), unit="N·mm", source=SOURCE, result=False)
    record.add("R_Bz", reactions.b_z, symbol="R_B,z", label="reaction at B, z",
               formula="R_B,z = ΣM_A,xz/(xB − xA)", template="R_B,z = {0}/{1}",
               args=(sums.moment_xz, sums.span), unit="N", source=SOURCE)
    record.add("R_Az", reactions.a_z, symbol="R_A,z", label="reaction at A, z",
               formula="R_A,z = −ΣFz,i − R_B,z", template="R_A,z = −({0}) − ({1})",
               args=(sums.force_z, reactions.b_z), unit="N", source=SOURCE)
    record.add("Fr_A", reactions.radial_a, symbol="Fr,A", label="radial load on bearing A",
               formula="Fr,A = √(R_A,y² + R_A,z²)", template="Fr,A = √({0}² + {1}²)",
               args=(reactions.a_y, reactions.a_z), unit="N", source=SOURCE)
    record.add("Fr_B", reactions.radial_b, symbol="Fr,B", label="radial load on bearing B",
               formula="Fr,B = √(R_B,y² + R_B,z²)", template="Fr,B = √({0}² + {1}²)",
               args=(reactions.b_y, reactions.b_z), unit="N", source=SOURCE)
    record.add("F_thrust", reactions.thrust, symbol="ΣFx",
               label="net external thrust on the shaft, + toward B", formula="ΣFx = ΣFx,i",
               template="ΣFx = {0}", args=(sums.thrust,), unit="N", source=SOURCE)
    if layout.locating == "both":
        note = "paired bearings adjusted against each other: split by the paired-bearing thrust rule"
    else:
        note = f"bearing {layout.locating} locates and carries |ΣFx|; the other floats"
    record.add("Fa_A", reactions.axial_a, symbol="Fa,A", label="axial load on bearing A",
               formula="Fa,A from the locating arrangement", template="Fa,A = {0}",
               args=(reactions.axial_a,), unit="N", source=SOURCE, note=note)
    record.add("Fa_B", reactions.axial_b, symbol="Fa,B", label="axial load on bearing B",
               formula="Fa,B from the locating arrangement", template="Fa,B = {0}",
               args=(reactions.axial_b,), unit="N", source=SOURCE, note=note)
    return record


@dataclass(frozen=True, slots=True, kw_only=True)
class ShaftElement:
    """A gear or pulley on the shaft, in engine units (mm, degrees).

    ``diameter_mm`` is the pitch diameter (spur), the transverse pitch diameter (helical), the
    mean pitch diameter (straight bevel) or the pulley diameter.  ``mesh_angle_deg`` is the
    direction, from +y toward +z, from the shaft's axis toward the mating gear or the other
    pulley.  ``share`` is the fraction of the shaft's torque this element carries.  The gears need
    ``pressure_angle_deg`` (the normal one for a helical gear) and ``driving``; a helical gear
    also ``helix_angle_deg`` and ``hand``, a bevel gear ``pitch_cone_angle_deg`` and ``apex`` (the
    side, "A" or "B", on which its pitch-cone apex lies).  A pulley may give ``pull_factor``
    (default the V-belt value).
    """

    name: str
    kind: ElementKind
    position_mm: float
    diameter_mm: float
    mesh_angle_deg: float
    pressure_angle_deg: float | None = None
    helix_angle_deg: float | None = None
    hand: Literal["left", "right"] | None = None
    driving: bool | None = None
    pitch_cone_angle_deg: float | None = None
    apex: Literal["A", "B"] | None = None
    pull_factor: float | None = None
    share: float = 1.0


def shaft_torque(d: Derivation, *, power_W: float | None, torque_Nm: float | None,
                 speed_rpm: float) -> float:
    """The torque through the shaft in N·m, with its step: as given, or T = P/ω with
    ω = 2π·n/60 (P in W, n in r/min)."""
    if torque_Nm is not None:
        return d.add("T", torque_Nm, symbol="T", label="Torque through the shaft",
                     formula="given", template="{0}", args=(torque_Nm,), unit="N·m",
                     source="input")
    assert power_W is not None
    value = torque_from_power(power_W, speed_rpm)
    return d.add("T", value, symbol="T", label="Torque through the shaft",
                 formula="T = P/(2π·n/60)", template="{0} / (2π × {1} / 60)",
                 args=(power_W, speed_rpm), unit="N·m", source=TORQUE_SOURCE)


_Input = TypeVar("_Input")


def _gear_input(value: _Input | None, field_name: str, kind: ElementKind) -> _Input:
    """An input ``kind`` needs (the model's shaft table checks it is there); an InputError
    naming it where it is not."""
    if value is None:
        raise InputError(field_name, f"a {kind} gear needs its {field_name.replace('_', ' ')}")
    return value


def element_load(d: Derivation, element: ShaftElement, torque_Nm: float, *,
                 rotation: int) -> PointLoad:
    """The force of a gear mesh or a belt on the shaft as a point load, with its steps.

    Gear-force relations (spur, helical, straight bevel; :mod:`workbench.engine.gears`) at the
    element's share of ``torque_Nm``, resolved in the shaft frame by
    :func:`~workbench.engine.gears.mesh_force_components`; a pulley's pull F = f·2T/D points at
    the mesh angle.  ``rotation`` is +1 or −1 about +x.  Forces in N, positions in mm.
    """
    name, theta = element.name, element.mesh_angle_deg
    torque = torque_Nm
    if element.share != 1.0:
        torque = d.add(f"T[{name}]", element.share * torque_Nm, symbol=f"T,{name}",
                       label=f"Torque carried by {name}", formula="share·T", template="{0} × {1}",
                       args=(element.share, torque_Nm), unit="N·m", source="input", result=False)
    if element.kind == "pulley":
        return _pulley_load(d, element, torque)
    pressure_angle = _gear_input(element.pressure_angle_deg, "pressure_angle", element.kind)
    if element.kind == "spur":
        forces = spur_forces(torque, element.diameter_mm, pressure_angle)
        source, fx = SPUR_SOURCE, 0.0
        radial_formula, radial_template = "Wt·tan αn", "{0} × tan {1}°"
        angles: tuple[float, ...] = (pressure_angle,)
    elif element.kind == "helical":
        helix_angle = _gear_input(element.helix_angle_deg, "helix_angle", element.kind)
        forces = helical_forces(torque, element.diameter_mm, pressure_angle, helix_angle,
                                _gear_input(element.hand, "hand", element.kind),
                                bool(element.driving), rotation=rotation)
        source, fx = HELICAL_SOURCE, forces.axial
        radial_formula, radial_template = "Wt·tan αn/cos β", "{0} × tan {1}° / cos {2}°"
        angles = (pressure_angle, helix_angle)
    else:
        cone_angle = _gear_input(element.pitch_cone_angle_deg, "pitch_cone_angle", element.kind)
        forces = straight_bevel_forces(torque, element.diameter_mm, pressure_angle, cone_angle)
        source, fx = BEVEL_SOURCE, bevel_axial_load(forces.axial,
                                                    _gear_input(element.apex, "apex", element.kind))
        radial_formula, radial_template = "Wt·tan αn·cos γ", "{0} × tan {1}° × cos {2}°"
        angles = (pressure_angle, cone_angle)
    d.add(f"Wt[{name}]", forces.tangential, symbol=f"Wt,{name}",
          label=f"Tangential load of {name}", formula="Wt = 2T/d",
          template="2 × {0:=N·mm+} / {1:=mm+}", args=(N_MM_PER_N_M * torque, element.diameter_mm),
          unit="N", source=source, result=False)
    d.add(f"Wr[{name}]", forces.radial, symbol=f"Wr,{name}", label=f"Radial load of {name}",
          formula=radial_formula, template=radial_template, args=(forces.tangential, *angles),
          unit="N", source=source, note="toward the axis", result=False)
    if element.kind == "helical":
        role = "driving" if element.driving else "driven"
        d.add(f"Wa[{name}]", fx, symbol=f"Wa,{name}", label=f"Axial load of {name}, + toward B",
              formula="±Wt·tan β", template="({2}) × {0} × tan {1}°",
              args=(forces.tangential, helix_angle, math.copysign(1.0, fx)),
              unit="N", source=source,
              note=f"{element.hand} hand, {role}, rotation {'+' if rotation > 0 else '−'}: "
                   f"thrust toward {'B' if fx >= 0 else 'A'}",
              result=False)
    elif element.kind == "bevel":
        d.add(f"Wa[{name}]", fx, symbol=f"Wa,{name}", label=f"Axial load of {name}, + toward B",
              formula="±Wt·tan αn·sin γ", template="({3}) × {0} × tan {1}° × sin {2}°",
              args=(forces.tangential, *angles, math.copysign(1.0, fx)), unit="N", source=source,
              note=f"apex on the {element.apex} side: thrust away from it", result=False)
    fy, fz = mesh_force_components(forces.tangential, forces.radial, theta, rotation=rotation,
                                   driving=bool(element.driving))
    along = float(-rotation if element.driving else rotation)
    role_words = ("against the mesh-point motion (driving)" if element.driving
                  else "with the mesh-point motion (driven)")
    d.add(f"Fy[{name}]", fy, symbol=f"Fy,{name}", label=f"Force of {name}, y",
          formula="−Wr·cos θ ∓ Wt·sin θ", template="−{0} × cos {2}° − ({3}) × {1} × sin {2}°",
          args=(forces.radial, forces.tangential, theta, along), unit="N",
          source=RESOLVE_SOURCE, note=f"Wr toward the axis; Wt {role_words}", result=False)
    d.add(f"Fz[{name}]", fz, symbol=f"Fz,{name}", label=f"Force of {name}, z",
          formula="−Wr·sin θ ± Wt·cos θ", template="−{0} × sin {2}° + ({3}) × {1} × cos {2}°",
          args=(forces.radial, forces.tangential, theta, along), unit="N",
          source=RESOLVE_SOURCE, result=False)
    return PointLoad(element.position_mm, fy, fz, fx, element.diameter_mm / 2.0, theta, name)


def _pulley_load(d: Derivation, element: ShaftElement, torque_Nm: float) -> PointLoad:
    """A belt or chain pull F = f·2T/D on the shaft at the mesh angle, with its steps."""
    name, theta = element.name, element.mesh_angle_deg
    factor = V_BELT_PULL_FACTOR if element.pull_factor is None else element.pull_factor
    pull = belt_pull(torque_Nm, element.diameter_mm, factor, theta)
    low, high = BELT_PULL_FACTORS["v_belt"][1]
    note = None if element.pull_factor is not None else (
        f"no pull factor given: the V-belt value {V_BELT_PULL_FACTOR:g} (spread {low:g}–{high:g})")
    d.add(f"F[{name}]", pull.force, symbol=f"F,{name}", label=f"Belt pull of {name}",
          formula="F = f·2T/D", template="{0} × 2 × {1:=N·mm+} / {2:=mm+}",
          args=(factor, N_MM_PER_N_M * torque_Nm, element.diameter_mm), unit="N", source=PULLEY_SOURCE,
          note=note, result=False)
    d.add(f"Fy[{name}]", pull.fy, symbol=f"Fy,{name}", label=f"Pull of {name}, y",
          formula="F·cos θ", template="{0} × cos {1}°", args=(pull.force, theta), unit="N",
          source=RESOLVE_SOURCE, result=False)
    d.add(f"Fz[{name}]", pull.fz, symbol=f"Fz,{name}", label=f"Pull of {name}, z",
          formula="F·sin θ", template="{0} × sin {1}°", args=(pull.force, theta), unit="N",
          source=RESOLVE_SOURCE, result=False)
    return PointLoad(element.position_mm, pull.fy, pull.fz, 0.0, 0.0, theta, name)
