"""Bearing catalogs a person keeps: CSV or TOML files read into numpy columns for selection.

CSV: one bearing per line under a header line; lines starting with ``#`` are comments.  Columns
(the first seven required)::

    designation,kind,d_mm,D_mm,B_mm,C_kN,C0_kN,arrangement,f0,Cu_kN,contact_angle_deg,speed_limit_rpm,mass_kg

TOML: one ``[[bearing]]`` table per bearing with the same keys (numbers as numbers), and optional
top-level ``title`` and ``notes``.

Reading is row by row.  A row with a bad value is left out and reported as a
:class:`CatalogProblem` naming its row (the line in the file) and column; the other rows still
load.  A file that cannot be read at all (missing, not UTF-8, bad TOML, a required column absent)
raises :class:`CatalogError`.  Each row is checked with the engine's own ``validate`` (kind,
arrangement, ratings, contact angle) and Table 3 factors, so a row that loads is one the engine
can rate.
"""

from __future__ import annotations

import math
import os
import re
from collections import Counter
from dataclasses import dataclass, field
from importlib import resources
from pathlib import Path
from typing import Any, Iterable

import numpy as np

from ..engine.derive import CaseInputs, validate
from ..engine.kinds import THRUST_KINDS, dynamic_factors, parse_arrangement, parse_kind
from ..engine.record import InputError
from ..engine.select import BearingArrays
from .fields import BEARING_FIELDS, INSIDE_FIELDS
from .guarded_read import FileRefused, csv_cells, csv_rows, parse_toml, read_text
from .user_text import clipped, quoted

DEMO_CATALOG = "demo_catalog.csv"
REQUIRED_COLUMNS = ("designation", "kind", "d_mm", "D_mm", "B_mm", "C_kN", "C0_kN")
OPTIONAL_COLUMNS = ("arrangement", "f0", "Cu_kN", "contact_angle_deg", "speed_limit_rpm", "mass_kg")
COLUMNS = REQUIRED_COLUMNS + OPTIONAL_COLUMNS
_TEXT_COLUMNS = ("designation", "kind", "arrangement")
_POSITIVE_COLUMNS = ("d_mm", "D_mm", "B_mm", "C_kN", "C0_kN", "f0", "Cu_kN", "speed_limit_rpm",
                     "mass_kg")
# engine input → the catalog column it comes from, for naming the column of a refused row
_COLUMN_OF_INPUT = {"kind": "kind", "arrangement": "arrangement", "c": "C_kN", "c0": "C0_kN",
                    "f0": "f0", "contact_angle": "contact_angle_deg", "dm": "D_mm", "cu": "Cu_kN"}
_TOML_TOP_KEYS = ("title", "notes", "bearing")
KN = 1000.0


class CatalogError(FileRefused):
    """A catalog file that cannot be read at all; ``str()`` is one line for the user."""


@dataclass(frozen=True)
class CatalogProblem:
    """A catalog row left out (or a header note): its line in the file, the column, what is wrong."""

    row: int
    column: str
    message: str

    def __str__(self) -> str:
        return f"row {self.row}, {self.column}: {self.message}"

    def as_dict(self) -> dict[str, object]:
        """Plain data for JSON output."""
        return {"row": self.row, "column": self.column, "message": self.message}


@dataclass
class Catalog(BearingArrays):
    """The rows that loaded, as engine-unit columns (N, mm), with their designations and problems."""

    designations: list[str] = field(default_factory=list)
    rows: list[int] = field(default_factory=list)  # the line each bearing came from
    problems: list[CatalogProblem] = field(default_factory=list)
    source: str = ""
    title: str = ""

    @property
    def kinds(self) -> list[str]:
        """The kind of each bearing, as text."""
        return [str(k) for k in self.kind]


# ---- one row ---------------------------------------------------------------------------------
class _RowError(Exception):
    def __init__(self, column: str, message: str) -> None:
        super().__init__(column, message)
        self.column = column
        self.message = message


def _number(column: str, raw: object) -> float | None:
    """A finite number from CSV text or a TOML value; None when blank."""
    if raw is None or (isinstance(raw, str) and not raw.strip()):
        return None
    if isinstance(raw, bool):
        raise _RowError(column, f"expected a number, got {quoted(raw)}")
    if isinstance(raw, (int, float)):
        value = float(raw)
    elif isinstance(raw, str):
        try:
            value = float(raw.strip())
        except ValueError:
            raise _RowError(column, f"expected a number, got {quoted(raw.strip())}") from None
    else:
        raise _RowError(column, f"expected a number, got {type(raw).__name__}")
    if not math.isfinite(value):
        raise _RowError(column, "must be a finite number")
    return value


def _text(column: str, raw: object) -> str:
    if raw is None:
        return ""
    if not isinstance(raw, str):
        raise _RowError(column, f"expected text, got {quoted(raw)}")
    return raw.strip()


