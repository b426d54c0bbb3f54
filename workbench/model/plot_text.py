"""The What-if and Inside panes' drawings as plain text: no Textual, so the screen, a report or
a test reads them alike.

- :func:`plot_lines`: a :class:`~workbench.engine.curves.Curve` on log–log axes (life against a
  load scale, aISO against κ).
- :func:`clearance_section`: the reference rating life L10r against operating clearance
  (:class:`~workbench.model.inside_request.ClearanceCurve`) on a linear axis, where slight
  preload helps and where it hurts, in a band of plain characters and in words.
- :func:`ring_art` and :func:`load_bar`: a bearing's element loads around the ring and by azimuth.

Braille cells give 2×4 dots per character, so a curve reads smoothly in 60 columns; marks use
plain characters, so a plot still reads in a monochrome terminal or a text report.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from typing import TYPE_CHECKING

from ..engine.record import fmt, with_unit

if TYPE_CHECKING:  # annotations only
    from ..engine.curves import Curve
    from ..engine.internal.analysis import SweepPoint
    from .inside_request import ClearanceCurve

GUTTER = 10
"""Columns left of a plot's body: the y-axis labels and the axis line."""
_BRAILLE_BASE = 0x2800
_DOT_BITS = ((0x01, 0x08), (0x02, 0x10), (0x04, 0x20), (0x40, 0x80))  # [row][column]


