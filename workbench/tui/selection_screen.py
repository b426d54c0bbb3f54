"""Select a bearing from a catalog for every case on one session bearing, and adopt one.

The screen runs :func:`workbench.engine.select.select` (ISO 281:2007 life on Lnm against the
session's life target, ISO 76:2006 static safety) over the demo catalog or a catalog file whose
path is typed, for all the cases (the session's and the generated ones) that use one session
bearing, with the inputs built by :func:`workbench.model.selection.selection_inputs` and the
same filters as ``workbench select`` (kind, bore, outer diameter, width, and whether cylindrical
roller bearings have flanges to carry the axial load).  The ranking runs in a
worker thread: typing in the filters never waits for it, the list is dimmed and the summary says
so while it runs, and a ranking that finishes after a newer one was asked for is dropped.

The qualifying bearings are listed smallest first.  Enter on a row closes the screen with that
row's bearing texts (:func:`~workbench.model.catalog.catalog_bearing_texts`); the workbench
screen writes them into the session bearing as one undo step.  A bearing no catalog holds is
rated from its geometry instead (ctrl+g, :mod:`workbench.tui.rating_screen`), and adopted the
same way.
"""

from __future__ import annotations

import os
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import Any, NamedTuple

from textual import on, work
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical
from textual.content import Content
from textual.widgets import Checkbox, DataTable, Input, Label, Select, Static
from textual.worker import Worker, WorkerState

from ..engine.kinds import KIND_WORDS, Arrangement, Kind, is_bearing_set, set_words
from ..engine.record import InputError, fmt
from ..engine.select import REASON_NO_AXIAL, REASON_NO_RADIAL, Filters, Selection, select
from ..model.catalog import Catalog, CatalogError, catalog_bearing_texts, demo_catalog_path, load_catalog
from ..model.quantities import QuantityError, parse
from ..model.selection import (
    candidate_rows, catalog_as_position, mounting_words, position_arrangement, selection_inputs,
)
from ..model.session import CaseResult
from .choice_box import ChoiceBox
from .dialogs import Check, OnceModal
from .table_fit import CELL_PADDING, natural_width, plain
from .tick_box import TickBox

SIZE_FILTERS = (("bore_min", "Bore d from"), ("bore_max", "to"), ("outer_max", "Outer D up to"),
                ("width_max", "Width B up to"))
"""The size limits on the bearing (``Filters`` field without ``_mm`` → label), in screen order."""
FILTER_PREFIX = "filter-"
FLANGED_WORDS = "flanged cylindrical may take Fa"
"""The switch that lets cylindrical roller bearings qualify under axial load (``--flanged-cylindrical``)."""
LOAD_REASONS = (REASON_NO_AXIAL, REASON_NO_RADIAL)
NARROW_COLUMNS = (("designation", "Designation"), ("kind", "Kind"), ("size", "d × D × B mm"),
                  ("life_margin", "Life margin"), ("min_s0", "Least s0"))
GOVERNING_COLUMN = ("governing_case", "Governing case")
"""Shown when the table is wide enough for every case name in it; the detail line always names it."""
SELECTION_HINT = ("enter on a row: adopt it (ctrl+z undoes) · tab: the filters and the catalog "
                  "file · ctrl+g: rate a special bearing from its geometry · escape: close")
BUSY_CLASS = "-busy"


@dataclass(frozen=True, slots=True)
class Adoption:
    """A bearing chosen: its designation, the session bearing texts it gives, and where it came
    from (catalog file and row, or rated from geometry)."""

    designation: str
    texts: dict[str, str]
    source: str = ""
    geometry: dict[str, str] = field(default_factory=dict)
    """A rated bearing's internal geometry (the session keeps it for the inside view); a
    catalog row gives none."""
    note: str = ""
    """What adopting it did beyond taking the row's data, in words ("" for nothing): a pair
    made of a single-row bearing with its ratings' step, or an arrangement the row cannot keep."""


class Ranking(NamedTuple):
    """One ranking's outcome: ``serial`` says which request it answers; ``problem`` why there
    is none (the catalog cannot be read, a case cannot be evaluated, no life target)."""

    serial: int
    catalog: Catalog | None = None
    """The catalog as rated: a pair position's single-row bearings as pairs of them."""
    selection: Selection | None = None
    life_target: float | None = None
    problem: str | None = None
    listed: Catalog | None = None
    """The catalog as the file lists it."""
    position: str = Arrangement.SINGLE.value
    """The arrangement of the session bearing's position."""


