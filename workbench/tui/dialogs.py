"""Small modal dialogs: ask for a line of text (names, file paths), a choice among buttons, or
one of a field's choices from a list.  Imported when the first dialog opens."""

from __future__ import annotations

from collections.abc import Callable, Mapping, Sequence
from typing import Generic, TypeVar

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical
from textual.content import Content
from textual.screen import ModalScreen
from textual.widgets import Button, Input, Label, OptionList, Static
from textual.widgets.option_list import Option

ResultType = TypeVar("ResultType")


class OnceModal(ModalScreen[ResultType], Generic[ResultType]):
    """A modal screen that closes once: a second enter or escape already queued is ignored
    (dismissing twice would pop the screen underneath)."""

    DEFAULT_CSS = """
    OnceModal {
        &.dialog {
            align: center middle;
            background: $background 60%;
        }
        .dialog-box {
            width: 64;
            max-width: 95%;
            height: auto;
            max-height: 90%;
            padding: 1 2;
            border: round $primary;
            background: $surface;
        }
        .info-box {
            width: 100;
        }
        .choice-box {
            width: 44;
        }
        .choice-box OptionList {
            height: auto;
            max-height: 14;
        }
        .selection-box {
            width: 100%;
            height: 100%;
            max-width: 120;
            max-height: 100%;
        }
        .dialog-title {
            color: $text-primary;
            text-style: bold;
            margin-bottom: 1;
        }
        .dialog-message {
            margin-bottom: 1;
        }
        .dialog-hint {
            color: $text-muted;
            margin-top: 1;
        }
        .dialog-buttons {
            height: auto;
        }
        .dialog-buttons Button {
            margin-right: 2;
        }
        #prompt-message {
            color: $text-error;
        }
        #candidates {
            height: 1fr;
            margin-top: 1;
        }
        #selection-summary {
            margin-top: 1;
        }
    }
    """
    """The dialogs' styles, read when the first dialog opens rather than at start."""

    _answered = False

    def close(self, result: ResultType) -> None:
        """Dismiss with ``result`` unless already closing or no longer on top."""
        if self._answered or self.app.screen is not self:
            return
        self._answered = True
        self.dismiss(result)

    def action_dismiss_none(self) -> None:
        """Close without an answer."""
        self.close(None)  # type: ignore[arg-type]


class TextPrompt(OnceModal[str | None]):
    """Ask for one line of text; ``check`` returns why a text is refused (None: accept)."""

    BINDINGS = [Binding("escape", "dismiss_none", "Cancel", id="dialog.cancel")]

    def __init__(self, title: str, value: str = "",
                 check: Callable[[str], str | None] | None = None) -> None:
        super().__init__(classes="dialog")
        self._title = title
        self._value = value
        self._check = check

    def compose(self) -> ComposeResult:
        """Title, the input, a message line and the hint."""
        with Vertical(classes="dialog-box"):
            yield Label(Content(self._title), classes="dialog-title")
            yield Input(self._value, id="prompt-input")
            yield Static("", id="prompt-message")
            yield Static("enter: accept   escape: cancel", classes="dialog-hint")

    @on(Input.Submitted, "#prompt-input")
    def _submitted(self, event: Input.Submitted) -> None:
        event.stop()
        problem = self._check(event.value) if self._check else None
        if problem is not None:
            self.query_one("#prompt-message", Static).update(Content("✘ " + problem))
            return
        self.close(event.value)


class ChoiceDialog(OnceModal[str | None]):
    """A question with a few answers, one button each; escape answers None."""

    BINDINGS = [Binding("escape", "dismiss_none", "Cancel", id="dialog.cancel")]

    def __init__(self, title: str, message: str, choices: Sequence[tuple[str, str]]) -> None:
        super().__init__(classes="dialog")
        self._title = title
        self._message = message
        self._choices = choices

    def compose(self) -> ComposeResult:
        """Title, message and one button per answer."""
        with Vertical(classes="dialog-box"):
            yield Label(Content(self._title), classes="dialog-title")
            yield Static(Content(self._message), classes="dialog-message")
            with Horizontal(classes="dialog-buttons"):
                for answer, words in self._choices:
                    yield Button(words, id=f"answer-{answer}", compact=True)

    @on(Button.Pressed)
    def _pressed(self, event: Button.Pressed) -> None:
        event.stop()
        self.close((event.button.id or "").removeprefix("answer-"))


BLANK_KEY = ""
"""The list's key for "no choice" (the prompt's line)."""


class ChoiceList(OnceModal[str | None]):
    """The choices of a field as a list; enter takes the highlighted one, escape keeps the value.

    Answers the chosen value, ``BLANK_KEY`` for the blank line, or None when cancelled."""

    BINDINGS = [Binding("escape", "dismiss_none", "Cancel", id="dialog.cancel")]

    def __init__(self, title: str, choices: Sequence[str], current: str | None,
                 blank_prompt: str | None, labels: Mapping[str, str] | None = None) -> None:
        super().__init__(classes="dialog")
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
        with Vertical(classes="dialog-box choice-box"):
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
