"""``PaneLazy``: Textual's ``Lazy`` for the panes that start hidden, safe when the screen closes
first.

Why not ``Lazy`` itself: it mounts its widget after the first refresh without asking whether
its parent is still mounted, so ctrl+q pressed as the screen came up raised ``MountError`` while
the app shut down, and the app exited with status 1 after a clean quit (found by
``tests/tui/test_saving_never_loses_work.py``).
"""

from __future__ import annotations

from textual.lazy import Lazy
from textual.widget import Widget


class PaneLazy(Lazy):
    """A ``Lazy`` whose widget is mounted after the first refresh, unless its parent has been
    unmounted by then (the screen closed)."""

    async def mount_composed_widgets(self, widgets: list[Widget]) -> None:
        """Mount the wrapped widget after a refresh, in place of this one, if still wanted."""
        parent = self.parent
        if not isinstance(parent, Widget):
            return

        async def mount() -> None:
            if not (parent.is_mounted and parent.is_attached):
                return  # the screen closed before the pane was needed
            await parent.mount(self._replace_widget, after=self)
            await self.remove()

        self.call_after_refresh(mount)
