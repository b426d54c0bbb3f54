"""``workbench select``: the catalog bearings that meet a session's cases."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from workbench.cli import main

# Row 4 (counting the comment and the header) has a non-numeric outer diameter.
ONE_BAD_ROW_CSV = """# a comment line
designation,kind,d_mm,D_mm,B_mm,C_kN,C0_kN,f0,contact_angle_deg,speed_limit_rpm,mass_kg
T-1,deep-groove,40,80,18,31.5,20.2,14,,8000,0.35
T-2,deep-groove,40,x,18,31.5,20.2,14,,8000,0.35
"""

SESSION = """schema = 1

[session]
title = "Select test"

[targets]
life = "20000 h"
reliability = "0.95"
s0 = "1.5"

[[bearings]]
name = "position A"
kind = "deep-groove"
c = "30 kN"
c0 = "20 kN"

[[cases]]
name = "running"
bearing = "position A"
fr = "2 kN"
fa = "0.4 kN"
speed = "1500 rpm"
vg = "68"
temp = "60 °C"
cleanliness = "normal"

[[cases]]
name = "peak"
bearing = "position A"
fr = "6 kN"
fa = "1 kN"
speed = "0 rpm"
"""


@pytest.fixture
def session_file(tmp_path: Path) -> Path:
    path = tmp_path / "select.toml"
    path.write_text(SESSION, encoding="utf-8")
    return path


def test_select_cli_json(session_file: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["select", str(session_file), "--json", "--top", "3"]) == 0
    out = json.loads(capsys.readouterr().out)
    assert {"candidates", "rejected_rows", "session", "targets"} <= set(out)
    assert 1 <= len(out["candidates"]) <= 3
    first = out["candidates"][0]
    assert set(first) == {"designation", "kind", "arrangement", "d_mm", "D_mm", "B_mm", "mass_kg", "life_margin",
                          "governing_case", "min_s0", "note"}
    assert first["life_margin"] >= 1.0 and first["min_s0"] >= 1.5
    assert first["governing_case"] == "running"  # the speed-0 case is a static check only
    outer = [(c["D_mm"], c["B_mm"]) for c in out["candidates"]]
    assert outer == sorted(outer)
    assert out["targets"]["life_h"] == 20000.0


def test_select_cli_filters_and_text(session_file: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["select", str(session_file), "--kind", "cylindrical", "--od-max", "90 mm",
                 "--flanged-cylindrical"]) == 0
    text = capsys.readouterr().out
    assert "designation" in text and "WB-CR" in text and "WB-DG" not in text


def test_select_cli_refuses_cylindrical_bearings_under_axial_load_and_says_why(
        session_file: Path, capsys: pytest.CaptureFixture[str]) -> None:
    # both cases have Fa > 0: a cylindrical roller bearing carries it only on flanges (ISO 281:2007
    # §7.2 rates it on P = Fr), so without --flanged-cylindrical none qualifies
    assert main(["select", str(session_file), "--kind", "cylindrical"]) == 0
    text = capsys.readouterr().out
    assert "No catalog bearing meets every case." in text
    assert "cannot carry Fa in case 'running' (--flanged-cylindrical" in text
    assert "WB-CR 02-20" in text.split("cannot carry Fa in case")[1]
    assert main(["select", str(session_file), "--json", "--top", "0"]) == 0
    out = json.loads(capsys.readouterr().out)
    assert all(c["kind"] != "cylindrical" for c in out["candidates"])
    refused = [row for row in out["not_qualifying"] if row["kind"] == "cylindrical"]
    assert refused and all(row == {"designation": row["designation"], "kind": "cylindrical",
                                   "reason": "cannot carry Fa", "case": "running"} for row in refused)
    assert "flanges" in out["reasons"]["cannot carry Fa"]
    assert out["rejections"]["cannot carry Fa"] == len(refused)


def test_select_cli_lets_flanged_cylindrical_bearings_qualify_with_a_note(
        session_file: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["select", str(session_file), "--json", "--top", "0", "--kind", "cylindrical",
                 "--flanged-cylindrical"]) == 0
    out = json.loads(capsys.readouterr().out)
    assert out["candidates"] and out["flanged_cylindrical"] is True
    # the largest Fa of the session's cases (1 kN, "peak") is what the flanges must carry
    assert all("Fa up to 1000 N" in c["note"] and "maker's data" in c["note"]
               for c in out["candidates"])
    assert main(["select", str(session_file), "--kind", "cylindrical", "--flanged-cylindrical"]) == 0
    text = capsys.readouterr().out
    assert " WB-CR 02-20*  cylindrical " in text  # marked: its note follows the table
    assert "\n* flanges carry Fa up to 1000 N" in text


def test_select_cli_reports_rejected_rows_on_stderr(session_file: Path, tmp_path: Path,
                                                    capsys: pytest.CaptureFixture[str]) -> None:
    catalog = tmp_path / "mine.csv"
    catalog.write_text(ONE_BAD_ROW_CSV, encoding="utf-8")
    assert main(["select", str(session_file), "--catalog", str(catalog), "--json"]) == 0
    captured = capsys.readouterr()
    assert "row 4, D_mm" in captured.err
    assert {"row": 4, "column": "D_mm"}.items() <= json.loads(captured.out)["rejected_rows"][0].items()


def test_select_cli_exit_codes(session_file: Path, tmp_path: Path,
                               capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["select", str(tmp_path / "absent.toml")]) == 2
    bad_session = tmp_path / "bad.toml"
    bad_session.write_text("schema = 1\n[session]\ntitel = 'x'\n", encoding="utf-8")
    assert main(["select", str(bad_session)]) == 2
    bad_catalog = tmp_path / "bad.csv"
    bad_catalog.write_text("designation,kind\nA,deep-groove\n", encoding="utf-8")
    assert main(["select", str(session_file), "--catalog", str(bad_catalog)]) == 2
    assert main(["select", str(session_file), "--bore-min", "5 kg"]) == 2
    assert main(["select", str(session_file), "--bearing", "nowhere"]) == 2
    assert "workbench:" in capsys.readouterr().err


PAIR_SESSION = """schema = 1

