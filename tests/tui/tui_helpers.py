"""Small helpers shared by the screen tests: widgets found by id, the document's state."""

from __future__ import annotations

from textual import events
from textual.pilot import Pilot
from textual.widgets import Input

from workbench.engine.derive import derive
from workbench.engine.record import Derivation
from workbench.model.fields import inputs_from_texts
from workbench.model.session import CaseResult, LoadCase
from workbench.tui.app import WorkbenchApp
from workbench.tui.case_form import CaseForm
from workbench.tui.derivation_pane import DerivationPane
from workbench.tui.report_screen import ReportScreen


def editor(app: WorkbenchApp) -> CaseForm:
    """The case form of the main screen."""
    return app.workbench_screen.query_one(CaseForm)


def selected(app: WorkbenchApp) -> int:
    """The index of the selected case."""
    return app.workbench_screen.selected


def selected_case(app: WorkbenchApp) -> LoadCase | None:
    """The selected load case."""
    return app.document.case(selected(app))


def selected_result(app: WorkbenchApp) -> CaseResult | None:
    """The selected case evaluated (without its steps)."""
    return app.document.result(selected(app))


def derivation_text(app: WorkbenchApp) -> str:
    """What the derivation pane shows, as plain text."""
    return app.workbench_screen.query_one(DerivationPane).text.plain


async def text_box(pilot: Pilot[int], app: WorkbenchApp, field: str) -> Input:
    """The text box of a typed ``field``, with the focus."""
    box = app.workbench_screen.query_one(f"#field-{field}", Input)
    box.focus()
    await pilot.pause()
    assert box.has_focus, field
    return box


async def retype(pilot: Pilot[int], app: WorkbenchApp, field: str, text: str) -> None:
    """Put the focus on ``field``, clear it and type ``text`` key by key."""
    await text_box(pilot, app, field)
    await pilot.press("end", "ctrl+u", *text)
    await pilot.pause()


async def choose(pilot: Pilot[int], app: WorkbenchApp, field: str) -> None:
    """Put the focus on the choice or switch ``field``."""
    app.workbench_screen.query_one(f"#field-{field}").focus()
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
    document = app.document
    case = selected_case(app)
    assert case is not None
    texts = document.texts(selected(app))
    values = dict(texts)
    if document.session.targets.s0 and not values.get("s0_min"):
        values["s0_min"] = document.session.targets.s0
    return derive(inputs_from_texts(values))


async def write_report(pilot: Pilot[int], app: WorkbenchApp, path: object, fmt: str, *,
                       rounds: int = 200) -> None:
    """Write the report in ``fmt`` to ``path`` from the report screen (alt+r), and wait while
    its worker writes it (at most ``rounds`` pauses; a large session needs more)."""
    await pilot.press("alt+r")
    await pilot.pause()
    screen = app.screen
    assert isinstance(screen, ReportScreen)
    screen.query_one("#report-format").value = fmt  # type: ignore[attr-defined]
    await pilot.pause()
    screen.query_one("#report-path", Input).value = str(path)
    await pilot.press("enter")
    for _ in range(rounds):
        await app.workers.wait_for_complete()
        await pilot.pause()
        if not isinstance(app.screen, ReportScreen):
            return
    raise AssertionError(str(screen.query_one("#report-message").render()))
