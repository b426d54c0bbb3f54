"""Session files: a versioned TOML layout, strict reading, safe saving, and crash recovery.

The layout (schema 1) uses plain engineering words and keeps every value as the text a person
typed, so a file reads and edits by hand::

    schema = 1

    [session]
    title = "Input shaft, reducer R2"
    engineer = "A. Person"
    notes = ""
    units = "SI"                 # "SI" or "US"

    [targets]
    life = "20000 h"             # on the modified rating life Lnm
    reliability = "0.95"
    s0 = "1.5"

    [[bearings]]
    name = "DG-40-80"
    notes = ""
    kind = "deep-groove"         # and every other bearing field of workbench.model.fields
    c = "31 kN"
    clearance = "0.01 mm"        # schema 2: the fit (clearance, preload) for the inside view

    [bearings.geometry]          # schema 2: its internal geometry, as `workbench rate` names it
    elements = "9"
    dw = "12.7 mm"
    dpw = "60 mm"

    [[cases]]
    name = "full load"
    bearing = "DG-40-80"
    notes = ""
    fr = "5.2 kN"                # and every other case field (schema 2: tilt or moment too)

    [solver]
    unknown = "c"
    target = "Lnm=20000 h"       # left out: the session's life target, on Lnm
    case = "full load"

    [[shafts]]                   # a shaft on two bearings of the file: workbench.model.shafts
    name = "input shaft"
    bearing_a = "DG-40-80"
    ...
    [[shafts.elements]]          # its gears and pulleys
    ...
    [[shafts.states]]            # how it runs: power or torque, speed, share of the time
    ...

    [[duty_cycles]]              # states of one bearing: workbench.model.duty_cycles
    name = "locating end"
    [[duty_cycles.states]]
    case = "full load"           # a case of the file or one generated from a shaft
    share = "0.7"

Schema 2 added the bearing's ``geometry`` table and the fit fields (``clearance``, ``preload``
on a bearing, ``tilt``, ``moment`` on a case; :data:`~workbench.model.fields.INSIDE_FIELDS`).
A session that uses none of them is written as schema 1, so an older workbench still reads it;
a schema-1 file that holds them is refused with a line asking for ``schema = 2``.

The ``[[shafts]]`` and ``[[duty_cycles]]`` arrays are kept in ``Session.reserved`` as read and
written back unchanged; on reading they are checked with
:func:`~workbench.model.shafts.shafts_from_tables` and
:func:`~workbench.model.duty_cycles.duty_cycles_from_tables`, and every bearing a shaft sits on
and every case a duty cycle names must exist.

Reading is strict.  An unknown key is an error, never silently ignored: a misspelt ``fa`` would
otherwise leave the axial load at zero and give a life that looks fine.  Every field text is
checked with :func:`workbench.model.fields.parse_field`, so a bad unit is reported when the file
is opened, not when a result is shown.  Errors are :class:`SessionFileError`, one line naming the
file, the key and its line.  Keys of repeated tables are counted from 1 in the order they appear:
``cases[2].fr`` is ``fr`` in the second ``[[cases]]`` table of the file, and
``shafts[2].elements[1].helix_angle`` is ``helix_angle`` in the first ``[[shafts.elements]]``
table inside the second ``[[shafts]]`` table.

Saving never leaves a half-written file: the text goes to a temporary file in the same folder,
is flushed and synced to disk, then replaces the old file in one ``os.replace``.  The version
replaced is kept as ``NAME.toml.bak``.  The TOML writer does not keep comments, so the first time
a file holding a person's comments is overwritten, it is copied to ``NAME.toml.orig``.
"""

from __future__ import annotations

import contextlib
import hashlib
import os
import re
from dataclasses import dataclass, field
from enum import Enum
from importlib import resources
from pathlib import Path
from typing import Any, Callable, Collection, Mapping, TypeVar

import platformdirs

from ..engine.pairs import SIDES
from ..engine.solve import UNKNOWNS
from .duty_cycles import duty_cycles_from_tables
from .fields import BEARING_FIELDS, CASE_FIELDS, INSIDE_FIELDS, FieldError, parse_field
from .guarded_read import (
    MAX_FILE_BYTES, FileRefused, decode_text, parse_toml, read_bytes, read_text,
)
from .safe_write import (
    FileStamp, digest_of, remove_stale_temporaries, resolved_path, stamp_for, writable_target,
    write_atomically,
)
from .session import (
    GEOMETRY_KEYS, SCHEMA_VERSION, UNIT_SYSTEMS, Bearing, LoadCase, Session, SolverSetup, Targets,
    parse_target,
)
from .shafts import Shaft, case_name, shafts_from_tables
from .targets import parse_target_text
from .toml_tables import checked_table, required_name, table_list, table_text, type_words
from .user_text import clipped, clipped_path, quoted

