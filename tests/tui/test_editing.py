"""Typing into the case editor: the derivation follows, bad text never takes effect."""

from __future__ import annotations

import html

import pytest
from textual.widgets import Checkbox, Select

from screen_host import painted
from tui_helpers import (choose, derivation_text, editor, paste_into, reference_derivation, retype, selected_result)

from workbench.engine.record import fmt
from workbench.model.fields import FIELD_BY_NAME
from workbench.model.quantities import format_quantity
from workbench.tui.case_form import field_help
from workbench.tui.case_table import CaseTable


async def test_typed_radial_load_changes_the_derivation(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "4 kN")
        await retype(pilot, app, "fa", "0")
        assert app.document.session.cases[0].texts["fr"] == "4 kN"
        result = selected_result(app)
        assert result is not None and result.derivation is not None
        reference = reference_derivation(app)
        assert result.derivation.results == reference.results
        # Closed form, ISO 281:2007 §6.1 and §7.1: with Fa = 0 the ball bearing's P = Fr and
        # L10 = (C/P)^3 = (30/4)^3 = 421.875 million revolutions; L10h = L10·10⁶/(60·n).
        assert result.derivation.results["P"] == pytest.approx(4000.0)
        assert result.derivation.results["L10"] == pytest.approx(421.875)
        assert result.derivation.results["L10h"] == pytest.approx(421.875e6 / (60 * 1500))
        shown = derivation_text(app)
        assert f"= {format_quantity(4000.0, 'force', 'SI')}" in shown
        assert f"= {fmt(reference.results['L10'])} × 10⁶ rev" in shown  # ISO 80000-1's "×"
        assert "Fa/Fr ≤ e" in shown


async def test_every_derivation_number_matches_the_engine(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(120, 40)) as pilot:
        await retype(pilot, app, "speed", "900 r/min")
        shown = derivation_text(app)
        reference = reference_derivation(app)
        for step in reference.steps:
            assert step.label in shown
            assert step.substituted in shown or step.substituted == step.value_text
            assert step.source in shown
        assert "branch: Fa/Fr > e" in shown


async def test_case_list_row_follows_typing(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "7 kN")
        row = app.workbench_screen.query_one(CaseTable).row_texts(0)
        reference = reference_derivation(app)
        assert row[0] == "Steady run"
        assert row[1] == format_quantity(reference.results["P"], "force", "SI")
        assert row[2] == fmt(reference.results['Lnm'])
        # Lnm below the 20 000 h target, s0 = 16/7 above 2: only the life is marked missed.
        assert reference.results["Lnm"] < 20000
        assert row[4] == "L✘ s0✔"


def note_shown(app, field: str) -> bool:
    """Whether the note line under ``field`` is on show."""
    notes = app.workbench_screen.query(f"#note-{field}")
    return bool(notes) and notes.first().display


BAD_TEXTS = [
    ("nan", "not a finite number"),
    ("-3 kN", "must not be negative"),
    ("5 kg", "a mass, not a force"),
    ("9**9**9 kN", "not of the form number [unit]"),
]


@pytest.mark.parametrize(("text", "words"), BAD_TEXTS)
async def test_bad_typed_value_keeps_the_last_valid_one(make_app, text: str, words: str) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        before = derivation_text(app)
        await retype(pilot, app, "fr", text)
        assert app.document.session.cases[0].texts["fr"] == "3 kN"
        message = editor(app).message_for("fr")
        assert message is not None and words in message
        assert note_shown(app, "fr")  # drawn under the field
        assert derivation_text(app) == before
        await retype(pilot, app, "fr", "3.5 kN")
        assert editor(app).message_for("fr") is None
        assert not note_shown(app, "fr")
        assert app.document.session.cases[0].texts["fr"] == "3.5 kN"


@pytest.mark.parametrize(("text", "words"), [
    ("1" * 10_000, "too long"),
    ("3\x07 kN", "control character"),
    ("\x1b[2J3 kN", "control character"),
    ("3 kN\x00", "control character"),
])
async def test_pasted_junk_keeps_the_last_valid_value(make_app, text: str, words: str) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        before = derivation_text(app)
        await paste_into(pilot, app, "fa", text)
        assert app.document.session.cases[0].texts["fa"] == "1 kN"
        message = editor(app).message_for("fa")
        assert message is not None and words in message
        assert derivation_text(app) == before
        assert app.is_running


