"""What every pane of the main screen follows, and fitting words into a width."""

from __future__ import annotations

import textwrap
from typing import NamedTuple

from rich.cells import cell_len
from rich.console import Console, ConsoleOptions, RenderResult
from rich.measure import Measurement
from rich.text import Text
from textual.reactive import var

ELLIPSIS = "…"


class View(NamedTuple):
    """The document's revision and the selected case: the screen holds one, its panes follow
    it (``data_bind``) and redraw from the document when either changes."""

    revision: int
    selected: int


def view_reactive() -> var[View]:
    """The ``view`` reactive each pane declares and the screen binds (``data_bind``); it starts
    at no revision and no case, so the first bound value always draws."""
    return var(View(-1, -1))


def fit_words(text: str, width: int) -> str:
    """``text`` in at most ``width`` columns, cut between words, never inside one.

    A long text keeps its first words and its last one ("RM-2 input shaft · full load · A" in
    20 columns: "RM-2 input … · A"), since case names differ most at their two ends.  A first
    word longer than ``width`` is cut after one of its hyphens ("SP-25-100-…"), and only where
    it has none in reach inside.
    """
    if len(text) <= width:
        return text
    words = text.split(" ")
    for tail, candidates in ((f" {ELLIPSIS} {words[-1]}", words[:-1]), (ELLIPSIS, words)):
        head: list[str] = []
        for word in candidates:
            if len(" ".join([*head, word])) + len(tail) > width:
                break
            head.append(word)
        while head and not any(ch.isalnum() for ch in head[-1]):
            head.pop()  # no separator left dangling before the ellipsis
        if head:
            return " ".join(head) + tail
    room = max(width - 1, 0)
    hyphen = text.rfind("-", 0, room)
    return text[: hyphen + 1 if hyphen > 0 else room] + ELLIPSIS


class FittedText:
    """A text that fits the width it is drawn in, on at most ``lines`` lines: whole where it
    fits; else one line cut between words (:func:`fit_words`), or several wrapped between
    words with an ellipsis ending the last.  A Rich renderable, so it fits again whenever its
    widget is laid out at another width (a box's chosen value, the help line)."""

    def __init__(self, text: str, *, lines: int = 1) -> None:
        self.text = text
        self.lines = lines

    def fitted(self, width: int) -> list[str]:
        """The lines shown in ``width`` columns."""
        if self.lines == 1:
            return [self.text if cell_len(self.text) <= width else fit_words(self.text, width)]
        return textwrap.wrap(self.text, max(width, 1), max_lines=self.lines,
                             placeholder=f" {ELLIPSIS}", break_on_hyphens=False) or [""]

    def __rich_console__(self, console: Console, options: ConsoleOptions) -> RenderResult:
        yield Text("\n".join(self.fitted(options.max_width)), no_wrap=True, overflow="crop")

    def __rich_measure__(self, console: Console, options: ConsoleOptions) -> Measurement:
        return Measurement(min(cell_len(self.text), options.max_width), cell_len(self.text))
