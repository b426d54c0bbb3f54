"""``workbench select SESSION [--catalog FILE]``: the catalog bearings that meet a session's cases.

Every load case of the session (or of one session bearing, ``--bearing``) is run on every catalog
bearing; those meeting the session's life target on Lnm and its static safety are listed smallest
first (ISO 281:2007, ISO 76:2006, by :func:`workbench.engine.select.select`).  A kind that cannot
carry a case's load does not qualify, and the output says why: a cylindrical roller bearing under
axial load (unless ``--flanged-cylindrical`` says it has flanges for it), a thrust bearing under
radial load.  Rejected catalog
rows go to standard error with their row number (the first twenty; ``--json`` lists all).  Exit codes: 0 done (also when none qualifies),
2 a bad session or catalog file or a bad option value.
"""

from __future__ import annotations

import argparse
import sys
from typing import TYPE_CHECKING, Any

from ..engine.kinds import Kind
from ..model.quantities import QuantityError, parse
from ..model.user_text import clipped, clipped_path
from .common import fail, print_json

if TYPE_CHECKING:
    from ..engine.select import Selection
    from ..model.catalog import Catalog
    from ..model.session import Session

DEFAULT_TOP = 10
SHOWN_PROBLEMS = 20  # rejected catalog rows named on standard error; --json lists all
SUMMARY = "list the catalog bearings that meet a session's cases"
DESCRIPTION = ("List the catalog bearings that meet every load case of a session: Lnm at the "
               "session's reliability against its life target, and its static safety "
               "(ISO 281:2007, ISO 76:2006). Smallest first: outer diameter, width, mass.")
EPILOG = ("Lengths take units (\"35 mm\", \"1.5 in\"); a bare number is mm. "
          "Exit codes: 2 a bad session, catalog or option.")


def add_arguments(parser: argparse.ArgumentParser) -> None:
    parser.add_argument("session", help="session file (.toml)")
    parser.add_argument("--catalog", metavar="FILE",
                        help="catalog file, .csv or .toml (default: the invented demo catalog)")
    parser.add_argument("--bearing", metavar="NAME",
                        help="only the cases that use this session bearing (one bearing position)")
    parser.add_argument("--kind", choices=[k.value for k in Kind], help="only this bearing kind")
    parser.add_argument("--bore-min", metavar="LENGTH", help="smallest bore d")
    parser.add_argument("--bore-max", metavar="LENGTH", help="largest bore d")
    parser.add_argument("--od-max", metavar="LENGTH", help="largest outer diameter D")
    parser.add_argument("--width-max", metavar="LENGTH", help="largest width B")
    parser.add_argument("--flanged-cylindrical", action="store_true",
                        help="cylindrical roller bearings have flanges to carry the axial load: "
                             "let them qualify under Fa > 0 (life still on P = Fr, ISO 281; "
                             "check their axial capacity with the maker's data)")
    parser.add_argument("--top", metavar="N", type=int, default=DEFAULT_TOP,
                        help=f"show the best N (default {DEFAULT_TOP}; 0 for all)")
    parser.add_argument("--json", action="store_true", help="print one JSON object")


def _length(flag: str, text: str | None) -> float | None:
    """A length option in mm; QuantityError carries the message."""
    if text is None:
        return None
    try:
        return parse(text, "length", default_unit="mm")
    except QuantityError as exc:
        raise QuantityError(f"{flag}: {exc.message}") from None


NOTE_MARK = "*"


def _table(rows: list[dict[str, Any]]) -> str:
    """The candidates as a plain table; a designation with a note is marked (the notes follow)."""
    from ..engine.record import fmt
    from ..report.contents import Table
    from ..report.text import table_lines

    body = tuple((str(n), r["designation"] + (NOTE_MARK if r["note"] else ""), r["kind"],
                  f"{r['d_mm']:g} × {r['D_mm']:g} × {r['B_mm']:g}",
                  "—" if r["mass_kg"] is None else f"{r['mass_kg']:.3f}",
                  "—" if r["life_margin"] is None else fmt(r["life_margin"], 3),
                  "—" if r["min_s0"] is None else fmt(r["min_s0"], 3),
                  r["governing_case"] or "—") for n, r in enumerate(rows, 1))
    table = Table(("#", "designation", "kind", "d × D × B mm", "mass kg", "life margin", "min s0",
                   "governing case"), body,
                  numeric=(True, False, False, False, True, True, True, False))
    return "\n".join(table_lines(table, indent="", rule=True))


