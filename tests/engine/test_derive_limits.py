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


def test_load_rounding_to_zero_without_af_names_a_load_not_af() -> None:
    """With af = 1 (no application factor) a P that rounds to zero is the loads' fault, not af's
    (issue 15 item 8: bad input names the input). Fr = 0, Fa = 5e-324 on a tapered bearing with
    the maker's Y = 0.4 (below one half): Fa/Fr > e, P = 0.4·0 + 0.4·5e-324 rounds to 0.0."""
    assert 0.4 * 5e-324 == 0.0
    case = CaseInputs(kind="tapered", fr=0.0, fa=5e-324, c=33000.0, c0=19000.0, speed=100.0,
                      e_given=1.5, y_given=0.4)
    assert _refused(case).field in ("fr", "fa")
    assert _refused(replace(case, af=0.5)).field == "af"


@pytest.mark.parametrize("angle", [90.5, 91.0])
def test_thrust_contact_angle_past_90_degrees_is_refused(angle: float) -> None:
    """A contact angle is measured from the radial plane; past 90° it is not an angle of a thrust
    bearing (ISO 281:2007 §3 definition of the nominal contact angle, closed geometry)."""
    case = CaseInputs(kind="thrust-ball", fr=0.0, fa=5000.0, c=50000.0, c0=90000.0, speed=100.0,
                      contact_angle=angle)
    assert _refused(case).field == "contact_angle"
    assert derive(replace(case, contact_angle=90.0)).results["P"] == pytest.approx(5000.0)
