"""The survey being edited, without any Textual: the editing session, read-only opening,
saving a snapshot from a worker thread, and the list of recent surveys.

The screens change records through :class:`Editor` only after the new record passed
:func:`survey.store.check_record`, so a value that failed validation is never saved.
"""

from __future__ import annotations

import datetime as dt
import os
import threading
from dataclasses import dataclass
from pathlib import Path

import msgspec

from survey import model, store
from survey.errors import SurveyFileError


@dataclass(frozen=True)
class SaveOutcome:
    """What one save did: ``ok`` with the time, or the store's message."""

    ok: bool
    at: dt.datetime
    problem: str = ""


class Editor:
    """One survey open in the app: editable through a session, or read-only with a reason."""

    def __init__(
        self,
        path: Path | None,
        survey: model.Survey,
        session: store.EditSession | None,
        read_only_reason: str = "",
    ) -> None:
        self.path = path
        self.survey = survey
        self.session = session
        self.read_only_reason = read_only_reason
        self.visit_index = len(survey.visits) - 1 if survey.visits else -1
        self.took_over = None if session is None else session.took_over
        self._generation = 0  # bumped by every committed change
        self._saved_generation = 0
        self._lock = threading.Lock()
        self.last_outcome: SaveOutcome | None = None

    # --- opening ---------------------------------------------------------------------------

    @classmethod
    def open(cls, path: str | os.PathLike[str]) -> Editor:
        """Open ``path`` for editing; a survey locked by someone else opens read-only.

        A file that fails to load raises :class:`SurveyFileError` and is left untouched."""
        path = Path(path)
        try:
            session = store.open_for_editing(path)
        except store.SurveyLocked as exc:
            return cls(path, store.load_survey(path), None, f"read-only: {exc.problem}")
        return cls(path, session.survey, session)

    @classmethod
    def create(cls, path: str | os.PathLike[str], reference: str) -> Editor:
        """Create a new survey file at ``path`` (it must not exist) and open it."""
        path = Path(path)
        session = store.open_for_editing(path, create=store.new_survey(reference))
        return cls(path, session.survey, session)

    @property
    def read_only(self) -> bool:
        return bool(self.read_only_reason)

    @property
    def unit_system(self) -> str:
        return self.survey.site.unit_system

    # --- changes and saving ----------------------------------------------------------------

    def changed(self) -> None:
        """Note a committed change (the caller then saves)."""
        self._generation += 1

    @property
    def unsaved(self) -> bool:
        return self._generation != self._saved_generation

    def save(self) -> SaveOutcome:
        """Save the survey as it is now (safe to call from a worker thread; saves run one
        at a time and a save finding nothing new to write does nothing)."""
        with self._lock:
            generation = self._generation
            if self.session is None or generation == self._saved_generation:
                return self.last_outcome or SaveOutcome(True, dt.datetime.now())
            # One encode is atomic with respect to the event loop's changes (it holds the
            # interpreter lock), so the snapshot is one consistent state.
            snapshot = msgspec.json.decode(msgspec.json.encode(self.survey), type=model.Survey)
            try:
                self.session.save(snapshot)
            except (SurveyFileError, OSError) as exc:
                self.last_outcome = SaveOutcome(False, dt.datetime.now(), str(exc))
                return self.last_outcome
            self._saved_generation = generation
            self.last_outcome = SaveOutcome(True, dt.datetime.now())
            return self.last_outcome

    def close(self) -> None:
        """Save what is unsaved (best effort) and release the lock."""
        if self.session is not None:
            if self.unsaved:
                self.save()
            self.session.close()


# --- the recent surveys ---------------------------------------------------------------------


class RecentEntry(msgspec.Struct, kw_only=True):
    path: str
    reference: str = ""
    room: str = ""  #: the room last edited, to return to it
    opened_at: dt.datetime | None = None


class Recents:
    """Recent surveys in the user's data folder, newest first (at most ``limit``)."""

    FILE = "recent-surveys.json"

    def __init__(self, folder: Path | None, limit: int = 12) -> None:
        self.folder = folder
        self.limit = limit

    @staticmethod
    def default_folder() -> Path:
        import platformdirs

        return Path(platformdirs.user_data_dir("condition-survey", appauthor=False))

    def entries(self) -> list[RecentEntry]:
        if self.folder is None:
            return []
        try:
            data = (self.folder / self.FILE).read_bytes()
            return msgspec.json.decode(data, type=list[RecentEntry])
        except (OSError, msgspec.DecodeError):
            return []

    def find(self, path: Path) -> RecentEntry | None:
        key = str(path.resolve())
        return next((e for e in self.entries() if e.path == key), None)

    def remember(self, path: Path, reference: str, room: str = "") -> None:
        if self.folder is None:
            return
        key = str(path.resolve())
        kept = [e for e in self.entries() if e.path != key]
        entry = RecentEntry(
            path=key,
            reference=reference,
            room=room,
            opened_at=dt.datetime.now().replace(microsecond=0),
        )
        try:
            self.folder.mkdir(parents=True, exist_ok=True)
            store.write_file_atomically(
                self.folder / self.FILE, msgspec.json.encode([entry, *kept][: self.limit])
            )
        except (OSError, SurveyFileError):
            pass  # the list is a convenience; a survey never fails to open over it
