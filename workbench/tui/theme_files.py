"""Colour themes as Textual themes: the files are read and checked by
:mod:`workbench.model.themes`; here each checked theme becomes a :class:`textual.theme.Theme`,
its colours parsed once more by Textual itself.  A file that fails is reported, never raised.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from importlib.resources import files
from importlib.resources.abc import Traversable
from pathlib import Path

from textual.color import Color, ColorParseError
from textual.theme import Theme

from ..model.themes import ThemeFileError, ThemeFiles, ThemeSpec, read_theme_files, theme_files_in
from ..model.themes import theme_from_data as checked_theme_data

THEME_PACKAGE = "workbench.themes"
DEFAULT_THEME = "bench-night"
MONOCHROME_THEME = "bench-mono"

__all__ = ["DEFAULT_THEME", "MONOCHROME_THEME", "ThemeFileError", "ThemeLoad", "load_theme_files",
           "theme_from_data"]


@dataclass
class ThemeLoad(ThemeFiles):
    """The Textual themes made, and each file that failed with its reason."""

    themes: list[Theme] = field(default_factory=list)  # type: ignore[assignment]


def _textual_theme(spec: ThemeSpec) -> Theme:
    for key, value in spec.colors.items():
        try:
            Color.parse(value)
        except ColorParseError:
            raise ThemeFileError(f"colour {key} = {value!r} is not a colour") from None
    return Theme(name=spec.name, dark=spec.dark, variables=dict(spec.variables), **spec.colors,
                 **spec.numbers)  # type: ignore[arg-type]


def theme_from_data(data: dict[str, object]) -> Theme:
    """A Textual theme from the parsed TOML of one theme file; ThemeFileError when invalid."""
    return _textual_theme(checked_theme_data(data))


def load_theme_files(folder: Traversable | Path | None = None) -> ThemeLoad:
    """Every ``*.toml`` theme in ``folder`` (default: the shipped ``workbench.themes``)."""
    root = Path(str(folder if folder is not None else files(THEME_PACKAGE)))
    checked = read_theme_files(theme_files_in(root))
    load = ThemeLoad(failures=checked.failures)
    for spec in checked.themes:
        try:
            load.themes.append(_textual_theme(spec))
        except ThemeFileError as exc:
            load.failures.append((spec.name, str(exc)))
    return load
