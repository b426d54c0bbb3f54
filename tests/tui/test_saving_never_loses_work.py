"""Saving, opening and recovery from the screen never lose work without a word (issue 18):
with the real session files (the conftest points config and recovery folders at tmp_path).

Expectations are the issue's: a file changed on disk since it was read, a file that is not a
session and another session are each asked about (save elsewhere / replace / cancel); read-only
files and folders are refused with a message; a link is written through to its target; the open
dialog names each file of the hostile corpus in place and leaves the session under edit alone;
escape on the recovery offer keeps the copy; a crashed screen exits non-zero.
"""

from __future__ import annotations

import os
import sys
from pathlib import Path

import pytest
from textual.widgets import Input, Static
from screen_host import cut_widgets
from tui_helpers import retype
from tui_sessions import rig_session

from workbench.model import files
from workbench.model.sessionfile import dumps_session, load_session, recovery_path, save_session
from workbench.tui.app import WorkbenchApp, exit_code
from workbench.tui.dialogs import ChoiceDialog, TextPrompt
from workbench.tui.open_dialog import OpenDialog
from workbench.tui.dialogs import SaveQuestion

sys.path.insert(0, str(Path(__file__).parents[1] / "hostile"))
from corpus import REFUSED_SESSIONS, write_files, write_special_files  # noqa: E402


def _opened_app(path: Path, **options: object) -> WorkbenchApp:
    """The app on the file at ``path`` as ``workbench PATH`` opens it (its stamp kept)."""
    opened = files.open_session(path)
    assert opened.session is not None, opened.error
    options.setdefault("offer_recovery", False)
    options.setdefault("autosave_delay", None)
    return WorkbenchApp(opened.session, path, stamp=opened.stamp, **options)  # type: ignore[arg-type]


def _saved_rig(path: Path) -> Path:
    save_session(rig_session(), path)
    return path


async def _answer(pilot, app: WorkbenchApp, answer: str) -> None:
    app.screen.query_one(f"#answer-{answer}").press()
    await pilot.pause()


# ---- two instances, one file -----------------------------------------------------------------

async def test_second_instance_is_asked_and_cancel_keeps_the_other_save(tmp_path: Path) -> None:
    path = _saved_rig(tmp_path / "rig.toml")
    first, second = _opened_app(path), _opened_app(path)
    async with first.run_test(size=(80, 24)) as pilot:
        await retype(pilot, first, "fr", "4 kN")
        await pilot.press("ctrl+s")
        await pilot.pause()
        assert not first.document.dirty
    assert load_session(path).cases[0].texts["fr"] == "4 kN"
    async with second.run_test(size=(80, 24)) as pilot:
        await retype(pilot, second, "fa", "2 kN")
        await pilot.press("ctrl+s")
        await pilot.pause()
        assert isinstance(second.screen, SaveQuestion)
        assert second.screen.kind == "changed on disk"
        await pilot.press("escape")  # cancel: nothing written
        await pilot.pause()
        assert second.document.dirty
        await pilot.press("ctrl+s")
        await pilot.pause()
        await _answer(pilot, second, "cancel")
        assert second.document.dirty
    on_disk = load_session(path).cases[0].texts
    assert on_disk["fr"] == "4 kN" and on_disk["fa"] == "1 kN"  # the first's work is there


async def test_second_instance_may_replace_after_asking(tmp_path: Path) -> None:
    path = _saved_rig(tmp_path / "rig.toml")
    second = _opened_app(path)
    path.write_text(path.read_text(encoding="utf-8").replace("3 kN", "3.5 kN"), encoding="utf-8")
    async with second.run_test(size=(80, 24)) as pilot:
        await retype(pilot, second, "fa", "2 kN")
        await pilot.press("ctrl+s")
        await pilot.pause()
        assert isinstance(second.screen, SaveQuestion)
        assert second.screen.focused.id == "answer-elsewhere"  # a stray enter replaces nothing
        await _answer(pilot, second, "replace")
        assert not second.document.dirty
        assert "3.5 kN" in (tmp_path / "rig.toml.bak").read_text(encoding="utf-8")
        await retype(pilot, second, "fa", "2.5 kN")  # the next save is no question: it wrote last
        await pilot.press("ctrl+s")
        await pilot.pause()
        assert not isinstance(second.screen, SaveQuestion) and not second.document.dirty
    assert load_session(path).cases[0].texts["fa"] == "2.5 kN"


