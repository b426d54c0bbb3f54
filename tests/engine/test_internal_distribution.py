"""Load distribution by the ring-displacement equilibrium, against Stribeck's and Sjövall's
closed forms, the equilibrium of the element loads themselves, and the definitions."""

from __future__ import annotations

import math
from dataclasses import replace

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from internal_examples import BALL, ROLLER

from workbench.engine.internal import hertz
from workbench.engine.internal.distribution import (
    InternalInputs,
    NoEquilibrium,
    ball_contacts,
    make_rows,
    load_zone,
    sjovall_integrals,
    solve_equilibrium,
    stribeck_q_max,
)
from workbench.engine.record import InputError



def _cos_sum(z: int, n: float) -> float:
    psi = np.arange(z) * 2.0 * math.pi / z
    c = np.cos(psi)
    return float(np.sum(c[c > 1e-12] ** (n + 1.0)))


@pytest.mark.parametrize("z", [7, 9, 12, 16])
def test_zero_clearance_ball_matches_stribeck(z: int) -> None:
    # Stribeck, rigid rings, zero clearance, pure radial: Qmax = Fr/(Σ cos^(n+1) ψj), n = 3/2.
    eq = solve_equilibrium(replace(BALL, z=z, dw=min(12.7, 3.0 * 65.0 / z)))
    assert float(np.max(eq.rows[0].load)) == pytest.approx(5000.0 / _cos_sum(z, 1.5), rel=1e-8)


@pytest.mark.parametrize("z", [10, 14, 18])
def test_zero_clearance_roller_matches_stribeck(z: int) -> None:
    # The same for line contact, n = 10/9 (straight rollers, slices share the load evenly).
    eq = solve_equilibrium(replace(ROLLER, z=z))
    assert float(np.max(eq.rows[0].load)) == pytest.approx(20000.0 / _cos_sum(z, 10 / 9), rel=1e-8)


def test_stribeck_limits() -> None:
    # Stribeck's constants for many elements: Qmax·Z/Fr → 1/Jr(0.5) = 4.37 (point) and 4.08
    # (line) [handbook: bearing-analysis texts]; the classic design value 5 allows for clearance.
    assert stribeck_q_max(1.0, 2000, 1.5) * 2000 == pytest.approx(4.37, abs=0.005)
    assert stribeck_q_max(1.0, 2000, 10 / 9) * 2000 == pytest.approx(4.08, abs=0.005)
    assert stribeck_q_max(1.0, 9, 1.5) * 9 == pytest.approx(9.0 / _cos_sum(9, 1.5), rel=1e-12)


@pytest.mark.parametrize(("epsilon", "exponent", "jr", "ja"), [
    # Point contact, tabulated by Sjövall (values as quoted in Harris & Kotzalas; from memory).
    (0.5, 1.5, 0.2288, 0.2782),
    (1.0, 1.5, 0.2546, 0.4244),
    # Line contact (from memory): Jr(0.5) = 0.2453.
    (0.5, 10 / 9, 0.2453, None),
])
def test_sjovall_integrals_at_tabulated_epsilon(epsilon: float, exponent: float, jr: float,
                                                 ja: float | None) -> None:
    radial, axial = sjovall_integrals(epsilon, exponent)
    assert radial == pytest.approx(jr, abs=6e-4)
    if ja is not None:
        assert axial == pytest.approx(ja, abs=6e-4)


def test_sjovall_integral_closed_form_at_half() -> None:
    # ε = 0.5: Jr = (1/2π)∫_{−π/2}^{π/2} cos^(n+1)ψ dψ = Γ((n+2)/2)/(2√π·Γ((n+3)/2)) (Beta
    # function; computed here by scipy.special, not typed).
    from scipy.special import gamma

    for n in (1.5, 10 / 9):
        closed = gamma((n + 2) / 2) / (2.0 * math.sqrt(math.pi) * gamma((n + 3) / 2))
        assert sjovall_integrals(0.5, n)[0] == pytest.approx(closed, rel=1e-9)


