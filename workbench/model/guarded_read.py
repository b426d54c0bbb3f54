"""The one door through which the workbench reads a TOML or CSV file a person gave it.

Sessions, recovery copies, catalogs, theme files, ``keys.toml`` and ``settings.toml`` are all
read here, so the traps a hostile or broken file can set are closed once:

- only a regular file is read (a FIFO would block for ever, ``/dev/zero`` never ends), opened
  without blocking and checked again on the open descriptor;
- at most :data:`MAX_FILE_BYTES` (20 MB; config files 1 MB) are read, and a larger file is
  refused in one line before its text is decoded;
- the text is UTF-8, with or without the byte-order mark some Windows editors write (the
  workbench writes none);
- TOML nesting (arrays and inline tables) is measured before parsing and refused beyond
  :data:`MAX_DEPTH`, since the parser recurses once per level;
- a key longer than :data:`MAX_KEY_CHARS` is refused (its first characters quoted), so no
  later step spends time or memory on it;
- whatever the parser still raises (its syntax error, RecursionError, ValueError for an integer
  of thousands of digits, MemoryError, OverflowError) becomes :class:`FileRefused`: one line
  naming the file and, where known, the line.

A CSV text is split into rows by :func:`csv_rows`, which bounds the columns of a row
(:data:`MAX_CSV_COLUMNS`) and the characters of a line (:data:`MAX_CSV_LINE_CHARS`): a line over
it is a problem of that row, not a traceback, and a 100 000-column header costs one split.
"""

from __future__ import annotations

import codecs
import csv
import os
import re
import stat
import tomllib
from pathlib import Path
from typing import Any, Iterator

from .user_text import clipped, clipped_path, quoted

MAX_FILE_BYTES = 20 * 1024 * 1024  # sessions, recovery copies, catalogs
MAX_CONFIG_BYTES = 1024 * 1024  # themes, keys.toml, settings.toml
MAX_DEPTH = 32  # nested arrays and inline tables; the deepest file we write uses 3
MAX_KEY_CHARS = 200
MAX_CSV_LINE_CHARS = 64 * 1024
MAX_CSV_COLUMNS = 256
MAX_NAME_BYTES = 255  # a file name's limit on the common file systems (ext4, APFS, NTFS)


class FileRefused(Exception):
    """A file that cannot be read (or written); ``str()`` is one line for the user.

    ``key`` is the dotted key the problem sits at, ``line`` its 1-based line, each when known.
    The path and the key are clipped when shown, so the line stays short.
    """

    def __init__(self, path: str | os.PathLike[str], message: str, key: str | None = None,
                 line: int | None = None) -> None:
        self.path = str(path)
        self.message = " ".join(message.split())
        self.key = key
        self.line = line
        super().__init__(self.path, self.message, key, line)

    def __str__(self) -> str:
        where = [clipped_path(self.path)]
        if self.line is not None:
            where.append(f"line {self.line}")
        if self.key:
            where.append(clipped(self.key))
        return f"{', '.join(where)}: {self.message}"


Refusal = type[FileRefused]

_KINDS = ((stat.S_ISFIFO, "a pipe (FIFO)"), (stat.S_ISCHR, "a device"), (stat.S_ISBLK, "a device"),
          (stat.S_ISSOCK, "a socket"), (stat.S_ISDIR, "a folder"))


def file_kind(mode: int) -> str | None:
    """What a non-regular file is, in words ("a pipe (FIFO)", "a folder"…); None for a regular one."""
    if stat.S_ISREG(mode):
        return None
    return next((words for test, words in _KINDS if test(mode)), "not a regular file")


def name_too_long(path: Path) -> str | None:
    """Why ``path``'s file name cannot exist, or None: over :data:`MAX_NAME_BYTES` in UTF-8."""
    size = len(os.fsencode(path.name))
    if size > MAX_NAME_BYTES:
        return f"the file name is {size} bytes long; file systems allow {MAX_NAME_BYTES}"
    return None