async def test_save_elsewhere_keeps_both_and_then_quits(tmp_path: Path) -> None:
    path = _saved_rig(tmp_path / "rig.toml")
    app = _opened_app(path)
    other = path.read_text(encoding="utf-8").replace("3 kN", "3.5 kN")
    path.write_text(other, encoding="utf-8")
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fa", "2 kN")
        await pilot.press("ctrl+q")  # unsaved: save and quit
        await pilot.pause()
        await _answer(pilot, app, "save")
        assert isinstance(app.screen, SaveQuestion)
        await _answer(pilot, app, "elsewhere")
        assert isinstance(app.screen, TextPrompt)
        box = app.screen.query_one(Input)
        box.value = str(tmp_path / "mine.toml")
        await pilot.press("enter")
        await pilot.pause()
    assert app.return_value == 0  # saved elsewhere, then quit
    assert path.read_text(encoding="utf-8") == other
    assert load_session(tmp_path / "mine.toml").cases[0].texts["fa"] == "2 kN"


# ---- what the target is ----------------------------------------------------------------------

async def test_save_as_onto_a_file_that_is_not_a_session_asks(tmp_path: Path) -> None:
    readme = tmp_path / "README.md"
    readme.write_text("# notes\nnot a session\n", encoding="utf-8")
    app = _opened_app(_saved_rig(tmp_path / "rig.toml"))
    async with app.run_test(size=(80, 24)) as pilot:
        app.workbench_screen.save_to(readme)
        await pilot.pause()
        assert isinstance(app.screen, SaveQuestion) and app.screen.kind == "not a session"
        await _answer(pilot, app, "cancel")
        assert readme.read_text(encoding="utf-8") == "# notes\nnot a session\n"
        app.workbench_screen.save_to(readme)
        await pilot.pause()
        await _answer(pilot, app, "replace")
    assert load_session(readme) == rig_session()
    assert (tmp_path / "README.md.bak").read_text(encoding="utf-8") == "# notes\nnot a session\n"


async def test_save_as_onto_another_session_asks(tmp_path: Path) -> None:
    other = tmp_path / "other.toml"
    save_session(rig_session(1), other)
    app = _opened_app(_saved_rig(tmp_path / "rig.toml"))
    async with app.run_test(size=(80, 24)) as pilot:
        app.workbench_screen.save_to(other)
        await pilot.pause()
        assert isinstance(app.screen, SaveQuestion) and app.screen.kind == "exists"
        await pilot.press("escape")
        await pilot.pause()
    assert load_session(other) == rig_session(1)


async def test_read_only_file_is_refused_with_a_message(tmp_path: Path) -> None:
    """Refused by its permission bits, even for root (who could write it)."""
    path = _saved_rig(tmp_path / "rig.toml")
    app = _opened_app(path)
    before = path.read_bytes()
    path.chmod(0o444)
    try:
        async with app.run_test(size=(80, 24)) as pilot:
            await retype(pilot, app, "fr", "4 kN")
            await pilot.press("ctrl+s")
            await pilot.pause()
            assert not isinstance(app.screen, ChoiceDialog)
            assert app.document.dirty
            assert any("read-only" in n.message for n in app.notices_given)
    finally:
        path.chmod(0o644)
    assert path.read_bytes() == before


async def test_a_folder_is_refused_with_a_message(tmp_path: Path) -> None:
    folder = tmp_path / "folder.toml"
    folder.mkdir()
    app = _opened_app(_saved_rig(tmp_path / "rig.toml"))
    async with app.run_test(size=(80, 24)) as pilot:
        app.workbench_screen.save_to(folder)
        await pilot.pause()
        assert not isinstance(app.screen, ChoiceDialog)
        assert any(n.title == "Not saved" for n in app.notices_given)
    assert folder.is_dir()


async def test_save_writes_through_a_link_to_its_target(tmp_path: Path) -> None:
    target = _saved_rig(tmp_path / "real.toml")
    link = tmp_path / "link.toml"
    link.symlink_to(target)
    app = _opened_app(link)
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "4 kN")
        await pilot.press("ctrl+s")
        await pilot.pause()
        assert not isinstance(app.screen, ChoiceDialog) and not app.document.dirty
    assert link.is_symlink() and link.resolve() == target
    assert load_session(target).cases[0].texts["fr"] == "4 kN"