@pytest.mark.parametrize("epsilon", [0.2, 0.75, 0.98, 1.5])
def test_sjovall_integrals_from_their_definitions(epsilon: float) -> None:
    # Jr(ε) = (1/2π)∫ [1 − (1 − cos ψ)/(2ε)]₊^n cos ψ dψ and Ja(ε) = (1/2π)∫ [·]₊^n dψ over the
    # whole circle, the bracket's positive part marking the load zone (Sjövall; REFERENCE.md §8),
    # integrated here by scipy.integrate.quad on (−π, π) with the zone's edge as a break point.
    from scipy.integrate import quad

    def bracket(psi: float) -> float:
        return max(1.0 - (1.0 - math.cos(psi)) / (2.0 * epsilon), 0.0) ** 1.5

    edge = [math.acos(1.0 - 2.0 * epsilon)] if epsilon < 1.0 else []
    jr = quad(lambda p: bracket(p) * math.cos(p), 0.0, math.pi, points=edge)[0] / math.pi
    ja = quad(bracket, 0.0, math.pi, points=edge)[0] / math.pi
    assert sjovall_integrals(epsilon, 1.5) == pytest.approx((jr, ja), rel=1e-7)


@pytest.mark.parametrize("ratio", [1.2, 1.6, 3.0])
def test_combined_load_follows_sjovall(ratio: float) -> None:
    # Sjövall: with many elements and a fixed contact angle, Fr = Z·Qmax·Jr(ε)·cos α and
    # Fa = Z·Qmax·Ja(ε)·sin α, ε the engine's load zone (integrals by scipy.integrate.quad from
    # their definitions).  Straight tapered rollers, Z = 60: the discrete sum is within 0.5 %.
    alpha = 15.0
    fr = 20000.0
    inputs = InternalInputs("tapered", 60, 5.0, 100.0, alpha_deg=alpha, lwe=8.0, fr=fr,
                            fa=ratio * fr * math.tan(math.radians(alpha)), profile="straight")
    eq = solve_equilibrium(inputs)
    state = eq.rows[0]
    zone = load_zone(state)
    q_max = float(np.max(state.load))
    jr, ja = sjovall_integrals(zone.epsilon, 10 / 9)
    assert 60 * q_max * jr * math.cos(math.radians(alpha)) == pytest.approx(fr, rel=5e-3)
    assert 60 * q_max * ja * math.sin(math.radians(alpha)) == pytest.approx(inputs.fa, rel=5e-3)


def test_zero_clearance_load_zone_is_half() -> None:
    # Zero clearance, pure radial: ε = 0.5 and ψl = 90° (Stribeck; Harris & Kotzalas).
    zone = load_zone(solve_equilibrium(BALL).rows[0])
    assert zone.epsilon == pytest.approx(0.5, abs=1e-9)
    assert zone.half_angle_deg == pytest.approx(90.0, abs=1e-6)


def test_clearance_load_zone_formula() -> None:
    # Radial load with clearance Pd on a roller bearing: δψ = δr·cos ψ − Pd/2, so
    # ε = (1/2)·(1 − Pd/(2δr)) (Harris & Kotzalas; REFERENCE.md §8).
    inputs = replace(ROLLER, clearance=0.02)
    eq = solve_equilibrium(inputs)
    delta_r = float(eq.displacement[0])
    assert load_zone(eq.rows[0]).epsilon == pytest.approx(0.5 * (1.0 - 0.02 / (2.0 * delta_r)), rel=1e-9)


