"""The one report document of a session, which every writer (text, Markdown, JSON) renders.

Every number comes from a derivation record: :func:`workbench.model.analysis.analyse` for the
cases, the session's and those generated from its shafts (ISO 281:2007 dynamic rating and life,
ISO 76:2006 static safety), the shafts' free bodies (gear-force relations, shaft statics, the
two-bearing thrust-sharing rule) and system lives (series system of Weibull lives), and the duty
cycles (Palmgren–Miner rule); :func:`workbench.engine.solve.solve` for the solver question.
Nothing is computed here: :func:`build_report` arranges the steps, results, warnings and verdicts
those records hold into a tree of typed records, with the sentences and tables that every writer
shows composed once, and ends with the sources cited and the safety caution. A writer only lays
that tree out; a new format (HTML) is one more module beside ``text.py``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Sequence

from ..engine.derive import CaseInputs
from ..engine.record import Derivation, InputError, percent, signed, with_unit
from ..engine.record import fmt as number_text
from ..engine.sensitivity import SensitivityItem, sensitivity_of
from ..engine.solve import TARGETS, UNKNOWNS, Solution, solve
from ..model.analysis import DutyOutcome, ShaftOutcome, SessionAnalysis, analyse, time_shares
from ..model.caution import SAFETY_CAUTION
from ..model.fields import FIELD_BY_NAME, FieldError
from ..model.session import CaseResult, Session, case_texts
from ..model.shafts import SIDES, is_generated
from ..model.targets import parse_target_text, solver_target
from ..model.user_text import sentence
from .meta import Provenance, provenance

UNITS_NOTE = ("Units throughout: forces in N, lengths in mm, speeds in r/min, lives in h or "
              "10⁶ rev, viscosities in mm²/s, temperatures in °C.")
SUMMARY_RESULTS = ("P", "L10h", "Lnm", "s0")
GENERATED_MARK = " *"
GENERATED_LEGEND = "* generated from a shaft: its loads come from the Shafts section"
# Each sensitivity table costs about 32 derivations; past this many cases (a large session, where
# a reader compares the summary anyway) the later cases have none, and the report says so.
SENSITIVITY_CASES = 50
SENSITIVITY_HEADERS = ("input", "value", "ε life", "ε s0", "−10 %", "+10 %", "method")
STATIC_ONLY = "static check only"
BEARING_HEADERS = ("Bearing", "Kind", "Designation", "Source")


# ---- the records ---------------------------------------------------------------------------------
@dataclass(frozen=True)
class Table:
    """Cells of display text; ``header`` may be empty; ``numeric`` marks right-aligned columns."""

    header: tuple[str, ...]
    rows: tuple[tuple[str, ...], ...]
    numeric: tuple[bool, ...] = ()


@dataclass(frozen=True)
class SessionMeta:
    """What the session is, the targets it sets (as typed), and where the report comes from:
    when it was generated, by which tool version, from which saved file (its SHA-256)."""

    title: str
    project: str
    engineer: str
    revision: str
    notes: str
    units: str
    source: str
    life_target: str
    reliability: str
    s0_target: str
    generated_at: str  # ISO 8601 in UTC
    tool_version: str
    session_sha256: str | None  # None: never saved, or changed since (``hash_note`` says)
    hash_note: str
    facts: tuple[tuple[str, str], ...]  # (label, value) lines of the report's head


@dataclass(frozen=True)
class BearingInfo:
    """A session bearing: its name, kind, notes, designation and where its data came from."""

    name: str
    kind: str
    notes: str
    designation: str = ""
    source: str = ""

    @property
    def line(self) -> str:
        """"NAME (kind), designation D, from S": what a case says of its bearing."""
        return (self.name + (f" ({self.kind})" if self.kind else "")
                + (f", designation {self.designation}" if self.designation else "")
                + (f", from {self.source}" if self.source else ""))


@dataclass(frozen=True)
class InputText:
    """One input a case gives: field name, its label, and the text as typed."""

    name: str
    label: str
    text: str


@dataclass(frozen=True)
class ResultRow:
    """One named result with the symbol, label and unit of the step that recorded it."""

    key: str
    symbol: str
    label: str
    value: float
    unit: str


@dataclass(frozen=True)
class SensitivitySection:
    """The elasticity of a case's life to each input, with its one-line heading and notes."""

    items: tuple[SensitivityItem, ...]
    heading: str
    table: Table
    notes: tuple[tuple[str, str], ...]  # (input label, note)


