"""``workbench select SESSION [--catalog FILE]``: the catalog bearings that meet a session's cases.

Every load case of the session (or of one session bearing, ``--bearing``) is run on every catalog
bearing; those meeting the session's life target on Lnm and its static safety are listed smallest
first (ISO 281:2007, ISO 76:2006, by :func:`workbench.engine.select.select`).  Rejected catalog
rows go to standard error with their row number.  Exit codes: 0 done (also when none qualifies),
2 a bad session or catalog file or a bad option value.
"""

from __future__ import annotations

import argparse
import json
import math
import sys
from typing import Any, Sequence

from ..engine.derive import CaseInputs
from ..engine.kinds import Kind
from ..engine.record import InputError, fmt
from ..engine.select import Filters, Selection, select
from .catalog import Catalog, CatalogError, demo_catalog_path, load_catalog
from .quantities import QuantityError, parse
from .session import CaseResult, Session, evaluate_case
from .sessionfile import SessionFileError, load_session

EXIT_BAD_INPUT = 2
DEFAULT_TOP = 10


def _parser() -> argparse.ArgumentParser:
    parser = argparse.ArgumentParser(
        prog="workbench select",
        description="List the catalog bearings that meet every load case of a session: Lnm at the "
                    "session's reliability against its life target, and its static safety "
                    "(ISO 281:2007, ISO 76:2006). Smallest first: outer diameter, width, mass.",
        epilog="Lengths take units (\"35 mm\", \"1.5 in\"); a bare number is mm. "
               "Exit codes: 2 a bad session, catalog or option.",
    )
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
    parser.add_argument("--top", metavar="N", type=int, default=DEFAULT_TOP,
                        help=f"show the best N (default {DEFAULT_TOP}; 0 for all)")
    parser.add_argument("--json", action="store_true", help="print one JSON object")
    return parser


def _fail(message: str) -> int:
    print(f"workbench: {message}", file=sys.stderr)
    return EXIT_BAD_INPUT


def _length(flag: str, text: str | None) -> float | None:
    """A length option in mm; QuantityError carries the message."""
    if text is None:
        return None
    try:
        return parse(text, "length", default_unit="mm")
    except QuantityError as exc:
        raise QuantityError(f"{flag}: {exc.message}") from None


def _number(value: float) -> float | None:
    """NaN and infinities as JSON null."""
    return float(value) if math.isfinite(value) else None


def selection_inputs(results: Sequence[CaseResult]) -> tuple[list[CaseInputs], float]:
    """The engine inputs of the evaluated cases to select for, and the session's life target.

    InputError names the first case that cannot be read (field ``case``) or the missing life
    target (field ``targets.life``); the message says which.
    """
    for result in results:
        if result.inputs is None:
            raise InputError("case", f"case {result.case.name!r}, {result.error_field}: "
                                     f"{result.error}")
    life_target = results[0].life_target_h if results else None
    if life_target is None:
        raise InputError("targets.life", "the session has no life target ([targets] life)")
    return [result.inputs for result in results if result.inputs is not None], life_target


def candidate_rows(catalog: Catalog, selection: Selection, case_names: list[str],
                   top: int) -> list[dict[str, Any]]:
    """The best ``top`` candidates (0: all) as plain rows: designation, kind, d, D, B, mass,
    life margin, governing case name and smallest s0 (NaN as None)."""
    chosen = selection.candidates if top <= 0 else selection.candidates[:top]
    return [{
        "designation": catalog.designations[c.index],
        "kind": str(catalog.kind[c.index]),
        "d_mm": float(catalog.d_mm[c.index]),
        "D_mm": float(catalog.D_mm[c.index]),
        "B_mm": float(catalog.B_mm[c.index]),
        "mass_kg": _number(catalog.mass_kg[c.index]),
        "life_margin": _number(c.life_margin),
        "governing_case": case_names[c.governing_case] if c.governing_case >= 0 else None,
        "min_s0": _number(c.min_s0),
    } for c in chosen]


