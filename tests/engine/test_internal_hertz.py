"""Hertz contact: curvature, ellipse, semi-axes, pressure and the steel load–deflection relations,
against closed forms written out here (scipy.special.ellipk/ellipe) and published approximations."""

from __future__ import annotations

import math

import pytest
from scipy.optimize import brentq
from scipy.special import ellipe, ellipk

from workbench.engine.internal import hertz

# A ball of 12.7 mm on a 65 mm pitch circle, osculations 0.52/0.53, α = 0° and 40°.
GEOMETRIES = [(12.7, 65.0, 0.0, 0.52, True), (12.7, 65.0, 0.0, 0.53, False),
              (12.7, 65.0, 40.0, 0.52, True), (9.525, 46.0, 25.0, 0.515, False)]


def _radii(dw: float, dpw: float, alpha: float, f: float, inner: bool) -> tuple[float, float]:
    """1/Rx (rolling direction) and 1/Ry (across the groove), the curvatures written out."""
    gamma = dw * math.cos(math.radians(alpha)) / dpw
    race = 2.0 / dw * gamma / (1.0 - gamma) if inner else -2.0 / dw * gamma / (1.0 + gamma)
    return 2.0 / dw + race, 2.0 / dw - 1.0 / (f * dw)


@pytest.mark.parametrize(("dw", "dpw", "alpha", "f", "inner"), GEOMETRIES)
def test_curvature_sum_and_difference(dw: float, dpw: float, alpha: float, f: float, inner: bool) -> None:
    # Σρ = 1/Rx + 1/Ry and F(ρ) = (1/Rx − 1/Ry)/Σρ (Harris & Kotzalas: the curvature sum and
    # difference of a ball in a groove, written here from the principal curvatures).
    rx_inv, ry_inv = _radii(dw, dpw, alpha, f, inner)
    curvature = hertz.ball_raceway_curvature(dw, dpw, alpha, f, inner=inner)
    assert curvature.curvature_sum == pytest.approx(rx_inv + ry_inv, rel=1e-12)
    assert curvature.curvature_difference == pytest.approx((rx_inv - ry_inv) / (rx_inv + ry_inv), rel=1e-12)


@pytest.mark.parametrize(("dw", "dpw", "alpha", "f", "inner"), GEOMETRIES)
def test_semi_axes_and_pressure_closed_form(dw: float, dpw: float, alpha: float, f: float,
                                            inner: bool) -> None:
    # Closed form (Hertz; REFERENCE.md §8): solve F(ρ) = [(k²+1)E − 2K]/[(k²−1)E] for k with
    # scipy's ellipk/ellipe (parameter m = 1 − 1/k²), then a = (6k²EQ/(πΣρE'))^(1/3),
    # b = (6EQ/(πkΣρE'))^(1/3), pmax = 3Q/(2πab); E' = 2/[2(1 − 0.3²)/207000].
    rx_inv, ry_inv = _radii(dw, dpw, alpha, f, inner)
    rho, diff = rx_inv + ry_inv, (rx_inv - ry_inv) / (rx_inv + ry_inv)

    def f_of_k(k: float) -> float:
        m = 1.0 - 1.0 / k ** 2
        return ((k ** 2 + 1.0) * ellipe(m) - 2.0 * ellipk(m)) / ((k ** 2 - 1.0) * ellipe(m))

    k = brentq(lambda x: f_of_k(x) - diff, 1.0001, 100.0, xtol=1e-14)
    m = 1.0 - 1.0 / k ** 2
    e2 = 2.0 / (2.0 * (1.0 - 0.09) / 207000.0)
    load = 2500.0
    a = (6.0 * k ** 2 * ellipe(m) * load / (math.pi * rho * e2)) ** (1.0 / 3.0)
    b = (6.0 * ellipe(m) * load / (math.pi * k * rho * e2)) ** (1.0 / 3.0)
    curvature = hertz.ball_raceway_curvature(dw, dpw, alpha, f, inner=inner)
    ellipse = hertz.ellipse_of(curvature.curvature_difference)
    contact = hertz.point_contact(load, curvature, ellipse)
    assert ellipse.k == pytest.approx(k, rel=1e-9)
    assert contact.a == pytest.approx(a, rel=1e-9)
    assert contact.b == pytest.approx(b, rel=1e-9)
    assert contact.p_max == pytest.approx(3.0 * load / (2.0 * math.pi * a * b), rel=1e-9)


@pytest.mark.parametrize(("dw", "dpw", "alpha", "f", "inner"), GEOMETRIES)
def test_ellipticity_against_hamrock_brewe(dw: float, dpw: float, alpha: float, f: float,
                                           inner: bool) -> None:
    # Hamrock & Brewe (1983) approximations, published: k ≈ 1.0339·(Ry/Rx)^0.636,
    # E ≈ 1.0003 + 0.5968·Rx/Ry, within a few per cent of the exact values.
    rx_inv, ry_inv = _radii(dw, dpw, alpha, f, inner)
    ratio = rx_inv / ry_inv  # Ry/Rx
    ellipse = hertz.ellipse_of(hertz.ball_raceway_curvature(dw, dpw, alpha, f, inner=inner).curvature_difference)
    assert ellipse.k == pytest.approx(1.0339 * ratio ** 0.636, rel=0.03)
    assert ellipse.second_kind == pytest.approx(1.0003 + 0.5968 / ratio, rel=0.01)


