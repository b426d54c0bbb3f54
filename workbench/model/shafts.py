"""Shafts: where the bearing loads come from, turned into load cases the engine already derives.

A :class:`Shaft` sits on two bearings of the session (A at the smaller axial position, B at the
larger) and carries gears and pulleys (:class:`Element`); each :class:`OperatingState` gives the
torque (or power) and speed it runs at and its share of the time.  Like the rest of the session,
every value is the text a person typed ("80 mm", "20°", "15 kW").

:func:`solve_shaft` turns the texts into the engine's inputs and has the engine work the free
body of one state: the mesh or belt force of each element by the gear-force relations and the
bearing reactions by shaft statics (:mod:`workbench.engine.shaft`), and for a pair of
angular-contact or tapered roller bearings adjusted against each other the axial loads by the
two-bearing thrust-sharing rule (:mod:`workbench.engine.pairs`).
:func:`generated_cases` turns each shaft × state × bearing into an ordinary :class:`LoadCase`, so
``evaluate_case``, the solver and the selection apply to it unchanged.

Frame and signs (those of :mod:`workbench.engine.gears`): x runs along the shaft from A toward B;
y and z are transverse, right-handed.  ``rotation = "+"`` turns the shaft positively about +x
(clockwise as seen from A looking toward B), ``"-"`` the other way.  ``mesh_angle`` is the
direction in the y–z plane, from +y toward +z, from this shaft's axis toward the mating gear (the
mesh point lies there at the pitch radius) or toward the other pulley (the belt pull points
there).  A straight bevel gear's ``apex`` says on which side of the gear its pitch-cone apex lies
("A" or "B"); its thrust points away from the apex.

Table layout (TOML, an array of tables; every value is text)::

    [[shafts]]
    name = "input shaft"
    bearing_a = "DG-45-85"           # a bearing of the session, at position_a
    bearing_b = "TR-40-90"
    position_a = "0 mm"
    position_b = "210 mm"            # greater than position_a
    locating = "B"                   # "A", "B" (that bearing takes all thrust) or "pair"
    mounting = ""                    # "O" or "X" for a pair, else blank
    rotation = "+"                   # "+" or "-" about +x (default "+")
    [shafts.case_fields]             # other case inputs copied into every generated case
    reliability = "0.95"
    [[shafts.elements]]
    name = "pinion"
    kind = "helical"                 # "spur", "helical", "bevel" or "pulley"
    position = "70 mm"
    diameter = "62 mm"               # pitch (spur, helical), mean pitch (bevel), pulley diameter
    pressure_angle = "20°"           # normal pressure angle for a helical gear
    helix_angle = "15°"
    hand = "right"
    driving = "yes"                  # does this element drive its mate?
    mesh_angle = "90°"
    share = "1"                      # fraction of the state's torque this element carries
    [[shafts.states]]
    name = "full load"
    power = "15 kW"                  # or torque = "97 N·m"
    speed = "1480 r/min"
    share = "0.7"                    # of the time

Errors are :class:`~workbench.model.fields.FieldError` naming the key, counted from 1 like the
session file: ``shafts[1].elements[2].helix_angle``.

Y for the induced thrust: a pair's bearings are read from the session as
:class:`~workbench.engine.pairs.PairBearing`; :func:`~workbench.engine.pairs.induced_thrust` takes
the very Y (or e) the bearing's own derivation shows on the Fa/Fr > e branch.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Iterator, Mapping, Sequence
from contextlib import contextmanager
from dataclasses import dataclass, field, fields
from typing import Any

from ..engine.derive import validate
from ..engine.kinds import Arrangement, Kind
from ..engine.pairs import SIDES, PairBearing, paired_axial_loads
from ..engine.record import Derivation, InputError
from ..engine.shaft import (
    PointLoad, ShaftElement, ShaftLayout, ShaftReactions, derivation_steps, element_load,
    shaft_torque, solve_reactions,
)
from .fields import BEARING_FIELDS, CASE_FIELDS, FieldError, inputs_from_values, parse_field
from .quantities import QuantityError, parse
from .session import LoadCase, Session
from .toml_tables import checked_table, named_tables, required_name, table_list, table_text
from .user_text import quoted

ELEMENT_KINDS = ("spur", "helical", "bevel", "pulley")
LOCATING = ("A", "B", "pair")
MOUNTINGS = ("O", "X")
ROTATIONS = {"+": 1, "-": -1, "−": -1}
HANDS = ("left", "right")
YES = ("yes", "true", "on", "1")
NO = ("no", "false", "off", "0")
#: case inputs a shaft fills in itself; the rest may be given in ``case_fields``
SOLVED_FIELDS = ("fr", "fa", "speed")
CASE_FIELD_KEYS = tuple(name for name in CASE_FIELDS if name not in SOLVED_FIELDS)
SEPARATOR = " · "
GENERATED_NOTE = "generated from shaft "

PAIR_KINDS = (Kind.ANGULAR_CONTACT, Kind.TAPERED)


# ---- the typed text ------------------------------------------------------------------------
@dataclass
class Element:
    """A gear or pulley on the shaft; every value is typed text (see the module notes)."""

    name: str
    kind: str
    position: str = ""
    diameter: str = ""
    pressure_angle: str = ""
    helix_angle: str = ""
    hand: str = ""
    driving: str = ""
    pitch_cone_angle: str = ""
    apex: str = ""
    mesh_angle: str = ""
    pull_factor: str = ""
    share: str = "1"


@dataclass
class OperatingState:
    """One way the shaft runs: power or torque, speed, and its share of the time."""

    name: str
    power: str = ""
    torque: str = ""
    speed: str = ""
    share: str = "1"


@dataclass
class Shaft:
    """A shaft on two of the session's bearings, its gears and pulleys, and how it runs."""

    name: str
    bearing_a: str
    bearing_b: str
    position_a: str
    position_b: str
    locating: str
    mounting: str = ""
    rotation: str = "+"
    elements: list[Element] = field(default_factory=list)
    states: list[OperatingState] = field(default_factory=list)
    case_fields: dict[str, str] = field(default_factory=dict)


