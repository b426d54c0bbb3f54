"""``workbench bench [--json] [--quick]``: speed figures measured on this machine, in one run.

Each figure is a median over repeated runs, but for the typing figures, 90th percentiles over
keys (:mod:`workbench.tui.bench`).  ``pint_ratio`` compares the engine with the same
chain of ISO 281 / ISO 76 relations evaluated on pint quantities throughout
(:func:`pint_chain`), which doubles as a unit cross-check in the tests.
"""

from __future__ import annotations

import argparse
import statistics
import time
from dataclasses import replace
from typing import Any, Callable

from ..engine.derive import CaseInputs, derive
from ..engine.internal.distribution import InternalInputs
from ..engine.kinds import Arrangement, Kind, dynamic_factors
from ..engine.life import a1_iso281
from .common import print_json

SUMMARY = "measure the speed figures on this machine"
DESCRIPTION = "Measure speed figures."
EPILOG = None

REFERENCE_CASE = CaseInputs(
    kind="deep-groove", fr=5200.0, fa=2500.0, c=33000.0, c0=19000.0, f0=14.0, speed=1450.0,
    af=1.2, reliability=0.95, vg=68.0, temp=70.0, dm=47.5, cleanliness="normal",
)


# A deep-groove bearing with clearance under combined load, lubrication given: one internal
# analysis with every step recorded (the figure internal_ms), and its life against clearance.
REFERENCE_INTERNAL = InternalInputs(
    kind="deep-groove", z=9, dw=12.7, dpw=65.0, clearance=0.015, fr=5200.0, fa=1100.0,
    speed=1450.0, nu=30.0, ec=0.5,
)


def _median_seconds(func: Callable[[], object], repeats: int, inner: int = 1) -> float:
    """Median wall time of ``inner`` calls, per call, over ``repeats`` rounds."""
    samples = []
    for _ in range(repeats):
        start = time.perf_counter()
        for _ in range(inner):
            func()
        samples.append((time.perf_counter() - start) / inner)
    return statistics.median(samples)


def pint_chain(case: CaseInputs) -> dict[str, float]:
    """P, L10, L10h, a1, Lnm (h, aISO = 1), P0 and s0 of a deep-groove case on pint quantities.

    The same relations as the engine (ISO 281:2007 §5.2–§5.3, Table 12; ISO 76:2006 §5.2), with
    every force, speed and life a pint Quantity; only the table lookup reads magnitudes.
    """
    from ..model.quantities import unit_registry

    u = unit_registry()
    fr, fa = case.fr * u.newton, case.fa * u.newton
    c, c0 = case.c * u.newton, case.c0 * u.newton
    speed = case.speed * u.turn / u.minute
    f = dynamic_factors(Kind.DEEP_GROOVE, Arrangement.SINGLE, 0.0, fa.magnitude, c0.magnitude,
                        case.f0)
    high = (fa / fr).to("dimensionless").magnitude > f.e
    x, y = (f.x_high, f.y_high) if high else (f.x_low, f.y_low)
    p = x * fr + y * fa
    l10 = ((c / (case.af * p)).to("dimensionless") ** 3) * 1e6 * u.turn
    l10h = (l10 / speed).to(u.hour)
    a1 = a1_iso281(case.reliability)
    lnm = (a1 * l10h).to(u.hour)
    p0 = max(0.6 * fr + 0.5 * fa, fr)
    s0 = (c0 / p0).to("dimensionless")
    return {"P": p.to(u.newton).magnitude, "L10": l10.to(u.turn).magnitude / 1e6,
            "L10h": l10h.magnitude, "a1": a1, "Lnm": lnm.magnitude,
            "P0": p0.to(u.newton).magnitude, "s0": s0.magnitude}


