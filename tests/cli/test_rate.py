"""``workbench rate``: ratings of a special bearing from its geometry, headless."""

from __future__ import annotations

import json

import pytest

from workbench.cli import main


def test_rate_deep_groove_against_the_formula(capsys: pytest.CaptureFixture[str]) -> None:
    """ISO 281:2007 §5.1.1 (from memory): Cr = bm·fc·(i·cos α)^0.7·Z^(2/3)·Dw^1.8 for Dw ≤ 25.4 mm,
    with bm = 1.3 and fc = 59.9 at Dw·cos α/Dpw = 12.7/65 = 0.195 (REFERENCE table, 0.18–0.20)."""
    code = main(["rate", "--kind", "deep-groove", "--elements", "9", "--dw", "12.7 mm",
                 "--dpw", "65 mm", "--json"])
    out = json.loads(capsys.readouterr().out)
    assert code == 0
    assert out["results"]["C"] == pytest.approx(1.3 * 59.9 * 9 ** (2 / 3) * 12.7 ** 1.8, rel=1e-9)
    assert [s["key"] for s in out["steps"]][:2] == ["gamma", "fc"]


def test_rate_refuses_a_wrong_dimension(capsys: pytest.CaptureFixture[str]) -> None:
    code = main(["rate", "--kind", "deep-groove", "--elements", "9", "--dw", "12.7 kg",
                 "--dpw", "65 mm"])
    assert code == 2
    assert "mass" in capsys.readouterr().err
