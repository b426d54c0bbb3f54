"""``workbench [FILE]``: open the workbench screen on a session, or on the built-in demo."""

from __future__ import annotations

import argparse
from typing import Sequence


def parser(subcommands: Sequence[str]) -> argparse.ArgumentParser:
    """The parser of the default command; its help names the sub-commands."""
    parser = argparse.ArgumentParser(
        prog="workbench",
        description="Rolling-bearing workbench for combined radial and axial load. "
                    f"Sub-commands: {', '.join(subcommands)} (see 'workbench calc --help').",
    )
    parser.add_argument("file", nargs="?", help="session file to open (default: the demo session)")
    return parser


def run(args: argparse.Namespace) -> int:
    """Open the screen; its exit code."""
    from ..tui.app import run_app

    return run_app(args.file)