def run(args: argparse.Namespace) -> int:
    """Select from the catalog for the session's cases and print the candidates."""
    from ..engine.record import InputError
    from ..engine.select import Filters, select
    from ..model.catalog import CatalogError, demo_catalog_path, load_catalog
    from ..model.selection import (
        candidate_rows, catalog_as_position, not_qualifying_rows, position_arrangement,
        position_words, selection_inputs,
    )
    from ..model.session import evaluate_case
    from ..model.sessionfile import SessionFileError, load_session

    try:
        session = load_session(args.session)
    except SessionFileError as exc:
        return fail(str(exc))
    catalog_path = args.catalog if args.catalog is not None else demo_catalog_path()
    try:
        catalog = load_catalog(catalog_path)
    except CatalogError as exc:
        return fail(str(exc))
    for problem in catalog.problems[:SHOWN_PROBLEMS]:
        print(f"workbench: {clipped_path(catalog.source)}: rejected row {problem.row}, "
              f"{clipped(problem.column, 30)}: {clipped(problem.message, 200)}", file=sys.stderr)
    if len(catalog.problems) > SHOWN_PROBLEMS:
        print(f"workbench: {clipped_path(catalog.source)}: and "
              f"{len(catalog.problems) - SHOWN_PROBLEMS} more rejected rows (--json lists all)",
              file=sys.stderr)
    try:
        filters = Filters(args.kind, _length("--bore-min", args.bore_min),
                          _length("--bore-max", args.bore_max), _length("--od-max", args.od_max),
                          _length("--width-max", args.width_max),
                          flanged_cylindrical=args.flanged_cylindrical)
    except QuantityError as exc:
        return fail(exc.message)
    cases = [case for case in session.cases if args.bearing is None or case.bearing == args.bearing]
    if not cases:
        where = f" on bearing {args.bearing!r}" if args.bearing else ""
        return fail(f"{args.session}: no load cases{where} to select for")
    results = [evaluate_case(session, case) for case in cases]
    try:
        inputs, life_target = selection_inputs(results)
    except InputError as exc:
        return fail(f"{args.session}: {exc.message}")
    catalog = catalog_as_position(catalog, inputs)
    try:
        selection = select(catalog, inputs, life_target, None, filters)
    except InputError as exc:
        return fail(f"{args.session}: {exc.field}: {exc.message}")
    case_names = [case.name for case in cases]
    rows = candidate_rows(catalog, selection, case_names, args.top)
    position = position_arrangement(inputs)
    if args.json:
        report = _report(args, session, catalog, selection, rows, case_names, life_target,
                         results[0].s0_target)
        report["not_qualifying"] = not_qualifying_rows(catalog, selection, case_names)
        report["position_arrangement"] = position
        print_json(report)
        return 0
    print(_text(args, session, catalog, selection, rows, case_names, life_target,
                results[0].s0_target, position_words(position)))
    return 0


def _report(args: argparse.Namespace, session: Session, catalog: Catalog, selection: Selection,
            rows: list[dict[str, Any]], case_names: list[str], life_target: float,
            s0_target: float | None) -> dict[str, Any]:
    """The JSON object: candidates best first, rejected rows, session, targets and counts."""
    return {
        "candidates": rows,
        "qualifying": len(selection.order),
        "rejected_rows": [p.as_dict() for p in catalog.problems],
        "rejections": selection.rejections,
        "reasons": selection.examples,
        "flanged_cylindrical": args.flanged_cylindrical,
        "session": {"path": str(args.session), "title": session.title, "cases": case_names},
        "catalog": {"path": catalog.source, "bearings": len(catalog)},
        "targets": {"life_h": life_target, "reliability": session.targets.reliability,
                    "s0": s0_target},
    }


def _text(args: argparse.Namespace, session: Session, catalog: Catalog, selection: Selection,
          rows: list[dict[str, Any]], case_names: list[str], life_target: float,
          s0_target: float | None, rated_as: str = "") -> str:
    """The readable form: what was asked (with how a pair position rates the catalog), the
    table, and why the others fell out."""
    s0_words = f", s0 ≥ {s0_target:g}" if s0_target is not None else ""
    lines = [
        f"Session  {session.title} ({args.session})",
        f"Catalog  {catalog.source}: {len(catalog)} bearings"
        + (f", {len(catalog.problems)} row(s) rejected (see standard error)" if catalog.problems else ""),
        f"Targets  Lnm ≥ {life_target:g} h at R = {session.targets.reliability}{s0_words}, "
        f"over {len(case_names)} case(s): {', '.join(case_names)}",
        *([f"Rated    {rated_as}"] if rated_as else []),
        "",
    ]
    if rows:
        shown = f"best {len(rows)} of {len(selection.order)}" if len(rows) < len(selection.order) \
            else f"all {len(rows)}"
        lines += [f"Qualifying bearings, smallest first ({shown}); life margin = min Lnm/target:",
                  _table(rows)]
        lines += [f"{NOTE_MARK} {note}" for note in dict.fromkeys(r["note"] for r in rows if r["note"])]
    else:
        lines.append("No catalog bearing meets every case.")
    if selection.rejections:
        counts = ", ".join(f"{count} {reason}" for reason, count in
                           sorted(selection.rejections.items(), key=lambda item: -item[1]))
        lines += ["", f"Not qualifying: {counts}."]
        for reason, message in selection.examples.items():
            lines.append(f"  {reason}: {message}")
        lines += _load_refusals(catalog, selection, case_names, args.top,
                                flanged_allowed=args.flanged_cylindrical)
    return "\n".join(lines)


def _load_refusals(catalog: Catalog, selection: Selection, case_names: list[str], top: int, *,
                   flanged_allowed: bool) -> list[str]:
    """The bearings whose kind cannot carry some case's load, by reason and case (the first
    ``top`` of each, 0: all); the JSON's ``not_qualifying`` lists every rejected bearing."""
    from ..engine.select import REASON_NO_AXIAL, REASON_NO_RADIAL
    from ..model.selection import not_qualifying_rows

    by_cause: dict[tuple[str, str], list[str]] = {}
    for row in not_qualifying_rows(catalog, selection, case_names):
        if row["reason"] in (REASON_NO_AXIAL, REASON_NO_RADIAL):
            by_cause.setdefault((row["reason"], row["case"]), []).append(row["designation"])
    lines = []
    for (reason, case), names in by_cause.items():
        shown = names if top <= 0 else names[:top]
        more = f", and {len(names) - len(shown)} more" if len(shown) < len(names) else ""
        hint = (" (--flanged-cylindrical lets flanged ones qualify)"
                if reason == REASON_NO_AXIAL and not flanged_allowed else "")
        lines.append(f"  {reason} in case {case!r}{hint}: {', '.join(shown)}{more}.")
    return lines
