"""The whole-session analysis and its report sections: shafts, generated cases, duty cycles.

References outside the module: shaft statics for one gear between two bearings worked in closed
form (ΣF = 0, ΣM = 0), the helical gear force relations Wt = 2T/d, Wr = Wt·tan αn/cos β,
Wa = Wt·tan β and T = P/ω, the Palmgren–Miner rule 1/L = Σ ui/Li with ui = ti·ni/Σ tj·nj, the
hours conversion Lh = 10⁶·L/(60·n) of ISO 281:2007, the series-system closed form
L_sys = (Σ L_i^−e)^(−1/e), and the JSON grammar of RFC 8259 (no NaN) as the standard library's
``json`` module enforces it.
"""

from __future__ import annotations

import json
import math
from dataclasses import replace
from pathlib import Path

import pytest

from workbench.engine.shaft import HELICAL_SOURCE
from workbench.model.analysis import analyse, session_duty_cycles, session_shafts, time_shares
from workbench.model.duty_cycles import (
    DutyCycle, duty_cycle_to_table, duty_life, shaft_cycles, system_life,
)
from workbench.model.session import Bearing, LoadCase, Session
from workbench.model.sessionfile import load_session
from workbench.model.shafts import (
    Element, OperatingState, Shaft, generated_cases, is_generated, shaft_to_table, solve_shaft,
)
from workbench.report import render_report

DEMO = Path(__file__).resolve().parents[2] / "sessions" / "demo.toml"


def strict_json(text: str) -> dict:
    """Parse JSON refusing NaN and Infinity, which RFC 8259 does not allow."""
    def refuse(name: str) -> None:
        raise ValueError(f"non-standard JSON constant {name}")
    return json.loads(text, parse_constant=refuse)


# ---- the demo --------------------------------------------------------------------------------
def test_demo_generated_cases_follow_the_session_cases_and_derive() -> None:
    session = load_session(DEMO)
    analysis = analyse(session)
    shafts = session_shafts(session)
    generated = generated_cases(session, shafts)
    assert [r.case for r in analysis.cases] == session.cases + generated
    assert len(generated) == 2 * sum(len(s.states) for s in shafts) > 0
    assert all(r.derivation is not None and r.error is None for r in analysis.cases)
    assert [is_generated(r.case) for r in analysis.cases] == (
        [False] * len(session.cases) + [True] * len(generated))
    assert all(o.error is None and o.system is not None for o in analysis.shafts)
    assert all(d.error is None and d.result is not None for d in analysis.duties)


def test_demo_full_load_matches_closed_form_statics() -> None:
    # One helical pinion between the bearings (demo: A at 0, B at 190 mm, pinion at x = 118 mm,
    # d = 56 mm, αn = 20°, β = 18°, right hand, driving, rotation +, mesh point at θ = 90°, i.e. on
    # +z at r = 28 mm), P = 30 kW at 1480 r/min, B locating.  Closed form:
    #   T = P/ω; Wt = 2T/d; Wr = Wt·tan αn/cos β; Wa = Wt·tan β toward B.
    #   On the shaft at the mesh point: Fy = +Wt (a driving gear is held back against the
    #   motion of the mesh point, which moves along −y there), Fz = −Wr (toward the axis),
    #   Fx = +Wa at z = r.
    #   x–y: R_B,y = −Fy·a/L, R_A,y = −Fy − R_B,y.
    #   x–z: R_B,z = (Fx·r − Fz·a)/L, R_A,z = −Fz − R_B,z.
    session = load_session(DEMO)
    torque = 30000 / (2 * math.pi * 1480 / 60)
    wt = 2 * torque / 56e-3
    wr = wt * math.tan(math.radians(20)) / math.cos(math.radians(18))
    wa = wt * math.tan(math.radians(18))
    a, span, r = 118.0, 190.0, 28.0
    rby = -wt * a / span
    ray = -wt - rby
    rbz = (wa * r + wr * a) / span
    raz = wr - rbz
    data = strict_json(render_report(session, "json", "demo"))
    full = data["shafts"][0]["states"][0]
    assert full["name"] == "full load"
    assert full["torque"] == pytest.approx(torque, rel=1e-12)
    assert full["bearings"]["A"]["fr"] == pytest.approx(math.hypot(ray, raz), rel=1e-9)
    assert full["bearings"]["B"]["fr"] == pytest.approx(math.hypot(rby, rbz), rel=1e-9)
    assert (full["bearings"]["A"]["fa"], full["bearings"]["B"]["fa"]) == (
        0.0, pytest.approx(wa, rel=1e-12))
    assert full["results"]["Fr_A"] == full["bearings"]["A"]["fr"]