def read_bytes(path: str | os.PathLike[str], *, error: Refusal = FileRefused,
               limit: int = MAX_FILE_BYTES, what: str = "file") -> bytes:
    """The bytes of the regular file at ``path``, at most ``limit`` of them.

    Raises ``error`` (a :class:`FileRefused`) in one line: no such file, not a regular file,
    over ``limit`` bytes, cannot be read.
    """
    target = Path(path)
    too_long = name_too_long(target)
    if too_long:
        raise error(target, too_long)
    try:
        mode = os.stat(target).st_mode
    except FileNotFoundError:
        raise error(target, "no such file") from None
    except OSError as exc:
        raise error(target, f"cannot read it: {exc.strerror or exc}") from None
    kind = file_kind(mode)
    if kind:
        raise error(target, f"is {kind}, not a {what}")
    try:
        descriptor = os.open(target, os.O_RDONLY | getattr(os, "O_NONBLOCK", 0))
    except OSError as exc:
        raise error(target, f"cannot read it: {exc.strerror or exc}") from None
    with os.fdopen(descriptor, "rb") as handle:
        status = os.fstat(handle.fileno())
        kind = file_kind(status.st_mode)  # swapped for a pipe between stat and open
        if kind:
            raise error(target, f"is {kind}, not a {what}")
        if status.st_size > limit:
            raise error(target, _too_large(status.st_size, limit))
        try:
            data = handle.read(limit + 1)
        except OSError as exc:
            raise error(target, f"cannot read it: {exc.strerror or exc}") from None
    if len(data) > limit:
        raise error(target, _too_large(len(data), limit))
    return data


def read_text(path: str | os.PathLike[str], *, error: Refusal = FileRefused,
              limit: int = MAX_FILE_BYTES, what: str = "file") -> str:
    """The UTF-8 text of the regular file at ``path`` (a leading BOM dropped); ``error`` as
    :func:`read_bytes` raises it, or for text that is not UTF-8 (with the line of the bad byte)."""
    return decode_text(read_bytes(path, error=error, limit=limit, what=what), path, error)


def _too_large(size: int, limit: int) -> str:
    return f"too large: {size / 1048576:.1f} MB, over the {limit / 1048576:g} MB this file may hold"


def decode_text(data: bytes, source: str | os.PathLike[str], error: Refusal) -> str:
    """``data`` as UTF-8 text, a leading byte-order mark dropped; ``error`` names the bad byte."""
    if data.startswith(codecs.BOM_UTF8):
        data = data[len(codecs.BOM_UTF8):]
    try:
        return data.decode("utf-8")
    except UnicodeDecodeError as exc:
        line = data.count(b"\n", 0, exc.start) + 1
        raise error(source, f"not UTF-8 text (byte {exc.start})", line=line) from None


# ---- TOML ------------------------------------------------------------------------------------
# Strings and comments, whose brackets do not nest.  A rough lexer, enough to measure depth: what
# it misreads in a broken file, the parser then refuses.  An unclosed string runs to its end of
# line (or of text), so every token that starts also ends and the scan stays linear.
_TOML_TOKEN = re.compile(
    r'"""(?:[^\\]|\\.)*?(?:"""|\\?\Z)'
    r"|'''.*?(?:'''|\Z)"
    r'|"(?:[^"\\\n]|\\.)*(?:"|\n|\\?\Z)'
    r"|'[^'\n]*(?:'|\n|\Z)"
    r"|#[^\n]*", re.DOTALL)
_NOT_BRACKET = re.compile(r"[^\[\]{}]+")
_INNERMOST_PAIR = re.compile(r"\[\]|\{\}")
_TOML_POSITION = re.compile(r"\s*\(at line (\d+), column (\d+)\)\s*$")
_TOML_END = re.compile(r"\s*\(at end of document\)\s*$")
_LONG_DIGITS = re.compile(r"[0-9_]{1000,}")


def nesting_deeper_than(text: str, depth: int) -> bool:
    """True when TOML ``text`` nests brackets (arrays, inline tables, table headers) more than
    ``depth`` deep outside its strings and comments.

    C-speed passes only: the strings and comments are cut out, everything but brackets removed,
    then innermost pairs are struck out ``depth`` times; a pair still left lies deeper.
    """
    brackets = _NOT_BRACKET.sub("", _TOML_TOKEN.sub("", text))
    for _ in range(depth):
        stripped = _INNERMOST_PAIR.sub("", brackets)
        if stripped == brackets:
            return False
        brackets = stripped
    return _INNERMOST_PAIR.search(brackets) is not None


