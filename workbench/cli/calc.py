"""``workbench calc``: derive one load case, optionally back-solve one input."""

from __future__ import annotations

import argparse
from typing import TYPE_CHECKING

from ..model.fields import FIELDS, INSIDE_FIELDS, FieldError, inputs_from_texts
from .common import EXIT_NO_SOLUTION, fail, print_json

if TYPE_CHECKING:
    from ..engine.solve import Solution

SUMMARY = "derive one load case (and back-solve one input)"
DESCRIPTION = ("Derive one load case: equivalent loads, rating life, reliability, lubrication and "
               "static safety (ISO 281:2007, ISO 76:2006).")
CALC_FIELDS = tuple(spec for spec in FIELDS if spec.name not in INSIDE_FIELDS)
"""The fields ``calc`` takes: the fit (clearance, preload, tilt, moment) is ``workbench
internal``'s, as the ISO 281 chain does not read it."""
EPILOG = ("Values take units: \"2 kN\", \"450 lbf\", \"1200 r/min\", \"68 mm^2/s\", \"70 degC\". "
          "Exit codes: 2 bad input, 3 no solution.")


def add_arguments(parser: argparse.ArgumentParser) -> None:
    """A flag per field of :data:`CALC_FIELDS`, then the output and solver."""
    for spec in CALC_FIELDS:
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
    parser.add_argument("--between", nargs=2, metavar=("LOW", "HIGH"),
                        help="search the solved input only from LOW to HIGH, with units like its "
                             "own flag, e.g. --between \"500 r/min\" \"2000 r/min\"")
    parser.add_argument("--sensitivity", action="store_true",
                        help="add the elasticity of life to each numeric input")


def _texts_from_args(args: argparse.Namespace) -> dict[str, str]:
    """Typed text per field, as the session files and the screen keep it."""
    texts: dict[str, str] = {}
    for spec in CALC_FIELDS:
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


def _several_roots(solved: Solution) -> str:
    """More than one value meets the target: list them and say how to choose."""
    return solved.several_roots_message() + " (--between LOW HIGH)"


def run(args: argparse.Namespace) -> int:
    """Derive (or solve) the case given by the flags and print it."""
    from ..engine.derive import derive
    from ..engine.record import InputError
    from ..engine.solve import NoSolution, solve

    texts = _texts_from_args(args)
    texts.setdefault("kind", "deep-groove")
    try:
        case = inputs_from_texts(texts)
    except FieldError as exc:
        return fail(f"{_flag(exc.field)}: {exc.message}")
    solved = None
    try:
        if args.solve or args.target:
            if not (args.solve and args.target):
                return fail("--solve and --target go together")
            from ..model.targets import parse_between, parse_target_text

            try:
                target_name, target_value = parse_target_text(args.target)
            except FieldError as exc:
                return fail(f"--target: {exc.message}")
            try:
                between = parse_between(args.solve, args.between)
            except FieldError as exc:
                return fail(f"--between: {exc.message}")
            solved = solve(case, args.solve, target_name, target_value, between)
            derivation = solved.derivation
        elif args.between:
            return fail("--between goes with --solve and --target")
        else:
            derivation = derive(case)
    except NoSolution as exc:
        if args.json:
            print_json({"error": exc.message, "field": exc.field,
                        "reachable": list(exc.reachable) if exc.reachable else None}, indent=None)
        return fail(f"--solve {args.solve}: {exc.message}", EXIT_NO_SOLUTION)
    except InputError as exc:
        return fail(f"{_flag(exc.field)}: {exc.message}")
    sensitivity = None
    if args.sensitivity:
        from ..engine.sensitivity import sensitivity_of

        sensitivity = sensitivity_of(solved.inputs if solved else case)
    several = solved is not None and len(solved.roots) > 1
    if args.json:
        out = derivation.as_dict()
        if solved is not None:
            out["solved"] = solved.as_dict()
        if sensitivity is not None:
            out["sensitivity"] = [item.as_dict() for item in sensitivity]
        if solved is not None and several:
            out["error"] = _several_roots(solved)
        print_json(out)
        return fail(f"--solve {args.solve}: {out['error']}", EXIT_NO_SOLUTION) if several else 0
    if solved is not None and several:
        return fail(f"--solve {args.solve}: {_several_roots(solved)}", EXIT_NO_SOLUTION)
    from ..report.text import derivation_text, sensitivity_text

    print(derivation_text(derivation))
    if solved is not None:
        print(f"\nSolved {solved.unknown} = {solved.value:.6g} {solved.unit} "
              f"({solved.evaluations} evaluations, residual {solved.residual:.1e}, {solved.branch})")
    if sensitivity is not None:
        print("\n" + sensitivity_text(sensitivity))
    return 0
