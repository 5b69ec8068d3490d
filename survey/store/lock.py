"""The editing lock: ``NAME.json.lock`` says who holds a survey open.

The lock records the process id, host, user, start time, Linux boot id and a random token.
A second opener is told who holds it; a lock left by a crashed process on this host (its
process is gone, or the host has rebooted since) is recognised as stale and taken over. A
takeover replaces the stale lock file in one ``os.replace`` while holding a short ``flock``
guard (released by the kernel if its holder dies), after checking that the lock still holds
exactly the stale content: several processes taking over at once end with one holder, and a
live lock is never removed. A lock from another host cannot be checked and is respected
unless the caller forces it. A session only ever removes its own lock.

A lock file comes from a shared folder like the survey: it is read with the bounded,
non-blocking reader (a named pipe planted as the lock reads as a damaged lock), and what it
says about its holder is shown shortened and with control characters made visible.
"""

from __future__ import annotations

import datetime as dt
import errno
import os
import time
from pathlib import Path

import msgspec

try:
    import fcntl
except ImportError:  # not on Windows
    fcntl = None  # type: ignore[assignment]

from survey.errors import SurveyFileError
from survey.safe_text import shorten
from survey.store.fileio import (
    NotARegularFile,
    fsync_dir,
    named,
    open_regular,
    os_problem,
    read_at_most,
    remove_quietly,
    resolve,
    shown_name,
    tmp_name,
    write_all,
    write_synced,
)

#: A lock file is a few hundred bytes; no more than this is read of one.
LOCK_MAX_BYTES = 65536


def hostname() -> str:
    """This computer's name, as a lock records it."""
    if hasattr(os, "uname"):
        return os.uname().nodename

    return hostname()  # pragma: no cover


class LockInfo(msgspec.Struct, kw_only=True, frozen=True):
    """Who holds a survey open for editing (the content of ``NAME.json.lock``)."""

    pid: int
    host: str
    user: str
    started_at: str  #: ISO 8601 local time
    program: str = ""
    boot_id: str = ""  #: Linux boot id; a different one means the host rebooted since
    token: str = ""

    def describe(self) -> str:
        """Who holds the lock, in words (what the lock file says is shortened and made
        visible: it comes from a shared folder)."""
        when = shorten(self.started_at.replace("T", " ")[:16], 16)
        return (
            f"{shorten(self.user, 40)} on {shorten(self.host, 60)} (process {self.pid}, "
            f"since {when})"
        )


class SurveyLocked(SurveyFileError):
    """The survey is open for editing elsewhere; ``holder`` says by whom."""

    def __init__(self, path: object, holder: LockInfo | None, problem: str) -> None:
        self.holder = holder
        super().__init__(path, "", problem)


def lock_path(path: str | os.PathLike[str]) -> Path:
    """The lock file of the survey at ``path``: ``NAME.json.lock``."""
    path = resolve(named(path))
    return path.with_name(path.name + ".lock")


def boot_id() -> str:
    """This boot's id (Linux), or '' where there is none."""
    try:
        with open("/proc/sys/kernel/random/boot_id", encoding="ascii") as handle:
            return handle.read().strip()
    except OSError:
        return ""


def _user() -> str:
    try:
        import getpass

        return getpass.getuser()
    except Exception:  # no login name in the environment or password database
        return "unknown user"


def pid_alive(pid: int) -> bool:
    if pid <= 0:
        return False
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except PermissionError:
        return True  # alive, owned by someone else
    except (OSError, ValueError, OverflowError):
        return False
    return True


def _this_lock() -> LockInfo:
    from survey import __version__

    return LockInfo(
        pid=os.getpid(),
        host=hostname(),
        user=_user(),
        started_at=dt.datetime.now().replace(microsecond=0).isoformat(),
        program=f"condition-survey {__version__}",
        boot_id=boot_id(),
        token=os.urandom(8).hex(),
    )


def _read_lock_bytes(lock: Path) -> bytes | None:
    """The lock file's content (``None`` if there is none); anything but a regular file
    reads as empty, which is a damaged lock, and is never waited on."""
    try:
        fd, st = open_regular(lock)
    except FileNotFoundError:
        return None
    except NotARegularFile:
        return b""
    try:
        return read_at_most(fd, LOCK_MAX_BYTES, st.st_size)
    finally:
        os.close(fd)


