"""Design-review reports of a session: plain text, Markdown or JSON.

Every number comes from a derivation record: :func:`workbench.model.analysis.analyse` for the
cases, the session's and those generated from its shafts (ISO 281:2007 dynamic rating and life,
ISO 76:2006 static safety), the shafts' free bodies (gear-force relations, shaft statics, the
two-bearing thrust-sharing rule) and system lives (series system of Weibull lives), and the duty
cycles (Palmgren–Miner rule); :func:`workbench.engine.solve.solve` for the solver question.
Nothing is computed here; the report only arranges the steps, results, warnings and verdicts
those records hold, and ends with the sources cited and the safety caution.
"""

from __future__ import annotations

import json
import math
import sys
from dataclasses import dataclass
from pathlib import Path
from typing import Any, Callable

from .engine.record import Derivation, InputError
from .engine.record import fmt as number_text
from .engine.sensitivity import SensitivityItem, sensitivity_of
from .engine.solve import TARGETS, UNKNOWNS, Solution, solve
from .model.analysis import DutyOutcome, SessionAnalysis, ShaftOutcome, analyse, time_shares
from .model.caution import SAFETY_CAUTION
from .model.fields import FIELD_BY_NAME, FieldError
from .model.session import CaseResult, Session, case_texts
from .model.sessionfile import SessionFileError, load_session
from .model.shafts import SIDES, is_generated
from .model.targets import parse_target_text
from .render import (
    SENSITIVITY_HEADERS, sensitivity_heading, sensitivity_rows, sensitivity_text, step_lines,
)

FORMATS = ("text", "markdown", "json")
UNITS_NOTE = "Values are in the engine's units: N, mm, r/min, h, 10⁶ rev, mm²/s, °C."
SUMMARY_RESULTS = ("P", "L10h", "Lnm", "s0")
GENERATED_MARK = " *"
GENERATED_LEGEND = "* generated from a shaft: its loads come from the Shafts section"


@dataclass
class SolverOutcome:
    """The solver question of a session and its answer (or why there is none)."""

    case: str
    unknown: str
    target: str
    solution: Solution | None
    error: str | None


@dataclass
class ResultRow:
    """One named result with the symbol, label and unit of the step that recorded it."""

    key: str
    symbol: str
    label: str
    value: float
    unit: str


def _result_rows(derivation: Derivation) -> list[ResultRow]:
    """Every entry of ``derivation.results``, labelled from its step when it has one."""
    rows = []
    for key, value in derivation.results.items():
        try:
            step = derivation.step(key)
        except KeyError:
            rows.append(ResultRow(key, key, "", value, ""))
            continue
        rows.append(ResultRow(key, step.symbol, step.label, value, step.unit))
    return rows


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


def _verdict(ok: bool | None) -> str:
    return "no verdict" if ok is None else ("met" if ok else "missed")


def _life_line(result: CaseResult) -> str:
    """The life verdict in words, from the case's Lnm and the session's life target."""
    if result.life_target_h is None:
        return "Life: no life target set"
    assert result.derivation is not None
    lnm = result.derivation.results.get("Lnm", math.nan)
    return (f"Life: Lnm = {number_text(lnm)} h against the target {number_text(result.life_target_h)} h: "
            f"{_verdict(result.meets_life)}")


def _static_line(result: CaseResult) -> str:
    """The static-safety verdict in words (ISO 76:2006 s0 against the minimum in force)."""
    assert result.derivation is not None
    res = result.derivation.results
    return (f"Static safety: s0 = {number_text(res['s0'])} against the minimum "
            f"{number_text(res['s0_min'])}: {_verdict(result.meets_s0)}")


def _solver_outcome(session: Session, results: list[CaseResult]) -> SolverOutcome | None:
    """Run the session's solver question when it names one of its cases."""
    setup = session.solver
    if not setup.case:
        return None
    outcome = SolverOutcome(setup.case, setup.unknown, setup.target, None, None)
    match = next((r for r in results if r.case.name == setup.case), None)
    if match is None:
        outcome.error = f"no case called {setup.case!r} in this session"
    elif match.inputs is None or match.derivation is None:
        outcome.error = f"the case cannot be derived ({_error_text(match)})"
    else:
        try:
            name, value = parse_target_text(setup.target)
            outcome.solution = solve(match.inputs, setup.unknown, name, value)
        except (InputError, FieldError) as exc:
            outcome.error = f"{exc.field}: {exc.message}"
    return outcome


