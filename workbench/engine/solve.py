"""Back-solve any one input of a load case so that one result meets a target: every root.

The physics is :func:`workbench.engine.derive.derive` itself (``keep_steps=False``): the solver
never holds a second copy.  The chain is smooth only in pieces, so the search works piece by piece:

1. Scan the searched range on a grid (log space for quantities that span decades).
2. At each point read the *state* of the chain from the derivation's results: whether the case is
   valid at all (a single-direction thrust bearing refuses Fa/Fr ≤ e), which side of e the load
   falls on (ISO 281:2007 §5.2–§8.2), where κ lies against 0.1, 0.4, 1 and 4 (the aISO clamps and
   formula pieces, §9.3.2), which ν1 formula applies (n against 1000 r/min, §9.3.3), whether aISO
   sits at its cap of 50, and whether P0 = Fr governs (ISO 76:2006).  Between grid points whose
   states differ, the boundary is located to about 1e-13 of the range (Brent's method on a smooth
   indicator such as ln(κ/0.4) where there is one, bisection otherwise), and both sides of it
   become points of the scan.
3. Each smooth piece gets at least :data:`PIECE_POINTS` points; where the samples of a piece turn
   (a local maximum below the target or a minimum above it), the extremum is found with bounded
   Brent minimisation, so two roots either side of a narrow peak are not missed.
4. Every sign change inside a piece is a root (``brentq``); a sign change across a boundary is a
   root only where the result is continuous there (a kink), else the result jumps across the
   target and there is no exact root.

All roots are reported, smallest first (:attr:`Solution.value` is the smallest): callers that must
have one answer treat more than one as "narrow the question" (``calc`` exits 3 listing them).  With
no root, the reachable range is stated from the real extremes: the values either side of every
boundary and the refined extrema, not the grid's ends.  Table rows of e and Y (linear
interpolation) are kinks of a continuous P and are not located; the extremum search covers them.
"""

from __future__ import annotations

import math
from bisect import bisect_right
from dataclasses import dataclass, replace
from itertools import pairwise
from typing import Any, NamedTuple

from .derive import SPEED_MISSING, CaseInputs, derive
from .life import AISO_CAP, KAPPA_MAX, KAPPA_MIN, KAPPA_PIECE_LIMITS, NU1_SPEED_SWITCH
from .record import Derivation, InputError, fmt, with_unit

REL_TOL = 1e-9
MAX_EVALUATIONS = 3000  # a guard against a runaway search, far above any real question
GRID_POINTS = 33  # the first scan of the searched range
PIECE_POINTS = 6  # at least this many points on each smooth piece
BOUNDARY_TOL = 1e-13  # a boundary is located to this fraction of the searched range
JUMP_TOL = 1e-6  # a bracketed sign change missing the target by more is a jump, not a root
KAPPA_LIMITS = (KAPPA_MIN, *KAPPA_PIECE_LIMITS, KAPPA_MAX)


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
        Unknown("speed", "speed n", "r/min", 1e-3, 1e7, True),
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

# The boundaries where the result can jump, in words ("the result jumps across the target at …");
# the others (the κ clamps, the aISO cap, P0 = Fr) are kinks of a continuous result.
_JUMP_WORDS = {
    "branch": "the e switch (Fa/Fr = e)",
    "kappa": "a joint of the aISO pieces (κ = 0.4 or 1)",
    "nu1": f"the ν1 switch at n = {NU1_SPEED_SWITCH:g} r/min",
}
# The parts of the state that can change the result, per target (P0 plays no part in a life,
# lubrication none in s0 or the basic life).
_PARTS: dict[str, tuple[str, ...]] = {
    "L10h": ("valid", "branch"),
    "L10": ("valid", "branch"),
    "Lnm": ("valid", "branch", "kappa", "nu1", "cap"),
    "Lnm_mrev": ("valid", "branch", "kappa", "nu1", "cap"),
    "s0": ("valid", "floor"),
}


class NoSolution(InputError):
    """No value of the unknown meets the target; ``reachable`` is the range the result can take."""

    def __init__(self, field_name: str, message: str,
                 reachable: tuple[float, float] | None = None) -> None:
        super().__init__(field_name, message)
        self.reachable = reachable