def _line_of(text: str, position: int) -> int:
    return text.count("\n", 0, max(position, 0)) + 1


def parse_toml(text: str, source: str | os.PathLike[str], *,
               error: Refusal = FileRefused) -> dict[str, Any]:
    """The TOML document in ``text``; ``error`` (one line, with the line where known) on any
    problem: syntax, nesting over :data:`MAX_DEPTH`, a key over :data:`MAX_KEY_CHARS`, an
    integer too long to convert, or the parser running out of stack or memory."""
    if text.startswith("\ufeff"):
        text = text[1:]
    if nesting_deeper_than(text, MAX_DEPTH):
        raise error(source, f"nested more than {MAX_DEPTH} levels deep (arrays or inline tables)")
    try:
        doc = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        message = clipped(str(exc), 200)
        position = _TOML_POSITION.search(str(exc))
        if position:
            message = f"{str(exc)[:position.start()]} (column {position[2]})"
            raise error(source, f"not valid TOML: {clipped(message, 120)}",
                        line=int(position[1])) from None
        raise error(source, f"not valid TOML: {_TOML_END.sub(' at the end of the file', message)}") \
            from None
    except RecursionError:
        raise error(source, "nested too deeply to read") from None
    except MemoryError:
        raise error(source, "too large to read in the memory available") from None
    except (ValueError, OverflowError) as exc:
        long_digits = _LONG_DIGITS.search(text)
        if long_digits:
            raise error(source, "a number with too many digits to read",
                        line=_line_of(text, long_digits.start())) from None
        raise error(source, f"not valid TOML: {clipped(str(exc))}") from None
    _check_keys(doc, text, source, error)
    return doc


def _check_keys(doc: dict[str, Any], text: str, source: str | os.PathLike[str],
                error: Refusal) -> None:
    """Refuse a key longer than MAX_KEY_CHARS anywhere in the document (depth already bounded)."""
    stack: list[Any] = [doc]
    while stack:
        value = stack.pop()
        if isinstance(value, dict):
            for key, item in value.items():
                if len(key) > MAX_KEY_CHARS:
                    raise error(source, f"a key of {len(key)} characters, {quoted(key, 30)}; "
                                        f"keys are at most {MAX_KEY_CHARS}",
                                line=_line_of(text, text.find(key[:MAX_KEY_CHARS])))
                stack.append(item)
        elif isinstance(value, list):
            stack.extend(value)


def read_toml(path: str | os.PathLike[str], *, error: Refusal = FileRefused,
              limit: int = MAX_FILE_BYTES, what: str = "TOML file") -> tuple[str, dict[str, Any]]:
    """The text and the parsed document of the TOML file at ``path``; ``error`` when refused."""
    text = read_text(path, error=error, limit=limit, what=what)
    return text, parse_toml(text, str(path), error=error)


# ---- CSV -------------------------------------------------------------------------------------
def csv_cells(line: str) -> list[str] | str:
    """The cells of one CSV line, or why they cannot be read (a line over the length limit,
    more than :data:`MAX_CSV_COLUMNS` cells, a NUL or a broken quote)."""
    if len(line) > MAX_CSV_LINE_CHARS:
        return f"a line of {len(line)} characters; at most {MAX_CSV_LINE_CHARS} are read"
    if line.count(",") >= MAX_CSV_COLUMNS:
        return f"more than {MAX_CSV_COLUMNS} columns"
    try:
        return next(csv.reader([line], strict=True))
    except (csv.Error, StopIteration) as exc:
        return f"not readable CSV: {clipped(str(exc))}"


def csv_rows(text: str) -> Iterator[tuple[int, str]]:
    """(line number, line) of every line of a CSV text that is not blank or a ``#`` comment."""
    for number, line in enumerate(text.splitlines(), 1):
        if line.strip() and not line.lstrip().startswith("#"):
            yield number, line