ELEMENT_TEXTS = tuple(f.name for f in fields(Element) if f.name not in ("name", "kind"))
STATE_TEXTS = ("power", "torque", "speed", "share")
SHAFT_TEXTS = ("bearing_a", "bearing_b", "position_a", "position_b", "locating", "mounting",
               "rotation")
ELEMENT_KEYS = ("name", "kind") + ELEMENT_TEXTS
STATE_KEYS = ("name",) + STATE_TEXTS
SHAFT_KEYS = ("name",) + SHAFT_TEXTS + ("case_fields", "elements", "states")

_GEAR_TEXTS = ("position", "diameter", "pressure_angle", "driving", "mesh_angle")
#: the element texts each kind needs, and those it may leave blank
REQUIRED_TEXTS: dict[str, tuple[str, ...]] = {
    "spur": _GEAR_TEXTS,
    "helical": _GEAR_TEXTS + ("helix_angle", "hand"),
    "bevel": _GEAR_TEXTS + ("pitch_cone_angle", "apex"),
    "pulley": ("position", "diameter", "mesh_angle"),
}
OPTIONAL_TEXTS: dict[str, tuple[str, ...]] = {
    "spur": ("share",), "helical": ("share",), "bevel": ("share",),
    "pulley": ("pull_factor", "share"),
}
KIND_WORDS = {"spur": "spur gear", "helical": "helical gear", "bevel": "straight bevel gear",
              "pulley": "pulley"}


def _without_defaults(item: object) -> dict[str, str]:
    """The text fields of a dataclass in order, leaving out those equal to their default."""
    return {f.name: getattr(item, f.name) for f in fields(item)  # type: ignore[arg-type]
            if isinstance(getattr(item, f.name), str) and getattr(item, f.name) != f.default}


