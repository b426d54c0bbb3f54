"""html: the report document as one self-contained page that prints cleanly to PDF.

One file: the style sheet is inline, the figures are inline SVG (drawn by matplotlib through
:mod:`.plot_svg`), nothing is fetched and no script runs. Print rules start each case on a new
page, keep table rows and figures whole, and print black on white. Every piece of user text
(titles, names, notes, designations, typed values) is escaped by
:func:`workbench.model.user_text.html_text`.

Figures: per case, Lnm against a scale on its loads with the e switch marked
(:func:`~workbench.engine.curves.life_curve`) and aISO against κ
(:func:`~workbench.engine.curves.aiso_curve`); per shaft, its bearing loads in each state; per
duty cycle, each state's share of time and of damage (Palmgren–Miner).
"""

from __future__ import annotations

import math
from typing import Sequence

from ..engine.curves import aiso_curve, life_curve
from ..engine.record import Derivation, InputError
from ..model.user_text import html_text as _e
from .contents import (
    CaseSection, DutySection, Report, ShaftSection, Table, input_table, result_table, step_table,
)
from .plot_svg import aiso_svg, life_svg, shaft_loads_svg, shares_svg  # matplotlib: when drawn

PLOTTED_CASES = 40  # cases past this many get no figures: a large session's page stays usable

STYLE = """
:root { --ink: #1a1a1a; --muted: #555; --rule: #b8b8b8; --soft: #f3f3f1; }
* { box-sizing: border-box; }
body { margin: 0 auto; max-width: 60rem; padding: 1.5rem 2rem 3rem; color: var(--ink);
       background: #fff; font: 10.5pt/1.45 "DejaVu Sans", "Helvetica Neue", Arial, sans-serif; }
h1 { font-size: 1.55rem; margin: 0 0 .6rem; }
h2 { font-size: 1.2rem; margin: 2rem 0 .5rem; padding-bottom: .2rem;
     border-bottom: 2px solid var(--ink); }
h3 { font-size: 1rem; margin: 1.2rem 0 .4rem; }
h4 { font-size: .95rem; margin: 1rem 0 .3rem; color: var(--muted); }
p { margin: .35rem 0; }
table { border-collapse: collapse; margin: .4rem 0 .8rem; font-size: 9pt; }
th, td { border: 1px solid var(--rule); padding: .15rem .45rem; text-align: left;
         vertical-align: top; }
th { background: var(--soft); font-weight: 600; }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
table.facts td:first-child { width: 11rem; font-weight: 600; }
table.steps td:nth-child(4), table.steps td:nth-child(5) { font-family: "DejaVu Sans Mono",
    Menlo, Consolas, monospace; font-size: 8.5pt; }
.caution { border: 2px solid var(--ink); padding: .6rem .8rem; margin: .8rem 0 1rem;
           font-weight: 600; }
.caution strong { text-transform: uppercase; letter-spacing: .04em; }
.note { color: var(--muted); font-style: italic; }
.error { border-left: 4px solid var(--ink); padding-left: .5rem; font-weight: 600; }
.verdicts li { margin: .15rem 0; }
.static-only { display: inline-block; border: 1px solid var(--ink); padding: 0 .4rem;
               font-size: 9pt; font-weight: 600; }
figure { margin: .6rem 0 1rem; }
figure svg { width: 100%; max-width: 40rem; height: auto; display: block; }
figcaption { font-size: 9pt; color: var(--muted); }
.figures { display: grid; grid-template-columns: repeat(auto-fit, minmax(22rem, 1fr));
           gap: .5rem 1.5rem; }
@page { size: A4; margin: 16mm 14mm; }
@media print {
  body { max-width: none; padding: 0; font-size: 9.5pt; }
  section.case, section.shafts, section.duties { break-before: page; }
  table, figure, .caution { break-inside: avoid; }
  tr, li { break-inside: avoid; }
  h2, h3, h4 { break-after: avoid; }
  th { background: none; }
}
"""


def _cells(cells: Sequence[str], numeric: Sequence[bool], tag: str) -> str:
    return "".join(f'<{tag} class="num">{_e(c)}</{tag}>' if right else f"<{tag}>{_e(c)}</{tag}>"
                   for c, right in zip(cells, numeric))


