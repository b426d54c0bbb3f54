"""Saving that never loses work, and opening that never raises: the rules the screen relies on.

Each test names the loss it guards against.  The expectations are POSIX file semantics
(links, permission bits, rename) and the rules written in DEVELOPERS.md (Session files).
"""

from __future__ import annotations

import os
import time
from pathlib import Path

import pytest

from workbench.model.safe_write import STALE_AFTER_S, remove_stale_temporaries, write_atomically
from workbench.model.session import Bearing, LoadCase, Session
from workbench.model.sessionfile import (
    SaveStatus, SessionFileError, dumps_session, load_session, open_session, recovery_path,
    save_session, try_save_session,
)


def session(title: str) -> Session:
    return Session(title=title,
                   bearings=[Bearing("B1", {"kind": "deep-groove", "c": "30 kN", "c0": "18 kN"})],
                   cases=[LoadCase("C1", "B1", {"fr": "2 kN", "speed": "900 rpm"})])


def test_second_instance_is_asked_before_overwriting_the_first_ones_save(tmp_path: Path) -> None:
    """Two instances on one file: the later save sees the file changed since it read it."""
    path = tmp_path / "shared.toml"
    save_session(session("start"), path)
    first, second = open_session(path), open_session(path)
    saved = try_save_session(session("first's change"), path, read_stamp=first.stamp)
    assert saved.status is SaveStatus.SAVED
    clash = try_save_session(session("second's change"), path, read_stamp=second.stamp)
    assert clash.status is SaveStatus.CHANGED_ON_DISK and "changed on disk" in clash.message
    assert load_session(path).title == "first's change"  # nothing written yet
    agreed = try_save_session(session("second's change"), path, read_stamp=second.stamp,
                              confirmed=[SaveStatus.CHANGED_ON_DISK])
    assert agreed.status is SaveStatus.SAVED
    assert load_session(agreed.backup).title == "first's change"  # the other's work is kept


def test_saving_again_with_the_new_stamp_asks_nothing(tmp_path: Path) -> None:
    """The stamp a save returns is the one the next save compares with."""
    path = tmp_path / "own.toml"
    outcome = try_save_session(session("one"), path)
    again = try_save_session(session("two"), path, read_stamp=outcome.stamp)
    assert again.status is SaveStatus.SAVED and load_session(path).title == "two"


def test_a_file_that_is_not_a_session_is_not_replaced_without_asking(tmp_path: Path) -> None:
    """Save-as onto README.md asks first; the README stays until the person agrees."""
    readme = tmp_path / "README.md"
    readme.write_text("# notes\n", encoding="utf-8")
    outcome = try_save_session(session("s"), readme)
    assert outcome.status is SaveStatus.NOT_A_SESSION
    assert readme.read_text(encoding="utf-8") == "# notes\n"
    with pytest.raises(SessionFileError):  # the raising door refuses it too
        save_session(session("s"), readme)
    agreed = try_save_session(session("s"), readme, confirmed=[SaveStatus.NOT_A_SESSION])
    assert agreed.status is SaveStatus.SAVED
    assert agreed.backup is not None and agreed.backup.read_text(encoding="utf-8") == "# notes\n"


def test_save_as_onto_another_session_asks(tmp_path: Path) -> None:
    """An untitled session saved onto an existing session file asks before replacing it."""
    path = tmp_path / "other.toml"
    save_session(session("other"), path)
    assert try_save_session(session("mine"), path).status is SaveStatus.EXISTS
    assert load_session(path).title == "other"


def test_symlink_is_written_through_and_stays_a_link(tmp_path: Path) -> None:
    """A linked session is saved into the file the link names; the link is kept."""
    real = tmp_path / "real.toml"
    link = tmp_path / "link.toml"
    save_session(session("one"), real)
    link.symlink_to(real.name)
    opened = open_session(link)
    outcome = try_save_session(session("two"), link, read_stamp=opened.stamp)
    assert outcome.status is SaveStatus.SAVED and outcome.path == real.resolve()
    assert link.is_symlink() and load_session(real).title == "two"


