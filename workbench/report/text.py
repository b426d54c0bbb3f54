"""Plain text: the report document as aligned lines, and a derivation as ``calc`` prints it.

Every line of the report is at most :data:`TEXT_WIDTH` columns: prose and steps are wrapped
between words (a continuation indented past its line), and a table too wide for the page is
written row by row, its first cell on a line and the others after it as "heading value".
"""

from __future__ import annotations

import re
import textwrap
from typing import Sequence

from ..engine.record import Derivation, with_unit
from ..engine.record import fmt as number_text
from ..engine.sensitivity import SensitivityItem
from .contents import (
    CaseSection, DutySection, Report, SensitivitySection, ShaftSection, Table,
    sensitivity_section,
)


TEXT_WIDTH = 74
"""The columns of every line of the text report: the report screen's preview shows 74 at the
80-column terminal the workbench is made for, and a longer line wraps there."""
CONTINUED = "    "
"""How much further than its line a wrapped line's continuation is indented."""
_UNIT_AFTER_NUMBER = re.compile(r"(?<=\d) (?=[^\s\d=×+−\-/(·])")
"""The space between a number and the word after it ("3600 N", "-37.7 %"), kept on one line."""
_GLUE = "\u00a0"  # textwrap breaks only at ASCII whitespace
_NEW_LINE_OF_NOTES = re.compile(r"\s|[-*•] |\d+[.)] ")
"""A typed line that begins a line of its own: indented, or an item of a list."""


def fitted(line: str, width: int = TEXT_WIDTH, hanging: str = CONTINUED) -> list[str]:
    """``line`` wrapped between words to ``width`` columns, its continuations indented
    ``hanging`` past its own indent (none for prose a person typed, which is read as written);
    a word longer than a line is broken (only a line that cannot fit otherwise)."""
    if len(line) <= width:
        return [line]
    indent = line[:len(line) - len(line.lstrip())]
    glued = _UNIT_AFTER_NUMBER.sub(_GLUE, line.strip())
    return [piece.replace(_GLUE, " ") for piece in textwrap.wrap(
        glued, width, initial_indent=indent, subsequent_indent=indent + hanging,
        break_on_hyphens=False)]


def table_lines(table: Table, indent: str = "  ", rule: bool = False,
                width: int | None = None) -> list[str]:
    """The table's rows (after its header, if it has one) padded into aligned columns, numeric
    columns to the right; ``rule`` draws a line of dashes under the header.  Given a ``width``
    the table does not fit, it is written row by row instead (:func:`_row_by_row`); a table
    without a header (label and value) only in its rows that do not fit."""
    rows = ([table.header] if table.header else []) + list(table.rows)
    widths = [max(len(row[i]) for row in rows) for i in range(len(rows[0]))]
    right = table.numeric or (False,) * len(widths)

    def line(cells: Sequence[str]) -> str:
        return indent + "  ".join(c.rjust(w) if r else c.ljust(w)
                                  for c, w, r in zip(cells, widths, right)).rstrip()

    lines = [line(row) for row in rows]
    if width is not None and any(len(text) > width for text in lines):
        if table.header:
            return _row_by_row(table, indent, width)
        return [piece for row, text in zip(rows, lines)
                for piece in ([text] if len(text) <= width else _row_by_row(
                    Table((), (row,)), indent, width))]
    if rule and table.header:
        lines.insert(1, line(["-" * w for w in widths]))
    return lines


def _row_by_row(table: Table, indent: str, width: int) -> list[str]:
    """A table too wide for ``width``: each row's first cell on a line, then its other cells,
    each after its column's heading ("P (N) 3600 · Lnm (h) 35671"), wrapped under it."""
    headings = table.header or ("",) * len(table.rows[0])
    lines: list[str] = []
    for row in table.rows:
        lines += fitted(indent + row[0], width)
        cells = (f"{heading} {cell}".strip() for heading, cell in zip(headings[1:], row[1:]))
        lines += fitted(indent + CONTINUED + " · ".join(cell for cell in cells if cell), width)
    return lines


def step_lines(derivation: Derivation, indent: str = "  ", width: int | None = None) -> list[str]:
    """Numbered steps: symbol, label and source, then formula = numbers = result, notes, warnings.
    Given a ``width`` the first line does not fit, the source goes on a line of its own."""
    lines: list[str] = []
    for index, step in enumerate(derivation.steps, start=1):
        head = f"{indent}{index:2d}. {step.symbol}  {step.label}"
        if width is not None and len(f"{head}  [{step.source}]") > width:
            lines += [head, f"{indent}    [{step.source}]"]
        else:
            lines.append(f"{head}  [{step.source}]")
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


