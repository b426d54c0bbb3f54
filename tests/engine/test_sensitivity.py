"""Sensitivity of life to each input: closed forms of the ISO 281:2007 life relation, and the
numbers against finite differences taken here by direct derive() calls."""

from __future__ import annotations

import math
from dataclasses import replace

import pytest

from workbench.engine.derive import CaseInputs, derive
from workbench.engine.sensitivity import SensitivityItem, benchmark_sensitivity, sensitivity_of
from workbench.report.text import sensitivity_text

H = 0.01
# Deep-groove case with f0 given and no lubrication data, so aISO = 1 (ISO 281:2007 §9.3 not used).
PLAIN = CaseInputs(kind="deep-groove", fr=5200.0, fa=0.0, c=33000.0, c0=19000.0, f0=14.0,
                   speed=1450.0)
# The same bearing with lubrication data: aISO from κ, eC and Cu (ISO 281:2007 §9.3.2).
LUBRICATED = replace(PLAIN, fa=2500.0, reliability=0.95, nu=20.0, dm=47.5, ec=0.5, cu=900.0)


def _items(case: CaseInputs) -> dict[str, SensitivityItem]:
    return {item.input: item for item in sensitivity_of(case)}


def _life(case: CaseInputs, key: str = "Lnm") -> float:
    return derive(case).results[key]


def _scaled(case: CaseInputs, name: str, factor: float) -> CaseInputs:
    if name == "load_scale":
        return replace(case, fr=case.fr * factor, fa=case.fa * factor)
    if name == "reliability":
        return replace(case, reliability=1.0 - (1.0 - case.reliability) * factor)
    return replace(case, **{name: getattr(case, name) * factor})


def _central(case: CaseInputs, name: str, key: str = "Lnm") -> float:
    """d ln L / d ln x by a central difference on direct derive() calls."""
    up, down = _life(_scaled(case, name, 1 + H), key), _life(_scaled(case, name, 1 - H), key)
    return math.log(up / down) / math.log((1 + H) / (1 - H))


def _swing(case: CaseInputs, name: str, factor: float) -> float:
    return _life(_scaled(case, name, factor)) / _life(case) - 1.0


@pytest.mark.parametrize(("kind", "p"), [("deep-groove", 3.0), ("cylindrical", 10.0 / 3.0)])
def test_rating_elasticity_is_the_life_exponent(kind: str, p: float) -> None:
    """ISO 281:2007 §5.3/§7.3: L10 = (C/P)^p, so d ln L/d ln C = p (3 ball, 10/3 roller)."""
    case = replace(PLAIN, kind=kind, f0=None if kind == "cylindrical" else PLAIN.f0)
    item = _items(case)["c"]
    assert item.elasticity == pytest.approx(p, rel=1e-12)
    assert item.elasticity == pytest.approx(_central(case, "c", "L10"), rel=1e-9)
    assert item.plus10 == pytest.approx(1.1 ** p - 1.0, rel=1e-12)
    assert item.minus10 == pytest.approx(_swing(case, "c", 0.9), rel=1e-9)
    lubricated = replace(LUBRICATED, kind=kind, f0=case.f0)
    assert _items(lubricated)["c"].elasticity == pytest.approx(_central(lubricated, "c"), rel=1e-9)


@pytest.mark.parametrize(("kind", "p"), [("deep-groove", 3.0), ("cylindrical", 10.0 / 3.0)])
def test_load_elasticity_is_minus_the_life_exponent(kind: str, p: float) -> None:
    """ISO 281:2007: with Fa = 0, P = Fr ∝ load and L10 ∝ P^−p; af multiplies P likewise.
    s0 = C0/P0 with P0 = Fr (ISO 76:2006), so its elasticity to the load is −1."""
    case = replace(PLAIN, kind=kind, f0=None if kind == "cylindrical" else PLAIN.f0)
    items = _items(case)
    for name in ("load_scale", "fr", "af"):
        assert items[name].elasticity == pytest.approx(-p, rel=1e-9)
        assert items[name].method == "central"
    assert items["load_scale"].elasticity_s0 == pytest.approx(-1.0, rel=1e-9)
    assert items["af"].elasticity_s0 == 0.0
    assert items["load_scale"].plus10 == pytest.approx(1.1 ** -p - 1.0, rel=1e-9)
    assert "fa" not in items  # Fa = 0 is not varied


def test_speed_elasticity_of_hours_is_minus_one() -> None:
    """ISO 281:2007: L10h = 10⁶·L10/(60·n); without lubrication data nothing else holds n."""
    item = _items(PLAIN)["speed"]
    assert item.elasticity == pytest.approx(-1.0, rel=1e-9)
    assert item.plus10 == pytest.approx(1 / 1.1 - 1.0, rel=1e-9)
    assert item.life == "Lnm (h)"


