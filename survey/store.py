"""Survey files: load with clear errors, crash-safe save with a backup, an editing lock,
schema versions and migrations.

One survey is one UTF-8 JSON file carrying ``schema_version`` (see :mod:`survey.model`).

Loading (:func:`load_survey`)
    Any problem — not JSON, truncated, wrong types, values out of range, references to rooms
    that do not exist, a newer ``schema_version`` — raises one
    :class:`~survey.errors.SurveyFileError` naming the file, the place in the document
    (``visits[1].rooms[3].surfaces[0].surface_temp_c``, or a line and column for broken
    JSON) and the problem in plain words. When the file is damaged and ``NAME.json.bak``
    exists, the message says whether the backup loads and how to recover from it.

Saving (:func:`save_survey`)
    The survey is encoded and checked first (a record that fails its own checks is never
    written). The bytes go to a temporary file in the same folder, which is flushed and
    fsynced; the previous file is kept as ``NAME.json.bak`` (a hard link, or a synced copy
    where links are not supported); ``os.replace`` puts the new file in place in one step and
    the folder is fsynced. A process killed at any moment leaves either the old or the new
    file, never a mixture. A failed save (read-only folder, full disk) raises
    ``SurveyFileError``, removes its temporary file and leaves the old file and the survey in
    memory as they were. A file that is read-only for the user (by permission, or by its
    mode bits, which root would otherwise ignore) is never replaced. A file there that does
    not load as a survey is never replaced either, nor rotated into the backup over a good
    one, unless the caller asks for it (``replace_damaged``): then it is kept as
    ``NAME.json.damaged-<time>`` and the backup is left alone. The same crash-safe write
    serves other files the program writes (:func:`write_file_atomically`, e.g. exports).

Editing (:func:`open_for_editing`)
    ``NAME.json.lock`` records who holds the survey open (process id, host, user, start
    time). A second opener is told who; a lock left by a crashed process on this host (its
    process is gone, or the host has rebooted since) is recognised as stale and taken over.
    A takeover replaces the stale lock file in one ``os.replace`` while holding a short
    ``flock`` guard (released by the kernel if its holder dies), after checking that the
    lock still holds exactly the stale content: several processes taking over at once end
    with one holder, and a live lock is never removed.
    An editing session also refuses to save over a file that changed on disk since it was
    read, and a file that failed to load never gets a session, so it is never overwritten.

Schema versions
    ``MIGRATIONS[n]`` turns a version-``n`` document (plain dicts and lists) into version
    ``n + 1``. Files older than :data:`~survey.model.SCHEMA_VERSION` are upgraded in memory
    on load and written in the current version on the next save (the old version stays in
    the ``.bak``). A file from a newer version is refused with a message saying so.
"""

from __future__ import annotations

import datetime as dt
import difflib
import errno
import os
import re
import secrets
import socket
import stat
import time
from pathlib import Path
from typing import Any, Callable, Iterator

import msgspec
import msgspec.inspect as mi

try:
    import fcntl
except ImportError:  # not on Windows
    fcntl = None  # type: ignore[assignment]

from survey import model
from survey.errors import SurveyFileError
from survey.model import SCHEMA_VERSION, Survey

#: Refuse to read files larger than this (a 1000-room survey with logs is a few MB).
MAX_FILE_BYTES = 256 * 1024 * 1024

#: Returned by :func:`value_at` when the document has no value at that place.
MISSING: Any = object()

_ENCODER = msgspec.json.Encoder()
_DECODER = msgspec.json.Decoder(Survey)


class _Head(msgspec.Struct):
    """Only the version of a document (every other key is skipped unread)."""

    schema_version: Any = msgspec.UNSET


_HEAD_DECODER = msgspec.json.Decoder(_Head)


# --- describing validation errors ----------------------------------------------------------

_AT = re.compile(r"^(?P<message>.*?)(?: - at `\$(?P<path>[^`]*)`)?$", re.S)
_TOKEN = re.compile(r"\.([^.\[\]]+)|\[(\d+)\]")
_TYPE_WORDS = {
    "float": "a number", "int": "a whole number", "str": "text", "bool": "true or false",
    "array": "a list", "object": "an object ({...})", "null": "null", "datetime": "a date and time",
    "date": "a date", "bytes": "bytes",
}
_UNIT_SUFFIXES = (
    ("_l_per_day", " L/day"), ("_m3", " m³"), ("_m2", " m²"), ("_pct", " %"), ("_pa", " Pa"),
    ("_c", " °C"), ("_k", " K"), ("_m", " m"), ("_l", " L"),
)
_DATETIME_FORM = "2025-01-14T09:30:00 (ISO 8601; an offset such as +01:00 may follow)"


def _tokens(where: str) -> list[str | int]:
    return [name if name else int(index)
            for name, index in _TOKEN.findall("." + where if where and where[0] != "[" else where)]


def _where(tokens: list[str | int]) -> str:
    text = ""
    for token in tokens:
        text += f"[{token}]" if isinstance(token, int) else (f".{token}" if text else token)
    return text


def _unwrap(info: Any) -> Any:
    while True:
        if isinstance(info, mi.Metadata):
            info = info.type
        elif isinstance(info, mi.UnionType):
            kinds = [t for t in info.types if not isinstance(t, mi.NoneType)]
            if len(kinds) != 1:
                return info
            info = kinds[0]
        else:
            return info


def _struct_info(cls: type) -> Any:
    cached = _INFO_CACHE.get(cls)
    if cached is None:
        cached = _INFO_CACHE[cls] = mi.type_info(cls)
    return cached


_INFO_CACHE: dict[type, Any] = {}


def _type_at(root: type, tokens: list[str | int]) -> Any:
    """The msgspec type info of the value at ``tokens`` inside a ``root`` document."""
    info: Any = _struct_info(root)
    for token in tokens:
        info = _unwrap(info)
        if isinstance(token, int):
            if isinstance(info, mi.ListType):
                info = info.item_type
            elif isinstance(info, mi.StructType) and info.array_like and token < len(info.fields):
                info = info.fields[token].type
            else:
                return None
        elif isinstance(info, mi.StructType):
            for fld in info.fields:
                if fld.encode_name == token:
                    info = fld.type
                    break
            else:
                return None
        else:
            return None
    return info


