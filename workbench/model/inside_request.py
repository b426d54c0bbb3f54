"""The inside of a document's load case, as the Inside and What-if panes ask for it.

:func:`inside_request` takes what an internal analysis of case ``index`` needs from the
document (on the screen's thread): the case's engine inputs, its bearing's geometry and fit
texts (:func:`workbench.model.internal_form.session_inside_texts`), or why there is nothing to
analyse.  A request is plain data, so the analysis can run on another thread:

- :func:`work_out` runs the quasi-static ring-displacement equilibrium of
  :func:`~workbench.model.internal_form.internal_for_case` (Hertz; Stribeck and Sjövall's load
  distribution; Jones; Harris and Kotzalas; the reference rating life after ISO/TS 16281) with
  every step, for the Inside pane;
- :func:`clearance_curve` sweeps the reference rating life L10r over operating clearance from a
  preload to a loose fit (:func:`~workbench.model.internal_form.clearance_curve_for_case`, a
  pair's axial preload set aside, the clearance standing for it), for the What-if pane's plot
  (drawn by :func:`workbench.model.plot_text.clearance_section`).

Both answer a refusal in words (no geometry, no equilibrium with the engine's cause, a refused
input named by its label, :func:`input_label`) instead of raising.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import TYPE_CHECKING

from ..engine.derive import CaseInputs
from ..engine.internal.analysis import InternalResult, SweepPoint
from .fields import FIELD_BY_NAME, FieldError, parse_field
from .internal_form import (INTERNAL_INPUT_BY_NAME, NoEquilibrium, clearance_curve_for_case,
                            internal_for_case, session_inside_texts)

if TYPE_CHECKING:
    from .document import Document

CLEARANCE_POINTS = 25
NO_CASE = "No load case selected."


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


@dataclass(frozen=True)
class ClearanceCurve:
    """L10r (10⁶ rev) against operating clearance (mm, negative: preload), or why there is
    none."""

    points: tuple[SweepPoint, ...] = ()
    problem: str | None = None
    operating: float | None = None
    """The case's own operating clearance (mm), when its bearing gives one."""


NO_CURVE = ClearanceCurve(problem="No clearance curve yet.")


def inside_request(document: Document, index: int) -> InsideRequest:
    """The request for case ``index`` of ``document`` as it stands now."""
    result = document.result(index)
    if result is None:
        return InsideRequest(problem=NO_CASE)
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
        return InsideOutcome(request, refusal=request.problem or NO_CASE)
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


def clearance_curve(request: InsideRequest, count: int = CLEARANCE_POINTS) -> ClearanceCurve:
    """The sweep of ``count`` clearances for ``request``, in words when the case has no
    geometry or the analysis refuses it."""
    if request.problem is not None or request.inputs is None:
        return ClearanceCurve(problem=request.problem or NO_CASE)
    if request.geometry is None:
        return ClearanceCurve(problem=f"No clearance curve: bearing {request.bearing} has no "
                                      "internal geometry (the Inside pane, f8, says how to give "
                                      "it).")
    try:
        points = clearance_curve_for_case(request.inputs, request.geometry, request.fit,
                                          count=count)
    except (FieldError, NoEquilibrium) as exc:
        return ClearanceCurve(problem=f"No clearance curve: {input_label(exc.field)}: "
                                      f"{exc.message}")
    text = request.fit.get("clearance", "")
    operating = parse_field("clearance", text) if text.strip() else 0.0
    return ClearanceCurve(tuple(points), operating=float(operating)  # type: ignore[arg-type]
                          if "preload" not in request.fit else None)
