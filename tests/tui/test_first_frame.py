"""The first frame painted already shows the workbench as it settles.

``workbench bench`` times start-up to the first frame Textual hands to its driver; the
editor's text box and the hidden panes are mounted after it.  That is only fair if the first frame is the
real screen: these tests compare its text with the screen's once everything is mounted, at the
two sizes the snapshots use.  Scrollbar thumbs are left out of the comparison: Textual sizes a
scroll view's bar only after its first layout (the gutters are reserved, so nothing moves).
"""

from __future__ import annotations

from collections import Counter

import pytest
from rich.console import RenderableType
from textual.screen import Screen
from textual.widgets import DataTable, TabPane


from workbench.model import files
from workbench.tui.app import WorkbenchApp
from workbench.tui.bench_floor import FORM_CONTROLS, TABLE_SIZE, SameWidgetsApp

SCROLLBAR_GLYPHS = str.maketrans({glyph: " " for glyph in "▁▂▃▄▅▆▇█▔"})


def screen_text(screen: Screen[object]) -> list[str]:
    """Each line of ``screen`` as shown, scrollbar and border glyphs blanked alike."""
    return [strip.text.translate(SCROLLBAR_GLYPHS)
            for strip in screen._compositor.render_strips()]


class FirstFrameKept(WorkbenchApp):
    """The workbench, keeping the text of the first frame of its main screen."""

    first_frame: list[str] | None = None

    def _display(self, screen: Screen[object], renderable: RenderableType | None) -> None:
        if renderable is not None and self.first_frame is None and screen is self.screen_stack[0]:
            self.first_frame = screen_text(screen)
        super()._display(screen, renderable)


@pytest.mark.parametrize("size", [(80, 24), (120, 40)])
async def test_first_frame_is_the_settled_screen(size: tuple[int, int]) -> None:
    path = files.demo_path()
    assert path is not None
    session = files.open_session(path).session
    app = FirstFrameKept(session, offer_recovery=False, autosave_delay=None)
    async with app.run_test(size=size) as pilot:
        await pilot.pause()
        await app.workers.wait_for_complete()
        await pilot.pause()
        settled = screen_text(app.workbench_screen)
        assert app.first_frame is not None
        differing = [(number, first, later) for number, (first, later)
                     in enumerate(zip(app.first_frame, settled))
                     if first != later and "━" not in first]  # the tabs' underline slides in
        assert not differing, "\n".join(f"{n}: {a!r}\n{n}: {b!r}" for n, a, b in differing[:3])


def _census(screen: Screen[object]) -> Counter[str]:
    """How many of each of the floor's Textual classes ``screen`` holds."""
    kinds = (*FORM_CONTROLS, DataTable, TabPane)
    return Counter(kind.__name__ for widget in screen.walk_children() for kind in kinds
                   if isinstance(widget, kind))


class FirstCensusKept(WorkbenchApp):
    """The workbench, keeping the census of its main screen at its first frame."""

    census: Counter[str] | None = None
    table_size: tuple[int, int] | None = None

    def _display(self, screen: Screen[object], renderable: RenderableType | None) -> None:
        if renderable is not None and self.census is None and screen is self.screen_stack[0]:
            self.census = _census(screen)
            table = screen.query_one(DataTable)
            self.table_size = (table.row_count, len(table.columns))
        super()._display(screen, renderable)


async def test_the_start_up_floor_holds_the_widgets_of_the_first_frame() -> None:
    # `startup_floor_ratio` is only a floor if the floor app makes what the first frame holds
    path = files.demo_path()
    assert path is not None
    app = FirstCensusKept(files.open_session(path).session, offer_recovery=False,
                          autosave_delay=None)
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
    floor = SameWidgetsApp()
    async with floor.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        assert app.census is not None and app.census["Input"] > 0
        assert app.census == _census(floor.screen)
        assert app.table_size == TABLE_SIZE
