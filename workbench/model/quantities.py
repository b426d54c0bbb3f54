"""The unit edge: the only place where text typed by a user becomes a number.

Every quantity the workbench knows has one internal unit (the engine's SI-ish units) and one
display unit per unit system; they live in the single table ``QUANTITIES``.  ``parse`` turns
"2 kN", "450 lbf", "1200 r/min", "70 °C" into a float in the internal unit; ``format_quantity``
and the display helpers go the other way.

Safety: text is checked against a strict ``number [unit]`` grammar *before* pint sees it, so
expressions ("2*3 kN", "9**9**9 kN") and code are refused without evaluation.  Speed: the
conversion of a unit text to a quantity's internal unit is affine (``internal = a·x + b``; b is
non-zero only for offset temperature units), so (a, b) is cached per (unit text, quantity) after
the first pint lookup and repeated parses never touch pint.  pint itself, and its
``UnitRegistry``, are loaded only on the first cache miss, so importing this module stays cheap.
A unit written exactly as the quantity's internal unit (x1), or as that unit with the SI prefix
k or M (ISO 80000-1: x10³, x10⁶) where the internal unit is one SI symbol, is converted without
pint, so a session in the internal units ("2 kN", "1200 r/min", "70 °C", or a spelling the table
lists beside its internal unit, "1200 rpm") opens without loading pint.

Dimension checks compare pint's root units *including the radian*, which pint treats as a
dimensionless base unit: that keeps angles and revolutions apart from plain numbers, and a
rotational speed (r/min, r/s, rad/s) apart from a bare frequency.  "Hz" is therefore refused as a
speed: pint reads 1/s as 1 rad/s, not the 1 r/s an engineer usually means by "50 Hz" on a shaft.
Angles and revolutions share the radian, so "360°" is accepted as 1e-6 Mrev.
"""

from __future__ import annotations

import math
import re
import unicodedata
from collections.abc import Callable
from dataclasses import dataclass
from typing import TYPE_CHECKING, Literal

from workbench.engine.record import engine_units, fmt

from .user_text import clipped, quoted

if TYPE_CHECKING:  # pint is imported lazily, on the first cache miss
    import pint

System = Literal["SI", "US"]

MAX_TEXT_LENGTH = 200
ABSOLUTE_ZERO_C = -273.15
KILO_FROM_N = 1000.0  # SI force display switches from N to kN at this magnitude


class QuantityError(ValueError):
    """Text that cannot be read as the quantity asked for; ``message`` is one line for the user."""

    def __init__(self, message: str) -> None:
        super().__init__(message)
        self.message = message


@dataclass(frozen=True, slots=True)
class QuantitySpec:
    """One row of the quantity table: internal unit, display units and wording for messages.

    Units are written as labels that pint also reads (``mm²/s``, ``N·m``, ``°C``), so the label a
    value is printed with is the unit text it parses back from.  ``si_large`` is an optional
    larger SI display unit used by ``format_quantity`` from ``KILO_FROM_N`` of the base unit;
    ``aliases`` other spellings of the internal unit itself, read without pint (typed text and
    older sessions use them; the workbench never writes them).
    """

    noun: str  # "a force", used in "5 kg is a mass, not a force"
    internal: str
    si: str
    us: str
    example: str  # shown when a unit is missing
    si_large: str | None = None
    aliases: tuple[str, ...] = ()


QUANTITIES: dict[str, QuantitySpec] = {
    "force": QuantitySpec("a force", "N", "N", "lbf", "2 kN", si_large="kN"),
    "length": QuantitySpec("a length", "mm", "mm", "in", "25 mm"),
    # r/min: the ISO 80000-3 spelling, shown everywhere; "rpm" is read as the same unit
    "speed": QuantitySpec("a rotational speed", "r/min", "r/min", "r/min", "1200 r/min",
                          aliases=("rpm",)),
    "time": QuantitySpec("a time", "h", "h", "h", "20000 h"),
    # cSt = mm²/s exactly; the US display uses the name common on US lubricant data sheets.
    "viscosity": QuantitySpec("a kinematic viscosity", "mm²/s", "mm²/s", "cSt", "68 mm²/s"),
    "temperature": QuantitySpec("a temperature", "°C", "°C", "°F", "70 °C"),
    "angle": QuantitySpec("an angle", "°", "°", "°", "15°"),
    "revolutions": QuantitySpec("a number of revolutions", "Mrev", "Mrev", "Mrev", "100 Mrev"),
    "torque": QuantitySpec("a torque", "N·m", "N·m", "lbf·ft", "50 N·m"),
    "power": QuantitySpec("a power", "W", "kW", "hp", "5 kW"),  # hp: mechanical, 745.7 W
    "mass": QuantitySpec("a mass", "kg", "kg", "lb", "2 kg"),
    "dimensionless": QuantitySpec("a plain number", "", "", "", "0.5"),
}

