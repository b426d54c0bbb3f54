"""A choice among fixed options: Textual's ``Select`` with the workbench's keys."""

from __future__ import annotations

from typing import Any, Generic, TypeVar

from textual.binding import Binding
from textual.widgets import Select

T = TypeVar("T")


class ChoiceBox(Select[T], Generic[T], inherit_bindings=False):
    """A ``Select`` that leaves up/down to the form around it (they move between fields, as in
    every other row) and steps through its options in place with left/right; enter or space
    opens the list."""

    BINDINGS = [
        Binding("enter,space", "show_overlay", "Choose", show=False),
        Binding("right", "step(1)", "Next choice", show=False),
        Binding("left", "step(-1)", "Previous choice", show=False),
    ]

    def __init__(self, *args: Any, allow_blank: bool = True, **kwargs: Any) -> None:
        super().__init__(*args, allow_blank=allow_blank, **kwargs)
        self.allows_blank = allow_blank
        """Whether "no choice" is one of the steps (as it is one of the list's lines)."""

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
