"""A bare app that shows one secondary screen or dialog, for testing it apart from the main screen.

The screens are given what the main screen gives them (a session's evaluated cases, its
analysis, the unit system); what they answer is kept in ``answers``.  The workbench's theme files
are registered, so a test can show a screen in each of them.
"""

from __future__ import annotations

from collections.abc import Callable
from typing import Any

from rich.cells import cell_len
from rich.text import Text
from textual.app import App, ComposeResult
from textual.errors import NoWidget
from textual.geometry import Region
from textual.pilot import Pilot
from textual.screen import Screen
from textual.widgets import Button, DataTable, Input, Label, Select, Static

from workbench.model.analysis import analyse
from workbench.model.session import CaseResult, Session
from workbench.model.sessionfile import demo_session_path, load_session
from workbench.tui.app import WorkbenchApp
from workbench.tui.theme_files import DEFAULT_THEME, load_theme_files
from workbench.tui.view import ELLIPSIS

THEMES = ("bench-night", "bench-paper", "bench-floodlit", "bench-mono")
SIZES = ((80, 24), (120, 40))


class ScreenHost(App[None]):
    """Pushes ``make_screen()`` at start over an empty screen; keeps what it answers."""

    def __init__(self, make_screen: Callable[[], Screen[Any]], theme: str = DEFAULT_THEME) -> None:
        super().__init__()
        self._make_screen = make_screen
        self._wanted_theme = theme
        self.answers: list[Any] = []

    def compose(self) -> ComposeResult:
        yield Static("host", id="host")

    def on_mount(self) -> None:
        for theme in load_theme_files().themes:
            self.register_theme(theme)
        self.theme = self._wanted_theme
        self.push_screen(self._make_screen(), self.answers.append)


def demo_session() -> Session:
    """The shipped demo session (shafts and duty cycles)."""
    return load_session(demo_session_path())


def demo_app() -> WorkbenchApp:
    """The workbench on the demo session, recovery and autosave off."""
    return WorkbenchApp(demo_session(), None, offer_recovery=False, autosave_delay=None)


def users(session: Session, bearing: str) -> list[CaseResult]:
    """The evaluated cases (own and generated) on one session bearing, as the main screen
    gives them to the selection screen."""
    return [result for result in analyse(session).cases if result.case.bearing == bearing]


def cell_text(cell: object) -> str:
    """A table cell as plain text."""
    return cell.plain if isinstance(cell, Text) else str(cell)


def column_texts(table: DataTable[Any], column: int) -> list[str]:
    """One column of a table, top to bottom, as plain text."""
    return [cell_text(table.get_row_at(k)[column]) for k in range(table.row_count)]


def cut_widgets(screen: Screen[Any]) -> list[str]:
    """The widgets on show whose text does not fit their width (an empty list: nothing is cut).

    A table is cut when its columns are wider than the table; a one-line widget (label of a
    field row, button, input, choice) when its text is wider than its content region.  Wrapped
    text (a ``Static`` of more than one line) breaks between words and is not cut."""
    cut: list[str] = []
    for widget in screen.query("*"):
        if not widget.display or widget.region.width == 0:
            continue
        width = widget.content_region.width
        if isinstance(widget, DataTable):
            columns = sum(column.get_render_width(widget) for column in widget.columns.values())
            if columns > widget.scrollable_content_region.width:
                cut.append(f"table #{widget.id}: {columns} > {widget.scrollable_content_region.width}")
            cut += [f"heading {column.label.plain!r} of #{widget.id}"
                    for column in widget.columns.values()
                    if column.label.cell_len > column.get_render_width(widget) - 2]
        elif isinstance(widget, Input):
            text = widget.value or widget.placeholder
            if cell_len(text) >= width:
                cut.append(f"input #{widget.id}: {text!r} in {width}")
        elif isinstance(widget, Select):
            shown, whole = painted_choice(screen, widget), choice_text(widget)
            if shown is not None and shown != whole and not cut_between_words(shown, whole):
                cut.append(f"choice #{widget.id}: {whole!r} shown {shown!r}")
        elif isinstance(widget, (Label, Button)) and widget.size.height == 1:
            text = str(widget.render()).strip()
            if cell_len(text) > width:
                cut.append(f"{type(widget).__name__} {text!r} in {width}")
    return cut


def choice_text(select: Select[Any]) -> str:
    """The chosen option's text in full, or the prompt when nothing is chosen."""
    for prompt, value in select._options:  # Select keeps its options only there
        if value is not Select.NULL and value == select.value:
            return prompt.plain if isinstance(prompt, Text) else str(prompt)
    return select.prompt


def painted(screen: Screen[Any], region: Region) -> list[str]:
    """The text painted in ``region`` of the screen, line by line (trailing blanks dropped)."""
    strips = screen._compositor.render_strips()
    return [strips[y].crop(region.x, region.right).text.rstrip()
            for y in range(region.y, min(region.bottom, len(strips)))]


def painted_choice(screen: Screen[Any], select: Select[Any]) -> str | None:
    """What a choice box paints as its value (None: its box is not on show)."""
    label = select.query_one("SelectCurrent Static#label")
    region = label.content_region
    if region.width == 0 or region.height == 0:
        return None
    try:
        widget, _ = screen.get_widget_at(region.x, region.y)
    except NoWidget:
        return None
    if widget is not label:
        return None  # scrolled out of view or under an overlay
    return painted(screen, region.intersection(label.region))[0]


def cut_between_words(shown: str, whole: str) -> bool:
    """Whether ``shown`` is ``whole`` shortened on purpose: an ellipsis marks what was left
    out, and every word kept is a whole word of ``whole`` (or the leading parts of a hyphened
    one, "SP-25-100-")."""
    kept, words = shown.replace(ELLIPSIS, " ").split(), whole.split()
    return ELLIPSIS in shown and bool(kept) and all(
        word in words or (word.endswith("-") and any(w.startswith(word) for w in words))
        for word in kept)


def screen_lines(screen: Screen[Any]) -> list[str]:
    """What the terminal shows, line by line, as plain text."""
    return ["".join(segment.text for segment in strip) for strip in screen._compositor.render_strips()]


def hues(screen: Screen[Any]) -> set[tuple[int, int, int]]:
    """Every foreground and background colour on the screen that is not a grey."""
    found = set()
    for strip in screen._compositor.render_strips():
        for segment in strip:
            style = segment.style
            if style is None:
                continue
            for colour in (style.color, style.bgcolor):
                if colour is not None and colour.triplet is not None:
                    r, g, b = colour.triplet
                    if not r == g == b:
                        found.add((r, g, b))
    return found


async def settled(pilot: Pilot[None]) -> None:
    """Wait for the screen's workers (the catalog ranking), then for their answers to be shown."""
    await pilot.pause()
    await pilot.app.workers.wait_for_complete()
    await pilot.pause()


async def tab_to(pilot: Pilot[None], widget_id: str) -> None:
    """Press tab until the widget with ``widget_id`` has the focus."""
    for _ in range(16):
        if pilot.app.focused is not None and pilot.app.focused.id == widget_id:
            return
        await pilot.press("tab")
    raise AssertionError(f"tab never reached #{widget_id}")


async def type_into(pilot: Pilot[None], widget_id: str, text: str) -> None:
    """Tab to the input ``widget_id``, clear it and type ``text`` key by key."""
    await tab_to(pilot, widget_id)
    await pilot.press("end", "ctrl+u", *text)
    await pilot.pause()
