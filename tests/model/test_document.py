"""The document without a screen: edit runs, one undo stack for every edit, incremental
re-derivation, solver answers tied to a revision, bearings, targets and tables."""

from __future__ import annotations

import sys
from pathlib import Path

import pytest

sys.path.insert(0, str(Path(__file__).parents[1] / "tui"))  # the test-rig session

from tui_sessions import rig_session  # noqa: E402

from workbench.engine.record import InputError  # noqa: E402
from workbench.model.document import Document  # noqa: E402
from workbench.model.nudge import number_text, scale_text  # noqa: E402
from workbench.model.session import Session  # noqa: E402
from workbench.model.sessionfile import dumps_session, load_session, loads_session  # noqa: E402
from workbench.model.targets import solver_target  # noqa: E402

DEMO = Path(__file__).parents[2] / "sessions" / "demo.toml"


def test_half_typed_prefix_never_stays_in_force() -> None:
    document = Document(rig_session())
    for text in ("", "5", "5 ", "5 k", "5 kg"):  # typing "5 kg" over "3 kN"
        document.set_field(0, "fr", text)
    assert document.session.cases[0].texts["fr"] == "3 kN"
    assert not document.can_undo  # back where the run began: no undo step left behind


def test_valid_run_is_one_undo_step() -> None:
    document = Document(rig_session())
    for text in ("", "4", "4.", "4.5", "4.5 kN"):
        assert document.set_field(0, "fr", text) is None
    document.end_run()
    assert document.session.cases[0].texts["fr"] == "4.5 kN"
    undone = document.undo()
    assert undone is not None and undone.label == "edit Radial load Fr" and undone.case_index == 0
    assert document.session.cases[0].texts["fr"] == "3 kN"
    assert not document.can_undo
    document.redo()
    assert document.session.cases[0].texts["fr"] == "4.5 kN"


def test_after_a_run_ends_a_bad_text_falls_back_to_its_value() -> None:
    document = Document(rig_session())
    document.set_field(0, "fr", "4 kN")
    document.end_run()
    assert document.set_field(0, "fr", "4 kNx") is not None
    assert document.session.cases[0].texts["fr"] == "4 kN"


def test_engine_refusal_of_this_field_puts_back_the_run_start() -> None:
    document = Document(rig_session())
    # ISO 281:2007 Table 12 gives a1 from 90 % to 99.95 % only: 0.9999 is refused by the engine.
    message = document.set_field(0, "reliability", "0.9999")
    assert message is not None and "0.9995" in message
    assert "reliability" not in document.session.cases[0].texts


def test_every_change_raises_the_revision_and_marks_it_dirty() -> None:
    document = Document(rig_session())
    assert not document.dirty
    start = document.revision
    document.set_field(0, "fr", "4 kN")
    assert document.revision == start + 1 and document.dirty
    document.mark_saved(Path("rig.toml"))
    assert not document.dirty
    document.toggle_units()
    assert document.dirty and document.units == "US"


def test_structural_edits_and_their_undo() -> None:
    document = Document(rig_session())
    added = document.add_case(0)
    copy = document.duplicate_case(added)
    assert [c.name for c in document.session.cases] == [
        "Steady run", "Case 4", "Case 4 copy", "Peak torque", "Idler end"]
    assert copy == 2
    assert document.rename_case(2, "Peak torque") is not None  # taken
    assert document.rename_case(2, "x" * 61) is not None
    assert document.rename_case(2, "bad\x07name") is not None
    assert document.rename_case(2, "  Spare  ") is None
    assert document.case(2).name == "Spare"
    assert document.move_case(2, -1) == 1
    assert Document(rig_session(1)).move_case(0, 1) is None
    assert document.delete_case(1) == "Spare"
    assert len(document.results) == len(document.session.cases) == 4
    while document.can_undo:
        document.undo()
    assert [c.name for c in document.session.cases] == ["Steady run", "Peak torque", "Idler end"]


