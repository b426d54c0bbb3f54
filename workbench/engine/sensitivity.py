"""How strongly the life of one load case answers to each of its inputs.

For every numeric input that is set, the elasticity ε = d ln L / d ln x of the modified rating life
(ISO 281:2007 §9.1, Lnm = a1·aISO·L10) and of the static safety s0 (ISO 76:2006) by central
differences on :func:`~workbench.engine.derive.derive` itself, plus the relative life change for
x·0.9 and x·1.1.  The calculation is piecewise (the e switch and the Table 3 interpolation rows,
the aISO cap at 50, the κ limits 0.1 and 4, the ν1 speed switch at 1000 r/min, the P0 ≥ Fr rule),
so where a piece boundary lies within the step the one-sided difference on the side of the case is
used and the item says so.

Reliability is varied through the failure probability F = 1 − R, the way a practitioner reasons
("99 % → 99.5 %" halves F): its elasticity is d ln L / d ln F and its ±10 % are F·0.9 and F·1.1.
An ISO VG grade is a discrete choice and is not varied; the operating temperature is.
"""

from __future__ import annotations

import math
import statistics
import time
from bisect import bisect_right
from dataclasses import dataclass, fields
from typing import Any

from . import tables as T
from .derive import CaseInputs, above_e, derive, validate
from .kinds import life_exponent, parse_kind
from .life import AISO_CAP, KAPPA_MAX, KAPPA_MIN, a1_iso281, weibull_life_factor
from .record import Derivation, InputError, fmt

STEP = 0.01
SWING = 0.10


@dataclass(frozen=True, slots=True)
class SensitivityItem:
    """The response of life (and of s0) to one input.

    ``elasticity`` is d ln L / d ln x, ``minus10`` / ``plus10`` are L(x·0.9)/L − 1 and
    L(x·1.1)/L − 1 (None where that leaves the input's valid range); ``life`` names the life used.
    """

    input: str
    label: str
    value: float
    unit: str
    elasticity: float | None
    elasticity_s0: float | None
    minus10: float | None
    plus10: float | None
    method: str
    life: str
    note: str = ""

    def as_dict(self) -> dict[str, Any]:
        """Plain data for ``calc --json``."""
        return {
            "input": self.input, "label": self.label, "value": self.value, "unit": self.unit,
            "elasticity": self.elasticity, "elasticity_s0": self.elasticity_s0,
            "minus10": self.minus10, "plus10": self.plus10, "method": self.method,
            "life": self.life, "note": self.note,
        }


@dataclass(frozen=True, slots=True)
class _Input:
    name: str
    label: str
    unit: str


_INPUTS: tuple[_Input, ...] = (
    _Input("fr", "radial load Fr", "N"),
    _Input("fa", "axial load Fa", "N"),
    _Input("load_scale", "scale on Fr and Fa", ""),
    _Input("c", "dynamic rating C", "N"),
    _Input("c0", "static rating C0", "N"),
    _Input("f0", "factor f0", ""),
    _Input("speed", "speed n", "r/min"),
    _Input("af", "application factor af", ""),
    _Input("reliability", "failure probability 1 − R", ""),
    _Input("nu", "operating viscosity ν", "mm²/s"),
    _Input("temp", "operating temperature", "°C"),
    _Input("dm", "mean diameter dm", "mm"),
    _Input("cu", "fatigue load limit Cu", "N"),
    _Input("ec", "contamination factor eC", ""),
)

_FIELD_NAMES: tuple[str, ...] = tuple(f.name for f in fields(CaseInputs))
_SLOT: dict[str, int] = {name: i for i, name in enumerate(_FIELD_NAMES)}


@dataclass(frozen=True, slots=True)
class _Point:
    """One derive() run, reduced to what the differences need (a tuple: built ~40 times a call)."""

    life: float
    s0: float
    life_regime: tuple[tuple[str, object], ...]
    static_regime: tuple[tuple[str, object], ...]


