"""The html report: one self-contained page with inline SVG figures, every piece of user text
escaped, the caution shown, print rules in place.

References outside the project: the HTML Living Standard as read by the standard library's
``html.parser`` (the page parses, and what a browser would see as an element or an attribute is
known), ``html.escape`` for the expected escaped text, and the SVG elements ``<svg>``,
``<path>``/``<use>`` as written by matplotlib (the plotting library drawing the figures).
One small session: seven figures in all (matplotlib drawing is the cost of this file).
"""

from __future__ import annotations

import html
import subprocess
import sys
from html.parser import HTMLParser

import pytest

from workbench.model.caution import SAFETY_CAUTION
from workbench.model.session import Bearing, LoadCase, Session, Targets
from workbench.report import render_report

SCRIPT_NAME = "<script>alert('case')</script>"
IMAGE_NAME = '<img src=x onerror="alert(1)">'
TITLE = "Mill & <b>press</b> \"review\""

# A two-bearing shaft with one spur gear and one state (forces from the spur-gear relations).
SHAFT = {
    "name": "countershaft", "bearing_a": "locating", "bearing_b": IMAGE_NAME,
    "position_a": "0 mm", "position_b": "200 mm", "locating": "A",
    "elements": [{"name": "wheel", "kind": "spur", "position": "80 mm", "diameter": "120 mm",
                  "pressure_angle": "20°", "driving": "no", "mesh_angle": "0°"}],
    "states": [{"name": "running", "power": "7.5 kW", "speed": "960 rpm", "share": "1"}],
}


def hostile_session() -> Session:
    locating = Bearing("locating", {"kind": "deep-groove", "c": "33 kN", "c0": "19 kN",
                                    "dm": "52 mm"}, notes=IMAGE_NAME)
    locating.designation = SCRIPT_NAME  # field of issue 14, item 2
    locating.source = IMAGE_NAME
    free = Bearing(IMAGE_NAME, {"kind": "deep-groove", "c": "25 kN", "c0": "15 kN"})
    session = Session(
        title=TITLE, engineer=SCRIPT_NAME, notes=f"first line\n\n{IMAGE_NAME}",
        targets=Targets(life="20000 h", reliability="0.90"),
        bearings=[locating, free],
        cases=[LoadCase(SCRIPT_NAME, "locating",
                        {"fr": "4 kN", "fa": "1 kN", "speed": "960 rpm", "vg": "150",
                         "temp": "70 °C", "cleanliness": "normal"}, notes=IMAGE_NAME)])
    session.reserved["shafts"] = [SHAFT]
    return session


@pytest.fixture(scope="module")
def page() -> str:
    return render_report(hostile_session(), "html", "hostile <names>.toml")


class Elements(HTMLParser):
    """Every start tag and its attributes, as a browser's parser would see them."""

    def __init__(self) -> None:
        super().__init__()
        self.tags: list[tuple[str, dict[str, str | None]]] = []

    def handle_starttag(self, tag: str, attrs: list[tuple[str, str | None]]) -> None:
        self.tags.append((tag, dict(attrs)))


def elements(text: str) -> list[tuple[str, dict[str, str | None]]]:
    parser = Elements()
    parser.feed(text)
    parser.close()
    return parser.tags


def test_user_text_is_escaped_everywhere(page: str) -> None:
    tags = elements(page)
    names = {tag for tag, _ in tags}
    assert "script" not in names and "img" not in names and "b" not in names
    assert not any(name.startswith("on") for _, attrs in tags for name in attrs)
    assert html.escape(SCRIPT_NAME) in page and html.escape(IMAGE_NAME) in page
    assert html.escape(TITLE) in page
    assert "<script" not in page and "<img" not in page


def test_one_self_contained_page_with_inline_svg_figures(page: str) -> None:
    tags = elements(page)
    # life: the own case and the shaft's two generated ones; aISO: the own case (the only one
    # with lubrication data); the shaft's loads; one duty cycle per shaft bearing
    assert [tag for tag, _ in tags].count("svg") == 3 + 1 + 1 + 2
    assert page.count("<style>") == 1 and "@media print" in page and "break-before: page" in page
    assert "http" not in page and "url(" not in page.replace("url(#", "")
    assert not [tag for tag, attrs in tags
                if tag in {"link", "iframe", "object", "embed", "script"} or "src" in attrs]
    assert all((attrs.get("href") or attrs.get("xlink:href") or "#").startswith("#")
               for _, attrs in tags)
    ids = [attrs["id"] for _, attrs in tags if attrs.get("id")]
    assert len(ids) == len(set(ids))  # figures never share an id


def test_the_caution_heads_and_ends_the_page(page: str) -> None:
    escaped = html.escape(SAFETY_CAUTION)
    assert page.count(escaped) == 2
    assert page.index(escaped) < page.index("<h2>")


def test_designation_source_and_shaft_loads_are_shown(page: str) -> None:
    assert f"designation {html.escape(SCRIPT_NAME)}" in page
    assert html.escape(IMAGE_NAME) in page
    assert "bearing loads in each state" in page
    # Fa/Fr = 0.25 against ISO 281 Table 3's e, which moves with Fa/C0 as the load scales: the
    # branch changes inside 0.25…4, and the figure's legend names the mark
    assert "e switch (Fa/Fr = e)" in page


def test_matplotlib_loads_only_for_html() -> None:
    program = (
        "import sys\n"
        "from workbench.model.session import Bearing, LoadCase, Session\n"
        "from workbench.report import render_report\n"
        "s = Session(bearings=[Bearing('b', {'kind': 'deep-groove', 'c': '30 kN', "
        "'c0': '18 kN'})], cases=[LoadCase('c', 'b', {'fr': '3 kN', 'speed': '900 rpm'})])\n"
        "for fmt in ('text', 'markdown', 'json'):\n"
        "    render_report(s, fmt, 'x')\n"
        "print('matplotlib' in sys.modules)\n"
    )
    shown = subprocess.run([sys.executable, "-c", program], capture_output=True, text=True,
                           check=True).stdout
    assert shown.strip() == "False"
