"""Load distribution over the rolling elements: the quasi-static ring-displacement equilibrium.

The inner ring moves against the outer ring by a radial displacement δr (in the plane of Fr), an
axial displacement δa and a tilt θ (about the axis perpendicular to that plane).  Each rolling
element's elastic approach δj follows from the geometry, its load from Q = K·δ^n (n = 3/2 point
contact, 10/9 line contact: Hertz, Palmgren), and the rings are in equilibrium when the element
loads balance Fr, Fa and M.  This is the model of Jones (1960) as set out in Harris & Kotzalas,
*Rolling Bearing Analysis*, reduced to rigid rings, three degrees of freedom and no speed
effects (no centrifugal or gyroscopic ball loads: the quasi-static low-speed case that ISO/TS
16281 also uses); Stribeck's and Sjövall's load distributions are its special cases.

* **Balls** (deep-groove, angular-contact): the centres of the inner and outer groove curvatures
  are A = (fi + fe − 1)·Dw apart in the free state.  With the rings displaced they are
  s = √(sr² + sa²) apart, sr = A·cos α − Pd/2 + (δr + θ·z)·cos ψ and
  sa = A·sin α + δpre + s·(δa − θ·Ri·cos ψ); the approach is δ = s − A and the operating contact
  angle tan αj = sa/sr.  A deep-groove bearing (α = 0) contacts either groove flank: αj takes the
  sign of sa.
* **Rollers** (cylindrical, tapered): contact angle fixed at α, each roller cut into slices
  (laminae) along its length; slice k at xk takes δjk = cos α·((δr + θ·(z + xk·cos α))·cos ψ −
  Pd/2) + sin α·(δpre + s·(δa − θ·R·cos ψ)) − gk, with gk the crown's gap at that slice.  The
  roller's stiffness is shared among the slices by width, so a uniformly loaded straight roller
  follows Palmgren's relation exactly.

Here Pd is the operating diametral clearance (negative: preload), s = ±1 the direction in which
the row's contacts take axial load, z the row's axial position and δpre the axial preload
offset of a pair.  The reactions are the derivatives of the contacts' work, Fq = Σ Q·∂δ/∂q, so
the Jacobian (the bearing's tangent stiffness) is symmetric and computed analytically over all
elements at once with numpy.  Equilibrium is found by ``scipy.optimize.root`` on scaled unknowns:
Levenberg–Marquardt (MINPACK) with the analytic Jacobian, Powell's hybrid method if that stalls.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

import numpy as np

from ..num import cosd, tand
from ..record import InputError
from . import hertz

BALL_KINDS = ("deep-groove", "angular-contact")
ROLLER_KINDS = ("cylindrical", "tapered")
KINDS = (*BALL_KINDS, *ROLLER_KINDS)
PAIR_ARRANGEMENTS = ("back-to-back", "face-to-face")
ARRANGEMENTS = ("single", *PAIR_ARRANGEMENTS)
PROFILES = ("crowned", "straight")

# Raceway osculations f = groove radius/Dw when the maker gives none (common practice: inner
# grooves 0.515–0.52, outer 0.52–0.53; Harris & Kotzalas quote the same range).
DEFAULT_INNER_OSCULATION = 0.52
DEFAULT_OUTER_OSCULATION = 0.53
DEFAULT_SLICES = 30  # laminae per roller
# A crowned roller's gap at each end, as a share of Lwe, when none is given (an assumption of
# ours, of the order makers use: 14 µm on a 14 mm roller); the crown is a parabola.
DEFAULT_CROWN_DROP_RATIO = 0.001
# Hertz theory assumes the contact small against the bodies: an element approach beyond this
# share of its diameter is reported as a load beyond what the geometry can carry.
APPROACH_LIMIT_RATIO = 0.01
RESIDUAL_TOLERANCE = 1e-9  # on forces scaled by the largest load
METHODS = ("lm", "hybr")  # scipy.optimize.root methods, tried in turn


class NoEquilibrium(Exception):
    """No ring position balances the loads, with the cause in plain words and the input to look at."""

    def __init__(self, field_name: str, message: str) -> None:
        super().__init__(f"{field_name}: {message}")
        self.field = field_name
        self.message = message


@dataclass(frozen=True, slots=True)
class InternalInputs:
    """One bearing's internal geometry, fit and loads (N, mm, N·mm, r/min, degrees).

    ``kind`` deep-groove, angular-contact, cylindrical or tapered; ``arrangement`` single,
    back-to-back or face-to-face (pairs of angular-contact or tapered rows); ``z`` elements per
    row; ``dw`` ball diameter Dw or roller diameter Dwe; ``dpw`` pitch diameter; ``alpha_deg``
    nominal contact angle; ``lwe`` roller length; ``clearance`` operating diametral clearance
    (negative: preload); ``preload`` axial preload of a pair; ``moment`` a tilting moment M (the tilt θ is then
    solved) or ``None``: the rings are then held at the misalignment ``tilt`` (rad, default 0, as
    a shaft and its other bearing hold them) and the moment they carry is a result;
    ``fi``/``fe`` raceway osculations (balls); ``profile`` and ``crown_drop`` the roller profile;
    ``row_spacing`` the distance between a pair's row centres; ``outer_ring_rotates`` which ring
    turns against the load (the inner ring by default).  Lubrication for aISO: ``nu``
    (operating viscosity, mm²/s), ``ec`` (contamination factor eC), ``cu`` (fatigue load limit).
    ``bm`` and ``f0`` as in ``workbench rate``.
    """

    kind: str
    z: int
    dw: float
    dpw: float
    alpha_deg: float = 0.0
    lwe: float | None = None
    arrangement: str = "single"
    clearance: float = 0.0
    preload: float = 0.0
    fr: float = 0.0
    fa: float = 0.0
    moment: float | None = None
    tilt: float = 0.0
    speed: float = 0.0
    fi: float | None = None
    fe: float | None = None
    profile: str = "crowned"
    crown_drop: float | None = None
    slices: int = DEFAULT_SLICES
    row_spacing: float | None = None
    outer_ring_rotates: bool = False
    nu: float | None = None
    ec: float | None = None
    cu: float | None = None
    bm: float | None = None
    f0: float | None = None


def is_ball(kind: str) -> bool:
    """True for the ball kinds (point contact)."""
    return kind in BALL_KINDS


def is_pair(inputs: InternalInputs) -> bool:
    """True for a back-to-back or face-to-face pair of rows."""
    return inputs.arrangement in PAIR_ARRANGEMENTS


def default_row_spacing(inputs: InternalInputs) -> float:
    """Row-centre distance of a pair when none is given: 2·Dw for ball rows, Lwe + Dwe for
    tapered rows (an assumption of ours, about two bearing widths' worth; give the drawing's)."""
    if is_ball(inputs.kind):
        return 2.0 * inputs.dw
    return float(inputs.lwe or 0.0) + inputs.dw


def crown_drop(inputs: InternalInputs) -> float:
    """The roller's gap at each end (mm): 0 straight, given, or DEFAULT_CROWN_DROP_RATIO·Lwe."""
    if inputs.profile == "straight":
        return 0.0
    if inputs.crown_drop is not None:
        return inputs.crown_drop
    return DEFAULT_CROWN_DROP_RATIO * float(inputs.lwe or 0.0)


