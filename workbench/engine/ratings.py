"""Basic load ratings from a bearing's internal geometry (ISO 281:2007 dynamic, ISO 76:2006 static).

Inputs are in mm and degrees, ratings in N.  Every function takes floats or numpy arrays alike
(:data:`~workbench.engine.num.NumT`); the results of ``**`` are named with their type, which
typeshed leaves Any for a float.
The stand-alone functions refuse a geometry ratio outside the standard's table (no silent clamping,
no extrapolation); :func:`rate_bearing` instead clamps to the table end and says so in the step.

Formula provenance follows ``/work/shared/REFERENCE.md`` §6: the radial ball, radial roller and
static formulas are from that sheet; the thrust dynamic formulas (α = 90°) and the thrust-roller fc
table are **from memory**.  Clause and table numbers of both standards are given from memory too.

Refused rather than guessed (``InputError``): self-aligning ball bearings, double-row deep-groove
ball bearings, thrust bearings with α ≠ 90° (dynamic), multi-row thrust bearings, and static ratings
of angular-contact and thrust ball bearings unless f0 is supplied.
"""

from __future__ import annotations

from dataclasses import dataclass

from workbench.engine import rating_tables as tables
from workbench.engine.num import NumT, all_true, as_number, cosd, interp, isfinite, sind, where
from workbench.engine.record import Derivation, InputError, fmt
from workbench.engine.rating_tables import RatingTable

_TABLE_END_TOLERANCE = 1e-9


# ---------------------------------------------------------------------------------------------
# Input checks (float or array)


def _as_number(field: str, value: NumT) -> NumT:
    """``value`` as a float or a float array; anything else is refused."""
    try:
        return as_number(value)
    except (TypeError, ValueError):
        raise InputError(field, f"expected a number, got {value!r}") from None


def _positive(field: str, value: NumT, label: str) -> NumT:
    """A finite value above zero (a diameter, a length, a factor)."""
    number = _as_number(field, value)
    if not all_true(isfinite(number) & (number > 0)):
        raise InputError(field, f"{label} must be a finite number above zero")
    return number


def _count(field: str, value: NumT, label: str) -> NumT:
    """A whole number of at least one (rows, rolling elements)."""
    number = _as_number(field, value)
    if not all_true(isfinite(number)):
        raise InputError(field, f"{label} must be a finite whole number")
    if not all_true(number >= 1):
        raise InputError(field, f"{label} must be at least 1")
    if not all_true(number % 1.0 == 0.0):
        raise InputError(field, f"{label} must be a whole number")
    return number


def _radial_angle(value: NumT) -> NumT:
    """Nominal contact angle of a radial bearing: 0° ≤ α ≤ 45° (ISO 281:2007 §3, from memory)."""
    angle = _as_number("alpha_deg", value)
    if not all_true(isfinite(angle) & (angle >= 0) & (angle <= 45)):
        raise InputError("alpha_deg", "a radial bearing has a contact angle from 0° to 45°")
    return angle


def _thrust_angle(value: NumT) -> NumT:
    """Nominal contact angle of a thrust bearing: 45° < α ≤ 90° (ISO 281:2007 §3, from memory)."""
    angle = _as_number("alpha_deg", value)
    if not all_true(isfinite(angle) & (angle > 45) & (angle <= 90)):
        raise InputError("alpha_deg", "a thrust bearing has a contact angle above 45° and up to 90°")
    return angle


def _right_angle(value: NumT) -> NumT:
    """α = 90°: the only thrust contact angle whose dynamic fc column is carried here."""
    angle = _thrust_angle(value)
    if not all_true(angle == 90):
        raise InputError(
            "alpha_deg",
            "dynamic thrust ratings are only available for α = 90°: the ISO 281 fc columns for "
            "other angles are not tabulated here",
        )
    return angle


def _within_pitch_circle(dw: NumT, dpw: NumT) -> None:
    """The rolling element must be smaller than the pitch diameter."""
    if not all_true(dw - dpw < 0):
        raise InputError("dw", "the rolling-element diameter must be smaller than the pitch diameter Dpw")


# ---------------------------------------------------------------------------------------------
# Table look-up


