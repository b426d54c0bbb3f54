"""A footer that redraws its keys only when the keys on show really change.

Textual's footer rebuilds all of its key widgets whenever the active bindings are refreshed
(every focus change); with every workbench action on show that rebuild dominated the cost of a
tab press.  The keys on show here are the same for every field, so most refreshes change nothing.
"""

from __future__ import annotations

from textual.screen import Screen
from textual.widgets import Footer


class KeyFooter(Footer):
    """:class:`textual.widgets.Footer`, skipping rebuilds that would draw the same keys."""

    def __init__(self, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self._drawn: tuple[tuple[str, str, bool], ...] | None = None

    def bindings_changed(self, screen: Screen[object]) -> None:
        """Rebuild when the keys on show, their words or their enabled state differ."""
        shown = tuple((binding.key, binding.description, enabled)
                      for _, binding, enabled, _ in screen.active_bindings.values()
                      if binding.show)
        if shown == self._drawn and self._bindings_ready:
            return
        self._drawn = shown
        super().bindings_changed(screen)
