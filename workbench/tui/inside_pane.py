"""The inside pane: the selected case's bearing seen from inside, element by element.

For a bearing whose internal geometry is known (rated from geometry, or given in the session's
``[bearings.geometry]`` table), the quasi-static ring-displacement equilibrium of
:func:`workbench.model.internal_form.internal_for_case` (Hertz; Stribeck and Sjövall's load
distribution; Jones; Harris and Kotzalas; the reference rating life after ISO/TS 16281) gives
each rolling element's load; :mod:`workbench.model.inside_request` asks for it and words a
refusal.  The pane draws the loads around the ring in digits (tenths of the largest load, so it
reads in monochrome; :func:`workbench.model.plot_text.ring_art`), lists them by azimuth with a
bar each, gives the numbers (Qmax, the load zone, the ring displacements, the largest contact
pressures against ISO 76's 4 200 / 4 000 MPa, the stiffness, L10r beside the ISO 281 L10) and
then every step of the same :class:`~workbench.engine.record.Derivation` record the derivation
pane reads.

It follows :attr:`view` (bound to the screen's) while it is on show, as the other panes do; the
analysis runs in a thread worker (a newer view cancels the older work, and an answer for an
older view is dropped).  Without a geometry it says how to give one; where no ring position
balances the loads it says so with the engine's cause.
"""

from __future__ import annotations

from textual import work
from textual.content import Content

from ..engine.internal.analysis import InternalResult
from ..engine.internal.distribution import ROLLER_KINDS
from ..engine.internal.hertz import STATIC_REFERENCE_PRESSURE_BALL, STATIC_REFERENCE_PRESSURE_ROLLER
from ..engine.record import fmt, with_unit
from ..model.document import Document
from ..model.inside_request import InsideOutcome, InsideRequest, input_label, inside_request, work_out
from ..model.plot_text import NO_CONTACT, load_bar, ring_art
from ..model.quantities import format_quantity
from .derivation_pane import (ERROR_STYLE, RESULT_STYLE, SOURCE_STYLE, WARNING_STYLE, DerivationPane,
                              steps_lines)
from .view import View

TITLE_STYLE = "bold $text-primary"
RING_STYLE = "bold $accent"
IDLE_STYLE = "$foreground 50%"
BUSY_MARK = " · working…"
GEOMETRY_HELP = ("Give it one: alt+c, then ctrl+g rates a special bearing from its geometry "
                 "(Z, Dw, Dpw …) and adopting it keeps that geometry here; or add a "
                 "[bearings.geometry] table to the session file (elements, dw, dpw, and lwe for "
                 "rollers; schema = 2). Clearance and preload are bearing fields, tilt and "
                 "moment case fields.")


def _styled_ring(line: str) -> Content:
    parts = [(character, IDLE_STYLE if character == NO_CONTACT else
              RING_STYLE if character.isdigit() else "") for character in line]
    return Content.assemble(*parts)


def _row_title(name: str) -> str:
    return f"row {name}" if name else "the row"


def _number(label: str, value: str, note: str = "") -> Content:
    return Content.assemble(f"  {label} = ", (value, RESULT_STYLE), note)


def _results(outcome: InsideOutcome, system: str) -> list[Content]:
    result = outcome.result
    assert result is not None
    r = result.results
    roller = result.inputs.kind in ROLLER_KINDS
    limit = STATIC_REFERENCE_PRESSURE_ROLLER if roller else STATIC_REFERENCE_PRESSURE_BALL
    force = lambda value: format_quantity(value, "force", system)  # noqa: E731
    length = lambda value: format_quantity(value, "length", system)  # noqa: E731
    lines = [Content.styled("Results", TITLE_STYLE),
             _number("Qmax", force(r["Q_max"]), f" · {sum(e.load > 0.0 for e in result.elements)} "
                                                f"of {len(result.elements)} elements loaded"),
             _number("ε", fmt(r["epsilon"], 3), f" · load zone ψl = ±{fmt(r['psi_l'], 3)}°"),
             _number("δr", length(r["delta_r"]), f" · δa = {length(r['delta_a'])}"),
             _number("θ", f"{fmt(1000.0 * r['theta'], 3)} mrad",
                     f" · M = {format_quantity(r['M'] / 1000.0, 'torque', system)}")]
    for side in ("inner", "outer"):
        pressure = r[f"p_max_{side}"]
        lines.append(_number(f"pmax {side}", f"{fmt(pressure, 4)} MPa",
                             f" · {fmt(100.0 * pressure / limit, 3)} % of ISO 76's "
                             f"{fmt(limit, 4)} MPa"))
    lines.append(_number("kr", f"{fmt(r['k_radial'] / 1000.0, 4)} N/µm",
                         f" · ka = {fmt(r['k_axial'] / 1000.0, 4)} N/µm"))
    lines.append(_number("kθ", f"{fmt(r['k_tilt'] / 1.0e6, 4)} N·m/mrad"))
    lines.append(_number("L10r", with_unit(fmt(r["L10r"], 4), "10⁶ rev"),
                         f" · ISO 281 L10 = {with_unit(fmt(r['L10_iso281'], 4), '10⁶ rev')}"))
    if "L10rh" in r:
        hours = format_quantity(r["L10rh"], "time", system)
        lines.append(_number("L10rh", hours))
    if "Lnmr" in r:
        lines.append(_number("Lnmr", with_unit(fmt(r["Lnmr"], 4), "10⁶ rev"),
                             f" · aISO = {fmt(r['aISO'], 3)}"))
    return lines