def _engine_figures(repeats: int) -> dict[str, Any]:
    from ..engine.solve import solve

    case_eval = _median_seconds(lambda: derive(REFERENCE_CASE), repeats, 200)
    cases = [replace(REFERENCE_CASE, fr=3000.0 + 40.0 * i, fa=500.0 + 30.0 * i) for i in range(100)]
    session100 = _median_seconds(lambda: [derive(c) for c in cases], max(5, repeats // 4))
    plain = replace(REFERENCE_CASE, vg=None, temp=None, dm=None, cleanliness=None)
    ours = _median_seconds(lambda: derive(plain), repeats, 100)
    pint_chain(plain)  # load the registry before timing
    with_pint = _median_seconds(lambda: pint_chain(plain), max(5, repeats // 4), 10)
    evaluations: list[int] = []

    def one_solve() -> None:
        evaluations.append(solve(REFERENCE_CASE, "c", "Lnm", 25000.0).evaluations)

    solve_time = _median_seconds(one_solve, max(10, repeats // 2))
    internal, sweep = _internal_figures(repeats)
    return {
        "case_eval_us": case_eval * 1e6,
        "session100_ms": session100 * 1e3,
        "pint_ratio": with_pint / ours,
        "solve_ms": solve_time * 1e3,
        "solve_evals": statistics.median(evaluations),
        "internal_ms": internal * 1e3,
        "internal_sweep_ms": sweep * 1e3,
    }


def _internal_figures(repeats: int) -> tuple[float, float]:
    """Median seconds of one internal analysis (steps kept) and of the 25-point life-against-
    clearance sweep the What-if plot draws (engine/internal)."""
    from ..engine.internal.analysis import analyse_internal, clearance_sweep, default_clearances

    analyse_internal(REFERENCE_INTERNAL)  # scipy's modules load before timing
    one = _median_seconds(lambda: analyse_internal(REFERENCE_INTERNAL), repeats, 5)
    clearances = default_clearances(REFERENCE_INTERNAL, count=25)
    sweep = _median_seconds(lambda: clearance_sweep(REFERENCE_INTERNAL, clearances), max(5, repeats // 4))
    return one, sweep


def _large_session_figures(repeats: int, cases: int = 1000) -> dict[str, Any]:
    """``open1000_ms``: read a 1,000-case session file (the screen's open); ``report1000_ms``:
    its text report (analysis, derivations, layout).  Goal: each ≤ 2 s."""
    import tempfile
    from pathlib import Path

    from ..model.sample_sessions import shared_bearing_session
    from ..model.sessionfile import dumps_session, open_session
    from ..report import render_report

    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / "large.toml"
        path.write_text(dumps_session(shared_bearing_session(cases)), encoding="utf-8")
        opened = open_session(path)
        assert opened.session is not None, opened.error
        open_time = _median_seconds(lambda: open_session(path), repeats)
        report_time = _median_seconds(lambda: render_report(opened.session, "text", str(path)),
                                      repeats)
    return {f"open{cases}_ms": open_time * 1e3, f"report{cases}_ms": report_time * 1e3}


def run_benchmarks(quick: bool = False) -> dict[str, Any]:
    """Every figure of the project, as one mapping (see the README for the goals)."""
    repeats = 8 if quick else 40
    figures: dict[str, Any] = _engine_figures(repeats)
    from ..engine.sensitivity import benchmark_sensitivity

    figures.update(benchmark_sensitivity(repeats=20 if quick else 200))
    from ..engine.select import benchmark_select

    figures.update(benchmark_select(n_bearings=1000 if quick else 10000))
    figures.update(_large_session_figures(repeats=1 if quick else 3))
    from ..tui import bench as screen

    figures.update(screen.measure_clearance_curve(5 if quick else 20))
    figures.update(screen.measure_typing(
        screen.QUICK_TYPING_KEYS if quick else screen.TYPING_KEYS))
    figures.update(screen.measure_startup(
        screen.QUICK_STARTUP_ROUNDS if quick else screen.STARTUP_ROUNDS))
    from ..tui import bench_large

    figures.update(bench_large.measure_large(quick))
    return figures


def add_arguments(parser: argparse.ArgumentParser) -> None:
    parser.add_argument("--json", action="store_true", help="print one JSON object")
    parser.add_argument("--quick", action="store_true", help="fewer repetitions (a smoke run)")


def run(args: argparse.Namespace) -> int:
    """Measure every figure and print them."""
    figures = run_benchmarks(quick=args.quick)
    if args.json:
        print_json(figures)
    else:
        for key, value in figures.items():
            if isinstance(value, dict):  # a figure's parts (echo_settle: one line a combination)
                print(f"{key:>16}")
                for part, numbers in value.items():
                    print(f"{part:>16}  " + "  ".join(f"{name} {number:.4g}"
                                                      for name, number in numbers.items()))
            else:
                print(f"{key:>16}  {value:.4g}" if isinstance(value, float)
                      else f"{key:>16}  {value}")
    return 0
