"""Shafts: free bodies worked by hand, generated load cases, paired-bearing thrust, tables.

References outside the module: hand equilibrium (ΣF = 0, ΣM = 0) of shafts worked in the
comments; the gear-force closed forms (Wt = 2T/d, Wr = Wt·tan αn/cos β, Wa = Wt·tan β); Newton's
third law between meshing gears; T = P/ω; the thrust-sharing rule as ``engine.pairs.share_thrust``
gives it; ISO 281:2007 Table 3 values quoted in REFERENCE.md §2 (from memory).
"""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from workbench.engine.pairs import share_thrust
from workbench.model.fields import FieldError
from workbench.model.quantities import parse
from workbench.model.session import Bearing, LoadCase, Session, evaluate_case
from workbench.model.sessionfile import dumps_session, loads_session
from workbench.model.shafts import (
    Element,
    OperatingState,
    Shaft,
    generated_cases,
    is_generated,
    shaft_from_table,
    shaft_to_table,
    shafts_from_tables,
    solve_shaft,
)

# Invented bearings of an invented test rig; no maker's data.
BEARINGS = [
    Bearing("ball", {"kind": "deep-groove", "c": "30 kN", "c0": "20 kN"}),
    Bearing("taper 1.6", {"kind": "tapered", "c": "60 kN", "c0": "70 kN", "e_given": "0.37",
                          "y_given": "1.6"}),
    Bearing("taper 1.8", {"kind": "tapered", "c": "55 kN", "c0": "62 kN", "e_given": "0.33",
                          "y_given": "1.8"}),
    Bearing("taper 15°", {"kind": "tapered", "c": "50 kN", "c0": "60 kN",
                          "contact_angle": "15°"}),
    Bearing("ac 40", {"kind": "angular-contact", "c": "40 kN", "c0": "30 kN",
                      "contact_angle": "40°"}),
    Bearing("ac 15", {"kind": "angular-contact", "c": "30 kN", "c0": "20 kN",
                      "contact_angle": "15°", "f0": "14"}),
    Bearing("ac pair", {"kind": "angular-contact", "arrangement": "back-to-back", "c": "60 kN",
                        "c0": "50 kN", "contact_angle": "40°"}),
]


def session() -> Session:
    return Session(bearings=[replace(b, texts=dict(b.texts)) for b in BEARINGS],
                   cases=[LoadCase("existing", "ball", {"fr": "1 kN"})])


def helical_pinion(**changes: str) -> Element:
    texts = dict(position="80 mm", diameter="100 mm", pressure_angle="20°", helix_angle="15°",
                 hand="right", driving="yes", mesh_angle="0°")
    texts.update(changes)
    return Element("pinion", "helical", **texts)


def hand_shaft(**changes: object) -> Shaft:
    fields: dict[str, object] = dict(
        name="rig", bearing_a="ball", bearing_b="ball", position_a="0 mm", position_b="200 mm",
        locating="B", elements=[helical_pinion()],
        states=[OperatingState("full", torque="100 N·m", speed="1450 rpm")],
        case_fields={"reliability": "0.95"})
    fields.update(changes)
    return Shaft(**fields)  # type: ignore[arg-type]


def loads_of(case: LoadCase) -> tuple[float, float, float]:
    return (parse(case.texts["fr"], "force"), parse(case.texts["fa"], "force"),
            parse(case.texts["speed"], "speed"))


