"""What the workbench remembers between runs (the chosen theme), in the user's config folder,
and the person's own key table, ``keys.toml`` beside it (written by hand, never by the workbench:
action id = keys, e.g. ``"case.add" = "ctrl+a"``).

The folder is ``platformdirs.user_config_dir("bearing-workbench")`` unless the environment
variable ``BEARING_WORKBENCH_CONFIG_DIR`` names another one (tests point it at a temporary
folder).  A missing or unreadable settings file means the defaults (an unreadable one is named
in one line); a failed write is reported, never raised.
"""

from __future__ import annotations

import os
from pathlib import Path

import tomli_w

from .config_files import read_key_table, read_settings
from .guarded_read import FileRefused
from .safe_write import write_atomically
from .user_text import clipped

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


def load_settings() -> tuple[dict[str, object], str | None]:
    """The saved settings (empty when there are none) and, when the file could not be read,
    one line saying it was ignored (through :func:`config_files.read_settings`: nested,
    huge-integer or oversized files never stop the start)."""
    return read_settings(config_dir() / SETTINGS_FILE)


def key_table() -> tuple[dict[str, object], str | None]:
    """The person's key table (empty when there is no file) and why it could not be read."""
    return read_key_table(config_dir() / KEYS_FILE)


def saved_theme() -> str | None:
    """The theme name saved last time, if any."""
    return theme_in(load_settings()[0])


def theme_in(settings: dict[str, object]) -> str | None:
    """The theme name in the saved ``settings``, if they hold one."""
    name = settings.get("theme")
    return name if isinstance(name, str) else None


def save_theme(name: str) -> str | None:
    """Remember ``name`` as the chosen theme; None when written, else why it was not."""
    settings, _ = load_settings()  # an unreadable file is replaced by a good one
    settings["theme"] = name
    folder = config_dir()
    try:
        folder.mkdir(parents=True, exist_ok=True)
        write_atomically(folder / SETTINGS_FILE, tomli_w.dumps(settings).encode("utf-8"),
                         what="settings file")
    except FileRefused as exc:
        return f"could not remember the theme: {exc}"
    except (OSError, TypeError, ValueError) as exc:
        return f"could not remember the theme: {clipped(str(exc), 120)}"
    return None
