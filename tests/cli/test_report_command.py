"""``workbench report`` through the command tree, and the top-level help."""

from __future__ import annotations

import hashlib
import json
from pathlib import Path

import pytest

from workbench.cli import SUBCOMMANDS, main
from workbench.model.caution import SAFETY_CAUTION

DEMO = Path(__file__).resolve().parents[2] / "sessions" / "demo.toml"


def test_report_json_on_stdout_carries_the_caution(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["report", str(DEMO), "--format", "json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert data["caution"] == SAFETY_CAUTION
    assert data["cases"] and data["session"]["source"] == str(DEMO)


def test_report_writes_the_output_file(tmp_path: Path) -> None:
    out = tmp_path / "review.md"
    assert main(["report", str(DEMO), "--format", "markdown", "-o", str(out)]) == 0
    assert out.read_text(encoding="utf-8").startswith("# Design review: ")


def test_an_unknown_format_is_refused_by_the_parser(capsys: pytest.CaptureFixture[str]) -> None:
    with pytest.raises(SystemExit) as caught:
        main(["report", str(DEMO), "--format", "pdf"])
    assert caught.value.code == 2
    assert "workbench report" in capsys.readouterr().err


def test_top_level_help_names_every_sub_command(capsys: pytest.CaptureFixture[str]) -> None:
    with pytest.raises(SystemExit) as caught:
        main(["--help"])
    assert caught.value.code == 0
    shown = capsys.readouterr().out
    assert all(name in shown for name in SUBCOMMANDS)


def test_report_writes_an_html_page(tmp_path: Path) -> None:
    session = tmp_path / "one.toml"
    session.write_text('schema = 1\n[session]\ntitle = "One case"\n'
                       '[[bearings]]\nname = "B"\nkind = "deep-groove"\nc = "30 kN"\nc0 = "18 kN"\n'
                       '[[cases]]\nname = "run"\nbearing = "B"\nfr = "3 kN"\nspeed = "900 rpm"\n',
                       encoding="utf-8")
    out = tmp_path / "one.html"
    assert main(["report", str(session), "--format", "html", "-o", str(out)]) == 0
    page = out.read_text(encoding="utf-8")
    assert page.startswith("<!DOCTYPE html>") and page.count("<svg") == 1  # the life figure
    assert hashlib.sha256(session.read_bytes()).hexdigest() in page  # FIPS 180-4, by hashlib


def test_report_to_a_folder_is_one_line_and_exit_2(tmp_path: Path,
                                                   capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["report", str(DEMO), "--format", "json", "-o", str(tmp_path)]) == 2
    error = capsys.readouterr().err
    assert error.count("\n") == 1 and "folder" in error
