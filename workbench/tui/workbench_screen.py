"""The workbench screen: load-case list, case editor, and the derivation and solver panes.

State lives in :class:`~workbench.tui.state.Workbench`; the panes announce what a person does
with messages, this screen asks the state to do it and tells each pane what to draw.  At 80×24
the list and the editor share the left column and the derivation, the solver and the what-if
share the right one as tabs (f5 / f6 / f11).
"""

from __future__ import annotations

from collections.abc import Callable
from pathlib import Path
from typing import TYPE_CHECKING

from textual import on
from textual.app import ComposeResult
from textual.containers import Horizontal, Vertical
from textual.screen import Screen
from textual.timer import Timer
from textual.widgets import ContentSwitcher

from ..engine.record import InputError
from ..engine.solve import NoSolution
from ..model.fields import FieldError
from ..model.session import Session
from . import files
from .actions import bindings
from .case_editor import CaseEditor
from .case_list import CaseList
from .derivation_pane import DerivationPane
from .key_footer import KeyFooter
from .pane_tabs import PaneTabs
from .solver_pane import SolverPane
from .state import Workbench, input_field
from .title_bar import TitleBar

if TYPE_CHECKING:
    from .selection_screen import Adoption
    from .whatif_pane import WhatIfPane

AUTOSAVE_DELAY_S = 2.0
DEFAULT_SAVE_NAME = "session.toml"
PANES = (("derivation", "Derivation"), ("solver", "Solver"), ("whatif", "What-if"))
"""The right column's panes: (name, title); the first is on show at start."""
PANE_PREFIX = "pane-"


