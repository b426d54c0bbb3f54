"""The key line at the foot of the screen: every key on show, drawn as one widget.

Textual's ``Footer`` builds a widget per key (about forty for the workbench's table) and
rebuilds them all whenever the active bindings are refreshed, on every focus change; styling
those widgets was a noticeable part of start-up and of each tab press.  This line draws the
same keys as one piece of text, redraws only when the keys on show change, and keeps the
footer's habits: keys of one group share their words, a disabled key is dim, the palette key
sits at the right end, a click on a key presses it and the mouse wheel scrolls the line.
"""

from __future__ import annotations

from collections.abc import Iterator
from itertools import groupby
from typing import NamedTuple

from textual import events
from textual.binding import Binding
from textual.content import Content
from textual.reactive import reactive
from textual.screen import Screen
from textual.style import Style
from textual.widget import Widget

SCROLL_STEP = 8


class KeyShown(NamedTuple):
    """One key on the line: what it presses and how it reads."""

    key: str
    display: str
    description: str
    enabled: bool


class KeyGroupShown(NamedTuple):
    """Keys of one binding group, read together (``alt+↑ alt+↓ Move case``), or one key."""

    keys: tuple[KeyShown, ...]
    description: str


class KeyFooter(Widget, can_focus=False):
    """The keys of the active bindings, one line, the palette key at the right end."""

    ALLOW_SELECT = False
    COMPONENT_CLASSES = {"key-footer--key", "key-footer--description"}
    DEFAULT_CSS = """
    KeyFooter {
        dock: bottom;
        height: 1;
        width: 1fr;
        color: $footer-foreground;
        background: $footer-background;
        .key-footer--key {
            color: $footer-key-foreground;
            background: $footer-key-background;
            text-style: bold;
        }
        .key-footer--description {
            color: $footer-description-foreground;
            background: $footer-description-background;
        }
    }
    """

    scroll_offset_x: reactive[int] = reactive(0)
    """How many cells of the key list are scrolled off to the left."""

    def __init__(self, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self._groups: tuple[KeyGroupShown, ...] = ()
        self._palette: KeyShown | None = None
        self._hits: list[tuple[int, int, str]] = []

    def on_mount(self) -> None:
        """Follow the screen's bindings (they change with the focus)."""
        self.screen.bindings_updated_signal.subscribe(self, self.bindings_changed)
        self.bindings_changed(self.screen)

    def on_unmount(self) -> None:
        """Stop following the screen's bindings."""
        self.screen.bindings_updated_signal.unsubscribe(self)

    def bindings_changed(self, screen: Screen[object]) -> None:
        """Redraw when the keys on show, their words or their enabled state differ."""
        groups, palette = self._keys_on_show(screen)
        if (groups, palette) != (self._groups, self._palette):
            self._groups, self._palette = groups, palette
            self.refresh()

    def _keys_on_show(self, screen: Screen[object]) -> tuple[tuple[KeyGroupShown, ...],
                                                              KeyShown | None]:
        """The groups of keys to draw, first binding of each action only (as Textual's footer)."""
        app = self.app
        first_of_action: dict[str, tuple[Binding, bool]] = {}
        palette: KeyShown | None = None
        for key, (_, binding, enabled, _) in screen.active_bindings.items():
            if key == app.COMMAND_PALETTE_BINDING and app.ENABLE_COMMAND_PALETTE:
                palette = KeyShown(binding.key, app.get_key_display(binding),
                                   binding.description, enabled)
                continue
            if binding.show:
                first_of_action.setdefault(binding.action, (binding, enabled))
        groups: list[KeyGroupShown] = []
        for group, members in groupby(first_of_action.values(), lambda item: item[0].group):
            shown = tuple(KeyShown(binding.key, app.get_key_display(binding),
                                   binding.description, enabled) for binding, enabled in members)
            if group is not None and len(shown) > 1:
                groups.append(KeyGroupShown(shown, group.description))
            else:
                groups.extend(KeyGroupShown((key,), key.description) for key in shown)
        return tuple(groups), palette

    def _pieces(self) -> Iterator[tuple[str, str | None, str, int]]:
        """(text, key pressed by clicking it or None, component, group index) in drawing
        order."""
        for index, group in enumerate(self._groups):
            if index:
                yield "  ", None, "", index
            for position, key in enumerate(group.keys):
                if position:
                    yield " ", None, "", index
                yield key.display, key.key if key.enabled else None, \
                    "key" if key.enabled else "dim-key", index
            yield " " + group.description, group.keys[0].key if len(group.keys) == 1 else None, \
                "description", index

    def _styles(self) -> dict[str, Style]:
        key = self.get_visual_style("key-footer--key")
        words = self.get_visual_style("key-footer--description")
        return {"key": key, "dim-key": key + Style(dim=True), "description": words, "": Style()}

    def render(self) -> Content:
        """The keys from the scroll offset on that fit whole, the palette key at the end."""
        styles = self._styles()
        width = self.size.width
        palette = Content()
        if self._palette is not None:
            palette = Content.assemble("▏", (self._palette.display, styles["key"]),
                                       (" " + self._palette.description, styles["description"]))
        room = max(0, width - palette.cell_length - (1 if palette.cell_length else 0))
        parts: list[tuple[str, Style]] = []
        self._hits = []
        x = -self.scroll_offset_x
        starts: dict[int, int] = {}
        ends: dict[int, int] = {}
        for text, _, _, group in self._pieces():
            starts.setdefault(group, x)
            x += len(text)
            ends[group] = x
        x = -self.scroll_offset_x
        for text, key, component, group in self._pieces():
            start, x = x, x + len(text)
            if ends[group] > room:
                break  # a key is shown whole or not at all
            if starts[group] < 0:
                continue
            visible = text[max(0, -start):max(0, room - start)]
            parts.append((visible, styles[component]))
            if key is not None:
                self._hits.append((max(0, start), min(room, x), key))
        line = Content.assemble(*parts)
        line = line.pad_right(max(0, room - line.cell_length))
        if self._palette is not None:
            self._hits.append((width - palette.cell_length, width, self._palette.key))
            line = Content.assemble(line, " ", palette)
        return line

    @property
    def text(self) -> str:
        """The whole key list as plain text (not cut to the width)."""
        return "".join(piece[0] for piece in self._pieces())

    def on_click(self, event: events.Click) -> None:
        """Press the key under the pointer."""
        for start, end, key in self._hits:
            if start <= event.x < end:
                self.app.simulate_key(key)
                return

    def on_mouse_scroll_down(self, event: events.MouseScrollDown) -> None:
        """Scroll the key list left, to show the keys cut off at the right."""
        longest = max(0, len(self.text) - self.size.width // 2)
        self.scroll_offset_x = min(longest, self.scroll_offset_x + SCROLL_STEP)
        event.stop()

    def on_mouse_scroll_up(self, event: events.MouseScrollUp) -> None:
        """Scroll the key list back to its start."""
        self.scroll_offset_x = max(0, self.scroll_offset_x - SCROLL_STEP)
        event.stop()