def table_factor(table: RatingTable, ratio: NumT, field: str = "dw") -> NumT:
    """``table`` read at ``ratio`` by linear interpolation; a ratio outside the table is refused.

    ``field`` names the input blamed when the ratio falls outside (the element diameter by default).
    """
    low = table.lowest - _TABLE_END_TOLERANCE
    high = table.highest + _TABLE_END_TOLERANCE
    if not all_true((ratio >= low) & (ratio <= high)):
        raise InputError(
            field,
            f"{table.argument} lies outside {table.source} ({fmt(table.lowest)}–{fmt(table.highest)}); "
            "the standard gives no value there",
        )
    return interp(ratio, table.xs, table.ys)


def _clamped_factor(table: RatingTable, ratio: float) -> tuple[float, str | None]:
    """``table`` at ``ratio``, held at the table end outside it, with the warning to show then."""
    value = float(interp(ratio, table.xs, table.ys))
    if table.lowest - _TABLE_END_TOLERANCE <= ratio <= table.highest + _TABLE_END_TOLERANCE:
        return value, None
    return value, (
        f"{table.argument} = {fmt(ratio)} lies outside {table.source} "
        f"({fmt(table.lowest)}–{fmt(table.highest)}): {table.symbol} held at the table end, "
        f"{fmt(value)}, not extrapolated"
    )


# ---------------------------------------------------------------------------------------------
# The formulas, written once; callers have checked the inputs and read the tables.


def _radial_ball_c(i: NumT, z: NumT, dw: NumT, alpha_deg: NumT, bm: float, fc: NumT) -> NumT:
    """ISO 281:2007 §5.1.1: Cr, with the exponent switch at Dw = 25.4 mm."""
    common: NumT = bm * fc * (i * cosd(alpha_deg)) ** 0.7 * z ** (2 / 3)
    small: NumT = common * dw**1.8
    large: NumT = tables.LARGE_BALL_FACTOR * common * dw**1.4
    return where(dw <= tables.BALL_DIAMETER_SWITCH_MM, small, large)


def _radial_roller_c(i: NumT, z: NumT, dwe: NumT, lwe: NumT, alpha_deg: NumT, bm: float, fc: NumT) -> NumT:
    """ISO 281:2007 §7.1.1: Cr = bm·fc·(i·Lwe·cos α)^(7/9)·Z^(3/4)·Dwe^(29/27)."""
    rating: NumT = bm * fc * (i * lwe * cosd(alpha_deg)) ** (7 / 9) * z**0.75 * dwe ** (29 / 27)
    return rating


def _thrust_ball_c(z: NumT, dw: NumT, bm: float, fc: NumT) -> NumT:
    """ISO 281:2007 §6.1.1, α = 90° (from memory): Ca = bm·fc·Z^(2/3)·Dw^1.8, or 3.647·…·Dw^1.4."""
    common: NumT = bm * fc * z ** (2 / 3)
    small: NumT = common * dw**1.8
    large: NumT = tables.LARGE_BALL_FACTOR * common * dw**1.4
    return where(dw <= tables.BALL_DIAMETER_SWITCH_MM, small, large)


def _thrust_roller_c(z: NumT, dwe: NumT, lwe: NumT, bm: float, fc: NumT) -> NumT:
    """ISO 281:2007 §8.1.1, α = 90° (from memory): Ca = bm·fc·Lwe^(7/9)·Z^(3/4)·Dwe^(29/27)."""
    rating: NumT = bm * fc * lwe ** (7 / 9) * z**0.75 * dwe ** (29 / 27)
    return rating


def _radial_ball_c0(i: NumT, z: NumT, dw: NumT, alpha_deg: NumT, f0: NumT) -> NumT:
    """ISO 76:2006 §5.1: C0r = f0·i·Z·Dw²·cos α."""
    return f0 * i * z * dw**2 * cosd(alpha_deg)


def _thrust_ball_c0(z: NumT, dw: NumT, alpha_deg: NumT, f0: NumT) -> NumT:
    """ISO 76:2006 §7.1: C0a = f0·Z·Dw²·sin α."""
    return f0 * z * dw**2 * sind(alpha_deg)


