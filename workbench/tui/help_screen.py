"""The help screen: every key and what it does, from the one table of actions, as a table."""

from __future__ import annotations

from collections.abc import Mapping

from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.content import Content
from textual.widgets import DataTable, Label, Static

from .actions import ACTIONS
from .dialogs import OnceModal
from .table_fit import fill_fitted

HELP_HEADINGS = ("Keys", "Command", "What it does")
READABLE_HELP = 40
"""The description column's width below which the keys and command columns wrap (at 80
columns a key list and a long title left it 21 cells, and a description took 4–6 lines)."""
GENERAL_KEYS = (
    ("tab, shift+tab", "Next, previous", "Move between fields, tables and panes"),
    ("ctrl+p", "Command palette", "Every command by name, with its keys"),
    ("enter, space", "Open a choice", "On a choice field: list the choices (type to search); "
                                      "enter takes one, escape keeps the value"),
    ("escape", "Back", "Close a dialog or a screen such as this one"),
)
"""Keys that belong to the widgets rather than to an action of the table."""
HELP_FOOTNOTE = ("A value that cannot be used is marked at its field and the last valid value "
                 "stays in force. To move an action to other keys, name its id (in brackets "
                 "above) in keys.toml in the workbench's config folder, e.g. \"case.add\" = \"ctrl+a\".")


def help_rows(keymap: Mapping[str, str] | None = None) -> list[tuple[str, str, str]]:
    """One row per action (keys in force, title, what it does and its id), then the widgets'
    own keys."""
    return [(action.key_text(keymap), action.title, f"{action.help} [{action.id}]")
            for action in ACTIONS] + list(GENERAL_KEYS)


class HelpScreen(OnceModal[None]):
    """Keys and commands; escape or f1 closes it."""

    DEFAULT_CSS = """
    HelpScreen #help-keys { height: 1fr; }
    """

    BINDINGS = [Binding("escape,f1,q", "dismiss_none", "Close", id="help.close")]

    def __init__(self, keymap: Mapping[str, str] | None = None) -> None:
        super().__init__()
        self._rows = help_rows(keymap)

    def compose(self) -> ComposeResult:
        """The key table and a footnote."""
        with Vertical(classes="dialog-box screen-box"):
            yield Label("Keys", classes="dialog-title")
            yield DataTable(id="help-keys", cursor_type="row", zebra_stripes=True)
            yield Static(Content(HELP_FOOTNOTE), classes="dialog-hint")
            yield Static("↑/↓, page up/down: read on · escape: close", classes="dialog-hint")

    def on_mount(self) -> None:
        """Fill the table and put the focus in it."""
        self._fit()
        self.query_one("#help-keys", DataTable).focus()

    def _fit(self) -> None:
        table = self.query_one("#help-keys", DataTable)
        width = table.scrollable_content_region.width or self.app.size.width - 4
        fill_fitted(table, HELP_HEADINGS, self._rows, width - 1,  # the scroll bar
                    readable=READABLE_HELP)

    def on_resize(self) -> None:
        """Wrap the table again for the new width, once it is laid out."""
        self.call_after_refresh(self._fit)
