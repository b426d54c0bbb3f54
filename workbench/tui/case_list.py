"""The load-case list: one row per case with P, Lnm, s0 and whether it meets the targets."""

from __future__ import annotations

import math
from collections.abc import Sequence

from rich.text import Text
from textual.message import Message
from textual.widgets import DataTable

from ..engine.record import fmt
from ..model.quantities import format_quantity
from ..model.session import CaseResult

# (key, heading, width): one leading space per cell stands in for the cell padding, so the
# five columns fit the left column of an 80-column terminal.
COLUMNS = (("name", "Case", 12), ("P", "P", 10), ("Lnm", "Lnm h", 7), ("s0", "s0", 5),
           ("verdict", "Meets", 7))
LIFE_SHOWN_UP_TO_H = 1e6
S0_SHOWN_UP_TO = 1000.0


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


def _cell(text: str) -> Text:
    return Text(" " + text, no_wrap=True, overflow="ellipsis")


def case_row(result: CaseResult, system: str) -> tuple[Text, ...]:
    """The cells of one case's row, results formatted in ``system`` (SI or US)."""
    if result.derivation is None:
        return (_cell(result.case.name), _cell("—"), _cell("—"), _cell("—"),
                _cell(verdict(result)))
    values = result.derivation.results
    s0 = values["s0"]
    return (
        _cell(result.case.name),
        _cell(format_quantity(values["P"], "force", system)),  # type: ignore[arg-type]
        _cell(_life_text(values.get("Lnm", math.nan))),
        _cell(fmt(s0, 3) if s0 < S0_SHOWN_UP_TO else f">{S0_SHOWN_UP_TO:g}"),
        _cell(verdict(result)),
    )


class CaseList(DataTable[Text]):
    """The session's load cases; announces the case a person moves to with :class:`Chosen`."""

    class Chosen(Message):
        """The highlighted case changed to ``index``."""

        def __init__(self, index: int) -> None:
            super().__init__()
            self.index = index

    def __init__(self, *, id: str | None = None) -> None:
        super().__init__(id=id, cursor_type="row", zebra_stripes=True, cell_padding=0)

    def on_mount(self) -> None:
        """Set up the columns."""
        for key, label, width in COLUMNS:
            self.add_column(" " + label, key=key, width=width)

    def show(self, results: Sequence[CaseResult], selected: int, system: str) -> None:
        """Redraw every row and put the cursor on ``selected``."""
        with self.prevent(DataTable.RowHighlighted):
            self.clear()
            for index, result in enumerate(results):
                self.add_row(*case_row(result, system), key=str(index))
            if 0 <= selected < len(results):
                self.move_cursor(row=selected, animate=False)

    def show_row(self, index: int, result: CaseResult, system: str) -> None:
        """Redraw one row (after an edit of that case)."""
        if not 0 <= index < self.row_count:
            return
        for (key, _, _), cell in zip(COLUMNS, case_row(result, system)):
            self.update_cell(str(index), key, cell)

    def on_data_table_row_highlighted(self, event: DataTable.RowHighlighted) -> None:
        """Announce the case moved to."""
        event.stop()
        self.post_message(self.Chosen(event.cursor_row))
