"""The inside pane: the selected case's bearing seen from inside, element by element.

For a bearing whose internal geometry is known (rated from geometry, or given in the session's
``[bearings.geometry]`` table), the quasi-static ring-displacement equilibrium of
:func:`workbench.model.internal_form.internal_for_case` (Hertz; Stribeck and Sjövall's load
distribution; Jones; Harris and Kotzalas; the reference rating life after ISO/TS 16281) gives
each rolling element's load.  The pane draws them around the ring in digits (tenths of the
largest load, so it reads in monochrome), lists them by azimuth with a bar each, gives the
numbers (Qmax, the load zone, the ring displacements, the largest contact pressures against
ISO 76's 4 200 / 4 000 MPa, the stiffness, L10r beside the ISO 281 L10) and then every step of
the same :class:`~workbench.engine.record.Derivation` record the derivation pane reads.

It follows :attr:`view` (bound to the screen's) while it is on show, as the other panes do; the
analysis runs in a thread worker (a newer view cancels the older work, and an answer for an
older view is dropped).  Without a geometry it says how to give one; where no ring position
balances the loads it says so with the engine's cause.
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field

from textual import work
from textual.content import Content

from ..engine.derive import CaseInputs
from ..engine.internal.analysis import InternalResult
from ..engine.internal.distribution import ROLLER_KINDS
from ..engine.internal.hertz import STATIC_REFERENCE_PRESSURE_BALL, STATIC_REFERENCE_PRESSURE_ROLLER
from ..engine.record import fmt
from ..model.document import Document
from ..model.fields import FIELD_BY_NAME, FieldError
from ..model.internal_form import (INTERNAL_INPUT_BY_NAME, NoEquilibrium, internal_for_case,
                                   session_inside_texts)
from ..model.quantities import format_quantity
from .derivation_pane import (ERROR_STYLE, RESULT_STYLE, SOURCE_STYLE, WARNING_STYLE, DerivationPane,
                              steps_lines)
from .view import View

TITLE_STYLE = "bold $text-primary"
RING_STYLE = "bold $accent"
IDLE_STYLE = "$foreground 50%"
BUSY_MARK = " · working…"
RING_HALF_WIDTH = 8  # columns from the ring's centre to its side (a terminal cell is twice as tall)
RING_HALF_HEIGHT = 4
BAR_WIDTH = 12
BAR_FULL, BAR_EMPTY = "█", "·"
NO_CONTACT = "·"
GEOMETRY_HELP = ("Give it one: alt+c, then ctrl+g rates a special bearing from its geometry "
                 "(Z, Dw, Dpw …) and adopting it keeps that geometry here; or add a "
                 "[bearings.geometry] table to the session file (elements, dw, dpw, and lwe for "
                 "rollers; schema = 2). Clearance and preload are bearing fields, tilt and "
                 "moment case fields.")


@dataclass(frozen=True)
class InsideRequest:
    """What one inside analysis needs, taken from the document on the screen's thread: the
    case's engine inputs, its bearing's geometry and fit texts (None: no geometry), or why
    there is nothing to analyse."""

    case: str = ""
    bearing: str = ""
    inputs: CaseInputs | None = None
    geometry: Mapping[str, str] | None = None
    fit: Mapping[str, str] = field(default_factory=dict)
    problem: str | None = None


@dataclass(frozen=True)
class InsideOutcome:
    """The analysis of a request, or the line that says why there is none (``refusal``: the
    geometry is missing, no equilibrium exists, or an input is refused)."""

    request: InsideRequest
    result: InternalResult | None = None
    refusal: str | None = None


def inside_request(document: Document, index: int) -> InsideRequest:
    """The request for case ``index`` of ``document`` as it stands now."""
    result = document.result(index)
    if result is None:
        return InsideRequest(problem="No load case selected.")
    case = result.case
    if result.inputs is None or result.derivation is None:
        return InsideRequest(case.name, case.bearing,
                             problem="The case cannot be derived: see the derivation tab (f5).")
    texts = session_inside_texts(document.session, case)
    if texts is None:
        return InsideRequest(case.name, case.bearing, result.inputs)
    geometry, fit = texts
    return InsideRequest(case.name, case.bearing, result.inputs, geometry, fit)


def input_label(name: str) -> str:
    """The words for an input the internal analysis names (a field, or a geometry input)."""
    if name in FIELD_BY_NAME:
        return FIELD_BY_NAME[name].label
    spec = INTERNAL_INPUT_BY_NAME.get(name)
    return spec.label if spec is not None else name


def work_out(request: InsideRequest) -> InsideOutcome:
    """The internal analysis of ``request`` with every step (:func:`internal_for_case`), or the
    refusal in words."""
    if request.problem is not None or request.inputs is None:
        return InsideOutcome(request, refusal=request.problem or "No load case selected.")
    if request.geometry is None:
        return InsideOutcome(request, refusal=f"Bearing {request.bearing} has no internal "
                                              "geometry, so its element loads are unknown.")
    try:
        return InsideOutcome(request, internal_for_case(request.inputs, request.geometry,
                                                        request.fit))
    except NoEquilibrium as exc:
        return InsideOutcome(request, refusal=f"No equilibrium ({input_label(exc.field)}): "
                                              f"{exc.message}")
    except FieldError as exc:
        return InsideOutcome(request, refusal=f"{input_label(exc.field)}: {exc.message}")


def load_digit(load: float, q_max: float) -> str:
    """An element's load as one character: tenths of ``q_max`` as a digit (0 … 9, the largest
    load 9), or a dot for an element out of contact."""
    if not load > 0.0 or not q_max > 0.0:
        return NO_CONTACT
    return str(min(9, int(10.0 * load / q_max)))


def ring_art(angles_deg: Sequence[float], loads: Sequence[float], q_max: float, *,
             half_width: int = RING_HALF_WIDTH, half_height: int = RING_HALF_HEIGHT,
             centre: str = "Fr↓") -> list[str]:
    """The elements around the ring as text: each at its azimuth ψ on an ellipse (a terminal
    cell is about twice as tall as wide, so this reads as a circle), ψ = 0 at the bottom where
    Fr pushes the inner ring, ψ growing counter-clockwise; each drawn by :func:`load_digit`.
    Two elements falling on one cell show the larger load."""
    width, height = 2 * half_width + 1, 2 * half_height + 1
    grid = [[" "] * width for _ in range(height)]
    drawn: dict[tuple[int, int], float] = {}
    for angle, load in zip(angles_deg, loads):
        psi = math.radians(angle)
        column = half_width + round(half_width * math.sin(psi))
        row = half_height + round(half_height * math.cos(psi))
        shown = load if load > 0.0 else -1.0
        if drawn.get((row, column), -math.inf) < shown:
            drawn[(row, column)] = shown
            grid[row][column] = load_digit(load, q_max)
    start = max(half_width - len(centre) // 2, 0)
    for offset, character in enumerate(centre[: width]):
        grid[half_height][start + offset] = character
    return ["".join(line) for line in grid]


def load_bar(load: float, q_max: float, width: int = BAR_WIDTH) -> str:
    """A load as a bar of ``width`` cells against ``q_max``."""
    filled = round(width * min(load / q_max, 1.0)) if load > 0.0 and q_max > 0.0 else 0
    return BAR_FULL * filled + BAR_EMPTY * (width - filled)


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
    lines.append(_number("L10r", f"{fmt(r['L10r'], 4)} 10⁶ rev",
                         f" · ISO 281 L10 = {fmt(r['L10_iso281'], 4)} 10⁶ rev"))
    if "L10rh" in r:
        hours = format_quantity(r["L10rh"], "time", system)
        lines.append(_number("L10rh", hours))
    if "Lnmr" in r:
        lines.append(_number("Lnmr", f"{fmt(r['Lnmr'], 4)} 10⁶ rev", f" · aISO = {fmt(r['aISO'], 3)}"))
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
