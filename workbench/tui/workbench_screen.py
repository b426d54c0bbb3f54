"""The workbench screen: the load-case list across the top; under it the case form, and the
Derivation, Solver, What-if and Inside panes beside it.

The screen holds one :class:`~workbench.tui.view.View` (the document's revision and the selected
case); the list, the form and the panes follow it through ``data_bind`` and redraw themselves
from the document.  Every action here edits the document (:mod:`workbench.model.document`) and
then sets the view once: there is no list of panes to redraw by hand.

In a large session an edit that reaches more than :data:`DEFER_OVER` cases derives at once only
the case in the form and the rows on show (the list asks for each); the rest are derived by a
thread worker (:meth:`WorkbenchScreen._rederive`) once typing pauses for :data:`DERIVE_DELAY_S`,
so it never competes with drawing a key.  It hands results to the document every
:data:`HAND_OVER_S` and is cancelled by the next edit (results for an older revision of a case
are dropped by the document).  Nothing on show waits for it.
"""

from __future__ import annotations

import time
from collections.abc import Callable
from pathlib import Path
from typing import TYPE_CHECKING

from textual import on, work
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical
from textual.events import DescendantFocus, Resize
from textual.reactive import var
from textual.screen import Screen
from textual.timer import Timer
from textual.widgets import DataTable, Header, Static, TabbedContent, TabPane
from textual.worker import get_current_worker

from ..engine.record import InputError
from ..engine.solve import NoSolution, Solution
from ..model import files
from ..model.document import Derived, Document, Question, Rederivation
from ..model.fields import FieldError, in_force_words
from ..model.files import FileOutcome
from ..model.session import Session
from ..model.shafts import GENERATED_NOTE
from ..model.user_text import clipped_path, quoted
from .actions import bindings
from .case_form import WIDE, CaseForm
from .case_table import CaseTable
from .derivation_pane import DerivationPane
from .key_footer import KeyFooter
from .pane_lazy import PaneLazy
from .solver_pane import SolverPane
from .view import FittedText, View, fit_words

if TYPE_CHECKING:
    from ..model.safe_write import FileStamp
    from .selection_screen import Adoption

AUTOSAVE_DELAY_S = 2.0
DEFAULT_SAVE_NAME = "session.toml"
PANES = ("derivation", "solver", "whatif", "inside")
HELP_LINES = 2
"""The help line's most lines (the longest field help is two at 80 columns)."""
"""The right column's panes (their tab ids); the first is on show at start."""
APP_NAME = "Bearing workbench"
DEFER_OVER = 200
"""An edit derives at most this many cases before the screen draws again (about 10 ms); a
larger one leaves the rest to :meth:`WorkbenchScreen._rederive`."""
DERIVE_PART = 16
"""Cases the worker derives between two looks at whether it is still wanted (about 1 ms)."""
HAND_OVER_S = 0.05
"""How often the worker hands its results to the document."""
DERIVE_DELAY_S = 0.2
"""The pause in editing after which the worker starts (a key's frames are drawn by then)."""


