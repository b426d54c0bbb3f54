"""A seeded storm of key presses across every pane: the app stays up and consistent."""

from __future__ import annotations

import random

from textual import events
from textual.keys import _character_to_key
from textual.screen import ModalScreen

from tui_helpers import editor

from workbench.model.fields import FIELD_BY_NAME, FieldError, parse_field
from workbench.model.analysis import analyse
from workbench.model.session import evaluate_case
from workbench.tui.actions import ACTIONS
from workbench.tui.case_form import field_choices, takes_text
from workbench.tui.case_table import CaseTable
from workbench.tui.derivation_pane import DerivationPane, derivation_lines

SEED = 20_240_611
PRESSES = 3000
BATCH = 30
TYPED = "0123456789.-+eE kNnmrpdgCl*/°,x "
MOVES = ["tab", "shift+tab", "up", "down", "left", "right", "home", "end", "enter", "escape",
         "backspace", "delete", "pageup", "pagedown", "space"]
# Every action key except quitting; the palette is left out too (it could run "Quit").
ACTION_KEYS = [key.strip() for action in ACTIONS if action.id != "app.quit"
               for key in action.keys.split(",")]


def _key_event(key: str) -> events.Key:
    if len(key) == 1:
        name = key if key.isalnum() else _character_to_key(key)
        return events.Key(name, key)
    return events.Key(key, " " if key == "space" else None)


def _storm(rng: random.Random) -> list[str]:
    keys = []
    for _ in range(PRESSES):
        roll = rng.random()
        if roll < 0.55:
            keys.append(rng.choice(TYPED))
        elif roll < 0.85:
            keys.append(rng.choice(MOVES))
        else:
            keys.append(rng.choice(ACTION_KEYS))
    return keys


def _value(name: str, text: str) -> object:
    try:
        return parse_field(name, text)
    except FieldError:
        return "unreadable"


async def test_random_keys_leave_the_app_alive_and_consistent(make_app, no_disk) -> None:
    app = make_app()
    rng = random.Random(SEED)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        keys = _storm(rng)
        for start in range(0, len(keys), BATCH):
            for key in keys[start:start + BATCH]:
                app.post_message(_key_event(key))
            await pilot.pause()
        for _ in range(6):  # close whatever dialog the storm left open
            if not isinstance(app.screen, ModalScreen):
                break
            await pilot.press("escape")
            await pilot.pause()
        await pilot.press("f3")  # leave any half-typed field: its run ends
        await pilot.pause()
        await pilot.press("f5")  # the derivation on show (a hidden pane catches up when shown)
        await pilot.pause()
        assert app.is_running and not isinstance(app.screen, ModalScreen)

        document = app.document
        screen = app.workbench_screen
        everything = analyse(document.session, keep_steps=False).cases  # own and generated
        assert len(document.results) == len(everything)
        assert screen.query_one(CaseTable).row_count == len(everything)
        for case, result in zip(document.session.cases, document.results):
            fresh = evaluate_case(document.session, case)
            assert (fresh.derivation is None) == (result.derivation is None)
            if fresh.derivation is not None:
                assert fresh.derivation.results == result.derivation.results
        pane = screen.query_one(DerivationPane)
        expected = "\n".join(line.plain for line in derivation_lines(
            document.with_steps(screen.selected), document.units))
        assert pane.text.plain == expected
        texts = document.texts(screen.selected)
        for name in texts:
            if editor(app).message_for(name) is not None:
                continue
            shown = editor(app).field_text(name)
            if takes_text(name) or FIELD_BY_NAME[name].kind == "switch":
                assert _value(name, shown) == _value(name, texts[name]), name
            elif texts[name].strip() in field_choices(name, texts):  # the kind's arrangements
                assert shown == texts[name].strip(), name