@dataclass(slots=True)
class Solution:
    """The solved value, how it was found, and the forward derivation re-run at it.

    ``roots`` holds every value of the unknown that meets the target within the searched range,
    smallest first; ``value`` is the smallest and the derivation is taken there.
    """

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
    roots: tuple[float, ...]
    searched: tuple[float, float]  # the range of the unknown that was searched

    def as_dict(self) -> dict[str, object]:
        """The ``solved`` object of ``calc --json``."""
        return {
            "name": self.unknown, "value": self.value, "unit": self.unit,
            "roots": list(self.roots), "target": self.target, "target_value": self.target_value,
            "achieved": self.achieved, "residual": self.residual,
            "evaluations": self.evaluations, "bracket": list(self.bracket), "branch": self.branch,
            "searched": list(self.searched),
        }

    def roots_text(self) -> str:
        """Every root with the unknown's unit, e.g. "21.4, 925.9, 941.8, 1022 r/min"."""
        unit = f" {self.unit}" if self.unit else ""
        return ", ".join(fmt(r, 6) for r in self.roots) + unit

    def several_roots_message(self) -> str:
        """Why one answer cannot be given: the roots, and how to narrow the question."""
        spec = UNKNOWNS[self.unknown]
        unit = TARGETS[self.target][1]
        return (f"{len(self.roots)} values of {spec.label} meet {self.target} = "
                f"{_amount(self.target_value, unit)}: {self.roots_text()}; narrow the search "
                "range to choose one")


def apply_unknown(case: CaseInputs, unknown: str, value: float) -> CaseInputs:
    """The case with the unknown set to ``value`` (``load_scale`` scales Fr and Fa together)."""
    if unknown == "load_scale":
        return replace(case, fr=case.fr * value, fa=case.fa * value)
    changes: dict[str, Any] = {unknown: value}
    return replace(case, **changes)


def _bounds(case: CaseInputs, unknown: Unknown) -> tuple[float, float]:
    """The range searched; reliability follows the limits of the chosen model."""
    if unknown.name == "reliability":
        if case.reliability_model == "iso281":
            return 0.90, 0.9995
        return 1e-6, 1.0 - 1e-12
    return unknown.low, unknown.high


def search_range(case: CaseInputs, unknown: str,
                 between: tuple[float, float] | None = None) -> tuple[float, float]:
    """The range of ``unknown`` searched: ``between`` (checked) or the unknown's whole range."""
    spec = UNKNOWNS[unknown]
    if between is None:
        return _bounds(case, spec)
    low, high = between
    if not (math.isfinite(low) and math.isfinite(high)):
        raise InputError("between", "the search range needs two finite numbers")
    if not low < high:
        raise InputError("between", "the search range must run from a lower to a higher value")
    if spec.log and low <= 0:
        raise InputError("between", f"{spec.label} is searched above zero: give a low end above 0")
    if unknown == "reliability" and not (0.0 < low and high < 1.0):
        raise InputError("between", "a reliability range must lie between 0 and 1")
    return low, high


def _branch(derivation: Derivation) -> str:
    """Which side of e the solution fell on, in words."""
    ratio = derivation.peek("ratio")
    if ratio is not None and ratio.note:
        return ratio.note.removeprefix("branch: ")
    return "no e switch for this kind"


class _Point(NamedTuple):
    """One evaluation: ln(result/target) (NaN where the case is refused), the chain's state, and
    a smooth indicator per part of the state where one exists (NaN otherwise)."""

    u: float
    residual: float
    state: tuple[object, ...]
    signals: tuple[float, ...]


def _clip(value: float) -> float:
    """A residual brentq can take: ±∞ (a life of 0 or ∞) held to the largest finite floats."""
    return max(-1e300, min(1e300, value))