def _radial_roller_c0(i: NumT, z: NumT, dwe: NumT, lwe: NumT, alpha_deg: NumT, static_factor: NumT) -> NumT:
    """ISO 76:2006 §6.1: C0r = 44·(1 − γ)·i·Z·Lwe·Dwe·cos α, with the factor 44·(1 − γ) given."""
    return static_factor * i * z * lwe * dwe * cosd(alpha_deg)


def _thrust_roller_c0(z: NumT, dwe: NumT, lwe: NumT, alpha_deg: NumT, static_factor: NumT) -> NumT:
    """ISO 76:2006 §8.1: C0a = 220·(1 − γ)·Z·Lwe·Dwe·sin α, with the factor 220·(1 − γ) given."""
    return static_factor * z * lwe * dwe * sind(alpha_deg)


def _radial_roller_static_factor(gamma: NumT) -> NumT:
    """ISO 76:2006 §6.1: the factor 44·(1 − Dwe·cos α/Dpw) in front of i·Z·Lwe·Dwe·cos α."""
    return tables.STATIC_RADIAL_ROLLER_FACTOR * (1 - gamma)


def _thrust_roller_static_factor(gamma: NumT) -> NumT:
    """ISO 76:2006 §8.1: the factor 220·(1 − Dwe·cos α/Dpw) in front of Z·Lwe·Dwe·sin α."""
    return tables.STATIC_THRUST_ROLLER_FACTOR * (1 - gamma)


# ---------------------------------------------------------------------------------------------
# Stand-alone ratings


def dynamic_rating_radial_ball(
    i: NumT, z: NumT, dw: NumT, alpha_deg: NumT, dpw: NumT, bm: float = 1.3
) -> NumT:
    """Basic dynamic radial rating Cr of a radial ball bearing, N (ISO 281:2007 §5.1.1, Table 2).

    Cr = bm·fc·(i·cos α)^0.7·Z^(2/3)·Dw^1.8 for Dw ≤ 25.4 mm,
    Cr = 3.647·bm·fc·(i·cos α)^0.7·Z^(2/3)·Dw^1.4 above; fc from the single-row
    deep-groove / angular-contact column by Dw·cos α/Dpw.
    """
    i, z = _count("i", i, "the number of rows"), _count("z", z, "the number of balls per row")
    dw, dpw = _positive("dw", dw, "the ball diameter Dw"), _positive("dpw", dpw, "the pitch diameter Dpw")
    alpha_deg, bm = _radial_angle(alpha_deg), _positive("bm", bm, "the rating factor bm")
    _within_pitch_circle(dw, dpw)
    fc = table_factor(tables.FC_RADIAL_BALL, dw * cosd(alpha_deg) / dpw)
    return _radial_ball_c(i, z, dw, alpha_deg, bm, fc)


def dynamic_rating_radial_roller(
    i: NumT, z: NumT, dwe: NumT, lwe: NumT, alpha_deg: NumT, dpw: NumT, bm: float = 1.1
) -> NumT:
    """Basic dynamic radial rating Cr of a radial roller bearing, N (ISO 281:2007 §7.1.1, Table 6).

    Cr = bm·fc·(i·Lwe·cos α)^(7/9)·Z^(3/4)·Dwe^(29/27), fc by Dwe·cos α/Dpw.
    """
    i, z = _count("i", i, "the number of rows"), _count("z", z, "the number of rollers per row")
    dwe = _positive("dwe", dwe, "the roller diameter Dwe")
    lwe = _positive("lwe", lwe, "the roller length Lwe")
    dpw = _positive("dpw", dpw, "the pitch diameter Dpw")
    alpha_deg, bm = _radial_angle(alpha_deg), _positive("bm", bm, "the rating factor bm")
    _within_pitch_circle(dwe, dpw)
    fc = table_factor(tables.FC_RADIAL_ROLLER, dwe * cosd(alpha_deg) / dpw, "dwe")
    return _radial_roller_c(i, z, dwe, lwe, alpha_deg, bm, fc)


