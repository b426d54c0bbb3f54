"""What every sub-command shares: exit codes, the one-line failure, JSON on standard output,
and the guard around a run (control characters kept off the terminal, a closed pipe or a full
disk said in one line)."""

from __future__ import annotations

import contextlib
import json
import os
import re
import sys
from typing import Any, Callable, TextIO

from ..model.user_text import clipped, terminal_safe

EXIT_BAD_INPUT = 2
EXIT_NO_SOLUTION = 3
MESSAGE_LIMIT = 300  # characters of one failure line

# Characters JSON leaves raw that a terminal may still act on (C1 controls, bidi overrides)
_RAW_IN_JSON = re.compile("[\x7f-\x9f\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069\u2028\u2029]")


def fail(message: str, code: int = EXIT_BAD_INPUT) -> int:
    """Say ``message`` on one line of standard error and give the exit code."""
    print(f"workbench: {clipped(message, MESSAGE_LIMIT)}", file=sys.stderr)
    return code


def print_json(value: Any, indent: int | None = 2) -> None:
    """``value`` as standard JSON (NaN and infinities as null) on standard output; characters a
    terminal could act on are written as ``\\uXXXX`` escapes, so the data stays whole."""
    from ..report.json import json_safe

    text = json.dumps(json_safe(value), ensure_ascii=False, indent=indent)
    print(_RAW_IN_JSON.sub(lambda match: f"\\u{ord(match[0]):04x}", text))


class TerminalText:
    """A text stream that drops control characters (but tabs and line ends) from all it writes:
    a title or case name holding an escape sequence cannot retitle the window or move the
    cursor.  Everything else is the wrapped stream's."""

    def __init__(self, stream: TextIO) -> None:
        self._stream = stream

    def write(self, text: str) -> int:
        self._stream.write(terminal_safe(text))
        return len(text)

    def __getattr__(self, name: str) -> Any:
        return getattr(self._stream, name)


def _silence(stream: TextIO) -> None:
    """Point a failed stream's descriptor at the null device, so the interpreter's last flush
    at exit does not fail a second time with a traceback."""
    with contextlib.suppress(AttributeError, OSError, ValueError):
        null = os.open(os.devnull, os.O_WRONLY)
        os.dup2(null, stream.fileno())
        os.close(null)


def run_guarded(command: Callable[[], int]) -> int:
    """Run a sub-command with terminal-safe output; a closed pipe or a failed write (a full
    disk) ends it with one line on standard error and exit code 2, never a traceback."""
    out, err = sys.stdout, sys.stderr
    sys.stdout, sys.stderr = TerminalText(out), TerminalText(err)  # type: ignore[assignment]
    try:
        code = command()
        sys.stdout.flush()
        return code
    except BrokenPipeError:
        _silence(out)
        return EXIT_BAD_INPUT  # the reader went away: nobody to tell
    except OSError as exc:
        _silence(out)
        with contextlib.suppress(OSError, ValueError):
            fail(f"cannot write the output: {exc.strerror or exc}")
            sys.stderr.flush()
        return EXIT_BAD_INPUT
    finally:
        sys.stdout, sys.stderr = out, err