def value_at(data: bytes | Any, where: str, default: Any = MISSING) -> Any:
    """The value at ``where`` in a document (JSON bytes or decoded builtins), else ``default``."""
    if isinstance(data, (bytes, bytearray, memoryview)):
        try:
            data = msgspec.json.decode(data)
        except (msgspec.DecodeError, RecursionError, MemoryError):
            return default
    node = data
    for token in _tokens(where):
        try:
            node = node[token]
        except (KeyError, IndexError, TypeError):
            return default
    return node


def _show(value: Any) -> str:
    if isinstance(value, str):
        return repr(value if len(value) <= 60 else value[:57] + "...")
    if isinstance(value, bool) or value is None:
        return "true" if value is True else "false" if value is False else "null"
    if isinstance(value, (int, float)):
        text = repr(value)
        return text if len(text) <= 30 else text[:27] + "..."
    if isinstance(value, list):
        return f"a list of {len(value)}"
    if isinstance(value, dict):
        return "an object"
    return type(value).__name__


def _unit_for(root: type, tokens: list[str | int]) -> str:
    name = next((t for t in reversed(tokens) if isinstance(t, str)), "")
    if tokens and isinstance(tokens[-1], int):  # an item of a record stored as a list
        parent = _unwrap(_type_at(root, tokens[:-1]))
        if isinstance(parent, mi.StructType) and parent.array_like:
            name = parent.fields[tokens[-1]].name
    for suffix, unit in _UNIT_SUFFIXES:
        if name.endswith(suffix):
            return unit
    return ""


def _number(value: float) -> str:
    return f"{value:g}"


def _range_text(info: Any, unit: str) -> str:
    low = (f"above {_number(info.gt)}" if info.gt is not None
           else f"at least {_number(info.ge)}" if info.ge is not None else "")
    high = (f"below {_number(info.lt)}" if info.lt is not None
            else f"at most {_number(info.le)}" if info.le is not None else "")
    if info.ge is not None and info.le is not None:
        return f"between {_number(info.ge)} and {_number(info.le)}{unit}"
    return " and ".join(part for part in (low, high) if part) + unit


def _type_words(spec: str) -> str:
    return " or ".join(_TYPE_WORDS.get(part.strip(), part.strip()) for part in spec.split("|"))


def _field_names(info: Any) -> list[str]:
    info = _unwrap(info)
    if isinstance(info, mi.StructType):
        return [fld.encode_name for fld in info.fields]
    return []


def _overlong_array_like(doc: Any, info: Any, tokens: list[str | int]):
    """Where a record stored as a list has too many items (msgspec gives no path for it)."""
    info = _unwrap(info)
    if isinstance(info, mi.StructType):
        if info.array_like:
            if isinstance(doc, list) and len(doc) > len(info.fields):
                return _where(tokens), info, len(doc)
            return None
        if isinstance(doc, dict):
            for fld in info.fields:
                if fld.encode_name in doc:
                    found = _overlong_array_like(doc[fld.encode_name], fld.type,
                                                 tokens + [fld.encode_name])
                    if found is not None:
                        return found
    elif isinstance(info, mi.ListType) and isinstance(doc, list):
        for i, item in enumerate(doc):
            found = _overlong_array_like(item, info.item_type, tokens + [i])
            if found is not None:
                return found
    return None


def explain_validation_error(exc: msgspec.ValidationError, root: type,
                             data: bytes | Any) -> tuple[str, str]:
    """``(where, problem)`` in plain words for a msgspec error decoding ``data`` as ``root``."""
    match = _AT.match(str(exc))
    message = match.group("message") if match else str(exc)
    tokens = _tokens((match.group("path") or "").lstrip(".") if match else "")
    info = _unwrap(_type_at(root, tokens))
    unit = _unit_for(root, tokens)

    def here() -> Any:
        return value_at(data, _where(tokens))

    m = re.fullmatch(r"Object contains unknown field `(.*)`", message)
    if m:
        name = m.group(1)
        allowed = _field_names(info)
        close = ([a for a in allowed if a.startswith(name + "_")]
                 or difflib.get_close_matches(name, allowed, n=1, cutoff=0.6))
        hint = (f"; did you mean '{close[0]}'?" if close
                else f"; allowed here: {', '.join(allowed)}" if allowed else "")
        return _where(tokens + [name]), f"unknown field '{name}'{hint}"
    m = re.fullmatch(r"Object missing required field `(.*)`", message)
    if m:
        return _where(tokens + [m.group(1)]), f"the required field '{m.group(1)}' is missing"
    where = _where(tokens)
    value = here()
    shown = _show(value) if value is not MISSING else "the value"
    m = re.fullmatch(r"Expected `(?:float|int)` (?:<=|>=|<|>) \S+", message)
    if m and isinstance(info, (mi.FloatType, mi.IntType)):
        if info.ge is not None and info.ge == info.le:  # one value allowed, e.g. a version
            name = next((t for t in reversed(tokens) if isinstance(t, str)), "the value")
            return where, f"{name} must be {_number(info.ge)}{unit}, not {shown}"
        return where, f"{shown} is out of range; allowed: {_range_text(info, unit)}"
    if message == "Number out of range":
        return where, "the number is too large to be read"
    m = re.fullmatch(r"Expected `(.*?)`, got `(.*?)`", message)
    if m:
        expected, got = _type_words(m.group(1)), _TYPE_WORDS.get(m.group(2), m.group(2))
        found = f"{got} {shown}" if got not in ("a list", "an object ({...})", "null") else got
        return where, f"expected {expected}, found {found}"
    m = re.fullmatch(r"Invalid enum value (.*)", message)
    if m and isinstance(info, mi.LiteralType):
        choices = [str(v) for v in info.values]
        close = difflib.get_close_matches(str(value), choices, n=1, cutoff=0.6)
        hint = f" (did you mean '{close[0]}'?)" if close else ""
        return where, f"{shown} is not allowed{hint}; choose one of: {', '.join(choices)}"
    m = re.fullmatch(r"Expected `str` of length (<=|>=) (\d+)", message)
    if m:
        if m.group(1) == ">=":
            return where, "must not be empty"
        length = len(value) if isinstance(value, str) else "too many"
        return where, f"text too long ({length} characters; at most {m.group(2)})"
    if message.startswith("Expected `str` matching regex"):
        if tokens and tokens[-1] in ("id", "room", "instrument"):
            return where, (f"{shown} is not a valid id: use letters, digits, '-', '_' or '.', "
                           "starting with a letter or digit, up to 40 characters")
        if tokens and tokens[-1] == "source_sha256":
            return where, f"{shown} is not a SHA-256 digest (64 lowercase hex digits)"
        if len(tokens) >= 2 and tokens[-2] == "photos" and isinstance(value, str):
            problem = model.photo_name_problem(value)
            if problem:
                return where, f"photo file name {shown} {problem}"
        return where, f"{shown} contains characters that are not allowed (control characters)"
    if message == "Invalid RFC3339 encoded datetime":
        return where, f"{shown} is not a date and time; write it as {_DATETIME_FORM}"
    if message == "Invalid RFC3339 encoded date":
        return where, f"{shown} is not a date; write it as 2025-01-14"
    m = re.fullmatch(r"Expected `array` of (?:at least|at most) length (\d+), got (\d+)", message)
    if m and isinstance(info, mi.StructType) and info.array_like:
        names = ", ".join(fld.name for fld in info.fields)
        return where, f"expected a list of {m.group(1)} items [{names}], found {m.group(2)}"
    if message.startswith("Expected `array` of at most length") and not tokens:
        found = _overlong_array_like(value_at(data, ""), _struct_info(root), [])
        if found is not None:
            where, info, count = found
            names = ", ".join(fld.name for fld in info.fields)
            return where, (f"expected a list of {len(info.fields)} items [{names}], "
                           f"found {count}")
    return where, message[0].lower() + message[1:] if message else "invalid value"


