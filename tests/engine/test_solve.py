"""The back-solver: round trips for every unknown, closed forms, and honest failure."""

from __future__ import annotations

import math
from dataclasses import replace

import pytest
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

from workbench.engine.derive import CaseInputs, derive
from workbench.engine.record import InputError
from workbench.engine.solve import UNKNOWNS, NoSolution, apply_unknown, solve

BASE = CaseInputs(kind="deep-groove", fr=5200.0, fa=1100.0, c=33000.0, c0=19000.0, speed=1450.0,
                  reliability=0.95, af=1.2)
ROLLER = CaseInputs(kind="tapered", contact_angle=14.0, fr=9000.0, fa=2600.0, c=95000.0,
                    c0=110000.0, speed=600.0, nu=30.0, dm=80.0, cleanliness="high")


def test_required_rating_matches_closed_form() -> None:
    """C = af·P·(L/a1)^(1/p) with L in 10⁶ rev (ISO 281:2007 §5.3, Table 12), no aISO data."""
    target_h = 20000.0
    sol = solve(BASE, "c", "Lnm", target_h)
    d = derive(BASE)
    l_mrev = target_h * 60.0 * BASE.speed / 1e6
    expected = BASE.af * d.results["P"] * (l_mrev / d.results["a1"]) ** (1 / 3)
    assert sol.value == pytest.approx(expected, rel=1e-9)
    assert abs(sol.residual) <= 1e-9
    assert sol.derivation.results["Lnm"] == pytest.approx(target_h, rel=1e-9)


def test_roller_closed_form_exponent() -> None:
    """Roller exponent 10/3: solving C for L10 gives af·P·L^(3/10) (ISO 281:2007 §7.3)."""
    sol = solve(ROLLER, "c", "L10", 500.0)
    p = derive(ROLLER).results["P"]
    assert sol.value == pytest.approx(p * 500.0 ** 0.3, rel=1e-9)


def test_allowed_speed_closed_form() -> None:
    """L10h = 10⁶·L10/(60·n) gives n = 10⁶·L10/(60·L10h) for an hours target."""
    sol = solve(BASE, "speed", "L10h", 8000.0)
    l10 = derive(BASE).results["L10"]
    assert sol.value == pytest.approx(1e6 * l10 / (60 * 8000.0), rel=1e-9)


def test_solution_lands_on_the_right_branch() -> None:
    """Allowed Fa for a life well below the Fa = 0 life lies on the Fa/Fr > e branch, and says so."""
    sol = solve(BASE, "fa", "L10h", 900.0)
    assert "> e" in sol.branch
    assert derive(apply_unknown(BASE, "fa", sol.value)).results["L10h"] == pytest.approx(900.0, rel=1e-9)


def test_solution_is_part_of_the_derivation() -> None:
    """The solved value, bracket and evaluations are a step of the record."""
    sol = solve(BASE, "c", "L10h", 10000.0)
    step = sol.derivation.step("solved")
    assert step.value == sol.value
    assert "evaluations" in (step.note or "")
    assert sol.bracket[0] <= sol.value <= sol.bracket[1]


@pytest.mark.parametrize(
    ("case", "unknown", "target", "value", "field"),
    [
        (replace(BASE, speed=0.0), "c", "L10h", 10000.0, "speed"),     # hours undefined at n = 0
        (BASE, "reliability", "Lnm", 1e9, "reliability"),             # beyond any reliability
        (BASE, "c0", "s0", 5.0, None),                                # fine: a root exists
        (BASE, "fa", "s0", 100.0, "fa"),                               # s0 capped by Fr alone
    ],
)
def test_no_root_kinds_have_plain_messages(case: CaseInputs, unknown: str, target: str,
                                           value: float, field: str | None) -> None:
    """Each impossible question gives NoSolution naming the input, with a reachable range
    where one exists; a possible one solves."""
    if field is None:
        assert solve(case, unknown, target, value).residual == pytest.approx(0.0, abs=1e-9)
        return
    with pytest.raises(NoSolution) as info:
        solve(case, unknown, target, value)
    assert info.value.field == field
    assert info.value.message


