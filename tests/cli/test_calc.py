"""``workbench calc``: the headless contract (flag names, JSON keys, exit codes)."""

from __future__ import annotations

import json
import subprocess
import sys

import pytest

from workbench.cli import main

EXAMPLE = ["calc", "--kind", "deep-groove", "--fr", "5.2 kN", "--fa", "1.1 kN", "--c", "33 kN",
           "--c0", "19 kN", "--speed", "1450 rpm", "--reliability", "0.95", "--af", "1.2"]


def run(args: list[str], capsys: pytest.CaptureFixture[str]) -> tuple[int, str, str]:
    code = main(args)
    out, err = capsys.readouterr()
    return code, out, err


def test_example_json_has_the_contract_results(capsys: pytest.CaptureFixture[str]) -> None:
    """The README example: results carry P, e, X, Y, L10, L10h, Lnm, P0, s0."""
    code, out, _ = run(EXAMPLE + ["--json"], capsys)
    assert code == 0
    data = json.loads(out)
    for key in ("P", "e", "X", "Y", "L10", "L10h", "Lnm", "P0", "s0"):
        assert key in data["results"]
    # Fa/Fr = 0.2115 ≤ e (ISO 281 Table 3 at Fa/C0 = 0.0579), so P = Fr = 5200 N and
    # L10 = (33000/(1.2·5200))^3 (ISO 281:2007 §5.3, closed form).
    assert data["results"]["P"] == pytest.approx(5200.0)
    assert data["results"]["L10"] == pytest.approx((33000 / (1.2 * 5200)) ** 3)
    assert data["steps"] and all("source" in s for s in data["steps"])


def test_units_are_converted_like_pint(capsys: pytest.CaptureFixture[str]) -> None:
    """1169 lbf is 5200.0 N to within pint's conversion (reference library)."""
    import pint

    newtons = pint.UnitRegistry().Quantity(1169.0, "lbf").to("N").magnitude
    args = EXAMPLE.copy()
    args[args.index("5.2 kN")] = "1169 lbf"
    code, out, _ = run(args + ["--json"], capsys)
    assert code == 0
    assert json.loads(out)["results"]["P"] == pytest.approx(newtons, rel=1e-9)