def _sources(analysis: SessionAnalysis, solver: SolverOutcome | None) -> list[str]:
    """Every source cited by the derivations shown, in order of first use."""
    derivations = [r.derivation for r in analysis.cases if r.derivation is not None]
    for shaft in analysis.shafts:
        derivations += [s.solution.derivation for s in shaft.states if s.solution is not None]
        if shaft.system is not None:
            derivations.append(shaft.system.derivation)
    derivations += [duty.result.derivation for duty in analysis.duties if duty.result is not None]
    if solver is not None and solver.solution is not None:
        derivations.append(solver.solution.derivation)
    return list(dict.fromkeys(s for d in derivations for s in d.sources))


def _generated_words(notes: str) -> str:
    """``generated from shaft X`` as the start of a sentence."""
    return notes[:1].upper() + notes[1:]


def _shaft_heading(outcome: ShaftOutcome) -> str:
    """The shaft's bearings, positions and which end locates, in words."""
    shaft = outcome.shaft
    if shaft is None:
        return "(its table cannot be read)"
    return (f"bearing A = {shaft.bearing_a} at {shaft.position_a}, bearing B = {shaft.bearing_b} "
            f"at {shaft.position_b}; locating: {shaft.locating}"
            + (f" ({shaft.mounting} mounting)" if shaft.mounting else ""))


def _state_heading(outcome: ShaftOutcome, number: int) -> str:
    """``State 1: full load (15 kW, 1480 rpm, time share 0.7)`` from the texts as typed."""
    state = outcome.states[number - 1].state
    drive = state.power or state.torque
    return f"State {number}: {state.name} ({drive}, {state.speed}, time share {state.share})"


def _bearing_load_rows(outcome: ShaftOutcome, number: int) -> list[list[str]]:
    """(side, bearing, Fr, Fa) of each bearing of a solved state."""
    solution = outcome.states[number - 1].solution
    assert solution is not None and outcome.shaft is not None
    return [[side, getattr(outcome.shaft, f"bearing_{side.lower()}"),
             *(number_text(load) for load in solution.bearing_loads[side])]
            for side in SIDES]


def _system_line(outcome: ShaftOutcome) -> str:
    """The shaft's system life in words, or why there is none."""
    system = outcome.system
    if system is None:
        return f"System life: none ({outcome.system_error})"
    return (f"System life of the shaft's bearings: L_sys = {number_text(system.life_mrev)} 10⁶ rev"
            f" = {number_text(system.life_h)} h at the mean speed, R = {system.reliability:g} "
            f"(Weibull slope {number_text(system.weibull_slope)})")


def _duty_heading(duty: DutyOutcome) -> str:
    """Where the cycle comes from, the bearing it loads and its share basis."""
    origin = f"automatic, from shaft {duty.shaft}" if duty.shaft is not None else "from the file"
    if duty.result is None:
        return origin
    return (f"{origin}; bearing {duty.result.bearing} ({duty.result.kind}); "
            f"shares typed on a {duty.result.cycle.basis} basis")


def _duty_rows(duty: DutyOutcome) -> list[list[str]]:
    """Per state: case, share as typed, time share, revolution share, life, damage share."""
    result = duty.result
    assert result is not None
    return [[str(i), case.case.name, share, number_text(t), number_text(u), number_text(life),
             number_text(damage)]
            for i, (case, (_, share), t, u, life, damage) in enumerate(zip(
                result.case_results, result.cycle.states, time_shares(result),
                result.revolution_shares, result.lives_mrev, result.damage_shares), start=1)]


DUTY_HEADER = ["#", "Case", "Share typed", "Time share", "Revolution share ui",
               "Life Li (10⁶ rev)", "Damage share"]


def _duty_line(duty: DutyOutcome) -> str:
    """The Miner life in 10⁶ rev and in hours at the mean speed, or why there is none."""
    result = duty.result
    if result is None:
        return f"No duty life: {duty.error}"
    return (f"Duty life: L = {number_text(result.life_mrev)} 10⁶ rev = "
            f"{number_text(result.life_h)} h at the mean speed nm = {number_text(result.mean_speed)} r/min, "
            f"R = {result.reliability:g}")


