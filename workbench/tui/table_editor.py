"""Editing a shaft or a duty cycle from the keyboard, its results worked out as you type.

A :class:`TableEditor` edits one ``[[shafts]]`` or ``[[duty_cycles]]`` table of the session as
typed: a form on the left (the table's own fields, then a group per row: a gear or pulley, an
operating state, a duty-cycle state) and, on the right, what the analysis makes of it now — the
bearing loads of each state and the free-body derivation for a shaft, the Palmgren–Miner life for
a duty cycle — or the error naming the key to put right.  Each edit is a step of the document's
undo stack (keystrokes in one field merge); the main screen's list follows the generated cases.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any, NamedTuple

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, VerticalScroll
from textual.content import Content
from textual.widget import Widget
from textual.widgets import Input, Label, Select, Static

from ..model.document import Document
from ..model.table_words import TableWords, error_in_words
from .choice_box import ChoiceBox
from .line_pane import LinePane
from .field_box import FieldBox
from .field_moves import FieldMoves
from .key_footer import KeyFooter

Choices = tuple[str, ...] | str | None
"""A field's options: None typed, a tuple of fixed choices ("" = blank allowed), or the name of
a list the editor fills from the session ("bearings", "cases")."""


class Field(NamedTuple):
    """One text of a table: its key, its label and what may be chosen."""

    key: str
    label: str
    choices: Choices = None
    hint: str = ""


class Rows(NamedTuple):
    """A list of rows in the table (``elements``, ``states``): how a row reads and a new one."""

    key: str
    title: str
    fields: tuple[Field, ...]
    new: dict[str, str]


SEP = "--"


def control_id(where: tuple[str | int, ...], key: str) -> str:
    """The id of the control for ``key`` at ``where`` (() the table, ("states", 1) a row)."""
    return SEP.join(["t", *map(str, where), key])


def parse_control_id(widget_id: str) -> tuple[tuple[str | int, ...], str]:
    """(where, key) of a control id made by :func:`control_id`."""
    parts = widget_id.split(SEP)[1:]
    where: tuple[str | int, ...] = tuple(int(p) if p.isdigit() else p for p in parts[:-1])
    return where, parts[-1]


class TableForm(VerticalScroll, can_focus=False):
    """The editor's form; built again (``recompose``) when rows come or go.  No focus stop of
    its own: ↑/↓ move between its fields (``field_moves``) and it scrolls to the focused one."""

    def __init__(self, editor: TableEditor, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self.editor = editor

    def compose(self) -> ComposeResult:
        """The editor's groups and rows as the table holds them now."""
        yield from self.editor.form_widgets()