@dataclass(frozen=True)
class CaseSection:
    """One load case: its bearing, inputs, derivation, verdicts and sensitivity (or its error)."""

    number: int
    name: str
    bearing: BearingInfo
    notes: str
    generated_note: str | None  # "Generated from shaft …: …" for a case made from a shaft
    inputs: tuple[InputText, ...]
    engine_inputs: CaseInputs | None  # what the derivation ran on, for the html plots
    derivation: Derivation | None
    results: tuple[ResultRow, ...]
    verdicts: tuple[str, ...]  # the life and the static-safety verdict in words
    static_only: bool  # a static check: s0 verdict only, life shown for completeness
    meets_life: bool | None
    meets_s0: bool | None
    life_target_h: float | None
    error: str | None
    field_errors: dict[str, str]
    sensitivity: SensitivitySection | None

    @property
    def generated(self) -> bool:
        return self.generated_note is not None


@dataclass(frozen=True)
class BearingLoad:
    """The load on one bearing of a shaft in one state, in N."""

    side: str
    bearing: str
    fr: float
    fa: float


@dataclass(frozen=True)
class ShaftStateSection:
    """One operating state of a shaft: typed texts, then torque, speed, free body and loads."""

    heading: str
    name: str
    key: str
    error: str | None
    typed: dict[str, str]  # power, torque, speed, share as typed
    torque: float | None
    speed: float | None
    loads: tuple[BearingLoad, ...]
    load_table: Table | None
    derivation: Derivation | None


@dataclass(frozen=True)
class SystemLife:
    """The system life of a shaft's two bearings (series system of Weibull lives)."""

    life_mrev: float
    life_h: float
    weibull_slope: float
    reliability: float
    derivation: Derivation


@dataclass(frozen=True)
class ShaftSection:
    """A shaft: its bearings, each state's free body and bearing loads, then its system life."""

    number: int
    title: str
    name: str
    key: str
    description: str
    bearing_a: str | None
    bearing_b: str | None
    locating: str | None
    error: str | None
    states: tuple[ShaftStateSection, ...]
    system_line: str | None  # None when the shaft's table cannot be read
    system: SystemLife | None
    system_error: str | None


@dataclass(frozen=True)
class DutyState:
    """One state of a duty cycle; the numbers are None when the cycle has no life."""

    case: str
    share: str
    time_share: float | None = None
    revolution_share: float | None = None
    life_mrev: float | None = None
    damage_share: float | None = None


@dataclass(frozen=True)
class DutySection:
    """A duty cycle: its states' shares, lives and damage, then the Miner life (or its error)."""

    number: int
    title: str
    name: str
    key: str
    shaft: str | None
    basis: str | None
    error: str | None
    description: str
    bearing: str | None
    kind: str | None
    states: tuple[DutyState, ...]
    table: Table | None
    life_line: str
    life_mrev: float | None
    mean_speed: float | None
    life_h: float | None
    reliability: float | None
    derivation: Derivation | None


@dataclass(frozen=True)
class SolverSection:
    """The session's solver question and its answer (or why there is none)."""

    case: str
    unknown: str
    target: str
    solution: Solution | None
    error: str | None
    lines: tuple[str, ...]  # question and answer in plain words
    step_line: str | None  # how the answer was found, from the solver's step


@dataclass(frozen=True)
class Report:
    """The whole design review of a session, in reading order."""

    meta: SessionMeta
    bearings: tuple[BearingInfo, ...]
    bearing_table: Table
    units_note: str
    summary: Table
    generated_legend: str | None
    sensitivity_note: str | None  # why later cases have no sensitivity table, when they have none
    cases: tuple[CaseSection, ...]
    shafts: tuple[ShaftSection, ...]
    duties: tuple[DutySection, ...]
    solver: SolverSection | None
    sources: tuple[str, ...]
    caution: str


def _verdict(ok: bool | None) -> str:
    return "no verdict" if ok is None else ("met" if ok else "missed")


def _static_only(result: CaseResult) -> bool:
    # CaseResult.static_only comes with the session details on the screen (issue 14, item 4)
    return bool(getattr(result, "static_only", False))


def _meets_life(result: CaseResult) -> bool | None:
    """The life verdict, none for a static check."""
    return None if _static_only(result) else result.meets_life