[session]
title = "Pair position"

[targets]
life = "20000 h"

[[bearings]]
name = "DE angular pair"
kind = "angular-contact"
arrangement = "back-to-back"
contact_angle = "40 deg"
c = "24 kN"
c0 = "20 kN"

[[cases]]
name = "Running"
bearing = "DE angular pair"
fr = "3 kN"
fa = "1 kN"
speed = "1000 r/min"
"""

PAIR_CSV = """designation,kind,arrangement,d_mm,D_mm,B_mm,C_kN,C0_kN,contact_angle_deg
P-1,angular-contact,single,40,80,18,26.02,16.62,40
"""


def test_a_pair_position_rates_single_rows_as_pairs(tmp_path: Path,
                                                     capsys: pytest.CaptureFixture[str]) -> None:
    """ISO 281:2007 §5.1: the pair rates C = 2^0.7·C of one bearing; Table 3, 40° pair, Fa/Fr =
    1/3 ≤ e = 1.14: X = 1, Y = 0.55 (from memory), P = 3550 N; L10h = 10⁶·(C/P)³/(60·n)."""
    session, catalog = tmp_path / "pair.toml", tmp_path / "one.csv"
    session.write_text(PAIR_SESSION, encoding="utf-8")
    catalog.write_text(PAIR_CSV, encoding="utf-8")
    assert main(["select", str(session), "--catalog", str(catalog), "--json"]) == 0
    out = json.loads(capsys.readouterr().out)
    assert out["position_arrangement"] == "back-to-back"
    [row] = out["candidates"]
    assert row["arrangement"] == "back-to-back"
    hours = 1e6 * (26.02e3 * 2 ** 0.7 / 3550.0) ** 3 / (60 * 1000.0)
    assert row["life_margin"] == pytest.approx(hours / 20000.0, rel=1e-9)
    assert main(["select", str(session), "--catalog", str(catalog)]) == 0
    assert "Rated    Each single-row bearing of a kind that comes as a back-to-back pair is " \
        "rated as a pair of it" in capsys.readouterr().out
