"""Every key in the table does what its footer words say; the palette offers every one."""

from __future__ import annotations

from collections.abc import Awaitable, Callable

import pytest
from textual import events
from textual._xterm_parser import XTermParser
from textual.widgets import Input, TabbedContent

from screen_host import column_texts
from tui_helpers import editor, retype, selected, text_box

from workbench.tui.about_screen import AboutScreen
from workbench.tui.bearings_screen import BearingsScreen
from workbench.tui.actions import ACTIONS, check_keymap
from workbench.tui.app import WorkbenchApp
from workbench.tui.commands import WorkbenchCommands
from workbench.tui.dialogs import ChoiceDialog, TextPrompt
from workbench.tui.help_screen import HelpScreen
from workbench.tui.open_dialog import OpenDialog
from workbench.tui.session_screen import SessionScreen
from workbench.tui.shaft_editor import DutyEditor, ShaftEditor
from workbench.tui.key_footer import KeyFooter
from workbench.tui.selection_screen import SelectionScreen
from workbench.tui.shafts_screen import ShaftsScreen

Check = Callable[..., Awaitable[None]]


def first_key(action_id: str) -> str:
    """The first key of an action in the table."""
    return next(a for a in ACTIONS if a.id == action_id).keys.split(",")[0]


async def press(pilot, action_id: str) -> None:
    """Press the action's first key, or run it from the palette when it has none."""
    action = next(a for a in ACTIONS if a.id == action_id)
    if action.keys:
        await pilot.press(first_key(action_id))
    else:
        await pilot.press("ctrl+p")
        await pilot.pause()
        await pilot.press(*action.title, "enter")
        await pilot.pause()
    await pilot.pause()


async def check_help(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "app.help")
    assert isinstance(app.screen, HelpScreen)
    shown = [" ".join(title.split()) for title in column_texts(app.screen.query_one("#help-keys"), 1)]
    assert all(action.title in shown for action in ACTIONS)  # a long title wraps at 80 columns


async def check_about(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "app.about")
    assert isinstance(app.screen, AboutScreen)
    from workbench.model.caution import SAFETY_CAUTION
    assert str(app.screen.query_one("#about-caution").render()) == SAFETY_CAUTION


async def check_save(pilot, app: WorkbenchApp, calls) -> None:
    await press(pilot, "file.save")  # no file yet: asks for a name
    assert isinstance(app.screen, TextPrompt)
    await pilot.press("enter")
    await pilot.pause()
    assert any(call[0] == "save" for call in calls) and not app.document.dirty


async def check_save_as(pilot, app: WorkbenchApp, calls) -> None:
    await press(pilot, "file.save_as")
    assert isinstance(app.screen, TextPrompt)
    app.screen.query_one(Input).value = "elsewhere.toml"
    await pilot.press("enter")
    await pilot.pause()
    assert ("save", app.document.path) in calls and app.document.path.name == "elsewhere.toml"


async def check_open(pilot, app: WorkbenchApp, calls) -> None:
    await press(pilot, "file.open")
    assert isinstance(app.screen, OpenDialog)
    app.screen.query_one(Input).value = "README.md"  # there, but (here) not readable
    await pilot.press("enter")
    await pilot.pause()
    assert calls[-1][0] == "open" and app.is_running  # the failure is a notice, not a crash


async def check_undo_redo(pilot, app: WorkbenchApp) -> None:
    await retype(pilot, app, "fr", "4 kN")
    await pilot.press("f3")
    await press(pilot, "edit.undo")
    assert app.document.session.cases[0].texts["fr"] == "3 kN"
    await press(pilot, "edit.redo")
    assert app.document.session.cases[0].texts["fr"] == "4 kN"


async def check_add(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "case.add")
    assert len(app.document.session.cases) == 4 and selected(app) == 1


async def check_duplicate(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "case.duplicate")
    cases = app.document.session.cases
    assert cases[1].name == "Steady run copy" and cases[1].texts == cases[0].texts


async def check_rename(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "case.rename")
    assert isinstance(app.screen, TextPrompt)
    app.screen.query_one(Input).value = "Peak torque"  # taken: refused in the dialog
    await pilot.press("enter")
    await pilot.pause()
    assert isinstance(app.screen, TextPrompt)
    app.screen.query_one(Input).value = "Cruise"
    await pilot.press("enter")
    await pilot.pause()
    assert app.document.session.cases[0].name == "Cruise"