def test_zero_speed_uses_life_in_revolutions() -> None:
    """Speed 0: hours are undefined, so the items speak of Lnm in 10⁶ revolutions."""
    items = _items(replace(PLAIN, speed=0.0))
    assert "speed" not in items
    assert {item.life for item in items.values()} == {"Lnm (10⁶ rev)"}
    assert items["c"].elasticity == 3.0


def test_reliability_against_direct_differences() -> None:
    """a1 (ISO 281:2007 Table 12 closed form) varied through F = 1 − R: central differences by
    direct derive() calls, and F·0.9 / F·1.1 by direct calls."""
    item = _items(LUBRICATED)["reliability"]
    assert item.value == pytest.approx(0.05)
    assert item.method == "central"
    assert item.elasticity == pytest.approx(_central(LUBRICATED, "reliability"), rel=1e-9)
    assert item.minus10 == pytest.approx(_swing(LUBRICATED, "reliability", 0.9), rel=1e-9)
    assert item.plus10 == pytest.approx(_swing(LUBRICATED, "reliability", 1.1), rel=1e-9)
    assert "1 − R" in item.note


def test_weibull_reliability_against_direct_differences() -> None:
    """The three-parameter Weibull factor takes the place of a1; same check by direct calls."""
    case = replace(LUBRICATED, reliability_model="weibull", reliability=0.99)
    item = _items(case)["reliability"]
    assert item.elasticity == pytest.approx(_central(case, "reliability"), rel=1e-9)
    assert item.plus10 == pytest.approx(_swing(case, "reliability", 1.1), rel=1e-9)


def test_reliability_at_the_edge_of_the_iso_range() -> None:
    """ISO 281:2007 a1 covers R ≥ 90 %: at R = 0.90, F·1.1 leaves the range, so plus10 is None and
    the elasticity is the one-sided (backward) difference."""
    case = replace(LUBRICATED, reliability=0.90)
    item = _items(case)["reliability"]
    assert item.plus10 is None
    assert item.method == "one-sided (range edge)"
    backward = math.log(_life(case) / _life(_scaled(case, "reliability", 1 - H))) / -math.log(1 - H)
    assert item.elasticity == pytest.approx(backward, rel=1e-9)
    assert "+10 % leaves the valid range" in item.note


@pytest.mark.parametrize("name", ["fr", "fa", "load_scale", "c0", "f0", "speed", "af", "nu", "dm",
                                  "cu", "ec"])
def test_lubricated_case_against_direct_derive(name: str) -> None:
    """aISO (ISO 281:2007 §9.3.2) and the Table 3 interpolation make these non-trivial: every
    elasticity and ±10 % figure matches direct derive() calls."""
    item = _items(LUBRICATED)[name]
    assert item.method == "central"
    assert item.elasticity == pytest.approx(_central(LUBRICATED, name), rel=1e-9, abs=1e-12)
    assert item.elasticity_s0 == pytest.approx(_central(LUBRICATED, name, "s0"), rel=1e-9,
                                               abs=1e-12)
    assert item.minus10 == pytest.approx(_swing(LUBRICATED, name, 0.9), rel=1e-9, abs=1e-12)
    assert item.plus10 == pytest.approx(_swing(LUBRICATED, name, 1.1), rel=1e-9, abs=1e-12)


# An ISO VG oil at temperature with a named cleanliness, Cu estimated from C0 and af ≠ 1: the
# viscosity chain (ISO 3448, ASTM D341), eC from ISO 281:2007 Table 13 and Cu from Annex B.
GRADED = replace(LUBRICATED, nu=None, vg=68.0, temp=70.0, ec=None, cleanliness="normal", cu=None,
                 af=1.2)


@pytest.mark.parametrize("name", ["fr", "fa", "load_scale", "c0", "f0", "speed", "af", "temp",
                                  "dm"])
def test_graded_oil_case_against_direct_derive(name: str) -> None:
    """The same check by direct derive() calls on the ISO VG case with af ≠ 1."""
    item = _items(GRADED)[name]
    assert item.elasticity == pytest.approx(_central(GRADED, name), rel=1e-9, abs=1e-12)
    assert item.elasticity_s0 == pytest.approx(_central(GRADED, name, "s0"), rel=1e-9, abs=1e-12)
    assert item.minus10 == pytest.approx(_swing(GRADED, name, 0.9), rel=1e-9, abs=1e-12)
    assert item.plus10 == pytest.approx(_swing(GRADED, name, 1.1), rel=1e-9, abs=1e-12)


