"""Design-review reports: built from the derivation record, checked against closed forms.

References outside the project: the ISO 281:2007 §7.1 closed forms L10 = (C/P)^p and
L10h = 10⁶·L10/(60·n) (and their inverse for the solver), ISO 281:2007 Table 12 for a1, pint
for unit conversions of solver targets, and the JSON grammar of RFC 8259 (no NaN) as enforced by
the standard library's ``json`` module.
"""

from __future__ import annotations

import json
import math
import re
from pathlib import Path

import pint
import pytest

from workbench.engine.derive import derive
from workbench.model.caution import SAFETY_CAUTION
from workbench.model.analysis import analyse
from workbench.model.fields import FieldError
from workbench.model.session import Bearing, LoadCase, Session, SolverSetup, Targets
from workbench.model.sessionfile import dumps_session, load_session
from workbench.model.targets import parse_target_text
from workbench.cli.report import run_report
from workbench.report import render_report

SESSIONS = Path(__file__).resolve().parents[2] / "sessions"
EXAMPLES = sorted(SESSIONS.glob("*.toml"))
REFERENCE = pint.UnitRegistry()


def strict_json(text: str) -> dict:
    """Parse JSON refusing NaN and Infinity, which RFC 8259 does not allow."""
    def refuse(name: str) -> None:
        raise ValueError(f"non-standard JSON constant {name}")
    return json.loads(text, parse_constant=refuse)


def radial_session(speed: str = "1000 rpm", solver_case: str = "") -> Session:
    """A deep-groove bearing under pure radial load, no lubrication data (aISO = 1)."""
    return Session(
        title="closed form",
        targets=Targets(life="", reliability="0.90", s0=""),
        bearings=[Bearing("B", {"kind": "deep-groove", "c": "30 kN", "c0": "18 kN"})],
        cases=[LoadCase("radial", "B", {"fr": "3 kN", "speed": speed}),
               LoadCase("radial at 95 %", "B", {"fr": "3 kN", "speed": speed,
                                                "reliability": "0.95"})],
        solver=SolverSetup("c", "L10h=20000 h", solver_case),
    )


# ---- the example sessions --------------------------------------------------------------------
def test_there_are_example_sessions_with_a_solver_question() -> None:
    assert len(EXAMPLES) >= 3 and (SESSIONS / "demo.toml") in EXAMPLES
    assert any(load_session(p).solver.case for p in EXAMPLES)


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.name)
def test_example_sessions_report_cleanly_in_every_format(path: Path, tmp_path: Path) -> None:
    # html (matplotlib figures for every case) is checked on small sessions in test_html_report.py
    for fmt in ("text", "markdown", "json"):
        out = tmp_path / f"report.{fmt}"
        assert run_report(str(path), fmt, str(out)) == 0
        text = out.read_text(encoding="utf-8")
        shown = strict_json(text)["caution"] if fmt == "json" else text
        assert " ".join(SAFETY_CAUTION.split()) in " ".join(shown.split())  # lines may wrap
    data = strict_json((tmp_path / "report.json").read_text(encoding="utf-8"))
    assert [c["error"] for c in data["cases"]] == [None] * len(data["cases"])
    if data["solver"] is not None:
        assert data["solver"]["error"] is None and data["solver"]["solution"] is not None


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.name)
def test_json_results_are_derive_results(path: Path) -> None:
    session = load_session(path)
    data = strict_json(render_report(session, "json", path.name))
    # the session's cases, then those generated from its shafts
    for case, evaluated in zip(data["cases"], analyse(session).cases, strict=True):
        assert evaluated.inputs is not None
        reference = derive(evaluated.inputs).results
        assert case["results"].keys() == reference.keys()
        for key, value in reference.items():
            assert case["results"][key] == (None if math.isnan(value) else value)
        assert all(step["source"] for step in case["steps"])


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.name)
def test_text_report_shows_every_step_and_source(path: Path) -> None:
    session = load_session(path)
    text = render_report(session, "text", path.name)
    words = " ".join(text.split())  # the report wraps its lines: compare the words
    for evaluated in analyse(session).cases:
        assert evaluated.derivation is not None
        assert " ".join(f": {evaluated.case.name}".split()) in words
        for step in evaluated.derivation.steps:
            assert step.label in text
            assert " ".join(f"[{step.source}]".split()) in words
    assert re.search(r"\bengine\b", words) is None  # a report reader knows no "engine's units"


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.name)
def test_every_line_of_the_text_report_fits_74_columns(path: Path) -> None:
    """The text report is read in the report screen's preview, 74 columns wide at 80: no line
    may be longer (the title's "=" underline was 75), and wrapping loses no word."""
    session = load_session(path)
    text = render_report(session, "text", path.name)
    long = [line for line in text.splitlines() if len(line) > 74]
    assert long == []
    words = " ".join(text.split())
    assert f"Design review: {' '.join(session.title.split())}" in words
    for note_line in session.notes.split():
        assert note_line in words