class WorkbenchScreen(Screen[None]):
    """The main screen; every key action here comes from :data:`~workbench.tui.actions.ACTIONS`."""

    BINDINGS = bindings("screen")

    def __init__(self, workbench: Workbench, autosave_delay: float | None = AUTOSAVE_DELAY_S) -> None:
        super().__init__(id="workbench")
        self.workbench = workbench
        self._autosave_delay = autosave_delay
        self._autosave_timer: Timer | None = None
        self._autosave_failed = False
        self._saved_revision = workbench.revision
        self._solver_pane: SolverPane | None = None
        self._whatif_pane: WhatIfPane | None = None
        """The panes mounted just after the first frame (None until then)."""

    def compose(self) -> ComposeResult:
        """Left: the list over the editor; right: the pane strip over the Derivation, Solver
        and What-if panes (the last two mounted after the first frame)."""
        yield TitleBar()
        with Horizontal(id="body"):
            with Vertical(id="left"):
                yield CaseList(id="cases")
                yield CaseEditor(id="editor")
            with Vertical(id="panes"):
                yield PaneTabs(PANES, active=PANES[0][0], id="pane-tabs")
                with ContentSwitcher(initial=PANE_PREFIX + PANES[0][0], id="pane-switcher"):
                    with Vertical(id=PANE_PREFIX + "derivation"):
                        yield DerivationPane(id="derivation")
                    yield Vertical(id=PANE_PREFIX + "solver")
                    yield Vertical(id=PANE_PREFIX + "whatif")
        yield KeyFooter()

    def on_mount(self) -> None:
        """Draw the session; the hidden panes come after the first frame."""
        self.redraw_all()
        self.query_one(CaseList).focus()
        self.call_after_refresh(self._mount_hidden_panes)

    async def _mount_hidden_panes(self) -> None:
        """The Solver and What-if panes, off show at start, mounted once the first frame is
        painted; the What-if's module (the sensitivity sweep, the curves, the plots) is
        imported then."""
        from .whatif_pane import WhatIfPane

        solver = SolverPane(self.workbench.session.solver, id="solver")
        whatif = WhatIfPane(id="whatif")
        await self.query_one(f"#{PANE_PREFIX}solver").mount(solver)
        await self.query_one(f"#{PANE_PREFIX}whatif").mount(whatif)
        self._solver_pane, self._whatif_pane = solver, whatif  # in use once mounted
        self._show_whatif()

    # ---- drawing ----------------------------------------------------------------------------
    def _title(self) -> None:
        state = self.workbench
        self.app.title = state.session.title or "Bearing workbench"
        where = state.path.name if state.path else "not saved yet"
        mark = " ●" if state.dirty else ""
        self.app.sub_title = f"{where}{mark} · {state.units}"

    def _show_case(self) -> None:
        """The derivation and the editor's case error of the selected case."""
        state = self.workbench
        result = state.result
        self.query_one(DerivationPane).show(result, state.units)
        editor = self.query_one(CaseEditor)
        if result is None or result.derivation is not None:
            editor.show_case_error(None, None)
        else:
            editor.show_case_error(input_field(result.error_field), result.error)
        self._show_whatif()

    def _show_whatif(self) -> None:
        """The what-if of the selected case, worked out only while its tab is on show."""
        pane = self._whatif_pane
        if pane is None or self.query_one(PaneTabs).active != "whatif":
            return
        state = self.workbench
        pane.show(state.result, state.units, state.analysis.duties)

    def _show_pane(self, name: str) -> None:
        """Put the pane ``name`` on show in the right column (the what-if brought up to date)."""
        self.query_one(PaneTabs).active = name
        self.query_one(ContentSwitcher).current = PANE_PREFIX + name
        self._show_whatif()

    @on(PaneTabs.Chosen)
    def _pane_chosen(self, event: PaneTabs.Chosen) -> None:
        self._show_pane(event.name)

    def redraw_all(self) -> None:
        """Redraw every pane (after a structural change, an undo or an open)."""
        state = self.workbench
        self.query_one(CaseList).show(state.results, state.selected, state.units)
        self._load_editor()
        self._show_case()
        self._title()

    def _load_editor(self) -> None:
        state = self.workbench
        case = state.case
        editor = self.query_one(CaseEditor)
        editor.token += 1  # edits announced before this load belong to what was shown then
        bearing = case.bearing if case is not None else None
        editor.load(state.texts(), [b.name for b in state.session.bearings], bearing,
                    state.bearing_users(bearing) if bearing else 0)

    def _after_change(self) -> None:
        self._title()
        if self.workbench.revision != self._saved_revision:
            self._schedule_autosave()

    # ---- messages from the panes ------------------------------------------------------------
    @on(CaseList.Chosen)
    def _case_chosen(self, event: CaseList.Chosen) -> None:
        """Move the editor and the derivation to the case highlighted in the list."""
        if event.index == self.workbench.selected:
            return
        self.workbench.select(event.index)
        self._load_editor()
        self._show_case()

    @on(CaseEditor.Changed)
    def _field_changed(self, event: CaseEditor.Changed) -> None:
        """Check a typed value; write it and re-derive, or show why it was not taken."""
        editor = self.query_one(CaseEditor)
        if event.token != editor.token:
            return  # typed into what the editor showed before its last load
        state = self.workbench
        problem = state.set_text(event.field, event.text)
        if event.done:
            state.end_run()
        if problem is not None:
            in_force = state.texts().get(event.field, "")
            editor.reject(event.field, f"{problem} · in force: {in_force or '(blank)'}")
            self._show_case()
            self._refresh_rows()
            self._after_change()
            return
        editor.accept(event.field)
        self._refresh_rows()
        self._show_case()
        self._after_change()

    def _refresh_rows(self) -> None:
        """Redraw the list rows an edit of the selected case can touch (its bearing's cases)."""
        state = self.workbench
        case_list = self.query_one(CaseList)
        case = state.case
        for index, other in enumerate(state.session.cases):
            if other is case or (case is not None and other.bearing == case.bearing):
                case_list.show_row(index, state.results[index], state.units)

    @on(CaseEditor.Done)
    def _typing_done(self) -> None:
        """Enter or leaving a field ends its edit run: the value now in force stands."""
        self.workbench.end_run()

    @on(CaseEditor.BearingChosen)
    def _bearing_chosen(self, event: CaseEditor.BearingChosen) -> None:
        """Let the selected case use another bearing of the session."""
        problem = self.workbench.choose_bearing(event.name)
        if problem is not None:
            self.notify(problem, severity="warning")
            self._load_editor()  # show the bearing still in force
            return
        self.redraw_all()
        self._after_change()

    @on(SolverPane.SolveRequested)
    def _solve_requested(self, event: SolverPane.SolveRequested) -> None:
        """Solve from the pane's button or its value field."""
        self._solve(event.unknown, event.target_text)

    @on(SolverPane.ApplyRequested)
    def _apply_requested(self) -> None:
        """Apply from the pane's button."""
        self.action_apply_solution()

    # ---- actions (keys, footer and palette) -------------------------------------------------
    def action_add_case(self) -> None:
        """Add an empty load case after the selected one."""
        name = self.workbench.add_case()
        self.redraw_all()
        self._after_change()
        self.notify(f"Added {name}: give its loads in the editor")

    def action_duplicate_case(self) -> None:
        """Copy the selected load case."""
        name = self.workbench.duplicate_case()
        if name is None:
            self.notify("No case to duplicate", severity="warning")
            return
        self.redraw_all()
        self._after_change()

    def action_rename_case(self) -> None:
        """Ask for a new name for the selected case."""
        case = self.workbench.case
        if case is None:
            self.notify("No case to rename", severity="warning")
            return
        if self._refuse_generated():
            return

        from .dialogs import TextPrompt  # the dialogs load when the first one opens

        def renamed(name: str | None) -> None:
            if name is None:
                return
            problem = self.workbench.rename_case(name)
            if problem is not None:
                self.notify(problem, severity="warning")
                return
            self.redraw_all()
            self._after_change()

        self.app.push_screen(TextPrompt("Rename load case", case.name,
                                        self.workbench.name_problem), renamed)

    def _refuse_generated(self) -> bool:
        """Say so and refuse when the selected case is generated from a shaft (read-only)."""
        problem = self.workbench.generated_problem()
        if problem is not None:
            self.notify(problem, severity="warning")
        return problem is not None

    def action_delete_case(self) -> None:
        """Delete the selected case (ctrl+z brings it back)."""
        if self._refuse_generated():
            return
        name = self.workbench.delete_case()
        if name is None:
            self.notify("No case to delete", severity="warning")
            return
        self.redraw_all()
        self._after_change()
        self.notify(f"Deleted {name} (ctrl+z brings it back)")

    def action_move_case(self, delta: int) -> None:
        """Move the selected case up or down the list."""
        if self._refuse_generated():
            return
        if self.workbench.move_case(delta):
            self.redraw_all()
            self._after_change()

    def _undo_redo(self, step: Callable[[], str | None], verb: str) -> None:
        label = step()
        if label is None:
            self.notify(f"Nothing to {verb.lower()}", severity="warning")
            return
        self.redraw_all()
        if (pane := self._solver_pane) is not None:
            pane.show_note("")
        self._after_change()
        self.notify(f"{verb}: {label}")

    def action_undo(self) -> None:
        """Undo the last change."""
        self._undo_redo(self.workbench.undo, "Undone")

    def action_redo(self) -> None:
        """Redo what was undone."""
        self._undo_redo(self.workbench.redo, "Redone")

    def action_nudge(self, factor: float) -> None:
        """Scale the focused numeric field by ``factor`` (what-if), its unit kept."""
        self.workbench.end_run()
        problem = self.query_one(CaseEditor).nudge(factor)
        if problem is not None:
            self.notify(problem, severity="warning")

    def _solve(self, unknown: str, target_text: str) -> None:
        pane = self._solver_pane
        if pane is None:
            return
        self._show_pane("solver")
        state = self.workbench
        try:
            solution = state.solve(unknown, target_text)
        except NoSolution as exc:
            pane.show_failure(exc.message, exc.reachable)
        except (FieldError, InputError) as exc:
            pane.show_failure(exc.message)
        else:
            case = state.case
            pane.show_solution(case.name if case else "", solution, state.units)
        self._after_change()

    def action_solve(self) -> None:
        """Back-solve the chosen input for the chosen target."""
        pane = self._solver_pane
        if pane is not None:
            self._solve(*pane.request())

    def action_apply_solution(self) -> None:
        """Write the solved value into its case (undoable)."""
        try:
            done = self.workbench.apply_solution()
        except InputError as exc:
            self.notify(exc.message, severity="warning")
            return
        self.redraw_all()
        if (pane := self._solver_pane) is not None:
            pane.show_note(f"Applied: {done} (ctrl+z undoes it)")
        self._after_change()
        self.notify(f"Applied {done}")

    def action_toggle_units(self) -> None:
        """Switch the display system between SI and US customary."""
        system = self.workbench.toggle_units()
        self.redraw_all()
        self._after_change()
        self.notify(f"Results in {'US customary' if system == 'US' else 'SI'} units")

    def action_show_pane(self, name: str) -> None:
        """Show the derivation or the solver in the right column."""
        self._show_pane(name)

    def action_select_from_catalog(self) -> None:
        """List the catalog bearings for every case on the selected case's bearing; adopt one."""
        from .selection_screen import SelectionScreen  # the catalog and its sweep load on first use

        state = self.workbench
        case = state.case
        if case is None:
            self.notify("No load case selected", severity="warning")
            return
        bearing = case.bearing

        def adopted(choice: Adoption | None) -> None:
            if choice is None:
                return
            problem = state.adopt_bearing(choice.texts, choice.designation)
            if problem is not None:
                self.notify(problem, severity="warning")
                return
            self.redraw_all()
            self._after_change()
            self.notify(f"Bearing {bearing} now has the data of {choice.designation} "
                        "(ctrl+z undoes it)")

        users = [result for result in state.results if result.case.bearing == bearing]
        held = state.session.bearing(bearing)
        self.app.push_screen(SelectionScreen(bearing, users,
                                             bearing_texts=held.texts if held else None,
                                             system=state.units), adopted)

    def action_show_shafts(self) -> None:
        """Show the shafts, their bearing loads and free bodies, and the duty cycles."""
        from .shafts_screen import ShaftsScreen  # loaded on first use, not at start

        self.app.push_screen(ShaftsScreen(self.workbench.analysis, self.workbench.units))

    def action_focus_cases(self) -> None:
        """Go to the load-case list."""
        self.query_one(CaseList).focus()

    def action_focus_editor(self) -> None:
        """Go to the case editor."""
        self.query_one(CaseEditor).focus_first()

    # ---- files ------------------------------------------------------------------------------
    def save_to(self, path: Path, then: Callable[[], object] | None = None) -> None:
        """Write the session to ``path`` and report what the writer said."""
        outcome = files.save(self.workbench.session, path)
        if outcome.error is not None:
            self.notify(outcome.error, title="Not saved", severity="error")
            return
        for saved_from in {self.workbench.path, path}:
            files.discard_recovery_copy(saved_from)
        if self._autosave_timer is not None:
            self._autosave_timer.stop()
            self._autosave_timer = None
        self.workbench.mark_saved(path)
        self._saved_revision = self.workbench.revision
        for message in outcome.messages:
            self.notify(message, title="Saved")
        if not outcome.messages:
            self.notify(f"Saved {path}")
        self._title()
        if then is not None:
            then()

    def save_as(self, then: Callable[[], object] | None = None) -> None:
        """Ask for a file name and save there."""
        from .dialogs import TextPrompt

        current = self.workbench.path

        def chosen(text: str | None) -> None:
            if text:
                self.save_to(Path(text).expanduser(), then)

        self.app.push_screen(
            TextPrompt("Save session as", str(current) if current else DEFAULT_SAVE_NAME,
                       lambda text: None if text.strip() else "a file name is needed"),
            chosen)

    def save(self, then: Callable[[], object] | None = None) -> None:
        """Save to the session's file, asking for one the first time."""
        if self.workbench.path is None:
            self.save_as(then)
        else:
            self.save_to(self.workbench.path, then)

    def action_save(self) -> None:
        """Save the session."""
        self.save()

    def action_save_as(self) -> None:
        """Save the session under a new name."""
        self.save_as()

    def action_open(self) -> None:
        """Open another session file (asking first when there is unsaved work)."""
        from .dialogs import ChoiceDialog, TextPrompt

        def chosen(text: str | None) -> None:
            if not text:
                return
            outcome = files.open_session(Path(text).expanduser())
            if outcome.session is None:
                self.notify(outcome.error or "not opened", title="Not opened", severity="error")
                return
            self.open_session(outcome.session, outcome.path)

        def ask_path(answer: str | None = "discard") -> None:
            if answer == "discard":
                self.app.push_screen(TextPrompt("Open session file", "",
                                                lambda t: None if t.strip() else "a file name is needed"),
                                     chosen)

        if self.workbench.dirty:
            self.app.push_screen(ChoiceDialog(
                "Unsaved changes", "Open another file and drop the changes made here?",
                [("discard", "Drop changes and open"), ("stay", "Stay")]), ask_path)
        else:
            ask_path()

    def open_session(self, session: Session, path: Path | None, dirty: bool = False) -> None:
        """Put ``session`` under edit and redraw."""
        self.workbench.replace_session(session, path, dirty)
        self._saved_revision = -1 if dirty else self.workbench.revision
        if (pane := self._solver_pane) is not None:
            pane.load(session.solver)
            pane.show_note("")
        self.redraw_all()

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
        problem = files.write_recovery_copy(self.workbench.session, self.workbench.path)
        if problem is not None and not self._autosave_failed:
            self._autosave_failed = True
            self.notify(problem, title="Recovery", severity="warning")
