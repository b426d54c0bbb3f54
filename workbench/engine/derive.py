"""derive(case): the whole combined-load calculation of one load case, step by step.

Inputs are plain floats in the engine's units (N, mm, r/min, h, mm²/s, °C, degrees); the output is
a :class:`~workbench.engine.record.Derivation` whose ``results`` hold the contract names
``P e X Y L10 L10h Lnm P0 s0`` and more.  Standards: ISO 281:2007 (dynamic rating, life, a1, aISO),
ISO 76:2006 (static), ISO 3448 / ASTM D341 / ASTM D2270 (viscosity), three-parameter Weibull.
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass, fields
from functools import lru_cache

from . import tables as T
from . import viscosity
from .explain import aiso_words, table_lookup
from .kinds import (
    DEFAULT_CONTACT_ANGLE, KIND_WORDS, ROLLER_KINDS, THRUST_KINDS, Arrangement, DynamicFactors,
    Kind, StaticFactors, aiso_load_divisor, contact_angle_from_e, dynamic_factors, dynamic_load,
    equivalent_static_load, life_clause, life_exponent, load_clause, makers_factor_warnings,
    is_bearing_set, makers_y_is_per_row, parse_arrangement, parse_kind, rating_clause,
    rotation_factor, rotation_factor_refusal, set_exponent_words, set_words, static_factors,
    static_rating_clause,
)
from .life import (
    KAPPA_MAX, KAPPA_MIN, a1_iso281, aiso, basic_rating_life, contamination_factor,
    fatigue_load_limit_estimate, kappa_in_range, life_hours, reference_viscosity,
    weibull_life_factor,
)
from .record import Derivation, InputError, StepWords, fmt

NAN = math.nan
RELIABILITY_MODELS = ("iso281", "weibull")

# Read once here, not on every derive() (the solver and the sensitivity sweep run dozens a call):
# an Enum member read off its class costs ~0.1 µs on Python 3.11, a clause f-string ~0.3 µs.
_CYLINDRICAL = Kind.CYLINDRICAL
_ANGLED_RADIAL_KINDS = frozenset({Kind.SELF_ALIGNING, Kind.TAPERED, Kind.SPHERICAL})
_PAIRED_ARRANGEMENTS = frozenset({Arrangement.BACK_TO_BACK, Arrangement.FACE_TO_FACE})
MODIFIED_LIFE_SOURCE = "ISO 281:2007 §9.1"
"""The clause of the modified rating life Lnm = a1·aISO·L10."""
_LOAD_CLAUSE: dict[Kind, str] = {kind: load_clause(kind) for kind in Kind}
_LIFE_CLAUSE: dict[Kind, str] = {kind: life_clause(kind) for kind in Kind}
_AISO_LOAD_DIVISOR: dict[Kind, float] = {kind: aiso_load_divisor(kind) for kind in Kind}
# X0, Y0 hang on the kind, the arrangement and α alone: the same few in every derive() of a session.
_static_factors = lru_cache(maxsize=64)(static_factors)


@dataclass(frozen=True, slots=True)
class CaseInputs:
    """Everything one load case needs, in engine units.  ``None`` means "not given"."""

    kind: str = "deep-groove"
    arrangement: str = "single"
    fr: float = 0.0                 # N, radial load
    fa: float = 0.0                 # N, axial load
    c: float = 0.0                  # N, basic dynamic load rating
    c0: float = 0.0                 # N, basic static load rating
    f0: float | None = None         # ISO 76 factor f0 (deep-groove, 15° angular-contact)
    contact_angle: float | None = None  # degrees
    e_given: float | None = None    # maker's e (tapered, spherical, self-aligning)
    y_given: float | None = None    # maker's Y for Fa/Fr > e
    speed: float = 0.0              # r/min; 0 leaves hours undefined
    af: float = 1.0                 # application factor on P
    outer_ring_rotates: bool = False  # rotation factor V = 1.2 (older practice)
    reliability: float = 0.90
    reliability_model: str = "iso281"
    weibull_x0: float = T.WEIBULL_X0
    weibull_theta: float = T.WEIBULL_THETA
    weibull_b: float = T.WEIBULL_B
    rating_life_mrev: float = 1.0   # LR, the rating basis life of C (Weibull model), 10⁶ rev
    nu: float | None = None         # operating viscosity, mm²/s (overrides vg/temp)
    vg: float | None = None         # ISO VG grade
    vi: float | None = None         # viscosity index (default 100 when vg is given)
    nu100: float | None = None      # viscosity at 100 °C, mm²/s (instead of vi)
    temp: float | None = None       # operating temperature, °C
    dm: float | None = None         # mean diameter (d + D)/2, mm
    cu: float | None = None         # fatigue load limit, N
    cleanliness: str | None = None  # named level from tables.CONTAMINATION_LEVELS
    ec: float | None = None         # contamination factor eC as a number
    static_duty: str = "normal"     # key of tables.STATIC_SAFETY_MINIMUMS
    s0_min: float | None = None     # required static safety, overrides the duty's minimum


NUMERIC_INPUTS: tuple[str, ...] = tuple(
    f.name for f in fields(CaseInputs)
    if f.name not in ("kind", "arrangement", "reliability_model", "cleanliness", "static_duty",
                      "outer_ring_rotates")
)


def _check(name: str, value: float | None, *, positive: bool = False, optional: bool = False) -> None:
    """Refuse non-finite or negative numbers (and zero where ``positive``), naming the input."""
    if value is None:
        if optional:
            return
        raise InputError(name, "a value is needed")
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        raise InputError(name, f"expected a number, got {value!r}")
    if not math.isfinite(value):
        raise InputError(name, "must be a finite number")
    if value < 0 or (positive and value == 0):
        raise InputError(name, "must be greater than zero" if positive else "must not be negative")


_NON_NEGATIVE = ("fr", "fa", "speed")
_POSITIVE = ("c", "c0", "af")
_OPTIONAL_POSITIVE = ("f0", "e_given", "y_given", "nu", "vg", "nu100", "dm", "cu", "s0_min")
_OPTIONAL_NON_NEGATIVE = ("vi", "ec", "contact_angle")
_INF = math.inf
SPEED_MISSING = "no speed (n is blank or 0)"
"""What a life in hours lacks at n = 0: a blank speed field reaches the engine as 0."""


def _plain(value: object, low_open: bool) -> bool:
    """Fast test: a real finite number ≥ 0 (> 0 when ``low_open``); anything else goes to _check."""
    if type(value) is not float and type(value) is not int:
        return False
    return (0.0 < value < _INF) if low_open else (0.0 <= value < _INF)


def validate(case: CaseInputs) -> tuple[Kind, Arrangement, float]:
    """Check every input at the engine's door; return the kind, arrangement and contact angle."""
    kind = parse_kind(case.kind)
    arrangement = parse_arrangement(kind, case.arrangement)
    for name in _NON_NEGATIVE:
        if not _plain(getattr(case, name), False):
            _check(name, getattr(case, name))
    for name in _POSITIVE:
        if not _plain(getattr(case, name), True):
            _check(name, getattr(case, name), positive=True)
    for name in _OPTIONAL_POSITIVE:
        value = getattr(case, name)
        if value is not None and not _plain(value, True):
            _check(name, value, positive=True)
    for name in _OPTIONAL_NON_NEGATIVE:
        value = getattr(case, name)
        if value is not None and not _plain(value, False):
            _check(name, value)
    if case.temp is not None and not (math.isfinite(case.temp) and -60.0 <= case.temp <= 250.0):
        raise InputError("temp", "operating temperature must lie between −60 °C and 250 °C")
    if case.ec is not None and case.ec > 1.0:
        raise InputError("ec", "eC lies between 0 and 1")
    if case.cleanliness is not None and case.cleanliness not in T.CONTAMINATION_LEVELS:
        names = ", ".join(T.CONTAMINATION_LEVELS)
        raise InputError("cleanliness", f"unknown level {case.cleanliness!r}; use one of {names} or a number")
    if case.static_duty not in T.STATIC_SAFETY_MINIMUMS:
        names = ", ".join(T.STATIC_SAFETY_MINIMUMS)
        raise InputError("static_duty", f"unknown duty {case.static_duty!r}; use one of {names}")
    if case.reliability_model not in RELIABILITY_MODELS:
        raise InputError("reliability_model", "use iso281 or weibull")
    if not _plain(case.reliability, True):
        _check("reliability", case.reliability, positive=True)
    if case.reliability_model == "iso281":
        if not T.RELIABILITY_MIN <= case.reliability <= T.RELIABILITY_MAX + 1e-12:
            raise InputError("reliability",
                             "ISO 281 a1 covers 0.90 to 0.9995; use the Weibull model outside it")
    else:
        if not case.reliability < 1.0:
            raise InputError("reliability", "must be below 1 (certain survival has no finite life)")
        for name in ("weibull_theta", "weibull_b", "rating_life_mrev"):
            _check(name, getattr(case, name), positive=True)
        _check("weibull_x0", case.weibull_x0)
        if case.weibull_x0 >= case.weibull_theta:
            raise InputError("weibull_x0", "x0 must be below θ")
        try:
            factor = reliability_life_factor(case)
        except OverflowError:
            factor = _INF
        if not factor < _INF:
            raise InputError("weibull_b", f"(ln 1/R)^(1/b) is beyond the largest number at "
                                          f"R = {case.reliability:g}: b is too small")
    alpha = case.contact_angle
    if alpha is None:
        alpha = DEFAULT_CONTACT_ANGLE[kind]
    if alpha is None:
        if case.e_given is None:
            raise InputError("contact_angle",
                             f"a {KIND_WORDS[kind]} needs its contact angle or the maker's e")
        alpha = contact_angle_from_e(case.e_given)
    if kind in _ANGLED_RADIAL_KINDS and not 0.0 < alpha < 90.0:
        raise InputError("contact_angle", "must lie between 0° and 90° for this kind")
    if kind in THRUST_KINDS and alpha > 90.0:
        raise InputError("contact_angle", "cannot exceed 90°")
    if case.fr == 0.0 and case.fa == 0.0:
        raise InputError("fr", "Fr and Fa are both zero: there is no load to rate")
    if kind is _CYLINDRICAL and case.fr == 0.0:
        raise InputError("fa", "a cylindrical roller bearing cannot carry a purely axial load")
    if kind in THRUST_KINDS and alpha >= 90.0 and case.fr > 0.0:
        raise InputError("fr", f"a {KIND_WORDS[kind]} with α = 90° takes no radial load")
    if kind in THRUST_KINDS and case.fa == 0.0:
        raise InputError("fa", f"a {KIND_WORDS[kind]} needs an axial load")
    return kind, arrangement, alpha