def _table(rows: list[dict[str, Any]]) -> str:
    """The candidates as a plain table."""
    head = ("#", "designation", "kind", "d × D × B mm", "mass kg", "life margin", "min s0",
            "governing case")
    body = [(str(n), r["designation"], r["kind"], f"{r['d_mm']:g} × {r['D_mm']:g} × {r['B_mm']:g}",
             "—" if r["mass_kg"] is None else f"{r['mass_kg']:.3f}",
             "—" if r["life_margin"] is None else fmt(r["life_margin"], 3),
             "—" if r["min_s0"] is None else fmt(r["min_s0"], 3),
             r["governing_case"] or "—") for n, r in enumerate(rows, 1)]
    widths = [max(len(row[k]) for row in (head, *body)) for k in range(len(head))]
    right = {0, 4, 5, 6}
    lines = []
    for row in (head, *body):
        cells = [cell.rjust(w) if k in right else cell.ljust(w)
                 for k, (cell, w) in enumerate(zip(row, widths))]
        lines.append("  ".join(cells).rstrip())
    lines.insert(1, "  ".join("-" * w for w in widths))
    return "\n".join(lines)


def run_select(argv: Sequence[str]) -> int:
    """``workbench select SESSION [--catalog FILE] [--json] [--top N] [filters]``."""
    args = _parser().parse_args(argv)
    try:
        session = load_session(args.session)
    except SessionFileError as exc:
        return _fail(str(exc))
    catalog_path = args.catalog if args.catalog is not None else demo_catalog_path()
    try:
        catalog = load_catalog(catalog_path)
    except CatalogError as exc:
        return _fail(str(exc))
    for problem in catalog.problems:
        print(f"workbench: {catalog.source}: rejected row {problem.row}, {problem.column}: "
              f"{problem.message}", file=sys.stderr)
    try:
        filters = Filters(args.kind, _length("--bore-min", args.bore_min),
                          _length("--bore-max", args.bore_max), _length("--od-max", args.od_max),
                          _length("--width-max", args.width_max))
    except QuantityError as exc:
        return _fail(exc.message)
    cases = [case for case in session.cases if args.bearing is None or case.bearing == args.bearing]
    if not cases:
        where = f" on bearing {args.bearing!r}" if args.bearing else ""
        return _fail(f"{args.session}: no load cases{where} to select for")
    results = [evaluate_case(session, case) for case in cases]
    try:
        inputs, life_target = selection_inputs(results)
    except InputError as exc:
        return _fail(f"{args.session}: {exc.message}")
    try:
        selection = select(catalog, inputs, life_target, None, filters)
    except InputError as exc:
        return _fail(f"{args.session}: {exc.field}: {exc.message}")
    case_names = [case.name for case in cases]
    rows = candidate_rows(catalog, selection, case_names, args.top)
    if args.json:
        print(json.dumps(_report(args, session, catalog, selection, rows, case_names, life_target,
                                 results[0].s0_target), ensure_ascii=False, indent=2))
        return 0
    print(_text(args, session, catalog, selection, rows, case_names, life_target,
                results[0].s0_target))
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
        "session": {"path": str(args.session), "title": session.title, "cases": case_names},
        "catalog": {"path": catalog.source, "bearings": len(catalog)},
        "targets": {"life_h": life_target, "reliability": session.targets.reliability,
                    "s0": s0_target},
    }


def _text(args: argparse.Namespace, session: Session, catalog: Catalog, selection: Selection,
          rows: list[dict[str, Any]], case_names: list[str], life_target: float,
          s0_target: float | None) -> str:
    """The readable form: what was asked, the table, and why the others fell out."""
    s0_words = f", s0 ≥ {s0_target:g}" if s0_target is not None else ""
    lines = [
        f"Session  {session.title} ({args.session})",
        f"Catalog  {catalog.source}: {len(catalog)} bearings"
        + (f", {len(catalog.problems)} row(s) rejected (see standard error)" if catalog.problems else ""),
        f"Targets  Lnm ≥ {life_target:g} h at R = {session.targets.reliability}{s0_words}, "
        f"over {len(case_names)} case(s): {', '.join(case_names)}",
        "",
    ]
    if rows:
        shown = f"best {len(rows)} of {len(selection.order)}" if len(rows) < len(selection.order) \
            else f"all {len(rows)}"
        lines += [f"Qualifying bearings, smallest first ({shown}); life margin = min Lnm/target:",
                  _table(rows)]
    else:
        lines.append("No catalog bearing meets every case.")
    if selection.rejections:
        counts = ", ".join(f"{count} {reason}" for reason, count in
                           sorted(selection.rejections.items(), key=lambda item: -item[1]))
        lines += ["", f"Not qualifying: {counts}."]
        for reason, message in selection.examples.items():
            lines.append(f"  {reason}: {message}")
    return "\n".join(lines)