# ---- the open dialog and the hostile corpus --------------------------------------------------

def _hostile_files(folder: Path) -> list[Path]:
    special = write_special_files(folder / "special")
    return [*write_files(folder, REFUSED_SESSIONS), *special.values()]


async def test_open_dialog_names_each_hostile_file_in_place(tmp_path: Path) -> None:
    """Every file of the corpus: a line in the dialog, the dialog stays, the session is as it
    was (not even marked changed)."""
    app = _opened_app(_saved_rig(tmp_path / "rig.toml"))
    before = dumps_session(app.document.session)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.press("ctrl+o")
        await pilot.pause()
        dialog = app.screen
        assert isinstance(dialog, OpenDialog)
        for path in _hostile_files(tmp_path / "corpus"):
            dialog.query_one("#open-path", Input).value = str(path)
            await pilot.pause()
            await pilot.press("enter")
            await pilot.pause()
            assert app.screen is dialog, path.name
            message = str(dialog.query_one("#open-message", Static).render())
            assert message.strip() and "Traceback" not in message, path.name
            assert len(message) < 400 and "\x1b" not in message, path.name
        await pilot.press("escape")
        await pilot.pause()
        assert not isinstance(app.screen, OpenDialog)
    assert dumps_session(app.document.session) == before and not app.document.dirty


async def test_open_dialog_opens_a_good_file_with_its_stamp(tmp_path: Path) -> None:
    other = tmp_path / "other.toml"
    save_session(rig_session(1), other)
    app = _opened_app(_saved_rig(tmp_path / "rig.toml"))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.press("ctrl+o")
        await pilot.pause()
        app.screen.query_one("#open-path", Input).value = str(other)
        await pilot.press("enter")
        await pilot.pause()
        assert not isinstance(app.screen, OpenDialog)
        assert app.document.path == other and len(app.document.session.cases) == 1
        await retype(pilot, app, "fr", "4 kN")
        await pilot.press("ctrl+s")  # read here: saved without a question
        await pilot.pause()
        assert not isinstance(app.screen, ChoiceDialog) and not app.document.dirty


# ---- recovery --------------------------------------------------------------------------------

def _left_recovery_copy(tmp_path: Path) -> tuple[Path, Path, bytes]:
    path = _saved_rig(tmp_path / "rig.toml")
    crashed = rig_session()
    crashed.cases[0].texts["fr"] = "7 kN"
    assert files.write_recovery_copy(crashed, path) is None
    copy = recovery_path(path)
    stat = path.stat()
    os.utime(path, ns=(stat.st_atime_ns, copy.stat().st_mtime_ns - 10**9))  # the copy is newer
    return path, copy, copy.read_bytes()


@pytest.mark.parametrize("answer", ["escape", "keep"])
async def test_escape_on_the_recovery_offer_keeps_the_copy(answer: str, tmp_path: Path) -> None:
    path, copy, data = _left_recovery_copy(tmp_path)
    app = _opened_app(path, offer_recovery=True, autosave_delay=0.1)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        assert isinstance(app.screen, ChoiceDialog)
        if answer == "escape":
            await pilot.press("escape")
            await pilot.pause()
        else:
            await _answer(pilot, app, "keep")
        assert app.document.session.cases[0].texts["fr"] == "3 kN"  # the file as saved
        await retype(pilot, app, "fa", "2 kN")
        await pilot.pause(0.4)  # this run's autosave writes its own copy
    kept = [p for p in copy.parent.iterdir() if ".kept-" in p.name]
    assert len(kept) == 1 and kept[0].read_bytes() == data
    assert load_session(kept[0], check_values=False).cases[0].texts["fr"] == "7 kN"


async def test_discard_on_the_recovery_offer_deletes_the_copy(tmp_path: Path) -> None:
    path, copy, _ = _left_recovery_copy(tmp_path)
    app = _opened_app(path, offer_recovery=True)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await _answer(pilot, app, "discard")
    assert not copy.exists() and not [p for p in copy.parent.iterdir() if ".kept-" in p.name]


