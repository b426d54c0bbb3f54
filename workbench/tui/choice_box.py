"""A choice among fixed options: Textual's ``Select`` with the workbench's keys, and the chosen
value shown whole or deliberately shortened, never cut inside a word by the box's edge."""

from __future__ import annotations

from typing import Any, Generic, TypeVar

from rich.text import Text
from textual.binding import Binding
from textual.widgets import Select

# Select shows the chosen option's prompt as given, on as many lines as it wraps to, and its
# one-line row shows the first: a long value loses its end ("angular-contac▼") or its last
# words without a sign.  Select has no public hook for what its box shows, so the box is
# updated here through SelectCurrent.update (the one call Select itself makes for it).
from textual.widgets._select import SelectCurrent

from .view import FittedText

T = TypeVar("T")


class ChoiceBox(Select[T], Generic[T], inherit_bindings=False):
    """A ``Select`` that leaves up/down to the form around it (they move between fields, as in
    every other row) and steps through its options in place with left/right; enter or space
    opens the list.

    The box shows the chosen option whole where it fits; where it does not (a long bearing or
    case name in a narrow column) it is cut between words with an ellipsis, and the list that
    enter opens shows every option whole.  Layouts give the fixed choices the room to be shown
    whole (tests/tui/test_shown_whole.py)."""

    BINDINGS = [
        Binding("enter,space", "show_overlay", "Choose", show=False),
        Binding("right", "step(1)", "Next choice", show=False),
        Binding("left", "step(-1)", "Previous choice", show=False),
    ]

    def __init__(self, *args: Any, allow_blank: bool = True, **kwargs: Any) -> None:
        super().__init__(*args, allow_blank=allow_blank, **kwargs)
        self.allows_blank = allow_blank
        """Whether "no choice" is one of the steps (as it is one of the list's lines)."""

    def chosen_text(self) -> str:
        """The chosen option's text in full ("" for no choice)."""
        for prompt, value in self._options:
            if value is not Select.NULL and value == self.value:
                return prompt.plain if isinstance(prompt, Text) else str(prompt)
        return ""

    def watch_value(self, value: T | Any) -> None:
        """Show the chosen option fitted to the box (Select's own watcher, which runs first,
        put it there as given)."""
        if value is Select.NULL:
            return
        for current in self.query(SelectCurrent):  # none before the box is composed
            current.update(FittedText(self.chosen_text()))

    def action_step(self, delta: int) -> None:
        """Choose the next (+1) or previous (−1) option, round the end; "no choice" is a step
        where it is allowed."""
        values: list[Any] = [value for _, value in self._options if value is not Select.NULL]
        if self.allows_blank:
            values.insert(0, Select.NULL)
        if not values:
            return
        index = values.index(self.value) if self.value in values else -1
        self.value = values[(index + delta) % len(values)]
