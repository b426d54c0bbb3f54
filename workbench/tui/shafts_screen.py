"""The shafts and duty cycles of the session, worked out: read-only (the session file edits them).

For each ``[[shafts]]`` table: where its two bearings sit, a table of its gears and pulleys as
typed, a table of its operating states with the bearing loads Fr and Fa, and under it the
highlighted state's free-body derivation (gear-force relations, shaft statics ΣF = 0 and ΣM = 0,
the two-bearing thrust-sharing rule for a pair) drawn step by step the way the derivation pane
draws a case; then the series system life of the two bearings (Weibull).  Last, a table per
duty cycle: each state's share, life and share of the Palmgren–Miner damage.  Everything comes
from :func:`workbench.model.analysis.analyse`.
"""

from __future__ import annotations

import math
from collections.abc import Callable

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import VerticalScroll
from textual.content import Content
from textual.widgets import DataTable, Label, Static

from ..engine.pairs import SIDES
from ..engine.record import fmt, with_unit
from ..model.analysis import DutyOutcome, SessionAnalysis, ShaftOutcome, StateOutcome
from ..model.quantities import format_quantity
from ..model.shafts import KIND_WORDS, Element, state_words
from ..model.user_text import sentence
from .derivation_pane import step_content
from .dialogs import OnceModal
from .table_fit import fill_fitted, plain

READ_ONLY_NOTE = ("An overview: alt+h edits a shaft and alt+y a duty cycle on the main screen. "
                  "The cases the shafts generate are in the case list.")
NO_SHAFTS = "This session has no shaft: a [[shafts]] table in the session file adds one."
NO_DUTIES = "This session has no duty cycle."
SHAFTS_HINT = ("tab / shift+tab: next / previous table · ↑/↓ in the states: that state's free "
               "body · pgup/pgdn, ctrl+home/ctrl+end: scroll · escape: close")
# The element texts worth showing, in plain words (blank texts are left out).
ELEMENT_WORDS = (("pressure_angle", "pressure angle"), ("helix_angle", "helix angle"),
                 ("hand", "hand"), ("pitch_cone_angle", "pitch-cone angle"), ("apex", "apex"),
                 ("mesh_angle", "towards"), ("driving", "driving"),
                 ("pull_factor", "pull factor"), ("share", "torque share"))
ELEMENT_HEADINGS = ("Element", "Kind", "At", "Diameter", "Also")
STATE_HEADINGS = ("State", "Fr A", "Fa A", "Fr B", "Fa B")
DUTY_HEADINGS = ("Share", "Life 10⁶ rev", "Damage %", "Case")


def element_row(element: Element) -> list[str]:
    """One gear or pulley as typed: name, kind, position, diameter, its other non-blank values."""
    others = ", ".join(f"{words} {getattr(element, name)}" for name, words in ELEMENT_WORDS
                       if getattr(element, name).strip())
    return [element.name, KIND_WORDS.get(element.kind, element.kind), element.position or "—",
            element.diameter or "—", others or "—"]


def _force(value: float, system: str) -> str:
    if not math.isfinite(value):
        return "undefined"
    return format_quantity(value, "force", system)  # type: ignore[arg-type]


def _hours(value: float, system: str) -> str:
    return format_quantity(value, "time", system) if math.isfinite(value) else "∞"  # type: ignore[arg-type]


def state_row(state: StateOutcome, system: str) -> list[str]:
    """One operating state: its name and the bearing loads (✘ where it could not be solved)."""
    if state.solution is None:
        return [state.state.name, "✘", "✘", "✘", "✘"]
    loads = state.solution.bearing_loads
    return [state.state.name, *(_force(value, system) for side in SIDES for value in loads[side])]


def free_body(state: StateOutcome, system: str, in_words: Callable[[str], str] = str) -> Content:
    """What a state asks (power or torque, speed, share) and its free body, step by step;
    ``in_words`` says an error's key (see :func:`~workbench.tui.shaft_editor.session_in_words`)."""
    given = state.state.power or state.state.torque
    lines = [Content.styled(f"{sentence(state_words(state.state.name))}: {given} at {state.state.speed}, time "
                            f"share {state.state.share}", "bold $text-primary")]
    if state.solution is None:
        lines.append(Content.styled(f"✘ {in_words(state.error or '')}", "bold $text-error"))
    else:
        for step in state.solution.derivation.steps:
            lines.extend(step_content(step, system))
    return Content("\n").join(lines)