class _Search:
    """The scan of one question: evaluations (cached by position), boundaries, pieces, roots."""

    def __init__(self, case: CaseInputs, spec: Unknown, target: str, target_value: float,
                 low: float, high: float) -> None:
        self.case, self.spec, self.target = case, spec, target
        self.log_target = math.log(target_value)
        self.parts = _PARTS[target]
        self.u_low, self.u_high = (math.log(low), math.log(high)) if spec.log else (low, high)
        self.tol = BOUNDARY_TOL * (self.u_high - self.u_low)
        self.cache: dict[float, _Point] = {}
        self.jumps: list[tuple[float, str]] = []  # (u, part) where the result jumps across

    def x(self, u: float) -> float:
        """The unknown's value at position ``u``."""
        return math.exp(u) if self.spec.log else u

    def point(self, u: float) -> _Point:
        """The evaluation at position ``u`` (cached: the scan, the boundaries and Brent share it)."""
        cached = self.cache.get(u)
        if cached is not None:
            return cached
        if len(self.cache) >= MAX_EVALUATIONS:
            raise NoSolution(self.spec.name, "the solver ran out of evaluations")
        case = apply_unknown(self.case, self.spec.name, self.x(u))
        try:
            results = derive(case, keep_steps=False).results
        except InputError:
            point = _Point(u, math.nan, (False,) + (None,) * (len(self.parts) - 1),
                           (math.nan,) * len(self.parts))
        else:
            point = self._read(u, case, results)
        self.cache[u] = point
        return point

    def _read(self, u: float, case: CaseInputs, results: dict[str, float]) -> _Point:
        """The residual and the state of the chain from one derivation's results."""
        value = results[self.target]
        if math.isnan(value):
            residual = math.nan
        elif value <= 0.0 or math.isinf(value):
            residual = math.inf if value > 0 else -math.inf
        else:
            residual = math.log(value) - self.log_target  # not log(value/target): it can underflow
        state: list[object] = []
        signals: list[float] = []
        for part in self.parts:
            flag: object = None
            signal = math.nan
            if part == "valid":
                flag = True
            elif part == "branch" and "ratio" in results:
                ratio, e = results["ratio"], results["e"]
                flag = ratio > e
                if 0.0 < ratio < math.inf and 0.0 < e < math.inf:
                    signal = math.log(ratio / e)
            elif part == "kappa" and "nu1" in results:
                kappa = results["nu"] / results["nu1"]
                flag = bisect_right(KAPPA_LIMITS, kappa)
                signal = math.log(kappa)
            elif part == "nu1" and "nu1" in results:
                flag = case.speed >= NU1_SPEED_SWITCH
                signal = math.log(case.speed / NU1_SPEED_SWITCH)
            elif part == "cap" and "nu1" in results:
                flag = results["aISO"] >= AISO_CAP
            elif part == "floor" and "X0" in results:
                flag = results["P0"] == case.fr
            state.append(flag)
            signals.append(signal)
        return _Point(u, residual, tuple(state), tuple(signals))

    # ---- boundaries -----------------------------------------------------------------------
    def split(self, points: list[_Point]) -> list[_Point]:
        """``points`` with both sides of every boundary between neighbours of different state."""
        out = [points[0]]
        for b in points[1:]:
            a = out[-1]
            while a.state != b.state and b.u - a.u > self.tol:
                lo, hi = self.locate(a, b)
                out += [p for p in (lo, hi) if p.u != out[-1].u and p.u != b.u]
                a = hi
            out.append(b)
        return out

    def locate(self, a: _Point, b: _Point) -> tuple[_Point, _Point]:
        """Two points within ``tol`` either side of the first change of state after ``a``."""
        lo, hi = a, b
        index = next(i for i, (s, t) in enumerate(zip(a.state, b.state)) if s != t)
        guess = self._indicator_root(a, b, index)
        if guess is not None:
            for u in (guess, guess - self.tol, guess + self.tol):
                if lo.u < u < hi.u:
                    p = self.point(u)
                    lo, hi = (p, hi) if p.state == a.state else (lo, p)
        while hi.u - lo.u > self.tol:
            mid = self.point(0.5 * (lo.u + hi.u))
            lo, hi = (mid, hi) if mid.state == a.state else (lo, mid)
        return lo, hi

    def _indicator_root(self, a: _Point, b: _Point, index: int) -> float | None:
        """Where the smooth indicator of part ``index`` crosses its threshold, if it has one."""
        sa, sb = a.signals[index], b.signals[index]
        if math.isnan(sa) or math.isnan(sb):
            return None
        offset = 0.0
        if self.parts[index] == "kappa":
            low_level, high_level = a.state[index], b.state[index]
            assert isinstance(low_level, int) and isinstance(high_level, int)
            offset = math.log(KAPPA_LIMITS[min(low_level, high_level)])
        fa_, fb_ = sa - offset, sb - offset
        if fa_ == 0.0 or fb_ == 0.0 or (fa_ < 0) == (fb_ < 0):
            return None
        from scipy.optimize import brentq

        def indicator(u: float) -> float:
            signal = self.point(u).signals[index]
            return (signal - offset) if not math.isnan(signal) else (fb_ if u > a.u else fa_)

        return float(brentq(indicator, a.u, b.u, xtol=self.tol, maxiter=100))

    # ---- pieces ---------------------------------------------------------------------------
    def pieces(self, points: list[_Point]) -> list[list[_Point]]:
        """Runs of neighbouring valid points that share one state (one smooth piece each)."""
        runs: list[list[_Point]] = []
        for p in points:
            if runs and runs[-1][-1].state == p.state and runs[-1][-1].state[0]:
                runs[-1].append(p)
            else:
                runs.append([p])
        return [run for run in runs if run[0].state[0]]

    def fill(self, points: list[_Point]) -> list[_Point]:
        """Add evenly spaced points to every piece that has fewer than :data:`PIECE_POINTS`."""
        extra: list[_Point] = []
        for run in self.pieces(points):
            start, end = run[0].u, run[-1].u
            if len(run) >= PIECE_POINTS or end - start <= 2 * self.tol * PIECE_POINTS:
                continue
            step = (end - start) / (PIECE_POINTS - 1)
            extra += [self.point(start + i * step) for i in range(1, PIECE_POINTS - 1)]
        return sorted({p.u: p for p in points + extra}.values())

    def refine_extrema(self, points: list[_Point], every: bool) -> list[_Point]:
        """Add the extremum where a piece's samples turn: a maximum below the target or a minimum
        above it could hide two roots (``every``: all of them, for the reachable range)."""
        extra: list[_Point] = []
        for run in self.pieces(points):
            for a, b, c in zip(run, run[1:], run[2:]):
                rise, fall = b.residual - a.residual, c.residual - b.residual
                if not rise * fall < 0:
                    continue
                peak = rise > 0
                if every or (peak and b.residual < 0) or (not peak and b.residual > 0):
                    extra.append(self._extremum(a.u, c.u, peak))
        if not extra:
            return points
        return sorted({p.u: p for p in points + extra}.values())

    def _extremum(self, a: float, c: float, peak: bool) -> _Point:
        """The highest (``peak``) or lowest point between ``a`` and ``c``, by bounded Brent."""
        from scipy.optimize import minimize_scalar

        sign = -1.0 if peak else 1.0

        def objective(u: float) -> float:
            value = self.point(u).residual
            return math.inf if math.isnan(value) else sign * _clip(value)

        found = minimize_scalar(objective, bounds=(a, c), method="bounded",
                                options={"xatol": self.tol})
        return self.point(float(found.x))

    # ---- roots ----------------------------------------------------------------------------
    def roots(self, points: list[_Point]) -> list[tuple[float, tuple[float, float]]]:
        """Every root with its bracket: sign changes within a piece, and across a boundary
        where the result is continuous (a kink); a jump across the target is recorded instead."""
        found: list[tuple[float, tuple[float, float]]] = []
        for a, b in pairwise(points):
            if math.isnan(a.residual) or math.isnan(b.residual):
                continue
            if a.residual == 0.0:
                found.append((a.u, (a.u, a.u)))
                continue
            if b.residual == 0.0 or (a.residual < 0) == (b.residual < 0):
                continue
            u = self._brent(a.u, b.u)
            if abs(self.point(u).residual) <= JUMP_TOL:
                found.append((u, (a.u, b.u)))
            else:
                part = next((self.parts[i] for i, (s, t) in enumerate(zip(a.state, b.state))
                             if s != t), "")
                self.jumps.append((u, part))
        last = points[-1]
        if last.residual == 0.0:
            found.append((last.u, (last.u, last.u)))
        return found

    def _brent(self, a: float, b: float) -> float:
        """The root between ``a`` and ``b`` by brentq, to 1e-12 in ln x (relative on x for a linear
        unknown): with the residual ln(result/target) that meets the target within 1e-9."""
        from scipy.optimize import brentq

        xtol = 1e-3 * REL_TOL * (1.0 if self.spec.log else max(abs(a), abs(b)))
        return float(brentq(lambda u: _clip(self.point(u).residual), a, b, xtol=xtol, maxiter=200))

    def flat_at_target(self, points: list[_Point]) -> tuple[float, float] | None:
        """The widest run of neighbouring points that all meet the target exactly (the result
        does not move with the unknown there), or None."""
        runs: list[tuple[float, float]] = []
        start: float | None = None
        for a, b in pairwise(points):
            if a.residual == 0.0 and b.residual == 0.0:
                start = a.u if start is None else start
                runs.append((start, b.u))
            else:
                start = None
        if not runs:
            return None
        low, high = max(runs, key=lambda run: run[1] - run[0])
        return self.x(low), self.x(high)


