"""The workbench application: global keys, themes, the main screen, quitting and recovery.

``run_app(path)`` opens a session file (None: the shipped demo session) and runs the screen.
"""

from __future__ import annotations

import os
import sys
from collections.abc import Iterable, Sequence
from pathlib import Path
from typing import Any

from textual.app import App, SystemCommand
from textual.command import CommandListItem, SimpleProvider
from textual.screen import Screen
from textual.widget import AwaitMount
from textual.binding import Binding
from textual.notifications import SeverityLevel

from ..model.session import Session
from ..model import files, settings
from ..model.document import Document
from ..model.safe_write import FileStamp
from .actions import ACTIONS, bindings, check_keymap
from .commands import WorkbenchCommands, WorkbenchPalette
from .theme_files import DEFAULT_THEME, MONOCHROME_THEME, load_theme_files
from .workbench_screen import AUTOSAVE_DELAY_S, WorkbenchScreen


def no_color_requested() -> bool:
    """Whether the NO_COLOR convention asks for no colour (set and not empty)."""
    return bool(os.environ.get("NO_COLOR"))


class WorkbenchApp(App[int]):
    """A keyboard-first workbench for one session of load cases."""

    CSS_PATH = Path(__file__).with_name("app.tcss")  # found from subclasses anywhere too
    TITLE = "Bearing workbench"
    COMMANDS = App.COMMANDS | {WorkbenchCommands}
    BINDINGS = [Binding("ctrl+c", "help_quit", show=False, system=True), *bindings("app")]

    def __init__(self, session: Session | None = None, path: Path | None = None, *,
                 offer_recovery: bool = True,
                 autosave_delay: float | None = AUTOSAVE_DELAY_S,
                 theme_folder: Path | None = None, greeting: str = "",
                 stamp: FileStamp | None = None) -> None:
        super().__init__()
        self._greeting = greeting
        self.document = Document(session if session is not None else Session(), path,
                                 stamp=stamp)
        self._offer_recovery = offer_recovery
        self._autosave_delay = autosave_delay
        self._theme_folder = theme_folder
        self._our_themes: list[str] = []
        self._remember_theme = False
        saved, self._settings_problem = settings.load_settings()
        self._theme_problem = self._install_themes(settings.theme_in(saved))
        self.personal_keymap: dict[str, str] = {}
        """The person's keys in force (action id → keys), from ``keys.toml``."""
        self._keymap_problems = self._install_keymap()

    def notify(self, message: str, *, title: str = "", severity: SeverityLevel = "information",
               timeout: float | None = None, markup: bool = False) -> None:
        """A notification; its text (names, paths, messages quoting what was typed) is shown as
        written, never read as markup."""
        super().notify(message, title=title, severity=severity, timeout=timeout, markup=False)

    def get_default_screen(self) -> WorkbenchScreen:
        """The workbench screen is the base of the screen stack."""
        return WorkbenchScreen(self.document, self._autosave_delay)

    @property
    def workbench_screen(self) -> WorkbenchScreen:
        """The main screen (under any dialog)."""
        screen = self.screen_stack[0]
        assert isinstance(screen, WorkbenchScreen)
        return screen

    def on_mount(self) -> None:
        """Report theme files that failed, then offer a recovery copy if one was left behind."""
        if self._settings_problem is not None:
            self.notify(self._settings_problem, title=settings.SETTINGS_FILE, severity="warning",
                        timeout=12)
        if self._theme_problem is not None:
            self.notify(self._theme_problem, title="Themes", severity="warning", timeout=8)
        if self._keymap_problems:
            self.notify("\n".join(self._keymap_problems), title=settings.KEYS_FILE,
                        severity="warning", timeout=12)
        if self._greeting:
            self.notify(self._greeting, timeout=10)
        if self._offer_recovery:
            self._ask_about_recovery()

    # ---- themes -----------------------------------------------------------------------------
    def _install_themes(self, saved_theme: str | None) -> str | None:
        """Register the theme files and choose the theme (``saved_theme``, the one remembered,
        unless NO_COLOR asks for none); the message naming the files that failed, if any."""
        load = load_theme_files(self._theme_folder)
        for theme in load.themes:
            self.register_theme(theme)
        self._our_themes = [theme.name for theme in load.themes]
        wanted = MONOCHROME_THEME if no_color_requested() else saved_theme
        for name in (wanted, DEFAULT_THEME):
            if name and name in self.available_themes:
                self.theme = name
                break
        self._remember_theme = not no_color_requested()
        return load.failure_message()

    def _install_keymap(self) -> list[str]:
        """Move the actions named in the person's key table to their keys; what was refused."""
        table, unreadable = settings.key_table()
        self.personal_keymap, problems = check_keymap(table)
        self.set_keymap(self.personal_keymap)
        return [unreadable] if unreadable else problems

    def watch_theme(self, name: str) -> None:
        """Remember a theme the person chose (not the one set at start)."""
        if self._remember_theme:
            problem = settings.save_theme(name)
            if problem is not None:
                self.notify(problem, severity="warning")

    def action_next_theme(self) -> None:
        """Switch to the next of the workbench's own themes."""
        names = self._our_themes or [self.theme]
        index = names.index(self.theme) if self.theme in names else -1
        self.theme = names[(index + 1) % len(names)]
        self.notify(f"Theme {self.theme}")

    def get_system_commands(self, screen: Screen[Any]) -> Iterable[SystemCommand]:
        """Textual's palette commands, less those the workbench's own table offers: its "Theme"
        listed every registered theme, Textual's own among them, beside the workbench's
        "Theme" (alt+t), which goes through the project's four; its "Quit" ran the same
        action as ours.  Two entries of one name read as one command listed twice."""
        ours = {self.action_change_theme} | {getattr(self, f"action_{action.action}")
                                             for action in ACTIONS if action.scope == "app"}
        for command in super().get_system_commands(screen):
            if command.callback not in ours:
                yield command

    # ---- screens ----------------------------------------------------------------------------
    # Every palette is a WorkbenchPalette, which closes once (Textual's own could pop the screen
    # under it); these two are the places Textual makes one.
    def action_command_palette(self) -> None:
        """Show the command palette."""
        if self.use_command_palette and not WorkbenchPalette.is_open(self):
            self.push_screen(WorkbenchPalette(id="--command-palette"))

    def search_commands(self, commands: Sequence[CommandListItem],
                        placeholder: str = "Search for commands…") -> AwaitMount:
        """A palette of the given commands."""
        return self.push_screen(WorkbenchPalette(  # type: ignore[return-value]
            providers=[SimpleProvider(self.screen, commands)], placeholder=placeholder))

    def action_help(self) -> None:
        """Show every key and what it does."""
        from .help_screen import HelpScreen  # loaded when first opened, like the about screen

        if not isinstance(self.screen, HelpScreen):
            self.push_screen(HelpScreen(self.personal_keymap))

    def action_about(self) -> None:
        """Show the standards and the safety caution."""
        from .about_screen import AboutScreen  # loaded when first opened

        if not isinstance(self.screen, AboutScreen):
            self.push_screen(AboutScreen())

    async def action_quit(self) -> None:
        """Leave, asking first when there is unsaved work."""
        if not self.document.dirty:
            self.exit(0)
            return
        from .dialogs import ChoiceDialog  # loaded when the first dialog opens

        if isinstance(self.screen, ChoiceDialog):
            return

        def answered(answer: str | None) -> None:
            if answer == "quit":
                files.discard_recovery_copy(self.document.path)
                self.exit(0)
            elif answer == "save":
                self.workbench_screen.save(then=lambda: self.exit(0))

        self.push_screen(ChoiceDialog(files.UNSAVED_TITLE, *files.UNSAVED_BEFORE_QUIT), answered)

    # ---- recovery ---------------------------------------------------------------------------
    def _ask_about_recovery(self) -> None:
        """Offer the recovery copy a run that did not end cleanly left for this file.  Only an
        explicit "discard" deletes it; escape or "keep it" sets it aside under a name of its own
        (named in a notice), so the autosave of this run cannot write over it."""
        found = files.recovery_for(self.document.path)
        if found is None:
            return
        from .dialogs import ChoiceDialog

        def answered(answer: str | None) -> None:
            if answer == "discard":
                files.discard_recovery_copy(self.document.path)
                return
            if answer != "recover":
                kept = files.keep_recovery_copy(self.document.path)
                self.notify(f"The recovery copy is kept as {kept}: open it with ctrl+o"
                            if kept is not None else f"The recovery copy stays at {found}",
                            title="Recovery", timeout=20)
                return
            outcome = files.open_session(found, recovered=True)
            if outcome.session is None:
                self.notify(outcome.error or "recovery copy unreadable", severity="error")
                return
            self.workbench_screen.open_session(outcome.session, self.document.path, dirty=True,
                                               stamp=self.document.stamp)
            self.notify("Recovered the unsaved work: save it to keep it")

        self.push_screen(ChoiceDialog(
            "Recover unsaved work?",
            f"A recovery copy from a run that did not end cleanly was found:\n{found}\n"
            "Keep it aside: open the file as saved and keep the copy under a new name.",
            [("recover", "Recover it"), ("keep", "Keep it aside"), ("discard", "Discard it")]),
            answered)


