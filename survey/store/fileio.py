"""Files on disk, knowing nothing of surveys: the bounded reader and the atomic writer.

Reading (:func:`read_input_file`)
    Every file the program reads from a user (a survey, its backup, a logger's CSV, a lock)
    is read here. Only a regular file is read: a folder, a named pipe (FIFO), a device or a
    socket is refused with one clear :class:`~survey.errors.SurveyFileError`. The path is
    stat'ed first, so a device is never opened, then opened with ``O_NONBLOCK`` (an open of
    a FIFO never waits for a writer) and ``O_NOCTTY``, and the open handle is ``fstat``'ed
    again: a file swapped for a pipe between the two is still refused, never read. A file
    larger than :data:`MAX_FILE_BYTES` (from ``fstat``) is refused before anything is read,
    and no read takes more than ``MAX_FILE_BYTES + 1`` bytes, so a file that grows while it
    is read, or one that reports no size (``/proc``), is refused at the limit too.

Writing (:func:`write_file_atomically`)
    The bytes go to a uniquely named temporary file created exclusively in the same folder,
    which is flushed and fsynced; ``os.replace`` puts it in place in one step and the folder
    is fsynced. A process killed at any moment leaves the old file or the new one, never a
    mixture. A failure raises ``SurveyFileError``, removes the temporary file and leaves the
    old file as it was. A file that is read-only for the user (by permission, or by its mode
    bits, which root would otherwise ignore) is never replaced, and neither is anything that
    is not a regular file (replacing ``/dev/null`` would be a disaster for the system).
"""

from __future__ import annotations

import contextlib
import errno
import os
import stat
from collections.abc import Callable, Iterable
from pathlib import Path

import msgspec

from survey.errors import SurveyFileError
from survey.safe_text import shorten

#: The largest file the program reads, bytes: a survey, a backup or a logger file. A
#: 1000-room survey is about 2 MB and a year of one-minute logger samples about 25 MB.
MAX_FILE_BYTES = 256 * 1024 * 1024

_ERRNO_WORDS = {
    errno.ENOSPC: "the disk is full",
    errno.EROFS: "the folder is on a read-only file system",
    errno.EACCES: "permission denied (the folder or file is read-only for you)",
    errno.EPERM: "the operation is not permitted",
    errno.ENOENT: "the folder does not exist",
    errno.ENOTDIR: "part of the path is a file, not a folder",
    errno.EISDIR: "the name is a folder",
    errno.EFBIG: "the file would exceed the largest size allowed",
    errno.EIO: "input/output error (a failing or removed drive?)",
    errno.ENAMETOOLONG: "the file name is too long",
}
if hasattr(errno, "EDQUOT"):
    _ERRNO_WORDS[errno.EDQUOT] = "the disk quota is exceeded"


def os_problem(exc: OSError) -> str:
    """An operating-system error in plain words (short, and safe to print)."""
    words = _ERRNO_WORDS.get(exc.errno or 0)
    if words:
        return words
    return shorten(exc.strerror or str(exc), 120)


def _read_problem(exc: OSError) -> str:
    """Why a file could not be read; a refused permission is about reading, not writing."""
    if exc.errno in (errno.EACCES, errno.EPERM):
        return (
            "no permission to read the file (ask its owner, or check the permissions of "
            "the file and its folders)"
        )
    return f"cannot read the file: {os_problem(exc)}"


# --- what a path is ----------------------------------------------------------------------

_KINDS: tuple[tuple[Callable[[int], bool], str], ...] = (
    (stat.S_ISDIR, "a folder"),
    (stat.S_ISFIFO, "a named pipe (FIFO)"),
    (stat.S_ISSOCK, "a socket"),
    (stat.S_ISCHR, "a device"),
    (stat.S_ISBLK, "a disk device"),
)


def special_kind(mode: int) -> str | None:
    """What a path of this ``st_mode`` is when it is not a regular file ('a folder' …)."""
    if stat.S_ISREG(mode):
        return None
    for test, words in _KINDS:
        if test(mode):
            return words
    return "not a regular file"


class NotARegularFile(OSError):
    """The path is a folder, a named pipe, a device or a socket (``kind`` says which)."""

    def __init__(self, kind: str) -> None:
        super().__init__(errno.EINVAL, kind)
        self.kind = kind


_READ_FLAGS = (
    os.O_RDONLY
    | getattr(os, "O_NONBLOCK", 0)
    | getattr(os, "O_NOCTTY", 0)
    | getattr(os, "O_CLOEXEC", 0)
    | getattr(os, "O_BINARY", 0)
)


def open_regular(path: str | os.PathLike[str]) -> tuple[int, os.stat_result]:
    """Open a regular file for reading without ever blocking; ``(fd, fstat of it)``.

    Raises :class:`NotARegularFile` for anything else (checked before opening, so no device
    is opened, and again on the open handle, so a swap in between is caught), and the
    ``OSError`` of ``stat`` or ``open`` otherwise.
    """
    kind = special_kind(os.stat(path).st_mode)
    if kind is not None:
        raise NotARegularFile(kind)
    fd = os.open(path, _READ_FLAGS)
    try:
        st = os.fstat(fd)
        kind = special_kind(st.st_mode)
        if kind is not None:
            raise NotARegularFile(kind)
    except BaseException:
        os.close(fd)
        raise
    return fd, st