def solve(case: CaseInputs, unknown: str, target: str, target_value: float,
          between: tuple[float, float] | None = None) -> Solution:
    """Every value of ``unknown`` at which result ``target`` equals ``target_value``.

    ``between`` limits the search to (low, high) in the unknown's engine unit (N, r/min, or a
    plain number); by default the unknown's whole range.  Returns a :class:`Solution` whose
    ``roots`` lists them all, smallest first (``value`` is the smallest).  Raises
    :class:`NoSolution` when no value meets the target (with the reachable range where one
    exists, from the true extremes of each smooth piece and the values at its boundaries), and
    InputError for a bad request.
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
        raise NoSolution("speed", f"{SPEED_MISSING}, so a life in hours is undefined: "
                                          "give a speed")
    low, high = search_range(case, unknown, between)
    search = _Search(case, spec, target, target_value, low, high)
    step = (search.u_high - search.u_low) / (GRID_POINTS - 1)
    points = [search.point(search.u_low + i * step) for i in range(GRID_POINTS - 1)]
    points.append(search.point(search.u_high))
    points = search.split(points)
    points = search.split(search.fill(points))
    points = search.split(search.refine_extrema(points, every=False))
    flat = search.flat_at_target(points)
    if flat is not None:
        unit = TARGETS[target][1]
        raise NoSolution(unknown, f"{target} stays at {_amount(target_value, unit)} for every "
                                  f"{spec.label} from {fmt(flat[0])} to "
                                  f"{_amount(flat[1], spec.unit)}: no single answer",
                         (target_value, target_value))
    found = search.roots(points)
    if not found:
        points = search.split(search.refine_extrema(points, every=True))
        found = search.roots(points)
    if not found:
        raise _no_root(search, points, target_value, between is not None, low, high)
    found.sort()
    roots = tuple(search.x(u) for u, _ in found)
    a, b = found[0][1]
    x = roots[0]
    solved_case = apply_unknown(case, unknown, x)
    forward = derive(solved_case)
    achieved = forward.results[target]
    rel = (achieved - target_value) / target_value
    bracket = (search.x(a), search.x(b))
    unit = TARGETS[target][1]
    note = f"{len(search.cache)} evaluations, relative residual {rel:.1e}"
    warning = None
    if len(roots) > 1:
        others = ", ".join(fmt(r) for r in roots[1:])
        note += f"; the smallest of {len(roots)} roots"
        warning = (f"{len(roots)} values of {spec.label} meet {target} = "
                   f"{_amount(target_value, unit)}; shown at the smallest, also at "
                   + (f"{others} {spec.unit}" if spec.unit else others))
    forward.add("solved", x, symbol=unknown, label=f"Solved {spec.label}",
                formula=f"{target} = {_amount(target_value, unit)}",
                template="brentq on [{0}, {1}]", args=bracket, unit=spec.unit,
                source="root finding (Brent's method)",
                warning=warning, note=note, result=False)
    return Solution(unknown, x, spec.unit, target, target_value, achieved, rel,
                    len(search.cache), bracket, _branch(forward), forward, solved_case,
                    roots, (low, high))


def _no_root(search: _Search, points: list[_Point], target_value: float, limited: bool,
             low: float, high: float) -> NoSolution:
    """Why nothing meets the target: a jump across it, or the range the result can take."""
    spec, target = search.spec, search.target
    label, unit = TARGETS[target]
    if search.jumps:
        at, part = search.jumps[0]
        where = _JUMP_WORDS.get(part, "a step of the chain")
        return NoSolution(spec.name, f"the result jumps across the target at {where}, near "
                                     f"{spec.label} = {fmt(search.x(at))}: no exact root")
    finite = [p.residual for p in points if not math.isnan(p.residual)]
    if not finite:
        return NoSolution(spec.name, f"no {spec.label} gives a valid case; check the other inputs")
    low_v, high_v = (_exp(math.log(target_value) + r) for r in (min(finite), max(finite)))
    span = (f"from {spec.label} = {fmt(low)} to {_amount(high, spec.unit)}" if limited
            else "over its range")
    return NoSolution(
        spec.name,
        f"no {spec.label} reaches {target} = {_amount(target_value, unit)}: {span} the "
        f"{label} runs from {fmt(low_v)} to {_amount(high_v, unit)}",
        (low_v, high_v),
    )


def _amount(value: float, unit: str) -> str:
    """A number with its unit, if it has one."""
    return with_unit(fmt(value), unit)


def _exp(log_value: float) -> float:
    """e^x, infinite where it exceeds the largest float (a reachable range can be that wide)."""
    try:
        return math.exp(log_value)
    except OverflowError:
        return math.inf
