"""Fixtures for the screen tests: frozen cursor blink, a private config folder, app factories."""

from __future__ import annotations

import sys
from collections.abc import Callable
from pathlib import Path
from types import SimpleNamespace

import pytest
from textual.widgets import Input

sys.path.insert(0, str(Path(__file__).parent))  # tui_sessions and tui_helpers beside the tests

from tui_sessions import rig_session  # noqa: E402

from workbench.model import files  # noqa: E402
from workbench.model.settings import CONFIG_DIR_VARIABLE  # noqa: E402
from workbench.tui.app import WorkbenchApp  # noqa: E402


@pytest.fixture(autouse=True)
def freeze_cursor_blink(monkeypatch: pytest.MonkeyPatch) -> None:
    """Keep the text cursor still, so timing never leaks into a test or a snapshot."""
    monkeypatch.setattr(Input, "_toggle_cursor", lambda self: None)


@pytest.fixture(autouse=True)
def notices_given(monkeypatch: pytest.MonkeyPatch) -> None:
    """Every notice the app gives is kept in ``app.notices_given`` (message, title, severity)
    for the test to read: on screen a notice expires after 8–12 s, and a busy machine can take
    longer than that to reach the check."""
    real_notify = WorkbenchApp.notify

    def notify(self: WorkbenchApp, message: str, **options: object) -> None:
        given = self.__dict__.setdefault("notices_given", [])
        given.append(SimpleNamespace(message=message, title=options.get("title", ""),
                                     severity=options.get("severity", "information")))
        real_notify(self, message, **options)  # type: ignore[arg-type]

    monkeypatch.setattr(WorkbenchApp, "notify", notify)


@pytest.fixture(autouse=True)
def private_config(monkeypatch: pytest.MonkeyPatch, tmp_path: Path) -> Path:
    """Settings (the remembered theme) and recovery copies go to temporary folders; colour is
    not suppressed."""
    folder = tmp_path / "config"
    monkeypatch.setenv(CONFIG_DIR_VARIABLE, str(folder))
    monkeypatch.setenv("XDG_DATA_HOME", str(tmp_path / "data"))
    monkeypatch.setenv("XDG_CONFIG_HOME", str(tmp_path / "xdg-config"))
    monkeypatch.delenv("NO_COLOR", raising=False)
    return folder


@pytest.fixture
def no_disk(monkeypatch: pytest.MonkeyPatch) -> list[tuple[str, object]]:
    """Session-file calls recorded instead of touching the disk; returns the record."""
    calls: list[tuple[str, object]] = []

    def fake_save(session: object, path: Path, **answers: object) -> files.FileOutcome:
        calls.append(("save", path))
        return files.FileOutcome(path=path, messages=[f"wrote {path.name}"])

    def fake_open(path: Path, *, recovered: bool = False) -> files.FileOutcome:
        calls.append(("open", path))
        return files.FileOutcome(error=f"{path}: no such file (test)")

    def fake_recovery(session: object, path: Path | None) -> None:
        calls.append(("recovery", path))
        return None

    monkeypatch.setattr(files, "save", fake_save)
    monkeypatch.setattr(files, "open_session", fake_open)
    monkeypatch.setattr(files, "write_recovery_copy", fake_recovery)
    monkeypatch.setattr(files, "discard_recovery_copy", lambda path: calls.append(("discard", path)))
    return calls


@pytest.fixture
def make_app() -> Callable[..., WorkbenchApp]:
    """A factory of workbench apps on the test-rig session, recovery and autosave off."""
    def factory(cases: int = 3, **options: object) -> WorkbenchApp:
        options.setdefault("offer_recovery", False)
        options.setdefault("autosave_delay", None)
        return WorkbenchApp(rig_session(cases), **options)  # type: ignore[arg-type]
    return factory
