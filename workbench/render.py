"""Plain-text rendering of a derivation record, shared by ``calc`` and the text report."""

from __future__ import annotations

from typing import TYPE_CHECKING, Sequence

from .engine.record import Derivation, fmt

if TYPE_CHECKING:
    from .engine.sensitivity import SensitivityItem


def step_lines(derivation: Derivation, indent: str = "  ") -> list[str]:
    """Numbered steps: symbol, label and source, then formula = numbers = result, notes, warnings."""
    lines: list[str] = []
    for index, step in enumerate(derivation.steps, start=1):
        unit = f" {step.unit}" if step.unit else ""
        lines.append(f"{indent}{index:2d}. {step.symbol}  {step.label}  [{step.source}]")
        worked = [step.formula, step.substituted, f"{step.value_text}{unit}"]
        lines.append(f"{indent}    " + "  =  ".join(dict.fromkeys(worked)))
        if step.note:
            lines.append(f"{indent}    note: {step.note}")
        if step.warning:
            lines.append(f"{indent}    WARNING: {step.warning}")
    return lines


def derivation_text(derivation: Derivation) -> str:
    """The whole derivation as text, with its warnings gathered at the end."""
    lines = step_lines(derivation, indent="")
    if derivation.warnings:
        lines += ["", "Warnings:", *(f"  - {w}" for w in derivation.warnings)]
    return "\n".join(lines)


SENSITIVITY_HEADERS = ("input", "value", "ε life", "ε s0", "−10 %", "+10 %", "method")


def sensitivity_rows(items: Sequence[SensitivityItem]) -> list[tuple[str, ...]]:
    """One row of display text per item, in the order of :data:`SENSITIVITY_HEADERS`."""
    return [
        (item.label, _with_unit(item.value, item.unit), signed(item.elasticity),
         signed(item.elasticity_s0), percent(item.minus10), percent(item.plus10), item.method)
        for item in items
    ]


def sensitivity_heading(items: Sequence[SensitivityItem]) -> str:
    """What the elasticities are of, in one line."""
    lives = ", ".join(sorted({item.life for item in items}))
    return f"Sensitivity of {lives}: ε = d ln L / d ln x; ±10 % = life change for x·0.9 and x·1.1"


def sensitivity_text(items: Sequence[SensitivityItem]) -> str:
    """The elasticity of life to each input as an aligned table, notes listed under it."""
    if not items:
        return "Sensitivity: no numeric input to vary."
    headers = SENSITIVITY_HEADERS
    rows = sensitivity_rows(items)
    widths = [max(len(h), *(len(r[i]) for r in rows)) for i, h in enumerate(headers)]
    right = (False, True, True, True, True, True, False)

    def line(cells: Sequence[str]) -> str:
        return "  ".join(c.rjust(w) if r else c.ljust(w)
                         for c, w, r in zip(cells, widths, right)).rstrip()

    lines = [sensitivity_heading(items), line(headers), line(["-" * w for w in widths])]
    lines.extend(line(r) for r in rows)
    notes = [(item.label, item.note) for item in items if item.note]
    if notes:
        lines += ["", "Notes:", *(f"  - {label}: {note}" for label, note in notes)]
    return "\n".join(lines)


def _with_unit(value: float, unit: str) -> str:
    return f"{fmt(value)} {unit}" if unit else fmt(value)


def signed(value: float | None) -> str:
    """An elasticity with its sign, three decimals ("n/a" when there is none)."""
    return "n/a" if value is None else f"{value + 0.0:+.3f}"


def percent(value: float | None) -> str:
    """A relative change as a signed percentage ("n/a" when there is none)."""
    return "n/a" if value is None else f"{100.0 * value + 0.0:+.1f} %"
