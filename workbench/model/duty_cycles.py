"""Duty cycles: a bearing's life over several operating states, and a shaft's system life.

A :class:`DutyCycle` lists load cases of one bearing position with their shares, of the time or
of the revolutions.  :func:`duty_life` evaluates each case with ``evaluate_case`` and sums the
damage by the Palmgren–Miner rule, 1/L = Σ ui/Li, over each state's modified rating life Lnm in
10⁶ revolutions and its revolution share ui (time shares ti become ui = ti·ni/Σ tj·nj).  The life
in hours is taken at the mean speed nm (nm = Σ ti·ni).

For a shaft the cycles come from its states: :func:`shaft_cycles` gives one per bearing position,
over the cases :func:`workbench.model.shafts.generated_cases` makes, on time shares.
:func:`system_life` combines the shaft's two duty lives by the series rule for two-parameter
Weibull lives of a common slope e, L_sys = (Σ L_i^−e)^(−1/e).  The rule holds for lives taken at
any one reliability R (each L_R,i = η_i·(ln 1/R)^(1/e), and the factor cancels), so every state of
every bearing must be derived at the same R — the session's, unless the shaft's ``case_fields``
set another, which then applies to all its cases alike.

Slope: e = 9/8 when every bearing of the shaft is a roller bearing, else e = 10/9 (the ball
value), so a mixed set takes the smaller slope.  L_sys grows with e for fixed lives, so the
smaller slope gives the shorter, conservative system life.  Both slopes are the commonly used
values of ``engine.duty`` (from memory).

Table layout (TOML, every value text)::

    [[duty_cycles]]
    name = "locating end, shift pattern"
    basis = "time"                   # or "revolutions"
    [[duty_cycles.states]]
    case = "full load"
    share = "0.7"
    [[duty_cycles.states]]
    case = "part load"
    share = "0.3"
"""

from __future__ import annotations

import math
from collections.abc import Callable, Iterator, Mapping, Sequence
from dataclasses import dataclass, field
from typing import Any

from ..engine import duty
from ..engine.derive import MODIFIED_LIFE_SOURCE
from ..engine.kinds import ROLLER_KINDS, life_clause, parse_kind
from ..engine.life import life_hours
from ..engine.pairs import SIDES
from ..engine.record import Derivation, InputError
from .fields import FieldError
from .quantities import QuantityError, parse
from .session import CaseResult, LoadCase, Session, evaluate_case
from .toml_tables import checked_table, named_tables, required_name, table_list, table_text
from .shafts import Shaft, case_name, shaft_cases
from .user_text import quoted

BASES = ("time", "revolutions")
CYCLE_KEYS = ("name", "basis", "states")
STATE_KEYS = ("case", "share")
MINER_SOURCE = "Palmgren–Miner rule, 1/L = Σ ui/Li"
SERIES_SOURCE = "series system of Weibull lives, L_sys = (Σ L_i^−e)^(−1/e)"
SLOPE_SOURCE = "Weibull slope of bearing fatigue life: 10/9 ball, 9/8 roller (from memory)"


@dataclass
class DutyCycle:
    """Load cases of one bearing position and their shares (typed text), on a time or revolution basis."""

    name: str
    states: list[tuple[str, str]] = field(default_factory=list)
    basis: str = "time"


@dataclass(frozen=True, slots=True)
class DutyResult:
    """A duty cycle worked out: Miner life, hours at the mean speed, each state's damage share.

    ``bearing`` and ``kind`` are the session bearing the states load and its kind.
    """

    cycle: DutyCycle
    bearing: str
    kind: str
    case_results: tuple[CaseResult, ...]
    lives_mrev: tuple[float, ...]
    revolution_shares: tuple[float, ...]
    damage_shares: tuple[float, ...]
    life_mrev: float
    mean_speed: float
    life_h: float
    reliability: float
    derivation: Derivation


@dataclass(frozen=True, slots=True)
class SystemResult:
    """A shaft's bearings as a series system: each duty life and the combined life."""

    shaft: Shaft
    duties: tuple[DutyResult, ...]
    weibull_slope: float
    life_mrev: float
    life_h: float
    reliability: float
    derivation: Derivation


