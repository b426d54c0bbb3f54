"""The open session as a document: its file, a revision number, one undo stack, one analysis.

Every change goes through :meth:`Document.apply` as an edit command (:mod:`.edits`): the
revision goes up by one, the inverse edit goes on the undo stack, and the analysis is brought up
to date for what the edit touches, and no more:

- a load-case field derives that case again;
- a bearing field derives the cases on that bearing;
- shafts, the cases they generate and the duty cycles are worked out again only when an edit
  can reach them (a bearing a shaft carries, a case a duty cycle names, a table, a target);
- the display system changes nothing but the revision.

In a large session one edit can reach thousands of cases (a bearing field, a target).  With
:attr:`Document.defer_over` set (the screen sets it), an edit that reaches more cases than that
derives only the case it was made in and leaves the others :attr:`~Document.pending`: they keep
their last result, marked out of date, until :meth:`Document.rederivation` (a snapshot, derived
on another thread) hands its results back through :meth:`Document.take`, which keeps only those
still current (each case carries the revision of its inputs).  :meth:`Document.result` is always
current: it derives a pending case on the spot.  Sessions with shafts or duty cycles an edit
reaches are derived at once (their results are built from the cases').

The cases are derived without their steps (results and warnings only: ISO 281:2007 life,
ISO 76:2006 static safety); :meth:`Document.with_steps` derives the one case a person reads
with every step, once per revision of that case.  Nothing here knows about the screen: the
screen watches :attr:`Document.revision`.

Typing is an *edit run*: keystrokes in one field of one case merge into one undo step; a text
that cannot be read (or that the engine refuses because of that field) puts back the value in
force when the run began, so a half-typed "5" of "5 kN" never stays in force.
"""

from __future__ import annotations

import copy
import math
import unicodedata
from collections.abc import Iterable, Set
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import TYPE_CHECKING, Any, NamedTuple

from ..engine.derive import CaseInputs
from ..engine.record import InputError
from ..engine.solve import UNKNOWNS, Solution, solve
from .analysis import SessionAnalysis, analyse_extras
from .duty_cycles import state_tables

if TYPE_CHECKING:
    from .safe_write import FileStamp
from .edits import (
    Edit, Insert, MoveCase, Remove,
    RenameBearing, RenameCase, SetBearingOrigin, SetCaseBearing, SetSessionText, SetTable,
    SetTarget, SetText, SetUnits,
    Together, Touch,
)
from .fields import BEARING_FIELDS, FIELD_BY_NAME, FieldError, parse_field
from .nudge import NUDGE_DIGITS, Rounding, leading_number, number_text, scale_text
from .quantities import format_quantity
from .session import (
    GEOMETRY_KEYS, Bearing, CaseResult, LoadCase, Session, UNIT_SYSTEMS, case_texts, evaluate_case,
)
from .shafts import is_generated
from .table_words import TableWords, key_in_words
from .user_text import quoted

MAX_NAME = 60
UNDO_DEPTH = 500
ENGINE_FIELD_TO_INPUT = {"ec": "cleanliness"}
"""The engine names one input differently from the field a person types it in."""
DEFAULT_BEARING_TEXTS = {"kind": "deep-groove"}


def input_field(engine_field: str | None) -> str | None:
    """The editor field an engine error names ("ec" is typed in the cleanliness field)."""
    if engine_field is None:
        return None
    return ENGINE_FIELD_TO_INPUT.get(engine_field, engine_field)


def name_problem(name: str, taken: set[str], current: str | None = None) -> str | None:
    """Why ``name`` cannot name a case or bearing (``taken``: names in use), or None."""
    stripped = name.strip()
    if not stripped:
        return "a name is needed"
    if len(stripped) > MAX_NAME:
        return f"at most {MAX_NAME} characters"
    if any(unicodedata.category(ch).startswith("C") for ch in stripped):
        return "contains a control character"
    if stripped != current and stripped in taken:
        return f"{stripped!r} is taken already"
    return None


class Step(NamedTuple):
    """One undo step: what it was, the edit that undoes it, the case it concerned."""

    label: str
    inverse: Edit
    case_index: int | None
    merge_key: tuple[str, int, str] | None


class Undone(NamedTuple):
    """What undo or redo did: the step's label and the case to show (None: keep the selection)."""

    label: str
    case_index: int | None


@dataclass
class _EditRun:
    case_index: int
    field: str
    start: str | None  # the field's own text when the run began; None: not set


@dataclass(frozen=True)
class Question:
    """A reverse question on one case as it stood at ``revision``: everything the solver needs,
    so it can be answered away from the screen's thread."""

    case_name: str
    revision: int
    inputs: CaseInputs
    unknown: str
    target: str
    value: float
    between: tuple[float, float] | None = None

    def solve(self) -> Solution:
        """The engine's answer (:func:`workbench.engine.solve.solve`), every root in the range;
        raises NoSolution."""
        return solve(self.inputs, self.unknown, self.target, self.value, self.between)


@dataclass(frozen=True)
class Solved:
    """A solution, the case it was solved for, and the revision it belongs to."""

    case_name: str
    revision: int
    solution: Solution


