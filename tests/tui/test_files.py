"""Saving, opening, the unsaved-work guard, autosave to recovery and the recovery offer."""

from __future__ import annotations

from pathlib import Path

from tui_sessions import rig_session

from tui_helpers import retype

from workbench.model.analysis import analyse
from workbench.model import files
from workbench.tui.case_table import CaseTable
from workbench.tui.app import WorkbenchApp
from workbench.tui.dialogs import ChoiceDialog


async def test_save_shows_the_writers_messages(make_app, no_disk, tmp_path: Path) -> None:
    app = make_app(path=tmp_path / "rig.toml")
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "4 kN")
        assert app.document.dirty and "●" in app.sub_title
        await pilot.press("ctrl+s")
        await pilot.pause()
        assert ("save", tmp_path / "rig.toml") in no_disk
        assert ("discard", tmp_path / "rig.toml") in no_disk  # the recovery copy goes
        assert not app.document.dirty and "●" not in app.sub_title
        assert any("wrote rig.toml" in n.message for n in app.notices_given)


async def test_save_error_is_a_notice(make_app, monkeypatch, tmp_path: Path) -> None:
    monkeypatch.setattr(files, "save", lambda s, p, **answers: files.FileOutcome(error="disk full (test)"))
    app = make_app(path=tmp_path / "rig.toml")
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "4 kN")
        await pilot.press("ctrl+s")
        await pilot.pause()
        assert app.document.dirty
        assert any("disk full" in n.message for n in app.notices_given)


async def test_quit_guard_can_save_then_quit(make_app, no_disk, tmp_path: Path) -> None:
    app = make_app(path=tmp_path / "rig.toml")
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "4 kN")
        await pilot.press("ctrl+q")
        await pilot.pause()
        assert isinstance(app.screen, ChoiceDialog)
        app.screen.query_one("#answer-save").press()
        await pilot.pause()
        assert ("save", tmp_path / "rig.toml") in no_disk
    assert app.return_value == 0


class _HeldTimer:
    """A timer that fires only when told: the quiet spell without waiting for the clock."""

    def __init__(self, delay: float, callback) -> None:
        self.delay, self.callback, self.stopped = delay, callback, False

    def stop(self) -> None:
        self.stopped = True


async def test_autosave_writes_recovery_after_a_quiet_spell(make_app, no_disk,
                                                            monkeypatch) -> None:
    app = make_app(autosave_delay=2.0)
    async with app.run_test(size=(80, 24)) as pilot:
        timers: list[_HeldTimer] = []
        screen = app.workbench_screen
        monkeypatch.setattr(screen, "set_timer", lambda delay, callback, **kw: (
            timers.append(_HeldTimer(delay, callback)), timers[-1])[1])
        await retype(pilot, app, "fr", "4 kN")
        await retype(pilot, app, "fa", "2 kN")
        assert not [c for c in no_disk if c[0] == "recovery"]
        # Debounced: each change puts the quiet spell off; only the last timer still runs.
        live = [timer for timer in timers if not timer.stopped and timer.delay == 2.0]
        assert len(timers) > 2 and len(live) == 1
        live[0].callback()  # the quiet spell ends
        assert [c for c in no_disk if c[0] == "recovery"] == [("recovery", None)]


async def test_recovery_is_offered_and_taken(monkeypatch, tmp_path: Path) -> None:
    found = tmp_path / "rig.toml.recovery"
    recovered_session = rig_session()
    recovered_session.cases[0].texts["fr"] = "7 kN"
    monkeypatch.setattr(files, "recovery_for", lambda path: found)
    monkeypatch.setattr(files, "open_session",
                        lambda path, recovered=False: files.FileOutcome(session=recovered_session,
                                                                        path=path))
    app = WorkbenchApp(rig_session(), tmp_path / "rig.toml", autosave_delay=None)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        assert isinstance(app.screen, ChoiceDialog)
        app.screen.query_one("#answer-recover").press()
        await pilot.pause()
        assert app.document.session.cases[0].texts["fr"] == "7 kN"
        assert app.document.dirty and app.document.path == tmp_path / "rig.toml"


