"""README's newcomer walkthrough, pressed key by key, and its report against closed forms.

The keys are read from README.md (between its walkthrough markers), so the README says what
works: from ``workbench gearbox.toml`` (a new, empty session) to a saved session and its html and
json reports, keyboard only, at 80×24.  The report's numbers are then checked against forms
worked here from the walkthrough's invented inputs, never from the engine:

- helical gear forces: T = P/ω, Ft = 2T/d, Fr = Ft·tan αn/cos β, Fa = Ft·tan β;
- two-bearing shaft statics: the reactions by moments about each bearing, in two planes;
- ISO 281:2007 basic rating life L10 = (C/P)^p (p = 3 ball, 10/3 roller) with P = X·Fr + Y·Fa,
  X, Y and e from ISO 281 Table 3 (deep-groove rows typed below) and P = Fr for a cylindrical
  roller bearing (α = 0, §7.2);
- Palmgren–Miner over the two states: 1/L = Σ ui/Li with revolution shares ui = ti·ni/Σ tj·nj;
- the series system life of the two bearings (two-parameter Weibull, a common slope).
"""

from __future__ import annotations

import hashlib
import json
import math
import re
from pathlib import Path

import pytest

from workbench.tui.app import WorkbenchApp, app_for

README = Path(__file__).resolve().parents[2] / "README.md"
START = "<!-- walkthrough:"
END = "<!-- end of walkthrough -->"
ARROWS = {"↓": "down", "↑": "up", "←": "left", "→": "right", "esc": "escape"}
KEY_NAME = re.compile(r"[a-z]|f\d{1,2}|enter|escape|tab|down|up|left|right|"
                      r"(?:(?:ctrl|alt|shift)\+)+[a-z0-9]+")

# ---- the walkthrough's invented inputs (README) ------------------------------------------------
SESSION_NAME = "gearbox.toml"
LIFE_TARGET_H = 30000.0
X_A, X_B = 0.0, 200.0           # bearing positions, mm (the new shaft's own)
X_GEAR, PITCH_D = 70.0, 80.0    # the pinion's position and pitch diameter, mm
ALPHA_N, BETA = 20.0, 15.0      # normal pressure angle and helix angle, degrees (the new gear's)
STATES = (("full load", 15e3, 1000.0, 0.7), ("part load", 6e3, 1450.0, 0.3))  # W, r/min, time
C_A, C0_A = 40e3, 38e3          # free end A: cylindrical roller bearing, N
C_B, C0_B = 30e3, 18e3          # locating end B: deep-groove ball bearing, N

# ISO 281:2007 Table 3, single-row deep-groove ball bearings, read by Fa/C0r (the printed
# column; from memory): e and Y for Fa/Fr > e, where X = 0.56; linear interpolation between rows.
TABLE3_FA_C0 = (0.014, 0.028, 0.056, 0.084, 0.11, 0.17, 0.28, 0.42, 0.56)
TABLE3_E = (0.19, 0.22, 0.26, 0.28, 0.30, 0.34, 0.38, 0.42, 0.44)
TABLE3_Y = (2.30, 1.99, 1.71, 1.55, 1.45, 1.31, 1.15, 1.04, 1.00)
TABLE3_X = 0.56
# Weibull slope of a mixed ball/roller pair for the series system life: 10/9, the smaller of the
# commonly used 10/9 (ball) and 9/8 (roller) (from memory)
SYSTEM_SLOPE = 10 / 9


def walkthrough_steps(readme: str) -> list[tuple[str, str]]:
    """("key", name) and ("type", text) in the order README gives them: `k` is a key (×N
    repeats it), type `text` types text."""
    block = readme[readme.index(START):readme.index(END)]
    steps: list[tuple[str, str]] = []
    for match in re.finditer(r"(type\s+)?`([^`]+)`(?:×(\d+))?", block):
        typed, text, times = match.group(1), match.group(2), match.group(3)
        if typed:
            steps.append(("type", text))
            continue
        key = ARROWS.get(text, text)
        assert KEY_NAME.fullmatch(key), f"README names {text!r}, which is not a key"
        steps.extend([("key", key)] * int(times or 1))
    return steps


