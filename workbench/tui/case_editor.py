"""The case editor: every input of the selected load case, grouped, as the person typed it.

The editor never writes to the session itself: each edit is announced with
:class:`CaseEditor.Changed` (field name and text) and the screen answers with
:meth:`CaseEditor.reject` or :meth:`CaseEditor.accept`.  A rejected text stays in its box with
the message beside it while the last valid value stays in force.

Each field is a :class:`FieldRow` that draws its label, and its text until the text box is
mounted over it.  The text boxes (an ``Input`` styles as about six plain widgets) are mounted
just after the first frame, showing the same text, so the screen appears at once and the rows
become editable a moment later.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence

from textual import on
from textual.app import ComposeResult
from textual.containers import VerticalScroll
from textual.content import Content
from textual.message import Message
from textual.reactive import reactive
from textual.suggester import SuggestFromList
from textual.widget import Widget
from textual.widgets import Checkbox, Input, Label, Static

from ..model.fields import FIELD_BY_NAME, FieldError, FieldSpec, parse_field
from ..model.quantities import QUANTITIES
from .choice_field import ChoiceField
from .whatif import scale_text

EDITOR_GROUPS: tuple[tuple[str, tuple[str, ...]], ...] = (
    ("Bearing", ("kind", "arrangement", "c", "c0", "f0", "contact_angle", "e_given", "y_given",
                 "dm", "cu")),
    ("Loads and speed", ("fr", "fa", "speed", "af", "outer_ring_rotates")),
    ("Reliability", ("reliability", "reliability_model", "weibull_x0", "weibull_theta",
                     "weibull_b", "rating_life_mrev")),
    ("Lubrication", ("vg", "vi", "nu100", "temp", "nu", "cleanliness")),
    ("Static", ("static_duty", "s0_min")),
)
NUDGEABLE_KINDS = ("quantity", "number", "fraction")
SWITCH_TEXT = {True: "yes", False: "no"}
FIELD_PREFIX = "field-"
ROW_PREFIX = "row-"


def field_id(name: str) -> str:
    """The DOM id of a field's widget."""
    return FIELD_PREFIX + name


def _placeholder(spec: FieldSpec) -> str:
    if spec.hint:
        return spec.hint
    if spec.kind == "quantity" and spec.quantity in QUANTITIES:
        return "e.g. " + QUANTITIES[spec.quantity].example
    return ""


def _takes_text(spec: FieldSpec) -> bool:
    """Numbers, quantities and the cleanliness level (which also takes an eC number) are typed."""
    return spec.kind not in ("switch", "choice") or spec.name == "cleanliness"


def _choice_widget(spec: FieldSpec) -> Widget:
    """The widget that edits a fixed choice (a ChoiceField) or a switch (a Checkbox)."""
    if spec.kind == "switch":
        widget: Widget = Checkbox("V = 1.2" if spec.name == "outer_ring_rotates" else "",
                                  compact=True, id=field_id(spec.name))
    else:
        widget = ChoiceField(spec.choices, title=spec.label, allow_blank=not spec.required,
                             id=field_id(spec.name))
    widget.tooltip = spec.hint or None
    return widget


def _text_box(spec: FieldSpec) -> Input:
    """The text box of a typed field."""
    suggester = SuggestFromList(spec.choices) if spec.choices else None
    box = Input(placeholder=_placeholder(spec), compact=True, suggester=suggester,
                id=field_id(spec.name), select_on_focus=False)
    box.tooltip = spec.hint or None
    return box


LABEL_WIDTH = 20


def _words_that_fit(text: str, width: int) -> str:
    """The leading words of ``text`` that fit in ``width`` cells (as a text box wraps its hint)."""
    if len(text) <= width:
        return text
    cut = text.rfind(" ", 0, width + 1)
    return text[:cut] if cut > 0 else text[:width]


class FieldRow(Widget):
    """One field: its label, then its editing widget (or, until that is mounted, its text)."""

    DEFAULT_CSS = f"""
    FieldRow {{
        height: 1;
        layout: horizontal;
        color: $text-muted;
        & > * {{
            margin-left: {LABEL_WIDTH};
            width: 1fr;
        }}
    }}
    """
    TEXT_STYLE = "$foreground on $surface"
    HINT_STYLE = "$text-disabled on $surface"
    """The text and the hint as a compact ``Input`` colours them (a component class for the
    hint was styled anew for each of the thirty rows at start)."""

    text: reactive[str] = reactive("")
    """The field's text as typed (what its text box shows)."""

    def __init__(self, label: str, placeholder: str = "", *, id: str | None = None) -> None:
        super().__init__(id=id)
        self._label = label
        self._placeholder = placeholder

    def render(self) -> Content:
        """The label in the label column; the text (or the hint, dim) where the box will sit,
        drawn as the text box draws them."""
        label = Content(f" {self._label[:LABEL_WIDTH - 2]:<{LABEL_WIDTH - 2}} ")
        if self.children:
            return label
        width = max(0, self.size.width - LABEL_WIDTH)
        if self.text:
            shown = Content.styled(self.text, self.TEXT_STYLE)
        else:
            shown = Content.styled(_words_that_fit(self._placeholder, width), self.HINT_STYLE)
        return Content.assemble(label, shown.truncate(width, pad=True).stylize("on $surface"))


