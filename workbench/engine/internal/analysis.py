"""One bearing inside: contact constants, equilibrium, load zone, pressure, stiffness and the
reference rating life, every step recorded in a :class:`~workbench.engine.record.Derivation`.

:func:`analyse_internal` is the one entry: the command ``workbench internal``, the model's
helpers for the screen and the benchmark all call it.  Sources: Hertz (contact), Stribeck and
Sjövall (load distribution), Jones and Harris & Kotzalas, *Rolling Bearing Analysis* (the
ring-displacement model), ISO/TS 16281 (reference rating life), ISO 76 (reference pressures and
C0), ISO 281 (C, bm, the catalogue life beside it, aISO).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace
from typing import Any

import numpy as np

from .. import pairs
from ..derive import CaseInputs, derive
from ..kinds import Arrangement, Kind, dynamic_factors
from ..life import aiso, fatigue_load_limit_estimate, kappa_in_range, life_hours, reference_viscosity
from ..ratings import (dynamic_rating_radial_ball, dynamic_rating_radial_roller,
                       static_rating_radial_ball, static_rating_radial_roller)
from ..rating_tables import BM_BY_KIND
from ..num import cosd, tand
from ..record import Derivation, InputError
from . import hertz, reference_life
from .distribution import (BallContacts, Equilibrium, InternalInputs, LoadZone, NoEquilibrium,
                           RowState, ball_contacts, crown_drop, default_row_spacing,
                           element_stiffness, is_ball,
                           is_pair, load_zone, osculations, roller_constant,
                           solve_equilibrium, stribeck_q_max, validate)

NAN = math.nan
SOURCE_HERTZ = "Hertz; Harris & Kotzalas, Rolling Bearing Analysis"
SOURCE_PALMGREN = "Palmgren (steel line contact); Harris & Kotzalas"
SOURCE_EQUILIBRIUM = "Jones; Harris & Kotzalas (quasi-static ring displacements)"
SOURCE_SJOVALL = "Sjövall; Harris & Kotzalas"
SOURCE_TS16281 = "ISO/TS 16281:2008 (reference rating life; from memory)"
SOURCE_LP = "Lundberg & Palmgren; ISO/TS 16281:2008"
SOURCE_ISO76 = "ISO 76:2006 §4 (reference contact pressure; from memory)"
SOURCE_PAIRS = "two-bearing thrust-sharing rule (engine/pairs.py)"
STRIBECK_DESIGN_CONSTANT = 5.0  # Qmax = 5·F/(i·Z·cos α), the classic allowance (from memory)


@dataclass(frozen=True, slots=True)
class ElementLoad:
    """One rolling element at equilibrium: its row ("" single, "A"/"B" in a pair), azimuth from
    the direction of Fr (°), load (N), operating contact angle (°) and approach (mm)."""

    row: str
    angle_deg: float
    load: float
    contact_angle_deg: float
    approach: float


@dataclass(frozen=True, slots=True)
class RowResult:
    """One row's loads, load zone, pressures and lives."""

    name: str
    radial_load: float
    axial_load: float  # in the row's own contact direction
    q_max: float
    zone: LoadZone
    loaded: int
    p_max_inner: float
    p_max_outer: float
    life_inner: float
    life_outer: float
    life: float


@dataclass(frozen=True, slots=True)
class InternalResult:
    """Everything the command, the screen and the reports show of one internal analysis."""

    inputs: InternalInputs
    equilibrium: Equilibrium
    elements: list[ElementLoad]
    rows: list[RowResult]
    derivation: Derivation

    @property
    def results(self) -> dict[str, float]:
        """The derivation's named results."""
        return self.derivation.results

    def as_dict(self) -> dict[str, Any]:
        """Plain data with the keys of ``workbench internal --json``."""
        r = self.results
        q = self.equilibrium.displacement
        return {
            "kind": self.inputs.kind,
            "arrangement": self.inputs.arrangement,
            "elements": [{"row": e.row, "angle_deg": e.angle_deg, "load_N": e.load,
                          "contact_angle_deg": e.contact_angle_deg, "approach_mm": e.approach}
                         for e in self.elements],
            "q_max_N": r["Q_max"],
            "load_zone_deg": r["psi_l"],
            "epsilon": r["epsilon"],
            "displacement": {"radial_mm": float(q[0]), "axial_mm": float(q[1]), "tilt_rad": float(q[2])},
            "moment_Nmm": r["M"],
            "p_max_MPa": {"inner": r["p_max_inner"], "outer": r["p_max_outer"]},
            "stiffness": {"radial_N_per_mm": r["k_radial"], "axial_N_per_mm": r["k_axial"],
                          "tilt_Nmm_per_rad": r["k_tilt"]},
            "rows": [{"row": row.name, "radial_load_N": row.radial_load,
                      "axial_load_N": row.axial_load, "q_max_N": row.q_max,
                      "epsilon": row.zone.epsilon, "load_zone_deg": row.zone.half_angle_deg,
                      "loaded_elements": row.loaded, "p_max_MPa": {"inner": row.p_max_inner,
                                                                   "outer": row.p_max_outer},
                      "L10r": row.life} for row in self.rows],
            "L10r": r["L10r"],
            "L10_iso281": r["L10_iso281"],
            "Lnmr": r.get("Lnmr", NAN),
            "steps": [s.as_dict() for s in self.derivation.steps],
            "warnings": list(self.derivation.warnings),
        }


