"""↑/↓ between a form's fields, acting as each key arrives and never wrapping round.

Textual hands a key to the focused widget and runs a screen's ordinary binding only when the key
has bubbled back up to the app; by then the keys typed behind it (a burst from a quick typist
or a slow SSH link) have already gone to the field the focus was in.  "↓ then 30 kW" put "30 kW"
into the field above.  A priority binding runs as the app takes the key from the terminal,
before the next key is handed on, so the focus has moved when the text behind it arrives.
The move is :meth:`Screen.set_focus` at once (``Widget.focus`` only queues the move behind the
keys already waiting).

The move stops at the first and last stop instead of wrapping round to the other end, and the
form's scrolling container is no stop of its own: ↓ from the last field of the session dialog
landed on the invisible container, where typing vanished, and the next ↓ wrapped to the title,
which the typing then replaced.
"""

from __future__ import annotations

from textual.binding import Binding
from textual.screen import Screen
from textual.widget import Widget
from textual.widgets import Input, Select

FIELD_MOVES = [
    Binding("down", "move_field(1)", "Next field", show=False, priority=True),
    Binding("up", "move_field(-1)", "Previous field", show=False, priority=True),
]
"""The bindings a screen with :class:`FieldMoves` adds."""


class FieldMoves(Screen[object]):
    """A screen whose ↑/↓ move between its fields at once (see the module).  Only from a text
    box or a closed choice box: an open choice list, a text area or a scrolling pane keeps its
    own ↑/↓."""

    BINDINGS = FIELD_MOVES

    def moves_from(self, widget: Widget | None) -> bool:
        """Whether ↑/↓ move the focus from ``widget`` (a text box or a closed choice box)."""
        return isinstance(widget, Input | Select)

    def check_action(self, action: str, parameters: tuple[object, ...]) -> bool | None:
        """↑/↓ pass to the focused widget where it is not a field (see :meth:`moves_from`)."""
        if action == "move_field":
            return self.moves_from(self.focused)
        return super().check_action(action, parameters)

    def action_move_field(self, step: int) -> None:
        """Focus the next (+1) or previous (−1) stop; at either end the focus stays."""
        chain = self.focus_chain
        focused = self.focused
        if focused not in chain:
            return
        place = chain.index(focused) + step
        if 0 <= place < len(chain):
            self.set_focus(chain[place])
