"""The one table of what a person can do: keys, footer words, palette titles and help.

The app's and the workbench screen's ``BINDINGS``, the command palette
(:mod:`workbench.tui.commands`) and the help screen are all built from :data:`ACTIONS`, so a key
and its command can never drift apart.  Each binding carries an ``id`` (the action's) so the
person's own key table (``[keys]`` in the settings file, applied with ``App.set_keymap``) can
move it to other keys; :func:`check_keymap` reads that table.
"""

from __future__ import annotations

from collections.abc import Mapping
from typing import Literal, NamedTuple

from textual.binding import Binding

from ..model.config_files import key_problem
from ..model.user_text import quoted

Scope = Literal["app", "screen"]

NUDGE_GROUP = Binding.Group("What-if ±5 % / ±1 %", compact=True)
MOVE_GROUP = Binding.Group("Move case", compact=True)
PANE_GROUP = Binding.Group("Derivation / Solver / What-if / Inside", compact=True)


class Action(NamedTuple):
    """One thing to do: ``action`` names an ``action_*`` method in ``scope``."""

    id: str
    keys: str
    action: str
    title: str
    help: str
    scope: Scope = "screen"
    group: Binding.Group | None = None
    at_once: bool = False
    """Whether the key acts as the app takes it, before the keys typed behind it are handed on
    (a priority binding): for a key that opens a form, whose first field those keys are for
    (see ``field_moves``)."""

    def binding(self) -> Binding:
        """The Textual binding for this action (shown in the footer)."""
        return Binding(self.keys, self.action, self.title, id=self.id, group=self.group,
                       tooltip=self.help, priority=self.at_once)

    def key_text(self, keymap: Mapping[str, str] | None = None) -> str:
        """The keys as a person reads them ("ctrl+s, f12"), after the person's ``keymap``."""
        keys = (keymap or {}).get(self.id, self.keys)
        return ", ".join(key.strip() for key in keys.split(","))


