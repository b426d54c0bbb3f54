"""A whole session worked out: its cases, the cases its shafts generate, shafts and duty cycles.

:func:`analyse` gathers everything a report shows.  The session's own load cases come first,
then those :func:`~workbench.model.shafts.shaft_cases` generates from each ``[[shafts]]`` table
(shaft × state × bearing), each derived by :func:`~workbench.model.session.evaluate_case`
(ISO 281:2007 life, ISO 76:2006 static safety).  Each shaft's states are solved by
:func:`~workbench.model.shafts.solve_shaft` (gear-force relations, shaft statics, the
two-bearing thrust-sharing rule) and its two bearings combined by
:func:`~workbench.model.duty_cycles.system_life` (series system of Weibull lives).  Each
``[[duty_cycles]]`` cycle, and the two cycles of every shaft (one per bearing, over its states'
time shares), get their Palmgren–Miner life from :func:`~workbench.model.duty_cycles.duty_life`.

Errors are values, never raised: text naming the key (``shafts[1].elements[2].helix_angle:
…``), so one bad shaft or cycle leaves the rest of the analysis intact.  A session read from a
file has had its tables checked already; one built in memory may not have.
"""

from __future__ import annotations

from collections.abc import Callable, Mapping
from dataclasses import dataclass
from typing import Any, TypeVar

from ..engine.record import InputError
from .duty_cycles import (
    DutyCycle, DutyResult, SystemResult, duty_cycle_from_table, duty_cycles_from_tables,
    duty_life, shaft_cycles, system_life,
)
from .fields import FieldError
from .quantities import parse
from .session import CaseResult, LoadCase, Session, evaluate_case
from .shafts import (
    OperatingState, Shaft, ShaftSolution, shaft_cases, shaft_from_table, shafts_from_tables,
    solve_shaft,
)

T = TypeVar("T")


@dataclass(frozen=True, slots=True)
class StateOutcome:
    """One operating state of a shaft: its free body solved, or why not (``key: message``)."""

    state: OperatingState
    key: str
    solution: ShaftSolution | None
    error: str | None


@dataclass(frozen=True, slots=True)
class ShaftOutcome:
    """A ``[[shafts]]`` table worked out.

    ``shaft`` is None when the table cannot be read; ``error`` says why, or why its cases could
    not be generated.  ``system`` is the series life of its two bearings, or ``system_error``.
    """

    key: str
    name: str
    shaft: Shaft | None
    error: str | None
    states: tuple[StateOutcome, ...]
    system: SystemResult | None
    system_error: str | None


@dataclass(frozen=True, slots=True)
class DutyOutcome:
    """A duty cycle worked out, or why not.

    ``shaft`` names the shaft whose states make the cycle (one per bearing position), and is None
    for a ``[[duty_cycles]]`` table of the file; ``key`` is where its errors are named.
    """

    key: str
    name: str
    shaft: str | None
    cycle: DutyCycle | None
    result: DutyResult | None
    error: str | None


@dataclass(frozen=True, slots=True)
class SessionAnalysis:
    """Every case (the session's, then the generated ones), every shaft, every duty cycle."""

    cases: list[CaseResult]
    shafts: list[ShaftOutcome]
    duties: list[DutyOutcome]


def session_shafts(session: Session) -> list[Shaft]:
    """The session's ``[[shafts]]`` tables as shafts; raises FieldError naming ``shafts[n]…``."""
    return shafts_from_tables(session.reserved.get("shafts", []))


def session_duty_cycles(session: Session) -> list[DutyCycle]:
    """The session's ``[[duty_cycles]]`` tables; raises FieldError naming ``duty_cycles[n]…``."""
    return duty_cycles_from_tables(session.reserved.get("duty_cycles", []))


def _error_text(error: FieldError | InputError) -> str:
    return f"{error.field}: {error.message}"


def _attempt(work: Callable[[], T]) -> tuple[T | None, str | None]:
    """(result, None), or (None, "key: message") when ``work`` refuses its input."""
    try:
        return work(), None
    except (FieldError, InputError) as exc:
        return None, _error_text(exc)


def _tables(session: Session, name: str,
            read_all: Callable[[object], object]) -> list[tuple[str, str, Any, str | None]]:
    """(key, name as written, table, error) of each item of the reserved array ``name``.

    Read item by item, so one bad table does not hide the others.  A value that is not an array
    is one item whose error is the one ``read_all`` (the whole-array reader) gives for it.
    """
    value = session.reserved.get(name, [])
    if not isinstance(value, list):
        return [(name, "", None, _attempt(lambda: read_all(value))[1])]
    return [(f"{name}[{number}]",
             item.get("name", "") if isinstance(item, Mapping) and isinstance(
                 item.get("name", ""), str) else "", item, None)
            for number, item in enumerate(value, start=1)]


