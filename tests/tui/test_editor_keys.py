"""Keys typed quickly after a key that opens a form or adds a row go to the new field; ↑/↓ in
the session dialog never stop where nothing shows; alt+y never adds a duty cycle unasked.

Keys are sent as one burst (posted to the app as a terminal's burst arrives, no pause between
them), so the test does not depend on timing: each key either acted before the next was
handed on, or the text landed in the wrong field."""

from __future__ import annotations

from textual import events
from textual.widgets import Input

from workbench.model import files
from workbench.model.shafts import GENERATED_NOTE
from workbench.tui.app import WorkbenchApp
from workbench.tui.session_screen import SessionScreen
from workbench.tui.line_pane import LinePane
from workbench.tui.shaft_editor import DutyEditor, ShaftEditor


def demo_app(*, cycles: bool = True) -> WorkbenchApp:
    """The demo session; without ``cycles``, none of its own duty cycles (the shaft's stay)."""
    session = files.open_session(files.demo_path()).session
    assert session is not None
    if not cycles:
        session.reserved.pop("duty_cycles")
    return WorkbenchApp(session, None, offer_recovery=False, autosave_delay=None)


def burst(app: WorkbenchApp, *keys: str) -> None:
    """``keys`` (a key name, or text typed character by character) as one burst."""
    for key in keys:
        if len(key) > 1 and " " not in key and (key.startswith(("alt+", "f", "ctrl+"))
                                                 or key in ("down", "up", "enter")):
            app.post_message(events.Key(key, None))
            continue
        for character in key:
            name = "space" if character == " " else character
            app.post_message(events.Key(name, character))


def value(app: WorkbenchApp, widget_id: str) -> str:
    return app.screen.query_one(f"#{widget_id}", Input).value


async def test_a_state_added_by_f3_takes_the_keys_typed_behind_it() -> None:
    """The newcomer's steps at 80×24: alt+h, f3, type "overload", ↓, type "30 kW", all in one
    burst.  The text went into the shaft's name ("overload30 kW", renaming every generated
    case) and the new state stayed "state 4"."""
    app = demo_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        burst(app, "alt+h", "f3", "overload", "down", "30 kW")
        await pilot.pause()
        assert isinstance(app.screen, ShaftEditor)
        assert value(app, "t--name") == "RM-2 input shaft"
        assert value(app, "t--states--3--name") == "overload"
        assert value(app, "t--states--3--power") == "30 kW"
        shaft = app.document.tables("shafts")[0]
        assert shaft["name"] == "RM-2 input shaft"
        assert shaft["states"][3]["name"] == "overload" and shaft["states"][3]["power"] == "30 kW"


async def test_the_session_dialog_takes_the_title_typed_at_once() -> None:
    """alt+i then typing at once: the typed title was lost (the keys reached the dialog before
    its first field had the focus)."""
    app = demo_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        burst(app, "alt+i", "Gearbox input shaft")
        await pilot.pause()
        assert isinstance(app.screen, SessionScreen)
        assert value(app, "detail-title") == "Gearbox input shaft"


async def test_down_at_the_session_dialogs_last_field_stays_there() -> None:
    """↓ from "Required s0" landed on an invisible stop (the scrolling box) where typing
    vanished, and the next ↓ wrapped to the title, which typing then replaced.  Now ↓ stays on
    s0 and the text typed goes there."""
    app = demo_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("alt+i")
        await pilot.pause()
        title = value(app, "detail-title")
        app.screen.set_focus(app.screen.query_one("#target-reliability"))
        await pilot.press("down")
        assert app.focused is not None and app.focused.id == "target-s0"
        await pilot.press("down", "down")  # past the last field
        assert app.focused is not None and app.focused.id == "target-s0"
        await pilot.press("ctrl+u", *"2")
        await pilot.pause()
        assert value(app, "target-s0") == "2"
        assert value(app, "detail-title") == title
        app.screen.set_focus(app.screen.query_one("#detail-project"))
        await pilot.press("up", "up", "up")  # and ↑ stops at the title, no stop before it
        assert app.focused is not None and app.focused.id == "detail-title"