def length_limit(text: str) -> float | None:
    """A typed size limit in mm (a bare number is mm); None when blank; QuantityError if unreadable."""
    return parse(text, "length", default_unit="mm") if text.strip() else None


def _length_problem(text: str) -> str | None:
    try:
        length_limit(text)
    except QuantityError as exc:
        return exc.message
    return None


def _number_text(value: float | None) -> str:
    return "—" if value is None else fmt(value, 3)


def _cells(row: Mapping[str, Any]) -> dict[str, str]:
    """One candidate row's texts by column."""
    return {"designation": row["designation"], "kind": row["kind"],
            "arrangement": row["arrangement"],
            "size": f"{row['d_mm']:g} × {row['D_mm']:g} × {row['B_mm']:g}",
            "life_margin": _number_text(row["life_margin"]), "min_s0": _number_text(row["min_s0"]),
            "governing_case": row["governing_case"] or "—", "note": row["note"]}


def _mounting(arrangement: str) -> str:
    """", rated as a back-to-back pair of two" for a row rated as a pair; "" otherwise."""
    try:
        mounted = Arrangement(arrangement)
    except ValueError:
        return ""
    return f", rated as a {set_words(mounted)} of two" if is_bearing_set(mounted) else ""


def _kind_words(kind: str) -> str:
    try:
        return KIND_WORDS[Kind(kind)]
    except ValueError:
        return kind


def columns_that_fit(rows: Sequence[Mapping[str, str]], width: int) -> tuple[tuple[str, str], ...]:
    """The columns to show in ``width`` cells: the narrow set, and the governing case when every
    cell of it fits too (a cell is its text and one space each side)."""
    def needed(key: str, heading: str) -> int:
        return natural_width(heading, [row[key] for row in rows]) + CELL_PADDING

    narrow = sum(needed(key, heading) for key, heading in NARROW_COLUMNS)
    if narrow + needed(*GOVERNING_COLUMN) <= width:
        return NARROW_COLUMNS + (GOVERNING_COLUMN,)
    return NARROW_COLUMNS


