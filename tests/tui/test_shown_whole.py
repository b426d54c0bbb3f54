"""The case form at 80×24, the narrowest screen the workbench is made for, and at 120×40 (issue 17
item 5: nothing cut mid-word).  What each choice box paints is read off the screen and
compared with the chosen option's text: a fixed choice is shown whole, a name too long for the
box is shortened between words with an ellipsis, and the list that enter opens shows it whole.
The help line says the focused field in full."""

from __future__ import annotations

from pathlib import Path

import pytest

from screen_host import ELLIPSIS, choice_text, cut_widgets, painted, painted_choice
from tui_helpers import editor

from workbench.model.fields import FIELD_BY_NAME, parse_field
from workbench.model.session import Bearing, LoadCase, Session
from workbench.model.sessionfile import load_session
from workbench.tui.app import WorkbenchApp
from workbench.tui.case_form import FIELD_ORDER, CaseForm, field_help, takes_text
from workbench.tui.choice_box import ChoiceBox

SESSIONS = sorted((Path(__file__).parents[2] / "sessions").glob("*.toml"))
NARROW = (80, 24)
CHOICE_FIELDS = [name for name in FIELD_ORDER if not takes_text(name) and
                 (name == "bearing" or FIELD_BY_NAME[name].kind == "choice")]


def _app(session: Session, path: Path | None = None) -> WorkbenchApp:
    return WorkbenchApp(session, path, offer_recovery=False, autosave_delay=None)


async def _shown(pilot, form: CaseForm, name: str) -> tuple[str | None, str]:
    """(what the box of choice field ``name`` paints, the chosen option's text), the box
    scrolled into view first."""
    box = form.query_one(f"#field-{name}", ChoiceBox)
    form.scroll_to_widget(box, animate=False)
    await pilot.pause()
    return painted_choice(pilot.app.screen, box), choice_text(box)


@pytest.mark.parametrize("path", SESSIONS, ids=lambda p: p.stem)
async def test_every_case_shows_its_choices_whole_at_80x24(path: Path) -> None:
    app = _app(load_session(path), path)
    async with app.run_test(size=NARROW) as pilot:
        await pilot.pause()
        form = editor(app)
        for index in range(len(app.document.results)):
            await pilot.press("f3", "home", *["down"] * index)
            await pilot.pause()
            assert app.workbench_screen.selected == index
            for name in CHOICE_FIELDS:
                shown, chosen = await _shown(pilot, form, name)
                assert shown == chosen, (index, name)


async def test_every_fixed_choice_fits_the_narrow_form() -> None:
    """Every option of every fixed choice, not only those the sessions use: the form is no
    narrower below 80 columns (its pane's least width), so each fits wherever it is shown."""
    session = load_session(SESSIONS[0])
    app = _app(session)
    async with app.run_test(size=NARROW) as pilot:
        await pilot.pause()
        form = editor(app)
        for name in CHOICE_FIELDS:
            if name == "bearing":
                continue
            box = form.query_one(f"#field-{name}", ChoiceBox)
            for option in FIELD_BY_NAME[name].choices:
                if option not in box._legal_values:
                    box.set_options([(o, o) for o in FIELD_BY_NAME[name].choices])
                box.value = option
                shown, chosen = await _shown(pilot, form, name)
                assert (shown, chosen) == (option, option), name


async def test_a_long_bearing_name_is_shortened_between_words_and_listed_whole() -> None:
    name = "Wheel-end spindle pair, grinding side"
    session = Session(title="Long names", bearings=[Bearing(name, {
        "kind": "deep-groove", "c": "30 kN", "c0": "16 kN"})],
        cases=[LoadCase("Run", name, {"fr": "3 kN", "speed": "1500 rpm"})])
    app = _app(session)
    async with app.run_test(size=NARROW) as pilot:
        await pilot.pause()
        form = editor(app)
        shown, chosen = await _shown(pilot, form, "bearing")
        assert chosen == name
        assert shown is not None and shown.endswith(ELLIPSIS) and len(shown) < len(name)
        assert all(word in name.split() for word in shown.replace(ELLIPSIS, " ").split())
        box = form.query_one("#field-bearing", ChoiceBox)
        box.focus()
        await pilot.press("enter")
        await pilot.pause()
        listed = " ".join(painted(app.screen, box.query_one("SelectOverlay").content_region))
        assert name in " ".join(listed.split())


