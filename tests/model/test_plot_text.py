"""The text plot of a What-if curve fits its box."""

from __future__ import annotations

import pytest

from workbench.engine.curves import life_curve
from workbench.engine.derive import CaseInputs
from workbench.model.plot_text import plot_lines

CASE = CaseInputs(kind="deep-groove", fr=5200.0, fa=1300.0, c=33000.0, c0=19000.0, speed=1450.0,
                  nu=20.0, dm=47.5, cleanliness="normal")


@pytest.mark.parametrize(("width", "height"), [(40, 8), (60, 12)])
def test_plot_fits_its_box(width: int, height: int) -> None:
    lines = plot_lines(life_curve(CASE, 20000.0), width, height)
    assert len(lines) == height + 3
    assert all(len(line) <= width + 10 for line in lines[:-1])
    assert any("●" in line for line in lines)
