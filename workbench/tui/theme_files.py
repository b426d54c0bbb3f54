"""Colour themes as files: one TOML per theme in the top-level ``themes/`` folder.

A theme file names the theme, says whether it is dark, and gives Textual's base colours; an
optional ``[variables]`` table sets further Textual variables (``footer-key-foreground`` …)::

    name = "bench-night"
    dark = true
    [colors]
    primary = "#5b9bd1"
    background = "#14191f"

Each file is checked here and turned into a :class:`textual.theme.Theme`; a file that fails is
reported with its reason and skipped, never raised.
"""

from __future__ import annotations

import re
import tomllib
from dataclasses import dataclass, field
from importlib.resources import files
from importlib.resources.abc import Traversable
from pathlib import Path

from textual.color import Color, ColorParseError
from textual.theme import Theme

THEME_PACKAGE = "workbench.themes"
DEFAULT_THEME = "bench-night"
MONOCHROME_THEME = "bench-mono"
COLOR_KEYS = ("primary", "secondary", "accent", "warning", "error", "success", "foreground",
              "background", "surface", "panel", "boost")
TOP_KEYS = {"name", "dark", "description", "colors", "variables", "luminosity_spread",
            "text_alpha"}
_NAME = re.compile(r"[a-z][a-z0-9-]{0,39}")


class ThemeFileError(ValueError):
    """A theme file that cannot be used, with the reason in one line."""


@dataclass
class ThemeLoad:
    """The themes read, and each file that failed with its reason."""

    themes: list[Theme] = field(default_factory=list)
    failures: list[tuple[str, str]] = field(default_factory=list)

    def failure_message(self) -> str | None:
        """One line naming every file that failed, or None when all loaded."""
        if not self.failures:
            return None
        listed = "; ".join(f"{name} ({reason})" for name, reason in self.failures)
        return f"Theme files skipped: {listed}"


def _color(key: str, value: object) -> str:
    if not isinstance(value, str):
        raise ThemeFileError(f"colour {key} must be text such as \"#336699\"")
    try:
        Color.parse(value)
    except ColorParseError:
        raise ThemeFileError(f"colour {key} = {value!r} is not a colour") from None
    return value


def theme_from_data(data: dict[str, object]) -> Theme:
    """A Textual theme from the parsed TOML of one theme file; ThemeFileError when invalid."""
    unknown = set(data) - TOP_KEYS
    if unknown:
        raise ThemeFileError(f"unknown key {sorted(unknown)[0]!r}")
    name = data.get("name")
    if not isinstance(name, str) or not _NAME.fullmatch(name):
        raise ThemeFileError("name must be lower-case letters, digits and '-'")
    dark = data.get("dark", True)
    if not isinstance(dark, bool):
        raise ThemeFileError("dark must be true or false")
    colors = data.get("colors")
    if not isinstance(colors, dict) or "primary" not in colors:
        raise ThemeFileError("a [colors] table with at least primary is needed")
    bad = set(colors) - set(COLOR_KEYS)
    if bad:
        raise ThemeFileError(f"unknown colour {sorted(bad)[0]!r}")
    checked = {key: _color(key, value) for key, value in colors.items()}
    variables = data.get("variables", {})
    if not isinstance(variables, dict) or not all(
            isinstance(k, str) and isinstance(v, str) for k, v in variables.items()):
        raise ThemeFileError("[variables] must map names to text")
    extra: dict[str, float] = {}
    for key in ("luminosity_spread", "text_alpha"):
        if key in data:
            value = data[key]
            if isinstance(value, bool) or not isinstance(value, (int, float)) or not 0 <= value <= 1:
                raise ThemeFileError(f"{key} must be a number from 0 to 1")
            extra[key] = float(value)
    return Theme(name=name, dark=dark, variables=dict(variables), **checked, **extra)  # type: ignore[arg-type]


def _theme_files(folder: Traversable | Path | None) -> list[Traversable | Path]:
    root = folder if folder is not None else files(THEME_PACKAGE)
    return sorted((item for item in root.iterdir() if item.name.endswith(".toml")),
                  key=lambda item: item.name)


def load_theme_files(folder: Traversable | Path | None = None) -> ThemeLoad:
    """Every ``*.toml`` theme in ``folder`` (default: the shipped ``workbench.themes``)."""
    load = ThemeLoad()
    seen: set[str] = set()
    for item in _theme_files(folder):
        try:
            data = tomllib.loads(item.read_text(encoding="utf-8"))
            theme = theme_from_data(data)
            if theme.name in seen:
                raise ThemeFileError(f"a second theme called {theme.name!r}")
        except (OSError, UnicodeDecodeError) as exc:
            load.failures.append((item.name, f"cannot be read: {exc}"))
            continue
        except tomllib.TOMLDecodeError as exc:
            load.failures.append((item.name, f"not valid TOML: {exc}"))
            continue
        except ThemeFileError as exc:
            load.failures.append((item.name, str(exc)))
            continue
        seen.add(theme.name)
        load.themes.append(theme)
    return load