class WorkbenchScreen(Screen[None]):
    """The main screen; every key action here comes from :data:`~workbench.tui.actions.ACTIONS`."""

    BINDINGS = [*bindings("screen"),
                Binding("escape", "focus_cases", "Case list", show=False)]

    HORIZONTAL_BREAKPOINTS = [(0, "-narrow"), (WIDE, "-wide")]
    """The screen's width class: long field labels from :data:`WIDE` columns."""

    view: var[View] = var(View(-1, -1), init=False)
    """The document's revision and the selected case: what every pane follows."""

    def __init__(self, document: Document,
                 autosave_delay: float | None = AUTOSAVE_DELAY_S) -> None:
        # The width class from the terminal's size now, so the first frame already has the
        # labels it keeps (Textual sets it on the first resize, a frame later; set at mount
        # instead, it restyled every widget of the form once more before the first frame).
        wide = self.app.size.width >= WIDE
        super().__init__(id="workbench", classes="-wide" if wide else "-narrow")
        self.document = document
        document.defer_over = DEFER_OVER
        self._autosave_delay = autosave_delay
        self._autosave_timer: Timer | None = None
        self._derive_timer: Timer | None = None
        self._help_text = ""
        self._autosave_failed = False

    def compose(self) -> ComposeResult:
        """The list across the screen; under it the form (left) and the panes as tabs (right);
        under both the help line, saying in full what the focus is on."""
        from .inside_pane import InsidePane
        from .whatif_pane import WhatIfPane

        document = self.document
        yield Header(show_clock=False, icon="≡")
        yield CaseTable(document, id="cases").data_bind(WorkbenchScreen.view)
        with Horizontal(id="body"):
            with Vertical(id="left"):
                yield CaseForm(document, id="editor").data_bind(WorkbenchScreen.view)
            with TabbedContent(id="panes", initial=PANES[0]):
                with TabPane("Derivation", id="derivation"):
                    yield DerivationPane(document, id="derivation-view").data_bind(
                        WorkbenchScreen.view)
                with TabPane("Solver", id="solver"):
                    yield PaneLazy(SolverPane(document, id="solver-view").data_bind(
                        WorkbenchScreen.view))
                with TabPane("What-if", id="whatif"):
                    yield PaneLazy(WhatIfPane(document, id="whatif-view").data_bind(
                        WorkbenchScreen.view))
                with TabPane("Inside", id="inside"):
                    yield PaneLazy(InsidePane(document, id="inside-view").data_bind(
                        WorkbenchScreen.view))
        yield Static("", id="help-line")
        yield KeyFooter()

    def on_mount(self) -> None:
        """Show the first case, with the focus in the list and the case named on the help line."""
        self.view = View(self.document.revision, 0 if self.document.results else -1)
        self.query_one(CaseTable).focus()
        self._help_for_case()

    # ---- following the document --------------------------------------------------------------
    @property
    def selected(self) -> int:
        """The index of the selected case (−1: none)."""
        return self.view.selected

    def _changed(self, selected: int | None = None) -> None:
        """The document changed (or the selection did): every pane follows from the new view."""
        count = len(self.document.results)
        index = self.view.selected if selected is None else selected
        index = max(0, min(index, count - 1)) if count else -1
        self.view = View(self.document.revision, index)

    def watch_view(self, old: View, new: View) -> None:
        """The title follows, and the help line unless it speaks of the field being typed in;
        a change to the document schedules the recovery copy."""
        self._title()
        if self.is_mounted and self.query_one(CaseForm).focused_field() is None:
            self._help_for_case()
        if new.revision != old.revision:
            self._derive_pending()
            if self.document.dirty:
                self._schedule_autosave()

    # ---- cases left pending by a large edit -------------------------------------------------
    def _derive_pending(self) -> None:
        """After an edit: stop a run of the worker, and start one on what is pending once
        editing pauses for :data:`DERIVE_DELAY_S`."""
        self.workers.cancel_group(self, "rederive")
        if self._derive_timer is not None:
            self._derive_timer.stop()
            self._derive_timer = None
        if self.document.pending:
            self._derive_timer = self.set_timer(DERIVE_DELAY_S, self._start_rederive)

    def _start_rederive(self) -> None:
        self._derive_timer = None
        job = self.document.rederivation(near=max(self.view.selected, 0))
        if job is not None:
            self._rederive(job)

    @work(thread=True, exclusive=True, group="rederive", description="pending cases")
    def _rederive(self, job: Rederivation) -> None:
        """Derive ``job``'s cases away from the screen's thread, :data:`DERIVE_PART` at a time,
        handing what is done to the list every :data:`HAND_OVER_S`."""
        worker = get_current_worker()
        done: list[Derived] = []
        handed = time.monotonic()
        for start in range(0, len(job.cases), DERIVE_PART):
            if worker.is_cancelled:
                return
            done += job.derive(start, start + DERIVE_PART)
            time.sleep(0)  # the screen's thread may take the interpreter between parts
            last = start + DERIVE_PART >= len(job.cases)
            if last or time.monotonic() - handed >= HAND_OVER_S:
                if worker.is_cancelled:
                    return
                self.app.call_from_thread(self._take, done)
                done, handed = [], time.monotonic()

    def _take(self, derived: list[Derived]) -> None:
        """Keep what the worker derived that is still current."""
        self.document.take(derived)

    def _title(self) -> None:
        document = self.document
        where = document.path.name if document.path else "not saved yet"
        mark = "● " if document.dirty else ""
        sub_title = f"{mark}{where} · {document.units}"
        room = self.app.size.width - len(sub_title) - 26  # the icon, the dash and margins
        self.app.sub_title = sub_title
        self.app.title = fit_words(document.session.title or APP_NAME, max(room, 8))

    def on_resize(self, event: Resize) -> None:
        """Fit the title to the new width."""
        self._title()

    # ---- messages from the panes ------------------------------------------------------------
    @on(CaseTable.Chosen)
    def _case_chosen(self, event: CaseTable.Chosen) -> None:
        """Move the form and the panes to the case under the list's cursor."""
        self.document.end_run()
        self._changed(event.index)
        self._help_for_case()

    @on(DataTable.RowSelected, "#cases")
    def _case_entered(self, event: DataTable.RowSelected) -> None:
        """Enter on a case goes to its inputs (as f4 does)."""
        event.stop()
        self.action_focus_editor()

    def _help_for_case(self) -> None:
        case = self.document.case(self.selected)
        text = "" if case is None else f"{case.name} · bearing {case.bearing}" + (
            f" · {case.notes}" if case.notes else "")
        self._say(text)

    def on_descendant_focus(self, event: DescendantFocus) -> None:
        """The focus left the form: the help line names the selected case again."""
        if self.query_one(CaseForm).focused_field() is None:
            self._help_for_case()

    @on(CaseForm.HelpShown)
    def _help_shown(self, event: CaseForm.HelpShown) -> None:
        self._say(event.text)

    def _say(self, text: str) -> None:
        """Put ``text`` on the help line: across the screen, on two lines at most, the words
        that do not fit left out between words with an ellipsis (case notes can be long)."""
        if text != self._help_text:  # an update lays the screen out again: only on a change
            self._help_text = text
            self.query_one("#help-line", Static).update(FittedText(text, lines=HELP_LINES))

    @on(CaseForm.Edited)
    def _field_edited(self, event: CaseForm.Edited) -> None:
        """Write a typed or chosen value, or show why it was not taken."""
        document, form = self.document, self.query_one(CaseForm)
        if event.field == "bearing":
            problem = document.choose_bearing(self.selected, event.text)
        else:
            problem = document.set_field(self.selected, event.field, event.text)
        if event.done:
            document.end_run()
        if problem is not None:
            in_force = document.texts(self.selected).get(event.field, "")
            form.answer(event.field, f"{problem} · {in_force_words(event.field, in_force)}")
        else:
            form.answer(event.field, None)
        self._changed()

    @on(CaseForm.TypingDone)
    def _typing_done(self) -> None:
        """Enter or leaving a field ends its edit run: the value now in force stands."""
        self.document.end_run()

    @on(SolverPane.SolveRequested)
    def _solve_requested(self, event: SolverPane.SolveRequested) -> None:
        self._solve(event.unknown, event.target_text, event.between)

    @on(SolverPane.ApplyRequested)
    def _apply_requested(self) -> None:
        self.action_apply_solution()

    # ---- actions (keys, footer and palette) -------------------------------------------------
    def _refuse_generated(self) -> bool:
        """Say so and refuse when the selected case is generated from a shaft (read-only)."""
        problem = self.document.generated_problem(self.selected)
        if problem is not None:
            self.notify(problem, severity="warning")
        return problem is not None

    def action_add_case(self) -> None:
        """Add an empty load case after the selected one (after the session's own cases when
        a generated one is selected: those follow their shafts), and select it."""
        document = self.document
        on_generated = document.generated_problem(self.selected) is not None
        index = document.add_case(self.selected)
        self._changed(index)
        name = document.case(index).name
        if on_generated:  # it cannot go among them: say where it went
            after = f"after {document.case(index - 1).name}" if index else "first"
            self.notify(f"Added {name} {after}, above the cases made from shafts: give its "
                        "loads in the form")
        else:
            self.notify(f"Added {name}: give its loads in the form")

    def action_duplicate_case(self) -> None:
        """Copy the selected load case."""
        index = self.document.duplicate_case(self.selected)
        if index is None:
            self.notify("No case to duplicate", severity="warning")
            return
        self._changed(index)

    def action_rename_case(self) -> None:
        """Ask for a new name for the selected case."""
        case = self.document.case(self.selected)
        if case is None:
            self.notify("No case to rename", severity="warning")
            return
        if self._refuse_generated():
            return
        from .dialogs import TextPrompt  # the dialogs load when the first one opens

        index = self.selected

        def renamed(name: str | None) -> None:
            if name is None:
                return
            problem = self.document.rename_case(index, name)
            if problem is not None:
                self.notify(problem, severity="warning")
            self._changed()

        self.app.push_screen(TextPrompt("Rename load case", case.name,
                                        lambda text: self.document.case_name_problem(index, text)),
                             renamed)

    def action_delete_case(self) -> None:
        """Delete the selected case (ctrl+z brings it back)."""
        if self._refuse_generated():
            return
        problem = self.document.delete_problem(self.selected)
        if problem is not None:
            self.notify(problem, severity="warning")
            return
        name = self.document.delete_case(self.selected)
        if name is None:
            self.notify("No case to delete", severity="warning")
            return
        self._changed()
        self.notify(f"Deleted {name} (ctrl+z brings it back)")

    def action_move_case(self, delta: int) -> None:
        """Move the selected case up or down the list, or say why it cannot move."""
        problem = self.document.move_problem(self.selected, delta)
        if problem is not None:
            self.notify(problem, severity="warning")
            return
        index = self.document.move_case(self.selected, delta)
        if index is not None:
            self._changed(index)

    def _undo_redo(self, step: Callable[[], object], verb: str, *, nothing: str) -> None:
        done = step()
        if done is None:
            self.notify(nothing, severity="warning")
            return
        self.query_one(CaseForm).drop_notes()
        self._changed(getattr(done, "case_index", None))
        self.app.clear_notifications()  # a run of undos shows the last, not a column over the panes
        self.notify(f"{verb}: {getattr(done, 'label', '')}")

    def action_undo(self) -> None:
        """Undo the last change."""
        self._undo_redo(self.document.undo, "Undone", nothing="Nothing to undo")

    def action_redo(self) -> None:
        """Redo what was undone."""
        self._undo_redo(self.document.redo, "Redone", nothing="Nothing to redo")

    def action_nudge(self, factor: float) -> None:
        """Scale the focused numeric field by ``factor`` (what-if), its unit kept."""
        name = self.query_one(CaseForm).focused_field()
        if name is None:
            self.notify("Put the focus on a number in the form first", severity="warning")
            return
        problem = self.document.nudge(self.selected, name, factor)
        if problem is not None:
            self.notify(problem, severity="warning")
        self._changed()

    def _solver(self) -> SolverPane | None:
        found = self.query(SolverPane)
        return found.first() if found else None

    def _solve(self, unknown: str, target_text: str,
               between: tuple[str, str] = ("", "")) -> None:
        self._show_pane("solver", focus=False)
        pane = self._solver()
        if pane is None:
            return
        try:
            question = self.document.question(self.selected, unknown, target_text, between)
        except (FieldError, InputError) as exc:
            pane.show_failure(exc.message, revision=self.document.revision)
            return
        pane.show_busy()
        self._answer(question)

    @work(thread=True, exclusive=True, group="solve")
    def _answer(self, question: Question) -> None:
        """Solve away from the screen's thread (a search over the unknown's whole range)."""
        try:
            solution: Solution | NoSolution | InputError = question.solve()
        except (NoSolution, InputError) as exc:
            solution = exc
        self.app.call_from_thread(self._answered, question, solution)

    def _answered(self, question: Question, outcome: Solution | NoSolution | InputError) -> None:
        pane = self._solver()
        if pane is None:
            return
        if isinstance(outcome, NoSolution | InputError):
            pane.show_failure(outcome.message, revision=question.revision)
        elif self.document.answer(question, outcome):
            pane.show_solution(question.case_name, outcome, self.document.units,
                               revision=question.revision)
        else:
            pane.show_note("The session changed while solving: solve again (f9).")

    def action_solve(self) -> None:
        """Back-solve the chosen input for the chosen target."""
        pane = self._solver()
        if pane is None:
            self._show_pane("solver")
            return
        self._solve(*pane.request())

    def action_apply_solution(self) -> None:
        """Write the solved value into its case (undoable)."""
        try:
            done = self.document.apply_solution(self.selected)
        except InputError as exc:
            self.notify(exc.message, severity="warning")
            return
        self._changed()
        if (pane := self._solver()) is not None:
            pane.show_note(f"Applied: {done} (ctrl+z undoes it)")
        self.notify(f"Applied {done}")

    def action_toggle_units(self) -> None:
        """Switch the display system between SI and US customary."""
        system = self.document.toggle_units()
        self._changed()
        self.notify(f"Results in {'US customary' if system == 'US' else 'SI'} units")

    def _show_pane(self, name: str, *, focus: bool = True) -> None:
        self.query_one(TabbedContent).active = name
        if focus:
            self.call_after_refresh(self._focus_pane, name)

    def _focus_pane(self, name: str) -> None:
        if name == "solver" and (pane := self._solver()) is not None:
            pane.focus_first()
        elif name in ("whatif", "inside"):
            found = self.query(f"#{name}-view")
            if found:
                found.first().focus()
        else:
            self.query_one(DerivationPane).focus()

    def action_show_pane(self, name: str) -> None:
        """Show a pane of the right column and put the focus in it."""
        self._show_pane(name)

    def action_select_from_catalog(self) -> None:
        """List the catalog bearings for every case on the selected case's bearing; adopt one."""
        from .selection_screen import SelectionScreen  # the catalog and its sweep load on first use

        document = self.document
        case = document.case(self.selected)
        if case is None:
            self.notify("No load case selected", severity="warning")
            return
        bearing = case.bearing

        def adopted(choice: Adoption | None) -> None:
            if choice is None:
                return
            problem = document.adopt_bearing(bearing, choice.texts,
                                             designation=choice.designation,
                                             source=getattr(choice, "source", ""),
                                             geometry=choice.geometry)
            if problem is not None:
                self.notify(problem, severity="warning")
                return
            self._changed()
            note = f"; {choice.note}" if choice.note else ""
            self.notify(f"Bearing {bearing} now has the data of {choice.designation}{note} "
                        "(ctrl+z undoes it)")

        users = [result for result in document.current_results()
                 if result.case.bearing == bearing]
        held = document.session.bearing(bearing)
        self.app.push_screen(SelectionScreen(bearing, users,
                                             bearing_texts=held.texts if held else None,
                                             system=document.units,
                                             bearing_geometry=held.geometry if held else None),
                             adopted)

    def action_manage_bearings(self) -> None:
        """Add, duplicate, rename or delete bearings; enter uses one for the selected case."""
        from .bearings_screen import BearingsScreen

        case = self.document.case(self.selected)
        index = self.selected

        def chosen(name: str | None) -> None:
            if name is not None and case is not None:
                problem = self.document.choose_bearing(index, name)
                if problem is not None:
                    self.notify(problem, severity="warning")
            self._changed()

        self.app.push_screen(BearingsScreen(self.document, case.bearing if case else None),
                             chosen)

    async def action_edit_session(self) -> None:
        """Edit the session's details and targets in one dialog (open, with the focus on the
        title, before the next key is handed on: ``Action.at_once``)."""
        from .session_screen import SessionScreen

        def closed(kept: bool | None) -> None:
            self._changed()
            if kept:
                self.notify("Session details and targets kept (ctrl+z undoes them)")

        await self.app.push_screen(SessionScreen(self.document), closed)

    async def _open_table(self, tables: str, index: int) -> None:
        from .shaft_editor import DutyEditor, ShaftEditor

        editor = ShaftEditor if tables == "shafts" else DutyEditor
        await self.app.push_screen(editor(self.document, index), lambda _: self._changed())

    async def action_edit_shaft(self) -> None:
        """Edit the shaft the selected case comes from, else the first; none: add one."""
        shafts = self.document.tables("shafts")
        if not shafts:
            await self.action_add_shaft()
            return
        shaft = self._generating_shaft()
        index = next((i for i, table in enumerate(shafts)
                      if str(table.get("name", "")) == shaft), 0)
        await self._open_table("shafts", index)

    def _generating_shaft(self) -> str | None:
        """The name of the shaft the selected case was generated from (None: an own case)."""
        case = self.document.case(self.selected)
        notes = case.notes if case is not None else ""
        return notes.removeprefix(GENERATED_NOTE) if notes.startswith(GENERATED_NOTE) else None

    async def action_add_shaft(self) -> None:
        """Add a shaft on the session's first two bearings and edit it."""
        from .shaft_editor import new_shaft

        if not self.document.session.bearings:
            self.document.add_bearing()
        index = self.document.add_table(
            "shafts", new_shaft([b.name for b in self.document.session.bearings]))
        self._changed()
        await self._open_table("shafts", index)

    async def action_edit_duty_cycle(self) -> None:
        """Edit the duty cycle over the selected case's bearing, else the first one.

        Never adds one (the palette's "Add a new duty cycle" does, asked): alt+y on a shaft's
        generated case once made a stray one-state cycle beside the shaft's own.  A shaft's
        cycle is worked out from its operating states and their shares, so for its cases, with
        no cycle of the session's on their bearing, the notice says to edit the shaft."""
        cycles = self.document.tables("duty_cycles")
        case = self.document.case(self.selected)
        names = {r.case.name for r in self.document.results
                 if case is not None and r.case.bearing == case.bearing}
        index = next((i for i, table in enumerate(cycles)
                      if any(state.get("case") in names for state in table.get("states", []))),
                     None)
        shaft = self._generating_shaft()
        if index is None and shaft is not None:
            self.notify(f"The duty cycle of shaft {quoted(shaft)} is worked out from its "
                        "operating states and their shares of time: alt+h edits them")
        elif index is None and not cycles:
            self.notify("No duty cycle yet: ctrl+p, \"Add a new duty cycle\" adds one over "
                        "this case")
        else:
            await self._open_table("duty_cycles", index or 0)

    async def action_add_duty_cycle(self) -> None:
        """Add a duty cycle over the selected case and edit it."""
        from .shaft_editor import new_duty_cycle

        case = self.document.case(self.selected)
        index = self.document.add_table("duty_cycles",
                                        new_duty_cycle([case.name] if case else []))
        self._changed()
        await self._open_table("duty_cycles", index)

    def action_add_bearing(self) -> None:
        """Add a bearing and show the session's bearings."""
        name = self.document.add_bearing()
        self._changed()
        self.notify(f"Added bearing {name}")
        self.action_manage_bearings()

    def action_write_report(self) -> None:
        """Write the session's report (format, file, preview)."""
        from .report_screen import ReportScreen

        if isinstance(self.app.screen, ReportScreen):
            return

        def written(path: Path | None) -> None:
            if path is not None:
                self.notify(f"Report written to {path}")

        self.app.push_screen(ReportScreen(self.document), written)

    def action_show_shafts(self) -> None:
        """Show the shafts, their bearing loads and free bodies, and the duty cycles."""
        from .shaft_editor import session_in_words  # loaded on first use, not at start
        from .shafts_screen import ShaftsScreen

        self.app.push_screen(ShaftsScreen(self.document.analysis, self.document.units,
                                          in_words=session_in_words(self.document)))

    def action_focus_cases(self) -> None:
        """Go to the load-case list."""
        self.query_one(CaseTable).focus()

    def action_focus_editor(self) -> None:
        """Go to the case form."""
        self.query_one(CaseForm).focus_first()

    # ---- files ------------------------------------------------------------------------------
    def save_to(self, path: Path, then: Callable[[], object] | None = None, *,
                confirmed: frozenset[str] = frozenset(), not_done: str = "") -> None:
        """Write the session to ``path`` and report what the writer said; when the file there
        is not a session, holds another one or changed on disk since it was read here, ask
        first (:meth:`_ask_before_saving`); ``then`` runs once it is saved, and a refusal says
        ``not_done`` (what ``then`` would have done) after its reason."""
        document = self.document
        outcome = files.save(document.session, path, read_stamp=document.stamp,
                             confirmed=confirmed)
        if outcome.question is not None:
            self._ask_before_saving(outcome, then, confirmed, not_done)
            return
        if outcome.error is not None:
            self.notify(f"{outcome.error}; {not_done}" if not_done else outcome.error,
                        title="Not saved", severity="error")
            return
        for saved_from in {document.path, path}:
            files.discard_recovery_copy(saved_from)
        if self._autosave_timer is not None:
            self._autosave_timer.stop()
            self._autosave_timer = None
        document.mark_saved(path, outcome.stamp)
        for message in outcome.messages:
            self.notify(message, title="Saved")
        if not outcome.messages:
            self.notify(f"Saved {path}")
        self._title()
        if then is not None:
            then()

    def save_as(self, then: Callable[[], object] | None = None, not_done: str = "") -> None:
        """Ask for a file name and save there."""
        from .dialogs import PathSuggester, TextPrompt

        current = self.document.path

        def chosen(text: str | None) -> None:
            if text and text.strip():
                self.save_to(Path(text.strip()).expanduser(), then, not_done=not_done)

        self.app.push_screen(
            TextPrompt("Save session as", str(current) if current else DEFAULT_SAVE_NAME,
                       lambda text: None if text.strip() else "a file name is needed",
                       suggester=PathSuggester()),
            chosen)

    def save(self, then: Callable[[], object] | None = None, not_done: str = "") -> None:
        """Save to the session's file, asking for one the first time; ``then`` runs once it
        is saved, and a refusal says ``not_done`` after its reason."""
        if self.document.path is None:
            self.save_as(then, not_done)
        else:
            self.save_to(self.document.path, then, not_done=not_done)

    def action_save(self) -> None:
        """Save the session."""
        self.save()

    def action_save_as(self) -> None:
        """Save the session under a new name."""
        self.save_as()

    def action_open(self) -> None:
        """Open another session file, or start a new one (asking first when there is unsaved
        work)."""
        from .dialogs import ChoiceDialog
        from .open_dialog import Opened, OpenDialog

        def chosen(opened: Opened | None) -> None:
            if opened is None:
                return
            if self.document.dirty:  # the changes were dropped: so is their recovery copy
                files.discard_recovery_copy(self.document.path)
            if opened.outcome is None:  # a new session: no file there yet
                self.open_session(Session(title=opened.path.stem), opened.path)
                self.notify(f"New session {opened.path.name}: ctrl+s writes it")
                return
            session = opened.outcome.session
            assert session is not None  # the dialog keeps a file it could not read
            self.open_session(session, opened.path, stamp=opened.outcome.stamp)

        def ask_path(answer: str | None = "discard") -> None:
            if answer == "save":  # the file to open is chosen once this session is saved
                self.save(then=ask_path, not_done=files.NOT_OPENED)
            elif answer == "discard":
                folder = str(self.document.path.parent) + "/" if self.document.path else ""
                self.app.push_screen(OpenDialog(folder), chosen)

        if self.document.dirty:
            self.app.push_screen(ChoiceDialog(files.UNSAVED_TITLE, *files.UNSAVED_BEFORE_OPEN),
                                 ask_path)
        else:
            ask_path()

    def _ask_before_saving(self, outcome: FileOutcome, then: Callable[[], object] | None,
                           confirmed: frozenset[str], not_done: str = "") -> None:
        """Ask the question ``outcome`` holds, then save as answered (``then`` runs once saved;
        a refusal says ``not_done``)."""
        from .dialogs import SaveQuestion

        assert outcome.question is not None and outcome.path is not None
        path, kind = outcome.path, outcome.question
        if isinstance(self.app.screen, SaveQuestion):
            return  # a second save in the same burst: the first question is still open

        def answered(answer: str | None) -> None:
            if answer == "replace":
                self.save_to(path, then, confirmed=confirmed | {kind}, not_done=not_done)
            elif answer == "elsewhere":
                self.save_as(then, not_done)

        backup = clipped_path(path.with_name(path.name + ".bak"))
        self.app.push_screen(SaveQuestion(kind, outcome.error or str(path), backup), answered)

    def open_session(self, session: Session, path: Path | None, dirty: bool = False, *,
                     stamp: FileStamp | None = None) -> None:
        """Put ``session`` under edit and show it; ``stamp`` is what its file held when read."""
        self.document.replace(session, path, dirty=dirty)
        self.document.stamp = stamp
        if (pane := self._solver()) is not None:
            pane.load()
            pane.show_note("")
        self.query_one(CaseForm).drop_notes()
        self._changed(0)

    # ---- recovery ---------------------------------------------------------------------------
    def _schedule_autosave(self) -> None:
        if self._autosave_delay is None:
            return
        if self._autosave_timer is not None:
            self._autosave_timer.stop()
        self._autosave_timer = self.set_timer(self._autosave_delay, self.autosave)

    def autosave(self) -> None:
        """Write the recovery copy now (called after a quiet spell following a change)."""
        self._autosave_timer = None
        problem = files.write_recovery_copy(self.document.session, self.document.path)
        if problem is not None and not self._autosave_failed:
            self._autosave_failed = True
            self.notify(problem, title="Recovery", severity="warning")
