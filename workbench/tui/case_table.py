"""The load-case list: Textual's ``DataTable``, one row per case (own, then generated).

Cells are given as plain ``Text``, so a name is shown as written, never read as markup.

It follows :attr:`CaseTable.view` (bound to the screen's) and keeps its cursor on the selected
case.  Only the rows on show are written: a large session has thousands of rows, and one key in
a bearing field changes them all.  Each row remembers the result its cells were made from; on a
new revision, a scroll or a resize, the rows on show whose result changed are written again
(only their changed cells), each from :meth:`~workbench.model.document.Document.result`, which
derives a case the document left pending on the spot.  So a row on show is always current, and
the others are written when they come into view.  Moving the cursor posts
:class:`CaseTable.Chosen`.  The name column takes the room the other columns leave, so wide
screens show whole names; a name that does not fit is cut between words (its full text is in
the help line and the derivation's heading).
"""

from __future__ import annotations

import math
from collections.abc import Iterable, Sequence
from typing import overload

from rich.segment import Segment
from rich.style import Style
from rich.text import Text
from textual.binding import Binding
from textual.cache import LRUCache
from textual.coordinate import Coordinate
from textual.events import Resize
from textual.geometry import Region
from textual.message import Message
from textual.reactive import var
from textual.widgets import DataTable
from textual.widgets.data_table import Row, RowKey

from ..engine.record import fmt
from ..model.document import Document
from ..model.quantities import format_quantity
from ..model.session import CaseResult
from .view import View, fit_words, view_reactive

SegmentLines = list[list[Segment]]
"""Textual's lines of a row: segments per line."""
COLUMNS = (("P", 9), ("Lnm h", 7), ("s0", 5), ("Checks", 8))
"""The columns after the name: (heading, width)."""
NAME_HEADING = "Load case"
MIN_NAME = 12
LIFE_LIMIT_H = 1e6
NEIGHBOUR_ROWS = 1
"""Rows kept in view either side of the cursor where the list has room for them."""


def life_text(hours: float) -> str:
    """A life in hours for the list: four significant figures as the derivation writes it
    ("35670", not "35671" beside the derivation's "Lnm = 35670 h"), ">1e6" past a million,
    "—" undefined."""
    if math.isnan(hours):
        return "—"
    if hours > LIFE_LIMIT_H:
        return ">1e6"
    return fmt(hours)


def checks_text(result: CaseResult) -> str:
    """The verdicts in one short cell: L (life target) and s0, each ✔ met, ✘ missed, – none.

    A case with no life target shows "L–", never a life ✔; a static check shows its s0
    verdict alone ("s0✔ only")."""
    if result.derivation is None:
        return "error"
    mark = {True: "✔", False: "✘", None: "–"}
    if result.static_only:
        return f"s0{mark[result.meets_s0]} only"
    return f"L{mark[result.meets_life]} s0{mark[result.meets_s0]}"


def row_cells(result: CaseResult, system: str) -> tuple[str, ...]:
    """The cells after the name for one case."""
    if result.derivation is None:
        return ("—", "—", "—", checks_text(result))
    values = result.derivation.results
    return (format_quantity(values["P"], "force", system),  # type: ignore[arg-type]
            life_text(values.get("Lnm", math.nan)), fmt(values["s0"], 3), checks_text(result))


class _RowLines(Sequence[tuple[RowKey, int]]):
    """The table's lines as Textual's ``DataTable._y_offsets`` gives them ((row key, line in
    the row) per line), for a table whose rows are all one line: read from the rows in order
    instead of a list rebuilt after every cell update."""

    def __init__(self, table: CaseTable) -> None:
        self._table = table

    def __len__(self) -> int:
        return self._table.row_count

    @overload
    def __getitem__(self, line: int) -> tuple[RowKey, int]: ...

    @overload
    def __getitem__(self, line: slice) -> Sequence[tuple[RowKey, int]]: ...

    def __getitem__(self, line: int | slice) -> tuple[RowKey, int] | Sequence[tuple[RowKey, int]]:
        rows = self._table.ordered_rows
        if isinstance(line, slice):
            return [(row.key, 0) for row in rows[line]]
        return (rows[line].key, 0)

    def clear(self) -> None:
        """Nothing is kept (``DataTable.clear`` clears the list it would keep)."""


