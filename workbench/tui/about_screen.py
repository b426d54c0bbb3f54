"""The about screen: what the numbers follow, and the safety caution."""

from __future__ import annotations

from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import VerticalScroll
from textual.content import Content
from textual.widgets import Label, Static

from ..model.caution import SAFETY_CAUTION
from ..report.meta import tool_version
from .dialogs import OnceModal

STANDARDS = (
    "ISO 281:2007 — dynamic load ratings, equivalent dynamic load, rating life, a1, aISO",
    "ISO 76:2006 — static load ratings, equivalent static load, static safety factor s0",
    "ISO 3448 — ISO viscosity grades (VG) for industrial lubricants",
    "ASTM D341 — viscosity–temperature relation of petroleum oils",
    "ASTM D2270 — viscosity index",
    "Three-parameter Weibull life distribution — reliability beyond the ISO 281 a1 table",
    "Palmgren–Miner rule — the life of a duty cycle",
    "Shaft statics, gear-mesh and belt forces — the loads on a shaft's bearings",
    "Hertz, Lundberg–Palmgren, ISO/TS 16281:2008 — the Inside pane",
    "Brent's method — the back-solver's root finding",
)


class AboutScreen(OnceModal[None]):
    """The standards and the caution; escape closes it."""

    DEFAULT_CSS = """
    AboutScreen {
        #about-box { width: 100; }
        #about-caution {
            width: 100%;
            border: round $warning;
            padding: 0 1;
        }
        Static { width: 100%; }
    }
    """

    BINDINGS = [Binding("escape,q", "dismiss_none", "Close", id="about.close")]

    def compose(self) -> ComposeResult:
        """Title, standards, caution."""
        with VerticalScroll(classes="dialog-box", id="about-box"):
            yield Label(f"Bearing workbench {tool_version()}", classes="dialog-title")
            yield Static("The numbers follow:")
            yield Static(Content("\n".join("• " + line for line in STANDARDS)),
                         id="about-standards")
            caution = Static(Content(SAFETY_CAUTION), id="about-caution")
            caution.border_title = "Caution"
            yield caution
            yield Static("↑/↓: scroll · escape: close", classes="dialog-hint")

    def on_mount(self) -> None:
        """Let the arrow keys scroll at once."""
        self.query_one("#about-box").focus()
