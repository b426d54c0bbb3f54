"""A large document: an edit reaching more than ``defer_over`` cases derives only the case it
was made in, leaves the rest pending for another thread, and keeps only results still current.

Lives are checked against ISO 281:2007's closed form for a radial ball bearing under pure
radial load: P = Fr (§6.2, X = 1, Y = 0 when Fa = 0), L10 = (C/P)³ million revolutions
(eq. 2, p = 3 for ball bearings), L10h = 10⁶·L10/(60·n), and without lubrication data and at
90 % reliability Lnm = L10h (a1 = 1, Table 12; aISO = 1).
"""

from __future__ import annotations

import pytest

from workbench.model.analysis import analyse
from workbench.model.document import Document
from workbench.model.sample_sessions import (
    SHARED_BEARING, SHARED_SPEED_RPM, shared_bearing_session, shared_fr_kn,
)

CASES = 400
DEFER_OVER = 50


def closed_form_l10h(c_kn: float, fr_kn: float, speed_rpm: float = SHARED_SPEED_RPM) -> float:
    """ISO 281:2007 eq. 2 with P = Fr, in hours (see the module notes)."""
    return (c_kn / fr_kn) ** 3 * 1e6 / (60.0 * speed_rpm)


def large_document() -> Document:
    document = Document(shared_bearing_session(CASES, pure_radial=True))
    document.defer_over = DEFER_OVER
    return document


def shared_indices(document: Document) -> list[int]:
    return [index for index, case in enumerate(document.session.cases)
            if case.bearing == SHARED_BEARING]


def derive_pending(document: Document) -> int:
    """What the screen's worker does, on this thread: derive every pending case, hand it back."""
    job = document.rederivation()
    assert job is not None
    return document.take(job.derive(0, len(job.cases)))


def test_a_shared_bearing_edit_derives_its_case_and_leaves_the_rest_pending(
        derived: list[str]) -> None:
    document = large_document()
    shared = shared_indices(document)
    derived.clear()
    assert document.set_field(7, "c", "40 kN") is None
    assert derived == ["case 8"]  # only the case the edit was made in
    assert set(document.pending) == set(shared) - {7}
    # a pending case asked for is derived on the spot, and is current
    result = document.result(200)
    assert result.derivation.results["L10h"] == pytest.approx(
        closed_form_l10h(40.0, shared_fr_kn(201)), rel=1e-12)
    assert 200 not in document.pending


def test_every_case_on_the_bearing_reaches_the_closed_form_life() -> None:
    document = large_document()
    document.set_field(0, "c", "40 kN")
    assert derive_pending(document) == len(shared_indices(document)) - 1
    assert not document.pending
    for index in shared_indices(document):
        values = document.results[index].derivation.results
        expected = closed_form_l10h(40.0, shared_fr_kn(index + 1))
        assert values["P"] == pytest.approx(shared_fr_kn(index + 1) * 1000.0, rel=1e-12)
        assert values["L10h"] == pytest.approx(expected, rel=1e-12)
        assert values["Lnm"] == pytest.approx(expected, rel=1e-12)


def test_a_result_for_an_older_revision_is_dropped() -> None:
    document = large_document()
    document.set_field(0, "c", "40 kN")
    job = document.rederivation()
    document.set_field(0, "c", "45 kN")  # while the worker works on 40 kN
    stale = job.derive(0, len(job.cases))
    assert document.take(stale) == 0
    assert len(document.pending) == len(shared_indices(document)) - 1
    derive_pending(document)
    assert document.results[300].derivation.results["L10h"] == pytest.approx(
        closed_form_l10h(45.0, shared_fr_kn(301)), rel=1e-12)


def test_a_case_edited_meanwhile_keeps_its_own_result() -> None:
    document = large_document()
    document.end_run()
    document.set_field(0, "c", "40 kN")
    document.end_run()
    job = document.rederivation()
    document.set_field(10, "fr", "5 kN")  # case 11 changes under the worker
    kept = document.take(job.derive(0, len(job.cases)))
    assert kept == len(shared_indices(document)) - 2  # neither case 1 nor case 11
    assert not document.pending
    assert document.results[10].derivation.results["L10h"] == pytest.approx(
        closed_form_l10h(40.0, 5.0), rel=1e-12)


def test_the_work_is_handed_over_nearest_first_and_in_parts() -> None:
    document = large_document()
    document.set_field(0, "c", "40 kN")
    job = document.rederivation(near=150)
    assert [index for index, _, _ in job.cases[:3]] == [150, 149, 151]
    assert document.take(job.derive(0, 10)) == 10
    assert len(document.pending) == len(shared_indices(document)) - 1 - 10


def test_cases_added_and_removed_under_deferral_match_a_full_analysis() -> None:
    document = large_document()
    document.set_field(0, "c", "40 kN")
    document.end_run()
    added = document.add_case(5)
    document.set_field(added, "fr", "3 kN")
    document.end_run()
    document.delete_case(20)
    document.undo()
    document.set_field(3, "c", "38 kN")  # the targets and the shared bearing again
    derive_pending(document)
    full = analyse(document.session, keep_steps=False)
    assert [r.case.name for r in document.results] == [r.case.name for r in full.cases]
    assert [r.derivation.results if r.derivation else r.error for r in document.results] == \
        [r.derivation.results if r.derivation else r.error for r in full.cases]


def test_current_results_derives_what_is_pending() -> None:
    document = large_document()
    document.set_field(0, "c", "40 kN")
    results = document.current_results()
    assert not document.pending
    assert results[-3].derivation.results["L10h"] == pytest.approx(
        closed_form_l10h(40.0, shared_fr_kn(CASES - 2)), rel=1e-12)


def test_a_session_with_duty_cycles_is_derived_at_once(derived: list[str]) -> None:
    session = shared_bearing_session(CASES, pure_radial=True)
    session.reserved["duty_cycles"] = [{"name": "spectrum", "basis": "time", "states": [
        {"case": "case 1", "share": "0.5"}, {"case": "case 2", "share": "0.5"}]}]
    document = Document(session)
    document.defer_over = DEFER_OVER
    document.set_field(0, "c", "40 kN")
    assert not document.pending  # a duty cycle's life is built from its cases' results
    duty = document.analysis.duties[0]
    assert duty.error is None, duty.error


def test_without_defer_over_every_case_is_derived_in_the_edit() -> None:
    document = Document(shared_bearing_session(CASES, pure_radial=True))
    document.set_field(0, "c", "40 kN")
    assert not document.pending and document.rederivation() is None
