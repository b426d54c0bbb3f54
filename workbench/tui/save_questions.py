"""What the screen asks before a save replaces a file it must not replace in silence.

Three questions (:data:`workbench.model.files.QUESTIONS`): the file there changed on disk since
this window read it (another window or program saved it), it is not a session file at all
(``README.md``), or it holds another session (save-as onto it).  Each offers the same three
answers, the safe one first so that a stray enter never replaces anything: save elsewhere (the
save-as prompt), replace it (the replaced version is kept as ``NAME.bak``), or cancel.  Imported
when the first question comes up.
"""

from __future__ import annotations

from collections.abc import Callable
from typing import TYPE_CHECKING

from ..model.files import FileOutcome
from ..model.user_text import clipped_path
from .dialogs import ChoiceDialog

if TYPE_CHECKING:
    from .workbench_screen import WorkbenchScreen

TITLES = {
    "changed on disk": "The file changed on disk",
    "not a session": "Not a session file",
    "exists": "Another session is there",
}

AFTER = {
    "changed on disk": "Replacing it drops the other version's changes from the file (it is kept "
                       "as {backup} until the next save). Saving elsewhere keeps both.",
    "not a session": "Replacing it keeps the file as it was in {backup} until the next save.",
    "exists": "Replacing it keeps that session in {backup} until the next save.",
}

ANSWERS = [("elsewhere", "Save elsewhere…"), ("replace", "Replace it"), ("cancel", "Cancel")]


class SaveQuestion(ChoiceDialog):
    """A question before saving (its kind in :attr:`kind`); answers ``elsewhere``, ``replace``
    or ``cancel`` (escape: None, as cancel)."""

    def __init__(self, kind: str, message: str, backup: str) -> None:
        super().__init__(TITLES[kind], f"{message}\n{AFTER[kind].format(backup=backup)}",
                         ANSWERS)
        self.kind = kind


def ask_before_saving(screen: WorkbenchScreen, outcome: FileOutcome,
                      then: Callable[[], object] | None, confirmed: frozenset[str]) -> None:
    """Ask the question ``outcome`` holds, then save as answered (``then`` runs once saved)."""
    assert outcome.question is not None and outcome.path is not None
    path, kind = outcome.path, outcome.question
    if isinstance(screen.app.screen, SaveQuestion):
        return  # a second save in the same burst: the first question is still open

    def answered(answer: str | None) -> None:
        if answer == "replace":
            screen.save_to(path, then, confirmed=confirmed | {kind})
        elif answer == "elsewhere":
            screen.save_as(then)

    backup = clipped_path(path.with_name(path.name + ".bak"))
    screen.app.push_screen(SaveQuestion(kind, outcome.error or str(path), backup), answered)