@dataclass(frozen=True, slots=True)
class _Step:
    """The relative step of the central differences, with its log widths and its words."""

    up: float       # ln(1 + step)
    down: float     # −ln(1 − step)
    minus: str      # "−1 %"
    plus: str       # "+1 %"

    @classmethod
    def of(cls, step: float) -> _Step:
        """The widths and words of the relative step ``step``, worked out once per sweep."""
        return cls(math.log1p(step), -math.log1p(-step), f"−{100 * step:g} %", f"+{100 * step:g} %")


def sensitivity_of(case: CaseInputs, step: float = STEP) -> list[SensitivityItem]:
    """Elasticity of Lnm (hours when speed > 0, else 10⁶ rev) and s0 to each set input.

    Central differences at x·(1 ± step) on derive() (ISO 281:2007 §9.1 life, ISO 76:2006 s0),
    one-sided where a piece boundary of the calculation lies inside the step; the ±10 % figures
    are direct derive() runs.  Ranked by |elasticity|, signs kept.  InputError on a bad case.
    """
    if not 0.0 < step < SWING:
        raise InputError("step", f"the relative step must lie between 0 and {SWING:g}")
    life_key = "Lnm" if case.speed > 0.0 else "Lnm_mrev"
    life_word = "Lnm (h)" if life_key == "Lnm" else "Lnm (10⁶ rev)"
    runner = _Runner(case, life_key, step)
    items = []
    for spec in _INPUTS:
        value = _input_value(case, spec.name)
        if value is None or value == 0.0:
            continue
        if spec.name == "c":
            items.append(_rating_item(case, spec, value, life_word))
        else:
            items.append(_item(spec, value, runner, step, life_word, case))
    items.sort(key=lambda item: -abs(item.elasticity) if item.elasticity is not None else 1.0)
    return items


def _input_value(case: CaseInputs, name: str) -> float | None:
    """The number varied for ``name``, or None when the input is not in play."""
    if name == "load_scale":
        return 1.0
    if name == "reliability":
        return float(f"{1.0 - case.reliability:.12g}")  # F without the float residue
    if name == "temp" and (case.nu is not None or case.vg is None):
        return None  # temperature only acts through an ISO VG oil's viscosity
    value: float | None = getattr(case, name)
    return value


class _Runner:
    """derive() on the case with one input scaled, each distinct case derived once.

    Reliability is the exception: only a1 holds R (ISO 281:2007 §9.1, Lnm = a1·aISO·L10), so its
    points scale the life by the ratio of the reliability factors after validate() accepts them.
    """

    def __init__(self, case: CaseInputs, life_key: str, step: float) -> None:
        self.values = [getattr(case, name) for name in _FIELD_NAMES]
        self.life_key = life_key
        self.step = _Step.of(step)
        derivation = derive(case, keep_steps=False)
        self.base = _point(derivation, case, life_key)
        self.base_a1 = derivation.results["a1"]
        self.memo: dict[tuple[Any, ...], _Point | None] = {}

    def at(self, name: str, factor: float) -> _Point | None:
        """The point with input ``name`` scaled by ``factor``; None outside its valid range."""
        values = list(self.values)
        if name == "load_scale":
            values[_SLOT["fr"]] *= factor
            values[_SLOT["fa"]] *= factor
        elif name == "reliability":
            values[_SLOT["reliability"]] = 1.0 - (1.0 - values[_SLOT["reliability"]]) * factor
        else:
            values[_SLOT[name]] *= factor
        key = tuple(values)
        if key not in self.memo:  # a point may be None: outside the valid range
            self.memo[key] = self._reliability(key) if name == "reliability" else self._run(key)
        return self.memo[key]

    def _run(self, values: tuple[Any, ...]) -> _Point | None:
        case = CaseInputs(*values)
        try:
            return _point(derive(case, keep_steps=False), case, self.life_key)
        except InputError:
            return None

    def _reliability(self, values: tuple[Any, ...]) -> _Point | None:
        case = CaseInputs(*values)
        try:
            validate(case)
        except InputError:
            return None
        ratio = _reliability_factor(case) / self.base_a1
        return _Point(self.base.life * ratio, self.base.s0, self.base.life_regime,
                      self.base.static_regime)