# ---- the text grammar, checked before pint sees anything ------------------------------------
_NUMBER = r"[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d{1,3})?"
_NAME = r"[A-Za-z°µμΩ%][A-Za-z_°µμΩ]*"
_POWER = r"(?:(?:\^|\*\*)[+-]?\d{1,2}|[²³])"
_FACTOR = rf"{_NAME}{_POWER}?"
_UNIT = rf"{_FACTOR}(?:(?:\s*[*·/]\s*|\s+){_FACTOR})*"
_NUMBER_AND_UNIT = re.compile(rf"\s*(?P<number>{_NUMBER})\s*(?P<unit>{_UNIT})?\s*")
_UNIT_ONLY = re.compile(rf"\s*{_UNIT}\s*")
_NOT_FINITE = re.compile(r"\s*[+-]?(?:nan|inf|infinity)\b.*", re.IGNORECASE)
_LOOKALIKES = str.maketrans({"−": "-", "\u00a0": " ", "\u202f": " ", "\u2009": " ", "⋅": "·"})

_CACHE_LIMIT = 1024
# ISO 80000-1 decimal prefixes read without pint, on internal units that are one SI symbol
_SI_PREFIXES = {"k": 1e3, "M": 1e6}
_PREFIXABLE_INTERNAL = ("N", "W")
_SPAN = 1e6
_conversions: dict[tuple[str, str], tuple[float, float]] = {}
_registry: pint.UnitRegistry[float] | None = None


def _spec(quantity: str) -> QuantitySpec:
    try:
        return QUANTITIES[quantity]
    except KeyError:
        raise QuantityError(f"unknown quantity {quantity!r}") from None


def _shown(text: str) -> str:
    """The user's text, shortened for a one-line message."""
    return clipped(text, 40)


def unit_registry() -> pint.UnitRegistry[float]:
    """The pint registry, created on first use (with pint's on-disk cache when it can write one)."""
    global _registry
    if _registry is None:
        import pint

        registry: pint.UnitRegistry[float]
        try:
            registry = pint.UnitRegistry(cache_folder=":auto:")
        except OSError:  # no writable cache folder: build the registry from its definitions
            registry = pint.UnitRegistry()
        registry.define("@alias turn = r = rev")  # "r/min" (ISO 80000 symbol) and "Mrev"
        _registry = registry
    return _registry


def _root(units: pint.Unit) -> object:
    """pint root units, keeping the radian (so angles and plain numbers stay distinct)."""
    return unit_registry().get_root_units(units)[1]


def _noun_for(units: pint.Unit) -> str | None:
    """The table's noun for a unit's dimension, if any quantity has it (the first row wins:
    an angle and a number of revolutions share pint's root unit, the radian)."""
    root = _root(units)
    ureg = unit_registry()
    for spec in QUANTITIES.values():
        if _root(ureg.parse_units(spec.internal)) == root:
            return spec.noun
    return None


def _exact_conversion(unit_text: str, spec: QuantitySpec) -> tuple[float, float] | None:
    """(a, 0) for the internal unit itself (or one of its aliases) or its k/M-prefixed form
    (ISO 80000-1); else None."""
    if unit_text == spec.internal or unit_text in spec.aliases:
        return 1.0, 0.0
    prefix, rest = unit_text[:1], unit_text[1:]
    if prefix in _SI_PREFIXES and rest == spec.internal and rest in _PREFIXABLE_INTERNAL:
        return _SI_PREFIXES[prefix], 0.0
    return None


