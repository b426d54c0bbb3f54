"""Text a person typed, made safe for the place it goes: a message, a terminal, Markdown, HTML.

Every error line that quotes a person's text quotes it through :func:`quoted` (or :func:`clipped`
without the quotes), so no message grows with the text: a 1 MB key name is shown as its first
sixty characters and an ellipsis.  Anything printed to a terminal passes :func:`terminal_safe`,
which drops control characters (an escape sequence in a case name would otherwise retitle the
window or move the cursor).  Reports escape user text with :func:`markdown_text` and
:func:`html_text`.
"""

from __future__ import annotations

import html
import re

QUOTE_LIMIT = 60  # characters of a person's text quoted in one message
PATH_LIMIT = 160  # characters of a path named in one message (its end kept: the file's name)
ELLIPSIS = "…"

# C0 and C1 controls, DEL, and the bidirectional overrides that reorder what a terminal shows;
# a tab and a line end are kept where the caller allows them.
_BIDI = "\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069"
_CONTROLS = re.compile(f"[\x00-\x08\x0b\x0c\x0e-\x1f\x7f-\x9f{_BIDI}]")
_CONTROLS_AND_LINES = re.compile(f"[\x00-\x1f\x7f-\x9f{_BIDI}\u2028\u2029\u0085]")
# Emphasis, code, strike-through and table cells; "_" only at a word's edge (inside a word it
# emphasises nothing: s0_min); "]" only where it would close a link or image ("](", "][").
_MARKDOWN_SPECIAL = re.compile(r"([\\`*|~]|(?<![0-9A-Za-z])_|_(?![0-9A-Za-z])|\](?=[(\[]))")
# What Markdown passes on as HTML: a tag, comment or declaration start, or a character reference
_HTML_START = re.compile(r"<(?=[A-Za-z/!?])|&(?=#?\w+;)")
_MARKDOWN_LEADING = re.compile(r"^(\d*)([#\-+>.)\[])")  # a heading, list, quote, link label


def clipped(text: str, limit: int = QUOTE_LIMIT) -> str:
    """``text`` on one line and at most ``limit`` characters, ending in "…" when shortened."""
    text = " ".join(str(text)[: 4 * limit].split())  # bounded work however long the text
    text = _CONTROLS_AND_LINES.sub("", text)
    return text if len(text) <= limit else text[: limit - 1] + ELLIPSIS


def sentence(text: str) -> str:
    """``text`` beginning with a capital, as a sentence or heading begins (the rest as typed:
    ``str.capitalize`` would lower "RM-2")."""
    return text[:1].upper() + text[1:]


def quoted(text: object, limit: int = QUOTE_LIMIT) -> str:
    """``text`` in quotes for a message, clipped as :func:`clipped` does: ``'abc…'``."""
    return f"'{clipped(str(text), limit)}'"


def clipped_path(path: object, limit: int = PATH_LIMIT) -> str:
    """A path for a message: its end (the file's name) kept when it is too long to show whole."""
    text = _CONTROLS_AND_LINES.sub("?", str(path))
    return text if len(text) <= limit else ELLIPSIS + text[-(limit - 1):]


def terminal_safe(text: str, *, keep_lines: bool = True) -> str:
    """``text`` without control characters, for a terminal; tabs and line ends stay when
    ``keep_lines`` (a report), else they go too (a title, a name on one line)."""
    pattern = _CONTROLS if keep_lines else _CONTROLS_AND_LINES
    return pattern.sub("", text)


def one_line(text: str) -> str:
    """User text for a heading or a table cell: control characters and line breaks become spaces."""
    return " ".join(_CONTROLS_AND_LINES.sub(" ", text).split())


def _html_entity(match: re.Match[str]) -> str:
    return "&lt;" if match[0] == "<" else "&amp;"


def markdown_text(text: str, *, block_start: bool = True) -> str:
    """User text as literal Markdown on one line: HTML tags and character references escaped
    (``<script>`` shows as text; a lone ``<`` or ``&`` stays as typed),
    Markdown's inline marks backslash-escaped, line breaks and control characters gone.  Where
    the text starts a block (a paragraph, a list item, a quote; ``block_start``) a leading
    ``#``, ``-``, ``+``, ``>`` or ``1.`` is escaped too, so it cannot become a heading or a list."""
    escaped = _MARKDOWN_SPECIAL.sub(r"\\\1", _HTML_START.sub(_html_entity, one_line(text)))
    return _MARKDOWN_LEADING.sub(r"\1\\\2", escaped) if block_start else escaped


def html_text(text: str) -> str:
    """User text as literal HTML (``&``, ``<``, ``>``, quotes escaped; control characters gone)."""
    return html.escape(terminal_safe(text), quote=True)

