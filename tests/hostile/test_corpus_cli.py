"""The hostile corpus through the command line: each file is refused with exit 2 and one short
line on standard error (naming the file), or, where the file is sound and only a case is not,
reported with the case's error; never a traceback, never a hang.

Speed is not asserted here (it is a property of the machine); the inputs are bounded so each
run is quick, and ``workbench bench`` reports the large-session figures.  Expectations: the exit
codes documented in DEVELOPERS.md, and the ECMA-48 control ranges for what reaches a terminal.
"""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

import pytest
from corpus import (
    ACCEPTED_SESSIONS, GOOD, REFUSED_CASES, REFUSED_CATALOGS, REFUSED_SESSIONS,
    ROW_PROBLEM_CATALOGS, write_files, write_special_files,
)

from workbench.cli import main
from workbench.model.sessionfile import open_session

MAX_LINE = 400  # one failure line: a screen line or two, never the user's megabyte
CONTROL = [chr(c) for c in (*range(0x00, 0x09), *range(0x0B, 0x20), *range(0x7F, 0xA0))]


def _one_line_failure(err: str, path: Path) -> None:
    assert err.count("\n") == 1 and err.startswith("workbench: "), err[:500]
    assert len(err) <= MAX_LINE
    assert path.name[:40] in err or "…" in err  # names the file (its end when clipped)
    assert "Traceback" not in err and not any(c in err for c in CONTROL)


@pytest.mark.parametrize("name", sorted(REFUSED_SESSIONS))
def test_refused_session_is_one_line_and_exit_2(name: str, tmp_path: Path,
                                                capsys: pytest.CaptureFixture[str]) -> None:
    """A hostile session file: exit 2, one line naming it, nothing on standard output."""
    [path] = write_files(tmp_path, {name: REFUSED_SESSIONS[name]})
    assert main(["report", str(path)]) == 2
    captured = capsys.readouterr()
    assert captured.out == ""
    _one_line_failure(captured.err, path)


@pytest.mark.parametrize("name", sorted(REFUSED_SESSIONS))
def test_screen_open_of_a_refused_session_is_a_message(name: str, tmp_path: Path) -> None:
    """The screen's door (open_session) gives the same file an error line, never raises."""
    [path] = write_files(tmp_path, {name: REFUSED_SESSIONS[name]})
    outcome = open_session(path)
    assert outcome.session is None and outcome.error and "\n" not in outcome.error