def _conversion(unit_text: str, quantity: str, shown: str) -> tuple[float, float]:
    """(a, b) with internal = a·x + b for a value x in ``unit_text``; cached after first use."""
    key = (unit_text, quantity)
    cached = _conversions.get(key)
    if cached is not None:
        return cached
    spec = _spec(quantity)
    exact = _exact_conversion(unit_text, spec)
    if exact is not None:
        return exact
    try:
        factor, offset = _pint_conversion(unit_text, quantity, spec, shown)
    except (ArithmeticError, RecursionError, MemoryError):  # "kN**99": pint's scale overflows
        raise QuantityError(f"{shown}: the unit {clipped(unit_text, 30)} is out of range") from None
    if not (math.isfinite(factor) and math.isfinite(offset)) or factor == 0.0:
        raise QuantityError(f"{shown}: the unit {clipped(unit_text, 30)} is out of range")
    if len(_conversions) < _CACHE_LIMIT:
        _conversions[key] = (factor, offset)
    return factor, offset


def _pint_conversion(unit_text: str, quantity: str, spec: QuantitySpec,
                     shown: str) -> tuple[float, float]:
    """(a, b) for ``unit_text`` from pint, checking its dimension against ``spec``."""
    import pint

    ureg = unit_registry()
    try:
        units = ureg.parse_units(unit_text)
    except pint.UndefinedUnitError as error:
        raise QuantityError(f"{shown}: unknown unit {quoted(str(error.args[0]), 30)}") from None
    except (pint.PintError, ValueError, TypeError, SyntaxError):
        raise QuantityError(f"{shown}: cannot read the unit {quoted(unit_text, 30)}") from None
    internal = ureg.parse_units(spec.internal)
    if _root(units) != _root(internal):
        other = _noun_for(units)
        what = f"is {other}, not" if other else f"has dimension {units.dimensionality}, not"
        hint = ": write r/min, r/s or rad/s, e.g. 1200 r/min" if quantity == "speed" else ""
        raise QuantityError(f"{shown} {what} {spec.noun}{hint}")
    try:
        offset = float(ureg.Quantity(0.0, units).to(internal).magnitude)
        # the slope over a wide span, so an offset unit's rounding in ``offset`` does not leak in
        factor = (float(ureg.Quantity(_SPAN, units).to(internal).magnitude) - offset) / _SPAN
    except pint.PintError:  # e.g. an offset unit inside a product, "°C·m"
        raise QuantityError(f"{shown}: cannot convert {quoted(unit_text, 30)} to {spec.internal}") from None
    return factor, offset


def parse(text: str, quantity: str, *, default_unit: str | None = None) -> float:
    """Read ``text`` ("2 kN", "1200 r/min", "70 °C", or a plain number with ``default_unit``)
    as ``quantity`` and return the value in the quantity's internal unit.

    Raises :class:`QuantityError` with a one-line message for anything that is not
    ``number [unit]`` of the right dimension, for nan/inf and for temperatures below absolute zero.
    """
    spec = _spec(quantity)
    if not isinstance(text, str):
        raise QuantityError(f"expected text, got {type(text).__name__}")
    if len(text) > MAX_TEXT_LENGTH:
        raise QuantityError(f"too long: {len(text)} characters (at most {MAX_TEXT_LENGTH})")
    if any(unicodedata.category(ch) in ("Cc", "Cf") for ch in text):
        raise QuantityError("contains a control character")
    text = text.translate(_LOOKALIKES)
    if not text.strip():
        raise QuantityError(f"empty: give a value, e.g. {spec.example}")
    match = _NUMBER_AND_UNIT.fullmatch(text)
    if match is None:
        if _NOT_FINITE.fullmatch(text):
            raise QuantityError(f"{_shown(text)}: not a finite number")
        if _UNIT_ONLY.fullmatch(text):
            raise QuantityError(f"{_shown(text)}: a unit with no number, e.g. {spec.example}")
        raise QuantityError(f"{_shown(text)}: not of the form number [unit], e.g. {spec.example}")
    value = float(match["number"])
    if not math.isfinite(value):
        raise QuantityError(f"{_shown(text)}: not a finite number (too large)")
    unit_text = match["unit"]
    if unit_text is None:
        if default_unit is None and quantity != "dimensionless":
            raise QuantityError(f"{_shown(text)}: give a unit, e.g. {spec.example}")
        unit_text = default_unit or ""
    factor, offset = _conversion(unit_text, quantity, _shown(text))
    result = factor * value + offset
    if not math.isfinite(result):
        raise QuantityError(f"{_shown(text)}: not a finite number (too large)")
    if quantity == "temperature" and result < ABSOLUTE_ZERO_C - 1e-9:
        raise QuantityError(f"{_shown(text)} is below absolute zero ({ABSOLUTE_ZERO_C} °C)")
    return result