def _rings(result: InternalResult) -> list[Content]:
    q_max = result.results["Q_max"]
    lines = [Content.styled("Element loads around the ring", TITLE_STYLE),
             Content.styled("  digits: tenths of Qmax (9 the largest) · dot: no contact · "
                            "ψ = 0 at the bottom, where Fr acts", SOURCE_STYLE)]
    for row in result.rows:
        elements = [e for e in result.elements if e.row == row.name]
        if len(result.rows) > 1:
            lines.append(Content(f"  {_row_title(row.name)}: Fr = {fmt(row.radial_load, 4)} N, "
                                 f"Fa = {fmt(row.axial_load, 4)} N"))
        art = ring_art([e.angle_deg for e in elements], [e.load for e in elements], q_max,
                       centre=f"{row.name}↓" if row.name else "Fr↓")
        lines.extend(Content.assemble("  ", _styled_ring(line)) for line in art)
    return lines


def _table(result: InternalResult, system: str) -> list[Content]:
    q_max = result.results["Q_max"]
    lines = [Content.styled("Element loads by azimuth ψ", TITLE_STYLE)]
    for row in result.rows:
        if len(result.rows) > 1:
            lines.append(Content.styled(f"  {_row_title(row.name)}", "bold"))
        for element in (e for e in result.elements if e.row == row.name):
            lines.append(Content.assemble(
                f"  {element.angle_deg:6.1f}° ", load_bar(element.load, q_max),
                (f" {format_quantity(element.load, 'force', system, 3):>8}", RESULT_STYLE),
                f"  α {fmt(element.contact_angle_deg, 3)}°"))
    return lines


def inside_lines(outcome: InsideOutcome | None, system: str, *, busy: bool = False) -> list[Content]:
    """The pane line by line: the title, then the ring, the numbers, the element table and the
    derivation; or the refusal and, for a missing geometry, how to give one."""
    title = "Inside the bearing"
    if outcome is not None and outcome.request.case:
        title += f" {outcome.request.bearing} · {outcome.request.case}"
    lines = [Content.styled(title + (BUSY_MARK if busy else ""), "bold")]
    if outcome is None:
        return lines
    if outcome.result is None:
        lines.append(Content.styled(f"✘ {outcome.refusal}", ERROR_STYLE))
        if outcome.request.inputs is not None and outcome.request.geometry is None:
            lines.append(Content(""))
            lines.append(Content(GEOMETRY_HELP))
        return lines
    result = outcome.result
    fit = ", ".join(f"{input_label(name)} {text}" for name, text in outcome.request.fit.items())
    lines.append(Content.styled(f"  {result.inputs.kind}, {result.inputs.arrangement}, "
                                f"Z = {result.inputs.z}" + (f"; {fit}" if fit else
                                                            "; zero clearance, no tilt"),
                                SOURCE_STYLE))
    for block in (_rings(result), _results(outcome, system), _table(result, system)):
        lines.append(Content(""))
        lines.extend(block)
    for warning in result.derivation.warnings:
        lines.append(Content.styled(f"⚠ {warning}", WARNING_STYLE))
    lines.append(Content(""))
    lines.append(Content.styled("Derivation", TITLE_STYLE))
    return lines + steps_lines(result.derivation, system)


class InsidePane(DerivationPane):
    """The inside view of the selected case's bearing, painted line by line as the derivation
    pane is (it keeps its scroll place when redrawn)."""

    def __init__(self, document: Document, *, id: str | None = None) -> None:
        super().__init__(document, id=id)
        self.outcome: InsideOutcome | None = None
        """What is on show (None until the first answer)."""
        self.shown: tuple[View, str] | None = None
        """The view and unit system whose answer is on show."""

    def _show_selected(self) -> None:
        """Ask for the selected case's inside view, unless it is on show or asked already."""
        document = self.document
        key = (self.view, document.units)
        if key == self._shown or self.view.revision < 0:
            return
        self._shown = key
        self.show_lines(inside_lines(self.outcome, document.units, busy=True))
        self._work(key, inside_request(document, self.view.selected))

    @work(thread=True, exclusive=True, group="inside")
    def _work(self, key: tuple[View, str], request: InsideRequest) -> None:
        """The analysis, away from the screen's thread."""
        outcome = work_out(request)
        self.app.call_from_thread(self._draw, key, outcome)

    def _draw(self, key: tuple[View, str], outcome: InsideOutcome) -> None:
        """Draw the answer, unless the document or the selection has moved on since."""
        if key != (self.view, self.document.units):
            return
        self.outcome = outcome
        self.show_lines(inside_lines(outcome, key[1]))
        self.shown = key
