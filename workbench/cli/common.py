"""What every sub-command shares: exit codes, the one-line failure, JSON on standard output."""

from __future__ import annotations

import json
import sys
from typing import Any

EXIT_BAD_INPUT = 2
EXIT_NO_SOLUTION = 3


def fail(message: str, code: int = EXIT_BAD_INPUT) -> int:
    """Say ``message`` on one line of standard error and give the exit code."""
    print(f"workbench: {message}", file=sys.stderr)
    return code


def print_json(value: Any, indent: int | None = 2) -> None:
    """``value`` as standard JSON (NaN and infinities as null) on standard output."""
    from ..report.json import json_safe

    print(json.dumps(json_safe(value), ensure_ascii=False, indent=indent))
