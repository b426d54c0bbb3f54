"""The derivation pane: every step of the selected case, as the engine recorded it.

The pane draws a :class:`~workbench.model.session.CaseResult` it is given and computes nothing:
label, formula, the numbers substituted, the result with its unit (in the session's display
system) and the source; the e-branch taken is repeated at the top; warnings carry the theme's
warning colour and a ⚠ mark so they stand out in monochrome too.  Redrawing keeps the scroll place.
"""

from __future__ import annotations

import math

from rich.style import Style as RichStyle
from textual.content import Content
from textual.geometry import Size
from textual.reactive import var
from textual.scroll_view import ScrollView
from textual.strip import Strip
from textual.style import Style

from ..engine.record import Step, fmt
from ..model.fields import FIELD_BY_NAME
from ..model.quantities import ENGINE_UNIT_QUANTITY, format_quantity, step_number_writer
from ..model.session import CaseResult
from ..model.document import Document, input_field
from .view import View, view_reactive

# Engine units that have a display quantity (the rest are shown as the engine writes them).
SYMBOL_STYLE = "bold $accent"
RESULT_STYLE = "bold"
SOURCE_STYLE = "italic $foreground 60%"
WARNING_STYLE = "bold $text-warning on $warning-muted"
ERROR_STYLE = "bold $text-error on $error-muted"
BRANCH_STYLE = "bold $text-primary"
INDENT = 1
MIN_WRAP = 10


def step_result_text(step: Step, system: str) -> str:
    """A step's value with its unit, in ``system`` where the unit has a display quantity."""
    quantity = ENGINE_UNIT_QUANTITY.get(step.unit)
    if quantity is not None and math.isfinite(step.value):
        return format_quantity(step.value, quantity, system)  # type: ignore[arg-type]
    return f"{step.value_text} {step.unit}".rstrip()


def branch_text(result: CaseResult) -> str | None:
    """The e-branch taken ("Fa/Fr > e"), from the ratio step's note, or None."""
    if result.derivation is None:
        return None
    for step in result.derivation.steps:
        if step.key == "ratio" and step.note:
            return step.note.removeprefix("branch: ")
    return None


def _summary(result: CaseResult, system: str) -> list[Content]:
    values = result.derivation.results if result.derivation else {}
    lines = [Content.styled(f"Load case {result.case.name}", "bold")]
    branch = branch_text(result)
    if branch:
        lines.append(Content.assemble("Branch taken: ", (branch, BRANCH_STYLE)))
    if values:
        lnm = values.get("Lnm", math.nan)
        lnm_text = format_quantity(lnm, "time", system) if math.isfinite(lnm) else "undefined"  # type: ignore[arg-type]
        lines.append(Content.assemble(
            "P = ", (format_quantity(values["P"], "force", system), RESULT_STYLE),  # type: ignore[arg-type]
            "   s0 = ", (fmt(values["s0"], 3), RESULT_STYLE)))
        lines.append(Content.assemble("Lnm = ", (lnm_text, RESULT_STYLE)))
    if result.static_only:
        lines.append(Content.styled("Static check only: judged on s0; the life is shown for "
                                    "completeness", "italic"))
    elif result.life_target_h is None and result.derivation is not None:
        lines.append(Content.styled("No life target: set one with alt+i for a life verdict",
                                    "italic"))
    if result.life_target_h is not None and result.meets_life is not None:
        word = "meets" if result.meets_life else "misses"
        lines.append(Content.assemble(
            (f"Lnm {word} the life target {fmt(result.life_target_h)} h",
             "$text-success" if result.meets_life else ERROR_STYLE)))
    if result.meets_s0 is not None and result.derivation is not None:
        word = "meets" if result.meets_s0 else "misses"
        minimum = result.derivation.results["s0_min"]
        lines.append(Content.assemble(
            (f"s0 {word} the minimum {fmt(minimum, 3)}",
             "$text-success" if result.meets_s0 else ERROR_STYLE)))
    if result.derivation is not None and result.derivation.warnings:
        count = len(result.derivation.warnings)
        lines.append(Content.styled(f"⚠ {count} warning{'s' if count > 1 else ''} below",
                                    WARNING_STYLE))
    return lines


def step_content(step: Step, system: str) -> list[Content]:
    """The display lines of one derivation step; the shafts view shows its steps with it too."""
    lines = [Content.assemble((step.symbol, SYMBOL_STYLE), "  ", (step.label, "bold"))]
    substituted = step.substituted_in(step_number_writer(system))  # type: ignore[arg-type]
    if step.formula and step.formula not in (substituted, "given"):
        lines.append(Content("  " + step.formula))
    if substituted and substituted != step.value_text:
        lines.append(Content("  = " + substituted))
    lines.append(Content.assemble("  = ", (step_result_text(step, system), RESULT_STYLE)))
    lines.append(Content.styled("  " + step.source, SOURCE_STYLE))
    if step.warning:
        lines.append(Content.styled("  ⚠ " + step.warning, WARNING_STYLE))
    if step.note:
        if step.key == "ratio":
            lines.append(Content.assemble("  ▶ ", (step.note, BRANCH_STYLE)))
        else:
            lines.append(Content.styled("  · " + step.note, "italic"))
    return lines


