"""The session's bearings: add, duplicate, rename and delete them, and choose one for the case.

A ``DataTable`` lists each bearing with its kind, ratings and how many cases use it; the line
under it gives the highlighted bearing's origin (designation, where its data came from), which
can be long and wraps there rather than widen the table past 80 columns.  Deleting a bearing
that cases use is refused, naming them.  Every change is one undo step of the document.
"""

from __future__ import annotations

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.screen import ModalScreen
from textual.widgets import DataTable, Footer, Input, Static

from ..model.document import Document

COLUMNS = ("Bearing", "Kind", "C", "C0", "Cases")


class BearingsScreen(ModalScreen[str | None]):
    """The session's bearings; dismisses with the name of a bearing chosen for the selected
    case (enter), or None."""

    BINDINGS = [
        Binding("escape", "close", "Close"),
        Binding("enter", "choose", "Use for the case"),
        Binding("a", "add", "Add"),
        Binding("c", "copy", "Duplicate"),
        Binding("r,f2", "rename", "Rename"),
        Binding("delete,d", "delete", "Delete"),
    ]

    DEFAULT_CSS = """
    BearingsScreen {
        align: center middle;
        background: $background 60%;
        & #bearings-box {
            width: 100%;
            max-width: 118;
            height: auto;
            max-height: 100%;
            border: round $primary;
            background: $surface;
            padding: 0 1;
        }
        & .dialog-title { text-style: bold; color: $text-primary; }
        & DataTable { height: auto; max-height: 16; }
        & #bearing-name { display: none; }
        & #bearing-name.-shown { display: block; }
        & #bearing-origin { color: $text-muted; }
        & #bearings-message { color: $text-warning; }
    }
    """

    def __init__(self, document: Document, current: str | None) -> None:
        super().__init__()
        self.document = document
        self.current = current
        self._renaming: str | None = None

    def compose(self) -> ComposeResult:
        """The table, a line for messages and the name box used when renaming."""
        with Vertical(id="bearings-box"):
            yield Static("Bearings of this session", classes="dialog-title")
            yield DataTable(id="bearings", cursor_type="row", zebra_stripes=True)
            yield Static("", id="bearing-origin", markup=False)
            yield Input(id="bearing-name", compact=True, placeholder="new name, enter keeps")
            yield Static("", id="bearings-message", markup=False)
        yield Footer()

    def on_mount(self) -> None:
        """Fill the table, the cursor on the case's bearing."""
        table = self.query_one(DataTable)
        for heading in COLUMNS:
            table.add_column(heading, key=heading)
        self._fill(self.current)
        table.focus()

    def _fill(self, cursor_on: str | None) -> None:
        table = self.query_one(DataTable)
        table.clear()
        document = self.document
        for bearing in document.session.bearings:
            texts = bearing.texts
            users = sum(1 for r in document.results if r.case.bearing == bearing.name)
            table.add_row(bearing.name, texts.get("kind", ""), texts.get("c", ""),
                          texts.get("c0", ""), str(users), key=bearing.name)
        names = [b.name for b in document.session.bearings]
        if cursor_on in names:
            table.move_cursor(row=names.index(cursor_on))
        self._show_origin()

    @on(DataTable.RowHighlighted)
    def _show_origin(self) -> None:
        """Say where the highlighted bearing comes from."""
        name = self._selected()
        bearing = None if name is None else self.document.session.bearing(name)
        self.query_one("#bearing-origin", Static).update(
            "" if bearing is None else
            f"{bearing.name}: "
            + (f"designation {bearing.designation}" if bearing.designation else "no designation")
            + f"; data: {bearing.source or 'typed'}")

    def _selected(self) -> str | None:
        table = self.query_one(DataTable)
        if not table.row_count:
            return None
        return str(table.coordinate_to_cell_key(table.cursor_coordinate).row_key.value)

    def _say(self, message: str) -> None:
        self.query_one("#bearings-message", Static).update(message)

    def action_add(self) -> None:
        """Add a new bearing (deep-groove, no ratings yet)."""
        name = self.document.add_bearing()
        self._fill(name)
        self._say(f"Added {name}: give its ratings in the form once a case uses it")

    def action_copy(self) -> None:
        """Add a copy of the bearing under the cursor."""
        selected = self._selected()
        if selected is not None:
            name = self.document.add_bearing(like=selected)
            self._fill(name)
            self._say(f"Added {name}, a copy of {selected}")

    def action_rename(self) -> None:
        """Type a new name for the bearing under the cursor."""
        selected = self._selected()
        if selected is None:
            return
        self._renaming = selected
        box = self.query_one("#bearing-name", Input)
        box.value = selected
        box.add_class("-shown")
        box.focus()

    @on(Input.Submitted, "#bearing-name")
    def _renamed(self, event: Input.Submitted) -> None:
        old, self._renaming = self._renaming, None
        box = self.query_one("#bearing-name", Input)
        box.remove_class("-shown")
        self.query_one(DataTable).focus()
        if old is None:
            return
        problem = self.document.rename_bearing(old, event.value)
        self._say(problem or f"Renamed {old} to {event.value.strip()}")
        self._fill(old if problem else event.value.strip())

    def action_delete(self) -> None:
        """Delete the bearing under the cursor, unless cases use it."""
        selected = self._selected()
        if selected is None:
            return
        row = self.query_one(DataTable).cursor_row
        problem = self.document.delete_bearing(selected)
        self._say(problem or f"Deleted {selected} (ctrl+z on the main screen brings it back)")
        names = [b.name for b in self.document.session.bearings]
        # a refused delete leaves the cursor where it was; a done one on the bearing that took its place
        self._fill(selected if problem else names[min(row, len(names) - 1)] if names else None)

    def action_choose(self) -> None:
        """Use the bearing under the cursor for the selected case."""
        if self._renaming is not None or self.app.screen is not self:
            return
        self.dismiss(self._selected())

    def action_close(self) -> None:
        """Close; the changes made stay (each is an undo step)."""
        if self._renaming is not None:
            self._renaming = None
            self.query_one("#bearing-name", Input).remove_class("-shown")
            self.query_one(DataTable).focus()
            return
        if self.app.screen is self:
            self.dismiss(None)
