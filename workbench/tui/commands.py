"""Every key action as a command-palette command, from the one table in :mod:`.actions`."""

from __future__ import annotations

from collections.abc import Callable, Iterator

from textual.command import DiscoveryHit, Hit, Hits, Provider
from textual.dom import DOMNode

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