def dynamic_rating_thrust_ball(z: NumT, dw: NumT, alpha_deg: NumT, dpw: NumT, bm: float = 1.3) -> NumT:
    """Basic dynamic axial rating Ca of a single-row thrust ball bearing, α = 90° only, N.

    ISO 281:2007 §6.1.1 (formula from memory): Ca = bm·fc·Z^(2/3)·Dw^1.8 for Dw ≤ 25.4 mm,
    3.647·bm·fc·Z^(2/3)·Dw^1.4 above; fc by Dw/Dpw from the α = 90° column.  Other angles raise
    InputError: their fc columns are not carried here.
    """
    z = _count("z", z, "the number of balls")
    dw, dpw = _positive("dw", dw, "the ball diameter Dw"), _positive("dpw", dpw, "the pitch diameter Dpw")
    _right_angle(alpha_deg)
    bm = _positive("bm", bm, "the rating factor bm")
    _within_pitch_circle(dw, dpw)
    fc = table_factor(tables.FC_THRUST_BALL_90, dw / dpw)
    return _thrust_ball_c(z, dw, bm, fc)


def dynamic_rating_thrust_roller(
    z: NumT, dwe: NumT, lwe: NumT, alpha_deg: NumT, dpw: NumT, bm: float = 1.0
) -> NumT:
    """Basic dynamic axial rating Ca of a single-row thrust roller bearing, α = 90° only, N.

    ISO 281:2007 §8.1.1 (formula and fc table from memory): Ca = bm·fc·Lwe^(7/9)·Z^(3/4)·Dwe^(29/27),
    fc by Dwe/Dpw.  Other angles raise InputError.
    """
    z = _count("z", z, "the number of rollers")
    dwe = _positive("dwe", dwe, "the roller diameter Dwe")
    lwe = _positive("lwe", lwe, "the roller length Lwe")
    dpw = _positive("dpw", dpw, "the pitch diameter Dpw")
    _right_angle(alpha_deg)
    bm = _positive("bm", bm, "the rating factor bm")
    _within_pitch_circle(dwe, dpw)
    fc = table_factor(tables.FC_THRUST_ROLLER_90, dwe / dpw, "dwe")
    return _thrust_roller_c(z, dwe, lwe, bm, fc)


def static_rating_radial_ball(
    i: NumT, z: NumT, dw: NumT, alpha_deg: NumT, dpw: NumT, f0: NumT | None = None
) -> NumT:
    """Basic static radial rating C0r of a radial ball bearing, N (ISO 76:2006 §5.1, Table 1).

    C0r = f0·i·Z·Dw²·cos α.  With ``f0`` None it is read from the deep-groove column by
    Dw·cos α/Dpw; for other radial ball bearings pass the f0 of their own column.
    """
    i, z = _count("i", i, "the number of rows"), _count("z", z, "the number of balls per row")
    dw, dpw = _positive("dw", dw, "the ball diameter Dw"), _positive("dpw", dpw, "the pitch diameter Dpw")
    alpha_deg = _radial_angle(alpha_deg)
    _within_pitch_circle(dw, dpw)
    if f0 is None:
        f0 = table_factor(tables.F0_DEEP_GROOVE, dw * cosd(alpha_deg) / dpw)
    else:
        f0 = _positive("f0", f0, "the static factor f0")
    return _radial_ball_c0(i, z, dw, alpha_deg, f0)


def static_rating_radial_roller(i: NumT, z: NumT, dwe: NumT, lwe: NumT, alpha_deg: NumT, dpw: NumT) -> NumT:
    """Basic static radial rating C0r of a radial roller bearing, N (ISO 76:2006 §6.1).

    C0r = 44·(1 − Dwe·cos α/Dpw)·i·Z·Lwe·Dwe·cos α.
    """
    i, z = _count("i", i, "the number of rows"), _count("z", z, "the number of rollers per row")
    dwe = _positive("dwe", dwe, "the roller diameter Dwe")
    lwe = _positive("lwe", lwe, "the roller length Lwe")
    dpw = _positive("dpw", dpw, "the pitch diameter Dpw")
    alpha_deg = _radial_angle(alpha_deg)
    _within_pitch_circle(dwe, dpw)
    static_factor = _radial_roller_static_factor(dwe * cosd(alpha_deg) / dpw)
    return _radial_roller_c0(i, z, dwe, lwe, alpha_deg, static_factor)