def read_at_most(fd: int, limit: int, size_hint: int = 0) -> bytes:
    """Read from ``fd`` to the end, or until more than ``limit`` bytes are read (then
    ``limit + 1`` bytes are returned, so the caller can tell). ``size_hint`` (the size from
    ``fstat``) lets a whole regular file come in one read."""
    chunks = []
    total = 0
    want = min(max(size_hint, 0), limit) + 1  # the file and the byte that proves its end
    while total <= limit:
        ask = want - total if total < want else min(1 << 20, limit + 1 - total)
        chunk = os.read(fd, ask)
        if not chunk:
            break
        chunks.append(chunk)
        total += len(chunk)
    return b"".join(chunks)


def _size(n: int) -> str:
    return f"{n / 2**20:.0f} MB" if n >= 2**20 else f"{n} bytes"


def read_stamped(path: Path, what: str = "survey file") -> tuple[bytes, FileStamp]:
    """The bytes of the file at ``path`` and the stamp of the version read (from the open
    handle); every failure is a :class:`SurveyFileError` naming ``what``."""
    limit = MAX_FILE_BYTES
    too_large = f"the file is too large (a {what} is at most {_size(limit)})"
    try:
        fd, st = open_regular(path)
    except NotARegularFile as exc:
        raise SurveyFileError(path, "", f"this is {exc.kind}, not a {what}") from None
    except FileNotFoundError:
        raise SurveyFileError(path, "", "no such file") from None
    except IsADirectoryError:
        raise SurveyFileError(path, "", f"this is a folder, not a {what}") from None
    except OSError as exc:
        raise SurveyFileError(path, "", _read_problem(exc)) from None
    try:
        if st.st_size > limit:
            raise SurveyFileError(
                path,
                "",
                f"the file is too large ({_size(st.st_size)}; a {what} is at most {_size(limit)})",
            )
        data = read_at_most(fd, limit, st.st_size)
    except OSError as exc:
        raise SurveyFileError(path, "", _read_problem(exc)) from None
    finally:
        os.close(fd)
    if len(data) > limit:
        raise SurveyFileError(path, "", too_large)
    return data, FileStamp.of(st)


def read_input_file(path: str | os.PathLike[str], what: str = "survey file") -> bytes:
    """The bytes of a file the program reads (a survey, a logger CSV), at most
    :data:`MAX_FILE_BYTES`; a folder, FIFO, device or socket is refused without blocking.
    Every failure is a :class:`SurveyFileError` naming ``what``."""
    return read_stamped(Path(path), what)[0]


# --- stamps and temporary files ----------------------------------------------------------


class FileStamp(msgspec.Struct, frozen=True):
    """Identity of one version of a file on disk, to notice changes by others."""

    inode: int
    size: int
    mtime_ns: int

    @classmethod
    def of(cls, st: os.stat_result) -> FileStamp:
        return cls(st.st_ino, st.st_size, st.st_mtime_ns)


def file_stamp(path: str | os.PathLike[str]) -> FileStamp | None:
    """The stamp of the file at ``path`` now, or ``None`` if there is none."""
    try:
        return FileStamp.of(os.stat(path))
    except OSError:
        return None


def tmp_name(target: Path, kind: str = "") -> Path:
    """A unique, unpredictable temporary name beside ``target``:
    ``.NAME<kind>.<pid>-<8 hex digits>.tmp`` (the pid lets a later run remove it)."""
    return target.with_name(f".{target.name}{kind}.{os.getpid()}-{os.urandom(4).hex()}.tmp")


def write_all(fd: int, data: bytes) -> None:
    view = memoryview(data)
    while view:
        written = os.write(fd, view)
        view = view[written:]


#: Data to write: bytes, or an iterable of byte chunks made as they are written (a large
#: export is never held whole).
Data = bytes | bytearray | memoryview | Iterable[bytes]


def write_synced(path: Path, data: Data, mode: int | None) -> FileStamp:
    """Create ``path`` exclusively with ``data`` (and ``mode``), fsynced; its stamp."""
    flags = os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0)
    fd = os.open(path, flags, 0o666)
    try:
        if mode is not None and hasattr(os, "fchmod"):
            os.fchmod(fd, mode)
        if isinstance(data, (bytes, bytearray, memoryview)):
            write_all(fd, bytes(data))
        else:
            for chunk in data:
                write_all(fd, chunk)
        os.fsync(fd)
        return FileStamp.of(os.fstat(fd))
    finally:
        os.close(fd)


def fsync_dir(folder: Path) -> None:
    """Make renames in ``folder`` durable; a no-op where folders cannot be opened or synced."""
    try:
        fd = os.open(folder, os.O_RDONLY | getattr(os, "O_DIRECTORY", 0))
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


