"""Words a newcomer reads on the screen (the shipped demo session, or the test rig's): the
speed's unit, the shaft editor's messages and headings, what a refused text leaves in force."""

from __future__ import annotations

import pytest
from textual.widgets import Input, Static

from tui_helpers import derivation_text, retype, selected_result

from screen_host import demo_app, demo_session

from workbench.model.analysis import analyse
from workbench.tui.app import WorkbenchApp
from workbench.tui.line_pane import LinePane
from workbench.tui.shaft_editor import ShaftEditor
from workbench.tui.shafts_screen import ShaftsScreen




def test_the_demo_session_spells_every_speed_r_min() -> None:
    """Every speed the demo's cases hold, its own and those its shaft generates, reads r/min."""
    speeds = [evaluated.case.texts["speed"] for evaluated in analyse(demo_session()).cases]
    assert speeds and all(text.endswith(" r/min") for text in speeds), speeds


async def test_the_speed_unit_reads_r_min_on_screen_and_rpm_is_still_read() -> None:
    """The speed box, its example and the derivation pane all write r/min (ISO 80000-3), the
    spelling the panes use; typed "rpm" is still read as the same unit."""
    app = demo_app()
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        box = app.workbench_screen.query_one("#field-speed", Input)
        assert box.value == "1480 r/min"
        assert box.placeholder == "e.g. 1200 r/min"
        shown = derivation_text(app)
        assert "r/min" in shown and "rpm" not in shown
        await retype(pilot, app, "speed", "740 rpm")
        result = selected_result(app)
        assert result is not None and result.derivation is not None
        # ISO 281:2007 §5.3 (and §7.3): L10h = 10⁶·L10/(60·n), n = 740 r/min
        assert result.derivation.results["L10h"] == pytest.approx(
            result.derivation.results["L10"] * 1e6 / (60 * 740.0), rel=1e-12)
        assert "rpm" not in derivation_text(app)


def results_text(app: WorkbenchApp) -> str:
    """What the shaft editor's results pane shows, as plain text."""
    return app.screen.query_one("#table-results", LinePane).text.plain


async def open_shaft_editor(pilot) -> None:
    await pilot.pause()
    await pilot.press("alt+h")
    await pilot.pause()
    assert isinstance(pilot.app.screen, ShaftEditor)


async def type_into(pilot, widget_id: str, text: str) -> None:
    box = pilot.app.screen.query_one(f"#{widget_id}", Input)
    box.focus()
    await pilot.pause()
    await pilot.press("end", "ctrl+u", *text)
    await pilot.pause()


async def test_the_shaft_editor_names_a_bad_text_in_its_own_words() -> None:
    """A refused power of the first state is named by the shaft's name, the state's number and
    name and the field's label, never by its key in the file ("shafts[1].states[1].power")."""
    app = demo_app()
    async with app.run_test(size=(120, 40)) as pilot:
        await open_shaft_editor(pilot)
        await type_into(pilot, "t--states--0--power", "xx")
        shown = " ".join(results_text(app).split())  # as one line: the pane wraps it
        assert ("Shaft 'RM-2 input shaft', operating state 1 'full load', Power: xx: a unit "
                "with no number") in shown
        assert "shafts[" not in shown and "states[" not in shown


async def test_the_shaft_editor_names_a_generated_case_that_cannot_be_derived() -> None:
    """A case input the engine refuses (R = 0.5, outside ISO 281 Table 12) stops the system
    life; the message names the state and the case input by its label, not by keys."""
    app = demo_app()
    async with app.run_test(size=(120, 40)) as pilot:
        await open_shaft_editor(pilot)
        await type_into(pilot, "t--case_fields--reliability", "0.5")
        shown = " ".join(results_text(app).split())
        assert ("system life: Shaft 'RM-2 input shaft', operating state 1 'full load', its "
                "generated case: case 'RM-2 input shaft · full load · A': Reliability R:") in shown
        assert "shafts[" not in shown and "states[" not in shown and "reliability:" not in shown


async def test_a_new_operating_state_has_a_numbered_name_and_no_doubled_heading() -> None:
    """f3 adds "state 4" after the demo's three states (its number in the list, as the form
    titles it), then "state 5"; the results head them "State 4", never "State state"."""
    app = demo_app()
    async with app.run_test(size=(120, 40)) as pilot:
        await open_shaft_editor(pilot)
        await pilot.press("f3")
        await pilot.pause()
        await pilot.press("f3")
        await pilot.pause()
        names = [app.screen.query_one(f"#t--states--{row}--name", Input).value for row in (3, 4)]
        assert names == ["state 4", "state 5"]
        shown = results_text(app)
        assert "State 4\n" in shown and "State 5\n" in shown
        assert "State state" not in shown and "state state" not in shown
        assert "RM-2 input shaft · state 4 · A" in shown


@pytest.mark.parametrize(("field", "in_force", "words"), [
    ("vi", "", "the calculation still has this field blank (blank means 100)"),
    ("af", "", "the calculation still has this field blank"),
    ("fr", "3 kN", "the calculation still uses 3 kN"),
])
async def test_a_refused_text_says_what_the_calculation_uses(make_app, field: str,
                                                             in_force: str, words: str) -> None:
    """Under a refused text the note says what the calculation uses meanwhile: the value in
    force, or that the field is blank there (with what blank means, where its hint says);
    never the obscure "in force: (blank)"."""
    app = make_app()
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        assert app.document.texts(0).get(field, "") == in_force
        await retype(pilot, app, field, "abc")
        note = str(app.workbench_screen.query_one(f"#note-{field}", Static).render())
        assert note.endswith(f" · {words}"), note
        assert "(blank)" not in note and "in force:" not in note


async def test_the_shafts_view_names_errors_as_the_editors_do() -> None:
    """The shafts view (alt+s) says a shaft's error in the editor's words too."""
    app = demo_app()
    async with app.run_test(size=(120, 40)) as pilot:
        await open_shaft_editor(pilot)
        await type_into(pilot, "t--case_fields--reliability", "0.5")
        await pilot.press("escape")
        await pilot.pause()
        await pilot.press("alt+s")
        await pilot.pause()
        assert isinstance(app.screen, ShaftsScreen)
        shown = " ".join(str(static.render()) for static in app.screen.query(Static))
        assert ("System life: Shaft 'RM-2 input shaft', operating state 1 'full load', its "
                "generated case: case 'RM-2 input shaft · full load · A': Reliability R:") in shown
        assert "shafts[" not in shown and "states[" not in shown