APP_NAME = "bearing-workbench"
DEMO_SESSION = "demo.toml"
RESERVED_TABLES = ("duty_cycles", "shafts")
TOP_LEVEL_KEYS = ("schema", "session", "targets", "bearings", "cases", "solver") + RESERVED_TABLES
SESSION_KEYS = ("title", "project", "engineer", "revision", "notes", "units")
TARGET_KEYS = ("life", "reliability", "s0")
SOLVER_KEYS = ("unknown", "target", "case")
BEARING_KEYS = ("name", "notes", "designation", "source", "geometry") + BEARING_FIELDS
SCHEMA_2_KEYS = frozenset({"geometry", *INSIDE_FIELDS})
"""Keys of a bearing or case that schema 2 added."""
FIRST_SCHEMA = 1
CASE_KEYS = ("name", "bearing", "notes") + CASE_FIELDS
RECOVERY_STEM_CHARS = 40
RECOVERY_FILE_MODE = 0o600

T = TypeVar("T")
KeyPath = tuple[str | int, ...]  # ("cases", 2, "fr"); table indexes count from 1


class SessionFileError(FileRefused):
    """A session file that cannot be read or written; ``str()`` is one line for the user."""


class SaveStatus(Enum):
    """How a save ended: written, a question for the person, or refused."""

    SAVED = "saved"
    NOT_A_SESSION = "not a session"  # the file there is something else (README.md …)
    EXISTS = "exists"  # another session file is there (save-as onto it)
    CHANGED_ON_DISK = "changed on disk"  # someone saved the file since it was read here
    REFUSED = "refused"  # read-only, a folder or device, a name too long, a full disk …


@dataclass
class SaveOutcome:
    """What a save did: the file written (a link's target), the backup and original copies,
    the new stamp of the file, notes for the screen; or the question or refusal in ``message``."""

    path: Path
    backup: Path | None = None
    original: Path | None = None
    messages: list[str] = field(default_factory=list)
    status: SaveStatus = SaveStatus.SAVED
    message: str | None = None
    stamp: FileStamp | None = None


@dataclass
class OpenOutcome:
    """What opening a file gave: the session and the file's stamp, or the one-line error; and
    a recovery copy newer than the file, when a run ended without saving."""

    path: Path
    session: Session | None = None
    stamp: FileStamp | None = None
    error: str | None = None
    recovery: Path | None = None


# ---- reading ---------------------------------------------------------------------------------
_HEADER = re.compile(r"^\s*(\[\[?)\s*([^\[\]]+?)\s*\]\]?")
_KEY_PART = re.compile(r"\[(\d+)\]|([^.\[\]]+)")


def _key_text(path: KeyPath) -> str:
    """``("cases", 2, "fr")`` as ``cases[2].fr``."""
    text = ""
    for part in path:
        text += f"[{part}]" if isinstance(part, int) else (f".{part}" if text else part)
    return text


def _key_path(text: str) -> KeyPath:
    """``shafts[2].elements[1].helix_angle`` as ``("shafts", 2, "elements", 1, "helix_angle")``."""
    return tuple(int(match[1]) if match[1] else match[2] for match in _KEY_PART.finditer(text))