def _inputs(session: Session, result: CaseResult) -> list[tuple[str, str, str]]:
    """(field, label, text as typed) of every input the case gives, bearing fields first."""
    texts = case_texts(session, result.case)
    return [(name, FIELD_BY_NAME[name].label, text) for name, text in texts.items() if text.strip()]


def _solver_summary(outcome: SolverOutcome) -> list[str]:
    """The solver's question and answer as lines of plain words."""
    label = UNKNOWNS[outcome.unknown].label if outcome.unknown in UNKNOWNS else outcome.unknown
    lines = [f"Question: which {label} gives {outcome.target} on case {outcome.case!r}?"]
    if outcome.solution is None:
        lines.append(f"No answer: {outcome.error}")
        return lines
    s = outcome.solution
    unit = f" {s.unit}" if s.unit else ""
    target_unit = TARGETS[s.target][1]
    target_unit = f" {target_unit}" if target_unit else ""
    lines += [
        f"Answer: {s.unknown} = {number_text(s.value)}{unit}",
        f"Achieved: {s.target} = {number_text(s.achieved)}{target_unit} "
        f"(relative residual {s.residual:.1e})",
        f"Found by Brent's method on [{number_text(s.bracket[0])}, {number_text(s.bracket[1])}]"
        f"{unit} in {s.evaluations} evaluations; branch: {s.branch}",
    ]
    return lines


# ---- plain text ------------------------------------------------------------------------------
def _columns(rows: list[list[str]], indent: str = "  ") -> list[str]:
    """Rows of cells padded into aligned columns."""
    widths = [max(len(row[i]) for row in rows) for i in range(len(rows[0]))]
    return [indent + "  ".join(c.ljust(w) for c, w in zip(row, widths)).rstrip() for row in rows]


def _summary_rows(results: list[CaseResult]) -> list[list[str]]:
    """Header and one row per case: its bearing, key results and the two verdicts."""
    rows = [["Case", "Bearing", "P (N)", "L10h (h)", "Lnm (h)", "s0", "Life", "Static"]]
    for r in results:
        name = r.case.name + (GENERATED_MARK if is_generated(r.case) else "")
        if r.derivation is None:
            rows.append([name, r.case.bearing, "error", "", "", "", "", ""])
            continue
        res = r.derivation.results
        rows.append([name, r.case.bearing]
                    + [number_text(res[k]) for k in SUMMARY_RESULTS]
                    + [_verdict(r.meets_life), _verdict(r.meets_s0)])
    return rows


def _head_lines(session: Session, source_name: str) -> list[tuple[str, str]]:
    """(label, value) pairs describing the session and its targets."""
    targets = session.targets
    return [
        ("Session file", source_name),
        ("Engineer", session.engineer or "—"),
        ("Unit system", session.units),
        ("Life target", f"Lnm ≥ {targets.life}" if targets.life.strip() else "none"),
        ("Reliability", targets.reliability or "—"),
        ("Static safety", f"s0 ≥ {targets.s0}" if targets.s0.strip() else "the duty's minimum"),
    ]


def _text_case(session: Session, number: int, result: CaseResult) -> list[str]:
    case = result.case
    bearing = session.bearing(case.bearing)
    kind = bearing.texts.get("kind", "") if bearing else ""
    lines = [f"Case {number}: {case.name}", "-" * (len(case.name) + len(str(number)) + 6),
             f"Bearing: {case.bearing}" + (f" ({kind})" if kind else "")]
    if bearing is not None and bearing.notes:
        lines.append(f"  {bearing.notes}")
    if is_generated(case):
        lines.append(f"{_generated_words(case.notes)}: its Fr, Fa and speed are those of the "
                     "Shafts section")
    elif case.notes:
        lines += ["Notes:", *(f"  {line}" for line in case.notes.strip().splitlines())]
    inputs = _inputs(session, result)
    if inputs:
        lines += ["Inputs as typed:", *_columns([[label, text] for _, label, text in inputs])]
    if result.derivation is None:
        lines += [f"ERROR: {_error_text(result)}", ""]
        return lines
    d = result.derivation
    lines.append("Results:")
    lines += _columns([[row.symbol, row.label, number_text(row.value), row.unit]
                       for row in _result_rows(d)])
    lines.append("Derivation:")
    lines += step_lines(d)
    lines.append("Warnings:" if d.warnings else "Warnings: none")
    lines += [f"  - {w}" for w in d.warnings]
    lines += ["Targets:", f"  {_life_line(result)}", f"  {_static_line(result)}", ""]
    items = _sensitivity(result)
    if items:
        lines += [*(f"  {line}" for line in sensitivity_text(items).splitlines()), ""]
    return lines