def _cases_named_by(cycles: object) -> set[str] | None:
    """The case names the ``[[duty_cycles]]`` tables' states give, or None where the tables
    do not read as written (then everything is worked out again)."""
    if not isinstance(cycles, list):
        return None
    named: set[str] = set()
    for cycle in cycles:
        states = cycle.get("states") if isinstance(cycle, dict) else None
        if not isinstance(states, list):
            return None
        for state in states:
            case = state.get("case") if isinstance(state, dict) else None
            if not isinstance(case, str):
                return None
            named.add(case)
    return named


@dataclass(frozen=True)
class Derived:
    """One case derived away from the screen's thread: its index, the revision of its inputs
    when it was asked for, and the result."""

    index: int
    stamp: int
    result: CaseResult


@dataclass(frozen=True)
class Rederivation:
    """The pending cases of a document at one moment, with what deriving them needs, so they can
    be derived on any thread: ``session`` holds copies of the bearings and targets; ``cases``
    is (index, revision of its inputs, the case) in the order to derive them."""

    session: Session
    cases: tuple[tuple[int, int, LoadCase], ...]

    def derive(self, start: int, stop: int) -> list[Derived]:
        """Cases ``start`` to ``stop`` of :attr:`cases` derived (results and warnings only).

        A case's texts are copied first (an edit on the screen's thread may change them
        meanwhile; its result then no longer matches the case's revision and is dropped)."""
        derived = []
        for index, stamp, case in self.cases[start:stop]:
            copied = LoadCase(case.name, case.bearing, dict(case.texts), case.notes)
            derived.append(Derived(index, stamp,
                                   evaluate_case(self.session, copied, keep_steps=False)))
        return derived