# --- reading -----------------------------------------------------------------------------

_MAGIC = (
    (b"PK\x03\x04", "a ZIP archive (or an Office document)"),
    (b"\x1f\x8b", "a gzip-compressed file"),
    (b"%PDF", "a PDF document"),
    (b"\x89PNG", "a PNG image"),
    (b"\xff\xd8\xff", "a JPEG image"),
    (b"\xd0\xcf\x11\xe0", "an old-style Office document"),
    (b"SQLite format 3", "an SQLite database"),
)


def _line_column(data: bytes, offset: int) -> str:
    offset = max(0, min(offset, len(data)))
    line = data.count(b"\n", 0, offset) + 1
    column = offset - (data.rfind(b"\n", 0, offset) + 1) + 1
    return f"line {line}, column {column}"


_LONE_SURROGATE = re.compile(rb"\\u[dD][89abAB][0-9a-fA-F]{2}(?!\\u[dD][c-fC-F][0-9a-fA-F]{2})")


def _decode_error(path: object, exc: Exception, data: bytes) -> SurveyFileError:
    message = str(exc)
    if isinstance(exc, RecursionError):
        return SurveyFileError(path, "", "lists or objects are nested too deeply to be a survey")
    if "truncated" in message or "escape" in message or "surrogate" in message:
        lone = _LONE_SURROGATE.search(data)
        if lone is not None:
            return SurveyFileError(path, _line_column(data, lone.start()),
                                   "not valid JSON: a \\u escape names half of a UTF-16 "
                                   "surrogate pair")
    if "truncated" in message:
        return SurveyFileError(path, _line_column(data, len(data)),
                               "the file ends too early: it has been cut off (truncated)")
    m = re.search(r"\(byte (\d+)\)", message)
    where = _line_column(data, int(m.group(1))) if m else ""
    if m:
        try:
            data[: int(m.group(1)) + 4].decode("utf-8")
        except UnicodeDecodeError as bad:
            if bad.start <= int(m.group(1)):
                return SurveyFileError(path, _line_column(data, bad.start),
                                       "the file is not UTF-8 text; save it as UTF-8")
    if "UTF-8" in message:
        try:
            data.decode("utf-8")
        except UnicodeDecodeError as bad:
            return SurveyFileError(path, _line_column(data, bad.start),
                                   "the file is not UTF-8 text; save it as UTF-8")
    detail = message.replace("JSON is malformed: ", "")
    detail = re.sub(r"\s*\(byte \d+\)", "", detail)
    if detail == "trailing characters":
        return SurveyFileError(path, where,
                               "there is more text after the end of the survey's JSON object")
    return SurveyFileError(path, where, f"not valid JSON ({detail})")


def _check_bytes(data: bytes, path: object) -> bytes:
    if data.startswith(b"\xef\xbb\xbf"):  # a UTF-8 byte-order mark some editors add
        data = data[3:]
    if not data.strip():
        raise SurveyFileError(path, "", "the file is empty")
    if data.startswith((b"\xff\xfe", b"\xfe\xff")):
        raise SurveyFileError(path, "", "the file is UTF-16 text; save it as UTF-8")
    for magic, what in _MAGIC:
        if data.startswith(magic):
            raise SurveyFileError(path, "", f"not a survey file: this is {what}")
    if b"\x00" in data[:65536]:
        zeros = data.count(b"\x00") == len(data)
        raise SurveyFileError(path, "", "the file is all zero bytes (damaged by a crash or "
                              "disk fault)" if zeros else
                              "the file contains NUL bytes: it is binary or damaged")
    return data