def test_move_problem_says_why_a_case_cannot_move() -> None:
    document = Document(rig_session())
    assert document.move_problem(0, -1) == "Steady run is the first case already"
    assert document.move_problem(2, 1) == "Idler end is the last case already"
    assert document.move_problem(1, 1) is None and document.move_problem(1, -1) is None
    assert document.move_problem(5, 1) == "no load case is selected"
    demo = Document(load_session(DEMO))
    last_own = len(demo.session.cases) - 1
    assert "the cases made from shafts stay below" in demo.move_problem(last_own, 1)
    assert demo.move_problem(last_own + 1, -1) == demo.generated_problem(last_own + 1)


def test_empty_session_is_safe() -> None:
    document = Document(rig_session(0))
    assert document.case(0) is None and document.result(0) is None
    assert document.set_field(0, "fr", "1 kN") is not None
    assert document.delete_case(0) is None and document.duplicate_case(0) is None
    assert document.move_case(0, 1) is None
    with pytest.raises(InputError):
        document.solve(0, "c", "Lnm=20000 h")
    document.add_case(-1)
    assert document.case(0) is not None and document.result(0) is not None
    assert document.result(0).derivation is None  # no loads yet: the engine says so


def test_a_new_session_gets_a_bearing_with_its_first_case() -> None:
    document = Document(rig_session(0))
    document.session.bearings.clear()
    document.add_case(-1)
    assert [b.name for b in document.session.bearings] == ["Bearing 1"]
    assert document.case(0).bearing == "Bearing 1"
    document.undo()  # one step: the case and its bearing
    assert not document.session.bearings and not document.session.cases


def test_apply_needs_a_current_solution_for_this_case() -> None:
    document = Document(rig_session())
    with pytest.raises(InputError):
        document.apply_solution(0)
    document.solve(0, "fr", "s0=4")
    with pytest.raises(InputError):
        document.apply_solution(1)
    document.apply_solution(0)
    # ISO 76:2006 §9: s0 = C0/P0 with P0 = Fr here: Fr = 16 kN / 4 = 4 kN.
    assert document.session.cases[0].texts["fr"] == "4 kN"


def test_an_answer_goes_out_of_date_with_any_change() -> None:
    document = Document(rig_session())
    document.solve(0, "fr", "s0=4")
    assert document.solved_is_current
    document.set_field(1, "fa", "0.5 kN")  # another case: still a change to the session
    document.end_run()
    assert not document.solved_is_current
    with pytest.raises(InputError, match="changed since"):
        document.apply_solution(0)


def test_the_applied_value_meets_its_own_target() -> None:
    document = Document(load_session(DEMO))
    for target in ("Lnm=30000 h", "Lnm=25000 h", "L10h=12345 h", "s0=7"):
        name, value = target.split("=")
        document.solve(0, "fr", target)
        document.apply_solution(0)
        achieved = document.result(0).derivation.results[name]
        assert achieved >= float(value.split()[0])  # every target is a least value
        document.undo()


def test_a_solver_question_follows_the_life_target_until_given_its_own() -> None:
    """A practising engineer's expectation: the session's life target is the solver's until
    the solver is given another; a target the solver was given stays when the session's moves."""
    session = rig_session()
    session.solver.target = ""
    document = Document(session)
    assert solver_target(session) == "Lnm=20000 h"
    document.question(0, "c", "Lnm=20000 h")  # asked as shown: still following
    assert session.solver.target == ""
    document.set_details({}, {"life": "40000 h"})
    assert solver_target(session) == "Lnm=40000 h"
    document.question(0, "c", "Lnm=25000 h")  # a target of its own
    document.set_details({}, {"life": "50000 h"})
    assert solver_target(session) == "Lnm=25000 h"
    document.question(0, "c", "Lnm=50000 h")  # its own, now equal to the session's: still its own
    assert session.solver.target == "Lnm=50000 h"


def test_a_case_field_derives_only_its_case(derived: list[str]) -> None:
    document = Document(rig_session(5))
    derived.clear()
    document.set_field(2, "fr", "4 kN")
    assert document.results  # the analysis brought up to date
    assert derived == ["Idler end"]


