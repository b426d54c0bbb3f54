"""How a derivation writes its numbers (``engine.record.fmt``)."""

from __future__ import annotations

import math

import pytest

from workbench.engine.record import fmt


def _rounded(value: float, digits: int) -> float:
    """``value`` to ``digits`` significant figures, by decimal places (the schoolbook way)."""
    return round(value, digits - 1 - math.floor(math.log10(abs(value))))


@pytest.mark.parametrize("value", [2_811_344.0, 123_456.7, 54_321.0, 987_654.3, 1_234.5678,
                                   0.012_345_6, 47.25, 9_999_999.0])
def test_a_number_keeps_four_significant_figures_written_out_or_not(value: float) -> None:
    # a life of 2 811 344 h was written "2811344 h", seven figures where four were meant
    text = fmt(value)
    assert "e" not in text
    assert float(text) == pytest.approx(_rounded(value, 4), rel=1e-12)
    assert len(text.replace(".", "").strip("0")) <= 4


def test_past_ten_million_a_number_takes_an_exponent() -> None:
    assert fmt(60_551_234.0) == "6.055e+07"