@pytest.mark.parametrize("kind", ["fifo", "dev-zero-link", "folder", "long-name", "sparse-30MB"])
def test_files_that_are_not_sessions_are_refused_without_reading(
        kind: str, tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    """A FIFO would hang a read, /dev/zero never ends, a 30 MB file is over the limit."""
    special = write_special_files(tmp_path)
    if kind not in special:
        pytest.skip(f"{kind} cannot be made here")
    assert main(["report", str(special[kind])]) == 2
    _one_line_failure(capsys.readouterr().err, special[kind])


@pytest.mark.skipif(sys.platform == "win32", reason="POSIX FIFO")
def test_fifo_does_not_hang_the_process(tmp_path: Path) -> None:
    """In a real process (the timeout only catches a hang; the run takes well under a second)."""
    fifo = write_special_files(tmp_path)["fifo"]
    done = subprocess.run([sys.executable, "-m", "workbench", "report", str(fifo)],
                          capture_output=True, text=True, timeout=60)
    assert done.returncode == 2 and "pipe" in done.stderr


@pytest.mark.parametrize("name", sorted(REFUSED_CASES))
def test_case_the_engine_refuses_is_reported_not_raised(
        name: str, tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    """Overflowing engine inputs in a sound file: the report names the case's error (exit 0)."""
    [path] = write_files(tmp_path, {name: REFUSED_CASES[name]})
    assert main(["report", str(path), "--format", "json"]) == 0
    assert '"error"' in capsys.readouterr().out


@pytest.mark.parametrize("name", sorted(ACCEPTED_SESSIONS))
def test_accepted_sessions_report_without_control_characters(
        name: str, tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    """A BOM, 100 000 comments, escape codes and markup in names: reported, and nothing a
    terminal would act on reaches standard output."""
    [path] = write_files(tmp_path, {name: ACCEPTED_SESSIONS[name]})
    for fmt in ("text", "markdown", "json"):
        assert main(["report", str(path), "--format", fmt]) == 0
        out = capsys.readouterr().out
        assert not any(c in out for c in CONTROL if c != "\n")


def test_markdown_report_escapes_markup_in_names(tmp_path: Path,
                                                 capsys: pytest.CaptureFixture[str]) -> None:
    """<script> and <img onerror> show as text; a newline in a case name makes no heading."""
    [path] = write_files(tmp_path, {"m.toml": ACCEPTED_SESSIONS["markup-in-names.toml"]})
    assert main(["report", str(path), "--format", "markdown"]) == 0
    out = capsys.readouterr().out
    assert "<script>" not in out and "<img" not in out and "&lt;script>" in out
    assert "\n# injected" not in out


def _select_with_catalog(folder: Path, name: str, data: bytes) -> tuple[int, Path]:
    """``workbench select`` of the corpus base session on the catalog ``name``: exit code, path."""
    [session] = write_files(folder, {"s.toml": GOOD.encode()})
    [path] = write_files(folder, {name: data})
    return main(["select", str(session), "--catalog", str(path)]), path


@pytest.mark.parametrize("name", sorted(REFUSED_CATALOGS))
def test_refused_catalog_is_one_line_and_exit_2(name: str, tmp_path: Path,
                                                capsys: pytest.CaptureFixture[str]) -> None:
    """A 100 000-column header, a 200 kB header cell, nested or huge-integer TOML catalogs."""
    code, path = _select_with_catalog(tmp_path, name, REFUSED_CATALOGS[name])
    assert code == 2
    _one_line_failure(capsys.readouterr().err, path)


@pytest.mark.parametrize("name", sorted(ROW_PROBLEM_CATALOGS))
def test_bad_catalog_rows_are_rejected_and_bounded(name: str, tmp_path: Path,
                                                   capsys: pytest.CaptureFixture[str]) -> None:
    """A 140 kB field rejects its row; 5000 bad rows are named 20 at a time on standard error."""
    assert _select_with_catalog(tmp_path, name, ROW_PROBLEM_CATALOGS[name])[0] == 0
    err = capsys.readouterr().err
    assert 1 <= err.count("\n") <= 21 and max(len(line) for line in err.splitlines()) <= MAX_LINE


@pytest.mark.parametrize("flags", [
    ["--c", "1 kN**99", "--c0", "19 kN", "--fr", "1 kN"],
    ["--c", "33 kN", "--c0", "19 kN", "--fr", "1 kN", "--solve", "c", "--target", "Lnm=1 kN**99"],
    ["--c", "33 kN", "--c0", "19 kN", "--fr", "1 kN", "--reliability-model", "weibull",
     "--weibull-b", "0.001", "--reliability", "0.01"],
    ["--c", "1e308", "--c0", "19 kN", "--fr", "1 kN", "--speed", "100 rpm"],
    ["--c", "33 kN", "--c0", "19 kN", "--fr", "1 kN", "--af", "5e-324"],
    ["--c", "33 kN", "--c0", "19 kN", "--fr", "1 kN", "--kind", "\x1b]0;x\x07" + "k" * 5000],
])
def test_hostile_calc_flags_are_one_line(flags: list[str],
                                         capsys: pytest.CaptureFixture[str]) -> None:
    """Overflowing quantities, targets and engine inputs on the command line: exit 2, one line
    naming the flag."""
    assert main(["calc", *flags]) == 2
    err = capsys.readouterr().err
    assert err.count("\n") == 1 and err.startswith("workbench: --") and len(err) <= MAX_LINE
    assert not any(c in err for c in CONTROL)


def test_tiny_af_load_scale_solve_is_no_answer_not_a_crash(
        capsys: pytest.CaptureFixture[str]) -> None:
    """af = 5e-324 with a load-scale solve: the solver answers 'no solution' (exit 3)."""
    code = main(["calc", "--c", "33 kN", "--c0", "19 kN", "--fr", "1 kN", "--speed", "100 rpm",
                 "--af", "5e-324", "--solve", "load_scale", "--target", "Lnm=20000 h"])
    assert code in (2, 3) and capsys.readouterr().err.count("\n") == 1


def test_report_to_a_full_disk_is_one_line(tmp_path: Path) -> None:
    """Standard output on /dev/full (ENOSPC): one line on standard error, exit 2."""
    if not Path("/dev/full").exists():
        pytest.skip("needs /dev/full")
    [path] = write_files(tmp_path, {"s.toml": GOOD.encode()})
    with open("/dev/full", "w", encoding="utf-8") as full:
        done = subprocess.run([sys.executable, "-m", "workbench", "report", str(path)],
                              stdout=full, stderr=subprocess.PIPE, text=True, timeout=60)
    assert done.returncode == 2 and done.stderr.count("\n") == 1 and "space" in done.stderr


def test_report_into_a_closed_pipe_is_quiet(tmp_path: Path) -> None:
    """The reader of a pipe goes away first: no traceback on standard error."""
    [path] = write_files(tmp_path, {"s.toml": GOOD.encode()})
    child = subprocess.Popen([sys.executable, "-m", "workbench", "calc", "--c", "33 kN", "--c0",
                              "19 kN", "--fr", "1 kN", "--json", "--sensitivity"],
                             stdout=subprocess.PIPE, stderr=subprocess.PIPE)
    assert child.stdout is not None and child.stderr is not None
    child.stdout.close()  # nobody reads: the write meets a closed pipe
    err = child.stderr.read().decode()
    assert child.wait(timeout=60) == 2 and "Traceback" not in err


def test_report_output_is_written_atomically_and_never_over_the_session(
        tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    """report -o replaces the old report whole; it refuses to overwrite its own session."""
    [path] = write_files(tmp_path, {"s.toml": GOOD.encode()})
    out = tmp_path / "review.md"
    out.write_text("old", encoding="utf-8")
    assert main(["report", str(path), "--format", "markdown", "-o", str(out)]) == 0
    assert out.read_text(encoding="utf-8").startswith("# Design review")
    assert [p.name for p in tmp_path.iterdir() if p.name.endswith(".tmp")] == []
    assert main(["report", str(path), "-o", str(path)]) == 2
    assert path.read_bytes() == GOOD.encode()
    _one_line_failure(capsys.readouterr().err, path)


def test_thousand_case_session_opens_and_reports(tmp_path: Path,
                                                  capsys: pytest.CaptureFixture[str]) -> None:
    """1,000 cases on one bearing: read and reported, every case in the summary; sensitivity
    tables stop after the first 50 and the report says so (the speed is in workbench bench)."""
    from workbench.model.sample_sessions import shared_bearing_session
    from workbench.model.sessionfile import dumps_session
    from workbench.report.contents import SENSITIVITY_CASES

    path = tmp_path / "large.toml"
    path.write_text(dumps_session(shared_bearing_session(1000)), encoding="utf-8")
    assert len(open_session(path).session.cases) == 1000
    assert main(["report", str(path), "--format", "json"]) == 0
    cases = json.loads(capsys.readouterr().out)["cases"]
    assert len(cases) == 1000 and all(case["error"] is None for case in cases)
    with_tables = [case for case in cases if case["sensitivity"]]
    assert len(with_tables) == SENSITIVITY_CASES
    assert main(["report", str(path)]) == 0
    assert f"first {SENSITIVITY_CASES} cases" in capsys.readouterr().out
