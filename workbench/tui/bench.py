"""Timings of the screen for ``workbench bench``: what a person sees after a key, and start-up.

The typing figures run the real app headless (Textual's test driver) in this process, on the
demo session at 120×40 with the cursor not blinking, and time every frame the app hands to its
driver.  For each of {a load-case field (Fr), a bearing field (C)} × {each pane on show}, keys
alternating a digit and backspace are typed as a terminal delivers them (through the driver,
from another thread), one at a time: each once the screen has been quiet for
:data:`QUIET_S` after the last.  A key's *echo* is the first frame after it, its *settle* the
last frame before that quiet; ``echo_ms_p90`` and ``settle_ms_p90`` are the 90th percentiles of
the worst combination, and ``echo_settle`` holds every combination's figures.

The start-up figure is measured at process level, as a person meets it: from here, the wall time
of a fresh Python process that imports and runs the workbench headless on the demo session until
its first full frame is painted (the first update of the main screen handed to the driver) and
then exits, divided by the same for a minimal one-line Textual app.  Beside it,
``startup_floor_ratio`` times Textual's widgets of the workbench's first screen with nothing of
ours (:mod:`.bench_floor`) against the same app.  They are run in turn, round after round
(``python -m workbench.tui.bench --first-frame demo|minimal|widgets`` is that process), and each
figure is the median of the rounds' ratios, so machine speed cancels out.

This module imports only what the minimal app needs at its top: the workbench and the floor are
imported by the functions that use them, so the minimal process pays for nothing else.
"""

from __future__ import annotations

import argparse
import asyncio
import gc
import os
import re
import statistics
import subprocess
import sys
import threading
import time
from collections.abc import Sequence
from typing import TYPE_CHECKING, Any, NamedTuple

from rich.console import RenderableType
from textual import events
from textual.app import App, ComposeResult
from textual.screen import Screen
from textual.widgets import Static

if TYPE_CHECKING:
    from textual.widgets import Input

    from ..model.session import Session

TYPING_FIELDS = ("fr", "c")
"""The fields typed into: a load-case field (radial load) and a bearing field (rating C)."""
TYPING_PANES = ("derivation", "solver", "whatif")
TYPING_KEYS = 40
"""Keys per combination of field and pane."""
QUICK_TYPING_KEYS = 2
QUIET_S = 0.3
"""The screen is settled after a key once it has drawn nothing for this long."""
SETTLE_LIMIT_S = 5.0
"""The longest wait for the screen to settle after a key."""
STARTUP_ROUNDS = 11
QUICK_STARTUP_ROUNDS = 3
FIRST_FRAME_LIMIT_S = 120.0
TERMINAL = (120, 40)
FIRST_FRAME_APPS = ("demo", "minimal", "widgets")
"""The workbench, the one-line yardstick, and Textual's widgets of the workbench's first screen
with nothing of ours (:mod:`.bench_floor`)."""


def bench_session(cases: int) -> Session:
    """An invented session of ``cases`` load cases on one deep-groove ball bearing."""
    from ..model.session import Bearing, LoadCase, Session, Targets

    bearing = Bearing("Bench bearing", {"kind": "deep-groove", "c": "30 kN", "c0": "16 kN",
                                        "dm": "45 mm"})
    made = [LoadCase(f"Case {i + 1}", bearing.name,
                     {"fr": f"{2 + 0.1 * i:g} kN", "fa": "0.8 kN", "speed": "1200 r/min",
                      "vg": "68", "temp": "60 degC", "cleanliness": "normal"})
            for i in range(cases)]
    return Session(title="Bench", targets=Targets(life="20000 h", s0="2"),
                   bearings=[bearing], cases=made)


# ---- typing: what a person sees after a key -------------------------------------------------
def with_frame_clock(base: type[App[object]]) -> type[App[object]]:
    """``base`` with the time of every frame it hands to its driver in ``frame_times`` (and
    ``frame_drawn`` set at each, for a thread waiting on frames).

    Headless, the driver writes nothing, so each update is turned into terminal output here
    as a terminal run would (the same as :func:`_until_first_frame`); the time is taken after
    that, when the frame is ready to leave for the terminal.
    """

    class FrameClock(base):  # type: ignore[valid-type, misc]
        def __init__(self, *args: Any, **kwargs: Any) -> None:
            super().__init__(*args, **kwargs)
            self.frame_times: list[float] = []
            self.frame_drawn = threading.Event()

        def _display(self, screen: Screen[object], renderable: RenderableType | None) -> None:
            super()._display(screen, renderable)
            if renderable is not None and not self._batch_count:  # what Textual would write
                renderable.render_segments(self.console)  # type: ignore[attr-defined]
                self.frame_times.append(time.perf_counter())
                self.frame_drawn.set()

    return FrameClock


class KeyTiming(NamedTuple):
    """What followed one key: the first frame after it (echo), the last frame before
    :data:`QUIET_S` of quiet (settle), in ms from the key, and how many frames in between."""

    echo_ms: float
    settle_ms: float
    frames: int