class CaseTable(DataTable[Text]):
    """Every load case with its equivalent load, life, static safety and verdicts; home and
    end go to the first and last case (the table's own home/end scroll sideways, and this
    table fits its width)."""

    BINDINGS = [
        Binding("home", "scroll_top", "First case", show=False),
        Binding("end", "scroll_bottom", "Last case", show=False),
    ]

    DEFAULT_CSS = """
    CaseTable { scrollbar-size-vertical: 1; }
    """

    view: var[View] = view_reactive()
    """The document's revision and the selected case (bound to the screen's)."""

    class Chosen(Message):
        """The cursor moved to case ``index``."""

        def __init__(self, index: int) -> None:
            super().__init__()
            self.index = index

    def __init__(self, document: Document, *, id: str | None = None) -> None:
        self._generation = 0
        """Counts the times the table was cleared (see :attr:`ordered_rows`)."""
        self._ordered: tuple[tuple[int, int], list[Row]] = ((-1, -1), [])
        self._row_versions: dict[RowKey, int] = {}
        """Per row, the count of writes to the whole table when the row was last written."""
        self._writes = 0
        self._painted_rows: LRUCache[tuple[object, ...], tuple[SegmentLines, SegmentLines]] = \
            LRUCache(1024)
        """A row's painted line, kept until that row is written again (see
        :meth:`_render_line_in_row`)."""
        super().__init__(id=id, cursor_type="row", zebra_stripes=True)
        self.document = document
        self._rows: list[tuple[str, ...]] = []
        self._made_from: list[tuple[CaseResult, str, str] | None] = []
        """Per row, what its cells were made from (result, name, unit system); None: not yet."""
        self._name_width = MIN_NAME

    @property
    def ordered_rows(self) -> list[Row]:
        """The rows in order.  Textual's ``DataTable`` builds this list again after every cell
        update, and ``_y_offsets`` a list per row from it (about 50 ms a frame at 10,000 rows);
        these rows are never sorted and only added or removed at the end, so the list is kept
        until the row count changes or the table is cleared."""
        key = (self.row_count, self._generation)
        if self._ordered[0] != key:
            locations = self._row_locations
            self._ordered = (key, [self.rows[locations.get_key(index)]
                                   for index in range(self.row_count)])
        return self._ordered[1]

    @property
    def _y_offsets(self) -> _RowLines:  # type: ignore[override]
        """Every row is one line high: the lines are the rows (see :attr:`ordered_rows`)."""
        return _RowLines(self)

    def _update_dimensions(self, new_rows: Iterable[RowKey]) -> None:
        """The scrollable size, without measuring the new rows' cells: Textual measures every
        cell of a new row to widen its column (0.3 ms a row, seconds at 10,000 rows), and
        these columns have fixed widths and rows one line high."""
        super()._update_dimensions(())

    def _render_line_in_row(self, row_key: RowKey, line_no: int, base_style: Style,
                            cursor_location: Coordinate,
                            hover_location: Coordinate) -> tuple[SegmentLines, SegmentLines]:
        """A row's line as Textual paints it, painted again only when that row was written.

        Measured problem (``workbench bench``, settle after a key): Textual's ``DataTable``
        keys its painted rows and cells on a count of updates to the whole table, so one
        updated cell paints every visible cell again, about a fifth of a key's frame time on
        the demo; a key changes one row.  Textual's method is kept and its result reused
        while this row, the cursor, the width and the styles are as they were.  (A private
        method of ``DataTable``: check it, with :attr:`ordered_rows`, :attr:`_y_offsets` and
        :meth:`_update_dimensions`, when Textual is upgraded.)"""
        key = (row_key, self._row_versions.get(row_key, 0), self._generation, line_no,
               base_style, cursor_location, hover_location, self.cursor_type, self.show_cursor,
               self._show_hover_cursor, self._pseudo_class_state, self.size.width)
        painted = self._painted_rows.get(key)
        if painted is None:
            painted = super()._render_line_in_row(row_key, line_no, base_style,
                                                  cursor_location, hover_location)
            self._painted_rows[key] = painted
        return painted

    def _scroll_cursor_into_view(self, animate: bool = False) -> None:
        """Scroll so the cursor's row is in view with a row either side where the list has
        room: at 80×24 it shows four rows, and a case added after the session's own cases (or
        moved, or chosen) came into view as the top row, with nothing above it to say where it
        stood.  (Textual's ``DataTable`` scrolls the cursor's row alone into view; this is its
        private method, kept with :attr:`ordered_rows` when Textual is upgraded.)"""
        if self.cursor_type != "row" or not self.row_count:
            super()._scroll_cursor_into_view(animate)
            return
        offset = self._get_fixed_offset()
        room = self.scrollable_content_region.height - offset.top
        around = NEIGHBOUR_ROWS if room >= 2 * NEIGHBOUR_ROWS + 1 else 0
        first = max(self.cursor_row - around, 0)
        last = min(self.cursor_row + around, self.row_count - 1)
        # every row is one line high (see _y_offsets): row n starts n lines under the header
        region = Region(int(self.scroll_x) + offset.left, offset.top + first,
                        max(self.size.width - offset.left, 1), last - first + 1)
        self.scroll_to_region(region, animate=animate, spacing=offset, force=True)

    def _clear_caches(self) -> None:
        super()._clear_caches()
        self._painted_rows.clear()

    def notify_style_update(self) -> None:
        """A new theme or class: every row is painted again."""
        self._painted_rows.clear()
        super().notify_style_update()

    def on_mount(self) -> None:
        """The columns, sized to the screen's width (the list spans it) until laid out."""
        self._columns_for(self.size.width or self.app.size.width)

    def _columns_for(self, width: int) -> None:
        if width <= 0:
            return
        others = sum(w + 2 for _, w in COLUMNS)  # each column has a cell padding of one a side
        name_width = max(MIN_NAME, width - others - 2 - 1)  # the scrollbar's column
        if name_width == self._name_width and self.columns:
            return
        self._name_width = name_width
        self._generation += 1
        self.clear(columns=True)
        self.add_column(NAME_HEADING, width=name_width, key="name")
        for heading, column_width in COLUMNS:
            self.add_column(heading, width=column_width, key=heading)
        self._rows, self._made_from = [], []
        self._show(self.view)

    def on_resize(self, event: Resize) -> None:
        """Give the name column the room the other columns leave; write the rows now on show."""
        self._columns_for(event.size.width)
        self._write_on_show()

    def watch_scroll_y(self, old_value: float, new_value: float) -> None:
        """Write the rows that came into view."""
        super().watch_scroll_y(old_value, new_value)
        self._write_on_show()

    def watch_view(self, view: View) -> None:
        """Rewrite what changed, and keep the cursor on the selected case."""
        self._show(view)

    def _show(self, view: View) -> None:
        if not self.columns:
            self._columns_for(self.size.width or self.app.size.width)
            return
        count = len(self.document.results)
        rows = self._rows
        with self.prevent(DataTable.RowHighlighted):  # the cursor is put back below
            while len(rows) > count:
                rows.pop()
                self._made_from.pop()
                self.remove_row(str(len(rows)))
                self._written(len(rows))
            blank = ("",) * (len(COLUMNS) + 1)
            for number in range(len(rows), count):  # written when they come into view
                self.add_row(*map(Text, blank), key=str(number))
                rows.append(blank)
                self._made_from.append(None)
            if rows and 0 <= view.selected < len(rows) and self.cursor_row != view.selected:
                self.move_cursor(row=view.selected, animate=False)
        self._write_on_show()

    def _on_show_range(self) -> range:
        """The rows on show (with a row to spare either side)."""
        top = int(self.scroll_y)
        height = self.size.height or self.app.size.height  # before the first layout: at most the screen
        return range(max(top - 1, 0), min(top + height + 1, len(self._rows)))

    def _write_on_show(self) -> None:
        for number in self._on_show_range():
            self._write(number)

    def _write(self, number: int) -> None:
        """Write the cells of row ``number`` that differ from its case's current result."""
        document = self.document
        result = document.result(number)
        if result is None:
            return
        made = (result, result.case.name, document.units)
        before = self._made_from[number]
        if before is not None and before[0] is result and before[1:] == made[1:]:
            return
        row = (fit_words(made[1], self._name_width), *row_cells(result, made[2]))
        for key, old, new in zip((column.key for column in self.ordered_columns),
                                 self._rows[number], row):
            if old != new:
                self.update_cell(str(number), key, Text(new))
                self._written(number)
        self._rows[number], self._made_from[number] = row, made

    def _written(self, number: int) -> None:
        """Row ``number`` changed: its painted line is out of date."""
        self._writes += 1
        self._row_versions[RowKey(str(number))] = self._writes

    def row_texts(self, index: int) -> tuple[str, ...]:
        """The cells of row ``index`` as they are (or will be, once in view) shown."""
        self._write(index)
        return self._rows[index]

    def on_data_table_row_highlighted(self, event: DataTable.RowHighlighted) -> None:
        """Tell the screen the cursor moved to another case."""
        event.stop()
        if event.cursor_row != self.view.selected:
            self.post_message(self.Chosen(event.cursor_row))