# ---- tables --------------------------------------------------------------------------------
def duty_cycle_from_table(data: Mapping[str, Any], key: str = "duty_cycles[1]") -> DutyCycle:
    """A :class:`DutyCycle` from its TOML table, texts checked; FieldError names the bad key."""
    table = checked_table(data, key, CYCLE_KEYS)
    name = required_name(table, key, set(), "duty cycle")
    basis = table_text(table, key, "basis", DutyCycle.basis)
    if basis not in BASES:
        raise FieldError(f"{key}.basis", f"use 'time' or 'revolutions', not {quoted(basis)}")
    states = []
    for number, value in enumerate(table_list(table, key, "states"), start=1):
        where = f"{key}.states[{number}]"
        item = checked_table(value, where, STATE_KEYS)
        case = table_text(item, where, "case")
        if not case.strip():
            raise FieldError(f"{where}.case", "name the load case of this state")
        share = table_text(item, where, "share")
        _share(f"{where}.share", share)
        states.append((case, share))
    return DutyCycle(name, states, basis)


def duty_cycle_to_table(cycle: DutyCycle) -> dict[str, Any]:
    """The TOML-ready table of ``cycle``; :func:`duty_cycle_from_table` reads it back equal."""
    return {"name": cycle.name, "basis": cycle.basis,
            "states": [{"case": case, "share": share} for case, share in cycle.states]}


def duty_cycles_from_tables(value: object, key: str = "duty_cycles") -> list[DutyCycle]:
    """Every cycle of a ``[[duty_cycles]]`` array of tables; names must differ."""
    return named_tables(value, key, duty_cycle_from_table, "duty cycle")


def state_tables(value: object) -> Iterator[tuple[dict[str, Any], dict[str, Any]]]:
    """Each state table of a ``[[duty_cycles]]`` array as read, with its cycle's table, to read
    or change in place; what is not a table is passed over (the file's reader reports it)."""
    for cycle in value if isinstance(value, list) else ():
        states = cycle.get("states") if isinstance(cycle, dict) else None
        for state in states if isinstance(states, list) else ():
            if isinstance(state, dict):
                yield cycle, state


def duty_cycles_to_tables(cycles: Sequence[DutyCycle]) -> list[dict[str, Any]]:
    """The ``[[duty_cycles]]`` array of tables for ``cycles``."""
    return [duty_cycle_to_table(cycle) for cycle in cycles]


def _share(key: str, text: str) -> float:
    try:
        value = parse(text, "dimensionless", default_unit="")
    except QuantityError as exc:
        raise FieldError(key, exc.message) from None
    if not (math.isfinite(value) and value >= 0.0):
        raise FieldError(key, "a share is a number of 0 or more")
    return value


# ---- Palmgren–Miner ------------------------------------------------------------------------
def shaft_cycles(shaft: Shaft) -> list[DutyCycle]:
    """One duty cycle per bearing position of ``shaft``, over its states' time shares."""
    return [DutyCycle(f"{shaft.name} · {side}",
                      [(case_name(shaft, state, side), state.share) for state in shaft.states],
                      "time")
            for side in SIDES]


def _find_case(session: Session, name: str, cases: Sequence[LoadCase]) -> LoadCase | None:
    found = session.case(name)
    if found is not None:
        return found
    return next((case for case in cases if case.name == name), None)


