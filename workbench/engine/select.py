"""Catalog selection: every catalog bearing against every load case at once.

For a set of load cases and targets, :func:`select` finds the catalog bearings that qualify —
modified rating life Lnm at the cases' reliability at least the target in hours (ISO 281:2007
§9.1), static safety s0 = C0/P0 at least the minimum (ISO 76:2006), and the filters on kind,
bore, outer diameter, width and speed limit — and ranks them smallest first (outer diameter, then
width, then mass).  The sweep is one numpy evaluation per group of like bearings (same kind,
arrangement, contact angle, f0 given or not) over an array of shape (bearings in the group, cases),
calling the same engine functions :func:`workbench.engine.derive.derive` calls; there is no second
copy of the physics.  :func:`select_by_loop` gives the same answer by calling ``derive()`` for every
bearing and case, and is the reference the tests and :func:`benchmark_select` compare against.

A case at speed 0 has no life in hours: it is checked for static safety only.  A bearing whose
combination with some case the engine refuses (an ``InputError`` from ``derive``) is rejected with
the reason ``cannot be rated (<field>)``.

A bearing must also suit its position (:func:`load_direction_refusal`, the one rule both sweeps
and so ``workbench select`` and the selection screen apply): a cylindrical roller bearing under an
axial load qualifies only when the person says its design has flanges for it
(``Filters.flanged_cylindrical``), and a thrust bearing only where it can take the radial load.
"""

from __future__ import annotations

import math
import statistics
import time
from collections import Counter
from dataclasses import dataclass, field, replace
from typing import Sequence, TypeVar

import numpy as np

from .derive import (
    CaseInputs, derive, lubrication_gaps, operating_viscosity, rating_basis_mrev,
    reliability_life_factor, static_safety_minimum, validate,
)
from .kinds import (
    ARRANGEMENTS, DEFAULT_CONTACT_ANGLE, KIND_WORDS, ROLLER_KINDS, THRUST_KINDS, Arrangement, Kind,
    aiso_load_divisor, dynamic_factors, dynamic_load, equivalent_static_load, is_bearing_set,
    life_exponent, parse_arrangement, rotation_factor, set_dynamic_rating, set_static_rating,
    static_factors,
)
from .life import (
    aiso, basic_rating_life, contamination_factor, fatigue_load_limit_estimate, kappa_in_range,
    life_hours, reference_viscosity,
)
from .record import Derivation, InputError, fmt

REASON_KIND = "kind"
REASON_BORE = "bore"
REASON_OUTER = "outer diameter"
REASON_WIDTH = "width"
REASON_SPEED = "speed limit"
REASON_NO_AXIAL = "cannot carry Fa"
REASON_NO_RADIAL = "cannot carry Fr"
REASON_STATIC = "static safety"
REASON_LIFE = "life"


def unrated_reason(field_name: str) -> str:
    """The rejection reason for a bearing the engine refuses to rate for some case."""
    return f"cannot be rated ({field_name})"


@dataclass
class BearingArrays:
    """Catalog columns as numpy arrays in engine units (N, mm, r/min, kg); NaN means not given.

    ``kind`` and ``arrangement`` are arrays of text; ``f0``, ``cu_n``, ``contact_angle_deg``,
    ``speed_limit_rpm`` and ``mass_kg`` are optional per bearing (NaN where absent).
    """

    kind: np.ndarray
    arrangement: np.ndarray
    d_mm: np.ndarray
    D_mm: np.ndarray
    B_mm: np.ndarray
    c_n: np.ndarray
    c0_n: np.ndarray
    f0: np.ndarray
    cu_n: np.ndarray
    contact_angle_deg: np.ndarray
    speed_limit_rpm: np.ndarray
    mass_kg: np.ndarray

    def __len__(self) -> int:
        return int(self.d_mm.shape[0])

    @property
    def dm_mm(self) -> np.ndarray:
        """Mean diameter (d + D)/2, the dpw the engine's aISO and Cu estimate take (ISO 281:2007 §9.3)."""
        mean: np.ndarray = 0.5 * (self.d_mm + self.D_mm)
        return mean

    def take(self, rows: np.ndarray) -> BearingArrays:
        """The bearings at ``rows``, as a smaller table."""
        return BearingArrays(**{name: getattr(self, name)[rows] for name in _COLUMNS})


_COLUMNS = ("kind", "arrangement", "d_mm", "D_mm", "B_mm", "c_n", "c0_n", "f0", "cu_n",
            "contact_angle_deg", "speed_limit_rpm", "mass_kg")


