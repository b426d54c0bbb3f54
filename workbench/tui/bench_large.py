"""Timings of the screen on large sessions, for ``workbench bench`` (issue 18, item 8).

Three figures, on the generated session of :func:`~workbench.model.sample_sessions.
shared_bearing_session` (all but two cases on one bearing, so a bearing field reaches them):

``large_open_s``
    From spawning a fresh Python process on a 1,000-case session file to the screen settled
    with every row of the list current (no case waiting for its derivation): interpreter start,
    imports, reading the file, the analysis, the first frames, all of it.  The child process
    (``python -m workbench.tui.bench_large --open FILE``) reports the time of its last frame;
    ``perf_counter`` is the system's monotonic clock, the same in both processes.  Goal ≤ 2 s.

``large_settle_ms_p90``
    Keys typed in a bearing field (C, shared by the 1,000 cases) and in a case field (Fr) of
    the same session, with the method of :mod:`workbench.tui.bench`: one key, then a wait until
    the screen has drawn nothing for ``QUIET_S``; settle is the last frame before that quiet,
    so it covers the re-derivation of every case on the bearing and the list showing it.  The
    worse field's 90th percentile; ``large_echo_settle`` holds each field's figures.
    Goal ≤ 100 ms.

``huge_echo_ms_p90``
    10,000 cases: digits typed into C at a typist's pace (one every :data:`HUGE_KEY_GAP_S`, not
    waiting for the screen), so each key lands while the re-derivation the last one started is
    still running.  Each digit makes a text the field has not shown before; a key's echo is the
    first frame whose focused field shows its text (or a later key's).  ``huge_keys_lost``
    counts keys whose text never showed: the field was rewritten under the typist (the form
    puts the document's text back while a later key is still on its way).  ``huge_settle_s`` is from the last key to every row current.  The screen stays
    responsive when the echo stays near the small session's.

Each figure runs the real app (headless, 120×40); the code shared with the small-session
figures is :mod:`workbench.tui.bench`'s.
"""

from __future__ import annotations

import argparse
import asyncio
import gc
import math
import statistics
import subprocess
import sys
import tempfile
import time
from collections.abc import Sequence
from pathlib import Path
from typing import Any

from rich.console import RenderableType
from textual import events
from textual.app import App
from textual.screen import Screen

from . import bench

LARGE_CASES = 1000
HUGE_CASES = 10_000
LARGE_FIELDS = ("c", "fr")
"""A bearing field every case shares, and a field of one case."""
LARGE_KEYS = 20
HUGE_KEYS = 20
QUICK_KEYS = 2
HUGE_KEY_GAP_S = 0.15
"""A typist's pace: about seven keys a second."""
OPEN_ROUNDS = 3
QUICK_OPEN_ROUNDS = 1
SETTLED_LIMIT_S = 60.0
"""The longest wait for a large session to have every row current."""


def _pending(app: App[object]) -> int:
    """How many cases of the app's document wait for their derivation."""
    return len(app.document.pending)  # type: ignore[attr-defined]


def _rows(app: App[object]) -> int:
    from .case_table import CaseTable

    return app.screen.query_one(CaseTable).row_count


async def _until_current(app: App[object], cases: int) -> None:
    """Wait until the screen is quiet with every one of ``cases`` rows listed and current."""
    deadline = time.perf_counter() + SETTLED_LIMIT_S
    while True:
        await bench._until_quiet(app)
        if _rows(app) >= cases and not _pending(app):
            return
        if time.perf_counter() > deadline:
            raise TimeoutError(f"the list was not current within {SETTLED_LIMIT_S} s")
        await asyncio.sleep(0.05)


def _large_app(cases: int, path: Path | None = None) -> App[object]:
    from ..model.sample_sessions import shared_bearing_session
    from .app import WorkbenchApp

    if path is not None:
        from ..model import files

        session = files.open_session(path).session
    else:
        session = shared_bearing_session(cases)
    gc.collect()
    return _with_echo_clock(WorkbenchApp)(session, path, offer_recovery=False,
                                          autosave_delay=None)


