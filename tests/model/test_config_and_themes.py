"""Theme files, settings.toml and keys.toml: a hostile config file is reported, never fatal.

Expectations: TOML 1.0 (what parses), the theme grammar written in workbench.model.themes
(colours as CSS writes them: #rgb, #rrggbb, rgb(); style words), and Unicode character names
(``unicodedata``) for key names such as question_mark.
"""

from __future__ import annotations

from pathlib import Path

import pytest

from workbench.model.config_files import key_problem, read_key_table, read_settings
from workbench.model.themes import ThemeFileError, read_theme_files, theme_from_data

GOOD = {"name": "x-1", "colors": {"primary": "#123456"}}


@pytest.mark.parametrize("value", ["$$$;;}{", "#fff; background: red", "red}", "url(x)", ""])
def test_theme_variable_that_would_break_the_stylesheet_is_refused(value: str) -> None:
    """A variable value outside colours and style words ("$$$;;}{") would break every start."""
    with pytest.raises(ThemeFileError, match="neither a colour"):
        theme_from_data(GOOD | {"variables": {"footer-key-foreground": value}})


@pytest.mark.parametrize("value", ["#0030a0", "#fff", "rgb(10, 20, 30)", "bold", "reverse",
                                   "bold italic", "red"])
def test_theme_variable_colours_and_style_words_pass(value: str) -> None:
    """The values the shipped themes use, and their kin, are accepted."""
    assert theme_from_data(GOOD | {"variables": {"v": value}}).variables == {"v": value}


def test_theme_variable_name_is_checked() -> None:
    """A variable name with stylesheet punctuation is refused, its text clipped."""
    with pytest.raises(ThemeFileError, match="names are lower-case") as caught:
        theme_from_data(GOOD | {"variables": {"a;b" * 1000: "#fff"}})
    assert len(str(caught.value)) < 160


def test_hostile_theme_file_is_skipped_with_its_line(tmp_path: Path) -> None:
    """Nested or huge-integer theme files fail alone, with their reason; the rest load."""
    (tmp_path / "deep.toml").write_text("x = " + "[" * 500 + "]" * 500, encoding="utf-8")
    (tmp_path / "int.toml").write_text('name = "a"\nn = ' + "9" * 5000, encoding="utf-8")
    (tmp_path / "ok.toml").write_text('name = "ok"\n[colors]\nprimary = "#123456"\n',
                                      encoding="utf-8")
    load = read_theme_files(sorted(tmp_path.iterdir()))
    assert [theme.name for theme in load.themes] == ["ok"]
    reasons = dict(load.failures)
    assert "nested" in reasons["deep.toml"] and reasons["int.toml"].startswith("line 2")


def test_hostile_settings_mean_the_defaults(tmp_path: Path) -> None:
    """A nested or huge-integer settings.toml cannot stop the start: the defaults apply, and
    one short line says the file was ignored."""
    path = tmp_path / "settings.toml"
    assert read_settings(path) == ({}, None)  # no file: nothing to say
    for text in ("theme = " + "[" * 3000 + "]" * 3000, "n = " + "9" * 5000):
        path.write_text(text, encoding="utf-8")
        data, problem = read_settings(path)
        assert data == {} and problem and "\n" not in problem and len(problem) < 200
        assert "ignored" in problem
    path.write_text('theme = "bench-paper"\n', encoding="utf-8")
    assert read_settings(path) == ({"theme": "bench-paper"}, None)


def test_hostile_key_table_is_reported_in_one_line(tmp_path: Path) -> None:
    """A key table that cannot be read is not used, and says why in one short line."""
    path = tmp_path / "keys.toml"
    assert read_key_table(path) == ({}, None)  # no file: nothing to say
    path.write_text('"case.add" = ' + "{a=" * 3000 + "1" + "}" * 3000, encoding="utf-8")
    table, problem = read_key_table(path)
    assert table == {} and problem and "\n" not in problem and "not used" in problem


@pytest.mark.parametrize(("keys", "good"), [
    ("ctrl+k", True), ("f4,ctrl+e", True), ("shift+tab", True), ("question_mark", True),
    ("?", True), ("ctrl+shift+left", True), ("plus", True),
    ("ctlr+k", False), ("foo", False), ("ctrl+", False), ("f99", False), ("", False),
])
def test_key_names_are_checked(keys: str, good: bool) -> None:
    """A misspelt key binds nothing in silence: it is reported (Unicode names as Textual reads)."""
    assert (key_problem(keys) is None) is good