# ---- statics worked by hand ----------------------------------------------------------------
def test_helical_shaft_matches_hand_equilibrium() -> None:
    # By hand.  Bearings A at x = 0, B at x = 200 mm; B locates.  Right-hand helical pinion at
    # x = 80 mm, d = 100 mm, αn = 20°, β = 15°, driving, shaft turning + about x, T = 100 N·m,
    # mesh point at θ = 0° (on +y, r = 50 mm).
    #   Wt = 2T/d = 2·100 000/100 = 2000 N; Wr = 2000·tan 20°/cos 15° = 2000·0.363970/0.965926
    #   = 753.62 N; Wa = 2000·tan 15° = 535.90 N, toward +x (right hand, driving, + rotation).
    #   Force on the shaft at the mesh point: Fy = −Wr = −753.62 N (toward the axis);
    #   Fz = −Wt = −2000 N (the mesh point moves along +z, a driving gear is held back);
    #   Fx = +535.90 N acting at y = +50 mm.
    #   x–y plane, moments about A: −753.62·80 − 535.90·50 = −60 289.6 − 26 794.9 = −87 084.5 N·mm
    #   → R_B,y = 87 084.5/200 = 435.42 N, R_A,y = 753.62 − 435.42 = 318.20 N.
    #   x–z plane: 2000·80/200 → R_B,z = 800 N, R_A,z = 2000 − 800 = 1200 N.
    #   Fr,A = √(318.20² + 1200²) = 1241.47 N; Fr,B = √(435.42² + 800²) = 910.82 N;
    #   Fa,A = 0, Fa,B = 535.90 N.
    shaft = hand_shaft()
    case_a, case_b = generated_cases(session(), [shaft])
    assert loads_of(case_a) == (pytest.approx(1241.47, abs=0.01), 0.0, 1450.0)
    assert loads_of(case_b) == (pytest.approx(910.82, abs=0.01), pytest.approx(535.90, abs=0.01),
                                1450.0)
    assert case_a.name == "rig · full · A" and case_a.bearing == "ball"
    assert case_a.texts["reliability"] == "0.95"
    assert is_generated(case_a) and case_a.notes == "generated from shaft rig"

    solution = solve_shaft(shaft, shaft.states[0], session())
    results = solution.derivation.results
    # helical gear force relations (closed form) and the hand reactions above
    assert solution.derivation.step("Wr[pinion]").value == pytest.approx(
        2000 * math.tan(math.radians(20)) / math.cos(math.radians(15)), rel=1e-12)
    assert solution.derivation.step("Wa[pinion]").value == pytest.approx(
        2000 * math.tan(math.radians(15)), rel=1e-12)
    assert (results["R_Ay"], results["R_Az"], results["R_By"], results["R_Bz"]) == (
        pytest.approx(318.197, abs=1e-3), pytest.approx(1200.0), pytest.approx(435.422, abs=1e-3),
        pytest.approx(800.0))
    assert solution.derivation.step("Wt[pinion]").source.startswith("helical gear force relations")


def test_left_hand_driven_or_reversed_flips_the_thrust_to_bearing_a() -> None:
    # Gear-force sign rule (engine.gears docstring): each of hand, role and rotation flips the
    # thrust once.  With A locating, Fa,A = |Wa| = 535.90 N and Fa,B = 0 in every case.
    for change in ({"elements": [helical_pinion(hand="left")]},
                   {"elements": [helical_pinion(driving="no")]},
                   {"rotation": "-"}):
        shaft = hand_shaft(locating="A", **change)
        solution = solve_shaft(shaft, shaft.states[0], session())
        assert solution.reactions.thrust == pytest.approx(-535.898, abs=1e-3)
        assert solution.bearing_loads["A"][1] == pytest.approx(535.898, abs=1e-3)
        assert solution.bearing_loads["B"][1] == 0.0


def test_power_state_uses_t_equals_p_over_omega() -> None:
    # T = P/ω = 15 000·60/(2π·1200) = 119.366 N·m; Wt = 2T/d = 2387.3 N.
    shaft = hand_shaft(states=[OperatingState("run", power="15 kW", speed="1200 rpm")])
    solution = solve_shaft(shaft, shaft.states[0], session())
    assert solution.torque == pytest.approx(15000 * 60 / (2 * math.pi * 1200), rel=1e-12)
    assert solution.derivation.step("Wt[pinion]").value == pytest.approx(2387.32, abs=0.01)


def test_meshing_gears_on_two_shafts_load_each_other_equal_and_opposite() -> None:
    # Newton's third law: shaft 2 lies on +y of shaft 1, so the pinion meshes at θ = 0° and the
    # wheel at θ = 180°; the wheel turns the other way, is driven, has the opposite hand and
    # carries T·d2/d1.  The two forces (all three components) are equal and opposite.
    pinion = helical_pinion(position="50 mm", diameter="60 mm")
    wheel = Element("wheel", "helical", position="50 mm", diameter="150 mm",
                    pressure_angle="20°", helix_angle="15°", hand="left", driving="no",
                    mesh_angle="180°")
    one = hand_shaft(elements=[pinion], states=[OperatingState("s", torque="40 N·m",
                                                                speed="1000 rpm")])
    two = hand_shaft(name="two", rotation="-", elements=[wheel],
                     states=[OperatingState("s", torque="100 N·m", speed="400 rpm")])
    load_1 = solve_shaft(one, one.states[0], session()).loads[0]
    load_2 = solve_shaft(two, two.states[0], session()).loads[0]
    for component in ("fx", "fy", "fz"):
        assert getattr(load_1, component) == pytest.approx(-getattr(load_2, component), abs=1e-9)