@pytest.mark.parametrize("size", [NARROW, (120, 40)], ids=lambda s: f"{s[0]}x{s[1]}")
async def test_the_help_line_says_each_field_in_full(make_app, size) -> None:
    """Issue 17 item 5: the full words of a field (its long label and hint) are on the help
    line when the field has the focus, at 80×24 and 120×40: no hint is cut."""
    app = make_app()
    async with app.run_test(size=size) as pilot:
        await pilot.pause()
        line = app.workbench_screen.query_one("#help-line")
        form = editor(app)
        for name in FIELD_ORDER:
            if app.workbench_screen.query_one(f"#field-{name}").disabled:
                continue  # not read for this kind: it takes no focus (its tooltip says why)
            app.workbench_screen.query_one(f"#field-{name}").focus()
            await pilot.pause()
            said = " ".join(painted(app.screen, line.content_region))
            assert said.split() == form.help_for(name).split(), name


async def test_the_help_line_names_the_case_once_the_focus_leaves_the_form(make_app) -> None:
    """Esc back to the list, or a pane's key, and the help line names the selected case again,
    under its new name after a rename (it kept the last field's words, or the old name)."""
    app = make_app()
    async with app.run_test(size=NARROW) as pilot:
        await pilot.pause()
        screen = app.workbench_screen
        line = screen.query_one("#help-line")

        def said() -> str:
            return " ".join(" ".join(painted(app.screen, line.content_region)).split())

        case = app.document.session.cases[0]
        assert said().startswith(f"{case.name} · bearing {case.bearing}")
        for leave in ("escape", "f6"):
            screen.query_one("#field-fr").focus()
            await pilot.pause()
            assert said().startswith("Radial load Fr")
            await pilot.press(leave)
            await pilot.pause()
            assert said().startswith(f"{case.name} · bearing {case.bearing}"), leave
        await pilot.press("escape", "f2", "ctrl+u", *"Renamed run", "enter")
        await pilot.pause()
        assert app.document.session.cases[0].name == "Renamed run"
        assert said().startswith("Renamed run · bearing")


@pytest.mark.parametrize("keys", [(), ("f6",), ("alt+e",)], ids=["main", "solver", "bearings"])
@pytest.mark.parametrize("path", SESSIONS, ids=lambda p: p.stem)
async def test_nothing_on_show_is_cut_at_80x24(path: Path, keys: tuple[str, ...]) -> None:
    """The main screen, its solver pane (whose search boxes had a placeholder of 17 characters
    in 13 columns) and the bearings list (whose seven columns were wider than 80)."""
    app = _app(load_session(path), path)
    async with app.run_test(size=NARROW) as pilot:
        await pilot.pause()
        await pilot.press(*keys)
        await pilot.pause()
        assert cut_widgets(app.screen) == []


async def test_the_session_notes_wrap_between_words_and_are_kept_as_they_were() -> None:
    """The details dialog (alt+i): the notes, several lines of a sentence each, were one text
    box cut at its edge mid-word; they wrap between words now, and keeping the dialog without
    an edit changes nothing."""
    path = next(p for p in SESSIONS if p.stem == "demo")
    app = _app(load_session(path), path)
    async with app.run_test(size=NARROW) as pilot:
        await pilot.pause()
        before = app.document.revision
        await pilot.press("alt+i")
        await pilot.pause()
        notes = app.screen.query_one("#detail-notes")
        words = app.document.session.notes.split()
        shown = " ".join(painted(app.screen, notes.scrollable_content_region)).split()
        assert len(shown) > 10 and shown == words[:len(shown)]
        await pilot.press("ctrl+s")
        await pilot.pause()
        assert app.screen is app.workbench_screen and app.document.revision == before


@pytest.mark.parametrize("name", ["fr", "speed", "temp", "contact_angle", "moment"])
def test_the_help_says_what_a_number_without_a_unit_means(name: str) -> None:
    # a newcomer typed "2" in Fr meaning kN and got 2 N with every check green, unwarned
    said = field_help(name)
    unit = said.rsplit("no unit means ", 1)[1]
    assert parse_field(name, "2") == pytest.approx(parse_field(name, f"2 {unit}"))
    assert parse_field(name, "2") == pytest.approx(parse_field(name, f"2{unit}"))
