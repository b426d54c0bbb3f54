"""Command line: the screen by default, and headless ``calc``, ``report``, ``select``, ``rate``,
``bench``.

Exit codes: 0 success, 2 a bad input or file (one line on standard error naming it), 3 a question
the solver cannot answer (no root, or more than one).
"""

from __future__ import annotations

import argparse
import json
import math
import sys
from typing import Any, Sequence

from .model.fields import FIELDS, FieldError, inputs_from_texts

SUBCOMMANDS = ("calc", "report", "select", "rate", "bench")
EXIT_BAD_INPUT = 2
EXIT_NO_SOLUTION = 3


def _clean(value: Any) -> Any:
    """NaN and infinities become null in JSON output."""
    if isinstance(value, float) and not math.isfinite(value):
        return None
    if isinstance(value, dict):
        return {k: _clean(v) for k, v in value.items()}
    if isinstance(value, list):
        return [_clean(v) for v in value]
    return value


def _fail(message: str, code: int = EXIT_BAD_INPUT) -> int:
    print(f"workbench: {message}", file=sys.stderr)
    return code


def _calc_parser() -> argparse.ArgumentParser:
    parser = argparse.ArgumentParser(
        prog="workbench calc",
        description="Derive one load case: equivalent loads, rating life, reliability, "
                    "lubrication and static safety (ISO 281:2007, ISO 76:2006).",
        epilog="Values take units: \"2 kN\", \"450 lbf\", \"1200 rpm\", \"68 mm^2/s\", \"70 degC\". "
               "Exit codes: 2 bad input, 3 no solution.",
    )
    for spec in FIELDS:
        if spec.kind == "switch":
            parser.add_argument(spec.flag, dest=spec.name, action="store_true", help=spec.label)
            continue
        help_text = spec.label
        if spec.choices:
            help_text += f" ({', '.join(spec.choices)})"
        if spec.hint:
            help_text += f"; {spec.hint}"
        parser.add_argument(spec.flag, dest=spec.name, metavar="VALUE", help=help_text)
    parser.add_argument("--json", action="store_true", help="print one JSON object")
    parser.add_argument("--solve", metavar="NAME",
                        help="back-solve this input (c, c0, fr, fa, load_scale, speed, reliability, af)")
    parser.add_argument("--target", metavar="RESULT=VALUE",
                        help="the result the solved input must meet, e.g. \"Lnm=20000 h\"")
    parser.add_argument("--sensitivity", action="store_true",
                        help="add the elasticity of life to each numeric input")
    return parser


def _texts_from_args(args: argparse.Namespace) -> dict[str, str]:
    """Typed text per field, as the session files and the screen keep it."""
    texts: dict[str, str] = {}
    for spec in FIELDS:
        value = getattr(args, spec.name)
        if spec.kind == "switch":
            texts[spec.name] = "yes" if value else "no"
        elif value is not None:
            texts[spec.name] = value
    return texts


def _flag(name: str) -> str:
    for spec in FIELDS:
        if spec.name == name:
            return spec.flag
    return name if name.startswith("--") else f"--{name.replace('_', '-')}"


def run_calc(argv: Sequence[str]) -> int:
    """``workbench calc``: derive one case, optionally back-solve one input."""
    from .engine.record import InputError
    from .engine.derive import derive
    from .engine.solve import NoSolution, solve

    args = _calc_parser().parse_args(argv)
    texts = _texts_from_args(args)
    texts.setdefault("kind", "deep-groove")
    try:
        case = inputs_from_texts(texts)
    except FieldError as exc:
        return _fail(f"{_flag(exc.field)}: {exc.message}")
    solved = None
    try:
        if args.solve or args.target:
            if not (args.solve and args.target):
                return _fail("--solve and --target go together")
            from .model.targets import parse_target_text

            try:
                target_name, target_value = parse_target_text(args.target)
            except FieldError as exc:
                return _fail(f"--target: {exc.message}")
            solved = solve(case, args.solve, target_name, target_value)
            derivation = solved.derivation
        else:
            derivation = derive(case)
    except NoSolution as exc:
        if args.json:
            print(json.dumps(_clean({"error": exc.message, "field": exc.field,
                                     "reachable": list(exc.reachable) if exc.reachable else None})))
        return _fail(f"--solve {args.solve}: {exc.message}", EXIT_NO_SOLUTION)
    except InputError as exc:
        return _fail(f"{_flag(exc.field)}: {exc.message}")
    sensitivity = None
    if args.sensitivity:
        from .engine.sensitivity import sensitivity_of

        sensitivity = sensitivity_of(solved.inputs if solved else case)
    if args.json:
        out = derivation.as_dict()
        if solved is not None:
            out["solved"] = solved.as_dict()
        if sensitivity is not None:
            out["sensitivity"] = [item.as_dict() for item in sensitivity]
        print(json.dumps(_clean(out), ensure_ascii=False, indent=2))
        return 0
    from .render import derivation_text

    print(derivation_text(derivation))
    if solved is not None:
        print(f"\nSolved {solved.unknown} = {solved.value:.6g} {solved.unit} "
              f"({solved.evaluations} evaluations, residual {solved.residual:.1e}, {solved.branch})")
    if sensitivity is not None:
        from .render import sensitivity_text

        print("\n" + sensitivity_text(sensitivity))
    return 0


