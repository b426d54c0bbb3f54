"""Duty cycles and shaft system life: Palmgren–Miner by hand, share conversion, Weibull series.

References outside the module: ISO 281:2007 L10 = (C/P)³ for a ball bearing (P = Fr at Fa = 0,
a1 = 1 at R = 90 %, Table 12), the Palmgren–Miner rule 1/L = Σ ui/Li worked by hand, the
series-system closed form L_sys = (Σ L_i^−e)^(−1/e) and ``scipy.stats.weibull_min`` for the same
system's survival.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.stats import weibull_min

from workbench.model.duty_cycles import (
    DutyCycle,
    duty_cycle_from_table,
    duty_cycle_to_table,
    duty_cycles_from_tables,
    duty_life,
    shaft_cycles,
    system_life,
    weibull_slope,
)
from workbench.model.fields import FieldError
from workbench.model.session import Bearing, LoadCase, Session
from workbench.model.shafts import Element, OperatingState, Shaft, generated_cases

# An invented three-state duty on an invented ball bearing (C = 30 kN): radial loads (N), time
# shares and speeds (r/min).  Fa = 0, so P = Fr; no lubrication data, so aISO = 1; R = 0.90, a1 = 1.
LOADS = (4000.0, 6000.0, 2000.0)
TIME_SHARES = ("0.5", "0.3", "0.2")
SPEEDS = (1000.0, 500.0, 1500.0)


def three_state_session() -> Session:
    cases = [LoadCase(f"state {i}", "ball", {"fr": f"{fr:g} N", "fa": "0 N", "speed": f"{n:g} rpm"})
             for i, (fr, n) in enumerate(zip(LOADS, SPEEDS), start=1)]
    bearings = [Bearing("ball", {"kind": "deep-groove", "c": "30 kN", "c0": "20 kN"}),
                Bearing("other", {"kind": "deep-groove", "c": "20 kN", "c0": "12 kN"}),
                Bearing("roller", {"kind": "cylindrical", "c": "60 kN", "c0": "55 kN"})]
    cases.append(LoadCase("elsewhere", "other", {"fr": "1 kN", "speed": "1000 rpm"}))
    cases.append(LoadCase("stricter", "ball", {"fr": "1 kN", "speed": "1000 rpm",
                                               "reliability": "0.99"}))
    return Session(bearings=bearings, cases=cases)


def time_cycle() -> DutyCycle:
    return DutyCycle("shift", [(f"state {i}", share) for i, share in enumerate(TIME_SHARES, 1)])


def test_three_state_miner_life_by_hand() -> None:
    # ISO 281 L10 = (C/P)³: Li = (30/4)³ = 421.875, (30/6)³ = 125, (30/2)³ = 3375 (10⁶ rev).
    # Revolutions per unit time ti·ni = 500, 150, 300 (Σ 950) → ui = 500/950, 150/950, 300/950.
    # 1/L = Σ ui/Li = (1.18518 + 1.2 + 0.08889)·10⁻³/0.95 = 2.60429·10⁻³ → L = 383.98·10⁶ rev.
    # Mean speed nm = Σ ti·ni = 950 r/min → Lh = 383.98·10⁶/(60·950) = 6736.5 h.
    # Damage shares ∝ ui/Li: 0.47904, 0.48503, 0.03593.
    result = duty_life(three_state_session(), time_cycle())
    lives = [(30_000.0 / p) ** 3 for p in LOADS]
    u = [500 / 950, 150 / 950, 300 / 950]
    assert result.lives_mrev == pytest.approx(lives, rel=1e-12)
    assert result.revolution_shares == pytest.approx(u, rel=1e-12)
    assert result.life_mrev == pytest.approx(1.0 / sum(ui / li for ui, li in zip(u, lives)),
                                             rel=1e-12)
    assert result.life_mrev == pytest.approx(383.98, abs=0.01)
    assert result.mean_speed == pytest.approx(950.0, rel=1e-12)
    assert result.life_h == pytest.approx(6736.5, abs=0.1)
    assert result.damage_shares == pytest.approx([0.47904, 0.48503, 0.03593], abs=1e-5)
    assert result.bearing == "ball"
    d = result.derivation
    assert d.step("L").source == "Palmgren–Miner rule, 1/L = Σ ui/Li"
    assert d.results["L_h"] == result.life_h and d.results["D[2]"] == result.damage_shares[1]


def test_revolution_shares_give_the_same_duty() -> None:
    # By hand: the time shares 0.5, 0.3, 0.2 at 1000, 500, 1500 r/min make 500, 150, 300
    # revolutions per unit time.  Given as revolution shares they are the same duty, and the mean
    # speed from them is nm = 1/Σ(ui/ni) = 950/(0.5 + 0.3 + 0.2) = 950 r/min.
    session = three_state_session()
    by_time = duty_life(session, time_cycle())
    by_revolutions = duty_life(session, DutyCycle(
        "shift", [("state 1", "500"), ("state 2", "150"), ("state 3", "300")], "revolutions"))
    assert by_revolutions.life_mrev == pytest.approx(by_time.life_mrev, rel=1e-12)
    assert by_revolutions.mean_speed == pytest.approx(950.0, rel=1e-12)
    assert by_revolutions.life_h == pytest.approx(by_time.life_h, rel=1e-12)
    # and the other way: equal revolution shares 1/3 each are time shares ∝ 1/ni
    # = 1/1000 : 1/500 : 1/1500 = 3 : 6 : 2 (by hand), so the time cycle 3, 6, 2 is the same duty.
    equal_revolutions = duty_life(session, DutyCycle(
        "r", [("state 1", "1"), ("state 2", "1"), ("state 3", "1")], "revolutions"))
    as_time = duty_life(session, DutyCycle("t", [("state 1", "3"), ("state 2", "6"),
                                                 ("state 3", "2")]))
    assert as_time.revolution_shares == pytest.approx([1 / 3] * 3, rel=1e-12)
    assert as_time.life_mrev == pytest.approx(equal_revolutions.life_mrev, rel=1e-12)
    # nm = (3·1000 + 6·500 + 2·1500)/11 = 9000/11 r/min
    assert equal_revolutions.mean_speed == pytest.approx(9000 / 11, rel=1e-12)


def test_standstill_on_a_time_basis_does_no_damage() -> None:
    # A state at n = 0 makes no revolutions: ui = 0 and the life is that of the others alone
    # (Palmgren–Miner); the mean speed counts its time (nm = (0.5·1000 + 0.5·0)/1 = 500 r/min).
    session = three_state_session()
    session.cases.append(LoadCase("parked", "ball", {"fr": "9 kN", "speed": "0 rpm"}))
    result = duty_life(session, DutyCycle("p", [("state 1", "1"), ("parked", "1")]))
    assert result.life_mrev == pytest.approx(421.875, rel=1e-12)
    assert result.damage_shares == pytest.approx([1.0, 0.0])
    assert result.mean_speed == pytest.approx(500.0)
    with pytest.raises(FieldError) as caught:
        duty_life(session, DutyCycle("p", [("state 1", "1"), ("parked", "1")], "revolutions"),
                  key="duty_cycles[4]")
    assert caught.value.field == "duty_cycles[4].states"


@pytest.mark.parametrize("states, key, words", [
    ([("state 1", "1"), ("nowhere", "1")], "duty_cycles[2].states[2].case", "no load case"),
    ([("state 1", "1"), ("elsewhere", "1")], "duty_cycles[2].states[2].case", "one bearing"),
    ([("state 1", "1"), ("stricter", "1")], "duty_cycles[2].states[2].case", "reliability"),
    ([("state 1", "half")], "duty_cycles[2].states[1].share", "number"),
    ([], "duty_cycles[2].states", "at least one"),
])
def test_duty_errors_are_named(states: list[tuple[str, str]], key: str, words: str) -> None:
    with pytest.raises(FieldError) as caught:
        duty_life(three_state_session(), DutyCycle("bad", states), key="duty_cycles[2]")
    assert caught.value.field == key
    assert words in caught.value.message


# ---- shafts as series systems --------------------------------------------------------------
def two_state_shaft(bearing_a: str = "ball", bearing_b: str = "ball") -> Shaft:
    spur = Element("spur", "spur", position="60 mm", diameter="120 mm", pressure_angle="20°",
                   driving="yes", mesh_angle="90°")
    return Shaft("line", bearing_a, bearing_b, "0 mm", "180 mm", "A", elements=[spur],
                 states=[OperatingState("full", torque="120 N·m", speed="1200 rpm", share="0.6"),
                         OperatingState("light", power="4 kW", speed="1500 rpm", share="0.4")])


def test_shaft_cycles_follow_the_states() -> None:
    cycles = shaft_cycles(two_state_shaft())
    assert [c.states for c in cycles] == [
        [("line · full · A", "0.6"), ("line · light · A", "0.4")],
        [("line · full · B", "0.6"), ("line · light · B", "0.4")]]
    assert all(c.basis == "time" for c in cycles)


def test_system_life_against_closed_form_and_scipy() -> None:
    session = three_state_session()
    shaft = two_state_shaft()
    result = system_life(session, shaft)
    # each bearing's duty life is its Miner life over the generated cases
    cases = generated_cases(session, [shaft])
    for duty, cycle in zip(result.duties, shaft_cycles(shaft)):
        assert duty.life_mrev == pytest.approx(duty_life(session, cycle, cases).life_mrev,
                                               rel=1e-12)
    # closed form, ball bearings e = 10/9 (from memory)
    e = 10 / 9
    l_a, l_b = (duty.life_mrev for duty in result.duties)
    assert result.weibull_slope == e
    assert result.life_mrev == pytest.approx((l_a ** -e + l_b ** -e) ** (-1 / e), rel=1e-12)
    # scipy.stats: two Weibull lives of slope e whose 10 % quantiles are L_A and L_B; the series
    # system survives to L_sys with probability R_A·R_B = 0.90.
    scales = [life / (-math.log(0.9)) ** (1 / e) for life in (l_a, l_b)]
    survival = math.prod(weibull_min(c=e, scale=s).sf(result.life_mrev) for s in scales)
    assert survival == pytest.approx(0.90, rel=1e-9)
    assert result.reliability == 0.9
    # hours at the shaft's mean speed nm = 0.6·1200 + 0.4·1500 = 1320 r/min
    assert result.life_h == pytest.approx(result.life_mrev * 1e6 / (60 * 1320), rel=1e-12)
    assert result.derivation.step("L_sys").source == \
        "series system of Weibull lives, L_sys = (Σ L_i^−e)^(−1/e)"


def test_weibull_slope_choice() -> None:
    # 9/8 for an all-roller set, 10/9 for ball and for mixed sets (the smaller slope; from memory).
    assert weibull_slope(["cylindrical", "tapered"]) == 9 / 8
    assert weibull_slope(["deep-groove", "angular-contact"]) == 10 / 9
    assert weibull_slope(["deep-groove", "cylindrical"]) == 10 / 9
    mixed = system_life(three_state_session(), two_state_shaft("ball", "roller"))
    assert mixed.weibull_slope == 10 / 9
    rollers = system_life(three_state_session(), two_state_shaft("roller", "roller"))
    assert rollers.weibull_slope == 9 / 8


def test_system_life_errors_name_the_shaft_key() -> None:
    shaft = two_state_shaft()
    shaft.states[1].speed = "-5 rpm"
    with pytest.raises(FieldError) as caught:
        system_life(three_state_session(), shaft, key="shafts[2]")
    assert caught.value.field == "shafts[2].states[2].speed"


# ---- tables ----------------------------------------------------------------------------------
names = st.text(st.characters(min_codepoint=32, max_codepoint=0x24F), min_size=1,
                max_size=12).filter(str.strip)
cycles = st.builds(
    DutyCycle, names,
    st.lists(st.tuples(names, st.floats(0, 1e4, allow_nan=False).map(lambda x: f"{x:.5g}")),
             max_size=4),
    st.sampled_from(["time", "revolutions"]))


@settings(max_examples=50, deadline=None)
@given(cycle=cycles)
def test_table_round_trip_is_exact(cycle: DutyCycle) -> None:
    table = duty_cycle_to_table(cycle)
    assert duty_cycle_from_table(table) == cycle
    assert duty_cycle_to_table(duty_cycle_from_table(table)) == table


@pytest.mark.parametrize("table, key, words", [
    ({"name": "c", "basis": "hours"}, "duty_cycles[1].basis", "'time'"),
    ({"name": "c", "states": [{"case": "a", "shares": "1"}]}, "duty_cycles[1].states[1].shares",
     "share"),
    ({"name": "c", "states": [{"case": "a", "share": "1 kN"}]}, "duty_cycles[1].states[1].share",
     "plain number"),
    ({"name": "c", "states": [{"case": "", "share": "1"}]}, "duty_cycles[1].states[1].case",
     "name the load case"),
    ({"name": "c", "states": [{"case": "a", "share": 1}]}, "duty_cycles[1].states[1].share",
     "text in quotes"),
    ({"name": "", "states": []}, "duty_cycles[1].name", "needs a name"),
    ({"name": "c", "states": {"case": "a"}}, "duty_cycles[1].states", "[[states]]"),
])
def test_bad_keys_are_named(table: dict[str, object], key: str, words: str) -> None:
    with pytest.raises(FieldError) as caught:
        duty_cycle_from_table(table)
    assert caught.value.field == key
    assert words in caught.value.message


def test_duplicate_cycle_names_are_named() -> None:
    with pytest.raises(FieldError) as caught:
        duty_cycles_from_tables([{"name": "c"}, {"name": "d"}, {"name": "c"}])
    assert caught.value.field == "duty_cycles[3].name"