def _table(table: Table, css: str = "") -> str:
    """A ``Table`` as an html table, every cell escaped."""
    width = len(table.header) if table.header else len(table.rows[0]) if table.rows else 0
    numeric = table.numeric or (False,) * width
    head = f"<thead><tr>{_cells(table.header, (False,) * width, 'th')}</tr></thead>" \
        if table.header else ""
    body = "".join(f"<tr>{_cells(row, numeric, 'td')}</tr>" for row in table.rows)
    classes = f' class="{css}"' if css else ""
    return f"<table{classes}>{head}<tbody>{body}</tbody></table>"


def _steps(derivation: Derivation) -> str:
    return _table(step_table(derivation), "steps")


def _paragraphs(text: str, css: str = "") -> str:
    classes = f' class="{css}"' if css else ""
    return "".join(f"<p{classes}>{_e(block)}</p>" for block in text.strip().split("\n\n") if block)


def _figure(svg: str, caption: str) -> str:
    return f"<figure>{svg}<figcaption>{_e(caption)}</figcaption></figure>"


def _case_figures(case: CaseSection) -> str:
    """Lnm against the load scale (e switch marked) and aISO against κ, when the case has them."""
    inputs = case.engine_inputs
    if inputs is None or case.derivation is None:
        return ""
    figures = []
    try:
        life = life_curve(inputs, case.life_target_h)
        aiso = aiso_curve(inputs)
    except InputError:
        return ""
    if len(life.x) > 1:
        figures.append(_figure(life_svg(life, f"c{case.number}l-"),
                               f"Case {case.number}: Lnm against one scale on Fr and Fa "
                               "(ISO 281:2007); dashed: the Fa/Fr e switch; ring: this case."))
    if aiso is not None:
        figures.append(_figure(aiso_svg(aiso, f"c{case.number}a-"),
                               f"Case {case.number}: aISO against κ (ISO 281:2007 §9.3.2); "
                               "ring: this case."))
    return f'<div class="figures">{"".join(figures)}</div>' if figures else ""


def _case(case: CaseSection, with_figures: bool) -> str:
    parts = [f'<section class="case" id="case-{case.number}">',
             f"<h2>Case {case.number}: {_e(case.name)}</h2>",
             f"<p><strong>Bearing:</strong> {_e(case.bearing.line)}</p>"]
    if case.bearing.notes:
        parts.append(_paragraphs(case.bearing.notes, "note"))
    if case.static_only:
        parts.append('<p><span class="static-only">Static check only</span> judged on s0; its '
                     "life is shown for completeness.</p>")
    if case.generated_note is not None:
        parts.append(f'<p class="note">{_e(case.generated_note)}.</p>')
    elif case.notes.strip():
        parts.append(_paragraphs(case.notes))
    if case.inputs:
        parts += ["<h3>Inputs as typed</h3>", _table(input_table(case))]
    if case.derivation is None:
        parts.append(f'<p class="error">Error: {_e(case.error or "")}</p></section>')
        return "".join(parts)
    d = case.derivation
    parts += ["<h3>Results</h3>", _table(result_table(case))]
    parts += ["<h3>Targets</h3>", '<ul class="verdicts">',
              *(f"<li>{_e(verdict)}</li>" for verdict in case.verdicts), "</ul>"]
    if with_figures:
        parts.append(_case_figures(case))
    parts += ["<h3>Derivation</h3>", _steps(d), "<h3>Warnings</h3>"]
    parts.append("<ul>" + "".join(f"<li>{_e(w)}</li>" for w in d.warnings) + "</ul>"
                 if d.warnings else "<p>None.</p>")
    if case.sensitivity is not None:
        section = case.sensitivity
        parts += ["<h3>Sensitivity</h3>", f"<p>{_e(section.heading)}</p>",
                  _table(section.table)]
        parts += [f"<p class=\"note\">{_e(label)}: {_e(note)}</p>" for label, note in
                  section.notes]
    return "".join(parts) + "</section>"


def _shaft_figure(shaft: ShaftSection) -> str:
    """The bearing loads of each solved state, grouped by state."""
    solved = [state for state in shaft.states if state.loads]
    if not solved:
        return ""
    loads: dict[str, list[float]] = {}
    for state in solved:
        for load in state.loads:
            loads.setdefault(f"Fr {load.side}", []).append(load.fr)
            loads.setdefault(f"Fa {load.side}", []).append(load.fa)
    svg = shaft_loads_svg([state.name for state in solved], loads, f"s{shaft.number}-")
    return _figure(svg, f"Shaft {shaft.number}: bearing loads in each state (A and B as in the "
                        "free body).")


