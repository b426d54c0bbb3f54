"""The text box of a typed field: Textual's ``Input``, checked by the field table, with its own
editing keys kept in order when keys arrive in a burst."""

from __future__ import annotations

from textual import events
from textual.geometry import Size
from textual.reactive import Reactive
from textual.validation import ValidationResult, Validator
from textual.widgets import Input

from ..model.fields import FieldError, parse_field


class FieldValidator(Validator):
    """Checks a typed text the way the session reads it (:func:`parse_field`): the unit edge,
    the field's range; the failure carries the field's own message."""

    def __init__(self, name: str) -> None:
        super().__init__()
        self.field_name = name

    def validate(self, value: str) -> ValidationResult:
        try:
            parse_field(self.field_name, value)
        except FieldError as exc:
            return self.failure(exc.message, value)
        return self.success()


class FieldBox(Input):
    """An ``Input`` that keeps up with fast typing on a busy screen.

    Measured problem (``workbench bench``, settle after a key): an ``Input`` sets its
    ``virtual_size`` on every change of its text, and that reactive asks for a layout of the
    whole screen, 20–35 ms on the form's few hundred widgets, on every key.  A one-line field of
    fixed width has no scrollbar that needs the layout, so here the size is set without one.

    And its own editing keys (backspace, ctrl+u, the arrows …) act in the order
    they arrive among the characters typed.

    Measured problem: Textual inserts a typed character at once but sends a bound key up to the
    app first, so in a burst of keys (a slow SSH link delivers them so) the characters behind a
    bound key went in before it acted: ctrl+u then 7 left the field empty
    (Textualize/textual#6605, open).  Here the box's own non-priority bindings run as the key
    arrives, as the fix proposed upstream (#6631) does; drop this class when Textual does it."""

    virtual_size = Reactive(Size(0, 0), layout=False)
    """As a ``Widget``'s, without the layout (see above)."""

    async def _on_key(self, event: events.Key) -> None:
        for binding in self._bindings.key_to_bindings.get(event.key, ()):
            if not binding.priority and await self.app.run_action(binding.action, self):
                event.stop()
                event.prevent_default()
                return
        await super()._on_key(event)