def _reliability_factor(case: CaseInputs) -> float:
    """a1 at the case's reliability: ISO 281:2007 Table 12 closed form, or the Weibull factor."""
    if case.reliability_model == "iso281":
        return a1_iso281(case.reliability)
    return weibull_life_factor(case.reliability, case.weibull_x0, case.weibull_theta,
                               case.weibull_b)


def _point(derivation: Derivation, case: CaseInputs, life_key: str) -> _Point:
    """Life, s0 and the flags that say which piece of the calculation the case sits on."""
    results = derivation.results
    life: list[tuple[str, object]] = []
    if "ratio" in results:  # the branch of ISO 281 §5.2: Fa/Fr > e or ≤ e
        life.append(("e switch", above_e(results)))
    if "index" in results:
        rows = T.DEEP_GROOVE_INDEX_F0 if case.kind == "deep-groove" else T.ANGULAR_15_INDEX
        segment = bisect_right(rows, results["index"])
        life.append(("table breakpoint", segment if results["Y"] != 0.0 else None))  # acts via Y
    if "nu1" in results:
        raw_kappa = results["nu"] / results["nu1"]
        life += (
            ("ν1 speed switch", case.speed < 1000.0),
            ("κ clamp", raw_kappa < KAPPA_MIN or raw_kappa > KAPPA_MAX),
            ("κ 0.4/1 piece boundary", bisect_right((0.4, 1.0), results["kappa"])),
            ("aISO cap", results["aISO"] >= AISO_CAP),
            ("dm 100 mm column", (case.dm or 0.0) >= 100.0),
        )
    floored = "X0" in results and results["X0"] * case.fr + results["Y0"] * case.fa < case.fr
    static = (("P0 = Fr floor", floored),)
    return _Point(results[life_key], results["s0"], tuple(life), static)


def _differentiate(low: _Point | None, mid: _Point, high: _Point | None, step: _Step,
                   attribute: str, regime: str) -> tuple[float | None, str, str]:
    """(elasticity, method, note) of ``attribute`` from the three points, one-sided at kinks."""
    up, down, minus, plus = step.up, step.down, step.minus, step.plus
    value = getattr(mid, attribute)
    if low is None and high is None:
        return None, "not available", f"{minus} and {plus} both leave the valid range"
    if low is None:
        return (_log(getattr(high, attribute), value) / up, "one-sided (range edge)",
                f"{minus} leaves the valid range: forward difference")
    if high is None:
        return (_log(value, getattr(low, attribute)) / down, "one-sided (range edge)",
                f"{plus} leaves the valid range: backward difference")
    below = _changed(getattr(low, regime), getattr(mid, regime))
    above = _changed(getattr(mid, regime), getattr(high, regime))
    if below and not above:
        return (_log(getattr(high, attribute), value) / up, f"one-sided ({below})",
                f"{below} lies within {minus}: forward difference")
    if above and not below:
        return (_log(value, getattr(low, attribute)) / down, f"one-sided ({above})",
                f"{above} lies within {plus}: backward difference")
    central = _log(getattr(high, attribute), getattr(low, attribute)) / (up + down)
    if above:
        return (central, "central", f"{below} within {minus} and {above} within {plus}: "
                "the central difference spans both")
    return central, "central", ""


def _changed(before: tuple[tuple[str, object], ...], after: tuple[tuple[str, object], ...]) -> str:
    """The name of the first flag that differs between two regimes, or ''."""
    if before == after:  # the common case, settled in one comparison
        return ""
    for (name, a), (_, b) in zip(before, after):
        if a != b:
            return name
    return ""