@dataclass
class Document:
    """A session under edit: its file, revision, undo and redo, and its analysis."""

    session: Session
    path: Path | None = None
    revision: int = 0
    saved_revision: int = 0
    solved: Solved | None = None
    stamp: FileStamp | None = None
    """What :attr:`path` held when this session was read from it or last saved there (None:
    never read or written here); a save asks first when the file no longer holds it."""
    _undo: list[Step] = field(default_factory=list, repr=False)
    _redo: list[Step] = field(default_factory=list, repr=False)
    _run: _EditRun | None = field(default=None, repr=False)
    _own: list[CaseResult] = field(default_factory=list, repr=False)
    _extras: SessionAnalysis | None = field(default=None, repr=False)
    _with_steps: dict[int, tuple[int, CaseResult]] = field(default_factory=dict, repr=False)
    _case_revision: list[int] = field(default_factory=list, repr=False)
    _pending: set[int] = field(default_factory=set, repr=False)
    defer_over: int | None = None
    """An edit derives at most this many cases at once; past it the others are left
    :attr:`pending`.  None: every case at once (the command line, reports, tests)."""

    def __post_init__(self) -> None:
        self._derive_all()

    # ---- reading ------------------------------------------------------------------------
    @property
    def dirty(self) -> bool:
        """Whether there are changes not saved to :attr:`path`."""
        return self.revision != self.saved_revision

    @property
    def units(self) -> str:
        """The session's display system, SI or US."""
        return self.session.units if self.session.units in UNIT_SYSTEMS else "SI"

    @property
    def analysis(self) -> SessionAnalysis:
        """Every case (own, then generated), every shaft and duty cycle, for this revision; an
        own case in :attr:`pending` holds its last result until it is derived again."""
        if self._extras is None:
            self._extras = analyse_extras(self.session, self._own, keep_steps=False)
        return self._extras

    @property
    def results(self) -> list[CaseResult]:
        """Every case evaluated (without steps): the session's own, then the generated ones."""
        return self.analysis.cases

    @property
    def pending(self) -> Set[int]:
        """The own cases whose listed result is out of date (see :attr:`defer_over`)."""
        return self._pending

    def result(self, index: int) -> CaseResult | None:
        """Case ``index`` of :attr:`results`, current (a pending case is derived now), or None
        outside the list."""
        results = self.results
        if not 0 <= index < len(results):
            return None
        if index in self._pending:
            self._derive_now([index])
        return results[index]

    def current_results(self) -> list[CaseResult]:
        """:attr:`results` with every pending case derived first (on this thread)."""
        self._derive_now(sorted(self._pending))
        return self.results

    def case(self, index: int) -> LoadCase | None:
        """The load case at ``index`` (own or generated), or None."""
        results = self.results
        return results[index].case if 0 <= index < len(results) else None

    def with_steps(self, index: int) -> CaseResult | None:
        """Case ``index`` derived with every step, for a person to read; derived once per
        revision of that case."""
        result = self.result(index)
        if result is None:
            return None
        own = index < len(self._own)
        stamp = self._case_revision[index] if own else self.revision
        cached = self._with_steps.get(index)
        if cached is not None and cached[0] == stamp and cached[1].case is result.case:
            return cached[1]
        full = evaluate_case(self.session, result.case)
        self._with_steps[index] = (stamp, full)
        return full

    def texts(self, index: int) -> dict[str, str]:
        """Every input of case ``index`` as typed (bearing fields from its bearing)."""
        case = self.case(index)
        return case_texts(self.session, case) if case is not None else {}

    def bearing_users(self, bearing_name: str) -> list[str]:
        """The names of the own cases that use the bearing called ``bearing_name``."""
        return [case.name for case in self.session.cases if case.bearing == bearing_name]

    def generated_problem(self, index: int) -> str | None:
        """Why case ``index`` cannot be edited (it is generated from a shaft), or None."""
        case = self.case(index)
        if case is None or not is_generated(case):
            return None
        return (f"{case.notes}: edit the shaft, not the case; "
                "duplicate the case for an editable copy")

    @property
    def can_undo(self) -> bool:
        """Whether there is a step to undo."""
        return bool(self._undo)

    @property
    def can_redo(self) -> bool:
        """Whether there is a step to redo."""
        return bool(self._redo)

    # ---- the one way in -----------------------------------------------------------------
    def apply(self, edit: Edit, label: str, *, case_index: int | None = None,
              merge_key: tuple[str, int, str] | None = None) -> None:
        """Make ``edit`` (one undo step, or merged into the last one when ``merge_key``
        matches it) and bring the analysis up to date for what it touches."""
        inverse = edit.apply(self.session)
        self._redo.clear()
        if merge_key is None:
            self._run = None
        top = self._undo[-1] if self._undo else None
        if merge_key is None or top is None or top.merge_key != merge_key:
            self._undo.append(Step(label, inverse, case_index, merge_key))
            del self._undo[:-UNDO_DEPTH]
        elif top.label != label:  # a run's label says the text as it now reads
            self._undo[-1] = top._replace(label=label)
        self._changed(edit.touch, case_index)

    def _changed(self, touch: Touch, case_index: int | None = None) -> None:
        self.revision += 1
        self._refresh(touch, case_index)

    def _derive_all(self) -> None:
        self._own = [evaluate_case(self.session, case, keep_steps=False)
                     for case in self.session.cases]
        self._case_revision = [self.revision] * len(self._own)
        self._extras = None
        self._with_steps.clear()
        self._pending.clear()

    def _refresh(self, touch: Touch, case_index: int | None) -> None:
        """Derive again what ``touch`` reaches (see the module notes); past
        :attr:`defer_over` cases, only the one the edit was made in (``case_index``)."""
        cases = self.session.cases
        reach = self._extras_reach(touch)
        fresh: set[int] = set()
        if touch.everything or len(cases) != len(self._own):
            if self.defer_over is None or reach or len(cases) <= self.defer_over:
                self._derive_all()
                return
            fresh = self._realign()
            again = set(range(len(cases)))
        else:
            again = set(touch.cases) | {index for index, case in enumerate(cases)
                                        if case.bearing in touch.bearings}
        now = again
        if self.defer_over is not None and len(again) > self.defer_over and not reach:
            now = again & (set(touch.cases) | {case_index})
        for index in again:
            self._case_revision[index] = self.revision
        self._pending |= again - fresh
        self._derive_now(now - fresh)
        if (again or touch.bearings) and reach:  # a shaft's bearing may have no own case
            self._extras = None

    def _realign(self) -> set[int]:
        """Bring the own results into line with the session's cases after cases were added,
        removed or moved: each case keeps its last result, a new one is derived now (its
        index is returned)."""
        known = {id(result.case): result for result in self._own}
        kept = [known.get(id(case)) for case in self.session.cases]
        self._own = [result if result is not None
                     else evaluate_case(self.session, case, keep_steps=False)
                     for result, case in zip(kept, self.session.cases)]
        self._case_revision = [self.revision] * len(self._own)
        self._extras = None
        self._with_steps.clear()
        self._pending.clear()
        return {index for index, result in enumerate(kept) if result is None}

    def _derive_now(self, indices: Iterable[int]) -> None:
        """Derive the own cases ``indices`` on this thread."""
        cases = self.session.cases
        self._keep((index, evaluate_case(self.session, cases[index], keep_steps=False))
                   for index in indices)

    def _keep(self, results: Iterable[tuple[int, CaseResult]]) -> None:
        """Put current results of own cases in place (in the analysis too, when worked out)."""
        listed = self._extras.cases if self._extras is not None else None
        for index, result in results:
            self._own[index] = result
            if listed is not None:
                listed[index] = result
            self._pending.discard(index)

    def rederivation(self, near: int = 0) -> Rederivation | None:
        """The pending cases to derive on another thread, nearest to case ``near`` first (the
        rows on show), or None when nothing is pending; hand the results to :meth:`take`."""
        if not self._pending:
            return None
        session = self.session
        snapshot = Session(targets=replace(session.targets),
                           bearings=[replace(bearing, texts=dict(bearing.texts))
                                     for bearing in session.bearings])
        order = sorted(self._pending, key=lambda index: (abs(index - near), index))
        return Rederivation(snapshot, tuple((index, self._case_revision[index],
                                             session.cases[index]) for index in order))

    def take(self, derived: Iterable[Derived]) -> int:
        """Keep the results of a :meth:`rederivation` that are still current (the case is
        pending and its inputs have not changed since it was asked for); how many were kept."""
        cases = self.session.cases
        kept = [item for item in derived
                if item.index in self._pending and self._case_revision[item.index] == item.stamp]
        for item in kept:
            item.result.case = cases[item.index]  # the session's own, not the worker's copy
        self._keep((item.index, item.result) for item in kept)
        return len(kept)

    def _extras_reach(self, touch: Touch) -> bool:
        """Whether shafts, generated cases or duty cycles can depend on what ``touch`` names:
        any of them after a change to everything, a shaft carried on a touched bearing, or a
        duty cycle naming a touched case (a case touched itself or through its bearing).
        Tables that do not read as written are worked out again on any change."""
        reserved = self.session.reserved
        shafts, cycles = reserved.get("shafts"), reserved.get("duty_cycles")
        if touch.everything:
            return bool(shafts or cycles)
        if shafts:
            if not isinstance(shafts, list):
                return True
            carried = {table.get(side) for table in shafts if isinstance(table, dict)
                       for side in ("bearing_a", "bearing_b")}
            if carried & set(touch.bearings):
                return True
        if not cycles:
            return False
        named = _cases_named_by(cycles)
        if named is None:
            return True
        cases = self.session.cases
        touched = {cases[index].name for index in touch.cases if 0 <= index < len(cases)}
        touched |= {case.name for case in cases if case.bearing in touch.bearings}
        return bool(named & touched)

    # ---- undo ---------------------------------------------------------------------------
    def _swap(self, source: list[Step], target: list[Step]) -> Undone | None:
        if not source:
            return None
        step = source.pop()
        inverse = step.inverse.apply(self.session)
        target.append(Step(step.label, inverse, step.case_index, None))
        self.solved = None
        self._run = None
        self._changed(step.inverse.touch, step.case_index)
        return Undone(step.label, step.case_index)

    def undo(self) -> Undone | None:
        """Undo the last step; what it was, or None when there is nothing to undo."""
        return self._swap(self._undo, self._redo)

    def redo(self) -> Undone | None:
        """Redo the last undone step; what it was, or None."""
        return self._swap(self._redo, self._undo)

    def end_run(self) -> None:
        """End the current run of keystrokes (enter, leaving the field, a nudge): the next
        edit starts a new undo step, and what is in force now is what a bad text falls back to."""
        self._run = None
        if self._undo and self._undo[-1].merge_key is not None:
            self._undo[-1] = self._undo[-1]._replace(merge_key=None)

    # ---- fields -------------------------------------------------------------------------
    def _owner(self, index: int, name: str) -> tuple[str, int | str, dict[str, str]] | None:
        """Where field ``name`` of case ``index`` is written: ("case", index, texts) or
        ("bearing", name, texts); None when the case or its bearing is missing."""
        case = self.case(index)
        if case is None:
            return None
        if name in BEARING_FIELDS:
            bearing = self.session.bearing(case.bearing)
            return None if bearing is None else ("bearing", bearing.name, bearing.texts)
        return ("case", index, case.texts)

    def set_field(self, index: int, name: str, text: str) -> str | None:
        """Write ``text`` into field ``name`` of case ``index`` if it is valid (a bearing field
        into the case's bearing, so even a case generated from a shaft takes those).

        None when written (or unchanged), else the message to show beside the field.  Valid
        means the unit edge reads it and the engine does not refuse the case because of this
        field; otherwise the value in force when the edit run began is put back.
        """
        if name not in FIELD_BY_NAME:
            return "unknown input"
        if name not in BEARING_FIELDS and (generated := self.generated_problem(index)) is not None:
            return generated  # a generated case's bearing fields are its bearing's: open
        owner = self._owner(index, name)
        if owner is None:
            return "no load case with a bearing is selected"
        kind, key, texts = owner
        run = self._run
        if run is None or run.case_index != index or run.field != name:
            self.end_run()
            run = self._run = _EditRun(index, name, texts.get(name))
        try:
            parse_field(name, text)
        except FieldError as exc:
            self._back_to_run_start(run)
            return exc.message
        if texts.get(name, "") == text:
            return None
        merge_key = ("edit", index, name)
        self.apply(SetText(kind, key, name, text),  # type: ignore[arg-type]
                   f"edit {FIELD_BY_NAME[name].label}", case_index=index, merge_key=merge_key)
        self._run = run
        result = self.result(index)
        if result is not None and result.derivation is None and \
                input_field(result.error_field) == name:
            message = result.error
            self._back_to_run_start(run)
            return message
        return None

    def _back_to_run_start(self, run: _EditRun) -> None:
        """Put back the text in force when the edit run began (dropping its undo step)."""
        top = self._undo[-1] if self._undo else None
        if top is not None and top.merge_key == ("edit", run.case_index, run.field):
            self._undo.pop()
            top.inverse.apply(self.session)
            self._changed(top.inverse.touch, run.case_index)
        self._run = run

    def nudge(self, index: int, name: str, factor: float) -> str | None:
        """Scale the number typed in field ``name`` of case ``index`` by ``factor``, its unit
        kept (one undo step), written with four significant figures (:data:`NUDGE_DIGITS`);
        None when done, else why not."""
        text = self.texts(index).get(name, "")
        scaled = scale_text(text, factor, digits=NUDGE_DIGITS)
        if scaled is None:
            return "no number to change in this field"
        self.end_run()
        problem = self.set_field(index, name, scaled)
        self.end_run()
        return problem

    # ---- cases --------------------------------------------------------------------------
    def _unique(self, stem: str, taken: set[str]) -> str:
        if stem not in taken:
            return stem
        number = 2
        while f"{stem} {number}" in taken:
            number += 1
        return f"{stem} {number}"

    def case_names(self) -> set[str]:
        """Every case name in use (own and generated)."""
        return {result.case.name for result in self.results}

    def add_case(self, after: int) -> int:
        """Add an empty case after case ``after`` (on its bearing); the new case's index."""
        own = len(self.session.cases)
        index = min(after + 1, own) if 0 <= after else own
        edits: list[Edit] = []
        case = self.case(after)
        bearing = case.bearing if case is not None and self.session.bearing(case.bearing) \
            else (self.session.bearings[0].name if self.session.bearings else None)
        if bearing is None:
            bearing = "Bearing 1"
            edits.append(Insert("bearings", 0, Bearing(bearing, dict(DEFAULT_BEARING_TEXTS))))
        name = self._unique(f"Case {own + 1}", self.case_names())
        edits.append(Insert("cases", index, LoadCase(name, bearing)))
        self.apply(Together(tuple(edits)), "add case", case_index=index)
        return index

    def duplicate_case(self, index: int) -> int | None:
        """Copy case ``index`` (a generated one gives an editable copy) after the session's
        own cases it follows; the copy's index, or None."""
        case = self.case(index)
        if case is None:
            return None
        notes = "" if is_generated(case) else case.notes
        copy = LoadCase(self._unique(f"{case.name} copy", self.case_names()), case.bearing,
                        dict(case.texts), notes)
        at = min(index + 1, len(self.session.cases))
        self.apply(Insert("cases", at, copy), "duplicate case", case_index=at)
        return at

    def case_name_problem(self, index: int, name: str) -> str | None:
        """Why ``name`` cannot name case ``index``, or None."""
        if (generated := self.generated_problem(index)) is not None:
            return generated
        case = self.case(index)
        return name_problem(name, self.case_names(), case.name if case else None)

    def rename_case(self, index: int, name: str) -> str | None:
        """Rename case ``index``; None when done, else why not."""
        case = self.case(index)
        if case is None:
            return "no load case is selected"
        problem = self.case_name_problem(index, name)
        if problem is not None:
            return problem
        if name.strip() != case.name:
            self.apply(RenameCase(index, name.strip()), "rename case", case_index=index)
        return None

    def delete_problem(self, index: int) -> str | None:
        """Why case ``index`` cannot be deleted (a duty cycle has it as a state), or None."""
        case = self.case(index)
        if case is None:
            return None
        cycles = sorted({str(cycle.get("name", "")) for cycle, state
                         in state_tables(self.session.reserved.get("duty_cycles"))
                         if state.get("case") == case.name})
        if not cycles:
            return None
        return (f"{case.name} is a state of duty cycle {', '.join(cycles)}: take it out of the "
                "cycle first (alt+y)")

    def delete_case(self, index: int) -> str | None:
        """Delete own case ``index`` (undoable); its name, or None for none, a generated one or
        one a duty cycle has as a state (:meth:`delete_problem` says why)."""
        case = self.case(index)
        if case is None or index >= len(self.session.cases) or self.delete_problem(index):
            return None
        self.apply(Remove("cases", index), f"delete case {case.name}",
                   case_index=min(index, len(self.session.cases) - 2))
        return case.name

    def move_problem(self, index: int, delta: int) -> str | None:
        """Why case ``index`` cannot move up (−1) or down (+1), or None when it can."""
        case = self.case(index)
        if case is None:
            return "no load case is selected"
        if (generated := self.generated_problem(index)) is not None:
            return generated
        own = len(self.session.cases)
        if 0 <= index + delta < own:
            return None
        if delta < 0:
            return f"{case.name} is the first case already"
        if own < len(self.results):
            return (f"{case.name} is the last of the session's own cases; the cases made from "
                    "shafts stay below them")
        return f"{case.name} is the last case already"

    def move_case(self, index: int, delta: int) -> int | None:
        """Move own case ``index`` up (−1) or down (+1); its new index, or None at the end."""
        target = index + delta
        own = len(self.session.cases)
        if not (0 <= index < own and 0 <= target < own):
            return None
        self.apply(MoveCase(index, target), "move case", case_index=target)
        return target

    def choose_bearing(self, index: int, bearing_name: str) -> str | None:
        """Let case ``index`` use another bearing of the session; a message if it can't."""
        case = self.case(index)
        if case is None:
            return "no load case is selected"
        if (generated := self.generated_problem(index)) is not None:
            return generated
        if self.session.bearing(bearing_name) is None:
            return f"no bearing called {bearing_name!r}"
        if case.bearing != bearing_name:
            self.apply(SetCaseBearing(index, bearing_name), f"use bearing {bearing_name}",
                       case_index=index)
        return None

    # ---- bearings -----------------------------------------------------------------------
    def bearing_names(self) -> set[str]:
        """Every bearing name in use."""
        return {bearing.name for bearing in self.session.bearings}

    def add_bearing(self, like: str | None = None) -> str:
        """Add a bearing (a copy of the one called ``like``, else a deep-groove one with no
        ratings yet); its name."""
        source = self.session.bearing(like) if like else None
        stem = f"{source.name} copy" if source else f"Bearing {len(self.session.bearings) + 1}"
        name = self._unique(stem, self.bearing_names())
        texts = dict(source.texts) if source else dict(DEFAULT_BEARING_TEXTS)
        bearing = Bearing(name, texts, source.notes if source else "",
                          source.designation if source else "", source.source if source else "",
                          dict(source.geometry) if source else {})
        self.apply(Insert("bearings", len(self.session.bearings), bearing), f"add bearing {name}")
        return name

    def rename_bearing(self, old: str, new: str) -> str | None:
        """Rename a bearing, and every case and shaft naming it; None when done, else why not."""
        if self.session.bearing(old) is None:
            return f"no bearing called {old!r}"
        problem = name_problem(new, self.bearing_names(), old)
        if problem is None and new.strip() != old:
            self.apply(RenameBearing(old, new.strip()), f"rename bearing {old}")
        return problem

    def delete_bearing(self, name: str) -> str | None:
        """Delete a bearing no case uses; None when done, else why not (naming the cases)."""
        index = next((i for i, b in enumerate(self.session.bearings) if b.name == name), None)
        if index is None:
            return f"no bearing called {name!r}"
        users = [result.case.name for result in self.results if result.case.bearing == name]
        if users:
            shown = ", ".join(users[:4]) + (f" and {len(users) - 4} more" if len(users) > 4 else "")
            return f"bearing {name} is used by {shown}"
        self.apply(Remove("bearings", index), f"delete bearing {name}")
        return None

    def adopt_bearing(self, bearing_name: str, texts: dict[str, str], *, designation: str,
                      source: str, geometry: dict[str, str] | None = None) -> str | None:
        """Give a bearing the field texts of a catalog or rated bearing, with its designation
        and source kept (one undo step; a blank text clears the field); None, or why not.

        ``geometry`` is the rated bearing's internal geometry; the geometry the bearing held
        is cleared either way (it described the bearing these data replace)."""
        held = self.session.bearing(bearing_name)
        if held is None:
            return f"no bearing called {bearing_name!r} in this session"
        edits: list[Edit] = [SetText("bearing", bearing_name, name, text.strip() or None)
                             for name, text in texts.items()]
        new_geometry = {name: text.strip() for name, text in (geometry or {}).items()
                        if name in GEOMETRY_KEYS and text.strip()}
        edits += [SetText("geometry", bearing_name, name, new_geometry.get(name))
                  for name in GEOMETRY_KEYS
                  if held.geometry.get(name) != new_geometry.get(name)]
        edits.append(SetBearingOrigin(bearing_name, designation, source))
        self.apply(Together(tuple(edits)), f"adopt {designation} as bearing {bearing_name}")
        self.end_run()
        return None

    def set_geometry(self, bearing_name: str, name: str, text: str) -> str | None:
        """Write one text of a bearing's internal geometry (blank removes it; one undo step);
        None when written or unchanged, else why not."""
        from .internal_form import input_problem  # the internal analysis loads on first use

        bearing = self.session.bearing(bearing_name)
        if bearing is None:
            return f"no bearing called {bearing_name!r} in this session"
        if name not in GEOMETRY_KEYS:
            return f"{name!r} is not a geometry input"
        if (problem := input_problem(name, text)) is not None:
            return problem
        new = text.strip() or None
        if bearing.geometry.get(name) != new:
            self.apply(SetText("geometry", bearing_name, name, new),
                       f"edit the geometry of bearing {bearing_name}")
        return None

    # ---- shafts and duty cycles (tables kept as typed) -------------------------------------
    def tables(self, name: str) -> list[dict[str, Any]]:
        """The session's ``shafts`` or ``duty_cycles`` tables as typed (a copy to read)."""
        value = self.session.reserved.get(name)
        return copy.deepcopy(value) if isinstance(value, list) else []

    def _set_tables(self, name: str, tables: list[dict[str, Any]], label: str, *,
                    merge_key: tuple[str, int, str] | None = None) -> None:
        self.apply(SetTable(name, tables or None), label, merge_key=merge_key)

    def set_table_text(self, name: str, index: int, where: tuple[str | int, ...], key: str,
                       text: str, *, words: TableWords | None = None) -> None:
        """Set one text of table ``index`` of ``name`` (``where`` leads into it: () for the
        table itself, ("elements", 2) for its third element, ("case_fields",) …).

        Kept as typed, as in the file: a text that cannot be read is named by the analysis
        (the shaft or cycle then gives no cases or life) until it is put right.  Keystrokes in
        one text merge into one undo step, labelled in the editor's ``words`` (else by the
        file's key) as the text reads after the last of them."""
        tables = self.tables(name)
        target: Any = tables[index]
        for step in where:
            target = target.setdefault(step, {}) if isinstance(step, str) else target[step]
        if target.get(key, "") == text:
            return
        if text:
            target[key] = text
        else:
            target.pop(key, None)
        run_key = ".".join(map(str, (name, index, *where, key)))
        label = "edit " + self._table_key_words(tables, name, index, (*where, key), words)
        self._set_tables(name, tables, label, merge_key=("table", index, run_key))

    def _table_key_words(self, tables: list[dict[str, Any]], name: str, index: int,
                         where: tuple[str | int, ...], words: TableWords | None) -> str:
        """A place in table ``index`` of ``name`` as the undo list says it: in ``words``
        (``table_words.key_in_words``), else by its key in the file (1-based, as the analysis
        names it: ``shafts[1].states[4].name``)."""
        key = f"{name}[{index + 1}]"
        for step in where:
            key += f"[{step + 1}]" if isinstance(step, int) else f".{step}"
        if words is None:
            return key
        return key_in_words(key, tables[index], words,
                            bearings=[bearing.name for bearing in self.session.bearings])

    def add_table(self, name: str, table: dict[str, Any]) -> int:
        """Add a shaft or duty cycle table; its index."""
        tables = self.tables(name)
        taken = {str(item.get("name", "")) for item in tables}
        table = dict(table, name=self._unique(str(table.get("name", "")), taken))
        tables.append(table)
        self._set_tables(name, tables, f"add {name[:-1].replace('_', ' ')} {quoted(table['name'])}")
        return len(tables) - 1

    def delete_table(self, name: str, index: int) -> None:
        """Delete a shaft or duty cycle table (undoable)."""
        tables = self.tables(name)
        removed = tables.pop(index)
        self._set_tables(name, tables,
                         f"delete {name[:-1].replace('_', ' ')} {quoted(removed.get('name', ''))}")

    def add_row(self, name: str, index: int, rows: str, row: dict[str, str], *,
                words: TableWords | None = None) -> int:
        """Add a row (an element or state) to table ``index``; the row's index.  The undo
        step names the row in the editor's ``words`` ("add Shaft 'X', operating state 4 'state
        4'")."""
        tables = self.tables(name)
        items = tables[index].setdefault(rows, [])
        if "name" in row:
            row = dict(row, name=self._unique(row["name"], {str(r.get("name", "")) for r in items}))
        items.append(row)
        number = len(items) - 1
        self._set_tables(name, tables,
                         "add " + self._table_key_words(tables, name, index, (rows, number), words))
        return number

    def delete_row(self, name: str, index: int, rows: str, row: int, *,
                   words: TableWords | None = None) -> None:
        """Delete row ``row`` of table ``index`` (undoable), named in the undo list as it
        read before."""
        tables = self.tables(name)
        label = "delete " + self._table_key_words(tables, name, index, (rows, row), words)
        del tables[index][rows][row]
        self._set_tables(name, tables, label)

    # ---- session details and targets ------------------------------------------------------
    def target_problem(self, name: str, text: str) -> str | None:
        """Why ``text`` cannot be the session's ``name`` target (life, reliability, s0), or None.

        Blank life or s0 means none; a blank reliability means the default 0.90."""
        from .session import parse_target

        try:
            if name == "reliability":
                parse_field("reliability", text or "0.90")
            else:
                parse_target(name, text)
        except FieldError as exc:
            return exc.message
        return None

    def set_details(self, details: dict[str, str], targets: dict[str, str]) -> dict[str, str]:
        """Set the session's details (title, project, engineer, revision, notes) and targets
        (life, reliability, s0) as one undo step; {name: message} for what cannot be read (and
        then nothing is changed)."""
        problems = {name: problem for name, text in targets.items()
                    if (problem := self.target_problem(name, text.strip())) is not None}
        if problems:
            return problems
        edits: list[Edit] = [SetSessionText(name, text) for name, text in details.items()
                             if getattr(self.session, name) != text]
        edits += [SetTarget(name, text.strip() or ("0.90" if name == "reliability" else ""))
                  for name, text in targets.items()
                  if getattr(self.session.targets, name) != text.strip()]
        if edits:
            self.apply(Together(tuple(edits)), "edit the session's details and targets")
        return {}

    def toggle_units(self) -> str:
        """Switch the display system between SI and US customary; the new one."""
        self.apply(SetUnits("US" if self.units == "SI" else "SI"), "switch units")
        return self.units

    # ---- solver -------------------------------------------------------------------------
    def question(self, index: int, unknown: str, target_text: str,
                 between: tuple[str, str] = ("", "")) -> Question:
        """The reverse question for case ``index``: back-solve ``unknown`` for a target like
        "Lnm=20000 h", searching the unknown's whole range or ``between`` two typed values;
        kept in the session as its solver setup (a target that was following the session's life
        target and is that target still follows it).

        Raises FieldError for a target that cannot be read and InputError when the case cannot
        be derived.  Solve it with :meth:`Question.solve` (on any thread) and hand the answer
        to :meth:`answer`.
        """
        from .targets import kept_solver_target, parse_between, parse_target_text

        result = self.result(index)
        if result is None:
            raise InputError("case", "no load case is selected")
        if result.inputs is None:
            raise InputError(result.error_field or "case", result.error or "the case has errors")
        target, value = parse_target_text(target_text)
        search = parse_between(unknown, between)
        solver = self.session.solver
        solver.target = kept_solver_target(self.session, target_text)
        solver.unknown, solver.case = unknown, result.case.name
        return Question(result.case.name, self.revision, result.inputs, unknown, target, value,
                        search)

    def answer(self, question: Question, solution: Solution) -> bool:
        """Keep ``solution`` as the answer to ``question``; False (and nothing kept) when the
        session has changed since the question was asked."""
        if question.revision != self.revision:
            return False
        self.solved = Solved(question.case_name, question.revision, solution)
        return True

    def solve(self, index: int, unknown: str, target_text: str) -> Solution:
        """Ask and answer at once (see :meth:`question`); raises NoSolution when no value of
        the unknown meets the target."""
        question = self.question(index, unknown, target_text)
        solution = question.solve()
        self.answer(question, solution)
        return solution

    @property
    def solved_is_current(self) -> bool:
        """Whether the last solution was found on the session as it is now."""
        return self.solved is not None and self.solved.revision == self.revision

    def _solved_texts(self, index: int, solution: Solution, current: float,
                      rounding: Rounding) -> dict[str, str]:
        """The typed texts that put the solved value into the case, units kept as typed."""
        texts = self.texts(index)
        if solution.unknown == "load_scale":
            scaled = {name: scale_text(texts.get(name, ""), solution.value, rounding)
                      for name in ("fr", "fa")}
            return {name: text for name, text in scaled.items() if text is not None}
        name = solution.unknown
        typed = leading_number(texts.get(name, ""))
        if typed and current > 0 and math.isfinite(current):
            scaled_text = scale_text(texts[name], solution.value / current, rounding)
            if scaled_text is not None:
                return {name: scaled_text}
        spec = FIELD_BY_NAME[name]
        if spec.kind == "quantity" and spec.quantity is not None:
            return {name: format_quantity(solution.value, spec.quantity, self.units,  # type: ignore[arg-type]
                                          digits=7)}
        return {name: number_text(solution.value, rounding)}

    def _meets(self, index: int, solution: Solution) -> bool:
        """Whether case ``index`` as it stands meets the solution's target (every target is a
        least value: a life or a static safety)."""
        result = self.result(index)
        if result is None or result.derivation is None:
            return False
        achieved = result.derivation.results.get(solution.target, math.nan)
        return achieved >= solution.target_value

    def apply_solution(self, index: int) -> str:
        """Write the last solved value into case ``index`` (one undo step); a line saying
        what changed.  Raises InputError when there is no current solution for that case.

        The value is written with seven figures, rounded the way that still meets the target
        (a load solved for 30 000 h is written so that the case gives at least 30 000 h)."""
        solved, case, result = self.solved, self.case(index), self.result(index)
        if solved is None:
            raise InputError("solve", "nothing solved yet: solve first")
        if case is None or result is None or case.name != solved.case_name:
            raise InputError("solve", f"the solution is for case {solved.case_name!r}: "
                                      "select it or solve again")
        if solved.revision != self.revision:
            raise InputError("solve", "the session has changed since this was solved: "
                                      "solve again")
        if result.inputs is None:
            raise InputError("solve", "the case has errors: solve again")
        if (generated := self.generated_problem(index)) is not None:
            raise InputError("solve", generated)
        solution = solved.solution
        current = 1.0 if solution.unknown == "load_scale" else float(
            getattr(result.inputs, solution.unknown))
        self.end_run()
        label = f"apply solved {UNKNOWNS[solution.unknown].label}"
        changed: dict[str, str] = {}
        for rounding in ("nearest", "down", "up"):
            changed = self._solved_texts(index, solution, current, rounding)
            if not changed:
                raise InputError("solve", "no typed value to change")
            edits = [SetText(owner[0], owner[1], name, text)  # type: ignore[arg-type]
                     for name, text in changed.items()
                     if (owner := self._owner(index, name)) is not None]
            self.apply(Together(tuple(edits)), label, case_index=index)
            if self._meets(index, solution):
                break
            self._swap(self._undo, [])  # this rounding misses the target: take it back
        self.solved = None  # applied once: solve again to apply again
        words = ", ".join(f"{FIELD_BY_NAME[n].label} = {t}" for n, t in changed.items())
        users = self.bearing_users(case.bearing)
        shared = any(n in BEARING_FIELDS for n in changed) and len(users) > 1
        return words + (f" (bearing {case.bearing}, used by {len(users)} cases)" if shared else "")

    # ---- files --------------------------------------------------------------------------
    def mark_saved(self, path: Path, stamp: FileStamp | None = None) -> None:
        """Record that the session as it is now was written to ``path`` (which then held
        ``stamp``)."""
        self.path, self.stamp = path, stamp
        self.saved_revision = self.revision

    def replace(self, session: Session, path: Path | None, *, dirty: bool = False) -> None:
        """Put another session under edit (an opened or recovered file); undo starts afresh."""
        self.session, self.path = session, path
        self.solved, self._run = None, None
        self._undo.clear()
        self._redo.clear()
        self.revision += 1
        self.saved_revision = -1 if dirty else self.revision
        self._derive_all()


__all__ = ["Derived", "Document", "Question", "Rederivation", "Solved", "Undone",
           "input_field", "name_problem"]