async def check_delete(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "case.delete")
    assert [c.name for c in app.document.session.cases] == ["Peak torque", "Idler end"]
    await press(pilot, "edit.undo")
    assert app.document.session.cases[0].name == "Steady run"


async def check_move(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "case.move_down")
    assert app.document.session.cases[1].name == "Steady run" and selected(app) == 1
    await press(pilot, "case.move_up")
    assert app.document.session.cases[0].name == "Steady run"


def _nudge_check(action_id: str, expected: str) -> Check:
    async def check(pilot, app: WorkbenchApp) -> None:
        await text_box(pilot, app, "fa")
        await press(pilot, action_id)
        assert app.document.session.cases[0].texts["fa"] == expected
    return check


async def solved(pilot, app: WorkbenchApp) -> None:
    """Press solve, and wait for the worker's answer."""
    await press(pilot, "view.solver")  # the pane mounts when first shown
    await press(pilot, "solver.solve")
    for _ in range(50):
        await app.workers.wait_for_complete()
        await pilot.pause()
        if app.document.solved is not None:
            return


async def check_solve(pilot, app: WorkbenchApp) -> None:
    await solved(pilot, app)
    assert app.document.solved is not None
    assert app.workbench_screen.query_one(TabbedContent).active == "solver"


async def check_apply(pilot, app: WorkbenchApp) -> None:
    await solved(pilot, app)
    await press(pilot, "solver.apply")
    assert app.document.session.bearing("Drive").texts["c"] != "30 kN"


async def check_units(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "view.units")
    assert app.document.session.units == "US"


def _pane_check(action_id: str, pane: str) -> Check:
    async def check(pilot, app: WorkbenchApp) -> None:
        await press(pilot, "view.solver" if pane == "derivation" else "view.derivation")
        await press(pilot, action_id)
        assert app.workbench_screen.query_one(TabbedContent).active == pane
        focused = app.focused
        assert focused is not None and pane in {n.id for n in focused.ancestors_with_self}
    return check


async def check_catalog(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "bearing.catalog")
    assert isinstance(app.screen, SelectionScreen) and app.screen.bearing == "Drive"


async def check_shafts(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "view.shafts")
    assert isinstance(app.screen, ShaftsScreen)


async def check_focus_cases(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "focus.editor")
    await press(pilot, "focus.cases")
    assert app.focused is not None and app.focused.id == "cases"


async def check_focus_editor(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "focus.editor")
    assert editor(app).focused_field() == "bearing"


async def check_bearings(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "bearing.manage")
    assert isinstance(app.screen, BearingsScreen)


async def check_add_bearing(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "bearing.add")
    assert isinstance(app.screen, BearingsScreen) and len(app.document.session.bearings) == 3


async def check_details(pilot, app: WorkbenchApp) -> None:
    await press(pilot, "session.details")
    assert isinstance(app.screen, SessionScreen)


def _table_check(action_id: str, screen: type) -> Check:
    async def check(pilot, app: WorkbenchApp) -> None:
        await press(pilot, action_id)
        assert isinstance(app.screen, screen)
        tables = "shafts" if screen is ShaftEditor else "duty_cycles"
        assert len(app.document.tables(tables)) == 1  # none yet: one is added to edit
    return check


async def check_duty_edit(pilot, app: WorkbenchApp) -> None:
    """With no duty cycle yet, alt+y adds none (the palette's "Add a new duty cycle" does):
    it says how to add one; with one, it opens it."""
    await press(pilot, "duty.edit")
    assert app.screen is app.workbench_screen and app.document.tables("duty_cycles") == []
    assert "Add a new duty cycle" in " ".join(str(n.message) for n in app._notifications)
    await press(pilot, "duty.add")
    await pilot.press("escape")
    await press(pilot, "duty.edit")
    assert isinstance(app.screen, DutyEditor) and len(app.document.tables("duty_cycles")) == 1


async def check_report(pilot, app: WorkbenchApp) -> None:
    from workbench.tui.report_screen import ReportScreen

    await press(pilot, "report.write")
    assert isinstance(app.screen, ReportScreen)


async def check_theme(pilot, app: WorkbenchApp) -> None:
    before = app.theme
    await press(pilot, "app.theme")
    assert app.theme != before


async def check_quit(pilot, app: WorkbenchApp) -> None:
    await retype(pilot, app, "fr", "4 kN")
    await press(pilot, "app.quit")
    assert isinstance(app.screen, ChoiceDialog)  # unsaved work: asks first
    await pilot.press("escape")
    await pilot.pause()
    assert app.is_running
    app.document.saved_revision = app.document.revision  # as if saved
    await press(pilot, "app.quit")
    assert app.return_value == 0


