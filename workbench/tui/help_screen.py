"""The help screen: every key, what it does, from the one table of actions."""

from __future__ import annotations

from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import VerticalScroll
from textual.content import Content
from textual.widgets import Label, Static

from .actions import ACTIONS
from .dialogs import OnceModal

HELP_FOOTNOTE = (
    "tab / shift+tab move between fields; ctrl+p opens the command palette with every command. "
    "A value that cannot be used is marked beside its field and the last valid value stays in "
    "force. Typed values keep their units; results follow the SI/US display setting."
)


def help_content() -> Content:
    """One line per action: keys, title, and what it does."""
    width = max(len(action.key_text) for action in ACTIONS)
    lines = [Content.assemble((action.key_text.ljust(width), "bold $text-accent"), "  ",
                              (action.title, "bold"), " — ", action.help)
             for action in ACTIONS]
    return Content("\n").join(lines)


class HelpScreen(OnceModal[None]):
    """Keys and commands; escape or f1 closes it."""

    BINDINGS = [Binding("escape,f1,q", "dismiss_none", "Close", id="help.close")]

    def compose(self) -> ComposeResult:
        """The key table and a footnote."""
        with VerticalScroll(classes="dialog-box info-box"):
            yield Label("Keys", classes="dialog-title")
            yield Static(help_content(), id="help-keys")
            yield Static(Content(HELP_FOOTNOTE), classes="dialog-hint")
            yield Static("escape: close", classes="dialog-hint")