def interpolate(x: float, xs: tuple[float, ...], ys: tuple[float, ...]) -> float:
    """Linear interpolation in a table (ISO 281 Table 3 allows it), x inside the table."""
    for k in range(len(xs) - 1):
        if xs[k] <= x <= xs[k + 1]:
            return ys[k] + (ys[k + 1] - ys[k]) * (x - xs[k]) / (xs[k + 1] - xs[k])
    raise AssertionError(f"{x} outside the table")


def expected_state(power_w: float, speed: float) -> dict[str, float]:
    """One state worked by hand: gear forces, reactions, P and L10 of both bearings."""
    torque = power_w / (2 * math.pi * speed / 60)                      # T = P/ω, N·m
    ft = 2 * torque * 1e3 / PITCH_D                                     # Ft = 2T/d, N
    fr = ft * math.tan(math.radians(ALPHA_N)) / math.cos(math.radians(BETA))  # Fr = Ft·tan αn/cos β
    fa = ft * math.tan(math.radians(BETA))                              # Fa = Ft·tan β
    # Shaft statics (moments about A and B).  The mate lies at +z (mesh angle 90°), so the mesh
    # point is at z = +d/2: Fr pushes the pinion toward −z, Ft acts along y, and a right-hand
    # driving pinion turning positively is thrust toward +x, toward B, the locating bearing.
    # In the x–y plane Ft alone; in the x–z plane Fr and the couple Fa·d/2 of the thrust at the
    # pitch radius, which adds to Fr's moment about A.
    span, arm = X_B - X_A, X_GEAR - X_A
    radius = PITCH_D / 2
    b_y, b_z = ft * arm / span, (fr * arm + fa * radius) / span
    a_y, a_z = ft - b_y, fr - b_z
    fr_a, fr_b = math.hypot(a_y, a_z), math.hypot(b_y, b_z)
    # ISO 281: A cylindrical, P = Fr (§7.2), p = 10/3; B deep-groove, Table 3 by Fa/C0r, p = 3
    e = interpolate(fa / C0_B, TABLE3_FA_C0, TABLE3_E)
    y = interpolate(fa / C0_B, TABLE3_FA_C0, TABLE3_Y)
    assert fa / fr_b > e  # the > e branch: P = X·Fr + Y·Fa
    p_a, p_b = fr_a, TABLE3_X * fr_b + y * fa
    return {"ft": ft, "fr_gear": fr, "fa": fa, "fr_a": fr_a, "fr_b": fr_b, "e": e, "y": y,
            "p_a": p_a, "p_b": p_b, "l10_a": (C_A / p_a) ** (10 / 3), "l10_b": (C_B / p_b) ** 3}


def miner(lives_mrev: list[float]) -> tuple[float, float]:
    """Palmgren–Miner life (10⁶ rev) over the states' time shares, and hours at the mean speed."""
    mean_speed = sum(share * speed for _, _, speed, share in STATES)   # nm = Σ ti·ni
    shares = [share * speed / mean_speed for _, _, speed, share in STATES]  # ui = ti·ni/nm
    life = 1 / sum(u / life_i for u, life_i in zip(shares, lives_mrev))
    return life, life * 1e6 / (60 * mean_speed)


async def press_walkthrough(app: WorkbenchApp, steps: list[tuple[str, str]]) -> None:
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        for what, text in steps:
            if what == "type":
                await pilot.press(*text)  # as one burst, as a paste or a slow link delivers it
            else:
                await pilot.press(text)
            await pilot.pause()
            await app.workers.wait_for_complete()  # the report is written in a worker
            await pilot.pause()


def test_readme_walkthrough_names_only_keys_a_terminal_passes() -> None:
    steps = walkthrough_steps(README.read_text(encoding="utf-8"))
    keys = {text for what, text in steps if what == "key"}
    assert not keys & {"alt+b", "alt+f"}  # many terminals take these for word movement
    assert {"alt+i", "alt+e", "alt+h", "alt+r", "ctrl+s"} <= keys