def _read_row(values: dict[str, object]) -> dict[str, Any]:
    """The checked values of one row, engine units; _RowError names the first bad column."""
    out: dict[str, Any] = {}
    for column in COLUMNS:
        raw = values.get(column)
        if column in _TEXT_COLUMNS:
            out[column] = _text(column, raw)
        else:
            number = _number(column, raw)
            if number is not None and column in _POSITIVE_COLUMNS and number <= 0.0:
                raise _RowError(column, "must be greater than zero")
            out[column] = number
        if column in REQUIRED_COLUMNS and out[column] in ("", None):
            raise _RowError(column, "a value is needed")
    if out["D_mm"] <= out["d_mm"]:
        raise _RowError("D_mm", "the outer diameter must exceed the bore d")
    angle = out["contact_angle_deg"]
    if angle is not None and not 0.0 <= angle <= 90.0:
        raise _RowError("contact_angle_deg", "must lie between 0° and 90°")
    try:
        kind = parse_kind(out["kind"])
        arrangement = parse_arrangement(kind, out["arrangement"] or "single")
    except InputError as exc:
        raise _RowError(_COLUMN_OF_INPUT[exc.field], exc.message) from None
    out["arrangement"] = arrangement.value
    _engine_accepts(out, kind in THRUST_KINDS)
    return out


def _engine_accepts(row: dict[str, Any], thrust: bool) -> None:
    """The engine's validate() and Table 3 factors on the row, so a loaded row is one it can rate."""
    probe = CaseInputs(
        kind=row["kind"], arrangement=row["arrangement"], fr=0.0 if thrust else 1.0, fa=1.0,
        c=row["C_kN"] * KN, c0=row["C0_kN"] * KN, f0=row["f0"],
        contact_angle=row["contact_angle_deg"], dm=0.5 * (row["d_mm"] + row["D_mm"]),
        cu=None if row["Cu_kN"] is None else row["Cu_kN"] * KN,
    )
    try:
        kind, arrangement, alpha = validate(probe)
        dynamic_factors(kind, arrangement, alpha)
    except InputError as exc:
        raise _RowError(_COLUMN_OF_INPUT.get(exc.field, exc.field), exc.message) from None


RawRow = tuple[int, dict[str, object], dict[str, int]]  # line, values, line of each key (TOML)


def _build(rows: Iterable[RawRow], problems: list[CatalogProblem], source: str,
           title: str = "") -> Catalog:
    """Check every row, keep the good ones, and turn them into columns."""
    good: list[tuple[int, dict[str, Any]]] = []
    seen: dict[str, int] = {}
    for line, values, key_lines in rows:
        try:
            row = _read_row(values)
            if row["designation"] in seen:
                raise _RowError("designation", f"{quoted(row['designation'])} is already used on row "
                                               f"{seen[row['designation']]}")
        except _RowError as exc:
            problems.append(CatalogProblem(key_lines.get(exc.column, line), exc.column, exc.message))
            continue
        seen[row["designation"]] = line
        good.append((line, row))

    def column(name: str, scale: float = 1.0) -> np.ndarray:
        return np.array([math.nan if r[name] is None else r[name] * scale for _, r in good],
                        dtype=float)

    return Catalog(
        kind=np.array([r["kind"] for _, r in good], dtype=str),
        arrangement=np.array([r["arrangement"] for _, r in good], dtype=str),
        d_mm=column("d_mm"), D_mm=column("D_mm"), B_mm=column("B_mm"),
        c_n=column("C_kN", KN), c0_n=column("C0_kN", KN), f0=column("f0"), cu_n=column("Cu_kN", KN),
        contact_angle_deg=column("contact_angle_deg"), speed_limit_rpm=column("speed_limit_rpm"),
        mass_kg=column("mass_kg"),
        designations=[r["designation"] for _, r in good], rows=[line for line, _ in good],
        problems=problems, source=source, title=title,
    )


# ---- CSV -------------------------------------------------------------------------------------
def loads_catalog_csv(text: str, source: str = "<text>") -> Catalog:
    """The catalog in CSV ``text`` (``#`` lines are comments); see the module notes."""
    lines = list(csv_rows(text))
    if not lines:
        raise CatalogError(source, "no header line: the first line that is not a comment names the columns")
    header_line, header_text = lines[0]
    cells = csv_cells(header_text)
    if isinstance(cells, str):
        raise CatalogError(source, f"the header {cells}", line=header_line)
    header = [name.strip() for name in cells]
    problems: list[CatalogProblem] = []
    missing = [name for name in REQUIRED_COLUMNS if name not in header]
    if missing:
        raise CatalogError(source, f"missing column(s) {', '.join(missing)}; "
                                   f"the header needs {','.join(REQUIRED_COLUMNS)}", line=header_line)
    counts = Counter(header)
    doubled = sorted(clipped(name, 30) for name, count in counts.items() if count > 1)
    if doubled:
        raise CatalogError(source, f"column(s) {', '.join(doubled[:5])} named twice",
                           line=header_line)
    for name in header:
        if name not in COLUMNS:
            problems.append(CatalogProblem(header_line, clipped(name, 30),
                                           f"unknown column, ignored; known: {', '.join(COLUMNS)}"))

    def rows() -> Iterable[RawRow]:
        for number, line in lines[1:]:
            cells = csv_cells(line)
            if isinstance(cells, str):
                problems.append(CatalogProblem(number, "row", cells))
                continue
            if len(cells) != len(header):
                problems.append(CatalogProblem(number, "row", f"{len(cells)} values for "
                                                              f"{len(header)} columns"))
                continue
            yield number, dict(zip(header, cells)), {}

    return _build(rows(), problems, source)


