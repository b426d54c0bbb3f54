"""User text made literal for an html report.

Every title, name, note, designation and cell a person typed passes :func:`html_text` on its way
into the html report, so ``<script>`` or ``<img onerror=…>`` in a case name shows as text and
never runs. (The hostile-input work, issue 18 item 7, brings ``model.user_text.html_text`` with
the same contract for every output; when it lands this module gives way to it.)
"""

from __future__ import annotations

import html
import re

# C0 and C1 control characters other than tab and line feed, and DEL: never meaningful in a report
_CONTROLS = re.compile("[\x00-\x08\x0b-\x1f\x7f-\x9f]")


def html_text(text: str) -> str:
    """``text`` as literal html: ``&``, ``<``, ``>`` and both quotes escaped, controls dropped."""
    return html.escape(_CONTROLS.sub("", text), quote=True)