BearingsT = TypeVar("BearingsT", bound=BearingArrays)


def mounted_as(bearings: BearingsT, arrangement: str) -> tuple[BearingsT, np.ndarray]:
    """The catalog rated as the position's ``arrangement`` asks, and which rows were mounted so.

    Where ``arrangement`` is a set of bearings mounted as a unit (tandem, back-to-back,
    face-to-face) and a row's kind comes so, a single-row catalog bearing is rated as a pair of
    it: C = 2^0.7·C (ball) or 2^(7/9)·C (roller, ISO 281:2007 §5.1/§7.1), C0 = 2·C0 (ISO 76:2006
    §5.1/§7.1), and a given Cu = 2·Cu (a load limit that adds up as C0 does; our decision).  A
    row that is a pair already keeps its ratings and takes the arrangement.  Any other row, and
    every row for a single or double-row position, is rated as the catalog lists it.
    """
    n = len(bearings)
    mounted = np.zeros(n, dtype=bool)
    try:
        wanted = Arrangement(arrangement)
    except ValueError:
        return bearings, mounted
    if not is_bearing_set(wanted):
        return bearings, mounted
    c, c0, cu = bearings.c_n.copy(), bearings.c0_n.copy(), bearings.cu_n.copy()
    single = bearings.arrangement == Arrangement.SINGLE.value
    paired = np.isin(bearings.arrangement, [a.value for a in Arrangement if is_bearing_set(a)])
    for kind in Kind:
        if wanted not in ARRANGEMENTS[kind]:
            continue
        of_kind = bearings.kind == kind.value
        doubled = of_kind & single
        c[doubled] = set_dynamic_rating(kind, bearings.c_n[doubled])
        c0[doubled] = set_static_rating(bearings.c0_n[doubled])
        cu[doubled] = set_static_rating(bearings.cu_n[doubled])
        mounted |= doubled | (of_kind & paired)
    arrangements = np.where(mounted, wanted.value, bearings.arrangement)
    return replace(bearings, arrangement=arrangements, c_n=c, c0_n=c0, cu_n=cu), mounted


@dataclass(frozen=True)
class Filters:
    """Limits on the bearing itself (mm); ``None`` leaves a limit open.

    ``flanged_cylindrical``: the person says the cylindrical roller bearings considered have
    flanges on both rings to carry the cases' axial load, so they may qualify under Fa > 0
    (see :func:`load_direction_refusal`).
    """

    kind: str | None = None
    bore_min_mm: float | None = None
    bore_max_mm: float | None = None
    outer_max_mm: float | None = None
    width_max_mm: float | None = None
    flanged_cylindrical: bool = False


@dataclass(frozen=True)
class Candidate:
    """One qualifying bearing: its catalog index, life margin, governing case, smallest s0, and
    what the ranking leaves to the maker's data (``note``, "" for nothing)."""

    index: int
    life_margin: float
    governing_case: int
    min_s0: float
    note: str = ""


@dataclass
class Selection:
    """The outcome for every catalog bearing.

    ``reason[i]`` is ``""`` for a bearing that qualifies, else why it does not (the first reason in
    the order: kind, bore, outer diameter, width, speed limit, cannot carry Fa or Fr, cannot be
    rated, static safety, life).  ``life_margin[i]`` is min over the cases at speed > 0 of
    Lnm/target (∞ when every case is at speed 0), ``governing_case[i]`` the case giving it (−1
    when none), ``min_s0[i]`` the smallest s0 over the cases; all NaN (−1) where the bearing was
    not evaluated.  ``load_case[i]`` is the first case whose load bearing ``i`` cannot carry (−1
    when none).  ``order`` lists the qualifying bearings best first; ``notes`` what the ranking
    of a qualifying bearing leaves to the maker's data, by index.
    """

    order: np.ndarray
    reason: list[str]
    life_margin: np.ndarray
    governing_case: np.ndarray
    min_s0: np.ndarray
    examples: dict[str, str] = field(default_factory=dict)  # reason → one message behind it
    load_case: np.ndarray = field(default_factory=lambda: np.full(0, -1))
    notes: dict[int, str] = field(default_factory=dict)

    @property
    def candidates(self) -> list[Candidate]:
        """The qualifying bearings, best first."""
        return [Candidate(int(i), float(self.life_margin[i]), int(self.governing_case[i]),
                          float(self.min_s0[i]), self.notes.get(int(i), "")) for i in self.order]

    @property
    def rejections(self) -> dict[str, int]:
        """How many bearings each reason rejected."""
        return dict(Counter(r for r in self.reason if r))