# ---------------------------------------------------------------------------------------------


def analyse_internal(inputs: InternalInputs, *, keep_steps: bool = True) -> InternalResult:
    """The internal analysis of one bearing (see the module notes); InputError for bad input,
    :class:`~workbench.engine.internal.distribution.NoEquilibrium` when no ring position
    balances the loads."""
    validate(inputs)
    d = Derivation(keep_steps)
    ball = is_ball(inputs.kind)
    _geometry_steps(d, inputs)
    if ball:
        contacts = ball_contacts(inputs)
        stiffness = _ball_contact_steps(d, inputs, contacts)
    else:
        contacts = None
        stiffness = _roller_contact_steps(d, inputs)
    equilibrium = solve_equilibrium(inputs, stiffness=stiffness)
    _equilibrium_steps(d, inputs, equilibrium)
    rows = _row_results(d, inputs, equilibrium, contacts)
    _stiffness_steps(d, equilibrium)
    c, c0 = _rating_steps(d, inputs, contacts)
    _life_steps(d, inputs, rows, c)
    _iso281_step(d, inputs, c, c0)
    if is_pair(inputs):
        _pair_rule_steps(d, inputs, rows, c0)
    elements = [ElementLoad(name, float(math.degrees(psi)), float(load), float(angle), float(delta))
                for name, state in zip(_row_names(inputs), equilibrium.rows)
                for psi, load, angle, delta in zip(state.azimuth, state.load,
                                                   state.contact_angle_deg, state.approach)]
    return InternalResult(inputs, equilibrium, elements, rows, d)


def _row_names(inputs: InternalInputs) -> tuple[str, ...]:
    return ("A", "B") if is_pair(inputs) else ("",)


def _geometry_steps(d: Derivation, inputs: InternalInputs) -> None:
    alpha = inputs.alpha_deg
    d.add("gamma", inputs.dw * cosd(alpha) / inputs.dpw, symbol="γ", label="geometry ratio",
          formula="γ = Dw·cos α/Dpw", template="γ = {0}·cos {1}°/{2}",
          args=(inputs.dw, alpha, inputs.dpw), unit="", source=SOURCE_HERTZ)
    if inputs.preload > 0.0:
        d.add("preload", inputs.preload, symbol="Fpre", label="axial preload of the pair",
              formula="given", template="{0}", args=(inputs.preload,), unit="N", source="input")
    else:
        d.add("Pd", inputs.clearance, symbol="Pd", label="operating diametral clearance",
              formula="given (negative: preload)", template="{0}", args=(inputs.clearance,),
              unit="mm", source="input",
              note="preload" if inputs.clearance < 0.0 else None)
    if is_pair(inputs):
        spacing = inputs.row_spacing if inputs.row_spacing is not None else default_row_spacing(inputs)
        d.add("row_spacing", spacing, symbol="L", label="distance between the pair's row centres",
              formula="given" if inputs.row_spacing is not None else
              ("2·Dw (assumed)" if is_ball(inputs.kind) else "Lwe + Dwe (assumed)"), template="{0}",
              args=(spacing,), unit="mm",
              source="input" if inputs.row_spacing is not None else "assumption (give the drawing's)")


def _ball_contact_steps(d: Derivation, inputs: InternalInputs, contacts: BallContacts) -> float:
    fi, fe = osculations(inputs)
    for key, symbol, value, given in (("fi", "fi", fi, inputs.fi), ("fe", "fe", fe, inputs.fe)):
        d.add(key, value, symbol=symbol,
              label=f"{'inner' if key == 'fi' else 'outer'} raceway osculation",
              formula="groove radius/Dw", template="{0}", args=(value,), unit="",
              source="input" if given is not None else "common practice default (0.52 inner, 0.53 outer)")
    for side, curvature, ellipse, k in (("i", contacts.inner, contacts.inner_ellipse, contacts.k_inner),
                                        ("e", contacts.outer, contacts.outer_ellipse, contacts.k_outer)):
        word = "inner" if side == "i" else "outer"
        d.add(f"sum_rho_{side}", curvature.curvature_sum, symbol=f"Σρ{side}",
              label=f"curvature sum, {word} contact",
              formula="Σρ = 4/Dw ± (2/Dw)·γ/(1 ∓ γ) − 1/(f·Dw)",
              template="Dw = {0}, γ = {1}, f = {2}",
              args=(inputs.dw, d.results["gamma"], fi if side == "i" else fe), unit="1/mm",
              source=SOURCE_HERTZ)
        d.add(f"F_rho_{side}", curvature.curvature_difference, symbol=f"F(ρ){side}",
              label=f"curvature difference, {word} contact",
              formula="F(ρ) = [(ρI1 − ρI2) + (ρII1 − ρII2)]/Σρ", template="Σρ = {0}",
              args=(curvature.curvature_sum,), unit="", source=SOURCE_HERTZ)
        d.add(f"k_{side}", ellipse.k, symbol=f"k{side}", label=f"ellipticity a/b, {word} contact",
              formula="F(ρ) = [(k² + 1)·E(e) − 2K(e)]/[(k² − 1)·E(e)], e² = 1 − 1/k²",
              template="F(ρ) = {0}: K = {1}, E = {2}",
              args=(curvature.curvature_difference, ellipse.first_kind, ellipse.second_kind),
              unit="", source=SOURCE_HERTZ,
              note="complete elliptic integrals by scipy.special.ellipk/ellipe")
        d.add(f"K_{side}", k, symbol=f"K{side}", label=f"load–deflection constant, {word} contact",
              formula="Q = K·δ^(3/2), K = (Σρ·E'/3)·(2/(δ*·Σρ))^(3/2)",
              template="Σρ = {0}, E' = {1}",
              args=(curvature.curvature_sum, hertz.REDUCED_MODULUS_STEEL), unit="N/mm^1.5",
              source=SOURCE_HERTZ, note="steel, E = 207 GPa, ν = 0.3")
    return d.add("K", contacts.k_element, symbol="K",
                 label="load–deflection constant of one ball (both contacts)",
                 formula="K = [(1/Ki)^(2/3) + (1/Ke)^(2/3)]^(−3/2)", template="Ki = {0}, Ke = {1}",
                 args=(contacts.k_inner, contacts.k_outer), unit="N/mm^1.5", source=SOURCE_HERTZ)