async def test_the_readme_walkthrough_gives_a_report_that_closed_forms_confirm(tmp_path: Path) -> None:
    path = tmp_path / SESSION_NAME
    app = app_for(str(path), offer_recovery=False, autosave_delay=None)
    assert isinstance(app, WorkbenchApp) and not path.exists()  # a new, empty session
    assert not app.document.session.cases and not app.document.session.bearings
    await press_walkthrough(app, walkthrough_steps(README.read_text(encoding="utf-8")))

    html_path, json_path = tmp_path / "gearbox-report.html", tmp_path / "gearbox-report.json"
    assert path.exists() and html_path.exists() and json_path.exists()
    report = json.loads(json_path.read_text(encoding="utf-8"))
    # the report is of the session as saved: the SHA-256 of the file's bytes
    assert report["meta"]["session_sha256"] == hashlib.sha256(path.read_bytes()).hexdigest()
    assert report["session"]["title"] == "Gearbox input shaft"
    assert report["session"]["targets"]["life"] == "30000 h"

    cases = {case["name"]: case for case in report["cases"]}
    expected = {name: expected_state(power, speed) for name, power, speed, _ in STATES}
    for name, _, speed, _ in STATES:
        hand = expected[name]
        a, b = cases[f"Input shaft · {name} · A"], cases[f"Input shaft · {name} · B"]
        assert a["bearing"] == "Free end" and b["bearing"] == "Locating end"
        # gear forces and shaft statics: the bearings' loads (the case texts keep 6 figures)
        assert float(a["inputs"]["fr"].removesuffix(" N")) == pytest.approx(hand["fr_a"], rel=1e-5)
        assert float(b["inputs"]["fr"].removesuffix(" N")) == pytest.approx(hand["fr_b"], rel=1e-5)
        assert float(b["inputs"]["fa"].removesuffix(" N")) == pytest.approx(hand["fa"], rel=1e-5)
        assert float(a["inputs"]["fa"].removesuffix(" N")) == 0.0  # the free end takes no thrust
        # ISO 281: e and Y from Table 3, P, L10 = (C/P)^p, and L10h = L10·10⁶/(60·n)
        assert b["results"]["e"] == pytest.approx(hand["e"], rel=1e-4)
        assert b["results"]["Y"] == pytest.approx(hand["y"], rel=1e-4)
        assert b["results"]["X"] == TABLE3_X
        assert a["results"]["P"] == pytest.approx(hand["p_a"], rel=1e-5)
        assert b["results"]["P"] == pytest.approx(hand["p_b"], rel=1e-4)
        assert a["results"]["L10"] == pytest.approx(hand["l10_a"], rel=2e-4)
        assert b["results"]["L10"] == pytest.approx(hand["l10_b"], rel=2e-4)
        assert b["results"]["L10h"] == pytest.approx(hand["l10_b"] * 1e6 / (60 * speed), rel=2e-4)
        # R = 0.90 (a1 = 1, ISO 281 Table 12) and no lubrication given (aISO = 1): Lnm = L10
        assert b["results"]["Lnm_mrev"] == pytest.approx(hand["l10_b"], rel=2e-4)
        assert a["life_target_h"] == LIFE_TARGET_H

    # Palmgren–Miner per bearing over the two states
    duties = {duty["bearing"]: duty for duty in report["duty_cycles"]}
    for bearing, side in (("Free end", "l10_a"), ("Locating end", "l10_b")):
        life_mrev, life_h = miner([expected[name][side] for name, *_ in STATES])
        assert duties[bearing]["life_mrev"] == pytest.approx(life_mrev, rel=2e-4)
        assert duties[bearing]["life_h"] == pytest.approx(life_h, rel=2e-4)
    # the two bearings in series: L_sys = (L_A^−s + L_B^−s)^(−1/s)
    lives = [miner([expected[name][side] for name, *_ in STATES])[0] for side in ("l10_a", "l10_b")]
    system = sum(life ** -SYSTEM_SLOPE for life in lives) ** (-1 / SYSTEM_SLOPE)
    assert report["shafts"][0]["system"]["life_mrev"] == pytest.approx(system, rel=2e-4)

    # the html page: one self-contained file with its figures, the same numbers in it
    html = html_path.read_text(encoding="utf-8")
    assert "<svg" in html and "<script" not in html and "Gearbox input shaft" in html
    locating_h = miner([expected[name]["l10_b"] for name, *_ in STATES])[1]
    assert f"{round(locating_h)}" in html  # the locating end's Miner life, whole hours