def app_for(path: str | None, **options: Any) -> WorkbenchApp | str:
    """The workbench as ``workbench [FILE]`` opens it: on the session file at ``path``, a new
    session there when no file is (written on the first save), or the demo session (None);
    ``options`` go to :class:`WorkbenchApp`.  The message to print when it cannot open."""
    if path is None:
        demo = files.demo_path()
        if demo is None:
            return "the demo session is not available"
        outcome = files.open_session(demo)
        file_path = None  # the demo is read-only: the first save asks for a name
    else:
        file_path = Path(path)
        if not file_path.exists():
            outcome = files.FileOutcome(session=Session(title=file_path.stem), path=file_path,
                                        messages=[f"New session {file_path.name}: no file there "
                                                  "yet; ctrl+s writes it. Add a case with "
                                                  "ctrl+n, the targets with alt+i."])
        else:
            outcome = files.open_session(file_path)
    if outcome.session is None:
        return outcome.error or "the session could not be opened"
    return WorkbenchApp(outcome.session, file_path, greeting=" ".join(outcome.messages),
                        stamp=outcome.stamp if file_path is not None else None, **options)


def run_app(path: str | None) -> int:
    """Run the workbench on the session file at ``path`` (None: the demo session); exit code."""
    app = app_for(path)
    if isinstance(app, str):
        print(f"workbench: {app}", file=sys.stderr)
        return 2
    return exit_code(app, app.run())


def exit_code(app: WorkbenchApp, result: object) -> int:
    """The process's exit code once ``app`` has stopped with ``result``: its own code, or 1 when
    it stopped on an error (Textual has printed the traceback), in which case unsaved work is
    written to the recovery copy first and one line says where."""
    code = app.return_code or 0
    if code == 0:
        return result if isinstance(result, int) else 0
    document = app.document
    if document.dirty:
        problem = files.write_recovery_copy(document.session, document.path)
        where = files.recovery_for(document.path) if problem is None else None
        print("workbench: the screen stopped on an error; "
              + (f"the unsaved work is in {where}: the next start on this file offers it"
                 if where is not None else problem or "the unsaved work could not be kept"),
              file=sys.stderr)
    else:
        print("workbench: the screen stopped on an error (nothing unsaved was lost)",
              file=sys.stderr)
    return code
