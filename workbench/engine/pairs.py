"""Axial loads of two angular-contact or tapered-roller bearings adjusted against each other.

Under radial load a bearing with contact angle α > 0 pushes its rings apart axially: the induced
axial component Fi.  With two such bearings locating a shaft in opposite directions, each
bearing's axial load is at least its own Fi, and together with the external thrust Ka they must
balance on the shaft.  Axial equilibrium of the shaft under that condition gives the usual
two-bearing thrust-sharing rule (tapered: Fi = Fr/(2Y), the ISO form):

* the *receiving* bearing is the one that resists the direction in which Ka pushes the shaft;
* if Fi,other + Ka ≥ Fi,receiving: Fa,other = Fi,other and Fa,receiving = Fi,other + Ka;
* otherwise: Fa,receiving = Fi,receiving and Fa,other = Fi,receiving − Ka.

Mountings, defined by geometry (names for them differ between sources, so the geometry rules):

* ``"O"`` — back-to-back (direct): the contact lines meet the axis *outside* the bearing span.
  Each bearing pushes the shaft away from the other bearing, so a thrust on the shaft toward B
  is taken by A, and a thrust toward A by B.
* ``"X"`` — face-to-face (indirect): the contact lines meet the axis *inside* the span; a thrust
  toward B is taken by B, a thrust toward A by A.

Sign of the external thrust: ``external_thrust > 0`` pushes the shaft from A toward B (the +x
direction of :mod:`workbench.engine.shaft`, where A lies at the smaller x); ``< 0`` toward A.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Literal

from .gears import checked
from .kinds import Arrangement, DynamicFactors, Kind, dynamic_factors
from .num import NumT, safe_ratio
from .record import Derivation, InputError, fmt

Mounting = Literal["O", "X"]
MOUNTING_NAMES = {"O": "back-to-back (O)", "X": "face-to-face (X)"}
SIDES = ("A", "B")
TAPERED_SOURCE = "induced axial component of a tapered roller bearing, Fi = Fr/(2Y) (ISO form)"
ANGULAR_SOURCE = "induced axial component of an angular-contact ball bearing, Fi = e·Fr (common practice)"
SHARING_SOURCE = "two-bearing thrust-sharing rule: shaft axial equilibrium with each Fa ≥ its Fi"
PAIR_ITERATIONS = 100


def induced_thrust_tapered(fr: NumT, y: NumT) -> NumT:
    """Induced axial component of a single-row tapered roller bearing, Fi = Fr/(2Y).

    ISO-form relation with Y the bearing's axial load factor for Fa/Fr > e (ISO 281:2007 §6
    equivalent-load factors).
    """
    checked("radial_load", fr, low=0.0)
    checked("Y", y, low=0.0, low_open=True)
    return fr / (2.0 * y)


def induced_thrust_angular_contact(fr: NumT, e: NumT, *, factor: NumT | None = None) -> NumT:
    """Induced axial component of a single-row angular-contact ball bearing, Fi = e·Fr.

    Taking the limiting ratio e of ISO 281:2007 Table 3 as the factor is common practice (from
    memory); pass ``factor`` to use the maker's own factor instead of e.
    """
    checked("radial_load", fr, low=0.0)
    ratio = checked("e", e, low=0.0, low_open=True) if factor is None else checked(
        "induced_thrust_factor", factor, low=0.0)
    return ratio * fr


def receiving_bearing(external_thrust: float, mounting: Mounting) -> Literal["A", "B"]:
    """The bearing of the pair that resists the external thrust's direction (see module notes)."""
    toward_b = external_thrust >= 0.0
    if mounting == "O":
        return "A" if toward_b else "B"
    return "B" if toward_b else "A"


def share_thrust(fr_a: float, fr_b: float, induced_a: float, induced_b: float,
                 external_thrust: float, mounting: Mounting) -> tuple[float, float, str]:
    """Axial loads (Fa,A, Fa,B) of a bearing pair and a sentence saying which case applied.

    The two-bearing thrust-sharing rule for paired angular-contact or tapered roller bearings
    (shaft axial equilibrium with each Fa ≥ its own Fi), in ``mounting`` "O" or "X";
    ``external_thrust`` > 0 pushes the shaft toward B.  Forces in N.
    """
    for name, value in (("radial_load_A", fr_a), ("radial_load_B", fr_b),
                        ("induced_thrust_A", induced_a), ("induced_thrust_B", induced_b)):
        checked(name, value, low=0.0)
    checked("external_thrust", external_thrust)
    if mounting not in MOUNTING_NAMES:
        raise InputError("mounting", f"use 'O' (back-to-back) or 'X' (face-to-face), not {mounting!r}")

    receiver = receiving_bearing(external_thrust, mounting)
    other = "B" if receiver == "A" else "A"
    induced = {"A": induced_a, "B": induced_b}
    ka = abs(external_thrust)
    toward = "B" if external_thrust >= 0.0 else "A"
    if induced[other] + ka >= induced[receiver]:
        fa = {other: induced[other], receiver: induced[other] + ka}
        case = (f"Fi,{other} + Ka = {fmt(induced[other])} + {fmt(ka)} ≥ Fi,{receiver} = "
                f"{fmt(induced[receiver])}: bearing {other} carries its own induced thrust, "
                f"Fa,{other} = {fmt(fa[other])} N; bearing {receiver} carries "
                f"Fa,{receiver} = Fi,{other} + Ka = {fmt(fa[receiver])} N")
    else:
        fa = {receiver: induced[receiver], other: induced[receiver] - ka}
        case = (f"Fi,{other} + Ka = {fmt(induced[other])} + {fmt(ka)} < Fi,{receiver} = "
                f"{fmt(induced[receiver])}: bearing {receiver} carries its own induced thrust, "
                f"Fa,{receiver} = {fmt(fa[receiver])} N; bearing {other} carries "
                f"Fa,{other} = Fi,{receiver} − Ka = {fmt(fa[other])} N")
    ratios = ", ".join(
        f"Fa,{side}/Fr,{side} = {fmt(safe_ratio(fa[side], fr))}"
        for side, fr in (("A", fr_a), ("B", fr_b)))
    explanation = (f"{MOUNTING_NAMES[mounting]}, external thrust Ka = {fmt(ka)} N toward {toward} "
                   f"is resisted by bearing {receiver}. {case}. {ratios}.")
    return fa["A"], fa["B"], explanation