def test_missing_session_module_is_a_message_not_a_crash(monkeypatch, tmp_path) -> None:
    import builtins

    real_import = builtins.__import__

    def refuse(name, *args, **kwargs):
        if name.endswith("sessionfile") or (args and args[2] and "sessionfile" in args[2]):
            raise ImportError("sessionfile missing (test)")
        return real_import(name, *args, **kwargs)

    monkeypatch.setattr(builtins, "__import__", refuse)
    assert files.save(rig_session(), tmp_path / "x.toml").error is not None
    assert files.open_session(tmp_path / "x.toml").error is not None
    assert files.recovery_for(None) is None
    assert files.write_recovery_copy(rig_session(), None) is not None


# ---- with the real session files (folders redirected to tmp_path by the conftest) ----------

async def test_real_save_reports_kept_comments(make_app, tmp_path: Path) -> None:
    from workbench.model.sessionfile import load_session, save_session

    path = tmp_path / "rig.toml"
    save_session(rig_session(), path)
    path.write_text("# hand-written note\n" + path.read_text(encoding="utf-8"), encoding="utf-8")
    opened = files.open_session(path)
    app = WorkbenchApp(opened.session, path, offer_recovery=False, autosave_delay=None,
                       stamp=opened.stamp)
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "4 kN")
        await pilot.press("ctrl+s")
        await pilot.pause()
        assert any(".orig" in n.message for n in app.notices_given)
    assert load_session(path).cases[0].texts["fr"] == "4 kN"
    assert (tmp_path / "rig.toml.orig").exists() or list(tmp_path.glob("*.orig"))


async def test_real_recovery_round_trip(tmp_path: Path) -> None:
    from workbench.model.sessionfile import find_recovery, save_session

    path = tmp_path / "rig.toml"
    save_session(rig_session(), path)
    opened = files.open_session(path)
    first = WorkbenchApp(opened.session, path, offer_recovery=False, autosave_delay=0.2,
                         stamp=opened.stamp)
    async with first.run_test(size=(80, 24)) as pilot:
        await retype(pilot, first, "fr", "4.5 kN")
        await pilot.pause(0.6)
        assert find_recovery(path) is not None
        first.exit(0)  # as if the terminal were closed: no save
    opened = files.open_session(path)
    second = WorkbenchApp(opened.session, path, autosave_delay=None, stamp=opened.stamp)
    async with second.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        assert isinstance(second.screen, ChoiceDialog)
        second.screen.query_one("#answer-recover").press()
        await pilot.pause()
        assert second.document.session.cases[0].texts["fr"] == "4.5 kN"
        await pilot.press("ctrl+s")
        await pilot.pause()
    assert find_recovery(path) is None  # saved: the recovery copy is gone


def test_run_app_refuses_an_unreadable_file(tmp_path: Path, capsys) -> None:
    from workbench.tui.app import run_app

    bad = tmp_path / "bad.toml"
    bad.write_text("this is [not toml", encoding="utf-8")
    assert run_app(str(bad)) == 2
    assert "bad.toml" in capsys.readouterr().err


async def test_demo_session_shows_on_the_screen() -> None:
    demo = files.demo_path()
    assert demo is not None
    outcome = files.open_session(demo)
    assert outcome.session is not None
    app = WorkbenchApp(outcome.session, None, offer_recovery=False, autosave_delay=None)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        table = app.workbench_screen.query_one(CaseTable)
        # the session's own cases, then those its shaft generates
        assert table.row_count == len(analyse(outcome.session).cases) > len(outcome.session.cases)
        assert app.workbench_screen.query_one("#derivation-view").text.plain.startswith("Load case")
