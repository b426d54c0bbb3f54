"""Writing a file so that no work is lost: atomically, through links, never over what it must not.

:func:`write_atomically` is the one way the workbench writes a file a person keeps (sessions,
their ``.bak`` and ``.orig`` copies, recovery copies, reports):

- the bytes go to a temporary file ``.NAME.XXXX.tmp`` in the same folder, are flushed and
  synced, then replace the file in one ``os.replace``: the file holds its old or its new bytes,
  never part of either, whatever happens in between (a full disk, kill -9, a power cut);
- a symbolic link is written through to the file it names (the link stays a link);
- a folder, pipe, device or socket is refused, and so is a read-only file (no write permission
  bit set, which holds even for root) or a file name longer than the file system allows;
- the file keeps its permission bits.

A temporary file left by a process killed mid-write is removed by
:func:`remove_stale_temporaries` once it is older than :data:`STALE_AFTER_S`, on every save and
open of the file beside it.  :class:`FileStamp` records what a file held when it was read (its
SHA-256, size and modification time), so a later save can tell whether someone else changed it.
"""

from __future__ import annotations

import contextlib
import hashlib
import os
import stat
import tempfile
import time
from pathlib import Path
from typing import NamedTuple

from .guarded_read import FileRefused, Refusal, file_kind, name_too_long
from .user_text import clipped_path

STALE_AFTER_S = 300.0  # a save takes milliseconds; a temporary this old belongs to a dead process
NEW_FILE_MODE = 0o644
TEMPORARY_SUFFIX = ".tmp"


class FileStamp(NamedTuple):
    """What a file held when it was read or written: its resolved path, SHA-256, size, mtime."""

    path: Path
    digest: str
    size: int
    mtime_ns: int


def digest_of(data: bytes) -> str:
    """The SHA-256 of ``data`` in hex."""
    return hashlib.sha256(data).hexdigest()


def stamp_for(path: str | os.PathLike[str], data: bytes) -> FileStamp:
    """The stamp of the file at ``path`` known to hold ``data`` (size and mtime from the disk)."""
    resolved = resolved_path(path)
    try:
        status = os.stat(resolved)
        size, mtime = status.st_size, status.st_mtime_ns
    except OSError:
        size, mtime = len(data), 0
    return FileStamp(resolved, digest_of(data), size, mtime)


def resolved_path(path: str | os.PathLike[str]) -> Path:
    """``path`` with ``~``, ``..`` and every symbolic link resolved (a missing end is kept)."""
    return Path(os.path.realpath(Path(path).expanduser()))


def writable_target(path: str | os.PathLike[str], *, error: Refusal = FileRefused,
                    what: str = "file", verb: str = "write") -> tuple[Path, int | None]:
    """The file a write to ``path`` lands in (links followed) and its permission bits (None
    when it does not exist yet); ``error`` ("cannot ``verb``: …") when it cannot or must not be
    written."""
    given = Path(path).expanduser()
    too_long = name_too_long(given)
    if too_long:
        raise error(given, too_long)
    target = resolved_path(given)
    too_long = name_too_long(target)
    if too_long:
        raise error(given, too_long)
    try:
        status = os.stat(target)
    except FileNotFoundError:
        if not target.parent.is_dir():
            raise error(given, f"cannot {verb}: no folder {clipped_path(target.parent)}") from None
        return target, None
    except OSError as exc:
        raise error(given, f"cannot {verb}: {exc.strerror or exc}") from None
    kind = file_kind(status.st_mode)
    if kind:
        raise error(given, f"is {kind}, not a {what}: not written")
    if not status.st_mode & (stat.S_IWUSR | stat.S_IWGRP | stat.S_IWOTH):
        raise error(given, "is read-only: not written (save under another name, or make it "
                           "writable first)")
    return target, stat.S_IMODE(status.st_mode)


def write_atomically(path: str | os.PathLike[str], data: bytes, *, mode: int | None = None,
                     error: Refusal = FileRefused, what: str = "file", verb: str = "write") -> Path:
    """Write ``data`` to ``path`` so that it holds either its old or its new bytes, never part;
    the file written (a link's target).  ``mode`` defaults to the file's own bits, else 0644.

    Raises ``error`` in one line when the file must not or cannot be written.
    """
    target, existing_mode = writable_target(path, error=error, what=what, verb=verb)
    remove_stale_temporaries(target)
    try:
        descriptor, temporary = tempfile.mkstemp(dir=target.parent, prefix=f".{target.name}.",
                                                 suffix=TEMPORARY_SUFFIX)
    except OSError as exc:
        raise error(path, f"cannot {verb}: {exc.strerror or exc}") from None
    try:
        with os.fdopen(descriptor, "wb") as handle:
            handle.write(data)
            handle.flush()
            os.fsync(handle.fileno())
        os.chmod(temporary, mode if mode is not None else existing_mode or NEW_FILE_MODE)
        os.replace(temporary, target)
    except BaseException as exc:
        with contextlib.suppress(OSError):
            os.unlink(temporary)
        if isinstance(exc, OSError):
            raise error(path, f"cannot {verb}: {exc.strerror or exc}") from None
        raise
    _sync_folder(target.parent)
    return target


def _sync_folder(folder: Path) -> None:
    """fsync a folder so a rename in it survives a power cut (POSIX; a no-op elsewhere)."""
    if not hasattr(os, "O_DIRECTORY"):
        return
    with contextlib.suppress(OSError):
        descriptor = os.open(folder, os.O_RDONLY | os.O_DIRECTORY)
        try:
            os.fsync(descriptor)
        finally:
            os.close(descriptor)


def remove_stale_temporaries(path: str | os.PathLike[str], *,
                             older_than_s: float = STALE_AFTER_S) -> list[Path]:
    """Remove the temporaries a killed save left beside ``path`` (``.NAME.*.tmp``, including
    those of its ``.bak`` and ``.orig`` copies) once older than ``older_than_s``; those removed."""
    target = Path(path)
    prefix = f".{target.name}."
    cutoff = time.time() - older_than_s
    removed = []
    with contextlib.suppress(OSError), os.scandir(target.parent) as entries:
        for entry in entries:
            if not (entry.name.startswith(prefix) and entry.name.endswith(TEMPORARY_SUFFIX)):
                continue
            with contextlib.suppress(OSError):
                if entry.is_file(follow_symlinks=False) and \
                        entry.stat(follow_symlinks=False).st_mtime < cutoff:
                    os.unlink(entry.path)
                    removed.append(Path(entry.path))
    return removed