def sensitivity_section(items: Sequence[SensitivityItem]) -> SensitivitySection:
    """The elasticities as a table of display text, with what they are of and the notes."""
    lives = ", ".join(sorted({item.life for item in items}))
    return SensitivitySection(
        items=tuple(items),
        heading=f"Sensitivity of {lives}: ε = d ln L / d ln x; ±10 % = life change for x·0.9 "
                "and x·1.1",
        table=Table(SENSITIVITY_HEADERS, tuple(
            (item.label, with_unit(number_text(item.value), item.unit), signed(item.elasticity),
             signed(item.elasticity_s0), percent(item.minus10), percent(item.plus10), item.method)
            for item in items), numeric=(False, True, True, True, True, True, False)),
        notes=tuple((item.label, item.note) for item in items if item.note),
    )


def step_table(derivation: Derivation) -> Table:
    """The steps of a derivation, one row each: symbol, label, formula, numbers, result, unit,
    source, then its note and warning."""
    return Table(
        ("#", "Symbol", "Step", "Formula", "With numbers", "Result", "Unit", "Source", "Note"),
        tuple((str(i), s.symbol, s.label, s.formula, s.substituted, s.value_text, s.unit,
               s.source, "; ".join(x for x in (s.note, f"⚠ {s.warning}" if s.warning else None)
                                   if x))
              for i, s in enumerate(derivation.steps, start=1)))


def input_table(case: CaseSection) -> Table:
    """The case's inputs as typed: label, field name, text."""
    return Table(("Input", "Field", "Value"), tuple((i.label, i.name, i.text) for i in case.inputs))


def result_table(case: CaseSection) -> Table:
    """The case's results: symbol, label (or key), value, unit."""
    return Table(("Symbol", "Result", "Value", "Unit"),
                 tuple((r.symbol, r.label or r.key, number_text(r.value), r.unit)
                       for r in case.results), numeric=(False, False, True, False))


# ---- building the document ------------------------------------------------------------------
def _result_rows(derivation: Derivation) -> tuple[ResultRow, ...]:
    """Every entry of ``derivation.results``, labelled from its step when it has one."""
    rows = []
    for key, value in derivation.results.items():
        try:
            step = derivation.step(key)
        except KeyError:
            rows.append(ResultRow(key, key, "", value, ""))
            continue
        rows.append(ResultRow(key, step.symbol, step.label, value, step.unit))
    return tuple(rows)


def _sensitivity(result: CaseResult) -> list[SensitivityItem]:
    """The elasticity of the case's life to each input (empty when the case cannot be derived)."""
    if result.inputs is None or result.derivation is None:
        return []
    try:
        return sensitivity_of(result.inputs)
    except InputError:
        return []


def _error_text(result: CaseResult) -> str | None:
    """The case's error as "field: message", or None."""
    if result.error is None:
        return None
    return f"{result.error_field}: {result.error}" if result.error_field else result.error


def _verdict_lines(result: CaseResult) -> tuple[str, ...]:
    """The life verdict (Lnm against the session's life target) and the static-safety verdict
    (ISO 76:2006 s0 against the minimum in force), in words."""
    assert result.derivation is not None
    res = result.derivation.results
    if _static_only(result):
        life = (f"Life: {STATIC_ONLY}; Lnm = {number_text(res.get('Lnm', math.nan))} h is shown "
                "for completeness, with no life verdict")
    elif result.life_target_h is None:
        life = "Life: no life target set"
    else:
        life = (f"Life: Lnm = {number_text(res.get('Lnm', math.nan))} h against the target "
                f"{number_text(result.life_target_h)} h: {_verdict(result.meets_life)}")
    static = (f"Static safety: s0 = {number_text(res['s0'])} against the minimum "
              f"{number_text(res['s0_min'])}: {_verdict(result.meets_s0)}")
    return life, static


def _bearing_info(session: Session, name: str) -> BearingInfo:
    bearing = session.bearing(name)
    if bearing is None:
        return BearingInfo(name, "", "")
    # Bearing.designation and .source come with adopting from a catalog (issue 14, item 2)
    return BearingInfo(name, bearing.texts.get("kind", ""), bearing.notes,
                       getattr(bearing, "designation", ""), getattr(bearing, "source", ""))


