"""The inputs of a load case as a person types them, and their one way into engine numbers.

One table, :data:`FIELDS`, names every input: its engine field, command-line flag, label, the
quantity it measures and its unit when a bare number is typed.  The command line, the session
files and the case editor all go through :func:`parse_field`, so "2 kN" means one thing everywhere.
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from functools import lru_cache
from typing import Mapping

from ..engine import tables as T
from ..engine.derive import RELIABILITY_MODELS, CaseInputs
from ..engine.kinds import ARRANGEMENTS, Kind, unread_inputs
from .quantities import QuantityError, parse

MAX_TEXT = 200
PARSED_TEXTS_KEPT = 8192


@dataclass(frozen=True, slots=True)
class FieldSpec:
    """One input: ``kind`` is quantity, number, fraction, choice or switch."""

    name: str
    flag: str
    label: str
    kind: str
    quantity: str | None = None
    default_unit: str | None = None
    choices: tuple[str, ...] = ()
    required: bool = False
    hint: str = ""
    group: str = "case"  # "bearing" fields belong to the bearing a case uses
    short: str = ""  # the label where columns are few (at most 16 characters); "" = label

    @property
    def short_label(self) -> str:
        """The label for a narrow screen (the long one when it is short already)."""
        return self.short or self.label


CLEANLINESS_CHOICES = tuple(T.CONTAMINATION_LEVELS)
ALL_ARRANGEMENTS = tuple(dict.fromkeys(a.value for arr in ARRANGEMENTS.values() for a in arr))

FIELDS: tuple[FieldSpec, ...] = (
    FieldSpec("kind", "--kind", "Bearing kind", "choice", choices=tuple(k.value for k in Kind),
              required=True, group="bearing"),
    FieldSpec("arrangement", "--arrangement", "Arrangement", "choice", choices=ALL_ARRANGEMENTS, group="bearing"),
    FieldSpec("c", "--c", "Dynamic rating C", "quantity", "force", "N", required=True, group="bearing",
              hint="of the whole set for a pair or tandem: 2^0.7 × one bearing's C "
                   "(roller 2^(7/9)), ISO 281 §5.1/§7.1"),
    FieldSpec("c0", "--c0", "Static rating C0", "quantity", "force", "N", required=True, group="bearing",
              hint="of the whole set for a pair or tandem: 2 × one bearing's C0, "
                   "ISO 76 §5.1/§7.1"),
    FieldSpec("f0", "--f0", "Factor f0", "number", hint="ISO 76 factor; blank: Fa/C0 basis", group="bearing"),
    FieldSpec("contact_angle", "--contact-angle", "Contact angle α", "quantity", "angle", "°", group="bearing"),
    FieldSpec("e_given", "--e", "Maker's e", "number", hint="tapered, spherical, self-aligning", group="bearing"),
    FieldSpec("y_given", "--y", "Maker's Y", "number", hint="Y for Fa/Fr > e; one row's for a tapered pair", group="bearing"),
    FieldSpec("fr", "--fr", "Radial load Fr", "quantity", "force", "N"),
    FieldSpec("fa", "--fa", "Axial load Fa", "quantity", "force", "N"),
    FieldSpec("speed", "--speed", "Speed n", "quantity", "speed", "r/min"),
    FieldSpec("af", "--af", "Application factor af", "number", hint=T.APPLICATION_FACTOR_HINT,
              short="App. factor af"),
    FieldSpec("outer_ring_rotates", "--outer-ring-rotates", "Outer ring rotates",
              "switch", short="Outer ring turns"),
    FieldSpec("tilt", "--tilt", "Misalignment θ", "quantity", "angle", "rad",
              hint="ring tilt held by the shaft, e.g. 1 mrad (inside view; blank: 0)",
              short="Tilt θ"),
    FieldSpec("moment", "--moment", "Tilting moment M", "quantity", "torque", "N·m",
              hint="instead of the tilt: the rings tilt under it (inside view)",
              short="Moment M"),
    FieldSpec("reliability", "--reliability", "Reliability R", "fraction",
              hint="fraction, e.g. 0.95"),
    FieldSpec("reliability_model", "--reliability-model", "Reliability model", "choice",
              choices=RELIABILITY_MODELS, short="Reliab. model"),
    FieldSpec("weibull_x0", "--weibull-x0", "Weibull x0", "number"),
    FieldSpec("weibull_theta", "--weibull-theta", "Weibull θ", "number"),
    FieldSpec("weibull_b", "--weibull-b", "Weibull b", "number"),
    FieldSpec("rating_life_mrev", "--rating-life", "Rating basis life LR", "quantity",
              "revolutions", "Mrev", hint="revolutions at which C is rated (Weibull model)",
              short="Basis life LR"),
    FieldSpec("vg", "--vg", "Oil grade ISO VG", "number"),
    FieldSpec("vi", "--vi", "Viscosity index VI", "number", hint="blank: 100",
              short="Visc. index VI"),
    FieldSpec("nu100", "--nu100", "Viscosity at 100 °C", "quantity", "viscosity", "mm²/s",
              short="ν at 100 °C"),
    FieldSpec("temp", "--temp", "Operating temperature", "quantity", "temperature", "°C",
              short="Operating temp."),
    FieldSpec("nu", "--nu", "Operating viscosity ν", "quantity", "viscosity", "mm²/s",
              hint="overrides ISO VG and temperature", short="Operating ν"),
    FieldSpec("dm", "--dm", "Mean diameter dm", "quantity", "length", "mm", group="bearing"),
    FieldSpec("cu", "--cu", "Fatigue load limit Cu", "quantity", "force", "N",
              hint="blank: estimated from C0", group="bearing",
              short="Fatigue limit Cu"),
    FieldSpec("clearance", "--clearance", "Operating clearance Pd", "quantity", "length", "mm",
              hint="mounted, diametral; negative = preload (inside view; blank: 0)",
              group="bearing", short="Clearance Pd"),
    FieldSpec("preload", "--preload", "Axial preload of a pair", "quantity", "force", "N",
              hint="back-to-back or face-to-face pairs (inside view)", group="bearing",
              short="Pair preload"),
    FieldSpec("cleanliness", "--cleanliness", "Cleanliness (or eC)", "choice",
              choices=CLEANLINESS_CHOICES, hint="a level or a number 0–1 for eC",
              short="Cleanliness eC"),
    FieldSpec("static_duty", "--static-duty", "Static duty", "choice",
              choices=tuple(T.STATIC_SAFETY_MINIMUMS)),
    FieldSpec("s0_min", "--s0-min", "Required s0", "number", hint="blank: the duty's minimum"),
    FieldSpec("static_only", "--static-only", "Static check only", "switch",
              hint="a start-up or peak case checked for s0 alone: no life verdict"),
)
INSIDE_FIELDS = ("clearance", "preload", "tilt", "moment")
"""The fit: read only by the inside view (the internal load distribution,
:mod:`workbench.model.internal_form`); the ISO 281 chain assumes normal clearance, no tilt and
no preload, so these are no inputs of ``derive`` nor flags of ``calc`` (``workbench internal``
has its own).  Clearance and preload belong to the bearing (its mounting), tilt and moment to
the load case."""
NOT_ENGINE_INPUTS = frozenset({"static_only", *INSIDE_FIELDS})
"""Fields that say how a case is judged or what the inside view reads, not what the ISO 281
chain derives from."""
FIELD_BY_NAME: dict[str, FieldSpec] = {f.name: f for f in FIELDS}
BEARING_FIELDS: tuple[str, ...] = tuple(f.name for f in FIELDS if f.group == "bearing")
CASE_FIELDS: tuple[str, ...] = tuple(f.name for f in FIELDS if f.group == "case")


@lru_cache(maxsize=len(Kind) + 1)
def unread_fields(kind_text: str) -> dict[str, str]:
    """The bearing fields no calculation reads for the kind named ``kind_text``, each with the
    reason (:func:`~workbench.engine.kinds.unread_inputs`; the field names are the engine's);
    none for a kind that cannot be read.  Shared: do not change it."""
    try:
        kind = Kind(kind_text.strip())
    except ValueError:
        return {}
    return unread_inputs(kind)


_BLANK_MEANS = re.compile(r"blank: (?P<meaning>[^;)]+)")


def in_force_words(name: str, text: str) -> str:
    """What the calculation uses while a refused text stands in field ``name`` and ``text`` is
    the value in force: that text, or the field left blank with what blank means where its
    hint says ("blank: 100")."""
    if text.strip():
        return f"the calculation still uses {text.strip()}"
    spec = FIELD_BY_NAME.get(name)
    found = _BLANK_MEANS.search(spec.hint) if spec is not None else None
    meaning = f" (blank means {found['meaning'].strip()})" if found else ""
    return f"the calculation still has this field blank{meaning}"


class FieldError(ValueError):
    """A typed value that cannot be used, naming its field."""

    def __init__(self, field_name: str, message: str) -> None:
        super().__init__(f"{field_name}: {message}")
        self.field = field_name
        self.message = message


def _plain_number(spec: FieldSpec, text: str) -> float:
    """A dimensionless number, guarded like quantities (no expressions, finite)."""
    try:
        value = parse(text, "dimensionless", default_unit="")
    except QuantityError as exc:
        raise FieldError(spec.name, exc.message) from None
    if not math.isfinite(value):
        raise FieldError(spec.name, "must be a finite number")
    return value


def parse_field(name: str, text: str) -> object:
    """The engine value of one typed field; ``None`` for a blank optional one.

    The cleanliness field returns either a level name or a float (an eC value).  Raises
    FieldError.  A text is read once: the answer (value or message) is kept for the next time
    the same text of the same field is read, as it is for every case on one bearing.
    """
    value, message = _read_field(name, text)
    if message is not None:
        raise FieldError(name, message)
    return value


@lru_cache(maxsize=PARSED_TEXTS_KEPT)
def _read_field(name: str, text: str) -> tuple[object, str | None]:
    """(value, None) or (None, message) for one typed field (see :func:`parse_field`)."""
    try:
        return _parse_field(name, text), None
    except FieldError as exc:
        return None, exc.message


def _parse_field(name: str, text: str) -> object:
    """The reading itself, for :func:`parse_field`."""
    spec = FIELD_BY_NAME[name]
    if len(text) > MAX_TEXT:
        raise FieldError(name, f"too long ({len(text)} characters)")
    text = text.strip()
    if spec.kind == "switch":
        lowered = text.lower()
        if lowered in ("", "no", "false", "off", "0", "inner"):
            return False
        if lowered in ("yes", "true", "on", "1", "outer"):
            return True
        raise FieldError(name, "answer yes or no")
    if not text:
        if spec.required:
            raise FieldError(name, "a value is needed")
        return None
    if spec.kind == "choice":
        if text in spec.choices:
            return text
        if name == "cleanliness":
            value = _plain_number(spec, text)
            if not 0.0 <= value <= 1.0:
                raise FieldError(name, "eC lies between 0 and 1")
            return value
        raise FieldError(name, f"use one of {', '.join(spec.choices)}")
    if spec.kind == "quantity":
        try:
            return parse(text, spec.quantity or "dimensionless", default_unit=spec.default_unit)
        except QuantityError as exc:
            raise FieldError(name, exc.message) from None
    value = _plain_number(spec, text)
    if spec.kind == "fraction" and not 0.0 < value < 1.0:
        raise FieldError(name, "give a fraction between 0 and 1, e.g. 0.95")
    return value


def inputs_from_values(values: Mapping[str, object]) -> CaseInputs:
    """CaseInputs from parsed field values (blank optional fields keep the engine's defaults)."""
    kwargs: dict[str, object] = {}
    for name, value in values.items():
        if value is None or name in NOT_ENGINE_INPUTS:
            continue
        if name == "cleanliness" and isinstance(value, float):
            kwargs["ec"] = value
            continue
        kwargs[name] = value
    return CaseInputs(**kwargs)  # type: ignore[arg-type]


def parse_texts(texts: Mapping[str, str]) -> tuple[dict[str, object], dict[str, str]]:
    """Parse every typed field: the good values, and a message per field that failed."""
    values: dict[str, object] = {}
    errors: dict[str, str] = {}
    for name, text in texts.items():
        if name not in FIELD_BY_NAME:
            errors[name] = "unknown input"
            continue
        try:
            values[name] = parse_field(name, text)
        except FieldError as exc:
            errors[name] = exc.message
    return values, errors


def inputs_from_texts(texts: Mapping[str, str]) -> CaseInputs:
    """CaseInputs from typed text, or a FieldError for the first field that fails."""
    values, errors = parse_texts(texts)
    for name, message in errors.items():
        raise FieldError(name, message)
    for spec in FIELDS:
        if spec.required and values.get(spec.name) is None:
            raise FieldError(spec.name, "a value is needed")
    return inputs_from_values(values)
