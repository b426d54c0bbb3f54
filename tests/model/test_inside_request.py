"""What the Inside and What-if panes ask of a document's case, without a screen: the request,
and a refusal in words where there is nothing to analyse."""

from __future__ import annotations

import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).parents[1] / "tui"))  # the test-rig session

from tui_sessions import rig_session  # noqa: E402

from workbench.model.document import Document  # noqa: E402
from workbench.model.fields import FIELD_BY_NAME  # noqa: E402
from workbench.model.inside_request import clearance_curve, inside_request, work_out  # noqa: E402

# An invented deep-groove bearing: 10 balls of 7.9 mm on a 45 mm pitch circle.
DRIVE_GEOMETRY = {"elements": "10", "dw": "7.9 mm", "dpw": "45 mm"}


def document_with(**drive_texts: str) -> Document:
    """The test rig with the Drive bearing's geometry (the Idler has none) and ``drive_texts``
    on the Drive bearing; the first case loaded radially only."""
    session = rig_session(3)
    session.bearings[0].geometry = dict(DRIVE_GEOMETRY)
    session.bearings[0].texts.update(drive_texts)
    session.cases[0].texts["fa"] = "0 kN"
    return Document(session)


def test_no_case_and_a_case_that_cannot_be_derived_are_refused() -> None:
    document = document_with()
    assert inside_request(document, 7).problem == "No load case selected."
    document.session.cases[1].texts["fr"] = "-3 kN"
    request = inside_request(Document(document.session), 1)
    assert request.inputs is None and "cannot be derived" in str(request.problem)
    assert work_out(request).refusal == request.problem
    assert clearance_curve(request).problem == request.problem


def test_a_bearing_without_geometry_is_named() -> None:
    request = inside_request(document_with(), 2)  # the Idler
    assert request.inputs is not None and request.geometry is None
    assert "Bearing Idler has no internal geometry" in str(work_out(request).refusal)
    assert "bearing Idler has no internal geometry" in str(clearance_curve(request).problem)


def test_a_refused_input_is_named_by_its_label() -> None:
    # An axial preload belongs to a pair; the Drive is a single deep-groove bearing.
    request = inside_request(document_with(preload="1 kN"), 0)
    assert request.fit == {"preload": "1 kN"}
    label = FIELD_BY_NAME["preload"].label
    assert str(work_out(request).refusal).startswith(f"{label}: ")
    assert str(clearance_curve(request).problem).startswith(f"No clearance curve: {label}: ")


def test_the_curve_carries_the_typed_operating_clearance() -> None:
    request = inside_request(document_with(clearance="0.01 mm"), 0)
    curve = clearance_curve(request, count=9)
    assert curve.problem is None and len(curve.points) == 9
    assert curve.operating == 0.01  # mm, as typed
    outcome = work_out(request)
    assert outcome.refusal is None and outcome.result is not None
