"""Rating a special bearing from its geometry: inputs checked as typed, the kind chosen from a
list, the ratings adopted (through the main screen, and undone).  Keyboard only."""

from __future__ import annotations

import pytest
from textual.widgets import Input, Select

from screen_host import ScreenHost, cut_widgets, type_into
from tui_sessions import DRIVE_BEARING

from workbench.tui.rating_screen import RATING_SOURCE, RatingScreen
from workbench.tui.selection_screen import SelectionScreen
from tui_helpers import selected_result

# ISO 281:2007 §5.1.1 (from memory): Cr = bm·fc·Z^(2/3)·Dw^1.8 for a radial ball bearing with
# Dw ≤ 25.4 mm, bm = 1.3; fc = 59.9 at Dw·cos α/Dpw = 12.7/65 ≈ 0.195 (ISO 281 Table 2).
C_FORMULA_N = 1.3 * 59.9 * 9 ** (2 / 3) * 12.7 ** 1.8


def host() -> ScreenHost:
    return ScreenHost(lambda: RatingScreen("Drive", DRIVE_BEARING, "SI"))


async def typed(pilot, **texts: str) -> RatingScreen:
    """The form once each input named (without its ``rating-`` prefix) has its text typed."""
    await pilot.pause()
    for name, text in texts.items():
        await type_into(pilot, f"rating-{name}", text)
    return pilot.app.screen


async def ball_bearing_typed(pilot) -> RatingScreen:
    """The form with Z = 9 balls of 12.7 mm on a 65 mm pitch circle typed in."""
    return await typed(pilot, elements="9", dw="12.7 mm", dpw="65 mm")


@pytest.mark.parametrize("size", [(80, 24), (120, 40)])
async def test_starts_at_the_first_input_needed_and_fits(size) -> None:
    app = host()
    async with app.run_test(size=size) as pilot:
        await pilot.pause()
        screen = app.screen
        assert isinstance(screen, RatingScreen)
        # started from the Drive bearing: deep-groove, dm 45 mm as the pitch diameter
        assert screen.query_one("#rating-kind", Select).value == "deep-groove"
        assert screen.query_one("#rating-dpw", Input).value == "45 mm"
        assert app.focused is screen.query_one("#rating-elements")
        assert "Elements per row Z: needed" in str(screen.query_one("#rating-message").render())
        assert cut_widgets(screen) == []


async def test_typed_geometry_is_rated_and_adopted() -> None:
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        screen = await ball_bearing_typed(pilot)
        assert screen.adoption is not None
        assert "C = 32.69 kN" in str(screen.query_one("#rating-message").render())
        assert "fc" in str(screen.query_one("#rating-steps").render())
        await pilot.press("f10")
        await pilot.pause()
        [adoption] = app.answers
        assert adoption.source == RATING_SOURCE and adoption.texts["dm"] == "65 mm"
        assert float(adoption.texts["c"].removesuffix(" kN")) * 1000 == pytest.approx(
            C_FORMULA_N, rel=5e-4)


async def test_the_form_starts_from_the_bearings_geometry() -> None:
    geometry = {"elements": "10", "dw": "7.9 mm", "dpw": "46 mm"}
    app = ScreenHost(lambda: RatingScreen("Drive", DRIVE_BEARING, "SI", geometry_now=geometry))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        screen = app.screen
        assert [screen.query_one(f"#rating-{name}", Input).value
                for name in ("elements", "dw", "dpw")] == ["10", "7.9 mm", "46 mm"]
        assert screen.adoption is not None and screen.adoption.geometry == geometry


async def test_unreadable_input_is_marked_and_nothing_is_adopted() -> None:
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        screen = await typed(pilot, elements="9", dw="12.7 kg")
        assert screen.query_one("#rating-dw", Input).has_class("-invalid")
        assert screen.adoption is None
        assert "mass" in str(screen.query_one("#rating-message").render())
        await pilot.press("f10")
        await pilot.pause()
        assert app.screen is screen and app.answers == []
        await pilot.press("escape")
        await pilot.pause()
        assert app.answers == [None]


async def test_choosing_a_roller_kind_asks_for_the_roller_length() -> None:
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        screen = await typed(pilot, elements="14", dw="10 mm")
        assert screen.adoption is not None
        await pilot.press("shift+tab", "shift+tab", "shift+tab")  # back to the kind
        assert app.focused is screen.query_one("#rating-kind")
        await pilot.press("enter", *"cyl", "enter")
        await pilot.pause()
        assert screen.query_one("#rating-kind", Select).value == "cylindrical"
        assert screen.adoption is None
        assert "Roller length Lwe" in str(screen.query_one("#rating-message").render())


async def test_rated_bearing_is_adopted_through_the_main_screen_and_undone(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("alt+c")
        await pilot.pause()
        assert isinstance(app.screen, SelectionScreen)
        await pilot.press("ctrl+g")
        await pilot.pause()
        assert isinstance(await ball_bearing_typed(pilot), RatingScreen)
        await pilot.press("f10")
        await app.workers.wait_for_complete()
        await pilot.pause()
        assert not isinstance(app.screen, (RatingScreen, SelectionScreen))
        drive = app.document.session.bearing("Drive")
        assert drive.texts["c"] == "32.69 kN" and drive.texts["dm"] == "65 mm"
        # the geometry stays with the bearing, for the inside view (issue 16)
        assert drive.geometry == {"elements": "9", "dw": "12.7 mm", "dpw": "65 mm"}
        result = selected_result(app)
        assert result is not None and result.inputs.c == pytest.approx(C_FORMULA_N, rel=5e-4)
        await pilot.press("ctrl+z")
        await pilot.pause()
        assert app.document.session.bearing("Drive").texts["c"] == "30 kN"
        assert app.document.session.bearing("Drive").geometry == {}


async def test_a_pair_position_adopts_the_pair_of_a_rated_row_and_says_so() -> None:
    """One angular-contact row rated (i = 1) for a back-to-back position: the session bearing
    is the pair, C = 2^0.7·C and C0 = 2·C0 of the row (ISO 281:2007 §5.1, ISO 76:2006 §5.1);
    the rating of the same geometry in a single position is the row's own."""
    geometry = {"elements": "12", "dw": "12 mm", "dpw": "60 mm", "f0": "13"}
    pair = {"kind": "angular-contact", "arrangement": "back-to-back", "contact_angle": "40°",
            "c": "24 kN", "c0": "20 kN"}
    adopted = []
    for texts in (dict(pair, arrangement="single"), pair):
        app = ScreenHost(lambda texts=texts: RatingScreen("DE angular pair", texts, "SI",
                                                          geometry_now=geometry))
        async with app.run_test(size=(80, 24)) as pilot:
            await pilot.pause()
            screen = app.screen
            assert screen.adoption is not None
            message = str(screen.query_one("#rating-message").render())
            await pilot.press("f10")
            await pilot.pause()
            [adoption] = app.answers
            adopted.append((adoption, message))
    (single, single_message), (paired, pair_message) = adopted
    kn = lambda text: float(text.removesuffix(" kN"))  # noqa: E731
    assert single.note == "" and "pair" not in single_message
    assert kn(paired.texts["c"]) == pytest.approx(kn(single.texts["c"]) * 2 ** 0.7, rel=5e-4)
    assert kn(paired.texts["c0"]) == pytest.approx(kn(single.texts["c0"]) * 2, rel=5e-4)
    assert paired.note.startswith("rated for one bearing and adopted as a back-to-back pair of "
                                  "two: C = 2^0.7 × ")
    assert "ISO 281:2007 §5.1" in paired.note and paired.note in pair_message.replace("\n", " ")