def derive(case: CaseInputs, keep_steps: bool = True) -> Derivation:
    """The full derivation of one load case (ISO 281:2007, ISO 76:2006); InputError on bad input.

    ``keep_steps=False`` records results and warnings only, for callers that read nothing else:
    each step's words are then never composed (see :meth:`Derivation.derived`).
    """
    kind, arrangement, alpha = validate(case)
    d = Derivation(keep_steps)
    _dynamic_load(d, case, kind, arrangement, alpha)
    p = d.results["P"]
    p_eff = p * case.af
    if case.af != 1.0:
        d.derived("P_eff", p_eff, lambda: StepWords(
            symbol="af·P", label="Load with the application factor", formula="af·P",
            template="{0} × {1:N}", args=(case.af, p), unit="N", source="common practice",
            note=T.APPLICATION_FACTOR_HINT))
    if not p_eff > 0.0:  # a load that rounds to zero: C/P would divide by it
        raise InputError("af" if case.af != 1.0 else "fr", "af·P rounds to zero: too small to rate")
    exponent = life_exponent(kind)
    rating_mrev = rating_basis_mrev(case)
    l10 = _finite_life(rating_mrev * basic_rating_life(case.c, p_eff, exponent), "L10", case)
    d.derived("L10", l10, lambda: _l10_words(case, kind, arrangement, rating_mrev, p_eff, exponent))
    _hours(d, "L10h", "L10h", "Basic rating life in hours", l10, case.speed, kind)
    a_rel = _reliability(d, case)
    a_iso = _lubrication(d, case, kind, p_eff)
    lnm_mrev = _finite_life(a_rel * a_iso * l10, "Lnm", case)
    d.derived("Lnm_mrev", lnm_mrev, lambda: StepWords(
        symbol="Lnm", label="Modified rating life", formula="a1·aISO·L10",
        template="{0} × {1} × {2}", args=(a_rel, a_iso, l10), unit="10⁶ rev",
        source=MODIFIED_LIFE_SOURCE))
    _hours(d, "Lnm", "Lnm", "Modified rating life in hours", lnm_mrev, case.speed, kind)
    _static(d, case, kind, arrangement, alpha)
    return d


