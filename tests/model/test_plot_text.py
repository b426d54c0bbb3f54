"""The What-if and Inside panes' text drawings: a curve fits its box, the clearance band marks
where preload helps and hurts, the element loads sit at their azimuths."""

from __future__ import annotations

import pytest

from workbench.engine.curves import life_curve
from workbench.engine.derive import CaseInputs
from workbench.engine.internal.analysis import SweepPoint
from workbench.model.inside_request import ClearanceCurve
from workbench.model.plot_text import (GUTTER, HELPS, HURTS, clearance_plot_lines, clearance_verdict_lines,
                                       load_digit, plot_lines, ring_art)

CASE = CaseInputs(kind="deep-groove", fr=5200.0, fa=1300.0, c=33000.0, c0=19000.0, speed=1450.0,
                  nu=20.0, dm=47.5, cleanliness="normal")


@pytest.mark.parametrize(("width", "height"), [(40, 8), (60, 12)])
def test_plot_fits_its_box(width: int, height: int) -> None:
    lines = plot_lines(life_curve(CASE, 20000.0), width, height)
    assert len(lines) == height + 3
    assert all(len(line) <= GUTTER + width for line in lines[:-1])
    assert any("●" in line for line in lines)


def _curve(lives: list[float]) -> ClearanceCurve:
    step = 4.0 / (len(lives) - 1)
    return ClearanceCurve(tuple(SweepPoint(-2.0 + i * step, life, 1.0, None)
                                for i, life in enumerate(lives)))


def test_the_band_marks_where_preload_helps_and_where_it_hurts() -> None:
    # A made-up curve: 10 at zero clearance, 12 at slight preload, 5 at heavy preload.
    curve = _curve([5.0, 12.0, 10.0, 8.0, 6.0])  # clearances −2, −1, 0, 1, 2
    lines = clearance_plot_lines(curve, width=20, height=4)
    assert len(lines) == 4 + 2 and all(len(line) == GUTTER + 20 for line in lines)
    band = lines[4].split("│")[1]
    assert band[0] == HURTS and HELPS in band[:10] and set(band[10:]) == {HURTS}
    words = " ".join(clearance_verdict_lines(curve))
    assert "helps" in words and "hurts" in words


def test_load_digits_are_tenths_of_the_largest_load() -> None:
    assert [load_digit(q, 100.0) for q in (100.0, 95.0, 50.0, 9.9, 0.0)] == \
        ["9", "9", "5", "0", "·"]


def test_ring_art_puts_each_element_at_its_azimuth() -> None:
    # ψ = 0 at the bottom (where Fr pushes), 90° to the right, 180° at the top.
    art = ring_art([0.0, 90.0, 180.0, 270.0], [100.0, 50.0, 0.0, 50.0], 100.0,
                   half_width=4, half_height=2, centre="+")
    assert art == ["    ·    ",
                   "         ",
                   "5   +   5",
                   "         ",
                   "    9    "]