def _text_shafts(analysis: SessionAnalysis) -> list[str]:
    """The Shafts section: per shaft and state the free body and the bearing loads, then the
    system life of its bearings."""
    if not analysis.shafts:
        return []
    lines = ["Shafts", "------"]
    for number, outcome in enumerate(analysis.shafts, start=1):
        heading = f"Shaft {number}: {outcome.name or outcome.key}"
        lines += [heading, "~" * len(heading), _shaft_heading(outcome)]
        if outcome.error is not None:
            lines.append(f"ERROR: {outcome.error}")
        for state_number, state in enumerate(outcome.states, start=1):
            lines.append(_state_heading(outcome, state_number))
            if state.solution is None:
                lines.append(f"  ERROR: {state.error}")
                continue
            lines.append("  Free body: mesh and belt forces, reactions, thrust:")
            lines += step_lines(state.solution.derivation, indent="    ")
            lines.append("  Bearing loads (N):")
            lines += _columns([["", "Bearing", "Fr", "Fa"]]
                              + _bearing_load_rows(outcome, state_number), indent="    ")
        if outcome.shaft is not None:
            lines.append(_system_line(outcome))
        if outcome.system is not None:
            lines += step_lines(outcome.system.derivation, indent="    ")
        lines.append("")
    return lines


def _text_duties(analysis: SessionAnalysis) -> list[str]:
    """The Duty cycles section: per cycle the states' shares, lives and damage, then the life."""
    if not analysis.duties:
        return []
    lines = ["Duty cycles", "-----------"]
    for number, duty in enumerate(analysis.duties, start=1):
        heading = f"Cycle {number}: {duty.name or duty.key}"
        lines += [heading, "~" * len(heading), _duty_heading(duty)]
        if duty.result is not None:
            lines += _columns([DUTY_HEADER] + _duty_rows(duty))
            lines.append("Palmgren–Miner summation:")
            lines += step_lines(duty.result.derivation, indent="    ")
        lines += [_duty_line(duty), ""]
    return lines


def _render_text(session: Session, analysis: SessionAnalysis, solver: SolverOutcome | None,
                 source_name: str) -> str:
    results = analysis.cases
    title = f"Design review: {session.title}"
    lines = [title, "=" * len(title)]
    lines += _columns([[f"{k}:", v] for k, v in _head_lines(session, source_name)], indent="")
    if session.notes.strip():
        lines += ["", *session.notes.strip().splitlines()]
    lines += ["", UNITS_NOTE, "", "Summary", "-------"]
    lines += _columns(_summary_rows(results)) if results else ["  (no load cases)"]
    if any(is_generated(r.case) for r in results):
        lines.append(f"  {GENERATED_LEGEND}")
    lines.append("")
    for number, result in enumerate(results, start=1):
        lines += _text_case(session, number, result)
    lines += _text_shafts(analysis)
    lines += _text_duties(analysis)
    if solver is not None:
        lines += ["Solver", "------", *(f"  {line}" for line in _solver_summary(solver)), ""]
    lines += ["Sources", "-------", *(f"  - {s}" for s in _sources(analysis, solver)), ""]
    lines += ["Caution", "-------", SAFETY_CAUTION]
    return "\n".join(lines) + "\n"


# ---- Markdown --------------------------------------------------------------------------------
def _cell(text: str) -> str:
    """Text safe inside a Markdown table cell."""
    return " ".join(text.split()).replace("|", "\\|") or " "


