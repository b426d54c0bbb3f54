"""Life against operating clearance for the What-if pane: where slight preload helps, where it
hurts.

The reference rating life L10r (ISO/TS 16281-style, from the element loads: Hertz, the
ring-displacement equilibrium of Jones, Harris and Kotzalas) of the selected case is swept over
operating clearance from a preload to a loose fit by
:func:`workbench.model.internal_form.clearance_curve_for_case` (a pair's axial preload set
aside, the clearance standing for it).  The plot is braille dots on a linear clearance axis
with zero clearance marked, and under it one character a column: ``+`` where the life is above
its zero-clearance value (slight preload helps: more elements share the load), ``-`` where it
is below (a loose fit narrows the load zone; heavy preload loads every element on top of the
external load), ``x`` where no equilibrium exists.  Plain characters throughout, so it reads
in monochrome.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from ..engine.internal.analysis import SweepPoint
from ..engine.record import fmt
from ..model.fields import FieldError, parse_field
from ..model.internal_form import NoEquilibrium, clearance_curve_for_case
from .inside_pane import InsideRequest, input_label

POINTS = 25
GUTTER = 10  # as the What-if pane's other plots (workbench.model.plot_text)
HELPS, HURTS, NO_POINT = "+", "-", "x"
_BRAILLE_BASE = 0x2800
_DOT_BITS = ((0x01, 0x08), (0x02, 0x10), (0x04, 0x20), (0x40, 0x80))  # [row][column]


@dataclass(frozen=True)
class ClearanceCurve:
    """L10r (10⁶ rev) against operating clearance (mm, negative: preload), or why there is
    none."""

    points: tuple[SweepPoint, ...] = ()
    problem: str | None = None
    operating: float | None = None
    """The case's own operating clearance (mm), when its bearing gives one."""


NO_CURVE = ClearanceCurve(problem="No clearance curve yet.")


def clearance_curve(request: InsideRequest, count: int = POINTS) -> ClearanceCurve:
    """The sweep for one inside request (see :mod:`workbench.tui.inside_pane`), in words when
    the case has no geometry or the analysis refuses it."""
    if request.problem is not None or request.inputs is None:
        return ClearanceCurve(problem=request.problem or "No load case selected.")
    if request.geometry is None:
        return ClearanceCurve(problem=f"No clearance curve: bearing {request.bearing} has no "
                                      "internal geometry (the Inside pane, f8, says how to give "
                                      "it).")
    try:
        points = clearance_curve_for_case(request.inputs, request.geometry, request.fit,
                                          count=count)
    except (FieldError, NoEquilibrium) as exc:
        return ClearanceCurve(problem=f"No clearance curve: {input_label(exc.field)}: "
                                      f"{exc.message}")
    text = request.fit.get("clearance", "")
    operating = parse_field("clearance", text) if text.strip() else 0.0
    return ClearanceCurve(tuple(points), operating=float(operating)  # type: ignore[arg-type]
                          if "preload" not in request.fit else None)


def clearance_section(curve: ClearanceCurve, width: int, height: int) -> tuple[list[str], list[str]]:
    """The What-if pane's block: the plot (lines kept whole), and what it says in words with
    the legend (lines to wrap); or no plot and why there is no curve."""
    if curve.problem is not None:
        return [], [curve.problem]
    return plot_lines(curve, width, height, curve.operating), [*verdict_lines(curve), LEGEND]


def _life_at(points: tuple[SweepPoint, ...], clearance: float) -> float:
    """L10r at ``clearance`` by linear interpolation between the swept points (NaN outside or
    where a neighbour has no equilibrium)."""
    for low, high in zip(points, points[1:]):
        if low.clearance <= clearance <= high.clearance:
            share = (clearance - low.clearance) / (high.clearance - low.clearance)
            return low.life + share * (high.life - low.life)
    return math.nan


def verdict_lines(curve: ClearanceCurve) -> list[str]:
    """In words: the life at zero clearance, the best clearance, and from which preload on the
    life falls below its zero-clearance value."""
    points = curve.points
    reference = _life_at(points, 0.0)
    lives = [p for p in points if math.isfinite(p.life)]
    if not lives or not math.isfinite(reference) or reference <= 0.0:
        return ["No life at zero clearance to compare with."]
    best = max(lives, key=lambda p: p.life)
    lines = [f"L10r at zero clearance {fmt(reference, 4)} 10⁶ rev; the best "
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


def plot_lines(curve: ClearanceCurve, width: int, height: int,
               operating: float | None = None) -> list[str]:
    """The curve in ``height`` lines of braille and a band line of ``+``/``-``/``x`` under it,
    then the clearance axis: ``height`` + 2 lines of ``GUTTER`` + ``width`` characters.  A
    ``●`` marks ``operating`` (mm) when it is given and inside the range."""
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
            cx, cy = round(column(x)), min(4 * height - 1, max(0, round(row(y))))
            cells[cy // 4][cx // 2] |= _DOT_BITS[cy % 4][cx % 2]
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


LEGEND = (f"L10r (10⁶ rev) against operating clearance Pd; negative: preload. Under it, "
          f"{HELPS} life above its value at Pd = 0, {HURTS} below, {NO_POINT} no equilibrium; "
          ": zero clearance; ● the case's clearance.")
