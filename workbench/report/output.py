"""A report written to a file, or shown as a preview: what the screen and ``report -o`` call.

Both take the session as it is (in memory) and where it is saved; the provenance (generation
time, tool version, SHA-256 of the saved file) is taken at the moment of writing. Nothing here
raises: a report that cannot be built or written comes back as one line saying why, so the
screen can call these from a worker thread and show the line.
"""

from __future__ import annotations

import os
from pathlib import Path
from typing import NamedTuple

from ..model.guarded_read import FileRefused
from ..model.safe_write import resolved_path, writable_target, write_atomically
from ..model.session import Session
from ..model.user_text import clipped, clipped_path
from .meta import provenance

UNSAVED_SOURCE = "(not saved)"


class ReportWritten(NamedTuple):
    """The outcome of :func:`write_report`: the file written, or the one line saying why not."""

    path: Path | None
    error: str | None

    @property
    def ok(self) -> bool:
        return self.error is None


def _source_name(session_path: str | os.PathLike[str] | None) -> str:
    return UNSAVED_SOURCE if session_path is None else str(session_path)


def report_text(session: Session, *, fmt: str, session_path: str | os.PathLike[str] | None,
                modified: bool = False) -> str:
    """The report of ``session`` in ``fmt``; raises ValueError for an unknown format.

    ``session_path`` is the file the session was read from or saved to (None: never saved);
    ``modified`` says it has changes that file does not hold (then no file hash is given).
    """
    from . import render_report

    made = provenance(session_path, modified=modified)
    return render_report(session, fmt, _source_name(session_path), made=made)


def preview(session: Session, *, session_path: str | os.PathLike[str] | None,
            modified: bool = False) -> str:
    """The report as plain text, for the screen to show before writing; never raises (a report
    that cannot be built is one line saying why)."""
    try:
        return report_text(session, fmt="text", session_path=session_path, modified=modified)
    except Exception as exc:  # noqa: BLE001 - the screen's worker shows the line, never a trace
        return f"The report cannot be built: {exc}"


def write_report(session: Session, *, session_path: str | os.PathLike[str] | None, fmt: str,
                 out_path: str | os.PathLike[str], modified: bool = False) -> ReportWritten:
    """Write the report of ``session`` in ``fmt`` to ``out_path`` atomically and through links
    (:func:`~workbench.model.safe_write.write_atomically`): the file holds the old report or the
    new one, never part of either. Refuses a folder, a device, a read-only file and the
    session's own file. Never raises."""
    try:
        target, _ = writable_target(out_path, what="report file")
        if session_path is not None and target == resolved_path(session_path):
            return ReportWritten(None, f"{clipped_path(out_path)}: is the session file itself; "
                                       "choose another name")
    except FileRefused as exc:
        return ReportWritten(None, str(exc))
    try:
        text = report_text(session, fmt=fmt, session_path=session_path, modified=modified)
    except Exception as exc:  # noqa: BLE001 - the screen's worker shows the line, never a trace
        return ReportWritten(None, f"The report cannot be built: {clipped(str(exc), 200)}")
    try:
        target = write_atomically(out_path, text.encode("utf-8"), what="report file")
    except FileRefused as exc:
        return ReportWritten(None, str(exc))
    return ReportWritten(target, None)