class CaseEditor(VerticalScroll):
    """The inputs of one load case, grouped as an engineer reads them."""

    class Changed(Message):
        """A field was edited to ``text`` (not yet checked) in the case loaded as ``token``;
        ``done`` when the edit is complete in itself (a choice, a switch, a nudge)."""

        def __init__(self, field: str, text: str, token: int, done: bool = False) -> None:
            super().__init__()
            self.field = field
            self.text = text
            self.token = token
            self.done = done

    class Done(Message):
        """Typing in a field ended (enter, or the focus moved on)."""

    class BearingChosen(Message):
        """The case should use the bearing called ``name``."""

        def __init__(self, name: str) -> None:
            super().__init__()
            self.name = name

    def __init__(self, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self.token = 0
        """Which case is loaded; the screen ignores edits announced for another one."""
        self._nudging = False
        self._rejected: dict[str, str] = {}
        self._case_error: tuple[str, str] | None = None
        self._rows: dict[str, FieldRow] = {}
        self._message_lines: dict[str, Static] = {}
        self._bearing_title = Label("Bearing", classes="group-title", id="group-bearing")
        self._bearing_choice = ChoiceField([], title="Bearing used", prompt="(none)",
                                           id="bearing-choice")

    def compose(self) -> ComposeResult:
        """Group headings, a bearing chooser, and one row per field with its message line."""
        yield Static("No load case selected: add one with ctrl+n.", id="editor-empty")
        for title, names in EDITOR_GROUPS:
            if title == "Bearing":
                yield self._bearing_title
                with FieldRow("Bearing used", id="row-bearing"):
                    yield self._bearing_choice
            else:
                yield Label(title, classes="group-title", id=f"group-{title.split()[0].lower()}")
            for name in names:
                spec = FIELD_BY_NAME[name]
                row = self._rows[name] = FieldRow(spec.label, _placeholder(spec),
                                                  id=ROW_PREFIX + name)
                if _takes_text(spec):
                    yield row
                else:
                    with row:
                        yield _choice_widget(spec)

    def _field_widget(self, name: str) -> Widget | None:
        """The widget editing field ``name`` (None while its text box is still to come)."""
        row = self._rows.get(name)
        return row.children[0] if row is not None and row.children else None

    def on_mount(self) -> None:
        """Mount the text boxes once the first frame is painted."""
        self.call_after_refresh(self._mount_text_boxes)

    async def _mount_text_boxes(self) -> None:
        """A text box over each typed field's row, showing the row's text."""
        rows = [(row, FIELD_BY_NAME[name]) for name, row in self._rows.items() if not row.children]
        mounting = [row.mount(_text_box(spec)) for row, spec in rows]
        for waiting in mounting:
            await waiting
        for row, spec in rows:
            self._set_widget(spec.name, row.text)

    # ---- what the screen tells the editor ---------------------------------------------------
    def load(self, texts: Mapping[str, str], bearings: Sequence[str], bearing: str | None,
             bearing_users: int = 1) -> None:
        """Show a case's texts (empty ``texts``: no case) without announcing them as edits."""
        self._rejected.clear()
        empty = not texts
        self.set_class(empty, "-empty")
        if empty:
            self._show_messages()
            return
        title = f"Bearing {bearing}" if bearing else "Bearing"
        if bearing_users > 1:
            title += f" (shared by {bearing_users} cases)"
        self._bearing_title.update(Content(title))
        chooser = self._bearing_choice
        with chooser.prevent(ChoiceField.Changed):
            chooser.set_choices(bearings)
            chooser.value = bearing if bearing in bearings else None
        for name, text in texts.items():
            if name in FIELD_BY_NAME:
                self._set_widget(name, text)
        self._show_messages()

    def _set_widget(self, name: str, text: str) -> None:
        self._rows[name].text = text
        widget = self._field_widget(name)
        if widget is None:
            return  # a text box not mounted yet: it starts from the row's text
        if isinstance(widget, Input):
            with widget.prevent(Input.Changed):
                widget.value = text
                widget.cursor_position = len(text)
        elif isinstance(widget, ChoiceField):
            with widget.prevent(ChoiceField.Changed):
                widget.value = text.strip() if text.strip() in widget.choices else None
        elif isinstance(widget, Checkbox):
            try:
                checked = bool(parse_field(name, text))
            except FieldError:
                checked = False
            with widget.prevent(Checkbox.Changed):
                widget.value = checked

    def reject(self, field: str, message: str) -> None:
        """Show why the text typed in ``field`` was not taken."""
        self._rejected[field] = message
        self._show_messages()

    def accept(self, field: str) -> None:
        """The text typed in ``field`` was taken: clear its message."""
        if self._rejected.pop(field, None) is not None:
            self._show_messages()

    def show_case_error(self, field: str | None, message: str | None) -> None:
        """Show the case's own error (the engine's refusal) beside the field it names."""
        error = (field, message) if field and message else None
        if error != self._case_error:
            self._case_error = error
            self._show_messages()

    def _message_line(self, name: str) -> Static:
        """The message line under ``name``'s row, mounted the first time it is needed (thirty
        hidden lines made up a fifth of the editor's start-up)."""
        line = self._message_lines.get(name)
        if line is None:
            line = self._message_lines[name] = Static("", classes="field-message",
                                                      id=f"message-{name}")
            self.mount(line, after=self._rows[name])
        return line

    def _show_messages(self) -> None:
        shown = {name: (text, "-rejected") for name, text in self._rejected.items()}
        if self._case_error and self._case_error[0] not in shown:
            shown[self._case_error[0]] = (self._case_error[1], "-case-error")
        for name, line in self._message_lines.items():
            if name not in shown:
                line.display = False
        for name, (text, kind) in shown.items():
            if name not in self._rows:
                continue  # a case error about an input the editor has no field for
            line = self._message_line(name)
            line.set_class(kind == "-rejected", "-rejected")
            line.set_class(kind == "-case-error", "-case-error")
            line.display = True
            line.update(Content(("✘ " if kind == "-rejected" else "⚠ ") + text))

    def message_for(self, field: str) -> str | None:
        """The message shown beside ``field`` (a rejected text's, else the case's), or None."""
        if field in self._rejected:
            return self._rejected[field]
        if self._case_error and self._case_error[0] == field:
            return self._case_error[1]
        return None

    def field_text(self, field: str) -> str:
        """What the field's widget shows now, as text."""
        widget = self._field_widget(field)
        if widget is None:
            return self._rows[field].text
        if isinstance(widget, Input):
            return widget.value
        if isinstance(widget, ChoiceField):
            return widget.value or ""
        if isinstance(widget, Checkbox):
            return SWITCH_TEXT[widget.value]
        return ""

    def focused_field(self) -> str | None:
        """The field whose widget has focus, or None."""
        focused = self.screen.focused
        if focused is None or focused.id is None or not focused.id.startswith(FIELD_PREFIX):
            return None
        name = focused.id.removeprefix(FIELD_PREFIX)
        return name if self._field_widget(name) is focused else None

    def focus_field(self, field: str) -> None:
        """Move the focus to ``field``'s widget (nothing while its text box is still to come)."""
        widget = self._field_widget(field)
        if widget is not None:
            widget.focus()

    def focus_first(self) -> None:
        """Focus the first field (or the editor itself when there is no case)."""
        if self.has_class("-empty"):
            self.focus()
        else:
            self.focus_field(EDITOR_GROUPS[0][1][0])

    def nudge(self, factor: float) -> str | None:
        """Scale the number in the focused field by ``factor``, keeping its unit; a message
        when there is no numeric field in focus or nothing to scale."""
        name = self.focused_field()
        if name is None or FIELD_BY_NAME[name].kind not in NUDGEABLE_KINDS:
            return "put the cursor in a numeric field to nudge it"
        widget = self._field_widget(name)
        assert isinstance(widget, Input)  # a focused numeric field has its text box
        scaled = scale_text(widget.value, factor)
        if scaled is None:
            return f"{FIELD_BY_NAME[name].label}: no number to nudge"
        self._nudging = True
        try:
            widget.value = scaled
        finally:
            self._nudging = False
        widget.cursor_position = len(scaled)
        return None

    # ---- what the person does ---------------------------------------------------------------
    def _announce(self, widget: Widget | None, text: str, done: bool) -> None:
        if widget is not None and widget.id and widget.id.startswith(FIELD_PREFIX):
            self.post_message(self.Changed(widget.id.removeprefix(FIELD_PREFIX), text,
                                           self.token, done))

    @on(Input.Changed)
    def _input_changed(self, event: Input.Changed) -> None:
        event.stop()
        self._announce(event.input, event.value, self._nudging)

    @on(Input.Submitted)
    @on(Input.Blurred)
    def _typing_done(self, event: Input.Submitted | Input.Blurred) -> None:
        event.stop()
        self.post_message(self.Done())

    @on(ChoiceField.Changed)
    def _choice_changed(self, event: ChoiceField.Changed) -> None:
        event.stop()
        if event.field.id == "bearing-choice":
            if event.value is not None:
                self.post_message(self.BearingChosen(event.value))
            return
        self._announce(event.field, event.value or "", True)

    @on(Checkbox.Changed)
    def _checkbox_changed(self, event: Checkbox.Changed) -> None:
        event.stop()
        self._announce(event.checkbox, SWITCH_TEXT[event.value], True)
