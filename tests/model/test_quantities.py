"""The unit edge, checked against pint (the reference library) with its own, untouched registry."""

from __future__ import annotations

import math
import re
import subprocess
import sys
from pathlib import Path

import pint
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from workbench.model import quantities
from workbench.model.quantities import (
    QUANTITIES,
    QuantityError,
    format_quantity,
    from_display,
    parse,
    step_number_writer,
    to_display,
    unit_label,
)
from workbench.engine.derive import CaseInputs, derive
from workbench.engine.record import Step, fmt

# reference: pint's default definitions, plus "rev" as another name for pint's own "turn"
REFERENCE = pint.UnitRegistry()
REFERENCE.define("@alias turn = rev")


PINT_SPELLING = {"r/min": "rpm"}
"""pint's own registry has no "r" (the ISO 80000-3 revolution symbol); its "rpm" is r/min."""


def pint_value(magnitude: float, unit: str, internal: str) -> float:
    """The conversion as pint itself does it."""
    unit, internal = PINT_SPELLING.get(unit, unit), PINT_SPELLING.get(internal, internal)
    return float(REFERENCE.Quantity(magnitude, unit).to(internal).magnitude)


# ---- conversions equal pint's ---------------------------------------------------------------
@pytest.mark.parametrize(
    ("text", "quantity", "magnitude", "unit", "internal"),
    [
        ("2 kN", "force", 2.0, "kN", "N"),
        ("0.7kN", "force", 0.7, "kN", "N"),
        ("450 lbf", "force", 450.0, "lbf", "N"),
        ("1.25 in", "length", 1.25, "inch", "mm"),
        ("158 degF", "temperature", 158.0, "degF", "degC"),
        ("-40 °F", "temperature", -40.0, "degF", "degC"),
        ("300 K", "temperature", 300.0, "K", "degC"),
        ("68 cSt", "viscosity", 68.0, "cSt", "mm**2/s"),
        ("1200 rpm", "speed", 1200.0, "rpm", "rpm"),
        ("25 rad/s", "speed", 25.0, "rad/s", "rpm"),
        ("3 d", "time", 3.0, "day", "h"),
        ("40 lbf·ft", "torque", 40.0, "lbf*ft", "N*m"),
        ("7.5 hp", "power", 7.5, "hp", "W"),
        ("3 lb", "mass", 3.0, "lb", "kg"),
        ("0.2 rad", "angle", 0.2, "rad", "deg"),
    ],
)
def test_conversion_equals_pint(
    text: str, quantity: str, magnitude: float, unit: str, internal: str
) -> None:
    # reference: pint Quantity(magnitude, unit).to(internal)
    expected = pint_value(magnitude, unit, internal)
    assert parse(text, quantity) == pytest.approx(expected, rel=1e-12, abs=1e-12)


def test_spellings_the_brief_names() -> None:
    # closed forms: definitions of the units (r/min is the ISO 80000 symbol for rpm; cSt = mm²/s)
    assert parse("1200 r/min", "speed") == pytest.approx(1200.0)
    assert parse("20 r/s", "speed") == pytest.approx(1200.0)
    assert parse("20000 h", "time") == 20000.0
    assert parse("70 °C", "temperature") == 70.0
    assert parse("15°", "angle") == 15.0
    assert parse("100 Mrev", "revolutions") == pytest.approx(100.0)
    assert parse("68 mm²/s", "viscosity") == pytest.approx(68.0)
    assert parse("68 mm^2/s", "viscosity") == pytest.approx(68.0)
    assert parse("0.5", "dimensionless") == 0.5
    assert parse("5 %", "dimensionless") == pytest.approx(0.05)


def test_plain_number_needs_a_default_unit() -> None:
    assert parse("1200", "speed", default_unit="rpm") == 1200.0
    assert parse("2", "force", default_unit="kN") == 2000.0
    with pytest.raises(QuantityError, match="give a unit, e.g. 2 kN"):
        parse("2", "force")


def test_negative_numbers_parse_but_not_below_absolute_zero() -> None:
    assert parse("-5 kN", "force") == -5000.0
    assert parse("−3 N", "force") == -3.0  # a typographic minus sign
    assert parse("-40 °C", "temperature") == -40.0
    # closed form: 0 K = -273.15 °C (definition of the Celsius scale)
    assert parse("0 K", "temperature") == pytest.approx(-273.15)
    with pytest.raises(QuantityError, match="absolute zero"):
        parse("-300 °C", "temperature")
    with pytest.raises(QuantityError, match="absolute zero"):
        parse("-500 degF", "temperature")


