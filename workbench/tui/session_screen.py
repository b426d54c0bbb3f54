"""The session's details and targets, edited in one dialog: title, project, engineer, revision,
notes; the life, reliability and static safety every case must meet.

Ctrl+s (or enter, but in the notes, which take lines of their own) keeps what is typed as one
undo step; Esc leaves everything as it was.  A target that cannot be read is named under its
field and nothing is kept until it is put right.
"""

from __future__ import annotations

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, VerticalScroll
from textual.screen import ModalScreen
from textual.validation import ValidationResult, Validator
from textual.widget import Widget
from textual.widgets import Input, Label, Static, TextArea

from ..model.document import Document
from ..model.edits import SESSION_TEXTS, TARGET_TEXTS
from .field_moves import FieldMoves

LABELS = {
    "title": "Title", "project": "Project", "engineer": "Engineer", "revision": "Revision",
    "notes": "Notes", "life": "Life target Lnm", "reliability": "Reliability R",
    "s0": "Required s0",
}
HINTS = {
    "life": "hours on Lnm, e.g. 30000 h; blank: no life verdict",
    "reliability": "for cases that give none, e.g. 0.95; blank: 0.90",
    "s0": "overrides each case's static duty minimum; blank: by duty",
    "revision": "your document's revision mark, e.g. B",
}


class NotesArea(TextArea):
    """The session's notes: lines of their own, wrapped between words (a one-line box cut them
    at its edge, mid-word, at every width).  ↑/↓ move the cursor through the notes and, where it
    cannot move further, to the previous or next field, as in every other row of the dialog."""

    def action_cursor_down(self, select: bool = False) -> None:
        """Down a line; from the end of the notes, to the next field."""
        before = self.cursor_location
        super().action_cursor_down(select)
        if not select and self.cursor_location == before:
            self.screen.focus_next()

    def action_cursor_up(self, select: bool = False) -> None:
        """Up a line; from the start of the notes, to the previous field."""
        before = self.cursor_location
        super().action_cursor_up(select)
        if not select and self.cursor_location == before:
            self.screen.focus_previous()


class TargetValidator(Validator):
    """Checks a target as the document would read it."""

    def __init__(self, document: Document, name: str) -> None:
        super().__init__()
        self.document = document
        self.target = name

    def validate(self, value: str) -> ValidationResult:
        problem = self.document.target_problem(self.target, value.strip())
        return self.success() if problem is None else self.failure(problem, value)


class SessionScreen(FieldMoves, ModalScreen[bool]):
    """Edit the session's details and targets; dismisses True when something was kept."""

    BINDINGS = [
        Binding("escape", "close", "Cancel", show=True),
        Binding("ctrl+s", "keep", "Keep", show=True, priority=True),
    ]

    DEFAULT_CSS = """
    SessionScreen {
        align: center middle;
        background: $background 60%;
        & #session-box {
            width: 100%;
            max-width: 110;  /* the room a long title needs, where the screen has it */
            height: auto;
            max-height: 100%;
            border: round $primary;
            background: $surface;
            padding: 0 1;
        }
        & .dialog-title { text-style: bold; color: $text-primary; }
        & .group-title { margin-top: 1; text-style: bold; color: $text-primary; }
        & .form-row { height: 1; }
        & .form-label { width: 18; color: $text-muted; }
        & .form-row Input { width: 1fr; }
        & .form-row.-notes { height: 4; }
        & NotesArea { width: 1fr; height: 4; padding: 0; scrollbar-size-vertical: 1; }
        & .form-note { color: $text-error; padding-left: 18; display: none; }
        & .form-note.-shown { display: block; }
        & .form-hint { color: $text-muted; padding-left: 18; }
        & #session-keys { color: $text-muted; margin-top: 1; }
    }
    """

    def __init__(self, document: Document) -> None:
        super().__init__()
        self.document = document

    def compose(self) -> ComposeResult:
        """A row per detail, then per target, each target with its hint."""
        session = self.document.session
        with VerticalScroll(id="session-box") as box:
            box.can_focus = False  # no focus stop of its own: it scrolls to the focused field
            yield Static("Session details and targets", classes="dialog-title")
            for name in SESSION_TEXTS:
                with Horizontal(classes="form-row" + (" -notes" if name == "notes" else "")):
                    yield Label(LABELS[name], classes="form-label")
                    if name == "notes":
                        yield NotesArea(session.notes, id="detail-notes", compact=True,
                                        highlight_cursor_line=False)
                    else:
                        yield Input(getattr(session, name), id=f"detail-{name}", compact=True)
                if name in HINTS:
                    yield Static(HINTS[name], classes="form-hint")
            yield Static("Targets", classes="group-title")
            for name in TARGET_TEXTS:
                with Horizontal(classes="form-row"):
                    yield Label(LABELS[name], classes="form-label")
                    yield Input(getattr(session.targets, name), id=f"target-{name}",
                                compact=True, validators=[TargetValidator(self.document, name)])
                yield Static("", id=f"target-note-{name}", classes="form-note", markup=False)
                yield Static(HINTS[name], classes="form-hint")
            yield Static("ctrl+s (or enter, but in the notes) keeps · esc cancels · ↑/↓ move",
                         id="session-keys")

    def on_mount(self) -> None:
        """The focus starts on the title, at once: ``focus()`` would queue the move behind
        the keys typed after the one that opened the dialog, and they would be lost."""
        self.set_focus(self.query_one("#detail-title", Input))

    def moves_from(self, widget: Widget | None) -> bool:
        """↑/↓ move from a text box; the notes take them while their cursor can move
        (``NotesArea``)."""
        return isinstance(widget, Input)

    @on(Input.Changed)
    def _checked(self, event: Input.Changed) -> None:
        name = (event.input.id or "").removeprefix("target-")
        if event.input.id and event.input.id.startswith("target-"):
            result = event.validation_result
            self._note(name, None if result is None or result.is_valid
                       else "; ".join(result.failure_descriptions))

    def _note(self, name: str, message: str | None) -> None:
        note = self.query_one(f"#target-note-{name}", Static)
        note.update(f"✘ {message}" if message else "")
        note.set_class(bool(message), "-shown")

    @on(Input.Submitted)
    def _submitted(self) -> None:
        self.action_keep()

    def action_keep(self) -> None:
        """Keep what is typed (one undo step), unless a target cannot be read."""
        if self.app.screen is not self:
            return
        details = {name: self._detail(name) for name in SESSION_TEXTS}
        targets = {name: self.query_one(f"#target-{name}", Input).value for name in TARGET_TEXTS}
        before = self.document.revision
        problems = self.document.set_details(details, targets)
        for name in TARGET_TEXTS:
            self._note(name, problems.get(name))
        if not problems:
            self.dismiss(self.document.revision != before)

    def _detail(self, name: str) -> str:
        if name == "notes":
            return self.query_one(NotesArea).text
        return self.query_one(f"#detail-{name}", Input).value

    def action_close(self) -> None:
        """Leave everything as it was."""
        if self.app.screen is self:
            self.dismiss(False)
