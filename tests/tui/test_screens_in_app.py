"""The secondary screens opened from the workbench by their keys: the focus lands in the table
(or the first input still needed), nothing is cut at 80×24 or 120×40 under the workbench's own
stylesheet, and escape goes back.  Keyboard only."""

from __future__ import annotations

import pytest

from screen_host import SIZES, cut_widgets, settled

from workbench.tui.about_screen import AboutScreen
from workbench.tui.bearings_screen import BearingsScreen
from workbench.tui.help_screen import HelpScreen
from workbench.tui.rating_screen import RatingScreen
from workbench.tui.selection_screen import SelectionScreen
from workbench.tui.shafts_screen import ShaftsScreen

OPENED_BY = {
    BearingsScreen: (("alt+e",), "bearings"),
    SelectionScreen: (("alt+c",), "candidates"),
    RatingScreen: (("alt+c", "ctrl+g"), "rating-elements"),
    ShaftsScreen: (("alt+s",), "shafts-view"),  # the rig session has no shaft: no table
    HelpScreen: (("f1",), "help-keys"),
    AboutScreen: (("f13",), "about-box"),
}


@pytest.mark.parametrize("size", SIZES)
@pytest.mark.parametrize("screen_class", list(OPENED_BY), ids=lambda c: c.__name__)
async def test_keys_open_the_screen_with_the_focus_in_it(make_app, screen_class, size) -> None:
    keys, focused_id = OPENED_BY[screen_class]
    app = make_app()
    async with app.run_test(size=size) as pilot:
        await pilot.pause()
        main = app.screen
        await pilot.press(*keys)
        await settled(pilot)
        assert isinstance(app.screen, screen_class)
        assert app.focused is not None and app.focused.id == focused_id
        assert cut_widgets(app.screen) == []
        for _ in keys:
            await pilot.press("escape")
            await pilot.pause()
        assert app.screen is main



async def test_a_refused_bearing_delete_leaves_the_cursor_on_that_bearing(make_app) -> None:
    """Delete on a bearing that cases use is refused, and the cursor stays on it (it went to the
    first row, where a second delete would act on another bearing)."""
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("alt+e")
        await settled(pilot)
        table = app.screen.query_one("#bearings")
        used = [b.name for b in app.document.session.bearings]
        await pilot.press("down")
        await pilot.pause()
        assert table.cursor_row == 1
        await pilot.press("delete")
        await pilot.pause()
        assert [b.name for b in app.document.session.bearings] == used  # refused: cases use it
        assert table.cursor_row == 1