def shaft_from_table(data: Mapping[str, Any], key: str = "shafts[1]") -> Shaft:
    """A :class:`Shaft` from its TOML table, every text checked; FieldError names the bad key."""
    table = checked_table(data, key, SHAFT_KEYS)
    name = required_name(table, key, set(), "shaft")
    texts = {n: table_text(table, key, n, getattr(Shaft, n, "")) for n in SHAFT_TEXTS}
    case_table = checked_table(table.get("case_fields", {}), f"{key}.case_fields", CASE_FIELDS)
    case_fields = {n: table_text(case_table, f"{key}.case_fields", n) for n in case_table}
    element_names: set[str] = set()
    elements = []
    for number, value in enumerate(table_list(table, key, "elements"), start=1):
        where = f"{key}.elements[{number}]"
        item = checked_table(value, where, ELEMENT_KEYS)
        elements.append(Element(
            required_name(item, where, element_names, "element"), table_text(item, where, "kind"),
            **{n: table_text(item, where, n, getattr(Element, n)) for n in ELEMENT_TEXTS}))
    state_names: set[str] = set()
    states = []
    for number, value in enumerate(table_list(table, key, "states"), start=1):
        where = f"{key}.states[{number}]"
        item = checked_table(value, where, STATE_KEYS)
        states.append(OperatingState(
            required_name(item, where, state_names, "state"),
            **{n: table_text(item, where, n, getattr(OperatingState, n)) for n in STATE_TEXTS}))
    shaft = Shaft(name, elements=elements, states=states, case_fields=case_fields, **texts)
    _parsed_shaft(shaft, key)
    for number, state in enumerate(shaft.states, start=1):
        _parsed_state(state, f"{key}.states[{number}]")
    return shaft


def shaft_to_table(shaft: Shaft) -> dict[str, Any]:
    """The TOML-ready table of ``shaft``; :func:`shaft_from_table` reads it back equal."""
    table: dict[str, Any] = _without_defaults(shaft)
    table["case_fields"] = dict(shaft.case_fields)
    table["elements"] = [_without_defaults(element) for element in shaft.elements]
    table["states"] = [_without_defaults(state) for state in shaft.states]
    return table


def shafts_from_tables(value: object, key: str = "shafts") -> list[Shaft]:
    """Every shaft of a ``[[shafts]]`` array of tables; names must differ."""
    return named_tables(value, key, shaft_from_table, "shaft")


def shafts_to_tables(shafts: Sequence[Shaft]) -> list[dict[str, Any]]:
    """The ``[[shafts]]`` array of tables for ``shafts``."""
    return [shaft_to_table(shaft) for shaft in shafts]


# ---- typed text to numbers -----------------------------------------------------------------
def _quantity(key: str, text: str, quantity: str, default_unit: str | None) -> float:
    try:
        return parse(text, quantity, default_unit=default_unit)
    except QuantityError as exc:
        raise FieldError(key, exc.message) from None


def _choice(key: str, text: str, choices: Sequence[str]) -> str:
    if text.strip() in choices:
        return text.strip()
    raise FieldError(key, f"use {' or '.join(repr(c) for c in choices)}, not {quoted(text)}")


def _yes_no(key: str, text: str) -> bool:
    lowered = text.strip().lower()
    if lowered in YES:
        return True
    if lowered in NO:
        return False
    raise FieldError(key, "answer yes or no")


def _share(key: str, text: str) -> float:
    value = _quantity(key, text, "dimensionless", "")
    if not (math.isfinite(value) and value >= 0.0):
        raise FieldError(key, "a share is a number of 0 or more")
    return value


_ELEMENT_PARSERS: dict[str, Callable[[str, str], float | str | bool]] = {
    "position": lambda k, t: _quantity(k, t, "length", "mm"),
    "diameter": lambda k, t: _quantity(k, t, "length", "mm"),
    "pressure_angle": lambda k, t: _quantity(k, t, "angle", "deg"),
    "helix_angle": lambda k, t: _quantity(k, t, "angle", "deg"),
    "pitch_cone_angle": lambda k, t: _quantity(k, t, "angle", "deg"),
    "mesh_angle": lambda k, t: _quantity(k, t, "angle", "deg"),
    "pull_factor": lambda k, t: _quantity(k, t, "dimensionless", ""),
    "share": _share,
    "hand": lambda k, t: _choice(k, t, HANDS),
    "driving": _yes_no,
    "apex": lambda k, t: _choice(k, t, SIDES),
}


#: the engine's name of each element text (the others keep theirs)
_ENGINE_NAMES = {"position": "position_mm", "diameter": "diameter_mm",
                 "pressure_angle": "pressure_angle_deg", "helix_angle": "helix_angle_deg",
                 "pitch_cone_angle": "pitch_cone_angle_deg", "mesh_angle": "mesh_angle_deg"}


