"""Draw a :class:`~workbench.engine.curves.Curve` as plain text on log–log axes.

Braille cells give 2×4 dots per character, so a curve reads smoothly in 60 columns; marks use
plain characters, so the plot still reads in a monochrome terminal or a text report.
"""

from __future__ import annotations

import math

from ..engine.curves import Curve
from ..engine.record import fmt

_BRAILLE_BASE = 0x2800
_DOT_BITS = ((0x01, 0x08), (0x02, 0x10), (0x04, 0x20), (0x40, 0x80))  # [row][column]


def _log_span(values: list[float]) -> tuple[float, float]:
    low, high = math.log10(min(values)), math.log10(max(values))
    if high - low < 1e-9:
        low, high = low - 0.5, high + 0.5
    return low, high


def plot_lines(curve: Curve, width: int = 60, height: int = 12) -> list[str]:
    """The curve as ``height`` + 2 lines of at most ``width`` + 10 characters."""
    if len(curve.x) < 2:
        return [f"{curve.y_label}: not enough points to draw"]
    ys = [y for y in curve.y if y > 0]
    extra = [v for _, v in curve.levels if v and v > 0]
    if curve.point and curve.point[1] > 0:
        extra.append(curve.point[1])
    y_low, y_high = _log_span(ys + extra)
    x_low, x_high = _log_span(list(curve.x))
    cells = [[0] * width for _ in range(height)]
    overlay: dict[tuple[int, int], str] = {}

    def column(x: float) -> float:
        return (math.log10(x) - x_low) / (x_high - x_low) * (2 * width - 1)

    def row(y: float) -> float:
        return (y_high - math.log10(y)) / (y_high - y_low) * (4 * height - 1)

    for x, y in zip(curve.x, curve.y):
        if y <= 0:
            continue
        cx, cy = round(column(x)), round(row(y))
        cells[cy // 4][cx // 2] |= _DOT_BITS[cy % 4][cx % 2]
    for _, level in curve.levels:
        if level and y_low <= math.log10(level) <= y_high:
            r = min(height - 1, round(row(level)) // 4)
            for c in range(0, width, 2):
                overlay.setdefault((r, c), "-")
    for _, mark in curve.marks:
        c = min(width - 1, round(column(mark)) // 2)
        for r in range(height):
            overlay.setdefault((r, c), ":")
    if curve.point and curve.point[1] > 0:
        overlay[(min(height - 1, round(row(curve.point[1])) // 4),
                 min(width - 1, round(column(curve.point[0])) // 2))] = "●"
    lines = []
    for r in range(height):
        label = fmt(10 ** (y_high - (y_high - y_low) * r / (height - 1)), 3) if r in (0, height - 1) else ""
        text = "".join(overlay.get((r, c)) or (chr(_BRAILLE_BASE + cells[r][c]) if cells[r][c] else " ")
                       for c in range(width))
        lines.append(f"{label:>9}│{text}")
    lines.append(f"{'':>9}└{'─' * width}")
    left, right = fmt(10 ** x_low, 3), fmt(10 ** x_high, 3)
    lines.append(f"{'':>10}{left}{curve.x_label:^{max(0, width - len(left) - len(right))}}{right}")
    legend = [f"y: {curve.y_label}", "● operating point"]
    legend += [f"- {name} {fmt(v)}" for name, v in curve.levels if v]
    legend += [f": {name} at {fmt(v, 3)}" for name, v in curve.marks]
    lines.append("  ".join(legend))
    return lines