def _md_table(header: list[str], rows: list[list[str]]) -> list[str]:
    lines = ["| " + " | ".join(header) + " |", "|" + "|".join("---" for _ in header) + "|"]
    lines += ["| " + " | ".join(_cell(c) for c in row) + " |" for row in rows]
    return lines + [""]


def _md_steps(d: Derivation) -> list[str]:
    """The steps of a derivation as one Markdown table."""
    return _md_table(
        ["#", "Symbol", "Step", "Formula", "With numbers", "Result", "Unit", "Source", "Note"],
        [[str(i), s.symbol, s.label, s.formula, s.substituted, s.value_text, s.unit, s.source,
          "; ".join(x for x in (s.note, f"⚠ {s.warning}" if s.warning else None) if x)]
         for i, s in enumerate(d.steps, start=1)])


def _md_case(session: Session, number: int, result: CaseResult) -> list[str]:
    case = result.case
    bearing = session.bearing(case.bearing)
    kind = bearing.texts.get("kind", "") if bearing else ""
    lines = [f"## Case {number}: {case.name}", "",
             f"**Bearing:** {case.bearing}" + (f" ({kind})" if kind else "")
             + (f" — {bearing.notes}" if bearing is not None and bearing.notes else ""), ""]
    if is_generated(case):
        lines += [f"*{_generated_words(case.notes)}: its Fr, Fa and speed are those of the "
                  "Shafts section.*", ""]
    elif case.notes.strip():
        lines += [" ".join(case.notes.split()), ""]
    inputs = _inputs(session, result)
    if inputs:
        lines += ["### Inputs as typed", ""]
        lines += _md_table(["Input", "Field", "Value"], [[label, f"`{name}`", text]
                                                         for name, label, text in inputs])
    if result.derivation is None:
        return lines + [f"**Error:** {_error_text(result)}", ""]
    d = result.derivation
    lines += ["### Results", ""]
    lines += _md_table(["Symbol", "Result", "Value", "Unit"],
                       [[row.symbol, row.label or f"`{row.key}`", number_text(row.value), row.unit]
                        for row in _result_rows(d)])
    lines += ["### Derivation", ""]
    lines += _md_steps(d)
    lines += ["### Warnings", ""]
    lines += [f"- {w}" for w in d.warnings] if d.warnings else ["None."]
    lines += ["", "### Targets", "", f"- {_life_line(result)}", f"- {_static_line(result)}", ""]
    items = _sensitivity(result)
    if items:
        lines += ["### Sensitivity", "", sensitivity_heading(items), ""]
        lines += _md_table(list(SENSITIVITY_HEADERS), [list(r) for r in sensitivity_rows(items)])
        lines += [f"- {item.label}: {item.note}" for item in items if item.note]
        lines.append("")
    return lines


def _md_shafts(analysis: SessionAnalysis) -> list[str]:
    """The Shafts section in Markdown (see :func:`_text_shafts`)."""
    if not analysis.shafts:
        return []
    lines = ["## Shafts", ""]
    for number, outcome in enumerate(analysis.shafts, start=1):
        lines += [f"### Shaft {number}: {outcome.name or outcome.key}", "",
                  _shaft_heading(outcome), ""]
        if outcome.error is not None:
            lines += [f"**Error:** {outcome.error}", ""]
        for state_number, state in enumerate(outcome.states, start=1):
            lines += [f"#### {_state_heading(outcome, state_number)}", ""]
            if state.solution is None:
                lines += [f"**Error:** {state.error}", ""]
                continue
            lines += ["Free body: mesh and belt forces, reactions, thrust.", ""]
            lines += _md_steps(state.solution.derivation)
            lines += _md_table(["Side", "Bearing", "Fr (N)", "Fa (N)"],
                               _bearing_load_rows(outcome, state_number))
        if outcome.shaft is not None:
            lines += [f"#### {_system_line(outcome)}", ""]
        if outcome.system is not None:
            lines += _md_steps(outcome.system.derivation)
    return lines


def _md_duties(analysis: SessionAnalysis) -> list[str]:
    """The Duty cycles section in Markdown (see :func:`_text_duties`)."""
    if not analysis.duties:
        return []
    lines = ["## Duty cycles", ""]
    for number, duty in enumerate(analysis.duties, start=1):
        lines += [f"### Cycle {number}: {duty.name or duty.key}", "", _duty_heading(duty), ""]
        if duty.result is not None:
            lines += _md_table(DUTY_HEADER, _duty_rows(duty))
            lines += ["Palmgren–Miner summation:", ""]
            lines += _md_steps(duty.result.derivation)
        lines += [f"**{_duty_line(duty)}**", ""]
    return lines


