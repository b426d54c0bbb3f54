"""derive() at the edge of floating point: an overflow is an InputError naming the input.

References: IEEE 754 double range (largest finite ≈ 1.8e308, smallest subnormal 5e-324) and
the relations themselves — L10 = (C/P)^p (ISO 281:2007 §5–§8) and the three-parameter Weibull
life factor x0 + (θ − x0)·(ln 1/R)^(1/b) — evaluated here only to show they leave the range.
"""

from __future__ import annotations

import math
import sys
from dataclasses import replace

import pytest

from workbench.engine.derive import CaseInputs, derive
from workbench.engine.record import InputError
from workbench.engine.solve import solve

CASE = CaseInputs(kind="deep-groove", fr=1000.0, fa=0.0, c=33000.0, c0=19000.0, speed=100.0)


def _refused(case: CaseInputs) -> InputError:
    with pytest.raises(InputError) as caught:
        derive(case)
    return caught.value


def test_bare_c_of_1e308_is_refused_not_an_infinite_life() -> None:
    """(1e308/1000)^3 exceeds the double range: no 'infinite life' with exit 0."""
    assert (1e308 / 1000.0) > sys.float_info.max ** (1 / 3)
    assert _refused(replace(CASE, c=1e308)).field == "c"


def test_smallest_application_factor_is_refused_naming_af() -> None:
    """af = 5e-324 (the smallest subnormal) sends C/(af·P) past the range."""
    assert _refused(replace(CASE, af=5e-324)).field == "af"


def test_load_rounding_to_zero_is_refused() -> None:
    """Fr = 5e-324 with af = 0.5: af·P rounds to 0.0, and C/P would divide by zero."""
    assert 5e-324 * 0.5 == 0.0
    assert _refused(replace(CASE, fr=5e-324, af=0.5)).field == "af"


def test_weibull_factor_overflow_names_b() -> None:
    """(ln 1/0.01)^(1/0.001) = 4.6^1000 overflows a double."""
    with pytest.raises(OverflowError):
        math.log(1 / 0.01) ** (1 / 0.001)
    case = replace(CASE, reliability_model="weibull", reliability=0.01, weibull_b=0.001)
    assert _refused(case).field == "weibull_b"


def test_hours_beyond_the_range_name_the_speed() -> None:
    """L10 = 35937 (10⁶ rev) at 1e-300 r/min is beyond any number of hours."""
    assert _refused(replace(CASE, speed=1e-300)).field == "speed"


def test_load_scale_solve_with_tiny_af_ends_in_an_answer_not_a_crash() -> None:
    """A load-scale solve with af = 5e-324 ends in InputError (NoSolution), not ZeroDivisionError."""
    with pytest.raises(InputError):
        solve(replace(CASE, af=5e-324), "load_scale", "Lnm", 20000.0)
