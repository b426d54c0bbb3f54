"""The pint-free fast path for plain units agrees with pint and keeps pint unloaded."""

from __future__ import annotations

import subprocess
import sys

import pint
import pytest

from workbench.model.quantities import parse

UREG = pint.UnitRegistry()  # the reference library


@pytest.mark.parametrize(("text", "quantity", "unit"),
                         [("2 kN", "force", "N"), ("3.5 MN", "force", "N"), ("450 N", "force", "N"),
                          ("15 kW", "power", "W"), ("80 mm", "length", "mm")])
def test_fast_path_equals_pint(text: str, quantity: str, unit: str) -> None:
    """Prefixed SI units (ISO 80000-1) convert exactly as pint converts them."""
    assert parse(text, quantity) == pytest.approx(UREG.Quantity(text).to(unit).magnitude, rel=1e-12)


def test_plain_units_do_not_load_pint() -> None:
    """Opening a session of plain 'number unit' values need not import pint (start-up time)."""
    code = ("import sys; from workbench.model.quantities import parse; "
            "parse('2 kN', 'force'); parse('80 mm', 'length'); print('pint' in sys.modules)")
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False"


def test_speed_in_either_spelling_does_not_load_pint() -> None:
    """The workbench writes r/min (ISO 80000-3) and reads rpm, the spelling older sessions and
    habits use, as the same unit; neither loads pint (every session has speeds)."""
    code = ("import sys; from workbench.model.quantities import parse; "
            "print(parse('1200 r/min', 'speed'), parse('1200 rpm', 'speed'), 'pint' in sys.modules)")
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.split() == ["1200.0", "1200.0", "False"]
    # reference: pint reads rpm as revolutions per minute
    assert parse("1200 rpm", "speed") == pytest.approx(UREG.Quantity("1200 rpm").to("rpm").magnitude)
