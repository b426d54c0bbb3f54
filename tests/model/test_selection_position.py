"""Catalog selection for a bearing position that is a pair: the catalog rated as that pair,
the rows it gives, the texts adopted and the words that say what adopting did.

Sources: ISO 281:2007 §5.1 (ball bearings, bearing combinations): two identical single-row
bearings mounted as a unit rate C = 2^0.7·C of one; ISO 76:2006 §5.1: C0 = 2·C0 of one (from
memory; the closed forms typed here). The catalog row's numbers are read from the shipped demo
file's text, not from the engine.
"""

from __future__ import annotations

import pytest

from workbench.engine.derive import CaseInputs
from workbench.model.catalog import catalog_bearing_texts, demo_catalog_path, load_catalog
from workbench.model.fields import parse_field
from workbench.model.selection import (
    candidate_rows, catalog_as_position, mounting_words, position_arrangement, position_words,
)
from workbench.engine.select import select

ROW = "WB-AC40 02-40"  # demo catalog: angular-contact, single, 40°, C 26.02 kN, C0 16.62 kN
C_ONE, C0_ONE = 26.02e3, 16.62e3


def pair_case(arrangement: str = "back-to-back") -> CaseInputs:
    return CaseInputs(kind="angular-contact", arrangement=arrangement, fr=3000.0, fa=1000.0,
                      c=24e3, c0=20e3, contact_angle=40.0, speed=1000.0)


def test_the_demo_rows_numbers_are_as_the_file_lists_them() -> None:
    line = next(line for line in demo_catalog_path().read_text().splitlines()
                if line.startswith(ROW + ","))
    assert line.split(",")[2:8] == ["single", "40", "80", "18", "26.02", "16.62"]


@pytest.mark.parametrize("arrangement", ["back-to-back", "face-to-face", "tandem"])
def test_adopting_into_a_pair_keeps_the_pair_with_the_pairs_ratings(arrangement: str) -> None:
    listed = load_catalog(demo_catalog_path())
    rated = catalog_as_position(listed, [pair_case(arrangement)])
    i = listed.designations.index(ROW)
    texts = catalog_bearing_texts(rated, i)
    assert texts["arrangement"] == arrangement
    # ISO 281:2007 §5.1 and ISO 76:2006 §5.1, as typed texts the session keeps
    assert parse_field("c", texts["c"]) == pytest.approx(C_ONE * 2 ** 0.7, rel=1e-11)
    assert parse_field("c0", texts["c0"]) == pytest.approx(2 * C0_ONE, rel=1e-11)
    words = mounting_words(listed, rated, i, arrangement)
    assert words.startswith(f"rated and adopted as a {arrangement} pair of two: ")
    assert "C = 2^0.7 × 26.02 kN = 42.27 kN" in words and "C0 = 2 × 16.62 kN = 33.24 kN" in words
    assert "ISO 281:2007 §5.1" in words and "ISO 76:2006 §5.1" in words


def test_a_row_whose_kind_makes_no_such_pair_says_the_arrangement_it_falls_back_to() -> None:
    listed = load_catalog(demo_catalog_path())
    rated = catalog_as_position(listed, [pair_case()])
    i = listed.kinds.index("deep-groove")
    assert catalog_bearing_texts(rated, i)["arrangement"] == "single"
    assert parse_field("c", catalog_bearing_texts(rated, i)["c"]) == listed.c_n[i]
    assert mounting_words(listed, rated, i, "back-to-back") == (
        "arrangement back-to-back → single: a deep-groove ball bearing does not come as a "
        "back-to-back pair")


def test_a_single_position_takes_the_row_as_listed_with_no_words() -> None:
    listed = load_catalog(demo_catalog_path())
    rated = catalog_as_position(listed, [pair_case("single")])
    i = listed.designations.index(ROW)
    assert catalog_bearing_texts(rated, i) == catalog_bearing_texts(listed, i)
    assert mounting_words(listed, rated, i, "single") == ""
    assert position_words("single") == ""


def test_the_position_is_the_cases_one_arrangement_else_single() -> None:
    assert position_arrangement([pair_case(), pair_case()]) == "back-to-back"
    assert position_arrangement([pair_case(), pair_case("single")]) == "single"
    spherical = CaseInputs(kind="spherical", arrangement="single", fr=1.0, c=1.0, c0=1.0)
    assert position_arrangement([spherical]) == "double-row"  # as the engine reads it


def test_the_rows_say_the_arrangement_each_was_rated_as() -> None:
    listed = load_catalog(demo_catalog_path())
    case = pair_case()
    rated = catalog_as_position(listed, [case])
    rows = candidate_rows(rated, select(rated, [case], 1000.0), ["one"], 0)
    by_name = {row["designation"]: row for row in rows}
    assert by_name[ROW]["arrangement"] == "back-to-back"
    assert {row["arrangement"] for row in rows if row["kind"] == "deep-groove"} <= {"single"}
    assert "2^0.7·C" in position_words("back-to-back")
