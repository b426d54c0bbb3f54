"""Solver targets as a person types them: "Lnm=20000 h", "L10=900 Mrev", "s0=2".

The name is one of :data:`workbench.engine.solve.TARGETS`; the value is read through the unit
edge (:mod:`workbench.model.quantities`) into the engine's unit for that result: hours for the
lives in hours, millions of revolutions (10⁶ rev) for the lives in revolutions, a plain number
for the static safety factor s0 (ISO 76:2006 §9).
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from ..engine.solve import TARGETS
from .fields import FieldError
from .quantities import QuantityError, parse
from .session import Session
from .user_text import quoted

FOLLOWED_RESULT = "Lnm"
"""The result the session's life target is set on (:class:`~workbench.model.session.Targets`)."""

MILLION_REV_SPELLINGS = ("10⁶ rev", "10^6 rev", "1e6 rev")


def _target_value(name: str, text: str) -> float:
    """The value text in the engine unit of result ``name``."""
    unit = TARGETS[name][1]
    if unit == "h":
        return parse(text, "time", default_unit="h")
    if unit == "10⁶ rev":
        for spelling in MILLION_REV_SPELLINGS:
            if text.rstrip().endswith(spelling):
                text = text.rstrip()[: -len(spelling)] + "Mrev"
                break
        return parse(text, "revolutions", default_unit="Mrev")
    return parse(text, "dimensionless", default_unit="")


def followed_target(life: str) -> str:
    """The solver target that follows a session life target ``life`` ("30000 h" →
    "Lnm=30000 h"); "" when the session has none."""
    return f"{FOLLOWED_RESULT}={life.strip()}" if life.strip() else ""


def solver_target(session: Session) -> str:
    """The target the session's solver question aims at: its own where one was set, else the
    session's life target on Lnm; "" when neither is given."""
    return session.solver.target or followed_target(session.targets.life)


def kept_solver_target(session: Session, typed: str) -> str:
    """What the solver setup keeps of a target ``typed`` for a question: blank (still
    following the session's life target) when it was following and ``typed`` is that target,
    else ``typed`` (an explicit target stays explicit)."""
    typed = typed.strip()
    following = not session.solver.target and typed == followed_target(session.targets.life)
    return "" if following else typed


def parse_target_text(text: str) -> tuple[str, float]:
    """``(result name, value in the engine unit)`` from text like "Lnm=20000 h".

    A bare number takes the result's own unit (h, 10⁶ rev, or none for s0).  Raises
    :class:`~workbench.model.fields.FieldError` on the field ``target`` with a one-line message.
    """
    name, equals, value_text = text.partition("=")
    name = name.strip()
    names = ", ".join(TARGETS)
    if not equals or not name:
        raise FieldError("target", f"write a result, '=' and a value, e.g. Lnm=20000 h ({names})")
    if name not in TARGETS:
        raise FieldError("target", f"unknown result {quoted(name)}; use one of {names}")
    try:
        value = _target_value(name, value_text)
    except QuantityError as exc:
        raise FieldError("target", exc.message) from None
    if not (math.isfinite(value) and value > 0):
        raise FieldError("target", "the target value must be above zero")
    return name, value


def parse_between(unknown: str, texts: Sequence[str] | None) -> tuple[float, float] | None:
    """A search range for ``unknown`` in engine units, each end read like the unknown's own field
    ("15 r/s" for the speed; a plain number for the load scale); None for no range (both ends
    blank, or none given).  Raises FieldError on the field ``between``."""
    from ..engine.solve import UNKNOWNS
    from .fields import FIELD_BY_NAME, parse_field

    if texts is None or unknown not in UNKNOWNS or not any(text.strip() for text in texts):
        return None
    if len(texts) != 2 or not all(text.strip() for text in texts):
        raise FieldError("between", "give both ends of the range, or neither")
    values = []
    for text in texts:
        try:
            value = (parse_field(unknown, text) if unknown in FIELD_BY_NAME
                     else parse(text, "dimensionless", default_unit=""))
        except FieldError as exc:
            raise FieldError("between", exc.message) from None
        except QuantityError as exc:
            raise FieldError("between", exc.message) from None
        if not isinstance(value, float):
            raise FieldError("between", f"{text!r} is not a value of {unknown}")
        values.append(value)
    return values[0], values[1]