def _shaft_duties(session: Session, key: str, shaft: Shaft, cases: list[LoadCase],
                  cases_error: str | None, system: SystemResult | None,
                  evaluate: Callable[[LoadCase], CaseResult]) -> list[DutyOutcome]:
    """The two automatic duty cycles of a shaft (one per bearing), from its system life if any."""
    cycles = shaft_cycles(shaft)
    if system is not None:
        return [DutyOutcome(key, cycle.name, shaft.name, cycle, result, None)
                for cycle, result in zip(cycles, system.duties)]
    outcomes = []
    for cycle in cycles:
        error: str | None
        if cases_error is not None:
            result, error = None, cases_error
        else:
            result, error = _attempt(lambda: duty_life(session, cycle, cases, key=key,
                                                            evaluate=evaluate))
        outcomes.append(DutyOutcome(key, cycle.name, shaft.name, cycle, result, error))
    return outcomes


def analyse(session: Session, *, keep_steps: bool = True) -> SessionAnalysis:
    """Every case, shaft and duty cycle of ``session`` worked out; errors are values, not raised.

    Cases: the session's own, then each shaft's generated ones (shaft × state × bearing), all by
    ``evaluate_case`` (ISO 281:2007, ISO 76:2006).  Shafts: each state's free body
    (:func:`solve_shaft`) and the series system life of the two bearings (:func:`system_life`).
    Duties: each ``[[duty_cycles]]`` cycle (over the session's and the generated cases), then each
    shaft's two automatic cycles, by the Palmgren–Miner rule (:func:`duty_life`).
    """
    own = [evaluate_case(session, case, keep_steps=keep_steps) for case in session.cases]
    return analyse_extras(session, own, keep_steps=keep_steps)


def analyse_extras(session: Session, own: list[CaseResult], *,
                   keep_steps: bool = True) -> SessionAnalysis:
    """The analysis of ``session`` given its own cases already evaluated (``own``, in order):
    the shafts, the cases they generate and the duty cycles are worked out here, each case
    derived once (a duty cycle reuses the result of the case it names)."""
    known: dict[str, CaseResult] = {result.case.name: result for result in own}

    def evaluate(case: LoadCase) -> CaseResult:
        found = known.get(case.name)
        if found is None or found.case != case:
            found = known[case.name] = evaluate_case(session, case, keep_steps=keep_steps)
        return found

    taken = {case.name for case in session.cases}
    generated: list[LoadCase] = []
    shafts: list[ShaftOutcome] = []
    shaft_duties: list[DutyOutcome] = []
    for key, name, table, error in _tables(session, "shafts", shafts_from_tables):
        shaft = None
        if error is None:
            shaft, error = _attempt(lambda: shaft_from_table(table, key))
        if shaft is None:
            shafts.append(ShaftOutcome(key, name, None, error, (), None, None))
            continue
        names = set(taken)
        own_cases, cases_error = _attempt(lambda: shaft_cases(session, shaft, key=key,
                                                              taken=names))
        if own_cases is not None:
            taken, generated = names, generated + own_cases
        states = []
        for number, state in enumerate(shaft.states, start=1):
            solution, state_error = _attempt(lambda: solve_shaft(shaft, state, session, key=key))
            states.append(StateOutcome(state, f"{key}.states[{number}]", solution, state_error))
        system, system_error = _attempt(
            lambda: system_life(session, shaft, key=key, cases=own_cases, evaluate=evaluate))
        shafts.append(ShaftOutcome(key, shaft.name, shaft, cases_error, tuple(states), system,
                                   system_error))
        shaft_duties += _shaft_duties(session, key, shaft, own_cases or [], cases_error, system,
                                      evaluate)
    duties: list[DutyOutcome] = []
    for key, name, table, error in _tables(session, "duty_cycles", duty_cycles_from_tables):
        cycle = result = None
        if error is None:
            cycle, error = _attempt(lambda: duty_cycle_from_table(table, key))
        if cycle is not None:
            result, error = _attempt(
                lambda: duty_life(session, cycle, generated, key=key, evaluate=evaluate))
        duties.append(DutyOutcome(key, name, None, cycle, result, error))
    cases = own + [evaluate(case) for case in generated]
    return SessionAnalysis(cases, shafts, duties + shaft_duties)


def time_shares(result: DutyResult) -> tuple[float, ...]:
    """Each state's share of the time, ti (Σ ti = 1), for a cycle on either basis.

    On a time basis the typed shares, normalised; on a revolution basis ti ∝ ui/ni (from
    ui = ti·ni/Σ tj·nj, the Palmgren–Miner revolution share); a state with no revolutions takes 0.
    """
    if result.cycle.basis == "time":
        weights = [parse(share, "dimensionless", default_unit="")
                   for _, share in result.cycle.states]
    else:
        weights = [u / case.inputs.speed if u > 0.0 and case.inputs is not None else 0.0
                   for u, case in zip(result.revolution_shares, result.case_results)]
    total = sum(weights)
    return tuple(weight / total for weight in weights)