def system_life(outcome: ShaftOutcome, system: str, in_words: Callable[[str], str] = str) -> Content:
    """The series life of the shaft's two bearings, or why there is none."""
    if outcome.system is None:
        return Content.styled(f"✘ System life: {in_words(outcome.system_error or '')}",
                              "bold $text-error")
    result = outcome.system
    return Content.assemble("System life of both bearings (in series): ",
                            (_hours(result.life_h, system), "bold"),
                            f" ({with_unit(fmt(result.life_mrev), '10⁶ rev')}) at R = {fmt(result.reliability, 3)}")


def duty_life(duty: DutyOutcome, system: str, in_words: Callable[[str], str] = str) -> Content:
    """A duty cycle's bearing and Palmgren–Miner life, or why there is none."""
    if duty.result is None:
        return Content.styled(f"✘ {in_words(duty.error or '')}", "bold $text-error")
    result = duty.result
    return Content.assemble(f"Bearing {result.bearing}: Miner life ",
                            (_hours(result.life_h, system), "bold"),
                            f" ({with_unit(fmt(result.life_mrev), '10⁶ rev')}) at R = {fmt(result.reliability, 3)}")


def duty_rows(duty: DutyOutcome) -> list[list[str]]:
    """Each state of a worked-out duty cycle: its share as typed, life, damage share, case."""
    if duty.result is None:
        return []
    result = duty.result
    return [[share, fmt(life), f"{100.0 * damage:.1f}", case_result.case.name]
            for (_, share), life, damage, case_result in zip(
                result.cycle.states, result.lives_mrev, result.damage_shares, result.case_results)]