def test_point_contact_load_deflection_for_steel() -> None:
    # Harris & Kotzalas, steel ball on steel raceway (E = 207 GPa, ν = 0.3; from memory):
    # δ = 2.79·10⁻⁴·δ*·Q^(2/3)·Σρ^(1/3) (mm, N), and Q = K·δ^(3/2) inverts it.
    curvature = hertz.ball_raceway_curvature(12.7, 65.0, 0.0, 0.52, inner=True)
    ellipse = hertz.ellipse_of(curvature.curvature_difference)
    star = hertz.approach_factor(ellipse)
    for load in (100.0, 1000.0, 5000.0):
        approach = hertz.point_contact(load, curvature, ellipse).approach
        assert approach == pytest.approx(2.79e-4 * star * load ** (2 / 3) * curvature.curvature_sum ** (1 / 3),
                                         rel=2e-3)
        constant = hertz.point_contact_constant(curvature, ellipse)
        assert constant * approach ** 1.5 == pytest.approx(load, rel=1e-12)


def test_line_contact_load_deflection_for_steel() -> None:
    # Palmgren, steel roller on raceway (from memory): δ = 3.84·10⁻⁵·Q^0.9/l^0.8 (mm, N);
    # Harris & Kotzalas quote the inverse as K = 8.06·10⁴·l^(8/9) (N/mm^(10/9)).
    for length in (8.0, 14.0, 30.0):
        constant = hertz.line_contact_constant(length)
        assert constant == pytest.approx(8.06e4 * length ** (8 / 9), rel=5e-3)
        for load in (500.0, 5000.0):
            approach = 3.84e-5 * load ** 0.9 / length ** 0.8
            assert constant * approach ** (10 / 9) == pytest.approx(load, rel=1e-12)


def test_series_contacts_share_one_load() -> None:
    # Two springs Q = K·δ^n in series carry the same Q; approaches add (closed form).
    k_inner, k_outer, load = 1.0e6, 9.0e5, 3000.0
    total = (load / k_inner) ** (2 / 3) + (load / k_outer) ** (2 / 3)
    assert hertz.series_constant(k_inner, k_outer, 1.5) * total ** 1.5 == pytest.approx(load, rel=1e-12)


def test_line_contact_pressure_closed_form() -> None:
    # Hertz line contact: b = (8QR/(πlE'))^(1/2), pmax = 2Q/(πbl) = (QE'/(2πRl))^(1/2).
    load, length, rho = 4000.0, 12.0, 0.25
    e2 = hertz.REDUCED_MODULUS_STEEL
    assert hertz.line_contact_pressure(load, length, rho) == pytest.approx(
        math.sqrt(load * e2 * rho / (2.0 * math.pi * length)), rel=1e-12)


@pytest.mark.parametrize("difference", [2e-3, 1e-2])
def test_nearly_circular_contact(difference: float) -> None:
    # A ball on a nearly flat, nearly conforming pair has F(ρ) near 0 and k near 1 (a circle):
    # the same closed form F(k) = [(k²+1)E − 2K]/[(k²−1)E] (scipy's ellipk/ellipe, m = 1 − 1/k²)
    # solved from just above 1.
    def f_of_k(k: float) -> float:
        m = 1.0 - 1.0 / k ** 2
        return ((k ** 2 + 1.0) * ellipe(m) - 2.0 * ellipk(m)) / ((k ** 2 - 1.0) * ellipe(m))

    k = brentq(lambda x: f_of_k(x) - difference, 1.0 + 1e-6, 2.0, xtol=1e-15)
    assert k < 1.03
    assert hertz.ellipse_of(difference).k == pytest.approx(k, rel=1e-9)


@pytest.mark.parametrize("alpha", [0.0, 12.0])
def test_roller_raceway_curvature_from_the_radii(alpha: float) -> None:
    # A roller of radius Dwe/2 on a raceway whose radius normal to the contact is
    # (Dpw/cos α − Dwe)/2 inside, (Dpw/cos α + Dwe)/2 outside (concave): Σρ = 1/r1 ± 1/r2
    # (closed geometry).
    dwe, dpw = 11.0, 70.0
    lever = dpw / math.cos(math.radians(alpha))
    inner = 2.0 / dwe + 2.0 / (lever - dwe)
    outer = 2.0 / dwe - 2.0 / (lever + dwe)
    assert hertz.roller_raceway_curvature_sum(dwe, dpw, alpha, inner=True) == pytest.approx(inner, rel=1e-12)
    assert hertz.roller_raceway_curvature_sum(dwe, dpw, alpha, inner=False) == pytest.approx(outer, rel=1e-12)


def test_line_contact_half_width_for_steel() -> None:
    # Hertz line contact: b = (8Q·R/(π·l·E'))^(1/2), E' = 2/[2(1 − 0.3²)/207 000 MPa] (steel,
    # REFERENCE.md §8); pmax = 2Q/(π·b·l).
    e2 = 2.0 / (2.0 * (1.0 - 0.3 ** 2) / 207000.0)
    load, length, rho = 4000.0, 12.0, 0.25
    b = math.sqrt(8.0 * load / (rho * math.pi * length * e2))
    assert hertz.line_contact_half_width(load, length, rho) == pytest.approx(b, rel=1e-12)
    assert hertz.line_contact_pressure(load, length, rho) == pytest.approx(
        2.0 * load / (math.pi * b * length), rel=1e-12)
    assert hertz.REDUCED_MODULUS_STEEL == pytest.approx(e2, rel=1e-12)