def test_a_bearing_field_derives_the_cases_on_that_bearing(derived: list[str]) -> None:
    document = Document(rig_session(5))
    derived.clear()
    document.set_field(0, "c", "31 kN")  # the Drive bearing: every case but the idler's
    assert document.results
    assert sorted(derived) == sorted(c.name for c in document.session.cases
                                     if c.bearing == "Drive")
    assert document.result(1).inputs.c == pytest.approx(31_000.0)


def test_incremental_results_equal_a_full_analysis() -> None:
    from workbench.model.analysis import analyse

    document = Document(load_session(DEMO))
    document.set_field(1, "c", "50 kN")
    document.end_run()
    document.set_field(3, "fa", "6 kN")
    full = analyse(document.session, keep_steps=False)
    assert [r.derivation.results if r.derivation else r.error for r in document.results] == \
        [r.derivation.results if r.derivation else r.error for r in full.cases]
    assert [d.result.life_mrev if d.result else d.error for d in document.analysis.duties] == \
        [d.result.life_mrev if d.result else d.error for d in full.duties]


def test_duty_cycles_are_worked_out_again_only_for_the_cases_they_name(
        derived: list[str]) -> None:
    from workbench.model.analysis import analyse

    document = Document(load_session(DEMO))
    named = {case for table in document.session.reserved["duty_cycles"]
             for case in (state["case"] for state in table["states"])}
    assert document.session.cases[0].name not in named  # the free end: in no cycle
    duties = document.analysis.duties
    derived.clear()
    document.set_field(0, "fr", "3.9 kN")
    assert document.analysis.duties is duties and derived == [document.session.cases[0].name]
    document.end_run()
    index = next(i for i, case in enumerate(document.session.cases) if case.name in named)
    document.set_field(index, "fr", "7 kN")
    assert document.analysis.duties is not duties
    full = analyse(document.session, keep_steps=False)
    # Palmgren–Miner over the cycle's states: the same life as a full analysis gives
    assert [d.result.life_mrev if d.result else d.error for d in document.analysis.duties] == \
        [d.result.life_mrev if d.result else d.error for d in full.duties]


def test_bearings_add_rename_and_delete() -> None:
    document = Document(rig_session())
    name = document.add_bearing(like="Drive")
    assert name == "Drive copy"
    assert document.session.bearing(name).texts == document.session.bearing("Drive").texts
    problem = document.delete_bearing("Drive")
    assert problem is not None and "Steady run" in problem  # used: refused, naming the cases
    assert document.rename_bearing("Drive", "Idler") is not None  # taken
    assert document.rename_bearing("Drive", "Input") is None
    assert {c.bearing for c in document.session.cases} == {"Input", "Idler"}
    assert document.delete_bearing(name) is None
    document.undo()
    document.undo()
    assert {c.bearing for c in document.session.cases} == {"Drive", "Idler"}


def test_adopting_keeps_the_designation_and_source() -> None:
    document = Document(rig_session())
    document.adopt_bearing("Drive", {"c": "35 kN", "c0": "19 kN"}, designation="DG-50-90",
                           source="demo catalog, row 7")
    bearing = document.session.bearing("Drive")
    assert (bearing.designation, bearing.source, bearing.texts["c"]) == (
        "DG-50-90", "demo catalog, row 7", "35 kN")
    document.undo()
    assert (bearing.designation, bearing.source, bearing.texts["c"]) == ("", "", "30 kN")


def test_a_rated_bearing_keeps_its_geometry_and_a_catalog_one_clears_it() -> None:
    document = Document(rig_session())
    geometry = {"elements": "10", "dw": "7.9 mm", "dpw": "45 mm", "kind": "deep-groove"}
    document.adopt_bearing("Drive", {"c": "14.9 kN"}, designation="the geometry rating",
                           source="rated from geometry", geometry=geometry)
    bearing = document.session.bearing("Drive")
    assert bearing.geometry == {"elements": "10", "dw": "7.9 mm", "dpw": "45 mm"}
    document.adopt_bearing("Drive", {"c": "35 kN"}, designation="DG-50-90", source="catalog")
    assert bearing.geometry == {}  # it described the bearing the catalog row replaces
    document.undo()
    assert bearing.geometry["elements"] == "10"
    document.undo()
    assert bearing.geometry == {} and bearing.texts["c"] == "30 kN"


