"""The Inside pane (f8) and the What-if pane's life against operating clearance."""

from __future__ import annotations

import math

import pytest

from tui_helpers import retype
from tui_sessions import rig_session

from workbench.tui.app import WorkbenchApp
from workbench.tui.inside_pane import InsidePane
from workbench.tui.whatif_pane import WhatIfPane

# An invented deep-groove bearing: 10 balls of 7.9 mm on a 45 mm pitch circle.
DRIVE_GEOMETRY = {"elements": "10", "dw": "7.9 mm", "dpw": "45 mm"}
# The idler's single 40° angular-contact row, 12 balls of 9.5 mm on 60 mm.
IDLER_GEOMETRY = {"elements": "12", "dw": "9.5 mm", "dpw": "60 mm"}


def inside_session():
    """The test rig with both bearings' geometry: the drive case loaded radially only, the
    idler (a single angular-contact row) under radial load alone."""
    session = rig_session(3)
    session.bearings[0].geometry = dict(DRIVE_GEOMETRY)
    session.bearings[1].geometry = dict(IDLER_GEOMETRY)
    session.cases[0].texts["fa"] = "0 kN"
    session.cases[2].texts["fa"] = "0 kN"
    return session


def app_on(session) -> WorkbenchApp:
    return WorkbenchApp(session, offer_recovery=False, autosave_delay=None)


def pane(app: WorkbenchApp) -> InsidePane:
    return app.workbench_screen.query_one(InsidePane)


async def shown(pilot, app: WorkbenchApp) -> str:
    """Wait until the pane shows the view on show (worked out in a worker); its text."""
    for _ in range(200):
        await app.workers.wait_for_complete()
        await pilot.pause()
        if pane(app).shown == (app.workbench_screen.view, app.document.units):
            return pane(app).text.plain
    raise AssertionError("the inside pane never caught up")


def stribeck_q_max(fr: float, z: int, exponent: float = 1.5) -> float:
    """Zero clearance, pure radial load: Q(ψ) = Qmax·cos^n ψ on the loaded half, so
    Fr = Σ Q cos ψ gives Qmax = Fr / Σ cos^(n+1) ψj over cos ψj > 0, n = 3/2 for point
    contact (Stribeck; Harris & Kotzalas, Rolling Bearing Analysis, load distribution)."""
    total = sum(math.cos(2 * math.pi * j / z) ** (exponent + 1) for j in range(z)
                if math.cos(2 * math.pi * j / z) > 0.0)
    return fr / total


async def test_zero_clearance_pure_radial_q_max_is_stribecks() -> None:
    app = app_on(inside_session())
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("f8")
        text = await shown(pilot, app)
        result = pane(app).outcome.result
        assert result is not None
        expected = stribeck_q_max(3000.0, 10)
        assert result.results["Q_max"] == pytest.approx(expected, rel=1e-6)
        assert f"Qmax = {expected / 1000.0:.4g} kN" in text
        # the ring, the ISO 76 reference pressure, L10r beside ISO 281 and the steps are shown
        assert "Element loads around the ring" in text and "4200 MPa" in text
        assert "ISO 281 L10" in text and "Derivation" in text
        assert text.count("9") >= 1 and app.focused is pane(app)


async def test_a_bearing_without_geometry_says_how_to_give_it(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("f8")
        text = await shown(pilot, app)
        assert "Drive has no internal geometry" in text
        assert "ctrl+g" in text and "[bearings.geometry]" in text
        assert pane(app).outcome.result is None


async def test_no_equilibrium_names_the_cause() -> None:
    # A single angular-contact row under radial load alone has no equilibrium (the row needs
    # thrust to hold its contact angle: Harris & Kotzalas), though ISO 281 rates it (P = Fr).
    app = app_on(inside_session())
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("down", "down")
        await pilot.press("f8")
        text = await shown(pilot, app)
        assert app.document.result(2).derivation is not None
        assert "✘ No equilibrium" in text and "thrust" in text


async def test_clearance_is_a_field_and_undo_puts_it_back() -> None:
    app = app_on(inside_session())
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        await pilot.press("f8")
        await shown(pilot, app)
        zero = pane(app).outcome.result.results["Q_max"]
        await retype(pilot, app, "clearance", "0.02 mm")
        await pilot.press("enter")
        await shown(pilot, app)
        assert app.document.session.bearings[0].texts["clearance"] == "0.02 mm"
        loose = pane(app).outcome.result.results["Q_max"]
        # a loose fit narrows the load zone: fewer balls, a larger Qmax (Harris & Kotzalas)
        assert loose > zero * 1.05
        app.workbench_screen.query_one("#inside-view").focus()
        await pilot.press("ctrl+z")
        await shown(pilot, app)
        assert app.document.session.bearings[0].texts.get("clearance", "") == ""
        assert pane(app).outcome.result.results["Q_max"] == pytest.approx(zero, rel=1e-12)


async def test_an_answer_for_an_older_view_is_dropped() -> None:
    app = app_on(inside_session())
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.press("f8")
        await shown(pilot, app)
        before = pane(app).outcome
        older = (app.workbench_screen.view._replace(revision=-5), app.document.units)
        pane(app)._draw(older, before.__class__(before.request, None, "stale"))
        assert pane(app).outcome is before


async def test_whatif_draws_life_against_clearance() -> None:
    app = app_on(inside_session())
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        await pilot.press("f7")
        whatif = app.workbench_screen.query_one(WhatIfPane)
        for _ in range(200):
            await app.workers.wait_for_complete()
            await pilot.pause()
            if whatif.shown == app.workbench_screen.view:
                break
        text = whatif.text.plain
        assert "vs Pd=0" in text and "L10r at zero clearance" in text
        points = whatif._clearance.points
        assert len(points) == 25 and points[0].clearance < 0.0 < points[-1].clearance


async def test_the_spindle_pair_opens_unchanged_and_shows_both_rows() -> None:
    # The example session (sessions/spindle-pair.toml): opening it writes nothing (a required
    # choice's first option, set as the form mounts, once overwrote the pair's kind), and the
    # inside view draws both rows of the preloaded pair.
    from pathlib import Path

    from workbench.model.sessionfile import load_session

    session = load_session(Path(__file__).parents[2] / "sessions" / "spindle-pair.toml")
    app = app_on(session)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("f8")
        text = await shown(pilot, app)
        assert not app.document.dirty and not app.document.can_undo
        assert app.document.session.bearings[0].texts["kind"] == "angular-contact"
        assert "row A" in text and "row B" in text and "A↓" in text and "B↓" in text
        result = pane(app).outcome.result
        assert result is not None and len(result.rows) == 2
