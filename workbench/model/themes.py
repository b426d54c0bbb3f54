"""Colour theme files: one TOML per theme, read through the guarded reader and checked here.

A theme file names the theme, says whether it is dark, and gives the screen's base colours; an
optional ``[variables]`` table sets further style variables (``footer-key-foreground`` …)::

    name = "bench-night"
    dark = true
    [colors]
    primary = "#5b9bd1"
    background = "#14191f"

Values reach the screen's stylesheet, so they are held to a narrow grammar: a colour (``#rgb``,
``#rrggbb``, ``#rrggbbaa``, ``rgb(…)``/``hsl(…)`` with numbers, or a colour word) or a few
style words (``bold``, ``reverse``…).  A value such as ``"$$$;;}{"`` would break the stylesheet
at every start; it is refused with the file and key instead.  Each file that fails is reported
with its reason and skipped, never raised; the screen (``workbench.tui.theme_files``) turns
each :class:`ThemeSpec` into its own theme object.
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, Iterable, NamedTuple

from .guarded_read import MAX_CONFIG_BYTES, FileRefused, read_toml
from .user_text import clipped, quoted

COLOR_KEYS = ("primary", "secondary", "accent", "warning", "error", "success", "foreground",
              "background", "surface", "panel", "boost")
TOP_KEYS = ("name", "dark", "description", "colors", "variables", "luminosity_spread",
            "text_alpha")
MAX_VARIABLES = 100
_NAME = re.compile(r"[a-z][a-z0-9-]{0,39}")
_VARIABLE_NAME = re.compile(r"[a-z][a-z0-9-]{0,63}")
_NUMBER = r"\s*-?\d+(?:\.\d+)?%?\s*"
_COLOR = re.compile(
    rf"#(?:[0-9a-fA-F]{{3,4}}|[0-9a-fA-F]{{6}}|[0-9a-fA-F]{{8}})"
    rf"|(?:rgb|rgba|hsl|hsla)\({_NUMBER}(?:,{_NUMBER}){{2,3}}\)"
    rf"|[a-z][a-z0-9_]{{0,39}}(?:\s+\d{{1,3}}%)?")
_STYLE_WORDS = re.compile(r"[a-z][a-z0-9_]{0,19}(?: [a-z][a-z0-9_]{0,19}){0,5}")


class ThemeFileError(ValueError):
    """A theme file that cannot be used, with the reason in one line."""


class ThemeSpec(NamedTuple):
    """One checked theme: its name, dark or light, base colours, variables and the two
    optional numbers (``luminosity_spread``, ``text_alpha``) when given."""

    name: str
    dark: bool
    colors: dict[str, str]
    variables: dict[str, str]
    numbers: dict[str, float]


@dataclass
class ThemeFiles:
    """The themes read, and each file that failed with its reason."""

    themes: list[ThemeSpec] = field(default_factory=list)
    failures: list[tuple[str, str]] = field(default_factory=list)

    def failure_message(self) -> str | None:
        """One line naming every file that failed, or None when all loaded."""
        if not self.failures:
            return None
        listed = "; ".join(f"{clipped(name, 40)} ({reason})" for name, reason in self.failures)
        return f"Theme files skipped: {listed}"


def is_color(value: str) -> bool:
    """True when ``value`` has the shape of a colour the stylesheet takes."""
    return _COLOR.fullmatch(value) is not None


def _color(key: str, value: object) -> str:
    if not isinstance(value, str):
        raise ThemeFileError(f"colour {key} must be text such as \"#336699\"")
    if not is_color(value):
        raise ThemeFileError(f"colour {key} = {quoted(value, 30)} is not a colour")
    return value


def _variable(name: object, value: object) -> tuple[str, str]:
    if not isinstance(name, str) or not _VARIABLE_NAME.fullmatch(name):
        raise ThemeFileError(f"variable {quoted(name, 30)}: names are lower-case letters, "
                             "digits and '-'")
    if not isinstance(value, str) or not (is_color(value) or _STYLE_WORDS.fullmatch(value)):
        raise ThemeFileError(f"variable {name} = {quoted(value, 30)} is neither a colour "
                             "nor style words such as \"bold\"")
    return name, value


def theme_from_data(data: dict[str, Any]) -> ThemeSpec:
    """A checked theme from the parsed TOML of one theme file; ThemeFileError when invalid."""
    unknown = sorted(set(data) - set(TOP_KEYS))
    if unknown:
        raise ThemeFileError(f"unknown key {quoted(unknown[0], 30)}")
    name = data.get("name")
    if not isinstance(name, str) or not _NAME.fullmatch(name):
        raise ThemeFileError("name must be lower-case letters, digits and '-'")
    dark = data.get("dark", True)
    if not isinstance(dark, bool):
        raise ThemeFileError("dark must be true or false")
    colors = data.get("colors")
    if not isinstance(colors, dict) or "primary" not in colors:
        raise ThemeFileError("a [colors] table with at least primary is needed")
    bad = sorted(set(colors) - set(COLOR_KEYS))
    if bad:
        raise ThemeFileError(f"unknown colour {quoted(bad[0], 30)}")
    variables = data.get("variables", {})
    if not isinstance(variables, dict) or len(variables) > MAX_VARIABLES:
        raise ThemeFileError(f"[variables] must map at most {MAX_VARIABLES} names to text")
    numbers: dict[str, float] = {}
    for key in ("luminosity_spread", "text_alpha"):
        if key in data:
            value = data[key]
            if isinstance(value, bool) or not isinstance(value, (int, float)) or not 0 <= value <= 1:
                raise ThemeFileError(f"{key} must be a number from 0 to 1")
            numbers[key] = float(value)
    return ThemeSpec(name, dark, {key: _color(key, value) for key, value in colors.items()},
                     dict(_variable(key, value) for key, value in variables.items()), numbers)


def read_theme_files(files: Iterable[Path]) -> ThemeFiles:
    """Every theme file of ``files`` (in that order), checked; a second theme of one name fails."""
    load = ThemeFiles()
    seen: set[str] = set()
    for item in files:
        try:
            _, data = read_toml(item, limit=MAX_CONFIG_BYTES, what="theme file")
            theme = theme_from_data(data)
            if theme.name in seen:
                raise ThemeFileError(f"a second theme called {theme.name!r}")
        except FileRefused as exc:
            load.failures.append((item.name, exc.message if exc.line is None
                                  else f"line {exc.line}: {exc.message}"))
            continue
        except ThemeFileError as exc:
            load.failures.append((item.name, str(exc)))
            continue
        seen.add(theme.name)
        load.themes.append(theme)
    return load


def theme_files_in(folder: Path) -> list[Path]:
    """The ``*.toml`` files of ``folder``, by name."""
    return sorted((item for item in folder.iterdir() if item.name.endswith(".toml")),
                  key=lambda item: item.name)