_DAMAGED_LOCK = LockInfo(pid=0, host="", user="unknown", started_at="")


def _parse_lock(raw: bytes) -> LockInfo:
    try:
        return msgspec.json.decode(raw, type=LockInfo)
    except (msgspec.DecodeError, msgspec.ValidationError):
        return _DAMAGED_LOCK


def read_lock(path: str | os.PathLike[str]) -> LockInfo | None:
    """Who holds the survey at ``path`` open, or ``None``; a damaged lock file reads as a
    holder with process id 0 (always stale)."""
    raw = _read_lock_bytes(lock_path(path))
    return None if raw is None else _parse_lock(raw)


def lock_is_stale(info: LockInfo) -> bool:
    """True when the lock's process is known to be gone: same host and (rebooted since,
    or no such process). A lock from another host cannot be checked and is not stale."""
    if info.pid <= 0:
        return True
    if info.host != hostname():
        return False
    here = boot_id()
    if info.boot_id and here and info.boot_id != here:
        return True
    return not pid_alive(info.pid)


def describe_lock(holder: LockInfo, lock_name: str) -> str:
    """What a lock means for someone who wants to edit the survey, and what they can do."""
    lock_name = shorten(lock_name, 80)
    if holder.pid <= 0:
        return (
            f"a damaged lock file {lock_name} remains (a session ended while writing "
            "it); opening the survey for editing replaces it"
        )
    if lock_is_stale(holder):
        return (
            f"a stale lock from {holder.describe()} remains ({lock_name}): that session "
            "ended without closing and its process is gone; opening the survey for "
            "editing takes the lock over"
        )
    if holder.host and holder.host != hostname():
        return (
            f"open for editing by {holder.describe()}, another computer, which cannot "
            f"be checked from here. Close the survey there; if that session has ended "
            f"(the computer crashed or was switched off while editing), delete "
            f"{lock_name} and try again. Reading the survey works meanwhile"
        )
    return (
        f"open for editing by {holder.describe()}. Close the survey there, or wait for "
        "that program to finish, and try again. Reading the survey works meanwhile"
    )


def _create_lock(lock: Path, info: LockInfo) -> bool:
    """Atomically create ``lock`` with ``info`` in it; False if a lock exists."""
    data = msgspec.json.encode(info) + b"\n"
    tmp = tmp_name(lock)
    write_synced(tmp, data, None)
    try:
        try:
            os.link(tmp, lock)  # atomic, and the lock is never seen half-written
            return True
        except FileExistsError:
            return False
        except OSError as exc:
            if exc.errno in (errno.ENOSPC, errno.EROFS, errno.EACCES, errno.EIO):
                raise
        try:  # no hard links here: exclusive create, then write
            fd = os.open(lock, os.O_WRONLY | os.O_CREAT | os.O_EXCL, 0o666)
        except FileExistsError:
            return False
        try:
            write_all(fd, data)
            os.fsync(fd)
        finally:
            os.close(fd)
        return True
    finally:
        remove_quietly(tmp)


class TakeoverGuard:
    """Mutual exclusion among processes taking over a stale lock of one survey.

    ``.NAME.json.lock.takeover`` is locked with ``flock``, which the kernel releases when
    its holder dies, so a crash during a takeover never leaves a guard that blocks for ever.
    The guard file is removed on release; an opener that locked a file someone had
    meanwhile removed (its inode is no longer the name's) tries again. Where ``fcntl`` is
    missing, an exclusively created guard file is used, and one older than
    :data:`_GUARD_ABANDONED_S` is taken as abandoned.
    """

    def __init__(self, lock: Path) -> None:
        self.path = lock.with_name(f".{lock.name}.takeover")
        self.fd: int | None = None

    def __enter__(self) -> TakeoverGuard:
        deadline = time.monotonic() + _GUARD_WAIT_S
        while True:
            if self._try():
                return self
            if time.monotonic() > deadline:
                raise OSError(errno.EAGAIN, "another program is taking over the lock")
            time.sleep(0.002)

    def _try(self, create: bool = True) -> bool:
        if fcntl is None:
            try:
                self.fd = os.open(self.path, os.O_WRONLY | os.O_CREAT | os.O_EXCL, 0o666)
                return True
            except FileExistsError:
                try:
                    if time.time() - os.stat(self.path).st_mtime > _GUARD_ABANDONED_S:
                        remove_quietly(self.path)
                except OSError:
                    pass
                return False
        fd = os.open(self.path, os.O_RDWR | (os.O_CREAT if create else 0), 0o666)
        try:
            fcntl.flock(fd, fcntl.LOCK_EX | fcntl.LOCK_NB)
        except OSError as exc:
            os.close(fd)
            if exc.errno in (errno.EAGAIN, errno.EACCES, errno.EWOULDBLOCK):
                return False
            raise
        try:
            same = os.fstat(fd).st_ino == os.stat(self.path).st_ino
        except FileNotFoundError:
            same = False
        if not same:  # removed by the previous holder after we opened it
            os.close(fd)
            return False
        self.fd = fd
        return True

    def clear_abandoned(self) -> bool:
        """Remove a guard file nobody holds (left by a process killed during a takeover)."""
        if fcntl is None:
            return False  # aged out by the next takeover instead
        try:
            if self._try(create=False):
                self.__exit__()
                return True
        except OSError:
            pass
        return False

    def __exit__(self, *exc_info: object) -> None:
        if self.fd is not None:
            remove_quietly(self.path)  # while still holding it, then let go
            os.close(self.fd)
            self.fd = None


