"""The top line: the session's title and where it is saved, as the app's title and sub-title.

One widget (Textual's ``Header`` is four: icon, title, clock and the bar).
"""

from __future__ import annotations

from textual.content import Content
from textual.widget import Widget


class TitleBar(Widget):
    """``App.title`` and ``App.sub_title`` on one centred line, redrawn when either changes."""

    DEFAULT_CSS = """
    TitleBar {
        dock: top;
        height: 1;
        width: 1fr;
        background: $panel;
        color: $foreground;
        content-align: center middle;
    }
    """

    def on_mount(self) -> None:
        """Follow the app's title and sub-title."""
        self.watch(self.app, "title", self._changed, init=False)
        self.watch(self.app, "sub_title", self._changed, init=False)

    def _changed(self) -> None:
        self.refresh()

    def render(self) -> Content:
        """The title in bold, then the sub-title dimmed; a long title is cut (with an
        ellipsis) before the sub-title is."""
        width = self.size.width
        title = Content.styled(self.app.title, "bold")
        if not self.app.sub_title:
            return title.truncate(width, ellipsis=True)
        after = Content.assemble(" — ", (self.app.sub_title, "$text-muted"))
        room = max(width - after.cell_length, width // 2)
        return Content.assemble(title.truncate(room, ellipsis=True), after).truncate(
            width, ellipsis=True)
