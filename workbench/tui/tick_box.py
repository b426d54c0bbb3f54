"""A check box whose box is empty when it is off."""

from __future__ import annotations

from typing import Any

from textual.widgets import Checkbox


class TickBox(Checkbox):
    """Textual's ``Checkbox``, with the X drawn only when it is on.

    Problem a person noticed: Textual draws the X in both states and tells them apart by colour
    alone, so "Outer ring rotates ▐X▌ V = 1" and the selection's "▐X▌ flanged cylindrical may
    take Fa" read as ticked while off, and under ``NO_COLOR`` nothing told them apart."""

    def __init__(self, *args: Any, **kwargs: Any) -> None:
        super().__init__(*args, **kwargs)
        self.BUTTON_INNER = self._inner()

    def _inner(self) -> str:
        return "X" if self.value else " "

    def watch_value(self) -> None:
        """Draw the box for the new value, then do what a ``Checkbox`` does (the ``-on``
        class, the ``Changed`` message)."""
        self.BUTTON_INNER = self._inner()
        super().watch_value()
