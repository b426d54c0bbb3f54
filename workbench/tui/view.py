"""What every pane of the main screen follows, and fitting words into a width."""

from __future__ import annotations

from typing import NamedTuple

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
    20 columns: "RM-2 input … · A"), since case names differ most at their two ends.  Only a
    first word longer than ``width`` is cut inside.
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
    return text[: max(width - 1, 0)] + ELLIPSIS
