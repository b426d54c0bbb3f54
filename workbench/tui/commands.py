"""Every key action as a command-palette command, from the one table in :mod:`.actions`, and
the palette that shows them (Textual's, made to close once)."""

from __future__ import annotations

from collections.abc import Callable, Iterator

from textual import on
from textual.app import ScreenStackError
from textual.await_complete import AwaitComplete
from textual.command import CommandPalette, DiscoveryHit, Hit, Hits, Provider
from textual.dom import DOMNode
from textual.message import Message
from textual.widgets import Input, OptionList

from .actions import ACTIONS, Action


class WorkbenchCommands(Provider):
    """Offer each action of :data:`ACTIONS` that the calling screen (or the app) can run."""

    def _available(self) -> Iterator[tuple[Action, Callable[[], None]]]:
        for action in ACTIONS:
            target: DOMNode = self.app if action.scope == "app" else self.screen
            method = action.action.split("(", 1)[0]
            if not hasattr(target, f"action_{method}"):
                continue
            yield action, self._runner(action, target)

    def _runner(self, action: Action, target: DOMNode) -> Callable[[], None]:
        def run() -> None:
            self.app.call_later(self.app.run_action, action.action, target)
        return run

    def _title(self, action: Action) -> str:
        keymap = getattr(self.app, "personal_keymap", None)
        return f"{action.title}  ({action.key_text(keymap)})"

    async def discover(self) -> Hits:
        """All commands, for the palette opened with nothing typed."""
        for action, run in self._available():
            yield DiscoveryHit(self._title(action), run, help=action.help)

    async def search(self, query: str) -> Hits:
        """Commands whose title or help matches what is typed."""
        matcher = self.matcher(query)
        for action, run in self._available():
            title = self._title(action)
            score = max(matcher.match(title), 0.5 * matcher.match(action.help))
            if score > 0:
                yield Hit(score, matcher.highlight(title), run, help=action.help)


class WorkbenchPalette(CommandPalette):
    """Textual's command palette, closing once and only while it is the screen on top.

    A command chosen with enter, then a second enter in the same burst (a pasted line, a slow
    link), made Textual's palette dismiss itself twice: the second pop took the main screen off
    the stack (``ScreenStackError``) and the command ran twice.  Here, once the palette is
    closing, the keys that would choose again are dropped and a second dismissal does nothing.
    """

    _chosen = False

    def dismiss(self, result: object = None) -> AwaitComplete:
        """Close, unless already closing or no longer the screen on top."""
        if self._chosen or not self._on_top():
            return AwaitComplete.nothing()
        self._chosen = True
        return super().dismiss(result)

    def _on_top(self) -> bool:
        try:
            return self.app.screen is self
        except ScreenStackError:
            return False

    @on(Input.Submitted)
    @on(OptionList.OptionSelected)
    def _ignore_once_closing(self, event: Message) -> None:
        """Keep a late enter from choosing a command again (the palette's own handler runs
        after this one unless it is stopped here)."""
        if self._chosen:
            event.stop()
            event.prevent_default()