# ---- refusals -------------------------------------------------------------------------------
@pytest.mark.parametrize(
    ("text", "quantity", "problem"),
    [
        ("5 kg", "force", "5 kg is a mass, not a force"),
        ("2 kN", "length", "is a force, not a length"),
        ("15°", "dimensionless", "is an angle, not a plain number"),
        ("50 Hz", "speed", "not a rotational speed"),
        ("kN", "force", "a unit with no number"),
        ("nan", "force", "not a finite number"),
        ("inf kN", "force", "not a finite number"),
        ("-Infinity N", "force", "not a finite number"),
        ("1e999 N", "force", "not a finite number"),
        ("", "force", "empty"),
        ("   ", "force", "empty"),
        ("2 kN\n", "force", "control character"),
        ("2\x00 kN", "force", "control character"),
        ("2\u200b kN", "force", "control character"),
        ("9**9**9 kN", "force", "not of the form number [unit]"),
        ("2*3 kN", "force", "not of the form number [unit]"),
        ("2 kN*3", "force", "not of the form number [unit]"),
        ("__import__('os')", "force", "not of the form number [unit]"),
        ("1,5 kN", "force", "not of the form number [unit]"),
        ("2 furlongs_per_week", "force", "unknown unit"),
        ("2 °C·m", "temperature", "not a temperature"),
    ],
)
def test_refusals_name_the_problem(text: str, quantity: str, problem: str) -> None:
    with pytest.raises(QuantityError) as caught:
        parse(text, quantity)
    assert problem in caught.value.message
    assert "\n" not in caught.value.message


def test_long_and_hostile_text_is_refused() -> None:
    # these must return at once: the grammar check runs before pint could evaluate anything
    with pytest.raises(QuantityError, match="too long"):
        parse("9" * 10_000 + " kN", "force")
    with pytest.raises(QuantityError, match="too long"):
        parse("x" * 201, "force")
    with pytest.raises(QuantityError):
        parse("9**9**9 kN", "force")
    with pytest.raises(QuantityError):
        parse("9" * 150 + "**9 kN", "force")


def test_unknown_quantity_and_system() -> None:
    with pytest.raises(QuantityError, match="unknown quantity"):
        parse("2 kN", "pressure")
    with pytest.raises(QuantityError, match="unknown unit system"):
        unit_label("force", "metric")  # type: ignore[arg-type]


# ---- speed and laziness ---------------------------------------------------------------------
def test_import_does_not_load_pint() -> None:
    code = "import sys, workbench.model.quantities; print('pint' in sys.modules)"
    repository = Path(__file__).resolve().parents[2]
    result = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, check=True, cwd=repository
    )
    assert result.stdout.strip() == "False"


def test_repeated_parses_do_not_touch_pint(monkeypatch: pytest.MonkeyPatch) -> None:
    first = parse("3.5 lbf", "force")

    def no_pint() -> None:
        raise AssertionError("pint was consulted on a cached unit")

    monkeypatch.setattr(quantities, "unit_registry", no_pint)
    assert parse("7 lbf", "force") == pytest.approx(2 * first)


# ---- display --------------------------------------------------------------------------------
def test_display_units_per_system() -> None:
    si = {q: unit_label(q, "SI") for q in QUANTITIES}
    us = {q: unit_label(q, "US") for q in QUANTITIES}
    assert si["force"] == "N" and us["force"] == "lbf"
    assert si["length"] == "mm" and us["length"] == "in"
    assert si["viscosity"] == "mm²/s" and us["viscosity"] == "cSt"
    assert si["temperature"] == "°C" and us["temperature"] == "°F"
    assert si["torque"] == "N·m" and us["torque"] == "lbf·ft"
    assert si["power"] == "kW" and us["power"] == "hp"
    assert si["speed"] == us["speed"] == "r/min"  # ISO 80000-3