def above_e(results: Mapping[str, float]) -> bool | None:
    """The side of the e switch a derivation's ``results`` sit on (ISO 281:2007 §5.2): true for
    Fa/Fr > e, false for Fa/Fr ≤ e, None where no ratio was compared with e."""
    if "ratio" not in results:
        return None
    return results["ratio"] > results["e"]


def set_rating_words(kind: Kind, arrangement: Arrangement, symbol: str) -> str:
    """Whose rating C or C0 (``symbol``) is for a set of bearings mounted as a unit: the set's,
    with the relation to one bearing's (ISO 281:2007 §5.1/§7.1, ISO 76:2006 §5.1/§7.1, bearing
    combinations); "" for a single or double-row bearing, whose rating is its own."""
    if not is_bearing_set(arrangement):
        return ""
    if symbol == "C0":
        return (f"C0 is the whole {set_words(arrangement)}'s rating: 2 × one bearing's C0 "
                f"({static_rating_clause(kind)}, bearing combinations)")
    return (f"C is the whole {set_words(arrangement)}'s rating: 2^{set_exponent_words(kind)} × "
            "one bearing's C "
            f"({rating_clause(kind)}, bearing combinations)")


def _l10_words(case: CaseInputs, kind: Kind, arrangement: Arrangement, rating_mrev: float,
               p_eff: float, exponent: float) -> StepWords:
    p_word = "10/3 (roller)" if kind in ROLLER_KINDS else "3 (ball)"
    whose = set_rating_words(kind, arrangement, "C")
    whose = f"; {whose}" if whose else ""
    if rating_mrev != 1.0:
        return StepWords(
            symbol="L10", label="Basic rating life", formula="LR·(C/P)^p",
            template="{0} × ({1:N} / {2:N})^{3}", args=(rating_mrev, case.c, p_eff, exponent),
            unit="10⁶ rev", source=_LIFE_CLAUSE[kind],
            note=f"p = {p_word}; C rated at LR = {rating_mrev:g}·10⁶ revolutions{whose}")
    return StepWords(
        symbol="L10", label="Basic rating life", formula="(C/P)^p", template="({0:N} / {1:N})^{2}",
        args=(case.c, p_eff, exponent), unit="10⁶ rev", source=_LIFE_CLAUSE[kind],
        note=f"p = {p_word}{whose}")


