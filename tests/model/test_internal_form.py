"""The internal analysis as typed: texts into engine inputs, errors naming the input, and the
helpers the screen calls for a session's load case."""

from __future__ import annotations

import math

import pytest

from workbench.engine.derive import CaseInputs, derive
from workbench.engine.internal.analysis import analyse_internal
from workbench.engine.internal.distribution import InternalInputs
from workbench.model.fields import FieldError
from workbench.model.internal_form import (
    NoEquilibrium,
    analyse_texts,
    clearance_curve_for_case,
    inputs_from_texts,
    internal_for_case,
    session_inside_texts,
)

TEXTS = {"kind": "angular-contact", "elements": "12", "dw": "12.7 mm", "dpw": "65",
         "contact_angle": "40°", "arrangement": "back-to-back", "preload": "1 kN", "fr": "4 kN",
         "fa": "1 kN", "speed": "3000 rpm", "nu": "20", "cleanliness": "0.5", "moment": "20 N·m"}


def test_texts_become_engine_units() -> None:
    # kN → N, N·m → N·mm, mrad → rad (pint at the edge; the arithmetic is exact).
    inputs = inputs_from_texts(TEXTS)
    assert inputs.preload == pytest.approx(1000.0)
    assert inputs.moment == pytest.approx(20000.0)
    assert inputs.ec == 0.5
    tilted = inputs_from_texts({**TEXTS, "moment": "", "tilt": "1 mrad"})
    assert tilted.tilt == pytest.approx(0.001)
    assert tilted.moment is None


def test_a_named_cleanliness_level_reads_its_ec() -> None:
    inputs = inputs_from_texts({**TEXTS, "cleanliness": "normal"})
    assert inputs.ec is not None and 0.0 < inputs.ec <= 1.0


@pytest.mark.parametrize(("changes", "field"), [
    ({"elements": "many"}, "elements"), ({"dw": ""}, "dw"), ({"rows": "2"}, "rows"),
    ({"arrangement": "tandem"}, "arrangement"), ({"tilt": "1 mrad"}, "tilt"),
    ({"fr": "3 kg"}, "fr"), ({"cleanliness": "2"}, "cleanliness"), ({"kind": "spherical"}, "kind"),
    ({"clearance": "0.01 mm"}, "preload"), ({"contact_angle": "0°"}, "contact_angle"),
])
def test_bad_texts_name_the_input(changes: dict[str, str], field: str) -> None:
    with pytest.raises(FieldError) as info:
        analyse_texts({**TEXTS, **changes})
    assert info.value.field == field


def test_no_equilibrium_names_the_input() -> None:
    with pytest.raises(NoEquilibrium) as info:
        analyse_texts({"kind": "cylindrical", "elements": "14", "dw": "11", "dpw": "70", "lwe": "11",
                       "fr": "0", "fa": "2 kN"})
    assert info.value.field == "fa"


def test_texts_and_engine_agree() -> None:
    result = analyse_texts(TEXTS)
    direct = analyse_internal(InternalInputs(
        "angular-contact", 12, 12.7, 65.0, alpha_deg=40.0, arrangement="back-to-back", preload=1000.0,
        fr=4000.0, fa=1000.0, moment=20000.0, speed=3000.0, nu=20.0, ec=0.5))
    assert result.results == direct.results


CASE = CaseInputs(kind="angular-contact", arrangement="back-to-back", fr=4400.0, fa=2600.0, c=74000.0,
                  c0=61000.0, contact_angle=40.0, speed=1480.0, vg=220.0, temp=65.0, dm=65.0,
                  cleanliness="normal")
GEOMETRY = {"elements": "12", "dw": "12.7 mm", "dpw": "65 mm"}


def test_internal_for_a_session_case_takes_its_loads_and_lubrication() -> None:
    result = internal_for_case(CASE, GEOMETRY, {"preload": "800 N"})
    catalogue = derive(CASE).results
    assert result.inputs.fr == 4400.0 and result.inputs.fa == 2600.0
    assert result.inputs.nu == pytest.approx(catalogue["nu"], rel=1e-12)
    assert result.inputs.ec == pytest.approx(catalogue["eC"], rel=1e-12)
    assert "Lnmr" in result.results and math.isfinite(result.results["Lnmr"])


def test_a_cylindrical_bearings_stale_contact_angle_is_not_read() -> None:
    """The case form shows a cylindrical bearing's contact angle as not used (α = 0 by its
    construction, ISO 281:2007 §7.2), so the inside view must not read one left from another
    kind either: it used to refuse the case with "a cylindrical roller bearing has α = 0°"."""
    case = CaseInputs(kind="cylindrical", fr=20000.0, c=90000.0, c0=95000.0, speed=1000.0,
                      contact_angle=40.0)
    geometry = {"elements": "14", "dw": "11 mm", "dpw": "70 mm", "lwe": "11 mm"}
    result = internal_for_case(case, geometry, {})
    assert result.inputs.alpha_deg == 0.0 and result.results["Q_max"] > 0.0


def test_clearance_curve_for_a_session_case() -> None:
    points = clearance_curve_for_case(CASE, GEOMETRY, {"preload": "800 N"}, count=15)
    assert len(points) == 15
    assert points[0].clearance < 0.0 < points[-1].clearance
    assert all(math.isfinite(p.life) for p in points)


def test_the_spindle_pair_example_session() -> None:
    # The example session's wheel-end pair, geometry and preload as its bearing carries them
    # (schema 2), read back by session_inside_texts: the rows share the
    # thrust (shaft equilibrium), and at the finishing pass's light load the 600 N preload, which
    # the catalogue method ignores, governs: the reference life falls below the ISO 281 life.
    from pathlib import Path

    from workbench.model.session import evaluate_case
    from workbench.model.sessionfile import load_session

    session = load_session(Path(__file__).parents[2] / "sessions" / "spindle-pair.toml")
    results = {}
    for case in session.cases:
        inputs = evaluate_case(session, case).inputs
        texts = session_inside_texts(session, case)
        assert inputs is not None and texts is not None
        geometry, fit = texts
        assert geometry == {"elements": "16", "dw": "11.1 mm", "dpw": "72.5 mm",
                            "row_spacing": "24 mm"} and fit == {"preload": "600 N"}
        results[case.name] = internal_for_case(inputs, geometry, fit)
    rough, finish = results["Roughing pass"], results["Finishing pass"]
    assert rough.rows[0].axial_load - rough.rows[1].axial_load == pytest.approx(500.0, rel=1e-8)
    assert finish.results["L10r"] < finish.results["L10_iso281"]
    assert rough.results["k_radial"] > 0.0 and rough.results["k_tilt"] > 0.0
