"""The guarded reader: every TOML and CSV file the workbench opens passes these traps.

What each check guards is in its name and docstring.  Expected values come from the TOML 1.0
specification (what parses), the UTF-8 byte-order mark as Unicode defines it (EF BB BF), POSIX
file kinds, and Python's own limits (4300-digit int conversion, recursion); nothing is taken
from the reader itself.
"""

from __future__ import annotations

import os
import tomllib
from pathlib import Path

import pytest

from workbench.model.guarded_read import (
    MAX_CSV_COLUMNS, MAX_CSV_LINE_CHARS, MAX_DEPTH, MAX_KEY_CHARS, FileRefused, csv_cells,
    nesting_deeper_than, parse_toml, read_text, read_toml,
)


def _refusal(path: Path) -> FileRefused:
    with pytest.raises(FileRefused) as caught:
        read_toml(path)
    return caught.value


def test_byte_order_mark_is_accepted(tmp_path: Path) -> None:
    """A UTF-8 BOM (EF BB BF, as some Windows editors write) is not part of the text."""
    path = tmp_path / "bom.toml"
    path.write_bytes(b"\xef\xbb\xbfschema = 1\n")
    text, doc = read_toml(path)
    assert doc == {"schema": 1} and not text.startswith("\ufeff")


def test_not_utf8_names_the_line(tmp_path: Path) -> None:
    """A byte that is not UTF-8 is refused with its line, not a UnicodeDecodeError."""
    path = tmp_path / "latin.toml"
    path.write_bytes(b"a = 1\nb = '\xe9'\n")
    error = _refusal(path)
    assert error.line == 2 and "not UTF-8" in str(error)


@pytest.mark.skipif(not hasattr(os, "mkfifo"), reason="POSIX FIFOs")
def test_fifo_is_refused_without_blocking(tmp_path: Path) -> None:
    """A named pipe would block a plain read for ever: it is refused from its file kind."""
    path = tmp_path / "pipe.toml"
    os.mkfifo(path)
    assert "pipe" in str(_refusal(path))


@pytest.mark.skipif(not Path("/dev/zero").exists(), reason="needs /dev/zero")
def test_link_to_an_endless_device_is_refused(tmp_path: Path) -> None:
    """A link to /dev/zero would read until memory runs out: the device is refused."""
    path = tmp_path / "zero.toml"
    path.symlink_to("/dev/zero")
    assert "device" in str(_refusal(path))


def test_folder_and_missing_file(tmp_path: Path) -> None:
    """A folder and a missing file each get one line."""
    assert "folder" in str(_refusal(tmp_path))
    assert "no such file" in str(_refusal(tmp_path / "absent.toml"))


def test_file_over_the_size_limit_is_refused_unread(tmp_path: Path) -> None:
    """A file over the limit is refused from its size (a sparse file: nothing is written)."""
    path = tmp_path / "huge.toml"
    with path.open("wb") as handle:
        handle.truncate(30 * 1024 * 1024)
    assert "too large" in str(_refusal(path))
    small = tmp_path / "small.toml"
    small.write_text("a = 1\n" * 100, encoding="utf-8")
    with pytest.raises(FileRefused, match="too large"):
        read_text(small, limit=100)


def test_file_name_over_255_bytes_is_a_message(tmp_path: Path) -> None:
    """A name longer than file systems allow is refused in words, not ENAMETOOLONG."""
    error = _refusal(tmp_path / ("n" * 300 + ".toml"))
    assert "255" in str(error) and len(str(error)) < 240


@pytest.mark.parametrize("opening,closing", [("[", "]"), ("{a=", "}")])
def test_nesting_beyond_the_limit_is_refused_before_parsing(opening: str, closing: str) -> None:
    """Arrays or inline tables nested thousands deep would exhaust the parser's recursion."""
    text = "x = " + opening * 5000 + ("1" if opening == "{a=" else "") + closing * 5000 + "\n"
    with pytest.raises(FileRefused, match="nested more than"):
        parse_toml(text, "deep.toml")


def test_nesting_at_the_limit_still_parses() -> None:
    """The limit leaves room: MAX_DEPTH levels of arrays parse (tomllib is the reference)."""
    text = "x = " + "[" * (MAX_DEPTH - 1) + "]" * (MAX_DEPTH - 1) + "\n"
    assert parse_toml(text, "ok.toml") == tomllib.loads(text)


def test_brackets_in_strings_and_comments_do_not_count() -> None:
    """Only real nesting counts: brackets inside strings and comments are text."""
    text = ("a = '" + "[" * 100 + "'\nb = \"\"\"\n" + "{" * 100 + "\"\"\"\n# " + "[" * 100 + "\n")
    assert not nesting_deeper_than(text, 3)
    assert parse_toml(text, "x")["a"] == "[" * 100


def test_unbalanced_deep_brackets_are_a_message() -> None:
    """Unclosed brackets a million deep: a message (from the depth check or the parser)."""
    with pytest.raises(FileRefused):
        parse_toml("x = " + "[" * 1_000_000, "open.toml")


def test_integer_of_thousands_of_digits_names_its_line() -> None:
    """Python refuses to convert integers over 4300 digits (ValueError): one line, with the line."""
    with pytest.raises(FileRefused) as caught:
        parse_toml("a = 1\nb = " + "9" * 5000 + "\n", "big.toml")
    assert caught.value.line == 2 and "digits" in caught.value.message


def test_megabyte_key_is_refused_with_a_short_message() -> None:
    """A 1 MB key name: refused, and the message quotes only its start."""
    key = "k" * 1_000_000
    with pytest.raises(FileRefused) as caught:
        parse_toml(f"schema = 1\n[session]\n{key} = 1\n", "key.toml")
    assert caught.value.line == 3 and len(str(caught.value)) < 200
    assert f"{MAX_KEY_CHARS}" in caught.value.message


def test_many_comment_lines_parse() -> None:
    """100 000 comment lines are a valid (if odd) file: they parse to an empty document."""
    assert parse_toml("# note\n" * 100_000, "comments.toml") == {}


def test_syntax_error_names_line_and_column() -> None:
    """A TOML syntax error keeps the parser's line as the error's line."""
    with pytest.raises(FileRefused) as caught:
        parse_toml("a = 1\nb = = 2\n", "bad.toml")
    assert caught.value.line == 2 and "column" in caught.value.message


def test_csv_line_and_columns_are_bounded() -> None:
    """A CSV field over 128 kB and a 100 000-column header are refused in words, at once."""
    assert "characters" in str(csv_cells("x" * (MAX_CSV_LINE_CHARS + 1)))
    assert f"{MAX_CSV_COLUMNS}" in str(csv_cells("," * 1000))
    assert isinstance(csv_cells("," * 100_000), str)
    assert "characters" in str(csv_cells("a," + "y" * 200_000))
    assert csv_cells('a,"b,c",d') == ["a", "b,c", "d"]  # the csv module's quoting still holds
