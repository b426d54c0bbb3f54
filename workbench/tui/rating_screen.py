"""Rate a special bearing from its internal geometry, and adopt its ratings.

The form reads its inputs with :func:`workbench.model.rating_form.rate_texts` (ISO 281:2007
basic dynamic rating C, ISO 76:2006 basic static rating C0: the same reader as ``workbench
rate``) and shows every step of the rating live as the inputs change.  Each typed input is
checked as it is typed (:func:`~workbench.model.rating_form.input_problem`); the kind is a
``Select``.  f10 or ctrl+g closes the screen with the session bearing texts the ratings give
(kind, C, C0, dm = Dpw, α, and f0 for balls); the workbench screen writes them into the bearing
as one undo step, as it does for a catalog bearing.
"""

from __future__ import annotations

from collections.abc import Mapping
from functools import partial

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical, VerticalScroll
from textual.content import Content
from textual.widgets import Input, Label, Select, Static

from ..engine.kinds import KIND_WORDS, Kind
from ..engine.ratings import KINDS
from ..model.fields import FieldError
from ..model.selection import pair_step_words
from ..model.session import GEOMETRY_KEYS
from ..model.rating_form import (
    RATING_INPUT_BY_NAME, RATING_INPUTS, bearing_texts, input_problem, pair_of_rated, pair_ratings,
    rate_texts,
)
from .derivation_pane import step_content
from .dialogs import Check, OnceModal
from .selection_screen import Adoption

RATING_PREFIX = "rating-"
RATING_DESIGNATION = "the geometry rating"
RATING_SOURCE = "rated from geometry (ISO 281, ISO 76)"
PREFILLED_FROM_BEARING = {"kind": "kind", "dpw": "dm", "contact_angle": "contact_angle"}
"""Form inputs started from the session bearing's texts (form input → bearing field)."""
RATING_HINT = ("tab / shift+tab: next / previous input · f10 or ctrl+g: use these ratings for "
               "the bearing (ctrl+z undoes) · escape: back")