def test_geometry_and_fit_edits_are_checked_and_undone() -> None:
    document = Document(rig_session())
    revision = document.revision
    assert document.set_geometry("Drive", "dw", "12 kN") is not None  # not a length
    assert document.set_geometry("Drive", "colour", "red") is not None
    assert document.revision == revision
    assert document.set_geometry("Drive", "dw", "7.9 mm") is None
    assert document.session.bearing("Drive").geometry == {"dw": "7.9 mm"}
    assert document.revision == revision + 1
    # clearance is the bearing's (every case on it), tilt the case's; neither reaches ISO 281
    before = [r.derivation.results for r in document.results]
    assert document.set_field(1, "clearance", "-0.005 mm") is None
    document.end_run()
    assert document.set_field(0, "tilt", "1 mrad") is None
    document.end_run()
    assert document.session.bearing("Drive").texts["clearance"] == "-0.005 mm"
    assert document.session.cases[0].texts["tilt"] == "1 mrad"
    assert [r.derivation.results for r in document.results] == before
    for _ in range(3):
        document.undo()
    assert document.session.bearing("Drive").geometry == {}
    assert "clearance" not in document.session.bearing("Drive").texts
    assert "tilt" not in document.session.cases[0].texts


def test_details_and_targets_are_one_step_and_checked() -> None:
    document = Document(rig_session())
    problems = document.set_details({"title": "Rig B"}, {"life": "30000 kg"})
    assert set(problems) == {"life"} and document.session.title == "Test-rig gearbox"
    assert document.set_details({"title": "Rig B", "engineer": "A. Person"},
                                {"life": "30000 h", "s0": ""}) == {}
    assert (document.session.title, document.session.targets.life) == ("Rig B", "30000 h")
    assert document.result(0).meets_life is not None
    document.undo()
    assert (document.session.title, document.session.targets.life) == (
        "Test-rig gearbox", "20000 h")


def test_no_life_target_means_no_life_verdict() -> None:
    document = Document(rig_session())
    document.set_details({}, {"life": ""})
    assert all(r.meets_life is None for r in document.results)


def test_a_static_check_has_no_life_verdict() -> None:
    document = Document(rig_session())
    document.set_field(1, "static_only", "yes")
    result = document.result(1)
    assert result.static_only and result.meets_life is None and result.meets_s0 is not None


def test_tables_are_kept_as_typed_and_undo_in_runs() -> None:
    document = Document(load_session(DEMO))
    before = document.tables("shafts")
    for text in ("2", "20", "20°"):
        document.set_table_text("shafts", 0, ("elements", 0), "helix_angle", text)
    document.end_run()
    assert document.tables("shafts")[0]["elements"][0]["helix_angle"] == "20°"
    document.undo()  # the three keystrokes were one step
    assert document.tables("shafts") == before


def test_a_shaft_edit_moves_its_generated_cases() -> None:
    document = Document(load_session(DEMO))
    own = len(document.session.cases)
    fr_before = document.result(own).inputs.fr
    document.set_table_text("shafts", 0, ("states", 0), "power", "45 kW")
    assert document.result(own).inputs.fr > fr_before  # more power through the pinion


