"""What catalog selection needs from a session, and its candidates as plain rows.

Shared by ``workbench select`` and the screen's selection: the engine inputs of a session's cases
with its life target (:func:`selection_inputs`), and the best candidates of
:func:`workbench.engine.select.select` as rows of plain values (:func:`candidate_rows`).
"""

from __future__ import annotations

import math
from typing import Any, Sequence

from ..engine.derive import CaseInputs
from ..engine.record import InputError
from ..engine.select import Selection
from .catalog import Catalog
from .session import CaseResult
from .user_text import quoted


def _number(value: float) -> float | None:
    """NaN and infinities as JSON null."""
    return float(value) if math.isfinite(value) else None


def selection_inputs(results: Sequence[CaseResult]) -> tuple[list[CaseInputs], float]:
    """The engine inputs of the evaluated cases to select for, and the session's life target.

    InputError names the first case that cannot be read (field ``case``) or the missing life
    target (field ``targets.life``); the message says which.
    """
    for result in results:
        if result.inputs is None:
            raise InputError("case", f"case {quoted(result.case.name)}, {result.error_field}: "
                                     f"{result.error}")
    life_target = results[0].life_target_h if results else None
    if life_target is None:
        raise InputError("targets.life", "the session has no life target ([targets] life)")
    return [result.inputs for result in results if result.inputs is not None], life_target


def candidate_rows(catalog: Catalog, selection: Selection, case_names: list[str],
                   top: int) -> list[dict[str, Any]]:
    """The best ``top`` candidates (0: all) as plain rows: designation, kind, d, D, B, mass,
    life margin, governing case name, smallest s0 (NaN as None) and the note on what the ranking
    leaves to the maker's data ("" for nothing)."""
    chosen = selection.candidates if top <= 0 else selection.candidates[:top]
    return [{
        "designation": catalog.designations[c.index],
        "kind": str(catalog.kind[c.index]),
        "d_mm": float(catalog.d_mm[c.index]),
        "D_mm": float(catalog.D_mm[c.index]),
        "B_mm": float(catalog.B_mm[c.index]),
        "mass_kg": _number(catalog.mass_kg[c.index]),
        "life_margin": _number(c.life_margin),
        "governing_case": case_names[c.governing_case] if c.governing_case >= 0 else None,
        "min_s0": _number(c.min_s0),
        "note": c.note,
    } for c in chosen]


def not_qualifying_rows(catalog: Catalog, selection: Selection,
                        case_names: list[str]) -> list[dict[str, Any]]:
    """Every catalog bearing that does not qualify, in catalog order: designation, kind, the
    reason, and the case whose load its kind cannot carry (None for other reasons)."""
    return [{
        "designation": catalog.designations[i],
        "kind": str(catalog.kind[i]),
        "reason": reason,
        "case": case_names[selection.load_case[i]] if selection.load_case[i] >= 0 else None,
    } for i, reason in enumerate(selection.reason) if reason]