@dataclass(frozen=True, slots=True)
class _ParsedShaft:
    position_a: float
    position_b: float
    locating: str
    mounting: str
    rotation: int
    elements: tuple[ShaftElement, ...]


def _parsed_element(element: Element, key: str) -> ShaftElement:
    """The element's texts as engine inputs, after checking each kind has what it needs and no
    more."""
    kind = _choice(f"{key}.kind", element.kind, ELEMENT_KINDS)
    required, optional = REQUIRED_TEXTS[kind], OPTIONAL_TEXTS[kind]
    values: dict[str, Any] = {"name": element.name, "kind": kind}
    for name in ELEMENT_TEXTS:
        text = getattr(element, name)
        if not text.strip():
            if name in required:
                raise FieldError(f"{key}.{name}", f"a {KIND_WORDS[kind]} needs its {name}")
            values[name] = None
            continue
        if name not in required and name not in optional:
            raise FieldError(f"{key}.{name}", f"a {KIND_WORDS[kind]} takes no {name}; leave it blank")
        values[name] = _ELEMENT_PARSERS[name](f"{key}.{name}", text)
    if values["share"] is None:
        values["share"] = 1.0
    return ShaftElement(**{_ENGINE_NAMES.get(name, name): value for name, value in values.items()})


def _parsed_shaft(shaft: Shaft, key: str) -> _ParsedShaft:
    """Every text of ``shaft`` but its states, checked and turned into numbers."""
    for side in ("bearing_a", "bearing_b"):
        if not getattr(shaft, side).strip():
            raise FieldError(f"{key}.{side}", "name the session bearing that sits here")
    locating = _choice(f"{key}.locating", shaft.locating, LOCATING)
    if locating == "pair":
        mounting = _choice(f"{key}.mounting", shaft.mounting, MOUNTINGS)
    elif shaft.mounting.strip():
        raise FieldError(f"{key}.mounting", "a mounting is given only for locating = 'pair'")
    else:
        mounting = ""
    rotation = ROTATIONS[_choice(f"{key}.rotation", shaft.rotation, tuple(ROTATIONS))]
    for name, text in shaft.case_fields.items():
        if name not in CASE_FIELD_KEYS:
            raise FieldError(f"{key}.case_fields.{name}",
                             "fr, fa and speed come from the shaft" if name in SOLVED_FIELDS
                             else "not a case input")
        try:
            parse_field(name, text)
        except FieldError as exc:
            raise FieldError(f"{key}.case_fields.{name}", exc.message) from None
    return _ParsedShaft(
        _quantity(f"{key}.position_a", shaft.position_a, "length", "mm"),
        _quantity(f"{key}.position_b", shaft.position_b, "length", "mm"),
        locating, mounting, rotation,
        tuple(_parsed_element(e, f"{key}.elements[{n}]") for n, e in enumerate(shaft.elements, 1)))


def _parsed_state(state: OperatingState, key: str) -> tuple[float | None, float | None, float, float]:
    """(power W or None, torque N·m or None, speed r/min, time share) of a state."""
    has_power, has_torque = bool(state.power.strip()), bool(state.torque.strip())
    if has_power == has_torque:
        raise FieldError(f"{key}.power", "give either the power or the torque, not both"
                         if has_power else "give the power or the torque")
    if not state.speed.strip():
        raise FieldError(f"{key}.speed", "give the shaft speed, e.g. 1480 r/min")
    power = _quantity(f"{key}.power", state.power, "power", None) if has_power else None
    torque = _quantity(f"{key}.torque", state.torque, "torque", "N·m") if has_torque else None
    speed = _quantity(f"{key}.speed", state.speed, "speed", "r/min")
    for name, value in (("power", power), ("torque", torque), ("speed", speed)):
        if value is not None and value < 0.0:
            raise FieldError(f"{key}.{name}", "must not be negative (the shaft's rotation gives "
                                              "the sense of turning)")
    return power, torque, speed, _share(f"{key}.share", state.share)


@contextmanager
def _engine_keys(prefix: str, names: Mapping[str, str]) -> Iterator[None]:
    """Turn an engine InputError into a FieldError naming the shaft-table key it came from."""
    try:
        yield
    except InputError as exc:
        if exc.field in names:
            raise FieldError(f"{prefix}.{names[exc.field]}", exc.message) from None
        raise FieldError(prefix, f"{exc.field}: {exc.message}") from None