def _dynamic_load(d: Derivation, case: CaseInputs, kind: Kind, arrangement: Arrangement,
                  alpha: float) -> None:
    """Steps for V, the Table 3 index, e, the branch, X, Y and P (ISO 281:2007 §5.2–§8.2, Table 3)."""
    factors = dynamic_factors(kind, arrangement, alpha, case.fa, case.c0, case.f0,
                              case.e_given, case.y_given)
    v = rotation_factor(kind, case.outer_ring_rotates)
    p, ratio, high, possible = dynamic_load(kind, factors, case.fr, case.fa, v)
    if case.outer_ring_rotates:
        _rotation_step(d, kind, v)
    if kind is _CYLINDRICAL:
        d.derived("P", p, lambda: StepWords(
            symbol="P", label="Equivalent dynamic load",
            formula="P = V·Fr (α = 0)" if v != 1.0 else "P = Fr (α = 0)",
            template="{0} × {1:N}" if v != 1.0 else "{1:N}", args=(v, case.fr), unit="N",
            source=factors.source, note=_cylindrical_axial_note(case)),
            warning=_cylindrical_axial_warning(case))
        d.results.update(e=NAN, X=1.0, Y=0.0)
        return
    if kind in THRUST_KINDS and alpha >= 90.0:
        d.derived("P", case.fa, lambda: StepWords(
            symbol="P", label="Equivalent dynamic load", formula="P = Fa (α = 90°)",
            template="{0:N}", args=(case.fa,), unit="N", source=factors.source))
        d.results.update(e=NAN, X=0.0, Y=1.0)
        return
    if not possible:  # refused before any step is recorded: a refused case has no derivation
        raise InputError("fa", f"a single-direction {KIND_WORDS[kind]} needs Fa/Fr > e "
                               f"({ratio:.3g} ≤ {factors.e:.3g})")
    x = factors.x_high if high else factors.x_low
    y = factors.y_high if high else factors.y_low
    warning = None
    if factors.clamped and (high or factors.clamped > 0) and case.fa > 0:
        warning = f"{factors.index_formula} lies outside the table; e and Y clamped at its end"
    if kind in _ANGLED_RADIAL_KINDS:
        warning = "; ".join(makers_factor_warnings(
            factors, kind, arrangement, case.contact_angle, case.e_given, case.y_given)) or None
    tabulated = factors.columns is not None and case.fa > 0  # no axial load: no table look-up
    if tabulated:
        d.derived("index", factors.index, lambda: _index_words(case, arrangement, factors))
    d.derived("e", factors.e, lambda: _factor_words("e", "Limit ratio e", factors, 1, tabulated))
    vfr = "(V·Fr)" if v != 1.0 else "Fr"  # Fa/(V·Fr): V multiplies Fr, not the quotient
    side = f"Fa/{vfr} > e" if high else f"Fa/{vfr} ≤ e"
    d.derived("ratio", ratio, lambda: StepWords(
        symbol=f"Fa/{vfr}", label="Axial-to-radial load ratio",
        formula=f"Fa/{vfr}, compared with e", template="{0:N} / {1:N}", args=(case.fa, v * case.fr),
        source=_LOAD_CLAUSE[kind], note=f"branch: {side}"))
    d.derived("X", x, lambda: StepWords(
        symbol="X", label=f"Radial factor ({side})", formula=f"Table 3, {side}", template="{0}",
        args=(x,), source=factors.source))
    d.derived("Y", y, lambda: _factor_words(
        "Y", f"Axial factor ({side})", factors, 2 if high else 3, tabulated,
        _makers_y_note(case, kind, arrangement)), warning=warning)
    if v != 1.0:
        d.derived("P", p, lambda: StepWords(
            symbol="P", label="Equivalent dynamic load", formula="X·V·Fr + Y·Fa",
            template="{0} × {1} × {2:N} + {3} × {4:N}", args=(x, v, case.fr, y, case.fa),
            unit="N", source=_LOAD_CLAUSE[kind]))
    else:
        d.derived("P", p, lambda: StepWords(
            symbol="P", label="Equivalent dynamic load", formula="X·Fr + Y·Fa",
            template="{0} × {1:N} + {2} × {3:N}", args=(x, case.fr, y, case.fa), unit="N",
            source=_LOAD_CLAUSE[kind]))


def _factor_words(symbol: str, label: str, factors: DynamicFactors[float], column: int, tabulated: bool,
                  note: str | None = None) -> StepWords:
    """e or Y: read from its Table 3 column with the bracketing rows (``column`` 1 e, 2 Y>e,
    3 Y≤e of a pair), or the closed form or fixed row that gave it."""
    value = factors.e if column == 1 else (factors.y_high if column == 2 else factors.y_low)
    columns = factors.columns
    read = None if columns is None else columns[column]
    if not tabulated or columns is None or read is None:
        return StepWords(symbol=symbol, label=label, formula=factors.basis, template="{0}",
                         args=(value,), source=factors.source, note=note)
    words = table_lookup(symbol, factors.index_formula, float(factors.index), columns[0], read,
                         "Table 3")
    notes = "; ".join(n for n in (words.note, note) if n) or None
    return StepWords(symbol=symbol, label=label, formula=f"{factors.basis}: {words.formula}",
                     template=words.template, args=words.args, source=factors.source, note=notes)


