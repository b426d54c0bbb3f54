"""Timings of the screen for ``workbench bench``: keystroke latency and start-up cost.

The keystroke figure runs the real app headless (Textual's test driver) in this process: the
median time from a key press in the radial-load field to the derivation pane showing the case
derived with the new text.

The start-up figure is measured at process level, as a person meets it: from here, the wall time
of a fresh Python process that imports and runs the workbench headless on the demo session until
its first full frame is painted (the first update of the main screen handed to the driver) and
then exits, divided by the same for a minimal one-line Textual app.  The two are run in turn,
round after round (``python -m workbench.tui.bench --first-frame demo|minimal`` is that
process), and the figure is the median of the rounds' ratios, so machine speed cancels out.

This module imports only what the minimal app needs at its top: the workbench is imported by the
functions that use it, so the minimal process pays for nothing of ours.
"""

from __future__ import annotations

import argparse
import asyncio
import os
import statistics
import subprocess
import sys
import threading
import time
from collections.abc import Callable, Sequence
from typing import TYPE_CHECKING

from rich.console import RenderableType
from textual import events
from textual.app import App, ComposeResult
from textual.screen import Screen
from textual.widgets import Static

if TYPE_CHECKING:
    from ..model.session import Session

KEYSTROKE_SAMPLES = 31
STARTUP_ROUNDS = 11
POLL_LIMIT_S = 5.0
FIRST_FRAME_LIMIT_S = 120.0
TERMINAL = (120, 40)
FIRST_FRAME_APPS = ("demo", "minimal")


def bench_session(cases: int) -> Session:
    """An invented session of ``cases`` load cases on one deep-groove ball bearing."""
    from ..model.session import Bearing, LoadCase, Session, Targets

    bearing = Bearing("Bench bearing", {"kind": "deep-groove", "c": "30 kN", "c0": "16 kN",
                                        "dm": "45 mm"})
    made = [LoadCase(f"Case {i + 1}", bearing.name,
                     {"fr": f"{2 + 0.1 * i:g} kN", "fa": "0.8 kN", "speed": "1200 rpm",
                      "vg": "68", "temp": "60 degC", "cleanliness": "normal"})
            for i in range(cases)]
    return Session(title="Bench", targets=Targets(life="20000 h", s0="2"),
                   bearings=[bearing], cases=made)


async def _until(condition: Callable[[], bool]) -> None:
    deadline = time.perf_counter() + POLL_LIMIT_S
    while not condition():
        if time.perf_counter() > deadline:
            raise TimeoutError("the screen did not follow the key press")
        await asyncio.sleep(0)


async def _keystrokes(cases: int) -> list[float]:
    from textual.widgets import Input

    from .app import WorkbenchApp
    from .case_editor import TEXT_BOX_ID, CaseEditor
    from .derivation_pane import DerivationPane

    app = WorkbenchApp(bench_session(cases), offer_recovery=False, autosave_delay=None)
    samples: list[float] = []
    async with app.run_test(size=TERMINAL) as pilot:
        screen = app.workbench_screen
        await _until(lambda: bool(screen.query(f"#{TEXT_BOX_ID}")))  # mounted after frame 1
        box = screen.query_one(f"#{TEXT_BOX_ID}", Input)
        pane = screen.query_one(DerivationPane)
        screen.query_one(CaseEditor).focus_field("fr")
        box.value = "2"
        box.cursor_position = 1
        await pilot.pause()
        for index in range(KEYSTROKE_SAMPLES):
            digit = str(index % 9 + 1)
            expected = box.value + digit
            before = pane.text
            start = time.perf_counter()
            app.post_message(events.Key(digit, digit))
            await _until(lambda: pane.text is not before and box.value == expected)
            samples.append((time.perf_counter() - start) * 1000.0)
            if len(box.value) > 4:  # keep the load in a sensible range: back to one digit
                box.value = "2"
                box.cursor_position = 1
                await pilot.pause()
    return samples


def measure_keystroke_ms(cases: int = 20) -> float:
    """Median milliseconds from a key press in a field to the derivation showing the result,
    for a session of ``cases`` load cases."""
    return statistics.median(asyncio.run(_keystrokes(cases)))