def static_rating_thrust_ball(z: NumT, dw: NumT, alpha_deg: NumT, f0: NumT | None = None) -> NumT:
    """Basic static axial rating C0a of a thrust ball bearing, N (ISO 76:2006 §7.1).

    C0a = f0·Z·Dw²·sin α, 45° < α ≤ 90°.  The ISO 76 thrust-ball f0 column is not carried here,
    so ``f0`` must be given; None raises InputError naming ``f0``.
    """
    z = _count("z", z, "the number of balls")
    dw = _positive("dw", dw, "the ball diameter Dw")
    alpha_deg = _thrust_angle(alpha_deg)
    if f0 is None:
        raise InputError("f0", "give f0: the ISO 76 thrust-ball f0 table is not carried here")
    return _thrust_ball_c0(z, dw, alpha_deg, _positive("f0", f0, "the static factor f0"))


def static_rating_thrust_roller(z: NumT, dwe: NumT, lwe: NumT, alpha_deg: NumT, dpw: NumT) -> NumT:
    """Basic static axial rating C0a of a thrust roller bearing, N (ISO 76:2006 §8.1).

    C0a = 220·(1 − Dwe·cos α/Dpw)·Z·Lwe·Dwe·sin α, 45° < α ≤ 90°.
    """
    z = _count("z", z, "the number of rollers")
    dwe = _positive("dwe", dwe, "the roller diameter Dwe")
    lwe = _positive("lwe", lwe, "the roller length Lwe")
    dpw = _positive("dpw", dpw, "the pitch diameter Dpw")
    alpha_deg = _thrust_angle(alpha_deg)
    _within_pitch_circle(dwe, dpw)
    static_factor = _thrust_roller_static_factor(dwe * cosd(alpha_deg) / dpw)
    return _thrust_roller_c0(z, dwe, lwe, alpha_deg, static_factor)


# ---------------------------------------------------------------------------------------------
# The derivation for one bearing

BALL_KINDS = ("deep-groove", "angular-contact")
RADIAL_ROLLER_KINDS = ("cylindrical", "tapered", "spherical")
THRUST_KINDS = ("thrust-ball", "thrust-roller")
KINDS = ("deep-groove", "angular-contact", "self-aligning", *RADIAL_ROLLER_KINDS, *THRUST_KINDS)
_FC_TABLE_BY_KIND: dict[str, RatingTable] = {
    "deep-groove": tables.FC_RADIAL_BALL,
    "angular-contact": tables.FC_RADIAL_BALL,
    "cylindrical": tables.FC_RADIAL_ROLLER,
    "tapered": tables.FC_RADIAL_ROLLER,
    "spherical": tables.FC_RADIAL_ROLLER,
    "thrust-ball": tables.FC_THRUST_BALL_90,
    "thrust-roller": tables.FC_THRUST_ROLLER_90,
}


@dataclass(frozen=True, slots=True)
class BearingGeometry:
    """The internal geometry that fixes a bearing's basic load ratings (mm, degrees).

    ``kind`` is one of :data:`KINDS`.  ``i`` rows, ``z`` rolling elements per row (thrust: carrying
    load in one direction), ``dw`` ball diameter Dw or roller diameter Dwe, ``lwe`` effective roller
    length Lwe (rollers only), ``alpha_deg`` nominal contact angle α, ``dpw`` pitch diameter Dpw.
    ``bm`` overrides the ISO 281 Table 1 value; ``f0`` overrides (or, where no table is carried,
    supplies) the ISO 76 static factor of ball bearings.
    """

    kind: str
    i: int
    z: int
    dw: float
    alpha_deg: float
    dpw: float
    lwe: float | None = None
    bm: float | None = None
    f0: float | None = None


def _check_kind(geometry: BearingGeometry) -> None:
    """Refuse unknown kinds and kinds whose tables are not carried here."""
    if geometry.kind == "self-aligning":
        raise InputError(
            "kind",
            "self-aligning ball bearings have their own bm, fc and f0 in ISO 281 and ISO 76: "
            "not supported for geometry rating yet",
        )
    if geometry.kind not in KINDS:
        expected = ", ".join(KINDS)
        raise InputError("kind", f"unknown bearing kind {geometry.kind!r}; expected one of {expected}")