_ROTATION_SOURCE = "common practice (older practice; ISO 281:2007 no longer carries V)"


def _rotation_step(d: Derivation, kind: Kind, v: float) -> None:
    """The step for V when the outer ring rotates: 1.2 where V applies, else 1 with a warning."""
    refusal = rotation_factor_refusal(kind)
    if refusal is None:
        d.derived("V", v, lambda: StepWords(
            symbol="V", label="Rotation factor", formula="outer ring rotates relative to the load",
            template="{0}", args=(v,), source=_ROTATION_SOURCE,
            note="V multiplies Fr in the branch test and in X·V·Fr"))
        return
    d.derived("V", v, lambda: StepWords(
        symbol="V", label="Rotation factor", formula="not applied", template="{0}", args=(v,),
        source=_ROTATION_SOURCE, note=f"outer ring rotates, but {refusal}"),
        warning=f"outer ring rotation ignored: {refusal}; V = 1 used")


def _index_words(case: CaseInputs, arrangement: Arrangement, factors: DynamicFactors[float]) -> StepWords:
    """The Table 3 index step: i·f0·Fa/C0r with f0 known, else the printed i·Fa/C0r column."""
    rows = 2.0 if arrangement in _PAIRED_ARRANGEMENTS else 1.0
    formula = factors.index_formula
    label = f"Table 3 index {formula}"
    if case.f0 is not None:
        template = "{0} × {1} × {2:N} / {3:N}" if rows != 1.0 else "{1} × {2:N} / {3:N}"
        return StepWords(symbol=formula, label=label, formula=formula, template=template,
                         args=(rows, case.f0, case.fa, case.c0), source=factors.source)
    template = "{0} × {1:N} / {2:N}" if rows != 1.0 else "{1:N} / {2:N}"
    return StepWords(symbol=formula, label=label,
                     formula=f"{formula} (no f0 given: the printed Fa/C0r column)",
                     template=template, args=(rows, case.fa, case.c0), source=factors.source)


def _makers_y_note(case: CaseInputs, kind: Kind, arrangement: Arrangement) -> str | None:
    """Whose Y the maker's Y is: a row's (tapered pairs and double-row sets) or the bearing's."""
    if case.y_given is None:
        return None
    if makers_y_is_per_row(kind, arrangement):
        return (f"maker's Y = {case.y_given:g} taken per row; the set's Y>e = (0.67/0.4)·Y and "
                "Y≤e = (0.45/0.4)·Y (ISO 281 Table 3 ratios)")
    return f"maker's Y = {case.y_given:g} taken for the whole bearing, Fa/Fr > e"


def _cylindrical_axial_note(case: CaseInputs) -> str | None:
    """P leaves a cylindrical roller bearing's axial load out: the flanges carry it, and their
    capacity is the maker's to state (ISO 281 rates the rollers only)."""
    if case.fa <= 0.0:
        return None
    return (f"Fa = {fmt(case.fa)} N is not in P: flanges must carry it; check their axial "
            "capacity with the maker's data")


def _cylindrical_axial_warning(case: CaseInputs) -> str | None:
    """Axial load on a cylindrical roller bearing is carried by ribs only: warn beyond the limit."""
    if case.fa <= 0.0:
        return None
    limit = T.CYLINDRICAL_AXIAL_RATIO_LIMIT
    if case.fa > limit * case.fr:
        return (f"Fa/Fr = {case.fa / case.fr:.3g} exceeds {limit:g}: more axial load than ribs of a "
                "cylindrical roller bearing commonly carry (common practice); check the maker's limit")
    return None


def _finite_life(life_mrev: float, symbol: str, case: CaseInputs) -> float:
    """``life_mrev``, refused when it is beyond the largest float: an infinite life is no answer.
    The input named is af when it is below 1 (it divides the life), else C."""
    if not life_mrev < _INF:
        name, words = ("af", "af is too small") if case.af < 1.0 else ("c", "C is too large")
        raise InputError(name, f"{symbol} is beyond the largest number: {words} for these loads")
    return life_mrev


def _hours(d: Derivation, key: str, symbol: str, label: str, life_mrev: float, speed: float,
           kind: Kind) -> None:
    """A life in hours at the case speed, or an undefined value with a warning without one
    (a blank speed field reaches the engine as n = 0, so the words name both)."""
    if speed > 0.0 and not life_hours(life_mrev, speed) < _INF:
        raise InputError("speed", f"{symbol} is beyond the largest number of hours: the speed is "
                                  "too small for this life")
    if speed > 0.0:
        d.derived(key, life_hours(life_mrev, speed), lambda: StepWords(
            symbol=symbol, label=label, formula="L·10⁶/(60·n)", template="{0} × 10⁶ / (60 × {1:r/min})",
            args=(life_mrev, speed), unit="h", source=_LIFE_CLAUSE[kind]))
        return
    d.derived(key, NAN, lambda: StepWords(
        symbol=symbol, label=label, formula="L·10⁶/(60·n)", template=SPEED_MISSING,
        unit="h", source=_LIFE_CLAUSE[kind]),
        warning=f"{SPEED_MISSING}: {symbol} in hours is undefined "
                "(the life in revolutions stands)")


