"""Command line: the screen by default, and headless ``calc``, ``report``, ``select``, ``rate``,
``internal``, ``bench``, one module each.

A sub-command module gives ``SUMMARY`` (its line in the help), ``DESCRIPTION``, ``EPILOG``,
``add_arguments(parser)`` and ``run(args) -> int``; :func:`build_parser` hangs them on one
argparse tree. ``workbench [FILE]`` (no sub-command) opens the screen (:mod:`.screen`): a session
file named where a sub-command would stand cannot share argparse's sub-command position, so
:func:`main` routes on the first word. The sub-command modules load only when a sub-command is
given, so opening the screen imports none of them.

Exit codes: 0 success, 2 a bad input or file (one line on standard error naming it) or output
that could not be written (a closed pipe, a full disk), 3 a question the solver cannot answer
(no root, or more than one).  A sub-command's output passes :func:`.common.run_guarded`:
control characters never reach the terminal.
"""

from __future__ import annotations

import argparse
import importlib
import sys
from typing import Sequence

from . import screen
from .common import run_guarded

SUBCOMMANDS = ("calc", "report", "select", "rate", "internal", "bench")  # each a module of this package


def build_parser() -> argparse.ArgumentParser:
    """``workbench`` with one sub-parser per sub-command; ``args.run(args)`` runs the one given."""
    parser = argparse.ArgumentParser(prog="workbench")
    commands = parser.add_subparsers(title="sub-commands", dest="command", required=True,
                                     metavar="COMMAND")
    for name in SUBCOMMANDS:
        module = importlib.import_module(f".{name}", __name__)
        command = commands.add_parser(name, help=module.SUMMARY, description=module.DESCRIPTION,
                                      epilog=module.EPILOG)
        module.add_arguments(command)
        command.set_defaults(run=module.run)
    return parser


def main(argv: Sequence[str] | None = None) -> int:
    """Entry point of the ``workbench`` console script and ``python -m workbench``."""
    argv = list(sys.argv[1:] if argv is None else argv)
    if argv and argv[0] in SUBCOMMANDS:
        def run() -> int:  # argparse's own error lines pass the guard too
            args = build_parser().parse_args(argv)
            return int(args.run(args))

        return run_guarded(run)
    return screen.run(screen.parser(SUBCOMMANDS).parse_args(argv))


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
