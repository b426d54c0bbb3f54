"""The load-case list (its cursor follows keys and clicks and stays in view, its rows show the
engine's figures) and the title line above it."""

from __future__ import annotations

from tui_helpers import retype, selected, selected_case

from workbench.engine.record import fmt
from workbench.model.quantities import format_quantity
from workbench.tui.case_list import CaseList, case_row
from workbench.tui.title_bar import TitleBar


def _list(app) -> CaseList:
    return app.workbench_screen.query_one(CaseList)


async def test_keys_move_the_cursor_and_choose_the_case(make_app) -> None:
    app = make_app(cases=5)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        assert _list(app).has_focus and selected(app) == 0
        await pilot.press("up")  # already at the top: stays
        await pilot.pause()
        assert selected(app) == 0
        await pilot.press("down", "down")
        await pilot.pause()
        assert _list(app).cursor == 2 and selected(app) == 2
        assert selected_case(app) is app.document.session.cases[2]
        await pilot.press("end")
        await pilot.pause()
        assert selected(app) == 4
        await pilot.press("home")
        await pilot.pause()
        assert selected(app) == 0


async def test_a_click_on_a_row_chooses_its_case(make_app) -> None:
    app = make_app(cases=5)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.click(CaseList, offset=(3, 1 + 3))  # the heading, then rows 0, 1, 2, 3
        await pilot.pause()
        assert selected(app) == 3
        await pilot.click(CaseList, offset=(3, 0))  # the heading: nothing
        await pilot.click(CaseList, offset=(3, 1 + 7))  # below the last row: nothing
        await pilot.pause()
        assert selected(app) == 3


async def test_the_cursor_stays_in_view_in_a_long_list(make_app) -> None:
    app = make_app(cases=40)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        cases = _list(app)
        shown = cases.scrollable_content_region.height - 1  # rows under the heading
        assert shown < 40
        await pilot.press("end")
        await pilot.pause()
        assert selected(app) == 39
        top = cases.scroll_offset.y
        assert top <= 39 < top + shown
        assert cases.row_texts(39)[0] == "Sweep 40"
        await pilot.press("pageup")
        await pilot.pause()
        top = cases.scroll_offset.y
        assert selected(app) < 39 and top <= cases.cursor < top + shown


async def test_rows_show_the_derived_figures(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        state = app.workbench
        for index, result in enumerate(state.results):
            values = result.derivation.results
            row = _list(app).row_texts(index)
            assert row == case_row(result, "SI")
            assert row[1] == format_quantity(values["P"], "force", "SI")
            assert row[2] == (fmt(values["Lnm"]) if values["Lnm"] < 1e6 else ">1e6")
        # the heading and the first row as painted, cells cut to their columns
        painted = [cases_line.text for cases_line in (_list(app).render_line(y) for y in (0, 1))]
        assert painted[0].split() == ["Case", "P", "Lnm", "h", "s0", "Meets"]
        assert painted[1].startswith(" Steady run")


async def test_title_line_keeps_the_save_state_in_view_when_the_title_is_long(make_app) -> None:
    app = make_app()
    app.document.session.title = "A very long session title " * 4
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        line = app.workbench_screen.query_one(TitleBar).render().plain
        assert line.startswith("A very long session title")
        assert "…" in line and line.endswith("not saved yet · SI")
        await retype(pilot, app, "fr", "4 kN")
        assert app.workbench_screen.query_one(TitleBar).render().plain.endswith(
            "not saved yet ● · SI")