def bearing_case(case: CaseInputs, bearings: BearingArrays, i: int,
                 s0_min: float | None = None) -> CaseInputs:
    """``case`` run on catalog bearing ``i``: the bearing fields replaced by the catalog's.

    dm is (d + D)/2; e and Y given by a maker are cleared (a catalog row carries none); ``s0_min``,
    when given, replaces the case's required s0.
    """
    return replace(
        case,
        kind=str(bearings.kind[i]),
        arrangement=str(bearings.arrangement[i]),
        c=float(bearings.c_n[i]),
        c0=float(bearings.c0_n[i]),
        f0=_optional(bearings.f0[i]),
        contact_angle=_optional(bearings.contact_angle_deg[i]),
        e_given=None,
        y_given=None,
        dm=float(0.5 * (bearings.d_mm[i] + bearings.D_mm[i])),
        cu=_optional(bearings.cu_n[i]),
        s0_min=case.s0_min if s0_min is None else s0_min,
    )


def load_direction_refusal(kind: Kind, alpha_deg: float | None, fr: float, fa: float, *,
                           flanged_cylindrical: bool = False) -> tuple[str, str] | None:
    """Whether a bearing of ``kind`` (contact angle ``alpha_deg``) can take a case's loads at
    all: None when it can, else ``(reason, message)``.

    - A cylindrical roller bearing (α = 0) carries Fa only on flanges, which not every design
      has, and ISO 281:2007 §7.2 rates its life on P = Fr whatever Fa is.  Under Fa > 0 it
      qualifies only when ``flanged_cylindrical`` (the person says it has flanges for it), and
      never under a purely axial load.
    - A thrust bearing with α = 90° takes no radial load (ISO 281:2007 §6.2, §8.2); one with
      α < 90° only while Fa/Fr > e (single direction, ISO 281:2007 Table 3): the engine's own
      ``dynamic_factors`` and ``dynamic_load`` decide.  An angle the engine cannot rate is left
      to ``derive`` (reason ``cannot be rated``).
    """
    if kind is Kind.CYLINDRICAL and fa > 0.0 and not (flanged_cylindrical and fr > 0.0):
        if fr == 0.0:
            return REASON_NO_AXIAL, "a cylindrical roller bearing cannot carry a purely axial load"
        return REASON_NO_AXIAL, (
            f"a cylindrical roller bearing takes Fa = {fmt(fa)} N only on flanges, its life "
            "rated on P = Fr (ISO 281:2007 §7.2); allow flanged ones if yours has them")
    if kind not in THRUST_KINDS or fr <= 0.0 or alpha_deg is None:
        return None
    words = KIND_WORDS[kind]
    if alpha_deg >= 90.0:
        return REASON_NO_RADIAL, f"a {words} with α = 90° takes no radial load (Fr = {fmt(fr)} N)"
    try:
        factors = dynamic_factors(kind, Arrangement.SINGLE, alpha_deg, fa, 1.0)
    except InputError:
        return None
    if dynamic_load(kind, factors, fr, fa)[3]:
        return None
    return REASON_NO_RADIAL, (f"a {words} with α = {alpha_deg:g}° takes radial load only while "
                              f"Fa/Fr > e = {fmt(factors.e, 3)} (here {fmt(fa / fr, 3)})")


def _kind_and_angle(kind_text: str, alpha_deg: float) -> tuple[Kind | None, float | None]:
    """A catalog row's kind and contact angle (the kind's default where the row gives none)."""
    try:
        kind = Kind(kind_text)
    except ValueError:
        return None, None
    return kind, (DEFAULT_CONTACT_ANGLE[kind] if math.isnan(alpha_deg) else alpha_deg)


def _first_load_refusal(kind_text: str, alpha_deg: float, cases: Sequence[CaseInputs],
                        flanged_cylindrical: bool) -> tuple[int, str, str] | None:
    """The first case (index, reason, message) whose load a bearing of this kind and angle cannot
    carry, by :func:`load_direction_refusal`; None when it can carry them all."""
    kind, alpha = _kind_and_angle(kind_text, alpha_deg)
    if kind is None:
        return None
    for j, case in enumerate(cases):
        refusal = load_direction_refusal(kind, alpha, case.fr, case.fa,
                                         flanged_cylindrical=flanged_cylindrical)
        if refusal is not None:
            return j, *refusal
    return None