def derivation_lines(result: CaseResult | None, system: str) -> list[Content]:
    """The pane line by line: summary, then every step, or the reason there is none."""
    if result is None:
        return [Content("No load case selected.")]
    lines = _summary(result, system)
    if result.derivation is None:
        field = input_field(result.error_field)
        where = FIELD_BY_NAME[field].label if field in FIELD_BY_NAME else (field or "case")
        lines.append(Content.styled(f"✘ Cannot derive: {where}: {result.error}", ERROR_STYLE))
        for name, message in result.field_errors.items():
            if name != result.error_field:
                label = FIELD_BY_NAME[name].label if name in FIELD_BY_NAME else name
                lines.append(Content.styled(f"✘ {label}: {message}", ERROR_STYLE))
        return lines
    for step in result.derivation.steps:
        lines.append(Content(""))
        lines.extend(step_content(step, system))
    for note in result.derivation.notes:
        lines.append(Content.styled("· " + note, "italic"))
    return lines


class _WrappedLine:
    """One line of the derivation wrapped to the pane's width; each part is painted (turned
    into a strip) the first time it comes on show."""

    __slots__ = ("parts", "strips")

    def __init__(self, parts: list[Content]) -> None:
        self.parts = parts
        self.strips: list[Strip | None] = [None] * len(parts)

    def strip(self, part: int, style: Style) -> Strip:
        """The painted ``part``."""
        painted = self.strips[part]
        if painted is None:
            painted = self.strips[part] = Strip(self.parts[part].render_segments(style))
        return painted


class DerivationPane(ScrollView, can_focus=True):
    """A scrolling view of one case's derivation; keeps its scroll place when redrawn.

    Each line is wrapped to the pane's width once and kept (most lines stay the same from one
    keystroke to the next), a wrapped line is painted only when it comes on show, and the pane
    paints line by line, so a redraw never asks the screen for a new layout.  Before the pane's
    first layout its width is unknown: the lines are then wrapped when the first frame paints
    them, at the width laid out.
    """

    DEFAULT_CSS = """
    DerivationPane {
        scrollbar-size-vertical: 1;
        scrollbar-gutter: stable;  /* the text keeps its width when the scrollbar comes */
    }
    """

    text: Content = Content("")
    """What the pane shows now (its plain text is ``text.plain``)."""

    view: var[View] = view_reactive()
    """The document's revision and the selected case (bound to the screen's)."""

    def __init__(self, document: Document, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self.document = document
        self._shown: tuple[View, str] | None = None
        self._lines: list[Content] = []
        self._rows: list[tuple[_WrappedLine, int]] = []
        self._wrapped: dict[tuple[str, tuple[object, ...]], _WrappedLine] = {}
        self._wrapped_width = 0
        self._blank_style: RichStyle | None = None

    def watch_view(self, view: View) -> None:
        """Show the selected case as it stands now (derived with its steps only while the pane
        is on show; it catches up when it comes on show)."""
        if self.display and self.is_attached and self.parent is not None and \
                self.parent.display:
            self._show_selected()

    def on_show(self) -> None:
        """Catch up with the document when the pane comes on show."""
        self._show_selected()

    def _show_selected(self) -> None:
        document = self.document
        key = (self.view, document.units)
        if key != self._shown:
            self._shown = key
            self.show(document.with_steps(self.view.selected), document.units)

    def show(self, result: CaseResult | None, system: str) -> None:
        """Redraw for ``result`` in the display ``system``."""
        self._lines = derivation_lines(result, system)
        self.text = Content("\n").join(self._lines)
        if self.size.width:
            self._wrap()
        else:  # not laid out yet: at least this many lines (the scrollbar is laid out for them)
            self._wrapped_width = 0
            self.virtual_size = Size(MIN_WRAP, len(self._lines))

    def _wrap(self) -> None:
        width = self._text_width
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

    @property
    def _text_width(self) -> int:
        return max(self.scrollable_content_region.width - INDENT, MIN_WRAP)

    def on_resize(self) -> None:
        """Wrap again for the new width."""
        if self._text_width != self._wrapped_width:
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
        if self._text_width != self._wrapped_width:
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
        line = Strip.join([Strip.blank(INDENT, style), wrapped.strip(part, self.visual_style)])
        return line.crop_extend(scroll_x, scroll_x + width, style).apply_offsets(scroll_x, index)
