"""The catalog selection screen: the engine's candidates, adopting one, undoing it."""

from __future__ import annotations

import pytest
from textual.widgets import DataTable, Input

from workbench.engine.select import select
from workbench.model.catalog import demo_catalog_path, load_catalog
from workbench.tui.app import WorkbenchApp
from workbench.tui.selection_screen import SelectionScreen
from tui_helpers import selected_result


def drive_inputs(app: WorkbenchApp) -> list:
    return [r.inputs for r in app.document.results if r.case.bearing == "Drive"]


async def test_first_candidate_is_selects_first_and_adopting_sets_c(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("ctrl+l")
        await pilot.pause()
        screen = app.screen
        assert isinstance(screen, SelectionScreen)
        catalog = load_catalog(demo_catalog_path())
        expected = select(catalog, drive_inputs(app), 20000.0).candidates  # targets.life
        assert expected
        table = screen.query_one("#candidates", DataTable)
        assert table.row_count == len(expected)
        first = table.coordinate_to_cell_key((0, 0)).row_key.value
        assert int(first) == expected[0].index
        assert table.get_row_at(0)[0] == catalog.designations[expected[0].index]

        await pilot.press("enter")  # adopt the highlighted (first) row
        await pilot.pause()
        assert not isinstance(app.screen, SelectionScreen)
        c_catalog = float(catalog.c_n[expected[0].index])
        result = selected_result(app)
        assert result is not None and result.derivation is not None
        assert result.inputs.c == pytest.approx(c_catalog)
        # ISO 281:2007 §7.1 closed form: L10 = (C/P)^p, p = 10/3 for a roller bearing, 3 for a ball
        p = 10 / 3 if catalog.kind[expected[0].index] != "deep-groove" else 3.0
        assert result.derivation.results["L10"] == pytest.approx(
            (c_catalog / result.derivation.results["P"]) ** p)
        assert f"{c_catalog / 1000:g} kN" == app.document.session.bearing("Drive").texts["c"]

        await pilot.press("ctrl+z")
        await pilot.pause()
        again = selected_result(app)
        assert again is not None and again.inputs.c == 30000.0  # the rig's Drive: "30 kN"
        assert app.document.session.bearing("Drive").texts["c"] == "30 kN"


async def test_a_catalog_path_that_cannot_be_read_is_reported(make_app, tmp_path) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("ctrl+l")
        await pilot.pause()
        screen = app.screen
        assert isinstance(screen, SelectionScreen)
        box = screen.query_one("#catalog-path", Input)
        box.value = str(tmp_path / "missing.csv")
        box.focus()
        await pilot.press("enter")
        await pilot.pause()
        assert screen.catalog is None
        assert "✘" in str(screen.query_one("#selection-summary").render())
        assert screen.query_one("#candidates", DataTable).row_count == 0
        await pilot.press("escape")
        await pilot.pause()
        assert not isinstance(app.screen, SelectionScreen) and not app.document.dirty


async def test_no_life_target_is_reported(make_app) -> None:
    app = make_app()
    app.document.session.targets.life = ""
    app.workbench.reevaluate()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("ctrl+l")
        await pilot.pause()
        assert "no life target" in str(app.screen.query_one("#selection-summary").render())