def flange_note(kind_text: str, cases: Sequence[CaseInputs]) -> str:
    """What a qualifying cylindrical roller bearing under axial load leaves to the maker: its
    flanges' axial capacity ("" for any other bearing, or with no axial load)."""
    fa_max = max((case.fa for case in cases), default=0.0)
    if kind_text != Kind.CYLINDRICAL.value or not fa_max > 0.0:
        return ""
    return (f"flanges carry Fa up to {fmt(fa_max)} N: check their axial capacity with the maker's "
            "data (life rated on P = Fr, ISO 281:2007 §7.2)")


def _notes(bearings: BearingArrays, cases: Sequence[CaseInputs], order: np.ndarray) -> dict[int, str]:
    """The flange note of each ranked cylindrical roller bearing (one text for them all)."""
    note = flange_note(Kind.CYLINDRICAL.value, cases)
    if not note:
        return {}
    return {int(i): note for i in order[bearings.kind[order] == Kind.CYLINDRICAL.value]}


def _optional(value: float) -> float | None:
    return None if math.isnan(value) else float(value)


def _check_request(cases: Sequence[CaseInputs], life_target_h: float) -> None:
    if not cases:
        raise InputError("cases", "there are no load cases to select for")
    if not (math.isfinite(life_target_h) and life_target_h > 0.0):
        raise InputError("life", "the life target must be a positive number of hours")


def _filter_reasons(bearings: BearingArrays, cases: Sequence[CaseInputs],
                    filters: Filters) -> np.ndarray:
    """Per bearing, the first filter it fails ("" when it passes them all)."""
    n = len(bearings)
    reason = np.full(n, "", dtype=object)
    checks: list[tuple[str, np.ndarray | None]] = [
        (REASON_KIND, None if filters.kind is None else bearings.kind != filters.kind),
        (REASON_BORE, None if filters.bore_min_mm is None else bearings.d_mm < filters.bore_min_mm),
        (REASON_BORE, None if filters.bore_max_mm is None else bearings.d_mm > filters.bore_max_mm),
        (REASON_OUTER, None if filters.outer_max_mm is None else bearings.D_mm > filters.outer_max_mm),
        (REASON_WIDTH, None if filters.width_max_mm is None else bearings.B_mm > filters.width_max_mm),
        (REASON_SPEED, bearings.speed_limit_rpm < max(case.speed for case in cases)),
    ]
    for name, failing in checks:
        if failing is not None:
            reason[(reason == "") & failing] = name
    return reason


def _rank(bearings: BearingArrays, reason: Sequence[str]) -> np.ndarray:
    """Qualifying bearings smallest first: outer diameter, then width, then mass (unknown last)."""
    chosen = np.flatnonzero(np.asarray(reason, dtype=object) == "")
    mass = np.where(np.isnan(bearings.mass_kg[chosen]), np.inf, bearings.mass_kg[chosen])
    keys = (chosen, mass, bearings.B_mm[chosen], bearings.D_mm[chosen])
    return chosen[np.lexsort(keys)]


# ---- the reference: derive() per bearing and case -------------------------------------------
def select_by_loop(bearings: BearingArrays, cases: Sequence[CaseInputs], life_target_h: float,
                   s0_min: float | None = None, filters: Filters = Filters()) -> Selection:
    """:func:`select` by calling ``derive()`` for every bearing and case (the plain reference)."""
    _check_request(cases, life_target_h)
    n = len(bearings)
    reason = list(_filter_reasons(bearings, cases, filters))
    margin = np.full(n, np.nan)
    governing = np.full(n, -1)
    load_case = np.full(n, -1)
    min_s0 = np.full(n, np.nan)
    examples: dict[str, str] = {}
    for i in range(n):
        if reason[i]:
            continue
        refused = _first_load_refusal(str(bearings.kind[i]), float(bearings.contact_angle_deg[i]),
                                      cases, filters.flanged_cylindrical)
        if refused is not None:
            load_case[i], reason[i] = refused[0], refused[1]
            examples.setdefault(refused[1], refused[2])
            continue
        lowest_margin, lowest_case, lowest_s0 = math.inf, -1, math.inf
        static_ok = life_ok = True
        try:
            for j, case in enumerate(cases):
                results = derive(bearing_case(case, bearings, i, s0_min)).results
                s0 = results["s0"]
                static_ok = static_ok and s0 >= results["s0_min"]
                lowest_s0 = min(lowest_s0, s0)
                if case.speed > 0.0:
                    life_ok = life_ok and results["Lnm"] >= life_target_h
                    case_margin = results["Lnm"] / life_target_h
                    if case_margin < lowest_margin:
                        lowest_margin, lowest_case = case_margin, j
        except InputError as exc:
            reason[i] = unrated_reason(exc.field)
            examples.setdefault(reason[i], exc.message)
            continue
        margin[i], governing[i], min_s0[i] = lowest_margin, lowest_case, lowest_s0
        reason[i] = "" if static_ok and life_ok else (REASON_STATIC if not static_ok else REASON_LIFE)
    order = _rank(bearings, reason)
    return Selection(order, reason, margin, governing, min_s0, examples, load_case,
                     _notes(bearings, cases, order))


