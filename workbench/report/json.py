"""JSON: the report document as one standard JSON object (RFC 8259: no NaN or infinity)."""

from __future__ import annotations

import json
import math
from typing import Any

from ..engine.record import Derivation
from .contents import CaseSection, DutySection, Report, ShaftSection


def json_safe(value: Any) -> Any:
    """``value`` with every NaN or infinity replaced by None, so the JSON is standard."""
    if isinstance(value, float) and not math.isfinite(value):
        return None
    if isinstance(value, dict):
        return {k: json_safe(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [json_safe(v) for v in value]
    return value


def _record(d: Derivation | None) -> dict[str, Any]:
    """Results, steps and warnings of a derivation (empty without one)."""
    record = d.as_dict() if d is not None else {"results": {}, "steps": [], "warnings": []}
    return {"results": record["results"], "steps": record["steps"], "warnings": record["warnings"]}


def _case(case: CaseSection) -> dict[str, Any]:
    return {
        "name": case.name,
        "bearing": case.bearing.name,
        "notes": case.notes,
        "inputs": {i.name: i.text for i in case.inputs},
        **_record(case.derivation),
        "static_only": case.static_only,
        "meets_life": case.meets_life,
        "meets_s0": case.meets_s0,
        "life_target_h": case.life_target_h,
        "error": case.error,
        "field_errors": case.field_errors,
        "generated": case.generated,
        "sensitivity": [item.as_dict() for item in case.sensitivity.items] if case.sensitivity
        else [],
    }


def _shaft(shaft: ShaftSection) -> dict[str, Any]:
    """Per state the typed texts, torque, speed, bearing loads and free-body record."""
    states = []
    for state in shaft.states:
        data: dict[str, Any] = {"name": state.name, "key": state.key, "error": state.error,
                                "typed": state.typed}
        if state.loads:
            data |= {"torque": state.torque, "speed": state.speed,
                     "bearings": {load.side: {"bearing": load.bearing, "fr": load.fr,
                                              "fa": load.fa} for load in state.loads},
                     **_record(state.derivation)}
        states.append(data)
    system = shaft.system
    return {
        "name": shaft.name, "key": shaft.key, "bearing_a": shaft.bearing_a,
        "bearing_b": shaft.bearing_b, "locating": shaft.locating, "error": shaft.error,
        "states": states,
        "system": None if system is None else {
            "life_mrev": system.life_mrev, "life_h": system.life_h,
            "weibull_slope": system.weibull_slope, "reliability": system.reliability,
            **_record(system.derivation)},
        "system_error": shaft.system_error,
    }


def _duty(duty: DutySection) -> dict[str, Any]:
    """Per state the shares, life and damage share, then the Miner life."""
    data: dict[str, Any] = {"name": duty.name, "key": duty.key, "shaft": duty.shaft,
                            "basis": duty.basis, "error": duty.error}
    if duty.derivation is None:
        return data | {"states": [{"case": s.case, "share": s.share} for s in duty.states]}
    return data | {
        "bearing": duty.bearing, "kind": duty.kind,
        "states": [{"case": s.case, "share": s.share, "time_share": s.time_share,
                    "revolution_share": s.revolution_share, "life_mrev": s.life_mrev,
                    "damage_share": s.damage_share} for s in duty.states],
        "life_mrev": duty.life_mrev, "mean_speed": duty.mean_speed, "life_h": duty.life_h,
        "reliability": duty.reliability, **_record(duty.derivation),
    }


def render(report: Report) -> str:
    """The report as one indented JSON object."""
    meta, solver = report.meta, report.solver
    solution = solver.solution if solver is not None else None
    data = {
        "meta": {
            "generated_at": meta.generated_at, "tool_version": meta.tool_version,
            "session_sha256": meta.session_sha256, "session_sha256_note": meta.hash_note,
            "session_file": meta.source,
            "title": meta.title, "project": meta.project, "engineer": meta.engineer,
            "revision": meta.revision,
        },
        "session": {
            "title": meta.title, "engineer": meta.engineer, "notes": meta.notes,
            "units": meta.units, "source": meta.source,
            "targets": {"life": meta.life_target, "reliability": meta.reliability,
                        "s0": meta.s0_target},
        },
        "bearings": [{"name": b.name, "kind": b.kind, "notes": b.notes,
                      "designation": b.designation, "source": b.source}
                     for b in report.bearings],
        "cases": [_case(case) for case in report.cases],
        "shafts": [_shaft(shaft) for shaft in report.shafts],
        "duty_cycles": [_duty(duty) for duty in report.duties],
        "solver": None if solver is None else {
            "case": solver.case, "unknown": solver.unknown, "target": solver.target,
            "solution": solution.as_dict() if solution else None,
            "results": solution.derivation.as_dict()["results"] if solution else None,
            "error": solver.error,
        },
        "sources": list(report.sources),
        "caution": report.caution,
    }
    return json.dumps(json_safe(data), indent=2, ensure_ascii=False, allow_nan=False) + "\n"
