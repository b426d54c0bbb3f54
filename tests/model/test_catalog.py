"""Catalog files and the invented demo catalog."""

from __future__ import annotations

import math
from pathlib import Path

import numpy as np
import pytest

from workbench.engine import ratings
from workbench.model.catalog import (
    CatalogError, catalog_bearing_texts, demo_catalog_path, load_catalog, loads_catalog_csv,
    loads_catalog_toml,
)
from workbench.model.demo_catalog import build_demo_catalog
from workbench.model.fields import BEARING_FIELDS, INSIDE_FIELDS, parse_field

GOOD_CSV = """# a comment line
designation,kind,d_mm,D_mm,B_mm,C_kN,C0_kN,f0,contact_angle_deg,speed_limit_rpm,mass_kg
T-1,deep-groove,40,80,18,31.5,20.2,14,,8000,0.35
T-2,deep-groove,40,x,18,31.5,20.2,14,,8000,0.35
# another comment
T-3,angular-contact,40,80,18,35,25,,33,,
T-4,cylindrical,40,80,18,40,-1,,,,
T-1,deep-groove,45,85,19,33,22,14,,,
T-5,angular-contact,40,80,18,35,25,,40,,
T-6,tapered,40,80,18,50,60,,,,
T-7,deep-groove,40,80,18,31.5,20.2,14,,
"""


def test_bad_rows_are_reported_by_row_and_column_and_the_rest_load() -> None:
    catalog = loads_catalog_csv(GOOD_CSV, "test.csv")
    assert catalog.designations == ["T-1", "T-5"]
    assert catalog.rows == [3, 9]
    found = {(p.row, p.column) for p in catalog.problems}
    assert found == {
        (4, "D_mm"),                # not a number
        (6, "contact_angle_deg"),   # 33° is not a tabulated angular-contact angle
        (7, "C0_kN"),               # not above zero
        (8, "designation"),         # used twice
        (10, "contact_angle_deg"),  # a tapered bearing needs α (no e column in a catalog)
        (11, "row"),                # one value short
    }
    assert catalog.c_n.tolist() == [31500.0, 35000.0]  # kN in the file, N in the engine
    assert math.isnan(catalog.f0[1]) and catalog.contact_angle_deg[1] == 40.0


def test_toml_catalog_reports_the_line_of_the_bad_key() -> None:
    text = """title = "test catalog"

[[bearing]]
designation = "A"
kind = "deep-groove"
d_mm = 40
D_mm = 80
B_mm = 18
C_kN = 31.5
C0_kN = 20.2

[[bearing]]
designation = "B"
kind = "deep-groove"
d_mm = 40
D_mm = 30
B_mm = 18
C_kN = 31.5
C0_kN = 20.2
"""
    catalog = loads_catalog_toml(text, "test.toml")
    assert catalog.designations == ["A"] and catalog.title == "test catalog"
    assert [(p.row, p.column) for p in catalog.problems] == [(16, "D_mm")]


def test_unreadable_catalogs_raise(tmp_path: Path) -> None:
    with pytest.raises(CatalogError, match="missing column"):
        loads_catalog_csv("designation,kind,d_mm\nA,deep-groove,10\n", "x.csv")
    with pytest.raises(CatalogError, match="no such file"):
        load_catalog(tmp_path / "absent.csv")
    with pytest.raises(CatalogError):
        load_catalog(tmp_path / "catalog.xlsx")


def test_demo_catalog_ships_what_its_function_builds() -> None:
    assert demo_catalog_path().read_text(encoding="utf-8") == build_demo_catalog()


def test_demo_catalog_loads_with_no_problems_and_is_marked_invented() -> None:
    catalog = load_catalog(demo_catalog_path())
    assert catalog.problems == []
    assert set(catalog.kinds) == {"deep-groove", "angular-contact", "cylindrical"}
    assert all(name.startswith("WB-") for name in catalog.designations)
    assert "INVENTED" in demo_catalog_path().read_text(encoding="utf-8").splitlines()[0]


def _fits(dpw: float, element: float, spacing: float, z: int) -> bool:
    return dpw * math.sin(math.pi / z) >= spacing * element