_ELEMENT_ENGINE_KEYS = {
    "pressure_angle": "pressure_angle", "normal_pressure_angle": "pressure_angle",
    "helix_angle": "helix_angle", "pitch_cone_angle": "pitch_cone_angle",
    "diameter": "diameter", "belt_pull_factor": "pull_factor", "belt_direction": "mesh_angle",
    "hand": "hand", "torque": "share",
}
_LAYOUT_ENGINE_KEYS = {"bearing_a_position": "position_a", "bearing_b_position": "position_b"}


# ---- the free body -------------------------------------------------------------------------
@dataclass(frozen=True, slots=True)
class ShaftSolution:
    """One state of a shaft solved: the loads on it, the reactions and per bearing (Fr, Fa) in N."""

    shaft: Shaft
    state: OperatingState
    torque: float
    speed: float
    loads: tuple[PointLoad, ...]
    reactions: ShaftReactions
    bearing_loads: dict[str, tuple[float, float]]
    derivation: Derivation


def _bearing_inputs(session: Session, name: str, key: str) -> PairBearing:
    """The session bearing ``name`` as engine inputs; errors name ``bearings[n].<field>``."""
    for number, bearing in enumerate(session.bearings, start=1):  # noqa: B007 (read after the loop)
        if bearing.name == name:
            break
    else:
        raise FieldError(key, f"no bearing called {quoted(name)} in this session")
    where = f"bearings[{number}]"
    values: dict[str, object] = {}
    for field_name in BEARING_FIELDS:
        try:
            values[field_name] = parse_field(field_name, bearing.texts.get(field_name, ""))
        except FieldError as exc:
            raise FieldError(f"{where}.{exc.field}", exc.message) from None
    inputs = inputs_from_values(values | {"fr": 1.0})  # a unit load: validate needs one
    try:
        kind, arrangement, alpha = validate(inputs)
    except InputError as exc:
        raise FieldError(f"{where}.{exc.field}", exc.message) from None
    return PairBearing(kind=kind, arrangement=arrangement, alpha_deg=alpha, c0=inputs.c0,
                       f0=inputs.f0, e_given=inputs.e_given, y_given=inputs.y_given)


def _element_load(d: Derivation, element: ShaftElement, torque: float, rotation: int,
                  key: str) -> PointLoad:
    """The element's load on the shaft (engine), its errors named under the element's ``key``."""
    with _engine_keys(key, _ELEMENT_ENGINE_KEYS):
        return element_load(d, element, torque, rotation=rotation)


def _state_key(shaft: Shaft, state: OperatingState, key: str) -> str:
    for number, item in enumerate(shaft.states, start=1):
        if item is state:
            return f"{key}.states[{number}]"
    return f"{key}.state"


def solve_shaft(shaft: Shaft, state: OperatingState, session: Session, *,
                key: str = "shaft") -> ShaftSolution:
    """Free body of ``shaft`` in ``state``: mesh and belt forces, reactions, per bearing (Fr, Fa).

    Gear-force relations (spur, helical, straight bevel), belt pull, shaft statics (ΣF = 0,
    ΣM = 0), and for a pair the induced thrusts and the two-bearing thrust-sharing rule.  Bad
    input raises FieldError naming the key under ``key`` (``shafts[1]`` when reading a file).
    """
    parsed = _parsed_shaft(shaft, key)
    state_key = _state_key(shaft, state, key)
    power, torque, speed, _ = _parsed_state(state, state_key)
    pair = None
    if parsed.locating == "pair":
        pair = {side: _bearing_inputs(session, getattr(shaft, f"bearing_{side.lower()}"),
                                      f"{key}.bearing_{side.lower()}") for side in SIDES}
        for side, bearing in pair.items():
            if bearing.kind not in PAIR_KINDS or bearing.arrangement is not Arrangement.SINGLE:
                raise FieldError(f"{key}.bearing_{side.lower()}",
                                 "a pair needs single angular-contact or tapered roller bearings, "
                                 f"not {bearing.kind.value} ({bearing.arrangement.value})")
    else:
        for side in ("bearing_a", "bearing_b"):
            if session.bearing(getattr(shaft, side)) is None:
                raise FieldError(f"{key}.{side}",
                                 f"no bearing called {quoted(getattr(shaft, side))} in this session")
    d = Derivation()
    with _engine_keys(state_key, {"power": "power", "speed": "speed"}):
        total_torque = shaft_torque(d, power_W=power, torque_Nm=torque, speed_rpm=speed)
    loads = tuple(_element_load(d, element, total_torque, parsed.rotation,
                                f"{key}.elements[{number}]")
                  for number, element in enumerate(parsed.elements, start=1))
    layout = ShaftLayout(parsed.position_a, parsed.position_b,
                         "both" if pair is not None else parsed.locating,  # type: ignore[arg-type]
                         loads)
    with _engine_keys(key, _LAYOUT_ENGINE_KEYS):
        reactions = solve_reactions(layout)
        d.extend(derivation_steps(layout, reactions))
    if pair is not None:
        fa = paired_axial_loads(d, pair, {"A": reactions.radial_a, "B": reactions.radial_b},
                                reactions.thrust, parsed.mounting)  # type: ignore[arg-type]
    else:
        fa = {"A": reactions.axial_a, "B": reactions.axial_b}
    bearing_loads = {"A": (reactions.radial_a, fa["A"]), "B": (reactions.radial_b, fa["B"])}
    return ShaftSolution(shaft, state, total_torque, speed, loads, reactions, bearing_loads, d)