class _Reader:
    """One pass over a parsed file, raising SessionFileError at the first problem."""

    def __init__(self, text: str, source: str, check_values: bool) -> None:
        self.lines = text.split("\n")  # not splitlines(): U+0085 inside a string is no line end
        self.source = source
        self.check_values = check_values
        self.headers = self._headers()
        self.version = SCHEMA_VERSION

    def _headers(self) -> list[tuple[int, str]]:
        """(line index, dotted table name) of every ``[name]`` and ``[[name]]`` header line."""
        found = []
        for index, line in enumerate(self.lines):
            match = _HEADER.match(line)
            if match:
                name = ".".join(part.strip().strip("\"'") for part in match[2].split("."))
                found.append((index, name))
        return found

    def _own_end(self, start: int, end: int) -> int:
        """The end of a table's own key lines: the next header after ``start`` (or ``end``)."""
        return next((index for index, _ in self.headers if start <= index < end), end)

    def _nth_header(self, start: int, end: int, name: str, occurrence: int) -> int | None:
        """The line index of the ``occurrence``-th header called ``name`` in lines start…end."""
        matches = [index for index, found in self.headers if start <= index < end and found == name]
        return matches[occurrence - 1] if len(matches) >= occurrence else None

    def _block_end(self, header: int, end: int, name: str) -> int:
        """The end of table ``name`` opened at ``header``: the next header not inside it."""
        inside = name + "."
        return next((index for index, found in self.headers
                     if header < index < end and not found.startswith(inside)), end)

    def line_of(self, path: KeyPath) -> int | None:
        """The 1-based line of ``path`` in the text (the deepest table header found when absent).

        Each name followed by a number is the Nth ``[[name]]`` header inside the table found so
        far, counted by position in the text: ``("shafts", 2, "elements", 1, "helix_angle")``
        looks for the first ``[[shafts.elements]]`` after the second ``[[shafts]]`` header and
        before the table that ends it.  A table written inline (``name = {…}`` or ``[…]``) is
        found by its key line.
        """
        start, end, header, prefix = 0, len(self.lines), None, ""
        position = 0
        while position < len(path):
            key = str(path[position])
            following = path[position + 1] if position + 1 < len(path) else None
            occurrence = following if isinstance(following, int) else None
            name = prefix + key
            if following is None:  # the last name: a key line, else a table of that name
                found = self._key_line(start, self._own_end(start, end), key)
                if found is not None:
                    return found
                table = self._nth_header(start, end, name, 1)
                return table + 1 if table is not None else (None if header is None else header + 1)
            table = self._nth_header(start, end, name, occurrence or 1)
            if table is None:  # an inline table or array, or a table that is missing
                found = self._key_line(start, self._own_end(start, end), key)
                return found if found is not None else (None if header is None else header + 1)
            header, start, end = table, table + 1, self._block_end(table, end, name)
            prefix = name + "."
            position += 1 if occurrence is None else 2
        return None if header is None else header + 1

    def _key_line(self, start: int, end: int, key: str) -> int | None:
        pattern = re.compile(
            rf"^\s*(?:{re.escape(key)}|\"{re.escape(key)}\"|'{re.escape(key)}')\s*[=.]")
        for index in range(start, end):
            if pattern.match(self.lines[index]):
                return index + 1
        return None

    def fail(self, path: KeyPath, message: str) -> SessionFileError:
        """The error for ``path``, with its line found by scanning the text."""
        return SessionFileError(self.source, message, _key_text(path), self.line_of(path))

    def field_failure(self, error: FieldError) -> SessionFileError:
        """The error for a FieldError whose key is a full key text (``shafts[1].speed``)."""
        return self.fail(_key_path(error.field), error.message)

    def checked(self, read: Callable[..., T], *args: Any) -> T:
        """Run a :mod:`toml_tables` reader, turning its FieldError into this file's error."""
        try:
            return read(*args)
        except FieldError as exc:
            raise self.fail(_key_path(exc.field), exc.message) from None

    def table(self, value: object, path: KeyPath, allowed: tuple[str, ...]) -> dict[str, Any]:
        """A table whose keys are all in ``allowed``."""
        return self.checked(checked_table, value, _key_text(path), allowed)

    def text(self, table: Mapping[str, Any], path: KeyPath, key: str, default: str = "") -> str:
        """A text value of ``table`` (``default`` when absent)."""
        return self.checked(table_text, table, _key_text(path), key, default)

    def texts(self, table: Mapping[str, Any], path: KeyPath, names: tuple[str, ...]) -> dict[str, str]:
        """The field texts of a bearing or case table, each checked by ``parse_field``."""
        texts = {name: self.text(table, path, name) for name in names if name in table}
        if self.check_values:
            for name in names:
                try:
                    parse_field(name, texts.get(name, ""))
                except FieldError as exc:
                    raise self.fail(path + (name,), exc.message) from None
        return texts

    def named_list(self, doc: Mapping[str, Any], name: str) -> list[dict[str, Any]]:
        """An array of tables (``[[name]]``)."""
        return self.checked(table_list, doc, "", name)

    def unique_name(self, table: Mapping[str, Any], path: KeyPath, seen: set[str], what: str) -> str:
        """The required, unique ``name`` of a bearing or case."""
        return self.checked(required_name, table, _key_text(path), seen, what)

    def session(self, doc: dict[str, Any]) -> Session:
        """The whole session, checked table by table."""
        self.table(doc, (), TOP_LEVEL_KEYS)
        self.schema(doc)
        head = self.table(doc.get("session", {}), ("session",), SESSION_KEYS)
        units = self.text(head, ("session",), "units", "SI")
        if units not in UNIT_SYSTEMS:
            raise self.fail(("session", "units"), f"use {' or '.join(UNIT_SYSTEMS)}, not {quoted(units)}")
        bearings = self.bearings(doc)
        cases = self.cases(doc, {b.name for b in bearings})
        case_names = {c.name for c in cases}
        if self.check_values:
            shafts = self.shafts(doc, {b.name for b in bearings})
            case_names |= _generated_case_names(shafts)
            self.duty_cycles(doc, case_names)
        return Session(
            title=self.text(head, ("session",), "title", Session.title),
            project=self.text(head, ("session",), "project"),
            engineer=self.text(head, ("session",), "engineer"),
            revision=self.text(head, ("session",), "revision"),
            notes=self.text(head, ("session",), "notes"),
            units=units,
            targets=self.targets(doc),
            bearings=bearings,
            cases=cases,
            solver=self.solver(doc, case_names),
            reserved={name: doc[name] for name in RESERVED_TABLES if name in doc},
        )

    def schema(self, doc: Mapping[str, Any]) -> None:
        """``schema`` present, a whole number, and not newer than this workbench reads."""
        if "schema" not in doc:
            raise self.fail(("schema",), f"no 'schema = {SCHEMA_VERSION}' at the top: "
                                         "not a bearing-workbench session file")
        version = doc["schema"]
        if type(version) is not int:
            raise self.fail(("schema",), f"should be a whole number, found {type_words(version)}")
        if version > SCHEMA_VERSION:
            raise self.fail(("schema",), f"written by a newer workbench (schema {version}); this "
                                         f"one reads schema {SCHEMA_VERSION}: please update it")
        if version < FIRST_SCHEMA:
            raise self.fail(("schema",), f"unknown schema version {version}")
        self.version = version

    def newer_keys(self, table: Mapping[str, Any], path: KeyPath) -> None:
        """A schema-1 file holds none of the keys schema 2 added."""
        if self.version >= 2:
            return
        for key in table:
            if key in SCHEMA_2_KEYS:
                raise self.fail(path + (key,), f"{quoted(key)} came with schema 2: write "
                                               "'schema = 2' at the top of the file")

    def geometry(self, table: Mapping[str, Any], path: KeyPath) -> dict[str, str]:
        """A bearing's ``geometry`` table: texts under the rating form's names, each readable."""
        if "geometry" not in table:
            return {}
        path = path + ("geometry",)
        geometry = self.table(table["geometry"], path, GEOMETRY_KEYS)
        texts = {key: self.text(geometry, path, key) for key in GEOMETRY_KEYS if key in geometry}
        if self.check_values and texts:
            from .internal_form import input_problem  # the internal analysis loads only here

            for key, text in texts.items():
                if (problem := input_problem(key, text)) is not None:
                    raise self.fail(path + (key,), problem)
        return texts

    def targets(self, doc: Mapping[str, Any]) -> Targets:
        """The [targets] table; life and s0 read as session targets, reliability as a fraction."""
        path: KeyPath = ("targets",)
        table = self.table(doc.get("targets", {}), path, TARGET_KEYS)
        targets = Targets(**{k: self.text(table, path, k, getattr(Targets, k)) for k in TARGET_KEYS})
        if self.check_values:
            for key in TARGET_KEYS:
                try:
                    if key == "reliability":
                        parse_field("reliability", targets.reliability)
                    else:
                        parse_target(key, getattr(targets, key))
                except FieldError as exc:
                    raise self.fail(path + (key,), exc.message) from None
        return targets

    def bearings(self, doc: Mapping[str, Any]) -> list[Bearing]:
        """Every [[bearings]] table."""
        seen: set[str] = set()
        result = []
        for number, value in enumerate(self.named_list(doc, "bearings"), start=1):
            path: KeyPath = ("bearings", number)
            table = self.table(value, path, BEARING_KEYS)
            self.newer_keys(table, path)
            name = self.unique_name(table, path, seen, "bearing")
            result.append(Bearing(name, self.texts(table, path, BEARING_FIELDS),
                                  self.text(table, path, "notes"),
                                  self.text(table, path, "designation"),
                                  self.text(table, path, "source"),
                                  self.geometry(table, path)))
        return result

    def cases(self, doc: Mapping[str, Any], bearing_names: set[str]) -> list[LoadCase]:
        """Every [[cases]] table; each names a bearing of the file."""
        seen: set[str] = set()
        result = []
        for number, value in enumerate(self.named_list(doc, "cases"), start=1):
            path: KeyPath = ("cases", number)
            table = self.table(value, path, CASE_KEYS)
            self.newer_keys(table, path)
            name = self.unique_name(table, path, seen, "case")
            bearing = self.text(table, path, "bearing")
            if self.check_values and bearing not in bearing_names:
                message = (f"no bearing called {quoted(bearing)} in this file" if bearing.strip()
                           else "every case names the bearing it loads")
                raise self.fail(path + ("bearing",), message)
            result.append(LoadCase(name, bearing, self.texts(table, path, CASE_FIELDS),
                                   self.text(table, path, "notes")))
        return result

    def shafts(self, doc: Mapping[str, Any], bearing_names: set[str]) -> list[Shaft]:
        """The [[shafts]] tables checked; each sits on two bearings of the file."""
        if "shafts" not in doc:
            return []
        try:
            shafts = shafts_from_tables(doc["shafts"])
        except FieldError as exc:
            raise self.field_failure(exc) from None
        for number, shaft in enumerate(shafts, start=1):
            for side in ("bearing_a", "bearing_b"):
                if getattr(shaft, side) not in bearing_names:
                    raise self.fail(("shafts", number, side),
                                    f"no bearing called {quoted(getattr(shaft, side))} in this file")
        return shafts

    def duty_cycles(self, doc: Mapping[str, Any], case_names: set[str]) -> None:
        """The [[duty_cycles]] tables checked; each state names a case of the file or a shaft's."""
        if "duty_cycles" not in doc:
            return
        try:
            cycles = duty_cycles_from_tables(doc["duty_cycles"])
        except FieldError as exc:
            raise self.field_failure(exc) from None
        for number, cycle in enumerate(cycles, start=1):
            for state_number, (case, _) in enumerate(cycle.states, start=1):
                if case not in case_names:
                    raise self.fail(("duty_cycles", number, "states", state_number, "case"),
                                    f"no case called {quoted(case)} in this file, nor generated "
                                    "from one of its shafts")

    def solver(self, doc: Mapping[str, Any], case_names: set[str]) -> SolverSetup:
        """The [solver] table: a known unknown, a readable target, a case of the file or one
        generated from its shafts (or none)."""
        path: KeyPath = ("solver",)
        table = self.table(doc.get("solver", {}), path, SOLVER_KEYS)
        setup = SolverSetup(**{k: self.text(table, path, k, getattr(SolverSetup, k))
                               for k in SOLVER_KEYS})
        if not self.check_values:
            return setup
        if setup.unknown not in UNKNOWNS:
            raise self.fail(path + ("unknown",), f"cannot solve for {quoted(setup.unknown)}; "
                                                 f"use one of {', '.join(UNKNOWNS)}")
        try:
            if setup.target:  # blank or left out: the session's life target on Lnm
                parse_target_text(setup.target)
        except FieldError as exc:
            raise self.fail(path + ("target",), exc.message) from None
        if setup.case and setup.case not in case_names:
            raise self.fail(path + ("case",), f"no case called {quoted(setup.case)} in this file, "
                                              "nor generated from one of its shafts")
        return setup