def rating_basis_mrev(case: CaseInputs) -> float:
    """LR, the life in 10⁶ revolutions at which C is rated: 1 under ISO 281, the case's LR under Weibull."""
    return case.rating_life_mrev if case.reliability_model == "weibull" else 1.0


def reliability_life_factor(case: CaseInputs) -> float:
    """a1 (ISO 281:2007 §9.2, Table 12) or the three-parameter Weibull life factor at the case's R."""
    if case.reliability_model == "iso281":
        return a1_iso281(case.reliability)
    return weibull_life_factor(case.reliability, case.weibull_x0, case.weibull_theta, case.weibull_b)


def _reliability(d: Derivation, case: CaseInputs) -> float:
    """a1 by ISO 281:2007 Table 12, or the Weibull life factor, at the requested reliability."""
    return d.derived("a1", reliability_life_factor(case), lambda: _reliability_words(case))


def _reliability_words(case: CaseInputs) -> StepWords:
    r = case.reliability
    if case.reliability_model == "iso281":
        printed = dict(T.A1_TABLE).get(round(100.0 * r, 6))
        note = ("the closed form, unrounded; Table 12 prints it rounded" if printed is None else
                f"the closed form, unrounded; Table 12 prints {printed:g} at {100.0 * r:g} %")
        return StepWords(
            symbol="a1", label="Life factor for reliability (closed form)",
            formula="0.95·(ln(100/R)/ln(100/90))^(2/3) + 0.05",
            template="0.95 × (ln(100/{0}) / ln(100/90))^(2/3) + 0.05", args=(100.0 * r,),
            source="ISO 281:2007 §9.2 (the closed form behind Table 12)", note=note)
    return StepWords(
        symbol="aR", label="Life factor for reliability (Weibull)",
        formula="x0 + (θ − x0)·(ln 1/R)^(1/b)", template="{0} + ({1} − {0}) × (ln 1/{2})^(1/{3})",
        args=(case.weibull_x0, case.weibull_theta, r, case.weibull_b),
        source="three-parameter Weibull, R = exp(−((x − x0)/(θ − x0))^b)",
        note="life at R as a multiple of the rating life")


def operating_viscosity(d: Derivation, case: CaseInputs) -> float | None:
    """ν at operating temperature: given directly, or from ISO VG and VI (ISO 3448, ASTM D341)."""
    given = case.nu  # named, so the check below holds inside the lambda too
    if given is not None:
        return d.derived("nu", given, lambda: StepWords(
            symbol="ν", label="Operating viscosity", formula="given", template="{0:mm²/s}",
            args=(given,), unit="mm²/s", source="input"))
    temp_c = case.temp
    if case.vg is None or temp_c is None:
        return None
    nu40 = viscosity.nu40_of_grade(case.vg)
    vi = 100.0 if case.vi is None else case.vi
    nu100 = case.nu100 if case.nu100 is not None else viscosity.nu100_from_viscosity_index(nu40, vi)
    nu = viscosity.viscosity_at_temperature(nu40, nu100, temp_c)
    walther_a, walther_b = viscosity.walther_constants(nu40, nu100)
    kelvin = temp_c + viscosity.KELVIN_OFFSET
    d.derived("nu40", nu40, lambda: StepWords(
        symbol="ν40", label="Viscosity at 40 °C", formula=f"ISO VG {case.vg:g} midpoint",
        template="{0:mm²/s}", args=(nu40,), unit="mm²/s", source="ISO 3448"))
    if case.nu100 is not None:
        d.derived("nu100", nu100, lambda: StepWords(
            symbol="ν100", label="Viscosity at 100 °C", formula="given", template="{0:mm²/s}",
            args=(nu100,), unit="mm²/s", source="input"))
    else:
        d.derived("nu100", nu100, lambda: StepWords(
            symbol="ν100", label="Viscosity at 100 °C", formula="from ν40 and VI",
            template="VI {0}", args=(vi,), unit="mm²/s", source="ASTM D2270",
            note="VI 100 assumed (no VI given)" if case.vi is None else None))
    d.derived("T", kelvin, lambda: StepWords(
        symbol="T", label="Operating temperature, absolute", formula="T = t + 273.15",
        template="{0:=°C+} + 273.15", args=(temp_c,), unit="K",
        source="ASTM D341 (T in kelvin)"))
    return d.derived("nu", nu, lambda: StepWords(
        symbol="ν", label="Operating viscosity (ASTM D341)",
        formula="ν = 10^(10^(A − B·log10 T)) − 0.7",
        # A and B written to six figures: the double logarithm magnifies their rounding
        template=f"10^(10^({walther_a:.6g} − {walther_b:.6g} × log10 {{0}})) − 0.7", args=(kelvin,),
        unit="mm²/s", source="ASTM D341",
        note=(f"A = {walther_a:.6g}, B = {walther_b:.6g}: the line log10 log10(ν + 0.7) = "
              f"A − B·log10 T through ν40 = {nu40:.4g} and ν100 = {nu100:.4g} mm²/s "
              "(at 313.15 K and 373.15 K)")))