def _schema_version(data: bytes, path: object) -> int:
    try:
        head = _HEAD_DECODER.decode(data)
    except msgspec.ValidationError:
        raise SurveyFileError(path, "", "not a survey file: the top level is not a JSON "
                                        "object") from None
    except (msgspec.DecodeError, RecursionError) as exc:
        raise _decode_error(path, exc, data) from None
    version = head.schema_version
    if version is msgspec.UNSET:
        raise SurveyFileError(path, "", "this is not a condition-survey file (it has no "
                                        "schema_version)")
    if data.count(b'"schema_version"') > 1:
        versions = _top_level_values(data, "schema_version")
        if len(versions) > 1:
            shown = " and ".join(_show(v) for v in versions)
            raise SurveyFileError(
                path, "schema_version",
                f"given {len(versions)} times ({shown}); a survey file states its version "
                f"once: keep the one line \"schema_version\": {SCHEMA_VERSION}")
    if type(version) is not int:
        raise SurveyFileError(path, "schema_version",
                              f"expected a whole number, found {_show(version)}")
    if version > SCHEMA_VERSION:
        raise SurveyFileError(
            path, "schema_version",
            f"the file is schema version {version}, written by a newer condition-survey; this "
            f"one reads versions up to {SCHEMA_VERSION}. Update condition-survey to open it")
    if version < min(MIGRATIONS, default=SCHEMA_VERSION):
        raise SurveyFileError(path, "schema_version", f"unknown schema version {version}")
    return version


def _top_level_values(data: bytes, key: str) -> list[Any]:
    """Every value given for ``key`` in the top-level object (JSON keeps only the last)."""
    import json

    pairs: list[list[tuple[str, Any]]] = []

    def keep(items: list[tuple[str, Any]]) -> dict:
        pairs.append(items)
        return {}

    try:
        json.loads(data, object_pairs_hook=keep)
    except (ValueError, RecursionError):
        return []
    return [value for name, value in pairs[-1] if name == key] if pairs else []


def loads_survey(data: bytes, path: object = "<survey>") -> Survey:
    """Decode and check a survey from JSON bytes; ``path`` names it in errors."""
    data = _check_bytes(bytes(data), path)
    version = _schema_version(data, path)
    try:
        if version == SCHEMA_VERSION:
            try:
                survey = _DECODER.decode(data)
            except msgspec.ValidationError as exc:
                where, problem = explain_validation_error(exc, Survey, data)
                raise SurveyFileError(path, where, problem) from None
        else:
            doc = msgspec.json.decode(data)
            doc = migrate(doc, version, path)
            try:
                survey = msgspec.convert(doc, Survey)
            except msgspec.ValidationError as exc:
                where, problem = explain_validation_error(exc, Survey, doc)
                raise SurveyFileError(
                    path, where, f"{problem} (after upgrading from schema version {version})"
                ) from None
    except (msgspec.DecodeError, RecursionError) as exc:
        raise _decode_error(path, exc, data) from None
    except MemoryError:
        raise SurveyFileError(path, "", "the file is too large to read into memory") from None
    found = model.problems(survey)
    if found:
        where, problem = found[0]
        others = len(found) - 1
        more = f" (and {others} more problem{'s' * (others > 1)})" if others else ""
        raise SurveyFileError(path, where, problem + more)
    return survey


def _read_bytes(path: Path) -> bytes:
    return _read_stamped(path)[0]


def read_input_file(path: str | os.PathLike[str], what: str = "survey file") -> bytes:
    """The bytes of a file the program reads (a survey, a logger CSV), at most
    ``MAX_FILE_BYTES``; every failure is a :class:`SurveyFileError` naming ``what``."""
    return _read_stamped(Path(path), what)[0]


def _read_stamped(path: Path, what: str = "survey file") -> tuple[bytes, "FileStamp"]:
    """The file's bytes and the stamp of the version read (from the open handle)."""
    try:
        with open(path, "rb") as handle:
            st = os.fstat(handle.fileno())
            if st.st_size > MAX_FILE_BYTES:
                raise SurveyFileError(path, "", f"the file is too large "
                                      f"({st.st_size / 2**20:.0f} MB; a {what} is at "
                                      f"most {MAX_FILE_BYTES // 2**20} MB)")
            return handle.read(MAX_FILE_BYTES + 1), FileStamp.of(st)
    except IsADirectoryError:
        raise SurveyFileError(path, "", f"this is a folder, not a {what}") from None
    except FileNotFoundError:
        raise SurveyFileError(path, "", "no such file") from None
    except OSError as exc:
        raise SurveyFileError(path, "", f"cannot read the file: {_os_problem(exc)}") from None


def backup_path(path: str | os.PathLike[str]) -> Path:
    """Where the previous version of ``path`` is kept: ``NAME.json.bak``."""
    path = Path(path)
    return path.with_name(path.name + ".bak")


def _backup_hint(path: Path) -> str:
    bak = backup_path(path)
    try:
        saved = dt.datetime.fromtimestamp(bak.stat().st_mtime).strftime("%Y-%m-%d %H:%M")
    except OSError:
        return ""
    try:
        loads_survey(_read_bytes(bak), bak)
    except SurveyFileError as exc:
        return f". The backup {bak.name} (saved {saved}) is damaged too: {exc.problem}"
    return (f". The previous version is in {bak.name} (saved {saved}) and loads cleanly: "
            f"copy it over {path.name} to recover")


def load_survey(path: str | os.PathLike[str]) -> Survey:
    """Load and check the survey at ``path``; older schema versions are upgraded in memory.

    Raises :class:`~survey.errors.SurveyFileError` for every kind of problem. A damaged file's
    message says whether ``NAME.json.bak`` is there and loads.
    """
    path = Path(path)
    try:
        data, stamp = _read_stamped(path)
        survey = loads_survey(data, path)
        _remember_good(_resolve(path), stamp)
        return survey
    except SurveyFileError as exc:
        if exc.where == "schema_version" and "newer" in exc.problem:
            raise
        hint = _backup_hint(path)
        if not hint:
            raise
        raise SurveyFileError(exc.path, exc.where, exc.problem + hint) from None


# --- migrations --------------------------------------------------------------------------

Migration = Callable[[dict[str, Any]], dict[str, Any]]
#: ``MIGRATIONS[n]`` upgrades a version-``n`` document to version ``n + 1``.
MIGRATIONS: dict[int, Migration] = {}