def _finite(name: str, value: float, *, low: float | None = None, low_open: bool = False,
            high: float | None = None, words: str = "") -> None:
    if isinstance(value, bool) or not isinstance(value, (int, float)) or not math.isfinite(value):
        raise InputError(name, f"{words or 'must be'} a finite number")
    if low is not None and (value < low or (low_open and value == low)):
        raise InputError(name, f"must be {'above' if low_open else 'at least'} {low:g}")
    if high is not None and value > high:
        raise InputError(name, f"must be at most {high:g}")


def validate(inputs: InternalInputs) -> None:
    """Refuse inputs the model cannot take, naming the input (InputError)."""
    if inputs.kind not in KINDS:
        raise InputError("kind", f"the internal analysis covers {', '.join(KINDS)}, not {inputs.kind!r}")
    if inputs.arrangement not in ARRANGEMENTS:
        raise InputError("arrangement", f"use one of {', '.join(ARRANGEMENTS)}")
    if is_pair(inputs) and inputs.kind not in ("angular-contact", "tapered"):
        raise InputError("arrangement", "pairs are angular-contact or tapered rows")
    if isinstance(inputs.z, bool) or not isinstance(inputs.z, int) or inputs.z < 3:
        raise InputError("z", "needs a whole number of at least 3 rolling elements")
    _finite("dw", inputs.dw, low=0.0, low_open=True)
    _finite("dpw", inputs.dpw, low=0.0, low_open=True)
    if inputs.dw >= inputs.dpw:
        raise InputError("dw", "the rolling-element diameter must be smaller than the pitch diameter")
    if inputs.z * inputs.dw > math.pi * inputs.dpw:
        raise InputError("z", f"{inputs.z} elements of {inputs.dw:g} mm do not fit on a "
                              f"{inputs.dpw:g} mm pitch circle")
    _finite("alpha_deg", inputs.alpha_deg, low=0.0, high=45.0)
    if inputs.kind == "cylindrical" and inputs.alpha_deg != 0.0:
        raise InputError("alpha_deg", "a cylindrical roller bearing has α = 0°")
    if inputs.kind in ("angular-contact", "tapered") and inputs.alpha_deg <= 0.0:
        raise InputError("alpha_deg", f"a {inputs.kind} bearing needs a contact angle above 0°")
    if is_ball(inputs.kind):
        if inputs.lwe is not None:
            raise InputError("lwe", "a ball bearing has no roller length Lwe")
        for name, value in (("fi", inputs.fi), ("fe", inputs.fe)):
            if value is not None:
                _finite(name, value, low=0.5, low_open=True, high=0.6)
    else:
        if inputs.lwe is None:
            raise InputError("lwe", "a roller bearing needs the effective roller length Lwe")
        _finite("lwe", inputs.lwe, low=0.0, low_open=True)
        if inputs.profile not in PROFILES:
            raise InputError("profile", f"use {' or '.join(PROFILES)}")
        if inputs.crown_drop is not None:
            _finite("crown_drop", inputs.crown_drop, low=0.0)
        slices = inputs.slices
        if isinstance(slices, bool) or not isinstance(slices, int) or not 1 <= slices <= 200:
            raise InputError("slices", "use 1 to 200 slices")
    _finite("clearance", inputs.clearance)
    if abs(inputs.clearance) >= 0.05 * inputs.dw:
        raise InputError("clearance", "an operating clearance of more than 5 % of the element "
                                      "diameter is outside this model")
    _finite("preload", inputs.preload, low=0.0)
    if inputs.preload > 0.0 and not is_pair(inputs):
        raise InputError("preload", "an axial preload applies to a back-to-back or face-to-face pair; "
                                    "give a single bearing a negative clearance instead")
    if inputs.preload > 0.0 and inputs.clearance != 0.0:
        raise InputError("preload", "give either the clearance or the axial preload, not both")
    for name in ("fr", "fa", "tilt"):
        _finite(name, getattr(inputs, name))
    if inputs.moment is not None:
        _finite("moment", inputs.moment)
        if inputs.tilt != 0.0:
            raise InputError("tilt", "give either the moment or the tilt, not both")
    if abs(inputs.tilt) > 0.01:
        raise InputError("tilt", "a misalignment above 0.01 rad is outside this model")
    _finite("fr", inputs.fr, low=0.0)
    _finite("speed", inputs.speed, low=0.0)
    if inputs.row_spacing is not None:
        _finite("row_spacing", inputs.row_spacing, low=0.0, low_open=True)
    for name in ("nu", "cu", "bm", "f0"):
        value = getattr(inputs, name)
        if value is not None:
            _finite(name, value, low=0.0, low_open=True)
    if inputs.ec is not None:
        _finite("ec", inputs.ec, low=0.0, high=1.0)


