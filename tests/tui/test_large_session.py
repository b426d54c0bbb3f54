"""A session of 1,000 cases on the screen: it opens, a key in a bearing field every case shares
reaches every row (the rows on show at once, the rest through the worker), and a report is
written.  The speed is measured by ``workbench bench`` (large_open_s, large_settle_ms_p90,
huge_echo_ms_p90), never here.

Lives against ISO 281:2007's closed form for a radial ball bearing under pure radial load:
P = Fr (§6.2), L10 = (C/P)³ million revolutions (eq. 2, p = 3), L10h = 10⁶·L10/(60·n), and
Lnm = L10h at 90 % reliability without lubrication data (a1 = 1, Table 12; aISO = 1).
"""

from __future__ import annotations

import json

from tui_helpers import retype, write_report

from workbench.engine.record import fmt
from workbench.model.sample_sessions import (
    SHARED_BEARING, SHARED_SPEED_RPM, shared_bearing_session, shared_fr_kn,
)
from workbench.tui.app import WorkbenchApp
from workbench.tui.case_table import COLUMNS, CaseTable
from workbench.tui.workbench_screen import DEFER_OVER

CASES = 1000
LIFE_COLUMN = 1 + [heading for heading, _ in COLUMNS].index("Lnm h")


def closed_form_lnm_h(c_kn: float, fr_kn: float) -> float:
    """Lnm = L10h = 10⁶·(C/Fr)³/(60·n) (see the module notes)."""
    return (c_kn / fr_kn) ** 3 * 1e6 / (60.0 * SHARED_SPEED_RPM)


def shown_life(table: CaseTable, row: int) -> str:
    """The life cell of ``row`` as the table holds it (what it draws)."""
    return table.get_row_at(row)[LIFE_COLUMN].plain


async def until_derived(pilot, app: WorkbenchApp) -> None:
    """Wait until the worker has derived every pending case (it starts after a pause)."""
    for _ in range(400):
        await app.workers.wait_for_complete()
        await pilot.pause(0.05)
        if not app.document.pending:
            return
    raise AssertionError(f"{len(app.document.pending)} cases still pending")


async def test_thousand_cases_open_edit_a_shared_bearing_and_report(tmp_path) -> None:
    app = WorkbenchApp(shared_bearing_session(CASES, pure_radial=True), offer_recovery=False,
                       autosave_delay=None)
    document = app.document
    shared = [i for i, case in enumerate(document.session.cases)
              if case.bearing == SHARED_BEARING]
    assert len(shared) > DEFER_OVER  # so the edit below is left to the worker
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        table = app.workbench_screen.query_one(CaseTable)
        assert table.row_count == CASES
        assert shown_life(table, 0) == fmt(closed_form_lnm_h(33.0, shared_fr_kn(1)))

        await retype(pilot, app, "c", "40 kN")  # the bearing every shared case uses
        assert document.session.bearing(SHARED_BEARING).texts["c"] == "40 kN"
        # the rows on show are current at once, before the worker has run
        for row in range(5):
            assert shown_life(table, row) == \
                fmt(closed_form_lnm_h(40.0, shared_fr_kn(row + 1))), row

        await until_derived(pilot, app)
        for index in shared:
            lnm = document.results[index].derivation.results["Lnm"]
            assert abs(lnm / closed_form_lnm_h(40.0, shared_fr_kn(index + 1)) - 1) < 1e-12

        last = shared[-1]
        await pilot.press("escape", "end")  # the last rows come into view and are written
        await pilot.press(*["up"] * (CASES - 1 - last))  # to the last case on the bearing
        await pilot.pause()
        assert app.workbench_screen.selected == last
        assert shown_life(table, last) == \
            fmt(closed_form_lnm_h(40.0, shared_fr_kn(last + 1)))

        await retype(pilot, app, "fr", "5 kN")  # a field of the last case alone
        assert shown_life(table, last) == fmt(closed_form_lnm_h(40.0, 5.0))

        await write_report(pilot, app, tmp_path / "large.json", "json", rounds=400)
    written = json.loads((tmp_path / "large.json").read_text(encoding="utf-8"))
    assert len(written["cases"]) == CASES
    by_name = {case["name"]: case for case in written["cases"]}
    assert abs(by_name["case 500"]["results"]["Lnm"]
               / closed_form_lnm_h(40.0, shared_fr_kn(500)) - 1) < 1e-12
    assert abs(by_name[f"case {last + 1}"]["results"]["Lnm"]
               / closed_form_lnm_h(40.0, 5.0) - 1) < 1e-12