def migration(from_version: int) -> Callable[[Migration], Migration]:
    """Register a function that upgrades a document from ``from_version`` to the next."""
    def register(fn: Migration) -> Migration:
        MIGRATIONS[from_version] = fn
        return fn
    return register


def migrate(doc: Any, version: int, path: object = "<survey>") -> dict[str, Any]:
    """Apply the migrations from ``version`` up to :data:`SCHEMA_VERSION`."""
    while version < SCHEMA_VERSION:
        step = MIGRATIONS.get(version)
        if step is None:
            raise SurveyFileError(path, "schema_version",
                                  f"cannot upgrade from schema version {version}")
        try:
            doc = step(doc)
        except (KeyError, TypeError, AttributeError, ValueError, IndexError) as exc:
            detail = f"missing {exc}" if isinstance(exc, KeyError) else str(exc)
            raise SurveyFileError(
                path, "", f"cannot upgrade from schema version {version}: the file does not "
                          f"have that version's layout ({detail})") from None
        version += 1
        doc["schema_version"] = version
    return doc


def _copy_keys(source: dict, target: dict, names: Iterator[str] | tuple[str, ...]) -> dict:
    for name in names:
        if name in source:
            target[name] = source[name]
    return target


@migration(0)
def _upgrade_0_to_1(doc: dict[str, Any]) -> dict[str, Any]:
    """Schema 0, the pre-release layout, to schema 1.

    Schema 0 kept the site's fields at the top level (``reference``, ``address``,
    ``client``, ``inspector``, ``purpose``, ``units``: ``"metric"``/``"imperial"``,
    ``altitude_m``, ``notes``); instrument accuracies in an ``accuracy`` object
    (``temp_k``, ``rh_pct``, ``surface_k``); ``reference: bool`` on rooms; and per visit a
    ``date``, an ``outdoor`` of ``temp_c``/``rh_pct`` and ``readings`` holding, per room,
    ``temp_c``, ``rh_pct``, ``surfaces`` (``label``, ``element``, ``temp_c``) and
    ``moisture`` (``label``, ``material``, ``value``, ``scale``: ``"wme"``/``"relative"``).
    """
    if not isinstance(doc, dict):
        raise TypeError("the top level is not an object")
    units = {"metric": "si", "imperial": "ip"}
    site = _copy_keys(doc, {}, ("reference", "address", "client", "inspector", "purpose",
                                "altitude_m", "notes"))
    if "units" in doc:
        site["unit_system"] = units.get(doc["units"], doc["units"])
    instruments = []
    for old in doc.get("instruments", []):
        new = _copy_keys(old, {}, ("id", "kind", "name", "serial"))
        accuracy = old.get("accuracy") or {}
        for old_key, new_key in (("temp_k", "air_temp_accuracy_k"), ("rh_pct", "rh_accuracy_pct"),
                                 ("surface_k", "surface_temp_accuracy_k")):
            if old_key in accuracy:
                new[new_key] = accuracy[old_key]
        instruments.append(new)
    rooms = []
    for old in doc.get("rooms", []):
        new = _copy_keys(old, {}, ("id", "name", "use", "volume_m3", "occupants", "notes"))
        if "reference" in old:
            new["is_reference"] = old["reference"]
        rooms.append(new)

    def air(old: dict | None) -> dict | None:
        if old is None:
            return None
        return {"dry_bulb_c": old["temp_c"], "rh_pct": old["rh_pct"]}

    visits = []
    for old in doc.get("visits", []):
        new = {"started_at": old["date"]}
        _copy_keys(old, new, ("weather", "notes"))
        if old.get("outdoor") is not None:
            new["outdoor"] = air(old["outdoor"])
        new["rooms"] = []
        for reading in old.get("readings", []):
            room = {"room": reading["room"]}
            if "temp_c" in reading or "rh_pct" in reading:
                room["air"] = air(reading)
            room["surfaces"] = [
                {"location": s["label"], "element": s["element"], "surface_temp_c": s["temp_c"]}
                for s in reading.get("surfaces", [])]
            room["materials"] = [
                {"location": m["label"], "material": m["material"], "value": m["value"],
                 "scale": {"wme": "wme_pct"}.get(m["scale"], m["scale"])}
                for m in reading.get("moisture", [])]
            _copy_keys(reading, room, ("notes",))
            new["rooms"].append(room)
        visits.append(new)
    return {"schema_version": 0, "site": site, "instruments": instruments, "rooms": rooms,
            "visits": visits, "logs": [], "created_at": doc.get("created_at")}


# --- saving ------------------------------------------------------------------------------

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


def _os_problem(exc: OSError) -> str:
    words = _ERRNO_WORDS.get(exc.errno or 0)
    if words:
        return words
    return exc.strerror or str(exc)


def dumps_survey(survey: Survey, path: object = "<survey>") -> bytes:
    """The survey as indented JSON bytes, after checking every type, range and reference.

    Raises :class:`~survey.errors.SurveyFileError` ("not saved: …") if the survey in memory
    holds a value its own records do not allow (a reading set to NaN, say).
    """
    if not isinstance(survey, Survey):
        raise TypeError(f"expected a Survey, got {type(survey).__name__}")
    try:
        raw = _ENCODER.encode(survey)
    except (TypeError, ValueError, OverflowError, UnicodeError) as exc:
        raise SurveyFileError(path, "", f"not saved: the survey holds a value that cannot be "
                                        f"written ({exc})") from None
    try:
        checked = _DECODER.decode(raw)
    except msgspec.ValidationError as exc:
        where, problem = explain_validation_error(exc, Survey, raw)
        raise SurveyFileError(path, where, f"not saved: {problem}") from None
    found = model.problems(checked)
    if found:
        raise SurveyFileError(path, found[0][0], f"not saved: {found[0][1]}")
    # Written from the checked copy, so a whole number held in a float field is written as
    # 68.0 and the file is the same whichever way the survey was built.
    return msgspec.json.format(_ENCODER.encode(checked), indent=2) + b"\n"


