"""Writing the session's report from the screen: the format, where to write it, and a preview.

The preview is the text report of the session as it stands; building it and writing the file
run in a thread worker (an html report with its plots takes seconds), so the screen never waits.
Writing is atomic (:func:`workbench.report.write_report`); a failure is one line here.
"""

from __future__ import annotations

import copy
from pathlib import Path

from textual import on, work
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical, VerticalScroll
from textual.screen import ModalScreen
from textual.widgets import Input, Label, Select, Static

from ..model.document import Document
from ..report import FORMATS, preview, write_report
from .choice_box import ChoiceBox
from .dialogs import PathSuggester

SUFFIX = {"text": ".txt", "markdown": ".md", "json": ".json", "html": ".html"}


class ReportScreen(ModalScreen[Path | None]):
    """Choose a format and a file, see the report, write it; dismisses with the file written."""

    BINDINGS = [
        Binding("escape", "close", "Close"),
        Binding("ctrl+s", "write", "Write the report", priority=True),
    ]

    DEFAULT_CSS = """
    ReportScreen {
        align: center middle;
        background: $background 60%;
        & #report-box { width: 100%; max-width: 110; height: 100%; max-height: 40;
                        border: round $primary; background: $surface; padding: 0 1; }
        & .dialog-title { text-style: bold; color: $text-primary; }
        & .form-row { height: 1; }
        & .form-label { width: 12; color: $text-muted; }
        & .form-row Input, & .form-row Select { width: 1fr; }
        & #report-message { color: $text-warning; }
        & #report-keys { color: $text-muted; }
        & #report-preview { height: 1fr; border-top: hkey $panel; }
    }
    """

    def __init__(self, document: Document) -> None:
        super().__init__()
        self.document = document
        self.session = copy.deepcopy(document.session)  # the session as it was when asked
        self.session_path = document.path
        self.modified = document.dirty

    def _default_path(self, fmt: str) -> str:
        base = self.session_path or Path("session.toml")
        return str(base.with_name(base.stem + "-report" + SUFFIX[fmt]))

    def compose(self) -> ComposeResult:
        """Format, file, message line, keys, preview."""
        with Vertical(id="report-box"):
            yield Static("Report of this session", classes="dialog-title")
            with Horizontal(classes="form-row"):
                yield Label("Format", classes="form-label")
                yield ChoiceBox([(name, name) for name in FORMATS], value="html",
                                allow_blank=False, compact=True, id="report-format")
            with Horizontal(classes="form-row"):
                yield Label("Write to", classes="form-label")
                yield Input(self._default_path("html"), id="report-path", compact=True,
                            suggester=PathSuggester())
            yield Static("", id="report-message", markup=False)
            yield Static("ctrl+s or enter writes · esc closes · the preview is the text form",
                         id="report-keys")
            with VerticalScroll(id="report-preview"):
                yield Static("Building the preview…", id="report-text", markup=False)

    def on_mount(self) -> None:
        """The focus on the file name; the preview built in a worker."""
        self.query_one("#report-path", Input).focus()
        self._preview()

    @work(thread=True, exclusive=True, group="report-preview")
    def _preview(self) -> None:
        text = preview(self.session, session_path=self.session_path, modified=self.modified)
        self.app.call_from_thread(self.query_one("#report-text", Static).update, text)

    @on(Select.Changed, "#report-format")
    def _format_chosen(self, event: Select.Changed) -> None:
        box = self.query_one("#report-path", Input)
        box.value = str(Path(box.value).with_suffix(SUFFIX[str(event.value)]))

    @on(Input.Submitted, "#report-path")
    def _submitted(self) -> None:
        self.action_write()

    def action_write(self) -> None:
        """Write the report where asked (in a worker)."""
        path = self.query_one("#report-path", Input).value.strip()
        if not path:
            self.query_one("#report-message", Static).update("Name the file to write")
            return
        fmt = str(self.query_one("#report-format", ChoiceBox).value)
        self.query_one("#report-message", Static).update(f"Writing the {fmt} report…")
        self._write(fmt, Path(path).expanduser())

    @work(thread=True, exclusive=True, group="report-write")
    def _write(self, fmt: str, path: Path) -> None:
        written = write_report(self.session, session_path=self.session_path, fmt=fmt,
                               out_path=path, modified=self.modified)
        self.app.call_from_thread(self._written, written.path, written.error)

    def _written(self, path: Path | None, error: str | None) -> None:
        if error is not None or path is None:
            self.query_one("#report-message", Static).update(f"✘ {error}")
            return
        if self.app.screen is self:
            self.dismiss(path)

    def action_close(self) -> None:
        """Close without writing."""
        if self.app.screen is self:
            self.dismiss(None)