def test_mixed_shaft_is_in_equilibrium() -> None:
    # Spur gear, straight bevel gear and pulley on one shaft: ΣF = 0 and ΣM = 0 about A with
    # the bearing reactions (the locating bearing takes −ΣFx on the axis), in both planes.
    shaft = hand_shaft(locating="A", elements=[
        Element("spur", "spur", position="40 mm", diameter="90 mm", pressure_angle="20°",
                driving="no", mesh_angle="30°", share="0.6"),
        Element("bevel", "bevel", position="260 mm", diameter="70 mm", pressure_angle="20°",
                pitch_cone_angle="30°", apex="A", driving="yes", mesh_angle="200°",
                share="0.4"),
        Element("pulley", "pulley", position="-60 mm", diameter="160 mm", mesh_angle="-80°",
                pull_factor="2.5", share="0.2"),
    ])
    solution = solve_shaft(shaft, shaft.states[0], session())
    r = solution.reactions
    vectors = [np.array([ld.fx, ld.fy, ld.fz]) for ld in solution.loads]
    points = [np.array([ld.x_mm, ld.offset_y_mm, ld.offset_z_mm]) for ld in solution.loads]
    vectors += [np.array([-r.thrust, r.a_y, r.a_z]), np.array([0.0, r.b_y, r.b_z])]
    points += [np.zeros(3), np.array([200.0, 0.0, 0.0])]
    total_force = np.sum(vectors, axis=0)
    total_moment = np.sum(np.cross(points, vectors), axis=0)
    assert np.allclose(total_force, 0.0, atol=1e-8)
    assert np.allclose(total_moment[1:], 0.0, atol=1e-6)
    # straight bevel closed form: Wa = Wt·tan αn·sin γ, Wt = 2·0.4·100 000/70; apex on the A side
    # pushes the shaft toward B (+x); the pulley pull is f·2T/D = 2.5·2·20 000/160 = 625 N.
    wt = 2 * 40_000 / 70
    assert solution.loads[1].fx == pytest.approx(wt * math.tan(math.radians(20)) * 0.5, rel=1e-12)
    assert math.hypot(solution.loads[2].fy, solution.loads[2].fz) == pytest.approx(625.0)


def test_generated_cases_derive_through_evaluate_case() -> None:
    s = session()
    shafts = [hand_shaft(states=[OperatingState("full", torque="100 N·m", speed="1450 rpm",
                                                share="0.7"),
                                 OperatingState("part", power="5 kW", speed="900 rpm",
                                                share="0.3")]),
              hand_shaft(name="pair", bearing_a="taper 1.6", bearing_b="taper 1.8",
                         locating="pair", mounting="X")]
    cases = generated_cases(s, shafts)
    assert [c.name for c in cases] == ["rig · full · A", "rig · full · B", "rig · part · A",
                                       "rig · part · B", "pair · full · A", "pair · full · B"]
    for case in cases:
        result = evaluate_case(s, case)
        assert result.error is None and result.derivation is not None
        fr, fa, _ = loads_of(case)
        assert result.inputs is not None
        assert (result.inputs.fr, result.inputs.fa) == (fr, fa)
        assert result.inputs.reliability == 0.95


# ---- pairs -----------------------------------------------------------------------------------
@pytest.mark.parametrize("mounting", ["O", "X"])
@pytest.mark.parametrize("rotation", ["+", "-"])
def test_tapered_pair_axial_loads_follow_share_thrust(mounting: str, rotation: str) -> None:
    # ISO form Fi = Fr/(2Y) with the maker's Y (1.6 at A, 1.8 at B); the axial loads are those
    # engine.pairs.share_thrust gives for the statics' Fr and thrust.
    shaft = hand_shaft(bearing_a="taper 1.6", bearing_b="taper 1.8", locating="pair",
                       mounting=mounting, rotation=rotation)
    solution = solve_shaft(shaft, shaft.states[0], session())
    r = solution.reactions
    expected = share_thrust(r.radial_a, r.radial_b, r.radial_a / 3.2, r.radial_b / 3.6,
                            r.thrust, mounting)  # type: ignore[arg-type]
    case_a, case_b = generated_cases(session(), [shaft])
    assert loads_of(case_a)[1] == pytest.approx(expected[0], rel=1e-5)
    assert loads_of(case_b)[1] == pytest.approx(expected[1], rel=1e-5)
    assert solution.derivation.results["Fi_A"] == pytest.approx(r.radial_a / 3.2, rel=1e-12)
    assert solution.derivation.step("Fa_B").note == expected[2]


