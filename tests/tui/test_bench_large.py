"""The large-session bench figures run and give sensible numbers (a small session and few keys:
this checks the plumbing, never the speed)."""

from __future__ import annotations

import math

import pytest

from workbench.tui import bench_large, workbench_screen


def test_typed_digits_make_texts_never_shown_before() -> None:
    keys = bench_large.typing_digits(11)
    texts = bench_large._texts_typed("33 kN", 2, keys)
    assert texts[0] == "331 kN" and texts[-1] == "3312345678912 kN"
    assert len(set(texts)) == len(texts)


def test_an_echo_is_the_first_frame_showing_the_keys_text_or_a_later_one() -> None:
    texts = ["331 kN", "3312 kN", "33123 kN"]
    sent = [1.0, 2.0, 3.0]
    frames = [(0.5, "33 kN"), (1.010, "33 kN"), (1.020, "331 kN"),  # key 1: 20 ms
              (3.050, "33123 kN")]  # keys 2 and 3 drawn together
    echoes = bench_large._echoes(frames, sent, texts)
    assert echoes == pytest.approx([20.0, 1050.0, 50.0])
    assert math.isnan(bench_large._echoes([(1.1, "33 kN")], [1.0], ["331 kN"])[0])


def test_large_figures_cover_both_fields(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(workbench_screen, "DEFER_OVER", 5)  # the worker takes part
    figures = bench_large.measure_large_typing(keys=2, cases=30)
    assert set(figures["large_echo_settle"]) == set(bench_large.LARGE_FIELDS)
    for field in figures["large_echo_settle"].values():
        assert 0 < field["echo_ms_p90"] <= field["settle_ms_p90"]
    huge = bench_large.measure_huge_typing(keys=3, cases=30, gap=0.05)
    assert huge["huge_keys_lost"] < 3 and huge["huge_echo_ms_p90"] > 0
    assert huge["huge_settle_s"] >= 0


def test_opening_is_timed_in_a_fresh_process(tmp_path) -> None:
    from workbench.model.sample_sessions import shared_bearing_session
    from workbench.model.sessionfile import dumps_session

    path = tmp_path / "large.toml"
    path.write_text(dumps_session(shared_bearing_session(30)), encoding="utf-8")
    seconds = bench_large.open_process_s(path, 30)
    assert 0 < seconds < bench_large.SETTLED_LIMIT_S * 2