def _render_markdown(session: Session, analysis: SessionAnalysis, solver: SolverOutcome | None,
                     source_name: str) -> str:
    results = analysis.cases
    lines = [f"# Design review: {session.title}", ""]
    lines += _md_table(["Item", "Value"], [[k, v] for k, v in _head_lines(session, source_name)])
    if session.notes.strip():
        lines += [" ".join(session.notes.split()), ""]
    lines += [f"*{UNITS_NOTE}*", "", "## Summary", ""]
    summary = _summary_rows(results)
    lines += _md_table(summary[0], summary[1:]) if results else ["No load cases.", ""]
    if any(is_generated(r.case) for r in results):
        lines += [f"\\{GENERATED_LEGEND}", ""]
    for number, result in enumerate(results, start=1):
        lines += _md_case(session, number, result)
    lines += _md_shafts(analysis)
    lines += _md_duties(analysis)
    if solver is not None:
        lines += ["## Solver", "", *(f"- {line}" for line in _solver_summary(solver)), ""]
        if solver.solution is not None:
            step = solver.solution.derivation.step("solved")
            lines += [f"Solver step: {step.formula} by {step.substituted} ({step.note}).", ""]
    lines += ["## Sources", "", *(f"- {s}" for s in _sources(analysis, solver)), ""]
    lines += ["## Caution", "", f"> {SAFETY_CAUTION}", ""]
    return "\n".join(lines)


