"""The document the workbench screen edits: a session, the selected load case, undo and redo.

No Textual here: every edit the screen offers is a method that changes the :class:`Session`
through its typed texts and re-derives what the change touches (through
:func:`workbench.model.session.evaluate_case`, so the numbers are the engine's).  A typed value
is written only when it is valid: :meth:`Workbench.set_text` returns the message otherwise, and
the last valid text stays in force.  Undo keeps whole-session snapshots; consecutive keystrokes
in one field of one case merge into one undo step.

The cases a session's ``[[shafts]]`` generate follow its own cases in :attr:`Workbench.results`
(and in the case list); they are read-only here: an edit of one is refused with
:meth:`Workbench.generated_problem`'s message, since the file's shaft table is their editor.
"""

from __future__ import annotations

import copy
import math
import unicodedata
from dataclasses import dataclass
from pathlib import Path
from typing import NamedTuple

from ..engine.record import InputError
from ..engine.solve import UNKNOWNS, Solution, solve
from ..model.analysis import SessionAnalysis, analyse
from ..model.fields import FIELD_BY_NAME, FieldError, parse_field
from ..model.quantities import format_quantity
from ..model.session import (
    Bearing, CaseResult, LoadCase, Session, UNIT_SYSTEMS, case_texts, evaluate_case,
)
from ..model.shafts import is_generated
from .whatif import leading_number, number_text, scale_text

MAX_NAME = 60
UNDO_DEPTH = 200
# The engine names one input differently from the field a person types it in.
ENGINE_FIELD_TO_INPUT = {"ec": "cleanliness"}
DEFAULT_BEARING_TEXTS = {"kind": "deep-groove"}


def input_field(engine_field: str | None) -> str | None:
    """The editor field an engine error names ("ec" is typed in the cleanliness field)."""
    if engine_field is None:
        return None
    return ENGINE_FIELD_TO_INPUT.get(engine_field, engine_field)


@dataclass
class _Snapshot:
    label: str
    session: Session
    selected: int
    merge_key: tuple[str, int, str] | None


@dataclass
class _EditRun:
    case_index: int
    field: str
    start: str | None  # the field's own text when the run began; None: not set


def _put(texts: dict[str, str], name: str, text: str | None) -> None:
    """Set ``texts[name]``, or remove it for None."""
    if text is None:
        texts.pop(name, None)
    else:
        texts[name] = text


class SolvedFor(NamedTuple):
    """A solution and the case it was solved for (applying it elsewhere would be wrong)."""

    case_name: str
    solution: Solution


