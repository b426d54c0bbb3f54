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
from typing import Literal, NamedTuple, Sequence

from .gears import checked
from .num import cosd, sind
from .record import Derivation, InputError

Locating = Literal["A", "B", "both"]
SOURCE = "shaft statics, ΣF = 0, ΣM = 0"


class PointLoad(NamedTuple):
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


class ShaftLayout(NamedTuple):
    """Bearing positions (mm), which bearing locates axially, and the loads on the shaft.

    ``locating`` is "A" or "B" when one bearing takes all the thrust (the other floats), or "both"
    for a paired set adjusted against each other, whose thrust split needs
    :func:`workbench.engine.pairs.share_thrust`.
    """

    bearing_a_mm: float
    bearing_b_mm: float
    locating: Locating
    loads: Sequence[PointLoad] = ()


class ShaftReactions(NamedTuple):
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


class _LoadSums(NamedTuple):
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