# ---- JSON ------------------------------------------------------------------------------------
def _plain(value: Any) -> Any:
    """``value`` with every NaN or infinity replaced by None, so the JSON is standard."""
    if isinstance(value, float) and not math.isfinite(value):
        return None
    if isinstance(value, dict):
        return {k: _plain(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [_plain(v) for v in value]
    return value


def _json_case(session: Session, result: CaseResult) -> dict[str, Any]:
    record = result.derivation.as_dict() if result.derivation is not None else None
    return {
        "name": result.case.name,
        "bearing": result.case.bearing,
        "notes": result.case.notes,
        "inputs": {name: text for name, _, text in _inputs(session, result)},
        "results": record["results"] if record else {},
        "steps": record["steps"] if record else [],
        "warnings": record["warnings"] if record else [],
        "meets_life": result.meets_life,
        "meets_s0": result.meets_s0,
        "life_target_h": result.life_target_h,
        "error": _error_text(result),
        "field_errors": dict(result.field_errors),
        "generated": is_generated(result.case),
        "sensitivity": [item.as_dict() for item in _sensitivity(result)],
    }


def _json_record(d: Derivation) -> dict[str, Any]:
    """Results, steps and warnings of a derivation."""
    record = d.as_dict()
    return {"results": record["results"], "steps": record["steps"], "warnings": record["warnings"]}


def _json_shaft(outcome: ShaftOutcome) -> dict[str, Any]:
    """A shaft: per state the typed texts, torque, speed, bearing loads and free-body record."""
    shaft = outcome.shaft
    states = []
    for state in outcome.states:
        solution = state.solution
        typed = state.state
        data: dict[str, Any] = {
            "name": typed.name, "key": state.key, "error": state.error,
            "typed": {"power": typed.power, "torque": typed.torque, "speed": typed.speed,
                      "share": typed.share},
        }
        if solution is not None and shaft is not None:
            data |= {"torque": solution.torque, "speed": solution.speed,
                     "bearings": {side: {"bearing": getattr(shaft, f"bearing_{side.lower()}"),
                                         "fr": solution.bearing_loads[side][0],
                                         "fa": solution.bearing_loads[side][1]}
                                  for side in SIDES}} | _json_record(solution.derivation)
        states.append(data)
    system = outcome.system
    return {
        "name": outcome.name, "key": outcome.key,
        "bearing_a": shaft.bearing_a if shaft else None,
        "bearing_b": shaft.bearing_b if shaft else None,
        "locating": shaft.locating if shaft else None,
        "error": outcome.error,
        "states": states,
        "system": None if system is None else {
            "life_mrev": system.life_mrev, "life_h": system.life_h,
            "weibull_slope": system.weibull_slope, "reliability": system.reliability,
        } | _json_record(system.derivation),
        "system_error": outcome.system_error,
    }


def _json_duty(duty: DutyOutcome) -> dict[str, Any]:
    """A duty cycle: per state the shares, life and damage share, then the Miner life."""
    result = duty.result
    data: dict[str, Any] = {"name": duty.name, "key": duty.key, "shaft": duty.shaft,
                            "basis": duty.cycle.basis if duty.cycle else None, "error": duty.error}
    if result is None:
        return data | {"states": [
            {"case": case, "share": share} for case, share in duty.cycle.states]
            if duty.cycle else []}
    return data | {
        "bearing": result.bearing, "kind": result.kind,
        "states": [{"case": case, "share": share, "time_share": t, "revolution_share": u,
                    "life_mrev": life, "damage_share": damage}
                   for (case, share), t, u, life, damage in zip(
                       result.cycle.states, time_shares(result), result.revolution_shares,
                       result.lives_mrev, result.damage_shares)],
        "life_mrev": result.life_mrev, "mean_speed": result.mean_speed, "life_h": result.life_h,
        "reliability": result.reliability,
    } | _json_record(result.derivation)


def _render_json(session: Session, analysis: SessionAnalysis, solver: SolverOutcome | None,
                 source_name: str) -> str:
    solver_data = None
    if solver is not None:
        solution = solver.solution
        solver_data = {
            "case": solver.case, "unknown": solver.unknown, "target": solver.target,
            "solution": solution.as_dict() if solution else None,
            "results": solution.derivation.as_dict()["results"] if solution else None,
            "error": solver.error,
        }
    data = {
        "session": {
            "title": session.title, "engineer": session.engineer, "notes": session.notes,
            "units": session.units, "source": source_name,
            "targets": {"life": session.targets.life, "reliability": session.targets.reliability,
                        "s0": session.targets.s0},
        },
        "cases": [_json_case(session, r) for r in analysis.cases],
        "shafts": [_json_shaft(outcome) for outcome in analysis.shafts],
        "duty_cycles": [_json_duty(duty) for duty in analysis.duties],
        "solver": solver_data,
        "sources": _sources(analysis, solver),
        "caution": SAFETY_CAUTION,
    }
    return json.dumps(_plain(data), indent=2, ensure_ascii=False, allow_nan=False) + "\n"


RENDERERS: dict[str, Callable[[Session, SessionAnalysis, SolverOutcome | None, str], str]] = {
    "text": _render_text, "markdown": _render_markdown, "json": _render_json,
}


def render_report(session: Session, fmt: str, source_name: str) -> str:
    """The design-review report of ``session`` in ``fmt`` (text, markdown or json).

    Built only from the derivation records of :func:`~workbench.model.analysis.analyse` (cases,
    shafts, duty cycles) and, when the session's solver names a case, of
    :func:`~workbench.engine.solve.solve`.
    """
    if fmt not in RENDERERS:
        raise ValueError(f"unknown report format {fmt!r}; use one of {', '.join(FORMATS)}")
    analysis = analyse(session)
    return RENDERERS[fmt](session, analysis, _solver_outcome(session, analysis.cases), source_name)


def run_report(path: str, fmt: str, out: str | None) -> int:
    """``workbench report``: load ``path``, render it, write ``out`` or stdout; 0, or 2 on error.

    A case that cannot be derived shows its error in the report and does not fail the run.
    """
    if fmt not in RENDERERS:
        print(f"workbench report: unknown format {fmt!r}; use one of {', '.join(FORMATS)}",
              file=sys.stderr)
        return 2
    try:
        session = load_session(path)
    except SessionFileError as exc:
        print(str(exc), file=sys.stderr)
        return 2
    report = render_report(session, fmt, path)
    if out is None:
        sys.stdout.write(report)
        return 0
    try:
        Path(out).write_text(report, encoding="utf-8")
    except OSError as exc:
        print(f"{out}: cannot write the report: {exc.strerror or exc}", file=sys.stderr)
        return 2
    return 0
