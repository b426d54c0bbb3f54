"""The shafts and duty cycles of the session, worked out: read-only (the session file edits them).

For each ``[[shafts]]`` table: the bearings and where they sit, the gears and pulleys as typed,
and for each operating state the bearing loads Fr and Fa with the free-body derivation (gear-force
relations, shaft statics ΣF = 0 and ΣM = 0, the two-bearing thrust-sharing rule for a pair)
drawn step by step the way the derivation pane draws a case; then the series system life of the
two bearings (Weibull).  Last, each duty cycle's Palmgren–Miner life and each state's share of
the damage.  Everything comes from :func:`workbench.model.analysis.analyse`.
"""

from __future__ import annotations

import math

from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import VerticalScroll
from textual.content import Content
from textual.widgets import Label, Static

from ..engine.record import fmt
from ..model.analysis import SessionAnalysis, ShaftOutcome, StateOutcome
from ..model.quantities import format_quantity
from ..model.shafts import KIND_WORDS, SIDES, Element
from .derivation_pane import step_content
from .dialogs import OnceModal
from .whatif_pane import duty_lines

READ_ONLY_NOTE = ("Read-only here: edit [[shafts]] and [[duty_cycles]] in the session file, then "
                  "open it again. The cases the shafts generate are in the case list.")
NO_SHAFTS = "This session has no shaft: a [[shafts]] table in the session file adds one."
NO_DUTIES = "This session has no duty cycle."
# The element texts worth showing, in plain words (blank texts are left out).
ELEMENT_WORDS = (("position", "at"), ("diameter", "diameter"),
                 ("pressure_angle", "pressure angle"), ("helix_angle", "helix angle"),
                 ("hand", "hand"), ("pitch_cone_angle", "pitch-cone angle"), ("apex", "apex"),
                 ("mesh_angle", "towards"), ("driving", "driving"),
                 ("pull_factor", "pull factor"), ("share", "torque share"))
ERROR_STYLE = "bold $text-error on $error-muted"


def element_text(element: Element) -> str:
    """One gear or pulley as typed: name, kind and its non-blank values."""
    kind = KIND_WORDS.get(element.kind, element.kind)
    values = ", ".join(f"{words} {getattr(element, name)}" for name, words in ELEMENT_WORDS
                       if getattr(element, name).strip())
    return f"  {element.name}: {kind}" + (f", {values}" if values else "")


def _force(value: float, system: str) -> str:
    if not math.isfinite(value):
        return "undefined"
    return format_quantity(value, "force", system)  # type: ignore[arg-type]


def _state_lines(outcome: ShaftOutcome, state: StateOutcome, system: str) -> list[Content]:
    given = state.state.power or state.state.torque
    lines = [Content(""), Content.styled(
        f"State {state.state.name}: {given}, {state.state.speed}, time share {state.state.share}",
        "bold $text-primary")]
    if state.solution is None:
        lines.append(Content.styled(f"✘ {state.error}", ERROR_STYLE))
        return lines
    solution = state.solution
    for side in SIDES:
        bearing = getattr(outcome.shaft, f"bearing_{side.lower()}")
        fr, fa = solution.bearing_loads[side]
        lines.append(Content.assemble(f"  {side} {bearing}: Fr = ", (_force(fr, system), "bold"),
                                      "  Fa = ", (_force(fa, system), "bold")))
    lines.append(Content.styled("  Free body:", "italic"))
    for step in solution.derivation.steps:
        lines.extend(Content("    ") + line for line in step_content(step, system))
    return lines


def shaft_lines(outcome: ShaftOutcome, system: str) -> list[Content]:
    """One shaft: bearings, elements, each state's bearing loads and free body, system life."""
    lines = [Content.styled(f"Shaft {outcome.name or outcome.key}", "bold $text-accent")]
    shaft = outcome.shaft
    if shaft is None:
        lines.append(Content.styled(f"✘ {outcome.error}", ERROR_STYLE))
        return lines
    lines.append(Content(f"  A {shaft.bearing_a} at {shaft.position_a} · B {shaft.bearing_b} at "
                         f"{shaft.position_b} · locating {shaft.locating}"
                         + (f" ({shaft.mounting})" if shaft.mounting else "")))
    lines.append(Content("  Gears and pulleys:"))
    lines.extend(Content(element_text(element)) for element in shaft.elements)
    if outcome.error is not None:
        lines.append(Content.styled(f"✘ {outcome.error}", ERROR_STYLE))
    for state in outcome.states:
        lines.extend(_state_lines(outcome, state, system))
    lines.append(Content(""))
    if outcome.system is not None:
        system_life = outcome.system
        hours = (format_quantity(system_life.life_h, "time", system)  # type: ignore[arg-type]
                 if math.isfinite(system_life.life_h) else "∞")
        lines.append(Content.assemble(
            "System life of both bearings (in series): ", (hours, "bold"),
            f" ({fmt(system_life.life_mrev)} 10⁶ rev) at R = {fmt(system_life.reliability, 3)}"))
    else:
        lines.append(Content.styled(f"✘ System life: {outcome.system_error}", ERROR_STYLE))
    return lines


def analysis_content(analysis: SessionAnalysis, system: str) -> Content:
    """Every shaft, then every duty cycle, as one block of lines."""
    lines: list[Content] = []
    for outcome in analysis.shafts:
        lines.extend(shaft_lines(outcome, system))
        lines.append(Content(""))
    if not analysis.shafts:
        lines += [Content(NO_SHAFTS), Content("")]
    lines.append(Content.styled("Duty cycles (Palmgren–Miner)", "bold $text-accent"))
    lines.extend(duty_lines(analysis.duties, system) or [Content(NO_DUTIES)])
    return Content("\n").join(lines)


class ShaftsScreen(OnceModal[None]):
    """Shafts, their bearing loads and free bodies, system lives and duty cycles; escape closes."""

    BINDINGS = [Binding("escape,q", "dismiss_none", "Close", id="shafts.close")]

    def __init__(self, analysis: SessionAnalysis, system: str) -> None:
        super().__init__()
        self.analysis = analysis
        self.system = system

    @property
    def text(self) -> str:
        """What the screen shows, as plain text."""
        return READ_ONLY_NOTE + "\n" + analysis_content(self.analysis, self.system).plain

    def compose(self) -> ComposeResult:
        """Title, the read-only note, and the worked-out shafts and duty cycles (scrolling)."""
        with VerticalScroll(classes="dialog-box selection-box", id="shafts-view"):
            yield Label("Shafts and duty cycles", classes="dialog-title")
            yield Static(Content(READ_ONLY_NOTE), classes="dialog-hint")
            yield Static(analysis_content(self.analysis, self.system), id="shafts-text")
            yield Static("up/down, page up/down: scroll · escape: close", classes="dialog-hint")

    def on_mount(self) -> None:
        """Let the arrow keys scroll at once."""
        self.query_one("#shafts-view").focus()