# ---- the vectorised sweep -------------------------------------------------------------------
Refusal = tuple[str, str]  # (field, message) of an InputError, as derive() would raise it


@dataclass
class _CaseRows:
    """Per-case numbers as (1, n_cases) rows; cases the engine refuses get harmless placeholders."""

    fr: np.ndarray
    fa: np.ndarray
    speed: np.ndarray
    af: np.ndarray
    outer_ring_rotates: np.ndarray  # bool: V then depends on each group's kind
    basis: np.ndarray        # LR, 10⁶ rev
    a_rel: np.ndarray        # a1 or the Weibull life factor
    hours_speed: np.ndarray  # speed, NaN at 0 (no life in hours)
    rated: np.ndarray        # speed > 0: the case has a life in hours
    lubricated: np.ndarray   # column indices with everything aISO needs
    nu: np.ndarray           # operating viscosity of the lubricated columns
    errors: list[Refusal | None]  # a case-level refusal met in the lubrication step


def _case_rows(cases: Sequence[CaseInputs], usable: Sequence[bool]) -> _CaseRows:
    """The case-only terms of derive(), once per case, by derive's own functions."""
    m = len(cases)
    fr, fa, speed, af = np.ones(m), np.zeros(m), np.ones(m), np.ones(m)
    outer, basis, a_rel = np.zeros(m, dtype=bool), np.ones(m), np.ones(m)
    lubricated: list[int] = []
    nus: list[float] = []
    errors: list[Refusal | None] = [None] * m
    for j, case in enumerate(cases):
        if not usable[j]:
            continue
        fr[j], fa[j], speed[j], af[j] = case.fr, case.fa, case.speed, case.af
        outer[j] = case.outer_ring_rotates
        basis[j], a_rel[j] = rating_basis_mrev(case), reliability_life_factor(case)
        if lubrication_gaps(replace(case, dm=1.0)):  # dm comes from each catalog bearing
            continue
        try:
            nu = operating_viscosity(Derivation(), case)
        except InputError as exc:
            errors[j] = (exc.field, exc.message)
            continue
        assert nu is not None
        lubricated.append(j)
        nus.append(nu)
    hours_speed = np.where(speed > 0.0, speed, np.nan)
    return _CaseRows(fr[None], fa[None], speed[None], af[None], outer[None], basis[None], a_rel[None],
                     hours_speed[None], (speed > 0.0)[None], np.asarray(lubricated, dtype=int),
                     np.asarray(nus, dtype=float)[None], errors)


@dataclass
class _Group:
    """Bearings alike for the engine: one kind, arrangement, contact angle, f0 given or not."""

    rows: np.ndarray
    kind: str
    arrangement: str
    has_f0: bool


def _codes(values: np.ndarray, known: Sequence[str]) -> tuple[np.ndarray, list[str]]:
    """Integer codes of text values and the text of each code (known names compared directly)."""
    codes = np.full(values.shape[0], -1)
    labels: list[str] = []
    for name in known:
        hit = values == name
        if hit.any():
            codes[hit] = len(labels)
            labels.append(name)
    rest = codes < 0
    if rest.any():
        others, inverse = np.unique(values[rest], return_inverse=True)
        codes[rest] = len(labels) + inverse
        labels.extend(str(o) for o in others)
    return codes, labels


def _groups(bearings: BearingArrays, rows: np.ndarray) -> list[_Group]:
    """Split ``rows`` into groups the engine treats alike (its factors take one α per call)."""
    kind_code, kinds = _codes(bearings.kind[rows], [k.value for k in Kind])
    arrangement_code, arrangements = _codes(bearings.arrangement[rows], [a.value for a in Arrangement])
    alpha = bearings.contact_angle_deg[rows]
    _, alpha_code = np.unique(np.where(np.isnan(alpha), -1.0, alpha), return_inverse=True)
    has_f0 = ~np.isnan(bearings.f0[rows])
    key = (((kind_code * len(arrangements) + arrangement_code) * (int(alpha_code.max()) + 1)
            + alpha_code) * 2 + has_f0)
    order = np.argsort(key, kind="stable")
    sorted_key = key[order]
    starts = np.flatnonzero(np.r_[True, sorted_key[1:] != sorted_key[:-1]])
    groups = []
    for members in np.split(order, starts[1:]):
        first = members[0]
        groups.append(_Group(rows[members], kinds[kind_code[first]],
                             arrangements[arrangement_code[first]], bool(has_f0[first])))
    return groups