CASES = [
    InternalInputs("deep-groove", 9, 12.7, 65.0, fr=5000.0, fa=2000.0, clearance=0.02),
    InternalInputs("deep-groove", 9, 12.7, 65.0, fr=5000.0, clearance=-0.01),
    InternalInputs("deep-groove", 9, 12.7, 65.0, fr=5000.0, clearance=0.01, moment=20000.0),
    InternalInputs("angular-contact", 12, 12.7, 65.0, alpha_deg=40.0, fr=4000.0, fa=3000.0),
    InternalInputs("angular-contact", 12, 12.7, 65.0, alpha_deg=25.0, fr=2000.0, fa=3000.0, moment=-30000.0),
    InternalInputs("tapered", 17, 9.0, 66.0, alpha_deg=15.0, lwe=14.0, fr=10000.0, fa=5000.0),
]


@pytest.mark.parametrize("inputs", CASES)
def test_equilibrium_residuals_from_element_loads(inputs: InternalInputs) -> None:
    # Equilibrium of the inner ring written from the element outputs alone (Harris & Kotzalas):
    # Fr = Σ Qj·cos αj·cos ψj, Fa = Σ Qj·sin αj, and, with the moment given,
    # M = −Σ Qj·sin αj·ℜ·cos ψj (ℜ the inner groove-centre radius for balls, Dpw/2 and the slice
    # positions for rollers: only balls are checked for M here).
    eq = solve_equilibrium(inputs)
    state = eq.rows[0]
    alpha = np.radians(state.contact_angle_deg)
    cos_psi = np.cos(state.azimuth)
    scale = max(inputs.fr, abs(inputs.fa))
    assert float(np.sum(state.load * np.cos(alpha) * cos_psi)) == pytest.approx(inputs.fr, abs=1e-8 * scale)
    assert float(np.sum(state.load * np.sin(alpha))) == pytest.approx(inputs.fa, abs=1e-8 * scale)
    if inputs.moment is not None and inputs.kind != "tapered":
        locus = 0.5 * inputs.dpw + (0.52 - 0.5) * inputs.dw * math.cos(math.radians(inputs.alpha_deg))
        moment = -float(np.sum(state.load * np.sin(alpha) * locus * cos_psi))
        assert moment == pytest.approx(inputs.moment, abs=1e-7 * scale * inputs.dpw)


@pytest.mark.parametrize("inputs", CASES + [InternalInputs(
    "angular-contact", 12, 12.7, 65.0, alpha_deg=40.0, arrangement="back-to-back", fr=4000.0,
    fa=1000.0, preload=1000.0, moment=20000.0)])
def test_stiffness_is_the_jacobian_of_the_reactions(inputs: InternalInputs) -> None:
    # The analytic tangent stiffness against central differences of the reactions (definition).
    eq = solve_equilibrium(inputs)
    rows = make_rows(inputs, _stiffness(inputs), eq.preload_offset)

    def reactions(q: np.ndarray) -> np.ndarray:
        return sum(row.reactions(q)[0] for row in rows)

    q0 = eq.displacement
    steps = np.array([1e-7, 1e-7, 1e-7 / (0.5 * inputs.dpw)])
    numeric = np.column_stack([(reactions(q0 + np.eye(3)[i] * steps[i]) - reactions(q0 - np.eye(3)[i] * steps[i]))
                               / (2.0 * steps[i]) for i in range(3)])
    assert np.allclose(eq.stiffness, numeric, rtol=1e-4, atol=1e-6 * np.max(np.abs(numeric)))
    assert np.allclose(eq.stiffness, eq.stiffness.T, rtol=1e-9, atol=1e-9 * np.max(np.abs(eq.stiffness)))


def _stiffness(inputs: InternalInputs) -> float:
    from workbench.engine.internal.distribution import element_stiffness

    return element_stiffness(inputs)


