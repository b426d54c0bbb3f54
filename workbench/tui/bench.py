"""Timings of the screen for ``workbench bench``: keystroke latency and start-up cost.

Both run the real app headless (Textual's test driver) in this process.  The keystroke figure is
the median time from a key press in the radial-load field to the derivation pane showing the
case derived with the new text; the start-up figure is the time to the first full frame of the
workbench on the demo session divided by the same for a minimal Textual app, measured in the
same run so machine speed cancels out.
"""

from __future__ import annotations

import asyncio
import statistics
import time
from collections.abc import Callable

from textual import events
from textual.app import App, ComposeResult
from textual.widgets import Input, Static

from ..model.session import Bearing, LoadCase, Session, Targets
from . import files
from .app import WorkbenchApp
from .case_editor import field_id
from .derivation_pane import DerivationPane

KEYSTROKE_SAMPLES = 31
STARTUP_ROUNDS = 3
POLL_LIMIT_S = 5.0
TERMINAL = (120, 40)


def bench_session(cases: int) -> Session:
    """An invented session of ``cases`` load cases on one deep-groove ball bearing."""
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
    app = WorkbenchApp(bench_session(cases), offer_recovery=False, autosave_delay=None)
    samples: list[float] = []
    async with app.run_test(size=TERMINAL) as pilot:
        screen = app.workbench_screen
        box = screen.query_one(f"#{field_id('fr')}", Input)
        pane = screen.query_one(DerivationPane)
        box.focus()
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
    path = files.demo_path()
    if path is not None:
        outcome = files.open_session(path)
        if outcome.session is not None:
            return outcome.session
    return bench_session(3)


async def _first_frame_s(make: Callable[[], App[object]]) -> float:
    start = time.perf_counter()
    app = make()
    async with app.run_test(size=TERMINAL) as pilot:
        await pilot.pause()
        app.screen._compositor.render_strips()  # the full frame, painted
        return time.perf_counter() - start


async def _startup_ratio() -> float:
    session = _demo_or_bench_session()
    ours, minimal = [], []
    for _ in range(STARTUP_ROUNDS):
        minimal.append(await _first_frame_s(_MinimalApp))
        ours.append(await _first_frame_s(
            lambda: WorkbenchApp(session, offer_recovery=False, autosave_delay=None)))
    return statistics.median(ours) / statistics.median(minimal)


def measure_startup_ratio() -> float:
    """Time to the first full frame of the workbench on the demo session, divided by the time
    to the first full frame of a minimal Textual app, both measured in this run."""
    return asyncio.run(_startup_ratio())