def _check_numbers(g: BearingGeometry) -> None:
    """The numeric checks of the stand-alone functions, under the geometry's field names."""
    _count("i", g.i, "the number of rows")
    _count("z", g.z, "the number of rolling elements per row")
    _positive("dw", g.dw, "the rolling-element diameter")
    _positive("dpw", g.dpw, "the pitch diameter Dpw")
    if g.lwe is not None:
        _positive("lwe", g.lwe, "the roller length Lwe")
    if g.bm is not None:
        _positive("bm", g.bm, "the rating factor bm")
    if g.f0 is not None:
        _positive("f0", g.f0, "the static factor f0")
    if g.kind in THRUST_KINDS:
        _right_angle(g.alpha_deg)
    else:
        _radial_angle(g.alpha_deg)
    _within_pitch_circle(g.dw, g.dpw)


def _check_layout(g: BearingGeometry) -> None:
    """Refuse row counts and inputs that do not fit the kind."""
    if g.kind == "deep-groove" and g.i != 1:
        raise InputError("i", "double-row deep-groove ball bearings have their own fc column: "
                              "not supported yet")
    if g.kind in THRUST_KINDS and g.i != 1:
        raise InputError("i", "thrust ratings here are for one row; combining rows is not supported yet")
    is_roller = g.kind in RADIAL_ROLLER_KINDS or g.kind == "thrust-roller"
    if is_roller and g.lwe is None:
        raise InputError("lwe", "a roller bearing needs the effective roller length Lwe")
    if not is_roller and g.lwe is not None:
        raise InputError("lwe", "a ball bearing has no roller length Lwe")
    if g.f0 is None and g.kind in ("angular-contact", "thrust-ball"):
        raise InputError("f0", f"give f0 for a {g.kind} bearing: its ISO 76 f0 column is not carried here")
    if is_roller and g.f0 is not None:
        raise InputError("f0", "f0 applies to ball bearings; roller static ratings use ISO 76's own constants")


def _add_gamma(record: Derivation, g: BearingGeometry, table: RatingTable) -> float:
    """Step: the geometry ratio γ that the fc table is read at."""
    if g.kind in THRUST_KINDS:
        return record.add("gamma", g.dw / g.dpw, symbol="γ", label="geometry ratio",
                          formula="γ = Dw/Dpw (α = 90°)", template="γ = {0}/{1}",
                          args=(g.dw, g.dpw), source=table.source)
    return record.add("gamma", g.dw * cosd(g.alpha_deg) / g.dpw, symbol="γ",
                      label="geometry ratio", formula="γ = Dw·cos α/Dpw",
                      template="γ = {0}·cos {1}°/{2}", args=(g.dw, g.alpha_deg, g.dpw),
                      source=table.source)


def _add_table_step(record: Derivation, key: str, label: str, table: RatingTable, gamma: float) -> float:
    """Step: a factor read from a standard table at γ, held at the table end (with a warning) outside."""
    value, warning = _clamped_factor(table, gamma)
    return record.add(key, value, symbol=table.symbol, label=f"{label} ({table.name})",
                      formula=f"{table.symbol} = table({table.argument}), linear interpolation",
                      template=f"{table.symbol} read at γ = {{0}}", args=(gamma,),
                      source=table.source, warning=warning)


def _add_bm(record: Derivation, g: BearingGeometry) -> float:
    """Step: the rating factor bm, from ISO 281 Table 1 unless overridden."""
    label = "rating factor for material and manufacture"
    if g.bm is not None:
        return record.add("bm", g.bm, symbol="bm", label=label, formula="bm (given)",
                          template="bm (given)", source="given", result=False)
    value = tables.BM_BY_KIND[g.kind]
    return record.add("bm", value, symbol="bm", label=label, formula=f"bm ({g.kind})",
                      template=f"bm ({g.kind})", source=tables.BM_SOURCE, result=False)


def _add_given_f0(record: Derivation, f0: float) -> float:
    """Step: a static factor f0 supplied with the geometry."""
    return record.add("f0", f0, symbol="f0", label="static factor", formula="f0 (given)",
                      template="f0 (given)", source="given")