class SelectionScreen(OnceModal[Adoption | None]):
    """The catalog bearings that meet every case on one session bearing, smallest first."""

    DEFAULT_CSS = """
    SelectionScreen {
        #filter-kind { width: 32; margin-right: 1; }
        .size-limit { width: 9; margin-right: 1; }
        #catalog-path { width: 1fr; }
        #selection-summary, #filter-message { width: 100%; }
        #candidates {
            height: 1fr;
            &.-busy { text-opacity: 50%; }
        }
        #candidate-detail { width: 100%; color: $text-secondary; }
    }
    """

    BINDINGS = [
        Binding("escape", "dismiss_none", "Close", id="selection.close"),
        Binding("ctrl+g", "rate_from_geometry", "Rate from geometry", id="selection.rate"),
        # the filters move on with ↓/↑ as the case form's fields do (the list keeps its own)
        Binding("down", "app.focus_next", show=False),
        Binding("up", "app.focus_previous", show=False),
    ]

    catalog: Catalog | None = None
    """The catalog of the ranking on show (None before, or when it could not be read)."""

    selection: Selection | None = None
    """The ranking on show."""

    _ranking: Ranking | None = None

    def __init__(self, bearing: str, results: Sequence[CaseResult], *,
                 bearing_texts: Mapping[str, str] | None = None, system: str = "SI",
                 catalog_path: Path | None = None,
                 bearing_geometry: Mapping[str, str] | None = None) -> None:
        super().__init__()
        self._bearing_geometry = dict(bearing_geometry or {})
        self.bearing = bearing
        self.results = list(results)
        self._catalog_path = catalog_path or demo_catalog_path()
        self._bearing_texts = dict(bearing_texts or {})
        self._system = system
        self._filters = Filters()
        self._serial = 0
        self._rows: list[dict[str, str]] = []
        self._columns: tuple[tuple[str, str], ...] = ()
        self._catalogs: dict[tuple[str, int], Catalog] = {}

    def compose(self) -> ComposeResult:
        """Title, catalog file, filters, what was asked, the candidates, the row in full, keys."""
        with Vertical(classes="dialog-box screen-box"):
            yield Label(Content(f"Catalog bearings for bearing {self.bearing}"),
                        classes="dialog-title")
            with Horizontal(classes="form-row"):
                yield Label("Catalog file", classes="form-label")
                yield Input(str(self._catalog_path), compact=True, id="catalog-path",
                            select_on_focus=False)
            with Horizontal(classes="form-row"):
                yield Label("Kind", classes="form-label")
                yield ChoiceBox([(words, kind.value) for kind, words in KIND_WORDS.items()],
                                prompt="any kind", compact=True, id=FILTER_PREFIX + "kind")
                yield TickBox(FLANGED_WORDS, compact=True, id=FILTER_PREFIX + "flanged")
            with Horizontal(classes="form-row"):
                for name, label in SIZE_FILTERS:
                    yield Label(label, classes="form-label")
                    yield Input(placeholder="any", compact=True, classes="size-limit",
                                id=FILTER_PREFIX + name.replace("_", "-"),
                                validators=[Check(_length_problem)])
            yield Static(id="filter-message", classes="dialog-problem")
            yield Static(id="selection-summary")
            yield DataTable(id="candidates", cursor_type="row", zebra_stripes=True)
            yield Static(id="candidate-detail")
            yield Static(Content(SELECTION_HINT), classes="dialog-hint")

    def on_mount(self) -> None:
        """Rank the starting catalog and put the focus in the list."""
        self.query_one("#filter-message").display = False
        self.query_one("#candidates", DataTable).focus()
        self.rank()

    # ---- asking -----------------------------------------------------------------------------
    def rank(self) -> None:
        """Rank the catalog last given (the path box takes effect on enter) with the filters in
        force, in a worker; the list is marked busy until the answer arrives."""
        self._serial += 1
        path = self._catalog_path
        self.query_one("#candidates", DataTable).add_class(BUSY_CLASS)
        self.query_one("#selection-summary", Static).update(
            Content.styled(f"Ranking {path.name} …", "italic"))
        self._rank(self._serial, path, self._filters)

    @work(thread=True, exclusive=True, group="ranking", exit_on_error=False)
    def _rank(self, serial: int, path: Path, filters: Filters) -> Ranking:
        """Read the catalog (once per file version) and rank it: runs in a worker thread."""
        try:
            catalog = self._catalog(path)
        except CatalogError as exc:
            return Ranking(serial, problem=str(exc))
        try:
            inputs, life_target = selection_inputs(self.results)
            if not inputs:
                raise InputError("case", f"no load case uses bearing {self.bearing!r}")
            rated = catalog_as_position(catalog, inputs)
            selection = select(rated, inputs, life_target, None, filters)
        except InputError as exc:
            return Ranking(serial, catalog, problem=exc.message)
        return Ranking(serial, rated, selection, life_target, listed=catalog,
                       position=position_arrangement(inputs))

    def _catalog(self, path: Path) -> Catalog:
        try:
            key = (str(path.resolve()), os.stat(path).st_mtime_ns)
        except OSError:
            return load_catalog(path)  # names what is wrong with the path
        if key not in self._catalogs:
            self._catalogs[key] = load_catalog(path)
        return self._catalogs[key]

    @on(Input.Submitted, "#catalog-path")
    def _path_given(self, event: Input.Submitted) -> None:
        """Rank the catalog file whose path was typed (blank: the demo catalog), and go to the
        list."""
        event.stop()
        text = event.value.strip()
        self._catalog_path = Path(text).expanduser() if text else demo_catalog_path()
        self.rank()
        self.query_one("#candidates", DataTable).focus()

    @on(Select.Changed, f"#{FILTER_PREFIX}kind")
    def _kind_changed(self, event: Select.Changed) -> None:
        event.stop()
        kind = None if event.value is Select.NULL else str(event.value)
        if kind != self._filters.kind:
            self._filters = Filters(kind, *self._size_limits(),
                                    flanged_cylindrical=self._filters.flanged_cylindrical)
            self.rank()

    @on(Checkbox.Changed, f"#{FILTER_PREFIX}flanged")
    def _flanged_changed(self, event: Checkbox.Changed) -> None:
        """Cylindrical roller bearings may (or may no longer) qualify under axial load."""
        event.stop()
        if event.value != self._filters.flanged_cylindrical:
            self._filters = replace(self._filters, flanged_cylindrical=event.value)
            self.rank()

    @on(Input.Changed, ".size-limit")
    def _limit_changed(self, event: Input.Changed) -> None:
        """Take a readable limit at once; an unreadable one is marked and the last readable one
        stays in force."""
        event.stop()
        self._show_filter_problems()
        limits = self._size_limits()
        if limits != self._size_limits_in_force():
            self._filters = Filters(self._filters.kind, *limits,
                                    flanged_cylindrical=self._filters.flanged_cylindrical)
            self.rank()

    @on(Input.Submitted, ".size-limit")
    def _limit_submitted(self, event: Input.Submitted) -> None:
        event.stop()
        self.query_one("#candidates", DataTable).focus()

    def _size_limits_in_force(self) -> tuple[float | None, ...]:
        filters = self._filters
        return (filters.bore_min_mm, filters.bore_max_mm, filters.outer_max_mm,
                filters.width_max_mm)

    def _size_limits(self) -> tuple[float | None, ...]:
        """The typed limits in mm; an unreadable one keeps the value in force."""
        limits = []
        for (name, _), in_force in zip(SIZE_FILTERS, self._size_limits_in_force()):
            text = self.query_one(f"#{FILTER_PREFIX}{name.replace('_', '-')}", Input).value
            try:
                limits.append(length_limit(text))
            except QuantityError:
                limits.append(in_force)
        return tuple(limits)

    def _show_filter_problems(self) -> None:
        problems = []
        for name, label in SIZE_FILTERS:
            box = self.query_one(f"#{FILTER_PREFIX}{name.replace('_', '-')}", Input)
            problem = _length_problem(box.value)
            if problem is not None:
                problems.append(f"{'Bore d up to' if name == 'bore_max' else label}: {problem}")
        message = self.query_one("#filter-message", Static)
        message.update(Content("✘ " + "; ".join(problems) + " (the last readable limit holds)")
                       if problems else Content(""))
        message.display = bool(problems)

    # ---- showing ----------------------------------------------------------------------------
    def on_worker_state_changed(self, event: Worker.StateChanged) -> None:
        """Show a ranking when it is the answer to the latest request; drop older ones."""
        worker = event.worker
        if worker.group != "ranking" or event.state not in (WorkerState.SUCCESS, WorkerState.ERROR):
            return
        if event.state == WorkerState.ERROR:
            self._show(Ranking(self._serial, problem=f"the ranking failed: {worker.error}"))
            return
        ranking = worker.result
        if isinstance(ranking, Ranking) and ranking.serial == self._serial:
            self._show(ranking)

    def _show(self, ranking: Ranking) -> None:
        table = self.query_one("#candidates", DataTable)
        table.remove_class(BUSY_CLASS)
        self.catalog, self.selection = ranking.catalog, ranking.selection
        self._ranking = ranking
        summary = self.query_one("#selection-summary", Static)
        if ranking.selection is None or ranking.catalog is None or ranking.life_target is None:
            self._rows = []
            self._fill_table()
            summary.update(Content.styled(f"✘ {ranking.problem}", "bold $text-error"))
            return
        names = [result.case.name for result in self.results]
        self._rows = [dict(_cells(row), key=str(candidate.index)) for candidate, row in zip(
            ranking.selection.candidates,
            candidate_rows(ranking.catalog, ranking.selection, names, 0))]
        self._fill_table()
        summary.update(self._summary(ranking.catalog, ranking.selection, ranking.life_target))

    def _fill_table(self) -> None:
        """The rows, with the governing case as a column when it fits."""
        table = self.query_one("#candidates", DataTable)
        width = table.scrollable_content_region.width or self.app.size.width - 4
        columns = columns_that_fit(self._rows, width - 1)  # the scroll bar
        table.clear(columns=True)
        for key, heading in columns:
            table.add_column(heading, key=key)
        for row in self._rows:
            table.add_row(*plain([row[key] for key, _ in columns]), key=row["key"])
        self._columns = columns
        self._describe_row()

    def on_resize(self) -> None:
        """Offer the governing-case column again once the new width is laid out."""
        self.call_after_refresh(self._refit)

    def _refit(self) -> None:
        width = self.query_one("#candidates", DataTable).scrollable_content_region.width
        if self._rows and columns_that_fit(self._rows, width - 1) != self._columns:
            self._fill_table()

    def _summary(self, catalog: Catalog, selection: Selection, life_target: float) -> Content:
        s0 = self.results[0].s0_target
        rejected = f", {len(catalog.problems)} row(s) not readable" if catalog.problems else ""
        others = ", ".join(f"{count} {reason}" for reason, count in
                           sorted(selection.rejections.items(), key=lambda item: -item[1]))
        return Content("\n").join([
            Content(f"{Path(catalog.source).name}: {len(catalog)} bearings{rejected}. "
                    f"Lnm ≥ {fmt(life_target)} h" + (f", s0 ≥ {fmt(s0, 3)}" if s0 else "")
                    + f" in each of {len(self.results)} case(s)."),
            Content.assemble((f"{len(selection.order)} qualify", "bold"),
                             ", smallest first; life margin = least Lnm / target"
                             + (f". Not qualifying: {others}." if others else ".")),
        ])

    @on(DataTable.RowHighlighted, "#candidates")
    def _highlighted(self, event: DataTable.RowHighlighted) -> None:
        event.stop()
        self._describe_row()

    def _describe_row(self) -> None:
        """The highlighted candidate in full words under the list, with what it leaves to the
        maker's data; then why bearings of a kind that cannot carry the load were left out (with
        no candidate, why every refused bearing was)."""
        table = self.query_one("#candidates", DataTable)
        detail = self.query_one("#candidate-detail", Static)
        examples = self.selection.examples if self.selection is not None else {}
        if not self._rows or not 0 <= table.cursor_row < len(self._rows):
            detail.update(Content("\n").join(Content(f"{reason}: {message}")
                                             for reason, message in examples.items()))
            return
        row = self._rows[table.cursor_row]
        note = f"; {row['note']}" if row["note"] else ""
        mounted = _mounting(row["arrangement"])
        lines = [Content(
            f"{row['designation']}: {_kind_words(row['kind'])}{mounted}, {row['size']}; least life margin "
            f"{row['life_margin']} (case {row['governing_case']}), least s0 {row['min_s0']}{note}")]
        lines += [Content(f"Not qualifying, {reason}: {examples[reason]}")
                  for reason in LOAD_REASONS if reason in examples]
        detail.update(Content("\n").join(lines))

    # ---- adopting ---------------------------------------------------------------------------
    @on(DataTable.RowSelected, "#candidates")
    def _adopt(self, event: DataTable.RowSelected) -> None:
        """Close with the chosen catalog bearing's texts."""
        event.stop()
        catalog = self.catalog
        if catalog is None or event.row_key.value is None:
            return
        if event.data_table.has_class(BUSY_CLASS):
            self.notify("Still ranking with the new filters: choose again when the list is back",
                        severity="warning")
            return
        index = int(event.row_key.value)
        ranking = self._ranking
        listed = ranking.listed if ranking is not None and ranking.listed is not None else catalog
        position = ranking.position if ranking is not None else Arrangement.SINGLE.value
        source = f"{catalog.source}, row {catalog.rows[index]}"
        arrangement = str(catalog.arrangement[index])
        if arrangement != str(listed.arrangement[index]):
            source += f", as a {set_words(Arrangement(arrangement))} of two"
        self.close(Adoption(catalog.designations[index], catalog_bearing_texts(catalog, index),
                            source, note=mounting_words(listed, catalog, index, position)))

    def action_rate_from_geometry(self) -> None:
        """Rate a bearing no catalog holds from its internal geometry; adopting its ratings
        closes this screen too."""
        from .rating_screen import RatingScreen  # it imports Adoption from here

        if not self.on_top:
            return

        def rated(adoption: Adoption | None) -> None:
            if adoption is not None:
                self.close(adoption)

        self.app.push_screen(RatingScreen(self.bearing, self._bearing_texts, self._system,
                                          geometry_now=self._bearing_geometry), rated)
