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