def _rate_radial_ball(record: Derivation, g: BearingGeometry, gamma: float, bm: float, fc: float) -> None:
    """Steps Cr, f0, C0r of a radial ball bearing."""
    if g.dw <= tables.BALL_DIAMETER_SWITCH_MM:
        formula = "Cr = bm·fc·(i·cos α)^0.7·Z^(2/3)·Dw^1.8  (Dw ≤ 25.4 mm)"
        template = "Cr = {0}·{1}·({2}·cos {3}°)^0.7·{4}^(2/3)·{5}^1.8"
    else:
        formula = "Cr = 3.647·bm·fc·(i·cos α)^0.7·Z^(2/3)·Dw^1.4  (Dw > 25.4 mm)"
        template = "Cr = 3.647·{0}·{1}·({2}·cos {3}°)^0.7·{4}^(2/3)·{5}^1.4"
    record.add("C", _radial_ball_c(g.i, g.z, g.dw, g.alpha_deg, bm, fc), symbol="Cr",
               label="basic dynamic radial load rating", formula=formula, template=template,
               args=(bm, fc, g.i, g.alpha_deg, g.z, g.dw), unit="N",
               source=tables.FC_RADIAL_BALL.source)
    if g.f0 is None:
        f0 = _add_table_step(record, "f0", "static factor", tables.F0_DEEP_GROOVE, gamma)
    else:
        f0 = _add_given_f0(record, g.f0)
    record.add("C0", _radial_ball_c0(g.i, g.z, g.dw, g.alpha_deg, f0), symbol="C0r",
               label="basic static radial load rating", formula="C0r = f0·i·Z·Dw²·cos α",
               template="C0r = {0}·{1}·{2}·{3}²·cos {4}°", args=(f0, g.i, g.z, g.dw, g.alpha_deg),
               unit="N", source=tables.STATIC_RADIAL_BALL_SOURCE)


def _rate_radial_roller(record: Derivation, g: BearingGeometry, gamma: float, bm: float, fc: float) -> None:
    """Steps Cr, f0 (the ISO 76 factor 44·(1 − γ)), C0r of a radial roller bearing."""
    assert g.lwe is not None  # checked by _check_layout
    lwe = float(g.lwe)
    record.add("C", _radial_roller_c(g.i, g.z, g.dw, lwe, g.alpha_deg, bm, fc), symbol="Cr",
               label="basic dynamic radial load rating",
               formula="Cr = bm·fc·(i·Lwe·cos α)^(7/9)·Z^(3/4)·Dwe^(29/27)",
               template="Cr = {0}·{1}·({2}·{3}·cos {4}°)^(7/9)·{5}^(3/4)·{6}^(29/27)",
               args=(bm, fc, g.i, lwe, g.alpha_deg, g.z, g.dw), unit="N",
               source=tables.FC_RADIAL_ROLLER.source)
    f0 = record.add("f0", _radial_roller_static_factor(gamma), symbol="f0", label="static factor",
                    formula="f0 = 44·(1 − γ)", template="f0 = 44·(1 − {0})", args=(gamma,),
                    unit="N/mm²", source=tables.STATIC_RADIAL_ROLLER_SOURCE)
    record.add("C0", _radial_roller_c0(g.i, g.z, g.dw, lwe, g.alpha_deg, f0), symbol="C0r",
               label="basic static radial load rating", formula="C0r = f0·i·Z·Lwe·Dwe·cos α",
               template="C0r = {0}·{1}·{2}·{3}·{4}·cos {5}°",
               args=(f0, g.i, g.z, lwe, g.dw, g.alpha_deg), unit="N",
               source=tables.STATIC_RADIAL_ROLLER_SOURCE)


def _rate_thrust_ball(record: Derivation, g: BearingGeometry, gamma: float, bm: float, fc: float) -> None:
    """Steps Ca, f0 (given), C0a of a thrust ball bearing, α = 90°."""
    assert g.f0 is not None  # checked by _check_layout
    f0 = float(g.f0)
    if g.dw <= tables.BALL_DIAMETER_SWITCH_MM:
        formula = "Ca = bm·fc·Z^(2/3)·Dw^1.8  (α = 90°, Dw ≤ 25.4 mm)"
        template = "Ca = {0}·{1}·{2}^(2/3)·{3}^1.8"
    else:
        formula = "Ca = 3.647·bm·fc·Z^(2/3)·Dw^1.4  (α = 90°, Dw > 25.4 mm)"
        template = "Ca = 3.647·{0}·{1}·{2}^(2/3)·{3}^1.4"
    record.add("C", _thrust_ball_c(g.z, g.dw, bm, fc), symbol="Ca",
               label="basic dynamic axial load rating", formula=formula, template=template,
               args=(bm, fc, g.z, g.dw), unit="N", source=tables.FC_THRUST_BALL_90.source,
               note="thrust formula from memory")
    _add_given_f0(record, f0)
    record.add("C0", _thrust_ball_c0(g.z, g.dw, g.alpha_deg, f0), symbol="C0a",
               label="basic static axial load rating", formula="C0a = f0·Z·Dw²·sin α",
               template="C0a = {0}·{1}·{2}²·sin {3}°", args=(f0, g.z, g.dw, g.alpha_deg), unit="N",
               source=tables.STATIC_THRUST_BALL_SOURCE)


