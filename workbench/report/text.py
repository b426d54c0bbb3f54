"""Plain text: the report document as aligned lines, and a derivation as ``calc`` prints it."""

from __future__ import annotations

from typing import Sequence

from ..engine.record import Derivation, with_unit
from ..engine.record import fmt as number_text
from ..engine.sensitivity import SensitivityItem
from .contents import (
    CaseSection, DutySection, Report, SensitivitySection, ShaftSection, Table,
    sensitivity_section,
)


def table_lines(table: Table, indent: str = "  ", rule: bool = False) -> list[str]:
    """The table's rows (after its header, if it has one) padded into aligned columns, numeric
    columns to the right; ``rule`` draws a line of dashes under the header."""
    rows = ([table.header] if table.header else []) + list(table.rows)
    widths = [max(len(row[i]) for row in rows) for i in range(len(rows[0]))]
    right = table.numeric or (False,) * len(widths)

    def line(cells: Sequence[str]) -> str:
        return indent + "  ".join(c.rjust(w) if r else c.ljust(w)
                                  for c, w, r in zip(cells, widths, right)).rstrip()

    lines = [line(row) for row in rows]
    if rule and table.header:
        lines.insert(1, line(["-" * w for w in widths]))
    return lines


def step_lines(derivation: Derivation, indent: str = "  ") -> list[str]:
    """Numbered steps: symbol, label and source, then formula = numbers = result, notes, warnings."""
    lines: list[str] = []
    for index, step in enumerate(derivation.steps, start=1):
        lines.append(f"{indent}{index:2d}. {step.symbol}  {step.label}  [{step.source}]")
        worked = [step.formula, step.substituted, with_unit(step.value_text, step.unit)]
        lines.append(f"{indent}    " + "  =  ".join(dict.fromkeys(worked)))
        if step.note:
            lines.append(f"{indent}    note: {step.note}")
        if step.warning:
            lines.append(f"{indent}    WARNING: {step.warning}")
    return lines


def derivation_text(derivation: Derivation) -> str:
    """The whole derivation as text, with its warnings gathered at the end."""
    lines = step_lines(derivation, indent="")
    if derivation.warnings:
        lines += ["", "Warnings:", *(f"  - {w}" for w in derivation.warnings)]
    return "\n".join(lines)


def sensitivity_text(items: Sequence[SensitivityItem]) -> str:
    """The elasticity of life to each input as an aligned table, notes listed under it."""
    if not items:
        return "Sensitivity: no numeric input to vary."
    return "\n".join(_sensitivity_lines(sensitivity_section(items)))


def _sensitivity_lines(section: SensitivitySection, indent: str = "") -> list[str]:
    lines = [section.heading, *table_lines(section.table, indent="", rule=True)]
    if section.notes:
        lines += ["", "Notes:", *(f"  - {label}: {note}" for label, note in section.notes)]
    return [f"{indent}{line}" for line in lines]


def _underlined(heading: str, mark: str) -> list[str]:
    return [heading, mark * len(heading)]


def _case(case: CaseSection) -> list[str]:
    bearing = case.bearing
    lines = [*_underlined(f"Case {case.number}: {case.name}", "-"), f"Bearing: {bearing.line}"]
    if case.static_only:
        lines.append("Static check only: judged on s0; its life is shown for completeness.")
    if bearing.notes:
        lines.append(f"  {bearing.notes}")
    if case.generated_note is not None:
        lines.append(case.generated_note)
    elif case.notes:
        lines += ["Notes:", *(f"  {line}" for line in case.notes.strip().splitlines())]
    if case.inputs:
        lines += ["Inputs as typed:",
                  *table_lines(Table((), tuple((i.label, i.text) for i in case.inputs)))]
    if case.derivation is None:
        return lines + [f"ERROR: {case.error}", ""]
    d = case.derivation
    lines.append("Results:")
    lines += table_lines(Table((), tuple((r.symbol, r.label, number_text(r.value), r.unit)
                                         for r in case.results)))
    lines += ["Derivation:", *step_lines(d), "Warnings:" if d.warnings else "Warnings: none"]
    lines += [f"  - {w}" for w in d.warnings]
    lines += ["Targets:", *(f"  {verdict}" for verdict in case.verdicts), ""]
    if case.sensitivity is not None:
        lines += [*_sensitivity_lines(case.sensitivity, indent="  "), ""]
    return lines


def _shaft(shaft: ShaftSection) -> list[str]:
    """Per state the free body and the bearing loads, then the system life of its bearings."""
    lines = [*_underlined(f"Shaft {shaft.number}: {shaft.title}", "~"), shaft.description]
    if shaft.error is not None:
        lines.append(f"ERROR: {shaft.error}")
    for state in shaft.states:
        lines.append(state.heading)
        if state.derivation is None:
            lines.append(f"  ERROR: {state.error}")
            continue
        lines.append("  Free body: mesh and belt forces, reactions, thrust:")
        lines += step_lines(state.derivation, indent="    ")
        if state.load_table is not None:
            lines += ["  Bearing loads:", *table_lines(state.load_table, indent="    ")]
    if shaft.system_line is not None:
        lines.append(shaft.system_line)
    if shaft.system is not None:
        lines += step_lines(shaft.system.derivation, indent="    ")
    return lines + [""]


def _duty(duty: DutySection) -> list[str]:
    """The states' shares, lives and damage, then the Miner life."""
    lines = [*_underlined(f"Cycle {duty.number}: {duty.title}", "~"), duty.description]
    if duty.table is not None and duty.derivation is not None:
        lines += table_lines(duty.table)
        lines += ["Palmgren–Miner summation:", *step_lines(duty.derivation, indent="    ")]
    return lines + [duty.life_line, ""]


def render(report: Report) -> str:
    """The report as plain text."""
    meta = report.meta
    lines = _underlined(f"Design review: {meta.title}", "=")
    lines += table_lines(Table((), tuple((f"{label}:", value) for label, value in meta.facts)),
                         indent="")
    if meta.notes.strip():
        lines += ["", *meta.notes.strip().splitlines()]
    lines += ["", report.units_note, "", *_underlined("Bearings", "-")]
    lines += table_lines(report.bearing_table) if report.bearings else ["  (no bearings)"]
    lines += ["", *_underlined("Summary", "-")]
    lines += table_lines(report.summary) if report.cases else ["  (no load cases)"]
    if report.generated_legend:
        lines.append(f"  {report.generated_legend}")
    if report.sensitivity_note:
        lines.append(f"  {report.sensitivity_note}")
    lines.append("")
    for case in report.cases:
        lines += _case(case)
    if report.shafts:
        lines += _underlined("Shafts", "-")
        for shaft in report.shafts:
            lines += _shaft(shaft)
    if report.duties:
        lines += _underlined("Duty cycles", "-")
        for duty in report.duties:
            lines += _duty(duty)
    if report.solver is not None:
        lines += [*_underlined("Solver", "-"), *(f"  {line}" for line in report.solver.lines), ""]
    lines += [*_underlined("Sources", "-"), *(f"  - {s}" for s in report.sources), ""]
    lines += [*_underlined("Caution", "-"), report.caution]
    return "\n".join(lines) + "\n"
