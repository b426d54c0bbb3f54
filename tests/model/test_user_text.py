"""User text made safe for messages, terminals and reports.

Expectations: the ECMA-48 control ranges (C0 0x00–0x1F, DEL, C1 0x80–0x9F), CommonMark's
backslash escapes and HTML's five escaped characters (``html.escape`` is the reference).
"""

from __future__ import annotations

import html

from workbench.model.user_text import (
    QUOTE_LIMIT, clipped, clipped_path, html_text, markdown_text, quoted, terminal_safe,
)


def test_messages_quote_at_most_sixty_characters() -> None:
    """A megabyte of user text in a message shows as its start and an ellipsis."""
    shown = quoted("k" * 1_000_000)
    assert len(shown) == QUOTE_LIMIT + 2 and shown.endswith("…'")
    assert clipped("short") == "short"
    assert clipped("two\nlines\x1b[2J") == "two lines[2J"


def test_long_paths_keep_their_file_name() -> None:
    """A long path is clipped at its start, so the file's name stays readable."""
    shown = clipped_path("/" + "d" * 500 + "/session.toml")
    assert len(shown) <= 160 and shown.endswith("/session.toml")


def test_escape_sequences_never_reach_the_terminal() -> None:
    """An OSC title sequence and a cursor move are dropped; tabs and line ends may stay."""
    text = "case\x1b]0;pwned\x07 A\x9b2J\tok\nnext"
    assert terminal_safe(text) == "case]0;pwned A2J\tok\nnext"
    assert terminal_safe(text, keep_lines=False) == "case]0;pwned A2Jok" + "next"


def test_markdown_escapes_html_and_marks_and_keeps_one_line() -> None:
    """<img onerror> and <script> show as text; a newline cannot start a new heading."""
    text = "<img src=x onerror=alert(1)>\n# injected *bold* [link](x) |cell|"
    out = markdown_text(text)
    assert "<" not in out and "\n" not in out
    assert r"\*bold\*" in out and r"[link\](x)" in out and "](" not in out.replace("\\](", "")
    assert r"\|cell\|" in out and markdown_text("s0_min") == "s0_min"
    assert markdown_text("# title").startswith("\\#") and markdown_text("1. x") == r"1\. x"


def test_html_escapes_like_the_standard_library() -> None:
    """html.escape is the reference; control characters are dropped first."""
    assert html_text("<script>'&\"</script>") == html.escape("<script>'&\"</script>", quote=True)
    assert html_text("a\x1bb") == "ab"
