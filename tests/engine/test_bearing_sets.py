"""Sets of single-row bearings mounted as a unit (tandem, back-to-back, face-to-face): their
ratings from one bearing's, what the derivation says of whose C and C0 it rates, and the
catalog rated as such a set.

Sources: ISO 281:2007 §5.1 (ball) and §7.1 (roller), "bearing combinations": two identical
single-row bearings mounted as a unit rate C_pair = 2^0.7·C (ball) or 2^(7/9)·C (roller), the
exponents of i in the rating formulas; ISO 76:2006 §5.1/§7.1: C0_pair = 2·C0 (from memory; the
closed forms are typed here, not read from the engine).
"""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np
import pytest

from workbench.engine.derive import CaseInputs, derive
from workbench.engine.kinds import Kind, set_dynamic_rating, set_static_rating
from workbench.engine.select import BearingArrays, mounted_as, select, select_by_loop

NAN = math.nan


@pytest.mark.parametrize("kind, factor", [
    (Kind.ANGULAR_CONTACT, 1.624504792712471),   # 2^0.7, ISO 281:2007 §5.1 (ball)
    (Kind.DEEP_GROOVE, 1.624504792712471),
    (Kind.TAPERED, 1.7144879657061456),          # 2^(7/9), ISO 281:2007 §7.1 (roller)
])
def test_a_pairs_dynamic_rating_is_two_to_the_ball_or_roller_exponent(kind: Kind,
                                                                      factor: float) -> None:
    assert set_dynamic_rating(kind, 24000.0) == pytest.approx(24000.0 * factor, rel=1e-12)


def test_a_pairs_static_rating_is_twice_one_bearings() -> None:
    # ISO 76:2006 §5.1/§7.1: C0 of two identical bearings mounted as a unit = 2·C0
    assert set_static_rating(20000.0) == 40000.0


def test_set_ratings_take_arrays_alike() -> None:
    c = np.array([10e3, 24e3])
    np.testing.assert_allclose(set_dynamic_rating(Kind.ANGULAR_CONTACT, c), c * 2 ** 0.7)
    np.testing.assert_allclose(set_static_rating(c), 2 * c)


PAIR = CaseInputs(kind="angular-contact", arrangement="back-to-back", fr=3000.0, fa=1000.0,
                  c=38990.0, c0=40000.0, contact_angle=40.0, speed=1000.0)


def _note(case: CaseInputs, key: str) -> str:
    return next(step.note or "" for step in derive(case).steps if step.key == key)


@pytest.mark.parametrize("arrangement", ["back-to-back", "face-to-face", "tandem"])
def test_the_derivation_says_a_pairs_ratings_are_the_whole_pairs(arrangement: str) -> None:
    case = replace(PAIR, arrangement=arrangement)
    l10 = _note(case, "L10")
    s0 = _note(case, "s0")
    assert f"C is the whole {arrangement} pair's rating" in l10
    assert "2^0.7 × one bearing's C" in l10 and "ISO 281:2007 §5.1" in l10
    assert f"C0 is the whole {arrangement} pair's rating" in s0
    assert "2 × one bearing's C0" in s0 and "ISO 76:2006 §5.1" in s0


def test_a_tapered_pairs_words_give_the_roller_exponent() -> None:
    case = replace(PAIR, kind="tapered", contact_angle=15.0)
    assert "2^(7/9) × one bearing's C" in _note(case, "L10")
    assert "ISO 281:2007 §7.1" in _note(case, "L10")
    assert "ISO 76:2006 §7.1" in _note(case, "s0")


def test_a_single_bearings_rating_is_its_own() -> None:
    case = replace(PAIR, arrangement="single")
    assert "pair" not in _note(case, "L10") and "pair" not in _note(case, "s0")


def _catalog() -> BearingArrays:
    """One bearing of each case: angular-contact single, deep-groove single, an angular-contact
    pair listed with its own pair ratings, a tapered single row."""
    def col(*values: float) -> np.ndarray:
        return np.array(values, dtype=float)
    return BearingArrays(
        kind=np.array(["angular-contact", "deep-groove", "angular-contact", "tapered"]),
        arrangement=np.array(["single", "single", "back-to-back", "single"]),
        d_mm=col(40, 40, 40, 40), D_mm=col(80, 80, 80, 80), B_mm=col(18, 18, 36, 20),
        c_n=col(24e3, 30e3, 39e3, 50e3), c0_n=col(20e3, 19e3, 40e3, 55e3),
        f0=col(NAN, 14.0, NAN, NAN), cu_n=col(0.9e3, NAN, NAN, NAN),
        contact_angle_deg=col(40.0, NAN, 40.0, 15.0), speed_limit_rpm=col(NAN, NAN, NAN, NAN),
        mass_kg=col(NAN, NAN, NAN, NAN))


def test_a_pair_position_rates_single_rows_as_pairs_of_them() -> None:
    rated, mounted = mounted_as(_catalog(), "back-to-back")
    assert list(mounted) == [True, False, True, True]
    assert list(rated.arrangement) == ["back-to-back", "single", "back-to-back", "back-to-back"]
    # ISO 281:2007 §5.1 / §7.1 and ISO 76:2006 §5.1 / §7.1, the closed forms typed here
    np.testing.assert_allclose(rated.c_n, [24e3 * 2 ** 0.7, 30e3, 39e3, 50e3 * 2 ** (7 / 9)])
    np.testing.assert_allclose(rated.c0_n, [40e3, 19e3, 40e3, 110e3])
    assert rated.cu_n[0] == 1.8e3  # a load limit adds up as C0 does (our decision)


@pytest.mark.parametrize("arrangement", ["single", "double-row", "nonsense"])
def test_other_positions_rate_the_catalog_as_listed(arrangement: str) -> None:
    catalog = _catalog()
    rated, mounted = mounted_as(catalog, arrangement)
    assert not mounted.any()
    np.testing.assert_array_equal(rated.c_n, catalog.c_n)


def test_the_ranking_of_a_pair_position_is_the_pairs_closed_form_life() -> None:
    """ISO 281:2007: the pair is one double-row bearing of C = 2^0.7·C; Table 3, 40° pair, Fa/Fr
    = 1/3 ≤ e = 1.14: X = 1, Y = 0.55 (REFERENCE §2, from memory), P = 3000 + 0.55·1000 =
    3550 N; L10 = (C/P)³; L10h = 10⁶·L10/(60·n); no lubrication given: aISO = 1, a1 = 1."""
    case = CaseInputs(kind="angular-contact", arrangement="back-to-back", fr=3000.0, fa=1000.0,
                      c=1.0, c0=1.0, contact_angle=40.0, speed=1000.0)
    rated, _ = mounted_as(_catalog(), "back-to-back")
    target = 1000.0
    hours = 1e6 * (24e3 * 2 ** 0.7 / 3550.0) ** 3 / (60 * 1000.0)
    for sweep in (select, select_by_loop):
        selection = sweep(rated, [case], target)
        assert selection.life_margin[0] == pytest.approx(hours / target, rel=1e-9)
        # as a single row (X = 1, Y = 0 at ≤ e) it would have read (24 kN / 3 kN)³: not that
        assert selection.life_margin[0] != pytest.approx(
            1e6 * (24e3 / 3000.0) ** 3 / 60e3 / target, rel=1e-3)