def test_unreachable_target_states_the_range() -> None:
    """s0 ≤ C0/Fr whatever Fa: a larger s0 target reports the range the axial load allows."""
    with pytest.raises(NoSolution) as info:
        solve(BASE, "fa", "s0", 100.0)
    low, high = info.value.reachable
    assert high <= 19000.0 / 5200.0 * (1 + 1e-9)
    assert "runs from" in info.value.message


def test_bad_requests_are_input_errors() -> None:
    """Unknown names and targets, and non-positive target values, are refused."""
    for args in (("zz", "L10h", 1.0), ("c", "zz", 1.0), ("c", "L10h", -5.0), ("c", "L10h", math.nan)):
        with pytest.raises(InputError):
            solve(BASE, *args)


targets = st.sampled_from(["L10h", "Lnm", "L10", "s0"])


@settings(max_examples=120, deadline=None, suppress_health_check=[HealthCheck.filter_too_much])
@given(unknown=st.sampled_from(sorted(UNKNOWNS)), target=targets,
       factor=st.floats(min_value=0.3, max_value=3.0),
       base=st.sampled_from([BASE, ROLLER, replace(BASE, reliability_model="weibull")]))
def test_round_trip_every_unknown(unknown: str, target: str, factor: float, base: CaseInputs) -> None:
    """Property: pick a reachable target (the result at a perturbed value of the unknown), solve,
    put the value back, run forward: the target is met to 1e-9 relative."""
    start = getattr(base, unknown) if unknown != "load_scale" else 1.0
    probe = start * factor if unknown != "reliability" else 1.0 - (1.0 - start) * factor
    try:
        wanted = derive(apply_unknown(base, unknown, probe)).results[target]
    except InputError:
        assume(False)
    assume(math.isfinite(wanted) and wanted > 0)
    try:
        sol = solve(base, unknown, target, wanted)
    except NoSolution as exc:
        # Only an input that does not move the target may fail (e.g. speed for s0).
        assert "more than one" in exc.message or "runs from" in exc.message
        low, high = exc.reachable or (wanted, wanted)
        assert low == pytest.approx(high, rel=1e-6) or "more than one" in exc.message
        return
    achieved = derive(apply_unknown(base, unknown, sol.value)).results[target]
    assert achieved == pytest.approx(wanted, rel=1e-9)


def test_life_peak_just_past_the_e_switch_is_found() -> None:
    """Just past Fa/Fr = e the rounded Table 3 gives 0.56·Fr + Y·Fa slightly below Fr, so the
    life there exceeds the Fa = 0 life (found by the round-trip property test). The solver must
    still reach such a target: it locates the switch between its grid points."""
    fa = 1100.0 * 1.296875
    wanted = derive(apply_unknown(BASE, "fa", fa)).results["L10h"]
    assert wanted > derive(apply_unknown(BASE, "fa", 1.0)).results["L10h"]
    sol = solve(BASE, "fa", "L10h", wanted)
    achieved = derive(apply_unknown(BASE, "fa", sol.value)).results["L10h"]
    assert achieved == pytest.approx(wanted, rel=1e-9)


@pytest.mark.parametrize(("case", "unknown", "target", "value"), [
    # L10 ≈ 1e-45 against a target of 1e300: L/target underflows a double (IEEE 754)
    (CaseInputs(kind="angular-contact", fr=0.001, fa=1e-300, c=1e-12, c0=0.001, speed=0.0),
     "fa", "L10", 1e300),
    # a reachable range wider than the largest double: its top end is ∞, not an overflow
    (CaseInputs(kind="angular-contact", fr=0.0, fa=0.001, c=1.0, c0=1e6, speed=10.0, nu=1e200,
                dm=1e-300, ec=1.0), "af", "Lnm_mrev", 1e-300),
])
def test_extreme_questions_get_a_plain_answer(case: CaseInputs, unknown: str, target: str,
                                              value: float) -> None:
    """Found by a random sweep over extreme inputs: these used to end in a bare math error."""
    with pytest.raises(NoSolution) as caught:
        solve(case, unknown, target, value)
    assert caught.value.message
