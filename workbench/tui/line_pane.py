"""A scrolling pane of styled text lines that paints line by line: the derivation and what-if panes.

Why not a ``VerticalScroll`` of ``Static``s: every ``Static.update`` asks the screen for a new
layout, and in the workbench screen (a form of some hundred widgets beside the pane) that layout
cost 25–35 ms a keystroke, measured with ``workbench bench`` (``settle_ms_p90``).  This pane keeps
its lines, wraps each to the pane's width once and keeps the wrapped line while it stays the same
(most lines stay the same from one keystroke to the next), paints a wrapped line only when it
comes on show, and only sets its virtual size on an update, so an update never asks for a layout.
"""

from __future__ import annotations

from rich.style import Style as RichStyle
from textual.content import Content
from textual.geometry import Size
from textual.scroll_view import ScrollView
from textual.strip import Strip
from textual.style import Style

INDENT = 1
"""Cells left blank before every line."""
MIN_WRAP = 10
"""The narrowest width lines are wrapped to."""


class _WrappedLine:
    """One line wrapped to the pane's width; each part is painted (turned into a strip) the first
    time it comes on show, and kept as last shown (a key redraws the pane, but most of its lines
    are shown where they were)."""

    __slots__ = ("parts", "strips", "shown")

    def __init__(self, parts: list[Content]) -> None:
        self.parts = parts
        self.strips: list[Strip | None] = [None] * len(parts)
        self.shown: list[tuple[tuple[object, ...], Strip] | None] = [None] * len(parts)

    def strip(self, part: int, style: Style) -> Strip:
        """The painted ``part``."""
        painted = self.strips[part]
        if painted is None:
            painted = self.strips[part] = Strip(self.parts[part].render_segments(style))
        return painted


class LinePane(ScrollView, can_focus=True):
    """Shows the lines given to :meth:`show_lines`, wrapped to its width; keeps its scroll place
    when they change.  Before the pane's first layout its width is unknown: the lines are then
    wrapped when the first frame paints them, at the width laid out."""

    DEFAULT_CSS = """
    LinePane {
        scrollbar-size-vertical: 1;
        scrollbar-gutter: stable;  /* the text keeps its width when the scrollbar comes */
    }
    """

    text: Content = Content("")
    """What the pane shows now (its plain text is ``text.plain``)."""

    def __init__(self, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self._lines: list[Content] = []
        self._rows: list[tuple[_WrappedLine, int]] = []
        self._wrapped: dict[tuple[str, tuple[object, ...]], _WrappedLine] = {}
        self._wrapped_width = 0
        self._blank_style: RichStyle | None = None

    @property
    def text_width(self) -> int:
        """The cells a line may take before it wraps."""
        return max(self.scrollable_content_region.width - INDENT, MIN_WRAP)

    @property
    def laid_out(self) -> bool:
        """Whether the pane has a width yet."""
        return bool(self.size.width)

    def show_lines(self, lines: list[Content]) -> None:
        """Show ``lines`` from now on."""
        self._lines = lines
        self.text = Content("\n").join(lines)
        if self.laid_out:
            self._wrap()
        else:  # not laid out yet: at least this many lines (the scrollbar is laid out for them)
            self._wrapped_width = 0
            self.virtual_size = Size(MIN_WRAP, len(lines))

    def line_of(self, plain: str) -> int | None:
        """The first wrapped row whose line reads ``plain``, or None."""
        for index, (wrapped, part) in enumerate(self._rows):
            if part == 0 and wrapped.parts[0].plain.rstrip() == plain:
                return index
        return None

    def _wrap(self) -> None:
        width = self.text_width
        if width != self._wrapped_width:
            self._wrapped.clear()
            self._wrapped_width = width
        rows: list[tuple[_WrappedLine, int]] = []
        kept: dict[tuple[str, tuple[object, ...]], _WrappedLine] = {}
        for line in self._lines:
            key = (line.plain, tuple(line.spans))
            wrapped = self._wrapped.get(key) or kept.get(key) or _WrappedLine(
                [line] if line.cell_length <= width else line.wrap(width))  # most lines fit
            kept[key] = wrapped
            rows.extend((wrapped, part) for part in range(len(wrapped.parts)))
        self._wrapped = kept
        self._rows = rows
        self.virtual_size = Size(width, len(rows))
        self.refresh()

    def on_resize(self) -> None:
        """Wrap again for the new width."""
        if self.text_width != self._wrapped_width:
            self._wrap()

    def notify_style_update(self) -> None:
        """Re-render the styled lines when the theme changes."""
        super().notify_style_update()
        self._blank_style = None
        self._wrapped.clear()
        self._wrapped_width = 0
        if self._lines:
            self.call_later(self._wrap)

    def render_line(self, y: int) -> Strip:
        """One screen line: the wrapped line at the scroll position, indented by one cell."""
        if self.text_width != self._wrapped_width:
            self._wrap()
        scroll_x, scroll_y = self.scroll_offset
        width = self.scrollable_content_region.width
        if self._blank_style is None:  # kept until the styles change
            self._blank_style = self.rich_style
        style = self._blank_style
        index = scroll_y + y
        if index >= len(self._rows):
            return Strip.blank(width, style)
        wrapped, part = self._rows[index]
        place = (scroll_x, index, width, style)
        shown = wrapped.shown[part]
        if shown is not None and shown[0] == place:
            return shown[1]
        line = Strip.join([Strip.blank(INDENT, style), wrapped.strip(part, self.visual_style)])
        painted = line.crop_extend(scroll_x, scroll_x + width, style).apply_offsets(scroll_x, index)
        wrapped.shown[part] = (place, painted)
        return painted
