"""The internal analysis as typed: geometry, fit and loads as texts into an engine
:class:`~workbench.engine.internal.distribution.InternalInputs`, and its result.

One reader serves ``workbench internal`` and the screen.  The geometry inputs are those of the
rating form (:mod:`workbench.model.rating_form`, the ``workbench rate`` flags); the others are
the fit (operating clearance, a pair's axial preload, tilt or moment), the loads and speed, the
ball osculations, the roller profile and the lubrication for aISO.  Errors are
:class:`~workbench.model.fields.FieldError` under this form's input names.

For a session's load case, :func:`internal_for_case` takes the case's own loads, speed and
lubrication (ν and eC as the case's derivation finds them) and the bearing's geometry and fit
as texts; :func:`session_inside_texts` finds those texts in a session (the bearing's
``geometry`` table and its f0, the bearing's clearance and preload, the case's tilt or moment).
"""

from __future__ import annotations

import math
from collections.abc import Mapping

from ..engine.derive import CaseInputs, derive
from ..engine.internal.analysis import (InternalResult, SweepPoint, analyse_internal, clearance_sweep,
                                        default_clearances)
from ..engine.internal.distribution import ARRANGEMENTS, KINDS, PROFILES, InternalInputs, NoEquilibrium
from ..engine.record import InputError
from ..engine import tables as T
from .fields import INSIDE_FIELDS, FieldError, unread_fields
from .quantities import QuantityError, parse
from .rating_form import RATING_INPUTS, RatingInput, read_rating_input
from .session import GEOMETRY_KEYS, LoadCase, Session

__all__ = ["INTERNAL_INPUTS", "INTERNAL_INPUT_BY_NAME", "FIT_INPUTS", "NoEquilibrium",
           "inputs_from_texts", "analyse_texts", "internal_for_case", "clearance_curve_for_case",
           "input_problem", "session_inside_texts"]

_GEOMETRY = tuple(spec for spec in RATING_INPUTS)
INTERNAL_INPUTS: tuple[RatingInput, ...] = (
    *_GEOMETRY,
    RatingInput("arrangement", "--arrangement", "Arrangement", "choice",
                "single, back-to-back or face-to-face (pairs)", required=False),
    RatingInput("clearance", "--clearance", "Operating clearance Pd", "length",
                "diametral, negative = preload, e.g. 0.015 mm", required=False),
    RatingInput("preload", "--preload", "Axial preload (pairs)", "force", "e.g. 800 N", required=False),
    RatingInput("fr", "--fr", "Radial load Fr", "force", "e.g. 5 kN"),
    RatingInput("fa", "--fa", "Axial load Fa", "force", "default 0", required=False),
    RatingInput("moment", "--moment", "Tilting moment M", "torque",
                "tilt then follows; e.g. 40 N·m", required=False),
    RatingInput("tilt", "--tilt", "Misalignment θ", "angle", "held; default 0, e.g. 1 mrad",
                required=False),
    RatingInput("speed", "--speed", "Speed n", "speed", "for hours and aISO", required=False),
    RatingInput("fi", "--fi", "Inner osculation fi", "number", "default 0.52", required=False),
    RatingInput("fe", "--fe", "Outer osculation fe", "number", "default 0.53", required=False),
    RatingInput("profile", "--profile", "Roller profile", "choice", "crowned (default) or straight",
                required=False),
    RatingInput("crown_drop", "--crown-drop", "Crown gap at roller ends", "length",
                "default 0.001·Lwe", required=False),
    RatingInput("slices", "--slices", "Slices per roller", "count", "default 30", required=False),
    RatingInput("row_spacing", "--row-spacing", "Row spacing of a pair", "length",
                "default 2·Dw (ball), Lwe + Dwe (tapered)", required=False),
    RatingInput("nu", "--nu", "Operating viscosity ν", "viscosity", "for aISO", required=False),
    RatingInput("cleanliness", "--cleanliness", "Cleanliness (or eC)", "choice",
                "a level or a number 0–1, for aISO", required=False),
    RatingInput("cu", "--cu", "Fatigue load limit Cu", "force", "default from C0", required=False),
)
INTERNAL_INPUT_BY_NAME = {spec.name: spec for spec in INTERNAL_INPUTS}
FIT_INPUTS = INSIDE_FIELDS
"""The fit: fields of a session (:data:`workbench.model.fields.INSIDE_FIELDS`), clearance and
preload on the bearing, tilt and moment on the case."""
CHOICES: dict[str, tuple[str, ...]] = {"kind": KINDS, "arrangement": ARRANGEMENTS, "profile": PROFILES}
_ENGINE_NAMES = {"z": "elements", "alpha_deg": "contact_angle", "ec": "cleanliness"}
_ARRANGEMENT_WORDS = {"single": "single", "back-to-back": "back-to-back", "face-to-face": "face-to-face"}


