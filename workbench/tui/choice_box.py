"""A choice among fixed options: Textual's ``Select`` with the workbench's keys."""

from __future__ import annotations

from typing import Generic, TypeVar

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

    def action_step(self, delta: int) -> None:
        """Choose the next (+1) or previous (−1) option, round the end."""
        values = [value for _, value in self._options if value is not Select.NULL]
        if not values:
            return
        index = values.index(self.value) if self.value in values else -1
        self.value = values[(index + delta) % len(values)]
