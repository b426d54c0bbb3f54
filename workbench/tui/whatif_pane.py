"""The what-if pane: how strongly the selected case's life answers to each input, and two plots.

Everything here is drawn from the engine: the sensitivity table from
:func:`~workbench.engine.sensitivity.sensitivity_of` (ISO 281:2007 §9.1 life, ISO 76:2006 s0,
ranked by |ε|, signs kept, the method named where a piece boundary makes the difference
one-sided), the life against a scale on Fr and Fa from
:func:`~workbench.engine.curves.life_curve` (target life and e switch marked) and aISO against κ
from :func:`~workbench.engine.curves.aiso_curve` (ISO 281:2007 §9.3.2), drawn by
:func:`workbench.model.plot_text.plot_lines` in braille and plain marks so they read in monochrome.
The Duty block shows each state's share of the Palmgren–Miner damage as a text bar, for the duty
cycles on the selected case's bearing.  For a bearing whose internal geometry is known, the
reference life against operating clearance shows where slight preload helps and where it hurts
(:func:`workbench.model.inside_request.clearance_curve`, drawn by
:func:`workbench.model.plot_text.clearance_section`).

The pane follows :attr:`WhatIfPane.view` (bound to the screen's) while it is on show: the sweep
and the curves are worked out in a thread worker (a newer revision cancels the older work, and
an answer that arrives for an older revision is dropped), so typing never waits for them.  The
title says "working…" when an answer is slower than :data:`BUSY_AFTER_S`; a quicker one is
simply drawn (marking every answer busy drew the whole pane twice a key, once only to say so).
"""

from __future__ import annotations

import math
from collections.abc import Callable, Sequence

from textual import work
from textual.content import Content
from textual.reactive import var
from textual.timer import Timer

from ..engine.curves import Curve, aiso_curve, life_curve
from ..engine.record import InputError, fmt, percent, signed, with_unit
from ..engine.sensitivity import SensitivityItem, sensitivity_of
from ..model.analysis import DutyOutcome
from ..model.document import Document
from ..model.inside_request import NO_CURVE, ClearanceCurve, InsideRequest, clearance_curve, inside_request
from ..model.plot_text import GUTTER, clearance_section, plot_lines
from ..model.quantities import format_quantity
from ..model.session import CaseResult
from .line_pane import LinePane
from .view import View, view_reactive

SENSITIVITY_TITLE = "Sensitivity of life"
BUSY_MARK = " · working…"
BUSY_AFTER_S = 0.1
"""An answer slower than this gets the busy mark: a person sees no wait below it."""
PLOT_HEIGHT = 8
PLOT_MIN_WIDTH = 16
PLOT_DEFAULT_WIDTH = 24
BAR_WIDTH = 16
BAR_FULL, BAR_EMPTY = "█", "░"
NUMBER_STYLE = "bold"
NOTE_STYLE = "italic $foreground 70%"
ERROR_STYLE = "bold $text-error on $error-muted"
SECTION_STYLE = "bold $text-primary on $boost"
LIFE_PLOT_TITLE = "Life against a scale on Fr and Fa"
AISO_PLOT_TITLE = "aISO against κ"
DUTY_TITLE = "Duty: share of damage by state"
CLEARANCE_TITLE = "Life against operating clearance"
MISSING_CURVE = {
    "life": "No life curve: the case cannot be derived.",
    "aiso": "No aISO curve: the case has no lubrication data (ν or an ISO VG grade with its "
            "temperature).",
}


def _value_text(item: SensitivityItem) -> str:
    return with_unit(fmt(item.value), item.unit)


def sensitivity_lines(items: Sequence[SensitivityItem]) -> list[Content]:
    """The ranked sensitivity items, three or four short lines each (fits a narrow pane)."""
    if not items:
        return [Content("No numeric input to vary.")]
    lives = ", ".join(sorted({item.life for item in items}))
    lines = [Content(f"Life {lives}, largest effect first. ε = d ln L / d ln x; "
                     "x·0.9 / x·1.1: life change with the input 10 % lower / higher.")]
    for rank, item in enumerate(items, start=1):
        lines.append(Content(""))
        lines.append(Content.assemble((f"{rank}. {item.label}", "bold"),
                                      f" = {_value_text(item)}"))
        lines.append(Content.assemble("   ε life ", (signed(item.elasticity), NUMBER_STYLE),
                                      " · ε s0 ", (signed(item.elasticity_s0), NUMBER_STYLE)))
        lines.append(Content.assemble("   x·0.9 ", (percent(item.minus10), NUMBER_STYLE),
                                      " · x·1.1 ", (percent(item.plus10), NUMBER_STYLE)))
        if item.method != "central":
            lines.append(Content.styled(f"   method: {item.method}", NOTE_STYLE))
        if item.note:
            lines.append(Content.styled(f"   · {item.note}", NOTE_STYLE))
    return lines