async def test_engine_refusal_is_shown_beside_its_field(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "reliability", "0.9999")
        # ISO 281:2007 Table 12 gives a1 from 90 % to 99.95 % reliability only.
        message = editor(app).message_for("reliability")
        assert message is not None and "0.9995" in message
        assert selected_result(app) is not None and selected_result(app).derivation is not None


async def test_nudge_keeps_the_unit_and_the_derivation_follows(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "3.2 kN")
        await pilot.press("ctrl+up")
        await pilot.pause()
        assert app.document.session.cases[0].texts["fr"] == "3.36 kN"
        await pilot.press("ctrl+shift+down")
        await pilot.pause()
        assert app.document.session.cases[0].texts["fr"] == "3.326 kN"  # 3.36 × 0.99 = 3.3264
        reference = reference_derivation(app)
        assert selected_result(app).derivation.results == reference.results
        assert format_quantity(reference.results["P"], "force", "SI") in derivation_text(app)
        await pilot.press("ctrl+down")
        await pilot.pause()
        assert app.document.session.cases[0].texts["fr"] == "3.16 kN"  # × 0.95 = 3.1597


async def test_units_switch_formats_results_and_keeps_typed_text(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        p = selected_result(app).derivation.results["P"]
        await pilot.press("alt+u")
        await pilot.pause()
        assert app.document.session.units == "US"
        # pint: 1 lbf = 4.4482216152605 N (international avoirdupois pound, standard gravity).
        assert f"{fmt(p / 4.4482216152605)} lbf" in derivation_text(app)
        assert app.document.session.cases[0].texts["fr"] == "3 kN"
        assert editor(app).field_text("fr") == "3 kN"
        await pilot.press("alt+u")
        await pilot.pause()
        assert app.document.session.units == "SI"


async def test_choice_and_switch_fields_write_texts(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await choose(pilot, app, "outer_ring_rotates")
        await pilot.press("space")
        await pilot.pause()
        assert app.document.session.cases[0].texts["outer_ring_rotates"] == "yes"
        assert editor(app).field_text("outer_ring_rotates") == "yes"
        assert "Rotation factor" in derivation_text(app)
        await pilot.press("space")
        await pilot.pause()
        assert app.document.session.cases[0].texts["outer_ring_rotates"] == "no"
        await choose(pilot, app, "static_duty")
        await pilot.press("enter")  # opens the list
        await pilot.pause()
        assert app.workbench_screen.query_one("#field-static_duty", Select).expanded
        await pilot.press("down", "down", "down", "enter")  # (default), quiet, normal, shock
        await pilot.pause()
        assert app.document.session.cases[0].texts["static_duty"] == "shock"


async def test_choice_field_steps_with_arrows_and_chooses_from_its_list(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await choose(pilot, app, "static_duty")
        await pilot.press("right")  # from blank (the default) to the first choice
        await pilot.pause()
        first = FIELD_BY_NAME["static_duty"].choices[0]
        assert app.document.session.cases[0].texts["static_duty"] == first
        await pilot.press("left")  # back to blank: the default again
        await pilot.pause()
        assert app.document.session.cases[0].texts.get("static_duty", "") == ""
        await pilot.press("right", "right")  # the first choice, then the second
        await pilot.pause()
        second = FIELD_BY_NAME["static_duty"].choices[1]
        assert app.document.session.cases[0].texts["static_duty"] == second
        await pilot.press("enter")
        await pilot.pause()
        await pilot.press("up", "escape")  # escape keeps the value in force
        await pilot.pause()
        assert app.document.session.cases[0].texts["static_duty"] == second
        assert editor(app).field_text("static_duty") == second


async def test_kind_chosen_changes_the_derivation(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await choose(pilot, app, "kind")
        kinds = FIELD_BY_NAME["kind"].choices
        steps = (kinds.index("cylindrical") - kinds.index("deep-groove")) % len(kinds)
        await pilot.press(*["right"] * steps)
        await pilot.pause()
        assert app.document.session.bearing("Drive").texts["kind"] == "cylindrical"
        await retype(pilot, app, "fa", "0")  # a cylindrical roller bearing here takes no Fa
        result = selected_result(app)
        assert result is not None and result.derivation is not None
        # ISO 281:2007 §7.1: L10 = (C/P)^p with p = 10/3 for a roller bearing; C = 30 kN and,
        # with Fa = 0, P = Fr
        fr = result.derivation.results["P"]
        assert result.derivation.results["L10"] == pytest.approx((30000.0 / fr) ** (10 / 3))


async def test_bearing_field_edit_updates_every_case_on_that_bearing(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "c", "40 kN")
        assert app.document.session.bearing("Drive").texts["c"] == "40 kN"
        peak = app.document.results[1]
        assert peak.inputs is not None and peak.inputs.c == pytest.approx(40_000.0)
        row = app.workbench_screen.query_one(CaseTable).row_texts(1)
        assert row[2] == fmt(peak.derivation.results['Lnm'])


async def test_names_that_look_like_markup_are_shown_as_written(make_app) -> None:
    app = make_app()
    session = app.document.session
    session.title = "[/] rig [bold"
    session.bearings[0].name = "[red]B"
    for case in session.cases[:2]:
        case.bearing = "[red]B"
    session.cases[0].name = "[/]"
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("f2")
        await pilot.pause()
        app.screen.query_one("Input").value = "[b]x[/b"
        await pilot.press("enter")
        await pilot.pause()
        await pilot.press("ctrl+d", "f8")
        await pilot.pause()
        assert app.document.session.cases[0].name == "[b]x[/b"
        assert app.workbench_screen.query_one(CaseTable).row_texts(0)[0] == "[b]x[/b"
        await retype(pilot, app, "fr", "3 [unit]")
        assert "[unit]" in (editor(app).message_for("fr") or "")
        assert "[unit]" in str(app.workbench_screen.query_one("#note-fr").render())
        assert app.is_running


async def test_derivation_keeps_its_scroll_place_when_redrawn(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        pane = app.workbench_screen.query_one("#derivation-view")
        pane.scroll_to(y=30, animate=False)
        await pilot.pause()
        assert pane.scroll_y == 30
        await retype(pilot, app, "fa", "1.2 kN")
        assert app.document.session.cases[0].texts["fa"] == "1.2 kN"
        assert pane.scroll_y == 30


async def test_keys_typed_ahead_of_the_screen_are_kept(make_app) -> None:
    """A key that reaches the field before the screen has answered the one before it stays:
    loading the form (as the answer to the earlier key does) never puts an older text back."""
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "4 kN")
        box = app.workbench_screen.query_one("#field-fr")
        box.value = "4.5 kN"  # typed; its change has not reached the form yet
        editor(app).load()  # the screen answers an earlier edit: the form loads
        assert box.value == "4.5 kN"
        box.cursor_position = 3
        box.insert_text_at_cursor("0")  # and the next key lands on the newer text
        for _ in range(3):
            await pilot.pause()
        assert box.value == "4.50 kN"
        assert app.document.session.cases[0].texts["fr"] == "4.50 kN"
        await pilot.press("ctrl+z")  # an undo still shows in the field it changes
        await pilot.pause()
        assert box.value == app.document.session.cases[0].texts["fr"] != "4.50 kN"


@pytest.mark.parametrize("size", [(80, 24), (120, 40)])
async def test_a_note_under_a_field_leaves_no_blank_rows(make_app, size) -> None:
    """The message of a refused text spans the group's two columns; the next field follows its
    last line at once (Textual's grid measured the note at one column's width)."""
    app = make_app()
    async with app.run_test(size=size) as pilot:
        await pilot.pause()
        await retype(pilot, app, "fr", "abc")
        await pilot.pause()
        screen = app.workbench_screen
        note = screen.query_one("#note-fr")
        assert note.region.height >= 1
        assert note.region.width == screen.query_one("#field-fr").parent.region.width
        assert screen.query_one("#field-fa").region.y == note.region.bottom


async def test_a_switch_says_what_is_in_force_on_and_off(make_app) -> None:
    """The words beside the outer-ring switch follow it (ISO 281's rotation factor: V = 1.2
    with the outer ring rotating, else 1), so they read right without colour."""
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        box = app.workbench_screen.query_one("#field-outer_ring_rotates")
        assert not box.value and str(box.label) == "V = 1"
        await choose(pilot, app, "outer_ring_rotates")
        await pilot.press("space")
        await pilot.pause()
        assert app.document.session.cases[0].texts.get("outer_ring_rotates") in ("yes", "true")
        assert box.value and str(box.label) == "V = 1.2"
        await pilot.press("ctrl+z")
        await pilot.pause()
        assert not box.value and str(box.label) == "V = 1"


async def test_a_run_of_undos_shows_one_notice_the_last(make_app) -> None:
    # five undos in a row once stacked five three-line notices over the panes, top to bottom
    app = make_app()
    fields = {"fr": "3.1 kN", "fa": "1.1 kN", "speed": "900 rpm", "af": "1.3", "temp": "55 °C"}
    async with app.run_test(size=(80, 24), notifications=True) as pilot:
        for name, text in fields.items():
            assert app.document.set_field(0, name, text) is None
            app.document.end_run()
        for _ in fields:
            await pilot.press("ctrl+z")
            await pilot.pause()
        shown = html.unescape(app.export_screenshot()).replace("\xa0", " ")
    labels = [FIELD_BY_NAME[name].label for name in fields]
    assert f"Undone: edit {labels[0]}" in shown  # the last undone: the first edit
    assert sum(f"Undone: edit {label}" in shown for label in labels) == 1


async def test_fields_a_kind_does_not_read_are_shown_not_used(make_app) -> None:
    """What the engine reads per kind (``engine.kinds.unread_inputs``, checked against
    ``derive`` in tests/engine/test_derive.py): a cylindrical roller bearing has α = 0 and
    P = V·Fr (ISO 281:2007 §7.2), so its contact angle, e, Y and f0 are disabled, with the
    reason in the tooltip and on the help line while the kind is chosen; a deep-groove bearing
    reads f0 (Table 3 by f0·Fa/C0r) and its contact angle (the inside view), not e or Y."""
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        screen = app.workbench_screen
        inert = ("contact_angle", "e_given", "y_given", "f0")

        def disabled() -> dict[str, bool]:
            return {name: screen.query_one(f"#field-{name}").disabled for name in inert}

        await pilot.pause()
        assert disabled() == {"contact_angle": False, "e_given": True, "y_given": True,
                              "f0": False}
        assert "not used for a deep-groove ball bearing" in str(
            screen.query_one("#field-e_given").tooltip)
        await choose(pilot, app, "kind")
        kinds = FIELD_BY_NAME["kind"].choices
        steps = kinds.index("cylindrical") - kinds.index("deep-groove")
        await pilot.press(*["right"] * steps)
        await pilot.pause()
        assert app.document.session.bearing("Drive").texts["kind"] == "cylindrical"
        assert all(disabled().values())
        assert "α = 0" in str(screen.query_one("#field-contact_angle").tooltip)
        assert screen.query_one("#label-f0").has_class("-unread")
        line = screen.query_one("#help-line")
        help_line = " ".join(" ".join(painted(app.screen, line.content_region)).split())
        assert "not used for a cylindrical roller bearing" in help_line
        assert "Maker's e" in help_line and "f0" in help_line
        await pilot.press("down")  # the next open field: the arrangement, then C
        await pilot.press("down", "down", "down")
        await pilot.pause()
        assert editor(app).focused_field() == "dm"  # past C0, over the four not used
        await pilot.press(*["ctrl+z"] * steps)  # each kind chosen was an undo step
        await pilot.pause()
        assert app.document.session.bearing("Drive").texts["kind"] == "deep-groove"
        assert not disabled()["f0"] and not screen.query_one("#label-f0").has_class("-unread")
        assert str(screen.query_one("#field-f0").tooltip) == field_help("f0")


async def test_a_switch_that_is_off_shows_an_empty_box(make_app) -> None:
    # Textual draws "▐X▌" on and off alike: "Outer ring rotates ▐X▌ V = 1" read as ticked
    app = make_app()
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        switch = app.workbench_screen.query_one("#field-outer_ring_rotates", Checkbox)
        assert not switch.value
        assert switch.render().plain.startswith("▐ ▌")
        switch.focus()
        await pilot.press("space")
        await pilot.pause()
        assert switch.value and switch.render().plain.startswith("▐X▌")
        assert app.document.texts(app.workbench_screen.selected)["outer_ring_rotates"] != ""