@dataclass(frozen=True, slots=True, kw_only=True)
class PairBearing:
    """What the induced thrust of one bearing of a pair needs: its kind, arrangement and contact
    angle (degrees), C0 (N), and the f0, e and Y the maker gives (None when not given)."""

    kind: Kind
    arrangement: Arrangement
    alpha_deg: float
    c0: float
    f0: float | None = None
    e_given: float | None = None
    y_given: float | None = None


def induced_thrust(bearing: PairBearing, fr: float, fa: float) -> tuple[float, float, DynamicFactors[float]]:
    """(factor, Fi, factors) of one bearing of a pair at radial load ``fr`` and axial load ``fa``.

    A tapered roller bearing takes Fi = Fr/(2Y) with Y its Fa/Fr > e factor as
    :func:`~workbench.engine.kinds.dynamic_factors` gives it (the maker's Y, else 0.4·cot α); an
    angular-contact ball bearing Fi = e·Fr with its ISO 281:2007 Table 3 e, which for the 15° rows
    depends on ``fa`` (common practice).  Forces in N.
    """
    factors = dynamic_factors(bearing.kind, bearing.arrangement, bearing.alpha_deg, fa, bearing.c0,
                              bearing.f0, bearing.e_given, bearing.y_given)
    if bearing.kind is Kind.TAPERED:
        return factors.y_high, induced_thrust_tapered(fr, factors.y_high), factors
    return factors.e, induced_thrust_angular_contact(fr, factors.e), factors


def paired_axial_loads(d: Derivation, bearings: Mapping[str, PairBearing],
                       radial: Mapping[str, float], external_thrust: float,
                       mounting: Mounting) -> dict[str, float]:
    """Fa of each bearing ("A", "B") of a pair adjusted against each other, with the steps.

    The induced thrusts (:func:`induced_thrust`) and the two-bearing thrust-sharing rule
    (:func:`share_thrust`).  Where e depends on the bearing's own axial load (15° angular
    contact) the loads are found by fixed-point iteration from Fa = 0, which rises monotonically
    because e grows with Fa; a warning says so if it has not settled after
    :data:`PAIR_ITERATIONS` rounds.  ``radial`` holds Fr per side; forces in N.
    """
    fa = {"A": 0.0, "B": 0.0}
    for _ in range(PAIR_ITERATIONS):
        induced = {side: induced_thrust(bearings[side], radial[side], fa[side]) for side in SIDES}
        fa_a, fa_b, explanation = share_thrust(radial["A"], radial["B"], induced["A"][1],
                                               induced["B"][1], external_thrust, mounting)
        settled = max(abs(fa_a - fa["A"]), abs(fa_b - fa["B"])) <= 1e-9 * max(fa_a, fa_b, 1.0)
        fa = {"A": fa_a, "B": fa_b}
        if settled:
            break
    warning = None if settled else (
        f"the axial loads of the pair did not settle in {PAIR_ITERATIONS} rounds (e depends on Fa)")
    for side in SIDES:
        factor, fi, factors = induced[side]
        if bearings[side].kind is Kind.TAPERED:
            d.add(f"Y_{side}", factor, symbol=f"Y,{side}",
                  label=f"Axial factor of bearing {side} (Fa/Fr > e)", formula=factors.basis,
                  template="{0}", args=(factor,), source=factors.source,
                  note="the Y of the bearing's own derivation on the Fa/Fr > e branch")
            d.add(f"Fi_{side}", fi, symbol=f"Fi,{side}", label=f"Induced thrust of bearing {side}",
                  formula="Fr/(2Y)", template="{0} / (2 × {1})", args=(radial[side], factor),
                  unit="N", source=TAPERED_SOURCE)
        else:
            d.add(f"e_{side}", factor, symbol=f"e,{side}",
                  label=f"Limit ratio e of bearing {side}", formula=factors.basis, template="{0}",
                  args=(factor,), source=factors.source,
                  note="at the bearing's own Fa" if factors.index_formula else None)
            d.add(f"Fi_{side}", fi, symbol=f"Fi,{side}", label=f"Induced thrust of bearing {side}",
                  formula="e·Fr", template="{0} × {1}", args=(factor, radial[side]), unit="N",
                  source=ANGULAR_SOURCE)
    for side in SIDES:
        d.add(f"Fa_{side}", fa[side], symbol=f"Fa,{side}", label=f"Axial load on bearing {side}",
              formula="thrust-sharing rule", template="{0}", args=(fa[side],), unit="N",
              source=SHARING_SOURCE, warning=warning if side == "B" else None, note=explanation)
    return fa