def test_read_only_file_is_refused(tmp_path: Path) -> None:
    """A file without write permission is not replaced, even by root (the bits decide)."""
    path = tmp_path / "locked.toml"
    save_session(session("kept"), path)
    opened = open_session(path)
    path.chmod(0o444)
    outcome = try_save_session(session("new"), path, read_stamp=opened.stamp)
    assert outcome.status is SaveStatus.REFUSED and "read-only" in outcome.message
    assert load_session(path).title == "kept"


@pytest.mark.skipif(not hasattr(os, "mkfifo"), reason="POSIX FIFOs")
def test_non_regular_files_are_refused(tmp_path: Path) -> None:
    """A pipe or a folder in the way is refused, never replaced by a regular file."""
    pipe = tmp_path / "pipe.toml"
    os.mkfifo(pipe)
    assert "pipe" in try_save_session(session("s"), pipe).message
    (tmp_path / "dir.toml").mkdir()
    assert "folder" in try_save_session(session("s"), tmp_path / "dir.toml").message
    assert pipe.exists() and not pipe.is_file()


def test_name_over_255_bytes_is_a_message(tmp_path: Path) -> None:
    """An over-long file name is refused in words; opening it too."""
    path = tmp_path / ("n" * 300 + ".toml")
    assert "255" in try_save_session(session("s"), path).message
    assert "255" in open_session(path).error


def test_open_never_raises(tmp_path: Path) -> None:
    """Opening a hostile file gives an error line; the screen keeps its session."""
    bad = tmp_path / "bad.toml"
    bad.write_text("x = " + "[" * 10_000, encoding="utf-8")
    outcome = open_session(bad)
    assert outcome.session is None and outcome.error and "\n" not in outcome.error
    assert open_session(tmp_path / "absent.toml").error.endswith("no such file")


def test_stale_temporaries_are_removed_fresh_ones_kept(tmp_path: Path) -> None:
    """kill -9 mid-save leaves .NAME.toml.*.tmp files: old ones go on save/open, fresh stay
    (a fresh one may belong to a save running in another process)."""
    path = tmp_path / "work.toml"
    save_session(session("s"), path)
    stale = tmp_path / ".work.toml.bak.abc123.tmp"
    fresh = tmp_path / ".work.toml.def456.tmp"
    other = tmp_path / ".other.toml.ghi789.tmp"
    for item in (stale, fresh, other):
        item.write_text("partial", encoding="utf-8")
    old = time.time() - STALE_AFTER_S - 60
    os.utime(stale, (old, old))
    os.utime(other, (old, old))
    open_session(path)
    assert not stale.exists() and fresh.exists() and other.exists()
    assert remove_stale_temporaries(tmp_path / "other.toml") == [other]


def test_recovery_copy_is_keyed_on_the_resolved_path(tmp_path: Path,
                                                     monkeypatch: pytest.MonkeyPatch) -> None:
    """'../r.toml', 'r.toml' and a link to it share one recovery copy."""
    (tmp_path / "sub").mkdir()
    (tmp_path / "r.toml").write_text(dumps_session(session("r")), encoding="utf-8")
    (tmp_path / "link.toml").symlink_to("r.toml")
    monkeypatch.chdir(tmp_path / "sub")
    assert recovery_path("../r.toml") == recovery_path(tmp_path / "r.toml") \
        == recovery_path(tmp_path / "link.toml")
    assert len(recovery_path("n" * 250 + ".toml").name) < 255


def test_atomic_write_keeps_the_old_file_when_writing_fails(tmp_path: Path,
                                                             monkeypatch: pytest.MonkeyPatch) -> None:
    """A write that fails part-way (a full disk) leaves the old bytes and no temporary."""
    path = tmp_path / "report.md"
    path.write_text("old report", encoding="utf-8")

    def full_disk(descriptor: int) -> None:
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(os, "fsync", full_disk)
    with pytest.raises(Exception, match="No space left"):
        write_atomically(path, b"new report")
    assert path.read_text(encoding="utf-8") == "old report"
    assert [p.name for p in tmp_path.iterdir()] == ["report.md"]