def _with_echo_clock(base: type[App[object]]) -> type[App[object]]:
    """:func:`workbench.tui.bench.with_frame_clock`'s app that also notes, at every frame, the
    text of the focused field (``frame_texts``), to tell a key's echo from other frames."""

    class EchoClock(bench.with_frame_clock(base)):  # type: ignore[misc]
        def __init__(self, *args: Any, **kwargs: Any) -> None:
            super().__init__(*args, **kwargs)
            self.frame_texts: list[tuple[float, str | None]] = []

        def _display(self, screen: Screen[object], renderable: RenderableType | None) -> None:
            count = len(self.frame_times)
            super()._display(screen, renderable)
            if len(self.frame_times) > count:
                self.frame_texts.append((self.frame_times[-1],
                                         getattr(self.focused, "value", None)))

    return EchoClock


# ---- opening: a fresh process to the settled screen -------------------------------------------
def open_settled(path: Path, cases: int) -> None:
    """Run the workbench headless on ``path`` until it has settled with ``cases`` rows current,
    and print the time of its last frame (``perf_counter``)."""

    async def run() -> float:
        app = _large_app(cases, path)
        async with app.run_test(size=bench.TERMINAL):
            await _until_current(app, cases)
            return app.frame_times[-1]  # type: ignore[attr-defined, no-any-return]

    print(repr(asyncio.run(run())))


def open_process_s(path: Path, cases: int) -> float:
    """Seconds from spawning a process on ``path`` to its settled screen's last frame."""
    command = [sys.executable, "-m", "workbench.tui.bench_large", "--open", str(path),
               "--cases", str(cases)]
    start = time.perf_counter()
    done = subprocess.run(command, stdin=subprocess.DEVNULL, capture_output=True, text=True,
                          env=bench._child_environment(), timeout=SETTLED_LIMIT_S * 2,
                          check=True)
    return float(done.stdout.strip().splitlines()[-1]) - start


def measure_large_open(rounds: int = OPEN_ROUNDS, cases: int = LARGE_CASES) -> float:
    """``large_open_s``: the median over ``rounds`` of :func:`open_process_s` on a file of
    ``cases`` cases, after one untimed run (compiled files written, disk cache warm)."""
    from ..model.sample_sessions import shared_bearing_session
    from ..model.sessionfile import dumps_session

    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / "large.toml"
        path.write_text(dumps_session(shared_bearing_session(cases)), encoding="utf-8")
        open_process_s(path, cases)
        return statistics.median(open_process_s(path, cases) for _ in range(rounds))


# ---- typing in a large session --------------------------------------------------------------
async def _focus_for_typing(app: App[object], field: str) -> str:
    """Focus ``field`` with its cursor after its number (a digit there keeps the text valid);
    its text."""
    box = await bench.focus_field(app, field)
    box.cursor_blink = False
    box.cursor_position = bench._number_end(box.value)
    await bench._until_quiet(app)
    return box.value


async def _typing_large(cases: int, keys: int) -> dict[str, list[bench.KeyTiming]]:
    app = _large_app(cases)
    timings: dict[str, list[bench.KeyTiming]] = {}
    async with app.run_test(size=bench.TERMINAL):
        await _until_current(app, cases)
        for field in LARGE_FIELDS:
            text = await _focus_for_typing(app, field)
            timings[field] = await asyncio.to_thread(bench._type, app, bench.typing_keys(keys))
            await _until_current(app, cases)
            value = app.screen.query_one(f"#field-{field}").value  # type: ignore[attr-defined]
            if keys % 2 == 0 and value != text:
                raise RuntimeError(f"typing in {field} left {value!r}, not {text!r}")
    return timings


def measure_large_typing(keys: int = LARGE_KEYS, cases: int = LARGE_CASES) -> dict[str, Any]:
    """``large_settle_ms_p90`` (the worse field's), ``large_echo_ms_p90`` and each field's
    figures in ``large_echo_settle``."""
    detail = {}
    for field, timings in asyncio.run(_typing_large(cases, keys)).items():
        echo = [timing.echo_ms for timing in timings]
        settle = [timing.settle_ms for timing in timings]
        detail[field] = {"echo_ms_p90": bench.percentile_90(echo),
                         "settle_ms_p90": bench.percentile_90(settle),
                         "settle_ms_median": statistics.median(settle)}
    return {"large_settle_ms_p90": max(f["settle_ms_p90"] for f in detail.values()),
            "large_echo_ms_p90": max(f["echo_ms_p90"] for f in detail.values()),
            "large_echo_settle": detail}


