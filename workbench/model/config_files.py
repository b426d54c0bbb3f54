"""The person's config files, ``settings.toml`` and ``keys.toml``, read through the guarded reader.

Neither may stop the workbench from starting: a settings file that cannot be read means the
defaults, and a key table that cannot be read is reported in one line and left unused.  Key
names are checked here (``ctrl+k``, ``f4``, ``question_mark``, ``?``), so a typo such as
``ctlr+k`` is reported instead of binding nothing in silence.
"""

from __future__ import annotations

import os
import re
import unicodedata
from pathlib import Path

from .guarded_read import MAX_CONFIG_BYTES, FileRefused, read_toml
from .user_text import quoted

MODIFIERS = ("ctrl", "shift", "alt", "meta", "super", "hyper")
NAMED_KEYS = ("escape", "enter", "return", "tab", "space", "backspace", "delete", "insert", "home",
              "end", "pageup", "pagedown", "up", "down", "left", "right",
              "newline", "slash", "backslash", "at", "minus", "plus", "underscore",
              *(f"f{number}" for number in range(1, 25)))
MAX_KEYS_PER_ACTION = 8
_CHARACTER_NAME = re.compile(r"[a-z][a-z0-9_]{0,60}")


def read_settings(path: str | os.PathLike[str]) -> tuple[dict[str, object], str | None]:
    """The settings saved at ``path`` (empty when there are none) and, when the file is there
    but cannot be read (too large, nested, not TOML, not a regular file …), one line saying so:
    the defaults then apply."""
    if not Path(path).exists():
        return {}, None
    try:
        _, data = read_toml(path, limit=MAX_CONFIG_BYTES, what="settings file")
    except FileRefused as exc:
        return {}, f"{exc} (ignored: the defaults apply)"
    return data, None


def read_key_table(path: str | os.PathLike[str]) -> tuple[dict[str, object], str | None]:
    """The person's key table at ``path`` (empty when there is no file) and, when it cannot be
    read, one line saying why it is not used."""
    if not Path(path).exists():
        return {}, None
    try:
        _, data = read_toml(path, limit=MAX_CONFIG_BYTES, what="key table")
    except FileRefused as exc:
        return {}, f"{exc} (not used)"
    return data, None


def _base_key_known(name: str) -> bool:
    """A key without modifiers: one printable character, a named key, or a character's
    Unicode name in lower case with ``_`` for spaces (``question_mark``, ``full_stop``)."""
    if len(name) == 1:
        return name.isprintable() and not name.isspace() and name not in ",+"
    if name in NAMED_KEYS:
        return True
    if not _CHARACTER_NAME.fullmatch(name):
        return False
    try:
        unicodedata.lookup(name.replace("_", " "))
    except KeyError:
        return False
    return True


def key_problem(keys: str) -> str | None:
    """Why ``keys`` ("ctrl+k" or "f4,ctrl+e") is not a list of keys, or None when it is."""
    parts = [part.strip() for part in keys.split(",") if part.strip()]
    if not parts:
        return "keys must be a text such as \"ctrl+k\" or \"f4,ctrl+e\""
    if len(parts) > MAX_KEYS_PER_ACTION:
        return f"at most {MAX_KEYS_PER_ACTION} keys per action"
    for part in parts:
        *modifiers, base = part.split("+")
        unknown = [word for word in modifiers if word not in MODIFIERS]
        if unknown or not _base_key_known(base):
            return (f"{quoted(part, 30)} is not a key; write e.g. ctrl+k, f4, shift+tab, "
                    f"question_mark (modifiers: {', '.join(MODIFIERS)})")
    return None
