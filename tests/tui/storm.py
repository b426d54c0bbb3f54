"""A seeded storm across every screen: random keys in bursts (text, function, ctrl and alt keys,
the palette with a command and two enters, enter and escape runs), pastes of 2–8 kB and
terminal resizes, as a person or a slow link might send them.

Used by ``tests/tui/test_storm.py`` (a modest run in the suite) and ``tools/storm.py`` (long runs
from a chosen seed, outside the suite).  Nothing here knows the screens' internals: it speaks only
in keys, pastes and sizes, then checks from the outside that the app is up and its session sound.
"""

from __future__ import annotations

import random
import string
from collections.abc import Iterator
from dataclasses import dataclass

from textual import events
from textual.command import CommandPalette
from textual.keys import _character_to_key
from textual.screen import ModalScreen

from workbench.model.sessionfile import dumps_session, loads_session
from workbench.tui.actions import ACTIONS
from workbench.tui.app import WorkbenchApp

TYPED = string.ascii_letters + string.digits + " .,-+*/=_:;()[]{}<>'\"#%&|~?!@$^°κ±\\"
MOVES = ["tab", "shift+tab", "up", "down", "left", "right", "home", "end", "enter", "escape",
         "backspace", "delete", "pageup", "pagedown", "space", "ctrl+home", "ctrl+end"]
FUNCTION_KEYS = [f"f{number}" for number in range(1, 13)] + ["shift+f1", "f13"]
CTRL_KEYS = [f"ctrl+{letter}" for letter in "abdefghijklnoprstuvwxyz"] + ["ctrl+delete"]
ALT_KEYS = [f"alt+{letter}" for letter in "abcdefghijklmnoprstuvwxyz"] + ["alt+up", "alt+down"]
# Quitting leaves the storm early: the app's exit is caught instead (see run_storm)
ACTION_KEYS = [key.strip() for action in ACTIONS for key in action.keys.split(",") if key.strip()]
PALETTE_WORDS = ["save", "open", "catalog", "rate", "shaft", "duty", "report", "theme", "help",
                 "about", "units", "solve", "apply", "add", "delete", "rename", "bearing",
                 "session", "quit", "undo", "redo", "what", "derivation"]
SIZES = [(80, 24), (60, 20), (120, 40), (40, 12), (100, 30), (80, 24)]


@dataclass
class Paste:
    """Paste ``text`` into whatever has the focus."""

    text: str


@dataclass
class Resize:
    """Resize the terminal."""

    width: int
    height: int


Move = str | Paste | Resize


def _key_event(key: str) -> events.Key:
    if len(key) == 1:
        name = key if key.isalnum() else _character_to_key(key)
        return events.Key(name, key)
    return events.Key(key, " " if key == "space" else None)


def _paste_text(rng: random.Random) -> str:
    size = rng.randint(2000, 8000)
    kind = rng.random()
    if kind < 0.3:  # a unit-bearing number, over and over
        return ("12.5 kN " * (size // 8 + 1))[:size]
    if kind < 0.6:  # lines of text with tabs and control characters
        alphabet = TYPED + "\n\t\r\x1b\x07"
        return "".join(rng.choice(alphabet) for _ in range(size))
    return "".join(rng.choice(TYPED) for _ in range(size))


def _burst(rng: random.Random) -> list[Move]:
    """One burst: what arrives between two pauses of the event loop."""
    roll = rng.random()
    if roll < 0.08:  # the palette, a command typed, enters in one burst
        word = rng.choice(PALETTE_WORDS)
        return ["ctrl+p", *word[:rng.randint(1, len(word))], *["enter"] * rng.randint(1, 3)]
    if roll < 0.14:
        return [rng.choice(["enter", "escape"]) for _ in range(rng.randint(2, 5))]
    if roll < 0.16:
        return [Paste(_paste_text(rng))]
    if roll < 0.18:
        return [Resize(*rng.choice(SIZES))]
    moves: list[Move] = []
    for _ in range(rng.randint(1, 12)):
        pick = rng.random()
        if pick < 0.45:
            moves.append(rng.choice(TYPED))
        elif pick < 0.7:
            moves.append(rng.choice(MOVES))
        elif pick < 0.82:
            moves.append(rng.choice(ACTION_KEYS))
        elif pick < 0.9:
            moves.append(rng.choice(FUNCTION_KEYS))
        elif pick < 0.95:
            moves.append(rng.choice(CTRL_KEYS))
        else:
            moves.append(rng.choice(ALT_KEYS))
    return moves


def bursts(seed: int, keys: int) -> Iterator[list[Move]]:
    """Bursts of moves from ``seed`` until about ``keys`` keys have gone."""
    rng = random.Random(seed)
    sent = 0
    while sent < keys:
        burst = _burst(rng)
        sent += sum(1 for move in burst if isinstance(move, str))
        yield burst


class StormApp(WorkbenchApp):
    """The workbench with its exit caught: a storm that asks to quit goes on storming."""

    exits = 0

    def exit(self, result: object = None, return_code: int = 0, message: object = None) -> None:
        """Count the request instead of leaving."""
        self.exits += 1


async def run_storm(app: WorkbenchApp, pilot: object, seed: int, keys: int) -> int:
    """Send the storm of ``seed`` (about ``keys`` keys) to the running ``app``; the bursts sent."""
    count = 0
    for burst in bursts(seed, keys):
        for move in burst:
            if isinstance(move, Paste):
                app.post_message(events.Paste(move.text))
            elif isinstance(move, Resize):
                await pilot.resize_terminal(move.width, move.height)  # type: ignore[attr-defined]
            else:
                app.post_message(_key_event(move))
        await pilot.pause()  # type: ignore[attr-defined]
        count += 1
        if not app.is_running:
            break
    return count


async def settle(app: WorkbenchApp, pilot: object) -> None:
    """Close whatever the storm left open, back to the main screen at 80×24."""
    await pilot.resize_terminal(80, 24)  # type: ignore[attr-defined]
    for _ in range(12):
        if not isinstance(app.screen, ModalScreen | CommandPalette) and len(app.screen_stack) == 1:
            break
        await pilot.press("escape")  # type: ignore[attr-defined]
        await pilot.pause()  # type: ignore[attr-defined]


def session_round_trips(app: WorkbenchApp) -> None:
    """The document's session written and read back is the same session (values unchecked:
    a storm leaves half-typed values, which a save keeps as typed)."""
    session = app.document.session
    text = dumps_session(session)
    again = loads_session(text, "<storm>", check_values=False)
    assert dumps_session(again) == text
