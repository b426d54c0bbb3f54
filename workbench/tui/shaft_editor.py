"""The shaft and duty-cycle editors: which texts each table holds, and how its results read.

A shaft's results are each operating state's bearing loads (gear-force relations and shaft
statics, the thrust-sharing rule for an adjusted pair), the lives of the cases it generates, the
series system life of its two bearings, and the free-body derivation of its first state; a duty
cycle's are its Palmgren–Miner life and each state's share of the damage.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from typing import Any

from textual.app import ComposeResult
from textual.binding import Binding
from textual.content import Content
from textual.widgets import Static

from ..engine.record import fmt, with_unit
from ..model.document import Document
from ..model.fields import FIELD_BY_NAME
from ..model.quantities import format_quantity
from ..model.shafts import (
    ELEMENT_KINDS, GENERATED_NOTE, HANDS, LOCATING, MOUNTINGS, OPTIONAL_TEXTS, REQUIRED_TEXTS,
    new_state_name, state_words,
)
from ..model.table_words import session_error_in_words
from ..model.user_text import sentence
from .derivation_pane import step_content
from .table_editor import Field, Rows, TableEditor

ERROR_STYLE = "bold $text-error on $error-muted"
BEFORE_THE_ERROR = "The last results without an error, until it is put right:"
CASE_INPUTS = ("reliability", "af", "vg", "vi", "temp", "nu", "cleanliness", "static_duty")
"""The case inputs a shaft passes to every case it generates (its loads and speed it solves)."""

ELEMENT_FIELDS = (
    Field("name", "Name"),
    Field("kind", "Kind", ELEMENT_KINDS),
    Field("position", "Axial position", hint="from the shaft's origin, e.g. 118 mm"),
    Field("diameter", "Diameter", hint="pitch (mean pitch for bevel) or pulley diameter"),
    Field("pressure_angle", "Pressure angle αn", hint="normal pressure angle, e.g. 20°"),
    Field("helix_angle", "Helix angle β", hint="e.g. 18°"),
    Field("hand", "Hand of helix", ("",) + HANDS),
    Field("driving", "Drives its mate", ("", "yes", "no")),
    Field("pitch_cone_angle", "Pitch cone angle", hint="e.g. 30°"),
    Field("apex", "Cone apex side", ("", "A", "B")),
    Field("mesh_angle", "Direction to mate", hint="in the y–z plane from +y toward +z, e.g. 90°"),
    Field("pull_factor", "Belt pull factor", hint="blank: the belt type's common value"),
    Field("share", "Share of torque", hint="of the state's torque through this element"),
)


class ShaftEditor(TableEditor):
    """Edit a shaft: its bearings and positions, gears and pulleys, operating states."""

    TABLES = "shafts"
    TITLE_WORD = "shaft"
    HEAD = (
        Field("name", "Name"),
        Field("bearing_a", "Bearing at A", "bearings"),
        Field("position_a", "Position of A", hint="e.g. 0 mm"),
        Field("bearing_b", "Bearing at B", "bearings"),
        Field("position_b", "Position of B", hint="greater than A's, e.g. 190 mm"),
        Field("locating", "Takes the thrust", LOCATING,
              hint="A or B alone, or pair: an adjusted pair shares it"),
        Field("mounting", "Pair mounting", ("",) + MOUNTINGS, hint="O back-to-back, X face-to-face"),
        Field("rotation", "Turns about +x", ("+", "-")),
    )
    ROWS = (
        Rows("elements", "Gear or pulley", ELEMENT_FIELDS,
             {"name": "gear", "kind": "helical", "position": "100 mm", "diameter": "60 mm",
              "pressure_angle": "20°", "helix_angle": "15°", "hand": "right", "driving": "yes",
              "mesh_angle": "90°"}),
        Rows("states", "Operating state",
             (Field("name", "Name"), Field("power", "Power", hint="e.g. 15 kW; or a torque"),
              Field("torque", "or torque", hint="e.g. 97 N·m"), Field("speed", "Speed"),
              Field("share", "Share of time")),
             {"power": "10 kW", "speed": "1500 r/min", "share": "1"}),  # named when added
    )
    MORE_LABELS = {"states": {"case": "its generated case"}}  # a state of the bearings' duty cycles
    BINDINGS = [
        Binding("f2", "add_element", "Add gear or pulley", priority=True),
        Binding("f3", "add_state", "Add state", priority=True),
    ]

    def extra_groups(self, table: dict[str, Any]) -> ComposeResult:
        """The case inputs every generated case gets."""
        yield Static("Case inputs of the generated cases", classes="group-title")
        fields = tuple(Field(name, FIELD_BY_NAME[name].short_label,
                             tuple(("",) + FIELD_BY_NAME[name].choices)
                             if FIELD_BY_NAME[name].kind == "choice" and name != "cleanliness"
                             else None)
                       for name in CASE_INPUTS)
        yield from self._rows_of(fields, ("case_fields",), table.get("case_fields", {}))

    def row_fields(self, rows: Rows, row: dict[str, str]) -> tuple[Field, ...]:
        """A gear or pulley shows the texts its kind needs or may take."""
        if rows.key != "elements":
            return rows.fields
        kind = row.get("kind", "")
        wanted = {"name", "kind", *REQUIRED_TEXTS.get(kind, ()), *OPTIONAL_TEXTS.get(kind, ())}
        return tuple(f for f in rows.fields if f.key in wanted)

    def rebuilds_on(self, key: str) -> bool:
        """A new element kind shows other fields."""
        return key == "kind"

    async def action_add_element(self) -> None:
        """Add a gear (helical by default) at the end of the list."""
        await self.add_row(self.ROWS[0])

    async def action_add_state(self) -> None:
        """Add an operating state, named "state N" (see ``shafts.new_state_name``)."""
        await self.add_row(self.ROWS[1], name=new_state_name(self.table.get("states", [])))

    def __init__(self, document: Document, index: int) -> None:
        super().__init__(document, index)
        self.last_good: list[Content] = []
        """The results as they read when the shaft last had no error (see :meth:`results`)."""

    def results(self) -> list[Content]:
        """What :meth:`worked_out` says now; while the shaft has an error, the error lines
        first and the last results without one under them, marked as such (a typo in one
        state's share used to blank every bearing load until it was put right)."""
        lines = self.worked_out()
        if not any(line.plain.lstrip().startswith("✘") for line in lines):
            self.last_good = lines
            return lines
        if not self.last_good:
            return lines
        return [*lines, Content(""),
                Content.styled(BEFORE_THE_ERROR, "italic $text-muted"), *self.last_good]

    def worked_out(self) -> list[Content]:
        """Each state's bearing loads, the generated cases' lives, the system life and the
        first state's free body, each error where it is."""
        document = self.document
        system = document.units
        outcomes = document.analysis.shafts
        if self.index >= len(outcomes):
            return [Content("No results yet.")]
        outcome = outcomes[self.index]
        lines: list[Content] = []
        if outcome.error:
            lines.append(Content.styled(f"✘ {self.in_words(outcome.error)}", ERROR_STYLE))
        for state in outcome.states:
            lines.append(Content.styled(sentence(state_words(state.state.name)), "bold"))
            if state.error or state.solution is None:
                lines.append(Content.styled(f"  ✘ {self.in_words(state.error or '')}", ERROR_STYLE))
                continue
            for side, (fr, fa) in state.solution.bearing_loads.items():
                lines.append(Content(
                    f"  bearing {side}: Fr = {format_quantity(fr, 'force', system)}, "  # type: ignore[arg-type]
                    f"Fa = {format_quantity(fa, 'force', system)}"))  # type: ignore[arg-type]
        name = str(self.table.get("name", ""))
        generated = [r for r in document.results if r.case.notes == GENERATED_NOTE + name]
        if generated:
            lines.append(Content(""))
            lines.append(Content.styled("Generated load cases", "bold"))
            for result in generated:
                lnm = result.derivation.results.get("Lnm", math.nan) if result.derivation else math.nan
                life = "—" if not math.isfinite(lnm) else format_quantity(lnm, "time", system)  # type: ignore[arg-type]
                lines.append(Content(f"  {result.case.name}: Lnm = {life}" if result.derivation
                                     else f"  {result.case.name}: ✘ {result.error}"))
        if outcome.system is not None:
            lines.append(Content(""))
            lines.append(Content.styled(
                f"System life of A and B: {fmt(outcome.system.life_h)} h "
                f"(R = {fmt(outcome.system.reliability)})", "bold"))
        elif outcome.system_error:
            lines.append(Content.styled(f"✘ system life: {self.in_words(outcome.system_error)}",
                                        ERROR_STYLE))
        first = next((s.solution for s in outcome.states if s.solution is not None), None)
        if first is not None:
            lines.append(Content(""))
            lines.append(Content.styled(f"Free body of {state_words(first.state.name)}", "bold"))
            for step in first.derivation.steps:
                lines.extend(step_content(step, system))
        return lines


class DutyEditor(TableEditor):
    """Edit a duty cycle: its basis and the load cases it runs through, with their shares."""

    TABLES = "duty_cycles"
    TITLE_WORD = "duty cycle"
    HEAD = (Field("name", "Name"), Field("basis", "Shares of", ("time", "revolutions")))
    ROWS = (Rows("states", "State", (Field("case", "Load case", "cases"),
                                     Field("share", "Share", hint="of the time or revolutions")),
                 {"case": "", "share": "0.5"}),)
    BINDINGS = [Binding("f3", "add_state", "Add state", priority=True)]

    async def action_add_state(self) -> None:
        """Add a state (choose its case, give its share)."""
        await self.add_row(self.ROWS[0])

    def results(self) -> list[Content]:
        """The Palmgren–Miner life and each state's share of the damage, or the error."""
        name = str(self.table.get("name", ""))
        outcome = next((d for d in self.document.analysis.duties
                        if d.shaft is None and d.name == name), None)
        if outcome is None:
            return [Content("No results yet.")]
        if outcome.result is None:
            return [Content.styled(f"✘ {self.in_words(outcome.error or '')}", ERROR_STYLE)]
        result = outcome.result
        lines = [Content.styled(f"Bearing {result.bearing}: L = {with_unit(fmt(result.life_mrev), '10⁶ rev')}, "
                                f"{fmt(result.life_h)} h at the mean speed "
                                f"{fmt(result.mean_speed)} r/min", "bold"),
                 Content("Share of the damage by state (Palmgren–Miner, 1/L = Σ ui/Li):")]
        for (case, _), share in zip(result.cycle.states, result.damage_shares):
            lines.append(Content(f"  {case}: {100 * share:.1f} %"))
        lines.append(Content(""))
        for step in result.derivation.steps:
            lines.extend(step_content(step, self.document.units))
        return lines


def session_in_words(document: Document) -> Callable[[str], str]:
    """How the shafts view says an error of any shaft or duty-cycle table of ``document``: as
    the editors do (``model.table_words``)."""
    editors = (ShaftEditor, DutyEditor)
    tables = {editor.TABLES: document.tables(editor.TABLES) for editor in editors}
    words = {editor.TABLES: editor.table_words() for editor in editors}
    bearings = [bearing.name for bearing in document.session.bearings]
    return lambda error: session_error_in_words(error, tables, words, bearings=bearings)


def new_shaft(bearings: list[str]) -> dict[str, Any]:
    """A shaft to start from: on the first two bearings, one state, no gears yet."""
    first = bearings[0] if bearings else ""
    second = bearings[1] if len(bearings) > 1 else first
    return {"name": "Shaft", "bearing_a": first, "bearing_b": second, "position_a": "0 mm",
            "position_b": "200 mm", "locating": "B", "rotation": "+",
            "states": [{"name": "full load", "power": "10 kW", "speed": "1500 r/min", "share": "1"}]}


def new_duty_cycle(cases: list[str]) -> dict[str, Any]:
    """A duty cycle to start from: the first case for all the time."""
    return {"name": "Duty cycle", "basis": "time",
            "states": [{"case": cases[0], "share": "1"}] if cases else []}
