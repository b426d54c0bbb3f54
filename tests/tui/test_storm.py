"""A seeded storm of keys, pastes and resizes across every screen (issue 18, item 5): the screen
never dies, and the session it holds stays sound.  A modest run here (one seed of about 1,200
keys); ``python -m tools.storm --seeds 1 2 3 --keys 5000`` runs long ones from chosen seeds
through the same test (the variables below), outside the suite."""

from __future__ import annotations

import os
from pathlib import Path

import pytest
from textual.command import CommandList
from textual.screen import ModalScreen
from textual.widgets import Input
from tui_sessions import rig_session

from storm import StormApp, _key_event, run_storm, session_round_trips, settle

SEEDS_VARIABLE, KEYS_VARIABLE = "WORKBENCH_STORM_SEEDS", "WORKBENCH_STORM_KEYS"
# In the suite: one seed of about 1,200 keys (some 20 s of CPU; more on a loaded machine)
SEEDS = tuple(int(seed) for seed in os.environ.get(SEEDS_VARIABLE, "1200").split())
KEYS = int(os.environ.get(KEYS_VARIABLE, "1200"))


@pytest.mark.parametrize("seed", SEEDS)
async def test_storm_leaves_the_app_alive_and_the_session_sound(
        seed: int, tmp_path: Path, monkeypatch: pytest.MonkeyPatch, no_disk) -> None:
    monkeypatch.chdir(tmp_path)  # reports and sessions the storm names land here
    app = StormApp(rig_session(3), tmp_path / "storm.toml", offer_recovery=False,
                   autosave_delay=None)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        bursts = await run_storm(app, pilot, seed, KEYS)
        assert bursts > 0 and app.is_running
        await settle(app, pilot)
        assert app.is_running and not isinstance(app.screen, ModalScreen)
        assert len(app.screen_stack) == 1
        session_round_trips(app)
        await pilot.press("ctrl+n")  # the main screen still answers
        await pilot.pause()
    assert app.return_code in (None, 0)


@pytest.mark.parametrize("action", ["add_duty_cycle", "edit_shaft"])
async def test_names_with_markup_brackets_show_as_typed(action: str, make_app) -> None:
    """Found by the storm: a duty cycle or shaft named "[a=" stopped the screen (the editor's
    title read the name as markup).  (The rig has neither: the palette's "Add a new duty
    cycle" makes the cycle, alt+h the shaft.)"""
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await app.workbench_screen.run_action(action)
        await pilot.pause()
        editor = app.screen
        name_box = next(box for box in editor.query(Input)
                        if box.value == editor.table.get("name"))  # type: ignore[attr-defined]
        name_box.focus()
        await pilot.press("end", "[", "a", "=")
        await pilot.pause()
        assert app.is_running and editor.table["name"].endswith("[a=")  # type: ignore[attr-defined]
        assert "[a=" in str(editor.query_one("#editor-title").render())


@pytest.mark.parametrize("under", [None, "f13"])
@pytest.mark.parametrize("enters", [2, 3])
async def test_palette_command_and_enters_in_one_burst(under: str | None, enters: int,
                                                       make_app) -> None:
    """The issue's crash, 3 of 3 times before: ctrl+p, a command, two enters in one burst popped
    the main screen (ScreenStackError).  The command runs once and only the palette closes, also
    with a dialog open under the palette."""
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        if under:
            await pilot.press(under)
            await pilot.pause()
        below = list(app.screen_stack)
        for key in ["ctrl+p", *"add case"]:
            app.post_message(_key_event(key))
        if not under:  # the palette searches in a worker: enters before its answer choose nothing
            for _ in range(200):
                await pilot.pause()
                lists = app.screen.query(CommandList)
                if lists and lists.first().highlighted is not None:
                    break
        for key in ["enter"] * enters:
            app.post_message(_key_event(key))
        await pilot.pause()
        await pilot.pause()
        assert app.is_running and app.screen_stack[:len(below)] == below
        # once; over the about box the main screen's commands are not offered
        assert len(app.document.session.cases) - 3 == (0 if under else 1)