def _roller_contact_steps(d: Derivation, inputs: InternalInputs) -> float:
    lwe = float(inputs.lwe or 0.0)
    single = hertz.line_contact_constant(lwe)
    d.add("K_line", single, symbol="Kl", label="load–deflection constant, one line contact",
          formula="δ = 3.84·10⁻⁵·Q^0.9/Lwe^0.8 ⇒ K = Lwe^(8/9)/(3.84·10⁻⁵)^(10/9)",
          template="Lwe = {0}", args=(lwe,), unit="N/mm^(10/9)",
          source=SOURCE_PALMGREN, note="steel, from memory")
    drop = crown_drop(inputs)
    d.add("slices", float(inputs.slices), symbol="ns", label="slices per roller",
          formula="laminae of width Lwe/ns", template="{0}", args=(float(inputs.slices),), unit="",
          source=SOURCE_TS16281, note=f"{inputs.profile} profile")
    d.add("crown_drop", drop, symbol="c", label="crown gap at each roller end",
          formula="parabolic crown c·(2x/Lwe)²", template="{0}", args=(drop,), 
          unit="mm", source="input" if inputs.crown_drop is not None or inputs.profile == "straight"
          else "assumption: 0.001·Lwe")
    return d.add("K", roller_constant(lwe), symbol="K",
                 label="load–deflection constant of one roller (both contacts)",
                 formula="K = Kl·2^(−10/9), shared among the slices by width", template="Kl = {0}",
                 args=(single,), unit="N/mm^(10/9)", source=SOURCE_PALMGREN)


def _equilibrium_steps(d: Derivation, inputs: InternalInputs, eq: Equilibrium) -> None:
    if eq.preload_offset > 0.0:
        d.add("delta_pre", eq.preload_offset, symbol="δpre",
              label="axial preload interference per row",
              formula="row's axial reaction = Fpre (rings centred)", template="Fpre = {0}",
              args=(inputs.preload,), unit="mm", source=SOURCE_EQUILIBRIUM, note="Brent's method")
    q = eq.displacement
    how = (f"scipy.optimize.root ({'Powell hybrid' if eq.method == 'hybr' else 'Levenberg–Marquardt'},"
           f" analytic Jacobian), {eq.evaluations} evaluations, residual {eq.residual:.1e}")
    d.add("delta_r", float(q[0]), symbol="δr", label="radial displacement of the inner ring",
          formula="Σ Q·∂δ/∂δr = Fr", template="Fr = {0}", args=(inputs.fr,), 
          unit="mm", source=SOURCE_EQUILIBRIUM, note=how)
    if inputs.kind == "cylindrical":
        d.add("delta_a", 0.0, symbol="δa", label="axial displacement",
              formula="α = 0°: no axial stiffness", template="0", args=(), unit="mm",
              source=SOURCE_EQUILIBRIUM,
              warning=("Fa is carried by the ribs, outside this analysis: the raceway loads "
                       "below are from Fr and the moment") if inputs.fa != 0.0 else None)
    else:
        d.add("delta_a", float(q[1]), symbol="δa", label="axial displacement of the inner ring",
              formula="Σ Q·∂δ/∂δa = Fa", template="Fa = {0}", args=(inputs.fa,), 
              unit="mm", source=SOURCE_EQUILIBRIUM)
    if inputs.moment is not None:
        d.add("theta", float(q[2]), symbol="θ", label="tilt of the inner ring",
              formula="Σ Q·∂δ/∂θ = M", template="M = {0}", args=(inputs.moment,), unit="rad",
              source=SOURCE_EQUILIBRIUM)
        d.add("M", inputs.moment, symbol="M", label="tilting moment", formula="given",
              template="{0}", args=(inputs.moment,), unit="N·mm", source="input")
    else:
        d.add("theta", inputs.tilt, symbol="θ", label="tilt of the inner ring (held)",
              formula="given misalignment", template="{0}", args=(inputs.tilt,), 
              unit="rad", source="input")
        d.add("M", float(eq.reactions[2]), symbol="M", label="moment the rings carry at that tilt",
              formula="M = Σ Q·∂δ/∂θ", template="θ = {0}", args=(inputs.tilt,), unit="N·mm",
              source=SOURCE_EQUILIBRIUM)