CHECKS: dict[str, Check] = {
    "app.help": check_help,
    "app.about": check_about,
    "file.save": check_save,
    "file.save_as": check_save_as,
    "file.open": check_open,
    "edit.undo": check_undo_redo,
    "edit.redo": check_undo_redo,
    "case.add": check_add,
    "case.duplicate": check_duplicate,
    "case.rename": check_rename,
    "case.delete": check_delete,
    "case.move_up": check_move,
    "case.move_down": check_move,
    # ±5 % and ±1 % of "1 kN", the unit kept (1 × 1.05, 1 × 0.95, 1 × 1.01, 1 × 0.99).
    "whatif.up5": _nudge_check("whatif.up5", "1.05 kN"),
    "whatif.down5": _nudge_check("whatif.down5", "0.95 kN"),
    "whatif.up1": _nudge_check("whatif.up1", "1.01 kN"),
    "whatif.down1": _nudge_check("whatif.down1", "0.99 kN"),
    "solver.solve": check_solve,
    "solver.apply": check_apply,
    "view.units": check_units,
    "view.derivation": _pane_check("view.derivation", "derivation"),
    "view.solver": _pane_check("view.solver", "solver"),
    "view.whatif": _pane_check("view.whatif", "whatif"),
    "view.inside": _pane_check("view.inside", "inside"),
    "bearing.catalog": check_catalog,
    "view.shafts": check_shafts,
    "focus.cases": check_focus_cases,
    "focus.editor": check_focus_editor,
    "app.theme": check_theme,
    "bearing.manage": check_bearings,
    "report.write": check_report,
    "bearing.add": check_add_bearing,
    "session.details": check_details,
    "shaft.edit": _table_check("shaft.edit", ShaftEditor),
    "shaft.add": _table_check("shaft.add", ShaftEditor),
    "duty.edit": check_duty_edit,
    "duty.add": _table_check("duty.add", DutyEditor),
    "app.quit": check_quit,
}


def test_every_action_has_a_check_and_a_unique_id() -> None:
    ids = [action.id for action in ACTIONS]
    assert len(ids) == len(set(ids))
    assert set(ids) == set(CHECKS)


@pytest.mark.parametrize("action_id", [action.id for action in ACTIONS])
async def test_binding_does_what_it_says(make_app, no_disk, action_id: str) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        check = CHECKS[action_id]
        if check in (check_save, check_save_as, check_open):
            await check(pilot, app, no_disk)
        else:
            await check(pilot, app)


async def test_footer_shows_every_screen_action(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(200, 24)) as pilot:
        await pilot.pause()
        shown = {binding.id for _, binding, _, _ in app.screen.active_bindings.values()
                 if binding.show}
        assert {a.id for a in ACTIONS if a.keys} <= shown  # the rest: palette commands only


