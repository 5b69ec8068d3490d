"""A survey file on disk: load it, save it with a backup, never destroy evidence.

Loading (:func:`load_survey`)
    Any problem (see :mod:`survey.store.decoding`) raises one
    :class:`~survey.errors.SurveyFileError` naming the file, the place in the document and
    the problem. When the file is damaged and ``NAME.json.bak`` exists, the message says
    whether the backup loads and how to recover from it.

Saving (:func:`save_survey`)
    The survey is encoded and checked first (a record that fails its own checks is never
    written), then written with :func:`~survey.store.fileio.replace_atomically`; just
    before the rename the previous file is kept as ``NAME.json.bak`` (a hard link, or a
    synced copy where links are not supported). A failed save (read-only folder, full disk)
    raises ``SurveyFileError``, removes its temporary files and leaves the old file and the
    survey in memory as they were. A file there that does not load as a survey is never
    replaced, nor rotated into the backup over a good one, unless the caller asks for it
    (``replace_damaged``): then it is kept as ``NAME.json.damaged-<time>`` and the backup
    is left alone.
"""

from __future__ import annotations

import datetime as dt
import errno
import os
from pathlib import Path

from survey.errors import SurveyFileError
from survey.model import Survey
from survey.safe_text import shorten
from survey.store.decoding import (
    check_bytes,
    dumps_survey,
    loads_survey,
    schema_version,
)
from survey.store.fileio import (
    FileStamp,
    fsync_dir,
    named,
    os_problem,
    read_stamped,
    remove_quietly,
    replace_atomically,
    resolve,
    shown_name,
    target_state,
    tmp_name,
    write_synced,
)

#: Versions of survey files this process read and found loading, or wrote itself, by
#: resolved path: saving over one of them needs no fresh check that it loads.
_KNOWN_GOOD: dict[str, FileStamp] = {}


def forget_known_good() -> None:
    """Forget which files this process found loading (as if another program wrote them)."""
    _KNOWN_GOOD.clear()


def _remember_good(target: Path, stamp: FileStamp) -> None:
    if len(_KNOWN_GOOD) > 1000:
        _KNOWN_GOOD.clear()
    _KNOWN_GOOD[os.fspath(target)] = stamp


def backup_path(path: str | os.PathLike[str]) -> Path:
    """Where the previous version of ``path`` is kept: ``NAME.json.bak``."""
    path = named(path)
    return path.with_name(path.name + ".bak")


def _backup_hint(path: Path) -> str:
    try:
        bak = backup_path(path)
        saved = dt.datetime.fromtimestamp(bak.stat().st_mtime).strftime("%Y-%m-%d %H:%M")
    except (OSError, SurveyFileError):
        return ""
    try:
        loads_survey(read_stamped(bak)[0], bak)
    except SurveyFileError as exc:
        return (
            f". The backup {shown_name(bak)} (saved {saved}) is damaged too: "
            f"{shorten(exc.problem, 160)}"
        )
    return (
        f". The previous version is in {shown_name(bak)} (saved {saved}) and loads "
        f"cleanly: copy it over {shown_name(path)} to recover"
    )


def load_survey(path: str | os.PathLike[str]) -> Survey:
    """Load and check the survey at ``path``; older schema versions are upgraded in memory.

    Raises :class:`~survey.errors.SurveyFileError` for every kind of problem. A damaged file's
    message says whether ``NAME.json.bak`` is there and loads.
    """
    path = Path(path)
    try:
        data, stamp = read_stamped(path)
        survey = loads_survey(data, path)
        _remember_good(resolve(path), stamp)
        return survey
    except SurveyFileError as exc:
        if exc.where == "schema_version" and "newer" in exc.problem:
            raise
        hint = _backup_hint(path)
        if not hint:
            raise
        raise SurveyFileError(exc.path, exc.where, exc.problem + hint) from None


def read_schema_version(path: str | os.PathLike[str]) -> int:
    """The ``schema_version`` a survey file was written with (before any upgrade)."""
    path = Path(path)
    return schema_version(check_bytes(read_stamped(path)[0], path), path)


# --- saving ------------------------------------------------------------------------------


def _copy_synced(source: Path, copy: Path) -> bool:
    """Copy ``source`` (a survey that loaded, so of bounded size) to a new file ``copy``,
    fsynced; False when ``source`` is gone."""
    try:
        with open(source, "rb") as old:
            content = old.read()
    except FileNotFoundError:
        return False
    write_synced(copy, content, None)
    return True


def _keep_backup(target: Path) -> None:
    """Make ``NAME.json.bak`` the current content of ``target`` (if it exists)."""
    bak_tmp = tmp_name(target, ".bak")
    try:
        os.link(target, bak_tmp)
    except FileNotFoundError:
        return
    except OSError:  # no hard links here (FAT, some network shares): copy instead
        try:
            if not _copy_synced(target, bak_tmp):
                return
        except BaseException:
            remove_quietly(bak_tmp)
            raise
    try:
        os.replace(bak_tmp, backup_path(target))
    finally:
        # When the .bak already is a hard link to the survey, the rename of another link to
        # the same file does nothing and leaves its source: remove it (it is ours alone).
        remove_quietly(bak_tmp)


