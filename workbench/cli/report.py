"""``workbench report FILE [--format text|markdown|json|html] [-o OUT]``: a session's design review."""

from __future__ import annotations

import argparse
import sys

from ..model.user_text import quoted
from ..report import FORMATS
from .common import fail

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
    from ..model.guarded_read import FileRefused
    from ..model.sessionfile import load_session
    from ..report import report_text, write_report

    if fmt not in FORMATS:
        return fail(f"report: unknown format {quoted(fmt)}; use one of {', '.join(FORMATS)}")
    try:
        session = load_session(path)
    except FileRefused as exc:
        return fail(str(exc))
    if out is None:
        sys.stdout.write(report_text(session, fmt=fmt, session_path=path))
        return 0
    written = write_report(session, session_path=path, fmt=fmt, out_path=out)
    if written.error is not None:
        return fail(written.error)
    return 0
