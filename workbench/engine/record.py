"""The derivation record: every number the workbench shows comes from one of these.

A :class:`Derivation` is an ordered list of :class:`Step` objects plus a ``results`` mapping and
the warnings raised on the way.  Steps keep their numbers raw; the text with numbers substituted
is formatted only when something displays it (``Step.substituted``), so building a record stays
cheap in the hot path.
"""

from __future__ import annotations

import string
from collections.abc import Callable
from dataclasses import dataclass
from typing import Any, TypeAlias


class InputError(ValueError):
    """A value the engine refuses, with the name of the input it belongs to."""

    def __init__(self, field_name: str, message: str) -> None:
        super().__init__(f"{field_name}: {message}")
        self.field = field_name
        self.message = message


NumberWriter: TypeAlias = Callable[[float, str], str]
"""Writes one number of a step for display, given its placeholder's unit spec."""


def engine_units(value: float, spec: str) -> str:
    """A step's number in the engine's own unit: the number, and the unit where the spec asks."""
    unit = spec.removeprefix("=").removesuffix("+")
    return with_unit(fmt(value), unit) if spec.endswith("+") else fmt(value)


OPERATOR_BEFORE = ("−", "-", "+", "×", "/", "·", "^", "√")
"""Text a substituted number may follow that binds it: a negative number there is bracketed."""
POWER_AFTER = ("²", "³", "^")
"""Text a substituted number may precede that binds it: a negative number there is bracketed."""


def _substitute(template: str, args: tuple[Any, ...], write: NumberWriter) -> str:
    """``template`` with each placeholder's number written by ``write(value, spec)``; a
    negative number that follows an operator or carries a power is put in brackets, so that
    "−{0}/{1}" reads "−(-296700)/180" and "{0}²" reads "(-461.6)²", never "−-296700" or "-461.6²"
    (which reads as −(461.6²))."""
    parsed = list(string.Formatter().parse(template))
    pieces: list[str] = []
    auto = 0
    for number, (literal, field, spec, _) in enumerate(parsed):
        pieces.append(literal)
        if field is None:
            continue
        index = int(field) if field else auto
        auto += 1
        value = args[index]
        text = write(value, spec or "")
        following = parsed[number + 1][0] if number + 1 < len(parsed) else ""
        binds = literal.rstrip().endswith(OPERATOR_BEFORE) or following.startswith(POWER_AFTER)
        pieces.append(f"({text})" if binds and isinstance(value, float | int) and value < 0
                      else text)
    return "".join(pieces)


def with_unit(number: str, unit: str) -> str:
    """A written number and its unit, as every display writes a value: "216 h", and a unit that
    begins with a power of ten after "×" ("216 × 10⁶ rev", ISO 80000-1); the number alone
    without a unit."""
    if not unit:
        return number
    return f"{number} × {unit}" if unit.startswith("10") else f"{number} {unit}"


def fmt(value: float, digits: int = 4) -> str:
    """Format a number for a derivation line: ``digits`` significant figures, no exponent clutter."""
    if value != value:  # NaN
        return "undefined"
    if value in (float("inf"), float("-inf")):
        return "∞" if value > 0 else "−∞"
    magnitude = abs(value)
    if magnitude != 0 and (magnitude >= 1e7 or magnitude < 1e-4):
        return f"{value:.{digits - 1}e}"
    text = f"{value:.{digits}g}"
    if "e" in text:  # e.g. 1.235e+05 at 4 digits: written out in full, 123500
        text = f"{float(text):.0f}"
    return text


def signed(value: float | None) -> str:
    """An elasticity with its sign, three decimals ("n/a" when there is none)."""
    return "n/a" if value is None else f"{value + 0.0:+.3f}"


def percent(value: float | None) -> str:
    """A relative change as a signed percentage ("n/a" when there is none)."""
    return "n/a" if value is None else f"{100.0 * value + 0.0:+.1f} %"


@dataclass(slots=True)
class Step:
    """One line of a derivation.

    ``template`` is the formula with ``{0}``, ``{1}`` … where ``args`` go; ``substituted`` fills
    them in.  A placeholder may name the engine unit of its number, ``{0:N}``, so that a display
    can write it in its own unit system (:meth:`substituted_in`); ``{0:°C+}`` also writes the unit
    after the number, and ``{0:=mm}`` keeps the engine unit (the relation is stated in it) and
    writes it whenever the display's unit differs.  ``source`` names the standard and clause or
    table, or says ``common practice``.
    """

    key: str
    symbol: str
    label: str
    formula: str
    template: str
    args: tuple[float, ...]
    value: float
    unit: str
    source: str
    warning: str | None = None
    note: str | None = None

    @property
    def substituted(self) -> str:
        """The formula with the numbers put in, in the engine's units."""
        return self.substituted_in(engine_units)

    def substituted_in(self, write: NumberWriter) -> str:
        """The formula with each number written by ``write(value, spec)``, where ``spec`` is the
        placeholder's unit spec ("" when it has none; see the class notes)."""
        if not self.args:
            return self.template
        return _substitute(self.template, self.args, write)

    @property
    def value_text(self) -> str:
        """The result formatted for display."""
        return fmt(self.value)

    def as_dict(self) -> dict[str, Any]:
        """Plain data for JSON output and reports."""
        return {
            "key": self.key,
            "symbol": self.symbol,
            "label": self.label,
            "formula": self.formula,
            "substituted": self.substituted,
            "value": None if self.value != self.value else self.value,
            "unit": self.unit,
            "source": self.source,
            "warning": self.warning,
            "note": self.note,
        }


