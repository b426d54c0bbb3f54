"""The case form: every input of the selected load case, grouped as an engineer reads them.

Built from Textual's own fields: a :class:`FieldBox` (an ``Input`` checked by the field table)
for typed values, a :class:`ChoiceBox` (a ``Select``) for fixed choices and the bearing, a
:class:`TickBox` (a ``Checkbox``) for a switch.  The form never writes to the session: each edit is announced with
:class:`CaseForm.Edited` and the screen answers with :meth:`CaseForm.show_note`.  The form
follows :attr:`view` (bound to the screen's) and shows what the document holds for the selected
case; a rejected text stays in its field with its message under it while the value in force
stays in the document.
"""

from __future__ import annotations

from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Grid, Horizontal, VerticalScroll
from textual.events import DescendantFocus
from textual.geometry import Size
from textual.message import Message
from textual.reactive import var
from textual.suggester import SuggestFromList
from textual.widget import Widget
from textual.widgets import Checkbox, Input, Label, Select, Static

from ..engine.kinds import ARRANGEMENTS, parse_kind
from ..model.document import Document
from ..model.fields import (BEARING_FIELDS, FIELD_BY_NAME, FieldError, FieldSpec, parse_field,
                            unread_fields)
from ..model.quantities import QUANTITIES
from .choice_box import ChoiceBox
from .field_box import FieldBox, FieldValidator
from .tick_box import TickBox
from .view import View, view_reactive

EDITOR_GROUPS: tuple[tuple[str, tuple[str, ...]], ...] = (
    ("Bearing", ("bearing", "kind", "arrangement", "c", "c0", "f0", "contact_angle", "e_given",
                 "y_given", "dm", "cu")),
    ("Loads and speed", ("fr", "fa", "speed", "af", "outer_ring_rotates")),
    ("Reliability", ("reliability", "reliability_model", "weibull_x0", "weibull_theta",
                     "weibull_b", "rating_life_mrev")),
    ("Lubrication", ("vg", "vi", "nu100", "temp", "nu", "cleanliness")),
    ("Static", ("static_duty", "s0_min", "static_only")),
    ("Fit: inside view (f8)", ("clearance", "preload", "tilt", "moment")),
)
BEARING_FIELD = "bearing"
BEARING_LABEL = "Bearing used"
BEARING_HINT = "the bearing of the session this case loads; its fields are shared by its cases"
FIELD_ORDER: tuple[str, ...] = tuple(name for _, names in EDITOR_GROUPS for name in names)
WIDE = 100
"""From this many columns of screen the labels are written in full (the screen's ``-wide``)."""
BLANK_CHOICE = "(default)"
SWITCH_WORDS = {"outer_ring_rotates": ("V = 1", "V = 1.2"),
                "static_only": ("life and s0", "s0 verdict only")}
"""What a switch does, off and on: the words beside it follow it, so they read right in
monochrome too (a fixed "V = 1.2" beside an empty box read as applied)."""


def switch_words(name: str, on: bool) -> str:
    """The words beside switch ``name`` when it is ``on`` or off."""
    off_words, on_words = SWITCH_WORDS.get(name, ("no", "yes"))
    return on_words if on else off_words


def takes_text(name: str) -> bool:
    """Numbers, quantities and the cleanliness level (which also takes an eC number) are typed;
    fixed choices, switches and the bearing are chosen."""
    if name == BEARING_FIELD:
        return False
    spec = FIELD_BY_NAME[name]
    return spec.kind not in ("switch", "choice") or name == "cleanliness"


def field_help(name: str) -> str:
    """The full words for a field: its long label and its hint."""
    if name == BEARING_FIELD:
        return f"{BEARING_LABEL}: {BEARING_HINT}"
    spec = FIELD_BY_NAME[name]
    example = _example(spec)
    hints = [spec.hint or (f"for example {example}" if example else "")]
    if spec.kind == "quantity" and spec.default_unit:  # "2" typed in Fr is 2 N: say so
        hints.append(f"no unit means {spec.default_unit}")
    hint = "; ".join(part for part in hints if part)
    return f"{spec.label}: {hint}" if hint else spec.label