def _row_results(d: Derivation, inputs: InternalInputs, eq: Equilibrium,
                 contacts: BallContacts | None) -> list[RowResult]:
    ball = contacts is not None
    capacities = _capacity_steps(d, inputs)
    results = []
    n = hertz.POINT_CONTACT_EXPONENT if ball else hertz.LINE_CONTACT_EXPONENT
    for name, state, force in zip(_row_names(inputs), eq.rows, eq.row_reactions):
        q_max = float(np.max(state.load))
        zone = load_zone(state)
        loaded = int(np.count_nonzero(state.load > 0.0))
        p_inner, p_outer, width = _pressures(inputs, state, contacts)
        lives = _row_life(inputs, state, capacities)
        results.append(RowResult(name, float(force[0]), float(force[1] * state.direction), q_max, zone,
                                 loaded, p_inner, p_outer, lives.inner, lives.outer, lives.row))
        tag = f" (row {name})" if name else ""
        suffix = f"_{name}" if name else ""
        d.add(f"Q_max{suffix}", q_max, symbol="Qmax", label=f"largest element load{tag}",
              formula="Q = K·δ^n at the most loaded element",
              template="n = {0}, {1} of {2} elements loaded",
              args=(n, float(loaded), float(inputs.z)), unit="N",
              source=SOURCE_EQUILIBRIUM)
        if not suffix and inputs.fr > 0.0:
            d.add("Q_max_stribeck",
                  stribeck_q_max(inputs.fr, inputs.z, n, alpha_deg=inputs.alpha_deg),
                  symbol="Qmax,S", label="largest element load by Stribeck, for comparison",
                  formula="Qmax = Fr/(cos α·Σ cos^(n+1) ψj), zero clearance, pure radial",
                  template="Fr = {0}, Z = {1}, n = {2}", args=(inputs.fr, float(inputs.z), n),
                  unit="N", source="Stribeck; Harris & Kotzalas",
                  note="the equilibrium above adds clearance, thrust and tilt")
        d.add(f"epsilon{suffix}", zone.epsilon, symbol="ε", label=f"load zone parameter{tag}",
              formula="ε = (δ0 + δ1)/(2δ1), δψ = δ0 + δ1·cos ψ", template="{0} elements loaded",
              args=(float(loaded),), unit="", source=SOURCE_SJOVALL,
              note="ε = 0.5: half the ring loaded (zero clearance); > 0.5 preload; ∞ pure thrust")
        d.add(f"psi_l{suffix}", zone.half_angle_deg, symbol="ψl",
              label=f"loaded arc, ± from the most loaded element{tag}",
              formula="ψl = arccos(−δ0/δ1)", template="ε = {0}", args=(zone.epsilon,),
              unit="°", source=SOURCE_SJOVALL)
        limit = hertz.STATIC_REFERENCE_PRESSURE_BALL if ball else hertz.STATIC_REFERENCE_PRESSURE_ROLLER
        for side, p in (("inner", p_inner), ("outer", p_outer)):
            warning = None
            if p > limit:
                warning = (f"{side} raceway{tag}: pmax = {p:.0f} MPa exceeds the {limit:.0f} MPa "
                           "ISO 76 takes at C0 (permanent deformation beyond 0.0001·Dw)")
            d.add(f"p_max_{side}{suffix}", p, symbol=f"pmax,{side[0]}",
                  label=f"largest contact pressure, {side} raceway{tag}",
                  formula="pmax = 3Q/(2π·a·b)" if ball else
                  "pmax = 2q/(π·b·w), b = (8q/(π·w·Σρ·E'))^(1/2)",
                  template="Q = {0}" if ball else "slice width w = {0}",
                  args=(q_max,) if ball else (width,), unit="MPa", source=SOURCE_HERTZ,
                  note=f"reference at C0: {limit:.0f} MPa ({SOURCE_ISO76})", warning=warning)
        _row_life_steps(d, inputs, lives, suffix, tag)
    if len(results) > 1:
        _pair_summary_steps(d, results)
    return results


def _pair_summary_steps(d: Derivation, rows: list[RowResult]) -> None:
    """Steps: the pair's headline numbers, from its most loaded row (pressures: the larger)."""
    best = max(rows, key=lambda row: row.q_max)
    inner = max(rows, key=lambda row: row.p_max_inner)
    outer = max(rows, key=lambda row: row.p_max_outer)
    for key, symbol, label, value, unit, row in (
            ("Q_max", "Qmax", "largest element load of the pair", best.q_max, "N", best),
            ("epsilon", "ε", "load zone parameter of the most loaded row", best.zone.epsilon, "", best),
            ("psi_l", "ψl", "loaded arc of the most loaded row", best.zone.half_angle_deg, "°", best),
            ("p_max_inner", "pmax,i", "largest contact pressure of the pair, inner",
             inner.p_max_inner, "MPa", inner),
            ("p_max_outer", "pmax,o", "largest contact pressure of the pair, outer",
             outer.p_max_outer, "MPa", outer)):
        d.add(key, value, symbol=symbol, label=label, formula="the larger of rows A and B",
              template=f"row {row.name}", args=(), unit=unit,
              source=SOURCE_EQUILIBRIUM)


