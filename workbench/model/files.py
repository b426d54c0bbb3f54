"""The screen's door to session files: open, save, demo and recovery, through
:mod:`workbench.model.sessionfile`, imported only when a file is touched.

Every function returns a value or a one-line message; nothing here raises into the screen.
"""

from __future__ import annotations

import time
from collections.abc import Collection
from dataclasses import dataclass, field
from pathlib import Path
from typing import TYPE_CHECKING

from .session import Session

if TYPE_CHECKING:
    from .safe_write import FileStamp


def _error_text(exc: Exception) -> str:
    return str(exc) or type(exc).__name__


QUESTIONS = ("not a session", "exists", "changed on disk")
"""What a save may ask before it replaces a file (:class:`sessionfile.SaveStatus` values): the
file there is not a session; it holds another session; it changed on disk since it was read."""
QUESTION_TITLES = {
    "changed on disk": "The file changed on disk",
    "not a session": "Not a session file",
    "exists": "Another session is there",
}
QUESTION_AFTER = {
    "changed on disk": "Replacing it drops the other version's changes from the file (it is kept "
                       "as {backup} until the next save). Saving elsewhere keeps both.",
    "not a session": "Replacing it keeps the file as it was in {backup} until the next save.",
    "exists": "Replacing it keeps that session in {backup} until the next save.",
}
"""What each question says a replace does; ``{backup}`` is where the replaced file is kept."""
QUESTION_ANSWERS = [("elsewhere", "Save elsewhere…"), ("replace", "Replace it"),
                    ("cancel", "Cancel")]
"""The answers to every question, the safe one first so that a stray enter never replaces
anything: save elsewhere (the save-as prompt), replace it (kept as ``NAME.bak``), or cancel."""


UNSAVED_TITLE = "Unsaved changes"
UNSAVED_BEFORE_QUIT = ("This session has changes that are not saved.",
                       [("save", "Save and quit"), ("quit", "Quit without saving"),
                        ("stay", "Stay")])
UNSAVED_BEFORE_OPEN = ("This session has changes that are not saved. Save them before opening "
                       "another file, or drop them?",
                       [("save", "Save and open"), ("discard", "Drop changes and open"),
                        ("stay", "Stay")])
"""The question (message, answers) before quitting or opening another file loses unsaved work;
saving comes first, so a stray enter loses nothing."""
NOT_OPENED = "nothing else was opened: the changes here are still unsaved"
"""Added to a refused save's reason when the save was to come before opening another file."""


@dataclass
class FileOutcome:
    """What a file operation did: the session read (for open) and the file's stamp (what it held
    then, for the next save), messages to show; or an error, or (for a save) a question to ask
    first (one of :data:`QUESTIONS`, its words in ``error``)."""

    session: Session | None = None
    path: Path | None = None
    messages: list[str] = field(default_factory=list)
    error: str | None = None
    stamp: FileStamp | None = None
    question: str | None = None


def open_session(path: Path, *, recovered: bool = False) -> FileOutcome:
    """Read the session at ``path`` and note what the file held; a recovery copy is read without
    checking its values (it may hold a value typed half-way).  Never raises: a file that cannot
    be read (hostile, not a regular file, too large …) gives one line in ``error``."""
    try:
        from .sessionfile import open_session as read_session
    except ImportError as exc:
        return FileOutcome(error=f"session files are not available: {exc}")
    opened = read_session(path, recovered=recovered)
    if opened.session is None:
        return FileOutcome(path=path, error=opened.error or f"{path}: not opened")
    return FileOutcome(session=opened.session, path=path, stamp=opened.stamp)


def save(session: Session, path: Path, *, read_stamp: FileStamp | None = None,
         confirmed: Collection[str] = ()) -> FileOutcome:
    """Write ``session`` to ``path`` (through a link to its target), unless something must be
    asked first: ``question`` then names it and ``error`` words it; call again with the answered
    question in ``confirmed``.  ``read_stamp`` is what the file held when this session was read
    or last saved.  A file that must not be written (read-only, a folder or device …) is refused
    in ``error``.  On success ``stamp`` is what the file holds now, and ``messages`` the
    writer's notes (comments kept aside …).  Never raises."""
    try:
        from .sessionfile import SaveStatus, try_save_session
    except ImportError as exc:
        return FileOutcome(error=f"session files are not available: {exc}")
    outcome = try_save_session(session, path, read_stamp=read_stamp,
                               confirmed={SaveStatus(answer) for answer in confirmed})
    if outcome.status is SaveStatus.SAVED:
        return FileOutcome(path=path, messages=list(outcome.messages), stamp=outcome.stamp)
    question = outcome.status.value if outcome.status.value in QUESTIONS else None
    return FileOutcome(path=path, error=outcome.message or f"{path}: not saved",
                       question=question)


def demo_path() -> Path | None:
    """Where the shipped demo session lives, or None when it cannot be found."""
    try:
        from .sessionfile import demo_session_path
    except ImportError:
        return None
    return Path(demo_session_path())


def write_recovery_copy(session: Session, path: Path | None) -> str | None:
    """Write the recovery copy of ``session`` (for the file at ``path``); None or why not."""
    try:
        from .sessionfile import SessionFileError, write_recovery
    except ImportError as exc:
        return f"recovery copies are not available: {exc}"
    try:
        write_recovery(session, path)
    except (SessionFileError, OSError, ValueError, TypeError) as exc:
        return f"recovery copy not written: {_error_text(exc)}"
    return None


def discard_recovery_copy(path: Path | None) -> None:
    """Remove the recovery copy for the file at ``path`` (saved, or declined); quietly."""
    try:
        from .sessionfile import SessionFileError, discard_recovery
    except ImportError:
        return
    try:
        discard_recovery(path)
    except (SessionFileError, OSError, ValueError):
        return


def keep_recovery_copy(path: Path | None) -> Path | None:
    """Set the recovery copy for the file at ``path`` aside, under a name of its own beside it
    (``NAME-….kept-YYYYMMDD-HHMMSS.toml``), so the next autosave cannot write over it; where it
    went, or None when there was none or it could not be moved."""
    try:
        from .sessionfile import recovery_path
    except ImportError:
        return None
    copy = recovery_path(path)
    stem = f"{copy.stem}.kept-{time.strftime('%Y%m%d-%H%M%S')}"
    kept = copy.with_name(stem + copy.suffix)
    number = 1
    while kept.exists():  # a rename would replace a copy kept in the same second
        number += 1
        kept = copy.with_name(f"{stem}-{number}{copy.suffix}")
    try:
        copy.rename(kept)
    except OSError:
        return None
    return kept


def recovery_for(path: Path | None) -> Path | None:
    """A recovery copy left behind for ``path`` by a run that did not end cleanly, if any."""
    try:
        from .sessionfile import SessionFileError, find_recovery
    except ImportError:
        return None
    try:
        found = find_recovery(path)
    except (SessionFileError, OSError, ValueError, TypeError):
        return None
    return Path(found) if found else None
