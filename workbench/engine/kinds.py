"""Bearing kinds, their arrangements, and the X, Y, e and X0, Y0 factors of each.

Dynamic factors follow the ISO 281:2007 Table 3 family; static factors ISO 76:2006.  Each factor
function takes floats or numpy arrays alike (through :mod:`workbench.engine.num`) so the scalar
derivation and the catalog sweep use this one copy.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from enum import StrEnum
from typing import Generic, NamedTuple, TypeVar, overload

from . import tables as T
from .num import BoolArray, FloatArray, Num, NumT, Truth, interp, safe_ratio, tand, where
from .record import InputError


class Kind(StrEnum):
    """Bearing kinds the engine knows, by their plain trade names."""

    DEEP_GROOVE = "deep-groove"
    ANGULAR_CONTACT = "angular-contact"
    SELF_ALIGNING = "self-aligning"
    CYLINDRICAL = "cylindrical"
    TAPERED = "tapered"
    SPHERICAL = "spherical"
    THRUST_BALL = "thrust-ball"
    THRUST_ROLLER = "thrust-roller"


class Arrangement(StrEnum):
    """How the rows or the bearings of a set are arranged."""

    SINGLE = "single"
    DOUBLE_ROW = "double-row"
    TANDEM = "tandem"
    BACK_TO_BACK = "back-to-back"
    FACE_TO_FACE = "face-to-face"


KIND_WORDS: dict[Kind, str] = {
    Kind.DEEP_GROOVE: "deep-groove ball bearing",
    Kind.ANGULAR_CONTACT: "angular-contact ball bearing",
    Kind.SELF_ALIGNING: "self-aligning ball bearing",
    Kind.CYLINDRICAL: "cylindrical roller bearing",
    Kind.TAPERED: "tapered roller bearing",
    Kind.SPHERICAL: "spherical roller bearing",
    Kind.THRUST_BALL: "thrust ball bearing",
    Kind.THRUST_ROLLER: "thrust roller bearing",
}

ARRANGEMENTS: dict[Kind, tuple[Arrangement, ...]] = {
    Kind.DEEP_GROOVE: (Arrangement.SINGLE, Arrangement.DOUBLE_ROW),
    Kind.ANGULAR_CONTACT: (Arrangement.SINGLE, Arrangement.TANDEM, Arrangement.BACK_TO_BACK,
                           Arrangement.FACE_TO_FACE),
    Kind.SELF_ALIGNING: (Arrangement.DOUBLE_ROW,),
    Kind.CYLINDRICAL: (Arrangement.SINGLE,),
    Kind.TAPERED: (Arrangement.SINGLE, Arrangement.BACK_TO_BACK, Arrangement.FACE_TO_FACE,
                   Arrangement.DOUBLE_ROW),
    Kind.SPHERICAL: (Arrangement.DOUBLE_ROW,),
    Kind.THRUST_BALL: (Arrangement.SINGLE,),
    Kind.THRUST_ROLLER: (Arrangement.SINGLE,),
}

DEFAULT_CONTACT_ANGLE: dict[Kind, float | None] = {
    Kind.DEEP_GROOVE: 0.0,
    Kind.ANGULAR_CONTACT: 40.0,
    Kind.SELF_ALIGNING: None,
    Kind.CYLINDRICAL: 0.0,
    Kind.TAPERED: None,
    Kind.SPHERICAL: None,
    Kind.THRUST_BALL: 90.0,
    Kind.THRUST_ROLLER: 90.0,
}

# ISO 281:2007 clause per family (radial ball 5, thrust ball 6, radial roller 7, thrust roller 8;
# from memory): §n.2 the dynamic equivalent load, §n.3 the basic rating life.
_CLAUSE: dict[Kind, int] = {
    Kind.DEEP_GROOVE: 5, Kind.ANGULAR_CONTACT: 5, Kind.SELF_ALIGNING: 5, Kind.THRUST_BALL: 6,
    Kind.CYLINDRICAL: 7, Kind.TAPERED: 7, Kind.SPHERICAL: 7, Kind.THRUST_ROLLER: 8,
}


def load_clause(kind: Kind) -> str:
    """The ISO 281:2007 clause for the dynamic equivalent load of ``kind``."""
    return f"ISO 281:2007 §{_CLAUSE[kind]}.2"


def life_clause(kind: Kind) -> str:
    """The ISO 281:2007 clause for the basic rating life of ``kind``."""
    return f"ISO 281:2007 §{_CLAUSE[kind]}.3"


def rating_clause(kind: Kind) -> str:
    """The ISO 281:2007 clause for the basic dynamic load rating of ``kind`` (§n.1)."""
    return f"ISO 281:2007 §{_CLAUSE[kind]}.1"


def static_rating_clause(kind: Kind) -> str:
    """The ISO 76:2006 clause for the basic static load rating of ``kind`` (§n.1)."""
    return f"ISO 76:2006 §{_CLAUSE[kind]}.1"


def static_clause(kind: Kind) -> str:
    """The ISO 76:2006 clause for the static equivalent load of ``kind`` (same numbering)."""
    return f"ISO 76:2006 §{_CLAUSE[kind]}.2"


ROLLER_KINDS = frozenset({Kind.CYLINDRICAL, Kind.TAPERED, Kind.SPHERICAL, Kind.THRUST_ROLLER})
THRUST_KINDS = frozenset({Kind.THRUST_BALL, Kind.THRUST_ROLLER})
MAKERS_FACTOR_KINDS = frozenset({Kind.SELF_ALIGNING, Kind.TAPERED, Kind.SPHERICAL})
"""The kinds whose e and Y follow the contact angle's closed form, or the maker's e and Y
(:func:`dynamic_factors`); every other kind takes them from Table 3 or has none."""
F0_KINDS = frozenset({Kind.DEEP_GROOVE, Kind.ANGULAR_CONTACT})
"""The kinds that read f0: the Table 3 index of deep-groove and 15° angular-contact bearings
(:func:`dynamic_factors`), and C0 from the geometry of a ball bearing in the internal analysis."""
_FACTORS_ELSEWHERE: dict[Kind, str] = {
    Kind.DEEP_GROOVE: "e and Y come from ISO 281:2007 Table 3 by Fa/C0r",
    Kind.ANGULAR_CONTACT: "e and Y come from ISO 281:2007 Table 3 at the contact angle",
    Kind.CYLINDRICAL: "it has no e or Y, P = V·Fr (ISO 281:2007 §7.2)",
    Kind.THRUST_BALL: "e and Y follow from the contact angle (ISO 281:2007 §6.2)",
    Kind.THRUST_ROLLER: "e and Y follow from the contact angle (ISO 281:2007 §8.2)",
}


def unread_inputs(kind: Kind) -> dict[str, str]:
    """The bearing inputs (:class:`~workbench.engine.derive.CaseInputs` names) that no
    calculation reads for ``kind`` — not the ISO 281 and ISO 76 chain, a shaft's pair rule nor
    the internal analysis — each with the reason, as "not used for a … bearing: …".

    The contact angle of a cylindrical roller bearing is 0 by its construction (ISO 281:2007
    §7.2, P = V·Fr); the maker's e and Y replace the closed forms of
    :data:`MAKERS_FACTOR_KINDS` only; f0 is read by :data:`F0_KINDS` only."""
    reasons: dict[str, str] = {}
    if kind is Kind.CYLINDRICAL:
        reasons["contact_angle"] = "α = 0 by its construction, P = V·Fr (ISO 281:2007 §7.2)"
    if kind not in MAKERS_FACTOR_KINDS:
        reasons["e_given"] = reasons["y_given"] = _FACTORS_ELSEWHERE[kind]
    if kind not in F0_KINDS:
        reasons["f0"] = ("f0 enters only the Table 3 look-up of deep-groove and 15° "
                         "angular-contact ball bearings")
    return {name: f"not used for a {KIND_WORDS[kind]}: {reason}"
            for name, reason in reasons.items()}


_KIND_BY_NAME: dict[str, Kind] = {k.value: k for k in Kind}
# (kind, text) → arrangement, filled as names are met (an Enum call costs a microsecond).
_ARRANGEMENT_SEEN: dict[tuple[Kind, str], Arrangement] = {}


def parse_kind(text: str) -> Kind:
    """The :class:`Kind` named by ``text``, or an InputError listing the names."""
    kind = _KIND_BY_NAME.get(text)
    if kind is None:
        names = ", ".join(_KIND_BY_NAME)
        raise InputError("kind", f"unknown bearing kind {text!r}; use one of {names}")
    return kind


def parse_arrangement(kind: Kind, text: str) -> Arrangement:
    """The arrangement named by ``text``, checked against what ``kind`` allows."""
    seen = _ARRANGEMENT_SEEN.get((kind, text))
    if seen is not None:
        return seen
    _ARRANGEMENT_SEEN[(kind, text)] = arrangement = _arrangement(kind, text)
    return arrangement


def _arrangement(kind: Kind, text: str) -> Arrangement:
    allowed = ARRANGEMENTS[kind]
    if text == "single" and Arrangement.SINGLE not in allowed:
        return allowed[0]  # self-aligning and spherical are double-row by construction
    try:
        arrangement = Arrangement(text)
    except ValueError:
        arrangement = None
    if arrangement not in allowed:
        names = ", ".join(a.value for a in allowed)
        raise InputError("arrangement", f"a {KIND_WORDS[kind]} comes as {names}, not {text!r}")
    return arrangement


SET_ARRANGEMENTS = frozenset({Arrangement.TANDEM, Arrangement.BACK_TO_BACK, Arrangement.FACE_TO_FACE})
"""Sets of identical single-row bearings mounted side by side as a unit (ISO 281:2007 §5.1 and
§7.1, "bearing combinations"): their C and C0 are the set's, not one bearing's.  A double-row
bearing is one bearing, rated as made."""
SET_SIZE = 2
"""The bearings of a set the workbench rates: a pair (a longer tandem stack is a rating of its own)."""
_SET_WORDS: dict[Arrangement, str] = {
    Arrangement.TANDEM: "tandem pair",
    Arrangement.BACK_TO_BACK: "back-to-back pair",
    Arrangement.FACE_TO_FACE: "face-to-face pair",
}


def is_bearing_set(arrangement: Arrangement) -> bool:
    """True for a set of single-row bearings mounted as a unit (tandem, back-to-back, face-to-face)."""
    return arrangement in SET_ARRANGEMENTS


def set_words(arrangement: Arrangement) -> str:
    """A set in words ("back-to-back pair"); "" for a single or double-row bearing."""
    return _SET_WORDS.get(arrangement, "")


def set_dynamic_rating(kind: Kind, c_one: NumT, count: int = SET_SIZE) -> NumT:
    """C of ``count`` identical single-row bearings mounted as a unit, from one bearing's C (N).

    C_set = i^0.7·C (ball bearings, ISO 281:2007 §5.1, bearing combinations), i^(7/9)·C (roller
    bearings, §7.1): the exponents of i in the rating formulas, from memory.
    """
    c_set: NumT = count ** set_exponent(kind) * c_one
    return c_set


def set_exponent(kind: Kind) -> float:
    """The exponent of the number of bearings in a set's C: 7/9 roller, 0.7 ball (ISO 281:2007
    §5.1/§7.1, the exponent of i in the rating formulas)."""
    return 7.0 / 9.0 if kind in ROLLER_KINDS else 0.7


def set_exponent_words(kind: Kind) -> str:
    """:func:`set_exponent` as a step writes it after "2^": "0.7" or "(7/9)"."""
    return "(7/9)" if kind in ROLLER_KINDS else "0.7"


def set_static_rating(c0_one: NumT, count: int = SET_SIZE) -> NumT:
    """C0 of ``count`` identical single-row bearings mounted as a unit, from one bearing's C0 (N).

    C0_set = i·C0 (ISO 76:2006 §5.1 and §7.1, bearing combinations; from memory).
    """
    c0_set: NumT = count * c0_one
    return c0_set


def life_exponent(kind: Kind) -> float:
    """ISO 281:2007 §5.3–§8.3: p = 3 for ball bearings, 10/3 for roller bearings."""
    return 10.0 / 3.0 if kind in ROLLER_KINDS else 3.0


FactorT = TypeVar("FactorT", bound=Num, covariant=True)
"""What :class:`DynamicFactors` holds: ``float`` when found for one load (the derivation),
``Num`` in a catalog sweep (a table kind's e and Y are arrays there, a fixed angle's are floats)."""


@dataclass(slots=True)
class DynamicFactors(Generic[FactorT]):
    """e and the X, Y pair on each side of it, plus how they were found.

    ``basis`` says which table or relation gave them; ``index`` is the table index used (NaN when
    there is none) and ``clamped`` is -1/0/+1 when the index fell below / inside / above the table.
    """

    e: FactorT
    x_low: FactorT
    y_low: FactorT
    x_high: FactorT
    y_high: FactorT
    basis: str
    source: str
    index: FactorT | float = math.nan  # a float (NaN) where no table was read
    index_formula: str = ""
    clamped: FactorT | float = 0
    columns: tuple[tuple[float, ...], tuple[float, ...], tuple[float, ...],
                   tuple[float, ...] | None] | None = None
    """(index, e, Y>e, Y≤e or None) columns of the Table 3 block read, for showing the rows."""


def _clamp_flag(index: Num, lo: float, hi: float) -> Num:
    """-1 below the table, +1 above it, 0 inside."""
    return where(index < lo, -1, where(index > hi, 1, 0))


def contact_angle_from_e(e: float) -> float:
    """Contact angle in degrees from e = 1.5·tan α (ISO 281:2007 Table 3 roller/self-aligning rows)."""
    return math.degrees(math.atan(e / 1.5))


@overload
def dynamic_factors(kind: Kind, arrangement: Arrangement, alpha_deg: float, fa: float = 0.0,
                    c0: float = 1.0, f0: float | None = None, e_given: float | None = None,
                    y_given: float | None = None) -> DynamicFactors[float]: ...
@overload
def dynamic_factors(kind: Kind, arrangement: Arrangement, alpha_deg: float, fa: Num = 0.0,
                    c0: Num = 1.0, f0: Num | None = None, e_given: float | None = None,
                    y_given: float | None = None) -> DynamicFactors[Num]: ...
def dynamic_factors(
    kind: Kind,
    arrangement: Arrangement,
    alpha_deg: float,
    fa: Num = 0.0,
    c0: Num = 1.0,
    f0: Num | None = None,
    e_given: float | None = None,
    y_given: float | None = None,
) -> DynamicFactors[Num]:
    """e, X and Y for the kind (ISO 281:2007 Table 3 family).

    Deep-groove and 15° angular-contact bearings read e and Y from the table by f0·Fa/C0r, or,
    when f0 is not known, by the table's printed Fa/C0r column; linear interpolation between
    rows.  Bearings with a contact angle take e = 1.5·tan α and Y ∝ cot α, unless the maker's e
    and Y are given.
    """
    if kind is Kind.DEEP_GROOVE:
        return _table_factors(
            fa, c0, f0, TableBlock(T.DEEP_GROOVE_INDEX_F0, T.DEEP_GROOVE_INDEX_PLAIN,
                                   T.DEEP_GROOVE_E, T.DEEP_GROOVE_Y),
            x_high=T.DEEP_GROOVE_X, rows=1.0, x_low=1.0, y_low=0.0,
            what="deep-groove", source="ISO 281:2007 Table 3 (deep-groove ball)",
        )
    if kind is Kind.ANGULAR_CONTACT:
        paired = arrangement in (Arrangement.BACK_TO_BACK, Arrangement.FACE_TO_FACE)
        angle = round(alpha_deg)
        if abs(alpha_deg - angle) > 1e-9 or angle not in T.ANGULAR_ANGLES:
            listed = ", ".join(f"{a}°" for a in T.ANGULAR_ANGLES)
            raise InputError(
                "contact_angle",
                f"angular-contact factors are tabulated at {listed}; {alpha_deg:g}° is not one of them",
            )
        source = "ISO 281:2007 Table 3 (angular-contact ball)"
        if angle == 15:
            if paired:
                return _table_factors(
                    fa, c0, f0, TableBlock(T.ANGULAR_15_INDEX, T.ANGULAR_15_INDEX_PLAIN,
                                           T.ANGULAR_15_E, T.ANGULAR_15_PAIR_Y_HIGH,
                                           T.ANGULAR_15_PAIR_Y_LOW),
                    x_high=T.ANGULAR_15_PAIR_X_HIGH, rows=2.0, x_low=1.0, y_low=0.0,
                    what="15° angular-contact pair", source=source,
                )
            return _table_factors(
                fa, c0, f0, TableBlock(T.ANGULAR_15_INDEX, T.ANGULAR_15_INDEX_PLAIN,
                                       T.ANGULAR_15_E, T.ANGULAR_15_Y),
                x_high=T.ANGULAR_15_X, rows=1.0, x_low=1.0, y_low=0.0,
                what="15° angular-contact", source=source,
            )
        e, xs, ys, xl, yl, xh, yh = T.ANGULAR_FIXED[angle]
        if paired:
            return DynamicFactors(e, xl, yl, xh, yh, f"{angle}° contact angle, pair", source)
        return DynamicFactors(e, 1.0, 0.0, xs, ys, f"{angle}° contact angle", source)
    if kind is Kind.CYLINDRICAL:
        return DynamicFactors(math.inf, 1.0, 0.0, 1.0, 0.0, "α = 0: P = Fr",
                              "ISO 281:2007 §7.2 (radial roller, α = 0)")
    if kind in THRUST_KINDS:
        return _thrust_factors(kind, alpha_deg)
    return _angle_factors(kind, arrangement, alpha_deg, e_given, y_given)


class TableBlock(NamedTuple):
    """One block of ISO 281:2007 Table 3: the two printed index columns and the e and Y columns."""

    index_f0: tuple[float, ...]     # f0·Fa/C0r (i·f0·Fa/C0r for pairs)
    index_plain: tuple[float, ...]  # Fa/C0r (i·Fa/C0r), read when f0 is not known
    e: tuple[float, ...]
    y: tuple[float, ...]            # Y for Fa/Fr > e
    y_low: tuple[float, ...] | None = None  # Y for Fa/Fr ≤ e where it is tabulated (pairs)


def _index(fa: Num, c0: Num, f0: Num | None, block: TableBlock,
           rows: float) -> tuple[Num, str, tuple[float, ...]]:
    """The table index, its formula and the index column it is read in: i·f0·Fa/C0r in the f0
    column when f0 is known, else i·Fa/C0r in the printed Fa/C0r column."""
    pair = rows != 1.0
    if f0 is None:
        return rows * fa / c0, "i·Fa/C0r" if pair else "Fa/C0r", block.index_plain
    return rows * f0 * fa / c0, "i·f0·Fa/C0r" if pair else "f0·Fa/C0r", block.index_f0


def _table_factors(fa: Num, c0: Num, f0: Num | None, block: TableBlock, *, x_high: float,
                   rows: float, x_low: float, y_low: Num, what: str, source: str) -> DynamicFactors[Num]:
    """Linear interpolation of e and Y in a Table 3 block, clamped (and flagged) at its ends;
    Y≤e from its own column where the block has one, else ``y_low``."""
    index, formula, xp = _index(fa, c0, f0, block, rows)
    e = interp(index, xp, block.e)
    y = interp(index, xp, block.y)
    if block.y_low is not None:
        y_low = interp(index, xp, block.y_low)
    basis = f"{what} table by {formula}"
    return DynamicFactors(e, x_low, y_low, x_high, y, basis, source, index, formula,
                          _clamp_flag(index, xp[0], xp[-1]), (xp, block.e, block.y, block.y_low))


# ISO 281:2007 Table 3 for α ≠ 0 (from memory): X≤e = 1, and (Y≤e, X>e, Y>e) with each Y a
# multiple of cot α; e = 1.5·tan α for all three.
_SINGLE_ROW_ROLLER = (0.0, 0.4, 0.4)
_DOUBLE_ROW_ROLLER = (0.45, 0.67, 0.67)
_SELF_ALIGNING_BALL = (0.42, 0.65, 0.65)


def _angle_form(kind: Kind, arrangement: Arrangement) -> tuple[tuple[float, float, float], str]:
    """The Table 3 closed form (Y≤e, X>e, Y>e over cot α) of an angled radial bearing, and its source."""
    if kind is Kind.SELF_ALIGNING:
        return _SELF_ALIGNING_BALL, "ISO 281:2007 Table 3 (self-aligning ball)"
    if arrangement is not Arrangement.SINGLE:
        return _DOUBLE_ROW_ROLLER, "ISO 281:2007 §7.2 (radial roller, double row, α ≠ 0)"
    return _SINGLE_ROW_ROLLER, "ISO 281:2007 §7.2 (radial roller, single row, α ≠ 0)"


def makers_y_is_per_row(kind: Kind, arrangement: Arrangement) -> bool:
    """True where the maker's Y is a single row's (a tapered bearing of a pair or double-row set,
    as catalogues print Y for one bearing), false where it is the whole bearing's Y for Fa/Fr > e
    (single-row bearings, and spherical and self-aligning bearings, which are double-row units)."""
    return kind is Kind.TAPERED and arrangement is not Arrangement.SINGLE


def _angle_factors(kind: Kind, arrangement: Arrangement, alpha_deg: float,
                   e_given: float | None, y_given: float | None) -> DynamicFactors[float]:
    """Self-aligning ball, tapered and spherical roller: e = 1.5·tan α, Y ∝ cot α (Table 3).

    The maker's e replaces 1.5·tan α; the maker's Y replaces Y>e — for a tapered pair or
    double-row set it is the single row's Y, and the set's factors follow the closed forms'
    ratios: Y>e = (0.67/0.4)·Y, Y≤e = (0.45/0.4)·Y.
    """
    tan_a = tand(alpha_deg)
    (low, high_x, high), source = _angle_form(kind, arrangement)
    e = 1.5 * tan_a if e_given is None else e_given
    if y_given is None:
        y_high = high / tan_a
    elif makers_y_is_per_row(kind, arrangement):
        y_high = y_given * high / _SINGLE_ROW_ROLLER[2]
    else:
        y_high = y_given
    y_low = y_high * low / high  # both rows scale with cot α
    if e_given is not None or y_given is not None:
        basis = "maker's e and Y" if (e_given is not None and y_given is not None) else (
            "maker's e, Y from α" if e_given is not None else "e from α, maker's Y")
    else:
        basis = f"α = {alpha_deg:g}°: e = 1.5·tan α, Y ∝ cot α"
    x_low = 1.0
    return DynamicFactors(e, x_low, y_low, high_x, y_high, basis, source)


def makers_factor_warnings(factors: DynamicFactors[float], kind: Kind, arrangement: Arrangement,
                           alpha_deg: float | None, e_given: float | None,
                           y_given: float | None) -> list[str]:
    """Where the maker's e and Y disagree with each other or with the contact angle.

    With each other: ISO 281 Table 3 makes P continuous at Fa/Fr = e (X≤·Fr + Y≤·Fa =
    X>·Fr + Y>·Fa there); a jump of more than 5 % says e and Y do not belong together.  With the
    angle (when one is given as well): e = 1.5·tan α and Y = the closed form's multiple of cot α,
    more than 10 % apart.
    """
    if e_given is None and y_given is None:
        return []
    warnings = []
    low_side = factors.x_low + factors.y_low * factors.e
    high_side = factors.x_high + factors.y_high * factors.e
    jump = abs(high_side - low_side) / low_side
    if jump > 0.05:
        row = "per row " if makers_y_is_per_row(kind, arrangement) else ""
        warnings.append(
            f"maker's e = {factors.e:.3g} and Y {row}= {y_given if y_given is not None else factors.y_high:.3g} "
            f"disagree: P jumps by {100 * jump:.0f} % at Fa/Fr = e (Table 3 keeps it continuous)")
    if alpha_deg is not None:
        tan_a = tand(alpha_deg)
        (_, _, high), _ = _angle_form(kind, arrangement)
        if e_given is not None and abs(e_given / (1.5 * tan_a) - 1.0) > 0.10:
            warnings.append(f"maker's e = {e_given:.3g} differs from 1.5·tan α = {1.5 * tan_a:.3g} "
                            f"at α = {alpha_deg:g}° by more than 10 %")
        if y_given is not None:
            per_row = makers_y_is_per_row(kind, arrangement)
            closed = (_SINGLE_ROW_ROLLER[2] if per_row else high) / tan_a
            form = "0.4·cot α" if per_row else f"{high:g}·cot α"
            if abs(y_given / closed - 1.0) > 0.10:
                warnings.append(f"maker's Y = {y_given:.3g} differs from {form} = {closed:.3g} "
                                f"at α = {alpha_deg:g}° by more than 10 %")
    return warnings


def _thrust_factors(kind: Kind, alpha_deg: float) -> DynamicFactors[float]:
    """Thrust bearings: α = 90° gives P = Fa; α < 90° has only the Fa/Fr > e branch (Table 3)."""
    if abs(alpha_deg - 90.0) < 1e-9:
        return DynamicFactors(0.0, 0.0, 1.0, 0.0, 1.0, "α = 90°: P = Fa",
                              f"{load_clause(kind)} (thrust, α = 90°)")
    tan_a = tand(alpha_deg)
    if kind is Kind.THRUST_ROLLER:
        if not 45.0 <= alpha_deg < 90.0:
            raise InputError("contact_angle", "a thrust roller bearing needs 45° ≤ α ≤ 90°")
        return DynamicFactors(1.5 * tan_a, math.nan, math.nan, tan_a, 1.0,
                              f"α = {alpha_deg:g}°: e = 1.5·tan α, X = tan α, Y = 1",
                              "ISO 281:2007 §8.2 (thrust roller, α ≠ 90°)")
    angle = round(alpha_deg)
    if abs(alpha_deg - angle) > 1e-9 or angle not in T.THRUST_BALL_X:
        listed = ", ".join(f"{a}°" for a in T.THRUST_BALL_X)
        raise InputError("contact_angle",
                         f"thrust ball factors are tabulated at {listed} and 90°, not {alpha_deg:g}°")
    return DynamicFactors(1.25 * tan_a, math.nan, math.nan, T.THRUST_BALL_X[angle], 1.0,
                          f"α = {angle}°: e = 1.25·tan α", "ISO 281:2007 §6.2 (thrust ball, α ≠ 90°)")


def rotation_factor(kind: Kind, outer_ring_rotates: bool) -> float:
    """V (common practice, older practice; ISO 281:2007 no longer carries it): 1.2 for a radial
    bearing whose outer ring rotates relative to the load, cylindrical roller bearings included
    (P = V·Fr); 1 otherwise, and always 1 for self-aligning ball and thrust bearings."""
    if outer_ring_rotates and rotation_factor_refusal(kind) is None:
        return T.ROTATION_FACTOR_OUTER_RING
    return 1.0


def rotation_factor_refusal(kind: Kind) -> str | None:
    """Why a rotating outer ring changes nothing for ``kind`` (V = 1), or None where V applies."""
    if kind in THRUST_KINDS:
        return "thrust bearings have no rotation factor"
    if kind is Kind.SELF_ALIGNING:
        return "the older tables take V = 1 for self-aligning ball bearings (from memory)"
    return None


@overload
def equivalent_dynamic_load(factors: DynamicFactors[float], fr: float, fa: float,
                            v: float = 1.0) -> tuple[float, float, bool]: ...
@overload
def equivalent_dynamic_load(factors: DynamicFactors[Num], fr: FloatArray, fa: Num,
                            v: Num = 1.0) -> tuple[FloatArray, FloatArray, BoolArray]: ...
@overload
def equivalent_dynamic_load(factors: DynamicFactors[Num], fr: Num, fa: Num,
                            v: Num = 1.0) -> tuple[Num, Num, Truth]: ...
def equivalent_dynamic_load(factors: DynamicFactors[Num], fr: Num, fa: Num,
                            v: Num = 1.0) -> tuple[Num, Num, Truth]:
    """P = X·V·Fr + Y·Fa with X, Y from the side of e that Fa/(V·Fr) falls on (ISO 281:2007 §6).

    Returns ``(P, ratio, high)`` where ``high`` is true on the Fa/(V·Fr) > e branch.  Fr = 0 with
    Fa > 0 gives ratio = ∞, so the > e branch: P = Y·Fa.
    """
    ratio = safe_ratio(fa, v * fr)
    high = ratio > factors.e
    x = where(high, factors.x_high, factors.x_low)
    y = where(high, factors.y_high, factors.y_low)
    return x * v * fr + y * fa, ratio, high


@overload
def dynamic_load(kind: Kind, factors: DynamicFactors[float], fr: float, fa: float,
                 v: float = 1.0) -> tuple[float, float, bool, bool]: ...
@overload
def dynamic_load(kind: Kind, factors: DynamicFactors[Num], fr: FloatArray, fa: Num,
                 v: Num = 1.0) -> tuple[FloatArray, FloatArray, BoolArray, Truth]: ...
def dynamic_load(kind: Kind, factors: DynamicFactors[Num], fr: Num, fa: Num,
                 v: Num = 1.0) -> tuple[Num, Num, Truth, Truth]:
    """P for ``kind``: V·Fr for a cylindrical roller bearing (α = 0, ISO 281:2007 §7.2), else
    :func:`equivalent_dynamic_load` (ISO 281:2007 §5.2–§8.2).

    Returns ``(P, ratio, high, possible)``; ``possible`` is false where a single-direction thrust
    bearing meets Fa/(V·Fr) ≤ e, a load it cannot carry (ISO 281:2007 §6.2, §8.2).
    """
    p, ratio, high = equivalent_dynamic_load(factors, fr, fa, v)
    if kind is Kind.CYLINDRICAL:
        return v * fr, ratio, high, True
    return p, ratio, high, (high if kind in THRUST_KINDS else True)


def aiso_load_divisor(kind: Kind) -> float:
    """The divisor on eC·Cu/P in aISO: 3 thrust ball, 2.5 thrust roller, 1 radial (ISO 281:2007 §9.3.2)."""
    if kind is Kind.THRUST_BALL:
        return 3.0
    if kind is Kind.THRUST_ROLLER:
        return 2.5
    return 1.0


@dataclass(slots=True)
class StaticFactors:
    """X0 and Y0 with their source; ``radial`` bearings also obey P0 ≥ Fr."""

    x0: float
    y0: float
    radial: bool
    source: str


def static_factors(kind: Kind, arrangement: Arrangement, alpha_deg: float) -> StaticFactors:
    """X0, Y0 by ISO 76:2006 §5.2–§8.2 for each kind (from memory; deep-groove row consistent with maker data)."""
    paired = arrangement in (Arrangement.BACK_TO_BACK, Arrangement.FACE_TO_FACE,
                             Arrangement.DOUBLE_ROW)
    if kind is Kind.DEEP_GROOVE:
        return StaticFactors(T.DEEP_GROOVE_X0, T.DEEP_GROOVE_Y0, True, f"{static_clause(kind)} (radial ball)")
    if kind is Kind.ANGULAR_CONTACT:
        y0 = T.ANGULAR_Y0_SINGLE[round(alpha_deg)]
        if paired:
            return StaticFactors(1.0, 2.0 * y0, True, f"{static_clause(kind)} (angular-contact pair)")
        return StaticFactors(T.ANGULAR_X0_SINGLE, y0, True, f"{static_clause(kind)} (angular-contact)")
    if kind is Kind.CYLINDRICAL:
        return StaticFactors(1.0, 0.0, True, f"{static_clause(kind)} (radial roller, α = 0)")
    if kind in THRUST_KINDS:
        tan_a = tand(alpha_deg) if alpha_deg < 90 else math.inf
        x0 = 0.0 if alpha_deg >= 90 else 2.3 * tan_a
        return StaticFactors(x0, 1.0, False, static_clause(kind))
    cot_a = 1.0 / tand(alpha_deg)
    if kind is Kind.SELF_ALIGNING:
        return StaticFactors(1.0, 0.44 * cot_a, True, f"{static_clause(kind)} (self-aligning ball)")
    if paired:
        return StaticFactors(1.0, 0.44 * cot_a, True, f"{static_clause(kind)} (radial roller, double row)")
    return StaticFactors(0.5, 0.22 * cot_a, True, f"{static_clause(kind)} (radial roller, single row)")


@overload
def equivalent_static_load(factors: StaticFactors, fr: float, fa: float) -> tuple[float, bool]: ...
@overload
def equivalent_static_load(factors: StaticFactors, fr: FloatArray, fa: FloatArray) -> tuple[FloatArray, Truth]: ...
def equivalent_static_load(factors: StaticFactors, fr: Num, fa: Num) -> tuple[Num, Truth]:
    """P0 = X0·Fr + Y0·Fa, and P0 = Fr for radial bearings when that is larger (ISO 76:2006 §5.2, §7.2).

    Returns ``(P0, floored)`` where ``floored`` is true where the P0 ≥ Fr rule applied.
    """
    combined = factors.x0 * fr + factors.y0 * fa
    if not factors.radial:
        return combined, False
    floored = combined < fr
    return where(floored, fr, combined), floored
