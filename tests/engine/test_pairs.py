"""Induced axial components and the two-bearing thrust-sharing rule, cases worked by hand."""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from workbench.engine.kinds import Arrangement, Kind
from workbench.engine.pairs import (
    PairBearing,
    induced_thrust,
    induced_thrust_angular_contact,
    induced_thrust_tapered,
    paired_axial_loads,
    receiving_bearing,
    share_thrust,
)
from workbench.engine.record import Derivation, InputError


def test_induced_thrust_tapered_iso_form() -> None:
    # ISO form Fi = Fr/(2Y): Fr = 6000 N, Y = 1.6 → 6000/3.2 = 1875 N.
    assert induced_thrust_tapered(6000.0, 1.6) == pytest.approx(1875.0, rel=1e-12)


def test_induced_thrust_angular_contact_default_and_override() -> None:
    # Fi = e·Fr, common practice (from memory); e = 1.14 (40° row of REFERENCE.md §2):
    # 4000·1.14 = 4560 N.  A maker's factor 1.2 overrides e: 4000·1.2 = 4800 N.
    assert induced_thrust_angular_contact(4000.0, 1.14) == pytest.approx(4560.0, rel=1e-12)
    assert induced_thrust_angular_contact(4000.0, 1.14, factor=1.2) == pytest.approx(4800.0, rel=1e-12)


# (mounting, Ka, Fi,A, Fi,B, expected Fa,A, Fa,B), each worked by hand from the rule
# "receiving bearing R (the one resisting Ka's direction), other bearing O:
#  Fi,O + Ka ≥ Fi,R → Fa,O = Fi,O, Fa,R = Fi,O + Ka;  else Fa,R = Fi,R, Fa,O = Fi,R − Ka".
HAND_CASES = [
    # O, thrust toward B → A receives.  Fi,B + Ka = 1500 + 1000 = 2500 ≥ Fi,A = 2000:
    # Fa,B = 1500, Fa,A = 2500.
    ("O", 1000.0, 2000.0, 1500.0, 2500.0, 1500.0),
    # O, toward B.  2500 < Fi,A = 3000: Fa,A = 3000, Fa,B = 3000 − 1000 = 2000.
    ("O", 1000.0, 3000.0, 1500.0, 3000.0, 2000.0),
    # O, thrust toward A → B receives.  Fi,A + Ka = 1500 + 1000 = 2500 ≥ Fi,B = 2000:
    # Fa,A = 1500, Fa,B = 2500.
    ("O", -1000.0, 1500.0, 2000.0, 1500.0, 2500.0),
    # O, toward A.  2500 < Fi,B = 3000: Fa,B = 3000, Fa,A = 3000 − 1000 = 2000.
    ("O", -1000.0, 1500.0, 3000.0, 2000.0, 3000.0),
    # X, thrust toward B → B receives.  Fi,A + Ka = 1500 + 1000 = 2500 ≥ Fi,B = 2000:
    # Fa,A = 1500, Fa,B = 2500.
    ("X", 1000.0, 1500.0, 2000.0, 1500.0, 2500.0),
    # X, toward B.  2500 < Fi,B = 3000: Fa,B = 3000, Fa,A = 3000 − 1000 = 2000.
    ("X", 1000.0, 1500.0, 3000.0, 2000.0, 3000.0),
    # X, thrust toward A → A receives.  Fi,B + Ka = 1500 + 1000 = 2500 ≥ Fi,A = 2000:
    # Fa,B = 1500, Fa,A = 2500.
    ("X", -1000.0, 2000.0, 1500.0, 2500.0, 1500.0),
    # X, toward A.  2500 < Fi,A = 3000: Fa,A = 3000, Fa,B = 3000 − 1000 = 2000.
    ("X", -1000.0, 3000.0, 1500.0, 3000.0, 2000.0),
]


@pytest.mark.parametrize("mounting, ka, fi_a, fi_b, fa_a, fa_b", HAND_CASES)
def test_hand_worked_cases(mounting: str, ka: float, fi_a: float, fi_b: float,
                           fa_a: float, fa_b: float) -> None:
    got_a, got_b, explanation = share_thrust(5000.0, 5000.0, fi_a, fi_b, ka, mounting)
    assert (got_a, got_b) == (pytest.approx(fa_a, rel=1e-12), pytest.approx(fa_b, rel=1e-12))
    receiver = receiving_bearing(ka, mounting)
    assert f"resisted by bearing {receiver}" in explanation
    assert ("toward B" if ka > 0 else "toward A") in explanation


def test_receiving_bearing_by_geometry() -> None:
    # Contact lines meeting the axis outside the span (O): each bearing pushes the shaft away from
    # the other, so a push toward B is held by A.  Inside the span (X): held by B.
    assert receiving_bearing(1.0, "O") == "A" and receiving_bearing(-1.0, "O") == "B"
    assert receiving_bearing(1.0, "X") == "B" and receiving_bearing(-1.0, "X") == "A"


def test_no_external_thrust_both_carry_the_larger_induced_component() -> None:
    # Ka = 0: Fa,A = Fa,B = max(Fi,A, Fi,B) (shaft axial equilibrium, each Fa ≥ its own Fi).
    for mounting in ("O", "X"):
        fa_a, fa_b, _ = share_thrust(4000.0, 2000.0, 1250.0, 625.0, 0.0, mounting)
        assert (fa_a, fa_b) == (1250.0, 1250.0)


