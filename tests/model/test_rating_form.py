"""Reading a special bearing's geometry as typed, and the bearing texts its ratings give."""

from __future__ import annotations

import pytest

from workbench.engine.derive import derive
from workbench.model.fields import FieldError, inputs_from_texts
from workbench.model.rating_form import bearing_texts, geometry_from_texts, rate_texts

DEEP_GROOVE = {"kind": "deep-groove", "elements": "9", "dw": "12.7 mm", "dpw": "65 mm"}


def test_texts_read_with_units_and_defaults() -> None:
    geometry = geometry_from_texts({**DEEP_GROOVE, "dw": "0.5 in", "dpw": "6.5 cm"})
    # 0.5 in = 12.7 mm exactly (international inch); 6.5 cm = 65 mm
    assert geometry.dw == pytest.approx(12.7) and geometry.dpw == pytest.approx(65.0)
    assert geometry.i == 1 and geometry.z == 9 and geometry.alpha_deg == 0.0
    assert geometry.lwe is None and geometry.bm is None and geometry.f0 is None
    thrust = geometry_from_texts({"kind": "thrust-ball", "elements": "12", "dw": "10",
                                  "dpw": "60"})
    assert thrust.alpha_deg == 90.0  # a blank angle of a thrust bearing: α = 90°


@pytest.mark.parametrize(("change", "field", "words"), [
    ({"dw": "12.7 kg"}, "dw", "mass"),
    ({"elements": ""}, "elements", "needed"),
    ({"rows": "1.5"}, "rows", "whole number"),
    ({"kind": "ball"}, "kind", "choose one of"),
    ({"bm": "nan"}, "bm", "finite"),
    ({"rows": "2"}, "rows", "double-row"),  # refused by the engine, named as the form names it
    ({"dw": "70 mm"}, "dw", "smaller than the pitch diameter"),
])
def test_refusals_name_the_input(change: dict[str, str], field: str, words: str) -> None:
    with pytest.raises(FieldError) as caught:
        rate_texts({**DEEP_GROOVE, **change})
    assert caught.value.field == field and words in caught.value.message


def test_adopted_texts_carry_the_ratings_and_derive_as_rated() -> None:
    geometry, derivation = rate_texts(DEEP_GROOVE)
    # ISO 281:2007 §5.1.1 (from memory): Cr = bm·fc·(i·cos α)^0.7·Z^(2/3)·Dw^1.8 for Dw ≤ 25.4 mm,
    # bm = 1.3 and fc = 59.9 at Dw·cos α/Dpw = 0.195 (REFERENCE table, 0.18–0.20)
    c_formula = 1.3 * 59.9 * 9 ** (2 / 3) * 12.7 ** 1.8
    texts = bearing_texts(geometry, derivation)
    assert texts["kind"] == "deep-groove" and texts["dm"] == "65 mm"
    assert texts["e_given"] == texts["y_given"] == texts["cu"] == ""
    case = inputs_from_texts({**texts, "fr": "3 kN", "speed": "1000 rpm"})
    assert case.c == pytest.approx(c_formula, rel=5e-4)  # four figures kept
    assert case.c0 == pytest.approx(derivation.results["C0"], rel=5e-4)
    # with Fa = 0, P = Fr and L10 = (C/P)^3 (ISO 281:2007 §6.1, §7.1): the session derives it
    assert derive(case).results["L10"] == pytest.approx((case.c / 3000.0) ** 3)


def test_a_roller_keeps_no_f0_of_its_own() -> None:
    geometry, derivation = rate_texts({"kind": "cylindrical", "elements": "14", "dw": "10 mm",
                                       "lwe": "10 mm", "dpw": "62 mm"})
    assert bearing_texts(geometry, derivation)["f0"] == ""