class TableEditor(FieldMoves):
    """The form of one table and its results; subclasses say what the table holds."""

    TABLES = ""
    """The session's tables this edits (``shafts`` or ``duty_cycles``)."""
    TITLE_WORD = ""
    HEAD: tuple[Field, ...] = ()
    ROWS: tuple[Rows, ...] = ()
    MORE_LABELS: dict[str, dict[str, str]] = {}
    """Labels of keys the analysis names in a list of rows beyond the form's fields."""

    BINDINGS = [
        Binding("escape", "close", "Back"),
        # a row's coming and going acts as the key arrives, before the keys behind it
        # (``field_moves``): the focus is in its place when they are handed on
        Binding("f8", "delete_row", "Delete this row", priority=True),
        Binding("ctrl+z", "undo", "Undo", show=False),
        Binding("ctrl+y", "redo", "Redo", show=False),
    ]

    DEFAULT_CSS = """
    TableEditor {
        & #editor-title { background: $boost; color: $text-primary; text-style: bold;
                          padding: 0 1; }
        & #table-form { width: 50%; min-width: 40; border-right: vkey $panel;
                        scrollbar-size-vertical: 1; }
        & #table-results { width: 1fr; padding: 0 1; }
        & .group-title { margin-top: 1; background: $boost; color: $text-primary;
                         text-style: bold; padding: 0 1; }
        & .form-row { height: 1; }
        /* labels are at most 17 characters: the rest of the row is the value's */
        & .form-label { width: 19; padding: 0 1; color: $text-muted; }
        & .form-row Input, & .form-row Select { width: 1fr; }
        & .form-hint { color: $text-muted; padding: 0 1 0 20; }
    }
    """

    def __init__(self, document: Document, index: int) -> None:
        super().__init__()
        self.document = document
        self.index = index
        self._title = ""

    # ---- the form -----------------------------------------------------------------------
    @property
    def table(self) -> dict[str, Any]:
        """The table as typed now ({} once an undo has taken it away)."""
        tables = self.document.tables(self.TABLES)
        return tables[self.index] if self.index < len(tables) else {}

    @property
    def gone(self) -> bool:
        """Whether the table is no longer in the session (an undo took its adding back)."""
        return self.index >= len(self.document.tables(self.TABLES))

    def compose(self) -> ComposeResult:
        """The title, the form and the results side by side."""
        yield Static(id="editor-title", markup=False)  # the name as typed
        with Horizontal():
            yield TableForm(self, id="table-form")
            yield LinePane(id="table-results")
        yield KeyFooter()

    def form_widgets(self) -> ComposeResult:
        table = self.table
        yield Static(self.TITLE_WORD.capitalize(), classes="group-title")
        yield from self._rows_of(self.HEAD, (), table)
        yield from self.extra_groups(table)
        for rows in self.ROWS:
            for number, row in enumerate(table.get(rows.key, [])):
                yield Static(self._row_title(rows, number, row), classes="group-title",
                             id=self._title_id(rows.key, number))
                yield from self._rows_of(self.row_fields(rows, row), (rows.key, number), row)

    @staticmethod
    def _row_title(rows: Rows, number: int, row: dict[str, str]) -> str:
        return f"{rows.title} {number + 1}: {row.get('name', row.get('case', ''))}"

    @staticmethod
    def _title_id(key: str, number: int) -> str:
        return SEP.join(["title", key, str(number)])

    def extra_groups(self, table: dict[str, Any]) -> ComposeResult:
        """More groups after the table's own fields (a shaft's case inputs)."""
        yield from ()

    def row_fields(self, rows: Rows, row: dict[str, str]) -> tuple[Field, ...]:
        """The fields a row shows (a gear shows what its kind needs)."""
        return rows.fields

    def _rows_of(self, fields: Sequence[Field], where: tuple[str | int, ...],
                 values: dict[str, Any]) -> ComposeResult:
        for field in fields:
            with Horizontal(classes="form-row"):
                yield Label(field.label, classes="form-label")
                yield self._control(field, where, str(values.get(field.key, "")))
            if field.hint:
                yield Static(field.hint, classes="form-hint")

    def _options(self, choices: Choices) -> list[str]:
        if choices == "bearings":
            return [b.name for b in self.document.session.bearings]
        if choices == "cases":
            return [r.case.name for r in self.document.results]
        return [c for c in choices or () if c]

    def _control(self, field: Field, where: tuple[str | int, ...], value: str) -> Widget:
        widget_id = control_id(where, field.key)
        if field.choices is None:
            box = FieldBox(value, id=widget_id, compact=True, tooltip=field.hint or None)
            box.cursor_position = 0  # a text longer than its box shows its start, not its end
            return box
        options = self._options(field.choices)
        if value and value not in options:
            options.append(value)
        blank = isinstance(field.choices, str) or "" in field.choices
        return ChoiceBox([(o, o) for o in options], value=value if value else Select.NULL,
                         allow_blank=blank or not value, compact=True, id=widget_id,
                         prompt="(blank)")

    async def _rebuild(self, focus: str | None = None) -> None:
        """Build the form again (a row added or removed, a gear's kind changed)."""
        await self.query_one(TableForm).recompose()
        if focus is not None:
            found = self.query(f"#{focus}")
            if found:  # at once: ``focus()`` would queue the move behind the keys waiting
                self.set_focus(found.first())

    # ---- editing ------------------------------------------------------------------------
    def on_mount(self) -> None:
        """Show the results, the focus on the first field."""
        self._show()
        first = self.query(Input)
        if first:  # at once, before a key typed behind the one that opened the editor
            self.set_focus(first.first())

    def _edited(self, widget_id: str, text: str) -> None:
        if self.gone:
            self.action_close()
            return
        where, key = parse_control_id(widget_id)
        self.document.set_table_text(self.TABLES, self.index, where, key, text,
                                     words=self.table_words())
        if key in ("name", "case") and len(where) == 2:  # a row's title names it
            rows = next(r for r in self.ROWS if r.key == where[0])
            row = self.table.get(rows.key, [])[int(where[1])]
            self.query_one(f"#{self._title_id(rows.key, int(where[1]))}", Static).update(
                self._row_title(rows, int(where[1]), row))
        self._show()

    @on(Input.Changed)
    def _typed(self, event: Input.Changed) -> None:
        if event.input.id and event.input.id.startswith("t" + SEP):
            self._edited(event.input.id, event.value)

    @on(Input.Blurred)
    @on(Input.Submitted)
    def _typing_done(self) -> None:
        self.document.end_run()

    @on(Select.Changed)
    async def _chosen(self, event: Select.Changed) -> None:
        widget_id = event.select.id or ""
        if not widget_id.startswith("t" + SEP):
            return
        value = "" if event.value is Select.NULL else str(event.value)
        where, key = parse_control_id(widget_id)
        if self.gone:
            self.action_close()
            return
        current = self.table
        for step in where:
            current = current.get(step, {}) if isinstance(step, str) else current[step]
        if str(current.get(key, "")) == value:
            return
        self._edited(widget_id, value)
        self.document.end_run()
        if self.rebuilds_on(key):
            await self._rebuild(focus=widget_id)

    def rebuilds_on(self, key: str) -> bool:
        """Whether choosing a new ``key`` changes which fields show."""
        return False

    async def add_row(self, rows: Rows, **texts: str) -> None:
        """Add a row to ``rows`` (``rows.new``, with ``texts`` over it) and put the focus on its
        first field."""
        if self.gone:
            self.action_close()
            return
        number = self.document.add_row(self.TABLES, self.index, rows.key, rows.new | texts,
                                       words=self.table_words())
        await self._rebuild(focus=control_id((rows.key, number), rows.fields[0].key))
        self._show()

    async def action_delete_row(self) -> None:
        """Delete the row (gear, state) the focus is in."""
        focused = self.focused
        if focused is None or not (focused.id or "").startswith("t" + SEP):
            return
        where, _ = parse_control_id(focused.id or "")
        if self.gone:
            self.action_close()
            return
        if len(where) != 2 or not isinstance(where[1], int):
            self.notify("Put the focus in a row to delete it", severity="warning")
            return
        self.document.delete_row(self.TABLES, self.index, str(where[0]), where[1],
                                 words=self.table_words())
        await self._rebuild()
        self._show()

    async def action_undo(self) -> None:
        """Undo the last change (the form shows the table as it is then; an undo that takes
        the table away closes the editor)."""
        await self._after(self.document.undo())

    async def action_redo(self) -> None:
        """Redo what was undone."""
        await self._after(self.document.redo())

    async def _after(self, done: object) -> None:
        if done is None:
            return
        if self.gone:
            self.action_close()
            return
        await self._rebuild()
        self._show()

    def action_close(self) -> None:
        """Back to the main screen."""
        if self.app.screen is self:
            self.document.end_run()
            self.dismiss(None)

    # ---- results ------------------------------------------------------------------------
    def _show(self) -> None:
        if self.gone:
            return
        title = (f"{self.TITLE_WORD.capitalize()}: {self.table.get('name', '')}   "
                 "(results follow as you type; esc goes back)")
        if title != self._title:  # an update lays the screen out: only on a change
            self._title = title
            self.query_one("#editor-title", Static).update(title)
        self.query_one("#table-results", LinePane).show_lines(self.results())

    @classmethod
    def table_words(cls) -> TableWords:
        """How this editor names its table's parts: its word, the rows' titles, the labels."""
        return TableWords(
            cls.TITLE_WORD, {f.key: f.label for f in cls.HEAD},
            {rows.key: (rows.title, {f.key: f.label for f in rows.fields}
                        | cls.MORE_LABELS.get(rows.key, {}))
             for rows in cls.ROWS})

    def in_words(self, error: str) -> str:
        """An analysis error ("shafts[1].states[2].power: …") with its key named as this
        editor shows it: the table's name, the row's title, number and name, the label."""
        return error_in_words(error, self.table, self.table_words(),
                              bearings=[bearing.name for bearing in self.document.session.bearings])

    def results(self) -> list[Content]:
        """What the analysis makes of the table now, line by line."""
        raise NotImplementedError
