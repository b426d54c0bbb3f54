"""The start-up floor for ``workbench bench``: Textual's own widgets, as many and of the kinds the
workbench's first screen holds, with nothing of ours.

``startup_ratio`` divides the workbench's first frame by a one-line Textual app's.  This app
answers the question that figure raises: how much of it is Textual making, styling and painting
the widgets issue 17 asks the screen to be built from, and how much is ours (our imports and
numpy, the document, the derivations, the theme)?  Its ratio to the same one-line app is
``startup_floor_ratio``; the workbench can only come close to it, never under it.

The counts below follow the demo session's first screen at 120×40;
``tests/tui/test_first_frame.py`` checks them against a census of that screen, so the floor
moves when the form does.
"""

from __future__ import annotations

from textual.app import App, ComposeResult
from textual.containers import Grid, Horizontal, VerticalScroll
from textual.validation import Function
from textual.widgets import (Checkbox, DataTable, Footer, Header, Input, Label, Select, Static,
                             TabbedContent, TabPane)

FORM_GROUPS = 6
"""Field groups of the case form, each a title and a grid."""
FORM_CONTROLS = {Input: 28, Select: 5, Checkbox: 2}
"""The case form's controls by Textual class, each with a label."""
PANES = 4
"""Tabs of the pane area (derivation, solver, What-if, inside)."""
TABLE_SIZE = (11, 5)
"""Rows and columns of the case list."""


class SameWidgetsApp(App[None]):
    """A header, a table, a scrolling form of labelled controls in grids, tabbed panes and a
    footer: the workbench's first screen in Textual's widgets, with placeholder texts."""

    def compose(self) -> ComposeResult:
        """The widgets, laid out as the workbench lays out its own."""
        controls = [kind for kind, count in FORM_CONTROLS.items() for _ in range(count)]
        yield Header()
        with Horizontal():
            yield DataTable(id="cases")
            with VerticalScroll():
                yield Static("")
                for group in range(FORM_GROUPS):
                    yield Static(f"Group {group + 1}")
                    with Grid():
                        for number, kind in enumerate(controls[group::FORM_GROUPS]):
                            yield Label(f"field {group}.{number}")
                            yield self._control(kind)
            with TabbedContent():
                for pane in range(PANES):
                    with TabPane(f"Pane {pane + 1}"):
                        yield Static("\n".join(f"step {line}: a = b · c" for line in range(30)))
        yield Footer()

    @staticmethod
    def _control(kind: type) -> Input | Select[str] | Checkbox:
        if kind is Select:
            return Select([(choice, choice) for choice in ("one", "two", "three")], compact=True,
                          value="one")
        if kind is Checkbox:
            return Checkbox("switch", compact=True)
        return Input("12.5 kN", compact=True, validators=[Function(bool)])

    def on_mount(self) -> None:
        """Fill the table as the workbench fills its case list."""
        rows, columns = TABLE_SIZE
        table = self.query_one("#cases", DataTable)
        table.add_columns(*(f"column {column}" for column in range(columns)))
        table.add_rows([f"case {row}", "1.25 kN", "30 000 h", "2.4", "ok"][:columns]
                       for row in range(rows))