# ---- a typist's pace in a huge session ------------------------------------------------------
def typing_digits(count: int) -> list[tuple[str, str]]:
    """``count`` digit keys, 1 to 9 in turn: each makes a text the field has not shown yet."""
    return [(str(index % 9 + 1),) * 2 for index in range(count)]


def _texts_typed(text: str, position: int, keys: Sequence[tuple[str, str]]) -> list[str]:
    """The field's text after each of ``keys`` (digits inserted at ``position`` in turn)."""
    texts = []
    for number in range(1, len(keys) + 1):
        texts.append(text[:position] + "".join(c for _, c in keys[:number]) + text[position:])
    return texts


def _paced(app: App[object], keys: Sequence[tuple[str, str]], gap: float) -> list[float]:
    """Send ``keys`` through the driver one every ``gap`` seconds (from this thread); the
    time each was sent."""
    driver = app._driver
    assert driver is not None
    sent = []
    for key, character in keys:
        sent.append(time.perf_counter())
        driver.process_message(events.Key(key, character))
        time.sleep(max(0.0, sent[-1] + gap - time.perf_counter()))
    return sent


def _echoes(frames: Sequence[tuple[float, str | None]], sent: Sequence[float],
            texts: Sequence[str]) -> list[float]:
    """Each key's echo in ms: the first frame after it that shows its text or a later key's
    (two keys handled together are echoed by one frame)."""
    echoes = []
    for number, at in enumerate(sent):
        later = set(texts[number:])
        shown = [stamp for stamp, value in frames if stamp > at and value in later]
        echoes.append(((shown[0] if shown else math.nan) - at) * 1000.0)
    return echoes


async def _typing_huge(cases: int, keys: int, gap: float) -> dict[str, float]:
    app = _large_app(cases)
    async with app.run_test(size=bench.TERMINAL):
        await _until_current(app, cases)
        text = await _focus_for_typing(app, "c")
        typed = typing_digits(keys)
        texts = _texts_typed(text, bench._number_end(text), typed)
        frames: list[tuple[float, str | None]] = app.frame_texts  # type: ignore[attr-defined]
        seen = len(frames)
        sent = await asyncio.to_thread(_paced, app, typed, gap)
        await _until_current(app, cases)
        current = app.frame_times[-1]  # type: ignore[attr-defined]
        echoes = _echoes(frames[seen:], sent, texts)
    shown = [echo for echo in echoes if not math.isnan(echo)] or [math.nan]
    return {"huge_echo_ms_p90": bench.percentile_90(shown),
            "huge_echo_ms_median": statistics.median(shown),
            "huge_keys_lost": sum(math.isnan(echo) for echo in echoes),
            "huge_settle_s": current - sent[-1]}


def measure_huge_typing(keys: int = HUGE_KEYS, cases: int = HUGE_CASES,
                        gap: float = HUGE_KEY_GAP_S) -> dict[str, float]:
    """``huge_echo_ms_p90`` (and median) over the keys echoed, ``huge_keys_lost``,
    ``huge_settle_s``: see the module notes."""
    return asyncio.run(_typing_huge(cases, keys, gap))


def measure_large(quick: bool = False) -> dict[str, Any]:
    """Every large-session figure, for ``workbench bench``."""
    figures: dict[str, Any] = {
        "large_open_s": measure_large_open(QUICK_OPEN_ROUNDS if quick else OPEN_ROUNDS)}
    figures.update(measure_large_typing(QUICK_KEYS if quick else LARGE_KEYS))
    figures.update(measure_huge_typing(QUICK_KEYS if quick else HUGE_KEYS))
    return figures


def main(argv: Sequence[str] | None = None) -> int:
    """``python -m workbench.tui.bench_large --open FILE --cases N``: one opening to time."""
    parser = argparse.ArgumentParser(prog="python -m workbench.tui.bench_large",
                                     description="Open a large session to its settled screen.")
    parser.add_argument("--open", type=Path, required=True)
    parser.add_argument("--cases", type=int, required=True)
    args = parser.parse_args(argv)
    open_settled(args.open, args.cases)
    return 0


if __name__ == "__main__":
    sys.exit(main())
