"""The load-case list: one row per case with P, Lnm, s0 and whether it meets the targets.

One scrolling widget paints the heading and the rows line by line (Textual's ``DataTable``, with
its nine component classes and its cell machinery, was a twelfth of the workbench's start-up
for a handful of rows).  Up/down, page up/down, home/end and a click move the cursor; the case
under it is announced with :class:`CaseList.Chosen`.
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from textual import events
from textual.binding import Binding
from textual.content import Content
from textual.geometry import Size
from textual.message import Message
from textual.scroll_view import ScrollView
from textual.strip import Strip

from ..engine.record import fmt
from ..model.quantities import format_quantity
from ..model.session import CaseResult

# (key, heading, width): one leading space per cell, so the five columns fit the left column of
# an 80-column terminal.
COLUMNS = (("name", "Case", 12), ("P", "P", 10), ("Lnm", "Lnm h", 7), ("s0", "s0", 5),
           ("verdict", "Meets", 7))
ROW_WIDTH = sum(width for _, _, width in COLUMNS)
LIFE_SHOWN_UP_TO_H = 1e6
S0_SHOWN_UP_TO = 1000.0
HEADING_STYLE = "bold $foreground on $panel"
CURSOR_STYLE = "bold $block-cursor-foreground on $block-cursor-background"
BLURRED_CURSOR_STYLE = "on $block-cursor-blurred-background"
STRIPE_STYLE = "on $boost"
"""The heading, the cursor row (with and without the focus) and every second row."""


def verdict(result: CaseResult) -> str:
    """A short mark against the session's targets: ✔ (met), ✘ L / ✘ s0 / ✘ L s0 (missed),
    ✘ err (cannot be derived) or — (no target to meet)."""
    if result.derivation is None:
        return "✘ err"
    life, static = result.meets_life, result.meets_s0
    missed = [word for word, ok in (("L", life), ("s0", static)) if ok is False]
    if missed:
        return "✘ " + " ".join(missed)
    if life is None and static is None:
        return "—"
    return "✔"


def _life_text(hours: float) -> str:
    if math.isnan(hours):
        return "—"
    return ">1e6" if hours >= LIFE_SHOWN_UP_TO_H else fmt(hours)


def case_row(result: CaseResult, system: str) -> tuple[str, ...]:
    """The cells of one case's row, results formatted in ``system`` (SI or US)."""
    if result.derivation is None:
        return (result.case.name, "—", "—", "—", verdict(result))
    values = result.derivation.results
    s0 = values["s0"]
    return (
        result.case.name,
        format_quantity(values["P"], "force", system),  # type: ignore[arg-type]
        _life_text(values.get("Lnm", math.nan)),
        fmt(s0, 3) if s0 < S0_SHOWN_UP_TO else f">{S0_SHOWN_UP_TO:g}",
        verdict(result),
    )


def _line(cells: Sequence[str]) -> Content:
    """Cells in their columns, each after one space and cut with an ellipsis when too long."""
    return Content.assemble(*(Content(" " + cell).truncate(width, ellipsis=True, pad=True)
                              for cell, (_, _, width) in zip(cells, COLUMNS)))


HEADING = _line([heading for _, heading, _ in COLUMNS])


