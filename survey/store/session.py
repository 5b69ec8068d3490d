"""Editing a survey: the lock held, atomic saves, changes by others noticed.

:func:`open_for_editing` takes the lock (:mod:`survey.store.lock`), removes temporary files
a killed save left behind, and loads the survey; the :class:`EditSession` saves with the
stamp of the version read, so a save over a file that changed on disk since is refused. A
file that failed to load never gets a session, so it is never overwritten.
"""

from __future__ import annotations

import os
import re
from pathlib import Path

from survey.errors import SurveyFileError
from survey.model import Survey
from survey.store.fileio import (
    FileStamp,
    file_stamp,
    remove_quietly,
    resolve,
    target_state,
)
from survey.store.lock import (
    LockInfo,
    TakeoverGuard,
    acquire_lock,
    lock_path,
    pid_alive,
    release_lock,
)
from survey.store.survey_file import load_survey, save_survey


class EditSession:
    """A survey open for editing: holds the lock, saves atomically, notices outside changes.

    Use as a context manager (the lock is released on exit)::

        with open_for_editing("flat7.json") as session:
            session.survey.visits.append(visit)
            session.save()
    """

    def __init__(
        self,
        path: Path,
        survey: Survey,
        lock: LockInfo,
        took_over: LockInfo | None,
        stamp: FileStamp | None,
    ) -> None:
        self.path = path
        self.survey = survey
        self.lock = lock
        #: The stale lock this session replaced, to tell the user (``None`` if none).
        self.took_over = took_over
        self.stamp = stamp
        self.closed = False

    def save(self, survey: Survey | None = None) -> None:
        """Save ``survey`` (default: :attr:`survey`) and make it the session's survey."""
        if self.closed:
            raise SurveyFileError(self.path, "", "not saved: the editing session is closed")
        survey = self.survey if survey is None else survey
        self.stamp = save_survey(survey, self.path, expected=self.stamp)
        self.survey = survey

    def close(self) -> None:
        """Release the lock (the survey is not saved)."""
        if not self.closed:
            self.closed = True
            release_lock(self.path, self.lock)

    def __enter__(self) -> EditSession:
        return self

    def __exit__(self, *exc_info: object) -> None:
        self.close()


def open_for_editing(
    path: str | os.PathLike[str],
    *,
    create: Survey | None = None,
    take_over_stale: bool = True,
    force: bool = False,
) -> EditSession:
    """Lock and load the survey at ``path`` for editing.

    With ``create``, the file must not exist yet and is created from that survey. A stale
    lock is taken over (``EditSession.took_over`` says whose) unless ``take_over_stale`` is
    false; ``force`` takes over even a live lock. A file that fails to load raises
    :class:`~survey.errors.SurveyFileError` and is left untouched.
    """
    path = Path(path)
    ours, previous = acquire_lock(path, take_over_stale=take_over_stale, force=force)
    stamp: FileStamp | None
    try:
        remove_stale_temp_files(path)
        if create is not None:
            stamp = save_survey(create, path, exclusive=True)
            survey = create
        else:
            # The stamp is taken before reading: a change during the read makes the first
            # save refuse rather than overwrite a version nobody has seen.
            stamp = file_stamp(resolve(path))
            survey = load_survey(path)
            target_state(
                resolve(path),
                path,
                "cannot open for editing",
                "edit a copy of it, or make it writable first",
            )
    except BaseException:
        release_lock(path, ours)
        raise
    return EditSession(path, survey, ours, previous, stamp)


def remove_stale_temp_files(path: str | os.PathLike[str]) -> list[Path]:
    """Delete temporary files a killed save of ``path`` left behind; return their paths.

    Only files named like the store's temporaries (:func:`~survey.store.fileio.tmp_name`)
    whose writing process is gone.
    """
    target = resolve(path)
    pattern = re.compile(
        rf"^\.{re.escape(target.name)}(?:\.bak|\.lock|\.lock\.claim)?\.(\d+)-[0-9a-f]{{8}}\.tmp$"
    )
    removed = []
    guard = TakeoverGuard(lock_path(path))
    if guard.path.exists() and guard.clear_abandoned():
        removed.append(guard.path)
    try:
        names = os.listdir(target.parent)
    except OSError:
        return removed
    for name in names:
        m = pattern.match(name)
        if m is None:
            continue
        pid = int(m.group(1))
        if pid != os.getpid() and not pid_alive(pid):
            remove_quietly(target.parent / name)
            removed.append(target.parent / name)
    return removed
