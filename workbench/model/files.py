"""The screen's door to session files: open, save, demo and recovery, through
:mod:`workbench.model.sessionfile`, imported only when a file is touched.

Every function returns a value or a one-line message; nothing here raises into the screen.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path

from ..model.session import Session


@dataclass
class FileOutcome:
    """What a file operation did: the session read (for open), messages to show, or an error."""

    session: Session | None = None
    path: Path | None = None
    messages: list[str] = field(default_factory=list)
    error: str | None = None


def _error_text(exc: Exception) -> str:
    return str(exc) or type(exc).__name__


def open_session(path: Path, *, recovered: bool = False) -> FileOutcome:
    """Read the session at ``path``; a recovery copy is read without checking its values
    (it may hold a value typed half-way)."""
    try:
        from ..model.sessionfile import SessionFileError, load_session
    except ImportError as exc:
        return FileOutcome(error=f"session files are not available: {exc}")
    try:
        return FileOutcome(session=load_session(path, check_values=not recovered), path=path)
    except (SessionFileError, OSError, ValueError) as exc:
        return FileOutcome(error=_error_text(exc))


def save(session: Session, path: Path) -> FileOutcome:
    """Write ``session`` to ``path``; the messages the writer reports (comments kept …)."""
    try:
        from ..model.sessionfile import SessionFileError, save_session
    except ImportError as exc:
        return FileOutcome(error=f"session files are not available: {exc}")
    try:
        outcome = save_session(session, path)
    except (SessionFileError, OSError, ValueError) as exc:
        return FileOutcome(error=_error_text(exc))
    messages = [str(m) for m in getattr(outcome, "messages", None) or []]
    return FileOutcome(path=path, messages=messages)


def demo_path() -> Path | None:
    """Where the shipped demo session lives, or None when it cannot be found."""
    try:
        from ..model.sessionfile import demo_session_path
    except ImportError:
        return None
    return Path(demo_session_path())


def write_recovery_copy(session: Session, path: Path | None) -> str | None:
    """Write the recovery copy of ``session`` (for the file at ``path``); None or why not."""
    try:
        from ..model.sessionfile import SessionFileError, write_recovery
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
        from ..model.sessionfile import SessionFileError, discard_recovery
    except ImportError:
        return
    try:
        discard_recovery(path)
    except (SessionFileError, OSError, ValueError):
        return


def recovery_for(path: Path | None) -> Path | None:
    """A recovery copy left behind for ``path`` by a run that did not end cleanly, if any."""
    try:
        from ..model.sessionfile import SessionFileError, find_recovery
    except ImportError:
        return None
    try:
        found = find_recovery(path)
    except (SessionFileError, OSError, ValueError, TypeError):
        return None
    return Path(found) if found else None