def test_tapered_pair_y_from_contact_angle() -> None:
    # No maker's Y: Y = 0.4·cot α (ISO 281:2007, radial roller single row, REFERENCE.md §2, from
    # memory), α = 15° → Y = 1.4928, Fi = Fr/(2Y).
    shaft = hand_shaft(bearing_a="taper 15°", bearing_b="taper 15°", locating="pair",
                       mounting="O")
    solution = solve_shaft(shaft, shaft.states[0], session())
    y = 0.4 / math.tan(math.radians(15))
    assert solution.derivation.results["Y_A"] == pytest.approx(y, rel=1e-12)
    r = solution.reactions
    expected = share_thrust(r.radial_a, r.radial_b, r.radial_a / (2 * y), r.radial_b / (2 * y),
                            r.thrust, "O")
    assert solution.bearing_loads["A"][1] == pytest.approx(expected[0], rel=1e-12)
    assert solution.bearing_loads["B"][1] == pytest.approx(expected[1], rel=1e-12)


def test_pair_derivation_shows_the_statics_before_the_sharing_rule() -> None:
    # The reactions (shaft statics) come first, then the induced thrusts and the rule's Fa; the
    # statics leave Fa undefined for a pair, the rule fills it in.
    shaft = hand_shaft(bearing_a="taper 1.6", bearing_b="taper 1.8", locating="pair",
                       mounting="O")
    derivation = solve_shaft(shaft, shaft.states[0], session()).derivation
    keys = [step.key for step in derivation.steps]
    assert keys.index("R_By") < keys.index("Fr_B") < keys.index("Fi_A") < len(keys) - 2
    assert keys[-2:] == ["Fa_A", "Fa_B"]
    assert "shaft statics, ΣF = 0, ΣM = 0" in derivation.sources
    assert derivation.step("Fa_B").value == derivation.results["Fa_B"] > 0.0


@pytest.mark.parametrize("mounting", ["O", "X"])
def test_angular_contact_pair_uses_e(mounting: str) -> None:
    # Fi = e·Fr (common practice), e = 1.14 for 40° (ISO 281 Table 3 as quoted in REFERENCE.md §2,
    # from memory).
    shaft = hand_shaft(bearing_a="ac 40", bearing_b="ac 40", locating="pair", mounting=mounting)
    solution = solve_shaft(shaft, shaft.states[0], session())
    r = solution.reactions
    expected = share_thrust(r.radial_a, r.radial_b, 1.14 * r.radial_a, 1.14 * r.radial_b,
                            r.thrust, mounting)  # type: ignore[arg-type]
    assert solution.bearing_loads["A"][1] == pytest.approx(expected[0], rel=1e-12)
    assert solution.bearing_loads["B"][1] == pytest.approx(expected[1], rel=1e-12)


@pytest.mark.parametrize("mounting", ["O", "X"])
def test_fifteen_degree_pair_is_a_fixed_point_of_the_rule(mounting: str) -> None:
    # 15° rows: e by the index i·f0·Fa/C0r (f0 = 14, C0 = 20 kN), REFERENCE.md §2 (from memory),
    # interpolated linearly.  The axial loads found must reproduce themselves through the rule.
    index = [0.178, 0.357, 0.714, 1.07, 1.43, 2.14, 3.57, 5.35, 7.14]
    e_column = [0.38, 0.40, 0.43, 0.46, 0.47, 0.50, 0.55, 0.56, 0.56]
    shaft = hand_shaft(bearing_a="ac 15", bearing_b="ac 15", locating="pair", mounting=mounting)
    solution = solve_shaft(shaft, shaft.states[0], session())
    r = solution.reactions
    fa_a, fa_b = solution.bearing_loads["A"][1], solution.bearing_loads["B"][1]
    e_a, e_b = (float(np.interp(14 * fa / 20_000, index, e_column)) for fa in (fa_a, fa_b))
    again = share_thrust(r.radial_a, r.radial_b, e_a * r.radial_a, e_b * r.radial_b, r.thrust,
                         mounting)  # type: ignore[arg-type]
    assert again[:2] == (pytest.approx(fa_a, rel=1e-8), pytest.approx(fa_b, rel=1e-8))
    assert not solution.derivation.warnings