def _value(spec: RatingInput, text: str) -> float | int:
    if spec.kind in ("force", "torque", "speed", "viscosity"):
        try:
            return parse(text, spec.kind, default_unit=_DEFAULT_UNITS[spec.kind])
        except QuantityError as exc:
            raise FieldError(spec.name, exc.message) from None
    if spec.kind == "angle" and spec.name == "tilt":
        try:
            return math.radians(parse(text, "angle", default_unit="rad"))
        except QuantityError as exc:
            raise FieldError(spec.name, exc.message) from None
    return read_rating_input(spec, text)


_DEFAULT_UNITS = {"force": "N", "torque": "N*m", "speed": "r/min", "viscosity": "mm**2/s"}


def _ec(text: str) -> float:
    if text in T.CONTAMINATION_LEVELS:
        return math.nan  # a level: its eC depends on dpw, read below
    try:
        value = float(text)
    except ValueError:
        raise FieldError("cleanliness", f"use a level ({', '.join(T.CONTAMINATION_LEVELS)}) "
                                        "or a number 0–1") from None
    if not 0.0 <= value <= 1.0:
        raise FieldError("cleanliness", "eC lies between 0 and 1")
    return value


def input_problem(name: str, text: str) -> str | None:
    """Why ``text`` cannot be read as input ``name`` of this form (None: it can, or it is
    blank); the session reader and the document check a geometry text with it."""
    spec = INTERNAL_INPUT_BY_NAME[name]
    text = text.strip()
    if not text:
        return None
    if spec.kind == "choice":
        if spec.name == "cleanliness":
            return None if text in T.CONTAMINATION_LEVELS else _problem(_ec, text)
        return None if text in CHOICES[spec.name] else f"use one of {', '.join(CHOICES[spec.name])}"
    return _problem(lambda typed: _value(spec, typed), text)


def _problem(read: object, text: str) -> str | None:
    try:
        read(text)  # type: ignore[operator]
    except FieldError as exc:
        return exc.message
    return None


def session_inside_texts(session: Session, case: LoadCase) -> tuple[dict[str, str], dict[str, str]] | None:
    """The geometry and fit texts of ``case`` for :func:`internal_for_case`: its bearing's
    geometry table (with the bearing's f0), the bearing's clearance and preload and the case's
    tilt and moment; None when the bearing has no geometry (elements, Dw and Dpw are needed)."""
    bearing = session.bearing(case.bearing)
    if bearing is None or not all(bearing.geometry.get(key, "").strip()
                                  for key in ("elements", "dw", "dpw")):
        return None
    geometry = {key: text for key, text in bearing.geometry.items()
                if key in GEOMETRY_KEYS and text.strip()}
    if bearing.texts.get("f0", "").strip():
        geometry["f0"] = bearing.texts["f0"]
    fit = {key: owner.texts.get(key, "") for owner, keys in ((bearing, ("clearance", "preload")),
                                                            (case, ("tilt", "moment")))
           for key in keys if owner.texts.get(key, "").strip()}
    return geometry, fit


def inputs_from_texts(texts: Mapping[str, str]) -> InternalInputs:
    """The engine inputs the texts describe (blank optional inputs keep the engine's defaults);
    :class:`FieldError` naming the input that is missing or unreadable."""
    from ..engine.life import contamination_factor

    unknown = sorted(set(texts) - set(INTERNAL_INPUT_BY_NAME))
    if unknown:
        raise FieldError(unknown[0], "unknown input")
    values: dict[str, object] = {}
    for spec in INTERNAL_INPUTS:
        text = texts.get(spec.name, "").strip()
        if not text:
            if spec.required:
                raise FieldError(spec.name, "needed")
            continue
        if spec.kind == "choice":
            if spec.name == "cleanliness":
                values[spec.name] = text
                continue
            if text not in CHOICES[spec.name]:
                raise FieldError(spec.name, f"use one of {', '.join(CHOICES[spec.name])}")
            values[spec.name] = text
            continue
        values[spec.name] = _value(spec, text)
    if values.get("rows", 1) != 1:
        raise FieldError("rows", "the internal analysis takes one row; give a pair with --arrangement")
    if "moment" in values and "tilt" in values:
        raise FieldError("tilt", "give either the moment or the tilt, not both")
    kind = str(values["kind"])
    dpw = float(values["dpw"])  # type: ignore[arg-type]
    ec = None
    if "cleanliness" in values:
        text = str(values["cleanliness"])
        ec = _ec(text)
        if math.isnan(ec):
            ec = float(contamination_factor(text, dpw)[0])
    moment = values.get("moment")
    number = {name: float(value) for name, value in values.items()
              if isinstance(value, (int, float))}
    return InternalInputs(
        kind=kind, z=int(number["elements"]), dw=number["dw"], dpw=dpw,
        alpha_deg=number.get("contact_angle", 0.0), lwe=number.get("lwe"),
        arrangement=str(values.get("arrangement", "single")),
        clearance=number.get("clearance", 0.0), preload=number.get("preload", 0.0),
        fr=number["fr"], fa=number.get("fa", 0.0),
        moment=None if moment is None else 1000.0 * number["moment"],  # N·m → N·mm
        tilt=number.get("tilt", 0.0), speed=number.get("speed", 0.0),
        fi=number.get("fi"), fe=number.get("fe"), profile=str(values.get("profile", "crowned")),
        crown_drop=number.get("crown_drop"), slices=int(number.get("slices", 30)),
        row_spacing=number.get("row_spacing"), nu=number.get("nu"), ec=ec, cu=number.get("cu"),
        bm=number.get("bm"), f0=number.get("f0"))


