"""Every secondary screen and dialog takes its colours from the theme: under the monochrome
theme (the one the workbench takes under NO_COLOR) nothing on them shows a hue, so no colour is
written into them, and under each theme the frame is drawn in the theme's primary colour."""

from __future__ import annotations

import pytest
from textual.color import Color

from screen_host import THEMES, ScreenHost, demo_session, hues, screen_lines, users

from workbench.model.analysis import analyse
from workbench.tui.about_screen import AboutScreen
from workbench.tui.dialogs import ChoiceDialog, TextPrompt
from workbench.tui.help_screen import HelpScreen
from workbench.tui.rating_screen import RatingScreen
from workbench.tui.selection_screen import SelectionScreen
from workbench.tui.shafts_screen import ShaftsScreen
from workbench.tui.theme_files import MONOCHROME_THEME, load_theme_files

SESSION = demo_session()
BEARING = SESSION.cases[0].bearing
SCREENS = {
    "selection": lambda: SelectionScreen(BEARING, users(SESSION, BEARING),
                                         bearing_texts=SESSION.bearing(BEARING).texts),
    "rating": lambda: RatingScreen(BEARING, SESSION.bearing(BEARING).texts, "SI"),
    "shafts": lambda: ShaftsScreen(analyse(SESSION), "SI"),
    "help": HelpScreen,
    "about": AboutScreen,
    "prompt": lambda: TextPrompt("Rename load case", "", lambda text: "needed" if not text else None),
    "choice": lambda: ChoiceDialog("Unsaved changes", "Drop them?", [("drop", "Drop"), ("stay", "Stay")]),
}


@pytest.mark.parametrize("name", sorted(SCREENS))
async def test_monochrome_theme_shows_no_hue(name: str) -> None:
    app = ScreenHost(SCREENS[name], theme=MONOCHROME_THEME)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await app.workers.wait_for_complete()
        await pilot.pause()
        assert any(line.strip() for line in screen_lines(app.screen))
        assert hues(app.screen) == set()


@pytest.mark.parametrize("theme", THEMES)
@pytest.mark.parametrize("name", sorted(SCREENS))
async def test_frame_follows_the_theme(name: str, theme: str) -> None:
    primary = next(t for t in load_theme_files().themes if t.name == theme).primary
    app = ScreenHost(SCREENS[name], theme=theme)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await app.workers.wait_for_complete()
        await pilot.pause()
        frame = app.screen.query_one(".dialog-box").styles.border_top[1]
        wanted = Color.parse(primary)
        # Textual derives $primary through HSL: a channel may come back one step off
        assert max(abs(a - b) for a, b in zip(frame.rgb, wanted.rgb)) <= 1