def share_bar(share: float, width: int = BAR_WIDTH) -> str:
    """A share 0…1 as a bar of ``width`` cells: full cells for the share, light ones for the rest."""
    filled = round(min(max(share, 0.0), 1.0) * width) if math.isfinite(share) else 0
    return BAR_FULL * filled + BAR_EMPTY * (width - filled)


def duties_on(bearing: str, duties: Sequence[DutyOutcome]) -> list[DutyOutcome]:
    """The worked-out duty cycles whose states load the session bearing ``bearing``."""
    return [duty for duty in duties if duty.result is not None and duty.result.bearing == bearing]


def duty_lines(duties: Sequence[DutyOutcome], system: str,
               in_words: Callable[[str], str] = str) -> list[Content]:
    """Each duty cycle's Palmgren–Miner life and each state's share of the damage as a bar; a
    cycle's error with its file key said ``in_words`` (``shaft_editor.session_in_words``)."""
    lines: list[Content] = []
    for duty in duties:
        title = duty.name or duty.key
        if duty.result is None:
            lines.append(Content.styled(f"✘ {title}: {in_words(duty.error or '')}", ERROR_STYLE))
            continue
        result = duty.result
        life_h = (format_quantity(result.life_h, "time", system)  # type: ignore[arg-type]
                  if math.isfinite(result.life_h) else "∞")
        lines.append(Content.styled(title, "bold"))
        lines.append(Content.assemble(
            f"  bearing {result.bearing}: Miner life ", (life_h, NUMBER_STYLE),
            f" ({with_unit(fmt(result.life_mrev), '10⁶ rev')}) at R = {fmt(result.reliability, 3)}"))
        for case_result, damage in zip(result.case_results, result.damage_shares):
            lines.append(Content.assemble(
                "  ", share_bar(damage), (f" {100.0 * damage:5.1f} %", NUMBER_STYLE),
                f"  {case_result.case.name}"))
    return lines


def section_title(title: str, width: int) -> Content:
    """A block's title across the pane's ``width``, on the theme's boost colour."""
    return Content.styled(f" {title}".ljust(width), SECTION_STYLE)


def curve_lines(curve: Curve | None, name: str, width: int) -> list[Content]:
    """A curve drawn ``width`` cells wide beside its axis labels, then its legend (no curve: why)."""
    if curve is None:
        return [Content(MISSING_CURVE[name])]
    return [Content(line) for line in plot_lines(curve, width, PLOT_HEIGHT)]