def _sensitivity_lines(section: SensitivitySection, indent: str = "",
                       width: int | None = None) -> list[str]:
    table_width = None if width is None else width - len(indent)
    lines = [section.heading, *table_lines(section.table, indent="", rule=True, width=table_width)]
    if section.notes:
        lines += ["", "Notes:", *(f"  - {label}: {note}" for label, note in section.notes)]
    return [f"{indent}{line}" for line in lines]


def _underlined(heading: str, mark: str) -> list[str]:
    """``heading`` (wrapped to the page) over a line of ``mark`` as long as its longest line."""
    lines = fitted(heading, hanging="")
    return [*lines, mark * max(len(line) for line in lines)]


def _typed(text: str, indent: str = "") -> list[str]:
    """Text a person typed (notes) wrapped to the page as paragraphs: a line goes on from the
    one before unless that was blank, or it is indented or an item of a list."""
    paragraphs: list[str] = []
    joins = False
    for line in text.strip().splitlines():
        if joins and line.strip() and not _NEW_LINE_OF_NOTES.match(line):
            paragraphs[-1] += " " + line.strip()
        else:
            paragraphs.append(line.rstrip())
        joins = bool(line.strip())
    return [piece for paragraph in paragraphs for piece in fitted(indent + paragraph, hanging="")]


def _case(case: CaseSection) -> list[str]:
    bearing = case.bearing
    lines = [*_underlined(f"Case {case.number}: {case.name}", "-"), f"Bearing: {bearing.line}"]
    if case.static_only:
        lines.append("Static check only: judged on s0; its life is shown for completeness.")
    if bearing.notes:
        lines += _typed(bearing.notes, "  ")
    if case.generated_note is not None:
        lines.append(case.generated_note)
    elif case.notes:
        lines += ["Notes:", *_typed(case.notes, "  ")]
    if case.inputs:
        lines += ["Inputs as typed:",
                  *table_lines(Table((), tuple((i.label, i.text) for i in case.inputs)),
                               width=TEXT_WIDTH)]
    if case.derivation is None:
        return lines + [f"ERROR: {case.error}", ""]
    d = case.derivation
    lines.append("Results:")
    lines += table_lines(Table((), tuple((r.symbol, r.label, with_unit(number_text(r.value), r.unit))
                                         for r in case.results)), width=TEXT_WIDTH)
    lines += ["Derivation:", *step_lines(d, width=TEXT_WIDTH), "Warnings:" if d.warnings else "Warnings: none"]
    lines += [f"  - {w}" for w in d.warnings]
    lines += ["Targets:", *(f"  {verdict}" for verdict in case.verdicts), ""]
    if case.sensitivity is not None:
        lines += [*_sensitivity_lines(case.sensitivity, indent="  ", width=TEXT_WIDTH), ""]
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
        lines += step_lines(state.derivation, indent="    ", width=TEXT_WIDTH)
        if state.load_table is not None:
            lines += ["  Bearing loads:",
                      *table_lines(state.load_table, indent="    ", width=TEXT_WIDTH)]
    if shaft.system_line is not None:
        lines.append(shaft.system_line)
    if shaft.system is not None:
        lines += step_lines(shaft.system.derivation, indent="    ", width=TEXT_WIDTH)
    return lines + [""]


def _duty(duty: DutySection) -> list[str]:
    """The states' shares, lives and damage, then the Miner life."""
    lines = [*_underlined(f"Cycle {duty.number}: {duty.title}", "~"), duty.description]
    if duty.table is not None and duty.derivation is not None:
        lines += table_lines(duty.table, width=TEXT_WIDTH)
        lines += ["Palmgren–Miner summation:",
                  *step_lines(duty.derivation, indent="    ", width=TEXT_WIDTH)]
    return lines + [duty.life_line, ""]


def render(report: Report) -> str:
    """The report as plain text."""
    meta = report.meta
    lines = _underlined(f"Design review: {meta.title}", "=")
    lines += table_lines(Table((), tuple((f"{label}:", value) for label, value in meta.facts)),
                         indent="", width=TEXT_WIDTH)
    if meta.notes.strip():
        lines += ["", *_typed(meta.notes)]
    lines += ["", report.units_note, "", *_underlined("Bearings", "-")]
    lines += (table_lines(report.bearing_table, width=TEXT_WIDTH) if report.bearings
              else ["  (no bearings)"])
    lines += ["", *_underlined("Summary", "-")]
    lines += (table_lines(report.summary, width=TEXT_WIDTH) if report.cases
              else ["  (no load cases)"])
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
    return "\n".join(piece for line in lines for piece in fitted(line)) + "\n"
