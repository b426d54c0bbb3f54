"""The dialogs: a text checked as it is typed, path completion, answers by button, and the
rule that a screen closes only while it is on top (a palette command that closes a screen
no longer on the stack must not pop another).  Keyboard only."""

from __future__ import annotations

import pytest
from textual.widgets import Input

from screen_host import ScreenHost, cut_widgets

from workbench.tui.dialogs import ChoiceDialog, PathSuggester, TextPrompt


def name_check(text: str) -> str | None:
    return None if text.strip() and text != "taken" else "that name is taken or blank"


@pytest.mark.parametrize("size", [(80, 24), (120, 40)])
async def test_text_prompt_refuses_what_check_refuses(size) -> None:
    app = ScreenHost(lambda: TextPrompt("Rename load case", "Cruise", name_check))
    async with app.run_test(size=size) as pilot:
        await pilot.pause()
        screen = app.screen
        box = screen.query_one("#prompt-input", Input)
        assert app.focused is box
        await pilot.press("end", "ctrl+u", *"taken")
        await pilot.pause()
        assert box.has_class("-invalid")
        assert "taken" in str(screen.query_one("#prompt-message").render())
        await pilot.press("enter")
        await pilot.pause()
        assert app.screen is screen and app.answers == []
        assert cut_widgets(screen) == []
        await pilot.press("backspace", "enter")
        await pilot.pause()
        assert app.answers == ["take"]


async def test_text_prompt_escape_answers_none_once() -> None:
    app = ScreenHost(lambda: TextPrompt("Save session as", "session.toml"))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("escape", "escape")
        await pilot.pause()
        assert app.answers == [None] and app.screen.query_one("#host")


async def test_path_suggester_completes_folders_first(tmp_path) -> None:
    (tmp_path / "alpine").mkdir()
    (tmp_path / "alpha.toml").write_text("", encoding="utf-8")
    (tmp_path / "alps.txt").write_text("", encoding="utf-8")
    suggester = PathSuggester()
    assert await suggester.get_suggestion(f"{tmp_path}/al") == f"{tmp_path}/alpine/"
    assert await suggester.get_suggestion(f"{tmp_path}/alph") == f"{tmp_path}/alpha.toml"
    assert await suggester.get_suggestion(f"{tmp_path}/z") is None
    assert await suggester.get_suggestion(f"{tmp_path}/nowhere/a") is None


async def test_path_completion_is_taken_with_the_right_arrow(tmp_path) -> None:
    (tmp_path / "gearbox.toml").write_text("", encoding="utf-8")
    app = ScreenHost(lambda: TextPrompt("Open session file", "", suggester=PathSuggester()))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press(*f"{tmp_path}/gea")
        await pilot.pause()
        await pilot.pause()
        await pilot.press("right", "enter")
        await pilot.pause()
        assert app.answers == [f"{tmp_path}/gearbox.toml"]


async def test_choice_dialog_answers_with_the_button_chosen() -> None:
    app = ScreenHost(lambda: ChoiceDialog("Unsaved changes", "Drop the changes?",
                                          [("discard", "Drop them"), ("stay", "Stay")]))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        assert app.focused is app.screen.query_one("#answer-discard")
        await pilot.press("right")
        assert app.focused is app.screen.query_one("#answer-stay")
        await pilot.press("enter")
        await pilot.pause()
        assert app.answers == ["stay"]


async def test_a_screen_under_another_does_not_close() -> None:
    app = ScreenHost(lambda: TextPrompt("Rename load case", "Cruise"))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        prompt = app.screen
        on_top = ChoiceDialog("Unsaved changes", "Drop the changes?", [("stay", "Stay")])
        await app.push_screen(on_top)
        await pilot.pause()
        prompt.action_dismiss_none()  # as a command for the prompt would, run late
        await pilot.pause()
        assert app.screen is on_top and app.answers == []
        await pilot.press("escape")
        await pilot.pause()
        assert app.screen is prompt
        await pilot.press("escape")
        await pilot.pause()
        assert app.answers == [None] and app.screen.query_one("#host")