def test_demo_ratings_are_ratings_py_output_for_the_stated_rule() -> None:
    # The rule stated in the file header, applied here independently of demo_catalog.py:
    # Dpw = (d + D)/2; ball Dw = 0.3·(D − d), Z the largest with Dpw·sin(π/Z) ≥ 1.5·Dw;
    # roller Dwe = Lwe = 0.25·(D − d), Z the largest with Dpw·sin(π/Z) ≥ 1.3·Dwe.
    catalog = load_catalog(demo_catalog_path())
    for i, kind in enumerate(catalog.kinds):
        d, outer = catalog.d_mm[i], catalog.D_mm[i]
        dpw = (d + outer) / 2
        roller = kind == "cylindrical"
        element = (0.25 if roller else 0.3) * (outer - d)
        spacing = 1.3 if roller else 1.5
        z = max(n for n in range(3, 60) if _fits(dpw, element, spacing, n))
        if roller:
            c = ratings.dynamic_rating_radial_roller(1, z, element, element, 0.0, dpw)
            c0 = ratings.static_rating_radial_roller(1, z, element, element, 0.0, dpw)
        else:
            alpha = 40.0 if kind == "angular-contact" else 0.0
            c = ratings.dynamic_rating_radial_ball(1, z, element, alpha, dpw)
            c0 = ratings.static_rating_radial_ball(1, z, element, alpha, dpw)
        # the file keeps kN to two decimals
        assert abs(catalog.c_n[i] - c) <= 5.0 + 1e-6, catalog.designations[i]
        assert abs(catalog.c0_n[i] - c0) <= 5.0 + 1e-6, catalog.designations[i]


def test_one_demo_rating_by_the_iso_281_formula_itself() -> None:
    # ISO 281:2007 §5.1.1 (REFERENCE.md §6, from memory): Cr = bm·fc·(i·cos α)^0.7·Z^(2/3)·Dw^1.8,
    # bm = 1.3, fc read linearly from the radial-ball table at Dw·cos α/Dpw.  WB-DG 02-40: d 40,
    # D 80 → Dw = 12, Dpw = 60, γ = 0.2 (fc = 59.9 at a table row); 60·sin(π/10) = 18.54 ≥ 1.5·12
    # and 60·sin(π/11) = 16.9 < 18, so Z = 10.
    catalog = load_catalog(demo_catalog_path())
    i = catalog.designations.index("WB-DG 02-40")
    expected = 1.3 * 59.9 * 1.0 * 10 ** (2 / 3) * 12.0 ** 1.8
    assert catalog.c_n[i] == pytest.approx(expected, abs=5.0)
    # ISO 76:2006 §5.1: C0r = f0·i·Z·Dw²·cos α with f0 = 14.0 at γ = 0.20 (deep-groove column)
    assert catalog.c0_n[i] == pytest.approx(14.0 * 10 * 12.0 ** 2, abs=5.0)
    assert catalog.f0[i] == 14.0


def test_catalog_bearing_texts_read_back_to_the_catalog_values() -> None:
    catalog = load_catalog(demo_catalog_path())
    for i in (0, catalog.kinds.index("angular-contact"), catalog.kinds.index("cylindrical")):
        texts = catalog_bearing_texts(catalog, i)
        assert tuple(texts) == tuple(name for name in BEARING_FIELDS if name not in INSIDE_FIELDS)
        assert parse_field("c", texts["c"]) == pytest.approx(catalog.c_n[i], rel=1e-12)
        assert parse_field("c0", texts["c0"]) == pytest.approx(catalog.c0_n[i], rel=1e-12)
        assert parse_field("dm", texts["dm"]) == pytest.approx((catalog.d_mm[i] + catalog.D_mm[i]) / 2)
        assert parse_field("kind", texts["kind"]) == catalog.kinds[i]
        if not np.isnan(catalog.contact_angle_deg[i]):
            assert parse_field("contact_angle", texts["contact_angle"]) == pytest.approx(40.0)
        assert texts["cu"] == "" and texts["e_given"] == ""
