"""Rating a special bearing from its geometry in the screen, adopting it, undoing it."""

from __future__ import annotations

import pytest
from textual.widgets import Input

from workbench.tui.rating_screen import RatingScreen
from workbench.tui.selection_screen import SelectionScreen
from tui_helpers import selected_result


async def _open_rating(pilot, app) -> RatingScreen:
    await pilot.press("ctrl+l")
    await pilot.pause()
    assert isinstance(app.screen, SelectionScreen)
    await pilot.press("ctrl+g")
    await pilot.pause()
    screen = app.screen
    assert isinstance(screen, RatingScreen)
    return screen


async def _type(pilot, screen: RatingScreen, name: str, text: str) -> None:
    box = screen.query_one(f"#rating-{name}", Input)
    box.focus()
    await pilot.pause()
    await pilot.press("end", "ctrl+u", *text)
    await pilot.pause()


async def test_rated_bearing_is_adopted_and_undone(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        screen = await _open_rating(pilot, app)
        # started from the Drive bearing: deep-groove, dm 45 mm as the pitch diameter
        assert screen.query_one("#rating-dpw", Input).value == "45 mm"
        await _type(pilot, screen, "elements", "9")
        await _type(pilot, screen, "dw", "12.7 mm")
        await _type(pilot, screen, "dpw", "65 mm")
        assert screen.adoption is not None
        # ISO 281:2007 §5.1.1 (from memory): Cr = bm·fc·Z^(2/3)·Dw^1.8, bm = 1.3, fc = 59.9
        c_formula = 1.3 * 59.9 * 9 ** (2 / 3) * 12.7 ** 1.8
        assert "C = 32.69 kN" in str(screen.query_one("#rating-message").render())
        assert "fc" in str(screen.query_one("#rating-steps").render())
        await pilot.press("f10")
        await pilot.pause()
        assert not isinstance(app.screen, (RatingScreen, SelectionScreen))
        drive = app.document.session.bearing("Drive")
        assert drive.texts["c"] == "32.69 kN" and drive.texts["dm"] == "65 mm"
        result = selected_result(app)
        assert result is not None and result.inputs.c == pytest.approx(c_formula, rel=5e-4)
        await pilot.press("ctrl+z")
        await pilot.pause()
        assert app.document.session.bearing("Drive").texts["c"] == "30 kN"


async def test_unratable_inputs_say_why_and_adopt_nothing(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        screen = await _open_rating(pilot, app)
        await _type(pilot, screen, "elements", "9")
        await _type(pilot, screen, "dw", "12.7 kg")
        assert screen.adoption is None
        assert "mass" in str(screen.query_one("#rating-message").render())
        await pilot.press("f10")
        await pilot.pause()
        assert app.screen is screen
        await pilot.press("escape")
        await pilot.pause()
        assert isinstance(app.screen, SelectionScreen)
        assert app.document.session.bearing("Drive").texts["c"] == "30 kN"
