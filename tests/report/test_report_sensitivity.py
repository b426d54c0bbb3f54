"""Reports carry each case's sensitivity, the same figures as ``calc --sensitivity``."""

from __future__ import annotations

import json

import pytest

from workbench.engine.sensitivity import sensitivity_of
from workbench.model.analysis import analyse
from workbench.model.sessionfile import demo_session_path, load_session
from workbench.report import render_report


def test_json_report_sensitivity_equals_the_engine() -> None:
    """Each case's ``sensitivity`` list is sensitivity_of() on that case's inputs."""
    session = load_session(demo_session_path())
    data = json.loads(render_report(session, "json", "demo"))
    results = analyse(session).cases
    for case_json, result in zip(data["cases"], results):
        expected = [item.as_dict() for item in sensitivity_of(result.inputs)]
        assert [i["input"] for i in case_json["sensitivity"]] == [i["input"] for i in expected]
        for got, want in zip(case_json["sensitivity"], expected):
            assert got["elasticity"] == pytest.approx(want["elasticity"], rel=1e-12)


@pytest.mark.parametrize("fmt", ["text", "markdown"])
def test_text_reports_show_the_sensitivity_table(fmt: str) -> None:
    out = render_report(load_session(demo_session_path()), fmt, "demo")
    assert "Sensitivity of Lnm" in out and "ε life" in out