# ---------------------------------------------------------------------------------------------
# Contact constants


@dataclass(frozen=True, slots=True)
class BallContacts:
    """Hertz constants of a ball row at its nominal contact angle (Harris & Kotzalas)."""

    inner: hertz.Curvature
    outer: hertz.Curvature
    inner_ellipse: hertz.Ellipse
    outer_ellipse: hertz.Ellipse
    k_inner: float
    k_outer: float
    k_element: float  # both contacts in series, Q = K·δ^1.5


def osculations(inputs: InternalInputs) -> tuple[float, float]:
    """(fi, fe): given, or the documented defaults 0.52 and 0.53."""
    return (DEFAULT_INNER_OSCULATION if inputs.fi is None else inputs.fi,
            DEFAULT_OUTER_OSCULATION if inputs.fe is None else inputs.fe)


def ball_contacts(inputs: InternalInputs) -> BallContacts:
    """Curvatures, ellipses and load–deflection constants of the inner and outer contacts."""
    fi, fe = osculations(inputs)
    inner = hertz.ball_raceway_curvature(inputs.dw, inputs.dpw, inputs.alpha_deg, fi, inner=True)
    outer = hertz.ball_raceway_curvature(inputs.dw, inputs.dpw, inputs.alpha_deg, fe, inner=False)
    inner_ellipse = hertz.ellipse_of(inner.curvature_difference)
    outer_ellipse = hertz.ellipse_of(outer.curvature_difference)
    k_inner = hertz.point_contact_constant(inner, inner_ellipse)
    k_outer = hertz.point_contact_constant(outer, outer_ellipse)
    k_element = hertz.series_constant(k_inner, k_outer, hertz.POINT_CONTACT_EXPONENT)
    return BallContacts(inner, outer, inner_ellipse, outer_ellipse, k_inner, k_outer, k_element)


def roller_constant(lwe: float) -> float:
    """Q = K·δ^(10/9) of one roller between both raceways: Palmgren's line contact twice in series."""
    single = hertz.line_contact_constant(lwe)
    return hertz.series_constant(single, single, hertz.LINE_CONTACT_EXPONENT)


# ---------------------------------------------------------------------------------------------
# Rows: the approach of every contact as a function of the ring displacements q = (δr, δa, θ)


