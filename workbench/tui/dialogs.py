"""Small modal dialogs on Textual's own widgets: a line of text (names, file paths) checked as it
is typed, and a question answered with one of a few buttons.  Imported when the first dialog
opens.

:class:`OnceModal` is the base of every dialog and secondary screen: it closes only while it is
the screen on top, and only once, so a key or a palette command that arrives after the screen
has already gone never pops the screen underneath (Textual's ``ScreenStackError``).
"""

from __future__ import annotations

from collections.abc import Callable, Sequence
from pathlib import Path
from typing import Generic, TypeVar

from textual import on
from textual.app import ComposeResult, ScreenStackError
from textual.binding import Binding
from textual.containers import Horizontal, Vertical
from textual.content import Content
from textual.screen import ModalScreen
from textual.suggester import Suggester
from textual.validation import ValidationResult, Validator
from textual.widgets import Button, Input, Label, Static

from ..model.files import QUESTION_AFTER, QUESTION_ANSWERS, QUESTION_TITLES

ResultType = TypeVar("ResultType")


class OnceModal(ModalScreen[ResultType], Generic[ResultType]):
    """A modal screen that closes once, and only while it is the screen on top."""

    DEFAULT_CSS = """
    OnceModal {
        align: center middle;
        background: $background 60%;
        .dialog-box {
            width: 64;
            max-width: 100%;
            height: auto;
            max-height: 100%;
            padding: 0 1;
            border: round $primary;
            background: $surface;
        }
        .screen-box {
            width: 100%;
            height: 100%;
            max-width: 132;
        }
        .dialog-title {
            width: 100%;
            color: $text-primary;
            text-style: bold;
        }
        .dialog-message {
            margin: 1 0;
        }
        .dialog-hint {
            width: 100%;
            color: $text-muted;
        }
        .dialog-problem {
            width: 100%;
            color: $text-error;
        }
        .dialog-buttons {
            height: auto;
            margin-bottom: 1;
        }
        .dialog-buttons Button {
            margin-right: 2;
        }
        .form-row {
            height: 1;
            width: 100%;
        }
        .form-label {
            width: auto;
            padding-right: 1;
        }
        DataTable {
            scrollbar-size-vertical: 1;
        }
    }
    """
    """The shared rules of the dialogs and secondary screens."""

    _answered = False

    @property
    def on_top(self) -> bool:
        """Whether this is the screen the person sees and types into."""
        try:
            return self.app.screen is self
        except ScreenStackError:
            return False

    def close(self, result: ResultType) -> None:
        """Dismiss with ``result`` unless already closing or no longer on top."""
        if self._answered or not self.on_top:
            return
        self._answered = True
        self.dismiss(result)

    def action_dismiss_none(self) -> None:
        """Close without an answer."""
        self.close(None)  # type: ignore[arg-type]


class Check(Validator):
    """A validator from a function that returns why a text is refused (None: accepted)."""

    def __init__(self, problem: Callable[[str], str | None]) -> None:
        super().__init__()
        self._problem = problem

    def validate(self, value: str) -> ValidationResult:
        """Accept the text, or fail with the function's words."""
        problem = self._problem(value)
        return self.success() if problem is None else self.failure(problem)


class PathSuggester(Suggester):
    """Completes the last part of a file path from what is on disk (→ or end takes it):
    folders first, then ``.toml`` files, then the rest, each alphabetically."""

    def __init__(self) -> None:
        super().__init__(use_cache=False, case_sensitive=True)

    async def get_suggestion(self, value: str) -> str | None:
        """The first entry of the typed folder whose name starts with the typed part."""
        if not value or value.endswith(("/", "~")):
            return None
        typed = Path(value).expanduser()
        folder, start = typed.parent, typed.name
        try:
            names = [(not entry.is_dir(), not entry.name.endswith(".toml"), entry.name)
                     for entry in folder.iterdir()
                     if entry.name.startswith(start) and not entry.name.startswith(".")]
        except (OSError, ValueError):  # unreadable, a name too long, a NUL typed or pasted
            return None
        if not names:
            return None
        is_file, _, name = min(names)
        return value + name[len(start):] + ("" if is_file else "/")


class TextPrompt(OnceModal[str | None]):
    """Ask for one line of text; ``check`` returns why a text is refused (None: accept).

    The text is checked as it is typed; enter accepts it only when ``check`` does.
    ``suggester`` offers a completion (e.g. :class:`PathSuggester` for file names)."""

    BINDINGS = [Binding("escape", "dismiss_none", "Cancel", id="dialog.cancel")]

    def __init__(self, title: str, value: str = "",
                 check: Callable[[str], str | None] | None = None, *,
                 suggester: Suggester | None = None) -> None:
        super().__init__()
        self._title = title
        self._value = value
        self._check = check
        self._suggester = suggester

    def compose(self) -> ComposeResult:
        """Title, the input, a message line and the hint."""
        with Vertical(classes="dialog-box"):
            yield Label(Content(self._title), classes="dialog-title")
            yield Input(self._value, id="prompt-input", suggester=self._suggester,
                        validators=[Check(self._check)] if self._check else None)
            yield Static("", id="prompt-message", classes="dialog-problem")
            yield Static("enter: accept · escape: cancel"
                         + (" · → or end: take the completion" if self._suggester else ""),
                         classes="dialog-hint")

    def _show(self, result: ValidationResult | None) -> bool:
        """Show why the text is refused, if it is; whether it is accepted."""
        problems = [] if result is None else result.failure_descriptions
        self.query_one("#prompt-message", Static).update(
            Content("✘ " + "; ".join(problems)) if problems else Content(""))
        return not problems

    @on(Input.Changed, "#prompt-input")
    def _changed(self, event: Input.Changed) -> None:
        event.stop()
        self._show(event.validation_result)

    @on(Input.Submitted, "#prompt-input")
    def _submitted(self, event: Input.Submitted) -> None:
        event.stop()
        if self._show(event.validation_result):
            self.close(event.value)


class ChoiceDialog(OnceModal[str | None]):
    """A question with a few answers, one button each (←/→ or tab between them, enter
    answers); escape answers None."""

    BINDINGS = [
        Binding("escape", "dismiss_none", "Cancel", id="dialog.cancel"),
        Binding("left", "app.focus_previous", "Previous answer", show=False),
        Binding("right", "app.focus_next", "Next answer", show=False),
    ]

    def __init__(self, title: str, message: str, choices: Sequence[tuple[str, str]]) -> None:
        super().__init__()
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


class SaveQuestion(ChoiceDialog):
    """A question before a save replaces a file it must not replace in silence (its kind, one of
    :data:`workbench.model.files.QUESTIONS`, in :attr:`kind`); answers ``elsewhere``,
    ``replace`` or ``cancel`` (escape: None, as cancel)."""

    def __init__(self, kind: str, message: str, backup: str) -> None:
        super().__init__(QUESTION_TITLES[kind],
                         f"{message}\n{QUESTION_AFTER[kind].format(backup=backup)}",
                         QUESTION_ANSWERS)
        self.kind = kind
