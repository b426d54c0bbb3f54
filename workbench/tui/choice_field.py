"""A fixed choice on one line: the value in force and a mark; the list opens in a dialog.

Left over from before the screens were rebuilt on Textual's own widgets: only the case editor
and the solver pane still use it, and this file (with its :class:`ChoiceList`) goes when they
take ``Select``.  The secondary screens and dialogs use ``Select``.

Textual's ``Select`` carries its drop-down list with it (five widgets, the list built up front).
This field is one widget: left and right step through the choices in place, enter (or a click)
opens them as a list in a small dialog.  The solver pane and the rating form use it; the case
editor paints its choices itself and shares the stepping (:func:`step_choice`) and the list
(:func:`open_choice_list`).
"""

from __future__ import annotations

from collections.abc import Callable, Mapping, Sequence

from textual import on
from textual.app import App, ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.content import Content
from textual.message import Message
from textual.reactive import reactive
from textual.widget import Widget
from textual.widgets import Label, OptionList, Static
from textual.widgets.option_list import Option

from .dialogs import OnceModal

BLANK_KEY = ""
"""The list's key for "no choice" (the prompt's line)."""


class ChoiceList(OnceModal[str | None]):
    """The choices of a field as a list; enter takes the highlighted one, escape keeps the value.

    Answers the chosen value, ``BLANK_KEY`` for the blank line, or None when cancelled."""

    BINDINGS = [Binding("escape", "dismiss_none", "Cancel", id="dialog.cancel")]

    def __init__(self, title: str, choices: Sequence[str], current: str | None,
                 blank_prompt: str | None, labels: Mapping[str, str] | None = None) -> None:
        super().__init__()
        self._title = title
        self._choices = tuple(choices)
        self._labels = dict(labels or {})
        self._current = current
        self._blank_prompt = blank_prompt

    def compose(self) -> ComposeResult:
        """Title, the list, and the hint."""
        options = [Option(Content(self._blank_prompt), id=BLANK_KEY)] if self._blank_prompt else []
        options += [Option(Content(self._labels.get(choice, choice)), id=choice)
                    for choice in self._choices]
        with Vertical(classes="dialog-box"):
            yield Label(Content(self._title), classes="dialog-title")
            yield OptionList(*options, id="choice-options")
            yield Static("enter: choose   escape: keep as is", classes="dialog-hint")

    def on_mount(self) -> None:
        """Highlight the value in force."""
        options = self.query_one(OptionList)
        wanted = self._current if self._current is not None else BLANK_KEY
        try:
            options.highlighted = options.get_option_index(wanted)
        except LookupError:
            options.highlighted = 0
        options.focus()

    @on(OptionList.OptionSelected)
    def _chosen(self, event: OptionList.OptionSelected) -> None:
        event.stop()
        self.close(event.option.id)


def step_choice(offered: Sequence[str | None], value: str | None, delta: int) -> str | None:
    """The choice ``delta`` places from ``value`` in ``offered`` (not empty), wrapping round;
    a value not on offer steps from before the first."""
    index = offered.index(value) if value in offered else -1
    return offered[(index + delta) % len(offered)]


def open_choice_list(app: App[object], title: str, choices: Sequence[str], current: str | None,
                     blank_prompt: str | None, take: Callable[[str | None], None],
                     labels: Mapping[str, str] | None = None) -> None:
    """Open ``choices`` as a :class:`ChoiceList`; ``take`` gets the value chosen (None for the
    blank line) and is not called when the list is cancelled."""
    def answered(answer: str | None) -> None:
        if answer is not None:
            take(None if answer == BLANK_KEY else answer)

    app.push_screen(ChoiceList(title, choices, current, blank_prompt, labels), answered)


class ChoiceField(Widget, can_focus=True):
    """One of a fixed set of texts, or none (shown as the prompt) when blank is allowed;
    ``labels`` gives a choice words to show instead of its text."""

    BINDINGS = [
        Binding("enter,space", "open", "Choose", show=False),
        Binding("right", "step(1)", "Next choice", show=False),
        Binding("left", "step(-1)", "Previous choice", show=False),
    ]
    DEFAULT_CSS = """
    ChoiceField {
        height: 1;
        width: 1fr;
        color: $foreground;
        background: $surface;
        &:focus {
            background: $block-cursor-background;
            color: $block-cursor-foreground;
        }
    }
    """

    value: reactive[str | None] = reactive(None, init=False)
    """The choice in force (None: blank)."""

    class Changed(Message):
        """The person chose ``value`` (None: blank) in ``field``."""

        def __init__(self, field: ChoiceField, value: str | None) -> None:
            super().__init__()
            self.field = field
            self.value = value

        @property
        def control(self) -> ChoiceField:
            """The field that changed (for ``@on(..., selector)``)."""
            return self.field

    def __init__(self, choices: Sequence[str], *, title: str, prompt: str = "(default)",
                 allow_blank: bool = True, labels: Mapping[str, str] | None = None,
                 value: str | None = None, id: str | None = None) -> None:
        super().__init__(id=id)
        self._choices = tuple(choices)
        self._labels = dict(labels or {})
        self.set_reactive(ChoiceField.value, value if value in self._choices else None)
        self._title = title
        self._prompt = prompt
        self._allow_blank = allow_blank

    @property
    def choices(self) -> tuple[str, ...]:
        """The texts on offer."""
        return self._choices

    def set_choices(self, choices: Sequence[str]) -> None:
        """Offer other texts; a value no longer on offer becomes blank."""
        self._choices = tuple(choices)
        if self.value not in self._choices:
            self.value = None
        self.refresh()

    def render(self) -> Content:
        """The value (or the prompt, dim) and the mark that a list opens here."""
        width = max(0, self.content_region.width - 2)
        if self.value is None:
            shown = Content.styled(self._prompt, "dim")
        else:
            shown = Content(self._labels.get(self.value, self.value))
        return Content.assemble(shown.truncate(width, ellipsis=True, pad=True), " ▾")

    def watch_value(self, value: str | None) -> None:
        """Announce the new choice (suppressed with ``prevent(ChoiceField.Changed)``)."""
        self.post_message(self.Changed(self, value))

    def action_step(self, delta: int) -> None:
        """Take the next (or previous) choice in place, wrapping round."""
        offered: list[str | None] = [None] if self._allow_blank else []
        offered += self._choices
        if offered:
            self.value = step_choice(offered, self.value, delta)

    def action_open(self) -> None:
        """Open the choices as a list."""
        def take(value: str | None) -> None:
            self.value = value

        open_choice_list(self.app, self._title, self._choices, self.value,
                         self._prompt if self._allow_blank else None, take, self._labels)

    def on_click(self) -> None:
        """A click opens the list, as enter does."""
        self.action_open()