@pytest.mark.parametrize("fmt", ["text", "markdown"])
def test_revolution_lives_are_written_with_a_times_sign(fmt: str) -> None:
    """A life in millions of revolutions reads "216 × 10⁶ rev" (ISO 80000-1 writes a power of
    ten before a unit after "×"), never "216 10⁶ rev", which reads as the number 21610⁶, nor
    with the unit in a column of its own in the text report's results."""
    session = load_session(SESSIONS / "demo.toml")
    text = render_report(session, fmt, "demo.toml")
    assert "× 10⁶ rev" in text
    assert re.search(r"\d\s+10⁶ rev", text) is None, re.search(r".*\d\s+10⁶ rev.*", text)


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.name)
def test_markdown_tables_are_well_formed(path: Path) -> None:
    markdown = render_report(load_session(path), "markdown", path.name)
    widths: list[int] = []
    for line in markdown.splitlines() + [""]:
        if line.startswith("|"):
            assert line.endswith("|")
            widths.append(len(re.findall(r"(?<!\\)\|", line)))
            continue
        assert len(set(widths)) <= 1, "a table whose rows have different numbers of cells"
        widths = []
    assert markdown.count("### Derivation") == len(analyse(load_session(path)).cases)


# ---- numbers against closed forms ------------------------------------------------------------
def test_report_numbers_match_iso281_closed_forms() -> None:
    data = strict_json(render_report(radial_session(), "json", "closed"))
    plain, at_95 = data["cases"]
    l10 = (30000 / 3000) ** 3  # ISO 281:2007 §7.1: L10 = (C/P)^3 for ball bearings, P = Fr here
    assert plain["results"]["P"] == pytest.approx(3000)
    assert plain["results"]["L10"] == pytest.approx(l10, rel=1e-12)
    assert plain["results"]["L10h"] == pytest.approx(l10 * 1e6 / (60 * 1000), rel=1e-12)
    # ISO 281:2007 Table 12: a1 = 0.64 at 95 % reliability (from memory, two digits)
    assert at_95["results"]["a1"] == pytest.approx(0.64, abs=0.005)
    assert at_95["results"]["Lnm"] == pytest.approx(at_95["results"]["a1"] * plain["results"]["L10h"])
    assert at_95["meets_life"] is None  # no life target set


def test_solver_section_matches_the_inverted_closed_form() -> None:
    data = strict_json(render_report(radial_session(solver_case="radial"), "json", "closed"))
    # ISO 281:2007 §7.1 inverted: C = P·(60·n·L10h/10⁶)^(1/3)
    expected = 3000 * (60 * 1000 * 20000 / 1e6) ** (1 / 3)
    solution = data["solver"]["solution"]
    assert solution["value"] == pytest.approx(expected, rel=1e-7)
    assert solution["target"] == "L10h" and solution["target_value"] == 20000
    assert data["solver"]["results"]["L10h"] == pytest.approx(20000, rel=1e-7)
    assert "root finding (Brent's method)" in data["sources"]
    text = render_report(radial_session(solver_case="radial"), "text", "closed")
    assert "Answer: c = " in text


