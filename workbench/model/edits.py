"""The edits a person makes to a session, as commands the document's one undo stack keeps.

Every edit is a small record with :meth:`Edit.apply`, which changes the session and returns the
edit that puts it back (its inverse), and :attr:`Edit.touch`, what the change can alter in the
results.  Undo applies the inverse and keeps *its* inverse for redo, so one mechanism serves
every edit, from a keystroke in a field to deleting a bearing.

Cases are named by their index among the session's own cases, bearings by name.  Nothing here
checks that an edit makes sense (the document does, before it applies one): an edit only does
exactly what it says, so that its inverse is exact.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Literal, Protocol

from .duty_cycles import state_tables
from .session import Bearing, LoadCase, Session

Owner = Literal["case", "bearing", "geometry"]
Listed = Literal["cases", "bearings"]
SESSION_TEXTS = ("title", "project", "engineer", "revision", "notes")
TARGET_TEXTS = ("life", "reliability", "s0")


@dataclass(frozen=True)
class Touch:
    """What an edit can change in the results.

    ``cases``: own cases (by index) to derive again; ``bearings``: every case on these bearings;
    ``everything``: the whole session (a case added, a bearing renamed, a target changed);
    ``display``: nothing in the numbers, only how they are shown.
    """

    cases: frozenset[int] = frozenset()
    bearings: frozenset[str] = frozenset()
    everything: bool = False

    def __or__(self, other: Touch) -> Touch:
        return Touch(self.cases | other.cases, self.bearings | other.bearings,
                     self.everything or other.everything)


EVERYTHING = Touch(everything=True)
NOTHING = Touch()


class Edit(Protocol):
    """One change to a session; ``apply`` makes it and returns the edit that undoes it."""

    @property
    def touch(self) -> Touch: ...

    def apply(self, session: Session) -> Edit: ...


def _texts(session: Session, owner: Owner, key: int | str) -> dict[str, str]:
    if owner == "case":
        assert isinstance(key, int)
        return session.cases[key].texts
    bearing = session.bearing(str(key))
    if bearing is None:
        raise KeyError(f"no bearing called {key!r}")
    return bearing.geometry if owner == "geometry" else bearing.texts


@dataclass(frozen=True)
class SetText:
    """Set one typed field of a case (``key``: its index), a bearing or a bearing's internal
    geometry (``key``: its name); ``text`` None removes it, so the field falls back to its
    default.  The geometry touches no result of the ISO 281 chain (only the inside view, which
    follows the revision)."""

    owner: Owner
    key: int | str
    name: str
    text: str | None

    @property
    def touch(self) -> Touch:
        if self.owner == "case":
            return Touch(cases=frozenset({int(self.key)}))
        if self.owner == "geometry":
            return NOTHING
        return Touch(bearings=frozenset({str(self.key)}))

    def apply(self, session: Session) -> Edit:
        texts = _texts(session, self.owner, self.key)
        before = texts.get(self.name)
        if self.text is None:
            texts.pop(self.name, None)
        else:
            texts[self.name] = self.text
        return SetText(self.owner, self.key, self.name, before)


@dataclass(frozen=True)
class SetCaseBearing:
    """Let case ``index`` use the bearing called ``bearing``."""

    index: int
    bearing: str

    @property
    def touch(self) -> Touch:
        return Touch(cases=frozenset({self.index}))

    def apply(self, session: Session) -> Edit:
        case = session.cases[self.index]
        before, case.bearing = case.bearing, self.bearing
        return SetCaseBearing(self.index, before)


@dataclass(frozen=True)
class Insert:
    """Put ``item`` at ``index`` in the session's ``cases`` or ``bearings``."""

    items: Listed
    index: int
    item: LoadCase | Bearing
    touch: Touch = EVERYTHING

    def apply(self, session: Session) -> Edit:
        getattr(session, self.items).insert(self.index, self.item)
        return Remove(self.items, self.index)


@dataclass(frozen=True)
class Remove:
    """Take the item at ``index`` out of the session's ``cases`` or ``bearings`` (the
    document refuses to remove a bearing that cases use)."""

    items: Listed
    index: int
    touch: Touch = EVERYTHING

    def apply(self, session: Session) -> Edit:
        return Insert(self.items, self.index, getattr(session, self.items).pop(self.index))


