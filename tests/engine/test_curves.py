"""What-if curves are samples of the engine itself."""

from __future__ import annotations

import pytest

from workbench.engine.curves import aiso_curve, life_curve
from workbench.engine.derive import CaseInputs, derive
from workbench.engine.life import aiso
from workbench.engine.solve import apply_unknown

CASE = CaseInputs(kind="deep-groove", fr=5200.0, fa=1300.0, c=33000.0, c0=19000.0, speed=1450.0,
                  nu=20.0, dm=47.5, cleanliness="normal")


def test_life_curve_points_are_derivations() -> None:
    """Every sample equals derive() at that load scale; life falls as load rises (ISO 281 §5.3)."""
    curve = life_curve(CASE, 20000.0)
    for x, y in zip(curve.x[::10], curve.y[::10]):
        assert y == pytest.approx(derive(apply_unknown(CASE, "load_scale", x)).results["Lnm"])
    assert all(a >= b for a, b in zip(curve.y, curve.y[1:]))
    assert curve.point == (1.0, derive(CASE).results["Lnm"])
    assert curve.levels == (("target", 20000.0),)


def test_e_switch_is_marked_between_the_samples_where_the_branch_changes() -> None:
    """Scaling both loads keeps Fa/Fr = 0.25 but moves e with the Table 3 index (e rises with
    Fa/C0): below the switch Fa/Fr > e, above it Fa/Fr ≤ e, and the mark sits between."""
    curve = life_curve(CASE)
    (name, at), = curve.marks
    assert name == "e switch"
    below = derive(apply_unknown(CASE, "load_scale", at * 0.97))
    above = derive(apply_unknown(CASE, "load_scale", at * 1.03))
    assert "> e" in below.peek("ratio").note and "≤ e" in above.peek("ratio").note


def test_aiso_curve_uses_the_case_load_ratio() -> None:
    """aISO samples follow ISO 281 §9.3.2 at the case's eC·Cu/P; none without lubrication data."""
    curve = aiso_curve(CASE)
    ratio = derive(CASE).results["load_ratio"]
    assert curve.y[0] == pytest.approx(aiso(curve.x[0], ratio, False))
    plain = CaseInputs(kind="deep-groove", fr=5200.0, c=33000.0, c0=19000.0, speed=1450.0)
    assert aiso_curve(plain) is None