def _probe(group: _Group, bearings: BearingArrays, cases: Sequence[CaseInputs],
           s0_min: float | None) -> tuple[list[Refusal | None], Kind | None, float]:
    """derive()'s own validate() on one member per case: what it refuses holds for the whole group.

    A group's members differ only in numbers the catalog reader has checked (positive, finite),
    so validate() answers alike for all of them.  Returns the refusal per case and the kind and
    contact angle validate() resolved.
    """
    first = int(group.rows[0])
    refusals: list[Refusal | None] = []
    kind, alpha = None, math.nan
    for case in cases:
        try:
            kind, _, alpha = validate(bearing_case(case, bearings, first, s0_min))
            refusals.append(None)
        except InputError as exc:
            refusals.append((exc.field, exc.message))
    return refusals, kind, alpha


class _Refusals:
    """Which refusal derive() would meet first for each bearing × case, and then for each bearing."""

    def __init__(self, ng: int, m: int) -> None:
        self.code = np.zeros((ng, m), dtype=np.int16)  # 0: none; k: self.table[k - 1]
        self.table: list[Refusal] = []

    def add(self, refusal: Refusal, where: np.ndarray | None = None, column: int | None = None) -> None:
        """Record ``refusal`` at ``where`` (or in ``column``), behind any refusal met before it."""
        self.table.append(refusal)
        if column is not None:
            cells = self.code[:, column]
            cells[cells == 0] = len(self.table)
        else:
            self.code[(self.code == 0) & where] = len(self.table)

    def first_per_bearing(self) -> np.ndarray:
        """Per bearing, the code met first in case order (0 for none)."""
        if not self.table:
            return np.zeros(self.code.shape[0], dtype=np.int16)
        first = np.argmax(self.code > 0, axis=1)
        codes: np.ndarray = self.code[np.arange(self.code.shape[0]), first]
        return codes


@dataclass
class _Outcome:
    """Per bearing of a group: its first refusal code, verdicts, margin, governing case, min s0."""

    refusal: np.ndarray
    table: list[Refusal]
    static_ok: np.ndarray
    life_ok: np.ndarray
    margin: np.ndarray
    governing: np.ndarray
    min_s0: np.ndarray