def analyse_texts(texts: Mapping[str, str], *, keep_steps: bool = True) -> InternalResult:
    """Read the texts and run the internal analysis; :class:`FieldError` under this form's input
    names for anything refused, :class:`NoEquilibrium` (with ``field`` renamed the same way)
    when no ring position balances the loads."""
    return _run(inputs_from_texts(texts), keep_steps=keep_steps)


def _run(inputs: InternalInputs, *, keep_steps: bool) -> InternalResult:
    try:
        return analyse_internal(inputs, keep_steps=keep_steps)
    except NoEquilibrium as exc:
        raise NoEquilibrium(_ENGINE_NAMES.get(exc.field, exc.field), exc.message) from None
    except InputError as exc:
        raise FieldError(_ENGINE_NAMES.get(exc.field, exc.field), exc.message) from None


def case_texts(case: CaseInputs, geometry_texts: Mapping[str, str],
               fit_texts: Mapping[str, str]) -> dict[str, str]:
    """The form's texts for a session load case: its kind, arrangement, contact angle (unless the
    geometry gives one), loads and speed, and its lubrication as the case's derivation finds it
    (ν, eC, Cu), with the bearing's geometry and fit texts over them."""
    texts: dict[str, str] = {"kind": case.kind, "fr": f"{case.fr!r} N", "fa": f"{case.fa!r} N",
                             "speed": f"{case.speed!r} r/min"}
    if case.arrangement in _ARRANGEMENT_WORDS:
        texts["arrangement"] = case.arrangement
    if case.contact_angle is not None and "contact_angle" not in unread_fields(case.kind):
        texts["contact_angle"] = f"{case.contact_angle!r}°"  # not a cylindrical bearing's: α = 0
    try:
        results = derive(case, keep_steps=False).results
    except InputError:
        results = {}
    if "nu" in results and "eC" in results:
        texts["nu"] = f"{results['nu']!r} mm²/s"
        texts["cleanliness"] = repr(results["eC"])
        if case.cu is not None:
            texts["cu"] = f"{case.cu!r} N"
    texts.update({k: v for k, v in geometry_texts.items() if v.strip()})
    texts.update({k: v for k, v in fit_texts.items() if v.strip()})
    return texts


def internal_for_case(case: CaseInputs, geometry_texts: Mapping[str, str],
                      fit_texts: Mapping[str, str], *, keep_steps: bool = True) -> InternalResult:
    """The internal analysis of a session load case whose bearing geometry is known.

    ``geometry_texts`` are the rating form's texts (elements, dw, dpw, lwe, contact_angle, …);
    ``fit_texts`` any of :data:`FIT_INPUTS` (clearance, preload, tilt, moment).  Errors as
    :func:`analyse_texts`."""
    return analyse_texts(case_texts(case, geometry_texts, fit_texts), keep_steps=keep_steps)


def clearance_curve_for_case(case: CaseInputs, geometry_texts: Mapping[str, str],
                             fit_texts: Mapping[str, str], *, count: int = 25) -> list[SweepPoint]:
    """L10r against operating clearance for the What-if plot (the engine's
    :func:`~workbench.engine.internal.analysis.clearance_sweep` over
    :func:`~workbench.engine.internal.analysis.default_clearances`); a pair's preload is set
    aside, the clearance standing for it."""
    inputs = inputs_from_texts(case_texts(case, geometry_texts, fit_texts))
    try:
        return clearance_sweep(inputs, default_clearances(inputs, count=count))
    except InputError as exc:
        raise FieldError(_ENGINE_NAMES.get(exc.field, exc.field), exc.message) from None
