"""The help screen: every key, what it does, from the one table of actions."""

from __future__ import annotations

from collections.abc import Mapping

from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import VerticalScroll
from textual.content import Content
from textual.widgets import Label, Static

from .actions import ACTIONS
from .dialogs import OnceModal

HELP_FOOTNOTE = (
    "tab / shift+tab move between fields and panes (in the case editor ↑ / ↓ too, page up / "
    "down by a screenful, home / end on a choice to the first and last field); ctrl+p opens "
    "the command palette with every command. In a choice field ← and → step through the "
    "choices and enter or space lists them; space, ← or → flips a switch; on the strip of "
    "pane titles ← and → step through the panes. "
    "A value that cannot be used is marked beside its field and the last valid value stays in "
    "force. Typed values keep their units; results follow the SI/US display setting. "
    "To move an action to other keys, name its id (in brackets above) in keys.toml in the "
    "workbench's config folder, e.g. \"case.add\" = \"ctrl+a\"."
)


def help_content(keymap: Mapping[str, str] | None = None) -> Content:
    """One line per action: keys in force, title, what it does, and its id for ``keys.toml``."""
    width = max(len(action.key_text(keymap)) for action in ACTIONS)
    lines = [Content.assemble((action.key_text(keymap).ljust(width), "bold $text-accent"), "  ",
                              (action.title, "bold"), " — ", action.help,
                              (f"  [{action.id}]", "$text-muted"))
             for action in ACTIONS]
    return Content("\n").join(lines)


class HelpScreen(OnceModal[None]):
    """Keys and commands; escape or f1 closes it."""

    BINDINGS = [Binding("escape,f1,q", "dismiss_none", "Close", id="help.close")]

    def __init__(self, keymap: Mapping[str, str] | None = None) -> None:
        super().__init__()
        self._keymap = keymap

    def compose(self) -> ComposeResult:
        """The key table and a footnote."""
        with VerticalScroll(classes="dialog-box info-box"):
            yield Label("Keys", classes="dialog-title")
            yield Static(help_content(self._keymap), id="help-keys")
            yield Static(Content(HELP_FOOTNOTE), classes="dialog-hint")
            yield Static("escape: close", classes="dialog-hint")
