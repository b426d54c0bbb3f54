"""Help and about: the keys as a table from the one table of actions, the caution in full."""

from __future__ import annotations

import pytest
from textual.widgets import DataTable

from screen_host import ScreenHost, column_texts, cut_widgets, screen_lines

from workbench.model.caution import SAFETY_CAUTION
from workbench.tui.about_screen import AboutScreen
from workbench.tui.actions import ACTIONS
from workbench.tui.help_screen import HelpScreen


@pytest.mark.parametrize("size", [(80, 24), (120, 40)])
async def test_help_lists_every_action_with_the_focus_in_the_table(size) -> None:
    app = ScreenHost(lambda: HelpScreen({"case.add": "ctrl+k"}))
    async with app.run_test(size=size) as pilot:
        await pilot.pause()
        screen = app.screen
        table = screen.query_one("#help-keys", DataTable)
        assert app.focused is table
        titles = [" ".join(title.split()) for title in column_texts(table, 1)]  # may wrap
        assert [action.title for action in ACTIONS] == titles[:len(ACTIONS)]
        keys = dict(zip(titles, column_texts(table, 0)))
        assert keys["Add case"] == "ctrl+k" and keys["Save"] == "ctrl+s"
        helps = column_texts(table, 2)
        assert all(f"[{action.id}]" in " ".join(help_text.split("\n")) for action, help_text
                   in zip(ACTIONS, helps))
        assert cut_widgets(screen) == []
        await pilot.press("escape")
        await pilot.pause()
        assert app.answers == [None]


async def test_help_descriptions_have_room_at_80_columns() -> None:
    """At 80 columns the keys column was as wide as its longest list ("ctrl+delete,
    shift+delete") and the command column as its longest title, which left the descriptions 21
    cells: 4–6 lines each.  Now those columns wrap (a key list between its keys, a title between
    words) so that a description has 40 cells: one of up to 75 characters (most of them)
    reads in 2 lines."""
    app = ScreenHost(HelpScreen)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        table = app.screen.query_one("#help-keys", DataTable)
        keys, helps = column_texts(table, 0), column_texts(table, 2)
        widths = [column.width for column in table.ordered_columns]
        longest_key = max(len(key) for cell in keys for key in cell.replace(",", " ").split())
        assert widths[0] == longest_key and widths[2] >= 40
        for cell in keys:  # a list wraps only between its keys
            assert all(line.endswith(",") for line in cell.split("\n")[:-1]), cell
        short = [text for text in helps if len(text.replace("\n", " ")) <= 75]
        assert len(short) > len(helps) / 2 and all(text.count("\n") <= 1 for text in short)
        assert cut_widgets(app.screen) == []


async def test_about_shows_the_whole_caution_at_80_by_24() -> None:
    app = ScreenHost(AboutScreen)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        screen = app.screen
        assert str(screen.query_one("#about-caution").render()) == SAFETY_CAUTION
        shown = " ".join(" ".join(line.strip("│ ").split()) for line in screen_lines(screen))
        for words in ("estimates under the cited standards", "bearing maker's data",
                      "local codes and licensed engineering practice"):
            assert words in shown
        assert cut_widgets(screen) == []
        await pilot.press("escape")
        await pilot.pause()
        assert app.answers == [None]


async def test_help_keeps_its_row_when_the_terminal_is_resized() -> None:
    app = ScreenHost(HelpScreen)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        table = app.screen.query_one("#help-keys", DataTable)
        await pilot.press("down", "down", "down")
        await pilot.resize_terminal(120, 40)
        await pilot.pause()
        await pilot.pause()
        assert table.cursor_row == 3
        assert "\n" not in column_texts(table, 2)[0]  # at 120 columns the first help is one line
        assert cut_widgets(app.screen) == []


async def test_about_names_the_methods_the_shaft_and_inside_steps_cite() -> None:
    # it listed ISO 281/76 and the rest, but not the shaft statics or ISO/TS 16281 and Hertz,
    # which the shaft and Inside steps cite
    app = ScreenHost(AboutScreen)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        shown = str(app.screen.query_one("#about-standards").render())
        for method in ("Shaft statics", "ISO/TS 16281", "Hertz", "Lundberg–Palmgren"):
            assert method in shown
