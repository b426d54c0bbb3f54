"""A special bearing's internal geometry as typed, and the bearing texts its ratings give.

One reader serves the ``workbench rate`` flags and the screen's rating form: each input is text
("12.7 mm", "9", blank for the standard's default), read into an engine
:class:`~workbench.engine.ratings.BearingGeometry` (ISO 281:2007 and ISO 76:2006 ratings from
geometry).  Errors name the input as this module does, whichever the engine's own name for it.
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass

from ..engine.kinds import ARRANGEMENTS, Arrangement, Kind, is_bearing_set, set_dynamic_rating, set_static_rating
from ..engine.ratings import BALL_KINDS, KINDS, THRUST_KINDS, BearingGeometry, rate_bearing
from ..engine.record import Derivation, InputError, fmt
from .fields import FieldError
from .quantities import QuantityError, parse
from .user_text import quoted

RADIAL_DEFAULT_ANGLE = "0°"
THRUST_DEFAULT_ANGLE = "90°"


@dataclass(frozen=True, slots=True)
class RatingInput:
    """One input of the rating form: ``kind`` is choice, count, length, angle or number."""

    name: str
    flag: str
    label: str
    kind: str
    hint: str
    required: bool = True


RATING_INPUTS: tuple[RatingInput, ...] = (
    RatingInput("kind", "--kind", "Bearing kind", "choice", "the kind to rate"),
    RatingInput("rows", "--rows", "Rows i", "count", "default 1", required=False),
    RatingInput("elements", "--elements", "Elements per row Z", "count", "e.g. 9"),
    RatingInput("dw", "--dw", "Element diameter", "length", "ball Dw or roller Dwe, e.g. 12.7 mm"),
    RatingInput("lwe", "--lwe", "Roller length Lwe", "length", "rollers only, e.g. 14 mm",
                required=False),
    RatingInput("contact_angle", "--contact-angle", "Contact angle α", "angle",
                "default 0° radial, 90° thrust", required=False),
    RatingInput("dpw", "--dpw", "Pitch diameter Dpw", "length", "e.g. 65 mm"),
    RatingInput("bm", "--bm", "Factor bm", "number", "default from ISO 281", required=False),
    RatingInput("f0", "--f0", "Factor f0", "number", "default from ISO 76 (balls)",
                required=False),
)
RATING_INPUT_BY_NAME = {spec.name: spec for spec in RATING_INPUTS}
_ENGINE_NAMES = {"i": "rows", "z": "elements", "alpha_deg": "contact_angle"}


def _number(spec: RatingInput, text: str) -> float:
    try:
        value = float(text)
    except ValueError:
        raise FieldError(spec.name, f"{quoted(text)} is not a number") from None
    if not math.isfinite(value):
        raise FieldError(spec.name, "must be a finite number")
    return value


def _count(spec: RatingInput, text: str) -> int:
    value = _number(spec, text)
    if value != round(value) or value < 1:
        raise FieldError(spec.name, "must be a whole number of at least 1")
    return int(value)


def read_rating_input(spec: RatingInput, text: str) -> float | int:
    """One typed input of the form as a number: a count, a plain number, or a length or angle
    (bare numbers in mm or degrees); :class:`FieldError` naming it."""
    try:
        if spec.kind == "count":
            return _count(spec, text)
        if spec.kind == "number":
            return _number(spec, text)
        return parse(text, spec.kind, default_unit="mm" if spec.kind == "length" else "deg")
    except QuantityError as exc:
        raise FieldError(spec.name, exc.message) from None


def input_problem(name: str, text: str) -> str | None:
    """Why the text typed for input ``name`` cannot be read (None: it can, or it is blank; a
    blank required input is named when the whole form is read)."""
    spec = RATING_INPUT_BY_NAME[name]
    if spec.kind == "choice" or not text.strip():
        return None
    try:
        read_rating_input(spec, text.strip())
    except FieldError as exc:
        return exc.message
    return None


def geometry_from_texts(texts: Mapping[str, str]) -> BearingGeometry:
    """The geometry the texts describe; :class:`FieldError` naming the input that is missing or
    unreadable.  Blank rows means one row, a blank contact angle 0° (radial) or 90° (thrust)."""
    kind = texts.get("kind", "").strip()
    if kind not in KINDS:
        raise FieldError("kind", f"choose one of {', '.join(KINDS)}")
    values: dict[str, float | int | None] = {}
    for spec in RATING_INPUTS[1:]:
        text = texts.get(spec.name, "").strip()
        if spec.name == "contact_angle" and not text:
            text = THRUST_DEFAULT_ANGLE if kind in THRUST_KINDS else RADIAL_DEFAULT_ANGLE
        if not text:
            if spec.required:
                raise FieldError(spec.name, "needed")
            values[spec.name] = 1 if spec.name == "rows" else None
            continue
        values[spec.name] = read_rating_input(spec, text)
    return BearingGeometry(kind, int(values["rows"] or 1), int(values["elements"] or 0),
                           float(values["dw"] or 0.0), float(values["contact_angle"] or 0.0),
                           float(values["dpw"] or 0.0), _optional(values["lwe"]),
                           _optional(values["bm"]), _optional(values["f0"]))


def _optional(value: float | int | None) -> float | None:
    return None if value is None else float(value)


def rate_texts(texts: Mapping[str, str]) -> tuple[BearingGeometry, Derivation]:
    """Read the texts and rate the bearing; :class:`FieldError` under this form's input names
    for anything the reader or the engine refuses."""
    geometry = geometry_from_texts(texts)
    try:
        return geometry, rate_bearing(geometry)
    except InputError as exc:
        raise FieldError(_ENGINE_NAMES.get(exc.field, exc.field), exc.message) from None


def pair_of_rated(geometry: BearingGeometry, arrangement: str) -> Arrangement | None:
    """The pair a rated bearing makes in a position of ``arrangement``: where the position is a
    pair (tandem, back-to-back, face-to-face), the kind comes so and one row was rated (i = 1),
    the session bearing is a pair of it (ISO 281:2007 §5.1/§7.1); None otherwise (a rating of
    i rows is the set's already)."""
    try:
        wanted, kind = Arrangement(arrangement), Kind(geometry.kind)
    except ValueError:
        return None
    if geometry.i != 1 or not is_bearing_set(wanted) or wanted not in ARRANGEMENTS[kind]:
        return None
    return wanted


def pair_ratings(geometry: BearingGeometry, derivation: Derivation,
                 arrangement: str) -> tuple[float, float]:
    """C and C0 (N) the session bearing takes: the rated bearing's, or its pair's where
    :func:`pair_of_rated` makes one (C = 2^0.7·C ball, 2^(7/9)·C roller; C0 = 2·C0)."""
    c, c0 = derivation.results["C"], derivation.results["C0"]
    if pair_of_rated(geometry, arrangement) is None:
        return c, c0
    return set_dynamic_rating(Kind(geometry.kind), c), set_static_rating(c0)


def bearing_texts(geometry: BearingGeometry, derivation: Derivation, *,
                  arrangement: str = "single") -> dict[str, str]:
    """The session bearing's field texts for a rated bearing: kind, C and C0 (kN, four
    significant figures; a pair's in a pair position, :func:`pair_ratings`), mean diameter
    dm = Dpw, the contact angle, and for ball bearings the ISO 76 f0 (a roller's f0 step is
    another factor and is not carried over).  A maker's e and Y and a given Cu are cleared, as
    adopting a catalog bearing clears them: they belonged to the bearing these ratings replace
    (Cu is then estimated from the new C0)."""
    results = derivation.results
    c, c0 = pair_ratings(geometry, derivation, arrangement)
    return {
        "kind": geometry.kind,
        "c": f"{fmt(c / 1000.0)} kN",
        "c0": f"{fmt(c0 / 1000.0)} kN",
        "dm": f"{fmt(geometry.dpw)} mm",
        "contact_angle": f"{fmt(geometry.alpha_deg)}°",
        "f0": fmt(results["f0"]) if geometry.kind in BALL_KINDS else "",
        "e_given": "",
        "y_given": "",
        "cu": "",
    }
