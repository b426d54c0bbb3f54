"""Opening a session file, or starting a new one: a path typed with completion.

→ at the end of the line takes the suggested name (:class:`~.dialogs.PathSuggester`); tab
completes the path as far as every match agrees, as a shell does; the lines under the box list
what matches.  Enter reads an existing file here: a file that cannot be read (not a session, too
large, nested, a pipe or device …) is named in the message line and the dialog stays, so the
session under edit is never touched; a file read closes the dialog with its session.  A name
that does not exist yet asks once, and a second enter starts a new session there (written on
the first save).
"""

from __future__ import annotations

import os
from pathlib import Path
from typing import NamedTuple

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.screen import ModalScreen
from textual.widgets import Input, Static

from ..model import files
from ..model.user_text import clipped_path
from .dialogs import PathSuggester

SHOWN = 8
"""How many matching names the list under the box shows."""


def matches(text: str) -> list[str]:
    """The folder entries that complete ``text`` (folders end in "/"; sessions are .toml).

    Hidden entries show only when their dot is typed; an unreadable folder matches nothing."""
    typed = os.path.expanduser(text)
    folder, _, stem = typed.rpartition(os.sep)
    where = Path(folder or ".") if folder or not typed.startswith(os.sep) else Path(os.sep)
    try:
        entries = sorted(os.scandir(where), key=lambda entry: entry.name)
    except (OSError, ValueError):  # unreadable, a name too long, a NUL typed or pasted
        return []
    found = []
    for entry in entries:
        if not entry.name.startswith(stem) or (entry.name.startswith(".") and not stem.startswith(".")):
            continue
        try:
            is_dir = entry.is_dir()
        except OSError:
            continue
        if is_dir or entry.name.endswith(".toml"):
            prefix = f"{folder}{os.sep}" if folder or typed.startswith(os.sep) else ""
            found.append(prefix + entry.name + (os.sep if is_dir else ""))
    return found


def completion(text: str) -> str | None:
    """The longest completion all matches share, when it adds to ``text``; else None."""
    found = matches(text)
    if not found:
        return None
    common = os.path.commonprefix(found)
    typed = os.path.expanduser(text)
    return common if len(common) > len(typed) else None


class Opened(NamedTuple):
    """The path chosen and the file read there (its session and stamp), or None for a new
    session (no file there yet)."""

    path: Path
    outcome: files.FileOutcome | None


class OpenDialog(ModalScreen[Opened | None]):
    """Ask for a session file to open, or a new file to start."""

    BINDINGS = [
        Binding("escape", "cancel", "Cancel"),
        Binding("tab", "complete", "Complete", priority=True),
    ]

    DEFAULT_CSS = """
    OpenDialog {
        align: center middle;
        background: $background 60%;
        & #open-box {
            width: 76; max-width: 100%; height: auto;
            border: round $primary; background: $surface; padding: 0 1;
        }
        & #open-title { text-style: bold; color: $text-primary; }
        & #open-matches { color: $text-muted; }
        & #open-message { color: $text-warning; }
        & #open-keys { color: $text-muted; }
    }
    """

    def __init__(self, start: str = "") -> None:
        super().__init__()
        self._start = start
        self._asked_new: str | None = None

    def compose(self) -> ComposeResult:
        """The box, the matches, a message line and the keys."""
        with Vertical(id="open-box"):
            yield Static("Open a session file, or name a new one", id="open-title")
            yield Input(self._start, id="open-path", suggester=PathSuggester(),
                        placeholder="e.g. sessions/demo.toml")
            yield Static("", id="open-matches", markup=False)
            yield Static("", id="open-message", markup=False)
            yield Static("tab completes · enter opens · esc cancels", id="open-keys")

    def on_mount(self) -> None:
        """List what the folder holds."""
        self._list(self._start)

    @on(Input.Changed, "#open-path")
    def _typed(self, event: Input.Changed) -> None:
        self._asked_new = None
        self.query_one("#open-message", Static).update("")
        self._list(event.value)

    def _list(self, text: str) -> None:
        found = matches(text)
        more = f"\n… and {len(found) - SHOWN} more" if len(found) > SHOWN else ""
        self.query_one("#open-matches", Static).update("\n".join(found[:SHOWN]) + more)

    def action_complete(self) -> None:
        """Complete the path as far as the matches agree."""
        box = self.query_one("#open-path", Input)
        completed = completion(box.value)
        if completed is not None:
            box.value = completed
            box.cursor_position = len(completed)

    @on(Input.Submitted, "#open-path")
    def _submitted(self, event: Input.Submitted) -> None:
        text = event.value.strip()
        message = self.query_one("#open-message", Static)
        if not text:
            message.update("Name a file")
            return
        path = Path(text).expanduser()
        try:
            is_folder, exists = path.is_dir(), path.exists() or path.is_symlink()
        except (OSError, ValueError) as exc:  # a name too long, a NUL byte
            message.update(f"{clipped_path(text)}: {getattr(exc, 'strerror', None) or exc}")
            return
        if is_folder:
            message.update(f"{clipped_path(text)} is a folder: name a file in it")
            return
        if exists:
            outcome = files.open_session(path)
            if outcome.session is None:
                message.update(f"✘ {outcome.error or 'not opened'}")
                return
            self._close(Opened(path, outcome))
            return
        if path.suffix != ".toml":
            message.update("A session file ends in .toml")
            return
        if self._asked_new != text:
            self._asked_new = text
            message.update(f"No file {clipped_path(text)} yet: enter again to start a new "
                           "session there (ctrl+s writes it)")
            return
        self._close(Opened(path, None))

    def _close(self, result: Opened | None) -> None:
        if self.app.screen is self:
            self.dismiss(result)

    def action_cancel(self) -> None:
        """Leave without opening anything."""
        self._close(None)
