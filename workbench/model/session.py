"""A session: the bearings, the load cases that use them, the targets, and what the solver asks.

Every value is kept as the text a person typed ("5.2 kN"), so a session file reads and edits by
hand and shows again exactly as typed; :func:`evaluate_case` turns that text into engine numbers
through :mod:`workbench.model.fields` and runs the engine's derivation.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from ..engine.derive import CaseInputs, derive
from ..engine.record import Derivation, InputError
from .quantities import QuantityError, parse
from .fields import BEARING_FIELDS, CASE_FIELDS, FieldError, inputs_from_values, parse_field
from .user_text import quoted

SCHEMA_VERSION = 2
"""Schema 2 added a bearing's internal geometry (``[bearings.geometry]``) and the fit fields
(clearance, preload; tilt, moment); a session without them is still written as schema 1."""
UNIT_SYSTEMS = ("SI", "US")
GEOMETRY_KEYS = ("rows", "elements", "dw", "dpw", "lwe", "bm", "fi", "fe", "profile",
                 "crown_drop", "slices", "row_spacing")
"""A bearing's internal geometry, as the rating form and ``workbench rate``/``internal`` name
it (:mod:`workbench.model.internal_form`); the kind, contact angle and f0 are bearing fields."""


@dataclass
class Bearing:
    """A bearing the session's cases can use; ``texts`` holds its bearing fields as typed."""

    name: str
    texts: dict[str, str] = field(default_factory=dict)
    notes: str = ""
    designation: str = ""  # the maker's or catalog's name for it, once one is adopted
    source: str = ""  # where its data came from: "catalog FILE, row N" or "rated from geometry"
    geometry: dict[str, str] = field(default_factory=dict)
    """Its internal geometry as typed (keys of :data:`GEOMETRY_KEYS`), for the inside view;
    empty when unknown."""


@dataclass
class LoadCase:
    """One operating condition on one bearing; ``texts`` holds the case fields as typed."""

    name: str
    bearing: str
    texts: dict[str, str] = field(default_factory=dict)
    notes: str = ""


@dataclass
class Targets:
    """What every case must meet: a life in hours (on Lnm), a reliability, a static safety."""

    life: str = ""
    reliability: str = "0.90"
    s0: str = ""


@dataclass
class SolverSetup:
    """The reverse question: which input is unknown, which result must reach which value.

    A blank ``target`` follows the session's life target on Lnm (what every case must meet;
    :func:`workbench.model.targets.solver_target`): a life target set for the session is the
    one an engineer expects the solver to aim at until they give it another."""

    unknown: str = "c"
    target: str = ""
    case: str = ""


@dataclass
class Session:
    """Everything a colleague needs to reopen the work."""

    title: str = "Untitled session"
    engineer: str = ""
    notes: str = ""
    units: str = "SI"
    targets: Targets = field(default_factory=Targets)
    bearings: list[Bearing] = field(default_factory=list)
    cases: list[LoadCase] = field(default_factory=list)
    solver: SolverSetup = field(default_factory=SolverSetup)
    reserved: dict[str, object] = field(default_factory=dict)  # duty_cycles, shafts: kept as read
    project: str = ""
    revision: str = ""  # the document's own revision mark, as the engineer writes it

    def bearing(self, name: str) -> Bearing | None:
        """The bearing called ``name``, or None."""
        for item in self.bearings:
            if item.name == name:
                return item
        return None

    def case(self, name: str) -> LoadCase | None:
        """The load case called ``name``, or None."""
        for item in self.cases:
            if item.name == name:
                return item
        return None


@dataclass
class CaseResult:
    """A case evaluated: its derivation (None when it could not be derived) and what went wrong."""

    case: LoadCase
    derivation: Derivation | None
    inputs: CaseInputs | None
    field_errors: dict[str, str]
    error: str | None
    error_field: str | None
    life_target_h: float | None
    s0_target: float | None
    static_only: bool = False
    """A static check: judged on s0 alone, its life shown for completeness only."""

    @property
    def meets_life(self) -> bool | None:
        """True/False against the session's life target on Lnm; None when there is no verdict
        (no target, a static check, or no life)."""
        if self.derivation is None or self.life_target_h is None or self.static_only:
            return None
        lnm = self.derivation.results.get("Lnm", math.nan)
        if math.isnan(lnm):
            return None
        return lnm >= self.life_target_h

    @property
    def meets_s0(self) -> bool | None:
        """True/False against the static safety minimum in force for the case."""
        if self.derivation is None:
            return None
        return self.derivation.results["s0"] >= self.derivation.results["s0_min"]


def case_texts(session: Session, case: LoadCase) -> dict[str, str]:
    """The typed text of every input of ``case``: its bearing's fields, then its own."""
    bearing = session.bearing(case.bearing)
    texts = {name: "" for name in BEARING_FIELDS + CASE_FIELDS}
    if bearing is not None:
        texts.update({k: v for k, v in bearing.texts.items() if k in BEARING_FIELDS})
    texts.update({k: v for k, v in case.texts.items() if k in CASE_FIELDS})
    if not texts.get("reliability", "").strip():
        texts["reliability"] = session.targets.reliability
    return texts


def parse_target(name: str, text: str) -> float | None:
    """A session target as a number (life in h, s0 plain), None when blank."""
    if not text.strip():
        return None
    try:
        if name == "life":
            return parse(text, "time", default_unit="h")
        return parse(text, "dimensionless", default_unit="")
    except QuantityError as exc:
        raise FieldError(name, exc.message) from None


def evaluate_case(session: Session, case: LoadCase, *, keep_steps: bool = True) -> CaseResult:
    """Parse the case's texts and derive it; every problem is returned, none is raised.

    ``keep_steps=False`` records results and warnings only (the list, the summaries); a
    person reading the derivation gets the case derived with its steps."""
    texts = case_texts(session, case)
    values: dict[str, object] = {}
    errors: dict[str, str] = {}
    for name, text in texts.items():
        try:
            values[name] = parse_field(name, text)
        except FieldError as exc:
            errors[name] = exc.message
    life_target = s0_target = None
    try:
        life_target = parse_target("life", session.targets.life)
        s0_target = parse_target("s0", session.targets.s0)
    except FieldError as exc:
        errors[f"targets.{exc.field}"] = exc.message
    if s0_target is not None and values.get("s0_min") is None:
        values["s0_min"] = s0_target
    if session.bearing(case.bearing) is None:
        errors["bearing"] = f"no bearing called {quoted(case.bearing)} in this session"
    static_only = bool(values.get("static_only"))
    if errors:
        first = next(iter(errors))
        return CaseResult(case, None, None, errors, errors[first], first, life_target, s0_target,
                          static_only)
    inputs = inputs_from_values(values)
    try:
        derivation = derive(inputs, keep_steps=keep_steps)
    except InputError as exc:
        return CaseResult(case, None, inputs, {}, exc.message, exc.field, life_target, s0_target,
                          static_only)
    return CaseResult(case, derivation, inputs, {}, None, None, life_target, s0_target,
                      static_only)


def evaluate(session: Session) -> list[CaseResult]:
    """Every case of the session, in order."""
    return [evaluate_case(session, case) for case in session.cases]