class ShaftsScreen(OnceModal[None]):
    """Shafts, their bearing loads and free bodies, system lives and duty cycles; escape closes."""

    DEFAULT_CSS = """
    ShaftsScreen {
        #shafts-view { scrollbar-size-vertical: 1; }
        .section-title { color: $text-accent; text-style: bold; margin-top: 1; width: 100%; }
        .subtitle { text-style: bold; width: 100%; }
        DataTable { height: auto; max-height: 12; margin-bottom: 1; }
        .free-body { width: 100%; margin-bottom: 1; }
        Static { width: 100%; }
    }
    """

    BINDINGS = [
        Binding("escape,q", "dismiss_none", "Close", id="shafts.close"),
        # Before the focused table's own page keys: the tables are short (at most 12 rows on
        # show), the overview is long, and a page key in a table left it where it was.
        Binding("pagedown", "scroll_overview('page_down')", "Page down", show=False,
                priority=True),
        Binding("pageup", "scroll_overview('page_up')", "Page up", show=False, priority=True),
        Binding("ctrl+end", "scroll_overview('scroll_end')", "End", show=False, priority=True),
        Binding("ctrl+home", "scroll_overview('scroll_home')", "Top", show=False,
                priority=True),
    ]

    def __init__(self, analysis: SessionAnalysis, system: str, *,
                 in_words: Callable[[str], str] = str) -> None:
        """``in_words`` says an error's key in words (the screen passes
        :func:`~workbench.tui.shaft_editor.session_in_words`); as it is by default."""
        super().__init__()
        self.analysis = analysis
        self.system = system
        self.in_words = in_words

    def compose(self) -> ComposeResult:
        """Title, the read-only note, each shaft, each duty cycle, the keys."""
        with VerticalScroll(classes="dialog-box screen-box", id="shafts-view"):
            yield Label("Shafts and duty cycles", classes="dialog-title")
            yield Static(Content(READ_ONLY_NOTE), classes="dialog-hint")
            for n, outcome in enumerate(self.analysis.shafts):
                yield from self._shaft(n, outcome)
            if not self.analysis.shafts:
                yield Static(Content(NO_SHAFTS))
            yield Label("Duty cycles (Palmgren–Miner)", classes="section-title")
            for n, duty in enumerate(self.analysis.duties):
                yield Label(Content(duty.name or duty.key), classes="subtitle")
                yield Static(duty_life(duty, self.system, self.in_words))
                if duty.result is not None:
                    yield DataTable(id=f"duty-{n}", cursor_type="row", zebra_stripes=True)
            if not self.analysis.duties:
                yield Static(Content(NO_DUTIES))
            yield Static(Content(SHAFTS_HINT), classes="dialog-hint")

    def _shaft(self, n: int, outcome: ShaftOutcome) -> ComposeResult:
        yield Label(Content(f"Shaft {outcome.name or outcome.key}"), classes="section-title")
        shaft = outcome.shaft
        if shaft is None:
            yield Static(Content.styled(f"✘ {self.in_words(outcome.error or '')}",
                                        "bold $text-error"))
            return
        yield Static(Content(
            f"A = {shaft.bearing_a} at {shaft.position_a}, B = {shaft.bearing_b} at "
            f"{shaft.position_b}; locating: {shaft.locating}"
            + (f" ({shaft.mounting})" if shaft.mounting else "")))
        yield DataTable(id=f"shaft-{n}-elements", cursor_type="row", zebra_stripes=True)
        if outcome.error is not None:
            yield Static(Content.styled(f"✘ {self.in_words(outcome.error)}", "bold $text-error"))
        if outcome.states:
            yield DataTable(id=f"shaft-{n}-states", cursor_type="row", zebra_stripes=True)
            yield Static(id=f"shaft-{n}-free-body", classes="free-body")
        yield Static(system_life(outcome, self.system, self.in_words))

    def action_scroll_overview(self, how: str) -> None:
        """Scroll the overview a page up or down, or to its top or end."""
        view = self.query_one("#shafts-view", VerticalScroll)
        {"page_down": view.scroll_page_down, "page_up": view.scroll_page_up,
         "scroll_end": view.scroll_end, "scroll_home": view.scroll_home}[how](animate=False)

    def on_mount(self) -> None:
        """Fill the tables and put the focus in the first one."""
        for n, outcome in enumerate(self.analysis.shafts):
            if not outcome.states or outcome.shaft is None:
                continue
            states = self.query_one(f"#shaft-{n}-states", DataTable)
            states.add_columns(*STATE_HEADINGS)
            for k, state in enumerate(outcome.states):
                states.add_row(*plain(state_row(state, self.system)), key=str(k))
            self._show_free_body(n, 0)
        self._fit_tables()
        tables = self.query(DataTable)
        if tables:
            tables.first().focus()
        else:
            self.query_one("#shafts-view").focus()

    def _fit_tables(self) -> None:
        """The tables whose last column wraps, filled for the width on show."""
        width = self.query_one("#shafts-view").scrollable_content_region.width or (
            self.app.size.width - 5)
        for n, outcome in enumerate(self.analysis.shafts):
            if outcome.shaft is not None:
                fill_fitted(self.query_one(f"#shaft-{n}-elements", DataTable), ELEMENT_HEADINGS,
                            [element_row(element) for element in outcome.shaft.elements], width)
        for n, duty in enumerate(self.analysis.duties):
            if duty.result is not None:
                fill_fitted(self.query_one(f"#duty-{n}", DataTable), DUTY_HEADINGS,
                            duty_rows(duty), width)

    def on_resize(self) -> None:
        """Wrap the tables again for the new width, once it is laid out."""
        self.call_after_refresh(self._fit_tables)

    def _show_free_body(self, n: int, row: int) -> None:
        states = self.analysis.shafts[n].states
        if 0 <= row < len(states):
            self.query_one(f"#shaft-{n}-free-body", Static).update(
                free_body(states[row], self.system, self.in_words))

    @on(DataTable.RowHighlighted)
    def _state_highlighted(self, event: DataTable.RowHighlighted) -> None:
        """The highlighted state's free body under the states."""
        event.stop()
        table_id = event.data_table.id or ""
        if table_id.startswith("shaft-") and table_id.endswith("-states"):
            self._show_free_body(int(table_id.split("-")[1]), event.cursor_row)
