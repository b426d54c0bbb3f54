"""The workbench document without a screen: edit runs, undo/redo, structural edits."""

from __future__ import annotations

import pytest
from tui_sessions import rig_session

from workbench.engine.record import InputError
from workbench.tui.state import Workbench
from workbench.tui.whatif import scale_text


def test_half_typed_prefix_never_stays_in_force() -> None:
    state = Workbench(rig_session())
    for text in ("", "5", "5 ", "5 k", "5 kg"):  # typing "5 kg" over "3 kN"
        state.set_text("fr", text)
    assert state.session.cases[0].texts["fr"] == "3 kN"
    assert not state.can_undo  # back where the run began: no undo step left behind


def test_valid_run_is_one_undo_step() -> None:
    state = Workbench(rig_session())
    for text in ("", "4", "4.", "4.5", "4.5 kN"):
        assert state.set_text("fr", text) is None
    state.end_run()
    assert state.session.cases[0].texts["fr"] == "4.5 kN"
    assert state.undo() == "edit Radial load Fr"
    assert state.session.cases[0].texts["fr"] == "3 kN"
    assert not state.can_undo
    state.redo()
    assert state.session.cases[0].texts["fr"] == "4.5 kN"


def test_after_a_run_ends_a_bad_text_falls_back_to_its_value() -> None:
    state = Workbench(rig_session())
    state.set_text("fr", "4 kN")
    state.end_run()
    assert state.set_text("fr", "4 kNx") is not None
    assert state.session.cases[0].texts["fr"] == "4 kN"


def test_structural_edits_and_their_undo() -> None:
    state = Workbench(rig_session())
    state.add_case()
    state.duplicate_case()
    assert [c.name for c in state.session.cases] == [
        "Steady run", "Case 4", "Case 4 copy", "Peak torque", "Idler end"]
    assert state.rename_case("Peak torque") is not None  # taken
    assert state.rename_case("x" * 61) is not None
    assert state.rename_case("bad\x07name") is not None
    assert state.rename_case("  Spare  ") is None
    assert state.case.name == "Spare"
    assert state.move_case(-1) and state.selected == 1
    assert not Workbench(rig_session(1)).move_case(1)
    assert state.delete_case() == "Spare"
    assert len(state.results) == len(state.session.cases) == 4
    while state.can_undo:
        state.undo()
    assert [c.name for c in state.session.cases] == ["Steady run", "Peak torque", "Idler end"]


def test_empty_session_is_safe() -> None:
    state = Workbench(rig_session(0))
    assert state.case is None and state.result is None
    assert state.set_text("fr", "1 kN") is not None
    assert state.delete_case() is None and state.duplicate_case() is None
    assert not state.move_case(1)
    with pytest.raises(InputError):
        state.solve("c", "Lnm=20000 h")
    state.add_case()
    assert state.case is not None and state.result is not None
    assert state.result.derivation is None  # no loads yet: the engine says so, no crash


def test_apply_needs_a_solution_for_this_case() -> None:
    state = Workbench(rig_session())
    with pytest.raises(InputError):
        state.apply_solution()
    state.solve("fr", "s0=4")
    state.select(1)
    with pytest.raises(InputError):
        state.apply_solution()
    state.select(0)
    state.apply_solution()
    # ISO 76:2006 §9: s0 = C0/P0 with P0 = Fr here: Fr = 16 kN / 4 = 4 kN.
    assert state.session.cases[0].texts["fr"] == "4 kN"


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