class Row:
    """One row of elements: approaches, loads and their derivatives over all its contacts.

    A ball row has one contact per element; a roller row one per slice (Z × slices), summed per
    roller for the element loads.
    """

    def __init__(self, inputs: InternalInputs, *, direction: float, position: float,
                 preload_offset: float, stiffness: float) -> None:
        self.inputs = inputs
        self.direction = direction
        self.position = position
        self.preload_offset = preload_offset
        self.stiffness = stiffness
        self.ball = is_ball(inputs.kind)
        self.exponent = hertz.POINT_CONTACT_EXPONENT if self.ball else hertz.LINE_CONTACT_EXPONENT
        z = inputs.z
        self.azimuth = np.arange(z) * (2.0 * math.pi / z)
        cos_psi = np.cos(self.azimuth)
        alpha = math.radians(inputs.alpha_deg)
        pd = inputs.clearance
        if self.ball:
            fi, fe = osculations(inputs)
            self.free_distance = (fi + fe - 1.0) * inputs.dw
            locus = 0.5 * inputs.dpw + (fi - 0.5) * inputs.dw * math.cos(alpha)
            zeros = np.zeros(z)
            self.radial0 = np.full(z, self.free_distance * math.cos(alpha) - 0.5 * pd)
            self.axial0 = np.full(z, self.free_distance * math.sin(alpha) + preload_offset)
            self.radial_map = np.column_stack((cos_psi, zeros, position * cos_psi))
            self.axial_map = np.column_stack((zeros, np.full(z, direction),
                                              -direction * locus * cos_psi))
            self.slice_share = 1.0
        else:
            lwe = float(inputs.lwe or 0.0)
            n = inputs.slices
            width = lwe / n
            x = (np.arange(n) + 0.5) * width - 0.5 * lwe
            gap = crown_drop(inputs) * (2.0 * x / lwe) ** 2
            ca, sa = math.cos(alpha), math.sin(alpha)
            radius = 0.5 * inputs.dpw
            cos_grid = np.repeat(cos_psi, n)
            x_grid = np.tile(x, z)
            self.base = -0.5 * pd * ca + preload_offset * sa - np.tile(gap, z)
            self.gradient = np.column_stack((
                ca * cos_grid,
                np.full(z * n, direction * sa),
                ca * cos_grid * (position + x_grid * ca) - direction * sa * radius * cos_grid))
            self.slice_share = 1.0 / n
            self.slices = n
            self.slice_width = width

    def approach(self, q: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        """(δ, ∂δ/∂q) of every contact; δ may be negative (no contact)."""
        if self.ball:
            sr = self.radial0 + self.radial_map @ q
            sa = self.axial0 + self.axial_map @ q
            s = np.hypot(sr, sa)
            gradient = (sr[:, None] * self.radial_map + sa[:, None] * self.axial_map) / s[:, None]
            return s - self.free_distance, gradient
        return self.base + self.gradient @ q, self.gradient

    def reactions(self, q: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        """(F, ∂F/∂q): the row's generalised reactions Σ Q·∂δ/∂q and their Jacobian
        Σ (dQ/dδ)·∇δ ∇δᵀ + Q·∇²δ (the second term for balls only: rollers' δ is linear in q)."""
        k = self.stiffness * self.slice_share
        n = self.exponent
        if self.ball:
            sr = self.radial0 + self.radial_map @ q
            sa = self.axial0 + self.axial_map @ q
            s = np.hypot(sr, sa)
            gradient = (sr[:, None] * self.radial_map + sa[:, None] * self.axial_map) / s[:, None]
            positive = np.maximum(s - self.free_distance, 0.0)
            root = np.sqrt(positive)
            load = k * positive * root
            weight = load / s
            # ∇²s = (Drᵀ Dr + Daᵀ Da − ∇s ∇sᵀ)/s per contact
            jacobian = ((gradient * (1.5 * k * root - weight)[:, None]).T @ gradient
                        + (self.radial_map * weight[:, None]).T @ self.radial_map
                        + (self.axial_map * weight[:, None]).T @ self.axial_map)
            return load @ gradient, jacobian
        positive = np.maximum(self.base + self.gradient @ q, 0.0)
        load = k * positive ** n
        slope = n * k * positive ** (n - 1.0)
        return load @ self.gradient, (self.gradient * slope[:, None]).T @ self.gradient

    def axial_reaction(self, offset: float) -> float:
        """The row's axial reaction with the rings centred and pushed together axially by
        ``offset`` (every element alike): Z·Q·sin αj over one element's contacts."""
        k = self.stiffness * self.slice_share
        if self.ball:
            sr = float(self.radial0[0])
            sa = float(self.axial0[0]) + offset
            s = math.hypot(sr, sa)
            delta = max(s - self.free_distance, 0.0)
            reaction: float = self.inputs.z * k * delta ** 1.5 * sa / s
            return reaction
        sin_a = float(self.gradient[0, 1])
        per_slice = np.maximum(self.base[:self.slices] + sin_a * offset, 0.0) ** self.exponent
        return self.inputs.z * k * float(np.sum(per_slice)) * sin_a

    def state(self, q: np.ndarray) -> RowState:
        """Element loads, contact angles, approaches and the slice loads at ``q``."""
        delta, _ = self.approach(q)
        k = self.stiffness * self.slice_share
        contact_load = k * np.maximum(delta, 0.0) ** self.exponent
        z = self.inputs.z
        if self.ball:
            sr = self.radial0 + self.radial_map @ q
            sa = self.axial0 + self.axial_map @ q
            angle = np.degrees(np.arctan2(sa, sr))
            return RowState(self.azimuth, contact_load, angle, delta, contact_load.reshape(z, 1),
                            self.direction)
        slices = contact_load.reshape(z, self.slices)
        return RowState(self.azimuth, slices.sum(axis=1), np.full(z, self.inputs.alpha_deg),
                        delta.reshape(z, self.slices).max(axis=1), slices, self.direction)


@dataclass(frozen=True, slots=True)
class RowState:
    """One row at equilibrium: per element its azimuth ψ (rad), load Q (N), contact angle (°),
    approach δ (mm, a roller's largest over its slices; negative where the element is free), and
    the slice loads (Z × slices; one column for balls); ``direction`` the way the row takes
    thrust (+1: the inner ring pushed toward row B)."""

    azimuth: np.ndarray
    load: np.ndarray
    contact_angle_deg: np.ndarray
    approach: np.ndarray
    slice_loads: np.ndarray
    direction: float


def element_stiffness(inputs: InternalInputs) -> float:
    """K of one element between both raceways (N/mm^n)."""
    if is_ball(inputs.kind):
        return ball_contacts(inputs).k_element
    return roller_constant(float(inputs.lwe or 0.0))


def make_rows(inputs: InternalInputs, stiffness: float, preload_offset: float = 0.0) -> list[Row]:
    """The rows of a single bearing, or the two rows of a pair (row A at −L/2, row B at +L/2).

    Back-to-back: row A takes thrust pushing the inner ring toward B (+), row B the other way;
    face-to-face the reverse (the geometry of :mod:`workbench.engine.pairs`).
    """
    if not is_pair(inputs):
        return [Row(inputs, direction=1.0, position=0.0, preload_offset=0.0, stiffness=stiffness)]
    spacing = inputs.row_spacing if inputs.row_spacing is not None else default_row_spacing(inputs)
    sign_a = 1.0 if inputs.arrangement == "back-to-back" else -1.0
    return [Row(inputs, direction=sign_a, position=-0.5 * spacing, preload_offset=preload_offset,
                stiffness=stiffness),
            Row(inputs, direction=-sign_a, position=0.5 * spacing, preload_offset=preload_offset,
                stiffness=stiffness)]


def _total(rows: list[Row], q: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    force, jacobian = rows[0].reactions(q)
    for row in rows[1:]:
        f, j = row.reactions(q)
        force = force + f
        jacobian = jacobian + j
    return force, jacobian


def preload_offset(inputs: InternalInputs, stiffness: float) -> float:
    """The axial interference δpre (mm) at which one row of a pair carries the axial preload alone
    (rings centred, no external load), found by Brent's method on the row's axial reaction."""
    from scipy.optimize import brentq

    if inputs.preload <= 0.0:
        return 0.0
    row = Row(replace(inputs, arrangement="single"), direction=1.0, position=0.0,
              preload_offset=0.0, stiffness=stiffness)
    high = 1e-3 * inputs.dw
    while row.axial_reaction(high) < inputs.preload:
        high *= 2.0
        if high > APPROACH_LIMIT_RATIO * inputs.dw * 10.0:
            raise NoEquilibrium("preload", "the axial preload is beyond what the geometry can carry")
    offset: float = brentq(lambda offset: row.axial_reaction(offset) - inputs.preload, 0.0, high,
                           xtol=1e-12 * inputs.dw, rtol=1e-12)
    return offset


@dataclass(frozen=True, slots=True)
class Equilibrium:
    """The solved ring displacements and what follows from them.

    ``displacement`` (δr mm, δa mm, θ rad); ``reactions`` (Fr N, Fa N, M N·mm) the rings carry
    there (M is a result when the tilt was held); ``stiffness`` the tangent stiffness matrix ∂F/∂q
    (N/mm, N, N·mm/rad) at that point; ``rows`` each row's state; ``evaluations`` of the residual;
    ``residual`` the largest scaled force error; ``preload_offset`` δpre of a pair;
    ``row_reactions`` each row's (Fr, Fa, M) in the same axes.
    """

    displacement: np.ndarray
    reactions: np.ndarray
    stiffness: np.ndarray
    rows: list[RowState]
    evaluations: int
    residual: float
    method: str
    preload_offset: float
    row_reactions: list[np.ndarray]


def _refuse_impossible(inputs: InternalInputs) -> None:
    """The load cases with no equilibrium that the inputs show before solving."""
    moment = inputs.moment or 0.0
    load_free = inputs.fr == 0.0 and moment == 0.0
    if inputs.kind == "cylindrical" and load_free and inputs.fa != 0.0:
        raise NoEquilibrium("fa", "pure thrust on a cylindrical roller bearing: its raceways "
                                  "(α = 0°) carry no axial load, only its ribs do, and they are "
                                  "outside this analysis")
    if inputs.fr == 0.0 and inputs.fa == 0.0 and moment == 0.0 and inputs.preload == 0.0 \
            and inputs.clearance >= 0.0 and inputs.tilt == 0.0:
        raise InputError("fr", "no load: give Fr, Fa or a moment (or a preload)")
    if not is_pair(inputs) and inputs.kind in ("angular-contact", "tapered"):
        if inputs.fa < 0.0:
            raise NoEquilibrium("fa", f"a single {inputs.kind} row carries axial load in one "
                                      "direction only (Fa > 0); the reverse needs a second bearing")
        if inputs.fa == 0.0 and (inputs.fr > 0.0 or moment != 0.0 or inputs.tilt != 0.0):
            raise NoEquilibrium("fa", f"a single {inputs.kind} row under radial load needs an axial "
                                      "load to hold its contact angle (its own induced thrust); "
                                      "give Fa, or analyse the pair")
    if inputs.kind == "tapered" and not is_pair(inputs) and inputs.fr > 0.0:
        induced = inputs.fr * tand(inputs.alpha_deg)
        if inputs.fa < induced and moment == 0.0 and inputs.tilt == 0.0:
            raise NoEquilibrium("fa", f"Fa = {inputs.fa:.4g} N is below Fr·tan α = {induced:.4g} N: "
                                      "a single tapered row cannot balance its own induced thrust "
                                      "(Sjövall: Fa/(Fr·tan α) ≥ 1); the load is beyond the "
                                      "geometry; pair it with an opposed bearing")


def solve_equilibrium(inputs: InternalInputs, *, stiffness: float | None = None,
                      start: np.ndarray | None = None, continuation: bool = True) -> Equilibrium:
    """Ring displacements balancing Fr, Fa and M (and a pair's preload), by scipy.optimize.root.

    The unknowns are δr, δa (not for a cylindrical bearing: α = 0 gives it no axial stiffness)
    and θ when a moment is given; otherwise θ is held at the given misalignment and the moment
    the rings carry is a result.  Unknowns are scaled by an element's approach under the mean
    load, forces by the largest load.  Levenberg–Marquardt with the analytic Jacobian first (fewer
    evaluations than Powell's hybrid method on these cases), the hybrid method if it stalls, both
    from ``start`` (a neighbouring solution, as a sweep
    passes) or Stribeck's estimate.  When a given moment defeats both, the moment is reached in
    steps from the one the rings carry untilted (``continuation``), each step starting from the
    last.  :class:`NoEquilibrium`
    names the cause when no position balances the loads.
    """
    from scipy.optimize import root

    validate(inputs)
    _refuse_impossible(inputs)
    k = element_stiffness(inputs) if stiffness is None else stiffness
    offset = preload_offset(inputs, k)
    rows = make_rows(inputs, k, offset)
    n = rows[0].exponent
    radius = 0.5 * inputs.dpw
    moment = inputs.moment or 0.0
    target = np.array([inputs.fr, inputs.fa, moment])
    force_scale = max(abs(inputs.fr), abs(inputs.fa), abs(moment) / radius, inputs.preload, 1.0)
    length_scale = (force_scale / (inputs.z * k)) ** (1.0 / n) + 0.5 * abs(inputs.clearance)
    scale = np.array([length_scale, length_scale, length_scale / radius])
    active = np.array([True, inputs.kind != "cylindrical", inputs.moment is not None])
    denominators = np.array([force_scale, force_scale, force_scale * radius])
    fixed = np.array([0.0, 0.0, inputs.tilt])
    cross = np.ix_(active, active)
    jacobian_scale = scale[None, :] / denominators[:, None]
    free_scale = scale[active]

    def displacement(x: np.ndarray) -> np.ndarray:
        q = fixed.copy()
        q[active] = x * free_scale
        return q

    def residual(x: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        force, jacobian = _total(rows, displacement(x))
        return ((force - target) / denominators)[active], (jacobian * jacobian_scale)[cross]

    guesses = [_first_guess(inputs, k, n)]
    if start is not None:
        guesses.insert(0, np.asarray(start, dtype=float))
    if inputs.moment:
        guesses.append(np.array([guesses[-1][0], guesses[-1][1], inputs.tilt]))
    evaluations = 0
    best: tuple[float, np.ndarray, str] | None = None
    for guess in guesses:
        initial = _in_contact(rows, guess, active) / scale
        for method in METHODS:
            solution = root(residual, initial[active], jac=True, method=method,
                            options={"xtol": 1e-11})
            evaluations += int(solution.get("nfev", 0))
            error = float(np.max(np.abs(residual(solution.x)[0])))
            if best is None or error < best[0]:
                best = (error, solution.x, method)
            if error < RESIDUAL_TOLERANCE:
                break
        if best is not None and best[0] < RESIDUAL_TOLERANCE:
            break
    assert best is not None
    error, x, method = best
    if error >= RESIDUAL_TOLERANCE:
        cause = NoEquilibrium("moment" if inputs.moment else "fr", _unbalanced_cause(inputs, error))
        if continuation and inputs.moment is not None:
            return _moment_in_steps(inputs, k, cause)
        raise cause
    q = displacement(x)
    states = [row.state(q) for row in rows]
    _check_result(inputs, states)
    per_row = [row.reactions(q) for row in rows]
    force = sum(f for f, _ in per_row)
    jacobian = sum(j for _, j in per_row)
    assert isinstance(force, np.ndarray) and isinstance(jacobian, np.ndarray)  # rows is not empty
    return Equilibrium(q, force, jacobian, states, evaluations, error, method, offset,
                       [f for f, _ in per_row])


def _moment_in_steps(inputs: InternalInputs, stiffness: float, cause: NoEquilibrium,
                     steps: int = 8) -> Equilibrium:
    """Continuation in the moment: from the untilted rings' own moment M0 to M in ``steps``;
    ``cause`` is raised if the untilted rings have no equilibrium to start from."""
    try:
        held = solve_equilibrium(replace(inputs, moment=None), stiffness=stiffness,
                                 continuation=False)
    except (NoEquilibrium, InputError):
        raise cause from None
    carried = float(held.reactions[2])
    target = float(inputs.moment or 0.0)
    result, evaluations = held, held.evaluations
    for step in range(1, steps + 1):
        moment = carried + (target - carried) * step / steps
        result = solve_equilibrium(replace(inputs, moment=moment), stiffness=stiffness,
                                   start=result.displacement, continuation=False)
        evaluations += result.evaluations
    return replace(result, evaluations=evaluations, method=f"{result.method}, moment in steps")


def _in_contact(rows: list[Row], guess: np.ndarray, active: np.ndarray) -> np.ndarray:
    """``guess`` with its free displacements grown by half again until some element is in
    contact (a start with none gives the solver a zero Jacobian), at most 40 times."""
    q = guess.copy()
    for _ in range(40):
        if any(np.any(row.approach(q)[0] > 0.0) for row in rows):
            break
        q[active] *= 1.5
    return q


def _unbalanced_cause(inputs: InternalInputs, error: float) -> str:
    """Words for a load no position balances, naming the likely cause."""
    words = (f"no ring position balances these loads (the solver's best leaves {error:.1e} of the "
             "load unbalanced)")
    if inputs.moment and not is_pair(inputs):
        return words + ": the moment is likely too large for a single row under these loads"
    return words


def _first_guess(inputs: InternalInputs, k: float, n: float) -> np.ndarray:
    """Start: Stribeck's Qmax ≈ 5·Fr/(Z·cos α) for δr, an equal share Fa/(Z·sin α) for δa (after
    the axial play of a ball bearing with clearance), a tilt of the same order for a moment."""
    alpha = math.radians(inputs.alpha_deg)
    guess = np.array([0.0, 0.0, inputs.tilt])
    pd = inputs.clearance
    cos_a = max(math.cos(alpha), 0.1)
    radius = 0.5 * inputs.dpw
    q_radial = 5.0 * abs(inputs.fr) / (inputs.z * cos_a)
    guess[0] = (q_radial / k) ** (1.0 / n) / cos_a + 0.5 * max(pd, 0.0)
    if inputs.kind != "cylindrical" and inputs.fa != 0.0:
        sin_a = max(math.sin(alpha), 0.1)
        q_axial = abs(inputs.fa) / (inputs.z * sin_a)
        guess[1] = math.copysign((q_axial / k) ** (1.0 / n) / sin_a, inputs.fa)
        if not is_ball(inputs.kind) and pd > 0.0:  # a roller row's axial play first
            guess[1] += math.copysign(0.5 * pd * math.cos(alpha) / sin_a, inputs.fa)
        if is_ball(inputs.kind) and pd > 0.0:  # the free contact angle's axial play first
            fi, fe = osculations(inputs)
            a = (fi + fe - 1.0) * inputs.dw
            guess[1] += math.copysign(math.sqrt(max(a * a - (a - 0.5 * pd) ** 2, 0.0)), inputs.fa)
    if inputs.moment:
        q_moment = 4.0 * abs(inputs.moment) / (inputs.z * radius)
        guess[2] = math.copysign((q_moment / k) ** (1.0 / n) + 0.5 * max(pd, 0.0),
                                 inputs.moment) / radius
    return guess


def _check_result(inputs: InternalInputs, states: list[RowState]) -> None:
    """Refuse a solution outside the model's own assumptions."""
    largest = max(float(np.max(state.approach)) for state in states)
    if largest > APPROACH_LIMIT_RATIO * inputs.dw:
        raise NoEquilibrium("fr", f"the load is beyond what the geometry can carry: the most "
                                  f"loaded element would be compressed by {largest:.3g} mm, more "
                                  f"than {APPROACH_LIMIT_RATIO:.0%} of its diameter, where Hertz "
                                  "theory no longer holds")
    if inputs.kind == "angular-contact":
        for state in states:
            if np.any((state.load > 0.0) & (state.contact_angle_deg < 0.0)):
                raise NoEquilibrium("fa", "the load would carry balls over to the low shoulder "
                                          "(negative contact angle): the axial load is too small "
                                          "for the radial load and moment on this row")


# ---------------------------------------------------------------------------------------------
# Load zone and the classic distributions


@dataclass(frozen=True, slots=True)
class LoadZone:
    """Sjövall's load-zone parameter ε and the loaded half-angle ψl (degrees) of one row."""

    epsilon: float
    half_angle_deg: float


def load_zone(state: RowState) -> LoadZone:
    """ε and ψl from the elements' approaches, δψ = δ0 + δ1·cos ψ (the first two terms of their
    Fourier series, exact for a rigid ring with no tilt): ε = (δ0 + δ1)/(2δ1), the share of the
    diameter under load (Sjövall; Harris & Kotzalas), ψl = arccos(−δ0/δ1).  All loaded with no
    variation: ε = ∞, ψl = 180°."""
    z = len(state.azimuth)
    cos_psi = np.cos(state.azimuth)
    mean = float(np.mean(state.approach))
    first = float(2.0 / z * np.dot(state.approach, cos_psi))
    if first <= 1e-9 * abs(mean) or first <= 0.0:
        return LoadZone(math.inf if mean > 0.0 else 0.0, 180.0 if mean > 0.0 else 0.0)
    epsilon = (mean + first) / (2.0 * first)
    ratio = -mean / first
    if ratio <= -1.0:
        return LoadZone(epsilon, 180.0)
    if ratio >= 1.0:
        return LoadZone(max(epsilon, 0.0), 0.0)
    return LoadZone(epsilon, math.degrees(math.acos(ratio)))


def sjovall_integrals(epsilon: float, exponent: float) -> tuple[float, float]:
    """Sjövall's integrals (Jr(ε), Ja(ε)) by scipy.integrate.quad from their definitions:
    Jr = (1/2π)∫ [1 − (1 − cos ψ)/(2ε)]^n cos ψ dψ, Ja = (1/2π)∫ [1 − (1 − cos ψ)/(2ε)]^n dψ,
    over the loaded arc −ψl…ψl with cos ψl = 1 − 2ε (the whole circle for ε ≥ 1)."""
    from scipy.integrate import quad

    limit = math.pi if epsilon >= 1.0 else math.acos(1.0 - 2.0 * epsilon)

    def shape(psi: float) -> float:
        share: float = max(1.0 - (1.0 - math.cos(psi)) / (2.0 * epsilon), 0.0) ** exponent
        return share

    radial = quad(lambda p: shape(p) * math.cos(p), -limit, limit, epsabs=1e-13, epsrel=1e-12)[0]
    axial = quad(shape, -limit, limit, epsabs=1e-13, epsrel=1e-12)[0]
    return radial / (2.0 * math.pi), axial / (2.0 * math.pi)


def stribeck_q_max(fr: float, z: int, exponent: float, *, alpha_deg: float = 0.0) -> float:
    """Largest element load at zero clearance under pure radial load, rigid rings (Stribeck):
    Qmax = Fr/(cos α·Σj cos^(n+1) ψj) over the elements within ±90° of the load."""
    psi = np.arange(z) * (2.0 * math.pi / z)
    cos_psi = np.cos(psi)
    loaded = cos_psi > 1e-12
    return fr / (cosd(alpha_deg) * float(np.sum(cos_psi[loaded] ** (exponent + 1.0))))
