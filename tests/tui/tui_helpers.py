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
from workbench.tui.case_editor import CaseEditor, field_id
from workbench.tui.derivation_pane import DerivationPane


def editor(app: WorkbenchApp) -> CaseEditor:
    """The case editor of the main screen."""
    return app.workbench_screen.query_one(CaseEditor)


def derivation_text(app: WorkbenchApp) -> str:
    """What the derivation pane shows, as plain text."""
    return app.workbench_screen.query_one(DerivationPane).text.plain


async def text_box(pilot: Pilot[int], app: WorkbenchApp, field: str) -> Input:
    """The text box of ``field``, once the editor has mounted it (just after the first frame)."""
    for _ in range(100):
        found = app.workbench_screen.query(f"#{field_id(field)}")
        if found:
            box = found.first()
            assert isinstance(box, Input)
            return box
        await pilot.pause()
    raise AssertionError(f"no text box for {field}")


async def retype(pilot: Pilot[int], app: WorkbenchApp, field: str, text: str) -> None:
    """Focus ``field``, clear it and type ``text`` key by key."""
    box = await text_box(pilot, app, field)
    box.focus()
    await pilot.pause()
    await pilot.press("end", "ctrl+u", *text)
    await pilot.pause()


async def paste_into(pilot: Pilot[int], app: WorkbenchApp, field: str, text: str) -> None:
    """Clear ``field`` and paste ``text`` into it as a terminal paste arrives (any characters)."""
    box = await text_box(pilot, app, field)
    box.focus()
    await pilot.pause()
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