def test_report_json_figures_are_those_of_the_model_functions() -> None:
    session = load_session(DEMO)
    data = strict_json(render_report(session, "json", "demo"))
    [shaft] = session_shafts(session)
    [entry] = data["shafts"]
    assert (entry["name"], entry["key"], entry["error"]) == (shaft.name, "shafts[1]", None)
    for state, reported in zip(shaft.states, entry["states"], strict=True):
        solution = solve_shaft(shaft, state, session, key="shafts[1]")
        for side in "AB":
            assert (reported["bearings"][side]["fr"], reported["bearings"][side]["fa"]) == \
                solution.bearing_loads[side]
        assert reported["results"] == solution.derivation.results
        assert [s["key"] for s in reported["steps"]] == [s.key for s in solution.derivation.steps]
    system = system_life(session, shaft)
    assert entry["system"]["life_mrev"] == system.life_mrev
    assert entry["system"]["life_h"] == system.life_h
    assert entry["system"]["weibull_slope"] == system.weibull_slope
    # series-system closed form over the two duty lives, e = 10/9 (a mixed set takes the ball slope)
    lives = [d["life_mrev"] for d in data["duty_cycles"][1:]]
    assert entry["system"]["life_mrev"] == pytest.approx(
        sum(life ** (-10 / 9) for life in lives) ** (-9 / 10), rel=1e-12)

    cycles = session_duty_cycles(session) + shaft_cycles(shaft)
    cases = generated_cases(session, [shaft])
    assert [d["name"] for d in data["duty_cycles"]] == [c.name for c in cycles]
    for cycle, reported in zip(cycles, data["duty_cycles"], strict=True):
        result = duty_life(session, cycle, cases)
        assert reported["life_mrev"] == result.life_mrev and reported["life_h"] == result.life_h
        assert reported["mean_speed"] == result.mean_speed
        assert [s["damage_share"] for s in reported["states"]] == list(result.damage_shares)
        assert [s["revolution_share"] for s in reported["states"]] == list(result.revolution_shares)
        # Palmgren–Miner: 1/L = Σ ui/Li; hours at the mean speed, Lh = 10⁶·L/(60·nm)
        states = reported["states"]
        assert reported["life_mrev"] == pytest.approx(
            1 / sum(s["revolution_share"] / s["life_mrev"] for s in states), rel=1e-12)
        assert reported["life_h"] == pytest.approx(
            reported["life_mrev"] * 1e6 / (60 * reported["mean_speed"]), rel=1e-12)
        assert sum(s["time_share"] for s in states) == pytest.approx(1.0, rel=1e-12)
    assert data["duty_cycles"][1]["shaft"] == shaft.name and data["duty_cycles"][0]["shaft"] is None
    assert HELICAL_SOURCE in data["sources"]
    assert "Palmgren–Miner rule, 1/L = Σ ui/Li" in data["sources"]


def test_text_and_markdown_show_the_shaft_and_duty_sections() -> None:
    session = load_session(DEMO)
    analysis = analyse(session)
    text = render_report(session, "text", "demo")
    markdown = render_report(session, "markdown", "demo")
    assert "\nShafts\n------\n" in text and "\nDuty cycles\n-----------\n" in text
    assert "## Shafts" in markdown and "## Duty cycles" in markdown
    words = " ".join(text.split())  # the text report wraps at 74 columns: compare the words
    for outcome in analysis.shafts:
        for state in outcome.states:
            assert state.solution is not None
            for step in state.solution.derivation.steps:
                assert step.label in text and " ".join(f"[{step.source}]".split()) in words
        assert outcome.system is not None
        assert "L_sys" in text and f"System life at R = {outcome.system.reliability:g}" in words
    for duty in analysis.duties:
        assert duty.result is not None
        assert duty.result.derivation.step("L_h").label in text
    assert "Generated from shaft RM-2 input shaft: its Fr, Fa and speed" in text
    assert "RM-2 input shaft · full load · A *" in text


# ---- one bad shaft does not stop the rest ----------------------------------------------------
def small_session() -> Session:
    bearings = [Bearing("ball", {"kind": "deep-groove", "c": "30 kN", "c0": "20 kN"}),
                Bearing("rollers", {"kind": "cylindrical", "c": "60 kN", "c0": "55 kN"})]
    return Session(bearings=bearings, cases=[LoadCase("by hand", "ball",
                                                      {"fr": "2 kN", "speed": "1000 rpm"})])


def spur_shaft(name: str, **element: str) -> Shaft:
    texts = dict(position="80 mm", diameter="100 mm", pressure_angle="20°", driving="yes",
                 mesh_angle="0°") | element
    return Shaft(name, "ball", "ball", "0 mm", "200 mm", "B",
                 elements=[Element("gear", "spur", **texts)],
                 states=[OperatingState("run", torque="100 N·m", speed="1000 rpm", share="0.6"),
                         OperatingState("idle", torque="20 N·m", speed="1000 rpm", share="0.4")])