def loads_session(text: str, source: str = "<text>", *, check_values: bool = True) -> Session:
    """The session in TOML ``text``; ``source`` names it in errors.

    Raises :class:`SessionFileError` for TOML syntax, unknown keys, wrong types, missing required
    values, a newer schema and (unless ``check_values`` is false, as for a recovery file saved
    mid-edit) for any field text that :func:`~workbench.model.fields.parse_field` refuses.
    """
    doc = parse_toml(text, source, error=SessionFileError)
    return _Reader(text, source, check_values).session(doc)


def load_session(path: str | os.PathLike[str], *, check_values: bool = True) -> Session:
    """The session in the file at ``path`` (UTF-8 TOML); see :func:`loads_session`."""
    text = read_text(path, error=SessionFileError, what="session file")
    return loads_session(text, str(path), check_values=check_values)


# ---- writing ---------------------------------------------------------------------------------
def _field_table(head: dict[str, str], texts: Mapping[str, str], names: tuple[str, ...],
                 owner: str) -> dict[str, str]:
    """``head`` followed by the field texts in the order of the FIELDS table."""
    stray = [key for key in texts if key not in names]
    if stray:
        raise ValueError(f"{owner} holds {', '.join(map(repr, stray))}, not a field it can have")
    return head | {name: texts[name] for name in names if name in texts}