# ---- tables ----------------------------------------------------------------------------------
texts = st.text(st.characters(min_codepoint=32, max_codepoint=0x24F, exclude_characters="\x7f"),
                min_size=1, max_size=12).filter(str.strip)
numbers = st.floats(-500, 500, allow_nan=False).map(lambda x: f"{x:.6g}")
positive = st.floats(1, 500, allow_nan=False).map(lambda x: f"{x:.6g}")
angles = st.floats(1, 40, allow_nan=False).map(lambda x: f"{x:.4g}°")


@st.composite
def elements(draw: st.DrawFn, name: str) -> Element:
    kind = draw(st.sampled_from(["spur", "helical", "bevel", "pulley"]))
    element = Element(name, kind, position=draw(numbers) + " mm", diameter=draw(positive) + " mm",
                      mesh_angle=draw(angles), share=draw(st.sampled_from(["1", "0.5", "0.25"])))
    if kind == "pulley":
        element.pull_factor = draw(st.sampled_from(["", "1.3", "2.5"]))
        return element
    element.pressure_angle = draw(angles)
    element.driving = draw(st.sampled_from(["yes", "no"]))
    if kind == "helical":
        element.helix_angle, element.hand = draw(angles), draw(st.sampled_from(["left", "right"]))
    if kind == "bevel":
        element.pitch_cone_angle, element.apex = draw(angles), draw(st.sampled_from(["A", "B"]))
    return element


@st.composite
def shafts(draw: st.DrawFn) -> Shaft:
    locating = draw(st.sampled_from(["A", "B", "pair"]))
    element_names = draw(st.lists(texts, max_size=3, unique=True))
    state_names = draw(st.lists(texts, max_size=3, unique=True))
    states = [OperatingState(n, **({"power": draw(positive) + " kW"} if draw(st.booleans())
                                   else {"torque": draw(positive) + " N·m"}),
                             speed=draw(positive) + " rpm", share=draw(st.sampled_from(["1", "0.3"])))
              for n in state_names]
    return Shaft(draw(texts), draw(texts), draw(texts), draw(numbers) + " mm",
                 draw(numbers) + " mm", locating,
                 draw(st.sampled_from(["O", "X"])) if locating == "pair" else "",
                 draw(st.sampled_from(["+", "-"])), [draw(elements(n)) for n in element_names],
                 states, draw(st.sampled_from(CASE_FIELD_CHOICES)))


CASE_FIELD_CHOICES = [{}, {"reliability": "0.95"}, {"af": "1.2", "vg": "68"},
                      {"cleanliness": "0.5", "temp": "70 °C"}]


@settings(max_examples=50, deadline=None)
@given(shaft=shafts())
def test_table_round_trip_is_exact(shaft: Shaft) -> None:
    table = shaft_to_table(shaft)
    assert all(isinstance(v, str) for v in table.values() if not isinstance(v, (list, dict)))
    assert shaft_from_table(table) == shaft
    assert shaft_to_table(shaft_from_table(table)) == table


def test_round_trip_through_a_session_file() -> None:
    # the reserved [[shafts]] tables survive the session file's TOML writer and tomllib reader
    s = session()
    s.reserved["shafts"] = [shaft_to_table(hand_shaft()),
                            shaft_to_table(hand_shaft(name="pair", locating="pair", mounting="X"))]
    again = loads_session(dumps_session(s))
    assert shafts_from_tables(again.reserved["shafts"]) == [
        hand_shaft(), hand_shaft(name="pair", locating="pair", mounting="X")]


def _table_with(path: tuple[object, ...], value: object) -> dict[str, object]:
    table = shaft_to_table(hand_shaft(elements=[helical_pinion(), helical_pinion()]))
    table["elements"][1]["name"] = "second"  # type: ignore[index]
    target: object = table
    for part in path[:-1]:
        target = target[part]  # type: ignore[index]
    if value is None:
        del target[path[-1]]  # type: ignore[attr-defined]
    else:
        target[path[-1]] = value  # type: ignore[index]
    return table