class CaseList(ScrollView, can_focus=True):
    """The session's load cases under a fixed heading; announces the case a person moves to
    with :class:`Chosen`."""

    DEFAULT_CSS = """
    CaseList {
        overflow-x: hidden;
    }
    """
    BINDINGS = [
        Binding("up", "move(-1)", "Previous case", show=False),
        Binding("down", "move(1)", "Next case", show=False),
        Binding("pageup", "move_page(-1)", "Page up", show=False),
        Binding("pagedown", "move_page(1)", "Page down", show=False),
        Binding("home", "move_to(0)", "First case", show=False),
        Binding("end", "move_to(-1)", "Last case", show=False),
    ]

    class Chosen(Message):
        """The cursor moved to case ``index``."""

        def __init__(self, index: int) -> None:
            super().__init__()
            self.index = index

    def __init__(self, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self._rows: list[tuple[str, ...]] = []
        self._lines: list[Content] = []
        self.cursor = 0
        """The row under the cursor."""

    @property
    def row_count(self) -> int:
        """How many cases are listed."""
        return len(self._rows)

    def row_texts(self, index: int) -> tuple[str, ...]:
        """The cells of row ``index`` as written (before they are cut to their columns)."""
        return self._rows[index]

    def show(self, results: Sequence[CaseResult], selected: int, system: str) -> None:
        """Redraw every row and put the cursor on ``selected`` (not announced)."""
        self._rows = [case_row(result, system) for result in results]
        self._lines = [_line(row) for row in self._rows]
        self.virtual_size = Size(ROW_WIDTH, len(self._rows) + 1)
        self.cursor = selected if 0 <= selected < len(self._rows) else 0
        self._keep_cursor_in_view()
        self.refresh()

    def show_row(self, index: int, result: CaseResult, system: str) -> None:
        """Redraw one row (after an edit of that case)."""
        if 0 <= index < len(self._rows):
            self._rows[index] = case_row(result, system)
            self._lines[index] = _line(self._rows[index])
            self.refresh_line(index + 1 - self.scroll_offset.y)

    # ---- the cursor -------------------------------------------------------------------------
    def move_cursor(self, row: int) -> None:
        """Put the cursor on ``row`` and announce the case there."""
        if not self._rows:
            return
        row = max(0, min(len(self._rows) - 1, row))
        if row != self.cursor:
            self.cursor = row
            self._keep_cursor_in_view()
            self.refresh()
        self.post_message(self.Chosen(row))

    def _keep_cursor_in_view(self) -> None:
        shown = max(1, self.scrollable_content_region.height - 1)  # under the heading
        top = self.scroll_offset.y
        if self.cursor < top:
            self.scroll_to(y=self.cursor, animate=False, immediate=True)
        elif self.cursor >= top + shown:
            self.scroll_to(y=self.cursor - shown + 1, animate=False, immediate=True)

    def action_move(self, delta: int) -> None:
        """The next (or previous) case."""
        self.move_cursor(self.cursor + delta)

    def action_move_page(self, delta: int) -> None:
        """About a screenful of cases on (or back)."""
        self.move_cursor(self.cursor + delta * max(1, self.scrollable_content_region.height - 2))

    def action_move_to(self, row: int) -> None:
        """The first case (0) or the last (-1)."""
        self.move_cursor(row if row >= 0 else len(self._rows) - 1)

    def on_click(self, event: events.Click) -> None:
        """A click on a row moves the cursor there."""
        row = self.scroll_offset.y + event.y - 1
        if event.y >= 1 and row < len(self._rows):
            self.move_cursor(row)

    def on_focus(self) -> None:
        """The cursor row takes the focused colours."""
        self.refresh()

    def on_blur(self) -> None:
        """The cursor row takes the unfocused colours."""
        self.refresh()

    # ---- painting ---------------------------------------------------------------------------
    def render_line(self, y: int) -> Strip:
        """The heading on the first line; below it the rows from the scroll position."""
        width = self.scrollable_content_region.width
        base = self.visual_style
        index = self.scroll_offset.y + y - 1
        if y == 0:
            line, style = HEADING, HEADING_STYLE
        elif index >= len(self._lines):
            return Strip.blank(width, self.rich_style)
        elif index == self.cursor:
            line = self._lines[index]
            style = CURSOR_STYLE if self.has_focus else BLURRED_CURSOR_STYLE
        else:
            line, style = self._lines[index], STRIPE_STYLE if index % 2 else ""
        line = line.truncate(width, pad=True)
        return Strip(line.stylize_before(style).render_segments(base) if style
                     else line.render_segments(base))