def _case_names(session: Session) -> set[str]:
    """Every case a file of ``session`` can name: its own and those its shafts make (the
    shafts' cases only while its shaft tables read)."""
    own = {case.name for case in session.cases}
    try:
        shafts = shafts_from_tables(session.reserved.get("shafts", []))
    except FieldError:
        return own
    return own | _generated_case_names(shafts)


def _generated_case_names(shafts: list[Shaft]) -> set[str]:
    """The names of the cases ``shafts`` make: one per state and bearing side."""
    return {case_name(shaft, state, side)
            for shaft in shafts for state in shaft.states for side in SIDES}


def dumps_session(session: Session) -> str:
    """The session as TOML text (``tomli_w``), schema 1 unless it uses what schema 2 added;
    loads back equal with loads_session.

    Raises ValueError when the session holds a key the schema has no place for.
    """
    stray = [key for key in session.reserved if key not in RESERVED_TABLES]
    if stray:
        raise ValueError(f"reserved tables are {', '.join(RESERVED_TABLES)}, not {', '.join(stray)}")
    doc: dict[str, Any] = {
        "schema": schema_needed(session),
        "session": {key: getattr(session, key) for key in SESSION_KEYS
                    if getattr(session, key) or key in ("title", "engineer", "notes", "units")},
        "targets": {key: getattr(session.targets, key) for key in TARGET_KEYS},
    }
    if session.bearings:
        doc["bearings"] = [
            _field_table({"name": b.name, "notes": b.notes}
                         | {key: getattr(b, key) for key in ("designation", "source")
                            if getattr(b, key)}, b.texts, BEARING_FIELDS,
                         f"bearing {quoted(b.name)}")
            | ({"geometry": _geometry_table(b)} if b.geometry else {})
            for b in session.bearings
        ]
    if session.cases:
        doc["cases"] = [
            _field_table({"name": c.name, "bearing": c.bearing, "notes": c.notes}, c.texts,
                         CASE_FIELDS, f"case {quoted(c.name)}")
            for c in session.cases
        ]
    # a blank target (following the session's life target) is left out, as an older
    # workbench, which needs a target there, then reads its own default
    doc["solver"] = {key: getattr(session.solver, key) for key in SOLVER_KEYS
                     if key != "target" or session.solver.target}
    if session.solver.case not in _case_names(session):
        # the question's case was deleted or renamed with its shaft: the file is written
        # without it, since a file naming a case it lacks is refused on opening
        doc["solver"]["case"] = ""
    # in one order, however they were added: a file written, read and written again is the same
    doc.update({name: session.reserved[name] for name in RESERVED_TABLES if name in session.reserved})
    import tomli_w  # imported on the first save, not when the workbench starts

    # tomli_w writes "\r\n" raw inside a multi-line string, where TOML reads it back as "\n"
    return tomli_w.dumps(doc, multiline_strings=not _holds_carriage_return(doc))