class _MinimalApp(App[None]):
    """The yardstick: a Textual app with one line of text."""

    def compose(self) -> ComposeResult:
        """One static line."""
        yield Static("ready")


def _demo_or_bench_session() -> Session:
    from ..model import files

    path = files.demo_path()
    if path is not None:
        outcome = files.open_session(path)
        if outcome.session is not None:
            return outcome.session
    return bench_session(3)


def _until_first_frame(base: type[App[object]]) -> type[App[object]]:
    """``base`` made to paint its first full frame and then exit.

    The first frame is the first update Textual hands to its driver for the main screen (a
    full layout of it, every visible line rendered).  Headless, the driver writes nothing, so
    the update is turned into terminal output here as a terminal run would; the process then
    ends, without the shutdown (nothing is left to flush in a headless run), so work scheduled
    after the first frame (the editor's text box, the hidden panes) is neither
    timed nor interrupted half-way.  ``tests/tui/test_first_frame.py`` checks that this frame
    already shows what the settled screen shows.
    """

    class FirstFrame(base):  # type: ignore[valid-type, misc]
        def _display(self, screen: Screen[object], renderable: RenderableType | None) -> None:
            super()._display(screen, renderable)
            if renderable is not None and screen is self.screen_stack[0]:
                renderable.render_segments(self.console)  # type: ignore[attr-defined]
                os._exit(0)

    return FirstFrame


def first_frame(which: str) -> None:
    """Run the ``demo`` workbench or the ``minimal`` app headless to its first full frame."""
    if which == "minimal":
        _until_first_frame(_MinimalApp)().run(headless=True, size=TERMINAL)
        return
    from .app import WorkbenchApp

    session = _demo_or_bench_session()
    app = _until_first_frame(WorkbenchApp)(session, offer_recovery=False, autosave_delay=None)
    app.run(headless=True, size=TERMINAL)


def _child_environment() -> dict[str, str]:
    """This environment, with bytecode caching allowed: an installed package runs from its
    compiled files (textual's are compiled at install), so ours are compiled once too instead of
    on every start."""
    environment = dict(os.environ)
    environment.pop("PYTHONDONTWRITEBYTECODE", None)
    return environment


def first_frame_process_s(which: str) -> float:
    """Wall seconds of a fresh Python process that runs ``which`` app to its first full frame
    and exits (timed from this process, interpreter start-up included)."""
    command = [sys.executable, "-m", "workbench.tui.bench", "--first-frame", which]
    start = time.perf_counter()
    child = subprocess.Popen(command, stdin=subprocess.DEVNULL, stdout=subprocess.DEVNULL,
                             env=_child_environment())
    # A wait with a timeout polls in steps of up to 50 ms, which rounded every figure to them;
    # a plain wait returns the moment the child ends, and a timer stops a child that hangs.
    watchdog = threading.Timer(FIRST_FRAME_LIMIT_S, child.kill)
    watchdog.start()
    try:
        code = child.wait()
    finally:
        watchdog.cancel()
    elapsed = time.perf_counter() - start
    if code != 0:
        raise subprocess.CalledProcessError(code, command)
    return elapsed


def measure_startup_ratio(rounds: int | None = None) -> float:
    """Process time to the first full frame of the workbench on the demo session, divided by
    that of a minimal Textual app: the median over ``rounds`` rounds, each timing the minimal
    app and then the workbench, after one untimed run of each (compiled files written, the disk
    cache warm).  Each round's ratio is taken on its own, so a slow spell of the machine weighs
    on both sides of it."""
    for which in FIRST_FRAME_APPS:
        first_frame_process_s(which)
    ratios = []
    for _ in range(STARTUP_ROUNDS if rounds is None else rounds):
        minimal = first_frame_process_s("minimal")
        ratios.append(first_frame_process_s("demo") / minimal)
    return statistics.median(ratios)


def main(argv: Sequence[str] | None = None) -> int:
    """``python -m workbench.tui.bench --first-frame demo|minimal``: one start-up to time."""
    parser = argparse.ArgumentParser(prog="python -m workbench.tui.bench",
                                     description="Run one app headless to its first full frame.")
    parser.add_argument("--first-frame", choices=FIRST_FRAME_APPS, required=True)
    first_frame(parser.parse_args(argv).first_frame)
    return 0


if __name__ == "__main__":
    sys.exit(main())
