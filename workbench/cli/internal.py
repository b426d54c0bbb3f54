"""``workbench internal``: the load distribution inside one bearing, headless.

Flags: the geometry flags of ``workbench rate`` and the fit, loads and lubrication of
:data:`workbench.model.internal_form.INTERNAL_INPUTS`.  Text output: a summary, the element loads
round the ring, then every derivation step; ``--json`` one object (keys in the README).  Exit 2
with one line naming the flag for a bad input, and for loads no ring position can balance (the
line says "no equilibrium" and why).
"""

from __future__ import annotations

import argparse
import math
from typing import Any

from .common import fail, print_json

SUMMARY = "load distribution inside one bearing (element loads, pressure, stiffness, L10r)"
DESCRIPTION = ("Load distribution inside one bearing: element loads, load zone, contact pressure, "
               "stiffness and the reference rating life (Hertz, Sjövall, ISO/TS 16281), with the "
               "ISO 281 life beside it.")
EPILOG = ("Values take units: \"12.7 mm\", \"5 kN\", \"40 N·m\", \"1 mrad\". A negative clearance "
          "is a preload. Exit code 2: bad input, or no equilibrium.")


def add_arguments(parser: argparse.ArgumentParser) -> None:
    """A flag per input of the internal form (rate's geometry first), and ``--json``."""
    from ..model.internal_form import CHOICES, INTERNAL_INPUTS

    for spec in INTERNAL_INPUTS:
        choices = CHOICES.get(spec.name) if spec.kind == "choice" else None
        parser.add_argument(spec.flag, dest=spec.name, required=spec.required, choices=choices,
                            help=f"{spec.label} ({spec.hint})")
    parser.add_argument("--json", action="store_true", help="print one JSON object")


def run(args: argparse.Namespace) -> int:
    """Analyse the bearing the flags describe and print the result; 2 with one line on a refusal."""
    from ..engine.record import fmt
    from ..model.fields import FieldError
    from ..model.internal_form import INTERNAL_INPUT_BY_NAME, INTERNAL_INPUTS, NoEquilibrium, analyse_texts
    from ..report.text import derivation_text

    texts = {spec.name: getattr(args, spec.name) or "" for spec in INTERNAL_INPUTS}
    try:
        result = analyse_texts(texts)
    except FieldError as exc:
        return fail(f"{_flag(exc.field, INTERNAL_INPUT_BY_NAME)}: {exc.message}")
    except NoEquilibrium as exc:
        return fail(f"{_flag(exc.field, INTERNAL_INPUT_BY_NAME)}: no equilibrium: {exc.message}")
    if args.json:
        print_json(result.as_dict())
        return 0
    print("\n".join(summary_lines(result.as_dict(), fmt)))
    print()
    print(derivation_text(result.derivation))
    return 0


def _flag(name: str, specs: dict[str, Any]) -> str:
    spec = specs.get(name)
    return spec.flag if spec is not None else f"--{name.replace('_', '-')}"


def summary_lines(out: dict[str, Any], fmt: Any) -> list[str]:
    """The headline numbers and one line per element (row, ψ, Q, α, a bar of Q/Qmax in '#')."""
    from ..engine.record import with_unit

    q, k, p = out["displacement"], out["stiffness"], out["p_max_MPa"]
    lines = [
        f"{out['kind']} ({out['arrangement']}):  Qmax {fmt(out['q_max_N'])} N,  ε {fmt(out['epsilon'])},"
        f"  ψl ±{fmt(out['load_zone_deg'])}°",
        f"displacement: δr {fmt(q['radial_mm'])} mm, δa {fmt(q['axial_mm'])} mm,"
        f" θ {fmt(q['tilt_rad'])} rad;  moment {fmt(out['moment_Nmm'])} N·mm",
        f"pmax: inner {fmt(p['inner'])} MPa, outer {fmt(p['outer'])} MPa",
        f"stiffness: radial {fmt(k['radial_N_per_mm'])} N/mm, axial {fmt(k['axial_N_per_mm'])} N/mm,"
        f" tilt {fmt(k['tilt_Nmm_per_rad'])} N·mm/rad",
        f"L10r {with_unit(fmt(out['L10r']), '10⁶ rev')}   "
        f"L10 ISO 281 {with_unit(fmt(out['L10_iso281']), '10⁶ rev')}"
        + (f"   Lnmr {fmt(out['Lnmr'])}" if math.isfinite(out["Lnmr"]) else ""),
        "",
        "row     ψ (°)     Q (N)   α (°)",
    ]
    largest = max(out["q_max_N"], 1e-300)
    for element in out["elements"]:
        bar = "#" * round(30 * element["load_N"] / largest)
        lines.append(f"{element['row'] or '-':>3} {element['angle_deg']:>9.1f} {element['load_N']:>9.1f}"
                     f" {element['contact_angle_deg']:>7.2f}  {bar}")
    return lines
