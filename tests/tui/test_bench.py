"""The bench timings run and give sensible numbers (few samples: this checks the plumbing,
never the speed)."""

from __future__ import annotations

import asyncio
import random

import numpy
import pytest
from textual import on
from textual.app import App, ComposeResult
from textual.screen import Screen
from textual.widgets import Input, TabbedContent, TabPane

from workbench.tui import bench


def test_typing_keys_alternate_a_digit_and_backspace() -> None:
    keys = bench.typing_keys(20)
    assert [key for key, _ in keys[1::2]] == ["backspace"] * 10
    assert [key for key, _ in keys[0::2]] == [str(n) for n in range(1, 10)] + ["1"]
    assert all(character == key for key, character in keys[0::2])


@pytest.mark.parametrize("size", [1, 2, 4, 11, 40])
def test_percentile_90_is_numpys_linear_percentile(size: int) -> None:
    samples = [random.Random(size).uniform(1.0, 300.0) for _ in range(size)]
    assert bench.percentile_90(samples) == pytest.approx(numpy.percentile(samples, 90))


def test_typing_figures_cover_every_field_and_pane() -> None:
    figures = bench.measure_typing(keys=2)
    detail = figures["echo_settle"]
    assert set(detail) == {f"{field}/{pane}" for field in bench.TYPING_FIELDS
                           for pane in bench.TYPING_PANES}
    for combination in detail.values():
        # every key was followed by a frame, and the last frame comes no earlier than the first
        assert 0 < combination["echo_ms_p90"] <= combination["settle_ms_p90"]
        assert combination["frames_median"] >= 1
    assert figures["echo_ms_p90"] == max(c["echo_ms_p90"] for c in detail.values())
    assert figures["settle_ms_p90"] == max(c["settle_ms_p90"] for c in detail.values())


class _InputFieldScreen(Screen[None]):
    """The shape of a screen whose editor fields are Textual's own ``Input``s (``#field-fr``,
    ``#field-c``) beside a ``TabbedContent`` of the panes, whose ``show_pane`` moves the focus
    into the pane; it notes every text the fields take."""

    def __init__(self) -> None:
        super().__init__()
        self.texts: list[tuple[str, str]] = []

    def compose(self) -> ComposeResult:
        yield Input("3.6 kN", id="field-fr")  # select_on_focus: typing would replace the text
        yield Input("33.5 kN", id="field-c")
        with TabbedContent(initial=bench.TYPING_PANES[0]):
            for name in bench.TYPING_PANES:
                with TabPane(name, id=name):
                    yield Input(id=f"in-{name}")

    def action_show_pane(self, name: str) -> None:
        self.query_one(TabbedContent).active = name
        self.query_one(f"#in-{name}").focus()

    @on(Input.Changed)
    def _changed(self, event: Input.Changed) -> None:
        assert event.input.id is not None
        self.texts.append((event.input.id, event.value))


class _InputFieldApp(App[None]):
    def __init__(self) -> None:
        super().__init__()
        self.fields_screen = _InputFieldScreen()

    def get_default_screen(self) -> _InputFieldScreen:
        return self.fields_screen


def test_typing_reaches_input_fields_by_their_ids() -> None:
    app = bench.with_frame_clock(_InputFieldApp)()
    timings = asyncio.run(bench.time_typing(app, keys=2))
    assert len(timings) == len(bench.TYPING_FIELDS) * len(bench.TYPING_PANES)
    typed = [text for text in app.fields_screen.texts if text[0].startswith("field-")]
    # the texts the fields start with; then the digit goes in after the number and backspace
    # takes it out again, in every pane
    assert typed == [("field-fr", "3.6 kN"), ("field-c", "33.5 kN")] + [
        ("field-fr", "3.61 kN"), ("field-fr", "3.6 kN")] * 3 + [
        ("field-c", "33.51 kN"), ("field-c", "33.5 kN")] * 3


def test_startup_figures_are_ratios() -> None:
    figures = bench.measure_startup(rounds=1)
    assert set(figures) == {"startup_ratio", "startup_floor_ratio"}
    assert all(ratio > 0 for ratio in figures.values())


def test_the_clearance_curve_figure_runs_on_the_spindle_pair() -> None:
    # the plumbing only: the example's geometry gives a curve (the function asserts it) and a
    # positive time; the goal (≤ 100 ms) is for `workbench bench`, never a unit test
    figures = bench.measure_clearance_curve(repeats=1)
    assert set(figures) == {"whatif_clearance_ms"} and figures["whatif_clearance_ms"] > 0.0
