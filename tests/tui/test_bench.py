"""The bench timings run and give sensible numbers (few samples: this checks the plumbing)."""

from __future__ import annotations

import pytest

from workbench.tui import bench


def test_keystroke_timing_is_positive(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(bench, "KEYSTROKE_SAMPLES", 5)
    ms = bench.measure_keystroke_ms(cases=20)
    assert 0 < ms < 2000


def test_startup_ratio_is_a_ratio(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(bench, "STARTUP_ROUNDS", 1)
    ratio = bench.measure_startup_ratio()
    assert ratio > 0
