"""Every report's provenance (``meta``), bearing designations, static checks, and the API the
screen writes reports through.

References outside the project: ISO 8601 date-times as read by ``datetime.fromisoformat``,
SHA-256 (FIPS 180-4) as computed by ``hashlib`` on the file's bytes, the package version as
``importlib.metadata`` reports it, and RFC 8259 JSON as the ``json`` module reads it.
"""

from __future__ import annotations

import hashlib
import html
import json
import re
from datetime import datetime, timedelta, timezone
from importlib.metadata import version
from pathlib import Path

import pytest

from workbench.model import analysis
from workbench.model.session import Bearing, LoadCase, Session, Targets
from workbench.model.sessionfile import save_session
from workbench.report import FORMATS, preview, render_report, report_text, write_report
from workbench.report.meta import NEVER_SAVED

DESIGNATION = "WB-6207-ZZ"
SOURCE = "catalog invented.csv, row 12"


def small_session() -> Session:
    """One deep-groove bearing with a designation and source, one case (no lubrication data,
    so the html report draws one figure)."""
    bearing = Bearing("free end", {"kind": "deep-groove", "c": "25.5 kN", "c0": "15.3 kN"})
    bearing.designation, bearing.source = DESIGNATION, SOURCE  # fields of issue 14, item 2
    session = Session(title="Provenance check", engineer="A. Tester",
                      targets=Targets(life="20000 h", reliability="0.90"),
                      bearings=[bearing],
                      cases=[LoadCase("start-up peak", "free end",
                                      {"fr": "9 kN", "speed": "1000 rpm"})])
    session.revision = "C"  # field of issue 14, item 1
    return session


def saved(tmp_path: Path) -> tuple[Session, Path]:
    session, path = small_session(), tmp_path / "provenance.toml"
    save_session(session, path)
    return session, path


def plain(fmt: str, text: str) -> str:
    """The report's words: html without its tags (a table row to a line) and entities, Markdown
    without its cell bars."""
    if fmt == "html":
        text = html.unescape(re.sub(r"<[^>]+>", " ", text.replace("</tr>", "\n")))
    return text.replace("|", " ") if fmt == "markdown" else text


def shown_meta(fmt: str, text: str) -> dict[str, str | None]:
    """generated_at, tool_version and session_sha256 as each format shows them."""
    if fmt == "json":
        meta = json.loads(text)["meta"]
        return {k: meta[k] for k in ("generated_at", "tool_version", "session_sha256")}
    found = {}
    for key, label in (("generated_at", "Generated (UTC)"), ("tool_version", "Tool version"),
                       ("session_sha256", "Session SHA-256")):
        # the value after its label, or on the next line where the two do not fit one line
        match = re.search(re.escape(label) + r":?\s+(.+)", plain(fmt, text))
        assert match is not None, (fmt, label)
        found[key] = match.group(1).strip()
    found["tool_version"] = str(found["tool_version"]).removeprefix("bearing-workbench ")
    return found


@pytest.mark.parametrize("fmt", FORMATS)
def test_every_format_carries_the_meta_of_the_saved_file(fmt: str, tmp_path: Path) -> None:
    session, path = saved(tmp_path)
    expected_sha = hashlib.sha256(path.read_bytes()).hexdigest()
    before = datetime.now(timezone.utc).replace(microsecond=0)
    out = tmp_path / f"review.{fmt}"
    written = write_report(session, session_path=path, fmt=fmt, out_path=out)
    after = datetime.now(timezone.utc)
    assert written.ok and written.path == out
    text = out.read_text(encoding="utf-8")
    meta = shown_meta(fmt, text)
    assert meta["session_sha256"] == expected_sha
    generated = datetime.fromisoformat(str(meta["generated_at"]))
    assert generated.utcoffset() == timedelta(0)  # timezone-aware, UTC
    assert before <= generated <= after
    assert meta["tool_version"] == version("bearing-workbench")
    shown = plain(fmt, text)
    for value in (DESIGNATION, SOURCE, "A. Tester", "Provenance check"):
        assert value in shown, (fmt, value)
    if fmt == "json":
        data = json.loads(text)
        assert data["meta"]["revision"] == "C" and data["meta"]["engineer"] == "A. Tester"
        assert data["bearings"][0]["designation"] == DESIGNATION
        assert data["bearings"][0]["source"] == SOURCE
    else:
        assert re.search(r"Revision:?\s+C\b", shown)


def test_a_session_never_saved_or_changed_since_has_no_hash(tmp_path: Path) -> None:
    session, path = saved(tmp_path)
    never = json.loads(report_text(session, fmt="json", session_path=None))["meta"]
    assert never["session_sha256"] is None and never["session_sha256_note"] == NEVER_SAVED
    changed = json.loads(report_text(session, fmt="json", session_path=path, modified=True))
    assert changed["meta"]["session_sha256"] is None
    assert "not yet saved" in changed["meta"]["session_sha256_note"]
    assert NEVER_SAVED in render_report(session, "text", "memory")


def test_the_preview_is_the_text_report(tmp_path: Path) -> None:
    session, path = saved(tmp_path)
    shown = preview(session, session_path=path)
    assert shown.startswith("Design review: Provenance check\n")
    assert hashlib.sha256(path.read_bytes()).hexdigest() in shown


def test_writing_replaces_the_old_report_whole_and_refuses_without_raising(
        tmp_path: Path) -> None:
    session, path = saved(tmp_path)
    out = tmp_path / "review.md"
    out.write_text("old report\n", encoding="utf-8")
    assert write_report(session, session_path=path, fmt="markdown", out_path=out).ok
    assert out.read_text(encoding="utf-8").startswith("# Design review: Provenance check")
    assert [p.name for p in tmp_path.iterdir() if p.name.endswith(".tmp")] == []

    def refused(**where: object) -> str:
        outcome = write_report(session, **{"session_path": path, "fmt": "text", **where})
        assert outcome.path is None and outcome.error is not None
        assert "\n" not in outcome.error
        return outcome.error

    assert "folder" in refused(out_path=tmp_path)
    assert "session file itself" in refused(out_path=path)
    assert "cannot write" in refused(out_path=tmp_path / "no such folder" / "r.txt")
    assert "unknown report format" in refused(out_path=out, fmt="pdf")
    assert path.read_bytes().startswith(b"schema = 1")  # the session is untouched


@pytest.fixture
def static_start_up(monkeypatch: pytest.MonkeyPatch) -> None:
    """Mark the case as a static check, as CaseResult.static_only does (issue 14, item 4)."""
    evaluate = analysis.evaluate_case

    def marked(session: Session, case: LoadCase, **options: object):  # type: ignore[no-untyped-def]
        result = evaluate(session, case, **options)
        object.__setattr__(result, "static_only", True)
        return result

    monkeypatch.setattr(analysis, "evaluate_case", marked)


@pytest.mark.parametrize("fmt", FORMATS)
def test_a_static_check_has_no_life_verdict(fmt: str, static_start_up: None) -> None:
    # 9 kN on C = 25.5 kN at 1000 r/min: L10h = 10⁶/(60·1000)·(25.5/9)³ ≈ 379 h (ISO 281:2007
    # closed form), which misses the 20 000 h target were it judged on life
    text = render_report(small_session(), fmt, "memory")
    if fmt == "json":
        case = json.loads(text)["cases"][0]
        assert case["static_only"] is True and case["meets_life"] is None
        return
    assert "static check only" in text.lower()
    assert "missed" not in text  # s0 = 15.3/9 = 1.7 meets the normal-duty minimum 1
