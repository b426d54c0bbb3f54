"""``workbench internal``: the load distribution inside one bearing, headless."""

from __future__ import annotations

import json
import math

import pytest

from workbench.cli import main

BALL = ["internal", "--kind", "deep-groove", "--elements", "9", "--dw", "12.7 mm", "--dpw", "65 mm"]


def _json(capsys: pytest.CaptureFixture[str], argv: list[str]) -> dict:
    assert main(argv + ["--json"]) == 0
    return json.loads(capsys.readouterr().out)


def test_json_keys_as_the_issue_lists(capsys: pytest.CaptureFixture[str]) -> None:
    out = _json(capsys, BALL + ["--fr", "5 kN"])
    for key in ("elements", "q_max_N", "load_zone_deg", "epsilon", "displacement", "p_max_MPa",
                "stiffness", "L10r", "L10_iso281", "steps"):
        assert key in out
    assert set(out["displacement"]) == {"radial_mm", "axial_mm", "tilt_rad"}
    assert set(out["p_max_MPa"]) == {"inner", "outer"}
    assert len(out["elements"]) == 9
    assert {"angle_deg", "load_N", "contact_angle_deg"} <= set(out["elements"][0])
    assert {"key", "formula", "substituted", "value", "unit", "source"} <= set(out["steps"][0])


def test_zero_clearance_against_stribeck(capsys: pytest.CaptureFixture[str]) -> None:
    # Stribeck: Qmax = Fr/Σ cos^(5/2) ψj over the loaded balls (Z = 9, zero clearance), and
    # the load zone is ±90° with ε = 0.5.
    out = _json(capsys, BALL + ["--fr", "5 kN"])
    cos_sum = sum(max(math.cos(2 * math.pi * j / 9), 0.0) ** 2.5 for j in range(9))
    assert out["q_max_N"] == pytest.approx(5000.0 / cos_sum, rel=1e-8)
    assert out["epsilon"] == pytest.approx(0.5, abs=1e-9)
    assert out["load_zone_deg"] == pytest.approx(90.0, abs=1e-6)


def test_pure_thrust_shares_equally(capsys: pytest.CaptureFixture[str]) -> None:
    # Pure axial load: every ball alike (symmetry); the load zone is the whole ring (ε → ∞: null).
    out = _json(capsys, ["internal", "--kind", "angular-contact", "--elements", "12", "--dw", "12.7",
                         "--dpw", "65", "--contact-angle", "40°", "--fr", "0", "--fa", "3 kN"])
    loads = [e["load_N"] for e in out["elements"]]
    assert max(loads) - min(loads) <= 1e-9 * max(loads)
    assert out["epsilon"] is None and out["load_zone_deg"] == 180.0


def test_text_output_draws_the_ring(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(BALL + ["--fr", "5 kN", "--clearance", "0.02 mm"]) == 0
    text = capsys.readouterr().out
    assert "Qmax" in text and "L10r" in text and "#" * 30 in text
    assert "Jones; Harris & Kotzalas" in text


@pytest.mark.parametrize(("extra", "flag"), [
    (["--fr", "5 kN", "--dw", "80 mm"], "--dw"),
    (["--fr", "5 kg"], "--fr"),
    (["--fr", "5 kN", "--clearance", "2 mm"], "--clearance"),
    (["--fr", "5 kN", "--rows", "2"], "--rows"),
    (["--fr", "5 kN", "--moment", "1 N·m", "--tilt", "1 mrad"], "--tilt"),
    (["--fr", "5 kN", "--lwe", "10 mm"], "--lwe"),
])
def test_bad_input_exits_2_naming_the_flag(capsys: pytest.CaptureFixture[str], extra: list[str],
                                           flag: str) -> None:
    argv = BALL + extra
    if "--dw" in extra:
        argv = argv[:5] + argv[7:]  # replace the ball diameter
    assert main(argv) == 2
    err = capsys.readouterr().err.strip()
    assert err.count("\n") == 0
    assert err.startswith(f"workbench: {flag}:")


def test_no_equilibrium_exits_2_with_the_cause(capsys: pytest.CaptureFixture[str]) -> None:
    code = main(["internal", "--kind", "cylindrical", "--elements", "14", "--dw", "11", "--dpw", "70",
                 "--lwe", "11", "--fr", "0", "--fa", "2 kN"])
    assert code == 2
    err = capsys.readouterr().err.strip()
    assert err.startswith("workbench: --fa: no equilibrium: pure thrust on a cylindrical")


def test_preloaded_pair_compares_the_rule(capsys: pytest.CaptureFixture[str]) -> None:
    out = _json(capsys, ["internal", "--kind", "tapered", "--arrangement", "face-to-face",
                         "--elements", "17", "--dw", "9", "--dpw", "66", "--lwe", "14",
                         "--contact-angle", "15°", "--preload", "1 kN", "--fr", "10 kN", "--fa", "2 kN"])
    assert {row["row"] for row in out["rows"]} == {"A", "B"}
    keys = {step["key"] for step in out["steps"]}
    assert {"Fa_rule_A", "Fa_rule_B", "delta_pre"} <= keys
