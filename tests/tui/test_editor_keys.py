"""Moving about the case editor: the cursor, the one text box, switches, leaving the form."""

from __future__ import annotations

from textual import events

from tui_helpers import choose, editor, mounted_text_box, retype, text_box

from workbench.tui.case_editor import FIELD_ORDER, LABEL_WIDTH, FieldSheet
from workbench.tui.case_list import CaseList


async def test_arrows_move_the_cursor_through_every_field(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        box = await mounted_text_box(pilot, app)
        await pilot.press("f4")
        await pilot.pause()
        assert editor(app).focused_field() == "kind"
        visited = ["kind"]
        sheet = app.workbench_screen.query_one(FieldSheet)
        for _ in FIELD_ORDER:
            await pilot.press("down")
            await pilot.pause()
            visited.append(editor(app).focused_field())
            # the cursor's line is in view (a focus change must not scroll the sheet's top back)
            lines = editor(app).sheet_text.split("\n")
            line = next(i for i, text in enumerate(lines) if text.startswith("▸"))
            top = editor(app).scroll_offset.y
            assert top <= line < top + editor(app).scrollable_content_region.height, line
            assert sheet.region.y <= box.region.y or not box.display
            if editor(app).focused_field() in ("c", "fr"):  # typed: the box has the keys
                assert box.has_focus and box.display
        assert visited[-1] == FIELD_ORDER[-1]  # the last field holds the cursor
        assert [name for name in FIELD_ORDER[1:] if name not in visited] == []
        await pilot.press("up")
        await pilot.pause()
        assert editor(app).focused_field() == FIELD_ORDER[-2]


async def test_tab_leaves_the_form_after_its_last_field_and_shift_tab_before_its_first(
        make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, FIELD_ORDER[-1], "2.5")
        await pilot.press("tab")
        await pilot.pause()
        assert editor(app).focused_field() is None
        assert app.focused is not None and app.focused not in (editor(app).query("*"))
        await choose(pilot, app, "kind")
        await pilot.press("shift+tab")  # to the bearing row, the first
        await pilot.pause()
        assert editor(app).focused_field() is None  # the bearing row is not an input
        await pilot.press("shift+tab")
        await pilot.pause()
        assert isinstance(app.focused, CaseList)


async def test_the_text_box_follows_its_field_below_a_message(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "5 kg")  # refused: a message line under Fr
        box = await mounted_text_box(pilot, app)
        editor(app).focus_field("fa")
        await pilot.pause()
        lines = editor(app).sheet_text.split("\n")
        line = next(i for i, text in enumerate(lines) if text[1:].startswith("Axial load Fa"))
        above = next(i for i, text in enumerate(lines) if text[1:].startswith("Radial load Fr"))
        assert lines[above + 1].startswith("   ✘ ") and line > above + 1
        assert box.region.y - app.workbench_screen.query_one(FieldSheet).region.y == line
        assert box.value == "1 kN"


async def test_a_click_on_a_switch_flips_it(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(120, 40)) as pilot:
        await mounted_text_box(pilot, app)
        lines = editor(app).sheet_text.split("\n")
        line = next(i for i, text in enumerate(lines) if "Outer ring rotates" in text)
        assert "[ ] no" in lines[line]
        await pilot.click(FieldSheet, offset=(LABEL_WIDTH + 1, line))
        await pilot.pause()
        assert app.workbench.session.cases[0].texts["outer_ring_rotates"] == "yes"
        assert "[x] yes" in editor(app).sheet_text


async def test_a_session_without_cases_shows_the_note_and_ignores_keys(make_app) -> None:
    app = make_app(cases=0)
    async with app.run_test(size=(80, 24)) as pilot:
        await mounted_text_box(pilot, app)
        await pilot.press("f4", "down", "right", "enter", "space", "x", "tab")
        await pilot.pause()
        assert "No load case selected" in editor(app).sheet_text
        assert editor(app).focused_field() is None
        assert app.is_running


async def test_keys_typed_in_a_burst_are_all_kept(make_app) -> None:
    # Keys can arrive in a burst (a slow SSH link delivers them so): the bound editing keys
    # (end, ctrl+u, backspace) must act in order among the characters, and the screen's answer
    # to "7 r" (refused: no such unit, a message line drawn) must not hand the box back a text
    # it has moved on from.
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        box = await text_box(pilot, app, "speed")
        burst = [("end", None), ("ctrl+u", None), ("8", "8"), ("backspace", None)]
        burst += [(character if character != " " else "space", character)
                  for character in "7 rpm"]
        for key, character in burst:
            app.post_message(events.Key(key, character))
        for _ in range(3):
            await pilot.pause()
        assert box.value == "7 rpm"
        assert app.workbench.session.cases[0].texts["speed"] == "7 rpm"
        assert editor(app).message_for("speed") is None
        await pilot.press("down")  # the sheet then shows what the box held
        await pilot.pause()
        assert "Speed n            7 rpm" in editor(app).sheet_text
