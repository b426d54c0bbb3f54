"""The shafts view and the generated cases: the loads analyse() gives, read-only on screen."""

from __future__ import annotations

import math

import pytest

from textual.widgets import DataTable

from screen_host import ScreenHost, column_texts, cut_widgets, demo_app, demo_session

from workbench.model.analysis import analyse
from workbench.model.quantities import format_quantity
from workbench.model.shafts import KIND_WORDS, is_generated
from workbench.tui.case_table import CaseTable
from workbench.tui.shafts_screen import ShaftsScreen




@pytest.mark.parametrize("size", [(80, 24), (120, 40)])
async def test_shafts_view_tables_show_what_analyse_gives(size) -> None:
    analysis = analyse(demo_session())
    app = ScreenHost(lambda: ShaftsScreen(analysis, "SI"))
    async with app.run_test(size=size) as pilot:
        await pilot.pause()
        screen = app.screen
        assert isinstance(screen, ShaftsScreen)
        assert app.focused is screen.query_one("#shaft-0-elements")  # the first table
        assert cut_widgets(screen) == []
        shaft = analysis.shafts[0]
        assert column_texts(screen.query_one("#shaft-0-elements", DataTable), 1) == \
            [KIND_WORDS[element.kind] for element in shaft.shaft.elements]
        states = screen.query_one("#shaft-0-states", DataTable)
        assert column_texts(states, 0) == [state.state.name for state in shaft.states]
        for column, (side, load) in enumerate([("A", 0), ("A", 1), ("B", 0), ("B", 1)], 1):
            assert column_texts(states, column) == [
                format_quantity(state.solution.bearing_loads[side][load], "force", "SI")
                for state in shaft.states]
        for n, _duty in enumerate(analysis.duties):
            damage = [float(text) for text in column_texts(screen.query_one(f"#duty-{n}"), 2)]
            assert sum(damage) == pytest.approx(100.0, abs=0.1 * len(damage))  # Miner: Σ shares = 1
        await pilot.press("escape")
        await pilot.pause()
        assert app.answers == [None]


async def test_page_keys_scroll_the_overview_from_inside_a_table() -> None:
    """At 80×24 the duty cycles sit below the fold while the focus is in the first table: the
    page keys scroll the overview (a table's own page keys left it where it was)."""
    analysis = analyse(demo_session())
    app = ScreenHost(lambda: ShaftsScreen(analysis, "SI"))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        view = app.screen.query_one("#shafts-view")
        assert isinstance(app.focused, DataTable) and view.scroll_y == 0 and view.max_scroll_y > 0
        await pilot.press("pagedown")
        await pilot.pause()
        assert view.scroll_y > 0
        await pilot.press("ctrl+end")
        await pilot.pause()
        assert view.scroll_y == view.max_scroll_y
        await pilot.press("ctrl+home")
        await pilot.pause()
        assert view.scroll_y == 0


async def test_moving_through_the_states_shows_each_free_body() -> None:
    analysis = analyse(demo_session())
    app = ScreenHost(lambda: ShaftsScreen(analysis, "SI"))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        screen = app.screen
        free_body = screen.query_one("#shaft-0-free-body")
        first, second = (state.state.name for state in analysis.shafts[0].states[:2])
        assert f"State {first}:" in str(free_body.render())
        await pilot.press("tab")
        assert app.focused is screen.query_one("#shaft-0-states")
        await pilot.press("down")
        await pilot.pause()
        assert f"State {second}:" in str(free_body.render())
        assert "Wt = 2T/d" in str(free_body.render())


def test_locating_bearing_takes_the_helix_thrust() -> None:
    # Helical gear force relations: T = P/ω, Wt = 2T/d, Wa = Wt·tan β; the locating bearing B
    # carries all the thrust (shaft axial equilibrium). Demo: 30 kW at 1480 r/min, d = 56 mm, β = 18°.
    torque = 30_000 / (2 * math.pi * 1480 / 60)
    thrust = 2 * torque / 0.056 * math.tan(math.radians(18))
    full_load = analyse(demo_session()).shafts[0].states[0].solution
    assert full_load is not None
    assert full_load.bearing_loads["B"][1] == pytest.approx(thrust, rel=1e-9)
    assert full_load.bearing_loads["A"][1] == 0.0


async def test_generated_cases_are_listed_and_read_only() -> None:
    app = demo_app()
    own = len(demo_session().cases)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        document = app.document
        table = app.workbench_screen.query_one(CaseTable)
        assert table.row_count == len(analyse(document.session).cases)
        table.move_cursor(row=own)
        await pilot.pause()
        case = document.case(own)
        assert case is not None and is_generated(case) and app.workbench_screen.selected == own
        typed_before = dict(case.texts)
        assert app.workbench_screen.query_one("#field-fr").disabled  # read-only here
        assert "generated from shaft RM-2 input shaft" in str(
            app.workbench_screen.query_one("#case-note").render())
        assert document.set_field(own, "fr", "1 kN") is not None  # refused, with the reason
        assert case.texts == typed_before and not document.dirty
        await pilot.press("f8")  # delete: refused
        await pilot.pause()
        assert len(document.results) == len(analyse(document.session).cases)
        assert not document.dirty
        await pilot.press("ctrl+d")  # duplicate: an ordinary, editable copy
        await pilot.pause()
        assert len(document.session.cases) == own + 1
        copy = document.session.cases[own]
        assert not is_generated(copy) and copy.texts["fr"] == typed_before["fr"]