def test_a_solver_without_a_target_aims_at_the_sessions_life_target() -> None:
    session = radial_session(solver_case="radial")
    session.targets.life = "30000 h"
    session.solver.target = ""  # none of its own: the session's life target, on Lnm
    data = strict_json(render_report(session, "json", "followed"))
    # no lubrication data and R = 0.90: a1 = aISO = 1, so Lnm = L10h and ISO 281:2007 §7.1
    # inverted gives C = P·(60·n·Lnm/10⁶)^(1/3)
    expected = 3000 * (60 * 1000 * 30000 / 1e6) ** (1 / 3)
    assert data["solver"]["target"] == "Lnm=30000 h"
    assert data["solver"]["solution"]["value"] == pytest.approx(expected, rel=1e-7)
    session.targets.life = ""
    text = render_report(session, "text", "no target")
    assert "No answer: no target: give the session a life target, or the solver one" in text


def test_nan_results_become_null() -> None:
    data = strict_json(render_report(radial_session(speed="0 rpm"), "json", "stopped"))
    results = data["cases"][0]["results"]
    assert results["L10h"] is None and results["Lnm"] is None  # speed 0: hours undefined
    assert results["L10"] == pytest.approx(1000.0)  # (30/3)^3, ISO 281:2007 §7.1


def test_life_and_static_verdicts_follow_the_targets() -> None:
    session = radial_session()
    session.targets = Targets(life="16000 h", reliability="0.90", s0="7")
    data = strict_json(render_report(session, "json", "targets"))
    plain = data["cases"][0]
    # L10h = 1000·10⁶/(60·1000) = 16 667 h ≥ 16 000 h; s0 = C0/P0 = 18/3 = 6 < 7 (ISO 76, P0 = Fr)
    assert plain["meets_life"] is True and plain["meets_s0"] is False
    markdown = render_report(session, "markdown", "targets")
    assert "against the target 16000 h" in markdown
    assert ": missed" in markdown and ": met" in markdown


def test_a_case_that_cannot_be_derived_is_reported_not_fatal(tmp_path: Path) -> None:
    session = radial_session()
    session.bearings.append(Bearing("N", {"kind": "cylindrical", "c": "50 kN", "c0": "45 kN"}))
    session.cases.append(LoadCase("axial on rollers", "N", {"fa": "2 kN", "speed": "500 rpm"}))
    path = tmp_path / "mixed.toml"
    path.write_text(dumps_session(session), encoding="utf-8")
    out = tmp_path / "mixed.json"
    assert run_report(str(path), "json", str(out)) == 0
    cases = strict_json(out.read_text(encoding="utf-8"))["cases"]
    assert [c["error"] is None for c in cases] == [True, True, False]
    assert cases[2]["error"].startswith("fa:") and cases[2]["results"] == {}
    for fmt in ("text", "markdown"):
        assert "cylindrical roller bearing cannot carry a purely axial load" in render_report(
            session, fmt, "mixed")


# ---- run_report on bad input -----------------------------------------------------------------
BAD = {
    "syntax": 'schema = 1\n[session\n',
    "unknown-key": 'schema = 1\n[session]\ntitel = "x"\n',
    "wrong-type": 'schema = 1\n[session]\nunits = 1\n',
    "bad-value": 'schema = 1\n[targets]\nlife = "lots"\n',
    "missing-required": 'schema = 1\n[[bearings]]\nname = "B"\nc = "1 kN"\nc0 = "1 kN"\n',
    "newer-schema": "schema = 9\n",
}


@pytest.mark.parametrize("kind", [*BAD, "no-such-file", "a-folder"])
def test_run_report_returns_2_with_one_line(kind: str, tmp_path: Path,
                                            capsys: pytest.CaptureFixture[str]) -> None:
    path = tmp_path / "bad.toml"
    if kind in BAD:
        path.write_text(BAD[kind], encoding="utf-8")
    elif kind == "a-folder":
        path.mkdir()
    assert run_report(str(path), "text", None) == 2
    captured = capsys.readouterr()
    assert captured.out == ""
    # the same "workbench: " prefix as every other sub-command's failure line
    assert captured.err.startswith(f"workbench: {path}") and captured.err.count("\n") == 1