def _bearing_table(bearings: Sequence[BearingInfo]) -> Table:
    return Table(BEARING_HEADERS, tuple(
        (b.name, b.kind or "—", b.designation or "—", b.source or "—") for b in bearings))


def _sensitivity_note(cases: int) -> str | None:
    """The line saying which cases have no sensitivity table (over SENSITIVITY_CASES), if any."""
    if cases <= SENSITIVITY_CASES:
        return None
    return (f"Sensitivity tables are given for the first {SENSITIVITY_CASES} cases; for the other "
            f"{cases - SENSITIVITY_CASES}, 'workbench calc --sensitivity' gives one case's.")


def _case_section(session: Session, number: int, result: CaseResult) -> CaseSection:
    case, derivation = result.case, result.derivation
    texts = case_texts(session, case)
    items = _sensitivity(result) if number <= SENSITIVITY_CASES else []
    return CaseSection(
        number=number, name=case.name, bearing=_bearing_info(session, case.bearing),
        notes=case.notes,
        generated_note=(f"{sentence(case.notes)}: its Fr, Fa and speed are those "
                        "of the Shafts section") if is_generated(case) else None,
        inputs=tuple(InputText(name, FIELD_BY_NAME[name].label, text)
                     for name, text in texts.items() if text.strip()),
        engine_inputs=result.inputs,
        derivation=derivation,
        results=_result_rows(derivation) if derivation is not None else (),
        verdicts=_verdict_lines(result) if derivation is not None else (),
        static_only=_static_only(result),
        meets_life=_meets_life(result), meets_s0=result.meets_s0,
        life_target_h=result.life_target_h, error=_error_text(result),
        field_errors=dict(result.field_errors),
        sensitivity=sensitivity_section(items) if items else None,
    )


def _summary(results: list[CaseResult]) -> Table:
    """One row per case: its bearing, key results and the two verdicts."""
    rows: list[tuple[str, ...]] = []
    for r in results:
        name = r.case.name + (GENERATED_MARK if is_generated(r.case) else "")
        if r.derivation is None:
            rows.append((name, r.case.bearing, "error", "", "", "", "", ""))
            continue
        res = r.derivation.results
        life = STATIC_ONLY if _static_only(r) else _verdict(r.meets_life)
        rows.append((name, r.case.bearing, *(number_text(res[k]) for k in SUMMARY_RESULTS),
                     life, _verdict(r.meets_s0)))
    return Table(("Case", "Bearing", "P (N)", "L10h (h)", "Lnm (h)", "s0", "Life", "Static"),
                 tuple(rows))


def _meta(session: Session, source_name: str, made: Provenance) -> SessionMeta:
    targets = session.targets
    # Session.project and .revision come with the session details on the screen (issue 14, item 1)
    project, revision = getattr(session, "project", ""), getattr(session, "revision", "")
    return SessionMeta(
        title=session.title, project=project, engineer=session.engineer, revision=revision,
        notes=session.notes, units=session.units,
        source=source_name, life_target=targets.life, reliability=targets.reliability,
        s0_target=targets.s0, generated_at=made.generated_at, tool_version=made.tool_version,
        session_sha256=made.session_sha256, hash_note=made.hash_note,
        facts=(
            ("Session file", source_name),
            ("Session SHA-256", made.session_sha256 or made.hash_note),
            ("Project", project or "—"),
            ("Revision", revision or "—"),
            ("Engineer", session.engineer or "—"),
            ("Generated (UTC)", made.generated_at),
            ("Tool version", f"bearing-workbench {made.tool_version}"),
            ("Unit system", session.units),
            ("Life target", f"Lnm ≥ {targets.life}" if targets.life.strip() else "none"),
            ("Reliability", targets.reliability or "—"),
            ("Static safety", f"s0 ≥ {targets.s0}" if targets.s0.strip() else "the duty's minimum"),
        ),
    )