def _example(spec: FieldSpec) -> str:
    if spec.kind == "quantity" and spec.quantity in QUANTITIES:
        return QUANTITIES[spec.quantity].example
    return ""


def _switch_on(name: str, text: str) -> bool:
    try:
        return bool(parse_field(name, text))
    except FieldError:
        return False


def field_choices(name: str, texts: dict[str, str]) -> tuple[str, ...]:
    """The options of a choice field; the arrangements follow the kind typed."""
    spec = FIELD_BY_NAME[name]
    if name == "arrangement":
        try:
            return tuple(a.value for a in ARRANGEMENTS[parse_kind(texts.get("kind", ""))])
        except (KeyError, ValueError):
            return spec.choices
    return spec.choices


class FieldRow(Horizontal):
    """A label and a control on one line (the solver pane's inputs)."""


class FieldGroup(Grid):
    """One group of the form: two columns, each field's label beside its control, a row a
    field (a note under a field spans both columns).  A grid rather than a container per
    field: the form is most of the screen's widgets, and each one costs the screen time to
    start, to style and to paint on every key."""


class FieldNote(Static):
    """A refused text's message under its field, across both columns of the field's group.

    Textual's grid measures an ``auto`` row at one column's width even for a cell that spans
    two, so a message that wraps there took more rows than it fills, and blank rows opened under
    it; here the height is measured at the width the note is given, the grid's."""

    def get_content_height(self, container: Size, viewport: Size, width: int) -> int:
        return super().get_content_height(container, viewport,
                                          container.width - self.styles.gutter.width)