def _row_life_steps(d: Derivation, inputs: InternalInputs, lives: reference_life.RaceLives,
                    suffix: str, tag: str) -> None:
    """Steps: each raceway's equivalent reference load and life, and the row's L10r."""
    ball = is_ball(inputs.kind)
    for side, life, load in (("inner", lives.inner, lives.load_inner),
                             ("outer", lives.outer, lives.load_outer)):
        capacity = d.results[f"Qc_{side}"]
        rotating = (side == "inner") != inputs.outer_ring_rotates
        if ball:
            power = "3" if rotating else "10/3"
            d.add(f"Qe_{side}{suffix}", load, symbol=f"Qe{side[0]}",
                  label=f"equivalent reference load, {side} raceway{tag}",
                  formula=f"((1/Z)·Σ Q^{power})^(1/{power})", template="Z = {0}",
                  args=(float(inputs.z),), unit="N", source=SOURCE_LP,
                  note="ring rotating against the load" if rotating else "ring stationary against the load")
            d.add(f"L_{side}{suffix}", life, symbol=f"L{side[0]}",
                  label=f"{side} raceway life{tag}", formula="(Qc/Qe)³", template="({0}/{1})³",
                  args=(capacity, load), unit="10⁶ rev", source=SOURCE_LP)
        else:
            power = "4" if rotating else "4.5"
            d.add(f"Qe_{side}{suffix}", load, symbol=f"qe{side[0]}",
                  label=f"equivalent slice load, {side} raceway, " f"most loaded slice{tag}",
                  formula=f"((1/Z)·Σ q^{power})^(1/{power}) per slice", template="Z = {0}",
                  args=(float(inputs.z),), unit="N", source=SOURCE_LP,
                  note="ring rotating against the load" if rotating else "ring stationary against the load")
            d.add(f"L_{side}{suffix}", life, symbol=f"L{side[0]}",
                  label=f"{side} raceway life{tag}",
                  formula="[Σk (qck/qek)^(−9/2)]^(−8/9), qck = Qc·ns^(−7/9)",
                  template="Qc = {0}, ns = {1}", args=(capacity, float(inputs.slices)),
                  unit="10⁶ rev", source=SOURCE_LP)
    d.add(f"L10r_row{suffix}" if suffix else "L10r", lives.row, symbol="L10r",
          label=f"reference rating life of the row{tag}",
          formula="(Li^(−e) + Le^(−e))^(−1/e), e = 10/9" if ball else
          "[Σ raceways, slices (qck/qek)^(−9/2)]^(−8/9)",
          template="Li = {0}, Le = {1}", args=(lives.inner, lives.outer), 
          unit="10⁶ rev", source=SOURCE_TS16281)


def _capacity_steps(d: Derivation, inputs: InternalInputs) -> tuple[float, float]:
    """Steps Qci, Qce: each raceway's basic dynamic capacity (one row)."""
    q_ci, q_ce = raceway_capacities(inputs)
    ball = is_ball(inputs.kind)
    formula = ("Qc = bm·98.1·(2f/(2f − 1))^0.41·(1 ∓ γ)^1.39/(1 ± γ)^(1/3)·(Dw/Dpw)^0.3"
               "·Dw^1.8·Z^(−1/3)" if ball else
               "Qc = bm·0.83·552·(1 ∓ γ)^(29/27)/(1 ± γ)^(1/4)·(Dwe/Dpw)^(2/9)·Dwe^(29/27)"
               "·Lwe^(7/9)·Z^(−1/4)")
    for side, value in (("inner", q_ci), ("outer", q_ce)):
        d.add(f"Qc_{side}", value, symbol=f"Qc{side[0]}",
              label=f"basic dynamic capacity, {side} raceway", formula=formula,
              template="bm = {0}, γ = {1}, Z = {2}",
              args=(_bm(inputs), d.results["gamma"], float(inputs.z)), unit="N", source=SOURCE_LP,
              note="constants from memory")
    return q_ci, q_ce


def _pressures(inputs: InternalInputs, state: RowState,
               contacts: BallContacts | None) -> tuple[float, float, float]:
    """(pmax inner, pmax outer, slice width) of a row: Hertz at its largest element or slice load."""
    if contacts is not None:
        q_max = float(np.max(state.load))
        inner = hertz.point_contact(q_max, contacts.inner, contacts.inner_ellipse).p_max
        outer = hertz.point_contact(q_max, contacts.outer, contacts.outer_ellipse).p_max
        return inner, outer, NAN
    width = float(inputs.lwe or 0.0) / inputs.slices
    q_slice = float(np.max(state.slice_loads))
    rho_inner = hertz.roller_raceway_curvature_sum(inputs.dw, inputs.dpw, inputs.alpha_deg, inner=True)
    rho_outer = hertz.roller_raceway_curvature_sum(inputs.dw, inputs.dpw, inputs.alpha_deg, inner=False)
    return (hertz.line_contact_pressure(q_slice, width, rho_inner),
            hertz.line_contact_pressure(q_slice, width, rho_outer), width)


