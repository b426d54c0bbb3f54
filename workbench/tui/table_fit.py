"""Fill a ``DataTable`` so that it fits its width: the last column's text wraps between words.

Textual's ``DataTable`` sizes a column to its longest cell and never wraps, so a long text
(a help line, the details of a gear) would run off an 80-column screen or be cut mid-word.
:func:`fill_fitted` gives the last column what the others leave and wraps its cells there, the
row growing to as many lines as it needs.  A screen calls it again when its width changes.
Cells go in as plain ``Text``: a ``str`` cell would be read as markup, and a case or bearing
name with square brackets would lose them.
"""

from __future__ import annotations

import textwrap
from collections.abc import Sequence

from rich.cells import cell_len
from rich.text import Text
from textual.widgets import DataTable

CELL_PADDING = 2
"""A ``DataTable`` cell's padding, one cell each side (its default ``cell_padding``)."""
MIN_LAST_WIDTH = 16
"""The narrowest the wrapped column gets, however little room the others leave."""


def natural_width(heading: str, cells: Sequence[str]) -> int:
    """The cells a column needs for its heading and longest line, without padding."""
    return max([cell_len(heading)] + [cell_len(line) for cell in cells for line in cell.split("\n")])


def plain(texts: Sequence[str]) -> list[Text]:
    """Cells shown exactly as written (no markup)."""
    return [Text(text, end="") for text in texts]


def fill_fitted(table: DataTable[Text], headings: Sequence[str], rows: Sequence[Sequence[str]],
                width: int, keys: Sequence[str] | None = None) -> None:
    """Replace the table's columns and rows: every column but the last at its natural width,
    the last wrapped between words to what remains of ``width`` (cells, padding included).
    The cursor stays on the row it was on."""
    cursor_row = table.cursor_row
    table.clear(columns=True)
    widths = [natural_width(heading, [row[k] for row in rows])
              for k, heading in enumerate(headings[:-1])]
    last = max(MIN_LAST_WIDTH, cell_len(headings[-1]),
               width - sum(widths) - CELL_PADDING * len(headings))
    for heading, column_width in zip(headings, [*widths, last]):
        table.add_column(heading, width=column_width, key=heading)
    for n, row in enumerate(rows):
        lines = textwrap.wrap(row[-1], last, break_on_hyphens=False) or [""]
        table.add_row(*plain([*row[:-1], "\n".join(lines)]), height=len(lines),
                      key=keys[n] if keys is not None else None)
    if rows:
        table.move_cursor(row=min(cursor_row, len(rows) - 1))
