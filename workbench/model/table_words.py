"""The keys of a session's shaft and duty-cycle tables in a person's words.

The analysis names a text it cannot use by its key in the session file
(``shafts[1].states[2].power: …``), as the command line and the reports do, where the file is
what a person edits.  The editors name it as they show it instead: the shaft or duty cycle by
its name, a row by its title, number and name, a text by its label (``Shaft 'RM-2 input shaft',
operating state 2 'part load', Power: …``).  The labels are the editor's; this module only
composes them.
"""

from __future__ import annotations

import re
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from typing import Any

from .fields import FIELD_BY_NAME
from .user_text import quoted, sentence

_LEADING_KEY = re.compile(
    r"(?P<key>(?:shafts|duty_cycles|bearings)\[\d+\](?:\.\w+(?:\[\d+\])?)*): ")
_PART = re.compile(r"(?P<name>\w+)(?:\[(?P<number>\d+)\])?")
_CASE_LABELS = {name: spec.label for name, spec in FIELD_BY_NAME.items()}
_CASE_FIELD_IN_MESSAGE = re.compile(r"^(?P<case>case '.*?'): (?P<name>\w+): ")
"""A case a duty cycle runs through that cannot be derived: "case 'X': reliability: …"."""


@dataclass(frozen=True, slots=True)
class TableWords:
    """How an editor names its table: ``word`` for the table ("shaft"), ``labels`` of the
    table's own texts by key, and per list of rows (``states``) the rows' title ("Operating
    state") and their texts' labels."""

    word: str
    labels: Mapping[str, str]
    rows: Mapping[str, tuple[str, Mapping[str, str]]]


def error_in_words(error: str, table: Mapping[str, Any], words: TableWords, *,
                   bearings: Sequence[str] = ()) -> str:
    """``error`` ("key: message") with its leading key named in words, and the field of a case
    that cannot be derived ("case 'X': reliability: …") by its label; other text as it is.  ``table`` is
    the table the editor shows, ``bearings`` the session's bearing names (an error in a bearing
    a shaft carries names ``bearings[n]``)."""
    match = _LEADING_KEY.match(error)
    if match is None:
        return error
    named = key_in_words(match["key"], table, words, bearings=bearings)
    message = _CASE_FIELD_IN_MESSAGE.sub(
        lambda case: f"{case['case']}: {_CASE_LABELS.get(case['name'], case['name'])}: ",
        error[match.end():])
    return f"{named}: {message}"


def session_error_in_words(error: str, tables: Mapping[str, Sequence[Mapping[str, Any]]],
                           words: Mapping[str, TableWords], *, bearings: Sequence[str] = ()) -> str:
    """:func:`error_in_words` for an error of any of the session's tables: its key names the
    list and number (``shafts[2]…``) of the table in ``tables``, said with ``words`` of that
    list; an error in a bearing (``bearings[n]…``) or of no table given, as it is said."""
    match = _LEADING_KEY.match(error)
    first = _PART.match(match["key"]) if match is not None else None
    if first is None:
        return error
    if first["name"] == "bearings":
        return error_in_words(error, {}, next(iter(words.values())), bearings=bearings)
    listed = tables.get(first["name"], ())
    number = int(first["number"])
    if first["name"] not in words or not 0 < number <= len(listed):
        return error
    return error_in_words(error, listed[number - 1], words[first["name"]], bearings=bearings)


def key_in_words(key: str, table: Mapping[str, Any], words: TableWords, *,
                 bearings: Sequence[str] = ()) -> str:
    """``shafts[1].states[2].power`` as "Shaft 'RM-2 input shaft', operating state 2 'part
    load', Power" (see :func:`error_in_words`)."""
    parts = [_PART.fullmatch(part) for part in key.split(".")]
    named: list[str] = []
    labels: Mapping[str, str] = words.labels
    for index, part in enumerate(parts):
        if part is None:  # not a key this module knows: said as it is
            return key
        name, number = part["name"], part["number"]
        if index == 0 and name == "bearings":
            named.append(_bearing(int(number), bearings))
            labels = _CASE_LABELS
        elif index == 0:
            named.append(f"{words.word} {quoted(table.get('name', ''))}")
        elif number is not None and name in words.rows:
            title, labels = words.rows[name]
            named.append(_row(title, int(number), table.get(name, [])))
        elif name == "case_fields":
            named.append("case inputs")
            labels = _CASE_LABELS
        elif name in ("A", "B"):
            named.append(words.labels.get(f"bearing_{name.lower()}", f"bearing at {name}"))
        else:
            named.append(labels.get(name, name))
    return sentence(", ".join(named))


def _bearing(number: int, bearings: Sequence[str]) -> str:
    return f"bearing {quoted(bearings[number - 1])}" if 0 < number <= len(bearings) else "a bearing"


def _row(title: str, number: int, rows: Sequence[Mapping[str, Any]]) -> str:
    """"operating state 2 'part load'": the row's title, number and name (a duty cycle's state
    is named by its case)."""
    row = rows[number - 1] if 0 < number <= len(rows) else {}
    name = str(row.get("name", row.get("case", "")))
    return f"{title.lower()} {number}" + (f" {quoted(name)}" if name else "")
