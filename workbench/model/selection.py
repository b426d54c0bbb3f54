"""What catalog selection needs from a session, and its candidates as plain rows.

Shared by ``workbench select`` and the screen's selection: the engine inputs of a session's cases
with its life target (:func:`selection_inputs`), and the best candidates of
:func:`workbench.engine.select.select` as rows of plain values (:func:`candidate_rows`).
"""

from __future__ import annotations

import math
from typing import Any, Sequence

from ..engine.derive import CaseInputs
from ..engine.kinds import (
    KIND_WORDS, Arrangement, Kind, is_bearing_set, parse_arrangement, parse_kind, rating_clause,
    set_exponent_words, set_words, static_rating_clause,
)
from ..engine.record import InputError, fmt
from ..engine.select import Selection, mounted_as
from .catalog import KN, Catalog
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


def position_arrangement(inputs: Sequence[CaseInputs]) -> str:
    """The arrangement of the bearing position the cases describe: the one their bearing has
    ("single" when the cases name several, as ``workbench select`` without ``--bearing`` may)."""
    arrangements = {_arrangement_of(case) for case in inputs}
    return arrangements.pop() if len(arrangements) == 1 else Arrangement.SINGLE.value


def _arrangement_of(case: CaseInputs) -> str:
    """The case's arrangement as the engine reads it (a spherical "single" is double-row)."""
    try:
        return parse_arrangement(parse_kind(case.kind), case.arrangement).value
    except InputError:
        return case.arrangement


def catalog_as_position(catalog: Catalog, inputs: Sequence[CaseInputs]) -> Catalog:
    """The catalog rated as the cases' bearing position is mounted: where it is a pair
    (tandem, back-to-back, face-to-face), each single-row bearing of a kind that comes so is
    rated as a pair of it (:func:`workbench.engine.select.mounted_as`), so the ranking, the
    rows and the adopted texts all describe the pair the session describes."""
    rated, _ = mounted_as(catalog, position_arrangement(inputs))
    return rated


def position_words(position: str) -> str:
    """How a pair position rates the catalog, in a sentence ("" for a single or double-row one)."""
    if not _is_set(position):
        return ""
    return (f"Each single-row bearing of a kind that comes as a {set_words(Arrangement(position))} "
            "is rated as a pair of it: C = 2^0.7·C (ball) or 2^(7/9)·C (roller), C0 = 2·C0 "
            "(ISO 281:2007 §5.1/§7.1, ISO 76:2006 §5.1/§7.1).")


def pair_step_words(kind: Kind, arrangement: Arrangement, *, c_one: float, c_pair: float,
                    c0_one: float, c0_pair: float) -> str:
    """The step from one bearing's ratings to its pair's (N in, kN written): "as a back-to-back
    pair of two: C = 2^0.7 × … kN = … kN, C0 = 2 × … kN = … kN (ISO 281:2007 §5.1, ISO 76:2006
    §5.1)"."""
    return (f"as a {set_words(arrangement)} of two: "
            f"C = 2^{set_exponent_words(kind)} × {fmt(c_one / KN)} kN = {fmt(c_pair / KN)} kN, "
            f"C0 = 2 × {fmt(c0_one / KN)} kN = {fmt(c0_pair / KN)} kN "
            f"({rating_clause(kind)}, {static_rating_clause(kind)})")


def mounting_words(listed: Catalog, rated: Catalog, i: int, position: str) -> str:
    """What adopting row ``i`` of ``rated`` (``listed`` as the file gives it) does to the
    position's arrangement ``position``, in words; "" when the row is taken as listed into a
    position of its own arrangement.

    A pair made of a single-row bearing states its ratings' step (ISO 281:2007 §5.1/§7.1,
    ISO 76:2006 §5.1/§7.1); any other change of arrangement is said, with why (a kind that
    does not come as the position's pair, or the catalog's own arrangement)."""
    arrangement = str(rated.arrangement[i])
    if arrangement != str(listed.arrangement[i]) and rated.c_n[i] != listed.c_n[i]:
        return "rated and adopted " + pair_step_words(
            Kind(str(rated.kind[i])), Arrangement(arrangement), c_one=float(listed.c_n[i]),
            c_pair=float(rated.c_n[i]), c0_one=float(listed.c0_n[i]), c0_pair=float(rated.c0_n[i]))
    if position == arrangement:
        return ""
    if _is_set(position) and not _is_set(arrangement):
        words = KIND_WORDS[Kind(str(rated.kind[i]))]  # a catalog row's kind is read and checked
        return (f"arrangement {position} → {arrangement}: a {words} does not come as a "
                f"{set_words(Arrangement(position))}")
    return f"arrangement {position} → {arrangement}, as the catalog lists it"


def _is_set(arrangement: str) -> bool:
    try:
        return is_bearing_set(Arrangement(arrangement))
    except ValueError:
        return False


def candidate_rows(catalog: Catalog, selection: Selection, case_names: list[str],
                   top: int) -> list[dict[str, Any]]:
    """The best ``top`` candidates (0: all) as plain rows: designation, kind, the arrangement it
    was rated as, d, D, B, mass, life margin, governing case name, smallest s0 (NaN as None) and
    the note on what the ranking leaves to the maker's data ("" for nothing)."""
    chosen = selection.candidates if top <= 0 else selection.candidates[:top]
    return [{
        "designation": catalog.designations[c.index],
        "kind": str(catalog.kind[c.index]),
        "arrangement": str(catalog.arrangement[c.index]),
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
