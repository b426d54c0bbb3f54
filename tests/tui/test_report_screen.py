"""Writing the report from the screen: the html file it writes carries the session's numbers."""

from __future__ import annotations

import html
import json


from tui_helpers import write_report



async def test_json_and_html_reports_from_the_screen(make_app, tmp_path) -> None:
    app = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await write_report(pilot, app, tmp_path / "rig.json", "json")
        written = json.loads((tmp_path / "rig.json").read_text(encoding="utf-8"))
        p = app.document.result(0).derivation.results["P"]
        case = next(c for c in written["cases"] if c["name"] == "Steady run")
        assert case["results"]["P"] == p  # the engine's number, as the screen shows it
        assert "generated_at" in written["meta"]
        await write_report(pilot, app, tmp_path / "rig.html", "html")
        page = (tmp_path / "rig.html").read_text(encoding="utf-8")
        assert "<svg" in page and html.escape("Test-rig gearbox") in page