def test_format_examples() -> None:
    # reference values: pint conversions of the same numbers (2500 N = 562.0 lbf; 70 °C = 158 °F)
    assert format_quantity(2500.0, "force", "SI") == "2.5 kN"
    assert format_quantity(999.0, "force", "SI") == "999 N"
    assert format_quantity(-2500.0, "force", "SI") == "-2.5 kN"
    assert format_quantity(2500.0, "force", "US") == f"{pint_value(2500, 'N', 'lbf'):.4g} lbf"
    assert format_quantity(70.0, "temperature", "US") == "158 °F"
    assert format_quantity(70.0, "temperature", "SI") == "70 °C"
    assert format_quantity(15.0, "angle", "SI") == "15°"
    assert format_quantity(5000.0, "power", "SI") == "5 kW"
    assert format_quantity(0.25, "dimensionless", "US") == "0.25"
    assert format_quantity(25.4, "length", "US", digits=3) == "1 in"


@pytest.mark.parametrize("quantity", sorted(QUANTITIES))
@pytest.mark.parametrize("system", ["SI", "US"])
def test_to_display_equals_pint_and_inverts(quantity: str, system: str) -> None:
    internal = QUANTITIES[quantity].internal
    label = unit_label(quantity, system)  # type: ignore[arg-type]
    value = 37.25
    # reference: pint converts the internal value to the display unit
    expected = pint_value(value, internal or "dimensionless", label or "dimensionless")
    shown = to_display(value, quantity, system)  # type: ignore[arg-type]
    assert shown == pytest.approx(expected, rel=1e-12)
    back = from_display(shown, quantity, system)  # type: ignore[arg-type]
    assert back == pytest.approx(value, rel=1e-12)


_PRINTED = re.compile(r"(?P<number>[+-]?[0-9.]+(?:e[+-]?[0-9]+)?)\s*(?P<unit>.*)")


def _value_strategy() -> st.SearchStrategy[tuple[str, str, float, int]]:
    def for_quantity(quantity: str) -> st.SearchStrategy[tuple[str, str, float, int]]:
        low = -273.15 if quantity == "temperature" else -1e9
        values = st.floats(min_value=low, max_value=1e9, allow_nan=False, allow_infinity=False)
        systems = st.sampled_from(["SI", "US"])
        return st.tuples(st.just(quantity), systems, values, st.integers(2, 8))

    return st.sampled_from(sorted(QUANTITIES)).flatmap(for_quantity)


@settings(max_examples=200, deadline=None)
@given(_value_strategy())
def test_format_then_parse_round_trips_within_printed_digits(
    case: tuple[str, str, float, int],
) -> None:
    quantity, system, value, digits = case
    text = format_quantity(value, quantity, system, digits)  # type: ignore[arg-type]
    back = parse(text, quantity)
    # tolerance: half a unit in the last printed digit, in the printed unit, via pint's scale
    match = _PRINTED.fullmatch(text)
    assert match is not None, text
    unit = match["unit"] or "dimensionless"
    internal = QUANTITIES[quantity].internal or "dimensionless"
    shown = abs(float(match["number"]))
    scale = abs(pint_value(2.0, unit, internal) - pint_value(1.0, unit, internal))
    last_digit = 10 ** (math.floor(math.log10(shown)) - digits + 1) if shown > 0 else 0.0
    tolerance = 0.5 * last_digit * scale * (1 + 1e-9) + 1e-9 * (1 + abs(value))
    if quantity == "temperature" and value - 2 * last_digit * scale < -273.15:
        # at absolute zero the text is rounded toward warmer, so that it reads back: a whole digit
        tolerance *= 2
    assert abs(back - value) <= tolerance, (text, back, value)


@pytest.mark.parametrize("digits", range(2, 9))
@pytest.mark.parametrize("system", ["SI", "US"])
def test_absolute_zero_reads_back(digits: int, system: str) -> None:
    """−273.15 °C is −459.67 °F (pint): its text, at any precision, is never below absolute zero."""
    assert pint_value(-273.15, "degC", "degF") == pytest.approx(-459.67)
    text = format_quantity(-273.15, "temperature", system, digits)  # type: ignore[arg-type]
    assert parse(text, "temperature") >= -273.15 - 1e-9


# ---- derivation numbers in the display's unit system ---------------------------------------------
LUBRICATED = CaseInputs(kind="deep-groove", fr=5200.0, fa=2500.0, c=33000.0, c0=19000.0, f0=14.0,
                        speed=700.0, vg=68.0, temp=70.0, dm=60.0, cleanliness="normal")