def duty_life(session: Session, cycle: DutyCycle, cases: Sequence[LoadCase] = (), *,
              key: str = "duty_cycle",
              evaluate: Callable[[LoadCase], CaseResult] | None = None) -> DutyResult:
    """Palmgren–Miner life of one bearing over ``cycle`` (1/L = Σ ui/Li, Li = Lnm of each state).

    The cycle's cases are looked up in the session, then in ``cases`` (e.g. those generated from
    shafts).  Raises FieldError naming ``<key>.states[n]…`` when a state cannot be evaluated, when
    the states load different bearings or are derived at different reliabilities.
    """
    if cycle.basis not in BASES:
        raise FieldError(f"{key}.basis", f"use 'time' or 'revolutions', not {quoted(cycle.basis)}")
    if not cycle.states:
        raise FieldError(f"{key}.states", "a duty cycle needs at least one state")
    results: list[CaseResult] = []
    reliability = math.nan
    shares: list[float] = []
    speeds_list: list[float] = []
    lives_list: list[float] = []
    for number, (name, share_text) in enumerate(cycle.states, start=1):
        where = f"{key}.states[{number}]"
        shares.append(_share(f"{where}.share", share_text))
        case = _find_case(session, name, cases)
        if case is None:
            raise FieldError(f"{where}.case", f"no load case called {quoted(name)}")
        result = evaluate(case) if evaluate is not None else evaluate_case(session, case)
        if result.derivation is None or result.inputs is None:
            raise FieldError(f"{where}.case", f"case {quoted(name)}: {result.error_field}: {result.error}")
        if results and case.bearing != results[0].case.bearing:
            raise FieldError(f"{where}.case", f"case {quoted(name)} loads bearing {quoted(case.bearing)}, not "
                                              f"{quoted(results[0].case.bearing)}: a duty cycle is one bearing's")
        if results and result.inputs.reliability != reliability:
            raise FieldError(f"{where}.case", "every state of a duty cycle is derived at one "
                                              "reliability; this case uses another")
        reliability, kind = result.inputs.reliability, result.inputs.kind
        results.append(result)
        speeds_list.append(result.inputs.speed)
        lives_list.append(result.derivation.results["Lnm_mrev"])
    speeds, lives = tuple(speeds_list), tuple(lives_list)
    try:
        u = duty.revolution_shares(shares, speeds, cycle.basis)  # type: ignore[arg-type]
        if cycle.basis == "revolutions":
            if any(n <= 0.0 and share > 0.0 for n, share in zip(speeds, u)):
                raise InputError("speeds", "a state at standstill makes no revolutions: "
                                           "give this cycle's shares on a time basis")
            time_shares = [share / n if share > 0.0 else 0.0 for n, share in zip(speeds, u)]
        else:
            time_shares = shares
        miner = duty.miner_life(lives, u)
        n_mean = duty.mean_speed(speeds, time_shares)
    except InputError as exc:
        raise FieldError(f"{key}.states", f"{exc.field}: {exc.message}") from None
    d = Derivation()
    _miner_steps(d, cycle, results, shares, speeds, lives, u, miner, n_mean)
    life_h = life_hours(miner.life, n_mean) if n_mean > 0.0 else math.nan
    d.add("L_h", life_h, symbol="Lh", label="Duty-cycle life in hours at the mean speed",
          formula="L·10⁶/(60·nm)", template="{0} × 10⁶ / (60 × {1})", args=(miner.life, n_mean),
          unit="h", source=_life_source(results[0]))
    return DutyResult(cycle, results[0].case.bearing, kind, tuple(results), lives, u,
                      miner.damage_shares, miner.life, n_mean, life_h, reliability, d)


def _life_source(result: CaseResult) -> str:
    """The ISO 281 clause of a case's life in hours (read from its kind, so a case derived
    without its steps serves as well)."""
    assert result.inputs is not None
    return life_clause(parse_kind(result.inputs.kind))


def _miner_steps(d: Derivation, cycle: DutyCycle, results: Sequence[CaseResult],
                 weights: Sequence[float], speeds: Sequence[float], lives: Sequence[float],
                 u: Sequence[float], miner: duty.MinerLife, n_mean: float) -> None:
    """Steps of the Palmgren–Miner summation: Li, ui, L, damage shares, mean speed."""
    for i, result in enumerate(results, start=1):
        name = result.case.name
        d.add(f"L[{i}]", lives[i - 1], symbol=f"L{i}", label=f"Life of state {i} ({name})",
              formula="Lnm of the case", template="{0}", args=(lives[i - 1],), unit="10⁶ rev",
              source=MODIFIED_LIFE_SOURCE)
    total = math.fsum(weights)
    revolutions = math.fsum(w * n for w, n in zip(weights, speeds))
    for i in range(1, len(results) + 1):
        if cycle.basis == "time":
            d.add(f"u[{i}]", u[i - 1], symbol=f"u{i}", label=f"Revolution share of state {i}",
                  formula="ui = ti·ni/Σ tj·nj", template="{0} × {1} / {2}",
                  args=(weights[i - 1] / total, speeds[i - 1], revolutions / total),
                  source=MINER_SOURCE, note="time share × speed")
        else:
            d.add(f"u[{i}]", u[i - 1], symbol=f"u{i}", label=f"Revolution share of state {i}",
                  formula="ui = si/Σ sj", template="{0} / {1}", args=(weights[i - 1], total),
                  source=MINER_SOURCE)
    damage = math.fsum(share / life for share, life in zip(u, lives))
    d.add("L", miner.life, symbol="L", label="Duty-cycle life", formula="1/L = Σ ui/Li",
          template="1 / {0}", args=(damage,), unit="10⁶ rev", source=MINER_SOURCE)
    for i in range(1, len(results) + 1):
        share = miner.damage_shares[i - 1]
        d.add(f"D[{i}]", share, symbol=f"D{i}", label=f"Share of the damage done in state {i}",
              formula="(ui/Li)/Σ(uj/Lj)", template="({0} / {1}) / {2}",
              args=(u[i - 1], lives[i - 1], damage), source=MINER_SOURCE)
    if cycle.basis == "time":
        d.add("n_m", n_mean, symbol="nm", label="Mean speed", formula="nm = Σ ti·ni",
              template="{0} / {1}", args=(revolutions, total), unit="r/min", source=MINER_SOURCE)
    else:
        d.add("n_m", n_mean, symbol="nm", label="Mean speed", formula="nm = 1/Σ(ui/ni)",
              template="1 / {0}", args=(1.0 / n_mean if n_mean > 0.0 else math.inf,), unit="r/min",
              source=MINER_SOURCE, note="time shares ti ∝ ui/ni")


