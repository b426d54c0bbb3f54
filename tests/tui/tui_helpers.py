"""Small helpers shared by the screen tests."""

from __future__ import annotations

from textual import events
from textual.pilot import Pilot
from textual.widgets import Input

from workbench.engine.derive import derive
from workbench.engine.record import Derivation
from workbench.model.fields import inputs_from_texts
from workbench.model.session import case_texts
from workbench.tui.app import WorkbenchApp
from workbench.tui.case_editor import TEXT_BOX_ID, CaseEditor
from workbench.tui.derivation_pane import DerivationPane


def editor(app: WorkbenchApp) -> CaseEditor:
    """The case editor of the main screen."""
    return app.workbench_screen.query_one(CaseEditor)


def derivation_text(app: WorkbenchApp) -> str:
    """What the derivation pane shows, as plain text."""
    return app.workbench_screen.query_one(DerivationPane).text.plain


async def mounted_text_box(pilot: Pilot[int], app: WorkbenchApp) -> Input:
    """The editor's text box, once it is mounted (just after the first frame)."""
    for _ in range(100):
        found = app.workbench_screen.query(f"#{TEXT_BOX_ID}")
        if found:
            box = found.first()
            assert isinstance(box, Input)
            return box
        await pilot.pause()
    raise AssertionError("the editor's text box was never mounted")


async def text_box(pilot: Pilot[int], app: WorkbenchApp, field: str) -> Input:
    """The text box, put on ``field`` (a typed field) with the focus."""
    box = await mounted_text_box(pilot, app)
    editor(app).focus_field(field)
    await pilot.pause()
    assert box.has_focus and editor(app).focused_field() == field, field
    return box


async def retype(pilot: Pilot[int], app: WorkbenchApp, field: str, text: str) -> None:
    """Put the cursor on ``field``, clear it and type ``text`` key by key."""
    await text_box(pilot, app, field)
    await pilot.press("end", "ctrl+u", *text)
    await pilot.pause()


async def choose(pilot: Pilot[int], app: WorkbenchApp, field: str) -> None:
    """Put the cursor on the choice or switch ``field``, the focus in the editor."""
    await mounted_text_box(pilot, app)
    editor(app).focus_field(field)
    await pilot.pause()
    assert editor(app).focused_field() == field, field


async def paste_into(pilot: Pilot[int], app: WorkbenchApp, field: str, text: str) -> None:
    """Clear ``field`` and paste ``text`` into it as a terminal paste arrives (any characters)."""
    box = await text_box(pilot, app, field)
    await pilot.press("end", "ctrl+u")
    box.post_message(events.Paste(text))
    await pilot.pause()


def reference_derivation(app: WorkbenchApp) -> Derivation:
    """The engine's derivation of the selected case, straight from the session's texts."""
    state = app.workbench
    assert state.case is not None
    texts = case_texts(state.session, state.case)
    values = dict(texts)
    if state.session.targets.s0 and not values.get("s0_min"):
        values["s0_min"] = state.session.targets.s0
    return derive(inputs_from_texts(values))