def _bm(inputs: InternalInputs) -> float:
    return BM_BY_KIND[inputs.kind] if inputs.bm is None else inputs.bm


def raceway_capacities(inputs: InternalInputs) -> tuple[float, float]:
    """(Qci, Qce) of one row, with ISO 281's bm (Lundberg–Palmgren; see reference_life)."""
    bm = _bm(inputs)
    if is_ball(inputs.kind):
        fi, fe = osculations(inputs)
        return (reference_life.ball_raceway_capacity(inputs.dw, inputs.dpw, inputs.alpha_deg, inputs.z,
                                                     fi, inner=True, bm=bm),
                reference_life.ball_raceway_capacity(inputs.dw, inputs.dpw, inputs.alpha_deg, inputs.z,
                                                     fe, inner=False, bm=bm))
    lwe = float(inputs.lwe or 0.0)
    return (reference_life.roller_raceway_capacity(inputs.dw, inputs.dpw, inputs.alpha_deg, inputs.z,
                                                   lwe, inner=True, bm=bm),
            reference_life.roller_raceway_capacity(inputs.dw, inputs.dpw, inputs.alpha_deg, inputs.z,
                                                   lwe, inner=False, bm=bm))


def _row_life(inputs: InternalInputs, state: RowState,
              capacities: tuple[float, float]) -> reference_life.RaceLives:
    inner_rotates = not inputs.outer_ring_rotates
    if is_ball(inputs.kind):
        return reference_life.ball_row_life(state.load, *capacities, inner_rotates=inner_rotates)
    return reference_life.roller_row_life(state.slice_loads, *capacities, inner_rotates=inner_rotates)


def _stiffness_steps(d: Derivation, eq: Equilibrium) -> None:
    k = eq.stiffness
    for key, symbol, label, index, unit in (
            ("k_radial", "kr", "radial stiffness", 0, "N/mm"),
            ("k_axial", "ka", "axial stiffness", 1, "N/mm"),
            ("k_tilt", "kθ", "tilting stiffness", 2, "N·mm/rad")):
        d.add(key, float(k[index, index]), symbol=symbol, label=label,
              formula=f"∂F/∂q at equilibrium (diagonal term {index + 1})",
              template="from the analytic Jacobian", args=(), 
              unit=unit, source=SOURCE_EQUILIBRIUM)


def _rating_steps(d: Derivation, inputs: InternalInputs,
                  contacts: BallContacts | None) -> tuple[float, float]:
    """C and C0 of the bearing (a pair: i = 2) from its geometry, ISO 281 and ISO 76."""
    rows = 2 if is_pair(inputs) else 1
    bm = _bm(inputs)
    if contacts is not None:
        c = dynamic_rating_radial_ball(rows, inputs.z, inputs.dw, inputs.alpha_deg, inputs.dpw, bm)
        if inputs.f0 is not None or inputs.kind == "deep-groove":
            c0 = static_rating_radial_ball(rows, inputs.z, inputs.dw, inputs.alpha_deg, inputs.dpw,
                                           inputs.f0)
            c0_how, c0_source = "C0r = f0·i·Z·Dw²·cos α", "ISO 76:2006 §5.1 (from memory)"
        else:
            c0 = _static_rating_by_pressure(inputs, contacts, rows)
            c0_how = "Qmax = 5·C0/(i·Z·cos α) reaches 4 200 MPa (Hertz, inner contact)"
            c0_source = SOURCE_ISO76
    else:
        lwe = float(inputs.lwe or 0.0)
        c = dynamic_rating_radial_roller(rows, inputs.z, inputs.dw, lwe, inputs.alpha_deg, inputs.dpw, bm)
        c0 = static_rating_radial_roller(rows, inputs.z, inputs.dw, lwe, inputs.alpha_deg, inputs.dpw)
        c0_how = "C0r = 44·(1 − γ)·i·Z·Lwe·Dwe·cos α"
        c0_source = "ISO 76:2006 §6.1 (from memory)"
    d.add("C", float(c), symbol="C", label="basic dynamic load rating from the geometry",
          formula="ISO 281 Cr (ball or roller formula)", template="i = {0}, Z = {1}, bm = {2}",
          args=(float(rows), float(inputs.z), bm), unit="N",
          source="ISO 281:2007 §5.1/§7.1 (from memory)")
    d.add("C0", float(c0), symbol="C0", label="basic static load rating", formula=c0_how,
          template="i = {0}, Z = {1}", args=(float(rows), float(inputs.z)), 
          unit="N", source=c0_source)
    return float(c), float(c0)


def _static_rating_by_pressure(inputs: InternalInputs, contacts: BallContacts, rows: int) -> float:
    """C0 of a ball bearing by ISO 76's definition: the load at which the most loaded ball's inner
    contact reaches 4 200 MPa, with Stribeck's Qmax = 5·C0/(i·Z·cos α).  pmax grows as Q^(1/3)."""
    probe = 1000.0
    p_probe = hertz.point_contact(probe, contacts.inner, contacts.inner_ellipse).p_max
    q0 = probe * (hertz.STATIC_REFERENCE_PRESSURE_BALL / p_probe) ** 3
    return q0 * rows * inputs.z * cosd(inputs.alpha_deg) / STRIBECK_DESIGN_CONSTANT