def remove_quietly(path: Path) -> None:
    with contextlib.suppress(OSError):
        os.unlink(path)


def resolve(path: str | os.PathLike[str]) -> Path:
    """``path``, or the file it points to when it is a symbolic link."""
    path = Path(path)
    return Path(os.path.realpath(path)) if path.is_symlink() else path


def named(path: str | os.PathLike[str]) -> Path:
    """``path`` as a ``Path`` with a file name; ``.``, ``/`` or an empty path (a folder by
    its nature) is refused, so that no ``.bak`` or ``.lock`` is made beside the folder."""
    path = Path(path)
    if not path.name:
        raise SurveyFileError(
            path, "", "this is a folder, not a file; give the path of a survey file"
        )
    return path


def shown_name(path: Path) -> str:
    """A file's name as a message quotes it (visible, shortened)."""
    return shorten(path.name, 80)


# --- replacing a file --------------------------------------------------------------------


def _on_read_only_file_system(folder: Path) -> bool:
    try:
        return bool(os.statvfs(folder).f_flag & getattr(os, "ST_RDONLY", 1))
    except (OSError, AttributeError):
        return False


def target_state(
    target: Path,
    shown: Path,
    verb: str,
    advice: str = "save under another name, or make it writable first",
) -> os.stat_result | None:
    """The stat of the file about to be replaced (``None`` if there is none), after
    refusing a folder, anything else that is not a regular file, and a file that is
    read-only for this user."""
    try:
        current = os.stat(target)
    except FileNotFoundError:
        return None
    except NotADirectoryError:
        raise SurveyFileError(shown, "", f"{verb}: {_ERRNO_WORDS[errno.ENOTDIR]}") from None
    except OSError as exc:
        raise SurveyFileError(shown, "", f"{verb}: {os_problem(exc)}") from None
    kind = special_kind(current.st_mode)
    if kind == "a folder":
        raise SurveyFileError(shown, "", f"{verb}: the name is a folder")
    if kind is not None:
        raise SurveyFileError(
            shown, "", f"{verb}: the name is {kind}, not a file; give the name of a file"
        )
    mode = stat.S_IMODE(current.st_mode)
    # os.access answers for the real user; root passes it whatever the mode, so the mode
    # bits are checked too: a file nobody may write was made read-only on purpose.
    if not os.access(target, os.W_OK) or not mode & 0o222:
        if _on_read_only_file_system(target.parent):
            raise SurveyFileError(
                shown, "", f"{verb}: {_ERRNO_WORDS[errno.EROFS]}; the file on disk is unchanged"
            )
        raise SurveyFileError(
            shown,
            "",
            f"{verb}: the file is read-only (mode {mode:04o}), perhaps kept that "
            f"way on purpose, and is left as it is; {advice} "
            f"(chmod u+w {shown_name(shown)})",
        )
    return current


def untouched(current: os.stat_result | None) -> str:
    return "the file on disk is unchanged" if current is not None else "no file was created"


def replace_atomically(
    target: Path,
    shown: Path,
    data: Data,
    current: os.stat_result | None,
    verb: str,
    before_replace: Callable[[], object] | None = None,
) -> FileStamp:
    """Write ``data`` to a new temporary file beside ``target`` (exclusive create, unique
    name), fsync it, run ``before_replace``, ``os.replace`` it over ``target`` and fsync the
    folder. The permissions of the file replaced are kept. On failure the temporary file is
    removed and ``target`` is as it was."""
    mode = stat.S_IMODE(current.st_mode) if current is not None else None
    tmp = tmp_name(target)
    try:
        stamp = write_synced(tmp, data, mode)
        if before_replace is not None:
            before_replace()
        os.replace(tmp, target)
    except SurveyFileError:
        remove_quietly(tmp)
        raise
    except OSError as exc:
        remove_quietly(tmp)
        raise SurveyFileError(
            shown, "", f"{verb}: {os_problem(exc)}; {untouched(current)}"
        ) from None
    except BaseException:
        remove_quietly(tmp)
        raise
    fsync_dir(target.parent)
    return stamp


def write_file_atomically(path: str | os.PathLike[str], data: Data) -> FileStamp:
    """Write ``data`` (bytes, or byte chunks made as they are written) to ``path`` (any
    file, e.g. an export or a report) the way surveys are saved: a
    uniquely named temporary file created exclusively in the same folder, fsynced, renamed
    over ``path`` in one step, the folder fsynced. A crash leaves the old file or the new
    one. A read-only existing file, and anything that is not a regular file, is refused;
    an existing file's permissions are otherwise kept.

    Raises :class:`~survey.errors.SurveyFileError` ("not written: …") on any failure.
    """
    shown = Path(path)
    target = resolve(path)
    current = target_state(target, shown, "not written")
    if isinstance(data, (bytearray, memoryview)):
        data = bytes(data)
    return replace_atomically(target, shown, data, current, "not written")