def test_run_report_refuses_an_unknown_format(capsys: pytest.CaptureFixture[str]) -> None:
    assert run_report(str(EXAMPLES[0]), "pdf", None) == 2
    assert "pdf" in capsys.readouterr().err


def test_run_report_writes_to_stdout(capsys: pytest.CaptureFixture[str]) -> None:
    assert run_report(str(SESSIONS / "demo.toml"), "markdown", None) == 0
    assert capsys.readouterr().out.startswith("# Design review: ")


# ---- solver targets and the caution ----------------------------------------------------------
@pytest.mark.parametrize(("text", "name", "magnitude", "unit", "engine_unit"), [
    ("Lnm=20000 h", "Lnm", 20000, "hour", "hour"),
    ("L10h = 3 years", "L10h", 3, "year", "hour"),       # reference: pint's year (365.25 d)
    ("Lnm=2.5 kh", "Lnm", 2.5, "kilohour", "hour"),
    ("L10=900 Mrev", "L10", 900, "megaturn", "megaturn"),
    ("Lnm_mrev=2 Grev", "Lnm_mrev", 2, "gigaturn", "megaturn"),
])
def test_target_values_convert_as_pint_does(text: str, name: str, magnitude: float, unit: str,
                                            engine_unit: str) -> None:
    expected = REFERENCE.Quantity(magnitude, unit).to(engine_unit).magnitude
    assert parse_target_text(text) == (name, pytest.approx(expected, rel=1e-12))


def test_target_shorthands() -> None:
    assert parse_target_text("Lnm_mrev=5000 10⁶ rev") == ("Lnm_mrev", 5000.0)
    assert parse_target_text("L10=750") == ("L10", 750.0)  # bare number: the result's own unit
    assert parse_target_text("L10h=20000") == ("L10h", 20000.0)
    assert parse_target_text("s0=2.5") == ("s0", 2.5)


@pytest.mark.parametrize("text", ["Lnm 20000 h", "=5", "Lxx=5 h", "Lnm=20000 N", "s0=2 kN",
                                  "Lnm=0 h", "Lnm=-3 h"])
def test_bad_targets_raise_field_errors(text: str) -> None:
    with pytest.raises(FieldError) as caught:
        parse_target_text(text)
    assert caught.value.field == "target"


def test_caution_names_the_standards_and_defers_to_codes() -> None:
    for phrase in ("ISO 281:2007", "ISO 76:2006", "maker", "local codes",
                   "licensed engineering practice", "safety-critical"):
        assert phrase in SAFETY_CAUTION


def test_solver_section_lists_every_root() -> None:
    """Several roots (issue 15, finding 3; the inputs of tests/engine/test_solve.py::SPEED_CASE):
    the report answers with the smallest and lists all four, in text and in JSON."""
    session = Session(
        title="several roots",
        targets=Targets(life="", reliability="0.90", s0=""),
        bearings=[Bearing("B", {"kind": "deep-groove", "c": "30 kN", "c0": "18 kN",
                                "cu": "1515.54 N", "dm": "50 mm"})],
        cases=[LoadCase("slow", "B", {"fr": "5 kN", "speed": "1000 rpm", "nu": "21.908",
                                      "cleanliness": "0.5"})],
        solver=SolverSetup("speed", "Lnm=16854 h", "slow"),
    )
    text = render_report(session, "text", "several")
    several = next(line for line in text.splitlines() if "More than one answer" in line)
    assert several.count(",") == 3
    roots = strict_json(render_report(session, "json", "several"))["solver"]["solution"]["roots"]
    assert roots == pytest.approx([21.4, 925.9, 941.8, 1021.6], rel=2e-4)
