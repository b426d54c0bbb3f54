"""Plain-text rendering of a derivation record, shared by ``calc`` and the text report."""

from __future__ import annotations

from .engine.record import Derivation


def derivation_text(derivation: Derivation) -> str:
    """Every step on its own lines: label, formula, the numbers put in, result and source."""
    lines: list[str] = []
    for step in derivation.steps:
        unit = f" {step.unit}" if step.unit else ""
        lines.append(f"{step.symbol:<9} {step.label}")
        lines.append(f"{'':<9}   {step.formula}")
        if step.substituted not in (step.formula, step.value_text):
            lines.append(f"{'':<9}   = {step.substituted}")
        lines.append(f"{'':<9}   = {step.value_text}{unit}    [{step.source}]")
        if step.note:
            lines.append(f"{'':<9}   note: {step.note}")
        if step.warning:
            lines.append(f"{'':<9}   WARNING: {step.warning}")
    if derivation.warnings:
        lines.append("")
        lines.append("Warnings:")
        lines.extend(f"  - {w}" for w in derivation.warnings)
    return "\n".join(lines)