def test_pure_axial_load_shares_equally() -> None:
    # A pure axial load on an angular-contact ball bearing loads every ball alike (symmetry;
    # Harris & Kotzalas): Q = Fa/(Z·sin α'), α' the operating contact angle.
    inputs = InternalInputs("angular-contact", 12, 12.7, 65.0, alpha_deg=40.0, fa=3000.0)
    state = solve_equilibrium(inputs).rows[0]
    assert float(np.ptp(state.load)) <= 1e-9 * float(np.mean(state.load))
    assert float(np.ptp(state.contact_angle_deg)) <= 1e-9
    alpha = math.radians(float(state.contact_angle_deg[0]))
    assert float(state.load[0]) == pytest.approx(3000.0 / (12 * math.sin(alpha)), rel=1e-10)
    assert math.degrees(alpha) > 40.0  # the contact angle opens under thrust


def test_free_contact_angle_of_a_deep_groove_bearing() -> None:
    # Pure thrust on a deep-groove bearing with clearance Pd: the free contact angle is
    # cos α0 = 1 − Pd/(2A), A = (fi + fe − 1)·Dw, and the angle only grows under load.
    pd = 0.02
    state = solve_equilibrium(InternalInputs("deep-groove", 9, 12.7, 65.0, fa=0.05, clearance=pd)).rows[0]
    a = (0.52 + 0.53 - 1.0) * 12.7
    free = math.degrees(math.acos(1.0 - pd / (2.0 * a)))
    assert float(state.contact_angle_deg[0]) == pytest.approx(free, rel=0.01)
    assert float(state.contact_angle_deg[0]) > free


def test_preloaded_pair_carries_the_preload_on_each_row() -> None:
    # Displacement compatibility with no external load: each row carries the preload, the rings
    # stay centred (symmetry).
    inputs = InternalInputs("angular-contact", 12, 12.7, 65.0, alpha_deg=25.0,
                            arrangement="back-to-back", preload=800.0, moment=0.0)
    eq = solve_equilibrium(inputs)
    assert np.allclose(eq.displacement, 0.0, atol=1e-12)
    for state in eq.rows:
        axial = float(np.sum(state.load * np.sin(np.radians(state.contact_angle_deg))))
        assert axial == pytest.approx(800.0, rel=1e-9)


def test_pair_rows_share_the_external_thrust() -> None:
    # Shaft axial equilibrium: Fa,A − Fa,B = Fa for a back-to-back pair with thrust toward B.
    inputs = InternalInputs("tapered", 17, 9.0, 66.0, alpha_deg=15.0, lwe=14.0,
                            arrangement="back-to-back", fr=10000.0, fa=2000.0, preload=500.0)
    eq = solve_equilibrium(inputs)
    axial = [float(np.sum(s.load)) * math.sin(math.radians(15.0)) for s in eq.rows]
    assert axial[0] - axial[1] == pytest.approx(2000.0, rel=1e-8)


def test_back_to_back_is_stiffer_in_tilt_than_face_to_face() -> None:
    # Back-to-back rows spread their pressure centres wider than face-to-face at the same row
    # spacing, so resist tilt more (Harris & Kotzalas; common practice for spindles).
    common = dict(alpha_deg=25.0, preload=800.0, fr=1000.0, moment=0.0, row_spacing=25.0)
    o = solve_equilibrium(InternalInputs("angular-contact", 12, 12.7, 65.0, arrangement="back-to-back", **common))
    x = solve_equilibrium(InternalInputs("angular-contact", 12, 12.7, 65.0, arrangement="face-to-face", **common))
    assert o.stiffness[2, 2] > 1.5 * x.stiffness[2, 2]


def test_preload_stiffens_the_bearing() -> None:
    # Preload raises the radial stiffness (Harris & Kotzalas; the reason spindles are preloaded).
    loose = solve_equilibrium(replace(BALL, clearance=0.01))
    tight = solve_equilibrium(replace(BALL, clearance=-0.01))
    assert tight.stiffness[0, 0] > loose.stiffness[0, 0]