def run_report_command(argv: Sequence[str]) -> int:
    """``workbench report FILE [--format text|markdown|json] [-o OUT]``."""
    parser = argparse.ArgumentParser(prog="workbench report",
                                     description="Report every load case of a session.")
    parser.add_argument("file", help="session file (.toml)")
    parser.add_argument("--format", choices=("text", "markdown", "json"), default="text")
    parser.add_argument("-o", "--output", help="write here instead of standard output")
    args = parser.parse_args(argv)
    from .report import run_report

    return run_report(args.file, args.format, args.output)


def run_select_command(argv: Sequence[str]) -> int:
    """``workbench select SESSION --catalog FILE [--json] [--top N]``."""
    from .model.select_cli import run_select

    return run_select(argv)


def run_rate_command(argv: Sequence[str]) -> int:
    """``workbench rate``: basic load ratings C and C0 of a special bearing from its geometry."""
    from .engine.ratings import KINDS
    from .model.fields import FieldError
    from .model.rating_form import RATING_INPUT_BY_NAME, RATING_INPUTS, rate_texts
    from .render import derivation_text

    parser = argparse.ArgumentParser(
        prog="workbench rate",
        description="Basic dynamic and static load ratings from internal geometry "
                    "(ISO 281:2007, ISO 76:2006).")
    for spec in RATING_INPUTS:
        parser.add_argument(spec.flag, dest=spec.name, required=spec.required,
                            choices=KINDS if spec.kind == "choice" else None,
                            help=f"{spec.label} ({spec.hint})")
    parser.add_argument("--json", action="store_true", help="print one JSON object")
    args = parser.parse_args(argv)
    texts = {spec.name: getattr(args, spec.name) or "" for spec in RATING_INPUTS}
    try:
        _, derivation = rate_texts(texts)
    except FieldError as exc:
        return _fail(f"{RATING_INPUT_BY_NAME[exc.field].flag}: {exc.message}")
    if args.json:
        print(json.dumps(_clean(derivation.as_dict()), ensure_ascii=False, indent=2))
    else:
        print(derivation_text(derivation))
    return 0


def run_bench_command(argv: Sequence[str]) -> int:
    """``workbench bench [--json]``: the speed figures, measured here and now."""
    parser = argparse.ArgumentParser(prog="workbench bench", description="Measure speed figures.")
    parser.add_argument("--json", action="store_true", help="print one JSON object")
    parser.add_argument("--quick", action="store_true", help="fewer repetitions (a smoke run)")
    args = parser.parse_args(argv)
    from .bench import run_benchmarks

    figures = run_benchmarks(quick=args.quick)
    if args.json:
        print(json.dumps(_clean(figures), indent=2))
    else:
        for key, value in figures.items():
            print(f"{key:>16}  {value:.4g}" if isinstance(value, float) else f"{key:>16}  {value}")
    return 0


def run_screen(argv: Sequence[str]) -> int:
    """``workbench [FILE]``: open the workbench screen on a session, or on the built-in demo."""
    parser = argparse.ArgumentParser(
        prog="workbench",
        description="Rolling-bearing workbench for combined radial and axial load. "
                    "Sub-commands: calc, report, select, rate, bench (see 'workbench calc --help').",
    )
    parser.add_argument("file", nargs="?", help="session file to open (default: the demo session)")
    args = parser.parse_args(argv)
    from .tui.app import run_app

    return run_app(args.file)


def main(argv: Sequence[str] | None = None) -> int:
    """Entry point of the ``workbench`` console script and ``python -m workbench``."""
    argv = list(sys.argv[1:] if argv is None else argv)
    commands = {"calc": run_calc, "report": run_report_command, "select": run_select_command,
                "rate": run_rate_command, "bench": run_bench_command}
    if argv and argv[0] in commands:
        return commands[argv[0]](argv[1:])
    return run_screen(argv)


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
