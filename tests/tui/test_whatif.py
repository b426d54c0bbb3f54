"""The What-if tab: sensitivity, life and aISO plots and damage shares of the selected case."""

from __future__ import annotations

import pytest

from tui_helpers import retype, selected_case, selected_result

from workbench.engine.sensitivity import sensitivity_of
from workbench.model.analysis import analyse
from workbench.model import files
from workbench.tui.app import WorkbenchApp
from workbench.tui.whatif_pane import LIFE_PLOT_TITLE, WhatIfPane, share_bar


def pane(app: WorkbenchApp) -> WhatIfPane:
    return app.workbench_screen.query_one(WhatIfPane)


async def worked_out(pilot, app: WorkbenchApp) -> None:
    """Wait until the pane shows the what-if of the view on show (worked out in a worker)."""
    for _ in range(100):
        await app.workers.wait_for_complete()
        await pilot.pause()
        if pane(app).shown == app.workbench_screen.view:
            return
    raise AssertionError("the what-if never caught up")


def elasticities(items) -> dict[str, float | None]:
    return {item.input: item.elasticity for item in items}


async def test_elasticities_are_the_engines_and_follow_typed_fr(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("f7")
        await worked_out(pilot, app)
        shown = pane(app).items
        result = selected_result(app)
        assert result is not None and result.inputs is not None
        assert elasticities(shown) == elasticities(sensitivity_of(result.inputs))
        # ISO 281:2007 §7.1: L10 = (C/P)^p with p = 3 for ball bearings, so ε(C) = 3 exactly.
        assert elasticities(shown)["c"] == pytest.approx(3.0)
        assert "radial load Fr" in pane(app).text.plain and "aISO" in pane(app).text.plain
        before = elasticities(shown)

        await retype(pilot, app, "fr", "4.5 kN")
        await worked_out(pilot, app)
        after = pane(app).items
        assert app.document.session.cases[0].texts["fr"] == "4.5 kN"
        assert elasticities(after) != before
        fresh = selected_result(app)
        assert fresh is not None and fresh.inputs is not None and fresh.inputs.fr == 4500.0
        assert elasticities(after) == elasticities(sensitivity_of(fresh.inputs))


async def test_a_case_that_cannot_be_derived_says_so(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("down", "down")  # Idler end
        await pilot.pause()
        app.document.session.cases[2].texts["fr"] = "-5 kN"  # refused by the engine
        app.document.replace(app.document.session, None)
        app.workbench_screen.view = app.workbench_screen.view._replace(
            revision=app.document.revision)
        await pilot.press("f7")
        await worked_out(pilot, app)
        assert pane(app).items == [] and "cannot be derived" in pane(app).text.plain


async def test_an_answer_for_an_older_view_is_dropped(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.press("f7")
        await worked_out(pilot, app)
        before = pane(app).items
        older = app.workbench_screen.view._replace(revision=-5)
        pane(app)._draw(older, [], {}, "stale", None, "SI", [])  # as a late worker would
        assert pane(app).items == before and "stale" not in pane(app).text.plain


async def test_duty_block_shows_the_damage_shares_of_the_bearings_cycles() -> None:
    session = files.open_session(files.demo_path()).session
    assert session is not None
    app = WorkbenchApp(session, None, offer_recovery=False, autosave_delay=None)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("f7")
        await worked_out(pilot, app)
        text = pane(app).text.plain
        bearing = selected_case(app).bearing
        duties = [d for d in analyse(session).duties if d.result and d.result.bearing == bearing]
        assert duties
        for duty in duties:
            assert duty.name in text
            for share in duty.result.damage_shares:
                assert f"{100 * share:5.1f} %" in text
        # Palmgren–Miner: the damage shares of a cycle add up to the whole damage.
        assert sum(duties[0].result.damage_shares) == pytest.approx(1.0)


def test_share_bar() -> None:
    # closed form: round(share × width) full cells, the rest light
    assert share_bar(0.25, 8) == "██░░░░░░"
    assert share_bar(1.5, 4) == "████" and share_bar(float("nan"), 3) == "░░░"


def _theme(name: str, scroll_to: str | None = None):
    async def run_before(pilot) -> None:
        await pilot.pause()
        pilot.app.theme = name
        await pilot.press("f7")
        await worked_out(pilot, pilot.app)
        if scroll_to is not None:
            pilot.app.workbench_screen.query_one(WhatIfPane).scroll_to_block(scroll_to)
        await pilot.pause()
    return run_before


def test_whatif_tab_snapshot_night(snap_compare, make_app) -> None:
    assert snap_compare(make_app(), terminal_size=(80, 24), run_before=_theme("bench-night"))


def test_whatif_tab_snapshot_monochrome_plot(snap_compare, make_app) -> None:
    assert snap_compare(make_app(), terminal_size=(80, 24),
                        run_before=_theme("bench-mono", LIFE_PLOT_TITLE))


async def test_a_slow_answer_is_marked_busy_and_a_quick_one_is_not(make_app, monkeypatch) -> None:
    """Issue 17 item 4: work off the key path shows that it is busy.  The sweep is held until
    the mark is on show; a quick answer is drawn without the mark ever being drawn."""
    import threading

    from workbench.tui import whatif_pane

    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.press("f7")
        await worked_out(pilot, app)
        drawn: list[bool] = []
        redraw = pane(app)._redraw

        def noting() -> None:
            drawn.append(pane(app)._busy)
            redraw()

        monkeypatch.setattr(pane(app), "_redraw", noting)
        monkeypatch.setattr(whatif_pane, "BUSY_AFTER_S", 60.0)  # every answer quick, however busy the machine
        await retype(pilot, app, "fr", "4.5 kN")
        await worked_out(pilot, app)
        assert drawn and not any(drawn)  # a quick answer: drawn once, never marked busy

        release = threading.Event()

        def held(inputs):
            release.wait(timeout=30)
            return sensitivity_of(inputs)

        monkeypatch.setattr(whatif_pane, "sensitivity_of", held)
        monkeypatch.setattr(whatif_pane, "BUSY_AFTER_S", 0.05)
        await retype(pilot, app, "fr", "5 kN")
        for _ in range(200):
            await pilot.pause(0.02)
            if whatif_pane.BUSY_MARK in pane(app).text.plain:
                break
        assert whatif_pane.BUSY_MARK in pane(app).text.plain
        release.set()
        await worked_out(pilot, app)
        assert whatif_pane.BUSY_MARK not in pane(app).text.plain
