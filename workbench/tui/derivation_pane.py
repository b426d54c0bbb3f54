"""The derivation pane: every step of the selected case, as the engine recorded it.

The pane draws a :class:`~workbench.model.session.CaseResult` it is given and computes nothing:
label, formula, the numbers substituted, the result with its unit (in the session's display
system) and the source; the e-branch taken is repeated at the top; warnings carry the theme's
warning colour and a ⚠ mark so they stand out in monochrome too.  Redrawing keeps the scroll place.
"""

from __future__ import annotations

import math

from textual.content import Content
from textual.reactive import var

from ..engine.record import Derivation, Step, fmt, with_unit
from ..model.fields import FIELD_BY_NAME
from ..model.quantities import ENGINE_UNIT_QUANTITY, format_quantity, step_number_writer
from ..model.session import CaseResult
from ..model.document import Document, input_field
from .line_pane import LinePane
from .view import View, view_reactive

SYMBOL_STYLE = "bold $accent"
RESULT_STYLE = "bold"
SOURCE_STYLE = "italic $foreground 60%"
WARNING_STYLE = "bold $text-warning on $warning-muted"
ERROR_STYLE = "bold $text-error on $error-muted"
BRANCH_STYLE = "bold $text-primary"


def step_result_text(step: Step, system: str) -> str:
    """A step's value with its unit, in ``system`` where the unit has a display quantity."""
    quantity = ENGINE_UNIT_QUANTITY.get(step.unit)
    if quantity is not None and math.isfinite(step.value):
        return format_quantity(step.value, quantity, system)  # type: ignore[arg-type]
    return with_unit(step.value_text, step.unit)


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
    return lines + steps_lines(result.derivation, system)


def steps_lines(derivation: Derivation, system: str) -> list[Content]:
    """Every step of ``derivation``, a blank line before each, then its notes."""
    lines: list[Content] = []
    for step in derivation.steps:
        lines.append(Content(""))
        lines.extend(step_content(step, system))
    for note in derivation.notes:
        lines.append(Content.styled("· " + note, "italic"))
    return lines


class DerivationPane(LinePane):
    """A scrolling view of one case's derivation; keeps its scroll place when redrawn (a
    :class:`LinePane`, so a redraw never asks the screen for a new layout)."""

    view: var[View] = view_reactive()
    """The document's revision and the selected case (bound to the screen's)."""

    def __init__(self, document: Document, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self.document = document
        self._shown: tuple[View, str] | None = None

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
        self.show_lines(derivation_lines(result, system))