def _set_dot(cells: list[list[int]], column: int, row: int) -> None:
    """Put the dot at ``column``, ``row`` (in dots: two a cell across, four down) into its
    braille cell."""
    cells[row // 4][column // 2] |= _DOT_BITS[row % 4][column % 2]


def _log_span(values: list[float]) -> tuple[float, float]:
    low, high = math.log10(min(values)), math.log10(max(values))
    if high - low < 1e-9:
        low, high = low - 0.5, high + 0.5
    return low, high


def plot_lines(curve: Curve, width: int = 60, height: int = 12) -> list[str]:
    """The curve as ``height`` + 3 lines: ``height`` + 2 of at most ``GUTTER`` + ``width``
    characters, then the legend."""
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
        _set_dot(cells, round(column(x)), round(row(y)))
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
        lines.append(f"{label:>{GUTTER - 1}}│{text}")
    lines.append(f"{'':>{GUTTER - 1}}└{'─' * width}")
    left, right = fmt(10 ** x_low, 3), fmt(10 ** x_high, 3)
    lines.append(f"{'':>{GUTTER}}{left}{curve.x_label:^{max(0, width - len(left) - len(right))}}{right}")
    legend = [f"y: {curve.y_label}", "● operating point"]
    legend += [f"- {name} {fmt(v)}" for name, v in curve.levels if v]
    legend += [f": {name} at {fmt(v, 3)}" for name, v in curve.marks]
    lines.append("  ".join(legend))
    return lines


HELPS, HURTS, NO_POINT = "+", "-", "x"
CLEARANCE_LEGEND = (f"L10r (10⁶ rev) against operating clearance Pd; negative: preload. Under it, "
                    f"{HELPS} life above its value at Pd = 0, {HURTS} below, {NO_POINT} no "
                    "equilibrium; : zero clearance; ● the case's clearance.")


def clearance_section(curve: ClearanceCurve, width: int, height: int) -> tuple[list[str], list[str]]:
    """The What-if pane's block for life against operating clearance: the plot (lines kept
    whole), and what it says in words with the legend (lines to wrap); or no plot and why there
    is no curve."""
    if curve.problem is not None:
        return [], [curve.problem]
    return (clearance_plot_lines(curve, width, height, curve.operating),
            [*clearance_verdict_lines(curve), CLEARANCE_LEGEND])


def _life_at(points: Sequence[SweepPoint], clearance: float) -> float:
    """L10r at ``clearance`` by linear interpolation between the swept points (NaN outside or
    where a neighbour has no equilibrium)."""
    for low, high in zip(points, points[1:]):
        if low.clearance <= clearance <= high.clearance:
            share = (clearance - low.clearance) / (high.clearance - low.clearance)
            return low.life + share * (high.life - low.life)
    return math.nan


def clearance_verdict_lines(curve: ClearanceCurve) -> list[str]:
    """In words: the life at zero clearance, the best clearance, and from which preload on the
    life falls below its zero-clearance value."""
    points = curve.points
    reference = _life_at(points, 0.0)
    lives = [p for p in points if math.isfinite(p.life)]
    if not lives or not math.isfinite(reference) or reference <= 0.0:
        return ["No life at zero clearance to compare with."]
    best = max(lives, key=lambda p: p.life)
    lines = [f"L10r at zero clearance {with_unit(fmt(reference, 4), '10⁶ rev')}; the best "
             f"{fmt(best.life, 4)} at Pd = {fmt(1000.0 * best.clearance, 3)} µm "
             f"({fmt(best.life / reference, 3)}×)."]
    preload_side = [p for p in points if p.clearance < 0.0]
    helping = [p for p in preload_side if math.isfinite(p.life) and p.life > reference]
    hurting = [p for p in preload_side if not (math.isfinite(p.life) and p.life >= reference)]
    if helping:
        lines.append(f"Slight preload helps from 0 to {fmt(1000.0 * min(p.clearance for p in helping), 3)} µm"
                     + (f"; beyond {fmt(1000.0 * max(p.clearance for p in hurting), 3)} µm it "
                        "hurts." if hurting else "."))
    elif hurting:
        lines.append("Preload hurts here from the first step: the load zone is full already.")
    return lines


def clearance_plot_lines(curve: ClearanceCurve, width: int, height: int,
                         operating: float | None = None) -> list[str]:
    """The curve in ``height`` lines of braille on a linear clearance axis, zero clearance
    marked, and a band line under it, one character a column: ``+`` where the life is above
    its zero-clearance value (slight preload helps: more elements share the load), ``-`` where
    it is below (a loose fit narrows the load zone; heavy preload loads every element on top of
    the external load), ``x`` where no equilibrium exists; then the clearance axis: ``height``
    + 2 lines of ``GUTTER`` + ``width`` characters.  A ``●`` marks ``operating`` (mm) when it
    is given and inside the range."""
    points = curve.points
    xs = [p.clearance for p in points]
    finite = [p.life for p in points if math.isfinite(p.life) and p.life > 0.0]
    if len(points) < 2 or not finite:
        return ["Not enough points to draw."]
    x_low, x_high = min(xs), max(xs)
    y_high = max(finite) * 1.05
    reference = _life_at(points, 0.0)
    cells = [[0] * width for _ in range(height)]

    def column(x: float) -> float:
        return (x - x_low) / (x_high - x_low) * (2 * width - 1)

    def row(y: float) -> float:
        return (1.0 - y / y_high) * (4 * height - 1)

    for low, high in zip(points, points[1:]):  # dots along each segment, so the line is whole
        if not (math.isfinite(low.life) and math.isfinite(high.life)):
            continue
        steps = 1 + int(max(abs(column(high.clearance) - column(low.clearance)),
                            abs(row(high.life) - row(low.life))))
        for i in range(steps + 1):
            x = low.clearance + (high.clearance - low.clearance) * i / steps
            y = low.life + (high.life - low.life) * i / steps
            _set_dot(cells, round(column(x)), min(4 * height - 1, max(0, round(row(y)))))
    zero = round(column(0.0)) // 2 if x_low <= 0.0 <= x_high else None
    marked: dict[tuple[int, int], str] = {}
    if zero is not None:
        for r in range(height):
            if not cells[r][zero]:
                marked[(r, zero)] = ":"
    if operating is not None and x_low <= operating <= x_high:
        life = _life_at(points, operating)
        if math.isfinite(life):
            marked[(min(height - 1, round(row(life)) // 4), round(column(operating)) // 2)] = "●"
    lines = []
    for r in range(height):
        label = fmt(y_high * (1.0 - r / max(height - 1, 1)), 3) if r in (0, height - 1) else ""
        body = "".join(marked.get((r, c)) or chr(_BRAILLE_BASE + cells[r][c]) for c in range(width))
        lines.append(f"{label:>{GUTTER - 1}}│{body}")
    band = []
    for c in range(width):
        x = x_low + (x_high - x_low) * (2 * c + 0.5) / (2 * width - 1)
        life = _life_at(points, x)
        band.append(NO_POINT if not math.isfinite(life) else
                    HELPS if life > reference else HURTS)
    lines.append(f"{'vs Pd=0':>{GUTTER - 1}}│{''.join(band)}")
    left, right = f"{fmt(1000.0 * x_low, 3)} µm", f"{fmt(1000.0 * x_high, 3)} µm"
    axis = [" "] * width
    for offset, character in enumerate(left[:width]):
        axis[offset] = character
    if zero is not None and len(left) < zero < width - len(right) - 1:
        axis[zero] = "0"
    for offset, character in enumerate(right[-width:]):
        axis[width - len(right[-width:]) + offset] = character
    lines.append(f"{'Pd':>{GUTTER - 1}} {''.join(axis)}")
    return lines


RING_HALF_WIDTH = 8  # columns from the ring's centre to its side (a terminal cell is twice as tall)
RING_HALF_HEIGHT = 4
NO_CONTACT = "·"
LOAD_BAR_WIDTH = 12
LOAD_BAR_FULL, LOAD_BAR_EMPTY = "█", "·"


def load_digit(load: float, q_max: float) -> str:
    """An element's load as one character: tenths of ``q_max`` as a digit (0 … 9, the largest
    load 9), or a dot for an element out of contact."""
    if not load > 0.0 or not q_max > 0.0:
        return NO_CONTACT
    return str(min(9, int(10.0 * load / q_max)))


def ring_art(angles_deg: Sequence[float], loads: Sequence[float], q_max: float, *,
             half_width: int = RING_HALF_WIDTH, half_height: int = RING_HALF_HEIGHT,
             centre: str = "Fr↓") -> list[str]:
    """The elements around the ring as text: each at its azimuth ψ on an ellipse (a terminal
    cell is about twice as tall as wide, so this reads as a circle), ψ = 0 at the bottom where
    Fr pushes the inner ring, ψ growing counter-clockwise; each drawn by :func:`load_digit`.
    Two elements falling on one cell show the larger load."""
    width, height = 2 * half_width + 1, 2 * half_height + 1
    grid = [[" "] * width for _ in range(height)]
    drawn: dict[tuple[int, int], float] = {}
    for angle, load in zip(angles_deg, loads):
        psi = math.radians(angle)
        column = half_width + round(half_width * math.sin(psi))
        row = half_height + round(half_height * math.cos(psi))
        shown = load if load > 0.0 else -1.0
        if drawn.get((row, column), -math.inf) < shown:
            drawn[(row, column)] = shown
            grid[row][column] = load_digit(load, q_max)
    start = max(half_width - len(centre) // 2, 0)
    for offset, character in enumerate(centre[: width]):
        grid[half_height][start + offset] = character
    return ["".join(line) for line in grid]


def load_bar(load: float, q_max: float, width: int = LOAD_BAR_WIDTH) -> str:
    """A load as a bar of ``width`` cells against ``q_max``."""
    filled = round(width * min(load / q_max, 1.0)) if load > 0.0 and q_max > 0.0 else 0
    return LOAD_BAR_FULL * filled + LOAD_BAR_EMPTY * (width - filled)