class RatingScreen(OnceModal[Adoption | None]):
    """The geometry of one bearing, its rating worked out step by step, and adopting it."""

    DEFAULT_CSS = """
    RatingScreen {
        .form-label { width: 20; }
        Select { width: 34; }
        #rating-message { width: 100%; margin-top: 1; }
        #rating-steps-scroll { height: 1fr; scrollbar-size-vertical: 1; }
    }
    """

    BINDINGS = [
        Binding("escape", "dismiss_none", "Back", id="rating.close"),
        Binding("f10,ctrl+g", "adopt", "Use ratings", id="rating.adopt"),
    ]

    def __init__(self, bearing: str, bearing_texts_now: Mapping[str, str], system: str, *,
                 geometry_now: Mapping[str, str] | None = None) -> None:
        super().__init__()
        self.bearing = bearing
        self._start = {name: bearing_texts_now.get(field, "")
                       for name, field in PREFILLED_FROM_BEARING.items()}
        self._start.update({name: text for name, text in (geometry_now or {}).items()
                            if name in RATING_INPUT_BY_NAME and text.strip()})
        self._system = system
        self._arrangement = (bearing_texts_now.get("arrangement") or "single").strip()
        """The session bearing's arrangement: a pair position adopts a pair of a rated row."""
        self.adoption: Adoption | None = None
        """The texts the inputs give now (None while they cannot be rated)."""

    def compose(self) -> ComposeResult:
        """Title, one row per input, the message line, the steps and the keys."""
        with Vertical(classes="dialog-box screen-box"):
            yield Label(Content(f"Rate bearing {self.bearing} from its geometry"),
                        classes="dialog-title")
            for spec in RATING_INPUTS:
                with Horizontal(classes="form-row"):
                    yield Label(spec.label, classes="form-label")
                    start = self._start.get(spec.name, "")
                    if spec.kind == "choice":
                        yield Select([(KIND_WORDS[Kind(kind)], kind) for kind in KINDS],
                                     allow_blank=False, compact=True,
                                     value=start if start in KINDS else KINDS[0],
                                     id=RATING_PREFIX + spec.name)
                    else:
                        yield Input(start, placeholder=spec.hint, compact=True,
                                    id=RATING_PREFIX + spec.name,
                                    validators=[Check(partial(input_problem, spec.name))])
            yield Static(id="rating-message")
            with VerticalScroll(id="rating-steps-scroll"):
                yield Static(id="rating-steps")
            yield Static(Content(RATING_HINT), classes="dialog-hint")

    def on_mount(self) -> None:
        """Rate what the bearing's own texts give, and start at the first input still needed."""
        self.rate()
        needed = [box for box in self.query(Input) if not box.value
                  and RATING_INPUT_BY_NAME[(box.id or "").removeprefix(RATING_PREFIX)].required]
        (needed[0] if needed else self.query_one(Select)).focus()

    def texts(self) -> dict[str, str]:
        """The inputs as typed."""
        texts: dict[str, str] = {}
        for spec in RATING_INPUTS:
            widget = self.query_one(f"#{RATING_PREFIX}{spec.name}")
            if isinstance(widget, Select):
                texts[spec.name] = "" if widget.value is Select.NULL else str(widget.value)
            elif isinstance(widget, Input):
                texts[spec.name] = widget.value
        return texts

    def rate(self) -> None:
        """Rate the bearing from the inputs as they stand and show the steps or what is wrong."""
        message = self.query_one("#rating-message", Static)
        steps = self.query_one("#rating-steps", Static)
        try:
            geometry, derivation = rate_texts(self.texts())
        except FieldError as exc:
            self.adoption = None
            label = RATING_INPUT_BY_NAME[exc.field].label if exc.field in RATING_INPUT_BY_NAME \
                else exc.field
            message.update(Content.styled(f"✘ {label}: {exc.message}", "bold $text-error"))
            steps.update("")
            return
        texts = bearing_texts(geometry, derivation, arrangement=self._arrangement)
        kept = {name: text.strip() for name, text in self.texts().items()
                if name in GEOMETRY_KEYS and text.strip()}
        pair = pair_of_rated(geometry, self._arrangement)
        note = ""
        if pair is not None:
            c_pair, c0_pair = pair_ratings(geometry, derivation, self._arrangement)
            note = "rated for one bearing and adopted " + pair_step_words(
                Kind(geometry.kind), pair, c_one=derivation.results["C"], c_pair=c_pair,
                c0_one=derivation.results["C0"], c0_pair=c0_pair)
        self.adoption = Adoption(RATING_DESIGNATION, texts, RATING_SOURCE, kept, note=note)
        message.update(Content.assemble(
            ("C = ", "bold"), texts["c"], ("   C0 = ", "bold"), texts["c0"],
            f"   (dm {texts['dm']}" + (f", f0 {texts['f0']})" if texts["f0"] else ")"),
            f"\n{note}" if note else ""))
        lines: list[Content] = []
        for step in derivation.steps:
            lines.append(Content(""))
            lines.extend(step_content(step, self._system))
        steps.update(Content("\n").join(lines))

    @on(Input.Changed)
    @on(Select.Changed)
    def _input_changed(self, event: Input.Changed | Select.Changed) -> None:
        event.stop()
        self.rate()

    @on(Input.Submitted)
    def _next_input(self, event: Input.Submitted) -> None:
        """Enter in an input goes on to the next one, as tab does."""
        event.stop()
        self.focus_next()

    def action_adopt(self) -> None:
        """Close with the ratings' texts, when the inputs can be rated."""
        if self.adoption is None:
            self.app.bell()
            self.notify("The inputs cannot be rated yet: see the message above the steps",
                        severity="warning")
            return
        self.close(self.adoption)
