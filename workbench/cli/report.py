"""``workbench report FILE [--format text|markdown|json] [-o OUT]``: a session's design review."""

from __future__ import annotations

import argparse
import sys
from pathlib import Path

from ..report import FORMATS
from .common import EXIT_BAD_INPUT

SUMMARY = "write the design review of a session"
DESCRIPTION = "Report every load case of a session."
EPILOG = None


def add_arguments(parser: argparse.ArgumentParser) -> None:
    parser.add_argument("file", help="session file (.toml)")
    parser.add_argument("--format", choices=FORMATS, default="text")
    parser.add_argument("-o", "--output", help="write here instead of standard output")


def run(args: argparse.Namespace) -> int:
    return run_report(args.file, args.format, args.output)


def run_report(path: str, fmt: str, out: str | None) -> int:
    """Load ``path``, render it in ``fmt``, write ``out`` or stdout; 0, or 2 on error.

    A case that cannot be derived shows its error in the report and does not fail the run.
    """
    from ..model.sessionfile import SessionFileError, load_session
    from ..report import render_report

    if fmt not in FORMATS:
        print(f"workbench report: unknown format {fmt!r}; use one of {', '.join(FORMATS)}",
              file=sys.stderr)
        return EXIT_BAD_INPUT
    try:
        session = load_session(path)
    except SessionFileError as exc:
        print(str(exc), file=sys.stderr)
        return EXIT_BAD_INPUT
    report = render_report(session, fmt, path)
    if out is None:
        sys.stdout.write(report)
        return 0
    try:
        Path(out).write_text(report, encoding="utf-8")
    except OSError as exc:
        print(f"{out}: cannot write the report: {exc.strerror or exc}", file=sys.stderr)
        return EXIT_BAD_INPUT
    return 0
