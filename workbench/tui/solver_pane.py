"""The solver pane: which input to back-solve, which result must reach which value, and what
the solver found (value, residual, evaluations, bracket, branch) or why nothing meets the target.

The pane asks with :class:`SolverPane.SolveRequested` / :class:`SolverPane.ApplyRequested`; the
screen solves (in a worker, through the document) and hands the outcome back to
:meth:`SolverPane.show_solution` or :meth:`SolverPane.show_failure`.  An answer belongs to the
revision it was solved on: the pane follows :attr:`SolverPane.view` and marks it out of date as
soon as anything changes.
"""

from __future__ import annotations

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, VerticalScroll
from textual.content import Content
from textual.message import Message
from textual.reactive import var
from textual.widgets import Button, Input, Label, Select, Static

from ..engine.record import fmt, with_unit
from ..engine.solve import TARGETS, UNKNOWNS, Solution
from ..model.document import Document
from ..model.quantities import format_quantity
from ..model.targets import FOLLOWED_RESULT, solver_target
from .choice_box import ChoiceBox
from .view import View, view_reactive

UNKNOWN_QUANTITY = {"N": "force", "r/min": "speed"}
TARGET_EXAMPLE = {"h": "20000 h", "10⁶ rev": "900 Mrev", "": "2"}


def unknown_value_text(name: str, value: float, system: str) -> str:
    """A solved value in the display system (forces and speeds), else as a plain number."""
    quantity = UNKNOWN_QUANTITY.get(UNKNOWNS[name].unit)
    if quantity is None:
        return fmt(value, 6)
    return format_quantity(value, quantity, system, digits=6)  # type: ignore[arg-type]


def solution_content(case_name: str, solution: Solution, system: str) -> Content:
    """What the solver found, line by line."""
    spec = UNKNOWNS[solution.unknown]
    unit = TARGETS[solution.target][1]
    low, high = solution.bracket
    lines = [
        Content.styled(f"Solved for case {case_name}", "bold"),
        Content.assemble(f"{spec.label} = ",
                         (unknown_value_text(solution.unknown, solution.value, system),
                          "bold $text-success")),
        Content(f"{solution.target} reached: {with_unit(fmt(solution.achieved, 6), unit)}"),
        Content(f"relative residual: {solution.residual:.2e}"),
        Content(f"evaluations: {solution.evaluations}"),
        Content(f"bracket: {unknown_value_text(solution.unknown, low, system)} … "
                f"{unknown_value_text(solution.unknown, high, system)}"),
        Content(f"branch: {solution.branch}"),
    ]
    if len(solution.roots) > 1:  # the smallest is shown; say where else the target is met
        others = ", ".join(unknown_value_text(solution.unknown, root, system)
                           for root in solution.roots[1:])
        lines.append(Content.styled(f"also meets the target at {others}",
                                    "bold $text-warning on $warning-muted"))
    lines.append(Content.styled("f10 (or Apply) writes the value into the case; ctrl+z undoes it.",
                                "italic"))
    return Content("\n").join(lines)


def failure_content(message: str) -> Content:
    """Why no value was found (the engine's message states the range the result can reach)."""
    return Content.styled("✘ " + message, "bold $text-error on $error-muted")


WHOLE_RANGE = "The range the unknown is searched in; blank: its whole range"
"""What the two search boxes mean (their placeholders are one word: each has 13 columns at 80)."""
FOLLOWS_SESSION = ("The session's life target (alt+i) until you give another; "
                   "a value typed here is kept with the session when you solve")
"""What the target value box holds."""


