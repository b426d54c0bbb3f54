"""The solver pane: which input to back-solve, which result must reach which value, and what
the solver found (value, residual, evaluations, bracket, branch) or why nothing meets the target.

The pane asks with :class:`SolverPane.SolveRequested` / :class:`SolverPane.ApplyRequested`; the
screen runs :func:`workbench.engine.solve.solve` (through the workbench state) and hands the
outcome back to :meth:`SolverPane.show_solution` or :meth:`SolverPane.show_failure`.
"""

from __future__ import annotations

from textual import on
from textual.app import ComposeResult
from textual.containers import Horizontal, VerticalScroll
from textual.content import Content
from textual.message import Message
from textual.widgets import Button, Input, Label, Static

from ..engine.record import fmt
from ..engine.solve import TARGETS, UNKNOWNS, Solution
from ..model.quantities import format_quantity
from ..model.session import SolverSetup
from .choice_field import ChoiceField

UNKNOWN_QUANTITY = {"N": "force", "rpm": "speed"}
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
        Content(f"{solution.target} reached: {fmt(solution.achieved, 6)} {unit}".rstrip()),
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


def failure_content(message: str, reachable: tuple[float, float] | None, target: str) -> Content:
    """Why no value was found, with the range the result can reach where known."""
    lines = [Content.styled("✘ " + message, "bold $text-error on $error-muted")]
    if reachable is not None and target in TARGETS:
        unit = TARGETS[target][1]
        lines.append(Content(f"reachable {target}: {fmt(reachable[0])} … {fmt(reachable[1])} "
                             f"{unit}".rstrip()))
    return Content("\n").join(lines)


class SolverPane(VerticalScroll):
    """Choose the unknown and the target; see the solution or the reason there is none."""

    DEFAULT_CSS = """
    SolverPane {
        height: 1fr;
        padding: 0 1;
    }
    #solver-buttons {
        height: 1;
        margin: 1 0;
    }
    #solver-buttons Button {
        margin-right: 2;
    }
    #solver-result {
        width: 1fr;
    }
    """

    class SolveRequested(Message):
        """Solve ``unknown`` so that the target text ("Lnm=20000 h") is met."""

        def __init__(self, unknown: str, target_text: str) -> None:
            super().__init__()
            self.unknown = unknown
            self.target_text = target_text

    class ApplyRequested(Message):
        """Write the last solved value into its case."""

    text: Content = Content("")
    """What the result area shows now."""

    def __init__(self, setup: SolverSetup, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self._setup = setup

    def on_mount(self) -> None:
        """Show the session's solver question."""
        self.load(self._setup)

    def compose(self) -> ComposeResult:
        """Unknown, target, value, the two buttons and the result area."""
        with Horizontal(classes="field-row"):
            yield Label("Solve for", classes="field-label")
            yield ChoiceField(list(UNKNOWNS), title="Solve for", allow_blank=False,
                              labels={name: u.label for name, u in UNKNOWNS.items()},
                              value=next(iter(UNKNOWNS)), id="solver-unknown")
        with Horizontal(classes="field-row"):
            yield Label("so that", classes="field-label")
            yield ChoiceField(list(TARGETS), title="so that", allow_blank=False,
                              labels={name: f"{name}: {label}"
                                      for name, (label, _) in TARGETS.items()},
                              value="Lnm", id="solver-target")
        with Horizontal(classes="field-row"):
            yield Label("reaches", classes="field-label")
            yield Input(placeholder="e.g. 20000 h", compact=True, id="solver-value")
        with Horizontal(id="solver-buttons"):
            yield Button("Solve (f9)", id="solver-solve", compact=True)
            yield Button("Apply (f10)", id="solver-apply", compact=True, disabled=True)
        yield Static(id="solver-result")

    def load(self, setup: SolverSetup) -> None:
        """Show the session's solver question (unknown, and "target=value" split for editing)."""
        unknown = self.query_one("#solver-unknown", ChoiceField)
        if setup.unknown in UNKNOWNS:
            unknown.value = setup.unknown
        name, _, value_text = setup.target.partition("=")
        if name.strip() in TARGETS:
            self.query_one("#solver-target", ChoiceField).value = name.strip()
        self.query_one("#solver-value", Input).value = value_text.strip()

    def request(self) -> tuple[str, str]:
        """The question as asked now: (unknown, "target=value text")."""
        unknown = self.query_one("#solver-unknown", ChoiceField).value
        target = self.query_one("#solver-target", ChoiceField).value
        value_text = self.query_one("#solver-value", Input).value
        return str(unknown), f"{target}={value_text}"

    def _show(self, content: Content, can_apply: bool) -> None:
        self.text = content
        self.query_one("#solver-result", Static).update(content)
        self.query_one("#solver-apply", Button).disabled = not can_apply

    def show_solution(self, case_name: str, solution: Solution, system: str) -> None:
        """Show what the solver found for ``case_name``."""
        self._show(solution_content(case_name, solution, system), True)

    def show_failure(self, message: str, reachable: tuple[float, float] | None = None) -> None:
        """Show why nothing was solved."""
        target = str(self.query_one("#solver-target", ChoiceField).value)
        self._show(failure_content(message, reachable, target), False)

    def show_note(self, message: str) -> None:
        """A plain line in the result area (e.g. after applying)."""
        self._show(Content(message), False)

    @on(ChoiceField.Changed, "#solver-target")
    def _target_changed(self, event: ChoiceField.Changed) -> None:
        event.stop()
        unit = TARGETS.get(str(event.value), ("", ""))[1]
        self.query_one("#solver-value", Input).placeholder = "e.g. " + TARGET_EXAMPLE.get(unit, "")

    @on(Input.Submitted, "#solver-value")
    @on(Button.Pressed, "#solver-solve")
    def _solve_asked(self, event: Message) -> None:
        event.stop()
        self.post_message(self.SolveRequested(*self.request()))

    @on(Button.Pressed, "#solver-apply")
    def _apply_asked(self, event: Button.Pressed) -> None:
        event.stop()
        self.post_message(self.ApplyRequested())