def _shaft(shaft: ShaftSection) -> str:
    parts = [f"<h3>Shaft {shaft.number}: {_e(shaft.title)}</h3>", f"<p>{_e(shaft.description)}</p>"]
    if shaft.error is not None:
        parts.append(f'<p class="error">Error: {_e(shaft.error)}</p>')
    parts.append(_shaft_figure(shaft))
    for state in shaft.states:
        parts.append(f"<h4>{_e(state.heading)}</h4>")
        if state.derivation is None:
            parts.append(f'<p class="error">Error: {_e(state.error or "")}</p>')
            continue
        if state.load_table is not None:
            parts.append(_table(state.load_table))
        parts += ["<p>Free body: mesh and belt forces, reactions, thrust.</p>",
                  _steps(state.derivation)]
    if shaft.system_line is not None:
        parts.append(f"<p><strong>{_e(shaft.system_line)}</strong></p>")
    if shaft.system is not None:
        parts.append(_steps(shaft.system.derivation))
    return "".join(parts)


def _duty_figure(duty: DutySection) -> str:
    states = [s for s in duty.states if s.time_share is not None and s.damage_share is not None
              and math.isfinite(s.damage_share)]
    if not states:
        return ""
    svg = shares_svg([s.case for s in states], [s.time_share or 0.0 for s in states],
                     [s.damage_share or 0.0 for s in states], f"d{duty.number}-")
    return _figure(svg, f"Cycle {duty.number}: each state's share of the time and of the damage "
                        "(Palmgren–Miner).")


def _duty(duty: DutySection) -> str:
    parts = [f"<h3>Cycle {duty.number}: {_e(duty.title)}</h3>", f"<p>{_e(duty.description)}</p>"]
    if duty.table is not None and duty.derivation is not None:
        parts += [_table(duty.table), _duty_figure(duty),
                  "<p>Palmgren–Miner summation:</p>", _steps(duty.derivation)]
    return "".join(parts) + f"<p><strong>{_e(duty.life_line)}</strong></p>"


def _caution(text: str) -> str:
    return f'<div class="caution" role="note"><strong>Caution.</strong> {_e(text)}</div>'


def render(report: Report) -> str:
    """The report as one self-contained html page."""
    meta = report.meta
    title = f"Design review: {meta.title}"
    parts = ["<!DOCTYPE html>", '<html lang="en">', "<head>", '<meta charset="utf-8">',
             '<meta name="viewport" content="width=device-width, initial-scale=1">',
             f'<meta name="generator" content="bearing-workbench {_e(meta.tool_version)}">',
             f"<title>{_e(title)}</title>", f"<style>{STYLE}</style>", "</head>", "<body>",
             "<header>", f"<h1>{_e(title)}</h1>", _caution(report.caution),
             _table(Table((), meta.facts), "facts")]
    if meta.notes.strip():
        parts.append(_paragraphs(meta.notes))
    parts += ["</header>", f'<p class="note">{_e(report.units_note)}</p>',
              "<section><h2>Bearings</h2>",
              _table(report.bearing_table) if report.bearings else "<p>No bearings.</p>",
              "</section>", "<section><h2>Summary</h2>",
              _table(report.summary) if report.cases else "<p>No load cases.</p>"]
    if report.generated_legend:
        parts.append(f'<p class="note">{_e(report.generated_legend)}</p>')
    if report.sensitivity_note:
        parts.append(f'<p class="note">{_e(report.sensitivity_note)}</p>')
    if len(report.cases) > PLOTTED_CASES:
        parts.append(f'<p class="note">Figures are drawn for the first {PLOTTED_CASES} cases.</p>')
    parts.append("</section>")
    parts += [_case(case, case.number <= PLOTTED_CASES) for case in report.cases]
    if report.shafts:
        parts += ['<section class="shafts"><h2>Shafts</h2>',
                  *(_shaft(shaft) for shaft in report.shafts), "</section>"]
    if report.duties:
        parts += ['<section class="duties"><h2>Duty cycles</h2>',
                  *(_duty(duty) for duty in report.duties), "</section>"]
    if report.solver is not None:
        parts += ["<section><h2>Solver</h2><ul>",
                  *(f"<li>{_e(line)}</li>" for line in report.solver.lines), "</ul>"]
        if report.solver.step_line is not None:
            parts.append(f"<p>{_e(report.solver.step_line)}</p>")
        parts.append("</section>")
    parts += ["<section><h2>Sources</h2><ul>", *(f"<li>{_e(s)}</li>" for s in report.sources),
              "</ul></section>", "<section><h2>Caution</h2>", _caution(report.caution),
              "</section>", "</body>", "</html>"]
    return "\n".join(parts) + "\n"