class SolverPane(VerticalScroll):
    """Choose the unknown and the target; see the solution or the reason there is none.
    ↑/↓ move between its fields as they do in the case form (a choice opens with enter)."""

    BINDINGS = [
        Binding("down", "app.focus_next", "Next field", show=False),
        Binding("up", "app.focus_previous", "Previous field", show=False),
    ]

    DEFAULT_CSS = """
    SolverPane {
        height: 1fr;
        padding: 0 1;
        & FieldRow { height: 1; }
        & .field-label { width: 12; color: $text-muted; }
        & FieldRow > Select, & FieldRow > Input { width: 1fr; }
        #solver-buttons { height: 1; margin: 1 0; }
        #solver-buttons Button { margin-right: 2; }
        #solver-result { width: 1fr; }
        #solver-stale { display: none; color: $text-warning; background: $warning-muted; }
        #solver-stale.-shown { display: block; }
    }
    """

    view: var[View] = view_reactive()
    """The document's revision and the selected case (bound to the screen's)."""

    class SolveRequested(Message):
        """Solve ``unknown`` so that the target text ("Lnm=20000 h") is met, searching
        ``between`` two typed values (blank: the unknown's whole range)."""

        def __init__(self, unknown: str, target_text: str, between: tuple[str, str]) -> None:
            super().__init__()
            self.unknown = unknown
            self.target_text = target_text
            self.between = between

    class ApplyRequested(Message):
        """Write the last solved value into its case."""

    text: Content = Content("")
    """What the result area shows now."""

    def __init__(self, document: Document, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self.document = document
        self._answered_at: int | None = None
        """The revision the answer on show was solved on (None: no answer on show)."""
        self._followed: str | None = None
        """The session's life target as the value box was given it, while the question follows
        that target (None: the session's solver has a target of its own)."""

    def compose(self) -> ComposeResult:
        """Unknown, target, value, the two buttons and the result area."""
        from .case_form import FieldRow

        with FieldRow():
            yield Label("Solve for", classes="field-label")
            yield ChoiceBox([(u.label, name) for name, u in UNKNOWNS.items()],
                            allow_blank=False, compact=True, id="solver-unknown")
        with FieldRow():
            yield Label("so that", classes="field-label")
            yield ChoiceBox([(f"{name}: {label}", name) for name, (label, _) in TARGETS.items()],
                            allow_blank=False, value="Lnm", compact=True, id="solver-target")
        with FieldRow():
            yield Label("reaches", classes="field-label")
            yield Input(placeholder="e.g. 20000 h", compact=True, id="solver-value",
                        tooltip=FOLLOWS_SESSION)
        with FieldRow():
            yield Label("searching", classes="field-label")
            yield Input(placeholder="from", compact=True, id="solver-low", tooltip=WHOLE_RANGE)
            yield Input(placeholder="to", compact=True, id="solver-high", tooltip=WHOLE_RANGE)
        with Horizontal(id="solver-buttons"):
            yield Button("Solve (f9)", id="solver-solve", compact=True)
            yield Button("Apply (f10)", id="solver-apply", compact=True, disabled=True)
        yield Static("", id="solver-stale")
        yield Static(id="solver-result")

    def on_mount(self) -> None:
        """Show the session's solver question."""
        self.load()

    def load(self) -> None:
        """Show the session's solver question (unknown, and "target=value" split for editing):
        its own target, else the session's life target on Lnm."""
        session = self.document.session
        setup = session.solver
        if setup.unknown in UNKNOWNS:
            self.query_one("#solver-unknown", ChoiceBox).value = setup.unknown
        name, _, value_text = solver_target(session).partition("=")
        self.query_one("#solver-target", ChoiceBox).value = \
            name.strip() if name.strip() in TARGETS else FOLLOWED_RESULT
        self.query_one("#solver-value", Input).value = value_text.strip()
        self._followed = None if setup.target else session.targets.life.strip()

    def _follow_life_target(self) -> None:
        """While the question follows the session's life target and its value is as it was
        given, a new life target (alt+i, undo) becomes the value."""
        life = self.document.session.targets.life.strip()
        if self._followed is None or life == self._followed or self.document.session.solver.target:
            return
        box = self.query_one("#solver-value", Input)
        if self.query_one("#solver-target", ChoiceBox).value == FOLLOWED_RESULT and \
                box.value.strip() == self._followed:
            box.value = life
            self._followed = life

    def request(self) -> tuple[str, str, tuple[str, str]]:
        """The question as asked now: (unknown, "target=value text", (from, to) as typed)."""
        unknown = self.query_one("#solver-unknown", ChoiceBox).value
        target = self.query_one("#solver-target", ChoiceBox).value
        value_text = self.query_one("#solver-value", Input).value
        between = (self.query_one("#solver-low", Input).value,
                   self.query_one("#solver-high", Input).value)
        return str(unknown), f"{target}={value_text}", between

    def watch_view(self, view: View) -> None:
        """An answer solved on another revision is out of date: say so, and no applying it.
        A question following the session's life target follows a new one."""
        self._follow_life_target()
        stale = self._answered_at is not None and self._answered_at != view.revision
        note = self.query_one("#solver-stale", Static)
        if note.has_class("-shown") != stale:  # an update lays the screen out: only on a change
            note.update("⚠ The session has changed since this was solved: solve again (f9)."
                        if stale else "")
            note.set_class(stale, "-shown")
        if stale:
            self.query_one("#solver-apply", Button).disabled = True

    def _show(self, content: Content, can_apply: bool, revision: int | None) -> None:
        self.text = content
        self._answered_at = revision
        self.query_one("#solver-result", Static).update(content)
        self.query_one("#solver-apply", Button).disabled = not can_apply
        self.watch_view(self.view)

    def show_busy(self) -> None:
        """Say that the solver is working."""
        self._show(Content.styled("Solving…", "italic"), False, None)

    def show_solution(self, case_name: str, solution: Solution, system: str, *,
                      revision: int) -> None:
        """Show what the solver found for ``case_name`` on ``revision``."""
        self._show(solution_content(case_name, solution, system), True, revision)

    def show_failure(self, message: str, *, revision: int) -> None:
        """Show why nothing was solved on ``revision`` (marked out of date, as an answer is,
        once the session changes)."""
        self._show(failure_content(message), False, revision)

    def show_note(self, message: str) -> None:
        """A plain line in the result area (e.g. after applying)."""
        self._show(Content(message), False, None)

    @on(Select.Changed, "#solver-target")
    def _target_changed(self, event: Select.Changed) -> None:
        event.stop()
        unit = TARGETS.get(str(event.value), ("", ""))[1]
        self.query_one("#solver-value", Input).placeholder = "e.g. " + TARGET_EXAMPLE.get(unit, "")

    @on(Select.Changed, "#solver-unknown")
    def _unknown_changed(self, event: Select.Changed) -> None:
        event.stop()

    @on(Input.Submitted, "#solver-value")
    @on(Input.Submitted, "#solver-low")
    @on(Input.Submitted, "#solver-high")
    @on(Button.Pressed, "#solver-solve")
    def _solve_asked(self, event: Message) -> None:
        event.stop()
        self.post_message(self.SolveRequested(*self.request()))

    @on(Button.Pressed, "#solver-apply")
    def _apply_asked(self, event: Button.Pressed) -> None:
        event.stop()
        self.post_message(self.ApplyRequested())

    def focus_first(self) -> None:
        """Put the focus on the first choice."""
        self.query_one("#solver-unknown", ChoiceBox).focus()
