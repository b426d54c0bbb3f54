"""Curves for the what-if plots: life against a load scale, and aISO against κ.

Both are sampled from the engine itself (``derive`` for the life curve, ``life.aiso`` for the aISO
curve), so a plot can never disagree with the derivation it sits beside.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from .derive import CaseInputs, above_e, derive
from .kinds import ROLLER_KINDS, parse_kind
from .life import KAPPA_MAX, KAPPA_MIN, aiso
from .record import InputError
from .solve import apply_unknown

SCALE_LOW, SCALE_HIGH = 0.25, 4.0


@dataclass(frozen=True, slots=True)
class Curve:
    """Sampled points of one curve, the operating point, and marks worth drawing."""

    x: tuple[float, ...]
    y: tuple[float, ...]
    point: tuple[float, float] | None
    x_label: str
    y_label: str
    marks: tuple[tuple[str, float], ...] = ()      # vertical marks: (label, x)
    levels: tuple[tuple[str, float], ...] = ()     # horizontal marks: (label, y)


def _geometric(low: float, high: float, count: int) -> list[float]:
    ratio = (high / low) ** (1.0 / (count - 1))
    return [low * ratio ** i for i in range(count)]


def life_curve(case: CaseInputs, target_h: float | None = None, count: int = 61) -> Curve:
    """Lnm (h, or 10⁶ rev at speed 0) against one scale on Fr and Fa, from 0.25× to 4×.

    The Fa/Fr ≤ e / > e switch is marked where the branch changes between samples (ISO 281 §5.2:
    the ratio stays fixed under scaling, but e moves with the Table 3 index).
    """
    key = "Lnm" if case.speed > 0 else "Lnm_mrev"
    xs, ys, branches = [], [], []
    for scale in _geometric(SCALE_LOW, SCALE_HIGH, count):
        try:
            results = derive(apply_unknown(case, "load_scale", scale), keep_steps=False).results
        except InputError:
            continue
        value = results[key]
        if not (math.isfinite(value) and value > 0):
            continue
        xs.append(scale)
        ys.append(value)
        branches.append(above_e(results))
    marks = tuple(("e switch", math.sqrt(xs[i - 1] * xs[i])) for i in range(1, len(xs))
                  if branches[i] != branches[i - 1])
    base = derive(case, keep_steps=False).results[key]
    levels = (("target", target_h),) if target_h and key == "Lnm" else ()
    unit = "h" if key == "Lnm" else "10⁶ rev"
    return Curve(tuple(xs), tuple(ys), (1.0, base), "load scale on Fr and Fa", f"Lnm ({unit})",
                 marks, levels)


def aiso_curve(case: CaseInputs, count: int = 61) -> Curve | None:
    """aISO against κ from 0.1 to 4 at the case's eC·Cu/P (ISO 281:2007 §9.3.2); None without data."""
    d = derive(case)
    if "kappa" not in d.results:
        return None
    roller = parse_kind(case.kind) in ROLLER_KINDS
    load_ratio = d.results["load_ratio"]
    xs = _geometric(KAPPA_MIN, KAPPA_MAX, count)
    ys = [aiso(k, load_ratio, roller) for k in xs]
    return Curve(tuple(xs), tuple(ys), (d.results["kappa"], d.results["aISO"]), "κ = ν/ν1",
                 f"aISO at eC·Cu/P = {load_ratio:.3g}")
