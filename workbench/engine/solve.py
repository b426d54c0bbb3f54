"""Back-solve any one input of a load case so that one result meets a target.

Root-finding with :func:`scipy.optimize.brentq` on a bracket found by safe expansion, in log space
for quantities that span decades.  The physics is :func:`workbench.engine.derive.derive` itself: the
solver never holds a second copy.  The e switch and the table interpolation make P piecewise, so
the bracket is scanned on a grid first; every sign change is a root and more than one is reported.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace
from typing import Callable

from .derive import CaseInputs, derive
from .record import Derivation, InputError, fmt

REL_TOL = 1e-9
MAX_EVALUATIONS = 400
GRID_POINTS = 25  # scan for sign changes before brentq: catches a second root or a jump
SWITCH_BISECTIONS = 24  # locate an e switch between grid points to about 1e-6 of the span


@dataclass(frozen=True, slots=True)
class Unknown:
    """An input the solver can vary: its label, unit, the range it may take, and how it scales."""

    name: str
    label: str
    unit: str
    low: float
    high: float
    log: bool


UNKNOWNS: dict[str, Unknown] = {
    u.name: u
    for u in (
        Unknown("c", "dynamic rating C", "N", 1.0, 1e9, True),
        Unknown("c0", "static rating C0", "N", 1.0, 1e9, True),
        Unknown("fr", "radial load Fr", "N", 1e-3, 1e9, True),
        Unknown("fa", "axial load Fa", "N", 1e-3, 1e9, True),
        Unknown("load_scale", "scale on Fr and Fa", "", 1e-6, 1e6, True),
        Unknown("speed", "speed n", "rpm", 1e-3, 1e7, True),
        Unknown("reliability", "reliability R", "", 0.0, 1.0, False),
        Unknown("af", "application factor af", "", 1e-3, 1e3, True),
    )
}

TARGETS: dict[str, tuple[str, str]] = {
    "L10h": ("basic rating life", "h"),
    "Lnm": ("modified rating life", "h"),
    "L10": ("basic rating life", "10⁶ rev"),
    "Lnm_mrev": ("modified rating life", "10⁶ rev"),
    "s0": ("static safety factor", ""),
}


class NoSolution(InputError):
    """No value of the unknown meets the target; ``reachable`` is the range the result can take."""

    def __init__(self, field_name: str, message: str,
                 reachable: tuple[float, float] | None = None) -> None:
        super().__init__(field_name, message)
        self.reachable = reachable


@dataclass(slots=True)
class Solution:
    """The solved value, how it was found, and the forward derivation re-run at it."""

    unknown: str
    value: float
    unit: str
    target: str
    target_value: float
    achieved: float
    residual: float
    evaluations: int
    bracket: tuple[float, float]
    branch: str
    derivation: Derivation
    inputs: CaseInputs

    def as_dict(self) -> dict[str, object]:
        """The ``solved`` object of ``calc --json``."""
        return {
            "name": self.unknown, "value": self.value, "unit": self.unit,
            "target": self.target, "target_value": self.target_value,
            "achieved": self.achieved, "residual": self.residual,
            "evaluations": self.evaluations, "bracket": list(self.bracket), "branch": self.branch,
        }


def apply_unknown(case: CaseInputs, unknown: str, value: float) -> CaseInputs:
    """The case with the unknown set to ``value`` (``load_scale`` scales Fr and Fa together)."""
    if unknown == "load_scale":
        return replace(case, fr=case.fr * value, fa=case.fa * value)
    return replace(case, **{unknown: value})


def _bounds(case: CaseInputs, unknown: Unknown) -> tuple[float, float]:
    """The range searched; reliability follows the limits of the chosen model."""
    if unknown.name == "reliability":
        if case.reliability_model == "iso281":
            return 0.90, 0.9995
        return 1e-6, 1.0 - 1e-12
    return unknown.low, unknown.high


def _branch(derivation: Derivation) -> str:
    """Which side of e the solution fell on, in words."""
    ratio = derivation.peek("ratio")
    if ratio is not None and ratio.note:
        return ratio.note.removeprefix("branch: ")
    return "no e switch for this kind"


def solve(case: CaseInputs, unknown: str, target: str, target_value: float) -> Solution:
    """Find the value of ``unknown`` at which result ``target`` equals ``target_value``.

    Raises :class:`NoSolution` (with the reachable range where one exists) when no value of the
    unknown can meet the target or when several can, and InputError for a bad request.
    """
    if unknown not in UNKNOWNS:
        raise InputError("solve", f"cannot solve for {unknown!r}; choose one of {', '.join(UNKNOWNS)}")
    if target not in TARGETS:
        raise InputError("target", f"unknown target {target!r}; choose one of {', '.join(TARGETS)}")
    if not (math.isfinite(target_value) and target_value > 0):
        raise InputError("target", "the target value must be a finite number above zero")
    spec = UNKNOWNS[unknown]
    if unknown == "load_scale" and case.fr == 0 and case.fa == 0:
        raise InputError("fr", "scaling needs a load to scale")
    if target in ("L10h", "Lnm") and unknown != "speed" and case.speed <= 0:
        raise NoSolution("speed", "speed is 0, so a life in hours is undefined: give a speed")
    counter = [0]
    log_target = math.log(target_value)

    branches: dict[float, bool | None] = {}  # u → on the Fa/Fr > e branch (None: no switch)
    switches: list[tuple[float, float]] = []  # (u, u) bracketing each e switch, ~1e-6 apart

    def result_at(u: float) -> float:
        counter[0] += 1
        if counter[0] > MAX_EVALUATIONS:
            raise NoSolution(unknown, "the solver ran out of evaluations")
        x = math.exp(u) if spec.log else u
        try:
            results = derive(apply_unknown(case, unknown, x), keep_steps=False).results
        except InputError:
            branches[u] = None
            return math.nan
        branches[u] = results["ratio"] > results["e"] if "ratio" in results else None
        return results[target]

    def residual(u: float) -> float:
        value = result_at(u)
        if math.isnan(value) or value <= 0 or math.isinf(value):
            return math.nan if math.isnan(value) else (math.inf if value > 0 else -math.inf)
        return math.log(value) - log_target  # not log(value/target): the ratio can underflow

    def with_switches(grid: list[float], values: list[float]) -> tuple[list[float], list[float]]:
        """Add the points either side of each e switch between grid points: P is piecewise and
        the life can peak just past the switch, where a coarse grid would miss it."""
        points, results = [grid[0]], [values[0]]
        for a, b, vb in zip(grid, grid[1:], values[1:]):
            if None not in (branches[a], branches[b]) and branches[a] != branches[b]:
                lo, hi = a, b
                for _ in range(SWITCH_BISECTIONS):
                    mid = 0.5 * (lo + hi)
                    residual(mid)
                    if branches[mid] is None:
                        break
                    lo, hi = (mid, hi) if branches[mid] == branches[a] else (lo, mid)
                switches.append((lo, hi))
                for u in (lo, hi):
                    if u not in (a, b):
                        points.append(u)
                        results.append(residual(u))
            points.append(b)
            results.append(vb)
        return points, results

    low, high = _bounds(case, spec)
    if spec.log:
        u_low, u_high = math.log(low), math.log(high)
    else:
        u_low, u_high = low, high
    grid = _grid(u_low, u_high, GRID_POINTS)
    grid, values = with_switches(grid, [residual(u) for u in grid])
    brackets, lo_val, hi_val = _sign_changes(grid, values)
    jumps = [b for b in brackets if b in switches]  # the target falls in the step at e: no root
    brackets = [b for b in brackets if b not in switches]
    if not brackets and jumps:
        at = math.exp(jumps[0][0]) if spec.log else jumps[0][0]
        raise NoSolution(unknown, f"the result jumps across the target at the e switch near "
                                  f"{spec.label} = {fmt(at)}: no exact root")
    if not brackets:
        raise _no_root(spec, target, target_value, lo_val, hi_val)
    if len(brackets) > 1:
        roots = ", ".join(fmt(math.exp(a) if spec.log else a) for a, _ in brackets)
        raise NoSolution(unknown, f"more than one {spec.label} meets the target (near {roots}); "
                                  "narrow the question")
    a, b = brackets[0]
    root = _brent(residual, a, b, spec.log)
    x = math.exp(root) if spec.log else root
    solved_case = apply_unknown(case, unknown, x)
    forward = derive(solved_case)
    achieved = forward.results[target]
    rel = (achieved - target_value) / target_value
    if abs(rel) > 1e-6:
        raise NoSolution(unknown, f"the result jumps across the target near {spec.label} = {fmt(x)} "
                                  f"({fmt(achieved)} instead of {fmt(target_value)}): no exact root")
    bracket = (math.exp(a), math.exp(b)) if spec.log else (a, b)
    label, unit = TARGETS[target]
    forward.add("solved", x, symbol=unknown, label=f"Solved {spec.label}",
                formula=f"{target} = {fmt(target_value)} {unit}", template="brentq on [{0}, {1}]",
                args=bracket, unit=spec.unit, source="root finding (Brent's method)",
                note=f"{counter[0]} evaluations, relative residual {rel:.1e}", result=False)
    return Solution(unknown, x, spec.unit, target, target_value, achieved, rel, counter[0],
                    bracket, _branch(forward), forward, solved_case)


def _grid(low: float, high: float, count: int) -> list[float]:
    step = (high - low) / (count - 1)
    return [low + i * step for i in range(count)]


def _sign_changes(grid: list[float], values: list[float]
                  ) -> tuple[list[tuple[float, float]], float, float]:
    """Adjacent grid points whose residuals differ in sign; also the finite extremes seen."""
    brackets: list[tuple[float, float]] = []
    finite = [v for v in values if not math.isnan(v)]
    lo_val = min(finite) if finite else math.nan
    hi_val = max(finite) if finite else math.nan
    previous: tuple[float, float] | None = None
    for u, v in zip(grid, values):
        if math.isnan(v):
            previous = None
            continue
        if v == 0.0:
            brackets.append((u, u))
        elif previous is not None and (previous[1] < 0) != (v < 0) and previous[1] != 0.0:
            brackets.append((previous[0], u))
        previous = (u, v)
    return brackets, lo_val, hi_val


def _brent(residual: Callable[[float], float], a: float, b: float, log: bool) -> float:
    """brentq to 1e-9 relative on the unknown (relative on x itself when searching in log space)."""
    from scipy.optimize import brentq

    if a == b:
        return a
    # The residual is ln(result/target), so 1e-12 on it keeps the target within 1e-9 relative
    # with room to spare whatever the life exponent.
    xtol = 1e-3 * REL_TOL * (1.0 if log else max(abs(a), abs(b)))
    return float(brentq(residual, a, b, xtol=xtol, maxiter=200))


def _exp(log_value: float) -> float:
    """e^x, infinite where it exceeds the largest float (a reachable range can be that wide)."""
    try:
        return math.exp(log_value)
    except OverflowError:
        return math.inf


def _no_root(spec: Unknown, target: str, target_value: float, lo: float, hi: float) -> NoSolution:
    """A plain message naming the range the target can take over the unknown's whole span."""
    label, unit = TARGETS[target]
    if math.isnan(lo):
        return NoSolution(spec.name, f"no {spec.label} gives a valid case; check the other inputs")
    low_v, high_v = (_exp(math.log(target_value) + residual) for residual in (lo, hi))
    return NoSolution(
        spec.name,
        f"no {spec.label} reaches {target} = {fmt(target_value)} {unit}: over its range the "
        f"{label} runs from {fmt(low_v)} to {fmt(high_v)} {unit}",
        (low_v, high_v),
    )