@dataclass(frozen=True)
class MoveCase:
    """Swap the own case at ``index`` with the one at ``to``."""

    index: int
    to: int
    touch: Touch = EVERYTHING

    def apply(self, session: Session) -> Edit:
        cases = session.cases
        cases[self.index], cases[self.to] = cases[self.to], cases[self.index]
        return MoveCase(self.to, self.index)


@dataclass(frozen=True)
class RenameCase:
    """Rename own case ``index``; the solver's question and the duty cycles' states that name
    it follow the name (a file whose duty cycle names a case it lacks is refused on opening)."""

    index: int
    name: str
    touch: Touch = EVERYTHING  # duty cycles name their cases

    def apply(self, session: Session) -> Edit:
        case = session.cases[self.index]
        before = case.name
        if session.solver.case == before:
            session.solver.case = self.name
        for _, state in state_tables(session.reserved.get("duty_cycles")):
            if state.get("case") == before:
                state["case"] = self.name
        case.name = self.name
        return RenameCase(self.index, before)


@dataclass(frozen=True)
class RenameBearing:
    """Rename bearing ``old`` to ``new``, and every case and shaft that names it."""

    old: str
    new: str
    touch: Touch = EVERYTHING

    def apply(self, session: Session) -> Edit:
        bearing = session.bearing(self.old)
        if bearing is None:
            raise KeyError(f"no bearing called {self.old!r}")
        bearing.name = self.new
        for case in session.cases:
            if case.bearing == self.old:
                case.bearing = self.new
        shafts = session.reserved.get("shafts")
        if isinstance(shafts, list):
            for table in shafts:
                if isinstance(table, dict):
                    for side in ("bearing_a", "bearing_b"):
                        if table.get(side) == self.old:
                            table[side] = self.new
        return RenameBearing(self.new, self.old)


@dataclass(frozen=True)
class SetBearingOrigin:
    """Record where a bearing's data came from: its designation and source (a catalog file and
    row, or "rated from geometry")."""

    bearing: str
    designation: str
    source: str
    touch: Touch = NOTHING

    def apply(self, session: Session) -> Edit:
        bearing = session.bearing(self.bearing)
        if bearing is None:
            raise KeyError(f"no bearing called {self.bearing!r}")
        before = SetBearingOrigin(self.bearing, bearing.designation, bearing.source)
        bearing.designation, bearing.source = self.designation, self.source
        return before



@dataclass(frozen=True)
class SetSessionText:
    """Set one of the session's details (title, project, engineer, revision, notes)."""

    name: str
    text: str
    touch: Touch = NOTHING

    def apply(self, session: Session) -> Edit:
        before = getattr(session, self.name)
        setattr(session, self.name, self.text)
        return SetSessionText(self.name, before)


@dataclass(frozen=True)
class SetTarget:
    """Set one of the session's targets (life, reliability, s0) as typed."""

    name: str
    text: str
    touch: Touch = EVERYTHING

    def apply(self, session: Session) -> Edit:
        before = getattr(session.targets, self.name)
        setattr(session.targets, self.name, self.text)
        return SetTarget(self.name, before)


@dataclass(frozen=True)
class SetUnits:
    """Show the session in another unit system (SI or US); no number changes."""

    system: str
    touch: Touch = NOTHING

    def apply(self, session: Session) -> Edit:
        before, session.units = session.units, self.system
        return SetUnits(before)


@dataclass(frozen=True)
class SetTable:
    """Replace one of the session's tables kept as read (``shafts``, ``duty_cycles``); None
    removes it."""

    name: str
    value: object
    touch: Touch = EVERYTHING

    def apply(self, session: Session) -> Edit:
        before = session.reserved.get(self.name)
        if self.value is None:
            session.reserved.pop(self.name, None)
        else:
            session.reserved[self.name] = self.value
        return SetTable(self.name, before)


@dataclass(frozen=True)
class Together:
    """Several edits made as one step (adopting a catalog bearing sets many fields)."""

    edits: tuple[Edit, ...] = field(default_factory=tuple)

    @property
    def touch(self) -> Touch:
        touch = NOTHING
        for edit in self.edits:
            touch = touch | edit.touch
        return touch

    def apply(self, session: Session) -> Edit:
        inverses = [edit.apply(session) for edit in self.edits]
        return Together(tuple(reversed(inverses)))
