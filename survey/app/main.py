"""The app object: opening surveys, moving between the walk's screens, saving in a worker,
the status line."""

from __future__ import annotations

import datetime as dt
import os
import shutil
from collections.abc import Callable
from pathlib import Path

from textual.app import App
from textual.binding import Binding
from textual.message import Message

from survey.app.editing import Editor, Recents, SaveOutcome
from survey.errors import SurveyFileError

DEMO_SOURCE = Path(__file__).with_name("demo_site.json")
DEMO_NAME = "demo-flat-9.json"
#: Seconds between retries after a save failed.
RETRY_S = 5.0


class SaveDone(Message):
    """A save in the worker finished (posted from the worker thread)."""

    def __init__(self, outcome: SaveOutcome) -> None:
        super().__init__()
        self.outcome = outcome


class SurveyApp(App):
    """condition-survey's walk-through app."""

    CSS_PATH = "survey.tcss"
    TITLE = "condition-survey"
    ENABLE_COMMAND_PALETTE = True
    BINDINGS = [
        Binding("f1", "help", "Help", id="help", priority=True),
        Binding("f2", "go('site')", "Site", id="go_site", priority=True),
        Binding("f3", "go('visit')", "Visit", id="go_visit", priority=True),
        Binding("f4", "go('rooms')", "Rooms", id="go_rooms", priority=True),
        Binding("f5", "go('findings')", "Findings", id="go_findings", priority=True),
        Binding("f6", "quick_check", "Quick check", id="quick_check", priority=True),
        Binding("f8", "go('report')", "Report", id="go_report", priority=True),
        Binding("ctrl+s", "save", "Save now", id="save", priority=True, show=False),
        Binding("ctrl+q", "quit", "Quit", id="quit", priority=True),
    ]

    def __init__(
        self,
        *,
        path: Path | None = None,
        create: str | None = None,
        demo: bool = False,
        data_dir: Path | None = None,
        clock: Callable[[], dt.datetime] | None = None,
        fresh_demo: bool = False,
        use_data_dir: bool = True,
    ) -> None:
        super().__init__()
        from survey.app.palette import SurveyCommands

        self.COMMANDS = App.COMMANDS | {SurveyCommands}
        self.data_dir = (
            data_dir
            if data_dir is not None
            else (Recents.default_folder() if use_data_dir else None)
        )
        self.recents = Recents(self.data_dir)
        self.clock = clock or dt.datetime.now
        self.editor: Editor | None = None
        #: The room of the open survey shown last (the room list's cursor goes back to it).
        self.last_room_id: str | None = None
        self.status_text = "No survey open."
        self.status_kind = ""
        #: A plain note shown since the last save (see ``on_save_done``).
        self._note: str | None = None
        self._start = (path, create, demo, fresh_demo)
        self._retry_timer = None
        #: Quitting was confirmed (half a reading on screen is let go).
        self._quitting = False
        #: The user's own keys (binding id to key) from the keys file in the data folder.
        self.user_keys: dict[str, str] = {}

    # --- start-up --------------------------------------------------------------------------

    def on_mount(self) -> None:
        from survey.app.keymap import load

        self.user_keys, problems = load(self.data_dir)
        if self.user_keys:
            self.set_keymap(self.user_keys)
        path, create, demo, fresh = self._start
        opened = False
        if demo:
            opened = self.open_demo(fresh=fresh)
        elif path is not None:
            opened = self.create_survey(path, create) if create else self.open_survey(path)
        if not opened:
            self.show_start()
        if problems:
            self.show_status("Keys file: " + "; ".join(problems) + ".", "error")

    @property
    def display_units(self):
        """The :class:`survey.words.Display` of the open survey's unit system."""
        from survey import words

        return words.Display(self.editor.unit_system if self.editor else "si")

    def demo_path(self) -> Path:
        folder = (self.data_dir or Path.cwd()) / "demo"
        return folder / DEMO_NAME

    def open_demo(self, fresh: bool = False) -> bool:
        """Copy the bundled example site to the data folder (once, or afresh) and open it;
        the bundled file is never edited."""
        target = self.demo_path()
        if fresh and self._is_open(target):
            self.close_survey()  # its lock is ours: released before the copy is replaced
        try:
            target.parent.mkdir(parents=True, exist_ok=True)
            if fresh or not target.exists():
                for stale in (target, Path(f"{target}.lock")):
                    if fresh and stale.exists():
                        stale.unlink()
                shutil.copyfile(DEMO_SOURCE, target)
                # a fresh copy starts at the room list, not at the room last edited
                self.recents.remember(target, "", "")
        except OSError as exc:
            self.show_status(f"The demo could not be copied to {target}: {exc}", "error")
            return False
        return self.open_survey(target)

    def _is_open(self, path: Path) -> bool:
        """Whether ``path`` is the survey open now."""
        current = self.editor.path if self.editor is not None else None
        if current is None:
            return False
        try:
            return os.path.samefile(current, path)
        except OSError:
            return current.resolve() == Path(path).resolve()

    def open_survey(self, path: Path) -> bool:
        if self._is_open(path):
            editor = self.editor
            assert editor is not None
            if not editor.read_only:
                # Opened again (from the recent list, say) while it is open here for editing:
                # go back to it. Reopening would read the file again, and edits a failing
                # save still holds would be lost; and the new session would find this one's
                # lock and open read-only.
                self.show_status(f"{editor.path.name} is open here already.")
                self.go("rooms")
                last = self.last_room_id
                if last is not None and any(r.id == last for r in editor.survey.rooms):
                    self.open_room(last)
                return True
            self.close_survey()  # open read-only here: let go, and try the lock again
        try:
            editor = Editor.open(path)
        except SurveyFileError as exc:
            self.show_status(f"Not opened: {exc}", "error")
            return False
        self._begin(editor)
        return True

    def create_survey(self, path: Path, reference: str) -> bool:
        try:
            editor = Editor.create(path, reference)
        except SurveyFileError as exc:
            self.show_status(f"Not created: {exc}", "error")
            return False
        self._begin(editor, new=True)
        return True

    def _begin(self, editor: Editor, new: bool = False) -> None:
        self.close_survey()
        self.editor = editor
        self.last_room_id = None
        assert editor.path is not None
        recent = self.recents.find(editor.path)
        self.recents.remember(
            editor.path, editor.survey.site.reference, recent.room if recent else ""
        )
        if editor.read_only:
            self.show_status(editor.read_only_reason, "error")
        elif editor.took_over is not None:
            self.show_status(
                f"Opened {editor.path.name}; an abandoned lock "
                f"({editor.took_over.describe()}) was taken over."
            )
        else:
            self.show_status(f"Opened {editor.path}. Every field is saved when committed.")
        if new:
            self.go("site")
            return
        self.go("rooms")
        if recent and recent.room and any(r.id == recent.room for r in editor.survey.rooms):
            self.open_room(recent.room)

    def close_survey(self) -> None:
        if self.editor is not None:
            self.editor.close()
            self.editor = None

    # --- moving between screens -----------------------------------------------------------
    # The stack is [default, start screen, walk screen, room screen]; started on a file, the
    # start screen is left out (it is built when first asked for) so the survey shows sooner.

    @property
    def _walk_base(self) -> int:
        """Screens under the walk's screens."""
        # by a mark rather than isinstance: opening a file need not import the start screen
        stack = self.screen_stack
        return 2 if len(stack) > 1 and getattr(stack[1], "IS_START", False) else 1

    def show_start(self) -> None:
        """The start screen: back under the walk, or built now."""
        from survey.app.start import StartScreen

        if not self.may_leave(self.show_start):
            return
        base = self._walk_base
        while len(self.screen_stack) > base:
            self.pop_screen()
        if base == 1:
            self.push_screen(StartScreen())

    def may_leave(self, then: Callable[[], object]) -> bool:
        """Whether the walk's screens can be left now. Text typed but not committed is
        committed first (leaving commits it anyway). Half an air reading on any of them (a
        temperature with no RH, or the other way round), which is not saved, is asked about
        first, as quitting asks: let go, the half is dropped and ``then`` runs; kept,
        nothing moves. While the question is showing, nothing else leaves."""
        if self._asking():
            return False  # asked already: answered there
        pairs = self._half_readings()
        if self._asking():
            return False  # committing what was typed raised a question: answered first
        if not pairs:
            return True
        from survey.app.dialogs import ConfirmDialog

        def answered(yes: bool | None) -> None:
            if yes:
                for pair in pairs:
                    pair.show_reading(pair.reading)  # back to what is saved
                then()

        question = ConfirmDialog(
            "Not saved: "
            + "; ".join(str(p.unsaved_half()) for p in pairs)
            + " (a reading is saved once it has both). Leave it unsaved?"
        )
        question.leave_question = True
        self.push_screen(question, answered)
        return False

    def go(self, name: str) -> None:
        """Show one of the walk's screens (above the start screen)."""
        import importlib

        if self.editor is None:
            self.show_status("Open or create a survey first (on the start screen).", "error")
            return
        if not self.may_leave(lambda: self.go(name)):
            return
        if name != "site":
            self.ensure_visit()
        if name == "visit" and not self.editor.survey.visits:  # read-only, none recorded
            self.show_status("This survey has no visit, and it is open read-only.", "error")
            name = "rooms"
        module, class_name = {
            "site": ("site", "SiteScreen"),
            "visit": ("visit", "VisitScreen"),
            "rooms": ("rooms", "RoomListScreen"),
            "findings": ("findings", "FindingsScreen"),
            "report": ("report_view", "ReportScreen"),
        }[name]
        screen = getattr(importlib.import_module(f"survey.app.{module}"), class_name)
        base = self._walk_base
        popped = False
        while len(self.screen_stack) > base + 1:
            self.pop_screen()
            popped = True
        top = self.screen_stack[-1] if len(self.screen_stack) == base + 1 else None
        if (
            getattr(screen, "KEPT", False)
            and type(top) is screen
            and getattr(top, "opened_with", None) is self.editor
        ):
            # a screen that keeps its place (the room list: its cursor and undo), of the same
            # survey: kept, and redrawn for what another screen changed. Others (the visit
            # and site screens, built on the visit chosen and the unit system) are built again.
            if not popped:
                top.refresh_view()
            return
        shown = screen()
        shown.opened_with = self.editor
        if top is not None:
            self.switch_screen(shown)
        else:
            self.push_screen(shown)

    def action_go(self, name: str) -> None:
        self.go(name)

    def open_room(self, room_id: str) -> None:
        from survey.app.room import RoomScreen

        editor = self.editor
        if editor is None or not self.may_leave(lambda: self.open_room(room_id)):
            return
        self.ensure_visit()
        if not editor.survey.visits:
            self.show_status("This survey has no visit, and it is open read-only.", "error")
            return
        base = self._walk_base
        while len(self.screen_stack) > base + 2:
            self.pop_screen()
        if len(self.screen_stack) == base + 2:
            self.switch_screen(RoomScreen(room_id))
        else:
            self.push_screen(RoomScreen(room_id))
        if editor.path is not None:
            self.recents.remember(editor.path, editor.survey.site.reference, room_id)
        self.last_room_id = room_id

    def ensure_visit(self) -> None:
        """A survey with no visit gets one starting now, so readings have a home."""
        from survey.app import judging

        editor = self.editor
        if editor is not None and not editor.survey.visits and not editor.read_only:
            editor.survey.visits.append(judging.new_visit(self.clock()))
            editor.visit_index = 0
            self.committed()

    def action_help(self) -> None:
        from survey.app.help import HelpScreen

        if isinstance(self.screen, HelpScreen):
            self.pop_screen()
        else:
            self.push_screen(HelpScreen())

    def action_quick_check(self) -> None:
        from survey.app.quick import QuickScreen

        if not isinstance(self.screen, QuickScreen):
            self.push_screen(QuickScreen())

    # --- saving ---------------------------------------------------------------------------

    def committed(self) -> None:
        """A change was committed: save it at once, in a worker."""
        if self.editor is None:
            return
        self.editor.changed()
        self.request_save()

    def request_save(self) -> None:
        editor = self.editor
        if editor is None or editor.session is None:
            return
        self.run_worker(
            lambda: self.post_message(SaveDone(editor.save())),
            thread=True,
            group="save",
            name="save",
            exit_on_error=False,
        )

    def action_save(self) -> None:
        if self.editor is not None and self.editor.read_only:
            self.show_status(self.editor.read_only_reason, "error")
            return
        self.request_save()

    def on_save_done(self, message: SaveDone) -> None:
        outcome = message.outcome
        if outcome.ok:
            if self._retry_timer is not None:
                self._retry_timer.stop()
                self._retry_timer = None
            saved = f"Saved {outcome.at:%H:%M:%S}."
            # a note shown since the last save (a deletion's "u puts it back") stays beside
            # the first save after it, not replaced by it at once
            note = self._note if self._note is not None else ""
            self.show_status(f"{note} {saved}".strip(), "saved")
        else:
            self.show_status(
                f"NOT SAVED {outcome.at:%H:%M:%S}: {outcome.problem}. Your "
                f"changes are kept and saving is retried every "
                f"{RETRY_S:g} s (Ctrl+S to retry now).",
                "error",
            )
            if self._retry_timer is None:
                self._retry_timer = self.set_interval(RETRY_S, self.request_save)

    def show_status(self, text: str, kind: str = "") -> None:
        from survey.app.status import StatusBar

        # a plain note waits for the next save to be shown beside it; anything else ends it
        self._note = text if kind == "" else None
        self.status_text, self.status_kind = text, kind
        for bar in self.screen.query(StatusBar):
            bar.show(text, kind)

    def _half_readings(self):
        """The air readings on any open screen that are half typed (a temperature with no
        RH, or the other way round), after what was typed but not committed is committed."""
        from survey.app.air import AirPair

        for screen in self.screen_stack:
            commit = getattr(screen, "commit_pending", None)
            if commit is not None:
                commit()
        return [
            pair
            for screen in self.screen_stack
            for pair in screen.query(AirPair)
            if pair.unsaved_half() is not None
        ]

    def _asking(self) -> bool:
        """Whether a question that holds the walk where it is is showing (see
        :meth:`may_leave`)."""
        return any(getattr(screen, "leave_question", False) for screen in self.screen_stack)

    async def action_quit(self) -> None:
        asked = self._asking()
        halves = [str(pair.unsaved_half()) for pair in self._half_readings()]
        if not halves and not asked and self._asking() and not self._quitting:
            return  # committing what was typed raised a question: answered first
        if halves and not self._quitting:
            from survey.app.dialogs import ConfirmDialog

            if isinstance(self.screen, ConfirmDialog):  # asked already: Ctrl+Q again quits
                self._quitting = True
                self.screen.dismiss(False)
                self.call_next(self.action_quit)
                return

            def answered(yes: bool | None) -> None:
                if yes:
                    self._quitting = True
                    self.call_next(self.action_quit)

            self.push_screen(
                ConfirmDialog(
                    "Not saved: "
                    + "; ".join(halves)
                    + " (a reading is saved once it has both). Quit anyway?"
                ),
                answered,
            )
            return
        self.close_survey()
        self.exit()

    def on_unmount(self) -> None:
        self.close_survey()