def _log(numerator: float, denominator: float) -> float:
    """ln(numerator/denominator); NaN where a value is zero or unbounded (no elasticity there)."""
    if not denominator > 0.0:
        return math.nan
    ratio = numerator / denominator
    return math.log(ratio) if 0.0 < ratio < math.inf else math.nan


def _finite(value: float | None) -> float | None:
    """None for a difference that came out undefined (a life of 0 or ∞ on one side)."""
    return value if value is not None and math.isfinite(value) else None


def _item(spec: _Input, value: float, runner: _Runner, step: float, life_word: str,
          case: CaseInputs) -> SensitivityItem:
    """One input's item from derive() runs at x·(1 ± step) and x·(1 ± 10 %)."""
    base = runner.base
    low, high = runner.at(spec.name, 1.0 - step), runner.at(spec.name, 1.0 + step)
    elasticity, method, note = _differentiate(low, base, high, runner.step, "life", "life_regime")
    elasticity_s0, _, note_s0 = _differentiate(low, base, high, runner.step, "s0", "static_regime")
    notes = [note] if note else []
    if note_s0 and note_s0 != note:
        notes.append("s0: " + note_s0)
    if elasticity is not None and _finite(elasticity) is None:
        notes.append("the life is 0 or unbounded here: no elasticity")
    elasticity, elasticity_s0 = _finite(elasticity), _finite(elasticity_s0)
    minus, plus = runner.at(spec.name, 1.0 - SWING), runner.at(spec.name, 1.0 + SWING)
    for point, word in ((minus, "−10 %"), (plus, "+10 %")):
        if point is None:
            notes.append(f"{word} leaves the valid range")
        else:
            crossed = _changed(base.life_regime, point.life_regime)
            if crossed:
                notes.append(f"{crossed} crossed by {word}")
    if spec.name == "reliability":
        notes.insert(0, f"varied as F = 1 − R (R = {fmt(case.reliability)}); "
                        "±10 % means F·0.9 (R up) and F·1.1 (R down)")
    return SensitivityItem(
        spec.name, spec.label, value, spec.unit, elasticity, elasticity_s0,
        _relative(minus, base), _relative(plus, base), method, life_word, "; ".join(notes),
    )


def _relative(point: _Point | None, base: _Point) -> float | None:
    if point is None or not 0.0 < base.life < math.inf:
        return None
    return _finite(point.life / base.life - 1.0)


def _rating_item(case: CaseInputs, spec: _Input, value: float, life_word: str) -> SensitivityItem:
    """C enters only L10 = (C/P)^p (ISO 281:2007 §5.3–§8.3): ε = p exactly, s0 untouched."""
    p = life_exponent(parse_kind(case.kind))
    return SensitivityItem(
        spec.name, spec.label, value, spec.unit, p, 0.0, (1.0 - SWING) ** p - 1.0,
        (1.0 + SWING) ** p - 1.0, "analytic (L ∝ C^p)", life_word,
        f"p = {fmt(p)}: only L10 = (C/P)^p holds C",
    )


BENCHMARK_CASE = CaseInputs(
    kind="deep-groove", fr=5200.0, fa=1100.0, c=33000.0, c0=19000.0, f0=14.0, speed=1450.0,
    af=1.2, reliability=0.95, vg=68.0, temp=70.0, dm=47.5, ec=0.5,
)


def benchmark_sensitivity(repeats: int = 200) -> dict[str, float]:
    """``sensitivity_ms``: median wall time of sensitivity_of() on one case with lubrication data."""
    samples = []
    for _ in range(repeats):
        start = time.perf_counter()
        sensitivity_of(BENCHMARK_CASE)
        samples.append(time.perf_counter() - start)
    return {"sensitivity_ms": 1e3 * statistics.median(samples)}
