"""Fill a ``DataTable`` so that it fits its width: the last column's text wraps between words.

Textual's ``DataTable`` sizes a column to its longest cell and never wraps, so a long text
(a help line, the details of a gear) would run off an 80-column screen or be cut mid-word.
:func:`fill_fitted` gives the last column what the others leave and wraps its cells there, the
row growing to as many lines as it needs; asked for a ``readable`` last column, it narrows the
other columns first (left to right, never below their longest word), wrapping their cells too.
A screen calls it again when its width changes.
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


def least_width(heading: str, cells: Sequence[str]) -> int:
    """The narrowest a column gets when its cells wrap between words: its heading and its
    longest word (a key of a list such as "ctrl+delete, shift+delete")."""
    return max([cell_len(heading)] + [cell_len(word) for cell in cells for word in cell.split()])


def _wrapped(text: str, width: int) -> list[str]:
    """``text`` wrapped between words to ``width`` cells (whole when it fits)."""
    if cell_len(text) <= width:
        return [text]
    return textwrap.wrap(text, width, break_on_hyphens=False, break_long_words=False) or [""]


def plain(texts: Sequence[str]) -> list[Text]:
    """Cells shown exactly as written (no markup)."""
    return [Text(text, end="") for text in texts]


def fill_fitted(table: DataTable[Text], headings: Sequence[str], rows: Sequence[Sequence[str]],
                width: int, keys: Sequence[str] | None = None, *, readable: int = 0) -> None:
    """Replace the table's columns and rows: every column but the last at its natural width,
    the last wrapped between words to what remains of ``width`` (cells, padding included).
    Where that leaves the last column under ``readable`` cells (and its text is wider), the
    columns before it give up room, left to right, down to their longest word, and wrap.
    The cursor stays on the row it was on."""
    cursor_row = table.cursor_row
    table.clear(columns=True)
    columns = [[row[k] for row in rows] for k in range(len(headings))]
    widths = [natural_width(heading, cells) for heading, cells in zip(headings[:-1], columns)]
    room = width - CELL_PADDING * len(headings)
    wanted = min(readable, natural_width(headings[-1], columns[-1]))
    for k, heading in enumerate(headings[:-1]):
        short = room - sum(widths) - wanted
        if short >= 0:
            break
        widths[k] = max(least_width(heading, columns[k]), widths[k] + short)
    last = max(MIN_LAST_WIDTH, cell_len(headings[-1]), room - sum(widths))
    for heading, column_width in zip(headings, [*widths, last]):
        table.add_column(heading, width=column_width, key=heading)
    for n, row in enumerate(rows):
        cells = [_wrapped(text, column_width) for text, column_width in zip(row, [*widths, last])]
        table.add_row(*plain(["\n".join(lines) for lines in cells]),
                      height=max(len(lines) for lines in cells),
                      key=keys[n] if keys is not None else None)
    if rows:
        table.move_cursor(row=min(cursor_row, len(rows) - 1))