class FileStamp(msgspec.Struct, frozen=True):
    """Identity of one version of a file on disk, to notice changes by others."""

    inode: int
    size: int
    mtime_ns: int

    @classmethod
    def of(cls, st: os.stat_result) -> "FileStamp":
        return cls(st.st_ino, st.st_size, st.st_mtime_ns)


def file_stamp(path: str | os.PathLike[str]) -> FileStamp | None:
    """The stamp of the file at ``path`` now, or ``None`` if there is none."""
    try:
        return FileStamp.of(os.stat(path))
    except OSError:
        return None


def _tmp_name(target: Path, kind: str = "") -> Path:
    return target.with_name(f".{target.name}{kind}.{os.getpid()}-{secrets.token_hex(4)}.tmp")


def _write_all(fd: int, data: bytes) -> None:
    view = memoryview(data)
    while view:
        written = os.write(fd, view)
        view = view[written:]


def _write_synced(path: Path, data: bytes, mode: int | None) -> FileStamp:
    flags = os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0)
    fd = os.open(path, flags, 0o666)
    try:
        if mode is not None and hasattr(os, "fchmod"):
            os.fchmod(fd, mode)
        _write_all(fd, data)
        os.fsync(fd)
        return FileStamp.of(os.fstat(fd))
    finally:
        os.close(fd)


def _fsync_dir(folder: Path) -> None:
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


def _remove_quietly(path: Path) -> None:
    try:
        os.unlink(path)
    except OSError:
        pass


def _keep_backup(target: Path) -> None:
    """Make ``NAME.json.bak`` the current content of ``target`` (if it exists)."""
    bak_tmp = _tmp_name(target, ".bak")
    try:
        os.link(target, bak_tmp)
    except FileNotFoundError:
        return
    except OSError:  # no hard links here (FAT, some network shares): copy instead
        try:
            with open(target, "rb") as old:
                content = old.read()
        except FileNotFoundError:
            return
        try:
            _write_synced(bak_tmp, content, None)
        except BaseException:
            _remove_quietly(bak_tmp)
            raise
    try:
        os.replace(bak_tmp, backup_path(target))
    except BaseException:
        _remove_quietly(bak_tmp)
        raise


def _resolve(path: str | os.PathLike[str]) -> Path:
    path = Path(path)
    return Path(os.path.realpath(path)) if path.is_symlink() else path


#: Versions of survey files this process read and found loading, or wrote itself, by
#: resolved path: saving over one of them needs no fresh check that it loads.
_KNOWN_GOOD: dict[str, FileStamp] = {}


def _remember_good(target: Path, stamp: FileStamp) -> None:
    if len(_KNOWN_GOOD) > 1000:
        _KNOWN_GOOD.clear()
    _KNOWN_GOOD[os.fspath(target)] = stamp


def _on_read_only_file_system(folder: Path) -> bool:
    try:
        return bool(os.statvfs(folder).f_flag & getattr(os, "ST_RDONLY", 1))
    except (OSError, AttributeError):
        return False


def _target_state(target: Path, shown: Path, verb: str,
                  advice: str = "save under another name, or make it writable first"
                  ) -> os.stat_result | None:
    """The stat of the file about to be replaced (``None`` if there is none), after
    refusing a folder and a file that is read-only for this user."""
    try:
        current = os.stat(target)
    except FileNotFoundError:
        return None
    except NotADirectoryError:
        raise SurveyFileError(shown, "", f"{verb}: {_ERRNO_WORDS[errno.ENOTDIR]}") from None
    except OSError as exc:
        raise SurveyFileError(shown, "", f"{verb}: {_os_problem(exc)}") from None
    if stat.S_ISDIR(current.st_mode):
        raise SurveyFileError(shown, "", f"{verb}: the name is a folder")
    mode = stat.S_IMODE(current.st_mode)
    # os.access answers for the real user; root passes it whatever the mode, so the mode
    # bits are checked too: a file nobody may write was made read-only on purpose.
    if not os.access(target, os.W_OK) or not mode & 0o222:
        if _on_read_only_file_system(target.parent):
            raise SurveyFileError(shown, "", f"{verb}: {_ERRNO_WORDS[errno.EROFS]}; the "
                                             "file on disk is unchanged")
        raise SurveyFileError(
            shown, "", f"{verb}: the file is read-only (mode {mode:04o}), perhaps kept that "
                       f"way on purpose, and is left as it is; {advice} "
                       f"(chmod u+w {shown.name})")
    return current


def _untouched(current: os.stat_result | None) -> str:
    return "the file on disk is unchanged" if current is not None else "no file was created"


def _replace_atomically(target: Path, shown: Path, data: bytes,
                        current: os.stat_result | None, verb: str,
                        before_replace: Callable[[], None] | None = None) -> FileStamp:
    """Write ``data`` to a new temporary file beside ``target`` (exclusive create, unique
    name), fsync it, run ``before_replace``, ``os.replace`` it over ``target`` and fsync the
    folder. The permissions of the file replaced are kept. On failure the temporary file is
    removed and ``target`` is as it was."""
    mode = stat.S_IMODE(current.st_mode) if current is not None else None
    tmp = _tmp_name(target)
    try:
        stamp = _write_synced(tmp, data, mode)
        if before_replace is not None:
            before_replace()
        os.replace(tmp, target)
    except SurveyFileError:
        _remove_quietly(tmp)
        raise
    except OSError as exc:
        _remove_quietly(tmp)
        raise SurveyFileError(shown, "", f"{verb}: {_os_problem(exc)}; "
                                         f"{_untouched(current)}") from None
    except BaseException:
        _remove_quietly(tmp)
        raise
    _fsync_dir(target.parent)
    return stamp


