"""The strip of pane titles over the right column: a click, or ← and → with it in focus,
put a pane on show, and the strip and the panes always agree."""

from __future__ import annotations

from collections.abc import Callable

import pytest
from textual.widgets import ContentSwitcher

from workbench.engine.sensitivity import sensitivity_of
from workbench.tui.app import WorkbenchApp
from workbench.tui.pane_tabs import PaneTabs
from workbench.tui.whatif_pane import WhatIfPane
from workbench.tui.workbench_screen import PANES


def shown(app: WorkbenchApp) -> tuple[str, str | None]:
    """(the strip's active name, the switcher's pane on show)."""
    screen = app.workbench_screen
    return screen.query_one(PaneTabs).active, screen.query_one(ContentSwitcher).current


@pytest.mark.parametrize("name", [name for name, _ in PANES])
async def test_a_click_on_a_title_shows_its_pane(make_app: Callable[..., WorkbenchApp],
                                                 name: str) -> None:
    app = make_app()
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        strip = app.workbench_screen.query_one(PaneTabs)
        if name == strip.active:  # start from another pane
            strip.choose(PANES[1][0])
            await pilot.pause()
        _, _, start, _ = next(cell for cell in strip._cells() if cell[0] == name)
        await pilot.click(PaneTabs, offset=(start + 1, 0))
        await pilot.pause()
        assert shown(app) == (name, f"pane-{name}")


async def test_arrows_step_through_the_panes_round_the_end(
        make_app: Callable[..., WorkbenchApp]) -> None:
    app = make_app()
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        app.workbench_screen.query_one(PaneTabs).focus()
        names = [name for name, _ in PANES]
        for step in range(1, len(names) + 1):  # right, right, right: back to the first
            await pilot.press("right")
            await pilot.pause()
            expected = names[step % len(names)]
            assert shown(app) == (expected, f"pane-{expected}")
        await pilot.press("left")
        await pilot.pause()
        assert shown(app) == (names[-1], f"pane-{names[-1]}")


async def test_what_if_is_worked_out_when_chosen_on_the_strip(
        make_app: Callable[..., WorkbenchApp]) -> None:
    app = make_app()
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        app.workbench_screen.query_one(PaneTabs).choose("whatif")
        await pilot.pause()
        pane = app.workbench_screen.query_one(WhatIfPane)
        result = app.workbench.result
        assert result is not None and result.inputs is not None
        # the pane shows the engine's sweep of the selected case (sensitivity.py)
        assert [item.input for item in pane.items] == \
            [item.input for item in sensitivity_of(result.inputs)]
        assert "radial load Fr" in pane.text