class WhatIfPane(LinePane):
    """The selected case's sensitivity table, life and aISO plots, and its bearing's duty cycles
    (a :class:`LinePane`, so the answer of a sweep is shown without a new layout)."""

    items: list[SensitivityItem]
    """The sensitivity items shown now (empty when the case cannot be derived)."""

    view: var[View] = view_reactive()
    """The document's revision and the selected case (bound to the screen's)."""

    shown: var[View | None] = var(None)
    """The view whose what-if is on show (None until the first is drawn)."""

    def __init__(self, document: Document, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self.document = document
        self.items = []
        self._curves: dict[str, Curve | None] = {}
        self._clearance = NO_CURVE
        self._blocks: tuple[list[Content], list[Content]] = ([], [])
        self._busy = False
        self._plot_width = 0
        self._asked: View | None = None
        self._busy_timer: Timer | None = None

    def watch_view(self, view: View) -> None:
        """Work the what-if out again while the pane is on show."""
        if self.parent is not None and self.parent.display:
            self._ask()

    def on_show(self) -> None:
        """Catch up with the document when the pane comes on show."""
        self._ask()

    def _ask(self) -> None:
        view = self.view
        if view == self._asked or view.revision < 0:
            return
        self._asked = view
        document = self.document
        result = document.result(view.selected)
        duties = document.analysis.duties
        shown = duties_on(result.case.bearing, duties) if result is not None else []
        if self._busy_timer is None:
            self._busy_timer = self.set_timer(BUSY_AFTER_S, self._show_busy)
        self._work(view, result, document.units, shown, inside_request(document, view.selected))

    def _show_busy(self) -> None:
        """The answer is slow in coming: say that the pane is working on it."""
        self._busy_timer = None
        self._busy = True
        self._redraw()

    @work(thread=True, exclusive=True, group="whatif")
    def _work(self, view: View, result: CaseResult | None, system: str,
              duties: Sequence[DutyOutcome], inside: InsideRequest) -> None:
        """The sweep and the curves, away from the screen's thread."""
        items: list[SensitivityItem] = []
        curves: dict[str, Curve | None] = {}
        error: str | None = None
        if result is None or result.inputs is None or result.derivation is None:
            error = ("No load case selected." if result is None
                     else "The case cannot be derived: see the derivation tab.")
        else:
            try:
                items = sensitivity_of(result.inputs)
                curves["life"] = life_curve(result.inputs, result.life_target_h)
                curves["aiso"] = aiso_curve(result.inputs)
            except InputError as exc:
                error = f"✘ {exc.field}: {exc.message}"
        clearance = clearance_curve(inside)
        self.app.call_from_thread(self._draw, view, items, curves, error, result, system, duties,
                                  clearance)

    def _draw(self, view: View, items: list[SensitivityItem], curves: dict[str, Curve | None],
              error: str | None, result: CaseResult | None, system: str,
              duties: Sequence[DutyOutcome], clearance: ClearanceCurve = NO_CURVE) -> None:
        """Draw what the worker found, unless the document has moved on since."""
        if view != self.view:
            return
        if self._busy_timer is not None:
            self._busy_timer.stop()
            self._busy_timer = None
        self.items, self._curves, self._busy = items, curves, False
        self._clearance = clearance
        if error is not None:
            sensitivity = [Content.styled(error, ERROR_STYLE)]
        else:
            sensitivity = sensitivity_lines(items)
        if duties:
            from .shaft_editor import session_in_words  # loaded on first use, not at start

            duty = duty_lines(duties, system, session_in_words(self.document))
        else:
            where = f" on bearing {result.case.bearing}" if result is not None else ""
            duty = [Content(f"No duty cycle{where}. A duty cycle or a shaft in the session "
                            "makes one.")]
        self._blocks = (sensitivity, duty)
        self.shown = view
        self._redraw()

    def _redraw(self) -> None:
        """The four blocks under their titles, the plots at the pane's width."""
        width = self.text_width
        self._plot_width = plot_width = max(width - GUTTER, PLOT_MIN_WIDTH) \
            if self.laid_out else PLOT_DEFAULT_WIDTH
        sensitivity, duty = self._blocks
        busy = BUSY_MARK if self._busy else ""
        missing_known = self.shown is not None and not self._busy  # "no curve" only once answered
        lines = [section_title(SENSITIVITY_TITLE + busy, width), *sensitivity]
        for name, title in (("life", LIFE_PLOT_TITLE), ("aiso", AISO_PLOT_TITLE)):
            lines += [Content(""), section_title(title, width)]
            if name in self._curves or missing_known:
                lines += curve_lines(self._curves.get(name), name, plot_width)
        lines += [Content(""), section_title(DUTY_TITLE, width), *duty]
        if self._clearance is not NO_CURVE or missing_known:
            plot, words = clearance_section(self._clearance, plot_width, PLOT_HEIGHT)
            lines += [Content(""), section_title(CLEARANCE_TITLE, width),
                      *map(Content, plot), *map(Content, words)]
        self.show_lines(lines)

    def scroll_to_block(self, title: str) -> None:
        """Scroll the block titled ``title`` to the top of the pane."""
        row = self.line_of(f" {title}")
        if row is not None:
            self.scroll_to(y=row, animate=False)

    def on_resize(self) -> None:
        """Draw the blocks again when the width they fit changes."""
        if self.text_width != self._wrapped_width:
            self._redraw()