def _evaluate_group(group: _Group, kind: Kind, alpha: float, bearings: BearingArrays,
                    cases: Sequence[CaseInputs], rows_of: _CaseRows, probed: list[Refusal | None],
                    life_target_h: float, s0_min: float | None) -> _Outcome:
    """derive() for every member and case at once: the same engine functions, on arrays.

    Refusals are taken in derive()'s order: validate(), the Table 3 factors, the single-direction
    thrust branch, then the viscosity of the lubrication step.
    """
    rows = group.rows
    ng, m = len(rows), len(cases)
    refusals = _Refusals(ng, m)
    for j, refusal in enumerate(probed):
        if refusal is not None:
            refusals.add(refusal, column=j)
    arrangement = parse_arrangement(kind, group.arrangement)
    c = bearings.c_n[rows, None]
    c0 = bearings.c0_n[rows, None]
    dm = bearings.dm_mm[rows, None]
    try:
        factors = dynamic_factors(kind, arrangement, alpha, rows_of.fa, c0,
                                  bearings.f0[rows, None] if group.has_f0 else None)
    except InputError as exc:
        refusals.add((exc.field, exc.message), where=np.ones((ng, m), dtype=bool))
        return _Outcome(refusals.first_per_bearing(), refusals.table, np.zeros(ng, bool),
                        np.zeros(ng, bool), np.full(ng, np.nan), np.full(ng, -1), np.full(ng, np.nan))
    v = np.where(rows_of.outer_ring_rotates, rotation_factor(kind, True), 1.0)
    p, _, _, possible = dynamic_load(kind, factors, rows_of.fr, rows_of.fa, v)
    if possible is not True:
        refusals.add(("fa", f"a single-direction {kind.value} bearing needs Fa/Fr > e"),
                     where=~np.broadcast_to(possible, (ng, m)))
    for j, error in enumerate(rows_of.errors):
        if error is not None:
            refusals.add(error, column=j)
    roller = kind in ROLLER_KINDS
    p_eff = p * rows_of.af
    l10 = rows_of.basis * basic_rating_life(c, p_eff, life_exponent(kind))
    lnm_mrev = rows_of.a_rel * l10
    lub = rows_of.lubricated
    if lub.size:
        everywhere = lub.size == m
        speed = rows_of.speed if everywhere else rows_of.speed[:, lub]
        kappa = kappa_in_range(rows_of.nu / reference_viscosity(speed, dm))
        ec = np.empty((ng, lub.size))
        by_level: dict[str, np.ndarray] = {}
        for k, j in enumerate(lub):
            case = cases[j]
            if case.ec is not None:
                ec[:, k] = case.ec
            else:
                level = str(case.cleanliness)
                if level not in by_level:
                    by_level[level] = contamination_factor(level, dm[:, 0])[0]
                ec[:, k] = by_level[level]
        cu_given = bearings.cu_n[rows, None]
        cu = np.where(np.isnan(cu_given), fatigue_load_limit_estimate(c0, dm, roller), cu_given)
        p_lub = np.broadcast_to(p_eff, (ng, m))
        load_ratio = ec * cu / (aiso_load_divisor(kind) * (p_lub if everywhere else p_lub[:, lub]))
        a_iso = aiso(kappa, load_ratio, roller)
        if everywhere:
            lnm_mrev = rows_of.a_rel * a_iso * l10
        else:
            lnm_mrev = np.broadcast_to(lnm_mrev, (ng, m)).copy()
            lnm_mrev[:, lub] = rows_of.a_rel[:, lub] * a_iso * np.broadcast_to(l10, (ng, m))[:, lub]
    lnm_h = life_hours(lnm_mrev, rows_of.hours_speed)
    p0, _ = equivalent_static_load(static_factors(kind, arrangement, alpha), rows_of.fr, rows_of.fa)
    s0 = c0 / p0
    needed = np.array([[static_safety_minimum(_with_s0(case, s0_min), kind)[0] for case in cases]])
    rated = rows_of.rated
    margins = np.where(rated, lnm_h / life_target_h, np.inf)
    governing = np.argmin(margins, axis=1)
    return _Outcome(
        refusals.first_per_bearing(), refusals.table,
        static_ok=np.all(s0 >= needed, axis=1),
        life_ok=np.all(~rated | (lnm_h >= life_target_h), axis=1),
        margin=margins[np.arange(ng), governing],
        governing=governing if rated.any() else np.full(ng, -1),
        min_s0=np.min(np.broadcast_to(s0, (ng, m)), axis=1),
    )


def _with_s0(case: CaseInputs, s0_min: float | None) -> CaseInputs:
    return case if s0_min is None else replace(case, s0_min=s0_min)


def _refused_throughout(ng: int, probed: list[Refusal | None]) -> _Outcome:
    """The outcome of a group validate() refused for every case: the first case's refusal."""
    table = [r for r in probed if r is not None]
    return _Outcome(np.ones(ng, dtype=np.int16), table, np.zeros(ng, bool), np.zeros(ng, bool),
                    np.full(ng, np.nan), np.full(ng, -1), np.full(ng, np.nan))


def select(bearings: BearingArrays, cases: Sequence[CaseInputs], life_target_h: float,
           s0_min: float | None = None, filters: Filters = Filters()) -> Selection:
    """Every catalog bearing against every case at once; the qualifying ones ranked smallest first.

    Qualifies: Lnm ≥ ``life_target_h`` for each case at speed > 0 (ISO 281:2007 §9.1, at the
    case's reliability and lubrication), s0 ≥ the case's minimum (ISO 76:2006; ``s0_min`` replaces
    every case's required s0 when given), the ``filters``, and a kind that can carry each case's
    load (:func:`load_direction_refusal`).  Same verdicts as
    :func:`select_by_loop`, which calls ``derive()`` per bearing and case.
    """
    _check_request(cases, life_target_h)
    n = len(bearings)
    reason = _filter_reasons(bearings, cases, filters)
    margin = np.full(n, np.nan)
    governing = np.full(n, -1)
    min_s0 = np.full(n, np.nan)
    examples: dict[str, str] = {}
    load_case = np.full(n, -1)
    open_rows = np.flatnonzero(reason == "")
    groups = []
    for group in _groups(bearings, open_rows) if open_rows.size else []:
        refused = _first_load_refusal(group.kind, float(bearings.contact_angle_deg[group.rows[0]]),
                                      cases, filters.flanged_cylindrical)
        if refused is None:
            groups.append(group)
        else:
            load_case[group.rows], reason[group.rows] = refused[0], refused[1]
            examples.setdefault(refused[1], refused[2])
    probes = [_probe(group, bearings, cases, s0_min) for group in groups]
    usable = [any(refusals[j] is None for refusals, _, _ in probes) for j in range(len(cases))]
    rows_of = _case_rows(cases, usable)
    with np.errstate(all="ignore"):
        for group, (probed, kind, alpha) in zip(groups, probes):
            if kind is None:
                outcome = _refused_throughout(len(group.rows), probed)
            else:
                outcome = _evaluate_group(group, kind, alpha, bearings, cases, rows_of, probed,
                                          life_target_h, s0_min)
            verdict = np.full(len(group.rows), "", dtype=object)
            verdict[~outcome.life_ok] = REASON_LIFE
            verdict[~outcome.static_ok] = REASON_STATIC
            for code in np.unique(outcome.refusal[outcome.refusal > 0]):
                field_name, message = outcome.table[code - 1]
                verdict[outcome.refusal == code] = unrated_reason(field_name)
                examples.setdefault(unrated_reason(field_name), message)
            rows = group.rows
            reason[rows] = verdict
            evaluated = outcome.refusal == 0
            margin[rows[evaluated]] = outcome.margin[evaluated]
            governing[rows[evaluated]] = outcome.governing[evaluated]
            min_s0[rows[evaluated]] = outcome.min_s0[evaluated]
    reasons = reason.tolist()
    order = _rank(bearings, reasons)
    return Selection(order, reasons, margin, governing, min_s0, examples, load_case,
                     _notes(bearings, cases, order))