@pytest.mark.parametrize("open_other", [True, False], ids=["opened", "cancelled"])
async def test_dropping_the_changes_drops_their_recovery_copy(open_other: bool,
                                                              tmp_path: Path) -> None:
    """"Drop changes and open", then another file opened: the dropped changes' recovery copy
    goes with them (it came back as a crash's on the next start).  Cancelling the open keeps
    the changes, and their copy."""
    path, other = _saved_rig(tmp_path / "rig.toml"), tmp_path / "other.toml"
    save_session(rig_session(1), other)
    app = _opened_app(path)
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "4 kN")
        app.workbench_screen.autosave()
        assert recovery_path(path).exists()
        await pilot.press("escape", "ctrl+o")
        await pilot.pause()
        await _answer(pilot, app, "discard")
        assert isinstance(app.screen, OpenDialog)
        if open_other:
            app.screen.query_one("#open-path", Input).value = str(other)
            await pilot.press("enter")
        else:
            await pilot.press("escape")
        await pilot.pause()
        assert app.document.path == (other if open_other else path)
    assert recovery_path(path).exists() is not open_other


async def test_save_and_open_saves_then_opens_the_chosen_file(tmp_path: Path) -> None:
    """The open dialog's unsaved-changes question offers "Save and open" first: the session is
    saved, then the file chosen is opened."""
    path, other = _saved_rig(tmp_path / "rig.toml"), tmp_path / "other.toml"
    save_session(rig_session(1), other)
    app = _opened_app(path)
    async with app.run_test(size=(80, 24)) as pilot:
        await retype(pilot, app, "fr", "4 kN")
        await pilot.press("escape", "ctrl+o")
        await pilot.pause()
        assert isinstance(app.screen, ChoiceDialog)
        assert cut_widgets(app.screen) == []
        assert app.focused is app.screen.query_one("#answer-save")  # the safe answer first
        await pilot.press("enter")
        await pilot.pause()
        assert load_session(path).cases[0].texts["fr"] == "4 kN" and not app.document.dirty
        assert isinstance(app.screen, OpenDialog)
        app.screen.query_one("#open-path", Input).value = str(other)
        await pilot.press("enter")
        await pilot.pause()
        assert app.document.path == other and len(app.document.session.cases) == 1
    assert not recovery_path(path).exists()


async def test_save_and_open_opens_nothing_when_the_save_is_refused(tmp_path: Path) -> None:
    """A read-only session file: "Save and open" says why it was not saved and that nothing
    else was opened; the changes stay under edit."""
    path = _saved_rig(tmp_path / "rig.toml")
    app = _opened_app(path)
    before = path.read_bytes()
    path.chmod(0o444)
    try:
        async with app.run_test(size=(80, 24)) as pilot:
            await retype(pilot, app, "fr", "4 kN")
            await pilot.press("escape", "ctrl+o")
            await pilot.pause()
            await _answer(pilot, app, "save")
            assert not isinstance(app.screen, (OpenDialog, ChoiceDialog))
            assert app.document.dirty and app.document.path == path
            assert app.document.session.cases[0].texts["fr"] == "4 kN"
            refused = app.notices_given[-1]
            assert refused.title == "Not saved" and "read-only" in refused.message
            assert refused.message.endswith(files.NOT_OPENED)
    finally:
        path.chmod(0o644)
    assert path.read_bytes() == before


# ---- exit status -----------------------------------------------------------------------------

class Crashing(WorkbenchApp):
    """The workbench with an action that fails, as a bug would."""

    def action_crash(self) -> None:
        raise RuntimeError("a bug (test)")


async def test_a_crash_exits_non_zero_and_keeps_the_unsaved_work(tmp_path: Path, capsys) -> None:
    path = _saved_rig(tmp_path / "rig.toml")
    opened = files.open_session(path)
    app = Crashing(opened.session, path, stamp=opened.stamp, offer_recovery=False,
                   autosave_delay=None)
    with pytest.raises(RuntimeError, match="a bug"):
        async with app.run_test(size=(80, 24)) as pilot:
            await retype(pilot, app, "fr", "4 kN")
            app.call_later(app.run_action, "crash")  # in the app's loop, as a key would
            await pilot.pause()
    assert exit_code(app, app.return_value) == 1
    err = capsys.readouterr().err
    assert err.splitlines()[-1].startswith("workbench: the screen stopped on an error")
    assert load_session(recovery_path(path), check_values=False).cases[0].texts["fr"] == "4 kN"


async def test_a_clean_quit_exits_zero(tmp_path: Path) -> None:
    app = _opened_app(_saved_rig(tmp_path / "rig.toml"))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.press("ctrl+q")
        await pilot.pause()
    assert exit_code(app, app.return_value) == 0