def write_file_atomically(path: str | os.PathLike[str], data: bytes) -> FileStamp:
    """Write ``data`` to ``path`` (any file, e.g. an export) the way surveys are saved: a
    uniquely named temporary file created exclusively in the same folder, fsynced, renamed
    over ``path`` in one step, the folder fsynced. A crash leaves the old file or the new
    one. A read-only existing file is refused; its permissions are otherwise kept.

    Raises :class:`~survey.errors.SurveyFileError` ("not written: …") on any failure.
    """
    shown = Path(path)
    target = _resolve(path)
    current = _target_state(target, shown, "not written")
    return _replace_atomically(target, shown, bytes(data), current, "not written")


def damaged_copy_path(path: str | os.PathLike[str], when: dt.datetime | None = None) -> Path:
    """Where a damaged survey file is kept when a save replaces it:
    ``NAME.json.damaged-YYYYMMDD-HHMMSS`` (a number added if that name is taken)."""
    target = _resolve(path)
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
        with open(target, "rb") as old:  # no hard links here: an exclusive synced copy
            content = old.read()
        try:
            _write_synced(aside, content, None)
        except FileExistsError:
            continue
        return aside
    raise OSError(errno.EEXIST, "no free name for the damaged copy")


def _load_problem(target: Path) -> str | None:
    """Why the file at ``target`` does not load as a survey, or ``None`` when it does."""
    try:
        data, stamp = _read_stamped(target)
        loads_survey(data, target)
    except SurveyFileError as exc:
        return f"{exc.where}: {exc.problem}" if exc.where else exc.problem
    _remember_good(target, stamp)
    return None


def save_survey(survey: Survey, path: str | os.PathLike[str], *, backup: bool = True,
                exclusive: bool = False, expected: FileStamp | None = None,
                replace_damaged: bool = False) -> FileStamp:
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
    target = _resolve(path)
    data = dumps_survey(survey, shown)
    current = _target_state(target, shown, "not saved")
    damaged = False
    if current is not None:
        if exclusive:
            raise SurveyFileError(shown, "", "not saved: the file already exists")
        stamp_now = FileStamp.of(current)
        if expected is not None and stamp_now != expected:
            raise SurveyFileError(
                shown, "", "not saved: the file was changed on disk by another program since "
                           "it was opened; save under another name and compare the two")
        if expected is None and _KNOWN_GOOD.get(os.fspath(target)) != stamp_now:
            problem = _load_problem(target)
            if problem is not None:
                if not replace_damaged:
                    raise SurveyFileError(
                        shown, "", f"not saved: the file there does not load as a survey "
                                   f"({problem}). It is left as it is, and so is its backup; "
                                   "save under another name, or move the file away first")
                damaged = True
    elif expected is not None:
        raise SurveyFileError(shown, "", "not saved: the file was deleted or moved since it "
                                         "was opened; save under another name")
    if exclusive:
        stamp = _save_exclusive(target, shown, data)
    elif damaged:
        stamp = _replace_atomically(target, shown, data, current, "not saved",
                                    lambda: _keep_damaged(target))
    else:
        keep = (lambda: _keep_backup(target)) if backup and current is not None else None
        stamp = _replace_atomically(target, shown, data, current, "not saved", keep)
    _remember_good(target, stamp)
    return stamp


def _save_exclusive(target: Path, shown: Path, data: bytes) -> FileStamp:
    """Create ``target`` with ``data``, never replacing a file that exists."""
    tmp = _tmp_name(target)
    try:
        stamp = _write_synced(tmp, data, None)
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
            _remove_quietly(tmp)
    except SurveyFileError:
        _remove_quietly(tmp)
        raise
    except OSError as exc:
        _remove_quietly(tmp)
        raise SurveyFileError(shown, "", f"not saved: {_os_problem(exc)}; no file was "
                                         "created") from None
    except BaseException:
        _remove_quietly(tmp)
        raise
    _fsync_dir(target.parent)
    return stamp


def remove_stale_temp_files(path: str | os.PathLike[str]) -> list[Path]:
    """Delete temporary files a killed save of ``path`` left behind; return their paths.

    Only files named like this module's temporaries whose writing process is gone.
    """
    target = _resolve(path)
    pattern = re.compile(
        rf"^\.{re.escape(target.name)}(?:\.bak|\.lock|\.lock\.claim)?\.(\d+)-[0-9a-f]{{8}}\.tmp$")
    removed = []
    guard = _TakeoverGuard(lock_path(path))
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
        if pid != os.getpid() and not _pid_alive(pid):
            _remove_quietly(target.parent / name)
            removed.append(target.parent / name)
    return removed


# --- lock --------------------------------------------------------------------------------

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
        when = self.started_at.replace("T", " ")[:16]
        return f"{self.user} on {self.host} (process {self.pid}, since {when})"


class SurveyLocked(SurveyFileError):
    """The survey is open for editing elsewhere; ``holder`` says by whom."""

    def __init__(self, path: object, holder: LockInfo | None, problem: str) -> None:
        self.holder = holder
        super().__init__(path, "", problem)


def lock_path(path: str | os.PathLike[str]) -> Path:
    """The lock file of the survey at ``path``: ``NAME.json.lock``."""
    path = _resolve(path)
    return path.with_name(path.name + ".lock")


def _boot_id() -> str:
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


def _pid_alive(pid: int) -> bool:
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

    return LockInfo(pid=os.getpid(), host=socket.gethostname(), user=_user(),
                    started_at=dt.datetime.now().replace(microsecond=0).isoformat(),
                    program=f"condition-survey {__version__}", boot_id=_boot_id(),
                    token=secrets.token_hex(8))


def _read_lock_bytes(lock: Path) -> bytes | None:
    try:
        with open(lock, "rb") as handle:
            return handle.read(65536)
    except FileNotFoundError:
        return None


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
    if info.host != socket.gethostname():
        return False
    here = _boot_id()
    if info.boot_id and here and info.boot_id != here:
        return True
    return not _pid_alive(info.pid)