# ---- the speed figures ----------------------------------------------------------------------
def random_catalog(n_bearings: int, rng: np.random.Generator) -> BearingArrays:
    """An invented catalog for timing: deep-groove, 40° angular-contact and cylindrical rows."""
    kinds = rng.choice(np.array(["deep-groove", "angular-contact", "cylindrical"]), n_bearings)
    d = rng.uniform(10.0, 100.0, n_bearings)
    outer = d * rng.uniform(1.4, 2.6, n_bearings)
    width = 0.25 * (outer - d) * rng.uniform(0.8, 1.3, n_bearings)
    c = rng.uniform(5e3, 2e5, n_bearings)
    c0 = c * rng.uniform(0.5, 1.5, n_bearings)
    ball = kinds == "deep-groove"
    f0 = np.where(ball, rng.uniform(12.0, 16.0, n_bearings), np.nan)
    angle = np.where(kinds == "angular-contact", 40.0, np.nan)
    none = np.full(n_bearings, np.nan)
    return BearingArrays(kinds, np.full(n_bearings, "single"), d, outer, width, c, c0, f0, none,
                         angle, none, none)


def random_cases(n_cases: int, rng: np.random.Generator) -> list[CaseInputs]:
    """Invented load cases for timing: combined loads, oil bath at a temperature, normal cleanliness."""
    return [CaseInputs(fr=float(rng.uniform(500.0, 8000.0)), fa=float(rng.uniform(0.0, 3000.0)),
                       speed=float(rng.uniform(100.0, 3000.0)), af=1.2, reliability=0.95,
                       vg=float(rng.choice([68.0, 100.0, 150.0, 220.0])),
                       temp=float(rng.uniform(40.0, 80.0)), cleanliness="normal")
            for _ in range(n_cases)]


def benchmark_select(n_bearings: int = 10000, n_cases: int = 20, seed: int = 0,
                     repeats: int = 7, loop_bearings: int = 100) -> dict[str, float]:
    """Speed of :func:`select` on a random catalog, and its ratio to :func:`select_by_loop`.

    ``select_ms`` is the median of ``repeats`` runs over ``n_bearings`` × ``n_cases``;
    ``select_ratio`` is the loop's time, measured on ``loop_bearings`` bearings and scaled linearly
    to ``n_bearings``, divided by ``select_ms``.
    """
    rng = np.random.default_rng(seed)
    bearings = random_catalog(n_bearings, rng)
    cases = random_cases(n_cases, rng)
    target = 20000.0
    times = []
    for _ in range(repeats):
        start = time.perf_counter()
        select(bearings, cases, target)
        times.append(time.perf_counter() - start)
    select_s = statistics.median(times)
    subset = bearings.take(np.arange(min(loop_bearings, n_bearings)))
    start = time.perf_counter()
    select_by_loop(subset, cases, target)
    loop_s = (time.perf_counter() - start) * n_bearings / len(subset)
    return {"select_ms": 1e3 * select_s, "select_ratio": loop_s / select_s,
            "select_bearings": float(n_bearings), "select_cases": float(n_cases)}
