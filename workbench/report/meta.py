"""Where a report comes from: when it was made, by which version, from which saved file.

Every report carries these in its ``meta`` block, so a printed or filed review can be traced to
the exact session file (its SHA-256, FIPS 180-4, of the bytes as saved) and tool that made it.
"""

from __future__ import annotations

import hashlib
import os
from datetime import datetime, timezone
from typing import NamedTuple

DISTRIBUTION = "bearing-workbench"
UNINSTALLED_VERSION = "development copy"
NEVER_SAVED = "none: the session has never been saved"
_READ_CHUNK = 1 << 20


class Provenance(NamedTuple):
    """When and by what a report was made, and the hash of the session file it reports.

    ``session_sha256`` is None when there is no saved file that matches the session reported
    (never saved, changed since saving, or unreadable); ``hash_note`` then says which.
    """

    generated_at: str  # ISO 8601, UTC with its offset: 2026-12-02T17:30:37+00:00
    tool_version: str
    session_sha256: str | None
    hash_note: str


def tool_version() -> str:
    """The installed package's version (``importlib.metadata``), or "development copy"."""
    # importlib.metadata (and the email package under it) loads only when a version is asked for
    from importlib.metadata import PackageNotFoundError, version

    try:
        return version(DISTRIBUTION)
    except PackageNotFoundError:
        return UNINSTALLED_VERSION


def file_sha256(path: str | os.PathLike[str]) -> str:
    """SHA-256 (hex) of the file's bytes; raises OSError when it cannot be read."""
    digest = hashlib.sha256()
    with open(path, "rb") as handle:
        while chunk := handle.read(_READ_CHUNK):
            digest.update(chunk)
    return digest.hexdigest()


def utc_now_text(now: datetime | None = None) -> str:
    """``now`` (default: this moment) in UTC as ISO 8601 to the second, with its +00:00 offset."""
    moment = now if now is not None else datetime.now(timezone.utc)
    return moment.astimezone(timezone.utc).isoformat(timespec="seconds")


def provenance(session_path: str | os.PathLike[str] | None, *, modified: bool = False,
               now: datetime | None = None) -> Provenance:
    """The provenance of a report of the session saved at ``session_path``.

    No path: never saved. ``modified``: the session reported has changes its file does not hold,
    so the file's hash would describe something else and none is given.
    """
    if session_path is None:
        sha, note = None, NEVER_SAVED
    elif modified:
        sha, note = None, "none: the session has changes not yet saved to its file"
    else:
        try:
            sha, note = file_sha256(session_path), ""
        except OSError as exc:
            sha, note = None, f"none: the session file cannot be read ({exc.strerror or exc})"
    return Provenance(utc_now_text(now), tool_version(), sha, note)