def test_text_output_shows_the_derivation(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(EXAMPLE, capsys)
    assert code == 0
    assert "Equivalent dynamic load" in out and "ISO 281:2007" in out


@pytest.mark.parametrize(
    ("flag", "value"),
    [("--fr", "5 kg"), ("--fr", "kN"), ("--fa", "9**9**9 kN"), ("--speed", "fast"),
     ("--c", "nan kN"), ("--fr", "-3 kN"), ("--reliability", "95"), ("--kind", "ball"),
     ("--fr", "x" * 10000)],
)
def test_bad_values_exit_2_naming_the_flag(flag: str, value: str,
                                           capsys: pytest.CaptureFixture[str]) -> None:
    """A wrong dimension, a unit without a number, an expression, a word: exit 2, one line."""
    args = EXAMPLE.copy()
    if flag in args:
        args[args.index(flag) + 1] = value
    else:
        args += [flag, value]
    code, out, err = run(args, capsys)
    assert code == 2
    assert flag in err
    assert len(err.strip().splitlines()) == 1


def test_solve_json_reports_solved(capsys: pytest.CaptureFixture[str]) -> None:
    """--solve c --target "Lnm=20000 h": the solved object and the target met."""
    code, out, _ = run(EXAMPLE + ["--solve", "c", "--target", "Lnm=20000 h", "--json"], capsys)
    assert code == 0
    data = json.loads(out)
    assert set(data["solved"]) >= {"name", "value", "unit", "residual", "evaluations"}
    assert data["solved"]["name"] == "c"
    assert data["results"]["Lnm"] == pytest.approx(20000.0, rel=1e-9)


def test_solve_allowed_axial_load(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(EXAMPLE + ["--solve", "fa", "--target", "L10h=1500 h", "--json"], capsys)
    assert code == 0
    assert json.loads(out)["results"]["L10h"] == pytest.approx(1500.0, rel=1e-9)


@pytest.mark.parametrize(
    "extra",
    [["--solve", "c", "--target", "L10h=20000 h", "--speed", "0 rpm"],
     ["--solve", "fa", "--target", "s0=100"],
     ["--solve", "reliability", "--target", "Lnm=1e9 h"]],
)
def test_no_root_exits_nonzero_with_message(extra: list[str],
                                           capsys: pytest.CaptureFixture[str]) -> None:
    args = EXAMPLE.copy()
    if "--speed" in extra:
        args[args.index("--speed") + 1] = "0 rpm"
        extra = extra[:4]
    code, _, err = run(args + extra, capsys)
    assert code == 3
    assert err.strip()


# Issue 15, finding 3: invented inputs with the four speed roots the issue reports for an Lnm
# target (21.4, 925.9, 941.8, 1021.6 r/min; see tests/engine/test_solve.py::SPEED_CASE).
SEVERAL = ["calc", "--kind", "deep-groove", "--fr", "5 kN", "--c", "30 kN", "--c0", "18 kN",
           "--speed", "1000 rpm", "--nu", "21.908", "--dm", "50 mm", "--cleanliness", "0.5",
           "--cu", "1515.54 N", "--solve", "speed", "--target", "Lnm=16854 h"]


def test_several_roots_exit_3_listing_them(capsys: pytest.CaptureFixture[str]) -> None:
    """More than one speed meets the target: exit 3, one line listing every root (the issue's
    independent values), not grid ends."""
    code, out, err = run(SEVERAL, capsys)
    assert code == 3 and out == ""
    assert len(err.strip().splitlines()) == 1
    listed = err.split(" h: ")[1].split(" r/min")[0]
    roots = [float(text) for text in listed.split(", ")]
    assert roots == pytest.approx([21.4, 925.9, 941.8, 1021.6], rel=2e-4)
    assert "--between" in err


def test_several_roots_json_lists_them(capsys: pytest.CaptureFixture[str]) -> None:
    """--json: ``solved.roots`` holds every root, smallest first, ``value`` the smallest, the
    derivation is at it, and ``error`` says why the exit code is 3."""
    code, out, _ = run(SEVERAL + ["--json"], capsys)
    assert code == 3
    data = json.loads(out)
    roots = data["solved"]["roots"]
    assert roots == pytest.approx([21.4, 925.9, 941.8, 1021.6], rel=2e-4)
    assert roots == sorted(roots) and data["solved"]["value"] == roots[0]
    assert data["results"]["Lnm"] == pytest.approx(16854.0, rel=1e-9)
    assert "4 values" in data["error"]


def test_between_takes_units_and_narrows_to_one_root(capsys: pytest.CaptureFixture[str]) -> None:
    """--between LOW HIGH reads like --speed (here r/s): 15 to 15.6 r/s is 900 to 936 r/min."""
    code, out, _ = run(SEVERAL + ["--between", "15 r/s", "15.6 r/s", "--json"], capsys)
    assert code == 0
    solved = json.loads(out)["solved"]
    assert solved["roots"] == [solved["value"]]
    assert solved["value"] == pytest.approx(925.9, rel=2e-4)
    assert solved["searched"] == pytest.approx([900.0, 936.0])


@pytest.mark.parametrize("extra", [["--between", "9 kN", "2000 rpm"],
                                   ["--between", "2000 rpm", "900 rpm"],
                                   ["--between", "fast", "2000 rpm"]])
def test_bad_search_range_exits_2(extra: list[str], capsys: pytest.CaptureFixture[str]) -> None:
    code, _, err = run(SEVERAL + extra, capsys)
    assert code == 2
    assert "--between" in err and len(err.strip().splitlines()) == 1


def test_between_needs_a_question(capsys: pytest.CaptureFixture[str]) -> None:
    code, _, err = run(EXAMPLE + ["--between", "1 kN", "2 kN"], capsys)
    assert code == 2 and "--between" in err


def test_thrust_root_next_to_refused_loads(capsys: pytest.CaptureFixture[str]) -> None:
    """Issue 15, finding 2 (an independent implementation): Fr = 130.5 kN gives L10h = 40 h."""
    code, out, _ = run(["calc", "--kind", "thrust-ball", "--contact-angle", "60", "--fa",
                        "362.7 kN", "--fr", "100 kN", "--c", "300 kN", "--c0", "257.5 kN",
                        "--speed", "100 rpm", "--solve", "fr", "--target", "L10h=40 h", "--json"],
                       capsys)
    assert code == 0
    assert json.loads(out)["solved"]["value"] == pytest.approx(130.5e3, rel=5e-4)


def test_module_entry_point_runs() -> None:
    """``python -m workbench calc`` is the same command."""
    out = subprocess.run([sys.executable, "-m", "workbench", *EXAMPLE, "--json"],
                         capture_output=True, text=True, timeout=60)
    assert out.returncode == 0
    assert "results" in json.loads(out.stdout)