class CaseForm(VerticalScroll):
    """The inputs of one load case; ↑/↓ move between fields, Esc goes back to the list."""

    BINDINGS = [
        Binding("down", "app.focus_next", "Next field", show=False),
        Binding("up", "app.focus_previous", "Previous field", show=False),
    ]

    DEFAULT_CSS = """
    CaseForm {
        height: 1fr;
        scrollbar-gutter: stable;
        scrollbar-size-vertical: 1;  /* the cell a choice needs at 80 columns ("angular-contact") */
        & .group-title {
            text-style: bold;
            color: $text-primary;
            background: $boost;
            padding: 0 1;
            margin-top: 1;
        }
        & .group-title.-first { margin-top: 0; }
        & FieldGroup {
            grid-size: 2;
            grid-columns: 18 1fr;
            grid-rows: auto;
            height: auto;
        }
        & .field-label {
            padding: 0 1;
            color: $text-muted;
        }
        & .field-label.-unread { text-style: strike; }
        & .field-note {
            column-span: 2;
            padding: 0 1 0 3;
            color: $text-error;
            background: $error-muted;
        }
        & #case-note {
            display: none;
            color: $text-warning;
            background: $warning-muted;
            padding: 0 1;
        }
        & #case-note.-shown { display: block; }
    }
    """

    view: var[View] = view_reactive()
    """The document's revision and the selected case (bound to the screen's)."""

    class Edited(Message):
        """Field ``field`` was edited to ``text`` (not yet checked); ``done`` when the edit is
        complete in itself (a choice, a switch, enter)."""

        def __init__(self, field: str, text: str, done: bool) -> None:
            super().__init__()
            self.field = field
            self.text = text
            self.done = done

    class TypingDone(Message):
        """Typing in a field ended (enter, or the focus moved on)."""

    class HelpShown(Message):
        """The field under the focus, in full words, for the help line."""

        def __init__(self, text: str) -> None:
            super().__init__()
            self.text = text

    def __init__(self, document: Document, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self.document = document
        self._notes: dict[str, str] = {}
        """Fields whose typed text was refused, with the message shown under them."""
        self._shown_case: tuple[int, str] | None = None
        """The case on show, by its place in the list and its name."""
        self._loaded: dict[str, str] = {}
        """What each field last showed of the document's: the text loaded into it, or for a
        typed field the text last announced from it."""
        self._unanswered: dict[str, int] = {}
        """Typed texts announced per field that the screen has not answered yet."""
        self._controls: dict[str, Widget] = {}
        self._labels: dict[str, Label] = {}
        self._unread: dict[str, str] = {}
        """The fields no calculation reads for the shown case's kind, with the reason (shown
        disabled, the reason in their tooltip and in the kind's help line)."""
        self._case_note = ""
        self._wide = False

    # ---- building --------------------------------------------------------------------------
    def compose(self) -> ComposeResult:
        """A title per group, then a row per field: its label, long or short as the screen is
        wide or narrow, and its control.  The note line under a field is made the first time it
        has a message (few fields ever have one, and every widget costs the form time)."""
        self._wide = wide = self.app.size.width >= WIDE
        yield Static(id="case-note", markup=False)  # engine messages quote what was typed
        for number, (title, names) in enumerate(EDITOR_GROUPS):
            yield Static(title, classes="group-title" + (" -first" if number == 0 else ""))
            with FieldGroup():
                for name in names:
                    yield Label(self._label(name, wide=wide), id=f"label-{name}",
                                classes="field-label")
                    yield self._control(name)

    @staticmethod
    def _label(name: str, *, wide: bool) -> str:
        if name == BEARING_FIELD:
            return BEARING_LABEL
        spec = FIELD_BY_NAME[name]
        return spec.label if wide else spec.short_label

    def _control(self, name: str) -> Widget:
        control_id = f"field-{name}"
        tooltip = field_help(name)
        if name == BEARING_FIELD:
            return ChoiceBox([], id=control_id, compact=True, prompt="(no bearing)",
                             tooltip=tooltip)
        spec = FIELD_BY_NAME[name]
        if spec.kind == "switch":
            return TickBox(switch_words(name, False), id=control_id, compact=True,
                            tooltip=tooltip)
        if not takes_text(name):
            return ChoiceBox([(choice, choice) for choice in spec.choices], id=control_id,
                             compact=True, allow_blank=not spec.required,
                             prompt=BLANK_CHOICE, tooltip=tooltip)
        suggester = SuggestFromList(spec.choices) if spec.choices else None
        example = _example(spec)
        return FieldBox(placeholder=f"e.g. {example}" if example else "", id=control_id,
                        compact=True, tooltip=tooltip,
                        validators=[FieldValidator(name)], suggester=suggester,
                        validate_on=["changed", "submitted"])

    def on_mount(self) -> None:
        """Keep each field's control at hand (a form is loaded on every keystroke)."""
        self._controls = {name: self.query_one(f"#field-{name}") for name in FIELD_ORDER}
        self._labels = {name: self.query_one(f"#label-{name}", Label) for name in FIELD_ORDER}
        self.load()

    def on_resize(self) -> None:
        """Keep the focused field in view (the help line under the form grows and shrinks with
        what it says), and write the labels long or short when the screen crosses
        :data:`WIDE` columns."""
        name = self.focused_field()
        if name is not None:  # after the focus has brought the field into view at the old size
            self.call_after_refresh(self.scroll_to_widget, self.query_one(f"#field-{name}"),
                                    animate=False)
        wide = self.app.size.width >= WIDE
        if wide != self._wide:
            self._wide = wide
            for name, label in self._labels.items():
                label.update(self._label(name, wide=wide))

    # ---- showing the document ----------------------------------------------------------------
    def watch_view(self, view: View) -> None:
        """Show the selected case as the document holds it now."""
        self.load()

    def load(self) -> None:
        """Put the document's texts for the selected case into the fields (a field whose text
        was refused keeps it while its case stays selected)."""
        if not self._controls or self.view.revision < 0:
            return  # not mounted yet, or no view given yet: on_mount or the view loads
        document, index = self.document, self.view.selected
        case = document.case(index)
        shown = None if case is None else (index, case.name)
        if shown != self._shown_case:  # by place and name: a shaft makes its cases anew on each edit
            self._shown_case = shown
            self._notes.clear()
            self._unanswered.clear()
            self._loaded.clear()
            self.query(".field-note").set(display=False)
        texts = document.texts(index)
        bearings = [(b.name, b.name) for b in document.session.bearings]
        read_only = document.generated_problem(index)
        if case is None:
            text = "No load case selected: add one with ctrl+n."
        elif read_only:
            text = f"{read_only}. Its Bearing fields edit {case.bearing} itself."
        else:
            result = document.result(index)
            problem = None if result is None or result.derivation is not None else result.error
            text = f"⚠ {problem}" if problem else ""
        if text != self._case_note:  # an update lays the screen out again: only on a change
            self._case_note = text
            note = self.query_one("#case-note", Static)
            note.update(text)
            note.set_class(bool(text), "-shown")
        unread = {} if case is None else unread_fields(texts.get("kind", ""))
        if unread != self._unread:  # a kind changed: only then are tooltips and labels touched
            self._show_unread(unread)
        for name in FIELD_ORDER:
            control = self._controls[name]
            disabled = case is None or name in unread or (
                read_only is not None and name not in BEARING_FIELDS)
            if control.disabled != disabled:
                control.disabled = disabled
            if name in self._notes:
                continue
            with control.prevent(Input.Changed, Select.Changed, Checkbox.Changed):
                self._put(name, control, texts, bearings, case.bearing if case else None)

    def _show_unread(self, unread: dict[str, str]) -> None:
        """Mark the fields the kind's calculation does not read (their label dimmed, the reason
        in the tooltip) and say which on the help line when the kind is being chosen."""
        for name in self._unread.keys() | unread.keys():
            if (name in unread) != (name in self._unread) or unread.get(name) != \
                    self._unread.get(name):
                self._controls[name].tooltip = self.help_for(name, unread)
                self._labels[name].set_class(name in unread, "-unread")
        self._unread = unread
        if self.focused_field() == "kind":
            self.post_message(self.HelpShown(self.help_for("kind", unread)))

    def help_for(self, name: str, unread: dict[str, str] | None = None) -> str:
        """What the help line and tooltip say of field ``name``: its full words, and why it is
        not used where the kind's calculation does not read it; the kind names those fields."""
        unread = self._unread if unread is None else unread
        words = field_help(name)
        if name in unread:
            return f"{words} · {unread[name]}"
        if name == "kind" and unread:
            first = next(iter(unread.values())).partition(":")[0]  # "not used for a … bearing"
            labels = ", ".join(FIELD_BY_NAME[field].short_label for field in unread)
            return f"{words} · {first}: {labels}"
        return words

    def _put(self, name: str, control: Widget, texts: dict[str, str],
             bearings: list[tuple[str, str]], bearing: str | None) -> None:
        if isinstance(control, ChoiceBox):
            options = bearings if name == BEARING_FIELD else [
                (choice, choice) for choice in field_choices(name, texts)]
            value = bearing if name == BEARING_FIELD else texts.get(name, "")
            if [o for _, o in control._options if o is not Select.NULL] != [v for _, v in options]:
                control.set_options(options)
            self._loaded[name] = value or ""
            wanted = value if value in [v for _, v in options] else Select.NULL
            blank_ok = name == BEARING_FIELD or not FIELD_BY_NAME[name].required
            if control.value != wanted and (wanted is not Select.NULL or blank_ok):
                control.value = wanted
        elif isinstance(control, Checkbox):
            on = _switch_on(name, texts.get(name, ""))
            self._loaded[name] = "yes" if on else "no"
            if control.value != on:
                control.value = on
                control.label = switch_words(name, on)
        elif isinstance(control, Input):
            if control.value != self._loaded.get(name, control.value) or \
                    self._unanswered.get(name):
                return  # typed ahead of the screen: the newer text is on its way to it
            text = self._loaded[name] = texts.get(name, "")
            if control.value != text:
                control.value = text
                control.cursor_position = len(text)

    def answer(self, name: str, message: str | None) -> None:
        """The screen's answer to a typed text of field ``name``: the message to show under it
        (None: it was taken).  Until every typed text is answered, loading the form leaves the
        field as typed, so keys that come faster than the screen answers are never lost."""
        if self._unanswered.get(name):
            self._unanswered[name] -= 1
        self.show_note(name, message)

    def show_note(self, name: str, message: str | None) -> None:
        """Show ``message`` under field ``name`` (None: clear it)."""
        if message is None and name not in self._notes:
            return  # nothing shown: nothing to lay out again
        made = self.query(f"#note-{name}")
        if not message:
            self._notes.pop(name, None)
            made.set(display=False)
            return
        self._notes[name] = message
        if made:  # a note line made for an earlier message: shown again
            made.first(Static).update(f"✘ {message}")
            made.set(display=True)
        else:
            self.mount(FieldNote(f"✘ {message}", id=f"note-{name}", classes="field-note",
                              markup=False), after=f"#field-{name}")

    def message_for(self, name: str) -> str | None:
        """The message under field ``name`` (a refused text), or None."""
        return self._notes.get(name)

    def field_text(self, name: str) -> str:
        """What field ``name`` shows: its typed text, the chosen option ("" for none), or
        "yes"/"no" for a switch."""
        control = self.query_one(f"#field-{name}")
        if isinstance(control, Input):
            return control.value
        if isinstance(control, Checkbox):
            return "yes" if control.value else "no"
        assert isinstance(control, Select)
        return "" if control.value is Select.NULL else str(control.value)

    def drop_notes(self) -> None:
        """Forget the refused texts: every field shows the value in force again."""
        for name in list(self._notes):
            self.show_note(name, None)
        self.load()

    def focus_first(self) -> None:
        """Put the focus on the first field that takes input."""
        for name in FIELD_ORDER:
            control = self.query_one(f"#field-{name}")
            if control.focusable:
                control.focus()
                return

    def focused_field(self) -> str | None:
        """The field under the focus, if the focus is in the form."""
        focused = self.screen.focused
        if focused is not None and focused.id and focused.id.startswith("field-") and \
                self in focused.ancestors:
            return focused.id.removeprefix("field-")
        return None

    # ---- edits -----------------------------------------------------------------------------
    @staticmethod
    def _field_of(widget: Widget) -> str:
        return (widget.id or "").removeprefix("field-")

    @on(Input.Changed)
    def _typed(self, event: Input.Changed) -> None:
        event.stop()
        name = self._field_of(event.input)
        self._loaded[name] = event.value
        self._unanswered[name] = self._unanswered.get(name, 0) + 1
        self.post_message(self.Edited(name, event.value, done=False))

    @on(Input.Submitted)
    def _submitted(self, event: Input.Submitted) -> None:
        event.stop()
        self.post_message(self.TypingDone())

    @on(Input.Blurred)
    def _left(self, event: Input.Blurred) -> None:
        self.post_message(self.TypingDone())

    def _announce(self, name: str, text: str, *, done: bool) -> None:
        """Tell the screen of an edit, unless the field only shows what is in force (a choice
        settling on its value as it mounts, or a message queued before a load), or no case is
        shown (a required choice's first option, set as it mounts before any case is loaded,
        would otherwise be written into the case selected next)."""
        if self._shown_case is None:
            return
        if name in self._loaded and self._loaded[name] != text:
            self._loaded[name] = text
            self.post_message(self.Edited(name, text, done=done))

    @on(Select.Changed)
    def _chosen(self, event: Select.Changed) -> None:
        event.stop()
        value = event.select.value
        self._announce(self._field_of(event.select),
                       "" if value is Select.NULL else str(value), done=True)

    @on(Checkbox.Changed)
    def _switched(self, event: Checkbox.Changed) -> None:
        event.stop()
        event.checkbox.label = switch_words(self._field_of(event.checkbox), event.checkbox.value)
        self._announce(self._field_of(event.checkbox),
                       "yes" if event.checkbox.value else "no", done=True)

    def on_descendant_focus(self, event: DescendantFocus) -> None:
        """Say in full what the focused field is, and keep it in view."""
        name = self._field_of(event.widget)
        if name in FIELD_ORDER:
            self.post_message(self.HelpShown(self.help_for(name)))
            self.scroll_to_widget(event.widget, animate=False)