def test_ec_and_cu_act_through_their_product() -> None:
    """ISO 281:2007 §9.3.2: aISO holds eC and Cu only as eC·Cu/P, so both elasticities agree."""
    items = _items(LUBRICATED)
    assert items["ec"].elasticity == pytest.approx(items["cu"].elasticity, rel=1e-9)
    assert items["ec"].elasticity > 0


def test_temperature_is_varied_for_an_iso_vg_oil() -> None:
    """With ISO VG and temperature the temperature is the input (ASTM D341 viscosity)."""
    case = replace(LUBRICATED, nu=None, vg=68.0, temp=70.0)
    item = _items(case)["temp"]
    assert item.elasticity == pytest.approx(_central(case, "temp"), rel=1e-9)
    assert item.elasticity < 0  # warmer oil is thinner: κ and life fall
    assert "vg" not in _items(case)


def _at_the_e_switch(margin: float) -> CaseInputs:
    """Fa/Fr = e·margin; e is fixed by f0·Fa/C0r alone (ISO 281:2007 Table 3), not by Fr."""
    e = derive(replace(PLAIN, fa=1100.0)).results["e"]
    return replace(PLAIN, fa=1100.0, fr=1100.0 / (e * margin))


def test_kink_just_above_the_e_switch_is_one_sided() -> None:
    """Fa/Fr 0.3 % above e: Fr·1.01 crosses to Fa/Fr ≤ e, so the Fr elasticity is the backward
    difference, and the item says so."""
    case = _at_the_e_switch(1.003)
    assert "> e" in derive(case).step("ratio").note
    item = _items(case)["fr"]
    assert item.method == "one-sided (e switch)"
    assert "e switch" in item.note and "backward" in item.note
    backward = math.log(_life(case) / _life(_scaled(case, "fr", 1 - H))) / -math.log(1 - H)
    assert item.elasticity == pytest.approx(backward, rel=1e-9)
    assert item.plus10 == pytest.approx(_swing(case, "fr", 1.1), rel=1e-9)
    assert "e switch crossed by +10 %" in item.note


def test_case_exactly_at_the_e_switch_is_one_sided() -> None:
    """Fa/Fr = e (to the last digit): one side of the step lies on the other branch."""
    item = _items(_at_the_e_switch(1.0))["fa"]
    assert item.method == "one-sided (e switch)"
    assert "e switch" in item.note


def test_kappa_clamp_is_one_sided() -> None:
    """κ just above 4 (ISO 281:2007 §9.3: above 4 use 4): ν·0.99 lands below the clamp."""
    d = derive(LUBRICATED)
    case = replace(LUBRICATED, nu=4.0 * 1.004 * d.results["nu1"])
    item = _items(case)["nu"]
    assert item.method == "one-sided (κ clamp)"
    assert item.elasticity == pytest.approx(0.0, abs=1e-12)  # forward side: κ stays at 4


def test_items_are_ranked_by_magnitude_with_signs_kept() -> None:
    items = sensitivity_of(LUBRICATED)
    magnitudes = [abs(item.elasticity) for item in items if item.elasticity is not None]
    assert magnitudes == sorted(magnitudes, reverse=True)
    assert any(item.elasticity < 0 for item in items) and any(item.elasticity > 0 for item in items)


def test_as_dict_keys_and_text() -> None:
    items = sensitivity_of(LUBRICATED)
    for item in items:
        data = item.as_dict()
        assert {"input", "elasticity", "minus10", "plus10", "method", "note", "life"} <= set(data)
    text = sensitivity_text(items)
    assert "ε life" in text and "Lnm (h)" in text
    for item in items:
        assert item.label in text


def test_benchmark_reports_milliseconds() -> None:
    figures = benchmark_sensitivity(repeats=3)
    assert figures["sensitivity_ms"] > 0


def test_a_life_that_underflows_to_zero_has_no_elasticity_and_no_crash() -> None:
    """C = 1e-200 N against P = 1e12 N: (C/P)^3 underflows to 0 (IEEE 754 double), so
    ln L is undefined on both sides; the items say so instead of dividing by zero."""
    case = CaseInputs(kind="deep-groove", fr=1e12, fa=0.0, c=1e-200, c0=1e6, speed=1500.0)
    items = {item.input: item for item in sensitivity_of(case)}
    assert items["fr"].elasticity is None and items["fr"].minus10 is None
    assert "no elasticity" in items["fr"].note
    # s0 = C0/P0 = C0/Fr stays finite: its elasticity to Fr is −1 exactly (ISO 76 s0 = C0/P0)
    assert items["fr"].elasticity_s0 == pytest.approx(-1.0, rel=1e-6)