ACTIONS: tuple[Action, ...] = (
    Action("app.help", "f1", "help", "Help", "List every key and what it does", "app"),
    Action("file.save", "ctrl+s", "save", "Save", "Save the session to its file"),
    Action("edit.undo", "ctrl+z", "undo", "Undo", "Undo the last edit, delete, move or apply"),
    Action("edit.redo", "ctrl+y", "redo", "Redo", "Redo what was undone"),
    Action("case.add", "ctrl+n", "add_case", "Add case",
           "Add an empty load case after the selected one"),
    Action("case.duplicate", "ctrl+d", "duplicate_case", "Duplicate",
           "Copy the selected load case (a generated one gives an editable copy)"),
    Action("case.rename", "f2", "rename_case", "Rename", "Rename the selected load case"),
    Action("case.delete", "ctrl+delete,shift+delete", "delete_case", "Delete",
           "Delete the selected load case (undo brings it back)"),
    Action("case.move_up", "alt+up", "move_case(-1)", "Move case up",
           "Move the selected load case up the list", group=MOVE_GROUP),
    Action("case.move_down", "alt+down", "move_case(1)", "Move case down",
           "Move the selected load case down the list", group=MOVE_GROUP),
    Action("whatif.up5", "ctrl+up", "nudge(1.05)", "Field +5 %",
           "Raise the focused number by 5 %, unit kept", group=NUDGE_GROUP),
    Action("whatif.down5", "ctrl+down", "nudge(0.95)", "Field −5 %",
           "Lower the focused number by 5 %, unit kept", group=NUDGE_GROUP),
    Action("whatif.up1", "ctrl+shift+up", "nudge(1.01)", "Field +1 %",
           "Raise the focused number by 1 %, unit kept", group=NUDGE_GROUP),
    Action("whatif.down1", "ctrl+shift+down", "nudge(0.99)", "Field −1 %",
           "Lower the focused number by 1 %, unit kept", group=NUDGE_GROUP),
    Action("solver.solve", "f9", "solve", "Solve",
           "Back-solve the chosen input so the chosen result meets its target"),
    Action("solver.apply", "f10", "apply_solution", "Apply",
           "Write the solved value into the case (undoable)"),
    Action("view.units", "alt+u", "toggle_units", "SI/US",
           "Show results in SI or US customary units (typed values stay as typed)"),
    Action("view.derivation", "f5", "show_pane('derivation')", "Derivation",
           "Show the derivation of the selected case", group=PANE_GROUP),
    Action("view.solver", "f6", "show_pane('solver')", "Solver",
           "Show the back-solver", group=PANE_GROUP),
    Action("view.whatif", "f7", "show_pane('whatif')", "What-if",
           "Show how strongly the life answers to each input, the life and aISO plots and the "
           "duty cycles' damage shares", group=PANE_GROUP),
    Action("view.inside", "f8", "show_pane('inside')", "Inside",
           "Show the bearing from inside: each element's load around the ring, the load zone, "
           "contact pressures, stiffness and the reference life L10r, with the clearance, "
           "preload and tilt fields (needs the bearing's internal geometry)", group=PANE_GROUP),
    Action("bearing.catalog", "alt+c", "select_from_catalog", "Bearing from a catalog",
           "List the catalog bearings that meet every case on the selected case's bearing; "
           "adopt one (undoable). There, ctrl+g rates a special bearing from its geometry "
           "(ISO 281 C, ISO 76 C0) to adopt instead"),
    Action("bearing.manage", "alt+e", "manage_bearings", "Bearings",
           "Add, duplicate, rename or delete the session's bearings; enter uses one for the "
           "selected case"),
    Action("session.details", "alt+i", "edit_session", "Details and targets",
           "Title, project, engineer, revision and notes; the life, reliability and s0 "
           "targets every case must meet", at_once=True),
    Action("shaft.edit", "alt+h", "edit_shaft", "Edit the shaft",
           "Edit the shaft the selected case comes from (else the first shaft): bearings, "
           "positions, gears and pulleys, operating states; its cases follow as you type",
           at_once=True),
    Action("shaft.add", "", "add_shaft", "Add a new shaft",
           "A shaft on two of the session's bearings, with one operating state to start from"),
    Action("duty.edit", "alt+y", "edit_duty_cycle", "Edit a duty cycle",
           "Edit the duty cycle on the selected case's bearing (else the first one): its "
           "states, their load cases and shares; a shaft's own cycle is edited with alt+h",
           at_once=True),
    Action("duty.add", "", "add_duty_cycle", "Add a new duty cycle",
           "A duty cycle over the selected case, to which states are added"),
    Action("bearing.add", "", "add_bearing", "Add a new bearing",
           "A new bearing of the session (deep-groove, no ratings yet), in the bearings list"),
    Action("report.write", "alt+r", "write_report", "Write the report",
           "The session's report as text, markdown, json or a self-contained html file with "
           "plots, with a preview; written where you say"),
    Action("view.shafts", "alt+s", "show_shafts", "Shafts at a glance",
           "Show each shaft's bearing loads and free body, system lives and duty cycles"),
    Action("focus.cases", "f3", "focus_cases", "Cases", "Go to the load-case list"),
    Action("focus.editor", "f4", "focus_editor", "Editor", "Go to the case editor"),
    Action("file.open", "ctrl+o", "open", "Open", "Open another session file"),
    Action("file.save_as", "f12", "save_as", "Save as", "Save the session under a new name"),
    Action("app.theme", "alt+t", "next_theme", "Theme", "Switch to the next colour theme",
           "app"),
    # xterm-like terminals send shift+f1 as the sequence Textual names f13: both are bound
    Action("app.about", "shift+f1,f13", "about", "About",
           "The standards the numbers follow, and the safety caution", "app"),
    Action("app.quit", "ctrl+q", "quit", "Quit", "Leave the workbench (asks about unsaved work)",
           "app"),
)


def bindings(scope: Scope) -> list[Binding]:
    """The bindings of every action in ``scope`` that has keys (the rest are palette commands
    only), in table order."""
    return [action.binding() for action in ACTIONS if action.scope == scope and action.keys]


ACTION_BY_ID: dict[str, Action] = {action.id: action for action in ACTIONS}


def check_keymap(table: Mapping[str, object]) -> tuple[dict[str, str], list[str]]:
    """The usable entries of a person's key table (action id → keys such as "ctrl+k" or
    "f4,ctrl+e"), and one line for each entry refused or key claimed by two actions."""
    keymap: dict[str, str] = {}
    problems: list[str] = []
    for action_id, keys in table.items():
        if action_id not in ACTION_BY_ID:
            problems.append(f"{quoted(action_id)} is not an action (see the help screen for the ids)")
        elif (problem := key_problem(keys) if isinstance(keys, str) else key_problem("")):
            problems.append(f"{action_id}: {problem}")
        else:
            keymap[action_id] = ",".join(key.strip() for key in keys.split(",") if key.strip())
    claimed: dict[str, list[str]] = {}
    for action in ACTIONS:
        for key in filter(None, action.key_text(keymap).split(", ")):
            claimed.setdefault(key, []).append(action.id)
    problems += [f"{key} is claimed by {' and '.join(ids)}: only one of them acts"
                 for key, ids in claimed.items() if len(ids) > 1]
    return keymap, problems
