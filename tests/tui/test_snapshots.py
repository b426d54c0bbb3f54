"""Pictures of the main screen (pytest-textual-snapshot): 80×24 and 120×40, dark and light.

They complement the behavioural tests; accept an intended change with ``--snapshot-update``.
"""

from __future__ import annotations

import pytest

from tui_helpers import retype

THEMES = ("bench-night", "bench-paper")
SIZES = ((80, 24), (120, 40))


@pytest.mark.parametrize("theme", THEMES)
@pytest.mark.parametrize("size", SIZES, ids=lambda size: f"{size[0]}x{size[1]}")
def test_main_screen(snap_compare, make_app, theme: str, size: tuple[int, int]) -> None:
    async def choose_theme(pilot) -> None:
        await pilot.pause()
        pilot.app.theme = theme
        await pilot.pause()

    assert snap_compare(make_app(), terminal_size=size, run_before=choose_theme)


def test_derivation_with_a_warning(snap_compare, make_app) -> None:
    async def slow_the_shaft(pilot) -> None:
        # focusing the speed field scrolls the form to it with an animation, which a busy
        # machine had not begun before f3 took the focus away (the form then stayed at its top)
        pilot.app.animation_level = "none"
        await pilot.pause()
        await retype(pilot, pilot.app, "speed", "0")
        await pilot.press("f3")  # the cursor leaves the editor
        await pilot.app.workers.wait_for_complete()
        for _ in range(3):  # a busy machine may need more than one round to settle
            await pilot.pause()

    assert snap_compare(make_app(), terminal_size=(80, 24), run_before=slow_the_shaft)
