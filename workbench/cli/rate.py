"""``workbench rate``: basic load ratings C and C0 of a special bearing from its geometry."""

from __future__ import annotations

import argparse

from .common import fail, print_json

SUMMARY = "rate a special bearing from its internal geometry"
DESCRIPTION = ("Basic dynamic and static load ratings from internal geometry "
               "(ISO 281:2007, ISO 76:2006).")
EPILOG = None


def add_arguments(parser: argparse.ArgumentParser) -> None:
    """A flag per input of the rating form, and ``--json``."""
    from ..engine.ratings import KINDS
    from ..model.rating_form import RATING_INPUTS

    for spec in RATING_INPUTS:
        parser.add_argument(spec.flag, dest=spec.name, required=spec.required,
                            choices=KINDS if spec.kind == "choice" else None,
                            help=f"{spec.label} ({spec.hint})")
    parser.add_argument("--json", action="store_true", help="print one JSON object")


def run(args: argparse.Namespace) -> int:
    """Rate the bearing the flags describe and print its derivation."""
    from ..model.fields import FieldError
    from ..model.rating_form import RATING_INPUT_BY_NAME, RATING_INPUTS, rate_texts
    from ..report.text import derivation_text

    texts = {spec.name: getattr(args, spec.name) or "" for spec in RATING_INPUTS}
    try:
        _, derivation = rate_texts(texts)
    except FieldError as exc:
        return fail(f"{RATING_INPUT_BY_NAME[exc.field].flag}: {exc.message}")
    if args.json:
        print_json(derivation.as_dict())
    else:
        print(derivation_text(derivation))
    return 0