@pytest.mark.parametrize("path, value, key, words", [
    (("elements", 1, "helix_angle"), "15 mm", "shafts[1].elements[2].helix_angle", "not an angle"),
    (("elements", 1, "helix_angel"), "15°", "shafts[1].elements[2].helix_angel", "helix_angle"),
    (("elements", 0, "helix_angle"), None, "shafts[1].elements[1].helix_angle", "needs"),
    (("elements", 0, "pitch_cone_angle"), "30°", "shafts[1].elements[1].pitch_cone_angle",
     "takes no"),
    (("elements", 0, "kind"), "worm", "shafts[1].elements[1].kind", "worm"),
    (("elements", 0, "hand"), "up", "shafts[1].elements[1].hand", "left"),
    (("elements", 0, "driving"), "maybe", "shafts[1].elements[1].driving", "yes or no"),
    (("elements", 0, "share"), "-1", "shafts[1].elements[1].share", "0 or more"),
    (("elements", 1, "name"), "pinion", "shafts[1].elements[2].name", "second"),
    (("states", 0, "power"), "3 kW", "shafts[1].states[1].power", "not both"),
    (("states", 0, "speed"), "50 Hz", "shafts[1].states[1].speed", "rotational speed"),
    (("states", 0, "torque"), 100, "shafts[1].states[1].torque", "text in quotes"),
    (("locating",), "C", "shafts[1].locating", "'pair'"),
    (("mounting",), "O", "shafts[1].mounting", "only for"),
    (("rotation",), "cw", "shafts[1].rotation", "'+'"),
    (("position_b",), "2 kN", "shafts[1].position_b", "length"),
    (("case_fields", "fr"), "1 kN", "shafts[1].case_fields.fr", "come from the shaft"),
    (("case_fields", "reliability"), "95", "shafts[1].case_fields.reliability", "fraction"),
    (("elements",), {"name": "x"}, "shafts[1].elements", "[[elements]]"),
])
def test_bad_keys_are_named(path: tuple[object, ...], value: object, key: str, words: str) -> None:
    with pytest.raises(FieldError) as caught:
        shaft_from_table(_table_with(path, value))
    assert caught.value.field == key
    assert words in caught.value.message


def test_pair_mounting_is_required() -> None:
    with pytest.raises(FieldError) as caught:
        shaft_from_table(shaft_to_table(hand_shaft(locating="pair")), "shafts[3]")
    assert caught.value.field == "shafts[3].mounting"


def test_duplicate_shaft_names_are_named() -> None:
    tables = [shaft_to_table(hand_shaft()), shaft_to_table(hand_shaft())]
    with pytest.raises(FieldError) as caught:
        shafts_from_tables(tables)
    assert caught.value.field == "shafts[2].name"


@pytest.mark.parametrize("changes, key, words", [
    ({"bearing_b": "nowhere"}, "shafts[1].bearing_b", "no bearing called"),
    ({"position_b": "-10 mm"}, "shafts[1].position_b", "+x side"),
    ({"locating": "pair", "mounting": "O"}, "shafts[1].bearing_a", "single angular-contact"),
    ({"locating": "pair", "mounting": "O", "bearing_a": "ac 40", "bearing_b": "ac pair"},
     "shafts[1].bearing_b", "back-to-back"),
    ({"elements": [helical_pinion(helix_angle="95°")]}, "shafts[1].elements[1].helix_angle",
     "< 90"),
    ({"elements": [helical_pinion(diameter="0 mm")]}, "shafts[1].elements[1].diameter", "> 0"),
    ({"states": [OperatingState("back", torque="-5 N·m", speed="10 rpm")]},
     "shafts[1].states[1].torque", "negative"),
    ({"states": [OperatingState("idle", power="2 kW", speed="0 rpm")]},
     "shafts[1].states[1].speed", "> 0"),
])
def test_solving_errors_are_named(changes: dict[str, object], key: str, words: str) -> None:
    with pytest.raises(FieldError) as caught:
        generated_cases(session(), [hand_shaft(**changes)])
    assert caught.value.field == key
    assert words in caught.value.message


def test_generated_name_already_taken_is_named() -> None:
    s = session()
    s.cases.append(LoadCase("rig · full · B", "ball", {"fr": "1 kN"}))
    with pytest.raises(FieldError) as caught:
        generated_cases(s, [hand_shaft()])
    assert caught.value.field == "shafts[1].states[1].name"
    assert "already taken" in caught.value.message