def _shaft_section(number: int, outcome: ShaftOutcome) -> ShaftSection:
    """A shaft's states (free body, bearing loads) and its system life, with their words."""
    shaft = outcome.shaft
    if shaft is None:
        description = "(its table cannot be read)"
    else:
        description = (f"bearing A = {shaft.bearing_a} at {shaft.position_a}, bearing B = "
                       f"{shaft.bearing_b} at {shaft.position_b}; locating: {shaft.locating}"
                       + (f" ({shaft.mounting} mounting)" if shaft.mounting else ""))
    states = []
    for state_number, state in enumerate(outcome.states, start=1):
        typed, solution = state.state, state.solution
        loads: tuple[BearingLoad, ...] = ()
        if solution is not None and shaft is not None:
            loads = tuple(BearingLoad(side, getattr(shaft, f"bearing_{side.lower()}"),
                                      *solution.bearing_loads[side]) for side in SIDES)
        states.append(ShaftStateSection(
            heading=f"State {state_number}: {typed.name} ({typed.power or typed.torque}, "
                    f"{typed.speed}, time share {typed.share})",
            name=typed.name, key=state.key, error=state.error,
            typed={"power": typed.power, "torque": typed.torque, "speed": typed.speed,
                   "share": typed.share},
            torque=solution.torque if solution is not None else None,
            speed=solution.speed if solution is not None else None,
            loads=loads,
            load_table=Table(("Side", "Bearing", "Fr (N)", "Fa (N)"), tuple(
                (load.side, load.bearing, number_text(load.fr), number_text(load.fa))
                for load in loads)) if loads else None,
            derivation=solution.derivation if solution is not None else None,
        ))
    system = outcome.system
    if shaft is None:
        system_line = None
    elif system is None:
        system_line = f"System life: none ({outcome.system_error})"
    else:
        system_line = (f"System life of the shaft's bearings: L_sys = "
                       f"{with_unit(number_text(system.life_mrev), '10⁶ rev')} = {number_text(system.life_h)} h "
                       f"at the mean speed, R = {system.reliability:g} "
                       f"(Weibull slope {number_text(system.weibull_slope)})")
    return ShaftSection(
        number=number, title=outcome.name or outcome.key, name=outcome.name, key=outcome.key,
        description=description,
        bearing_a=shaft.bearing_a if shaft else None, bearing_b=shaft.bearing_b if shaft else None,
        locating=shaft.locating if shaft else None, error=outcome.error, states=tuple(states),
        system_line=system_line,
        system=None if system is None else SystemLife(
            system.life_mrev, system.life_h, system.weibull_slope, system.reliability,
            system.derivation),
        system_error=outcome.system_error,
    )


DUTY_HEADER = ("#", "Case", "Share typed", "Time share", "Revolution share ui",
               "Life Li (10⁶ rev)", "Damage share")


def _duty_section(number: int, duty: DutyOutcome) -> DutySection:
    """A duty cycle's states and its Miner life in 10⁶ rev and in hours at the mean speed."""
    result = duty.result
    origin = f"automatic, from shaft {duty.shaft}" if duty.shaft is not None else "from the file"
    basis = duty.cycle.basis if duty.cycle else None
    if result is None:
        return DutySection(
            number=number, title=duty.name or duty.key, name=duty.name, key=duty.key,
            shaft=duty.shaft, basis=basis, error=duty.error, description=origin, bearing=None,
            kind=None, states=tuple(DutyState(case, share) for case, share in duty.cycle.states)
            if duty.cycle else (),
            table=None, life_line=f"No duty life: {duty.error}", life_mrev=None, mean_speed=None,
            life_h=None, reliability=None, derivation=None)
    numbers = tuple(zip(time_shares(result), result.revolution_shares, result.lives_mrev,
                        result.damage_shares))
    states = tuple(DutyState(case, share, *figures)
                   for (case, share), figures in zip(result.cycle.states, numbers))
    table = Table(DUTY_HEADER, tuple(
        (str(i), case_result.case.name, share, *(number_text(value) for value in figures))
        for i, (case_result, (_, share), figures) in enumerate(
            zip(result.case_results, result.cycle.states, numbers), start=1)))
    return DutySection(
        number=number, title=duty.name or duty.key, name=duty.name, key=duty.key,
        shaft=duty.shaft, basis=basis, error=duty.error,
        description=f"{origin}; bearing {result.bearing} ({result.kind}); shares typed on a "
                    f"{result.cycle.basis} basis",
        bearing=result.bearing, kind=result.kind, states=states, table=table,
        life_line=(f"Duty life: L = {with_unit(number_text(result.life_mrev), '10⁶ rev')} = "
                   f"{number_text(result.life_h)} h at the mean speed nm = "
                   f"{number_text(result.mean_speed)} r/min, R = {result.reliability:g}"),
        life_mrev=result.life_mrev, mean_speed=result.mean_speed, life_h=result.life_h,
        reliability=result.reliability, derivation=result.derivation,
    )