def schema_needed(session: Session) -> int:
    """The oldest schema that holds ``session``: 2 when a bearing has a geometry or a bearing or
    case a fit text, else 1 (an older workbench still reads it)."""
    owners: list[Bearing | LoadCase] = [*session.bearings, *session.cases]
    uses_two = any(isinstance(owner, Bearing) and owner.geometry for owner in owners) or any(
        key in INSIDE_FIELDS for owner in owners for key in owner.texts)
    return SCHEMA_VERSION if uses_two else FIRST_SCHEMA


def _geometry_table(bearing: Bearing) -> dict[str, str]:
    stray = [key for key in bearing.geometry if key not in GEOMETRY_KEYS]
    if stray:
        raise ValueError(f"bearing {quoted(bearing.name)}'s geometry holds "
                         f"{', '.join(map(repr, stray))}, not a geometry input")
    return {key: bearing.geometry[key] for key in GEOMETRY_KEYS if key in bearing.geometry}


def _holds_carriage_return(value: object) -> bool:
    """True when some text anywhere in ``value`` (tables, lists) holds a carriage return."""
    if isinstance(value, str):
        return "\r" in value
    if isinstance(value, dict):
        return any(_holds_carriage_return(item) for item in value.values())
    if isinstance(value, list):
        return any(_holds_carriage_return(item) for item in value)
    return False


def has_comments(text: str) -> bool:
    """True when TOML ``text`` holds a comment: a ``#`` outside every string.

    A plain scan, not a TOML parser: it follows one-line and multi-line basic and literal strings
    (and backslash escapes in basic ones) so a ``#`` inside a value is not taken for a comment.
    """
    if "#" not in text:  # the usual case, and a large file's, at C speed
        return False
    closing: str | None = None  # the delimiter of the multi-line string we are inside
    for line in text.split("\n"):  # TOML lines end in \n; splitlines() would also break at U+0085
        i, n = 0, len(line)
        while i < n:
            if closing is not None:
                end = line.find(closing, i)
                while end > 0 and closing == '"""' and line[end - 1] == "\\":
                    end = line.find(closing, end + 1)
                if end < 0:
                    break
                i, closing = end + 3, None
                continue
            char = line[i]
            if char == "#":
                return True
            if line.startswith('"""', i) or line.startswith("'''", i):
                closing, i = line[i:i + 3], i + 3
            elif char == '"':
                i += 1
                while i < n and line[i] != '"':
                    i += 2 if line[i] == "\\" else 1
                i += 1
            elif char == "'":
                end = line.find("'", i + 1)
                i = n if end < 0 else end + 1
            else:
                i += 1
    return False


