"""The case editor: every input of the selected load case, grouped, as the person typed it.

The editor never writes to the session itself: each edit is announced with
:class:`CaseEditor.Changed` (field name and text) and the screen answers with
:meth:`CaseEditor.reject` or :meth:`CaseEditor.accept`.  A rejected text stays in its field with
the message under it while the last valid value stays in force.

The whole form is one painted widget, a :class:`FieldSheet`: group titles, a line per field
(label and text) and the message lines.  One cursor moves over the fields (up/down, tab, a
click).  On a typed field a single text box sits over the field's line and takes the keys; on a
fixed choice left/right step through the choices and enter opens them as a list; a switch
flips with space.  A widget per field (about forty, each with its own message queue and styles)
took a quarter of the workbench's start-up; this draws the same screen with two.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from typing import Literal

from textual import events, on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import VerticalScroll
from textual.content import Content
from textual.geometry import Region, Size
from textual.message import Message
from textual.suggester import SuggestFromList
from textual.widget import Widget
from textual.widgets import Input

from ..model.fields import FIELD_BY_NAME, FieldError, FieldSpec, parse_field
from ..model.quantities import QUANTITIES
from .choice_field import open_choice_list, step_choice
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
BEARING_FIELD = "bearing"
BEARING_LABEL = "Bearing used"
"""The editor's own row choosing the case's bearing (not an input of the case)."""
FIELD_ORDER: tuple[str, ...] = (BEARING_FIELD,
                                *(name for _, names in EDITOR_GROUPS for name in names))
NUDGEABLE_KINDS = ("quantity", "number", "fraction")
SWITCH_TEXT = {True: "yes", False: "no"}
SWITCH_NOTE = {"outer_ring_rotates": "V = 1.2"}
LABEL_WIDTH = 20
EMPTY_NOTE = "No load case selected: add one with ctrl+n."
TEXT_BOX_ID = "field-box"
TITLE_STYLE = "bold $text-primary on $boost"
TEXT_STYLE = "$foreground"
HINT_STYLE = "$text-disabled"
CURSOR_STYLE = "$block-cursor-foreground on $block-cursor-background"
LABEL_CURSOR_STYLE = "bold $text"
MESSAGE_STYLE = {"-rejected": "$text-error on $error-muted",
                 "-case-error": "$text-warning on $warning-muted"}
"""The colours of the form's parts, after the styles of Textual's own fields."""

Line = tuple[Literal["gap", "title", "field", "message", "note"], str]
"""One row of the form: what it is, and the group title, field name or note it shows."""
SheetRow = tuple[Content, Content | None, str, bool]
"""A row as the sheet paints it: the label (or the whole text of a title, message or note),
the value after the label column (None: a whole-line row), the style under the row, and
whether a whole-line row too long for the width wraps (a message) or is cut (a title)."""


def _placeholder(spec: FieldSpec) -> str:
    if spec.hint:
        return spec.hint
    if spec.kind == "quantity" and spec.quantity in QUANTITIES:
        return "e.g. " + QUANTITIES[spec.quantity].example
    return ""


def takes_text(name: str) -> bool:
    """Numbers, quantities and the cleanliness level (which also takes an eC number) are typed;
    fixed choices, switches and the bearing are chosen."""
    if name == BEARING_FIELD:
        return False
    spec = FIELD_BY_NAME[name]
    return spec.kind not in ("switch", "choice") or name == "cleanliness"


def _switch_on(name: str, text: str) -> bool:
    try:
        return bool(parse_field(name, text))
    except FieldError:
        return False


class FieldSheet(Widget, can_focus=True):
    """The painted form: the rows the editor gives it, a long message wrapped to the width.

    Its one child is the text box, which it keeps over the row ``box_row``.  It says which row
    was clicked or is under the pointer."""

    DEFAULT_CSS = f"""
    FieldSheet {{
        width: 1fr;
        height: auto;
        color: $text-muted;
        & > Input {{
            margin-left: {LABEL_WIDTH};
            width: 1fr;
        }}
    }}
    """
    MESSAGE_INDENT = 5
    """Columns before a message's text (three spaces and the mark)."""

    class Clicked(Message):
        """Row ``row`` was clicked at column ``x``."""

        def __init__(self, row: int, x: int) -> None:
            super().__init__()
            self.row = row
            self.x = x

    class Hovered(Message):
        """The pointer is over row ``row``."""

        def __init__(self, row: int) -> None:
            super().__init__()
            self.row = row

    def __init__(self, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self._rows: list[SheetRow] = []
        self._box_row = 0
        self._wrapped: tuple[int, list[tuple[int, Content]]] = (-1, [])

    def show(self, rows: list[SheetRow], box_row: int) -> None:
        """Paint ``rows``, the text box over row ``box_row``."""
        self._rows = rows
        self._box_row = box_row
        self._wrapped = (-1, [])
        self.refresh(layout=True)
        self._place_box()

    def _lines(self, width: int) -> list[tuple[int, Content]]:
        """(row, line) for every painted line at ``width``: a whole-line row is wrapped."""
        if self._wrapped[0] == width:
            return self._wrapped[1]
        lines: list[tuple[int, Content]] = []
        for index, (text, _, _, wraps) in enumerate(self._rows):
            if not wraps or text.cell_length <= width or width <= self.MESSAGE_INDENT:
                lines.append((index, text))
                continue
            head, body = text[:self.MESSAGE_INDENT], text[self.MESSAGE_INDENT:]
            for number, part in enumerate(body.wrap(width - self.MESSAGE_INDENT)):
                lead = head if number == 0 else Content(" " * self.MESSAGE_INDENT)
                lines.append((index, lead + part))
        self._wrapped = (width, lines)
        return lines

    def line_of(self, row: int) -> int:
        """The first line of row ``row`` at the present width."""
        for line, (index, _) in enumerate(self._lines(self.content_region.width)):
            if index >= row:
                return line
        return 0

    def _row_at(self, y: int) -> int | None:
        lines = self._lines(self.content_region.width)
        return lines[y][0] if 0 <= y < len(lines) else None

    @property
    def text(self) -> str:
        """What the sheet shows, as plain text (a line each)."""
        return "\n".join(line.rstrip() for line in self.render().plain.split("\n"))

    def get_content_height(self, container: Size, viewport: Size, width: int) -> int:
        """One line per row, and more for a wrapped message."""
        return len(self._lines(width))

    def render(self) -> Content:
        """Every line at the width: the label column, then the value on its colour."""
        width = self.content_region.width
        room = max(0, width - LABEL_WIDTH)
        painted = []
        for index, line in self._lines(width):
            _, value, style, _ = self._rows[index]
            if value is None:
                painted.append(line.truncate(width, pad=True).stylize_before(style))
            else:
                painted.append(Content.assemble(
                    line.truncate(LABEL_WIDTH, pad=True),
                    value.truncate(room, pad=True).stylize_before(style)))
        return Content("\n").join(painted)

    def on_resize(self) -> None:
        """Keep the text box on its row when messages wrap anew."""
        self._place_box()

    def _place_box(self) -> None:
        for child in self.children:
            child.styles.offset = (0, self.line_of(self._box_row))

    def on_click(self, event: events.Click) -> None:
        """Say which row was clicked."""
        row = self._row_at(event.y)
        if row is not None:
            self.post_message(self.Clicked(row, event.x))

    def on_mouse_move(self, event: events.MouseMove) -> None:
        """Say which row the pointer is over (for its tooltip)."""
        row = self._row_at(event.y)
        if row is not None:
            self.post_message(self.Hovered(row))


class FieldBox(Input):
    """The editor's text box, whose own editing keys (backspace, ctrl+u, the arrows …) act in
    the order they arrive among the characters typed.

    Textual inserts a typed character at once but sends a bound key up to the app first, so in a
    burst of keys (a slow SSH link delivers them so) the characters behind a bound key went in
    before it acted: ctrl+u then 7 left the field empty (Textualize/textual#6605, open).  Here
    the box's own non-priority bindings run as the key arrives, as the fix proposed upstream
    (#6631) does; drop this class when Textual does it itself."""

    async def _on_key(self, event: events.Key) -> None:
        for binding in self._bindings.key_to_bindings.get(event.key, ()):
            if not binding.priority and await self.app.run_action(binding.action, self):
                event.stop()
                event.prevent_default()
                return
        await super()._on_key(event)


class CaseEditor(VerticalScroll, can_focus=False):
    """The inputs of one load case, grouped as an engineer reads them."""

    BINDINGS = [
        Binding("down", "move(1)", "Next field", show=False),
        Binding("up", "move(-1)", "Previous field", show=False),
        Binding("tab", "leave_or_move(1)", "Next field", show=False),
        Binding("shift+tab", "leave_or_move(-1)", "Previous field", show=False),
        Binding("pagedown", "move_page(1)", "Page down", show=False),
        Binding("pageup", "move_page(-1)", "Page up", show=False),
        Binding("home", "move_to_end(-1)", "First field", show=False),
        Binding("end", "move_to_end(1)", "Last field", show=False),
        Binding("right", "step(1)", "Next choice", show=False),
        Binding("left", "step(-1)", "Previous choice", show=False),
        Binding("enter,space", "open", "Choose", show=False),
    ]

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
        """Typing in a field ended (enter, or the cursor or the focus moved on)."""

    class BearingChosen(Message):
        """The case should use the bearing called ``name``."""

        def __init__(self, name: str) -> None:
            super().__init__()
            self.name = name

    def __init__(self, *, id: str | None = None) -> None:
        super().__init__(id=id)
        self.token = 0
        """Which case is loaded; the screen ignores edits announced for another one."""
        self._texts: dict[str, str] = {}
        self._empty = True
        self._bearings: tuple[str, ...] = ()
        self._bearing: str | None = None
        self._bearing_title = "Bearing"
        self._rejected: dict[str, str] = {}
        self._case_error: tuple[str, str] | None = None
        self._current = EDITOR_GROUPS[0][1][0]
        self._layout: list[Line] = []
        self._sheet = FieldSheet(id="field-sheet")
        self._box: Input | None = None
        """The text box, mounted just after the first frame (None until then)."""
        self._box_field: str | None = None
        """The field whose text the box holds.  While it holds it, the box is that text's
        keeper: keys may arrive faster than the screen answers each edit, and the box must
        never be handed back a text it has moved on from."""
        self._nudging = False

    def compose(self) -> ComposeResult:
        """The sheet (its text box comes after the first frame)."""
        yield self._sheet

    def on_mount(self) -> None:
        """Draw the (empty) sheet; mount the text box once the first frame is painted."""
        self._redraw()
        self.call_after_refresh(self._mount_box)

    async def _mount_box(self) -> None:
        box = FieldBox(compact=True, id=TEXT_BOX_ID, select_on_focus=False)
        box.display = False
        await self._sheet.mount(box)
        self._box = box
        self._place_box()

    # ---- what the screen tells the editor ---------------------------------------------------
    def load(self, texts: Mapping[str, str], bearings: Sequence[str], bearing: str | None,
             bearing_users: int = 1) -> None:
        """Show a case's texts (empty ``texts``: no case) without announcing them as edits."""
        self._rejected.clear()
        self._empty = not texts
        self._texts = {name: texts.get(name, "") for name in FIELD_BY_NAME}
        self._box_field = None  # the box takes the loaded text
        self._bearings = tuple(bearings)
        self._bearing = bearing if bearing in self._bearings else None
        title = f"Bearing {bearing}" if bearing else "Bearing"
        if bearing_users > 1:
            title += f" (shared by {bearing_users} cases)"
        self._bearing_title = title
        self._redraw()

    def reject(self, field: str, message: str) -> None:
        """Show why the text typed in ``field`` was not taken."""
        self._rejected[field] = message
        self._redraw()

    def accept(self, field: str) -> None:
        """The text typed in ``field`` was taken: clear its message."""
        if self._rejected.pop(field, None) is not None:
            self._redraw()

    def show_case_error(self, field: str | None, message: str | None) -> None:
        """Show the case's own error (the engine's refusal) beside the field it names."""
        error = (field, message) if field and message else None
        if error != self._case_error:
            self._case_error = error
            self._redraw()

    def message_for(self, field: str) -> str | None:
        """The message shown beside ``field`` (a rejected text's, else the case's), or None."""
        if field in self._rejected:
            return self._rejected[field]
        if self._case_error and self._case_error[0] == field:
            return self._case_error[1]
        return None

    def field_text(self, field: str) -> str:
        """What the field shows now, as text (a switch as yes/no, a blank choice as "")."""
        if field == self._current and self._box is not None and self._box.display:
            return self._box.value
        text = self._texts.get(field, "")
        spec = FIELD_BY_NAME[field]
        if spec.kind == "switch":
            return SWITCH_TEXT[_switch_on(field, text)]
        if not takes_text(field):
            return text.strip() if text.strip() in spec.choices else ""
        return text

    @property
    def sheet_text(self) -> str:
        """What the sheet shows, as plain text (the text box's line as the sheet draws it)."""
        return self._sheet.text

    def focused_field(self) -> str | None:
        """The field the cursor is on while the editor has the focus, or None."""
        if self._empty or not self._has_focus():
            return None
        return None if self._current == BEARING_FIELD else self._current

    def focus_field(self, field: str) -> None:
        """Put the cursor on ``field`` and the focus in the editor."""
        self._move_to(field)
        self._focus_current()

    def focus_first(self) -> None:
        """Focus the first field (or the editor itself when there is no case)."""
        if self._empty:
            self._sheet.focus()
        else:
            self.focus_field(EDITOR_GROUPS[0][1][0])

    def nudge(self, factor: float) -> str | None:
        """Scale the number in the focused field by ``factor``, keeping its unit; a message
        when there is no numeric field in focus or nothing to scale."""
        name = self.focused_field()
        box = self._box
        if (name is None or FIELD_BY_NAME[name].kind not in NUDGEABLE_KINDS or box is None
                or not box.display):
            return "put the cursor in a numeric field to nudge it"
        scaled = scale_text(box.value, factor)
        if scaled is None:
            return f"{FIELD_BY_NAME[name].label}: no number to nudge"
        self._nudging = True
        try:
            box.value = scaled
        finally:
            self._nudging = False
        box.cursor_position = len(scaled)
        return None

    # ---- drawing ----------------------------------------------------------------------------
    def _lines(self) -> list[Line]:
        """What the sheet shows, top to bottom."""
        if self._empty:
            return [("gap", ""), ("note", EMPTY_NOTE)]
        messages = self._messages()
        lines: list[Line] = []
        for title, names in EDITOR_GROUPS:
            lines += [("gap", ""), ("title", title)]
            for name in (BEARING_FIELD, *names) if title == "Bearing" else names:
                lines.append(("field", name))
                if name in messages:
                    lines.append(("message", name))
        return lines

    def _messages(self) -> dict[str, tuple[str, str]]:
        """The message under each field that has one: (text, kind)."""
        shown = {name: (text, "-rejected") for name, text in self._rejected.items()}
        if self._case_error and self._case_error[0] not in shown:
            if self._case_error[0] in FIELD_BY_NAME:  # else an input the editor has no field for
                shown[self._case_error[0]] = (self._case_error[1], "-case-error")
        return shown

    def _redraw(self) -> None:
        """Lay the form out again and paint it, the text box over the current field."""
        self._layout = self._lines()
        messages = self._messages()
        focused = self._has_focus()
        rows = [self._paint(line, messages, focused) for line in self._layout]
        self._sheet.show(rows, self._row_of(self._current))
        self._place_box()

    def _paint(self, line: Line, messages: Mapping[str, tuple[str, str]],
               focused: bool) -> SheetRow:
        kind, what = line
        if kind == "gap":
            return (Content(""), None, "", False)
        if kind == "note":
            return (Content(" " + what), None, "", True)
        if kind == "title":
            return (Content(" " + (self._bearing_title if what == "Bearing" else what)), None,
                    TITLE_STYLE, False)
        if kind == "message":
            text, message_kind = messages[what]
            mark = "✘ " if message_kind == "-rejected" else "⚠ "
            return (Content("   " + mark + text), None, MESSAGE_STYLE[message_kind], True)
        return self._paint_field(what, focused and what == self._current)

    def _paint_field(self, name: str, cursor: bool) -> SheetRow:
        """A field's row: its label, then its text (the hint, dim, when blank) on the field
        colour as the text box draws them; a choice with its mark, a switch with its box."""
        label = Content(f"{'▸' if cursor else ' '}{self._label(name)[:LABEL_WIDTH - 2]}")
        if cursor:
            label = label.stylize(LABEL_CURSOR_STYLE)
        if takes_text(name):
            text = self._texts.get(name, "")
            shown = (Content.styled(text, TEXT_STYLE) if text
                     else Content.styled(_placeholder(FIELD_BY_NAME[name]), HINT_STYLE))
            return (label, shown, "on $surface", False)
        style = CURSOR_STYLE if cursor else f"{TEXT_STYLE} on $surface"
        if self._is_switch(name):
            on_now = _switch_on(name, self._texts.get(name, ""))
            note = SWITCH_NOTE.get(name, "")
            return (label, Content(f"[{'x' if on_now else ' '}] {SWITCH_TEXT[on_now]}"
                                   + (f"  {note}" if note else "")), style, False)
        value = self._choice_value(name)
        shown = Content(value) if value is not None else Content.styled(
            self._choice_prompt(name), "dim")
        return (label, shown + " ▾", style, False)

    def _place_box(self) -> None:
        """Show the text box on the current field when that field is typed, with its text."""
        box = self._box
        if box is None:
            return
        name = self._current
        typed = not self._empty and takes_text(name)
        if typed and self._box_field != name:
            spec = FIELD_BY_NAME[name]
            box.placeholder = _placeholder(spec)
            box.suggester = SuggestFromList(spec.choices) if spec.choices else None
            box.tooltip = spec.hint or None
            text = self._texts.get(name, "")
            with box.prevent(Input.Changed):
                box.value = text
                box.cursor_position = len(text)
        elif not typed and box.has_focus:
            self._sheet.focus(scroll_visible=False)
        self._box_field = name if typed else None
        box.display = typed

    def _row_of(self, name: str) -> int:
        return self._layout.index(("field", name)) if ("field", name) in self._layout else 0

    # ---- the cursor -------------------------------------------------------------------------
    def _has_focus(self) -> bool:
        focused = self.screen.focused if self.is_attached else None
        return focused is not None and (focused is self._sheet or focused is self._box)

    def _move_to(self, name: str) -> None:
        """Put the cursor on ``name``: the edit run in the field left ends there."""
        if name == self._current:
            return
        box = self._box
        if box is not None and self._box_field == self._current:
            self._texts[self._current] = box.value  # the sheet shows what the box held
        if box is not None and box.has_focus:
            self.post_message(self.Done())
        self._current = name
        self._redraw()
        self._scroll_to_cursor()

    def _scroll_to_cursor(self) -> None:
        """Scroll so the cursor's field shows, with a line of context each side."""
        line = self._sheet.line_of(self._row_of(self._current))
        self.scroll_to_region(Region(0, max(0, line - 1), 1, 3), animate=False)

    def _focus_current(self) -> None:
        """Give the focus to the text box on a typed field, else to the sheet (without Textual
        scrolling the sheet's top into view, as it does for a widget given the focus)."""
        box = self._box
        if box is not None and box.display:
            box.focus(scroll_visible=False)
        else:
            self._sheet.focus(scroll_visible=False)
        self._scroll_to_cursor()

    def action_move(self, delta: int) -> None:
        """Move the cursor to the next (or previous) field."""
        if self._empty:
            return
        index = FIELD_ORDER.index(self._current) + delta
        self._move_to(FIELD_ORDER[max(0, min(len(FIELD_ORDER) - 1, index))])
        self._focus_current()

    def action_leave_or_move(self, delta: int) -> None:
        """Tab: the next field, or on from the last field to the next pane (shift+tab: back)."""
        index = FIELD_ORDER.index(self._current) + delta
        if self._empty or not 0 <= index < len(FIELD_ORDER):
            chain = self.screen.focus_chain
            inside = [i for i, widget in enumerate(chain) if widget in (self._sheet, self._box)]
            if inside and len(chain) > len(inside):
                target = (inside[-1] + 1) if delta > 0 else (inside[0] - 1)
                chain[target % len(chain)].focus()
            return
        self.action_move(delta)

    def action_move_page(self, delta: int) -> None:
        """Move the cursor by about a screenful of fields."""
        self.action_move(delta * max(1, self.scrollable_content_region.height - 2))

    def action_move_to_end(self, delta: int) -> None:
        """Move the cursor to the first (or last) field."""
        self.action_move(delta * len(FIELD_ORDER))

    # ---- choices and switches ---------------------------------------------------------------
    def _choice_value(self, name: str) -> str | None:
        if name == BEARING_FIELD:
            return self._bearing
        text = self._texts.get(name, "").strip()
        return text if text in FIELD_BY_NAME[name].choices else None

    def _choice_prompt(self, name: str) -> str:
        return "(none)" if name == BEARING_FIELD else "(default)"

    def _offered(self, name: str) -> list[str | None]:
        if name == BEARING_FIELD:
            return list(self._bearings)
        spec = FIELD_BY_NAME[name]
        return ([] if spec.required else [None]) + list(spec.choices)

    def _choose(self, name: str, value: str | None) -> None:
        """Take ``value`` for the choice (or switch) ``name`` and announce it."""
        if name == BEARING_FIELD:
            if value is not None and value != self._bearing:
                self._bearing = value
                self._redraw()
                self.post_message(self.BearingChosen(value))
            return
        self._texts[name] = value or ""
        self._redraw()
        self.post_message(self.Changed(name, value or "", self.token, True))

    def _flip(self, name: str) -> None:
        on_now = _switch_on(name, self._texts.get(name, ""))
        self._choose(name, SWITCH_TEXT[not on_now])

    def _is_switch(self, name: str) -> bool:
        return name != BEARING_FIELD and FIELD_BY_NAME[name].kind == "switch"

    def _choice_under_cursor(self) -> str | None:
        """The choice under the cursor; None when the cursor is on a typed field or a switch
        (a switch is flipped here: every key that acts on a choice flips it)."""
        name = self._current
        if self._empty or takes_text(name):
            return None
        if self._is_switch(name):
            self._flip(name)
            return None
        return name

    def action_step(self, delta: int) -> None:
        """Left/right on a choice: the previous or next choice in place; on a switch: flip."""
        name = self._choice_under_cursor()
        offered = self._offered(name) if name is not None else []
        if name is not None and offered:
            self._choose(name, step_choice(offered, self._choice_value(name), delta))

    def action_open(self) -> None:
        """Enter or space on a choice: its list; on a switch: flip."""
        name = self._choice_under_cursor()
        if name is None:
            return
        offered = self._offered(name)
        choices = [value for value in offered if value is not None]
        blank = self._choice_prompt(name) if None in offered else None
        open_choice_list(self.app, self._label(name), choices, self._choice_value(name), blank,
                         lambda value: self._choose(name, value))

    def _label(self, name: str) -> str:
        return BEARING_LABEL if name == BEARING_FIELD else FIELD_BY_NAME[name].label

    # ---- what the person does ---------------------------------------------------------------
    def on_descendant_focus(self, event: events.DescendantFocus) -> None:
        """Focus on the sheet goes on to the text box when the cursor is on a typed field;
        the cursor mark is drawn while the editor has the focus."""
        if event.widget is self._sheet and self._box is not None and self._box.display:
            self._box.focus(scroll_visible=False)
        self._redraw()
        self.call_after_refresh(self._scroll_to_cursor)  # after the scroll a focus change asks

    def on_descendant_blur(self) -> None:
        """Redraw without the cursor mark once the focus has left the editor (a move between
        the sheet and the box is redrawn by the focus that follows)."""
        self.call_after_refresh(self._redraw_if_left)

    def _redraw_if_left(self) -> None:
        if not self._has_focus():
            self._redraw()

    @on(FieldSheet.Clicked)
    def _clicked(self, event: FieldSheet.Clicked) -> None:
        event.stop()
        if self._empty or not 0 <= event.row < len(self._layout):
            self._sheet.focus()
            return
        kind, name = self._layout[event.row]
        if kind != "field":
            return
        self._move_to(name)
        self._focus_current()
        if not takes_text(name) and event.x >= LABEL_WIDTH:
            self.action_open()

    @on(FieldSheet.Hovered)
    def _hovered(self, event: FieldSheet.Hovered) -> None:
        event.stop()
        hint = None
        if not self._empty and 0 <= event.row < len(self._layout):
            kind, name = self._layout[event.row]
            if kind == "field" and name in FIELD_BY_NAME:
                hint = FIELD_BY_NAME[name].hint or None
        if self._sheet.tooltip != hint:
            self._sheet.tooltip = hint

    @on(Input.Changed, f"#{TEXT_BOX_ID}")
    def _typed(self, event: Input.Changed) -> None:
        event.stop()
        name = self._current
        if self._empty or not takes_text(name):
            return
        self._texts[name] = event.value
        self.post_message(self.Changed(name, event.value, self.token, self._nudging))

    @on(Input.Submitted, f"#{TEXT_BOX_ID}")
    @on(Input.Blurred, f"#{TEXT_BOX_ID}")
    def _typing_done(self, event: Input.Submitted | Input.Blurred) -> None:
        event.stop()
        self.post_message(self.Done())