def damaged_copy_path(path: str | os.PathLike[str], when: dt.datetime | None = None) -> Path:
    """Where a damaged survey file is kept when a save replaces it:
    ``NAME.json.damaged-YYYYMMDD-HHMMSS`` (a number added if that name is taken)."""
    target = resolve(path)
    stamp = (when or dt.datetime.now()).strftime("%Y%m%d-%H%M%S")
    candidate = target.with_name(f"{target.name}.damaged-{stamp}")
    n = 2
    while os.path.lexists(candidate):
        candidate = target.with_name(f"{target.name}.damaged-{stamp}-{n}")
        n += 1
    return candidate


def _keep_damaged(target: Path) -> Path:
    """Keep the current (damaged) content of ``target`` under a new name, never replacing
    anything; return that name."""
    for _attempt in range(100):
        aside = damaged_copy_path(target)
        try:
            os.link(target, aside)
            return aside
        except FileExistsError:
            continue
        except OSError as exc:
            if exc.errno in (errno.ENOSPC, errno.EROFS, errno.EACCES, errno.EIO):
                raise
        try:  # no hard links here: an exclusive synced copy
            _copy_synced(target, aside)
        except FileExistsError:
            continue
        return aside
    raise OSError(errno.EEXIST, "no free name for the damaged copy")


def _load_problem(target: Path) -> str | None:
    """Why the file at ``target`` does not load as a survey, or ``None`` when it does."""
    try:
        data, stamp = read_stamped(target)
        loads_survey(data, target)
    except SurveyFileError as exc:
        return shorten(f"{exc.where}: {exc.problem}" if exc.where else exc.problem, 200)
    _remember_good(target, stamp)
    return None


def save_survey(
    survey: Survey,
    path: str | os.PathLike[str],
    *,
    backup: bool = True,
    exclusive: bool = False,
    expected: FileStamp | None = None,
    replace_damaged: bool = False,
) -> FileStamp:
    """Save ``survey`` to ``path`` atomically; return the stamp of the file written.

    ``backup`` keeps the previous version as ``NAME.json.bak``. ``exclusive`` refuses to
    replace an existing file. ``expected``, the stamp of the version this survey was read
    from, refuses to save over a file someone else changed since. A file there that does not
    load as a survey (damaged, not a survey, from a newer version) is refused, so that it is
    never lost and never rotated into the backup over a good one; with ``replace_damaged``
    it is kept as ``NAME.json.damaged-<time>`` (see :func:`damaged_copy_path`), the backup
    is left as it is, and the new file takes its place. A file that is read-only for the user
    is refused. On any failure the old file and ``survey`` are unchanged and
    :class:`~survey.errors.SurveyFileError` is raised.
    """
    shown = Path(path)
    target = resolve(path)
    data = dumps_survey(survey, shown)
    current = target_state(target, shown, "not saved")
    damaged = False
    if current is not None:
        if exclusive:
            raise SurveyFileError(shown, "", "not saved: the file already exists")
        stamp_now = FileStamp.of(current)
        if expected is not None and stamp_now != expected:
            raise SurveyFileError(
                shown,
                "",
                "not saved: the file was changed on disk by another program since "
                "it was opened; save under another name and compare the two",
            )
        if expected is None and _KNOWN_GOOD.get(os.fspath(target)) != stamp_now:
            problem = _load_problem(target)
            if problem is not None:
                if not replace_damaged:
                    raise SurveyFileError(
                        shown,
                        "",
                        f"not saved: the file there does not load as a survey "
                        f"({problem}). It is left as it is, and so is its backup; "
                        "save under another name, or move the file away first",
                    )
                damaged = True
    elif expected is not None:
        raise SurveyFileError(
            shown,
            "",
            "not saved: the file was deleted or moved since it was opened; save under another name",
        )
    if exclusive:
        stamp = _save_exclusive(target, shown, data)
    elif damaged:
        stamp = replace_atomically(
            target, shown, data, current, "not saved", lambda: _keep_damaged(target)
        )
    else:
        keep = (lambda: _keep_backup(target)) if backup and current is not None else None
        stamp = replace_atomically(target, shown, data, current, "not saved", keep)
    _remember_good(target, stamp)
    return stamp


def _save_exclusive(target: Path, shown: Path, data: bytes) -> FileStamp:
    """Create ``target`` with ``data``, never replacing a file that exists."""
    tmp = tmp_name(target)
    try:
        stamp = write_synced(tmp, data, None)
        try:
            os.link(tmp, target)
        except FileExistsError:
            raise SurveyFileError(shown, "", "not saved: the file already exists") from None
        except OSError as exc:
            if exc.errno in (errno.ENOSPC, errno.EROFS, errno.EACCES, errno.EIO):
                raise
            if os.path.lexists(target):
                raise SurveyFileError(shown, "", "not saved: the file already exists") from None
            os.replace(tmp, target)
        else:
            remove_quietly(tmp)
    except SurveyFileError:
        remove_quietly(tmp)
        raise
    except OSError as exc:
        remove_quietly(tmp)
        raise SurveyFileError(
            shown, "", f"not saved: {os_problem(exc)}; no file was created"
        ) from None
    except BaseException:
        remove_quietly(tmp)
        raise
    fsync_dir(target.parent)
    return stamp
