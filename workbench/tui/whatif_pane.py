"""The what-if pane: how strongly the selected case's life answers to each input, and two plots.

Everything here is drawn from the engine: the sensitivity table from
:func:`~workbench.engine.sensitivity.sensitivity_of` (ISO 281:2007 §9.1 life, ISO 76:2006 s0,
ranked by |ε|, signs kept, the method named where a piece boundary makes the difference
one-sided), the life against a scale on Fr and Fa from
:func:`~workbench.engine.curves.life_curve` (target life and e switch marked) and aISO against κ
from :func:`~workbench.engine.curves.aiso_curve` (ISO 281:2007 §9.3.2), drawn by
:func:`workbench.report.plot_text.plot_lines` in braille and plain marks so they read in monochrome.
The Duty block shows each state's share of the Palmgren–Miner damage as a text bar, for the duty
cycles on the selected case's bearing.  The screen hands the pane what to draw with :meth:`show`.
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from textual.app import ComposeResult
from textual.containers import VerticalScroll
from textual.content import Content
from textual.widgets import Label, Static

from ..engine.curves import Curve, aiso_curve, life_curve
from ..engine.record import InputError, fmt
from ..engine.sensitivity import SensitivityItem, sensitivity_of
from ..model.analysis import DutyOutcome
from ..model.quantities import format_quantity
from ..model.session import CaseResult
from ..report.plot_text import plot_lines
from ..report.contents import percent, signed

PLOT_HEIGHT = 8
PLOT_GUTTER = 10  # plot_lines puts the y labels and the axis in the first ten columns
PLOT_MIN_WIDTH = 16
PLOT_DEFAULT_WIDTH = 24
BAR_WIDTH = 16
BAR_FULL, BAR_EMPTY = "█", "░"
NUMBER_STYLE = "bold"
NOTE_STYLE = "italic $foreground 70%"
ERROR_STYLE = "bold $text-error on $error-muted"


def _value_text(item: SensitivityItem) -> str:
    return f"{fmt(item.value)} {item.unit}".rstrip()


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


def duty_lines(duties: Sequence[DutyOutcome], system: str) -> list[Content]:
    """Each duty cycle's Palmgren–Miner life and each state's share of the damage as a bar."""
    lines: list[Content] = []
    for duty in duties:
        title = duty.name or duty.key
        if duty.result is None:
            lines.append(Content.styled(f"✘ {title}: {duty.error}", ERROR_STYLE))
            continue
        result = duty.result
        life_h = (format_quantity(result.life_h, "time", system)  # type: ignore[arg-type]
                  if math.isfinite(result.life_h) else "∞")
        lines.append(Content.styled(title, "bold"))
        lines.append(Content.assemble(
            f"  bearing {result.bearing}: Miner life ", (life_h, NUMBER_STYLE),
            f" ({fmt(result.life_mrev)} 10⁶ rev) at R = {fmt(result.reliability, 3)}"))
        for case_result, damage in zip(result.case_results, result.damage_shares):
            lines.append(Content.assemble(
                "  ", share_bar(damage), (f" {100.0 * damage:5.1f} %", NUMBER_STYLE),
                f"  {case_result.case.name}"))
    return lines


class WhatIfPane(VerticalScroll):
    """The selected case's sensitivity table, life and aISO plots, and its bearing's duty cycles."""

    DEFAULT_CSS = """
    WhatIfPane {
        scrollbar-size-vertical: 1;
        padding: 0 0 0 1;
    }
    WhatIfPane .plot {
        text-wrap: nowrap;
        text-overflow: clip;
    }
    WhatIfPane .group-title {
        width: 1fr;
        margin-top: 1;
        padding: 0 1;
        background: $boost;
        color: $text-primary;
        text-style: bold;
    }
    """

    items: list[SensitivityItem]
    """The sensitivity items shown now (empty when the case cannot be derived)."""

    def __init__(self, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self.items = []
        self._curves: dict[str, Curve | None] = {}
        self._plot_width = 0

    def compose(self) -> ComposeResult:
        """The four blocks, each under its title."""
        yield Label("Sensitivity of life", classes="group-title")
        yield Static(id="whatif-sensitivity")
        yield Label("Life against a scale on Fr and Fa", classes="group-title")
        yield Static(id="whatif-life-plot", classes="plot")
        yield Static(id="whatif-life-legend")
        yield Label("aISO against κ", classes="group-title")
        yield Static(id="whatif-aiso-plot", classes="plot")
        yield Static(id="whatif-aiso-legend")
        yield Label("Duty: share of damage by state", classes="group-title")
        yield Static(id="whatif-duty")

    @property
    def text(self) -> str:
        """What the pane shows now, as plain text."""
        return "\n".join(str(widget.render()) for widget in self.query(Static)
                         if not isinstance(widget, Label))

    def show(self, result: CaseResult | None, system: str, duties: Sequence[DutyOutcome]) -> None:
        """Work out and draw the what-if of ``result``, with the duty cycles on its bearing."""
        self.items = []
        self._curves = {}
        if result is None or result.inputs is None or result.derivation is None:
            reason = ("No load case selected." if result is None
                      else "The case cannot be derived: see the derivation tab.")
            self._static("whatif-sensitivity").update(Content.styled(reason, ERROR_STYLE))
        else:
            inputs = result.inputs
            try:
                self.items = sensitivity_of(inputs)
                self._curves["life"] = life_curve(inputs, result.life_target_h)
                self._curves["aiso"] = aiso_curve(inputs)
            except InputError as exc:
                self._static("whatif-sensitivity").update(
                    Content.styled(f"✘ {exc.field}: {exc.message}", ERROR_STYLE))
            else:
                self._static("whatif-sensitivity").update(
                    Content("\n").join(sensitivity_lines(self.items)))
        self._draw_plots()
        shown = duties_on(result.case.bearing, duties) if result is not None else []
        duty = self._static("whatif-duty")
        if shown:
            duty.update(Content("\n").join(duty_lines(shown, system)))
        else:
            where = f" on bearing {result.case.bearing}" if result is not None else ""
            duty.update(Content(f"No duty cycle{where}. A [[duty_cycles]] table or a shaft in "
                                "the session file makes one."))

    def _static(self, name: str) -> Static:
        return self.query_one(f"#{name}", Static)

    def _width(self) -> int:
        width = self.scrollable_content_region.width - PLOT_GUTTER - 1
        return max(width, PLOT_MIN_WIDTH) if width > 0 else PLOT_DEFAULT_WIDTH

    def _draw_plots(self) -> None:
        """Draw both curves at the pane's width (no curve: say why)."""
        self._plot_width = width = self._width()
        missing = {"life": "No life curve: the case cannot be derived.",
                   "aiso": "No aISO curve: the case has no lubrication data (ν or an ISO VG "
                           "grade with its temperature)."}
        for name in ("life", "aiso"):
            curve = self._curves.get(name)
            plot, legend = self._static(f"whatif-{name}-plot"), self._static(f"whatif-{name}-legend")
            if curve is None:
                plot.update(Content(missing[name]))
                legend.update("")
                continue
            lines = plot_lines(curve, width, PLOT_HEIGHT)
            plot.update(Content("\n".join(lines[:-1])))
            legend.update(Content(lines[-1]))

    def on_resize(self) -> None:
        """Draw the plots again when the width they fit changes."""
        if self._curves and self._width() != self._plot_width:
            self._draw_plots()