def unit_label(quantity: str, system: System) -> str:
    """The display unit of ``quantity`` in ``system`` (for SI force the base unit, N)."""
    spec = _spec(quantity)
    if system == "SI":
        return spec.si
    if system == "US":
        return spec.us
    raise QuantityError(f"unknown unit system {system!r} (SI or US)")


def _to_unit(value: float, quantity: str, label: str) -> float:
    factor, offset = _conversion(label, quantity, label)
    return (value - offset) / factor


def _from_unit(value: float, quantity: str, label: str) -> float:
    factor, offset = _conversion(label, quantity, label)
    return factor * value + offset


def to_display(value: float, quantity: str, system: System) -> float:
    """``value`` (internal unit) expressed in ``unit_label(quantity, system)``."""
    return _to_unit(value, quantity, unit_label(quantity, system))


def from_display(value: float, quantity: str, system: System) -> float:
    """A number in ``unit_label(quantity, system)`` expressed in the internal unit."""
    return _from_unit(value, quantity, unit_label(quantity, system))


# The engine's units as derivation steps name them (the unit spec of a step's placeholder, see
# ``engine.record.Step``), and the quantity each is.
ENGINE_UNIT_QUANTITY: dict[str, str] = {
    "N": "force", "mm": "length", "r/min": "speed", "h": "time", "mm²/s": "viscosity",
    "°C": "temperature", "N·m": "torque", "W": "power", "kg": "mass",
}


def step_number_writer(system: System) -> Callable[[float, str], str]:
    """How a display in ``system`` writes the numbers of a derivation step: a number tagged with
    an engine unit in the display's unit (with the unit after it where the tag ends in "+"), a
    number whose relation is stated in the engine unit ("=mm") as it is, with that unit written
    whenever the display's unit differs; an untagged number as it is."""

    def write(value: float, spec: str) -> str:
        unit = spec.strip("=+")
        quantity = ENGINE_UNIT_QUANTITY.get(unit)
        if quantity is None or not math.isfinite(value):
            return engine_units(value, spec)
        label = unit_label(quantity, system)
        if spec.startswith("="):
            return f"{fmt(value)} {unit}" if spec.endswith("+") or label != unit else fmt(value)
        shown = fmt(to_display(value, quantity, system))
        return f"{shown} {label}".rstrip() if spec.endswith("+") else shown

    return write


def format_quantity(value: float, quantity: str, system: System, digits: int = 4) -> str:
    """``value`` (internal unit) as text in ``system``'s display unit, ``digits`` significant
    figures: "2.5 kN", "450 lbf", "70 °C", "15°".  The text parses back with :func:`parse`.
    """
    label = unit_label(quantity, system)
    spec = _spec(quantity)
    if system == "SI" and spec.si_large is not None:
        if abs(_to_unit(value, quantity, label)) >= KILO_FROM_N:
            label = spec.si_large
    shown = _to_unit(value, quantity, label)
    number = fmt(shown, digits)
    if quantity == "temperature" and _from_unit(float(number), quantity, label) < ABSOLUTE_ZERO_C:
        # rounding took a temperature at absolute zero below it ("-459.67 °F" to "-459.7 °F"),
        # which would not read back: round toward warmer at the last printed digit instead
        step = 10.0 ** (math.floor(math.log10(abs(shown))) - digits + 1)
        number = fmt(math.ceil(shown / step) * step, digits)
    if not label:
        return number
    if label == "°":
        return f"{number}°"
    return f"{number} {label}"