async def test_alt_y_on_a_generated_case_adds_no_duty_cycle() -> None:
    """On a case a shaft generates, in a session with no duty cycle of its own, alt+y made a
    stray one-state "Duty cycle" and marked the session unsaved; now it says that the shaft's
    cycle is worked out from its states (alt+h) and changes nothing."""
    app = demo_app(cycles=False)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        screen = app.workbench_screen
        generated = next(i for i, r in enumerate(app.document.results)
                         if r.case.notes.startswith(GENERATED_NOTE))
        screen.query_one("CaseTable").move_cursor(row=generated)
        await pilot.pause()
        assert screen.selected == generated
        revision = app.document.revision
        await pilot.press("alt+y")
        await pilot.pause()
        assert app.screen is screen
        assert app.document.tables("duty_cycles") == []
        assert app.document.revision == revision and not app.document.can_undo
        shown = " ".join(str(n.message) for n in app._notifications)
        assert "worked out from its operating states" in shown and "alt+h" in shown


async def test_alt_y_opens_the_cycle_on_the_selected_cases_bearing() -> None:
    """Where a cycle of the session's runs on the selected case's bearing, alt+y opens it."""
    app = demo_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        cycles = len(app.document.tables("duty_cycles"))
        await pilot.press("alt+y")
        await pilot.pause()
        assert isinstance(app.screen, DutyEditor)
        assert len(app.document.tables("duty_cycles")) == cycles


async def test_undo_says_shaft_edits_in_the_editors_words() -> None:
    """Undo named a shaft edit by its 0-based path in the file ("edit shafts.0.name") and an
    added state by nothing ("add to …"); now each is said as the editor shows it (the words
    of ``model.table_words``)."""
    app = demo_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("alt+h", "f3", *"overload", "down", *"30 kW")
        await pilot.pause()
        shaft = "Shaft 'RM-2 input shaft', operating state 4"
        await pilot.press("escape", "ctrl+z")
        await pilot.pause()
        assert app._notifications and list(app._notifications)[-1].message == (
            f"Undone: edit {shaft} 'overload', Power")
        await pilot.press("ctrl+z")
        await pilot.pause()
        assert list(app._notifications)[-1].message == f"Undone: edit {shaft} 'overload', Name"
        await pilot.press("ctrl+z")
        await pilot.pause()
        assert list(app._notifications)[-1].message == f"Undone: add {shaft} 'state 4'"


def test_the_whatif_duty_error_says_the_key_in_the_editors_words() -> None:
    """The What-if pane's line for a duty cycle that cannot be worked out named its file key
    ("duty_cycles[1].states[2].share"); it is said as the duty-cycle editor says it."""
    from workbench.model.analysis import DutyOutcome
    from workbench.tui.shaft_editor import session_in_words
    from workbench.tui.whatif_pane import duty_lines

    app = demo_app()
    failed = DutyOutcome("duty_cycles[1]", "Locating end, hand-resolved shift pattern", None,
                         None, None, "duty_cycles[1].states[2].share: 'x' is not a number")
    line = duty_lines([failed], "SI", session_in_words(app.document))[0].plain
    assert line == ("✘ Locating end, hand-resolved shift pattern: Duty cycle 'Locating end, "
                    "hand-resolved shift pattern', state 2 'Locating end, part load', Share: "
                    "'x' is not a number")
    assert "[" not in line


BEFORE_THE_ERROR = "The last results without an error, until it is put right:"


async def test_a_shaft_error_keeps_the_last_good_results_under_it() -> None:
    """A bad share of one state put the error in place of every bearing load; now the error
    comes first and the last results without an error stay under it, said to be so."""
    app = demo_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("alt+h")
        await pilot.pause()
        editor = app.screen
        assert isinstance(editor, ShaftEditor)
        before = editor.query_one("#table-results", LinePane).text.plain
        assert "bearing A: Fr = " in before and "✘" not in before
        editor.set_focus(editor.query_one("#t--states--0--share", Input))
        await pilot.press("ctrl+u", *"xx")
        await pilot.pause()
        shown = editor.query_one("#table-results", LinePane).text.plain
        assert shown.startswith("✘ Shaft 'RM-2 input shaft', operating state 1 'full load', "
                                "Share of time: xx")
        assert BEFORE_THE_ERROR in shown
        # the last results without an error (the blank share of ctrl+u was one): the first
        # state's bearing loads as before
        kept = shown.split(BEFORE_THE_ERROR)[1]
        assert before.split("\n")[:3] == kept.strip("\n").split("\n")[:3], kept[:300]