def _solver_section(session: Session, results: list[CaseResult]) -> SolverSection | None:
    """Run the session's solver question when it names one of its cases."""
    setup = session.solver
    if not setup.case:
        return None
    target = solver_target(session)
    solution, error = None, None
    match = next((r for r in results if r.case.name == setup.case), None)
    if match is None:
        error = f"no case called {setup.case!r} in this session"
    elif match.inputs is None or match.derivation is None:
        error = f"the case cannot be derived ({_error_text(match)})"
    elif not target:
        error = "no target: give the session a life target, or the solver one"
    else:
        try:
            name, value = parse_target_text(target)
            solution = solve(match.inputs, setup.unknown, name, value)
        except (InputError, FieldError) as exc:
            error = f"{exc.field}: {exc.message}"
    label = UNKNOWNS[setup.unknown].label if setup.unknown in UNKNOWNS else setup.unknown
    lines = [f"Question: which {label} gives {target or 'a target'} on case {setup.case!r}?"]
    step_line = None
    if solution is None:
        lines.append(f"No answer: {error}")
    else:
        s = solution
        unit = f" {s.unit}" if s.unit else ""
        lines += [
            f"Answer: {s.unknown} = {number_text(s.value)}{unit}",
            f"Achieved: {s.target} = {with_unit(number_text(s.achieved), TARGETS[s.target][1])} "
            f"(relative residual {s.residual:.1e})",
            f"Found by Brent's method on [{number_text(s.bracket[0])}, "
            f"{number_text(s.bracket[1])}]{unit} in {s.evaluations} evaluations; branch: {s.branch}",
        ]
        if len(s.roots) > 1:
            lines.append(f"More than one answer: {s.unknown} = "
                         f"{', '.join(number_text(root) for root in s.roots)}{unit} all meet the "
                         "target; the answer above is the smallest")
        step = s.derivation.step("solved")
        step_line = f"Solver step: {step.formula} by {step.substituted} ({step.note})."
    return SolverSection(setup.case, setup.unknown, target, solution, error, tuple(lines),
                         step_line)


def _sources(analysis: SessionAnalysis, solver: SolverSection | None) -> tuple[str, ...]:
    """Every source cited by the derivations shown, in order of first use."""
    derivations = [r.derivation for r in analysis.cases if r.derivation is not None]
    for shaft in analysis.shafts:
        derivations += [s.solution.derivation for s in shaft.states if s.solution is not None]
        if shaft.system is not None:
            derivations.append(shaft.system.derivation)
    derivations += [duty.result.derivation for duty in analysis.duties if duty.result is not None]
    if solver is not None and solver.solution is not None:
        derivations.append(solver.solution.derivation)
    return tuple(dict.fromkeys(s for d in derivations for s in d.sources))


def build_report(session: Session, source_name: str,
                 made: Provenance | None = None) -> Report:
    """The design review of ``session``, read from ``source_name``, as one document.

    Built only from the derivation records of :func:`~workbench.model.analysis.analyse` (cases,
    shafts, duty cycles) and, when the session's solver names a case, of
    :func:`~workbench.engine.solve.solve`. ``made`` is its provenance
    (:func:`~workbench.report.meta.provenance`); without one, the report is of a session never
    saved, generated now.
    """
    analysis = analyse(session)
    solver = _solver_section(session, analysis.cases)
    if made is None:
        made = provenance(None)
    bearings = tuple(_bearing_info(session, bearing.name) for bearing in session.bearings)
    return Report(
        meta=_meta(session, source_name, made),
        bearings=bearings,
        bearing_table=_bearing_table(bearings),
        units_note=UNITS_NOTE,
        summary=_summary(analysis.cases),
        generated_legend=GENERATED_LEGEND if any(is_generated(r.case) for r in analysis.cases)
        else None,
        sensitivity_note=_sensitivity_note(len(analysis.cases)),
        cases=tuple(_case_section(session, number, result)
                    for number, result in enumerate(analysis.cases, start=1)),
        shafts=tuple(_shaft_section(number, outcome)
                     for number, outcome in enumerate(analysis.shafts, start=1)),
        duties=tuple(_duty_section(number, duty)
                     for number, duty in enumerate(analysis.duties, start=1)),
        solver=solver,
        sources=_sources(analysis, solver),
        caution=SAFETY_CAUTION,
    )