induced = st.floats(0.0, 1e5)


@settings(max_examples=200, deadline=None)
@given(fi_a=induced, fi_b=induced, ka=st.floats(-1e5, 1e5), mounting=st.sampled_from(["O", "X"]))
def test_rule_satisfies_equilibrium(fi_a: float, fi_b: float, ka: float, mounting: str) -> None:
    # Shaft axial equilibrium: Fa,receiving − Fa,other = |Ka|, each Fa ≥ its Fi, and one bearing
    # carries exactly its own Fi (the pair is just seated, not preloaded).
    fa_a, fa_b, _ = share_thrust(1e4, 1e4, fi_a, fi_b, ka, mounting)
    fa = {"A": fa_a, "B": fa_b}
    receiver = receiving_bearing(ka, mounting)
    other = "B" if receiver == "A" else "A"
    tolerance = 1e-9 * (fi_a + fi_b + abs(ka) + 1.0)
    assert fa[receiver] - fa[other] == pytest.approx(abs(ka), abs=tolerance)
    assert fa_a >= fi_a - tolerance and fa_b >= fi_b - tolerance
    assert min(abs(fa_a - fi_a), abs(fa_b - fi_b)) <= tolerance
    # mirror image: swapping A and B and reversing the thrust swaps the answers
    mirror_b, mirror_a, _ = share_thrust(1e4, 1e4, fi_b, fi_a, -ka, mounting)
    if ka != 0.0:
        assert (mirror_a, mirror_b) == (pytest.approx(fa_a), pytest.approx(fa_b))


def test_explanation_reports_fa_over_fr() -> None:
    _, _, explanation = share_thrust(5000.0, 0.0, 2000.0, 0.0, 1000.0, "X")
    # X, toward B: Fi,A + Ka = 3000 ≥ Fi,B = 0 → Fa,A = 2000, Fa,B = 3000; Fa,A/Fr,A = 0.4, B has no Fr.
    assert "Fa,A/Fr,A = 0.4" in explanation and "Fa,B/Fr,B = ∞" in explanation


@pytest.mark.parametrize("args, field", [
    ((-1.0, 1.0, 1.0, 1.0, 0.0, "O"), "radial_load_A"),
    ((1.0, 1.0, 1.0, -1.0, 0.0, "O"), "induced_thrust_B"),
    ((1.0, 1.0, 1.0, 1.0, math.inf, "O"), "external_thrust"),
    ((1.0, 1.0, 1.0, 1.0, 0.0, "tandem"), "mounting"),
])
def test_bad_input(args: tuple, field: str) -> None:
    with pytest.raises(InputError) as caught:
        share_thrust(*args)
    assert caught.value.field == field
    with pytest.raises(InputError):
        induced_thrust_tapered(1000.0, 0.0)


# ---- a pair on a shaft -------------------------------------------------------------------------
def _taper(y: float) -> PairBearing:
    return PairBearing(kind=Kind.TAPERED, arrangement=Arrangement.SINGLE, alpha_deg=15.0,
                       c0=60_000.0, e_given=0.4, y_given=y)


@pytest.mark.parametrize("mounting", ["O", "X"])
@pytest.mark.parametrize("thrust", [-900.0, 0.0, 250.0, 2500.0])
def test_paired_axial_loads_of_a_tapered_pair(mounting: str, thrust: float) -> None:
    # ISO form Fi = Fr/(2Y) with the maker's Y (1.6 at A, 1.8 at B), then the rule as share_thrust
    # gives it; the steps carry Y, Fi and Fa of each side.
    d = Derivation()
    fa = paired_axial_loads(d, {"A": _taper(1.6), "B": _taper(1.8)}, {"A": 4000.0, "B": 2500.0},
                            thrust, mounting)  # type: ignore[arg-type]
    expected = share_thrust(4000.0, 2500.0, 4000.0 / 3.2, 2500.0 / 3.6, thrust,
                            mounting)  # type: ignore[arg-type]
    assert (fa["A"], fa["B"]) == (pytest.approx(expected[0], rel=1e-12),
                                  pytest.approx(expected[1], rel=1e-12))
    assert d.results["Fi_B"] == pytest.approx(2500.0 / 3.6, rel=1e-12)
    assert d.results["Y_A"] == 1.6
    assert d.step("Fa_A").note == expected[2]
    assert not d.warnings


def test_induced_thrust_of_an_angular_contact_bearing_uses_e() -> None:
    # Fi = e·Fr (common practice) with e = 1.14 for 40° (ISO 281 Table 3 as quoted in
    # REFERENCE.md §2, from memory): 3000·1.14 = 3420 N.
    bearing = PairBearing(kind=Kind.ANGULAR_CONTACT, arrangement=Arrangement.SINGLE,
                          alpha_deg=40.0, c0=30_000.0)
    factor, fi, _ = induced_thrust(bearing, 3000.0, 0.0)
    assert factor == pytest.approx(1.14)
    assert fi == pytest.approx(3420.0, rel=1e-12)
