"""Design-review reports of a session: one document (:mod:`.contents`), several writers.

:func:`~.contents.build_report` turns a session into one :class:`~.contents.Report`; each writer
module (``text``, ``markdown``, ``json``, ``html``) only lays that document out through its
``render``. A new format is a module with a ``render(report) -> str`` and an entry in
:data:`WRITERS`. ``meta`` gives a report its provenance (time, tool version, the session file's
hash); ``output`` writes a report to a file atomically or previews it, for the screen and
``report -o``. ``plot_svg`` draws the html report's figures.
"""

from __future__ import annotations

from typing import Callable

from ..model.session import Session
from . import html, json, markdown, text
from .contents import Report, build_report
from .meta import Provenance
from .output import ReportWritten, preview, report_text, write_report

WRITERS: dict[str, Callable[[Report], str]] = {
    "text": text.render, "markdown": markdown.render, "json": json.render, "html": html.render,
}
FORMATS = tuple(WRITERS)

__all__ = ["FORMATS", "WRITERS", "ReportWritten", "preview", "render_report", "report_text",
           "write_report"]


def render_report(session: Session, fmt: str, source_name: str,
                  made: Provenance | None = None) -> str:
    """The design-review report of ``session`` in ``fmt`` (one of :data:`FORMATS`), with its
    provenance ``made`` (:func:`~.meta.provenance`; None: never saved, generated now)."""
    if fmt not in WRITERS:
        raise ValueError(f"unknown report format {fmt!r}; use one of {', '.join(FORMATS)}")
    return WRITERS[fmt](build_report(session, source_name, made))