def test_roller_load_deflection_end_to_end() -> None:
    # Zero clearance, straight rollers: the most loaded roller's approach is Palmgren's
    # 2·3.84·10⁻⁵·Qmax^0.9/l^0.8 (inner and outer contact), and equals δr (ψ = 0).
    eq = solve_equilibrium(ROLLER)
    q_max = float(np.max(eq.rows[0].load))
    assert float(eq.displacement[0]) == pytest.approx(2 * 3.84e-5 * q_max ** 0.9 / 11.0 ** 0.8, rel=1e-9)


def test_ball_contacts_series_constant() -> None:
    # The ball's two contacts in series (closed form of the series rule).
    c = ball_contacts(BALL)
    assert c.k_element == pytest.approx(
        (c.k_inner ** (-2 / 3) + c.k_outer ** (-2 / 3)) ** -1.5, rel=1e-12)
    assert hertz.POINT_CONTACT_EXPONENT == 1.5


def test_pure_thrust_on_a_cylindrical_bearing_has_no_equilibrium() -> None:
    with pytest.raises(NoEquilibrium, match="cylindrical") as info:
        solve_equilibrium(InternalInputs("cylindrical", 14, 11.0, 70.0, lwe=11.0, fa=2000.0))
    assert info.value.field == "fa"


def test_load_beyond_the_geometry_has_no_equilibrium() -> None:
    with pytest.raises(NoEquilibrium, match="beyond what the geometry"):
        solve_equilibrium(replace(BALL, fr=5.0e6))


def test_single_tapered_row_needs_its_induced_thrust() -> None:
    # Sjövall: a single row with a fixed contact angle needs Fa ≥ Fr·tan α (ε → 0 at equality).
    with pytest.raises(NoEquilibrium, match="tan α"):
        solve_equilibrium(InternalInputs("tapered", 17, 9.0, 66.0, alpha_deg=15.0, lwe=14.0,
                                         fr=10000.0, fa=2000.0))


@pytest.mark.parametrize(("changes", "field"), [
    ({"z": 2}, "z"), ({"dw": 70.0}, "dw"), ({"kind": "spherical"}, "kind"),
    ({"clearance": 1.0}, "clearance"), ({"preload": 100.0}, "preload"), ({"fr": -1.0}, "fr"),
    ({"moment": 1.0, "tilt": 0.001}, "tilt"), ({"lwe": 10.0}, "lwe"), ({"fi": 0.49}, "fi"),
])
def test_bad_inputs_name_the_input(changes: dict[str, object], field: str) -> None:
    with pytest.raises(InputError) as info:
        solve_equilibrium(replace(BALL, **changes))
    assert info.value.field == field


def test_three_elements_are_enough() -> None:
    # Three contacts are the fewest that hold a ring in the plane (closed geometry): Z = 3 is
    # taken, Z = 2 refused (above); the three loads balance Fr.
    row = solve_equilibrium(replace(BALL, z=3, fr=500.0)).rows[0]
    assert len(row.load) == 3
    radial = np.sum(row.load * np.cos(row.azimuth) * np.cos(np.radians(row.contact_angle_deg)))
    assert radial == pytest.approx(500.0, rel=1e-6)


@settings(max_examples=40, derandomize=True, deadline=None)
@given(kind=st.sampled_from(["deep-groove", "angular-contact", "cylindrical", "tapered"]),
       pair=st.booleans(), fr=st.floats(0.0, 0.4), fa=st.floats(-0.2, 0.4),
       clearance=st.floats(-0.002, 0.006), moment=st.one_of(st.none(), st.floats(-0.05, 0.05)))
