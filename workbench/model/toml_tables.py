"""Checked reading of parsed TOML tables, shared by session files, shafts and duty cycles.

Each function raises :class:`~workbench.model.fields.FieldError` whose field is the dotted key
(``shafts[1].elements[2].helix_angle``; tables of an array counted from 1), so every reader names
the same key the same way; the session-file reader adds the line.
"""

from __future__ import annotations

import difflib
from typing import Any, Callable, Mapping, Protocol, TypeVar

from .fields import FieldError
from .user_text import quoted


def join_key(key: str, name: str) -> str:
    """``key.name``, or ``name`` alone at the top of a file."""
    return f"{key}.{name}" if key else name


def type_words(value: object) -> str:
    """A TOML value's type in words, for a wrong-type message."""
    if isinstance(value, bool):
        return "true/false"
    if isinstance(value, int):
        return "a whole number"
    if isinstance(value, float):
        return "a number"
    if isinstance(value, str):
        return "text"
    if isinstance(value, dict):
        return "a table"
    if isinstance(value, list):
        return "a list"
    return "a date or time"


def checked_table(value: object, key: str, allowed: tuple[str, ...]) -> dict[str, Any]:
    """``value`` as a table whose keys are all in ``allowed``; a typo gets a "did you mean"."""
    if not isinstance(value, dict):
        raise FieldError(key, f"should be a table, found {type_words(value)}")
    for name in value:
        if name not in allowed:
            close = difflib.get_close_matches(str(name), allowed, n=1)
            hint = f"did you mean {close[0]!r}?" if close else f"allowed: {', '.join(allowed)}"
            raise FieldError(join_key(key, name), f"unknown key {quoted(name)}; {hint}")
    return value


def table_text(table: Mapping[str, Any], key: str, name: str, default: str = "") -> str:
    """The text value ``name`` of ``table`` (``default`` when absent)."""
    value = table.get(name, default)
    if not isinstance(value, str):
        raise FieldError(join_key(key, name), f'should be text in quotes, e.g. {name} = "…", '
                                              f"found {type_words(value)}")
    return value


def table_list(table: Mapping[str, Any], key: str, name: str) -> list[Any]:
    """The array of tables ``name`` of ``table`` (empty when absent)."""
    value = table.get(name, [])
    if not isinstance(value, list):
        raise FieldError(join_key(key, name),
                         f"should be [[{name}]] tables, found {type_words(value)}")
    return value


def required_name(table: Mapping[str, Any], key: str, seen: set[str], what: str) -> str:
    """The non-blank ``name`` of a table, different from every name in ``seen`` (then added)."""
    name = table_text(table, key, "name")
    if not name.strip():
        raise FieldError(join_key(key, "name"), f"every {what} needs a name")
    if name in seen:
        raise FieldError(join_key(key, "name"),
                         f"a second {what} called {quoted(name)}; names must differ")
    seen.add(name)
    return name


class _Named(Protocol):
    name: str


N = TypeVar("N", bound=_Named)


def named_tables(value: object, key: str, read_one: Callable[[Any, str], N], what: str) -> list[N]:
    """Every item of a ``[[key]]`` array of tables, each read by ``read_one``; names must differ."""
    if not isinstance(value, list):
        raise FieldError(key, f"should be [[{key}]] tables, found {type_words(value)}")
    items = [read_one(item, f"{key}[{number}]") for number, item in enumerate(value, 1)]
    seen: set[str] = set()
    for number, item in enumerate(items, start=1):
        required_name({"name": item.name}, f"{key}[{number}]", seen, what)
    return items