def lubrication_gaps(case: CaseInputs) -> list[str]:
    """What the case lacks for aISO (ISO 281:2007 §9.3), each as what aISO "needs"; empty when
    aISO can be evaluated."""
    missing = []
    if case.nu is None and (case.vg is None or case.temp is None):
        missing.append("the viscosity (ν, or ISO VG with the temperature)")
    if case.dm is None:
        missing.append("the mean diameter dm")
    if case.speed <= 0.0:
        missing.append("a speed above 0")
    if case.ec is None and case.cleanliness is None:
        missing.append("the cleanliness or eC")
    return missing


def _listed(items: list[str]) -> str:
    """Items as a sentence lists them: "a", "a and b", "a, b and c"."""
    return items[0] if len(items) == 1 else f"{', '.join(items[:-1])} and {items[-1]}"


def _lubrication(d: Derivation, case: CaseInputs, kind: Kind, p_eff: float) -> float:
    """aISO from κ, eC, Cu and P (ISO 281:2007 §9.3); 1 with a note when data is missing."""
    missing = lubrication_gaps(case)
    if missing:
        return d.derived("aISO", 1.0, lambda: StepWords(
            symbol="aISO", label="Systems-approach factor", formula="not evaluated", template="1",
            source="ISO 281:2007 §9.3", note=f"aISO = 1: it needs {_listed(missing)}"))
    nu = operating_viscosity(d, case)
    dm = case.dm
    assert nu is not None and dm is not None
    nu1 = reference_viscosity(case.speed, dm)
    kappa = nu / nu1
    used, warning = kappa_in_range(kappa), None
    if kappa < KAPPA_MIN:
        warning = (f"κ = {kappa:.3g} is below {KAPPA_MIN:g}, outside the aISO method; "
                   f"κ = {KAPPA_MIN:g} used")
    low = high = NAN
    if case.ec is not None:
        ec = case.ec
    else:
        assert case.cleanliness is not None
        ec, (low, high) = contamination_factor(case.cleanliness, dm)
    roller = kind in ROLLER_KINDS
    cu = case.cu if case.cu is not None else fatigue_load_limit_estimate(case.c0, dm, roller)
    divisor = _AISO_LOAD_DIVISOR[kind]
    load_ratio = ec * cu / (divisor * p_eff)
    a = aiso(used, load_ratio, roller)
    slow = case.speed < 1000
    d.derived("nu1", nu1, lambda: StepWords(
        symbol="ν1", label="Rated viscosity",
        formula="45000·n^−0.83·dm^−0.5" if slow else "4500·n^−0.5·dm^−0.5",
        template=("45000 × {0:r/min}^−0.83 × ({1:=mm})^−0.5" if slow
                  else "4500 × {0:r/min}^−0.5 × ({1:=mm})^−0.5"),
        args=(case.speed, dm), unit="mm²/s", source="ISO 281:2007 §9.3.3",
        note=("n < 1000 r/min" if slow else "n ≥ 1000 r/min") + "; the relation is stated in mm"))
    if used == kappa:
        d.derived("kappa", used, lambda: StepWords(
            symbol="κ", label="Viscosity ratio", formula="ν/ν1", template="{0:mm²/s} / {1:mm²/s}",
            args=(nu, nu1), source="ISO 281:2007 §9.3.3"))
    else:
        d.derived("kappa_ratio", kappa, lambda: StepWords(
            symbol="ν/ν1", label="Viscosity ratio", formula="ν/ν1",
            template="{0:mm²/s} / {1:mm²/s}", args=(nu, nu1), source="ISO 281:2007 §9.3.3"))
        d.derived("kappa", used, lambda: StepWords(
            symbol="κ", label="Viscosity ratio used for aISO",
            formula=f"ν/ν1 held to {KAPPA_MIN:g} … {KAPPA_MAX:g}", template="{0}", args=(used,),
            source="ISO 281:2007 §9.3.2",
            note=(f"ν/ν1 = {kappa:.3g} lies {'below' if kappa < KAPPA_MIN else 'above'} the range "
                  f"of the aISO method ({KAPPA_MIN:g} to {KAPPA_MAX:g}): κ = {used:g} is used"
                  + (", outside the method" if kappa < KAPPA_MIN else
                     " (more viscosity brings no further gain)"))),
            warning=warning)
    d.derived("eC", ec, lambda: _contamination_words(case, ec, low, high))
    d.derived("Cu", cu, lambda: _fatigue_limit_words(case, cu, roller))
    d.derived("load_ratio", load_ratio, lambda: _load_ratio_words(ec, cu, divisor, p_eff))
    return d.derived("aISO", a, lambda: _aiso_step_words(used, load_ratio, roller, divisor, a))


def _aiso_step_words(kappa: float, load_ratio: float, roller: bool, divisor: float,
                     value: float) -> StepWords:
    words = aiso_words(kappa, load_ratio, roller, divisor, value)
    return StepWords(symbol="aISO", label="Systems-approach factor", formula=words.formula,
                     template=words.template, args=words.args, source="ISO 281:2007 §9.3.2",
                     note=words.note)