def test_derivation_numbers_follow_the_us_display() -> None:
    """Under a result in lbf the substituted forces are lbf too (pint: 1 N = 0.2248 lbf), and a
    relation stated in °C or mm keeps its unit and says so."""
    d = derive(LUBRICATED)
    us = step_number_writer("US")
    lbf = pint_value(1.0, "N", "lbf")
    y = d.results["Y"]
    assert d.step("P").substituted_in(us) == f"0.56 × {fmt(5200 * lbf)} + {fmt(y)} × {fmt(2500 * lbf)}"
    assert d.step("s0").substituted_in(us) == f"{fmt(19000 * lbf)} / {fmt(5200 * lbf)}"
    # T = t + 273.15 is stated in °C: it keeps °C in any display, so the sum reads true
    # (it read "158 °F = 343.1 K"); pint: 70 °C is 343.15 K
    assert d.step("T").substituted_in(us) == "70 °C + 273.15"
    assert d.step("T").value == pytest.approx(pint_value(70.0, "degC", "K"))
    assert "(60 mm)^−0.5" in d.step("nu1").substituted_in(us)
    si = step_number_writer("SI")
    for step in d.steps:  # in SI the display writes what the engine writes
        assert step.substituted_in(si) == step.substituted, step.key
    assert d.step("T").substituted == "70 °C + 273.15"


@pytest.mark.parametrize("text", ["1 kN**99", "1 kN^99", "1e300 TN", "1 N*kN*MN*GN*TN*PN*EN"])
def test_overflowing_units_and_values_are_a_message(text: str) -> None:
    """A unit whose scale overflows pint (10^297 for kN**99) or a value past the double range
    is a one-line QuantityError, not an OverflowError (the issue's second door into pint)."""
    with pytest.raises(QuantityError):
        parse(text, "force")


def test_solver_target_goes_through_the_same_guard() -> None:
    """'Lnm=1 kN**99' as a solver target is refused by the same door (FieldError on target)."""
    from workbench.model.fields import FieldError
    from workbench.model.targets import parse_target_text

    with pytest.raises(FieldError, match="target"):
        parse_target_text("Lnm=1 kN**99")


# ---- how a derivation writes its numbers (engine.record.fmt, which format_quantity uses) ----

def _rounded(value: float, digits: int) -> float:
    """``value`` to ``digits`` significant figures, by decimal places (the schoolbook way)."""
    return round(value, digits - 1 - math.floor(math.log10(abs(value))))


@pytest.mark.parametrize("value", [2_811_344.0, 123_456.7, 54_321.0, 987_654.3, 1_234.5678,
                                   0.012_345_6, 47.25, 9_999_999.0])
def test_a_number_keeps_four_significant_figures_written_out_or_not(value: float) -> None:
    # a life of 2 811 344 h was written "2811344 h", seven figures where four were meant
    text = fmt(value)
    assert "e" not in text
    assert float(text) == pytest.approx(_rounded(value, 4), rel=1e-12)
    assert len(text.replace(".", "").strip("0")) <= 4


def test_past_ten_million_a_number_takes_an_exponent() -> None:
    assert fmt(60_551_234.0) == "6.055e+07"


@pytest.mark.parametrize(("template", "args", "expected"), [
    ("−{0}/{1}", (-296700.0, 180.0), "−(-296700)/180"),
    ("√({0}² + {1}²)", (-461.6, -48.1), "√((-461.6)² + (-48.1)²)"),
    ("−({0}) − ({1})", (-12.5, 4.0), "−(-12.5) − (4)"),
    ("ΣM = {0}", (-296700.0,), "ΣM = -296700"),
    ("{0} × {1}", (-2.0, 3.0), "-2 × 3"),
    ("{0} × {1}", (2.0, -3.0), "2 × (-3)"),
])
def test_a_negative_number_bound_by_an_operator_or_a_power_is_bracketed(
        template: str, args: tuple[float, ...], expected: str) -> None:
    # "−-296700/180" and "√(-461.6² + …)" (which reads as −(461.6²)) were written before
    step = Step(key="x", symbol="x", label="x", formula="x", template=template, args=args,
                value=0.0, unit="", source="")
    assert step.substituted == expected