def describe_lock(holder: LockInfo, lock_name: str) -> str:
    """What a lock means for someone who wants to edit the survey, and what they can do."""
    if holder.pid <= 0:
        return (f"a damaged lock file {lock_name} remains (a session ended while writing "
                "it); opening the survey for editing replaces it")
    if lock_is_stale(holder):
        return (f"a stale lock from {holder.describe()} remains ({lock_name}): that session "
                "ended without closing and its process is gone; opening the survey for "
                "editing takes the lock over")
    if holder.host and holder.host != socket.gethostname():
        return (f"open for editing by {holder.describe()}, another computer, which cannot "
                f"be checked from here. Close the survey there; if that session has ended "
                f"(the computer crashed or was switched off while editing), delete "
                f"{lock_name} and try again. Reading the survey works meanwhile")
    return (f"open for editing by {holder.describe()}. Close the survey there, or wait for "
            "that program to finish, and try again. Reading the survey works meanwhile")


def _create_lock(lock: Path, info: LockInfo) -> bool:
    """Atomically create ``lock`` with ``info`` in it; False if a lock exists."""
    data = msgspec.json.encode(info) + b"\n"
    tmp = _tmp_name(lock)
    _write_synced(tmp, data, None)
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
            _write_all(fd, data)
            os.fsync(fd)
        finally:
            os.close(fd)
        return True
    finally:
        _remove_quietly(tmp)


class _TakeoverGuard:
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

    def __enter__(self) -> "_TakeoverGuard":
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
                        _remove_quietly(self.path)
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
            _remove_quietly(self.path)  # while still holding it, then let go
            os.close(self.fd)
            self.fd = None


#: How long a takeover waits for another process's takeover of the same lock, seconds.
_GUARD_WAIT_S = 5.0
#: Without ``flock``: a takeover guard file older than this was left by a crash, seconds.
_GUARD_ABANDONED_S = 30.0


def _take_over(lock: Path, stale_raw: bytes, ours: LockInfo) -> bool:
    """Replace the lock holding exactly ``stale_raw`` with ours, in one step; False (and
    nothing changed) if the lock file holds anything else by now.

    Every takeover of a survey's lock happens under its :class:`_TakeoverGuard`, so the
    content cannot change between the check and the replace except by a fresh lock being
    created where none is, which cannot happen while the stale one is in place. The lock
    file is never absent during a takeover, so nobody can create a lock in a gap.
    """
    data = msgspec.json.encode(ours) + b"\n"
    with _TakeoverGuard(lock):
        if _read_lock_bytes(lock) != stale_raw:
            return False
        tmp = _tmp_name(lock)
        try:
            _write_synced(tmp, data, None)
            os.replace(tmp, lock)
        except BaseException:
            _remove_quietly(tmp)
            raise
    _fsync_dir(lock.parent)
    return True


def acquire_lock(path: str | os.PathLike[str], *, take_over_stale: bool = True,
                 force: bool = False) -> tuple[LockInfo, LockInfo | None]:
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
            raise SurveyFileError(shown, "", f"cannot open for editing: the lock file "
                                             f"{lock.name} cannot be written: "
                                             f"{_os_problem(exc)}") from None
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
            raise SurveyFileError(shown, "", f"cannot open for editing: the lock file "
                                             f"{lock.name} cannot be taken over: "
                                             f"{_os_problem(exc)}") from None
    raise SurveyLocked(shown, None, f"cannot take the lock {lock.name}: other programs keep "
                                    "taking it")


def release_lock(path: str | os.PathLike[str], ours: LockInfo) -> None:
    """Remove the lock of ``path`` if it is still ``ours`` (never someone else's)."""
    lock = lock_path(path)
    raw = _read_lock_bytes(lock)
    if raw is not None and _parse_lock(raw).token == ours.token:
        _remove_quietly(lock)


class EditSession:
    """A survey open for editing: holds the lock, saves atomically, notices outside changes.

    Use as a context manager (the lock is released on exit)::

        with open_for_editing("flat7.json") as session:
            session.survey.visits.append(visit)
            session.save()
    """

    def __init__(self, path: Path, survey: Survey, lock: LockInfo,
                 took_over: LockInfo | None, stamp: FileStamp | None) -> None:
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

    def __enter__(self) -> "EditSession":
        return self

    def __exit__(self, *exc_info: object) -> None:
        self.close()


def open_for_editing(path: str | os.PathLike[str], *, create: Survey | None = None,
                     take_over_stale: bool = True, force: bool = False) -> EditSession:
    """Lock and load the survey at ``path`` for editing.

    With ``create``, the file must not exist yet and is created from that survey. A stale
    lock is taken over (``EditSession.took_over`` says whose) unless ``take_over_stale`` is
    false; ``force`` takes over even a live lock. A file that fails to load raises
    :class:`~survey.errors.SurveyFileError` and is left untouched.
    """
    path = Path(path)
    ours, previous = acquire_lock(path, take_over_stale=take_over_stale, force=force)
    try:
        remove_stale_temp_files(path)
        if create is not None:
            stamp = save_survey(create, path, exclusive=True)
            survey = create
        else:
            # The stamp is taken before reading: a change during the read makes the first
            # save refuse rather than overwrite a version nobody has seen.
            stamp = file_stamp(_resolve(path))
            survey = load_survey(path)
            _target_state(_resolve(path), path, "cannot open for editing",
                          "edit a copy of it, or make it writable first")
    except BaseException:
        release_lock(path, ours)
        raise
    return EditSession(path, survey, ours, previous, stamp)


# --- schema ------------------------------------------------------------------------------

def survey_schema() -> dict[str, Any]:
    """The JSON Schema of a survey file, generated from :mod:`survey.model`."""
    schema = msgspec.json.schema(Survey)
    schema = {
        "$schema": "https://json-schema.org/draft/2020-12/schema",
        "title": "condition-survey survey file",
        "description": f"One site survey, schema version {SCHEMA_VERSION}. Numbers are SI with "
                       "the unit in the field name; derived values are not stored.",
        **schema,
    }
    return schema


def read_schema_version(path: str | os.PathLike[str]) -> int:
    """The ``schema_version`` a survey file was written with (before any upgrade)."""
    path = Path(path)
    return _schema_version(_check_bytes(_read_bytes(path), path), path)
