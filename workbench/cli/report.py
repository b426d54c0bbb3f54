"""``workbench report FILE [--format text|markdown|json|html] [-o OUT]``: a session's design review."""

from __future__ import annotations

import argparse
import sys

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
    """Load ``path``, render it in ``fmt``, write ``out`` (atomically) or stdout; 0, or 2 on error.

    A case that cannot be derived shows its error in the report and does not fail the run.
    """
    from ..model.sessionfile import SessionFileError, load_session
    from ..report import report_text, write_report

    if fmt not in FORMATS:
        print(f"workbench report: unknown format {fmt!r}; use one of {', '.join(FORMATS)}",
              file=sys.stderr)
        return EXIT_BAD_INPUT
    try:
        session = load_session(path)
    except SessionFileError as exc:
        print(str(exc), file=sys.stderr)
        return EXIT_BAD_INPUT
    if out is None:
        sys.stdout.write(report_text(session, fmt=fmt, session_path=path))
        return 0
    written = write_report(session, session_path=path, fmt=fmt, out_path=out)
    if written.error is not None:
        print(written.error, file=sys.stderr)
        return EXIT_BAD_INPUT
    return 0