#: How long a takeover waits for another process's takeover of the same lock, seconds.
_GUARD_WAIT_S = 5.0
#: Without ``flock``: a takeover guard file older than this was left by a crash, seconds.
_GUARD_ABANDONED_S = 30.0


def _take_over(lock: Path, stale_raw: bytes, ours: LockInfo) -> bool:
    """Replace the lock holding exactly ``stale_raw`` with ours, in one step; False (and
    nothing changed) if the lock file holds anything else by now.

    Every takeover of a survey's lock happens under its :class:`TakeoverGuard`, so the
    content cannot change between the check and the replace except by a fresh lock being
    created where none is, which cannot happen while the stale one is in place. The lock
    file is never absent during a takeover, so nobody can create a lock in a gap.
    """
    data = msgspec.json.encode(ours) + b"\n"
    with TakeoverGuard(lock):
        if _read_lock_bytes(lock) != stale_raw:
            return False
        tmp = tmp_name(lock)
        try:
            write_synced(tmp, data, None)
            os.replace(tmp, lock)
        except BaseException:
            remove_quietly(tmp)
            raise
    fsync_dir(lock.parent)
    return True


def acquire_lock(
    path: str | os.PathLike[str], *, take_over_stale: bool = True, force: bool = False
) -> tuple[LockInfo, LockInfo | None]:
    """Take the editing lock of the survey at ``path``.

    Returns ``(ours, previous)`` where ``previous`` is the stale (or, with ``force``, live)
    lock that was taken over, else ``None``. Raises :class:`SurveyLocked` naming the holder
    when someone else has it open, :class:`~survey.errors.SurveyFileError` when the lock
    cannot be written.
    """
    shown = Path(path)
    lock = lock_path(path)
    ours = _this_lock()
    for _attempt in range(5):
        try:
            if _create_lock(lock, ours):
                return ours, None
        except OSError as exc:
            raise SurveyFileError(
                shown,
                "",
                f"cannot open for editing: the lock file "
                f"{shown_name(lock)} cannot be written: "
                f"{os_problem(exc)}",
            ) from None
        raw = _read_lock_bytes(lock)
        if raw is None:
            continue  # released meanwhile
        holder = _parse_lock(raw)
        stale = lock_is_stale(holder)
        if not (force or (stale and take_over_stale)):
            raise SurveyLocked(shown, holder, describe_lock(holder, lock.name))
        try:
            if _take_over(lock, raw, ours):
                return ours, holder
        except OSError as exc:
            raise SurveyFileError(
                shown,
                "",
                f"cannot open for editing: the lock file "
                f"{shown_name(lock)} cannot be taken over: "
                f"{os_problem(exc)}",
            ) from None
    raise SurveyLocked(
        shown, None, f"cannot take the lock {shown_name(lock)}: other programs keep taking it"
    )


def release_lock(path: str | os.PathLike[str], ours: LockInfo) -> None:
    """Remove the lock of ``path`` if it is still ``ours`` (never someone else's)."""
    lock = lock_path(path)
    raw = _read_lock_bytes(lock)
    if raw is not None and _parse_lock(raw).token == ours.token:
        remove_quietly(lock)
