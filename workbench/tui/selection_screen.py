"""Select a bearing from a catalog for every case on one session bearing, and adopt one.

The screen runs :func:`workbench.engine.select.select` (ISO 281:2007 life on Lnm against the
session's life target, ISO 76:2006 static safety) over the demo catalog or a catalog file whose
path is typed, for all the cases (the session's and the generated ones) that use the selected
case's bearing, with the inputs built by :func:`workbench.model.selection.selection_inputs`.
The qualifying bearings are listed smallest first.  Enter on a row closes the screen with that
row's bearing texts (:func:`~workbench.model.catalog.catalog_bearing_texts`); the workbench
screen writes them into the session bearing as one undo step.  A bearing no catalog holds is
rated from its geometry instead (ctrl+g, :mod:`workbench.tui.rating_screen`), and adopted the
same way.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from pathlib import Path

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical
from textual.content import Content
from textual.widgets import DataTable, Input, Label, Static

from ..engine.record import InputError, fmt
from ..engine.select import Selection, select
from ..model.catalog import Catalog, CatalogError, catalog_bearing_texts, demo_catalog_path, load_catalog
from ..model.selection import candidate_rows, selection_inputs
from ..model.session import CaseResult
from .dialogs import OnceModal

COLUMNS = ("Designation", "Kind", "d × D × B mm", "Life margin", "Governing case", "min s0")
SELECTION_HINT = ("enter on a row: adopt that bearing's data into the session bearing "
                  "(ctrl+z undoes it) · tab: catalog file · ctrl+g: rate a special bearing "
                  "from its geometry instead · escape: close")


@dataclass(frozen=True, slots=True)
class Adoption:
    """A catalog bearing chosen: its designation and the session bearing texts it gives."""

    designation: str
    texts: dict[str, str]


def _number_text(value: float | None) -> str:
    return "—" if value is None else fmt(value, 3)


class SelectionScreen(OnceModal[Adoption | None]):
    """The catalog bearings that meet every case on one session bearing, smallest first."""

    BINDINGS = [
        Binding("escape", "dismiss_none", "Close", id="selection.close"),
        Binding("ctrl+g", "rate_from_geometry", "Rate from geometry", id="selection.rate"),
    ]

    catalog: Catalog | None = None
    """The catalog searched last (None before, or when it could not be read)."""

    selection: Selection | None = None
    """The outcome of the last search."""

    def __init__(self, bearing: str, results: Sequence[CaseResult],
                 catalog_path: Path | None = None, *,
                 bearing_texts: Mapping[str, str] | None = None, system: str = "SI") -> None:
        super().__init__()
        self.bearing = bearing
        self.results = list(results)
        self._catalog_path = catalog_path or demo_catalog_path()
        self._bearing_texts = dict(bearing_texts or {})
        self._system = system

    def compose(self) -> ComposeResult:
        """Title, catalog file, what was asked, the candidates and the keys."""
        with Vertical(classes="dialog-box selection-box"):
            yield Label(f"Select bearing from catalog: for bearing {self.bearing}",
                        classes="dialog-title")
            with Horizontal(classes="field-row"):
                yield Label("Catalog file", classes="field-label")
                yield Input(str(self._catalog_path), compact=True, id="catalog-path")
            yield Static(id="selection-summary")
            yield DataTable(id="candidates", cursor_type="row", zebra_stripes=True)
            yield Static(Content(SELECTION_HINT), classes="dialog-hint")

    def on_mount(self) -> None:
        """Search the starting catalog and put the cursor in the list."""
        table = self.query_one("#candidates", DataTable)
        table.add_columns(*COLUMNS)
        self.search(self._catalog_path)
        table.focus()

    @on(Input.Submitted, "#catalog-path")
    def _path_given(self, event: Input.Submitted) -> None:
        """Search the catalog file whose path was typed (blank: the demo catalog)."""
        event.stop()
        text = event.value.strip()
        self.search(Path(text).expanduser() if text else demo_catalog_path())

    def _say(self, content: Content) -> None:
        self.query_one("#selection-summary", Static).update(content)

    def search(self, path: Path) -> None:
        """Run the selection over the catalog at ``path`` and list the qualifying bearings."""
        table = self.query_one("#candidates", DataTable)
        table.clear()
        self.catalog = self.selection = None
        try:
            catalog = load_catalog(path)
        except CatalogError as exc:
            self._say(Content.styled(f"✘ {exc}", "bold $text-error"))
            return
        try:
            inputs, life_target = selection_inputs(self.results)
            if not inputs:
                raise InputError("case", f"no load case uses bearing {self.bearing!r}")
            selection = select(catalog, inputs, life_target)
        except InputError as exc:
            self._say(Content.styled(f"✘ {exc.message}", "bold $text-error"))
            return
        self.catalog, self.selection = catalog, selection
        names = [result.case.name for result in self.results]
        rows = candidate_rows(catalog, selection, names, 0)
        for candidate, row in zip(selection.candidates, rows):
            table.add_row(row["designation"], row["kind"],
                          f"{row['d_mm']:g} × {row['D_mm']:g} × {row['B_mm']:g}",
                          _number_text(row["life_margin"]), row["governing_case"] or "—",
                          _number_text(row["min_s0"]), key=str(candidate.index))
        self._say(self._summary(catalog, selection, life_target))

    def _summary(self, catalog: Catalog, selection: Selection, life_target: float) -> Content:
        s0 = self.results[0].s0_target
        rejected = f", {len(catalog.problems)} row(s) not readable" if catalog.problems else ""
        others = ", ".join(f"{count} {reason}" for reason, count in
                           sorted(selection.rejections.items(), key=lambda item: -item[1]))
        return Content("\n").join([
            Content(f"{catalog.source}: {len(catalog)} bearings{rejected}"),
            Content(f"Lnm ≥ {fmt(life_target)} h" + (f", s0 ≥ {fmt(s0, 3)}" if s0 else "")
                    + f" over {len(self.results)} case(s) on bearing {self.bearing}"),
            Content.assemble((f"{len(selection.order)} qualify", "bold"),
                             ", smallest first; life margin = smallest Lnm / target"
                             + (f". Not qualifying: {others}" if others else "")),
        ])

    @on(DataTable.RowSelected, "#candidates")
    def _adopt(self, event: DataTable.RowSelected) -> None:
        """Close with the chosen catalog bearing's texts."""
        event.stop()
        if self.catalog is None or event.row_key.value is None:
            return
        index = int(event.row_key.value)
        self.close(Adoption(self.catalog.designations[index],
                            catalog_bearing_texts(self.catalog, index)))

    def action_rate_from_geometry(self) -> None:
        """Rate a bearing no catalog holds from its internal geometry; adopting its ratings
        closes this screen too."""
        from .rating_screen import RatingScreen  # it imports Adoption from here

        def rated(adoption: Adoption | None) -> None:
            if adoption is not None:
                self.close(adoption)

        self.app.push_screen(RatingScreen(self.bearing, self._bearing_texts, self._system), rated)