@dataclass(frozen=True, slots=True, kw_only=True)
class StepWords:
    """The words and raw numbers of one step, besides its key, value and warning.

    :meth:`Derivation.add` takes them as its keyword arguments; :meth:`Derivation.derived` takes a
    function that makes them, called only when the steps are kept.
    """

    symbol: str
    label: str
    formula: str
    template: str
    args: tuple[float, ...] = ()
    unit: str = ""
    source: str
    note: str | None = None


class Derivation:
    """Steps in order, the named results, and every warning raised while deriving.

    ``add`` stores each step's key, value, warning and :class:`StepWords`; :attr:`steps` turns
    them into :class:`Step` objects the first time something reads them.  The solver and the
    sensitivity sweep read only ``results`` (``keep_steps`` false): a producer that records with
    :meth:`derived` hands over its step's words as a function, called only when the steps are
    kept, so those callers never pay for composing them.
    """

    __slots__ = ("_raw", "_steps", "keep_steps", "results", "warnings", "notes")

    def __init__(self, keep_steps: bool = True) -> None:
        self.keep_steps = keep_steps  # False: results and warnings only (solver, sensitivity)
        self._raw: list[tuple[str, float, str | None, StepWords]] = []
        """(key, value, warning, words) of each step, made into :class:`Step` when read."""
        self._steps: list[Step] | None = None
        self.results: dict[str, float] = {}
        self.warnings: list[str] = []
        self.notes: list[str] = []

    def add(self, key: str, value: float, *, symbol: str, label: str, formula: str,
            template: str, args: tuple[float, ...] = (), unit: str = "", source: str,
            note: str | None = None, warning: str | None = None, result: bool = True) -> float:
        """Append a step (and, unless ``result`` is false, record it under ``key``); return value."""
        if self.keep_steps:
            words = StepWords(symbol=symbol, label=label, formula=formula, template=template,
                              args=args, unit=unit, source=source, note=note)
            self._raw.append((key, value, warning, words))
            self._steps = None
        if result:
            self.results[key] = value
        if warning is not None:
            self.warnings.append(warning)
        return value

    def derived(self, key: str, value: float, explain: Callable[[], StepWords], *,
                warning: str | None = None) -> float:
        """Record ``value`` under ``key`` with its warning, and its step from ``explain()``, which
        is called only when the steps are kept; return value."""
        if self.keep_steps:
            self._raw.append((key, value, warning, explain()))
            self._steps = None
        self.results[key] = value
        if warning is not None:
            self.warnings.append(warning)
        return value

    def extend(self, other: Derivation) -> None:
        """Append ``other``'s steps, results, warnings and notes after this record's own."""
        if self.keep_steps:
            self._raw.extend(other._raw)
            self._steps = None
        self.results.update(other.results)
        self.warnings.extend(other.warnings)
        self.notes.extend(other.notes)

    @property
    def steps(self) -> list[Step]:
        """The steps in order (built on first read)."""
        if self._steps is None:
            self._steps = [_step_of(raw) for raw in self._raw]
        return self._steps

    def peek(self, key: str) -> Step | None:
        """The last step recorded under ``key``, built alone (cheap), or None if there is none."""
        for raw in reversed(self._raw):
            if raw[0] == key:
                return _step_of(raw)
        return None

    def step(self, key: str) -> Step:
        """The last step recorded under ``key``."""
        for item in reversed(self.steps):
            if item.key == key:
                return item
        raise KeyError(key)

    @property
    def sources(self) -> list[str]:
        """Every distinct source cited, in order of first use."""
        return list(dict.fromkeys(words.source for _, _, _, words in self._raw))

    def as_dict(self) -> dict[str, Any]:
        """Plain data: ``results``, ``steps``, ``warnings``, ``notes``, ``sources``."""
        return {
            "results": {k: (None if v != v else v) for k, v in self.results.items()},
            "steps": [s.as_dict() for s in self.steps],
            "warnings": list(self.warnings),
            "notes": list(self.notes),
            "sources": self.sources,
        }


def _step_of(raw: tuple[str, float, str | None, StepWords]) -> Step:
    """The :class:`Step` of one stored (key, value, warning, words)."""
    key, value, warning, words = raw
    return Step(key=key, symbol=words.symbol, label=words.label, formula=words.formula,
                template=words.template, args=words.args, value=value, unit=words.unit,
                source=words.source, warning=warning, note=words.note)