def _follow_key(frames: list[float], drawn: threading.Event, sent: float,
                seen: int) -> KeyTiming:
    """Wait (in the typist's thread) until the screen is quiet after a key sent at ``sent``
    (``seen``: how many frames there were just before; ``drawn`` is set at every frame) and
    time what it drew."""
    deadline = sent + SETTLE_LIMIT_S
    while True:
        drawn.clear()  # before looking: a frame drawn after the look wakes the wait below
        after = [stamp for stamp in frames[seen:] if stamp > sent]
        wake = min(after[-1] + QUIET_S, deadline) if after else deadline
        now = time.perf_counter()
        if now >= wake:
            break
        drawn.wait(wake - now)
    if not after:
        raise TimeoutError(f"no frame within {SETTLE_LIMIT_S} s of a key press")
    return KeyTiming((after[0] - sent) * 1000.0, (after[-1] - sent) * 1000.0, len(after))


def typing_keys(count: int) -> list[tuple[str, str]]:
    """``count`` keys (key, character) alternating a digit (1 to 9 in turn) and backspace, so
    the field's text is back where it started after an even count."""
    return [(str(index // 2 % 9 + 1),) * 2 if index % 2 == 0 else ("backspace", "\x7f")
            for index in range(count)]


def _type(app: App[object], keys: Sequence[tuple[str, str]]) -> list[KeyTiming]:
    """Type ``keys`` as a terminal delivers them: from another thread, through the driver
    (what Textual's own input thread does), each once the screen is quiet after the last."""
    driver = app._driver  # Textual has no public handle on it; a real driver is the same
    assert driver is not None
    frames: list[float] = app.frame_times  # type: ignore[attr-defined]
    drawn: threading.Event = app.frame_drawn  # type: ignore[attr-defined]
    timings = []
    for key, character in keys:
        seen = len(frames)
        sent = time.perf_counter()
        driver.process_message(events.Key(key, character))
        timings.append(_follow_key(frames, drawn, sent, seen))
    return timings


async def _until_quiet(app: App[object]) -> None:
    """Wait until the app has drawn no frame for :data:`QUIET_S` from now on (at most
    :data:`SETTLE_LIMIT_S`): what was asked of it just before is done and drawn."""
    frames: list[float] = app.frame_times  # type: ignore[attr-defined]
    start = time.perf_counter()
    deadline = start + SETTLE_LIMIT_S
    while True:
        now = time.perf_counter()
        quiet_from = max(frames[-1] if frames else start, start) + QUIET_S
        if min(quiet_from, deadline) <= now:
            return
        await asyncio.sleep(min(quiet_from, deadline) - now)


def show_pane(app: App[object], name: str) -> None:
    """Put the pane ``name`` on show (the same action on the painted and the new screen)."""
    app.screen.action_show_pane(name)  # type: ignore[attr-defined]


async def focus_field(app: App[object], name: str) -> Input:
    """Give the focus to the form's field ``name`` (its ``Input``, ``#field-<name>``) and
    return it."""
    from textual.widgets import Input

    field = app.screen.query_one(f"#field-{name}", Input)
    field.focus()
    await _until_quiet(app)
    return field


def _number_end(text: str) -> int:
    """Where the number at the start of ``text`` ends ("3.6 kN" → 3)."""
    return re.match(r"\s*[+-]?[\d.]*", text).end()  # type: ignore[union-attr]


async def _type_in(app: App[object], field: str, pane: str, keys: int) -> list[KeyTiming]:
    """Type ``keys`` keys in ``field`` with ``pane`` on show; each key's timing."""
    from textual.widgets import Input

    show_pane(app, pane)  # first: showing a pane moves the focus into it (after a refresh)
    await _until_quiet(app)
    box = await focus_field(app, field)
    for text_box in app.screen.query(Input):
        text_box.cursor_blink = False
    text = box.value
    box.cursor_position = _number_end(text)  # a digit typed there keeps the text valid
    await _until_quiet(app)
    timings = await asyncio.to_thread(_type, app, typing_keys(keys))
    if keys % 2 == 0 and box.value != text:
        raise RuntimeError(f"typing in {field} left {box.value!r}, not {text!r}")
    return timings


async def time_typing(app: App[object], keys: int) -> dict[str, list[KeyTiming]]:
    """Run ``app`` (made by :func:`with_frame_clock`) headless at 120×40 and type ``keys``
    keys in each combination of :data:`TYPING_FIELDS` and :data:`TYPING_PANES`; the timings
    by ``field/pane``."""
    timings: dict[str, list[KeyTiming]] = {}
    async with app.run_test(size=TERMINAL):
        await _until_quiet(app)  # start-up: what mounts after the first frame is in place
        for field in TYPING_FIELDS:
            for pane in TYPING_PANES:
                timings[f"{field}/{pane}"] = await _type_in(app, field, pane, keys)
    return timings


async def _typing_in_demo(keys: int) -> dict[str, list[KeyTiming]]:
    from .app import WorkbenchApp

    gc.collect()  # what the benchmarks before left behind is not collected during typing
    session = _demo_or_bench_session()
    app = with_frame_clock(WorkbenchApp)(session, offer_recovery=False, autosave_delay=None)
    return await time_typing(app, keys)


def percentile_90(samples: Sequence[float]) -> float:
    """The 90th percentile of ``samples`` (linear between order statistics)."""
    if len(samples) == 1:
        return samples[0]
    return statistics.quantiles(samples, n=10, method="inclusive")[8]


def measure_typing(keys: int = TYPING_KEYS) -> dict[str, Any]:
    """``echo_ms_p90`` and ``settle_ms_p90``: the 90th percentile over ``keys`` keys of the
    worst of the combinations {a load-case field, a bearing field} × {each pane on show},
    typed in the demo session at 120×40; ``echo_settle`` holds each combination's figures."""
    detail = {}
    for combination, timings in asyncio.run(_typing_in_demo(keys)).items():
        echo = [timing.echo_ms for timing in timings]
        settle = [timing.settle_ms for timing in timings]
        detail[combination] = {
            "echo_ms_p90": percentile_90(echo), "settle_ms_p90": percentile_90(settle),
            "echo_ms_median": statistics.median(echo),
            "settle_ms_median": statistics.median(settle),
            "frames_median": statistics.median(timing.frames for timing in timings),
        }
    return {"echo_ms_p90": max(figures["echo_ms_p90"] for figures in detail.values()),
            "settle_ms_p90": max(figures["settle_ms_p90"] for figures in detail.values()),
            "echo_settle": detail}

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
    """Run the ``demo`` workbench, the ``minimal`` app or the ``widgets`` floor headless to its
    first full frame."""
    if which == "minimal":
        _until_first_frame(_MinimalApp)().run(headless=True, size=TERMINAL)
        return
    if which == "widgets":
        from .bench_floor import SameWidgetsApp

        _until_first_frame(SameWidgetsApp)().run(headless=True, size=TERMINAL)
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


def measure_clearance_curve(repeats: int) -> dict[str, float]:
    """``whatif_clearance_ms``: the What-if pane's life against operating clearance for the
    spindle-pair example's roughing pass, as its worker makes it (the request from the
    document, the 25-point sweep, the plot and its words, 30 columns of plot); the median of
    ``repeats`` rounds after one to load scipy.  Goal: ≤ 100 ms."""
    from ..model.document import Document
    from ..model.inside_request import clearance_curve, inside_request
    from ..model.plot_text import clearance_section
    from ..model.sessionfile import demo_session_path, load_session

    document = Document(load_session(demo_session_path().with_name("spindle-pair.toml")))

    def once() -> None:
        curve = clearance_curve(inside_request(document, 0))
        assert curve.problem is None, curve.problem
        clearance_section(curve, 30, 8)

    once()
    samples = []
    for _ in range(repeats):
        start = time.perf_counter()
        once()
        samples.append(time.perf_counter() - start)
    return {"whatif_clearance_ms": statistics.median(samples) * 1e3}


def measure_startup(rounds: int | None = None) -> dict[str, float]:
    """``startup_ratio``: process time to the first full frame of the workbench on the demo
    session, divided by that of a minimal Textual app; and ``startup_floor_ratio``: the same for
    Textual's widgets of the workbench's first screen with nothing of ours (the part of the first
    figure that is Textual's).  Each is the median over ``rounds`` rounds, each timing the
    minimal app, then the floor and the workbench, after one untimed run of each (compiled files
    written, the disk cache warm).  Each round's ratios are taken on their own, so a slow spell
    of the machine weighs on both sides of them."""
    for which in FIRST_FRAME_APPS:
        first_frame_process_s(which)
    ratios: dict[str, list[float]] = {"startup_ratio": [], "startup_floor_ratio": []}
    for _ in range(STARTUP_ROUNDS if rounds is None else rounds):
        minimal = first_frame_process_s("minimal")
        ratios["startup_floor_ratio"].append(first_frame_process_s("widgets") / minimal)
        ratios["startup_ratio"].append(first_frame_process_s("demo") / minimal)
    return {name: statistics.median(values) for name, values in ratios.items()}


def main(argv: Sequence[str] | None = None) -> int:
    """``python -m workbench.tui.bench --first-frame demo|minimal|widgets``: one start-up to
    time."""
    parser = argparse.ArgumentParser(prog="python -m workbench.tui.bench",
                                     description="Run one app headless to its first full frame.")
    parser.add_argument("--first-frame", choices=FIRST_FRAME_APPS, required=True)
    first_frame(parser.parse_args(argv).first_frame)
    return 0


if __name__ == "__main__":
    sys.exit(main())