def _sibling(path: Path, suffix: str) -> Path:
    """``NAME.toml`` → ``NAME.toml.bak`` and the like."""
    return path.with_name(path.name + suffix)


_SCHEMA_FIRST = re.compile(rb"(?:\xef\xbb\xbf)?(?:[ \t]*(?:#[^\n]*)?\r?\n)*[ \t]*schema[ \t]*=[ \t]*\d+[ \t]*(?:#|\r?\n|$)")


def looks_like_session(data: bytes) -> bool:
    """True when ``data`` is TOML with a whole-number ``schema`` and only the top-level keys of
    a session file: a file this workbench wrote or could have (whether its values are good).
    A file whose first statement is ``schema = N``, as every file written here starts, is
    taken without parsing it."""
    if _SCHEMA_FIRST.match(data):
        return True
    try:
        doc = parse_toml(decode_text(data, "<file>", SessionFileError), "<file>",
                         error=SessionFileError)
    except SessionFileError:
        return False
    return type(doc.get("schema")) is int and all(key in TOP_LEVEL_KEYS for key in doc)


def _question(target: Path, old: bytes, read_stamp: FileStamp | None) -> SaveStatus | None:
    """What must be asked before ``old`` (the bytes at ``target`` now) is replaced, if anything."""
    if not looks_like_session(old):
        return SaveStatus.NOT_A_SESSION
    if read_stamp is None or read_stamp.path != target:
        return SaveStatus.EXISTS
    if digest_of(old) != read_stamp.digest:
        return SaveStatus.CHANGED_ON_DISK
    return None


_QUESTIONS = {
    SaveStatus.NOT_A_SESSION: "is not a bearing-workbench session file: replace it with this "
                              "session?",
    SaveStatus.EXISTS: "already holds another session: replace it?",
    SaveStatus.CHANGED_ON_DISK: "was changed on disk since it was read here (another window or "
                                "program saved it): replace that version with this one?",
}


class SaveQuestion(SessionFileError):
    """A save that needs the person's answer first; ``status`` says which question."""

    def __init__(self, path: str | os.PathLike[str], status: SaveStatus) -> None:
        super().__init__(path, _QUESTIONS[status])
        self.status = status


def save_session(session: Session, path: str | os.PathLike[str], *,
                 read_stamp: FileStamp | None = None,
                 confirmed: Collection[SaveStatus] = (SaveStatus.EXISTS,
                                                      SaveStatus.CHANGED_ON_DISK)) -> SaveOutcome:
    """Save atomically through links; keep the replaced version as ``.bak`` and a commented
    original as ``.orig``; the outcome carries the new :class:`FileStamp` for the next save.

    ``read_stamp`` is the stamp of the file as this session was read from it (or last saved;
    None for a session never saved).  Replacing an existing file asks first
    (:class:`SaveQuestion`, a SessionFileError) when it is not a session file, when it is
    another session (no stamp of it), or when it changed on disk since ``read_stamp`` — unless
    ``confirmed`` holds that status.  By default only a file that is not a session is asked
    about; :func:`try_save_session`, the screen's door, asks about all three.

    Raises SessionFileError when the file must not or cannot be written (a folder, pipe or
    device, read-only, a name too long, no such folder, a full disk).
    """
    data = dumps_session(session).encode("utf-8")
    target, mode = writable_target(path, error=SessionFileError, what="session file", verb="save")
    outcome = SaveOutcome(target)
    old = None
    if mode is not None:
        old = read_bytes(target, error=SessionFileError, what="session file", limit=MAX_FILE_BYTES)
        question = _question(target, old, read_stamp)
        if question is not None and question not in confirmed:
            raise SaveQuestion(path, question)
        if has_comments(old.decode("utf-8", errors="replace")):
            original = _sibling(target, ".orig")
            if not original.exists():
                outcome.original = write_atomically(original, old, mode=mode,
                                                    error=SessionFileError, verb="save")
                outcome.messages.append(
                    f"{target.name} held comments, which saving does not keep: "
                    f"the file as it was is kept as {original.name}")
            else:
                outcome.messages.append(
                    f"{target.name} held comments, which saving does not keep: the version "
                    f"just replaced is in {target.name}.bak ({original.name} keeps the first)")
        outcome.backup = write_atomically(_sibling(target, ".bak"), old, mode=mode,
                                          error=SessionFileError, verb="save")
    write_atomically(target, data, error=SessionFileError, what="session file", verb="save")
    outcome.stamp = stamp_for(target, data)
    return outcome


