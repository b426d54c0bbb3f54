"""The titles of the right column's panes on one line; the pane on show is marked.

Textual's ``TabbedContent`` builds a widget per title and a sliding underline, which it moves
under the active title only after its first layout (one frame late) and which takes a second
line.  This strip is one widget on one line, right from the first frame; the panes themselves
sit in a ``ContentSwitcher`` that the screen drives.  The screen's keys (f5, f6, f11) choose a
pane; with the strip in focus ← and → step through the panes, and a click chooses a title.
"""

from __future__ import annotations

from collections.abc import Sequence

from textual import events
from textual.binding import Binding
from textual.content import Content
from textual.message import Message
from textual.reactive import reactive
from textual.widget import Widget

TITLE_GAP = 1


class PaneTabs(Widget, can_focus=True):
    """One title per pane (``(name, title)`` pairs); ``active`` names the pane on show."""

    BINDINGS = [
        Binding("right", "step(1)", "Next pane", show=False),
        Binding("left", "step(-1)", "Previous pane", show=False),
    ]
    COMPONENT_CLASSES = {"pane-tabs--active"}
    DEFAULT_CSS = """
    PaneTabs {
        height: 1;
        width: 1fr;
        color: $text-muted;
        background: $panel;
        & > .pane-tabs--active {
            color: $text;
            background: $surface;
            text-style: bold underline;
        }
        &:focus > .pane-tabs--active {
            color: $block-cursor-foreground;
            background: $block-cursor-background;
        }
    }
    """

    active: reactive[str] = reactive("", init=False)
    """The name of the pane on show."""

    class Chosen(Message):
        """The person chose the pane called ``name`` (by a click or a step)."""

        def __init__(self, tabs: PaneTabs, name: str) -> None:
            super().__init__()
            self.tabs = tabs
            self.name = name

        @property
        def control(self) -> PaneTabs:
            """The strip that was used (for ``@on(..., selector)``)."""
            return self.tabs

    def __init__(self, titles: Sequence[tuple[str, str]], *, active: str,
                 id: str | None = None) -> None:
        super().__init__(id=id)
        self._titles = tuple(titles)
        self.set_reactive(PaneTabs.active, active)

    def _cells(self) -> list[tuple[str, str, int, int]]:
        """(name, label, first column, end column) of each title as drawn."""
        cells, column = [], 0
        for name, title in self._titles:
            label = f" {title} "
            cells.append((name, label, column, column + len(label)))
            column += len(label) + TITLE_GAP
        return cells

    def render(self) -> Content:
        """The titles, the active one marked."""
        active_style = self.get_visual_style("pane-tabs--active")
        parts: list[Content] = []
        for name, label, _, _ in self._cells():
            parts.append(Content.styled(label, active_style) if name == self.active
                         else Content(label))
            parts.append(Content(" " * TITLE_GAP))
        return Content.assemble(*parts)

    def choose(self, name: str) -> None:
        """Show the pane ``name`` as the person asked (announced with :class:`Chosen`)."""
        if name != self.active:
            self.active = name
            self.post_message(self.Chosen(self, name))

    def action_step(self, step: int) -> None:
        """Choose the next (``step`` 1) or previous (-1) pane, round the end."""
        names = [name for name, _ in self._titles]
        index = names.index(self.active) if self.active in names else 0
        self.choose(names[(index + step) % len(names)])

    def on_click(self, event: events.Click) -> None:
        """Choose the title under the pointer."""
        for name, _, start, end in self._cells():
            if start <= event.x < end:
                self.choose(name)
                return