def test_either_balanced_or_a_named_cause(kind: str, pair: bool, fr: float, fa: float,
                                          clearance: float, moment: float | None) -> None:
    # Any load on any covered kind: an equilibrium whose reactions balance the loads (residual
    # below 1e-8 of the largest), or NoEquilibrium / InputError naming an input, nothing else.
    dw, dpw, z = 10.0, 60.0, 14
    capacity = 100.0 * z * dw ** 1.8  # of the order of C (N)
    arrangement = "back-to-back" if pair and kind in ("angular-contact", "tapered") else "single"
    inputs = InternalInputs(
        kind, z, dw, dpw, alpha_deg=0.0 if kind in ("deep-groove", "cylindrical") else 25.0,
        lwe=12.0 if kind in ("cylindrical", "tapered") else None, arrangement=arrangement,
        clearance=clearance * dw, fr=fr * capacity, fa=fa * capacity,
        moment=None if moment is None else moment * capacity * dpw)
    try:
        eq = solve_equilibrium(inputs)
    except (NoEquilibrium, InputError) as exc:
        assert exc.field and exc.message
        return
    target = np.array([inputs.fr, 0.0 if kind == "cylindrical" else inputs.fa,
                       eq.reactions[2] if inputs.moment is None else inputs.moment])
    scale = max(inputs.fr, abs(inputs.fa), 1.0)
    assert np.allclose(eq.reactions * [1, 1, 1 / (0.5 * dpw)], target * [1, 1, 1 / (0.5 * dpw)],
                       atol=1e-8 * scale)


@pytest.mark.parametrize(("delta0", "delta1", "epsilon", "half_angle"), [
    (0.5, 1.0, 0.75, 120.0),      # ψl = arccos(−δ0/δ1) = arccos(−0.5)
    (-0.5, 1.0, 0.25, 60.0),      # clearance: fewer than half the elements carry load
    (2.0, 1.0, 1.5, 180.0),       # ε > 1: every element loaded, the whole circle
    (1.0, 0.0, math.inf, 180.0),  # no variation round the ring (pure thrust): all loaded
])
def test_load_zone_from_the_approaches(delta0: float, delta1: float, epsilon: float,
                                       half_angle: float) -> None:
    # Rigid rings: δψ = δ0 + δ1·cos ψ; ε = (δ0 + δ1)/(2δ1) and ψl = arccos(−δ0/δ1), the whole
    # circle (180°) once every element is loaded (Sjövall; Harris & Kotzalas; closed form).
    from workbench.engine.internal.distribution import RowState

    psi = np.linspace(0.0, 2.0 * math.pi, 24, endpoint=False)
    approach = delta0 + delta1 * np.cos(psi)
    state = RowState(psi, np.maximum(approach, 0.0) ** 1.5, np.zeros(24), approach,
                     np.maximum(approach, 0.0)[:, None] ** 1.5, 1.0)
    zone = load_zone(state)
    assert zone.epsilon == pytest.approx(epsilon, rel=1e-12)
    assert zone.half_angle_deg == pytest.approx(half_angle, rel=1e-12)


@pytest.mark.parametrize(("base", "field", "inside", "outside"), [
    # physics: a groove radius above the ball's (f > 0.5, closed geometry); eC from 0 to 1
    # (ISO 281:2007 §9.3, from memory)
    (BALL, "fi", 0.505, 0.5),
    (BALL, "ec", 1.0, 1.01),
    # the model's own stated range (our choice, said in each refusal; no published value):
    # α ≤ 45°, f ≤ 0.6, 1–200 slices, |clearance| < 5 % of the element diameter, |tilt| ≤ 0.01 rad
    (replace(BALL, kind="angular-contact", alpha_deg=30.0), "alpha_deg", 45.0, 45.5),
    (BALL, "fe", 0.6, 0.61),
    (ROLLER, "slices", 200, 201),
    (BALL, "clearance", 0.0495 * 12.7, 0.05 * 12.7),
    (BALL, "tilt", 0.01, 0.0101),
])
def test_the_range_at_its_edges(base: InternalInputs, field: str, inside: float,
                                outside: float) -> None:
    from workbench.engine.internal.distribution import validate

    validate(replace(base, **{field: inside}))
    with pytest.raises(InputError) as info:
        validate(replace(base, **{field: outside}))
    assert info.value.field == field