def _contamination_words(case: CaseInputs, ec: float, low: float, high: float) -> StepWords:
    if case.ec is not None or case.cleanliness is None or case.dm is None:
        return StepWords(
            symbol="eC", label="Contamination factor", formula="given", template="{0}", args=(ec,),
            source="input")
    return StepWords(
        symbol="eC", label="Contamination factor", formula=T.CONTAMINATION_WORDS[case.cleanliness],
        template="midpoint of {0}–{1}", args=(low, high), source="ISO 281:2007 §9.3.4, Table 13",
        note="dpw ≥ 100 mm column" if case.dm >= 100 else "dpw < 100 mm column")


def _fatigue_limit_words(case: CaseInputs, cu: float, roller: bool) -> StepWords:
    if case.cu is not None or case.dm is None:
        return StepWords(
            symbol="Cu", label="Fatigue load limit", formula="given", template="{0:N}", args=(cu,),
            unit="N", source="input")
    formula = "C0/8.2" if roller else "C0/22"
    template = "{0:N} / 8.2" if roller else "{0:N} / 22"
    if case.dm > 100:
        formula += "·(100/dpw)^0.3" if roller else "·(100/dpw)^0.5"
        template += " × (100 / {1:=mm})^0.3" if roller else " × (100 / {1:=mm})^0.5"
    return StepWords(
        symbol="Cu", label="Fatigue load limit (estimated)", formula=formula,
        template=template, args=(case.c0, case.dm), unit="N",
        source="ISO 281:2007 Annex B (estimate)",
        note="no Cu given: estimated from C0; the maker's value is better")


def _load_ratio_words(ec: float, cu: float, divisor: float, p_eff: float) -> StepWords:
    if divisor != 1.0:
        return StepWords(
            symbol="eC·Cu/P", label="Load ratio for aISO", formula=f"eC·Cu/({divisor:g}·P)",
            template="{0} × {1:N} / ({2} × {3:N})", args=(ec, cu, divisor, p_eff),
            source="ISO 281:2007 §9.3.2")
    return StepWords(
        symbol="eC·Cu/P", label="Load ratio for aISO", formula="eC·Cu/P",
        template="{0} × {1:N} / {2:N}", args=(ec, cu, p_eff), source="ISO 281:2007 §9.3.2")


def static_safety_minimum(case: CaseInputs, kind: Kind) -> tuple[float, str]:
    """The s0 the case must reach and why: the required s0, or the common-practice duty minimum."""
    if case.s0_min is not None:
        return case.s0_min, "the required s0"
    ball_min, roller_min, duty_words = T.STATIC_SAFETY_MINIMUMS[case.static_duty]
    minimum = roller_min if kind in ROLLER_KINDS else ball_min
    return minimum, f"the common-practice minimum for {duty_words}"


def _static(d: Derivation, case: CaseInputs, kind: Kind, arrangement: Arrangement,
            alpha: float) -> None:
    """P0 and s0 = C0/P0 against the minimum for the duty (ISO 76:2006; minimums common practice)."""
    sf = _static_factors(kind, arrangement, alpha)
    p0, floored = equivalent_static_load(sf, case.fr, case.fa)
    s0 = case.c0 / p0
    minimum, why = static_safety_minimum(case, kind)
    warning = None
    if s0 < minimum:
        warning = f"s0 = {s0:.3g} is below {minimum:g}, {why}"
    d.derived("P0", p0, lambda: _static_load_words(case, kind, sf, floored))
    if sf.radial and kind is not _CYLINDRICAL:
        d.results.update(X0=sf.x0, Y0=sf.y0)
    d.derived("s0", s0, lambda: StepWords(
        symbol="s0", label="Static safety factor", formula="C0/P0", template="{0:N} / {1:N}",
        args=(case.c0, p0), source="ISO 76:2006 (s0 = C0/P0); minimum: common practice",
        note=f"minimum {minimum:g}: {why}" + (
            f"; {set_rating_words(kind, arrangement, 'C0')}" if is_bearing_set(arrangement) else "")),
        warning=warning)
    d.results["s0_min"] = minimum


def _static_load_words(case: CaseInputs, kind: Kind, sf: StaticFactors, floored: bool) -> StepWords:
    if not sf.radial:
        if sf.x0 == 0.0:
            return StepWords(
                symbol="P0", label="Equivalent static load", formula="P0 = Fa (α = 90°)",
                template="{0:N}", args=(case.fa,), unit="N", source=sf.source)
        return StepWords(
            symbol="P0", label="Equivalent static load", formula="2.3·Fr·tan α + Fa",
            template="{0} × {1:N} + {2:N}", args=(sf.x0, case.fr, case.fa), unit="N",
            source=sf.source)
    if kind is _CYLINDRICAL:
        return StepWords(
            symbol="P0", label="Equivalent static load", formula="P0 = Fr", template="{0:N}",
            args=(case.fr,), unit="N", source=sf.source)
    return StepWords(
        symbol="P0", label="Equivalent static load", formula="max(X0·Fr + Y0·Fa, Fr)",
        template="max({0} × {1:N} + {2} × {3:N}, {1:N})", args=(sf.x0, case.fr, sf.y0, case.fa),
        unit="N", source=sf.source, note="P0 = Fr rule applied" if floored else None)