class Workbench:
    """A session under edit: the selected case, its results, undo/redo and the dirty mark."""

    def __init__(self, session: Session, path: Path | None = None) -> None:
        self.session = session
        self.path = path
        self.dirty = False
        self.revision = 0
        self.solved: SolvedFor | None = None
        self._undo: list[_Snapshot] = []
        self._redo: list[_Snapshot] = []
        self._run: _EditRun | None = None
        self._analysis: tuple[int, SessionAnalysis] | None = None
        self.results: list[CaseResult] = []
        self.reevaluate()
        self.selected = 0 if self.results else -1

    # ---- reading ------------------------------------------------------------------------
    @property
    def case(self) -> LoadCase | None:
        """The selected load case (one of the session's, or one its shafts generate), or None."""
        if 0 <= self.selected < len(self.session.cases):
            return self.session.cases[self.selected]
        if 0 <= self.selected < len(self.results):
            return self.results[self.selected].case
        return None

    def generated_problem(self) -> str | None:
        """Why the selected case cannot be edited here (it is generated from a shaft), or None."""
        case = self.case
        if case is None or not is_generated(case):
            return None
        return (f"{case.notes}: edit the shaft ([[shafts]] in the session file); "
                "duplicate the case for an editable copy")

    @property
    def analysis(self) -> SessionAnalysis:
        """The whole session worked out (shafts, duty cycles), redone once per change."""
        if self._analysis is None or self._analysis[0] != self.revision:
            self._analysis = (self.revision, analyse(self.session))
        return self._analysis[1]

    @property
    def result(self) -> CaseResult | None:
        """The selected case evaluated."""
        if 0 <= self.selected < len(self.results):
            return self.results[self.selected]
        return None

    @property
    def units(self) -> str:
        """The session's display system, SI or US."""
        return self.session.units if self.session.units in UNIT_SYSTEMS else "SI"

    def texts(self) -> dict[str, str]:
        """Every input of the selected case as typed (bearing fields from its bearing)."""
        case = self.case
        return case_texts(self.session, case) if case is not None else {}

    def bearing_users(self, bearing_name: str) -> int:
        """How many cases use the bearing called ``bearing_name``."""
        return sum(1 for case in self.session.cases if case.bearing == bearing_name)

    @property
    def can_undo(self) -> bool:
        """Whether there is a step to undo."""
        return bool(self._undo)

    def reevaluate(self) -> None:
        """Derive every case again, the session's own then those its shafts generate (after a
        structural change, an undo or a load)."""
        self.results = list(analyse(self.session).cases)

    def _reevaluate_bearing(self, bearing_name: str) -> None:
        for index, case in enumerate(self.session.cases):
            if case.bearing == bearing_name:
                self.results[index] = evaluate_case(self.session, case)
        if self.session.reserved.get("shafts"):  # a shaft's loads can hang on its bearings' data
            own = len(self.session.cases)
            self.results[own:] = analyse(self.session).cases[own:]

    # ---- undo ---------------------------------------------------------------------------
    def _remember(self, label: str, merge_key: tuple[str, int, str] | None = None,
                  before: Session | None = None) -> None:
        """Snapshot the session before a change (``before`` if taken already); keystrokes in
        one field of one case (the same ``merge_key``) merge into the step before them."""
        self._redo.clear()
        if merge_key is None:
            self._run = None
        if self._merges(merge_key):
            return
        snapshot = before if before is not None else copy.deepcopy(self.session)
        self._undo.append(_Snapshot(label, snapshot, self.selected, merge_key))
        del self._undo[:-UNDO_DEPTH]

    def _merges(self, merge_key: tuple[str, int, str] | None) -> bool:
        top = self._undo[-1] if self._undo else None
        return merge_key is not None and top is not None and top.merge_key == merge_key

    def _changed(self) -> None:
        self.dirty = True
        self.revision += 1

    def _swap(self, source: list[_Snapshot], target: list[_Snapshot]) -> str | None:
        if not source:
            return None
        snapshot = source.pop()
        target.append(_Snapshot(snapshot.label, self.session, self.selected, None))
        self.session = snapshot.session
        self.solved = None
        self.reevaluate()
        self.selected = min(snapshot.selected, len(self.results) - 1)
        self._changed()
        self.end_run()
        return snapshot.label

    def undo(self) -> str | None:
        """Undo the last change; its label, or None when there is nothing to undo."""
        return self._swap(self._undo, self._redo)

    def redo(self) -> str | None:
        """Redo the last undone change; its label, or None."""
        return self._swap(self._redo, self._undo)

    def break_merge(self) -> None:
        """End the current run of keystrokes: the next edit starts a new undo step."""
        if self._undo:
            self._undo[-1].merge_key = None

    # ---- editing ------------------------------------------------------------------------
    def select(self, index: int) -> None:
        """Select the case at ``index`` (clamped to the list)."""
        if self.results:
            self.selected = max(0, min(index, len(self.results) - 1))
            self.end_run()

    def _owner_texts(self, field_name: str) -> dict[str, str] | None:
        """The texts dict a field is written to: the case's, or its bearing's."""
        case = self.case
        if case is None:
            return None
        if FIELD_BY_NAME[field_name].group == "bearing":
            bearing = self.session.bearing(case.bearing)
            return None if bearing is None else bearing.texts
        return case.texts

    def set_text(self, field_name: str, text: str) -> str | None:
        """Write ``text`` into ``field_name`` of the selected case if it is valid.

        Returns None when written (or unchanged), else the message to show beside the field.
        Valid means the unit edge reads it and the engine does not refuse the case because of
        this field.  Keystrokes in one field form an edit run (ended by :meth:`end_run`): valid
        texts along the way take effect at once, and a text that is not valid puts back the
        value in force when the run began, so a half-typed "5" of "5 kg" never stays.
        """
        if field_name not in FIELD_BY_NAME:
            return "unknown input"
        if (generated := self.generated_problem()) is not None:
            return generated
        owner = self._owner_texts(field_name)
        case = self.case
        if owner is None or case is None:
            return "no load case with a bearing is selected"
        run = self._begin_run(field_name, owner)
        try:
            parse_field(field_name, text)
        except FieldError as exc:
            self._back_to_run_start(run, owner)
            return exc.message
        if owner.get(field_name, "") == text:
            return None
        merge_key = ("edit", self.selected, field_name)
        before = None if self._merges(merge_key) else copy.deepcopy(self.session)
        previous = owner.get(field_name)
        owner[field_name] = text
        trial = evaluate_case(self.session, case)
        if trial.derivation is None and input_field(trial.error_field) == field_name:
            _put(owner, field_name, previous)
            self._back_to_run_start(run, owner)
            return trial.error
        self._remember(f"edit {FIELD_BY_NAME[field_name].label}", merge_key, before)
        self._reevaluate_owner(field_name, trial)
        self._changed()
        return None

    def _reevaluate_owner(self, field_name: str, trial: CaseResult | None = None) -> None:
        """Re-derive what an edit of ``field_name`` touches: every case on the bearing, or
        just the selected case (``trial`` when it is evaluated already)."""
        case = self.case
        if case is None:
            return
        if FIELD_BY_NAME[field_name].group == "bearing":
            self._reevaluate_bearing(case.bearing)
        else:
            self.results[self.selected] = trial or evaluate_case(self.session, case)

    def _begin_run(self, field_name: str, owner: dict[str, str]) -> _EditRun:
        run = self._run
        if run is None or run.case_index != self.selected or run.field != field_name:
            self.break_merge()
            run = _EditRun(self.selected, field_name, owner.get(field_name))
            self._run = run
        return run

    def _back_to_run_start(self, run: _EditRun, owner: dict[str, str]) -> None:
        """Put back the text in force when the edit run began (and drop its undo step)."""
        if owner.get(run.field) == run.start:
            return
        _put(owner, run.field, run.start)
        top = self._undo[-1] if self._undo else None
        if top is not None and top.merge_key == ("edit", run.case_index, run.field):
            self._undo.pop()
        self._reevaluate_owner(run.field)
        self._changed()

    def end_run(self) -> None:
        """End the current edit run (the field lost focus, enter was pressed, a nudge landed):
        what is in force now is what a later bad text falls back to."""
        self._run = None
        self.break_merge()

    def choose_bearing(self, bearing_name: str) -> str | None:
        """Make the selected case use another bearing of the session; a message if it can't."""
        case = self.case
        if case is None:
            return "no load case is selected"
        if (generated := self.generated_problem()) is not None:
            return generated
        if self.session.bearing(bearing_name) is None:
            return f"no bearing called {bearing_name!r}"
        if case.bearing == bearing_name:
            return None
        self._remember(f"use bearing {bearing_name}")
        case.bearing = bearing_name
        self.results[self.selected] = evaluate_case(self.session, case)
        self._changed()
        return None

    def adopt_bearing(self, texts: dict[str, str], designation: str) -> str | None:
        """Give the selected case's bearing the field texts of a catalog bearing (one undo step;
        a blank text clears the field); None when done, else why not."""
        case = self.case
        if case is None:
            return "no load case is selected"
        bearing = self.session.bearing(case.bearing)
        if bearing is None:
            return f"no bearing called {case.bearing!r} in this session"
        self._remember(f"adopt {designation} as bearing {bearing.name}")
        for name, text in texts.items():
            _put(bearing.texts, name, text.strip() or None)
        self._reevaluate_bearing(bearing.name)
        self._changed()
        self.end_run()
        return None

    def _unique_name(self, stem: str) -> str:
        names = {case.name for case in self.session.cases}
        if stem not in names:
            return stem
        number = 2
        while f"{stem} {number}" in names:
            number += 1
        return f"{stem} {number}"

    def _default_bearing(self) -> str:
        case = self.case
        if case is not None and self.session.bearing(case.bearing) is not None:
            return case.bearing
        if self.session.bearings:
            return self.session.bearings[0].name
        bearing = Bearing("Bearing 1", dict(DEFAULT_BEARING_TEXTS))
        self.session.bearings.append(bearing)
        return bearing.name

    def _insert(self, case: LoadCase) -> None:
        own = len(self.session.cases)
        index = min(self.selected + 1, own) if self.case is not None else own
        self.session.cases.insert(index, case)
        self.selected = index
        self.reevaluate()
        self._changed()

    def add_case(self) -> str:
        """Add an empty case after the selected one, on the same bearing; its name."""
        self._remember("add case")
        name = self._unique_name(f"Case {len(self.session.cases) + 1}")
        self._insert(LoadCase(name, self._default_bearing()))
        return name

    def duplicate_case(self) -> str | None:
        """Copy the selected case, placed after it; the copy's name (None in an empty list)."""
        case = self.case
        if case is None:
            return None
        self._remember("duplicate case")
        notes = "" if is_generated(case) else case.notes  # the copy is the person's to edit
        copied = LoadCase(self._unique_name(f"{case.name} copy"), case.bearing,
                          dict(case.texts), notes)
        self._insert(copied)
        return copied.name

    def name_problem(self, name: str) -> str | None:
        """Why ``name`` cannot name the selected case, or None when it can."""
        stripped = name.strip()
        if (generated := self.generated_problem()) is not None:
            return generated
        if not stripped:
            return "a name is needed"
        if len(stripped) > MAX_NAME:
            return f"at most {MAX_NAME} characters"
        if any(unicodedata.category(ch).startswith("C") for ch in stripped):
            return "contains a control character"
        current = self.case.name if self.case is not None else None
        if stripped != current and any(result.case.name == stripped for result in self.results):
            return f"a case called {stripped!r} exists already"
        return None

    def rename_case(self, name: str) -> str | None:
        """Rename the selected case; None when done, else the reason it was refused."""
        case = self.case
        if case is None:
            return "no load case is selected"
        problem = self.name_problem(name)
        if problem is not None:
            return problem
        stripped = name.strip()
        if stripped == case.name:
            return None
        self._remember("rename case")
        if self.session.solver.case == case.name:
            self.session.solver.case = stripped
        case.name = stripped
        self._changed()
        return None

    def delete_case(self) -> str | None:
        """Delete the selected case (undoable); its name, or None in an empty list or for a
        generated case."""
        case = self.case
        if case is None or is_generated(case):
            return None
        self._remember("delete case")
        del self.session.cases[self.selected]
        self.selected = min(self.selected, len(self.session.cases) - 1)
        self.reevaluate()
        self._changed()
        return case.name

    def move_case(self, delta: int) -> bool:
        """Move the selected case up (−1) or down (+1); False when it is already at the end."""
        index, target = self.selected, self.selected + delta
        own = len(self.session.cases)
        if self.case is None or not (0 <= index < own and 0 <= target < own):
            return False
        self._remember("move case")
        cases = self.session.cases
        cases[index], cases[target] = cases[target], cases[index]
        self.results[index], self.results[target] = self.results[target], self.results[index]
        self.selected = target
        self._changed()
        return True

    def toggle_units(self) -> str:
        """Switch the session's display system between SI and US customary; the new one."""
        self.session.units = "US" if self.units == "SI" else "SI"
        self._changed()
        return self.session.units

    # ---- solver -------------------------------------------------------------------------
    def solve(self, unknown: str, target_text: str) -> Solution:
        """Back-solve ``unknown`` of the selected case for a target like "Lnm=20000 h".

        Raises FieldError for a target that cannot be read and InputError (NoSolution among
        them) when the case cannot be derived or no value meets the target.
        """
        from ..model.targets import parse_target_text

        result, case = self.result, self.case
        if case is None or result is None:
            raise InputError("case", "no load case is selected")
        if result.inputs is None:
            raise InputError(result.error_field or "case", result.error or "the case has errors")
        target, value = parse_target_text(target_text)
        self.session.solver.unknown = unknown
        self.session.solver.target = target_text.strip()
        self.session.solver.case = case.name
        solution = solve(result.inputs, unknown, target, value)
        self.solved = SolvedFor(case.name, solution)
        return solution

    def _solved_texts(self, solution: Solution, inputs_value: float) -> dict[str, str]:
        """The typed texts that put the solved value into the case, units kept as typed."""
        texts = self.texts()
        if solution.unknown == "load_scale":
            changed = {}
            for name in ("fr", "fa"):
                scaled = scale_text(texts.get(name, ""), solution.value)
                if scaled is not None:
                    changed[name] = scaled
            return changed
        name = solution.unknown
        current = texts.get(name, "")
        typed = leading_number(current)
        if typed is not None and typed != 0 and inputs_value > 0 and math.isfinite(inputs_value):
            scaled = scale_text(current, solution.value / inputs_value)
            if scaled is not None:
                return {name: scaled}
        spec = FIELD_BY_NAME[name]
        if spec.kind == "quantity" and spec.quantity is not None:
            return {name: format_quantity(solution.value, spec.quantity, self.units,  # type: ignore[arg-type]
                                          digits=7)}
        return {name: number_text(solution.value)}

    def apply_solution(self) -> str:
        """Write the last solved value into its case (one undo step); a line saying what changed.

        Raises InputError when there is no solution for the selected case.
        """
        solved, case, result = self.solved, self.case, self.result
        if solved is None:
            raise InputError("solve", "nothing solved yet: solve first")
        if case is None or result is None or case.name != solved.case_name:
            raise InputError("solve", f"the solution is for case {solved.case_name!r}: "
                                      "select it or solve again")
        if result.inputs is None:
            raise InputError("solve", "the case has changed and has errors: solve again")
        if (generated := self.generated_problem()) is not None:
            raise InputError("solve", generated)
        solution = solved.solution
        current = 1.0 if solution.unknown == "load_scale" else float(
            getattr(result.inputs, solution.unknown))
        changed = self._solved_texts(solution, current)
        if not changed:
            raise InputError("solve", "no typed value to change")
        self._remember(f"apply solved {UNKNOWNS[solution.unknown].label}")
        bearing = self.session.bearing(case.bearing)
        for name, text in changed.items():
            owner = bearing.texts if FIELD_BY_NAME[name].group == "bearing" and bearing else case.texts
            owner[name] = text
        self.solved = None  # applied once: solve again to apply again
        self.reevaluate()
        self._changed()
        words = ", ".join(f"{FIELD_BY_NAME[n].label} = {t}" for n, t in changed.items())
        users = self.bearing_users(case.bearing)
        shared = any(FIELD_BY_NAME[n].group == "bearing" for n in changed) and users > 1
        return words + (f" (bearing {case.bearing}, used by {users} cases)" if shared else "")

    # ---- files --------------------------------------------------------------------------
    def mark_saved(self, path: Path) -> None:
        """Record that the session was written to ``path``."""
        self.path = path
        self.dirty = False

    def replace_session(self, session: Session, path: Path | None, dirty: bool = False) -> None:
        """Put another session under edit (an opened or recovered file); undo starts afresh."""
        self.session = session
        self.path = path
        self.solved = None
        self._run = None
        self._undo.clear()
        self._redo.clear()
        self.dirty = dirty
        self.revision += 1
        self.reevaluate()
        self.selected = 0 if self.results else -1
