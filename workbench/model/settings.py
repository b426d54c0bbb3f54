"""What the workbench remembers between runs (the chosen theme), in the user's config folder,
and the person's own key table, ``keys.toml`` beside it (written by hand, never by the workbench:
action id = keys, e.g. ``"case.add" = "ctrl+a"``).

The folder is ``platformdirs.user_config_dir("bearing-workbench")`` unless the environment
variable ``BEARING_WORKBENCH_CONFIG_DIR`` names another one (tests point it at a temporary
folder).  A missing or unreadable settings file means the defaults; a failed write is reported,
never raised.
"""

from __future__ import annotations

import os
import tomllib
from pathlib import Path

import tomli_w

CONFIG_DIR_VARIABLE = "BEARING_WORKBENCH_CONFIG_DIR"
SETTINGS_FILE = "settings.toml"
KEYS_FILE = "keys.toml"


def config_dir() -> Path:
    """The folder the workbench's settings live in."""
    override = os.environ.get(CONFIG_DIR_VARIABLE)
    if override:
        return Path(override)
    from platformdirs import user_config_dir

    return Path(user_config_dir("bearing-workbench"))


def load_settings() -> dict[str, object]:
    """The saved settings, or an empty mapping when there are none or they cannot be read."""
    path = config_dir() / SETTINGS_FILE
    try:
        with path.open("rb") as handle:
            data = tomllib.load(handle)
    except (OSError, tomllib.TOMLDecodeError, UnicodeDecodeError):
        return {}
    return data if isinstance(data, dict) else {}


def key_table() -> tuple[dict[str, object], str | None]:
    """The person's key table (empty when there is no file) and why it could not be read."""
    path = config_dir() / KEYS_FILE
    try:
        with path.open("rb") as handle:
            return tomllib.load(handle), None
    except FileNotFoundError:
        return {}, None
    except (OSError, tomllib.TOMLDecodeError, UnicodeDecodeError) as exc:
        return {}, f"{path} not used: {exc}"


def saved_theme() -> str | None:
    """The theme name saved last time, if any."""
    name = load_settings().get("theme")
    return name if isinstance(name, str) else None


def save_theme(name: str) -> str | None:
    """Remember ``name`` as the chosen theme; None when written, else why it was not."""
    settings = load_settings()
    settings["theme"] = name
    folder = config_dir()
    try:
        folder.mkdir(parents=True, exist_ok=True)
        temporary = folder / (SETTINGS_FILE + ".tmp")
        temporary.write_text(tomli_w.dumps(settings), encoding="utf-8")
        temporary.replace(folder / SETTINGS_FILE)
    except (OSError, TypeError, ValueError) as exc:
        return f"could not remember the theme: {exc}"
    return None
