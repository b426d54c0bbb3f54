"""Markdown: the report document as headings, tables and lists."""

from __future__ import annotations

from typing import Sequence

from ..engine.record import Derivation
from ..model.user_text import markdown_text
from .contents import (
    CaseSection, DutySection, Report, ShaftSection, Table, input_table, result_table, step_table,
)


def _cell(text: str) -> str:
    """Text safe inside a Markdown table cell: one line, marks and HTML escaped."""
    return _inline(text) or " "


def _inline(text: str) -> str:
    """Text inside a line the writer began (a heading, a cell): escaped, on one line."""
    return markdown_text(text, block_start=False)


def _table(header: Sequence[str], rows: Sequence[Sequence[str]]) -> list[str]:
    lines = ["| " + " | ".join(_cell(h) for h in header) + " |", "|" + "|".join("---" for _ in header) + "|"]
    lines += ["| " + " | ".join(_cell(c) for c in row) + " |" for row in rows]
    return lines + [""]


def _of(table: Table) -> list[str]:
    return _table(table.header, table.rows)


def _steps(d: Derivation) -> list[str]:
    """The steps of a derivation as one Markdown table."""
    return _of(step_table(d))


def _case(case: CaseSection) -> list[str]:
    bearing = case.bearing
    lines = [f"## Case {case.number}: {_inline(case.name)}", "",
             f"**Bearing:** {_inline(bearing.line)}"
             + (f" — {_inline(bearing.notes)}" if bearing.notes else ""), ""]
    if case.static_only:
        lines += ["**Static check only:** judged on s0; its life is shown for completeness.", ""]
    if case.generated_note is not None:
        lines += [f"*{_inline(case.generated_note)}.*", ""]
    elif case.notes.strip():
        lines += [markdown_text(case.notes), ""]
    if case.inputs:
        lines += ["### Inputs as typed", ""]
        lines += _of(input_table(case))
    if case.derivation is None:
        return lines + [f"**Error:** {_inline(case.error or '')}", ""]
    d = case.derivation
    lines += ["### Results", ""]
    lines += _of(result_table(case))
    lines += ["### Derivation", "", *_steps(d), "### Warnings", ""]
    lines += [f"- {markdown_text(w)}" for w in d.warnings] if d.warnings else ["None."]
    lines += ["", "### Targets", "", *(f"- {markdown_text(verdict)}" for verdict in case.verdicts),
              ""]
    if case.sensitivity is not None:
        section = case.sensitivity
        lines += ["### Sensitivity", "", markdown_text(section.heading), "", *_of(section.table)]
        lines += [f"- {markdown_text(label)}: {_inline(note)}" for label, note in section.notes]
        lines.append("")
    return lines


def _shaft(shaft: ShaftSection) -> list[str]:
    """Per state the free body and the bearing loads, then the system life of its bearings."""
    lines = [f"### Shaft {shaft.number}: {_inline(shaft.title)}", "",
             markdown_text(shaft.description), ""]
    if shaft.error is not None:
        lines += [f"**Error:** {_inline(shaft.error)}", ""]
    for state in shaft.states:
        lines += [f"#### {_inline(state.heading)}", ""]
        if state.derivation is None:
            lines += [f"**Error:** {_inline(state.error or '')}", ""]
            continue
        lines += ["Free body: mesh and belt forces, reactions, thrust.", ""]
        lines += _steps(state.derivation)
        if state.load_table is not None:
            lines += _of(state.load_table)
    if shaft.system_line is not None:
        lines += [f"#### {_inline(shaft.system_line)}", ""]
    if shaft.system is not None:
        lines += _steps(shaft.system.derivation)
    return lines


def _duty(duty: DutySection) -> list[str]:
    """The states' shares, lives and damage, then the Miner life."""
    lines = [f"### Cycle {duty.number}: {_inline(duty.title)}", "",
             markdown_text(duty.description), ""]
    if duty.table is not None and duty.derivation is not None:
        lines += _of(duty.table)
        lines += ["Palmgren–Miner summation:", "", *_steps(duty.derivation)]
    return lines + [f"**{_inline(duty.life_line)}**", ""]


def render(report: Report) -> str:
    """The report as Markdown."""
    meta = report.meta
    lines = [f"# Design review: {_inline(meta.title)}", ""]
    lines += _table(["Item", "Value"], meta.facts)
    if meta.notes.strip():
        lines += [markdown_text(meta.notes), ""]
    lines += [f"*{report.units_note}*", "", "## Bearings", ""]
    lines += _of(report.bearing_table) if report.bearings else ["No bearings.", ""]
    lines += ["## Summary", ""]
    lines += _of(report.summary) if report.cases else ["No load cases.", ""]
    if report.generated_legend:
        lines += [f"\\{report.generated_legend}", ""]
    if report.sensitivity_note:
        lines += [markdown_text(report.sensitivity_note), ""]
    for case in report.cases:
        lines += _case(case)
    if report.shafts:
        lines += ["## Shafts", ""]
        for shaft in report.shafts:
            lines += _shaft(shaft)
    if report.duties:
        lines += ["## Duty cycles", ""]
        for duty in report.duties:
            lines += _duty(duty)
    if report.solver is not None:
        lines += ["## Solver", "", *(f"- {markdown_text(line)}" for line in report.solver.lines),
                  ""]
        if report.solver.step_line is not None:
            lines += [markdown_text(report.solver.step_line), ""]
    lines += ["## Sources", "", *(f"- {s}" for s in report.sources), ""]
    lines += ["## Caution", "", f"> {report.caution}", ""]
    return "\n".join(lines)