def _life_steps(d: Derivation, inputs: InternalInputs, rows: list[RowResult], c: float) -> None:
    ball = is_ball(inputs.kind)
    slope = reference_life.BALL_WEIBULL_SLOPE if ball else reference_life.ROLLER_WEIBULL_SLOPE
    if len(rows) > 1:
        life = reference_life.combine_lives([row.life for row in rows], slope)
        d.add("L10r", life, symbol="L10r", label="reference rating life of the pair",
              formula="(LA^(−e) + LB^(−e))^(−1/e)", template="LA = {0}, LB = {1}, e = {2}",
              args=(rows[0].life, rows[1].life, slope), unit="10⁶ rev",
              source=SOURCE_TS16281)
    else:
        life = rows[0].life  # recorded with the row (L10r)
    if inputs.speed > 0.0:
        d.add("L10rh", life_hours(life, inputs.speed), symbol="L10rh",
              label="reference rating life in hours", formula="L10r·10⁶/(60·n)",
              template="{0} × 10⁶/(60 × {1})", args=(life, inputs.speed), unit="h",
              source="ISO 281:2007 §5.3 (hours)")
    exponent = 3.0 if ball else 10.0 / 3.0
    p_ref = d.add("P_ref", reference_life.reference_load(c, life, exponent), symbol="Pref",
                  label="dynamic equivalent reference load of the bearing",
                  formula="Pref = C·L10r^(−1/p)", template="C = {0}, L10r = {1}, p = {2}",
                  args=(c, life, exponent), unit="N", source=SOURCE_TS16281,
                  note="the load that gives L10r through (C/P)^p")
    if inputs.nu is None or inputs.ec is None or inputs.speed <= 0.0:
        d.add("aISO", 1.0, symbol="aISO", label="life modification factor", formula="not evaluated",
              template="1", args=(), unit="", source="ISO 281:2007 §9.3",
              note="give ν, eC and a speed for aISO")
        return
    roller = not ball
    nu1 = reference_viscosity(inputs.speed, inputs.dpw)
    kappa = inputs.nu / nu1
    d.add("kappa", kappa, symbol="κ", label="viscosity ratio", formula="κ = ν/ν1(n, dpw)",
          template="{0}/{1}", args=(inputs.nu, nu1), unit="",
          source="ISO 281:2007 §9.3.3")
    c0 = d.results["C0"]
    cu = inputs.cu if inputs.cu is not None else fatigue_load_limit_estimate(c0, inputs.dpw, roller)
    d.add("Cu", cu, symbol="Cu", label="fatigue load limit",
          formula="given" if inputs.cu is not None else ("C0/8.2" if roller else "C0/22") + " (estimate)",
          template="{0}", args=(cu,), unit="N",
          source="input" if inputs.cu is not None else "ISO 281:2007 Annex B (estimate)")
    ratio = inputs.ec * cu / p_ref if p_ref > 0.0 else math.inf
    a = aiso(kappa_in_range(kappa), ratio, roller)
    d.add("aISO", a, symbol="aISO", label="life modification factor",
          formula="ISO 281 relation in κ and eC·Cu/Pref", template="κ = {0}, eC·Cu/Pref = {1}",
          args=(kappa, ratio), unit="", source="ISO 281:2007 §9.3.2")
    d.add("Lnmr", a * life, symbol="Lnmr", label="modified reference rating life",
          formula="aISO·L10r", template="{0} × {1}", args=(a, life), unit="10⁶ rev",
          source=SOURCE_TS16281)


def iso281_case(inputs: InternalInputs, c: float, c0: float) -> CaseInputs:
    """The catalogue-method case of the same bearing and loads (af = 1, R = 90 %)."""
    f0 = inputs.f0
    if inputs.kind == "deep-groove" and f0 is None:
        f0 = c0 / (inputs.z * inputs.dw ** 2 * cosd(inputs.alpha_deg))
    return CaseInputs(kind=inputs.kind, arrangement=inputs.arrangement, fr=inputs.fr,
                      fa=abs(inputs.fa), c=c, c0=c0, f0=f0 if inputs.kind == "deep-groove" else None,
                      contact_angle=inputs.alpha_deg, speed=inputs.speed, nu=inputs.nu,
                      ec=inputs.ec, cu=inputs.cu, dm=inputs.dpw)


def _iso281_step(d: Derivation, inputs: InternalInputs, c: float, c0: float) -> None:
    try:
        catalogue = derive(iso281_case(inputs, c, c0), keep_steps=False)
    except InputError as exc:
        d.add("L10_iso281", NAN, symbol="L10", label="basic rating life, ISO 281 (beside)",
              formula="(C/P)^p", template="not evaluated", args=(), unit="10⁶ rev",
              source="ISO 281:2007", note=f"the catalogue method refuses this case: {exc.message}")
        return
    r = catalogue.results
    note = "the moment is not part of the catalogue method" if inputs.moment else None
    d.add("P_iso281", r["P"], symbol="P", label="equivalent dynamic load, ISO 281 (beside)",
          formula="P = X·Fr + Y·Fa", template="Fr = {0}, Fa = {1}",
          args=(inputs.fr, abs(inputs.fa)), unit="N", source="ISO 281:2007 §5.2/§7.2",
          note=note)
    d.add("L10_iso281", r["L10"], symbol="L10", label="basic rating life, ISO 281 (beside)",
          formula="(C/P)^p", template="({0}/{1})^p", args=(c, r["P"]), 
          unit="10⁶ rev", source="ISO 281:2007 §5.3/§7.3")


