"""Theme files: validated, registered, remembered; bad files named once; NO_COLOR respected."""

from __future__ import annotations

import shutil
from importlib.resources import files
from pathlib import Path

import pytest
from textual.color import Color

from workbench.model import settings
from workbench.tui.theme_files import (
    DEFAULT_THEME, MONOCHROME_THEME, ThemeFileError, load_theme_files, theme_from_data,
)

SHIPPED = Path(str(files("workbench.themes")))


def test_shipped_themes_all_load() -> None:
    load = load_theme_files()
    names = {theme.name for theme in load.themes}
    assert not load.failures
    assert {"bench-night", "bench-paper", "bench-floodlit", "bench-mono"} <= names
    assert DEFAULT_THEME in names and MONOCHROME_THEME in names


def _luminance(hex_colour: str) -> float:
    # WCAG 2.1 relative luminance (sRGB), the basis of its contrast ratio.
    def channel(c: float) -> float:
        return c / 12.92 if c <= 0.04045 else ((c + 0.055) / 1.055) ** 2.4
    colour = Color.parse(hex_colour)
    r, g, b = (channel(v / 255) for v in (colour.r, colour.g, colour.b))
    return 0.2126 * r + 0.7152 * g + 0.0722 * b


@pytest.mark.parametrize("name", ["bench-night", "bench-paper", "bench-floodlit", "bench-mono"])
def test_text_contrast_meets_wcag_aa(name: str) -> None:
    theme = next(t for t in load_theme_files().themes if t.name == name)
    light, dark = sorted((_luminance(theme.foreground), _luminance(theme.background)),
                         reverse=True)
    ratio = (light + 0.05) / (dark + 0.05)  # WCAG 2.1 §1.4.3: at least 4.5 for body text
    assert ratio >= (15 if name == "bench-floodlit" else 4.5)


def test_monochrome_theme_has_only_greys() -> None:
    theme = next(t for t in load_theme_files().themes if t.name == MONOCHROME_THEME)
    for colour in (theme.primary, theme.warning, theme.error, theme.background):
        parsed = Color.parse(colour)
        assert parsed.r == parsed.g == parsed.b


@pytest.mark.parametrize(("data", "words"), [
    ({"dark": True, "colors": {"primary": "#123456"}}, "name"),
    ({"name": "x-1", "colors": {}}, "primary"),
    ({"name": "x-1", "colors": {"primary": "not a colour"}}, "not a colour"),
    ({"name": "x-1", "colors": {"primary": "#123456", "glow": "#fff"}}, "unknown colour"),
    ({"name": "x-1", "dark": "yes", "colors": {"primary": "#123456"}}, "dark"),
    ({"name": "x-1", "colors": {"primary": "#123456"}, "extra": 1}, "unknown key"),
    ({"name": "x-1", "colors": {"primary": "#123456"}, "text_alpha": 3}, "text_alpha"),
])
def test_bad_theme_data_is_refused(data: dict, words: str) -> None:
    with pytest.raises(ThemeFileError, match=words):
        theme_from_data(data)


def _folder_with_bad_files(tmp_path: Path) -> Path:
    folder = tmp_path / "themes"
    folder.mkdir()
    for item in SHIPPED.glob("*.toml"):
        shutil.copy(item, folder / item.name)
    (folder / "broken.toml").write_text("name = [unclosed", encoding="utf-8")
    (folder / "nocolour.toml").write_text('name = "plain"\n', encoding="utf-8")
    return folder


def test_bad_files_are_listed_and_the_rest_load(tmp_path: Path) -> None:
    load = load_theme_files(_folder_with_bad_files(tmp_path))
    assert {name for name, _ in load.failures} == {"broken.toml", "nocolour.toml"}
    assert len(load.themes) == 4
    message = load.failure_message()
    assert message is not None and "broken.toml" in message and "nocolour.toml" in message


async def test_app_notifies_once_about_bad_files(make_app, tmp_path: Path) -> None:
    app = make_app(theme_folder=_folder_with_bad_files(tmp_path))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        skipped = [n.message for n in app.notices_given if "Theme files skipped" in n.message]
        assert len(skipped) == 1
        assert "broken.toml" in skipped[0] and "nocolour.toml" in skipped[0]
        assert app.theme == DEFAULT_THEME


async def test_unknown_saved_theme_falls_back_to_the_default(make_app) -> None:
    assert settings.save_theme("no-such-theme") is None
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        assert app.theme == DEFAULT_THEME


async def test_chosen_theme_is_remembered(make_app, private_config: Path) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        app.theme = "bench-floodlit"
        await pilot.pause()
    assert settings.saved_theme() == "bench-floodlit"
    assert (private_config / settings.SETTINGS_FILE).exists()
    again = make_app()
    async with again.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        assert again.theme == "bench-floodlit"


async def test_no_color_selects_monochrome_and_keeps_the_saved_choice(
        make_app, monkeypatch: pytest.MonkeyPatch) -> None:
    settings.save_theme("bench-paper")
    monkeypatch.setenv("NO_COLOR", "1")
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        assert app.theme == MONOCHROME_THEME
    assert settings.saved_theme() == "bench-paper"


def test_config_dir_follows_the_environment(private_config: Path) -> None:
    assert settings.config_dir() == private_config


async def test_starting_theme_styles_the_screen_and_a_switch_restyles_it(make_app) -> None:
    # The starting theme's restyle is skipped (its colours are set before the first styling):
    # the screen must still wear it, and the next switch must restyle.
    settings.save_theme("bench-paper")
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        screen = app.workbench_screen
        paper = Color.parse(app.get_css_variables()["background"])
        assert screen.styles.background == paper
        await pilot.press("alt+t")
        await pilot.pause()
        assert app.theme != "bench-paper"
        switched = Color.parse(app.get_css_variables()["background"])
        assert switched != paper and screen.styles.background == switched