def test_a_broken_shaft_is_an_error_value_and_the_rest_reports() -> None:
    session = small_session()
    good = spur_shaft("good")
    bad = replace(spur_shaft("bad"), elements=[Element(
        "pinion", "helical", position="80 mm", diameter="100 mm", pressure_angle="20°",
        helix_angle="15 kg", hand="right", driving="yes", mesh_angle="0°")])
    no_bearing = replace(spur_shaft("lost"), bearing_b="nowhere")
    session.reserved["shafts"] = [shaft_to_table(s) for s in (bad, good, no_bearing)]
    session.reserved["duty_cycles"] = [
        duty_cycle_to_table(DutyCycle("hand and shaft",
                                      [("by hand", "1"), ("good · run · A", "1")])),
        duty_cycle_to_table(DutyCycle("missing", [("nowhere", "1")]))]
    analysis = analyse(session)
    assert [r.case.name for r in analysis.cases] == [
        "by hand", "good · run · A", "good · run · B", "good · idle · A", "good · idle · B"]
    assert all(r.derivation is not None for r in analysis.cases)
    broken, working, lost = analysis.shafts
    assert broken.shaft is None and broken.error is not None
    assert broken.error.startswith("shafts[1].elements[1].helix_angle: ")
    assert working.error is None and working.system is not None
    assert lost.error is not None and lost.error.startswith("shafts[3].bearing_b: ")
    assert all(s.error is not None and s.error.startswith("shafts[3].bearing_b: ")
               for s in lost.states)
    assert lost.system is None and lost.system_error is not None
    by_name = {d.name: d for d in analysis.duties}
    assert by_name["hand and shaft"].result is not None
    assert by_name["missing"].error == (
        "duty_cycles[2].states[1].case: no load case called 'nowhere'")
    assert by_name["good · A"].result is not None
    assert by_name["lost · A"].error == lost.error

    data = strict_json(render_report(session, "json", "mixed"))
    assert [c["error"] for c in data["cases"]] == [None] * 5
    assert data["shafts"][0]["error"] == broken.error and data["shafts"][0]["states"] == []
    assert data["shafts"][1]["system"]["life_h"] == working.system.life_h
    for fmt in ("text", "markdown"):
        report = render_report(session, fmt, "mixed")
        assert "shafts[1].elements[1].helix_angle" in report
        assert "shafts[3].bearing_b" in report and "duty_cycles[2].states[1].case" in report


def test_generated_name_clash_drops_only_that_shaft() -> None:
    session = small_session()
    session.cases.append(LoadCase("twin · run · A", "ball", {"fr": "1 kN", "speed": "900 rpm"}))
    session.reserved["shafts"] = [shaft_to_table(spur_shaft("twin")),
                                  shaft_to_table(spur_shaft("other"))]
    analysis = analyse(session)
    twin, other = analysis.shafts
    assert twin.error is not None and twin.error.startswith("shafts[1].states[1].name: ")
    assert other.error is None
    assert [r.case.name for r in analysis.cases][2:] == [
        "other · run · A", "other · run · B", "other · idle · A", "other · idle · B"]


def test_a_bad_table_type_is_an_error_value() -> None:
    session = small_session()
    session.reserved["shafts"] = {"name": "not an array"}
    session.reserved["duty_cycles"] = ["not a table"]
    analysis = analyse(session)
    assert analysis.shafts[0].error == "shafts: should be [[shafts]] tables, found a table"
    assert analysis.duties[0].error is not None and analysis.duties[0].error.startswith(
        "duty_cycles[1]: ")
    assert [r.case.name for r in analysis.cases] == ["by hand"]
    strict_json(render_report(session, "json", "odd"))


# ---- time shares -----------------------------------------------------------------------------
def test_time_shares_on_a_revolution_basis() -> None:
    # Palmgren–Miner shares: ui = ti·ni/Σ tj·nj, so ti ∝ ui/ni.  Revolution shares 0.5, 0.3, 0.2
    # at 1000, 500, 1500 r/min: ui/ni = 5.0e-4, 6.0e-4, 1.333e-4 (Σ 12.333e-4)
    # → ti = 0.405405, 0.486486, 0.108108.
    session = small_session()
    session.cases = [LoadCase(f"s{i}", "ball", {"fr": "2 kN", "speed": f"{n} rpm"})
                     for i, n in enumerate((1000, 500, 1500), start=1)]
    result = duty_life(session, DutyCycle("revs", [("s1", "0.5"), ("s2", "0.3"), ("s3", "0.2")],
                                          "revolutions"))
    assert time_shares(result) == pytest.approx((0.405405, 0.486486, 0.108108), abs=1e-6)
    timed = duty_life(session, DutyCycle("time", [("s1", "2"), ("s2", "1"), ("s3", "1")]))
    assert time_shares(timed) == pytest.approx((0.5, 0.25, 0.25), rel=1e-12)
