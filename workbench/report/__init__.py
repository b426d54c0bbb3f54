"""Design-review reports of a session: one document (:mod:`.contents`), several writers.

:func:`~.contents.build_report` turns a session into one :class:`~.contents.Report`; each writer
module (``text``, ``markdown``, ``json``) only lays that document out through its ``render``. A
new format is a module with a ``render(report) -> str`` and an entry in :data:`WRITERS`.
``plot_text`` draws curves as text for the screen's What-if pane.
"""

from __future__ import annotations

from typing import Callable

from ..model.session import Session
from . import json, markdown, text
from .contents import Report, build_report

WRITERS: dict[str, Callable[[Report], str]] = {
    "text": text.render, "markdown": markdown.render, "json": json.render,
}
FORMATS = tuple(WRITERS)


def render_report(session: Session, fmt: str, source_name: str) -> str:
    """The design-review report of ``session`` in ``fmt`` (text, markdown or json)."""
    if fmt not in WRITERS:
        raise ValueError(f"unknown report format {fmt!r}; use one of {', '.join(FORMATS)}")
    return WRITERS[fmt](build_report(session, source_name))