def try_save_session(session: Session, path: str | os.PathLike[str], *,
                     read_stamp: FileStamp | None = None,
                     confirmed: Collection[SaveStatus] = ()) -> SaveOutcome:
    """:func:`save_session` for the screen: never raises; a question or a refusal comes back as
    the outcome's ``status`` and ``message`` (ask, then call again with ``confirmed``)."""
    try:
        return save_session(session, path, read_stamp=read_stamp, confirmed=confirmed)
    except SaveQuestion as exc:
        return SaveOutcome(Path(path), status=exc.status, message=str(exc))
    except SessionFileError as exc:
        return SaveOutcome(Path(path), status=SaveStatus.REFUSED, message=str(exc))
    except (OSError, ValueError) as exc:  # a session holding what the schema has no place for
        return SaveOutcome(Path(path), status=SaveStatus.REFUSED,
                           message=f"{clipped_path(path)}: not saved: {clipped(str(exc), 120)}")


def open_session(path: str | os.PathLike[str], *, recovered: bool = False) -> OpenOutcome:
    """Read the session at ``path`` for the screen; never raises.

    The outcome holds the session and the file's stamp (keep it for :func:`save_session`), or
    one line saying why not, and a recovery copy newer than the file, if there is one.  A
    recovery copy (``recovered``) is read without checking its values: it may hold a value typed
    half-way.  Stale temporaries of killed saves beside the file are removed.
    """
    outcome = OpenOutcome(Path(path))
    try:
        data = read_bytes(path, error=SessionFileError, what="session file")
        text = decode_text(data, path, SessionFileError)
        outcome.session = loads_session(text, str(path), check_values=not recovered)
        outcome.stamp = stamp_for(path, data)
    except SessionFileError as exc:
        outcome.error = str(exc)
    except Exception as exc:  # noqa: BLE001 - the screen must never die opening a file
        outcome.error = f"{clipped_path(path)}: cannot read it ({type(exc).__name__})"
    if not recovered:
        remove_stale_temporaries(resolved_path(path))
        outcome.recovery = find_recovery(path)
    return outcome


# ---- recovery and the demo -------------------------------------------------------------------
def recovery_path(session_path: str | os.PathLike[str] | None) -> Path:
    """Where the recovery copy of ``session_path`` lives: one per file (its path resolved: links,
    ``..`` and ``~``), one for an untitled session."""
    folder = Path(platformdirs.user_data_dir(APP_NAME, appauthor=False)) / "recovery"
    if session_path is None:
        return folder / "untitled.toml"
    resolved = resolved_path(session_path)  # "../r.toml" and "r.toml" share one copy
    digest = hashlib.sha256(os.fsencode(resolved)).hexdigest()[:12]
    return folder / f"{resolved.stem[:RECOVERY_STEM_CHARS]}-{digest}.toml"


def write_recovery(session: Session, session_path: str | os.PathLike[str] | None) -> Path:
    """Write the recovery copy of an unsaved session (atomically, readable by its owner only)."""
    target = recovery_path(session_path)
    try:
        target.parent.mkdir(parents=True, exist_ok=True)
    except OSError as exc:
        raise SessionFileError(target, f"cannot write the recovery copy: {exc.strerror or exc}") from None
    write_atomically(target, dumps_session(session).encode("utf-8"), mode=RECOVERY_FILE_MODE,
                     error=SessionFileError, what="recovery copy")
    return target


def find_recovery(session_path: str | os.PathLike[str] | None) -> Path | None:
    """The recovery copy of ``session_path`` if there is one newer than the file itself.

    Read it with ``load_session(path, check_values=False)``: it may hold a value typed half-way.
    """
    candidate = recovery_path(session_path)
    try:
        saved_at = candidate.stat().st_mtime_ns
    except OSError:
        return None
    if session_path is None:
        return candidate
    try:
        file_at = resolved_path(session_path).stat().st_mtime_ns
    except OSError:
        return candidate
    return candidate if saved_at > file_at else None


def discard_recovery(session_path: str | os.PathLike[str] | None) -> None:
    """Remove the recovery copy of ``session_path`` (after a save, or when the person declines it)."""
    with contextlib.suppress(FileNotFoundError):
        recovery_path(session_path).unlink()


def demo_session_path() -> Path:
    """The demo session shipped in the package ``workbench.sessions`` (top-level ``sessions/``)."""
    try:
        folder = resources.files("workbench.sessions")
    except ModuleNotFoundError:  # a source checkout run without installing: the folder itself
        return Path(__file__).resolve().parents[2] / "sessions" / DEMO_SESSION
    return Path(str(folder / DEMO_SESSION))