# ---- TOML ------------------------------------------------------------------------------------
_HEADER = re.compile(r"^\s*\[\[\s*bearing\s*\]\]")


def _toml_lines(text: str) -> list[tuple[int, dict[str, int]]]:
    """For each ``[[bearing]]`` table: its header line and the line of each key in it."""
    tables: list[tuple[int, dict[str, int]]] = []
    keys: dict[str, int] | None = None
    for number, line in enumerate(text.splitlines(), 1):
        if _HEADER.match(line):
            keys = {}
            tables.append((number, keys))
        elif line.lstrip().startswith("["):
            keys = None  # another table ends the bearing one
        elif keys is not None and "=" in line:
            keys.setdefault(line.split("=", 1)[0].strip().strip("\"'"), number)
    return tables


def loads_catalog_toml(text: str, source: str = "<text>") -> Catalog:
    """The catalog in TOML ``text``: ``[[bearing]]`` tables with the CSV column names as keys."""
    doc = parse_toml(text, source, error=CatalogError)
    unknown = [quoted(key, 30) for key in doc if key not in _TOML_TOP_KEYS]
    if unknown:
        raise CatalogError(source, f"unknown top-level key(s) {', '.join(unknown[:5])}; "
                                   f"allowed: {', '.join(_TOML_TOP_KEYS)}")
    tables = doc.get("bearing", [])
    if not isinstance(tables, list) or not all(isinstance(t, dict) for t in tables):
        raise CatalogError(source, "bearings are [[bearing]] tables")
    title = doc.get("title", "")
    if not isinstance(title, str):
        raise CatalogError(source, "title should be text")
    positions = _toml_lines(text)
    problems: list[CatalogProblem] = []

    def rows() -> Iterable[RawRow]:
        for index, table in enumerate(tables):
            header_line, key_lines = positions[index] if index < len(positions) else (0, {})
            stray = [key for key in table if key not in COLUMNS]
            if stray:
                problems.append(CatalogProblem(key_lines.get(stray[0], header_line),
                                               clipped(stray[0], 30),
                                               f"unknown key; known: {', '.join(COLUMNS)}"))
                continue
            yield header_line, table, key_lines

    return _build(rows(), problems, source, title)


# ---- files -----------------------------------------------------------------------------------
def load_catalog(path: str | os.PathLike[str]) -> Catalog:
    """The catalog in the file at ``path``: ``.csv`` or ``.toml`` (UTF-8)."""
    target = Path(path)
    suffix = target.suffix.lower()
    if suffix not in (".csv", ".toml"):
        raise CatalogError(target, "a catalog is a .csv or a .toml file")
    text = read_text(target, error=CatalogError, what="catalog file")
    if suffix == ".csv":
        return loads_catalog_csv(text, str(target))
    return loads_catalog_toml(text, str(target))


def demo_catalog_path() -> Path:
    """The invented demo catalog shipped in ``workbench.data``."""
    return Path(str(resources.files("workbench.data") / DEMO_CATALOG))


def _plain(value: float) -> str:
    """A number as short text that reads back to the same value."""
    return f"{value:.12g}"


def catalog_bearing_texts(catalog: Catalog, i: int) -> dict[str, str]:
    """The session bearing fields of catalog bearing ``i``, as typed text a session keeps.

    kind, arrangement, c and c0 in kN, f0, contact angle in degrees, dm = (d + D)/2 in mm, cu in
    kN; e and Y blank (a catalog row carries none), so adopting a row clears a maker's e and Y.
    The fit (clearance, preload) is the mounting's, not the catalog's: adopting keeps it.
    """
    def optional(value: float, text: str) -> str:
        return "" if math.isnan(value) else text

    texts = {
        "kind": str(catalog.kind[i]),
        "arrangement": str(catalog.arrangement[i]),
        "c": f"{_plain(catalog.c_n[i] / KN)} kN",
        "c0": f"{_plain(catalog.c0_n[i] / KN)} kN",
        "f0": optional(catalog.f0[i], _plain(catalog.f0[i])),
        "contact_angle": optional(catalog.contact_angle_deg[i], f"{_plain(catalog.contact_angle_deg[i])}°"),
        "e_given": "",
        "y_given": "",
        "dm": f"{_plain(0.5 * (catalog.d_mm[i] + catalog.D_mm[i]))} mm",
        "cu": optional(catalog.cu_n[i], f"{_plain(catalog.cu_n[i] / KN)} kN"),
    }
    return {name: texts[name] for name in BEARING_FIELDS if name not in INSIDE_FIELDS}