# ---- series system -------------------------------------------------------------------------
def weibull_slope(kinds: Sequence[str]) -> float:
    """9/8 when every bearing is a roller bearing, else 10/9: the smaller slope for a mixed set."""
    roller = all(parse_kind(kind) in ROLLER_KINDS for kind in kinds)
    return duty.WEIBULL_SLOPE_ROLLER if roller else duty.WEIBULL_SLOPE_BALL


def system_life(session: Session, shaft: Shaft, *, key: str = "shaft",
                cases: Sequence[LoadCase] | None = None,
                evaluate: Callable[[LoadCase], CaseResult] | None = None) -> SystemResult:
    """Life of ``shaft``'s two bearings in series: L_sys = (Σ L_i^−e)^(−1/e) over their duty lives.

    Series system of two-parameter Weibull lives of common slope e (see the module notes for the
    slope of a mixed set), at the one reliability every generated case is derived at.
    """
    if cases is None:
        cases = shaft_cases(session, shaft, key=key)
    duties = tuple(duty_life(session, cycle, cases, key=key, evaluate=evaluate)
                   for cycle in shaft_cycles(shaft))
    reliability = duties[0].reliability
    kinds = [result.kind for result in duties]
    slope = weibull_slope(kinds)
    lives = [result.life_mrev for result in duties]
    life = duty.system_life(lives, slope)
    n_mean = duties[0].mean_speed  # both bearings turn with the shaft
    d = Derivation()
    for side, result in zip(SIDES, duties):
        d.add(f"L_{side}", result.life_mrev, symbol=f"L{side}",
              label=f"Duty-cycle life of bearing {side} ({result.bearing})",
              formula="1/L = Σ ui/Li", template="{0}", args=(result.life_mrev,), unit="10⁶ rev",
              source=MINER_SOURCE)
    kind_words = " and ".join(sorted(set(kinds)))
    d.add("e", slope, symbol="e", label="Weibull slope", formula="9/8 all roller, else 10/9",
          template="{0}", args=(slope,), source=SLOPE_SOURCE,
          note=f"bearings: {kind_words}; a mixed set takes the smaller slope " "(conservative)")
    d.add("L_sys", life, symbol="L_sys", label=f"System life at R = {reliability:g}",
          formula="(L_A^−e + L_B^−e)^(−1/e)", template="({0}^−{2} + {1}^−{2})^(−1/{2})",
          args=(lives[0], lives[1], slope), unit="10⁶ rev", source=SERIES_SOURCE)
    life_h = life_hours(life, n_mean) if n_mean > 0.0 else math.nan
    d.add("L_sys_h", life_h, symbol="L_sys,h", label="System life in hours at the mean speed",
          formula="L_sys·10⁶/(60·nm)", template="{0} × 10⁶ / (60 × {1})", args=(life, n_mean),
          unit="h", source=duties[0].derivation.step("L_h").source)
    return SystemResult(shaft, duties, slope, life, life_h, reliability, d)