def _rate_thrust_roller(record: Derivation, g: BearingGeometry, gamma: float, bm: float, fc: float) -> None:
    """Steps Ca, f0 (the ISO 76 factor 220·(1 − Dwe·cos α/Dpw)), C0a of a thrust roller bearing."""
    assert g.lwe is not None  # checked by _check_layout
    lwe = float(g.lwe)
    record.add("C", _thrust_roller_c(g.z, g.dw, lwe, bm, fc), symbol="Ca",
               label="basic dynamic axial load rating",
               formula="Ca = bm·fc·Lwe^(7/9)·Z^(3/4)·Dwe^(29/27)  (α = 90°)",
               template="Ca = {0}·{1}·{2}^(7/9)·{3}^(3/4)·{4}^(29/27)",
               args=(bm, fc, lwe, g.z, g.dw), unit="N", source=tables.FC_THRUST_ROLLER_90.source,
               note="thrust formula and fc table from memory")
    f0 = record.add("f0", _thrust_roller_static_factor(g.dw * cosd(g.alpha_deg) / g.dpw),
                    symbol="f0", label="static factor", formula="f0 = 220·(1 − Dwe·cos α/Dpw)",
                    template="f0 = 220·(1 − {0}·cos {1}°/{2})", args=(g.dw, g.alpha_deg, g.dpw),
                    unit="N/mm²", source=tables.STATIC_THRUST_ROLLER_SOURCE)
    record.add("C0", _thrust_roller_c0(g.z, g.dw, lwe, g.alpha_deg, f0), symbol="C0a",
               label="basic static axial load rating", formula="C0a = f0·Z·Lwe·Dwe·sin α",
               template="C0a = {0}·{1}·{2}·{3}·sin {4}°", args=(f0, g.z, lwe, g.dw, g.alpha_deg),
               unit="N", source=tables.STATIC_THRUST_ROLLER_SOURCE)


def rate_bearing(geometry: BearingGeometry) -> Derivation:
    """Basic dynamic and static load ratings of one bearing from its internal geometry.

    ISO 281:2007 (§5.1.1 radial ball, §6.1.1 thrust ball, §7.1.1 radial roller, §8.1.1 thrust
    roller) and ISO 76:2006 (§5.1–§8.1); clause numbers are from memory.  Steps: γ, fc, bm, C, f0,
    C0; results ``C``, ``C0``, ``fc``, ``gamma``, ``f0``.  A γ outside the fc or f0 table is held at
    the table end and the step carries a warning.  For rollers ``f0`` is the ISO 76 factor
    44·(1 − γ) (radial) or 220·(1 − γ) (thrust) in front of the geometry product.
    """
    _check_kind(geometry)
    _check_numbers(geometry)
    _check_layout(geometry)
    fc_table = _FC_TABLE_BY_KIND[geometry.kind]
    record = Derivation()
    gamma = _add_gamma(record, geometry, fc_table)
    fc = _add_table_step(record, "fc", "rating factor for geometry", fc_table, gamma)
    bm = _add_bm(record, geometry)
    if geometry.kind in BALL_KINDS:
        _rate_radial_ball(record, geometry, gamma, bm, fc)
    elif geometry.kind in RADIAL_ROLLER_KINDS:
        _rate_radial_roller(record, geometry, gamma, bm, fc)
    elif geometry.kind == "thrust-ball":
        _rate_thrust_ball(record, geometry, gamma, bm, fc)
    else:
        _rate_thrust_roller(record, geometry, gamma, bm, fc)
    return record