def _pair_rule_steps(d: Derivation, inputs: InternalInputs, rows: list[RowResult], c0: float) -> None:
    """Each row's axial load by today's two-bearing rule (induced thrust Fr/(2Y) or e·Fr) with the
    rows' radial loads from the equilibrium, against the displacement-compatible loads."""
    alpha = inputs.alpha_deg
    if inputs.kind == "tapered":
        y = 0.4 / tand(alpha)
        induced = [pairs.induced_thrust_tapered(row.radial_load, y) for row in rows]
        how = "Fi = Fr/(2Y), Y = 0.4·cot α"
    else:
        try:
            e = dynamic_factors(Kind.ANGULAR_CONTACT, Arrangement.SINGLE, alpha, abs(inputs.fa),
                                c0 / 2.0, inputs.f0).e
        except InputError as exc:
            d.notes.append(f"thrust-sharing rule not compared: {exc.message}")
            return
        induced = [pairs.induced_thrust_angular_contact(row.radial_load, float(e)) for row in rows]
        how = "Fi = e·Fr (common practice)"
    mounting: pairs.Mounting = "O" if inputs.arrangement == "back-to-back" else "X"
    fa_a, fa_b, words = pairs.share_thrust(rows[0].radial_load, rows[1].radial_load, induced[0],
                                           induced[1], inputs.fa, mounting)
    for row, rule in zip(rows, (fa_a, fa_b)):
        d.add(f"Fa_rule_{row.name}", rule, symbol=f"Fa,{row.name}",
              label=f"row {row.name} axial load: rule vs equilibrium",
              formula=f"rule: {how}; equilibrium: displacement compatibility",
              template="rule {0} N, equilibrium {1} N", args=(rule, row.axial_load), 
              unit="N", source=SOURCE_PAIRS,
              note=f"difference {row.axial_load - rule:+.4g} N" + (
                  "; the rule ignores the preload"
                  if inputs.preload > 0.0 or inputs.clearance < 0.0 else ""))
    d.notes.append(words)


# ---------------------------------------------------------------------------------------------
# Life against operating clearance (the What-if plot)


@dataclass(frozen=True, slots=True)
class SweepPoint:
    """One point of :func:`clearance_sweep`: the clearance (mm), L10r (10⁶ rev; NaN where no
    equilibrium), the largest element load (N) and why a point is missing."""

    clearance: float
    life: float
    q_max: float
    note: str | None


def default_clearances(inputs: InternalInputs, count: int = 41) -> list[float]:
    """Clearances for the plot: from −2 to +6 times the most loaded element's approach under
    Stribeck's Qmax ≈ 5·F/(Z·cos α), F the larger of Fr and Fa, so that slight preload, zero
    clearance and a loose fit all show."""
    validate(inputs)
    n = hertz.POINT_CONTACT_EXPONENT if is_ball(inputs.kind) else hertz.LINE_CONTACT_EXPONENT
    stiffness = element_stiffness(inputs)
    cos_alpha = cosd(inputs.alpha_deg)
    load = 5.0 * max(abs(inputs.fr), abs(inputs.fa), 1.0) / (inputs.z * cos_alpha)
    approach = (load / stiffness) ** (1.0 / n)
    limit = 0.049 * inputs.dw
    low, high = max(-2.0 * approach, -limit), min(6.0 * approach, limit)
    return [low + (high - low) * i / (count - 1) for i in range(count)]


def clearance_sweep(inputs: InternalInputs, clearances: list[float]) -> list[SweepPoint]:
    """L10r at each operating clearance (negative: preload), the rest of ``inputs`` held; a pair's
    axial preload is replaced by the clearance.  No steps are recorded: the contact constants and
    raceway capacities are found once, then one equilibrium per point, each starting from the
    last."""
    validate(inputs)
    base = replace(inputs, preload=0.0)
    ball = is_ball(inputs.kind)
    stiffness = element_stiffness(inputs)
    capacities = raceway_capacities(inputs)
    slope = reference_life.BALL_WEIBULL_SLOPE if ball else reference_life.ROLLER_WEIBULL_SLOPE
    points = []
    previous = None
    for clearance in clearances:
        case = replace(base, clearance=clearance)
        try:
            eq = solve_equilibrium(case, stiffness=stiffness, start=previous)
        except (NoEquilibrium, InputError) as exc:
            points.append(SweepPoint(clearance, NAN, NAN, exc.message))
            previous = None
            continue
        previous = eq.displacement
        lives = [_row_life(case, state, capacities).row for state in eq.rows]
        q_max = max(float(np.max(state.load)) for state in eq.rows)
        points.append(SweepPoint(clearance, reference_life.combine_lives(lives, slope), q_max, None))
    return points