def test_a_bearing_only_a_shaft_uses_takes_its_ratings_through_a_generated_case() -> None:
    # a new session: two bearings, one shaft on them, no own case (as a newcomer builds it)
    document = Document(load_session(DEMO))
    session = document.session
    session.cases.clear()
    session.reserved.pop("duty_cycles", None)
    document = Document(session)
    shaft = document.tables("shafts")[0]
    generated = next(index for index in range(len(document.results))
                     if document.case(index).bearing == shaft["bearing_a"])
    assert document.generated_problem(generated) is not None  # its loads come from the shaft
    assert document.set_field(generated, "fr", "1 kN") is not None  # refused: edit the shaft
    assert document.set_field(generated, "c", "61.3 kN") is None  # the bearing's own field
    assert session.bearing(shaft["bearing_a"]).texts["c"] == "61.3 kN"
    assert document.result(generated).inputs.c == pytest.approx(61300.0)  # derived again


@pytest.mark.parametrize(("text", "factor", "expected"), [
    ("3 kN", 1.05, "3.15 kN"),
    ("  1200 r/min", 0.5, "  600 r/min"),
    ("1e3 N", 1.01, "1010 N"),
    ("70 °C", 0.95, "66.5 °C"),
    ("kN", 1.05, None),
    ("", 1.05, None),
    ("1e300", 1e10, None),
])
def test_scale_text_keeps_what_follows_the_number(text: str, factor: float,
                                                  expected: str | None) -> None:
    assert scale_text(text, factor) == expected


def test_nudges_compound_to_four_significant_figures() -> None:
    # 1.2 kN × 1.05³ = 1.38915 kN (closed form); each nudge writes four figures
    document = Document(rig_session())
    document.set_field(0, "fr", "1.2 kN")
    for _ in range(3):
        assert document.nudge(0, "fr", 1.05) is None
    assert document.session.cases[0].texts["fr"] == "1.389 kN"
    for _ in range(3):
        assert document.nudge(0, "fr", 1 / 1.05) is None
    assert document.session.cases[0].texts["fr"] == "1.2 kN"  # and back again


@pytest.mark.parametrize(("value", "rounding", "expected"), [
    (3.7268014, "nearest", "3.726801"),
    (3.7268014, "up", "3.726802"),
    (3.7268016, "down", "3.726801"),
    (-2.5000001, "down", "-2.500001"),
    (1200.0, "up", "1200"),
])
def test_number_text_rounds_at_the_seventh_figure(value: float, rounding: str,
                                                  expected: str) -> None:
    assert number_text(value, rounding) == expected  # type: ignore[arg-type]


def _reopened(document: Document) -> Session:
    """The document's session as a file of it reads back (refused files raise)."""
    return loads_session(dumps_session(document.session))


def test_a_renamed_case_is_renamed_in_its_duty_cycle_and_the_file_opens_again() -> None:
    # renaming a case a duty cycle names wrote a file that refused to open
    document = Document(load_session(DEMO))
    cycle = document.session.reserved["duty_cycles"][0]
    named = cycle["states"][0]["case"]
    index = next(i for i, case in enumerate(document.session.cases) if case.name == named)
    assert document.rename_case(index, "Locating end, rated") is None
    assert cycle["states"][0]["case"] == "Locating end, rated"
    assert _reopened(document).reserved["duty_cycles"][0]["states"][0]["case"] == \
        "Locating end, rated"
    document.undo()
    assert cycle["states"][0]["case"] == named


def test_a_case_in_a_duty_cycle_is_not_deleted_and_says_why() -> None:
    document = Document(load_session(DEMO))
    cycle = document.session.reserved["duty_cycles"][0]
    named = cycle["states"][0]["case"]
    index = next(i for i, case in enumerate(document.session.cases) if case.name == named)
    problem = document.delete_problem(index)
    assert problem is not None and cycle["name"] in problem
    assert document.delete_case(index) is None
    assert named in {case.name for case in _reopened(document).cases}


def test_a_solver_question_on_a_deleted_case_is_left_out_of_the_file() -> None:
    # deleting the case the solver asked about wrote a file that refused to open
    document = Document(load_session(DEMO))
    free = next(i for i, case in enumerate(document.session.cases)
                if document.delete_problem(i) is None)
    document.session.solver.case = document.session.cases[free].name
    assert document.delete_case(free) is not None
    assert _reopened(document).solver.case == ""