# ---- load cases ----------------------------------------------------------------------------
def case_name(shaft: Shaft, state: OperatingState, side: str) -> str:
    """The name of a generated case: ``<shaft> · <state> · A``."""
    return SEPARATOR.join((shaft.name, state.name, side))


def state_words(name: str) -> str:
    """Operating state ``name`` as a sentence names it: "state full load", or the name alone
    where it says state already ("state 4", "start-up state"), so no heading doubles the word
    ("State state 4")."""
    return name if "state" in name.lower().split() else f"state {name}"


def new_state_name(states: Sequence[Mapping[str, Any]]) -> str:
    """The name of a state added after ``states``: "state N", N its number in the list (as the
    editor titles it "Operating state N"), or the next number no state uses yet. A placeholder
    that says which row it is; the generated cases' names ("shaft · state N · A") stay apart."""
    taken = {str(state.get("name", "")) for state in states}
    number = len(states) + 1
    while f"state {number}" in taken:
        number += 1
    return f"state {number}"


def is_generated(case: LoadCase) -> bool:
    """True for a case made by :func:`generated_cases` (the screen shows it read-only)."""
    return case.notes.startswith(GENERATED_NOTE)


def _force_text(value: float) -> str:
    return f"{value:.6g} N"


def shaft_cases(session: Session, shaft: Shaft, *, key: str = "shaft",
                taken: set[str] | None = None) -> list[LoadCase]:
    """The generated cases of one shaft (see :func:`generated_cases`); errors named under ``key``.

    ``taken`` holds case names already in use (the session's when not given); it is updated.
    """
    taken = {case.name for case in session.cases} if taken is None else taken
    result = []
    for state_number, state in enumerate(shaft.states, start=1):
        solution = solve_shaft(shaft, state, session, key=key)
        for side in SIDES:
            name = case_name(shaft, state, side)
            if name in taken:
                raise FieldError(f"{key}.states[{state_number}].name",
                                 f"the case name {quoted(name)} is already taken")
            taken.add(name)
            fr, fa = solution.bearing_loads[side]
            texts = dict(shaft.case_fields) | {
                "fr": _force_text(fr), "fa": _force_text(fa), "speed": f"{solution.speed:.6g} r/min"}
            result.append(LoadCase(name, getattr(shaft, f"bearing_{side.lower()}"), texts,
                                   f"{GENERATED_NOTE}{shaft.name}"))
    return result


def generated_cases(session: Session, shafts: Sequence[Shaft]) -> list[LoadCase]:
    """One load case per shaft × state × bearing, with Fr, Fa and speed from :func:`solve_shaft`.

    Each case also carries its shaft's ``case_fields`` and the note ``generated from shaft
    <name>``.  FieldError names ``shafts[n]…`` for bad input or a case name already taken.
    """
    taken = {case.name for case in session.cases}
    return [case for number, shaft in enumerate(shafts, start=1)
            for case in shaft_cases(session, shaft, key=f"shafts[{number}]", taken=taken)]