async def test_palette_offers_every_action(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        provider = WorkbenchCommands(app.screen)
        titles = [hit.text async for hit in provider.discover()]
        assert len(titles) == len(ACTIONS)
        hits = [hit async for hit in provider.search("duplicate")]
        assert hits and "Duplicate" in str(hits[0].match_display)
        await pilot.press("ctrl+p")
        await pilot.pause()
        await pilot.press(*"Add case", "enter")
        await pilot.pause()
        await pilot.pause()
        assert len(app.document.session.cases) == 4


async def test_footer_click_presses_the_key_under_it(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(120, 24)) as pilot:
        await pilot.pause()
        footer = app.screen.query_one(KeyFooter)
        column = footer.text.index("Add case")
        await pilot.click(KeyFooter, offset=(column, 0))
        await pilot.pause()
        assert len(app.document.session.cases) == 4


async def test_footer_wheel_brings_the_cut_off_keys_into_view(make_app) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        footer = app.screen.query_one(KeyFooter)
        assert "Quit" not in str(footer.render())
        seen = []
        for _ in range(80):
            footer.post_message(events.MouseScrollDown(footer, 1, 0, 0, 1, 0, False, False, False))
            await pilot.pause()
            seen.append(str(footer.render()))
        assert any("^q Quit" in line for line in seen)
        assert not any(line.startswith(("it ", "uit ")) for line in seen)  # keys shown whole


def test_key_table_keeps_known_actions_and_names_what_it_refuses() -> None:
    keymap, problems = check_keymap({"case.add": "ctrl+a", "case.nothing": "f3",
                                     "file.save": 5, "view.units": "f3"})
    assert keymap == {"case.add": "ctrl+a", "view.units": "f3"}
    assert any("'case.nothing' is not an action" in line for line in problems)
    assert any(line.startswith("file.save: keys must be a text") for line in problems)
    # f3 already goes to the case list (focus.cases): the clash is named
    assert any(line.startswith("f3 is claimed by") and "focus.cases" in line
               for line in problems)


async def test_key_table_moves_an_action_to_the_persons_key(make_app, private_config) -> None:
    private_config.mkdir(parents=True, exist_ok=True)
    (private_config / "keys.toml").write_text('"case.add" = "ctrl+k"\n"no.such" = "f3"\n',
                                              encoding="utf-8")
    app = make_app()
    async with app.run_test(size=(120, 30)) as pilot:
        await pilot.pause()
        await pilot.press("ctrl+k")
        await pilot.pause()
        assert len(app.document.session.cases) == 4
        await pilot.press("ctrl+n")  # the old key no longer adds a case
        await pilot.pause()
        assert len(app.document.session.cases) == 4
        assert "^k Add case" in app.screen.query_one(KeyFooter).text
        assert any("'no.such' is not an action" in note.message
                   for note in app.notices_given)
        await pilot.press("f1")
        await pilot.pause()
        assert isinstance(app.screen, HelpScreen)
        assert "ctrl+k" in column_texts(app.screen.query_one("#help-keys"), 0)


async def test_unreadable_key_table_is_reported_and_the_keys_stay(make_app, private_config) -> None:
    private_config.mkdir(parents=True, exist_ok=True)
    (private_config / "keys.toml").write_text('"case.add" = \n', encoding="utf-8")
    app = make_app()
    async with app.run_test(size=(120, 30)) as pilot:
        await pilot.pause()
        assert any("keys.toml" in note.message and "not used" in note.message
                   for note in app.notices_given)
        await pilot.press("ctrl+n")
        await pilot.pause()
        assert len(app.document.session.cases) == 4


def test_no_alt_key_is_one_the_terminal_parser_takes_for_another() -> None:
    """ESC b and ESC f (alt+b, alt+f) reach Textual as ctrl+left and ctrl+right (word moves), so
    no action may sit on them; ESC and any other letter arrive as alt+letter (seen in tmux)."""
    keys = {key.strip() for action in ACTIONS for key in action.keys.split(",") if key}
    assert not keys & {"alt+b", "alt+f"}


@pytest.mark.parametrize(("action_id", "sequence"), [
    ("app.about", "\x1b[1;2P"),  # shift+f1 as xterm sends it (Textual reads it as f13)
    ("case.move_down", "\x1b[1;3B"),  # alt+down, xterm's modifier-3 cursor key
    ("case.delete", "\x1b[3;5~"),  # ctrl+delete
    ("whatif.up1", "\x1b[1;6A"),  # ctrl+shift+up
    ("view.whatif", "\x1b[18~"),  # f7
    ("view.inside", "\x1b[19~"),  # f8
    ("case.delete", "\x1b[3;2~"),  # shift+delete
])
async def test_keys_arrive_as_a_terminal_sends_them(make_app, action_id: str,
                                                    sequence: str) -> None:
    """The keys of the table as Textual's own terminal parser turns the bytes into key names."""
    keys = [event for event in XTermParser().feed(sequence) if isinstance(event, events.Key)]
    assert len(keys) == 1
    action = next(a for a in ACTIONS if a.id == action_id)
    assert keys[0].key in [key.strip() for key in action.keys.split(",")]


async def test_the_palette_lists_one_theme_command(make_app) -> None:
    """Textual's own "Theme" (every registered theme) is left out beside the workbench's
    (alt+t, the project's four themes), and its "Quit" (our guarded quit again): the palette,
    opened with nothing typed, lists one of each."""
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        screen = app.screen
        titles = []
        for provider_type in (*app.COMMANDS, *screen.COMMANDS):
            provider = (provider_type() if not isinstance(provider_type, type)
                        else provider_type)(screen)
            titles += [str(hit.text) async for hit in provider.discover()]
        names = [title.split("  (")[0] for title in titles]
        assert titles[names.index("Theme")] == f"Theme  ({first_key('app.theme')})"
        assert names.count("Theme") == 1 and names.count("Quit") == 1  # Textual's ran ours
        assert "Screenshot" in names  # Textual's others stay
